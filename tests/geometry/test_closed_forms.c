/* test_closed_forms.c — areas and lengths of shapes with textbook formulas, drawn with
 * cairo's own arc code (cairo_copy_path keeps its Bézier segments, no flattening). */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "test_util.h"

/* cairo approximates an arc of angle θ by one Bézier per piece whose radial error is at
 * most r · 2/27 · sin⁶(θ/4) / cos²(θ/4) (cairo-arc.c, _arc_error_normalized; from
 * memory). The number of pieces follows cairo_set_tolerance but only down to a floor —
 * at tolerance 1e-5 cairo still draws a circle with 6 pieces (observed) — so the bound is
 * computed from the pieces cairo actually emitted, not from the tolerance asked for.
 * "fine" builds each arc from ≤ 2π/64 calls to cairo_arc, giving a radial error ~1e-11·r:
 * there any flattening-based area would fail, only exact integration passes.
 * cairo also stores path points in 24.8 fixed point in device space (cairo's internal
 * cairo_fixed_t; from memory), so every point moves by up to √2/512 device units; the
 * fine shapes are drawn under a ×1000 CTM to make that 1000× smaller in user space. */
#define FINE_SCALE 1000.0

static cairo_t *arc_context(gboolean fine) {
  cairo_t *cr = tu_path_context();
  if (fine)
    cairo_scale(cr, FINE_SCALE, FINE_SCALE);
  return cr;
}

static double quantum(gboolean fine) {
  return G_SQRT2 / 512 / (fine ? FINE_SCALE : 1);
}
static double radial_error(const pp_path *p, double cx, double cy, double r) {
  double worst = 0;
  pp_point cur = {0, 0};
  for (size_t i = 0; i < p->n_segs; i++) {
    const pp_seg *s = &p->segs[i];
    if (s->kind == PP_SEG_CURVE) {
      double a = atan2(cur.y - cy, cur.x - cx), b = atan2(s->pt[2].y - cy, s->pt[2].x - cx);
      double th = fabs(remainder(b - a, 2 * G_PI));
      double sn = sin(th / 4), cs = cos(th / 4);
      worst = fmax(worst, r * 2.0 / 27.0 * pow(sn, 6) / (cs * cs));
    }
    if (s->kind != PP_SEG_CLOSE)
      cur = s->pt[s->kind == PP_SEG_CURVE ? 2 : 0];
  }
  return worst * 1.001 + 1e-12 * r;
}

/* cairo_arc from a0 to a1, as one call (coarse) or as pieces of at most 2π/64 (fine). */
static void arc(cairo_t *cr, gboolean fine, double cx, double cy, double r, double a0, double a1) {
  int n = fine ? (int)ceil(fabs(a1 - a0) / (2 * G_PI / 64)) : 1;
  for (int i = 0; i < n; i++) {
    double s = a0 + (a1 - a0) * i / n, e = a0 + (a1 - a0) * (i + 1) / n;
    if (a1 >= a0)
      cairo_arc(cr, cx, cy, r, s, e);
    else
      cairo_arc_negative(cr, cx, cy, r, s, e);
  }
}

/* Region between radii r − tol and r + tol over angle θ: where a shape whose arcs have
 * radial error ≤ tol must have its area. */
static double band(double theta, double r, double tol) {
  return 0.5 * theta * ((r + tol) * (r + tol) - fmax(r - tol, 0) * fmax(r - tol, 0));
}

static void test_rectangle(void **state) {
  (void)state;
  g_autoptr(pp_path) p = pp_path_new();
  pp_path_rectangle(p, 10, 20, 30, 40);
  /* Rectangle area w·h (elementary geometry); y-down page, so re is counter-clockwise
   * in the y-up sense of the shoelace formula and the signed area is positive. */
  tu_assert_near(pp_path_signed_area(p), 1200, 1e-9);
  tu_assert_near(pp_path_fill_area(p, PP_FILL_NONZERO), 1200, 1e-9);
  tu_assert_near(pp_path_fill_area(p, PP_FILL_EVEN_ODD), 1200, 1e-9);
  tu_assert_near(pp_path_length(p), 140, 1e-9); /* perimeter 2(w+h) */
  pp_rect r;
  assert_true(pp_path_is_rectangle(p, 0, &r));
  tu_assert_near(r.x0, 10, 0);
  tu_assert_near(r.y1, 60, 0);
}

