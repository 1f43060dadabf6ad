/* scan.c — `plotproof scan`: inputs hashed and deduplicated, this shard's share taken,
 * documents already done by an earlier run into the same output directory skipped, the
 * rest run by the scheduler; each result becomes a findings file (atomically), a batch
 * record, a summary block or a JSON line, and the exit code. */
#include <errno.h>
#include <fcntl.h>
#include <stdio.h>
#include <string.h>
#include <unistd.h>

#include "batch.h"
#include "docworker.h"
#include "inputs.h"
#include "output.h"
#include "passwords.h"
#include "record.h"
#include "summary.h"
#include "worker.h"

typedef struct {
  const pp_cli_options *opt;
  GPtrArray *inputs;
  gboolean write_files;
  char *key;            /* tool version + settings digest */
  int records_fd;       /* batch.jsonl opened for append, or -1 */
  char **lines;         /* per input: this run's record line, or NULL */
  JsonNode **roots;     /* per input: the findings object kept for duplicates */
  const char **status;  /* per input */
  GHashTable *previous; /* output name → JsonObject from an earlier run */
  pp_progress *progress;
  pp_summary_totals totals;
  guint n_partial, n_resumed, n_duplicates, n_interrupted, n_docs;
  pp_passwords *passwords;
  pp_cli_review *review; /* baseline, HTML, annotated copies, CSV, SARIF (review_cli.c) */
} scan;

/* The settings that change a findings file; a rerun with other values rescans. */
static char *settings_key(const pp_cli_options *opt) {
  const pp_thresholds *t = &opt->thresholds;
  char *text = g_strdup_printf(
      "band=%.17g:%.17g gdi=%.17g gross=%.17g label=%.17g page_s=%u memory_mib=%u cpu_s=%u "
      "timeout_s=%u",
      t->lie_band_low, t->lie_band_high, t->gdi_limit, t->severe_factor, t->label_tolerance,
      opt->page_s, opt->memory_mib, opt->cpu_s, opt->timeout_s);
  GString *all = g_string_new(text);
  g_string_append_printf(all, " opt_in=%" G_GINT64_MODIFIER "x", (guint64)t->opt_in);
  GPtrArray *lists[] = {opt->disabled_rules, opt->min_severity};
  for (guint k = 0; k < 2; k++)
    for (guint i = 0; lists[k] && i < lists[k]->len; i++)
      g_string_append_printf(all, " %s=%s", k ? "min" : "off",
                             (const char *)g_ptr_array_index(lists[k], i));
  char *hash = g_compute_checksum_for_string(G_CHECKSUM_SHA256, all->str, -1);
  g_string_free(all, TRUE);
  char *key = g_strdup_printf("%s/%.16s", PP_VERSION, hash);
  g_free(hash);
  g_free(text);
  return key;
}

static char *output_path(const scan *s, const pp_input *in) {
  return g_build_filename(s->opt->output_dir, in->output_name, NULL);
}

static pp_record base_record(const scan *s, const pp_input *in) {
  return (pp_record){.path = in->path,
                     .output = in->output_name,
                     .sha256 = in->sha256,
                     .key = s->key,
                     .size = in->size};
}

static void add_record(scan *s, guint idx, const pp_record *r) {
  char *line = pp_record_to_line(r);
  s->status[idx] = r->status;
  if (s->records_fd >= 0) {
    char *with_nl = g_strconcat(line, "\n", NULL);
    if (!pp_worker_write_all(s->records_fd, with_nl, strlen(with_nl))) {
      pp_cli_print_file_error(PP_RECORD_FILE, "unwritable", g_strerror(errno));
      close(s->records_fd);
      s->records_fd = -1;
    }
    g_free(with_nl);
  }
  g_free(s->lines[idx]);
  s->lines[idx] = line;
}

static gint64 totals_member(JsonNode *root, const char *name) {
  JsonObject *t = json_object_get_object_member(json_node_get_object(root), "totals");
  return t ? json_object_get_int_member_with_default(t, name, 0) : 0;
}

