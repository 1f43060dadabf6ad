/* clip_area.c — exact area of (path under its fill rule) ∩ every clip region.
 * Slab sweep: edges become y-monotone pieces; between consecutive event y's no two
 * edges cross, so gaps are ordered by x and ∫(x_right − x_left) dy is taken in closed form. */
#include "internal.h"

#include <float.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

/* Sub-slab recursion and crossing-search limits: they only bound work on
 * pathological input (coincident curves, tangencies); see docs/geometry.md. */
#define MAX_SLAB_DEPTH 48
#define MAX_CROSS_DEPTH 52
#define CROSS_NODE_BUDGET 4000

typedef struct {
  double ya, yb; /* ya < yb */
  pp_point p[4]; /* line: p[0] → p[1]; cubic: control points with y(t) non-decreasing */
  gboolean curve;
  int dir; /* +1 when the original edge ran towards larger y */
  guint region;
  double t_hint;
  double slope; /* dx/dy of a line edge */
  /* per-slab scratch: x and t at slab top, middle and bottom */
  double xt, xm, xb, tt, tb;
} edge;

typedef struct {
  GArray *edges; /* of edge */
  edge **act;
  size_t n_act;
  guint n_reg;
  const pp_region *regs;
  int *wind;
  double eps_y, tol_x;
} sweep;

/* de Casteljau split at t: left half into l, right half into r (either may alias nothing). */
static void bez_split(const pp_point *p, double t, pp_point *l, pp_point *r) {
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

static void push_line(sweep *s, pp_point a, pp_point b, guint reg) {
  if (a.y == b.y)
    return; /* horizontal edges bound no slab */
  edge e = {0};
  e.region = reg;
  e.dir = a.y < b.y ? 1 : -1;
  e.p[0] = a.y < b.y ? a : b;
  e.p[1] = a.y < b.y ? b : a;
  e.ya = e.p[0].y, e.yb = e.p[1].y;
  e.slope = (e.p[1].x - e.p[0].x) / (e.yb - e.ya);
  g_array_append_val(s->edges, e);
}

static void push_mono_cubic(sweep *s, const pp_point *p, guint reg) {
  if (p[0].y == p[3].y)
    return; /* a y-monotone piece with equal end y is horizontal */
  edge e = {0};
  e.region = reg;
  e.curve = TRUE;
  e.dir = p[0].y < p[3].y ? 1 : -1;
  for (int i = 0; i < 4; i++)
    e.p[i] = e.dir > 0 ? p[i] : p[3 - i];
  e.ya = e.p[0].y, e.yb = e.p[3].y;
  e.t_hint = 0.5;
  g_array_append_val(s->edges, e);
}

static void push_cubic(sweep *s, pp_point p0, const pp_point *c, guint reg) {
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
    bez_split(rest, t, l, r);
    push_mono_cubic(s, l, reg);
    memcpy(rest, r, sizeof rest);
    prev = roots[i];
  }
  push_mono_cubic(s, rest, reg);
}

static void push_path(sweep *s, const pp_path *path, guint reg) {
  pp_point start = {0, 0}, cur = {0, 0};
  gboolean open = FALSE;
  for (size_t i = 0; i < path->n_segs; i++) {
    const pp_seg *sg = &path->segs[i];
    switch (sg->kind) {
    case PP_SEG_MOVE:
      if (open)
        push_line(s, cur, start, reg); /* fills close every subpath */
      start = cur = sg->pt[0];
      open = TRUE;
      break;
    case PP_SEG_LINE:
      if (!open)
        start = cur, open = TRUE;
      push_line(s, cur, sg->pt[0], reg);
      cur = sg->pt[0];
      break;
    case PP_SEG_CURVE:
      if (!open)
        start = cur, open = TRUE;
      push_cubic(s, cur, sg->pt, reg);
      cur = sg->pt[2];
      break;
    case PP_SEG_CLOSE:
      push_line(s, cur, start, reg);
      cur = start;
      break;
    }
  }
  if (open)
    push_line(s, cur, start, reg);
}

