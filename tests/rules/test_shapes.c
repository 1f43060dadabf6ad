/* test_shapes.c — the shape rules (bars-3d-ink, slices-vs-values, symbols-not-by-area) on
 * figures built by hand, against closed forms; the source of each expected value is named
 * beside its check. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "rules/internal.h"

static pp_finding *judge(const pp_figure *fig, const char *rule) {
  pp_thresholds t = pp_thresholds_default();
  g_autoptr(GPtrArray) found = g_ptr_array_new_with_free_func((GDestroyNotify)pp_finding_free);
  pp_rules_check_figure(fig, &t, found);
  if (found->len == 0)
    return NULL;
  pp_finding *f = g_ptr_array_steal_index(found, 0);
  assert_string_equal(f->rule, rule);
  return f;
}

static double extra(const pp_finding *f, const char *name) {
  for (guint i = 0; i < f->measures.n_extra; i++)
    if (g_strcmp0(f->measures.extra[i].name, name) == 0)
      return f->measures.extra[i].value;
  fail_msg("no measure %s", name);
  return NAN;
}

/* Oblique bars: front w·h and side dx·h grow with h, the cap w·dy does not (parallelogram
 * areas, textbook). Fronts a₁ < a₂ (with sides) and a constant cap c give an ink ratio
 * (a₂ + c)/(a₁ + c) (derived), so the lie factor is that over v₂/v₁. */
static void test_oblique_constant_cap(void **state) {
  (void)state;
  const double w = 30, dx = 12, dy = 10, k = 2.0; /* pt per unit of value */
  const double v[] = {20, 50, 80};
  g_autoptr(pp_figure) fig = pp_figure_new(PP_FIGURE_BAR_3D);
  fig->projection.kind = PP_PROJECTION_OBLIQUE;
  for (int i = 0; i < 3; i++) {
    pp_element e = pp_element_init(PP_ENCODING_AREA);
    double h = k * v[i];
    pp_element_add_part(&e, 3 * i, PP_PART_FRONT, w * h);
    pp_element_add_part(&e, 3 * i + 1, PP_PART_SIDE, dx * h);
    pp_element_add_part(&e, 3 * i + 2, PP_PART_CAP, w * dy);
    e.ink = w * h + dx * h + w * dy;
    e.value = v[i];
    g_array_append_val(fig->elements, e);
  }
  pp_finding *f = judge(fig, "bars-3d-ink");
  assert_non_null(f);
  double a1 = (w + dx) * k * v[0], a2 = (w + dx) * k * v[2], c = w * dy;
  double want = ((a2 + c) / (a1 + c)) / (v[2] / v[0]);
  assert_true(fabs(f->measures.growth_ratio - want) < 1e-12);
  assert_true(f->measures.growth_ratio < 1); /* caps understate differences */
  assert_true(fabs(extra(f, "nonprop_share") - c / (a1 + c)) < 1e-12);
  assert_true(fabs(extra(f, "front_departure") - 1) < 1e-12);
  pp_finding_free(f);
}

/* A shallow cap (c tiny against the fronts) keeps the lie factor inside Tufte's band
 * 0.95–1.05 (1983, p. 57): no finding. */
static void test_shallow_cap_is_quiet(void **state) {
  (void)state;
  g_autoptr(pp_figure) fig = pp_figure_new(PP_FIGURE_BAR_3D);
  const double v[] = {70, 95};
  for (int i = 0; i < 2; i++) {
    pp_element e = pp_element_init(PP_ENCODING_AREA);
    pp_element_add_part(&e, 2 * i, PP_PART_FRONT, 30 * 2 * v[i]);
    pp_element_add_part(&e, 2 * i + 1, PP_PART_CAP, 30 * 0.5);
    e.ink = 30 * 2 * v[i] + 15;
    e.value = v[i];
    g_array_append_val(fig->elements, e);
  }
  assert_null(judge(fig, "bars-3d-ink"));
}

/* A triangle pyramid cut at depths proportional to the values: slice areas ∝ h₂² − h₁²
 * (similar triangles, derived). Values 1, 2, 3 cut at depths 1, 3, 6 give areas ∝ 1, 8,
 * 27, ink per unit value ∝ 1, 4, 9: most against least inflated = 9. Read as a cone, slice
 * volumes ∝ h₂³ − h₁³ = 1, 26, 189 (derived), per unit value 1, 13, 63: 63. */
