/* test_faces.c — faces of 3D bars, pyramid slices and scaled symbols against closed forms:
 * quad classification and areas, faces grouped by shared edges, frustum volumes and the
 * log-log power fit. The source of every expected value is named beside its check. */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "test_util.h"

static pp_path *polygon(const double *xy, int n) {
  pp_path *p = pp_path_new();
  for (int i = 0; i < n; i++) {
    if (i == 0)
      pp_path_move_to(p, xy[0], xy[1]);
    else
      pp_path_line_to(p, xy[2 * i], xy[2 * i + 1]);
  }
  pp_path_close(p);
  return p;
}

/* Triangle pyramid, apex (100, 20), base width W at depth H below the apex (y down). */
#define APEX_X 100.0
#define APEX_Y 20.0
#define W 160.0
#define H 200.0

static pp_path *pyramid_slice(double h1, double h2) {
  double a = W / (2 * H); /* half-width per unit depth */
  if (h1 == 0) {
    double xy[] = {APEX_X, APEX_Y, APEX_X + a * h2, APEX_Y + h2, APEX_X - a * h2, APEX_Y + h2};
    return polygon(xy, 3);
  }
  double xy[] = {APEX_X - a * h1, APEX_Y + h1, APEX_X + a * h1, APEX_Y + h1,
                 APEX_X + a * h2, APEX_Y + h2, APEX_X - a * h2, APEX_Y + h2};
  return polygon(xy, 4);
}

/* A triangle slice between depths h1 and h2 has area (W/2H)(h2² − h1²): the triangle down to
 * depth h has base W·h/H (similar triangles) and area W h²/(2H) (derived). */
static void test_triangle_slices(void **state) {
  (void)state;
  const double depths[] = {0, 40, 90, 130, 200};
  for (int i = 0; i + 1 < 5; i++) {
    g_autoptr(pp_path) p = pyramid_slice(depths[i], depths[i + 1]);
    pp_quad q;
    assert_true(pp_path_as_quad(p, 1e-6, &q));
    assert_int_equal(q.kind, i == 0 ? PP_QUAD_TRIANGLE : PP_QUAD_TRAPEZOID);
    double want = W / (2 * H) * (depths[i + 1] * depths[i + 1] - depths[i] * depths[i]);
    tu_assert_near(q.area, want, 1e-9 * want);
    tu_assert_near(pp_path_fill_area(p, PP_FILL_NONZERO), want, 1e-9 * want);
    if (q.kind == PP_QUAD_TRAPEZOID) /* the parallel sides are p[0]p[1] and p[3]p[2] */
      tu_assert_near(q.p[0].y, q.p[1].y, 1e-9);
  }
}

/* A cone cut at depths h1 < h2 below its apex holds π (R/H)² (h2³ − h1³)/3: a cone of height
 * h and radius r = R h/H holds π r² h/3 (derived). A square pyramid of half-side S: 4(S/H)²
 * (h2³ − h1³)/3 (same derivation with a square base (2s)²). */
static void test_solid_slices(void **state) {
  (void)state;
  const double R = 80, h1 = 50, h2 = 120, Hc = 200;
  double want = G_PI * (R / Hc) * (R / Hc) * (h2 * h2 * h2 - h1 * h1 * h1) / 3;
  double got = pp_frustum_volume(PP_SOLID_CONE, R * h1 / Hc, R * h2 / Hc, h2 - h1);
  tu_assert_near(got, want, 1e-9 * want);
  double want_sq = 4 * (R / Hc) * (R / Hc) * (h2 * h2 * h2 - h1 * h1 * h1) / 3;
  got = pp_frustum_volume(PP_SOLID_SQUARE_PYRAMID, R * h1 / Hc, R * h2 / Hc, h2 - h1);
  tu_assert_near(got, want_sq, 1e-9 * want_sq);
  /* The apex slice (h1 = 0) is the whole small cone: π r² h / 3 (textbook). */
  got = pp_frustum_volume(PP_SOLID_CONE, 0, 30, 60);
  tu_assert_near(got, G_PI * 900 * 60 / 3, 1e-9);
}

/* Circles drawn by cairo_arc with radius ∝ value: area ratio (v2/v1)² (πr², textbook); the
 * power fit of area on value gives exponent 2 exactly, of area ∝ value exponent 1. */
