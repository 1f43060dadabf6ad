/* rule_polar_radius.c — a polar-area chart whose sectors' radii, not areas, follow the
 * values: a sector's area grows with the square of its radius, so a value v2/v1 times
 * another takes (v2/v1)² times the ink. The measures compare the largest value with the
 * smallest. */
#include <math.h>

#include "internal.h"

gboolean pp_rule_polar_radius_measure(const pp_figure *fig, const pp_thresholds *t, pp_finding *f) {
  (void)t;
  guint n = fig->elements->len, lo = 0, hi = 0;
  for (guint i = 0; i < n; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    if (!(e->value > 0) || !(e->ink > 0))
      return FALSE;
    const pp_element *l = &g_array_index(fig->elements, pp_element, lo);
    const pp_element *h = &g_array_index(fig->elements, pp_element, hi);
    lo = e->value < l->value ? i : lo;
    hi = e->value > h->value ? i : hi;
  }
  if (n < 2 || lo == hi)
    return FALSE;
  pp_rule_measure_elements(fig, f, PP_JUDGE_VALUE, FALSE, 0);
  const pp_element *l = &g_array_index(fig->elements, pp_element, lo);
  const pp_element *h = &g_array_index(fig->elements, pp_element, hi);
  pp_measures *m = &f->measures;
  m->first = lo;
  m->last = hi;
  m->growth_ratio = pp_ink_growth_ratio(l->value, h->value, l->ink, h->ink);
  m->lie_factor = pp_lie_factor(l->value, h->value, l->ink, h->ink);
  m->gdi = pp_gdi(l->value, h->value, l->ink, h->ink);
  return TRUE;
}

char *pp_rule_polar_radius_sentence(const pp_figure *fig, const pp_finding *f,
                                    const pp_thresholds *t) {
  (void)t;
  const pp_element *l = &g_array_index(fig->elements, pp_element, f->measures.first);
  const pp_element *h = &g_array_index(fig->elements, pp_element, f->measures.last);
  return g_strdup_printf("polar-area sectors scaled by radius: the largest value is %.2f× the "
                         "smallest but takes %.2f× its ink (Lie Factor %.2f)",
                         h->value / l->value, h->ink / l->ink, f->measures.lie_factor);
}
