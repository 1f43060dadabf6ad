/* bars.c — recognizer: bar and column charts on a value axis. Each fitted axis is tried
 * first on the side its labels face, then on the other; the bars beside it that share a
 * baseline become the chart, unless they are legend keys, histogram neighbours read the
 * wrong way, or cells too short to be bars. */
#include <math.h>

#define G_LOG_DOMAIN "plotproof-recognize"
#include "internal.h"

#define OWNER "bars"

/* Bars may reach at least this far beyond the end ticks, pt, however short the axis
 * (common practice, no source). */
#define PP_BARS_MIN_REACH 20.0
/* Only the most touched edge coordinates are tried as the baseline (enough for a
 * baseline, a top frame and a few coincidences; common practice, no source). */
#define PP_BASELINE_TRIALS 8
/* Bars whose longest stays under this share of the tick span are cells of a matrix
 * plot or a colour key, not a bar chart (common practice, no source). */
#define PP_BARS_MIN_LONGEST 0.1
/* Two bars overlapping across the axis by more than this share of the narrower one are
 * neighbours in the other direction (common practice, no source). */
#define PP_BARS_MAX_OVERLAP 0.5

/* How much a fitted value scale says: its weight when the tick labels fit exactly and
 * there are PP_EVIDENCE_FULL_TICKS of them or more (common practice, no source). The fit
 * counts for nothing at the axis reader's own limit of a 2% residual (axis.c). */
#define PP_EVIDENCE_SCALE_WEIGHT 0.8
#define PP_EVIDENCE_FULL_TICKS 4
#define PP_EVIDENCE_MAX_RESIDUAL 0.02

/* The scale's fit quality: residual against the range its ticks cover, times how many
 * ticks there are. */
static double scale_fit_score(const pp_scale *s) {
  guint n = s->ticks ? s->ticks->len : 0;
  if (n < 2)
    return 0;
  double lo = INFINITY, hi = -INFINITY;
  for (guint i = 0; i < n; i++) {
    double v = g_array_index(s->ticks, pp_tick, i).value;
    if (s->kind == PP_SCALE_LOG)
      v = v > 0 ? log10(v) : 0;
    lo = fmin(lo, v), hi = fmax(hi, v);
  }
  double rel = hi > lo ? s->rms_residual / (hi - lo) : 1;
  double fit = 1 - fmin(1, rel / PP_EVIDENCE_MAX_RESIDUAL);
  double ticks = fmin(1, (double)(n - 1) / (PP_EVIDENCE_FULL_TICKS - 1));
  return PP_EVIDENCE_SCALE_WEIGHT * fit * ticks;
}

/* The bars by their near edge across each orientation's axis (w0 of pp_frame_of), so that an
 * axis finds the bars within its reach across by binary search instead of a pass over every
 * bar: a page of tiles has a fitted axis for every row and column of them. A bar whose w0 is
 * not finite or lies beyond its w1, which a range of w0 cannot answer for, is NaN there and
 * so tried for every axis. Built on first use. */
typedef struct {
  pp_coord_index *w0[2]; /* [0: vertical axes, 1: horizontal] */
  GArray *hits;          /* guint: scratch */
} across_index;

static void across_index_build(across_index *x, GArray *bars) {
  g_autofree double *v = g_new(double, MAX(bars->len, 1));
  for (int o = 0; o < 2; o++) {
    for (guint i = 0; i < bars->len; i++) {
      pp_frame_rect f = pp_frame_of(g_array_index(bars, pp_bar_candidate, i).rect, o == 0);
      v[i] = isfinite(f.w0) && f.w0 <= f.w1 ? f.w0 : NAN;
    }
    x->w0[o] = pp_coord_index_new(v, bars->len);
  }
  x->hits = g_array_new(FALSE, FALSE, sizeof(guint));
}

static void across_index_clear(across_index *x) {
  if (!x->hits)
    return;
  for (int o = 0; o < 2; o++)
    pp_coord_index_free(x->w0[o]);
  g_array_unref(x->hits);
}

