/* test_wedges.c — wedges read back from paths drawn by cairo's own arc code: centre, radii
 * and angles against the values cairo was asked for, areas against the closed forms of
 * sectors and ellipse sectors and against cairo's rasteriser (pixel coverage). */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "test_util.h"

#define DEG (G_PI / 180)

/* cairo draws a circle with at least 6 Béziers at any tolerance; their radial error is at
 * most r·2/27·sin⁶(θ/4)/cos²(θ/4) ≈ 2.4e-5·r at θ = 60° (cairo-arc.c, from memory; the
 * same bound as test_closed_forms.c), and points are stored in 24.8 fixed point. */
#define ANGLE_TOL 2e-4 /* radians */
#define RADIUS_TOL 1e-4
/* Without an apex the centre comes from a fit through the Béziers, whose midpoints cairo
 * lets leave the circle by its tolerance (0.1 pt by default): 0.1/50 ≈ 2e-3 at r = 50. */
#define ANGLE_TOL_FREE 2e-3

/* The angle in [0, 2π). */
static double norm(double a) {
  a = fmod(a, 2 * G_PI);
  return a < 0 ? a + 2 * G_PI : a;
}

static double angle_diff(double a, double b) {
  return fabs(remainder(a - b, 2 * G_PI));
}

/* A pie slice with cairo: apex at (cx, cy), circle of radius r squeezed vertically by k,
 * from cairo angle α0 to α1 (clockwise on the page, as cairo_arc draws). */
static void slice(cairo_t *cr, double cx, double cy, double r, double k, double al0, double al1) {
  cairo_save(cr);
  cairo_translate(cr, cx, cy);
  cairo_scale(cr, 1, k);
  cairo_move_to(cr, 0, 0);
  cairo_arc(cr, 0, 0, r, al0, al1);
  cairo_close_path(cr);
  cairo_restore(cr);
}

static void ring_slice(cairo_t *cr, double cx, double cy, double r, double inner, double al0,
                       double al1) {
  cairo_new_sub_path(cr);
  cairo_arc(cr, cx, cy, r, al0, al1);
  cairo_arc_negative(cr, cx, cy, inner, al1, al0);
  cairo_close_path(cr);
}

/* In the y-up frame a cairo angle α is −α, so cairo's [α0, α1] is [−α1, −α0]. */
static void check_angles(const pp_wedge *w, double al0, double al1) {
  double tol = w->kind == PP_WEDGE_SECTOR ? ANGLE_TOL : ANGLE_TOL_FREE;
  if (angle_diff(w->a0, norm(-al1)) > tol || fabs((w->a1 - w->a0) - (al1 - al0)) > tol)
    fail_msg("angles %.6f..%.6f, want %.6f sweep %.6f", w->a0, w->a1, norm(-al1), al1 - al0);
}

/* Source: the centre, radius and angles given to cairo_arc. */
static void test_circle_slices(void **state) {
  (void)state;
  GRand *rng = g_rand_new_with_seed(81);
  for (int trial = 0; trial < 200; trial++) {
    double cx = g_rand_double_range(rng, 50, 500), cy = g_rand_double_range(rng, 50, 700);
    double r = g_rand_double_range(rng, 25, 200); /* cairo's 0.1 pt is < 0.4% of r */
    double al0 = g_rand_double_range(rng, -2 * G_PI, 2 * G_PI);
    double sweep = g_rand_double_range(rng, 0.5 * DEG, 359 * DEG);
    cairo_t *cr = tu_path_context();
    slice(cr, cx, cy, r, 1, al0, al0 + sweep);
    g_autoptr(pp_path) p = tu_path_from_cairo(cr);
    cairo_destroy(cr);
    g_autoptr(GArray) ws = pp_path_wedges(p, TRUE, NULL);
    if (ws->len != 1)
      fail_msg("trial %d: %u wedges (sweep %.2f°)", trial, ws->len, sweep / DEG);
    const pp_wedge *w = &g_array_index(ws, pp_wedge, 0);
    assert_int_equal(w->kind, PP_WEDGE_SECTOR);
    assert_true(hypot(w->outer.centre.x - cx, w->outer.centre.y - cy) < RADIUS_TOL * r + 0.01);
    assert_true(fabs(w->outer.rx - r) < RADIUS_TOL * r + 0.01);
    assert_true(fabs(w->outer.ry - r) < RADIUS_TOL * r + 0.01);
    check_angles(w, al0, al0 + sweep);
    /* Closed form r²θ/2 against the exact integral of cairo's Béziers. */
    double want = pp_sector_area(r, sweep);
    assert_true(fabs(pp_wedge_area(w) - want) < 1e-3 * want);
    assert_true(fabs(pp_path_fill_area(p, PP_FILL_NONZERO) - want) < 1e-3 * want);
  }
  g_rand_free(rng);
}

