/* box_view.c — the view of a 3D chart's box drawn in perspective (mplot3d's default): the
 * projective map from the box's unit cube to the page, found from the floor and the two
 * back walls, and the value scale read from the tick marks on one of its vertical edges. */
#include <math.h>
#include <string.h>

#include "internal.h"

/* Corners of panes that meet agree within this, pt: one projected point written for each
 * (producers' rounding; common practice, no source). */
#define PP_VIEW_CORNER_TOL 0.5
/* The seven corners must be reproduced by the fitted map within this, pt: a box seen by a
 * pinhole camera is exactly projective (textbook projective geometry); the slack is
 * rounding (common practice, no source). */
#define PP_VIEW_FIT_TOL 0.5
/* A tick mark is a short stroke, pt (tick lengths of plotting software are 2 to 8 pt;
 * common practice, no source). */
#define PP_VIEW_TICK_MAX 12.0
/* A tick label stands within this many label heights of its tick mark (common practice,
 * no source). */
#define PP_VIEW_LABEL_REACH 3.0
/* A tick crosses its edge no further beyond the edge's ends than this share of it
 * (rounding; common practice, no source). */
#define PP_VIEW_EDGE_SLACK 0.002
/* Fewest ticks for a scale (two fix a line; a third checks it; common practice). */
#define PP_VIEW_MIN_TICKS 3
/* The printed values must follow the box's height linearly within this share of their
 * range: data to box is affine in every 3D plotting program (textbook). */
#define PP_VIEW_SCALE_TOL 0.005

static void apply(const double p[3][4], double x, double y, double z, double *h) {
  for (int r = 0; r < 3; r++)
    h[r] = p[r][0] * x + p[r][1] * y + p[r][2] * z + p[r][3];
}

pp_point pp_box_view_project(const pp_box_view *v, double x, double y, double z) {
  double h[3];
  apply(v->p, x, y, z, h);
  return (pp_point){h[0] / h[2], h[1] / h[2]};
}

/* Solves the n×n system a·x = b in place (Gaussian elimination, partial pivoting). */
static gboolean solve(double *a, double *b, int n) {
  for (int c = 0; c < n; c++) {
    int piv = c;
    for (int r = c + 1; r < n; r++)
      if (fabs(a[r * n + c]) > fabs(a[piv * n + c]))
        piv = r;
    if (!(fabs(a[piv * n + c]) > 1e-12))
      return FALSE;
    for (int k = 0; k < n; k++) {
      double t = a[c * n + k];
      a[c * n + k] = a[piv * n + k], a[piv * n + k] = t;
    }
    double t = b[c];
    b[c] = b[piv], b[piv] = t;
    for (int r = c + 1; r < n; r++) {
      double f = a[r * n + c] / a[c * n + c];
      for (int k = c; k < n; k++)
        a[r * n + k] -= f * a[c * n + k];
      b[r] -= f * b[c];
    }
  }
  for (int c = n - 1; c >= 0; c--) {
    for (int k = c + 1; k < n; k++)
      b[c] -= a[c * n + k] * b[k];
    b[c] /= a[c * n + c];
  }
  return TRUE;
}

/* The direct linear transform (Hartley & Zisserman, ch. 7; from memory): the 3×4 map with
 * p[2][3] = 1 that best carries the cube points to the page points, least squares over the
 * linearised equations, page points centred and scaled first for conditioning. */
