/* analyse.c — the pipeline for one page, run inside a page child: capture, measure,
 * recognise, score, append to a one-page report. The document worker joins the pages;
 * a page that swells or hangs thus costs only itself. */
#include <math.h>
#include <string.h>
#include <unistd.h>

#include "analyse.h"
#include "geometry/geometry.h"
#include "recognize/recognize.h"

/* Library messages kept per page; a broken font can print thousands of the same line.
 * Common practice, no source. */
#define PP_ANALYSE_MAX_MESSAGES 40
/* Bytes of caught messages read per page. */
#define PP_ANALYSE_MESSAGE_BYTES (64 * 1024)

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

char *pp_analyse_gerror_payload(GError *error) {
  int code = error->domain == PP_CAPTURE_ERROR ? error->code : PP_CAPTURE_ERROR_DAMAGED;
  char *s = pp_analyse_error_payload(code, pp_capture_error_word(code), error->message);
  g_error_free(error);
  return s;
}

void pp_analyse_take_messages(int fd, GPtrArray *warnings) {
  if (fd < 0)
    return;
  char *buf = g_malloc(PP_ANALYSE_MESSAGE_BYTES + 1);
  ssize_t n = pread(fd, buf, PP_ANALYSE_MESSAGE_BYTES, 0);
  if (n > 0) {
    buf[n] = '\0';
    GHashTable *seen = g_hash_table_new(g_str_hash, g_str_equal);
    char **lines = g_strsplit(buf, "\n", -1);
    guint kept = 0, dropped = 0;
    for (char **l = lines; *l; l++) {
      g_strstrip(*l);
      if (!**l || !g_hash_table_add(seen, *l))
        continue;
      if (kept++ < PP_ANALYSE_MAX_MESSAGES)
        g_ptr_array_add(warnings, g_utf8_make_valid(*l, -1));
      else
        dropped++;
    }
    if (dropped)
      g_ptr_array_add(warnings, g_strdup_printf("%u more library messages not kept", dropped));
    g_hash_table_unref(seen);
    g_strfreev(lines);
  }
  g_free(buf);
  if (n != 0 && ftruncate(fd, 0) == 0) /* nothing written, nothing to clear */
    lseek(fd, 0, SEEK_SET);
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

/* A page box of zero, negative or non-finite size cannot hold a chart, and its width
 * would make the findings file schema-invalid (width > 0, docs/findings.schema.json). */
static gboolean usable_box(const pp_scene *scene) {
  return isfinite(scene->width) && isfinite(scene->height) && scene->width > 0 && scene->height > 0;
}

char *pp_analyse_report_page(gpointer data) {
  const pp_analyse_job *job = data;
  GError *error = NULL;
  const pp_document_info *info = pp_document_get_info(job->doc);
  pp_report *report = pp_report_new(info, &job->opt->thresholds);
  pp_scene *scene = pp_document_capture_page(job->doc, job->page_index, &error);
  if (!scene) {
    pp_report_add_failed_page(report, job->page_index, error->message);
    g_clear_error(&error);
  } else if (!usable_box(scene)) {
    char *msg = g_strdup_printf("the page box is empty or not finite (%g x %g pt)", scene->width,
                                scene->height);
    pp_report_add_failed_page(report, job->page_index, msg);
    g_free(msg);
  } else {
    pp_analyse_take_messages(job->messages_fd, scene->warnings);
    analyse_page(report, scene, &job->opt->thresholds, job->opt);
  }
  if (scene)
    pp_scene_free(scene);
  char *payload = pp_report_parts_to_string(report, NULL);
  pp_report_free(report);
  return payload;
}

char *pp_analyse_page(gpointer data) {
  const pp_analyse_job *job = data;
  GError *error = NULL;
  pp_document *doc = pp_document_open(job->path, job->password, &error);
  if (!doc)
    return pp_analyse_gerror_payload(error);
  pp_scene *scene = pp_document_capture_page(doc, job->opt->page - 1, &error);
  if (!scene) {
    pp_document_free(doc);
    return pp_analyse_gerror_payload(error);
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

char *pp_analyse_document(gpointer data) {
  const pp_analyse_job *job = data;
  GError *error = NULL;
  pp_document *doc = pp_document_open(job->path, job->password, &error);
  if (!doc)
    return pp_analyse_gerror_payload(error);
  const pp_document_info *info = pp_document_get_info(doc);
  pp_report *report = pp_report_new(info, &job->opt->thresholds);
  for (guint i = 0; i < info->n_pages; i++) {
    pp_scene *scene = pp_document_capture_page(doc, i, &error);
    if (!scene) {
      pp_report_add_failed_page(report, i, error->message);
      g_clear_error(&error);
    } else if (!usable_box(scene)) {
      pp_report_add_failed_page(report, i, "the page box is empty or not finite");
    } else {
      analyse_page(report, scene, &job->opt->thresholds, job->opt);
    }
    if (scene)
      pp_scene_free(scene);
  }
  char *payload = pp_report_n_pages_failed(report) == info->n_pages
                      ? pp_analyse_error_payload(PP_CAPTURE_ERROR_DAMAGED, "damaged",
                                                 "none of its pages could be analysed")
                      : pp_report_to_string(report, FALSE, NULL);
  pp_report_free(report);
  pp_document_free(doc);
  return payload;
}
