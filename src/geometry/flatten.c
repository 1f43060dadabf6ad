/* flatten.c — polygons from paths for consumers that need vertices; areas never use
 * this (they are exact), so the tolerance only shapes the vertex lists. */
#include "internal.h"

#include <math.h>

static double dist_to_segment(pp_point p, pp_point a, pp_point b) {
  double dx = b.x - a.x, dy = b.y - a.y, len2 = dx * dx + dy * dy;
  double t = len2 > 0 ? ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2 : 0;
  t = t < 0 ? 0 : t > 1 ? 1 : t;
  return hypot(p.x - (a.x + t * dx), p.y - (a.y + t * dy));
}

/* The curve lies in its control hull, so control points within tol of the chord
 * bound the chord's deviation by tol. */
static void flatten_cubic(GArray *out, const pp_point *p, double tol, int depth) {
  if (depth >= 24 ||
      (dist_to_segment(p[1], p[0], p[3]) <= tol && dist_to_segment(p[2], p[0], p[3]) <= tol)) {
    g_array_append_val(out, p[3]);
    return;
  }
  pp_point p01 = {(p[0].x + p[1].x) / 2, (p[0].y + p[1].y) / 2};
  pp_point p12 = {(p[1].x + p[2].x) / 2, (p[1].y + p[2].y) / 2};
  pp_point p23 = {(p[2].x + p[3].x) / 2, (p[2].y + p[3].y) / 2};
  pp_point a = {(p01.x + p12.x) / 2, (p01.y + p12.y) / 2};
  pp_point b = {(p12.x + p23.x) / 2, (p12.y + p23.y) / 2};
  pp_point m = {(a.x + b.x) / 2, (a.y + b.y) / 2};
  pp_point l[4] = {p[0], p01, a, m}, r[4] = {m, b, p23, p[3]};
  flatten_cubic(out, l, tol, depth + 1);
  flatten_cubic(out, r, tol, depth + 1);
}

GPtrArray *pp_path_flatten(const pp_path *path, double tolerance) {
  GPtrArray *polys = g_ptr_array_new_with_free_func((GDestroyNotify)g_array_unref);
  if (!path)
    return polys;
  if (!(tolerance > 0) || !isfinite(tolerance))
    tolerance = 0.1; /* cairo's default tolerance, in points */
  GArray *cur_poly = NULL;
  pp_point cur = {0, 0};
  for (size_t i = 0; i < path->n_segs; i++) {
    const pp_seg *s = &path->segs[i];
    if (s->kind == PP_SEG_MOVE || !cur_poly) {
      cur_poly = g_array_new(FALSE, FALSE, sizeof(pp_point));
      g_ptr_array_add(polys, cur_poly);
      if (s->kind != PP_SEG_MOVE)
        g_array_append_val(cur_poly, cur);
    }
    switch (s->kind) {
    case PP_SEG_MOVE:
    case PP_SEG_LINE:
      g_array_append_val(cur_poly, s->pt[0]);
      cur = s->pt[0];
      break;
    case PP_SEG_CURVE: {
      pp_point p[4] = {cur, s->pt[0], s->pt[1], s->pt[2]};
      flatten_cubic(cur_poly, p, tolerance, 0);
      cur = s->pt[2];
      break;
    }
    case PP_SEG_CLOSE:
      /* Polygons are implicitly closed; drawing on after a close starts a new one. */
      cur = g_array_index(cur_poly, pp_point, 0);
      cur_poly = NULL;
      break;
    }
  }
  /* Subpaths that draw nothing (lone moves, cairo's move after a close) are dropped. */
  for (guint i = polys->len; i-- > 0;)
    if (((GArray *)polys->pdata[i])->len < 2)
      g_ptr_array_remove_index(polys, i);
  return polys;
}
