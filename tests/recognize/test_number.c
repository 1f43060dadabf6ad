/* test_number.c — checks src/recognize/number.c against locale data from outside the project:
 * CLDR number symbols (recorded ICU 72.1 / CLDR 42.0 output), plus the notation the reader accepts
 * and rejects. glibc localedata and live ICU cases are in test_number_locale.c, the series
 * reading in test_number_series.c. */
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

/* ---- CLDR symbols per locale. Strings are ICU 72.1 (CLDR 42.0) output recorded on Debian 12
 * with unumf_openForSkeletonAndLocale(); the symbols themselves are, from memory, those of
 * Unicode CLDR, common/main/<locale>.xml, numbers/symbols and decimalFormats. */

static void test_cldr_en(void **state) {
  (void)state;
  /* Unicode CLDR, common/main/en.xml, numbers/symbols (group ",", decimal ".") and
   * decimalFormats "#,##0.###" (from memory; string from ICU 72.1 skeleton ".00", locale en) */
  pp_number n = CHECK_VALUE("1,234,567.50", ANY, 1234567.5);
  assert_int_equal(n.decimal_mark, POINT);
  assert_true(n.has_grouping);
  assert_int_equal(n.decimals, 2);
  assert_false(n.ambiguous);
  /* same source: "#,##0.###" allows up to three fraction digits */
  n = CHECK_VALUE("1,234.567", POINT, 1234.567);
  assert_int_equal(n.decimals, 3);
  /* Unicode CLDR, common/main/en.xml, currencyFormats "¤#,##0.00", minusSign "-" (from memory;
   * ICU 72.1 "currency/USD .00" printed "-$1,234.50") */
  n = CHECK_VALUE("-$1,234.50", ANY, -1234.5);
  assert_string_equal(n.currency, "$");
  /* ICU 72.1 "currency/CHF .00", locale en: ISO code, U+00A0, number */
  n = CHECK_VALUE("CHF\u00a01,234,567.50", ANY, 1234567.5);
  assert_string_equal(n.currency, "CHF");
  /* Unicode CLDR, common/main/en.xml, percentFormats "#,##0%" (from memory; ICU 72.1 "percent") */
  n = CHECK_VALUE("45%", ANY, 45);
  assert_true(n.percent);
  /* Unicode CLDR, common/main/en.xml, decimalFormats-numberSystem-latn short: "0K", "0M", "0B"
   * (from memory; ICU 72.1 "compact-short" printed "1.2M", "1.2B", "12K", "$1.2B") */
  n = CHECK_VALUE("1.2M", ANY, 1.2e6);
  assert_true(close_to(n.multiplier, 1e6));
  CHECK_VALUE("1.2B", ANY, 1.2e9);
  CHECK_VALUE("12K", ANY, 12e3);
  n = CHECK_VALUE("$1.2B", ANY, 1.2e9);
  assert_string_equal(n.currency, "$");
  /* same file, long compact forms (ICU 72.1 "compact-long": "1.2 million", "12 thousand") */
  CHECK_VALUE("1.2 million", ANY, 1.2e6);
  CHECK_VALUE("-1.2 thousand", ANY, -1.2e3);
  CHECK_VALUE("1.2 billion", ANY, 1.2e9);
  /* scientificFormats "#E0" (from memory; ICU 72.1 "scientific" printed "1.2345E3") */
  CHECK_VALUE("-1.2345E3", ANY, -1234.5);
  /* C printf "%g" and R's axis labels write "1e+06" (ISO C 7.21.6.1, the e conversion) */
  CHECK_VALUE("1e+06", ANY, 1e6);
  CHECK_VALUE("2.5e-3", ANY, 2.5e-3);
}

