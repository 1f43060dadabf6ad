/* internal.h — shared by the scoring stage's files only: the rule table's entry type,
 * the helpers every rule uses (measures over elements, band, severity, sentence) and
 * one run function per rule file. */
#pragma once

#include "rules.h"

void pp_measures_compute(const double *values, const double *inks, const guint *series, guint n,
                         double baseline, pp_measures *out);

/* "30,000", "1.25", "0.004": a value as a reviewer reads it (en grouping). */
char *pp_format_value(double v);

#define PP_KIND_BIT(k) (1u << (PP_FIGURE_##k))

/* One rule. Rules are tried in table order (table.c); the first whose kinds include the
 * figure's and whose measure() says it applies judges the figure, alone. */
typedef struct {
  const char *id;
  const char *summary;
  const char *doc; /* anchor in docs/rules.md */
  guint32 kinds;   /* PP_KIND_BIT mask of the figure kinds it judges */
  /* Applies to this figure? Then fills f's elements and measures and returns TRUE. */
  gboolean (*measure)(const pp_figure *fig, const pp_thresholds *t, pp_finding *f);
  /* Outside the faithful band? Then sets *severity and returns TRUE (no finding else). */
  gboolean (*severity)(const pp_measures *m, const pp_thresholds *t, pp_severity *severity);
  /* The one sentence a reviewer reads (newly allocated). */
  char *(*sentence)(const pp_figure *fig, const pp_finding *f, const pp_thresholds *t);
} pp_rule;

extern const pp_rule pp_rules[];
extern const guint pp_n_rules;

/* An opt-in rule (a profile's check, table_opt_in.c): runs only when switched on in the
 * thresholds, on every figure of its kinds, each on its own; measure() returns TRUE when
 * the check fails. */
typedef struct {
  pp_rule rule;
  /* Its finding restates this table rule's (same defect, the regime's source), so that
   * rule's finding on the same figure is dropped. NULL if none. */
  const char *supersedes;
} pp_opt_in_rule;

extern const pp_opt_in_rule pp_opt_in_rules[];
extern const guint pp_n_opt_in_rules;

/* ---- Helpers shared by the rules (engine.c) ---------------------------------------- */

/* Which value of an element a rule judges. */
typedef enum {
  PP_JUDGE_VALUE, /* e->value: the scale reading (or the label on labels-only charts) */
  PP_JUDGE_LABEL, /* e->label_value: the printed data label */
} pp_judge;

/* Fills f->elements from the figure (value per judge, ink, box, category) and computes
 * the measures; per_series compares each series' own ends (areas), else the first and
 * last elements whatever their series (the GDI convention for bars). */
void pp_rule_measure_elements(const pp_figure *fig, pp_finding *f, pp_judge judge,
                              gboolean per_series, double baseline);
/* The value where the ink starts: the first element's base (first unstacked one when
 * skip_stacked), NAN when unknown. */
double pp_rule_baseline(const pp_figure *fig, gboolean skip_stacked);
/* Zero lies within PP_ZERO_SHARE of the scale's span from base. */
gboolean pp_rule_baseline_is_zero(const pp_figure *fig, double base);
/* The default severity: outside the band (Tufte's 0.95–1.05 on the growth ratio, the GDI
 * limit, or the worst pair), graded minor / major / severe by the distortion alone. */
gboolean pp_rule_grade(const pp_measures *m, const pp_thresholds *t, pp_severity *severity);
/* "HEADLINE: LEAD; 2027 (€118.2m) to 2031 (€140.2m): ink ×2.21 for value ×1.19 (Lie Factor
 * 6.49, GDI +549%)"; noun names an element ("bar", "point"). Takes lead. */
char *pp_rule_sentence(const pp_finding *f, const pp_thresholds *t, char *lead, const char *noun);
/* The severity word of a distortion: the one scale every rule uses. */
pp_severity pp_rule_severity_of(double distortion, const pp_thresholds *t);
/* max(worst pair, growth ratio, 1/growth ratio); NAN when neither is known. */
double pp_measures_distortion(const pp_measures *m);
/* The plain headline: "shows 19% growth as 121% growth", "shows Lowfield 17% above
 * Nordvik as 109% above", from the pair the sentence shows. */
char *pp_rule_headline(const pp_finding *f, const pp_thresholds *t);
/* A value as the chart prints it: the tick label at that value when there is one. */
char *pp_rule_printed_value(const pp_figure *fig, double v);

/* Measures between elements a and b (Lie Factor, Tufte's form, GDI) and the worst pair
 * over positive values (shape_measures.c). */
void pp_measures_between(const double *v, const double *g, guint n, guint a, guint b,
                         pp_measures *m);
