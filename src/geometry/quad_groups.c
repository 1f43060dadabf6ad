/* quad_groups.c — faces grouped into solids by the edges they share: a uniform grid over the
 * faces' boxes proposes each pair of touching faces once, and a union–find joins the pairs
 * that share an edge (pp_quads_share_edge). */
#include "internal.h"

#include <float.h>
#include <math.h>
#include <stdlib.h>

/* Grid cells per face on average: enough that a cell holds a handful of faces on a dense
 * page, few enough that building the grid stays linear (common practice for bucket grids,
 * no source). */
#define QUAD_GRID_CELLS_PER_FACE 2
/* A face whose widened box spans more cells than this goes to the short list of large
 * faces, compared with every face by box, instead of filling the grid (a backdrop or a
 * frame among thousands of tiles; common practice, no source). */
#define QUAD_GRID_MAX_CELLS_PER_FACE 64

typedef struct {
  double x0, x1, y0, y1; /* the box widened by tol */
  guint index;
} quad_span;

typedef struct {
  double x0, y0, cw, ch;
  guint nx, ny;
} quad_grid;

static guint find_root(guint *parent, guint i) {
  while (parent[i] != i)
    i = parent[i] = parent[parent[i]];
  return i;
}

static gboolean spans_meet(const quad_span *a, const quad_span *b) {
  return a->x0 <= b->x1 && b->x0 <= a->x1 && a->y0 <= b->y1 && b->y0 <= a->y1;
}

static gboolean span_finite(const quad_span *s) {
  return isfinite(s->x0) && isfinite(s->x1) && isfinite(s->y0) && isfinite(s->y1);
}

static guint cell_of(double v, double v0, double size, guint n) {
  double c = floor((v - v0) / size);
  if (!(c > 0))
    return 0;
  return c >= n ? n - 1 : (guint)c;
}

static int cmp_double(const void *a, const void *b) {
  double p = *(const double *)a, q = *(const double *)b;
  return (p > q) - (p < q);
}

/* Cells as large as the median face, so a face sits in about four cells, enlarged until
 * the grid has at most QUAD_GRID_CELLS_PER_FACE cells per face. */
static quad_grid grid_for(const quad_span *span, const guint *fin, guint n_fin) {
  g_autofree double *w = g_new(double, n_fin), *h = g_new(double, n_fin);
  quad_grid g = {INFINITY, INFINITY, 0, 0, 1, 1};
  double x1 = -INFINITY, y1 = -INFINITY;
  for (guint i = 0; i < n_fin; i++) {
    const quad_span *s = &span[fin[i]];
    w[i] = s->x1 - s->x0, h[i] = s->y1 - s->y0;
    g.x0 = fmin(g.x0, s->x0), g.y0 = fmin(g.y0, s->y0);
    x1 = fmax(x1, s->x1), y1 = fmax(y1, s->y1);
  }
  qsort(w, n_fin, sizeof *w, cmp_double);
  qsort(h, n_fin, sizeof *h, cmp_double);
  double width = fmax(x1 - g.x0, DBL_MIN), height = fmax(y1 - g.y0, DBL_MIN);
  g.cw = fmax(w[n_fin / 2], width * 1e-6), g.ch = fmax(h[n_fin / 2], height * 1e-6);
  double cells = (double)n_fin * QUAD_GRID_CELLS_PER_FACE;
  while (ceil(width / g.cw) * ceil(height / g.ch) > cells)
    g.cw *= 2, g.ch *= 2;
  g.nx = (guint)fmax(1, ceil(width / g.cw)), g.ny = (guint)fmax(1, ceil(height / g.ch));
  return g;
}

static void join_if_shared(const pp_quad *quads, const quad_span *a, const quad_span *b, double tol,
                           guint *parent) {
  if (!spans_meet(a, b) || !pp_quads_share_edge(&quads[a->index], &quads[b->index], tol))
    return;
  guint ra = find_root(parent, a->index), rb = find_root(parent, b->index);
  if (ra != rb)
    parent[MAX(ra, rb)] = MIN(ra, rb);
}

/* Two quads that share an edge have boxes that meet once widened by tol, so only faces in
 * a common grid cell are compared: a page of a million tiles costs a few comparisons per
 * tile (issue 12: the x-sorted sweep before compared whole columns of a grid of tiles).
 * A pair is taken only in the cell holding the lower-left corner of its boxes' overlap, so
 * once. Roots are the lowest index of their group, so the grouping does not depend on the
 * order the pairs are met in. */
