/* test_geos.c — clipped fill areas of random paths checked against GEOS (libgeos C API).
 * The reference region for a fill rule is built from GEOS's arrangement of the rings:
 * GEOSNode splits the linework at every crossing, GEOSPolygonize returns the faces, and a
 * face is kept when the winding number of the rings around GEOSPointOnSurface(face) is
 * nonzero (nonzero rule) or odd (even-odd rule) — the rules' definitions, ISO 32000-1
 * §8.5.3.3. Winding numbers are counted here by plain ray crossing, not by plotproof. */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>
#include <geos_c.h>

#include "test_util.h"

#define CURVE_STEPS 8192 /* uniform steps per cubic on the GEOS side */

static GEOSContextHandle_t ctx;

typedef struct {
  GArray *rings; /* of GArray<pp_point>, closed implicitly */
  double dev;    /* bound on the distance from the true path */
  double length; /* total ring length */
} rings;

/* Flatten uniformly in t. A chord over a step h deviates from the cubic by at most
 * h²/8 · max|B''|, and |B''| ≤ 6·max|Δ²P| (B'' interpolates the second differences), so
 * dev ≤ 0.75 · max|Δ²P| / N² (standard Bézier bounds, e.g. Farin, "Curves and Surfaces
 * for CAGD", from memory). */
static rings flatten_rings(const pp_path *p) {
  rings r = {g_array_new(FALSE, FALSE, sizeof(GArray *)), 0, 0};
  GArray *cur = NULL;
  pp_point at = {0, 0};
  for (size_t i = 0; i < p->n_segs; i++) {
    const pp_seg *s = &p->segs[i];
    if (s->kind == PP_SEG_MOVE) {
      cur = g_array_new(FALSE, FALSE, sizeof(pp_point));
      g_array_append_val(r.rings, cur);
      g_array_append_val(cur, s->pt[0]);
      at = s->pt[0];
    } else if (s->kind == PP_SEG_LINE) {
      g_array_append_val(cur, s->pt[0]);
      at = s->pt[0];
    } else if (s->kind == PP_SEG_CURVE) {
      pp_point q[4] = {at, s->pt[0], s->pt[1], s->pt[2]};
      double m = 0;
      for (int k = 0; k < 2; k++)
        m = fmax(m,
                 hypot(q[k].x - 2 * q[k + 1].x + q[k + 2].x, q[k].y - 2 * q[k + 1].y + q[k + 2].y));
      r.dev = fmax(r.dev, 0.75 * m / ((double)CURVE_STEPS * CURVE_STEPS));
      for (int j = 1; j <= CURVE_STEPS; j++) {
        double t = (double)j / CURVE_STEPS, u = 1 - t;
        pp_point v = {u * u * u * q[0].x + 3 * u * u * t * q[1].x + 3 * u * t * t * q[2].x +
                          t * t * t * q[3].x,
                      u * u * u * q[0].y + 3 * u * u * t * q[1].y + 3 * u * t * t * q[2].y +
                          t * t * t * q[3].y};
        g_array_append_val(cur, v);
      }
      at = s->pt[2];
    }
  }
  for (guint k = 0; k < r.rings->len; k++) {
    GArray *g = g_array_index(r.rings, GArray *, k);
    for (guint i = 0; i < g->len; i++) {
      pp_point a = g_array_index(g, pp_point, i), b = g_array_index(g, pp_point, (i + 1) % g->len);
      r.length += hypot(b.x - a.x, b.y - a.y);
    }
  }
  return r;
}

static void rings_free(rings *r) {
  for (guint k = 0; k < r->rings->len; k++)
    g_array_unref(g_array_index(r->rings, GArray *, k));
  g_array_unref(r->rings);
}

static int winding(const rings *r, double x, double y) {
  int w = 0;
  for (guint k = 0; k < r->rings->len; k++) {
    GArray *g = g_array_index(r->rings, GArray *, k);
    for (guint i = 0; i < g->len; i++) {
      pp_point a = g_array_index(g, pp_point, i), b = g_array_index(g, pp_point, (i + 1) % g->len);
      if ((a.y <= y) != (b.y <= y) && a.x + (y - a.y) * (b.x - a.x) / (b.y - a.y) > x)
        w += a.y < b.y ? 1 : -1;
    }
  }
  return w;
}

