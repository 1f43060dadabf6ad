/* symbols.c — recognizer: bubbles and scaled symbols. Filled circles, or copies of one
 * icon outline, of one colour and of clearly different sizes, each with a printed number
 * (inside, on or just below it) or read from a size key beside the chart. Scatter plots
 * with one marker size, dot plots and unlabelled map symbols make no figure here. */
#include <math.h>
#include <string.h>

#include "internal.h"

/* A plot frame may fill most of a small figure page, but not all of it: a rectangle over
 * this share of the page is the page background (common practice, no source). */
#define PP_FRAME_MAX_PAGE 0.9
#define OWNER "symbols"

/* A circle's bbox is square within this share, and its area is π r² within this share
 * (cubic arcs of cairo or matplotlib are within 0.03%; common practice, no source). */
#define PP_SYMBOL_ROUND_SHARE 0.02
/* Two icons are copies of one outline when their bbox-normalised points agree within this
 * share of the bbox (common practice, no source). */
#define PP_SYMBOL_SIMILAR_SHARE 0.02
/* Sizes must differ by at least this ratio of largest to smallest ink for size to stand
 * for anything: equal markers (scatter, dot plot) make no figure (common practice, no
 * source). */
#define PP_SYMBOL_MIN_SPREAD 1.3
/* A polygon of this many sides or more may be a circle: a regular 16-gon holds 97.4% of
 * its circumcircle's area, outside PP_SYMBOL_ROUND_SHARE, so only finer ones pass the area
 * test (n/2·sin(2π/n)/π; textbook). */
#define PP_SYMBOL_MIN_POLYGON 16
/* Labels overlap where bubbles crowd: a family is read from its labels when at least this
 * share of its symbols carry one; the others are claimed but not judged (common practice,
 * no source). */
#define PP_SYMBOL_MIN_LABELLED 0.75
/* Tick labels step through their values evenly within this share of the step (printed
 * ticks are round numbers; common practice, no source). */
#define PP_SYMBOL_TICK_STEP_SHARE 0.01
/* Fewest symbols that make a chart rather than a pair of decorations (common practice). */
#define PP_SYMBOL_MIN_COUNT 3
/* Sizes that stand for the numbers follow them by a power law (area ∝ value^k, k > 0):
 * symbols whose log-log fit explains less than this share of the variance carry numbers
 * that are not their sizes (icons, arrows and boxes beside numbers in a manual), so the
 * figure is seen, not judged. Rounded labels on real bubbles keep R² near 1 (common
 * practice, no source). */
#define PP_SYMBOL_MIN_FIT_R2 0.9
/* Symbols smaller than this, pt², are dots and glyph parts, not sized symbols. */
#define PP_SYMBOL_MIN_INK 4.0
/* Colours of one family agree within this per channel (same as bar series). */
#define PP_SYMBOL_COLOUR_TOL 0.02
/* A label under an icon starts within this many icon heights below it (common practice). */
#define PP_SYMBOL_BELOW_REACH 0.8
/* Colours are bucketed in cells a little wider than PP_SYMBOL_COLOUR_TOL, so two colours
 * within the tolerance always fall in the same or neighbouring cells despite rounding. */
#define PP_SYMBOL_COLOUR_CELL (PP_SYMBOL_COLOUR_TOL * 1.005)

static gboolean same_colour(const pp_paint *a, const pp_paint *b) {
  return fabs(a->r - b->r) < PP_SYMBOL_COLOUR_TOL && fabs(a->g - b->g) < PP_SYMBOL_COLOUR_TOL &&
         fabs(a->b - b->b) < PP_SYMBOL_COLOUR_TOL;
}

/* One closed subpath of curves, or of many short lines (gnuplot draws small circles as
 * polygons), whose box is square and whose area is that of the inscribed circle. */
