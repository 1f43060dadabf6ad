/* test_solids.c — bars drawn as oblique solids by cairo at test time: bars close enough
 * that each one's side and cap go under the next, and a back wall whose gridlines carry
 * the value axis. Ink is checked against cairo's own pixel coverage of what stays visible,
 * values against the numbers the bars were drawn from; never against the recognizer. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <string.h>
#include <unistd.h>

#include <cairo-pdf.h>
#include <cmocka.h>
#include <glib/gstdio.h>

#include "geometry/geometry.h"
#include "recognize/recognize.h"

#include "test_page.h"

#define N_BARS 5
static const double values[N_BARS] = {30, 80, 55, 90, 20};
/* Page geometry: the axis line at AXIS_X, value v at Y0 − v·K; bar i's front from
 * X0 + i·SLOT, W wide. */
#define AXIS_X 70.0
#define Y0 420.0
#define K 3.0
#define X0 80.0
#define SLOT 50.0
#define W 30.0

typedef struct {
  double dx, dy;           /* the caps' depth on the page (x right, y up), pt */
  double wall_dx, wall_dy; /* the wall's offset from the front plane; 0: front axis */
  gboolean bent;           /* each wall gridline and its connector drawn as one polyline */
  gboolean labels_front;   /* tick labels at the connectors' front ends, not on the wall */
} layout;

/* The three faces of bar i, in painting order (front, side, cap), page points. */
static void bar_faces(const layout *l, int i, pp_point f[3][4]) {
  double x0 = X0 + i * SLOT, x1 = x0 + W, yb = Y0, yt = Y0 - values[i] * K;
  double dx = l->dx, dy = l->dy;
  pp_point front[4] = {{x0, yb}, {x1, yb}, {x1, yt}, {x0, yt}};
  pp_point side[4] = {{x1, yb}, {x1 + dx, yb - dy}, {x1 + dx, yt - dy}, {x1, yt}};
  pp_point cap[4] = {{x0, yt}, {x1, yt}, {x1 + dx, yt - dy}, {x0 + dx, yt - dy}};
  memcpy(f[0], front, sizeof front);
  memcpy(f[1], side, sizeof side);
  memcpy(f[2], cap, sizeof cap);
}

static void poly(cairo_t *cr, const pp_point *p) {
  cairo_move_to(cr, p[0].x, p[0].y);
  for (int k = 1; k < 4; k++)
    cairo_line_to(cr, p[k].x, p[k].y);
  cairo_close_path(cr);
}

static void label(cairo_t *cr, double x, double y, const char *s) {
  cairo_text_extents_t te;
  cairo_set_source_rgb(cr, 0, 0, 0);
  cairo_set_font_size(cr, 9);
  cairo_text_extents(cr, s, &te);
  cairo_move_to(cr, x - te.width - te.x_bearing, y + te.height / 2);
  cairo_show_text(cr, s);
}

static void line(cairo_t *cr, double x0, double y0, double x1, double y1) {
  cairo_set_source_rgb(cr, 0.7, 0.7, 0.7);
  cairo_set_line_width(cr, 0.6);
  cairo_move_to(cr, x0, y0);
  cairo_line_to(cr, x1, y1);
  cairo_stroke(cr);
}

static void draw(cairo_t *cr, const layout *l) {
  double right = X0 + N_BARS * SLOT + l->dx + l->wall_dx;
  for (int v = 0; v <= 100; v += 20) {
    double y = Y0 - v * K;
    char buf[16];
    g_snprintf(buf, sizeof buf, "%d", v);
    if (l->wall_dy > 0) { /* floor side to the wall, across the wall */
      if (l->bent) {
        cairo_move_to(cr, AXIS_X, y);
        cairo_line_to(cr, AXIS_X + l->wall_dx, y - l->wall_dy);
        cairo_line_to(cr, right, y - l->wall_dy);
        cairo_stroke(cr);
      } else {
        line(cr, AXIS_X, y, AXIS_X + l->wall_dx, y - l->wall_dy);
        line(cr, AXIS_X + l->wall_dx, y - l->wall_dy, right, y - l->wall_dy);
      }
      label(cr, AXIS_X - 6, l->labels_front ? y : y - l->wall_dy, buf);
    } else {
      line(cr, AXIS_X, y, right, y);
      label(cr, AXIS_X - 6, y, buf);
    }
  }
  static const double shade[3] = {0.35, 0.55, 0.25};
  for (int i = 0; i < N_BARS; i++) {
    pp_point f[3][4];
    bar_faces(l, i, f);
    for (int k = 0; k < 3; k++) {
      cairo_set_source_rgb(cr, 0.1, shade[k], 0.6);
      poly(cr, f[k]);
      cairo_fill(cr);
    }
  }
}

/* cairo's coverage of face k of bar i less every face painted after it (cleared with
 * CAIRO_OPERATOR_CLEAR), at 4 pixels a point: the visible ink by pixel count. */
