/* table.c — the rule table, in priority order: the first rule that applies to a figure
 * judges it. A new rule is one file (its measure and sentence) and one line here, with
 * its section in docs/rules.md. */
#include "internal.h"

#define BARS (PP_KIND_BIT(COLUMN) | PP_KIND_BIT(BAR))

const pp_rule pp_rules[] = {
    /* Printed labels outrank a scale reading: a chart that disagrees with its own labels
     * is judged against them. */
    {"bars-vs-labels", "bar ink that disagrees with the bars' own printed data labels",
     "bars-vs-labels", BARS, pp_rule_bars_vs_labels_measure, pp_rule_grade,
     pp_rule_bars_vs_labels_sentence},
    {"bars-on-log", "bars on a logarithmic value axis, where length cannot be proportional",
     "bars-on-log", BARS, pp_rule_bars_on_log_measure, pp_rule_grade, pp_rule_bars_on_log_sentence},
    {"bars-off-zero", "bars drawn from a value axis that does not start at zero", "bars-off-zero",
     BARS, pp_rule_bars_off_zero_measure, pp_rule_grade, pp_rule_bars_off_zero_sentence},
    {"area-off-zero", "a filled area whose floor is not the value zero", "area-off-zero",
     PP_KIND_BIT(AREA), pp_rule_area_off_zero_measure, pp_rule_grade,
     pp_rule_area_off_zero_sentence},
    {"bars-3d-ink", "3D bars whose caps and sides add ink that does not follow the values",
     "bars-3d-ink", PP_KIND_BIT(BAR_3D), pp_rule_bars_3d_ink_measure, pp_rule_grade,
     pp_rule_bars_3d_ink_sentence},
    {"slices-vs-values", "pyramid or funnel slices whose areas do not follow their values",
     "slices-vs-values", PP_KIND_BIT(PYRAMID), pp_rule_slices_vs_values_measure, pp_rule_grade,
     pp_rule_slices_vs_values_sentence},
    {"symbols-not-by-area", "bubbles or symbols whose area is not proportional to their values",
     "symbols-not-by-area", PP_KIND_BIT(BUBBLE), pp_rule_symbols_not_by_area_measure, pp_rule_grade,
     pp_rule_symbols_not_by_area_sentence},
    /* Circles: printed percentages that cannot be a whole come before any slice check. */
    {"shares-not-100", "a pie's printed percentages do not add up to 100 within rounding",
     "shares-not-100", PP_KIND_BIT(PIE) | PP_KIND_BIT(TILTED_PIE), pp_rule_shares_not_100_measure,
     pp_rule_shares_not_100_severity, pp_rule_shares_not_100_sentence},
    {"wedges-vs-labels", "pie or donut slices whose angles disagree with their printed shares",
     "wedges-vs-labels", PP_KIND_BIT(PIE), pp_rule_wedges_vs_labels_measure, pp_rule_grade,
     pp_rule_wedges_vs_labels_sentence},
    {"tilted-pie-ink",
     "a tilted or perspective pie whose front slices take more ink than "
     "their share",
     "tilted-pie-ink", PP_KIND_BIT(TILTED_PIE), pp_rule_tilted_pie_ink_measure, pp_rule_grade,
     pp_rule_tilted_pie_ink_sentence},
    {"radial-ring-ink", "radial bars whose outer rings take more ink per unit of value",
     "radial-ring-ink", PP_KIND_BIT(RADIAL_BAR), pp_rule_radial_ring_ink_measure, pp_rule_grade,
     pp_rule_radial_ring_ink_sentence},
    {"polar-radius", "a polar-area chart scaled by radius, so areas grow with the value squared",
     "polar-radius", PP_KIND_BIT(POLAR_AREA), pp_rule_polar_radius_measure, pp_rule_grade,
     pp_rule_polar_radius_sentence},
};

const guint pp_n_rules = G_N_ELEMENTS(pp_rules);
