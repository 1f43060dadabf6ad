/* test_gnuplot.c — capture of a bar chart made at test time by gnuplot's pdfcairo terminal
 * with a truncated y range. Expected boxes come from the data and the plot box gnuplot
 * reports (GPVAL_TERM_*), not from the capture code. */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "capture_util.h"

#define TOL 0.01     /* the tolerance for bar rectangles */
#define PAGE_W 360.0 /* size 5in,3in at 72 pt/in */
#define PAGE_H 216.0

/* Invented: Quillmere Bakery loaves sold (thousands) per year; y range cut at 400. */
static const double xs[] = {1, 2, 3, 4, 5}, ys[] = {420, 445, 460, 480, 510};
static const char *years[] = {"2019", "2020", "2021", "2022", "2023"};
#define X_MIN 0.0
#define X_MAX 6.0
#define Y_MIN 400.0
#define Y_MAX 560.0
#define BOX_W 0.5

static const char script[] =
    "set terminal pdfcairo size 5in,3in font 'Sans,10'\n"
    "set output '%s'\n"
    "set lmargin at screen 50.0/360\n"
    "set rmargin at screen 350.0/360\n"
    "set bmargin at screen 36.0/216\n"
    "set tmargin at screen 196.0/216\n"
    "set xrange [0:6]\n"
    "set yrange [400:560]\n"
    "set ytics 400,40,560\n"
    "set xtics (\"2019\" 1, \"2020\" 2, \"2021\" 3, \"2022\" 4, \"2023\" 5)\n"
    "set boxwidth 0.5 absolute\n"
    "set style fill solid 1.0 noborder\n"
    "unset key\n"
    "$data << EOD\n1 420\n2 445\n3 460\n4 480\n5 510\nEOD\n"
    "plot $data using 1:2 with boxes lc rgb '#3a6ea5'\n"
    "set print '%s'\n"
    "print GPVAL_TERM_XMIN, GPVAL_TERM_XMAX, GPVAL_TERM_YMIN, GPVAL_TERM_YMAX\n";

static char *scratch;

/* gnuplot's plot box in its terminal units (points, y up), as it reports after plotting. */
static double term_x0, term_x1, term_y0, term_y1;

/* Terminal → page points. gnuplot's cairo terminals span 0 .. size−1 pt and draw at pixel
 * centres, +0.5 (gnuplot 5.4 behaviour, from memory of gp_cairo.c; it is what gnuplot's own
 * output shows: XMIN 49.86, YMAX 195.085 become the border "50.359 20.414 … re"). */
static double page_x(double tx) {
  return tx + 0.5;
}
static double page_y(double ty) {
  return (PAGE_H - 1) - ty + 0.5;
}

static double map_x(double x) {
  return page_x(term_x0 + (x - X_MIN) / (X_MAX - X_MIN) * (term_x1 - term_x0));
}
static double map_y(double y) {
  return page_y(term_y0 + (y - Y_MIN) / (Y_MAX - Y_MIN) * (term_y1 - term_y0));
}

#ifdef CU_GNUPLOT
static const char *gnuplot_path = CU_GNUPLOT;
#else
static const char *gnuplot_path = NULL;
#endif

