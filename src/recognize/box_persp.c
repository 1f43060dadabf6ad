/* box_persp.c — the boxes of a 3D bar chart drawn in perspective (mplot3d's default view),
 * for boxes.c: each bar's value read where its top meets the value scale through the box's
 * view (box_view.c), its ink what can be seen of its faces after every face painted later. */
#define G_LOG_DOMAIN "plotproof-recognize"
#include <math.h>
#include <string.h>

#include "internal.h"

#define OWNER "box-bars"

/* Corners of one box's faces agree within this, pt (as in boxes.c: producers' rounding;
 * common practice, no source). */
#define PP_PERSP_TOL 0.3
/* An edge is vertical when it points at the vanishing point of the vertical within this
 * sine of the angle (producers' rounding; common practice, no source). */
#define PP_PERSP_VERTICAL 0.01
/* The vertical edges of one box must read the same value within this share of the tick
 * range (rounding; common practice, no source). */
#define PP_PERSP_AGREE 0.01
/* A bar's footprint lies on the floor within this margin, in the box's unit lengths
 * (rounding; common practice, no source). */
#define PP_PERSP_FLOOR_MARGIN 0.02
/* The floor pane's height snaps to the ticks' step within this share of the tick range:
 * mplot3d draws its panes 1/48 of the range beyond the axis limits (from memory). */
#define PP_PERSP_FLOOR_SNAP 0.05
/* A view is in perspective when the depths of the box's corners differ by more than this
 * share; below it the orthographic reading of boxes.c errs by less (common practice, no
 * source). */
#define PP_PERSP_MIN_DEPTH 0.01
/* Limits of the exact visible-area computation: convex pieces per face and corners per
 * piece (common practice, no source). */
#define PP_PERSP_MAX_PIECES 256
#define PP_PERSP_MAX_CORNERS 24

typedef struct {
  guint faces[6], n_faces;
  int top, bottom; /* face indices, −1 none */
  double value, height;
  pp_point lo_corners[4], hi_corners[4];
  guint n_lo;
  pp_rect box;
} pbox;

static pp_rect quad_box(const pp_quad *q) {
  pp_rect r = pp_rect_empty();
  for (int k = 0; k < 4; k++)
    r = pp_rect_union(r, (pp_rect){q->p[k].x, q->p[k].y, q->p[k].x, q->p[k].y});
  return r;
}

static gboolean near_pt(pp_point a, pp_point b) {
  return fabs(a.x - b.x) <= PP_PERSP_TOL && fabs(a.y - b.y) <= PP_PERSP_TOL;
}

/* Does a→b point at the vertical's vanishing point (homogeneous p[·][2], finite or not)? */
static gboolean is_vertical(const pp_box_view *v, pp_point a, pp_point b) {
  double dx = v->p[0][2] - a.x * v->p[2][2], dy = v->p[1][2] - a.y * v->p[2][2];
  double ex = b.x - a.x, ey = b.y - a.y;
  double n = hypot(dx, dy) * hypot(ex, ey);
  return hypot(ex, ey) > 1 && n > 0 && fabs(dx * ey - dy * ex) <= PP_PERSP_VERTICAL * n;
}

/* One group of faces as a box seen in perspective: six faces and eight corners or three
 * and seven; four (or two) faces with two vertical edges, two (or one) with none: the top
 * and the bottom. Its value from each vertical edge, bottom on the floor plane z0. */
