/* solids.c — recognizer: bars drawn as solids. A front rectangle with a cap and side
 * faces (parallelograms in oblique projection, trapezoids in perspective) that share its
 * edges is one bar; stacked fronts in one column are its segments. Values come from a
 * vertical value axis read on the plane it is drawn in (front, or back wall: shifted by
 * the depth the caps show), else from numbers printed above each bar. */
#include <math.h>
#include <string.h>

#include "internal.h"

/* A plot frame may fill most of a small figure page, but not all of it: a rectangle over
 * this share of the page is the page background (common practice, no source). */
#define PP_FRAME_MAX_PAGE 0.9
#define OWNER "solid-bars"

/* Corners and edges of one face agree within this, pt: producers round coordinates to a
 * few hundredths (matplotlib writes 3–4 decimals, cairo 1/256 pt; common practice, no
 * source); faces of one solid share edges exactly up to that rounding. */
#define PP_SOLID_TOL 0.05
#define PP_SOLID_EDGE_TOL 0.3
/* Bars of one chart stand on one floor line within this, pt (PP_SAME_COLUMN_TOL alike). */
#define PP_SOLID_BASE_TOL 1.0
/* The back-wall reading of the floor must be zero within this share of the tick span
 * for the wall to be taken as the axis plane (PP_ZERO_SHARE-like, looser for the depth
 * rounding; common practice, no source). */
#define PP_SOLID_WALL_ZERO 0.02
/* A label above a bar sits within this many font sizes over its top (common practice). */
#define PP_SOLID_LABEL_REACH 3.0
/* A back-wall gridline runs behind at least this share of the solids' width, and a wall
 * is taken from at least PP_SOLID_WALL_MIN gridlines with their connectors (common
 * practice, no source). */
#define PP_SOLID_WALL_SPAN 0.8
#define PP_SOLID_WALL_MIN 2
/* A tick sits on a gridline (or a connector's front end) when it is nearer to it than
 * this share of the wall's rise: the two candidates are one rise apart (common practice,
 * no source). */
#define PP_SOLID_WALL_TICK 0.25

typedef struct {
  guint mark;
  pp_quad q;
  gboolean front; /* an axis-aligned rectangle */
  pp_rect box;
  double ink;
} face;

typedef struct {
  GArray *fronts; /* face indices, top to bottom */
  GArray *sides;  /* face indices */
  int cap;        /* face index or −1 */
  pp_rect box;
  double top, base, depth; /* page y of the top and floor edges; cap's rise, pt */
  const pp_label *label;
} solid;

static void solid_clear(gpointer p) {
  solid *s = p;
  g_array_unref(s->fronts);
  g_array_unref(s->sides);
}

/* Every solid has a face that is not an upright rectangle (make_solid needs one beside
 * its fronts), so a page of rectangles alone has none and is not grouped: a page of
 * 10^5 tiles spent a quarter of its time here. */
static gboolean has_side(GArray *faces) {
  for (guint i = 0; i < faces->len; i++)
    if (!g_array_index(faces, face, i).front)
      return TRUE;
  return FALSE;
}

