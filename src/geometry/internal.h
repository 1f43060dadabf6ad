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

/* ---- Areas: the sweep (clip_area.c), groups and convex subpaths (pieces.c), prepared
 * clip chains (clip_info.c). */

/* One region of an intersection: a path filled under its rule, with its bbox. */
typedef struct {
  const pp_path *path;
  pp_fill_rule rule;
  pp_rect box;
} pp_region;

/* Exact area of the intersection of all regions; NaN past the sweep's work bound. */
double pp_sweep_area(const pp_region *regs, guint n_reg);
/* The same with another bound on crossings that involve a curve (tests). */
double pp_sweep_area_bounded(const pp_region *regs, guint n_reg, long max_curve_swaps);

/* The path's subpaths in groups whose boxes do not overlap (of pp_path*); empty when the
 * path has at most one subpath that draws. */
GPtrArray *pp_path_split_disjoint(const pp_path *path);
/* One closed convex subpath (see pieces.c): its fill area is |signed area|. */
gboolean pp_path_is_convex(const pp_path *path);

/* A clip chain digested once for many marks: finiteness, the intersection of its
 * rectangular members and the list of its other members. */
typedef struct {
  gboolean finite;
  gboolean empty;  /* some member's box is empty: nothing is visible */
  pp_rect box;     /* intersection of the rectangular members (infinite if none) */
  GArray *regions; /* of pp_region: the other members */
} pp_clip_info;

pp_clip_info *pp_clip_info_new(const pp_clip *clip);
void pp_clip_info_free(pp_clip_info *info);
double pp_clip_info_area(const pp_clip_info *info, const pp_path *path, pp_fill_rule rule);
