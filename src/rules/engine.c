/* engine.c — runs the rule table over a figure and holds what every rule shares: the
 * finding's elements and measures, the faithful band and severity, the sentence. Each
 * rule is explained with its method and source in docs/rules.md. */
#include <math.h>
#include <string.h>

#include "internal.h"

/* Zero counts as reached when the baseline lies within this share of the scale's span
 * from it (half a percent: under a pixel on a printed chart; common practice, no
 * source). */
#define PP_ZERO_SHARE 0.005

pp_thresholds pp_thresholds_default(void) {
  return (pp_thresholds){
      .lie_band_low = 0.95, /* Tufte (1983) p. 57: 0.95–1.05 is "accurate" */
      .lie_band_high = 1.05,
      .gdi_material = 10.0, /* ±10%: the materiality convention (Steinbart 1989; Beattie & Jones) */
      .gross_factor = 2.0,  /* ink off by a factor 2: common practice, no source */
      .label_tolerance = 0.05, /* 5% between a bar and its label: common practice, no source */
  };
}

const char *pp_severity_name(pp_severity s) {
  static const char *names[] = {"note", "material", "gross"};
  return s <= PP_SEVERITY_GROSS ? names[s] : "note";
}

const pp_rule_info *pp_rules_list(guint *n) {
  static pp_rule_info *infos;
  if (!infos) {
    pp_rule_info *list = g_new0(pp_rule_info, MAX(pp_n_rules, 1));
    for (guint i = 0; i < pp_n_rules; i++)
      list[i] = (pp_rule_info){pp_rules[i].id, pp_rules[i].summary, pp_rules[i].doc};
    infos = list; /* kept for the life of the process */
  }
  *n = pp_n_rules;
  return infos;
}

pp_finding *pp_finding_new(const pp_figure *fig, const char *rule) {
  pp_finding *f = g_new0(pp_finding, 1);
  f->figure_kind = fig->kind;
  f->rule = rule;
  f->bbox = fig->bbox;
  f->elements = g_array_new(FALSE, FALSE, sizeof(pp_finding_element));
  char *id_src = g_strconcat(fig->fingerprint ? fig->fingerprint : "", "/", rule, NULL);
  char *sum = g_compute_checksum_for_string(G_CHECKSUM_SHA256, id_src, -1);
  f->id = g_strndup(sum, 16);
  g_free(sum);
  g_free(id_src);
  return f;
}

void pp_finding_free(pp_finding *f) {
  if (!f)
    return;
  g_free(f->id);
  g_free(f->message);
  for (guint i = 0; f->elements && i < f->elements->len; i++)
    g_free(g_array_index(f->elements, pp_finding_element, i).category);
  if (f->elements)
    g_array_unref(f->elements);
  g_free(f);
}

void pp_rule_measure_elements(const pp_figure *fig, pp_finding *f, pp_judge judge,
                              gboolean per_series, double baseline) {
  guint n = fig->elements->len;
  double *values = g_new0(double, MAX(n, 1)), *inks = g_new0(double, MAX(n, 1));
  guint *series = g_new0(guint, MAX(n, 1));
  for (guint i = 0; i < n; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    pp_finding_element fe = {judge == PP_JUDGE_LABEL ? e->label_value : e->value, e->ink, e->box,
                             g_strdup(e->category)};
    g_array_append_val(f->elements, fe);
    values[i] = fe.value;
    inks[i] = fe.ink;
    series[i] = per_series ? e->series : 0;
  }
  pp_measures_compute(values, inks, series, n, baseline, &f->measures);
  g_free(values), g_free(inks), g_free(series);
}

double pp_rule_baseline(const pp_figure *fig, gboolean skip_stacked) {
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    if (!skip_stacked || !e->stacked)
      return e->base_value;
  }
  return NAN;
}

gboolean pp_rule_baseline_is_zero(const pp_figure *fig, double base) {
  double span = fig->scale ? fig->scale->max_value - fig->scale->min_value : 0;
  return fabs(base) <= fmax(PP_ZERO_SHARE * fabs(span), 1e-9);
}

static gboolean outside_band(const pp_measures *m, const pp_thresholds *t) {
  gboolean lf = isfinite(m->lie_factor) &&
                (m->lie_factor < t->lie_band_low || m->lie_factor > t->lie_band_high);
  gboolean gdi = isfinite(m->gdi) && fabs(m->gdi) > t->gdi_material;
  gboolean pair = isfinite(m->max_pair_departure) && m->max_pair_departure > t->lie_band_high;
  return lf || gdi || pair;
}

