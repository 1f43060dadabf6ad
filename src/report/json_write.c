/* json_write.c — compact JSON text, byte for byte what json-glib 1.6's generator writes
 * (tests/report compares them): of a json-glib tree, or written value by value (pp_json_out)
 * with no tree at all, as every page process writes its page entry and findings. */
#include <string.h>

#include "json_util.h"

/* g_string_append_len() without its call when the bytes fit, as GLib's own
 * g_string_append_c_inline() does for one byte (glib/gstring.h): most appends here are a few
 * bytes, and the call cost more than the copy. */
static inline void put(GString *out, const char *s, gsize n) {
  if (out->len + n < out->allocated_len) {
    memcpy(out->str + out->len, s, n);
    out->len += n;
    out->str[out->len] = '\0';
  } else {
    g_string_append_len(out, s, (gssize)n);
  }
}

/* json-glib's json_strescape(): '"' and '\\' escaped, \b \f \n \r \t by name, the other bytes
 * from 0x01 to 0x1e and 0x7f as \u00xx; 0x1f and everything else (UTF-8 included) as it is. */
static const guchar escaped[256] = {
    0, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, /* 0x00: NUL ends the string */
    1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 0, /* 0x10: 0x1f as it is */
    0, 0, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, /* 0x20: '"' */
    0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, /* 0x30 */
    0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, /* 0x40 */
    0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0, /* 0x50: '\\' */
    0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, /* 0x60 */
    0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, /* 0x70: 0x7f */
};

static void add_string(GString *out, const char *s) {
  static const char hex[] = "0123456789abcdef";
  g_string_append_c(out, '"');
  const char *run = s, *p = s;
  for (; *p; p++) {
    guchar c = (guchar)*p;
    if (!escaped[c])
      continue;
    put(out, run, (gsize)(p - run));
    run = p + 1;
    switch (c) {
    case '"': put(out, "\\\"", 2); break;
    case '\\': put(out, "\\\\", 2); break;
    case '\b': put(out, "\\b", 2); break;
    case '\f': put(out, "\\f", 2); break;
    case '\n': put(out, "\\n", 2); break;
    case '\r': put(out, "\\r", 2); break;
    case '\t': put(out, "\\t", 2); break;
    default: {
      char u[6] = {'\\', 'u', '0', '0', hex[c >> 4], hex[c & 15]};
      put(out, u, 6);
    }
    }
  }
  put(out, run, (gsize)(p - run));
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
  put(out, q, (gsize)(buf + sizeof buf - q));
}

/* json-glib: g_ascii_dtostr(), then ".0" when the text has no '.' */
static void add_double(GString *out, double v) {
  char buf[G_ASCII_DTOSTR_BUF_SIZE];
  gsize n = pp_json_format_double(v, buf);
  if (!memchr(buf, '.', n))
    buf[n++] = '.', buf[n++] = '0'; /* room: the longest text is 24 bytes */
  put(out, buf, n);
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
      add_double(out, json_node_get_double(node));
    } else if (t == G_TYPE_BOOLEAN) {
      g_string_append(out, json_node_get_boolean(node) ? "true" : "false");
    } else if (t == G_TYPE_STRING) {
      add_string(out, json_node_get_string(node));
    } else {
      put(out, "null", 4); /* no other value type is ever written */
    }
    break;
  }
  case JSON_NODE_NULL: put(out, "null", 4); break;
  }
}

char *pp_json_write_compact(JsonNode *node, gsize *length) {
  GString *out = g_string_sized_new(1024);
  add_node(out, node);
  if (length)
    *length = out->len;
  return g_string_free(out, FALSE);
}

/* The writer: a ',' goes before every value and name but the first of its level. */
static void separate(pp_json_out *o) {
  if (o->more)
    g_string_append_c(o->text, ',');
}

void pp_json_out_begin_object(pp_json_out *o) {
  separate(o);
  g_string_append_c(o->text, '{');
  o->more = FALSE;
}

void pp_json_out_end_object(pp_json_out *o) {
  g_string_append_c(o->text, '}');
  o->more = TRUE;
}

void pp_json_out_begin_array(pp_json_out *o) {
  separate(o);
  g_string_append_c(o->text, '[');
  o->more = FALSE;
}

void pp_json_out_end_array(pp_json_out *o) {
  g_string_append_c(o->text, ']');
  o->more = TRUE;
}

void pp_json_out_name(pp_json_out *o, const char *name) {
  separate(o);
  add_string(o->text, name);
  g_string_append_c(o->text, ':');
  o->more = FALSE;
}

void pp_json_out_null(pp_json_out *o) {
  separate(o);
  put(o->text, "null", 4);
  o->more = TRUE;
}

void pp_json_out_int(pp_json_out *o, gint64 v) {
  separate(o);
  add_int(o->text, v);
  o->more = TRUE;
}

void pp_json_out_double(pp_json_out *o, double v) {
  separate(o);
  add_double(o->text, v);
  o->more = TRUE;
}

void pp_json_out_bool(pp_json_out *o, gboolean v) {
  separate(o);
  if (v)
    put(o->text, "true", 4);
  else
    put(o->text, "false", 5);
  o->more = TRUE;
}

void pp_json_out_string(pp_json_out *o, const char *s) {
  separate(o);
  add_string(o->text, s);
  o->more = TRUE;
}