static gboolean dlt(const double (*cube)[3], const pp_point *page, int n, double p[3][4]) {
  double cx = 0, cy = 0, s = 0;
  for (int i = 0; i < n; i++)
    cx += page[i].x / n, cy += page[i].y / n;
  for (int i = 0; i < n; i++)
    s += hypot(page[i].x - cx, page[i].y - cy) / n;
  if (!(s > 0))
    return FALSE;
  double ata[11 * 11] = {0}, atb[11] = {0};
  for (int i = 0; i < n; i++) {
    double u = (page[i].x - cx) / s, w = (page[i].y - cy) / s;
    const double *X = cube[i];
    double rows[2][11] = {{X[0], X[1], X[2], 1, 0, 0, 0, 0, -u * X[0], -u * X[1], -u * X[2]},
                          {0, 0, 0, 0, X[0], X[1], X[2], 1, -w * X[0], -w * X[1], -w * X[2]}};
    double rhs[2] = {u, w};
    for (int k = 0; k < 2; k++)
      for (int a = 0; a < 11; a++) {
        atb[a] += rows[k][a] * rhs[k];
        for (int b = 0; b < 11; b++)
          ata[a * 11 + b] += rows[k][a] * rows[k][b];
      }
  }
  if (!solve(ata, atb, 11))
    return FALSE;
  double q[3][4] = {{atb[0], atb[1], atb[2], atb[3]},
                    {atb[4], atb[5], atb[6], atb[7]},
                    {atb[8], atb[9], atb[10], 1}};
  for (int c = 0; c < 4; c++) { /* undo the normalisation: page = s·norm + centre */
    p[0][c] = s * q[0][c] + cx * q[2][c];
    p[1][c] = s * q[1][c] + cy * q[2][c];
    p[2][c] = q[2][c];
  }
  return TRUE;
}

static gboolean same_point(pp_point a, pp_point b) {
  return fabs(a.x - b.x) <= PP_VIEW_CORNER_TOL && fabs(a.y - b.y) <= PP_VIEW_CORNER_TOL;
}

static int corner_of(const pp_quad *q, pp_point p) {
  for (int k = 0; k < 4; k++)
    if (same_point(q->p[k], p))
      return k;
  return -1;
}

/* Bit k set when corner k of a is a corner of b. */
static guint8 corners_shared(const pp_quad *a, const pp_quad *b) {
  guint8 bits = 0;
  for (int k = 0; k < 4; k++)
    if (corner_of(b, a->p[k]) >= 0)
      bits |= (guint8)(1u << k);
  return bits;
}

/* Three panes meeting at one corner O, each pair along an edge: the floor and two walls.
 * The edge from O that rises most steeply on the page is the vertical. */
static gboolean fit_panes(const pp_quad *a, const pp_quad *b, const pp_quad *c, pp_box_view *v) {
  const pp_quad *q[3] = {a, b, c};
  for (int k = 0; k < 4; k++) {
    pp_point o = a->p[k];
    int at[3] = {k, corner_of(b, o), corner_of(c, o)};
    if (at[1] < 0 || at[2] < 0)
      continue;
    /* each pane's two neighbours of O; the three distinct ones are the edges' ends */
    pp_point ends[3];
    int n_ends = 0;
    gboolean ok = TRUE;
    for (int i = 0; i < 3 && ok; i++)
      for (int d = 1; d <= 3 && ok; d += 2) {
        pp_point e = q[i]->p[(at[i] + d) % 4];
        int seen = -1;
        for (int j = 0; j < n_ends; j++)
          if (same_point(ends[j], e))
            seen = j;
        if (seen < 0) {
          if (n_ends == 3)
            ok = FALSE;
          else
            ends[n_ends++] = e;
        }
      }
    if (!ok || n_ends != 3)
      continue;
    int up = -1;
    double steep = 0;
    for (int j = 0; j < 3; j++) {
      double dx = ends[j].x - o.x, dy = o.y - ends[j].y; /* page y grows downwards */
      double s = dy / hypot(dx, dy);
      if (dy > 0 && s > steep)
        steep = s, up = j;
    }
    if (up < 0)
      continue;
    int ex = up == 0 ? 1 : 0, ey = up == 2 ? 1 : 2;
    double cube[7][3] = {{0, 0, 0}, {1, 0, 0}, {0, 1, 0}, {0, 0, 1},
                         {1, 1, 0}, {1, 0, 1}, {0, 1, 1}};
    pp_point page[7] = {o, ends[ex], ends[ey], ends[up]};
    /* the far corner of the pane holding each pair of edges */
    int pairs[3][2] = {{ex, ey}, {ex, up}, {ey, up}};
    for (int pi = 0; pi < 3 && ok; pi++) {
      ok = FALSE;
      for (int i = 0; i < 3 && !ok; i++)
        if (corner_of(q[i], ends[pairs[pi][0]]) >= 0 && corner_of(q[i], ends[pairs[pi][1]]) >= 0) {
          page[4 + pi] = q[i]->p[(at[i] + 2) % 4];
          ok = TRUE;
        }
    }
    if (!ok || !dlt((const double(*)[3])cube, page, 7, v->p))
      continue;
    double worst = 0;
    for (int i = 0; i < 7; i++) {
      pp_point r = pp_box_view_project(v, cube[i][0], cube[i][1], cube[i][2]);
      worst = fmax(worst, hypot(r.x - page[i].x, r.y - page[i].y));
    }
    if (worst <= PP_VIEW_FIT_TOL) {
      double wlo = INFINITY, whi = 0;
      for (int c = 0; c < 8; c++) {
        double h[3];
        apply(v->p, c & 1, (c >> 1) & 1, c >> 2, h);
        wlo = fmin(wlo, fabs(h[2])), whi = fmax(whi, fabs(h[2]));
      }
      v->depth_ratio = whi / wlo;
      v->frame = pp_rect_empty();
      for (int i = 0; i < 3; i++)
        for (int j = 0; j < 4; j++)
          v->frame = pp_rect_union(
              v->frame, (pp_rect){q[i]->p[j].x, q[i]->p[j].y, q[i]->p[j].x, q[i]->p[j].y});
      return TRUE;
    }
  }
  return FALSE;
}

