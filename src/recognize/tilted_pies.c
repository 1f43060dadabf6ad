/* tilted_pies.c — recognizer: pies drawn tilted ("3D") or in perspective. Top faces are
 * sectors sharing one apex; when they are ellipse sectors the tilt is the axis ratio and
 * every slice is re-read on the pie's shared ellipse, so its angle is the angle in the
 * un-tilted circle; when they are not (perspective) the apparent angles must still tile
 * the turn. Rims (bands under the front half) join the slice above them. */
#include <math.h>

#include "internal.h"

#define OWNER "tilted-pies"

/* Top faces of one pie share their apex within this distance, pt (one point written by
 * the producer for every slice; common practice, no source). */
#define PP_TILT_SAME_APEX 0.5
/* An ellipse sector fits its arc within this share of the radius; worse is perspective
 * (arc Béziers are exact to ~1e-4; a pinhole view bends them by percents). Derived from
 * tests/geometry and the perspective corpus pies. */
#define PP_TILT_ELLIPSE_FIT 0.003
/* Tiling tolerance (share of a turn): exact ellipse angles, or apparent angles read from
 * per-slice fits in perspective. Common practice, no source. */
#define PP_TILT_TILE_TOL 0.002
#define PP_PERSPECTIVE_TILE_TOL 0.03
/* A slice may be pulled out from the pie's centre by up to this many radii (exploded
 * pies; producers' defaults are 0.1–0.2, as pies.c; common practice, no source), its top
 * face then an arc of the pie's own ellipse: radius within this share of the pie's. */
#define PP_TILT_EXPLODE_MAX 0.4
#define PP_TILT_SAME_RADIUS 0.02
/* A perspective rim's points lie on its slice's outline within this distance, pt, at
 * least this share of them (its top edge: about half; common practice, no source), both
 * outlines flattened to this chord deviation, pt. */
#define PP_RIM_ON_EDGE 0.75
#define PP_RIM_EDGE_SHARE 0.25
#define PP_RIM_FLATTEN 0.1
/* A rim's top arc is centred on its slice's apex within this distance, pt. */
#define PP_RIM_SAME_CENTRE 2.0

static gboolean tilted_seed(const pp_wedge_candidate *c) {
  return c->w.kind == PP_WEDGE_SECTOR && c->w.shape_fitted &&
         (c->w.outer.ry / c->w.outer.rx < PP_CIRCLE_AXIS_RATIO ||
          c->w.fit_error > PP_TILT_ELLIPSE_FIT);
}

/* The apparent angle of the slice's arc ends about its apex (perspective). */
static void apparent_angles(const pp_wedge *w, double *a0, double *a1) {
  pp_point p0 = pp_ellipse_point(&w->outer, w->a0), p1 = pp_ellipse_point(&w->outer, w->a1);
  pp_point c = w->outer.centre;
  double t0 = atan2(-(p0.y - c.y), p0.x - c.x), t1 = atan2(-(p1.y - c.y), p1.x - c.x);
  double sweep = fmod(t1 - t0 + 4 * G_PI, 2 * G_PI);
  t0 = fmod(t0 + 2 * G_PI, 2 * G_PI);
  *a0 = t0;
  *a1 = t0 + sweep;
}

static pp_slice slice_of(const pp_wedge_candidate *c, const pp_wedge *w) {
  pp_slice s = {0};
  s.ellipse = w->outer;
  s.a0 = w->a0;
  s.a1 = w->a1;
  s.paint = c->paint;
  s.n_parts = 1;
  s.marks[0] = c->mark;
  s.roles[0] = PP_PART_TOP;
  s.inks[0] = c->ink;
  s.box = c->box;
  s.face = pp_rect_empty();
  return s;
}

/* The mark's wedge of the given subpath, re-read on the pie's ellipse. */
static gboolean reread(const pp_scene *scene, guint mark, guint subpath, const pp_ellipse *shape,
                       pp_wedge *out) {
  const pp_mark *m = g_ptr_array_index(scene->marks, mark);
  g_autoptr(GArray) ws = pp_path_wedges(m->path, TRUE, shape);
  for (guint k = 0; k < ws->len; k++)
    if (g_array_index(ws, pp_wedge, k).subpath == subpath) {
      *out = g_array_index(ws, pp_wedge, k);
      return TRUE;
    }
  return FALSE;
}

