/* test_core.c — the shared value types against cairo's own implementations: matrices
 * (cairo_matrix_multiply / invert / transform_point), and paths and clip chains by use. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cairo.h>
#include <cmocka.h>

#include "core/core.h"

static cairo_matrix_t to_cairo(pp_matrix m) {
  return (cairo_matrix_t){m.xx, m.yx, m.xy, m.yy, m.x0, m.y0};
}

static void assert_same(pp_matrix m, cairo_matrix_t c) {
  assert_true(fabs(m.xx - c.xx) < 1e-12 && fabs(m.yx - c.yx) < 1e-12);
  assert_true(fabs(m.xy - c.xy) < 1e-12 && fabs(m.yy - c.yy) < 1e-12);
  assert_true(fabs(m.x0 - c.x0) < 1e-9 && fabs(m.y0 - c.y0) < 1e-9);
}

/* cairo's reference: cairo_matrix_multiply(r, a, b) applies a first, then b (cairo API
 * documentation, cairo_matrix_t). */
static void test_matrix_against_cairo(void **state) {
  (void)state;
  pp_matrix a = {1.5, 0.25, -0.5, 2.0, 10, -4}, b = {0, 1, -1, 0, 100, 200};
  cairo_matrix_t ca = to_cairo(a), cb = to_cairo(b), cr;
  cairo_matrix_multiply(&cr, &ca, &cb);
  assert_same(pp_matrix_multiply(a, b), cr);

  pp_matrix inv;
  assert_true(pp_matrix_invert(a, &inv));
  cairo_matrix_t ci = ca;
  assert_int_equal(cairo_matrix_invert(&ci), CAIRO_STATUS_SUCCESS);
  assert_same(inv, ci);

  double x = 3.5, y = -7.25;
  cairo_matrix_transform_point(&ca, &x, &y);
  pp_point p = pp_matrix_apply(a, (pp_point){3.5, -7.25});
  assert_true(fabs(p.x - x) < 1e-12 && fabs(p.y - y) < 1e-12);
  double dx = 2, dy = 5;
  cairo_matrix_transform_distance(&ca, &dx, &dy);
  pp_point d = pp_matrix_apply_distance(a, (pp_point){2, 5});
  assert_true(fabs(d.x - dx) < 1e-12 && fabs(d.y - dy) < 1e-12);

  pp_matrix singular = {1, 2, 2, 4, 0, 0};
  assert_false(pp_matrix_invert(singular, &inv));
}

static void test_rect(void **state) {
  (void)state;
  pp_rect e = pp_rect_empty();
  assert_true(pp_rect_is_empty(e));
  assert_true(pp_rect_area(e) == 0);
  pp_rect a = {0, 0, 10, 5}, b = {5, 2, 20, 30};
  pp_rect u = pp_rect_union(a, b), i = pp_rect_intersect(a, b);
  assert_true(u.x0 == 0 && u.y0 == 0 && u.x1 == 20 && u.y1 == 30);
  assert_true(i.x0 == 5 && i.y0 == 2 && i.x1 == 10 && i.y1 == 5);
  assert_true(pp_rect_is_empty(pp_rect_intersect(a, (pp_rect){11, 0, 12, 1})));
  assert_true(pp_rect_contains(a, i, 0) && pp_rect_contains(b, i, 0));
  assert_false(pp_rect_contains(a, b, 0));
}

/* Boxes grown point by point agree with libm's fmin and fmax bit for bit (the C library is
 * the reference; the boxes were once built with them): signed zeros on ties, infinities,
 * and a NaN point, which leaves a box as it is. */
static void test_rect_grow_as_libm(void **state) {
  (void)state;
  /* volatile: libm at run time, not the compiler folding fmin of constants its own way */
  static volatile double v[] = {0.0, -0.0, 1.5, -2.25, INFINITY, -INFINITY};
  for (gsize i = 0; i < G_N_ELEMENTS(v); i++)
    for (gsize j = 0; j < G_N_ELEMENTS(v); j++) {
      pp_rect r = pp_rect_add_point(pp_rect_empty(), (pp_point){v[i], v[i]});
      r = pp_rect_add_point(r, (pp_point){v[j], v[j]});
      double want_lo = fmin(v[i], v[j]), want_hi = fmax(v[i], v[j]);
      assert_memory_equal(&r.x0, &want_lo, sizeof want_lo);
      assert_memory_equal(&r.y1, &want_hi, sizeof want_hi);
      pp_rect a = {v[i], v[i], v[i], v[i]}, b = {v[j], v[j], v[j], v[j]};
      pp_rect u = pp_rect_union(a, b);
      assert_memory_equal(&u.y0, &want_lo, sizeof want_lo);
      assert_memory_equal(&u.x1, &want_hi, sizeof want_hi);
    }
  pp_rect r = {1, 2, 3, 4};
  pp_rect n = pp_rect_add_point(r, (pp_point){NAN, 0});
  assert_memory_equal(&n, &r, sizeof r);
}

/* A path transformed by a matrix equals cairo transforming the same path. */
static void test_path_transform(void **state) {
  (void)state;
  pp_path *p = pp_path_new();
  pp_path_rectangle(p, 10, 20, 30, 40);
  pp_path_curve_to(p, 1, 2, 3, 4, 5, 6);
  assert_int_equal(pp_path_n_subpaths(p), 1);
  pp_path_move_to(p, 0, 0);
  assert_int_equal(pp_path_n_subpaths(p), 2);
  pp_matrix m = {2, 0, 0, -1, 5, 100};
  pp_path *q = pp_path_copy(p);
  pp_path_transform(q, m);
  cairo_matrix_t cm = to_cairo(m);
  for (size_t i = 0; i < p->n_segs; i++) {
    int n = p->segs[i].kind == PP_SEG_CURVE ? 3 : p->segs[i].kind == PP_SEG_CLOSE ? 0 : 1;
    for (int k = 0; k < n; k++) {
      double x = p->segs[i].pt[k].x, y = p->segs[i].pt[k].y;
      cairo_matrix_transform_point(&cm, &x, &y);
      assert_true(fabs(q->segs[i].pt[k].x - x) < 1e-12 && fabs(q->segs[i].pt[k].y - y) < 1e-12);
    }
  }
  pp_path_free(p);
  pp_path_free(q);
}

static void test_clip_chain(void **state) {
  (void)state;
  pp_path *outer = pp_path_new(), *inner = pp_path_new();
  pp_path_rectangle(outer, 0, 0, 100, 100);
  pp_path_rectangle(inner, 10, 10, 20, 20);
  pp_clip *a = pp_clip_new(NULL, outer, PP_FILL_NONZERO);
  pp_clip *b = pp_clip_new(a, inner, PP_FILL_EVEN_ODD);
  pp_clip_unref(a); /* b keeps a alive */
  assert_int_equal(pp_clip_depth(b), 2);
  assert_true(b->parent->path == outer);
  pp_clip *c = pp_clip_ref(b);
  pp_clip_unref(b);
  assert_int_equal(c->ref_count, 1);
  pp_clip_unref(c); /* frees the whole chain; ASan checks it */
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_matrix_against_cairo), cmocka_unit_test(test_rect),
      cmocka_unit_test(test_rect_grow_as_libm),    cmocka_unit_test(test_path_transform),
      cmocka_unit_test(test_clip_chain),
  };
  return cmocka_run_group_tests_name("core", tests, NULL, NULL);
}
