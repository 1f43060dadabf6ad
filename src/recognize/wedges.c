/* wedges.c — what the circle recognizers share: the page's filled marks read as wedges
 * (geometry's pp_path_wedges), the slices of one circle put in order, and the printed
 * numbers that belong to them: inside a slice, at the end of a leader line, beside the
 * slice's tip, or in a legend whose swatch has the slice's colour. */
#include <math.h>
#include <string.h>

#include "internal.h"

/* Swatch and slice colours agree within this per channel (producers round colours to
 * 8 bits or 3 decimals; common practice, no source). */
#define PP_WEDGE_SAME_COLOUR 0.02
/* A legend swatch is small: at most this many points on a side (common practice). */
#define PP_SWATCH_MAX 24.0
/* ...and its number lies to its right on its line within this distance, pt. */
#define PP_SWATCH_REACH 180.0
/* A printed number belongs to a slice when it lies within this many radii of the centre
 * (outside labels sit just beyond the rim; common practice, no source). */
#define PP_LABEL_REACH 1.9
/* A leader line starts inside its slice or on the rim, within this many radii, and ends
 * within this many points of its label's text (common practice, no source). */
#define PP_LEADER_START 1.02
/* A slice's name sits outside it within this many radii (common practice, no source). */
#define PP_NAME_REACH 1.5
#define PP_LEADER_REACH 12.0

static double share_of_mark(const pp_mark *m, GArray *ws, guint k) {
  if (ws->len == 1)
    return m->ink; /* exact, whatever the kind (a rim band has no sector area) */
  double total = 0;
  for (guint i = 0; i < ws->len; i++)
    total += pp_wedge_area(&g_array_index(ws, pp_wedge, i));
  double a = pp_wedge_area(&g_array_index(ws, pp_wedge, k));
  return total > 0 ? m->ink * a / total : 0;
}

/* Every eligible fill's wedges, read once per page: the pie, tilted-pie and radial
 * recognizers each ask, and reading a page of 100,000 circles three times was a third of
 * its scan. Claims change between recognizers, so they are checked per call. */
static GArray *page_wedges(pp_recognize_ctx *ctx) {
  if (ctx->wedges)
    return ctx->wedges;
  ctx->wedges = g_array_new(FALSE, FALSE, sizeof(pp_wedge_candidate));
  const pp_scene *scene = ctx->scene;
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    if (m->kind != PP_MARK_FILL || g_hash_table_contains(ctx->glyph_marks, GUINT_TO_POINTER(i)) ||
        !(m->ink > 0) || pp_page_sized(scene, m->visible_bbox))
      continue;
    g_autoptr(GArray) ws = pp_path_wedges(m->path, TRUE, NULL);
    for (guint k = 0; k < ws->len; k++) {
      pp_wedge_candidate c = {i, g_array_index(ws, pp_wedge, k), share_of_mark(m, ws, k), m->paint,
                              m->visible_bbox};
      g_array_append_val(ctx->wedges, c);
    }
  }
  return ctx->wedges;
}

GArray *pp_wedge_candidates_collect(pp_recognize_ctx *ctx) {
  GArray *all = page_wedges(ctx);
  GArray *out = g_array_new(FALSE, FALSE, sizeof(pp_wedge_candidate));
  for (guint i = 0; i < all->len; i++) {
    const pp_wedge_candidate *c = &g_array_index(all, pp_wedge_candidate, i);
    if (pp_claims_mark_free(ctx->claims, c->mark))
      g_array_append_val(out, *c);
  }
  return out;
}

gboolean pp_paint_same(const pp_paint *a, const pp_paint *b) {
  return fabs(a->r - b->r) < PP_WEDGE_SAME_COLOUR && fabs(a->g - b->g) < PP_WEDGE_SAME_COLOUR &&
         fabs(a->b - b->b) < PP_WEDGE_SAME_COLOUR;
}

gboolean pp_angle_within(double a, double a0, double a1) {
  double d = fmod(a - a0, 2 * G_PI);
  if (d < 0)
    d += 2 * G_PI;
  return d <= a1 - a0;
}

/* Where a point is in a slice's terms: its angle about the centre (y up) and its distance
 * in units of the radius (for a tilted pie, in the un-tilted circle). */
void pp_slice_coords(const pp_ellipse *e, pp_point p, double *angle, double *dist) {
  *angle = pp_ellipse_param(e, p);
  *dist = pp_ellipse_scale(e, p);
}

/* The text line holding a label (an empty box when none does). */
static pp_rect line_box_of(const pp_scene *scene, const pp_label *lab) {
  for (guint i = 0; i < scene->lines->len; i++) {
    const pp_text_line *line = g_ptr_array_index(scene->lines, i);
    if (lab->centre.x >= line->box.x0 && lab->centre.x <= line->box.x1 &&
        lab->centre.y >= line->box.y0 && lab->centre.y <= line->box.y1)
      return line->box;
  }
  return pp_rect_empty();
}

