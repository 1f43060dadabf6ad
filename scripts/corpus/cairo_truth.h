/* Ground-truth records for generated PDFs: one pp_gen_figure per chart,
 * table or text block, written as <name>.truth.json (format: docs/corpus.md). */
#pragma once

#include <glib.h>

typedef struct {
  double lie_factor_growth;
  double lie_factor_change;
  double gdi;
  double baseline;
  double max_pair_departure;
} pp_gen_measures;

typedef struct {
  int page;
  double bbox[4]; /* PDF points, origin top-left, y down */
  const char *kind;
  gboolean misleading;
  const char *rule; /* NULL = honest */
  GArray *values;   /* double */
  GPtrArray *labels;
  gboolean has_axis;
  gboolean axis_hidden; /* written as "axis": null plus "axis_hidden" */
  double axis_min, axis_max;
  gboolean axis_log;
  char orientation;    /* 'y' or 'x' */
  double baseline;     /* NAN = null */
  GArray *data_labels; /* NULL = null */
  GArray *drawn;       /* NULL = field omitted */
  gboolean has_expected;
  pp_gen_measures expected;
  GPtrArray *series_names;  /* char*, NULL = no "series" field */
  GPtrArray *series_values; /* GArray* of double, parallel to series_names */
  GPtrArray *styles;
  char *note;          /* written as "notes" (docs/corpus.md) */
  char *extra_json;    /* raw members written last ("\"circle\": {...}"), NULL = none */
  char *expected_json; /* raw "expected" object, written instead of expected; NULL = none */
} pp_gen_figure;

typedef struct {
  char *file;
  char *producer;
  guint64 seed;
  int pages;
  GPtrArray *figures;
} pp_gen_truth;

pp_gen_truth *pp_gen_truth_new(const char *file, guint64 seed);
void pp_gen_truth_free(pp_gen_truth *truth);
pp_gen_figure *pp_gen_truth_add(pp_gen_truth *truth, int page, const char *kind);
gboolean pp_gen_truth_write(const pp_gen_truth *truth, const char *path, GError **error);

void pp_gen_figure_add_style(pp_gen_figure *fig, const char *style);
void pp_gen_figure_set_note(pp_gen_figure *fig, const char *note);
void pp_gen_figure_add_series(pp_gen_figure *fig, const char *name, const double *values, int n);
void pp_gen_figure_set_bbox(pp_gen_figure *fig, double x, double y, double w, double h);

/* v: data values; g: ink extent in value units (v - baseline, or log
 * distance from the axis minimum). NAN marks an undefined measure. */
void pp_gen_measures_compute(const double *v, const double *g, int n, double baseline,
                             pp_gen_measures *out);
