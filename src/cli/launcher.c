/* launcher.c — fork, socket messages and signalfd. The scheduler and the launcher talk over
 * a SOCK_SEQPACKET pair, one message a request: "S ID\n" and the job with the worker's
 * output fd attached (SCM_RIGHTS), "K ID"; the launcher answers "E ID STATUS" when a worker
 * has ended and been reaped. */
#include <dirent.h>
#include <errno.h>
#include <fcntl.h>
#include <poll.h>
#include <signal.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/prctl.h>
#include <sys/signalfd.h>
#include <sys/socket.h>
#include <sys/wait.h>
#include <unistd.h>

#include <gio/gio.h>

#include "launcher.h"

/* Longest request: a job holds a path (hex, at most 8 KiB for PATH_MAX), a password and the
 * rule lists, far below this; the default socket buffer (about 208 KiB on Linux) is above
 * it. Common practice, no source. */
#define PP_LAUNCHER_MESSAGE_MAX (64 * 1024)

struct pp_launcher {
  int sock;
  pid_t pid;
  gboolean gone;
};

typedef struct {
  guint id;
  pid_t pid;
} running_worker;

static gboolean send_text(int sock, const char *text, int fd) {
  struct iovec iov = {(void *)text, strlen(text)};
  struct msghdr msg = {.msg_iov = &iov, .msg_iovlen = 1};
  union {
    char buf[CMSG_SPACE(sizeof(int))];
    struct cmsghdr align;
  } control;
  if (fd >= 0) {
    memset(&control, 0, sizeof control);
    msg.msg_control = control.buf;
    msg.msg_controllen = sizeof control.buf;
    struct cmsghdr *c = CMSG_FIRSTHDR(&msg);
    c->cmsg_level = SOL_SOCKET;
    c->cmsg_type = SCM_RIGHTS;
    c->cmsg_len = CMSG_LEN(sizeof(int));
    memcpy(CMSG_DATA(c), &fd, sizeof(int));
  }
  ssize_t n;
  do
    n = sendmsg(sock, &msg, MSG_NOSIGNAL);
  while (n < 0 && errno == EINTR);
  return n == (ssize_t)iov.iov_len;
}

/* One message into buf (NUL-terminated); *fd the descriptor it carried, or -1. Returns the
 * length, 0 at end of file, -1 on error or (with flags MSG_DONTWAIT) nothing to read. */
static ssize_t receive(int sock, char *buf, size_t size, int *fd, int flags) {
  struct iovec iov = {buf, size - 1};
  union {
    char buf[CMSG_SPACE(sizeof(int))];
    struct cmsghdr align;
  } control;
  struct msghdr msg = {.msg_iov = &iov,
                       .msg_iovlen = 1,
                       .msg_control = control.buf,
                       .msg_controllen = sizeof control.buf};
  ssize_t n;
  do
    n = recvmsg(sock, &msg, flags | MSG_CMSG_CLOEXEC);
  while (n < 0 && errno == EINTR);
  *fd = -1;
  for (struct cmsghdr *c = n >= 0 ? CMSG_FIRSTHDR(&msg) : NULL; c; c = CMSG_NXTHDR(&msg, c))
    if (c->cmsg_level == SOL_SOCKET && c->cmsg_type == SCM_RIGHTS)
      memcpy(fd, CMSG_DATA(c), sizeof(int));
  if (n >= 0)
    buf[n] = '\0';
  if (n > 0 && (msg.msg_flags & MSG_TRUNC)) { /* a request cut short is no request */
    if (*fd >= 0)
      close(*fd);
    *fd = -1;
    buf[0] = '\0';
  }
  return n;
}

/* What the launcher holds: the workers running, and the buffer requests arrive in. */
typedef struct {
  GArray *workers; /* of running_worker */
  char *buf;       /* PP_LAUNCHER_MESSAGE_MAX bytes */
} launcher_state;

/* In a new worker: its output on stdout, nothing on stdin, no launcher descriptors, and
 * none of the launcher's memory (valgrind's leak check runs in every process). */