static gboolean pp_box_view_read_scale(const pp_recognize_ctx *ctx, pp_box_view *v);

/* Pane candidates: the largest quads only (the floor and walls are among a 3D chart's
 * largest faces; bounds the triples tried; common practice, no source). */
#define PP_VIEW_MAX_CANDIDATES 40

static int by_area_desc(gconstpointer a, gconstpointer b, gpointer data) {
  const pp_quad *q = data;
  double x = q[*(const guint *)a].area, y = q[*(const guint *)b].area;
  return (x < y) - (x > y);
}

gboolean pp_box_view_find(const pp_recognize_ctx *ctx, const pp_quad *quads, guint n,
                          pp_box_view *v) {
  g_autofree guint *order = g_new(guint, MAX(n, 1));
  for (guint i = 0; i < n; i++)
    order[i] = i;
  g_qsort_with_data(order, (gint)n, sizeof(guint), by_area_desc, (gpointer)quads);
  guint m = MIN(n, PP_VIEW_MAX_CANDIDATES);
  /* fit_panes needs a corner of the first pane that the other two share, so a triple
   * whose pairs share no such corner is skipped without trying it (the same answer). */
  guint8 shared[PP_VIEW_MAX_CANDIDATES][PP_VIEW_MAX_CANDIDATES];
  for (guint i = 0; i < m; i++)
    for (guint j = i + 1; j < m; j++)
      shared[i][j] = corners_shared(&quads[order[i]], &quads[order[j]]);
  for (guint i = 0; i < m; i++)
    for (guint j = i + 1; j < m; j++)
      for (guint k = j + 1; k < m; k++) {
        if (!(shared[i][j] & shared[i][k]))
          continue;
        memset(v, 0, sizeof *v);
        if (!fit_panes(&quads[order[i]], &quads[order[j]], &quads[order[k]], v))
          continue;
        v->panes[0] = order[i], v->panes[1] = order[j], v->panes[2] = order[k];
        if (pp_box_view_read_scale(ctx, v))
          return TRUE;
      }
  memset(v, 0, sizeof *v);
  return FALSE;
}

/* The point of plane Z = z whose image is the page point: the plane's own 3×3 map inverted. */
gboolean pp_box_view_on_plane(const pp_box_view *v, pp_point page, double z, double *x, double *y) {
  /* (u,w) ~ H (X,Y,1): columns 0, 1 and (2·z + 3) of p; solve u·h2 = h0, w·h2 = h1 */
  double a[4], b[2];
  for (int r = 0; r < 2; r++) {
    double t = r == 0 ? page.x : page.y;
    a[r * 2 + 0] = v->p[r][0] - t * v->p[2][0];
    a[r * 2 + 1] = v->p[r][1] - t * v->p[2][1];
    b[r] = t * (v->p[2][2] * z + v->p[2][3]) - (v->p[r][2] * z + v->p[r][3]);
  }
  if (!solve(a, b, 2))
    return FALSE;
  *x = b[0], *y = b[1];
  return TRUE;
}

