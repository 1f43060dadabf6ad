/* test_number_series.c — checks the reading of one axis' labels under one shared decimal
 * convention (pp_number_pick_series, src/recognize/number_series.c). Expected values are worked
 * out by hand from the scoring rule documented there; the pick is also compared, on many generated
 * label sets, with the joint parse the module had before reading and picking were split. */
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

/* ---- the pick: scores by hand from number_series.c (16 a label read, then 8 evenly spaced,
 * 4 monotonic, 2 equal decimals, 1 unless every decimal part ends in '0'). */

static const pp_number_reading **read_all(const char *const *labels, size_t n,
                                          pp_number_reading *store) {
  const pp_number_reading **r = g_new(const pp_number_reading *, n);
  for (size_t i = 0; i < n; i++) {
    pp_number_read(labels[i], &store[i]);
    r[i] = &store[i];
  }
  return r;
}

static void test_pick_by_hand(void **state) {
  (void)state;
  pp_number_reading store[4];
  pp_number out[4];
  gboolean ok[4];

  /* point 1234, 5678: 2·16 + 2 + 1 = 35; comma 1.234, 5.678: 2·16 + 2 + 1 = 35. A tie: the point
   * reading, every label that reads differently flagged. */
  const char *tie[] = {"1,234", "5,678"};
  const pp_number_reading **r = read_all(tie, 2, store);
  assert_int_equal(pp_number_pick_series(r, 2, out, ok), 2);
  assert_true(ok[0] && ok[1] && out[0].value == 1234 && out[1].value == 5678);
  assert_true(out[0].ambiguous && out[1].ambiguous);
  g_free(r);

  /* point 1, 1.5, 2: 48 + 8 + 4 + 2 = 62 (all decimals end in 0); comma 1000, 1500, 2000:
   * 48 + 8 + 4 + 2 + 1 = 63. Comma, not flagged. */
  const char *pad[] = {"1.000", "1.500", "2.000"};
  r = read_all(pad, 3, store);
  assert_int_equal(pp_number_pick_series(r, 3, out, ok), 3);
  assert_true(out[0].value == 1000 && out[1].value == 1500 && out[2].value == 2000);
  assert_true(!out[0].ambiguous && !out[1].ambiguous && !out[2].ambiguous);
  g_free(r);

  /* point 1250, 1500, 1750: 48 + 15 = 63; comma 1.25, 1.5, 1.75 written "1,250"...: decimals all
   * end in 0, 48 + 14 = 62. Point. */
  const char *thousands[] = {"1,250", "1,500", "1,750"};
  r = read_all(thousands, 3, store);
  assert_int_equal(pp_number_pick_series(r, 3, out, NULL), 3);
  assert_true(out[0].value == 1250 && out[2].value == 1750 && !out[1].ambiguous);
  g_free(r);

  /* one label each: point reads "1.5" (16 + 1), comma reads "2,5" (16 + 1). A tie, point; "2,5"
   * fails under it, and "1.5" is not flagged since the comma convention cannot read it. */
  const char *split[] = {"1.5", "2,5"};
  r = read_all(split, 2, store);
  assert_int_equal(pp_number_pick_series(r, 2, out, ok), 1);
  assert_true(ok[0] && !ok[1] && out[0].value == 1.5 && !out[0].ambiguous);
  g_free(r);

  /* majority: comma reads all three, point only "1,500" */
  const char *majority[] = {"1,25", "1,500", "1,75", "2"};
  r = read_all(majority, 4, store);
  assert_int_equal(pp_number_pick_series(r, 4, out, ok), 4);
  assert_true(out[0].value == 1.25 && out[1].value == 1.5 && out[2].value == 1.75);
  assert_true(out[3].value == 2 && out[1].decimal_mark == COMMA);
  g_free(r);

  assert_int_equal(pp_number_pick_series(NULL, 0, NULL, NULL), 0);
}

/* ---- the joint parse as number.c had it before reading and picking were split (parse every
 * label under each convention, score, choose), kept here as the reference the split must match
 * bit for bit: its parses are pp_number_parse with a definite hint, its scoring the former code
 * unchanged. */

