/* shape_measures.c — measures the shape rules share: the Lie Factor and the ink growth
 * ratio between the largest and the smallest value (3D bars, bubbles) or two chosen
 * elements (pyramid slices), and the worst pair, from values and inks. Tufte (1983), p. 57. */
#include <math.h>

#include "internal.h"

void pp_measures_between(const double *v, const double *g, guint n, guint a, guint b,
                         pp_measures *m) {
  m->lie_factor = m->growth_ratio = m->gdi = m->max_pair_departure = m->distortion = NAN;
  m->baseline_value = 0;
  m->first = a, m->last = b, m->pair_i = b, m->pair_j = a;
  if (a >= n || b >= n || a == b)
    return;
  m->growth_ratio = pp_ink_growth_ratio(v[a], v[b], g[a], g[b]);
  m->lie_factor = pp_lie_factor(v[a], v[b], g[a], g[b]);
  m->gdi = pp_gdi(v[a], v[b], g[a], g[b]);
  double worst = NAN;
  for (guint i = 0; i < n; i++)
    for (guint j = 0; j < n; j++) {
      if (i == j || !(v[i] > 0) || !(v[j] > 0) || !(g[i] > 0) || !(g[j] > 0))
        continue;
      double d = (g[i] / g[j]) / (v[i] / v[j]);
      if (isnan(worst) || d > worst)
        worst = d, m->pair_i = i, m->pair_j = j;
    }
  m->max_pair_departure = worst;
  m->distortion = pp_measures_distortion(m);
}

gboolean pp_measures_extremes(const double *v, const double *g, guint n, guint *lo, guint *hi) {
  gint a = -1, b = -1;
  for (guint i = 0; i < n; i++) {
    if (!(v[i] > 0) || !(g[i] > 0) || !isfinite(v[i]))
      continue;
    if (a < 0 || v[i] < v[a])
      a = (gint)i;
    if (b < 0 || v[i] > v[b])
      b = (gint)i;
  }
  if (a < 0 || b < 0 || v[a] == v[b])
    return FALSE;
  *lo = (guint)a, *hi = (guint)b;
  return TRUE;
}

void pp_measures_add_extra(pp_measures *m, const char *name, double value) {
  if (m->n_extra >= PP_MEASURES_MAX_EXTRA)
    return;
  m->extra[m->n_extra].name = name;
  m->extra[m->n_extra].value = value;
  m->n_extra++;
}
