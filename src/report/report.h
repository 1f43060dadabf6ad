/* report.h — contract of the report stage: the findings file (format "plotproof-findings",
 * version 3, see docs/findings-format.md) built page by page, plus developer JSON views of
 * one page's scene and recognised charts. Everything is written with json-glib. */
#pragma once

#include <json-glib/json-glib.h>

#include "rules/rules.h"

G_BEGIN_DECLS

#define PP_REPORT_FORMAT "plotproof-findings"
#define PP_REPORT_VERSION 3
#define PP_REPORT_DISCLAIMER                                                                       \
  "These verdicts are an aid to a reviewer, not an audit opinion; the applicable reporting "       \
  "standards and regulator rules prevail."
#define PP_REPORT_LIE_FACTOR_DEFINITION                                                            \
  "Tufte: ((ink_last-ink_first)/ink_first)/((value_last-value_first)/value_first)"

/* One document's findings, accumulated a page at a time so that a page's scene can be
 * freed before the next page is captured; only the small per-page JSON is kept. */
typedef struct pp_report pp_report;

/* Copies what it needs from info and thresholds. */
pp_report *pp_report_new(const pp_document_info *info, const pp_thresholds *thresholds);
void pp_report_free(pp_report *report);
G_DEFINE_AUTOPTR_CLEANUP_FUNC(pp_report, pp_report_free)

/* Appends one analysed page: its coverage (from scene and charts) and its findings
 * (of pp_finding*; may be NULL). Nothing is retained; the caller frees all three. */
void pp_report_add_page(pp_report *report, const pp_scene *scene, const pp_page_charts *charts,
                        const GPtrArray *findings);

/* Appends a page that could not be captured (page_index is 0-based). */
void pp_report_add_failed_page(pp_report *report, guint page_index, const char *reason);

guint pp_report_n_pages_added(const pp_report *report);
guint pp_report_n_pages_failed(const pp_report *report);
guint pp_report_n_findings(const pp_report *report);

/* The whole findings object; a new node owned by the caller. */
JsonNode *pp_report_to_json(const pp_report *report);
/* Serialised; pretty for files, compact (one line, for JSON Lines) otherwise. */
char *pp_report_to_string(const pp_report *report, gboolean pretty, gsize *length);
/* Only the page entries and the findings, compact: {"pages":[...],"findings":[...]}, what the
 * scheduler takes from a page process (it has the rest from the document worker's header and
 * sums the totals itself). */
char *pp_report_parts_to_string(const pp_report *report, gsize *length);
/* Writes atomically (temporary file + rename) so a crash never leaves half a file. */
gboolean pp_report_write_file(const pp_report *report, const char *path, GError **error);

/* Developer views of one page, for `plotproof scene` and `plotproof charts`. */
JsonNode *pp_report_scene_to_json(const pp_scene *scene);
JsonNode *pp_report_charts_to_json(const pp_scene *scene, const pp_page_charts *charts);

/* Serialises any node; NaN and infinities were already written as null by the builders. */
char *pp_report_node_to_string(JsonNode *node, gboolean pretty, gsize *length);

G_END_DECLS
