/* review_cli.c — what a reviewer asks of a scan beyond the findings files: the HTML pack,
 * annotated copies, CSV and SARIF for the batch, a baseline of accepted findings; and the
 * commands compare, explain, rules and accept. Rendering runs in a worker child like the
 * scan itself, so a PDF that crashes poppler costs its pictures, not the batch. */
#include <stdio.h>
#include <string.h>

#include "analyse.h"
#include "cli.h"
#include "report/review.h"
#include "worker.h"

struct pp_cli_review {
  const pp_cli_options *opt;
  pp_baseline *baseline;
  pp_csv_writer *csv;
  pp_sarif_writer *sarif;
  pp_html_index *index;
  guint n_accepted, n_annotated;
  guint n_output_failed; /* documents whose HTML page or annotated copy was not written */
  GString *accepted;     /* one line per accepted finding, printed after the summary */
};

static void review_free(pp_cli_review *rv) {
  pp_csv_writer_free(rv->csv);
  pp_sarif_writer_free(rv->sarif);
  pp_html_index_free(rv->index);
  pp_baseline_free(rv->baseline);
  g_string_free(rv->accepted, TRUE);
  g_free(rv);
}

pp_cli_review *pp_cli_review_begin(const pp_cli_options *opt, int *rc) {
  pp_cli_review *rv = g_new0(pp_cli_review, 1);
  rv->opt = opt;
  rv->accepted = g_string_new(NULL);
  if (opt->baseline_file) {
    GError *error = NULL;
    rv->baseline = pp_baseline_load(opt->baseline_file, &error);
    if (!rv->baseline) {
      pp_cli_print_file_error(opt->baseline_file, "unreadable baseline", error->message);
      g_error_free(error);
      review_free(rv);
      *rc = PP_EXIT_USAGE;
      return NULL;
    }
  }
  if (opt->csv_file)
    rv->csv = pp_csv_writer_new();
  if (opt->sarif_file)
    rv->sarif = pp_sarif_writer_new();
  if (opt->html_dir) {
    if (g_mkdir_with_parents(opt->html_dir, 0755) != 0) {
      pp_cli_print_file_error(opt->html_dir, "unwritable", "cannot create the HTML directory");
      review_free(rv);
      *rc = PP_EXIT_USAGE;
      return NULL;
    }
    rv->index = pp_html_index_new();
  }
  return rv;
}

/* "<base>.findings.json" → "<base><suffix>". */
static char *sibling_name(const char *output_name, const char *suffix) {
  const char *cut = g_strrstr(output_name, ".findings.json");
  gsize n = cut ? (gsize)(cut - output_name) : strlen(output_name);
  char *base = g_strndup(output_name, n);
  char *out = g_strconcat(base, suffix, NULL);
  g_free(base);
  return out;
}

typedef struct {
  pp_cli_review *rv;
  JsonObject *doc;
  const char *pdf_path, *page_name, *annotated;
} render_job;

/* In the worker child: the pictures and pages that need poppler. */
static char *render_document(gpointer data) {
  render_job *job = data;
  GError *error = NULL;
  GString *errors = g_string_new(NULL);
  if (job->page_name && !pp_html_write_document(job->rv->opt->html_dir, job->page_name, job->doc,
                                                job->pdf_path, job->rv->opt->password, &error)) {
    g_string_append_printf(errors, "HTML page: %s; ", error->message);
    g_clear_error(&error);
  }
  guint n = 0;
  if (job->annotated && !pp_annotate_write(job->pdf_path, job->rv->opt->password, job->doc,
                                           job->annotated, &n, &error)) {
    g_string_append_printf(errors, "annotated copy: %s", error->message);
    g_clear_error(&error);
  }
  return errors->len ? pp_analyse_error_payload(-1, "output failed", g_string_free(errors, FALSE))
                     : (g_string_free(errors, TRUE), g_strdup("{}"));
}

