/* pieces.c — splits a fill into groups of subpaths whose boxes do not overlap, and
 * recognises convex subpaths. A closed subpath winds zero outside its box, so groups
 * fill disjoint regions and their areas add; a convex one fills exactly its signed area. */
#include "internal.h"

#include <math.h>
#include <stdlib.h>

/* Recursion depth of the alternating x/y cuts; past it the remaining subpaths stay one
 * group (still exact, only slower). 64 halvings exhaust any page: common practice, no source. */
#define MAX_CUT_DEPTH 64

typedef struct {
  size_t first, end; /* segments [first, end) */
  pp_point start;    /* the subpath's first point */
  pp_rect box;       /* tight box of the subpath */
} subpath;

/* Subpaths as a fill sees them: each MOVE starts one; a CLOSE returns to its start but
 * later segments still belong to it (clip_area.c's edge builder closes them the same way). */
/* Tight box of segments [first, end): control points would reach far beyond a circle
 * drawn in two half-turns and make neighbours overlap. */
static void finish(const pp_path *path, subpath *sp) {
  pp_path view = {path->segs + sp->first, sp->end - sp->first, 0};
  sp->box = pp_path_bbox(&view);
  if (path->segs[sp->first].kind != PP_SEG_MOVE)
    sp->box = pp_rect_add_point(sp->box, sp->start);
}

static GArray *split_subpaths(const pp_path *path) {
  GArray *subs = g_array_new(FALSE, FALSE, sizeof(subpath));
  subpath cur = {0, 0, {0, 0}, pp_rect_empty()};
  gboolean drawn = FALSE;
  for (size_t i = 0; i < path->n_segs; i++) {
    const pp_seg *s = &path->segs[i];
    if (s->kind == PP_SEG_MOVE) {
      if (drawn) {
        finish(path, &cur);
        g_array_append_val(subs, cur);
      }
      cur = (subpath){i, i, s->pt[0], pp_rect_empty()};
      drawn = FALSE;
    } else {
      drawn = drawn || s->kind != PP_SEG_CLOSE;
    }
    cur.end = i + 1;
  }
  if (drawn) {
    finish(path, &cur);
    g_array_append_val(subs, cur);
  }
  return subs;
}

static int cmp_x0(const void *a, const void *b) {
  const subpath *p = a, *q = b;
  return p->box.x0 < q->box.x0 ? -1 : p->box.x0 > q->box.x0;
}

static int cmp_y0(const void *a, const void *b) {
  const subpath *p = a, *q = b;
  return p->box.y0 < q->box.y0 ? -1 : p->box.y0 > q->box.y0;
}

/* Sorts subs[0..n) along one axis and returns the number of runs whose extents do not
 * overlap (boxes that only touch share no area, so they may be cut apart). */
static size_t runs_along(subpath *subs, size_t n, gboolean along_y, size_t *ends) {
  qsort(subs, n, sizeof(subpath), along_y ? cmp_y0 : cmp_x0);
  size_t runs = 0;
  double reach = -INFINITY;
  for (size_t i = 0; i < n; i++) {
    double lo = along_y ? subs[i].box.y0 : subs[i].box.x0;
    double hi = along_y ? subs[i].box.y1 : subs[i].box.x1;
    if (i > 0 && lo >= reach)
      ends[runs++] = i;
    reach = i == 0 ? hi : fmax(reach, hi);
  }
  ends[runs++] = n;
  return runs;
}

static pp_path *group_path(const pp_path *path, const subpath *subs, size_t n) {
  pp_path *g = pp_path_new();
  for (size_t k = 0; k < n; k++) {
    const subpath *s = &subs[k];
    if (path->segs[s->first].kind != PP_SEG_MOVE)
      pp_path_move_to(g, s->start.x, s->start.y);
    for (size_t i = s->first; i < s->end; i++) {
      const pp_seg *sg = &path->segs[i];
      switch (sg->kind) {
      case PP_SEG_MOVE: pp_path_move_to(g, sg->pt[0].x, sg->pt[0].y); break;
      case PP_SEG_LINE: pp_path_line_to(g, sg->pt[0].x, sg->pt[0].y); break;
      case PP_SEG_CURVE:
        pp_path_curve_to(g, sg->pt[0].x, sg->pt[0].y, sg->pt[1].x, sg->pt[1].y, sg->pt[2].x,
                         sg->pt[2].y);
        break;
      case PP_SEG_CLOSE: pp_path_close(g); break;
      }
    }
  }
  return g;
}

