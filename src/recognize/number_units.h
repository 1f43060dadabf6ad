/* number_units.h — the symbols and words a number label may carry around its digits:
 * currencies, magnitudes and percent signs. Private to the label reader (number.c). */
#pragma once

#include <stddef.h>

enum { PP_UNIT_CURRENCY, PP_UNIT_MULT, PP_UNIT_PERCENT, PP_UNIT_PERMILLE };

typedef struct {
  const char *text;
  int kind;
  int exp10; /* PP_UNIT_MULT only */
} pp_number_unit;

/* The longest unit at p (end bounds the text), or NULL; *len gets its length in bytes. A unit
 * ending in a letter must not run on into another letter, so "km" is neither "k" nor "kr". */
const pp_number_unit *pp_number_unit_match(const char *p, const char *end, size_t *len);
