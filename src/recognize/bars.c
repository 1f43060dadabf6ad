/* bars.c — bar and column charts. Works in the axis frame: u runs along the value
 * axis, w across it, so one routine serves vertical and horizontal bars. The bars of
 * a chart share a baseline edge; segments sitting on each other form stacks. */
#include <math.h>
#include <string.h>

#define G_LOG_DOMAIN "plotproof-recognize"
#include "internal.h"

typedef struct {
  double u0, u1, w0, w1;
} frame_rect;

static frame_rect to_frame(pp_rect r, gboolean vertical) {
  return vertical ? (frame_rect){r.y0, r.y1, r.x0, r.x1} : (frame_rect){r.x0, r.x1, r.y0, r.y1};
}

static double label_u(const pp_label *l, gboolean vertical) {
  return vertical ? l->centre.y : l->centre.x;
}
static double label_w(const pp_label *l, gboolean vertical) {
  return vertical ? l->centre.x : l->centre.y;
}

static GArray *select_bars(GArray *bars, const pp_axis_candidate *axis, double lo, double hi) {
  gboolean vertical = axis->axis->vertical;
  double span = axis->span1 - axis->span0;
  double reach = fmax(0.6 * span, 20);
  GArray *sel = g_array_new(FALSE, FALSE, sizeof(guint));
  for (guint i = 0; i < bars->len; i++) {
    pp_bar_candidate *b = &g_array_index(bars, pp_bar_candidate, i);
    if (b->used)
      continue;
    frame_rect f = to_frame(b->rect, vertical);
    if (f.w0 < lo || f.w1 > hi)
      continue;
    if (f.u0 < axis->span0 - reach || f.u1 > axis->span1 + reach)
      continue;
    g_array_append_val(sel, i);
  }
  return sel;
}

static frame_rect sel_rect(GArray *bars, GArray *sel, guint i, gboolean vertical) {
  return to_frame(g_array_index(bars, pp_bar_candidate, g_array_index(sel, guint, i)).rect,
                  vertical);
}

/* How many selected bars stand on the edge coordinate c: those touching it and those
 * stacked in their columns. Legend keys and stray boxes touching c by chance add
 * little; the true baseline carries whole stacks. */
static guint support_of(GArray *bars, GArray *sel, double c, gboolean vertical) {
  guint supported = 0;
  for (guint i = 0; i < sel->len; i++) {
    frame_rect fi = sel_rect(bars, sel, i, vertical);
    for (guint j = 0; j < sel->len; j++) {
      frame_rect fj = sel_rect(bars, sel, j, vertical);
      if ((fabs(fj.u0 - c) < 0.05 || fabs(fj.u1 - c) < 0.05) && fabs(fj.w0 - fi.w0) < 0.2 &&
          fabs(fj.w1 - fi.w1) < 0.2) {
        supported++;
        break;
      }
    }
  }
  return supported;
}

#define PP_BASELINE_TRIALS 8

/* The baseline: among the edge coordinates most bars touch, the one that carries the
 * most bars with their stacks; ties go to the one nearest value 0. It must carry at
 * least half of the selection: two bars touching end to end do not make a chart. */
static gboolean find_baseline(GArray *bars, GArray *sel, const pp_axis *axis, double *base) {
  gboolean vertical = axis->vertical;
  double cand[PP_BASELINE_TRIALS];
  guint touches[PP_BASELINE_TRIALS], n_cand = 0;
  for (guint i = 0; i < sel->len; i++) {
    frame_rect fi = sel_rect(bars, sel, i, vertical);
    double edges[2] = {fi.u0, fi.u1};
    for (int e = 0; e < 2; e++) {
      gboolean seen = FALSE;
      for (guint k = 0; k < n_cand && !seen; k++)
        seen = fabs(cand[k] - edges[e]) < 0.05;
      if (seen)
        continue;
      guint count = 0;
      for (guint j = 0; j < sel->len; j++) {
        frame_rect fj = sel_rect(bars, sel, j, vertical);
        count += fabs(fj.u0 - edges[e]) < 0.05 || fabs(fj.u1 - edges[e]) < 0.05;
      }
      if (count < 2)
        continue;
      /* keep the PP_BASELINE_TRIALS most touched coordinates */
      guint slot = n_cand < PP_BASELINE_TRIALS ? n_cand++ : PP_BASELINE_TRIALS;
      if (slot == PP_BASELINE_TRIALS) {
        guint weakest = 0;
        for (guint k = 1; k < n_cand; k++)
          if (touches[k] < touches[weakest])
            weakest = k;
        if (touches[weakest] >= count)
          continue;
        slot = weakest;
      }
      cand[slot] = edges[e];
      touches[slot] = count;
    }
  }
  guint best_support = 0;
  double best_abs = INFINITY;
  for (guint k = 0; k < n_cand; k++) {
    guint support = support_of(bars, sel, cand[k], vertical);
    double v = fabs(pp_axis_value_at(axis, cand[k]));
    if (support > best_support || (support == best_support && v < best_abs)) {
      best_support = support;
      best_abs = v;
      *base = cand[k];
    }
  }
  return best_support >= 2 && best_support * 2 >= sel->len;
}

