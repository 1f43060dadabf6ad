/* test_evidence.c — what is not a chart is seen, not judged (src/recognize/evidence.c).
 * Each case is drawn at test time with cairo's PDF surface, so what it is (a zebra table,
 * tags behind words, rules, shadowed boxes, line numbers, year rows) is known from the
 * drawing; a real labelled bar chart drawn the same way stays judged. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <string.h>

#include <cairo-pdf.h>
#include <cmocka.h>
#include <glib/gstdio.h>

#include "geometry/geometry.h"
#include "recognize/recognize.h"

#include "test_page.h"

typedef void (*drawing)(cairo_t *cr);

static void call_drawing(cairo_t *cr, const void *draw) {
  cairo_set_font_size(cr, 9);
  (*(const drawing *)draw)(cr);
}

static pp_page_charts *recognise(drawing draw) {
  pp_test_page p = pp_test_page_draw(call_drawing, &draw);
  pp_page_charts *charts = g_steal_pointer(&p.charts);
  pp_test_page_clear(&p);
  return charts;
}

static void text_at(cairo_t *cr, double x, double y, const char *t) {
  cairo_set_source_rgb(cr, 0, 0, 0);
  cairo_move_to(cr, x, y);
  cairo_show_text(cr, t);
}

static void box(cairo_t *cr, double x, double y, double w, double h, double grey) {
  cairo_set_source_rgb(cr, grey, grey, grey);
  cairo_rectangle(cr, x, y, w, h);
  cairo_fill(cr);
}

/* Every bar or area figure on the page is seen, not judged, for the expected reason; at
 * least one was seen (the drawing does fool a bar reader). */
static void expect_not_judged(drawing draw, const char *reason) {
  pp_page_charts *charts = recognise(draw);
  guint seen = 0;
  for (guint i = 0; i < charts->figures->len; i++) {
    const pp_figure *f = g_ptr_array_index(charts->figures, i);
    if (f->kind != PP_FIGURE_COLUMN && f->kind != PP_FIGURE_BAR && f->kind != PP_FIGURE_AREA)
      continue;
    seen++;
    assert_false(f->judged);
    assert_non_null(f->not_judged_reason);
    if (!strstr(f->not_judged_reason, reason))
      fail_msg("reason \"%s\" lacks \"%s\"", f->not_judged_reason, reason);
  }
  assert_true(seen > 0);
  pp_page_charts_free(charts);
}

/* A zebra table: equal shaded rows, a number at the end of each. */
static void draw_zebra(cairo_t *cr) {
  for (int i = 0; i < 6; i++) {
    box(cr, 100, 100 + 24 * i, 300, 12, 0.85);
    char buf[16];
    g_snprintf(buf, sizeof buf, "%d", 40 + 17 * i);
    text_at(cr, 402, 110 + 24 * i, buf);
  }
}

static void test_zebra_table(void **state) {
  (void)state;
  expect_not_judged(draw_zebra, "same length");
}

/* Tags behind words: boxes of different widths, each holding a word and a number. */
static void draw_tags(cairo_t *cr) {
  static const char *words[] = {"New", "Old", "Fix", "Add", "Cut"};
  for (int i = 0; i < 5; i++) {
    double w = 40 + 9 * i;
    box(cr, 100, 100 + 30 * i, w, 13, 0.9);
    text_at(cr, 102, 110 + 30 * i, words[i]);
    char buf[16];
    g_snprintf(buf, sizeof buf, "%d", 3 + 2 * i);
    text_at(cr, 100 + w + 2, 110 + 30 * i, buf);
  }
}

static void test_words_on_marks(void **state) {
  (void)state;
  expect_not_judged(draw_tags, "words on the marks");
}

/* Rules thinner than a line, of growing length, each ended by a number. */
static void draw_rules(cairo_t *cr) {
  for (int i = 0; i < 5; i++) {
    double len = 100 + 50 * i;
    box(cr, 100, 100 + 20 * i, len, 0.6, 0.2);
    char buf[16];
    g_snprintf(buf, sizeof buf, "%d", 10 * (i + 3));
    text_at(cr, 100 + len + 3, 104 + 20 * i, buf);
  }
}

