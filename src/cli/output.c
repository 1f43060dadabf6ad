/* output.c — atomic files and checked standard output. */
#include <errno.h>
#include <fcntl.h>
#include <stdio.h>
#include <string.h>
#include <unistd.h>

#include "output.h"
#include "worker.h"

static gboolean stdout_failed;

static gboolean set_errno_error(GError **error, const char *what, const char *path) {
  int e = errno;
  g_set_error(error, G_FILE_ERROR, g_file_error_from_errno(e), "%s %s: %s", what, path,
              g_strerror(e));
  return FALSE;
}

gboolean pp_output_write_atomic(const char *path, const char *data, gsize len, GError **error) {
  char *dir = g_path_get_dirname(path);
  if (g_mkdir_with_parents(dir, 0755) != 0) {
    set_errno_error(error, "cannot create", dir);
    g_free(dir);
    return FALSE;
  }
  char *tmp = g_build_filename(dir, ".plotproof-XXXXXX", NULL);
  g_free(dir);
  int fd = g_mkstemp_full(tmp, O_WRONLY | O_CLOEXEC, 0644);
  if (fd < 0) {
    set_errno_error(error, "cannot create a file in the directory of", path);
    g_free(tmp);
    return FALSE;
  }
  gboolean ok = pp_worker_write_all(fd, data, len) || set_errno_error(error, "cannot write", path);
  if (ok && fsync(fd) != 0)
    ok = set_errno_error(error, "cannot write", path);
  if (close(fd) != 0 && ok)
    ok = set_errno_error(error, "cannot write", path);
  if (ok && rename(tmp, path) != 0)
    ok = set_errno_error(error, "cannot rename into", path);
  if (!ok)
    unlink(tmp);
  g_free(tmp);
  return ok;
}

static void report_stdout_failure(void) {
  if (stdout_failed)
    return;
  stdout_failed = TRUE;
  fprintf(stderr, "plotproof: cannot write to standard output: %s\n",
          errno ? g_strerror(errno) : "write error");
  fflush(stderr);
}

gboolean pp_output_stdout(const char *data, gsize len) {
  if (stdout_failed)
    return FALSE;
  errno = 0;
  if (fwrite(data, 1, len, stdout) != len || fflush(stdout) != 0 || ferror(stdout)) {
    report_stdout_failure();
    return FALSE;
  }
  return TRUE;
}

gboolean pp_output_stdout_flush(void) {
  if (stdout_failed)
    return FALSE;
  errno = 0;
  if (fflush(stdout) != 0 || ferror(stdout)) {
    report_stdout_failure();
    return FALSE;
  }
  return TRUE;
}

gboolean pp_output_stdout_failed(void) {
  return stdout_failed;
}
