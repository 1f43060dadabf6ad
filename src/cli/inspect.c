/* inspect.c — `plotproof scene` and `plotproof charts`: one page as JSON on stdout,
 * produced in a worker child like a scan, so a hostile page cannot take the tool down. */
#include <stdio.h>

#include "analyse.h"
#include "worker.h"

int pp_cli_inspect(const char *path, gboolean charts, const pp_cli_options *opt) {
  GError *error = NULL;
  if (!pp_capture_self_test(&error)) {
    fprintf(stderr, "plotproof: %s\n", error->message);
    g_error_free(error);
    return PP_EXIT_USAGE;
  }
  pp_analyse_job job = {path, NULL, opt, charts};
  pp_worker_result res;
  pp_worker_run(pp_analyse_page, &job, opt->timeout_s, &res);
  int rc = PP_EXIT_USAGE;
  if (res.outcome == PP_WORKER_SIGNALLED) {
    char *msg = g_strdup_printf("the capture crashed (signal %d)", res.signal);
    pp_cli_print_file_error(path, "damaged", msg);
    g_free(msg);
  } else if (res.outcome == PP_WORKER_TIMED_OUT) {
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
      fwrite(res.payload->str, 1, res.payload->len, stdout);
      fputc('\n', stdout);
      rc = PP_EXIT_CLEAN;
    }
  }
  g_string_free(res.payload, TRUE);
  return rc;
}
