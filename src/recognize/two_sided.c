/* two_sided.c — recognizer: two-sided bars (population pyramids, back-to-back bars): rows
 * of bars reaching left and right from one shared zero line, under a value axis that prints
 * magnitudes on both sides (400 200 0 200 400), which no linear fit takes. Read and counted
 * as a bar chart; not judged by an ink rule (no one scale runs across it). */
#include <math.h>

#include "internal.h"

#define OWNER "two-sided"

/* Bars meet the zero line within this, pt (PP_SAME_COLUMN_TOL alike). */
#define PP_TWO_EDGE_TOL 0.3
/* A row: its left and right bars agree in their top and bottom within this, pt. */
#define PP_TWO_ROW_TOL 0.5
/* Rows at least: fewer are a pair of bars, not a pyramid (common practice, no source). */
#define PP_TWO_MIN_ROWS 3
/* Mirrored tick labels stand this close to their mirror position, pt, and this far at
 * most below or above the bars, pt (common practice, no source). */
#define PP_TWO_MIRROR_TOL 2.0
#define PP_TWO_LABEL_REACH 40.0

/* Pairs of labels of one value at mirrored places about x = c, on one row near the bars,
 * with a 0 at c. */
static guint mirrored_labels(const pp_recognize_ctx *ctx, double c, pp_rect bars) {
  gboolean zero = FALSE;
  guint pairs = 0;
  for (guint i = 0; i < ctx->labels->len; i++) {
    const pp_label *a = g_ptr_array_index(ctx->labels, i);
    double below = a->box.y0 - bars.y1, above = bars.y0 - a->box.y1;
    if (!pp_claims_label_free(ctx->claims, a->index) ||
        !((below >= -1 && below <= PP_TWO_LABEL_REACH) ||
          (above >= -1 && above <= PP_TWO_LABEL_REACH)))
      continue;
    if (a->number.value == 0 && fabs(a->centre.x - c) <= PP_TWO_MIRROR_TOL)
      zero = TRUE;
    if (a->centre.x <= c + PP_TWO_MIRROR_TOL || !(a->number.value > 0))
      continue;
    for (guint k = 0; k < ctx->labels->len; k++) {
      const pp_label *b = g_ptr_array_index(ctx->labels, k);
      if (b->number.value == a->number.value && fabs(b->centre.y - a->centre.y) < 1 &&
          fabs((c - b->centre.x) - (a->centre.x - c)) <= PP_TWO_MIRROR_TOL) {
        pairs++;
        break;
      }
    }
  }
  return zero ? pairs : 0;
}

static gboolean same_row(pp_rect a, pp_rect b) {
  return fabs(a.y0 - b.y0) <= PP_TWO_ROW_TOL && fabs(a.y1 - b.y1) <= PP_TWO_ROW_TOL;
}

void pp_recognize_two_sided(pp_recognize_ctx *ctx) {
  GArray *bars = ctx->bars;
  for (guint i = 0; i < bars->len; i++) {
    const pp_bar_candidate *seed = &g_array_index(bars, pp_bar_candidate, i);
    if (!pp_claims_mark_free(ctx->claims, seed->mark))
      continue;
    double c = seed->rect.x1; /* a left bar's inner end: the zero line */
    g_autoptr(GArray) left = g_array_new(FALSE, FALSE, sizeof(guint));
    g_autoptr(GArray) right = g_array_new(FALSE, FALSE, sizeof(guint));
    pp_rect all = pp_rect_empty();
    for (guint k = 0; k < bars->len; k++) {
      const pp_bar_candidate *b = &g_array_index(bars, pp_bar_candidate, k);
      if (!pp_claims_mark_free(ctx->claims, b->mark) || pp_rect_width(b->rect) <= 0)
        continue;
      if (fabs(b->rect.x1 - c) <= PP_TWO_EDGE_TOL)
        g_array_append_val(left, k);
      else if (fabs(b->rect.x0 - c) <= PP_TWO_EDGE_TOL)
        g_array_append_val(right, k);
      else
        continue;
      all = pp_rect_union(all, b->rect);
    }
    guint rows = 0;
    for (guint a = 0; a < left->len; a++)
      for (guint b = 0; b < right->len; b++)
        rows +=
            same_row(g_array_index(bars, pp_bar_candidate, g_array_index(left, guint, a)).rect,
                     g_array_index(bars, pp_bar_candidate, g_array_index(right, guint, b)).rect);
    if (rows < PP_TWO_MIN_ROWS || mirrored_labels(ctx, c, all) < 1)
      continue;
    pp_claims_begin(ctx->claims);
    pp_figure *f = pp_figure_new(PP_FIGURE_BAR);
    f->recognizer = OWNER;
    for (guint side = 0; side < 2; side++) {
      GArray *sel = side ? right : left;
      for (guint k = 0; k < sel->len; k++) {
        const pp_bar_candidate *b =
            &g_array_index(bars, pp_bar_candidate, g_array_index(sel, guint, k));
        pp_element e = pp_element_init(PP_ENCODING_LENGTH);
        pp_element_add_part(&e, b->mark, PP_PART_BODY, b->ink);
        pp_claims_take_mark(ctx->claims, b->mark, OWNER);
        e.shape.kind = PP_SHAPE_RECT;
        e.shape.rect = b->rect;
        e.box = b->rect;
        e.ink = b->ink;
        e.extent = pp_rect_width(b->rect);
        e.series = side;
        g_array_append_val(f->elements, e);
      }
    }
    f->n_series = 2;
    f->bbox = pp_solid_frame(ctx->scene, all);
    pp_figure_add_evidence(f, "shared-baseline", 1);
    pp_figure_add_evidence(f, "mirrored-scale", 1);
    f->judged = FALSE;
    f->not_judged_reason =
        g_strdup("two-sided bars from one zero line (a population pyramid): the scale prints "
                 "magnitudes on both sides; read, not judged");
    pp_claims_commit(ctx->claims);
    pp_figure_finish(ctx, f, NULL);
  }
}
