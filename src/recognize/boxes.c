/* boxes.c — recognizer: 3D bar charts of one value over two categorical dimensions
 * (matplotlib's Axes3D.bar3d and the like): each bar a box of six (or its three visible)
 * quadrilateral faces with vertical edges, seen in orthographic projection, standing on a
 * floor behind a vertical value axis. A bar's ink is what can be seen of it: its own
 * hidden faces are painted over by its visible ones, and nearer bars hide parts of it. */
#include <math.h>
#include <string.h>

#include "internal.h"

#define OWNER "box-bars"

/* Corners of one box's faces agree within this, pt: the faces are written one by one
 * from the same projected points (producers' rounding; common practice, no source). */
#define PP_BOX_TOL 0.3
/* An edge is vertical when its horizontal run is under this share of its rise: in an
 * orthographic view without roll the data's vertical projects to the page's (textbook
 * projective geometry); the slack is producers' rounding (common practice, no source). */
#define PP_BOX_VERTICAL 0.01
/* The vertical edges of one box are equally long in orthographic projection; they may
 * differ by this share (rounding; common practice, no source). In perspective they do not
 * agree and the box is not read. */
#define PP_BOX_EDGE_AGREE 0.01
/* Most nearer boxes one box may be hidden by: inclusion–exclusion over their overlaps
 * costs 2^n clips (common practice, no source). */
#define PP_BOX_MAX_COVERS 8

typedef struct {
  guint faces[6], n_faces; /* face indices, drawing order */
  pp_point hull[8];
  guint n_hull;
  double height; /* length of the vertical edges, pt */
  double base;   /* lowest page point (largest y) */
  pp_rect box;
  guint last_mark; /* drawn last: nearer boxes are drawn later (painter's order) */
  int top;         /* face index of the top among the visible faces, −1 none */
} box;

typedef struct {
  guint mark;
  pp_quad q;
  pp_rect bbox;
} face;

/* Faces, and apart from them the panes: a face whose box holds two or more others is the
 * floor or a wall the bars stand in front of. */
static GArray *collect_faces(const pp_recognize_ctx *ctx, GArray *panes) {
  GArray *faces = g_array_new(FALSE, FALSE, sizeof(face));
  const pp_scene *scene = ctx->scene;
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    face f = {.mark = i, .bbox = m->bbox};
    if (m->kind != PP_MARK_FILL || !(m->ink > 0) || !pp_claims_mark_free(ctx->claims, i) ||
        g_hash_table_contains(ctx->glyph_marks, GUINT_TO_POINTER(i)) ||
        pp_page_sized(scene, m->bbox) || !pp_path_as_quad(m->path, 0.05, &f.q) ||
        f.q.kind == PP_QUAD_TRIANGLE)
      continue;
    g_array_append_val(faces, f);
  }
  /* Panes leave in page order, each judged against the faces still kept; the grid only
   * narrows which faces are tested. */
  guint n = faces->len;
  g_autofree pp_rect *boxes = g_new(pp_rect, MAX(n, 1));
  for (guint i = 0; i < n; i++)
    boxes[i] = g_array_index(faces, face, i).bbox;
  g_autoptr(pp_box_grid) grid = pp_box_grid_new(boxes, n);
  g_autofree gboolean *pane = g_new0(gboolean, MAX(n, 1));
  g_autoptr(GArray) near = g_array_new(FALSE, FALSE, sizeof(guint));
  for (guint i = 0; i < n; i++) {
    guint inside = 0;
    pp_box_grid_query_inside(grid, boxes[i], 0.5, near);
    for (guint j = 0; j < near->len && inside < 2; j++) {
      guint k = g_array_index(near, guint, j);
      inside += k != i && !pane[k] && pp_rect_contains(boxes[i], boxes[k], 0.5);
    }
    pane[i] = inside >= 2;
  }
  for (guint i = 0; i < n; i++)
    if (pane[i])
      g_array_append_val(panes, g_array_index(faces, face, i));
  for (guint i = n; i-- > 0;)
    if (pane[i])
      g_array_remove_index(faces, i);
  return faces;
}

static gboolean is_vertical(pp_point a, pp_point b) {
  double rise = fabs(b.y - a.y);
  return rise > 1 && fabs(b.x - a.x) <= PP_BOX_VERTICAL * rise;
}