static void test_cldr_de(void **state) {
  (void)state;
  /* Unicode CLDR, common/main/de.xml, numbers/symbols group "." decimal "," (from memory;
   * ICU 72.1 ".00", locale de printed "1.234.567,50") */
  pp_number n = CHECK_VALUE("1.234.567,50", ANY, 1234567.5);
  assert_int_equal(n.decimal_mark, COMMA);
  assert_true(n.has_grouping);
  assert_false(n.ambiguous);
  /* de currencyFormats "#,##0.00 ¤" with U+00A0 (from memory; ICU 72.1 "currency/EUR .00") */
  n = CHECK_VALUE("-1.234,50\u00a0\u20ac", ANY, -1234.5);
  assert_string_equal(n.currency, "\u20ac");
  /* de percentFormats "#,##0 %" with U+00A0 (from memory; ICU 72.1 "percent") */
  n = CHECK_VALUE("45\u00a0%", ANY, 45);
  assert_true(n.percent);
  /* de compact short "0 Mio'.'", "0 Mrd'.'" (from memory; ICU 72.1 "compact-short" printed
   * "1,2 Mio." and "1,2 Mrd." with U+00A0, and "1,2 Mio. $" for currency/USD) */
  n = CHECK_VALUE("1,2\u00a0Mio.", ANY, 1.2e6);
  assert_true(close_to(n.multiplier, 1e6));
  CHECK_VALUE("1,2\u00a0Mrd.", ANY, 1.2e9);
  n = CHECK_VALUE("1,2\u00a0Mio.\u00a0$", ANY, 1.2e6);
  assert_string_equal(n.currency, "$");
  /* de compact long (ICU 72.1 "compact-long": "1,2 Millionen", "12 Tausend", "1,2 Milliarden") */
  CHECK_VALUE("1,2 Millionen", ANY, 1.2e6);
  CHECK_VALUE("12 Tausend", ANY, 12e3);
  CHECK_VALUE("1,2 Milliarden", ANY, 1.2e9);
  /* ICU 72.1 "compact-short" printed "12.500": grouping dot, only readable with the de hint */
  CHECK_VALUE("12.500", COMMA, 12500);
  /* ICU 72.1 "scientific", locale de: "1,2E9" */
  CHECK_VALUE("1,2E9", ANY, 1.2e9);
}

static void test_cldr_fr(void **state) {
  (void)state;
  /* Unicode CLDR, common/main/fr.xml, numbers/symbols group U+202F decimal "," (from memory;
   * ICU 72.1 ".00", locale fr printed "1 234 567,50" with U+202F) */
  pp_number n = CHECK_VALUE("1\u202f234\u202f567,50", ANY, 1234567.5);
  assert_int_equal(n.decimal_mark, COMMA);
  assert_true(n.has_grouping);
  /* fr currencyFormats "#,##0.00 ¤" (ICU 72.1 "currency/EUR .00": "-1 234,50 €", the group
   * U+202F, the gap U+00A0; "currency/USD .00": "45,00 $US") */
  n = CHECK_VALUE("-1\u202f234,50\u00a0\u20ac", ANY, -1234.5);
  assert_string_equal(n.currency, "\u20ac");
  n = CHECK_VALUE("45,00\u00a0$US", ANY, 45);
  assert_string_equal(n.currency, "$US");
  /* fr percentFormats "#,##0 %" (ICU 72.1 "percent" printed "45 %" with U+00A0) */
  n = CHECK_VALUE("45\u00a0%", ANY, 45);
  assert_true(n.percent);
  /* fr compact short "0 k", "0 M", "0 Md" (from memory; ICU 72.1 printed these with U+00A0) */
  CHECK_VALUE("12\u00a0k", ANY, 12e3);
  CHECK_VALUE("1,2\u00a0M", ANY, 1.2e6);
  CHECK_VALUE("1,2\u00a0Md", ANY, 1.2e9);
  /* fr compact long (ICU 72.1: "1,2 milliard", "12 mille", "-1,2 millier") */
  CHECK_VALUE("1,2 milliard", ANY, 1.2e9);
  CHECK_VALUE("12 mille", ANY, 12e3);
  CHECK_VALUE("-1,2 millier", ANY, -1.2e3);
  /* plain space, U+00A0 and U+2009 are used for the same grouping in typeset French
   * (common practice, no source) */
  CHECK_VALUE("1 234,5", ANY, 1234.5);
  CHECK_VALUE("1\u00a0234,5", ANY, 1234.5);
  CHECK_VALUE("1\u2009234\u2009567", ANY, 1234567);
}

