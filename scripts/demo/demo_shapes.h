/* The demo report's shape charts (3D bars, a pyramid, a bubble chart), drawn with cairo
 * and recorded in the truth with the geometry and expected measures of docs/corpus.md
 * ("Shape charts"), computed here by the same closed forms as truth_shapes.py. */
#pragma once

#include <cairo.h>

#include "cairo_truth.h"

/* Oblique 3D columns in the box x, y, w, h (page points, y down). */
void pp_demo_bars_3d(cairo_t *cr, pp_gen_truth *truth, int page, double x, double y, double w,
                     double h);
/* A triangle pyramid cut at heights proportional to the values. */
void pp_demo_pyramid(cairo_t *cr, pp_gen_truth *truth, int page, double x, double y, double w,
                     double h);
/* Bubbles whose radius is proportional to the value, values printed inside. */
void pp_demo_bubbles(cairo_t *cr, pp_gen_truth *truth, int page, double x, double y, double w,
                     double h);
