/* batch.c — worker processes driven by a GMainLoop: no sleep-poll loop. A worker is
 * finished when both its pipe has reached end of file and its exit has been seen. */
#include <errno.h>
#include <fcntl.h>
#include <signal.h>
#include <stdio.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

#include <gio/gio.h>
#include <gio/gunixinputstream.h>
#include <glib-unix.h>

#include "assemble.h"
#include "batch.h"
#include "docworker.h"

/* How often the progress line is redrawn. Common practice, no source. */
#define PP_BATCH_PROGRESS_MS 250

typedef struct batch batch;

typedef struct {
  batch *b;
  const pp_batch_item *item;
  GSubprocess *proc;
  int fd; /* the worker's stdout, owned by proc's stream */
  guint fd_source, timeout_source;
  GString *buf;
  pp_assembly *as;
  gboolean eof, exited, timed_out, killed;
  int status;
  guint pages_seen;
  gint64 start_us;
} task;

struct batch {
  const pp_cli_options *opt;
  char *self; /* this program, from /proc/self/exe */
  const GArray *items;
  guint next;
  GPtrArray *running;
  GMainLoop *loop;
  gboolean interrupted;
  pp_batch_done_func done;
  gpointer user_data;
  pp_progress *progress;
};

static void launch_more(batch *b);

static void feed_lines(task *t) {
  char *start = t->buf->str;
  char *nl;
  while ((nl = memchr(start, '\n', t->buf->len - (gsize)(start - t->buf->str)))) {
    pp_assembly_feed(t->as, start, (gsize)(nl - start));
    start = nl + 1;
  }
  g_string_erase(t->buf, 0, (gssize)(start - t->buf->str));
  guint done = pp_assembly_pages_done(t->as);
  if (done > t->pages_seen) {
    pp_progress_pages(t->b->progress, done - t->pages_seen);
    t->pages_seen = done;
  }
}

static char *worker_end_reason(const task *t) {
  const pp_cli_options *opt = t->b->opt;
  if (t->killed)
    return g_strdup("interrupted: the batch was stopped");
  if (t->timed_out)
    return g_strdup_printf("timed out after %u s", opt->timeout_s);
  if (WIFSIGNALED(t->status)) {
    int sig = WTERMSIG(t->status);
    if (sig == SIGXCPU)
      return g_strdup_printf("timed out: over %u CPU seconds", opt->cpu_s);
    if (sig == SIGALRM)
      return g_strdup_printf("timed out after %u s", opt->timeout_s);
    return g_strdup_printf("the capture crashed (signal %d)", sig);
  }
  if (WIFEXITED(t->status) && WEXITSTATUS(t->status) != 0)
    return g_strdup_printf("the capture ended without a result (exit status %d)",
                           WEXITSTATUS(t->status));
  return g_strdup("the capture ended without a result");
}

static void finish(task *t) {
  batch *b = t->b;
  if (t->timeout_source)
    g_source_remove(t->timeout_source);
  if (t->buf->len) /* a last line without its newline: the worker was cut off */
    g_string_truncate(t->buf, 0);
  gboolean clean_exit =
      WIFEXITED(t->status) && WEXITSTATUS(t->status) == 0 && !t->timed_out && !t->killed;
  char *why = clean_exit ? NULL : worker_end_reason(t);
  const char *word = NULL, *reason = NULL;
  char *text = NULL;
  JsonNode *root =
      pp_assembly_finish_text(t->as, why ? why : "the worker stopped", &word, &reason, &text);
  pp_batch_result r = {0};
  r.id = t->item->id;
  r.root = root;
  r.text = text;
  r.complete = root && clean_exit && pp_assembly_ended(t->as);
  r.interrupted = t->killed;
  r.pages = pp_assembly_pages(t->as);
  r.pages_done = pp_assembly_pages_done(t->as);
  r.pages_failed = pp_assembly_pages_failed(t->as);
  r.last_page = pp_assembly_last_page(t->as);
  r.seconds = (g_get_monotonic_time() - t->start_us) / 1e6;
  r.max_rss_kib = pp_assembly_max_rss_kib(t->as);
  r.first_page_error = pp_assembly_first_page_error(t->as);
  if (!root) {
    r.word = t->killed ? "interrupted" : t->timed_out ? "timed out" : word;
    r.reason = reason ? reason : why;
  } else if (!r.complete) {
    r.word = t->killed ? "interrupted" : t->timed_out ? "timed out" : "stopped";
    r.reason = why;
  }
  b->done(&r, b->user_data);
  if (root)
    json_node_unref(root);
  g_free(text);
  g_free(why);
  g_ptr_array_remove(b->running, t);
  pp_assembly_free(t->as);
  g_string_free(t->buf, TRUE);
  if (t->proc)
    g_object_unref(t->proc);
  g_free(t);
  launch_more(b);
}

