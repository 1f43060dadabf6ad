/* rule_wedges_vs_labels.c — pie and donut slices whose angles disagree with their printed
 * shares. Each slice's drawn share is its angle over the turn (equal to its ink share in a
 * flat pie, pulled out or not); a slice agrees when it lies within half a unit of its
 * label's last digit. The measures take the worst slice: drawn share / printed share. */
#include <math.h>

#include "internal.h"

/* Arcs are drawn to better than this share of a turn (0.02°): slack on top of rounding.
 * Derived from tests/geometry (angles within 2e-4 rad). */
#define PP_WEDGE_ANGLE_SLACK 5e-5

gboolean pp_rule_wedges_vs_labels_measure(const pp_figure *fig, const pp_thresholds *t,
                                          pp_finding *f) {
  (void)t;
  guint n = fig->elements->len;
  double *p = g_new(double, MAX(n, 1)), *h = g_new(double, MAX(n, 1));
  double *d = g_new(double, MAX(n, 1));
  gboolean ok = pp_rule_shares(fig, p, h);
  double turn = 0;
  for (guint i = 0; ok && i < n; i++)
    turn += g_array_index(fig->elements, pp_element, i).extent;
  gboolean off = FALSE;
  for (guint i = 0; ok && i < n; i++) {
    d[i] = g_array_index(fig->elements, pp_element, i).extent / turn;
    off = off || fabs(d[i] - p[i]) > h[i] + PP_WEDGE_ANGLE_SLACK;
  }
  if (!ok || !off || !(turn > 0)) {
    g_free(p), g_free(h), g_free(d);
    return FALSE;
  }
  pp_rule_measure_elements(fig, f, PP_JUDGE_LABEL, FALSE, NAN);
  pp_measures *m = &f->measures;
  guint worst = 0;
  for (guint i = 1; i < n; i++)
    if (fabs(log(d[i] / p[i])) > fabs(log(d[worst] / p[worst])))
      worst = i;
  m->growth_ratio = d[worst] / p[worst];
  m->lie_factor = m->gdi = NAN;
  m->first = m->last = worst;
  m->max_pair_departure = NAN;
  for (guint i = 0; i < n; i++)
    for (guint j = 0; j < n; j++) {
      double r = (d[i] / d[j]) / (p[i] / p[j]);
      if (i != j && (isnan(m->max_pair_departure) || r > m->max_pair_departure)) {
        m->max_pair_departure = r;
        m->pair_i = i;
        m->pair_j = j;
      }
    }
  /* Tufte's change form and the GDI on the worst pair (printed → drawn). */
  guint a = m->pair_j, b = m->pair_i;
  m->lie_factor = pp_lie_factor(p[a], p[b], d[a], d[b]);
  m->gdi = pp_gdi(p[a], p[b], d[a], d[b]);
  g_free(p), g_free(h), g_free(d);
  return TRUE;
}

char *pp_rule_wedges_vs_labels_sentence(const pp_figure *fig, const pp_finding *f,
                                        const pp_thresholds *t) {
  (void)t;
  const pp_measures *m = &f->measures;
  const pp_element *e = &g_array_index(fig->elements, pp_element, m->first);
  double turn = 0;
  for (guint i = 0; i < fig->elements->len; i++)
    turn += g_array_index(fig->elements, pp_element, i).extent;
  char name[64];
  g_snprintf(name, sizeof name, "%s", e->category ? e->category : "");
  if (!*name)
    g_snprintf(name, sizeof name, "#%u", m->first + 1);
  return g_strdup_printf(
      "slice angles disagree with their printed shares: the %s slice is "
      "drawn as %.1f%% of the pie but labelled %s (ink-to-value ratio %.2f; worst "
      "pair of slices %.2f)",
      name, 100 * e->extent / turn, e->label_text ? e->label_text : "?", m->growth_ratio,
      m->max_pair_departure);
}