static void test_radius_scaling(void **state) {
  (void)state;
  const double v[] = {3, 5, 8, 13, 21};
  double area_r[5], area_a[5];
  for (int i = 0; i < 5; i++) {
    cairo_t *cr = tu_path_context();
    cairo_arc(cr, 200, 200, 4 * v[i], 0, 2 * G_PI);
    cairo_close_path(cr);
    g_autoptr(pp_path) p = tu_path_from_cairo(cr);
    cairo_destroy(cr);
    area_r[i] = pp_path_fill_area(p, PP_FILL_NONZERO);
    area_a[i] = 7 * v[i]; /* an honest symbol: area ∝ value */
  }
  /* cairo's arc pieces are within ~1e-4 of the radius (see test_closed_forms.c): the area
   * ratio holds to 1e-3. */
  double ratio = area_r[4] / area_r[0], want = (v[4] / v[0]) * (v[4] / v[0]);
  tu_assert_near(ratio, want, 1e-3 * want);
  pp_power_fit f;
  assert_true(pp_power_fit_compute(v, area_r, 5, &f));
  tu_assert_near(f.exponent, 2.0, 1e-3);
  tu_assert_near(f.r2, 1.0, 1e-6);
  assert_int_equal(f.n, 5);
  assert_true(pp_power_fit_compute(v, area_a, 5, &f));
  tu_assert_near(f.exponent, 1.0, 1e-12);
  tu_assert_near(f.log_coeff, log(7), 1e-12);
}

/* R² of a one-variable least-squares line is the squared Pearson correlation of the two
 * variables (textbook regression identity); computed here by the correlation formula. */
static void test_power_fit_r2(void **state) {
  (void)state;
  const double v[] = {2, 4, 7, 11, 16, 22};
  const double s[] = {5.1, 15.0, 52.0, 118.0, 270.0, 470.0};
  pp_power_fit f;
  assert_true(pp_power_fit_compute(v, s, 6, &f));
  double mx = 0, my = 0;
  for (int i = 0; i < 6; i++)
    mx += log(v[i]) / 6, my += log(s[i]) / 6;
  double sxy = 0, sxx = 0, syy = 0;
  for (int i = 0; i < 6; i++) {
    double dx = log(v[i]) - mx, dy = log(s[i]) - my;
    sxy += dx * dy, sxx += dx * dx, syy += dy * dy;
  }
  tu_assert_near(f.exponent, sxy / sxx, 1e-12);
  tu_assert_near(f.r2, sxy * sxy / (sxx * syy), 1e-12);
  assert_true(f.r2 < 1.0);
  /* Constant sizes (a scatter with one marker size): exponent 0, exact fit. */
  const double c[] = {9, 9, 9, 9, 9, 9};
  assert_true(pp_power_fit_compute(v, c, 6, &f));
  tu_assert_near(f.exponent, 0, 1e-12);
  /* One value only, or non-positive values: no fit. */
  const double same[] = {4, 4, 4};
  assert_false(pp_power_fit_compute(same, s, 3, &f));
  const double neg[] = {-1, 0, 3};
  assert_false(pp_power_fit_compute(neg, s, 3, &f));
}

/* Oblique 3D bars: front w×h, a cap parallelogram of edges (w, 0) and (dx, −dy), a side of
 * edges (0, h) and (dx, −dy). Cap area w·dy is the same on every bar (base × height of a
 * parallelogram, textbook); front and side grow with h. With a = front + side, two bars
 * carry ink in the ratio (a2 + c)/(a1 + c), not a2/a1 (derived). */
static void oblique_bar(pp_path **faces, double x, double h, double w, double dx, double dy) {
  const double base = 300;
  double front[] = {x, base, x + w, base, x + w, base - h, x, base - h};
  double cap[] = {x, base - h, x + w, base - h, x + w + dx, base - h - dy, x + dx, base - h - dy};
  double side[] = {x + w, base, x + w + dx, base - dy, x + w + dx, base - h - dy, x + w, base - h};
  faces[0] = polygon(front, 4);
  faces[1] = polygon(cap, 4);
  faces[2] = polygon(side, 4);
}

/* A grid of tiles that touch is one connected group and the same grid with gaps is one group
 * per tile, by construction (neighbouring cells share a side); the grid is given in an order
 * that is not left to right, so the box sweep must not depend on input order. */
static void test_grouping_tile_grid(void **state) {
  (void)state;
  enum { side = 30, n = side * side };
  pp_quad *q = g_new0(pp_quad, n);
  guint *group = g_new(guint, n);
  for (int gap = 0; gap <= 1; gap++) {
    const double pitch = 10 + 2 * gap;
    for (int i = 0; i < n; i++) {
      int r = (i * 7) % side, c = i / side; /* a shuffled row order */
      double x = c * pitch, y = r * pitch;
      q[i] =
          (pp_quad){PP_QUAD_RECTANGLE, {{x, y}, {x + 10, y}, {x + 10, y + 10}, {x, y + 10}}, 100};
    }
    assert_int_equal(pp_quads_group_by_edges(q, n, 0.01, group), gap ? n : 1);
    if (gap)
      for (int i = 0; i < n; i++)
        assert_int_equal(group[i], i);
  }
  g_free(q);
  g_free(group);
}

