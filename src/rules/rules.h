/* rules.h — contract of the scoring stage: measures of how far a figure's ink departs
 * from its values (Tufte's Lie Factor, the Graph Discrepancy Index) and the rules that
 * turn departures into findings under configurable thresholds. */
#pragma once

#include "recognize/recognize.h"

G_BEGIN_DECLS

/* One scale, ordered by how much the ink misstates the values: the distortion (see
 * pp_measures) decides, so a higher word never goes with a smaller distortion. */
typedef enum {
  PP_SEVERITY_MINOR,  /* distortion below 1 + gdi_limit/100 (1.10) */
  PP_SEVERITY_MAJOR,  /* from there to below severe_factor (2) */
  PP_SEVERITY_SEVERE, /* ink off by severe_factor or more */
} pp_severity;

const char *pp_severity_name(pp_severity s);

typedef struct {
  double lie_band_low, lie_band_high; /* Tufte: 0.95–1.05 */
  double gdi_limit;                   /* percent; the GDI's ±10% convention (Steinbart 1989) */
  double severe_factor;               /* distortion from which a finding is severe: 2 (no source) */
  double label_tolerance; /* relative; bar-vs-label disagreement tolerated: 0.05 (no source) */
  guint64 opt_in;         /* bit i: opt-in rule i of the table runs (a profile's checks) */
} pp_thresholds;

pp_thresholds pp_thresholds_default(void);
/* Switches on an opt-in rule (a profile's extra check); FALSE when id is not one. */
gboolean pp_thresholds_enable_rule(pp_thresholds *t, const char *id);

#define PP_MEASURES_MAX_EXTRA 6

/* The measures for one figure: ink versus value of its first and last elements
 * and of the worst pair. NAN where undefined. */
typedef struct {
  double lie_factor;     /* Tufte's: relative change in the ink / relative change in the values */
  double growth_ratio;   /* not a lie factor: (ink_last/ink_first)/(v_last/v_first) */
  double gdi;            /* 100·(lie_factor − 1) */
  double baseline_value; /* value where the ink starts */
  double max_pair_departure; /* max over pairs of (ink_i/ink_j)/(v_i/v_j) ≥ 1 */
  guint first, last;         /* element indices used */
  guint pair_i, pair_j;      /* the worst pair */
  double distortion; /* how much the ink misstates: max(worst pair, growth ratio, 1/ratio) */
  /* Measures particular to one rule (a size exponent, the inflated slices), written after
   * the common ones; names are static strings listed in docs/findings.schema.json. */
  guint n_extra;
  struct {
    const char *name;
    double value;
  } extra[PP_MEASURES_MAX_EXTRA];
} pp_measures;

/* Appends a rule's own measure (ignored beyond PP_MEASURES_MAX_EXTRA). */
void pp_measures_add_extra(pp_measures *m, const char *name, double value);

/* Lie factors from two values and two ink amounts (exposed for tests). */
double pp_ink_growth_ratio(double v1, double v2, double g1, double g2);
double pp_lie_factor(double v1, double v2, double g1, double g2);
double pp_gdi(double v1, double v2, double g1, double g2);

/* One element as the rule judged it: the value it stands for under the rule, its ink
 * and where it is (page points), so outputs can draw overlays. */
typedef struct {
  double value;
  double ink;     /* visible ink, pt² (areas: per unit width) */
  pp_rect box;    /* page points, top-left origin */
  char *category; /* NULL if none */
  char *printed;  /* the value as the chart prints it ("€100m"), NULL if not printed */
} pp_finding_element;

/* What a rule found in one figure. Page and PDF-space boxes are the report's business:
 * rules do not see the scene. */
typedef struct {
  char *id;           /* fingerprint of figure + rule */
  char *figure_id;    /* the figure's fingerprint */
  char *figure_title; /* its title or nearest caption, NULL if none */
  pp_rect bbox;       /* the figure's plot region, page points, top-left origin */
  pp_figure_kind figure_kind;
  const char *rule; /* rule id, static string */
  pp_severity severity;
  pp_measures measures;
  GArray *elements; /* of pp_finding_element, the figure's order */
  char *headline;   /* plain words: "shows 19% growth as 121% growth" */
  char *message;    /* headline, then the cause and the measures */
} pp_finding;

/* An empty finding of one figure under one rule (no elements yet). */
pp_finding *pp_finding_new(const pp_figure *figure, const char *rule);
void pp_finding_free(pp_finding *f);
G_DEFINE_AUTOPTR_CLEANUP_FUNC(pp_finding, pp_finding_free)

/* Appends to findings (of pp_finding*) what the rules find in one figure: every opt-in
 * rule switched on in thresholds that fails adds its finding; then the first rule of the
 * table that judges the figure's kind and applies to it decides (see docs/rules.md),
 * unless a failed opt-in rule restates its finding. Figures seen but not judged get none. */
void pp_rules_check_figure(const pp_figure *figure, const pp_thresholds *thresholds,
                           GPtrArray *findings);

/* Stable list of rule ids with one-line descriptions, for --help and docs. */
typedef struct {
  const char *id;
  const char *summary;
  const char *doc; /* anchor in docs/rules.md */
  gboolean opt_in; /* runs only when a profile (or --enable-rule) switches it on */
} pp_rule_info;
const pp_rule_info *pp_rules_list(guint *n);

G_END_DECLS
