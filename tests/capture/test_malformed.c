/* test_malformed.c — every way a file can fail to open must give its own pp_capture_error
 * code through pp_document_open, and damaged files that poppler reconstructs must capture
 * without crashing. */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "capture_util.h"

#ifdef CU_QPDF
static const char *qpdf_path = CU_QPDF;
#else
static const char *qpdf_path = NULL;
#endif

static char *scratch;
static char *valid_pdf;

static char *scratch_path(const char *name) {
  return g_build_filename(scratch, name, NULL);
}

/* Three chart-like pages drawn with cairo's PDF surface. */
static void make_valid_pdf(const char *path) {
  cairo_surface_t *s = cairo_pdf_surface_create(path, 400, 300);
  cairo_t *cr = cairo_create(s);
  for (int page = 0; page < 3; page++) {
    for (int i = 0; i < 6; i++) {
      cairo_set_source_rgb(cr, 0.2, 0.3 + 0.1 * i, 0.7);
      cairo_rectangle(cr, 40 + 50 * i, 250 - 20 * (i + page), 30, 20 * (i + page) + 10);
      cairo_fill(cr);
    }
    cairo_set_source_rgb(cr, 0, 0, 0);
    cairo_select_font_face(cr, "sans", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_NORMAL);
    cairo_set_font_size(cr, 10);
    cairo_move_to(cr, 40, 280);
    cairo_show_text(cr, "Fernhollow Cycles, units sold 2019 2020 2021");
    cairo_show_page(cr);
  }
  cairo_destroy(cr);
  cairo_surface_destroy(s);
}

/* Three pages written by hand with the catalog and page tree first and each content
 * stream after all page objects (ISO 32000-1 §7.5: object order is free), so truncation
 * cuts content, xref and trailer but leaves the structure. */
static void make_structure_first_pdf(const char *path) {
  GString *pdf = g_string_new("%PDF-1.4\n");
  gsize off[9];
  off[1] = pdf->len;
  g_string_append(pdf, "1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj\n");
  off[2] = pdf->len;
  g_string_append(pdf, "2 0 obj << /Type /Pages /Kids [3 0 R 4 0 R 5 0 R] /Count 3 >> endobj\n");
  for (int p = 0; p < 3; p++) {
    off[3 + p] = pdf->len;
    g_string_append_printf(pdf,
                           "%d 0 obj << /Type /Page /Parent 2 0 R /MediaBox [0 0 400 300] "
                           "/Contents %d 0 R >> endobj\n",
                           3 + p, 6 + p);
  }
  for (int p = 0; p < 3; p++) {
    GString *content = g_string_new(NULL);
    for (int i = 0; i < 60; i++)
      g_string_append_printf(content, "0.%d 0.4 0.7 rg %d %d 5 %d re f\n", i % 10, 20 + 6 * i,
                             40 + p, 100 + i);
    off[6 + p] = pdf->len;
    g_string_append_printf(pdf, "%d 0 obj << /Length %zu >> stream\n%sendstream endobj\n", 6 + p,
                           content->len, content->str);
    g_string_free(content, TRUE);
  }
  gsize xref = pdf->len;
  g_string_append(pdf, "xref\n0 9\n0000000000 65535 f\r\n");
  for (int i = 1; i < 9; i++)
    g_string_append_printf(pdf, "%010zu 00000 n\r\n", off[i]);
  g_string_append_printf(pdf, "trailer << /Root 1 0 R /Size 9 >>\nstartxref\n%zu\n%%%%EOF\n", xref);
  assert_true(g_file_set_contents(path, pdf->str, (gssize)pdf->len, NULL));
  g_string_free(pdf, TRUE);
}

static void expect_error(const char *path, const char *password, int code) {
  GError *error = NULL;
  pp_document *doc = pp_document_open(path, password, &error);
  if (doc) {
    pp_document_free(doc);
    fail_msg("%s opened; expected error '%s'", path, pp_capture_error_word(code));
  }
  assert_non_null(error);
  if (!g_error_matches(error, PP_CAPTURE_ERROR, code))
    fail_msg("%s: got '%s' (%s), expected '%s'", path, pp_capture_error_word(error->code),
             error->message, pp_capture_error_word(code));
  g_error_free(error);
}

static void test_nonexistent(void **state) {
  (void)state;
  char *path = scratch_path("no-such-file.pdf");
  expect_error(path, NULL, PP_CAPTURE_ERROR_UNREADABLE);
  g_free(path);
}

static void test_empty(void **state) {
  (void)state;
  char *path = scratch_path("empty.pdf");
  assert_true(g_file_set_contents(path, "", 0, NULL));
  expect_error(path, NULL, PP_CAPTURE_ERROR_EMPTY);
  g_free(path);
}

static guchar *random_bytes(guint32 seed, gsize n) {
  GRand *rand = g_rand_new_with_seed(seed);
  guchar *b = g_malloc(n);
  for (gsize i = 0; i < n; i++)
    b[i] = (guchar)g_rand_int_range(rand, 0, 256);
  g_rand_free(rand);
  return b;
}

