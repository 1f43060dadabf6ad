/* test_cairo_pdf.c — capture of PDFs drawn at test time with cairo's PDF surface (and two
 * written by hand): bars at known coordinates must come back as marks within 0.01 pt,
 * clipped bars as path ∩ clip, text as words, images as one image mark. */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "capture_util.h"

/* cairo's PDF surface user space is the page with origin top-left, y down, in points
 * (cairo_pdf_surface_create docs: "size in points (1 point == 1/72.0 inch)"), which is
 * also capture.h's page space, so the drawn coordinates are the expected ones. */
#define PAGE_W 400.0
#define PAGE_H 300.0
#define TOL 0.01 /* the tolerance for bar rectangles */

typedef struct {
  pp_rect drawn;   /* what the path covers */
  pp_rect visible; /* drawn ∩ clip */
} bar;

/* Bars of an invented "Larkspur Rail" ridership chart, some values off the 1/8 grid so a
 * snapped coordinate would show. cairo itself stores paths in 24.8 fixed point (cairo
 * docs, cairo_fixed_t), so what reaches the PDF is within 1/512 pt of these. */
static const bar bars[] = {
    {{50, 100.25, 80, 250.25}, {50, 100.25, 80, 250.25}},         /* rectangle + fill */
    {{100.5, 150, 130.5, 250.125}, {100.5, 150, 130.5, 250.125}}, /* fill_preserve + stroke */
    {{150, 120.37, 180, 250}, {150, 120.37, 180, 250}},           /* closed 4-point path */
    {{190.2, 170, 215.7, 250}, {190.2, 170, 215.7, 250}},         /* open 4-point path */
    {{225, 20, 255, 250}, {225, 60, 255, 250}},                   /* cut by the plot top */
    {{265, 100, 295, 300}, {265, 100, 295, 250}},                 /* cut by the plot bottom */
};
static const pp_rect plot = {40, 60, 360, 250};

static char *scratch;
static char *chart_pdf, *image_pdf;

static void rect_path(cairo_t *cr, pp_rect r) {
  cairo_rectangle(cr, r.x0, r.y0, r.x1 - r.x0, r.y1 - r.y0);
}

static void four_points(cairo_t *cr, pp_rect r, gboolean close) {
  cairo_move_to(cr, r.x0, r.y0);
  cairo_line_to(cr, r.x1, r.y0);
  cairo_line_to(cr, r.x1, r.y1);
  cairo_line_to(cr, r.x0, r.y1);
  if (close)
    cairo_close_path(cr);
}

static double text_at(cairo_t *cr, const char *s, double x, double y, pp_point *centre) {
  cairo_text_extents_t e;
  cairo_text_extents(cr, s, &e);
  cairo_move_to(cr, x, y);
  cairo_show_text(cr, s);
  /* Expected word centre: horizontally the ink box from cairo's own metrics; vertically
   * the ink box centre too (poppler's box spans ascent..descent, so a few points off). */
  *centre = (pp_point){x + e.x_bearing + e.width / 2, y + e.y_bearing + e.height / 2};
  return e.x_advance;
}

static pp_point label_centre[2];

static void make_chart_pdf(const char *path) {
  cairo_surface_t *s = cairo_pdf_surface_create(path, PAGE_W, PAGE_H);
  cairo_t *cr = cairo_create(s);
  cairo_set_source_rgb(cr, 0.2, 0.4, 0.8);
  rect_path(cr, bars[0].drawn);
  cairo_fill(cr);

  rect_path(cr, bars[1].drawn);
  cairo_set_source_rgb(cr, 0.9, 0.1, 0.1);
  cairo_fill_preserve(cr);
  cairo_set_source_rgb(cr, 0, 0, 0);
  cairo_set_line_width(cr, 2);
  cairo_stroke(cr);

  cairo_set_source_rgb(cr, 0.1, 0.6, 0.3);
  four_points(cr, bars[2].drawn, TRUE);
  cairo_fill(cr);
  four_points(cr, bars[3].drawn, FALSE);
  cairo_fill(cr);

  cairo_save(cr);
  rect_path(cr, plot);
  cairo_clip(cr);
  cairo_set_source_rgb(cr, 0.5, 0.2, 0.7);
  rect_path(cr, bars[4].drawn);
  cairo_fill(cr);
  rect_path(cr, bars[5].drawn);
  cairo_fill(cr);
  cairo_restore(cr);

  cairo_select_font_face(cr, "sans", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_NORMAL);
  cairo_set_font_size(cr, 12);
  cairo_set_source_rgb(cr, 0, 0, 0);
  text_at(cr, "400", 50, 275, &label_centre[0]);
  text_at(cr, "2019", 150, 275, &label_centre[1]);
  cairo_destroy(cr);
  cairo_surface_destroy(s);
}

