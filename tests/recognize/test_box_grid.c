/* test_box_grid.c — the recognizers' bucket grid: every box that touches a query is
 * returned, ascending and once (or in any order, once), whatever the boxes' sizes (points,
 * page-wide boxes, empty boxes). The reference is the exhaustive test of every box against the
 * query (closed rectangles intersect when they overlap on both axes: textbook). */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "recognize/internal.h"

static gboolean touches(pp_rect a, pp_rect b) {
  return !pp_rect_is_empty(a) && a.x0 <= b.x1 && b.x0 <= a.x1 && a.y0 <= b.y1 && b.y0 <= a.y1;
}

static int cmp_id(gconstpointer a, gconstpointer b) {
  guint x = *(const guint *)a, y = *(const guint *)b;
  return (x > y) - (x < y);
}

static gboolean record_none(guint id, gpointer asked) {
  g_array_append_val((GArray *)asked, id);
  return FALSE;
}

static gboolean record_all(guint id, gpointer asked) {
  g_array_append_val((GArray *)asked, id);
  return TRUE;
}

static void check(pp_box_grid *g, const pp_rect *boxes, guint n, pp_rect q) {
  g_autoptr(GArray) hits = g_array_new(FALSE, FALSE, sizeof(guint));
  /* The unordered query gives the same ids as the ordered one, as a set. */
  g_autoptr(GArray) any = g_array_new(FALSE, FALSE, sizeof(guint));
  pp_box_grid_query_any(g, q, any);
  g_array_sort(any, cmp_id);
  pp_box_grid_query(g, q, hits);
  assert_int_equal(any->len, hits->len);
  for (guint k = 0; k < hits->len; k++)
    assert_int_equal(g_array_index(any, guint, k), g_array_index(hits, guint, k));
  for (guint k = 1; k < hits->len; k++) /* ascending, once each */
    assert_true(g_array_index(hits, guint, k - 1) < g_array_index(hits, guint, k));
  /* find asks every id of the query once until one is taken: taking none asks them all */
  g_autoptr(GArray) asked = g_array_new(FALSE, FALSE, sizeof(guint));
  assert_false(pp_box_grid_find(g, q, record_none, asked));
  g_array_sort(asked, cmp_id);
  assert_int_equal(asked->len, hits->len);
  for (guint k = 0; k < hits->len; k++)
    assert_int_equal(g_array_index(asked, guint, k), g_array_index(hits, guint, k));
  if (hits->len > 0) { /* and it stops at the first taken */
    g_array_set_size(asked, 0);
    assert_true(pp_box_grid_find(g, q, record_all, asked));
    assert_int_equal(asked->len, 1);
  }
  guint j = 0;
  for (guint i = 0; i < n; i++) {
    while (j < hits->len && g_array_index(hits, guint, j) < i)
      j++;
    gboolean found = j < hits->len && g_array_index(hits, guint, j) == i;
    if (touches(boxes[i], q))
      assert_true(found);
    if (pp_rect_is_empty(boxes[i]))
      assert_false(found);
  }
}

static void test_random_boxes(void **state) {
  (void)state;
  GRand *rand = g_rand_new_with_seed(12);
  for (int round = 0; round < 20; round++) {
    guint n = 1 + g_rand_int_range(rand, 0, 3000);
    g_autofree pp_rect *boxes = g_new(pp_rect, n);
    for (guint i = 0; i < n; i++) {
      double x = g_rand_double_range(rand, 0, 600), y = g_rand_double_range(rand, 0, 800);
      /* points, small marks, and now and then a page-wide frame or an empty box */
      double w = i % 97 == 0 ? 500 : i % 3 == 0 ? 0 : g_rand_double_range(rand, 0, 8);
      double h = i % 97 == 0 ? 700 : i % 3 == 0 ? 0 : g_rand_double_range(rand, 0, 8);
      boxes[i] = i % 101 == 50 ? pp_rect_empty() : (pp_rect){x, y, x + w, y + h};
    }
    g_autoptr(pp_box_grid) g = pp_box_grid_new(boxes, n);
    for (int k = 0; k < 200; k++) {
      double x = g_rand_double_range(rand, -50, 650), y = g_rand_double_range(rand, -50, 850);
      double w = k % 10 == 0 ? 0 : g_rand_double_range(rand, 0, 60);
      check(g, boxes, n, (pp_rect){x, y, x + w, y + g_rand_double_range(rand, 0, 60)});
    }
    /* a query on a box's own corner finds it */
    check(g, boxes, n, (pp_rect){boxes[0].x1, boxes[0].y1, boxes[0].x1, boxes[0].y1});
  }
  g_rand_free(rand);
}

static void test_empty_grid(void **state) {
  (void)state;
  g_autoptr(pp_box_grid) g = pp_box_grid_new(NULL, 0);
  g_autoptr(GArray) hits = g_array_new(FALSE, FALSE, sizeof(guint));
  pp_box_grid_query(g, (pp_rect){0, 0, 10, 10}, hits);
  assert_int_equal(hits->len, 0);
}

/* pp_coord_index_within against the exhaustive pass: every id whose value lies in [lo, hi]
 * (closed interval) or is not finite, each once, in ascending order. */
static void test_coord_within(void **state) {
  (void)state;
  GRand *rand = g_rand_new_with_seed(11);
  g_autoptr(GArray) hits = g_array_new(FALSE, FALSE, sizeof(guint));
  for (int round = 0; round < 200; round++) {
    guint n = (guint)g_rand_int_range(rand, 0, 60);
    double *v = g_new(double, MAX(n, 1));
    for (guint i = 0; i < n; i++) {
      int kind = g_rand_int_range(rand, 0, 10);
      v[i] = kind == 0 ? NAN : kind == 1 ? INFINITY : (double)g_rand_int_range(rand, 0, 50);
    }
    g_autoptr(pp_coord_index) x = pp_coord_index_new(v, n);
    double lo = g_rand_int_range(rand, -5, 50), hi = lo + g_rand_int_range(rand, 0, 20);
    g_array_append_val(hits, n); /* emptied first */
    pp_coord_index_within(x, lo, hi, hits);
    guint k = 0;
    for (guint i = 0; i < n; i++)
      if (!isfinite(v[i]) || (v[i] >= lo && v[i] <= hi)) {
        assert_true(k < hits->len);
        assert_int_equal(g_array_index(hits, guint, k), i);
        k++;
      }
    assert_int_equal(k, hits->len);
    g_free(v);
  }
  g_rand_free(rand);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_random_boxes),
      cmocka_unit_test(test_empty_grid),
      cmocka_unit_test(test_coord_within),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
