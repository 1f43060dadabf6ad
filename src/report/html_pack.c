/* html_pack.c — `scan --html DIR`: the review pack. Static pages that need no script and
 * no network: an index of documents with counts by severity and by rule (sortable by
 * following links to pre-sorted copies), one page per document with every finding
 * (crop with overlays, headline, numbers, explanation, link to the rule page), and the
 * rule pages themselves. Every text that comes from a PDF is escaped. */
#include <math.h>
#include <string.h>

#include "review.h"

static const char *const severity_css[] = {"sev-0", "sev-1", "sev-2"};

static void sev_badge(GString *o, const char *severity) {
  int r = pp_rv_severity_rank(severity);
  g_string_append_printf(o, "<span class=\"sev %s\">", r >= 0 && r < 3 ? severity_css[r] : "sev-0");
  pp_html_append_escaped(o, severity ? severity : "?");
  g_string_append(o, "</span>");
}

static void num_cell(GString *o, double v) {
  char *t = pp_rv_format_value(v);
  g_string_append(o, "<td class=\"n\">");
  pp_html_append_escaped(o, t);
  g_string_append(o, "</td>");
  g_free(t);
}

static void measure_row(GString *o, const char *name, const char *what, double v) {
  g_string_append(o, "<tr><th>");
  g_string_append(o, name);
  g_string_append(o, "</th>");
  num_cell(o, v);
  g_string_append_printf(o, "<td class=\"note\">%s</td></tr>\n", what);
}

static void measures_table(GString *o, JsonObject *f) {
  JsonObject *m = pp_rv_obj(f, "measures");
  g_string_append(o, "<h3>Measures</h3>\n<table>\n");
  measure_row(o, "Lie Factor",
              "Tufte: relative change shown by the ink ÷ relative change of the "
              "values, first to last element; faithful within 0.95–1.05",
              pp_rv_lie_factor(m));
  measure_row(o, "Ink growth ratio",
              "(ink last ÷ ink first) ÷ (value last ÷ value first); "
              "not a Lie Factor",
              pp_rv_growth_ratio(m));
  measure_row(o, "Graph Discrepancy Index, %", "100 × (Lie Factor − 1)", pp_rv_num(m, "gdi"));
  measure_row(o, "Baseline value", "the value where the drawing's ink starts",
              pp_rv_num(m, "baseline_value"));
  measure_row(o, "Worst pair", "largest (ink ratio ÷ value ratio) between any two elements",
              pp_rv_num(m, "max_pair_departure"));
  measure_row(o, "Distortion", "how much the ink misstates: the severity scale's measure",
              pp_rv_num(m, "distortion"));
  g_string_append(o, "</table>\n");
}

static void elements_table(GString *o, JsonObject *f) {
  JsonArray *els = pp_rv_arr(f, "elements");
  guint n = els ? json_array_get_length(els) : 0;
  if (n == 0)
    return;
  double sum_v = 0, sum_g = 0, v0 = NAN, g0 = NAN;
  for (guint i = 0; i < n; i++) {
    JsonObject *e = json_array_get_object_element(els, i);
    sum_v += pp_rv_num(e, "value"), sum_g += pp_rv_num(e, "ink");
    if (i == 0)
      v0 = pp_rv_num(e, "value"), g0 = pp_rv_num(e, "ink");
  }
  g_string_append(o, "<h3>Each element: value against ink</h3>\n<table>\n<tr><th>#</th>"
                     "<th>category</th><th>value</th><th>as printed</th><th>ink, pt²</th>"
                     "<th>value ÷ first</th><th>ink ÷ first</th></tr>\n");
  for (guint i = 0; i < n; i++) {
    JsonObject *e = json_array_get_object_element(els, i);
    double v = pp_rv_num(e, "value"), g = pp_rv_num(e, "ink");
    g_string_append_printf(o, "<tr><td class=\"n\">%u</td><td>", i + 1);
    pp_html_append_escaped(o, pp_rv_str(e, "category") ? pp_rv_str(e, "category") : "–");
    g_string_append(o, "</td>");
    num_cell(o, v);
    g_string_append(o, "<td>");
    pp_html_append_escaped(o, pp_rv_str(e, "printed") ? pp_rv_str(e, "printed") : "–");
    g_string_append(o, "</td>");
    num_cell(o, g);
    num_cell(o, v / v0);
    num_cell(o, g / g0);
    g_string_append(o, "</tr>\n");
  }
  g_string_append(o, "</table>\n");
  (void)sum_v, (void)sum_g;
}

