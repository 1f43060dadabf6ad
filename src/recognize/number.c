/* number.c — label string to number: sign, currency, digits with grouping and decimal mark,
 * exponent, magnitude suffix and percent, validated strictly so that dates, versions, times and
 * words are rejected instead of being misread as values a rule would then compare bars against.
 *
 * Grammar (gaps = ASCII space, tab, U+00A0, U+202F, U+2009, U+2007):
 *   label  := prefix* core [exp] suffix*         leading/trailing whitespace ignored
 *   prefix := '(' | sign | currency gap* | percent gap*      (sign: '-', '+', U+2212, U+2013)
 *   core   := digits (sep digits)* [dec digits] | dec digits
 *   exp    := (E|e) [sign] digits | ×10^ [sign] digits | ×10 superscript-digits
 *   power  := "10" (^ [sign] digits | superscript-digits)   in place of core [exp]: 10^k
 *   suffix := gap* (multiplier | currency | percent | permille) | ')'
 * Each of sign, parenthesis pair, currency, multiplier, percent appears at most once; a sign and
 * parentheses together, or a percent with a currency or multiplier, are rejected. The currencies,
 * multipliers and percent signs themselves are listed in number_units.c.
 * Choices (none comes from a standard, all are common practice, no source):
 * - A trailing minus ("5-") is rejected: in chart text it is more often half of a range "5–10"
 *   split by the text extractor than an accounting sign, and a wrong sign is worse than no value.
 * - No space is allowed between a sign and the digits, for the same reason ("– 5" bullet lists).
 * - "m"/"M"/"MM" mean million (finance usage; "MM" is US finance practice), "B" billion, "T" and
 *   "tn" trillion; so "5 m" (metres) reads as 5e6. "Billion" is rejected: 1e9 in English title
 *   case, 1e12 in German. en-IN compact "T" (thousand) is misread as trillion: not supported.
 * - Lakh (L, lakh, lac) = 1e5 and crore (Cr, crore) = 1e7, as en-IN charts print them.
 * - Only ASCII digits; other Unicode digits (Arabic-Indic, Devanagari, fullwidth) are rejected.
 * - Units other than currency and percent ("5 km", "20 °C") are rejected, not stripped.
 * - Group sizes are checked: 3s everywhere, or with ',' the Indian 2s-then-3 pattern; a leading
 *   zero group ("0,234") can never be grouping, which is what resolves many ambiguous strings. */
#include "recognize/number.h"
#include "recognize/number_units.h"

#include <math.h>
#include <string.h>

/* Separator classes after folding the look-alikes: all spaces are one class, ' and ’ another. */
enum { SEP_NONE = 0, SEP_POINT = '.', SEP_COMMA = ',', SEP_SPACE = ' ', SEP_APOS = '\'' };

#define MAX_GROUPS 32
/* A bare four-digit integer in this range may be a year (the span of dated series in
 * reports, with room ahead; common practice, no source). */
#define PP_YEAR_FIRST 1800
#define PP_YEAR_LAST 2199

static gunichar char_at(const char *p, const char *end, size_t *len) {
  if (p >= end) {
    *len = 0;
    return 0;
  }
  const char *next = g_utf8_next_char(p);
  *len = (size_t)(next - p);
  return g_utf8_get_char(p);
}

static gboolean is_gap(gunichar c) {
  return c == ' ' || c == '\t' || c == 0x00A0 || c == 0x202F || c == 0x2009 || c == 0x2007;
}

static gboolean is_trim(gunichar c) {
  return is_gap(c) || c == '\n' || c == '\r' || c == '\v' || c == '\f' || c == 0x200B ||
         c == 0xFEFF;
}

static int sep_class(gunichar c) {
  if (c == '.')
    return SEP_POINT;
  if (c == ',')
    return SEP_COMMA;
  if (c == '\'' || c == 0x2019)
    return SEP_APOS;
  if (c != '\t' && is_gap(c))
    return SEP_SPACE;
  return SEP_NONE;
}

