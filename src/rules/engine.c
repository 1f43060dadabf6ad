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
      .gdi_limit = 10.0,       /* ±10%: the GDI's convention (Steinbart 1989; Beattie & Jones) */
      .severe_factor = 2.0,    /* ink off by a factor 2: common practice, no source */
      .label_tolerance = 0.05, /* 5% between a bar and its label: common practice, no source */
  };
}

gboolean pp_thresholds_enable_rule(pp_thresholds *t, const char *id) {
  for (guint i = 0; i < pp_n_opt_in_rules; i++)
    if (g_strcmp0(pp_opt_in_rules[i].rule.id, id) == 0) {
      t->opt_in |= G_GUINT64_CONSTANT(1) << i;
      return TRUE;
    }
  return FALSE;
}

const char *pp_severity_name(pp_severity s) {
  static const char *names[] = {"minor", "major", "severe"};
  return s <= PP_SEVERITY_SEVERE ? names[s] : "minor";
}

const pp_rule_info *pp_rules_list(guint *n) {
  static pp_rule_info *infos;
  if (!infos) {
    pp_rule_info *list = g_new0(pp_rule_info, pp_n_rules + pp_n_opt_in_rules + 1);
    for (guint i = 0; i < pp_n_rules; i++)
      list[i] = (pp_rule_info){pp_rules[i].id, pp_rules[i].summary, pp_rules[i].doc, FALSE};
    for (guint i = 0; i < pp_n_opt_in_rules; i++) {
      const pp_rule *r = &pp_opt_in_rules[i].rule;
      list[pp_n_rules + i] = (pp_rule_info){r->id, r->summary, r->doc, TRUE};
    }
    infos = list; /* kept for the life of the process */
  }
  *n = pp_n_rules + pp_n_opt_in_rules;
  return infos;
}

pp_finding *pp_finding_new(const pp_figure *fig, const char *rule) {
  pp_finding *f = g_new0(pp_finding, 1);
  f->figure_kind = fig->kind;
  f->rule = rule;
  f->bbox = fig->bbox;
  f->figure_id = g_strdup(fig->fingerprint);
  f->figure_title = g_strdup(fig->title);
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
  g_free(f->figure_id);
  g_free(f->figure_title);
  g_free(f->headline);
  g_free(f->message);
  for (guint i = 0; f->elements && i < f->elements->len; i++) {
    g_free(g_array_index(f->elements, pp_finding_element, i).category);
    g_free(g_array_index(f->elements, pp_finding_element, i).printed);
  }
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
                             g_strdup(e->category), g_strdup(e->label_text)};
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
  gboolean lf = isfinite(m->growth_ratio) &&
                (m->growth_ratio < t->lie_band_low || m->growth_ratio > t->lie_band_high);
  gboolean gdi = isfinite(m->gdi) && fabs(m->gdi) > t->gdi_limit;
  gboolean pair = isfinite(m->max_pair_departure) && m->max_pair_departure > t->lie_band_high;
  return lf || gdi || pair;
}

/* The severity follows the distortion alone, so findings are ordered by how much they
 * misstate: ink off by 2× or more is severe, by more than the GDI's 10% major, less minor. */
pp_severity pp_rule_severity_of(double distortion, const pp_thresholds *t) {
  double d = isfinite(distortion) ? distortion : 1;
  if (d >= t->severe_factor)
    return PP_SEVERITY_SEVERE;
  return d > 1 + t->gdi_limit / 100 ? PP_SEVERITY_MAJOR : PP_SEVERITY_MINOR;
}

gboolean pp_rule_grade(const pp_measures *m, const pp_thresholds *t, pp_severity *severity) {
  if (!outside_band(m, t))
    return FALSE;
  *severity = pp_rule_severity_of(pp_measures_distortion(m), t);
  return TRUE;
}

