/* test_box_persp.c — 3D bars seen in perspective (the box-bars recognizer's perspective
 * half): cairo draws, through a pinhole camera this file defines, a floor, two walls, a
 * value scale on a vertical edge and boxes of known values. Values and ink are checked
 * against the drawing: the camera's own projection and the shoelace areas of the faces it
 * shows (textbook back-face test), never against the recognizer. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cairo-pdf.h>
#include <cmocka.h>
#include <glib/gstdio.h>

#include "geometry/geometry.h"
#include "recognize/recognize.h"

#include "test_page.h"

/* World: x 0..4, y 0..2 on the floor, z up; value v stands at z = v · Z_PER_VALUE. */
#define Z_PER_VALUE 0.03
static const double eye[3] = {7, -6, 5}, target[3] = {2, 1, 1.2};
static const double bar_x[] = {0.3, 1.3, 2.3, 3.3}, bar_v[] = {20, 45, 70, 90};
#define BAR_W 0.35
#define BAR_Y0 0.5
#define BAR_D 0.35
#define N_BARS 4

typedef struct {
  double r[3], u[3], f[3];
} camera;

static void cross(const double *a, const double *b, double *o) {
  o[0] = a[1] * b[2] - a[2] * b[1], o[1] = a[2] * b[0] - a[0] * b[2],
  o[2] = a[0] * b[1] - a[1] * b[0];
}
static void unit(double *a) {
  double n = sqrt(a[0] * a[0] + a[1] * a[1] + a[2] * a[2]);
  a[0] /= n, a[1] /= n, a[2] /= n;
}
static double dot(const double *a, const double *b) {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

static camera cam(void) {
  camera c;
  const double up[3] = {0, 0, 1};
  for (int k = 0; k < 3; k++)
    c.f[k] = target[k] - eye[k];
  unit(c.f);
  cross(c.f, up, c.r);
  unit(c.r);
  cross(c.r, c.f, c.u);
  return c;
}

/* Pinhole projection onto the page (y down), focal 380 pt, centred at (300, 420). */
static pp_point project(const double *x) {
  camera c = cam();
  double d[3] = {x[0] - eye[0], x[1] - eye[1], x[2] - eye[2]};
  double zc = dot(d, c.f);
  return (pp_point){300 + 380 * dot(d, c.r) / zc, 420 - 380 * dot(d, c.u) / zc};
}

static void quad(cairo_t *cr, const double (*p)[3], double grey) {
  cairo_set_source_rgb(cr, grey * 0.3, grey * 0.5, grey);
  for (int k = 0; k < 4; k++) {
    pp_point q = project(p[k]);
    k ? cairo_line_to(cr, q.x, q.y) : cairo_move_to(cr, q.x, q.y);
  }
  cairo_close_path(cr);
  cairo_fill(cr);
}

/* The six faces of a box, each with its outward normal. */
static void box_faces(double x0, double y0, double z1, double f[6][4][3], double n[6][3]) {
  double x1 = x0 + BAR_W, y1 = y0 + BAR_D;
  double c[8][3] = {{x0, y0, 0},  {x1, y0, 0},  {x1, y1, 0},  {x0, y1, 0},
                    {x0, y0, z1}, {x1, y0, z1}, {x1, y1, z1}, {x0, y1, z1}};
  static const int idx[6][4] = {{0, 3, 2, 1}, {4, 5, 6, 7}, {0, 1, 5, 4},
                                {1, 2, 6, 5}, {2, 3, 7, 6}, {3, 0, 4, 7}};
  static const double nn[6][3] = {{0, 0, -1}, {0, 0, 1}, {0, -1, 0},
                                  {1, 0, 0},  {0, 1, 0}, {-1, 0, 0}};
  for (int i = 0; i < 6; i++) {
    for (int k = 0; k < 4; k++)
      for (int j = 0; j < 3; j++)
        f[i][k][j] = c[idx[i][k]][j];
    for (int j = 0; j < 3; j++)
      n[i][j] = nn[i][j];
  }
}

/* A face is seen when the eye is on its outward side (back-face test, textbook). */
static gboolean seen(const double (*f)[3], const double *n) {
  double d[3] = {eye[0] - f[0][0], eye[1] - f[0][1], eye[2] - f[0][2]};
  return dot(d, n) > 0;
}

static double page_area(const double (*f)[3]) {
  pp_point p[4];
  for (int k = 0; k < 4; k++)
    p[k] = project(f[k]);
  double s = 0;
  for (int k = 0; k < 4; k++)
    s += p[k].x * p[(k + 1) % 4].y - p[(k + 1) % 4].x * p[k].y;
  return fabs(s) / 2;
}

static void draw(cairo_t *cr) {
  /* floor and the walls at y = 2 and x = 0; the walls reach z = 3 (value 100) */
  const double floor_[4][3] = {{0, 0, 0}, {4, 0, 0}, {4, 2, 0}, {0, 2, 0}};
  const double back[4][3] = {{0, 2, 0}, {4, 2, 0}, {4, 2, 3}, {0, 2, 3}};
  const double left[4][3] = {{0, 0, 0}, {0, 2, 0}, {0, 2, 3}, {0, 0, 3}};
  quad(cr, floor_, 0.95), quad(cr, back, 0.9), quad(cr, left, 0.92);
  /* the value scale on the back wall's right edge (x = 4, y = 2): ticks across it */
  cairo_set_line_width(cr, 0.8);
  cairo_set_font_size(cr, 9);
  for (int v = 0; v <= 100; v += 20) {
    double z = v * Z_PER_VALUE, a[3] = {3.95, 2, z}, b[3] = {4.12, 2, z};
    pp_point p = project(a), q = project(b);
    cairo_set_source_rgb(cr, 0, 0, 0);
    cairo_move_to(cr, p.x, p.y);
    cairo_line_to(cr, q.x, q.y);
    cairo_stroke(cr);
    char buf[8];
    g_snprintf(buf, sizeof buf, "%d", v);
    cairo_move_to(cr, q.x + 4, q.y + 3);
    cairo_show_text(cr, buf);
  }
  /* the bars, farthest first (they stand apart: none hides another); each box's hidden
   * faces first, as 3D plotting programs paint them */
  for (int i = 0; i < N_BARS; i++) {
    double f[6][4][3], n[6][3];
    box_faces(bar_x[i], BAR_Y0, bar_v[i] * Z_PER_VALUE, f, n);
    for (int pass = 0; pass < 2; pass++)
      for (int k = 0; k < 6; k++)
        if (seen((const double(*)[3])f[k], n[k]) == pass)
          quad(cr, (const double(*)[3])f[k], k == 1 ? 0.8 : 0.6);
  }
}

static void draw_page(cairo_t *cr, const void *unused) {
  (void)unused;
  draw(cr);
}

static void test_perspective_bars(void **state) {
  (void)state;
  pp_test_page page = pp_test_page_draw(draw_page, NULL);
  const pp_page_charts *charts = page.charts;
  const pp_figure *fig = NULL;
  for (guint i = 0; i < charts->figures->len; i++) {
    const pp_figure *f = g_ptr_array_index(charts->figures, i);
    if (f->kind == PP_FIGURE_BAR_3D) {
      assert_null(fig);
      fig = f;
    }
  }
  assert_non_null(fig);
  assert_string_equal(fig->recognizer, "box-bars");
  assert_int_equal(fig->projection.kind, PP_PROJECTION_PERSPECTIVE);
  assert_int_equal(fig->elements->len, N_BARS);
  for (int i = 0; i < N_BARS; i++) {
    /* the element standing at bar i: its box holds the bar's projected top centre */
    double top[3] = {bar_x[i] + BAR_W / 2, BAR_Y0 + BAR_D / 2, bar_v[i] * Z_PER_VALUE};
    pp_point c = project(top);
    const pp_element *e = NULL;
    for (guint k = 0; k < fig->elements->len; k++) {
      const pp_element *o = &g_array_index(fig->elements, pp_element, k);
      if (c.x >= o->box.x0 && c.x <= o->box.x1 && c.y >= o->box.y0 && c.y <= o->box.y1)
        e = o;
    }
    assert_non_null(e);
    /* the value as drawn (the camera's data); the PDF rounds corners to 1/1000 pt or so */
    assert_float_equal(e->value, bar_v[i], 0.05);
    assert_float_equal(e->base_value, 0, 1e-9);
    /* ink: the shoelace areas of the faces the eye sees (none hidden by another bar) */
    double f[6][4][3], n[6][3], want = 0, cap = 0;
    box_faces(bar_x[i], BAR_Y0, bar_v[i] * Z_PER_VALUE, f, n);
    for (int k = 0; k < 6; k++)
      if (seen((const double(*)[3])f[k], n[k])) {
        want += page_area((const double(*)[3])f[k]);
        cap += k == 1 ? page_area((const double(*)[3])f[k]) : 0;
      }
    assert_float_equal(e->ink, want, 1e-3 * want);
    assert_float_equal(pp_element_ink_of(e, PP_PART_CAP), cap, 1e-3 * cap);
  }
  pp_test_page_clear(&page);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_perspective_bars),
  };
  return cmocka_run_group_tests_name("recognize/box-persp", tests, NULL, NULL);
}
