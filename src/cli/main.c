/* main.c — plotproof's command line: subcommand dispatch, option parsing, --help with
 * the exit codes, --version. All work is in scan.c and inspect.c. */
#include <getopt.h>
#include <math.h>
#include <signal.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cli.h"

#include <unistd.h>

/* Defaults for the limits; each is an option. Common practice, no source: a report page
 * of vector charts captures in well under a second here, so 30 s is a generous page
 * budget, and 2 GiB of address space is ten times what the corpus's largest page needs. */
#define DEFAULT_TIMEOUT_S 600
#define DEFAULT_PAGE_S 30
#define DEFAULT_MEMORY_MIB 2048
#define PASSWORD_ENV "PLOTPROOF_PASSWORD"

static void print_help(FILE *out) {
  fprintf(out,
          "Usage: plotproof scan [OPTIONS] PATH...\n"
          "       plotproof scan [OPTIONS] --from LIST\n"
          "       plotproof merge -o DIR SHARD_DIR...\n"
          "       plotproof scene FILE [--page N]\n"
          "       plotproof charts FILE [--page N]\n"
          "       plotproof compare OLD NEW [--json] [--html FILE]\n"
          "       plotproof explain RULE | plotproof rules | plotproof profiles\n"
          "       plotproof accept FINDINGS.json ID... --baseline FILE [--who NAME] [--why TEXT]\n"
          "       plotproof --help | --version\n"
          "\n"
          "Finds charts in PDF reports whose ink is not proportional to the values it\n"
          "stands for (truncated value axes under bars or areas, bars on log axes, bars\n"
          "or wedges that disagree with their labels, 3D bars, tilted pies, radial bars,\n"
          "polar areas, pyramids and funnels, bubbles sized by radius) and scores Tufte's\n"
          "Lie Factor and the Graph Discrepancy Index.\n"
          "\n"
          "scan: PATH is a file, or a directory searched recursively for *.pdf. Each\n"
          "document is scanned in its own worker process, its pages in page processes\n"
          "(a fresh one after a failed page), and gets DIR/<name>.findings.json, in folders "
          "mirroring the scanned\n"
          "directories (names that would still collide get a -<hash> suffix). Documents\n"
          "with the same content (SHA-256) are scanned once. DIR/batch.jsonl gets one\n"
          "line per document and a summary line. A rerun into the same DIR skips the\n"
          "documents already done with the same content, version and settings.\n"
          "  -o, --output DIR       where findings files go (default: current directory;\n"
          "                         created if missing)\n"
          "      --from LIST        also scan the paths listed in LIST, one per line\n"
          "                         ('-' reads standard input)\n"
          "  -j, --jobs N           documents at once (default: the number of cores)\n"
          "      --force            rescan documents an earlier run has done\n"
          "      --shard K/N        scan only part K of N (split by content hash); join\n"
          "                         the N output directories with 'plotproof merge'\n"
          "      --password-file F  passwords for encrypted PDFs, lines 'PATTERN PASSWORD'\n"
          "                         or 'sha256:HEX PASSWORD'; $" PASSWORD_ENV " is\n"
          "                         the password for the others\n"
          "  -p, --password PW      the same on the command line (visible to ps)\n"
          "  -q, --quiet            no summary on stdout, no progress line\n"
          "      --json             print each document's findings JSON (or its failure\n"
          "                         record) on stdout instead of the summary, one object\n"
          "                         per line (JSON Lines); files are then written only if\n"
          "                         --output is given\n"
          "      --progress         one stderr line per finished document (on a terminal\n"
          "                         a progress line is shown without it)\n"
          "      --timeout SECONDS  wall-clock limit per document (default %d)\n"
          "      --cpu-seconds S    CPU limit per document (default: the timeout)\n"
          "      --page-seconds S   budget per page; a page over it, or over the memory\n"
          "                         limit, is 'not analysed: too complex' (default %d)\n"
          "      --max-memory MIB   address space per worker process (default %d)\n"
          "      --lie-band LOW:HIGH  Lie Factor band taken as faithful (default 0.95:1.05)\n"
          "      --gdi-limit PCT    Graph Discrepancy Index limit, percent (default 10)\n"
          "      --html DIR         review pack: index, one page per document with crops\n"
          "      --annotate         DIR/<name>.annotated.pdf with a note on each flagged figure\n"
          "      --csv FILE         one row per finding for the batch (spreadsheet-safe)\n"
          "      --sarif FILE       the findings as SARIF 2.1.0\n"
          "      --baseline FILE    accepted findings (key file): report only new ones\n"
          "      --disable-rule ID  drop a rule's findings (repeatable)\n"
          "      --min-severity RULE=WORD  drop a rule's findings below WORD\n"
          "      --config FILE      options from a key file (default: $XDG_CONFIG_HOME/\n"
          "                         plotproof/config); the command line wins. --no-config\n"
          "      --profile NAME     a named set of thresholds and rules: default, strict,\n"
          "                         fund-past-performance, or the user's own (plotproof\n"
          "                         profiles lists them); also [scan] profile= in the\n"
          "                         configuration, which with the command line overrides it\n"
          "      --enable-rule ID   switch on an opt-in rule (a profile's check) or undo an\n"
          "                         earlier --disable-rule (repeatable)\n"
          "\n"
          "compare: findings of two drafts (PDFs or findings files): new, resolved,\n"
          "unchanged. explain: a rule's page. rules: the rules. accept: add findings to\n"
          "a baseline file with who, why and today's date. profiles: the profiles with\n"
          "the file each comes from (user's $XDG_CONFIG_HOME/plotproof/profiles/ first).\n"
          "A profile aids a review and is no legal opinion: the regulation's text and the\n"
          "competent authority's guidance prevail.\n"
          "\n"
          "scene: the captured scene of one page (marks, paths, clips, words) as JSON.\n"
          "charts: the figures recognised on one page (axes, ticks, elements) as JSON.\n"
          "  --page N               1-based page number (default 1)\n"
          "merge: joins the output directories of shards into -o DIR, checking that\n"
          "every shard is there once.\n"
          "\n",
          DEFAULT_TIMEOUT_S, DEFAULT_PAGE_S, DEFAULT_MEMORY_MIB);
  guint n = 0;
  const pp_rule_info *rules = pp_rules_list(&n);
  if (n > 0) {
    fprintf(out, "Rules:\n");
    for (guint i = 0; i < n; i++)
      fprintf(out, "  %-20s %s%s\n", rules[i].id, rules[i].opt_in ? "(opt-in) " : "",
              rules[i].summary);
    fprintf(out, "\n");
  }
  fprintf(out,
          "Exit codes:\n"
          "  0  clean: every document scanned, no findings\n"
          "  1  findings: every document scanned, at least one finding\n"
          "  2  usage error\n"
          "  3  some documents failed or have pages not analysed (partial); the others\n"
          "     were scanned (merge: a shard is missing or incomplete)\n"
          "  4  no document could be scanned (every input failed), or the output could\n"
          "     not be written\n"
          "  5  interrupted (SIGINT, SIGTERM, SIGHUP); finished documents are kept and a\n"
          "     rerun resumes\n"
          "\n"
          "Each failure is one stderr line: plotproof: FILE: reason.\n"
          "%s\n",
          PP_REPORT_DISCLAIMER);
}

