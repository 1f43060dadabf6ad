/* cli.h — what the command-line files share: parsed options, exit codes and the one-line
 * stderr message every failure is reported with. */
#pragma once

#include "report/report.h"

typedef struct {
  char *output_dir;      /* never NULL after parsing */
  gboolean output_given; /* --output was on the command line */
  char *password;        /* --password or $PLOTPROOF_PASSWORD; NULL when neither */
  char *password_file;   /* --password-file, NULL when not given */
  char *from;            /* --from FILE ("-" = stdin), NULL when not given */
  gboolean quiet, json, force, progress;
  guint jobs;             /* worker processes at once */
  guint timeout_s;        /* wall-clock seconds per document */
  guint cpu_s;            /* CPU seconds per document (worker and its page processes) */
  guint page_s;           /* wall-clock seconds per page: the page budget */
  guint memory_mib;       /* address space per worker process */
  guint shard_k, shard_n; /* --shard K/N, 1-based; 1/1 when not given */
  guint page;             /* 1-based; scene and charts only */
  pp_thresholds thresholds;
} pp_cli_options;

/* `plotproof: FILE: WORD (MESSAGE)` on one line, control characters escaped. */
void pp_cli_print_file_error(const char *file, const char *word, const char *message);
/* A copy safe to print on a terminal: control characters (C0, DEL, C1) and invalid UTF-8
 * become \xNN, so names and PDF text cannot move the cursor or change the terminal. */
char *pp_cli_escape(const char *text);

/* Exit codes, as documented in --help and README.md. */
enum {
  PP_EXIT_CLEAN = 0,
  PP_EXIT_FINDINGS = 1,
  PP_EXIT_USAGE = 2,
  PP_EXIT_PARTIAL = 3,     /* some documents failed or had pages not analysed */
  PP_EXIT_ALL_FAILED = 4,  /* no document could be scanned, or output cannot be written */
  PP_EXIT_INTERRUPTED = 5, /* stopped by SIGINT/SIGTERM/SIGHUP; finished results kept */
};

int pp_cli_scan(char **paths, int n_paths, const pp_cli_options *opt);
int pp_cli_inspect(const char *path, gboolean charts, const pp_cli_options *opt);
int pp_cli_merge(char **dirs, int n_dirs, const pp_cli_options *opt);
