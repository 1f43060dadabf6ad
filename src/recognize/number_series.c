/* number_series.c — the labels of one axis read under one shared decimal convention. Each label
 * is read once under both conventions (pp_number_read, number.c); the pick weighs how many labels
 * each reads and how regular the series it gives is, so that a run of labels tried many times
 * (an axis fitted, trimmed and split) is never parsed again. */
#include "recognize/number.h"

#include <math.h>
#include <string.h>

/* Evidence that a reading is the intended one, for tick labels in axis order: evenly spaced
 * (linear or log axis), monotonic, same number of decimals, no decimal part that always ends in
 * '0' (a tick formatter never pads "1.5" to "1.500"). Weights only break ties between them. */
static int pattern_score(const pp_number_reading *const *r, size_t n, int c) {
  double prev = 0;
  size_t m = 0;
  gboolean same_dec = TRUE, any_dec = FALSE, all_zero = TRUE, mono_up = TRUE, mono_down = TRUE;
  gboolean linear = TRUE, geometric = TRUE;
  double first_diff = 0, first_ratio = 0, scale = 0;
  int dec0 = -1;

  for (size_t i = 0; i < n; i++)
    if (r[i]->ok[c])
      scale = MAX(scale, fabs(r[i]->as[c].value));
  double tol = 1e-9 * scale + 1e-300;
  for (size_t i = 0; i < n; i++) {
    if (!r[i]->ok[c])
      continue;
    const pp_number *v = &r[i]->as[c];
    double x = v->value;
    if (dec0 < 0)
      dec0 = v->decimals;
    same_dec = same_dec && v->decimals == dec0;
    if (v->decimals > 0) {
      any_dec = TRUE;
      all_zero = all_zero && r[i]->last_dec_zero[c];
    }
    if (m > 0) {
      double d = x - prev;
      mono_up = mono_up && d > 0;
      mono_down = mono_down && d < 0;
      if (m == 1)
        first_diff = d;
      linear = linear && fabs(d - first_diff) <= tol;
      if (prev != 0 && x / prev > 0) {
        double q = x / prev;
        if (m == 1)
          first_ratio = q;
        geometric = geometric && fabs(q - first_ratio) <= 1e-9 * fabs(first_ratio);
      } else {
        geometric = FALSE;
      }
    }
    prev = x;
    m++;
  }
  int score = 0;
  if (m >= 3 && (mono_up || mono_down) && (linear || geometric))
    score += 8;
  if (m >= 3 && (mono_up || mono_down))
    score += 4;
  if (m >= 2 && same_dec)
    score += 2;
  if (!(any_dec && all_zero))
    score += 1;
  return score;
}

size_t pp_number_pick_series(const pp_number_reading *const *readings, size_t n, pp_number *out,
                             gboolean *ok) {
  size_t count[2] = {0, 0};
  int score[2];

  if (n == 0)
    return 0;
  for (int c = 0; c < 2; c++) {
    for (size_t i = 0; i < n; i++)
      count[c] += readings[i]->ok[c] ? 1 : 0;
    /* a label read counts for more than any pattern: pattern_score is under 16 */
    score[c] = (int)MIN(count[c], (size_t)1 << 20) * 16 + pattern_score(readings, n, c);
  }
  int pick = score[1] > score[0] ? 1 : 0;
  gboolean tie = score[0] == score[1];
  for (size_t i = 0; i < n; i++) {
    const pp_number_reading *r = readings[i];
    out[i] = r->as[pick];
    /* with no evidence either way, flag the labels the other convention reads differently */
    out[i].ambiguous = tie && r->ok[0] && r->ok[1] && r->as[0].value != r->as[1].value;
    if (ok)
      ok[i] = r->ok[pick];
  }
  return count[pick];
}

size_t pp_number_parse_series(const char *const *labels, size_t n, pp_number *out, gboolean *ok) {
  if (n == 0)
    return 0;
  pp_number_reading *readings = g_new(pp_number_reading, n);
  const pp_number_reading **r = g_new(const pp_number_reading *, n);
  for (size_t i = 0; i < n; i++) {
    pp_number_read(labels[i], &readings[i]);
    r[i] = &readings[i];
  }
  size_t result = pp_number_pick_series(r, n, out, ok);
  g_free(r);
  g_free(readings);
  return result;
}
