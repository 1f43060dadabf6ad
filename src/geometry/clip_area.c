/* clip_area.c — exact area of (path under its fill rule) ∩ every clip region.
 * Sweep over y (Bentley–Ottmann): edges become y-monotone pieces kept in x order; the
 * order changes only at end points and at crossings, found between neighbours only and
 * taken from a heap. Each edge carries a coefficient (+1 right end of an inside run,
 * −1 left end, 0 otherwise) and ∫ c·x dy is accumulated in closed form per edge, only
 * when its coefficient changes: O((n + k) log n) for n pieces and k crossings, plus the
 * moves of the active list's tail in memory at each end-point height. The crossing search
 * itself is in sweep_cross.c. */
#include "internal.h"
#include "sweep_edges.h"

#include <float.h>
#include <math.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

/* Order changes (crossings) one sweep may process before it gives up with NaN: a few
 * seconds of work at the measured ~0.2 µs a crossing of two lines; a fill crossing itself
 * more often draws nothing a reader could measure (issue 12 allows 10 s a page).
 * Measured here, no outside source. */
#define MAX_SWEEP_SWAPS 20000000
/* Of those, crossings where a curve takes part: each costs about 2.5 µs (its neighbour
 * searches solve y(t) = y by Newton), so 2·10⁶ are about 5 s; the fuzzer's fills of
 * ~18,000 swinging cubics with 1.2–1.35·10⁶ true crossings stay under it, and one with
 * more ran for minutes under the line bound alone. Measured here, no outside source. */
#define MAX_CURVE_SWAPS 2000000
/* First search window of a new neighbour pair with a curve, as a share of their common
 * span; it doubles at each re-check. Short windows hold nearly straight sub-curves, which
 * the hull tests clear at once, and most neighbours part (another crossing comes between
 * them) long before their common span ends. Tuned on random curves, no outside source. */
#define FIRST_WINDOW_SHARE (1.0 / 64)

typedef pp_sweep_edge edge;

/* Places in the active list one height changes (pieces ending or starting) that are
 * tracked one by one; past this many, the windings are recounted from the first change to
 * the right end (as many pieces change anyway). Common practice, no source. */
#define MAX_SPOTS 64

/* The crossing heap holds each key beside its edge: comparisons stay in the heap's memory. */
typedef struct {
  double key; /* the edge's cross_y */
  edge *e;
} heap_node;

typedef struct {
  GArray *edges; /* of edge */
  edge **act;
  size_t n_act;
  size_t pos_ok; /* act[i]->pos == i for every i below it */
  heap_node *heap;
  size_t n_heap;
  guint n_reg;
  const pp_region *regs;
  edge *es;     /* the pieces; an active piece e owns the gap right of it: */
  int *gw;      /* its windings per region, n_reg from (e − es)·n_reg */
  guint8 *gin;  /* it is inside every region */
  int *scratch; /* n_reg windings being computed, then n_reg zeros (left of everything) */
  edge **ends;  /* the pieces by their top y, next_end the first still active */
  double *ya;   /* the bottom y of each piece in the order they enter */
  double *yb;   /* the top y of each of ends */
  size_t next_end;
  edge **gone;                 /* the pieces ending at the current height */
  size_t spots[MAX_SPOTS + 1]; /* where windings may change at the current height */
  size_t n_spots;
  pp_sweep_tol tol; /* eps_y and tol_x (sweep_edges.h) */
  double xref;      /* x origin of the integrals, so that far-away scenes keep their digits */
  double area;
  long swaps, curve_swaps;
} sweep;

/* ---- the crossing heap: active edges keyed by cross_y ---- */

static void heap_set(sweep *s, size_t i, heap_node n) {
  s->heap[i] = n;
  n.e->hpos = i;
}

static void heap_up(sweep *s, size_t i) {
  heap_node n = s->heap[i];
  while (i > 0 && n.key < s->heap[(i - 1) / 2].key) {
    heap_set(s, i, s->heap[(i - 1) / 2]);
    i = (i - 1) / 2;
  }
  heap_set(s, i, n);
}