/* Source: cairo_scale(1, k) maps the circle's point at angle α to the ellipse's point at
 * parametric angle −α (y up); the ellipse sector's area is ab(t2 − t1)/2 (affine image of
 * r²θ/2 under a map of determinant k). */
static void test_tilted_slices(void **state) {
  (void)state;
  GRand *rng = g_rand_new_with_seed(82);
  for (int trial = 0; trial < 200; trial++) {
    double cx = 300, cy = 400, r = g_rand_double_range(rng, 40, 200);
    double k = g_rand_double_range(rng, 0.25, 0.9);
    double al0 = g_rand_double_range(rng, 0, 2 * G_PI);
    double sweep = g_rand_double_range(rng, 70 * DEG, 300 * DEG);
    cairo_t *cr = tu_path_context();
    slice(cr, cx, cy, r, k, al0, al0 + sweep);
    g_autoptr(pp_path) p = tu_path_from_cairo(cr);
    cairo_destroy(cr);
    g_autoptr(GArray) ws = pp_path_wedges(p, TRUE, NULL);
    if (ws->len != 1)
      fail_msg("trial %d: %u wedges (k %.3f, from %.3f sweep %.3f)", trial, ws->len, k, al0, sweep);
    const pp_wedge *w = &g_array_index(ws, pp_wedge, 0);
    if (!w->shape_fitted)
      fail_msg("trial %d: shape not fitted (k %.3f, from %.3f sweep %.3f)", trial, k, al0, sweep);
    if (fabs(w->outer.rx - r) > 1e-3 * r || fabs(w->outer.ry - k * r) > 1e-3 * r ||
        fabs(remainder(w->outer.rot, G_PI)) > 1e-3)
      fail_msg("trial %d: rx %.4f ry %.4f rot %.4f, want %.4f %.4f 0", trial, w->outer.rx,
               w->outer.ry, w->outer.rot, r, k * r);
    if (angle_diff(w->a0, norm(-(al0 + sweep))) > 1e-3 || fabs(w->a1 - w->a0 - sweep) > 1e-3)
      fail_msg("trial %d: angles", trial);
    double want = pp_ellipse_sector_area(r, k * r, 0, sweep);
    assert_true(fabs(pp_path_fill_area(p, PP_FILL_NONZERO) - want) < 1e-3 * want);
    assert_true(fabs(pp_wedge_area(w) - want) < 2e-3 * want);
  }
  g_rand_free(rng);
}

/* A whole tilted pie as one path with one subpath per slice: the short slices cannot fix
 * the axes alone; given the shape of the longest one they get their true angles.
 * Source: the angles given to cairo_arc. */
static void test_tilted_pie_shared_shape(void **state) {
  (void)state;
  const double shares[] = {0.46, 0.22, 0.12, 0.08, 0.07, 0.05};
  double k = 0.4, r = 150, al = -0.3;
  cairo_t *cr = tu_path_context();
  for (int i = 0; i < 6; i++) {
    slice(cr, 300, 300, r, k, al, al + shares[i] * 2 * G_PI);
    al += shares[i] * 2 * G_PI;
  }
  g_autoptr(pp_path) p = tu_path_from_cairo(cr);
  cairo_destroy(cr);
  g_autoptr(GArray) first = pp_path_wedges(p, TRUE, NULL);
  assert_int_equal(first->len, 6);
  const pp_wedge *big = &g_array_index(first, pp_wedge, 0);
  assert_true(big->shape_fitted);
  g_autoptr(GArray) ws = pp_path_wedges(p, TRUE, &big->outer);
  assert_int_equal(ws->len, 6);
  double total = 0;
  for (int i = 0; i < 6; i++)
    total += pp_wedge_area(&g_array_index(ws, pp_wedge, i));
  for (int i = 0; i < 6; i++) {
    const pp_wedge *w = &g_array_index(ws, pp_wedge, i);
    assert_int_equal(w->subpath, i);
    assert_true(fabs((w->a1 - w->a0) / (2 * G_PI) - shares[i]) < 1e-3);
    /* Orthographic tilt keeps the top face's shares: ab·Δt/2 over πab (derived from the
     * closed form above). */
    assert_true(fabs(pp_wedge_area(w) / total - shares[i]) < 1e-3);
    assert_true(fabs(w->outer.ry / w->outer.rx - k) < 1e-3);
  }
  /* Without the shape a short slice is read as a circle: its apparent angle differs. */
  const pp_wedge *small = &g_array_index(first, pp_wedge, 5);
  assert_false(small->shape_fitted);
}

