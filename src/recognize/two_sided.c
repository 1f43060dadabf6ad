/* two_sided.c — recognizer: two-sided bars (population pyramids, back-to-back bars): rows
 * of bars reaching left and right from one shared line, under a value axis that prints
 * magnitudes on both sides (400 200 0 200 400), which no linear fit across the page takes.
 * The scale is read as value = a + b·(distance from the shared line) on both sides at once:
 * bars from a line that reads a ≠ 0 are bars off zero. */
#include <math.h>

#include "internal.h"

#define OWNER "two-sided"

/* Bars meet the zero line within this, pt (PP_SAME_COLUMN_TOL alike). */
#define PP_TWO_EDGE_TOL 0.3
/* A row: its left and right bars agree in their top and bottom within this, pt. */
#define PP_TWO_ROW_TOL 0.5
/* Rows at least: fewer are a pair of bars, not a pyramid (common practice, no source). */
#define PP_TWO_MIN_ROWS 3
/* Mirrored tick labels stand this close to their mirror position, pt, and this far at
 * most below or above the bars, pt (common practice, no source). */
#define PP_TWO_MIRROR_TOL 2.0
#define PP_TWO_LABEL_REACH 40.0
/* The printed values follow their distance from the shared line within this share of their
 * range: tick labels are centred on their ticks to a fraction of a point (common practice,
 * no source). */
#define PP_TWO_SCALE_TOL 0.005

/* Pairs of labels of one value at mirrored places about x = c, on one row near the bars,
 * with a label at c. */
static guint mirrored_labels(const pp_recognize_ctx *ctx, double c, pp_rect bars) {
  gboolean zero = FALSE;
  guint pairs = 0;
  for (guint i = 0; i < ctx->labels->len; i++) {
    const pp_label *a = g_ptr_array_index(ctx->labels, i);
    double below = a->box.y0 - bars.y1, above = bars.y0 - a->box.y1;
    if (!pp_claims_label_free(ctx->claims, a->index) ||
        !((below >= -1 && below <= PP_TWO_LABEL_REACH) ||
          (above >= -1 && above <= PP_TWO_LABEL_REACH)))
      continue;
    /* the line's own label: 0, or the value the bars start from when they are cut */
    if (a->number.value >= 0 && fabs(a->centre.x - c) <= PP_TWO_MIRROR_TOL)
      zero = TRUE;
    if (a->centre.x <= c + PP_TWO_MIRROR_TOL || !(a->number.value > 0))
      continue;
    for (guint k = 0; k < ctx->labels->len; k++) {
      const pp_label *b = g_ptr_array_index(ctx->labels, k);
      if (b->number.value == a->number.value && fabs(b->centre.y - a->centre.y) < 1 &&
          fabs((c - b->centre.x) - (a->centre.x - c)) <= PP_TWO_MIRROR_TOL) {
        pairs++;
        break;
      }
    }
  }
  return zero ? pairs : 0;
}

/* The mirrored scale: every free numeric label of the row of tick labels (the fullest row
 * within reach below or above the bars), its distance d from x = c; value = a + b·d by
 * least squares. FALSE unless three or more distinct distances fit within
 * PP_TWO_SCALE_TOL of their range with b > 0. The labels read are added to used. */
typedef struct {
  double a, b, lo, hi; /* value at the line, per pt, the labels' range */
  double d_max;        /* farthest label from the line, pt */
} mirrored;

static gboolean in_reach(const pp_label *l, pp_rect bars) {
  double below = l->box.y0 - bars.y1, above = bars.y0 - l->box.y1;
  return (below >= -1 && below <= PP_TWO_LABEL_REACH) ||
         (above >= -1 && above <= PP_TWO_LABEL_REACH);
}

