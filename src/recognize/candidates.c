/* candidates.c — which painted marks could encode a value: filled or hatched axis-aligned
 * rectangles (bars) and filled polygons (areas), each with its visible extent. */
#include <math.h>

#include "internal.h"

/* Fills more transparent than this are knock-outs (common practice, no source)... */
#define PP_BLANK_ALPHA 0.02
/* ...and solid fills lighter than this in every channel are white backgrounds (0.985:
 * 251 of 255; common practice, no source). */
#define PP_BLANK_WHITE 0.985
/* A word covering at least this share of a box on both sides makes it a text
 * background (common practice, no source). */
#define PP_BEHIND_TEXT_SHARE 0.5
/* An outline holds hatching when at least this many slanted strokes lie inside it (R's
 * density draws many; two could be a cross; common practice, no source)... */
#define PP_HATCH_MIN_LINES 3
/* ...inside it within this, pt, each slanted: wider and taller than this, pt (common
 * practice, no source)... */
#define PP_HATCH_INSIDE_TOL 0.5
#define PP_HATCH_SLANT 0.1
/* ...and the outline at least this big on both sides, pt (common practice, no source). */
#define PP_HATCHED_MIN_SIDE 2.0
/* Bars are at least this thick on both sides, pt: thinner fills are rules and hairlines
 * (common practice, no source). */
#define PP_BAR_MIN_SIDE 0.2
/* Areas put at least this much ink on the page, pt² (about 7×7 pt: smaller are markers
 * and glyphs; common practice, no source)... */
#define PP_AREA_MIN_INK 50.0
/* ...and their curves are flattened to this tolerance, pt (common practice, no source). */
#define PP_AREA_FLATTEN_TOL 0.05

static gboolean is_blank(const pp_paint *p) {
  /* White or fully transparent fills are backgrounds and knock-outs, not bars. */
  if (p->a < PP_BLANK_ALPHA)
    return TRUE;
  return p->kind == PP_PAINT_SOLID && p->r > PP_BLANK_WHITE && p->g > PP_BLANK_WHITE &&
         p->b > PP_BLANK_WHITE;
}

/* The page's words by position, so that a candidate looks only at the words touching it
 * (a page of a thousand labelled tiles has as many words as boxes). Words whose box is
 * empty (a NaN corner passes the overlap test) or reaches beyond PP_WORD_GRID_REACH are
 * not in the grid and are always tried. */
/* Far beyond any page, pt (ISO 32000-1 Annex C: at most 14,400 units a side), and small
 * enough that the grid's extent stays finite. */
#define PP_WORD_GRID_REACH 1e6
typedef struct {
  const pp_scene *scene;
  pp_box_grid *grid; /* over the words' boxes, on first use */
  GArray *unplaced;  /* guint: words with an empty box */
  GArray *near;      /* guint: scratch */
} word_lookup;

static void word_lookup_init(word_lookup *wl, const pp_scene *scene) {
  *wl = (word_lookup){scene, NULL, NULL, g_array_new(FALSE, FALSE, sizeof(guint))};
}

static void word_lookup_clear(word_lookup *wl) {
  pp_box_grid_free(wl->grid);
  if (wl->unplaced)
    g_array_unref(wl->unplaced);
  g_array_unref(wl->near);
}

/* A box behind a word that nearly fills it is a text background (a tag, a highlighted
 * cell), not a bar; data labels inside bars are numbers and leave most of it free. The
 * overlap must be half of r on both sides, so only words touching r can qualify (r is at
 * least PP_BAR_MIN_SIDE on both sides when this is asked). */
static gboolean covers(const pp_text_run *w, pp_rect r) {
  pp_rect in = pp_rect_intersect(w->box, r);
  pp_number num;
  return pp_rect_width(in) >= PP_BEHIND_TEXT_SHARE * pp_rect_width(r) &&
         pp_rect_height(in) >= PP_BEHIND_TEXT_SHARE * pp_rect_height(r) &&
         !pp_number_parse(w->text, PP_DECIMAL_UNKNOWN, &num);
}

