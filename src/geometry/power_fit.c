/* power_fit.c — how size grows with value: the exponent of a power law fitted by least
 * squares in log-log space (bubbles scaled by radius show exponent 2 in area), and the
 * volumes of solids cut into slices (a pyramid or cone read as a solid). */
#include "internal.h"

#include <math.h>

gboolean pp_power_fit_compute(const double *x, const double *y, guint n, pp_power_fit *out) {
  double sx = 0, sy = 0, sxx = 0, sxy = 0, syy = 0;
  guint m = 0;
  for (guint i = 0; i < n; i++) {
    if (!(x[i] > 0) || !(y[i] > 0) || !isfinite(x[i]) || !isfinite(y[i]))
      continue;
    double lx = log(x[i]), ly = log(y[i]);
    sx += lx, sy += ly, sxx += lx * lx, sxy += lx * ly, syy += ly * ly;
    m++;
  }
  if (m < 2)
    return FALSE;
  double vx = sxx - sx * sx / m, cxy = sxy - sx * sy / m, vy = syy - sy * sy / m;
  /* Values that are all equal (to rounding) give no slope. */
  if (!(vx > 1e-12 * m))
    return FALSE;
  out->n = m;
  out->exponent = cxy / vx;
  out->log_coeff = (sy - out->exponent * sx) / m;
  double ss_res = vy - out->exponent * cxy;
  /* Sizes all equal: the fit is exact, the exponent 0. */
  out->r2 = vy > 1e-12 * m ? 1 - fmax(0, ss_res) / vy : 1.0;
  return TRUE;
}

double pp_frustum_volume(pp_solid_kind kind, double base_top, double base_bottom, double height) {
  /* Frustum of a cone: V = πh/3 (r₁² + r₁r₂ + r₂²); of a square pyramid with sides
   * a₁, a₂: V = h/3 (a₁² + a₁a₂ + a₂²) (the prismoid formula, any geometry handbook; from
   * memory). With half-widths s (a = 2s) the pyramid is 4h/3 (s₁² + s₁s₂ + s₂²): at equal
   * half-widths a cone holds π/4 of the square pyramid's volume. */
  double a = base_top, b = base_bottom;
  double v = height / 3 * (a * a + a * b + b * b);
  return kind == PP_SOLID_CONE ? G_PI * v : 4 * v;
}
