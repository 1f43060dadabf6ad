/* internal.h — shared by the geometry stage's files only: evaluating a cubic Bézier and
 * its derivative, and the small helpers several measurements need. */
#pragma once

#include <math.h>

#include "geometry.h"

/* Point of the cubic p[0..3] at parameter t (Bernstein form). */
static inline pp_point pp_cubic_point(const pp_point *p, double t) {
  double s = 1 - t;
  double a = s * s * s, b = 3 * s * s * t, c = 3 * s * t * t, d = t * t * t;
  return (pp_point){a * p[0].x + b * p[1].x + c * p[2].x + d * p[3].x,
                    a * p[0].y + b * p[1].y + c * p[2].y + d * p[3].y};
}

/* Derivative of the cubic p[0..3] with respect to t. */
static inline pp_point pp_cubic_tangent(const pp_point *p, double t) {
  double s = 1 - t;
  return (pp_point){
      3 * (s * s * (p[1].x - p[0].x) + 2 * s * t * (p[2].x - p[1].x) + t * t * (p[3].x - p[2].x)),
      3 * (s * s * (p[1].y - p[0].y) + 2 * s * t * (p[2].y - p[1].y) + t * t * (p[3].y - p[2].y))};
}

/* Every coordinate finite: NaN or infinity anywhere makes a measure undefined. */
gboolean pp_path_is_finite(const pp_path *path);

/* qsort comparator for doubles. */
int pp_compare_doubles(const void *a, const void *b);
