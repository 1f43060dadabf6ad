/* pies.c — recognizer: flat pies and donuts. Sectors (or annular sectors) of one circle
 * whose angles tile the full turn, pulled-out slices and slices drawn in pieces included,
 * a hole painted white on top read as a donut; each slice's printed share or value found
 * inside it, at a leader line's end or in a legend matched by colour. A circle, a gauge,
 * a logo or a progress ring does not tile a turn with two or more slices: no pie. */
#include <math.h>
#include <string.h>

#include "internal.h"

#define OWNER "pies"

/* Slices of one pie have one radius within this share (producers' rounding of the arc
 * control points; common practice, no source). */
#define PP_PIE_SAME_RADIUS 0.02
/* ...and one inner radius (donuts) within this fraction of the outer one. */
#define PP_PIE_SAME_INNER 0.03
/* A slice may be pulled out from the centre by up to this many radii (exploded pies:
 * producers' defaults are 0.1–0.2; common practice, no source). */
#define PP_PIE_EXPLODE_MAX 0.4
/* Angles tile the turn within this share of it (half a degree: arcs are exact to far
 * better; common practice, no source). */
#define PP_PIE_TILE_TOL 0.0015
/* Pieces of one slice share their apex within this distance, pt. */
#define PP_PIE_SAME_APEX 0.5

static gboolean is_circle_wedge(const pp_wedge_candidate *c) {
  return (c->w.kind == PP_WEDGE_SECTOR || c->w.kind == PP_WEDGE_ANNULAR) &&
         c->w.outer.ry / c->w.outer.rx > PP_CIRCLE_AXIS_RATIO;
}

static gboolean same_pie(const pp_wedge_candidate *a, const pp_wedge_candidate *b) {
  double r = fmax(a->w.outer.rx, b->w.outer.rx);
  return is_circle_wedge(b) && fabs(a->w.outer.rx - b->w.outer.rx) <= PP_PIE_SAME_RADIUS * r &&
         fabs(a->w.inner - b->w.inner) <= PP_PIE_SAME_INNER &&
         hypot(a->w.outer.centre.x - b->w.outer.centre.x,
               a->w.outer.centre.y - b->w.outer.centre.y) <= PP_PIE_EXPLODE_MAX * r;
}

static pp_slice slice_of(const pp_wedge_candidate *c) {
  pp_slice s = {0};
  s.ellipse = c->w.outer;
  s.inner = c->w.inner;
  s.a0 = c->w.a0;
  s.a1 = c->w.a1;
  s.paint = c->paint;
  s.n_parts = 1;
  s.marks[0] = c->mark;
  s.roles[0] = PP_PART_BODY;
  s.inks[0] = c->ink;
  s.box = c->box;
  s.face = pp_rect_empty();
  return s;
}

/* Digits after the printed number's decimal mark. */
static int decimals_of(const char *text) {
  const char *dot = strpbrk(text, ".,");
  int n = 0;
  while (dot && dot[1 + n] >= '0' && dot[1 + n] <= '9')
    n++;
  return n == 3 && *dot == ',' ? 0 : n; /* "1,250" groups thousands */
}

/* A printed percentage fits the sweep within half a unit of its last digit. */
static gboolean percent_fits(const pp_label *lab, double sweep) {
  double half = 0.5 * pow(10, -decimals_of(lab->text)) / 100;
  return fabs(sweep / (2 * G_PI) - lab->number.value / 100) <= half + PP_PIE_TILE_TOL;
}

/* Two pieces are two slices of one colour (a palette that wraps, say) when one carries a
 * percentage that fits it alone and not the two together. */
static gboolean label_fits_alone(const pp_slice *a, const pp_slice *b) {
  const pp_slice *l = a->label ? a : b;
  if (!l->label || !l->label->number.percent)
    return FALSE;
  double both = (a->a1 - a->a0) + (b->a1 - b->a0);
  return percent_fits(l->label, l->a1 - l->a0) && !percent_fits(l->label, both);
}

static int cmp_a0(gconstpointer pa, gconstpointer pb) {
  const pp_slice *a = pa, *b = pb;
  return (a->a0 > b->a0) - (a->a0 < b->a0);
}

