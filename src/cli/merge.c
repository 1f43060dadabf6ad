/* merge.c — `plotproof merge -o OUT DIR...`: joins the output directories of shards
 * (--shard K/N) into one: findings files copied to the same relative names, batch
 * records joined into one batch.jsonl. It says when a shard is missing, when two
 * directories hold the same shard, and when one output name comes from two documents. */
#include <stdio.h>
#include <string.h>

#include "cli.h"
#include "output.h"
#include "record.h"

typedef struct {
  GHashTable *records; /* output → JsonObject (borrowed from a shard's table) */
  GHashTable *from;    /* output → directory it came from */
  GPtrArray *tables;
  guint problems;
} merged;

static gboolean parse_shard(const char *s, guint *k, guint *n) {
  return s && sscanf(s, "%u/%u", k, n) == 2 && *n >= 1 && *k >= 1 && *k <= *n;
}

static gboolean copy_file(const char *from, const char *to) {
  char *data = NULL;
  gsize len = 0;
  GError *error = NULL;
  gboolean ok = g_file_get_contents(from, &data, &len, &error) &&
                pp_output_write_atomic(to, data, len, &error);
  if (!ok) {
    pp_cli_print_file_error(from, "not merged", error->message);
    g_error_free(error);
  }
  g_free(data);
  return ok;
}

static void take(merged *m, const char *dir, GHashTable *records) {
  GHashTableIter it;
  gpointer key, value;
  g_hash_table_iter_init(&it, records);
  while (g_hash_table_iter_next(&it, &key, &value)) {
    const char *out = key;
    JsonObject *rec = value, *seen = g_hash_table_lookup(m->records, out);
    if (seen) {
      const char *a = json_object_get_string_member_with_default(seen, "sha256", "");
      const char *b = json_object_get_string_member_with_default(rec, "sha256", "");
      char *msg = g_strdup_printf(
          "%s also in %s (%s)", out, (const char *)g_hash_table_lookup(m->from, out),
          strcmp(a, b) ? "different content: kept the first" : "same content: kept once");
      pp_cli_print_file_error(dir, "duplicate", msg);
      g_free(msg);
      m->problems += strcmp(a, b) != 0;
      continue;
    }
    g_hash_table_insert(m->records, (gpointer)out, rec);
    g_hash_table_insert(m->from, (gpointer)out, (gpointer)dir);
  }
}

static int compare_strings(gconstpointer a, gconstpointer b) {
  return strcmp(*(const char *const *)a, *(const char *const *)b);
}