/* Prints one finished document: its summary block, or its JSON line. */
static void show(scan *s, const pp_input *in, JsonNode *root, const pp_record *r) {
  pp_progress_clear(s->progress);
  if (s->opt->json) {
    char *text = root ? pp_report_node_to_string(root, FALSE, NULL) : pp_record_to_line(r);
    char *line = g_strconcat(text, "\n", NULL);
    pp_output_stdout(line, strlen(line));
    g_free(line);
    g_free(text);
  } else if (root && !s->opt->quiet && !pp_output_stdout_failed()) {
    char *out = s->write_files ? output_path(s, in) : NULL;
    pp_summary_print_document(json_node_get_object(root), in->path, out, &s->totals);
    pp_output_stdout_flush();
    g_free(out);
    return;
  }
  if (root)
    pp_summary_count_document(json_node_get_object(root), &s->totals);
}

static void fill_counts(pp_record *r, JsonNode *root) {
  r->pages = totals_member(root, "pages");
  r->pages_failed = totals_member(root, "pages_failed");
  r->figures = totals_member(root, "figures");
  r->findings = totals_member(root, "findings");
}

static void document_failed(scan *s, guint idx, pp_record *r) {
  pp_input *in = g_ptr_array_index(s->inputs, idx);
  if (s->write_files && !r->resumed) { /* a failed rerun must not leave the old file */
    char *out = output_path(s, in);
    unlink(out);
    g_free(out);
  }
  if (strcmp(r->status, PP_STATUS_INTERRUPTED) == 0)
    s->n_interrupted++;
  else
    s->totals.failed++;
  if (!s->opt->json || s->opt->progress)
    pp_progress_clear(s->progress);
  pp_cli_print_file_error(in->path, r->word ? r->word : "failed", r->reason);
  add_record(s, idx, r);
  show(s, in, NULL, r);
}

/* Whether anything after the findings file reads the page entries: the summary block (its
 * coverage lines), the JSON on stdout, the baseline and the review outputs. Otherwise the
 * object without them (pp_assembly_finish_text) is enough, and no tree of the pages is built. */
static gboolean reads_pages(const pp_cli_options *opt) {
  return opt->json || !opt->quiet || opt->baseline_file || opt->csv_file || opt->sarif_file ||
         opt->html_dir || opt->annotate;
}

static void on_done(const pp_batch_result *res, gpointer data) {
  scan *s = data;
  pp_input *in = g_ptr_array_index(s->inputs, res->id);
  char *out = s->write_files ? output_path(s, in) : NULL;
  pp_record r = base_record(s, in);
  r.pages = res->pages;
  r.pages_done = res->pages_done;
  r.pages_failed = res->pages_failed;
  r.last_page = res->last_page;
  r.seconds = res->seconds;
  r.max_rss_mib = (res->max_rss_kib + 1023) / 1024;
  char *reason = NULL;
  JsonNode *root = res->root;
  if (res->interrupted) {
    r.status = PP_STATUS_INTERRUPTED;
    r.word = "interrupted";
    r.reason = "the batch was stopped before this document finished";
    root = NULL;
  } else if (root && totals_member(root, "pages_analysed") == 0) {
    r.status = PP_STATUS_FAILED;
    r.word = "damaged";
    reason = g_strdup_printf("none of its %" G_GINT64_FORMAT " pages could be analysed (%s)",
                             totals_member(root, "pages"),
                             res->first_page_error ? res->first_page_error : "no reason given");
    r.reason = reason;
    root = NULL;
  } else if (!root) {
    r.status = PP_STATUS_FAILED;
    r.word = res->word ? res->word : "damaged";
    r.reason = res->reason;
  } else {
    fill_counts(&r, root);
    r.status = res->complete && r.pages_failed == 0 ? PP_STATUS_OK : PP_STATUS_PARTIAL;
    if (out) {
      char *with_nl = g_strconcat(res->text, "\n", NULL);
      GError *error = NULL;
      if (!pp_output_write_atomic(out, with_nl, strlen(with_nl), &error)) {
        r.status = PP_STATUS_FAILED;
        r.word = "output failed";
        reason = g_strdup(error->message);
        r.reason = reason;
        g_error_free(error);
        root = NULL;
      }
      g_free(with_nl);
    }
  }
  JsonNode *full = NULL;
  if (root && reads_pages(s->opt) && (full = json_from_string(res->text, NULL)))
    root = full;
  if (!root) {
    document_failed(s, res->id, &r);
  } else {
    if (strcmp(r.status, PP_STATUS_PARTIAL) == 0) {
      s->n_partial++;
      r.word = "partial";
      reason =
          g_strdup_printf("%" G_GINT64_FORMAT " of %" G_GINT64_FORMAT " pages not analysed; %s",
                          r.pages_failed, r.pages,
                          res->reason             ? res->reason
                          : res->first_page_error ? res->first_page_error
                                                  : "see the findings file");
      r.reason = reason;
      pp_progress_clear(s->progress);
      pp_cli_print_file_error(in->path, "partial", reason);
    }
    s->n_docs++;
    add_record(s, res->id, &r);
    pp_cli_review_document(s->review, root, in->path, in->output_name);
    show(s, in, root, &r);
    s->roots[res->id] = json_node_ref(root);
  }
  pp_progress_document(s->progress, in->path, r.status, (guint)r.pages, (guint)r.findings,
                       r.seconds);
  if (full)
    json_node_unref(full);
  g_free(reason);
  g_free(out);
}