/* The vertical edges of a face: their count and mean length. */
static guint vertical_edges(const pp_quad *q, double *len) {
  guint n = 0;
  *len = 0;
  for (int k = 0; k < 4; k++)
    if (is_vertical(q->p[k], q->p[(k + 1) % 4]))
      n++, *len += fabs(q->p[(k + 1) % 4].y - q->p[k].y);
  if (n)
    *len /= n;
  return n;
}

/* One group of faces as a box: six faces (all drawn, hidden ones first) or three (only
 * the visible ones), eight or seven distinct corners, equal vertical edges. */
static gboolean make_box(GArray *faces, const guint *members, guint n_members, box *b) {
  memset(b, 0, sizeof *b);
  b->box = pp_rect_empty();
  pp_point pts[24];
  guint np = 0;
  for (guint m = 0; m < n_members; m++) {
    guint i = members[m];
    if (b->n_faces == 6)
      return FALSE;
    const face *f = &g_array_index(faces, face, i);
    b->faces[b->n_faces++] = i;
    b->box = pp_rect_union(b->box, f->bbox);
    b->last_mark = MAX(b->last_mark, f->mark);
    for (int k = 0; k < 4; k++) {
      gboolean seen = FALSE;
      for (guint j = 0; j < np && !seen; j++)
        seen = fabs(pts[j].x - f->q.p[k].x) <= PP_BOX_TOL &&
               fabs(pts[j].y - f->q.p[k].y) <= PP_BOX_TOL;
      if (!seen)
        pts[np++] = f->q.p[k];
    }
  }
  if (!((b->n_faces == 6 && np == 8) || (b->n_faces == 3 && np == 7)))
    return FALSE;
  /* The visible faces are the last three drawn: each lies nearer than its opposite. */
  guint first = b->n_faces - 3;
  double lo = INFINITY, hi = 0;
  b->top = -1;
  for (guint k = first; k < b->n_faces; k++) {
    double len;
    guint nv = vertical_edges(&g_array_index(faces, face, b->faces[k]).q, &len);
    if (nv == 0) {
      if (b->top >= 0)
        return FALSE;
      b->top = (int)b->faces[k];
    } else if (nv == 2) {
      lo = fmin(lo, len), hi = fmax(hi, len);
    } else
      return FALSE;
  }
  if (!(hi > 0) || (hi - lo) > PP_BOX_EDGE_AGREE * hi)
    return FALSE;
  b->height = (lo + hi) / 2;
  b->n_hull = pp_convex_hull(pts, np, b->hull);
  b->base = b->box.y1;
  return b->n_hull >= 4;
}

/* The area of polygon p that the union of covers hides: inclusion–exclusion over the
 * covers' common parts (each a clip of convex polygons, so convex; textbook). */
static double hidden_area(const pp_point *p, guint np, const box **covers, guint nc) {
  double total = 0;
  for (guint set = 1; set < (1u << nc); set++) {
    pp_point a[PP_CONVEX_MAX], b[PP_CONVEX_MAX];
    memcpy(a, p, np * sizeof *p);
    guint n = np, bits = 0;
    for (guint k = 0; k < nc && n >= 3; k++)
      if (set & (1u << k)) {
        n = pp_convex_clip(a, n, covers[k]->hull, covers[k]->n_hull, b);
        memcpy(a, b, n * sizeof *b);
        bits++;
      }
    if (n >= 3)
      total += (bits % 2 ? 1 : -1) * pp_polygon_area(a, n);
  }
  return total;
}

static gboolean overlap(const box *a, const box *b) {
  pp_point out[PP_CONVEX_MAX];
  if (!(pp_rect_area(pp_rect_intersect(a->box, b->box)) > 0))
    return FALSE;
  guint n = pp_convex_clip(a->hull, a->n_hull, b->hull, b->n_hull, out);
  return n >= 3 && pp_polygon_area(out, n) > 0.01;
}

/* Back rows first (higher on the page), then left to right. */
static int cmp_box(gconstpointer a, gconstpointer b) {
  const box *p = a, *q = b;
  if (fabs(p->base - q->base) > PP_BOX_TOL)
    return p->base < q->base ? -1 : 1; /* back rows first */
  return (p->box.x0 > q->box.x0) - (p->box.x0 < q->box.x0);
}

/* The free fitted vertical linear scale whose labels stand beside the boxes (left or
 * right of all of them) and whose ticks overlap their height: the nearest. */