static void test_pyramid_by_heights(void **state) {
  (void)state;
  const double depth[] = {0, 1, 3, 6}, W = 60, H = 6, apex_x = 100;
  g_autoptr(pp_figure) fig = pp_figure_new(PP_FIGURE_PYRAMID);
  for (int i = 0; i < 3; i++) {
    pp_element e = pp_element_init(PP_ENCODING_AREA);
    double h1 = depth[i], h2 = depth[i + 1], a1 = W / 2 * h1 / H, a2 = W / 2 * h2 / H;
    double ink = (2 * a1 + 2 * a2) / 2 * (h2 - h1);
    pp_element_add_part(&e, i, PP_PART_BODY, ink);
    e.ink = ink;
    e.value = i + 1;
    e.shape.kind = PP_SHAPE_QUAD;
    e.shape.quad.p[0] = (pp_point){apex_x - a1, h1};
    e.shape.quad.p[1] = (pp_point){apex_x + a1, h1};
    e.shape.quad.p[2] = (pp_point){apex_x + a2, h2};
    e.shape.quad.p[3] = (pp_point){apex_x - a2, h2};
    g_array_append_val(fig->elements, e);
  }
  pp_finding *f = judge(fig, "slices-vs-values");
  assert_non_null(f);
  assert_true(fabs(f->measures.growth_ratio - 9.0) < 1e-9);
  assert_true(fabs(extra(f, "most_inflated") - 2) < 1e-12);
  assert_true(fabs(extra(f, "least_inflated") - 0) < 1e-12);
  assert_true(fabs(extra(f, "volume_ratio") - 63.0) < 1e-9);
  assert_int_equal(f->severity, PP_SEVERITY_SEVERE); /* ≥ 2: severe (docs/rules.md) */
  pp_finding_free(f);
}

/* Depths h_k = H·sqrt(cumulative share) make areas ∝ values (derived from the same
 * h₂² − h₁²): no finding. */
static void test_pyramid_by_areas_is_quiet(void **state) {
  (void)state;
  const double v[] = {2, 3, 5}, H = 10, W = 8;
  g_autoptr(pp_figure) fig = pp_figure_new(PP_FIGURE_PYRAMID);
  double cum = 0, prev = 0;
  for (int i = 0; i < 3; i++) {
    cum += v[i];
    double d = H * sqrt(cum / 10);
    double a1 = W / 2 * prev / H, a2 = W / 2 * d / H;
    pp_element e = pp_element_init(PP_ENCODING_AREA);
    e.ink = (a1 + a2) * (d - prev);
    pp_element_add_part(&e, i, PP_PART_BODY, e.ink);
    e.value = v[i];
    e.shape.kind = PP_SHAPE_QUAD;
    e.shape.quad.p[0] = (pp_point){-a1, prev};
    e.shape.quad.p[1] = (pp_point){a1, prev};
    e.shape.quad.p[2] = (pp_point){a2, d};
    e.shape.quad.p[3] = (pp_point){-a2, d};
    g_array_append_val(fig->elements, e);
    prev = d;
  }
  assert_null(judge(fig, "slices-vs-values"));
}

/* Circles with radius ∝ value: area ratio (v₂/v₁)² (πr², textbook), exponent 2, lie factor
 * v_max/v_min. Area ∝ value: exponent 1, no finding. */
static void test_bubbles(void **state) {
  (void)state;
  const double v[] = {4, 9, 16, 25};
  for (int honest = 0; honest < 2; honest++) {
    g_autoptr(pp_figure) fig = pp_figure_new(PP_FIGURE_BUBBLE);
    for (int i = 0; i < 4; i++) {
      pp_element e = pp_element_init(PP_ENCODING_AREA);
      double r = honest ? 3 * sqrt(v[i]) : 3 * v[i];
      e.ink = G_PI * r * r;
      pp_element_add_part(&e, i, PP_PART_BODY, e.ink);
      e.value = v[i];
      g_array_append_val(fig->elements, e);
    }
    pp_finding *f = judge(fig, "symbols-not-by-area");
    if (honest) {
      assert_null(f);
      continue;
    }
    assert_non_null(f);
    assert_true(fabs(f->measures.growth_ratio - 25.0 / 4) < 1e-9);
    assert_true(fabs(extra(f, "size_exponent") - 2) < 1e-9);
    assert_true(fabs(extra(f, "size_r2") - 1) < 1e-9);
    pp_finding_free(f);
  }
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_oblique_constant_cap),
      cmocka_unit_test(test_shallow_cap_is_quiet),
      cmocka_unit_test(test_pyramid_by_heights),
      cmocka_unit_test(test_pyramid_by_areas_is_quiet),
      cmocka_unit_test(test_bubbles),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
