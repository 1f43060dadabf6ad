/* test_json_out.c — the report's own JSON text against outside references: the double
 * formatter against glibc's printf "%.17g" (what g_ascii_dtostr() calls, GLib gstrfuncs.c;
 * this program never calls setlocale, so printf runs in the C locale), and the text writer
 * (pp_json_out) against json-glib's generator on the tree JsonBuilder makes of the same calls. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <string.h>

#include <cmocka.h>

#include "report/json_util.h"

/* Values per kind below; PP_TEST_DOUBLES=N multiplies them for a longer run. */
#define RANDOM_DOUBLES 1000000

static guint64 scale_runs(void) {
  const char *s = g_getenv("PP_TEST_DOUBLES");
  guint64 k = s ? g_ascii_strtoull(s, NULL, 10) : 1;
  return k ? k : 1;
}

static guint64 checked;

static void check(double v) {
  char mine[G_ASCII_DTOSTR_BUF_SIZE], want[64];
  pp_json_format_double(v, mine);
  snprintf(want, sizeof want, "%.17g", v);
  if (strcmp(mine, want) != 0)
    fail_msg("%a: \"%s\", printf \"%s\"", v, mine, want);
  checked++;
}

static double from_bits(guint64 b) {
  double v;
  memcpy(&v, &b, sizeof v);
  return v;
}

static guint64 rand64(GRand *r) {
  return (guint64)g_rand_int(r) << 32 | g_rand_int(r);
}

/* Every bit pattern (NaN and infinities too), and those of the magnitudes the exact way takes
 * (exponents 2^-55 to 2^56, a little beyond its bounds on both sides). */
static void test_random_bits(void **state) {
  (void)state;
  GRand *r = g_rand_new_with_seed(2026);
  guint64 n = RANDOM_DOUBLES * scale_runs();
  for (guint64 i = 0; i < n; i++) {
    guint64 b = rand64(r);
    check(from_bits(b));
    guint64 exp = (guint64)(1023 + g_rand_int_range(r, -55, 57));
    check(from_bits((b & 0x800fffffffffffffull) | exp << 52));
  }
  g_rand_free(r);
}

/* Decimal-looking values, as labels and their ratios are: k / 10^j and k * 0.1 (not exact in
 * binary), plus multiples of 2^-k (exact in few digits). */
static void test_decimal_looking(void **state) {
  (void)state;
  GRand *r = g_rand_new_with_seed(17);
  guint64 n = RANDOM_DOUBLES / 4 * scale_runs();
  for (guint64 i = 0; i < n; i++) {
    gint64 k = (gint64)(i % 200000) + 1;
    check(k * 0.1);
    check((double)g_rand_int_range(r, 1, 1000000) / pow(10, g_rand_int_range(r, 0, 22)));
    check((double)g_rand_int_range(r, -1000000, 1000000) / (1 << g_rand_int_range(r, 0, 31)));
    check(-(double)k / 3);
  }
  g_rand_free(r);
}

/* Exact ties at the 17th digit: m * 2^-k with m odd is m * 5^k / 10^k, whose last digit is 5;
 * when m * 5^k has 18 digits, %.17g must round half to even. And their neighbours. */
static void test_halfway(void **state) {
  (void)state;
  GRand *r = g_rand_new_with_seed(5);
  guint64 n = RANDOM_DOUBLES / 8 * scale_runs(), ties = 0;
  for (guint64 i = 0; i < n; i++) {
    int k = g_rand_int_range(r, 2, 26);
    double p5 = pow(5, k);
    /* m * 5^k in [10^17, 10^18): m in [10^17 / 5^k, 10^18 / 5^k), below 2^53 */
    double lo = ceil(1e17 / p5), hi = MIN(floor(1e18 / p5), 9007199254740991.0);
    if (lo > hi)
      continue;
    guint64 m = (guint64)(lo + floor(g_rand_double(r) * (hi - lo))) | 1;
    double v = ldexp((double)m, -k);
    check(v);
    check(nextafter(v, 0));
    check(nextafter(v, INFINITY));
    check(-v);
    ties++;
  }
  assert_true(ties > n / 2); /* the cases were really made */
  g_rand_free(r);
}

/* Powers of ten and their neighbours, where the exponent estimate and the carry into a new
 * digit (9.99...95 rounding up) decide; the bounds of the exact way and of %g's notations. */
static void test_powers_of_ten(void **state) {
  (void)state;
  for (int p = -20; p <= 20; p++) {
    double v = pow(10, p), lo = v, hi = v;
    check(v);
    for (int i = 0; i < 64; i++) {
      lo = nextafter(lo, 0);
      hi = nextafter(hi, INFINITY);
      check(lo);
      check(hi);
      check(-lo);
    }
  }
  double edges[] = {0.0,
                    -0.0,
                    1e-15,
                    1e16,
                    9.9999999999999995e-5,
                    0.0001,
                    0.99999999999999994,
                    0.5,
                    5e-324,
                    2.2250738585072014e-308,
                    1.7976931348623157e308};
  for (size_t i = 0; i < G_N_ELEMENTS(edges); i++)
    check(edges[i]);
}

/* The writer: random members and values written through JsonBuilder (then json-glib's
 * generator) and through pp_json_out, call for call. Names are distinct in each object. */
static void random_value(GRand *r, JsonBuilder *b, pp_json_out *o, int depth);

static void random_text(GRand *r, char *s, int max) {
  int len = g_rand_int_range(r, 0, max);
  for (int i = 0; i < len; i++)
    s[i] = (char)g_rand_int_range(r, 1, 256); /* invalid UTF-8 too: both make it valid */
  s[len] = '\0';
}

