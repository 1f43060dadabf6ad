/* assemble.h — the scheduler's side of a document: reads the worker's event lines
 * (docworker.h) and joins the one-page findings objects into the document's findings
 * object, with pages never finished listed as not analysed and the totals summed. */
#pragma once

#include <json-glib/json-glib.h>

typedef struct pp_assembly pp_assembly;

pp_assembly *pp_assembly_new(void);
void pp_assembly_free(pp_assembly *as);

/* One line from the worker, without its newline. Unreadable lines are counted, not fatal. */
void pp_assembly_feed(pp_assembly *as, const char *line, gsize len);

/* After the worker is gone. NULL when the document cannot be opened (or the worker died
 * before telling its header): then *word and *reason say why (owned by as). Otherwise
 * the findings object (new reference); pages never reported get interrupted_reason, or,
 * after a stop line, its reason. */
JsonNode *pp_assembly_finish(pp_assembly *as, const char *interrupted_reason, const char **word,
                             const char **reason);

/* The same, written out: *text is the findings object as json-glib's pretty generator writes
 * it (no final newline; g_free it), and the node returned holds everything but the page
 * entries ("pages" is empty), which is enough for the totals and the summary counts. */
JsonNode *pp_assembly_finish_text(pp_assembly *as, const char *interrupted_reason,
                                  const char **word, const char **reason, char **text);

gboolean pp_assembly_ended(const pp_assembly *as);     /* the worker said {"end": true} */
guint pp_assembly_pages(const pp_assembly *as);        /* pages of the document, 0 before open */
guint pp_assembly_pages_done(const pp_assembly *as);   /* page results received */
guint pp_assembly_pages_failed(const pp_assembly *as); /* of those, not analysed */
int pp_assembly_last_page(const pp_assembly *as);      /* 1-based page last started, 0: none */
long pp_assembly_max_rss_kib(const pp_assembly *as);
const char *pp_assembly_first_page_error(const pp_assembly *as); /* "page N: reason" or NULL */
