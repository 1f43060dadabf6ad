/* test_families.c — each recognizer on charts cairo draws at test time: filled areas,
 * stacked columns, bars read from their labels alone, a legend beside bars, a log axis
 * and two value axes. This file drew every mark, so values, baselines, parts and ink are
 * checked against the drawing (cairo's own geometry), never against the recognizer. */
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

/* A vertical value axis: labels right of x (side > 0: labels left of the line at x,
 * plot to the right) with a tick mark under each, value v at y = y0 − (t(v)−t(lo))·k. */
typedef struct {
  double x, y0, k; /* axis line x, y of lo, points per unit of t */
  double lo, hi, step;
  gboolean log, right; /* right: labels to the right of the line (a second axis) */
} axis;

static double t_of(const axis *a, double v) {
  return a->log ? log10(v) : v;
}
static double y_of(const axis *a, double v) {
  return a->y0 - (t_of(a, v) - t_of(a, a->lo)) * a->k;
}

static void draw_axis(cairo_t *cr, const axis *a) {
  cairo_set_source_rgb(cr, 0, 0, 0);
  cairo_set_line_width(cr, 0.8);
  cairo_set_font_size(cr, 9);
  for (double v = a->lo; v <= a->hi * (1 + 1e-9); v = a->log ? v * a->step : v + a->step) {
    double y = y_of(a, v), dx = a->right ? 4 : -4;
    cairo_move_to(cr, a->x, y);
    cairo_line_to(cr, a->x + dx, y);
    cairo_stroke(cr);
    char buf[32];
    g_snprintf(buf, sizeof buf, "%g", v);
    cairo_text_extents_t te;
    cairo_text_extents(cr, buf, &te);
    double tx = a->right ? a->x + 7 : a->x - 7 - te.width - te.x_bearing;
    cairo_move_to(cr, tx, y + te.height / 2);
    cairo_show_text(cr, buf);
  }
}

static void fill_rect(cairo_t *cr, double r, double g, double b, double x0, double y0, double x1,
                      double y1) {
  cairo_set_source_rgb(cr, r, g, b);
  cairo_rectangle(cr, x0, y0, x1 - x0, y1 - y0);
  cairo_fill(cr);
}

static void text(cairo_t *cr, double x, double y, const char *s) {
  cairo_set_source_rgb(cr, 0, 0, 0);
  cairo_set_font_size(cr, 9);
  cairo_move_to(cr, x, y);
  cairo_show_text(cr, s);
}

typedef void (*drawer)(cairo_t *cr);

typedef pp_test_page page;

static void call_drawer(cairo_t *cr, const void *draw) {
  (*(const drawer *)draw)(cr);
}

static page recognise(drawer draw) {
  return pp_test_page_draw(call_drawer, &draw);
}

static void page_free(page *p) {
  pp_test_page_clear(p);
}

/* The only figure of a kind; fails when there are none or two. */
static const pp_figure *only(const page *p, pp_figure_kind kind) {
  const pp_figure *found = NULL;
  for (guint i = 0; i < p->charts->figures->len; i++) {
    const pp_figure *f = g_ptr_array_index(p->charts->figures, i);
    if (f->kind == kind) {
      assert_null(found);
      found = f;
    }
  }
  assert_non_null(found);
  return found;
}

static const pp_element *el(const pp_figure *f, guint i) {
  assert_true(i < f->elements->len);
  return &g_array_index(f->elements, pp_element, i);
}

/* ---- a filled area on an axis from 20 ------------------------------------------------ */
static const axis area_axis = {100, 400, 3, 20, 100, 20, FALSE, FALSE};
static const double area_x[] = {120, 220, 320, 420}, area_v[] = {40, 90, 60, 80};

static void draw_area(cairo_t *cr) {
  draw_axis(cr, &area_axis);
  cairo_set_source_rgb(cr, 0.3, 0.5, 0.2);
  cairo_move_to(cr, area_x[0], y_of(&area_axis, 20));
  for (int i = 0; i < 4; i++)
    cairo_line_to(cr, area_x[i], y_of(&area_axis, area_v[i]));
  cairo_line_to(cr, area_x[3], y_of(&area_axis, 20));
  cairo_close_path(cr);
  cairo_fill(cr);
}

/* Samples lie on the drawn polyline: value by linear interpolation between the drawn
 * vertices, floor at 20; height (ink per unit width) is (value − 20)·3 pt. */