static gboolean is_circle(const pp_mark *m) {
  const pp_path *p = m->path;
  guint curves = 0, lines = 0, moves = 0;
  for (size_t i = 0; i < p->n_segs; i++) {
    curves += p->segs[i].kind == PP_SEG_CURVE;
    lines += p->segs[i].kind == PP_SEG_LINE;
    moves += p->segs[i].kind == PP_SEG_MOVE;
  }
  double w = pp_rect_width(m->bbox), h = pp_rect_height(m->bbox);
  if ((curves < 2 && lines < PP_SYMBOL_MIN_POLYGON) || moves != 1 || !(w > 0) ||
      fabs(w - h) > PP_SYMBOL_ROUND_SHARE * w)
    return FALSE;
  double area = pp_path_fill_area(p, m->rule);
  return fabs(area - G_PI * w * h / 4) <= PP_SYMBOL_ROUND_SHARE * area;
}

/* Copies of one outline: same segment kinds, same points relative to the bbox. */
static gboolean similar(const pp_mark *a, const pp_mark *b) {
  const pp_path *p = a->path, *q = b->path;
  if (p->n_segs != q->n_segs || p->n_segs < 4)
    return FALSE;
  double wa = pp_rect_width(a->bbox), ha = pp_rect_height(a->bbox);
  double wb = pp_rect_width(b->bbox), hb = pp_rect_height(b->bbox);
  if (!(wa > 0 && ha > 0 && wb > 0 && hb > 0) ||
      fabs(wa / ha - wb / hb) > PP_SYMBOL_SIMILAR_SHARE * (wa / ha))
    return FALSE;
  for (size_t i = 0; i < p->n_segs; i++) {
    if (p->segs[i].kind != q->segs[i].kind)
      return FALSE;
    int n = p->segs[i].kind == PP_SEG_CURVE ? 3 : p->segs[i].kind == PP_SEG_CLOSE ? 0 : 1;
    for (int k = 0; k < n; k++) {
      double ux = (p->segs[i].pt[k].x - a->bbox.x0) / wa,
             uy = (p->segs[i].pt[k].y - a->bbox.y0) / ha;
      double vx = (q->segs[i].pt[k].x - b->bbox.x0) / wb,
             vy = (q->segs[i].pt[k].y - b->bbox.y0) / hb;
      if (fabs(ux - vx) > PP_SYMBOL_SIMILAR_SHARE || fabs(uy - vy) > PP_SYMBOL_SIMILAR_SHARE)
        return FALSE;
    }
  }
  return TRUE;
}

/* Filled circles and icons, and outlined circles (a size key's nested circles are drawn
 * as outlines so that the smaller ones show). */
static GArray *collect(const pp_recognize_ctx *ctx) {
  GArray *out = g_array_new(FALSE, FALSE, sizeof(pp_symbol));
  const pp_scene *scene = ctx->scene;
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    gboolean outline = m->kind == PP_MARK_STROKE && !m->dashed;
    if ((m->kind != PP_MARK_FILL && !outline) || m->paint.kind != PP_PAINT_SOLID ||
        !(outline || m->ink >= PP_SYMBOL_MIN_INK) || !pp_claims_mark_free(ctx->claims, i) ||
        g_hash_table_contains(ctx->glyph_marks, GUINT_TO_POINTER(i)) ||
        pp_page_sized(scene, m->bbox))
      continue;
    /* a symbol cut by its clip is not measurable as drawn (an outline's visible box holds
     * half its line width) */
    double pen = outline ? m->line_width / 2 : 0;
    pp_rect drawn = {m->bbox.x0 - pen, m->bbox.y0 - pen, m->bbox.x1 + pen, m->bbox.y1 + pen};
    if (fabs(pp_rect_area(m->visible_bbox) - pp_rect_area(drawn)) > 0.01 * pp_rect_area(drawn))
      continue;
    pp_symbol s = {.mark = i, .box = m->bbox, .ink = m->ink, .paint = m->paint, .family = -1};
    s.centre = (pp_point){(m->bbox.x0 + m->bbox.x1) / 2, (m->bbox.y0 + m->bbox.y1) / 2};
    s.circle = is_circle(m);
    if (outline) {
      if (!s.circle)
        continue;
      s.outline = TRUE;
      s.ink = pp_path_fill_area(m->path, m->rule);
      if (!(s.ink >= PP_SYMBOL_MIN_INK))
        continue;
    }
    s.r = s.circle ? pp_rect_width(m->bbox) / 2
                   : hypot(pp_rect_width(m->bbox), pp_rect_height(m->bbox)) / 2;
    g_array_append_val(out, s);
  }
  return out;
}

