/* bar_group.c — what the bar recognizers share: a group of bars standing on one
 * baseline becomes a figure (stacks merged, series by colour, categories, data labels).
 * Works in the axis frame: u runs along the value axis, w across it, so one routine
 * serves vertical and horizontal bars. Marks and labels are claimed through the ledger. */
#include <math.h>
#include <string.h>

#define G_LOG_DOMAIN "plotproof-recognize"
#include "internal.h"

/* Paints of one series differ by less than this per channel (5 of 255; producers'
 * colour rounding; common practice, no source). */
#define PP_SERIES_COLOUR_TOL 0.02
/* Text may touch a box's edge by this much, pt (glyph boxes overhang; common practice,
 * no source). */
#define PP_EDGE_SLACK 0.5
/* A category label is centred over its bar within this, pt, or, turned, ends within
 * PP_CATEGORY_ROTATED_SLACK of its right edge (common practice, no source)... */
#define PP_CATEGORY_SLACK 1.0
#define PP_CATEGORY_ROTATED_SLACK 2.0
/* ...at most this far beyond the plot, pt (common practice, no source)... */
#define PP_CATEGORY_MAX_GAP 60.0
/* ...continued by words on its line closer than this share of the font size (a word
 * space; common practice, no source), spilling at most this share of the bar's width
 * past it (common practice, no source). */
#define PP_WORD_GAP 0.6
#define PP_CATEGORY_SPILL 0.6
/* A data label stands at most this many text sizes beyond its bar's tip, or this many
 * inside it (labels printed in the bar's end; common practice, no source). */
#define PP_LABEL_BEYOND 2.5
#define PP_LABEL_INSIDE 3.0

pp_frame_rect pp_frame_of(pp_rect r, gboolean vertical) {
  return vertical ? (pp_frame_rect){r.y0, r.y1, r.x0, r.x1}
                  : (pp_frame_rect){r.x0, r.x1, r.y0, r.y1};
}

static double label_u(const pp_label *l, gboolean vertical) {
  return vertical ? l->centre.y : l->centre.x;
}
static double label_w(const pp_label *l, gboolean vertical) {
  return vertical ? l->centre.x : l->centre.y;
}

static int paint_series(GArray *colours, const pp_paint *p) {
  for (guint i = 0; i < colours->len; i++) {
    pp_paint *c = &g_array_index(colours, pp_paint, i);
    if (c->kind == p->kind && fabs(c->r - p->r) < PP_SERIES_COLOUR_TOL &&
        fabs(c->g - p->g) < PP_SERIES_COLOUR_TOL && fabs(c->b - p->b) < PP_SERIES_COLOUR_TOL)
      return (int)i;
  }
  g_array_append_val(colours, *p);
  return (int)colours->len - 1;
}

static int cmp_element(gconstpointer a, gconstpointer b, gpointer vertical) {
  const pp_element *ea = a, *eb = b;
  /* category order: left to right for columns, top to bottom for horizontal bars */
  double pa = GPOINTER_TO_INT(vertical) ? ea->box.x0 : ea->box.y0;
  double pb = GPOINTER_TO_INT(vertical) ? eb->box.x0 : eb->box.y0;
  return (pa > pb) - (pa < pb);
}

/* The page's words and labels in coordinate order, built on the first bar figure of a
 * page (ctx->bar_text) so that categories and data labels are looked up in the band
 * where they can lie instead of among every word per bar: a page of a thousand labelled
 * tiles has as many words as bars. Lookups keep the linear scans' answers: the first
 * word or label in page order among the nearest. Words with a NaN key, which the scans
 * never chose, are skipped; labels with one are still tried. */
struct pp_bar_text {
  guint n_words;
  guint *by_y0;                /* word indices by box.y0 */
  guint *by_x1;                /* word indices by box.x1 */
  guint n_by_y0, n_by_x1;      /* entries with a key (not NaN) */
  gboolean lines_in_order;     /* words' line numbers never decrease (capture's reading order) */
  double tallest, upside_down; /* the largest y1 - y0 and y0 - y1 of a word, at least 0 */
  /* Data labels (tip_label), on first use: a grid of the labels' centres, and the labels
   * the grid cannot answer for (a centre or size not finite, or beyond its reach), which
   * are tried for every bar. */
  pp_box_grid *centres;
  GArray *centres_others, *near; /* guint label indices; near is scratch */
  double largest_size;           /* of the labels in the grid */
};

