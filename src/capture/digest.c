/* digest.c — SHA-256 of document bytes through OpenSSL's libcrypto: it uses the processor's
 * SHA instructions where there are any, several times faster than GLib's portable code, and
 * every document is hashed twice (once to schedule it, once by the worker that opens it). */
#include "capture.h"

#include <openssl/evp.h>

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