/* An earlier run's result for this input, when its findings file is still there and was
 * made from the same content, by the same version, with the same settings. */
static JsonNode *resumable(scan *s, const pp_input *in, JsonObject **prev) {
  JsonObject *p = s->previous ? g_hash_table_lookup(s->previous, in->output_name) : NULL;
  if (!p)
    return NULL;
  const char *status = json_object_get_string_member_with_default(p, "status", "");
  if (g_strcmp0(json_object_get_string_member_with_default(p, "sha256", NULL), in->sha256) ||
      g_strcmp0(json_object_get_string_member_with_default(p, "key", NULL), s->key) ||
      (strcmp(status, PP_STATUS_OK) && strcmp(status, PP_STATUS_PARTIAL)))
    return NULL;
  char *out = output_path(s, in);
  g_autoptr(JsonParser) parser = json_parser_new();
  JsonNode *root = NULL;
  if (json_parser_load_from_file(parser, out, NULL) &&
      JSON_NODE_HOLDS_OBJECT(json_parser_get_root(parser))) {
    JsonObject *doc = json_object_get_object_member(
        json_node_get_object(json_parser_get_root(parser)), "document");
    if (doc &&
        !g_strcmp0(json_object_get_string_member_with_default(doc, "sha256", NULL), in->sha256))
      root = json_node_copy(json_parser_get_root(parser));
  }
  g_free(out);
  *prev = p;
  return root;
}

static void resume(scan *s, guint idx, JsonNode *root, JsonObject *prev) {
  pp_input *in = g_ptr_array_index(s->inputs, idx);
  pp_record r = base_record(s, in);
  fill_counts(&r, root);
  r.status = json_object_get_string_member_with_default(prev, "status", PP_STATUS_OK);
  r.status = strcmp(r.status, PP_STATUS_PARTIAL) == 0 ? PP_STATUS_PARTIAL : PP_STATUS_OK;
  r.word = json_object_get_string_member_with_default(prev, "word", NULL);
  r.reason = json_object_get_string_member_with_default(prev, "reason", NULL);
  r.pages_done = r.pages;
  r.resumed = TRUE;
  if (strcmp(r.status, PP_STATUS_PARTIAL) == 0)
    s->n_partial++;
  s->n_resumed++;
  s->n_docs++;
  add_record(s, idx, &r);
  pp_cli_review_document(s->review, root, in->path, in->output_name);
  show(s, in, root, &r);
  s->roots[idx] = root;
  pp_progress_document(s->progress, in->path, r.status, (guint)r.pages, (guint)r.findings, 0);
}

static void record_duplicate(scan *s, guint idx) {
  pp_input *in = g_ptr_array_index(s->inputs, idx);
  pp_input *first = g_ptr_array_index(s->inputs, in->primary);
  JsonNode *root = s->roots[in->primary];
  pp_record r = base_record(s, in);
  r.duplicate_of = first->path;
  r.status = root ? PP_STATUS_DUPLICATE : s->status[in->primary];
  if (!r.status)
    return; /* the first copy was never reached (interrupted) */
  if (root)
    fill_counts(&r, root);
  else
    r.word = "failed", r.reason = "same content as a document that failed";
  s->n_duplicates++;
  add_record(s, idx, &r);
  if (s->opt->json) {
    char *line = pp_record_to_line(&r);
    char *with_nl = g_strconcat(line, "\n", NULL);
    pp_output_stdout(with_nl, strlen(with_nl));
    g_free(with_nl);
    g_free(line);
  } else if (!s->opt->quiet) {
    char *name = pp_cli_escape(in->path), *other = pp_cli_escape(first->path);
    printf("%s: same content as %s (SHA-256 %.12s…), scanned once\n", name, other, in->sha256);
    pp_output_stdout_flush();
    g_free(name);
    g_free(other);
  }
}

