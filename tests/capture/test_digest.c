/* test_digest.c — the documents' SHA-256 against the examples published with the standard
 * (FIPS 180-2, appendix B: "abc", the 448-bit message, one million "a"; the empty string's
 * digest as widely published) and against GLib's own implementation on fed-in pieces. */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <string.h>

#include <cmocka.h>

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

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_published_examples),
      cmocka_unit_test(test_same_as_glib),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
