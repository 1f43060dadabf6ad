/* areas.c — recognizer: filled areas under a series beside a vertical value axis. A
 * polygon whose bottom is flat (the drawn baseline) or which lies on another series
 * (stacked). Elements are vertical samples: value read at the top, ink per unit width
 * is the visible height. */
#include <math.h>

#include "internal.h"

#define OWNER "areas"

/* Samples across each area: enough to follow a polyline top of a few dozen vertices
 * (common practice, no source). */
#define PP_AREA_MAX_SAMPLES 64
/* Areas may reach this far beyond the end ticks beyond the axis' share, pt (common
 * practice, no source). */
#define PP_AREA_REACH_SLACK 20.0
/* ...and start at most this far from the tick labels across the axis, pt (common
 * practice, no source). */
#define PP_AREA_MAX_DISTANCE 400.0
/* A bottom within this of the lowest point at both ends is flat, pt (common practice,
 * no source). */
#define PP_AREA_FLAT_TOL 0.3

/* An outline of curves alone whose area is that of the ellipse inscribed in its box is a
 * circle or an ellipse (a bubble, a dot, a tilted pie's face) within this share; cubic
 * arcs are within 0.03% of the true curve (common practice, no source). */
#define PP_AREA_ELLIPSE_SHARE 0.02

/* A closed curved outline, one subpath of curves only (no straight edge), filling π/4 of
 * its box: a circle or ellipse. An area under a series always has a straight or polyline
 * edge (its baseline, its sides at the first and last x) and never fills that share by
 * chance with curves alone. */
static gboolean is_ellipse(const pp_mark *m) {
  const pp_path *p = m->path;
  guint curves = 0, moves = 0;
  double w = pp_rect_width(m->bbox), h = pp_rect_height(m->bbox);
  pp_point start = {0, 0}, at = {0, 0};
  for (size_t i = 0; i < p->n_segs; i++) {
    switch (p->segs[i].kind) {
    case PP_SEG_MOVE: start = at = p->segs[i].pt[0], moves++; break;
    case PP_SEG_CURVE: at = p->segs[i].pt[2], curves++; break;
    case PP_SEG_CLOSE: /* a closing chord is a straight edge (a half disc) */
      if (hypot(at.x - start.x, at.y - start.y) > PP_AREA_ELLIPSE_SHARE * fmax(w, h))
        return FALSE;
      break;
    default: return FALSE; /* a straight edge */
    }
  }
  if (curves < 2 || moves != 1 || !(w > 0 && h > 0))
    return FALSE;
  double area = pp_path_fill_area(p, m->rule);
  return fabs(area - G_PI * w * h / 4) <= PP_AREA_ELLIPSE_SHARE * area;
}

/* Sutherland–Hodgman against the clip box: the visible outline. */
static GArray *clip_polygon(GArray *pts, pp_rect box) {
  GArray *cur = g_array_copy(pts);
  for (int edge = 0; edge < 4; edge++) {
    GArray *next = g_array_new(FALSE, FALSE, sizeof(pp_point));
    guint n = cur->len;
    for (guint i = 0; i < n; i++) {
      pp_point a = g_array_index(cur, pp_point, i), b = g_array_index(cur, pp_point, (i + 1) % n);
      double da, db;
      switch (edge) {
      case 0: da = a.x - box.x0, db = b.x - box.x0; break;
      case 1: da = box.x1 - a.x, db = box.x1 - b.x; break;
      case 2: da = a.y - box.y0, db = b.y - box.y0; break;
      default: da = box.y1 - a.y, db = box.y1 - b.y; break;
      }
      if (da >= 0)
        g_array_append_val(next, a);
      if ((da >= 0) != (db >= 0)) {
        double t = da / (da - db);
        pp_point p = {a.x + t * (b.x - a.x), a.y + t * (b.y - a.y)};
        g_array_append_val(next, p);
      }
    }
    g_array_unref(cur);
    cur = next;
    if (cur->len == 0)
      break;
  }
  return cur;
}

/* Lowest point of the outline (largest y) at abscissa x, and highest. */
static void column_extent(GArray *pts, double x, double *top, double *bottom) {
  *top = INFINITY, *bottom = -INFINITY;
  guint n = pts->len;
  for (guint i = 0; i < n; i++) {
    pp_point a = g_array_index(pts, pp_point, i), b = g_array_index(pts, pp_point, (i + 1) % n);
    if ((x < fmin(a.x, b.x) - 1e-9) || (x > fmax(a.x, b.x) + 1e-9))
      continue;
    double y;
    if (fabs(b.x - a.x) < 1e-9) {
      *top = fmin(*top, fmin(a.y, b.y));
      *bottom = fmax(*bottom, fmax(a.y, b.y));
      continue;
    }
    y = a.y + (x - a.x) / (b.x - a.x) * (b.y - a.y);
    *top = fmin(*top, y);
    *bottom = fmax(*bottom, y);
  }
}

