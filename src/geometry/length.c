/* length.c — arc length of paths (cubics by adaptive Gauss–Legendre quadrature) and
 * stroke ink as width × visible length. */
#include "internal.h"

#include <math.h>

/* 8-point Gauss–Legendre nodes and weights on [-1, 1] (Abramowitz & Stegun, table 25.4). */
static const double gl_x[4] = {0.1834346424956498, 0.5255324099163290, 0.7966664774136267,
                               0.9602898564975363};
static const double gl_w[4] = {0.3626837833783620, 0.3137066458778873, 0.2223810344533745,
                               0.1012285362903763};

static double speed(const pp_point *p, double t) {
  pp_point d = pp_cubic_tangent(p, t);
  return hypot(d.x, d.y);
}

static double gl(const pp_point *p, double a, double b) {
  double m = 0.5 * (a + b), h = 0.5 * (b - a), sum = 0;
  for (int i = 0; i < 4; i++)
    sum += gl_w[i] * (speed(p, m - h * gl_x[i]) + speed(p, m + h * gl_x[i]));
  return sum * h;
}

static double adapt(const pp_point *p, double a, double b, double whole, double tol, int depth) {
  double m = 0.5 * (a + b);
  double l = gl(p, a, m), r = gl(p, m, b);
  if (depth >= 30 || fabs(l + r - whole) <= tol)
    return l + r;
  return adapt(p, a, m, l, tol / 2, depth + 1) + adapt(p, m, b, r, tol / 2, depth + 1);
}

double pp_cubic_length(const pp_point p[4], double t0, double t1) {
  double chord = hypot(p[3].x - p[0].x, p[3].y - p[0].y);
  double poly = hypot(p[1].x - p[0].x, p[1].y - p[0].y) + hypot(p[2].x - p[1].x, p[2].y - p[1].y) +
                hypot(p[3].x - p[2].x, p[3].y - p[2].y);
  double tol = 1e-13 * fmax(chord, poly) + 1e-300;
  return adapt(p, t0, t1, gl(p, t0, t1), tol, 0);
}

double pp_path_length(const pp_path *path) {
  if (!path)
    return 0;
  double sum = 0;
  pp_point start = {0, 0}, cur = {0, 0};
  for (size_t i = 0; i < path->n_segs; i++) {
    const pp_seg *s = &path->segs[i];
    switch (s->kind) {
    case PP_SEG_MOVE: start = cur = s->pt[0]; break;
    case PP_SEG_LINE:
      sum += hypot(s->pt[0].x - cur.x, s->pt[0].y - cur.y);
      cur = s->pt[0];
      break;
    case PP_SEG_CURVE: {
      pp_point p[4] = {cur, s->pt[0], s->pt[1], s->pt[2]};
      sum += pp_cubic_length(p, 0, 1);
      cur = s->pt[2];
      break;
    }
    case PP_SEG_CLOSE:
      sum += hypot(start.x - cur.x, start.y - cur.y);
      cur = start;
      break;
    }
  }
  return sum; /* NaN coordinates propagate */
}

double pp_stroke_ink(const pp_path *path, double line_width, const pp_clip *clip) {
  if (isnan(line_width))
    return NAN;
  if (line_width <= 0)
    return 0; /* PDF's zero width is "thinnest device line": no measurable ink */
  return line_width * pp_path_clipped_length(path, clip);
}