static int usage_error(const char *fmt, const char *arg) {
  fprintf(stderr, "plotproof: ");
  fprintf(stderr, fmt, arg);
  fprintf(stderr, "\nTry 'plotproof --help'.\n");
  return PP_EXIT_USAGE;
}

static gboolean parse_double(const char *s, double *out) {
  char *end = NULL;
  double v = g_ascii_strtod(s, &end);
  if (!s[0] || !end || *end || !isfinite(v))
    return FALSE;
  *out = v;
  return TRUE;
}

static gboolean parse_uint(const char *s, guint min, guint max, guint *out) {
  guint64 v;
  if (!g_ascii_string_to_unsigned(s, 10, min, max, &v, NULL))
    return FALSE;
  *out = (guint)v;
  return TRUE;
}

static gboolean parse_band(const char *s, pp_thresholds *t) {
  char **parts = g_strsplit(s, ":", 3);
  double low, high;
  gboolean ok = g_strv_length(parts) == 2 && parse_double(parts[0], &low) &&
                parse_double(parts[1], &high) && low > 0 && low <= 1 && high >= 1;
  g_strfreev(parts);
  if (ok) {
    t->lie_band_low = low;
    t->lie_band_high = high;
  }
  return ok;
}

enum {
  OPT_JSON = 256,
  OPT_TIMEOUT,
  OPT_LIE_BAND,
  OPT_GDI_LIMIT,
  OPT_PAGE,
  OPT_FROM,
  OPT_FORCE,
  OPT_SHARD,
  OPT_PROGRESS,
  OPT_PASSWORD_FILE,
  OPT_CPU,
  OPT_PAGE_S,
  OPT_MEMORY,
  OPT_REVIEW, /* last: the reviewer options are OPT_REVIEW + index */
};