static double key_of(const void *base, gsize stride, guint i) {
  return *(const double *)((const char *)base + stride * i);
}

static const void *sort_base;
static gsize sort_stride;

/* Key, then index: ties stay in page order. */
static int cmp_by_key(const void *a, const void *b) {
  guint i = *(const guint *)a, j = *(const guint *)b;
  double x = key_of(sort_base, sort_stride, i), y = key_of(sort_base, sort_stride, j);
  if (x != y)
    return x < y ? -1 : 1;
  return (i > j) - (i < j);
}

/* Indices 0..n-1 of the items (their key a double at byte offset off), those with a key
 * sorted by it in the first *n_out places, those with a NaN key after them. */
static guint *sorted_indices(GPtrArray *items, gsize off, guint *n_out) {
  guint n = items->len, m = 0, back = n;
  double *keys = g_new(double, MAX(n, 1));
  guint *idx = g_new(guint, MAX(n, 1));
  for (guint i = 0; i < n; i++) {
    keys[i] = *(const double *)((const char *)g_ptr_array_index(items, i) + off);
    if (!isnan(keys[i]))
      idx[m++] = i;
  }
  for (guint i = n; i-- > 0;) /* NaN keys last, in page order */
    if (isnan(keys[i]))
      idx[--back] = i;
  sort_base = keys, sort_stride = sizeof(double);
  qsort(idx, m, sizeof(guint), cmp_by_key);
  sort_base = NULL;
  g_free(keys);
  *n_out = m;
  return idx;
}

static const pp_bar_text *bar_text(pp_recognize_ctx *ctx) {
  if (ctx->bar_text)
    return ctx->bar_text;
  pp_bar_text *t = g_new0(pp_bar_text, 1);
  GPtrArray *words = ctx->scene->words;
  t->n_words = words->len;
  t->by_y0 = sorted_indices(words, G_STRUCT_OFFSET(pp_text_run, box.y0), &t->n_by_y0);
  t->by_x1 = sorted_indices(words, G_STRUCT_OFFSET(pp_text_run, box.x1), &t->n_by_x1);
  for (guint k = 0; k < words->len; k++) { /* capture's boxes have y0 <= y1; not assumed */
    const pp_text_run *w = g_ptr_array_index(words, k);
    t->tallest = fmax(t->tallest, w->box.y1 - w->box.y0);
    t->upside_down = fmax(t->upside_down, w->box.y0 - w->box.y1);
  }
  t->lines_in_order = TRUE;
  for (guint i = 1; i < words->len && t->lines_in_order; i++)
    t->lines_in_order = ((const pp_text_run *)g_ptr_array_index(words, i - 1))->line <=
                        ((const pp_text_run *)g_ptr_array_index(words, i))->line;
  ctx->bar_text = t;
  return t;
}

void pp_bar_text_free(pp_bar_text *t) {
  if (!t)
    return;
  g_free(t->by_y0);
  g_free(t->by_x1);
  pp_box_grid_free(t->centres);
  if (t->centres_others)
    g_array_unref(t->centres_others);
  if (t->near)
    g_array_unref(t->near);
  g_free(t);
}

/* First position in idx (n sorted entries of items) whose key at off is >= v. */
static guint lower_bound(GPtrArray *items, gsize off, const guint *idx, guint n, double v) {
  guint lo = 0, hi = n;
  while (lo < hi) {
    guint mid = lo + (hi - lo) / 2;
    if (*(const double *)((const char *)g_ptr_array_index(items, idx[mid]) + off) < v)
      lo = mid + 1;
    else
      hi = mid;
  }
  return lo;
}

