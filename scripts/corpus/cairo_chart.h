/* One declarative chart description (bars, areas, bands, lines) that is both
 * drawn with cairo and turned into its ground-truth record, so the two agree. */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "cairo_text.h"
#include "cairo_truth.h"

typedef enum {
  PP_GEN_MARK_BARS,
  PP_GEN_MARK_AREA, /* filled polygon from bar_from up to the series */
  PP_GEN_MARK_BAND, /* filled polygon between values and lower */
  PP_GEN_MARK_LINE, /* unfilled polyline */
} pp_gen_mark;

typedef enum {
  PP_GEN_BAR_RECT,        /* cairo_rectangle + fill */
  PP_GEN_BAR_PATH4,       /* move_to + 3 line_to + close_path */
  PP_GEN_BAR_FILL_STROKE, /* fill_preserve + dark edge stroke */
  PP_GEN_BAR_CLIPPED,     /* bar from bar_from (below frame), clipped to the plot */
} pp_gen_bar_style;

typedef struct {
  const char *title;
  double x, y, w, h; /* plot area, page units, y down */
  pp_gen_mark mark;
  gboolean horizontal;
  int n, n_series;
  const double *values; /* n_series * n, series-major */
  const char *const *cats;
  const char *const *series_names; /* legend; NULL for none */
  const double *drawn;             /* series-0 bar ends actually drawn, if they differ */
  const double *lower;             /* band only */
  gboolean data_labels;
  gboolean hide_value_axis;
  double axis_min, axis_max, tick_step;
  gboolean log_axis;
  double bar_from; /* value where bars/areas start */
  pp_gen_bar_style bar_style;
  pp_gen_fmt fmt;
  int decimals;       /* tick labels */
  int label_decimals; /* data labels, if more than decimals */
  int label_every;    /* category label stride; 0 = every one */
  gboolean gridlines, rotated, gradient, stacked, markers;
  double alpha; /* 0 = opaque */
} pp_gen_chart;

void pp_gen_chart_draw(cairo_t *cr, const pp_gen_chart *c);
pp_gen_figure *pp_gen_chart_truth(const pp_gen_chart *c, pp_gen_truth *truth, int page);
