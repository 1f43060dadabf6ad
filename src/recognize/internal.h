/* internal.h — shared by the recognition stage's files only.
 * Labels → axes → bar and area groups → figures; each file is one of those steps. */
#pragma once

#include "geometry/geometry.h"
#include "number.h"
#include "recognize.h"

/* A text phrase that reads as a number (a tick label or a data label). */
typedef struct {
  char *text;
  pp_rect box;
  pp_point centre;
  double size;
  double angle;
  pp_number number;
  gboolean on_axis; /* claimed by a value axis */
} pp_label;

/* Every numeric phrase of the page, words merged where a number was split by
 * spaces ("30 000", "€ 1.2 bn"). Free with g_ptr_array_unref. Marks that turn out
 * to be parts of labels (a minus sign drawn as a path) are added to glyph_marks. */
GPtrArray *pp_labels_collect(const pp_scene *scene, GHashTable *glyph_marks);

/* Value-axis candidates (pp_axis*, fitted or not) from aligned labels. Labels used
 * get on_axis. Candidates whose fit failed carry fit_failed and a reason. */
typedef struct {
  pp_axis *axis;
  gboolean fit_failed;
  gboolean category; /* consecutive years: labels of categories, never a value scale */
  char *reason;
  double label_edge; /* x of the label column's inner edge (vertical) or y (horizontal) */
  int side; /* +1: plot lies towards larger coordinates from the labels, −1 smaller, 0 unknown */
  double span0, span1; /* extent of the tick positions along the axis */
  GPtrArray *labels;   /* pp_label* (borrowed) */
} pp_axis_candidate;

GPtrArray *pp_axes_find(const pp_scene *scene, GPtrArray *labels);

/* How far across the axis its plot may reach on one side (+1 towards larger x, or y for
 * a horizontal axis): from the labels to the next fitted axis of the same orientation. */
void pp_axis_reach(const pp_axis_candidate *axis, GPtrArray *all_axes, int side, double *lo,
                   double *hi);

/* A filled axis-aligned rectangle that could be a bar. */
typedef struct {
  guint mark;
  pp_rect rect; /* visible part: path rectangle ∩ clip bbox */
  pp_rect clip; /* clip bbox (infinite when unclipped) */
  double ink;
  pp_paint paint;
  gboolean used;
} pp_bar_candidate;

/* glyph_marks: mark indices that are parts of text, never bars. */
GArray *pp_bar_candidates_collect(const pp_scene *scene, GHashTable *glyph_marks);

/* A filled non-rectangular polygon that could be an area under a series. */
typedef struct {
  guint mark;
  GArray *points; /* pp_point, flattened outline */
  pp_rect rect;   /* visible bbox */
  pp_rect clip;
  double ink;
  pp_paint paint;
  gboolean used;
} pp_area_candidate;

GPtrArray *pp_area_candidates_collect(const pp_scene *scene);
void pp_area_candidate_free(gpointer p);

/* Builds a figure from the bars on one side of an axis (+1: towards larger x, or y for
 * a horizontal axis; −1: smaller). Returns NULL when no bar group is found there. */
pp_figure *pp_bar_figure_build(const pp_scene *scene, GArray *bars, const pp_axis_candidate *axis,
                               int side, GPtrArray *labels, GPtrArray *all_axes);
pp_figure *pp_bar_figure_from_labels(const pp_scene *scene, GArray *bars, GPtrArray *labels);
pp_figure *pp_area_figure_build(const pp_scene *scene, GPtrArray *areas,
                                const pp_axis_candidate *axis, int side, GPtrArray *all_axes);

void pp_figure_set_fingerprint(pp_figure *figure);
