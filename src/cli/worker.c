/* worker.c — fork + pipe + poll + wait4. The child writes its whole payload and leaves
 * with _exit(): the one place an exit sits below main, because a forked child must never
 * return into the parent's loop or run its atexit handlers. */
#include <errno.h>
#include <fcntl.h>
#include <poll.h>
#include <signal.h>
#include <stdio.h>
#include <string.h>
#include <sys/prctl.h>
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include "worker.h"

/* Seconds the child's own alarm waits beyond the parent's deadline: the parent normally
 * kills first; the alarm only matters when the parent is gone. Common practice, no source. */
#define PP_WORKER_ALARM_GRACE_S 5

#if defined(__SANITIZE_ADDRESS__)
#define PP_ASAN 1
#elif defined(__has_feature)
#if __has_feature(address_sanitizer)
#define PP_ASAN 1
#endif
#endif

gboolean pp_worker_memory_limit_applies(void) {
#ifdef PP_ASAN
  return FALSE;
#else
  return TRUE;
#endif
}

gboolean pp_worker_write_all(int fd, const char *data, size_t len) {
  while (len > 0) {
    ssize_t n = write(fd, data, len);
    if (n < 0 && errno == EINTR)
      continue;
    if (n <= 0)
      return FALSE;
    data += n;
    len -= (size_t)n;
  }
  return TRUE;
}

void pp_worker_child_setup(const pp_worker_limits *limits, pid_t parent) {
  const int defaults[] = {SIGINT, SIGTERM, SIGHUP, SIGCHLD, SIGPIPE, SIGALRM, SIGXCPU, SIGQUIT};
  for (size_t i = 0; i < G_N_ELEMENTS(defaults); i++)
    signal(defaults[i], SIG_DFL);
  sigset_t none;
  sigemptyset(&none);
  sigprocmask(SIG_SETMASK, &none, NULL);
  prctl(PR_SET_PDEATHSIG, SIGKILL);
  if (getppid() != parent) /* the parent died between fork() and prctl() */
    _exit(1);
  /* A crash is reported by the parent; a core file per hostile PDF helps nobody. */
  struct rlimit no_core = {0, 0};
  setrlimit(RLIMIT_CORE, &no_core);
  if (limits && limits->memory_bytes && pp_worker_memory_limit_applies()) {
    struct rlimit as = {limits->memory_bytes, limits->memory_bytes};
    setrlimit(RLIMIT_AS, &as);
  }
  if (limits && limits->cpu_s) {
    struct rlimit cpu = {limits->cpu_s, limits->cpu_s + 2}; /* SIGXCPU, then SIGKILL */
    setrlimit(RLIMIT_CPU, &cpu);
  }
  if (limits && limits->wall_s)
    alarm(limits->wall_s + PP_WORKER_ALARM_GRACE_S);
}

/* Milliseconds left until deadline (monotonic µs), at least 0; -1 without a deadline. */
static int ms_left(gint64 deadline) {
  if (deadline == 0)
    return -1;
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
      return r < 0; /* poll error: give up reading but let wait decide */
    ssize_t n = read(fd, buf, sizeof buf);
    if (n < 0 && errno == EINTR)
      continue;
    if (n <= 0)
      return TRUE;
    g_string_append_len(out, buf, n);
  }
}

/* The child closed its pipe, so it is ending; still bounded by the deadline. */
static gboolean wait_child(pid_t pid, gint64 deadline, int *status, struct rusage *ru) {
  for (;;) {
    pid_t r = wait4(pid, status, WNOHANG, ru);
    if (r == pid)
      return TRUE;
    if (r < 0 && errno != EINTR)
      return FALSE;
    if (ms_left(deadline) == 0)
      return FALSE;
    g_usleep(1000);
  }
}

static void child_main(int fd, pp_worker_func func, gpointer data, const pp_worker_limits *limits,
                       pid_t parent) {
  pp_worker_child_setup(limits, parent);
  char *payload = func(data);
  gboolean ok = payload && pp_worker_write_all(fd, payload, strlen(payload));
  g_free(payload); /* for valgrind's leak check: the child's own allocations all freed */
  close(fd);
  _exit(ok ? 0 : 1);
}

static void lines_child_main(int fd, pp_worker_lines_func func, gpointer data,
                             const pp_worker_limits *limits, pid_t parent) {
  pp_worker_child_setup(limits, parent);
  gboolean ok = func(fd, data);
  close(fd);
  _exit(ok ? 0 : 1);
}

/* Forks with a pipe from child to parent; returns the child's pid (the read end in *rfd),
 * 0 in the child (the write end in *wfd), or -1 with the reason in res. */
static pid_t fork_with_pipe(int *rfd, int *wfd, pp_worker_result *res) {
  int fds[2];
  if (pipe2(fds, O_CLOEXEC) != 0) {
    res->outcome = PP_WORKER_NO_FORK;
    g_string_assign(res->payload, g_strerror(errno));
    return -1;
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
    return -1;
  }
  if (pid == 0) {
    close(fds[0]);
    *wfd = fds[1];
  } else {
    close(fds[1]);
    *rfd = fds[0];
  }
  return pid;
}

