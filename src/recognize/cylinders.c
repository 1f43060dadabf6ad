/* cylinders.c — recognizer: bars drawn as cylinders (or cones cut flat). A body with two
 * vertical straight sides and a curved bottom, and an ellipse on its top edge of the same
 * width, are one bar. The body's bulge below the floor and the top ellipse are the same on
 * every bar: ink that does not follow the value. Ink is what shows (the ellipse hides the
 * body's top). */
#include <math.h>
#include <string.h>

#include "internal.h"

#define OWNER "cylinder-bars"

/* Rounding of outlines and of where an ellipse sits on its body, pt (solids.c alike). */
#define PP_CYL_TOL 0.5
/* An ellipse's area is π·a·b within this share (cubic arcs; common practice, no source). */
#define PP_CYL_ELLIPSE_SHARE 0.02

typedef struct {
  guint mark;
  double x0, x1, top, bottom; /* the straight sides: x, and the y where they start and end */
  double ink;
  pp_rect box;
  int cap; /* index into the ellipses */
} body;

typedef struct {
  guint mark;
  pp_rect box;
  double ink;
} ellipse;

static gboolean is_free_fill(const pp_recognize_ctx *ctx, guint i, const pp_mark *m) {
  return m->kind == PP_MARK_FILL && m->ink > 0 && pp_claims_mark_free(ctx->claims, i) &&
         !g_hash_table_contains(ctx->glyph_marks, GUINT_TO_POINTER(i)) &&
         !pp_page_sized(ctx->scene, m->bbox);
}

/* One closed subpath of curves whose area is that of the ellipse in its box. */
static gboolean is_ellipse(const pp_mark *m) {
  guint curves = 0, moves = 0;
  for (size_t i = 0; i < m->path->n_segs; i++) {
    curves += m->path->segs[i].kind == PP_SEG_CURVE;
    moves += m->path->segs[i].kind == PP_SEG_MOVE;
    if (m->path->segs[i].kind == PP_SEG_LINE)
      return FALSE;
  }
  double w = pp_rect_width(m->bbox), h = pp_rect_height(m->bbox);
  return curves >= 4 && moves == 1 && w > h && h > 0 &&
         fabs(m->ink - G_PI * w * h / 4) <= PP_CYL_ELLIPSE_SHARE * m->ink;
}

/* Two vertical straight segments on the box's left and right edges, of one length, and
 * curves for the rest. */
static gboolean is_body(const pp_mark *m, body *b) {
  pp_point cur = {0, 0};
  int sides = 0;
  double len[2] = {0, 0}, top[2] = {0, 0};
  for (size_t i = 0; i < m->path->n_segs; i++) {
    const pp_seg *s = &m->path->segs[i];
    if (s->kind == PP_SEG_LINE) {
      pp_point p = s->pt[0];
      gboolean vertical = fabs(p.x - cur.x) < 0.01 && fabs(p.y - cur.y) > 1;
      gboolean edge = fabs(p.x - m->bbox.x0) < 0.01 || fabs(p.x - m->bbox.x1) < 0.01;
      if (vertical && edge && sides < 2) {
        len[sides] = fabs(p.y - cur.y);
        top[sides] = fmin(p.y, cur.y);
        sides++;
      }
    }
    if (s->kind != PP_SEG_CLOSE)
      cur = s->pt[s->kind == PP_SEG_CURVE ? 2 : 0];
  }
  if (sides != 2 || fabs(len[0] - len[1]) > PP_CYL_TOL || fabs(top[0] - top[1]) > PP_CYL_TOL)
    return FALSE;
  *b = (body){.x0 = m->bbox.x0,
              .x1 = m->bbox.x1,
              .top = top[0],
              .bottom = top[0] + len[0],
              .ink = m->ink,
              .box = m->bbox,
              .cap = -1};
  return TRUE;
}

static int cmp_body_x(gconstpointer a, gconstpointer b) {
  const body *ba = a, *bb = b;
  return (ba->x0 > bb->x0) - (ba->x0 < bb->x0);
}