void pp_cli_review_document(pp_cli_review *rv, JsonNode *root, const char *pdf_path,
                            const char *output_name) {
  if (!rv)
    return;
  JsonObject *doc = json_node_get_object(root);
  if (rv->baseline) {
    pp_baseline_apply(rv->baseline, doc);
    JsonArray *acc = pp_rv_arr(doc, "accepted");
    for (guint i = 0; acc && i < json_array_get_length(acc); i++) {
      JsonObject *f = json_array_get_object_element(acc, i), *a = pp_rv_obj(f, "acceptance");
      const char *title = pp_rv_finding_title(doc, f);
      char *name = g_filename_display_name(pdf_path);
      g_string_append_printf(
          rv->accepted, "  %s page %" G_GINT64_FORMAT " %s \"%s\": accepted by %s on %s: %s\n",
          name, pp_rv_int(f, "page"), pp_rv_str(f, "rule"), title ? title : "untitled",
          pp_rv_str(a, "who"), pp_rv_str(a, "when"), pp_rv_str(a, "why"));
      g_free(name);
      rv->n_accepted++;
    }
  }
  if (rv->csv)
    pp_csv_writer_add_document(rv->csv, doc, NULL, NULL);
  if (rv->sarif)
    pp_sarif_writer_add_document(rv->sarif, doc, NULL, NULL);
  JsonArray *list = pp_rv_arr(doc, "findings");
  gboolean flagged = list && json_array_get_length(list) > 0;
  char *page_name = rv->index ? sibling_name(output_name, ".html") : NULL;
  char *annotated = NULL;
  if (rv->opt->annotate && flagged) {
    char *name = sibling_name(output_name, ".annotated.pdf");
    annotated = g_build_filename(rv->opt->output_dir, name, NULL);
    g_free(name);
  }
  if (page_name || annotated) {
    render_job job = {rv, doc, pdf_path, page_name, annotated};
    pp_worker_result res;
    pp_worker_run(render_document, &job, &(pp_worker_limits){rv->opt->timeout_s, 0, 0}, &res);
    if (res.outcome != PP_WORKER_DONE) {
      pp_cli_print_file_error(pdf_path, "output failed", "rendering the review pages stopped");
      rv->n_output_failed++;
    } else if (strstr(res.payload->str, "\"error\"")) {
      pp_cli_print_file_error(pdf_path, "output failed", res.payload->str);
      rv->n_output_failed++;
    }
    g_string_free(res.payload, TRUE);
    if (annotated && res.outcome == PP_WORKER_DONE)
      rv->n_annotated++;
  }
  if (rv->index)
    pp_html_index_add(rv->index, doc, page_name);
  g_free(page_name);
  g_free(annotated);
}

static void print_accepted_and_stale(pp_cli_review *rv) {
  if (!rv->baseline)
    return;
  if (!rv->opt->quiet && !rv->opt->json && rv->n_accepted)
    printf("%u accepted %s listed apart (baseline %s), not counted above:\n%s", rv->n_accepted,
           rv->n_accepted == 1 ? "finding" : "findings", rv->opt->baseline_file, rv->accepted->str);
  GPtrArray *stale = pp_baseline_stale(rv->baseline);
  for (guint i = 0; i < stale->len; i++) {
    char *msg = g_strdup_printf("baseline entry %s matches no finding any more (fixed, or the "
                                "figure changed): remove it or review again",
                                (const char *)g_ptr_array_index(stale, i));
    fprintf(stderr, "plotproof: %s: warning: %s\n", rv->opt->baseline_file, msg);
    g_free(msg);
  }
  g_ptr_array_unref(stale);
}

int pp_cli_review_end(pp_cli_review *rv, int rc) {
  if (!rv)
    return rc;
  GError *error = NULL;
  if (rv->csv && !pp_csv_writer_finish(rv->csv, rv->opt->csv_file, &error)) {
    pp_cli_print_file_error(rv->opt->csv_file, "unwritable", error->message);
    g_clear_error(&error);
    rc = PP_EXIT_PARTIAL;
  }
  if (rv->sarif && !pp_sarif_writer_finish(rv->sarif, rv->opt->sarif_file, &error)) {
    pp_cli_print_file_error(rv->opt->sarif_file, "unwritable", error->message);
    g_clear_error(&error);
    rc = PP_EXIT_PARTIAL;
  }
  if (rv->index && !pp_html_index_finish(rv->index, rv->opt->html_dir, &error)) {
    pp_cli_print_file_error(rv->opt->html_dir, "unwritable", error->message);
    g_clear_error(&error);
    rc = PP_EXIT_PARTIAL;
  }
  /* A review output that was asked for and not written is a partial run, not a clean one. */
  if (rv->n_output_failed > 0 && (rc == PP_EXIT_CLEAN || rc == PP_EXIT_FINDINGS))
    rc = PP_EXIT_PARTIAL;
  if (rv->index && !rv->opt->quiet && !rv->opt->json)
    printf("Review pack: %s/index.html\n", rv->opt->html_dir);
  if (rv->opt->annotate && !rv->opt->quiet && !rv->opt->json)
    printf("Annotated copies: %u in %s\n", rv->n_annotated, rv->opt->output_dir);
  print_accepted_and_stale(rv);
  review_free(rv);
  return rc;
}

static gboolean below_minimum(const pp_cli_options *opt, const pp_finding *f) {
  for (guint i = 0; opt->min_severity && i < opt->min_severity->len; i++) {
    const char *spec = g_ptr_array_index(opt->min_severity, i);
    const char *eq = strchr(spec, '=');
    if (!eq || strncmp(spec, f->rule, (size_t)(eq - spec)) != 0 || f->rule[eq - spec])
      continue;
    if (pp_rv_severity_rank(pp_severity_name(f->severity)) < pp_rv_severity_rank(eq + 1))
      return TRUE;
  }
  return FALSE;
}

void pp_cli_filter_findings(const pp_cli_options *opt, GPtrArray *findings) {
  for (guint i = findings->len; i-- > 0;) {
    const pp_finding *f = g_ptr_array_index(findings, i);
    gboolean off = FALSE;
    for (guint k = 0; opt->disabled_rules && k < opt->disabled_rules->len; k++)
      off |= g_strcmp0(g_ptr_array_index(opt->disabled_rules, k), f->rule) == 0;
    if (off || below_minimum(opt, f))
      g_ptr_array_remove_index(findings, i);
  }
}

