/* scan.c — `plotproof scan`: one worker child per document, so a crash or a hang in
 * poppler costs one document, not the batch; then the summary and the exit code. */
#include <stdio.h>
#include <string.h>

#include "analyse.h"
#include "inputs.h"
#include "summary.h"
#include "worker.h"

/* Reports a worker that did not deliver; returns FALSE so the caller counts a failure. */
static gboolean report_worker_failure(const char *path, const pp_worker_result *res,
                                      guint timeout_s) {
  char *msg = NULL;
  switch (res->outcome) {
  case PP_WORKER_SIGNALLED:
    msg = g_strdup_printf("the capture crashed (signal %d)", res->signal);
    pp_cli_print_file_error(path, "damaged", msg);
    break;
  case PP_WORKER_TIMED_OUT:
    msg = g_strdup_printf("timed out after %u s", timeout_s);
    pp_cli_print_file_error(path, "timed out", msg);
    break;
  case PP_WORKER_EXITED:
    msg = g_strdup_printf("the capture ended without a result (exit status %d)", res->exit_status);
    pp_cli_print_file_error(path, "damaged", msg);
    break;
  case PP_WORKER_NO_FORK: pp_cli_print_file_error(path, "not scanned", res->payload->str); break;
  case PP_WORKER_DONE: return TRUE;
  }
  g_free(msg);
  return FALSE;
}

/* The payload is a findings object or {"error": ...}; returns the parsed root or NULL. */
static JsonNode *parse_payload(const char *path, const GString *payload) {
  g_autoptr(JsonParser) parser = json_parser_new();
  GError *error = NULL;
  if (!json_parser_load_from_data(parser, payload->str, (gssize)payload->len, &error) ||
      !JSON_NODE_HOLDS_OBJECT(json_parser_get_root(parser))) {
    pp_cli_print_file_error(path, "damaged", "the capture returned an unreadable result");
    g_clear_error(&error);
    return NULL;
  }
  JsonObject *root = json_node_get_object(json_parser_get_root(parser));
  JsonNode *err = json_object_get_member(root, "error");
  if (err && JSON_NODE_HOLDS_OBJECT(err)) {
    JsonObject *e = json_node_get_object(err);
    pp_cli_print_file_error(path, json_object_get_string_member_with_default(e, "word", "error"),
                            json_object_get_string_member_with_default(e, "message", ""));
    return NULL;
  }
  return json_node_copy(json_parser_get_root(parser));
}

static gboolean make_output_dir(const pp_cli_options *opt) {
  if (g_mkdir_with_parents(opt->output_dir, 0755) == 0 &&
      g_file_test(opt->output_dir, G_FILE_TEST_IS_DIR))
    return TRUE;
  pp_cli_print_file_error(opt->output_dir, "unwritable", "cannot create the output directory");
  return FALSE;
}

int pp_cli_scan(char **paths, int n_paths, const pp_cli_options *opt) {
  GError *error = NULL;
  if (!pp_capture_self_test(&error)) {
    fprintf(stderr, "plotproof: %s\n", error->message);
    g_error_free(error);
    return PP_EXIT_USAGE;
  }
  /* Files go to --output; with --json only when --output was asked for explicitly,
   * so a pipe does not litter the current directory. */
  gboolean write_files = !opt->json || opt->output_given;
  if (write_files && !make_output_dir(opt))
    return PP_EXIT_USAGE;
  int review_rc = PP_EXIT_CLEAN;
  pp_cli_review *review = pp_cli_review_begin(opt, &review_rc);
  if (!review)
    return review_rc;
  guint n_failed = 0;
  GPtrArray *inputs = pp_inputs_collect(paths, n_paths, &n_failed);
  pp_summary_totals totals = {0};
  for (guint i = 0; i < inputs->len; i++) {
    pp_input *in = g_ptr_array_index(inputs, i);
    char *out = write_files ? g_build_filename(opt->output_dir, in->output_name, NULL) : NULL;
    pp_analyse_job job = {in->path, out, opt, FALSE};
    pp_worker_result res;
    pp_worker_run(pp_analyse_document, &job, opt->timeout_s, &res);
    JsonNode *root = NULL;
    if (report_worker_failure(in->path, &res, opt->timeout_s))
      root = parse_payload(in->path, res.payload);
    if (root) /* baseline, HTML, annotated copy, CSV and SARIF rows */
      pp_cli_review_document(review, root, in->path, in->output_name);
    if (!root) {
      n_failed++;
    } else if (opt->json) {
      fwrite(res.payload->str, 1, res.payload->len, stdout);
      fputc('\n', stdout);
      fflush(stdout);
      pp_summary_count_document(json_node_get_object(root), &totals);
    } else if (opt->quiet) {
      pp_summary_count_document(json_node_get_object(root), &totals);
    } else {
      pp_summary_print_document(json_node_get_object(root), in->path, out, &totals);
    }
    if (root)
      json_node_unref(root);
    g_string_free(res.payload, TRUE);
    g_free(out);
  }
  totals.failed = n_failed;
  if (!opt->quiet && !opt->json)
    pp_summary_print_total(&totals);
  g_ptr_array_unref(inputs);
  int rc = totals.documents == 0 ? PP_EXIT_USAGE
           : n_failed > 0        ? PP_EXIT_PARTIAL
           : totals.findings > 0 ? PP_EXIT_FINDINGS
                                 : PP_EXIT_CLEAN;
  return pp_cli_review_end(review, rc);
}
