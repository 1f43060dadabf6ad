/* evidence.c — whether a figure a recognizer built is a chart at all, before any rule
 * judges it. Bars and areas are looked at for what tables, listings, tags, calendars,
 * tiles, swatches, rules, shadows, text boxes, KPI cards, diagrams and maps have and
 * charts do not; a figure that shows one is kept as "seen, not judged" with the reason. */
#include <math.h>
#include <string.h>

#define G_LOG_DOMAIN "plotproof-recognize"
#include "internal.h"

/* A bar must be thicker than a line: rules, frame sides and stems are drawn 0.4–1 pt
 * wide; the narrowest bars of a dense chart (60 bars across a page column) are about
 * 2 pt (common practice, no source). */
#define PP_EVIDENCE_MIN_THICKNESS 1.5
/* Lengths equal within this share of the longest (plus PP_SAME_EDGE_TOL) are one length:
 * every mark the same size encodes nothing — cells, tiles, swatches, row shading
 * (common practice, no source). */
#define PP_EVIDENCE_EQUAL_SHARE 0.005
/* A word sitting on at least this share of the marks makes them text backgrounds: table
 * cells, tags, listing lines, boxes of a diagram (common practice, no source). */
#define PP_EVIDENCE_TEXT_ON_MARKS 0.5
/* More words than this inside the plot region, and more than PP_EVIDENCE_WORDS_PER_MARK
 * per mark, are body text, not a chart's legend or annotations (common practice, no
 * source). */
#define PP_EVIDENCE_MAX_PLOT_WORDS 15
#define PP_EVIDENCE_WORDS_PER_MARK 2
/* Bars of one series share one width across the axis: within this share of the widest
 * plus PP_SAME_COLUMN_TOL. Tiles of a mosaic, cells spanning rows and boxes of a listing
 * do not (common practice, no source). */
#define PP_EVIDENCE_WIDTH_SHARE 0.1
/* A drop shadow is a same-size copy offset by a little in both directions, pt (common
 * practice, no source). */
#define PP_EVIDENCE_SHADOW_MIN 0.5
#define PP_EVIDENCE_SHADOW_MAX 10.0
#define PP_EVIDENCE_SHADOW_SHARE 0.5
/* A data label stands centred on its bar: its centre within this share of the bar's
 * width of the bar's centre line (plus PP_EVIDENCE_LABEL_SLACK pt). Labels further off
 * belong to a neighbour (common practice, no source). */
#define PP_EVIDENCE_LABEL_CENTRED 0.35
#define PP_EVIDENCE_LABEL_SLACK 1.0
/* An area whose height stays within this share of its median over most of its width
 * (PP_EVIDENCE_FLAT_SHARE of the samples) is a box with rounded corners, not a series
 * (common practice, no source). */
#define PP_EVIDENCE_FLAT_TOL 0.01
#define PP_EVIDENCE_FLAT_SHARE 0.8

/* Passing every check above rules out what they look for and nothing more: its weight
 * in the confidence (common practice, no source). */
#define PP_EVIDENCE_LOOKALIKE_WEIGHT 0.5

static gboolean is_number(const char *text) {
  pp_number num;
  return pp_number_parse(text, PP_DECIMAL_UNKNOWN, &num);
}

static gboolean inside(pp_rect outer, pp_rect r) {
  double cx = (r.x0 + r.x1) / 2, cy = (r.y0 + r.y1) / 2;
  return cx > outer.x0 && cx < outer.x1 && cy > outer.y0 && cy < outer.y1;
}

static gboolean is_bar_figure(const pp_figure *f) {
  if (f->kind != PP_FIGURE_COLUMN && f->kind != PP_FIGURE_BAR)
    return FALSE;
  for (guint i = 0; i < f->elements->len; i++)
    if (g_array_index(f->elements, pp_element, i).shape.kind != PP_SHAPE_RECT)
      return FALSE;
  return f->elements->len > 0;
}

