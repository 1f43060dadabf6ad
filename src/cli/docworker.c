/* docworker.c — inside a batch worker: limits, stderr caught for the findings file's
 * warnings, the document opened once, pages run in forked page children, each page under
 * the page budget. A page child inherits the opened document (copy-on-write), so nothing
 * is parsed twice, and takes pages until its memory has grown by a bound, so poppler's
 * caches (fonts, objects) stay warm; a page that fails ends its child, and the next page
 * starts in a fresh one. */
#include <signal.h>
#include <stdio.h>
#include <string.h>
#include <sys/mman.h>
#include <sys/resource.h>
#include <unistd.h>

#include "analyse.h"
#include "docworker.h"
#include "worker.h"

/* A page process that dies by signal after using more than this share of the memory
 * budget is taken as out of memory (RLIMIT_AS makes allocations fail, and poppler and
 * GLib then abort). Common practice, no source. */
#define PP_DOCWORKER_MEMORY_SHARE 0.5
/* A page child takes no further page once its peak resident memory has grown by this much
 * since its fork: it bounds what poppler's caches and a fragmented heap can hold, while a
 * fresh child's fork, copy-on-write faults and cold caches are paid once per document, not
 * every 32 pages as before (on the 300-page report of scripts/bench-speed: 5,800 page
 * faults against 15,900, and 0.44 s of CPU against 0.49 s). Four times the 16 MB a page
 * process holds there; common practice, no source. */
#define PP_DOCWORKER_RECYCLE_GROWTH_MIB 64
/* ...and at most this share of the memory budget, so that a page child which crashes above
 * PP_DOCWORKER_MEMORY_SHARE of the budget can only have got there on its last page. */
#define PP_DOCWORKER_RECYCLE_SHARE 0.25

static void send_line(int fd, const char *line) {
  char *with_nl = g_strconcat(line, "\n", NULL);
  if (!pp_worker_write_all(fd, with_nl, strlen(with_nl)))
    _exit(3); /* the scheduler is gone */
  g_free(with_nl);
}

/* Library messages go to a memory file instead of the terminal; each page child reads
 * its own and files them among its page's warnings. */
static int catch_stderr(void) {
  int mfd = memfd_create("plotproof-messages", 0);
  if (mfd < 0 || dup2(mfd, STDERR_FILENO) < 0)
    return -1;
  close(mfd);
  return STDERR_FILENO;
}

static gboolean messages_mention_memory(int fd) {
  char buf[4097];
  ssize_t n = fd >= 0 ? pread(fd, buf, sizeof buf - 1, 0) : -1;
  if (n <= 0)
    return FALSE;
  buf[n] = '\0';
  return strstr(buf, "alloc") || strstr(buf, "memory");
}

/* The page entry's reason for a page child that gave no result. */
static char *page_failure(const pp_worker_result *r, const pp_cli_options *opt, int messages_fd) {
  if (r->outcome == PP_WORKER_TIMED_OUT ||
      (r->outcome == PP_WORKER_SIGNALLED && (r->signal == SIGALRM || r->signal == SIGXCPU)))
    return g_strdup_printf("too complex: over the page budget of %u s", opt->page_s);
  gboolean limited = pp_worker_memory_limit_applies();
  double budget_kib = opt->memory_mib * 1024.0;
  if (r->outcome == PP_WORKER_SIGNALLED &&
      (messages_mention_memory(messages_fd) ||
       (limited && r->max_rss_kib > PP_DOCWORKER_MEMORY_SHARE * budget_kib)))
    return g_strdup_printf("too complex: over the memory budget of %u MiB", opt->memory_mib);
  if (r->outcome == PP_WORKER_SIGNALLED)
    return g_strdup_printf("damaged: the page's capture crashed (signal %d)", r->signal);
  if (r->outcome == PP_WORKER_NO_FORK)
    return g_strdup_printf("not analysed: %s", r->payload->str);
  return g_strdup_printf("damaged: the page's capture ended without a result (exit status %d)",
                         r->exit_status);
}