/* t in [0,1] with y(t) = y on a monotone piece: safeguarded Newton (bisection fallback). */
static double solve_t(edge *e, double y) {
  if (y <= e->ya)
    return 0;
  if (y >= e->yb)
    return 1;
  double lo = 0, hi = 1, t = e->t_hint;
  if (!(t > 0 && t < 1))
    t = (y - e->ya) / (e->yb - e->ya);
  for (int it = 0; it < 100; it++) {
    double f = pp_cubic_point(e->p, t).y - y;
    if (f == 0)
      break;
    if (f < 0)
      lo = t;
    else
      hi = t;
    double d = pp_cubic_tangent(e->p, t).y;
    double nt = d > 0 ? t - f / d : -1;
    if (!(nt > lo && nt < hi))
      nt = 0.5 * (lo + hi);
    if (fabs(nt - t) <= 4 * DBL_EPSILON || hi - lo <= 4 * DBL_EPSILON) {
      t = nt;
      break;
    }
    t = nt;
  }
  e->t_hint = t;
  return t;
}

static double edge_x(edge *e, double y, double *t_out) {
  if (!e->curve) {
    if (y <= e->ya)
      return e->p[0].x;
    if (y >= e->yb)
      return e->p[1].x;
    return e->p[0].x + (e->p[1].x - e->p[0].x) * ((y - e->ya) / (e->yb - e->ya));
  }
  double t = solve_t(e, y);
  if (t_out)
    *t_out = t;
  return pp_cubic_point(e->p, t).x;
}

/* ∫ (x − xref) dy over the slab [y0, y1], using the scratch values of the slab.
 * Cubic: ∫ x(t) y'(t) dt is a degree-5 polynomial, integrated exactly. */
static double edge_integral(const edge *e, double y0, double y1, double xref) {
  if (!e->curve)
    return (0.5 * (e->xt + e->xb) - xref) * (y1 - y0);
  const pp_point *p = e->p;
  double x0 = p[0].x;
  /* Power-basis coefficients of x(t) − x0; all are translation invariant. */
  double X[4] = {0, 3 * (p[1].x - x0), 3 * (x0 - 2 * p[1].x + p[2].x),
                 -x0 + 3 * p[1].x - 3 * p[2].x + p[3].x};
  double ay = -p[0].y + 3 * p[1].y - 3 * p[2].y + p[3].y;
  double by = 3 * (p[0].y - 2 * p[1].y + p[2].y);
  double cy = 3 * (p[1].y - p[0].y);
  double Y[3] = {cy, 2 * by, 3 * ay};
  double P[6] = {0};
  for (int i = 0; i < 4; i++)
    for (int j = 0; j < 3; j++)
      P[i + j] += X[i] * Y[j];
  double F1 = 0, F0 = 0;
  for (int k = 5; k >= 0; k--) {
    F1 = (F1 + P[k] / (k + 1)) * e->tb;
    F0 = (F0 + P[k] / (k + 1)) * e->tt;
  }
  return (F1 - F0) + (x0 - xref) * (y1 - y0);
}

static void xrange(edge *e, double lo_y, double hi_y, double *lo, double *hi) {
  if (!e->curve) {
    double a = edge_x(e, lo_y, NULL), b = edge_x(e, hi_y, NULL);
    *lo = fmin(a, b), *hi = fmax(a, b);
    return;
  }
  double t0 = solve_t(e, lo_y), t1 = solve_t(e, hi_y);
  pp_point l[4], q[4];
  bez_split(e->p, t1, l, NULL);
  bez_split(l, t1 > 0 ? t0 / t1 : 0, NULL, q);
  *lo = fmin(fmin(q[0].x, q[1].x), fmin(q[2].x, q[3].x));
  *hi = fmax(fmax(q[0].x, q[1].x), fmax(q[2].x, q[3].x));
}

