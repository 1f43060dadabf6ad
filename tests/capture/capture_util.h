/* capture_util.h — helpers shared by the capture tests: a per-test scratch directory,
 * boxes of captured paths and clip chains (computed here, independent of the geometry
 * stage), mark lookup by rectangle, running producer programs, and a scene dump. */
#pragma once

#include <cairo-pdf.h>
#include <cairo.h>
#include <glib/gstdio.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "capture/capture.h"

/* Control-point box of a path: exact for the straight-edged bars these tests draw. */
static inline pp_rect cu_path_bbox(const pp_path *p) {
  pp_rect r = pp_rect_empty();
  for (size_t i = 0; i < p->n_segs; i++) {
    const pp_seg *s = &p->segs[i];
    int n = s->kind == PP_SEG_CURVE ? 3 : s->kind == PP_SEG_CLOSE ? 0 : 1;
    for (int k = 0; k < n; k++)
      r = pp_rect_add_point(r, s->pt[k]);
  }
  return r;
}

/* Subpaths with at least one line or curve (a lone MOVE draws nothing). */
static inline size_t cu_drawn_subpaths(const pp_path *p) {
  size_t n = 0;
  gboolean drawing = FALSE;
  for (size_t i = 0; i < p->n_segs; i++) {
    pp_seg_kind k = p->segs[i].kind;
    if (k == PP_SEG_MOVE)
      drawing = FALSE;
    else if ((k == PP_SEG_LINE || k == PP_SEG_CURVE) && !drawing)
      drawing = TRUE, n++;
  }
  return n;
}

/* Box of the region a clip chain leaves visible: the intersection of every link's
 * path box (the clip is the intersection of all regions on the chain, capture.h). */
static inline pp_rect cu_clip_bbox(const pp_clip *clip) {
  pp_rect r = {-INFINITY, -INFINITY, INFINITY, INFINITY};
  for (; clip; clip = clip->parent)
    r = pp_rect_intersect(r, cu_path_bbox(clip->path));
  return r;
}

static inline pp_rect cu_visible_bbox(const pp_mark *m) {
  return pp_rect_intersect(cu_path_bbox(m->path), cu_clip_bbox(m->clip));
}

static inline gboolean cu_rect_near(pp_rect a, pp_rect b, double tol) {
  return fabs(a.x0 - b.x0) <= tol && fabs(a.y0 - b.y0) <= tol && fabs(a.x1 - b.x1) <= tol &&
         fabs(a.y1 - b.y1) <= tol;
}

/* Largest coordinate difference, for failure messages. */
static inline double cu_rect_diff(pp_rect a, pp_rect b) {
  return fmax(fmax(fabs(a.x0 - b.x0), fabs(a.y0 - b.y0)),
              fmax(fabs(a.x1 - b.x1), fabs(a.y1 - b.y1)));
}

/* The fill mark whose visible box is closest to want, or NULL if none is within tol. */
static inline const pp_mark *cu_find_fill(const pp_scene *s, pp_rect want, double tol) {
  const pp_mark *best = NULL;
  double best_d = INFINITY;
  for (guint i = 0; i < s->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(s->marks, i);
    if (m->kind != PP_MARK_FILL)
      continue;
    pp_rect v = cu_visible_bbox(m);
    if (pp_rect_is_empty(v))
      continue;
    double d = cu_rect_diff(v, want);
    if (d < best_d)
      best_d = d, best = m;
  }
  return best_d <= tol ? best : NULL;
}

static inline guint cu_count_kind(const pp_scene *s, pp_mark_kind kind) {
  guint n = 0;
  for (guint i = 0; i < s->marks->len; i++)
    n += ((const pp_mark *)g_ptr_array_index(s->marks, i))->kind == kind;
  return n;
}