static gboolean behind_text(word_lookup *wl, pp_rect r) {
  GPtrArray *words = wl->scene->words;
  if (!wl->grid) {
    g_autofree pp_rect *boxes = g_new(pp_rect, MAX(words->len, 1));
    wl->unplaced = g_array_new(FALSE, FALSE, sizeof(guint));
    for (guint i = 0; i < words->len; i++) {
      pp_rect b = ((const pp_text_run *)g_ptr_array_index(words, i))->box;
      gboolean placed = !pp_rect_is_empty(b) && fabs(b.x0) <= PP_WORD_GRID_REACH &&
                        fabs(b.y0) <= PP_WORD_GRID_REACH && fabs(b.x1) <= PP_WORD_GRID_REACH &&
                        fabs(b.y1) <= PP_WORD_GRID_REACH;
      boxes[i] = placed ? b : pp_rect_empty();
      if (!placed)
        g_array_append_val(wl->unplaced, i);
    }
    wl->grid = pp_box_grid_new(boxes, words->len);
  }
  for (guint k = 0; k < wl->unplaced->len; k++)
    if (covers(g_ptr_array_index(words, g_array_index(wl->unplaced, guint, k)), r))
      return TRUE;
  pp_box_grid_query(wl->grid, r, wl->near);
  for (guint k = 0; k < wl->near->len; k++)
    if (covers(g_ptr_array_index(words, g_array_index(wl->near, guint, k)), r))
      return TRUE;
  return FALSE;
}

/* Hatch lines: single slanted strokes, in page order. Slanted, because ticks and gridlines
 * inside a plot frame are axis-aligned. Listed once per page, since every outlined
 * rectangle (a table of a thousand cells has as many) looks for them. */
static GArray *hatch_lines(const pp_scene *scene) {
  GArray *lines = g_array_new(FALSE, FALSE, sizeof(guint));
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    if (m->kind == PP_MARK_STROKE && m->path->n_segs == 2 && m->path->segs[1].kind == PP_SEG_LINE &&
        pp_rect_width(m->bbox) > PP_HATCH_SLANT && pp_rect_height(m->bbox) > PP_HATCH_SLANT)
      g_array_append_val(lines, i);
  }
  return lines;
}

/* Hatch lines whose box lies within r, counted up to PP_HATCH_MIN_LINES. */
static guint count_hatching(const pp_scene *scene, GArray *lines, pp_rect r) {
  guint n = 0;
  for (guint k = 0; k < lines->len && n < PP_HATCH_MIN_LINES; k++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, g_array_index(lines, guint, k));
    n += pp_rect_contains(r, m->bbox, PP_HATCH_INSIDE_TOL);
  }
  return n;
}

/* An outlined rectangle filled with hatch lines, not paint (R's barplot(density = …)):
 * the reader sees the region, so the region is its ink. Unhatched outlines are table
 * cells, frames and legends, never bars. */
static void collect_hatched(const pp_scene *scene, GArray *out) {
  g_autoptr(GArray) lines = hatch_lines(scene);
  for (guint i = 0; i < scene->marks->len && lines->len >= PP_HATCH_MIN_LINES; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    pp_rect r;
    if (m->kind != PP_MARK_STROKE || !pp_path_is_rectangle(m->path, PP_RECT_TOL, &r) ||
        pp_rect_width(r) < PP_HATCHED_MIN_SIDE || pp_rect_height(r) < PP_HATCHED_MIN_SIDE ||
        count_hatching(scene, lines, r) < PP_HATCH_MIN_LINES)
      continue;
    pp_rect clip = pp_clip_bbox(m->clip);
    pp_rect vis = pp_rect_intersect(r, clip);
    if (pp_rect_is_empty(vis) || pp_page_sized(scene, vis))
      continue;
    pp_bar_candidate c = {i, vis, clip, pp_rect_area(vis), m->paint};
    g_array_append_val(out, c);
  }
}

/* A rectangle holding two or more others is a plot background, a chart wall or a frame.
 * Producers round geometry (LibreOffice to 1/100 mm, 0.028 pt), so bars may stick out
 * of their wall by that much. */
static GArray *rects_of(GArray *cands, guint n) {
  GArray *rects = g_array_sized_new(FALSE, FALSE, sizeof(pp_rect), n);
  for (guint i = 0; i < n; i++)
    g_array_append_val(rects, g_array_index(cands, pp_bar_candidate, i).rect);
  return rects;
}

