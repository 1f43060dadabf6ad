/* axis.c — value axes from aligned numeric labels. A column of labels sharing an edge
 * (vertical axis) or a row sharing a baseline (horizontal axis) is snapped to its tick
 * marks or gridlines, then value = a + b·position is fitted by least squares; a log axis
 * is one where log10(value) fits and value does not. */
#include <math.h>
#include <string.h>

#include "internal.h"

/* Relative to the value span: more than this and the labels are not a scale. A tick
 * label centred by eye is within a few percent of its tick (common practice, no source). */
#define PP_AXIS_MAX_RESIDUAL 0.02
/* A segment is horizontal (vertical) when its other coordinate moves less than this, pt
 * (common practice, no source)... */
#define PP_STRAIGHT_TOL 0.01
/* ...and a tick or gridline when longer than this, pt: shorter strokes are glyph parts
 * (common practice, no source). */
#define PP_TICK_MIN_LEN 0.5
/* A label snaps to a segment within this share of its half-height (half-width for a
 * horizontal axis), and within this share of its text size for rotated labels (common
 * practice, no source)... */
#define PP_SNAP_HALF_SHARE 0.9
#define PP_SNAP_SIZE_SHARE 0.6
/* ...that starts within this of the label, pt: ticks stand next to their labels (common
 * practice, no source). */
#define PP_SNAP_REACH 30.0
/* Consecutive year labels step by at most this (decades on long series; common
 * practice, no source). */
#define PP_YEARS_MAX_STEP 10
/* Two labels further apart than this many text sizes are aligned by coincidence; ticks
 * sit a few text heights apart (common practice, no source). */
#define PP_PAIR_MAX_GAP 8
/* A run of labels splits where a gap exceeds this multiple of the median gap (two charts
 * stacked on one label edge), or is under this share of the text size (overprinted
 * labels; common practice, no source). */
#define PP_RUN_GAP_JUMP 2.6
#define PP_RUN_MIN_GAP 0.5
/* Labels of one axis: upright or a quarter turn within this, degrees (common practice,
 * no source)... */
#define PP_ANGLE_TOL 1.0
/* ...text sizes within this share of each other (tick labels share one font; common
 * practice, no source)... */
#define PP_SIZE_TOL 0.25
/* ...aligned edges (or baselines) within this, pt (common practice, no source). */
#define PP_ALIGN_TOL 1.5
/* An axis' reach starts this far inside its label edge, pt (common practice, no
 * source)... */
#define PP_REACH_EDGE_SLACK 1.0
/* ...and ends at another axis whose labels start beyond this clearance, pt, and whose
 * tick span overlaps within this, pt (common practice, no source). */
#define PP_REACH_CLEARANCE 2.0
#define PP_REACH_OVERLAP 20.0

typedef struct {
  double along;  /* position of the segment along the axis direction it marks */
  double lo, hi; /* extent across */
} tick_seg;

/* Straight segments of strokes that could be ticks or gridlines: horizontal ones
 * (marking positions on a vertical axis) and vertical ones. */
static void collect_segments(const pp_scene *scene, GArray *horiz, GArray *vert) {
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    pp_rect outline;
    /* Outlined rectangles are bar borders and frames, not ticks: their edges run
     * through tick labels' rows and would capture them. */
    if (m->kind != PP_MARK_STROKE || pp_path_is_rectangle(m->path, PP_RECT_TOL, &outline))
      continue;
    pp_point cur = {0, 0}, start = {0, 0};
    for (size_t k = 0; k < m->path->n_segs; k++) {
      const pp_seg *s = &m->path->segs[k];
      pp_point next;
      if (s->kind == PP_SEG_MOVE) {
        cur = start = s->pt[0];
        continue;
      } else if (s->kind == PP_SEG_LINE) {
        next = s->pt[0];
      } else if (s->kind == PP_SEG_CLOSE) {
        next = start;
      } else {
        cur = s->pt[2];
        continue;
      }
      double dx = next.x - cur.x, dy = next.y - cur.y;
      if (fabs(dy) < PP_STRAIGHT_TOL && fabs(dx) > PP_TICK_MIN_LEN) {
        tick_seg t = {cur.y, fmin(cur.x, next.x), fmax(cur.x, next.x)};
        g_array_append_val(horiz, t);
      } else if (fabs(dx) < PP_STRAIGHT_TOL && fabs(dy) > PP_TICK_MIN_LEN) {
        tick_seg t = {cur.x, fmin(cur.y, next.y), fmax(cur.y, next.y)};
        g_array_append_val(vert, t);
      }
      cur = next;
    }
  }
}