/* Thickness across the value axis: the bar's width for columns, its height for bars. */
static double thickness(const pp_figure *f, const pp_element *e) {
  return f->kind == PP_FIGURE_COLUMN ? pp_rect_width(e->box) : pp_rect_height(e->box);
}

/* Bar thickness is a design constant of a chart: one mark thinner than a line makes the
 * group rules, frame sides or stems. */
static const char *thin_marks(const pp_figure *f) {
  for (guint i = 0; i < f->elements->len; i++)
    if (thickness(f, &g_array_index(f->elements, pp_element, i)) < PP_EVIDENCE_MIN_THICKNESS)
      return "marks thinner than a line: rules, frame sides or stems";
  return NULL;
}

/* The edge every element touches, along the value axis (the baseline), and whether the
 * elements grow from it both ways. */
static gboolean both_ways(const pp_figure *f) {
  gboolean vertical = f->kind == PP_FIGURE_COLUMN;
  pp_frame_rect a = pp_frame_of(g_array_index(f->elements, pp_element, 0).box, vertical);
  for (int side = 0; side < 2; side++) {
    double c = side ? a.u1 : a.u0;
    gboolean all = TRUE, lower = FALSE, upper = FALSE;
    for (guint i = 0; i < f->elements->len && all; i++) {
      pp_frame_rect r = pp_frame_of(g_array_index(f->elements, pp_element, i).box, vertical);
      all = pp_on_edge(r.u0, r.u1, c);
      lower |= pp_same_edge(r.u1, c);
      upper |= pp_same_edge(r.u0, c);
    }
    if (all)
      return lower && upper;
  }
  return FALSE;
}

/* Bars read from their labels alone that grow both ways from their baseline stand for
 * numbers of both signs; printed numbers of one sign on them are not their values. */
static const char *directions_disagree(const pp_figure *f) {
  if (f->scale || !both_ways(f))
    return NULL;
  guint pos = 0, neg = 0;
  for (guint i = 0; i < f->elements->len; i++) {
    double v = g_array_index(f->elements, pp_element, i).label_value;
    pos += v > 0, neg += v < 0;
  }
  return pos == 0 || neg == 0 ? "marks grow both ways from one edge but their numbers share a "
                                "sign: cells or boxes side by side, not bars"
                              : NULL;
}

/* Bars of a chart start near their scale: the gap from the tick labels to the nearest
 * bar is at most PP_EVIDENCE_AXIS_GAP_SHARE of the width the bars span, or
 * PP_EVIDENCE_AXIS_GAP_MIN pt (common practice, no source). */
#define PP_EVIDENCE_AXIS_GAP_SHARE 1.0
#define PP_EVIDENCE_AXIS_GAP_MIN 40.0

static const char *far_from_scale(const pp_figure *f) {
  if (!f->scale)
    return NULL;
  gboolean vertical = f->kind == PP_FIGURE_COLUMN; /* value axis vertical: labels beside */
  pp_rect ab = f->scale->box, span = pp_rect_empty();
  for (guint i = 0; i < f->elements->len; i++)
    span = pp_rect_union(span, g_array_index(f->elements, pp_element, i).box);
  double gap =
      vertical ? fmax(span.x0 - ab.x1, ab.x0 - span.x1) : fmax(span.y0 - ab.y1, ab.y0 - span.y1);
  double across = vertical ? pp_rect_width(span) : pp_rect_height(span);
  return gap > PP_EVIDENCE_AXIS_GAP_MIN && gap > PP_EVIDENCE_AXIS_GAP_SHARE * across
             ? "marks far from the scale they were read on: not its bars"
             : NULL;
}

/* Two marks are a chart only when each is named or labelled: a pair of boxes is the
 * commonest coincidence on a page. */
