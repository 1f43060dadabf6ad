/* rule_bars_vs_labels.c — bars whose printed data labels disagree with their lengths.
 * With a value scale, a label off the scale reading at its bar's tip by more than the
 * label tolerance makes the labels the values; without a scale they are the values. */
#include <math.h>

#include "internal.h"

/* How many labelled elements there are, and whether one disagrees with its reading. */
static gboolean labels_disagree(const pp_figure *fig, const pp_thresholds *t, guint *n_labelled) {
  guint bad = 0, n = 0;
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    if (isnan(e->label_value))
      continue;
    n++;
    double ref = fmax(fabs(e->label_value), 1e-12);
    if (fabs(e->scale_value - e->label_value) / ref > t->label_tolerance)
      bad++;
  }
  *n_labelled = n;
  return bad > 0;
}

gboolean pp_rule_bars_vs_labels_measure(const pp_figure *fig, const pp_thresholds *t,
                                        pp_finding *f) {
  guint n_labelled = 0;
  if (fig->scale && !(labels_disagree(fig, t, &n_labelled) && n_labelled >= 2))
    return FALSE;
  /* The printed labels are the values; the ink must follow them. */
  pp_rule_measure_elements(fig, f, PP_JUDGE_LABEL, FALSE, pp_rule_baseline(fig, FALSE));
  return TRUE;
}

char *pp_rule_bars_vs_labels_sentence(const pp_figure *fig, const pp_finding *f,
                                      const pp_thresholds *t) {
  (void)fig;
  return pp_rule_sentence(f, t, g_strdup("bar lengths disagree with their printed labels"), "bar");
}