/* Position of the tick a label marks: the nearest segment across the label's centre
 * that starts within reach of the label; the label centre when none. With a finite
 * column, only segments whose end nearest the label is on that edge count. *near gets
 * that end of the segment chosen. */
static double snap(const pp_label *l, gboolean vertical, GArray *segs, double column,
                   gboolean *snapped, double *near) {
  double centre = vertical ? l->centre.y : l->centre.x;
  double half = vertical ? pp_rect_height(l->box) / 2 : pp_rect_width(l->box) / 2;
  double e0 = vertical ? l->box.x0 : l->box.y0, e1 = vertical ? l->box.x1 : l->box.y1;
  /* Rotated labels are long along the axis; the text size bounds the window then. */
  double best = centre, best_d = fmin(PP_SNAP_HALF_SHARE * half, PP_SNAP_SIZE_SHARE * l->size);
  double mid = (e0 + e1) / 2; /* font boxes are tall: only the label's middle counts */
  *snapped = FALSE;
  for (guint i = 0; i < segs->len; i++) {
    tick_seg *t = &g_array_index(segs, tick_seg, i);
    double d = fabs(t->along - centre);
    if (d >= best_d)
      continue;
    double reach = fmin(fabs(t->lo - e1), fabs(t->hi - e0));
    reach = fmin(reach, fmin(fabs(t->lo - e0), fabs(t->hi - e1)));
    if (reach > PP_SNAP_REACH || (t->lo < mid && t->hi > mid))
      continue; /* too far away, or running through the label */
    double end = fabs(t->lo - mid) < fabs(t->hi - mid) ? t->lo : t->hi;
    if (isfinite(column) && !pp_same_edge(end, column))
      continue;
    best = t->along;
    best_d = d;
    *snapped = TRUE;
    *near = end;
  }
  return best;
}

static int cmp_double(const void *a, const void *b) {
  double x = *(const double *)a, y = *(const double *)b;
  return (x > y) - (x < y);
}

/* Snaps every label of a run. The ticks (or gridlines) of one axis start on one drawn
 * edge, the axis line; a legend frame or another chart's edge that passes nearer a
 * label's centre does not. When two or more labels snapped, their median near end is
 * that edge, and each label is snapped again to segments starting there; a label with
 * none there keeps its first snap. ends is scratch space for n values. */
static guint snap_run(pp_label *const *run, guint n, gboolean vertical, GArray *segs, double *pos,
                      double *ends) {
  guint n_snapped = 0;
  for (guint i = 0; i < n; i++) {
    gboolean snapped;
    double end = NAN;
    pos[i] = snap(run[i], vertical, segs, NAN, &snapped, &end);
    if (snapped)
      ends[n_snapped++] = end;
  }
  if (n_snapped >= 2) {
    qsort(ends, n_snapped, sizeof(double), cmp_double);
    double column = ends[n_snapped / 2];
    for (guint i = 0; i < n; i++) {
      gboolean snapped;
      double end, p = snap(run[i], vertical, segs, column, &snapped, &end);
      if (snapped)
        pos[i] = p;
    }
  }
  return n_snapped;
}

