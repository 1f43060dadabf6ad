/* test_page.h — shared by the recognition tests: a page the test draws with cairo into a
 * temporary PDF, read back through capture and measured as a scan reads it, then
 * recognised. PP_TEST_KEEP_PDF=1 keeps the PDF for a look. */
#pragma once

#include <math.h>
#include <stdlib.h>
#include <unistd.h>

#include <cairo-pdf.h>
#include <glib/gstdio.h>

#include "capture/capture.h"
#include "geometry/geometry.h"
#include "recognize/recognize.h"

typedef void (*pp_test_draw_func)(cairo_t *cr, const void *data);

typedef struct {
  pp_document *doc;
  pp_scene *scene;
  pp_page_charts *charts;
} pp_test_page;

/* One A4 page drawn by draw(cr, data) in DejaVu Sans, captured, measured and recognised;
 * fails the test when the PDF cannot be written or read. */
static inline pp_test_page pp_test_page_draw(pp_test_draw_func draw, const void *data) {
  char *path = g_build_filename(g_get_tmp_dir(), "pp-test-page-XXXXXX.pdf", NULL);
  int fd = g_mkstemp(path);
  if (fd < 0)
    abort();
  close(fd);
  cairo_surface_t *s = cairo_pdf_surface_create(path, 595, 842);
  cairo_t *cr = cairo_create(s);
  cairo_select_font_face(cr, "DejaVu Sans", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_NORMAL);
  draw(cr, data);
  cairo_destroy(cr);
  cairo_surface_destroy(s);
  pp_test_page p = {0};
  GError *error = NULL;
  p.doc = pp_document_open(path, NULL, &error);
  if (p.doc)
    p.scene = pp_document_capture_page(p.doc, 0, &error);
  if (!p.scene) {
    g_printerr("%s: %s\n", path, error ? error->message : "no page");
    abort();
  }
  pp_scene_measure(p.scene);
  if (g_getenv("PP_TEST_KEEP_PDF"))
    g_message("kept %s", path);
  else
    g_unlink(path);
  g_free(path);
  p.charts = pp_page_charts_find(p.scene);
  return p;
}

static inline void pp_test_page_clear(pp_test_page *p) {
  g_clear_pointer(&p->charts, pp_page_charts_free);
  g_clear_pointer(&p->scene, pp_scene_free);
  g_clear_pointer(&p->doc, pp_document_free);
}

/* The page's only figure of a kind; fails the test when there are none or two. */
static inline const pp_figure *pp_test_page_only_figure(const pp_page_charts *charts,
                                                        pp_figure_kind kind) {
  const pp_figure *found = NULL;
  for (guint i = 0; i < charts->figures->len; i++) {
    const pp_figure *f = g_ptr_array_index(charts->figures, i);
    if (f->kind == kind) {
      if (found)
        abort();
      found = f;
    }
  }
  if (!found)
    abort();
  return found;
}

/* Index of the drawn point (xs[k], ys[k]) nearest an element's box centre. */
static inline guint pp_test_nearest_drawn(const double *xs, const double *ys, guint n,
                                          pp_rect box) {
  double cx = (box.x0 + box.x1) / 2, cy = (box.y0 + box.y1) / 2;
  guint k = 0;
  for (guint j = 1; j < n; j++)
    if (hypot(xs[j] - cx, ys[j] - cy) < hypot(xs[k] - cx, ys[k] - cy))
      k = j;
  return k;
}