/* The height Z on the vertical line (x, y) whose image lies nearest the page point: the
 * image of the line is (a + Z·d) / (aw + Z·dw); least squares over both coordinates. */
double pp_box_view_height(const pp_box_view *v, double x, double y, pp_point page) {
  double num = 0, den = 0;
  for (int r = 0; r < 2; r++) {
    double t = r == 0 ? page.x : page.y;
    double a = v->p[r][0] * x + v->p[r][1] * y + v->p[r][3];
    double aw = v->p[2][0] * x + v->p[2][1] * y + v->p[2][3];
    /* t·(aw + Z·dw) = a + Z·d  →  Z·(t·dw − d) = a − t·aw */
    double k = t * v->p[2][2] - v->p[r][2], m = a - t * aw;
    num += k * m, den += k * k;
  }
  return den > 0 ? num / den : NAN;
}

typedef struct {
  pp_point at;  /* where the tick crosses the edge */
  pp_point mid; /* the stroke's middle */
  double z;
  int label; /* index into ctx->labels, −1 none */
  double gap;
} tick;

/* Ticks crossing the vertical edge (ex, ey) of the cube. */
static GArray *edge_ticks(const pp_recognize_ctx *ctx, const pp_box_view *v, double ex, double ey) {
  GArray *out = g_array_new(FALSE, FALSE, sizeof(tick));
  pp_point e0 = pp_box_view_project(v, ex, ey, 0), e1 = pp_box_view_project(v, ex, ey, 1);
  const pp_scene *scene = ctx->scene;
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    if (m->kind != PP_MARK_STROKE || m->path->n_segs != 2 || !pp_claims_mark_free(ctx->claims, i))
      continue;
    pp_point s0 = m->path->segs[0].pt[0], s1 = m->path->segs[1].pt[0];
    double len = hypot(s1.x - s0.x, s1.y - s0.y);
    if (m->path->segs[1].kind != PP_SEG_LINE || !(len > 0) || len > PP_VIEW_TICK_MAX)
      continue;
    /* s0 + t(s1 − s0) = e0 + u(e1 − e0) */
    double dx = s1.x - s0.x, dy = s1.y - s0.y, fx = e1.x - e0.x, fy = e1.y - e0.y;
    double det = dx * -fy - dy * -fx;
    if (fabs(det) < 1e-9 * len * hypot(fx, fy) + 1e-12)
      continue;
    double rx = e0.x - s0.x, ry = e0.y - s0.y;
    double t = (rx * -fy - ry * -fx) / det, u = (dx * ry - dy * rx) / det;
    /* on the stroke, and on the edge between the floor and the top of the walls */
    if (t < -0.05 || t > 1.05 || u < -PP_VIEW_EDGE_SLACK || u > 1 + PP_VIEW_EDGE_SLACK)
      continue;
    tick tk = {.at = {s0.x + t * dx, s0.y + t * dy},
               .mid = {(s0.x + s1.x) / 2, (s0.y + s1.y) / 2},
               .label = -1,
               .gap = INFINITY};
    tk.z = pp_box_view_height(v, ex, ey, tk.at);
    g_array_append_val(out, tk);
  }
  return out;
}

/* Each free numeric label goes to its nearest tick mark within reach, one label a tick. */
static guint match_labels(const pp_recognize_ctx *ctx, GArray *ticks) {
  guint n = 0;
  for (guint round = 0; round < ticks->len; round++) {
    int best_t = -1, best_l = -1;
    double best = INFINITY;
    for (guint i = 0; i < ctx->labels->len; i++) {
      const pp_label *l = g_ptr_array_index(ctx->labels, i);
      if (!pp_claims_label_free(ctx->claims, l->index))
        continue;
      gboolean used = FALSE;
      for (guint k = 0; k < ticks->len && !used; k++)
        used = g_array_index(ticks, tick, k).label == (int)i;
      if (used)
        continue;
      double reach = PP_VIEW_LABEL_REACH * (l->box.y1 - l->box.y0);
      for (guint k = 0; k < ticks->len; k++) {
        const tick *tk = &g_array_index(ticks, tick, k);
        double d = hypot(l->centre.x - tk->mid.x, l->centre.y - tk->mid.y);
        if (tk->label < 0 && d <= reach && d < best)
          best = d, best_t = (int)k, best_l = (int)i;
      }
    }
    if (best_t < 0)
      break;
    g_array_index(ticks, tick, best_t).label = best_l;
    g_array_index(ticks, tick, best_t).gap = best;
    n++;
  }
  return n;
}

