/* radial.c — recognizer: radial bars and polar-area charts. Radial bars are concentric
 * rings sharing a centre and a starting angle, one annular sector per ring, each sweep
 * standing for its value; a polar-area chart is sectors of equal angle sharing an apex
 * and tiling the turn, each radius standing for its value. Values are the printed
 * numbers at a ring's start or end, or beyond a sector's tip. A gauge or a logo (sectors
 * of one ring) and a progress ring (one ring) are neither. */
#include <math.h>
#include <string.h>

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

/* An angular value scale: numbers printed around the rings, their centres between the
 * outer ring and this many outer radii from the centre, all within this ratio of one
 * distance (tick labels of a polar axis sit on one circle; common practice, no source). */
#define PP_ANGULAR_TICK_REACH 1.6
#define PP_ANGULAR_TICK_SAME_DIST 1.3
/* ...at least this many of them, spread over at least a quarter turn (two ticks make
 * any line; common practice, no source)... */
#define PP_ANGULAR_MIN_TICKS 3
#define PP_ANGULAR_MIN_SPREAD (G_PI / 2)
/* ...and values linear in the angle within this share of their range (rms; a printed
 * scale is exact up to where its labels' centres sit; common practice, no source). */
#define PP_ANGULAR_FIT 0.02
/* A label this close to the common start (radians, 3°) is the scale's origin or its full
 * turn, whichever its value says (common practice, no source). */
#define PP_ANGULAR_AT_START (3 * G_PI / 180)
/* A ring's name sits within this many points of its start (common practice, no source). */
#define PP_RADIAL_NAME_REACH 24.0

/* A radial value axis: numbers printed along one ray from the centre, their centres
 * within this many points of it (text boxes sit beside their tick; common practice, no
 * source), out to this many outer radii... */
#define PP_RADIAL_AXIS_BAND 10.0
#define PP_RADIAL_AXIS_REACH 1.3
/* ...each read at the centred circle (grid line) within this many points of its text,
 * else at its text's nearest point to the centre (common practice, no source). */
#define PP_RADIAL_GRID_SNAP 8.0
/* A stroked path is a grid circle when its box is square within this share and centred
 * on the chart within this many points (common practice, no source). */
#define PP_GRID_SQUARE 0.01
#define PP_GRID_CENTRED 1.0

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

typedef struct {
  double offset, slope; /* value = offset + slope·(angle from the common start) */
  guint n;
  guint labels[64]; /* indexes into ctx->labels */
} pp_angular_scale;

/* The angle from the rings' common start in their sweep direction (dir +1: counter-
 * clockwise from start), in [−PP_ANGULAR_AT_START, 2π − PP_ANGULAR_AT_START). */
static double angle_from_start(double a, double start, int dir) {
  double u = fmod(dir * (a - start) + PP_ANGULAR_AT_START + 8 * G_PI, 2 * G_PI);
  return u - PP_ANGULAR_AT_START;
}

/* Printed numbers around the rings read as a linear angle→value scale, fitted by least
 * squares; FALSE when they are too few, not on one circle, not increasing along the sweep
 * or not linear. */
