/* review.h — the reviewer's outputs, built from findings documents (the JSON that
 * report.h writes, read back with json-glib so they never depend on the C structs):
 * the HTML review pack, annotated PDF copies, CSV, SARIF, baselines, draft comparison
 * and the rule pages compiled into the binary. Part of the report stage. */
#pragma once

#include <json-glib/json-glib.h>

G_BEGIN_DECLS

/* ---- reading a findings document (review_doc.c) ---- */

/* Member accessors that tolerate absent members and wrong types. */
const char *pp_rv_str(JsonObject *o, const char *name);
double pp_rv_num(JsonObject *o, const char *name); /* NAN when absent or null */
gint64 pp_rv_int(JsonObject *o, const char *name);
JsonArray *pp_rv_arr(JsonObject *o, const char *name);
JsonObject *pp_rv_obj(JsonObject *o, const char *name);
/* A [x0, y0, x1, y1] member; FALSE when absent or malformed. */
gboolean pp_rv_rect(JsonObject *o, const char *name, double r[4]);

/* The figure of a finding: its own "figure" member when the finding carries one, else
 * the figure on the same page whose plot box matches the finding's box. May be NULL. */
JsonObject *pp_rv_finding_figure(JsonObject *doc, JsonObject *finding);
/* The figure's title (or caption), or NULL. */
const char *pp_rv_finding_title(JsonObject *doc, JsonObject *finding);
/* The figure id: the finding's figure id, else the matching figure's id, or NULL. */
const char *pp_rv_finding_figure_id(JsonObject *doc, JsonObject *finding);
/* The plain one-line headline of a finding ("headline" when present, else "message"). */
const char *pp_rv_finding_headline(JsonObject *finding);
/* Tufte's Lie Factor and the ink growth ratio of a measures object, any format version. */
double pp_rv_lie_factor(JsonObject *measures);
double pp_rv_growth_ratio(JsonObject *measures);
/* Severity rank, 0 = mildest; unknown words rank -1. */
int pp_rv_severity_rank(const char *severity);
/* The severity words, mildest first (NULL-terminated, static). */
const char *const *pp_rv_severity_words(void);
/* A value for people: 4 significant digits, thousands grouped ("118,200,000", "0.4184"). */
char *pp_rv_format_value(double v);

/* ---- spreadsheet and CI outputs (csv_out.c, sarif_out.c) ---- */

/* Status of a finding against a baseline, for the outputs that list accepted ones. */
typedef struct {
  const char *who, *why, *when; /* NULL when the finding is not accepted */
} pp_rv_acceptance;

/* Returns the acceptance for a finding id, or NULL: lets outputs mark accepted findings. */
typedef const pp_rv_acceptance *(*pp_rv_accepted_func)(const char *finding_id, gpointer data);

typedef struct pp_csv_writer pp_csv_writer;
pp_csv_writer *pp_csv_writer_new(void);
void pp_csv_writer_add_document(pp_csv_writer *w, JsonObject *doc, pp_rv_accepted_func accepted,
                                gpointer data);
/* Writes the whole table (RFC 4180, CRLF) atomically. */
gboolean pp_csv_writer_finish(pp_csv_writer *w, const char *path, GError **error);
void pp_csv_writer_free(pp_csv_writer *w);
/* One RFC 4180 field: quoted when needed; text that a spreadsheet would run as a formula
 * (leading = + - @, tab or CR) gets a leading apostrophe. Appended to out. */
void pp_csv_append_field(GString *out, const char *text, gboolean is_number);

typedef struct pp_sarif_writer pp_sarif_writer;
pp_sarif_writer *pp_sarif_writer_new(void);
void pp_sarif_writer_add_document(pp_sarif_writer *w, JsonObject *doc, pp_rv_accepted_func accepted,
                                  gpointer data);
gboolean pp_sarif_writer_finish(pp_sarif_writer *w, const char *path, GError **error);
void pp_sarif_writer_free(pp_sarif_writer *w);

/* ---- baselines (baseline.c) ---- */

typedef struct pp_baseline pp_baseline;
/* A GLib key file, one group per accepted finding id with who, why, when (and, for the
 * reader, rule, page and title). A missing file is an error. */