/* The free bars across the axis between lo and hi and within its reach along, in page
 * order. A bar there has lo <= w0 <= w1 <= hi, so the index's range of w0 holds it. */
static GArray *select_bars(const pp_recognize_ctx *ctx, across_index *x,
                           const pp_axis_candidate *axis, double lo, double hi) {
  gboolean vertical = axis->scale->vertical;
  GArray *sel = g_array_new(FALSE, FALSE, sizeof(guint));
  GArray *hits = NULL;
  if (!isnan(lo) && !isnan(hi)) { /* a NaN bound passes every bar */
    if (!x->hits)
      across_index_build(x, ctx->bars);
    hits = x->hits;
    pp_coord_index_within(x->w0[vertical ? 0 : 1], lo, hi, hits);
  }
  guint n = hits ? hits->len : ctx->bars->len;
  for (guint k = 0; k < n; k++) {
    guint i = hits ? g_array_index(hits, guint, k) : k;
    pp_bar_candidate *b = &g_array_index(ctx->bars, pp_bar_candidate, i);
    if (!pp_claims_mark_free(ctx->claims, b->mark))
      continue;
    pp_frame_rect f = pp_frame_of(b->rect, vertical);
    if (f.w0 < lo || f.w1 > hi || !pp_within_reach(axis, f.u0, f.u1, 0, PP_BARS_MIN_REACH))
      continue;
    g_array_append_val(sel, i);
  }
  return sel;
}

static pp_frame_rect sel_rect(GArray *bars, GArray *sel, guint i, gboolean vertical) {
  return pp_frame_of(g_array_index(bars, pp_bar_candidate, g_array_index(sel, guint, i)).rect,
                     vertical);
}

/* How many selected bars stand on the edge coordinate c: those touching it and those
 * stacked in their columns. Legend keys and stray boxes touching c by chance add
 * little; the true baseline carries whole stacks. */
static guint support_of(GArray *bars, GArray *sel, double c, gboolean vertical) {
  guint supported = 0;
  for (guint i = 0; i < sel->len; i++) {
    pp_frame_rect fi = sel_rect(bars, sel, i, vertical);
    for (guint j = 0; j < sel->len; j++) {
      pp_frame_rect fj = sel_rect(bars, sel, j, vertical);
      if (pp_on_edge(fj.u0, fj.u1, c) && pp_same_column(fi, fj)) {
        supported++;
        break;
      }
    }
  }
  return supported;
}

/* The baseline: among the edge coordinates most bars touch, the one that carries the
 * most bars with their stacks; ties go to the one nearest value 0. It must carry at
 * least half of the selection: two bars touching end to end do not make a chart. */