static gboolean fit(const double *x, const double *y, guint n, double *a, double *b,
                    double *max_rel, double *rms) {
  double sx = 0, sy = 0, sxx = 0, sxy = 0;
  for (guint i = 0; i < n; i++)
    sx += x[i], sy += y[i], sxx += x[i] * x[i], sxy += x[i] * y[i];
  double den = n * sxx - sx * sx;
  if (n < 2 || fabs(den) < 1e-12)
    return FALSE;
  *b = (n * sxy - sx * sy) / den;
  *a = (sy - *b * sx) / n;
  double lo = y[0], hi = y[0], worst = 0, sq = 0;
  for (guint i = 0; i < n; i++) {
    double r = *a + *b * x[i] - y[i];
    lo = fmin(lo, y[i]), hi = fmax(hi, y[i]);
    worst = fmax(worst, fabs(r));
    sq += r * r;
  }
  *rms = sqrt(sq / n);
  if (hi - lo <= 0)
    return FALSE;
  *max_rel = worst / (hi - lo);
  return TRUE;
}

static int cmp_pos(gconstpointer a, gconstpointer b, gpointer vertical) {
  const pp_label *la = *(pp_label *const *)a, *lb = *(pp_label *const *)b;
  double pa = GPOINTER_TO_INT(vertical) ? la->centre.y : la->centre.x;
  double pb = GPOINTER_TO_INT(vertical) ? lb->centre.y : lb->centre.x;
  return (pa > pb) - (pa < pb);
}

static void candidate_free(gpointer p) {
  pp_axis_candidate *c = p;
  pp_scale_free(c->scale);
  g_free(c->reason);
  g_ptr_array_unref(c->labels);
  g_free(c);
}

/* One run of labels as it is fitted whole, trimmed and split: its readings, the gaps between
 * neighbours and the scratch space of one fit are laid out once, each try is a range of the
 * run, and a try that fails builds nothing (a long row of numbers that are no scale is tried
 * about as many times as it has labels). */
typedef struct {
  pp_label **labels; /* the run's, in axis order */
  gboolean vertical;
  GArray *segs;
  double edge;
  const pp_number_reading **readings;
  double *gaps; /* gaps[i]: from label i to label i + 1, along the axis */
  /* Under each reading convention c (what the series pick may choose), counts over the run:
   * rises[c][j] and falls[c][j] of the steps up and down between labels 0 .. j - 1, plain[c][j]
   * of the labels before j that do not read as a year. */
  guint *rises[2], *falls[2], *plain[2];
  /* scratch of the last judge(): index 0 is the first label of its range */
  pp_number *nums;
  gboolean *ok;
  double *pos, *val, *lval, *ends;
} run_fit;

/* What the fit of one range found. */
typedef struct {
  gboolean failed, category, log_scale;
  double a, b, rms;   /* the scale, when one fits */
  double rel, lrel;   /* worst residuals, for the reason of a failed fit */
  const char *reason; /* of a failure; NULL for the residual one */
} run_verdict;

/* The value and year reading of label k under convention c, as judge() reads them when the
 * pick is c. */
static double value_as(const run_fit *rf, guint k, int c, gboolean *year) {
  const pp_number_reading *r = rf->readings[k];
  const pp_number *num = r->ok[c] ? &r->as[c] : &rf->labels[k]->number;
  *year = num->year_like;
  return num->value;
}

static void run_counts_init(run_fit *rf, guint n) {
  for (int c = 0; c < 2; c++) {
    guint *rises = rf->rises[c] = g_new0(guint, n + 1),
          *falls = rf->falls[c] = g_new0(guint, n + 1);
    guint *plain = rf->plain[c] = g_new0(guint, n + 1);
    double prev = 0;
    for (guint k = 0; k < n; k++) {
      gboolean year;
      double v = value_as(rf, k, c, &year);
      plain[k + 1] = plain[k] + !year;
      rises[k + 1] = rises[k] + (k > 0 && v - prev > 0);
      falls[k + 1] = falls[k] + (k > 0 && v - prev < 0);
      prev = v;
    }
  }
}

