/* A PDF being generated together with its truth record: page handling,
 * fixed metadata (so output is byte-stable) and the axis-fitting helpers. */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "cairo_chart.h"
#include "cairo_truth.h"

typedef struct {
  cairo_surface_t *surface;
  cairo_t *cr;
  pp_gen_truth *truth;
  char *pdf_path;
  char *truth_path;
  int page;
  double width, height;
} pp_gen_doc;

/* rel_dir is the path recorded in the truth "file" field (e.g. corpus/cairo). */
pp_gen_doc *pp_gen_doc_new(const char *out_dir, const char *rel_dir, const char *name, guint64 seed,
                           double width, double height, const char *title);
void pp_gen_doc_next_page(pp_gen_doc *doc);
gboolean pp_gen_doc_finish(pp_gen_doc *doc, GError **error);
void pp_gen_doc_free(pp_gen_doc *doc);

/* Smallest of 1, 2, 2.5, 5 x 10^k that is >= raw. */
double pp_gen_nice_step(double raw);
/* Sets axis_min/max/tick_step/decimals/bar_from. frac = 0 gives a zero-based
 * axis; otherwise the axis starts near frac x smallest value (0.5 mild, 0.9 severe). */
void pp_gen_chart_fit_axis(pp_gen_chart *c, double frac);
