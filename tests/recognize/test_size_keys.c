/* test_size_keys.c — bubbles read through a size key in each layout keys come in: a
 * column with the numbers beside, a row with the numbers under or over each symbol, and
 * nested outlined circles on one bottom point with the numbers at leader lines; inside
 * or outside the plot frame. This file drew every circle from its value (radius ∝ value,
 * or radius ∝ √value so that area ∝ value), so each bubble's value read back is checked
 * against the value it was drawn from (within 2%, the tolerance). */
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

typedef enum { COLUMN, ROW_BELOW, ROW_ABOVE, NESTED_LEADER } layout;

typedef struct {
  layout layout;
  gboolean by_radius;
  gboolean inside; /* the key inside the plot frame */
} chart;

static const double bubble_x[] = {130, 210, 290, 370, 250};
static const double bubble_y[] = {420, 520, 430, 530, 620};
static const double bubble_v[] = {8, 20, 35, 50, 64};
static const double key_v[] = {10, 40, 70};

static double radius_of(const chart *c, double v) {
  return c->by_radius ? 0.5 * v : 4 * sqrt(v);
}

static void number(cairo_t *cr, double x, double y, double v, int align_x, int align_y) {
  char buf[16];
  g_snprintf(buf, sizeof buf, "%g", v);
  cairo_set_source_rgb(cr, 0, 0, 0);
  cairo_set_font_size(cr, 8);
  cairo_text_extents_t te;
  cairo_text_extents(cr, buf, &te);
  /* align_x: -1 starts at x, 0 centred on x; align_y: -1 top at y, 0 centred, 1 bottom */
  double tx = align_x < 0 ? x - te.x_bearing : x - te.width / 2 - te.x_bearing;
  double ty = align_y < 0   ? y - te.y_bearing
              : align_y > 0 ? y - te.height - te.y_bearing
                            : y - te.height / 2 - te.y_bearing;
  cairo_move_to(cr, tx, ty);
  cairo_show_text(cr, buf);
}

static void disc(cairo_t *cr, double x, double y, double r, double grey) {
  cairo_set_source_rgb(cr, grey, grey, grey);
  cairo_new_path(cr);
  cairo_arc(cr, x, y, r, 0, 2 * G_PI);
  cairo_fill(cr);
}

static void draw_key(cairo_t *cr, const chart *c, double x0, double y0) {
  double big = radius_of(c, key_v[2]);
  double x = x0, y = y0;
  for (int i = 0; i < 3; i++) {
    double r = radius_of(c, key_v[i]);
    switch (c->layout) {
    case COLUMN:
      y += r;
      disc(cr, x0 + big, y, r, 0.6);
      number(cr, x0 + 2 * big + 6, y, key_v[i], -1, 0);
      y += r + 6;
      break;
    case ROW_BELOW:
    case ROW_ABOVE:
      x += r;
      disc(cr, x, y0, r, 0.6);
      if (c->layout == ROW_BELOW)
        number(cr, x, y0 + r + 2, key_v[i], 0, -1);
      else
        number(cr, x, y0 - r - 2, key_v[i], 0, 1);
      x += r + 14;
      break;
    case NESTED_LEADER: { /* (x0, y0) is the common bottom point */
      double top = y0 - 2 * r, end = x0 + big + 10;
      cairo_set_source_rgb(cr, 0.3, 0.3, 0.3);
      cairo_set_line_width(cr, 0.8);
      cairo_new_path(cr);
      cairo_arc(cr, x0, y0 - r, r, 0, 2 * G_PI);
      cairo_stroke(cr);
      cairo_set_line_width(cr, 0.5);
      cairo_move_to(cr, x0, top);
      cairo_line_to(cr, end, top);
      cairo_stroke(cr);
      number(cr, end + 2, top, key_v[i], -1, 0);
      break;
    }
    }
  }
}

static void draw(cairo_t *cr, const chart *c) {
  cairo_set_source_rgb(cr, 0, 0, 0);
  cairo_set_line_width(cr, 0.8);
  cairo_rectangle(cr, 80, 300, 440, 380); /* the plot frame: x 80..520, y 300..680 */
  cairo_stroke(cr);
  for (guint i = 0; i < G_N_ELEMENTS(bubble_v); i++) {
    cairo_set_source_rgb(cr, 0.17, 0.42, 0.56);
    cairo_new_path(cr);
    cairo_arc(cr, bubble_x[i], bubble_y[i], radius_of(c, bubble_v[i]), 0, 2 * G_PI);
    cairo_fill(cr);
  }
  double kx = c->inside ? 430 : 100, ky = c->inside ? 320 : 120;
  if (c->layout == NESTED_LEADER)
    kx += 20, ky += 75;
  else if (c->layout == ROW_BELOW || c->layout == ROW_ABOVE)
    kx -= c->inside ? 150 : 0, ky += 45;
  draw_key(cr, c, kx, ky);
}

static void draw_chart(cairo_t *cr, const void *c) {
  draw(cr, c);
}

static pp_page_charts *recognise(const chart *c) {
  pp_test_page p = pp_test_page_draw(draw_chart, c);
  pp_page_charts *charts = g_steal_pointer(&p.charts);
  pp_test_page_clear(&p);
  return charts;
}

/* One bubble figure, one element per drawn bubble, each valued from the key as drawn. */
static void check(const chart *c) {
  print_message("layout %d, radius %d, inside %d\n", c->layout, c->by_radius, c->inside);
  pp_page_charts *charts = recognise(c);
  const pp_figure *fig = pp_test_page_only_figure(charts, PP_FIGURE_BUBBLE);
  assert_true(fig->judged);
  assert_int_equal(fig->elements->len, G_N_ELEMENTS(bubble_v));
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    assert_int_equal(e->source, PP_VALUE_SIZE_KEY);
    guint k = pp_test_nearest_drawn(bubble_x, bubble_y, G_N_ELEMENTS(bubble_v), e->box);
    double cx = (e->box.x0 + e->box.x1) / 2, cy = (e->box.y0 + e->box.y1) / 2;
    assert_true(hypot(bubble_x[k] - cx, bubble_y[k] - cy) < 1);
    assert_true(fabs(e->value - bubble_v[k]) <= 0.02 * bubble_v[k]);
  }
  pp_page_charts_free(charts);
}

static void test_column(void **state) {
  (void)state;
  for (int by = 0; by < 2; by++)
    for (int in = 0; in < 2; in++)
      check(&(chart){COLUMN, by, in});
}

static void test_row_below(void **state) {
  (void)state;
  for (int by = 0; by < 2; by++)
    for (int in = 0; in < 2; in++)
      check(&(chart){ROW_BELOW, by, in});
}

static void test_row_above(void **state) {
  (void)state;
  for (int by = 0; by < 2; by++)
    for (int in = 0; in < 2; in++)
      check(&(chart){ROW_ABOVE, by, in});
}

static void test_nested_leader(void **state) {
  (void)state;
  for (int by = 0; by < 2; by++)
    for (int in = 0; in < 2; in++)
      check(&(chart){NESTED_LEADER, by, in});
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_column),
      cmocka_unit_test(test_row_below),
      cmocka_unit_test(test_row_above),
      cmocka_unit_test(test_nested_leader),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
