/* test_pathological.c — fills that once took minutes (issue 12): a many-turn arc found by
 * the fuzzer, a self-intersecting polygon of random points, a path of random curves, chains
 * of swinging curves like the fuzzer's slow crossings inputs and a path of thousands of
 * separate circles. Each must give cairo's pixel count (or πr²);
 * meson's timeout for this file (tests/geometry/meson.build) is the speed check. */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "geometry/internal.h"
#include "test_util.h"

#define SCALE 2
#define SIZE 600 /* scene is [0, SIZE]² points */

/* Σ alpha/255 of cairo's fill under the rule, at SCALE pixels a point, in pt². */
static double cairo_ink(const pp_path *p, pp_fill_rule rule) {
  cairo_t *cr = tu_coverage_begin(SIZE, SCALE);
  tu_path_to_cairo(cr, p);
  cairo_set_fill_rule(cr, tu_cairo_rule(rule));
  cairo_fill(cr);
  return tu_coverage_end(cr);
}

/* tests/fuzz/known/scene-slow-clip-area.bin: cairo_arc(0, 48.3125, 110, 4, 40), about
 * 5.7 turns of one circle, then a stray move, filled. Nonzero: every point inside winds
 * 5 or 6 times, so the disc, πr² within cairo's arc tolerance (cairo_set_tolerance, cairo
 * API docs) over the circumference. Even-odd against cairo's pixels (within 1%, as in
 * test_raster.c: antialiasing at 2 px a point; common practice, no source). */
static void test_many_turn_arc(void **state) {
  (void)state;
  cairo_t *cr = tu_path_context();
  /* moved by (300, 300) onto the raster; areas do not move */
  cairo_arc(cr, 300, 348.3125, 110, 4, 40);
  cairo_move_to(cr, 444.25, 296.5);
  pp_path *p = tu_path_from_cairo(cr);
  double r = 110, tol = cairo_get_tolerance(cr);
  tu_assert_near(pp_path_fill_area(p, PP_FILL_NONZERO), G_PI * r * r, 2 * G_PI * r * tol);
  double want = cairo_ink(p, PP_FILL_EVEN_ODD);
  tu_assert_near(pp_path_fill_area(p, PP_FILL_EVEN_ODD), want, 0.01 * want);
  pp_path_free(p);
  cairo_destroy(cr);
}

/* 1,500 random points joined in one polygon: ~10⁵ self-crossings. */
static void test_random_polygon(void **state) {
  (void)state;
  GRand *rng = g_rand_new_with_seed(12);
  pp_path *p = pp_path_new();
  tu_random_ring(p, rng, 1500, 50, 550);
  for (int rule = 0; rule < 2; rule++) {
    double want = cairo_ink(p, rule);
    tu_assert_near(pp_path_fill_area(p, rule), want, 0.01 * want);
  }
  pp_path_free(p);
  g_rand_free(rng);
}

/* 60 random cubics in one closed path: thousands of curve–curve crossings. */
static void test_random_curves(void **state) {
  (void)state;
  GRand *rng = g_rand_new_with_seed(7);
  pp_path *p = pp_path_new();
  tu_random_curvy(p, rng, 60, 50, 550);
  for (int rule = 0; rule < 2; rule++) {
    double want = cairo_ink(p, rule);
    tu_assert_near(pp_path_fill_area(p, rule), want, 0.01 * want);
  }
  pp_path_free(p);
  g_rand_free(rng);
}

/* Chains of cubics, each swinging across the whole width while it climbs a sliver of the
 * height; each chain is one subpath, closed by the fill. */
static pp_path *swinging_chains(GRand *rng, int chains, int links) {
  pp_path *p = pp_path_new();
  for (int c = 0; c < chains; c++) {
    double y = g_rand_double_range(rng, 50, 100), dy = (500 - y) / links;
    pp_path_move_to(p, g_rand_double_range(rng, 50, 550), y);
    for (int i = 0; i < links; i++, y += dy)
      pp_path_curve_to(p, g_rand_double_range(rng, 50, 550), y + dy / 3,
                       g_rand_double_range(rng, 50, 550), y + 2 * dy / 3,
                       g_rand_double_range(rng, 50, 550), y + dy);
  }
  return p;
}

/* The shape of the fuzzer's slow crossings inputs (tests/fuzz/known/scene-slow-crossings*.bin:
 * about 20 overlapping chains of 900 cubics, each cubic swinging across the whole width
 * while it climbs a sliver of the height): 20 chains of 600 such cubics, ~2.7·10⁵
 * crossings between nearly level pieces. Each chain is one subpath, closed by the fill.
 * Against cairo's pixels within 1%, as test_random_curves. */
static void test_swinging_chains(void **state) {
  (void)state;
  GRand *rng = g_rand_new_with_seed(3);
  pp_path *p = swinging_chains(rng, 20, 600);
  for (int rule = 0; rule < 2; rule++) {
    double want = cairo_ink(p, rule);
    tu_assert_near(pp_path_fill_area(p, rule), want, 0.01 * want);
  }
  pp_path_free(p);
  g_rand_free(rng);
}

/* The curve-crossing bound (MAX_CURVE_SWAPS in src/geometry/clip_area.c): the fuzzer's
 * slowest input under its old arc rule (~18,000 swinging cubics) ran for
 * minutes before the sweep gave up. A smaller fill of the same shape, 20 chains of 100
 * cubics, measured with a bound under its crossings is NaN ("not measurable", never a
 * guess); with a bound above them it is cairo's pixel count within 1%, as
 * test_swinging_chains. */
static void test_curve_swap_bound(void **state) {
  (void)state;
  GRand *rng = g_rand_new_with_seed(5);
  pp_path *p = swinging_chains(rng, 20, 100);
  pp_region reg = {p, PP_FILL_NONZERO, pp_path_bbox(p)};
  assert_true(isnan(pp_sweep_area_bounded(&reg, 1, 1000)));
  double want = cairo_ink(p, PP_FILL_NONZERO);
  tu_assert_near(pp_sweep_area_bounded(&reg, 1, 100000000), want, 0.01 * want);
  tu_assert_near(pp_path_fill_area(p, PP_FILL_NONZERO), want, 0.01 * want);
  pp_path_free(p);
  g_rand_free(rng);
}

/* 40,000 separate circles of radius 1 in one path: 40,000 πr² within cairo's tolerance,
 * which applies in device space, here 100 units a point (so the arcs get fine pieces). */
static void test_many_circles(void **state) {
  (void)state;
  cairo_t *cr = tu_path_context();
  cairo_scale(cr, 100, 100);
  int n = 0;
  for (int i = 0; i < 200; i++)
    for (int j = 0; j < 200; j++, n++) {
      cairo_new_sub_path(cr);
      cairo_arc(cr, 3 * i + 1.5, 3 * j + 1.5, 1, 0, 2 * G_PI);
    }
  pp_path *p = tu_path_from_cairo(cr);
  double tol = cairo_get_tolerance(cr) / 100;
  tu_assert_near(pp_path_fill_area(p, PP_FILL_NONZERO), n * G_PI, n * 2 * G_PI * tol);
  pp_path_free(p);
  cairo_destroy(cr);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_many_turn_arc), cmocka_unit_test(test_random_polygon),
      cmocka_unit_test(test_random_curves), cmocka_unit_test(test_swinging_chains),
      cmocka_unit_test(test_many_circles),  cmocka_unit_test(test_curve_swap_bound),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