static void test_area(void **state) {
  (void)state;
  page p = recognise(draw_area);
  const pp_figure *f = only(&p, PP_FIGURE_AREA);
  assert_string_equal(f->recognizer, "areas");
  assert_non_null(f->scale);
  assert_true(f->elements->len >= 4);
  for (guint i = 0; i < f->elements->len; i++) {
    const pp_element *e = el(f, i);
    assert_int_equal(e->shape.kind, PP_SHAPE_SAMPLE);
    assert_int_equal(e->encoding, PP_ENCODING_LENGTH);
    double x = e->shape.rect.x0;
    int k = x < area_x[1] ? 0 : x < area_x[2] ? 1 : 2;
    double t = (x - area_x[k]) / (area_x[k + 1] - area_x[k]);
    double want = area_v[k] + t * (area_v[k + 1] - area_v[k]);
    assert_float_equal(e->value, want, 0.002 * 80);
    assert_float_equal(e->base_value, 20, 0.002 * 80);
    assert_float_equal(e->ink, (want - 20) * 3, 0.05);
    assert_int_equal(e->parts->len, 1);
  }
  page_free(&p);
}

/* ---- stacked columns on a zero baseline ------------------------------------------------ */
static const axis stack_axis = {100, 400, 2.5, 0, 100, 20, FALSE, FALSE};
static const double stack_lo[] = {30, 45, 20}, stack_hi[] = {25, 35, 50};

static void draw_stacks(cairo_t *cr) {
  draw_axis(cr, &stack_axis);
  for (int i = 0; i < 3; i++) {
    double x = 130 + 80 * i;
    fill_rect(cr, 0.2, 0.4, 0.7, x, y_of(&stack_axis, stack_lo[i]), x + 40, y_of(&stack_axis, 0));
    fill_rect(cr, 0.9, 0.5, 0.1, x, y_of(&stack_axis, stack_lo[i] + stack_hi[i]), x + 40,
              y_of(&stack_axis, stack_lo[i]));
  }
}

/* One element per column, its two segments kept as parts; the value is the top of the
 * stack and the ink both rectangles (40 pt × total × 2.5 pt). */
static void test_stacks(void **state) {
  (void)state;
  page p = recognise(draw_stacks);
  const pp_figure *f = only(&p, PP_FIGURE_COLUMN);
  assert_int_equal(f->elements->len, 3);
  for (guint i = 0; i < 3; i++) {
    const pp_element *e = el(f, i);
    double total = stack_lo[i] + stack_hi[i];
    assert_true(e->stacked);
    assert_int_equal(e->parts->len, 2);
    assert_int_equal(g_array_index(e->parts, pp_part, 0).role, PP_PART_SEGMENT);
    assert_int_equal(g_array_index(e->parts, pp_part, 1).role, PP_PART_SEGMENT);
    assert_float_equal(e->value, total, 0.2);
    assert_float_equal(e->ink, 40 * total * 2.5, 0.1);
    assert_float_equal(pp_element_ink_of(e, PP_PART_SEGMENT), e->ink, 1e-9);
    assert_int_equal(e->source, PP_VALUE_SCALE);
  }
  page_free(&p);
}

/* Three-segment stacks drawn top segment first: a segment is found on its column's tip
 * whatever the drawing order, so each column is one element with its parts from the
 * baseline up. */
static const double stack3[3][3] = {{30, 25, 20}, {45, 35, 10}, {20, 50, 15}};

static void draw_stacks_top_first(cairo_t *cr) {
  draw_axis(cr, &stack_axis);
  for (int i = 0; i < 3; i++) {
    double x = 130 + 80 * i;
    for (int s = 2; s >= 0; s--) {
      double lo = 0;
      for (int k = 0; k < s; k++)
        lo += stack3[i][k];
      fill_rect(cr, 0.2 + 0.3 * s, 0.4, 0.7 - 0.2 * s, x, y_of(&stack_axis, lo + stack3[i][s]),
                x + 40, y_of(&stack_axis, lo));
    }
  }
}

/* Each part reads from the end of the one below to its own top (the axis' readings of
 * the drawn edges: 2.5 pt per unit, within 0.2 as in test_stacks). */