static void test_thin_rules(void **state) {
  (void)state;
  expect_not_judged(draw_rules, "thinner than a line");
}

/* Boxes of growing height standing on one line, each with a grey copy offset 4 pt right
 * and down behind it, a number on top. */
static void draw_shadows(cairo_t *cr) {
  for (int i = 0; i < 4; i++) {
    double h = 60 + 25 * i, x = 100 + 60 * i;
    box(cr, x + 4, 400 - h + 4, 40, h, 0.5);
    box(cr, x, 400 - h, 40, h, 0.8);
    char buf[16];
    g_snprintf(buf, sizeof buf, "%d", 7 + 5 * i);
    text_at(cr, x + 14, 400 - h - 3, buf);
  }
}

static void test_drop_shadows(void **state) {
  (void)state;
  expect_not_judged(draw_shadows, "drop shadows");
}

/* Listing lines: shaded backgrounds of different lengths numbered 1, 2, 3… at their
 * ends (the numbers count lines, they measure nothing). */
static void draw_line_numbers(cairo_t *cr) {
  for (int i = 0; i < 6; i++) {
    double len = 120 + 23 * ((i * 5) % 7);
    box(cr, 100, 100 + 14 * i, len, 12, 0.93);
    char buf[16];
    g_snprintf(buf, sizeof buf, "%d", i + 1);
    text_at(cr, 100 + len + 2, 110 + 14 * i, buf);
  }
}

static void test_line_numbers(void **state) {
  (void)state;
  expect_not_judged(draw_line_numbers, "count 1, 2, 3");
}

/* Bars of different lengths with a year at each tip: the years name the bars. */
static void draw_year_tips(cairo_t *cr) {
  for (int i = 0; i < 4; i++) {
    double len = 80 + 45 * i;
    box(cr, 100, 100 + 30 * i, len, 16, 0.4);
    char buf[16];
    g_snprintf(buf, sizeof buf, "%d", 2031 + i);
    text_at(cr, 100 + len + 3, 112 + 30 * i, buf);
  }
}

static void test_year_labels(void **state) {
  (void)state;
  expect_not_judged(draw_year_tips, "years");
}

/* A labelled bar chart whose lengths follow its labels: it stays judged. */
static void draw_labelled_chart(cairo_t *cr) {
  static const double v[] = {12, 30, 21, 45};
  for (int i = 0; i < 4; i++) {
    double h = 4 * v[i], x = 100 + 50 * i;
    box(cr, x, 400 - h, 30, h, 0.3);
    char buf[16];
    g_snprintf(buf, sizeof buf, "%g", v[i]);
    text_at(cr, x + 9, 400 - h - 3, buf);
  }
  static const char *names[] = {"Tern", "Gull", "Skua", "Auk"};
  for (int i = 0; i < 4; i++)
    text_at(cr, 100 + 50 * i + 4, 412, names[i]);
}

static void test_chart_stays_judged(void **state) {
  (void)state;
  pp_page_charts *charts = recognise(draw_labelled_chart);
  guint judged = 0;
  for (guint i = 0; i < charts->figures->len; i++) {
    const pp_figure *f = g_ptr_array_index(charts->figures, i);
    if (f->kind == PP_FIGURE_COLUMN) {
      assert_true(f->judged);
      judged++;
    }
  }
  assert_int_equal(judged, 1);
  pp_page_charts_free(charts);
}

/* An arrow icon (a manual's "step" marker): one outline, scaled by s, at x, y. */
static void arrow(cairo_t *cr, double x, double y, double s) {
  static const double pts[][2] = {{0, 8}, {26, 8}, {26, 0}, {44, 16}, {26, 32}, {26, 24}, {0, 24}};
  cairo_set_source_rgb(cr, 0.2, 0.4, 0.7);
  cairo_move_to(cr, x + s * pts[0][0], y + s * pts[0][1]);
  for (guint i = 1; i < G_N_ELEMENTS(pts); i++)
    cairo_line_to(cr, x + s * pts[i][0], y + s * pts[i][1]);
  cairo_close_path(cr);
  cairo_fill(cr);
}