/* The number a leader line points at: a stroke starting inside a slice and ending beyond
 * its rim, its last point near the label. -1 when none. */
static int leader_label(const pp_recognize_ctx *ctx, const pp_slice *s, double a0, double a1) {
  const pp_scene *scene = ctx->scene;
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    if (m->kind != PP_MARK_STROKE || m->path->n_segs < 2 || m->path->n_segs > 4 ||
        !pp_claims_mark_free(ctx->claims, i))
      continue;
    pp_point first = m->path->segs[0].pt[0], last = first;
    for (size_t k = 1; k < m->path->n_segs; k++)
      if (m->path->segs[k].kind == PP_SEG_LINE)
        last = m->path->segs[k].pt[0];
    double fa, fd, la, ld;
    pp_slice_coords(&s->ellipse, first, &fa, &fd);
    pp_slice_coords(&s->ellipse, last, &la, &ld);
    /* Starts inside the slice or on its rim (R's pie() draws from the rim outwards). */
    if (!(fd < PP_LEADER_START && fd > s->inner && ld > fd && pp_angle_within(fa, a0, a1)))
      continue;
    int best = -1;
    double best_d = PP_LEADER_REACH;
    for (guint l = 0; l < ctx->labels->len; l++) {
      const pp_label *lab = g_ptr_array_index(ctx->labels, l);
      if (!pp_claims_label_free(ctx->claims, lab->index))
        continue;
      /* The leader points at the label's text line ("Ferries 41%"), not only the number. */
      pp_rect box = pp_rect_union(lab->box, line_box_of(scene, lab));
      double dx = fmax(0, fmax(box.x0 - last.x, last.x - box.x1));
      double dy = fmax(0, fmax(box.y0 - last.y, last.y - box.y1));
      if (hypot(dx, dy) < best_d) {
        best_d = hypot(dx, dy);
        best = (int)l;
      }
    }
    if (best >= 0)
      return best;
  }
  return -1;
}

/* The free label that lies in the slice (or just beyond it, along its angles), nearest
 * its middle ray; percentages first. -1 when none. */
static int label_in_slice(const pp_recognize_ctx *ctx, const pp_slice *s, double a0, double a1,
                          const gboolean *taken) {
  int best = -1;
  double best_score = INFINITY;
  double mid = (a0 + a1) / 2;
  for (guint l = 0; l < ctx->labels->len; l++) {
    const pp_label *lab = g_ptr_array_index(ctx->labels, l);
    /* A bare year ("2031" in a title) is never a slice's share or value. */
    if (taken[l] || lab->number.year_like || !pp_claims_label_free(ctx->claims, lab->index))
      continue;
    double a, d;
    pp_slice_coords(&s->ellipse, lab->centre, &a, &d);
    if (!pp_angle_within(a, a0, a1) || d > PP_LABEL_REACH || d < s->inner * 0.8)
      continue;
    double off = fabs(remainder(a - mid, 2 * G_PI));
    double score = off + (lab->number.percent ? 0 : 10);
    if (score < best_score) {
      best_score = score;
      best = (int)l;
    }
  }
  return best;
}

/* A legend entry: a small filled swatch of the colour, not a slice, and the number on
 * its line to its right. Sets *swatch. -1 when none. */
static int legend_label(const pp_recognize_ctx *ctx, const pp_paint *paint, const gboolean *taken,
                        guint *swatch) {
  const pp_scene *scene = ctx->scene;
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    pp_rect b = m->visible_bbox;
    if (m->kind != PP_MARK_FILL || !pp_claims_mark_free(ctx->claims, i) ||
        pp_rect_width(b) > PP_SWATCH_MAX || pp_rect_height(b) > PP_SWATCH_MAX ||
        pp_rect_width(b) < 2 || pp_rect_height(b) < 2 || !pp_paint_same(&m->paint, paint))
      continue;
    int best = -1;
    double best_d = PP_SWATCH_REACH;
    double cy = (b.y0 + b.y1) / 2;
    for (guint l = 0; l < ctx->labels->len; l++) {
      const pp_label *lab = g_ptr_array_index(ctx->labels, l);
      if (taken[l] || !pp_claims_label_free(ctx->claims, lab->index))
        continue;
      double d = lab->box.x0 - b.x1;
      if (d < 0 || d > best_d || fabs(lab->centre.y - cy) > pp_rect_height(b) / 2 + 3)
        continue;
      best_d = d;
      best = (int)l;
    }
    if (best >= 0) {
      *swatch = i;
      return best;
    }
  }
  return -1;
}

