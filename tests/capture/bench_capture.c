/* bench_capture.c — benchmark, not a test: pages per second of pp_document_capture_page
 * against poppler_page_render_for_printing into a cairo recording surface, on a 120-page
 * chart PDF generated with cairo; a third timing adds the text API calls capture also
 * makes. Usage: bench-capture [pages] (default 120). */
#include <poppler.h>
#include <stdlib.h>

#include "capture_util.h"

static double bench_capture(pp_document *doc, guint n, guint *marks) {
  gint64 t0 = g_get_monotonic_time();
  for (guint i = 0; i < n; i++) {
    GError *error = NULL;
    pp_scene *s = pp_document_capture_page(doc, i, &error);
    if (!s) {
      fprintf(stderr, "page %u: %s\n", i, error->message);
      g_error_free(error);
      continue;
    }
    *marks += s->marks->len;
    pp_scene_free(s);
  }
  return (g_get_monotonic_time() - t0) / 1e6;
}

/* with_text adds the poppler text calls capture makes (text.c), to split its cost. */
static double bench_render(PopplerDocument *pd, guint n, gboolean with_text) {
  gint64 t0 = g_get_monotonic_time();
  for (guint i = 0; i < n; i++) {
    PopplerPage *page = poppler_document_get_page(pd, (int)i);
    cairo_surface_t *target = cairo_recording_surface_create(CAIRO_CONTENT_COLOR_ALPHA, NULL);
    cairo_t *cr = cairo_create(target);
    poppler_page_render_for_printing(page, cr);
    if (with_text) {
      PopplerRectangle *rects = NULL;
      guint n_rects = 0;
      g_free(poppler_page_get_text(page));
      poppler_page_get_text_layout(page, &rects, &n_rects);
      g_free(rects);
      poppler_page_free_text_attributes(poppler_page_get_text_attributes(page));
    }
    cairo_destroy(cr);
    cairo_surface_destroy(target);
    g_object_unref(page);
  }
  return (g_get_monotonic_time() - t0) / 1e6;
}

int main(int argc, char **argv) {
  int n_pages = argc > 1 ? atoi(argv[1]) : 120;
  if (n_pages <= 0)
    n_pages = 120;
  char *dir = cu_scratch_new();
  char *path = g_build_filename(dir, "bench.pdf", NULL);
  cu_write_chart_pages(path, n_pages);

  GError *error = NULL;
  if (!pp_capture_self_test(&error)) {
    fprintf(stderr, "%s\n", error->message);
    return 1;
  }
  pp_document *doc = pp_document_open(path, NULL, &error);
  char *uri = g_filename_to_uri(path, NULL, NULL);
  PopplerDocument *pd = poppler_document_new_from_file(uri, NULL, NULL);
  if (!doc || !pd) {
    fprintf(stderr, "cannot open %s\n", path);
    return 1;
  }
  /* One untimed pass each so both start with poppler's caches (fonts, page objects) warm. */
  guint marks = 0;
  bench_capture(doc, (guint)n_pages, &marks);
  bench_render(pd, (guint)n_pages, TRUE);

  /* Best of 5: the machine is shared, and the minimum is the least disturbed run. */
  double tc = INFINITY, tr = INFINITY, tt = INFINITY;
  for (int rep = 0; rep < 5; rep++) {
    marks = 0;
    tc = fmin(tc, bench_capture(doc, (guint)n_pages, &marks));
    tr = fmin(tr, bench_render(pd, (guint)n_pages, FALSE));
    tt = fmin(tt, bench_render(pd, (guint)n_pages, TRUE));
  }
  printf("%d pages, %u marks captured\n", n_pages, marks);
  printf("capture (pp_document_capture_page, incl. text): %8.1f pages/s (%.3f s)\n", n_pages / tc,
         tc);
  printf("render_for_printing → recording surface:       %8.1f pages/s (%.3f s)\n", n_pages / tr,
         tr);
  printf("render_for_printing + poppler text API:         %8.1f pages/s (%.3f s)\n", n_pages / tt,
         tt);

  g_object_unref(pd);
  pp_document_free(doc);
  g_free(uri);
  g_free(path);
  cu_scratch_free(dir);
  return 0;
}