/* Arrows of a manual drawn at whatever size fits the layout, each with a step number in
 * it; the numbers do not grow with the arrows (sizes 1.0, 1.9, 1.3, 2.4 hold steps 3, 1,
 * 4, 2). */
static const double manual_scale[] = {1.0, 1.9, 1.3, 2.4};
static void draw_manual_arrows(cairo_t *cr) {
  static const char *steps[] = {"3", "1", "4", "2"};
  for (int i = 0; i < 4; i++) {
    double s = manual_scale[i], x = 80 + 120 * i, y = 200;
    arrow(cr, x, y, s);
    text_at(cr, x + 10 * s, y + 19 * s, steps[i]);
  }
}

/* The same arrows with numbers whose square roots follow their sizes: a pictogram chart
 * (area ∝ value, value = 10·s²). */
static void draw_sized_arrows(cairo_t *cr) {
  for (int i = 0; i < 4; i++) {
    double s = manual_scale[i], x = 80 + 120 * i, y = 200;
    arrow(cr, x, y, s);
    char buf[16];
    g_snprintf(buf, sizeof buf, "%.1f", 10 * s * s);
    text_at(cr, x + 6 * s, y + 19 * s, buf);
  }
}

/* The bubble and symbol figures on a page: how many, and how many judged. */
static void count_symbols(drawing draw, guint *seen, guint *judged, const char *reason) {
  pp_page_charts *charts = recognise(draw);
  *seen = *judged = 0;
  for (guint i = 0; i < charts->figures->len; i++) {
    const pp_figure *f = g_ptr_array_index(charts->figures, i);
    if (f->kind != PP_FIGURE_BUBBLE)
      continue;
    (*seen)++;
    *judged += f->judged;
    if (!f->judged && reason && !strstr(f->not_judged_reason, reason))
      fail_msg("reason \"%s\" lacks \"%s\"", f->not_judged_reason, reason);
  }
  pp_page_charts_free(charts);
}

/* KPI cards: boxes of a dashboard standing on one line, each holding its figure in a
 * 26 pt headline size, its name under it. */
static void draw_kpi_cards(cairo_t *cr) {
  static const double h[] = {90, 110, 100, 120};
  static const char *figure[] = {"412", "961", "58", "37"};
  static const char *name[] = {"Crossings", "Berths", "Ferries", "Delays"};
  for (int i = 0; i < 4; i++) {
    double x = 80 + 125 * i;
    box(cr, x, 300 - h[i], 110, h[i], 0.75);
    cairo_set_font_size(cr, 26);
    text_at(cr, x + 30, 300 - h[i] / 2 + 9, figure[i]);
    cairo_set_font_size(cr, 9);
    text_at(cr, x + 30, 315, name[i]);
  }
}

static void test_kpi_cards(void **state) {
  (void)state;
  expect_not_judged(draw_kpi_cards, "KPI cards");
}

/* A state diagram: boxes sized by their layout, standing on one line, each numbered, and
 * arrows from each box's right side to the next box's left side (shaft stopping 6 pt
 * short, a filled head). */
static void draw_connected_boxes(cairo_t *cr) {
  static const double h[] = {50, 80, 65, 95};
  static const char *code[] = {"200", "301", "404", "503"};
  for (int i = 0; i < 4; i++) {
    double x = 100 + 100 * i;
    box(cr, x, 400 - h[i], 60, h[i], 0.85);
    text_at(cr, x + 22, 400 - h[i] + 12, code[i]);
    if (i == 3)
      continue;
    cairo_set_source_rgb(cr, 0, 0, 0);
    cairo_set_line_width(cr, 0.8);
    cairo_move_to(cr, x + 60, 380);
    cairo_line_to(cr, x + 94, 380);
    cairo_stroke(cr);
    cairo_move_to(cr, x + 94, 377);
    cairo_line_to(cr, x + 100, 380);
    cairo_line_to(cr, x + 94, 383);
    cairo_close_path(cr);
    cairo_fill(cr);
  }
}

static void test_connected_boxes(void **state) {
  (void)state;
  expect_not_judged(draw_connected_boxes, "connectors");
}

