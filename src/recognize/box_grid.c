/* box_grid.c — a uniform bucket grid over a fixed set of boxes, so that recognizers ask
 * "which boxes may touch this region" in time proportional to the answer instead of
 * scanning every mark or label on the page (dense scatters hold 10^5–10^6 of them). */
#include <math.h>
#include <string.h>

#include "internal.h"

/* An item spanning more cells than this is kept in one list every query returns, so one
 * page-wide box does not fill every cell (common practice, no source). */
#define PP_GRID_MAX_SPAN 64

struct pp_box_grid {
  pp_rect extent;
  guint cols, rows;
  double cw, ch;
  guint *start; /* cols*rows+1 offsets into ids (compressed rows) */
  guint *ids;
  GArray *wide; /* guint: items over PP_GRID_MAX_SPAN cells */
  guint *stamp; /* per item: the query that last returned it */
  guint n, query;
  GArray *empty; /* guint: items whose box is empty, for pp_box_grid_query_inside */
};

static guint clamp_cell(double v, double lo, double size, guint count) {
  double c = floor((v - lo) / size);
  if (!(c >= 0))
    return 0;
  return c >= count ? count - 1 : (guint)c;
}

static void cells_of(const pp_box_grid *g, pp_rect r, guint *c0, guint *c1, guint *r0, guint *r1) {
  *c0 = clamp_cell(r.x0, g->extent.x0, g->cw, g->cols);
  *c1 = clamp_cell(r.x1, g->extent.x0, g->cw, g->cols);
  *r0 = clamp_cell(r.y0, g->extent.y0, g->ch, g->rows);
  *r1 = clamp_cell(r.y1, g->extent.y0, g->ch, g->rows);
}

static gboolean is_wide(guint c0, guint c1, guint r0, guint r1) {
  return (guint64)(c1 - c0 + 1) * (r1 - r0 + 1) > PP_GRID_MAX_SPAN;
}

pp_box_grid *pp_box_grid_new(const pp_rect *boxes, guint n) {
  pp_box_grid *g = g_new0(pp_box_grid, 1);
  g->n = n;
  g->extent = pp_rect_empty();
  for (guint i = 0; i < n; i++)
    if (!pp_rect_is_empty(boxes[i]))
      g->extent = pp_rect_union(g->extent, boxes[i]);
  if (pp_rect_is_empty(g->extent))
    g->extent = (pp_rect){0, 0, 1, 1};
  /* about one cell per item, square cells */
  double w = fmax(pp_rect_width(g->extent), 1e-6), h = fmax(pp_rect_height(g->extent), 1e-6);
  double side = sqrt(w * h / MAX(n, 1));
  g->cols = (guint)CLAMP(ceil(w / side), 1, 4096);
  g->rows = (guint)CLAMP(ceil(h / side), 1, 4096);
  g->cw = w / g->cols, g->ch = h / g->rows;
  g->wide = g_array_new(FALSE, FALSE, sizeof(guint));
  g->empty = g_array_new(FALSE, FALSE, sizeof(guint));
  for (guint i = 0; i < n; i++)
    if (pp_rect_is_empty(boxes[i]))
      g_array_append_val(g->empty, i);
  g->stamp = g_new0(guint, MAX(n, 1));
  guint n_cells = g->cols * g->rows;
  g->start = g_new0(guint, n_cells + 1);
  guint c0, c1, r0, r1;
  for (guint i = 0; i < n; i++) {
    if (pp_rect_is_empty(boxes[i]))
      continue;
    cells_of(g, boxes[i], &c0, &c1, &r0, &r1);
    if (is_wide(c0, c1, r0, r1))
      continue;
    for (guint r = r0; r <= r1; r++)
      for (guint c = c0; c <= c1; c++)
        g->start[r * g->cols + c + 1]++;
  }
  for (guint k = 0; k < n_cells; k++)
    g->start[k + 1] += g->start[k];
  g->ids = g_new(guint, MAX(g->start[n_cells], 1));
  g_autofree guint *fill = g_memdup2(g->start, n_cells * sizeof(guint));
  for (guint i = 0; i < n; i++) {
    if (pp_rect_is_empty(boxes[i]))
      continue;
    cells_of(g, boxes[i], &c0, &c1, &r0, &r1);
    if (is_wide(c0, c1, r0, r1)) {
      g_array_append_val(g->wide, i);
      continue;
    }
    for (guint r = r0; r <= r1; r++)
      for (guint c = c0; c <= c1; c++)
        g->ids[fill[r * g->cols + c]++] = i;
  }
  return g;
}

