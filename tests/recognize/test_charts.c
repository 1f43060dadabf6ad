/* test_charts.c — the recognizer on charts drawn at test time with cairo's PDF surface:
 * every geometric fact is known because this file drew it, so the values, baselines and
 * ink the recognizer reports are checked against the drawing, not against itself. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cairo-pdf.h>
#include <cmocka.h>
#include <glib/gstdio.h>

#include "geometry/geometry.h"
#include "recognize/internal.h"
#include "recognize/recognize.h"

#include "test_page.h"

/* The chart: a plot box, a linear value axis [lo, hi] mapped onto it, bars of known
 * values, tick labels as real text. */
typedef struct {
  double x, y, w, h; /* plot box, page points, y down */
  double lo, hi;     /* axis range */
  gboolean horizontal, clip_from_zero, rotated_labels, minus_as_path;
  int n;
  const double *values;
  double tick_step;
  /* When not 0: a legend box with rounded corners in the plot's top left, its bottom
   * edge this many points above the second-highest tick, nearer that label's centre. */
  double stray_edge;
  /* Tick labels drawn this many points above their ticks (matplotlib's 7.5 pt labels
   * centre their font box about 1.8 pt above the tick). */
  double label_lift;
} chart;

static double pos_of(const chart *c, double v) {
  double t = (v - c->lo) / (c->hi - c->lo);
  return c->horizontal ? c->x + t * c->w : c->y + c->h - t * c->h;
}

static void draw_chart(cairo_t *cr, const chart *c) {
  cairo_select_font_face(cr, "DejaVu Sans", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_NORMAL);
  cairo_set_font_size(cr, 9);
  cairo_set_source_rgb(cr, 0, 0, 0);
  cairo_set_line_width(cr, 0.8);
  for (double v = c->lo; v <= c->hi + 1e-9; v += c->tick_step) {
    char buf[32];
    g_snprintf(buf, sizeof buf, "%g", fabs(v));
    cairo_text_extents_t te;
    cairo_text_extents(cr, buf, &te);
    double p = pos_of(c, v);
    if (c->horizontal) {
      cairo_move_to(cr, p, c->y + c->h);
      cairo_line_to(cr, p, c->y + c->h + 4);
      cairo_stroke(cr);
      cairo_move_to(cr, p - te.width / 2 - te.x_bearing, c->y + c->h + 14);
      cairo_show_text(cr, buf);
      continue;
    }
    cairo_move_to(cr, c->x - 4, p);
    cairo_line_to(cr, c->x, p);
    cairo_stroke(cr);
    if (c->rotated_labels) { /* a quarter turn, reading upwards, centred on the tick */
      cairo_save(cr);
      cairo_move_to(cr, c->x - 7, p + te.width / 2);
      cairo_rotate(cr, -G_PI / 2);
      cairo_show_text(cr, buf);
      cairo_restore(cr);
    } else {
      double tx = c->x - 7 - te.width - te.x_bearing;
      cairo_move_to(cr, tx, p + te.height / 2 - c->label_lift);
      cairo_show_text(cr, buf);
      if (v < 0 && c->minus_as_path) { /* a minus drawn as a filled bar, as Type 3 fonts do */
        cairo_rectangle(cr, tx - 6.5, p - 0.4, 5, 0.8);
        cairo_fill(cr);
      } else if (v < 0) {
        cairo_move_to(cr, tx - 6, p + te.height / 2);
        cairo_show_text(cr, "-");
      }
    }
  }
  if (c->stray_edge != 0) {
    double bottom = pos_of(c, c->hi - c->tick_step) - c->stray_edge, r = 3;
    double x0 = c->x + 10, x1 = c->x + 90, y0 = c->y + 5;
    cairo_new_sub_path(cr);
    cairo_arc(cr, x1 - r, y0 + r, r, -G_PI / 2, 0);
    cairo_arc(cr, x1 - r, bottom - r, r, 0, G_PI / 2);
    cairo_arc(cr, x0 + r, bottom - r, r, G_PI / 2, G_PI);
    cairo_arc(cr, x0 + r, y0 + r, r, G_PI, 3 * G_PI / 2);
    cairo_close_path(cr);
    cairo_stroke(cr);
  }
  cairo_save(cr);
  if (c->clip_from_zero) { /* bars drawn from 0, cut by the plot frame */
    cairo_rectangle(cr, c->x, c->y, c->w, c->h);
    cairo_clip(cr);
  }
  double slot = (c->horizontal ? c->h : c->w) / c->n;
  double from = c->clip_from_zero ? 0 : (c->lo > 0 ? c->lo : 0);
  cairo_set_source_rgb(cr, 0.2, 0.4, 0.6);
  for (int i = 0; i < c->n; i++) {
    double a0 = (c->horizontal ? c->y : c->x) + i * slot + slot * 0.2, a1 = a0 + slot * 0.6;
    double p0 = pos_of(c, from), p1 = pos_of(c, c->values[i]);
    if (c->horizontal)
      cairo_rectangle(cr, fmin(p0, p1), a0, fabs(p1 - p0), a1 - a0);
    else
      cairo_rectangle(cr, a0, fmin(p0, p1), a1 - a0, fabs(p1 - p0));
    cairo_fill(cr);
  }
  cairo_restore(cr);
}

