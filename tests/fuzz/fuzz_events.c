/* fuzz_events.c — libFuzzer harness for the scheduler's reader of worker event lines
 * (src/cli/assemble.h): a worker killed mid-write, or a damaged pipe, gives any bytes. */
#include <stdint.h>
#include <string.h>

#include "cli/assemble.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size) {
  pp_assembly *as = pp_assembly_new();
  const char *p = (const char *)data, *end = p + size;
  while (p < end) {
    const char *nl = memchr(p, '\n', (size_t)(end - p));
    const char *stop = nl ? nl : end;
    pp_assembly_feed(as, p, (gsize)(stop - p));
    p = stop + 1;
  }
  const char *word, *reason;
  JsonNode *root = pp_assembly_finish(as, "stopped", &word, &reason);
  if (root) {
    char *s = json_to_string(root, FALSE);
    g_free(s);
    json_node_unref(root);
  }
  pp_assembly_free(as);
  return 0;
}