static GArray *collect_faces(const pp_recognize_ctx *ctx) {
  const pp_scene *scene = ctx->scene;
  GArray *faces = g_array_new(FALSE, FALSE, sizeof(face));
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    face f = {.mark = i, .box = m->bbox, .ink = m->ink};
    pp_rect r;
    if (m->kind != PP_MARK_FILL || !(m->ink > 0) || !pp_claims_mark_free(ctx->claims, i) ||
        g_hash_table_contains(ctx->glyph_marks, GUINT_TO_POINTER(i)) ||
        pp_page_sized(scene, m->bbox) || !pp_path_as_quad(m->path, PP_SOLID_TOL, &f.q))
      continue;
    f.front = pp_path_is_rectangle(m->path, PP_SOLID_TOL, &r);
    g_array_append_val(faces, f);
  }
  if (!has_side(faces)) /* only fronts are dropped below: the caller finds no solid */
    return faces;
  /* A rectangle holding two or more other faces is a background or a wall, not a face.
   * Faces are dropped in page order, each judged against the faces still kept; the grid
   * only narrows which faces are tested. */
  guint n = faces->len;
  g_autofree pp_rect *boxes = g_new(pp_rect, MAX(n, 1));
  for (guint i = 0; i < n; i++)
    boxes[i] = g_array_index(faces, face, i).box;
  g_autoptr(pp_box_grid) grid = pp_box_grid_new(boxes, n);
  g_autofree gboolean *dropped = g_new0(gboolean, MAX(n, 1));
  g_autoptr(GArray) near = g_array_new(FALSE, FALSE, sizeof(guint));
  for (guint i = 0; i < n; i++) {
    if (!g_array_index(faces, face, i).front)
      continue;
    guint inside = 0;
    pp_box_grid_query_inside(grid, boxes[i], 0.5, near);
    for (guint j = 0; j < near->len; j++) {
      guint k = g_array_index(near, guint, j);
      inside += k != i && !dropped[k] && pp_rect_contains(boxes[i], boxes[k], 0.5);
    }
    dropped[i] = inside >= 2;
  }
  for (guint i = n; i-- > 0;)
    if (dropped[i])
      g_array_remove_index(faces, i);
  return faces;
}

static int cmp_front_y(gconstpointer a, gconstpointer b, gpointer faces) {
  const face *fa = &g_array_index((GArray *)faces, face, *(const guint *)a);
  const face *fb = &g_array_index((GArray *)faces, face, *(const guint *)b);
  return (fa->box.y0 > fb->box.y0) - (fa->box.y0 < fb->box.y0);
}

/* One group of faces as a solid: fronts in one column, a cap on the top front, sides on
 * the fronts. FALSE when the group is not shaped like a bar. */
static gboolean make_solid(GArray *faces, const guint *members, guint n_members, solid *s) {
  s->fronts = g_array_new(FALSE, FALSE, sizeof(guint));
  s->sides = g_array_new(FALSE, FALSE, sizeof(guint));
  s->cap = -1;
  s->box = pp_rect_empty();
  guint others = 0;
  for (guint m = 0; m < n_members; m++) {
    guint i = members[m];
    face *f = &g_array_index(faces, face, i);
    s->box = pp_rect_union(s->box, f->box);
    if (f->front)
      g_array_append_val(s->fronts, i);
    else
      others++;
  }
  if (s->fronts->len == 0 || others == 0 || others > 2 * s->fronts->len + 1)
    return FALSE;
  g_array_sort_with_data(s->fronts, cmp_front_y, faces);
  const face *top = &g_array_index(faces, face, g_array_index(s->fronts, guint, 0));
  s->top = top->box.y0;
  s->base = g_array_index(faces, face, g_array_index(s->fronts, guint, s->fronts->len - 1)).box.y1;
  for (guint k = 1; k < s->fronts->len; k++) { /* one column, stacked without gaps */
    const face *a = &g_array_index(faces, face, g_array_index(s->fronts, guint, k - 1));
    const face *b = &g_array_index(faces, face, g_array_index(s->fronts, guint, k));
    if (fabs(a->box.x0 - b->box.x0) > PP_SOLID_EDGE_TOL ||
        fabs(a->box.x1 - b->box.x1) > PP_SOLID_EDGE_TOL ||
        fabs(a->box.y1 - b->box.y0) > PP_SOLID_EDGE_TOL)
      return FALSE;
  }
  for (guint m = 0; m < n_members; m++) {
    guint i = members[m];
    face *f = &g_array_index(faces, face, i);
    if (f->front)
      continue;
    if (s->cap < 0 && f->box.y1 <= s->top + PP_SOLID_EDGE_TOL &&
        pp_quads_share_edge(&f->q, &top->q, PP_SOLID_EDGE_TOL))
      s->cap = (int)i;
    else
      g_array_append_val(s->sides, i);
  }
  if (s->cap >= 0) {
    const face *c = &g_array_index(faces, face, s->cap);
    s->depth = s->top - c->box.y0;
  }
  return TRUE;
}

