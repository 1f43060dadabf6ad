/* record.h — batch.jsonl, the batch record: one JSON line per document (failures
 * included) and a closing {"summary": ...} line. The reader is forgiving: a run killed
 * mid-write leaves a cut last line, which is skipped, and a later line for the same
 * output replaces an earlier one. */
#pragma once

#include <json-glib/json-glib.h>

#define PP_RECORD_FILE "batch.jsonl"

typedef struct {
  const char *path, *output, *sha256, *status, *word, *reason, *key, *duplicate_of;
  guint64 size;
  gint64 pages, pages_done, pages_failed, last_page, figures, findings;
  double seconds;
  long max_rss_mib;
  gboolean resumed;
} pp_record;

/* Document statuses. */
#define PP_STATUS_OK "ok"
#define PP_STATUS_PARTIAL "partial"
#define PP_STATUS_FAILED "failed"
#define PP_STATUS_DUPLICATE "duplicate"
#define PP_STATUS_INTERRUPTED "interrupted"

/* Compact JSON object, no newline. NULL strings are left out. */
char *pp_record_to_line(const pp_record *r);

/* TRUE when text[0..len) is one JSON object with nothing but white space around it (only
 * the nesting is checked; the JSON parser checks the rest). json-glib 1.6 takes "{..}{..}"
 * as a document, keeps the last object and loses the others unfreed, so lines that read
 * hostile or cut JSON check this first. */
gboolean pp_json_is_one_object(const char *text, gsize len);

/* Parses JSON Lines text: returns output name → JsonObject* (owned by the table) of the
 * last well-formed record per output; *summary (may be NULL) gets a new reference to the
 * last summary object, or NULL. Never fails: what cannot be read is skipped. */
GHashTable *pp_records_parse(const char *data, gsize len, JsonObject **summary);
/* The same for a file; an absent or unreadable file gives an empty table. */
GHashTable *pp_records_load(const char *path, JsonObject **summary);