/* First position whose key is > v. */
static guint upper_bound(GPtrArray *items, gsize off, const guint *idx, guint n, double v) {
  guint lo = 0, hi = n;
  while (lo < hi) {
    guint mid = lo + (hi - lo) / 2;
    if (*(const double *)((const char *)g_ptr_array_index(items, idx[mid]) + off) <= v)
      lo = mid + 1;
    else
      hi = mid;
  }
  return lo;
}

/* Category label: the nearest word outside the plot, beyond the baseline, centred on
 * (or, when rotated, ending at) the bar. Its index in the page's words, G_MAXUINT when
 * none; *dist gets its distance (INFINITY when none). */
static guint nearest_category(pp_recognize_ctx *ctx, pp_rect bar, pp_rect plot, gboolean vertical,
                              double *dist) {
  const pp_scene *scene = ctx->scene;
  const pp_bar_text *t = bar_text(ctx);
  GPtrArray *words = scene->words;
  const pp_text_run *best = NULL;
  guint best_i = G_MAXUINT;
  double best_d = INFINITY;
  if (vertical) {
    /* Words whose top is at most PP_EDGE_SLACK above the plot's bottom, nearest first. */
    guint k = lower_bound(words, G_STRUCT_OFFSET(pp_text_run, box.y0), t->by_y0, t->n_by_y0,
                          plot.y1 - PP_EDGE_SLACK);
    for (; k < t->n_by_y0; k++) {
      guint i = t->by_y0[k];
      const pp_text_run *w = g_ptr_array_index(words, i);
      double d = w->box.y0 - plot.y1; /* never decreases along by_y0 */
      if (!(d < PP_CATEGORY_MAX_GAP) || d > best_d)
        break;
      double cx = (w->box.x0 + w->box.x1) / 2;
      gboolean over =
          (cx >= bar.x0 - PP_CATEGORY_SLACK && cx <= bar.x1 + PP_CATEGORY_SLACK) ||
          (w->angle != 0 && w->box.x1 >= bar.x0 && w->box.x1 <= bar.x1 + PP_CATEGORY_ROTATED_SLACK);
      if (over && (d < best_d || (d == best_d && i < best_i))) {
        best_d = d;
        best = w;
        best_i = i;
      }
    }
  } else {
    /* Words ending at most PP_EDGE_SLACK right of the plot's left edge, nearest first. */
    guint k = upper_bound(words, G_STRUCT_OFFSET(pp_text_run, box.x1), t->by_x1, t->n_by_x1,
                          plot.x0 + PP_EDGE_SLACK);
    while (k-- > 0) {
      guint i = t->by_x1[k];
      const pp_text_run *w = g_ptr_array_index(words, i);
      double d = plot.x0 - w->box.x1; /* never decreases along by_x1 taken backwards */
      if (!(d < PP_CATEGORY_MAX_GAP) || d > best_d)
        break;
      double cy = (w->box.y0 + w->box.y1) / 2;
      if (cy < bar.y0 - PP_CATEGORY_SLACK || cy > bar.y1 + PP_CATEGORY_SLACK)
        continue;
      if (d < best_d || (d == best_d && i < best_i)) {
        best_d = d;
        best = w;
        best_i = i;
      }
    }
  }
  *dist = best_d;
  return best ? best_i : G_MAXUINT;
}

/* The category's text: word best_i of the page (G_MAXUINT: none, NULL) with the words
 * that continue it. */
