/* Tiny deterministic PRNG (splitmix64) for the corpus and demo generators.
 * Own implementation so the generated values are identical on every libc. */
#pragma once

#include <glib.h>

typedef struct {
  guint64 state;
} pp_gen_rng;

void pp_gen_rng_init(pp_gen_rng *rng, guint64 seed);
guint64 pp_gen_rng_next(pp_gen_rng *rng);
double pp_gen_rng_uniform(pp_gen_rng *rng, double lo, double hi);
int pp_gen_rng_int(pp_gen_rng *rng, int lo, int hi_inclusive);
