/* rect.c — axis-aligned boxes and affine matrices in cairo's convention. */
#include "core.h"

#include <math.h>

pp_rect pp_rect_empty(void) {
  return (pp_rect){INFINITY, INFINITY, -INFINITY, -INFINITY};
}

gboolean pp_rect_is_empty(pp_rect r) {
  return !(r.x0 <= r.x1 && r.y0 <= r.y1);
}

/* fmin and fmax without the call: a box of a path of a million points takes four per
 * point. Neither argument is NaN here (a rectangle holding one is empty), and on a tie
 * these give the first argument, as glibc's fmin and fmax do (measured). */
static inline double low(double a, double b) {
  return a <= b ? a : b;
}
static inline double high(double a, double b) {
  return a >= b ? a : b;
}

pp_rect pp_rect_union(pp_rect a, pp_rect b) {
  if (pp_rect_is_empty(a))
    return b;
  if (pp_rect_is_empty(b))
    return a;
  return (pp_rect){low(a.x0, b.x0), low(a.y0, b.y0), high(a.x1, b.x1), high(a.y1, b.y1)};
}

pp_rect pp_rect_intersect(pp_rect a, pp_rect b) {
  pp_rect r = {fmax(a.x0, b.x0), fmax(a.y0, b.y0), fmin(a.x1, b.x1), fmin(a.y1, b.y1)};
  return pp_rect_is_empty(r) ? pp_rect_empty() : r;
}

/* pp_rect_union with the point's rectangle, which is empty when a coordinate is NaN. */
pp_rect pp_rect_add_point(pp_rect r, pp_point p) {
  if (isnan(p.x) || isnan(p.y))
    return r;
  if (pp_rect_is_empty(r))
    return (pp_rect){p.x, p.y, p.x, p.y};
  return (pp_rect){low(r.x0, p.x), low(r.y0, p.y), high(r.x1, p.x), high(r.y1, p.y)};
}

double pp_rect_width(pp_rect r) {
  return pp_rect_is_empty(r) ? 0 : r.x1 - r.x0;
}
double pp_rect_height(pp_rect r) {
  return pp_rect_is_empty(r) ? 0 : r.y1 - r.y0;
}
double pp_rect_area(pp_rect r) {
  return pp_rect_width(r) * pp_rect_height(r);
}

gboolean pp_rect_contains(pp_rect outer, pp_rect inner, double tol) {
  return inner.x0 >= outer.x0 - tol && inner.y0 >= outer.y0 - tol && inner.x1 <= outer.x1 + tol &&
         inner.y1 <= outer.y1 + tol;
}

pp_matrix pp_matrix_identity(void) {
  return (pp_matrix){1, 0, 0, 1, 0, 0};
}

pp_matrix pp_matrix_multiply(pp_matrix a, pp_matrix b) {
  return (pp_matrix){
      .xx = a.xx * b.xx + a.yx * b.xy,
      .yx = a.xx * b.yx + a.yx * b.yy,
      .xy = a.xy * b.xx + a.yy * b.xy,
      .yy = a.xy * b.yx + a.yy * b.yy,
      .x0 = a.x0 * b.xx + a.y0 * b.xy + b.x0,
      .y0 = a.x0 * b.yx + a.y0 * b.yy + b.y0,
  };
}

gboolean pp_matrix_invert(pp_matrix m, pp_matrix *out) {
  double det = m.xx * m.yy - m.yx * m.xy;
  if (det == 0 || !isfinite(det))
    return FALSE;
  pp_matrix inv = {m.yy / det, -m.yx / det, -m.xy / det, m.xx / det, 0, 0};
  inv.x0 = -(inv.xx * m.x0 + inv.xy * m.y0);
  inv.y0 = -(inv.yx * m.x0 + inv.yy * m.y0);
  *out = inv;
  return TRUE;
}

pp_point pp_matrix_apply(pp_matrix m, pp_point p) {
  return (pp_point){m.xx * p.x + m.xy * p.y + m.x0, m.yx * p.x + m.yy * p.y + m.y0};
}

pp_point pp_matrix_apply_distance(pp_matrix m, pp_point d) {
  return (pp_point){m.xx * d.x + m.xy * d.y, m.yx * d.x + m.yy * d.y};
}

/* The box of the four mapped corners: exact for the quarter turns and flips that map
 * page points to PDF user space (ISO 32000-1 §8.3.2.3, /Rotate). */
pp_rect pp_rect_transform(pp_rect r, pp_matrix m) {
  if (pp_rect_is_empty(r) || !isfinite(r.x0) || !isfinite(r.y0) || !isfinite(r.x1) ||
      !isfinite(r.y1))
    return pp_rect_empty();
  pp_point corners[4] = {{r.x0, r.y0}, {r.x1, r.y0}, {r.x1, r.y1}, {r.x0, r.y1}};
  pp_rect out = pp_rect_empty();
  for (int i = 0; i < 4; i++)
    out = pp_rect_add_point(out, pp_matrix_apply(m, corners[i]));
  return out;
}
