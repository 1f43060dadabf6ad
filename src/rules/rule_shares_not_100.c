/* rule_shares_not_100.c — a pie whose printed percentages do not add up to 100 within the
 * rounding their decimals allow: n labels rounded to d decimals may be off by n·½·10^−d
 * points together, no more (each by at most half a unit of its last digit). */
#include <math.h>

#include "internal.h"

gboolean pp_rule_shares_not_100_measure(const pp_figure *fig, const pp_thresholds *t,
                                        pp_finding *f) {
  (void)t;
  guint n = fig->elements->len;
  double sum = 0, allowance = 0;
  for (guint i = 0; i < n; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    if (e->source != PP_VALUE_PERCENT_LABEL)
      return FALSE;
    sum += e->label_value;
    allowance += 0.5 * pow(10, -pp_label_decimals(e->label_text));
  }
  if (n < 2 || fabs(sum - 100) <= allowance + 1e-9)
    return FALSE;
  pp_rule_measure_elements(fig, f, PP_JUDGE_LABEL, FALSE, NAN);
  pp_measures *m = &f->measures;
  /* The labels claim a whole of sum% of the pie: that over the 100% drawn. */
  m->growth_ratio = sum / 100;
  m->lie_factor = m->gdi = m->max_pair_departure = NAN;
  m->first = 0;
  m->last = n - 1;
  return TRUE;
}

/* Any excess beyond rounding is a finding, graded on the one severity scale by how far
 * the claimed whole departs from 100% (severe when the labels claim twice or half). */
gboolean pp_rule_shares_not_100_severity(const pp_measures *m, const pp_thresholds *t,
                                         pp_severity *severity) {
  double d = pp_measures_distortion(m);
  if (!isfinite(d))
    return FALSE;
  *severity = pp_rule_severity_of(d, t);
  return TRUE;
}

char *pp_rule_shares_not_100_sentence(const pp_figure *fig, const pp_finding *f,
                                      const pp_thresholds *t) {
  (void)t;
  double allowance = 0;
  int decimals = 0;
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    decimals = MAX(decimals, pp_label_decimals(e->label_text));
    allowance += 0.5 * pow(10, -pp_label_decimals(e->label_text));
  }
  return g_strdup_printf("the printed percentages of the %u slices add up to %.*f%%, not 100%% "
                         "(rounding allows at most ±%.*f points)",
                         fig->elements->len, decimals, 100 * f->measures.growth_ratio, decimals + 1,
                         allowance);
}