/* The value axis beside the solids: fitted, linear, vertical, free, nearest. */
const pp_axis_candidate *pp_solid_value_axis(const pp_recognize_ctx *ctx, pp_rect all) {
  const pp_axis_candidate *best = NULL;
  double best_d = INFINITY;
  for (guint i = 0; i < ctx->axes->len; i++) {
    const pp_axis_candidate *a = g_ptr_array_index(ctx->axes, i);
    if (a->fit_failed || a->category || !a->scale || !a->scale->vertical ||
        a->scale->kind != PP_SCALE_LINEAR || pp_axis_taken(ctx, a) ||
        !pp_within_reach(a, all.y0, all.y1, 0, 20))
      continue;
    double d = a->label_edge <= all.x0 + 2   ? all.x0 - a->label_edge
               : a->label_edge >= all.x1 - 2 ? a->label_edge - all.x1
                                             : INFINITY;
    if (d < best_d) {
      best_d = d;
      best = a;
    }
  }
  return best;
}

typedef struct {
  pp_point e[2];
} stroke_ends;

/* The straight segments a stroke draws: each line of each subpath (a gridline drawn alone,
 * many in one path, or bent where the side wall meets the back wall). */
static void straight_strokes(const pp_mark *m, GArray *out) {
  const pp_path *p = m->path;
  if (m->kind != PP_MARK_STROKE)
    return;
  for (size_t i = 1; i < p->n_segs; i++) {
    const pp_seg *prev = &p->segs[i - 1];
    if (p->segs[i].kind == PP_SEG_LINE &&
        (prev->kind == PP_SEG_MOVE || prev->kind == PP_SEG_LINE)) {
      stroke_ends se = {{prev->pt[0], p->segs[i].pt[0]}};
      g_array_append_val(out, se);
    }
  }
}

/* A wall gridline at page y with the front end of its connector. */
typedef struct {
  double wall_y, front_y, rise;
} wall_line;

static int cmp_double(gconstpointer a, gconstpointer b) {
  double x = *(const double *)a, y = *(const double *)b;
  return (x > y) - (x < y);
}

/* The back wall as its gridlines draw it: horizontal strokes running behind the solids,
 * each met at one end by a slanted stroke (the gridline carried along the side wall or
 * floor to the front plane). The connectors' rise is how far the wall stands above the
 * front plane on the page. Returns the rise the value axis must be read with: the rise
 * when the axis's ticks sit on the wall's gridlines, 0 when they sit on the connectors'
 * front ends; NAN when no such wall is drawn or the ticks sit on neither. */