/* An earlier run into this directory may have used this name for another document (same
 * base name, other folder): then this one takes the "-<hash>" name instead. */
static void avoid_earlier_runs(scan *s, pp_input *in) {
  JsonObject *p = s->previous ? g_hash_table_lookup(s->previous, in->output_name) : NULL;
  char *valid = g_utf8_make_valid(in->path, -1);
  const char *other = NULL;
  g_autoptr(JsonParser) parser = json_parser_new();
  if (p) {
    other = json_object_get_string_member_with_default(p, "path", NULL);
  } else {
    char *out = output_path(s, in);
    if (g_file_test(out, G_FILE_TEST_EXISTS) && json_parser_load_from_file(parser, out, NULL) &&
        JSON_NODE_HOLDS_OBJECT(json_parser_get_root(parser))) {
      JsonObject *doc = json_object_get_object_member(
          json_node_get_object(json_parser_get_root(parser)), "document");
      other = doc ? json_object_get_string_member_with_default(doc, "path", NULL) : NULL;
    }
    g_free(out);
  }
  if (other && strcmp(other, valid) != 0)
    pp_input_retag(in);
  g_free(valid);
}

static int open_records(const scan *s) {
  char *path = g_build_filename(s->opt->output_dir, PP_RECORD_FILE, NULL);
  int fd = open(path, O_WRONLY | O_CREAT | O_APPEND | O_CLOEXEC, 0644);
  if (fd >= 0) {
    /* A run killed mid-line left a cut line; start on a fresh one. */
    char last = '\n';
    int rfd = open(path, O_RDONLY | O_CLOEXEC);
    off_t end = rfd >= 0 ? lseek(rfd, 0, SEEK_END) : 0;
    if (end > 0 && pread(rfd, &last, 1, end - 1) == 1 && last != '\n')
      pp_worker_write_all(fd, "\n", 1);
    if (rfd >= 0)
      close(rfd);
  } else {
    pp_cli_print_file_error(path, "unwritable", g_strerror(errno));
  }
  g_free(path);
  return fd;
}

static int compare_strings(gconstpointer a, gconstpointer b) {
  return strcmp(*(const char *const *)a, *(const char *const *)b);
}

/* batch.jsonl rewritten at the end: one line per input of this run (or the earlier run's
 * line when this run did not reach it), then the summary. */
