/* assemble.c — joins per-page findings objects. The totals of the findings file are sums
 * over pages (docs/findings-format.md), so they are recomputed from the parts here and
 * can never disagree with the pages and findings actually kept. A page line in the document
 * worker's own form keeps its page entry as text (json_text.c), read for its counts only. */
#include <string.h>

#include "assemble.h"
#include "json_text.h"
#include "record.h"
#include "report/report.h"
#include "rules/rules.h"

/* A header claiming more pages than this is a corrupt line: at the 30 s page budget such a
 * document would take over a month of CPU, and filling that many missing page entries
 * costs hundreds of MB (fuzz_events found headers of 9,888,888 and 1,048,575 pages
 * exhausting a 2 GB limit). No outside source. */
#define MAX_DOCUMENT_PAGES (1u << 17)

/* One page's result: a page entry as nodes (built here, or read by json-glib with its
 * findings in "_findings"), or as the compact text its page process wrote. */
typedef struct {
  JsonNode *node;
  char *text; /* without node: the entry's text, and what the totals need of it */
  gsize len;
  GPtrArray *findings; /* the texts of its findings that are objects */
  char *error;
  guint figures, raster, scale;
  guint by_severity[3];
} page_slot;

static void page_slot_free(page_slot *ps) {
  if (ps->node)
    json_node_unref(ps->node);
  if (ps->findings)
    g_ptr_array_unref(ps->findings);
  g_free(ps->text);
  g_free(ps->error);
  g_free(ps);
}

static page_slot *node_slot(JsonNode *node) {
  page_slot *ps = g_new0(page_slot, 1);
  ps->node = node;
  return ps;
}

struct pp_assembly {
  JsonNode *header; /* from {"open": ...} */
  GPtrArray *pages; /* page_slot* per page index, NULL until reported */
  char *error_word, *error_reason, *stop_reason, *first_page_error;
  gboolean ended;
  int last_started; /* 0-based, -1 before any */
  guint done, failed, bad_lines;
  long max_rss_kib;
};