/* A 40×30 pixel image placed on a 160×60 pt rectangle at (220, 40). */
static void make_image_pdf(const char *path) {
  cairo_surface_t *img = cairo_image_surface_create(CAIRO_FORMAT_RGB24, 40, 30);
  cairo_t *ic = cairo_create(img);
  cairo_set_source_rgb(ic, 0.8, 0.3, 0.1);
  cairo_paint(ic);
  cairo_set_source_rgb(ic, 0.1, 0.3, 0.8);
  cairo_rectangle(ic, 5, 5, 20, 10);
  cairo_fill(ic);
  cairo_destroy(ic);

  cairo_surface_t *s = cairo_pdf_surface_create(path, PAGE_W, PAGE_H);
  cairo_t *cr = cairo_create(s);
  cairo_translate(cr, 220, 40);
  cairo_scale(cr, 4, 2);
  cairo_set_source_surface(cr, img, 0, 0);
  cairo_paint(cr);
  cairo_destroy(cr);
  cairo_surface_destroy(s);
  cairo_surface_destroy(img);
}

static int setup(void **state) {
  (void)state;
  scratch = cu_scratch_new();
  chart_pdf = g_build_filename(scratch, "chart.pdf", NULL);
  image_pdf = g_build_filename(scratch, "image.pdf", NULL);
  make_chart_pdf(chart_pdf);
  make_image_pdf(image_pdf);
  return 0;
}

static int teardown(void **state) {
  (void)state;
  g_free(chart_pdf);
  g_free(image_pdf);
  cu_scratch_free(scratch);
  return 0;
}

static void test_bars(void **state) {
  (void)state;
  g_autoptr(pp_scene) s = cu_capture(chart_pdf, 0);
  assert_non_null(s);
  /* cairo_pdf_surface_create(…, 400, 300): the page size in points (cairo docs). */
  assert_float_equal(s->width, PAGE_W, 1e-9);
  assert_float_equal(s->height, PAGE_H, 1e-9);
  for (size_t i = 0; i < G_N_ELEMENTS(bars); i++) {
    const pp_mark *m = cu_find_fill(s, bars[i].visible, TOL);
    if (!m) {
      cu_dump_scene(s);
      fail_msg("bar %zu: no fill with visible box [%g %g %g %g]", i, bars[i].visible.x0,
               bars[i].visible.y0, bars[i].visible.x1, bars[i].visible.y1);
    }
    /* The path is what the cairo calls drew; the visible part is path ∩ clip (ISO 32000-1
     * §8.5.4: painting is limited to the current clipping path). */
    pp_rect b = cu_path_bbox(m->path);
    if (!cu_rect_near(b, bars[i].drawn, TOL))
      fail_msg("bar %zu: path box off by %g pt", i, cu_rect_diff(b, bars[i].drawn));
    assert_true(cu_rect_near(cu_visible_bbox(m), bars[i].visible, TOL));
    /* One subpath: ISO 32000-1 §8.5.2.1 "re" appends a complete subpath. cairo_copy_path
     * shows a MOVE_TO after each close_path (cairo_close_path docs), so an empty trailing
     * subpath is tolerated; only subpaths that draw are counted. */
    assert_int_equal(cu_drawn_subpaths(m->path), 1);
  }
}

static void test_clipped_bars_carry_clip(void **state) {
  (void)state;
  g_autoptr(pp_scene) s = cu_capture(chart_pdf, 0);
  assert_non_null(s);
  for (size_t i = 4; i < 6; i++) {
    const pp_mark *m = cu_find_fill(s, bars[i].visible, TOL);
    assert_non_null(m);
    /* cairo_clip(plot) was in force (cairo docs). cairo 1.16's PDF surface writes it
     * narrowed to the bar's extents ("225 60 30 190 re W n" in its output, observed), so
     * the chain's box lies inside plot and still cuts the bar where plot does. */
    assert_non_null(m->clip);
    pp_rect c = cu_clip_bbox(m->clip);
    assert_true(pp_rect_contains(plot, c, TOL));
    assert_true(pp_rect_height(c) < pp_rect_height(cu_path_bbox(m->path)) - 10);
  }
  /* Drawn after cairo_restore: the unclipped bars must carry no clip narrower than the page. */
  const pp_mark *m = cu_find_fill(s, bars[0].visible, TOL);
  assert_non_null(m);
  assert_true(pp_rect_contains(cu_clip_bbox(m->clip), (pp_rect){0, 0, PAGE_W, PAGE_H}, TOL));
}

