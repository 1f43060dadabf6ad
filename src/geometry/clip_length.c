/* clip_length.c — length of the part of a path inside a clip chain, for stroke ink.
 * Each segment is cut where it meets a clip boundary; each piece is then in or out,
 * decided by probes either side of its midpoint (a piece along the boundary counts half). */
#include "internal.h"

#include <math.h>
#include <string.h>

/* Curved clip boundaries are flattened to this fraction of the scene size; the
 * resulting error in the clipped length is bounded in docs/geometry.md. */
#define CLIP_FLATTEN_REL 1e-7

/* A curved clip member flattened, with its edges listed by horizontal band so that a
 * probe or a segment meets only the edges at its height. */
typedef struct {
  pp_path *path; /* a copy of the member's path: what the entry was made from */
  double tol;
  GPtrArray *polys;  /* flattened subpaths, of GArray<pp_point> */
  pp_point *ea, *eb; /* every edge (closing ones included), from ea[i] to eb[i] */
  guint n_edges;     /* ...in the order the subpaths list them */
  double band_y0, band_h;
  guint n_bands;
  guint *band_first; /* band j's edges: band_edges[band_first[j] .. band_first[j+1]) */
  guint *band_edges;
  guint *seen; /* per edge: the last lookup that met it */
  guint lookup;
  guint call; /* the last pp_path_clipped_length() call that took it from the cache */
} flat_clip;

typedef struct {
  const flat_clip *flat;
  flat_clip *own; /* set when not cached: this call frees it */
  pp_fill_rule rule;
  pp_rect box;
} clip_poly;

typedef struct {
  pp_rect box;     /* intersection of the rectangular clips */
  GArray *general; /* of clip_poly */
  double eps;
} clip_set;

/* Edges per band: about this many on average (common practice for bucket grids, no
 * source). */
#define CLIP_EDGES_PER_BAND 4
/* Flattened clips kept between calls: the strokes of a scene share a few clip paths, and
 * one curved clip flattened to CLIP_FLATTEN_REL holds thousands of points. An entry is
 * taken only for a path of the same segments and the same tolerance, so its polygons are
 * the ones flattening again would give (a freed path's address reused never matches). */
#define CLIP_CACHE_SIZE 8

static guint band_of(const flat_clip *f, double y) {
  double b = floor((y - f->band_y0) / f->band_h);
  if (!(b > 0))
    return 0;
  return b >= f->n_bands ? f->n_bands - 1 : (guint)b;
}

static void flat_clip_free(flat_clip *f) {
  if (!f)
    return;
  pp_path_free(f->path);
  g_ptr_array_unref(f->polys);
  g_free(f->ea);
  g_free(f->eb);
  g_free(f->band_first);
  g_free(f->band_edges);
  g_free(f->seen);
  g_free(f);
}

static flat_clip *flat_clip_new(const pp_path *path, double tol) {
  flat_clip *f = g_new0(flat_clip, 1);
  f->path = pp_path_copy(path);
  f->tol = tol;
  f->polys = pp_path_flatten(path, tol);
  for (guint k = 0; k < f->polys->len; k++)
    f->n_edges += ((GArray *)f->polys->pdata[k])->len;
  f->ea = g_new(pp_point, MAX(f->n_edges, 1));
  f->eb = g_new(pp_point, MAX(f->n_edges, 1));
  f->seen = g_new0(guint, MAX(f->n_edges, 1));
  double y0 = INFINITY, y1 = -INFINITY;
  guint e = 0;
  for (guint k = 0; k < f->polys->len; k++) {
    GArray *poly = f->polys->pdata[k];
    const pp_point *v = (const pp_point *)poly->data;
    for (guint i = 0; i < poly->len; i++, e++) {
      f->ea[e] = v[i], f->eb[e] = v[(i + 1) % poly->len];
      y0 = fmin(y0, v[i].y), y1 = fmax(y1, v[i].y);
    }
  }
  f->n_bands = MAX(f->n_edges / CLIP_EDGES_PER_BAND, 1);
  f->band_y0 = isfinite(y0) ? y0 : 0;
  f->band_h = isfinite(y1 - y0) && y1 > y0 ? (y1 - y0) / f->n_bands : 1;
  f->band_first = g_new0(guint, f->n_bands + 1);
  for (guint i = 0; i < f->n_edges; i++) /* count, then place */
    for (guint b = band_of(f, fmin(f->ea[i].y, f->eb[i].y));
         b <= band_of(f, fmax(f->ea[i].y, f->eb[i].y)); b++)
      f->band_first[b + 1]++;
  for (guint b = 0; b < f->n_bands; b++)
    f->band_first[b + 1] += f->band_first[b];
  f->band_edges = g_new(guint, MAX(f->band_first[f->n_bands], 1));
  guint *fill = g_memdup2(f->band_first, f->n_bands * sizeof(guint));
  for (guint i = 0; i < f->n_edges; i++)
    for (guint b = band_of(f, fmin(f->ea[i].y, f->eb[i].y));
         b <= band_of(f, fmax(f->ea[i].y, f->eb[i].y)); b++)
      f->band_edges[fill[b]++] = i;
  g_free(fill);
  return f;
}

