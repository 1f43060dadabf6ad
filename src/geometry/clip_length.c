/* clip_length.c — length of the part of a path inside a clip chain, for stroke ink.
 * Each segment is cut where it meets a clip boundary; each piece is then in or out,
 * decided by probes either side of its midpoint (a piece along the boundary counts half). */
#include "internal.h"

#include <math.h>

/* Curved clip boundaries are flattened to this fraction of the scene size; the
 * resulting error in the clipped length is bounded in docs/geometry.md. */
#define CLIP_FLATTEN_REL 1e-7

typedef struct {
  GPtrArray *polys; /* flattened subpaths, of GArray<pp_point> */
  pp_fill_rule rule;
  pp_rect box;
} clip_poly;

typedef struct {
  pp_rect box;     /* intersection of the rectangular clips */
  GArray *general; /* of clip_poly */
  double eps;
} clip_set;

static gboolean in_poly(const clip_poly *c, pp_point p) {
  if (!(p.x >= c->box.x0 && p.x <= c->box.x1 && p.y >= c->box.y0 && p.y <= c->box.y1))
    return FALSE;
  int w = 0;
  for (guint k = 0; k < c->polys->len; k++) {
    GArray *poly = c->polys->pdata[k];
    const pp_point *v = (const pp_point *)poly->data;
    for (guint i = 0; i < poly->len; i++) {
      pp_point a = v[i], b = v[(i + 1) % poly->len];
      if ((a.y <= p.y) != (b.y <= p.y)) { /* half-open rule: shared vertices count once */
        double x = a.x + (p.y - a.y) * (b.x - a.x) / (b.y - a.y);
        if (x > p.x)
          w += a.y < b.y ? 1 : -1;
      }
    }
  }
  return c->rule == PP_FILL_EVEN_ODD ? (w & 1) != 0 : w != 0;
}

static gboolean in_clip(const clip_set *cs, pp_point p) {
  if (!(p.x > cs->box.x0 && p.x < cs->box.x1 && p.y > cs->box.y0 && p.y < cs->box.y1))
    return FALSE;
  for (guint i = 0; i < cs->general->len; i++)
    if (!in_poly(&g_array_index(cs->general, clip_poly, i), p))
      return FALSE;
  return TRUE;
}

static double poly3(const double *c, double t) {
  return ((c[3] * t + c[2]) * t + c[1]) * t + c[0];
}

/* Roots in [0,1] of c0 + c1 t + c2 t² + c3 t³: the derivative's roots split [0,1] into
 * monotone stretches, each bisected — slow but never misses a simple root. */
static void cubic_roots01(const double *c, GArray *out) {
  double brk[4] = {0};
  int nb = 1;
  double a = 3 * c[3], b = 2 * c[2], cc = c[1];
  if (a != 0) {
    double disc = b * b - 4 * a * cc;
    if (disc > 0) {
      double q = -0.5 * (b + copysign(sqrt(disc), b));
      double r1 = q / a, r2 = q != 0 ? cc / q : r1;
      if (r1 > r2) {
        double t = r1;
        r1 = r2, r2 = t;
      }
      if (r1 > 0 && r1 < 1)
        brk[nb++] = r1;
      if (r2 > 0 && r2 < 1)
        brk[nb++] = r2;
    }
  } else if (b != 0) {
    double r = -cc / b;
    if (r > 0 && r < 1)
      brk[nb++] = r;
  }
  brk[nb++] = 1;
  for (int i = 0; i + 1 < nb; i++) {
    double lo = brk[i], hi = brk[i + 1], flo = poly3(c, lo), fhi = poly3(c, hi);
    if (flo == 0) {
      g_array_append_val(out, lo);
      continue;
    }
    if ((flo < 0) == (fhi < 0) || fhi == 0)
      continue;
    for (int it = 0; it < 100 && hi - lo > 1e-16; it++) {
      double m = 0.5 * (lo + hi), fm = poly3(c, m);
      if ((fm < 0) == (flo < 0))
        lo = m, flo = fm;
      else
        hi = m;
    }
    double r = 0.5 * (lo + hi);
    g_array_append_val(out, r);
  }
}

/* Parameters where segment p (line if n == 2, cubic if n == 4) meets the line through
 * c→d, kept when the hit lies on the segment c→d (or anywhere if infinite). */