static void test_gnuplot_boxes(void **state) {
  (void)state;
  if (!gnuplot_path) {
    print_message("skipped: gnuplot is not installed\n");
    skip();
  }
  char *pdf = g_build_filename(scratch, "gnuplot.pdf", NULL);
  char *box = g_build_filename(scratch, "box.txt", NULL);
  char *gp = g_build_filename(scratch, "chart.gp", NULL);
  char *text = g_strdup_printf(script, pdf, box);
  assert_true(g_file_set_contents(gp, text, -1, NULL));
  const char *argv[] = {gnuplot_path, gp, NULL};
  assert_true(cu_run(argv));
  char *reported = NULL;
  assert_true(g_file_get_contents(box, &reported, NULL, NULL));
  assert_int_equal(sscanf(reported, "%lf %lf %lf %lf", &term_x0, &term_x1, &term_y0, &term_y1), 4);

  /* The reported box is the one asked for with "margin at screen" (50..350 × 20..180 pt
   * from the top), to within gnuplot's one-point-smaller screen and half-point offset. */
  assert_float_equal(map_x(X_MIN), 50, 0.6);
  assert_float_equal(map_x(X_MAX), 350, 0.6);
  assert_float_equal(map_y(Y_MAX), PAGE_H - 196, 0.6);
  assert_float_equal(map_y(Y_MIN), PAGE_H - 36, 0.6);

  g_autoptr(pp_scene) s = cu_capture(pdf, 0);
  assert_non_null(s);
  assert_float_equal(s->width, PAGE_W, 1e-6);
  assert_float_equal(s->height, PAGE_H, 1e-6);

  /* "with boxes": x ± boxwidth/2, from y = 0 to the value (gnuplot docs, "boxes"); the
   * y range starts at 400, so the visible box starts at the plot bottom. */
  pp_rect plot = {map_x(X_MIN), map_y(Y_MAX), map_x(X_MAX), map_y(Y_MIN)};
  for (size_t i = 0; i < G_N_ELEMENTS(xs); i++) {
    pp_rect want = {map_x(xs[i] - BOX_W / 2), map_y(ys[i]), map_x(xs[i] + BOX_W / 2), map_y(Y_MIN)};
    const pp_mark *m = cu_find_fill(s, want, TOL);
    if (!m) {
      cu_dump_scene(s);
      fail_msg("box %zu: no fill whose path ∩ clip is [%.3f %.3f %.3f %.3f]", i, want.x0, want.y0,
               want.x1, want.y1);
    }
    /* The truncation is real: the full box would reach y = 0, far below the plot. */
    assert_true(map_y(0) > plot.y1 + 100);
    assert_true(pp_rect_contains(plot, cu_visible_bbox(m), TOL));
  }
  /* Nothing else is filled in this plot: border, tics are lines, labels are text. */
  assert_int_equal(cu_count_kind(s, PP_MARK_FILL), G_N_ELEMENTS(xs));

  /* Tick labels: x labels centred under their tic (gnuplot docs "xtics": centred by
   * default), y labels right-justified beside theirs and vertically centred. 3 pt slack
   * for poppler's ascent..descent boxes (common practice, no source). */
  for (size_t i = 0; i < G_N_ELEMENTS(xs); i++) {
    const pp_text_run *w = NULL;
    for (guint k = 0; k < s->words->len && !w; k++) {
      const pp_text_run *c = g_ptr_array_index(s->words, k);
      if (g_strcmp0(c->text, years[i]) == 0)
        w = c;
    }
    assert_non_null(w);
    assert_float_equal((w->box.x0 + w->box.x1) / 2, map_x(xs[i]), 3);
    assert_true(w->box.y0 >= plot.y1 - 1 && w->box.y1 <= plot.y1 + 20);
  }
  for (int v = 400; v <= 560; v += 40) {
    char label[8];
    g_snprintf(label, sizeof label, "%d", v);
    const pp_text_run *w = NULL;
    for (guint k = 0; k < s->words->len && !w; k++) {
      const pp_text_run *c = g_ptr_array_index(s->words, k);
      if (g_strcmp0(c->text, label) == 0)
        w = c;
    }
    if (!w) {
      cu_dump_scene(s);
      fail_msg("no word '%s'", label);
    }
    assert_float_equal((w->box.y0 + w->box.y1) / 2, map_y(v), 3);
    assert_true(w->box.x1 <= plot.x0 && w->box.x1 >= plot.x0 - 20);
  }
  g_free(reported);
  g_free(text);
  g_free(gp);
  g_free(box);
  g_free(pdf);
}

static int setup(void **state) {
  (void)state;
  scratch = cu_scratch_new();
  return 0;
}

static int teardown(void **state) {
  (void)state;
  cu_scratch_free(scratch);
  return 0;
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_gnuplot_boxes),
  };
  int failed = cmocka_run_group_tests(tests, setup, teardown);
  return failed ? failed : gnuplot_path ? 0 : 77; /* 77: meson's "skipped" */
}
