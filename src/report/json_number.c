/* json_number.c — the text g_ascii_dtostr() gives a double (printf's "%.17g" in the C locale,
 * GLib's gstrfuncs.c), worked out exactly in integers instead of through printf: json-glib
 * writes every double this way, and each page's findings hold hundreds of them. */
#include <math.h>
#include <string.h>

#include "json_util.h"

/* %.17g prints 17 significant digits, in exponent form when the decimal exponent X of the
 * rounded value is below -4 or at least the precision (C17 §7.21.6.1 "g"). */
#define PP_JSON_G_DIGITS 17
#define PP_JSON_G_MIN_EXP (-4)
/* The exact way scales |v| = M * 2^E (M < 2^53) by 10^p = 5^p * 2^p with p = 16 - X, so that
 * M * 5^p must stay below 2^128: p <= 32 (5^32 < 2^75), i.e. X >= -16; and it needs p >= 1,
 * X <= 15. Values outside [1e-15, 1e16) (never coordinates or ratios) go to printf. */
#define PP_JSON_EXACT_LOW 1e-15
#define PP_JSON_EXACT_HIGH 1e16
/* 5^27 is the largest power of five below 2^64. */
#define PP_JSON_POW5_U64 27
/* floor(log10(2) * 2^18), so that (e * 78913) >> 18 is floor(e * log10 2): the integer form
 * shortest-digit printers use (from memory: Ryu's log10Pow2); here |e| <= 54 only, and a
 * wrong estimate would only send the value to printf (the check after rounding). */
#define PP_JSON_LOG10_2_Q18 78913

#ifdef __SIZEOF_INT128__
typedef unsigned __int128 u128;

// clang-format off
static const guint64 pow5[PP_JSON_POW5_U64 + 1] = {
    1ull, 5ull, 25ull, 125ull, 625ull, 3125ull, 15625ull, 78125ull, 390625ull, 1953125ull,
    9765625ull, 48828125ull, 244140625ull, 1220703125ull, 6103515625ull, 30517578125ull,
    152587890625ull, 762939453125ull, 3814697265625ull, 19073486328125ull, 95367431640625ull,
    476837158203125ull, 2384185791015625ull, 11920928955078125ull, 59604644775390625ull,
    298023223876953125ull, 1490116119384765625ull, 7450580596923828125ull};
// clang-format on

/* floor(a * 10^p) for a = m * 2^e, and whether the part dropped is above, at or below one
 * half (+1, 0, -1; -2 when nothing was dropped). */
static guint64 scaled(guint64 m, int e, int p, int *half) {
  u128 n = (u128)m * pow5[MIN(p, PP_JSON_POW5_U64)];
  if (p > PP_JSON_POW5_U64)
    n *= pow5[p - PP_JSON_POW5_U64];
  int s = -(e + p);
  if (s <= 0) {
    *half = -2;
    return (guint64)(n << -s);
  }
  u128 r = n & (((u128)1 << s) - 1), h = (u128)1 << (s - 1);
  *half = r > h ? 1 : r == h ? 0 : r ? -1 : -2;
  return (guint64)(n >> s);
}

static gboolean exact_text(double v, char *buf) {
  double a = fabs(v);
  if (!(a >= PP_JSON_EXACT_LOW && a < PP_JSON_EXACT_HIGH))
    return FALSE;
  /* IEEE 754 binary64 (C17 Annex F): a normal a is (2^52 + fraction) * 2^(exponent - 1075). */
  guint64 bits;
  memcpy(&bits, &a, sizeof bits);
  guint64 m = (bits & ((G_GUINT64_CONSTANT(1) << 52) - 1)) | G_GUINT64_CONSTANT(1) << 52;
  int e = (int)(bits >> 52) - 1075;               /* a = m * 2^e, 2^52 <= m < 2^53 */
  int x = ((e + 52) * PP_JSON_LOG10_2_Q18) >> 18; /* X or X - 1, as 2^(e+52) <= a < 2^(e+53) */
  const guint64 lo = 10000000000000000ull, hi = 100000000000000000ull; /* 10^16, 10^17 */
  int half;
  guint64 q = scaled(m, e, 16 - x, &half);
  if (q >= hi) {
    x++;
    q = scaled(m, e, 16 - x, &half);
  }
  /* Round half to even on the last digit, as glibc's printf does in the default rounding
   * mode (stdio-common/printf_fp.c, round_away). */
  if (half > 0 || (half == 0 && (q & 1)))
    q++;
  if (q == hi) {
    q = lo;
    x++;
  }
  if (q < lo || q >= hi) /* cannot happen with the bounds above; printf then decides */
    return FALSE;
  char d[PP_JSON_G_DIGITS];
  for (int i = PP_JSON_G_DIGITS - 1; i >= 0; i--, q /= 10)
    d[i] = (char)('0' + q % 10);
  int nd = PP_JSON_G_DIGITS;
  while (nd > 1 && d[nd - 1] == '0')
    nd--;
  char *o = buf;
  if (v < 0)
    *o++ = '-';
  if (x < PP_JSON_G_MIN_EXP) {
    *o++ = d[0];
    if (nd > 1) {
      *o++ = '.';
      memcpy(o, d + 1, nd - 1);
      o += nd - 1;
    }
    *o++ = 'e';
    *o++ = '-';
    int ax = -x;
    if (ax >= 10)
      *o++ = (char)('0' + ax / 10);
    else
      *o++ = '0';
    *o++ = (char)('0' + ax % 10);
  } else if (x >= 0) {
    memcpy(o, d, x + 1);
    o += x + 1;
    if (nd > x + 1) {
      *o++ = '.';
      memcpy(o, d + x + 1, nd - x - 1);
      o += nd - x - 1;
    }
  } else {
    *o++ = '0';
    *o++ = '.';
    for (int i = 0; i < -x - 1; i++)
      *o++ = '0';
    memcpy(o, d, nd);
    o += nd;
  }
  *o = '\0';
  return TRUE;
}
#else
static gboolean exact_text(double v, char *buf) {
  (void)v, (void)buf;
  return FALSE;
}
#endif

char *pp_json_format_double(double v, char *buf) {
  if (!exact_text(v, buf))
    g_ascii_dtostr(buf, G_ASCII_DTOSTR_BUF_SIZE, v);
  return buf;
}