static gboolean parse_shard(const char *s, guint *k, guint *n) {
  char **parts = g_strsplit(s, "/", 3);
  gboolean ok = g_strv_length(parts) == 2 && parse_uint(parts[1], 1, 1000000, n) &&
                parse_uint(parts[0], 1, *n, k);
  g_strfreev(parts);
  return ok;
}

static const struct option long_options[] = {
    {"help", no_argument, NULL, 'h'},
    {"version", no_argument, NULL, 'V'},
    {"output", required_argument, NULL, 'o'},
    {"password", required_argument, NULL, 'p'},
    {"quiet", no_argument, NULL, 'q'},
    {"json", no_argument, NULL, OPT_JSON},
    {"timeout", required_argument, NULL, OPT_TIMEOUT},
    {"lie-band", required_argument, NULL, OPT_LIE_BAND},
    {"gdi-limit", required_argument, NULL, OPT_GDI_LIMIT},
    {"page", required_argument, NULL, OPT_PAGE},
    {"jobs", required_argument, NULL, 'j'},
    {"from", required_argument, NULL, OPT_FROM},
    {"force", no_argument, NULL, OPT_FORCE},
    {"shard", required_argument, NULL, OPT_SHARD},
    {"progress", no_argument, NULL, OPT_PROGRESS},
    {"password-file", required_argument, NULL, OPT_PASSWORD_FILE},
    {"cpu-seconds", required_argument, NULL, OPT_CPU},
    {"page-seconds", required_argument, NULL, OPT_PAGE_S},
    {"max-memory", required_argument, NULL, OPT_MEMORY},
    /* reviewer outputs (review_cli.c), all OPT_REVIEW + index below */
    {"html", required_argument, NULL, OPT_REVIEW + 0},
    {"csv", required_argument, NULL, OPT_REVIEW + 1},
    {"sarif", required_argument, NULL, OPT_REVIEW + 2},
    {"baseline", required_argument, NULL, OPT_REVIEW + 3},
    {"annotate", no_argument, NULL, OPT_REVIEW + 4},
    {"disable-rule", required_argument, NULL, OPT_REVIEW + 5},
    {"min-severity", required_argument, NULL, OPT_REVIEW + 6},
    {"who", required_argument, NULL, OPT_REVIEW + 7},
    {"why", required_argument, NULL, OPT_REVIEW + 8},
    {"config", required_argument, NULL, OPT_REVIEW + 9},
    {"no-config", no_argument, NULL, OPT_REVIEW + 10},
    {"profile", required_argument, NULL, OPT_REVIEW + 11},
    {"enable-rule", required_argument, NULL, OPT_REVIEW + 12},
    {NULL, 0, NULL, 0},
};

typedef enum {
  CMD_NONE,
  CMD_SCAN,
  CMD_SCENE,
  CMD_CHARTS,
  CMD_COMPARE,
  CMD_EXPLAIN,
  CMD_RULES,
  CMD_ACCEPT,
  CMD_MERGE,
  CMD_PROFILES
} command;

/* The reviewer options: stored as given (later ones win); checked where used. */
static gboolean review_option(int c, const char *arg, pp_cli_options *opt) {
  char **slot[] = {&opt->html_dir, &opt->csv_file, &opt->sarif_file, &opt->baseline_file};
  int k = c - OPT_REVIEW;
  if (k >= 0 && k < 4) {
    g_free(*slot[k]);
    *slot[k] = g_strdup(arg);
  } else if (k == 4) {
    opt->annotate = TRUE;
  } else if (k == 5 || k == 6) {
    GPtrArray **list = k == 5 ? &opt->disabled_rules : &opt->min_severity;
    if (!*list)
      *list = g_ptr_array_new_with_free_func(g_free);
    g_ptr_array_add(*list, g_strdup(arg));
  } else if (k == 7 || k == 8) {
    char **s = k == 7 ? &opt->who : &opt->why;
    g_free(*s);
    *s = g_strdup(arg);
  } else if (k == 11) { /* expanded by config.c before parsing; kept for the record */
    g_free(opt->profile);
    opt->profile = g_strdup(arg);
  } else if (k == 12) {
    return pp_cli_enable_rule(opt, arg);
  } else if (k != 9 && k != 10) {
    return FALSE;
  }
  return TRUE;
}