/* A page child's run: pages from first, until its memory has grown by recycle_kib. */
typedef struct {
  pp_analyse_job page; /* page_index is set for each page */
  guint first, n_pages;
  const pp_worker_limits *page_limits;
  long recycle_kib;
} page_run;

static double cpu_of(const struct rusage *ru) {
  return (double)ru->ru_utime.tv_sec + ru->ru_utime.tv_usec / 1e6 + (double)ru->ru_stime.tv_sec +
         ru->ru_stime.tv_usec / 1e6;
}

/* In the page child: one line per page, "INDEX RSS_KIB CPU_S REPORT". One getrusage() a
 * page serves the line, the memory bound and the next page's CPU limit. */
static gboolean page_run_child(int fd, gpointer data) {
  page_run *run = data;
  struct rusage ru;
  getrusage(RUSAGE_SELF, &ru);
  long rss_limit = ru.ru_maxrss + run->recycle_kib;
  double cpu0 = cpu_of(&ru);
  for (guint i = run->first; i < run->n_pages; i++) {
    pp_worker_child_rearm(run->page_limits, &ru);
    pp_analyse_job job = run->page;
    job.page_index = i;
    char *payload = pp_analyse_report_page(&job);
    /* JSON without pretty printing has no raw newline; make sure of it for the framing. */
    for (char *c = payload; *c; c++)
      if (*c == '\n' || *c == '\r')
        *c = ' ';
    getrusage(RUSAGE_SELF, &ru);
    double cpu = cpu_of(&ru);
    char *line = g_strdup_printf("%u %ld %.6f %s\n", i, ru.ru_maxrss, cpu - cpu0, payload);
    cpu0 = cpu;
    gboolean ok = pp_worker_write_all(fd, line, strlen(line));
    g_free(line);
    g_free(payload);
    if (!ok)
      return FALSE;
    /* Messages printed after the page's capture was read belong to no page. */
    if (job.messages_fd >= 0 && lseek(job.messages_fd, 0, SEEK_CUR) > 0 &&
        ftruncate(job.messages_fd, 0) == 0)
      lseek(job.messages_fd, 0, SEEK_SET);
    if (ru.ru_maxrss > rss_limit)
      break; /* a fresh child takes the next page */
  }
  return TRUE;
}

/* The document worker's side of the page children. */
typedef struct {
  int fd; /* to the scheduler */
  const pp_cli_options *opt;
  guint n_pages;
  guint next;    /* first page without a result */
  guint started; /* pages announced with "start" */
  gboolean over_cpu;
  double cpu_used;  /* CPU seconds of the pages so far */
  double child_cpu; /* of those, reported by the current child */
  GString *out;     /* lines for the scheduler, sent together: one wake-up, not one a page */
} run_state;

static void flush_lines(run_state *st) {
  if (st->out->len && !pp_worker_write_all(st->fd, st->out->str, st->out->len))
    _exit(3); /* the scheduler is gone */
  g_string_truncate(st->out, 0);
}

static gboolean on_page_line(const char *text, gpointer data) {
  run_state *st = data;
  if (!text) {
    flush_lines(st);
    return TRUE;
  }
  guint index;
  long rss;
  double cpu;
  int at = 0;
  if (sscanf(text, "%u %ld %lf %n", &index, &rss, &cpu, &at) != 3 || at == 0 || index != st->next ||
      text[at] != '{')
    return FALSE; /* not ours: the child is ended and the page counted as failed */
  g_string_append_printf(st->out, "{\"page\":%u,\"rss_kib\":%ld,\"report\":%s}\n", index, rss,
                         text + at);
  st->next = index + 1;
  st->cpu_used += cpu;
  st->child_cpu += cpu;
  if (st->opt->cpu_s && st->cpu_used > st->opt->cpu_s && st->next < st->n_pages) {
    st->over_cpu = TRUE;
    return FALSE;
  }
  if (st->next < st->n_pages && st->started <= st->next) {
    g_string_append_printf(st->out, "{\"start\":%u}\n", st->next);
    st->started = st->next + 1;
  }
  return TRUE;
}