static void test_circle(void **state) {
  (void)state;
  for (int fine = 0; fine < 2; fine++) {
    double r = 100;
    cairo_t *cr = arc_context(fine);
    arc(cr, fine, 300, 400, r, 0, 2 * G_PI);
    cairo_close_path(cr);
    g_autoptr(pp_path) p = tu_path_from_cairo(cr);
    cairo_destroy(cr);
    double tol = radial_error(p, 300, 400, r);
    if (fine)
      assert_true(tol < 1e-8 * r);
    tol += quantum(fine);
    /* πr², with the radial-error band above (cairo tolerance docs). */
    double bound = band(2 * G_PI, r, tol);
    tu_assert_near(pp_path_fill_area(p, PP_FILL_NONZERO), G_PI * r * r, bound);
    tu_assert_near(pp_path_fill_area(p, PP_FILL_EVEN_ODD), G_PI * r * r, bound);
    /* cairo_arc sweeps towards increasing angle: counter-clockwise in the y-up sense. */
    tu_assert_near(pp_path_signed_area(p), G_PI * r * r, bound);
    /* Circumference 2πr. A curve within tol of the circle need not be within O(tol) in
     * length in general; for cairo's arcs (tangent-continuous, error ∝ θ⁶) a slack of
     * 4·2π·tol is ample (from memory, not a theorem). */
    tu_assert_near(pp_path_length(p), 2 * G_PI * r, 2 * G_PI * tol * 4 + 1e-9);
    /* Bounding box of a disc: centre ± r, widened by the radial tolerance. */
    pp_rect b = pp_path_bbox(p);
    tu_assert_near(b.x0, 200, tol + 1e-9);
    tu_assert_near(b.x1, 400, tol + 1e-9);
    tu_assert_near(b.y0, 300, tol + 1e-9);
    tu_assert_near(b.y1, 500, tol + 1e-9);
  }
}

static void test_sector_and_annulus(void **state) {
  (void)state;
  const double a0 = 0.3, a1 = 2.2, theta = a1 - a0, R = 80, r = 35;
  for (int fine = 0; fine < 2; fine++) {
    cairo_t *cr = arc_context(fine);
    cairo_move_to(cr, 50, 60);
    arc(cr, fine, 50, 60, R, a0, a1);
    cairo_close_path(cr);
    g_autoptr(pp_path) sector = tu_path_from_cairo(cr);
    double tol = radial_error(sector, 50, 60, R) + quantum(fine);
    /* Sector r²θ/2 (elementary geometry). */
    tu_assert_near(pp_path_fill_area(sector, PP_FILL_NONZERO), R * R * theta / 2,
                   band(theta, R, tol));
    cairo_new_path(cr);
    arc(cr, fine, 50, 60, R, a0, a1);
    arc(cr, fine, 50, 60, r, a1, a0);
    cairo_close_path(cr);
    g_autoptr(pp_path) ring = tu_path_from_cairo(cr);
    cairo_destroy(cr);
    tol = fmax(tol, radial_error(ring, 50, 60, r) + quantum(fine));
    /* Annular sector (R² − r²)θ/2 (elementary geometry). */
    double want = (R * R - r * r) * theta / 2, bound = band(theta, R, tol) + band(theta, r, tol);
    tu_assert_near(pp_path_fill_area(ring, PP_FILL_NONZERO), want, bound);
    tu_assert_near(pp_path_fill_area(ring, PP_FILL_EVEN_ODD), want, bound);
    tu_assert_near(fabs(pp_path_signed_area(ring)), want, bound);
  }
}