/* The filled region of r under rule, as a GEOS (multi)polygon. */
static GEOSGeometry *geos_region(const rings *r, pp_fill_rule rule) {
  guint n = r->rings->len;
  GEOSGeometry **lines = g_new(GEOSGeometry *, n);
  for (guint k = 0; k < n; k++) {
    GArray *g = g_array_index(r->rings, GArray *, k);
    GEOSCoordSequence *seq = GEOSCoordSeq_create_r(ctx, g->len + 1, 2);
    for (guint i = 0; i <= g->len; i++) {
      pp_point a = g_array_index(g, pp_point, i % g->len);
      GEOSCoordSeq_setXY_r(ctx, seq, i, a.x, a.y);
    }
    lines[k] = GEOSGeom_createLineString_r(ctx, seq);
  }
  GEOSGeometry *multi = GEOSGeom_createCollection_r(ctx, GEOS_MULTILINESTRING, lines, n);
  g_free(lines);
  GEOSGeometry *noded = GEOSNode_r(ctx, multi);
  const GEOSGeometry *in[1] = {noded};
  GEOSGeometry *faces = GEOSPolygonize_r(ctx, in, 1);
  int nf = GEOSGetNumGeometries_r(ctx, faces);
  GEOSGeometry **keep = g_new(GEOSGeometry *, nf + 1);
  int nk = 0;
  for (int i = 0; i < nf; i++) {
    const GEOSGeometry *f = GEOSGetGeometryN_r(ctx, faces, i);
    GEOSGeometry *pt = GEOSPointOnSurface_r(ctx, f);
    double x, y;
    GEOSGeomGetX_r(ctx, pt, &x);
    GEOSGeomGetY_r(ctx, pt, &y);
    GEOSGeom_destroy_r(ctx, pt);
    int w = winding(r, x, y);
    if (rule == PP_FILL_EVEN_ODD ? (w & 1) : w != 0)
      keep[nk++] = GEOSGeom_clone_r(ctx, f);
  }
  GEOSGeometry *coll = GEOSGeom_createCollection_r(ctx, GEOS_GEOMETRYCOLLECTION, keep, nk);
  GEOSGeometry *region = GEOSUnaryUnion_r(ctx, coll);
  g_free(keep);
  GEOSGeom_destroy_r(ctx, coll);
  GEOSGeom_destroy_r(ctx, faces);
  GEOSGeom_destroy_r(ctx, noded);
  GEOSGeom_destroy_r(ctx, multi);
  return region;
}

typedef struct {
  double area, bound;
} reference;

static reference geos_clipped_area(const pp_path *p, pp_fill_rule rule, const pp_clip *clip) {
  rings r = flatten_rings(p);
  GEOSGeometry *acc = geos_region(&r, rule);
  double dev = r.dev, len = r.length;
  rings_free(&r);
  for (const pp_clip *c = clip; c; c = c->parent) {
    rings cr = flatten_rings(c->path);
    GEOSGeometry *g = geos_region(&cr, c->rule);
    GEOSGeometry *next = GEOSIntersection_r(ctx, acc, g);
    GEOSGeom_destroy_r(ctx, acc);
    GEOSGeom_destroy_r(ctx, g);
    acc = next;
    dev = fmax(dev, cr.dev);
    len += cr.length;
    rings_free(&cr);
  }
  reference ref = {0, 0};
  GEOSArea_r(ctx, acc, &ref.area);
  GEOSGeom_destroy_r(ctx, acc);
  /* Moving every boundary by at most dev changes the region by at most the dev-tube
   * around the boundary: area ≤ 2·dev·length (plus corner terms of order dev²). */
  ref.bound = 2 * dev * len + 1e-9;
  return ref;
}

static pp_clip *random_clip(GRand *rng, gboolean curves) {
  pp_path *c = pp_path_new();
  int kind = g_rand_int_range(rng, 0, 3);
  if (kind == 0)
    pp_path_rectangle(c, g_rand_double_range(rng, 0, 50), g_rand_double_range(rng, 0, 50),
                      g_rand_double_range(rng, 10, 60), g_rand_double_range(rng, 10, 60));
  else if (kind == 1 || !curves)
    tu_random_ring(c, rng, g_rand_int_range(rng, 3, 8), 0, 100);
  else
    tu_random_curvy(c, rng, 3, 0, 100);
  return pp_clip_new(NULL, c, g_rand_boolean(rng) ? PP_FILL_EVEN_ODD : PP_FILL_NONZERO);
}