static double visible_by_pixels(const layout *l, int i, int k) {
  cairo_surface_t *s = cairo_image_surface_create(CAIRO_FORMAT_A8, 600 * 4, 500 * 4);
  cairo_t *cr = cairo_create(s);
  cairo_scale(cr, 4, 4);
  pp_point f[3][4];
  bar_faces(l, i, f);
  poly(cr, f[k]);
  cairo_fill(cr);
  cairo_set_operator(cr, CAIRO_OPERATOR_CLEAR);
  for (int j = i; j < N_BARS; j++) {
    bar_faces(l, j, f);
    for (int m = j == i ? k + 1 : 0; m < 3; m++) {
      poly(cr, f[m]);
      cairo_fill(cr);
    }
  }
  cairo_surface_flush(s);
  const unsigned char *data = cairo_image_surface_get_data(s);
  int stride = cairo_image_surface_get_stride(s);
  double sum = 0;
  for (int y = 0; y < 500 * 4; y++)
    for (int x = 0; x < 600 * 4; x++)
      sum += data[y * stride + x] / 255.0;
  cairo_destroy(cr);
  cairo_surface_destroy(s);
  return sum / 16;
}

typedef pp_test_page page;

typedef struct {
  void (*draw)(cairo_t *, const layout *);
  const layout *l;
} drawing;

static void call_drawing(cairo_t *cr, const void *d) {
  const drawing *dr = d;
  dr->draw(cr, dr->l);
}

static page recognise_with(void (*drawer)(cairo_t *, const layout *), const layout *l) {
  drawing d = {drawer, l};
  return pp_test_page_draw(call_drawing, &d);
}

static page recognise(const layout *l) {
  return recognise_with(draw, l);
}

static void page_free(page *p) {
  pp_test_page_clear(p);
}

static const pp_figure *only_bar_3d(const page *p) {
  const pp_figure *found = NULL;
  for (guint i = 0; i < p->charts->figures->len; i++) {
    const pp_figure *f = g_ptr_array_index(p->charts->figures, i);
    if (f->kind == PP_FIGURE_BAR_3D) {
      assert_null(found);
      found = f;
    }
  }
  assert_non_null(found);
  assert_int_equal(found->elements->len, N_BARS);
  return found;
}

/* Pixel counts at 4 px/pt with antialiased edges agree with exact areas within a few
 * hundredths of a pt² per pt of edge (measured in tests/geometry/test_raster.c's way);
 * 0.5% covers faces of a few hundred pt² (common practice, no source). */
#define PIXEL_SHARE 0.005

/* Caps 28 pt deep across gaps of 20 pt: each bar's side and cap go under the next bar's
 * front (and cap, where the next is lower). The ink is what cairo leaves visible. */
static void test_overlapping_oblique(void **state) {
  (void)state;
  const layout l = {28, 12, 0, 0, FALSE, FALSE};
  page p = recognise(&l);
  const pp_figure *fig = only_bar_3d(&p);
  static const pp_part_role roles[3] = {PP_PART_FRONT, PP_PART_SIDE, PP_PART_CAP};
  double hidden_most = 0;
  for (int i = 0; i < N_BARS; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    /* value: the number the bar was drawn from (front-plane axis) */
    assert_true(fabs(e->value - values[i]) <= 0.005 * values[i]);
    double total = 0, drawn = 0;
    pp_point f[3][4];
    bar_faces(&l, i, f);
    for (int k = 0; k < 3; k++) {
      double seen = visible_by_pixels(&l, i, k); /* source: cairo pixel coverage */
      total += seen;
      drawn += pp_polygon_area(f[k], 4); /* shoelace, textbook */
      double got = pp_element_ink_of(e, roles[k]);
      if (fabs(got - seen) > PIXEL_SHARE * fmax(seen, 100))
        fail_msg("bar %d face %d: ink %.2f, cairo %.2f", i, k, got, seen);
    }
    assert_true(fabs(e->ink - total) <= PIXEL_SHARE * total);
    hidden_most = fmax(hidden_most, 1 - total / drawn);
  }
  /* the case is one where hiding matters: a bar loses over 5% of its drawn ink */
  assert_true(hidden_most > 0.05);
  page_free(&p);
}

/* Tick labels on a back wall three times as deep as the caps: the wall's gridlines, joined
 * to the front plane by slanted ones, say where a bar's top meets the axis plane. Reading
 * by the caps' depth would be off by 2·12 pt = 8 units. Drawn as separate lines, as bent
 * polylines, and with the labels at the front ends instead (then the front plane). */
static void check_wall(const layout *l) {
  page p = recognise(l);
  const pp_figure *fig = only_bar_3d(&p);
  for (int i = 0; i < N_BARS; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    /* source: the numbers the bars were drawn from */
    if (fabs(e->value - values[i]) > 0.005 * values[i])
      fail_msg("bar %d: value %.3f, drawn %.0f", i, e->value, values[i]);
    assert_true(fabs(e->base_value) <= 0.1);
  }
  page_free(&p);
}

