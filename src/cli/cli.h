/* cli.h — what the command-line files share: parsed options and the one-line
 * stderr message every failure is reported with. */
#pragma once

#include "report/report.h"

typedef struct {
  char *output_dir;      /* never NULL after parsing */
  gboolean output_given; /* --output was on the command line */
  char *password;        /* NULL when not given */
  gboolean quiet, json;
  guint timeout_s;
  guint page; /* 1-based; scene and charts only */
  pp_thresholds thresholds;
} pp_cli_options;

/* `plotproof: FILE: WORD (MESSAGE)` on one line, newlines in MESSAGE flattened. */
void pp_cli_print_file_error(const char *file, const char *word, const char *message);

/* Exit codes, as documented in --help. */
enum {
  PP_EXIT_CLEAN = 0,
  PP_EXIT_FINDINGS = 1,
  PP_EXIT_USAGE = 2, /* also: every input failed */
  PP_EXIT_PARTIAL = 3,
};

int pp_cli_scan(char **paths, int n_paths, const pp_cli_options *opt);
int pp_cli_inspect(const char *path, gboolean charts, const pp_cli_options *opt);
