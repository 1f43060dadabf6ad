/* number.h — turns one tick or data label string ("1.234,5", "$1.2bn", "(45 %)") into a number
 * plus the notation facts the recognition stage needs (decimal mark, grouping, unit,
 * year-likeness), and the labels of one axis into numbers under one convention. Stage-internal:
 * only src/recognize uses it. Grammar and choices are documented in number.c, the series pick in
 * number_series.c. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

typedef enum { PP_DECIMAL_UNKNOWN, PP_DECIMAL_POINT, PP_DECIMAL_COMMA } pp_decimal_mark;

typedef struct {
  double value;      /* mantissa × multiplier, sign applied; percent NOT divided (45% -> 45) */
  double multiplier; /* 1 unless a suffix: 1e3, 1e5 (lakh), 1e6, 1e7 (crore), 1e9, 1e12 */
  gboolean percent;  /* '%', U+066A or U+FF05 */
  gboolean permille; /* '‰' U+2030; value not divided either */
  char currency[8];  /* symbol or ISO 4217 code as written ("$", "€", "CHF", "US$"), "" if none */
  int decimals;      /* digits after the decimal mark */
  gboolean has_grouping;
  pp_decimal_mark decimal_mark; /* the mark used, UNKNOWN when the string has neither */
  gboolean year_like; /* bare 4-digit integer 1800..2199, no sign/unit/grouping: maybe a year */
  gboolean ambiguous; /* hint UNKNOWN and both conventions read it differently ("1,234") */
} pp_number;

/* Parses one label. With hint POINT or COMMA the convention is strict ("1,5" fails under POINT);
 * with UNKNOWN both are tried and an ambiguous string takes the point reading. On failure *out
 * is zeroed and FALSE returned. */
gboolean pp_number_parse(const char *utf8, pp_decimal_mark hint, pp_number *out);

/* One label read under each definite convention, [0] point and [1] comma, as
 * pp_number_parse with that hint reads it; last_dec_zero tells whether the last decimal digit
 * is '0'. What a series chooses between, computed once per label. */
typedef struct {
  pp_number as[2];
  gboolean ok[2];
  gboolean last_dec_zero[2];
} pp_number_reading;

/* Reads one label under both conventions; returns whether either parsed. */
gboolean pp_number_read(const char *utf8, pp_number_reading *out);

/* The label's reading on its own, exactly pp_number_parse with hint UNKNOWN: the point reading
 * (ambiguous when the comma one differs), else the comma one; zeroed and FALSE when neither. */
gboolean pp_number_reading_alone(const pp_number_reading *r, pp_number *out);

/* Picks one shared convention for the labels of one axis, in axis order: the one that parses
 * the most labels, then the one giving an evenly spaced / monotonic / equal-decimals series,
 * else the point convention. out has n slots (those of failed labels hold the failed reading);
 * ok[i] (may be NULL) tells which parsed; returns how many did. ambiguous is set only when no
 * evidence chose the convention. */
size_t pp_number_pick_series(const pp_number_reading *const *readings, size_t n, pp_number *out,
                             gboolean *ok);

/* pp_number_read on each label, then pp_number_pick_series. */
size_t pp_number_parse_series(const char *const *labels, size_t n, pp_number *out, gboolean *ok);

G_END_DECLS
