/* radial.c — recognizer: radial bars and polar-area charts. Radial bars are concentric
 * rings sharing a centre and a starting angle, one annular sector per ring, each sweep
 * standing for its value; a polar-area chart is sectors of equal angle sharing an apex
 * and tiling the turn, each radius standing for its value. Values are the printed
 * numbers at a ring's start or end, or beyond a sector's tip. A gauge or a logo (sectors
 * of one ring) and a progress ring (one ring) are neither. */
#include <math.h>

#include "internal.h"

#define OWNER_RINGS "radial-bars"
#define OWNER_POLAR "polar-area"

/* Rings and sectors of one chart share their centre within this distance, pt. */
#define PP_RADIAL_SAME_CENTRE 1.0
/* Rings start at one angle within this many radians (1°; common practice, no source). */
#define PP_RADIAL_SAME_START (G_PI / 180)
/* A ring's label lies within this many points (plus the ring's width) of its start or end. */
#define PP_RADIAL_LABEL_REACH 12.0
/* Polar-area sectors have one angle within this share of it (common practice). */
#define PP_POLAR_SAME_SWEEP 0.01
/* ...their radii differ by more than this factor somewhere (else it is a plain pie). */
#define PP_POLAR_MIN_SPREAD 1.05
/* ...and a value label lies beyond a tip by at most this many points. */
#define PP_POLAR_LABEL_REACH 40.0

/* A full-turn ring is a track drawn behind a bar (or a donut's whole ring), never a bar. */
#define PP_RADIAL_TRACK_SWEEP (0.999 * 2 * G_PI)

static gboolean is_circular(const pp_wedge_candidate *c) {
  return c->w.outer.ry / c->w.outer.rx > PP_CIRCLE_AXIS_RATIO &&
         c->w.a1 - c->w.a0 < PP_RADIAL_TRACK_SWEEP;
}

static gboolean same_centre(const pp_wedge_candidate *a, const pp_wedge_candidate *b) {
  return hypot(a->w.outer.centre.x - b->w.outer.centre.x,
               a->w.outer.centre.y - b->w.outer.centre.y) <= PP_RADIAL_SAME_CENTRE;
}

static double box_distance(pp_rect b, pp_point p) {
  double dx = fmax(0, fmax(b.x0 - p.x, p.x - b.x1)), dy = fmax(0, fmax(b.y0 - p.y, p.y - b.y1));
  return hypot(dx, dy);
}

static pp_element element_of(const pp_wedge_candidate *c, pp_encoding enc) {
  pp_element el = pp_element_init(enc);
  el.shape.kind = PP_SHAPE_SECTOR;
  el.shape.sector.centre = c->w.outer.centre;
  el.shape.sector.rx = c->w.outer.rx;
  el.shape.sector.ry = c->w.outer.ry;
  el.shape.sector.inner = c->w.inner;
  el.shape.sector.a0 = c->w.a0;
  el.shape.sector.a1 = c->w.a1;
  pp_element_add_part(&el, c->mark, PP_PART_BODY, c->ink);
  el.ink = c->ink;
  el.box = c->box;
  return el;
}

static void set_label(pp_recognize_ctx *ctx, pp_element *el, const pp_label *lab,
                      const char *owner) {
  el->label_value = el->value = lab->number.value;
  el->label_text = g_strdup(lab->text);
  el->source = PP_VALUE_DATA_LABEL;
  pp_claims_take_label(ctx->claims, lab->index, owner);
}

static int cmp_inner(gconstpointer pa, gconstpointer pb, gpointer data) {
  GArray *cands = data;
  double a = g_array_index(cands, pp_wedge_candidate, *(const guint *)pa).w.outer.rx;
  double b = g_array_index(cands, pp_wedge_candidate, *(const guint *)pb).w.outer.rx;
  return (a > b) - (a < b);
}