/* Element boxes are drawn only when the findings carry them. */
static gboolean has_element_boxes(JsonObject *f) {
  JsonArray *els = pp_rv_arr(f, "elements");
  double r[4];
  for (guint i = 0; els && i < json_array_get_length(els); i++) {
    JsonObject *e = json_array_get_object_element(els, i);
    if (pp_rv_rect(e, "bbox", r) || pp_rv_rect(e, "box", r))
      return TRUE;
  }
  return FALSE;
}

static void legend(GString *o, JsonObject *f) {
  g_string_append(o, "<figcaption class=\"legend\">"
                     "<span><i class=\"key\" style=\"border:2px dashed #e07b00\"></i>plot area "
                     "measured</span>");
  if (has_element_boxes(f))
    g_string_append(o, "<span><i class=\"key\" style=\"border:2px solid #bf008c\"></i>marks "
                       "measured</span>");
  g_string_append(o, ""
                     "<span><i class=\"key\" style=\"background:#c0161d;height:3px\"></i>"
                     "drawing's baseline</span>"
                     "<span><i class=\"key\" style=\"border-top:3px dashed #138a36\"></i>"
                     "value 0 on the axis</span></figcaption>\n");
}

static void explanation(GString *o, const char *root, const char *rule) {
  char *summary = pp_rule_page_summary(rule);
  g_string_append(o, "<h3>Why this matters</h3>\n<p>");
  pp_html_append_escaped(o, summary ? summary : "No rule page is available for this rule.");
  g_string_append(o, "</p>\n<p><a href=\"");
  g_string_append(o, root);
  g_string_append(o, "rules/");
  pp_html_append_escaped(o, rule);
  g_string_append(o, ".html\">The rule page</a>: how it measures, its published source, "
                     "typical false alarms, what to check, how to fix the chart.</p>\n");
  g_free(summary);
}

static void finding_heading(GString *o, const char *root, JsonObject *doc, JsonObject *f) {
  const char *title = pp_rv_finding_title(doc, f);
  const char *fig = pp_rv_finding_figure_id(doc, f);
  g_string_append_printf(o, "<h2>Page %" G_GINT64_FORMAT " · ", pp_rv_int(f, "page"));
  if (title) {
    g_string_append(o, "“");
    pp_html_append_escaped(o, title);
    g_string_append(o, "”");
  } else {
    g_string_append(o, "untitled figure");
  }
  if (fig) {
    g_string_append(o, " <span class=\"note\">figure ");
    pp_html_append_escaped(o, fig);
    g_string_append(o, "</span>");
  }
  g_string_append(o, "</h2>\n<p>");
  sev_badge(o, pp_rv_str(f, "severity"));
  g_string_append_printf(o, " rule <a href=\"%srules/", root);
  pp_html_append_escaped(o, pp_rv_str(f, "rule"));
  g_string_append(o, ".html\"><code>");
  pp_html_append_escaped(o, pp_rv_str(f, "rule"));
  g_string_append(o, "</code></a> · finding <code>");
  pp_html_append_escaped(o, pp_rv_str(f, "id"));
  g_string_append(o, "</code></p>\n");
}

