/* analyse.h — the work done inside a child process: one page of a document as a
 * one-page findings object (scan), or one page's scene or charts (inspect), returned
 * as a JSON payload for the parent. */
#pragma once

#include "cli.h"

typedef struct {
  const char *path;
  const char *password;
  const pp_cli_options *opt;
  gboolean charts; /* inspect: recognised charts instead of the scene */
  /* Set by the document worker (docworker.c) for its page children. */
  pp_document *doc;
  guint page_index;
  int messages_fd; /* where library messages on stderr are caught, or -1 */
} pp_analyse_job;

/* Payload: page job->page_index alone as {"pages":[its entry],"findings":[...]} (compact;
 * pp_report_parts_to_string), its library messages among the page's warnings. Never NULL. */
char *pp_analyse_report_page(gpointer job);
/* Payload: the compact findings object of the whole document, pages in this process
 * (for `compare`, which scans one PDF at a time), or the error object. */
char *pp_analyse_document(gpointer job);
/* Payload: the pretty scene or charts object, or the error object. */
char *pp_analyse_page(gpointer job);

/* {"error": {"code", "word", "message"}}. */
char *pp_analyse_error_payload(int code, const char *word, const char *message);
/* The same from a GError, which it frees. */
char *pp_analyse_gerror_payload(GError *error);

/* Appends the lines caught on fd since offset 0 (at most a few dozen, each once) to
 * warnings, then empties fd. */
void pp_analyse_take_messages(int fd, GPtrArray *warnings);