int pp_docworker_main(int fd, const pp_docworker_job *job, pid_t parent) {
  const pp_cli_options *opt = job->opt;
  pp_worker_limits doc_limits = {opt->timeout_s, opt->cpu_s,
                                 (guint64)opt->memory_mib * 1024 * 1024};
  pp_worker_child_setup(&doc_limits, parent);
  int messages_fd = catch_stderr();
  GError *error = NULL;
  pp_document *doc = pp_document_open_digested(job->path, job->password, job->digest, &error);
  if (!doc) {
    char *payload = pp_analyse_gerror_payload(error);
    send_line(fd, payload);
    g_free(payload);
    return 0;
  }
  const pp_document_info *info = pp_document_get_info(doc);
  pp_report *empty = pp_report_new(info, &opt->thresholds);
  char *header = pp_report_to_string(empty, FALSE, NULL);
  pp_report_free(empty);
  char *line = g_strdup_printf("{\"open\":%s}", header);
  send_line(fd, line);
  g_free(line);
  g_free(header);

  /* Each page has page_s of wall clock and page_s + 1 of CPU (pp_worker_child_rearm); the
   * child's hard CPU limit covers its whole run, which may be every page. */
  pp_worker_limits page_limits = {opt->page_s, opt->page_s + 1, doc_limits.memory_bytes};
  guint64 run_cpu = (guint64)(opt->page_s + 1) * info->n_pages;
  pp_worker_limits run_limits = {opt->page_s, (guint)MIN(run_cpu, G_MAXUINT - 2),
                                 doc_limits.memory_bytes};
  long recycle_kib = (long)MIN(PP_DOCWORKER_RECYCLE_GROWTH_MIB * 1024.0,
                               PP_DOCWORKER_RECYCLE_SHARE * opt->memory_mib * 1024.0);
  page_run run = {{job->path, job->password, opt, FALSE, doc, 0, messages_fd},
                  0,
                  info->n_pages,
                  &page_limits,
                  recycle_kib};
  run_state st = {fd, opt, info->n_pages, 0, 0, FALSE, 0, 0, g_string_new(NULL)};
  while (st.next < info->n_pages) {
    if (st.started <= st.next) {
      line = g_strdup_printf("{\"start\":%u}", st.next);
      send_line(fd, line);
      g_free(line);
      st.started = st.next + 1;
    }
    run.first = st.next;
    st.child_cpu = 0;
    guint before = st.next;
    pp_worker_result r;
    pp_worker_run_lines(page_run_child, &run, &run_limits, on_page_line, &st, &r);
    flush_lines(&st); /* what came before a line that said stop */
    gboolean ended_well =
        (r.outcome == PP_WORKER_DONE || (r.outcome == PP_WORKER_EXITED && r.exit_status == 0)) &&
        st.next > before;
    if (!ended_well && !st.over_cpu && st.next < info->n_pages) {
      /* The page in progress ended its child: it alone is lost. */
      st.cpu_used += MAX(r.cpu_s - st.child_cpu, 0);
      char *why = page_failure(&r, opt, messages_fd);
      JsonNode *js = json_node_new(JSON_NODE_VALUE);
      json_node_set_string(js, why);
      char *quoted = json_to_string(js, FALSE);
      line = g_strdup_printf("{\"page\":%u,\"rss_kib\":%ld,\"error\":%s}", st.next, r.max_rss_kib,
                             quoted);
      g_free(quoted);
      json_node_unref(js);
      g_free(why);
      send_line(fd, line);
      g_free(line);
      st.next++;
      if (messages_fd >= 0 && ftruncate(messages_fd, 0) == 0)
        lseek(messages_fd, 0, SEEK_SET);
      if (opt->cpu_s && st.cpu_used > opt->cpu_s && st.next < info->n_pages)
        st.over_cpu = TRUE;
    }
    g_string_free(r.payload, TRUE);
    if (st.over_cpu) {
      line =
          g_strdup_printf("{\"stop\":\"over the document's limit of %u CPU seconds\"}", opt->cpu_s);
      send_line(fd, line);
      g_free(line);
      pp_document_free(doc);
      g_string_free(st.out, TRUE);
      return 0;
    }
  }
  send_line(fd, "{\"end\":true}");
  pp_document_free(doc);
  g_string_free(st.out, TRUE);
  return 0;
}

