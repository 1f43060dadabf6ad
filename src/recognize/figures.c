/* figures.c — the stage's entry point: labels → axes → bars, areas, lines → figures,
 * plus what could not be read (scale failures, raster images) for the coverage. */
#include <math.h>
#include <string.h>

#define G_LOG_DOMAIN "plotproof-recognize"
#include "internal.h"

/* An image at least this big (pt²) could be a chart drawn as a picture (about 5×5 cm,
 * common practice, no source); smaller ones are logos and icons. */
#define PP_RASTER_FIGURE_MIN_AREA 2000.0

const char *pp_figure_kind_name(pp_figure_kind kind) {
  static const char *names[] = {"column", "bar", "area", "line", "other"};
  return kind <= PP_FIGURE_OTHER ? names[kind] : "other";
}

pp_figure *pp_figure_new(pp_figure_kind kind) {
  pp_figure *f = g_new0(pp_figure, 1);
  f->kind = kind;
  f->elements = g_array_new(FALSE, TRUE, sizeof(pp_element));
  f->bbox = pp_rect_empty();
  return f;
}

void pp_figure_free(pp_figure *f) {
  if (!f)
    return;
  for (guint i = 0; i < f->elements->len; i++) {
    pp_element *e = &g_array_index(f->elements, pp_element, i);
    g_free(e->label_text);
    g_free(e->category);
  }
  g_array_unref(f->elements);
  pp_axis_free(f->axis);
  g_free(f->fingerprint);
  g_free(f->title);
  g_free(f);
}

/* Content, not position: the same chart moved to another page keeps its id. */
void pp_figure_set_fingerprint(pp_figure *f) {
  GChecksum *ck = g_checksum_new(G_CHECKSUM_SHA256);
  const char *kind = pp_figure_kind_name(f->kind);
  g_checksum_update(ck, (const guchar *)kind, -1);
  for (guint i = 0; i < f->elements->len; i++) {
    const pp_element *e = &g_array_index(f->elements, pp_element, i);
    char buf[96];
    g_snprintf(buf, sizeof buf, "|%.4g|%.4g|%.4g", e->tip_value, e->base_value,
               e->extent > 0 ? e->ink / e->extent : 0);
    g_checksum_update(ck, (const guchar *)buf, -1);
    if (e->category)
      g_checksum_update(ck, (const guchar *)e->category, -1);
  }
  if (f->axis)
    for (guint i = 0; i < f->axis->ticks->len; i++) {
      const pp_tick *t = &g_array_index(f->axis->ticks, pp_tick, i);
      g_checksum_update(ck, (const guchar *)t->label, -1);
    }
  f->fingerprint = g_strndup(g_checksum_get_string(ck), 16);
  g_checksum_free(ck);
}

static pp_axis *axis_copy(const pp_axis *a) {
  pp_axis *c = g_memdup2(a, sizeof *a);
  c->ticks = g_array_new(FALSE, FALSE, sizeof(pp_tick));
  for (guint i = 0; i < a->ticks->len; i++) {
    pp_tick t = g_array_index(a->ticks, pp_tick, i);
    t.label = g_strdup(t.label);
    g_array_append_val(c->ticks, t);
  }
  return c;
}

/* The visible value range is the plot box along the axis. */
static void set_axis_range(pp_figure *f, const pp_axis_candidate *cand) {
  f->axis = axis_copy(cand->axis);
  double p0 = f->axis->vertical ? f->bbox.y0 : f->bbox.x0;
  double p1 = f->axis->vertical ? f->bbox.y1 : f->bbox.x1;
  p0 = fmin(p0, cand->span0), p1 = fmax(p1, cand->span1);
  double v0 = pp_axis_value_at(f->axis, p0), v1 = pp_axis_value_at(f->axis, p1);
  f->axis->min_value = fmin(v0, v1);
  f->axis->max_value = fmax(v0, v1);
}

/* A nearby line above the plot that is not a number: the chart's title. */
static void find_title(const pp_scene *scene, pp_figure *f) {
  const pp_text_line *best = NULL;
  double best_d = 60;
  for (guint i = 0; i < scene->lines->len; i++) {
    const pp_text_line *l = g_ptr_array_index(scene->lines, i);
    double d = f->bbox.y0 - l->box.y1;
    pp_number num;
    /* tick labels above the plot are numbers; titles are not */
    if (pp_number_parse(l->text, PP_DECIMAL_UNKNOWN, &num) ||
        (f->axis && pp_rect_area(pp_rect_intersect(l->box, f->axis->box)) > 0))
      continue;
    if (d < -2 || d > best_d || l->box.x1 < f->bbox.x0 - 40 || l->box.x0 > f->bbox.x1)
      continue;
    best_d = d;
    best = l;
  }
  if (best)
    f->title = g_strdup(best->text);
}