static int sign_tol(double d, double tol) {
  return d > tol ? 1 : d < -tol ? -1 : 0;
}

typedef struct {
  double *ys;
  size_t n, cap;
} ylist;

static void ylist_push(ylist *l, double y) {
  if (l->n == l->cap) {
    l->cap = l->cap ? 2 * l->cap : 8;
    l->ys = g_renew(double, l->ys, l->cap);
  }
  l->ys[l->n++] = y;
}

typedef struct {
  double y, d;
} sample;

typedef struct {
  sweep *s;
  edge *e, *f;
  GArray *samples; /* of sample */
  int budget;
} search;

static double diff_at(search *q, double y) {
  double d = edge_x(q->f, y, NULL) - edge_x(q->e, y, NULL);
  sample sm = {y, d};
  g_array_append_val(q->samples, sm);
  return d;
}

/* Samples d(y) = x_f(y) − x_e(y) on [a,b] by bisection, pruning sub-intervals where the
 * control hulls of the two sub-pieces are x-disjoint (no root can hide there). */
static void cross_search(search *q, double a, double b, double da, double db, int depth, int cap) {
  sweep *s = q->s;
  if (--q->budget < 0 || b - a <= s->eps_y || depth >= cap)
    return;
  double elo, ehi, flo, fhi;
  xrange(q->e, a, b, &elo, &ehi);
  xrange(q->f, a, b, &flo, &fhi);
  if (ehi < flo - s->tol_x || fhi < elo - s->tol_x)
    return;
  double c = 0.5 * (a + b);
  double dc = diff_at(q, c);
  /* Coincident at three samples: look only a few levels deeper, else overlapping
   * curves would cost 2^depth evaluations for gaps of zero width. */
  if (sign_tol(da, s->tol_x) == 0 && sign_tol(db, s->tol_x) == 0 && sign_tol(dc, s->tol_x) == 0)
    cap = MIN(cap, depth + 6);
  cross_search(q, a, c, da, dc, depth + 1, cap);
  cross_search(q, c, b, dc, db, depth + 1, cap);
}

static int cmp_sample(const void *a, const void *b) {
  double x = ((const sample *)a)->y, y = ((const sample *)b)->y;
  return x < y ? -1 : x > y;
}

static gboolean same_piece(const edge *e, const edge *f, double tol) {
  if (e->curve != f->curve)
    return FALSE;
  int n = e->curve ? 4 : 2;
  for (int i = 0; i < n; i++)
    if (fabs(e->p[i].x - f->p[i].x) > tol || fabs(e->p[i].y - f->p[i].y) > tol)
      return FALSE;
  return TRUE;
}

/* Strict sign changes between consecutive non-zero samples are crossings: refine each
 * by bisection (or cut at the zero sample that separates them). */
static void roots_from_samples(search *q, ylist *out) {
  sweep *s = q->s;
  GArray *sm = q->samples;
  qsort(sm->data, sm->len, sizeof(sample), cmp_sample);
  int last = 0;
  double last_y = 0;
  size_t zero_mid = (size_t)-1, zeros = 0;
  for (size_t i = 0; i < sm->len; i++) {
    sample *p = &g_array_index(sm, sample, i);
    int sg = sign_tol(p->d, s->tol_x);
    if (sg == 0) {
      if (zeros++ == 0)
        zero_mid = i;
      continue;
    }
    if (last != 0 && sg != last) {
      if (zeros > 0) {
        ylist_push(out, g_array_index(sm, sample, zero_mid + zeros / 2).y);
      } else {
        double lo = last_y, hi = p->y;
        for (int it = 0; it < 80 && hi - lo > s->eps_y; it++) {
          double m = 0.5 * (lo + hi);
          double d = edge_x(q->f, m, NULL) - edge_x(q->e, m, NULL);
          if (sign_tol(d, s->tol_x) == last)
            lo = m;
          else if (sign_tol(d, s->tol_x) == 0) {
            lo = hi = m;
          } else
            hi = m;
        }
        ylist_push(out, 0.5 * (lo + hi));
      }
    }
    last = sg, last_y = p->y, zeros = 0;
  }
}

