/* pyramids.c — recognizer: pyramids and funnels. Three or more slices (triangle on top,
 * trapezoids below, or trapezoids narrowing downwards) stacked edge to edge on one centre
 * line, each carrying a printed number or percentage inside it or on its row. Population
 * pyramids (two-sided bars), chevrons and arrows are not slices and make no figure. */
#include <math.h>
#include <string.h>

#include "internal.h"

#define OWNER "pyramids"

/* Outline rounding, as for 3D faces (solids.c). */
#define PP_SLICE_TOL 0.05
/* Slices meet when the gap between them is under this share of the thinner one plus
 * 1.5 pt (white separators, small spacing; common practice, no source). */
#define PP_SLICE_GAP_SHARE 0.3
/* Slices of one pyramid are centred on one vertical line within this share of the
 * widest plus 1 pt (common practice, no source). */
#define PP_SLICE_CENTRE_SHARE 0.02
/* The edges where two slices meet have one width within this share plus 1 pt. */
#define PP_SLICE_WIDTH_SHARE 0.05
#define PP_SLICE_MIN_COUNT 3
/* Centred bars make a stepped funnel only when the widest is this much wider than the
 * narrowest (a column of equal cells is a table; common practice, no source). */
#define PP_SLICE_STEP_SHARE 0.2
/* A label on a slice's row sits at most this far beside it, pt (common practice). */
#define PP_SLICE_LABEL_REACH 150.0

typedef struct {
  guint mark;
  pp_quad q;
  double y0, y1;     /* top and bottom edge, page y */
  double w0, w1;     /* widths of the top and bottom edges (0 at an apex) */
  double xc;         /* centre line */
  gboolean straight; /* vertical sides: a rectangle */
  double ink;
  pp_rect box;
  const pp_label *label;
} slice;

/* A horizontal edge of the quad at y within tol: its width, or −1. */
static double edge_width_at(const pp_quad *q, double y, double *xc) {
  int n = q->kind == PP_QUAD_TRIANGLE ? 3 : 4;
  for (int i = 0; i < n; i++) {
    pp_point a = q->p[i], b = q->p[(i + 1) % n];
    if (fabs(a.y - y) <= PP_SLICE_TOL && fabs(b.y - y) <= PP_SLICE_TOL &&
        fabs(a.x - b.x) > PP_SLICE_TOL) {
      *xc = (a.x + b.x) / 2;
      return fabs(a.x - b.x);
    }
  }
  for (int i = 0; i < n; i++)
    if (fabs(q->p[i].y - y) <= PP_SLICE_TOL) { /* an apex */
      *xc = q->p[i].x;
      return 0;
    }
  return -1;
}

static GArray *collect(const pp_recognize_ctx *ctx) {
  GArray *out = g_array_new(FALSE, FALSE, sizeof(slice));
  for (guint i = 0; i < ctx->scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(ctx->scene->marks, i);
    slice s = {.mark = i, .ink = m->ink, .box = m->bbox};
    if (m->kind != PP_MARK_FILL || !(m->ink > 0) || !pp_claims_mark_free(ctx->claims, i) ||
        g_hash_table_contains(ctx->glyph_marks, GUINT_TO_POINTER(i)) ||
        pp_page_sized(ctx->scene, m->bbox) || !pp_path_as_quad(m->path, PP_SLICE_TOL, &s.q))
      continue;
    s.y0 = m->bbox.y0, s.y1 = m->bbox.y1;
    double c0, c1;
    s.w0 = edge_width_at(&s.q, s.y0, &c0);
    s.w1 = edge_width_at(&s.q, s.y1, &c1);
    /* horizontal top and bottom (one may be an apex), centred on one line */
    if (s.w0 < 0 || s.w1 < 0 || (s.w0 == 0 && s.w1 == 0) ||
        fabs(c0 - c1) > PP_SLICE_TOL + 0.01 * fmax(s.w0, s.w1))
      continue;
    s.xc = (c0 + c1) / 2;
    s.straight = fabs(s.w0 - s.w1) <= PP_SLICE_TOL;
    g_array_append_val(out, s);
  }
  return out;
}

static int cmp_top(gconstpointer a, gconstpointer b) {
  const slice *sa = a, *sb = b;
  return (sa->y0 > sb->y0) - (sa->y0 < sb->y0);
}

/* Does b continue a downwards: touching, centred, the shared edge of one width? */
static gboolean continues(const slice *a, const slice *b) {
  double gap = b->y0 - a->y1, thin = fmin(a->y1 - a->y0, b->y1 - b->y0);
  double wide = fmax(fmax(a->w0, a->w1), fmax(b->w0, b->w1));
  return gap >= -1.0 && gap <= PP_SLICE_GAP_SHARE * thin + 1.5 &&
         fabs(a->xc - b->xc) <= PP_SLICE_CENTRE_SHARE * wide + 1 &&
         (fabs(a->w1 - b->w0) <= PP_SLICE_WIDTH_SHARE * wide + 1 ||
          (a->straight && b->straight)); /* a stepped funnel of centred bars */
}

