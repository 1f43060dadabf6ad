/* compare.c — `plotproof compare OLD NEW`: the findings of two drafts of one report as
 * new, resolved and unchanged. Findings are matched first by their stable id (a content
 * fingerprint of figure and rule with no page number, so added or removed pages and
 * moved figures change nothing), then by rule and figure title (the same chart with
 * edited numbers is the same finding, still open). */
#include <string.h>

#include "json_util.h"
#include "report.h"
#include "review.h"

static void add_side(JsonBuilder *b, const char *name, JsonObject *doc) {
  JsonObject *d = pp_rv_obj(doc, "document");
  JsonArray *list = pp_rv_arr(doc, "findings");
  json_builder_set_member_name(b, name);
  json_builder_begin_object(b);
  pp_json_member_string(b, "path", pp_rv_str(d, "path"));
  pp_json_member_string(b, "sha256", pp_rv_str(d, "sha256"));
  pp_json_member_int(b, "pages", pp_rv_int(d, "pages"));
  pp_json_member_int(b, "findings", list ? json_array_get_length(list) : 0);
  json_builder_end_object(b);
}

/* The few members a reader of a comparison needs about one finding. */
static void add_brief(JsonBuilder *b, JsonObject *doc, JsonObject *f) {
  json_builder_begin_object(b);
  pp_json_member_string(b, "id", pp_rv_str(f, "id"));
  pp_json_member_int(b, "page", pp_rv_int(f, "page"));
  pp_json_member_string(b, "figure_id", pp_rv_finding_figure_id(doc, f));
  pp_json_member_string(b, "figure_title", pp_rv_finding_title(doc, f));
  pp_json_member_string(b, "rule", pp_rv_str(f, "rule"));
  pp_json_member_string(b, "severity", pp_rv_str(f, "severity"));
  pp_json_member_string(b, "headline", pp_rv_finding_headline(f));
  pp_json_member_number(b, "lie_factor", pp_rv_lie_factor(pp_rv_obj(f, "measures")));
  json_builder_end_object(b);
}

static gboolean same_figure(JsonObject *old_doc, JsonObject *o, JsonObject *new_doc,
                            JsonObject *n) {
  const char *to = pp_rv_finding_title(old_doc, o), *tn = pp_rv_finding_title(new_doc, n);
  return to && tn && strcmp(to, tn) == 0 &&
         g_strcmp0(pp_rv_str(o, "rule"), pp_rv_str(n, "rule")) == 0;
}

