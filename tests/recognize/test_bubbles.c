/* test_bubbles.c — bubbles laid out as R's symbols() draws them on a plot with both
 * axes: two rows of filled circles, radius ∝ value, some overlapping, a number centred on
 * each. The numbers of one row may step evenly across evenly spaced bubbles (16, 19, 22),
 * as a tick row does; they are still the bubbles' numbers. Bare circles beside a value
 * axis are not a filled area. This file drew every circle, so values and ink are checked
 * against the drawing (π r² of the radius drawn), never against the recognizer. */
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

/* Invented head counts per orchard plot. Lower row: 16, 19, 22 step by 3 at x spaced
 * 70 pt apart, a row that reads like tick labels; upper row: 42 and 58 overlap. */
static const double bubble_x[] = {100, 170, 240, 310, 100, 160, 220};
static const double bubble_y[] = {560, 560, 560, 560, 440, 440, 440};
static const double bubble_v[] = {7, 16, 19, 22, 37, 42, 58};
/* radius ∝ value, points per unit (as symbols(circles = v) scales them) */
#define RADIUS_PER_UNIT 0.65

static void label(cairo_t *cr, double x, double y, const char *s, int centred) {
  cairo_set_source_rgb(cr, 0, 0, 0);
  cairo_set_font_size(cr, 8);
  cairo_text_extents_t te;
  cairo_text_extents(cr, s, &te);
  /* centred: on (x, y); else right-aligned at x, centred on y */
  double tx = centred ? x - te.width / 2 - te.x_bearing : x - te.width - te.x_bearing;
  cairo_move_to(cr, tx, y - te.height / 2 - te.y_bearing);
  cairo_show_text(cr, s);
}

/* Frame x 60..420, y 300..640; left axis 0..8 step 2 (y 620 → 320), bottom axis 0..10. */
static void draw(cairo_t *cr, gboolean numbers) {
  cairo_set_source_rgb(cr, 0, 0, 0);
  cairo_set_line_width(cr, 0.75);
  cairo_rectangle(cr, 60, 300, 360, 340);
  cairo_stroke(cr);
  char buf[16];
  for (int v = 0; v <= 8; v += 2) {
    double y = 620 - v * 37.5;
    cairo_move_to(cr, 60, y);
    cairo_line_to(cr, 53, y);
    cairo_stroke(cr);
    g_snprintf(buf, sizeof buf, "%d", v);
    label(cr, 48, y, buf, FALSE);
  }
  for (int v = 0; v <= 10; v += 2) {
    double x = 75 + v * 33;
    cairo_move_to(cr, x, 640);
    cairo_line_to(cr, x, 647);
    cairo_stroke(cr);
    g_snprintf(buf, sizeof buf, "%d", v);
    label(cr, x, 656, buf, TRUE);
  }
  for (guint i = 0; i < G_N_ELEMENTS(bubble_v); i++) {
    cairo_set_source_rgb(cr, 0.56, 0.35, 0.66);
    cairo_new_path(cr);
    cairo_arc(cr, bubble_x[i], bubble_y[i], RADIUS_PER_UNIT * bubble_v[i], 0, 2 * G_PI);
    cairo_fill(cr);
  }
  for (guint i = 0; numbers && i < G_N_ELEMENTS(bubble_v); i++) {
    g_snprintf(buf, sizeof buf, "%g", bubble_v[i]);
    label(cr, bubble_x[i], bubble_y[i], buf, TRUE);
  }
}

static void draw_page(cairo_t *cr, const void *data) {
  draw(cr, *(const gboolean *)data);
}

/* One bubble figure of every circle, each valued by the number drawn on it, its ink the
 * drawn disc's π r² within 2% (the tolerance); nothing read as a filled area. */
static void test_numbers_in_a_stepped_row(void **state) {
  (void)state;
  gboolean numbers = TRUE;
  pp_test_page page = pp_test_page_draw(draw_page, &numbers);
  const pp_page_charts *charts = page.charts;
  for (guint i = 0; i < charts->figures->len; i++)
    assert_int_not_equal(((const pp_figure *)g_ptr_array_index(charts->figures, i))->kind,
                         PP_FIGURE_AREA);
  const pp_figure *fig = pp_test_page_only_figure(charts, PP_FIGURE_BUBBLE);
  assert_true(fig->judged);
  assert_int_equal(fig->elements->len, G_N_ELEMENTS(bubble_v));
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    assert_int_equal(e->source, PP_VALUE_DATA_LABEL);
    guint k = pp_test_nearest_drawn(bubble_x, bubble_y, G_N_ELEMENTS(bubble_v), e->box);
    double cx = (e->box.x0 + e->box.x1) / 2, cy = (e->box.y0 + e->box.y1) / 2;
    assert_true(hypot(bubble_x[k] - cx, bubble_y[k] - cy) < 1);
    assert_true(fabs(e->value - bubble_v[k]) < 1e-9);
    double r = RADIUS_PER_UNIT * bubble_v[k];
    assert_true(fabs(e->ink - G_PI * r * r) <= 0.02 * G_PI * r * r);
  }
  pp_test_page_clear(&page);
}

/* Without numbers the circles stand for nothing readable, but they are still circles:
 * no filled-area figure over the left axis. */
static void test_bare_circles_are_not_areas(void **state) {
  (void)state;
  gboolean numbers = FALSE;
  pp_test_page page = pp_test_page_draw(draw_page, &numbers);
  const pp_page_charts *charts = page.charts;
  for (guint i = 0; i < charts->figures->len; i++) {
    const pp_figure *f = g_ptr_array_index(charts->figures, i);
    assert_int_not_equal(f->kind, PP_FIGURE_AREA);
  }
  pp_test_page_clear(&page);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_numbers_in_a_stepped_row),
      cmocka_unit_test(test_bare_circles_are_not_areas),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