static gboolean angular_scale(const pp_recognize_ctx *ctx, const pp_ellipse *outer, double start,
                              int dir, pp_angular_scale *sc) {
  double us[64], vs[64], dmin = INFINITY, dmax = 0;
  guint n = 0;
  for (guint l = 0; l < ctx->labels->len && n < G_N_ELEMENTS(us); l++) {
    const pp_label *lab = g_ptr_array_index(ctx->labels, l);
    if (lab->number.year_like || !pp_claims_label_free(ctx->claims, lab->index))
      continue;
    double a, d;
    pp_slice_coords(outer, lab->centre, &a, &d);
    if (d < 1 || d > PP_ANGULAR_TICK_REACH)
      continue;
    us[n] = angle_from_start(a, start, dir);
    vs[n] = lab->number.value;
    sc->labels[n++] = l;
    dmin = fmin(dmin, d), dmax = fmax(dmax, d);
  }
  if (n < PP_ANGULAR_MIN_TICKS || dmax > PP_ANGULAR_TICK_SAME_DIST * dmin)
    return FALSE;
  /* A label at the start printing the largest value marks the full turn. */
  double vmax = -INFINITY, vmin = INFINITY;
  for (guint i = 0; i < n; i++)
    vmax = fmax(vmax, vs[i]), vmin = fmin(vmin, vs[i]);
  for (guint i = 0; i < n; i++)
    if (fabs(us[i]) < PP_ANGULAR_AT_START && vs[i] == vmax && vmax > vmin)
      us[i] += 2 * G_PI;
  /* Increasing along the sweep: order by angle, values strictly rising. */
  double umin = INFINITY, umax = -INFINITY;
  for (guint i = 0; i < n; i++) {
    umin = fmin(umin, us[i]), umax = fmax(umax, us[i]);
    for (guint j = 0; j < n; j++)
      if (us[j] > us[i] && vs[j] <= vs[i])
        return FALSE;
  }
  if (umax - umin < PP_ANGULAR_MIN_SPREAD)
    return FALSE;
  /* A number printed at the start is the scale's value there exactly (its text may sit
   * a little off the ray; the others fix the slope). */
  int at_start = -1;
  for (guint i = 0; i < n; i++)
    if (fabs(us[i]) < PP_ANGULAR_AT_START)
      at_start = (int)i;
  if (at_start >= 0) {
    double v0 = vs[at_start], suu = 0, suv = 0;
    for (guint i = 0; i < n; i++)
      if ((int)i != at_start)
        suu += us[i] * us[i], suv += us[i] * (vs[i] - v0);
    if (!(suu > 0))
      return FALSE;
    sc->offset = v0;
    sc->slope = suv / suu;
  } else {
    double su = 0, sv = 0, suu = 0, suv = 0;
    for (guint i = 0; i < n; i++)
      su += us[i], sv += vs[i], suu += us[i] * us[i], suv += us[i] * vs[i];
    double det = n * suu - su * su;
    if (!(det > 0))
      return FALSE;
    sc->slope = (n * suv - su * sv) / det;
    sc->offset = (sv - sc->slope * su) / n;
  }
  double rss = 0;
  for (guint i = 0; i < n; i++) {
    double r = vs[i] - sc->offset - sc->slope * us[i];
    rss += r * r;
  }
  sc->n = n;
  return sc->slope > 0 && sqrt(rss / n) <= PP_ANGULAR_FIT * (vmax - vmin);
}

/* A ring's name: the text line nearest its start that is not a number. */
static char *ring_name(const pp_scene *scene, const pp_wedge_candidate *c, double start) {
  pp_ellipse mid = c->w.outer;
  mid.rx = mid.ry = c->w.outer.rx * (1 + c->w.inner) / 2;
  pp_point p = pp_ellipse_point(&mid, start);
  const pp_text_line *best = NULL;
  double best_d = PP_RADIAL_NAME_REACH;
  for (guint i = 0; i < scene->lines->len; i++) {
    const pp_text_line *line = g_ptr_array_index(scene->lines, i);
    pp_number num;
    double d = box_distance(line->box, p);
    if (d < best_d && !pp_number_parse(line->text, PP_DECIMAL_UNKNOWN, &num)) {
      best_d = d;
      best = line;
    }
  }
  return best ? g_strdup(best->text) : NULL;
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
  /* Data labels at the rings' ends first; without one for every ring, an angular scale
   * printed around them. */
  gboolean *taken = g_new0(gboolean, MAX(ctx->labels->len, 1));
  const pp_label **labs = g_new0(const pp_label *, group->len);
  guint labelled = 0;
  for (guint k = 0; k < group->len; k++) {
    labs[k] = ring_label(
        ctx, &g_array_index(cands, pp_wedge_candidate, g_array_index(group, guint, k)), taken);
    for (guint l = 0; labs[k] && l < ctx->labels->len; l++)
      if (g_ptr_array_index(ctx->labels, l) == labs[k])
        taken[l] = TRUE;
    labelled += labs[k] != NULL;
  }
  pp_angular_scale sc = {0};
  gboolean scaled = FALSE;
  double start = 0;
  int dir = 1;
  const pp_wedge_candidate *outer_c =
      &g_array_index(cands, pp_wedge_candidate, g_array_index(group, guint, group->len - 1));
  for (int s = 0; s < 2 && labelled < group->len && !scaled; s++) {
    if (!(s == 0 ? start0 : start1))
      continue;
    start = s == 0 ? first->w.a0 : first->w.a1;
    dir = s == 0 ? 1 : -1;
    scaled = angular_scale(ctx, &outer_c->w.outer, start, dir, &sc);
  }
  pp_claims_begin(ctx->claims);
  pp_figure *fig = pp_figure_new(PP_FIGURE_RADIAL_BAR);
  fig->recognizer = OWNER_RINGS;
  for (guint k = 0; k < group->len; k++) {
    const pp_wedge_candidate *c =
        &g_array_index(cands, pp_wedge_candidate, g_array_index(group, guint, k));
    pp_claims_take_mark(ctx->claims, c->mark, OWNER_RINGS);
    pp_element el = element_of(c, PP_ENCODING_ANGLE);
    el.extent = c->w.a1 - c->w.a0;
    if (scaled) {
      el.value = el.scale_value = sc.offset + sc.slope * el.extent;
      el.source = PP_VALUE_SCALE;
      el.category = ring_name(ctx->scene, c, start);
    } else if (labs[k]) {
      set_label(ctx, &el, labs[k], OWNER_RINGS);
    }
    fig->bbox = pp_rect_union(fig->bbox, c->box);
    g_array_append_val(fig->elements, el);
  }
  for (guint i = 0; scaled && i < sc.n; i++)
    pp_claims_take_label(ctx->claims,
                         ((const pp_label *)g_ptr_array_index(ctx->labels, sc.labels[i]))->index,
                         OWNER_RINGS);
  g_free(labs);
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
  if (scaled) {
    pp_figure_add_evidence(fig, "angular-scale", 0.8);
  } else if (labelled == group->len) {
    pp_figure_add_evidence(fig, "data-labels", 0.9);
  } else {
    fig->judged = FALSE;
    fig->not_judged_reason = g_strdup("rings without a printed value or angular scale");
  }
  pp_claims_commit(ctx->claims);
  pp_figure_finish(ctx, fig, NULL);
}

