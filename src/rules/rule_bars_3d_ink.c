/* rule_bars_3d_ink.c — bars drawn as solids. Caps (and, in perspective, sides) add ink
 * that does not grow with the value, and fronts at different depths shrink, so total ink
 * cannot follow the values: a third dimension that carries no data (Tufte's principle
 * that information-carrying dimensions should not exceed the data's). Measured between
 * the largest and the smallest value. */
#include <math.h>

#include "internal.h"

gboolean pp_rule_bars_3d_ink_measure(const pp_figure *fig, const pp_thresholds *t, pp_finding *f) {
  (void)t;
  guint n = fig->elements->len;
  g_autofree double *v = g_new0(double, MAX(n, 1));
  g_autofree double *g = g_new0(double, MAX(n, 1));
  g_autofree double *front = g_new0(double, MAX(n, 1));
  double nonprop = 0;
  for (guint i = 0; i < n; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    pp_finding_element fe = {e->value, e->ink, e->box, g_strdup(e->category),
                             g_strdup(e->label_text)};
    g_array_append_val(f->elements, fe);
    v[i] = e->value, g[i] = e->ink, front[i] = pp_element_ink_of(e, PP_PART_FRONT);
    /* ink that does not scale with the value: caps always; sides in perspective, where
     * their size depends on the bar's place, not its value alone */
    double fixed =
        pp_element_ink_of(e, PP_PART_CAP) + (fig->projection.kind == PP_PROJECTION_PERSPECTIVE
                                                 ? pp_element_ink_of(e, PP_PART_SIDE)
                                                 : 0);
    if (e->ink > 0)
      nonprop = fmax(nonprop, fixed / e->ink);
  }
  guint lo, hi;
  if (!pp_measures_extremes(v, g, n, &lo, &hi))
    return FALSE;
  pp_measures_between(v, g, n, lo, hi, &f->measures);
  pp_measures fm = {0};
  pp_measures_between(v, front, n, lo, hi, &fm);
  pp_measures_add_extra(&f->measures, "nonprop_share", nonprop);
  pp_measures_add_extra(&f->measures, "front_departure", fm.max_pair_departure);
  return TRUE;
}

char *pp_rule_bars_3d_ink_sentence(const pp_figure *fig, const pp_finding *f,
                                   const pp_thresholds *t) {
  if (g_strcmp0(fig->recognizer, "box-bars") == 0) { /* one value over two categories */
    char *lead = g_strdup_printf(
        "a 3D chart of one value over two categories: up to %.0f%% of a bar's ink is its top, "
        "which does not grow with its value, and nearer bars hide up to %.0f%% of those "
        "behind, so ink cannot be proportional",
        100 * f->measures.extra[0].value, 100 * fig->projection.ratio);
    return pp_rule_sentence(f, t, lead, "bar");
  }
  const char *how = fig->projection.kind == PP_PROJECTION_PERSPECTIVE ? "bars drawn in perspective"
                                                                      : "bars drawn as 3D solids";
  char *lead =
      g_strdup_printf("%s: up to %.0f%% of a bar's ink is caps%s that do not grow "
                      "with its value, so ink cannot be proportional",
                      how, 100 * f->measures.extra[0].value,
                      fig->projection.kind == PP_PROJECTION_PERSPECTIVE ? " and sides" : "");
  return pp_rule_sentence(f, t, lead, "bar");
}
