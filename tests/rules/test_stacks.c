/* test_stacks.c — stacked segments against the numbers printed in them (bars-vs-labels),
 * on stacks built by hand, every expected value computed by hand from the published
 * formulas: Tufte (1983), The Visual Display of Quantitative Information, p. 57 (lie
 * factor, faithful band 0.95–1.05); Steinbart (1989), The Accounting Review 64(1) (GDI =
 * 100·(a/b − 1), ±10% materiality). The 5% label tolerance is plotproof's (docs/rules.md:
 * common practice, no source); half a unit of a label's last digit is its rounding. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "rules/internal.h"

/* Segments 20 pt wide, so ink = 20 × drawn thickness. */
#define WIDTH 20.0

/* Stacks of two segments each, categories "A", "B", …: drawn thicknesses (scale units,
 * from base), printed labels (NAN: none); a scale from base to hi when with_scale. */
static pp_figure *stacks(guint n, const double (*drawn)[2], const double (*labels)[2],
                         gboolean with_scale, double base, double hi) {
  pp_figure *f = pp_figure_new(PP_FIGURE_COLUMN);
  f->fingerprint = g_strdup("0123456789abcdef");
  f->bbox = (pp_rect){10, 10, 210, 110};
  if (with_scale) {
    f->scale = pp_scale_new(TRUE);
    f->scale->min_value = base;
    f->scale->max_value = hi;
  }
  for (guint i = 0; i < n; i++) {
    pp_element e = pp_element_init(PP_ENCODING_LENGTH);
    double at = base, ink = 0;
    for (guint k = 0; k < 2; k++) {
      pp_element_add_part(&e, 2 * i + k, PP_PART_SEGMENT, WIDTH * drawn[i][k]);
      pp_part *p = &g_array_index(e.parts, pp_part, k);
      if (with_scale)
        p->start = at, p->end = at + drawn[i][k];
      p->label_value = labels[i][k];
      at += drawn[i][k];
      ink += WIDTH * drawn[i][k];
    }
    e.box = e.shape.rect = (pp_rect){20 + 40 * i, 100 - (at - base), 20 + 40 * i + WIDTH, 100};
    e.shape.kind = PP_SHAPE_RECT;
    e.ink = ink;
    e.extent = at - base;
    e.stacked = TRUE;
    if (with_scale) {
      e.value = e.scale_value = at;
      e.base_value = base;
      e.source = PP_VALUE_SCALE;
    }
    e.category = g_strdup_printf("%c", 'A' + i);
    g_array_append_val(f->elements, e);
  }
  return f;
}

static GPtrArray *check(const pp_figure *f) {
  pp_thresholds t = pp_thresholds_default();
  GPtrArray *out = g_ptr_array_new_with_free_func((GDestroyNotify)pp_finding_free);
  pp_rules_check_figure(f, &t, out);
  assert_true(out->len <= 1); /* one rule judges a figure */
  return out;
}

/* Stack A: labels 20, 30 drawn 20, 30; stack B: labels 25, 40, its top drawn 60. Labels
 * are the values; first segment 1 of A (20, ink 400), last segment 2 of B (40, ink 1200).
 * Growth form (1200/400)/(40/20) = 1.5; Tufte ((1200−400)/400)/((40−20)/20) = 2, GDI
 * +100%; worst pair: ink per unit value 20, 20, 20, 30 → 30/20 = 1.5. Distortion 1.5:
 * major (above 1.10, below 2). The same with a zero-based scale (the top of B reads 60,
 * not 40) and without one (labels are the values). */
static void test_segment_drawn_off_its_label(void **state) {
  (void)state;
  const double drawn[][2] = {{20, 30}, {25, 60}}, labels[][2] = {{20, 30}, {25, 40}};
  for (int with_scale = 1; with_scale >= 0; with_scale--) {
    pp_figure *fig = stacks(2, drawn, labels, with_scale, 0, 100);
    GPtrArray *out = check(fig);
    assert_int_equal(out->len, 1);
    const pp_finding *f = g_ptr_array_index(out, 0);
    assert_string_equal(f->rule, "bars-vs-labels");
    assert_int_equal(f->elements->len, 4);
    assert_float_equal(f->measures.growth_ratio, 1.5, 1e-9);
    assert_float_equal(f->measures.gdi, 100.0, 1e-9);
    assert_float_equal(f->measures.max_pair_departure, 1.5, 1e-9);
    assert_int_equal(f->severity, PP_SEVERITY_MAJOR);
    assert_string_equal(f->message,
                        "shows segment 2 of B 100% above segment 1 of A as 200% above: stacked "
                        "segments' lengths disagree with the numbers printed in them; segment 1 "
                        "of A (20) to segment 2 of B (40): ink ×3 for value ×2 (Lie Factor 2.00, "
                        "GDI +100%)");
    /* the top segment of B is the upper 60 of its stack's 85 (box 15 to 100) */
    const pp_finding_element *b2 = &g_array_index(f->elements, pp_finding_element, 3);
    assert_float_equal(b2->box.y0, 15, 1e-9);
    assert_float_equal(b2->box.y1, 75, 1e-9);
    g_ptr_array_unref(out);
    pp_figure_free(fig);
  }
}

