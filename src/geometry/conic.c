/* conic.c — circles and ellipses fitted to points sampled on arcs, and the parametric angle
 * of a point on an ellipse (the angle in the un-tilted circle). Fits work in a y-up frame
 * centred and scaled on the points, so page offsets and sizes do not cost digits. */
#include "internal.h"

#include <math.h>

/* Solves the n×n system m·x = v in place by Gaussian elimination with partial pivoting.
 * FALSE when the system is singular to working precision. */
static gboolean solve(int n, double m[6][6], double v[6], double x[6]) {
  for (int c = 0; c < n; c++) {
    int piv = c;
    for (int r = c + 1; r < n; r++)
      if (fabs(m[r][c]) > fabs(m[piv][c]))
        piv = r;
    if (!(fabs(m[piv][c]) > 1e-13))
      return FALSE;
    for (int k = 0; k < n; k++) {
      double t = m[c][k];
      m[c][k] = m[piv][k];
      m[piv][k] = t;
    }
    double t = v[c];
    v[c] = v[piv];
    v[piv] = t;
    for (int r = c + 1; r < n; r++) {
      double f = m[r][c] / m[c][c];
      for (int k = c; k < n; k++)
        m[r][k] -= f * m[c][k];
      v[r] -= f * v[c];
    }
  }
  for (int r = n - 1; r >= 0; r--) {
    double s = v[r];
    for (int k = r + 1; k < n; k++)
      s -= m[r][k] * x[k];
    x[r] = s / m[r][r];
  }
  return TRUE;
}

/* Least squares of rows·x ≈ rhs through the normal equations (the columns are scaled
 * to unit size by the caller's frame, which keeps them well conditioned). */
typedef struct {
  int n;
  double ata[6][6], atb[6];
} lsq;

static void lsq_add(lsq *l, const double *row, double rhs) {
  for (int i = 0; i < l->n; i++) {
    for (int j = 0; j < l->n; j++)
      l->ata[i][j] += row[i] * row[j];
    l->atb[i] += row[i] * rhs;
  }
}

/* The points' mean and spread: the frame the fits work in (y up). */
typedef struct {
  pp_point o;
  double s;
} frame;

static frame frame_of(const pp_point *pts, size_t n) {
  frame f = {{0, 0}, 0};
  for (size_t i = 0; i < n; i++) {
    f.o.x += pts[i].x / n;
    f.o.y += pts[i].y / n;
  }
  for (size_t i = 0; i < n; i++)
    f.s = fmax(f.s, hypot(pts[i].x - f.o.x, pts[i].y - f.o.y));
  if (!(f.s > 0))
    f.s = 1;
  return f;
}

static pp_point to_frame(frame f, pp_point p) {
  return (pp_point){(p.x - f.o.x) / f.s, -(p.y - f.o.y) / f.s};
}

static pp_point from_frame(frame f, pp_point q) {
  return (pp_point){f.o.x + q.x * f.s, f.o.y - q.y * f.s};
}

gboolean pp_circle_fit(const pp_point *pts, size_t n, pp_point *centre, double *r) {
  if (!pts || n < 3)
    return FALSE;
  /* Kåsa's algebraic fit: x² + y² + D x + E y + F = 0, linear in D, E, F. */
  frame f = frame_of(pts, n);
  lsq l = {.n = 3};
  for (size_t i = 0; i < n; i++) {
    pp_point q = to_frame(f, pts[i]);
    double row[3] = {q.x, q.y, 1};
    lsq_add(&l, row, -(q.x * q.x + q.y * q.y));
  }
  double x[6];
  if (!solve(3, l.ata, l.atb, x))
    return FALSE;
  pp_point c = {-x[0] / 2, -x[1] / 2};
  double r2 = c.x * c.x + c.y * c.y - x[2];
  if (!(r2 > 0))
    return FALSE;
  *centre = from_frame(f, c);
  *r = sqrt(r2) * f.s;
  return TRUE;
}