/* Whether labels [lo, hi) surely fail, and not as years, whichever convention the pick takes:
 * under each, some step rises and another falls (so no step agrees in sign with all the
 * others: not monotonic) and some label is no year. What judge() would find, told from the
 * counts alone; FALSE says nothing. */
static gboolean surely_fails(const run_fit *rf, guint lo, guint hi) {
  if (hi - lo < 3)
    return FALSE;
  for (int c = 0; c < 2; c++) /* steps lo + 1 .. hi - 1 end at labels lo + 1 .. hi - 1 */
    if (rf->rises[c][hi] == rf->rises[c][lo + 1] || rf->falls[c][hi] == rf->falls[c][lo + 1] ||
        rf->plain[c][hi] == rf->plain[c][lo])
      return FALSE;
  return TRUE;
}

/* Fits labels [lo, hi) of the run into rf's scratch. With quick, a range that fails before
 * any fit (consecutive years, values not monotonic) is told without snapping or fitting;
 * the verdict's failed and category are the same either way. */
static void judge(run_fit *rf, guint lo, guint hi, gboolean quick, run_verdict *v) {
  guint n = hi - lo;
  pp_label **labels = rf->labels + lo;
  double *val = rf->val, *pos = rf->pos;
  *v = (run_verdict){.rel = INFINITY, .lrel = INFINITY};
  /* each label was read under both conventions when collected: only the pick is per range */
  pp_number_pick_series(rf->readings + lo, n, rf->nums, rf->ok);
  gboolean all_positive = TRUE;
  for (guint i = 0; i < n; i++) {
    /* Every label parsed on its own; the series reading wins where it exists. */
    val[i] = rf->ok[i] ? rf->nums[i].value : labels[i]->number.value;
    all_positive &= val[i] > 0;
  }
  /* Values must change monotonically with position for any scale. */
  gboolean mono = TRUE;
  for (guint i = 2; i < n; i++)
    mono &= (val[i] - val[i - 1]) * (val[1] - val[0]) > 0;
  if (n >= 2 && val[1] == val[0])
    mono = FALSE;
  /* 2019, 2020, 2021…: years name categories even though they fit a line. */
  gboolean years = n >= 2;
  for (guint i = 0; i < n && years; i++) {
    double step = i > 0 ? fabs(val[i] - val[i - 1]) : 1;
    years = (rf->ok[i] ? rf->nums[i].year_like : labels[i]->number.year_like) && step >= 1 &&
            step <= PP_YEARS_MAX_STEP && (i < 2 || fabs(step - fabs(val[1] - val[0])) < 1e-9);
  }
  v->failed = TRUE;
  v->category = years;
  if (quick && (years || n < 2 || !mono))
    return;
  guint n_snapped = snap_run(labels, n, rf->vertical, rf->segs, pos, rf->ends);
  double la, lb, lrms = 0;
  gboolean lin = fit(pos, val, n, &v->a, &v->b, &v->rel, &v->rms), lg = FALSE;
  if (all_positive && n >= 3) {
    for (guint i = 0; i < n; i++)
      rf->lval[i] = log10(val[i]);
    lg = fit(pos, rf->lval, n, &la, &lb, &v->lrel, &lrms);
  }
  if (years) {
    v->reason = "consecutive years: a category axis";
  } else if (n < 2) {
    v->reason = "fewer than two numeric tick labels";
  } else if (n == 2 && n_snapped < 2) {
    /* Two numbers in a column fit any line; only their tick marks make them a scale. */
    v->reason = "two labels without tick marks";
  } else if (!mono) {
    v->reason = "tick values do not change monotonically along the axis";
  } else if (lin && v->rel <= PP_AXIS_MAX_RESIDUAL) {
    v->failed = FALSE;
  } else if (lg && v->lrel <= PP_AXIS_MAX_RESIDUAL) {
    v->failed = FALSE;
    v->log_scale = TRUE;
    v->a = la, v->b = lb, v->rms = lrms;
  }
}

