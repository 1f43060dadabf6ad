/* Layered ridge lines, sky gradients and a ferry silhouette rendered to an
 * RGB24 image surface, then painted scaled into the page. */
#include "demo_photo.h"

#include <math.h>

#include "cairo_rng.h"

typedef struct {
  double sky_top[3], sky_low[3], ridge[3][3], water[3];
  double sun_y;
  gboolean snow, lights;
} palette;

static const palette palettes[] = {
    {{0.35, 0.58, 0.85},
     {0.80, 0.88, 0.95},
     {{0.45, 0.55, 0.62}, {0.25, 0.40, 0.35}, {0.12, 0.25, 0.18}},
     {0.18, 0.36, 0.50},
     0.25,
     FALSE,
     FALSE},
    {{0.20, 0.18, 0.40},
     {0.98, 0.62, 0.35},
     {{0.35, 0.28, 0.42}, {0.22, 0.18, 0.30}, {0.10, 0.08, 0.15}},
     {0.25, 0.20, 0.35},
     0.55,
     FALSE,
     TRUE},
    {{0.55, 0.70, 0.90},
     {0.92, 0.95, 0.98},
     {{0.70, 0.75, 0.82}, {0.50, 0.56, 0.64}, {0.30, 0.36, 0.42}},
     {0.30, 0.42, 0.55},
     0.2,
     TRUE,
     FALSE},
    {{0.50, 0.62, 0.75},
     {0.85, 0.85, 0.82},
     {{0.50, 0.52, 0.55}, {0.40, 0.38, 0.36}, {0.28, 0.24, 0.22}},
     {0.22, 0.30, 0.38},
     0.3,
     FALSE,
     TRUE},
};

static void ridge(cairo_t *cr, pp_gen_rng *rng, int w, double base, double amp, const double *rgb,
                  gboolean snow) {
  int steps = 48;
  double *ys = g_new(double, steps + 1);
  double phase = pp_gen_rng_uniform(rng, 0, 6.28), y = base;
  for (int i = 0; i <= steps; i++) {
    y = base - amp * (0.6 + 0.4 * sin(phase + i * 0.35)) * (0.7 + 0.3 * sin(i * 0.9 + phase * 2)) +
        pp_gen_rng_uniform(rng, -amp * 0.08, amp * 0.08);
    ys[i] = y;
  }
  cairo_move_to(cr, 0, ys[0]);
  for (int i = 1; i <= steps; i++)
    cairo_line_to(cr, (double)w * i / steps, ys[i]);
  cairo_line_to(cr, w, base + amp);
  cairo_line_to(cr, 0, base + amp);
  cairo_close_path(cr);
  cairo_set_source_rgb(cr, rgb[0], rgb[1], rgb[2]);
  cairo_fill(cr);
  if (snow) {
    /* Caps on the peaks: small triangles above the snow line. */
    cairo_set_source_rgb(cr, 0.96, 0.97, 0.99);
    double line = base - amp * 0.75;
    for (int i = 1; i < steps; i++)
      if (ys[i] < line && ys[i] <= ys[i - 1] && ys[i] <= ys[i + 1]) {
        double px = (double)w * i / steps, d = line - ys[i];
        cairo_move_to(cr, px, ys[i]);
        cairo_line_to(cr, px + d * 1.8, line);
        cairo_line_to(cr, px - d * 1.8, line);
        cairo_close_path(cr);
        cairo_fill(cr);
      }
  }
  g_free(ys);
}

static void ferry(cairo_t *cr, double x, double y, double s) {
  cairo_set_source_rgb(cr, 0.95, 0.95, 0.95);
  cairo_move_to(cr, x, y);
  cairo_line_to(cr, x + 60 * s, y);
  cairo_line_to(cr, x + 52 * s, y + 9 * s);
  cairo_line_to(cr, x + 6 * s, y + 9 * s);
  cairo_close_path(cr);
  cairo_fill(cr);
  cairo_rectangle(cr, x + 14 * s, y - 9 * s, 30 * s, 9 * s);
  cairo_fill(cr);
  cairo_set_source_rgb(cr, 0.75, 0.15, 0.12);
  cairo_rectangle(cr, x + 34 * s, y - 16 * s, 6 * s, 7 * s);
  cairo_fill(cr);
  cairo_set_source_rgb(cr, 0.15, 0.2, 0.3);
  for (int i = 0; i < 5; i++) {
    cairo_rectangle(cr, x + (17 + i * 5.5) * s, y - 6 * s, 3 * s, 2.5 * s);
    cairo_fill(cr);
  }
}

