/* docworker.h — the batch worker: one process per document, forked by the scheduler.
 * It opens the document and runs each page in a page child of its own under the page
 * budget, streaming one JSON line per event to the scheduler, so that every page
 * finished before a crash or a timeout reaches the findings file. */
#pragma once

#include "cli.h"

typedef struct {
  const char *path;
  const char *password;
  const pp_cli_options *opt;
} pp_docworker_job;

/* The lines written to fd, each one JSON object:
 *   {"error": {"code", "word", "message"}}       the document cannot be opened
 *   {"open": <findings object without pages>}    header, document identity
 *   {"start": I}                                 page I (0-based) begins
 *   {"page": I, "report": <one-page findings>}   page I done
 *   {"page": I, "error": "too complex: ..."}     page I over its budget, or crashed
 *   {"stop": "..."}                              the document's CPU limit is spent
 *   {"end": true}                                all pages done
 * Never returns: the process ends with _exit(). */
G_NORETURN void pp_docworker_main(int fd, const pp_docworker_job *job, pid_t parent);
