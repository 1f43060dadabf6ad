/* rule_bars_off_zero.c — bars on a linear value scale whose drawn baseline is not the
 * value 0: their lengths, hence their ink, are no longer proportional to their values.
 * Stacked bars are judged like stacked areas, on the layer standing on the floor: the
 * bottom segments lose the cut-off part, the segments above keep their thickness. */
#include <math.h>

#include "internal.h"

/* The bottom segments of stacked bars: their readings at their ends (values counted from
 * 0) against their own ink; the stack totals stay in the finding's elements. */
static gboolean bottom_segments(const pp_figure *fig, double base, pp_measures *out) {
  guint n = fig->elements->len, stacked = 0;
  g_autofree double *values = g_new0(double, MAX(n, 1));
  g_autofree double *inks = g_new0(double, MAX(n, 1));
  g_autofree guint *series = g_new0(guint, MAX(n, 1));
  for (guint i = 0; i < n; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    const pp_part *p = e->parts && e->parts->len ? &g_array_index(e->parts, pp_part, 0) : NULL;
    stacked += e->stacked;
    values[i] = p ? p->end : NAN;
    inks[i] = p ? p->ink : NAN;
  }
  if (stacked == 0)
    return FALSE;
  pp_measures_compute(values, inks, series, n, base, out);
  return TRUE;
}

gboolean pp_rule_bars_off_zero_measure(const pp_figure *fig, const pp_thresholds *t,
                                       pp_finding *f) {
  if (!fig->scale || fig->scale->kind != PP_SCALE_LINEAR)
    return FALSE;
  double base = pp_rule_baseline(fig, FALSE);
  if (!isfinite(base) || pp_rule_baseline_is_zero(fig, base))
    return FALSE;
  pp_rule_measure_elements(fig, f, PP_JUDGE_VALUE, FALSE, base);
  pp_measures bottom = {0};
  if (!bottom_segments(fig, base, &bottom))
    return TRUE;
  pp_severity sev;
  /* The totals may stay within the band while the bottom segments do not: then the
   * bottom segments are the finding's measures, the totals' growth an extra. */
  if (!pp_rule_grade(&f->measures, t, &sev) && pp_rule_grade(&bottom, t, &sev)) {
    double totals = f->measures.growth_ratio;
    f->measures = bottom;
    for (guint i = 0; i < f->elements->len; i++) {
      const pp_element *e = &g_array_index(fig->elements, pp_element, i);
      pp_finding_element *fe = &g_array_index(f->elements, pp_finding_element, i);
      fe->value = g_array_index(e->parts, pp_part, 0).end;
      fe->ink = g_array_index(e->parts, pp_part, 0).ink;
    }
    pp_measures_add_extra(&f->measures, "totals_growth_ratio", totals);
    pp_measures_add_extra(&f->measures, "bottom_segments_judged", 1);
  } else {
    pp_measures_add_extra(&f->measures, "bottom_growth_ratio", bottom.growth_ratio);
    pp_measures_add_extra(&f->measures, "bottom_max_pair_departure", bottom.max_pair_departure);
  }
  return TRUE;
}

static gboolean has_extra(const pp_finding *f, const char *name) {
  for (guint i = 0; i < f->measures.n_extra; i++)
    if (g_strcmp0(f->measures.extra[i].name, name) == 0)
      return TRUE;
  return FALSE;
}

char *pp_rule_bars_off_zero_sentence(const pp_figure *fig, const pp_finding *f,
                                     const pp_thresholds *t) {
  char *b = pp_rule_printed_value(fig, f->measures.baseline_value);
  char *lead = has_extra(f, "bottom_segments_judged")
                   ? g_strdup_printf("stacked bars start at %s, not 0: the stack totals stay "
                                     "near proportion but the bottom segments do not",
                                     b)
               : has_extra(f, "bottom_growth_ratio")
                   ? g_strdup_printf("bars start at %s, not 0 (their bottom segments alone: ink "
                                     "growth over value growth ×%.3g)",
                                     b, f->measures.extra[0].value)
                   : g_strdup_printf("bars start at %s, not 0", b);
  g_free(b);
  return pp_rule_sentence(f, t, lead, has_extra(f, "bottom_segments_judged") ? "segment" : "bar");
}