typedef enum { PP_RADIAL_LINEAR, PP_RADIAL_SQUARE } pp_radial_model;

/* A radial axis: value = offset + slope·r (linear, a radius scaled by value) or
 * value = slope·r² (square: the axis spaced so that areas follow values). */
typedef struct {
  pp_radial_model model;
  double offset, slope;
  guint n;
  guint labels[64];
} pp_radial_axis;

/* The radius of the grid circle about c nearest to d, or d when none is within reach. */
static double grid_radius(const pp_scene *scene, pp_point c, double d) {
  double best = d, best_off = PP_RADIAL_GRID_SNAP;
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    double w = pp_rect_width(m->bbox), h = pp_rect_height(m->bbox);
    if (m->kind != PP_MARK_STROKE || !(w > 0) || fabs(w - h) > PP_GRID_SQUARE * w ||
        hypot((m->bbox.x0 + m->bbox.x1) / 2 - c.x, (m->bbox.y0 + m->bbox.y1) / 2 - c.y) >
            PP_GRID_CENTRED)
      continue;
    double r = (w + h) / 4;
    if (fabs(r - d) < best_off) {
      best_off = fabs(r - d);
      best = r;
    }
  }
  return best;
}

/* Least squares of v on x through (0, 0) when origin, else with an intercept; returns the
 * rms residual. */
static double fit_line(const double *x, const double *v, guint n, gboolean origin, double *offset,
                       double *slope) {
  double sx = 0, sv = 0, sxx = 0, sxv = 0;
  for (guint i = 0; i < n; i++)
    sx += x[i], sv += v[i], sxx += x[i] * x[i], sxv += x[i] * v[i];
  if (origin) {
    *offset = 0;
    *slope = sxx > 0 ? sxv / sxx : NAN;
  } else {
    double det = n * sxx - sx * sx;
    *slope = det > 0 ? (n * sxv - sx * sv) / det : NAN;
    *offset = (sv - *slope * sx) / n;
  }
  double rss = 0;
  for (guint i = 0; i < n; i++) {
    double r = v[i] - *offset - *slope * x[i];
    rss += r * r;
  }
  return isfinite(*slope) ? sqrt(rss / n) : INFINITY;
}

/* Printed numbers along one ray from the centre read as a radial value axis: the largest
 * set of free numbers on one ray, increasing outwards, fitted linear in the radius or in
 * its square (whichever fits; neither within PP_ANGULAR_FIT of their range: no axis). */
