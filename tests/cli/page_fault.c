/* page_fault.c — LD_PRELOAD fault injector for the batch tests only: wraps poppler-glib's
 * poppler_page_render_for_printing() so that one page (PP_TEST_PAGE, 1-based, never 1, so
 * the one-page start-up self-test is untouched) hangs, swells or aborts, chosen by
 * PP_TEST_PAGE_FAULT = hang | swell | abort | chatter (a thousand library-style lines on
 * stderr, then the page as usual). Reaches the page budget paths without a PDF that
 * really breaks poppler. */
#ifndef _GNU_SOURCE
#define _GNU_SOURCE
#endif
#include <dlfcn.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

typedef struct _PopplerPage PopplerPage;
typedef struct _cairo cairo_t;
int poppler_page_get_index(PopplerPage *page);
void poppler_page_render_for_printing(PopplerPage *page, cairo_t *cr);

/* Upper bound of what "swell" allocates, so a run without a memory limit (under
 * AddressSanitizer) cannot take the machine down: 8 GiB. */
#define SWELL_MAX_MIB 8192

void poppler_page_render_for_printing(PopplerPage *page, cairo_t *cr) {
  const char *mode = getenv("PP_TEST_PAGE_FAULT");
  const char *which = getenv("PP_TEST_PAGE");
  void (*real)(PopplerPage *, cairo_t *) =
      (void (*)(PopplerPage *, cairo_t *))dlsym(RTLD_NEXT, "poppler_page_render_for_printing");
  if (mode && which && atoi(which) > 1 && poppler_page_get_index(page) + 1 == atoi(which)) {
    if (strcmp(mode, "chatter") == 0) {
      for (int i = 0; i < 1000; i++)
        fprintf(stderr, "Syntax Warning: a library message from page %s\n", which);
      real(page, cr);
      return;
    }
    if (strcmp(mode, "hang") == 0)
      for (;;)
        pause();
    if (strcmp(mode, "swell") == 0) {
      for (int i = 0; i < SWELL_MAX_MIB; i++) {
        char *p = malloc(1 << 20);
        if (!p)
          break;
        memset(p, 1, 1 << 20);
      }
    }
    abort();
  }
  real(page, cr);
}