/* Source: radii and angles given to cairo_arc / cairo_arc_negative; (R² − r²)θ/2. */
static void test_donut_slices(void **state) {
  (void)state;
  GRand *rng = g_rand_new_with_seed(83);
  for (int trial = 0; trial < 100; trial++) {
    double r = g_rand_double_range(rng, 50, 200), f = g_rand_double_range(rng, 0.2, 0.9);
    double al0 = g_rand_double_range(rng, 0, 2 * G_PI);
    double sweep = g_rand_double_range(rng, 2 * DEG, 300 * DEG);
    if (fabs(sweep - G_PI) < 3 * DEG)
      continue; /* parallel edges: covered by test_half_ring */
    cairo_t *cr = tu_path_context();
    ring_slice(cr, 250, 250, r, f * r, al0, al0 + sweep);
    g_autoptr(pp_path) p = tu_path_from_cairo(cr);
    cairo_destroy(cr);
    g_autoptr(GArray) ws = pp_path_wedges(p, TRUE, NULL);
    assert_int_equal(ws->len, 1);
    const pp_wedge *w = &g_array_index(ws, pp_wedge, 0);
    assert_int_equal(w->kind, PP_WEDGE_ANNULAR);
    assert_true(fabs(w->inner - f) < 1e-3);
    assert_true(fabs(w->outer.rx - r) < 1e-3 * r);
    check_angles(w, al0, al0 + sweep);
    double want = pp_annular_sector_area(r, f * r, sweep);
    assert_true(fabs(pp_wedge_area(w) - want) < 2e-3 * want);
    assert_true(fabs(pp_path_fill_area(p, PP_FILL_NONZERO) - want) < 1e-3 * want);
  }
  g_rand_free(rng);
}

static void test_half_ring(void **state) {
  (void)state;
  cairo_t *cr = tu_path_context();
  ring_slice(cr, 250, 250, 100, 60, G_PI, 2 * G_PI); /* a gauge's upper half ring */
  g_autoptr(pp_path) p = tu_path_from_cairo(cr);
  cairo_destroy(cr);
  g_autoptr(GArray) ws = pp_path_wedges(p, TRUE, NULL);
  assert_int_equal(ws->len, 1);
  const pp_wedge *w = &g_array_index(ws, pp_wedge, 0);
  assert_int_equal(w->kind, PP_WEDGE_ANNULAR);
  assert_true(fabs(w->inner - 0.6) < 1e-3);
  check_angles(w, G_PI, 2 * G_PI);
}

/* A pie in one path, one subpath per slice, one slice pulled out along its bisector, one
 * slice drawn in two pieces. Source: the drawing parameters. */
static void test_exploded_and_pieces(void **state) {
  (void)state;
  const double shares[] = {0.35, 0.25, 0.2, 0.2};
  cairo_t *cr = tu_path_context();
  double al = 0;
  for (int i = 0; i < 4; i++) {
    double sw = shares[i] * 2 * G_PI, off = i == 1 ? 12 : 0, mid = al + sw / 2;
    double cx = 200 + off * cos(mid), cy = 200 + off * sin(mid);
    if (i == 2) { /* two pieces */
      slice(cr, cx, cy, 90, 1, al, al + sw * 0.3);
      slice(cr, cx, cy, 90, 1, al + sw * 0.3, al + sw);
    } else {
      slice(cr, cx, cy, 90, 1, al, al + sw);
    }
    al += sw;
  }
  g_autoptr(pp_path) p = tu_path_from_cairo(cr);
  cairo_destroy(cr);
  g_autoptr(GArray) ws = pp_path_wedges(p, TRUE, NULL);
  assert_int_equal(ws->len, 5);
  const pp_wedge *w1 = &g_array_index(ws, pp_wedge, 1);
  double mid = 0.35 * 2 * G_PI + 0.25 * G_PI;
  assert_true(fabs(w1->outer.centre.x - (200 + 12 * cos(mid))) < 0.01);
  assert_true(fabs(w1->outer.centre.y - (200 + 12 * sin(mid))) < 0.01);
  pp_wedge joined;
  assert_true(pp_wedge_join(&g_array_index(ws, pp_wedge, 3), &g_array_index(ws, pp_wedge, 2), 0.01,
                            &joined));
  assert_true(fabs((joined.a1 - joined.a0) - 0.2 * 2 * G_PI) < ANGLE_TOL);
  /* Slices of different radii or that do not abut are not joined. */
  assert_false(pp_wedge_join(&g_array_index(ws, pp_wedge, 0), &g_array_index(ws, pp_wedge, 3), 0.01,
                             &joined));
}