/* Pieces of one slice: same colour and apex, one ending where the next starts, and not
 * both labelled (two labelled slices of one colour side by side are two slices), nor one
 * whose percentage fits it alone. */
static void merge_pieces(GArray *slices) {
  g_array_sort(slices, cmp_a0);
  gboolean merged = TRUE;
  while (merged && slices->len > 1) {
    merged = FALSE;
    for (guint k = 0; k < slices->len && !merged; k++) {
      guint j = (k + 1) % slices->len;
      pp_slice *a = &g_array_index(slices, pp_slice, k), *b = &g_array_index(slices, pp_slice, j);
      if (!pp_paint_same(&a->paint, &b->paint) || (a->label && b->label) ||
          label_fits_alone(a, b) ||
          hypot(a->ellipse.centre.x - b->ellipse.centre.x,
                a->ellipse.centre.y - b->ellipse.centre.y) > PP_PIE_SAME_APEX ||
          fabs(remainder(b->a0 - a->a1, 2 * G_PI)) > PP_PIE_TILE_TOL * 2 * G_PI ||
          a->n_parts + b->n_parts > PP_SLICE_MAX_PARTS)
        continue;
      a->a1 += b->a1 - b->a0;
      if (!a->label) {
        a->label = b->label;
        a->category = b->category;
        b->category = NULL;
      }
      g_free(b->category);
      for (guint p = 0; p < b->n_parts; p++) {
        a->marks[a->n_parts] = b->marks[p];
        a->roles[a->n_parts] = b->roles[p];
        a->inks[a->n_parts++] = b->inks[p];
      }
      a->box = pp_rect_union(a->box, b->box);
      g_array_remove_index(slices, j);
      merged = TRUE;
    }
  }
}

static int cmp_double(gconstpointer a, gconstpointer b) {
  double x = *(const double *)a, y = *(const double *)b;
  return (x > y) - (x < y);
}

/* The pie's centre: the median of the slices' apexes (most slices are not pulled out). */
static pp_point common_centre(GArray *slices) {
  guint n = slices->len;
  double *xs = g_new(double, n), *ys = g_new(double, n);
  for (guint k = 0; k < n; k++) {
    xs[k] = g_array_index(slices, pp_slice, k).ellipse.centre.x;
    ys[k] = g_array_index(slices, pp_slice, k).ellipse.centre.y;
  }
  qsort(xs, n, sizeof(double), cmp_double);
  qsort(ys, n, sizeof(double), cmp_double);
  pp_point c = {xs[n / 2], ys[n / 2]};
  g_free(xs);
  g_free(ys);
  return c;
}

/* A white disc painted over the centre after the slices: a donut's hole. */
static int white_hole(const pp_recognize_ctx *ctx, GArray *cands, pp_point c, double r,
                      guint after) {
  for (guint i = 0; i < cands->len; i++) {
    const pp_wedge_candidate *h = &g_array_index(cands, pp_wedge_candidate, i);
    if (h->w.kind == PP_WEDGE_FULL && h->mark > after && h->paint.r > 0.97 && h->paint.g > 0.97 &&
        h->paint.b > 0.97 && h->w.outer.rx < 0.95 * r &&
        hypot(h->w.outer.centre.x - c.x, h->w.outer.centre.y - c.y) < 1 &&
        pp_claims_mark_free(ctx->claims, h->mark))
      return (int)i;
  }
  return -1;
}