pp_baseline *pp_baseline_load(const char *path, GError **error);
void pp_baseline_free(pp_baseline *b);
const pp_rv_acceptance *pp_baseline_lookup(const char *finding_id, gpointer baseline);
/* Moves the accepted findings of doc from "findings" to "accepted" (each with an
 * "acceptance" object), recounts totals, and marks the entries seen. */
void pp_baseline_apply(pp_baseline *b, JsonObject *doc);
/* Entries that matched no finding in any document applied so far (of const char* ids). */
GPtrArray *pp_baseline_stale(pp_baseline *b);
/* Adds or replaces one entry in the key file at path (created when missing). */
gboolean pp_baseline_accept(const char *path, JsonObject *doc, const char *finding_id,
                            const char *who, const char *why, GError **error);

/* ---- comparing two drafts (compare.c) ---- */

/* {"format": "plotproof-comparison", "old", "new", "new_findings", "resolved",
 * "unchanged"}: findings matched by stable id, then by rule and figure title, so pages
 * added or removed and figures moved do not count as changes. */
JsonNode *pp_compare_documents(JsonObject *old_doc, JsonObject *new_doc);
char *pp_compare_to_text(JsonObject *comparison);
char *pp_compare_to_html(JsonObject *comparison);

/* ---- rule pages (rule_pages.c; docs/rules/<id>.md compiled in as a GResource) ---- */

/* The Markdown page of a rule, or NULL when there is none. Owned by the caller. */
char *pp_rule_page_get(const char *rule_id);
/* Ids of all compiled-in pages, sorted (NULL-terminated; g_strfreev). */
char **pp_rule_page_list(void);
/* The first paragraph of the page's "What it detects" section, plain text, or NULL. */
char *pp_rule_page_summary(const char *rule_id);

/* ---- HTML (html_util.c, html_pack.c, html_crop.c) ---- */

/* Appends s with & < > " ' escaped; invalid UTF-8 is repaired first. */
void pp_html_append_escaped(GString *out, const char *s);
/* The small Markdown subset of the rule pages (headings, paragraphs, lists, `code`,
 * **bold**, [text](url)) as HTML; all text escaped. */
char *pp_html_from_markdown(const char *markdown);
/* The page head with title and the pack's stylesheet link. */
void pp_html_begin(GString *out, const char *title, const char *css_href);
void pp_html_end(GString *out);
/* The stylesheet shared by the pack and the comparison page. */
const char *pp_html_stylesheet(void);

/* Renders the crops and the share charts of one document's findings into dir/img/ and
 * writes dir/<page_name>. pdf_path is the scanned file (NULL: no crops); password opens
 * it when encrypted (may be NULL), here and below. */
gboolean pp_html_write_document(const char *dir, const char *page_name, JsonObject *doc,
                                const char *pdf_path, const char *password, GError **error);
/* Crop of a finding's figure at 150 dpi with the overlays; PNG at png_path. Returns the
 * image size in pixels through w, h. */
gboolean pp_html_render_crop(const char *pdf_path, const char *password, JsonObject *doc,
                             JsonObject *finding, const char *png_path, int *w, int *h,
                             GError **error);
/* Ink share against value share of each element, bars from zero; PNG. */
gboolean pp_html_render_shares(JsonObject *finding, const char *png_path, int *w, int *h,
                               GError **error);

typedef struct pp_html_index pp_html_index;
pp_html_index *pp_html_index_new(void);
/* Records one document's counts and its page name for the index. */
void pp_html_index_add(pp_html_index *idx, JsonObject *doc, const char *page_name);
/* Writes index.html (and its pre-sorted twins), the rule pages, style.css. */
gboolean pp_html_index_finish(pp_html_index *idx, const char *dir, GError **error);
void pp_html_index_free(pp_html_index *idx);

/* ---- annotated copies (annotate.c) ---- */

/* Writes out_path: a copy of pdf_path with one square annotation per finding of doc on
 * its figure, note = headline + measures. pdf_path is never written. Returns the count
 * through n_added. */
gboolean pp_annotate_write(const char *pdf_path, const char *password, JsonObject *doc,
                           const char *out_path, guint *n_added, GError **error);

G_END_DECLS