/* Returns the sign length at p, or 0; *neg tells which sign. */
static size_t match_sign(const char *p, const char *end, gboolean *neg) {
  size_t len;
  gunichar c = char_at(p, end, &len);
  *neg = c == '-' || c == 0x2212 || c == 0x2013;
  return (*neg || c == '+') ? len : 0;
}

static const char *skip_gaps(const char *p, const char *end) {
  size_t len;
  while (p < end && is_gap(char_at(p, end, &len)))
    p += len;
  return p;
}

/* Western groups are 3s; Indian (lakh) grouping is 3 then 2s, only ever written with ','. */
static gboolean groups_valid(const int *glen, int nint, const char *first_digit, int sep) {
  if (nint == 1)
    return TRUE;
  if (glen[0] < 1 || glen[0] > 3 || first_digit[0] == '0' || glen[nint - 1] != 3)
    return FALSE;
  gboolean western = TRUE, indian = sep == SEP_COMMA && glen[0] <= 2 && nint >= 3;
  for (int i = 1; i < nint - 1; i++) {
    western = western && glen[i] == 3;
    indian = indian && glen[i] == 2;
  }
  return western || indian;
}

static int superscript_digit(gunichar c) {
  static const gunichar sup[10] = {0x2070, 0x00B9, 0x00B2, 0x00B3, 0x2074,
                                   0x2075, 0x2076, 0x2077, 0x2078, 0x2079};
  for (int i = 0; i < 10; i++)
    if (sup[i] == c)
      return i;
  return -1;
}

/* The digits of an exponent: ASCII with an optional sign, or superscripts with an optional
 * superscript minus. Advances *pp only on success. */
static gboolean parse_exponent_digits(const char **pp, const char *end, gboolean super, int *exp) {
  const char *q = *pp;
  size_t len;
  gboolean neg = FALSE;
  int e = 0, ndig = 0;
  if (super) {
    if (char_at(q, end, &len) == 0x207B) /* superscript minus */
      neg = TRUE, q += len;
    int d;
    while (q < end && (d = superscript_digit(char_at(q, end, &len))) >= 0) {
      e = MIN(e * 10 + d, 1000);
      ndig++;
      q += len;
    }
  } else {
    q += match_sign(q, end, &neg);
    for (; q < end && g_ascii_isdigit(*q); q++, ndig++)
      e = MIN(e * 10 + (*q - '0'), 1000);
  }
  if (ndig == 0)
    return FALSE;
  *exp = neg ? -e : e;
  *pp = q;
  return TRUE;
}

/* Exponent after a mantissa: "E9", "e+06" (C, R, ICU), "×10^5" (CLDR sv and others),
 * "×10⁻³" with superscripts (typeset axes). Advances *pp only on success. */
static gboolean parse_exponent(const char **pp, const char *end, int *exp) {
  const char *q = *pp;
  size_t len;
  gboolean super = FALSE;
  if (q < end && (*q == 'e' || *q == 'E')) {
    q++;
  } else if (char_at(q, end, &len) == 0x00D7 && (size_t)(end - q) > len + 2 &&
             memcmp(q + len, "10", 2) == 0) {
    q += len + 2;
    if (q < end && *q == '^')
      q++;
    else
      super = TRUE;
  } else {
    return FALSE;
  }
  if (!parse_exponent_digits(&q, end, super, exp))
    return FALSE;
  *pp = q;
  return TRUE;
}

/* A bare power of ten right after the digits "10": "10^3", "10⁻²", as log axes print
 * their ticks (the text stage marks a raised exponent with '^'). */