static void test_cldr_sv(void **state) {
  (void)state;
  /* Unicode CLDR, common/main/sv.xml, numbers/symbols: group U+00A0 (U+202F in ICU output),
   * minusSign U+2212, exponential "×10^" (from memory; ICU 72.1 "scientific", locale sv
   * printed "1,23456×10^5") */
  CHECK_VALUE("1,23456×10^5", ANY, 123456);
  CHECK_VALUE("−1,2345×10^3", ANY, -1234.5);
  /* typeset superscript form, common practice, no source */
  CHECK_VALUE("2,5×10⁻³", ANY, 2.5e-3);
  CHECK_REJECTED("2,5×10");
  CHECK_REJECTED("2,5×10^");
}

static void test_bare_power_of_ten(void **state) {
  (void)state;
  /* Log-axis ticks as matplotlib's mathtext typesets them, 10 with a raised exponent; the
   * text stage writes the raise as '^' (common practice, no source). */
  CHECK_VALUE("10^3", ANY, 1000);
  CHECK_VALUE("10^-2", ANY, 0.01);
  CHECK_VALUE("10^−2", ANY, 0.01);
  CHECK_VALUE("10³", ANY, 1000); /* superscript three, U+00B3 */
  CHECK_REJECTED("10^");
  CHECK_REJECTED("11^3");
  CHECK_REJECTED("1,000^3");
}

static void test_cldr_de_ch(void **state) {
  (void)state;
  /* Unicode CLDR, common/main/de_CH.xml, numbers/symbols group "’" U+2019 decimal "." (CLDR 42,
   * from memory; ICU 72.1 ".00", locale de_CH printed "1’234’567.50") */
  pp_number n = CHECK_VALUE("1\u2019234\u2019567.50", ANY, 1234567.5);
  assert_int_equal(n.decimal_mark, POINT);
  assert_true(n.has_grouping);
  /* older Swiss texts use U+0027 for the same group (common practice, no source) */
  CHECK_VALUE("1'234.5", ANY, 1234.5);
  /* de_CH currencyFormats "¤ #,##0.00;¤-#,##0.00" (from memory; ICU 72.1 "currency/CHF .00"
   * printed "CHF 1’234’567.50" with U+00A0 and "CHF-1’234.50") */
  n = CHECK_VALUE("CHF\u00a01\u2019234\u2019567.50", ANY, 1234567.5);
  assert_string_equal(n.currency, "CHF");
  n = CHECK_VALUE("CHF-1\u2019234.50", ANY, -1234.5);
  assert_string_equal(n.currency, "CHF");
  /* ICU 72.1 "currency/USD .00", de_CH: "$-1’234.50" */
  CHECK_VALUE("$-1\u2019234.50", ANY, -1234.5);
  /* the brief's example, ASCII apostrophe */
  n = CHECK_VALUE("CHF 1'234.50", ANY, 1234.5);
  assert_int_equal(n.decimals, 2);
  /* de_CH percentFormats "#,##0%" (ICU 72.1 printed "45%") */
  CHECK_VALUE("45%", ANY, 45);
  /* ICU 72.1 "compact-short", de_CH: "1.2 Mio." */
  CHECK_VALUE("1.2\u00a0Mio.", ANY, 1.2e6);
}

static void test_cldr_en_in(void **state) {
  (void)state;
  /* Unicode CLDR, common/main/en_IN.xml, decimalFormats "#,##,##0.###" (from memory; ICU 72.1
   * ".00", locale en_IN printed "12,34,567.50" and "1,20,00,00,000.00") */
  pp_number n = CHECK_VALUE("12,34,567.50", ANY, 1234567.5);
  assert_true(n.has_grouping);
  CHECK_VALUE("1,20,00,00,000.00", ANY, 1.2e9);
  CHECK_VALUE("12,34,567", ANY, 1234567);
  /* en_IN compact short "0L" lakh and "0Cr" crore (ICU 72.1 printed "12L" for 1.2e6 and
   * "$120Cr" for 1.2e9) */
  CHECK_VALUE("12L", ANY, 1.2e6);
  n = CHECK_VALUE("$120Cr", ANY, 1.2e9);
  assert_true(close_to(n.multiplier, 1e7));
  /* group sizes that fit neither 3s nor lakh grouping */
  CHECK_REJECTED("1,23,4");
  CHECK_REJECTED("1,234,56");
  CHECK_REJECTED("12,34,56");
  CHECK_REJECTED("1,2345,678");
}