char *pp_rule_printed_value(const pp_figure *fig, double v) {
  if (fig->scale && fig->scale->ticks && isfinite(v)) {
    /* A tick within a ten-thousandth of the span is the same value, as printed. */
    double tol = 1e-4 * fabs(fig->scale->max_value - fig->scale->min_value);
    for (guint i = 0; i < fig->scale->ticks->len; i++) {
      const pp_tick *k = &g_array_index(fig->scale->ticks, pp_tick, i);
      if (k->label && fabs(k->value - v) <= tol)
        return g_strdup(k->label);
    }
  }
  return pp_format_value(v);
}

static const char *name_of(const pp_finding *f, guint i, char *buf, gsize len) {
  const char *c =
      i < f->elements->len ? g_array_index(f->elements, pp_finding_element, i).category : NULL;
  if (c && *c)
    return c;
  g_snprintf(buf, len, "#%u", i + 1);
  return buf;
}

/* The pair a sentence shows: the first and last elements when they depart from the band,
 * else the worst pair (so the words never contradict the measures). */
static gboolean shown_pair(const pp_finding *f, const pp_thresholds *t, guint *a, guint *b,
                           gboolean *worst) {
  const pp_measures *m = &f->measures;
  gboolean ends_depart = isfinite(m->growth_ratio) &&
                         (m->growth_ratio < t->lie_band_low || m->growth_ratio > t->lie_band_high);
  *worst = !ends_depart && isfinite(m->max_pair_departure);
  *a = *worst ? m->pair_j : m->first;
  *b = *worst ? m->pair_i : m->last;
  if (*a >= f->elements->len || *b >= f->elements->len)
    return FALSE;
  const pp_finding_element *ea = &g_array_index(f->elements, pp_finding_element, *a);
  return ea->ink > 0 && ea->value != 0;
}

/* Years (or no names at all, as along an area) read as a time line: "growth", "decline". */
static gboolean is_timeline(const pp_finding *f) {
  for (guint i = 0; i < f->elements->len; i++) {
    const char *c = g_array_index(f->elements, pp_finding_element, i).category;
    if (c && !(strlen(c) >= 4 && g_ascii_isdigit(c[0]) && g_ascii_isdigit(c[1]) &&
               g_ascii_isdigit(c[2]) && g_ascii_isdigit(c[3])))
      return FALSE;
  }
  return TRUE;
}

/* Ratios beyond tenfold read better as "N-fold" / "N times" than as percentages. */
#define PP_FOLD_FROM 10.0

static char *pct(double r) {
  double p = 100 * fabs(r - 1);
  return g_strdup_printf(p < 1 ? "%.1f%%" : "%.0f%%", p);
}

static char *fold(double r) {
  return g_strdup_printf(r >= 100 ? "%.0f" : r >= 10 ? "%.3g" : "%.2g", r);
}

/* English takes "an" before numbers said with a vowel: 8, 11, 18, 80–89, 800–899. */
static gboolean an_number(const char *n) {
  size_t digits = strspn(n, "0123456789");
  return n[0] == '8' || (digits == 2 && (strncmp(n, "11", 2) == 0 || strncmp(n, "18", 2) == 0));
}

/* "19% growth", "a 67% decline", "983-fold growth" */
static char *change_words(double r, gboolean folds) {
  char *n = folds ? fold(r) : pct(r);
  char *s = folds    ? g_strdup_printf("%s-fold %s", n, r >= 1 ? "growth" : "change")
            : r >= 1 ? g_strdup_printf("%s growth", n)
                     : g_strdup_printf("%s %s decline", an_number(n) ? "an" : "a", n);
  g_free(n);
  return s;
}

/* "17% above", "40% below", "983 times" */
static char *relative_words(double r, gboolean folds) {
  char *n = folds ? fold(r) : pct(r);
  char *s = folds ? g_strdup_printf("%s times", n)
                  : g_strdup_printf("%s %s", n, r >= 1 ? "above" : "below");
  g_free(n);
  return s;
}