pp_assembly *pp_assembly_new(void) {
  pp_assembly *as = g_new0(pp_assembly, 1);
  as->pages = g_ptr_array_new_with_free_func((GDestroyNotify)page_slot_free);
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
static void set_page_slot(pp_assembly *as, guint index, page_slot *ps, const char *error);

static void set_page(pp_assembly *as, guint index, JsonNode *node, const char *error) {
  set_page_slot(as, index, node_slot(node), error);
}

static void set_page_slot(pp_assembly *as, guint index, page_slot *ps, const char *error) {
  if (index >= MAX_DOCUMENT_PAGES) { /* a corrupt line */
    page_slot_free(ps);
    return;
  }
  if (index >= as->pages->len)
    g_ptr_array_set_size(as->pages, index + 1);
  if (g_ptr_array_index(as->pages, index)) { /* reported twice: the first report stands */
    page_slot_free(ps);
    return;
  }
  as->done++;
  g_ptr_array_index(as->pages, index) = ps;
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

/* A non-negative integer as the document worker prints it (no sign, no leading zero), at
 * most 18 digits; advances *p. */
static gboolean read_count(const char **p, const char *end, gint64 *v) {
  const char *q = *p;
  *v = 0;
  while (q < end && g_ascii_isdigit(*q) && q - *p < 18)
    *v = *v * 10 + (*q++ - '0');
  if (q == *p || (q - *p > 1 && **p == '0') || (q < end && g_ascii_isdigit(*q)))
    return FALSE;
  *p = q;
  return TRUE;
}

static gboolean read_literal(const char **p, const char *end, const char *text) {
  size_t n = strlen(text);
  if ((size_t)(end - *p) < n || memcmp(*p, text, n) != 0)
    return FALSE;
  *p += n;
  return TRUE;
}

static gboolean has_escape(const char *n, const char *n_end) {
  return memchr(n, '\\', (size_t)(n_end - n)) != NULL;
}

/* Walks the array at *p (any other value is passed over): its elements counted, *p left past
 * its end. */
static guint count_elements(const char **p, const char *end) {
  guint n = 0;
  if (**p != '[') {
    *p = pp_json_text_end(*p, end);
    return 0;
  }
  while (pp_json_text_member(p, end, NULL, NULL)) {
    *p = pp_json_text_end(*p, end);
    n++;
  }
  (*p)++;
  return n;
}

/* The one page entry of "pages" at *p, read into ps: its text's span, error and counts. *p is
 * left past the array; FALSE when it is not one object whose names have no escape. */
static gboolean walk_pages(const char **p, const char *end, page_slot *ps, const char **entry,
                           const char **entry_end, const char **error, const char **error_end) {
  const char *q = *p, *n, *n_end;
  if (*q != '[' || !pp_json_text_member(&q, end, NULL, NULL) || *q != '{')
    return FALSE;
  *entry = q;
  while (pp_json_text_member(&q, end, &n, &n_end)) {
    if (has_escape(n, n_end) || pp_json_text_name_is(n, n_end, "_findings"))
      return FALSE;
    if (pp_json_text_name_is(n, n_end, "error")) {
      *error = q;
      q = *error_end = pp_json_text_end(q, end);
    } else if (pp_json_text_name_is(n, n_end, "figures")) {
      ps->figures = count_elements(&q, end);
    } else if (pp_json_text_name_is(n, n_end, "raster_images_not_analysed")) {
      ps->raster = count_elements(&q, end);
    } else if (pp_json_text_name_is(n, n_end, "scale_failures")) {
      ps->scale = count_elements(&q, end);
    } else {
      q = pp_json_text_end(q, end);
    }
  }
  *entry_end = ++q;
  if (*q != ']') /* a second entry */
    return FALSE;
  *p = q + 1;
  return TRUE;
}

/* The findings at *p into ps: as pp_assembly_finish counts them, findings that are not objects
 * are dropped, and a severity counts only as a string. *p is left past the value; FALSE for a
 * name or a severity with an escape (json-glib unescapes them; one could spell "severity"). */
static gboolean walk_findings(const char **p, const char *end, page_slot *ps) {
  const char *a = *p, *n, *n_end;
  if (*a != '[') {
    *p = pp_json_text_end(a, end);
    return TRUE;
  }
  while (pp_json_text_member(&a, end, NULL, NULL)) {
    const char *f = a, *sev = NULL, *sev_end = NULL;
    if (*f != '{') {
      a = pp_json_text_end(a, end);
      continue;
    }
    while (pp_json_text_member(&a, end, &n, &n_end)) {
      if (has_escape(n, n_end))
        return FALSE;
      const char *v = a;
      a = pp_json_text_end(a, end);
      if (pp_json_text_name_is(n, n_end, "severity"))
        sev = v, sev_end = a;
    }
    a++;
    if (sev && *sev == '"' && has_escape(sev, sev_end))
      return FALSE;
    for (int k = 0; sev && *sev == '"' && k < 3; k++)
      ps->by_severity[k] += pp_json_text_name_is(sev, sev_end, pp_severity_name(k));
    g_ptr_array_add(ps->findings, g_strndup(f, (gsize)(a - f)));
  }
  *p = a + 1;
  return TRUE;
}

/* {"page":N,"rss_kib":R,"report":{...}} exactly as the document worker writes it
 * (docworker.c): the page entry is kept as text, only its error, its counts and the findings
 * are read, in one walk after the check. FALSE for anything else, before any change: json-glib
 * then reads the line (also for a report naming "pages" or "findings" twice). */
static gboolean feed_page_text(pp_assembly *as, const char *line, gsize len) {
  const char *p = line, *end = line + len, *n, *n_end;
  gint64 index, rss;
  if (!read_literal(&p, end, "{\"page\":") || !read_count(&p, end, &index) ||
      !read_literal(&p, end, ",\"rss_kib\":") || !read_count(&p, end, &rss) ||
      !read_literal(&p, end, ",\"report\":") || p >= end || *p != '{' || end[-1] != '}' ||
      pp_json_text_skip(p, end - 1) != end - 1)
    return FALSE;
  page_slot *ps = g_new0(page_slot, 1);
  ps->findings = g_ptr_array_new_with_free_func(g_free);
  const char *entry = NULL, *entry_end = NULL, *error = NULL, *error_end = NULL;
  gboolean ok = TRUE, found = FALSE;
  for (const char *r = p; ok && pp_json_text_member(&r, end - 1, &n, &n_end);) {
    /* Member names with escapes could spell "pages" another way: json-glib reads those. */
    if (has_escape(n, n_end))
      ok = FALSE;
    else if (pp_json_text_name_is(n, n_end, "pages"))
      ok = !entry && walk_pages(&r, end - 1, ps, &entry, &entry_end, &error, &error_end);
    else if (pp_json_text_name_is(n, n_end, "findings")) {
      ok = !found && walk_findings(&r, end - 1, ps);
      found = TRUE;
    } else
      r = pp_json_text_end(r, end - 1);
  }
  /* not one page entry, or an escaped error text (json-glib unescapes it): the slow way */
  if (!ok || !entry || (error && *error == '"' && has_escape(error, error_end))) {
    page_slot_free(ps);
    return FALSE;
  }
  if (error && *error == '"')
    ps->error = g_strndup(error + 1, (gsize)(error_end - error - 2));
  /* As the slow way: an index outside the document the header opened is a corrupt line. */
  if (index >= (gint64)header_pages(as)) {
    as->bad_lines++;
    page_slot_free(ps);
    return TRUE;
  }
  as->max_rss_kib = MAX(as->max_rss_kib, rss);
  ps->text = g_strndup(entry, (gsize)(entry_end - entry));
  ps->len = (gsize)(entry_end - entry);
  char *why = g_strdup(ps->error);
  set_page_slot(as, (guint)index, ps, why);
  g_free(why);
  return TRUE;
}

void pp_assembly_feed(pp_assembly *as, const char *line, gsize len) {
  if (feed_page_text(as, line, len))
    return;
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

/* Where the (empty) level-1 array "name" of json-glib's text of the findings object opens. */
static const char *array_slot(const char *text, const char *name) {
  char *slot = g_strdup_printf("\n  \"%s\" : []", name);
  const char *at = strstr(text, slot);
  if (at)
    at += strlen(slot) - 2;
  g_free(slot);
  return at;
}

/* The elements, each indented as json-glib writes an element at level 2. */
static void append_elements(GString *out, GPtrArray *elements) {
  for (guint i = 0; i < elements->len; i++) {
    const char *e = g_ptr_array_index(elements, i);
    g_string_append_len(out, i ? ",\n    " : "\n    ", i ? 6 : 5);
    pp_json_text_indent(out, e, e + strlen(e), 2);
  }
  if (elements->len)
    g_string_append(out, "\n  ");
}

/* json-glib's text of the findings object with "pages" and "findings" (empty there) filled. */
static char *splice_arrays(const char *bare, gsize len, GPtrArray *pages, GPtrArray *findings,
                           gsize size) {
  const char *slot[2] = {array_slot(bare, "pages"), array_slot(bare, "findings")};
  GPtrArray *els[2] = {pages, findings};
  int first = slot[0] && slot[1] && slot[1] < slot[0];
  GString *out = g_string_sized_new(len + size);
  const char *from = bare;
  for (int k = 0; k < 2; k++) {
    int j = k ^ first;
    if (!slot[j])
      continue;
    g_string_append_len(out, from, slot[j] + 1 - from);
    append_elements(out, els[j]);
    from = slot[j] + 1;
  }
  g_string_append(out, from);
  return g_string_free(out, FALSE);
}

JsonNode *pp_assembly_finish_text(pp_assembly *as, const char *interrupted_reason,
                                  const char **word, const char **reason, char **text) {
  *word = *reason = NULL;
  *text = NULL;
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
  GPtrArray *pages = g_ptr_array_new(), *findings = g_ptr_array_new_with_free_func(g_free);
  gint64 figures = 0, raster = 0, scale = 0, failed = 0, sev[3] = {0};
  for (guint i = 0; i < as->pages->len; i++) {
    page_slot *ps = g_ptr_array_index(as->pages, i);
    if (ps->node) { /* counted as the text slots were in feed_page_text */
      JsonObject *po = json_node_get_object(ps->node);
      JsonArray *pf = array_member(po, "_findings");
      for (guint k = 0; pf && k < json_array_get_length(pf); k++) {
        JsonNode *f = json_array_get_element(pf, k);
        /* a worker's line is untrusted input: a finding that is not an object is dropped, and
         * a severity that is not a string (null, a number) counts in no severity */
        if (!JSON_NODE_HOLDS_OBJECT(f))
          continue;
        g_ptr_array_add(findings, json_to_string(f, FALSE));
        const char *s = string_member(json_node_get_object(f), "severity", "");
        for (int k2 = 0; k2 < 3; k2++)
          sev[k2] += strcmp(s, pp_severity_name(k2)) == 0;
      }
      if (json_object_has_member(po, "_findings"))
        json_object_remove_member(po, "_findings");
      JsonArray *figs = array_member(po, "figures");
      JsonArray *ras = array_member(po, "raster_images_not_analysed");
      JsonArray *sca = array_member(po, "scale_failures");
      figures += figs ? json_array_get_length(figs) : 0;
      raster += ras ? json_array_get_length(ras) : 0;
      scale += sca ? json_array_get_length(sca) : 0;
      failed += page_error(po) != NULL;
      g_free(ps->text); /* the entry as text, for the findings file */
      ps->text = json_to_string(ps->node, FALSE);
      ps->len = strlen(ps->text);
    } else {
      figures += ps->figures;
      raster += ps->raster;
      scale += ps->scale;
      failed += ps->error != NULL;
      for (int k = 0; k < 3; k++)
        sev[k] += ps->by_severity[k];
      for (guint k = 0; k < ps->findings->len; k++)
        g_ptr_array_add(findings, g_strdup(g_ptr_array_index(ps->findings, k)));
    }
    g_ptr_array_add(pages, ps->text);
  }
  json_object_set_array_member(ro, "pages", json_array_new());
  json_object_set_array_member(ro, "findings", json_array_new());
  JsonObject *t = json_object_new();
  gint64 total = as->pages->len;
  json_object_set_int_member(t, "pages", total);
  json_object_set_int_member(t, "pages_analysed", total - failed);
  json_object_set_int_member(t, "pages_failed", failed);
  json_object_set_int_member(t, "figures", figures);
  json_object_set_int_member(t, "raster_images_not_analysed", raster);
  json_object_set_int_member(t, "scale_failures", scale);
  json_object_set_int_member(t, "findings", findings->len);
  JsonObject *by = json_object_new();
  for (int k = 0; k < 3; k++)
    json_object_set_int_member(by, pp_severity_name(k), sev[k]);
  json_object_set_object_member(t, "by_severity", by);
  json_object_set_object_member(ro, "totals", t);
  gsize len = 0, size = findings->len * 512;
  char *bare = pp_report_node_to_string(root, TRUE, &len);
  for (guint i = 0; i < as->pages->len; i++)
    size += ((page_slot *)g_ptr_array_index(as->pages, i))->len * 3 / 2;
  *text = splice_arrays(bare, len, pages, findings, size);
  g_free(bare);
  g_ptr_array_unref(pages);
  g_ptr_array_unref(findings);
  return root;
}

JsonNode *pp_assembly_finish(pp_assembly *as, const char *interrupted_reason, const char **word,
                             const char **reason) {
  char *text;
  JsonNode *bare = pp_assembly_finish_text(as, interrupted_reason, word, reason, &text);
  if (!bare)
    return NULL;
  json_node_unref(bare);
  JsonNode *root = json_from_string(text, NULL);
  g_free(text);
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
