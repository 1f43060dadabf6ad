/* test_number_locale.c — checks src/recognize/number.c against locale data read at run time:
 * glibc's localedata files (/usr/share/i18n/locales) and, when PP_TEST_HAVE_ICU, whatever the
 * installed ICU's CLDR prints, single labels and whole axis series. */
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

/* ---- glibc localedata: decimal_point, thousands_sep, grouping read from LC_NUMERIC of each
 * /usr/share/i18n/locales/<name> at run time (following "copy"), numbers formatted with them
 * by the test, then parsed under the matching hint. Skipped when the files are absent. */

typedef struct {
  char decimal[8], group[8];
  int grouping[8], ngrouping;
} glibc_numeric;

static void ucs_to_utf8(const char *in, char *out, size_t n) {
  GString *s = g_string_new(NULL);
  while (*in) {
    unsigned cp;
    int used;
    if (sscanf(in, "<U%4X>%n", &cp, &used) == 1) {
      g_string_append_unichar(s, cp);
      in += used;
    } else {
      g_string_append_c(s, *in++);
    }
  }
  g_strlcpy(out, s->str, n);
  g_string_free(s, TRUE);
}

static gboolean read_glibc_numeric(const char *dir, const char *locale, glibc_numeric *out,
                                   int depth) {
  char *path = g_build_filename(dir, locale, NULL), *text = NULL;
  gboolean ok = g_file_get_contents(path, &text, NULL, NULL);
  g_free(path);
  if (!ok)
    return FALSE;
  gboolean in_numeric = FALSE, found = FALSE;
  char **lines = g_strsplit(text, "\n", -1);
  for (char **l = lines; *l; l++) {
    char *line = g_strstrip(*l), val[64];
    if (g_str_has_prefix(line, "LC_NUMERIC"))
      in_numeric = TRUE;
    else if (g_str_has_prefix(line, "END LC_NUMERIC"))
      break;
    else if (!in_numeric)
      continue;
    else if (sscanf(line, "copy \"%63[^\"]\"", val) == 1 && depth < 4)
      found = read_glibc_numeric(dir, val, out, depth + 1);
    else if (sscanf(line, "decimal_point \"%63[^\"]\"", val) == 1)
      ucs_to_utf8(val, out->decimal, sizeof out->decimal), found = TRUE;
    else if (sscanf(line, "thousands_sep \"%63[^\"]\"", val) == 1)
      ucs_to_utf8(val, out->group, sizeof out->group);
    else if (sscanf(line, "thousands_sep \"%1[\"]", val) == 1)
      out->group[0] = '\0';
    else if (g_str_has_prefix(line, "grouping")) {
      char **parts = g_strsplit_set(line + strlen("grouping"), "; \t", -1);
      out->ngrouping = 0;
      for (char **p = parts; *p && out->ngrouping < 8; p++)
        if (**p && **p != '%')
          out->grouping[out->ngrouping++] = atoi(*p);
        else if (**p == '%')
          break;
      g_strfreev(parts);
    }
  }
  g_strfreev(lines);
  g_free(text);
  return found;
}

/* POSIX grouping: sizes from the right, the last one repeating; 0 or -1 ends grouping. */
static char *glibc_format(const glibc_numeric *ln, double v, int decimals) {
  char digits[64];
  g_snprintf(digits, sizeof digits, "%.*f", decimals, fabs(v));
  char *dot = strchr(digits, '.');
  size_t nint = dot ? (size_t)(dot - digits) : strlen(digits);
  GPtrArray *groups = g_ptr_array_new_with_free_func(g_free);
  size_t pos = nint;
  int gi = 0;
  while (pos > 0) {
    int size = ln->ngrouping ? ln->grouping[MIN(gi, ln->ngrouping - 1)] : 0;
    if (!ln->group[0] || size <= 0 || (size_t)size >= pos) {
      g_ptr_array_add(groups, g_strndup(digits, pos));
      break;
    }
    g_ptr_array_add(groups, g_strndup(digits + pos - size, size));
    pos -= size;
    gi++;
  }
  GString *s = g_string_new(v < 0 ? "-" : "");
  for (guint i = groups->len; i-- > 0;) {
    g_string_append(s, g_ptr_array_index(groups, i));
    if (i > 0)
      g_string_append(s, ln->group);
  }
  if (dot) {
    g_string_append(s, ln->decimal);
    g_string_append(s, dot + 1);
  }
  g_ptr_array_free(groups, TRUE);
  return g_string_free(s, FALSE);
}