static gboolean mirrored_scale(const pp_recognize_ctx *ctx, double c, pp_rect bars, mirrored *m,
                               GArray *used) {
  /* the row: the label centre height shared by most labels in reach */
  double row = NAN;
  guint best = 0;
  for (guint i = 0; i < ctx->labels->len; i++) {
    const pp_label *a = g_ptr_array_index(ctx->labels, i);
    if (!pp_claims_label_free(ctx->claims, a->index) || !in_reach(a, bars))
      continue;
    guint n = 0;
    for (guint k = 0; k < ctx->labels->len; k++) {
      const pp_label *b = g_ptr_array_index(ctx->labels, k);
      n += pp_claims_label_free(ctx->claims, b->index) && in_reach(b, bars) &&
           fabs(b->centre.y - a->centre.y) < 1;
    }
    if (n > best)
      best = n, row = a->centre.y;
  }
  double sd = 0, sv = 0, sdd = 0, sdv = 0, n = 0;
  m->lo = INFINITY, m->hi = -INFINITY, m->d_max = 0;
  g_array_set_size(used, 0);
  for (guint i = 0; i < ctx->labels->len; i++) {
    const pp_label *l = g_ptr_array_index(ctx->labels, i);
    if (!pp_claims_label_free(ctx->claims, l->index) || !in_reach(l, bars) ||
        !(fabs(l->centre.y - row) < 1))
      continue;
    double d = fabs(l->centre.x - c), v = l->number.value;
    sd += d, sv += v, sdd += d * d, sdv += d * v, n++;
    m->lo = fmin(m->lo, v), m->hi = fmax(m->hi, v), m->d_max = fmax(m->d_max, d);
    g_array_append_val(used, i);
  }
  double den = n * sdd - sd * sd;
  if (n < 3 || !(den > 0) || !(m->hi > m->lo))
    return FALSE;
  m->b = (n * sdv - sd * sv) / den;
  m->a = (sv - m->b * sd) / n;
  guint distinct = 0;
  for (guint k = 0; k < used->len; k++) {
    const pp_label *l = g_ptr_array_index(ctx->labels, g_array_index(used, guint, k));
    double d = fabs(l->centre.x - c);
    if (fabs(m->a + m->b * d - l->number.value) > PP_TWO_SCALE_TOL * (m->hi - m->lo))
      return FALSE;
    gboolean again = FALSE;
    for (guint j = 0; j < k && !again; j++)
      again =
          fabs(
              fabs(((const pp_label *)g_ptr_array_index(ctx->labels, g_array_index(used, guint, j)))
                       ->centre.x -
                   c) -
              d) <= PP_TWO_MIRROR_TOL;
    distinct += !again;
  }
  return distinct >= 3 && m->b > 0;
}

static gboolean same_row(pp_rect a, pp_rect b) {
  return fabs(a.y0 - b.y0) <= PP_TWO_ROW_TOL && fabs(a.y1 - b.y1) <= PP_TWO_ROW_TOL;
}

/* Bar indices in the order of one coordinate, so that the bars with an edge near a line
 * are found by binary search instead of a pass over every bar (dense pages hold 10^4). */
typedef struct {
  GArray *bars;
  int edge; /* 0: rect.x0, 1: rect.x1, 2: rect.y0 */
} by_edge;

static double edge_of(const pp_bar_candidate *b, int edge) {
  return edge == 0 ? b->rect.x0 : edge == 1 ? b->rect.x1 : b->rect.y0;
}

static int cmp_by_edge(gconstpointer pa, gconstpointer pb, gpointer data) {
  const by_edge *o = data;
  guint a = *(const guint *)pa, b = *(const guint *)pb;
  double x = edge_of(&g_array_index(o->bars, pp_bar_candidate, a), o->edge);
  double y = edge_of(&g_array_index(o->bars, pp_bar_candidate, b), o->edge);
  return x < y ? -1 : x > y ? 1 : (a > b) - (a < b);
}

/* The indices in sel (a subset of bars), or of every bar when sel is NULL, whose edge is a
 * finite number (a NaN or infinite edge passes no tolerance test), sorted by that edge. */
static GArray *sorted_by_edge(GArray *bars, const GArray *sel, int edge) {
  GArray *idx = g_array_new(FALSE, FALSE, sizeof(guint));
  guint n = sel ? sel->len : bars->len;
  for (guint k = 0; k < n; k++) {
    guint i = sel ? g_array_index(sel, guint, k) : k;
    if (isfinite(edge_of(&g_array_index(bars, pp_bar_candidate, i), edge)))
      g_array_append_val(idx, i);
  }
  by_edge o = {bars, edge};
  g_array_sort_with_data(idx, cmp_by_edge, &o);
  return idx;
}