void pp_box_grid_free(pp_box_grid *g) {
  if (!g)
    return;
  g_free(g->start);
  g_free(g->ids);
  g_free(g->stamp);
  g_array_unref(g->wide);
  g_array_unref(g->empty);
  g_free(g);
}

/* Ascending ids, without a comparison callback: Shell sort with Ciura's gaps (A102549 in
 * the OEIS), then insertion; an answer holds tens to hundreds of ids. */
static void sort_ids(GArray *out) {
  static const guint gaps[] = {701, 301, 132, 57, 23, 10, 4, 1};
  guint *v = (guint *)out->data, n = out->len;
  for (guint gi = 0; gi < G_N_ELEMENTS(gaps); gi++) {
    guint gap = gaps[gi];
    for (guint i = gap; i < n; i++) {
      guint x = v[i], j = i;
      for (; j >= gap && v[j - gap] > x; j -= gap)
        v[j] = v[j - gap];
      v[j] = x;
    }
  }
}

/* Writes id at *n of ids, once per query; ids has room for every candidate. */
static inline void take(pp_box_grid *g, guint id, guint *ids, guint *n) {
  if (g->stamp[id] == g->query)
    return;
  g->stamp[id] = g->query;
  ids[(*n)++] = id;
}

void pp_box_grid_query(pp_box_grid *g, pp_rect q, GArray *out) {
  pp_box_grid_query_any(g, q, out);
  sort_ids(out);
}

/* Starts a query of q: FALSE when it has no answer; else a fresh stamp and the rows and
 * columns of cells to visit (none when q misses the extent). */
static gboolean query_begin(pp_box_grid *g, pp_rect q, guint *c0, guint *c1, guint *r0, guint *r1) {
  if (g->n == 0 || !(q.x0 <= q.x1 && q.y0 <= q.y1))
    return FALSE;
  if (++g->query == 0) { /* the stamp counter wrapped: forget every stamp */
    memset(g->stamp, 0, g->n * sizeof(guint));
    g->query = 1;
  }
  gboolean inside =
      q.x1 >= g->extent.x0 && q.x0 <= g->extent.x1 && q.y1 >= g->extent.y0 && q.y0 <= g->extent.y1;
  *c0 = 0, *c1 = 0, *r0 = 1, *r1 = 0; /* no rows unless inside */
  if (inside)
    cells_of(g, q, c0, c1, r0, r1);
  return TRUE;
}

gboolean pp_box_grid_find(pp_box_grid *g, pp_rect q, pp_box_grid_accept accept, gpointer data) {
  guint c0, c1, r0, r1, id;
  if (!query_begin(g, q, &c0, &c1, &r0, &r1))
    return FALSE;
  for (guint k = 0; k < g->wide->len; k++)
    if (g->stamp[id = g_array_index(g->wide, guint, k)] != g->query) {
      g->stamp[id] = g->query;
      if (accept(id, data))
        return TRUE;
    }
  for (guint r = r0; r <= r1; r++)
    for (guint k = g->start[r * g->cols + c0]; k < g->start[r * g->cols + c1 + 1]; k++)
      if (g->stamp[id = g->ids[k]] != g->query) {
        g->stamp[id] = g->query;
        if (accept(id, data))
          return TRUE;
      }
  return FALSE;
}

void pp_box_grid_query_any(pp_box_grid *g, pp_rect q, GArray *out) {
  g_array_set_size(out, 0);
  guint c0, c1, r0, r1;
  if (!query_begin(g, q, &c0, &c1, &r0, &r1))
    return;
  /* Room for every candidate first, then filled in place: one call per query, not one per
   * id (a cell's ids are contiguous in each row of cells). */
  guint room = g->wide->len;
  for (guint r = r0; r <= r1; r++)
    room += g->start[r * g->cols + c1 + 1] - g->start[r * g->cols + c0];
  g_array_set_size(out, room);
  guint *ids = (guint *)out->data, n = 0;
  for (guint k = 0; k < g->wide->len; k++)
    take(g, g_array_index(g->wide, guint, k), ids, &n);
  for (guint r = r0; r <= r1; r++)
    for (guint k = g->start[r * g->cols + c0]; k < g->start[r * g->cols + c1 + 1]; k++)
      take(g, g->ids[k], ids, &n);
  g_array_set_size(out, n);
}

