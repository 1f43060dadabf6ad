/* test_rules.c — the rule table on figures built by hand: which rule judges which
 * figure, the severity, and the exact sentence of every rule, against values computed by
 * hand from the published formulas: Tufte (1983), The Visual Display of Quantitative
 * Information, p. 57 (lie factor, faithful band 0.95–1.05); Steinbart (1989), The
 * Accounting Review 64(1) (GDI = 100·(a/b − 1), materiality ±10%). The severe factor 2 and
 * the 5% label tolerance are plotproof's (docs/rules.md: common practice, no source).
 * Severity follows the distortion (the largest of the ink growth ratio, its inverse and the
 * worst pair): severe from 2, major above 1.10 (the ±10% convention), else minor. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "rules/internal.h"

/* A figure with one element per value: ink as given, a box per element, categories
 * "A", "B", … */
static pp_figure *figure(pp_figure_kind kind, gboolean with_scale, pp_scale_kind sk, double lo,
                         double hi, guint n, const double *values, const double *inks,
                         double base) {
  pp_figure *f = pp_figure_new(kind);
  f->fingerprint = g_strdup("0123456789abcdef");
  f->bbox = (pp_rect){10, 10, 210, 110};
  if (with_scale) {
    f->scale = pp_scale_new(TRUE);
    f->scale->kind = sk;
    f->scale->min_value = lo;
    f->scale->max_value = hi;
  }
  for (guint i = 0; i < n; i++) {
    pp_element e = pp_element_init(PP_ENCODING_LENGTH);
    pp_element_add_part(&e, i, PP_PART_BODY, inks[i]);
    e.box = e.shape.rect = (pp_rect){20 + 40 * i, 50, 40 + 40 * i, 100};
    e.shape.kind = PP_SHAPE_RECT;
    e.ink = inks[i];
    if (with_scale) {
      e.value = e.scale_value = values[i];
      e.base_value = base;
      e.source = PP_VALUE_SCALE;
    }
    e.category = g_strdup_printf("%c", 'A' + i);
    g_array_append_val(f->elements, e);
  }
  return f;
}

static void set_labels(pp_figure *f, const double *labels) {
  for (guint i = 0; i < f->elements->len; i++) {
    pp_element *e = &g_array_index(f->elements, pp_element, i);
    e->label_value = labels[i];
    e->label_text = g_strdup_printf("%g", labels[i]);
    if (!f->scale) {
      e->value = labels[i];
      e->source = PP_VALUE_DATA_LABEL;
    }
  }
}

/* Runs the table; returns the only finding or NULL, failing on more than one. */
static GPtrArray *check(const pp_figure *f) {
  pp_thresholds t = pp_thresholds_default();
  GPtrArray *out = g_ptr_array_new_with_free_func((GDestroyNotify)pp_finding_free);
  pp_rules_check_figure(f, &t, out);
  assert_true(out->len <= 1); /* one rule judges a figure */
  return out;
}

static const pp_finding *only(GPtrArray *out, const char *rule) {
  assert_int_equal(out->len, 1);
  const pp_finding *f = g_ptr_array_index(out, 0);
  assert_string_equal(f->rule, rule);
  return f;
}

/* Columns 410, 440, 470 on an axis from 400, ink ∝ length 10, 40, 70 (× 20 pt wide).
 * Growth form: (70/10)/(470/410) = 6.1064; Tufte: ((70−10)/10)/((470−410)/410) = 41,
 * GDI = 100·(41 − 1) = 4000. Worst pair is the same pair: 6.1064 ≥ 2, severe. */
static void test_bars_off_zero(void **state) {
  (void)state;
  const double v[] = {410, 440, 470}, g[] = {200, 800, 1400};
  pp_figure *fig = figure(PP_FIGURE_COLUMN, TRUE, PP_SCALE_LINEAR, 400, 480, 3, v, g, 400);
  GPtrArray *out = check(fig);
  const pp_finding *f = only(out, "bars-off-zero");
  assert_float_equal(f->measures.growth_ratio, 7.0 / (470.0 / 410.0), 1e-9);
  assert_float_equal(f->measures.lie_factor, 41.0, 1e-9);
  assert_float_equal(f->measures.gdi, 4000.0, 1e-6);
  assert_float_equal(f->measures.baseline_value, 400, 0);
  assert_int_equal(f->severity, PP_SEVERITY_SEVERE);
  assert_string_equal(f->message,
                      "shows C 15% above A as 600% above: bars start at 400, not 0; A (410) to C "
                      "(470): ink ×7 for value ×1.15 (Lie Factor 41.00, GDI +4000%)");
  /* the finding's elements carry the boxes the figure had */
  const pp_finding_element *e2 = &g_array_index(f->elements, pp_finding_element, 2);
  assert_float_equal(e2->box.x0, 100, 0);
  assert_string_equal(e2->category, "C");
  g_ptr_array_unref(out);
  pp_figure_free(fig);
}