/* R's pie() draws each slice as a polygon: the centre and points every 1.8° along the arc
 * (edges = 200; graphics/R/pie.R, from memory). */
static void test_polyline_slice(void **state) {
  (void)state;
  g_autoptr(pp_path) p = pp_path_new();
  double t0 = 20 * DEG, t1 = 130 * DEG, r = 80;
  int n = (int)ceil((t1 - t0) / (1.8 * DEG));
  pp_path_move_to(p, 300, 300);
  for (int i = 0; i <= n; i++) {
    double t = t0 + (t1 - t0) * i / n; /* y-up angles, drawn on a y-down page */
    pp_path_line_to(p, 300 + r * cos(t), 300 - r * sin(t));
  }
  pp_path_close(p);
  g_autoptr(GArray) ws = pp_path_wedges(p, TRUE, NULL);
  assert_int_equal(ws->len, 1);
  const pp_wedge *w = &g_array_index(ws, pp_wedge, 0);
  assert_int_equal(w->kind, PP_WEDGE_SECTOR);
  assert_true(fabs(w->a0 - t0) < 1e-3 && fabs(w->a1 - t1) < 1e-3);
  /* The inscribed polygon's radius: its vertices lie on the circle, the chords inside. */
  assert_true(fabs(w->outer.rx - r) < 0.002 * r);
}

/* A stroke arc (gauge, progress ring), a whole circle, a tilted pie's rim (a band), and
 * shapes that are not wedges (a rounded rectangle, a square). */