static G_NORETURN void run_worker(pp_launcher_job_func run, const char *job, int out_fd, int sock,
                                  int sfd, launcher_state *ls, pid_t launcher) {
  close(sock);
  close(sfd);
  char *own = g_strdup(job);
  g_array_free(ls->workers, TRUE);
  g_free(ls->buf);
  if (out_fd != STDOUT_FILENO) {
    dup2(out_fd, STDOUT_FILENO);
    close(out_fd);
  }
  int null_fd = open("/dev/null", O_RDONLY | O_CLOEXEC);
  if (null_fd >= 0) {
    dup2(null_fd, STDIN_FILENO);
    close(null_fd);
  }
  run(own, strlen(own), launcher);
  _exit(2);
}

static void report_ended(int sock, GArray *workers) {
  int status;
  pid_t pid;
  while ((pid = waitpid(-1, &status, WNOHANG)) > 0)
    for (guint i = 0; i < workers->len; i++) {
      running_worker *w = &g_array_index(workers, running_worker, i);
      if (w->pid != pid)
        continue;
      char *text = g_strdup_printf("E %u %d", w->id, status);
      send_text(sock, text, -1);
      g_free(text);
      g_array_remove_index_fast(workers, i);
      break;
    }
}

static void handle_request(int sock, int sfd, pp_launcher_job_func run, char *text, int fd,
                           launcher_state *ls) {
  GArray *workers = ls->workers;
  guint id;
  int at = 0;
  if (text[0] == 'K' && sscanf(text, "K %u", &id) == 1) {
    for (guint i = 0; i < workers->len; i++)
      if (g_array_index(workers, running_worker, i).id == id)
        kill(g_array_index(workers, running_worker, i).pid, SIGKILL);
  } else if (text[0] == 'S' && sscanf(text, "S %u\n%n", &id, &at) == 1 && at > 0 && fd >= 0) {
    pid_t me = getpid();
    pid_t pid = fork();
    if (pid == 0)
      run_worker(run, text + at, fd, sock, sfd, ls, me);
    close(fd);
    fd = -1;
    if (pid > 0) {
      running_worker w = {id, pid};
      g_array_append_val(workers, w);
    } else { /* reported as a worker that ended with status 1 at once */
      char *reply = g_strdup_printf("E %u %d", id, 1 << 8);
      send_text(sock, reply, -1);
      g_free(reply);
    }
  }
  if (fd >= 0)
    close(fd);
}

static G_NORETURN void launcher_main(int sock, pp_launcher_job_func run, pid_t scheduler) {
  prctl(PR_SET_PDEATHSIG, SIGKILL);
  if (getppid() != scheduler) /* the scheduler died between fork() and prctl() */
    _exit(0);
  /* Interrupts are the scheduler's to handle: it stops the workers through this process. */
  const int ignored[] = {SIGINT, SIGTERM, SIGHUP, SIGQUIT};
  for (size_t i = 0; i < G_N_ELEMENTS(ignored); i++)
    signal(ignored[i], SIG_IGN);
  /* Only the socket and the standard streams stay open (the scheduler's files do not). */
  if (sock > 3)
    close_range(3, (unsigned)sock - 1, 0);
  close_range((unsigned)sock + 1, ~0u, 0);
  sigset_t chld;
  sigemptyset(&chld);
  sigaddset(&chld, SIGCHLD);
  sigprocmask(SIG_BLOCK, &chld, NULL);
  int sfd = signalfd(-1, &chld, SFD_CLOEXEC | SFD_NONBLOCK);
  launcher_state ls = {g_array_new(FALSE, FALSE, sizeof(running_worker)),
                       g_malloc(PP_LAUNCHER_MESSAGE_MAX)};
  for (;;) {
    struct pollfd p[2] = {{sock, POLLIN, 0}, {sfd, POLLIN, 0}};
    if (poll(p, 2, -1) < 0 && errno != EINTR)
      break;
    if (p[1].revents) {
      struct signalfd_siginfo si;
      while (read(sfd, &si, sizeof si) == sizeof si)
        ;
      report_ended(sock, ls.workers);
    }
    if (p[0].revents) {
      int fd;
      ssize_t n = receive(sock, ls.buf, PP_LAUNCHER_MESSAGE_MAX, &fd, MSG_DONTWAIT);
      if (n == 0 || (n < 0 && errno != EAGAIN))
        break; /* the scheduler is done, or gone */
      if (n > 0)
        handle_request(sock, sfd, run, ls.buf, fd, &ls);
    }
  }
  for (guint i = 0; i < ls.workers->len; i++)
    kill(g_array_index(ls.workers, running_worker, i).pid, SIGKILL);
  g_array_free(ls.workers, TRUE);
  g_free(ls.buf);
  _exit(0);
}

