/* assemble.c — joins per-page findings objects. The totals of the findings file are sums
 * over pages (docs/findings-format.md), so they are recomputed from the parts here and
 * can never disagree with the pages and findings actually kept. */
#include <string.h>

#include "assemble.h"
#include "record.h"
#include "rules/rules.h"

/* A header claiming more pages than this is a corrupt line: at the 30 s page budget such a
 * document would take over a month of CPU, and filling that many missing page entries
 * costs hundreds of MB (fuzz_events found headers of 9,888,888 and 1,048,575 pages
 * exhausting a 2 GB limit). No outside source. */
#define MAX_DOCUMENT_PAGES (1u << 17)

struct pp_assembly {
  JsonNode *header; /* from {"open": ...} */
  GPtrArray *pages; /* JsonNode* per page index, NULL until reported */
  char *error_word, *error_reason, *stop_reason, *first_page_error;
  gboolean ended;
  int last_started; /* 0-based, -1 before any */
  guint done, failed, bad_lines;
  long max_rss_kib;
};

pp_assembly *pp_assembly_new(void) {
  pp_assembly *as = g_new0(pp_assembly, 1);
  as->pages = g_ptr_array_new_with_free_func((GDestroyNotify)json_node_unref);
  as->last_started = -1;
  return as;
}

void pp_assembly_free(pp_assembly *as) {
  if (!as)
    return;
  if (as->header)
    json_node_unref(as->header);
  g_ptr_array_unref(as->pages);
  g_free(as->error_word);
  g_free(as->error_reason);
  g_free(as->stop_reason);
  g_free(as->first_page_error);
  g_free(as);
}

/* A worker's line is untrusted input: json-glib's typed getters print a "critical" warning
 * when a member is an object or array where they expect a value, so members are read through
 * these, which check the node type first and fall back otherwise. */
static JsonNode *value_member(JsonObject *o, const char *name) {
  JsonNode *n = o ? json_object_get_member(o, name) : NULL;
  return n && JSON_NODE_HOLDS_VALUE(n) ? n : NULL;
}

static const char *string_member(JsonObject *o, const char *name, const char *fallback) {
  JsonNode *n = value_member(o, name);
  return n && json_node_get_value_type(n) == G_TYPE_STRING ? json_node_get_string(n) : fallback;
}

static gint64 int_member(JsonObject *o, const char *name, gint64 fallback) {
  JsonNode *n = value_member(o, name);
  return n ? json_node_get_int(n) : fallback;
}

static gboolean bool_member(JsonObject *o, const char *name, gboolean fallback) {
  JsonNode *n = value_member(o, name);
  return n ? json_node_get_boolean(n) : fallback;
}

/* The array member name of o, or NULL (json-glib warns on a missing member). */
static JsonArray *array_member(JsonObject *o, const char *name) {
  JsonNode *n = o ? json_object_get_member(o, name) : NULL;
  return n && JSON_NODE_HOLDS_ARRAY(n) ? json_node_get_array(n) : NULL;
}

/* The page entry's error text, NULL when the page was analysed. */
static const char *page_error(JsonObject *page) {
  return string_member(page, "error", NULL);
}

static JsonNode *failed_page(guint index, const char *reason) {
  JsonObject *o = json_object_new();
  json_object_set_int_member(o, "page", index + 1);
  json_object_set_string_member(o, "error", reason);
  JsonNode *n = json_node_new(JSON_NODE_OBJECT);
  json_node_take_object(n, o);
  return n;
}

static guint header_pages(const pp_assembly *as);

static void set_page(pp_assembly *as, guint index, JsonNode *node, const char *error) {
  if (index >= MAX_DOCUMENT_PAGES) { /* a corrupt line */
    json_node_unref(node);
    return;
  }
  if (index >= as->pages->len)
    g_ptr_array_set_size(as->pages, index + 1);
  if (g_ptr_array_index(as->pages, index)) { /* reported twice: the first report stands */
    json_node_unref(node);
    return;
  }
  as->done++;
  g_ptr_array_index(as->pages, index) = node;
  if (error) {
    as->failed++;
    if (!as->first_page_error)
      as->first_page_error = g_strdup_printf("page %u: %s", index + 1, error);
  }
}