/* The category printed with a label: the rest of its text line, when there is one. */
static char *category_of(const pp_scene *scene, const pp_label *lab) {
  for (guint i = 0; i < scene->lines->len; i++) {
    const pp_text_line *line = g_ptr_array_index(scene->lines, i);
    if (lab->centre.x < line->box.x0 || lab->centre.x > line->box.x1 ||
        lab->centre.y < line->box.y0 || lab->centre.y > line->box.y1)
      continue;
    const char *at = strstr(line->text, lab->text);
    if (!at)
      return NULL;
    g_autofree char *before = g_strstrip(g_strndup(line->text, at - line->text));
    g_autofree char *after = g_strstrip(g_strdup(at + strlen(lab->text)));
    char *rest = g_strstrip(g_strdup_printf("%s %s", before, after));
    if (!*rest) {
      g_free(rest);
      return NULL;
    }
    return rest;
  }
  return NULL;
}

/* A slice's name printed just outside it, along its angles, when its number is elsewhere
 * (inside the slice or in a legend): the nearest text line that is not a number and not
 * already another slice's name. Below a tilted pie its rim's depth is skipped, and a
 * perspective face is measured on its fitted outline. */
static char *name_beside(const pp_scene *scene, const pp_slice *s, GArray *slices) {
  const pp_text_line *best = NULL;
  double best_score = INFINITY, mid = (s->a0 + s->a1) / 2, half = (s->a1 - s->a0) / 2;
  for (guint i = 0; i < scene->lines->len; i++) {
    const pp_text_line *line = g_ptr_array_index(scene->lines, i);
    pp_point c = {(line->box.x0 + line->box.x1) / 2, (line->box.y0 + line->box.y1) / 2};
    double a, d;
    pp_slice_coords(&s->ellipse, c, &a, &d);
    pp_point o = s->ellipse.centre;
    if (c.y > o.y) /* page y runs down: below the apex */
      c.y -= fmin(s->drop, c.y - o.y);
    if (!pp_rect_is_empty(s->face)) {
      pp_rect f = s->face;
      double rx = c.x >= o.x ? f.x1 - o.x : o.x - f.x0, ry = c.y >= o.y ? f.y1 - o.y : o.y - f.y0;
      d = rx > 0 && ry > 0 ? hypot((c.x - o.x) / rx, (c.y - o.y) / ry) : 0;
    } else {
      double unused;
      pp_slice_coords(&s->ellipse, c, &unused, &d);
    }
    pp_number num;
    /* Nearest the slice's middle ray first (a neighbour's name may stray into its
     * angles), then nearest the rim. */
    double score = fabs(remainder(a - mid, 2 * G_PI)) / fmax(half, 1e-9) + (d - 1);
    if (d < 1 || d > PP_NAME_REACH || score >= best_score || !pp_angle_within(a, s->a0, s->a1) ||
        pp_number_parse(line->text, PP_DECIMAL_UNKNOWN, &num))
      continue;
    gboolean named = FALSE;
    for (guint k = 0; k < slices->len && !named; k++) {
      const char *other = g_array_index(slices, pp_slice, k).category;
      named = other && strcmp(other, line->text) == 0;
    }
    if (named)
      continue;
    best_score = score;
    best = line;
  }
  return best ? g_strdup(best->text) : NULL;
}

guint pp_slices_attach_labels(pp_recognize_ctx *ctx, GArray *slices, const char *owner,
                              gboolean *legend) {
  guint n = slices->len, found = 0;
  gboolean *taken = g_new0(gboolean, MAX(ctx->labels->len, 1));
  int *pick = g_new(int, MAX(n, 1));
  guint *swatches = g_new(guint, MAX(n, 1));
  *legend = FALSE;
  for (guint k = 0; k < n; k++) {
    pp_slice *s = &g_array_index(slices, pp_slice, k);
    swatches[k] = G_MAXUINT;
    pick[k] = leader_label(ctx, s, s->a0, s->a1);
    if (pick[k] >= 0 && taken[pick[k]])
      pick[k] = -1;
    if (pick[k] >= 0)
      taken[pick[k]] = TRUE;
  }
  for (guint k = 0; k < n; k++) {
    pp_slice *s = &g_array_index(slices, pp_slice, k);
    if (pick[k] < 0)
      pick[k] = label_in_slice(ctx, s, s->a0, s->a1, taken);
    if (pick[k] >= 0)
      taken[pick[k]] = TRUE;
  }
  guint labelled = 0;
  for (guint k = 0; k < n; k++)
    labelled += pick[k] >= 0;
  if (labelled < n) {
    /* Not every slice is labelled on the disc: try the legend for all of them. */
    guint by_legend = 0;
    int *lp = g_new(int, MAX(n, 1));
    gboolean *lt = g_new0(gboolean, MAX(ctx->labels->len, 1));
    for (guint k = 0; k < n; k++) {
      pp_slice *s = &g_array_index(slices, pp_slice, k);
      lp[k] = legend_label(ctx, &s->paint, lt, &swatches[k]);
      if (lp[k] >= 0) {
        lt[lp[k]] = TRUE;
        by_legend++;
      }
    }
    if (by_legend > labelled) {
      memcpy(pick, lp, n * sizeof(int));
      *legend = TRUE;
    } else {
      for (guint k = 0; k < n; k++)
        swatches[k] = G_MAXUINT;
    }
    g_free(lp);
    g_free(lt);
  }
  for (guint k = 0; k < n; k++) {
    pp_slice *s = &g_array_index(slices, pp_slice, k);
    if (pick[k] < 0)
      continue;
    const pp_label *lab = g_ptr_array_index(ctx->labels, pick[k]);
    s->label = lab;
    s->category = category_of(ctx->scene, lab);
    if (!s->category)
      s->category = name_beside(ctx->scene, s, slices);
    pp_claims_take_label(ctx->claims, lab->index, owner);
    if (swatches[k] != G_MAXUINT)
      pp_claims_take_mark_if_free(ctx->claims, swatches[k], owner);
    found++;
  }
  g_free(taken);
  g_free(pick);
  g_free(swatches);
  return found;
}

