/* quads.c — paths read as flat faces: triangles, trapezoids, parallelograms and other convex
 * quadrilaterals with their corners, and faces grouped into solids by the edges they share
 * (the front, cap and side of one 3D bar; the slices of one pyramid). */
#include "internal.h"

#include <math.h>
#include <string.h>

/* Two edges are parallel when the sine of the angle between them is below this: 0.01 rad
 * ≈ 0.6°, above the rounding of producers writing two decimals on edges of a few points
 * (0.01/5 = 0.002) and below any taper a perspective or funnel draws on purpose (common
 * practice, no source). */
#define PP_QUAD_PARALLEL_SIN 0.01
/* Most vertices a face outline may have before collinear points are removed. */
#define PP_QUAD_MAX_POINTS 32
/* Share of the shorter edge two collinear edges must overlap to count as shared: faces
 * of one solid meet along a whole edge, neighbours' faces at most touch (common practice,
 * no source). */
#define PP_QUAD_SHARED_OVERLAP 0.5

const char *pp_quad_kind_name(pp_quad_kind kind) {
  switch (kind) {
  case PP_QUAD_TRIANGLE: return "triangle";
  case PP_QUAD_RECTANGLE: return "rectangle";
  case PP_QUAD_PARALLELOGRAM: return "parallelogram";
  case PP_QUAD_TRAPEZOID: return "trapezoid";
  case PP_QUAD_CONVEX: return "convex";
  case PP_QUAD_NONE: break;
  }
  return "none";
}

static double cross(pp_point o, pp_point a, pp_point b) {
  return (a.x - o.x) * (b.y - o.y) - (a.y - o.y) * (b.x - o.x);
}

static double dist(pp_point a, pp_point b) {
  return hypot(a.x - b.x, a.y - b.y);
}

/* Distance of p from the infinite line through a and b. */
static double line_dist(pp_point p, pp_point a, pp_point b) {
  double len = dist(a, b);
  return len > 0 ? fabs(cross(a, b, p)) / len : dist(p, a);
}

static gboolean parallel(pp_point a0, pp_point a1, pp_point b0, pp_point b1) {
  double la = dist(a0, a1), lb = dist(b0, b1);
  if (la <= 0 || lb <= 0)
    return FALSE;
  double s = ((a1.x - a0.x) * (b1.y - b0.y) - (a1.y - a0.y) * (b1.x - b0.x)) / (la * lb);
  return fabs(s) < PP_QUAD_PARALLEL_SIN;
}

/* The corner points of one straight-edged subpath: repeats and points lying on the line
 * of their neighbours (within tol) removed. Returns the count, 0 when it is not such a path. */
static int outline_corners(const pp_path *path, double tol, pp_point *pts) {
  int n = 0;
  gboolean seen_move = FALSE;
  for (size_t i = 0; i < path->n_segs; i++) {
    const pp_seg *s = &path->segs[i];
    if (s->kind == PP_SEG_MOVE) {
      if (seen_move && n > 0)
        return 0; /* a second subpath with content */
      seen_move = TRUE;
    } else if (s->kind == PP_SEG_CURVE) {
      /* A curve counts only when it is straight: control points on its chord. */
      pp_point a = n ? pts[n - 1] : s->pt[2];
      if (line_dist(s->pt[0], a, s->pt[2]) > tol || line_dist(s->pt[1], a, s->pt[2]) > tol)
        return 0;
    } else if (s->kind == PP_SEG_CLOSE) {
      continue;
    }
    pp_point p = s->pt[s->kind == PP_SEG_CURVE ? 2 : 0];
    if (n > 0 && dist(p, pts[n - 1]) <= tol)
      continue;
    if (n >= PP_QUAD_MAX_POINTS)
      return 0;
    pts[n++] = p;
  }
  if (n > 1 && dist(pts[0], pts[n - 1]) <= tol)
    n--;
  /* Drop collinear points until none is left (each pass removes at most one per point). */
  gboolean changed = TRUE;
  while (changed && n >= 3) {
    changed = FALSE;
    for (int i = 0; i < n && n >= 3; i++) {
      pp_point prev = pts[(i + n - 1) % n], next = pts[(i + 1) % n];
      if (line_dist(pts[i], prev, next) <= tol) {
        for (int k = i; k < n - 1; k++)
          pts[k] = pts[k + 1];
        n--;
        changed = TRUE;
      }
    }
  }
  return n;
}

gboolean pp_path_as_quad(const pp_path *path, double tol, pp_quad *out) {
  pp_point pts[PP_QUAD_MAX_POINTS];
  if (!path || !out || !pp_path_is_finite(path))
    return FALSE;
  int n = outline_corners(path, tol, pts);
  if (n != 3 && n != 4)
    return FALSE;
  /* Convex, every turn the same way. */
  double sign = 0;
  for (int i = 0; i < n; i++) {
    double c = cross(pts[i], pts[(i + 1) % n], pts[(i + 2) % n]);
    if (sign == 0)
      sign = c;
    else if (c * sign <= 0)
      return FALSE;
  }
  *out = (pp_quad){.kind = PP_QUAD_NONE};
  for (int i = 0; i < 4; i++)
    out->p[i] = pts[i < n ? i : 0];
  out->area = pp_quad_area(out);
  if (n == 3) {
    out->kind = PP_QUAD_TRIANGLE;
    return TRUE;
  }
  gboolean p02 = parallel(pts[0], pts[1], pts[3], pts[2]);
  gboolean p13 = parallel(pts[1], pts[2], pts[0], pts[3]);
  if (p02 && p13) {
    double dot = (pts[1].x - pts[0].x) * (pts[3].x - pts[0].x) +
                 (pts[1].y - pts[0].y) * (pts[3].y - pts[0].y);
    double cosang = dot / (dist(pts[0], pts[1]) * dist(pts[0], pts[3]));
    out->kind = fabs(cosang) < PP_QUAD_PARALLEL_SIN ? PP_QUAD_RECTANGLE : PP_QUAD_PARALLELOGRAM;
  } else if (p02 || p13) {
    out->kind = PP_QUAD_TRAPEZOID;
    if (p13) { /* rotate so that p[0]p[1] ∥ p[3]p[2]: the parallel sides come first */
      pp_point first = out->p[0];
      for (int i = 0; i < 3; i++)
        out->p[i] = out->p[i + 1];
      out->p[3] = first;
    }
  } else {
    out->kind = PP_QUAD_CONVEX;
  }
  return TRUE;
}