static void cut_line(const pp_point *p, int n, pp_point c, pp_point d, gboolean infinite,
                     GArray *ts) {
  pp_point nrm = {-(d.y - c.y), d.x - c.x};
  double dd = nrm.x * nrm.x + nrm.y * nrm.y;
  if (dd == 0)
    return;
  double f[4];
  for (int i = 0; i < n; i++)
    f[i] = nrm.x * (p[i].x - c.x) + nrm.y * (p[i].y - c.y);
  double coef[4];
  if (n == 2) {
    coef[0] = f[0], coef[1] = f[1] - f[0], coef[2] = coef[3] = 0;
  } else {
    coef[0] = f[0], coef[1] = 3 * (f[1] - f[0]), coef[2] = 3 * (f[0] - 2 * f[1] + f[2]);
    coef[3] = -f[0] + 3 * f[1] - 3 * f[2] + f[3];
  }
  guint from = ts->len;
  cubic_roots01(coef, ts);
  if (infinite)
    return;
  guint k = from;
  for (guint i = from; i < ts->len; i++) {
    double t = g_array_index(ts, double, i);
    pp_point q = n == 2 ? (pp_point){p[0].x + t * (p[1].x - p[0].x), p[0].y + t * (p[1].y - p[0].y)}
                        : pp_cubic_point(p, t);
    double u = ((q.x - c.x) * (d.x - c.x) + (q.y - c.y) * (d.y - c.y)) / dd;
    if (u >= -1e-9 && u <= 1 + 1e-9)
      g_array_index(ts, double, k++) = t;
  }
  g_array_set_size(ts, k);
}

static gboolean boxes_overlap(pp_rect a, pp_rect b) {
  return a.x0 <= b.x1 && b.x0 <= a.x1 && a.y0 <= b.y1 && b.y0 <= a.y1;
}

static double segment_inside(const clip_set *cs, const pp_point *p, int n, GArray *ts) {
  pp_rect sb = pp_rect_empty();
  for (int i = 0; i < n; i++)
    sb = pp_rect_add_point(sb, p[i]);
  double full = n == 2 ? hypot(p[1].x - p[0].x, p[1].y - p[0].y) : pp_cubic_length(p, 0, 1);
  if (full == 0)
    return 0;
  if (!boxes_overlap(sb, cs->box))
    return 0;
  gboolean inner =
      sb.x0 > cs->box.x0 && sb.x1 < cs->box.x1 && sb.y0 > cs->box.y0 && sb.y1 < cs->box.y1;
  if (inner && cs->general->len == 0)
    return full; /* the common case: a mark well inside its plot-area clip */
  g_array_set_size(ts, 0);
  double zero = 0, one = 1;
  g_array_append_val(ts, zero);
  g_array_append_val(ts, one);
  pp_rect b = cs->box;
  if (!inner) {
    pp_point corners[4] = {{b.x0, b.y0}, {b.x1, b.y0}, {b.x1, b.y1}, {b.x0, b.y1}};
    for (int k = 0; k < 4; k++)
      if (isfinite(corners[k].x) && isfinite(corners[k].y) && isfinite(corners[(k + 1) % 4].x) &&
          isfinite(corners[(k + 1) % 4].y))
        cut_line(p, n, corners[k], corners[(k + 1) % 4], TRUE, ts);
  }
  for (guint g = 0; g < cs->general->len; g++) {
    const clip_poly *c = &g_array_index(cs->general, clip_poly, g);
    if (!boxes_overlap(sb, c->box))
      return 0;
    for (guint k = 0; k < c->polys->len; k++) {
      GArray *poly = c->polys->pdata[k];
      const pp_point *v = (const pp_point *)poly->data;
      for (guint i = 0; i < poly->len; i++) {
        pp_point a = v[i], d = v[(i + 1) % poly->len];
        pp_rect eb = pp_rect_add_point(pp_rect_add_point(pp_rect_empty(), a), d);
        if (boxes_overlap(sb, eb))
          cut_line(p, n, a, d, FALSE, ts);
      }
    }
  }
  qsort(ts->data, ts->len, sizeof(double), pp_compare_doubles);
  double sum = 0;
  for (guint i = 0; i + 1 < ts->len; i++) {
    double t0 = g_array_index(ts, double, i), t1 = g_array_index(ts, double, i + 1);
    if (t1 <= t0)
      continue;
    double tm = 0.5 * (t0 + t1);
    pp_point q, tan;
    if (n == 2) {
      q = (pp_point){p[0].x + tm * (p[1].x - p[0].x), p[0].y + tm * (p[1].y - p[0].y)};
      tan = (pp_point){p[1].x - p[0].x, p[1].y - p[0].y};
    } else {
      q = pp_cubic_point(p, tm);
      tan = pp_cubic_tangent(p, tm);
    }
    double tl = hypot(tan.x, tan.y);
    double w;
    if (tl > 0) {
      pp_point off = {-tan.y / tl * cs->eps, tan.x / tl * cs->eps};
      w = 0.5 * (in_clip(cs, (pp_point){q.x + off.x, q.y + off.y}) +
                 in_clip(cs, (pp_point){q.x - off.x, q.y - off.y}));
    } else {
      w = in_clip(cs, q);
    }
    if (w > 0)
      sum += w * (n == 2 ? full * (t1 - t0) : pp_cubic_length(p, t0, t1));
  }
  return sum;
}