/* A findings file as given, or a PDF scanned now in a worker. */
static JsonNode *load_side(const char *path, const pp_cli_options *opt) {
  g_autoptr(JsonParser) parser = json_parser_new();
  GError *error = NULL;
  if (g_str_has_suffix(path, ".json")) {
    if (!json_parser_load_from_file(parser, path, &error)) {
      pp_cli_print_file_error(path, "unreadable", error->message);
      g_error_free(error);
      return NULL;
    }
  } else {
    pp_analyse_job job = {.path = path, .opt = opt, .messages_fd = -1};
    pp_worker_result res;
    pp_worker_run(pp_analyse_document, &job, &(pp_worker_limits){opt->timeout_s, 0, 0}, &res);
    gboolean ok =
        res.outcome == PP_WORKER_DONE &&
        json_parser_load_from_data(parser, res.payload->str, (gssize)res.payload->len, NULL);
    g_string_free(res.payload, TRUE);
    if (!ok) {
      pp_cli_print_file_error(path, "damaged", "the scan did not finish");
      return NULL;
    }
  }
  JsonNode *root = json_parser_get_root(parser);
  if (!root || !JSON_NODE_HOLDS_OBJECT(root) ||
      !json_object_has_member(json_node_get_object(root), "findings")) {
    JsonObject *err = root && JSON_NODE_HOLDS_OBJECT(root)
                          ? pp_rv_obj(json_node_get_object(root), "error")
                          : NULL;
    pp_cli_print_file_error(path, err ? pp_rv_str(err, "word") : "not a findings file",
                            err ? pp_rv_str(err, "message") : "no findings member");
    return NULL;
  }
  return json_node_copy(root);
}

int pp_cli_compare(const char *old_path, const char *new_path, const pp_cli_options *opt) {
  JsonNode *old = load_side(old_path, opt), *nw = old ? load_side(new_path, opt) : NULL;
  if (!old || !nw) {
    if (old)
      json_node_unref(old);
    return PP_EXIT_USAGE;
  }
  JsonNode *c = pp_compare_documents(json_node_get_object(old), json_node_get_object(nw));
  JsonObject *co = json_node_get_object(c);
  int rc = PP_EXIT_CLEAN;
  if (opt->html_dir) {
    char *html = pp_compare_to_html(co);
    GError *error = NULL;
    if (!g_file_set_contents(opt->html_dir, html, -1, &error)) {
      pp_cli_print_file_error(opt->html_dir, "unwritable", error->message);
      g_error_free(error);
      rc = PP_EXIT_USAGE;
    }
    g_free(html);
  }
  char *text = opt->json ? pp_report_node_to_string(c, TRUE, NULL) : pp_compare_to_text(co);
  if (!opt->quiet)
    printf("%s\n", text);
  g_free(text);
  JsonArray *fresh = pp_rv_arr(co, "new_findings");
  if (rc == PP_EXIT_CLEAN && fresh && json_array_get_length(fresh) > 0)
    rc = PP_EXIT_FINDINGS; /* new findings in the new draft, like a scan with findings */
  json_node_unref(c);
  json_node_unref(old);
  json_node_unref(nw);
  return rc;
}

int pp_cli_explain(const char *rule_id) {
  char *page = pp_rule_page_get(rule_id);
  if (!page) {
    fprintf(stderr, "plotproof: no rule '%s'; 'plotproof rules' lists them\n", rule_id);
    return PP_EXIT_USAGE;
  }
  fputs(page, stdout);
  g_free(page);
  return PP_EXIT_CLEAN;
}

int pp_cli_rules(void) {
  char **ids = pp_rule_page_list();
  for (guint i = 0; ids[i]; i++) {
    char *summary = pp_rule_page_summary(ids[i]);
    printf("%-16s %s\n", ids[i], summary ? summary : "");
    g_free(summary);
  }
  g_strfreev(ids);
  return PP_EXIT_CLEAN;
}

int pp_cli_accept(const char *findings_file, char **ids, int n_ids, const pp_cli_options *opt) {
  if (!opt->baseline_file) {
    fprintf(stderr, "plotproof: accept needs --baseline FILE\n");
    return PP_EXIT_USAGE;
  }
  JsonNode *root = load_side(findings_file, opt);
  if (!root)
    return PP_EXIT_USAGE;
  int rc = PP_EXIT_CLEAN;
  for (int i = 0; i < n_ids; i++) {
    GError *error = NULL;
    if (!pp_baseline_accept(opt->baseline_file, json_node_get_object(root), ids[i], opt->who,
                            opt->why, &error)) {
      pp_cli_print_file_error(findings_file, "not accepted", error->message);
      g_error_free(error);
      rc = PP_EXIT_USAGE;
    } else if (!opt->quiet) {
      printf("accepted %s -> %s\n", ids[i], opt->baseline_file);
    }
  }
  json_node_unref(root);
  return rc;
}