static int colour_cell(double v) {
  double c = floor(v / PP_SYMBOL_COLOUR_CELL) + 1024;
  return !(c >= 1) ? 1 : c > 2046 ? 2046 : (int)c;
}

static gint64 family_key(const pp_symbol *s, const pp_mark *m, int dr, int dg, int db) {
  gint64 shape = s->outline ? 1 : s->circle ? 0 : (gint64)MIN(m->path->n_segs, 1u << 20) + 2;
  guint64 h = (guint64)(((shape * 2048 + colour_cell(s->paint.r) + dr) * 2048 +
                         colour_cell(s->paint.g) + dg) *
                            2048 +
                        colour_cell(s->paint.b) + db);
  /* splitmix64's finaliser: GLib's int64 hash keeps only the low bits */
  h = (h ^ (h >> 30)) * 0xbf58476d1ce4e5b9ull;
  h = (h ^ (h >> 27)) * 0x94d049bb133111ebull;
  return (gint64)(h ^ (h >> 31));
}

/* Families: circles of one colour, or copies of one icon outline in one colour. Each
 * symbol joins the family of the earliest first member it matches, else starts one;
 * first members are bucketed by shape and colour cell, and a match lies in the same or a
 * neighbouring cell. */
static int assign_families(const pp_scene *scene, GArray *syms) {
  g_autoptr(GHashTable) leaders =
      g_hash_table_new_full(g_int64_hash, g_int64_equal, g_free, (GDestroyNotify)g_array_unref);
  int n = 0;
  for (guint i = 0; i < syms->len; i++) {
    pp_symbol *b = &g_array_index(syms, pp_symbol, i);
    const pp_mark *mb = g_ptr_array_index(scene->marks, b->mark);
    const pp_symbol *found = NULL;
    guint found_i = G_MAXUINT;
    for (int d = 0; d < 27; d++) {
      gint64 key = family_key(b, mb, d % 3 - 1, d / 3 % 3 - 1, d / 9 - 1);
      GArray *bucket = g_hash_table_lookup(leaders, &key);
      for (guint k = 0; bucket && k < bucket->len; k++) {
        guint li = g_array_index(bucket, guint, k);
        if (li >= found_i)
          break;
        const pp_symbol *a = &g_array_index(syms, pp_symbol, li);
        if (a->circle == b->circle && a->outline == b->outline &&
            same_colour(&a->paint, &b->paint) &&
            (a->circle || similar(g_ptr_array_index(scene->marks, a->mark), mb))) {
          found = a, found_i = li;
          break;
        }
      }
    }
    if (found) {
      b->family = found->family;
      continue;
    }
    b->family = n++;
    gint64 key = family_key(b, mb, 0, 0, 0);
    GArray *bucket = g_hash_table_lookup(leaders, &key);
    if (!bucket) {
      bucket = g_array_new(FALSE, FALSE, sizeof(guint));
      g_hash_table_insert(leaders, g_memdup2(&key, sizeof key), bucket);
    }
    g_array_append_val(bucket, i);
  }
  return n;
}

/* The free numeric label on the symbol (its centre within the pp_symbol, or the symbol's
 * centre within the label), else just below it (pictograms). Only labels the grid finds
 * near the symbol are tested. */