/* ---- notation the brief asks for; the conventions are common practice, no source. */

static void test_currencies(void **state) {
  (void)state;
  pp_number n = CHECK_VALUE("$1.2bn", ANY, 1.2e9);
  assert_string_equal(n.currency, "$");
  assert_true(close_to(n.multiplier, 1e9));
  n = CHECK_VALUE("\u20ac 30", ANY, 30);
  assert_string_equal(n.currency, "\u20ac");
  n = CHECK_VALUE("30 \u20ac", ANY, 30);
  assert_string_equal(n.currency, "\u20ac");
  n = CHECK_VALUE("1.234,50 EUR", ANY, 1234.5);
  assert_string_equal(n.currency, "EUR");
  n = CHECK_VALUE("US$12", ANY, 12);
  assert_string_equal(n.currency, "US$");
  n = CHECK_VALUE("\u00a3250", ANY, 250);
  assert_string_equal(n.currency, "\u00a3");
  n = CHECK_VALUE("\u00a51,000", POINT, 1000);
  assert_string_equal(n.currency, "\u00a5");
  n = CHECK_VALUE("250 kr", ANY, 250);
  assert_string_equal(n.currency, "kr");
  n = CHECK_VALUE("USD 5", ANY, 5);
  assert_string_equal(n.currency, "USD");
  CHECK_VALUE("-$5", ANY, -5);
  CHECK_VALUE("$-5", ANY, -5);
  CHECK_VALUE("5 Mio. \u20ac", ANY, 5e6);
  CHECK_VALUE("EUR 3 Mrd.", ANY, 3e9);
  CHECK_REJECTED("$5$");
  CHECK_REJECTED("USD 5 EUR");
  CHECK_REJECTED("EURO 5"); /* not an ISO code run on into letters */
  CHECK_REJECTED("$");
}

static void test_percent(void **state) {
  (void)state;
  pp_number n = CHECK_VALUE("45%", ANY, 45);
  assert_true(n.percent);
  assert_false(n.permille);
  CHECK_VALUE("45 %", ANY, 45);
  CHECK_VALUE("45\u00a0%", ANY, 45);
  CHECK_VALUE("12,5\u202f%", ANY, 12.5);
  n = CHECK_VALUE("45\u066a", ANY, 45); /* U+066A ARABIC PERCENT SIGN */
  assert_true(n.percent);
  n = CHECK_VALUE("3\u2030", ANY, 3); /* per mille: flagged apart, not divided */
  assert_false(n.percent);
  assert_true(n.permille);
  n = CHECK_VALUE("-2.5%", ANY, -2.5);
  assert_true(n.percent);
  CHECK_REJECTED("5%%");
  CHECK_REJECTED("5 k%");
  CHECK_REJECTED("$5%");
  CHECK_REJECTED("%");
}

static void test_suffixes(void **state) {
  (void)state;
  static const struct {
    const char *s;
    double value, multiplier;
  } cases[] = {
      {"5k", 5e3, 1e3},         {"5K", 5e3, 1e3},           {"2.5m", 2.5e6, 1e6},
      {"2.5M", 2.5e6, 1e6},     {"2.5mn", 2.5e6, 1e6},      {"2.5 MM", 2.5e6, 1e6},
      {"2,5 Mio.", 2.5e6, 1e6}, {"2,5 Mio", 2.5e6, 1e6},    {"7bn", 7e9, 1e9},
      {"7B", 7e9, 1e9},         {"7 Mrd.", 7e9, 1e9},       {"7 Mrd", 7e9, 1e9},
      {"1.1tn", 1.1e12, 1e12},  {"1.1T", 1.1e12, 1e12},     {"1,1 Bio.", 1.1e12, 1e12},
      {"-0.3bn", -0.3e9, 1e9},  {"12.5 lakh", 1.25e6, 1e5}, {"3 crore", 3e7, 1e7},
  };
  for (size_t i = 0; i < G_N_ELEMENTS(cases); i++) {
    pp_number n = check_value_at(cases[i].s, ANY, cases[i].value, __LINE__);
    assert_true(close_to(n.multiplier, cases[i].multiplier));
  }
  /* the multiplied value is one correctly rounded conversion: 0.1k is exactly 100 */
  pp_number n = CHECK_VALUE("0.1k", ANY, 100);
  assert_true(n.value == 100.0);
  CHECK_REJECTED("5 km");
  CHECK_REJECTED("5kk");
  CHECK_REJECTED("5 k M");
  CHECK_REJECTED("5 Billion"); /* 1e9 or 1e12 depending on language: refused */
  CHECK_REJECTED("1e3k");
}