/* A relative margin around the continuation window: far above a double's rounding, so
 * the window never leaves out a slice continues() would take. */
#define PP_SLICE_SEARCH_SLACK 1e-6

/* Where a slice continuing a can start: continues() needs a gap of at least -1 pt and at
 * most PP_SLICE_GAP_SHARE of the thinner slice (so of a) plus 1.5 pt, so its top lies in
 * [*lo, *hi]. */
static void continuation_tops(const slice *a, double *lo, double *hi) {
  double h = fabs(a->y1 - a->y0);
  double slack = PP_SLICE_SEARCH_SLACK * (1 + fabs(a->y1) + h);
  *lo = a->y1 - 1.0 - slack;
  *hi = a->y1 + PP_SLICE_GAP_SHARE * h + 1.5 + slack;
}

/* Links each slice (in order of top) to the first later one that continues it and has
 * none above yet. When every slice's numbers are finite, only the slices whose top and
 * centre line can pass continues() are tried, found in a grid over (centre, top): the
 * centres agree within PP_SLICE_CENTRE_SHARE of the wider plus 1 pt, so within that
 * share of the page's widest slice. A page of 10^5 tiles otherwise tried every later
 * slice of the next row for each. */
static void link_slices(GArray *slices, int *next, gboolean *has_prev) {
  guint n = slices->len;
  double widest = 0;
  gboolean finite = TRUE;
  for (guint i = 0; i < n && finite; i++) {
    const slice *s = &g_array_index(slices, slice, i);
    finite =
        isfinite(s->y0) && isfinite(s->y1) && isfinite(s->xc) && isfinite(s->w0) && isfinite(s->w1);
    widest = fmax(widest, fmax(fabs(s->w0), fabs(s->w1)));
  }
  double reach = PP_SLICE_CENTRE_SHARE * widest + 1;
  finite = finite && isfinite(reach);
  g_autoptr(pp_box_grid) grid = NULL;
  g_autoptr(GArray) near = g_array_new(FALSE, FALSE, sizeof(guint));
  if (finite) {
    g_autofree pp_rect *pts = g_new(pp_rect, MAX(n, 1));
    for (guint i = 0; i < n; i++) {
      const slice *s = &g_array_index(slices, slice, i);
      pts[i] = (pp_rect){s->xc, s->y0, s->xc, s->y0};
    }
    grid = pp_box_grid_new(pts, n);
  }
  for (guint i = 0; i < n; i++) {
    const slice *a = &g_array_index(slices, slice, i);
    next[i] = -1;
    if (!finite) {
      for (guint k = i + 1; k < n && next[i] < 0; k++)
        if (!has_prev[k] && continues(a, &g_array_index(slices, slice, k))) {
          next[i] = (int)k;
          has_prev[k] = TRUE;
        }
      continue;
    }
    double lo, hi, dx = reach + PP_SLICE_SEARCH_SLACK * (1 + fabs(a->xc) + reach);
    continuation_tops(a, &lo, &hi);
    pp_box_grid_query(grid, (pp_rect){a->xc - dx, lo, a->xc + dx, hi}, near);
    for (guint j = 0; j < near->len && next[i] < 0; j++) { /* ascending: the first wins */
      guint k = g_array_index(near, guint, j);
      if (k > i && !has_prev[k] && continues(a, &g_array_index(slices, slice, k))) {
        next[i] = (int)k;
        has_prev[k] = TRUE;
      }
    }
  }
}

/* The free number on the slice: inside its box, else on its row beside it, nearest. */
static const pp_label *label_of(const pp_recognize_ctx *ctx, const slice *s, GHashTable *used) {
  const pp_label *best = NULL;
  double best_d = INFINITY;
  for (guint k = 0; k < ctx->labels->len; k++) {
    const pp_label *l = g_ptr_array_index(ctx->labels, k);
    if (!pp_claims_label_free(ctx->claims, l->index) || g_hash_table_contains(used, l) ||
        l->centre.y < s->y0 || l->centre.y > s->y1)
      continue;
    double d = l->centre.x < s->box.x0   ? s->box.x0 - l->box.x1
               : l->centre.x > s->box.x1 ? l->box.x0 - s->box.x1
                                         : -1; /* inside */
    if (d > PP_SLICE_LABEL_REACH)
      continue;
    if (d < best_d)
      best_d = d, best = l;
  }
  return best;
}

/* The slice's name: the nearest word on its row outside it that is not a number. */
static char *name_of(const pp_scene *scene, const slice *s) {
  const pp_text_run *best = NULL;
  double best_d = PP_SLICE_LABEL_REACH;
  for (guint i = 0; i < scene->words->len; i++) {
    const pp_text_run *w = g_ptr_array_index(scene->words, i);
    double cy = (w->box.y0 + w->box.y1) / 2;
    pp_number num;
    if (cy < s->y0 || cy > s->y1 || pp_number_parse(w->text, PP_DECIMAL_UNKNOWN, &num))
      continue;
    double d = w->box.x0 >= s->box.x1   ? w->box.x0 - s->box.x1
               : w->box.x1 <= s->box.x0 ? s->box.x0 - w->box.x1
                                        : INFINITY;
    if (d < best_d)
      best_d = d, best = w;
  }
  return best ? g_strdup(best->text) : NULL;
}

