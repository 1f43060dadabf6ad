/* test_degenerate.c — robustness: empty and move-only paths, zero-length and collinear
 * segments, huge coordinates, NaN, and a 200k-segment polygon; plus rectangle detection,
 * bounding boxes and flattening. */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "test_util.h"

/* Shoelace area of a simple polygon (Gauss's area formula), computed here independently. */
static double shoelace(const double *x, const double *y, size_t n) {
  double s = 0;
  for (size_t i = 0; i < n; i++) {
    size_t j = (i + 1) % n;
    s += x[i] * y[j] - x[j] * y[i];
  }
  return 0.5 * s;
}

static void test_empty_and_moves(void **state) {
  (void)state;
  g_autoptr(pp_path) p = pp_path_new();
  /* Nothing painted: zero area and length, empty box (definition of an empty fill). */
  tu_assert_near(pp_path_signed_area(p), 0, 0);
  tu_assert_near(pp_path_fill_area(p, PP_FILL_NONZERO), 0, 0);
  tu_assert_near(pp_path_length(p), 0, 0);
  assert_true(pp_rect_is_empty(pp_path_bbox(p)));
  pp_path_move_to(p, 10, 10);
  pp_path_move_to(p, 50, 70);
  pp_path_move_to(p, 1e7, -3);
  tu_assert_near(pp_path_fill_area(p, PP_FILL_EVEN_ODD), 0, 0);
  tu_assert_near(pp_path_length(p), 0, 0);
  assert_true(pp_rect_is_empty(pp_path_bbox(p)));
  GPtrArray *polys = pp_path_flatten(p, 0.1);
  assert_int_equal(polys->len, 0);
  g_ptr_array_unref(polys);
  assert_false(pp_path_is_rectangle(p, 0, NULL));
}

static void test_zero_length_and_collinear(void **state) {
  (void)state;
  g_autoptr(pp_path) p = pp_path_new();
  /* Triangle (0,0) (40,0) (0,30) with repeated, collinear and zero-length pieces:
   * area ½·40·30 = 600 (elementary geometry), perimeter 40 + 30 + 50. */
  pp_path_move_to(p, 0, 0);
  pp_path_line_to(p, 0, 0);
  pp_path_line_to(p, 20, 0);
  pp_path_line_to(p, 20, 0);
  pp_path_curve_to(p, 20, 0, 20, 0, 20, 0);
  pp_path_line_to(p, 40, 0);
  pp_path_curve_to(p, 30, 7.5, 20, 15, 0, 30); /* a straight cubic along the hypotenuse */
  pp_path_close(p);
  tu_assert_near(fabs(pp_path_signed_area(p)), 600, 1e-9);
  tu_assert_near(pp_path_fill_area(p, PP_FILL_NONZERO), 600, 1e-9);
  tu_assert_near(pp_path_fill_area(p, PP_FILL_EVEN_ODD), 600, 1e-9);
  tu_assert_near(pp_path_length(p), 120, 1e-9);

  /* A degenerate "polygon" on one line encloses nothing. */
  g_autoptr(pp_path) line = pp_path_new();
  pp_path_move_to(line, 0, 0);
  pp_path_line_to(line, 10, 10);
  pp_path_line_to(line, 20, 20);
  pp_path_line_to(line, 5, 5);
  pp_path_close(line);
  tu_assert_near(pp_path_fill_area(line, PP_FILL_NONZERO), 0, 1e-9);
  tu_assert_near(pp_path_signed_area(line), 0, 1e-9);

  /* The same square twice: nonzero covers it once, even-odd cancels (fill-rule
   * definitions, ISO 32000-1 §8.5.3.3). */
  g_autoptr(pp_path) twice = pp_path_new();
  pp_path_rectangle(twice, 0, 0, 10, 10);
  pp_path_rectangle(twice, 0, 0, 10, 10);
  tu_assert_near(pp_path_fill_area(twice, PP_FILL_NONZERO), 100, 1e-9);
  tu_assert_near(pp_path_fill_area(twice, PP_FILL_EVEN_ODD), 0, 1e-9);
  /* Square with a reversed inner square: a hole under both rules (ISO 32000-1 §8.5.3.3). */
  g_autoptr(pp_path) hole = pp_path_new();
  pp_path_rectangle(hole, 0, 0, 10, 10);
  pp_path_rectangle(hole, 7, 3, -4, 4);
  tu_assert_near(pp_path_fill_area(hole, PP_FILL_NONZERO), 84, 1e-9);
  tu_assert_near(pp_path_fill_area(hole, PP_FILL_EVEN_ODD), 84, 1e-9);
  /* Same orientation inner square: filled under nonzero, hole under even-odd. */
  g_autoptr(pp_path) nested = pp_path_new();
  pp_path_rectangle(nested, 0, 0, 10, 10);
  pp_path_rectangle(nested, 3, 3, 4, 4);
  tu_assert_near(pp_path_fill_area(nested, PP_FILL_NONZERO), 100, 1e-9);
  tu_assert_near(pp_path_fill_area(nested, PP_FILL_EVEN_ODD), 84, 1e-9);
  /* Five-point star {5/2}: nonzero fills the pentagon core, even-odd leaves it empty;
   * checked against the star's closed form below (regular star polygon geometry). */
  g_autoptr(pp_path) star = pp_path_new();
  double R = 50;
  for (int k = 0; k < 5; k++) {
    double a = -G_PI / 2 + k * 4 * G_PI / 5;
    if (k == 0)
      pp_path_move_to(star, R * cos(a), R * sin(a));
    else
      pp_path_line_to(star, R * cos(a), R * sin(a));
  }
  pp_path_close(star);
  /* Inner pentagon circumradius r = R·cos(2π/5)/cos(π/5); area of the star outline is
   * 5 tips + core; a regular pentagon with circumradius ρ has area (5/2)ρ² sin(72°). */
  double r = R * cos(2 * G_PI / 5) / cos(G_PI / 5);
  double core = 2.5 * r * r * sin(2 * G_PI / 5);
  double outline = 5 * 0.5 * R * r * sin(G_PI / 5) * 2; /* 10 triangles centre–R–r */
  tu_assert_near(pp_path_fill_area(star, PP_FILL_NONZERO), outline, 1e-9 * outline);
  tu_assert_near(pp_path_fill_area(star, PP_FILL_EVEN_ODD), outline - core, 1e-9 * outline);
}

