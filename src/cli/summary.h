/* summary.h — the human summary on stdout, read back from each document's findings
 * object (the same JSON the child wrote), so the summary can never disagree with the file. */
#pragma once

#include <json-glib/json-glib.h>

typedef struct {
  guint documents, failed, pages, figures, findings;
  guint by_severity[3];            /* indexed by pp_severity */
  double gdi_limit, severe_factor; /* from the findings files, for the severity line */
} pp_summary_totals;

/* Prints one document's block and adds its counts to totals. output_file may be NULL. */
void pp_summary_print_document(JsonObject *report, const char *path, const char *output_file,
                               pp_summary_totals *totals);
void pp_summary_print_total(const pp_summary_totals *totals);
/* Adds to totals without printing (for --quiet and --json, which still need the exit code). */
void pp_summary_count_document(JsonObject *report, pp_summary_totals *totals);
