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
  /* Reviewer outputs and policy (review_cli.c, config.c); NULL/FALSE when not asked for. */
  char *html_dir, *csv_file, *sarif_file, *baseline_file, *who, *why;
  gboolean annotate;
  GPtrArray *disabled_rules; /* of char*: rule ids whose findings are dropped */
  GPtrArray *min_severity;   /* of char* "RULE=WORD": findings below WORD dropped */
  char *profile;             /* --profile NAME as given (profiles.c expands it), or NULL */
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

/* review_cli.c: the reviewer's outputs of a scan, and the commands around them. */
typedef struct pp_cli_review pp_cli_review;
/* NULL with *rc set when the options cannot be honoured (unreadable baseline). */
pp_cli_review *pp_cli_review_begin(const pp_cli_options *opt, int *rc);
/* Applies the baseline to root (so the summary and exit code count new findings only)
 * and writes this document's HTML page, annotated copy and CSV/SARIF rows. */
void pp_cli_review_document(pp_cli_review *rv, JsonNode *root, const char *pdf_path,
                            const char *output_name);
/* Writes the batch outputs, prints accepted findings and stale baseline entries. */
int pp_cli_review_end(pp_cli_review *rv, int rc);
/* Drops the findings (of pp_finding*) of disabled rules or below a rule's minimum. */
void pp_cli_filter_findings(const pp_cli_options *opt, GPtrArray *findings);
int pp_cli_compare(const char *old_path, const char *new_path, const pp_cli_options *opt);
int pp_cli_explain(const char *rule_id);
int pp_cli_rules(void);
int pp_cli_accept(const char *findings_file, char **ids, int n_ids, const pp_cli_options *opt);

/* config.c: a GLib key file turned into command-line options placed before the user's
 * own, so the command line wins. Returns a new argv (g_strfreev) or NULL on error. */
char **pp_cli_config_argv(int argc, char **argv, int *new_argc);

/* profiles.c: a profile's thresholds and rules as option words (FALSE with a message on
 * stderr when there is no such profile), and `plotproof profiles`. */
gboolean pp_cli_profile_words(const char *name, GPtrArray *words);
int pp_cli_profiles(void);
/* --enable-rule: an opt-in rule on, or a main-table rule's earlier --disable-rule undone;
 * FALSE with a message when there is no such rule. */
gboolean pp_cli_enable_rule(pp_cli_options *opt, const char *id);