static void test_negatives(void **state) {
  (void)state;
  pp_number n = CHECK_VALUE("-1,234", POINT, -1234);
  assert_false(n.year_like);
  CHECK_VALUE("\u22125", ANY, -5); /* U+2212 MINUS SIGN */
  CHECK_VALUE("\u20135", ANY, -5); /* U+2013 EN DASH */
  CHECK_VALUE("+5", ANY, 5);
  CHECK_VALUE("(1,234)", POINT, -1234);
  CHECK_VALUE("($1,234.50)", ANY, -1234.5);
  CHECK_VALUE("$(1,234.50)", ANY, -1234.5);
  CHECK_VALUE("(5%)", ANY, -5);
  CHECK_VALUE("\u22121,5\u00a0%", ANY, -1.5);
  CHECK_VALUE("-.5", ANY, -0.5);
  CHECK_REJECTED("5-");  /* trailing minus refused, see number.c */
  CHECK_REJECTED("- 5"); /* sign detached from the digits */
  CHECK_REJECTED("--5");
  CHECK_REJECTED("+-5");
  CHECK_REJECTED("(-5)");
  CHECK_REJECTED("-(5)");
  CHECK_REJECTED("(5");
  CHECK_REJECTED("5)");
}

/* Exact, not close: the whole decimal string is converted once, and C17 §7.22.1.3 with IEEE 754
 * §5.12.2 (glibc's strtod rounds correctly) gives the double nearest to it, the same as the
 * literal. The long ones pass 96 bytes, where number.c builds the string on the heap. */
static void test_exact_conversion(void **state) {
  (void)state;
  struct {
    const char *label;
    double want;
  } cases[] = {{"0.1", 0.1},         {"123.456", 123.456},
               {"2.5e-3", 2.5e-3},   {"-0.3", -0.3},
               {"1.5E300", 1.5e300}, {"9,007,199,254,740,993", 9007199254740993.0},
               {"0.0000001", 1e-7}};
  for (size_t i = 0; i < G_N_ELEMENTS(cases); i++) {
    pp_number n;
    assert_true(pp_number_parse(cases[i].label, PP_DECIMAL_POINT, &n));
    assert_true(n.value == cases[i].want);
  }
  GString *big = g_string_new("1"), *tiny = g_string_new("0.");
  for (int i = 0; i < 120; i++)
    g_string_append_c(big, '0');
  for (int i = 0; i < 119; i++)
    g_string_append_c(tiny, '0');
  g_string_append_c(tiny, '1');
  pp_number n;
  assert_true(pp_number_parse(big->str, PP_DECIMAL_POINT, &n));
  assert_true(n.value == 1e120);
  assert_true(pp_number_parse(tiny->str, PP_DECIMAL_POINT, &n));
  assert_true(n.value == 1e-120);
  g_string_free(big, TRUE);
  g_string_free(tiny, TRUE);
}

