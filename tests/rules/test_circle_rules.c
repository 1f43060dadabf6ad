/* test_circle_rules.c — the circle rules on figures built from closed forms: sector areas
 * r²θ/2, annular sectors (R² − r²)θ/2, ellipse sectors ab(t2 − t1)/2 and the rim band
 * d·a·|cos t2 − cos t1|, with the rounding bound n·½·10^−d for printed percentages. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <string.h>

#include <cmocka.h>

#include "geometry/geometry.h"
#include "rules/internal.h"

static void add_element(pp_figure *fig, pp_encoding enc, double extent, double ink, double label,
                        gboolean percent, const char *text) {
  pp_element e = pp_element_init(enc);
  e.extent = extent;
  e.ink = ink;
  pp_element_add_part(&e, fig->elements->len, PP_PART_TOP, ink);
  e.label_value = e.value = label;
  e.label_text = g_strdup(text);
  e.source = percent ? PP_VALUE_PERCENT_LABEL : PP_VALUE_DATA_LABEL;
  e.share = percent ? label / 100 : NAN;
  e.box = (pp_rect){0, 0, 10, 10};
  g_array_append_val(fig->elements, e);
}

static GPtrArray *check(const pp_figure *fig) {
  GPtrArray *out = g_ptr_array_new_with_free_func((GDestroyNotify)pp_finding_free);
  pp_thresholds t = pp_thresholds_default();
  pp_rules_check_figure(fig, &t, out);
  return out;
}

/* A pie drawn from shares d but labelled p: lie factor of the worst slice d/p
 * (sector area r²θ/2 ∝ θ, so ink share = angle share). */
static void test_pie_labels(void **state) {
  (void)state;
  const double drawn[] = {0.30, 0.30, 0.18, 0.12, 0.10};
  const double printed[] = {41, 27, 16, 10, 6};
  const char *texts[] = {"41%", "27%", "16%", "10%", "6%"};
  g_autoptr(pp_figure) fig = pp_figure_new(PP_FIGURE_PIE);
  for (int i = 0; i < 5; i++)
    add_element(fig, PP_ENCODING_ANGLE, 2 * G_PI * drawn[i],
                pp_sector_area(80, 2 * G_PI * drawn[i]), printed[i], TRUE, texts[i]);
  g_autoptr(GPtrArray) f = check(fig);
  assert_int_equal(f->len, 1);
  pp_finding *x = g_ptr_array_index(f, 0);
  assert_string_equal(x->rule, "wedges-vs-labels");
  /* worst: 0.10 / 0.06 = 1.667 (|log| 0.51 beats 0.30/0.41's 0.31) */
  assert_true(fabs(x->measures.growth_ratio - 0.10 / 0.06) < 1e-9);
  /* worst pair: (0.10/0.30)/(6/41) */
  assert_true(fabs(x->measures.max_pair_departure - (0.10 / 0.30) / (6.0 / 41)) < 1e-9);
}

/* Honest pie with rounded labels: 4.4% printed as 4% is within half a unit: no finding. */
static void test_pie_rounding_is_honest(void **state) {
  (void)state;
  const double drawn[] = {0.456, 0.321, 0.179, 0.044};
  const char *texts[] = {"46%", "32%", "18%", "4%"};
  const double printed[] = {46, 32, 18, 4};
  g_autoptr(pp_figure) fig = pp_figure_new(PP_FIGURE_PIE);
  for (int i = 0; i < 4; i++)
    add_element(fig, PP_ENCODING_ANGLE, 2 * G_PI * drawn[i],
                pp_sector_area(50, 2 * G_PI * drawn[i]), printed[i], TRUE, texts[i]);
  g_autoptr(GPtrArray) f = check(fig);
  assert_int_equal(f->len, 0);
}

/* Five whole-number labels may sum to 100 ± 2.5 (each off by at most ½): 102 is no
 * finding, 103 is (lie factor 1.03, a note inside Tufte's band). */
static void test_percent_sum(void **state) {
  (void)state;
  for (int extra = 2; extra <= 3; extra++) {
    const double printed[] = {40.0 + extra, 25, 15, 12, 8};
    g_autoptr(pp_figure) fig = pp_figure_new(PP_FIGURE_PIE);
    for (int i = 0; i < 5; i++) {
      char t[16];
      g_snprintf(t, sizeof t, "%.0f%%", printed[i]);
      double share = (i == 0 ? 40 : printed[i]) / 100;
      add_element(fig, PP_ENCODING_ANGLE, 2 * G_PI * share, share, printed[i], TRUE, t);
    }
    g_autoptr(GPtrArray) f = check(fig);
    if (extra == 2) {
      for (guint k = 0; k < f->len; k++)
        assert_string_not_equal(((pp_finding *)g_ptr_array_index(f, k))->rule, "shares-not-100");
    } else {
      assert_int_equal(f->len, 1);
      pp_finding *x = g_ptr_array_index(f, 0);
      assert_string_equal(x->rule, "shares-not-100");
      assert_true(fabs(x->measures.growth_ratio - 1.03) < 1e-9);
      assert_int_equal(x->severity, PP_SEVERITY_MINOR);
    }
  }
  /* One decimal: 0.05 per label; 100.3 over five labels (allowance 0.25) is a finding. */
  const char *texts[] = {"40.1%", "25.1%", "15.0%", "12.0%", "8.1%"};
  const double printed[] = {40.1, 25.1, 15.0, 12.0, 8.1};
  g_autoptr(pp_figure) fig = pp_figure_new(PP_FIGURE_PIE);
  for (int i = 0; i < 5; i++)
    add_element(fig, PP_ENCODING_ANGLE, 2 * G_PI * printed[i] / 100.3, printed[i], printed[i], TRUE,
                texts[i]);
  g_autoptr(GPtrArray) f = check(fig);
  assert_int_equal(f->len, 1);
  assert_string_equal(((pp_finding *)g_ptr_array_index(f, 0))->rule, "shares-not-100");
}

