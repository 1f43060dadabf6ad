/* test_matplotlib.c — capture of bar charts made at test time by matplotlib (make_matplotlib.py),
 * with Type 3 (pdf.fonttype 3) and TrueType (42) text. The expected rectangles come from
 * matplotlib's own window extents, not from the capture code. */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>
#include <json-glib/json-glib.h>

#include "capture_util.h"

#define TOL 0.01 /* the tolerance for bar rectangles */
#define TEXT_TOL                                                                                   \
  4.0 /* pt; poppler's word box is ascent..descent, matplotlib's the text                          \
       * extent (common practice, no source) */

static char *scratch;

static pp_rect json_rect(JsonArray *a) {
  return (pp_rect){json_array_get_double_element(a, 0), json_array_get_double_element(a, 1),
                   json_array_get_double_element(a, 2), json_array_get_double_element(a, 3)};
}

#ifdef CU_PYTHON3
static const char *python3_path = CU_PYTHON3;
#else
static const char *python3_path = NULL;
#endif

static gboolean have_matplotlib(void) {
  const char *argv[] = {python3_path, "-c", "import matplotlib", NULL};
  return python3_path && cu_run(argv);
}

static void check_fonttype(const char *fonttype) {
  if (!have_matplotlib()) {
    print_message("skipped: /usr/bin/python3 with matplotlib (python3-matplotlib) is not "
                  "available\n");
    skip();
  }
  char *pdf = g_strdup_printf("%s/mpl%s.pdf", scratch, fonttype);
  char *json = g_strdup_printf("%s/mpl%s.json", scratch, fonttype);
  const char *argv[] = {python3_path, CU_SRCDIR "/make_matplotlib.py", pdf, json, fonttype, NULL};
  assert_true(cu_run(argv));

  g_autoptr(JsonParser) parser = json_parser_new();
  GError *error = NULL;
  if (!json_parser_load_from_file(parser, json, &error))
    fail_msg("%s: %s", json, error->message);
  JsonObject *root = json_node_get_object(json_parser_get_root(parser));
  g_autoptr(pp_scene) s = cu_capture(pdf, 0);
  assert_non_null(s);

  /* Page size: figsize (6, 4) in at 72 pt/in, as matplotlib reports fig.bbox. */
  JsonArray *page = json_object_get_array_member(root, "page");
  assert_float_equal(s->width, json_array_get_double_element(page, 0), 1e-6);
  assert_float_equal(s->height, json_array_get_double_element(page, 1), 1e-6);

  /* Every bar: path box = matplotlib's patch extent, path ∩ clip = extent ∩ axes box. */
  JsonArray *bars = json_object_get_array_member(root, "bars");
  guint n_bars = json_array_get_length(bars);
  assert_int_equal(n_bars, 8);
  for (guint i = 0; i < n_bars; i++) {
    JsonObject *b = json_array_get_object_element(bars, i);
    pp_rect full = json_rect(json_object_get_array_member(b, "full"));
    pp_rect visible = json_rect(json_object_get_array_member(b, "visible"));
    const pp_mark *m = cu_find_fill(s, visible, TOL);
    if (!m) {
      cu_dump_scene(s);
      fail_msg("fonttype %s bar %u: no fill whose path ∩ clip is [%g %g %g %g]", fonttype, i,
               visible.x0, visible.y0, visible.x1, visible.y1);
    }
    pp_rect got = cu_path_bbox(m->path);
    if (!cu_rect_near(got, full, TOL))
      fail_msg("fonttype %s bar %u: path box off by %g pt", fonttype, i, cu_rect_diff(got, full));
    /* Truncated axes (set_ylim(400, …), set_xlim(50, …)): every bar must really be cut. */
    assert_true(pp_rect_area(visible) < pp_rect_area(full) - 1);
    assert_non_null(m->clip);
  }

  /* Fills with area: the bars plus the figure and axes backgrounds (counted by the script
   * from matplotlib's artists). Tick marks are 2-point marker paths painted with fill and
   * stroke (observed in matplotlib's PDF output), so they have no area and are left out.
   * A Type 3 glyph procedure leaking onto the page would add fills here. */
  guint n_fills = 0;
  for (guint i = 0; i < s->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(s->marks, i);
    if (m->kind == PP_MARK_FILL && pp_rect_area(cu_path_bbox(m->path)) > 0.01)
      n_fills++;
  }
  guint others = (guint)json_object_get_int_member(root, "other_fills");
  if (n_fills != n_bars + others)
    cu_dump_scene(s);
  assert_int_equal(n_fills, n_bars + others);

  /* And no fill with area sits inside a word box, where glyph outlines would be (tick
   * marks are excluded again: with Type 3 fonts poppler's word boxes reach the ticks). */
  for (guint i = 0; i < s->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(s->marks, i);
    if (m->kind != PP_MARK_FILL || pp_rect_area(cu_path_bbox(m->path)) <= 0.01)
      continue;
    for (guint k = 0; k < s->words->len; k++) {
      const pp_text_run *w = g_ptr_array_index(s->words, k);
      if (pp_rect_contains(w->box, cu_path_bbox(m->path), 0))
        fail_msg("fonttype %s: fill #%u lies inside word '%s'", fonttype, m->index, w->text);
    }
  }

  /* Glyph runs keep the font size: rcParams font.size (reported by the script). */
  double font_size = json_object_get_double_member(root, "font_size");
  guint n_glyph_marks = 0;
  for (guint i = 0; i < s->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(s->marks, i);
    if (m->kind == PP_MARK_GLYPHS) {
      n_glyph_marks++;
      assert_float_equal(m->font_size, font_size, 0.01);
    }
  }
  assert_true(n_glyph_marks > 0);

  /* Tick labels as words, centred where matplotlib put their text extents. */
  JsonArray *ticks = json_object_get_array_member(root, "ticks");
  assert_int_equal(json_array_get_length(ticks), 16);
  for (guint i = 0; i < json_array_get_length(ticks); i++) {
    JsonObject *t = json_array_get_object_element(ticks, i);
    const char *text = json_object_get_string_member(t, "text");
    JsonArray *c = json_object_get_array_member(t, "centre");
    double cx = json_array_get_double_element(c, 0), cy = json_array_get_double_element(c, 1);
    if (!cu_find_word(s, text, cx, cy, TEXT_TOL)) {
      cu_dump_scene(s);
      fail_msg("fonttype %s: no word '%s' near (%g, %g)", fonttype, text, cx, cy);
    }
  }
  g_free(pdf);
  g_free(json);
}

static void test_fonttype3(void **state) {
  (void)state;
  check_fonttype("3");
}

static void test_fonttype42(void **state) {
  (void)state;
  check_fonttype("42");
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
      cmocka_unit_test(test_fonttype3),
      cmocka_unit_test(test_fonttype42),
  };
  int failed = cmocka_run_group_tests(tests, setup, teardown);
  return failed ? failed : have_matplotlib() ? 0 : 77; /* 77: meson's "skipped" */
}