gboolean pp_rule_grade(const pp_measures *m, const pp_thresholds *t, pp_severity *severity) {
  if (!outside_band(m, t))
    return FALSE;
  double lf = isfinite(m->lie_factor) ? m->lie_factor : 1;
  double worst =
      fmax(fmax(lf, 1 / lf), isfinite(m->max_pair_departure) ? m->max_pair_departure : 1);
  if (worst >= t->gross_factor)
    *severity = PP_SEVERITY_GROSS;
  else if ((isfinite(m->gdi) && fabs(m->gdi) > t->gdi_material) ||
           worst > 1 + t->gdi_material / 100)
    *severity = PP_SEVERITY_MATERIAL;
  else
    *severity = PP_SEVERITY_NOTE;
  return TRUE;
}

static const char *name_of(const pp_finding *f, guint i, char *buf, gsize len) {
  const char *c =
      i < f->elements->len ? g_array_index(f->elements, pp_finding_element, i).category : NULL;
  if (c && *c)
    return c;
  g_snprintf(buf, len, "#%u", i + 1);
  return buf;
}

/* "the 2022 bar uses 3.1× the ink of 2019 for 1.1× the value" for the pair that
 * shows the departure best: first/last when they do, else the worst pair. */
static char *comparison(const pp_finding *f, const char *noun, const pp_thresholds *t,
                        gboolean *worst_pair) {
  const pp_measures *m = &f->measures;
  guint a = m->first, b = m->last;
  gboolean ends_depart = isfinite(m->lie_factor) &&
                         (m->lie_factor < t->lie_band_low || m->lie_factor > t->lie_band_high);
  *worst_pair = !ends_depart && isfinite(m->max_pair_departure);
  if (*worst_pair) {
    a = m->pair_j;
    b = m->pair_i;
  }
  if (a >= f->elements->len || b >= f->elements->len)
    return g_strdup("");
  const pp_finding_element *ea = &g_array_index(f->elements, pp_finding_element, a);
  const pp_finding_element *eb = &g_array_index(f->elements, pp_finding_element, b);
  if (ea->ink <= 0 || ea->value == 0)
    return g_strdup("");
  char b1[32], b2[32];
  if (strcmp(noun, "point") == 0 && a == m->first && b == m->last)
    return g_strdup_printf("at its right end the area uses %.2f× the ink of its left end for "
                           "%.2f× the value",
                           eb->ink / ea->ink, eb->value / ea->value);
  return g_strdup_printf("the %s %s uses %.2f× the ink of %s for %.2f× the value",
                         name_of(f, b, b1, sizeof b1), noun, eb->ink / ea->ink,
                         name_of(f, a, b2, sizeof b2), eb->value / ea->value);
}

char *pp_rule_sentence(const pp_finding *f, const pp_thresholds *t, char *lead, const char *noun) {
  gboolean worst_pair;
  char *cmp = comparison(f, noun, t, &worst_pair);
  char lf[64] = "", gdi[64] = "", pair[64] = "";
  /* When the first and last marks happen to agree, the sentence shows the worst pair and
   * says so, so that its numbers and the lie factor do not seem to contradict. */
  if (worst_pair)
    g_snprintf(pair, sizeof pair,
               "the worst pair departs %.2f×; first to last: ", f->measures.max_pair_departure);
  if (isfinite(f->measures.lie_factor))
    g_snprintf(lf, sizeof lf, f->measures.lie_factor < 0.1 ? "lie factor %.2g" : "lie factor %.2f",
               f->measures.lie_factor);
  if (isfinite(f->measures.gdi))
    g_snprintf(gdi, sizeof gdi, ", GDI %+.0f%%", f->measures.gdi);
  char *s = g_strdup_printf("%s: %s (%s%s%s)", lead, cmp, pair, lf, gdi);
  g_free(cmp);
  g_free(lead);
  return s;
}

void pp_rules_check_figure(const pp_figure *fig, const pp_thresholds *t, GPtrArray *findings) {
  if (!fig->judged || fig->elements->len < 2)
    return;
  for (guint i = 0; i < pp_n_rules; i++) {
    const pp_rule *r = &pp_rules[i];
    if (!(r->kinds & (1u << fig->kind)))
      continue;
    pp_finding *f = pp_finding_new(fig, r->id);
    if (!r->measure(fig, t, f)) {
      pp_finding_free(f);
      continue;
    }
    /* The first rule that applies judges the figure, whatever it finds. */
    if (r->severity(&f->measures, t, &f->severity)) {
      f->message = r->sentence(fig, f, t);
      g_ptr_array_add(findings, f);
    } else {
      pp_finding_free(f);
    }
    return;
  }
}
