/* rule_bars_on_log.c — bars on a logarithmic value scale. A bar's length there encodes
 * log(v) − log(scale start), so its ink can never be proportional to v; the measures
 * compare the ink with the scale readings at the tips. */
#include "internal.h"

gboolean pp_rule_bars_on_log_measure(const pp_figure *fig, const pp_thresholds *t, pp_finding *f) {
  (void)t;
  if (!fig->scale || fig->scale->kind != PP_SCALE_LOG)
    return FALSE;
  pp_rule_measure_elements(fig, f, PP_JUDGE_VALUE, FALSE, pp_rule_baseline(fig, FALSE));
  return TRUE;
}

char *pp_rule_bars_on_log_sentence(const pp_figure *fig, const pp_finding *f,
                                   const pp_thresholds *t) {
  char *lo = pp_format_value(fig->scale->min_value), *hi = pp_format_value(fig->scale->max_value);
  char *lead = g_strdup_printf(
      "bars on a logarithmic axis (%s to %s), so length cannot follow value", lo, hi);
  g_free(lo), g_free(hi);
  return pp_rule_sentence(f, t, lead, "bar");
}