JsonNode *pp_compare_documents(JsonObject *old_doc, JsonObject *new_doc) {
  JsonArray *ol = pp_rv_arr(old_doc, "findings"), *nl = pp_rv_arr(new_doc, "findings");
  guint no = ol ? json_array_get_length(ol) : 0, nn = nl ? json_array_get_length(nl) : 0;
  gint *match = g_new(gint, no + 1); /* old index → new index, −1 */
  gboolean *used = g_new0(gboolean, nn + 1);
  const char **how = g_new0(const char *, no + 1);
  for (guint i = 0; i < no; i++) {
    match[i] = -1;
    const char *id = pp_rv_str(json_array_get_object_element(ol, i), "id");
    for (guint j = 0; id && j < nn; j++)
      if (!used[j] && g_strcmp0(id, pp_rv_str(json_array_get_object_element(nl, j), "id")) == 0) {
        match[i] = (gint)j, used[j] = TRUE, how[i] = "id";
        break;
      }
  }
  for (guint i = 0; i < no; i++) {
    if (match[i] >= 0)
      continue;
    for (guint j = 0; j < nn; j++)
      if (!used[j] && same_figure(old_doc, json_array_get_object_element(ol, i), new_doc,
                                  json_array_get_object_element(nl, j))) {
        match[i] = (gint)j, used[j] = TRUE, how[i] = "rule and figure title";
        break;
      }
  }
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  pp_json_member_string(b, "format", "plotproof-comparison");
  pp_json_member_int(b, "version", 1);
  add_side(b, "old", old_doc);
  add_side(b, "new", new_doc);
  json_builder_set_member_name(b, "new_findings");
  json_builder_begin_array(b);
  for (guint j = 0; j < nn; j++)
    if (!used[j])
      add_brief(b, new_doc, json_array_get_object_element(nl, j));
  json_builder_end_array(b);
  json_builder_set_member_name(b, "resolved");
  json_builder_begin_array(b);
  for (guint i = 0; i < no; i++)
    if (match[i] < 0)
      add_brief(b, old_doc, json_array_get_object_element(ol, i));
  json_builder_end_array(b);
  json_builder_set_member_name(b, "unchanged");
  json_builder_begin_array(b);
  for (guint i = 0; i < no; i++) {
    if (match[i] < 0)
      continue;
    json_builder_begin_object(b);
    pp_json_member_string(b, "matched_by", how[i]);
    json_builder_set_member_name(b, "old");
    add_brief(b, old_doc, json_array_get_object_element(ol, i));
    json_builder_set_member_name(b, "new");
    add_brief(b, new_doc, json_array_get_object_element(nl, (guint)match[i]));
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
  json_builder_end_object(b);
  g_free(match), g_free(used), g_free(how);
  return json_builder_get_root(b);
}

static void text_line(GString *o, JsonObject *f, const char *page) {
  const char *title = pp_rv_str(f, "figure_title");
  g_string_append_printf(o, "  page %-8s %-9s %s%s%s%s: %s\n", page, pp_rv_str(f, "severity"),
                         pp_rv_str(f, "rule"), title ? " \"" : "", title ? title : "",
                         title ? "\"" : "", pp_rv_str(f, "headline"));
}

static void text_section(GString *o, JsonObject *c, const char *member, const char *heading) {
  JsonArray *a = pp_rv_arr(c, member);
  guint n = a ? json_array_get_length(a) : 0;
  g_string_append_printf(o, "%s (%u):\n", heading, n);
  for (guint i = 0; i < n; i++) {
    JsonObject *e = json_array_get_object_element(a, i);
    JsonObject *old = pp_rv_obj(e, "old"), *nw = pp_rv_obj(e, "new");
    char page[32];
    if (old && nw) {
      if (pp_rv_int(old, "page") == pp_rv_int(nw, "page"))
        g_snprintf(page, sizeof page, "%" G_GINT64_FORMAT, pp_rv_int(nw, "page"));
      else
        g_snprintf(page, sizeof page, "%" G_GINT64_FORMAT "→%" G_GINT64_FORMAT,
                   pp_rv_int(old, "page"), pp_rv_int(nw, "page"));
      text_line(o, nw, page);
    } else {
      g_snprintf(page, sizeof page, "%" G_GINT64_FORMAT, pp_rv_int(e, "page"));
      text_line(o, e, page);
    }
  }
}

char *pp_compare_to_text(JsonObject *c) {
  GString *o = g_string_new(NULL);
  JsonObject *old = pp_rv_obj(c, "old"), *nw = pp_rv_obj(c, "new");
  g_string_append_printf(o, "old: %s (%" G_GINT64_FORMAT " pages, %" G_GINT64_FORMAT " findings)\n",
                         pp_rv_str(old, "path"), pp_rv_int(old, "pages"),
                         pp_rv_int(old, "findings"));
  g_string_append_printf(o,
                         "new: %s (%" G_GINT64_FORMAT " pages, %" G_GINT64_FORMAT " findings)\n\n",
                         pp_rv_str(nw, "path"), pp_rv_int(nw, "pages"), pp_rv_int(nw, "findings"));
  text_section(o, c, "new_findings", "New");
  text_section(o, c, "resolved", "Resolved");
  text_section(o, c, "unchanged", "Unchanged (still open)");
  return g_string_free(o, FALSE);
}

static void html_section(GString *o, JsonObject *c, const char *member, const char *heading) {
  JsonArray *a = pp_rv_arr(c, member);
  guint n = a ? json_array_get_length(a) : 0;
  g_string_append_printf(o, "<h2>%s (%u)</h2>\n", heading, n);
  if (!n)
    return;
  g_string_append(o, "<table>\n<tr><th>page</th><th>severity</th><th>rule</th><th>figure</th>"
                     "<th>headline</th></tr>\n");
  for (guint i = 0; i < n; i++) {
    JsonObject *e = json_array_get_object_element(a, i);
    JsonObject *old = pp_rv_obj(e, "old"), *f = pp_rv_obj(e, "new") ? pp_rv_obj(e, "new") : e;
    g_string_append(o, "<tr><td class=\"n\">");
    if (old && pp_rv_int(old, "page") != pp_rv_int(f, "page"))
      g_string_append_printf(o, "%" G_GINT64_FORMAT " → ", pp_rv_int(old, "page"));
    g_string_append_printf(o, "%" G_GINT64_FORMAT "</td><td>", pp_rv_int(f, "page"));
    pp_html_append_escaped(o, pp_rv_str(f, "severity"));
    g_string_append(o, "</td><td><code>");
    pp_html_append_escaped(o, pp_rv_str(f, "rule"));
    g_string_append(o, "</code></td><td>");
    pp_html_append_escaped(o, pp_rv_str(f, "figure_title") ? pp_rv_str(f, "figure_title")
                                                           : "untitled");
    g_string_append(o, "</td><td>");
    pp_html_append_escaped(o, pp_rv_str(f, "headline"));
    g_string_append(o, "</td></tr>\n");
  }
  g_string_append(o, "</table>\n");
}

char *pp_compare_to_html(JsonObject *c) {
  GString *o = g_string_new(NULL);
  pp_html_begin(o, "plotproof: two drafts compared", NULL);
  JsonObject *old = pp_rv_obj(c, "old"), *nw = pp_rv_obj(c, "new");
  g_string_append(o, "<h1>Two drafts compared</h1>\n<p>Old: ");
  pp_html_append_escaped(o, pp_rv_str(old, "path"));
  g_string_append_printf(o, " (%" G_GINT64_FORMAT " pages)<br>New: ", pp_rv_int(old, "pages"));
  pp_html_append_escaped(o, pp_rv_str(nw, "path"));
  g_string_append_printf(o, " (%" G_GINT64_FORMAT " pages)</p>\n", pp_rv_int(nw, "pages"));
  html_section(o, c, "new_findings", "New");
  html_section(o, c, "resolved", "Resolved");
  html_section(o, c, "unchanged", "Unchanged (still open)");
  pp_html_end(o);
  return g_string_free(o, FALSE);
}
