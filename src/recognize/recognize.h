/* recognize.h — contract of the chart-recognition stage: from a measured scene, find
 * the figures on the page, their value axes (ticks, labels, fitted scale) and the
 * marks that encode values (bars, filled areas), each with its value and its ink. */
#pragma once

#include "capture/capture.h"

G_BEGIN_DECLS

typedef enum {
  PP_FIGURE_COLUMN, /* vertical bars */
  PP_FIGURE_BAR,    /* horizontal bars */
  PP_FIGURE_AREA,   /* filled areas */
  PP_FIGURE_LINE,   /* unfilled lines only */
  PP_FIGURE_OTHER,
} pp_figure_kind;

const char *pp_figure_kind_name(pp_figure_kind kind);

typedef struct {
  double pos;   /* page points along the axis (x for a horizontal axis, y for vertical) */
  double value; /* as printed */
  char *label;
} pp_tick;

/* A value axis: value = offset + slope·pos, or on a log axis
 * log10(value) = offset + slope·pos. */
typedef struct {
  gboolean vertical; /* values change along y */
  gboolean log;
  double offset, slope;
  double rms_residual; /* of the least-squares fit, in value units (log10 units on log axes) */
  double min_value, max_value; /* of the visible axis range (plot area edges) */
  GArray *ticks;               /* of pp_tick */
  pp_rect box;                 /* the tick labels' extent */
} pp_axis;

/* An empty axis (no ticks yet); freed with its tick labels. */
pp_axis *pp_axis_new(gboolean vertical);
void pp_axis_free(pp_axis *axis);
double pp_axis_value_at(const pp_axis *axis, double pos);
double pp_axis_pos_of(const pp_axis *axis, double value);

typedef enum {
  PP_ELEMENT_BAR,
  PP_ELEMENT_AREA,
} pp_element_kind;

/* One mark that stands for a number. */
typedef struct {
  pp_element_kind kind;
  guint mark_index;   /* into the scene's marks */
  pp_rect box;        /* visible extent */
  double tip_value;   /* value at the bar's far end (axis reading); areas: mean top value */
  double base_value;  /* value at the drawn baseline (where the visible ink starts) */
  double ink;         /* visible ink, pt² */
  double extent;      /* visible length along the value axis (bars) or mean height (areas), pt */
  double label_value; /* printed data label attached to it, NAN if none */
  char *label_text;
  char *category;   /* category label, NULL if none was found */
  guint series;     /* colour group, 0-based */
  gboolean stacked; /* sits on another bar */
} pp_element;

typedef struct {
  pp_figure_kind kind;
  pp_rect bbox;     /* plot area, page points */
  pp_axis *axis;    /* NULL when the chart has no readable value axis */
  GArray *elements; /* of pp_element, category order (left→right, top→bottom) */
  guint n_series;
  char *fingerprint; /* stable content hash: values, labels, kind; no page number */
  char *title;       /* nearest title-like text above, NULL if none */
} pp_figure;

/* An empty figure; frees its axis, elements' strings, fingerprint and title. */
pp_figure *pp_figure_new(pp_figure_kind kind);
void pp_figure_free(pp_figure *figure);

typedef struct {
  pp_rect bbox;
  char *reason;
} pp_scale_failure;

typedef struct {
  GPtrArray *figures;        /* of pp_figure* */
  GPtrArray *scale_failures; /* of pp_scale_failure* */
  GArray *raster_images;     /* of pp_rect: images big enough to be figures, not analysed */
} pp_page_charts;

/* Empty result lists, owning what is added: figures, scale failures (bbox, reason). */
pp_page_charts *pp_page_charts_new(void);
pp_page_charts *pp_page_charts_find(const pp_scene *scene);
void pp_scale_failure_free(pp_scale_failure *failure);
void pp_page_charts_free(pp_page_charts *charts);
G_DEFINE_AUTOPTR_CLEANUP_FUNC(pp_page_charts, pp_page_charts_free)

G_END_DECLS