static void heap_down(sweep *s, size_t i) {
  heap_node n = s->heap[i];
  for (;;) {
    size_t c = 2 * i + 1;
    if (c >= s->n_heap)
      break;
    if (c + 1 < s->n_heap && s->heap[c + 1].key < s->heap[c].key)
      c++;
    if (!(s->heap[c].key < n.key))
      break;
    heap_set(s, i, s->heap[c]);
    i = c;
  }
  heap_set(s, i, n);
}

static void heap_remove(sweep *s, edge *e) {
  size_t i = e->hpos;
  heap_node last = s->heap[--s->n_heap];
  if (last.e != e) {
    heap_set(s, i, last);
    heap_up(s, i);
    heap_down(s, last.e->hpos);
  }
}

/* Key of l: its next crossing with its right neighbour r (NULL: none). With a curve the
 * search covers a window only (again: the pair's next, twice as high); when it finds
 * nothing the key is the window's end, marked for a re-check. */
static void set_key(sweep *s, edge *l, edge *r, double y, gboolean just, gboolean again) {
  const double was = l->cross_y;
  l->right = r;
  l->recheck = FALSE;
  l->cross_y = INFINITY;
  if (r) {
    double end = fmin(l->yb, r->yb), y1 = end;
    if (l->curve || r->curve) {
      l->window = again ? 2 * l->window : (end - y) * FIRST_WINDOW_SHARE;
      y1 = fmin(end, y + l->window);
      if (!(y1 > y + s->tol.eps_y))
        y1 = end;
    }
    l->cross_y = pp_sweep_next_flip(&s->tol, l, r, y, y1, just);
    if (l->cross_y == INFINITY && y1 < end)
      l->cross_y = y1, l->recheck = TRUE;
  }
  if (l->cross_y == was)
    return; /* the heap already holds it in place (mostly +∞ staying +∞) */
  s->heap[l->hpos].key = l->cross_y;
  heap_up(s, l->hpos);
  heap_down(s, l->hpos);
}

/* ---- windings and coefficients ---- */

static gboolean inside(pp_fill_rule rule, int w) {
  return rule == PP_FILL_EVEN_ODD ? (w & 1) != 0 : w != 0;
}

static int *wind(const sweep *s, const edge *e) {
  return s->gw + (size_t)(e - s->es) * s->n_reg;
}

static guint8 *gin(const sweep *s, const edge *e) {
  return s->gin + (e - s->es);
}

/* The gap right of act[i] from the gap on its left and act[i]. TRUE when an old piece
 * (old) keeps the windings it had: then every gap on its right keeps them too up to the
 * next place that changed. */
static gboolean gap_update(sweep *s, size_t i, gboolean old) {
  const guint n = s->n_reg;
  edge *e = s->act[i];
  int *w = wind(s, e), *t = s->scratch;
  memcpy(t, i > 0 ? wind(s, s->act[i - 1]) : s->scratch + n, n * sizeof(int));
  t[e->region] += e->dir;
  if (old && memcmp(t, w, n * sizeof(int)) == 0)
    return TRUE;
  memcpy(w, t, n * sizeof(int));
  guint in = 0;
  for (guint r = 0; r < n; r++)
    in += inside(s->regs[r].rule, w[r]);
  *gin(s, e) = in == n;
  return FALSE;
}

static int coef(const sweep *s, size_t i) {
  return (i > 0 ? *gin(s, s->act[i - 1]) : 0) - *gin(s, s->act[i]);
}

/* Accounts ∫ c·(x − xref) dy from y_from up to y. */
static void flush(sweep *s, edge *e, double y) {
  if (e->c != 0 && y > e->y_from)
    s->area += e->c * pp_sweep_edge_integral(e, e->y_from, y, s->xref);
  e->y_from = y;
}

static void set_coef(sweep *s, edge *e, int c, double y) {
  if (c != e->c) {
    flush(s, e, y);
    e->c = c;
  }
}

