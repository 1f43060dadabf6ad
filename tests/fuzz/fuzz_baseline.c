/* fuzz_baseline.c — libFuzzer harness for the baseline reader (src/report/review.h): the
 * input is a baseline key file, loaded and applied to a small findings document. */
#include <stdint.h>
#include <stdio.h>
#include <sys/mman.h>
#include <unistd.h>

#include "report/review.h"

static const char *doc_text =
    "{\"findings\":[{\"id\":\"a1\",\"rule\":\"bars-off-zero\",\"page\":1,\"severity\":\"major\"},"
    "{\"id\":\"b2\",\"rule\":\"bars-on-log\",\"page\":2,\"severity\":\"severe\"}],"
    "\"totals\":{\"findings\":2,\"by_severity\":{\"minor\":0,\"major\":1,\"severe\":1}}}";

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size) {
  int fd = memfd_create("baseline", 0);
  if (fd < 0 || write(fd, data, size) != (ssize_t)size) {
    if (fd >= 0)
      close(fd);
    return 0;
  }
  char path[64];
  snprintf(path, sizeof path, "/proc/self/fd/%d", fd);
  GError *error = NULL;
  pp_baseline *b = pp_baseline_load(path, &error);
  if (b) {
    pp_baseline_lookup("a1", b);
    JsonNode *doc = json_from_string(doc_text, NULL);
    pp_baseline_apply(b, json_node_get_object(doc));
    GPtrArray *stale = pp_baseline_stale(b);
    if (stale)
      g_ptr_array_unref(stale);
    json_node_unref(doc);
    pp_baseline_free(b);
  }
  g_clear_error(&error);
  close(fd);
  return 0;
}
