/* fuzz_records.c — libFuzzer harness for the batch record reader (src/cli/record.h), which
 * reads batch.jsonl files that a killed run may have cut anywhere or that a user edited. */
#include <stdint.h>

#include "cli/record.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size) {
  JsonObject *summary = NULL;
  GHashTable *t = pp_records_parse((const char *)data, size, &summary);
  GHashTableIter it;
  gpointer key, value;
  g_hash_table_iter_init(&it, t);
  while (g_hash_table_iter_next(&it, &key, &value)) /* what resume reads of each record */
    json_object_get_string_member_with_default(value, "sha256", NULL);
  if (summary)
    json_object_unref(summary);
  g_hash_table_unref(t);
  return 0;
}
