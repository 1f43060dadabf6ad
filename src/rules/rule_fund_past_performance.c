/* rule_fund_past_performance.c — the checks of a UCITS key investor information document's
 * past-performance bar chart (Commission Regulation (EU) No 583/2010, Annex III; Article 15
 * from memory). Opt-in rules: they run only under a profile that enables them, each failed
 * check is its own finding, and the sentence names the point of the Regulation it reads. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "internal.h"

#define REG "Regulation (EU) No 583/2010"

/* Share of the elements whose category must be a year for the chart to be a yearly one:
 * a legend word or a stray label may take one of ten (common practice, no source). */
#define PP_FUND_YEAR_SHARE 0.8
/* Article 15 (from memory): the chart covers the last 10 years at most. */
#define PP_FUND_MAX_YEARS 10
/* How exactly a bar can be measured: a quarter of a point of drawing (anti-aliasing and
 * stroke seams are finer than that in PDF producers; common practice, no source). */
#define PP_FUND_DRAWING_PT 0.25
/* The bars compress when, together with 0%, they span less than this share of the axis's
 * visible range: a third leaves two thirds of the plot empty (common practice, no source;
 * plotting software's automatic limits leave a tenth or less). */
#define PP_FUND_MIN_SPAN_SHARE (1.0 / 3.0)
/* A year gap is shown when the slot it leaves is at least half a step wider than the
 * usual step between years (common practice, no source). */
#define PP_FUND_GAP_SLACK 0.5

static int year_of(const char *category) {
  if (!category || strlen(category) != 4)
    return 0;
  for (int i = 0; i < 4; i++)
    if (category[i] < '0' || category[i] > '9')
      return 0;
  int y = atoi(category);
  return y >= 1900 && y <= 2199 ? y : 0;
}

static gboolean has_percent(const pp_figure *fig) {
  for (guint i = 0; fig->scale && i < fig->scale->ticks->len; i++) {
    const pp_tick *tk = &g_array_index(fig->scale->ticks, pp_tick, i);
    if (tk->label && strchr(tk->label, '%'))
      return TRUE;
  }
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    if (e->label_text && strchr(e->label_text, '%'))
      return TRUE;
  }
  return FALSE;
}

/* A past-performance chart: columns whose categories are years, with percentages (on the
 * axis or the labels) or a title that says so. */
static gboolean is_past_performance(const pp_figure *fig) {
  if (fig->kind != PP_FIGURE_COLUMN || fig->elements->len < 2)
    return FALSE;
  guint n_years = 0;
  for (guint i = 0; i < fig->elements->len; i++)
    n_years += year_of(g_array_index(fig->elements, pp_element, i).category) != 0;
  if (n_years < 2 || n_years < PP_FUND_YEAR_SHARE * fig->elements->len)
    return FALSE;
  char *title = fig->title ? g_ascii_strdown(fig->title, -1) : NULL;
  gboolean titled = title && strstr(title, "past performance");
  g_free(title);
  return titled || has_percent(fig);
}

static const pp_element *element(const pp_figure *fig, guint i) {
  return &g_array_index(fig->elements, pp_element, i);
}

static const char *name(const pp_element *e) {
  return e->category ? e->category : "one";
}

/* Half a unit of the label's last printed digit. */
static double half_unit(const pp_element *e) {
  return 0.5 * pow(10, -pp_label_decimals(e->label_text));
}

/* A bar cut by the plot frame: its far end sits on the edge of the visible value range
 * and its label (if any) lies beyond that range. */
static gboolean clipped(const pp_figure *fig, const pp_element *e) {
  if (!fig->scale || !isfinite(e->scale_value))
    return FALSE;
  double span = fig->scale->max_value - fig->scale->min_value;
  double tol = fabs(fig->scale->slope) * PP_FUND_DRAWING_PT + 1e-9;
  gboolean at_lo = fabs(e->scale_value - fig->scale->min_value) <= tol;
  gboolean at_hi = fabs(e->scale_value - fig->scale->max_value) <= tol;
  if (!(at_lo || at_hi) || span <= 0)
    return FALSE;
  if (isnan(e->label_value))
    return TRUE;
  return at_lo ? e->label_value < fig->scale->min_value - half_unit(e)
               : e->label_value > fig->scale->max_value + half_unit(e);
}

/* ---- The checks: NULL when the chart passes, else the reviewer's sentence. ---------- */

static char *check_log_axis(const pp_figure *fig) {
  if (!fig->scale || fig->scale->kind != PP_SCALE_LOG)
    return NULL;
  return g_strdup("past-performance bars on a logarithmic value axis; the Y-axis must be "
                  "linear (" REG ", Annex III point 1)");
}