double pp_path_clipped_length(const pp_path *path, const pp_clip *clip) {
  if (!path)
    return 0;
  if (!clip)
    return pp_path_length(path);
  if (!pp_path_is_finite(path))
    return NAN;
  pp_rect scene = pp_path_bbox(path);
  if (pp_rect_is_empty(scene))
    return 0;
  clip_set cs = {
      {-INFINITY, -INFINITY, INFINITY, INFINITY}, g_array_new(FALSE, FALSE, sizeof(clip_poly)), 0};
  double result = 0;
  for (const pp_clip *c = clip; c; c = c->parent) {
    if (!c->path)
      continue;
    if (!pp_path_is_finite(c->path)) {
      result = NAN;
      goto out;
    }
    pp_rect r, cb = pp_path_bbox(c->path);
    if (pp_rect_is_empty(cb))
      goto out; /* a clip that paints nothing hides everything */
    scene = pp_rect_union(scene, cb);
    if (pp_path_is_rectangle(c->path, 0, &r))
      cs.box = pp_rect_intersect(cs.box, r);
    else {
      clip_poly cp = {NULL, c->rule, cb};
      g_array_append_val(cs.general, cp);
    }
  }
  if (pp_rect_is_empty(cs.box))
    goto out;
  double size = fmax(fmax(pp_rect_width(scene), pp_rect_height(scene)), 1e-300);
  double maxabs = fmax(fmax(fabs(scene.x0), fabs(scene.x1)), fmax(fabs(scene.y0), fabs(scene.y1)));
  cs.eps = fmax(1e-9 * size, 64 * G_MINDOUBLE + 1e-15 * maxabs);
  guint gi = 0;
  for (const pp_clip *c = clip; c; c = c->parent) {
    pp_rect r;
    if (!c->path || pp_path_is_rectangle(c->path, 0, &r))
      continue;
    g_array_index(cs.general, clip_poly, gi++).polys =
        pp_path_flatten(c->path, CLIP_FLATTEN_REL * size);
  }
  GArray *ts = g_array_new(FALSE, FALSE, sizeof(double));
  pp_point start = {0, 0}, cur = {0, 0};
  for (size_t i = 0; i < path->n_segs; i++) {
    const pp_seg *s = &path->segs[i];
    pp_point p[4];
    switch (s->kind) {
    case PP_SEG_MOVE: start = cur = s->pt[0]; break;
    case PP_SEG_LINE:
    case PP_SEG_CLOSE:
      p[0] = cur, p[1] = s->kind == PP_SEG_LINE ? s->pt[0] : start;
      result += segment_inside(&cs, p, 2, ts);
      cur = p[1];
      break;
    case PP_SEG_CURVE:
      p[0] = cur, p[1] = s->pt[0], p[2] = s->pt[1], p[3] = s->pt[2];
      result += segment_inside(&cs, p, 4, ts);
      cur = s->pt[2];
      break;
    }
  }
  g_array_free(ts, TRUE);
out:
  for (guint i = 0; i < cs.general->len; i++) {
    GPtrArray *polys = g_array_index(cs.general, clip_poly, i).polys;
    if (polys)
      g_ptr_array_unref(polys);
  }
  g_array_free(cs.general, TRUE);
  return result;
}