/* "the Harbour slice takes 41% of the ink for 25% of the value": one element's shares. */
static char *share_headline(const pp_finding *f, guint i) {
  double sv = 0, sg = 0;
  for (guint k = 0; k < f->elements->len; k++) {
    const pp_finding_element *e = &g_array_index(f->elements, pp_finding_element, k);
    sv += fabs(e->value), sg += e->ink;
  }
  const pp_finding_element *e = &g_array_index(f->elements, pp_finding_element, i);
  char buf[32];
  const char *noun = strstr(pp_figure_kind_name(f->figure_kind), "pie") ? "slice" : "element";
  return g_strdup_printf("the %s %s takes %.0f%% of the ink for %.0f%% of the value",
                         name_of(f, i, buf, sizeof buf), noun, 100 * e->ink / sg,
                         100 * fabs(e->value) / sv);
}

char *pp_rule_headline(const pp_finding *f, const pp_thresholds *t) {
  guint a, b;
  gboolean worst;
  const pp_measures *m = &f->measures;
  /* Only a whole is measured (printed shares against 100%): say so. */
  if (!isfinite(m->lie_factor) && !isfinite(m->max_pair_departure) && isfinite(m->growth_ratio))
    return g_strdup_printf("the printed shares add up to %.0f%%, not 100%%", 100 * m->growth_ratio);
  if (m->first == m->last && m->first < f->elements->len)
    return share_headline(f, m->first);
  if (!shown_pair(f, t, &a, &b, &worst))
    return g_strdup("the ink is not proportional to the values");
  const pp_finding_element *ea = &g_array_index(f->elements, pp_finding_element, a);
  const pp_finding_element *eb = &g_array_index(f->elements, pp_finding_element, b);
  double rv = eb->value / ea->value, rg = eb->ink / ea->ink;
  gboolean folds = fmax(fmax(rv, 1 / rv), fmax(rg, 1 / rg)) >= PP_FOLD_FROM;
  char *shown, *drawn, *out;
  if (is_timeline(f) && !worst) {
    shown = change_words(rv, folds), drawn = change_words(rg, folds);
    out = g_strdup_printf("shows %s as %s", shown, drawn);
  } else {
    char b1[32], b2[32];
    shown = relative_words(rv, folds), drawn = relative_words(rg, folds);
    out = g_strdup_printf("shows %s %s %s as %s", name_of(f, b, b1, sizeof b1), shown,
                          name_of(f, a, b2, sizeof b2), drawn);
  }
  g_free(shown), g_free(drawn);
  return out;
}

/* "2027 (€118.2m)": the name and the value as printed, else as read. */
static char *element_words(const pp_finding *f, guint i, const char *fallback) {
  const pp_finding_element *e = &g_array_index(f->elements, pp_finding_element, i);
  char buf[32];
  const char *name = e->category && *e->category ? e->category : fallback;
  if (!name)
    name = name_of(f, i, buf, sizeof buf);
  char *v = e->printed ? g_strdup(e->printed) : pp_format_value(e->value);
  char *s = g_strdup_printf("%s (%s)", name, v);
  g_free(v);
  return s;
}