static void test_glibc_localedata(void **state) {
  (void)state;
  const char *dir = g_getenv("PP_TEST_LOCALEDATA");
  dir = dir ? dir : "/usr/share/i18n/locales";
  static const char *const locales[] = {
      "en_US", "en_GB", "de_DE", "de_AT", "de_CH", "fr_FR", "fr_CA", "fr_CH", "it_IT", "it_CH",
      "es_ES", "es_MX", "pt_BR", "pt_PT", "nl_NL", "sv_SE", "nb_NO", "da_DK", "fi_FI", "pl_PL",
      "cs_CZ", "ru_RU", "uk_UA", "en_IN", "hi_IN", "ja_JP", "zh_CN", "ko_KR", "tr_TR", "hu_HU"};
  static const double values[] = {1234567.25, -98765.43, 12345678901.5, 1000, 999, 0.75, 100000};
  int checked = 0;
  for (size_t l = 0; l < G_N_ELEMENTS(locales); l++) {
    glibc_numeric ln = {0};
    if (!read_glibc_numeric(dir, locales[l], &ln, 0))
      continue;
    /* every locale in the list has "." or "," as decimal_point in glibc 2.36 */
    assert_true(strcmp(ln.decimal, ".") == 0 || strcmp(ln.decimal, ",") == 0);
    pp_decimal_mark hint = ln.decimal[0] == ',' ? COMMA : POINT;
    for (size_t i = 0; i < G_N_ELEMENTS(values); i++)
      for (int d = 0; d <= 2; d += 2) {
        double want = d ? values[i] : round(values[i]);
        char *s = glibc_format(&ln, want, d);
        pp_number n = check_value_at(s, hint, want, __LINE__);
        if (n.decimals != d)
          print_error("%s: \"%s\" decimals %d\n", locales[l], s, n.decimals);
        assert_int_equal(n.decimals, d);
        g_free(s);
        checked++;
      }
  }
  if (checked == 0)
    skip();
}

/* ---- live CLDR via ICU: whatever the installed CLDR prints must read back. */
#ifdef PP_TEST_HAVE_ICU
#include <unicode/unum.h>
#include <unicode/unumberformatter.h>
#include <unicode/ustring.h>

/* The hint comes from CLDR too: the locale's decimal or monetary decimal symbol (they differ,
 * e.g. fr_CH uses "," for numbers and "." for amounts). */
static pp_decimal_mark icu_decimal_hint(const char *locale, gboolean monetary) {
  UErrorCode st = U_ZERO_ERROR;
  UChar sym[8];
  UNumberFormat *f = unum_open(UNUM_DECIMAL, NULL, 0, locale, NULL, &st);
  int32_t n = unum_getSymbol(
      f, monetary ? UNUM_MONETARY_SEPARATOR_SYMBOL : UNUM_DECIMAL_SEPARATOR_SYMBOL, sym, 8, &st);
  unum_close(f);
  assert_true(U_SUCCESS(st) && n == 1 && (sym[0] == '.' || sym[0] == ','));
  return sym[0] == ',' ? COMMA : POINT;
}

static char *icu_format(const char *skeleton, const char *locale, double v) {
  UErrorCode st = U_ZERO_ERROR;
  UChar skel[64], buf[128];
  u_uastrcpy(skel, skeleton);
  UNumberFormatter *f = unumf_openForSkeletonAndLocale(skel, -1, locale, &st);
  UFormattedNumber *r = unumf_openResult(&st);
  unumf_formatDouble(f, v, r, &st);
  int32_t n = unumf_resultToString(r, buf, G_N_ELEMENTS(buf), &st);
  char *out = U_SUCCESS(st) ? g_utf16_to_utf8((const gunichar2 *)buf, n, NULL, NULL, NULL) : NULL;
  unumf_closeResult(r);
  unumf_close(f);
  return out;
}

typedef struct {
  const char *locale;
  gboolean compact; /* compact forms this module reads (see number.c for the ones it cannot) */
} icu_locale;

static const icu_locale icu_locales[] = {
    {"en", TRUE},     {"de", TRUE},     {"fr", TRUE},  {"de_CH", TRUE},
    {"en_IN", FALSE}, {"it", FALSE},    {"es", FALSE}, {"nl", FALSE},
    {"sv", FALSE},    {"pl", FALSE},    {"ja", FALSE}, {"pt_BR", FALSE},
    {"en_GB", TRUE},  {"fr_CH", FALSE}, {"ru", FALSE}, {"tr", FALSE}};

typedef struct {
  const char *skeleton;
  gboolean percent, currency, compact;
  double values[8];
} icu_case;

