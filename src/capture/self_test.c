/* self_test.c — proves at start-up that poppler's cairo calls reach the tap.
 * Without ELF symbol interposition (static linking, another platform) every page
 * would come back empty; this turns that into one clear error instead. */
#include <math.h>
#include <string.h>

#include "internal.h"

/* A one-page PDF written by hand (ISO 32000-1 §7.5): a filled rectangle from
 * (100,200) to (300,260) in user space and one stroked line. The xref offsets are
 * deliberately absent; poppler reconstructs them, which the self-test also covers. */
static const char probe_pdf[] =
    "%PDF-1.4\n"
    "1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj\n"
    "2 0 obj << /Type /Pages /Kids [3 0 R] /Count 1 >> endobj\n"
    "3 0 obj << /Type /Page /Parent 2 0 R /MediaBox [0 0 400 400] /Contents 4 0 R >> endobj\n"
    "4 0 obj << /Length 58 >> stream\n"
    "1 0 0 rg 100 200 200 60 re f 2 w 10 10 m 390 10 l S\n"
    "endstream endobj\n"
    "trailer << /Root 1 0 R /Size 5 >>\n"
    "%%EOF\n";

gboolean pp_capture_self_test(GError **error) {
  static int verdict = -1; /* once per process */
  static char *reason;
  if (verdict >= 0) {
    if (!verdict)
      g_set_error(error, PP_CAPTURE_ERROR, PP_CAPTURE_ERROR_TAP, "%s", reason);
    return verdict;
  }
  GBytes *bytes = g_bytes_new_static(probe_pdf, sizeof probe_pdf - 1);
  GError *local = NULL;
  PopplerDocument *pd = poppler_document_new_from_bytes(bytes, NULL, &local);
  g_bytes_unref(bytes);
  gboolean ok = FALSE;
  if (!pd) {
    reason =
        g_strdup_printf("capture self-test: poppler cannot open its probe PDF: %s", local->message);
    g_error_free(local);
  } else {
    PopplerPage *page = poppler_document_get_page(pd, 0);
    pp_scene *scene = pp_scene_new(0, 400, 400);
    cairo_surface_t *target = cairo_recording_surface_create(CAIRO_CONTENT_COLOR_ALPHA, NULL);
    cairo_t *cr = cairo_create(target);
    pp_tap_begin(cr, 1.0, scene);
    poppler_page_render_for_printing(page, cr);
    guint calls = pp_tap_end();
    cairo_destroy(cr);
    cairo_surface_destroy(target);
    /* Expect the rectangle at page (100,140)–(300,200): y flips about the 400 pt box. */
    gboolean found = FALSE;
    for (guint i = 0; i < scene->marks->len; i++) {
      pp_mark *m = g_ptr_array_index(scene->marks, i);
      if (m->kind != PP_MARK_FILL || m->path->n_segs < 4)
        continue;
      pp_point p = m->path->segs[0].pt[0];
      if (fabs(p.x - 100) < 0.01 && (fabs(p.y - 140) < 0.01 || fabs(p.y - 200) < 0.01) &&
          fabs(m->paint.r - 1) < 1e-6)
        found = TRUE;
    }
    if (calls == 0)
      reason = g_strdup("capture self-test: no cairo call reached the tap; plotproof must be "
                        "dynamically linked against cairo and export its cairo_* symbols");
    else if (!found)
      reason = g_strdup("capture self-test: the tap saw cairo calls but not the probe rectangle");
    else
      ok = TRUE;
    pp_scene_free(scene);
    g_object_unref(page);
    g_object_unref(pd);
  }
  verdict = ok;
  if (!ok)
    g_set_error(error, PP_CAPTURE_ERROR, PP_CAPTURE_ERROR_TAP, "%s", reason);
  return ok;
}
