/* labelled.c — recognizer: bar charts with no value axis, read from their data labels
 * alone. Bars of one width sharing a baseline edge, each carrying its own printed
 * number; the printed numbers are the values. */
#include <math.h>
#include <string.h>

#include "internal.h"

#define OWNER "labelled-bars"

/* How much a printed number on every bar says, placed at each bar's end and read as one
 * format: strong, but a table's shaded cells carry numbers too (common practice, no
 * source). */
#define PP_EVIDENCE_LABELS_WEIGHT 0.7

/* Bars of one chart have one width, within this share of it plus PP_LABELLED_WIDTH_SLACK
 * points (producers' rounding; common practice, no source). */
#define PP_LABELLED_WIDTH_SHARE 0.05
#define PP_LABELLED_WIDTH_SLACK 0.1

/* The bars' edges along each orientation's value axis (u0, u1 of pp_frame_of) in order,
 * so that the bars on one edge are found by binary search: a page of 10^4 tiles has a
 * hundred rows, each tried once. */
typedef struct {
  pp_coord_index *u[2][2]; /* [orient][0: u0, 1: u1] */
  GArray *near;            /* guint: scratch */
} edge_index;

static void edge_index_init(edge_index *x, GArray *bars) {
  g_autofree double *v = g_new(double, MAX(bars->len, 1));
  for (int orient = 0; orient < 2; orient++)
    for (int side = 0; side < 2; side++) {
      for (guint j = 0; j < bars->len; j++) {
        pp_frame_rect f = pp_frame_of(g_array_index(bars, pp_bar_candidate, j).rect, orient == 0);
        v[j] = side ? f.u1 : f.u0;
      }
      x->u[orient][side] = pp_coord_index_new(v, bars->len);
    }
  x->near = g_array_new(FALSE, FALSE, sizeof(guint));
}

static void edge_index_clear(edge_index *x) {
  for (int orient = 0; orient < 2; orient++)
    for (int side = 0; side < 2; side++)
      pp_coord_index_free(x->u[orient][side]);
  g_array_unref(x->near);
}

static int cmp_guint(gconstpointer a, gconstpointer b) {
  guint x = *(const guint *)a, y = *(const guint *)b;
  return (x > y) - (x < y);
}

/* A margin around the edge search, pt, so that rounding in pp_on_edge (which decides)
 * never falls outside it: far above a double's spacing at page coordinates. */
#define PP_LABELLED_SEARCH_SLACK 1e-6

/* The free bars standing on edge c that have the width of the first, in page order. */
static GArray *select_on_edge(const pp_recognize_ctx *ctx, edge_index *x, int orient, double c,
                              double width) {
  gboolean vertical = orient == 0;
  GArray *sel = g_array_new(FALSE, FALSE, sizeof(guint));
  GArray *near = x->near;
  g_array_set_size(near, 0);
  double reach = PP_SAME_EDGE_TOL + PP_LABELLED_SEARCH_SLACK;
  for (int side = 0; side < 2; side++)
    pp_coord_index_range(x->u[orient][side], c - reach, c + reach, near);
  g_array_sort(near, cmp_guint);
  for (guint n = 0; n < near->len; n++) {
    guint j = g_array_index(near, guint, n);
    if (n > 0 && g_array_index(near, guint, n - 1) == j)
      continue;
    pp_bar_candidate *b = &g_array_index(ctx->bars, pp_bar_candidate, j);
    pp_frame_rect fb = pp_frame_of(b->rect, vertical);
    if (pp_claims_mark_free(ctx->claims, b->mark) && pp_on_edge(fb.u0, fb.u1, c) &&
        fabs((fb.w1 - fb.w0) - width) < PP_LABELLED_WIDTH_SHARE * width + PP_LABELLED_WIDTH_SLACK)
      g_array_append_val(sel, j);
  }
  return sel;
}

/* Every element of two or more carries a printed number, and the group is not a legend.
 * The legend test needs only the elements' boxes: it is asked first, before the labels are
 * looked for, so that a grid of small tiles (each named like a legend key) is turned down
 * without a search for its categories and data labels. */
static gboolean legend_or_single(pp_recognize_ctx *ctx, pp_figure *fig) {
  return fig->elements->len < 2 || pp_bars_legend_like(ctx, fig);
}

static gboolean all_labelled(const pp_figure *fig) {
  guint labelled = 0;
  for (guint k = 0; k < fig->elements->len; k++)
    labelled += !isnan(g_array_index(fig->elements, pp_element, k).label_value);
  return labelled == fig->elements->len;
}

/* An edge already tried in this pass: the selection depends only on the orientation, the
 * edge and the width (claims do not change until a figure is committed), so each row of
 * a grid of tiles is built once instead of once per tile. */
typedef struct {
  double edge, width;
  int orient;
} tried_edge;

static guint tried_hash(gconstpointer p) {
  const tried_edge *t = p;
  return g_double_hash(&t->edge) * 31u + g_double_hash(&t->width) * 7u + (guint)t->orient;
}

static gboolean tried_equal(gconstpointer a, gconstpointer b) {
  const tried_edge *x = a, *y = b;
  return x->edge == y->edge && x->width == y->width && x->orient == y->orient;
}