static void test_stacks_drawn_top_first(void **state) {
  (void)state;
  page p = recognise(draw_stacks_top_first);
  const pp_figure *f = only(&p, PP_FIGURE_COLUMN);
  assert_int_equal(f->elements->len, 3);
  for (guint i = 0; i < 3; i++) {
    const pp_element *e = el(f, i);
    assert_true(e->stacked);
    assert_int_equal(e->parts->len, 3);
    double top = 0;
    for (guint s = 0; s < 3; s++) {
      const pp_part *part = &g_array_index(e->parts, pp_part, s);
      assert_float_equal(part->start, top, 0.2);
      top += stack3[i][s];
      assert_float_equal(part->end, top, 0.2);
    }
    assert_float_equal(e->value, top, 0.2);
  }
  page_free(&p);
}

/* ---- a stepped funnel: centred bars, each with its number inside ------------------------- */
/* Five bars 20 pt tall narrowing downwards, apart by funnel_gap pt, their centres 1 pt
 * either side of x = 300 in turn. pyramids.c joins slices whose gap is under 0.3 of the
 * thinner plus 1.5 pt (7.5 pt here) and whose centres agree within 0.02 of the wider plus
 * 1 pt (2.8 pt for the narrowest pair; its own rules, common practice), so 7 pt joins
 * them and 8 pt does not. */
static const double funnel_v[] = {90, 70, 50, 30, 20};
static double funnel_gap;

static void draw_funnel(cairo_t *cr) {
  for (int i = 0; i < 5; i++) {
    double w = 3 * funnel_v[i], y = 200 + i * (20 + funnel_gap), xc = i % 2 ? 301 : 299;
    fill_rect(cr, 0.2, 0.4, 0.7, xc - w / 2, y, xc + w / 2, y + 20);
    char buf[16];
    g_snprintf(buf, sizeof buf, "%g", funnel_v[i]);
    text(cr, 295, y + 13, buf);
  }
}

static void test_funnel_gap_near_limit(void **state) {
  (void)state;
  funnel_gap = 7;
  page p = recognise(draw_funnel);
  const pp_figure *f = only(&p, PP_FIGURE_PYRAMID);
  assert_int_equal(f->elements->len, 5);
  for (guint i = 0; i < 5; i++)
    assert_float_equal(el(f, i)->value, funnel_v[i], 1e-9);
  page_free(&p);
}

static void test_funnel_gap_beyond_limit(void **state) {
  (void)state;
  funnel_gap = 8;
  page p = recognise(draw_funnel);
  for (guint i = 0; i < p.charts->figures->len; i++)
    assert_int_not_equal(((const pp_figure *)g_ptr_array_index(p.charts->figures, i))->kind,
                         PP_FIGURE_PYRAMID);
  page_free(&p);
}

/* ---- bars with data labels and no axis ------------------------------------------------ */
static const double label_v[] = {12, 30, 21};

static void draw_labelled(cairo_t *cr) {
  for (int i = 0; i < 3; i++) {
    double x = 130 + 70 * i, top = 400 - label_v[i] * 8;
    fill_rect(cr, 0.5, 0.2, 0.2, x, top, x + 36, 400);
    char buf[16];
    g_snprintf(buf, sizeof buf, "%g", label_v[i]);
    text(cr, x + 12, top - 4, buf);
  }
}

static void test_labels_only(void **state) {
  (void)state;
  page p = recognise(draw_labelled);
  const pp_figure *f = only(&p, PP_FIGURE_COLUMN);
  assert_string_equal(f->recognizer, "labelled-bars");
  assert_null(f->scale);
  assert_int_equal(f->elements->len, 3);
  for (guint i = 0; i < 3; i++) {
    const pp_element *e = el(f, i);
    assert_float_equal(e->value, label_v[i], 0);
    assert_int_equal(e->source, PP_VALUE_DATA_LABEL);
    assert_true(isnan(e->scale_value));
    assert_float_equal(e->ink, 36 * label_v[i] * 8, 0.1);
  }
  page_free(&p);
}

/* ---- a legend beside the bars ---------------------------------------------------------- */
static void draw_legend(cairo_t *cr) {
  draw_axis(cr, &stack_axis);
  static const double v[] = {40, 70, 55, 85};
  for (int i = 0; i < 4; i++) {
    double x = 130 + 60 * i;
    fill_rect(cr, i % 2 ? 0.9 : 0.2, 0.4, i % 2 ? 0.1 : 0.7, x, y_of(&stack_axis, v[i]), x + 30,
              y_of(&stack_axis, 0));
  }
  /* legend: two swatches, each named to its right, above the plot */
  fill_rect(cr, 0.2, 0.4, 0.7, 380, 120, 390, 130);
  text(cr, 394, 129, "Ferry");
  fill_rect(cr, 0.9, 0.4, 0.1, 380, 136, 390, 146);
  text(cr, 394, 145, "Bus");
}