static gboolean write_records(scan *s, guint inputs_total, gboolean interrupted) {
  GString *all = g_string_new(NULL);
  for (guint i = 0; i < s->inputs->len; i++) {
    pp_input *in = g_ptr_array_index(s->inputs, i);
    JsonObject *prev = s->previous ? g_hash_table_lookup(s->previous, in->output_name) : NULL;
    if (s->lines[i]) {
      g_string_append_printf(all, "%s\n", s->lines[i]);
    } else if (prev) {
      JsonNode *n = json_node_new(JSON_NODE_OBJECT);
      json_node_set_object(n, prev);
      char *line = json_to_string(n, FALSE);
      g_string_append_printf(all, "%s\n", line);
      g_free(line);
      json_node_unref(n);
    }
  }
  /* Documents of earlier runs into this directory that this run did not name keep
   * their lines, so that one directory can collect several runs. */
  if (s->previous) {
    GHashTable *mine = g_hash_table_new(g_str_hash, g_str_equal);
    for (guint i = 0; i < s->inputs->len; i++)
      g_hash_table_add(mine, ((pp_input *)g_ptr_array_index(s->inputs, i))->output_name);
    GPtrArray *others = g_ptr_array_new();
    GHashTableIter it;
    gpointer key;
    g_hash_table_iter_init(&it, s->previous);
    while (g_hash_table_iter_next(&it, &key, NULL))
      if (!g_hash_table_contains(mine, key))
        g_ptr_array_add(others, key);
    g_ptr_array_sort(others, compare_strings);
    for (guint i = 0; i < others->len; i++) {
      JsonNode *n = json_node_new(JSON_NODE_OBJECT);
      json_node_set_object(n, g_hash_table_lookup(s->previous, g_ptr_array_index(others, i)));
      char *line = json_to_string(n, FALSE);
      g_string_append_printf(all, "%s\n", line);
      g_free(line);
      json_node_unref(n);
    }
    g_ptr_array_unref(others);
    g_hash_table_unref(mine);
  }
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  json_builder_set_member_name(b, "summary");
  json_builder_begin_object(b);
  const char *names[] = {"documents",
                         "ok",
                         "partial",
                         "failed",
                         "duplicates",
                         "resumed",
                         "interrupted_documents",
                         "findings",
                         "pages",
                         "inputs_total"};
  gint64 values[] = {s->n_docs + s->totals.failed + s->n_duplicates,
                     s->n_docs - s->n_partial,
                     s->n_partial,
                     s->totals.failed,
                     s->n_duplicates,
                     s->n_resumed,
                     s->n_interrupted,
                     s->totals.findings,
                     s->totals.pages,
                     inputs_total};
  for (guint i = 0; i < G_N_ELEMENTS(names); i++) {
    json_builder_set_member_name(b, names[i]);
    json_builder_add_int_value(b, values[i]);
  }
  char shard[64];
  g_snprintf(shard, sizeof shard, "%u/%u", s->opt->shard_k, s->opt->shard_n);
  json_builder_set_member_name(b, "shard");
  json_builder_add_string_value(b, shard);
  json_builder_set_member_name(b, "interrupted");
  json_builder_add_boolean_value(b, interrupted);
  json_builder_set_member_name(b, "key");
  json_builder_add_string_value(b, s->key);
  json_builder_end_object(b);
  json_builder_end_object(b);
  JsonNode *root = json_builder_get_root(b);
  char *line = json_to_string(root, FALSE);
  json_node_unref(root);
  g_string_append_printf(all, "%s\n", line);
  g_free(line);
  char *path = g_build_filename(s->opt->output_dir, PP_RECORD_FILE, NULL);
  GError *error = NULL;
  gboolean ok = pp_output_write_atomic(path, all->str, all->len, &error);
  if (!ok) {
    pp_cli_print_file_error(path, "unwritable", error->message);
    g_error_free(error);
  }
  g_free(path);
  g_string_free(all, TRUE);
  return ok;
}

static int exit_code(const scan *s, gboolean interrupted, gboolean records_ok) {
  if (pp_output_stdout_failed() || !records_ok)
    return PP_EXIT_ALL_FAILED;
  if (interrupted)
    return PP_EXIT_INTERRUPTED;
  if (s->n_docs == 0 && s->n_duplicates == 0 && s->totals.failed > 0)
    return PP_EXIT_ALL_FAILED;
  if (s->totals.failed > 0 || s->n_partial > 0)
    return PP_EXIT_PARTIAL;
  return s->totals.findings > 0 ? PP_EXIT_FINDINGS : PP_EXIT_CLEAN;
}

