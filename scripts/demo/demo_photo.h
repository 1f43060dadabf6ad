/* Procedural "photographs" for the demo report: coastal landscapes drawn
 * into an image surface so they reach the PDF as raster images, not vectors. */
#pragma once

#include <cairo.h>
#include <glib.h>

typedef enum {
  PP_DEMO_PHOTO_FJORD,
  PP_DEMO_PHOTO_DUSK,
  PP_DEMO_PHOTO_SNOW,
  PP_DEMO_PHOTO_HARBOUR,
} pp_demo_photo;

/* Paints the photo into the rectangle (x, y, w, h) of cr at px_per_pt resolution. */
void pp_demo_photo_paint(cairo_t *cr, pp_demo_photo kind, guint64 seed, double x, double y,
                         double w, double h, double px_per_pt);