static const pp_axis_candidate *value_axis(const pp_recognize_ctx *ctx, pp_rect all) {
  const pp_axis_candidate *best = NULL;
  double best_d = INFINITY;
  for (guint i = 0; i < ctx->axes->len; i++) {
    const pp_axis_candidate *a = g_ptr_array_index(ctx->axes, i);
    if (a->fit_failed || a->category || !a->scale || !a->scale->vertical ||
        a->scale->kind != PP_SCALE_LINEAR || pp_axis_taken(ctx, a) || a->span1 < all.y0 ||
        a->span0 > all.y1)
      continue;
    double d = a->label_edge <= all.x0 + 2   ? all.x0 - a->label_edge
               : a->label_edge >= all.x1 - 2 ? a->label_edge - all.x1
                                             : INFINITY;
    if (d < best_d)
      best_d = d, best = a;
  }
  return best;
}

/* The value the bars stand on. mplot3d draws its panes a little beyond the axis range
 * (1/48 of it at each end, from memory), so the foot of the wall edge nearest the labels
 * reads just under the lowest value; the nearest tick (on the ticks' step) within PP_BOX_FLOOR_SNAP
 * of the tick span is taken. Without a wall: the lowest tick. */
#define PP_BOX_FLOOR_SNAP 0.05
static double floor_value(const pp_scale *scale, GArray *panes, double label_x) {
  const GArray *t = scale->ticks;
  double lo = INFINITY, hi = -INFINITY;
  for (guint k = 0; k < t->len; k++) {
    double v = g_array_index(t, pp_tick, k).value;
    lo = fmin(lo, v), hi = fmax(hi, v);
  }
  double foot = NAN, best = INFINITY;
  for (guint i = 0; i < panes->len; i++) {
    const pp_quad *q = &g_array_index(panes, face, i).q;
    for (int k = 0; k < 4; k++) {
      pp_point a = q->p[k], b = q->p[(k + 1) % 4];
      if (is_vertical(a, b) && fabs(a.x - label_x) < best)
        best = fabs(a.x - label_x), foot = fmax(a.y, b.y);
    }
  }
  if (isnan(foot))
    return lo;
  /* the ticks continued at their step: a centred "0" may stand apart from the column */
  double read = pp_scale_value_at(scale, foot);
  double step = t->len > 1 ? (hi - lo) / (t->len - 1) : 0;
  double snap = step > 0 ? lo + round((read - lo) / step) * step : lo, gap = fabs(snap - read);
  return gap <= PP_BOX_FLOOR_SNAP * (hi - lo) ? snap : read;
}

static void build(pp_recognize_ctx *ctx, GArray *faces, GArray *panes, GArray *boxes) {
  if (boxes->len < 2)
    return;
  pp_rect all = pp_rect_empty();
  for (guint i = 0; i < boxes->len; i++)
    all = pp_rect_union(all, g_array_index(boxes, box, i).box);
  const pp_axis_candidate *axis = value_axis(ctx, all);
  if (!axis)
    return;
  /* Orthographic: one length per unit for every vertical edge. */
  double slope = fabs(pp_scale_value_at(axis->scale, 1) - pp_scale_value_at(axis->scale, 0));
  double base_value = floor_value(axis->scale, panes, axis->label_edge);
  if (!(slope > 0) || !isfinite(base_value))
    return;
  g_array_sort(boxes, cmp_box);
  pp_claims_begin(ctx->claims);
  pp_figure *fig = pp_figure_new(PP_FIGURE_BAR_3D);
  fig->recognizer = OWNER;
  double hidden_max = 0;
  for (guint i = 0; i < boxes->len; i++) {
    const box *b = &g_array_index(boxes, box, i);
    const box *covers[PP_BOX_MAX_COVERS];
    guint nc = 0;
    for (guint j = 0; j < boxes->len; j++) {
      const box *o = &g_array_index(boxes, box, j);
      if (j != i && o->last_mark > b->last_mark && overlap(b, o) && nc < PP_BOX_MAX_COVERS)
        covers[nc++] = o;
    }
    pp_element e = pp_element_init(PP_ENCODING_AREA);
    double drawn = 0;
    for (guint k = 0; k < b->n_faces; k++) {
      const face *f = &g_array_index(faces, face, b->faces[k]);
      pp_claims_take_mark(ctx->claims, f->mark, OWNER);
      if (k + 3 < b->n_faces) { /* hidden behind the box's own faces */
        pp_element_add_part(&e, f->mark, PP_PART_SIDE, 0);
        continue;
      }
      double whole = pp_polygon_area(f->q.p, 4);
      double seen = whole - hidden_area(f->q.p, 4, covers, nc);
      drawn += whole;
      pp_element_add_part(&e, f->mark, (int)b->faces[k] == b->top ? PP_PART_CAP : PP_PART_FRONT,
                          fmax(seen, 0));
      e.ink += fmax(seen, 0);
    }
    if (drawn > 0)
      hidden_max = fmax(hidden_max, 1 - e.ink / drawn);
    e.box = b->box;
    e.shape.kind = PP_SHAPE_POLYGON;
    e.extent = b->height;
    e.value = base_value + b->height * slope;
    e.scale_value = e.value;
    e.base_value = base_value;
    e.source = PP_VALUE_SCALE;
    e.category = pp_solid_category(ctx->scene, b->box, b->base);
    g_array_append_val(fig->elements, e);
  }
  fig->projection.kind = PP_PROJECTION_OBLIQUE;
  fig->projection.ratio = hidden_max; /* the largest share of a bar hidden by nearer ones */
  fig->n_series = 1;
  fig->bbox = pp_solid_frame(ctx->scene, all);
  if (fig->bbox.x0 == all.x0 && fig->bbox.y1 == all.y1)
    fig->bbox = pp_rect_union(all, axis->scale->box);
  pp_figure_add_evidence(fig, "faces-share-edges", 1);
  pp_figure_add_evidence(fig, "scale-fits", 1);
  pp_axis_claim_labels(ctx, axis);
  pp_claims_commit(ctx->claims);
  pp_figure_finish(ctx, fig, axis);
}