void pp_demo_photo_paint(cairo_t *cr, pp_demo_photo kind, guint64 seed, double x, double y,
                         double w, double h, double px_per_pt) {
  const palette *p = &palettes[kind];
  int iw = (int)(w * px_per_pt), ih = (int)(h * px_per_pt);
  pp_gen_rng rng;
  pp_gen_rng_init(&rng, seed);
  cairo_surface_t *img = cairo_image_surface_create(CAIRO_FORMAT_RGB24, iw, ih);
  cairo_t *ic = cairo_create(img);
  double horizon = ih * 0.62;
  cairo_pattern_t *sky = cairo_pattern_create_linear(0, 0, 0, horizon);
  cairo_pattern_add_color_stop_rgb(sky, 0, p->sky_top[0], p->sky_top[1], p->sky_top[2]);
  cairo_pattern_add_color_stop_rgb(sky, 1, p->sky_low[0], p->sky_low[1], p->sky_low[2]);
  cairo_set_source(ic, sky);
  cairo_paint(ic);
  cairo_pattern_destroy(sky);
  double sx = iw * pp_gen_rng_uniform(&rng, 0.55, 0.8), sy = ih * p->sun_y;
  cairo_pattern_t *glow = cairo_pattern_create_radial(sx, sy, 0, sx, sy, ih * 0.25);
  cairo_pattern_add_color_stop_rgba(glow, 0, 1, 0.97, 0.85, 0.95);
  cairo_pattern_add_color_stop_rgba(glow, 0.15, 1, 0.95, 0.8, 0.8);
  cairo_pattern_add_color_stop_rgba(glow, 1, 1, 0.95, 0.8, 0);
  cairo_set_source(ic, glow);
  cairo_paint(ic);
  cairo_pattern_destroy(glow);
  for (int r = 0; r < 3; r++)
    ridge(ic, &rng, iw, horizon - ih * (0.12 - r * 0.04), ih * (0.30 - r * 0.07), p->ridge[r],
          p->snow && r < 2);
  cairo_pattern_t *sea = cairo_pattern_create_linear(0, horizon, 0, ih);
  cairo_pattern_add_color_stop_rgb(sea, 0, p->water[0] * 1.3, p->water[1] * 1.3, p->water[2] * 1.3);
  cairo_pattern_add_color_stop_rgb(sea, 1, p->water[0] * 0.7, p->water[1] * 0.7, p->water[2] * 0.7);
  cairo_rectangle(ic, 0, horizon, iw, ih - horizon);
  cairo_set_source(ic, sea);
  cairo_fill(ic);
  cairo_pattern_destroy(sea);
  /* Ripples: short light strokes, denser towards the horizon. */
  cairo_set_line_width(ic, 1.0 * px_per_pt);
  for (int i = 0; i < 140; i++) {
    double ry = horizon + (ih - horizon) * pow(pp_gen_rng_uniform(&rng, 0, 1), 1.6);
    double rx = pp_gen_rng_uniform(&rng, 0, iw), len = 4 + (ry - horizon) * 0.15;
    cairo_set_source_rgba(ic, 1, 1, 1, 0.12 + 0.2 * pp_gen_rng_uniform(&rng, 0, 1));
    cairo_move_to(ic, rx, ry);
    cairo_line_to(ic, rx + len, ry);
    cairo_stroke(ic);
  }
  if (p->lights) {
    for (int i = 0; i < 30; i++) {
      cairo_set_source_rgba(ic, 1, 0.85, 0.45, 0.9);
      cairo_arc(ic, pp_gen_rng_uniform(&rng, 0, iw),
                horizon - pp_gen_rng_uniform(&rng, 1, ih * 0.05), 1.2 * px_per_pt, 0, 2 * G_PI);
      cairo_fill(ic);
    }
  }
  ferry(ic, iw * pp_gen_rng_uniform(&rng, 0.15, 0.45), horizon + (ih - horizon) * 0.35,
        px_per_pt * w / 260.0);
  cairo_destroy(ic);
  cairo_save(cr);
  cairo_rectangle(cr, x, y, w, h);
  cairo_clip(cr);
  cairo_translate(cr, x, y);
  cairo_scale(cr, 1.0 / px_per_pt, 1.0 / px_per_pt);
  cairo_set_source_surface(cr, img, 0, 0);
  cairo_paint(cr);
  cairo_restore(cr);
  cairo_surface_destroy(img);
}
