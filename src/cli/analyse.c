/* analyse.c — the pipeline for one document, run inside the worker child: capture one
 * page, measure, recognise, score, append to the report, free the scene, next page.
 * Memory is thus bounded by the largest page, not the document. */
#include "analyse.h"
#include "geometry/geometry.h"
#include "recognize/recognize.h"

char *pp_analyse_error_payload(int code, const char *word, const char *message) {
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  json_builder_set_member_name(b, "error");
  json_builder_begin_object(b);
  json_builder_set_member_name(b, "code");
  json_builder_add_int_value(b, code);
  json_builder_set_member_name(b, "word");
  json_builder_add_string_value(b, word);
  char *valid = g_utf8_make_valid(message ? message : "", -1);
  json_builder_set_member_name(b, "message");
  json_builder_add_string_value(b, valid);
  g_free(valid);
  json_builder_end_object(b);
  json_builder_end_object(b);
  JsonNode *root = json_builder_get_root(b);
  char *s = pp_report_node_to_string(root, FALSE, NULL);
  json_node_unref(root);
  return s;
}

static char *gerror_payload(GError *error) {
  int code = error->domain == PP_CAPTURE_ERROR ? error->code : PP_CAPTURE_ERROR_DAMAGED;
  char *s = pp_analyse_error_payload(code, pp_capture_error_word(code), error->message);
  g_error_free(error);
  return s;
}

static void analyse_page(pp_report *report, pp_scene *scene, const pp_thresholds *t,
                         const pp_cli_options *opt) {
  pp_scene_measure(scene);
  pp_page_charts *charts = pp_page_charts_find(scene);
  GPtrArray *findings = g_ptr_array_new_with_free_func((GDestroyNotify)pp_finding_free);
  for (guint i = 0; charts && charts->figures && i < charts->figures->len; i++)
    pp_rules_check_figure(g_ptr_array_index(charts->figures, i), t, findings);
  pp_cli_filter_findings(opt, findings); /* rules switched off by the configuration */
  pp_report_add_page(report, scene, charts, findings);
  g_ptr_array_unref(findings);
  pp_page_charts_free(charts);
}

char *pp_analyse_document(gpointer data) {
  const pp_analyse_job *job = data;
  GError *error = NULL;
  pp_document *doc = pp_document_open(job->path, job->opt->password, &error);
  if (!doc)
    return gerror_payload(error);
  const pp_document_info *info = pp_document_get_info(doc);
  pp_report *report = pp_report_new(info, &job->opt->thresholds);
  char *first_failure = NULL;
  for (guint i = 0; i < info->n_pages; i++) {
    pp_scene *scene = pp_document_capture_page(doc, i, &error);
    if (!scene) {
      pp_report_add_failed_page(report, i, error->message);
      if (!first_failure)
        first_failure = g_strdup_printf("page %u: %s", i + 1, error->message);
      g_clear_error(&error);
      continue;
    }
    analyse_page(report, scene, &job->opt->thresholds, job->opt);
    pp_scene_free(scene);
  }
  char *payload = NULL;
  if (pp_report_n_pages_failed(report) == info->n_pages) {
    char *msg = g_strdup_printf("damaged: none of its %u pages could be captured (%s)",
                                info->n_pages, first_failure);
    payload = pp_analyse_error_payload(PP_CAPTURE_ERROR_DAMAGED, "damaged", msg);
    g_free(msg);
  } else if (job->output_file && !pp_report_write_file(report, job->output_file, &error)) {
    char *msg = g_strdup_printf("cannot write the findings file: %s", error->message);
    payload = pp_analyse_error_payload(-1, "output failed", msg);
    g_free(msg);
    g_clear_error(&error);
  } else {
    payload = pp_report_to_string(report, FALSE, NULL);
  }
  g_free(first_failure);
  pp_report_free(report);
  pp_document_free(doc);
  return payload;
}

char *pp_analyse_page(gpointer data) {
  const pp_analyse_job *job = data;
  GError *error = NULL;
  pp_document *doc = pp_document_open(job->path, job->opt->password, &error);
  if (!doc)
    return gerror_payload(error);
  pp_scene *scene = pp_document_capture_page(doc, job->opt->page - 1, &error);
  if (!scene) {
    pp_document_free(doc);
    return gerror_payload(error);
  }
  pp_scene_measure(scene);
  JsonNode *node;
  if (job->charts) {
    pp_page_charts *charts = pp_page_charts_find(scene);
    node = pp_report_charts_to_json(scene, charts);
    pp_page_charts_free(charts);
  } else {
    node = pp_report_scene_to_json(scene);
  }
  char *payload = pp_report_node_to_string(node, TRUE, NULL);
  json_node_unref(node);
  pp_scene_free(scene);
  pp_document_free(doc);
  return payload;
}
