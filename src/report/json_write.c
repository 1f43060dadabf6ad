/* json_write.c — compact JSON text of a json-glib tree, byte for byte what json-glib 1.6's
 * generator writes (tests/report compares them), without its per-value allocations and printf:
 * every page process writes its whole report this way. */
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
      g_ascii_dtostr(buf, sizeof buf, json_node_get_double(node));
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
