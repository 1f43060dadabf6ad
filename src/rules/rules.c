/* rules.c — the rules: which figures break proportional ink, how badly, and the one
 * sentence a reviewer reads. Each rule is explained with its method and source in
 * docs/rules.md. */
#include <math.h>
#include <string.h>

#include "internal.h"

#define RULE_BARS_OFF_ZERO "bars-off-zero"
#define RULE_AREA_OFF_ZERO "area-off-zero"
#define RULE_BARS_ON_LOG "bars-on-log"
#define RULE_BARS_VS_LABELS "bars-vs-labels"

static const pp_rule_info rules[] = {
    {RULE_BARS_OFF_ZERO, "bars drawn from a value axis that does not start at zero"},
    {RULE_AREA_OFF_ZERO, "a filled area whose floor is not the value zero"},
    {RULE_BARS_ON_LOG, "bars on a logarithmic value axis, where length cannot be proportional"},
    {RULE_BARS_VS_LABELS, "bar ink that disagrees with the bars' own printed data labels"},
};

const pp_rule_info *pp_rules_list(guint *n) {
  *n = G_N_ELEMENTS(rules);
  return rules;
}

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

void pp_finding_free(pp_finding *f) {
  if (!f)
    return;
  g_free(f->id);
  g_free(f->message);
  g_array_unref(f->values);
  g_array_unref(f->inks);
  g_ptr_array_unref(f->categories);
  g_free(f);
}

static gboolean outside_band(const pp_measures *m, const pp_thresholds *t) {
  gboolean lf = isfinite(m->lie_factor) &&
                (m->lie_factor < t->lie_band_low || m->lie_factor > t->lie_band_high);
  gboolean gdi = isfinite(m->gdi) && fabs(m->gdi) > t->gdi_material;
  gboolean pair = isfinite(m->max_pair_departure) && m->max_pair_departure > t->lie_band_high;
  return lf || gdi || pair;
}

static pp_severity grade(const pp_measures *m, const pp_thresholds *t) {
  double lf = isfinite(m->lie_factor) ? m->lie_factor : 1;
  double worst =
      fmax(fmax(lf, 1 / lf), isfinite(m->max_pair_departure) ? m->max_pair_departure : 1);
  if (worst >= t->gross_factor)
    return PP_SEVERITY_GROSS;
  if ((isfinite(m->gdi) && fabs(m->gdi) > t->gdi_material) || worst > 1 + t->gdi_material / 100)
    return PP_SEVERITY_MATERIAL;
  return PP_SEVERITY_NOTE;
}

static const char *name_of(const pp_finding *f, guint i, char *buf, gsize len) {
  const char *c = i < f->categories->len ? g_ptr_array_index(f->categories, i) : NULL;
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
  double *v = (double *)f->values->data, *g = (double *)f->inks->data;
  if (a >= f->values->len || b >= f->values->len || g[a] <= 0 || v[a] == 0)
    return g_strdup("");
  char b1[32], b2[32];
  if (strcmp(noun, "point") == 0 && a == m->first && b == m->last)
    return g_strdup_printf("at its right end the area uses %.2f× the ink of its left end for "
                           "%.2f× the value",
                           g[b] / g[a], v[b] / v[a]);
  return g_strdup_printf("the %s %s uses %.2f× the ink of %s for %.2f× the value",
                         name_of(f, b, b1, sizeof b1), noun, g[b] / g[a],
                         name_of(f, a, b2, sizeof b2), v[b] / v[a]);
}

static void fill_bbox(pp_finding *f, const pp_figure *fig, const pp_scene *scene) {
  f->bbox = fig->bbox;
  pp_point c[4] = {{fig->bbox.x0, fig->bbox.y0},
                   {fig->bbox.x1, fig->bbox.y0},
                   {fig->bbox.x0, fig->bbox.y1},
                   {fig->bbox.x1, fig->bbox.y1}};
  f->pdf_bbox = pp_rect_empty();
  for (int i = 0; i < 4; i++)
    f->pdf_bbox = pp_rect_add_point(f->pdf_bbox, pp_matrix_apply(scene->to_pdf, c[i]));
}

