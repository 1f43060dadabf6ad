/* rule_tilted_pie_ink.c — a tilted or perspective pie whose slices' visible ink (top face
 * and rim) is not shared as their printed shares are. An orthographic tilt alone keeps
 * the top faces' shares (ab·Δt/2 over πab); the rim, seen only at the front, and
 * perspective, which magnifies near parts, give the front slices more. The measures take
 * the most exaggerated slice: its ink share / its printed share. */
#include <math.h>

#include "internal.h"

/* Ink shares are exact (closed-form areas); half a unit of the label's last digit is all
 * the slack a slice gets, plus this for the producers' drawing precision (derived). */
#define PP_TILT_INK_SLACK 5e-4

static void ink_shares(const pp_figure *fig, double *g, double *top) {
  double total = 0, total_top = 0;
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    total += e->ink;
    total_top += pp_element_ink_of(e, PP_PART_TOP);
  }
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    g[i] = e->ink / total;
    top[i] = pp_element_ink_of(e, PP_PART_TOP) / total_top;
  }
}

gboolean pp_rule_tilted_pie_ink_measure(const pp_figure *fig, const pp_thresholds *t,
                                        pp_finding *f) {
  (void)t;
  guint n = fig->elements->len;
  double *p = g_new(double, MAX(n, 1)), *h = g_new(double, MAX(n, 1));
  double *g = g_new(double, MAX(n, 1)), *top = g_new(double, MAX(n, 1));
  gboolean ok = pp_rule_shares(fig, p, h), off = FALSE;
  if (ok) {
    ink_shares(fig, g, top);
    for (guint i = 0; i < n; i++)
      off = off || fabs(g[i] - p[i]) > h[i] + PP_TILT_INK_SLACK;
  }
  if (ok && off) {
    pp_rule_measure_elements(fig, f, PP_JUDGE_LABEL, FALSE, NAN);
    pp_measures *m = &f->measures;
    guint worst = 0;
    for (guint i = 1; i < n; i++)
      if (g[i] / p[i] > g[worst] / p[worst])
        worst = i;
    m->growth_ratio = g[worst] / p[worst];
    /* Tufte's change form and the GDI on the worst pair (from the printed shares' ink). */
    guint a = m->pair_j, b = m->pair_i;
    m->lie_factor = pp_lie_factor(p[a], p[b], g[a], g[b]);
    m->gdi = pp_gdi(p[a], p[b], g[a], g[b]);
    m->first = m->last = worst;
  }
  g_free(p), g_free(h), g_free(g), g_free(top);
  return ok && off;
}

char *pp_rule_tilted_pie_ink_sentence(const pp_figure *fig, const pp_finding *f,
                                      const pp_thresholds *t) {
  (void)t;
  guint n = fig->elements->len, w = f->measures.first;
  double *g = g_new(double, MAX(n, 1)), *top = g_new(double, MAX(n, 1));
  ink_shares(fig, g, top);
  const pp_element *e = &g_array_index(fig->elements, pp_element, w);
  char name[64];
  g_snprintf(name, sizeof name, "%s", e->category ? e->category : "");
  if (!*name)
    g_snprintf(name, sizeof name, "#%u", w + 1);
  const char *how = fig->projection.kind == PP_PROJECTION_PERSPECTIVE ? "perspective" : "tilted";
  char *s = g_strdup_printf("a %s pie gives its front slices more ink: the %s slice (%s) takes "
                            "%.1f%% of the visible ink, %.1f%% of the top face (ink-to-value ratio "
                            "%.2f)",
                            how, name, e->label_text ? e->label_text : "?", 100 * g[w],
                            100 * top[w], f->measures.growth_ratio);
  g_free(g), g_free(top);
  return s;
}