static const pp_label *label_of(pp_symbol_page *pg, const pp_symbol *s, GHashTable *used) {
  const pp_recognize_ctx *ctx = pg->ctx;
  double h = pp_rect_height(s->box);
  pp_rect q = {s->box.x0 - 0.5, s->box.y0 - 0.5, s->box.x1 + 0.5, s->box.y1 + 0.5};
  if (!s->circle)
    q.y1 = fmax(q.y1, s->box.y1 + fmax(PP_SYMBOL_BELOW_REACH * h, 2 * pg->label_size));
  g_autoptr(GArray) hits = g_array_new(FALSE, FALSE, sizeof(guint));
  g_autoptr(GArray) near = g_array_new(FALSE, FALSE, sizeof(guint));
  pp_box_grid_query(pg->labels, q, hits);
  const pp_label *best = NULL;
  double best_d = INFINITY;
  for (guint j = 0; j < hits->len; j++) {
    const pp_label *l = g_ptr_array_index(ctx->labels, g_array_index(hits, guint, j));
    if (!pp_claims_label_free(ctx->claims, l->index) || g_hash_table_contains(used, l) ||
        g_hash_table_contains(pg->tick_labels, l))
      continue;
    double d = hypot(l->centre.x - s->centre.x, l->centre.y - s->centre.y);
    gboolean on =
        s->circle
            ? d <= s->r ||
                  pp_rect_contains(l->box,
                                   (pp_rect){s->centre.x, s->centre.y, s->centre.x, s->centre.y}, 0)
            : pp_rect_contains(s->box, l->box, 0.5);
    gboolean below = !on && !s->circle && l->centre.x >= s->box.x0 && l->centre.x <= s->box.x1 &&
                     l->box.y0 >= s->box.y1 - 0.5 &&
                     l->box.y0 - s->box.y1 <= fmax(PP_SYMBOL_BELOW_REACH * h, 2 * l->size);
    if (!on && !below)
      continue;
    /* a label over two overlapping bubbles belongs to the one it is centred on */
    gboolean nearer = FALSE;
    if (on)
      pp_box_grid_query(
          pg->centres,
          (pp_rect){l->centre.x - d, l->centre.y - d, l->centre.x + d, l->centre.y + d}, near);
    for (guint i = 0; on && i < near->len && !nearer; i++) {
      const pp_symbol *o = &g_array_index(pg->syms, pp_symbol, g_array_index(near, guint, i));
      nearer = o != s && o->family == s->family &&
               hypot(l->centre.x - o->centre.x, l->centre.y - o->centre.y) < d;
    }
    if (nearer)
      continue;
    if (below)
      d = s->r + (l->box.y0 - s->box.y1);
    if (d < best_d) {
      best_d = d;
      best = l;
    }
  }
  return best;
}

/* The plot: the smallest non-page rectangle mark around every symbol centre. */
static pp_rect plot_box(pp_symbol_page *pg, int family) {
  const pp_scene *scene = pg->ctx->scene;
  const GArray *mem = g_ptr_array_index(pg->members, family);
  pp_rect all = pp_rect_empty(), centres = pp_rect_empty();
  for (guint i = 0; i < mem->len; i++) {
    const pp_symbol *s = &g_array_index(pg->syms, pp_symbol, g_array_index(mem, guint, i));
    all = pp_rect_union(all, s->box);
    centres = pp_rect_add_point(centres, s->centre);
  }
  if (!pg->frames) {
    pg->frames = g_array_new(FALSE, FALSE, sizeof(pp_rect));
    for (guint i = 0; i < scene->marks->len; i++) {
      const pp_mark *m = g_ptr_array_index(scene->marks, i);
      pp_rect r;
      if (m->kind != PP_MARK_GLYPHS && pp_path_is_rectangle(m->path, 0.05, &r) &&
          pp_rect_area(r) <= PP_FRAME_MAX_PAGE * scene->width * scene->height)
        g_array_append_val(pg->frames, r);
    }
  }
  pp_rect best = all;
  double best_a = INFINITY;
  for (guint i = 0; i < pg->frames->len; i++) {
    pp_rect r = g_array_index(pg->frames, pp_rect, i);
    /* every centre strictly inside: the centres' box is */
    gboolean holds =
        centres.x0 > r.x0 && centres.x1 < r.x1 && centres.y0 > r.y0 && centres.y1 < r.y1;
    if (holds && pp_rect_area(r) < best_a) {
      best_a = pp_rect_area(r);
      best = r;
    }
  }
  return best;
}

/* The symbol's name: the nearest word under it (below its number, for icons) that is not
 * a number, centred on it. */