static void test_other_shapes(void **state) {
  (void)state;
  cairo_t *cr = tu_path_context();
  cairo_arc(cr, 100, 100, 50, 0.5, 2.5);
  g_autoptr(pp_path) arc = tu_path_from_cairo(cr);
  cairo_new_path(cr);
  cairo_arc(cr, 100, 100, 50, 0, 2 * G_PI);
  cairo_close_path(cr);
  g_autoptr(pp_path) circle = tu_path_from_cairo(cr);
  cairo_new_path(cr);
  /* Rim of the front half of an ellipse rx 100, ry 40, depth 20. */
  cairo_save(cr);
  cairo_translate(cr, 200, 200);
  cairo_scale(cr, 1, 0.4);
  cairo_arc(cr, 0, 0, 100, 0, G_PI);
  cairo_restore(cr);
  cairo_save(cr);
  cairo_translate(cr, 200, 220);
  cairo_scale(cr, 1, 0.4);
  cairo_arc_negative(cr, 0, 0, 100, G_PI, 0);
  cairo_restore(cr);
  cairo_close_path(cr);
  g_autoptr(pp_path) rim = tu_path_from_cairo(cr);
  cairo_new_path(cr);
  double x = 10, y = 10, w = 80, h = 40, rr = 8;
  cairo_arc(cr, x + w - rr, y + rr, rr, -G_PI / 2, 0);
  cairo_arc(cr, x + w - rr, y + h - rr, rr, 0, G_PI / 2);
  cairo_arc(cr, x + rr, y + h - rr, rr, G_PI / 2, G_PI);
  cairo_arc(cr, x + rr, y + rr, rr, G_PI, 1.5 * G_PI);
  cairo_close_path(cr);
  g_autoptr(pp_path) rounded = tu_path_from_cairo(cr);
  cairo_new_path(cr);
  cairo_rectangle(cr, 10, 10, 50, 50);
  g_autoptr(pp_path) square = tu_path_from_cairo(cr);
  cairo_destroy(cr);

  g_autoptr(GArray) a = pp_path_wedges(arc, FALSE, NULL);
  assert_int_equal(a->len, 1);
  assert_int_equal(g_array_index(a, pp_wedge, 0).kind, PP_WEDGE_ARC);
  check_angles(&g_array_index(a, pp_wedge, 0), 0.5, 2.5);
  assert_true(fabs(g_array_index(a, pp_wedge, 0).outer.rx - 50) < 0.1); /* cairo's tolerance */
  g_autoptr(GArray) c = pp_path_wedges(circle, TRUE, NULL);
  assert_int_equal(c->len, 1);
  assert_int_equal(g_array_index(c, pp_wedge, 0).kind, PP_WEDGE_FULL);
  /* cairo's 0.1 pt tolerance moves the area by up to 2πr·0.1 ≈ 0.4%. */
  assert_true(fabs(pp_wedge_area(&g_array_index(c, pp_wedge, 0)) - G_PI * 2500) <
              0.004 * G_PI * 2500);
  g_autoptr(GArray) b = pp_path_wedges(rim, TRUE, NULL);
  assert_int_equal(b->len, 1);
  const pp_wedge *band = &g_array_index(b, pp_wedge, 0);
  assert_int_equal(band->kind, PP_WEDGE_BAND);
  assert_true(fabs(band->depth.y - 20) < 0.05 && fabs(band->depth.x) < 0.05);
  assert_true(fabs(band->outer.ry / band->outer.rx - 0.4) < 1e-3);
  /* A short piece of rim (parametric 200°..230°): alone its arcs look like a circle's;
   * with the pie's shape it gets the right centre and depth. */
  cr = tu_path_context();
  cairo_save(cr);
  cairo_translate(cr, 200, 200);
  cairo_scale(cr, 1, 0.4);
  cairo_arc(cr, 0, 0, 100, -230 * DEG, -200 * DEG);
  cairo_restore(cr);
  cairo_save(cr);
  cairo_translate(cr, 200, 220);
  cairo_scale(cr, 1, 0.4);
  cairo_arc_negative(cr, 0, 0, 100, -200 * DEG, -230 * DEG);
  cairo_restore(cr);
  cairo_close_path(cr);
  g_autoptr(pp_path) short_rim = tu_path_from_cairo(cr);
  cairo_destroy(cr);
  pp_ellipse shape = {{0, 0}, 10, 4, 0};
  g_autoptr(GArray) sb = pp_path_wedges(short_rim, TRUE, &shape);
  assert_int_equal(sb->len, 1);
  const pp_wedge *sw = &g_array_index(sb, pp_wedge, 0);
  assert_int_equal(sw->kind, PP_WEDGE_BAND);
  assert_true(hypot(sw->outer.centre.x - 200, sw->outer.centre.y - 200) < 0.1);
  assert_true(fabs(sw->depth.y - 20) < 0.1);
  assert_true(fabs(sw->a0 - 200 * DEG) < 1e-3 && fabs(sw->a1 - 230 * DEG) < 1e-3);
  g_autoptr(GArray) r = pp_path_wedges(rounded, TRUE, NULL);
  assert_int_equal(r->len, 0);
  g_autoptr(GArray) s = pp_path_wedges(square, TRUE, NULL);
  assert_int_equal(s->len, 0);
}

/* Σ coverage of cairo's fill at 4×, square points (as in test_raster.c). */
static double cairo_ink(const pp_path *p, int size) {
  return tu_cairo_fill_coverage(p, size, 4);
}

/* Source: cairo pixel counts. Areas from the recovered wedges match cairo's coverage; rings
 * of equal width and equal sweep take ink in the ratio of their mid radii (derived from
 * (R² − r²)θ/2 = (R − r)·(R + r)/2·θ). */
