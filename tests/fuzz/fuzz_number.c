/* fuzz_number.c — libFuzzer harness for the number-label parser (src/recognize/number.h):
 * each input line is one label, parsed under the three decimal-mark hints, then all lines
 * as one axis series. Finds crashes, overreads and undefined behaviour, not wrong values. */
#include <stdint.h>
#include <string.h>

#include "recognize/number.h"

/* Labels per input: an axis rarely has more than a few dozen. Common practice, no source. */
#define MAX_LABELS 64

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size) {
  char *text = g_strndup((const char *)data, size); /* stops at a NUL byte, like C strings */
  char **lines = g_strsplit(text, "\n", MAX_LABELS);
  size_t n = g_strv_length(lines);
  pp_number num;
  for (size_t i = 0; i < n; i++)
    for (int hint = PP_DECIMAL_UNKNOWN; hint <= PP_DECIMAL_COMMA; hint++)
      pp_number_parse(lines[i], (pp_decimal_mark)hint, &num);
  pp_number *out = g_new0(pp_number, n + 1);
  gboolean *ok = g_new0(gboolean, n + 1);
  pp_number_parse_series((const char *const *)lines, n, out, ok);
  g_free(ok);
  g_free(out);
  g_strfreev(lines);
  g_free(text);
  return 0;
}