void pp_slices_clear(GArray *slices) {
  for (guint k = 0; k < slices->len; k++)
    g_free(g_array_index(slices, pp_slice, k).category);
  g_array_set_size(slices, 0);
}

/* Category order: clockwise from 12 o'clock, by where each slice starts clockwise. */
static int cmp_clockwise(gconstpointer pa, gconstpointer pb) {
  const pp_slice *a = pa, *b = pb;
  double ka = fmod(G_PI / 2 - a->a1 + 8 * G_PI + 1e-9, 2 * G_PI);
  double kb = fmod(G_PI / 2 - b->a1 + 8 * G_PI + 1e-9, 2 * G_PI);
  return (ka > kb) - (ka < kb);
}

void pp_slices_sort_clockwise(GArray *slices) {
  g_array_sort(slices, cmp_clockwise);
}

gboolean pp_slices_tile_turn(GArray *slices, double tol) {
  if (slices->len < 2)
    return FALSE;
  double total = 0;
  for (guint k = 0; k < slices->len; k++) {
    const pp_slice *s = &g_array_index(slices, pp_slice, k);
    total += s->a1 - s->a0;
  }
  if (fabs(total - 2 * G_PI) > tol * 2 * G_PI)
    return FALSE;
  /* No overlaps and no gaps: every slice ends where another starts. */
  for (guint k = 0; k < slices->len; k++) {
    const pp_slice *s = &g_array_index(slices, pp_slice, k);
    gboolean next = FALSE;
    for (guint j = 0; j < slices->len && !next; j++) {
      const pp_slice *o = &g_array_index(slices, pp_slice, j);
      next = j != k && fabs(remainder(o->a0 - s->a1, 2 * G_PI)) < tol * 2 * G_PI;
    }
    if (!next)
      return FALSE;
  }
  return TRUE;
}

void pp_slice_set_value(pp_element *el, const pp_slice *s) {
  if (!s->label)
    return;
  el->label_value = s->label->number.value;
  el->label_text = g_strdup(s->label->text);
  el->value = el->label_value;
  el->source = s->label->number.percent ? PP_VALUE_PERCENT_LABEL : PP_VALUE_DATA_LABEL;
  if (s->label->number.percent)
    el->share = el->label_value / 100;
  el->category = g_strdup(s->category);
}

/* Shares of labels printed as plain values: each value over their sum. */
void pp_slices_value_shares(pp_figure *fig) {
  double total = 0;
  for (guint k = 0; k < fig->elements->len; k++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, k);
    if (e->source == PP_VALUE_DATA_LABEL)
      total += e->label_value;
  }
  for (guint k = 0; k < fig->elements->len; k++) {
    pp_element *e = &g_array_index(fig->elements, pp_element, k);
    if (e->source == PP_VALUE_DATA_LABEL && total > 0)
      e->share = e->label_value / total;
  }
}

void pp_slices_finish(pp_recognize_ctx *ctx, pp_figure *fig, guint labelled, guint n,
                      const char *labels_evidence) {
  pp_slices_value_shares(fig);
  fig->n_series = fig->elements->len;
  pp_figure_add_evidence(fig, "wedges-tile-turn", 0.9);
  if (labelled == n) {
    pp_figure_add_evidence(fig, labels_evidence, 0.9);
  } else {
    fig->judged = FALSE;
    fig->not_judged_reason = g_strdup("slices without a printed share or value");
  }
  pp_claims_commit(ctx->claims);
  pp_figure_finish(ctx, fig, NULL);
}