/* The first position in idx (sorted by edge) whose edge is at least v. */
static guint lower_bound(GArray *bars, const GArray *idx, int edge, double v) {
  guint lo = 0, hi = idx->len;
  while (lo < hi) {
    guint mid = lo + (hi - lo) / 2;
    if (edge_of(&g_array_index(bars, pp_bar_candidate, g_array_index(idx, guint, mid)), edge) < v)
      lo = mid + 1;
    else
      hi = mid;
  }
  return lo;
}

/* A margin around each search window, pt, so that rounding in the tolerance tests (which
 * decide) never falls outside it: far above a double's spacing at page coordinates. */
#define PP_TWO_SEARCH_SLACK 1e-6

/* Appends to out the indices in idx whose edge lies within tol (+ slack) of v. */
static void edge_window(GArray *bars, const GArray *idx, int edge, double v, double tol,
                        GArray *out) {
  double hi = v + tol + PP_TWO_SEARCH_SLACK;
  for (guint p = lower_bound(bars, idx, edge, v - tol - PP_TWO_SEARCH_SLACK); p < idx->len; p++) {
    guint k = g_array_index(idx, guint, p);
    if (edge_of(&g_array_index(bars, pp_bar_candidate, k), edge) > hi)
      break;
    g_array_append_val(out, k);
  }
}

static int cmp_guint(gconstpointer a, gconstpointer b) {
  guint x = *(const guint *)a, y = *(const guint *)b;
  return (x > y) - (x < y);
}

/* Left-right pairs on one row, counted up to PP_TWO_MIN_ROWS (all the caller asks). */
static guint count_rows(GArray *bars, const GArray *left, const GArray *right, GArray *near) {
  g_autoptr(GArray) by_y0 = sorted_by_edge(bars, right, 2);
  guint rows = 0;
  for (guint a = 0; a < left->len && rows < PP_TWO_MIN_ROWS; a++) {
    pp_rect l = g_array_index(bars, pp_bar_candidate, g_array_index(left, guint, a)).rect;
    g_array_set_size(near, 0);
    edge_window(bars, by_y0, 2, l.y0, PP_TWO_ROW_TOL, near);
    for (guint b = 0; b < near->len; b++)
      rows +=
          same_row(l, g_array_index(bars, pp_bar_candidate, g_array_index(near, guint, b)).rect);
  }
  return rows;
}