static void test_clipped_discs(void **state) {
  (void)state;
  for (int fine = 0; fine < 2; fine++) {
    double r = 50;
    cairo_t *cr = arc_context(fine);
    arc(cr, fine, 0, 0, r, 0, 2 * G_PI);
    cairo_close_path(cr);
    g_autoptr(pp_path) disc = tu_path_from_cairo(cr);
    double tol = radial_error(disc, 0, 0, r) + quantum(fine);
    cairo_new_path(cr);
    double d = 40; /* centre distance of the second disc */
    arc(cr, fine, d, 0, r, 0, 2 * G_PI);
    cairo_close_path(cr);
    pp_path *other = tu_path_from_cairo(cr);
    cairo_destroy(cr);

    /* Quarter disc πr²/4: disc clipped to the quadrant x > 0, y > 0. */
    pp_path *quad = pp_path_new();
    pp_path_rectangle(quad, 0, 0, 100, 100);
    g_autoptr(pp_clip) qc = pp_clip_new(NULL, quad, PP_FILL_NONZERO);
    tu_assert_near(pp_path_clipped_area(disc, PP_FILL_NONZERO, qc), G_PI * r * r / 4,
                   band(G_PI / 2, r, tol) + 1e-9);

    /* Circle–circle lens 2r²·acos(d/2r) − (d/2)·sqrt(4r² − d²) (standard formula). Both
     * boundaries may be off by tol; the lens perimeter is under 2·2πr. */
    g_autoptr(pp_clip) oc = pp_clip_new(NULL, other, PP_FILL_NONZERO);
    double lens = 2 * r * r * acos(d / (2 * r)) - d / 2 * sqrt(4 * r * r - d * d);
    double bound = 4 * G_PI * r * tol * 1.01 + 1e-9;
    tu_assert_near(pp_path_clipped_area(disc, PP_FILL_NONZERO, oc), lens, bound);
    tu_assert_near(pp_path_clipped_area(disc, PP_FILL_EVEN_ODD, oc), lens, bound);

    /* Clip chain = intersection: lens ∩ upper half-plane is half the lens by symmetry. */
    pp_path *half = pp_path_new();
    pp_path_rectangle(half, -100, -100, 300, 100);
    g_autoptr(pp_clip) chain = pp_clip_new(oc, half, PP_FILL_NONZERO);
    tu_assert_near(pp_path_clipped_area(disc, PP_FILL_NONZERO, chain), lens / 2, bound / 2 + 1e-9);

    /* Arc length inside the quadrant: a quarter circumference, πr/2 (slack as above). */
    tu_assert_near(pp_path_clipped_length(disc, qc), G_PI * r / 2, 2 * G_PI * tol + 1e-7 * r);
  }
}

/* The clipped-length cache of flattened clips (src/geometry/clip_length.c) must not evict a
 * member a chain has just found cached when the chain's next member is new: fuzz_scene
 * found the read of freed memory that followed. Eight discs about the origin fill the
 * cache; then a chain of the oldest of them inside a new smaller disc. A line through the
 * centre of a disc of radius r lies inside it for 2r (a diameter, elementary geometry);
 * the slack is the clip flattening's (CLIP_FLATTEN_REL of the scene, about 1e-4 of it). */
static void test_clip_cache_chain(void **state) {
  (void)state;
  g_autoptr(pp_path) line = pp_path_new();
  pp_path_move_to(line, -200, 0);
  pp_path_line_to(line, 200, 0);
  pp_clip *discs[8];
  for (int k = 0; k < 8; k++) {
    cairo_t *cr = arc_context(FALSE);
    arc(cr, FALSE, 0, 0, 60 + k, 0, 2 * G_PI);
    cairo_close_path(cr);
    discs[k] = pp_clip_new(NULL, tu_path_from_cairo(cr), PP_FILL_NONZERO);
    cairo_destroy(cr);
    tu_assert_near(pp_path_clipped_length(line, discs[k]), 2 * (60 + k), 0.05);
  }
  cairo_t *cr = arc_context(FALSE);
  arc(cr, FALSE, 0, 0, 50, 0, 2 * G_PI);
  cairo_close_path(cr);
  g_autoptr(pp_clip) small = pp_clip_new(NULL, tu_path_from_cairo(cr), PP_FILL_NONZERO);
  cairo_destroy(cr);
  g_autoptr(pp_clip) chain = pp_clip_new(small, pp_path_copy(discs[0]->path), PP_FILL_NONZERO);
  tu_assert_near(pp_path_clipped_length(line, chain), 2 * 50, 0.05);
  for (int k = 0; k < 8; k++)
    pp_clip_unref(discs[k]);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_rectangle),          cmocka_unit_test(test_circle),
      cmocka_unit_test(test_sector_and_annulus), cmocka_unit_test(test_clipped_discs),
      cmocka_unit_test(test_clip_cache_chain),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
