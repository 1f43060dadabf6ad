/* batch.c — worker processes driven by a GMainLoop: no sleep-poll loop. Workers are forked
 * by the launcher (launcher.h), which reports each one's end; a worker is finished when
 * both its pipe has reached end of file and its end has been reported. */
#include <errno.h>
#include <fcntl.h>
#include <signal.h>
#include <stdio.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

#include <glib-unix.h>

#include "assemble.h"
#include "batch.h"
#include "docworker.h"
#include "launcher.h"

/* How often the progress line is redrawn. Common practice, no source. */
#define PP_BATCH_PROGRESS_MS 250

typedef struct batch batch;

typedef struct {
  batch *b;
  const pp_batch_item *item;
  guint launch_id; /* the launcher's name for the worker, 0 before it is asked for one */
  int fd;          /* the worker's stdout */
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
  pp_launcher *launcher;
  guint launched;
  const GArray *items;
  guint next;
  GPtrArray *running;
  GMainLoop *loop;
  gboolean interrupted;
  gboolean launcher_lost;
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
  if (t->fd >= 0)
    close(t->fd);
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
  pp_launcher_kill(t->b->launcher, t->launch_id);
  return G_SOURCE_REMOVE;
}

static void ended(task *t, int status) {
  t->status = status;
  t->exited = TRUE;
  if (t->eof)
    finish(t);
}

static void on_worker_end(guint id, int status, gpointer data) {
  batch *b = data;
  for (guint i = 0; i < b->running->len; i++) {
    task *t = g_ptr_array_index(b->running, i);
    if (t->launch_id == id && !t->exited) {
      ended(t, status);
      return;
    }
  }
}

/* The launcher went away (someone killed it), and its workers with it: the batch stops as
 * if interrupted, so that a rerun resumes it. */
static gboolean on_launcher(int fd, GIOCondition cond, gpointer data) {
  batch *b = data;
  (void)fd;
  (void)cond;
  if (pp_launcher_read(b->launcher, on_worker_end, b))
    return G_SOURCE_CONTINUE;
  b->interrupted = b->launcher_lost = TRUE;
  for (guint i = b->running->len; i-- > 0;) {
    task *t = g_ptr_array_index(b->running, i);
    t->killed = TRUE;
    if (!t->exited)
      ended(t, SIGKILL); /* a wait status: ended by that signal */
  }
  return G_SOURCE_REMOVE;
}

/* A worker runs pp_docworker_run_job() in a process the launcher forks for it. */
static void start(batch *b, const pp_batch_item *item) {
  task *t = g_new0(task, 1);
  t->b = b;
  t->item = item;
  t->buf = g_string_new(NULL);
  t->as = pp_assembly_new();
  t->start_us = g_get_monotonic_time();
  t->fd = -1;
  g_ptr_array_add(b->running, t);
  int out[2];
  gboolean started = FALSE;
  if (pipe2(out, O_CLOEXEC) == 0) {
    pp_docworker_job job = {item->path, item->password, b->opt, item->digest};
    char *text = pp_docworker_job_to_json(&job);
    t->launch_id = ++b->launched;
    started = pp_launcher_start(b->launcher, t->launch_id, text, out[1]);
    g_free(text);
    t->fd = out[0];
  }
  if (!started) { /* no process: reported like a worker that ended without a result */
    t->eof = t->exited = TRUE;
    t->status = 1 << 8;
    if (pp_launcher_is_gone(b->launcher)) /* no more starts: the batch stops, to be resumed */
      b->interrupted = t->killed = TRUE;
    finish(t);
    return;
  }
  g_unix_set_fd_nonblocking(t->fd, TRUE, NULL);
  t->fd_source = g_unix_fd_add(t->fd, G_IO_IN | G_IO_HUP | G_IO_ERR, on_readable, t);
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
    if (!t->exited)
      pp_launcher_kill(b->launcher, t->launch_id);
  }
  if (b->running->len == 0)
    g_main_loop_quit(b->loop);
  return G_SOURCE_CONTINUE;
}

static gboolean on_tick(gpointer data) {
  pp_progress_draw(data);
  return G_SOURCE_CONTINUE;
}

gboolean pp_batch_run(const pp_cli_options *opt, pp_launcher *launcher, const GArray *items,
                      pp_batch_done_func done, gpointer user_data, pp_progress *progress) {
  batch b = {.opt = opt,
             .launcher = launcher,
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
  guint ends =
      g_unix_fd_add(pp_launcher_get_fd(launcher), G_IO_IN | G_IO_HUP | G_IO_ERR, on_launcher, &b);
  launch_more(&b);
  if (b.running->len > 0)
    g_main_loop_run(b.loop);
  g_source_remove(tick);
  for (int i = 0; i < 3; i++)
    g_source_remove(sig[i]);
  if (!b.launcher_lost)
    g_source_remove(ends);
  g_main_loop_unref(b.loop);
  g_ptr_array_unref(b.running);
  return b.interrupted;
}