static void test_rejections(void **state) {
  (void)state;
  static const char *const bad[] = {
      "2019-03",   "03/2019",   "12.03.2019",   "2019-03-12", "Q1 2031", "FY2022",
      "Jan",       "H1",        "1st",          "v2.0.1",     "10:30",   "A4",
      "",          " ",         "\u00a0\u202f", "\t\n",       "1.2.3",   "1,2,3",
      "2019 2020", "5.",        "5,",           ",",          ".",       "1 2",
      "12.3,4",    "1,234.5,6", "1.234,567.8",  "1,234 567",  "x5",      "5x",
      "\u0665", /* ARABIC-INDIC DIGIT FIVE: non-ASCII digits are not supported */
      "\xff",   /* not UTF-8 */
  };
  for (size_t i = 0; i < G_N_ELEMENTS(bad); i++)
    check_rejected_at(bad[i], __LINE__);
  pp_number n;
  assert_false(pp_number_parse(NULL, ANY, &n));
}

static void test_year_like(void **state) {
  (void)state;
  pp_number n = CHECK_VALUE("2019", ANY, 2019);
  assert_true(n.year_like);
  n = CHECK_VALUE("  1800 ", ANY, 1800);
  assert_true(n.year_like);
  n = CHECK_VALUE("2199", ANY, 2199);
  assert_true(n.year_like);
  n = CHECK_VALUE("1799", ANY, 1799);
  assert_false(n.year_like);
  n = CHECK_VALUE("2200", ANY, 2200);
  assert_false(n.year_like);
  n = CHECK_VALUE("2,019", POINT, 2019);
  assert_false(n.year_like);
  n = CHECK_VALUE("2019.0", ANY, 2019);
  assert_false(n.year_like);
  n = CHECK_VALUE("-2019", ANY, -2019);
  assert_false(n.year_like);
  n = CHECK_VALUE("$2019", ANY, 2019);
  assert_false(n.year_like);
  n = CHECK_VALUE("2019%", ANY, 2019);
  assert_false(n.year_like);
  n = CHECK_VALUE("02019", ANY, 2019);
  assert_false(n.year_like);
}

static void test_ambiguity_and_hints(void **state) {
  (void)state;
  /* the brief: without a hint an ambiguous string takes the point convention and is flagged */
  pp_number n = CHECK_VALUE("1,234", ANY, 1234);
  assert_true(n.ambiguous);
  assert_true(n.has_grouping);
  n = CHECK_VALUE("1.234", ANY, 1.234);
  assert_true(n.ambiguous);
  assert_int_equal(n.decimal_mark, POINT);
  n = CHECK_VALUE("1,234", COMMA, 1.234);
  assert_false(n.ambiguous);
  assert_int_equal(n.decimal_mark, COMMA);
  assert_int_equal(n.decimals, 3);
  CHECK_VALUE("1.234", COMMA, 1234);
  /* a leading zero group can never be grouping, so these are unambiguous */
  n = CHECK_VALUE("0,234", ANY, 0.234);
  assert_false(n.ambiguous);
  n = CHECK_VALUE("0.500", ANY, 0.5);
  assert_false(n.ambiguous);
  /* neither reading differs: not ambiguous, no mark */
  n = CHECK_VALUE("1 234", ANY, 1234);
  assert_false(n.ambiguous);
  assert_int_equal(n.decimal_mark, PP_DECIMAL_UNKNOWN);
  /* hints are strict */
  assert_false(pp_number_parse("1,5", POINT, &n));
  assert_false(pp_number_parse("1.5", COMMA, &n));
  assert_false(pp_number_parse("1,234.5", COMMA, &n));
  /* on failure the output is zeroed */
  assert_true(n.value == 0 && n.multiplier == 0 && n.currency[0] == '\0');
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_bare_power_of_ten),
      cmocka_unit_test(test_cldr_en),
      cmocka_unit_test(test_cldr_de),
      cmocka_unit_test(test_cldr_fr),
      cmocka_unit_test(test_cldr_sv),
      cmocka_unit_test(test_cldr_de_ch),
      cmocka_unit_test(test_cldr_en_in),
      cmocka_unit_test(test_currencies),
      cmocka_unit_test(test_percent),
      cmocka_unit_test(test_suffixes),
      cmocka_unit_test(test_negatives),
      cmocka_unit_test(test_exact_conversion),
      cmocka_unit_test(test_rejections),
      cmocka_unit_test(test_year_like),
      cmocka_unit_test(test_ambiguity_and_hints),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