static guint count_threads(void) {
  guint n = 0;
  DIR *d = opendir("/proc/self/task");
  for (struct dirent *e; d && (e = readdir(d));)
    n += e->d_name[0] != '.';
  if (d)
    closedir(d);
  return n;
}

pp_launcher *pp_launcher_new(pp_launcher_job_func run, GError **error) {
  guint threads = count_threads();
  if (threads != 1) {
    g_set_error(error, G_IO_ERROR, G_IO_ERROR_FAILED,
                "cannot start the worker launcher: %u threads where one is needed", threads);
    return NULL;
  }
  int sv[2];
  if (socketpair(AF_UNIX, SOCK_SEQPACKET | SOCK_CLOEXEC, 0, sv) != 0) {
    g_set_error(error, G_IO_ERROR, g_io_error_from_errno(errno),
                "cannot start the worker launcher: %s", g_strerror(errno));
    return NULL;
  }
  pid_t scheduler = getpid();
  pid_t pid = fork();
  if (pid == 0) {
    close(sv[0]);
    launcher_main(sv[1], run, scheduler);
  }
  close(sv[1]);
  if (pid < 0) {
    int e = errno;
    close(sv[0]);
    g_set_error(error, G_IO_ERROR, g_io_error_from_errno(e), "cannot start the worker launcher: %s",
                g_strerror(e));
    return NULL;
  }
  pp_launcher *l = g_new0(pp_launcher, 1);
  l->sock = sv[0];
  l->pid = pid;
  return l;
}

gboolean pp_launcher_start(pp_launcher *l, guint id, const char *job, int out_fd) {
  char *text = g_strdup_printf("S %u\n%s", id, job);
  gboolean ok = FALSE;
  if (!l->gone && strlen(text) < PP_LAUNCHER_MESSAGE_MAX) {
    ok = send_text(l->sock, text, out_fd);
    l->gone = !ok; /* the socket fails only when the launcher has ended */
  }
  g_free(text);
  close(out_fd);
  return ok;
}

void pp_launcher_kill(pp_launcher *l, guint id) {
  char text[32];
  g_snprintf(text, sizeof text, "K %u", id);
  if (!l->gone)
    send_text(l->sock, text, -1);
}

gboolean pp_launcher_is_gone(const pp_launcher *l) {
  return l->gone;
}

int pp_launcher_get_fd(const pp_launcher *l) {
  return l->sock;
}

gboolean pp_launcher_read(pp_launcher *l, pp_launcher_exit_func on_exit, gpointer data) {
  char buf[64];
  for (;;) {
    int fd = -1;
    ssize_t n = l->gone ? 0 : receive(l->sock, buf, sizeof buf, &fd, MSG_DONTWAIT);
    if (fd >= 0)
      close(fd);
    if (n < 0 && (errno == EAGAIN || errno == EWOULDBLOCK))
      return TRUE;
    if (n <= 0) {
      l->gone = TRUE;
      return FALSE;
    }
    guint id;
    int status;
    if (sscanf(buf, "E %u %d", &id, &status) == 2)
      on_exit(id, status, data);
  }
}

void pp_launcher_free(pp_launcher *l) {
  if (!l)
    return;
  close(l->sock);
  int status;
  while (waitpid(l->pid, &status, 0) < 0 && errno == EINTR)
    ;
  g_free(l);
}
