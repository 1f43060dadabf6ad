/* test_fund_rules.c — the fund past-performance checks on figures built by hand, against
 * the requirements of Commission Regulation (EU) No 583/2010, Annex III (points quoted in
 * docs/rules/fund-*.md) and the arithmetic of rounding: a return printed with one decimal
 * stands for any value within half a unit (0.05 points) of it. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <string.h>

#include <cmocka.h>

#include "rules/internal.h"

/* A linear axis of 0.1 point of return per page point, 0% at y = 200: y = 200 − 10·v. */
#define SLOPE (-0.1)
#define ZERO_Y 200.0

static pp_figure *fund_figure(guint n, const double *values, const char *const *labels,
                              int first_year) {
  pp_figure *fig = pp_figure_new(PP_FIGURE_COLUMN);
  fig->judged = TRUE;
  fig->bbox = (pp_rect){40, 40, 40 + 30.0 * n, 360};
  fig->scale = pp_scale_new(TRUE);
  fig->scale->slope = SLOPE;
  fig->scale->offset = -SLOPE * ZERO_Y;
  /* The visible range: the bars and 0% plus a tenth of their span, as plotting software
   * sets its limits. */
  double lo = 0, hi = 0;
  for (guint i = 0; i < n; i++)
    lo = fmin(lo, values[i]), hi = fmax(hi, values[i]);
  fig->scale->min_value = lo - 0.1 * (hi - lo);
  fig->scale->max_value = hi + 0.1 * (hi - lo);
  pp_tick tick = {ZERO_Y, 0, g_strdup("0%")};
  g_array_append_val(fig->scale->ticks, tick);
  for (guint i = 0; i < n; i++) {
    pp_element e = pp_element_init(PP_ENCODING_LENGTH);
    double tip = ZERO_Y - 10 * values[i];
    e.box = (pp_rect){50 + 30.0 * i, fmin(tip, ZERO_Y), 70 + 30.0 * i, fmax(tip, ZERO_Y)};
    e.shape.kind = PP_SHAPE_RECT;
    e.shape.rect = e.box;
    e.value = e.scale_value = values[i];
    e.source = PP_VALUE_SCALE;
    e.base_value = 0;
    e.ink = 20 * fabs(tip - ZERO_Y);
    e.extent = fabs(tip - ZERO_Y);
    e.category = g_strdup_printf("%d", first_year + (int)i);
    if (labels && labels[i]) {
      e.label_text = g_strdup(labels[i]);
      e.label_value = g_ascii_strtod(labels[i], NULL);
    }
    pp_element_add_part(&e, i, PP_PART_BODY, e.ink);
    g_array_append_val(fig->elements, e);
  }
  fig->n_series = 1;
  return fig;
}

static GPtrArray *check(const pp_figure *fig, gboolean fund_profile) {
  pp_thresholds t = pp_thresholds_default();
  if (fund_profile) {
    static const char *ids[] = {"fund-log-axis",       "fund-axis-off-zero",   "fund-label-missing",
                                "fund-label-decimals", "fund-bar-clipped",     "fund-label-vs-bar",
                                "fund-years",          "fund-scale-compressed"};
    for (guint i = 0; i < G_N_ELEMENTS(ids); i++)
      assert_true(pp_thresholds_enable_rule(&t, ids[i]));
  }
  GPtrArray *findings = g_ptr_array_new_with_free_func((GDestroyNotify)pp_finding_free);
  pp_rules_check_figure(fig, &t, findings);
  return findings;
}

/* The rule ids found, joined with spaces ("" for none). */
static char *found(GPtrArray *findings) {
  GString *s = g_string_new(NULL);
  for (guint i = 0; i < findings->len; i++)
    g_string_append_printf(s, "%s%s", i ? " " : "",
                           ((pp_finding *)g_ptr_array_index(findings, i))->rule);
  g_ptr_array_unref(findings);
  return g_string_free(s, FALSE);
}

static void expect(pp_figure *fig, gboolean fund_profile, const char *want) {
  char *got = found(check(fig, fund_profile));
  assert_string_equal(got, want);
  g_free(got);
  pp_figure_free(fig);
}

static const double returns[5] = {6.4, -3.2, 11.8, 4.1, -7.5};
static const char *printed[5] = {"6.4%", "-3.2%", "11.8%", "4.1%", "-7.5%"};

static void test_compliant(void **state) {
  (void)state;
  expect(fund_figure(5, returns, printed, 2026), TRUE, "");
  /* Opt-in: without the profile no fund check runs. */
  expect(fund_figure(5, returns, NULL, 2026), FALSE, "");
}

/* Annex III point 4 and the rounding of a one-decimal label (±0.05) plus a quarter point
 * of drawing (0.025 here): a bar at 6.47 is "6.4%", at 6.48 it is not. */
