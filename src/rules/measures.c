/* measures.c — Tufte's Lie Factor (both definitions in use) and the Graph Discrepancy
 * Index, from the values the marks stand for and the ink they put on the page.
 * Sources: Tufte, The Visual Display of Quantitative Information (1983), p. 57;
 * Steinbart (1989), The Accounting Review 64(1), GDI = 100·(a/b − 1). */
#include <math.h>

#include "internal.h"

/* Growth-factor form: how many times the ink grows per time the value grows. */
double pp_ink_growth_ratio(double v1, double v2, double g1, double g2) {
  if (v1 == 0 || g1 == 0 || !isfinite(v1) || !isfinite(v2))
    return NAN;
  return (g2 / g1) / (v2 / v1);
}

/* Tufte's form: size of effect in the graphic over size of effect in the data,
 * each effect the relative change from the first to the second. */
double pp_lie_factor(double v1, double v2, double g1, double g2) {
  if (v1 == 0 || g1 == 0 || v2 == v1 || !isfinite(v1) || !isfinite(v2))
    return NAN;
  return ((g2 - g1) / g1) / ((v2 - v1) / v1);
}

/* a = percentage change shown in the graphic, b = percentage change in the data. */
double pp_gdi(double v1, double v2, double g1, double g2) {
  double lf = pp_lie_factor(v1, v2, g1, g2);
  return isnan(lf) ? NAN : 100.0 * (lf - 1.0);
}

/* Pairs are compared only when both values have the same sign and neither is
 * zero: a ratio across zero says nothing about proportional ink. */
static gboolean comparable(double a, double b) {
  return a != 0 && b != 0 && (a > 0) == (b > 0);
}

void pp_measures_compute(const double *values, const double *inks, const guint *series, guint n,
                         double baseline, pp_measures *out) {
  out->growth_ratio = out->lie_factor = out->gdi = out->distortion = NAN;
  out->max_pair_departure = NAN;
  out->baseline_value = baseline;
  out->first = out->last = out->pair_i = out->pair_j = 0;
  /* first and last of the first series with a usable value */
  gint first = -1, last = -1;
  for (guint i = 0; i < n; i++) {
    if (series[i] != 0 || !isfinite(values[i]) || values[i] == 0 || !(inks[i] > 0))
      continue;
    if (first < 0)
      first = (gint)i;
    else if (comparable(values[first], values[i]))
      last = (gint)i;
  }
  if (first >= 0 && last >= 0) {
    double v1 = fabs(values[first]), v2 = fabs(values[last]);
    out->first = (guint)first;
    out->last = (guint)last;
    out->growth_ratio = pp_ink_growth_ratio(v1, v2, inks[first], inks[last]);
    out->lie_factor = pp_lie_factor(v1, v2, inks[first], inks[last]);
    out->gdi = pp_gdi(v1, v2, inks[first], inks[last]);
  }
  double worst = NAN;
  for (guint i = 0; i < n; i++)
    for (guint j = 0; j < n; j++) {
      if (i == j || !comparable(values[i], values[j]) || !(inks[i] > 0) || !(inks[j] > 0))
        continue;
      double d = (inks[i] / inks[j]) / (values[i] / values[j]);
      if (isnan(worst) || d > worst) {
        worst = d;
        out->pair_i = i;
        out->pair_j = j;
      }
    }
  out->max_pair_departure = worst;
  out->distortion = pp_measures_distortion(out);
}

/* One number for the severity scale: the largest factor by which the ink of one element
 * is too large or too small against another's (or the whole against 100%). */
double pp_measures_distortion(const pp_measures *m) {
  gboolean g_ok = isfinite(m->growth_ratio) && m->growth_ratio > 0;
  gboolean p_ok = isfinite(m->max_pair_departure);
  if (!g_ok && !p_ok)
    return NAN;
  double g = g_ok ? m->growth_ratio : 1;
  return fmax(fmax(g, 1 / g), p_ok ? m->max_pair_departure : 1);
}
