/* test_number_read.c — checks one label read under both decimal conventions
 * (pp_number_read, pp_number_reading_alone in src/recognize/number.c). Expected values are worked
 * out by hand from the grammar at the top of number.c and the rule stated in number.h; the stored
 * readings are also compared with pp_number_parse under each hint on strings that stop in every
 * part of the grammar. */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdint.h>

#include <cmocka.h>

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "number_checks.h"

/* ---- one label, both conventions: values by hand from number.c's grammar ('.' the decimal mark
 * and ',' grouping under the point convention, the other way round under the comma one; groups
 * of three after a first group of one to three digits that does not start with 0). */

typedef struct {
  gboolean ok;
  double value;
  int decimals;
  gboolean grouping, last_zero;
  pp_decimal_mark mark;
} want_reading;

static void check_reading_at(const char *s, want_reading p, want_reading c, int line) {
  pp_number_reading r;
  gboolean any = pp_number_read(s, &r);
  const want_reading *w[2] = {&p, &c};
  for (int k = 0; k < 2; k++) {
    gboolean good = r.ok[k] == w[k]->ok;
    if (good && w[k]->ok)
      good = r.as[k].value == w[k]->value && r.as[k].decimals == w[k]->decimals &&
             r.as[k].has_grouping == w[k]->grouping && r.last_dec_zero[k] == w[k]->last_zero &&
             r.as[k].decimal_mark == w[k]->mark && !r.as[k].ambiguous;
    if (!good) {
      print_error("line %d: \"%s\" under the %s convention: ok %d, want ok %d value %.17g\n", line,
                  s ? s : "(null)", k ? "comma" : "point", r.ok[k], w[k]->ok, w[k]->value);
      print_number("got", &r.as[k]);
      fail();
    }
  }
  assert_int_equal(any, p.ok || c.ok);
}
#define CHECK_READING(s, p, c) check_reading_at((s), (p), (c), __LINE__)
#define FAILS ((want_reading){FALSE, 0, 0, FALSE, FALSE, PP_DECIMAL_UNKNOWN})
#define READS(v, dec, grp, zero, mark) ((want_reading){TRUE, (v), (dec), (grp), (zero), (mark)})

static void test_read_by_hand(void **state) {
  (void)state;
  /* point: 1 then the decimals 234; comma: the groups 1 and 234 */
  CHECK_READING("1.234", READS(1.234, 3, FALSE, FALSE, POINT), READS(1234, 0, TRUE, FALSE, ANY));
  /* point: groups 1 and 500; comma: 1 then the decimals 500, which end in 0 */
  CHECK_READING("1,500", READS(1500, 0, TRUE, FALSE, ANY), READS(1.5, 3, FALSE, TRUE, COMMA));
  /* point: a group of one digit after "2" is no grouping; comma: 2 then the decimal 0 */
  CHECK_READING("2,0", FAILS, READS(2, 1, FALSE, TRUE, COMMA));
  /* comma: a first group "0" is never grouping */
  CHECK_READING("0.5", READS(0.5, 1, FALSE, FALSE, POINT), FAILS);
  /* two marks: only the one before the last group may be the decimal mark */
  CHECK_READING("\u20ac1.234,5", FAILS, READS(1234.5, 1, TRUE, FALSE, COMMA));
  CHECK_READING("1,234.5", READS(1234.5, 1, TRUE, FALSE, POINT), FAILS);
  /* neither mark: both conventions read alike */
  CHECK_READING("45%", READS(45, 0, FALSE, FALSE, ANY), READS(45, 0, FALSE, FALSE, ANY));
  CHECK_READING("12\u202f500", READS(12500, 0, TRUE, FALSE, ANY),
                READS(12500, 0, TRUE, FALSE, ANY));
  CHECK_READING(" 2019 ", READS(2019, 0, FALSE, FALSE, ANY), READS(2019, 0, FALSE, FALSE, ANY));
  CHECK_READING("Jan", FAILS, FAILS);
  CHECK_READING("", FAILS, FAILS);
  CHECK_READING("\u00a0", FAILS, FAILS);
  CHECK_READING("\xff", FAILS, FAILS);
  CHECK_READING(NULL, FAILS, FAILS);
}

/* The label on its own is number.h's rule: the point reading, flagged ambiguous when the comma
 * reading differs, else the comma reading (hand-worked values as above). */