/* The smallest and largest positive values with ink; FALSE when they are equal or absent. */
gboolean pp_measures_extremes(const double *v, const double *g, guint n, guint *lo, guint *hi);

/* ---- The rules (one file each, listed in table.c) ---------------------------------- */
gboolean pp_rule_bars_3d_ink_measure(const pp_figure *fig, const pp_thresholds *t, pp_finding *f);
char *pp_rule_bars_3d_ink_sentence(const pp_figure *fig, const pp_finding *f,
                                   const pp_thresholds *t);
gboolean pp_rule_slices_vs_values_measure(const pp_figure *fig, const pp_thresholds *t,
                                          pp_finding *f);
char *pp_rule_slices_vs_values_sentence(const pp_figure *fig, const pp_finding *f,
                                        const pp_thresholds *t);
gboolean pp_rule_symbols_not_by_area_measure(const pp_figure *fig, const pp_thresholds *t,
                                             pp_finding *f);
char *pp_rule_symbols_not_by_area_sentence(const pp_figure *fig, const pp_finding *f,
                                           const pp_thresholds *t);
/* ---- Shares (shares.c): pies and tilted pies ------------------------------------------ */
/* Digits after the decimal mark of a label as printed ("12.5%" → 1). */
int pp_label_decimals(const char *text);
/* Each element's printed share of the whole (0–1) and half a unit of its last printed digit
 * as a share; FALSE unless every element has a share and ink. Arrays of elements->len. */
gboolean pp_rule_shares(const pp_figure *fig, double *printed, double *half_unit);

/* ---- The rules (one file each, listed in table.c) ---------------------------------- */
gboolean pp_rule_shares_not_100_measure(const pp_figure *fig, const pp_thresholds *t,
                                        pp_finding *f);
gboolean pp_rule_shares_not_100_severity(const pp_measures *m, const pp_thresholds *t,
                                         pp_severity *severity);
char *pp_rule_shares_not_100_sentence(const pp_figure *fig, const pp_finding *f,
                                      const pp_thresholds *t);
gboolean pp_rule_wedges_vs_labels_measure(const pp_figure *fig, const pp_thresholds *t,
                                          pp_finding *f);
char *pp_rule_wedges_vs_labels_sentence(const pp_figure *fig, const pp_finding *f,
                                        const pp_thresholds *t);
gboolean pp_rule_tilted_pie_ink_measure(const pp_figure *fig, const pp_thresholds *t,
                                        pp_finding *f);
char *pp_rule_tilted_pie_ink_sentence(const pp_figure *fig, const pp_finding *f,
                                      const pp_thresholds *t);
gboolean pp_rule_radial_ring_ink_measure(const pp_figure *fig, const pp_thresholds *t,
                                         pp_finding *f);
char *pp_rule_radial_ring_ink_sentence(const pp_figure *fig, const pp_finding *f,
                                       const pp_thresholds *t);
gboolean pp_rule_polar_radius_measure(const pp_figure *fig, const pp_thresholds *t, pp_finding *f);
char *pp_rule_polar_radius_sentence(const pp_figure *fig, const pp_finding *f,
                                    const pp_thresholds *t);
gboolean pp_rule_bars_vs_labels_measure(const pp_figure *fig, const pp_thresholds *t,
                                        pp_finding *f);
char *pp_rule_bars_vs_labels_sentence(const pp_figure *fig, const pp_finding *f,
                                      const pp_thresholds *t);
gboolean pp_rule_bars_on_log_measure(const pp_figure *fig, const pp_thresholds *t, pp_finding *f);
char *pp_rule_bars_on_log_sentence(const pp_figure *fig, const pp_finding *f,
                                   const pp_thresholds *t);
gboolean pp_rule_bars_off_zero_measure(const pp_figure *fig, const pp_thresholds *t, pp_finding *f);
char *pp_rule_bars_off_zero_sentence(const pp_figure *fig, const pp_finding *f,
                                     const pp_thresholds *t);
/* The fund past-performance checks (rule_fund_past_performance.c): one measure and one
 * sentence for all of them, dispatched on the finding's rule id. */
gboolean pp_rule_fund_measure(const pp_figure *fig, const pp_thresholds *t, pp_finding *f);
gboolean pp_rule_fund_major(const pp_measures *m, const pp_thresholds *t, pp_severity *severity);
gboolean pp_rule_fund_minor(const pp_measures *m, const pp_thresholds *t, pp_severity *severity);
char *pp_rule_fund_sentence(const pp_figure *fig, const pp_finding *f, const pp_thresholds *t);
gboolean pp_rule_area_off_zero_measure(const pp_figure *fig, const pp_thresholds *t, pp_finding *f);
char *pp_rule_area_off_zero_sentence(const pp_figure *fig, const pp_finding *f,
                                     const pp_thresholds *t);