static char *category_text(pp_recognize_ctx *ctx, guint best_i, pp_rect bar, gboolean vertical) {
  if (best_i == G_MAXUINT)
    return NULL;
  const pp_scene *scene = ctx->scene;
  const pp_bar_text *t = bar_text(ctx);
  GPtrArray *words = scene->words;
  const pp_text_run *best = g_ptr_array_index(words, best_i);
  /* Multi-word categories ("North Sea") continue on the same line: to the right under a
   * column, to the left (towards the margin) beside a horizontal bar. Most are one word:
   * the string is only built when another joins. */
  GString *s = NULL;
  const pp_text_run *edge = best;
  /* Only words of best's line can continue it: with lines in order, that is one run. */
  guint first = 0, end = words->len;
  if (t->lines_in_order) {
    for (first = best_i;
         first > 0 &&
         ((const pp_text_run *)g_ptr_array_index(words, first - 1))->line == best->line;)
      first--;
    for (end = best_i + 1;
         end < words->len &&
         ((const pp_text_run *)g_ptr_array_index(words, end))->line == best->line;)
      end++;
  }
  for (gboolean grew = TRUE; grew;) {
    grew = FALSE;
    for (guint i = first; i < end && !grew; i++) {
      const pp_text_run *w = g_ptr_array_index(scene->words, i);
      double gap = vertical ? w->box.x0 - edge->box.x1 : edge->box.x0 - w->box.x1;
      pp_number num; /* "2017" "2018" side by side are two categories, not one name */
      if (w == edge || w->line != best->line || gap < -PP_EDGE_SLACK ||
          gap > PP_WORD_GAP * best->font_size || pp_number_parse(w->text, PP_DECIMAL_UNKNOWN, &num))
        continue;
      if (vertical && w->box.x0 > bar.x1 + PP_CATEGORY_SPILL * (bar.x1 - bar.x0))
        continue;
      if (!s)
        s = g_string_new(best->text);
      if (vertical) {
        g_string_append_c(s, ' ');
        g_string_append(s, w->text);
      } else {
        g_string_prepend_c(s, ' ');
        g_string_prepend(s, w->text);
      }
      edge = w;
      grew = TRUE;
    }
  }
  return s ? g_string_free(s, FALSE) : g_strdup(best->text);
}

static char *find_category(pp_recognize_ctx *ctx, pp_rect bar, pp_rect plot, gboolean vertical,
                           double *dist) {
  return category_text(ctx, nearest_category(ctx, bar, plot, vertical, dist), bar, vertical);
}

/* Bars of one group (one per series, side by side) may stand apart, their category
 * centred under the gap between them: the gap inside a group is at most this share of a
 * bar's width, and a group never holds a series twice (common practice, no source). */
#define PP_GROUP_MAX_GAP_SHARE 1.0

/* A group takes the category centred under it when that is nearer than the ones its bars
 * found alone (a footnote below the year, say), own[i] the distance of element i's. */
static void find_group_categories(pp_recognize_ctx *ctx, pp_figure *fig, pp_rect plot,
                                  gboolean vertical, const double *own) {
  guint n = fig->elements->len;
  for (guint start = 0, end; start < n; start = end) {
    pp_element *first = &g_array_index(fig->elements, pp_element, start);
    pp_rect span = first->box;
    guint64 seen = 1ull << MIN(first->series, 63u);
    for (end = start + 1; end < n; end++) {
      pp_element *prev = &g_array_index(fig->elements, pp_element, end - 1);
      pp_element *e = &g_array_index(fig->elements, pp_element, end);
      pp_frame_rect a = pp_frame_of(prev->box, vertical), b = pp_frame_of(e->box, vertical);
      guint64 bit = 1ull << MIN(e->series, 63u);
      if ((seen & bit) || b.w0 - a.w1 > PP_GROUP_MAX_GAP_SHARE * fmin(a.w1 - a.w0, b.w1 - b.w0))
        break;
      seen |= bit;
      span = pp_rect_union(span, e->box);
    }
    if (end - start < 2)
      continue;
    double d = INFINITY;
    char *category = find_category(ctx, span, plot, vertical, &d);
    for (guint i = start; category && i < end; i++) {
      pp_element *e = &g_array_index(fig->elements, pp_element, i);
      if (d < own[i]) {
        g_free(e->category);
        e->category = g_strdup(category);
      }
    }
    g_free(category);
  }
}

/* A data label sits at the bar's tip, just beyond it or just inside it; never at
 * the baseline end, where category labels live. */
/* A stack's segments each carry their own label, centred in the segment or at its end
 * inside it: the free label nearest the segment's centre among those inside it. */