char *pp_docworker_job_to_json(const pp_docworker_job *job) {
  const pp_cli_options *o = job->opt;
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  /* Hex, because a file name is bytes and need not be UTF-8, which JSON strings must be. */
  GString *hex = g_string_new(NULL);
  for (const guchar *p = (const guchar *)job->path; *p; p++)
    g_string_append_printf(hex, "%02x", *p);
  json_builder_set_member_name(b, "path_hex");
  json_builder_add_string_value(b, hex->str);
  g_string_free(hex, TRUE);
  if (job->digest && job->digest->trusted) {
    /* Integers as text: a device or inode number may not fit a signed 64-bit JSON number. */
    const pp_file_identity *id = &job->digest->identity;
    char *parts = g_strdup_printf("%s %" G_GUINT64_FORMAT " %" G_GUINT64_FORMAT
                                  " %" G_GUINT64_FORMAT " %" G_GINT64_FORMAT " %" G_GINT64_FORMAT,
                                  job->digest->sha256, id->device, id->inode, id->size,
                                  id->mtime_ns, id->ctime_ns);
    json_builder_set_member_name(b, "digest");
    json_builder_add_string_value(b, parts);
    g_free(parts);
  }
  json_builder_set_member_name(b, "password");
  if (job->password)
    json_builder_add_string_value(b, job->password);
  else
    json_builder_add_null_value(b);
  const char *names[] = {"timeout_s", "cpu_s", "page_s", "memory_mib"};
  gint64 values[] = {o->timeout_s, o->cpu_s, o->page_s, o->memory_mib};
  for (guint i = 0; i < G_N_ELEMENTS(names); i++) {
    json_builder_set_member_name(b, names[i]);
    json_builder_add_int_value(b, values[i]);
  }
  /* The thresholds as their bytes: the worker is this same program, so the layout is
   * the same, and every member (opt-in rule bits included) arrives exactly. */
  GString *thr = g_string_new(NULL);
  for (size_t i = 0; i < sizeof o->thresholds; i++)
    g_string_append_printf(thr, "%02x", ((const guchar *)&o->thresholds)[i]);
  json_builder_set_member_name(b, "thresholds_hex");
  json_builder_add_string_value(b, thr->str);
  g_string_free(thr, TRUE);
  /* The rule policy of the configuration (review_cli.c filters each page's findings). */
  GPtrArray *lists[] = {o->disabled_rules, o->min_severity};
  const char *list_names[] = {"disabled_rules", "min_severity"};
  for (guint k = 0; k < 2; k++) {
    json_builder_set_member_name(b, list_names[k]);
    json_builder_begin_array(b);
    for (guint i = 0; lists[k] && i < lists[k]->len; i++)
      json_builder_add_string_value(b, g_ptr_array_index(lists[k], i));
    json_builder_end_array(b);
  }
  json_builder_end_object(b);
  JsonNode *root = json_builder_get_root(b);
  char *text = json_to_string(root, FALSE);
  json_node_unref(root);
  return text;
}

static double number(JsonObject *o, const char *name, double fallback) {
  JsonNode *n = json_object_get_member(o, name);
  return n && JSON_NODE_HOLDS_VALUE(n) ? json_node_get_double(n) : fallback;
}