void pp_recognize_two_sided(pp_recognize_ctx *ctx) {
  GArray *bars = ctx->bars;
  g_autoptr(GArray) by_x0 = sorted_by_edge(bars, NULL, 0);
  g_autoptr(GArray) by_x1 = sorted_by_edge(bars, NULL, 1);
  g_autoptr(GArray) near = g_array_new(FALSE, FALSE, sizeof(guint));
  /* Lines that made no figure since the last one committed: the outcome depends only on
   * the line and the claims, so the other bars of a column need not try it again. */
  g_autoptr(GHashTable) failed = g_hash_table_new_full(g_double_hash, g_double_equal, g_free, NULL);
  for (guint i = 0; i < bars->len; i++) {
    const pp_bar_candidate *seed = &g_array_index(bars, pp_bar_candidate, i);
    if (!pp_claims_mark_free(ctx->claims, seed->mark))
      continue;
    double c = seed->rect.x1; /* a left bar's inner end: the zero line */
    if (g_hash_table_contains(failed, &c))
      continue;
    g_autoptr(GArray) left = g_array_new(FALSE, FALSE, sizeof(guint));
    g_autoptr(GArray) right = g_array_new(FALSE, FALSE, sizeof(guint));
    pp_rect all = pp_rect_empty();
    /* the bars with an edge near c, then taken in their page order as before */
    g_array_set_size(near, 0);
    if (isfinite(c)) {
      edge_window(bars, by_x1, 1, c, PP_TWO_EDGE_TOL, near);
      edge_window(bars, by_x0, 0, c, PP_TWO_EDGE_TOL, near);
    }
    g_array_sort(near, cmp_guint);
    for (guint j = 0; j < near->len; j++) {
      guint k = g_array_index(near, guint, j);
      if (j > 0 && g_array_index(near, guint, j - 1) == k)
        continue;
      const pp_bar_candidate *b = &g_array_index(bars, pp_bar_candidate, k);
      if (!pp_claims_mark_free(ctx->claims, b->mark) || pp_rect_width(b->rect) <= 0)
        continue;
      if (fabs(b->rect.x1 - c) <= PP_TWO_EDGE_TOL)
        g_array_append_val(left, k);
      else if (fabs(b->rect.x0 - c) <= PP_TWO_EDGE_TOL)
        g_array_append_val(right, k);
      else
        continue;
      all = pp_rect_union(all, b->rect);
    }
    guint rows = count_rows(bars, left, right, near);
    if (rows < PP_TWO_MIN_ROWS || mirrored_labels(ctx, c, all) < 1) {
      g_hash_table_add(failed, g_memdup2(&c, sizeof c));
      continue;
    }
    mirrored m;
    g_autoptr(GArray) used = g_array_new(FALSE, FALSE, sizeof(guint));
    gboolean scaled = mirrored_scale(ctx, c, all, &m, used);
    if (scaled && fabs(m.a) <= PP_TWO_SCALE_TOL * (m.hi - m.lo))
      m.a = 0; /* the line prints 0 up to the labels' rounding */
    pp_claims_begin(ctx->claims);
    pp_figure *f = pp_figure_new(PP_FIGURE_BAR);
    f->recognizer = OWNER;
    for (guint side = 0; side < 2; side++) {
      GArray *sel = side ? right : left;
      for (guint k = 0; k < sel->len; k++) {
        const pp_bar_candidate *b =
            &g_array_index(bars, pp_bar_candidate, g_array_index(sel, guint, k));
        pp_element e = pp_element_init(PP_ENCODING_LENGTH);
        pp_element_add_part(&e, b->mark, PP_PART_BODY, b->ink);
        pp_claims_take_mark(ctx->claims, b->mark, OWNER);
        e.shape.kind = PP_SHAPE_RECT;
        e.shape.rect = b->rect;
        e.box = b->rect;
        e.ink = b->ink;
        e.extent = pp_rect_width(b->rect);
        e.series = side;
        if (scaled) {
          e.value = e.scale_value = m.a + m.b * e.extent;
          e.base_value = m.a;
          e.source = PP_VALUE_SCALE;
        }
        g_array_append_val(f->elements, e);
      }
    }
    f->n_series = 2;
    f->bbox = pp_solid_frame(ctx->scene, all);
    pp_figure_add_evidence(f, "shared-baseline", 1);
    pp_figure_add_evidence(f, "mirrored-scale", 1);
    if (scaled) {
      /* the right half of the scale stands for both: value = a + b·(x − c) */
      pp_scale *sc = pp_scale_new(FALSE);
      sc->box = pp_rect_empty();
      for (guint k = 0; k < used->len; k++) {
        const pp_label *l = g_ptr_array_index(ctx->labels, g_array_index(used, guint, k));
        pp_claims_take_label(ctx->claims, l->index, OWNER);
        sc->box = pp_rect_union(sc->box, l->box);
        if (l->centre.x < c - PP_TWO_MIRROR_TOL)
          continue;
        pp_tick t = {l->centre.x, l->number.value, g_strdup(l->text)};
        g_array_append_val(sc->ticks, t);
      }
      sc->slope = m.b, sc->offset = m.a - m.b * c;
      sc->min_value = m.a;
      sc->max_value = m.a + m.b * fmax(m.d_max, fmax(all.x1 - c, c - all.x0));
      f->scale = sc;
      pp_figure_add_evidence(f, "scale-fits", 1);
    } else {
      f->judged = FALSE;
      f->not_judged_reason =
          g_strdup("two-sided bars from one line (a population pyramid): no scale was read "
                   "across its mirrored labels; read, not judged");
    }
    pp_claims_commit(ctx->claims);
    pp_figure_finish(ctx, f, NULL);
    g_hash_table_remove_all(failed);
  }
}