static void test_fill_preserve_stroke(void **state) {
  (void)state;
  g_autoptr(pp_scene) s = cu_capture(chart_pdf, 0);
  assert_non_null(s);
  /* Six fills were drawn and nothing else fills: cairo's PDF surface paints no background
   * (cairo docs: surfaces start transparent). */
  assert_int_equal(cu_count_kind(s, PP_MARK_FILL), G_N_ELEMENTS(bars));
  assert_int_equal(cu_count_kind(s, PP_MARK_STROKE), 1);
  for (guint i = 0; i < s->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(s->marks, i);
    if (m->kind != PP_MARK_STROKE)
      continue;
    /* cairo_set_line_width(2) on an unscaled context: 2 pt pen. */
    assert_float_equal(m->line_width, 2.0, 1e-6);
    assert_true(cu_rect_near(cu_path_bbox(m->path), bars[1].drawn, TOL));
    assert_float_equal(m->paint.r, 0, 1e-6);
    /* The stroke follows its fill in paint order (the order of the cairo calls). */
    const pp_mark *f = cu_find_fill(s, bars[1].visible, TOL);
    assert_non_null(f);
    assert_true(f->index < m->index);
    /* cairo_set_source_rgb(0.9, 0.1, 0.1); PDF stores 0.9 0.1 0.1 rg (1e-3 for rounding). */
    assert_float_equal(f->paint.r, 0.9, 1e-3);
    assert_float_equal(f->paint.g, 0.1, 1e-3);
  }
}

static void test_text_words(void **state) {
  (void)state;
  g_autoptr(pp_scene) s = cu_capture(chart_pdf, 0);
  assert_non_null(s);
  /* Positions from cairo_text_extents of the same strings; 4 pt because poppler's box is
   * the font's ascent..descent, not the ink box (common practice, no source). */
  if (!cu_find_word(s, "400", label_centre[0].x, label_centre[0].y, 4) ||
      !cu_find_word(s, "2019", label_centre[1].x, label_centre[1].y, 4)) {
    cu_dump_scene(s);
    fail_msg("tick-label words not found near their cairo positions");
  }
  /* Seven glyphs were shown by cairo_show_text("400") and ("2019"). */
  guint glyphs = 0;
  for (guint i = 0; i < s->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(s->marks, i);
    if (m->kind == PP_MARK_GLYPHS) {
      glyphs += m->glyph_count;
      /* cairo_set_font_size(12) (cairo docs: em size in user units). */
      assert_float_equal(m->font_size, 12.0, 0.01);
    }
  }
  assert_int_equal(glyphs, 7);
}

/* capture.h: to_pdf maps page points to PDF user space. cairo writes its y-down page with
 * "1 0 0 -1 0 H cm" (cairo-pdf-surface.c, from memory); ISO 32000-1 §8.3.2.3 puts the default
 * user space origin at the lower left, so a top-left page point (x, y) is PDF (x, H − y). */
static void test_to_pdf_cairo(void **state) {
  (void)state;
  g_autoptr(pp_scene) s = cu_capture(chart_pdf, 0);
  assert_non_null(s);
  pp_point p = pp_matrix_apply(s->to_pdf, (pp_point){50, 100.25});
  assert_float_equal(p.x, 50, 1e-9);
  assert_float_equal(p.y, PAGE_H - 100.25, 1e-9);
}

/* A hand-written page whose MediaBox does not start at 0 and whose content uses PDF
 * coordinates directly: "x y w h re" (ISO 32000-1 §8.5.2.1, Table 59). */