/* Fits labels [lo, hi) of the run; always returns a candidate (failed ones say why). */
static pp_axis_candidate *make_candidate(run_fit *rf, guint lo, guint hi) {
  guint n = hi - lo;
  run_verdict v;
  judge(rf, lo, hi, FALSE, &v);
  pp_axis_candidate *c = g_new0(pp_axis_candidate, 1);
  c->labels = g_ptr_array_sized_new(n);
  c->label_edge = rf->edge;
  pp_scale *axis = pp_scale_new(rf->vertical);
  c->scale = axis;
  g_array_set_size(axis->ticks, n); /* one tick a label, filled in order below */
  for (guint i = 0; i < n; i++) {
    pp_label *l = rf->labels[lo + i];
    g_array_index(axis->ticks, pp_tick, i) = (pp_tick){rf->pos[i], rf->val[i], g_strdup(l->text)};
    g_ptr_array_add(c->labels, l);
    axis->box = pp_rect_union(axis->box, l->box);
  }
  c->fit_failed = v.failed;
  c->category = v.category;
  if (v.failed) {
    c->reason = v.reason ? g_strdup(v.reason)
                         : g_strdup_printf("tick labels fit neither a linear nor a log scale "
                                           "(worst residual %.1f%% of the range)",
                                           100 * fmin(v.rel, v.lrel));
  } else {
    if (v.log_scale)
      axis->kind = PP_SCALE_LOG;
    axis->offset = v.a, axis->slope = v.b;
    axis->rms_residual = v.rms;
  }
  if (n > 0) {
    c->span0 = fmin(rf->pos[0], rf->pos[n - 1]);
    c->span1 = fmax(rf->pos[0], rf->pos[n - 1]);
    if (!c->fit_failed) {
      axis->min_value = pp_scale_value_at(axis, c->span0);
      axis->max_value = pp_scale_value_at(axis, c->span1);
      if (axis->min_value > axis->max_value) {
        double t = axis->min_value;
        axis->min_value = axis->max_value;
        axis->max_value = t;
      }
    }
  }
  return c;
}

/* Fits labels [lo, hi) of the run; when the fit fails, the range may be two axes stacked on
 * one label edge with a gap too small to split on: retry both sides of its widest gap. */
static void fit_range(run_fit *rf, guint lo, guint hi, GPtrArray *out) {
  guint n = hi - lo;
  if (n == 2) {
    /* Two labels far apart (an x-axis label above a category label of the chart below)
     * are a coincidence of alignment; ticks sit a few text heights apart (common
     * practice, no source). */
    const pp_label *a = rf->labels[lo], *b = rf->labels[lo + 1];
    if (fabs(rf->gaps[lo]) > PP_PAIR_MAX_GAP * fmax(a->size, b->size))
      return;
  }
  if (n < 4) { /* kept whatever its fit */
    g_ptr_array_add(out, make_candidate(rf, lo, hi));
    return;
  }
  run_verdict v = {.failed = TRUE};
  if (!surely_fails(rf, lo, hi))
    judge(rf, lo, hi, TRUE, &v);
  if (!v.failed) {
    g_ptr_array_add(out, make_candidate(rf, lo, hi));
    return;
  }
  /* An end label cut by the page edge ("100" for 1000) spoils an otherwise clean
   * scale: drop the first or the last label if the rest then fits. */
  for (int end = 0; end < 2 && !v.category; end++) {
    guint a = lo + (end ? 0 : 1), b = hi - (end ? 1 : 0);
    run_verdict r = {.failed = TRUE};
    if (!surely_fails(rf, a, b))
      judge(rf, a, b, TRUE, &r);
    if (!r.failed) {
      g_ptr_array_add(out, make_candidate(rf, a, b));
      return;
    }
  }
  /* the first widest gap that leaves two labels or more on each side */
  guint cut = 0;
  double widest = -1;
  for (guint i = 1; i + 2 < n; i++)
    if (rf->gaps[lo + i] > widest) {
      widest = rf->gaps[lo + i];
      cut = i + 1;
    }
  if (cut == 0) {
    g_ptr_array_add(out, make_candidate(rf, lo, hi));
    return;
  }
  fit_range(rf, lo, lo + cut, out);
  fit_range(rf, lo + cut, hi, out);
}