/* The one page entry of a one-page findings object, with its findings beside it. */
static void take_report(pp_assembly *as, guint index, JsonObject *report) {
  JsonArray *pages = array_member(report, "pages");
  if (!pages || json_array_get_length(pages) != 1 ||
      !JSON_NODE_HOLDS_OBJECT(json_array_get_element(pages, 0))) {
    set_page(as, index, failed_page(index, "damaged: the page's result was unreadable"),
             "damaged: the page's result was unreadable");
    return;
  }
  JsonNode *page = json_node_copy(json_array_get_element(pages, 0));
  JsonObject *po = json_node_get_object(page);
  const char *error = page_error(po);
  JsonArray *findings = array_member(report, "findings");
  /* Findings ride with their page so that a page reported twice replaces both. */
  json_object_set_array_member(po, "_findings",
                               findings ? json_array_ref(findings) : json_array_new());
  set_page(as, index, page, error);
}

void pp_assembly_feed(pp_assembly *as, const char *line, gsize len) {
  g_autoptr(JsonParser) parser = json_parser_new();
  if (!pp_json_is_one_object(line, len) ||
      !json_parser_load_from_data(parser, line, (gssize)len, NULL) ||
      !JSON_NODE_HOLDS_OBJECT(json_parser_get_root(parser))) {
    as->bad_lines++;
    return;
  }
  JsonObject *o = json_node_get_object(json_parser_get_root(parser));
  JsonNode *n;
  if ((n = json_object_get_member(o, "open")) && JSON_NODE_HOLDS_OBJECT(n) && !as->header) {
    as->header = json_node_copy(n);
  } else if ((n = json_object_get_member(o, "error")) && JSON_NODE_HOLDS_OBJECT(n) &&
             !json_object_has_member(o, "page")) {
    JsonObject *e = json_node_get_object(n);
    g_free(as->error_word);
    g_free(as->error_reason);
    as->error_word = g_strdup(string_member(e, "word", "damaged"));
    as->error_reason = g_strdup(string_member(e, "message", ""));
  } else if ((n = json_object_get_member(o, "start")) && JSON_NODE_HOLDS_VALUE(n)) {
    gint64 i = json_node_get_int(n);
    if (i >= 0 && i < G_MAXINT)
      as->last_started = (int)i;
  } else if ((n = json_object_get_member(o, "page")) && JSON_NODE_HOLDS_VALUE(n)) {
    gint64 i = json_node_get_int(n);
    /* A page index outside the document the header opened is a corrupt line: growing the
     * page table to it would cost memory and time in proportion to a number from a
     * damaged worker (fuzz_events found {"page":02222222}, tests/fuzz/known). */
    if (i < 0 || i >= (gint64)header_pages(as)) {
      as->bad_lines++;
      return;
    }
    as->max_rss_kib = MAX(as->max_rss_kib, int_member(o, "rss_kib", 0));
    JsonNode *r = json_object_get_member(o, "report");
    if (r && JSON_NODE_HOLDS_OBJECT(r)) {
      take_report(as, (guint)i, json_node_get_object(r));
    } else {
      const char *why = string_member(o, "error", "not analysed");
      set_page(as, (guint)i, failed_page((guint)i, why), why);
    }
  } else if ((n = json_object_get_member(o, "stop")) && JSON_NODE_HOLDS_VALUE(n)) {
    g_free(as->stop_reason);
    as->stop_reason = g_strdup(string_member(o, "stop", "stopped"));
  } else if (bool_member(o, "end", FALSE)) {
    as->ended = TRUE;
  } else {
    as->bad_lines++;
  }
}

static guint header_pages(const pp_assembly *as) {
  if (!as->header)
    return 0;
  JsonNode *d = json_object_get_member(json_node_get_object(as->header), "document");
  JsonObject *doc = d && JSON_NODE_HOLDS_OBJECT(d) ? json_node_get_object(d) : NULL;
  gint64 n = int_member(doc, "pages", 0);
  return n > 0 && n < MAX_DOCUMENT_PAGES ? (guint)n : 0;
}

