/* splitmix64 (Steele, Lea, Flood 2014; constants as published by Vigna).
 * Used instead of rand() because libc generators differ between systems. */
#include "cairo_rng.h"

void pp_gen_rng_init(pp_gen_rng *rng, guint64 seed) {
  rng->state = seed;
}

guint64 pp_gen_rng_next(pp_gen_rng *rng) {
  guint64 z = (rng->state += G_GUINT64_CONSTANT(0x9e3779b97f4a7c15));
  z = (z ^ (z >> 30)) * G_GUINT64_CONSTANT(0xbf58476d1ce4e5b9);
  z = (z ^ (z >> 27)) * G_GUINT64_CONSTANT(0x94d049bb133111eb);
  return z ^ (z >> 31);
}

double pp_gen_rng_uniform(pp_gen_rng *rng, double lo, double hi) {
  /* 53 high bits give an exactly representable double in [0,1). */
  double u = (double)(pp_gen_rng_next(rng) >> 11) / 9007199254740992.0;
  return lo + (hi - lo) * u;
}

int pp_gen_rng_int(pp_gen_rng *rng, int lo, int hi_inclusive) {
  guint64 span = (guint64)(hi_inclusive - lo + 1);
  return lo + (int)(pp_gen_rng_next(rng) % span);
}