static void draw_page(cairo_t *cr, const void *c) {
  draw_chart(cr, c);
}

static pp_page_charts *recognise(const chart *c, pp_scene **scene_out, pp_document **doc_out) {
  pp_test_page p = pp_test_page_draw(draw_page, c);
  *scene_out = p.scene;
  *doc_out = p.doc;
  return p.charts;
}

static const pp_figure *only_figure(const pp_page_charts *charts, pp_figure_kind kind) {
  const pp_figure *found = NULL;
  for (guint i = 0; i < charts->figures->len; i++) {
    const pp_figure *f = g_ptr_array_index(charts->figures, i);
    if (f->kind == kind) {
      assert_null(found);
      found = f;
    }
  }
  assert_non_null(found);
  return found;
}

/* Values back within 0.2% of the axis span, ink equal to the drawn visible rectangle
 * within 0.1 pt² (the capture resolves 1/1024 pt). */
static void check_bars(const chart *c, const pp_figure *f, double baseline) {
  assert_int_equal(f->elements->len, c->n);
  double slot = (c->horizontal ? c->h : c->w) / c->n;
  for (int i = 0; i < c->n; i++) {
    const pp_element *e = &g_array_index(f->elements, pp_element, i);
    assert_true(fabs(e->value - c->values[i]) < 0.002 * (c->hi - c->lo));
    assert_true(fabs(e->base_value - baseline) < 0.002 * (c->hi - c->lo));
    double visible_len = fabs(pos_of(c, c->values[i]) - pos_of(c, fmax(baseline, c->lo)));
    assert_true(fabs(e->ink - visible_len * slot * 0.6) < 0.1);
  }
}

static void test_truncated_columns_clipped(void **state) {
  (void)state;
  /* Bars from 0 cut by a plot frame starting at 400: the visible ink is the clipped part. */
  static const double v[] = {410, 440, 470, 455};
  chart c = {100, 100, 300, 200, 400, 480, FALSE, TRUE, FALSE, FALSE, 4, v, 10, 0, 0};
  pp_scene *scene;
  pp_document *doc;
  pp_page_charts *charts = recognise(&c, &scene, &doc);
  const pp_figure *f = only_figure(charts, PP_FIGURE_COLUMN);
  assert_non_null(f->scale);
  assert_int_equal(f->scale->kind, PP_SCALE_LINEAR);
  check_bars(&c, f, 400);
  pp_page_charts_free(charts);
  pp_scene_free(scene);
  pp_document_free(doc);
}

static void test_horizontal_bars(void **state) {
  (void)state;
  static const double v[] = {120, 260, 75};
  chart c = {150, 300, 320, 150, 0, 300, TRUE, FALSE, FALSE, FALSE, 3, v, 50, 0, 0};
  pp_scene *scene;
  pp_document *doc;
  pp_page_charts *charts = recognise(&c, &scene, &doc);
  const pp_figure *f = only_figure(charts, PP_FIGURE_BAR);
  check_bars(&c, f, 0);
  pp_page_charts_free(charts);
  pp_scene_free(scene);
  pp_document_free(doc);
}