static void attach_segment_labels(pp_recognize_ctx *ctx, pp_element *e, gboolean vertical) {
  for (guint k = 0; k < e->parts->len; k++) {
    pp_part *p = &g_array_index(e->parts, pp_part, k);
    const pp_mark *m = g_ptr_array_index(ctx->scene->marks, p->mark);
    pp_frame_rect f = pp_frame_of(m->visible_bbox, vertical);
    pp_label *best = NULL;
    double best_d = INFINITY;
    for (guint j = 0; j < ctx->labels->len; j++) {
      pp_label *l = g_ptr_array_index(ctx->labels, j);
      double lw = label_w(l, vertical), lu = label_u(l, vertical);
      if (!pp_claims_label_free(ctx->claims, l->index) || lw < f.w0 - PP_EDGE_SLACK ||
          lw > f.w1 + PP_EDGE_SLACK || lu < f.u0 || lu > f.u1)
        continue;
      double d = fabs(lu - (f.u0 + f.u1) / 2);
      if (d < best_d) {
        best_d = d;
        best = l;
      }
    }
    if (best) {
      p->label_value = best->number.value;
      pp_claims_take_label(ctx->claims, best->index, PP_OWNER_DATA_LABEL);
    }
  }
}

/* Far beyond any page, pt (ISO 32000-1 Annex C: at most 14,400 units a side), and small
 * enough that the grid's extent stays finite. */
#define PP_LABEL_GRID_REACH 1e6
/* Margin of the data-label search box, pt: far above rounding, so no label tip_label
 * would take is left out of it (common practice, no source). */
#define PP_LABEL_SEARCH_SLACK 1.0

static pp_bar_text *label_centres(pp_recognize_ctx *ctx) {
  pp_bar_text *t = (pp_bar_text *)bar_text(ctx);
  if (t->centres)
    return t;
  GPtrArray *labels = ctx->labels;
  g_autofree pp_rect *boxes = g_new(pp_rect, MAX(labels->len, 1));
  t->centres_others = g_array_new(FALSE, FALSE, sizeof(guint));
  t->near = g_array_new(FALSE, FALSE, sizeof(guint));
  for (guint k = 0; k < labels->len; k++) {
    const pp_label *l = g_ptr_array_index(labels, k);
    double x = l->centre.x, y = l->centre.y;
    gboolean placed = fabs(x) <= PP_LABEL_GRID_REACH && fabs(y) <= PP_LABEL_GRID_REACH &&
                      isfinite(l->size) && fabs(l->size) <= PP_LABEL_GRID_REACH;
    boxes[k] = placed ? (pp_rect){x, y, x, y} : pp_rect_empty();
    if (placed)
      t->largest_size = fmax(t->largest_size, fabs(l->size));
    else
      g_array_append_val(t->centres_others, k);
  }
  t->centres = pp_box_grid_new(boxes, labels->len);
  return t;
}

/* Whether label l is a better data label for the bar than *best (at *best_d); updates them. */
static void consider_tip_label(pp_recognize_ctx *ctx, const pp_element *e, pp_label *l,
                               gboolean vertical, double tip, double base, double dir,
                               pp_label **best, double *best_d) {
  if (!pp_claims_label_free(ctx->claims, l->index))
    return;
  double lu = label_u(l, vertical);
  double beyond = (lu - tip) * dir; /* > 0 outside the bar, < 0 inside */
  double from_base = (lu - base) * dir;
  /* a stack's total stands beyond its tip: labels inside are its segments' */
  double inside = e->stacked ? PP_EDGE_SLACK : PP_LABEL_INSIDE * l->size;
  if (from_base <= 0 || beyond > PP_LABEL_BEYOND * l->size || beyond < -inside)
    return;
  double d = fabs(beyond);
  if (d < *best_d || (d == *best_d && *best && l->index < (*best)->index)) {
    *best_d = d;
    *best = l;
  }
}

/* The data label of one bar: the free label nearest its tip, just beyond it or inside it
 * (first in page order among equals). Candidates lie across the bar's width (within
 * PP_EDGE_SLACK); a label with no position across (NaN) is always a candidate. A label
 * whose position along is NaN never passes the distance tests, so one that can pass lies
 * within the largest label's reach of the tip: the grid answers for the box of both. */