/* Is a before e in x order just after y (ties at y broken halfway down their common span)? */
static gboolean before(sweep *s, edge *a, edge *e, double y) {
  double xa = pp_sweep_edge_x(a, y), xe = pp_sweep_edge_x(e, y);
  if (fabs(xa - xe) > s->tol.tol_x)
    return xa < xe;
  double h = y + 0.5 * (fmin(a->yb, e->yb) - y);
  return pp_sweep_edge_x(a, h) < pp_sweep_edge_x(e, h);
}

/* Index of e in the active list. Indices below pos_ok hold their edge's pos; a height
 * moves the list's tail, and the tail is renumbered only as far as an index is asked for. */
static size_t pos_of(sweep *s, edge *e) {
  if (e->pos < s->n_act && s->act[e->pos] == e)
    return e->pos;
  size_t i = s->pos_ok;
  for (; s->act[i] != e; i++)
    s->act[i]->pos = i;
  s->pos_ok = i + 1;
  return e->pos = i;
}

static int cmp_edge_pos(const void *a, const void *b) {
  const edge *x = *(edge *const *)a, *y = *(edge *const *)b;
  return x->pos < y->pos ? -1 : x->pos > y->pos;
}

/* Index i of the active list changed (an edge starts there, or the edge left of it
 * ended); an edge starting at `at` moves every spot at or right of it one place on. */
static void spot_add(sweep *s, size_t i, size_t at) {
  if (s->n_spots > MAX_SPOTS)
    return;
  for (size_t k = 0; k < s->n_spots && at != SIZE_MAX; k++)
    if (s->spots[k] >= at)
      s->spots[k]++;
  s->spots[s->n_spots++] = i;
}

/* Edges ending at y leave (in list order), edges starting at y enter in x order. Returns
 * the first index that changed (SIZE_MAX: none); s->spots lists every changed index
 * unless there were more than MAX_SPOTS. */
static size_t vertex_update(sweep *s, double y, edge **order, size_t n, size_t *next) {
  size_t lo = SIZE_MAX, n_gone = 0;
  s->n_spots = 0;
  while (s->next_end < n && s->yb[s->next_end] <= y)
    s->gone[n_gone++] = s->ends[s->next_end++];
  if (n_gone > 0) {
    for (size_t j = 0; j < n_gone; j++)
      pos_of(s, s->gone[j]);
    qsort(s->gone, n_gone, sizeof(edge *), cmp_edge_pos);
    size_t m = lo = s->gone[0]->pos;
    for (size_t j = 0; j < n_gone; j++) {
      edge *e = s->gone[j];
      flush(s, e, e->yb);
      heap_remove(s, e);
      size_t from = e->pos + 1, to = j + 1 < n_gone ? s->gone[j + 1]->pos : s->n_act;
      if (s->n_spots == 0 || s->spots[s->n_spots - 1] != m)
        spot_add(s, m, SIZE_MAX);
      memmove(s->act + m, s->act + from, (to - from) * sizeof(edge *));
      m += to - from;
    }
    s->n_act = m;
  }
  while (*next < n && s->ya[*next] <= y) {
    edge *e = order[(*next)++];
    size_t lo_b = 0, hi_b = s->n_act;
    while (lo_b < hi_b) {
      size_t mid = (lo_b + hi_b) / 2;
      if (before(s, s->act[mid], e, y))
        lo_b = mid + 1;
      else
        hi_b = mid;
    }
    memmove(s->act + lo_b + 1, s->act + lo_b, (s->n_act - lo_b) * sizeof(edge *));
    s->act[lo_b] = e;
    s->n_act++;
    lo = MIN(lo, lo_b);
    spot_add(s, lo_b, lo_b);
    e->c = 0;
    e->y_from = y;
    e->cross_y = INFINITY;
    e->right = NULL;
    e->pos = SIZE_MAX; /* new: no windings of its own yet */
    s->heap[s->n_heap] = (heap_node){e->cross_y, e};
    e->hpos = s->n_heap++;
    heap_up(s, e->hpos);
  }
  return lo;
}

