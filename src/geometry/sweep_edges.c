/* sweep_edges.c — the area sweep's input: a path's lines and cubic Béziers as
 * y-monotone pieces (cubics cut at the roots of y'(t)), with the power-basis
 * coefficients the sweep's root finding evaluates. */
#include "sweep_edges.h"

#include <string.h>

void pp_bez_split(const pp_point *p, double t, pp_point *l, pp_point *r) {
  pp_point p01 = {p[0].x + (p[1].x - p[0].x) * t, p[0].y + (p[1].y - p[0].y) * t};
  pp_point p12 = {p[1].x + (p[2].x - p[1].x) * t, p[1].y + (p[2].y - p[1].y) * t};
  pp_point p23 = {p[2].x + (p[3].x - p[2].x) * t, p[2].y + (p[3].y - p[2].y) * t};
  pp_point a = {p01.x + (p12.x - p01.x) * t, p01.y + (p12.y - p01.y) * t};
  pp_point b = {p12.x + (p23.x - p12.x) * t, p12.y + (p23.y - p12.y) * t};
  pp_point m = {a.x + (b.x - a.x) * t, a.y + (b.y - a.y) * t};
  pp_point p0 = p[0], p3 = p[3];
  if (l) {
    l[0] = p0, l[1] = p01, l[2] = a, l[3] = m;
  }
  if (r) {
    r[0] = m, r[1] = b, r[2] = p23, r[3] = p3;
  }
}

/* Roots of a·t² + b·t + c in the open interval (0,1), ascending. */
static int quad_roots01(double a, double b, double c, double *out) {
  double r[2];
  int n = 0;
  double scale = fmax(fabs(a), fmax(fabs(b), fabs(c)));
  if (scale == 0)
    return 0;
  if (fabs(a) <= 1e-14 * scale) {
    if (b != 0)
      r[n++] = -c / b;
  } else {
    double disc = b * b - 4 * a * c;
    if (disc >= 0) {
      double q = -0.5 * (b + copysign(sqrt(disc), b));
      r[n++] = q / a;
      if (q != 0)
        r[n++] = c / q;
    }
  }
  int m = 0;
  for (int i = 0; i < n; i++)
    if (r[i] > 0 && r[i] < 1)
      out[m++] = r[i];
  if (m == 2 && out[0] > out[1]) {
    double t = out[0];
    out[0] = out[1], out[1] = t;
  }
  return m;
}

static void push_line(GArray *edges, pp_point a, pp_point b, guint reg) {
  if (a.y == b.y)
    return; /* horizontal edges bound no slab */
  pp_sweep_edge e = {0};
  e.region = reg;
  e.dir = a.y < b.y ? 1 : -1;
  e.p[0] = a.y < b.y ? a : b;
  e.p[1] = a.y < b.y ? b : a;
  e.ya = e.p[0].y, e.yb = e.p[1].y;
  e.slope = (e.p[1].x - e.p[0].x) / (e.yb - e.ya);
  g_array_append_val(edges, e);
}

static void push_mono_cubic(GArray *edges, const pp_point *p, guint reg) {
  if (p[0].y == p[3].y)
    return; /* a y-monotone piece with equal end y is horizontal */
  pp_sweep_edge e = {0};
  e.region = reg;
  e.curve = TRUE;
  e.dir = p[0].y < p[3].y ? 1 : -1;
  for (int i = 0; i < 4; i++)
    e.p[i] = e.dir > 0 ? p[i] : p[3 - i];
  e.ya = e.p[0].y, e.yb = e.p[3].y;
  e.t_hint = 0.5;
  e.end_y = NAN;
  /* Power basis relative to the first point: Horner is a quarter of Bernstein's cost in
   * the root finding, and the relative form keeps far-away pieces' digits. */
  const pp_point *q = e.p;
  double px[4] = {0, q[1].x - q[0].x, q[2].x - q[0].x, q[3].x - q[0].x};
  double py[4] = {0, q[1].y - q[0].y, q[2].y - q[0].y, q[3].y - q[0].y};
  e.kx[0] = 3 * px[1] - 3 * px[2] + px[3], e.kx[1] = 3 * (px[2] - 2 * px[1]), e.kx[2] = 3 * px[1];
  e.ky[0] = 3 * py[1] - 3 * py[2] + py[3], e.ky[1] = 3 * (py[2] - 2 * py[1]), e.ky[2] = 3 * py[1];
  g_array_append_val(edges, e);
}