/* Bands under the front half whose top arc lies on the pie's ellipse: each joins the
 * slice whose apex is the band's centre (pulled-out slices carry their rim with them) and
 * whose angles hold its middle. */
static void add_rims(pp_recognize_ctx *ctx, GArray *cands, GArray *slices, const pp_ellipse *shape,
                     const gboolean *member) {
  double drop = 0;
  for (guint i = 0; i < cands->len; i++) {
    const pp_wedge_candidate *c = &g_array_index(cands, pp_wedge_candidate, i);
    if (member[i] || c->w.kind != PP_WEDGE_BAND || !pp_claims_mark_free(ctx->claims, c->mark))
      continue;
    pp_wedge w;
    if (!reread(ctx->scene, c->mark, c->w.subpath, shape, &w) || w.kind != PP_WEDGE_BAND)
      continue;
    double mid = (w.a0 + w.a1) / 2;
    for (guint k = 0; k < slices->len; k++) {
      pp_slice *s = &g_array_index(slices, pp_slice, k);
      if (hypot(w.outer.centre.x - s->ellipse.centre.x, w.outer.centre.y - s->ellipse.centre.y) <=
              PP_RIM_SAME_CENTRE &&
          pp_angle_within(mid, s->a0, s->a1) && s->n_parts < PP_SLICE_MAX_PARTS) {
        drop = fmax(drop, hypot(w.depth.x, w.depth.y));
        s->marks[s->n_parts] = c->mark;
        s->roles[s->n_parts] = PP_PART_RIM;
        s->inks[s->n_parts++] = c->ink;
        s->box = pp_rect_union(s->box, c->box);
        break;
      }
    }
  }
  /* The pie's rim has one depth: names of the front slices sit below it. */
  for (guint k = 0; k < slices->len; k++)
    g_array_index(slices, pp_slice, k).drop = drop;
}

/* Slices pulled out of the pie: free sectors whose apex lies near its centre and whose
 * arc, re-read on the pie's ellipse, is that ellipse. */
static void add_pulled_out(const pp_recognize_ctx *ctx, GArray *cands, const pp_ellipse *shape,
                           gboolean *used, gboolean *member) {
  for (guint j = 0; j < cands->len; j++) {
    const pp_wedge_candidate *b = &g_array_index(cands, pp_wedge_candidate, j);
    pp_wedge w;
    if (used[j] || b->w.kind != PP_WEDGE_SECTOR || !pp_claims_mark_free(ctx->claims, b->mark) ||
        hypot(b->w.outer.centre.x - shape->centre.x, b->w.outer.centre.y - shape->centre.y) >
            PP_TILT_EXPLODE_MAX * shape->rx ||
        !reread(ctx->scene, b->mark, b->w.subpath, shape, &w) || w.kind != PP_WEDGE_SECTOR ||
        w.fit_error > PP_TILT_ELLIPSE_FIT ||
        fabs(w.outer.rx - shape->rx) > PP_TILT_SAME_RADIUS * shape->rx)
      continue;
    member[j] = used[j] = TRUE;
  }
}

/* Distance from p to the nearest edge of the polygons (flattened subpaths). */
static double polygons_distance(GPtrArray *polys, pp_point p) {
  double best = INFINITY;
  for (guint k = 0; k < polys->len; k++) {
    GArray *pts = g_ptr_array_index(polys, k);
    for (guint i = 0; i + 1 < pts->len; i++) {
      pp_point a = g_array_index(pts, pp_point, i), b = g_array_index(pts, pp_point, i + 1);
      double dx = b.x - a.x, dy = b.y - a.y, len2 = dx * dx + dy * dy;
      double t = len2 > 0 ? fmax(0, fmin(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2)) : 0;
      best = fmin(best, hypot(p.x - a.x - t * dx, p.y - a.y - t * dy));
    }
  }
  return best;
}

/* Rims of a perspective pie, whose edges are no ellipse: free fills hanging below the
 * pie's apex whose top edge runs along a slice's face (enough of their points on its
 * outline) and whose bulk lies below it. Each joins that slice. */