int pp_cli_merge(char **dirs, int n_dirs, const pp_cli_options *opt) {
  merged m = {g_hash_table_new(g_str_hash, g_str_equal), g_hash_table_new(g_str_hash, g_str_equal),
              g_ptr_array_new_with_free_func((GDestroyNotify)g_hash_table_unref), 0};
  guint shard_n = 0, inputs_total = 0;
  GHashTable *shards = g_hash_table_new(g_direct_hash, g_direct_equal);
  for (int i = 0; i < n_dirs; i++) {
    char *path = g_build_filename(dirs[i], PP_RECORD_FILE, NULL);
    JsonObject *summary = NULL;
    if (!g_file_test(path, G_FILE_TEST_IS_REGULAR)) {
      pp_cli_print_file_error(dirs[i], "not merged", "no " PP_RECORD_FILE " in this directory");
      m.problems++;
      g_free(path);
      continue;
    }
    GHashTable *records = pp_records_load(path, &summary);
    g_free(path);
    g_ptr_array_add(m.tables, records);
    guint k = 1, n = 1;
    if (!summary ||
        !parse_shard(json_object_get_string_member_with_default(summary, "shard", NULL), &k, &n)) {
      pp_cli_print_file_error(dirs[i], "incomplete", "the run has no summary line: rerun it");
      m.problems++;
    } else {
      if (json_object_get_boolean_member_with_default(summary, "interrupted", FALSE)) {
        pp_cli_print_file_error(dirs[i], "incomplete", "the run was interrupted: rerun it");
        m.problems++;
      }
      if (shard_n && n != shard_n) {
        pp_cli_print_file_error(dirs[i], "not merged", "its shard count differs from the others");
        m.problems++;
      }
      shard_n = shard_n ? shard_n : n;
      inputs_total = MAX(
          inputs_total, (guint)json_object_get_int_member_with_default(summary, "inputs_total", 0));
      if (!g_hash_table_add(shards, GUINT_TO_POINTER(k))) {
        char *msg = g_strdup_printf("shard %u/%u given twice", k, n);
        pp_cli_print_file_error(dirs[i], "duplicate", msg);
        g_free(msg);
      }
    }
    if (summary)
      json_object_unref(summary);
    take(&m, dirs[i], records);
  }
  for (guint k = 1; k <= shard_n; k++) {
    if (!g_hash_table_contains(shards, GUINT_TO_POINTER(k))) {
      fprintf(stderr, "plotproof: shard %u/%u is missing\n", k, shard_n);
      m.problems++;
    }
  }
  /* Records in output-name order, findings files copied beside them. */
  GPtrArray *names = g_ptr_array_new();
  GHashTableIter it;
  gpointer key;
  g_hash_table_iter_init(&it, m.records);
  while (g_hash_table_iter_next(&it, &key, NULL))
    g_ptr_array_add(names, key);
  g_ptr_array_sort(names, compare_strings);
  GString *all = g_string_new(NULL);
  gint64 counts[5] = {0}; /* ok, partial, failed, duplicate, findings */
  for (guint i = 0; i < names->len; i++) {
    const char *out = g_ptr_array_index(names, i);
    JsonObject *rec = g_hash_table_lookup(m.records, out);
    const char *status = json_object_get_string_member_with_default(rec, "status", "");
    if (!strcmp(status, "ok") || !strcmp(status, "partial")) {
      char *src = g_build_filename(g_hash_table_lookup(m.from, out), out, NULL);
      char *dst = g_build_filename(opt->output_dir, out, NULL);
      if (!copy_file(src, dst))
        m.problems++;
      g_free(src);
      g_free(dst);
    }
    counts[0] += !strcmp(status, "ok");
    counts[1] += !strcmp(status, "partial");
    counts[2] += !strcmp(status, "failed") || !strcmp(status, "interrupted");
    counts[3] += !strcmp(status, "duplicate");
    if (strcmp(status, "duplicate"))
      counts[4] += json_object_get_int_member_with_default(rec, "findings", 0);
    JsonNode *n = json_node_new(JSON_NODE_OBJECT);
    json_node_set_object(n, rec);
    char *line = json_to_string(n, FALSE);
    g_string_append_printf(all, "%s\n", line);
    g_free(line);
    json_node_unref(n);
  }
  if (inputs_total && names->len != inputs_total) {
    fprintf(stderr, "plotproof: the shards hold %u documents of the %u inputs\n", names->len,
            inputs_total);
    m.problems++;
  }
  g_string_append_printf(all,
                         "{\"summary\":{\"documents\":%u,\"ok\":%" G_GINT64_FORMAT
                         ",\"partial\":%" G_GINT64_FORMAT ",\"failed\":%" G_GINT64_FORMAT
                         ",\"duplicates\":%" G_GINT64_FORMAT ",\"findings\":%" G_GINT64_FORMAT
                         ",\"inputs_total\":%u,\"shard\":\"1/1\",\"merged_from\":%u,"
                         "\"complete\":%s,\"interrupted\":false}}\n",
                         names->len, counts[0], counts[1], counts[2], counts[3], counts[4],
                         inputs_total, g_hash_table_size(shards), m.problems ? "false" : "true");
  char *rec_path = g_build_filename(opt->output_dir, PP_RECORD_FILE, NULL);
  GError *error = NULL;
  if (!pp_output_write_atomic(rec_path, all->str, all->len, &error)) {
    pp_cli_print_file_error(rec_path, "unwritable", error->message);
    g_error_free(error);
    m.problems++;
  }
  if (!opt->quiet)
    printf("Merged %u directories: %u documents (%" G_GINT64_FORMAT " ok, %" G_GINT64_FORMAT
           " partial, %" G_GINT64_FORMAT " failed, %" G_GINT64_FORMAT " duplicates)%s.\n",
           n_dirs, names->len, counts[0], counts[1], counts[2], counts[3],
           m.problems ? "; see the messages above" : "");
  gboolean out_ok = pp_output_stdout_flush();
  g_free(rec_path);
  g_string_free(all, TRUE);
  g_ptr_array_unref(names);
  g_hash_table_unref(shards);
  g_hash_table_unref(m.records);
  g_hash_table_unref(m.from);
  g_ptr_array_unref(m.tables);
  if (!out_ok)
    return PP_EXIT_ALL_FAILED;
  return m.problems ? PP_EXIT_PARTIAL : PP_EXIT_CLEAN;
}
