/* dots.c — recognizer: dot plots and scatter plots of one marker size, read beside a fitted
 * value axis of either orientation (a dot plot's values run along a horizontal axis, its
 * categories down the side). Markers of one size carry no number by their ink, so the
 * figure is counted (the reviewer sees it was read) and never judged by an ink rule. */
#include <math.h>
#include <string.h>

#include "internal.h"

#define OWNER "dots"

/* A marker is smaller than this on both sides, pt, and covers more than the minimum area
 * (lines.c's limits: dots of dotted rules are smaller; common practice, no source). */
#define PP_DOT_MAX 15.0
#define PP_DOT_MIN_AREA 1.0
/* Markers of one size agree within this, pt (producers' rounding; common practice, no
 * source). */
#define PP_DOT_SIZE_TOL 0.1
/* At least this many markers of one size and colour: fewer are a legend or a key
 * (common practice, no source). */
#define PP_DOT_MIN_COUNT 5
/* The markers may lie this far from the axis labels across the axis, as a share of their
 * own extent along it plus a margin, pt: a plot is about as deep as it is wide (common
 * practice, no source). */
#define PP_DOT_MAX_DISTANCE 1.0
#define PP_DOT_MARGIN 30.0

typedef struct {
  guint mark;
  pp_rect box;
} dot;

static gboolean is_dot(const pp_mark *m) {
  pp_rect r = m->bbox, rect;
  return m->kind == PP_MARK_FILL && m->path->n_segs >= 4 && pp_rect_width(r) < PP_DOT_MAX &&
         pp_rect_height(r) < PP_DOT_MAX && pp_rect_area(r) > PP_DOT_MIN_AREA &&
         !pp_path_is_rectangle(m->path, PP_RECT_TOL, &rect);
}

static gboolean same_look(const pp_mark *a, const pp_mark *b) {
  return fabs(pp_rect_width(a->bbox) - pp_rect_width(b->bbox)) <= PP_DOT_SIZE_TOL &&
         fabs(pp_rect_height(a->bbox) - pp_rect_height(b->bbox)) <= PP_DOT_SIZE_TOL &&
         a->paint.kind == b->paint.kind && a->paint.r == b->paint.r && a->paint.g == b->paint.g &&
         a->paint.b == b->paint.b && a->paint.a == b->paint.a;
}

/* Sizes are bucketed in cells a little wider than PP_DOT_SIZE_TOL, so two sizes within
 * the tolerance always fall in the same or neighbouring cells despite rounding. */
#define PP_DOT_SIZE_CELL (PP_DOT_SIZE_TOL * 1.005)

static gint64 size_cell(double v) {
  double c = floor(v / PP_DOT_SIZE_CELL);
  return !(c >= 0) ? 0 : c > 1e6 ? 1000000 : (gint64)c;
}

/* One key per paint and size cell: equal paints give equal keys (0 and -0 alike). */
static gint64 look_key(const pp_mark *m, gint64 dw, gint64 dh) {
  const double p[4] = {m->paint.r, m->paint.g, m->paint.b, m->paint.a};
  guint64 h = (guint64)m->paint.kind;
  for (int i = 0; i < 4; i++) {
    double v = p[i] == 0 ? 0 : p[i];
    guint64 bits;
    memcpy(&bits, &v, sizeof bits);
    h = (h ^ bits) * 0x100000001b3ull;
  }
  h = (h ^ (guint64)(size_cell(pp_rect_width(m->bbox)) + dw)) * 0x100000001b3ull;
  h = (h ^ (guint64)(size_cell(pp_rect_height(m->bbox)) + dh)) * 0x100000001b3ull;
  /* splitmix64's finaliser: GLib's int64 hash keeps only the low bits */
  h = (h ^ (h >> 30)) * 0xbf58476d1ce4e5b9ull;
  h = (h ^ (h >> 27)) * 0x94d049bb133111ebull;
  return (gint64)(h ^ (h >> 31));
}

/* The largest set of free markers of one size and colour. Each marker joins the set of
 * the earliest first marker it looks like, else starts one (the first set wins a tie);
 * first markers are bucketed by paint and size cell, and a match lies in the same or a
 * neighbouring cell. */