static void fit_or_split(GPtrArray *run, gboolean vertical, GArray *segs, double edge,
                         GPtrArray *out) {
  guint n = run->len;
  run_fit rf = {
      .labels = (pp_label **)run->pdata, .vertical = vertical, .segs = segs, .edge = edge};
  rf.readings = g_new(const pp_number_reading *, n);
  rf.gaps = g_new0(double, n);
  rf.nums = g_new0(pp_number, n);
  rf.ok = g_new0(gboolean, n);
  rf.pos = g_new(double, n), rf.val = g_new(double, n);
  rf.lval = g_new(double, n), rf.ends = g_new(double, n);
  for (guint i = 0; i < n; i++) {
    const pp_label *a = rf.labels[i];
    rf.readings[i] = &a->reading;
    if (i + 1 < n) {
      const pp_label *b = rf.labels[i + 1];
      rf.gaps[i] = vertical ? b->centre.y - a->centre.y : b->centre.x - a->centre.x;
    }
  }
  run_counts_init(&rf, n);
  fit_range(&rf, 0, n, out);
  for (int c = 0; c < 2; c++)
    g_free(rf.rises[c]), g_free(rf.falls[c]), g_free(rf.plain[c]);
  g_free(rf.readings), g_free(rf.gaps), g_free(rf.nums), g_free(rf.ok);
  g_free(rf.pos), g_free(rf.val), g_free(rf.lval), g_free(rf.ends);
}

/* Splits a sorted run where the spacing jumps (two charts stacked on one page
 * share a label edge) and keeps the pieces with two or more labels. */
static void split_runs(GPtrArray *sorted, gboolean vertical, GArray *segs, double edge,
                       GPtrArray *out) {
  guint n = sorted->len;
  if (n < 2)
    return;
  double *gaps = g_new(double, n - 1);
  for (guint i = 0; i + 1 < n; i++) {
    pp_label *a = g_ptr_array_index(sorted, i), *b = g_ptr_array_index(sorted, i + 1);
    gaps[i] = vertical ? b->centre.y - a->centre.y : b->centre.x - a->centre.x;
  }
  double *tmp = g_memdup2(gaps, (n - 1) * sizeof(double));
  for (guint i = 0; i + 1 < n - 1; i++) /* small n: insertion sort for the median */
    for (guint j = i + 1; j < n - 1; j++)
      if (tmp[j] < tmp[i]) {
        double t = tmp[i];
        tmp[i] = tmp[j];
        tmp[j] = t;
      }
  double median = tmp[(n - 1) / 2];
  g_free(tmp);
  GPtrArray *run = g_ptr_array_new();
  for (guint i = 0; i < n; i++) {
    pp_label *l = g_ptr_array_index(sorted, i);
    if (i > 0 &&
        (gaps[i - 1] > PP_RUN_GAP_JUMP * median || gaps[i - 1] < PP_RUN_MIN_GAP * l->size)) {
      if (run->len >= 2)
        fit_or_split(run, vertical, segs, edge, out);
      g_ptr_array_set_size(run, 0);
    }
    g_ptr_array_add(run, l);
  }
  if (run->len >= 2)
    fit_or_split(run, vertical, segs, edge, out);
  g_ptr_array_unref(run);
  g_free(gaps);
}

typedef double (*label_key)(const pp_label *l);
static double key_x1(const pp_label *l) {
  return l->box.x1;
}
static double key_x0(const pp_label *l) {
  return l->box.x0;
}
static double key_cy(const pp_label *l) {
  return l->centre.y;
}

/* Tick labels read horizontally; a vertical axis may also have them turned a quarter
 * (R's default, las = 0), which keeps them in one column. */
