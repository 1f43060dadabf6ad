/* sweep_cross.c — where two neighbouring pieces of the area sweep (clip_area.c) next
 * change places: x of a piece at a height (Newton on its y(t)), ∫ x dy in closed form, and
 * the crossing search (bisection pruned by hulls, false position once one root is sure). */
#include "sweep_edges.h"

#include <float.h>
#include <math.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

/* Crossing-search limits: they only bound work on pathological input (coincident
 * curves, tangencies); see docs/geometry.md. */
#define MAX_CROSS_DEPTH 52
#define CROSS_NODE_BUDGET 4000
/* Smallest search interval, as a share of the window, next to a point where the pair
 * touches (a shared end point, the apex of a curve's turn): there the pieces part like
 * √y and hull tests never clear the interval. A second crossing closer than this to a
 * touching point is missed; the sliver's area is below 2⁻¹⁶ of the window times the
 * pieces' separation. Common practice for subdivision floors, no source. */
#define MIN_TOUCH_SHARE (1.0 / 65536)

typedef pp_sweep_edge edge;

/* t in [0,1] with y(t) = y on a monotone piece: safeguarded Newton (bisection fallback). */
static double solve_t(edge *e, double y) {
  if (y <= e->ya)
    return 0;
  if (y >= e->yb)
    return 1;
  double lo = 0, hi = 1, t = e->t_hint;
  if (!(t > 0 && t < 1))
    t = (y - e->ya) / (e->yb - e->ya);
  const double *k = e->ky;
  double target = y - e->ya;
  for (int it = 0; it < 100; it++) {
    double f = ((k[0] * t + k[1]) * t + k[2]) * t - target;
    if (f == 0)
      break;
    if (f < 0)
      lo = t;
    else
      hi = t;
    double d = (3 * k[0] * t + 2 * k[1]) * t + k[2];
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

/* x of a cubic piece at parameter t. */
static double x_of_t(const edge *e, double t) {
  if (t <= 0 || t >= 1)
    return t <= 0 ? e->p[0].x : e->p[3].x;
  return e->p[0].x + ((e->kx[0] * t + e->kx[1]) * t + e->kx[2]) * t;
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
  return x_of_t(e, t);
}

double pp_sweep_edge_x(edge *e, double y) {
  return edge_x(e, y, NULL);
}

/* ∫ (x − xref) dy over [y0, y1] within the edge's y-range.
 * Cubic: ∫ x(t) y'(t) dt is a degree-5 polynomial, integrated exactly. */
double pp_sweep_edge_integral(edge *e, double y0, double y1, double xref) {
  if (!e->curve) {
    double x0 = y0 == e->ya ? e->p[0].x : e->p[0].x + (y0 - e->ya) * e->slope;
    double x1 = y1 == e->yb ? e->p[1].x : e->p[0].x + (y1 - e->ya) * e->slope;
    return (0.5 * (x0 + x1) - xref) * (y1 - y0);
  }
  double t0 = solve_t(e, y0), t1 = solve_t(e, y1);
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
    F1 = (F1 + P[k] / (k + 1)) * t1;
    F0 = (F0 + P[k] / (k + 1)) * t0;
  }
  return (F1 - F0) + (x0 - xref) * (y1 - y0);
}

/* x at y with the parameter stored in *t, starting Newton from *t's current value. */
static double x_at(edge *e, double y, double *t) {
  if (!e->curve)
    return edge_x(e, y, NULL);
  e->t_hint = *t;
  return edge_x(e, y, t);
}

static int sign_tol(double d, double tol) {
  return d > tol ? 1 : d < -tol ? -1 : 0;
}

typedef struct {
  double y, d;
} sample;

/* Samples a search keeps on the stack; most searches take a few. */
#define LOCAL_SAMPLES 64

typedef struct {
  const pp_sweep_tol *s;
  edge *e, *f;
  sample *samples; /* in y order: first in local, on the heap past LOCAL_SAMPLES */
  size_t n_samples, cap_samples;
  sample local[LOCAL_SAMPLES];
  int budget;
  double touch_min;  /* MIN_TOUCH_SHARE of the window */
  gboolean just;     /* the pair has just swapped: negatives before a positive are rounding */
  gboolean seen_pos; /* a positive sample has been added */
  gboolean found;    /* the first change from + to − (or a first negative) is sampled */
  gboolean one_root; /* ... between two samples where d falls strictly (one_crossing) */
} search;

/* One end of a search interval: y, both pieces' x and parameters there, d = x_f − x_e. */
typedef struct {
  double y, d, xe, xf, te, tf;
} node_end;

/* x and parameter of a piece at the end of a search window, from Newton's plain start
 * (the share of the piece's height): a function of (piece, y) alone, so the last one is
 * kept; a swap asks for each of its two pieces at the same y in two neighbour pairs. */
static double x_at_end(edge *e, double y, double *t) {
  if (!e->curve)
    return edge_x(e, y, NULL);
  if (e->end_y == y) {
    *t = e->end_t;
    return x_of_t(e, e->end_t);
  }
  e->t_hint = -1;
  double x = edge_x(e, y, t);
  e->end_y = y, e->end_t = *t;
  return x;
}

static node_end end_at(search *q, double y, double te_guess, double tf_guess) {
  node_end n = {y, 0, 0, 0, te_guess, tf_guess};
  n.xe = x_at(q->e, y, &n.te);
  n.xf = x_at(q->f, y, &n.tf);
  n.d = n.xf - n.xe;
  return n;
}

static void add_sample(search *q, node_end n) {
  sample sm = {n.y, n.d};
  if (q->n_samples == q->cap_samples) {
    q->cap_samples *= 2;
    if (q->samples == q->local)
      q->samples = g_memdup2(q->local, sizeof q->local);
    q->samples = g_renew(sample, q->samples, q->cap_samples);
  }
  q->samples[q->n_samples++] = sm;
  int sg = sign_tol(n.d, q->s->tol_x);
  if (sg > 0)
    q->seen_pos = TRUE;
  else if (sg < 0 && (q->seen_pos || !q->just))
    q->found = TRUE;
}

/* The control points of a piece between two ends: the sub-curve for cubics (children
 * of a search node split it once), the end points for lines. */
typedef struct {
  pp_point q[4];
} sub;

static sub sub_between(edge *e, node_end a, node_end b, gboolean is_f) {
  sub r = {{{0, 0}}};
  if (!e->curve)
    return r;
  double t0 = is_f ? a.tf : a.te, t1 = is_f ? b.tf : b.te;
  pp_point l[4];
  pp_bez_split(e->p, t1, l, NULL);
  pp_bez_split(l, t1 > 0 ? t0 / t1 : 0, NULL, r.q);
  return r;
}

/* Splits a sub-curve between a and b at c into its two halves. */
static void sub_split(edge *e, const sub *p, double ta, double tb, double tc, sub *l, sub *r) {
  if (!e->curve) { /* a line's hull is its chord: nothing to carry */
    *l = *p, *r = *p;
    return;
  }
  double u = tb > ta ? (tc - ta) / (tb - ta) : 0.5;
  pp_bez_split(p->q, u, l->q, r->q);
}

/* x-range of a sub-curve's hull and how far (in x, at equal y) it strays from the chord
 * between the ends: x − chord(y) is affine, so over the hull it peaks at a control point. */
static void hull(const edge *e, const sub *p, double y0, double y1, double x0, double x1,
                 double *lo, double *hi, double *dev) {
  double k = y1 > y0 ? (x1 - x0) / (y1 - y0) : 0, d = 0, mn = x0 < x1 ? x0 : x1,
         mx = x0 < x1 ? x1 : x0;
  for (int i = 0; e->curve && i < 4; i++) {
    double x = p->q[i].x, off = fabs(x - (x0 + k * (p->q[i].y - y0)));
    d = off > d ? off : d;
    mn = x < mn ? x : mn;
    mx = x > mx ? x : mx;
  }
  *lo = mn, *hi = mx, *dev = d;
}

/* Can d change sign on [a,b] from + to −? Not when e's hull lies left of f's (d ≥ 0) or
 * right of it (d < 0 throughout), nor when d stays above the line through d(a) and d(b)
 * less both pieces' strays from their chords. */
static gboolean may_flip(search *q, node_end a, node_end b, const sub *se, const sub *sf) {
  double elo, ehi, edev, flo, fhi, fdev;
  hull(q->e, se, a.y, b.y, a.xe, b.xe, &elo, &ehi, &edev);
  hull(q->f, sf, a.y, b.y, a.xf, b.xf, &flo, &fhi, &fdev);
  double tol = q->s->tol_x;
  return ehi - flo > tol && elo - fhi <= tol && fmin(a.d, b.d) - (edev + fdev) < -tol;
}

/* Range of dx/dy along a piece between two search ends. A cubic's tangent is a positive
 * combination of its hodograph's three control vectors (de Casteljau differences), so with
 * each rising (dy > 0) the slope lies between their slopes. FALSE when one is level. */
static gboolean slope_range(const edge *e, const sub *p, double *lo, double *hi) {
  if (!e->curve) {
    *lo = *hi = e->slope;
    return TRUE;
  }
  *lo = INFINITY, *hi = -INFINITY;
  for (int i = 0; i < 3; i++) {
    double dy = p->q[i + 1].y - p->q[i].y, k = (p->q[i + 1].x - p->q[i].x) / dy;
    if (!(dy > 0) || !isfinite(k))
      return FALSE;
    *lo = fmin(*lo, k), *hi = fmax(*hi, k);
  }
  return TRUE;
}

/* Does d = x_f − x_e fall strictly all along [a,b]? Then it crosses zero at most once, and
 * with d(a) > 0 > d(b) the first flip is that crossing: first_flip() finds it from a and b
 * alone, and bisecting the interval further here would only repeat that work. */
static gboolean one_crossing(search *q, node_end a, node_end b, const sub *se, const sub *sf) {
  double elo, ehi, flo, fhi, tol = q->s->tol_x;
  if (!(sign_tol(a.d, tol) > 0 && sign_tol(b.d, tol) < 0))
    return FALSE;
  return slope_range(q->e, se, &elo, &ehi) && slope_range(q->f, sf, &flo, &fhi) && fhi < elo;
}

/* Samples d(y) on (a,b) by bisection, in y order, pruning sub-intervals where d cannot
 * turn negative, until the first change from + to − is sampled. se and sf are the
 * pieces' sub-curves between a and b. */
static void cross_search(search *q, node_end a, node_end b, const sub *se, const sub *sf, int depth,
                         int cap) {
  const pp_sweep_tol *s = q->s;
  if (q->found || --q->budget < 0 || b.y - a.y <= s->eps_y || depth >= cap ||
      !may_flip(q, a, b, se, sf))
    return;
  if (b.y - a.y < q->touch_min && (sign_tol(a.d, s->tol_x) == 0 || sign_tol(b.d, s->tol_x) == 0))
    return;
  if (one_crossing(q, a, b, se, sf)) {
    q->one_root = TRUE; /* b, sampled next, is the first negative */
    return;
  }
  node_end c = end_at(q, 0.5 * (a.y + b.y), 0.5 * (a.te + b.te), 0.5 * (a.tf + b.tf));
  /* Coincident at three samples: look only a few levels deeper, else overlapping
   * curves would cost 2^depth evaluations for gaps of zero width. */
  if (sign_tol(a.d, s->tol_x) == 0 && sign_tol(b.d, s->tol_x) == 0 && sign_tol(c.d, s->tol_x) == 0)
    cap = MIN(cap, depth + 6);
  sub el, er, fl, fr;
  sub_split(q->e, se, a.te, b.te, c.te, &el, &er);
  sub_split(q->f, sf, a.tf, b.tf, c.tf, &fl, &fr);
  cross_search(q, a, c, &el, &fl, depth + 1, cap);
  if (q->found)
    return;
  add_sample(q, c);
  cross_search(q, c, b, &er, &fr, depth + 1, cap);
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

/* The one root of d = x_r − x_l on [lo, hi] where d falls strictly from dlo > tol to
 * dhi < −tol, to eps_y or to |d| ≤ tol as bisection would give it: false position with the
 * Illinois step (a stuck end's value is halved), which converges superlinearly on such a
 * bracket where bisection needs one step per bit (Dowell & Jarratt 1971, BIT 11). */
static double falling_root(const pp_sweep_tol *s, edge *l, edge *r, double lo, double dlo,
                           double hi, double dhi) {
  int stuck = 0; /* +1: lo kept twice, −1: hi kept twice */
  for (int it = 0; it < 80 && hi - lo > s->eps_y; it++) {
    double m = lo + (hi - lo) * (dlo / (dlo - dhi));
    if (!(m > lo && m < hi))
      m = 0.5 * (lo + hi);
    double dm = edge_x(r, m, NULL) - edge_x(l, m, NULL);
    int sg = sign_tol(dm, s->tol_x);
    if (sg == 0)
      return m;
    if (sg > 0) {
      lo = m, dlo = dm;
      dhi *= stuck < 0 ? 0.5 : 1;
      stuck = stuck < 0 ? stuck - 1 : -1;
    } else {
      hi = m, dhi = dm;
      dlo *= stuck > 0 ? 0.5 : 1;
      stuck = stuck > 0 ? stuck + 1 : 1;
    }
  }
  return 0.5 * (lo + hi);
}

/* First sign change from + to − among the samples, refined by bisection; the first
 * sample's y when the pair starts out of order (unless just swapped). */
static double first_flip(const pp_sweep_tol *s, search *q, edge *l, edge *r, gboolean just) {
  const sample *sm = q->samples; /* in y order */
  double flip = INFINITY, last_pos = NAN, first_neg = NAN;
  for (size_t i = 0; i < q->n_samples; i++) {
    const sample *p = &sm[i];
    int sg = sign_tol(p->d, s->tol_x);
    if (sg > 0) {
      last_pos = p->y;
    } else if (sg < 0 && isnan(last_pos)) {
      if (isnan(first_neg) && i > 0)
        first_neg = p->y;
      if (just)
        continue;
      flip = sm[0].y;
      break;
    } else if (sg < 0 && q->one_root) {
      flip = falling_root(s, l, r, last_pos, sm[i - 1].d, p->y, p->d);
      break;
    } else if (sg < 0) { /* refine between the last positive and this negative sample */
      double lo = last_pos, hi = p->y;
      for (int it = 0; it < 80 && hi - lo > s->eps_y; it++) {
        double m = 0.5 * (lo + hi);
        int sm_ = sign_tol(edge_x(r, m, NULL) - edge_x(l, m, NULL), s->tol_x);
        if (sm_ > 0)
          lo = m;
        else if (sm_ == 0)
          lo = hi = m;
        else
          hi = m;
      }
      flip = 0.5 * (lo + hi);
      break;
    }
  }
  /* Just swapped yet never right of l again: they crossed back, at the latest there. */
  if (just && flip == INFINITY && isnan(last_pos) && !isnan(first_neg))
    flip = first_neg;
  return flip;
}

/* Lines: d is linear in y from d0 at y0 to d1 at y1. */
static double linear_flip(const pp_sweep_tol *s, double d0, double d1, double y0, double y1,
                          gboolean just) {
  if (d1 >= -s->tol_x)
    return INFINITY;
  if (d0 > s->tol_x)
    return y0 + (y1 - y0) * (d0 / (d0 - d1));
  return just ? INFINITY : y0;
}

/* First y ≥ y0 where r passes to the left of l (x_r − x_l < −tol), +∞ if none before
 * either ends. After a swap (just), samples left of the pair's first positive one are
 * rounding at the crossing just handled, not a new one. */
double pp_sweep_next_flip(const pp_sweep_tol *s, edge *l, edge *r, double y0, double y1,
                          gboolean just) {
  if (y1 <= y0 || same_piece(l, r, s->tol_x))
    return INFINITY;
  if (!l->curve && !r->curve) {
    /* Two lines with finite ends: the answer of the linear branch below, without the
     * search set-up. Its hull test adds nothing: when it clears the pair with d0 ≥ −tol,
     * d1 ≥ −tol too (rounded differences of the hulls' ends are monotone), and the linear
     * branch answers +∞ as well. */
    double d0 = edge_x(r, y0, NULL) - edge_x(l, y0, NULL);
    double d1 = edge_x(r, y1, NULL) - edge_x(l, y1, NULL);
    if (isfinite(d0) && isfinite(d1))
      return linear_flip(s, d0, d1, y0, y1, just);
  }
  search q; /* not zeroed: local holds nothing until n_samples says so */
  q.s = s, q.e = l, q.f = r, q.budget = CROSS_NODE_BUDGET;
  q.touch_min = (y1 - y0) * MIN_TOUCH_SHARE;
  q.just = just, q.seen_pos = q.found = q.one_root = FALSE;
  q.samples = q.local, q.n_samples = 0, q.cap_samples = LOCAL_SAMPLES;
  node_end a = {.y = y0}, b = {.y = y1};
  a.xe = x_at_end(l, y0, &a.te), a.xf = x_at_end(r, y0, &a.tf), a.d = a.xf - a.xe;
  b.xe = x_at_end(l, y1, &b.te), b.xf = x_at_end(r, y1, &b.tf), b.d = b.xf - b.xe;
  double flip = INFINITY;
  sub se = sub_between(l, a, b, FALSE), sf = sub_between(r, a, b, TRUE);
  if (!may_flip(&q, a, b, &se, &sf) && a.d >= -s->tol_x) {
    /* r stays right of l (within tol) all along */
  } else if (!l->curve && !r->curve) {
    flip = linear_flip(s, a.d, b.d, y0, y1, just);
  } else {
    add_sample(&q, a);
    cross_search(&q, a, b, &se, &sf, 0, MAX_CROSS_DEPTH);
    add_sample(&q, b);
    flip = first_flip(s, &q, l, r, just);
  }
  if (q.samples != q.local)
    g_free(q.samples);
  return flip;
}