char *pp_rule_sentence(const pp_finding *f, const pp_thresholds *t, char *lead, const char *noun) {
  const pp_measures *m = &f->measures;
  guint a, b;
  gboolean worst;
  GString *s = g_string_new(NULL);
  char *headline = pp_rule_headline(f, t);
  g_string_append_printf(s, "%s: %s", headline, lead);
  g_free(headline);
  if (shown_pair(f, t, &a, &b, &worst)) {
    gboolean ends = strcmp(noun, "point") == 0 && !worst;
    char *wa = element_words(f, a, ends ? "left end" : NULL);
    char *wb = element_words(f, b, ends ? "right end" : NULL);
    const pp_finding_element *ea = &g_array_index(f->elements, pp_finding_element, a);
    const pp_finding_element *eb = &g_array_index(f->elements, pp_finding_element, b);
    g_string_append_printf(s, "; %s%s to %s: ink ×%.3g for value ×%.3g", worst ? "worst pair " : "",
                           wa, wb, eb->ink / ea->ink, eb->value / ea->value);
    g_free(wa), g_free(wb);
  }
  if (isfinite(m->lie_factor))
    g_string_append_printf(s, fabs(m->lie_factor) < 0.1 ? " (Lie Factor %.2g" : " (Lie Factor %.2f",
                           m->lie_factor);
  if (isfinite(m->gdi))
    g_string_append_printf(s, "%sGDI %+.0f%%", isfinite(m->lie_factor) ? ", " : " (", m->gdi);
  if (isfinite(m->lie_factor) || isfinite(m->gdi))
    g_string_append_c(s, ')');
  g_free(lead);
  return g_string_free(s, FALSE);
}

/* Runs the opt-in rules switched on; returns the rule ids their findings restate. */
static GPtrArray *check_opt_in(const pp_figure *fig, const pp_thresholds *t, GPtrArray *findings) {
  GPtrArray *superseded = g_ptr_array_new();
  for (guint i = 0; i < pp_n_opt_in_rules; i++) {
    const pp_rule *r = &pp_opt_in_rules[i].rule;
    if (!(t->opt_in & (G_GUINT64_CONSTANT(1) << i)) || !(r->kinds & (1u << fig->kind)))
      continue;
    pp_finding *f = pp_finding_new(fig, r->id);
    if (r->measure(fig, t, f) && r->severity(&f->measures, t, &f->severity)) {
      f->measures.distortion = pp_measures_distortion(&f->measures);
      /* The sentence says what fails, then why and where the rule comes from; the
       * headline is its first clause. */
      f->message = r->sentence(fig, f, t);
      f->headline = g_strndup(f->message, strcspn(f->message, ";"));
      g_ptr_array_add(findings, f);
      if (pp_opt_in_rules[i].supersedes)
        g_ptr_array_add(superseded, (gpointer)pp_opt_in_rules[i].supersedes);
    } else {
      pp_finding_free(f);
    }
  }
  return superseded;
}

static gboolean listed(GPtrArray *ids, const char *id) {
  for (guint i = 0; i < ids->len; i++)
    if (strcmp(g_ptr_array_index(ids, i), id) == 0)
      return TRUE;
  return FALSE;
}

void pp_rules_check_figure(const pp_figure *fig, const pp_thresholds *t, GPtrArray *findings) {
  if (!fig->judged || fig->elements->len < 2)
    return;
  g_autoptr(GPtrArray) superseded = check_opt_in(fig, t, findings);
  for (guint i = 0; i < pp_n_rules; i++) {
    const pp_rule *r = &pp_rules[i];
    if (!(r->kinds & (1u << fig->kind)))
      continue;
    pp_finding *f = pp_finding_new(fig, r->id);
    if (!r->measure(fig, t, f)) {
      pp_finding_free(f);
      continue;
    }
    /* Rules may set their own measures after the shared ones: the distortion follows them. */
    f->measures.distortion = pp_measures_distortion(&f->measures);
    /* The first rule that applies judges the figure, whatever it finds; an opt-in rule's
     * finding that restates it replaces it. */
    if (!listed(superseded, r->id) && r->severity(&f->measures, t, &f->severity)) {
      f->headline = pp_rule_headline(f, t);
      char *sentence = r->sentence(fig, f, t);
      /* Every message opens with its headline; rules with their own sentence get it here. */
      f->message = g_str_has_prefix(sentence, f->headline)
                       ? sentence
                       : g_strdup_printf("%s: %s", f->headline, sentence);
      if (f->message != sentence)
        g_free(sentence);
      g_ptr_array_add(findings, f);
    } else {
      pp_finding_free(f);
    }
    return;
  }
}