static gboolean on_readable(int fd, GIOCondition cond, gpointer data) {
  task *t = data;
  (void)cond;
  char chunk[65536];
  for (;;) {
    ssize_t n = read(fd, chunk, sizeof chunk);
    if (n > 0) {
      g_string_append_len(t->buf, chunk, n);
      continue;
    }
    if (n < 0 && errno == EINTR)
      continue;
    if (n < 0 && errno == EAGAIN) {
      feed_lines(t);
      return G_SOURCE_CONTINUE;
    }
    break; /* end of file or an error: the worker is gone */
  }
  feed_lines(t);
  t->fd = -1;
  t->eof = TRUE;
  t->fd_source = 0;
  if (t->exited)
    finish(t);
  return G_SOURCE_REMOVE;
}

static gboolean on_deadline(gpointer data) {
  task *t = data;
  t->timed_out = TRUE;
  t->timeout_source = 0;
  g_subprocess_force_exit(t->proc);
  return G_SOURCE_REMOVE;
}

static void on_wait(GObject *source, GAsyncResult *result, gpointer data) {
  task *t = data;
  g_subprocess_wait_finish(G_SUBPROCESS(source), result, NULL);
  t->status = g_subprocess_get_status(t->proc);
  t->exited = TRUE;
  if (t->eof)
    finish(t);
}

/* A worker is this same program run as `plotproof __worker`, its job on its stdin. */
static void start(batch *b, const pp_batch_item *item) {
  task *t = g_new0(task, 1);
  t->b = b;
  t->item = item;
  t->buf = g_string_new(NULL);
  t->as = pp_assembly_new();
  t->start_us = g_get_monotonic_time();
  g_ptr_array_add(b->running, t);
  GError *error = NULL;
  t->proc = g_subprocess_new(G_SUBPROCESS_FLAGS_STDIN_PIPE | G_SUBPROCESS_FLAGS_STDOUT_PIPE, &error,
                             b->self, "__worker", NULL);
  if (t->proc) {
    pp_docworker_job job = {item->path, item->password, b->opt, item->digest};
    char *text = pp_docworker_job_to_json(&job, getpid());
    GOutputStream *in = g_subprocess_get_stdin_pipe(t->proc);
    g_output_stream_write_all(in, text, strlen(text), NULL, NULL, NULL);
    g_output_stream_close(in, NULL, NULL);
    g_free(text);
  }
  if (!t->proc) { /* no process: reported like a worker that ended without a result */
    g_clear_error(&error);
    t->eof = t->exited = TRUE;
    t->status = 1 << 8;
    finish(t);
    return;
  }
  t->fd = g_unix_input_stream_get_fd(G_UNIX_INPUT_STREAM(g_subprocess_get_stdout_pipe(t->proc)));
  g_unix_set_fd_nonblocking(t->fd, TRUE, NULL);
  t->fd_source = g_unix_fd_add(t->fd, G_IO_IN | G_IO_HUP | G_IO_ERR, on_readable, t);
  g_subprocess_wait_async(t->proc, NULL, on_wait, t);
  t->timeout_source = g_timeout_add_seconds(b->opt->timeout_s, on_deadline, t);
}

static void launch_more(batch *b) {
  while (!b->interrupted && b->running->len < b->opt->jobs && b->next < b->items->len)
    start(b, &g_array_index(b->items, pp_batch_item, b->next++));
  if (b->running->len == 0 && (b->interrupted || b->next >= b->items->len))
    g_main_loop_quit(b->loop);
}

static gboolean on_signal(gpointer data) {
  batch *b = data;
  b->interrupted = TRUE;
  for (guint i = 0; i < b->running->len; i++) {
    task *t = g_ptr_array_index(b->running, i);
    t->killed = TRUE;
    if (t->proc)
      g_subprocess_force_exit(t->proc);
  }
  if (b->running->len == 0)
    g_main_loop_quit(b->loop);
  return G_SOURCE_CONTINUE;
}

static gboolean on_tick(gpointer data) {
  pp_progress_draw(data);
  return G_SOURCE_CONTINUE;
}

gboolean pp_batch_run(const pp_cli_options *opt, const GArray *items, pp_batch_done_func done,
                      gpointer user_data, pp_progress *progress) {
  batch b = {.opt = opt,
             .self = g_file_read_link("/proc/self/exe", NULL),
             .items = items,
             .running = g_ptr_array_new(),
             .loop = g_main_loop_new(NULL, FALSE),
             .done = done,
             .user_data = user_data,
             .progress = progress};
  guint sig[3] = {g_unix_signal_add(SIGINT, on_signal, &b),
                  g_unix_signal_add(SIGTERM, on_signal, &b),
                  g_unix_signal_add(SIGHUP, on_signal, &b)};
  guint tick = g_timeout_add(PP_BATCH_PROGRESS_MS, on_tick, progress);
  launch_more(&b);
  if (b.running->len > 0)
    g_main_loop_run(b.loop);
  g_source_remove(tick);
  for (int i = 0; i < 3; i++)
    g_source_remove(sig[i]);
  g_main_loop_unref(b.loop);
  g_free(b.self);
  g_ptr_array_unref(b.running);
  return b.interrupted;
}
