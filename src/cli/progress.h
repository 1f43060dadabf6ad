/* progress.h — how far a batch is, on stderr: on a terminal one line updated in place
 * (documents and pages done, findings, failures, rate, time left); with --progress one
 * line per document instead; otherwise nothing. */
#pragma once

#include <glib.h>

typedef struct pp_progress pp_progress;

/* in_place: stderr is a terminal; lines: --progress. Both FALSE: silent. */
pp_progress *pp_progress_new(guint total, gboolean in_place, gboolean lines);
void pp_progress_free(pp_progress *p);

void pp_progress_pages(pp_progress *p, guint pages);
/* A document finished (status as in the batch record). */
void pp_progress_document(pp_progress *p, const char *path, const char *status, guint pages,
                          guint findings, double seconds);
/* Redraws the in-place line (called by a timer). */
void pp_progress_draw(pp_progress *p);
/* Erases the in-place line before something else is printed on the terminal. */
void pp_progress_clear(pp_progress *p);
/* Documents done so far and the total. */
guint pp_progress_done(const pp_progress *p);
