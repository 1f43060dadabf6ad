/* fault.c — LD_PRELOAD fault injector for the e2e tests only: replaces poppler-glib's
 * poppler_document_new_from_file() with abort() or an endless pause(), chosen by
 * PP_TEST_FAULT. Capture opens documents with it, while the start-up self-test uses
 * poppler_document_new_from_bytes(), so only the worker child is hit: this reaches the
 * crash and timeout paths without needing a PDF that really breaks poppler. */
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

void *poppler_document_new_from_file(const char *uri, const char *password, void **error);

void *poppler_document_new_from_file(const char *uri, const char *password, void **error) {
  (void)uri, (void)password, (void)error;
  const char *mode = getenv("PP_TEST_FAULT");
  if (mode && strcmp(mode, "hang") == 0)
    for (;;)
      pause();
  abort();
}
