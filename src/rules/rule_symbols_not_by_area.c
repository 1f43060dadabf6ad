/* rule_symbols_not_by_area.c — bubbles and scaled symbols. Area proportional to value is
 * the honest scaling; a radius or a side proportional to value squares the ratios. The
 * exponent of area against value is fitted by least squares on logs over every symbol
 * (Stevens' power law for perceived area is the context: readers underestimate area
 * ratios, which does not license inflating them). */
#include <math.h>

#include "geometry/geometry.h"
#include "internal.h"

gboolean pp_rule_symbols_not_by_area_measure(const pp_figure *fig, const pp_thresholds *t,
                                             pp_finding *f) {
  (void)t;
  guint n = fig->elements->len;
  g_autofree double *v = g_new0(double, MAX(n, 1));
  g_autofree double *g = g_new0(double, MAX(n, 1));
  for (guint i = 0; i < n; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    pp_finding_element fe = {e->value, e->ink, e->box, g_strdup(e->category),
                             g_strdup(e->label_text)};
    g_array_append_val(f->elements, fe);
    v[i] = e->value, g[i] = e->ink;
  }
  guint lo, hi;
  pp_power_fit fit;
  if (!pp_measures_extremes(v, g, n, &lo, &hi) || !pp_power_fit_compute(v, g, n, &fit))
    return FALSE;
  pp_measures_between(v, g, n, lo, hi, &f->measures);
  f->measures.baseline_value = NAN;
  pp_measures_add_extra(&f->measures, "size_exponent", fit.exponent);
  pp_measures_add_extra(&f->measures, "size_r2", fit.r2);
  return TRUE;
}

char *pp_rule_symbols_not_by_area_sentence(const pp_figure *fig, const pp_finding *f,
                                           const pp_thresholds *t) {
  (void)fig;
  double k = f->measures.extra[0].value, r2 = f->measures.extra[1].value;
  const char *what = fabs(k - 2) < 0.15 ? "as if scaled by radius or side, not area"
                     : k > 1            ? "faster than their values"
                                        : "slower than their values";
  char *lead = g_strdup_printf("symbol areas grow as value^%.2f (fit R² %.3f), %s", k, r2, what);
  return pp_rule_sentence(f, t, lead, "symbol");
}
