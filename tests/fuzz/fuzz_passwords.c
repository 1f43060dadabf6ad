/* fuzz_passwords.c — libFuzzer harness for the password file reader (src/cli/passwords.h). */
#include <stdint.h>

#include "cli/passwords.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size) {
  char *text = g_strndup((const char *)data, size);
  pp_passwords *pw = pp_passwords_parse(text, "fallback");
  pp_passwords_lookup(pw, "dir/report.pdf", "0123456789abcdef");
  pp_passwords_lookup(pw, text, text);
  pp_passwords_free(pw);
  g_free(text);
  return 0;
}
