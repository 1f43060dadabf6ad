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
/* Legend swatches are at most this big, pt (common practice, no source), and named
 * within their size plus this gap, pt (common practice, no source). */
#define PP_SWATCH_MAX 40.0
#define PP_SWATCH_NAME_GAP 6.0

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

/* Category label: the nearest word outside the plot, beyond the baseline, centred on
 * (or, when rotated, ending at) the bar. */
static char *find_category(const pp_scene *scene, pp_rect bar, pp_rect plot, gboolean vertical) {
  const pp_text_run *best = NULL;
  double best_d = INFINITY;
  for (guint i = 0; i < scene->words->len; i++) {
    const pp_text_run *w = g_ptr_array_index(scene->words, i);
    double cx = (w->box.x0 + w->box.x1) / 2, cy = (w->box.y0 + w->box.y1) / 2;
    double d;
    if (vertical) {
      gboolean over =
          (cx >= bar.x0 - PP_CATEGORY_SLACK && cx <= bar.x1 + PP_CATEGORY_SLACK) ||
          (w->angle != 0 && w->box.x1 >= bar.x0 && w->box.x1 <= bar.x1 + PP_CATEGORY_ROTATED_SLACK);
      if (!over || w->box.y0 < plot.y1 - PP_EDGE_SLACK)
        continue;
      d = w->box.y0 - plot.y1;
    } else {
      if (cy < bar.y0 - PP_CATEGORY_SLACK || cy > bar.y1 + PP_CATEGORY_SLACK ||
          w->box.x1 > plot.x0 + PP_EDGE_SLACK)
        continue;
      d = plot.x0 - w->box.x1;
    }
    if (d < best_d && d < PP_CATEGORY_MAX_GAP) {
      best_d = d;
      best = w;
    }
  }
  if (!best)
    return NULL;
  /* Multi-word categories ("North Sea") continue on the same line: to the right under a
   * column, to the left (towards the margin) beside a horizontal bar. */
  GString *s = g_string_new(best->text);
  const pp_text_run *edge = best;
  for (gboolean grew = TRUE; grew;) {
    grew = FALSE;
    for (guint i = 0; i < scene->words->len && !grew; i++) {
      const pp_text_run *w = g_ptr_array_index(scene->words, i);
      double gap = vertical ? w->box.x0 - edge->box.x1 : edge->box.x0 - w->box.x1;
      pp_number num; /* "2017" "2018" side by side are two categories, not one name */
      if (w == edge || w->line != best->line || gap < -PP_EDGE_SLACK ||
          gap > PP_WORD_GAP * best->font_size || pp_number_parse(w->text, PP_DECIMAL_UNKNOWN, &num))
        continue;
      if (vertical && w->box.x0 > bar.x1 + PP_CATEGORY_SPILL * (bar.x1 - bar.x0))
        continue;
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
  return g_string_free(s, FALSE);
}

/* A data label sits at the bar's tip, just beyond it or just inside it; never at
 * the baseline end, where category labels live. */
static void attach_data_labels(pp_recognize_ctx *ctx, pp_figure *fig, gboolean vertical,
                               double base) {
  GPtrArray *labels = ctx->labels;
  for (guint i = 0; i < fig->elements->len; i++) {
    pp_element *e = &g_array_index(fig->elements, pp_element, i);
    pp_frame_rect f = pp_frame_of(e->box, vertical);
    double tip = fabs(f.u0 - base) > fabs(f.u1 - base) ? f.u0 : f.u1;
    double dir = tip < base ? -1 : 1; /* from base towards tip */
    pp_label *best = NULL;
    double best_d = INFINITY;
    for (guint k = 0; k < labels->len; k++) {
      pp_label *l = g_ptr_array_index(labels, k);
      if (!pp_claims_label_free(ctx->claims, l->index))
        continue;
      double lw = label_w(l, vertical), lu = label_u(l, vertical);
      if (lw < f.w0 - PP_EDGE_SLACK || lw > f.w1 + PP_EDGE_SLACK)
        continue;
      double beyond = (lu - tip) * dir; /* > 0 outside the bar, < 0 inside */
      double from_base = (lu - base) * dir;
      if (from_base <= 0 || beyond > PP_LABEL_BEYOND * l->size ||
          beyond < -PP_LABEL_INSIDE * l->size)
        continue;
      double d = fabs(beyond);
      if (d < best_d) {
        best_d = d;
        best = l;
      }
    }
    if (best) {
      e->label_value = best->number.value;
      e->label_text = g_strdup(best->text);
      pp_claims_take_label(ctx->claims, best->index, PP_OWNER_DATA_LABEL);
    }
  }
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

/* Bars touching the baseline, then whatever stacks on them in their column: one
 * element per column, its segments kept as parts. scale may be NULL (labels-only
 * charts). Claims every bar and data label it uses, for owner. */
pp_figure *pp_bars_build(pp_recognize_ctx *ctx, GArray *sel, const pp_scale *scale,
                         gboolean vertical, double base, const char *owner) {
  const pp_scene *scene = ctx->scene;
  GArray *bars = ctx->bars;
  GArray *colours = g_array_new(FALSE, FALSE, sizeof(pp_paint));
  pp_figure *fig = pp_figure_new(vertical ? PP_FIGURE_COLUMN : PP_FIGURE_BAR);
  fig->recognizer = owner;
  gboolean *in = g_new0(gboolean, MAX(sel->len, 1));
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
    double ink = b->ink;
    pp_rect box = b->rect;
    for (gboolean grew = TRUE; grew;) {
      grew = FALSE;
      for (guint j = 0; j < sel->len; j++) {
        pp_bar_candidate *s = &g_array_index(bars, pp_bar_candidate, g_array_index(sel, guint, j));
        pp_frame_rect g = pp_frame_of(s->rect, vertical);
        if (in[j] || !pp_same_column(f, g))
          continue;
        double near = down ? g.u0 : g.u1, far = down ? g.u1 : g.u0;
        if (fabs(near - tip) < PP_STACK_GAP) {
          in[j] = TRUE;
          pp_claims_take_mark_if_free(ctx->claims, s->mark, owner);
          pp_element_add_part(&e, s->mark, PP_PART_SEGMENT, s->ink);
          tip = far;
          ink += s->ink;
          box = pp_rect_union(box, s->rect);
          e.stacked = grew = TRUE;
        }
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
  g_free(in);
  common_width(fig, vertical);
  fig->n_series = colours->len;
  g_array_unref(colours);
  g_array_sort_with_data(fig->elements, cmp_element, GINT_TO_POINTER(vertical));
  fig->bbox = plot;
  for (guint i = 0; i < fig->elements->len; i++) {
    pp_element *e = &g_array_index(fig->elements, pp_element, i);
    e->category = find_category(scene, e->box, plot, vertical);
  }
  attach_data_labels(ctx, fig, vertical, base);
  return fig;
}

/* Legend keys: swatches of one size, each with a series name beside, above or below
 * it. They share edges like bars do but stand for no value. */
gboolean pp_bars_legend_like(const pp_scene *scene, const pp_figure *fig) {
  pp_rect first = g_array_index(fig->elements, pp_element, 0).box;
  for (guint i = 0; i < fig->elements->len; i++) {
    pp_rect b = g_array_index(fig->elements, pp_element, i).box;
    if (fabs(pp_rect_width(b) - pp_rect_width(first)) > PP_EDGE_SLACK ||
        fabs(pp_rect_height(b) - pp_rect_height(first)) > PP_EDGE_SLACK ||
        pp_rect_width(b) > PP_SWATCH_MAX || pp_rect_height(b) > PP_SWATCH_MAX)
      return FALSE;
    double reach = fmin(pp_rect_width(b), pp_rect_height(b)) + PP_SWATCH_NAME_GAP;
    gboolean named = FALSE;
    for (guint k = 0; k < scene->words->len && !named; k++) {
      const pp_text_run *word = g_ptr_array_index(scene->words, k);
      pp_rect w = word->box;
      double e = PP_EDGE_SLACK;
      gboolean right = w.x0 >= b.x1 - e && w.x0 <= b.x1 + reach && w.y0 < b.y1 && w.y1 > b.y0;
      gboolean below = w.y0 >= b.y1 - e && w.y0 <= b.y1 + reach && w.x0 < b.x1 && w.x1 > b.x0;
      gboolean above = w.y1 <= b.y0 + e && w.y1 >= b.y0 - reach && w.x0 < b.x1 && w.x1 > b.x0;
      pp_number num; /* a number beside a bar is its data label, not a series name */
      named = (right || below || above) && !pp_number_parse(word->text, PP_DECIMAL_UNKNOWN, &num);
    }
    if (!named)
      return FALSE;
  }
  return TRUE;
}