static double wall_shift(const pp_recognize_ctx *ctx, pp_rect all, const pp_scale *scale) {
  const pp_scene *scene = ctx->scene;
  g_autoptr(GArray) flat = g_array_new(FALSE, FALSE, sizeof(stroke_ends));
  g_autoptr(GArray) slant = g_array_new(FALSE, FALSE, sizeof(stroke_ends));
  double width = pp_rect_width(all);
  g_autoptr(GArray) segs = g_array_new(FALSE, FALSE, sizeof(stroke_ends));
  for (guint i = 0; i < scene->marks->len; i++)
    straight_strokes(g_ptr_array_index(scene->marks, i), segs);
  for (guint i = 0; i < segs->len; i++) {
    stroke_ends se = g_array_index(segs, stroke_ends, i);
    pp_point *e = se.e;
    if (e[0].x > e[1].x) { /* left end first */
      pp_point t = e[0];
      e[0] = e[1], e[1] = t;
    }
    double run = e[1].x - e[0].x, rise = fabs(e[1].y - e[0].y);
    if (rise <= PP_SOLID_TOL &&
        fmin(e[1].x, all.x1) - fmax(e[0].x, all.x0) >= PP_SOLID_WALL_SPAN * width &&
        e[0].y < all.y1)
      g_array_append_val(flat, se);
    else if (rise > PP_SOLID_EDGE_TOL && run > PP_SOLID_EDGE_TOL)
      g_array_append_val(slant, se);
  }
  g_autoptr(GArray) lines = g_array_new(FALSE, FALSE, sizeof(wall_line));
  g_autoptr(GArray) rises = g_array_new(FALSE, FALSE, sizeof(double));
  for (guint i = 0; i < flat->len; i++) {
    const pp_point *h = g_array_index(flat, stroke_ends, i).e;
    for (guint k = 0; k < slant->len; k++) {
      const pp_point *c = g_array_index(slant, stroke_ends, k).e;
      pp_point up = c[0].y < c[1].y ? c[0] : c[1], down = c[0].y < c[1].y ? c[1] : c[0];
      gboolean meets = FALSE;
      for (int j = 0; j < 2; j++)
        meets |=
            fabs(up.x - h[j].x) <= PP_SOLID_EDGE_TOL && fabs(up.y - h[j].y) <= PP_SOLID_EDGE_TOL;
      if (meets) {
        wall_line w = {h[0].y, down.y, down.y - up.y};
        g_array_append_val(lines, w);
        g_array_append_val(rises, w.rise);
        break;
      }
    }
  }
  if (lines->len < PP_SOLID_WALL_MIN)
    return NAN;
  g_array_sort(rises, cmp_double);
  double rise = g_array_index(rises, double, rises->len / 2);
  for (guint i = 0; i < lines->len; i++)
    if (fabs(g_array_index(lines, wall_line, i).rise - rise) > PP_SOLID_EDGE_TOL)
      return NAN; /* one wall, one depth */
  /* each tick on the nearer of a gridline and a connector's front end */
  guint on_wall = 0, on_front = 0;
  for (guint t = 0; t < scale->ticks->len; t++) {
    double pos = g_array_index(scale->ticks, pp_tick, t).pos, dw = INFINITY, df = INFINITY;
    for (guint i = 0; i < lines->len; i++) {
      const wall_line *w = &g_array_index(lines, wall_line, i);
      dw = fmin(dw, fabs(pos - w->wall_y)), df = fmin(df, fabs(pos - w->front_y));
    }
    if (fmin(dw, df) <= PP_SOLID_WALL_TICK * rise)
      dw < df ? on_wall++ : on_front++;
  }
  if (on_wall >= PP_SOLID_WALL_MIN && on_front == 0)
    return rise;
  if (on_front >= PP_SOLID_WALL_MIN && on_wall == 0)
    return 0;
  return NAN;
}

/* A number over the bar: above its front, on its cap or just above the whole solid. */
static const pp_label *label_above(const pp_recognize_ctx *ctx, const solid *s) {
  const pp_label *best = NULL;
  for (guint k = 0; k < ctx->labels->len; k++) {
    const pp_label *l = g_ptr_array_index(ctx->labels, k);
    double gap = s->box.y0 - l->box.y1;
    if (pp_claims_label_free(ctx->claims, l->index) && l->centre.x >= s->box.x0 - 2 &&
        l->centre.x <= s->box.x1 + 2 && l->centre.y < s->top &&
        gap <= PP_SOLID_LABEL_REACH * l->size && (!best || l->box.y1 > best->box.y1))
      best = l;
  }
  return best;
}