void pp_box_grid_query_inside(pp_box_grid *g, pp_rect outer, double tol, GArray *out) {
  /* A non-empty box within outer grown by tol touches that grown box; an empty one (say
   * inverted) may pass a corner test without touching anything, so those all come too. */
  pp_box_grid_query(g, (pp_rect){outer.x0 - tol, outer.y0 - tol, outer.x1 + tol, outer.y1 + tol},
                    out);
  if (g->empty->len == 0)
    return;
  g_array_append_vals(out, g->empty->data, g->empty->len);
  sort_ids(out);
}

void pp_group_lists_init(pp_group_lists *gl, const guint *group, guint n, guint n_groups) {
  gl->start = g_new0(guint, n_groups + 1);
  gl->members = g_new(guint, MAX(n, 1));
  for (guint i = 0; i < n; i++)
    if (group[i] < n_groups)
      gl->start[group[i] + 1]++;
  for (guint g = 0; g < n_groups; g++)
    gl->start[g + 1] += gl->start[g];
  g_autofree guint *fill = g_memdup2(gl->start, (n_groups + 1) * sizeof(guint));
  for (guint i = 0; i < n; i++)
    if (group[i] < n_groups)
      gl->members[fill[group[i]]++] = i;
}

void pp_group_lists_clear(pp_group_lists *gl) {
  g_free(gl->start);
  g_free(gl->members);
}

struct pp_coord_index {
  guint *ids; /* by value, ties by id */
  double *values;
  guint n;
  guint *unknown; /* ids of the non-finite values, ascending */
  guint n_unknown;
};

static int cmp_by_value(gconstpointer pa, gconstpointer pb, gpointer data) {
  const double *v = data;
  guint a = *(const guint *)pa, b = *(const guint *)pb;
  return v[a] < v[b] ? -1 : v[a] > v[b] ? 1 : (a > b) - (a < b);
}

pp_coord_index *pp_coord_index_new(const double *values, guint n) {
  pp_coord_index *x = g_new0(pp_coord_index, 1);
  x->ids = g_new(guint, MAX(n, 1));
  x->unknown = g_new(guint, MAX(n, 1));
  x->values = g_memdup2(values, MAX(n, 1) * sizeof(double));
  for (guint i = 0; i < n; i++)
    if (isfinite(values[i]))
      x->ids[x->n++] = i;
    else
      x->unknown[x->n_unknown++] = i;
  g_qsort_with_data(x->ids, (gint)x->n, sizeof(guint), cmp_by_value, x->values);
  return x;
}

void pp_coord_index_free(pp_coord_index *x) {
  if (!x)
    return;
  g_free(x->ids);
  g_free(x->unknown);
  g_free(x->values);
  g_free(x);
}

void pp_coord_index_range(const pp_coord_index *x, double lo, double hi, GArray *out) {
  guint a = 0, b = x->n;
  while (a < b) { /* the first value at least lo */
    guint mid = a + (b - a) / 2;
    if (x->values[x->ids[mid]] < lo)
      a = mid + 1;
    else
      b = mid;
  }
  for (; a < x->n && x->values[x->ids[a]] <= hi; a++)
    g_array_append_val(out, x->ids[a]);
}

static int cmp_id(gconstpointer a, gconstpointer b) {
  guint x = *(const guint *)a, y = *(const guint *)b;
  return (x > y) - (x < y);
}

void pp_coord_index_within(const pp_coord_index *x, double lo, double hi, GArray *out) {
  g_array_set_size(out, 0);
  pp_coord_index_range(x, lo, hi, out);
  g_array_append_vals(out, x->unknown, x->n_unknown);
  g_array_sort(out, cmp_id);
}