static void finding_section(GString *o, const char *dir, const char *root, const char *stem,
                            guint k, JsonObject *doc, JsonObject *f, const char *pdf_path,
                            const char *password) {
  g_string_append(o, "<section class=\"finding\" id=\"f-");
  pp_html_append_escaped(o, pp_rv_str(f, "id"));
  g_string_append(o, "\">\n");
  finding_heading(o, root, doc, f);
  JsonObject *acc = pp_rv_obj(f, "acceptance");
  if (acc) {
    g_string_append(o, "<p class=\"note\">Accepted by ");
    pp_html_append_escaped(o, pp_rv_str(acc, "who"));
    g_string_append(o, " on ");
    pp_html_append_escaped(o, pp_rv_str(acc, "when"));
    g_string_append(o, ": ");
    pp_html_append_escaped(o, pp_rv_str(acc, "why"));
    g_string_append(o, "</p>\n");
  }
  g_string_append(o, "<p class=\"headline\">");
  pp_html_append_escaped(o, pp_rv_finding_headline(f));
  g_string_append(o, "</p>\n");
  const char *head = pp_rv_str(f, "headline"), *msg = pp_rv_str(f, "message");
  if (head && msg) {
    /* The message opens with the headline; the paragraph shows what follows it. */
    gsize n = strlen(head);
    const char *rest = strncmp(msg, head, n) == 0 && msg[n] == ':' ? msg + n + 1 : msg;
    g_string_append(o, "<p>");
    while (*rest == ' ')
      rest++;
    pp_html_append_escaped(o, rest);
    g_string_append(o, "</p>\n");
  }
  g_string_append(o, "<div class=\"cols\">\n");
  char *crop_name = g_strdup_printf("img/%s-%u.png", stem, k);
  char *crop_path = g_build_filename(dir, crop_name, NULL);
  char *crop_dir = g_path_get_dirname(crop_path);
  g_mkdir_with_parents(crop_dir, 0755);
  g_free(crop_dir);
  int w = 0, h = 0;
  GError *err = NULL;
  if (pdf_path && pp_html_render_crop(pdf_path, password, doc, f, crop_path, &w, &h, &err)) {
    /* Shown at 96 px per inch-ish: half the 150 dpi pixels keeps the page readable. */
    g_string_append_printf(o,
                           "<figure><img class=\"crop\" src=\"%s%s\" width=\"%d\" height=\"%d\" "
                           "alt=\"the figure on page %" G_GINT64_FORMAT " with overlays\">\n",
                           root, crop_name, (w * 2) / 3, (h * 2) / 3, pp_rv_int(f, "page"));
    legend(o, f);
    g_string_append(o, "</figure>\n");
  } else {
    g_string_append(o, "<p class=\"note\">No crop: ");
    pp_html_append_escaped(o, err ? err->message : "the PDF was not available");
    g_string_append(o, "</p>\n");
  }
  g_clear_error(&err);
  g_string_append(o, "<div>\n");
  measures_table(o, f);
  char *shares_name = g_strdup_printf("img/%s-%u-shares.png", stem, k);
  char *shares_path = g_build_filename(dir, shares_name, NULL);
  if (pp_html_render_shares(f, shares_path, &w, &h, &err)) {
    g_string_append(o, "<h3>Share of the ink against share of the value</h3>\n");
    g_string_append_printf(o,
                           "<img src=\"%s%s\" width=\"%d\" height=\"%d\" alt=\"ink share and "
                           "value share of each element, bars from 0\">\n",
                           root, shares_name, w, h);
  }
  g_clear_error(&err);
  g_string_append(o, "</div>\n</div>\n");
  elements_table(o, f);
  explanation(o, root, pp_rv_str(f, "rule"));
  g_string_append(o, "</section>\n");
  g_free(crop_name), g_free(crop_path), g_free(shares_name), g_free(shares_path);
}

static void coverage_notes(GString *o, JsonObject *doc) {
  JsonArray *pages = pp_rv_arr(doc, "pages");
  GString *items = g_string_new(NULL);
  for (guint i = 0; pages && i < json_array_get_length(pages); i++) {
    JsonObject *p = json_array_get_object_element(pages, i);
    JsonArray *r = pp_rv_arr(p, "raster_images_not_analysed");
    JsonArray *s = pp_rv_arr(p, "scale_failures");
    const char *err = pp_rv_str(p, "error");
    guint nr = r ? json_array_get_length(r) : 0, ns = s ? json_array_get_length(s) : 0;
    if (!nr && !ns && !err)
      continue;
    g_string_append_printf(items, "<li>page %" G_GINT64_FORMAT ": ", pp_rv_int(p, "page"));
    if (err) {
      g_string_append(items, "not analysed: ");
      pp_html_append_escaped(items, err);
    }
    if (nr)
      g_string_append_printf(items, "%u raster image%s not analysed ", nr, nr == 1 ? "" : "s");
    if (ns)
      g_string_append_printf(items, "%u chart%s with no readable value scale", ns,
                             ns == 1 ? "" : "s");
    g_string_append(items, "</li>\n");
  }
  if (items->len)
    g_string_append_printf(o,
                           "<h2>Not checked</h2>\n<p class=\"note\">Silence here is not a clean "
                           "bill: these parts were not analysed.</p>\n<ul>\n%s</ul>\n",
                           items->str);
  g_string_free(items, TRUE);
}