/* A word under the floor, centred on the front: the category. */
char *pp_solid_category(const pp_scene *scene, pp_rect front, double base) {
  const pp_text_run *best = NULL;
  for (guint i = 0; i < scene->words->len; i++) {
    const pp_text_run *w = g_ptr_array_index(scene->words, i);
    double cx = (w->box.x0 + w->box.x1) / 2;
    if (cx >= front.x0 - 2 && cx <= front.x1 + 2 && w->box.y0 >= base - 1 &&
        w->box.y0 - base < 40 && (!best || w->box.y0 < best->box.y0))
      best = w;
  }
  return best ? g_strdup(best->text) : NULL;
}

pp_rect pp_solid_frame(const pp_scene *scene, pp_rect all) {
  pp_rect best = all;
  double best_a = INFINITY;
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    pp_rect r;
    if (m->kind == PP_MARK_GLYPHS || !pp_path_is_rectangle(m->path, PP_SOLID_TOL, &r) ||
        pp_rect_area(r) > PP_FRAME_MAX_PAGE * scene->width * scene->height ||
        !pp_rect_contains(r, all, 1.0))
      continue;
    if (pp_rect_area(r) < best_a)
      best_a = pp_rect_area(r), best = r;
  }
  return best;
}

/* A fill hides what lies under it when it is painted opaque, outside any transparency
 * group or soft mask, and unclipped (its whole path shows; a clipped cover is left out,
 * which can only overstate the ink under it). */
static gboolean hides(const pp_mark *c, const pp_mark *under) {
  return c->kind == PP_MARK_FILL && c->paint.kind == PP_PAINT_SOLID && c->paint.a >= 1 &&
         c->group_depth == 0 && !c->soft_masked && c->ink > 0 && pp_path_n_subpaths(c->path) == 1 &&
         pp_rect_area(pp_rect_intersect(c->bbox, under->visible_bbox)) > 0 &&
         fabs(pp_rect_area(c->visible_bbox) - pp_rect_area(c->bbox)) <=
             1e-9 * pp_rect_area(c->bbox);
}

/* Appends one subpath turning counter-clockwise (as seen on the page): covers that all
 * turn one way, filled under the nonzero rule, paint their union (ISO 32000-1, 8.5.3.3.2). */
static void append_oriented(pp_path *out, const pp_path *p) {
  if (pp_path_signed_area(p) >= 0) {
    for (size_t i = 0; i < p->n_segs; i++) {
      const pp_seg *s = &p->segs[i];
      if (s->kind == PP_SEG_MOVE)
        pp_path_move_to(out, s->pt[0].x, s->pt[0].y);
      else if (s->kind == PP_SEG_LINE)
        pp_path_line_to(out, s->pt[0].x, s->pt[0].y);
      else if (s->kind == PP_SEG_CURVE)
        pp_path_curve_to(out, s->pt[0].x, s->pt[0].y, s->pt[1].x, s->pt[1].y, s->pt[2].x,
                         s->pt[2].y);
    }
    pp_path_close(out);
    return;
  }
  /* reversed: from the start back along the implicit closing edge, then each segment
   * backwards (a cubic's control points swap) */
  size_t n = 0;
  g_autofree pp_point *end = g_new(pp_point, p->n_segs + 1);
  for (size_t i = 0; i < p->n_segs; i++)
    if (p->segs[i].kind != PP_SEG_CLOSE)
      end[n++] = p->segs[i].pt[p->segs[i].kind == PP_SEG_CURVE ? 2 : 0];
  if (n == 0)
    return;
  pp_path_move_to(out, end[0].x, end[0].y);
  pp_path_line_to(out, end[n - 1].x, end[n - 1].y);
  for (size_t i = p->n_segs, k = n - 1; i-- > 0;) {
    const pp_seg *s = &p->segs[i];
    if (s->kind == PP_SEG_CLOSE || s->kind == PP_SEG_MOVE)
      continue;
    if (s->kind == PP_SEG_LINE)
      pp_path_line_to(out, end[k - 1].x, end[k - 1].y);
    else
      pp_path_curve_to(out, s->pt[1].x, s->pt[1].y, s->pt[0].x, s->pt[0].y, end[k - 1].x,
                       end[k - 1].y);
    k--;
  }
  pp_path_close(out);
}