/* Honest: ink ∝ value from a zero baseline, lie factor 1, GDI 0: no finding. A baseline
 * within half a percent of the span from 0 (0.4 on a span of 100) counts as zero. */
static void test_zero_baseline_is_clean(void **state) {
  (void)state;
  const double v[] = {20, 50, 80}, g[] = {400, 1000, 1600};
  pp_figure *fig = figure(PP_FIGURE_COLUMN, TRUE, PP_SCALE_LINEAR, 0, 100, 3, v, g, 0.4);
  GPtrArray *out = check(fig);
  assert_int_equal(out->len, 0);
  g_ptr_array_unref(out);
  pp_figure_free(fig);
}

/* Major: values 100, 120 from a baseline of 40, ink ∝ 60, 80. Growth form
 * (80/60)/(120/100) = 1.1111 (below 2); Tufte ((80−60)/60)/((120−100)/100) = 5/3,
 * distortion 1.1111 > 1.10: major. */
static void test_major(void **state) {
  (void)state;
  const double v[] = {100, 120}, g[] = {600, 800};
  pp_figure *fig = figure(PP_FIGURE_BAR, TRUE, PP_SCALE_LINEAR, 40, 130, 2, v, g, 40);
  GPtrArray *out = check(fig);
  const pp_finding *f = only(out, "bars-off-zero");
  assert_float_equal(f->measures.growth_ratio, (800.0 / 600) / 1.2, 1e-9);
  assert_float_equal(f->measures.gdi, 100.0 * (5.0 / 3 - 1), 1e-9);
  assert_int_equal(f->severity, PP_SEVERITY_MAJOR);
  assert_string_equal(f->message,
                      "shows B 20% above A as 33% above: bars start at 40, not 0; A (100) to B "
                      "(120): ink ×1.33 for value ×1.2 (Lie Factor 1.67, GDI +67%)");
  g_ptr_array_unref(out);
  pp_figure_free(fig);
}

/* Labels only (no scale): labels 10 and 1000, ink 100 and 10600. Growth form
 * 106/100 = 1.06 (outside Tufte's 0.95–1.05); Tufte (10500/100)/(990/10) = 105/99, GDI
 * 6.06 (within ±10%); worst pair 1.06 ≤ 1.10: minor. */
static void test_labels_only_minor(void **state) {
  (void)state;
  const double labels[] = {10, 1000}, g[] = {100, 10600};
  pp_figure *fig = figure(PP_FIGURE_COLUMN, FALSE, PP_SCALE_LINEAR, 0, 0, 2, labels, g, NAN);
  set_labels(fig, labels);
  GPtrArray *out = check(fig);
  const pp_finding *f = only(out, "bars-vs-labels");
  assert_float_equal(f->measures.growth_ratio, 1.06, 1e-9);
  assert_float_equal(f->measures.gdi, 100.0 * (105.0 / 99 - 1), 1e-9);
  assert_int_equal(f->severity, PP_SEVERITY_MINOR);
  assert_string_equal(
      f->message, "shows B 100 times A as 106 times: bar lengths disagree with their printed "
                  "labels; A (10) to B (1000): ink ×106 for value ×100 (Lie Factor 1.06, GDI +6%)");
  g_ptr_array_unref(out);
  pp_figure_free(fig);
}

/* With a scale, labels decide only when one disagrees with its reading by more than 5%:
 * label 60 on a bar read 50 (20% off) makes the labels the values; the ink (∝ 50, 100
 * read values) against labels 60, 100 gives (1000/500)/(100/60) = 1.2: major (distortion
 * 1.2 > 1.10: major; GDI (1/0.6667) − 1 = 50%). Labels within 5% leave the scale rule. */