/* Ellipse parameters from the centred quadratic form A x² + B xy + C y² = k (y up). */
static gboolean ellipse_from_form(double A, double B, double C, double k, pp_ellipse *e) {
  if (!(4 * A * C - B * B > 0) || !(k != 0))
    return FALSE;
  double mean = (A + C) / 2, diff = (A - C) / 2, rad = hypot(diff, B / 2);
  double l1 = mean + rad, l2 = mean - rad; /* eigenvalues, l1 ≥ l2 */
  if (!(l1 / k > 0) || !(l2 / k > 0))
    return FALSE;
  /* The smaller eigenvalue belongs to the major axis. */
  double rot = 0.5 * atan2(B, A - C); /* direction of the l1 eigenvector */
  e->rx = sqrt(k / l2);
  e->ry = sqrt(k / l1);
  /* Keep rot in [−π/2, π/2]: an ellipse is symmetric under a half turn. */
  e->rot = remainder(rot + G_PI / 2, G_PI);
  if (e->ry / e->rx > PP_CIRCLE_AXIS_RATIO) {
    /* A circle has no axis: the noise would pick one at random and turn every angle. */
    e->rx = e->ry = sqrt(e->rx * e->ry);
    e->rot = 0;
  }
  return TRUE;
}

gboolean pp_ellipse_fit(const pp_point *pts, size_t n, pp_ellipse *out) {
  if (!pts || n < 5)
    return FALSE;
  /* A x² + B xy + C y² + D x + E y + F = 0 with the trace normalised, A + C = 1, which no
   * ellipse violates and which is invariant under rotation: five unknowns, linear. */
  frame f = frame_of(pts, n);
  lsq l = {.n = 5};
  for (size_t i = 0; i < n; i++) {
    pp_point q = to_frame(f, pts[i]);
    double row[5] = {q.y * q.y - q.x * q.x, q.x * q.y, q.x, q.y, 1};
    lsq_add(&l, row, -q.x * q.x);
  }
  double x[6];
  if (!solve(5, l.ata, l.atb, x))
    return FALSE;
  double C = x[0], A = 1 - C, B = x[1], D = x[2], E = x[3], F = x[4];
  double det = 4 * A * C - B * B;
  if (!(det > 0))
    return FALSE;
  pp_point c = {(B * E - 2 * C * D) / det, (B * D - 2 * A * E) / det};
  double k = -(F + (D * c.x + E * c.y) / 2);
  pp_ellipse e;
  if (!ellipse_from_form(A, B, C, k, &e))
    return FALSE;
  e.centre = from_frame(f, c);
  e.rx *= f.s;
  e.ry *= f.s;
  *out = e;
  return TRUE;
}

gboolean pp_ellipse_fit_centred(const pp_point *pts, size_t n, pp_point centre, pp_ellipse *out) {
  if (!pts || n < 3)
    return FALSE;
  double s = 0;
  for (size_t i = 0; i < n; i++)
    s = fmax(s, hypot(pts[i].x - centre.x, pts[i].y - centre.y));
  if (!(s > 0))
    return FALSE;
  lsq l = {.n = 3};
  for (size_t i = 0; i < n; i++) {
    double x = (pts[i].x - centre.x) / s, y = -(pts[i].y - centre.y) / s;
    double row[3] = {x * x, x * y, y * y};
    lsq_add(&l, row, 1);
  }
  double x[6];
  if (!solve(3, l.ata, l.atb, x))
    return FALSE;
  pp_ellipse e;
  if (!ellipse_from_form(x[0], x[1], x[2], 1, &e))
    return FALSE;
  e.centre = centre;
  e.rx *= s;
  e.ry *= s;
  *out = e;
  return TRUE;
}

/* p in the ellipse's own frame: y up, axes along rx and ry, unit circle on the ellipse. */
static pp_point unit_coords(const pp_ellipse *e, pp_point p) {
  double dx = p.x - e->centre.x, dy = -(p.y - e->centre.y);
  double c = cos(e->rot), s = sin(e->rot);
  return (pp_point){(c * dx + s * dy) / e->rx, (-s * dx + c * dy) / e->ry};
}

double pp_ellipse_param(const pp_ellipse *e, pp_point p) {
  pp_point u = unit_coords(e, p);
  return atan2(u.y, u.x);
}

double pp_ellipse_scale(const pp_ellipse *e, pp_point p) {
  pp_point u = unit_coords(e, p);
  return hypot(u.x, u.y);
}

pp_point pp_ellipse_point(const pp_ellipse *e, double t) {
  double u = e->rx * cos(t), v = e->ry * sin(t);
  double c = cos(e->rot), s = sin(e->rot);
  return (pp_point){e->centre.x + c * u - s * v, e->centre.y - (s * u + c * v)};
}

double pp_sector_area(double r, double theta) {
  return r * r * theta / 2;
}

double pp_annular_sector_area(double r_outer, double r_inner, double theta) {
  return (r_outer * r_outer - r_inner * r_inner) * theta / 2;
}

double pp_ellipse_sector_area(double a, double b, double t1, double t2) {
  return a * b * (t2 - t1) / 2;
}