static const char *unnamed_pair(const pp_figure *f) {
  if (f->elements->len > 2)
    return NULL;
  for (guint i = 0; i < f->elements->len; i++) {
    const pp_element *e = &g_array_index(f->elements, pp_element, i);
    if (!e->category && isnan(e->label_value))
      return "two marks without category names or data labels";
  }
  return NULL;
}

static const char *equal_lengths(const pp_figure *f) {
  double lo = INFINITY, hi = 0;
  for (guint i = 0; i < f->elements->len; i++) {
    double x = g_array_index(f->elements, pp_element, i).extent;
    lo = fmin(lo, x), hi = fmax(hi, x);
  }
  return f->elements->len >= 2 && hi - lo <= PP_EVIDENCE_EQUAL_SHARE * hi + PP_SAME_EDGE_TOL
             ? "every mark the same length: cells, tiles, swatches or row shading, not bars"
             : NULL;
}

static const char *uneven_widths(const pp_figure *f) {
  for (guint s = 0; s < f->n_series; s++) {
    double lo = INFINITY, hi = 0;
    for (guint i = 0; i < f->elements->len; i++) {
      const pp_element *e = &g_array_index(f->elements, pp_element, i);
      if (e->series != s)
        continue;
      lo = fmin(lo, thickness(f, e)), hi = fmax(hi, thickness(f, e));
    }
    if (hi > 0 && hi - lo > PP_EVIDENCE_WIDTH_SHARE * hi + PP_SAME_COLUMN_TOL)
      return "marks of one colour differ in width: tiles, cells or boxes, not bars";
  }
  return NULL;
}

/* Words other than numbers standing on the marks. */
static const char *text_on_marks(const pp_scene *scene, const pp_figure *f) {
  guint covered = 0;
  for (guint i = 0; i < f->elements->len; i++) {
    pp_rect b = g_array_index(f->elements, pp_element, i).box;
    for (guint k = 0; k < scene->words->len; k++) {
      const pp_text_run *w = g_ptr_array_index(scene->words, k);
      if (inside(b, w->box) && pp_rect_height(w->box) <= pp_rect_height(b) + 1 &&
          !is_number(w->text)) {
        covered++;
        break;
      }
    }
  }
  return covered > 0 && covered >= PP_EVIDENCE_TEXT_ON_MARKS * f->elements->len
             ? "words on the marks: table cells, tags, listing lines or text boxes"
             : NULL;
}

/* Words inside the region the marks span (not the plot box: a producer's clip may hold
 * the table of the chart's data beside it). */
static const char *body_text(const pp_scene *scene, const pp_figure *f) {
  pp_rect region = pp_rect_empty();
  for (guint i = 0; i < f->elements->len; i++)
    region = pp_rect_union(region, g_array_index(f->elements, pp_element, i).box);
  guint n = 0;
  for (guint k = 0; k < scene->words->len; k++) {
    const pp_text_run *w = g_ptr_array_index(scene->words, k);
    n += inside(region, w->box) && !is_number(w->text);
  }
  guint marks = f->kind == PP_FIGURE_AREA ? f->n_series : f->elements->len;
  return n > PP_EVIDENCE_MAX_PLOT_WORDS && n > PP_EVIDENCE_WORDS_PER_MARK * marks
             ? "body text inside the plot region"
             : NULL;
}

/* A filled rectangle of the same size as r, offset by a little both ways. */
static gboolean has_shadow(const pp_recognize_ctx *ctx, pp_rect r) {
  for (guint i = 0; i < ctx->scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(ctx->scene->marks, i);
    if (m->kind != PP_MARK_FILL)
      continue;
    pp_rect o = m->bbox;
    double dx = o.x0 - r.x0, dy = o.y0 - r.y0;
    if (fabs(pp_rect_width(o) - pp_rect_width(r)) < 0.1 &&
        fabs(pp_rect_height(o) - pp_rect_height(r)) < 0.1 && fabs(dx) >= PP_EVIDENCE_SHADOW_MIN &&
        fabs(dx) <= PP_EVIDENCE_SHADOW_MAX && fabs(dy) >= PP_EVIDENCE_SHADOW_MIN &&
        fabs(dy) <= PP_EVIDENCE_SHADOW_MAX)
      return TRUE;
  }
  return FALSE;
}