static GArray *largest_set(const pp_recognize_ctx *ctx) {
  const pp_scene *scene = ctx->scene;
  g_autoptr(GHashTable) buckets =
      g_hash_table_new_full(g_int64_hash, g_int64_equal, g_free, (GDestroyNotify)g_array_unref);
  g_autoptr(GPtrArray) sets = g_ptr_array_new_with_free_func((GDestroyNotify)g_array_unref);
  g_autoptr(GArray) firsts = g_array_new(FALSE, FALSE, sizeof(guint));
  for (guint k = 0; k < scene->marks->len; k++) {
    const pp_mark *o = g_ptr_array_index(scene->marks, k);
    if (!pp_claims_mark_free(ctx->claims, k) || !is_dot(o) ||
        g_hash_table_contains(ctx->glyph_marks, GUINT_TO_POINTER(k)) || !same_look(o, o))
      continue;
    guint found = G_MAXUINT;
    for (int d = 0; d < 9; d++) {
      gint64 key = look_key(o, d % 3 - 1, d / 3 - 1);
      GArray *bucket = g_hash_table_lookup(buckets, &key);
      for (guint j = 0; bucket && j < bucket->len; j++) {
        guint set = g_array_index(bucket, guint, j);
        if (set >= found)
          break;
        const pp_mark *m = g_ptr_array_index(scene->marks, g_array_index(firsts, guint, set));
        if (same_look(m, o)) {
          found = set;
          break;
        }
      }
    }
    if (found == G_MAXUINT) {
      found = sets->len;
      g_ptr_array_add(sets, g_array_new(FALSE, FALSE, sizeof(dot)));
      g_array_append_val(firsts, k);
      gint64 key = look_key(o, 0, 0);
      GArray *bucket = g_hash_table_lookup(buckets, &key);
      if (!bucket) {
        bucket = g_array_new(FALSE, FALSE, sizeof(guint));
        g_hash_table_insert(buckets, g_memdup2(&key, sizeof key), bucket);
      }
      g_array_append_val(bucket, found);
    }
    dot d = {k, o->bbox};
    g_array_append_val(g_ptr_array_index(sets, found), d);
  }
  GArray *best = g_array_new(FALSE, FALSE, sizeof(dot));
  for (guint i = 0; i < sets->len; i++) {
    GArray *set = g_ptr_array_index(sets, i);
    if (set->len > best->len) {
      g_array_set_size(best, 0);
      g_array_append_vals(best, set->data, set->len);
    }
  }
  return best;
}

/* A free fitted axis whose ticks cover the markers along it and whose labels stand beside
 * them across it: the nearest. */
static const pp_axis_candidate *axis_of(const pp_recognize_ctx *ctx, pp_rect box) {
  const pp_axis_candidate *best = NULL;
  double best_d = INFINITY;
  for (guint i = 0; i < ctx->axes->len; i++) {
    const pp_axis_candidate *a = g_ptr_array_index(ctx->axes, i);
    if (a->fit_failed || a->category || !a->scale || pp_axis_taken(ctx, a))
      continue;
    gboolean v = a->scale->vertical;
    double u0 = v ? box.y0 : box.x0, u1 = v ? box.y1 : box.x1;
    if (!pp_within_reach(a, u0, u1, 10, 0))
      continue;
    double w0 = v ? box.x0 : box.y0, w1 = v ? box.x1 : box.y1;
    double d = a->label_edge <= w0 + 2   ? w0 - a->label_edge
               : a->label_edge >= w1 - 2 ? a->label_edge - w1
                                         : INFINITY;
    if (d <= PP_DOT_MAX_DISTANCE * (u1 - u0) + PP_DOT_MARGIN && d < best_d)
      best_d = d, best = a;
  }
  return best;
}

void pp_recognize_dots(pp_recognize_ctx *ctx) {
  g_autoptr(GArray) dots = largest_set(ctx);
  if (dots->len < PP_DOT_MIN_COUNT)
    return;
  pp_rect box = pp_rect_empty();
  for (guint i = 0; i < dots->len; i++)
    box = pp_rect_union(box, g_array_index(dots, dot, i).box);
  const pp_axis_candidate *axis = axis_of(ctx, box);
  if (!axis)
    return;
  pp_claims_begin(ctx->claims);
  for (guint i = 0; i < dots->len; i++)
    pp_claims_take_mark(ctx->claims, g_array_index(dots, dot, i).mark, OWNER);
  pp_axis_claim_labels(ctx, axis);
  pp_claims_commit(ctx->claims);
  /* The plot spans the axis' ticks, however the markers fall. */
  if (axis->scale->vertical)
    box.y0 = fmin(box.y0, axis->span0), box.y1 = fmax(box.y1, axis->span1);
  else
    box.x0 = fmin(box.x0, axis->span0), box.x1 = fmax(box.x1, axis->span1);
  pp_figure *f = pp_figure_new(PP_FIGURE_LINE);
  f->recognizer = OWNER;
  f->bbox = box;
  pp_figure_add_evidence(f, "scale-fits", 1);
  pp_figure_add_evidence(f, "one-size-markers", 1);
  pp_figure_finish(ctx, f, axis);
}
