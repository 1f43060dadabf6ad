/* test_pieces.c — the fast paths of the area code: convex outlines measured by their
 * signed area, fills of many separate subpaths cut into groups, a prepared clip reused
 * by many marks, and pathological fills that must finish quickly (issue 12). Each area
 * is checked against cairo's rasteriser or a textbook formula, never against itself. */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "geometry/internal.h"
#include "test_util.h"

#define SCALE 4
#define SIZE 200 /* scene is [0, SIZE]² points */

/* Σ alpha/255 of cairo's fill under the rule and an optional clip path (nonzero), pt². */
static double cairo_ink(const pp_path *p, pp_fill_rule rule, const pp_path *clip) {
  cairo_t *cr = tu_coverage_begin(SIZE, SCALE);
  if (clip) {
    tu_path_to_cairo(cr, clip);
    cairo_clip(cr);
  }
  tu_path_to_cairo(cr, p);
  cairo_set_fill_rule(cr, tu_cairo_rule(rule));
  cairo_fill(cr);
  return tu_coverage_end(cr);
}

static pp_path *poly(const double *xy, int n) {
  pp_path *p = pp_path_new();
  pp_path_move_to(p, xy[0], xy[1]);
  for (int i = 1; i < n; i++)
    pp_path_line_to(p, xy[2 * i], xy[2 * i + 1]);
  pp_path_close(p);
  return p;
}

/* Convexity by construction (definitions of a convex polygon; Bernstein's variation
 * diminishing property for the curves). */
static void test_convex(void **state) {
  (void)state;
  static const double square[] = {0, 0, 4, 0, 4, 3, 0, 3};
  static const double collinear[] = {0, 0, 2, 0, 4, 0, 4, 3, 0, 3};
  static const double lshape[] = {0, 0, 4, 0, 4, 1, 1, 1, 1, 3, 0, 3};
  static const double bowtie[] = {0, 0, 4, 3, 4, 0, 0, 3};
  static const double twice[] = {0, 0, 4, 0, 4, 3, 0, 3, 0, 0, 4, 0, 4, 3, 0, 3};
  double star[10];
  for (int i = 0; i < 5; i++) /* {5/2} pentagram: turns one way, twice around */
    star[2 * i] = 50 + 40 * cos(4 * G_PI * i / 5),
             star[2 * i + 1] = 50 + 40 * sin(4 * G_PI * i / 5);
  struct {
    const double *xy;
    int n;
    gboolean convex;
  } cases[] = {{square, 4, TRUE},  {collinear, 5, TRUE}, {lshape, 6, FALSE},
               {bowtie, 4, FALSE}, {twice, 8, FALSE},    {star, 5, FALSE}};
  for (size_t i = 0; i < G_N_ELEMENTS(cases); i++) {
    pp_path *p = poly(cases[i].xy, cases[i].n);
    if (pp_path_is_convex(p) != cases[i].convex)
      fail_msg("case %zu: convex %d, want %d", i, !cases[i].convex, cases[i].convex);
    pp_path_free(p);
  }
  /* Shoelace: the 4×3 rectangle has area 12 under both rules. */
  pp_path *p = poly(square, 4);
  tu_assert_near(pp_path_fill_area(p, PP_FILL_EVEN_ODD), 12, 1e-12);
  pp_path_free(p);
  /* A pentagram under even-odd leaves its centre empty: cairo's pixel count decides. */
  p = poly(star, 5);
  for (int rule = 0; rule < 2; rule++) {
    double want = cairo_ink(p, rule, NULL);
    tu_assert_near(pp_path_fill_area(p, rule), want, 0.01 * want);
  }
  pp_path_free(p);
  /* cairo's circles and rounded rectangles are convex outlines: πr², and cairo's pixels. */
  cairo_t *cr = tu_path_context();
  cairo_arc(cr, 100, 100, 60, 0, 2 * G_PI);
  p = tu_path_from_cairo(cr);
  assert_true(pp_path_is_convex(p));
  /* cairo keeps its arcs within the tolerance of the circle (cairo_set_tolerance, cairo
   * API docs): the area is within 2πr·tolerance of πr². */
  double tol = cairo_get_tolerance(cr);
  tu_assert_near(pp_path_fill_area(p, PP_FILL_NONZERO), G_PI * 60 * 60, 2 * G_PI * 60 * tol);
  pp_path_free(p);
  cairo_new_path(cr);
  cairo_new_sub_path(cr);
  cairo_arc(cr, 150, 30, 10, -G_PI / 2, 0);
  cairo_arc(cr, 150, 150, 10, 0, G_PI / 2);
  cairo_arc(cr, 30, 150, 10, G_PI / 2, G_PI);
  cairo_arc(cr, 30, 30, 10, G_PI, 3 * G_PI / 2);
  cairo_close_path(cr);
  p = tu_path_from_cairo(cr);
  assert_true(pp_path_is_convex(p));
  double want = 140.0 * 140 - (4 - G_PI) * 100; /* rounded square: side² − (4 − π)r² */
  tu_assert_near(pp_path_fill_area(p, PP_FILL_NONZERO), want, 1e-3 * want);
  pp_path_free(p);
  cairo_destroy(cr);
}

/* A grid of circles in one path, some pairs overlapping: the groups (cut along rows and
 * columns of empty space, see pieces.c) are measured apart
 * and must add up to what cairo paints, under both rules and under a round clip. */
static void test_disjoint_groups(void **state) {
  (void)state;
  cairo_t *cr = tu_path_context();
  int n = 0;
  for (int i = 0; i < 18; i++)
    for (int j = 0; j < 18; j++) {
      double x = 10 + 10.5 * i, y = 10 + 10.5 * j;
      cairo_new_sub_path(cr);
      cairo_arc(cr, x, y, 3.5, 0, 2 * G_PI);
      n++;
      if (i % 3 == 0 && j % 2 == 0) { /* a partner overlapping it, inside the same cell */
        cairo_new_sub_path(cr);
        cairo_arc(cr, x + 1.5, y, 3.5, 0, 2 * G_PI);
        n++;
      }
    }
  pp_path *p = tu_path_from_cairo(cr);
  GPtrArray *groups = pp_path_split_disjoint(p);
  assert_true(groups->len > 100 && groups->len < (guint)n); /* overlapping pairs stay together */
  g_ptr_array_unref(groups);
  for (int rule = 0; rule < 2; rule++) {
    double want = cairo_ink(p, rule, NULL);
    tu_assert_near(pp_path_fill_area(p, rule), want, 0.01 * want);
  }
  cairo_new_path(cr);
  cairo_arc(cr, 100, 100, 70, 0, 2 * G_PI);
  pp_path *round = tu_path_from_cairo(cr);
  pp_clip *clip = pp_clip_new(NULL, pp_path_copy(round), PP_FILL_NONZERO);
  double want = cairo_ink(p, PP_FILL_NONZERO, round);
  tu_assert_near(pp_path_clipped_area(p, PP_FILL_NONZERO, clip), want, 0.01 * want);
  /* The same clip digested once serves many marks with the same answers. */
  pp_clip_info *info = pp_clip_info_new(clip);
  tu_assert_near(pp_clip_info_area(info, p, PP_FILL_NONZERO),
                 pp_path_clipped_area(p, PP_FILL_NONZERO, clip), 1e-9 * want);
  pp_clip_info_free(info);
  pp_clip_unref(clip);
  pp_path_free(round);
  pp_path_free(p);
  cairo_destroy(cr);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_convex),
      cmocka_unit_test(test_disjoint_groups),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