static int cmp_size(const void *a, const void *b) {
  size_t x = *(const size_t *)a, y = *(const size_t *)b;
  return x < y ? -1 : x > y;
}

/* Renews the keys of the edges in [from, to) whose right neighbour changed. */
static void renew_keys(sweep *s, size_t from, size_t to, double y) {
  for (size_t i = from; i < to; i++) {
    edge *r = i + 1 < s->n_act ? s->act[i + 1] : NULL;
    if (s->act[i]->right != r || r == NULL)
      set_key(s, s->act[i], r, y, FALSE, FALSE);
  }
}

/* End points at y: the active list changes (vertex_update), then windings, coefficients
 * and the crossing keys of changed neighbours are renewed. From each changed index the
 * windings are recounted rightwards until an old edge keeps the windings it had: from
 * there to the next change every gap keeps them (same edges, same order). So a height
 * costs its changes and their neighbourhoods, not a pass over the whole list (besides
 * moving the list's tail in memory). */
static void vertex(sweep *s, double y, edge **order, size_t n, size_t *next) {
  size_t lo = vertex_update(s, y, order, n, next);
  if (lo == SIZE_MAX)
    return;
  size_t walk_to[MAX_SPOTS], n_walks = 0;
  if (s->n_spots > MAX_SPOTS) {
    s->spots[0] = lo, s->n_spots = 1;
    for (size_t i = lo; i < s->n_act; i++) {
      gap_update(s, i, FALSE);
      set_coef(s, s->act[i], coef(s, i), y);
      s->act[i]->pos = i;
    }
    walk_to[n_walks++] = s->n_act;
    if (s->pos_ok >= lo)
      s->pos_ok = s->n_act;
  } else {
    qsort(s->spots, s->n_spots, sizeof(size_t), cmp_size);
    size_t done = 0, k = 0;
    for (size_t j = 0; j < s->n_spots; j++) {
      size_t i = s->spots[j];
      if (j > 0 && i < done)
        continue;
      for (; i < s->n_act; i++) {
        edge *e = s->act[i];
        gboolean same = gap_update(s, i, e->pos != SIZE_MAX);
        set_coef(s, e, coef(s, i), y);
        e->pos = i; /* right, and no longer new */
        if (same)
          break;
      }
      s->spots[k] = s->spots[j];
      walk_to[k++] = done = MIN(i + 1, s->n_act);
    }
    s->n_spots = n_walks = k;
  }
  /* Right neighbours changed only next to the walks: from the edge left of each start to
   * the edge right of its end (the same calls, in the same order, as one pass would make). */
  size_t keyed = 0;
  for (size_t k = 0; k < n_walks; k++) {
    size_t from = s->spots[k] > 0 ? s->spots[k] - 1 : 0, to = MIN(walk_to[k] + 1, s->n_act);
    renew_keys(s, MAX(from, keyed), to, y);
    keyed = MAX(keyed, to);
  }
  s->pos_ok = MIN(s->pos_ok, lo);
}

/* The heap's first crossing: the edge a and its right neighbour b change places. The gap
 * right of both keeps its windings, now a's; b's gap is recounted. */
static void swap(sweep *s) {
  edge *a = s->heap[0].e;
  double y = a->cross_y;
  size_t i = pos_of(s, a);
  edge *b = s->act[i + 1];
  flush(s, a, y);
  flush(s, b, y);
  s->act[i] = b, s->act[i + 1] = a;
  b->pos = i, a->pos = i + 1;
  memcpy(wind(s, a), wind(s, b), s->n_reg * sizeof(int));
  *gin(s, a) = *gin(s, b);
  gap_update(s, i, FALSE);
  b->c = coef(s, i);
  a->c = coef(s, i + 1);
  if (i > 0)
    set_key(s, s->act[i - 1], b, y, FALSE, FALSE);
  set_key(s, b, a, y, TRUE, FALSE);
  set_key(s, a, i + 2 < s->n_act ? s->act[i + 2] : NULL, y, FALSE, FALSE);
}