static char *name_of(pp_symbol_page *pg, const pp_symbol *s) {
  const pp_scene *scene = pg->ctx->scene;
  if (!pg->words) {
    g_autofree pp_rect *at = g_new(pp_rect, MAX(scene->words->len, 1));
    for (guint i = 0; i < scene->words->len; i++) {
      const pp_text_run *w = g_ptr_array_index(scene->words, i);
      double cx = (w->box.x0 + w->box.x1) / 2;
      at[i] = (pp_rect){cx, w->box.y0, cx, w->box.y0};
      pg->word_size = fmax(pg->word_size, w->font_size);
    }
    pg->words = pp_box_grid_new(at, scene->words->len);
  }
  g_autoptr(GArray) hits = g_array_new(FALSE, FALSE, sizeof(guint));
  pp_box_grid_query(pg->words,
                    (pp_rect){s->box.x0, s->box.y1 - 0.5, s->box.x1, s->box.y1 + 4 * pg->word_size},
                    hits);
  const pp_text_run *best = NULL;
  for (guint j = 0; j < hits->len; j++) {
    const pp_text_run *w = g_ptr_array_index(scene->words, g_array_index(hits, guint, j));
    double cx = (w->box.x0 + w->box.x1) / 2;
    pp_number num;
    if (cx < s->box.x0 || cx > s->box.x1 || w->box.y0 < s->box.y1 - 0.5 ||
        w->box.y0 - s->box.y1 > 4 * w->font_size ||
        pp_number_parse(w->text, PP_DECIMAL_UNKNOWN, &num))
      continue;
    if (!best || w->box.y0 < best->box.y0)
      best = w;
  }
  return best ? g_strdup(best->text) : NULL;
}

static int cmp_x(gconstpointer a, gconstpointer b) {
  const pp_element *ea = a, *eb = b;
  double xa = ea->box.x0 + ea->box.x1, xb = eb->box.x0 + eb->box.x1;
  return (xa > xb) - (xa < xb);
}

static int cmp_tick_pos(gconstpointer a, gconstpointer b) {
  const pp_tick *ta = a, *tb = b;
  return (ta->pos > tb->pos) - (ta->pos < tb->pos);
}

/* Tick labels step evenly through their values; a row of numbers under pictograms that a
 * loose fit happened to accept does not (PP_SYMBOL_TICK_STEP_SHARE). */
static gboolean evenly_stepped(const pp_axis_candidate *a) {
  if (a->fit_failed || !a->scale || !a->scale->ticks || a->scale->ticks->len < 3)
    return FALSE;
  g_autoptr(GArray) t = g_array_copy(a->scale->ticks);
  g_array_sort(t, cmp_tick_pos);
  double step = g_array_index(t, pp_tick, 1).value - g_array_index(t, pp_tick, 0).value;
  for (guint k = 2; k < t->len; k++) {
    double d = g_array_index(t, pp_tick, k).value - g_array_index(t, pp_tick, k - 1).value;
    if (!(fabs(d - step) <= PP_SYMBOL_TICK_STEP_SHARE * fabs(step)) || step == 0)
      return FALSE;
  }
  return TRUE;
}

/* Each of the axis' labels is centred on a filled circle of its own: numbers printed in
 * bubbles that happen to step evenly across a row, not tick labels (a scale's labels
 * sit beside its plot, one per tick, never each inside a bubble). */
static gboolean labels_on_bubbles(pp_symbol_page *pg, const pp_axis_candidate *a) {
  g_autoptr(GArray) near = g_array_new(FALSE, FALSE, sizeof(guint));
  g_autoptr(GHashTable) seen = g_hash_table_new(NULL, NULL);
  double reach = 0; /* the largest radius: no centre farther from a label holds it */
  for (guint i = 0; i < pg->syms->len; i++)
    reach = fmax(reach, g_array_index(pg->syms, pp_symbol, i).r);
  for (guint k = 0; k < a->labels->len; k++) {
    const pp_label *l = g_ptr_array_index(a->labels, k);
    g_array_set_size(near, 0);
    pp_box_grid_query(pg->centres,
                      (pp_rect){l->centre.x - reach, l->centre.y - reach, l->centre.x + reach,
                                l->centre.y + reach},
                      near);
    const pp_symbol *on = NULL;
    for (guint i = 0; i < near->len && !on; i++) {
      const pp_symbol *s = &g_array_index(pg->syms, pp_symbol, g_array_index(near, guint, i));
      if (s->circle && !s->outline && !g_hash_table_contains(seen, s) &&
          hypot(l->centre.x - s->centre.x, l->centre.y - s->centre.y) <= s->r)
        on = s;
    }
    if (!on)
      return FALSE;
    g_hash_table_add(seen, (gpointer)on);
  }
  return a->labels->len > 0;
}

