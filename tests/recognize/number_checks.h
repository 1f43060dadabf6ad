/* number_checks.h — what the label-reading tests share: the hint names, checks that parse one
 * string and fail the test, naming the string and the caller's line, unless it reads as wanted,
 * and field-by-field comparison of two readings. */
#pragma once

#include <math.h>
#include <string.h>

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

/* Every field of two readings equal, values bit for bit (a -0 would differ from 0). */
static inline gboolean same_number(const pp_number *a, const pp_number *b) {
  return memcmp(&a->value, &b->value, sizeof(double)) == 0 &&
         memcmp(&a->multiplier, &b->multiplier, sizeof(double)) == 0 && a->percent == b->percent &&
         a->permille == b->permille && strcmp(a->currency, b->currency) == 0 &&
         a->decimals == b->decimals && a->has_grouping == b->has_grouping &&
         a->decimal_mark == b->decimal_mark && a->year_like == b->year_like &&
         a->ambiguous == b->ambiguous;
}

static inline void print_number(const char *what, const pp_number *n) {
  print_error("  %s: value %.17g mult %g pct %d pm %d cur \"%s\" dec %d grp %d mark %d year %d "
              "amb %d\n",
              what, n->value, n->multiplier, n->percent, n->permille, n->currency, n->decimals,
              n->has_grouping, n->decimal_mark, n->year_like, n->ambiguous);
}

/* Whether the last decimal digit is '0', from the text (the parser keeps the flag to itself): a
 * label's decimals are its last ASCII digits unless an exponent ("e", "\u00d710") follows. */
static inline gboolean last_dec_zero_of_text(const char *s, const pp_number *n) {
  if (n->decimals == 0)
    return FALSE;
  const char *last = NULL;
  for (const char *p = s; *p; p++) {
    if (*p == 'e' || *p == 'E' || (guchar)*p == 0xC3) /* exponent, or the × of ×10 */
      break;
    if (g_ascii_isdigit(*p))
      last = p;
  }
  return last && *last == '0';
}
