/* page_fault.c — LD_PRELOAD fault injector for the batch tests only: wraps poppler-glib's
 * poppler_page_render_for_printing() so that one page (PP_TEST_PAGE, 1-based, never 1, so
 * the one-page start-up self-test is untouched) hangs, swells or aborts, chosen by
 * PP_TEST_PAGE_FAULT = hang | swell | abort | chatter (a thousand library-style lines on
 * stderr, then the page as usual) | grow (keeps GROW_MIB of touched memory, then the page
 * as usual). With PP_TEST_PAGE_LOG set, every page from 2 on appends "PAGE PID" to that
 * file, which shows which process ran it. Reaches the page budget and page process paths
 * without a PDF that really breaks poppler. */
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
/* What "grow" keeps: above the 64 MiB a page process may grow by before the next page goes
 * to a fresh one (docworker.c), below any memory budget the tests set. */
#define GROW_MIB 96

static void log_page(int page) {
  const char *path = getenv("PP_TEST_PAGE_LOG");
  FILE *f = path && page > 1 ? fopen(path, "a") : NULL;
  if (f) {
    fprintf(f, "%d %ld\n", page, (long)getpid());
    fclose(f);
  }
}

void poppler_page_render_for_printing(PopplerPage *page, cairo_t *cr) {
  const char *mode = getenv("PP_TEST_PAGE_FAULT");
  const char *which = getenv("PP_TEST_PAGE");
  void (*real)(PopplerPage *, cairo_t *) =
      (void (*)(PopplerPage *, cairo_t *))dlsym(RTLD_NEXT, "poppler_page_render_for_printing");
  log_page(poppler_page_get_index(page) + 1);
  if (mode && which && atoi(which) > 1 && poppler_page_get_index(page) + 1 == atoi(which)) {
    if (strcmp(mode, "grow") == 0) {
      for (int i = 0; i < GROW_MIB; i++) {
        char *p = malloc(1 << 20); /* kept: the page process is to carry it on */
        if (p)
          memset(p, 1, 1 << 20);
      }
      real(page, cr);
      return;
    }
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
