/* baseline.c — findings a reviewer has accepted, kept in a GLib key file: one group per
 * finding's stable id with who accepted it, why and when (plus rule, page and title for
 * the person reading the file). A scan with a baseline reports only new findings, lists
 * the accepted ones apart, and names the entries that no longer match anything. */
#include <string.h>

#include "review.h"

struct pp_baseline {
  GHashTable *entries; /* id → pp_rv_acceptance* (strings owned by the key file copy) */
  GHashTable *seen;    /* ids matched at least once */
  GPtrArray *strings;  /* owned strings */
  GPtrArray *order;    /* ids in file order */
};

void pp_baseline_free(pp_baseline *b) {
  if (!b)
    return;
  g_hash_table_unref(b->entries);
  g_hash_table_unref(b->seen);
  g_ptr_array_unref(b->strings);
  g_ptr_array_unref(b->order);
  g_free(b);
}

static const char *keep(pp_baseline *b, char *s) {
  if (s)
    g_ptr_array_add(b->strings, s);
  return s;
}

pp_baseline *pp_baseline_load(const char *path, GError **error) {
  g_autoptr(GKeyFile) kf = g_key_file_new();
  if (!g_key_file_load_from_file(kf, path, G_KEY_FILE_NONE, error))
    return NULL;
  pp_baseline *b = g_new0(pp_baseline, 1);
  b->entries = g_hash_table_new_full(g_str_hash, g_str_equal, NULL, g_free);
  b->seen = g_hash_table_new(g_str_hash, g_str_equal);
  b->strings = g_ptr_array_new_with_free_func(g_free);
  b->order = g_ptr_array_new();
  gsize n = 0;
  char **groups = g_key_file_get_groups(kf, &n);
  for (gsize i = 0; i < n; i++) {
    pp_rv_acceptance *a = g_new0(pp_rv_acceptance, 1);
    a->who = keep(b, g_key_file_get_string(kf, groups[i], "who", NULL));
    a->why = keep(b, g_key_file_get_string(kf, groups[i], "why", NULL));
    a->when = keep(b, g_key_file_get_string(kf, groups[i], "when", NULL));
    const char *id = keep(b, g_strdup(groups[i]));
    g_hash_table_replace(b->entries, (gpointer)id, a);
    g_ptr_array_add(b->order, (gpointer)id);
  }
  g_strfreev(groups);
  return b;
}

const pp_rv_acceptance *pp_baseline_lookup(const char *finding_id, gpointer baseline) {
  pp_baseline *b = baseline;
  return b && finding_id ? g_hash_table_lookup(b->entries, finding_id) : NULL;
}

static void recount(JsonObject *doc, JsonArray *findings) {
  JsonObject *totals = pp_rv_obj(doc, "totals");
  if (!totals)
    return;
  guint n = json_array_get_length(findings);
  json_object_set_int_member(totals, "findings", n);
  JsonObject *sev = pp_rv_obj(totals, "by_severity");
  const char *const *words = pp_rv_severity_words();
  for (int s = 0; sev && words[s]; s++) {
    gint64 c = 0;
    for (guint i = 0; i < n; i++)
      if (g_strcmp0(pp_rv_str(json_array_get_object_element(findings, i), "severity"), words[s]) ==
          0)
        c++;
    json_object_set_int_member(sev, words[s], c);
  }
}

void pp_baseline_apply(pp_baseline *b, JsonObject *doc) {
  JsonArray *list = pp_rv_arr(doc, "findings");
  if (!b || !list)
    return;
  JsonArray *kept = json_array_new(), *accepted = json_array_new();
  for (guint i = 0; i < json_array_get_length(list); i++) {
    JsonNode *node = json_array_dup_element(list, i);
    JsonObject *f = json_node_get_object(node);
    const char *id = pp_rv_str(f, "id");
    const pp_rv_acceptance *a = pp_baseline_lookup(id, b);
    if (!a) {
      json_array_add_element(kept, node);
      continue;
    }
    /* The key stored must be the table's own string, which outlives the document. */
    for (guint k = 0; k < b->order->len; k++)
      if (strcmp(g_ptr_array_index(b->order, k), id) == 0)
        g_hash_table_add(b->seen, g_ptr_array_index(b->order, k));
    JsonObject *acc = json_object_new();
    json_object_set_string_member(acc, "who", a->who ? a->who : "");
    json_object_set_string_member(acc, "why", a->why ? a->why : "");
    json_object_set_string_member(acc, "when", a->when ? a->when : "");
    json_object_set_object_member(f, "acceptance", acc);
    json_array_add_element(accepted, node);
  }
  json_object_set_array_member(doc, "findings", kept);
  json_object_set_array_member(doc, "accepted", accepted);
  recount(doc, kept);
}

GPtrArray *pp_baseline_stale(pp_baseline *b) {
  GPtrArray *out = g_ptr_array_new();
  for (guint i = 0; b && i < b->order->len; i++)
    if (!g_hash_table_contains(b->seen, g_ptr_array_index(b->order, i)))
      g_ptr_array_add(out, g_ptr_array_index(b->order, i));
  return out;
}

static JsonObject *find_by_id(JsonObject *doc, const char *id) {
  JsonArray *list = pp_rv_arr(doc, "findings");
  for (guint i = 0; list && i < json_array_get_length(list); i++) {
    JsonObject *f = json_array_get_object_element(list, i);
    if (g_strcmp0(pp_rv_str(f, "id"), id) == 0)
      return f;
  }
  return NULL;
}

gboolean pp_baseline_accept(const char *path, JsonObject *doc, const char *finding_id,
                            const char *who, const char *why, GError **error) {
  JsonObject *f = find_by_id(doc, finding_id);
  if (!f) {
    g_set_error(error, G_KEY_FILE_ERROR, G_KEY_FILE_ERROR_GROUP_NOT_FOUND,
                "no finding %s in this findings file", finding_id);
    return FALSE;
  }
  g_autoptr(GKeyFile) kf = g_key_file_new();
  if (g_file_test(path, G_FILE_TEST_EXISTS) &&
      !g_key_file_load_from_file(kf, path, G_KEY_FILE_KEEP_COMMENTS, error))
    return FALSE;
  if (!g_file_test(path, G_FILE_TEST_EXISTS))
    g_key_file_set_comment(kf, NULL, NULL,
                           " plotproof baseline: findings accepted after review, one group per "
                           "finding id.\n Edit freely; a scan with --baseline lists these apart.",
                           NULL);
  g_autoptr(GDateTime) now = g_date_time_new_now_utc();
  g_autofree char *when = g_date_time_format(now, "%Y-%m-%d");
  g_key_file_set_string(kf, finding_id, "who", who ? who : g_get_user_name());
  g_key_file_set_string(kf, finding_id, "why", why ? why : "");
  g_key_file_set_string(kf, finding_id, "when", when);
  if (pp_rv_str(f, "rule"))
    g_key_file_set_string(kf, finding_id, "rule", pp_rv_str(f, "rule"));
  g_key_file_set_int64(kf, finding_id, "page", pp_rv_int(f, "page"));
  const char *title = pp_rv_finding_title(doc, f);
  if (title)
    g_key_file_set_string(kf, finding_id, "title", title);
  JsonObject *d = pp_rv_obj(doc, "document");
  if (pp_rv_str(d, "path"))
    g_key_file_set_string(kf, finding_id, "document", pp_rv_str(d, "path"));
  return g_key_file_save_to_file(kf, path, error);
}