static void find_crossings(sweep *s, edge *e, edge *f, double y0, double y1, ylist *out) {
  double d0 = f->xt - e->xt, d1 = f->xb - e->xb;
  if (!e->curve && !f->curve) {
    if ((d0 < 0 && d1 > 0) || (d0 > 0 && d1 < 0)) {
      double y = y0 + (y1 - y0) * (d0 / (d0 - d1)); /* d is linear in y for two lines */
      if (y > y0 + s->eps_y && y < y1 - s->eps_y)
        ylist_push(out, y);
    }
    return;
  }
  if (same_piece(e, f, s->tol_x))
    return;
  search q = {s, e, f, g_array_new(FALSE, FALSE, sizeof(sample)), CROSS_NODE_BUDGET};
  sample a = {y0, d0}, b = {y1, d1};
  g_array_append_val(q.samples, a);
  g_array_append_val(q.samples, b);
  cross_search(&q, y0, y1, d0, d1, 0, MAX_CROSS_DEPTH);
  size_t before = out->n;
  roots_from_samples(&q, out);
  g_array_free(q.samples, TRUE);
  /* Drop roots that merely touch the slab bounds. */
  size_t k = before;
  for (size_t i = before; i < out->n; i++)
    if (out->ys[i] > y0 + s->eps_y && out->ys[i] < y1 - s->eps_y)
      out->ys[k++] = out->ys[i];
  out->n = k;
}

static gboolean inside(pp_fill_rule rule, int w) {
  return rule == PP_FILL_EVEN_ODD ? (w & 1) != 0 : w != 0;
}

static double integrate_slab(sweep *s, double y0, double y1) {
  double sum = 0;
  guint n_in = 0;
  edge *left = NULL;
  for (size_t i = 0; i < s->n_act; i++) {
    edge *e = s->act[i];
    guint r = e->region;
    gboolean was = inside(s->regs[r].rule, s->wind[r]);
    s->wind[r] += e->dir;
    gboolean now = inside(s->regs[r].rule, s->wind[r]);
    gboolean all_before = n_in == s->n_reg;
    n_in = n_in + now - was;
    gboolean all_after = n_in == s->n_reg;
    if (!all_before && all_after)
      left = e;
    else if (all_before && !all_after && left) {
      /* Pair left and right boundary with a shared reference so huge coordinates cancel early. */
      double xref = left->xm;
      sum += edge_integral(e, y0, y1, xref) - edge_integral(left, y0, y1, xref);
      left = NULL;
    }
  }
  /* Every region is closed, so windings return to zero; reset anyway against rounding in dir sums.
   */
  memset(s->wind, 0, s->n_reg * sizeof(int));
  return sum;
}