static void test_label_rounding(void **state) {
  (void)state;
  double v[5] = {6.47, -3.2, 11.8, 4.1, -7.5};
  expect(fund_figure(5, v, printed, 2026), TRUE, "");
  v[0] = 6.48;
  expect(fund_figure(5, v, printed, 2026), TRUE, "fund-label-vs-bar");
}

/* Annex III point 5: exactly one decimal ("6.0%" has one, "6%" none, "6.43%" two). */
static void test_decimals(void **state) {
  (void)state;
  double v[2] = {6.0, 6.43};
  const char *ok[2] = {"6.0%", "6.4%"}, *none[2] = {"6%", "6.4%"}, *two[2] = {"6.0%", "6.43%"};
  expect(fund_figure(2, v, ok, 2029), TRUE, "");
  expect(fund_figure(2, v, none, 2029), TRUE, "fund-label-decimals");
  expect(fund_figure(2, v, two, 2029), TRUE, "fund-label-decimals");
}

/* Annex III point 4: a bar without its label. */
static void test_missing_label(void **state) {
  (void)state;
  const char *some[5] = {"6.4%", "-3.2%", NULL, "4.1%", "-7.5%"};
  expect(fund_figure(5, returns, some, 2026), TRUE, "fund-label-missing");
}

/* Annex III point 2: the axis ends at -5%, a -7.5% year drawn to the frame (value at the
 * range end) and labelled beyond it. Only the cut is reported, not the label. */
static void test_clipped(void **state) {
  (void)state;
  pp_figure *fig = fund_figure(5, returns, printed, 2026);
  fig->scale->min_value = -5;
  pp_element *e = &g_array_index(fig->elements, pp_element, 4);
  e->value = e->scale_value = -5;
  expect(fig, TRUE, "fund-bar-clipped");
}

/* Annex III point 1: a log axis; the fund finding replaces bars-on-log. */
static void test_log_axis_replaces(void **state) {
  (void)state;
  double v[3] = {2.0, 8.0, 30.0};
  const char *l[3] = {"2.0%", "8.0%", "30.0%"};
  pp_figure *fig = fund_figure(3, v, l, 2028), *plain = fund_figure(3, v, l, 2028);
  /* On a log axis from 1% a bar's length stands for log10(v): ink 100·log10(v). */
  for (guint i = 0; i < 3; i++) {
    g_array_index(fig->elements, pp_element, i).ink = 100 * log10(v[i]);
    g_array_index(plain->elements, pp_element, i).ink = 100 * log10(v[i]);
  }
  fig->scale->kind = plain->scale->kind = PP_SCALE_LOG;
  expect(plain, FALSE, "bars-on-log");
  expect(fig, TRUE, "fund-log-axis");
}

/* Annex III point 2: returns of -7.5% to 11.8% on an axis from -60% to 60% fill 16% of
 * it, under the third the check asks for. */
static void test_compressed(void **state) {
  (void)state;
  pp_figure *fig = fund_figure(5, returns, printed, 2026);
  fig->scale->min_value = -60;
  fig->scale->max_value = 60;
  expect(fig, TRUE, "fund-scale-compressed");
}

/* Article 15 (from memory): more than ten years. */
static void test_eleven_years(void **state) {
  (void)state;
  double v[11];
  for (int i = 0; i < 11; i++)
    v[i] = 1 + i;
  pp_figure *fig = fund_figure(11, v, NULL, 2020);
  for (guint i = 0; i < 11; i++) {
    pp_element *e = &g_array_index(fig->elements, pp_element, i);
    e->label_value = v[i];
    e->label_text = g_strdup_printf("%.1f%%", v[i]);
  }
  expect(fig, TRUE, "fund-years");
}

/* Not a past-performance chart: categories are not years. */
static void test_not_yearly(void **state) {
  (void)state;
  pp_figure *fig = fund_figure(5, returns, (const char *const *)printed, 2026);
  for (guint i = 0; i < 5; i++) {
    pp_element *e = &g_array_index(fig->elements, pp_element, i);
    g_free(e->category);
    e->category = g_strdup_printf("Region %u", i);
    g_free(e->label_text);
    e->label_text = g_strdup("6.43%");
  }
  expect(fig, TRUE, "");
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_compliant),    cmocka_unit_test(test_label_rounding),
      cmocka_unit_test(test_decimals),     cmocka_unit_test(test_missing_label),
      cmocka_unit_test(test_clipped),      cmocka_unit_test(test_log_axis_replaces),
      cmocka_unit_test(test_eleven_years), cmocka_unit_test(test_compressed),
      cmocka_unit_test(test_not_yearly),
  };
  return cmocka_run_group_tests_name("rules/fund", tests, NULL, NULL);
}