static void test_labels_outrank_scale(void **state) {
  (void)state;
  const double v[] = {50, 100}, g[] = {500, 1000}, labels[] = {60, 100}, close[] = {51, 99};
  pp_figure *fig = figure(PP_FIGURE_COLUMN, TRUE, PP_SCALE_LINEAR, 0, 120, 2, v, g, 0);
  set_labels(fig, labels);
  GPtrArray *out = check(fig);
  const pp_finding *f = only(out, "bars-vs-labels");
  assert_float_equal(f->measures.growth_ratio, 2.0 / (100.0 / 60), 1e-9);
  assert_float_equal(f->measures.gdi, 100.0 * ((500.0 / 500) / (40.0 / 60) - 1), 1e-9);
  assert_int_equal(f->severity, PP_SEVERITY_MAJOR);
  g_ptr_array_unref(out);
  pp_figure_free(fig);
  fig = figure(PP_FIGURE_COLUMN, TRUE, PP_SCALE_LINEAR, 0, 120, 2, v, g, 0);
  set_labels(fig, close);
  out = check(fig);
  assert_int_equal(out->len, 0); /* zero baseline, labels agree: clean */
  g_ptr_array_unref(out);
  pp_figure_free(fig);
}

/* A log scale from 10: bars 100 and 1000 are drawn log10(v/10) long, 1 and 2 units,
 * ink 100 and 200. Growth form (200/100)/(1000/100) = 0.2; worst pair 1000/100 / 2 = 5:
 * severe. The sentence prints small lie factors to two significant digits. */
static void test_bars_on_log(void **state) {
  (void)state;
  const double v[] = {100, 1000}, g[] = {100, 200};
  pp_figure *fig = figure(PP_FIGURE_COLUMN, TRUE, PP_SCALE_LOG, 10, 10000, 2, v, g, 10);
  GPtrArray *out = check(fig);
  const pp_finding *f = only(out, "bars-on-log");
  assert_float_equal(f->measures.growth_ratio, 0.2, 1e-12);
  assert_float_equal(f->measures.max_pair_departure, 5.0, 1e-12);
  assert_int_equal(f->severity, PP_SEVERITY_SEVERE);
  assert_string_equal(f->message, "shows B 10 times A as 2 times: bars on a logarithmic axis (10 "
                                  "to 10,000), so length cannot follow value; A (100) to B "
                                  "(1,000): ink ×2 for value ×10 (Lie Factor 0.11, GDI -89%)");
  g_ptr_array_unref(out);
  pp_figure_free(fig);
}

/* An area on a floor of 50: samples 60 → 90 with heights ∝ 10 → 40. Growth form
 * (40/10)/(90/60) = 2.6667: severe; Tufte (30/10)/(30/60) = 6, GDI 500. */
static void test_area_off_zero(void **state) {
  (void)state;
  const double v[] = {60, 75, 90}, g[] = {10, 25, 40};
  pp_figure *fig = figure(PP_FIGURE_AREA, TRUE, PP_SCALE_LINEAR, 50, 100, 3, v, g, 50);
  GPtrArray *out = check(fig);
  const pp_finding *f = only(out, "area-off-zero");
  assert_float_equal(f->measures.growth_ratio, 4.0 / 1.5, 1e-9);
  assert_float_equal(f->measures.gdi, 500.0, 1e-9);
  assert_int_equal(f->severity, PP_SEVERITY_SEVERE);
  assert_string_equal(f->message,
                      "shows C 50% above A as 300% above: the filled area stands on 50, not 0; A "
                      "(60) to C (90): ink ×4 for value ×1.5 (Lie Factor 6.00, GDI +500%)");
  g_ptr_array_unref(out);
  pp_figure_free(fig);
}

/* Stacked columns on an axis from 40, 20 pt wide: bottom segments end at 80, 90, 100, 110,
 * the stack totals at 600, 640, 680, 720 (ink ∝ length above 40). Totals: growth form
 * (680/560)/(720/600) = 1.0119, Tufte ((680−560)/560)/((720−600)/600) = 1.071 (GDI +7%),
 * every pair within 1.05: inside the band. Bottom segments: (70/40)/(110/80) = 1.2727,
 * Tufte (30/40)/(30/80) = 2 (GDI +100%): outside, major (above 1.10, below 2). A stacked
 * area whose bottom layer has the same numbers gets the same measures: stacked bars and
 * stacked areas are judged on the layer standing on the floor. */