JsonNode *pp_assembly_finish(pp_assembly *as, const char *interrupted_reason, const char **word,
                             const char **reason) {
  *word = *reason = NULL;
  if (!as->header) {
    *word = as->error_word ? as->error_word : "damaged";
    *reason = as->error_reason ? as->error_reason : interrupted_reason;
    return NULL;
  }
  guint n = MAX(header_pages(as), as->pages->len);
  const char *missing = as->stop_reason ? as->stop_reason : interrupted_reason;
  for (guint i = 0; i < n; i++) {
    if (i < as->pages->len && g_ptr_array_index(as->pages, i))
      continue;
    char *why = (int)i == as->last_started || !as->stop_reason
                    ? g_strdup_printf("not analysed: %s", missing ? missing : "no result")
                    : g_strdup_printf("not analysed: not reached (%s)", missing);
    set_page(as, i, failed_page(i, why), why);
    g_free(why);
  }
  JsonNode *root = json_node_copy(as->header);
  JsonObject *ro = json_node_get_object(root);
  JsonArray *pages = json_array_new(), *findings = json_array_new();
  gint64 figures = 0, raster = 0, scale = 0, failed = 0, sev[3] = {0};
  const char *sev_names[3] = {pp_severity_name(0), pp_severity_name(1), pp_severity_name(2)};
  for (guint i = 0; i < as->pages->len; i++) {
    JsonNode *page = json_node_copy(g_ptr_array_index(as->pages, i));
    JsonObject *po = json_node_get_object(page);
    JsonArray *pf = array_member(po, "_findings");
    for (guint k = 0; pf && k < json_array_get_length(pf); k++) {
      JsonNode *f = json_array_get_element(pf, k);
      /* a worker's line is untrusted input: a finding that is not an object is dropped, and
       * a severity that is not a string (null, a number) counts in no severity */
      if (!JSON_NODE_HOLDS_OBJECT(f))
        continue;
      json_array_add_element(findings, json_node_copy(f));
      const char *s = string_member(json_node_get_object(f), "severity", "");
      for (int k2 = 0; k2 < 3; k2++)
        sev[k2] += strcmp(s, sev_names[k2]) == 0;
    }
    if (json_object_has_member(po, "_findings"))
      json_object_remove_member(po, "_findings");
    if (page_error(po))
      failed++;
    JsonArray *figs = array_member(po, "figures");
    JsonArray *ras = array_member(po, "raster_images_not_analysed");
    JsonArray *sca = array_member(po, "scale_failures");
    figures += figs ? json_array_get_length(figs) : 0;
    raster += ras ? json_array_get_length(ras) : 0;
    scale += sca ? json_array_get_length(sca) : 0;
    json_array_add_element(pages, page);
  }
  json_object_set_array_member(ro, "pages", pages);
  json_object_set_array_member(ro, "findings", findings);
  JsonObject *t = json_object_new();
  gint64 total = json_array_get_length(pages);
  json_object_set_int_member(t, "pages", total);
  json_object_set_int_member(t, "pages_analysed", total - failed);
  json_object_set_int_member(t, "pages_failed", failed);
  json_object_set_int_member(t, "figures", figures);
  json_object_set_int_member(t, "raster_images_not_analysed", raster);
  json_object_set_int_member(t, "scale_failures", scale);
  json_object_set_int_member(t, "findings", json_array_get_length(findings));
  JsonObject *by = json_object_new();
  for (int k = 0; k < 3; k++)
    json_object_set_int_member(by, sev_names[k], sev[k]);
  json_object_set_object_member(t, "by_severity", by);
  json_object_set_object_member(ro, "totals", t);
  return root;
}

gboolean pp_assembly_ended(const pp_assembly *as) {
  return as->ended;
}
guint pp_assembly_pages(const pp_assembly *as) {
  return header_pages(as);
}
guint pp_assembly_pages_done(const pp_assembly *as) {
  return as->done;
}
guint pp_assembly_pages_failed(const pp_assembly *as) {
  return as->failed;
}
int pp_assembly_last_page(const pp_assembly *as) {
  return as->last_started + 1;
}
long pp_assembly_max_rss_kib(const pp_assembly *as) {
  return as->max_rss_kib;
}
const char *pp_assembly_first_page_error(const pp_assembly *as) {
  return as->first_page_error;
}