/* value = offset + slope·z by least squares over the labelled ticks; FALSE unless every
 * tick lies on the line within PP_VIEW_SCALE_TOL of the range, after dropping at most
 * one. */
static gboolean fit_scale(const pp_recognize_ctx *ctx, GArray *ticks, pp_box_view *v,
                          gboolean allow_drop) {
  double sz = 0, sv = 0, szz = 0, szv = 0, lo = INFINITY, hi = -INFINITY;
  guint n = 0;
  for (guint k = 0; k < ticks->len; k++) {
    const tick *tk = &g_array_index(ticks, tick, k);
    if (tk->label < 0)
      continue;
    double val = ((const pp_label *)g_ptr_array_index(ctx->labels, tk->label))->number.value;
    sz += tk->z, sv += val, szz += tk->z * tk->z, szv += tk->z * val, n++;
    lo = fmin(lo, val), hi = fmax(hi, val);
  }
  double den = n * szz - sz * sz;
  if (n < PP_VIEW_MIN_TICKS || !(den > 0) || !(hi > lo))
    return FALSE;
  v->slope = (n * szv - sz * sv) / den;
  v->offset = (sv - v->slope * sz) / n;
  double worst = 0;
  guint worst_k = 0;
  for (guint k = 0; k < ticks->len; k++) {
    tick *tk = &g_array_index(ticks, tick, k);
    if (tk->label < 0)
      continue;
    double val = ((const pp_label *)g_ptr_array_index(ctx->labels, tk->label))->number.value;
    double off = fabs(v->offset + v->slope * tk->z - val);
    if (off > worst)
      worst = off, worst_k = k;
  }
  if (worst > PP_VIEW_SCALE_TOL * (hi - lo)) {
    /* one label taken from a neighbouring axis (a corner's tick): drop it, fit again */
    if (!allow_drop)
      return FALSE;
    g_array_index(ticks, tick, worst_k).label = -1;
    return fit_scale(ctx, ticks, v, FALSE);
  }
  v->tick_lo = lo, v->tick_hi = hi, v->n_ticks = n;
  return v->slope > 0;
}

static gboolean pp_box_view_read_scale(const pp_recognize_ctx *ctx, pp_box_view *v) {
  g_autoptr(GArray) best = NULL;
  pp_box_view fitted = *v;
  for (int e = 0; e < 4; e++) {
    GArray *ticks = edge_ticks(ctx, v, e & 1, e >> 1);
    pp_box_view tried = *v;
    guint nl = match_labels(ctx, ticks);
    if (nl >= PP_VIEW_MIN_TICKS && fit_scale(ctx, ticks, &tried, TRUE) &&
        (!best || tried.n_ticks > fitted.n_ticks)) {
      if (best)
        g_array_unref(best);
      best = ticks, fitted = tried;
    } else
      g_array_unref(ticks);
  }
  if (!best)
    return FALSE;
  *v = fitted;
  v->labels = g_array_new(FALSE, FALSE, sizeof(guint));
  v->tick_pos = g_array_new(FALSE, FALSE, sizeof(pp_point));
  for (guint k = 0; k < best->len; k++) {
    const tick *tk = &g_array_index(best, tick, k);
    if (tk->label < 0)
      continue;
    guint li = (guint)tk->label;
    g_array_append_val(v->labels, li);
    g_array_append_val(v->tick_pos, tk->at);
  }
  return TRUE;
}

void pp_box_view_clear(pp_box_view *v) {
  g_clear_pointer(&v->labels, g_array_unref);
  g_clear_pointer(&v->tick_pos, g_array_unref);
}
