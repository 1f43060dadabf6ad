/* test_two_sided.c — two-sided bars (population pyramids) that cairo draws at test time:
 * the mirrored scale read across the shared line, from 0 and from a cut value. Values and
 * baselines are checked against the drawing (the values this file chose), never against the
 * recognizer. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cairo-pdf.h>
#include <cmocka.h>
#include <glib/gstdio.h>

#include "geometry/geometry.h"
#include "recognize/recognize.h"

#include "test_page.h"

/* Shared line at x = 300, 0.5 pt per unit, rows 20 pt apart from y = 200. */
#define CX 300.0
#define K 0.5
static const double left_v[] = {310, 240, 420, 150, 380}, right_v[] = {290, 350, 180, 400, 260};
#define ROWS 5
static double cut; /* the value at the shared line */

static void label(cairo_t *cr, double x, double y, const char *s) {
  cairo_text_extents_t te;
  cairo_text_extents(cr, s, &te);
  cairo_move_to(cr, x - te.width / 2 - te.x_bearing, y);
  cairo_show_text(cr, s);
}

static void draw(cairo_t *cr) {
  for (int i = 0; i < ROWS; i++) {
    double y = 200 + 20 * i;
    cairo_set_source_rgb(cr, 0.17, 0.42, 0.56);
    cairo_rectangle(cr, CX - (left_v[i] - cut) * K, y, (left_v[i] - cut) * K, 16);
    cairo_fill(cr);
    cairo_set_source_rgb(cr, 0.85, 0.51, 0.17);
    cairo_rectangle(cr, CX, y, (right_v[i] - cut) * K, 16);
    cairo_fill(cr);
  }
  /* tick labels below the bars: magnitudes on both sides, the cut at the line */
  cairo_set_source_rgb(cr, 0, 0, 0);
  cairo_set_font_size(cr, 9);
  for (double v = cut; v <= 500 + 1e-9; v += 100) {
    char buf[16];
    g_snprintf(buf, sizeof buf, "%g", v);
    double d = (v - cut) * K;
    label(cr, CX + d, 310, buf);
    if (d > 0)
      label(cr, CX - d, 310, buf);
  }
}

static void draw_page(cairo_t *cr, const void *unused) {
  (void)unused;
  draw(cr);
}

static pp_page_charts *recognise(pp_scene **scene, pp_document **doc) {
  pp_test_page p = pp_test_page_draw(draw_page, NULL);
  *scene = p.scene;
  *doc = p.doc;
  return p.charts;
}

/* Every bar's value is the one drawn, whichever side it reaches to. */
static void check(double at_line) {
  cut = at_line;
  pp_scene *scene;
  pp_document *doc;
  pp_page_charts *charts = recognise(&scene, &doc);
  assert_int_equal(charts->figures->len, 1);
  const pp_figure *f = g_ptr_array_index(charts->figures, 0);
  assert_string_equal(f->recognizer, "two-sided");
  assert_true(f->judged);
  assert_int_equal(f->elements->len, 2 * ROWS);
  for (guint k = 0; k < f->elements->len; k++) {
    const pp_element *e = &g_array_index(f->elements, pp_element, k);
    gboolean left = e->box.x1 <= CX + 0.5;
    int row = (int)lround((e->box.y0 - 200) / 20);
    assert_true(row >= 0 && row < ROWS);
    /* the drawn value; labels are centred to a fraction of a point (0.5 pt = 1 unit) */
    assert_float_equal(e->value, left ? left_v[row] : right_v[row], 1.0);
    assert_float_equal(e->base_value, cut, 1.0);
  }
  pp_page_charts_free(charts);
  pp_scene_free(scene);
  pp_document_free(doc);
}

static void test_from_zero(void **state) {
  (void)state;
  check(0);
}

static void test_from_a_cut(void **state) {
  (void)state;
  check(100);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_from_zero),
      cmocka_unit_test(test_from_a_cut),
  };
  return cmocka_run_group_tests_name("recognize/two-sided", tests, NULL, NULL);
}
