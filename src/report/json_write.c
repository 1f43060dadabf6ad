/* json_write.c — compact JSON text of a json-glib tree, byte for byte what json-glib 1.6's
 * generator writes (tests/report compares them), without its per-value allocations and printf:
 * every page process writes its whole report this way. */
#include <math.h>
#include <string.h>

#include "json_util.h"

/* json-glib's json_strescape(): '"' and '\\' escaped, \b \f \n \r \t by name, the other bytes
 * from 0x01 to 0x1e and 0x7f as \u00xx; 0x1f and everything else (UTF-8 included) as it is. */
static void add_string(GString *out, const char *s) {
  static const char hex[] = "0123456789abcdef";
  g_string_append_c(out, '"');
  const char *run = s;
  for (const char *p = s; *p; p++) {
    guchar c = (guchar)*p;
    if (c != '"' && c != '\\' && (c >= 0x1f || c == 0) && c != 0x7f)
      continue;
    g_string_append_len(out, run, p - run);
    run = p + 1;
    switch (c) {
    case '"': g_string_append_len(out, "\\\"", 2); break;
    case '\\': g_string_append_len(out, "\\\\", 2); break;
    case '\b': g_string_append_len(out, "\\b", 2); break;
    case '\f': g_string_append_len(out, "\\f", 2); break;
    case '\n': g_string_append_len(out, "\\n", 2); break;
    case '\r': g_string_append_len(out, "\\r", 2); break;
    case '\t': g_string_append_len(out, "\\t", 2); break;
    default: {
      char u[6] = {'\\', 'u', '0', '0', hex[c >> 4], hex[c & 15]};
      g_string_append_len(out, u, 6);
    }
    }
  }
  g_string_append_len(out, run, (gssize)strlen(run));
  g_string_append_c(out, '"');
}

static void add_int(GString *out, gint64 v) {
  char buf[24], *q = buf + sizeof buf;
  guint64 u = v < 0 ? 0 - (guint64)v : (guint64)v;
  do
    *--q = (char)('0' + u % 10);
  while ((u /= 10) != 0);
  if (v < 0)
    *--q = '-';
  g_string_append_len(out, q, buf + sizeof buf - q);
}

/* Decimal places and significant digits a double can have for the shortcut below: 2^-19
 * reaches the tap's 1/1024 pt and far below, 10^19 is the largest power of ten in 64 bits
 * (10^20 would wrap), and %.17g prints 17 significant digits (C17 §7.21.6.1). */
#define PP_JSON_DYADIC_BITS 19
#define PP_JSON_G_DIGITS 17

/* The text g_ascii_dtostr() ("%.17g") gives v, when v = m / 2^k with k <= 19 and the exact
 * decimal value m * 5^k / 10^k has at most 17 significant digits: then "%.17g" prints that
 * value exactly, in fixed notation for 1e-4 <= |v| < 1e15, trailing zeros dropped. Most
 * coordinates are such (multiples of 1/1024 pt); FALSE otherwise. */
static gboolean dyadic_text(double v, char *buf) {
  double a = fabs(v), s = a;
  if (!(a >= 1e-4 && a < 1e15))
    return FALSE;
  int k = 0;
  while (s != floor(s)) {
    if (++k > PP_JSON_DYADIC_BITS)
      return FALSE;
    s *= 2; /* exact */
  }
  guint64 m = (guint64)s, pow5 = 1, pow10 = 1;
  for (int i = 0; i < k; i++)
    pow5 *= 5, pow10 *= 10;
  if (m > G_MAXUINT64 / pow5)
    return FALSE;
  guint64 d = m * pow5, ip = d / pow10, fp = d % pow10;
  char digits[24];
  int n = 0;
  for (guint64 t = d; t; t /= 10)
    n++;
  int frac_digits = k;
  while (frac_digits > 0 && fp % 10 == 0)
    fp /= 10, frac_digits--;
  int significant = n - (k - frac_digits); /* trailing zeros of d are not significant */
  if (significant > PP_JSON_G_DIGITS)
    return FALSE;
  char *q = buf;
  if (v < 0)
    *q++ = '-';
  int len = 0;
  do
    digits[len++] = (char)('0' + ip % 10);
  while ((ip /= 10) != 0);
  while (len > 0)
    *q++ = digits[--len];
  if (frac_digits > 0) {
    *q++ = '.';
    for (int i = frac_digits - 1; i >= 0; i--, fp /= 10)
      q[i] = (char)('0' + fp % 10);
    q += frac_digits;
  }
  *q = '\0';
  return TRUE;
}

static void add_node(GString *out, JsonNode *node) {
  switch (json_node_get_node_type(node)) {
  case JSON_NODE_OBJECT: {
    JsonObjectIter it;
    const char *name;
    JsonNode *member;
    gboolean first = TRUE;
    g_string_append_c(out, '{');
    json_object_iter_init_ordered(&it, json_node_get_object(node));
    while (json_object_iter_next_ordered(&it, &name, &member)) {
      if (!first)
        g_string_append_c(out, ',');
      first = FALSE;
      add_string(out, name);
      g_string_append_c(out, ':');
      add_node(out, member);
    }
    g_string_append_c(out, '}');
    break;
  }
  case JSON_NODE_ARRAY: {
    JsonArray *a = json_node_get_array(node);
    guint n = json_array_get_length(a);
    g_string_append_c(out, '[');
    for (guint i = 0; i < n; i++) {
      if (i)
        g_string_append_c(out, ',');
      add_node(out, json_array_get_element(a, i));
    }
    g_string_append_c(out, ']');
    break;
  }
  case JSON_NODE_VALUE: {
    GType t = json_node_get_value_type(node);
    if (t == G_TYPE_INT64) {
      add_int(out, json_node_get_int(node));
    } else if (t == G_TYPE_DOUBLE) {
      /* json-glib: g_ascii_dtostr(), then ".0" when the text has no '.' */
      char buf[G_ASCII_DTOSTR_BUF_SIZE];
      double v = json_node_get_double(node);
      if (!dyadic_text(v, buf))
        g_ascii_dtostr(buf, sizeof buf, v);
      g_string_append(out, buf);
      if (!strchr(buf, '.'))
        g_string_append_len(out, ".0", 2);
    } else if (t == G_TYPE_BOOLEAN) {
      g_string_append(out, json_node_get_boolean(node) ? "true" : "false");
    } else if (t == G_TYPE_STRING) {
      add_string(out, json_node_get_string(node));
    } else {
      g_string_append_len(out, "null", 4); /* no other value type is ever written */
    }
    break;
  }
  case JSON_NODE_NULL: g_string_append_len(out, "null", 4); break;
  }
}

char *pp_json_write_compact(JsonNode *node, gsize *length) {
  GString *out = g_string_sized_new(1024);
  add_node(out, node);
  if (length)
    *length = out->len;
  return g_string_free(out, FALSE);
}
