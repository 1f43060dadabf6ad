/* bbox.c — tight bounding boxes (cubic extrema from the derivative's roots) and
 * recognition of axis-aligned rectangles, which unlock the O(1) rect ∩ rect path. */
#include "internal.h"

#include <math.h>

static pp_rect add_cubic_extrema(pp_rect r, pp_point p0, const pp_point *c) {
  double P[4][2] = {{p0.x, p0.y}, {c[0].x, c[0].y}, {c[1].x, c[1].y}, {c[2].x, c[2].y}};
  for (int k = 0; k < 2; k++) {
    /* B'(t)/3 = a t² + b t + c in power basis */
    double d0 = P[1][k] - P[0][k], d1 = P[2][k] - P[1][k], d2 = P[3][k] - P[2][k];
    double a = d0 - 2 * d1 + d2, b = 2 * (d1 - d0), cc = d0;
    double roots[2];
    int n = 0;
    double scale = fmax(fabs(a), fmax(fabs(b), fabs(cc)));
    if (scale == 0)
      continue;
    if (fabs(a) <= 1e-14 * scale) {
      if (b != 0)
        roots[n++] = -cc / b;
    } else {
      double disc = b * b - 4 * a * cc;
      if (disc >= 0) {
        double q = -0.5 * (b + copysign(sqrt(disc), b));
        roots[n++] = q / a;
        if (q != 0)
          roots[n++] = cc / q;
      }
    }
    for (int i = 0; i < n; i++) {
      double t = roots[i];
      if (!(t > 0 && t < 1))
        continue;
      double s = 1 - t;
      double v = s * s * s * P[0][k] + 3 * s * s * t * P[1][k] + 3 * s * t * t * P[2][k] +
                 t * t * t * P[3][k];
      if (k == 0)
        r = pp_rect_union(r, (pp_rect){v, r.y0, v, r.y0});
      else
        r = pp_rect_union(r, (pp_rect){r.x0, v, r.x0, v});
    }
  }
  return r;
}

pp_rect pp_path_bbox(const pp_path *path) {
  pp_rect r = pp_rect_empty();
  if (!path)
    return r;
  pp_point cur = {0, 0};
  gboolean pending_move = FALSE; /* a move counts only once something is drawn from it */
  for (size_t i = 0; i < path->n_segs; i++) {
    const pp_seg *s = &path->segs[i];
    int n = s->kind == PP_SEG_CURVE ? 3 : s->kind == PP_SEG_CLOSE ? 0 : 1;
    for (int k = 0; k < n; k++)
      if (!isfinite(s->pt[k].x) || !isfinite(s->pt[k].y))
        return (pp_rect){NAN, NAN, NAN, NAN};
    switch (s->kind) {
    case PP_SEG_MOVE:
      cur = s->pt[0];
      pending_move = TRUE;
      break;
    case PP_SEG_LINE:
    case PP_SEG_CURVE:
      if (pending_move)
        r = pp_rect_add_point(r, cur);
      pending_move = FALSE;
      if (s->kind == PP_SEG_CURVE)
        r = add_cubic_extrema(pp_rect_add_point(r, cur), cur, s->pt);
      cur = s->pt[n - 1];
      r = pp_rect_add_point(r, cur);
      break;
    case PP_SEG_CLOSE:
      if (pending_move)
        r = pp_rect_add_point(r, cur);
      pending_move = FALSE;
      break;
    }
  }
  return r;
}

pp_rect pp_clip_bbox(const pp_clip *clip) {
  pp_rect r = {-INFINITY, -INFINITY, INFINITY, INFINITY};
  for (; clip; clip = clip->parent)
    if (clip->path)
      r = pp_rect_intersect(r, pp_path_bbox(clip->path));
  return r;
}

static gboolean near(double a, double b, double tol) {
  return fabs(a - b) <= tol;
}

gboolean pp_path_is_rectangle(const pp_path *path, double tol, pp_rect *out) {
  if (!path || !(tol >= 0))
    return FALSE;
  pp_point pts[64];
  size_t n = 0, raw = 0;
  gboolean ended = FALSE;
  for (size_t i = 0; i < path->n_segs; i++) {
    const pp_seg *s = &path->segs[i];
    if (s->kind == PP_SEG_CURVE)
      return FALSE;
    if (s->kind == PP_SEG_CLOSE) {
      ended = TRUE; /* cairo appends a move back to the start after a close */
      continue;
    }
    if (s->kind == PP_SEG_MOVE && raw > 0) {
      ended = TRUE;
      if (i + 1 < path->n_segs && path->segs[i + 1].kind != PP_SEG_MOVE)
        return FALSE; /* a second subpath that draws something */
      continue;
    }
    if (ended)
      return FALSE;
    raw++;
    if (!isfinite(s->pt[0].x) || !isfinite(s->pt[0].y))
      return FALSE;
    if (n > 0 && near(pts[n - 1].x, s->pt[0].x, tol) && near(pts[n - 1].y, s->pt[0].y, tol))
      continue;
    if (n == G_N_ELEMENTS(pts))
      return FALSE;
    pts[n++] = s->pt[0];
  }
  while (n > 1 && near(pts[n - 1].x, pts[0].x, tol) && near(pts[n - 1].y, pts[0].y, tol))
    n--;
  if (raw < 4 || n == 0)
    return FALSE;
  pp_rect b = pp_rect_empty();
  for (size_t i = 0; i < n; i++)
    b = pp_rect_add_point(b, pts[i]);
  /* Every edge must run along one side of the box; with |area| = box area this means
   * the outline goes round the box exactly once. */
  double area2 = 0;
  for (size_t i = 0; i < n; i++) {
    pp_point p = pts[i], q = pts[(i + 1) % n];
    gboolean side = (near(p.x, b.x0, tol) && near(q.x, b.x0, tol)) ||
                    (near(p.x, b.x1, tol) && near(q.x, b.x1, tol)) ||
                    (near(p.y, b.y0, tol) && near(q.y, b.y0, tol)) ||
                    (near(p.y, b.y1, tol) && near(q.y, b.y1, tol));
    if (!side)
      return FALSE;
    area2 += (p.x - b.x0) * (q.y - b.y0) - (q.x - b.x0) * (p.y - b.y0);
  }
  double w = b.x1 - b.x0, h = b.y1 - b.y0;
  if (!near(fabs(area2) * 0.5, w * h, tol * 2 * (w + h) + 1e-12 * w * h))
    return FALSE;
  if (out)
    *out = b;
  return TRUE;
}

gboolean pp_path_is_finite(const pp_path *path) {
  for (size_t i = 0; i < path->n_segs; i++)
    for (int k = 0; k < 3; k++)
      if (!isfinite(path->segs[i].pt[k].x) || !isfinite(path->segs[i].pt[k].y))
        return FALSE;
  return TRUE;
}

int pp_compare_doubles(const void *a, const void *b) {
  double x = *(const double *)a, y = *(const double *)b;
  return x < y ? -1 : x > y;
}