static gboolean parse_bare_power(const char **pp, const char *end, int *exp) {
  const char *q = *pp;
  size_t len;
  if (q >= end)
    return FALSE;
  gunichar c = char_at(q, end, &len);
  gboolean super = c == 0x207B || superscript_digit(c) >= 0;
  if (c != '^' && !super)
    return FALSE;
  if (!super)
    q++;
  if (!parse_exponent_digits(&q, end, super, exp))
    return FALSE;
  *pp = q;
  return TRUE;
}

typedef struct {
  gboolean neg, signed_, paren_open, paren_closed;
  int exp10;
} label_state;

static gboolean apply_unit(const pp_number_unit *t, size_t len, const char *p, pp_number *out,
                           label_state *st) {
  switch (t->kind) {
  case PP_UNIT_CURRENCY:
    if (out->currency[0] || len >= sizeof out->currency)
      return FALSE;
    memcpy(out->currency, p, len);
    out->currency[len] = '\0';
    return TRUE;
  case PP_UNIT_MULT:
    if (out->multiplier != 1.0)
      return FALSE;
    out->multiplier = pow(10.0, t->exp10);
    st->exp10 += t->exp10;
    return TRUE;
  case PP_UNIT_PERCENT:
  case PP_UNIT_PERMILLE:
    if (out->percent || out->permille)
      return FALSE;
    out->percent = t->kind == PP_UNIT_PERCENT;
    out->permille = t->kind == PP_UNIT_PERMILLE;
    return TRUE;
  }
  return FALSE;
}

/* "I.F0eE" for the digit string (nint of them before the decimal mark) and the power of ten,
 * read by g_ascii_strtod: one correctly rounded conversion. Written without printf and on the
 * stack unless the label is very long: this ran for every numeric word of every page. */
static double decimal_value(const char *digits, int nint, int e10) {
  char stack[96];
  size_t ndig = strlen(digits), need = ndig + 24;
  char *buf = need <= sizeof stack ? stack : g_malloc(need), *q = buf;
  memcpy(q, digits, (size_t)nint);
  q += nint;
  if (nint == 0)
    *q++ = '0';
  *q++ = '.';
  memcpy(q, digits + nint, ndig - (size_t)nint);
  q += ndig - (size_t)nint;
  *q++ = '0';
  *q++ = 'e';
  if (e10 < 0)
    *q++ = '-';
  unsigned int u = e10 < 0 ? 0u - (unsigned int)e10 : (unsigned int)e10;
  char rev[12];
  int k = 0;
  do
    rev[k++] = (char)('0' + u % 10);
  while ((u /= 10) != 0);
  while (k > 0)
    *q++ = rev[--k];
  *q = '\0';
  double v = g_ascii_strtod(buf, NULL);
  if (buf != stack)
    g_free(buf);
  return v;
}

/* Parses s..end under one definite convention. *last_dec_zero reports whether the final decimal
 * digit is '0', which the series chooser reads as a sign of a misread grouping ("1.000"). */