gboolean pp_html_write_document(const char *dir, const char *page_name, JsonObject *doc,
                                const char *pdf_path, const char *password, GError **error) {
  /* The page sits where the findings file does, below the pack's folder when the inputs
   * were nested; links to the pack's shared files climb back to its root. */
  GString *up = g_string_new(NULL);
  for (const char *c = page_name; *c; c++)
    if (*c == '/')
      g_string_append(up, "../");
  char *root = g_string_free(up, FALSE);
  char *page_path = g_build_filename(dir, page_name, NULL),
       *page_dir = g_path_get_dirname(page_path);
  g_mkdir_with_parents(page_dir, 0755);
  g_free(page_dir);
  JsonObject *d = pp_rv_obj(doc, "document");
  const char *path = pp_rv_str(d, "path") ? pp_rv_str(d, "path") : "document";
  /* The whole name less ".html": "q1.2031" and "q1.2032" must not share their pictures. */
  char *stem = g_str_has_suffix(page_name, ".html")
                   ? g_strndup(page_name, strlen(page_name) - strlen(".html"))
                   : g_strdup(page_name);
  GString *o = g_string_new(NULL);
  char *base = g_path_get_basename(path);
  char *style = g_strconcat(root, "style.css", NULL);
  pp_html_begin(o, base, style);
  g_free(style);
  g_string_append_printf(o, "<nav><a href=\"%sindex.html\">← all documents</a></nav>\n<h1>", root);
  pp_html_append_escaped(o, base);
  g_string_append(o, "</h1>\n<p class=\"note\">");
  pp_html_append_escaped(o, path);
  g_string_append_printf(o, " · %" G_GINT64_FORMAT " pages · SHA-256 <code>",
                         pp_rv_int(d, "pages"));
  pp_html_append_escaped(o, pp_rv_str(d, "sha256"));
  g_string_append(o, "</code></p>\n<p class=\"note\">");
  pp_html_append_escaped(o, pp_rv_str(doc, "disclaimer"));
  g_string_append(o, "</p>\n");
  JsonArray *list = pp_rv_arr(doc, "findings");
  guint n = list ? json_array_get_length(list) : 0;
  if (n == 0)
    g_string_append(o, "<p>No findings in the parts that were analysed.</p>\n");
  for (guint i = 0; i < n; i++)
    finding_section(o, dir, root, stem, i + 1, doc, json_array_get_object_element(list, i),
                    pdf_path, password);
  JsonArray *acc = pp_rv_arr(doc, "accepted");
  if (acc && json_array_get_length(acc) > 0) {
    g_string_append(o, "<h2>Accepted earlier (baseline)</h2>\n");
    for (guint i = 0; i < json_array_get_length(acc); i++)
      finding_section(o, dir, root, stem, n + i + 1, doc, json_array_get_object_element(acc, i),
                      pdf_path, password);
  }
  coverage_notes(o, doc);
  pp_html_end(o);
  gboolean ok = g_file_set_contents(page_path, o->str, (gssize)o->len, error);
  g_free(page_path), g_free(root), g_free(base), g_free(stem);
  g_string_free(o, TRUE);
  return ok;
}

/* ---- the index ---- */

typedef struct {
  char *name, *page, *path;
  gint64 pages, figures, findings, accepted;
  gint64 by_sev[3];
} doc_row;

typedef struct {
  char *doc_name, *page, *anchor, *title, *rule, *severity, *headline;
  gint64 page_no;
  int rank;
} finding_row;

struct pp_html_index {
  GPtrArray *docs;     /* of doc_row* */
  GPtrArray *findings; /* of finding_row* */
  GHashTable *by_rule; /* rule → gint64[3] */
};

static void doc_row_free(gpointer p) {
  doc_row *r = p;
  g_free(r->name), g_free(r->page), g_free(r->path), g_free(r);
}