static char *check_axis_off_zero(const pp_figure *fig) {
  if (!fig->scale || fig->scale->kind != PP_SCALE_LINEAR)
    return NULL;
  double base = pp_rule_baseline(fig, FALSE);
  if (!isfinite(base) || pp_rule_baseline_is_zero(fig, base))
    return NULL;
  char *b = pp_format_value(base);
  char *s = g_strdup_printf("past-performance bars rise from %s%%, not from 0%%; the X-axis must "
                            "be set at the 0%% level (" REG ", Annex III point 3)",
                            b);
  g_free(b);
  return s;
}

static char *check_label_missing(const pp_figure *fig) {
  GString *which = g_string_new(NULL);
  guint n = 0;
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = element(fig, i);
    if (!isnan(e->label_value))
      continue;
    if (n++ < 3)
      g_string_append_printf(which, "%s%s (series %u)", which->len ? ", " : "", name(e),
                             e->series + 1);
  }
  if (!n)
    return g_string_free(which, TRUE), NULL;
  char *s =
      g_strdup_printf("%u past-performance bar%s no printed return: %s%s; each bar "
                      "must be labelled with its return in percent (" REG ", Annex III point 4)",
                      n, n == 1 ? " carries" : "s carry", which->str, n > 3 ? ", ..." : "");
  g_string_free(which, TRUE);
  return s;
}

static char *check_label_decimals(const pp_figure *fig) {
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = element(fig, i);
    if (!e->label_text || isnan(e->label_value))
      continue;
    int d = pp_label_decimals(e->label_text);
    if (d != 1)
      return g_strdup_printf("the %s label \"%s\" has %d decimal%s; past-performance figures "
                             "must be rounded to one decimal place (" REG ", Annex III point 5)",
                             name(e), e->label_text, d, d == 1 ? "" : "s");
  }
  return NULL;
}

static char *check_bar_clipped(const pp_figure *fig) {
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = element(fig, i);
    if (!clipped(fig, e))
      continue;
    char *edge = pp_format_value(e->scale_value);
    char *s = g_strdup_printf(
        "the %s bar (%s) is cut by the plot frame at %s%%, so the chart hides part of that "
        "return; the scale must be adapted to the span of the bars (" REG ", Annex III point 2)",
        name(e), e->label_text ? e->label_text : "no label", edge);
    g_free(edge);
    return s;
  }
  return NULL;
}

static char *check_scale_compressed(const pp_figure *fig) {
  if (!fig->scale || fig->scale->kind != PP_SCALE_LINEAR)
    return NULL;
  double lo = 0, hi = 0, range = fig->scale->max_value - fig->scale->min_value;
  for (guint i = 0; i < fig->elements->len; i++) {
    double v = element(fig, i)->scale_value;
    if (isfinite(v))
      lo = fmin(lo, v), hi = fmax(hi, v);
  }
  if (!(range > 0) || hi - lo >= PP_FUND_MIN_SPAN_SHARE * range)
    return NULL;
  char *a = pp_format_value(fig->scale->min_value), *b = pp_format_value(fig->scale->max_value);
  char *c = pp_format_value(lo), *d = pp_format_value(hi);
  char *s = g_strdup_printf("the bars span %s%% to %s%% on an axis from %s%% to %s%%, %.0f%% of "
                            "its height; the scale must not compress the bars so as to make "
                            "fluctuations harder to distinguish (" REG ", Annex III point 2)",
                            c, d, a, b, 100 * (hi - lo) / range);
  g_free(a), g_free(b), g_free(c), g_free(d);
  return s;
}

static char *check_label_vs_bar(const pp_figure *fig) {
  if (!fig->scale || fig->scale->kind != PP_SCALE_LINEAR)
    return NULL;
  /* Rounding of the label, plus how well the scale and the drawing can be read. */
  double reading = fmax(2 * fig->scale->rms_residual, fabs(fig->scale->slope) * PP_FUND_DRAWING_PT);
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = element(fig, i);
    if (isnan(e->label_value) || !isfinite(e->scale_value) || clipped(fig, e))
      continue;
    if (fabs(e->label_value - e->scale_value) <= half_unit(e) + reading)
      continue;
    char *drawn = pp_format_value(e->scale_value);
    char *s = g_strdup_printf("the %s bar is drawn at %s%% but labelled \"%s\"; each bar's label "
                              "must state the return it shows (" REG ", Annex III point 4)",
                              name(e), drawn, e->label_text ? e->label_text : "?");
    g_free(drawn);
    return s;
  }
  return NULL;
}

static int compare_ints(const void *a, const void *b) {
  return *(const int *)a - *(const int *)b;
}

static int compare_doubles(const void *a, const void *b) {
  double x = *(const double *)a, y = *(const double *)b;
  return (x > y) - (x < y);
}