static void test_huge_coordinates(void **state) {
  (void)state;
  GRand *rng = g_rand_new_with_seed(99);
  for (int i = 0; i < 20; i++) {
    g_autoptr(pp_path) p = pp_path_new();
    tu_random_ring(p, rng, 7, 0, 100);
    double offset = i % 2 ? 1e7 : 1e6;
    g_autoptr(pp_path) far = pp_path_copy(p);
    pp_path_transform(far, (pp_matrix){1, 0, 0, 1, offset, -offset});
    /* Area is translation invariant (elementary geometry), so the far copy must agree. */
    for (int rule = 0; rule < 2; rule++) {
      double a = pp_path_fill_area(p, rule), b = pp_path_fill_area(far, rule);
      tu_assert_near(a, b, 1e-6 * fmax(a, 1));
    }
    double sa = pp_path_signed_area(p), sb = pp_path_signed_area(far);
    tu_assert_near(sa, sb, 1e-6 * fmax(fabs(sa), 1));
  }
  /* A 3 × 2 bar at 1e7: exact rectangle area (w·h). */
  g_autoptr(pp_path) bar = pp_path_new();
  pp_path_rectangle(bar, 1e7, 1e7, 3, 2);
  pp_path *clip_rect = pp_path_new();
  pp_path_rectangle(clip_rect, 1e7 + 1, 0, 10, 2e7);
  g_autoptr(pp_clip) clip = pp_clip_new(NULL, clip_rect, PP_FILL_NONZERO);
  tu_assert_near(pp_path_fill_area(bar, PP_FILL_NONZERO), 6, 1e-6);
  tu_assert_near(pp_path_clipped_area(bar, PP_FILL_NONZERO, clip), 4, 1e-6);
  g_rand_free(rng);
}