/* A choropleth map of four districts tiling a frame, with a numeric scale of its colour
 * classes in a column to its left. */
static void draw_map(cairo_t *cr) {
  static const double region[4][4][2] = {
      {{100, 120}, {250, 130}, {240, 260}, {100, 250}},
      {{250, 130}, {400, 120}, {400, 270}, {240, 260}},
      {{100, 250}, {240, 260}, {250, 400}, {100, 400}},
      {{240, 260}, {400, 270}, {400, 400}, {250, 400}},
  };
  for (int r = 0; r < 4; r++) {
    cairo_set_source_rgb(cr, 0.3 + 0.15 * r, 0.6, 0.4);
    cairo_move_to(cr, region[r][0][0], region[r][0][1]);
    for (int k = 1; k < 4; k++)
      cairo_line_to(cr, region[r][k][0], region[r][k][1]);
    cairo_close_path(cr);
    cairo_fill(cr);
  }
  for (int k = 0; k < 5; k++) {
    char buf[16];
    g_snprintf(buf, sizeof buf, "%d", 250 * k);
    text_at(cr, 60, 403 - 70 * k, buf);
  }
}

static void test_map(void **state) {
  (void)state;
  expect_not_judged(draw_map, "map");
}

/* The same labelled bars placed at irregular positions (gaps 30, 90, 20 pt). */
static void draw_irregular_chart(cairo_t *cr) {
  static const double v[] = {12, 30, 21, 45}, x[] = {100, 130, 220, 240};
  static const char *names[] = {"Tern", "Gull", "Skua", "Auk"};
  for (int i = 0; i < 4; i++) {
    double h = 4 * v[i];
    box(cr, x[i], 400 - h, 16, h, 0.3);
    char buf[16];
    g_snprintf(buf, sizeof buf, "%g", v[i]);
    text_at(cr, x[i] + 2, 400 - h - 3, buf);
    text_at(cr, x[i], 412, names[i]);
  }
}

/* The one column figure's score for the evidence `what` (NAN when absent) and its
 * confidence. */
static double column_evidence(drawing draw, const char *what, double *confidence) {
  pp_page_charts *charts = recognise(draw);
  double score = NAN;
  guint n = 0;
  for (guint i = 0; i < charts->figures->len; i++) {
    const pp_figure *f = g_ptr_array_index(charts->figures, i);
    if (f->kind != PP_FIGURE_COLUMN)
      continue;
    n++;
    *confidence = f->confidence;
    for (guint k = 0; k < f->evidence->len; k++)
      if (strcmp(g_array_index(f->evidence, pp_evidence, k).what, what) == 0)
        score = g_array_index(f->evidence, pp_evidence, k).score;
  }
  assert_int_equal(n, 1);
  pp_page_charts_free(charts);
  return score;
}

/* Regular spacing is evidence of a bar chart and enters the confidence: bars drawn at one
 * pitch (every gap equal by construction) score higher than the same bars at gaps of 30,
 * 90 and 20 pt (one gap of three within 10% of the median), and the confidence follows. */
static void test_spacing_in_confidence(void **state) {
  (void)state;
  double c_regular = 0, c_irregular = 0;
  double regular = column_evidence(draw_labelled_chart, "regular-spacing", &c_regular);
  double irregular = column_evidence(draw_irregular_chart, "regular-spacing", &c_irregular);
  assert_true(regular > 0);
  assert_true(isnan(irregular) || irregular < regular / 2);
  assert_true(c_irregular < c_regular);
  assert_true(c_regular > 0 && c_regular < 1);
}

/* Stacked columns on a value axis 0–400 (0.75 pt per unit, baseline y = 400), a number
 * centred in every segment and the total over the first stack only. */