/* The swatches are neither a figure nor elements of the bar chart. */
static void test_legend(void **state) {
  (void)state;
  page p = recognise(draw_legend);
  assert_int_equal(p.charts->figures->len, 1);
  const pp_figure *f = only(&p, PP_FIGURE_COLUMN);
  assert_int_equal(f->elements->len, 4);
  assert_int_equal(f->n_series, 2);
  for (guint i = 0; i < 4; i++)
    assert_true(el(f, i)->box.y1 > 300); /* bars stand on the baseline at y 400 */
  page_free(&p);
}

/* ---- a log axis ------------------------------------------------------------------------ */
static const axis log_axis = {100, 400, 80, 1, 1000, 10, TRUE, FALSE};
static const double log_v[] = {5, 80, 600};

static void draw_log(cairo_t *cr) {
  draw_axis(cr, &log_axis);
  for (int i = 0; i < 3; i++) {
    double x = 130 + 70 * i;
    fill_rect(cr, 0.2, 0.4, 0.7, x, y_of(&log_axis, log_v[i]), x + 36, y_of(&log_axis, 1));
  }
}

/* log10 of the ticks fits their positions (1, 10, 100, 1000 evenly spaced), the values
 * do not: a log scale; bars read back within 0.5% of their value. */
static void test_log_axis(void **state) {
  (void)state;
  page p = recognise(draw_log);
  const pp_figure *f = only(&p, PP_FIGURE_COLUMN);
  assert_non_null(f->scale);
  assert_int_equal(f->scale->kind, PP_SCALE_LOG);
  for (guint i = 0; i < 3; i++) {
    assert_float_equal(el(f, i)->value, log_v[i], 0.005 * log_v[i]);
    assert_float_equal(el(f, i)->base_value, 1, 0.005);
  }
  page_free(&p);
}

/* ---- two value axes: bars on the left one, a line on the right one --------------------- */
static const axis left_axis = {100, 400, 2.5, 0, 100, 20, FALSE, FALSE};
/* Labels of different widths (0, 2.5, 5, …), so the right axis' column is left-aligned
 * only and faces the plot on its left. */
static const axis right_axis = {400, 400, 25, 0, 10, 2.5, FALSE, TRUE};
static const double dual_bars[] = {60, 80, 45}, dual_line[] = {3, 7, 5};

static void draw_two_axes(cairo_t *cr) {
  draw_axis(cr, &left_axis);
  draw_axis(cr, &right_axis);
  for (int i = 0; i < 3; i++) {
    double x = 140 + 80 * i;
    fill_rect(cr, 0.2, 0.4, 0.7, x, y_of(&left_axis, dual_bars[i]), x + 40, y_of(&left_axis, 0));
  }
  cairo_set_source_rgb(cr, 0.8, 0.1, 0.1);
  cairo_set_line_width(cr, 1.5);
  for (int i = 0; i < 3; i++)
    (i ? cairo_line_to : cairo_move_to)(cr, 160 + 80 * i, y_of(&right_axis, dual_line[i]));
  cairo_line_to(cr, 380, y_of(&right_axis, 6));
  cairo_stroke(cr);
}

/* The bars are read on the axis whose scale they were drawn to (left, 0–100), not on the
 * right one (0–10); the line goes to the right axis and is counted, not judged. */
static void test_two_value_axes(void **state) {
  (void)state;
  page p = recognise(draw_two_axes);
  const pp_figure *f = only(&p, PP_FIGURE_COLUMN);
  assert_float_equal(f->scale->max_value, 100, 1);
  for (guint i = 0; i < 3; i++)
    assert_float_equal(el(f, i)->value, dual_bars[i], 0.2);
  const pp_figure *l = only(&p, PP_FIGURE_LINE);
  assert_float_equal(l->scale->max_value, 10, 0.05);
  page_free(&p);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_area),
      cmocka_unit_test(test_stacks),
      cmocka_unit_test(test_stacks_drawn_top_first),
      cmocka_unit_test(test_funnel_gap_near_limit),
      cmocka_unit_test(test_funnel_gap_beyond_limit),
      cmocka_unit_test(test_labels_only),
      cmocka_unit_test(test_legend),
      cmocka_unit_test(test_log_axis),
      cmocka_unit_test(test_two_value_axes),
  };
  return cmocka_run_group_tests_name("recognize/families", tests, NULL, NULL);
}