/* The same stacks as horizontal bars growing right from x = 20, without a scale: the
 * finding's box of B's top segment is the right 60 of its bar's 85 (x 45 to 105). */
static void test_horizontal_segment_boxes(void **state) {
  (void)state;
  const double drawn[][2] = {{20, 30}, {25, 60}}, labels[][2] = {{20, 30}, {25, 40}};
  pp_figure *fig = stacks(2, drawn, labels, FALSE, 0, 100);
  fig->kind = PP_FIGURE_BAR;
  for (guint i = 0; i < 2; i++) {
    pp_element *e = &g_array_index(fig->elements, pp_element, i);
    e->box = e->shape.rect = (pp_rect){20, 20 + 40 * i, 20 + e->extent, 20 + 40 * i + WIDTH};
  }
  GPtrArray *out = check(fig);
  assert_int_equal(out->len, 1);
  const pp_finding *f = g_ptr_array_index(out, 0);
  assert_float_equal(f->measures.growth_ratio, 1.5, 1e-9);
  const pp_finding_element *b2 = &g_array_index(f->elements, pp_finding_element, 3);
  assert_float_equal(b2->box.x0, 45, 1e-9);
  assert_float_equal(b2->box.x1, 105, 1e-9);
  assert_float_equal(b2->box.y0, 60, 1e-9);
  g_ptr_array_unref(out);
  pp_figure_free(fig);
}

/* Honest stacks whose labels are rounded to whole numbers: drawn 3.4, 12.2 and 7.6, 9.5
 * printed 3, 12, 8, 10. On the labels alone the worst pair departs (3.4/3)/(12.2/12) =
 * 1.115, beyond the band; every label is within half a unit (0.5) of its drawing, so
 * rounding explains it: quiet, with a scale and without one. */
static void test_rounded_labels_are_quiet(void **state) {
  (void)state;
  const double drawn[][2] = {{3.4, 12.2}, {7.6, 9.5}}, labels[][2] = {{3, 12}, {8, 10}};
  for (int with_scale = 1; with_scale >= 0; with_scale--) {
    pp_figure *fig = stacks(2, drawn, labels, with_scale, 0, 30);
    GPtrArray *out = check(fig);
    assert_int_equal(out->len, 0);
    g_ptr_array_unref(out);
    pp_figure_free(fig);
  }
}

/* A 100% stack printing counts: A 30 and 10 drawn as 75% and 25%, B 20 and 60 as 25% and
 * 75%, on a scale 0–100. Counts and heights disagree across the chart, but within each
 * stack ink follows the counts exactly (30:10 = 75:25): quiet. Drawing B's counts as 50%
 * and 50% breaks it: ink per unit count 50, 50, 50, 16.7, worst pair 3, and growth form
 * (1000/1500)/(60/30) = 1/3: severe. Stack B alone departs as much (3), not materially
 * less, so the finding keeps all four segments. */
static void test_full_stacks(void **state) {
  (void)state;
  const double drawn[][2] = {{75, 25}, {25, 75}}, labels[][2] = {{30, 10}, {20, 60}};
  pp_figure *fig = stacks(2, drawn, labels, TRUE, 0, 100);
  GPtrArray *out = check(fig);
  assert_int_equal(out->len, 0);
  g_ptr_array_unref(out);
  pp_figure_free(fig);
  const double off[][2] = {{75, 25}, {50, 50}};
  fig = stacks(2, off, labels, TRUE, 0, 100);
  out = check(fig);
  assert_int_equal(out->len, 1);
  const pp_finding *f = g_ptr_array_index(out, 0);
  assert_string_equal(f->rule, "bars-vs-labels");
  assert_int_equal(f->severity, PP_SEVERITY_SEVERE);
  assert_int_equal(f->elements->len, 4);
  assert_float_equal(f->measures.max_pair_departure, 3.0, 1e-9);
  assert_float_equal(f->measures.growth_ratio, 1.0 / 3, 1e-9);
  g_ptr_array_unref(out);
  pp_figure_free(fig);
}

/* On an axis from 40, labels give each segment's value, the bottom one's counted from 0
 * (80 with 40 of it cut off): they agree with the readings, so the labels rule stays out
 * and the truncation is bars-off-zero's, on the bottom segments (docs/rules.md). */
static void test_cut_axis_is_not_a_label_finding(void **state) {
  (void)state;
  const double drawn[][2] = {{40, 500}, {70, 540}}, labels[][2] = {{80, 500}, {110, 540}};
  pp_figure *fig = stacks(2, drawn, labels, TRUE, 40, 800);
  GPtrArray *out = check(fig);
  assert_int_equal(out->len, 1);
  assert_string_equal(((const pp_finding *)g_ptr_array_index(out, 0))->rule, "bars-off-zero");
  g_ptr_array_unref(out);
  pp_figure_free(fig);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_segment_drawn_off_its_label),
      cmocka_unit_test(test_horizontal_segment_boxes),
      cmocka_unit_test(test_rounded_labels_are_quiet),
      cmocka_unit_test(test_full_stacks),
      cmocka_unit_test(test_cut_axis_is_not_a_label_finding),
  };
  return cmocka_run_group_tests_name("rules/stacks", tests, NULL, NULL);
}
