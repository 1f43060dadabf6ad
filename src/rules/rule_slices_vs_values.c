/* rule_slices_vs_values.c — pyramids and funnels. A slice's share of the ink should be its
 * value's share of the total; a triangle cut at heights proportional to the values gives
 * areas that grow with the square of the depth instead. Measures the ink per unit value
 * of the most against the least inflated slice, and the same read as a solid cone. */
#include <math.h>

#include "geometry/geometry.h"
#include "internal.h"

/* The slice read as a frustum of a cone: radii from its top and bottom widths. */
static double cone_volume(const pp_element *e) {
  if (e->shape.kind != PP_SHAPE_QUAD)
    return NAN;
  const pp_point *p = e->shape.quad.p;
  double y0 = INFINITY, y1 = -INFINITY;
  for (int i = 0; i < 4; i++)
    y0 = fmin(y0, p[i].y), y1 = fmax(y1, p[i].y);
  double w0 = 0, w1 = 0, x0a = INFINITY, x0b = -INFINITY, x1a = INFINITY, x1b = -INFINITY;
  for (int i = 0; i < 4; i++) {
    if (fabs(p[i].y - y0) < 0.05)
      x0a = fmin(x0a, p[i].x), x0b = fmax(x0b, p[i].x);
    if (fabs(p[i].y - y1) < 0.05)
      x1a = fmin(x1a, p[i].x), x1b = fmax(x1b, p[i].x);
  }
  w0 = x0b - x0a, w1 = x1b - x1a;
  return pp_frustum_volume(PP_SOLID_CONE, w0 / 2, w1 / 2, y1 - y0);
}

/* Each printed value moved, within the half unit of its last printed digit, as near as it
 * may go to the value its ink stands for (its ink share of the printed total): the values
 * rounding allows that agree best with the drawing (the same allowance as shares-not-100;
 * common practice, no source). */
static void nearest_within_rounding(const pp_figure *fig, const double *v, const double *g,
                                    double tv, double tg, double *out) {
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    double u = e->label_text ? 0.5 * pow(10, -pp_label_decimals(e->label_text)) : 0;
    out[i] = fmin(fmax(tv * g[i] / tg, v[i] - u), v[i] + u);
  }
}

/* The engine's faithful test (engine.c): ratio in the band, GDI within its limit, no pair
 * departing beyond the band. */
static gboolean in_band(const pp_measures *m, const pp_thresholds *t) {
  return m->growth_ratio >= t->lie_band_low && m->growth_ratio <= t->lie_band_high &&
         !(fabs(m->gdi) > t->gdi_limit) && !(m->max_pair_departure > t->lie_band_high);
}

gboolean pp_rule_slices_vs_values_measure(const pp_figure *fig, const pp_thresholds *t,
                                          pp_finding *f) {
  guint n = fig->elements->len;
  g_autofree double *v = g_new0(double, MAX(n, 1));
  g_autofree double *g = g_new0(double, MAX(n, 1));
  g_autofree double *vol = g_new0(double, MAX(n, 1));
  double tv = 0, tg = 0, tvol = 0;
  for (guint i = 0; i < n; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    pp_finding_element fe = {e->value, e->ink, e->box, g_strdup(e->category),
                             g_strdup(e->label_text)};
    g_array_append_val(f->elements, fe);
    v[i] = e->value, g[i] = e->ink, vol[i] = cone_volume(e);
    if (!(v[i] > 0) || !(g[i] > 0))
      return FALSE;
    tv += v[i], tg += g[i], tvol += vol[i];
  }
  guint most = 0, least = 0;
  double vmost = 0, vleast = INFINITY;
  for (guint i = 0; i < n; i++) {
    double infl = (g[i] / tg) / (v[i] / tv);
    if (infl > (g[most] / tg) / (v[most] / tv))
      most = i;
    if (infl < (g[least] / tg) / (v[least] / tv))
      least = i;
    double vi = (vol[i] / tvol) / (v[i] / tv);
    vmost = fmax(vmost, vi), vleast = fmin(vleast, vi);
  }
  if (most == least)
    return FALSE;
  pp_measures_between(v, g, n, least, most, &f->measures);
  /* A departure rounding of the printed numbers can explain is none: measured on the
   * values rounding allows nearest the drawing when those fall in the faithful band. */
  g_autofree double *r = g_new0(double, n);
  nearest_within_rounding(fig, v, g, tv, tg, r);
  pp_measures rm = {0};
  pp_measures_between(r, g, n, least, most, &rm);
  if (in_band(&rm, t))
    f->measures = rm;
  f->measures.baseline_value = NAN;
  pp_measures_add_extra(&f->measures, "most_inflated", most);
  pp_measures_add_extra(&f->measures, "least_inflated", least);
  pp_measures_add_extra(&f->measures, "volume_ratio",
                        isfinite(tvol) && vleast > 0 ? vmost / vleast : NAN);
  return TRUE;
}

char *pp_rule_slices_vs_values_sentence(const pp_figure *fig, const pp_finding *f,
                                        const pp_thresholds *t) {
  (void)fig;
  double vol = f->measures.extra[2].value;
  char *lead = isfinite(vol) ? g_strdup_printf("slice areas do not follow the slices' values "
                                               "(read as a cone, the volumes depart %.1f×)",
                                               vol)
                             : g_strdup("slice areas do not follow the slices' values");
  return pp_rule_sentence(f, t, lead, "slice");
}
