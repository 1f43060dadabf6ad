/* digest.c — SHA-256 of document bytes through OpenSSL's libcrypto (it uses the processor's
 * SHA instructions where there are any, several times faster than GLib's portable code), and
 * the file identity that lets the worker that opens a document trust the scheduler's digest
 * instead of reading every byte a second time. */
#include "capture.h"

#include <errno.h>
#include <fcntl.h>
#include <openssl/evp.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

/* A digest vouches for a file only if its last change is this much older than the reading:
 * a write during the reading then moves the ctime visibly, even where time stamps are as
 * coarse as FAT's 2 s and the kernel's file clock lags the real clock by a tick. The rule is
 * git's "racy git" rule (Documentation/technical/racy-git.txt); the margin is common
 * practice, no source. */
#define PP_FILE_IDENTITY_SETTLED_S 3

struct pp_sha256 {
  EVP_MD_CTX *ctx;
};

pp_sha256 *pp_sha256_new(void) {
  pp_sha256 *sum = g_new0(pp_sha256, 1);
  sum->ctx = EVP_MD_CTX_new();
  /* Allocation failure is the only way these fail for a built-in digest: abort as GLib does
   * on out-of-memory. */
  if (!sum->ctx || EVP_DigestInit_ex(sum->ctx, EVP_sha256(), NULL) != 1)
    g_error("SHA-256: OpenSSL could not set up a digest");
  return sum;
}

void pp_sha256_update(pp_sha256 *sum, const void *data, gsize len) {
  if (len > 0 && EVP_DigestUpdate(sum->ctx, data, len) != 1)
    g_error("SHA-256: OpenSSL digest update failed");
}

char *pp_sha256_free_to_hex(pp_sha256 *sum) {
  unsigned char md[EVP_MAX_MD_SIZE];
  unsigned int n = 0;
  if (EVP_DigestFinal_ex(sum->ctx, md, &n) != 1 || n != 32)
    g_error("SHA-256: OpenSSL digest final failed");
  EVP_MD_CTX_free(sum->ctx);
  g_free(sum);
  static const char hex[] = "0123456789abcdef";
  char *out = g_malloc(2 * n + 1);
  for (unsigned int i = 0; i < n; i++)
    out[2 * i] = hex[md[i] >> 4], out[2 * i + 1] = hex[md[i] & 15];
  out[2 * n] = '\0';
  return out;
}

char *pp_sha256_hex(const void *data, gsize len) {
  pp_sha256 *sum = pp_sha256_new();
  pp_sha256_update(sum, data, len);
  return pp_sha256_free_to_hex(sum);
}

gboolean pp_file_identity_of_fd(int fd, pp_file_identity *out) {
  struct stat st;
  if (fstat(fd, &st) != 0)
    return FALSE;
  *out = (pp_file_identity){
      (guint64)st.st_dev, (guint64)st.st_ino, (guint64)st.st_size,
      (gint64)st.st_mtim.tv_sec * G_GINT64_CONSTANT(1000000000) + st.st_mtim.tv_nsec,
      (gint64)st.st_ctim.tv_sec * G_GINT64_CONSTANT(1000000000) + st.st_ctim.tv_nsec};
  return TRUE;
}

gboolean pp_file_identity_equal(const pp_file_identity *a, const pp_file_identity *b) {
  return a->device == b->device && a->inode == b->inode && a->size == b->size &&
         a->mtime_ns == b->mtime_ns && a->ctime_ns == b->ctime_ns;
}

gboolean pp_file_digest_compute(const char *path, pp_file_digest *out, GError **error) {
  memset(out, 0, sizeof *out);
  gint64 start_ns = g_get_real_time() * 1000;
  int fd = open(path, O_RDONLY | O_CLOEXEC | O_NONBLOCK);
  pp_file_identity before, after;
  if (fd < 0 || !pp_file_identity_of_fd(fd, &before)) {
    int saved = errno;
    if (fd >= 0)
      close(fd);
    g_set_error_literal(error, G_FILE_ERROR, g_file_error_from_errno(saved), g_strerror(saved));
    return FALSE;
  }
  pp_sha256 *sum = pp_sha256_new();
  guchar buf[1 << 16];
  ssize_t n;
  guint64 size = 0;
  while ((n = read(fd, buf, sizeof buf)) != 0) {
    if (n < 0 && errno == EINTR)
      continue;
    if (n < 0) {
      int saved = errno;
      g_set_error_literal(error, G_FILE_ERROR, g_file_error_from_errno(saved), g_strerror(saved));
      g_free(pp_sha256_free_to_hex(sum));
      close(fd);
      return FALSE;
    }
    pp_sha256_update(sum, buf, (gsize)n);
    size += (guint64)n;
  }
  gboolean same = pp_file_identity_of_fd(fd, &after) && pp_file_identity_equal(&before, &after);
  close(fd);
  char *hex = pp_sha256_free_to_hex(sum);
  memcpy(out->sha256, hex, sizeof out->sha256);
  g_free(hex);
  out->identity = before;
  /* What was read, not what fstat said, in case the two disagree (a file that changed). */
  out->identity.size = size;
  out->trusted =
      same && size == before.size &&
      before.ctime_ns < start_ns - PP_FILE_IDENTITY_SETTLED_S * G_GINT64_CONSTANT(1000000000);
  return TRUE;
}