void pp_recognize_cylinders(pp_recognize_ctx *ctx) {
  const pp_scene *scene = ctx->scene;
  g_autoptr(GArray) bodies = g_array_new(FALSE, FALSE, sizeof(body));
  g_autoptr(GArray) ellipses = g_array_new(FALSE, FALSE, sizeof(ellipse));
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    body b;
    if (!is_free_fill(ctx, i, m))
      continue;
    if (is_ellipse(m)) {
      ellipse e = {i, m->bbox, m->ink};
      g_array_append_val(ellipses, e);
    } else if (is_body(m, &b)) {
      b.mark = i;
      g_array_append_val(bodies, b);
    }
  }
  /* a body and the ellipse of its width centred on its top edge */
  g_autoptr(GArray) bars = g_array_new(FALSE, FALSE, sizeof(body));
  for (guint i = 0; i < bodies->len; i++) {
    body *b = &g_array_index(bodies, body, i);
    for (guint k = 0; k < ellipses->len && b->cap < 0; k++) {
      const ellipse *e = &g_array_index(ellipses, ellipse, k);
      double ecx = (e->box.x0 + e->box.x1) / 2, ecy = (e->box.y0 + e->box.y1) / 2;
      if (fabs(ecx - (b->x0 + b->x1) / 2) < PP_CYL_TOL &&
          fabs(pp_rect_width(e->box) - (b->x1 - b->x0)) < PP_CYL_TOL &&
          fabs(ecy - b->top) < PP_CYL_TOL)
        b->cap = (int)k;
    }
    if (b->cap >= 0)
      g_array_append_val(bars, *b);
  }
  if (bars->len < 2)
    return;
  g_array_sort(bars, cmp_body_x);
  pp_rect all = pp_rect_empty();
  double base = g_array_index(bars, body, 0).bottom;
  for (guint i = 0; i < bars->len; i++) {
    const body *b = &g_array_index(bars, body, i);
    if (fabs(b->bottom - base) > PP_CYL_TOL)
      return; /* one floor, or no chart */
    all = pp_rect_union(all, b->box);
    all = pp_rect_union(all, g_array_index(ellipses, ellipse, b->cap).box);
  }
  const pp_axis_candidate *axis = pp_solid_value_axis(ctx, all);
  if (!axis)
    return;
  pp_claims_begin(ctx->claims);
  pp_figure *fig = pp_figure_new(PP_FIGURE_BAR_3D);
  fig->recognizer = OWNER;
  for (guint i = 0; i < bars->len; i++) {
    const body *b = &g_array_index(bars, body, i);
    const ellipse *cap = &g_array_index(ellipses, ellipse, b->cap);
    pp_element e = pp_element_init(PP_ENCODING_AREA);
    /* the body's straight part is the front; its bulge below the floor is as constant
     * as the top ellipse, so it is booked with the cap */
    double front = (b->x1 - b->x0) * (b->bottom - b->top);
    double bulge = fmax(0, b->ink - front);
    /* what shows: the top ellipse (painted after) hides the body's top edge, so the front
     * loses that and the bulge below the floor stays whole */
    double body = pp_solid_visible_ink(ctx, b->mark), top = pp_solid_visible_ink(ctx, cap->mark);
    pp_element_add_part(&e, b->mark, PP_PART_FRONT, fmax(0, fmin(front, body - bulge)));
    pp_element_add_part(&e, b->mark, PP_PART_CAP, fmin(bulge, body));
    pp_element_add_part(&e, cap->mark, PP_PART_CAP, top);
    pp_claims_take_mark(ctx->claims, b->mark, OWNER);
    pp_claims_take_mark(ctx->claims, cap->mark, OWNER);
    e.ink = body + top;
    e.box = pp_rect_union(b->box, cap->box);
    e.extent = b->bottom - b->top;
    e.shape.kind = PP_SHAPE_RECT;
    e.shape.rect = (pp_rect){b->x0, b->top, b->x1, b->bottom};
    e.scale_value = e.value = pp_scale_value_at(axis->scale, b->top);
    e.base_value = pp_scale_value_at(axis->scale, b->bottom);
    e.source = PP_VALUE_SCALE;
    e.category = pp_solid_category(scene, b->box, b->box.y1);
    g_array_append_val(fig->elements, e);
  }
  fig->projection.kind = PP_PROJECTION_OBLIQUE;
  fig->projection.ratio = pp_rect_height(g_array_index(ellipses, ellipse, 0).box) /
                          pp_rect_width(g_array_index(ellipses, ellipse, 0).box);
  fig->n_series = 1;
  fig->bbox = pp_solid_frame(scene, all);
  pp_figure_add_evidence(fig, "cylinder-caps", 1);
  pp_figure_add_evidence(fig, "shared-baseline", 1);
  pp_figure_add_evidence(fig, "scale-fits", 1);
  pp_axis_claim_labels(ctx, axis);
  pp_claims_commit(ctx->claims);
  pp_figure_finish(ctx, fig, axis);
}
