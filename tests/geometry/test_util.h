/* test_util.h — helpers shared by the geometry tests: conversion between cairo paths
 * and pp_path, a seeded random source, and cairo pixel coverage of a clipped fill. */
#pragma once

#include <cairo.h>
#include <math.h>

#include "geometry/geometry.h"

/* cairo's own path data (curves kept, not flattened) as a pp_path. */
static inline pp_path *tu_path_from_cairo(cairo_t *cr) {
  cairo_path_t *cp = cairo_copy_path(cr);
  pp_path *p = pp_path_new();
  for (int i = 0; i < cp->num_data; i += cp->data[i].header.length) {
    cairo_path_data_t *d = &cp->data[i];
    switch (d->header.type) {
    case CAIRO_PATH_MOVE_TO: pp_path_move_to(p, d[1].point.x, d[1].point.y); break;
    case CAIRO_PATH_LINE_TO: pp_path_line_to(p, d[1].point.x, d[1].point.y); break;
    case CAIRO_PATH_CURVE_TO:
      pp_path_curve_to(p, d[1].point.x, d[1].point.y, d[2].point.x, d[2].point.y, d[3].point.x,
                       d[3].point.y);
      break;
    case CAIRO_PATH_CLOSE_PATH: pp_path_close(p); break;
    }
  }
  cairo_path_destroy(cp);
  return p;
}

static inline void tu_path_to_cairo(cairo_t *cr, const pp_path *p) {
  cairo_new_path(cr);
  for (size_t i = 0; i < p->n_segs; i++) {
    const pp_seg *s = &p->segs[i];
    switch (s->kind) {
    case PP_SEG_MOVE: cairo_move_to(cr, s->pt[0].x, s->pt[0].y); break;
    case PP_SEG_LINE: cairo_line_to(cr, s->pt[0].x, s->pt[0].y); break;
    case PP_SEG_CURVE:
      cairo_curve_to(cr, s->pt[0].x, s->pt[0].y, s->pt[1].x, s->pt[1].y, s->pt[2].x, s->pt[2].y);
      break;
    case PP_SEG_CLOSE: cairo_close_path(cr); break;
    }
  }
}

static inline cairo_fill_rule_t tu_cairo_rule(pp_fill_rule r) {
  return r == PP_FILL_EVEN_ODD ? CAIRO_FILL_RULE_EVEN_ODD : CAIRO_FILL_RULE_WINDING;
}

/* An A8 canvas of size² points at `scale` pixels a point: draw on it, then
 * tu_coverage_end() gives Σ alpha/255 over its pixels in pt² and frees it. */
static inline cairo_t *tu_coverage_begin(int size, int scale) {
  cairo_surface_t *s = cairo_image_surface_create(CAIRO_FORMAT_A8, size * scale, size * scale);
  cairo_t *cr = cairo_create(s);
  cairo_surface_destroy(s); /* the context holds its own reference */
  cairo_scale(cr, scale, scale);
  return cr;
}

static inline double tu_coverage_end(cairo_t *cr) {
  cairo_surface_t *s = cairo_get_target(cr);
  cairo_surface_flush(s);
  double scale = 1, zero = 0;
  cairo_user_to_device_distance(cr, &scale, &zero);
  const unsigned char *data = cairo_image_surface_get_data(s);
  int stride = cairo_image_surface_get_stride(s);
  int w = cairo_image_surface_get_width(s), h = cairo_image_surface_get_height(s);
  double sum = 0;
  for (int y = 0; y < h; y++)
    for (int x = 0; x < w; x++)
      sum += data[y * stride + x] / 255.0;
  cairo_destroy(cr);
  return sum / (scale * scale);
}

/* Σ coverage of cairo's non-zero fill of p on a size×size pt square, rendered at
 * `scale` pixels per point, in pt²: the pixel-count reference of the geometry tests. */
static inline double tu_cairo_fill_coverage(const pp_path *p, int size, int scale) {
  cairo_t *cr = tu_coverage_begin(size, scale);
  tu_path_to_cairo(cr, p);
  cairo_fill(cr);
  return tu_coverage_end(cr);
}

/* A cairo context on a throw-away surface, used only to build paths. */
static inline cairo_t *tu_path_context(void) {
  cairo_surface_t *s = cairo_image_surface_create(CAIRO_FORMAT_A8, 1, 1);
  cairo_t *cr = cairo_create(s);
  cairo_surface_destroy(s);
  return cr;
}

/* Random polygon subpath with n vertices in [lo, hi]² (usually self-intersecting). */
static inline void tu_random_ring(pp_path *p, GRand *rng, int n, double lo, double hi) {
  for (int i = 0; i < n; i++) {
    double x = g_rand_double_range(rng, lo, hi), y = g_rand_double_range(rng, lo, hi);
    if (i == 0)
      pp_path_move_to(p, x, y);
    else
      pp_path_line_to(p, x, y);
  }
  pp_path_close(p);
}

/* Random closed subpath of n cubic segments in [lo, hi]². */
static inline void tu_random_curvy(pp_path *p, GRand *rng, int n, double lo, double hi) {
  double x0 = g_rand_double_range(rng, lo, hi), y0 = g_rand_double_range(rng, lo, hi);
  pp_path_move_to(p, x0, y0);
  for (int i = 0; i < n; i++) {
    double c[6];
    for (int k = 0; k < 6; k++)
      c[k] = g_rand_double_range(rng, lo, hi);
    if (i == n - 1)
      c[4] = x0, c[5] = y0;
    pp_path_curve_to(p, c[0], c[1], c[2], c[3], c[4], c[5]);
  }
  pp_path_close(p);
}

/* cmocka 1.1's assert_float_equal compares in float; areas need double precision. */
#define tu_assert_near(a, b, tol)                                                                  \
  do {                                                                                             \
    double tu_a_ = (a), tu_b_ = (b), tu_t_ = (tol);                                                \
    if (!(fabs(tu_a_ - tu_b_) <= tu_t_))                                                           \
      fail_msg("%s = %.12g, want %.12g ± %.3g", #a, tu_a_, tu_b_, tu_t_);                          \
  } while (0)
