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
  /* A rectangle holding two or more other faces is a background or a wall, not a face. */
  for (guint i = 0; i < faces->len;) {
    face *f = &g_array_index(faces, face, i);
    guint inside = 0;
    for (guint k = 0; k < faces->len && f->front; k++)
      inside += k != i && pp_rect_contains(f->box, g_array_index(faces, face, k).box, 0.5);
    if (inside >= 2)
      g_array_remove_index(faces, i);
    else
      i++;
  }
  return faces;
}

static int cmp_front_y(gconstpointer a, gconstpointer b, gpointer faces) {
  const face *fa = &g_array_index((GArray *)faces, face, *(const guint *)a);
  const face *fb = &g_array_index((GArray *)faces, face, *(const guint *)b);
  return (fa->box.y0 > fb->box.y0) - (fa->box.y0 < fb->box.y0);
}

/* One group of faces as a solid: fronts in one column, a cap on the top front, sides on
 * the fronts. FALSE when the group is not shaped like a bar. */
static gboolean make_solid(GArray *faces, const guint *group, guint g, solid *s) {
  s->fronts = g_array_new(FALSE, FALSE, sizeof(guint));
  s->sides = g_array_new(FALSE, FALSE, sizeof(guint));
  s->cap = -1;
  s->box = pp_rect_empty();
  guint others = 0;
  for (guint i = 0; i < faces->len; i++) {
    if (group[i] != g)
      continue;
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
  for (guint i = 0; i < faces->len; i++) {
    face *f = &g_array_index(faces, face, i);
    if (group[i] != g || f->front)
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
  double shift = 0;
  if (axis) { /* front plane, or the back wall the caps recede to */
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
      pp_element_add_part(&e, fr->mark, PP_PART_FRONT, fr->ink);
      pp_claims_take_mark(ctx->claims, fr->mark, OWNER);
      e.ink = fr->ink;
      e.box = fr->box;
      for (guint j = 0; j < s->sides->len; j++) {
        const face *sd = &g_array_index(faces, face, g_array_index(s->sides, guint, j));
        if (side_owner(faces, s, sd) == k && pp_claims_mark_free(ctx->claims, sd->mark)) {
          pp_element_add_part(&e, sd->mark, PP_PART_SIDE, sd->ink);
          pp_claims_take_mark(ctx->claims, sd->mark, OWNER);
          e.ink += sd->ink, e.box = pp_rect_union(e.box, sd->box);
        }
      }
      if (k == 0 && s->cap >= 0) {
        const face *cp = &g_array_index(faces, face, s->cap);
        pp_element_add_part(&e, cp->mark, PP_PART_CAP, cp->ink);
        pp_claims_take_mark(ctx->claims, cp->mark, OWNER);
        e.ink += cp->ink, e.box = pp_rect_union(e.box, cp->box);
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
  if (axis) {
    pp_figure_add_evidence(fig, "scale-fits", 1);
    pp_axis_claim_labels(ctx, axis);
  }
  pp_claims_commit(ctx->claims);
  pp_figure_finish(ctx, fig, axis);
  (void)oblique;
}

void pp_recognize_solid_bars(pp_recognize_ctx *ctx) {
  g_autoptr(GArray) faces = collect_faces(ctx);
  if (faces->len < 4)
    return;
  g_autoptr(GArray) quads = g_array_sized_new(FALSE, FALSE, sizeof(pp_quad), faces->len);
  for (guint i = 0; i < faces->len; i++)
    g_array_append_val(quads, g_array_index(faces, face, i).q);
  g_autofree guint *group = g_new(guint, faces->len);
  guint n = pp_quads_group_by_edges((pp_quad *)quads->data, faces->len, PP_SOLID_EDGE_TOL, group);
  g_autoptr(GArray) solids = g_array_new(FALSE, FALSE, sizeof(solid));
  g_array_set_clear_func(solids, solid_clear);
  for (guint g = 0; g < n; g++) {
    solid s = {0};
    if (make_solid(faces, group, g, &s))
      g_array_append_val(solids, s);
    else
      solid_clear(&s);
  }
  build(ctx, faces, solids);
}
