/* sarif_out.c — `scan --sarif FILE`: the batch's findings as one SARIF 2.1.0 log (OASIS
 * Static Analysis Results Interchange Format), one result per finding, each scanned PDF
 * an artifact, the page and box in the region's property bag and message. Accepted
 * findings carry an external suppression (SARIF §3.34) with who and why. */
#include <math.h>

#include "json_util.h"
#include "report.h"
#include "review.h"

#define PP_SARIF_SCHEMA "https://json.schemastore.org/sarif-2.1.0.json"

struct pp_sarif_writer {
  JsonArray *artifacts;
  JsonArray *results;
  GHashTable *rule_index; /* rule id → index + 1 */
  GPtrArray *rules;       /* of char* */
};

pp_sarif_writer *pp_sarif_writer_new(void) {
  pp_sarif_writer *w = g_new0(pp_sarif_writer, 1);
  w->artifacts = json_array_new();
  w->results = json_array_new();
  w->rule_index = g_hash_table_new_full(g_str_hash, g_str_equal, g_free, NULL);
  w->rules = g_ptr_array_new_with_free_func(g_free);
  return w;
}

void pp_sarif_writer_free(pp_sarif_writer *w) {
  if (!w)
    return;
  json_array_unref(w->artifacts);
  json_array_unref(w->results);
  g_hash_table_unref(w->rule_index);
  g_ptr_array_unref(w->rules);
  g_free(w);
}

static guint rule_index(pp_sarif_writer *w, const char *rule) {
  gpointer v = g_hash_table_lookup(w->rule_index, rule);
  if (v)
    return GPOINTER_TO_UINT(v) - 1;
  g_ptr_array_add(w->rules, g_strdup(rule));
  g_hash_table_insert(w->rule_index, g_strdup(rule), GUINT_TO_POINTER(w->rules->len));
  return w->rules->len - 1;
}

/* A file: URI for the artifact; relative paths stay relative (SARIF §3.4.3 allows it). */
static char *artifact_uri(const char *path) {
  if (g_path_is_absolute(path))
    return g_filename_to_uri(path, NULL, NULL);
  return g_uri_escape_string(path, "/", TRUE);
}

/* severe → error, the middle word → warning, the mildest → note (SARIF §3.27.10). */
static const char *level_of(const char *severity) {
  int r = pp_rv_severity_rank(severity);
  return r >= PP_SEVERITY_SEVERE ? "error" : r >= 1 ? "warning" : "note";
}

static void add_rect(JsonBuilder *b, const char *name, JsonObject *f, const char *member) {
  double r[4];
  if (!pp_rv_rect(f, member, r))
    return;
  json_builder_set_member_name(b, name);
  json_builder_begin_array(b);
  for (int i = 0; i < 4; i++)
    pp_json_add_number(b, r[i]);
  json_builder_end_array(b);
}

static void add_location(JsonBuilder *b, JsonObject *doc, JsonObject *f, const char *uri,
                         guint artifact) {
  json_builder_set_member_name(b, "locations");
  json_builder_begin_array(b);
  json_builder_begin_object(b);
  json_builder_set_member_name(b, "physicalLocation");
  json_builder_begin_object(b);
  json_builder_set_member_name(b, "artifactLocation");
  json_builder_begin_object(b);
  pp_json_member_string(b, "uri", uri);
  pp_json_member_int(b, "index", artifact);
  json_builder_end_object(b);
  json_builder_set_member_name(b, "region");
  json_builder_begin_object(b);
  const char *title = pp_rv_finding_title(doc, f);
  char *where = g_strdup_printf("page %" G_GINT64_FORMAT "%s%s%s", pp_rv_int(f, "page"),
                                title ? ", figure \"" : "", title ? title : "", title ? "\"" : "");
  json_builder_set_member_name(b, "message");
  json_builder_begin_object(b);
  pp_json_member_string(b, "text", where);
  json_builder_end_object(b);
  g_free(where);
  json_builder_set_member_name(b, "properties");
  json_builder_begin_object(b);
  pp_json_member_int(b, "page", pp_rv_int(f, "page"));
  add_rect(b, "bbox", f, "bbox");
  add_rect(b, "pdf_bbox", f, "pdf_bbox");
  json_builder_end_object(b);
  json_builder_end_object(b); /* region */
  json_builder_end_object(b); /* physicalLocation */
  json_builder_end_object(b);
  json_builder_end_array(b);
}