/* Sizes must grow with the printed numbers before their ink is judged against them. */
static void weigh_size_law(pp_figure *fig) {
  guint n = fig->elements->len;
  g_autofree double *v = g_new(double, MAX(n, 1));
  g_autofree double *g = g_new(double, MAX(n, 1));
  for (guint i = 0; i < n; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    v[i] = e->value, g[i] = e->ink;
  }
  pp_power_fit fit;
  if (n >= 2 && pp_power_fit_compute(v, g, n, &fit) && fit.exponent > 0 &&
      fit.r2 >= PP_SYMBOL_MIN_FIT_R2) {
    pp_figure_add_evidence(fig, "size-follows-numbers", fit.r2);
    return;
  }
  fig->judged = FALSE;
  fig->not_judged_reason =
      g_strdup("symbol sizes do not grow with their numbers: the numbers are not sizes");
}

static void build(pp_symbol_page *pg, int family) {
  pp_recognize_ctx *ctx = pg->ctx;
  const GArray *mem = g_ptr_array_index(pg->members, family);
  guint n = mem->len;
  double lo = INFINITY, hi = 0;
  for (guint i = 0; i < n; i++) {
    const pp_symbol *s = &g_array_index(pg->syms, pp_symbol, g_array_index(mem, guint, i));
    lo = fmin(lo, s->ink), hi = fmax(hi, s->ink);
  }
  if (n < PP_SYMBOL_MIN_COUNT || hi < PP_SYMBOL_MIN_SPREAD * lo ||
      g_array_index(pg->syms, pp_symbol, g_array_index(mem, guint, 0)).outline)
    return; /* outlined circles are read only as a size key */
  /* values: a number on every pp_symbol, else a size key; tick labels of a fitted axis are
   * never a symbol's number (pg->tick_labels) */
  g_autoptr(GHashTable) used = g_hash_table_new(NULL, NULL);
  guint labelled = 0;
  for (guint i = 0; i < n; i++) {
    pp_symbol *s = &g_array_index(pg->syms, pp_symbol, g_array_index(mem, guint, i));
    s->label = label_of(pg, s, used);
    if (s->label) {
      g_hash_table_add(used, (gpointer)s->label);
      labelled++;
    }
  }
  pp_power_fit key = {0};
  g_autoptr(GArray) key_members = g_array_new(FALSE, FALSE, sizeof(guint));
  gboolean by_key = FALSE;
  if (labelled < n && labelled < PP_SYMBOL_MIN_LABELLED * n) {
    if (labelled > 0 || !pp_size_key_find(pg, family, &key, key_members))
      return;
    by_key = TRUE;
  }
  pp_claims_begin(ctx->claims);
  pp_figure *fig = pp_figure_new(PP_FIGURE_BUBBLE);
  fig->recognizer = OWNER;
  for (guint i = 0; i < n; i++) {
    pp_symbol *s = &g_array_index(pg->syms, pp_symbol, g_array_index(mem, guint, i));
    pp_claims_take_mark(ctx->claims, s->mark, OWNER);
    if (!by_key && !s->label)
      continue; /* part of the chart, but its number is hidden: no element */
    pp_element e = pp_element_init(PP_ENCODING_AREA);
    pp_element_add_part(&e, s->mark, PP_PART_BODY, s->ink);
    e.ink = s->ink;
    e.box = s->box;
    e.extent = sqrt(s->ink / G_PI);
    e.category = name_of(pg, s);
    if (s->circle) {
      e.shape.kind = PP_SHAPE_CIRCLE;
      e.shape.circle.centre = s->centre;
      e.shape.circle.r = s->r;
    } else {
      e.shape.kind = PP_SHAPE_POLYGON;
    }
    if (by_key) {
      /* invert the key's own law: ink = c·value^k */
      e.value = exp((log(s->ink) - key.log_coeff) / key.exponent);
      e.source = PP_VALUE_SIZE_KEY;
    } else {
      e.value = e.label_value = s->label->number.value;
      e.label_text = g_strdup(s->label->text);
      e.source = s->label->number.percent ? PP_VALUE_PERCENT_LABEL : PP_VALUE_DATA_LABEL;
      pp_claims_take_label(ctx->claims, s->label->index, PP_OWNER_DATA_LABEL);
    }
    g_array_append_val(fig->elements, e);
  }
  for (guint k = 0; k < key_members->len; k++) {
    pp_symbol *s = &g_array_index(pg->syms, pp_symbol, g_array_index(key_members, guint, k));
    pp_claims_take_mark(ctx->claims, s->mark, OWNER);
    pp_claims_take_label(ctx->claims, s->label->index, OWNER);
  }
  g_array_sort(fig->elements, cmp_x);
  fig->bbox = plot_box(pg, family);
  fig->n_series = 1;
  pp_figure_add_evidence(fig, "symbol-family", 1);
  pp_figure_add_evidence(fig, by_key ? "size-key" : "data-labels", 1);
  weigh_size_law(fig);
  pp_claims_commit(ctx->claims);
  pp_figure_finish(ctx, fig, NULL);
}