static void add_perspective_rims(pp_recognize_ctx *ctx, GArray *slices, const gboolean *mark_in) {
  const pp_scene *scene = ctx->scene;
  pp_rect face = g_array_index(slices, pp_slice, 0).face;
  pp_point apex = g_array_index(slices, pp_slice, 0).ellipse.centre;
  double bottom = face.y1;
  for (guint k = 0; k < slices->len; k++) {
    pp_slice *s = &g_array_index(slices, pp_slice, k);
    const pp_mark *top = g_ptr_array_index(scene->marks, s->marks[0]);
    g_autoptr(GPtrArray) edge = pp_path_flatten(top->path, PP_RIM_FLATTEN);
    for (guint i = 0; i < scene->marks->len && s->n_parts < PP_SLICE_MAX_PARTS; i++) {
      const pp_mark *m = g_ptr_array_index(scene->marks, i);
      pp_rect b = m->visible_bbox;
      if (m->kind != PP_MARK_FILL || mark_in[i] || !(m->ink > 0) ||
          !pp_claims_mark_free(ctx->claims, i) ||
          g_hash_table_contains(ctx->glyph_marks, GUINT_TO_POINTER(i)) || b.y0 < apex.y ||
          b.y1 <= top->visible_bbox.y1 || b.x0 < face.x0 - 1 || b.x1 > face.x1 + 1)
        continue;
      g_autoptr(GPtrArray) polys = pp_path_flatten(m->path, PP_RIM_FLATTEN);
      guint n = 0, on = 0;
      for (guint p = 0; p < polys->len; p++) {
        GArray *pts = g_ptr_array_index(polys, p);
        for (guint q = 0; q < pts->len; q++, n++)
          on += polygons_distance(edge, g_array_index(pts, pp_point, q)) <= PP_RIM_ON_EDGE;
      }
      if (on < 3 || on < PP_RIM_EDGE_SHARE * n)
        continue;
      s->marks[s->n_parts] = i;
      s->roles[s->n_parts] = PP_PART_RIM;
      s->inks[s->n_parts++] = m->ink;
      s->box = pp_rect_union(s->box, b);
      bottom = fmax(bottom, b.y1);
    }
  }
  for (guint k = 0; k < slices->len; k++)
    g_array_index(slices, pp_slice, k).drop = bottom - face.y1;
}

static void build(pp_recognize_ctx *ctx, GArray *slices, gboolean perspective,
                  const pp_ellipse *shape) {
  pp_claims_begin(ctx->claims);
  for (guint k = 0; k < slices->len; k++) {
    pp_slice *s = &g_array_index(slices, pp_slice, k);
    for (guint p = 0; p < s->n_parts; p++)
      pp_claims_take_mark_if_free(ctx->claims, s->marks[p], OWNER);
  }
  gboolean legend = FALSE;
  guint labelled = pp_slices_attach_labels(ctx, slices, OWNER, &legend);
  pp_slices_sort_clockwise(slices);
  pp_figure *fig = pp_figure_new(PP_FIGURE_TILTED_PIE);
  fig->recognizer = OWNER;
  fig->projection.kind = perspective ? PP_PROJECTION_PERSPECTIVE : PP_PROJECTION_TILTED;
  fig->projection.ratio = shape->ry / shape->rx;
  gboolean rim = FALSE;
  for (guint k = 0; k < slices->len; k++) {
    const pp_slice *s = &g_array_index(slices, pp_slice, k);
    pp_element el = pp_element_init(PP_ENCODING_SHARE);
    el.shape.kind = PP_SHAPE_SECTOR;
    el.shape.sector.centre = s->ellipse.centre;
    el.shape.sector.rx = s->ellipse.rx;
    el.shape.sector.ry = s->ellipse.ry;
    el.shape.sector.a0 = s->a0;
    el.shape.sector.a1 = s->a1;
    el.shape.sector.offset =
        hypot(s->ellipse.centre.x - shape->centre.x, s->ellipse.centre.y - shape->centre.y);
    for (guint p = 0; p < s->n_parts; p++) {
      pp_element_add_part(&el, s->marks[p], s->roles[p], s->inks[p]);
      el.ink += s->inks[p];
      rim = rim || s->roles[p] == PP_PART_RIM;
    }
    el.extent = s->a1 - s->a0;
    el.box = s->box;
    el.series = k;
    pp_slice_set_value(&el, s);
    fig->bbox = pp_rect_union(fig->bbox, s->box);
    g_array_append_val(fig->elements, el);
  }
  if (rim)
    pp_figure_add_evidence(fig, "rim", 0.5);
  pp_slices_finish(ctx, fig, labelled, slices->len, legend ? "legend" : "percent-labels");
}