static const char *shadows(const pp_recognize_ctx *ctx, const pp_figure *f) {
  guint n = 0;
  for (guint i = 0; i < f->elements->len; i++)
    n += has_shadow(ctx, g_array_index(f->elements, pp_element, i).box);
  return n > 0 && n >= PP_EVIDENCE_SHADOW_SHARE * f->elements->len
             ? "drop shadows: offset copies of other boxes"
             : NULL;
}

/* Data labels of one chart: centred on their bars, not a count 1, 2, 3… of lines or
 * rows, not a run of years (category names). */
static const char *label_doubts(const pp_recognize_ctx *ctx, const pp_figure *f) {
  guint n = 0, counting = 0, years = 0;
  double prev = NAN;
  for (guint i = 0; i < f->elements->len; i++) {
    const pp_element *e = &g_array_index(f->elements, pp_element, i);
    if (isnan(e->label_value))
      continue;
    n++;
    counting += !isnan(prev) && fabs(fabs(e->label_value - prev) - 1) < 1e-9;
    prev = e->label_value;
    pp_number num;
    years +=
        e->label_text && pp_number_parse(e->label_text, PP_DECIMAL_UNKNOWN, &num) && num.year_like;
    /* the label's centre across the axis */
    for (guint k = 0; k < ctx->labels->len; k++) {
      const pp_label *l = g_ptr_array_index(ctx->labels, k);
      if (!e->label_text || strcmp(l->text, e->label_text) != 0 ||
          g_strcmp0(pp_claims_label_owner(ctx->claims, l->index), PP_OWNER_DATA_LABEL) != 0)
        continue;
      gboolean vertical = f->kind == PP_FIGURE_COLUMN;
      double c = vertical ? l->centre.x : l->centre.y;
      double b0 = vertical ? e->box.x0 : e->box.y0, b1 = vertical ? e->box.x1 : e->box.y1;
      if (fabs(c - (b0 + b1) / 2) > PP_EVIDENCE_LABEL_CENTRED * (b1 - b0) + PP_EVIDENCE_LABEL_SLACK)
        return "data labels off the centres of their bars: pairing uncertain";
      break;
    }
  }
  if (n >= 2 && years == n)
    return "labels are years: category names, not values";
  if (n >= 3 && counting + 1 == n)
    return "labels count 1, 2, 3…: line or row numbers, not values";
  return NULL;
}

/* An area whose height is the same over most of its width. */
static const char *flat_area(const pp_figure *f) {
  GArray *h = g_array_new(FALSE, FALSE, sizeof(double));
  for (guint i = 0; i < f->elements->len; i++)
    g_array_append_val(h, g_array_index(f->elements, pp_element, i).extent);
  if (h->len < 3) {
    g_array_unref(h);
    return NULL;
  }
  double *v = (double *)h->data;
  for (guint i = 1; i < h->len; i++) /* insertion sort: at most a few hundred samples */
    for (guint j = i; j > 0 && v[j] < v[j - 1]; j--) {
      double t = v[j];
      v[j] = v[j - 1];
      v[j - 1] = t;
    }
  double median = v[h->len / 2];
  guint flat = 0;
  for (guint i = 0; i < h->len; i++)
    flat += fabs(v[i] - median) <= PP_EVIDENCE_FLAT_TOL * median;
  gboolean is_flat = flat >= PP_EVIDENCE_FLAT_SHARE * h->len;
  g_array_unref(h);
  return is_flat ? "flat top: a box with rounded corners, not a series" : NULL;
}