static void check_re_page(const char *media_box, const char *extra, double pw, double ph,
                          int rotation) {
  char *path = g_build_filename(scratch, "re.pdf", NULL);
  assert_true(cu_write_pdf(path, media_box, extra, "0 0 1 rg 130 160 40 90 re f"));
  g_autoptr(pp_scene) s = cu_capture(path, 0);
  g_free(path);
  assert_non_null(s);
  assert_float_equal(s->width, pw, 1e-9);
  assert_float_equal(s->height, ph, 1e-9);
  assert_int_equal(s->rotation, rotation);
  assert_int_equal(cu_count_kind(s, PP_MARK_FILL), 1);
  const pp_mark *m = g_ptr_array_index(s->marks, 0);
  pp_rect pdf = pp_rect_empty();
  for (size_t i = 0; i < m->path->n_segs; i++)
    if (m->path->segs[i].kind != PP_SEG_CLOSE)
      pdf = pp_rect_add_point(pdf, pp_matrix_apply(s->to_pdf, m->path->segs[i].pt[0]));
  if (!cu_rect_near(pdf, (pp_rect){130, 160, 170, 250}, TOL)) {
    cu_dump_scene(s);
    fail_msg("to_pdf gives [%g %g %g %g], drawn at 130 160 40 90 re", pdf.x0, pdf.y0, pdf.x1,
             pdf.y1);
  }
  /* The page-space box of the same rectangle, from the MediaBox origin (100, 150) and
   * ISO 32000-1 §8.3.2.3 (y up) or, rotated, §7.7.3.3 /Rotate 90 = clockwise. */
  pp_rect page = cu_path_bbox(m->path);
  /* ISO 32000-1 §7.7.3.3: /Rotate turns the displayed page clockwise by the angle. With
   * the MediaBox [100 150 500 450] the rectangle x 130..170, y 160..250 shows at: */
  pp_rect want;
  switch (rotation) {
  case 0: want = (pp_rect){30, 450 - 250, 70, 450 - 160}; break;
  case 90: want = (pp_rect){160 - 150, 130 - 100, 250 - 150, 170 - 100}; break;
  case 180: want = (pp_rect){500 - 170, 160 - 150, 500 - 130, 250 - 150}; break;
  default: want = (pp_rect){450 - 250, 500 - 170, 450 - 160, 500 - 130}; break;
  }
  if (!cu_rect_near(page, want, TOL))
    fail_msg("rotation %d: page box [%g %g %g %g]", rotation, page.x0, page.y0, page.x1, page.y1);
}

static void test_to_pdf_offset_media_box(void **state) {
  (void)state;
  check_re_page("100 150 500 450", "", 400, 300, 0);
}

static void test_to_pdf_rotated(void **state) {
  (void)state;
  check_re_page("100 150 500 450", "/Rotate 90", 300, 400, 90);
  check_re_page("100 150 500 450", "/Rotate 180", 400, 300, 180);
  check_re_page("100 150 500 450", "/Rotate 270", 300, 400, 270);
}

static void test_image(void **state) {
  (void)state;
  g_autoptr(pp_scene) s = cu_capture(image_pdf, 0);
  assert_non_null(s);
  if (cu_count_kind(s, PP_MARK_IMAGE) != 1)
    cu_dump_scene(s);
  /* One cairo_paint of one image surface (cairo docs) → one image mark. */
  assert_int_equal(cu_count_kind(s, PP_MARK_IMAGE), 1);
  assert_int_equal(s->n_images, 1);
  const pp_mark *m = NULL;
  for (guint i = 0; i < s->marks->len; i++)
    if (((pp_mark *)g_ptr_array_index(s->marks, i))->kind == PP_MARK_IMAGE)
      m = g_ptr_array_index(s->marks, i);
  /* cairo_image_surface_create(RGB24, 40, 30): 40×30 pixels. */
  assert_int_equal(m->image_width, 40);
  assert_int_equal(m->image_height, 30);
  /* translate(220, 40) then scale(4, 2): 40×30 px → 160×60 pt at (220, 40). */
  pp_rect b = cu_path_bbox(m->path);
  if (!cu_rect_near(b, (pp_rect){220, 40, 380, 100}, TOL))
    fail_msg("image placed at [%g %g %g %g]", b.x0, b.y0, b.x1, b.y1);
  assert_int_equal(cu_count_kind(s, PP_MARK_FILL), 0);
}

static void test_self_test(void **state) {
  (void)state;
  GError *error = NULL;
  gboolean ok = pp_capture_self_test(&error);
  if (!ok)
    fail_msg("self-test: %s", error->message);
  assert_null(error);
  /* Once per process: the second call must give the same verdict. */
  assert_true(pp_capture_self_test(NULL));
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_self_test),
      cmocka_unit_test(test_bars),
      cmocka_unit_test(test_clipped_bars_carry_clip),
      cmocka_unit_test(test_fill_preserve_stroke),
      cmocka_unit_test(test_text_words),
      cmocka_unit_test(test_to_pdf_cairo),
      cmocka_unit_test(test_to_pdf_offset_media_box),
      cmocka_unit_test(test_to_pdf_rotated),
      cmocka_unit_test(test_image),
  };
  return cmocka_run_group_tests(tests, setup, teardown);
}