/* The "digest" member of a job: 64 hex digits and five integers; anything else is no digest. */
static gboolean read_digest(const char *text, pp_file_digest *out) {
  memset(out, 0, sizeof *out);
  pp_file_identity *id = &out->identity;
  int used = 0;
  if (sscanf(text,
             "%64[0-9a-f] %" G_GUINT64_FORMAT " %" G_GUINT64_FORMAT " %" G_GUINT64_FORMAT
             " %" G_GINT64_FORMAT " %" G_GINT64_FORMAT "%n",
             out->sha256, &id->device, &id->inode, &id->size, &id->mtime_ns, &id->ctime_ns,
             &used) != 6 ||
      strlen(out->sha256) != 64 || text[used] != '\0')
    return FALSE;
  out->trusted = TRUE;
  return TRUE;
}

G_NORETURN void pp_docworker_run_job(char *text, gsize len, pid_t parent) {
  g_autoptr(JsonParser) parser = json_parser_new();
  if (!json_parser_load_from_data(parser, text, (gssize)len, NULL) ||
      !JSON_NODE_HOLDS_OBJECT(json_parser_get_root(parser)))
    _exit(2);
  JsonObject *o = json_node_get_object(json_parser_get_root(parser));
  pp_cli_options opt = {0};
  opt.thresholds = pp_thresholds_default();
  opt.timeout_s = (guint)number(o, "timeout_s", 600);
  opt.cpu_s = (guint)number(o, "cpu_s", 600);
  opt.page_s = (guint)number(o, "page_s", 30);
  opt.memory_mib = (guint)number(o, "memory_mib", 2048);
  const char *thr = json_object_get_string_member_with_default(o, "thresholds_hex", "");
  if (strlen(thr) == 2 * sizeof opt.thresholds)
    for (size_t i = 0; i < sizeof opt.thresholds; i++)
      ((guchar *)&opt.thresholds)[i] =
          (guchar)(g_ascii_xdigit_value(thr[2 * i]) * 16 + g_ascii_xdigit_value(thr[2 * i + 1]));
  const char *list_names[] = {"disabled_rules", "min_severity"};
  GPtrArray **lists[] = {&opt.disabled_rules, &opt.min_severity};
  for (guint k = 0; k < 2; k++) {
    JsonNode *a = json_object_get_member(o, list_names[k]);
    for (guint i = 0;
         a && JSON_NODE_HOLDS_ARRAY(a) && i < json_array_get_length(json_node_get_array(a)); i++) {
      if (!*lists[k])
        *lists[k] = g_ptr_array_new_with_free_func(g_free);
      g_ptr_array_add(*lists[k],
                      g_strdup(json_array_get_string_element(json_node_get_array(a), i)));
    }
  }
  JsonNode *pw = json_object_get_member(o, "password");
  const char *hex = json_object_get_string_member_with_default(o, "path_hex", "");
  GString *path = g_string_new(NULL);
  for (size_t i = 0; hex[i] && hex[i + 1]; i += 2)
    g_string_append_c(path,
                      (char)(g_ascii_xdigit_value(hex[i]) * 16 + g_ascii_xdigit_value(hex[i + 1])));
  pp_file_digest digest;
  gboolean has_digest =
      read_digest(json_object_get_string_member_with_default(o, "digest", ""), &digest);
  pp_docworker_job job = {path->str,
                          pw && JSON_NODE_HOLDS_VALUE(pw) ? json_node_get_string(pw) : NULL, &opt,
                          has_digest ? &digest : NULL};
  int status = pp_docworker_main(STDOUT_FILENO, &job, parent);
  /* Everything freed before leaving, so that valgrind's leak check (scripts/test) sees
   * plotproof's own leaks only. */
  g_string_free(path, TRUE);
  g_clear_pointer(&opt.disabled_rules, g_ptr_array_unref);
  g_clear_pointer(&opt.min_severity, g_ptr_array_unref);
  g_clear_object(&parser);
  g_free(text);
  _exit(status);
}
