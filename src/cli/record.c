/* record.c — writing and reading batch.jsonl lines (JSON Lines, https://jsonlines.org:
 * one UTF-8 JSON value per line). */
#include <math.h>
#include <string.h>

#include "record.h"

static void member_string(JsonBuilder *b, const char *name, const char *value) {
  if (!value)
    return;
  json_builder_set_member_name(b, name);
  char *valid = g_utf8_make_valid(value, -1); /* file names need not be UTF-8 */
  json_builder_add_string_value(b, valid);
  g_free(valid);
}

static void member_int(JsonBuilder *b, const char *name, gint64 value) {
  json_builder_set_member_name(b, name);
  json_builder_add_int_value(b, value);
}

char *pp_record_to_line(const pp_record *r) {
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  member_string(b, "path", r->path);
  member_string(b, "output", r->output);
  member_string(b, "sha256", r->sha256);
  member_int(b, "size", (gint64)r->size);
  member_string(b, "status", r->status);
  member_string(b, "word", r->word);
  member_string(b, "reason", r->reason);
  member_string(b, "duplicate_of", r->duplicate_of);
  member_int(b, "pages", r->pages);
  member_int(b, "pages_done", r->pages_done);
  member_int(b, "pages_failed", r->pages_failed);
  member_int(b, "last_page", r->last_page);
  member_int(b, "figures", r->figures);
  member_int(b, "findings", r->findings);
  json_builder_set_member_name(b, "seconds"); /* to the millisecond */
  json_builder_add_double_value(b, round(r->seconds * 1000) / 1000);
  member_int(b, "max_rss_mib", r->max_rss_mib);
  json_builder_set_member_name(b, "resumed");
  json_builder_add_boolean_value(b, r->resumed);
  member_string(b, "key", r->key);
  json_builder_end_object(b);
  g_autoptr(JsonGenerator) gen = json_generator_new();
  JsonNode *root = json_builder_get_root(b);
  json_generator_set_root(gen, root);
  char *line = json_generator_to_data(gen, NULL);
  json_node_unref(root);
  return line;
}

gboolean pp_json_is_one_object(const char *text, gsize len) {
  gsize i = 0;
  while (i < len && g_ascii_isspace(text[i]))
    i++;
  if (i == len || text[i] != '{')
    return FALSE;
  gsize depth = 0;
  gboolean in_string = FALSE;
  for (; i < len; i++) {
    char c = text[i];
    if (in_string) {
      if (c == '\\')
        i++; /* the escaped character */
      else if (c == '"')
        in_string = FALSE;
    } else if (c == '"') {
      in_string = TRUE;
    } else if (c == '{' || c == '[') {
      depth++;
    } else if ((c == '}' || c == ']') && --depth == 0) {
      i++;
      break;
    }
  }
  if (depth != 0)
    return FALSE;
  while (i < len && g_ascii_isspace(text[i]))
    i++;
  return i >= len;
}

GHashTable *pp_records_parse(const char *data, gsize len, JsonObject **summary) {
  GHashTable *records =
      g_hash_table_new_full(g_str_hash, g_str_equal, g_free, (GDestroyNotify)json_object_unref);
  if (summary)
    *summary = NULL;
  JsonParser *parser = json_parser_new();
  const char *p = data, *end = data + len;
  while (p < end) {
    const char *nl = memchr(p, '\n', (size_t)(end - p));
    const char *stop = nl ? nl : end;
    if (pp_json_is_one_object(p, (gsize)(stop - p)) &&
        json_parser_load_from_data(parser, p, stop - p, NULL)) {
      JsonNode *root = json_parser_get_root(parser);
      JsonObject *o = root && JSON_NODE_HOLDS_OBJECT(root) ? json_node_get_object(root) : NULL;
      JsonNode *s = o ? json_object_get_member(o, "summary") : NULL;
      JsonNode *out = o ? json_object_get_member(o, "output") : NULL;
      if (s && JSON_NODE_HOLDS_OBJECT(s)) {
        if (summary) {
          if (*summary)
            json_object_unref(*summary);
          *summary = json_object_ref(json_node_get_object(s));
        }
      } else if (out && JSON_NODE_HOLDS_VALUE(out) &&
                 json_node_get_value_type(out) == G_TYPE_STRING) {
        g_hash_table_replace(records, g_strdup(json_node_get_string(out)), json_object_ref(o));
      }
    }
    p = stop + 1;
  }
  g_object_unref(parser);
  return records;
}

GHashTable *pp_records_load(const char *path, JsonObject **summary) {
  char *data = NULL;
  gsize len = 0;
  if (!g_file_get_contents(path, &data, &len, NULL))
    return pp_records_parse("", 0, summary);
  GHashTable *t = pp_records_parse(data, len, summary);
  g_free(data);
  return t;
}
