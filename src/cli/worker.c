/* worker.c — fork + pipe + poll + wait4. The child writes its whole payload and leaves
 * with _exit(): the one place an exit sits below main, because a forked child must never
 * return into the parent's loop or run its atexit handlers. A child that reports in lines
 * writes them to a memory file, which the parent reads as it grows. */
#include <errno.h>
#include <fcntl.h>
#include <poll.h>
#include <signal.h>
#include <stdio.h>
#include <string.h>
#include <sys/mman.h>
#include <sys/prctl.h>
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include "worker.h"

/* Seconds the child's own alarm waits beyond the parent's deadline: the parent normally
 * kills first; the alarm only matters when the parent is gone. Common practice, no source. */
#define PP_WORKER_ALARM_GRACE_S 5
/* How often the parent of a line-reporting child looks for new lines. The lines go to a
 * memory file rather than down the pipe because a pipe write wakes the sleeping parent
 * once a page, and on a virtual machine each cross-processor wake-up costs both sides
 * tens of microseconds: on the 300-page report of scripts/bench-speed, 15 ms of CPU
 * (3.5%). Polled at 20 Hz instead, a page's result reaches the scheduler at most this late,
 * and the end of the child still wakes the parent at once (the pipe's hang-up). Common
 * practice, no source. */
#define PP_WORKER_LINES_POLL_MS 50

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

/* The pipe's write end stays open, unused, until the child ends. */
static void lines_child_main(int lines_fd, pp_worker_lines_func func, gpointer data,
                             const pp_worker_limits *limits, pid_t parent) {
  pp_worker_child_setup(limits, parent);
  gboolean ok = func(lines_fd, data);
  close(lines_fd);
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

/* The parent's side of a line-reporting child: where it has read the memory file to. */
typedef struct {
  int fd;             /* the memory file the child appends its lines to */
  off_t at;           /* bytes read so far */
  off_t freed;        /* bytes before this are given back to the system */
  GString *line;      /* the line being read, not yet ended */
  gint64 deadline;    /* for the next line; 0 without a wall limit */
  gboolean stopped;   /* the line handler said stop */
  gboolean gave_line; /* at least one line reached the handler */
} line_reader;

/* Hands every whole line written so far to on_line, then NULL when any came. The child
 * appends with write(), and a memory file's size only grows past bytes already copied in,
 * so a '\n' read here ends a line that is all there. Read pages are punched out, so the file
 * holds about one poll's worth of lines however long the document. */
static void read_new_lines(line_reader *lr, const pp_worker_limits *limits,
                           pp_worker_line_func on_line, gpointer line_data) {
  char buf[65536];
  gboolean any = FALSE;
  while (!lr->stopped) {
    ssize_t n = pread(lr->fd, buf, sizeof buf, lr->at);
    if (n < 0 && errno == EINTR)
      continue;
    if (n <= 0)
      break;
    lr->at += n;
    for (const char *p = buf, *stop = buf + n; p < stop && !lr->stopped;) {
      const char *nl = memchr(p, '\n', (size_t)(stop - p));
      g_string_append_len(lr->line, p, (nl ? nl : stop) - p);
      if (!nl)
        break;
      p = nl + 1;
      lr->gave_line |= lr->line->len > 0;
      any = TRUE;
      lr->stopped = !on_line(lr->line->str, line_data);
      g_string_truncate(lr->line, 0);
      lr->deadline = deadline_after(limits);
    }
  }
  off_t page = sysconf(_SC_PAGESIZE), upto = lr->at / page * page;
  if (upto > lr->freed && fallocate(lr->fd, FALLOC_FL_PUNCH_HOLE | FALLOC_FL_KEEP_SIZE, lr->freed,
                                    upto - lr->freed) == 0)
    lr->freed = upto;
  if (any && !lr->stopped)
    lr->stopped = !on_line(NULL, line_data);
}

/* Reads lines until the child has gone (its pipe hangs up), each within the wall limit of
 * the one before; a line handler that says stop ends the reading (the child is then
 * killed). Returns TRUE when the child went of itself. */
static gboolean read_lines(int pipe_fd, int lines_fd, const pp_worker_limits *limits,
                           pp_worker_line_func on_line, gpointer line_data, GString *all) {
  line_reader lr = {lines_fd, 0, 0, g_string_new(NULL), deadline_after(limits), FALSE, FALSE};
  gboolean eof = FALSE;
  for (;;) {
    /* No POLLIN: the child writes nothing to the pipe, and its end is a hang-up. */
    struct pollfd p = {pipe_fd, 0, 0};
    int left = ms_left(lr.deadline);
    int r = poll(&p, 1, left < 0 ? PP_WORKER_LINES_POLL_MS : MIN(left, PP_WORKER_LINES_POLL_MS));
    if (r < 0 && errno == EINTR)
      continue;
    /* After the hang-up every line is in the file: read them all before ending. */
    read_new_lines(&lr, limits, on_line, line_data);
    if (lr.stopped)
      break;
    if (r != 0) { /* hang-up, or a poll error: give up reading but let wait decide */
      eof = TRUE;
      break;
    }
    if (ms_left(lr.deadline) == 0)
      break;
  }
  /* The result needs no copy of the lines: a non-empty payload says the child spoke. */
  if (lr.gave_line)
    g_string_append_c(all, '\n');
  g_string_free(lr.line, TRUE);
  return eof;
}

void pp_worker_run_lines(pp_worker_lines_func func, gpointer data, const pp_worker_limits *limits,
                         pp_worker_line_func on_line, gpointer line_data, pp_worker_result *res) {
  memset(res, 0, sizeof *res);
  res->payload = g_string_new(NULL);
  pid_t parent = getpid();
  int lines_fd = memfd_create("plotproof-lines", MFD_CLOEXEC);
  if (lines_fd < 0) {
    res->outcome = PP_WORKER_NO_FORK;
    g_string_assign(res->payload, g_strerror(errno));
    return;
  }
  int rfd = -1, wfd = -1;
  pid_t pid = fork_with_pipe(&rfd, &wfd, res);
  if (pid < 0) {
    close(lines_fd);
    return;
  }
  if (pid == 0)
    lines_child_main(lines_fd, func, data, limits, parent);
  gboolean eof = read_lines(rfd, lines_fd, limits, on_line, line_data, res->payload);
  close(rfd);
  close(lines_fd);
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
