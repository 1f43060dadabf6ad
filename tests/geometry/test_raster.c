/* test_raster.c — visible ink checked against cairo's own rasteriser: fill (and clip)
 * the same path at 4× on an A8 surface and sum the coverage. */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "test_util.h"

#define SCALE 4
#define SIZE 100 /* scene is [0, SIZE]² points */

typedef struct {
  pp_path *path;
  pp_fill_rule rule;
} tu_clip_spec;

/* Σ alpha/255 over the pixels, in square points. */
static double cairo_ink(const pp_path *p, pp_fill_rule rule, const pp_clip *clip,
                        double stroke_width) {
  cairo_t *cr = tu_coverage_begin(SIZE, SCALE);
  for (const pp_clip *c = clip; c; c = c->parent) {
    tu_path_to_cairo(cr, c->path);
    cairo_set_fill_rule(cr, tu_cairo_rule(c->rule));
    cairo_clip(cr);
  }
  tu_path_to_cairo(cr, p);
  cairo_set_fill_rule(cr, tu_cairo_rule(rule));
  if (stroke_width > 0) {
    cairo_set_line_width(cr, stroke_width);
    cairo_set_line_cap(cr, CAIRO_LINE_CAP_BUTT);
    cairo_stroke(cr);
  } else {
    cairo_fill(cr);
  }
  return tu_coverage_end(cr);
}

static pp_path *random_shape(GRand *rng) {
  pp_path *p = pp_path_new();
  int kind = g_rand_int_range(rng, 0, 3);
  if (kind == 0)
    tu_random_ring(p, rng, g_rand_int_range(rng, 3, 9), 5, 95);
  else if (kind == 1)
    tu_random_curvy(p, rng, g_rand_int_range(rng, 2, 5), 5, 95);
  else {
    tu_random_ring(p, rng, 5, 5, 95);
    tu_random_curvy(p, rng, 3, 5, 95);
  }
  return p;
}

static void test_fills_against_cairo(void **state) {
  (void)state;
  GRand *rng = g_rand_new_with_seed(20240611);
  int checked = 0;
  for (int i = 0; i < 120; i++) {
    g_autoptr(pp_path) p = random_shape(rng);
    pp_fill_rule rule = i % 2 ? PP_FILL_EVEN_ODD : PP_FILL_NONZERO;
    pp_clip *clip = NULL;
    int ck = i % 4;
    if (ck == 1) {
      pp_path *r = pp_path_new();
      pp_path_rectangle(r, g_rand_double_range(rng, 0, 40), g_rand_double_range(rng, 0, 40), 50,
                        45);
      clip = pp_clip_new(NULL, r, PP_FILL_NONZERO);
    } else if (ck >= 2) {
      clip = pp_clip_new(NULL, random_shape(rng), i % 3 ? PP_FILL_NONZERO : PP_FILL_EVEN_ODD);
      if (ck == 3) {
        pp_clip *outer = clip;
        pp_path *r = pp_path_new();
        pp_path_rectangle(r, 10, 10, 70, 80);
        clip = pp_clip_new(outer, r, PP_FILL_NONZERO);
        pp_clip_unref(outer);
      }
    }
    double ours = pp_path_clipped_area(p, rule, clip);
    double ref = cairo_ink(p, rule, clip, 0);
    /* Above 100 pt² the antialiased coverage sum agrees with the true area to well under
     * 1% at 4× (rasteriser sampling error ~ perimeter/(samples per pt)); task bound 1%. */
    if (ref > 100) {
      tu_assert_near(ours, ref, 0.01 * ref);
      checked++;
    }
    pp_clip_unref(clip);
  }
  assert_true(checked > 40); /* the random cases must actually exercise the comparison */
  g_rand_free(rng);
}

static void test_strokes_against_cairo(void **state) {
  (void)state;
  GRand *rng = g_rand_new_with_seed(7);
  pp_path *r = pp_path_new();
  pp_path_rectangle(r, 20, 15, 55, 60);
  g_autoptr(pp_clip) clip = pp_clip_new(NULL, r, PP_FILL_NONZERO);
  for (int i = 0; i < 40; i++) {
    g_autoptr(pp_path) p = pp_path_new();
    pp_path_move_to(p, g_rand_double_range(rng, 5, 95), g_rand_double_range(rng, 5, 95));
    pp_path_line_to(p, g_rand_double_range(rng, 5, 95), g_rand_double_range(rng, 5, 95));
    double w = 3;
    double ours = pp_stroke_ink(p, w, clip);
    double ref = cairo_ink(p, PP_FILL_NONZERO, clip, w);
    /* One straight butt-capped stroke: the ink inside a half-plane is exactly width ×
     * centre-line length inside it whenever the cut crosses the full width (elementary
     * geometry), so cairo's coverage is the reference; ends near corners add slack. */
    if (ref > 100)
      tu_assert_near(ours, ref, 0.01 * ref + 2 * w * w);
  }
  g_rand_free(rng);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_fills_against_cairo),
      cmocka_unit_test(test_strokes_against_cairo),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