/* Alternating cuts (x, then y, ...) until no cut separates a group: O(n log n) a level. */
static void cut(const pp_path *path, subpath *subs, size_t n, gboolean along_y, int depth,
                gboolean other_failed, GPtrArray *out) {
  if (n == 0)
    return;
  size_t *ends = g_new(size_t, n);
  size_t runs = n > 1 && depth < MAX_CUT_DEPTH ? runs_along(subs, n, along_y, ends) : 1;
  if (runs == 1 && (n == 1 || other_failed || depth >= MAX_CUT_DEPTH)) {
    g_ptr_array_add(out, group_path(path, subs, n));
  } else if (runs == 1) {
    cut(path, subs, n, !along_y, depth + 1, TRUE, out);
  } else {
    size_t from = 0;
    for (size_t r = 0; r < runs; r++) {
      cut(path, subs + from, ends[r] - from, !along_y, depth + 1, FALSE, out);
      from = ends[r];
    }
  }
  g_free(ends);
}

GPtrArray *pp_path_split_disjoint(const pp_path *path) {
  GPtrArray *out = g_ptr_array_new_with_free_func((GDestroyNotify)pp_path_free);
  GArray *subs = split_subpaths(path);
  if (subs->len > 1)
    cut(path, (subpath *)subs->data, subs->len, FALSE, 0, FALSE, out);
  g_array_free(subs, TRUE);
  return out;
}

/* Convex when the closed polygon of every point and control point turns one way only and
 * once around. A line meets each Bézier piece at most as often as its control polygon
 * (variation diminishing property), so every line meets the curve at most twice: the
 * curve is convex and simple, and under either fill rule it fills |signed area|. */
gboolean pp_path_is_convex(const pp_path *path) {
  pp_point pts[64];
  size_t n = 0;
  gboolean moved = FALSE, done = FALSE;
  for (size_t i = 0; i < path->n_segs; i++) {
    const pp_seg *s = &path->segs[i];
    if (s->kind == PP_SEG_MOVE) {
      done = done || n > 1; /* cairo's move after a close draws nothing */
      if (!done)
        n = 0, pts[n++] = s->pt[0], moved = TRUE;
      continue;
    }
    if (done && s->kind != PP_SEG_CLOSE)
      return FALSE; /* a second loop */
    if (!moved)
      return FALSE;
    if (s->kind == PP_SEG_CLOSE) {
      done = TRUE;
      continue;
    }
    int k = s->kind == PP_SEG_CURVE ? 3 : 1;
    for (int j = 0; j < k; j++) {
      if (n > 0 && pts[n - 1].x == s->pt[j].x && pts[n - 1].y == s->pt[j].y)
        continue;
      if (n == G_N_ELEMENTS(pts))
        return FALSE; /* long outlines go to the sweep */
      pts[n++] = s->pt[j];
    }
  }
  while (n > 1 && pts[n - 1].x == pts[0].x && pts[n - 1].y == pts[0].y)
    n--;
  if (n < 3)
    return FALSE;
  int sign = 0;
  double turning = 0;
  for (size_t i = 0; i < n; i++) {
    pp_point a = pts[(i + n - 1) % n], b = pts[i], c = pts[(i + 1) % n];
    double ux = b.x - a.x, uy = b.y - a.y, vx = c.x - b.x, vy = c.y - b.y;
    double cross = ux * vy - uy * vx, dot = ux * vx + uy * vy;
    if (cross == 0 && dot < 0)
      return FALSE; /* turns back on itself */
    int sg = cross > 0 ? 1 : cross < 0 ? -1 : 0;
    if (sg != 0 && sign != 0 && sg != sign)
      return FALSE;
    if (sg != 0)
      sign = sg;
    turning += atan2(cross, dot);
  }
  return sign != 0 && fabs(turning) < 3 * G_PI; /* 2π, not 4π or more */
}
