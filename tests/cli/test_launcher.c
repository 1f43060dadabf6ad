/* test_launcher.c — the worker launcher: a worker gets its job and its output pipe, its
 * parent is the launcher, its end comes back with the wait status (POSIX.1-2017 wait():
 * WIFEXITED, WEXITSTATUS, WIFSIGNALED, WTERMSIG), a kill request ends it, and a process
 * with a second thread is refused a launcher. */
#include <poll.h>
#include <setjmp.h>
#include <signal.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdio.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

#include <cmocka.h>
#include <glib.h>

#include "cli/launcher.h"

/* The worker: writes "PARENT-OK JOB" (PARENT-OK when its parent is the given launcher
 * pid), then ends as the job says: "exit N" or "hang". */
static void echo_job(char *job, gsize len, pid_t parent) {
  char line[256];
  g_snprintf(line, sizeof line, "%s %.*s\n", getppid() == parent ? "parent-ok" : "parent-wrong",
             (int)len, job);
  if (write(STDOUT_FILENO, line, strlen(line)) < 0)
    _exit(9);
  int code;
  if (sscanf(job, "exit %d", &code) == 1)
    _exit(code);
  for (;;)
    pause();
}

typedef struct {
  guint id;
  int status;
  gboolean seen;
} ending;

static void on_exit_cb(guint id, int status, gpointer data) {
  ending *e = data;
  e->id = id;
  e->status = status;
  e->seen = TRUE;
}

/* Waits (at most 10 s) for one worker end. */
static ending wait_end(pp_launcher *l) {
  ending e = {0};
  for (int i = 0; i < 100 && !e.seen; i++) {
    struct pollfd p = {pp_launcher_get_fd(l), POLLIN, 0};
    poll(&p, 1, 100);
    assert_true(pp_launcher_read(l, on_exit_cb, &e));
  }
  assert_true(e.seen);
  return e;
}

static char *read_all(int fd) {
  GString *s = g_string_new(NULL);
  char buf[256];
  ssize_t n;
  while ((n = read(fd, buf, sizeof buf)) > 0)
    g_string_append_len(s, buf, n);
  close(fd);
  return g_string_free(s, FALSE);
}

static void job_output_and_status(void **state) {
  (void)state;
  GError *error = NULL;
  pp_launcher *l = pp_launcher_new(echo_job, &error);
  assert_non_null(l);
  int out[2];
  assert_int_equal(pipe(out), 0);
  assert_true(pp_launcher_start(l, 41, "exit 7", out[1]));
  char *text = read_all(out[0]); /* end of file: the launcher kept no copy of the pipe */
  assert_string_equal(text, "parent-ok exit 7\n");
  g_free(text);
  ending e = wait_end(l);
  assert_int_equal(e.id, 41);
  assert_true(WIFEXITED(e.status));
  assert_int_equal(WEXITSTATUS(e.status), 7);
  pp_launcher_free(l);
}

static void kill_request(void **state) {
  (void)state;
  pp_launcher *l = pp_launcher_new(echo_job, NULL);
  assert_non_null(l);
  int out[2];
  assert_int_equal(pipe(out), 0);
  assert_true(pp_launcher_start(l, 3, "hang", out[1]));
  char line[64] = {0};
  assert_true(read(out[0], line, sizeof line - 1) > 0); /* it runs */
  pp_launcher_kill(l, 3);
  ending e = wait_end(l);
  assert_int_equal(e.id, 3);
  assert_true(WIFSIGNALED(e.status));
  assert_int_equal(WTERMSIG(e.status), SIGKILL);
  close(out[0]);
  pp_launcher_free(l);
}

static gpointer sleeper(gpointer data) {
  g_usleep(200000);
  return data;
}

static void refused_with_threads(void **state) {
  (void)state;
  GThread *t = g_thread_new("second", sleeper, NULL);
  GError *error = NULL;
  assert_null(pp_launcher_new(echo_job, &error));
  assert_non_null(error);
  assert_non_null(strstr(error->message, "threads"));
  g_error_free(error);
  g_thread_join(t);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(job_output_and_status),
      cmocka_unit_test(kill_request),
      cmocka_unit_test(refused_with_threads),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
