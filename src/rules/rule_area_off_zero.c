/* rule_area_off_zero.c — a filled area whose flat floor is not the value 0. Areas lying
 * on another series are read as thicknesses; the floor is the first unstacked series'. */
#include <math.h>

#include "internal.h"

gboolean pp_rule_area_off_zero_measure(const pp_figure *fig, const pp_thresholds *t,
                                       pp_finding *f) {
  (void)t;
  if (!fig->scale || fig->scale->kind != PP_SCALE_LINEAR)
    return FALSE;
  double base = pp_rule_baseline(fig, TRUE);
  if (!isfinite(base) || pp_rule_baseline_is_zero(fig, base))
    return FALSE;
  /* Each series' own ends: an area is compared along itself, not with the next one. */
  pp_rule_measure_elements(fig, f, PP_JUDGE_VALUE, TRUE, base);
  return TRUE;
}

char *pp_rule_area_off_zero_sentence(const pp_figure *fig, const pp_finding *f,
                                     const pp_thresholds *t) {
  char *b = pp_rule_printed_value(fig, f->measures.baseline_value);
  char *lead = g_strdup_printf("the filled area stands on %s, not 0", b);
  g_free(b);
  return pp_rule_sentence(f, t, lead, "point");
}