double pp_solid_visible_ink(const pp_recognize_ctx *ctx, guint mark) {
  const pp_scene *scene = ctx->scene;
  const pp_mark *m = g_ptr_array_index(scene->marks, mark);
  if (!(m->ink > 0))
    return m->ink;
  g_autoptr(pp_path) covers = pp_path_new();
  guint n = 0;
  for (guint i = mark + 1; i < scene->marks->len; i++) {
    const pp_mark *c = g_ptr_array_index(scene->marks, i);
    if (!g_hash_table_contains(ctx->glyph_marks, GUINT_TO_POINTER(i)) && hides(c, m))
      append_oriented(covers, c->path), n++;
  }
  if (n == 0)
    return m->ink;
  /* the covers' union inside this fill (and its clip): exact, by the geometry stage */
  g_autoptr(pp_clip) within = pp_clip_new(m->clip, pp_path_copy(m->path), m->rule);
  double hidden = pp_path_clipped_area(covers, PP_FILL_NONZERO, within);
  return isfinite(hidden) ? fmax(0, m->ink - hidden) : m->ink;
}

/* The segment a side face belongs to: the front its height range overlaps most (a side
 * rises by the depth above its own front, so it overlaps the one above only a little). */
static guint side_owner(GArray *faces, const solid *s, const face *side) {
  guint best = 0;
  double best_o = -INFINITY;
  for (guint k = 0; k < s->fronts->len; k++) {
    const face *fr = &g_array_index(faces, face, g_array_index(s->fronts, guint, k));
    double o = fmin(fr->box.y1, side->box.y1) - fmax(fr->box.y0, side->box.y0);
    if (o > best_o)
      best_o = o, best = k;
  }
  return best;
}

static int cmp_solid_x(gconstpointer a, gconstpointer b) {
  const solid *sa = a, *sb = b;
  return (sa->box.x0 > sb->box.x0) - (sa->box.x0 < sb->box.x0);
}

