/* rule_radial_ring_ink.c — radial bars: a ring's ink for the same sweep grows with its
 * radius ((R² − r²)θ/2, so rings of equal width take ink in proportion to their mid
 * radius). The measures compare the outermost ring with the innermost one: (ink_out /
 * ink_in) / (value_out / value_in) is the outer ring's ink per unit of value over the
 * inner one's. */
#include <math.h>

#include "internal.h"

gboolean pp_rule_radial_ring_ink_measure(const pp_figure *fig, const pp_thresholds *t,
                                         pp_finding *f) {
  (void)t;
  if (fig->elements->len < 2)
    return FALSE;
  /* Elements run from the innermost ring to the outermost (radial.c). */
  pp_rule_measure_elements(fig, f, PP_JUDGE_VALUE, FALSE, 0);
  return isfinite(f->measures.growth_ratio);
}

char *pp_rule_radial_ring_ink_sentence(const pp_figure *fig, const pp_finding *f,
                                       const pp_thresholds *t) {
  (void)fig;
  (void)t;
  return g_strdup_printf("radial bars: the outer ring takes %.2f× the ink per unit of value of "
                         "the inner ring (ink growth ratio %.2f, worst pair %.2f)",
                         f->measures.growth_ratio, f->measures.growth_ratio,
                         f->measures.max_pair_departure);
}