static gboolean first_try(GHashTable *tried, int orient, double edge, double width) {
  tried_edge key = {edge, width, orient};
  if (g_hash_table_contains(tried, &key))
    return FALSE;
  g_hash_table_add(tried, g_memdup2(&key, sizeof key));
  return TRUE;
}

/* A selection already built on an edge in this pass: the figure depends only on the
 * selection, the orientation and the edge, so one rejected is rejected again. Tiles whose
 * widths differ in the last digit are tried as different widths above, and each gives its
 * whole row again. */
typedef struct {
  double edge;
  int orient;
  guint n;
  guint ids[]; /* the selection, ascending */
} tried_sel;

static guint tried_sel_hash(gconstpointer p) {
  const tried_sel *t = p;
  guint h = g_double_hash(&t->edge) * 31u + (guint)t->orient;
  for (guint k = 0; k < t->n; k++)
    h = h * 16777619u ^ t->ids[k]; /* FNV-style mixing: common practice, no source */
  return h;
}

static gboolean tried_sel_equal(gconstpointer a, gconstpointer b) {
  const tried_sel *x = a, *y = b;
  return x->edge == y->edge && x->orient == y->orient && x->n == y->n &&
         memcmp(x->ids, y->ids, x->n * sizeof(guint)) == 0;
}

static gboolean first_build(GHashTable *built, int orient, double edge, GArray *sel) {
  tried_sel *t = g_malloc(sizeof(tried_sel) + sel->len * sizeof(guint));
  t->edge = edge, t->orient = orient, t->n = sel->len;
  memcpy(t->ids, sel->data, sel->len * sizeof(guint));
  if (g_hash_table_contains(built, t)) {
    g_free(t);
    return FALSE;
  }
  g_hash_table_add(built, t);
  return TRUE;
}

/* A labels-only figure needs two labelled bars, and each bar takes a free label of its
 * own (a data label is looked for among the free ones and claimed when found), so with
 * fewer than two free labels on the page no edge can give one: a page of unlabelled
 * rectangles tries none. Claims change only when a figure is committed, so this holds for
 * a whole pass. */
static gboolean two_free_labels(const pp_recognize_ctx *ctx) {
  guint free = 0;
  for (guint i = 0; i < ctx->labels->len && free < 2; i++)
    free += pp_claims_label_free(ctx->claims,
                                 ((const pp_label *)g_ptr_array_index(ctx->labels, i))->index);
  return free >= 2;
}

/* One labels-only figure, committed and finished; FALSE when there is none left. */
static gboolean find_one(pp_recognize_ctx *ctx, edge_index *x) {
  if (!two_free_labels(ctx))
    return FALSE;
  g_autoptr(GHashTable) tried = g_hash_table_new_full(tried_hash, tried_equal, g_free, NULL);
  g_autoptr(GHashTable) built =
      g_hash_table_new_full(tried_sel_hash, tried_sel_equal, g_free, NULL);
  for (int orient = 0; orient < 2; orient++) {
    gboolean vertical = orient == 0;
    for (guint i = 0; i < ctx->bars->len; i++) {
      pp_bar_candidate *a = &g_array_index(ctx->bars, pp_bar_candidate, i);
      if (!pp_claims_mark_free(ctx->claims, a->mark))
        continue;
      pp_frame_rect fa = pp_frame_of(a->rect, vertical);
      double edges[2] = {fa.u0, fa.u1};
      for (int e = 0; e < 2; e++) {
        if (!first_try(tried, orient, edges[e], fa.w1 - fa.w0))
          continue;
        GArray *sel = select_on_edge(ctx, x, orient, edges[e], fa.w1 - fa.w0);
        if (sel->len < 2 || !first_build(built, orient, edges[e], sel)) {
          g_array_unref(sel);
          continue;
        }
        pp_claims_begin(ctx->claims);
        pp_figure *fig = pp_bars_stack(ctx, sel, NULL, vertical, edges[e], OWNER);
        g_array_unref(sel);
        gboolean rejected = legend_or_single(ctx, fig);
        if (!rejected) {
          pp_bars_annotate(ctx, fig, vertical, edges[e]);
          rejected = !all_labelled(fig);
        }
        if (rejected) {
          pp_claims_rollback(ctx->claims);
          pp_figure_free(fig);
          continue;
        }
        pp_claims_commit(ctx->claims);
        for (guint k = 0; k < fig->elements->len; k++) {
          pp_element *el = &g_array_index(fig->elements, pp_element, k);
          el->value = el->label_value;
          el->source = PP_VALUE_DATA_LABEL;
        }
        pp_bars_weigh_layout(fig);
        pp_figure_add_evidence(fig, "data-labels", PP_EVIDENCE_LABELS_WEIGHT);
        pp_figure_finish(ctx, fig, NULL);
        return TRUE;
      }
    }
  }
  return FALSE;
}

void pp_recognize_labelled_bars(pp_recognize_ctx *ctx) {
  if (!two_free_labels(ctx)) /* no figure to find: the index is not built */
    return;
  edge_index x;
  edge_index_init(&x, ctx->bars);
  while (find_one(ctx, &x))
    ;
  edge_index_clear(&x);
}
