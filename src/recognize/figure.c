/* figure.c — the finishing every recognizer hands its accepted figure to: the scale's
 * visible range, the title, the evidence weighed into a confidence, the fingerprint.
 * The model it builds on is model.c. */
#include <math.h>

#include "internal.h"

/* The visible value range is the plot box along the scale, widened to the ticks. */
static void set_scale(pp_figure *f, const pp_axis_candidate *cand) {
  pp_scale_free(f->scale);
  f->scale = pp_scale_copy(cand->scale);
  double p0 = f->scale->vertical ? f->bbox.y0 : f->bbox.x0;
  double p1 = f->scale->vertical ? f->bbox.y1 : f->bbox.x1;
  p0 = fmin(p0, cand->span0), p1 = fmax(p1, cand->span1);
  double v0 = pp_scale_value_at(f->scale, p0), v1 = pp_scale_value_at(f->scale, p1);
  f->scale->min_value = fmin(v0, v1);
  f->scale->max_value = fmax(v0, v1);
}

/* A title sits at most this far above the plot, pt (a line or two of text; common
 * practice, no source). */
#define PP_TITLE_MAX_GAP 60.0
/* ...and may start this far left of the plot, where a y-axis and its labels stand, pt
 * (common practice, no source). */
#define PP_TITLE_LEFT_REACH 40.0

/* A nearby line above the plot that is not a number: the chart's title. */
static void find_title(const pp_scene *scene, pp_figure *f) {
  const pp_text_line *best = NULL;
  double best_d = PP_TITLE_MAX_GAP;
  for (guint i = 0; i < scene->lines->len; i++) {
    const pp_text_line *l = g_ptr_array_index(scene->lines, i);
    double d = f->bbox.y0 - l->box.y1;
    pp_number num;
    /* tick labels above the plot are numbers; titles are not */
    if (pp_number_parse(l->text, PP_DECIMAL_UNKNOWN, &num) ||
        (f->scale && pp_rect_area(pp_rect_intersect(l->box, f->scale->box)) > 0))
      continue;
    if (d < -2 || d > best_d || l->box.x1 < f->bbox.x0 - PP_TITLE_LEFT_REACH ||
        l->box.x0 > f->bbox.x1)
      continue;
    best_d = d;
    best = l;
  }
  g_free(f->title);
  f->title = best ? g_strdup(best->text) : NULL;
}

/* Independent pieces of evidence combine like independent chances of being right:
 * 1 − Π(1 − score) (the "noisy-or"; common practice, no source). */
static double confidence_of(const pp_figure *f) {
  double doubt = 1;
  for (guint i = 0; i < f->evidence->len; i++)
    doubt *= 1 - g_array_index(f->evidence, pp_evidence, i).score;
  return 1 - doubt;
}

void pp_figure_finish(pp_recognize_ctx *ctx, pp_figure *f, const pp_axis_candidate *scale_source) {
  if (scale_source)
    set_scale(f, scale_source);
  find_title(ctx->scene, f);
  pp_figure_weigh(ctx, f);
  if (f->evidence->len > 0)
    f->confidence = confidence_of(f);
  pp_figure_set_fingerprint(f);
  g_ptr_array_add(ctx->out->figures, f);
}