/* Returns -1 to go on, or an exit code (help, version, usage error). */
static int parse_options(int argc, char **argv, command cmd, pp_cli_options *opt) {
  gboolean scan_only = FALSE, page_given = FALSE, cpu_given = FALSE;
  opterr = 0; /* our own messages, in our format */
  optind = 1;
  int c;
  while ((c = getopt_long(argc, argv, ":hVo:p:qj:", long_options, NULL)) != -1) {
    switch (c) {
    case 'h': print_help(stdout); return PP_EXIT_CLEAN;
    case 'V': printf("plotproof %s\n", PP_VERSION); return PP_EXIT_CLEAN;
    case 'o':
      g_free(opt->output_dir);
      opt->output_dir = g_strdup(optarg);
      opt->output_given = scan_only = TRUE;
      break;
    case 'p':
      g_free(opt->password);
      opt->password = g_strdup(optarg);
      break;
    case 'q': opt->quiet = scan_only = TRUE; break;
    case OPT_JSON: opt->json = scan_only = TRUE; break;
    case OPT_TIMEOUT:
      if (!parse_uint(optarg, 1, 86400, &opt->timeout_s))
        return usage_error("--timeout wants whole seconds from 1 to 86400, not '%s'", optarg);
      break;
    case OPT_LIE_BAND:
      scan_only = TRUE;
      if (!parse_band(optarg, &opt->thresholds))
        return usage_error("--lie-band wants LOW:HIGH with 0 < LOW <= 1 <= HIGH, not '%s'", optarg);
      break;
    case OPT_GDI_LIMIT: {
      double v;
      scan_only = TRUE;
      if (!parse_double(optarg, &v) || v <= 0)
        return usage_error("--gdi-limit wants a positive percentage, not '%s'", optarg);
      opt->thresholds.gdi_limit = v;
      break;
    }
    case 'j':
      scan_only = TRUE;
      if (!parse_uint(optarg, 1, 1024, &opt->jobs))
        return usage_error("--jobs wants a number of processes from 1 to 1024, not '%s'", optarg);
      break;
    case OPT_FROM:
      scan_only = TRUE;
      g_free(opt->from);
      opt->from = g_strdup(optarg);
      break;
    case OPT_FORCE: opt->force = scan_only = TRUE; break;
    case OPT_PROGRESS: opt->progress = scan_only = TRUE; break;
    case OPT_SHARD:
      scan_only = TRUE;
      if (!parse_shard(optarg, &opt->shard_k, &opt->shard_n))
        return usage_error("--shard wants K/N with 1 <= K <= N, not '%s'", optarg);
      break;
    case OPT_PASSWORD_FILE:
      g_free(opt->password_file);
      opt->password_file = g_strdup(optarg);
      break;
    case OPT_CPU:
      cpu_given = TRUE;
      if (!parse_uint(optarg, 1, 86400, &opt->cpu_s))
        return usage_error("--cpu-seconds wants whole seconds from 1 to 86400, not '%s'", optarg);
      break;
    case OPT_PAGE_S:
      scan_only = TRUE;
      if (!parse_uint(optarg, 1, 86400, &opt->page_s))
        return usage_error("--page-seconds wants whole seconds from 1 to 86400, not '%s'", optarg);
      break;
    case OPT_MEMORY:
      if (!parse_uint(optarg, 64, 1u << 22, &opt->memory_mib))
        return usage_error("--max-memory wants MiB from 64 to 4194304, not '%s'", optarg);
      break;
    case OPT_PAGE:
      page_given = TRUE;
      if (!parse_uint(optarg, 1, G_MAXINT, &opt->page))
        return usage_error("--page wants a page number from 1, not '%s'", optarg);
      break;
    case ':': return usage_error("option '%s' needs a value", argv[optind - 1]);
    default:
      if (c >= OPT_REVIEW && review_option(c, optarg, opt))
        break;
      return usage_error("unknown option '%s'", argv[optind - 1]);
    }
  }
  if (!cpu_given)
    opt->cpu_s = opt->timeout_s;
  if (cmd == CMD_SCAN && page_given)
    return usage_error("%s", "--page is for 'scene' and 'charts', not 'scan'");
  if ((cmd == CMD_SCENE || cmd == CMD_CHARTS || cmd == CMD_EXPLAIN || cmd == CMD_RULES ||
       cmd == CMD_ACCEPT) &&
      scan_only)
    return usage_error("%s",
                       "--output, --quiet, --json, --jobs, --from, --force, --shard, --progress, "
                       "--page-seconds, --lie-band and --gdi-limit are for 'scan'");
  if (opt->quiet && opt->json)
    return usage_error("%s", "--quiet and --json exclude each other");
  return -1;
}