static gboolean reads_along(const pp_label *l, gboolean vertical) {
  return fabs(l->angle) <= PP_ANGLE_TOL || (vertical && fabs(fabs(l->angle) - 90) <= PP_ANGLE_TOL);
}

static gint cmp_by_key(gconstpointer a, gconstpointer b, gpointer keys) {
  guint i = *(const guint *)a, j = *(const guint *)b;
  double ki = ((const double *)keys)[i], kj = ((const double *)keys)[j];
  return ki < kj ? -1 : ki > kj ? 1 : (i > j) - (i < j);
}

static int cmp_index(const void *a, const void *b) {
  guint i = *(const guint *)a, j = *(const guint *)b;
  return (i > j) - (i < j);
}

/* The first of n positions of order (sorted by key) whose key is at least k. */
static guint lower_bound(const guint *order, guint n, const double *keys, double k) {
  guint lo = 0, hi = n;
  while (lo < hi) {
    guint mid = lo + (hi - lo) / 2;
    if (keys[order[mid]] < k)
      lo = mid + 1;
    else
      hi = mid;
  }
  return lo;
}

/* Groups labels whose key agrees within tol; each group of 2+ becomes runs. Groups are
 * formed in label order, each from its first free label. */
static void group_by(GPtrArray *labels, label_key key, double tol, gboolean vertical, GArray *segs,
                     GPtrArray *out, GHashTable *taken) {
  guint n = labels->len, m = 0;
  /* The labels this call may group, with their keys and sizes. A label taken during the call
   * belongs to a run of a group already made, so it is never looked at again: `taken` and the
   * reading direction are checked once here, not for every pair. */
  pp_label **eligible = g_new(pp_label *, MAX(n, 1));
  double *keys = g_new(double, MAX(n, 1)), *sizes = g_new(double, MAX(n, 1));
  for (guint i = 0; i < n; i++) {
    pp_label *l = g_ptr_array_index(labels, i);
    if (g_hash_table_contains(taken, l) || !reads_along(l, vertical))
      continue;
    eligible[m] = l;
    keys[m] = key(l);
    sizes[m] = l->size;
    m++;
  }
  /* Labels with a finite key in key order: a group's members are found among the few keys
   * near its first label's, not among all labels (a page of tiles has thousands). Labels
   * whose key is not finite match none. */
  guint *order = g_new(guint, MAX(m, 1)), n_order = 0, *members = g_new(guint, MAX(m, 1));
  for (guint i = 0; i < m; i++)
    if (isfinite(keys[i]))
      order[n_order++] = i;
  g_qsort_with_data(order, (gint)n_order, sizeof(guint), cmp_by_key, keys);
  gboolean *done = g_new0(gboolean, MAX(m, 1));
  GPtrArray *group = g_ptr_array_new();
  for (guint i = 0; i < m; i++) {
    if (done[i] || !isfinite(keys[i]))
      continue;
    /* twice the tolerance: every key within it of keys[i], whatever the rounding */
    guint k = lower_bound(order, n_order, keys, keys[i] - 2 * tol), n_members = 0;
    for (; k < n_order && keys[order[k]] <= keys[i] + 2 * tol; k++) {
      guint j = order[k];
      if (j >= i && !done[j] && fabs(keys[j] - keys[i]) <= tol &&
          fabs(sizes[j] - sizes[i]) <= PP_SIZE_TOL * sizes[i])
        members[n_members++] = j;
    }
    /* in label order, as the groups have always been */
    qsort(members, n_members, sizeof(guint), cmp_index);
    g_ptr_array_set_size(group, 0);
    for (guint q = 0; q < n_members; q++) {
      g_ptr_array_add(group, eligible[members[q]]);
      done[members[q]] = TRUE;
    }
    if (group->len >= 2) {
      g_ptr_array_sort_with_data(group, cmp_pos, GINT_TO_POINTER(vertical));
      guint before = out->len;
      split_runs(group, vertical, segs, keys[i], out);
      for (guint k = before; k < out->len; k++) {
        pp_axis_candidate *c = g_ptr_array_index(out, k);
        for (guint q = 0; q < c->labels->len; q++)
          g_hash_table_add(taken, g_ptr_array_index(c->labels, q));
      }
    }
  }
  g_ptr_array_unref(group);
  g_free(done);
  g_free(order);
  g_free(members);
  g_free(eligible);
  g_free(keys);
  g_free(sizes);
}

