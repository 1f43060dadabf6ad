/* test_digest.c — the documents' SHA-256 against the examples published with the standard
 * (FIPS 180-2, appendix B: "abc", the 448-bit message, one million "a"; the empty string's
 * digest as widely published) and against GLib's own implementation on fed-in pieces; and
 * the file identity under which a worker reuses the scheduler's digest, checked against
 * what stat(2) and GLib's GChecksum say about the file. */
#include <fcntl.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include <cairo-pdf.h>
#include <cmocka.h>
#include <glib/gstdio.h>

#include "capture/capture.h"

static void test_published_examples(void **state) {
  (void)state;
  struct {
    const char *msg, *digest;
  } cases[] = {
      {"abc", "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad"},
      {"abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq",
       "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1"},
      {"", "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855"},
  };
  for (gsize i = 0; i < G_N_ELEMENTS(cases); i++) {
    g_autofree char *hex = pp_sha256_hex(cases[i].msg, strlen(cases[i].msg));
    assert_string_equal(hex, cases[i].digest);
  }
  /* One million "a", fed in pieces of 1,000 (FIPS 180-2, B.3). */
  char block[1000];
  memset(block, 'a', sizeof block);
  pp_sha256 *sum = pp_sha256_new();
  for (int i = 0; i < 1000; i++)
    pp_sha256_update(sum, block, sizeof block);
  g_autofree char *hex = pp_sha256_free_to_hex(sum);
  assert_string_equal(hex, "cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0");
}

/* Pseudo-random bytes in uneven pieces: the same digest as GLib's GChecksum, which the
 * findings files of earlier versions carry. */
static void test_same_as_glib(void **state) {
  (void)state;
  GRand *rand = g_rand_new_with_seed(20311231);
  gsize len = 3 * 1024 * 1024 + 17;
  guchar *data = g_malloc(len);
  for (gsize i = 0; i < len; i++)
    data[i] = (guchar)g_rand_int_range(rand, 0, 256);
  pp_sha256 *sum = pp_sha256_new();
  for (gsize at = 0, step = 1; at < len; at += step, step = step * 3 % 65537 + 1)
    pp_sha256_update(sum, data + at, MIN(step, len - at));
  g_autofree char *ours = pp_sha256_free_to_hex(sum);
  g_autofree char *glib = g_compute_checksum_for_data(G_CHECKSUM_SHA256, data, len);
  assert_string_equal(ours, glib);
  g_free(data);
  g_rand_free(rand);
}

/* A one-page PDF drawn by cairo (an outside producer), in a fresh temporary folder. */
static char *write_pdf(char **dir) {
  *dir = g_dir_make_tmp("pp-digest-XXXXXX", NULL);
  assert_non_null(*dir);
  char *path = g_build_filename(*dir, "one.pdf", NULL);
  cairo_surface_t *s = cairo_pdf_surface_create(path, 200, 100);
  cairo_t *cr = cairo_create(s);
  cairo_rectangle(cr, 10, 10, 50, 80);
  cairo_fill(cr);
  cairo_destroy(cr);
  cairo_surface_destroy(s);
  return path;
}

static char *glib_digest_of(const char *path) {
  char *bytes = NULL;
  gsize len = 0;
  assert_true(g_file_get_contents(path, &bytes, &len, NULL));
  char *hex = g_compute_checksum_for_data(G_CHECKSUM_SHA256, (const guchar *)bytes, len);
  g_free(bytes);
  return hex;
}

static void remove_pdf(char *dir, char *path) {
  g_unlink(path);
  g_rmdir(dir);
  g_free(path);
  g_free(dir);
}

/* A file written a moment ago is not vouched for by its identity: a second write in the same
 * clock tick would leave the identity as it is (git's "racy git" case). */
static void test_fresh_file_not_trusted(void **state) {
  (void)state;
  char *dir, *path = write_pdf(&dir);
  pp_file_digest d;
  assert_true(pp_file_digest_compute(path, &d, NULL));
  g_autofree char *glib = glib_digest_of(path);
  assert_string_equal(d.sha256, glib);
  struct stat st;
  assert_int_equal(stat(path, &st), 0);
  assert_int_equal(d.identity.size, (guint64)st.st_size);
  assert_int_equal(d.identity.inode, (guint64)st.st_ino);
  assert_false(d.trusted);
  GError *error = NULL;
  assert_false(pp_file_digest_compute("/nonexistent/pp-digest.pdf", &d, &error));
  assert_true(g_error_matches(error, G_FILE_ERROR, G_FILE_ERROR_NOENT));
  g_error_free(error);
  remove_pdf(dir, path);
}

/* Once settled, the file is trusted: the worker takes the scheduler's digest without reading
 * the bytes (a deliberately wrong digest shows it was taken), and any later write, even one
 * that keeps the size, moves the ctime, so the worker reads and hashes the bytes again. */
static void test_identity_reused_until_written(void **state) {
  (void)state;
  char *dir, *path = write_pdf(&dir);
  g_usleep(3300 * 1000); /* past the settling margin of digest.c */
  pp_file_digest d;
  assert_true(pp_file_digest_compute(path, &d, NULL));
  assert_true(d.trusted);
  g_autofree char *before = glib_digest_of(path);
  assert_string_equal(d.sha256, before);

  pp_file_digest marked = d;
  memset(marked.sha256, 'a', 64);
  GError *error = NULL;
  pp_document *doc = pp_document_open_digested(path, NULL, &marked, &error);
  assert_non_null(doc);
  assert_string_equal(pp_document_get_info(doc)->sha256, marked.sha256);
  assert_int_equal(pp_document_get_info(doc)->size, d.identity.size);
  pp_document_free(doc);
  /* An untrusted digest is never taken. */
  marked.trusted = FALSE;
  doc = pp_document_open_digested(path, NULL, &marked, &error);
  assert_non_null(doc);
  assert_string_equal(pp_document_get_info(doc)->sha256, before);
  pp_document_free(doc);

  /* The same number of bytes, one changed: a PDF comment byte near the end. */
  int fd = open(path, O_WRONLY);
  assert_true(fd >= 0);
  struct stat st;
  assert_int_equal(fstat(fd, &st), 0);
  assert_int_equal(pwrite(fd, "%", 1, st.st_size - 1), 1);
  close(fd);
  g_autofree char *after = glib_digest_of(path);
  assert_string_not_equal(after, before);
  marked.trusted = TRUE;
  doc = pp_document_open_digested(path, NULL, &marked, &error);
  assert_non_null(doc);
  assert_string_equal(pp_document_get_info(doc)->sha256, after);
  pp_document_free(doc);
  remove_pdf(dir, path);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_published_examples),
      cmocka_unit_test(test_same_as_glib),
      cmocka_unit_test(test_fresh_file_not_trusted),
      cmocka_unit_test(test_identity_reused_until_written),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
