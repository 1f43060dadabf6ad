/* scale.c — a value scale read from a drawn axis: the fitted mapping between position
 * on the page and value, linear or logarithmic, with the ticks it was fitted to. */
#include <math.h>

#include "internal.h"

double pp_scale_value_at(const pp_scale *scale, double pos) {
  double v = scale->offset + scale->slope * pos;
  return scale->kind == PP_SCALE_LOG ? pow(10, v) : v;
}

double pp_scale_pos_of(const pp_scale *scale, double value) {
  double v = scale->kind == PP_SCALE_LOG ? log10(value) : value;
  return (v - scale->offset) / scale->slope;
}

pp_scale *pp_scale_new(gboolean vertical) {
  pp_scale *scale = g_new0(pp_scale, 1);
  scale->kind = PP_SCALE_LINEAR;
  scale->vertical = vertical;
  scale->ticks = g_array_new(FALSE, FALSE, sizeof(pp_tick));
  scale->box = pp_rect_empty();
  return scale;
}

pp_scale *pp_scale_copy(const pp_scale *scale) {
  pp_scale *c = g_memdup2(scale, sizeof *scale);
  c->ticks = g_array_new(FALSE, FALSE, sizeof(pp_tick));
  for (guint i = 0; scale->ticks && i < scale->ticks->len; i++) {
    pp_tick t = g_array_index(scale->ticks, pp_tick, i);
    t.label = g_strdup(t.label);
    g_array_append_val(c->ticks, t);
  }
  return c;
}

void pp_scale_free(pp_scale *scale) {
  if (!scale)
    return;
  for (guint i = 0; scale->ticks && i < scale->ticks->len; i++)
    g_free(g_array_index(scale->ticks, pp_tick, i).label);
  if (scale->ticks)
    g_array_unref(scale->ticks);
  g_free(scale);
}