static gboolean same_path(const pp_path *a, const pp_path *b) {
  if (a->n_segs != b->n_segs)
    return FALSE;
  for (size_t i = 0; i < a->n_segs; i++)
    if (a->segs[i].kind != b->segs[i].kind ||
        memcmp(a->segs[i].pt, b->segs[i].pt, sizeof a->segs[i].pt) != 0)
      return FALSE;
  return TRUE;
}

static flat_clip *flat_cache[CLIP_CACHE_SIZE];
static guint flat_cache_next;
static guint flat_cache_call;

/* The member flattened at tol, from the cache or made now (and cached). An entry that this
 * call already holds is never the one evicted: a chain whose outer member is new would
 * otherwise free the flattening of an inner member it found cached a moment before. */
static const flat_clip *flat_clip_get(const pp_path *path, double tol) {
  for (guint i = 0; i < CLIP_CACHE_SIZE; i++) {
    flat_clip *f = flat_cache[i];
    if (f && f->tol == tol && same_path(f->path, path)) {
      f->call = flat_cache_call;
      return f;
    }
  }
  flat_clip *f = flat_clip_new(path, tol);
  f->call = flat_cache_call;
  /* A chain holds at most CLIP_CACHE_SIZE members, so some slot is not held by this call. */
  guint slot = flat_cache_next;
  for (guint k = 0; k < CLIP_CACHE_SIZE; k++, slot = (slot + 1) % CLIP_CACHE_SIZE)
    if (!flat_cache[slot] || flat_cache[slot]->call != flat_cache_call)
      break;
  flat_clip_free(flat_cache[slot]);
  flat_cache[slot] = f;
  flat_cache_next = (slot + 1) % CLIP_CACHE_SIZE;
  return f;
}

static gboolean in_poly(const clip_poly *c, pp_point p) {
  if (!(p.x >= c->box.x0 && p.x <= c->box.x1 && p.y >= c->box.y0 && p.y <= c->box.y1))
    return FALSE;
  /* Only edges spanning p.y can cross the ray, and those are all in p.y's band; the
   * winding is a sum, so the order they are met in does not matter. */
  const flat_clip *f = c->flat;
  int w = 0;
  guint b = band_of(f, p.y);
  for (guint k = f->band_first[b]; k < f->band_first[b + 1]; k++) {
    pp_point a = f->ea[f->band_edges[k]], d = f->eb[f->band_edges[k]];
    if ((a.y <= p.y) != (d.y <= p.y)) { /* half-open rule: shared vertices count once */
      double x = a.x + (p.y - a.y) * (d.x - a.x) / (d.y - a.y);
      if (x > p.x)
        w += a.y < d.y ? 1 : -1;
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
    /* The edges of the bands the segment spans, each once; the cuts are sorted below, so
     * the order they are found in does not matter. */
    flat_clip *f = (flat_clip *)c->flat;
    if (++f->lookup == 0) { /* wrapped: forget every mark */
      memset(f->seen, 0, MAX(f->n_edges, 1) * sizeof(guint));
      f->lookup = 1;
    }
    for (guint b = band_of(f, sb.y0), last = band_of(f, sb.y1); b <= last; b++)
      for (guint k = f->band_first[b]; k < f->band_first[b + 1]; k++) {
        guint i = f->band_edges[k];
        if (f->seen[i] == f->lookup)
          continue;
        f->seen[i] = f->lookup;
        pp_point a = f->ea[i], d = f->eb[i];
        pp_rect eb = pp_rect_add_point(pp_rect_add_point(pp_rect_empty(), a), d);
        if (boxes_overlap(sb, eb))
          cut_line(p, n, a, d, FALSE, ts);
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
      clip_poly cp = {NULL, NULL, c->rule, cb};
      g_array_append_val(cs.general, cp);
    }
  }
  if (pp_rect_is_empty(cs.box))
    goto out;
  double size = fmax(fmax(pp_rect_width(scene), pp_rect_height(scene)), 1e-300);
  double maxabs = fmax(fmax(fabs(scene.x0), fabs(scene.x1)), fmax(fabs(scene.y0), fabs(scene.y1)));
  cs.eps = fmax(1e-9 * size, 64 * G_MINDOUBLE + 1e-15 * maxabs);
  if (++flat_cache_call == 0) { /* wrapped: no entry is held by the new call */
    for (guint i = 0; i < CLIP_CACHE_SIZE; i++)
      if (flat_cache[i])
        flat_cache[i]->call = 0;
    flat_cache_call = 1;
  }
  guint gi = 0;
  for (const pp_clip *c = clip; c; c = c->parent) {
    pp_rect r;
    if (!c->path || pp_path_is_rectangle(c->path, 0, &r))
      continue;
    clip_poly *cp = &g_array_index(cs.general, clip_poly, gi++);
    /* A chain of more curved members than the cache holds would evict its own. */
    if (cs.general->len <= CLIP_CACHE_SIZE)
      cp->flat = flat_clip_get(c->path, CLIP_FLATTEN_REL * size);
    else
      cp->flat = cp->own = flat_clip_new(c->path, CLIP_FLATTEN_REL * size);
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
  for (guint i = 0; i < cs.general->len; i++)
    flat_clip_free(g_array_index(cs.general, clip_poly, i).own);
  g_array_free(cs.general, TRUE);
  return result;
}
