/* summary.c — a few readable lines per document: what was scanned, what was found
 * (page, severity, rule, the rules stage's one-sentence message), what was not analysed. */
#include <stdio.h>
#include <string.h>

#include "cli.h"
#include "report/report.h"
#include "summary.h"

static gint64 member_int(JsonObject *o, const char *name) {
  JsonNode *n = o ? json_object_get_member(o, name) : NULL;
  return n && JSON_NODE_HOLDS_VALUE(n) ? json_node_get_int(n) : 0;
}

static const char *member_string(JsonObject *o, const char *name) {
  JsonNode *n = o ? json_object_get_member(o, name) : NULL;
  return n && JSON_NODE_HOLDS_VALUE(n) ? json_node_get_string(n) : NULL;
}

static JsonArray *member_array(JsonObject *o, const char *name) {
  JsonNode *n = o ? json_object_get_member(o, name) : NULL;
  return n && JSON_NODE_HOLDS_ARRAY(n) ? json_node_get_array(n) : NULL;
}

static JsonObject *member_object(JsonObject *o, const char *name) {
  JsonNode *n = o ? json_object_get_member(o, name) : NULL;
  return n && JSON_NODE_HOLDS_OBJECT(n) ? json_node_get_object(n) : NULL;
}

static const char *plural(gint64 n, const char *one, const char *many) {
  return n == 1 ? one : many;
}

void pp_summary_count_document(JsonObject *report, pp_summary_totals *t) {
  JsonObject *totals = member_object(report, "totals");
  JsonObject *sev = member_object(totals, "by_severity");
  t->documents++;
  t->pages += member_int(totals, "pages");
  t->figures += member_int(totals, "figures");
  t->findings += member_int(totals, "findings");
  JsonObject *th = member_object(report, "thresholds");
  JsonNode *gl = th ? json_object_get_member(th, "gdi_limit_percent") : NULL;
  JsonNode *sf = th ? json_object_get_member(th, "severe_factor") : NULL;
  if (gl && JSON_NODE_HOLDS_VALUE(gl))
    t->gdi_limit = json_node_get_double(gl);
  if (sf && JSON_NODE_HOLDS_VALUE(sf))
    t->severe_factor = json_node_get_double(sf);
  for (int s = PP_SEVERITY_MINOR; s <= PP_SEVERITY_SEVERE; s++)
    t->by_severity[s] += member_int(sev, pp_severity_name(s));
}

/* Pages whose content was only partly or not at all analysed, one line each kind. */
static void print_coverage(JsonArray *pages) {
  GString *raster = g_string_new(NULL), *scale = g_string_new(NULL);
  guint n_raster = 0, n_scale = 0;
  for (guint i = 0; pages && i < json_array_get_length(pages); i++) {
    JsonObject *p = json_array_get_object_element(pages, i);
    gint64 page = member_int(p, "page");
    const char *error = member_string(p, "error");
    if (error) {
      char *safe = pp_cli_escape(error);
      printf("  page %" G_GINT64_FORMAT ": not analysed: %s\n", page, safe);
      g_free(safe);
    }
    JsonArray *r = member_array(p, "raster_images_not_analysed");
    JsonArray *s = member_array(p, "scale_failures");
    if (r && json_array_get_length(r) > 0) {
      n_raster += json_array_get_length(r);
      g_string_append_printf(raster, "%s%" G_GINT64_FORMAT, raster->len ? ", " : "", page);
    }
    if (s && json_array_get_length(s) > 0) {
      n_scale += json_array_get_length(s);
      g_string_append_printf(scale, "%s%" G_GINT64_FORMAT, scale->len ? ", " : "", page);
    }
  }
  if (n_raster)
    printf("  not analysed: %u raster %s (page %s)\n", n_raster,
           plural(n_raster, "image", "images"), raster->str);
  if (n_scale)
    printf("  not analysed: %u %s with no readable value scale (page %s)\n", n_scale,
           plural(n_scale, "chart", "charts"), scale->str);
  g_string_free(raster, TRUE);
  g_string_free(scale, TRUE);
}

void pp_summary_print_document(JsonObject *report, const char *path, const char *output_file,
                               pp_summary_totals *t) {
  pp_summary_count_document(report, t);
  JsonObject *totals = member_object(report, "totals");
  gint64 pages = member_int(totals, "pages"), figures = member_int(totals, "figures");
  gint64 findings = member_int(totals, "findings");
  char *name = pp_cli_escape(path);
  printf("%s: %" G_GINT64_FORMAT " %s, %" G_GINT64_FORMAT " %s, ", name, pages,
         plural(pages, "page", "pages"), figures, plural(figures, "figure", "figures"));
  if (findings == 0)
    printf("no findings");
  else
    printf("%" G_GINT64_FORMAT " %s", findings, plural(findings, "finding", "findings"));
  if (output_file) {
    char *out = pp_cli_escape(output_file);
    printf("  -> %s", out);
    g_free(out);
  }
  printf("\n");
  g_free(name);
  JsonArray *list = member_array(report, "findings");
  for (guint i = 0; list && i < json_array_get_length(list); i++) {
    JsonObject *f = json_array_get_object_element(list, i);
    /* Titles and messages quote text from the PDF: escaped for the terminal. */
    const char *t = member_string(f, "figure_title"), *fig = member_string(f, "figure_id");
    char *msg = pp_cli_escape(member_string(f, "message") ? member_string(f, "message") : "");
    char *rule = pp_cli_escape(member_string(f, "rule") ? member_string(f, "rule") : "?");
    char *title = t ? pp_cli_escape(t) : NULL, *id = pp_cli_escape(fig ? fig : "?");
    printf("  page %-3" G_GINT64_FORMAT " %-8s %s %s%s%s [figure %.8s]: %s\n",
           member_int(f, "page"), member_string(f, "severity") ? member_string(f, "severity") : "?",
           rule, title ? "\"" : "", title ? title : "untitled", title ? "\"" : "", id, msg);
    g_free(msg);
    g_free(rule);
    g_free(title);
    g_free(id);
  }
  print_coverage(member_array(report, "pages"));
}

void pp_summary_print_total(const pp_summary_totals *t) {
  printf("\nTotal: %u %s scanned", t->documents, plural(t->documents, "document", "documents"));
  if (t->failed)
    printf(", %u failed", t->failed);
  printf("; %u %s, %u %s, %u %s", t->pages, plural(t->pages, "page", "pages"), t->figures,
         plural(t->figures, "figure", "figures"), t->findings,
         plural(t->findings, "finding", "findings"));
  if (t->findings)
    printf(" (%u %s, %u %s, %u %s)", t->by_severity[PP_SEVERITY_SEVERE],
           pp_severity_name(PP_SEVERITY_SEVERE), t->by_severity[PP_SEVERITY_MAJOR],
           pp_severity_name(PP_SEVERITY_MAJOR), t->by_severity[PP_SEVERITY_MINOR],
           pp_severity_name(PP_SEVERITY_MINOR));
  printf(".\n");
  if (t->findings && t->severe_factor > 0)
    printf("Severity: minor = the ink misstates a value by under %g%%, major = by %g%% up to "
           "%g×, severe = by %g× or more (worst pair of elements).\n",
           t->gdi_limit, t->gdi_limit, t->severe_factor, t->severe_factor);
  printf("%s\n", PP_REPORT_DISCLAIMER);
}
