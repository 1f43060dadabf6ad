/* floor.c — the floor plotproof's scan is measured against (scripts/bench-speed): poppler
 * renders every page of a PDF into a cairo recording surface and lays out its text,
 * which is the least any scan built on poppler must do. Prints the page count.
 *   pp-floor FILE.pdf */
#include <poppler.h>
#include <stdio.h>

int main(int argc, char **argv) {
  if (argc != 2) {
    fprintf(stderr, "usage: pp-floor FILE.pdf\n");
    return 2;
  }
  GError *error = NULL;
  GFile *file = g_file_new_for_commandline_arg(argv[1]);
  char *uri = g_file_get_uri(file);
  g_object_unref(file);
  PopplerDocument *doc = poppler_document_new_from_file(uri, NULL, &error);
  g_free(uri);
  if (!doc) {
    fprintf(stderr, "pp-floor: %s\n", error->message);
    g_error_free(error);
    return 1;
  }
  int n = poppler_document_get_n_pages(doc);
  for (int i = 0; i < n; i++) {
    PopplerPage *page = poppler_document_get_page(doc, i);
    if (!page)
      continue;
    cairo_surface_t *target = cairo_recording_surface_create(CAIRO_CONTENT_COLOR_ALPHA, NULL);
    cairo_t *cr = cairo_create(target);
    poppler_page_render_for_printing(page, cr);
    cairo_destroy(cr);
    cairo_surface_destroy(target);
    PopplerRectangle *rects = NULL;
    guint n_rects = 0;
    poppler_page_get_text_layout(page, &rects, &n_rects);
    g_free(rects);
    g_object_unref(page);
  }
  printf("%d\n", n);
  g_object_unref(doc);
  return 0;
}