static void test_wall_gridlines(void **state) {
  (void)state;
  const layout lines = {12, 12, 36, 36, FALSE, FALSE}, bent = {12, 12, 36, 36, TRUE, FALSE},
               front = {12, 12, 36, 36, TRUE, TRUE};
  check_wall(&lines);
  check_wall(&bent);
  check_wall(&front);
}

/* ---- cylinders: a body (front rectangle and the lower half of the base ellipse) and a
 * top ellipse painted over the body's top edge ---------------------------------------- */
#define CYL_RY 8.0

static void cyl_body(cairo_t *cr, int i) {
  double x0 = X0 + i * SLOT, x1 = x0 + W, yt = Y0 - values[i] * K;
  cairo_move_to(cr, x0, yt);
  cairo_line_to(cr, x0, Y0);
  cairo_save(cr);
  cairo_translate(cr, (x0 + x1) / 2, Y0);
  cairo_scale(cr, W / 2, CYL_RY);
  cairo_arc_negative(cr, 0, 0, 1, G_PI, 0);
  cairo_restore(cr);
  cairo_line_to(cr, x1, yt);
  cairo_close_path(cr);
}

static void cyl_top(cairo_t *cr, int i) {
  double x0 = X0 + i * SLOT, yt = Y0 - values[i] * K;
  cairo_new_sub_path(cr);
  cairo_save(cr);
  cairo_translate(cr, x0 + W / 2, yt);
  cairo_scale(cr, W / 2, CYL_RY);
  cairo_arc(cr, 0, 0, 1, 0, 2 * G_PI);
  cairo_restore(cr);
  cairo_close_path(cr);
}

static void draw_cylinders(cairo_t *cr) {
  for (int v = 0; v <= 100; v += 20) {
    char buf[16];
    g_snprintf(buf, sizeof buf, "%d", v);
    line(cr, AXIS_X, Y0 - v * K, X0 + N_BARS * SLOT, Y0 - v * K);
    label(cr, AXIS_X - 6, Y0 - v * K, buf);
  }
  for (int i = 0; i < N_BARS; i++) {
    cairo_set_source_rgb(cr, 0.1, 0.35, 0.6);
    cyl_body(cr, i);
    cairo_fill(cr);
    cairo_set_source_rgb(cr, 0.1, 0.55, 0.6);
    cyl_top(cr, i);
    cairo_fill(cr);
  }
}

/* cairo's coverage of cylinder i's body and top together (the top cleared over nothing
 * else: neighbours do not meet), and of its body alone less the top. */
static double cyl_pixels(int i, gboolean body_only) {
  cairo_surface_t *s = cairo_image_surface_create(CAIRO_FORMAT_A8, 600 * 4, 500 * 4);
  cairo_t *cr = cairo_create(s);
  cairo_scale(cr, 4, 4);
  cyl_body(cr, i);
  cairo_fill(cr);
  if (body_only)
    cairo_set_operator(cr, CAIRO_OPERATOR_CLEAR);
  cyl_top(cr, i);
  cairo_fill(cr);
  cairo_surface_flush(s);
  const unsigned char *data = cairo_image_surface_get_data(s);
  int stride = cairo_image_surface_get_stride(s);
  double sum = 0;
  for (int y = 0; y < 500 * 4; y++)
    for (int x = 0; x < 600 * 4; x++)
      sum += data[y * stride + x] / 255.0;
  cairo_destroy(cr);
  cairo_surface_destroy(s);
  return sum / 16;
}

static void draw_cylinders_layout(cairo_t *cr, const layout *l) {
  (void)l;
  draw_cylinders(cr);
}

/* The top ellipse covers the body's top edge: a bar's ink is body and top as cairo shows
 * them, not their sum (which counts half the ellipse twice). */
static void test_cylinders(void **state) {
  (void)state;
  page p = recognise_with(draw_cylinders_layout, NULL);
  const pp_figure *fig = only_bar_3d(&p);
  for (int i = 0; i < N_BARS; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    assert_true(fabs(e->value - values[i]) <= 0.005 * values[i]);
    double total = cyl_pixels(i, FALSE), body = cyl_pixels(i, TRUE); /* cairo pixel counts */
    if (fabs(e->ink - total) > PIXEL_SHARE * total)
      fail_msg("cylinder %d: ink %.2f, cairo %.2f", i, e->ink, total);
    /* the body's parts (front and bulge) are what cairo leaves of it under the top */
    const pp_part *p0 = &g_array_index(e->parts, pp_part, 0);
    double seen = 0;
    for (guint k = 0; k < e->parts->len; k++)
      if (g_array_index(e->parts, pp_part, k).mark == p0->mark)
        seen += g_array_index(e->parts, pp_part, k).ink;
    if (fabs(seen - body) > PIXEL_SHARE * body)
      fail_msg("cylinder %d: body ink %.2f, cairo %.2f", i, seen, body);
  }
  page_free(&p);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_overlapping_oblique),
      cmocka_unit_test(test_wall_gridlines),
      cmocka_unit_test(test_cylinders),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