static inline const pp_text_run *cu_find_word(const pp_scene *s, const char *text, double cx,
                                              double cy, double tol) {
  for (guint i = 0; i < s->words->len; i++) {
    const pp_text_run *w = g_ptr_array_index(s->words, i);
    double wx = (w->box.x0 + w->box.x1) / 2, wy = (w->box.y0 + w->box.y1) / 2;
    if (g_strcmp0(w->text, text) == 0 && fabs(wx - cx) <= tol && fabs(wy - cy) <= tol)
      return w;
  }
  return NULL;
}

static inline void cu_dump_scene(const pp_scene *s) {
  fprintf(stderr, "scene page %u %gx%g: %u marks, %u words\n", s->page_index, s->width, s->height,
          s->marks->len, s->words->len);
  for (guint i = 0; i < s->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(s->marks, i);
    pp_rect b = cu_path_bbox(m->path), v = cu_visible_bbox(m);
    fprintf(stderr,
            "  #%u %-6s segs=%zu bbox=[%.3f %.3f %.3f %.3f] vis=[%.3f %.3f %.3f %.3f]"
            " clip=%zu rgb=%.2f,%.2f,%.2f lw=%.2f\n",
            m->index, pp_mark_kind_name(m->kind), m->path->n_segs, b.x0, b.y0, b.x1, b.y1, v.x0,
            v.y0, v.x1, v.y1, pp_clip_depth(m->clip), m->paint.r, m->paint.g, m->paint.b,
            m->line_width);
  }
  for (guint i = 0; i < s->words->len; i++) {
    const pp_text_run *w = g_ptr_array_index(s->words, i);
    fprintf(stderr, "  word '%s' [%.2f %.2f %.2f %.2f] size=%.2f angle=%.0f\n", w->text, w->box.x0,
            w->box.y0, w->box.x1, w->box.y1, w->font_size, w->angle);
  }
}

/* A fresh scratch directory per test program; removed by cu_scratch_free(). */
static inline char *cu_scratch_new(void) {
  GError *error = NULL;
  char *dir = g_dir_make_tmp("pp-capture-XXXXXX", &error);
  g_assert_no_error(error);
  return dir;
}

static inline void cu_scratch_free(char *dir) {
  GDir *d = g_dir_open(dir, 0, NULL);
  const char *name;
  while (d && (name = g_dir_read_name(d))) {
    char *p = g_build_filename(dir, name, NULL);
    g_unlink(p);
    g_free(p);
  }
  if (d)
    g_dir_close(d);
  g_rmdir(dir);
  g_free(dir);
}

/* Runs argv; TRUE when it exits 0. Its stderr is shown on failure. */
static inline gboolean cu_run(const char *const *argv) {
  char *err = NULL;
  int status = 0;
  GError *error = NULL;
  gboolean ok = g_spawn_sync(NULL, (char **)argv, NULL, G_SPAWN_STDOUT_TO_DEV_NULL, NULL, NULL,
                             NULL, &err, &status, &error);
  if (!ok) {
    fprintf(stderr, "cannot run %s: %s\n", argv[0], error->message);
    g_error_free(error);
  } else if (!g_spawn_check_wait_status(status, NULL)) {
    fprintf(stderr, "%s failed:\n%s\n", argv[0], err ? err : "");
    ok = FALSE;
  }
  g_free(err);
  return ok;
}

/* Opens path and captures page index, failing the calling test on any error. */
static inline pp_scene *cu_capture(const char *path, guint index) {
  GError *error = NULL;
  pp_document *doc = pp_document_open(path, NULL, &error);
  if (!doc) {
    fprintf(stderr, "open %s: %s\n", path, error->message);
    g_error_free(error);
    return NULL;
  }
  pp_scene *s = pp_document_capture_page(doc, index, &error);
  if (!s) {
    fprintf(stderr, "capture %s page %u: %s\n", path, index, error->message);
    g_error_free(error);
  }
  pp_document_free(doc);
  return s;
}

/* Writes a one-page PDF around a content stream, with a correct xref table
 * (ISO 32000-1 §7.5.4: 20-byte entries "nnnnnnnnnn ggggg n\r\n"), so poppler reads it as
 * written instead of reconstructing it. extra_page_keys may be "" or e.g. "/Rotate 90". */
