/* legend.c — legend keys: a figure of equal small boxes, each named by a word beside it, is
 * a legend, not bars. The page's words are put in a grid once, so that each swatch looks
 * only at the words near it (a page of a thousand labelled tiles has thousands of both). */
#include <math.h>

#include "internal.h"

/* Legend swatches are at most this big, pt (common practice, no source), and named
 * within their size plus this gap, pt (common practice, no source). */
#define PP_SWATCH_MAX 40.0
#define PP_SWATCH_NAME_GAP 6.0
/* Swatches of one legend agree in size within this, and a name may touch its swatch's
 * edge by this much, pt (glyph boxes overhang; common practice, no source). */
#define PP_SWATCH_SLACK 0.5
/* Margin of a swatch's search box, pt: far above rounding, so no word that names the
 * swatch is left out of it (common practice, no source). */
#define PP_LEGEND_SEARCH_SLACK 1.0
/* Far beyond any page, pt (ISO 32000-1 Annex C: at most 14,400 units a side), and small
 * enough that the grid's extent stays finite; words beyond it are always tried. */
#define PP_LEGEND_GRID_REACH 1e6

struct pp_legend_words {
  pp_box_grid *grid; /* words with an ordinary box (finite, x0 <= x1, y0 <= y1) */
  GArray *others;    /* guint: the rest, tried for every swatch */
  guint8 *is_number; /* per word: 0 not read yet, 1 a number, 2 not (pp_number_parse) */
};

static gboolean ordinary(pp_rect b, double reach) {
  return b.x0 <= b.x1 && b.y0 <= b.y1 && fabs(b.x0) <= reach && fabs(b.x1) <= reach &&
         fabs(b.y0) <= reach && fabs(b.y1) <= reach;
}

static pp_legend_words *legend_words(pp_recognize_ctx *ctx) {
  if (ctx->legend_words)
    return ctx->legend_words;
  GPtrArray *words = ctx->scene->words;
  pp_legend_words *lw = g_new0(pp_legend_words, 1);
  lw->others = g_array_new(FALSE, FALSE, sizeof(guint));
  lw->is_number = g_new0(guint8, MAX(words->len, 1));
  g_autofree pp_rect *boxes = g_new(pp_rect, MAX(words->len, 1));
  for (guint k = 0; k < words->len; k++) {
    pp_rect b = ((const pp_text_run *)g_ptr_array_index(words, k))->box;
    gboolean placed = ordinary(b, PP_LEGEND_GRID_REACH);
    boxes[k] = placed ? b : pp_rect_empty();
    if (!placed)
      g_array_append_val(lw->others, k);
  }
  lw->grid = pp_box_grid_new(boxes, words->len);
  ctx->legend_words = lw;
  return lw;
}

void pp_legend_words_free(pp_legend_words *lw) {
  if (!lw)
    return;
  pp_box_grid_free(lw->grid);
  g_array_unref(lw->others);
  g_free(lw->is_number);
  g_free(lw);
}

/* Whether word k of the page reads as a number, parsed once per page: a page of tiles
 * asks it of the same words for thousands of swatches. */
static gboolean word_is_number(pp_recognize_ctx *ctx, pp_legend_words *lw, guint k) {
  if (!lw->is_number[k]) {
    pp_number num;
    const pp_text_run *w = g_ptr_array_index(ctx->scene->words, k);
    lw->is_number[k] = pp_number_parse(w->text, PP_DECIMAL_UNKNOWN, &num) ? 1 : 2;
  }
  return lw->is_number[k] == 1;
}