void pp_recognize_tilted_pies(pp_recognize_ctx *ctx) {
  g_autoptr(GArray) cands = pp_wedge_candidates_collect(ctx);
  gboolean *used = g_new0(gboolean, MAX(cands->len, 1));
  g_autoptr(GArray) slices = g_array_new(FALSE, FALSE, sizeof(pp_slice));
  for (guint i = 0; i < cands->len; i++) {
    const pp_wedge_candidate *a = &g_array_index(cands, pp_wedge_candidate, i);
    if (used[i] || !tilted_seed(a))
      continue;
    /* The slices at the seed's apex; a seed pulled out of its pie waits for the others. */
    guint n = 0;
    for (guint j = 0; j < cands->len; j++) {
      const pp_wedge_candidate *b = &g_array_index(cands, pp_wedge_candidate, j);
      n += !used[j] && b->w.kind == PP_WEDGE_SECTOR &&
           hypot(a->w.outer.centre.x - b->w.outer.centre.x,
                 a->w.outer.centre.y - b->w.outer.centre.y) <= PP_TILT_SAME_APEX;
    }
    if (n < 2)
      continue;
    gboolean *member = g_new0(gboolean, cands->len);
    guint best = i;
    n = 0;
    for (guint j = 0; j < cands->len; j++) {
      const pp_wedge_candidate *b = &g_array_index(cands, pp_wedge_candidate, j);
      if (used[j] || b->w.kind != PP_WEDGE_SECTOR ||
          hypot(a->w.outer.centre.x - b->w.outer.centre.x,
                a->w.outer.centre.y - b->w.outer.centre.y) > PP_TILT_SAME_APEX)
        continue;
      member[j] = used[j] = TRUE;
      n++;
      const pp_wedge_candidate *cb = &g_array_index(cands, pp_wedge_candidate, best);
      if (b->w.shape_fitted && b->w.fit_error < cb->w.fit_error + 1e-3 &&
          b->w.a1 - b->w.a0 > cb->w.a1 - cb->w.a0)
        best = j;
    }
    pp_ellipse shape = g_array_index(cands, pp_wedge_candidate, best).w.outer;
    add_pulled_out(ctx, cands, &shape, used, member);
    gboolean perspective = FALSE;
    pp_slices_clear(slices);
    for (guint j = 0; j < cands->len && n >= 2; j++) {
      if (!member[j])
        continue;
      const pp_wedge_candidate *c = &g_array_index(cands, pp_wedge_candidate, j);
      pp_wedge w;
      if (!reread(ctx->scene, c->mark, c->w.subpath, &shape, &w))
        w = c->w;
      if (w.fit_error > PP_TILT_ELLIPSE_FIT)
        perspective = TRUE;
      pp_slice s = slice_of(c, &w);
      g_array_append_val(slices, s);
    }
    if (perspective) {
      /* Not an ellipse: the apparent angles of each slice's own arc must tile the turn. */
      guint k = 0;
      pp_rect face = pp_rect_empty();
      for (guint j = 0; j < cands->len; j++) {
        if (!member[j])
          continue;
        pp_slice *s = &g_array_index(slices, pp_slice, k++);
        const pp_wedge *w = &g_array_index(cands, pp_wedge_candidate, j).w;
        apparent_angles(w, &s->a0, &s->a1);
        /* Labels are found about the apex in the page's own circle; names beyond the face's
         * outline (the whole face's box about the apex). */
        s->ellipse = (pp_ellipse){w->outer.centre, fmax(w->outer.rx, w->outer.ry),
                                  fmax(w->outer.rx, w->outer.ry), 0};
        face = pp_rect_union(face, s->box);
      }
      for (guint j = 0; j < slices->len; j++)
        g_array_index(slices, pp_slice, j).face = face;
    }
    gboolean ok =
        slices->len >= 2 &&
        pp_slices_tile_turn(slices, perspective ? PP_PERSPECTIVE_TILE_TOL : PP_TILT_TILE_TOL);
    if (ok) {
      if (!perspective) {
        add_rims(ctx, cands, slices, &shape, member);
      } else {
        gboolean *mark_in = g_new0(gboolean, ctx->scene->marks->len);
        for (guint j = 0; j < cands->len; j++)
          if (member[j])
            mark_in[g_array_index(cands, pp_wedge_candidate, j).mark] = TRUE;
        add_perspective_rims(ctx, slices, mark_in);
        g_free(mark_in);
      }
      build(ctx, slices, perspective, &shape);
    }
    g_free(member);
  }
  pp_slices_clear(slices);
  g_free(used);
}