int pp_cli_scan(char **paths, int n_paths, const pp_cli_options *opt) {
  GError *error = NULL;
  if (!pp_capture_self_test(&error)) {
    fprintf(stderr, "plotproof: %s\n", error->message);
    g_error_free(error);
    return PP_EXIT_USAGE;
  }
  /* Now, while this process has one thread (the batch's signal sources start GLib's), and
   * before the inputs are read, so that the workers it forks inherit little. */
  g_autoptr(pp_launcher) launcher = pp_launcher_new(pp_docworker_run_job, &error);
  if (!launcher) {
    fprintf(stderr, "plotproof: %s\n", error->message);
    g_error_free(error);
    return PP_EXIT_USAGE;
  }
  scan s = {.opt = opt,
            .write_files = !opt->json || opt->output_given,
            .key = settings_key(opt),
            .records_fd = -1};
  s.passwords = pp_passwords_load(opt->password_file, opt->password, &error);
  if (!s.passwords) {
    pp_cli_print_file_error(opt->password_file, "unreadable", error->message);
    g_error_free(error);
    g_free(s.key);
    return PP_EXIT_USAGE;
  }
  if (s.write_files && (g_mkdir_with_parents(opt->output_dir, 0755) != 0 ||
                        !g_file_test(opt->output_dir, G_FILE_TEST_IS_DIR))) {
    pp_cli_print_file_error(opt->output_dir, "unwritable", "cannot create the output directory");
    pp_passwords_free(s.passwords);
    g_free(s.key);
    return PP_EXIT_USAGE;
  }
  int review_rc = PP_EXIT_CLEAN;
  s.review = pp_cli_review_begin(opt, &review_rc);
  if (!s.review) {
    pp_passwords_free(s.passwords);
    g_free(s.key);
    return review_rc;
  }
  guint n_failed = 0;
  s.inputs = pp_inputs_collect(paths, n_paths, opt->from, &n_failed);
  if (!s.inputs) {
    pp_passwords_free(s.passwords);
    g_free(s.key);
    return PP_EXIT_USAGE;
  }
  s.totals.failed = n_failed;
  guint n = s.inputs->len;
  s.lines = g_new0(char *, n + 1);
  s.roots = g_new0(JsonNode *, n + 1);
  s.status = g_new0(const char *, n + 1);
  if (s.write_files) {
    char *rec = g_build_filename(opt->output_dir, PP_RECORD_FILE, NULL);
    s.previous = pp_records_load(rec, NULL);
    g_free(rec);
    s.records_fd = open_records(&s);
  }
  for (guint i = 0; s.write_files && i < n; i++)
    avoid_earlier_runs(&s, g_ptr_array_index(s.inputs, i));
  GArray *items = g_array_new(FALSE, TRUE, sizeof(pp_batch_item));
  GArray *mine = g_array_new(FALSE, FALSE, sizeof(guint));
  for (guint i = 0; i < n; i++) {
    pp_input *in = g_ptr_array_index(s.inputs, i);
    if (pp_inputs_shard_of(in->sha256, opt->shard_n) == opt->shard_k)
      g_array_append_val(mine, i);
  }
  s.progress = pp_progress_new(mine->len, isatty(STDERR_FILENO) && !opt->quiet, opt->progress);
  for (guint k = 0; k < mine->len; k++) {
    guint i = g_array_index(mine, guint, k);
    pp_input *in = g_ptr_array_index(s.inputs, i);
    if (in->primary >= 0)
      continue;
    JsonObject *prev = NULL;
    JsonNode *root = opt->force ? NULL : resumable(&s, in, &prev);
    if (root) {
      resume(&s, i, root, prev);
      continue;
    }
    pp_batch_item item = {in->path, pp_passwords_lookup(s.passwords, in->path, in->sha256),
                          &in->digest, i};
    g_array_append_val(items, item);
  }
  gboolean interrupted = pp_batch_run(opt, launcher, items, on_done, &s, s.progress);
  for (guint k = 0; k < mine->len; k++) {
    guint i = g_array_index(mine, guint, k);
    if (((pp_input *)g_ptr_array_index(s.inputs, i))->primary >= 0)
      record_duplicate(&s, i);
  }
  pp_progress_clear(s.progress);
  if (s.records_fd >= 0)
    close(s.records_fd);
  gboolean records_ok = !s.write_files || write_records(&s, n, interrupted);
  if (interrupted)
    fprintf(stderr,
            "plotproof: interrupted: %u of %u documents done; rerun the same command to resume\n",
            pp_progress_done(s.progress), mine->len);
  if (!opt->quiet && !opt->json && !pp_output_stdout_failed()) {
    pp_summary_print_total(&s.totals);
    pp_output_stdout_flush();
  }
  int rc = pp_cli_review_end(s.review, exit_code(&s, interrupted, records_ok));
  for (guint i = 0; i < n; i++) {
    g_free(s.lines[i]);
    if (s.roots[i])
      json_node_unref(s.roots[i]);
  }
  g_free(s.lines);
  g_free(s.roots);
  g_free(s.status);
  g_array_unref(items);
  g_array_unref(mine);
  if (s.previous)
    g_hash_table_unref(s.previous);
  pp_progress_free(s.progress);
  pp_passwords_free(s.passwords);
  g_ptr_array_unref(s.inputs);
  g_free(s.key);
  return rc;
}
