/* table_opt_in.c — the opt-in rules: checks a profile switches on (--profile, or
 * --enable-rule). Each failed check is its own finding, whatever the main table finds;
 * today the fund past-performance checks (Regulation (EU) No 583/2010, Annex III). */
#include "internal.h"

#define FUND(id, summary, severity)                                                                \
  { id, summary, id, PP_KIND_BIT(COLUMN), pp_rule_fund_measure, severity, pp_rule_fund_sentence }

const pp_opt_in_rule pp_opt_in_rules[] = {
    {FUND("fund-log-axis", "past-performance bars on a log axis (583/2010 Annex III pt 1)",
          pp_rule_fund_major),
     "bars-on-log"},
    {FUND("fund-axis-off-zero", "past-performance bars not rising from 0% (Annex III pt 3)",
          pp_rule_fund_major),
     "bars-off-zero"},
    {FUND("fund-label-missing", "a past-performance bar without its printed return (pt 4)",
          pp_rule_fund_major),
     NULL},
    {FUND("fund-label-decimals", "past-performance labels not rounded to one decimal (pt 5)",
          pp_rule_fund_minor),
     NULL},
    /* A cut bar disagrees with its label; the cut is the finding, not the label. */
    {FUND("fund-bar-clipped", "a past-performance bar cut by the plot frame (Annex III pt 2)",
          pp_rule_fund_major),
     "bars-vs-labels"},
    {FUND("fund-scale-compressed",
          "past-performance bars squeezed into a small part of the axis (pt 2)",
          pp_rule_fund_minor),
     NULL},
    {FUND("fund-label-vs-bar", "a past-performance label that disagrees with its bar (pt 4)",
          pp_rule_fund_major),
     "bars-vs-labels"},
    {FUND("fund-years", "past-performance years: more than ten, or a year dropped (Art. 15)",
          pp_rule_fund_minor),
     NULL},
};

const guint pp_n_opt_in_rules = G_N_ELEMENTS(pp_opt_in_rules);
G_STATIC_ASSERT(G_N_ELEMENTS(pp_opt_in_rules) <= 64); /* one bit of pp_thresholds.opt_in each */