static char *check_years(const pp_figure *fig) {
  /* Each year's centre along the category axis (fund and benchmark bars share a year). */
  int years[64];
  double sum[64] = {0}, cnt[64] = {0};
  guint n = 0;
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = element(fig, i);
    int y = year_of(e->category);
    if (!y)
      continue;
    guint k = 0;
    while (k < n && years[k] != y)
      k++;
    if (k == n) {
      if (n == G_N_ELEMENTS(years))
        continue;
      years[n++] = y;
    }
    sum[k] += (e->box.x0 + e->box.x1) / 2;
    cnt[k] += 1;
  }
  if (n > PP_FUND_MAX_YEARS)
    return g_strdup_printf("the chart shows %u years; past performance is shown for the last %d "
                           "years (" REG ", Article 15, from memory)",
                           n, PP_FUND_MAX_YEARS);
  /* Years in order with their centres; the usual step is the median step of neighbours. */
  double centre[64];
  int order[64];
  for (guint k = 0; k < n; k++)
    order[k] = years[k];
  qsort(order, n, sizeof *order, compare_ints);
  for (guint k = 0; k < n; k++)
    for (guint j = 0; j < n; j++)
      if (years[j] == order[k])
        centre[k] = sum[j] / cnt[j];
  double steps[64];
  guint n_steps = 0;
  for (guint k = 1; k < n; k++)
    if (order[k] == order[k - 1] + 1)
      steps[n_steps++] = fabs(centre[k] - centre[k - 1]);
  if (!n_steps)
    return NULL;
  qsort(steps, n_steps, sizeof *steps, compare_doubles);
  double step = steps[n_steps / 2];
  for (guint k = 1; k < n; k++) {
    int missing = order[k] - order[k - 1] - 1;
    if (missing <= 0 || fabs(centre[k] - centre[k - 1]) >= (1 + missing - PP_FUND_GAP_SLACK) * step)
      continue;
    char *years_out = missing == 1
                          ? g_strdup_printf("%d is", order[k - 1] + 1)
                          : g_strdup_printf("%d to %d are", order[k - 1] + 1, order[k] - 1);
    char *s = g_strdup_printf("%s left out with no empty slot between %d and %d, so the years "
                              "read as consecutive; a year without data is shown as a gap "
                              "(" REG ", Article 15, from memory)",
                              years_out, order[k - 1], order[k]);
    g_free(years_out);
    return s;
  }
  return NULL;
}

typedef struct {
  const char *id;
  char *(*check)(const pp_figure *fig);
} fund_check;

/* The same ids as the entries of table.c. */
static const fund_check checks[] = {
    {"fund-log-axis", check_log_axis},           {"fund-axis-off-zero", check_axis_off_zero},
    {"fund-label-missing", check_label_missing}, {"fund-label-decimals", check_label_decimals},
    {"fund-bar-clipped", check_bar_clipped},     {"fund-scale-compressed", check_scale_compressed},
    {"fund-label-vs-bar", check_label_vs_bar},   {"fund-years", check_years},
};

static char *run_check(const pp_figure *fig, const char *rule) {
  if (!is_past_performance(fig))
    return NULL;
  for (guint i = 0; i < G_N_ELEMENTS(checks); i++)
    if (strcmp(checks[i].id, rule) == 0)
      return checks[i].check(fig);
  return NULL;
}

gboolean pp_rule_fund_measure(const pp_figure *fig, const pp_thresholds *t, pp_finding *f) {
  (void)t;
  char *s = run_check(fig, f->rule);
  if (!s)
    return FALSE;
  g_free(s);
  /* The ink against the printed returns where every bar has one, else the scale readings. */
  gboolean all_labelled = TRUE;
  for (guint i = 0; i < fig->elements->len; i++)
    all_labelled &= !isnan(element(fig, i)->label_value);
  pp_rule_measure_elements(fig, f, all_labelled ? PP_JUDGE_LABEL : PP_JUDGE_VALUE, FALSE,
                           pp_rule_baseline(fig, FALSE));
  return TRUE;
}

gboolean pp_rule_fund_major(const pp_measures *m, const pp_thresholds *t, pp_severity *severity) {
  (void)m, (void)t;
  *severity = PP_SEVERITY_MAJOR;
  return TRUE;
}

gboolean pp_rule_fund_minor(const pp_measures *m, const pp_thresholds *t, pp_severity *severity) {
  (void)m, (void)t;
  *severity = PP_SEVERITY_MINOR;
  return TRUE;
}

char *pp_rule_fund_sentence(const pp_figure *fig, const pp_finding *f, const pp_thresholds *t) {
  (void)t;
  char *s = run_check(fig, f->rule);
  return s ? s : g_strdup("past-performance check failed");
}