static pp_label *tip_label(pp_recognize_ctx *ctx, const pp_element *e, gboolean vertical,
                           double base) {
  GPtrArray *labels = ctx->labels;
  pp_bar_text *t = label_centres(ctx);
  pp_frame_rect f = pp_frame_of(e->box, vertical);
  double tip = fabs(f.u0 - base) > fabs(f.u1 - base) ? f.u0 : f.u1;
  double dir = tip < base ? -1 : 1; /* from base towards tip */
  pp_label *best = NULL;
  double best_d = INFINITY;
  double w0 = f.w0 - PP_EDGE_SLACK, w1 = f.w1 + PP_EDGE_SLACK;
  double along = fmax(PP_EDGE_SLACK, fmax(PP_LABEL_INSIDE, PP_LABEL_BEYOND) * t->largest_size) +
                 PP_LABEL_SEARCH_SLACK;
  double s = PP_LABEL_SEARCH_SLACK;
  pp_rect q = vertical ? (pp_rect){w0 - s, tip - along, w1 + s, tip + along}
                       : (pp_rect){tip - along, w0 - s, tip + along, w1 + s};
  pp_box_grid_query_any(t->centres, q, t->near); /* any order: ties go by index */
  GArray *sources[2] = {t->near, t->centres_others};
  for (int k = 0; k < 2; k++)
    for (guint j = 0; j < sources[k]->len; j++) {
      pp_label *l = g_ptr_array_index(labels, g_array_index(sources[k], guint, j));
      double lw = label_w(l, vertical);
      if (isnan(lw) || (lw >= w0 && lw <= w1))
        consider_tip_label(ctx, e, l, vertical, tip, base, dir, &best, &best_d);
    }
  return best;
}

static void attach_data_labels(pp_recognize_ctx *ctx, pp_figure *fig, gboolean vertical,
                               double base) {
  for (guint i = 0; i < fig->elements->len; i++) {
    pp_element *e = &g_array_index(fig->elements, pp_element, i);
    if (e->stacked)
      attach_segment_labels(ctx, e, vertical);
    pp_label *best = tip_label(ctx, e, vertical, base);
    if (best) {
      e->label_value = best->number.value;
      e->label_text = g_strdup(best->text);
      pp_claims_take_label(ctx->claims, best->index, PP_OWNER_DATA_LABEL);
    }
  }
}

/* The last part's scale readings at its near and far ends (stays NAN without a scale). */
static void set_reading(pp_element *e, const pp_scale *scale, double near, double far) {
  if (!scale)
    return;
  pp_part *p = &g_array_index(e->parts, pp_part, e->parts->len - 1);
  p->start = pp_scale_value_at(scale, near);
  p->end = pp_scale_value_at(scale, far);
}

/* Bars of one chart are drawn at one width; the capture resolves 1/1024 pt, so two
 * equal widths can come back 0.001 pt apart, and a Lie Factor between two bars of
 * nearly equal value magnifies that a hundredfold. Widths within two same-edge
 * tolerances of the median (each side may be off by one) are set to the median, their
 * ink scaled with them; a chart of deliberately varied widths keeps its own. */
static void common_width(pp_figure *fig, gboolean vertical) {
  guint n = fig->elements->len;
  if (n < 2)
    return;
  double *w = g_new(double, n);
  for (guint i = 0; i < n; i++) {
    pp_frame_rect f = pp_frame_of(g_array_index(fig->elements, pp_element, i).box, vertical);
    w[i] = f.w1 - f.w0;
  }
  double *sorted = g_memdup2(w, n * sizeof(double));
  for (guint i = 1; i < n; i++) /* small n: insertion sort for the median */
    for (guint j = i; j > 0 && sorted[j] < sorted[j - 1]; j--) {
      double t = sorted[j];
      sorted[j] = sorted[j - 1];
      sorted[j - 1] = t;
    }
  double median = sorted[n / 2];
  g_free(sorted);
  for (guint i = 0; i < n; i++) {
    pp_element *e = &g_array_index(fig->elements, pp_element, i);
    if (!(w[i] > 0) || fabs(w[i] - median) >= 2 * PP_SAME_EDGE_TOL)
      continue;
    double k = median / w[i];
    e->ink *= k;
    for (guint p = 0; p < e->parts->len; p++)
      g_array_index(e->parts, pp_part, p).ink *= k;
  }
  g_free(w);
}

