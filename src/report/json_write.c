/* json_write.c — compact JSON text, byte for byte what json-glib 1.6's generator writes
 * (tests/report compares them): of a json-glib tree, or written value by value (pp_json_out)
 * with no tree at all, as every page process writes its page entry and findings. */
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

/* json-glib: g_ascii_dtostr(), then ".0" when the text has no '.' */
static void add_double(GString *out, double v) {
  char buf[G_ASCII_DTOSTR_BUF_SIZE];
  pp_json_format_double(v, buf);
  g_string_append(out, buf);
  if (!strchr(buf, '.'))
    g_string_append_len(out, ".0", 2);
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
  g_string_append_len(o->text, "null", 4);
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
    g_string_append_len(o->text, "true", 4);
  else
    g_string_append_len(o->text, "false", 5);
  o->more = TRUE;
}

void pp_json_out_string(pp_json_out *o, const char *s) {
  separate(o);
  add_string(o->text, s);
  o->more = TRUE;
}