static inline gboolean cu_write_pdf(const char *path, const char *media_box,
                                    const char *extra_page_keys, const char *content) {
  GString *pdf = g_string_new("%PDF-1.4\n");
  gsize off[5];
  off[1] = pdf->len;
  g_string_append(pdf, "1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj\n");
  off[2] = pdf->len;
  g_string_append(pdf, "2 0 obj << /Type /Pages /Kids [3 0 R] /Count 1 >> endobj\n");
  off[3] = pdf->len;
  g_string_append_printf(pdf,
                         "3 0 obj << /Type /Page /Parent 2 0 R /MediaBox [%s] %s "
                         "/Contents 4 0 R >> endobj\n",
                         media_box, extra_page_keys);
  off[4] = pdf->len;
  g_string_append_printf(pdf, "4 0 obj << /Length %zu >> stream\n%s\nendstream endobj\n",
                         strlen(content), content);
  gsize xref = pdf->len;
  g_string_append(pdf, "xref\n0 5\n0000000000 65535 f\r\n");
  for (int i = 1; i < 5; i++)
    g_string_append_printf(pdf, "%010zu 00000 n\r\n", off[i]);
  g_string_append_printf(pdf, "trailer << /Root 1 0 R /Size 5 >>\nstartxref\n%zu\n%%%%EOF\n", xref);
  gboolean ok = g_file_set_contents(path, pdf->str, (gssize)pdf->len, NULL);
  g_string_free(pdf, TRUE);
  return ok;
}

/* Draws n_pages chart pages (gridlines, bars, tick labels, a title) with cairo's PDF
 * surface: the workload of the memory test and the benchmark. Invented figures. */
static inline void cu_write_chart_pages(const char *path, int n_pages) {
  cairo_surface_t *s = cairo_pdf_surface_create(path, 595, 842);
  cairo_t *cr = cairo_create(s);
  cairo_select_font_face(cr, "sans", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_NORMAL);
  for (int p = 0; p < n_pages; p++) {
    for (int chart = 0; chart < 2; chart++) {
      double top = 80 + chart * 380, left = 70, w = 460, h = 280;
      cairo_set_source_rgb(cr, 0.85, 0.85, 0.85);
      cairo_set_line_width(cr, 0.5);
      for (int g = 0; g <= 5; g++) {
        cairo_move_to(cr, left, top + h - g * h / 5);
        cairo_line_to(cr, left + w, top + h - g * h / 5);
        cairo_stroke(cr);
      }
      cairo_save(cr);
      cairo_rectangle(cr, left, top, w, h);
      cairo_clip(cr);
      for (int b = 0; b < 12; b++) {
        double v = 0.3 + 0.6 * ((p * 7 + b * 5 + chart * 3) % 11) / 10.0;
        cairo_set_source_rgb(cr, 0.2, 0.4, 0.7 + 0.02 * b);
        cairo_rectangle(cr, left + 8 + b * 37.5, top + h * (1 - v), 28, h * v + 20);
        cairo_fill(cr);
      }
      cairo_restore(cr);
      cairo_set_source_rgb(cr, 0, 0, 0);
      cairo_set_font_size(cr, 8);
      for (int g = 0; g <= 5; g++) {
        char label[16];
        g_snprintf(label, sizeof label, "%d", 400 + 20 * g);
        cairo_move_to(cr, left - 22, top + h - g * h / 5 + 3);
        cairo_show_text(cr, label);
      }
      for (int b = 0; b < 12; b++) {
        char label[16];
        g_snprintf(label, sizeof label, "%d", 2012 + b);
        cairo_move_to(cr, left + 8 + b * 37.5, top + h + 12);
        cairo_show_text(cr, label);
      }
      cairo_set_font_size(cr, 12);
      cairo_move_to(cr, left, top - 12);
      cairo_show_text(cr, chart ? "Orrin Valley Water: litres per household"
                                : "Orrin Valley Water: new connections");
    }
    cairo_show_page(cr);
  }
  cairo_destroy(cr);
  cairo_surface_destroy(s);
}
