/* worker.c — fork + pipe + poll + waitpid. The child writes its whole payload and
 * leaves with _exit(): the one place an exit sits below main, because a forked child
 * must never return into the parent's scan loop or run its atexit handlers. */
#include <errno.h>
#include <poll.h>
#include <signal.h>
#include <stdio.h>
#include <string.h>
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include "worker.h"

static void write_all(int fd, const char *data, size_t len) {
  while (len > 0) {
    ssize_t n = write(fd, data, len);
    if (n < 0 && errno == EINTR)
      continue;
    if (n <= 0)
      return;
    data += n;
    len -= (size_t)n;
  }
}

static void run_child(int fd, pp_worker_func func, gpointer data) {
  /* A crash is reported by the parent; a core file per hostile PDF helps nobody. */
  struct rlimit no_core = {0, 0};
  setrlimit(RLIMIT_CORE, &no_core);
  signal(SIGPIPE, SIG_DFL);
  char *payload = func(data);
  if (payload)
    write_all(fd, payload, strlen(payload));
  close(fd);
  _exit(payload ? 0 : 1);
}

/* Milliseconds left until deadline (monotonic µs), at least 0. */
static int ms_left(gint64 deadline) {
  gint64 left = deadline - g_get_monotonic_time();
  return left <= 0 ? 0 : (int)MIN(left / 1000 + 1, G_MAXINT);
}

static gboolean read_until_eof(int fd, gint64 deadline, GString *out) {
  char buf[65536];
  for (;;) {
    struct pollfd p = {fd, POLLIN, 0};
    int left = ms_left(deadline);
    if (left == 0)
      return FALSE;
    int r = poll(&p, 1, left);
    if (r < 0 && errno == EINTR)
      continue;
    if (r <= 0)
      return r < 0; /* poll error: give up reading but let waitpid decide */
    ssize_t n = read(fd, buf, sizeof buf);
    if (n < 0 && errno == EINTR)
      continue;
    if (n <= 0)
      return TRUE;
    g_string_append_len(out, buf, n);
  }
}

/* The child closed its pipe, so it is ending; still bounded by the deadline. */
static gboolean wait_child(pid_t pid, gint64 deadline, int *status) {
  for (;;) {
    pid_t r = waitpid(pid, status, WNOHANG);
    if (r == pid)
      return TRUE;
    if (r < 0 && errno != EINTR)
      return FALSE;
    if (ms_left(deadline) == 0)
      return FALSE;
    g_usleep(2000);
  }
}

void pp_worker_run(pp_worker_func func, gpointer data, guint timeout_s, pp_worker_result *res) {
  memset(res, 0, sizeof *res);
  res->payload = g_string_new(NULL);
  int fds[2];
  if (pipe(fds) != 0) {
    res->outcome = PP_WORKER_NO_FORK;
    g_string_assign(res->payload, g_strerror(errno));
    return;
  }
  /* Buffered output would otherwise be written twice, once by each process. */
  fflush(stdout);
  fflush(stderr);
  pid_t pid = fork();
  if (pid < 0) {
    res->outcome = PP_WORKER_NO_FORK;
    g_string_assign(res->payload, g_strerror(errno));
    close(fds[0]);
    close(fds[1]);
    return;
  }
  if (pid == 0) {
    close(fds[0]);
    run_child(fds[1], func, data);
  }
  close(fds[1]);
  gint64 deadline = g_get_monotonic_time() + (gint64)timeout_s * G_USEC_PER_SEC;
  int status = 0;
  gboolean eof = read_until_eof(fds[0], deadline, res->payload);
  close(fds[0]);
  if (!eof || !wait_child(pid, deadline, &status)) {
    kill(pid, SIGKILL);
    while (waitpid(pid, &status, 0) < 0 && errno == EINTR)
      ;
    res->outcome = PP_WORKER_TIMED_OUT;
    return;
  }
  if (WIFSIGNALED(status)) {
    res->outcome = PP_WORKER_SIGNALLED;
    res->signal = WTERMSIG(status);
  } else if (WIFEXITED(status) && WEXITSTATUS(status) == 0 && res->payload->len > 0) {
    res->outcome = PP_WORKER_DONE;
  } else {
    res->outcome = PP_WORKER_EXITED;
    res->exit_status = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  }
}