static gboolean find_baseline(GArray *bars, GArray *sel, const pp_scale *scale, double *base) {
  gboolean vertical = scale->vertical;
  double cand[PP_BASELINE_TRIALS];
  guint touches[PP_BASELINE_TRIALS], n_cand = 0;
  for (guint i = 0; i < sel->len; i++) {
    pp_frame_rect fi = sel_rect(bars, sel, i, vertical);
    double edges[2] = {fi.u0, fi.u1};
    for (int e = 0; e < 2; e++) {
      gboolean seen = FALSE;
      for (guint k = 0; k < n_cand && !seen; k++)
        seen = pp_same_edge(cand[k], edges[e]);
      if (seen)
        continue;
      guint count = 0;
      for (guint j = 0; j < sel->len; j++) {
        pp_frame_rect fj = sel_rect(bars, sel, j, vertical);
        count += pp_on_edge(fj.u0, fj.u1, edges[e]);
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
    double v = fabs(pp_scale_value_at(scale, cand[k]));
    if (support > best_support || (support == best_support && v < best_abs)) {
      best_support = support;
      best_abs = v;
      *base = cand[k];
    }
  }
  return best_support >= 2 && best_support * 2 >= sel->len;
}

/* Bars of one chart stand side by side across the axis (stacks are merged already);
 * two that overlap across it are neighbours in another direction, e.g. the touching
 * bars of a histogram read against the wrong axis. */
static gboolean overlapping(const pp_figure *fig) {
  gboolean vertical = fig->kind == PP_FIGURE_COLUMN;
  for (guint i = 0; i < fig->elements->len; i++)
    for (guint j = i + 1; j < fig->elements->len; j++) {
      pp_frame_rect a = pp_frame_of(g_array_index(fig->elements, pp_element, i).box, vertical);
      pp_frame_rect b = pp_frame_of(g_array_index(fig->elements, pp_element, j).box, vertical);
      double common = fmin(a.w1, b.w1) - fmax(a.w0, b.w0);
      if (common > PP_BARS_MAX_OVERLAP * fmin(a.w1 - a.w0, b.w1 - b.w0))
        return TRUE;
    }
  return FALSE;
}

static gboolean too_short(const pp_figure *fig, const pp_axis_candidate *axis) {
  double longest = 0;
  for (guint i = 0; i < fig->elements->len; i++)
    longest = fmax(longest, g_array_index(fig->elements, pp_element, i).extent);
  return longest < PP_BARS_MIN_LONGEST * (axis->span1 - axis->span0);
}

/* The bar figure on one side of an axis (+1: towards larger x, or y for a horizontal
 * axis), or NULL. Claims inside the caller's transaction. */
static pp_figure *build_on_axis(pp_recognize_ctx *ctx, across_index *x,
                                const pp_axis_candidate *axis, int side) {
  double lo, hi, base;
  pp_axis_reach(axis, ctx->axes, side, &lo, &hi);
  GArray *sel = select_bars(ctx, x, axis, lo, hi);
  g_debug("  side %d: %u bars between %.1f and %.1f", side, sel->len, lo, hi);
  pp_figure *fig = NULL;
  if (sel->len >= 2 && find_baseline(ctx->bars, sel, axis->scale, &base)) {
    fig = pp_bars_build(ctx, sel, axis->scale, axis->scale->vertical, base, OWNER);
    gboolean legend = pp_bars_legend_like(ctx, fig), overlap = overlapping(fig);
    g_debug("  baseline %.2f: %u elements, legend %d, overlapping %d", base, fig->elements->len,
            legend, overlap);
    if (fig->elements->len < 2 || legend || overlap || too_short(fig, axis))
      g_clear_pointer(&fig, pp_figure_free);
  }
  g_array_unref(sel);
  if (fig) {
    pp_figure_add_evidence(fig, "scale-fits", scale_fit_score(axis->scale));
    pp_bars_weigh_layout(fig);
  }
  return fig;
}

/* First every axis on the side its labels face, then the ones still free on the other
 * side: with two value axes, the bars go to the axis that faces them. */
void pp_recognize_bars(pp_recognize_ctx *ctx) {
  across_index x = {{NULL, NULL}, NULL};
  for (int pass = 0; pass < 2; pass++)
    for (guint i = 0; i < ctx->axes->len; i++) {
      const pp_axis_candidate *c = g_ptr_array_index(ctx->axes, i);
      if (c->fit_failed || pp_axis_taken(ctx, c))
        continue;
      int side = c->side ? (pass ? -c->side : c->side) : (pass ? +1 : -1);
      pp_claims_begin(ctx->claims);
      /* The axis' own labels must not be taken for data labels while its bars are read. */
      pp_axis_claim_labels(ctx, c);
      pp_figure *f = build_on_axis(ctx, &x, c, side);
      g_debug("axis %s %u labels side %d: %s", c->scale->vertical ? "vertical" : "horizontal",
              c->labels->len, side, f ? pp_figure_kind_name(f->kind) : "no bars");
      if (!f) {
        pp_claims_rollback(ctx->claims);
        continue;
      }
      pp_claims_commit(ctx->claims);
      pp_figure_finish(ctx, f, c);
    }
  across_index_clear(&x);
}