/* A mark that draws data without standing for a number by its ink: a polyline, or a
 * small marker of a scatter plot. */
static gboolean is_line_mark(const pp_mark *m) {
  pp_rect r = m->bbox;
  if (m->kind == PP_MARK_STROKE)
    return m->path->n_segs >= 4 && pp_rect_width(r) >= 1 && pp_rect_height(r) >= 1;
  pp_rect rect;
  return m->kind == PP_MARK_FILL && m->path->n_segs >= 4 && pp_rect_width(r) < 15 &&
         pp_rect_height(r) < 15 && pp_rect_area(r) > 1 &&
         !pp_path_is_rectangle(m->path, 0.01, &rect);
}

/* Lines and markers beside a fitted axis: a line chart, honest at any baseline. */
static pp_figure *line_figure(const pp_scene *scene, const pp_axis_candidate *cand,
                              GPtrArray *all_axes) {
  pp_rect box = pp_rect_empty();
  const pp_axis *axis = cand->axis;
  double span = cand->span1 - cand->span0, lo, hi;
  pp_axis_reach(cand, all_axes, cand->side ? cand->side : +1, &lo, &hi);
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    if (!is_line_mark(m))
      continue;
    pp_rect r = m->bbox;
    double u0 = axis->vertical ? r.y0 : r.x0, u1 = axis->vertical ? r.y1 : r.x1;
    if (u0 < cand->span0 - 0.6 * span - 10 || u1 > cand->span1 + 0.6 * span + 10)
      continue;
    double w0 = axis->vertical ? r.x0 : r.y0, w1 = axis->vertical ? r.x1 : r.y1;
    if (w0 >= lo && w1 <= hi) /* beside the labels, before the next axis */
      box = pp_rect_union(box, r);
  }
  if (pp_rect_is_empty(box))
    return NULL;
  /* the data must start near the labels, not in the next chart over */
  double dist = axis->vertical ? fabs((cand->side > 0 ? box.x0 : box.x1) -
                                      (cand->side > 0 ? axis->box.x1 : axis->box.x0))
                               : fmin(fabs(box.y1 - axis->box.y0), fabs(box.y0 - axis->box.y1));
  if (dist > 60)
    return NULL;
  /* The plot spans the axis' ticks, however flat the line. */
  if (axis->vertical)
    box.y0 = fmin(box.y0, cand->span0), box.y1 = fmax(box.y1, cand->span1);
  else
    box.x0 = fmin(box.x0, cand->span0), box.x1 = fmax(box.x1, cand->span1);
  pp_figure *f = pp_figure_new(PP_FIGURE_LINE);
  f->bbox = box;
  return f;
}

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

static void add_figure(pp_page_charts *out, const pp_scene *scene, pp_figure *f,
                       const pp_axis_candidate *cand) {
  if (cand) {
    set_axis_range(f, cand);
    for (guint i = 0; i < cand->labels->len; i++)
      ((pp_label *)g_ptr_array_index(cand->labels, i))->on_axis = TRUE;
  }
  find_title(scene, f);
  pp_figure_set_fingerprint(f);
  g_ptr_array_add(out->figures, f);
}

/* Is there an unread bar chart beside this axis? Then its failed scale matters: three
 * or more unused bars within reach that share an edge along the axis and differ in
 * length. Tables (rules, equal row shading) have labels too, but no such bars. */
static gboolean has_bars_beside(GArray *bars, const pp_axis_candidate *c) {
  gboolean vertical = c->axis->vertical;
  pp_rect ab = c->axis->box;
  GArray *near = g_array_new(FALSE, FALSE, sizeof(pp_rect));
  for (guint i = 0; i < bars->len; i++) {
    pp_bar_candidate *b = &g_array_index(bars, pp_bar_candidate, i);
    double d = vertical ? fmin(fabs(b->rect.x0 - ab.x1), fabs(ab.x0 - b->rect.x1))
                        : fmin(fabs(b->rect.y1 - ab.y0), fabs(ab.y1 - b->rect.y0));
    if (!b->used && d < 150)
      g_array_append_val(near, b->rect);
  }
  gboolean found = FALSE;
  for (guint i = 0; i < near->len && !found; i++) {
    pp_rect a = g_array_index(near, pp_rect, i);
    double edges[2] = {vertical ? a.y0 : a.x0, vertical ? a.y1 : a.x1};
    for (int e = 0; e < 2 && !found; e++) {
      guint sharing = 0;
      double shortest = INFINITY, longest = 0;
      for (guint j = 0; j < near->len; j++) {
        pp_rect r = g_array_index(near, pp_rect, j);
        double u0 = vertical ? r.y0 : r.x0, u1 = vertical ? r.y1 : r.x1;
        if (fabs(u0 - edges[e]) < 0.05 || fabs(u1 - edges[e]) < 0.05) {
          sharing++;
          shortest = fmin(shortest, u1 - u0);
          longest = fmax(longest, u1 - u0);
        }
      }
      found = sharing >= 3 && longest - shortest > 0.5 && longest >= 0.1 * (c->span1 - c->span0);
    }
  }
  g_array_unref(near);
  return found;
}