/* The area figure on one side of a vertical axis, or NULL; claims inside the caller's
 * transaction. */
static pp_figure *build_on_axis(pp_recognize_ctx *ctx, const pp_axis_candidate *cand, int side) {
  const pp_scale *axis = cand->scale;
  pp_figure *fig = NULL;
  double lo, hi;
  pp_axis_reach(cand, ctx->axes, side, &lo, &hi);
  for (guint i = 0; i < ctx->areas->len; i++) {
    pp_area_candidate *a = g_ptr_array_index(ctx->areas, i);
    if (!pp_claims_mark_free(ctx->claims, a->mark) ||
        is_ellipse(g_ptr_array_index(ctx->scene->marks, a->mark)))
      continue;
    /* Beside the labels on the given side, before the next axis, within reach along y. */
    if (a->rect.x0 < lo || a->rect.x1 > hi ||
        fabs(side > 0 ? a->rect.x0 - axis->box.x1 : axis->box.x0 - a->rect.x1) >
            PP_AREA_MAX_DISTANCE)
      continue;
    if (!pp_within_reach(cand, a->rect.y0, a->rect.y1, PP_AREA_REACH_SLACK, 0))
      continue;
    GArray *vis = clip_polygon(a->points, isfinite(a->clip.x0) ? a->clip : a->rect);
    if (vis->len < 3) {
      g_array_unref(vis);
      continue;
    }
    pp_rect vb = pp_rect_empty();
    for (guint k = 0; k < vis->len; k++)
      vb = pp_rect_add_point(vb, g_array_index(vis, pp_point, k));
    /* Flat bottom: both ends of the outline reach the lowest y. */
    double t0, b0, t1, b1;
    double xe0 = vb.x0 + 1e-6 * (vb.x1 - vb.x0), xe1 = vb.x1 - 1e-6 * (vb.x1 - vb.x0);
    column_extent(vis, xe0, &t0, &b0);
    column_extent(vis, xe1, &t1, &b1);
    gboolean flat = fabs(b0 - vb.y1) < PP_AREA_FLAT_TOL && fabs(b1 - vb.y1) < PP_AREA_FLAT_TOL;
    if (!fig) {
      fig = pp_figure_new(PP_FIGURE_AREA);
      fig->recognizer = OWNER;
    }
    pp_claims_take_mark(ctx->claims, a->mark, OWNER);
    guint samples = MIN(PP_AREA_MAX_SAMPLES, MAX(2u, vis->len));
    for (guint s = 0; s < samples; s++) {
      double x = xe0 + (xe1 - xe0) * s / (samples - 1);
      double top, bottom;
      column_extent(vis, x, &top, &bottom);
      if (!isfinite(top) || bottom - top <= 0)
        continue;
      pp_element e = pp_element_init(PP_ENCODING_LENGTH);
      e.shape.kind = PP_SHAPE_SAMPLE;
      e.shape.rect = e.box = (pp_rect){x, top, x, bottom};
      e.extent = bottom - top;
      e.ink = e.extent; /* ink per unit width at x */
      pp_element_add_part(&e, a->mark, PP_PART_BODY, e.ink);
      e.series = fig->n_series;
      e.scale_value = pp_scale_value_at(axis, top);
      e.source = PP_VALUE_SCALE;
      if (flat) {
        e.base_value = pp_scale_value_at(axis, vb.y1);
        e.value = e.scale_value;
      } else {
        /* Between two series: the thickness is the value, drawn from its own floor. */
        e.base_value = pp_scale_value_at(axis, bottom);
        e.value = e.scale_value - e.base_value;
        e.stacked = TRUE;
      }
      g_array_append_val(fig->elements, e);
    }
    fig->n_series++;
    fig->bbox = pp_rect_union(fig->bbox, vb);
    if (isfinite(a->clip.x0) && !pp_page_sized(ctx->scene, a->clip))
      fig->bbox = pp_rect_union(fig->bbox, a->clip);
    g_array_unref(vis);
  }
  if (fig)
    pp_figure_add_evidence(fig, "scale-fits", 1);
  return fig;
}

/* Vertical axes only, on the side their labels face first, then on the other. */
void pp_recognize_areas(pp_recognize_ctx *ctx) {
  for (int pass = 0; pass < 2; pass++)
    for (guint i = 0; i < ctx->axes->len; i++) {
      const pp_axis_candidate *c = g_ptr_array_index(ctx->axes, i);
      if (c->fit_failed || !c->scale->vertical || pp_axis_taken(ctx, c))
        continue;
      int side = c->side ? (pass ? -c->side : c->side) : (pass ? +1 : -1);
      pp_claims_begin(ctx->claims);
      pp_axis_claim_labels(ctx, c);
      pp_figure *f = build_on_axis(ctx, c, side);
      if (!f) {
        pp_claims_rollback(ctx->claims);
        continue;
      }
      pp_claims_commit(ctx->claims);
      pp_figure_finish(ctx, f, c);
    }
}