static void test_random_bytes(void **state) {
  (void)state;
  char *path = scratch_path("random.pdf");
  guchar *b = random_bytes(20240611, 8192);
  /* Precondition: no "%PDF-" in the first 1024 bytes, where ISO 32000-1 §7.5.2 readers look. */
  assert_null(g_strstr_len((const char *)b, 1024, "%PDF-"));
  assert_true(g_file_set_contents(path, (const char *)b, 8192, NULL));
  expect_error(path, NULL, PP_CAPTURE_ERROR_NOT_PDF);
  g_free(b);
  g_free(path);
}

static void test_header_then_random(void **state) {
  (void)state;
  char *path = scratch_path("header-random.pdf");
  guchar *b = random_bytes(7, 8192);
  memcpy(b, "%PDF-1.7\n", 9);
  assert_true(g_file_set_contents(path, (const char *)b, 8192, NULL));
  /* A header and no objects, xref or trailer (ISO 32000-1 §7.5): nothing to parse. */
  expect_error(path, NULL, PP_CAPTURE_ERROR_DAMAGED);
  g_free(b);
  g_free(path);
}

/* Opens the file truncated to `percent` of its bytes. Returns TRUE when it opened (poppler
 * reconstructed it), after capturing every page; FALSE when it was reported DAMAGED. */
static gboolean open_truncated(const char *source, int percent, guint *n_pages) {
  char *data = NULL;
  gsize len = 0;
  assert_true(g_file_get_contents(source, &data, &len, NULL));
  char *name = g_strdup_printf("truncated-%d.pdf", percent);
  char *path = scratch_path(name);
  assert_true(g_file_set_contents(path, data, (gssize)(len * percent / 100), NULL));
  GError *error = NULL;
  pp_document *doc = pp_document_open(path, NULL, &error);
  gboolean opened = doc != NULL;
  if (doc) {
    const pp_document_info *info = pp_document_get_info(doc);
    assert_true(info->n_pages >= 1 && info->n_pages <= 3);
    *n_pages = info->n_pages;
    for (guint i = 0; i < info->n_pages; i++) {
      GError *page_error = NULL;
      pp_scene *s = pp_document_capture_page(doc, i, &page_error);
      /* A page may fail cleanly (PAGE) but must never crash or return neither. */
      assert_true((s != NULL) != (page_error != NULL));
      if (page_error)
        assert_true(g_error_matches(page_error, PP_CAPTURE_ERROR, PP_CAPTURE_ERROR_PAGE));
      g_clear_error(&page_error);
      pp_scene_free(s);
    }
    pp_document_free(doc);
  } else {
    if (!g_error_matches(error, PP_CAPTURE_ERROR, PP_CAPTURE_ERROR_DAMAGED))
      fail_msg("truncated at %d%%: %s", percent, error->message);
    g_error_free(error);
  }
  g_free(path);
  g_free(name);
  g_free(data);
  return opened;
}

/* Behaviour recorded with poppler 22.12 (Debian 12). cairo 1.16 writes the page tree and
 * catalog last (at about 94% of this file), so at 10%, 50% and 90% poppler's xref
 * reconstruction finds no /Root and the file is DAMAGED. */
static void test_truncated_cairo(void **state) {
  (void)state;
  guint n = 0;
  assert_false(open_truncated(valid_pdf, 10, &n));
  assert_false(open_truncated(valid_pdf, 50, &n));
  assert_false(open_truncated(valid_pdf, 90, &n));
}

/* With the structure first the result is the same at 10%, 50% and 90%: poppler 22.12
 * rebuilds a lost xref only from a surviving "trailer" dictionary (observed; the catalog
 * object alone is not enough), and truncation always cuts the trailer off. */
static void test_truncated_structure_first(void **state) {
  (void)state;
  char *path = scratch_path("structure-first.pdf");
  make_structure_first_pdf(path);
  guint n = 0;
  assert_false(open_truncated(path, 10, &n));
  assert_false(open_truncated(path, 50, &n));
  assert_false(open_truncated(path, 90, &n));
  g_free(path);
}

/* A linearized file (qpdf --linearize; ISO 32000-1 Annex F) has a first-page trailer near
 * the start. Observed: at 10% DAMAGED, at 50% and 90% DAMAGED ("no pages": the page tree
 * is written last), at 95% it opens with 3 pages, page 1 captures and pages 2–3 fail
 * cleanly with PAGE errors (checked inside open_truncated). */
static void test_truncated_linearized(void **state) {
  (void)state;
  if (!qpdf_path) {
    print_message("skipped: qpdf is not installed\n");
    skip();
  }
  char *path = scratch_path("linearized.pdf");
  const char *argv[] = {qpdf_path, "--linearize", valid_pdf, path, NULL};
  assert_true(cu_run(argv));
  guint n = 0;
  assert_false(open_truncated(path, 10, &n));
  assert_false(open_truncated(path, 50, &n));
  assert_false(open_truncated(path, 90, &n));
  assert_true(open_truncated(path, 95, &n));
  assert_int_equal(n, 3);
  g_free(path);
}