static void drop_backgrounds(GArray *cands) {
  gboolean *background = g_new0(gboolean, MAX(cands->len, 1));
  /* the grid only narrows which candidates are tested */
  g_autoptr(GArray) rects = rects_of(cands, cands->len);
  g_autoptr(pp_box_grid) grid = pp_box_grid_new((const pp_rect *)rects->data, rects->len);
  g_autoptr(GArray) near = g_array_new(FALSE, FALSE, sizeof(guint));
  for (guint i = 0; i < cands->len; i++) {
    pp_bar_candidate *a = &g_array_index(cands, pp_bar_candidate, i);
    guint inside = 0;
    pp_box_grid_query_inside(grid, a->rect, PP_SAME_EDGE_TOL, near);
    for (guint n = 0; n < near->len && inside < 2; n++) {
      guint j = g_array_index(near, guint, n);
      pp_bar_candidate *b = &g_array_index(cands, pp_bar_candidate, j);
      inside += i != j && pp_rect_contains(a->rect, b->rect, PP_SAME_EDGE_TOL) &&
                pp_rect_area(b->rect) < pp_rect_area(a->rect);
    }
    background[i] = inside >= 2;
  }
  for (guint i = cands->len; i-- > 0;)
    if (background[i])
      g_array_remove_index(cands, i);
  g_free(background);
}

/* Adds one rectangle of a fill as a candidate, unless it is too thin, page-sized, behind
 * text, or a repaint (hatching, outlines) of the rectangle just added. */
static void add_rect(word_lookup *wl, GArray *out, guint mark, pp_rect r, double ink) {
  const pp_scene *scene = wl->scene;
  const pp_mark *m = g_ptr_array_index(scene->marks, mark);
  pp_rect clip = pp_clip_bbox(m->clip);
  pp_rect vis = pp_rect_intersect(r, clip);
  if (pp_rect_is_empty(vis) || pp_rect_width(vis) < PP_BAR_MIN_SIDE ||
      pp_rect_height(vis) < PP_BAR_MIN_SIDE || pp_page_sized(scene, vis) || behind_text(wl, vis))
    return;
  for (guint k = out->len; k-- > 0 && k + 8 >= out->len;) {
    pp_bar_candidate *c = &g_array_index(out, pp_bar_candidate, k);
    if (fabs(c->rect.x0 - vis.x0) < PP_RECT_TOL && fabs(c->rect.x1 - vis.x1) < PP_RECT_TOL &&
        fabs(c->rect.y0 - vis.y0) < PP_RECT_TOL && fabs(c->rect.y1 - vis.y1) < PP_RECT_TOL)
      return;
  }
  pp_bar_candidate c = {mark, vis, clip, isnan(ink) ? pp_rect_area(vis) : ink, m->paint};
  g_array_append_val(out, c);
}

/* The subpaths of a path, each as a path of its own (drawn ones only). */
static GPtrArray *split_subpaths(const pp_path *path) {
  GPtrArray *parts = g_ptr_array_new_with_free_func((GDestroyNotify)pp_path_free);
  pp_path *cur = NULL;
  for (size_t i = 0; i < path->n_segs; i++) {
    const pp_seg *s = &path->segs[i];
    if (s->kind == PP_SEG_MOVE || !cur) {
      cur = pp_path_new();
      g_ptr_array_add(parts, cur);
    }
    switch (s->kind) {
    case PP_SEG_MOVE: pp_path_move_to(cur, s->pt[0].x, s->pt[0].y); break;
    case PP_SEG_LINE: pp_path_line_to(cur, s->pt[0].x, s->pt[0].y); break;
    case PP_SEG_CURVE:
      pp_path_curve_to(cur, s->pt[0].x, s->pt[0].y, s->pt[1].x, s->pt[1].y, s->pt[2].x, s->pt[2].y);
      break;
    case PP_SEG_CLOSE: pp_path_close(cur); break;
    }
  }
  for (guint i = parts->len; i-- > 0;)
    if (((pp_path *)parts->pdata[i])->n_segs < 3)
      g_ptr_array_remove_index(parts, i);
  return parts;
}

/* Outline-only bars (the default of several plotting packages): a stroked rectangle that
 * repaints no filled one. The reader sees the outlined region, so the region is its ink
 * (docs/rules.md). Frames holding other marks leave with the backgrounds; cells, tags and
 * boxes are told apart later, by the evidence a chart must show (evidence.c). */
/* A margin added to the repaint tolerance for the grid query, pt, so that rounding in the
 * tests (which decide) never falls outside it: far above a double's spacing at page
 * coordinates. */
#define PP_REPAINT_SEARCH_SLACK 1e-6