static void finding_row_free(gpointer p) {
  finding_row *r = p;
  g_free(r->doc_name), g_free(r->page), g_free(r->anchor), g_free(r->title), g_free(r->rule);
  g_free(r->severity), g_free(r->headline), g_free(r);
}

pp_html_index *pp_html_index_new(void) {
  pp_html_index *idx = g_new0(pp_html_index, 1);
  idx->docs = g_ptr_array_new_with_free_func(doc_row_free);
  idx->findings = g_ptr_array_new_with_free_func(finding_row_free);
  idx->by_rule = g_hash_table_new_full(g_str_hash, g_str_equal, g_free, g_free);
  return idx;
}

void pp_html_index_free(pp_html_index *idx) {
  if (!idx)
    return;
  g_ptr_array_unref(idx->docs);
  g_ptr_array_unref(idx->findings);
  g_hash_table_unref(idx->by_rule);
  g_free(idx);
}

void pp_html_index_add(pp_html_index *idx, JsonObject *doc, const char *page_name) {
  JsonObject *d = pp_rv_obj(doc, "document"), *t = pp_rv_obj(doc, "totals");
  doc_row *r = g_new0(doc_row, 1);
  r->path = g_strdup(pp_rv_str(d, "path") ? pp_rv_str(d, "path") : "?");
  r->name = g_path_get_basename(r->path);
  r->page = g_strdup(page_name);
  r->pages = pp_rv_int(t, "pages"), r->figures = pp_rv_int(t, "figures");
  JsonArray *list = pp_rv_arr(doc, "findings");
  r->findings = list ? json_array_get_length(list) : 0;
  JsonArray *acc = pp_rv_arr(doc, "accepted");
  r->accepted = acc ? json_array_get_length(acc) : 0;
  for (guint i = 0; i < r->findings; i++) {
    JsonObject *f = json_array_get_object_element(list, i);
    int rank = pp_rv_severity_rank(pp_rv_str(f, "severity"));
    if (rank >= 0 && rank < 3)
      r->by_sev[rank]++;
    const char *rule = pp_rv_str(f, "rule") ? pp_rv_str(f, "rule") : "unknown";
    gint64 *counts = g_hash_table_lookup(idx->by_rule, rule);
    if (!counts) {
      counts = g_new0(gint64, 3);
      g_hash_table_insert(idx->by_rule, g_strdup(rule), counts);
    }
    if (rank >= 0 && rank < 3)
      counts[rank]++;
    finding_row *fr = g_new0(finding_row, 1);
    fr->doc_name = g_strdup(r->name);
    fr->page = g_strdup(page_name);
    fr->anchor = g_strdup(pp_rv_str(f, "id"));
    fr->title = g_strdup(pp_rv_finding_title(doc, f));
    fr->rule = g_strdup(rule);
    fr->severity = g_strdup(pp_rv_str(f, "severity"));
    fr->headline = g_strdup(pp_rv_finding_headline(f));
    fr->page_no = pp_rv_int(f, "page");
    fr->rank = rank;
    g_ptr_array_add(idx->findings, fr);
  }
  g_ptr_array_add(idx->docs, r);
}

typedef enum { SORT_NAME, SORT_FINDINGS, SORT_SEVERITY, SORT_N } sort_key;
static const char *const sort_pages[] = {"index.html", "index-by-findings.html",
                                         "index-by-severity.html"};

static int cmp_name(gconstpointer a, gconstpointer b) {
  const doc_row *x = *(doc_row *const *)a, *y = *(doc_row *const *)b;
  int c = g_utf8_collate(x->name, y->name);
  return c ? c : strcmp(x->path, y->path);
}

static int cmp_findings(gconstpointer a, gconstpointer b) {
  const doc_row *x = *(doc_row *const *)a, *y = *(doc_row *const *)b;
  if (x->findings != y->findings)
    return x->findings > y->findings ? -1 : 1;
  return cmp_name(a, b);
}

static int cmp_severity(gconstpointer a, gconstpointer b) {
  const doc_row *x = *(doc_row *const *)a, *y = *(doc_row *const *)b;
  for (int s = 2; s >= 0; s--)
    if (x->by_sev[s] != y->by_sev[s])
      return x->by_sev[s] > y->by_sev[s] ? -1 : 1;
  return cmp_name(a, b);
}