/* KPI cards and callouts hold their number inside the box in a headline size: a
 * report's body text and a chart's data labels are 7–14 pt, a card's figure 18–40 pt
 * (common practice, no source). Every labelled mark holding such a number makes cards. */
#define PP_EVIDENCE_KPI_FONT 16.0

/* The data label paired with e, as found among the page's labels. */
static const pp_label *data_label_of(const pp_recognize_ctx *ctx, const pp_element *e) {
  for (guint k = 0; e->label_text && k < ctx->labels->len; k++) {
    const pp_label *l = g_ptr_array_index(ctx->labels, k);
    if (strcmp(l->text, e->label_text) == 0 &&
        g_strcmp0(pp_claims_label_owner(ctx->claims, l->index), PP_OWNER_DATA_LABEL) == 0)
      return l;
  }
  return NULL;
}

static const char *kpi_cards(const pp_recognize_ctx *ctx, const pp_figure *f) {
  guint labelled = 0, big = 0;
  for (guint i = 0; i < f->elements->len; i++) {
    const pp_element *e = &g_array_index(f->elements, pp_element, i);
    const pp_label *l = data_label_of(ctx, e);
    if (!l)
      continue;
    labelled++;
    big += l->size >= PP_EVIDENCE_KPI_FONT && pp_rect_contains(e->box, l->box, PP_SAME_EDGE_TOL);
  }
  return labelled >= 2 && big == labelled
             ? "big numbers inside the boxes: KPI cards or callouts, not data labels"
             : NULL;
}

/* A connector leaves a box's side (the edge along the value axis, away from its corners)
 * outwards and ends at another box's side: arrowheads stop this far short of the box, pt
 * (common practice, no source). Diagrams join at least this share of their neighbours
 * (and two pairs); a line series drawn over bars joins tops, not sides. */
#define PP_EVIDENCE_CONNECTOR_REACH 8.0
#define PP_EVIDENCE_CONNECTED_SHARE 0.5

/* The open stroke's two ends, FALSE for closed or empty paths. */
static gboolean stroke_ends(const pp_mark *m, pp_point *a, pp_point *b) {
  const pp_path *p = m->path;
  if (m->kind != PP_MARK_STROKE || !p || p->n_segs < 2 || p->segs[0].kind != PP_SEG_MOVE)
    return FALSE;
  *a = p->segs[0].pt[0];
  for (size_t i = 1; i < p->n_segs; i++) {
    if (p->segs[i].kind == PP_SEG_CLOSE || p->segs[i].kind == PP_SEG_MOVE)
      return FALSE;
    *b = p->segs[i].pt[p->segs[i].kind == PP_SEG_CURVE ? 2 : 0];
  }
  return TRUE;
}

/* The element whose side the point p leaves from towards q, or -1. */
static int side_of(const pp_figure *f, pp_point p, pp_point q) {
  gboolean vertical = f->kind == PP_FIGURE_COLUMN;
  for (guint i = 0; i < f->elements->len; i++) {
    pp_frame_rect r = pp_frame_of(g_array_index(f->elements, pp_element, i).box, vertical);
    double pu = vertical ? p.y : p.x, pw = vertical ? p.x : p.y, qw = vertical ? q.x : q.y;
    double inset = PP_SAME_EDGE_TOL;
    if (pu <= r.u0 + inset || pu >= r.u1 - inset)
      continue; /* at a corner, the baseline or the tip: not a side */
    if ((pw >= r.w1 - inset && pw <= r.w1 + PP_EVIDENCE_CONNECTOR_REACH && qw > r.w1) ||
        (pw <= r.w0 + inset && pw >= r.w0 - PP_EVIDENCE_CONNECTOR_REACH && qw < r.w0))
      return (int)i;
  }
  return -1;
}