static void push_cubic(GArray *edges, pp_point p0, const pp_point *c, guint reg) {
  pp_point p[4] = {p0, c[0], c[1], c[2]};
  double d0 = p[1].y - p[0].y, d1 = p[2].y - p[1].y, d2 = p[3].y - p[2].y;
  double roots[2];
  int n = quad_roots01(d0 - 2 * d1 + d2, 2 * (d1 - d0), d0, roots);
  double prev = 0;
  pp_point rest[4];
  memcpy(rest, p, sizeof rest);
  for (int i = 0; i < n; i++) {
    double t = (roots[i] - prev) / (1 - prev);
    pp_point l[4], r[4];
    pp_bez_split(rest, t, l, r);
    push_mono_cubic(edges, l, reg);
    memcpy(rest, r, sizeof rest);
    prev = roots[i];
  }
  push_mono_cubic(edges, rest, reg);
}

void pp_sweep_edges_add_path(GArray *edges, const pp_path *path, guint reg) {
  pp_point start = {0, 0}, cur = {0, 0};
  gboolean open = FALSE;
  for (size_t i = 0; i < path->n_segs; i++) {
    const pp_seg *sg = &path->segs[i];
    switch (sg->kind) {
    case PP_SEG_MOVE:
      if (open)
        push_line(edges, cur, start, reg); /* fills close every subpath */
      start = cur = sg->pt[0];
      open = TRUE;
      break;
    case PP_SEG_LINE:
      if (!open)
        start = cur, open = TRUE;
      push_line(edges, cur, sg->pt[0], reg);
      cur = sg->pt[0];
      break;
    case PP_SEG_CURVE:
      if (!open)
        start = cur, open = TRUE;
      push_cubic(edges, cur, sg->pt, reg);
      cur = sg->pt[2];
      break;
    case PP_SEG_CLOSE:
      push_line(edges, cur, start, reg);
      cur = start;
      break;
    }
  }
  if (open)
    push_line(edges, cur, start, reg);
}

/* Sort key of a double in unsigned order: the sign bit flipped, negatives reversed;
 * −0 counts as +0, as a comparison of doubles does. */
static guint64 order_key(double v) {
  v += 0.0;
  guint64 b;
  memcpy(&b, &v, sizeof b);
  return b >> 63 ? ~b : b | (guint64)1 << 63;
}

typedef struct {
  guint64 k;
  pp_sweep_edge *e;
} keyed;

/* Radix digits of 11 bits: six passes over 64-bit keys, each skipped when every key has
 * the same digit. Common practice (LSD radix sort), no source. */
#define RADIX_BITS 11
#define SMALL_SORT 32

void pp_sweep_edges_sort(pp_sweep_edge **v, double *keys, size_t n, gboolean by_top) {
  keyed *a = g_new(keyed, n), *b = g_new(keyed, n);
  for (size_t i = 0; i < n; i++)
    a[i] = (keyed){order_key(by_top ? v[i]->yb : v[i]->ya), v[i]};
  if (n <= SMALL_SORT) { /* insertion sort: stable, as the radix passes are */
    for (size_t i = 1; i < n; i++) {
      keyed t = a[i];
      size_t j = i;
      for (; j > 0 && a[j - 1].k > t.k; j--)
        a[j] = a[j - 1];
      a[j] = t;
    }
  } else {
    const size_t nb = (size_t)1 << RADIX_BITS;
    size_t *count = g_new(size_t, nb);
    for (int shift = 0; shift < 64; shift += RADIX_BITS) {
      memset(count, 0, nb * sizeof(size_t));
      for (size_t i = 0; i < n; i++)
        count[(a[i].k >> shift) & (nb - 1)]++;
      if (count[(a[0].k >> shift) & (nb - 1)] == n)
        continue;
      for (size_t d = 0, sum = 0; d < nb; d++) {
        size_t c = count[d];
        count[d] = sum, sum += c;
      }
      for (size_t i = 0; i < n; i++)
        b[count[(a[i].k >> shift) & (nb - 1)]++] = a[i];
      keyed *t = a;
      a = b, b = t;
    }
    g_free(count);
  }
  for (size_t i = 0; i < n; i++) {
    v[i] = a[i].e;
    keys[i] = by_top ? a[i].e->yb : a[i].e->ya;
  }
  g_free(a);
  g_free(b);
}