static int cmp_finding_rows(gconstpointer a, gconstpointer b) {
  const finding_row *x = *(finding_row *const *)a, *y = *(finding_row *const *)b;
  if (x->rank != y->rank)
    return x->rank > y->rank ? -1 : 1;
  int c = g_utf8_collate(x->doc_name, y->doc_name);
  if (c)
    return c;
  return x->page_no < y->page_no ? -1 : x->page_no > y->page_no;
}

static void sort_header(GString *o, const char *label, sort_key key, sort_key current) {
  if (key == current)
    g_string_append_printf(o, "<th class=\"sorted\">%s ▼</th>", label);
  else
    g_string_append_printf(o, "<th><a href=\"%s\">%s</a></th>", sort_pages[key], label);
}

static void docs_table(GString *o, pp_html_index *idx, sort_key key) {
  const char *const *words = pp_rv_severity_words();
  g_string_append(o, "<h2>Documents</h2>\n<p class=\"note\">Sort by following a column "
                     "heading.</p>\n<table>\n<tr>");
  sort_header(o, "document", SORT_NAME, key);
  g_string_append(o, "<th>pages</th><th>figures</th>");
  sort_header(o, "findings", SORT_FINDINGS, key);
  for (int s = 2; s >= 0; s--) {
    if (s == 2) {
      char *l = g_strdup_printf("%s", words[s]);
      sort_header(o, l, SORT_SEVERITY, key);
      g_free(l);
    } else {
      g_string_append_printf(o, "<th>%s</th>", words[s]);
    }
  }
  g_string_append(o, "<th>accepted</th></tr>\n");
  GCompareFunc cmp[] = {cmp_name, cmp_findings, cmp_severity};
  g_ptr_array_sort(idx->docs, cmp[key]);
  for (guint i = 0; i < idx->docs->len; i++) {
    doc_row *r = g_ptr_array_index(idx->docs, i);
    g_string_append(o, "<tr><td><a href=\"");
    pp_html_append_escaped(o, r->page);
    g_string_append(o, "\">");
    pp_html_append_escaped(o, r->name);
    g_string_append_printf(o,
                           "</a></td><td class=\"n\">%" G_GINT64_FORMAT
                           "</td><td class=\"n\">%" G_GINT64_FORMAT
                           "</td><td class=\"n\">%" G_GINT64_FORMAT "</td>",
                           r->pages, r->figures, r->findings);
    for (int s = 2; s >= 0; s--)
      g_string_append_printf(o, "<td class=\"n\">%" G_GINT64_FORMAT "</td>", r->by_sev[s]);
    g_string_append_printf(o, "<td class=\"n\">%" G_GINT64_FORMAT "</td></tr>\n", r->accepted);
  }
  g_string_append(o, "</table>\n");
}

static void rules_table(GString *o, pp_html_index *idx) {
  const char *const *words = pp_rv_severity_words();
  g_string_append(o, "<h2>By rule</h2>\n<table>\n<tr><th>rule</th>");
  for (int s = 2; s >= 0; s--)
    g_string_append_printf(o, "<th>%s</th>", words[s]);
  g_string_append(o, "<th>what it detects</th></tr>\n");
  GList *keys = g_list_sort(g_hash_table_get_keys(idx->by_rule), (GCompareFunc)strcmp);
  for (GList *k = keys; k; k = k->next) {
    const gint64 *c = g_hash_table_lookup(idx->by_rule, k->data);
    g_string_append(o, "<tr><td><a href=\"rules/");
    pp_html_append_escaped(o, k->data);
    g_string_append(o, ".html\"><code>");
    pp_html_append_escaped(o, k->data);
    g_string_append(o, "</code></a></td>");
    for (int s = 2; s >= 0; s--)
      g_string_append_printf(o, "<td class=\"n\">%" G_GINT64_FORMAT "</td>", c[s]);
    char *summary = pp_rule_page_summary(k->data);
    g_string_append(o, "<td class=\"note\">");
    pp_html_append_escaped(o, summary);
    g_string_append(o, "</td></tr>\n");
    g_free(summary);
  }
  g_list_free(keys);
  g_string_append(o, "</table>\n");
}