static void test_nan(void **state) {
  (void)state;
  g_autoptr(pp_path) p = pp_path_new();
  pp_path_move_to(p, 0, 0);
  pp_path_line_to(p, NAN, 5);
  pp_path_line_to(p, 5, 5);
  pp_path_close(p);
  /* Documented contract (docs/geometry.md): non-finite input gives NaN, never a hang. */
  assert_true(isnan(pp_path_fill_area(p, PP_FILL_NONZERO)));
  assert_true(isnan(pp_path_signed_area(p)));
  assert_true(isnan(pp_path_length(p)));
  assert_true(pp_rect_is_empty(pp_path_bbox(p)));
  pp_path *ok = pp_path_new();
  pp_path_rectangle(ok, 0, 0, 1, 1);
  g_autoptr(pp_clip) clip = pp_clip_new(NULL, pp_path_copy(p), PP_FILL_NONZERO);
  assert_true(isnan(pp_path_clipped_area(ok, PP_FILL_NONZERO, clip)));
  assert_true(isnan(pp_path_clipped_length(ok, clip)));
  pp_path_line_to(ok, INFINITY, 0);
  assert_true(isnan(pp_path_fill_area(ok, PP_FILL_NONZERO)));
  pp_path_free(ok);
}

static void test_200k_polygon(void **state) {
  (void)state;
  /* Area chart: random-walk top edge over a flat baseline, so the polygon is simple and
   * its area is the shoelace sum (computed independently above). */
  const size_t n = 200000;
  double *x = g_new(double, n + 2), *y = g_new(double, n + 2);
  GRand *rng = g_rand_new_with_seed(5);
  double v = 250;
  for (size_t i = 0; i < n; i++) {
    v += g_rand_double_range(rng, -3, 3);
    v = CLAMP(v, 1, 499);
    x[i] = i * (1000.0 / n), y[i] = v;
  }
  x[n] = x[n - 1], y[n] = 500, x[n + 1] = 0, y[n + 1] = 500;
  g_autoptr(pp_path) p = pp_path_new();
  for (size_t i = 0; i < n + 2; i++)
    (i ? pp_path_line_to : pp_path_move_to)(p, x[i], y[i]);
  pp_path_close(p);
  double want = fabs(shoelace(x, y, n + 2));
  gint64 t0 = g_get_monotonic_time();
  double got = pp_path_fill_area(p, PP_FILL_NONZERO);
  gint64 t1 = g_get_monotonic_time();
  pp_path *r = pp_path_new();
  pp_path_rectangle(r, 100, 100, 700, 300);
  g_autoptr(pp_clip) clip = pp_clip_new(NULL, r, PP_FILL_NONZERO);
  double clipped = pp_path_clipped_area(p, PP_FILL_EVEN_ODD, clip);
  gint64 t2 = g_get_monotonic_time();
  double len = pp_path_clipped_length(p, clip);
  gint64 t3 = g_get_monotonic_time();
  print_message("200k polygon: fill %.3f s, clipped fill %.3f s, clipped length %.3f s\n",
                (t1 - t0) / 1e6, (t2 - t1) / 1e6, (t3 - t2) / 1e6);
  tu_assert_near(got, want, 1e-9 * want);
  /* Clipped to x∈[100,800], y∈[100,400]: the part of the chart below y = 100 is the
   * integral of min(·) — computed here by clipping each trapezoid column exactly. */
  double ref = 0;
  for (size_t i = 0; i + 1 < n; i++) {
    double xa = fmax(x[i], 100), xb = fmin(x[i + 1], 800);
    if (xb <= xa)
      continue;
    /* Column between xa and xb: filled from top y(x) to 500, clipped to [100, 400]. The
     * top is linear; integrate the clamped height with fine midpoint steps. */
    const int k = 8;
    for (int j = 0; j < k; j++) {
      double xm = xa + (j + 0.5) * (xb - xa) / k;
      double tt = (xm - x[i]) / (x[i + 1] - x[i]);
      double top = y[i] + tt * (y[i + 1] - y[i]);
      double h = 400 - fmax(top, 100);
      ref += fmax(h, 0) * (xb - xa) / k;
    }
  }
  /* Midpoint rule is exact for linear pieces except where a clamp kinks a column. */
  tu_assert_near(clipped, ref, 1e-4 * ref);
  assert_true(len > 0 && len < pp_path_length(p));
  g_rand_free(rng);
  g_free(x);
  g_free(y);
}