static int joint_pattern_score(const pp_number *v, const gboolean *ok, const gboolean *zero,
                               size_t n) {
  double prev = 0;
  size_t m = 0;
  gboolean same_dec = TRUE, any_dec = FALSE, all_zero = TRUE, mono_up = TRUE, mono_down = TRUE;
  gboolean linear = TRUE, geometric = TRUE;
  double first_diff = 0, first_ratio = 0, scale = 0;
  int dec0 = -1;
  for (size_t i = 0; i < n; i++)
    if (ok[i])
      scale = MAX(scale, fabs(v[i].value));
  double tol = 1e-9 * scale + 1e-300;
  for (size_t i = 0; i < n; i++) {
    if (!ok[i])
      continue;
    double x = v[i].value;
    if (dec0 < 0)
      dec0 = v[i].decimals;
    same_dec = same_dec && v[i].decimals == dec0;
    if (v[i].decimals > 0) {
      any_dec = TRUE;
      all_zero = all_zero && zero[i];
    }
    if (m > 0) {
      double d = x - prev;
      mono_up = mono_up && d > 0;
      mono_down = mono_down && d < 0;
      if (m == 1)
        first_diff = d;
      linear = linear && fabs(d - first_diff) <= tol;
      if (prev != 0 && x / prev > 0) {
        double r = x / prev;
        if (m == 1)
          first_ratio = r;
        geometric = geometric && fabs(r - first_ratio) <= 1e-9 * fabs(first_ratio);
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

static size_t joint_parse_series(const char *const *labels, size_t n, pp_number *out,
                                 gboolean *ok) {
  static const pp_decimal_mark conv[2] = {PP_DECIMAL_POINT, PP_DECIMAL_COMMA};
  pp_number cand[2][16];
  gboolean cok[2][16], czero[2][16];
  size_t count[2] = {0, 0};
  int score[2];
  assert_true(n <= 16);
  if (n == 0)
    return 0;
  for (int c = 0; c < 2; c++) {
    for (size_t i = 0; i < n; i++) {
      cok[c][i] = pp_number_parse(labels[i], conv[c], &cand[c][i]);
      czero[c][i] = cok[c][i] && last_dec_zero_of_text(labels[i], &cand[c][i]);
      count[c] += cok[c][i] ? 1 : 0;
    }
    score[c] = (int)MIN(count[c], (size_t)1 << 20) * 16 +
               joint_pattern_score(cand[c], cok[c], czero[c], n);
  }
  int pick = score[1] > score[0] ? 1 : 0;
  gboolean tie = score[0] == score[1];
  for (size_t i = 0; i < n; i++) {
    out[i] = cand[pick][i];
    out[i].ambiguous = tie && cok[0][i] && cok[1][i] && cand[0][i].value != cand[1][i].value;
    ok[i] = cok[pick][i];
  }
  return count[pick];
}

/* A tick label for v with d decimals, written with the decimal mark dec and the grouping mark
 * grp ("" for none), every three digits or (indian) three then twos. */
static char *format_tick(double v, int d, const char *dec, const char *grp, gboolean indian) {
  char digits[64];
  g_snprintf(digits, sizeof digits, "%.*f", d, fabs(v));
  char *dot = strchr(digits, '.');
  size_t nint = dot ? (size_t)(dot - digits) : strlen(digits);
  GString *s = g_string_new(v < 0 ? "-" : "");
  for (size_t i = 0; i < nint; i++) {
    size_t left = nint - i; /* digits from here to the decimal mark */
    gboolean cut = left > 3 ? (indian ? (left - 3) % 2 == 0 : left % 3 == 0) : left == 3;
    if (i > 0 && cut && nint > 3)
      g_string_append(s, grp);
    g_string_append_c(s, digits[i]);
  }
  if (dot) {
    g_string_append(s, dec);
    g_string_append(s, dot + 1);
  }
  return g_string_free(s, FALSE);
}

/* Label sets of every kind an axis or a stray row of numbers gives: regular series in either
 * convention, grouped or not, with units, reversed, on log steps, with a label spoilt or replaced
 * by a word, thousands with one mark that either convention reads, and the same string twice. */
static int fill_label_set(GRand *rng, char **labels) {
  static const char *const grps[] = {"", ",", ".", " ", "\u202f", "'", "\u2019"};
  static const char *const junk[] = {"Jan",  "2019-03", "",      "1.2.3",   "n/a",
                                     "10^3", "1e3",     "(5)",   "\u22125", "45%",
                                     "2,0",  "0,5",     "1.000", "1,500",   "2019"};
  static const char *const pre[] = {"", "", "", "$", "\u20ac", "(", "-"};
  static const char *const post[] = {"", "", "", "%", "k", " Mio.", " bn", ")"};
  int n = g_rand_int_range(rng, 1, 9);
  gboolean comma = g_rand_boolean(rng), indian = g_rand_int_range(rng, 0, 6) == 0;
  const char *grp = grps[g_rand_int_range(rng, 0, G_N_ELEMENTS(grps))];
  int d = g_rand_int_range(rng, 0, 4), kind = g_rand_int_range(rng, 0, 5);
  double step = (double)g_rand_int_range(rng, 1, 6) * pow(10, g_rand_int_range(rng, -2, 7));
  double start = g_rand_int_range(rng, -3, 4) * step;
  size_t p = g_rand_int_range(rng, 0, G_N_ELEMENTS(pre));
  size_t q = g_rand_int_range(rng, 0, G_N_ELEMENTS(post));
  for (int i = 0; i < n; i++) {
    double v = kind == 3 ? pow(10, i + g_rand_int_range(rng, 0, 2)) : start + i * step;
    if (kind == 2)
      v = start + (n - 1 - i) * step;
    if (kind == 4) { /* "1,234" or "1.234": either convention reads it, often undecided */
      v = g_rand_int_range(rng, 1001, 1000000);
      d = 0;
      grp = g_rand_boolean(rng) ? "," : ".";
    }
    char *t = format_tick(v, d, comma ? "," : ".", grp, indian);
    if (kind == 1 && g_rand_int_range(rng, 0, 3) == 0) {
      g_free(t);
      t = g_strdup(junk[g_rand_int_range(rng, 0, G_N_ELEMENTS(junk))]);
    }
    labels[i] = g_strconcat(pre[p], t, post[q], NULL);
    g_free(t);
  }
  if (n >= 2 && g_rand_int_range(rng, 0, 8) == 0) {
    g_free(labels[n - 1]);
    labels[n - 1] = g_strdup(labels[0]);
  }
  return n;
}

static gboolean compare_with_joint(const char *const *labels, size_t n) {
  pp_number want[16], got[16], via_series[16];
  gboolean want_ok[16], got_ok[16], series_ok[16];
  pp_number_reading store[16];
  size_t want_count = joint_parse_series(labels, n, want, want_ok);
  const pp_number_reading **r = read_all(labels, n, store);
  size_t got_count = pp_number_pick_series(r, n, got, got_ok);
  size_t series_count = pp_number_parse_series(labels, n, via_series, series_ok);
  g_free(r);
  gboolean same = got_count == want_count && series_count == want_count;
  for (size_t i = 0; i < n; i++) {
    gboolean here = got_ok[i] == want_ok[i] && series_ok[i] == want_ok[i] &&
                    same_number(&got[i], &want[i]) && same_number(&via_series[i], &want[i]);
    if (!here) {
      print_error("label %zu \"%s\" of %zu: ok %d, joint parse ok %d\n", i, labels[i], n, got_ok[i],
                  want_ok[i]);
      print_number("pick", &got[i]);
      print_number("joint", &want[i]);
    }
    same = same && here;
  }
  return same;
}

static void test_pick_matches_joint_parse(void **state) {
  (void)state;
  /* the hand-worked sets and the module's own examples first */
  static const char *const sets[][5] = {{"1,5", "2,0", "2,5"},
                                        {"1,000", "2,000", "3,000"},
                                        {"0", "500", "1.000", "1.500"},
                                        {"1.000", "1.500", "2.000"},
                                        {"0", "0.5", "1.0", "1.5"},
                                        {"1", "10", "100", "1,000"},
                                        {"10", "Jan", "30"},
                                        {"1,234", "5,678"},
                                        {"1,25", "1,500", "1,75"},
                                        {"1,250", "1,500", "1,750"},
                                        {"1.5", "2,5"},
                                        {"2019", "2020", "2021"},
                                        {"0,1", "0,2", "0,3", "0,4"},
                                        {"1.2", "1.2", "1.2"},
                                        {"-1,5", "0", "1,5"}};
  for (size_t k = 0; k < G_N_ELEMENTS(sets); k++) {
    size_t n = 0;
    while (n < 5 && sets[k][n])
      n++;
    if (!compare_with_joint(sets[k], n)) {
      print_error("fixed set %zu differs\n", k);
      fail();
    }
  }
  /* then generated sets, with a fixed seed so that a failure repeats */
  GRand *rng = g_rand_new_with_seed(20311);
  int differing = 0, ambiguous = 0, comma_picked = 0;
  for (int t = 0; t < 20000; t++) {
    char *labels[16];
    int n = fill_label_set(rng, labels);
    if (!compare_with_joint((const char *const *)labels, (size_t)n))
      differing++;
    pp_number out[16];
    gboolean ok[16];
    pp_number_parse_series((const char *const *)labels, (size_t)n, out, ok);
    ambiguous += out[0].ambiguous;
    comma_picked += ok[0] && out[0].decimal_mark == COMMA;
    for (int i = 0; i < n; i++)
      g_free(labels[i]);
  }
  g_rand_free(rng);
  assert_int_equal(differing, 0);
  /* the generated sets reach both conventions and the undecided case */
  print_message("generated sets: %d undecided, %d read with the comma convention\n", ambiguous,
                comma_picked);
  assert_true(ambiguous > 100 && comma_picked > 100);
}

/* ---- whole series with hand-made expectations */

static void assert_series(const char *const *labels, size_t n, const double *want, int line) {
  pp_number out[16];
  gboolean ok[16];
  size_t got = pp_number_parse_series(labels, n, out, ok);
  for (size_t i = 0; i < n; i++)
    if (!ok[i] || !close_to(out[i].value, want[i])) {
      print_error("line %d: series label \"%s\" ok %d value %.17g want %.17g\n", line, labels[i],
                  ok[i], out[i].value, want[i]);
      fail();
    }
  assert_int_equal(got, n);
}

static void test_series(void **state) {
  (void)state;
  /* the brief's two examples */
  const char *comma_dec[] = {"1,5", "2,0", "2,5"};
  assert_series(comma_dec, 3, (double[]){1.5, 2.0, 2.5}, __LINE__);
  const char *comma_grp[] = {"1,000", "2,000", "3,000"};
  assert_series(comma_grp, 3, (double[]){1000, 2000, 3000}, __LINE__);
  /* de axis: the unambiguous "500" and the even spacing decide grouping dots */
  const char *de_ticks[] = {"0", "500", "1.000", "1.500", "2.000"};
  assert_series(de_ticks, 5, (double[]){0, 500, 1000, 1500, 2000}, __LINE__);
  /* same strings, no small tick: a formatter never pads 1.5 to "1.500", so grouping wins */
  const char *de_ticks2[] = {"1.000", "1.500", "2.000"};
  assert_series(de_ticks2, 3, (double[]){1000, 1500, 2000}, __LINE__);
  /* en axis with a decimal tick */
  const char *en_ticks[] = {"0", "0.5", "1.0", "1.5"};
  assert_series(en_ticks, 4, (double[]){0, 0.5, 1, 1.5}, __LINE__);
  /* log axis */
  const char *log_ticks[] = {"1", "10", "100", "1,000", "10,000"};
  assert_series(log_ticks, 5, (double[]){1, 10, 100, 1000, 10000}, __LINE__);
  /* fr axis with U+202F grouping and a decimal comma */
  const char *fr_ticks[] = {"0", "2\u202f500,5", "5\u202f001"};
  assert_series(fr_ticks, 3, (double[]){0, 2500.5, 5001}, __LINE__);

  /* one label that fits no convention: others still parse, ok[] tells which */
  const char *mixed[] = {"10", "Jan", "30"};
  pp_number out[3];
  gboolean ok[3];
  assert_int_equal(pp_number_parse_series(mixed, 3, out, ok), 2);
  assert_true(ok[0] && !ok[1] && ok[2]);
  assert_true(close_to(out[2].value, 30));

  /* no evidence either way: point convention, labels flagged ambiguous */
  const char *undecided[] = {"1,234", "5,678"};
  assert_int_equal(pp_number_parse_series(undecided, 2, out, ok), 2);
  assert_true(close_to(out[0].value, 1234) && out[0].ambiguous);

  /* evidence decides: flag cleared */
  assert_int_equal(pp_number_parse_series(comma_grp, 3, out, NULL), 3);
  assert_false(out[0].ambiguous);

  /* majority: two labels only readable with decimal comma outvote one grouped-looking label */
  const char *majority[] = {"1,25", "1,500", "1,75"};
  assert_int_equal(pp_number_parse_series(majority, 3, out, ok), 3);
  assert_true(close_to(out[1].value, 1.5));

  assert_int_equal(pp_number_parse_series(NULL, 0, NULL, NULL), 0);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_pick_by_hand),
      cmocka_unit_test(test_pick_matches_joint_parse),
      cmocka_unit_test(test_series),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
