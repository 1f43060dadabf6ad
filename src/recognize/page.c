/* page.c — the stage's entry point: labels, axes and candidates of one page, the
 * recognizer table run over them with one claims ledger, then what could not be read
 * (scale failures, raster images) for the coverage. */
#include <math.h>

#define G_LOG_DOMAIN "plotproof-recognize"
#include "internal.h"

/* An image at least this big (pt²) could be a chart drawn as a picture (about 5×5 cm,
 * common practice, no source); smaller ones are logos and icons. */
#define PP_RASTER_FIGURE_MIN_AREA 2000.0
/* A failed scale matters when unread bars stand within this of its labels, pt (common
 * practice, no source). */
#define PP_FAILED_SCALE_BAR_REACH 150.0
/* ...at least this many sharing an edge (fewer are a legend or a stray pair; common
 * practice, no source)... */
#define PP_FAILED_SCALE_MIN_BARS 3
/* ...differing in length by more than this, pt (equal rows are table shading; common
 * practice, no source)... */
#define PP_FAILED_SCALE_MIN_SPREAD 0.5
/* ...the longest at least this share of the tick span (common practice, no source). */
#define PP_FAILED_SCALE_MIN_LONGEST 0.1

void pp_scale_failure_free(pp_scale_failure *s) {
  if (!s)
    return;
  g_free(s->reason);
  g_free(s);
}

pp_page_charts *pp_page_charts_new(void) {
  pp_page_charts *out = g_new0(pp_page_charts, 1);
  out->figures = g_ptr_array_new_with_free_func((GDestroyNotify)pp_figure_free);
  out->scale_failures = g_ptr_array_new_with_free_func((GDestroyNotify)pp_scale_failure_free);
  out->raster_images = g_array_new(FALSE, FALSE, sizeof(pp_rect));
  return out;
}

void pp_page_charts_free(pp_page_charts *charts) {
  if (!charts)
    return;
  g_ptr_array_unref(charts->figures);
  g_ptr_array_unref(charts->scale_failures);
  g_array_unref(charts->raster_images);
  g_free(charts);
}

/* A margin around the edge search, pt: far above a double's spacing at page coordinates,
 * so rounding never leaves out a bar pp_on_edge would count. */
#define PP_FAILED_SCALE_SEARCH_SLACK 1e-6

static int cmp_guint(gconstpointer a, gconstpointer b) {
  guint x = *(const guint *)a, y = *(const guint *)b;
  return (x > y) - (x < y);
}

/* Is there an unread bar chart beside this axis? Then its failed scale matters: a few
 * unclaimed bars within reach that share an edge along the axis and differ in length.
 * Tables (rules, equal row shading) have labels too, but no such bars. */
/* Whether a bar is within reach of the axis box ab. */
static inline gboolean bar_near(pp_rect b, pp_rect ab, gboolean vertical) {
  double d = vertical ? fmin(fabs(b.x0 - ab.x1), fabs(ab.x0 - b.x1))
                      : fmin(fabs(b.y1 - ab.y0), fabs(ab.y1 - b.y0));
  return d < PP_FAILED_SCALE_BAR_REACH;
}

/* free_bars: the rectangles of the unclaimed bars, in page order. */
static gboolean has_bars_beside(GArray *free_bars, const pp_axis_candidate *c) {
  gboolean vertical = c->scale->vertical;
  pp_rect ab = c->scale->box;
  /* The bars on any one edge are some of the near bars, so their spread of lengths is at
   * most the near bars' own and their longest at most the near bars' longest: when these
   * already fail the test below, no edge passes it (a page of equal tiles), and the edges
   * need not be searched. */
  double shortest_near = INFINITY, longest_near = 0;
  for (guint i = 0; i < free_bars->len; i++)
    if (bar_near(g_array_index(free_bars, pp_rect, i), ab, vertical)) {
      pp_frame_rect r = pp_frame_of(g_array_index(free_bars, pp_rect, i), vertical);
      shortest_near = fmin(shortest_near, r.u1 - r.u0);
      longest_near = fmax(longest_near, r.u1 - r.u0);
    }
  if (!(longest_near - shortest_near > PP_FAILED_SCALE_MIN_SPREAD &&
        longest_near >= PP_FAILED_SCALE_MIN_LONGEST * (c->span1 - c->span0)))
    return FALSE;
  GArray *near = g_array_new(FALSE, FALSE, sizeof(pp_rect));
  for (guint i = 0; i < free_bars->len; i++)
    if (bar_near(g_array_index(free_bars, pp_rect, i), ab, vertical))
      g_array_append_val(near, g_array_index(free_bars, pp_rect, i));
  gboolean found = FALSE;
  /* The near bars' ends along the axis in order, so that the bars on an edge are found by
   * binary search: a page of tiles has as many edges as rows, each tried once. */
  g_autofree double *ends = g_new(double, MAX(near->len, 1));
  pp_coord_index *by_end[2];
  for (int side = 0; side < 2; side++) {
    for (guint j = 0; j < near->len; j++) {
      pp_frame_rect r = pp_frame_of(g_array_index(near, pp_rect, j), vertical);
      ends[j] = side ? r.u1 : r.u0;
    }
    by_end[side] = pp_coord_index_new(ends, near->len);
  }
  g_autoptr(GArray) on = g_array_new(FALSE, FALSE, sizeof(guint));
  /* Each edge is counted once: bars of a grid share their edges by the row. */
  GHashTable *tried = g_hash_table_new_full(g_double_hash, g_double_equal, g_free, NULL);
  for (guint i = 0; i < near->len && !found; i++) {
    pp_frame_rect a = pp_frame_of(g_array_index(near, pp_rect, i), vertical);
    double edges[2] = {a.u0, a.u1};
    for (int e = 0; e < 2 && !found; e++) {
      if (g_hash_table_contains(tried, &edges[e]))
        continue;
      g_hash_table_add(tried, g_memdup2(&edges[e], sizeof(double)));
      guint sharing = 0;
      double shortest = INFINITY, longest = 0;
      /* pp_on_edge needs an end within PP_SAME_EDGE_TOL of the edge; the margin keeps
       * rounding inside the search (the exact test decides). */
      double reach = PP_SAME_EDGE_TOL + PP_FAILED_SCALE_SEARCH_SLACK;
      g_array_set_size(on, 0);
      for (int side = 0; side < 2; side++)
        pp_coord_index_range(by_end[side], edges[e] - reach, edges[e] + reach, on);
      g_array_sort(on, cmp_guint);
      for (guint k = 0; k < on->len; k++) {
        guint j = g_array_index(on, guint, k);
        if (k > 0 && g_array_index(on, guint, k - 1) == j)
          continue;
        pp_frame_rect r = pp_frame_of(g_array_index(near, pp_rect, j), vertical);
        if (pp_on_edge(r.u0, r.u1, edges[e])) {
          sharing++;
          shortest = fmin(shortest, r.u1 - r.u0);
          longest = fmax(longest, r.u1 - r.u0);
        }
      }
      found = sharing >= PP_FAILED_SCALE_MIN_BARS &&
              longest - shortest > PP_FAILED_SCALE_MIN_SPREAD &&
              longest >= PP_FAILED_SCALE_MIN_LONGEST * (c->span1 - c->span0);
    }
  }
  g_hash_table_unref(tried);
  pp_coord_index_free(by_end[0]);
  pp_coord_index_free(by_end[1]);
  g_array_unref(near);
  return found;
}