guint pp_quads_group_by_edges(const pp_quad *quads, guint n, double tol, guint *group) {
  g_autofree guint *parent = g_new(guint, n ? n : 1);
  g_autofree quad_span *span = g_new(quad_span, n ? n : 1);
  g_autofree guint *fin = g_new(guint, n ? n : 1);
  GArray *odd = g_array_new(FALSE, FALSE, sizeof(guint)); /* large or not finite */
  guint n_fin = 0;
  for (guint i = 0; i < n; i++) {
    parent[i] = i;
    quad_span s = {quads[i].p[0].x, quads[i].p[0].x, quads[i].p[0].y, quads[i].p[0].y, i};
    for (int c = 1; c < (quads[i].kind == PP_QUAD_TRIANGLE ? 3 : 4); c++) {
      s.x0 = fmin(s.x0, quads[i].p[c].x), s.x1 = fmax(s.x1, quads[i].p[c].x);
      s.y0 = fmin(s.y0, quads[i].p[c].y), s.y1 = fmax(s.y1, quads[i].p[c].y);
    }
    s.x0 -= tol, s.x1 += tol, s.y0 -= tol, s.y1 += tol;
    span[i] = s;
    if (span_finite(&s))
      fin[n_fin++] = i;
    else
      g_array_append_val(odd, i);
  }
  if (n_fin > 0) {
    quad_grid g = grid_for(span, fin, n_fin);
    /* Count, then place: cell c holds entry[first[c] .. first[c + 1]). */
    g_autofree guint *first = g_new0(guint, (gsize)g.nx * g.ny + 1);
    guint n_grid = 0;
    for (guint i = 0; i < n_fin; i++) {
      const quad_span *s = &span[fin[i]];
      guint cx0 = cell_of(s->x0, g.x0, g.cw, g.nx), cx1 = cell_of(s->x1, g.x0, g.cw, g.nx);
      guint cy0 = cell_of(s->y0, g.y0, g.ch, g.ny), cy1 = cell_of(s->y1, g.y0, g.ch, g.ny);
      if ((guint64)(cx1 - cx0 + 1) * (cy1 - cy0 + 1) > QUAD_GRID_MAX_CELLS_PER_FACE) {
        g_array_append_val(odd, fin[i]);
        continue;
      }
      fin[n_grid++] = fin[i];
      for (guint cy = cy0; cy <= cy1; cy++)
        for (guint cx = cx0; cx <= cx1; cx++)
          first[(gsize)cy * g.nx + cx + 1]++;
    }
    gsize n_cells = (gsize)g.nx * g.ny;
    for (gsize c = 0; c < n_cells; c++)
      first[c + 1] += first[c];
    g_autofree guint *entry = g_new(guint, first[n_cells] ? first[n_cells] : 1);
    g_autofree guint *fill = g_memdup2(first, n_cells * sizeof(guint));
    for (guint i = 0; i < n_grid; i++) {
      const quad_span *s = &span[fin[i]];
      for (guint cy = cell_of(s->y0, g.y0, g.ch, g.ny); cy <= cell_of(s->y1, g.y0, g.ch, g.ny);
           cy++)
        for (guint cx = cell_of(s->x0, g.x0, g.cw, g.nx); cx <= cell_of(s->x1, g.x0, g.cw, g.nx);
             cx++)
          entry[fill[(gsize)cy * g.nx + cx]++] = fin[i];
    }
    for (guint cy = 0; cy < g.ny; cy++)
      for (guint cx = 0; cx < g.nx; cx++) {
        gsize c = (gsize)cy * g.nx + cx;
        for (guint a = first[c]; a < first[c + 1]; a++)
          for (guint b = a + 1; b < first[c + 1]; b++) {
            const quad_span *p = &span[entry[a]], *q = &span[entry[b]];
            if (cell_of(fmax(p->x0, q->x0), g.x0, g.cw, g.nx) == cx &&
                cell_of(fmax(p->y0, q->y0), g.y0, g.ch, g.ny) == cy)
              join_if_shared(quads, p, q, tol, parent);
          }
      }
  }
  /* Large and non-finite faces against every other face (each pair once). */
  g_autofree gboolean *is_odd = g_new0(gboolean, n ? n : 1);
  for (guint k = 0; k < odd->len; k++)
    is_odd[g_array_index(odd, guint, k)] = TRUE;
  for (guint k = 0; k < odd->len; k++) {
    guint o = g_array_index(odd, guint, k);
    for (guint i = 0; i < n; i++)
      if (i != o && (!is_odd[i] || i > o))
        join_if_shared(quads, &span[o], &span[i], tol, parent);
  }
  g_array_free(odd, TRUE);
  /* Number the groups in order of their first face. */
  g_autofree guint *label = g_new(guint, n ? n : 1);
  guint n_groups = 0;
  for (guint i = 0; i < n; i++) {
    guint r = find_root(parent, i);
    if (r == i)
      label[i] = n_groups++;
    group[i] = label[r];
  }
  return n_groups;
}