static command command_from(const char *word) {
  if (strcmp(word, "scan") == 0)
    return CMD_SCAN;
  if (strcmp(word, "scene") == 0)
    return CMD_SCENE;
  if (strcmp(word, "charts") == 0)
    return CMD_CHARTS;
  if (strcmp(word, "merge") == 0)
    return CMD_MERGE;
  if (strcmp(word, "compare") == 0)
    return CMD_COMPARE;
  if (strcmp(word, "explain") == 0)
    return CMD_EXPLAIN;
  if (strcmp(word, "rules") == 0)
    return CMD_RULES;
  if (strcmp(word, "accept") == 0)
    return CMD_ACCEPT;
  if (strcmp(word, "profiles") == 0)
    return CMD_PROFILES;
  return CMD_NONE;
}

static int run(int argc, char **argv, pp_cli_options *opt) {
  if (argc < 2)
    return usage_error("%s", "missing command (scan, merge, scene or charts)");
  command cmd = command_from(argv[1]);
  if (cmd == CMD_NONE && argv[1][0] != '-')
    return usage_error("unknown command '%s' (scan, merge, scene or charts)", argv[1]);
  /* Parse the words after the command (or all of them for a bare --help). */
  int skip = cmd == CMD_NONE ? 0 : 1;
  int rc = parse_options(argc - skip, argv + skip, cmd, opt);
  if (rc >= 0)
    return rc;
  int n_args = argc - skip - optind;
  char **args = argv + skip + optind;
  switch (cmd) {
  case CMD_NONE: return usage_error("%s", "missing command (scan, merge, scene or charts)");
  case CMD_MERGE:
    if (n_args < 1 || !opt->output_given)
      return usage_error("%s", "merge needs -o DIR and at least one shard directory");
    return pp_cli_merge(args, n_args, opt);
  case CMD_SCAN:
    if (n_args < 1 && !opt->from)
      return usage_error("%s", "scan needs at least one PATH (or --from LIST)");
    return pp_cli_scan(args, n_args, opt);
  case CMD_SCENE:
  case CMD_CHARTS:
    if (n_args != 1)
      return usage_error("%s needs exactly one FILE", argv[1]);
    return pp_cli_inspect(args[0], cmd == CMD_CHARTS, opt);
  case CMD_COMPARE:
    if (n_args != 2)
      return usage_error("%s", "compare needs OLD and NEW (PDFs or findings files)");
    return pp_cli_compare(args[0], args[1], opt);
  case CMD_EXPLAIN:
    if (n_args != 1)
      return usage_error("%s", "explain needs one RULE ('plotproof rules' lists them)");
    return pp_cli_explain(args[0]);
  case CMD_RULES: return pp_cli_rules();
  case CMD_PROFILES: return pp_cli_profiles();
  case CMD_ACCEPT:
    if (n_args < 2)
      return usage_error("%s", "accept needs a findings file and at least one finding id");
    return pp_cli_accept(args[0], args + 1, n_args - 1, opt);
  }
  return PP_EXIT_USAGE;
}

int main(int argc, char **argv) {
  /* A closed stdout pipe (plotproof ... | head) must end in an error, not a signal. */
  signal(SIGPIPE, SIG_IGN);
  /* Debug output (G_MESSAGES_DEBUG=plotproof-recognize) goes to stderr, never into the
   * JSON on stdout; GLib sends debug to stdout by default. */
  g_log_writer_default_set_use_stderr(TRUE);
  pp_cli_options opt = {0};
  opt.output_dir = g_strdup(".");
  opt.timeout_s = DEFAULT_TIMEOUT_S;
  opt.page_s = DEFAULT_PAGE_S;
  opt.memory_mib = DEFAULT_MEMORY_MIB;
  opt.jobs = MAX(1, g_get_num_processors());
  opt.shard_k = opt.shard_n = 1;
  const char *env_password = g_getenv(PASSWORD_ENV);
  opt.password = env_password && *env_password ? g_strdup(env_password) : NULL;
  opt.page = 1;
  opt.thresholds = pp_thresholds_default();
  int n_words = 0;
  char **words = pp_cli_config_argv(argc, argv, &n_words);
  int rc = words ? run(n_words, words, &opt) : PP_EXIT_USAGE;
  g_strfreev(words);
  g_free(opt.output_dir);
  g_free(opt.password);
  g_free(opt.password_file);
  g_free(opt.from);
  g_free(opt.html_dir), g_free(opt.csv_file), g_free(opt.sarif_file), g_free(opt.baseline_file);
  g_free(opt.who), g_free(opt.why), g_free(opt.profile);
  if (opt.disabled_rules)
    g_ptr_array_unref(opt.disabled_rules);
  if (opt.min_severity)
    g_ptr_array_unref(opt.min_severity);
  return rc;
}