static pp_finding *finding_new(const pp_figure *fig, const pp_scene *scene, const char *rule,
                               gboolean use_labels) {
  pp_finding *f = g_new0(pp_finding, 1);
  f->page = scene->page_index + 1;
  f->figure_kind = fig->kind;
  f->rule = rule;
  fill_bbox(f, fig, scene);
  f->values = g_array_new(FALSE, FALSE, sizeof(double));
  f->inks = g_array_new(FALSE, FALSE, sizeof(double));
  f->categories = g_ptr_array_new_with_free_func(g_free);
  guint n = fig->elements->len;
  guint *series = g_new0(guint, MAX(n, 1));
  double base = NAN;
  for (guint i = 0; i < n; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    double v = use_labels ? e->label_value : e->tip_value;
    g_array_append_val(f->values, v);
    g_array_append_val(f->inks, e->ink);
    g_ptr_array_add(f->categories, g_strdup(e->category));
    /* Bars: the first and last bars in category order, whatever their series (the GDI
     * convention compares the first and last bars drawn). Areas: one series' own ends. */
    series[i] = fig->kind == PP_FIGURE_AREA ? e->series : 0;
    if (isnan(base) && isfinite(e->base_value))
      base = e->base_value;
  }
  pp_measures_compute((double *)f->values->data, (double *)f->inks->data, series, n, base,
                      &f->measures);
  g_free(series);
  char *id_src = g_strconcat(fig->fingerprint ? fig->fingerprint : "", "/", rule, NULL);
  char *sum = g_compute_checksum_for_string(G_CHECKSUM_SHA256, id_src, -1);
  f->id = g_strndup(sum, 16);
  g_free(sum);
  g_free(id_src);
  return f;
}

static void emit(GPtrArray *findings, pp_finding *f, const pp_thresholds *t, char *lead,
                 const char *noun) {
  if (!outside_band(&f->measures, t)) {
    g_free(lead);
    pp_finding_free(f);
    return;
  }
  f->severity = grade(&f->measures, t);
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
  f->message = g_strdup_printf("%s: %s (%s%s%s)", lead, cmp, pair, lf, gdi);
  g_free(cmp);
  g_free(lead);
  g_ptr_array_add(findings, f);
}

/* Zero lies within half a percent of the axis span from the drawn baseline. */
static gboolean baseline_is_zero(const pp_figure *fig, double base) {
  double span = fig->axis ? fig->axis->max_value - fig->axis->min_value : 0;
  return fabs(base) <= fmax(0.005 * fabs(span), 1e-9);
}

static gboolean labels_disagree(const pp_figure *fig, const pp_thresholds *t, guint *n_labelled) {
  guint bad = 0, n = 0;
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    if (isnan(e->label_value))
      continue;
    n++;
    double ref = fmax(fabs(e->label_value), 1e-12);
    if (fabs(e->tip_value - e->label_value) / ref > t->label_tolerance)
      bad++;
  }
  *n_labelled = n;
  return bad > 0;
}

void pp_rules_check_figure(const pp_figure *fig, const pp_scene *scene, const pp_thresholds *t,
                           GPtrArray *findings) {
  if (fig->elements->len < 2)
    return;
  gboolean bars = fig->kind == PP_FIGURE_COLUMN || fig->kind == PP_FIGURE_BAR;
  guint n_labelled = 0;
  gboolean disagree = bars && fig->axis && labels_disagree(fig, t, &n_labelled);
  if (bars && (!fig->axis || disagree) && (fig->axis ? n_labelled >= 2 : TRUE)) {
    /* The printed labels are the values; the ink must follow them. */
    pp_finding *f = finding_new(fig, scene, RULE_BARS_VS_LABELS, TRUE);
    emit(findings, f, t, g_strdup("bar lengths disagree with their printed labels"), "bar");
    return;
  }
  if (!fig->axis)
    return;
  if (bars && fig->axis->log) {
    pp_finding *f = finding_new(fig, scene, RULE_BARS_ON_LOG, FALSE);
    char *lo = pp_format_value(fig->axis->min_value), *hi = pp_format_value(fig->axis->max_value);
    emit(findings, f, t,
         g_strdup_printf("bars on a logarithmic axis (%s to %s), so length cannot follow value", lo,
                         hi),
         "bar");
    g_free(lo), g_free(hi);
    return;
  }
  double base = NAN;
  for (guint i = 0; i < fig->elements->len && isnan(base); i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    if (!e->stacked || bars)
      base = e->base_value;
  }
  if (!isfinite(base) || baseline_is_zero(fig, base))
    return;
  if (bars) {
    pp_finding *f = finding_new(fig, scene, RULE_BARS_OFF_ZERO, FALSE);
    char *b = pp_format_value(base);
    emit(findings, f, t, g_strdup_printf("bars start at %s, not 0", b), "bar");
    g_free(b);
  } else if (fig->kind == PP_FIGURE_AREA) {
    pp_finding *f = finding_new(fig, scene, RULE_AREA_OFF_ZERO, FALSE);
    char *b = pp_format_value(base);
    emit(findings, f, t, g_strdup_printf("the filled area stands on %s, not 0", b), "point");
    g_free(b);
  }
}