void pp_recognize_boxes(pp_recognize_ctx *ctx) {
  g_autoptr(GArray) panes = g_array_new(FALSE, FALSE, sizeof(face));
  g_autoptr(GArray) faces = collect_faces(ctx, panes);
  if (faces->len < 6)
    return;
  g_autoptr(GArray) quads = g_array_sized_new(FALSE, FALSE, sizeof(pp_quad), faces->len);
  g_autofree guint *marks = g_new(guint, faces->len);
  for (guint i = 0; i < faces->len; i++) {
    g_array_append_val(quads, g_array_index(faces, face, i).q);
    marks[i] = g_array_index(faces, face, i).mark;
  }
  /* Boxes seen in perspective (box_persp.c) have no vertical edges on the page: when the
   * floor and walls show a perspective view, the boxes are read there and not here. */
  g_autoptr(GArray) pane_quads = g_array_sized_new(FALSE, FALSE, sizeof(pp_quad), panes->len);
  g_autofree guint *pane_marks = g_new(guint, panes->len + 1);
  for (guint i = 0; i < panes->len; i++) {
    g_array_append_val(pane_quads, g_array_index(panes, face, i).q);
    pane_marks[i] = g_array_index(panes, face, i).mark;
  }
  if (pp_recognize_boxes_in_perspective(ctx, (const pp_quad *)quads->data, marks, faces->len,
                                        (const pp_quad *)pane_quads->data, pane_marks,
                                        pane_quads->len))
    return;
  g_autofree guint *group = g_new(guint, faces->len);
  guint n = pp_quads_group_by_edges((pp_quad *)quads->data, faces->len, PP_BOX_TOL, group);
  g_autoptr(GArray) boxes = g_array_new(FALSE, FALSE, sizeof(box));
  pp_group_lists gl;
  pp_group_lists_init(&gl, group, faces->len, n);
  for (guint g = 0; g < n; g++) {
    box b;
    gboolean ok = make_box(faces, gl.members + gl.start[g], gl.start[g + 1] - gl.start[g], &b);
    if (ok)
      g_array_append_val(boxes, b);
  }
  pp_group_lists_clear(&gl);
  /* A box holding other boxes is the floor and walls around them, not a bar. */
  for (guint i = 0; i < boxes->len;) {
    const box *b = &g_array_index(boxes, box, i);
    guint inside = 0;
    for (guint k = 0; k < boxes->len; k++)
      inside += k != i && pp_rect_contains(b->box, g_array_index(boxes, box, k).box, 0.5);
    if (inside >= 2)
      g_array_remove_index(boxes, i);
    else
      i++;
  }
  build(ctx, faces, panes, boxes);
}