static void build(pp_recognize_ctx *ctx, GArray *faces, GArray *solids) {
  if (solids->len < 2)
    return;
  g_array_sort(solids, cmp_solid_x);
  /* the floor most solids share */
  double base = NAN;
  guint best_n = 0;
  for (guint i = 0; i < solids->len; i++) {
    guint n = 0;
    for (guint k = 0; k < solids->len; k++)
      n += fabs(g_array_index(solids, solid, k).base - g_array_index(solids, solid, i).base) <=
           PP_SOLID_BASE_TOL;
    if (n > best_n)
      best_n = n, base = g_array_index(solids, solid, i).base;
  }
  gboolean shared = best_n >= 2;
  pp_rect all = pp_rect_empty();
  for (guint i = 0; i < solids->len; i++)
    all = pp_rect_union(all, g_array_index(solids, solid, i).box);
  const pp_axis_candidate *axis = shared ? pp_solid_value_axis(ctx, all) : NULL;
  double shift = 0, wall = axis ? wall_shift(ctx, all, axis->scale) : NAN;
  if (isfinite(wall)) { /* the wall's gridlines say which plane the ticks are on */
    shift = wall;
  } else if (axis) { /* front plane, or a back wall as deep as the caps */
    double depth = 0;
    for (guint i = 0; i < solids->len; i++)
      depth = fmax(depth, g_array_index(solids, solid, i).depth);
    const GArray *t = axis->scale->ticks;
    double span =
        fabs(g_array_index(t, pp_tick, t->len - 1).value - g_array_index(t, pp_tick, 0).value);
    double vf = pp_scale_value_at(axis->scale, base),
           vb = pp_scale_value_at(axis->scale, base - depth);
    if (depth > 0 && fabs(vb) < fabs(vf) && fabs(vb) <= PP_SOLID_WALL_ZERO * span)
      shift = depth;
  } else {
    for (guint i = 0; i < solids->len; i++) {
      solid *s = &g_array_index(solids, solid, i);
      if (s->fronts->len != 1 || !(s->label = label_above(ctx, s)))
        return;
    }
  }
  pp_claims_begin(ctx->claims);
  pp_figure *fig = pp_figure_new(PP_FIGURE_BAR_3D);
  fig->recognizer = OWNER;
  gboolean perspective = FALSE, oblique = FALSE;
  double ratio = 0;
  for (guint i = 0; i < solids->len; i++) {
    solid *s = &g_array_index(solids, solid, i);
    if (shared && fabs(s->base - base) > PP_SOLID_BASE_TOL)
      continue;
    if (s->cap >= 0) {
      pp_quad_kind ck = g_array_index(faces, face, s->cap).q.kind;
      perspective |= ck == PP_QUAD_TRAPEZOID || ck == PP_QUAD_CONVEX;
      oblique |= ck == PP_QUAD_PARALLELOGRAM;
    }
    for (guint k = s->fronts->len; k-- > 0;) { /* bottom segment first */
      const face *fr = &g_array_index(faces, face, g_array_index(s->fronts, guint, k));
      pp_element e = pp_element_init(PP_ENCODING_AREA);
      double seen = pp_solid_visible_ink(ctx, fr->mark);
      pp_element_add_part(&e, fr->mark, PP_PART_FRONT, seen);
      pp_claims_take_mark(ctx->claims, fr->mark, OWNER);
      e.ink = seen;
      e.box = fr->box;
      for (guint j = 0; j < s->sides->len; j++) {
        const face *sd = &g_array_index(faces, face, g_array_index(s->sides, guint, j));
        if (side_owner(faces, s, sd) == k && pp_claims_mark_free(ctx->claims, sd->mark)) {
          seen = pp_solid_visible_ink(ctx, sd->mark);
          pp_element_add_part(&e, sd->mark, PP_PART_SIDE, seen);
          pp_claims_take_mark(ctx->claims, sd->mark, OWNER);
          e.ink += seen, e.box = pp_rect_union(e.box, sd->box);
        }
      }
      if (k == 0 && s->cap >= 0) {
        const face *cp = &g_array_index(faces, face, s->cap);
        seen = pp_solid_visible_ink(ctx, cp->mark);
        pp_element_add_part(&e, cp->mark, PP_PART_CAP, seen);
        pp_claims_take_mark(ctx->claims, cp->mark, OWNER);
        e.ink += seen, e.box = pp_rect_union(e.box, cp->box);
      }
      e.shape.kind = PP_SHAPE_QUAD;
      memcpy(e.shape.quad.p, fr->q.p, sizeof e.shape.quad.p);
      e.extent = pp_rect_height(fr->box);
      e.stacked = k + 1 < s->fronts->len;
      e.series = s->fronts->len - 1 - k;
      e.category = pp_solid_category(
          ctx->scene,
          g_array_index(faces, face, g_array_index(s->fronts, guint, s->fronts->len - 1)).box,
          s->base);
      if (axis) {
        double top = pp_scale_value_at(axis->scale, fr->box.y0 - shift);
        double bottom = pp_scale_value_at(axis->scale, fr->box.y1 - shift);
        e.scale_value = top;
        e.base_value = bottom;
        e.value = e.stacked || s->fronts->len > 1 ? top - bottom : top;
        e.source = PP_VALUE_SCALE;
      } else {
        e.value = e.label_value = s->label->number.value;
        e.label_text = g_strdup(s->label->text);
        e.source = PP_VALUE_DATA_LABEL;
        pp_claims_take_label(ctx->claims, s->label->index, PP_OWNER_DATA_LABEL);
      }
      g_array_append_val(fig->elements, e);
    }
    if (s->cap >= 0)
      ratio = fmax(ratio, s->depth / pp_rect_width(s->box));
  }
  fig->projection.kind = perspective ? PP_PROJECTION_PERSPECTIVE : PP_PROJECTION_OBLIQUE;
  fig->projection.ratio = ratio;
  fig->n_series = 1;
  for (guint i = 0; i < fig->elements->len; i++)
    fig->n_series = MAX(fig->n_series, g_array_index(fig->elements, pp_element, i).series + 1);
  fig->bbox = pp_solid_frame(ctx->scene, all);
  pp_figure_add_evidence(fig, "faces-share-edges", 1);
  pp_figure_add_evidence(fig, shared ? "shared-baseline" : "data-labels", 1);
  if (isfinite(wall))
    pp_figure_add_evidence(fig, "wall-gridlines", 1);
  if (axis) {
    pp_figure_add_evidence(fig, "scale-fits", 1);
    pp_axis_claim_labels(ctx, axis);
  }
  pp_claims_commit(ctx->claims);
  pp_figure_finish(ctx, fig, axis);
  (void)oblique;
}