/* qpdf --encrypt USER OWNER 256: AES-256 with a user password (qpdf manual), so a reader
 * needs one of the two passwords to open it. */
static void test_encrypted(void **state) {
  (void)state;
  if (!qpdf_path) {
    print_message("skipped: qpdf is not installed\n");
    skip();
  }
  char *path = scratch_path("encrypted.pdf");
  const char *argv[] = {qpdf_path, "--encrypt", "user", "owner", "256",
                        "--",      valid_pdf,   path,   NULL};
  assert_true(cu_run(argv));
  expect_error(path, NULL, PP_CAPTURE_ERROR_ENCRYPTED);
  expect_error(path, "wrong", PP_CAPTURE_ERROR_ENCRYPTED);
  const char *good[] = {"user", "owner"};
  for (size_t i = 0; i < G_N_ELEMENTS(good); i++) {
    GError *error = NULL;
    pp_document *doc = pp_document_open(path, good[i], &error);
    if (!doc)
      fail_msg("password '%s': %s", good[i], error->message);
    /* Same three pages as the unencrypted original. */
    assert_int_equal(pp_document_get_info(doc)->n_pages, 3);
    pp_scene *s = pp_document_capture_page(doc, 0, &error);
    assert_non_null(s);
    assert_int_equal(cu_count_kind(s, PP_MARK_FILL), 6);
    pp_scene_free(s);
    pp_document_free(doc);
  }
  g_free(path);
}

static void test_valid_opens(void **state) {
  (void)state;
  GError *error = NULL;
  pp_document *doc = pp_document_open(valid_pdf, NULL, &error);
  assert_non_null(doc);
  const pp_document_info *info = pp_document_get_info(doc);
  assert_int_equal(info->n_pages, 3);
  /* SHA-256 of the bytes, checked against GLib's checksum of the same file. */
  char *data = NULL;
  gsize len = 0;
  assert_true(g_file_get_contents(valid_pdf, &data, &len, NULL));
  char *sha = g_compute_checksum_for_data(G_CHECKSUM_SHA256, (const guchar *)data, len);
  assert_string_equal(info->sha256, sha);
  assert_int_equal(info->size, len);
  /* Page index past the end: a clean PAGE error. */
  assert_null(pp_document_capture_page(doc, 3, &error));
  assert_true(g_error_matches(error, PP_CAPTURE_ERROR, PP_CAPTURE_ERROR_PAGE));
  g_clear_error(&error);
  g_free(sha);
  g_free(data);
  pp_document_free(doc);
}

/* A content stream with an operator ISO 32000-1 Annex A does not define ("zz") and a lineto
 * without a current point (§8.5.2.1): both paints around them still come back, and each
 * problem is reported once in the page's warnings, not passed over silently. */
static void test_content_errors_reported(void **state) {
  (void)state;
  char *path = scratch_path("bad-operators.pdf");
  assert_true(cu_write_pdf(path, "0 0 400 300", "",
                           "1 0 0 rg 10 10 50 50 re f 1 2 l 3 zz 100 10 20 20 re f"));
  g_autoptr(pp_scene) s = cu_capture(path, 0);
  assert_non_null(s);
  assert_int_equal(cu_count_kind(s, PP_MARK_FILL), 2);
  guint unknown = 0;
  for (guint i = 0; i < s->warnings->len; i++) {
    const char *w = g_ptr_array_index(s->warnings, i);
    unknown += strstr(w, "zz") != NULL;
  }
  if (unknown != 1)
    for (guint i = 0; i < s->warnings->len; i++)
      print_message("warning: %s\n", (const char *)g_ptr_array_index(s->warnings, i));
  assert_int_equal(unknown, 1);
  g_free(path);
}

static int setup(void **state) {
  (void)state;
  scratch = cu_scratch_new();
  valid_pdf = scratch_path("valid.pdf");
  make_valid_pdf(valid_pdf);
  return 0;
}

static int teardown(void **state) {
  (void)state;
  g_free(valid_pdf);
  cu_scratch_free(scratch);
  return 0;
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_valid_opens),
      cmocka_unit_test(test_nonexistent),
      cmocka_unit_test(test_empty),
      cmocka_unit_test(test_random_bytes),
      cmocka_unit_test(test_header_then_random),
      cmocka_unit_test(test_truncated_cairo),
      cmocka_unit_test(test_truncated_structure_first),
      cmocka_unit_test(test_truncated_linearized),
      cmocka_unit_test(test_encrypted),
      cmocka_unit_test(test_content_errors_reported),
  };
  return cmocka_run_group_tests(tests, setup, teardown);
}