GPtrArray *pp_axes_find(const pp_scene *scene, GPtrArray *labels) {
  GArray *horiz = g_array_new(FALSE, FALSE, sizeof(tick_seg));
  GArray *vert = g_array_new(FALSE, FALSE, sizeof(tick_seg));
  collect_segments(scene, horiz, vert);
  GPtrArray *out = g_ptr_array_new_with_free_func(candidate_free);
  GHashTable *taken_v = g_hash_table_new(NULL, NULL);
  GHashTable *taken_h = g_hash_table_new(NULL, NULL);
  guint first_left;
  /* Vertical axes: right-aligned labels (axis on the left of the plot), then left-aligned. */
  group_by(labels, key_x1, PP_ALIGN_TOL, TRUE, horiz, out, taken_v);
  for (guint k = 0; k < out->len; k++)
    ((pp_axis_candidate *)g_ptr_array_index(out, k))->side = +1;
  first_left = out->len;
  group_by(labels, key_x0, PP_ALIGN_TOL, TRUE, horiz, out, taken_v);
  for (guint k = first_left; k < out->len; k++) {
    pp_axis_candidate *c = g_ptr_array_index(out, k);
    c->side = -1;
    c->label_edge = c->scale->box.x0;
  }
  for (guint k = 0; k < first_left; k++) {
    pp_axis_candidate *c = g_ptr_array_index(out, k);
    c->label_edge = c->scale->box.x1;
  }
  guint first_h = out->len;
  /* Horizontal axes: labels on one baseline row. */
  group_by(labels, key_cy, PP_ALIGN_TOL, FALSE, vert, out, taken_h);
  for (guint k = first_h; k < out->len; k++) {
    pp_axis_candidate *c = g_ptr_array_index(out, k);
    c->side = 0; /* decided by where the bars are */
    c->label_edge = (c->scale->box.y0 + c->scale->box.y1) / 2;
  }
  g_hash_table_unref(taken_v);
  g_hash_table_unref(taken_h);
  g_array_unref(horiz);
  g_array_unref(vert);
  return out;
}

/* The reach ends where another fitted axis of the same orientation, overlapping this
 * one along the axis, takes over. */
void pp_axis_reach(const pp_axis_candidate *axis, GPtrArray *all_axes, int side, double *lo,
                   double *hi) {
  gboolean vertical = axis->scale->vertical;
  pp_rect box = axis->scale->box;
  double edge = vertical ? (side > 0 ? box.x1 : box.x0) : (side > 0 ? box.y1 : box.y0);
  *lo = side > 0 ? edge - PP_REACH_EDGE_SLACK : -INFINITY;
  *hi = side > 0 ? INFINITY : edge + PP_REACH_EDGE_SLACK;
  for (guint i = 0; i < all_axes->len; i++) {
    const pp_axis_candidate *o = g_ptr_array_index(all_axes, i);
    if (o == axis || o->fit_failed || o->scale->vertical != vertical)
      continue;
    /* only axes whose span overlaps ours along u */
    if (o->span1 < axis->span0 - PP_REACH_OVERLAP || o->span0 > axis->span1 + PP_REACH_OVERLAP)
      continue;
    pp_rect ob = o->scale->box;
    double o_lo = vertical ? ob.x0 : ob.y0, o_hi = vertical ? ob.x1 : ob.y1;
    if (side > 0 && o_lo > edge + PP_REACH_CLEARANCE)
      *hi = fmin(*hi, o_lo);
    if (side < 0 && o_hi < edge - PP_REACH_CLEARANCE)
      *lo = fmax(*lo, o_hi);
  }
}
