/* rule_bars_off_zero.c — bars on a linear value scale whose drawn baseline is not the
 * value 0: their lengths, hence their ink, are no longer proportional to their values. */
#include <math.h>

#include "internal.h"

gboolean pp_rule_bars_off_zero_measure(const pp_figure *fig, const pp_thresholds *t,
                                       pp_finding *f) {
  (void)t;
  if (!fig->scale || fig->scale->kind != PP_SCALE_LINEAR)
    return FALSE;
  double base = pp_rule_baseline(fig, FALSE);
  if (!isfinite(base) || pp_rule_baseline_is_zero(fig, base))
    return FALSE;
  pp_rule_measure_elements(fig, f, PP_JUDGE_VALUE, FALSE, base);
  return TRUE;
}

char *pp_rule_bars_off_zero_sentence(const pp_figure *fig, const pp_finding *f,
                                     const pp_thresholds *t) {
  char *b = pp_rule_printed_value(fig, f->measures.baseline_value);
  char *lead = g_strdup_printf("bars start at %s, not 0", b);
  g_free(b);
  return pp_rule_sentence(f, t, lead, "bar");
}