/* Faces of very different sizes: 30 columns of 30 stacked tiles (each column one group, the
 * columns 2 apart), a plinth under the first ten columns sharing its top edge with their
 * bottom tiles (one group with them), and a face with a non-finite corner (alone). The
 * groups follow from the construction: 1 + 20 + 1. The plinth spans far more grid cells
 * than a tile, so it is compared apart from the grid, and must still join. */
static void test_grouping_mixed_sizes(void **state) {
  (void)state;
  enum { side = 30, tiles = side * side, n = tiles + 2 };
  pp_quad *q = g_new0(pp_quad, n);
  guint *group = g_new(guint, n);
  for (int i = 0; i < tiles; i++) {
    double x = (i % side) * 12, y = (i / side) * 10;
    q[i] = (pp_quad){PP_QUAD_RECTANGLE, {{x, y}, {x + 10, y}, {x + 10, y + 10}, {x, y + 10}}, 100};
  }
  double w = 9 * 12 + 10;
  q[tiles] = (pp_quad){PP_QUAD_RECTANGLE, {{0, -200}, {w, -200}, {w, 0}, {0, 0}}, w * 200};
  q[tiles + 1] =
      (pp_quad){PP_QUAD_RECTANGLE, {{1000, 0}, {INFINITY, 0}, {1010, 10}, {1000, 10}}, 100};
  assert_int_equal(pp_quads_group_by_edges(q, n, 0.01, group), 22);
  for (int c = 0; c < side; c++)
    for (int r = 1; r < side; r++)
      assert_int_equal(group[r * side + c], group[c]);
  for (int c = 0; c < side; c++)
    if (c < 10)
      assert_int_equal(group[c], group[tiles]);
    else
      assert_int_not_equal(group[c], group[tiles]);
  g_free(q);
  g_free(group);
}

static void test_oblique_bars(void **state) {
  (void)state;
  const double w = 30, dx = 12, dy = 8, hs[] = {60, 150, 240};
  pp_path *faces[9];
  for (int b = 0; b < 3; b++)
    oblique_bar(&faces[3 * b], 20 + 60 * b, hs[b], w, dx, dy);
  pp_quad q[9];
  for (int i = 0; i < 9; i++)
    assert_true(pp_path_as_quad(faces[i], 1e-6, &q[i]));
  assert_int_equal(q[0].kind, PP_QUAD_RECTANGLE);
  assert_int_equal(q[1].kind, PP_QUAD_PARALLELOGRAM);
  assert_int_equal(q[2].kind, PP_QUAD_PARALLELOGRAM);
  guint group[9];
  assert_int_equal(pp_quads_group_by_edges(q, 9, 0.01, group), 3);
  for (int i = 0; i < 9; i++)
    assert_int_equal(group[i], i / 3);
  double ink[3];
  for (int b = 0; b < 3; b++)
    ink[b] = q[3 * b].area + q[3 * b + 1].area + q[3 * b + 2].area;
  double c = w * dy;
  tu_assert_near(q[1].area, c, 1e-9);
  for (int b = 1; b < 3; b++) {
    double a1 = (w + dx) * hs[0], a2 = (w + dx) * hs[b];
    tu_assert_near(ink[b] / ink[0], (a2 + c) / (a1 + c), 1e-12);
  }
  for (int i = 0; i < 9; i++)
    pp_path_free(faces[i]);
}

/* Bars that touch only at a corner, or sit side by side with a gap, stay apart; bars in a
 * stack share the whole top edge and join. */
static void test_grouping_neighbours(void **state) {
  (void)state;
  double a[] = {0, 0, 10, 0, 10, 10, 0, 10};
  double corner[] = {10, 10, 20, 10, 20, 20, 10, 20};
  double stacked[] = {0, 10, 10, 10, 10, 25, 0, 25};
  double apart[] = {12, 0, 22, 0, 22, 10, 12, 10};
  g_autoptr(pp_path) pa = polygon(a, 4);
  g_autoptr(pp_path) pc = polygon(corner, 4);
  g_autoptr(pp_path) ps = polygon(stacked, 4);
  g_autoptr(pp_path) pp = polygon(apart, 4);
  pp_quad q[4];
  assert_true(pp_path_as_quad(pa, 1e-6, &q[0]));
  assert_true(pp_path_as_quad(pc, 1e-6, &q[1]));
  assert_true(pp_path_as_quad(ps, 1e-6, &q[2]));
  assert_true(pp_path_as_quad(pp, 1e-6, &q[3]));
  assert_false(pp_quads_share_edge(&q[0], &q[1], 0.01));
  assert_true(pp_quads_share_edge(&q[0], &q[2], 0.01));
  assert_false(pp_quads_share_edge(&q[0], &q[3], 0.01));
}