double pp_quad_area(const pp_quad *quad) {
  double s = 0;
  for (int i = 0; i < 4; i++) {
    pp_point a = quad->p[i], b = quad->p[(i + 1) % 4];
    s += a.x * b.y - b.x * a.y;
  }
  return fabs(s) / 2;
}

/* Do edges a0a1 and b0b1 lie on one line and overlap over most of the shorter one? */
static gboolean edges_shared(pp_point a0, pp_point a1, pp_point b0, pp_point b1, double tol) {
  double la = dist(a0, a1), lb = dist(b0, b1);
  if (la <= tol || lb <= tol)
    return FALSE;
  if (line_dist(b0, a0, a1) > tol || line_dist(b1, a0, a1) > tol)
    return FALSE;
  double ux = (a1.x - a0.x) / la, uy = (a1.y - a0.y) / la;
  double t0 = (b0.x - a0.x) * ux + (b0.y - a0.y) * uy;
  double t1 = (b1.x - a0.x) * ux + (b1.y - a0.y) * uy;
  double lo = fmax(0, fmin(t0, t1)), hi = fmin(la, fmax(t0, t1));
  return hi - lo >= PP_QUAD_SHARED_OVERLAP * fmin(la, lb);
}

static int n_corners(const pp_quad *q) {
  return q->kind == PP_QUAD_TRIANGLE ? 3 : 4;
}

gboolean pp_quads_share_edge(const pp_quad *a, const pp_quad *b, double tol) {
  int na = n_corners(a), nb = n_corners(b);
  for (int i = 0; i < na; i++)
    for (int k = 0; k < nb; k++)
      if (edges_shared(a->p[i], a->p[(i + 1) % na], b->p[k], b->p[(k + 1) % nb], tol))
        return TRUE;
  return FALSE;
}

double pp_polygon_area(const pp_point *pts, guint n) {
  double s = 0;
  for (guint i = 0; i < n; i++) {
    pp_point a = pts[i], b = pts[(i + 1) % n];
    s += a.x * b.y - b.x * a.y;
  }
  return fabs(s) / 2;
}

static int cmp_point(const void *a, const void *b) {
  const pp_point *p = a, *q = b;
  if (p->x != q->x)
    return p->x < q->x ? -1 : 1;
  return (p->y > q->y) - (p->y < q->y);
}

/* Andrew's monotone chain (textbook). */
guint pp_convex_hull(const pp_point *pts, guint n, pp_point *out) {
  if (n < 3) {
    memcpy(out, pts, n * sizeof *pts);
    return n;
  }
  g_autofree pp_point *p = g_memdup2(pts, n * sizeof *pts);
  qsort(p, n, sizeof *p, cmp_point);
  g_autofree pp_point *h = g_new(pp_point, 2 * n);
  guint k = 0;
  for (guint i = 0; i < n; i++) {
    while (k >= 2 && cross(h[k - 2], h[k - 1], p[i]) <= 0)
      k--;
    h[k++] = p[i];
  }
  for (guint i = n - 1, t = k + 1; i-- > 0;) {
    while (k >= t && cross(h[k - 2], h[k - 1], p[i]) <= 0)
      k--;
    h[k++] = p[i];
  }
  k = k > 0 ? k - 1 : 0;
  memcpy(out, h, MIN(k, n) * sizeof *h);
  return MIN(k, n);
}

/* Sutherland–Hodgman against each edge of the convex clip (textbook). */
guint pp_convex_clip(const pp_point *subject, guint ns, const pp_point *clip, guint nc,
                     pp_point *out) {
  pp_point a[PP_CONVEX_MAX], b[PP_CONVEX_MAX];
  if (ns < 3 || nc < 3 || ns > PP_CONVEX_MAX)
    return 0;
  double turn = 0;
  for (guint i = 0; i < nc; i++)
    turn += clip[i].x * clip[(i + 1) % nc].y - clip[(i + 1) % nc].x * clip[i].y;
  double sgn = turn < 0 ? -1 : 1;
  memcpy(a, subject, ns * sizeof *a);
  guint n = ns;
  for (guint e = 0; e < nc && n > 0; e++) {
    pp_point c0 = clip[e], c1 = clip[(e + 1) % nc];
    guint m = 0;
    for (guint k = 0; k < n && m + 2 <= PP_CONVEX_MAX; k++) {
      pp_point p = a[k], q = a[(k + 1) % n];
      double sp = sgn * cross(c0, c1, p), sq = sgn * cross(c0, c1, q);
      if (sp >= 0)
        b[m++] = p;
      if ((sp >= 0) != (sq >= 0)) {
        double t = sp / (sp - sq);
        b[m++] = (pp_point){p.x + t * (q.x - p.x), p.y + t * (q.y - p.y)};
      }
    }
    memcpy(a, b, m * sizeof *a);
    n = m;
  }
  if (n < 3)
    return 0;
  memcpy(out, a, n * sizeof *a);
  return n;
}