static gboolean radial_axis(const pp_recognize_ctx *ctx, pp_point c, double rmax,
                            pp_radial_axis *ax) {
  guint n_lab = ctx->labels->len, best_n = 0;
  guint *pick = g_new(guint, MAX(n_lab, 1)), *best = g_new(guint, MAX(n_lab, 1));
  for (guint a = 0; a < n_lab; a++) {
    const pp_label *anchor = g_ptr_array_index(ctx->labels, a);
    double ux = anchor->centre.x - c.x, uy = anchor->centre.y - c.y, len = hypot(ux, uy);
    if (anchor->number.year_like || !pp_claims_label_free(ctx->claims, anchor->index) ||
        len > PP_RADIAL_AXIS_REACH * rmax || !(len > 0))
      continue;
    ux /= len, uy /= len;
    guint n = 0;
    for (guint l = 0; l < n_lab; l++) {
      const pp_label *lab = g_ptr_array_index(ctx->labels, l);
      double dx = lab->centre.x - c.x, dy = lab->centre.y - c.y;
      double along = dx * ux + dy * uy, across = fabs(dx * uy - dy * ux);
      if (!lab->number.year_like && pp_claims_label_free(ctx->claims, lab->index) && along > 0 &&
          along <= len && across <= PP_RADIAL_AXIS_BAND)
        pick[n++] = l;
    }
    if (n > best_n) {
      best_n = n;
      memcpy(best, pick, n * sizeof(guint));
    }
  }
  g_free(pick);
  gboolean ok = best_n >= PP_ANGULAR_MIN_TICKS && best_n <= G_N_ELEMENTS(ax->labels);
  double rs[64], r2[64], vs[64], vmin = INFINITY, vmax = -INFINITY;
  for (guint i = 0; ok && i < best_n; i++) {
    const pp_label *lab = g_ptr_array_index(ctx->labels, best[i]);
    rs[i] = grid_radius(ctx->scene, c, box_distance(lab->box, c));
    r2[i] = rs[i] * rs[i];
    vs[i] = lab->number.value;
    vmin = fmin(vmin, vs[i]), vmax = fmax(vmax, vs[i]);
    ax->labels[i] = best[i];
  }
  /* Values rise outwards. */
  for (guint i = 0; ok && i < best_n; i++)
    for (guint j = 0; j < best_n; j++)
      if (rs[j] > rs[i] && vs[j] <= vs[i])
        ok = FALSE;
  g_free(best);
  if (!ok || !(vmax > vmin))
    return FALSE;
  double o1, s1, o2, s2;
  double e1 = fit_line(rs, vs, best_n, FALSE, &o1, &s1);
  double e2 = fit_line(r2, vs, best_n, TRUE, &o2, &s2);
  double limit = PP_ANGULAR_FIT * (vmax - vmin);
  ax->n = best_n;
  gboolean linear = e1 <= e2 && e1 <= limit && s1 > 0;
  gboolean square = e2 < e1 && e2 <= limit && s2 > 0;
  ax->model = square ? PP_RADIAL_SQUARE : PP_RADIAL_LINEAR;
  ax->offset = square ? o2 : o1;
  ax->slope = square ? s2 : s1;
  return linear || square;
}

/* The free number beyond a sector's tip nearest its middle ray; -1 when none. */
static int tip_label(const pp_recognize_ctx *ctx, const pp_wedge_candidate *c,
                     const gboolean *taken) {
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
  return best;
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
  /* Data labels beyond the tips first; without one for every sector, a radial axis. */
  gboolean *taken = g_new0(gboolean, MAX(ctx->labels->len, 1));
  int *labs = g_new(int, group->len);
  guint labelled = 0;
  pp_point centre = {0, 0};
  for (guint k = 0; k < group->len; k++) {
    const pp_wedge_candidate *c =
        &g_array_index(cands, pp_wedge_candidate, g_array_index(group, guint, k));
    centre = c->w.outer.centre;
    labs[k] = tip_label(ctx, c, taken);
    if (labs[k] >= 0)
      taken[labs[k]] = TRUE;
    labelled += labs[k] >= 0;
  }
  pp_radial_axis ax = {0};
  gboolean scaled = labelled < group->len && radial_axis(ctx, centre, rmax, &ax);
  pp_claims_begin(ctx->claims);
  pp_figure *fig = pp_figure_new(PP_FIGURE_POLAR_AREA);
  fig->recognizer = OWNER_POLAR;
  for (guint k = 0; k < group->len; k++) {
    const pp_wedge_candidate *c =
        &g_array_index(cands, pp_wedge_candidate, g_array_index(group, guint, k));
    pp_claims_take_mark(ctx->claims, c->mark, OWNER_POLAR);
    pp_element el = element_of(c, PP_ENCODING_RADIUS);
    el.extent = c->w.outer.rx;
    if (scaled) {
      double r = ax.model == PP_RADIAL_SQUARE ? el.extent * el.extent : el.extent;
      el.value = el.scale_value = ax.offset + ax.slope * r;
      el.source = PP_VALUE_SCALE;
    } else if (labs[k] >= 0) {
      set_label(ctx, &el, g_ptr_array_index(ctx->labels, labs[k]), OWNER_POLAR);
    }
    fig->bbox = pp_rect_union(fig->bbox, c->box);
    g_array_append_val(fig->elements, el);
  }
  for (guint i = 0; scaled && i < ax.n; i++)
    pp_claims_take_label(ctx->claims,
                         ((const pp_label *)g_ptr_array_index(ctx->labels, ax.labels[i]))->index,
                         OWNER_POLAR);
  g_free(taken);
  g_free(labs);
  fig->n_series = 1;
  pp_figure_add_evidence(fig, "equal-angles-tile-turn", 0.8);
  if (scaled) {
    pp_figure_add_evidence(
        fig, ax.model == PP_RADIAL_SQUARE ? "radial-axis-by-area" : "radial-axis", 0.8);
  } else if (labelled == group->len) {
    pp_figure_add_evidence(fig, "data-labels", 0.9);
  } else {
    fig->judged = FALSE;
    fig->not_judged_reason = g_strdup("sectors without a printed value or radial axis");
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