static gboolean parse_strict(const char *s, const char *end, pp_decimal_mark conv, pp_number *out,
                             gboolean *last_dec_zero) {
  const int dec_sep = conv == PP_DECIMAL_COMMA ? SEP_COMMA : SEP_POINT;
  label_state st = {0};
  const char *p = s;
  size_t len;

  memset(out, 0, sizeof *out);
  out->multiplier = 1.0;
  *last_dec_zero = FALSE;

  for (;;) {
    if (p >= end)
      return FALSE;
    if (g_ascii_isdigit(*p))
      break;
    gunichar c = char_at(p, end, &len);
    if (sep_class(c) == dec_sep && p + len < end && g_ascii_isdigit(p[len]))
      break;
    gboolean neg;
    size_t sl = match_sign(p, end, &neg);
    if (sl) {
      if (st.signed_ || st.paren_open)
        return FALSE;
      st.signed_ = TRUE;
      st.neg = neg;
      p += sl;
      if (p < end && is_gap(char_at(p, end, &len)))
        return FALSE;
      continue;
    }
    if (c == '(') {
      if (st.signed_ || st.paren_open)
        return FALSE;
      st.paren_open = TRUE;
      p += len;
      continue;
    }
    const pp_number_unit *t = pp_number_unit_match(p, end, &len);
    if (!t || t->kind == PP_UNIT_MULT || !apply_unit(t, len, p, out, &st))
      return FALSE;
    p = skip_gaps(p + len, end);
  }

  /* core: digit groups split by separators that are followed by a digit; the digit string is
   * on the stack unless the label is very long (this runs for every numeric word of a page) */
  char dstack[64];
  size_t dcap = (size_t)(end - p) + 1, dlen = 0;
  char *digits = dcap <= sizeof dstack ? dstack : g_malloc(dcap);
  int glen[MAX_GROUPS], seps[MAX_GROUPS], ng = 0, cur = 0;
  const char *first_digit = p;
  gboolean ok = FALSE;
  gunichar c0 = char_at(p, end, &len);
  if (sep_class(c0) == dec_sep) { /* ".5" */
    glen[ng] = 0;
    seps[ng++] = dec_sep;
    p += len;
    first_digit = p;
  }
  while (p < end) {
    if (g_ascii_isdigit(*p)) {
      digits[dlen++] = *p++;
      cur++;
      continue;
    }
    int sc = sep_class(char_at(p, end, &len));
    if (sc == SEP_NONE || cur == 0 || p + len >= end || !g_ascii_isdigit(p[len]))
      break;
    if (ng >= MAX_GROUPS - 1)
      goto done;
    glen[ng] = cur;
    seps[ng++] = sc;
    cur = 0;
    p += len;
  }
  digits[dlen] = '\0';
  glen[ng++] = cur;

  /* at most one decimal mark, and only as the last separator; the rest group with one class */
  int ndec = 0, group_sep = SEP_NONE;
  for (int i = 0; i < ng - 1; i++) {
    if (seps[i] == dec_sep) {
      if (++ndec > 1 || i != ng - 2)
        goto done;
    } else if (seps[i] == SEP_POINT || seps[i] == SEP_COMMA || seps[i] == SEP_SPACE ||
               seps[i] == SEP_APOS) {
      if (group_sep != SEP_NONE && group_sep != seps[i])
        goto done;
      group_sep = seps[i];
    }
  }
  int nint = ndec ? ng - 1 : ng;
  if (glen[0] == 0 && nint > 1) /* ".5" cannot be followed by grouping */
    goto done;
  if (!groups_valid(glen, nint, first_digit, group_sep))
    goto done;
  out->has_grouping = group_sep != SEP_NONE;
  out->decimals = ndec ? glen[ng - 1] : 0;
  out->decimal_mark = ndec ? conv : PP_DECIMAL_UNKNOWN;
  *last_dec_zero = ndec && digits[dlen - 1] == '0';

  int exp = 0;
  gboolean has_exp = !out->has_grouping && parse_exponent(&p, end, &exp);
  if (!has_exp && ng == 1 && strcmp(digits, "10") == 0 && parse_bare_power(&p, end, &exp)) {
    digits[0] = '1', digits[1] = '\0', dlen = 1; /* 10^k = 1·10^k */
    has_exp = TRUE;
  }

  /* suffixes */
  while (p < end) {
    const char *q = skip_gaps(p, end);
    if (q >= end)
      goto done;
    if (*q == ')' && q == p && st.paren_open && !st.paren_closed) {
      st.paren_closed = TRUE;
      p++;
      continue;
    }
    const pp_number_unit *t = pp_number_unit_match(q, end, &len);
    if (!t || !apply_unit(t, len, q, out, &st))
      goto done;
    p = q + len;
  }
  if (st.paren_open != st.paren_closed)
    goto done;
  if ((out->percent || out->permille) && (out->currency[0] || out->multiplier != 1.0))
    goto done;
  if (has_exp && out->multiplier != 1.0)
    goto done;

  /* one correctly rounded conversion of the whole decimal string, multiplier included */
  int nint_digits = (int)dlen - out->decimals;
  out->value = decimal_value(digits, nint_digits, exp + st.exp10);
  if (!isfinite(out->value))
    goto done;
  if (out->value == 0.0) /* "-0" is zero, not a negative value */
    out->value = 0.0;
  else if (st.neg || st.paren_open)
    out->value = -out->value;

  out->year_like = !out->has_grouping && ndec == 0 && !has_exp && nint == 1 && glen[0] == 4 &&
                   !st.signed_ && !st.paren_open && !out->currency[0] && out->multiplier == 1.0 &&
                   !out->percent && !out->permille && out->value >= PP_YEAR_FIRST &&
                   out->value <= PP_YEAR_LAST;
  ok = TRUE;
done:
  if (digits != dstack)
    g_free(digits);
  if (!ok)
    memset(out, 0, sizeof *out);
  return ok;
}