/* The free number nearest a ring's start or end point (at its mid radius). */
static const pp_label *ring_label(const pp_recognize_ctx *ctx, const pp_wedge_candidate *c,
                                  const gboolean *taken) {
  const pp_wedge *w = &c->w;
  pp_ellipse mid = w->outer;
  mid.rx = mid.ry = w->outer.rx * (1 + w->inner) / 2;
  double width = w->outer.rx * (1 - w->inner);
  pp_point ends[2] = {pp_ellipse_point(&mid, w->a0), pp_ellipse_point(&mid, w->a1)};
  const pp_label *best = NULL;
  double best_d = PP_RADIAL_LABEL_REACH + width;
  for (guint l = 0; l < ctx->labels->len; l++) {
    const pp_label *lab = g_ptr_array_index(ctx->labels, l);
    if (taken[l] || !pp_claims_label_free(ctx->claims, lab->index))
      continue;
    for (int e = 0; e < 2; e++) {
      double d = box_distance(lab->box, ends[e]);
      if (d < best_d) {
        best_d = d;
        best = lab;
      }
    }
  }
  return best;
}

/* Concentric rings with one start: a radial bar chart. */
static void try_rings(pp_recognize_ctx *ctx, GArray *cands, GArray *group) {
  g_array_sort_with_data(group, cmp_inner, cands);
  if (group->len < 2)
    return;
  gboolean start0 = TRUE, start1 = TRUE;
  const pp_wedge_candidate *first =
      &g_array_index(cands, pp_wedge_candidate, g_array_index(group, guint, 0));
  for (guint k = 1; k < group->len; k++) {
    const pp_wedge_candidate *prev =
        &g_array_index(cands, pp_wedge_candidate, g_array_index(group, guint, k - 1));
    const pp_wedge_candidate *c =
        &g_array_index(cands, pp_wedge_candidate, g_array_index(group, guint, k));
    /* Rings do not overlap: each starts beyond the previous one's outer edge. */
    if (c->w.outer.rx * c->w.inner < prev->w.outer.rx - 0.5)
      return;
    start0 = start0 && fabs(remainder(c->w.a0 - first->w.a0, 2 * G_PI)) < PP_RADIAL_SAME_START;
    start1 = start1 && fabs(remainder(c->w.a1 - first->w.a1, 2 * G_PI)) < PP_RADIAL_SAME_START;
  }
  if (!start0 && !start1)
    return;
  pp_claims_begin(ctx->claims);
  gboolean *taken = g_new0(gboolean, MAX(ctx->labels->len, 1));
  pp_figure *fig = pp_figure_new(PP_FIGURE_RADIAL_BAR);
  fig->recognizer = OWNER_RINGS;
  guint labelled = 0;
  for (guint k = 0; k < group->len; k++) {
    const pp_wedge_candidate *c =
        &g_array_index(cands, pp_wedge_candidate, g_array_index(group, guint, k));
    pp_claims_take_mark(ctx->claims, c->mark, OWNER_RINGS);
    pp_element el = element_of(c, PP_ENCODING_ANGLE);
    el.extent = c->w.a1 - c->w.a0;
    const pp_label *lab = ring_label(ctx, c, taken);
    if (lab) {
      for (guint l = 0; l < ctx->labels->len; l++)
        if (g_ptr_array_index(ctx->labels, l) == lab)
          taken[l] = TRUE;
      set_label(ctx, &el, lab, OWNER_RINGS);
      labelled++;
    }
    fig->bbox = pp_rect_union(fig->bbox, c->box);
    g_array_append_val(fig->elements, el);
  }
  g_free(taken);
  /* The chart's box is the outer ring's whole circle. */
  const pp_wedge_candidate *outer =
      &g_array_index(cands, pp_wedge_candidate, g_array_index(group, guint, group->len - 1));
  pp_point c = outer->w.outer.centre;
  double r = outer->w.outer.rx;
  fig->bbox = (pp_rect){c.x - r, c.y - r, c.x + r, c.y + r};
  fig->n_series = 1;
  pp_figure_add_evidence(fig, "concentric-rings", 0.8);
  pp_figure_add_evidence(fig, "common-start", 0.5);
  if (labelled == group->len) {
    pp_figure_add_evidence(fig, "data-labels", 0.9);
  } else {
    fig->judged = FALSE;
    fig->not_judged_reason = g_strdup("rings without a printed value");
  }
  pp_claims_commit(ctx->claims);
  pp_figure_finish(ctx, fig, NULL);
}