static void add_scale_failures(pp_recognize_ctx *ctx) {
  /* The unclaimed bars, listed once on the first failed scale (nothing is claimed from
   * here on): a page of tiles has as many failed scales as rows and columns of numbers. */
  g_autoptr(GArray) free_bars = NULL;
  for (guint i = 0; i < ctx->axes->len; i++) {
    pp_axis_candidate *c = g_ptr_array_index(ctx->axes, i);
    if (!c->fit_failed || c->category || c->labels->len < 3)
      continue;
    if (!free_bars) {
      free_bars = g_array_new(FALSE, FALSE, sizeof(pp_rect));
      for (guint k = 0; k < ctx->bars->len; k++) {
        const pp_bar_candidate *b = &g_array_index(ctx->bars, pp_bar_candidate, k);
        if (pp_claims_mark_free(ctx->claims, b->mark))
          g_array_append_val(free_bars, b->rect);
      }
    }
    if (!has_bars_beside(free_bars, c))
      continue;
    pp_scale_failure *s = g_new0(pp_scale_failure, 1);
    s->bbox = c->scale->box;
    s->reason = g_strdup(c->reason);
    g_ptr_array_add(ctx->out->scale_failures, s);
  }
}

static void add_raster_images(const pp_scene *scene, pp_page_charts *out) {
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    if (m->kind == PP_MARK_IMAGE && pp_rect_area(m->visible_bbox) >= PP_RASTER_FIGURE_MIN_AREA)
      g_array_append_val(out->raster_images, m->visible_bbox);
  }
}

pp_page_charts *pp_page_charts_find(const pp_scene *scene) {
  pp_recognize_ctx ctx = {0};
  ctx.scene = scene;
  ctx.out = pp_page_charts_new();
  ctx.glyph_marks = g_hash_table_new(NULL, NULL);
  ctx.labels = pp_labels_collect(scene, ctx.glyph_marks);
  ctx.axes = pp_axes_find(scene, ctx.labels);
  ctx.bars = pp_bar_candidates_collect(scene, ctx.glyph_marks);
  ctx.areas = pp_area_candidates_collect(scene);
  ctx.claims = pp_claims_new(scene->marks->len, ctx.labels->len);

  /* Year rows name categories: their labels are never data labels of a bar. */
  for (guint i = 0; i < ctx.axes->len; i++) {
    const pp_axis_candidate *c = g_ptr_array_index(ctx.axes, i);
    for (guint k = 0; c->category && k < c->labels->len; k++) {
      const pp_label *l = g_ptr_array_index(c->labels, k);
      pp_claims_take_label_if_free(ctx.claims, l->index, PP_OWNER_CATEGORY_AXIS);
    }
  }
  for (guint i = 0; i < pp_n_recognizers; i++) {
    pp_recognizers[i].run(&ctx);
    g_assert(pp_claims_depth(ctx.claims) == 0); /* every transaction closed */
  }
  add_scale_failures(&ctx);
  add_raster_images(scene, ctx.out);

  pp_claims_free(ctx.claims);
  if (ctx.wedges)
    g_array_unref(ctx.wedges);
  pp_bar_text_free(ctx.bar_text);
  pp_legend_words_free(ctx.legend_words);
  g_ptr_array_unref(ctx.areas);
  g_array_unref(ctx.bars);
  g_hash_table_unref(ctx.glyph_marks);
  g_ptr_array_unref(ctx.axes);
  g_ptr_array_unref(ctx.labels);
  return ctx.out;
}
