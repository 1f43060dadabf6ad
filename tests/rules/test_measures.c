/* test_measures.c — the scoring formulas against their published definitions and
 * the check values the issue gives. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "rules/internal.h"

/* Tufte (1983), The Visual Display of Quantitative Information, p. 57: lie factor =
 * size of effect in graphic / size of effect in data, effect = (second − first)/first.
 * Bars 100 → 120 on an axis from 80 are drawn 20 → 40 long: graphic effect 1.0, data
 * effect 0.2, lie factor 5.0. GDI (Steinbart 1989) = 100·(a/b − 1) = 400. */
static void test_truncated_check_value(void **state) {
  (void)state;
  assert_true(fabs(pp_lie_factor(100, 120, 20, 40) - 5.0) < 1e-12);
  assert_true(fabs(pp_gdi(100, 120, 20, 40) - 400.0) < 1e-9);
  /* growth-factor form on the same bars: (40/20)/(120/100) */
  assert_true(fabs(pp_ink_growth_ratio(100, 120, 20, 40) - 2.0 / 1.2) < 1e-12);
}

/* A value 1.08× an earlier one drawn with 2.7× the ink: lie factor ≈ 2.5 under the
 * growth-factor definition (a commonly cited case: common practice, no source). */
static void test_growth_case(void **state) {
  (void)state;
  double lf = pp_ink_growth_ratio(1.0, 1.08, 1.0, 2.7);
  assert_true(fabs(lf - 2.5) < 1e-9);
}

/* Honest ink (proportional to value) gives 1 under both definitions and GDI 0:
 * Tufte's band 0.95–1.05 is centred on 1. */
static void test_honest_is_one(void **state) {
  (void)state;
  assert_true(fabs(pp_ink_growth_ratio(30, 75, 3, 7.5) - 1) < 1e-12);
  assert_true(fabs(pp_lie_factor(30, 75, 3, 7.5) - 1) < 1e-12);
  assert_true(fabs(pp_gdi(30, 75, 3, 7.5)) < 1e-9);
  assert_true(isnan(pp_lie_factor(5, 5, 1, 2))); /* no change in data: undefined */
}

static void test_measures_pairs(void **state) {
  (void)state;
  /* Bars 410, 440, 470 from a baseline of 400: ink ∝ 10, 40, 70. */
  double v[3] = {410, 440, 470}, g[3] = {10, 40, 70};
  guint s[3] = {0, 0, 0};
  pp_measures m;
  pp_measures_compute(v, g, s, 3, 400, &m);
  assert_true(fabs(m.growth_ratio - (70.0 / 10) / (470.0 / 410)) < 1e-12);
  assert_true(fabs(m.max_pair_departure - (70.0 / 10) / (470.0 / 410)) < 1e-12);
  assert_int_equal(m.pair_i, 2);
  assert_int_equal(m.pair_j, 0);
}

static void test_format(void **state) {
  (void)state;
  char *a = pp_format_value(30000), *b = pp_format_value(1.08), *c = pp_format_value(-1234567);
  assert_string_equal(a, "30,000");
  assert_string_equal(b, "1.08");
  assert_string_equal(c, "-1,234,567");
  g_free(a), g_free(b), g_free(c);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_truncated_check_value),
      cmocka_unit_test(test_growth_case),
      cmocka_unit_test(test_honest_is_one),
      cmocka_unit_test(test_measures_pairs),
      cmocka_unit_test(test_format),
  };
  return cmocka_run_group_tests_name("rules/measures", tests, NULL, NULL);
}