static void collect_outlined(word_lookup *wl, GArray *out) {
  const pp_scene *scene = wl->scene;
  guint n_filled = out->len;
  g_autoptr(pp_box_grid) grid = NULL; /* over the filled candidates, on first use */
  g_autoptr(GArray) near = g_array_new(FALSE, FALSE, sizeof(guint));
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    pp_rect r;
    if (m->kind != PP_MARK_STROKE || m->dashed || !pp_path_is_rectangle(m->path, PP_RECT_TOL, &r) ||
        pp_rect_width(r) < 2 || pp_rect_height(r) < 2)
      continue;
    r = pp_rect_intersect(r, pp_clip_bbox(m->clip)); /* fills are compared as visible */
    if (pp_rect_is_empty(r))
      continue;
    double tol = fmax(0.3, m->line_width);
    gboolean repaint = FALSE;
    if (!grid) {
      g_autoptr(GArray) rects = rects_of(out, n_filled);
      grid = pp_box_grid_new((const pp_rect *)rects->data, n_filled);
    }
    /* a repainted fill lies within r grown by tol */
    pp_box_grid_query_inside(grid, r, tol + PP_REPAINT_SEARCH_SLACK, near);
    for (guint j = 0; j < near->len && !repaint; j++) {
      pp_rect c = g_array_index(out, pp_bar_candidate, g_array_index(near, guint, j)).rect;
      repaint = fabs(c.x0 - r.x0) < tol && fabs(c.x1 - r.x1) < tol && fabs(c.y0 - r.y0) < tol &&
                fabs(c.y1 - r.y1) < tol;
    }
    if (!repaint)
      add_rect(wl, out, i, r, NAN);
  }
}

GArray *pp_bar_candidates_collect(const pp_scene *scene, GHashTable *glyph_marks) {
  GArray *out = g_array_new(FALSE, FALSE, sizeof(pp_bar_candidate));
  word_lookup wl;
  word_lookup_init(&wl, scene);
  collect_hatched(scene, out);
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    if (m->kind != PP_MARK_FILL || is_blank(&m->paint) ||
        g_hash_table_contains(glyph_marks, GUINT_TO_POINTER(i)))
      continue;
    pp_rect r;
    if (pp_path_is_rectangle(m->path, PP_RECT_TOL, &r)) {
      add_rect(&wl, out, i, r, m->ink);
      continue;
    }
    /* One fill holding every bar of a series as its subpaths (pgfplots' ybar): each
     * rectangle is a bar, measured on its own. */
    if (pp_path_n_subpaths(m->path) < 2)
      continue;
    GPtrArray *parts = split_subpaths(m->path);
    gboolean all_rects = parts->len >= 2;
    for (guint k = 0; k < parts->len && all_rects; k++)
      all_rects = pp_path_is_rectangle(parts->pdata[k], PP_RECT_TOL, &r);
    for (guint k = 0; k < parts->len && all_rects; k++) {
      pp_path_is_rectangle(parts->pdata[k], PP_RECT_TOL, &r);
      add_rect(&wl, out, i, r, pp_path_clipped_area(parts->pdata[k], m->rule, m->clip));
    }
    g_ptr_array_unref(parts);
  }
  collect_outlined(&wl, out);
  word_lookup_clear(&wl);
  drop_backgrounds(out);
  return out;
}

void pp_area_candidate_free(gpointer p) {
  pp_area_candidate *a = p;
  g_array_unref(a->points);
  g_free(a);
}

GPtrArray *pp_area_candidates_collect(const pp_scene *scene) {
  GPtrArray *out = g_ptr_array_new_with_free_func(pp_area_candidate_free);
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    if (m->kind != PP_MARK_FILL || is_blank(&m->paint) || m->path->n_segs < 5)
      continue;
    pp_rect r;
    if (pp_path_is_rectangle(m->path, PP_RECT_TOL, &r))
      continue;
    double ink = isnan(m->ink) ? 0 : m->ink;
    if (ink < PP_AREA_MIN_INK)
      continue;
    GPtrArray *polys = pp_path_flatten(m->path, PP_AREA_FLATTEN_TOL);
    if (polys->len != 1) {
      g_ptr_array_unref(polys);
      continue;
    }
    pp_area_candidate *a = g_new0(pp_area_candidate, 1);
    a->mark = i;
    a->points = g_array_ref(g_ptr_array_index(polys, 0));
    g_ptr_array_unref(polys);
    a->clip = pp_clip_bbox(m->clip);
    a->rect = pp_rect_intersect(m->bbox, a->clip);
    a->ink = ink;
    a->paint = m->paint;
    if (pp_page_sized(scene, a->rect) || pp_rect_is_empty(a->rect)) {
      pp_area_candidate_free(a);
      continue;
    }
    g_ptr_array_add(out, a);
  }
  return out;
}