pp_page_charts *pp_page_charts_find(const pp_scene *scene) {
  pp_page_charts *out = pp_page_charts_new();

  GHashTable *glyph_marks = g_hash_table_new(NULL, NULL);
  GPtrArray *labels = pp_labels_collect(scene, glyph_marks);
  GPtrArray *axes = pp_axes_find(scene, labels);
  GArray *bars = pp_bar_candidates_collect(scene, glyph_marks);
  GPtrArray *areas = pp_area_candidates_collect(scene);

  /* Year rows name categories: their labels are never data labels of a bar. */
  for (guint i = 0; i < axes->len; i++) {
    pp_axis_candidate *c = g_ptr_array_index(axes, i);
    for (guint k = 0; c->category && k < c->labels->len; k++)
      ((pp_label *)g_ptr_array_index(c->labels, k))->on_axis = TRUE;
  }
  /* First every axis on the side its labels face, then the ones still empty on the
   * other side: with two value axes, the bars go to the axis that faces them. */
  gboolean *figured = g_new0(gboolean, MAX(axes->len, 1));
  for (int pass = 0; pass < 2; pass++) {
    for (guint i = 0; i < axes->len; i++) {
      pp_axis_candidate *c = g_ptr_array_index(axes, i);
      if (c->fit_failed || figured[i]) {
        if (pass == 0 && c->fit_failed)
          g_debug("axis candidate %u labels [%s..]: %s", c->labels->len,
                  c->labels->len ? ((pp_label *)g_ptr_array_index(c->labels, 0))->text : "",
                  c->reason);
        continue;
      }
      int side = c->side ? (pass ? -c->side : c->side) : (pass ? +1 : -1);
      /* The axis' own labels must not be taken for data labels while its bars are read. */
      for (guint k = 0; k < c->labels->len; k++)
        ((pp_label *)g_ptr_array_index(c->labels, k))->on_axis = TRUE;
      pp_figure *f = pp_bar_figure_build(scene, bars, c, side, labels, axes);
      if (!f)
        f = pp_area_figure_build(scene, areas, c, side, axes);
      g_debug("axis %s %u labels [%s..%s] side %d: %s",
              c->axis->vertical ? "vertical" : "horizontal", c->labels->len,
              ((pp_label *)g_ptr_array_index(c->labels, 0))->text,
              ((pp_label *)g_ptr_array_index(c->labels, c->labels->len - 1))->text, side,
              f ? pp_figure_kind_name(f->kind) : "no figure");
      if (f) {
        figured[i] = TRUE;
        add_figure(out, scene, f, c);
      } else {
        for (guint k = 0; k < c->labels->len; k++)
          ((pp_label *)g_ptr_array_index(c->labels, k))->on_axis = FALSE;
      }
    }
  }
  for (pp_figure *f; (f = pp_bar_figure_from_labels(scene, bars, labels));)
    add_figure(out, scene, f, NULL);
  /* Lines only where no bar or area figure took the axis. */
  for (guint i = 0; i < axes->len; i++) {
    pp_axis_candidate *c = g_ptr_array_index(axes, i);
    if (c->fit_failed || figured[i] || !c->axis->vertical)
      continue;
    pp_figure *f = line_figure(scene, c, axes);
    if (f)
      add_figure(out, scene, f, c);
  }
  g_free(figured);
  for (guint i = 0; i < axes->len; i++) {
    pp_axis_candidate *c = g_ptr_array_index(axes, i);
    if (!c->fit_failed || c->category || c->labels->len < 3 || !has_bars_beside(bars, c))
      continue;
    pp_scale_failure *s = g_new0(pp_scale_failure, 1);
    s->bbox = c->axis->box;
    s->reason = g_strdup(c->reason);
    g_ptr_array_add(out->scale_failures, s);
  }
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    if (m->kind == PP_MARK_IMAGE && pp_rect_area(m->visible_bbox) >= PP_RASTER_FIGURE_MIN_AREA)
      g_array_append_val(out->raster_images, m->visible_bbox);
  }
  g_ptr_array_unref(areas);
  g_array_unref(bars);
  g_hash_table_unref(glyph_marks);
  g_ptr_array_unref(axes);
  g_ptr_array_unref(labels);
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
