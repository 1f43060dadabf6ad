/* Invented annual-report prose: sentences assembled from a few templates
 * with a seeded PRNG, so the demo text is stable and obviously fictional. */
#pragma once

#include <glib.h>

#include "cairo_rng.h"

/* Returns a newly allocated paragraph of n_sentences sentences. */
char *pp_demo_prose_paragraph(pp_gen_rng *rng, int n_sentences);