static void test_rotated_tick_labels(void **state) {
  (void)state;
  /* R's default: y tick labels turned a quarter, reading upwards. */
  static const double v[] = {30, 55, 80, 20, 65};
  chart c = {120, 150, 350, 220, 0, 100, FALSE, FALSE, TRUE, FALSE, 5, v, 20, 0, 0};
  pp_scene *scene;
  pp_document *doc;
  pp_page_charts *charts = recognise(&c, &scene, &doc);
  check_bars(&c, only_figure(charts, PP_FIGURE_COLUMN), 0);
  pp_page_charts_free(charts);
  pp_scene_free(scene);
  pp_document_free(doc);
}

static void test_negative_bars_path_minus(void **state) {
  (void)state;
  /* Negative ticks whose minus is a filled bar, not text: values must come back signed. */
  static const double v[] = {-15, 25, -35, 10};
  chart c = {120, 150, 320, 240, -40, 40, FALSE, FALSE, FALSE, TRUE, 4, v, 20, 0, 0};
  pp_scene *scene;
  pp_document *doc;
  pp_page_charts *charts = recognise(&c, &scene, &doc);
  check_bars(&c, only_figure(charts, PP_FIGURE_COLUMN), 0);
  pp_page_charts_free(charts);
  pp_scene_free(scene);
  pp_document_free(doc);
}

/* A legend frame whose bottom edge passes nearer a tick label's centre than the label's
 * own tick (matplotlib's default legend, upper left, does this): the label must still
 * snap to its tick, which starts on the axis line like the others, so every tick sits
 * where this file drew it (within the capture's 1/1024 pt, twice) and the bars read
 * their drawn values within 0.01 on a 0–100 axis. */
static void test_tick_not_legend_edge(void **state) {
  (void)state;
  static const double v[] = {20, 35, 50, 60};
  chart c = {100, 100, 300, 200, 0, 100, FALSE, FALSE, FALSE, FALSE, 4, v, 20, 1.5, 2.0};
  pp_scene *scene;
  pp_document *doc;
  pp_page_charts *charts = recognise(&c, &scene, &doc);
  const pp_figure *f = only_figure(charts, PP_FIGURE_COLUMN);
  assert_non_null(f->scale);
  assert_int_equal(f->scale->ticks->len, 6);
  for (guint i = 0; i < f->scale->ticks->len; i++) {
    const pp_tick *t = &g_array_index(f->scale->ticks, pp_tick, i);
    assert_true(fabs(t->pos - pos_of(&c, t->value)) < 2.0 / 1024);
  }
  assert_int_equal(f->elements->len, c.n);
  for (int i = 0; i < c.n; i++)
    assert_true(fabs(g_array_index(f->elements, pp_element, i).value - v[i]) < 0.01);
  pp_page_charts_free(charts);
  pp_scene_free(scene);
  pp_document_free(doc);
}

static void add_word(pp_scene *s, const char *text, double x0, double x1) {
  pp_text_run *w = g_new0(pp_text_run, 1);
  w->text = g_strdup(text);
  w->box = (pp_rect){x0, 100, x1, 110};
  w->font_size = 10;
  w->font_name = g_strdup("");
  g_ptr_array_add(s->words, w);
}

/* Words split by the text API: "8," "000" is one number (TeX kerns after the comma;
 * CLDR en grouping is groups of three), "(1," "2)" a pair of cell indices, not the
 * accounting negative −1,2. */
static void test_split_numbers(void **state) {
  (void)state;
  pp_scene *s = pp_scene_new(0, 595, 842);
  add_word(s, "8,", 100, 107);
  add_word(s, "000", 109, 124);
  add_word(s, "(1,", 300, 310);
  add_word(s, "2)", 312, 320);
  GHashTable *glyphs = g_hash_table_new(NULL, NULL);
  GPtrArray *labels = pp_labels_collect(s, glyphs);
  assert_int_equal(labels->len, 1);
  const pp_label *l = g_ptr_array_index(labels, 0);
  assert_true(l->number.value == 8000);
  g_ptr_array_unref(labels);
  g_hash_table_unref(glyphs);
  pp_scene_free(s);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_truncated_columns_clipped),
      cmocka_unit_test(test_horizontal_bars),
      cmocka_unit_test(test_rotated_tick_labels),
      cmocka_unit_test(test_negative_bars_path_minus),
      cmocka_unit_test(test_split_numbers),
      cmocka_unit_test(test_tick_not_legend_edge),
  };
  return cmocka_run_group_tests_name("recognize/charts", tests, NULL, NULL);
}