static void test_rectangles_and_boxes(void **state) {
  (void)state;
  pp_rect r;
  g_autoptr(pp_path) five = pp_path_new();
  /* Counter-clockwise 5-point outline with a collinear midpoint and a closing point. */
  pp_path_move_to(five, 10, 10);
  pp_path_line_to(five, 10, 30);
  pp_path_line_to(five, 25, 30);
  pp_path_line_to(five, 40, 30);
  pp_path_line_to(five, 40, 10);
  pp_path_line_to(five, 10, 10);
  assert_true(pp_path_is_rectangle(five, 1e-9, &r));
  tu_assert_near(pp_rect_area(r), 600, 1e-9);
  g_autoptr(pp_path) tilted = pp_path_new();
  pp_path_move_to(tilted, 0, 5);
  pp_path_line_to(tilted, 5, 0);
  pp_path_line_to(tilted, 10, 5);
  pp_path_line_to(tilted, 5, 10);
  pp_path_close(tilted);
  assert_false(pp_path_is_rectangle(tilted, 1e-6, NULL)); /* a diamond is not axis-aligned */
  g_autoptr(pp_path) bowtie = pp_path_new();
  pp_path_move_to(bowtie, 0, 0);
  pp_path_line_to(bowtie, 10, 0);
  pp_path_line_to(bowtie, 0, 10);
  pp_path_line_to(bowtie, 10, 10);
  pp_path_close(bowtie);
  assert_false(pp_path_is_rectangle(bowtie, 1e-6, NULL));
  /* Bowtie: two triangles of 25 each under both rules (the crossing splits it). */
  tu_assert_near(pp_path_fill_area(bowtie, PP_FILL_NONZERO), 50, 1e-9);
  tu_assert_near(pp_path_signed_area(bowtie), 0, 1e-9);
  g_autoptr(pp_path) wobbly = pp_path_new();
  pp_path_move_to(wobbly, 0, 0);
  pp_path_line_to(wobbly, 10, 1e-4);
  pp_path_line_to(wobbly, 10, 10);
  pp_path_line_to(wobbly, 0, 10);
  assert_true(pp_path_is_rectangle(wobbly, 1e-3, NULL));
  assert_false(pp_path_is_rectangle(wobbly, 1e-6, NULL));

  /* Cubic (0,0) (0,100) (100,100) (100,0): the peak is B(½) = (P0 + 3P1 + 3P2 + P3)/8,
   * y = 75 (de Casteljau midpoint formula). */
  g_autoptr(pp_path) arch = pp_path_new();
  pp_path_move_to(arch, 0, 0);
  pp_path_curve_to(arch, 0, 100, 100, 100, 100, 0);
  pp_rect b = pp_path_bbox(arch);
  tu_assert_near(b.y1, 75, 1e-12);
  tu_assert_near(b.x0, 0, 0);
  tu_assert_near(b.x1, 100, 0);
  /* Area under it by Green: ∫ x dy in closed form = 3/5 · 100 · 100 · ... computed as
   * (3/20)·(…) ; for this symmetric arch the enclosed area is 6/10 of the 100×100 box. */
  tu_assert_near(pp_path_fill_area(arch, PP_FILL_NONZERO), 6000, 1e-9);
  GPtrArray *polys = pp_path_flatten(arch, 0.01);
  assert_int_equal(polys->len, 1);
  GArray *poly = polys->pdata[0];
  assert_true(poly->len > 10);
  /* Flattened vertices are points of the curve, so they stay inside the exact bbox. */
  for (guint i = 0; i < poly->len; i++)
    assert_true(g_array_index(poly, pp_point, i).y <= 75 + 1e-12);
  g_ptr_array_unref(polys);
  pp_path *c1 = pp_path_new(), *c2 = pp_path_new();
  pp_path_rectangle(c1, 0, 0, 50, 50);
  pp_path_rectangle(c2, 25, 10, 50, 50);
  pp_clip *outer = pp_clip_new(NULL, c1, PP_FILL_NONZERO);
  g_autoptr(pp_clip) chain = pp_clip_new(outer, c2, PP_FILL_NONZERO);
  pp_clip_unref(outer);
  pp_rect cb = pp_clip_bbox(chain);
  tu_assert_near(cb.x0, 25, 0);
  tu_assert_near(cb.y1, 50, 0);
  assert_true(isinf(pp_clip_bbox(NULL).x1));
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_empty_and_moves),  cmocka_unit_test(test_zero_length_and_collinear),
      cmocka_unit_test(test_huge_coordinates), cmocka_unit_test(test_nan),
      cmocka_unit_test(test_200k_polygon),     cmocka_unit_test(test_rectangles_and_boxes),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