static void build(pp_recognize_ctx *ctx, GArray *slices, guint from, guint to) {
  guint n = to - from;
  gboolean sloped = FALSE, widening = TRUE, narrowing = TRUE;
  for (guint i = from; i < to; i++) {
    const slice *s = &g_array_index(slices, slice, i);
    sloped |= !s->straight;
    widening &= s->w1 >= s->w0 - PP_SLICE_TOL;
    narrowing &= s->w1 <= s->w0 + PP_SLICE_TOL;
  }
  /* all straight: a stepped funnel only when the widths really change */
  double wmin = INFINITY, wmax = 0;
  for (guint i = from; i < to; i++) {
    const slice *s = &g_array_index(slices, slice, i);
    wmin = fmin(wmin, s->w0), wmax = fmax(wmax, s->w0);
  }
  gboolean stepped = !sloped && wmax > (1 + PP_SLICE_STEP_SHARE) * wmin;
  if (n < PP_SLICE_MIN_COUNT || !(sloped || stepped))
    return;
  if (sloped && !(widening || narrowing))
    return;
  if (stepped) { /* each bar no wider than the one above (funnel) or each wider (pyramid) */
    for (guint i = from + 1; i < to; i++) {
      const slice *a = &g_array_index(slices, slice, i - 1), *b = &g_array_index(slices, slice, i);
      widening &= b->w0 >= a->w0 - PP_SLICE_TOL;
      narrowing &= b->w0 <= a->w0 + PP_SLICE_TOL;
    }
    if (!(widening || narrowing))
      return;
  }
  g_autoptr(GHashTable) used = g_hash_table_new(NULL, NULL);
  guint percent = 0;
  for (guint i = from; i < to; i++) {
    slice *s = &g_array_index(slices, slice, i);
    if (!(s->label = label_of(ctx, s, used)))
      return;
    g_hash_table_add(used, (gpointer)s->label);
    percent += s->label->number.percent;
  }
  pp_claims_begin(ctx->claims);
  pp_figure *fig = pp_figure_new(PP_FIGURE_PYRAMID);
  fig->recognizer = OWNER;
  double total = 0;
  for (guint i = from; i < to; i++) {
    slice *s = &g_array_index(slices, slice, i);
    pp_element e = pp_element_init(PP_ENCODING_AREA);
    pp_element_add_part(&e, s->mark, PP_PART_BODY, s->ink);
    pp_claims_take_mark(ctx->claims, s->mark, OWNER);
    pp_claims_take_label(ctx->claims, s->label->index, PP_OWNER_DATA_LABEL);
    e.ink = s->ink;
    e.box = s->box;
    e.extent = s->y1 - s->y0;
    e.shape.kind = PP_SHAPE_QUAD;
    memcpy(e.shape.quad.p, s->q.p, sizeof e.shape.quad.p);
    e.value = e.label_value = s->label->number.value;
    e.label_text = g_strdup(s->label->text);
    e.source = s->label->number.percent ? PP_VALUE_PERCENT_LABEL : PP_VALUE_DATA_LABEL;
    e.category = name_of(ctx->scene, s);
    total += e.value;
    fig->bbox = pp_rect_union(fig->bbox, s->box);
    g_array_append_val(fig->elements, e);
  }
  for (guint i = 0; i < fig->elements->len; i++) {
    pp_element *e = &g_array_index(fig->elements, pp_element, i);
    e->share = total > 0 ? e->value / total : NAN;
  }
  fig->n_series = 1;
  pp_figure_add_evidence(fig, "stacked-slices", 1);
  pp_figure_add_evidence(fig, percent == n ? "percent-labels" : "data-labels", 1);
  pp_claims_commit(ctx->claims);
  pp_figure_finish(ctx, fig, NULL);
}

void pp_recognize_pyramids(pp_recognize_ctx *ctx) {
  g_autoptr(GArray) slices = collect(ctx);
  g_array_sort(slices, cmp_top);
  /* chains of slices, each continuing the one above */
  g_autofree int *next = g_new(int, MAX(slices->len, 1));
  g_autofree gboolean *has_prev = g_new0(gboolean, MAX(slices->len, 1));
  link_slices(slices, next, has_prev);
  for (guint i = 0; i < slices->len; i++) {
    if (has_prev[i])
      continue;
    /* reorder the chain contiguously into a scratch array and build */
    g_autoptr(GArray) chain = g_array_new(FALSE, FALSE, sizeof(slice));
    for (int k = (int)i; k >= 0; k = next[k])
      g_array_append_val(chain, g_array_index(slices, slice, k));
    build(ctx, chain, 0, chain->len);
  }
}