static const char *joined_by_connectors(const pp_recognize_ctx *ctx, const pp_figure *f) {
  guint joined = 0;
  for (guint k = 0; k < ctx->scene->marks->len; k++) {
    pp_point a, b;
    if (!stroke_ends(g_ptr_array_index(ctx->scene->marks, k), &a, &b))
      continue;
    int i = side_of(f, a, b), j = side_of(f, b, a);
    joined += i >= 0 && j >= 0 && i != j;
  }
  guint n = f->elements->len;
  return joined >= 2 && joined >= PP_EVIDENCE_CONNECTED_SHARE * (n - 1)
             ? "boxes joined by connectors: a diagram, not bars"
             : NULL;
}

/* Series of one chart share the category axis; regions standing side by side (across
 * less than this share of the narrower one, level over more than it), not both on one
 * floor, tile a plane: a map or a diagram (common practice, no source). */
#define PP_EVIDENCE_SIDE_BY_SIDE 0.5

static const char *side_by_side_regions(const pp_recognize_ctx *ctx, const pp_figure *f) {
  guint n = f->n_series;
  g_autofree pp_rect *box = g_new(pp_rect, MAX(n, 1));
  g_autofree gboolean *floor = g_new(gboolean, MAX(n, 1));
  for (guint s = 0; s < n; s++)
    box[s] = pp_rect_empty(), floor[s] = TRUE;
  for (guint i = 0; i < f->elements->len; i++) {
    const pp_element *e = &g_array_index(f->elements, pp_element, i);
    if (e->series >= n || e->parts->len == 0)
      continue;
    const pp_mark *m =
        g_ptr_array_index(ctx->scene->marks, g_array_index(e->parts, pp_part, 0).mark);
    box[e->series] = m->visible_bbox;
    floor[e->series] &= !e->stacked;
  }
  for (guint s = 0; s < n; s++)
    for (guint t = s + 1; t < n; t++) {
      pp_rect a = box[s], b = box[t];
      if (pp_rect_is_empty(a) || pp_rect_is_empty(b) || (floor[s] && floor[t]))
        continue;
      double across = fmin(a.x1, b.x1) - fmax(a.x0, b.x0);
      double level = fmin(a.y1, b.y1) - fmax(a.y0, b.y0);
      if (across < PP_EVIDENCE_SIDE_BY_SIDE * fmin(pp_rect_width(a), pp_rect_width(b)) &&
          level > PP_EVIDENCE_SIDE_BY_SIDE * fmin(pp_rect_height(a), pp_rect_height(b)))
        return "regions side by side, not series over one axis: a map or a diagram";
    }
  return NULL;
}

static void not_judged(pp_figure *f, const char *reason) {
  f->judged = FALSE;
  g_free(f->not_judged_reason);
  f->not_judged_reason = g_strdup(reason);
  g_debug("figure by %s not judged: %s", f->recognizer, reason);
}

void pp_figure_weigh(pp_recognize_ctx *ctx, pp_figure *f) {
  const char *reason = NULL;
  if (is_bar_figure(f)) {
    if (!(reason = thin_marks(f)) && !(reason = equal_lengths(f)) && !(reason = uneven_widths(f)) &&
        !(reason = directions_disagree(f)) && !(reason = far_from_scale(f)) &&
        !(reason = unnamed_pair(f)) && !(reason = text_on_marks(ctx->scene, f)) &&
        !(reason = body_text(ctx->scene, f)) && !(reason = shadows(ctx, f)) &&
        !(reason = kpi_cards(ctx, f)) && !(reason = joined_by_connectors(ctx, f)))
      reason = label_doubts(ctx, f);
  } else if (f->kind == PP_FIGURE_AREA) {
    if (!(reason = flat_area(f)) && !(reason = side_by_side_regions(ctx, f)))
      reason = body_text(ctx->scene, f);
  }
  if (reason)
    not_judged(f, reason);
  else if (is_bar_figure(f) || f->kind == PP_FIGURE_AREA)
    pp_figure_add_evidence(f, "not-a-lookalike", PP_EVIDENCE_LOOKALIKE_WEIGHT);
}