/* Area of the intersection of all regions, each (path, rule); NaN past max_curve_swaps
 * crossings that involve a curve (or MAX_SWEEP_SWAPS in all). */
double pp_sweep_area_bounded(const pp_region *regs, guint n_reg, long max_curve_swaps) {
  sweep s = {0};
  s.edges = g_array_new(FALSE, FALSE, sizeof(edge));
  s.regs = regs;
  s.n_reg = n_reg;
  double ylo = -INFINITY, yhi = INFINITY;
  pp_rect all = pp_rect_empty();
  for (guint r = 0; r < n_reg; r++) {
    pp_sweep_edges_add_path(s.edges, regs[r].path, r);
    ylo = fmax(ylo, regs[r].box.y0);
    yhi = fmin(yhi, regs[r].box.y1);
    all = pp_rect_union(all, regs[r].box);
  }
  double maxabs = fmax(fmax(fabs(all.x0), fabs(all.x1)), fmax(fabs(all.y0), fabs(all.y1)));
  double ext = fmax(pp_rect_width(all), pp_rect_height(all));
  s.tol.eps_y = fmax(1e-12 * ext, 8 * DBL_EPSILON * maxabs);
  s.tol.tol_x = s.tol.eps_y;
  s.xref = 0.5 * (all.x0 + all.x1);
  /* Only pieces that reach the band every region shares can bound an inside run. */
  size_t n = 0;
  edge *es = (edge *)s.edges->data;
  for (size_t i = 0; i < s.edges->len; i++)
    if (es[i].yb > ylo && es[i].ya < yhi) {
      if (n != i)
        es[n] = es[i];
      n++;
    }
  if (n > 0 && ylo < yhi) {
    edge **order = g_new(edge *, n);
    for (size_t i = 0; i < n; i++)
      order[i] = &es[i];
    s.ya = g_new(double, n);
    s.yb = g_new(double, n);
    pp_sweep_edges_sort(order, s.ya, n, FALSE);
    s.ends = g_new(edge *, n);
    memcpy(s.ends, order, n * sizeof(edge *));
    pp_sweep_edges_sort(s.ends, s.yb, n, TRUE);
    /* Every end-point height in order: the bottoms and tops merged. */
    double *ev = g_new(double, 2 * n);
    for (size_t i = 0, j = 0, k = 0; k < 2 * n; k++)
      ev[k] = j >= n || (i < n && s.ya[i] <= s.yb[j]) ? s.ya[i++] : s.yb[j++];
    s.act = g_new(edge *, n);
    s.heap = g_new(heap_node, n);
    s.es = es;
    s.gw = g_new(int, n *n_reg);
    s.gin = g_new(guint8, n);
    s.scratch = g_new0(int, 2 * n_reg);
    s.gone = g_new(edge *, n);
    size_t next = 0;
    for (size_t k = 0; k < 2 * n; k++) {
      if (k > 0 && ev[k] == ev[k - 1])
        continue;
      while (s.n_heap > 0 && s.heap[0].key < ev[k]) {
        edge *top = s.heap[0].e;
        if (top->recheck) {
          set_key(&s, top, top->right, top->cross_y, FALSE, TRUE);
          continue;
        }
        gboolean curve = top->curve || top->right->curve;
        if (++s.swaps > MAX_SWEEP_SWAPS || (curve && ++s.curve_swaps > max_curve_swaps)) {
          s.area = NAN;
          break;
        }
        swap(&s);
      }
      if (isnan(s.area))
        break;
      vertex(&s, ev[k], order, n, &next);
    }
    g_free(order);
    g_free(ev);
    g_free(s.act);
    g_free(s.heap);
    g_free(s.gw);
    g_free(s.gin);
    g_free(s.scratch);
    g_free(s.ends);
    g_free(s.ya);
    g_free(s.yb);
    g_free(s.gone);
  }
  g_array_free(s.edges, TRUE);
  return s.area;
}

double pp_sweep_area(const pp_region *regs, guint n_reg) {
  return pp_sweep_area_bounded(regs, n_reg, MAX_CURVE_SWAPS);
}