static void test_reading_alone_by_hand(void **state) {
  (void)state;
  pp_number_reading r;
  pp_number n;
  assert_true(pp_number_read("1,234", &r) && pp_number_reading_alone(&r, &n));
  assert_true(n.value == 1234 && n.ambiguous && n.has_grouping);
  assert_true(pp_number_read("0,5", &r) && pp_number_reading_alone(&r, &n));
  assert_true(n.value == 0.5 && !n.ambiguous && n.decimal_mark == COMMA);
  assert_true(pp_number_read("12 500", &r) && pp_number_reading_alone(&r, &n));
  assert_true(n.value == 12500 && !n.ambiguous);
  /* "1.500" reads 1.5 and 1500: ambiguous, point reading */
  assert_true(pp_number_read("1.500", &r) && pp_number_reading_alone(&r, &n));
  assert_true(n.value == 1.5 && n.ambiguous && n.decimals == 3);
  /* neither: zeroed, multiplier included */
  assert_false(pp_number_read("Jan", &r));
  assert_false(pp_number_reading_alone(&r, &n));
  assert_true(n.value == 0 && n.multiplier == 0 && n.currency[0] == '\0');
}

/* Strings that stop in every part of the grammar, with and without '.' and ','. */
static const char *const mixed_strings[] = {
    "0",
    "5",
    "-5",
    "(5)",
    "+5",
    "\u22125",
    "5-",
    "$",
    "$5",
    "5$",
    "$ 5",
    "- 5",
    "(5",
    "5)",
    "45%",
    "45 %",
    "%45",
    "5\u2030",
    "$5%",
    "5k%",
    "1.2bn",
    "1,2bn",
    "$1.2bn",
    "\u20ac 30",
    "30 \u20ac",
    "CHF 1'234.50",
    "1\u2019234",
    "1 234",
    "1e3",
    "1E-3",
    "1.5e3",
    "1,5e3",
    "10^3",
    "10\u207b\u00b2",
    "\u00d710^3",
    "2\u00d710^3",
    "2,5\u00d710\u00b3",
    "12,34,567",
    "1,23,45,678",
    "1.23.456",
    ".5",
    ",5",
    "0.500",
    "0,500",
    "1.000.000",
    "1,000,000",
    "1 000,5",
    "1 000.5",
    "2019",
    "2019.0",
    "2,019",
    "1799",
    "02019",
    "5 km",
    "5km",
    "5 m",
    "Mio. 5",
    "5 Mio.",
    "Rs. 500",
    "Fr. 5.50",
    "5 kr.",
    "kr 5,50",
    "5 Tsd.",
    "Jan",
    "Q1 2031",
    "1.2.3",
    "1,2,3",
    "12.3,4",
    "x5",
    "5x",
    "",
    " ",
    "\t5\n",
    "\u200b7",
    "(1,5)",
    "(-5)",
    "-(5)",
};

/* The stored readings are exactly what pp_number_parse makes of the label with each hint (the
 * one-parse shortcut for labels without '.' or ',' included). */
static void test_read_matches_hinted_parse(void **state) {
  (void)state;
  for (size_t i = 0; i < G_N_ELEMENTS(mixed_strings); i++) {
    pp_number_reading r;
    pp_number_read(mixed_strings[i], &r);
    for (int k = 0; k < 2; k++) {
      pp_number n;
      gboolean ok = pp_number_parse(mixed_strings[i], k ? COMMA : POINT, &n);
      if (ok != r.ok[k] || !same_number(&n, &r.as[k]) ||
          r.last_dec_zero[k] != (ok && last_dec_zero_of_text(mixed_strings[i], &n))) {
        print_error("\"%s\" hint %s: read ok %d, parse ok %d\n", mixed_strings[i],
                    k ? "comma" : "point", r.ok[k], ok);
        print_number("read", &r.as[k]);
        print_number("parse", &n);
        fail();
      }
    }
  }
}

/* Without a hint, pp_number_parse is number.h's rule applied to the two hinted parses (the
 * shortcut for strings without a digit included: "$" alone leaves a currency in the failed
 * hinted reading, never in the unhinted one). */
static void test_parse_unknown_is_rule(void **state) {
  (void)state;
  for (size_t i = 0; i < G_N_ELEMENTS(mixed_strings); i++) {
    pp_number p, c, want, got;
    gboolean okp = pp_number_parse(mixed_strings[i], POINT, &p);
    gboolean okc = pp_number_parse(mixed_strings[i], COMMA, &c);
    memset(&want, 0, sizeof want);
    if (okp) {
      want = p;
      want.ambiguous = okc && p.value != c.value;
    } else if (okc) {
      want = c;
    }
    gboolean ok = pp_number_parse(mixed_strings[i], ANY, &got);
    if (ok != (okp || okc) || !same_number(&got, &want)) {
      print_error("\"%s\" without a hint: ok %d, want ok %d\n", mixed_strings[i], ok, okp || okc);
      print_number("got", &got);
      print_number("want", &want);
      fail();
    }
  }
  pp_number n;
  assert_false(pp_number_parse(NULL, ANY, &n));
  assert_true(n.multiplier == 0);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_read_by_hand),
      cmocka_unit_test(test_reading_alone_by_hand),
      cmocka_unit_test(test_read_matches_hinted_parse),
      cmocka_unit_test(test_parse_unknown_is_rule),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