/* A margin around the stacking search, pt, so that rounding in the exact test (which
 * decides) never falls outside it: far above a double's spacing at page coordinates. */
#define PP_STACK_SEARCH_SLACK 1e-6

/* The selection's positions by the end a segment rests on (u0 when its column grows
 * towards larger u, u1 otherwise), so that the segments on a tip are found by binary
 * search instead of a pass over the selection per bar: a row of a page of tiles is a
 * selection of a hundred bars, each its own column. */
typedef struct {
  GArray *bars, *sel;
  gboolean vertical;
  const gboolean *in;
  pp_coord_index *near[2]; /* [0: u0, 1: u1] */
  GArray *hits;            /* guint: scratch */
} stack_index;

static void stack_index_init(stack_index *st, GArray *bars, GArray *sel, gboolean vertical,
                             const gboolean *in) {
  *st = (stack_index){bars, sel, vertical, in, {NULL, NULL}, NULL};
  g_autofree double *v = g_new(double, MAX(sel->len, 1));
  for (int side = 0; side < 2; side++) {
    for (guint j = 0; j < sel->len; j++) {
      pp_rect r = g_array_index(bars, pp_bar_candidate, g_array_index(sel, guint, j)).rect;
      pp_frame_rect g = pp_frame_of(r, vertical);
      v[j] = side ? g.u1 : g.u0;
    }
    st->near[side] = pp_coord_index_new(v, sel->len);
  }
  st->hits = g_array_new(FALSE, FALSE, sizeof(guint));
}

static void stack_index_clear(stack_index *st) {
  pp_coord_index_free(st->near[0]);
  pp_coord_index_free(st->near[1]);
  g_array_unref(st->hits);
}

/* The first position from `from` on of a free bar in column f whose near end lies within
 * PP_STACK_GAP of tip (sel->len when none): what a pass over the selection in order
 * would take next. */
static guint next_segment(stack_index *st, pp_frame_rect f, gboolean down, double tip, guint from) {
  guint best = st->sel->len;
  g_array_set_size(st->hits, 0);
  double reach = PP_STACK_GAP + PP_STACK_SEARCH_SLACK;
  pp_coord_index_range(st->near[down ? 0 : 1], tip - reach, tip + reach, st->hits);
  for (guint k = 0; k < st->hits->len; k++) {
    guint j = g_array_index(st->hits, guint, k);
    if (j < from || j >= best || st->in[j])
      continue;
    pp_rect r = g_array_index(st->bars, pp_bar_candidate, g_array_index(st->sel, guint, j)).rect;
    pp_frame_rect g = pp_frame_of(r, st->vertical);
    if (pp_same_column(f, g) && fabs((down ? g.u0 : g.u1) - tip) < PP_STACK_GAP)
      best = j;
  }
  return best;
}

/* Bars touching the baseline, then whatever stacks on them in their column: one
 * element per column, its segments kept as parts. scale may be NULL (labels-only
 * charts). Claims every bar it uses, for owner. */
