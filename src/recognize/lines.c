/* lines.c — recognizer: line charts and scatter plots beside a value axis that no bar
 * or area figure took. Their ink does not stand for their numbers, so they are counted
 * (the reviewer sees the chart was read) and never judged by an ink rule. */
#include <math.h>

#include "internal.h"

#define OWNER "lines"

/* A filled marker of a scatter plot is smaller than this on both sides, pt (common
 * practice, no source). */
#define PP_LINE_MARKER_MAX 15.0
/* Lines may reach this far beyond the axis' share past its end ticks, pt (common
 * practice, no source). */
#define PP_LINE_REACH_SLACK 10.0
/* The data must start within this of the tick labels, pt, not in the next chart over
 * (common practice, no source)... */
#define PP_LINE_MAX_DISTANCE 60.0
/* ...or within this share of the axis' tick span: a scatter's nearest point may sit far
 * into a plot about as wide as it is tall (common practice, no source). */
#define PP_LINE_MAX_DISTANCE_SHARE 0.5
/* A data line spans at least this both ways, pt (straight rules and gridlines do not),
 * and a marker covers more than PP_LINE_MARKER_MIN_AREA pt² (dots of dotted rules do
 * not; common practice, no source). */
#define PP_LINE_MIN_SPAN 1.0
#define PP_LINE_MARKER_MIN_AREA 1.0

/* A mark that draws data without standing for a number by its ink: a polyline, or a
 * small marker of a scatter plot. */
static gboolean is_line_mark(const pp_mark *m) {
  pp_rect r = m->bbox;
  if (m->kind == PP_MARK_STROKE)
    return m->path->n_segs >= 4 && pp_rect_width(r) >= PP_LINE_MIN_SPAN &&
           pp_rect_height(r) >= PP_LINE_MIN_SPAN;
  pp_rect rect;
  return m->kind == PP_MARK_FILL && m->path->n_segs >= 4 && pp_rect_width(r) < PP_LINE_MARKER_MAX &&
         pp_rect_height(r) < PP_LINE_MARKER_MAX && pp_rect_area(r) > PP_LINE_MARKER_MIN_AREA &&
         !pp_path_is_rectangle(m->path, PP_RECT_TOL, &rect);
}

/* The page's line marks, in page order, found once for the first axis that asks (a page of
 * tiles has as many axis candidates as rows of numbers, and each looked at every mark), and
 * indexed by their left edge: an axis' marks lie between its labels and the next axis, so
 * they are found by binary search. A mark whose x0 is not finite or lies beyond its x1, which
 * a range of x0 cannot answer for, is NaN there and so tried for every axis. */
typedef struct {
  GArray *marks;      /* guint mark indices, ascending */
  pp_coord_index *x0; /* item k: marks[k] */
  GArray *hits;       /* guint positions in marks: scratch */
} line_index;

static void line_index_build(line_index *x, const pp_scene *scene) {
  x->marks = g_array_new(FALSE, FALSE, sizeof(guint));
  for (guint k = 0; k < scene->marks->len; k++)
    if (is_line_mark(g_ptr_array_index(scene->marks, k)))
      g_array_append_val(x->marks, k);
  x->hits = g_array_new(FALSE, FALSE, sizeof(guint));
  g_autofree double *v = g_new(double, MAX(x->marks->len, 1));
  for (guint k = 0; k < x->marks->len; k++) {
    pp_rect r =
        ((const pp_mark *)g_ptr_array_index(scene->marks, g_array_index(x->marks, guint, k)))->bbox;
    v[k] = isfinite(r.x0) && r.x0 <= r.x1 ? r.x0 : NAN;
  }
  x->x0 = pp_coord_index_new(v, x->marks->len);
}

static void line_index_clear(line_index *x) {
  if (!x->marks)
    return;
  g_array_unref(x->marks);
  pp_coord_index_free(x->x0);
  g_array_unref(x->hits);
}

