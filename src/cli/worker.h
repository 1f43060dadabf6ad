/* worker.h — runs one job in a forked child with a deadline, because poppler and cairo
 * can abort() or loop on hostile files; the parent survives and reports what happened. */
#pragma once

#include <glib.h>

/* Runs in the child; returns the payload (a JSON text) sent back through a pipe. */
typedef char *(*pp_worker_func)(gpointer data);

typedef enum {
  PP_WORKER_DONE,      /* payload holds what the child sent */
  PP_WORKER_SIGNALLED, /* signal holds the signal number */
  PP_WORKER_TIMED_OUT,
  PP_WORKER_EXITED,  /* ended without a payload; exit_status holds its status */
  PP_WORKER_NO_FORK, /* fork or pipe failed; message in payload */
} pp_worker_outcome;

typedef struct {
  pp_worker_outcome outcome;
  int signal;
  int exit_status;
  GString *payload;
} pp_worker_result;

/* Blocks until the child ends or timeout_s elapse (then kills it). result->payload is
 * always allocated; free it with g_string_free(). */
void pp_worker_run(pp_worker_func func, gpointer data, guint timeout_s, pp_worker_result *result);
