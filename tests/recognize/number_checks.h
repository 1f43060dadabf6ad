/* number_checks.h — what the label-reading tests share: the hint names and checks that parse one
 * string and fail the test, naming the string and the caller's line, unless it reads as wanted. */
#pragma once

#include <math.h>

#include "recognize/number.h"

#define POINT PP_DECIMAL_POINT
#define COMMA PP_DECIMAL_COMMA
#define ANY PP_DECIMAL_UNKNOWN

static inline gboolean close_to(double got, double want) {
  return fabs(got - want) <= 1e-9 * fmax(1.0, fabs(want));
}

/* Parses s and fails the test, naming the string and the caller's line, unless value matches. */
static inline pp_number check_value_at(const char *s, pp_decimal_mark hint, double want, int line) {
  pp_number n;
  if (!pp_number_parse(s, hint, &n)) {
    print_error("line %d: \"%s\" (hint %d) did not parse, want %.17g\n", line, s, hint, want);
    fail();
  }
  if (!close_to(n.value, want)) {
    print_error("line %d: \"%s\" (hint %d) gave %.17g, want %.17g\n", line, s, hint, n.value, want);
    fail();
  }
  return n;
}
#define CHECK_VALUE(s, hint, want) check_value_at((s), (hint), (want), __LINE__)

static inline void check_rejected_at(const char *s, int line) {
  pp_number n;
  for (int h = ANY; h <= COMMA; h++)
    if (pp_number_parse(s, (pp_decimal_mark)h, &n)) {
      print_error("line %d: \"%s\" (hint %d) parsed as %.17g, want rejection\n", line, s, h,
                  n.value);
      fail();
    }
}
#define CHECK_REJECTED(s) check_rejected_at((s), __LINE__)