static void test_stacked_bottom_layer(void **state) {
  (void)state;
  const double bottom[] = {80, 90, 100, 110}, totals[] = {600, 640, 680, 720};
  double inks[4];
  for (guint i = 0; i < 4; i++)
    inks[i] = 20 * (totals[i] - 40);
  pp_figure *fig = figure(PP_FIGURE_COLUMN, TRUE, PP_SCALE_LINEAR, 40, 800, 4, totals, inks, 40);
  for (guint i = 0; i < 4; i++) {
    pp_element *e = &g_array_index(fig->elements, pp_element, i);
    g_array_set_size(e->parts, 0);
    pp_element_add_part(e, 3 * i, PP_PART_SEGMENT, 20 * (bottom[i] - 40));
    pp_element_add_part(e, 3 * i + 1, PP_PART_SEGMENT, 20 * (totals[i] - bottom[i]));
    pp_part *p = &g_array_index(e->parts, pp_part, 0);
    p->start = 40, p->end = bottom[i];
    e->stacked = TRUE;
  }
  GPtrArray *out = check(fig);
  const pp_finding *f = only(out, "bars-off-zero");
  assert_float_equal(f->measures.growth_ratio, 1.75 / 1.375, 1e-9);
  assert_float_equal(f->measures.gdi, 100.0, 1e-9);
  assert_int_equal(f->severity, PP_SEVERITY_MAJOR);
  double area_inks[4];
  for (guint i = 0; i < 4; i++)
    area_inks[i] = bottom[i] - 40;
  pp_figure *area =
      figure(PP_FIGURE_AREA, TRUE, PP_SCALE_LINEAR, 40, 800, 4, bottom, area_inks, 40);
  GPtrArray *area_out = check(area);
  const pp_finding *a = only(area_out, "area-off-zero");
  assert_float_equal(a->measures.growth_ratio, f->measures.growth_ratio, 1e-9);
  assert_float_equal(a->measures.gdi, f->measures.gdi, 1e-9);
  assert_int_equal(a->severity, f->severity);
  g_ptr_array_unref(area_out);
  pp_figure_free(area);
  g_ptr_array_unref(out);
  pp_figure_free(fig);
}

/* Selection by kind and judgement: a line chart on the same truncated scale, a bar
 * figure that was seen but not judged, and a single bar get no finding. */
static void test_selection(void **state) {
  (void)state;
  const double v[] = {410, 470}, g[] = {200, 1400};
  pp_figure *line = figure(PP_FIGURE_LINE, TRUE, PP_SCALE_LINEAR, 400, 480, 2, v, g, 400);
  pp_figure *unjudged = figure(PP_FIGURE_COLUMN, TRUE, PP_SCALE_LINEAR, 400, 480, 2, v, g, 400);
  unjudged->judged = FALSE;
  pp_figure *single = figure(PP_FIGURE_COLUMN, TRUE, PP_SCALE_LINEAR, 400, 480, 1, v, g, 400);
  pp_figure *figs[] = {line, unjudged, single};
  for (guint i = 0; i < G_N_ELEMENTS(figs); i++) {
    GPtrArray *out = check(figs[i]);
    assert_int_equal(out->len, 0);
    g_ptr_array_unref(out);
    pp_figure_free(figs[i]);
  }
  /* every rule in the table has an id, a summary, a doc anchor and judges some kind */
  guint n = 0;
  const pp_rule_info *info = pp_rules_list(&n);
  assert_int_equal(n, pp_n_rules + pp_n_opt_in_rules); /* the main table, then the opt-in */
  for (guint i = 0; i < n; i++) {
    assert_true(info[i].id && *info[i].id && info[i].summary && *info[i].summary);
    assert_non_null(info[i].doc);
    assert_true(info[i].opt_in == (i >= pp_n_rules));
    assert_true((i < pp_n_rules ? pp_rules[i].kinds : pp_opt_in_rules[i - pp_n_rules].rule.kinds) !=
                0);
  }
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_bars_off_zero),
      cmocka_unit_test(test_stacked_bottom_layer),
      cmocka_unit_test(test_zero_baseline_is_clean),
      cmocka_unit_test(test_major),
      cmocka_unit_test(test_labels_only_minor),
      cmocka_unit_test(test_labels_outrank_scale),
      cmocka_unit_test(test_bars_on_log),
      cmocka_unit_test(test_area_off_zero),
      cmocka_unit_test(test_selection),
  };
  return cmocka_run_group_tests_name("rules/table", tests, NULL, NULL);
}