static gboolean make_box(const pp_box_view *v, const pp_quad *q, const guint *group, guint n,
                         guint g, double z0, pbox *b) {
  memset(b, 0, sizeof *b);
  b->top = b->bottom = -1;
  b->box = pp_rect_empty();
  pp_point pts[24];
  guint np = 0, n_flat = 0;
  int flat[2];
  for (guint i = 0; i < n; i++) {
    if (group[i] != g)
      continue;
    if (b->n_faces == 6)
      return FALSE;
    b->faces[b->n_faces++] = i;
    b->box = pp_rect_union(b->box, quad_box(&q[i]));
    guint nv = 0;
    for (int k = 0; k < 4; k++) {
      gboolean seen = FALSE;
      for (guint j = 0; j < np && !seen; j++)
        seen = near_pt(pts[j], q[i].p[k]);
      if (!seen)
        pts[np++] = q[i].p[k];
      nv += is_vertical(v, q[i].p[k], q[i].p[(k + 1) % 4]);
    }
    if (nv == 0) {
      if (n_flat == 2)
        return FALSE;
      flat[n_flat++] = (int)i;
    } else if (nv != 2)
      return FALSE;
  }
  if (!((b->n_faces == 6 && np == 8 && n_flat == 2) || (b->n_faces == 3 && np == 7 && n_flat == 1)))
    return FALSE;
  /* the top is the flat face higher on the page (the value axis points up) */
  double y0 = 0, y1 = 0;
  for (int k = 0; k < 4; k++)
    y0 += q[flat[0]].p[k].y, y1 += n_flat == 2 ? q[flat[1]].p[k].y : 0;
  b->top = n_flat == 1 || y0 < y1 ? flat[0] : flat[1];
  b->bottom = n_flat == 1 ? -1 : (b->top == flat[0] ? flat[1] : flat[0]);
  /* each top corner's vertical edge down to its bottom corner */
  double lo = INFINITY, hi = -INFINITY, sum = 0, len = 0;
  guint ne = 0;
  for (int k = 0; k < 4; k++) {
    pp_point t = q[b->top].p[k];
    /* the vertical edge of a side face that ends at this top corner */
    gboolean found = FALSE;
    pp_point s = t;
    for (guint f = 0; f < b->n_faces && !found; f++)
      for (int c = 0; c < 4 && !found && (int)b->faces[f] != b->top; c++) {
        pp_point e0 = q[b->faces[f]].p[c], e1 = q[b->faces[f]].p[(c + 1) % 4];
        if (near_pt(e1, t))
          e1 = e0, e0 = t;
        if (near_pt(e0, t) && !near_pt(e1, t) && is_vertical(v, e0, e1))
          s = e1, found = TRUE;
      }
    if (found) {
      double x, y;
      if (!pp_box_view_on_plane(v, s, z0, &x, &y) || x < -PP_PERSP_FLOOR_MARGIN ||
          x > 1 + PP_PERSP_FLOOR_MARGIN || y < -PP_PERSP_FLOOR_MARGIN ||
          y > 1 + PP_PERSP_FLOOR_MARGIN)
        return FALSE;
      double val = v->offset + v->slope * pp_box_view_height(v, x, y, t);
      lo = fmin(lo, val), hi = fmax(hi, val), sum += val, ne++;
      len += hypot(t.x - s.x, t.y - s.y);
      b->lo_corners[b->n_lo++] = s;
      b->hi_corners[b->n_lo - 1] = t;
    }
  }
  if (ne < 3 || hi - lo > PP_PERSP_AGREE * (v->tick_hi - v->tick_lo))
    return FALSE;
  b->value = sum / ne, b->height = len / ne;
  return TRUE;
}

/* Faces joined when they have two corners in common (a box's faces meet along whole edges;
 * faces of different boxes may only line up on the page), transitively: union–find. */
static guint root_of(guint *parent, guint i) {
  while (parent[i] != i)
    i = parent[i] = parent[parent[i]];
  return i;
}

static guint group_by_corners(const pp_quad *q, guint n, guint *group) {
  g_autofree guint *parent = g_new(guint, MAX(n, 1));
  g_autofree pp_rect *box = g_new(pp_rect, MAX(n, 1));
  for (guint i = 0; i < n; i++)
    parent[i] = i, box[i] = quad_box(&q[i]);
  for (guint i = 0; i < n; i++)
    for (guint j = i + 1; j < n; j++) {
      if (box[i].x0 > box[j].x1 + PP_PERSP_TOL || box[j].x0 > box[i].x1 + PP_PERSP_TOL ||
          box[i].y0 > box[j].y1 + PP_PERSP_TOL || box[j].y0 > box[i].y1 + PP_PERSP_TOL)
        continue;
      guint common = 0;
      for (int a = 0; a < 4; a++)
        for (int b = 0; b < 4; b++)
          common += near_pt(q[i].p[a], q[j].p[b]);
      if (common >= 2)
        parent[root_of(parent, i)] = root_of(parent, j);
    }
  g_autofree guint *label = g_new(guint, MAX(n, 1));
  guint ng = 0;
  for (guint i = 0; i < n; i++)
    label[i] = G_MAXUINT;
  for (guint i = 0; i < n; i++) {
    guint r = root_of(parent, i);
    if (label[r] == G_MAXUINT)
      label[r] = ng++;
    group[i] = label[r];
  }
  return ng;
}