/* Lines and markers beside a fitted (vertical) axis, claimed; NULL when there are none. */
static pp_figure *build_on_axis(pp_recognize_ctx *ctx, const pp_axis_candidate *cand,
                                line_index *x) {
  const pp_scene *scene = ctx->scene;
  pp_rect box = pp_rect_empty();
  const pp_scale *axis = cand->scale;
  double lo, hi;
  pp_axis_reach(cand, ctx->axes, cand->side ? cand->side : +1, &lo, &hi);
  /* a mark beside the labels has lo <= x0 <= x1 <= hi; a NaN bound passes every mark */
  GArray *hits = NULL;
  if (axis->vertical && !isnan(lo) && !isnan(hi)) {
    hits = x->hits;
    pp_coord_index_within(x->x0, lo, hi, hits);
  }
  GArray *taken = g_array_new(FALSE, FALSE, sizeof(guint));
  guint n = hits ? hits->len : x->marks->len;
  for (guint h = 0; h < n; h++) {
    guint k = hits ? g_array_index(hits, guint, h) : h;
    guint i = g_array_index(x->marks, guint, k);
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    if (!pp_claims_mark_free(ctx->claims, i))
      continue;
    pp_rect r = m->bbox;
    double u0 = axis->vertical ? r.y0 : r.x0, u1 = axis->vertical ? r.y1 : r.x1;
    if (!pp_within_reach(cand, u0, u1, PP_LINE_REACH_SLACK, 0))
      continue;
    double w0 = axis->vertical ? r.x0 : r.y0, w1 = axis->vertical ? r.x1 : r.y1;
    if (w0 >= lo && w1 <= hi) { /* beside the labels, before the next axis */
      box = pp_rect_union(box, r);
      g_array_append_val(taken, i);
    }
  }
  double dist = INFINITY;
  if (!pp_rect_is_empty(box))
    dist = axis->vertical ? fabs((cand->side > 0 ? box.x0 : box.x1) -
                                 (cand->side > 0 ? axis->box.x1 : axis->box.x0))
                          : fmin(fabs(box.y1 - axis->box.y0), fabs(box.y0 - axis->box.y1));
  if (dist > fmax(PP_LINE_MAX_DISTANCE, PP_LINE_MAX_DISTANCE_SHARE * (cand->span1 - cand->span0))) {
    g_array_unref(taken);
    return NULL;
  }
  for (guint k = 0; k < taken->len; k++)
    pp_claims_take_mark(ctx->claims, g_array_index(taken, guint, k), OWNER);
  g_array_unref(taken);
  /* The plot spans the axis' ticks, however flat the line. */
  if (axis->vertical)
    box.y0 = fmin(box.y0, cand->span0), box.y1 = fmax(box.y1, cand->span1);
  else
    box.x0 = fmin(box.x0, cand->span0), box.x1 = fmax(box.x1, cand->span1);
  pp_figure *f = pp_figure_new(PP_FIGURE_LINE);
  f->recognizer = OWNER;
  f->bbox = box;
  pp_figure_add_evidence(f, "scale-fits", 1);
  return f;
}

void pp_recognize_lines(pp_recognize_ctx *ctx) {
  line_index x = {NULL, NULL, NULL};
  for (guint i = 0; i < ctx->axes->len; i++) {
    const pp_axis_candidate *c = g_ptr_array_index(ctx->axes, i);
    if (c->fit_failed || !c->scale->vertical || pp_axis_taken(ctx, c))
      continue;
    if (!x.marks)
      line_index_build(&x, ctx->scene);
    pp_claims_begin(ctx->claims);
    pp_axis_claim_labels(ctx, c);
    pp_figure *f = build_on_axis(ctx, c, &x);
    if (!f) {
      pp_claims_rollback(ctx->claims);
      continue;
    }
    pp_claims_commit(ctx->claims);
    pp_figure_finish(ctx, f, c);
  }
  line_index_clear(&x);
}