pp_figure *pp_bars_stack(pp_recognize_ctx *ctx, GArray *sel, const pp_scale *scale,
                         gboolean vertical, double base, const char *owner) {
  const pp_scene *scene = ctx->scene;
  GArray *bars = ctx->bars;
  GArray *colours = g_array_new(FALSE, FALSE, sizeof(pp_paint));
  pp_figure *fig = pp_figure_new(vertical ? PP_FIGURE_COLUMN : PP_FIGURE_BAR);
  fig->recognizer = owner;
  gboolean *in = g_new0(gboolean, MAX(sel->len, 1));
  stack_index st;
  stack_index_init(&st, bars, sel, vertical, in);
  pp_rect plot = pp_rect_empty();
  for (guint i = 0; i < sel->len; i++) {
    pp_bar_candidate *b = &g_array_index(bars, pp_bar_candidate, g_array_index(sel, guint, i));
    pp_frame_rect f = pp_frame_of(b->rect, vertical);
    if (in[i] || !pp_on_edge(f.u0, f.u1, base))
      continue;
    in[i] = TRUE;
    pp_claims_take_mark_if_free(ctx->claims, b->mark, owner);
    gboolean down = pp_same_edge(f.u0, base); /* grows towards larger u */
    double tip = down ? f.u1 : f.u0;
    pp_element e = pp_element_init(PP_ENCODING_LENGTH);
    pp_element_add_part(&e, b->mark, PP_PART_BODY, b->ink);
    set_reading(&e, scale, base, tip);
    double ink = b->ink;
    pp_rect box = b->rect;
    /* Passes over sel in order, each taking every segment resting on the tip so far,
     * until a pass takes none. */
    for (gboolean grew = TRUE; grew;) {
      grew = FALSE;
      for (guint j = 0; (j = next_segment(&st, f, down, tip, j)) < sel->len; j++) {
        pp_bar_candidate *s = &g_array_index(bars, pp_bar_candidate, g_array_index(sel, guint, j));
        pp_frame_rect g = pp_frame_of(s->rect, vertical);
        double near = down ? g.u0 : g.u1, far = down ? g.u1 : g.u0;
        in[j] = TRUE;
        pp_claims_take_mark_if_free(ctx->claims, s->mark, owner);
        pp_element_add_part(&e, s->mark, PP_PART_SEGMENT, s->ink);
        set_reading(&e, scale, near, far);
        tip = far;
        ink += s->ink;
        box = pp_rect_union(box, s->rect);
        e.stacked = grew = TRUE;
      }
    }
    if (e.stacked) /* every piece of a stack is a segment, the first included */
      g_array_index(e.parts, pp_part, 0).role = PP_PART_SEGMENT;
    e.shape.kind = PP_SHAPE_RECT;
    e.shape.rect = box;
    e.box = box;
    e.ink = ink;
    e.extent = fabs(tip - base);
    e.series = (guint)paint_series(colours, &b->paint);
    if (scale) {
      e.scale_value = pp_scale_value_at(scale, tip);
      e.base_value = pp_scale_value_at(scale, base);
      e.value = e.scale_value;
      e.source = PP_VALUE_SCALE;
    }
    g_array_append_val(fig->elements, e);
    plot = pp_rect_union(plot, box);
    if (!pp_rect_is_empty(b->clip) && isfinite(b->clip.x0) && isfinite(b->clip.x1) &&
        !pp_page_sized(scene, b->clip))
      plot = pp_rect_union(plot, b->clip);
  }
  stack_index_clear(&st);
  g_free(in);
  common_width(fig, vertical);
  fig->n_series = colours->len;
  g_array_unref(colours);
  g_array_sort_with_data(fig->elements, cmp_element, GINT_TO_POINTER(vertical));
  fig->bbox = plot;
  return fig;
}

/* Categories beyond the plot (fig->bbox) and data labels at the tips; claims the labels. */
void pp_bars_annotate(pp_recognize_ctx *ctx, pp_figure *fig, gboolean vertical, double base) {
  /* each element's own category and its distance, which its group's must beat */
  g_autofree double *own = g_new(double, MAX(fig->elements->len, 1));
  for (guint i = 0; i < fig->elements->len; i++) {
    pp_element *e = &g_array_index(fig->elements, pp_element, i);
    e->category = find_category(ctx, e->box, fig->bbox, vertical, &own[i]);
  }
  find_group_categories(ctx, fig, fig->bbox, vertical, own);
  attach_data_labels(ctx, fig, vertical, base);
}

pp_figure *pp_bars_build(pp_recognize_ctx *ctx, GArray *sel, const pp_scale *scale,
                         gboolean vertical, double base, const char *owner) {
  pp_figure *fig = pp_bars_stack(ctx, sel, scale, vertical, base, owner);
  pp_bars_annotate(ctx, fig, vertical, base);
  return fig;
}
