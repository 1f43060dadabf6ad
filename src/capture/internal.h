/* internal.h — shared between the capture stage's files only, never included elsewhere.
 * The tap records cairo calls on one page's context into a scene; text.c adds the words. */
#pragma once

#include <cairo.h>
#include <poppler.h>

#include "capture.h"

/* Starts recording every drawing call made on cr into scene->marks. Device units
 * of cr are `scale` per page point. Only one page is tapped at a time per process. */
void pp_tap_begin(cairo_t *cr, double scale, pp_scene *scene);
/* Stops recording; returns how many calls on cr reached the tap. */
guint pp_tap_end(void);

void pp_text_capture(PopplerPage *page, pp_scene *scene);