static void run_cases(int n_cases, guint32 seed, gboolean curves) {
  GRand *rng = g_rand_new_with_seed(seed);
  for (int i = 0; i < n_cases; i++) {
    g_autoptr(pp_path) p = pp_path_new();
    int subpaths = g_rand_int_range(rng, 1, 3);
    for (int s = 0; s < subpaths; s++) {
      if (curves && g_rand_boolean(rng))
        tu_random_curvy(p, rng, g_rand_int_range(rng, 2, 4), 0, 100);
      else
        tu_random_ring(p, rng, g_rand_int_range(rng, 3, 10), 0, 100);
    }
    pp_clip *clip = NULL;
    int nclip = i % 3; /* no clip, one clip, a chain of two */
    for (int k = 0; k < nclip; k++) {
      pp_clip *c = random_clip(rng, curves);
      c->parent = clip; /* chain onto the previous one; c owns that reference now */
      clip = c;
    }
    for (int rule = 0; rule < 2; rule++) {
      double ours = pp_path_clipped_area(p, rule, clip);
      reference ref = geos_clipped_area(p, rule, clip);
      /* GEOS agreement: 1e-6 relative (task requirement), plus the flattening bound of
       * the GEOS side when curves are present. */
      double tol = 1e-6 * fmax(ref.area, 1) + (curves ? ref.bound : 0);
      if (fabs(ours - ref.area) > tol)
        print_error("case %d rule %d: ours %.12g geos %.12g (tol %.3g)\n", i, rule, ours, ref.area,
                    tol);
      tu_assert_near(ours, ref.area, tol);
    }
    pp_clip_unref(clip);
  }
  g_rand_free(rng);
}

static void test_random_polygons(void **state) {
  (void)state;
  run_cases(200, 1234, FALSE);
}

static void test_random_curves(void **state) {
  (void)state;
  run_cases(40, 4321, TRUE);
}

static GEOSGeometry *geos_polygon(const pp_point *p, guint n) {
  GEOSCoordSequence *seq = GEOSCoordSeq_create_r(ctx, n + 1, 2);
  for (guint i = 0; i <= n; i++)
    GEOSCoordSeq_setXY_r(ctx, seq, i, p[i % n].x, p[i % n].y);
  return GEOSGeom_createPolygon_r(ctx, GEOSGeom_createLinearRing_r(ctx, seq), NULL, 0);
}

/* Convex hulls and convex clips (boxes.c: a 3D bar's silhouette, the part of a face a
 * nearer bar hides) against GEOS's convex hull and intersection areas. */
static void test_convex_hull_and_clip(void **state) {
  (void)state;
  GRand *rng = g_rand_new_with_seed(777);
  for (int c = 0; c < 300; c++) {
    pp_point a[8], b[8], ha[8], hb[8], out[PP_CONVEX_MAX];
    for (int i = 0; i < 8; i++) {
      a[i] = (pp_point){g_rand_double_range(rng, 0, 100), g_rand_double_range(rng, 0, 100)};
      b[i] = (pp_point){g_rand_double_range(rng, 30, 130), g_rand_double_range(rng, 20, 120)};
    }
    guint na = pp_convex_hull(a, 8, ha), nb = pp_convex_hull(b, 8, hb);
    GEOSGeometry *ga = geos_polygon(a, 8), *gb = geos_polygon(b, 8);
    GEOSGeometry *ca = GEOSConvexHull_r(ctx, ga), *cb = GEOSConvexHull_r(ctx, gb);
    double want_a, want_b, want_i;
    GEOSArea_r(ctx, ca, &want_a);
    GEOSArea_r(ctx, cb, &want_b);
    assert_true(fabs(pp_polygon_area(ha, na) - want_a) < 1e-9 * want_a + 1e-9);
    assert_true(fabs(pp_polygon_area(hb, nb) - want_b) < 1e-9 * want_b + 1e-9);
    GEOSGeometry *gi = GEOSIntersection_r(ctx, ca, cb);
    GEOSArea_r(ctx, gi, &want_i);
    guint ni = pp_convex_clip(ha, na, hb, nb, out);
    double got = ni >= 3 ? pp_polygon_area(out, ni) : 0;
    assert_true(fabs(got - want_i) < 1e-7 * (want_a + want_b));
    GEOSGeom_destroy_r(ctx, ga), GEOSGeom_destroy_r(ctx, gb), GEOSGeom_destroy_r(ctx, ca);
    GEOSGeom_destroy_r(ctx, cb), GEOSGeom_destroy_r(ctx, gi);
  }
  g_rand_free(rng);
}

int main(void) {
  ctx = GEOS_init_r();
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_random_polygons),
      cmocka_unit_test(test_random_curves),
      cmocka_unit_test(test_convex_hull_and_clip),
  };
  int rc = cmocka_run_group_tests(tests, NULL, NULL);
  GEOS_finish_r(ctx);
  return rc;
}