static void test_pixel_counts(void **state) {
  (void)state;
  const double widths = 14, sweep = 200 * DEG;
  double ink[3], mid[3];
  for (int i = 0; i < 3; i++) {
    double inner = 30 + i * 20;
    mid[i] = inner + widths / 2;
    cairo_t *cr = tu_path_context();
    ring_slice(cr, 100, 100, inner + widths, inner, -G_PI / 2, -G_PI / 2 + sweep);
    g_autoptr(pp_path) p = tu_path_from_cairo(cr);
    cairo_destroy(cr);
    ink[i] = cairo_ink(p, 200);
    g_autoptr(GArray) ws = pp_path_wedges(p, TRUE, NULL);
    assert_int_equal(ws->len, 1);
    double got = pp_wedge_area(&g_array_index(ws, pp_wedge, 0));
    if (fabs(got - ink[i]) > 0.005 * ink[i])
      fail_msg("ring %d: area %.2f, cairo %.2f", i, got, ink[i]);
  }
  for (int i = 1; i < 3; i++)
    assert_true(fabs((ink[i] / ink[0]) / (mid[i] / mid[0]) - 1) < 0.005);

  /* A tilted pie with a rim: the top faces' coverage shares equal the value shares, the
   * front slice's top + rim share exceeds its value share (derived: the rim is only seen
   * at the front). */
  const double shares[] = {0.25, 0.25, 0.25, 0.25}; /* cairo angles: slice 0 is front-right */
  double top[4], rimink[4], total_top = 0, total_all = 0;
  for (int i = 0; i < 4; i++) {
    double a0 = i * G_PI / 2, a1 = a0 + shares[i] * 2 * G_PI;
    cairo_t *cr = tu_path_context();
    slice(cr, 100, 80, 80, 0.4, a0, a1);
    g_autoptr(pp_path) tp = tu_path_from_cairo(cr);
    top[i] = cairo_ink(tp, 200);
    rimink[i] = 0;
    if (a0 < G_PI) { /* front half: a rim of depth 15 */
      cairo_new_path(cr);
      cairo_save(cr);
      cairo_translate(cr, 100, 80);
      cairo_scale(cr, 1, 0.4);
      cairo_arc(cr, 0, 0, 80, a0, fmin(a1, G_PI));
      cairo_restore(cr);
      cairo_save(cr);
      cairo_translate(cr, 100, 95);
      cairo_scale(cr, 1, 0.4);
      cairo_arc_negative(cr, 0, 0, 80, fmin(a1, G_PI), a0);
      cairo_restore(cr);
      cairo_close_path(cr);
      g_autoptr(pp_path) rp = tu_path_from_cairo(cr);
      rimink[i] = cairo_ink(rp, 200);
    }
    cairo_destroy(cr);
    total_top += top[i];
    total_all += top[i] + rimink[i];
  }
  for (int i = 0; i < 4; i++)
    assert_true(fabs(top[i] / total_top - shares[i]) < 0.005);
  assert_true((top[0] + rimink[0]) / total_all > shares[0] * 1.1);
  assert_true((top[2] + rimink[2]) / total_all < shares[2] * 0.9);
}

/* Perspective: a pie seen from above at an angle through a pinhole. The top face is no
 * longer an ellipse sector of the true angle; the slice nearest the viewer takes more of
 * the top face's area than its share (derived: a homography magnifies nearer parts). */
static void test_perspective_front_grows(void **state) {
  (void)state;
  double area[4], total = 0;
  for (int i = 0; i < 4; i++) {
    g_autoptr(pp_path) p = pp_path_new();
    double t0 = i * G_PI / 2 - G_PI / 4; /* slice 3 is centred on the front (Y < 0) */
    pp_path_move_to(p, 100, 100);        /* the apex projects to the image centre */
    for (int k = 0; k <= 64; k++) {
      double t = t0 + (G_PI / 2) * k / 64, X = cos(t), Y = sin(t);
      /* Plane tilted by 60° about x, pinhole at 4 radii, focal length 4 radii. */
      double z = 4 + Y * sin(60 * DEG);
      pp_path_line_to(p, 100 + 80 * 4 * X / z, 100 - 80 * 4 * Y * cos(60 * DEG) / z);
    }
    pp_path_close(p);
    area[i] = pp_path_fill_area(p, PP_FILL_NONZERO);
    total += area[i];
  }
  /* Slice 3 (Y < 0: nearer, depth < 4) gains, slice 1 (far) loses. */
  assert_true(area[3] / total > 0.25 * 1.1);
  assert_true(area[1] / total < 0.25 * 0.9);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_circle_slices),
      cmocka_unit_test(test_tilted_slices),
      cmocka_unit_test(test_tilted_pie_shared_shape),
      cmocka_unit_test(test_donut_slices),
      cmocka_unit_test(test_half_ring),
      cmocka_unit_test(test_exploded_and_pieces),
      cmocka_unit_test(test_polyline_slice),
      cmocka_unit_test(test_other_shapes),
      cmocka_unit_test(test_pixel_counts),
      cmocka_unit_test(test_perspective_front_grows),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
