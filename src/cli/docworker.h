/* docworker.h — the batch worker: one process per document, forked by the launcher
 * (launcher.h: never from the scheduler, which has GLib threads, so that no lock another
 * thread held comes along), with its job as JSON text. It opens the document and runs each page in
 * a page child of its own under the page budget, streaming one JSON line per event to the
 * scheduler, so that every page finished before a crash or a timeout reaches the findings file. */
#pragma once

#include "cli.h"

typedef struct {
  const char *path;
  const char *password;
  const pp_cli_options *opt;
  const pp_file_digest *digest; /* the scheduler's, reused while the file keeps its identity */
} pp_docworker_job;

/* The lines written to fd, each one JSON object:
 *   {"error": {"code", "word", "message"}}       the document cannot be opened
 *   {"open": <findings object without pages>}    header, document identity
 *   {"start": I}                                 page I (0-based) begins
 *   {"page": I, "report": {"pages": [entry], "findings": [...]}}   page I done
 *   {"page": I, "error": "too complex: ..."}     page I over its budget, or crashed
 *   {"stop": "..."}                              the document's CPU limit is spent
 *   {"end": true}                                all pages done
 * Returns the exit status for the worker process (0 whenever the lines were written; a
 * failed write ends the process at once with _exit(3)). */
int pp_docworker_main(int fd, const pp_docworker_job *job, pid_t parent);

/* The job as the scheduler hands it to the launcher (password included, so it never shows
 * on a command line). */
char *pp_docworker_job_to_json(const pp_docworker_job *job);
/* In a worker forked by the launcher: reads the job (and frees it), writes the event lines
 * to stdout and leaves with _exit(); parent is the launcher. A pp_launcher_job_func. */
G_NORETURN void pp_docworker_run_job(char *text, gsize len, pid_t parent);