void pp_recognize_symbols(pp_recognize_ctx *ctx) {
  g_autoptr(GArray) syms = collect(ctx);
  int n = assign_families(ctx->scene, syms);
  pp_symbol_page pg = {.ctx = ctx, .syms = syms};
  pg.members = g_ptr_array_new_with_free_func((GDestroyNotify)g_array_unref);
  for (int f = 0; f < n; f++)
    g_ptr_array_add(pg.members, g_array_new(FALSE, FALSE, sizeof(guint)));
  g_autofree pp_rect *at = g_new(pp_rect, MAX(MAX(syms->len, ctx->labels->len), 1));
  for (guint i = 0; i < syms->len; i++) {
    const pp_symbol *s = &g_array_index(syms, pp_symbol, i);
    g_array_append_val(g_ptr_array_index(pg.members, s->family), i);
    at[i] = (pp_rect){s->centre.x, s->centre.y, s->centre.x, s->centre.y};
  }
  pg.centres = pp_box_grid_new(at, syms->len);
  for (guint k = 0; k < ctx->labels->len; k++) {
    const pp_label *l = g_ptr_array_index(ctx->labels, k);
    at[k] = pp_rect_add_point(l->box, l->centre);
    pg.label_size = fmax(pg.label_size, l->size);
  }
  pg.labels = pp_box_grid_new(at, ctx->labels->len);
  pg.tick_labels = g_hash_table_new(NULL, NULL);
  for (guint i = 0; i < ctx->axes->len; i++) {
    const pp_axis_candidate *a = g_ptr_array_index(ctx->axes, i);
    if (!evenly_stepped(a) || labels_on_bubbles(&pg, a))
      continue;
    for (guint k = 0; k < a->labels->len; k++)
      g_hash_table_add(pg.tick_labels, g_ptr_array_index(a->labels, k));
  }
  pg.key_families = g_array_new(FALSE, FALSE, sizeof(int));
  for (int f = 0; f < n; f++) {
    guint len = ((GArray *)g_ptr_array_index(pg.members, f))->len;
    if (len >= 2 && len <= PP_SYMBOL_KEY_MAX)
      g_array_append_val(pg.key_families, f);
  }
  for (int f = 0; f < n; f++)
    build(&pg, f);
  g_ptr_array_unref(pg.members);
  pp_box_grid_free(pg.centres);
  pp_box_grid_free(pg.labels);
  pp_box_grid_free(pg.words);
  if (pg.frames)
    g_array_unref(pg.frames);
  g_hash_table_unref(pg.tick_labels);
  g_array_unref(pg.key_families);
}