/* ---- exact visible areas: a convex face less the convex faces painted over it ---------- */
typedef struct {
  guint n;
  pp_point p[PP_PERSP_MAX_CORNERS];
} piece;

/* The part of a convex polygon on one side of the line a→b (keep > 0: left as drawn when
 * sign is +1). Returns FALSE when the piece would outgrow its room. */
static gboolean cut(const piece *in, pp_point a, pp_point b, double sign, piece *out) {
  out->n = 0;
  for (guint k = 0; k < in->n; k++) {
    pp_point p = in->p[k], r = in->p[(k + 1) % in->n];
    double sp = sign * ((b.x - a.x) * (p.y - a.y) - (b.y - a.y) * (p.x - a.x));
    double sr = sign * ((b.x - a.x) * (r.y - a.y) - (b.y - a.y) * (r.x - a.x));
    if (sp >= 0) {
      if (out->n == PP_PERSP_MAX_CORNERS)
        return FALSE;
      out->p[out->n++] = p;
    }
    if ((sp >= 0) != (sr >= 0)) {
      double t = sp / (sp - sr);
      if (out->n == PP_PERSP_MAX_CORNERS)
        return FALSE;
      out->p[out->n++] = (pp_point){p.x + t * (r.x - p.x), p.y + t * (r.y - p.y)};
    }
  }
  return TRUE;
}

/* Area of face less the union of covers (convex quads): each piece is split by the cover's
 * edges into the parts outside it (textbook convex decomposition). NAN when too many. */
static double seen_area(const pp_quad *face, const pp_quad *const *covers, guint nc) {
  GArray *pieces = g_array_new(FALSE, FALSE, sizeof(piece)), *next;
  piece first = {.n = 4};
  memcpy(first.p, face->p, sizeof face->p);
  g_array_append_val(pieces, first);
  gboolean ok = TRUE;
  for (guint c = 0; c < nc && ok && pieces->len; c++) {
    const pp_quad *cv = covers[c];
    double s2 = 0; /* the cover's turn, from the shoelace sum */
    for (int k = 0; k < 4; k++)
      s2 += cv->p[k].x * cv->p[(k + 1) % 4].y - cv->p[(k + 1) % 4].x * cv->p[k].y;
    double sign = s2 >= 0 ? 1 : -1;
    next = g_array_new(FALSE, FALSE, sizeof(piece));
    for (guint i = 0; i < pieces->len && ok; i++) {
      piece rem = g_array_index(pieces, piece, i), out, in;
      for (int k = 0; k < 4 && rem.n >= 3 && ok; k++) {
        pp_point a = cv->p[k], b = cv->p[(k + 1) % 4];
        ok = cut(&rem, a, b, -sign, &out) && cut(&rem, a, b, sign, &in);
        if (ok && out.n >= 3 && pp_polygon_area(out.p, out.n) > 1e-9)
          g_array_append_val(next, out);
        rem = in;
      }
      ok = ok && next->len <= PP_PERSP_MAX_PIECES;
    }
    g_array_unref(pieces);
    pieces = next;
  }
  double area = 0;
  for (guint i = 0; i < pieces->len; i++)
    area += pp_polygon_area(g_array_index(pieces, piece, i).p, g_array_index(pieces, piece, i).n);
  g_array_unref(pieces);
  return ok ? area : NAN;
}

static gboolean boxes_overlap(pp_rect a, pp_rect b) {
  return a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;
}

/* The floor's value: the floor pane (Z = 0) read on the scale, snapped to the ticks' step
 * when within PP_PERSP_FLOOR_SNAP of the tick range. */
static double floor_value(const pp_box_view *v) {
  double read = v->offset, span = v->tick_hi - v->tick_lo;
  double step = v->n_ticks > 1 ? span / (v->n_ticks - 1) : 0;
  double snap = step > 0 ? v->tick_lo + round((read - v->tick_lo) / step) * step : read;
  return fabs(snap - read) <= PP_PERSP_FLOOR_SNAP * span ? snap : read;
}