static gint64 deadline_after(const pp_worker_limits *limits) {
  return limits && limits->wall_s ? g_get_monotonic_time() + (gint64)limits->wall_s * G_USEC_PER_SEC
                                  : 0;
}

/* Waits for the child (killing it when eof is FALSE or the deadline passes) and fills in
 * the outcome, peak memory and CPU time. */
static void finish_child(pid_t pid, gboolean eof, gint64 deadline, pp_worker_result *res) {
  int status = 0;
  struct rusage ru = {0};
  if (!eof || !wait_child(pid, deadline, &status, &ru)) {
    kill(pid, SIGKILL);
    while (wait4(pid, &status, 0, &ru) < 0 && errno == EINTR)
      ;
    res->outcome = PP_WORKER_TIMED_OUT;
  } else if (WIFSIGNALED(status)) {
    res->outcome = PP_WORKER_SIGNALLED;
    res->signal = WTERMSIG(status);
  } else if (WIFEXITED(status) && WEXITSTATUS(status) == 0 && res->payload->len > 0) {
    res->outcome = PP_WORKER_DONE;
  } else {
    res->outcome = PP_WORKER_EXITED;
    res->exit_status = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  }
  res->max_rss_kib = ru.ru_maxrss;
  res->cpu_s = (double)ru.ru_utime.tv_sec + ru.ru_utime.tv_usec / 1e6 + (double)ru.ru_stime.tv_sec +
               ru.ru_stime.tv_usec / 1e6;
}

void pp_worker_run(pp_worker_func func, gpointer data, const pp_worker_limits *limits,
                   pp_worker_result *res) {
  memset(res, 0, sizeof *res);
  res->payload = g_string_new(NULL);
  pid_t parent = getpid();
  int rfd = -1, wfd = -1;
  pid_t pid = fork_with_pipe(&rfd, &wfd, res);
  if (pid < 0)
    return;
  if (pid == 0)
    child_main(wfd, func, data, limits, parent);
  gint64 deadline = deadline_after(limits);
  gboolean eof = read_until_eof(rfd, deadline, res->payload);
  close(rfd);
  finish_child(pid, eof, deadline, res);
}

/* Reads lines until end of file, each within the wall limit of the one before; a line
 * handler that says stop ends the reading (the child is then killed). */
static gboolean read_lines(int fd, const pp_worker_limits *limits, pp_worker_line_func on_line,
                           gpointer line_data, GString *all) {
  char buf[65536];
  GString *line = g_string_new(NULL);
  gint64 deadline = deadline_after(limits);
  gboolean eof = FALSE;
  for (;;) {
    struct pollfd p = {fd, POLLIN, 0};
    int left = ms_left(deadline);
    if (left == 0)
      break;
    int r = poll(&p, 1, left);
    if (r < 0 && errno == EINTR)
      continue;
    if (r <= 0) {
      eof = r < 0;
      break;
    }
    ssize_t n = read(fd, buf, sizeof buf);
    if (n < 0 && errno == EINTR)
      continue;
    if (n <= 0) {
      eof = TRUE;
      break;
    }
    gboolean go_on = TRUE;
    for (const char *p = buf, *stop = buf + n; p < stop && go_on;) {
      const char *nl = memchr(p, '\n', (size_t)(stop - p));
      g_string_append_len(line, p, (nl ? nl : stop) - p);
      if (!nl)
        break;
      p = nl + 1;
      /* The result needs no copy of the lines: a non-empty payload says the child spoke. */
      if (all->len == 0 && line->len > 0)
        g_string_append_c(all, '\n');
      go_on = on_line(line->str, line_data);
      g_string_truncate(line, 0);
      deadline = deadline_after(limits);
    }
    if (!go_on)
      break;
  }
  g_string_free(line, TRUE);
  return eof;
}

void pp_worker_run_lines(pp_worker_lines_func func, gpointer data, const pp_worker_limits *limits,
                         pp_worker_line_func on_line, gpointer line_data, pp_worker_result *res) {
  memset(res, 0, sizeof *res);
  res->payload = g_string_new(NULL);
  pid_t parent = getpid();
  int rfd = -1, wfd = -1;
  pid_t pid = fork_with_pipe(&rfd, &wfd, res);
  if (pid < 0)
    return;
  if (pid == 0)
    lines_child_main(wfd, func, data, limits, parent);
  gboolean eof = read_lines(rfd, limits, on_line, line_data, res->payload);
  close(rfd);
  finish_child(pid, eof, deadline_after(limits), res);
}

void pp_worker_child_rearm(const pp_worker_limits *job, const struct rusage *now) {
  if (job->wall_s)
    alarm(job->wall_s + PP_WORKER_ALARM_GRACE_S);
  struct rlimit cur;
  if (job->cpu_s && getrlimit(RLIMIT_CPU, &cur) == 0) {
    rlim_t used = (rlim_t)(now->ru_utime.tv_sec + now->ru_stime.tv_sec + 1);
    rlim_t soft = used + job->cpu_s;
    cur.rlim_cur = cur.rlim_max == RLIM_INFINITY ? soft : MIN(soft, cur.rlim_max);
    setrlimit(RLIMIT_CPU, &cur);
  }
}