static void findings_table(GString *o, pp_html_index *idx) {
  g_string_append(o, "<h2>Every finding, most severe first</h2>\n<table>\n<tr><th>severity</th>"
                     "<th>document</th><th>page</th><th>figure</th><th>headline</th></tr>\n");
  for (guint i = 0; i < idx->findings->len; i++) {
    finding_row *r = g_ptr_array_index(idx->findings, i);
    g_string_append(o, "<tr><td>");
    sev_badge(o, r->severity);
    g_string_append(o, "</td><td>");
    pp_html_append_escaped(o, r->doc_name);
    g_string_append_printf(o, "</td><td class=\"n\">%" G_GINT64_FORMAT "</td><td>", r->page_no);
    pp_html_append_escaped(o, r->title ? r->title : "untitled");
    g_string_append(o, "</td><td><a href=\"");
    pp_html_append_escaped(o, r->page);
    g_string_append(o, "#f-");
    pp_html_append_escaped(o, r->anchor);
    g_string_append(o, "\">");
    pp_html_append_escaped(o, r->headline);
    g_string_append(o, "</a></td></tr>\n");
  }
  g_string_append(o, "</table>\n");
}

static gboolean write_text(const char *dir, const char *name, const char *text, GError **error) {
  char *path = g_build_filename(dir, name, NULL);
  gboolean ok = g_file_set_contents(path, text, -1, error);
  g_free(path);
  return ok;
}

static gboolean write_rule_pages(const char *dir, GError **error) {
  char *rdir = g_build_filename(dir, "rules", NULL);
  g_mkdir_with_parents(rdir, 0755);
  char **ids = pp_rule_page_list();
  gboolean ok = TRUE;
  for (guint i = 0; ok && ids[i]; i++) {
    char *md = pp_rule_page_get(ids[i]);
    char *body = pp_html_from_markdown(md);
    GString *o = g_string_new(NULL);
    pp_html_begin(o, ids[i], "../style.css");
    g_string_append(o, "<nav><a href=\"../index.html\">← all documents</a></nav>\n");
    g_string_append(o, body);
    pp_html_end(o);
    char *name = g_strdup_printf("%s.html", ids[i]);
    ok = write_text(rdir, name, o->str, error);
    g_free(name), g_free(md), g_free(body);
    g_string_free(o, TRUE);
  }
  g_strfreev(ids);
  g_free(rdir);
  return ok;
}

gboolean pp_html_index_finish(pp_html_index *idx, const char *dir, GError **error) {
  if (!write_text(dir, "style.css", pp_html_stylesheet(), error) || !write_rule_pages(dir, error))
    return FALSE;
  g_ptr_array_sort(idx->findings, cmp_finding_rows);
  const char *const *words = pp_rv_severity_words();
  gint64 total[3] = {0}, n = 0;
  for (guint i = 0; i < idx->docs->len; i++) {
    doc_row *r = g_ptr_array_index(idx->docs, i);
    for (int s = 0; s < 3; s++)
      total[s] += r->by_sev[s];
    n += r->findings;
  }
  for (int key = 0; key < SORT_N; key++) {
    GString *o = g_string_new(NULL);
    pp_html_begin(o, "plotproof review pack", "style.css");
    g_string_append_printf(o,
                           "<h1>Review pack</h1>\n<p>%u document%s, %" G_GINT64_FORMAT
                           " finding%s: %" G_GINT64_FORMAT " %s, %" G_GINT64_FORMAT
                           " %s, %" G_GINT64_FORMAT " %s.</p>\n",
                           idx->docs->len, idx->docs->len == 1 ? "" : "s", n, n == 1 ? "" : "s",
                           total[2], words[2], total[1], words[1], total[0], words[0]);
    g_string_append(o, "<p class=\"note\">Severity orders findings by how far the ink departs "
                       "from the values; see the rule pages. These verdicts aid a reviewer; "
                       "they are not an audit opinion.</p>\n");
    docs_table(o, idx, (sort_key)key);
    rules_table(o, idx);
    findings_table(o, idx);
    pp_html_end(o);
    gboolean ok = write_text(dir, sort_pages[key], o->str, error);
    g_string_free(o, TRUE);
    if (!ok)
      return FALSE;
  }
  return TRUE;
}
