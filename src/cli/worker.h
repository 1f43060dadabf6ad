/* worker.h — runs one job in a forked child with limits (address space, CPU seconds,
 * wall clock), because poppler and cairo can abort(), loop or swell on hostile files;
 * the parent survives and reports what happened. Used for one page of `scene`/`charts`
 * and for each page of a document inside a batch worker (see docworker.h). */
#pragma once

#include <glib.h>
#include <sys/types.h>

/* Runs in the child; returns the payload (a JSON text) sent back through a pipe. */
typedef char *(*pp_worker_func)(gpointer data);

typedef struct {
  guint wall_s;         /* killed after this many seconds (0: no limit) */
  guint cpu_s;          /* RLIMIT_CPU (0: no limit) */
  guint64 memory_bytes; /* RLIMIT_AS (0: no limit) */
} pp_worker_limits;

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
  long max_rss_kib; /* peak resident memory of the child (getrusage) */
  double cpu_s;     /* user + system CPU seconds of the child */
  GString *payload;
} pp_worker_result;

/* Blocks until the child ends or the wall limit passes (then kills it). result->payload is
 * always allocated; free it with g_string_free(). */
void pp_worker_run(pp_worker_func func, gpointer data, const pp_worker_limits *limits,
                   pp_worker_result *result);

/* Runs in the child of pp_worker_run_lines: writes newline-ended lines to fd (a memory
 * file, so a write never waits for the parent); returns FALSE on failure. */
typedef gboolean (*pp_worker_lines_func)(int fd, gpointer data);
/* Called in the parent for each line (without its newline), then with NULL after the lines
 * that came together (a chance to pass them on in one write); FALSE stops the child. */
typedef gboolean (*pp_worker_line_func)(const char *line, gpointer data);

/* Like pp_worker_run for a child that reports in lines: the wall limit applies to each
 * line (from the start, then from the line before), so one child can do many short jobs
 * each under the limit. The parent looks for lines a few times a second and at the child's
 * end, not at each line; a line cut short by the child's death is never handed on.
 * result->payload holds no copy of the lines (on_line has them): it is not empty once a
 * non-empty line came, which DONE needs. */
void pp_worker_run_lines(pp_worker_lines_func func, gpointer data, const pp_worker_limits *limits,
                         pp_worker_line_func on_line, gpointer line_data, pp_worker_result *result);

/* In a pp_worker_run_lines child before each job: the alarm and the CPU limit (soft, under
 * the child's hard limit) start again for the job's own wall_s and cpu_s, counted from now,
 * the child's getrusage(RUSAGE_SELF) of a moment ago. */
struct rusage;
void pp_worker_child_rearm(const pp_worker_limits *job, const struct rusage *now);

/* What every child does first: default signal dispositions, death with the parent
 * (PR_SET_PDEATHSIG, and _exit if the parent is already gone), no core files, the
 * limits, and an alarm a little after the wall limit so that even an orphan ends. */
void pp_worker_child_setup(const pp_worker_limits *limits, pid_t parent);

/* TRUE when RLIMIT_AS is applied (not under AddressSanitizer, whose shadow memory needs
 * terabytes of address space). */
gboolean pp_worker_memory_limit_applies(void);

/* Writes all of data, retrying on EINTR; FALSE on error. */
gboolean pp_worker_write_all(int fd, const char *data, size_t len);