static void add_result(pp_sarif_writer *w, JsonObject *doc, JsonObject *f, const char *uri,
                       guint artifact, const pp_rv_acceptance *acc) {
  g_autoptr(JsonBuilder) b = json_builder_new();
  const char *rule = pp_rv_str(f, "rule") ? pp_rv_str(f, "rule") : "unknown";
  json_builder_begin_object(b);
  pp_json_member_string(b, "ruleId", rule);
  pp_json_member_int(b, "ruleIndex", rule_index(w, rule));
  pp_json_member_string(b, "level", level_of(pp_rv_str(f, "severity")));
  json_builder_set_member_name(b, "message");
  json_builder_begin_object(b);
  pp_json_member_string(
      b, "text", pp_rv_str(f, "message") ? pp_rv_str(f, "message") : pp_rv_finding_headline(f));
  json_builder_end_object(b);
  add_location(b, doc, f, uri, artifact);
  json_builder_set_member_name(b, "partialFingerprints");
  json_builder_begin_object(b);
  pp_json_member_string(b, "plotproofFinding/v1", pp_rv_str(f, "id"));
  json_builder_end_object(b);
  if (acc) {
    json_builder_set_member_name(b, "suppressions");
    json_builder_begin_array(b);
    json_builder_begin_object(b);
    pp_json_member_string(b, "kind", "external");
    pp_json_member_string(b, "status", "accepted");
    char *why = g_strdup_printf("%s (accepted by %s on %s)", acc->why ? acc->why : "",
                                acc->who ? acc->who : "?", acc->when ? acc->when : "?");
    pp_json_member_string(b, "justification", why);
    g_free(why);
    json_builder_end_object(b);
    json_builder_end_array(b);
  }
  json_builder_set_member_name(b, "properties");
  json_builder_begin_object(b);
  pp_json_member_string(b, "severity", pp_rv_str(f, "severity"));
  pp_json_member_string(b, "figureId", pp_rv_finding_figure_id(doc, f));
  pp_json_member_string(b, "figureTitle", pp_rv_finding_title(doc, f));
  JsonObject *m = pp_rv_obj(f, "measures");
  if (m) {
    json_builder_set_member_name(b, "measures");
    json_builder_add_value(b, json_node_init_object(json_node_alloc(), m));
  }
  json_builder_end_object(b);
  json_builder_end_object(b);
  json_array_add_element(w->results, json_builder_get_root(b));
}

void pp_sarif_writer_add_document(pp_sarif_writer *w, JsonObject *doc, pp_rv_accepted_func accepted,
                                  gpointer data) {
  JsonObject *d = pp_rv_obj(doc, "document");
  const char *path = pp_rv_str(d, "path") ? pp_rv_str(d, "path") : "unknown.pdf";
  char *uri = artifact_uri(path);
  guint artifact = json_array_get_length(w->artifacts);
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  json_builder_set_member_name(b, "location");
  json_builder_begin_object(b);
  pp_json_member_string(b, "uri", uri);
  json_builder_end_object(b);
  pp_json_member_string(b, "mimeType", "application/pdf");
  if (pp_rv_num(d, "size") >= 0)
    pp_json_member_int(b, "length", pp_rv_int(d, "size"));
  if (pp_rv_str(d, "sha256")) {
    json_builder_set_member_name(b, "hashes");
    json_builder_begin_object(b);
    pp_json_member_string(b, "sha-256", pp_rv_str(d, "sha256"));
    json_builder_end_object(b);
  }
  json_builder_end_object(b);
  json_array_add_element(w->artifacts, json_builder_get_root(b));
  JsonArray *list = pp_rv_arr(doc, "findings");
  for (guint i = 0; list && i < json_array_get_length(list); i++) {
    JsonObject *f = json_array_get_object_element(list, i);
    add_result(w, doc, f, uri, artifact, accepted ? accepted(pp_rv_str(f, "id"), data) : NULL);
  }
  list = pp_rv_arr(doc, "accepted");
  for (guint i = 0; list && i < json_array_get_length(list); i++) {
    JsonObject *f = json_array_get_object_element(list, i);
    JsonObject *a = pp_rv_obj(f, "acceptance");
    pp_rv_acceptance acc = {pp_rv_str(a, "who"), pp_rv_str(a, "why"), pp_rv_str(a, "when")};
    add_result(w, doc, f, uri, artifact, &acc);
  }
  g_free(uri);
}

static void add_driver(JsonBuilder *b, pp_sarif_writer *w) {
  json_builder_set_member_name(b, "tool");
  json_builder_begin_object(b);
  json_builder_set_member_name(b, "driver");
  json_builder_begin_object(b);
  pp_json_member_string(b, "name", "plotproof");
  pp_json_member_string(b, "version", PP_VERSION);
  json_builder_set_member_name(b, "rules");
  json_builder_begin_array(b);
  for (guint i = 0; i < w->rules->len; i++) {
    const char *id = g_ptr_array_index(w->rules, i);
    json_builder_begin_object(b);
    pp_json_member_string(b, "id", id);
    char *summary = pp_rule_page_summary(id);
    json_builder_set_member_name(b, "shortDescription");
    json_builder_begin_object(b);
    pp_json_member_string(b, "text", summary ? summary : id);
    json_builder_end_object(b);
    g_free(summary);
    json_builder_set_member_name(b, "help");
    json_builder_begin_object(b);
    char *help = g_strdup_printf("plotproof explain %s", id);
    pp_json_member_string(b, "text", help);
    g_free(help);
    json_builder_end_object(b);
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
  json_builder_end_object(b);
  json_builder_end_object(b);
}

gboolean pp_sarif_writer_finish(pp_sarif_writer *w, const char *path, GError **error) {
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  pp_json_member_string(b, "$schema", PP_SARIF_SCHEMA);
  pp_json_member_string(b, "version", "2.1.0");
  json_builder_set_member_name(b, "runs");
  json_builder_begin_array(b);
  json_builder_begin_object(b);
  add_driver(b, w);
  json_builder_end_object(b);
  json_builder_end_array(b);
  json_builder_end_object(b);
  JsonNode *root = json_builder_get_root(b);
  JsonObject *run = json_array_get_object_element(
      json_object_get_array_member(json_node_get_object(root), "runs"), 0);
  json_object_set_array_member(run, "artifacts", json_array_ref(w->artifacts));
  json_object_set_array_member(run, "results", json_array_ref(w->results));
  gsize len = 0;
  char *text = pp_report_node_to_string(root, TRUE, &len);
  json_node_unref(root);
  gboolean ok = g_file_set_contents(path, text, (gssize)len, error);
  g_free(text);
  return ok;
}