static int paint_series(GArray *colours, const pp_paint *p) {
  for (guint i = 0; i < colours->len; i++) {
    pp_paint *c = &g_array_index(colours, pp_paint, i);
    if (c->kind == p->kind && fabs(c->r - p->r) < 0.02 && fabs(c->g - p->g) < 0.02 &&
        fabs(c->b - p->b) < 0.02)
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
      gboolean over = (cx >= bar.x0 - 1 && cx <= bar.x1 + 1) ||
                      (w->angle != 0 && w->box.x1 >= bar.x0 && w->box.x1 <= bar.x1 + 2);
      if (!over || w->box.y0 < plot.y1 - 0.5)
        continue;
      d = w->box.y0 - plot.y1;
    } else {
      if (cy < bar.y0 - 1 || cy > bar.y1 + 1 || w->box.x1 > plot.x0 + 0.5)
        continue;
      d = plot.x0 - w->box.x1;
    }
    if (d < best_d && d < 60) {
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
      if (w == edge || w->line != best->line || gap < -0.5 || gap > 0.6 * best->font_size ||
          pp_number_parse(w->text, PP_DECIMAL_UNKNOWN, &num))
        continue;
      if (vertical && w->box.x0 > bar.x1 + 0.6 * (bar.x1 - bar.x0))
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
static void attach_data_labels(pp_figure *fig, GPtrArray *labels, gboolean vertical, double base) {
  for (guint i = 0; i < fig->elements->len; i++) {
    pp_element *e = &g_array_index(fig->elements, pp_element, i);
    frame_rect f = to_frame(e->box, vertical);
    double tip = fabs(f.u0 - base) > fabs(f.u1 - base) ? f.u0 : f.u1;
    double dir = tip < base ? -1 : 1; /* from base towards tip */
    pp_label *best = NULL;
    double best_d = INFINITY;
    for (guint k = 0; k < labels->len; k++) {
      pp_label *l = g_ptr_array_index(labels, k);
      if (l->on_axis)
        continue;
      double lw = label_w(l, vertical), lu = label_u(l, vertical);
      if (lw < f.w0 - 0.5 || lw > f.w1 + 0.5)
        continue;
      double beyond = (lu - tip) * dir; /* > 0 outside the bar, < 0 inside */
      double from_base = (lu - base) * dir;
      if (from_base <= 0 || beyond > 2.5 * l->size || beyond < -3.0 * l->size)
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
      best->on_axis = TRUE; /* claimed */
    }
  }
}

static pp_figure *build_from_selection(const pp_scene *scene, GArray *bars, GArray *sel,
                                       const pp_axis *axis, gboolean vertical, double base,
                                       GPtrArray *labels) {
  /* Bars touching the baseline, then whatever stacks on them. */
  GArray *colours = g_array_new(FALSE, FALSE, sizeof(pp_paint));
  pp_figure *fig = pp_figure_new(vertical ? PP_FIGURE_COLUMN : PP_FIGURE_BAR);
  gboolean *in = g_new0(gboolean, sel->len);
  pp_rect plot = pp_rect_empty();
  for (guint i = 0; i < sel->len; i++) {
    pp_bar_candidate *b = &g_array_index(bars, pp_bar_candidate, g_array_index(sel, guint, i));
    frame_rect f = to_frame(b->rect, vertical);
    if (in[i] || (fabs(f.u0 - base) >= 0.05 && fabs(f.u1 - base) >= 0.05))
      continue;
    in[i] = TRUE;
    b->used = TRUE;
    gboolean down = fabs(f.u0 - base) < 0.05; /* grows towards larger u */
    double tip = down ? f.u1 : f.u0;
    double ink = b->ink;
    pp_rect box = b->rect;
    gboolean stacked = FALSE;
    for (gboolean grew = TRUE; grew;) {
      grew = FALSE;
      for (guint j = 0; j < sel->len; j++) {
        pp_bar_candidate *s = &g_array_index(bars, pp_bar_candidate, g_array_index(sel, guint, j));
        frame_rect g = to_frame(s->rect, vertical);
        if (in[j] || fabs(g.w0 - f.w0) > 0.2 || fabs(g.w1 - f.w1) > 0.2)
          continue;
        double near = down ? g.u0 : g.u1, far = down ? g.u1 : g.u0;
        if (fabs(near - tip) < 0.3) {
          in[j] = TRUE;
          s->used = TRUE;
          tip = far;
          ink += s->ink;
          box = pp_rect_union(box, s->rect);
          stacked = grew = TRUE;
        }
      }
    }
    pp_element e = {0};
    e.kind = PP_ELEMENT_BAR;
    e.mark_index = b->mark;
    e.box = box;
    e.ink = ink;
    e.extent = fabs(tip - base);
    e.label_value = NAN;
    e.stacked = stacked;
    e.series = (guint)paint_series(colours, &b->paint);
    if (axis) {
      e.tip_value = pp_axis_value_at(axis, tip);
      e.base_value = pp_axis_value_at(axis, base);
    } else {
      e.tip_value = e.base_value = NAN;
    }
    g_array_append_val(fig->elements, e);
    plot = pp_rect_union(plot, box);
    if (!pp_rect_is_empty(b->clip) && isfinite(b->clip.x0) && isfinite(b->clip.x1) &&
        pp_rect_area(b->clip) < 0.6 * scene->width * scene->height)
      plot = pp_rect_union(plot, b->clip);
  }
  g_free(in);
  fig->n_series = colours->len;
  g_array_unref(colours);
  g_array_sort_with_data(fig->elements, cmp_element, GINT_TO_POINTER(vertical));
  fig->bbox = plot;
  for (guint i = 0; i < fig->elements->len; i++) {
    pp_element *e = &g_array_index(fig->elements, pp_element, i);
    e->category = find_category(scene, e->box, plot, vertical);
  }
  attach_data_labels(fig, labels, vertical, base);
  return fig;
}

/* Building a figure claims bars and data labels; a rejected attempt gives them back. */
typedef struct {
  gboolean *claimed; /* on_axis of every label before the attempt */
} attempt;

static attempt attempt_begin(GPtrArray *labels) {
  attempt t = {g_new(gboolean, MAX(labels->len, 1))};
  for (guint k = 0; k < labels->len; k++)
    t.claimed[k] = ((pp_label *)g_ptr_array_index(labels, k))->on_axis;
  return t;
}

static void attempt_undo(attempt *t, GArray *bars, GArray *sel, GPtrArray *labels) {
  for (guint k = 0; k < sel->len; k++) /* sel holds only bars unused before the attempt */
    g_array_index(bars, pp_bar_candidate, g_array_index(sel, guint, k)).used = FALSE;
  for (guint k = 0; k < labels->len; k++)
    ((pp_label *)g_ptr_array_index(labels, k))->on_axis = t->claimed[k];
}

static void attempt_end(attempt *t) {
  g_free(t->claimed);
}

/* Bars of one chart stand side by side across the axis (stacks are merged already);
 * two that overlap across it are neighbours in another direction, e.g. the touching
 * bars of a histogram read against the wrong axis. */
static gboolean overlapping(const pp_figure *fig) {
  gboolean vertical = fig->kind == PP_FIGURE_COLUMN;
  for (guint i = 0; i < fig->elements->len; i++)
    for (guint j = i + 1; j < fig->elements->len; j++) {
      frame_rect a = to_frame(g_array_index(fig->elements, pp_element, i).box, vertical);
      frame_rect b = to_frame(g_array_index(fig->elements, pp_element, j).box, vertical);
      double common = fmin(a.w1, b.w1) - fmax(a.w0, b.w0);
      if (common > 0.5 * fmin(a.w1 - a.w0, b.w1 - b.w0))
        return TRUE;
    }
  return FALSE;
}

/* Bars that all stay within a tenth of the tick span are cells of a matrix plot or a
 * colour key, not a bar chart (common practice, no source). */
static gboolean too_short(const pp_figure *fig, const pp_axis_candidate *axis) {
  double longest = 0;
  for (guint i = 0; i < fig->elements->len; i++)
    longest = fmax(longest, g_array_index(fig->elements, pp_element, i).extent);
  return longest < 0.1 * (axis->span1 - axis->span0);
}

/* Legend keys: swatches of one size, each with a series name beside, above or below
 * it. They share edges like bars do but stand for no value. */
static gboolean legend_like(const pp_scene *scene, const pp_figure *fig) {
  pp_rect first = g_array_index(fig->elements, pp_element, 0).box;
  for (guint i = 0; i < fig->elements->len; i++) {
    pp_rect b = g_array_index(fig->elements, pp_element, i).box;
    if (fabs(pp_rect_width(b) - pp_rect_width(first)) > 0.5 ||
        fabs(pp_rect_height(b) - pp_rect_height(first)) > 0.5 || pp_rect_width(b) > 40 ||
        pp_rect_height(b) > 40)
      return FALSE;
    double reach = fmin(pp_rect_width(b), pp_rect_height(b)) + 6;
    gboolean named = FALSE;
    for (guint k = 0; k < scene->words->len && !named; k++) {
      const pp_text_run *word = g_ptr_array_index(scene->words, k);
      pp_rect w = word->box;
      gboolean right = w.x0 >= b.x1 - 0.5 && w.x0 <= b.x1 + reach && w.y0 < b.y1 && w.y1 > b.y0;
      gboolean below = w.y0 >= b.y1 - 0.5 && w.y0 <= b.y1 + reach && w.x0 < b.x1 && w.x1 > b.x0;
      gboolean above = w.y1 <= b.y0 + 0.5 && w.y1 >= b.y0 - reach && w.x0 < b.x1 && w.x1 > b.x0;
      pp_number num; /* a number beside a bar is its data label, not a series name */
      named = (right || below || above) && !pp_number_parse(word->text, PP_DECIMAL_UNKNOWN, &num);
    }
    if (!named)
      return FALSE;
  }
  return TRUE;
}

pp_figure *pp_bar_figure_build(const pp_scene *scene, GArray *bars, const pp_axis_candidate *axis,
                               int side, GPtrArray *labels, GPtrArray *all_axes) {
  double lo, hi, base;
  pp_axis_reach(axis, all_axes, side, &lo, &hi);
  GArray *sel = select_bars(bars, axis, lo, hi);
  g_debug("  side %d: %u bars between %.1f and %.1f", side, sel->len, lo, hi);
  pp_figure *fig = NULL;
  if (sel->len >= 2 && find_baseline(bars, sel, axis->axis, &base)) {
    attempt t = attempt_begin(labels);
    fig = build_from_selection(scene, bars, sel, axis->axis, axis->axis->vertical, base, labels);
    g_debug("  baseline %.2f: %u elements, legend %d, overlapping %d", base, fig->elements->len,
            legend_like(scene, fig), overlapping(fig));
    if (fig->elements->len < 2 || legend_like(scene, fig) || overlapping(fig) ||
        too_short(fig, axis)) {
      attempt_undo(&t, bars, sel, labels);
      g_clear_pointer(&fig, pp_figure_free);
    }
    attempt_end(&t);
  }
  g_array_unref(sel);
  return fig;
}

/* Charts with data labels and no value axis: bars sharing a baseline edge, each
 * carrying its own printed number. */
pp_figure *pp_bar_figure_from_labels(const pp_scene *scene, GArray *bars, GPtrArray *labels) {
  for (int orient = 0; orient < 2; orient++) {
    gboolean vertical = orient == 0;
    for (guint i = 0; i < bars->len; i++) {
      pp_bar_candidate *a = &g_array_index(bars, pp_bar_candidate, i);
      if (a->used)
        continue;
      frame_rect fa = to_frame(a->rect, vertical);
      double edges[2] = {fa.u0, fa.u1};
      for (int e = 0; e < 2; e++) {
        GArray *sel = g_array_new(FALSE, FALSE, sizeof(guint));
        double width = fa.w1 - fa.w0;
        for (guint j = 0; j < bars->len; j++) {
          pp_bar_candidate *b = &g_array_index(bars, pp_bar_candidate, j);
          frame_rect fb = to_frame(b->rect, vertical);
          if (!b->used && (fabs(fb.u0 - edges[e]) < 0.05 || fabs(fb.u1 - edges[e]) < 0.05) &&
              fabs((fb.w1 - fb.w0) - width) < 0.05 * width + 0.1)
            g_array_append_val(sel, j);
        }
        if (sel->len < 2) {
          g_array_unref(sel);
          continue;
        }
        attempt t = attempt_begin(labels);
        pp_figure *fig = build_from_selection(scene, bars, sel, NULL, vertical, edges[e], labels);
        guint labelled = 0;
        for (guint k = 0; k < fig->elements->len; k++)
          labelled += !isnan(g_array_index(fig->elements, pp_element, k).label_value);
        if (labelled == fig->elements->len && labelled >= 2 && !legend_like(scene, fig)) {
          for (guint k = 0; k < fig->elements->len; k++) {
            pp_element *el = &g_array_index(fig->elements, pp_element, k);
            el->tip_value = el->label_value;
          }
          attempt_end(&t);
          g_array_unref(sel);
          return fig;
        }
        attempt_undo(&t, bars, sel, labels);
        attempt_end(&t);
        g_array_unref(sel);
        pp_figure_free(fig);
      }
    }
  }
  return NULL;
}