/* Sectors of equal angle tiling the turn with different radii: a polar-area chart. */
static void try_polar(pp_recognize_ctx *ctx, GArray *cands, GArray *group) {
  if (group->len < 3)
    return;
  double sweep0 = -1, total = 0, rmin = INFINITY, rmax = 0;
  for (guint k = 0; k < group->len; k++) {
    const pp_wedge_candidate *c =
        &g_array_index(cands, pp_wedge_candidate, g_array_index(group, guint, k));
    double sw = c->w.a1 - c->w.a0;
    if (sweep0 < 0)
      sweep0 = sw;
    if (c->w.kind != PP_WEDGE_SECTOR || fabs(sw - sweep0) > PP_POLAR_SAME_SWEEP * sweep0)
      return;
    total += sw;
    rmin = fmin(rmin, c->w.outer.rx);
    rmax = fmax(rmax, c->w.outer.rx);
  }
  if (fabs(total - 2 * G_PI) > PP_POLAR_SAME_SWEEP * 2 * G_PI || rmax < PP_POLAR_MIN_SPREAD * rmin)
    return;
  pp_claims_begin(ctx->claims);
  pp_figure *fig = pp_figure_new(PP_FIGURE_POLAR_AREA);
  fig->recognizer = OWNER_POLAR;
  guint labelled = 0;
  gboolean *taken = g_new0(gboolean, MAX(ctx->labels->len, 1));
  for (guint k = 0; k < group->len; k++) {
    const pp_wedge_candidate *c =
        &g_array_index(cands, pp_wedge_candidate, g_array_index(group, guint, k));
    pp_claims_take_mark(ctx->claims, c->mark, OWNER_POLAR);
    pp_element el = element_of(c, PP_ENCODING_RADIUS);
    el.extent = c->w.outer.rx;
    int best = -1;
    double best_off = INFINITY, mid = (c->w.a0 + c->w.a1) / 2;
    for (guint l = 0; l < ctx->labels->len; l++) {
      const pp_label *lab = g_ptr_array_index(ctx->labels, l);
      if (taken[l] || !pp_claims_label_free(ctx->claims, lab->index))
        continue;
      double a, d;
      pp_slice_coords(&c->w.outer, lab->centre, &a, &d);
      if (!pp_angle_within(a, c->w.a0, c->w.a1) || d < 0.5 ||
          d > 1 + PP_POLAR_LABEL_REACH / c->w.outer.rx)
        continue;
      double off = fabs(remainder(a - mid, 2 * G_PI));
      if (off < best_off) {
        best_off = off;
        best = (int)l;
      }
    }
    if (best >= 0) {
      taken[best] = TRUE;
      set_label(ctx, &el, g_ptr_array_index(ctx->labels, best), OWNER_POLAR);
      labelled++;
    }
    fig->bbox = pp_rect_union(fig->bbox, c->box);
    g_array_append_val(fig->elements, el);
  }
  g_free(taken);
  fig->n_series = 1;
  pp_figure_add_evidence(fig, "equal-angles-tile-turn", 0.8);
  if (labelled == group->len) {
    pp_figure_add_evidence(fig, "data-labels", 0.9);
  } else {
    fig->judged = FALSE;
    fig->not_judged_reason = g_strdup("sectors without a printed value");
  }
  pp_claims_commit(ctx->claims);
  pp_figure_finish(ctx, fig, NULL);
}

void pp_recognize_radial(pp_recognize_ctx *ctx) {
  g_autoptr(GArray) cands = pp_wedge_candidates_collect(ctx);
  gboolean *used = g_new0(gboolean, MAX(cands->len, 1));
  for (int pass = 0; pass < 2; pass++) {
    pp_wedge_kind kind = pass == 0 ? PP_WEDGE_ANNULAR : PP_WEDGE_SECTOR;
    for (guint i = 0; i < cands->len; i++) {
      const pp_wedge_candidate *a = &g_array_index(cands, pp_wedge_candidate, i);
      if (used[i] || a->w.kind != kind || !is_circular(a) ||
          !pp_claims_mark_free(ctx->claims, a->mark))
        continue;
      g_autoptr(GArray) group = g_array_new(FALSE, FALSE, sizeof(guint));
      for (guint j = i; j < cands->len; j++) {
        const pp_wedge_candidate *b = &g_array_index(cands, pp_wedge_candidate, j);
        if (!used[j] && b->w.kind == kind && is_circular(b) && same_centre(a, b) &&
            pp_claims_mark_free(ctx->claims, b->mark)) {
          g_array_append_val(group, j);
          used[j] = TRUE;
        }
      }
      if (kind == PP_WEDGE_ANNULAR)
        try_rings(ctx, cands, group);
      else
        try_polar(ctx, cands, group);
    }
  }
  g_free(used);
}