/* A group that is not one bar may be two whose edges merely come near: packed or
 * overlapping bars put one bar's side edge within PP_SOLID_EDGE_TOL of the next bar's front
 * edge. The faces of one solid share edges to the producer's rounding, so the group is
 * joined again at that closeness (PP_SOLID_TOL) and each part tried as a bar. */
static void split_group(GArray *faces, const guint *members, guint n_members, GArray *solids) {
  if (n_members < 4)
    return; /* two bars have at least a front and one more face each */
  g_autoptr(GArray) quads = g_array_new(FALSE, FALSE, sizeof(pp_quad));
  for (guint k = 0; k < n_members; k++)
    g_array_append_val(quads, g_array_index(faces, face, members[k]).q);
  g_autofree guint *part = g_new(guint, n_members);
  guint n = pp_quads_group_by_edges((pp_quad *)quads->data, n_members, PP_SOLID_TOL, part);
  if (n < 2)
    return;
  pp_group_lists gl;
  pp_group_lists_init(&gl, part, n_members, n);
  g_autofree guint *sub = g_new(guint, n_members);
  for (guint k = 0; k < n_members; k++)
    sub[k] = members[gl.members[k]]; /* each part's faces in page order */
  for (guint k = 0; k < n; k++) {
    solid s = {0};
    if (make_solid(faces, sub + gl.start[k], gl.start[k + 1] - gl.start[k], &s))
      g_array_append_val(solids, s);
    else
      solid_clear(&s);
  }
  pp_group_lists_clear(&gl);
}

void pp_recognize_solid_bars(pp_recognize_ctx *ctx) {
  g_autoptr(GArray) faces = collect_faces(ctx);
  if (faces->len < 4 || !has_side(faces))
    return;
  g_autoptr(GArray) quads = g_array_sized_new(FALSE, FALSE, sizeof(pp_quad), faces->len);
  for (guint i = 0; i < faces->len; i++)
    g_array_append_val(quads, g_array_index(faces, face, i).q);
  g_autofree guint *group = g_new(guint, faces->len);
  guint n = pp_quads_group_by_edges((pp_quad *)quads->data, faces->len, PP_SOLID_EDGE_TOL, group);
  pp_group_lists gl;
  pp_group_lists_init(&gl, group, faces->len, n);
  g_autoptr(GArray) solids = g_array_new(FALSE, FALSE, sizeof(solid));
  g_array_set_clear_func(solids, solid_clear);
  for (guint g = 0; g < n; g++) {
    solid s = {0};
    const guint *members = gl.members + gl.start[g];
    guint n_members = gl.start[g + 1] - gl.start[g];
    if (make_solid(faces, members, n_members, &s))
      g_array_append_val(solids, s);
    else {
      solid_clear(&s);
      split_group(faces, members, n_members, solids);
    }
  }
  pp_group_lists_clear(&gl);
  build(ctx, faces, solids);
}
