/* format.c — numbers in finding sentences: four significant digits, en-style
 * grouping, so "30,000" and "1.08" read naturally. */
#include <math.h>
#include <string.h>

#include "internal.h"

char *pp_format_value(double v) {
  if (!isfinite(v))
    return g_strdup("?");
  double a = fabs(v);
  int decimals = a >= 1000 ? 0 : a >= 100 ? 1 : a >= 10 ? 2 : a >= 1 ? 2 : 3;
  if (a != 0 && a < 0.01)
    return g_strdup_printf("%.3g", v);
  char *raw = g_strdup_printf("%.*f", decimals, a);
  /* trim trailing zeros of the fraction */
  char *dot = strchr(raw, '.');
  if (dot) {
    char *end = raw + strlen(raw) - 1;
    while (end > dot && *end == '0')
      *end-- = '\0';
    if (end == dot)
      *end = '\0';
  }
  dot = strchr(raw, '.');
  size_t int_len = dot ? (size_t)(dot - raw) : strlen(raw);
  GString *s = g_string_new(v < 0 ? "-" : "");
  for (size_t i = 0; i < int_len; i++) {
    if (i > 0 && (int_len - i) % 3 == 0)
      g_string_append_c(s, ',');
    g_string_append_c(s, raw[i]);
  }
  if (dot)
    g_string_append(s, dot);
  g_free(raw);
  return g_string_free(s, FALSE);
}