static double random_number(GRand *r) {
  double pick[] = {NAN,
                   INFINITY,
                   -INFINITY,
                   -0.0,
                   3.0,
                   -9.3e18,
                   9.1e18,
                   1e20,
                   2e-7,
                   g_rand_double_range(r, -1e6, 1e6),
                   g_rand_double_range(r, -1, 1) * pow(10, g_rand_int_range(r, -20, 20)),
                   (double)g_rand_int_range(r, -100000, 100000) / 1024};
  return pick[g_rand_int_range(r, 0, G_N_ELEMENTS(pick))];
}

static void random_container(GRand *r, JsonBuilder *b, pp_json_out *o, int depth) {
  gboolean object = g_rand_boolean(r);
  if (object) {
    json_builder_begin_object(b);
    pp_json_out_begin_object(o);
  } else {
    json_builder_begin_array(b);
    pp_json_out_begin_array(o);
  }
  for (int i = g_rand_int_range(r, 0, 5); i > 0; i--) {
    if (!object) {
      random_value(r, b, o, depth + 1);
      continue;
    }
    char name[16], text[16];
    random_text(r, name, 6);
    if (!g_utf8_validate(name, -1, NULL))
      name[0] = '\0'; /* names are the caller's own words, always UTF-8 */
    g_snprintf(name + strlen(name), 4, "%d", i);
    double v = random_number(r);
    if (!isfinite(v) || fabs(v) > 9e18)
      v = 7;
    pp_rect box = {random_number(r), random_number(r), random_number(r), random_number(r)};
    if (g_rand_boolean(r)) /* mostly usable boxes */
      box = (pp_rect){v, -v / 3, v + 1e3, 1e4};
    switch (g_rand_int_range(r, 0, 6)) {
    case 0:
      random_text(r, text, 12);
      if (g_rand_int_range(r, 0, 4) == 0) {
        pp_json_member_string(b, name, NULL);
        pp_json_out_member_text(o, name, NULL);
      } else {
        pp_json_member_string(b, name, text);
        pp_json_out_member_text(o, name, text);
      }
      break;
    case 1:
      pp_json_member_number(b, name, v);
      pp_json_out_member_number(o, name, v);
      break;
    case 2:
      pp_json_member_int(b, name, (gint64)v);
      pp_json_out_member_int(o, name, (gint64)v);
      break;
    case 3:
      pp_json_member_rect(b, name, box);
      pp_json_out_member_rect(o, name, box);
      break;
    case 4:
      pp_json_member_bool(b, name, v > 0);
      pp_json_out_member_bool(o, name, v > 0);
      break;
    default:
      json_builder_set_member_name(b, name);
      pp_json_out_name(o, name);
      random_value(r, b, o, depth + 1);
    }
  }
  if (object) {
    json_builder_end_object(b);
    pp_json_out_end_object(o);
  } else {
    json_builder_end_array(b);
    pp_json_out_end_array(o);
  }
}

static void random_value(GRand *r, JsonBuilder *b, pp_json_out *o, int depth) {
  int kind = g_rand_int_range(r, 0, depth < 4 ? 8 : 6);
  double v = random_number(r);
  char text[16];
  if (kind == 0) {
    pp_json_add_number(b, v);
    pp_json_out_number(o, v);
  } else if (kind == 1) {
    random_text(r, text, 12);
    char *valid = g_utf8_make_valid(text, -1);
    json_builder_add_string_value(b, valid);
    pp_json_out_string(o, valid);
    g_free(valid);
  } else if (kind == 2) {
    json_builder_add_null_value(b);
    pp_json_out_null(o);
  } else if (kind == 3) {
    gint64 i = (gint64)rand64(r) >> g_rand_int_range(r, 0, 63);
    json_builder_add_int_value(b, i);
    pp_json_out_int(o, i);
  } else if (kind == 4) {
    json_builder_add_boolean_value(b, v > 0);
    pp_json_out_bool(o, v > 0);
  } else if (kind == 5 && isfinite(v)) {
    double w = pp_json_writable_double(v);
    json_builder_add_double_value(b, w);
    pp_json_out_double(o, w);
  } else {
    random_container(r, b, o, depth);
  }
}

static void test_writer_like_json_glib(void **state) {
  (void)state;
  GRand *r = g_rand_new_with_seed(99);
  for (int i = 0; i < 20000; i++) {
    g_autoptr(JsonBuilder) b = json_builder_new();
    pp_json_out o = {g_string_new(NULL), FALSE};
    random_container(r, b, &o, 0);
    JsonNode *root = json_builder_get_root(b);
    char *want = json_to_string(root, FALSE);
    assert_string_equal(o.text->str, want);
    g_free(want);
    json_node_unref(root);
    g_string_free(o.text, TRUE);
  }
  g_rand_free(r);
}

/* A list continued: with more = TRUE the first value follows a ','. */
static void test_writer_continues_list(void **state) {
  (void)state;
  GString *t = g_string_new(NULL);
  pp_json_out first = {t, FALSE};
  pp_json_out_int(&first, 1);
  pp_json_out next = {t, TRUE};
  pp_json_out_begin_object(&next);
  pp_json_out_member_number(&next, "a", 0.5);
  pp_json_out_end_object(&next);
  assert_string_equal(t->str, "1,{\"a\":0.5}");
  g_string_free(t, TRUE);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_random_bits),
      cmocka_unit_test(test_decimal_looking),
      cmocka_unit_test(test_halfway),
      cmocka_unit_test(test_powers_of_ten),
      cmocka_unit_test(test_writer_like_json_glib),
      cmocka_unit_test(test_writer_continues_list),
  };
  int failed = cmocka_run_group_tests(tests, NULL, NULL);
  printf("%" G_GUINT64_FORMAT " doubles compared with printf\n", checked);
  return failed;
}