/* Perspective: equal bars at depths z1 < z2 seen from distance f are scaled by f/(f + z)
 * (pinhole projection, textbook), so their front faces differ by ((f + z2)/(f + z1))². The
 * side face between a near and a far edge is a trapezoid. */
static void test_perspective_faces(void **state) {
  (void)state;
  const double f = 400, zs[] = {0, 150}, w = 40, h = 120;
  double area[2];
  for (int i = 0; i < 2; i++) {
    double s = f / (f + zs[i]);
    double xy[] = {100 * s, 0, (100 + w) * s, 0, (100 + w) * s, h * s, 100 * s, h * s};
    g_autoptr(pp_path) p = polygon(xy, 4);
    pp_quad q;
    assert_true(pp_path_as_quad(p, 1e-6, &q));
    area[i] = q.area;
  }
  double want = ((f + zs[1]) / (f + zs[0])) * ((f + zs[1]) / (f + zs[0]));
  tu_assert_near(area[0] / area[1], want, 1e-12);
  /* side: near edge x = 140 from y 0..120, far edge (depth 60) scaled by 400/460 */
  double s2 = f / (f + 60);
  double side[] = {140, 0, 140 * s2, 0, 140 * s2, 120 * s2, 140, 120};
  g_autoptr(pp_path) ps = polygon(side, 4);
  pp_quad q;
  assert_true(pp_path_as_quad(ps, 1e-6, &q));
  assert_int_equal(q.kind, PP_QUAD_TRAPEZOID);
}

/* What is not a face: a concave outline, a pentagon, two subpaths, a curved bubble. */
static void test_not_quads(void **state) {
  (void)state;
  double concave[] = {0, 0, 10, 0, 5, 3, 10, 10, 0, 10};
  double penta[] = {0, 0, 10, 0, 13, 6, 5, 12, -3, 6};
  double with_extra[] = {0, 0, 5, 0, 10, 0, 10, 10, 10, 10, 0, 10}; /* collinear + repeat */
  g_autoptr(pp_path) a = polygon(concave, 5);
  g_autoptr(pp_path) b = polygon(penta, 5);
  g_autoptr(pp_path) c = polygon(with_extra, 6);
  pp_quad q;
  assert_false(pp_path_as_quad(a, 1e-6, &q));
  assert_false(pp_path_as_quad(b, 1e-6, &q));
  assert_true(pp_path_as_quad(c, 1e-6, &q));
  assert_int_equal(q.kind, PP_QUAD_RECTANGLE);
  g_autoptr(pp_path) two = pp_path_new();
  pp_path_rectangle(two, 0, 0, 5, 5);
  pp_path_rectangle(two, 10, 0, 5, 5);
  assert_false(pp_path_as_quad(two, 1e-6, &q));
  cairo_t *cr = tu_path_context();
  cairo_arc(cr, 50, 50, 20, 0, 2 * G_PI);
  g_autoptr(pp_path) circle = tu_path_from_cairo(cr);
  cairo_destroy(cr);
  assert_false(pp_path_as_quad(circle, 0.01, &q));
}

/* The shoelace area of a funnel trapezoid against cairo's rasteriser (pixel coverage at
 * 8 px/pt, Σ alpha/255): agreement within the antialiasing of its edges. */
static void test_quad_vs_cairo_pixels(void **state) {
  (void)state;
  double xy[] = {10.3, 12.1, 90.7, 12.1, 70.2, 40.9, 30.6, 40.9};
  g_autoptr(pp_path) p = polygon(xy, 4);
  pp_quad q;
  assert_true(pp_path_as_quad(p, 1e-6, &q));
  assert_int_equal(q.kind, PP_QUAD_TRAPEZOID);
  const int scale = 8;
  /* Each edge pixel may be off by half a pixel's alpha quantum: perimeter × 1/scale bound. */
  tu_assert_near(tu_cairo_fill_coverage(p, 100, scale), q.area, 200.0 / scale * 0.1);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_triangle_slices),      cmocka_unit_test(test_solid_slices),
      cmocka_unit_test(test_radius_scaling),       cmocka_unit_test(test_power_fit_r2),
      cmocka_unit_test(test_oblique_bars),         cmocka_unit_test(test_grouping_tile_grid),
      cmocka_unit_test(test_grouping_mixed_sizes), cmocka_unit_test(test_grouping_neighbours),
      cmocka_unit_test(test_perspective_faces),    cmocka_unit_test(test_not_quads),
      cmocka_unit_test(test_quad_vs_cairo_pixels),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
