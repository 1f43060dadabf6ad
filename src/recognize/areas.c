/* areas.c — filled areas under a series: a polygon whose top is a polyline and whose
 * bottom is flat (the drawn baseline), or which lies on another series (stacked).
 * Values are read at the top vertices; ink per unit width is the visible height. */
#include <math.h>

#include "internal.h"

#define PP_AREA_MAX_SAMPLES 64

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

pp_figure *pp_area_figure_build(const pp_scene *scene, GPtrArray *areas,
                                const pp_axis_candidate *cand, int side, GPtrArray *all_axes) {
  const pp_axis *axis = cand->axis;
  if (!axis->vertical)
    return NULL;
  pp_figure *fig = NULL;
  double span = cand->span1 - cand->span0;
  for (guint i = 0; i < areas->len; i++) {
    pp_area_candidate *a = g_ptr_array_index(areas, i);
    if (a->used)
      continue;
    /* The area must lie beside the labels, within the axis' reach along y. */
    /* Beside the labels on the given side, before the next axis, within reach along y. */
    double lo, hi;
    pp_axis_reach(cand, all_axes, side, &lo, &hi);
    if (a->rect.x0 < lo || a->rect.x1 > hi ||
        fabs(side > 0 ? a->rect.x0 - axis->box.x1 : axis->box.x0 - a->rect.x1) > 400)
      continue;
    if (a->rect.y0 < cand->span0 - 0.6 * span - 20 || a->rect.y1 > cand->span1 + 0.6 * span + 20)
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
    gboolean flat = fabs(b0 - vb.y1) < 0.3 && fabs(b1 - vb.y1) < 0.3;
    if (!fig) {
      fig = pp_figure_new(PP_FIGURE_AREA);
      fig->bbox = pp_rect_empty();
    }
    a->used = TRUE;
    guint samples = MIN(PP_AREA_MAX_SAMPLES, MAX(2u, vis->len));
    for (guint s = 0; s < samples; s++) {
      double x = xe0 + (xe1 - xe0) * s / (samples - 1);
      double top, bottom;
      column_extent(vis, x, &top, &bottom);
      if (!isfinite(top) || bottom - top <= 0)
        continue;
      pp_element e = {0};
      e.kind = PP_ELEMENT_AREA;
      e.mark_index = a->mark;
      e.box = (pp_rect){x, top, x, bottom};
      e.extent = bottom - top;
      e.ink = e.extent; /* ink per unit width at x */
      e.label_value = NAN;
      e.series = fig->n_series;
      if (flat) {
        e.tip_value = pp_axis_value_at(axis, top);
        e.base_value = pp_axis_value_at(axis, vb.y1);
      } else {
        /* Between two series: the thickness is the value, drawn from its own floor. */
        e.tip_value = pp_axis_value_at(axis, top) - pp_axis_value_at(axis, bottom);
        e.base_value = 0;
        e.stacked = TRUE;
      }
      g_array_append_val(fig->elements, e);
    }
    fig->n_series++;
    fig->bbox = pp_rect_union(fig->bbox, vb);
    if (isfinite(a->clip.x0) && pp_rect_area(a->clip) < 0.6 * scene->width * scene->height)
      fig->bbox = pp_rect_union(fig->bbox, a->clip);
    g_array_unref(vis);
  }
  return fig;
}
