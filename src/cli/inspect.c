/* inspect.c — `plotproof scene` and `plotproof charts`: one page as JSON on stdout,
 * produced in a worker child like a scan, so a hostile page cannot take the tool down. */
#include <signal.h>
#include <stdio.h>

#include "analyse.h"
#include "output.h"
#include "worker.h"

int pp_cli_inspect(const char *path, gboolean charts, const pp_cli_options *opt) {
  GError *error = NULL;
  if (!pp_capture_self_test(&error)) {
    fprintf(stderr, "plotproof: %s\n", error->message);
    g_error_free(error);
    return PP_EXIT_USAGE;
  }
  pp_analyse_job job = {path, opt->password, opt, charts, NULL, 0, -1};
  pp_worker_limits limits = {opt->timeout_s, opt->cpu_s, (guint64)opt->memory_mib << 20};
  pp_worker_result res;
  pp_worker_run(pp_analyse_page, &job, &limits, &res);
  int rc = PP_EXIT_ALL_FAILED; /* the one input failed */
  if (res.outcome == PP_WORKER_SIGNALLED && res.signal != SIGXCPU) {
    char *msg = g_strdup_printf("the capture crashed (signal %d)", res.signal);
    pp_cli_print_file_error(path, "damaged", msg);
    g_free(msg);
  } else if (res.outcome == PP_WORKER_TIMED_OUT ||
             (res.outcome == PP_WORKER_SIGNALLED && res.signal == SIGXCPU)) {
    char *msg = g_strdup_printf("timed out after %u s", opt->timeout_s);
    pp_cli_print_file_error(path, "timed out", msg);
    g_free(msg);
  } else if (res.outcome != PP_WORKER_DONE) {
    pp_cli_print_file_error(path, "damaged", "the capture ended without a result");
  } else {
    g_autoptr(JsonParser) parser = json_parser_new();
    JsonObject *root = NULL;
    if (json_parser_load_from_data(parser, res.payload->str, (gssize)res.payload->len, NULL) &&
        JSON_NODE_HOLDS_OBJECT(json_parser_get_root(parser)))
      root = json_node_get_object(json_parser_get_root(parser));
    JsonObject *err = root && json_object_has_member(root, "error")
                          ? json_object_get_object_member(root, "error")
                          : NULL;
    if (!root) {
      pp_cli_print_file_error(path, "damaged", "the capture returned an unreadable result");
    } else if (err) {
      pp_cli_print_file_error(path,
                              json_object_get_string_member_with_default(err, "word", "error"),
                              json_object_get_string_member_with_default(err, "message", ""));
    } else {
      g_string_append_c(res.payload, '\n');
      rc =
          pp_output_stdout(res.payload->str, res.payload->len) ? PP_EXIT_CLEAN : PP_EXIT_ALL_FAILED;
    }
  }
  g_string_free(res.payload, TRUE);
  return rc;
}