static gboolean swatch_named(pp_recognize_ctx *ctx, pp_legend_words *lw, guint k, pp_rect b) {
  const pp_text_run *word = g_ptr_array_index(ctx->scene->words, k);
  double reach = fmin(pp_rect_width(b), pp_rect_height(b)) + PP_SWATCH_NAME_GAP;
  pp_rect w = word->box;
  double e = PP_SWATCH_SLACK;
  gboolean right = w.x0 >= b.x1 - e && w.x0 <= b.x1 + reach && w.y0 < b.y1 && w.y1 > b.y0;
  gboolean below = w.y0 >= b.y1 - e && w.y0 <= b.y1 + reach && w.x0 < b.x1 && w.x1 > b.x0;
  gboolean above = w.y1 <= b.y0 + e && w.y1 >= b.y0 - reach && w.x0 < b.x1 && w.x1 > b.x0;
  /* a number beside a bar is its data label, not a series name */
  return (right || below || above) && !word_is_number(ctx, lw, k);
}

typedef struct {
  pp_recognize_ctx *ctx;
  pp_legend_words *lw;
  pp_rect swatch;
} swatch_query;

static gboolean names_swatch(guint k, gpointer data) {
  swatch_query *sq = data;
  return swatch_named(sq->ctx, sq->lw, k, sq->swatch);
}

/* Tries the words the grid holds in q until one names the swatch (any order: the answer
 * is whether one does). */
static gboolean named_in(pp_recognize_ctx *ctx, pp_legend_words *lw, pp_rect q, pp_rect b) {
  swatch_query sq = {ctx, lw, b};
  return pp_box_grid_find(lw->grid, q, names_swatch, &sq);
}

/* Whether some word names the swatch. A word with an ordinary box that is right of, below
 * or above an ordinary swatch (swatch_named) touches one of three strips: the reach beside
 * the swatch's right edge, across its height; below and above it, across its width. Each
 * strip has the search slack all round, so only the grid's words there and the others are
 * tried. */
static gboolean named_by_some_word(pp_recognize_ctx *ctx, pp_legend_words *lw, pp_rect b) {
  if (!ordinary(b, PP_LEGEND_GRID_REACH)) {
    for (guint k = 0; k < ctx->scene->words->len; k++)
      if (swatch_named(ctx, lw, k, b))
        return TRUE;
    return FALSE;
  }
  double reach = fmin(pp_rect_width(b), pp_rect_height(b)) + PP_SWATCH_NAME_GAP;
  double e = PP_SWATCH_SLACK, s = PP_LEGEND_SEARCH_SLACK;
  pp_rect right = {b.x1 - e - s, b.y0 - s, b.x1 + reach + s, b.y1 + s};
  pp_rect below = {b.x0 - s, b.y1 - e - s, b.x1 + s, b.y1 + reach + s};
  pp_rect above = {b.x0 - s, b.y0 - reach - s, b.x1 + s, b.y0 + e + s};
  if (named_in(ctx, lw, right, b) || named_in(ctx, lw, below, b) || named_in(ctx, lw, above, b))
    return TRUE;
  for (guint i = 0; i < lw->others->len; i++)
    if (swatch_named(ctx, lw, g_array_index(lw->others, guint, i), b))
      return TRUE;
  return FALSE;
}

gboolean pp_bars_legend_like(pp_recognize_ctx *ctx, const pp_figure *fig) {
  GArray *els = fig->elements;
  pp_rect first = g_array_index(els, pp_element, 0).box;
  for (guint i = 0; i < els->len; i++) {
    pp_rect b = g_array_index(els, pp_element, i).box;
    if (fabs(pp_rect_width(b) - pp_rect_width(first)) > PP_SWATCH_SLACK ||
        fabs(pp_rect_height(b) - pp_rect_height(first)) > PP_SWATCH_SLACK ||
        pp_rect_width(b) > PP_SWATCH_MAX || pp_rect_height(b) > PP_SWATCH_MAX)
      return FALSE;
  }
  pp_legend_words *lw = legend_words(ctx);
  for (guint i = 0; i < els->len; i++)
    if (!named_by_some_word(ctx, lw, g_array_index(els, pp_element, i).box))
      return FALSE;
  return TRUE;
}