static double slab(sweep *s, double y0, double y1, int depth) {
  double ym = 0.5 * (y0 + y1);
  for (size_t i = 0; i < s->n_act; i++) {
    edge *e = s->act[i];
    if (e->curve) {
      e->xt = edge_x(e, y0, &e->tt);
      e->xm = edge_x(e, ym, NULL);
      e->xb = edge_x(e, y1, &e->tb);
    } else {
      /* Inline for lines: this loop is the sweep's hot spot. The slab lies within the
       * edge's y-range, so no clamping is needed (end points are kept exact). */
      e->xt = y0 == e->ya ? e->p[0].x : e->p[0].x + (y0 - e->ya) * e->slope;
      e->xm = e->p[0].x + (ym - e->ya) * e->slope;
      e->xb = y1 == e->yb ? e->p[1].x : e->p[0].x + (y1 - e->ya) * e->slope;
    }
  }
  /* Insertion sort: the order changes little from one slab to the next. */
  for (size_t i = 1; i < s->n_act; i++) {
    edge *e = s->act[i];
    size_t j = i;
    while (j > 0 && s->act[j - 1]->xm > e->xm) {
      s->act[j] = s->act[j - 1];
      j--;
    }
    s->act[j] = e;
  }
  if (depth < MAX_SLAB_DEPTH && y1 - y0 > 2 * s->eps_y) {
    ylist cuts = {0};
    for (size_t i = 0; i + 1 < s->n_act; i++)
      find_crossings(s, s->act[i], s->act[i + 1], y0, y1, &cuts);
    if (cuts.n > 0) {
      qsort(cuts.ys, cuts.n, sizeof(double), pp_compare_doubles);
      double sum = 0, prev = y0;
      for (size_t i = 0; i <= cuts.n; i++) {
        double next = i < cuts.n ? cuts.ys[i] : y1;
        if (next - prev > s->eps_y || i == cuts.n) {
          sum += slab(s, prev, next, depth + 1);
          prev = next;
        }
      }
      g_free(cuts.ys);
      return sum;
    }
    g_free(cuts.ys); /* roots found and then dropped at the slab bounds */
  }
  return integrate_slab(s, y0, y1);
}

static int cmp_edge_ya(const void *a, const void *b) {
  const edge *x = *(edge *const *)a, *y = *(edge *const *)b;
  return x->ya < y->ya ? -1 : x->ya > y->ya;
}

/* Area of the intersection of all regions, each (path, rule). */
double pp_sweep_area(const pp_region *regs, guint n_reg) {
  sweep s = {0};
  s.edges = g_array_new(FALSE, FALSE, sizeof(edge));
  s.regs = regs;
  s.n_reg = n_reg;
  double ylo = -INFINITY, yhi = INFINITY, maxabs = 0;
  pp_rect all = pp_rect_empty();
  for (guint r = 0; r < n_reg; r++) {
    push_path(&s, regs[r].path, r);
    ylo = fmax(ylo, regs[r].box.y0);
    yhi = fmin(yhi, regs[r].box.y1);
    all = pp_rect_union(all, regs[r].box);
  }
  maxabs = fmax(fmax(fabs(all.x0), fabs(all.x1)), fmax(fabs(all.y0), fabs(all.y1)));
  double ext = fmax(pp_rect_width(all), pp_rect_height(all));
  s.eps_y = fmax(1e-12 * ext, 8 * DBL_EPSILON * maxabs);
  s.tol_x = s.eps_y;
  size_t n = s.edges->len;
  double area = 0;
  if (n > 0 && ylo < yhi) {
    edge **order = g_new(edge *, n);
    double *ev = g_new(double, 2 * n);
    for (size_t i = 0; i < n; i++) {
      order[i] = &g_array_index(s.edges, edge, i);
      ev[2 * i] = order[i]->ya;
      ev[2 * i + 1] = order[i]->yb;
    }
    qsort(order, n, sizeof(edge *), cmp_edge_ya);
    qsort(ev, 2 * n, sizeof(double), pp_compare_doubles);
    s.act = g_new(edge *, n);
    s.wind = g_new0(int, n_reg);
    size_t next = 0;
    for (size_t k = 0; k + 1 < 2 * n; k++) {
      double y0 = ev[k], y1 = ev[k + 1];
      if (y1 <= y0)
        continue;
      size_t m = 0;
      for (size_t i = 0; i < s.n_act; i++)
        if (s.act[i]->yb > y0)
          s.act[m++] = s.act[i];
      s.n_act = m;
      while (next < n && order[next]->ya <= y0)
        s.act[s.n_act++] = order[next++];
      if (y1 <= ylo || y0 >= yhi || s.n_act < 2)
        continue; /* outside some region's box: nothing can be inside all of them */
      area += slab(&s, y0, y1, 0);
    }
    g_free(order);
    g_free(ev);
    g_free(s.act);
    g_free(s.wind);
  }
  g_array_free(s.edges, TRUE);
  return area;
}