static const double stack_part[3][3] = {{60, 100, 50}, {80, 90, 70}, {70, 120, 60}};
static void draw_stacked_labelled(cairo_t *cr) {
  for (int k = 0; k <= 4; k++) {
    char buf[16];
    g_snprintf(buf, sizeof buf, "%d", 100 * k);
    text_at(cr, 62 - 6 * (int)strlen(buf), 403 - 75 * k, buf);
    cairo_move_to(cr, 66, 400 - 75 * k);
    cairo_line_to(cr, 70, 400 - 75 * k);
  }
  cairo_move_to(cr, 70, 100);
  cairo_line_to(cr, 70, 400);
  cairo_set_line_width(cr, 0.6);
  cairo_stroke(cr);
  for (int i = 0; i < 3; i++) {
    double x = 100 + 60 * i, v0 = 0;
    for (int s = 0; s < 3; s++) {
      double v1 = v0 + stack_part[i][s];
      box(cr, x, 400 - 0.75 * v1, 30, 0.75 * stack_part[i][s], 0.25 + 0.25 * s);
      char buf[16];
      g_snprintf(buf, sizeof buf, "%g", stack_part[i][s]);
      text_at(cr, x + 9, 400 - 0.75 * (v0 + v1) / 2 + 3, buf);
      v0 = v1;
    }
    if (i == 0)
      text_at(cr, x + 6, 400 - 0.75 * v0 - 4, "210");
  }
}

/* Each segment of a stack is paired with the number centred in it, and the total over
 * the stack with the stack; readings at the segments' ends follow the drawing (0.75 pt
 * per unit, exact by construction, within 1 unit). */
static void test_stacked_segment_labels(void **state) {
  (void)state;
  pp_page_charts *charts = recognise(draw_stacked_labelled);
  const pp_figure *f = NULL;
  for (guint i = 0; i < charts->figures->len; i++) {
    const pp_figure *g = g_ptr_array_index(charts->figures, i);
    if (g->kind == PP_FIGURE_COLUMN)
      f = g;
  }
  assert_non_null(f);
  assert_int_equal(f->elements->len, 3);
  for (guint i = 0; i < 3; i++) {
    const pp_element *e = &g_array_index(f->elements, pp_element, i);
    assert_true(e->stacked);
    assert_int_equal(e->parts->len, 3);
    double top = 0;
    for (guint s = 0; s < 3; s++) {
      const pp_part *p = &g_array_index(e->parts, pp_part, s);
      top += stack_part[i][s];
      assert_float_equal(p->label_value, stack_part[i][s], 1e-9);
      assert_float_equal(p->end, top, 1.0);
    }
    if (i == 0)
      assert_float_equal(e->label_value, 210, 1e-9);
    else
      assert_true(isnan(e->label_value));
  }
  pp_page_charts_free(charts);
}

/* Symbols are judged only when their sizes follow their numbers by a power law (log-log
 * fit, exponent > 0, R² ≥ 0.9; src/recognize/symbols.c): the manual's arrows are read as
 * a symbol family (so the check is reached) but not judged. */
static void test_symbols_sizes_not_numbers(void **state) {
  (void)state;
  guint seen, judged;
  count_symbols(draw_manual_arrows, &seen, &judged, "do not grow with their numbers");
  assert_int_equal(seen, 1);
  assert_int_equal(judged, 0);
}

/* Control: the same icons whose numbers are 10·s² (area ∝ value, the law a pictogram
 * chart follows; exact by construction) stay judged. */
static void test_symbols_sizes_follow_numbers(void **state) {
  (void)state;
  guint seen, judged;
  count_symbols(draw_sized_arrows, &seen, &judged, NULL);
  assert_int_equal(seen, 1);
  assert_int_equal(judged, 1);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_zebra_table),
      cmocka_unit_test(test_words_on_marks),
      cmocka_unit_test(test_thin_rules),
      cmocka_unit_test(test_drop_shadows),
      cmocka_unit_test(test_line_numbers),
      cmocka_unit_test(test_year_labels),
      cmocka_unit_test(test_chart_stays_judged),
      cmocka_unit_test(test_symbols_sizes_not_numbers),
      cmocka_unit_test(test_symbols_sizes_follow_numbers),
      cmocka_unit_test(test_kpi_cards),
      cmocka_unit_test(test_connected_boxes),
      cmocka_unit_test(test_map),
      cmocka_unit_test(test_spacing_in_confidence),
      cmocka_unit_test(test_stacked_segment_labels),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