/* The label without the whitespace around it; FALSE when it is NULL, not UTF-8 or blank. */
static gboolean trim_label(const char *utf8, const char **s_out, const char **end_out) {
  size_t len;
  if (!utf8 || !g_utf8_validate(utf8, -1, NULL))
    return FALSE;
  const char *s = utf8, *end = utf8 + strlen(utf8);
  while (s < end && is_trim(char_at(s, end, &len)))
    s += len;
  while (end > s) {
    const char *prev = g_utf8_prev_char(end);
    if (!is_trim(g_utf8_get_char(prev)))
      break;
    end = prev;
  }
  *s_out = s;
  *end_out = end;
  return s < end;
}

gboolean pp_number_read(const char *utf8, pp_number_reading *out) {
  const char *s, *end;
  memset(out, 0, sizeof *out);
  if (!trim_label(utf8, &s, &end))
    return FALSE;
  out->ok[0] = parse_strict(s, end, PP_DECIMAL_POINT, &out->as[0], &out->last_dec_zero[0]);
  /* The conventions differ only in which of '.' and ',' is the decimal mark: without either,
   * both read the same separators the same way and no decimal mark, so the comma reading is
   * the point reading (most numeric words of a page: "2019", "45%", "12 500"). */
  size_t n = (size_t)(end - s);
  if (memchr(s, '.', n) || memchr(s, ',', n)) {
    out->ok[1] = parse_strict(s, end, PP_DECIMAL_COMMA, &out->as[1], &out->last_dec_zero[1]);
  } else {
    out->as[1] = out->as[0];
    out->ok[1] = out->ok[0];
    out->last_dec_zero[1] = out->last_dec_zero[0];
  }
  return out->ok[0] || out->ok[1];
}

gboolean pp_number_reading_alone(const pp_number_reading *r, pp_number *out) {
  memset(out, 0, sizeof *out);
  if (r->ok[0]) {
    *out = r->as[0];
    out->ambiguous = r->ok[1] && r->as[0].value != r->as[1].value;
  } else if (r->ok[1]) {
    *out = r->as[1];
  }
  return r->ok[0] || r->ok[1];
}

gboolean pp_number_parse(const char *utf8, pp_decimal_mark hint, pp_number *out) {
  if (hint == PP_DECIMAL_UNKNOWN) {
    /* Every number of the grammar holds an ASCII digit, and with neither reading parsed the
     * result is zeroed: titles and prose lines, which callers test to tell them from numbers,
     * stop here. */
    if (!utf8 || !strpbrk(utf8, "0123456789")) {
      memset(out, 0, sizeof *out);
      return FALSE;
    }
    pp_number_reading r;
    pp_number_read(utf8, &r);
    return pp_number_reading_alone(&r, out);
  }
  const char *s, *end;
  gboolean last_dec_zero;
  memset(out, 0, sizeof *out);
  if (!trim_label(utf8, &s, &end))
    return FALSE;
  return parse_strict(s, end, hint, out, &last_dec_zero);
}