gboolean pp_recognize_boxes_in_perspective(pp_recognize_ctx *ctx, const pp_quad *faces_in,
                                           const guint *marks_in, guint n_in, const pp_quad *panes,
                                           const guint *pane_marks, guint n_panes) {
  /* the floor and walls among every quad: a thin floor holds no face in its box */
  g_autoptr(GArray) all_q = g_array_new(FALSE, FALSE, sizeof(pp_quad));
  g_autoptr(GArray) all_m = g_array_new(FALSE, FALSE, sizeof(guint));
  g_array_append_vals(all_q, faces_in, n_in);
  g_array_append_vals(all_m, marks_in, n_in);
  g_array_append_vals(all_q, panes, n_panes);
  g_array_append_vals(all_m, pane_marks, n_panes);
  pp_box_view view;
  if (all_q->len < 9 || !pp_box_view_find(ctx, (const pp_quad *)all_q->data, all_q->len, &view))
    return FALSE;
  if (view.depth_ratio < 1 + PP_PERSP_MIN_DEPTH) {
    g_debug("box-bars: view of depth ratio %g: orthographic", view.depth_ratio);
    pp_box_view_clear(&view);
    return FALSE;
  }
  double base = floor_value(&view), z0 = (base - view.offset) / view.slope;
  /* the faces: every quad but the floor and walls */
  g_autoptr(GArray) q = g_array_new(FALSE, FALSE, sizeof(pp_quad));
  g_autoptr(GArray) mk = g_array_new(FALSE, FALSE, sizeof(guint));
  for (guint i = 0; i < all_q->len; i++)
    if (i != view.panes[0] && i != view.panes[1] && i != view.panes[2]) {
      g_array_append_val(q, g_array_index(all_q, pp_quad, i));
      g_array_append_val(mk, g_array_index(all_m, guint, i));
    }
  const pp_quad *faces = (const pp_quad *)q->data;
  const guint *marks = (const guint *)mk->data;
  guint n = q->len;
  g_autofree guint *group = g_new(guint, n);
  guint ng = group_by_corners(faces, n, group);
  g_autoptr(GArray) boxes = g_array_new(FALSE, FALSE, sizeof(pbox));
  for (guint g = 0; g < ng; g++) {
    pbox b;
    if (make_box(&view, faces, group, n, g, z0, &b))
      g_array_append_val(boxes, b);
  }
  /* stacked boxes stand on each other, not on the floor: not read here */
  gboolean stacked = FALSE;
  for (guint i = 0; i < boxes->len && !stacked; i++)
    for (guint j = 0; j < boxes->len && !stacked; j++) {
      const pbox *a = &g_array_index(boxes, pbox, i), *b = &g_array_index(boxes, pbox, j);
      for (guint k = 0; k < a->n_lo && i != j && !stacked; k++)
        for (guint m = 0; m < b->n_lo && !stacked; m++)
          stacked = near_pt(a->lo_corners[k], b->hi_corners[m]);
    }
  g_debug("box-bars: perspective: %u of %u groups are boxes, floor %g (read %g, slope %g)%s",
          boxes->len, ng, base, view.offset, view.slope, stacked ? ", stacked" : "");
  if (boxes->len < 2 || stacked) {
    pp_box_view_clear(&view);
    return TRUE;
  }
  /* every face of the boxes with the ones painted after it */
  g_autofree const pp_quad **covers = g_new(const pp_quad *, n);
  pp_claims_begin(ctx->claims);
  pp_figure *fig = pp_figure_new(PP_FIGURE_BAR_3D);
  fig->recognizer = OWNER;
  pp_rect all = pp_rect_empty();
  double hidden_max = 0;
  gboolean ok = TRUE;
  for (guint i = 0; i < boxes->len && ok; i++) {
    const pbox *b = &g_array_index(boxes, pbox, i);
    pp_element e = pp_element_init(PP_ENCODING_AREA);
    double drawn = 0;
    for (guint k = 0; k < b->n_faces && ok; k++) {
      guint fi = b->faces[k];
      guint nc = 0;
      for (guint j = 0; j < boxes->len; j++) {
        const pbox *o = &g_array_index(boxes, pbox, j);
        for (guint m = 0; m < o->n_faces; m++)
          if (marks[o->faces[m]] > marks[fi] &&
              boxes_overlap(quad_box(&faces[o->faces[m]]), quad_box(&faces[fi])))
            covers[nc++] = &faces[o->faces[m]];
      }
      double seen = seen_area(&faces[fi], covers, nc);
      ok = isfinite(seen);
      seen = fmax(seen, 0);
      pp_claims_take_mark(ctx->claims, marks[fi], OWNER);
      int role = (int)fi == b->top      ? PP_PART_CAP
                 : (int)fi == b->bottom ? PP_PART_SIDE
                                        : PP_PART_FRONT;
      pp_element_add_part(&e, marks[fi], role, seen);
      e.ink += seen;
      /* a face seen at all counts as drawn; its own hidden faces are not the others' doing */
      if (seen > 0.01)
        drawn += pp_polygon_area(faces[fi].p, 4);
    }
    if (drawn > 0)
      hidden_max = fmax(hidden_max, 1 - e.ink / drawn);
    e.box = b->box;
    e.shape.kind = PP_SHAPE_POLYGON;
    e.extent = b->height;
    e.value = e.scale_value = b->value;
    e.base_value = base;
    e.source = PP_VALUE_SCALE;
    /* categories stand along the floor's receding edges, not under the bars: not read */
    g_array_append_val(fig->elements, e);
    all = pp_rect_union(all, b->box);
  }
  if (!ok) {
    pp_claims_rollback(ctx->claims);
    pp_figure_free(fig);
    pp_box_view_clear(&view);
    return TRUE;
  }
  /* the value scale: its ticks at the page points where they meet the edge */
  pp_scale *scale = pp_scale_new(TRUE);
  scale->box = pp_rect_empty();
  for (guint k = 0; k < view.labels->len; k++) {
    const pp_label *l = g_ptr_array_index(ctx->labels, g_array_index(view.labels, guint, k));
    pp_tick t = {g_array_index(view.tick_pos, pp_point, k).y, l->number.value, g_strdup(l->text)};
    g_array_append_val(scale->ticks, t);
    scale->box = pp_rect_union(scale->box, l->box);
    pp_claims_take_label(ctx->claims, l->index, OWNER);
  }
  scale->min_value = base;
  scale->max_value = view.offset + view.slope; /* the top of the walls */
  /* page y to value along the edge is projective, not linear: the least-squares line over
   * the ticks, with its residual, describes it only roughly (values come from the view) */
  double sy = 0, sv = 0, syy = 0, syv = 0, nt = scale->ticks->len;
  for (guint k = 0; k < scale->ticks->len; k++) {
    const pp_tick *t = &g_array_index(scale->ticks, pp_tick, k);
    sy += t->pos, sv += t->value, syy += t->pos * t->pos, syv += t->pos * t->value;
  }
  scale->slope = (nt * syv - sy * sv) / (nt * syy - sy * sy);
  scale->offset = (sv - scale->slope * sy) / nt;
  double ss = 0;
  for (guint k = 0; k < scale->ticks->len; k++) {
    const pp_tick *t = &g_array_index(scale->ticks, pp_tick, k);
    ss += pow(scale->offset + scale->slope * t->pos - t->value, 2);
  }
  scale->rms_residual = sqrt(ss / nt);
  fig->scale = scale;
  fig->projection.kind = PP_PROJECTION_PERSPECTIVE;
  fig->projection.ratio = hidden_max; /* the largest share of a bar hidden by others */
  fig->n_series = 1;
  fig->bbox = pp_rect_union(pp_rect_union(view.frame, all), scale->box);
  pp_figure_add_evidence(fig, "faces-share-edges", 1);
  pp_figure_add_evidence(fig, "view-fits-panes", 1);
  pp_figure_add_evidence(fig, "scale-fits", 1);
  pp_claims_commit(ctx->claims);
  pp_box_view_clear(&view);
  pp_figure_finish(ctx, fig, NULL);
  return TRUE;
}