static const icu_case icu_cases[] = {
    {"precision-integer", FALSE, FALSE, FALSE, {1234567, -1234, 45, 12500, 1200000000, 0}},
    {".00", FALSE, FALSE, FALSE, {1234567.5, -1234.5, 0.25, -0.75, 98765.43, 100000}},
    {"precision-increment/0.1", FALSE, FALSE, FALSE, {1234567.5, -1234.5, 45, 0.5}},
    {"currency/EUR .00", FALSE, TRUE, FALSE, {1234567.5, -1234.5, 45, 0.25}},
    {"currency/USD .00", FALSE, TRUE, FALSE, {1234567.5, -1234.5, 45, 0.25}},
    {"currency/CHF .00", FALSE, TRUE, FALSE, {1234567.5, -1234.5, 45, 0.25}},
    {"percent", TRUE, FALSE, FALSE, {45, -12.5, 1234.5, 0.5}},
    {"scientific", FALSE, FALSE, FALSE, {123456, -1234.5, 45, 0.00125, 1200000000}},
    {"compact-short", FALSE, FALSE, TRUE, {1200000, 1200000000, -1500000, 45, 25000}},
    {"compact-long", FALSE, FALSE, TRUE, {1200000, 1200000000, -1500000, 45, 25000}},
    {"currency/USD compact-short", FALSE, TRUE, TRUE, {1200000, 1200000000, 25000}},
};

static void test_icu_cldr_live(void **state) {
  (void)state;
  int checked = 0;
  for (size_t l = 0; l < G_N_ELEMENTS(icu_locales); l++)
    for (size_t c = 0; c < G_N_ELEMENTS(icu_cases); c++) {
      const icu_case *k = &icu_cases[c];
      if (k->compact && !icu_locales[l].compact)
        continue;
      for (size_t i = 0; i < G_N_ELEMENTS(k->values); i++) {
        double v = k->values[i];
        if (v == 0 && i > 0)
          break;
        char *s = icu_format(k->skeleton, icu_locales[l].locale, v);
        assert_non_null(s);
        pp_number n;
        pp_decimal_mark hint = icu_decimal_hint(icu_locales[l].locale, k->currency);
        gboolean ok = pp_number_parse(s, hint, &n);
        if (!ok || !close_to(n.value, v) || n.percent != k->percent ||
            (n.currency[0] != '\0') != k->currency)
          print_error("ICU %s \"%s\" %.17g: \"%s\" -> ok %d value %.17g pct %d cur \"%s\"\n",
                      icu_locales[l].locale, k->skeleton, v, s, ok, n.value, n.percent, n.currency);
        assert_true(ok);
        assert_true(close_to(n.value, v));
        assert_int_equal(n.percent, k->percent);
        assert_int_equal(n.currency[0] != '\0', k->currency);
        g_free(s);
        checked++;
      }
    }
  assert_true(checked > 100);
}

/* Axis tick series printed by CLDR must be read with the right convention without a hint. */
static void test_icu_cldr_series(void **state) {
  (void)state;
  static const struct {
    const char *skeleton;
    double start, step;
  } series[] = {{"precision-integer", 0, 500},
                {"precision-integer", 0, 250000},
                {".0", 0, 0.5},
                {".00", 1, 0.25},
                {"precision-integer", 1000, 1000}};
  for (size_t l = 0; l < G_N_ELEMENTS(icu_locales); l++)
    for (size_t k = 0; k < G_N_ELEMENTS(series); k++) {
      char *labels[7];
      pp_number out[7];
      gboolean ok[7];
      for (int i = 0; i < 7; i++)
        labels[i] = icu_format(series[k].skeleton, icu_locales[l].locale,
                               series[k].start + i * series[k].step);
      size_t got = pp_number_parse_series((const char *const *)labels, 7, out, ok);
      for (int i = 0; i < 7; i++) {
        double want = series[k].start + i * series[k].step;
        if (!ok[i] || !close_to(out[i].value, want))
          print_error("ICU %s series %zu label \"%s\": ok %d value %.17g want %.17g\n",
                      icu_locales[l].locale, k, labels[i], ok[i], out[i].value, want);
        assert_true(ok[i]);
        assert_true(close_to(out[i].value, want));
        g_free(labels[i]);
      }
      assert_int_equal(got, 7);
    }
}
#endif

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_glibc_localedata),
#ifdef PP_TEST_HAVE_ICU
      cmocka_unit_test(test_icu_cldr_live),
      cmocka_unit_test(test_icu_cldr_series),
#endif
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