static void build(pp_recognize_ctx *ctx, GArray *cands, GArray *slices) {
  pp_point c = common_centre(slices);
  double r = g_array_index(slices, pp_slice, 0).ellipse.rx;
  guint last_mark = 0;
  for (guint k = 0; k < slices->len; k++) {
    pp_slice *s = &g_array_index(slices, pp_slice, k);
    s->offset = hypot(s->ellipse.centre.x - c.x, s->ellipse.centre.y - c.y);
    for (guint p = 0; p < s->n_parts; p++)
      last_mark = MAX(last_mark, s->marks[p]);
  }
  int hole = white_hole(ctx, cands, c, r, last_mark);
  double hole_frac = 0;
  if (hole >= 0)
    hole_frac = g_array_index(cands, pp_wedge_candidate, hole).w.outer.rx / r;

  pp_claims_begin(ctx->claims);
  for (guint k = 0; k < slices->len; k++) {
    pp_slice *s = &g_array_index(slices, pp_slice, k);
    for (guint p = 0; p < s->n_parts; p++)
      pp_claims_take_mark_if_free(ctx->claims, s->marks[p], OWNER);
    if (hole >= 0 && s->inner < hole_frac) {
      /* The white disc hides the same fraction of every sector's area. */
      double keep = (1 - hole_frac * hole_frac) / (1 - s->inner * s->inner);
      for (guint p = 0; p < s->n_parts; p++)
        s->inks[p] *= keep;
      s->inner = hole_frac;
    }
  }
  if (hole >= 0)
    pp_claims_take_mark(ctx->claims, g_array_index(cands, pp_wedge_candidate, hole).mark, OWNER);
  gboolean legend = FALSE;
  pp_slices_attach_labels(ctx, slices, OWNER, &legend);
  merge_pieces(slices);
  guint labelled = 0;
  for (guint k = 0; k < slices->len; k++)
    labelled += g_array_index(slices, pp_slice, k).label != NULL;
  pp_slices_sort_clockwise(slices);

  pp_figure *fig = pp_figure_new(PP_FIGURE_PIE);
  fig->recognizer = OWNER;
  guint n_percent = 0;
  for (guint k = 0; k < slices->len; k++) {
    const pp_slice *s = &g_array_index(slices, pp_slice, k);
    pp_element el = pp_element_init(PP_ENCODING_ANGLE);
    el.shape.kind = PP_SHAPE_SECTOR;
    el.shape.sector.centre = s->ellipse.centre;
    el.shape.sector.rx = s->ellipse.rx;
    el.shape.sector.ry = s->ellipse.ry;
    el.shape.sector.inner = s->inner;
    el.shape.sector.a0 = s->a0;
    el.shape.sector.a1 = s->a1;
    el.shape.sector.offset = s->offset;
    for (guint p = 0; p < s->n_parts; p++) {
      pp_element_add_part(&el, s->marks[p], s->roles[p], s->inks[p]);
      el.ink += s->inks[p];
    }
    el.extent = s->a1 - s->a0;
    el.box = s->box;
    el.series = k;
    pp_slice_set_value(&el, s);
    n_percent += s->label && s->label->number.percent;
    fig->bbox = pp_rect_union(fig->bbox, s->box);
    g_array_append_val(fig->elements, el);
  }
  pp_slices_finish(ctx, fig, labelled, slices->len,
                   legend      ? "legend"
                   : n_percent ? "percent-labels"
                               : "data-labels");
}

void pp_recognize_pies(pp_recognize_ctx *ctx) {
  g_autoptr(GArray) cands = pp_wedge_candidates_collect(ctx);
  gboolean *used = g_new0(gboolean, MAX(cands->len, 1));
  g_autoptr(GArray) slices = g_array_new(FALSE, FALSE, sizeof(pp_slice));
  for (guint i = 0; i < cands->len; i++) {
    const pp_wedge_candidate *a = &g_array_index(cands, pp_wedge_candidate, i);
    if (used[i] || !is_circle_wedge(a) || !pp_claims_mark_free(ctx->claims, a->mark))
      continue;
    g_autoptr(GArray) group = g_array_new(FALSE, FALSE, sizeof(guint));
    g_array_append_val(group, i);
    used[i] = TRUE;
    for (guint j = i + 1; j < cands->len; j++) {
      const pp_wedge_candidate *b = &g_array_index(cands, pp_wedge_candidate, j);
      if (!used[j] && same_pie(a, b) && pp_claims_mark_free(ctx->claims, b->mark)) {
        g_array_append_val(group, j);
        used[j] = TRUE;
      }
    }
    pp_slices_clear(slices);
    for (guint k = 0; k < group->len; k++) {
      pp_slice s =
          slice_of(&g_array_index(cands, pp_wedge_candidate, g_array_index(group, guint, k)));
      g_array_append_val(slices, s);
    }
    if (!pp_slices_tile_turn(slices, PP_PIE_TILE_TOL))
      continue;
    build(ctx, cands, slices);
  }
  pp_slices_clear(slices);
  g_free(used);
}