/* Tilted pie, 4 equal slices, ellipse a = 1, b = k, rim depth d under the front half
 * (parametric π..2π): top faces k·π/4 each; rims d·|cos t2 − cos t1| over the front parts.
 * Slices [−π/4, π/4], [π/4, 3π/4], [3π/4, 5π/4], [5π/4, 7π/4]. */
static void test_tilted_rim(void **state) {
  (void)state;
  double k = 0.4, d = 0.15;
  double t[4][2] = {{-G_PI / 4, G_PI / 4},
                    {G_PI / 4, 3 * G_PI / 4},
                    {3 * G_PI / 4, 5 * G_PI / 4},
                    {5 * G_PI / 4, 7 * G_PI / 4}};
  double ink[4], total = 0;
  for (int i = 0; i < 4; i++) {
    double top = pp_ellipse_sector_area(1, k, t[i][0], t[i][1]);
    /* front parts of each slice: its overlap with [π, 2π] and with [−π, 0] */
    double rim = 0;
    for (int w = 0; w < 2; w++) {
      double lo = fmax(t[i][0], w ? -G_PI : G_PI), hi = fmin(t[i][1], w ? 0 : 2 * G_PI);
      rim += hi > lo ? d * fabs(cos(hi) - cos(lo)) : 0;
    }
    ink[i] = top + rim;
    total += ink[i];
  }
  g_autoptr(pp_figure) fig = pp_figure_new(PP_FIGURE_TILTED_PIE);
  for (int i = 0; i < 4; i++)
    add_element(fig, PP_ENCODING_SHARE, G_PI / 2, ink[i], 25, TRUE, "25%");
  g_autoptr(GPtrArray) f = check(fig);
  assert_int_equal(f->len, 1);
  pp_finding *x = g_ptr_array_index(f, 0);
  assert_string_equal(x->rule, "tilted-pie-ink");
  /* The front slice [5π/4, 7π/4]: ink share / 0.25. */
  assert_true(fabs(x->measures.growth_ratio - (ink[3] / total) / 0.25) < 1e-9);
  assert_int_equal(x->measures.first, 3);
}

/* Radial bars: rings of width 10 at inner radii 30, 45, 60, 75 with sweeps ∝ value: the
 * lie factor outer vs inner is (R₄² − r₄²)/(R₁² − r₁²) = (85²−75²)/(40²−30²) = 1600/700. */
static void test_radial(void **state) {
  (void)state;
  const double v[] = {62, 48, 35, 21};
  g_autoptr(pp_figure) fig = pp_figure_new(PP_FIGURE_RADIAL_BAR);
  for (int i = 0; i < 4; i++) {
    double r = 30 + 15 * i, th = 2 * G_PI * v[i] / 80;
    add_element(fig, PP_ENCODING_ANGLE, th, pp_annular_sector_area(r + 10, r, th), v[i], FALSE,
                "x");
  }
  g_autoptr(GPtrArray) f = check(fig);
  assert_int_equal(f->len, 1);
  pp_finding *x = g_ptr_array_index(f, 0);
  assert_string_equal(x->rule, "radial-ring-ink");
  assert_true(fabs(x->measures.growth_ratio - 1600.0 / 700.0) < 1e-9);
  assert_int_equal(x->severity, PP_SEVERITY_SEVERE);
}

/* Polar area: radius ∝ value gives (v2/v1)² of ink for v2/v1 of value: lie factor v2/v1;
 * radius ∝ √value gives 1 and no finding. */
static void test_polar(void **state) {
  (void)state;
  const double v[] = {120, 80, 60, 35, 25};
  for (int sq = 0; sq < 2; sq++) {
    g_autoptr(pp_figure) fig = pp_figure_new(PP_FIGURE_POLAR_AREA);
    for (int i = 0; i < 5; i++) {
      double r = sq ? 90 * sqrt(v[i] / 120) : 90 * v[i] / 120;
      add_element(fig, PP_ENCODING_RADIUS, r, pp_sector_area(r, 2 * G_PI / 5), v[i], FALSE, "x");
    }
    g_autoptr(GPtrArray) f = check(fig);
    if (sq) {
      assert_int_equal(f->len, 0);
    } else {
      assert_int_equal(f->len, 1);
      pp_finding *x = g_ptr_array_index(f, 0);
      assert_string_equal(x->rule, "polar-radius");
      assert_true(fabs(x->measures.growth_ratio - 120.0 / 25) < 1e-9);
    }
  }
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_pie_labels),  cmocka_unit_test(test_pie_rounding_is_honest),
      cmocka_unit_test(test_percent_sum), cmocka_unit_test(test_tilted_rim),
      cmocka_unit_test(test_radial),      cmocka_unit_test(test_polar),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
