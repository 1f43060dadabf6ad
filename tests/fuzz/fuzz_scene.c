/* fuzz_scene.c — libFuzzer harness for scene building from recorded calls: the input is a
 * program of cairo calls (paths, fills, strokes, clips, groups, transforms, paints) made on
 * a tapped context, as poppler would make them; the scene is then measured, recognised,
 * scored and written as a findings page. Extreme and non-finite coordinates are in reach. */
#include <math.h>
#include <stdint.h>
#include <string.h>

#include "capture/internal.h"
#include "geometry/geometry.h"
#include "report/report.h"

/* Calls per input; pages from real producers have thousands, a few hundred find the
 * shapes of interest faster. Common practice, no source. */
#define MAX_OPS 400
/* Widest arc: one full turn (a circle), the most a producer's circle or wedge draws. */
#define MAX_ARC_SWEEP (2 * G_PI)
/* Largest arc radius, in user and device units: about ten pages (common practice, no
 * source). */
#define MAX_ARC_RADIUS 1e4

typedef struct {
  const uint8_t *p, *end;
} reader;

static uint8_t byte(reader *r) {
  return r->p < r->end ? *r->p++ : 0;
}

/* Mostly page-sized coordinates; sometimes extreme or non-finite ones. */
static double num(reader *r) {
  uint8_t kind = byte(r);
  if (kind < 240) {
    int16_t v = (int16_t)(byte(r) | byte(r) << 8);
    return v / 16.0;
  }
  static const double extreme[] = {1e20, -1e20, 1e308, 0.0, -0.0, 1e-300, NAN, INFINITY};
  return extreme[kind % 8];
}

/* cairo splits an arc by its size on the device, so a page-sized radius under a 1e20
 * scale costs it minutes of sin/cos before our code sees a point (a found input: 202 s,
 * all in cairo's arc code). poppler never asks cairo for arcs, so they stay page-sized on
 * the device too. */
static gboolean arc_page_sized(cairo_t *cr, double rad) {
  double ax = rad, ay = 0, bx = 0, by = rad;
  cairo_user_to_device_distance(cr, &ax, &ay);
  cairo_user_to_device_distance(cr, &bx, &by);
  return hypot(ax, ay) < MAX_ARC_RADIUS && hypot(bx, by) < MAX_ARC_RADIUS;
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size) {
  reader r = {data, data + size};
  cairo_surface_t *target = cairo_recording_surface_create(CAIRO_CONTENT_COLOR_ALPHA, NULL);
  cairo_t *cr = cairo_create(target);
  pp_scene *scene = pp_scene_new(0, 400, 300);
  pp_tap_begin(cr, 1.0, scene);
  int depth = 0, groups = 0;
  for (int i = 0; i < MAX_OPS && r.p < r.end; i++) {
    switch (byte(&r) % 18) {
    case 0: cairo_move_to(cr, num(&r), num(&r)); break;
    case 1: cairo_line_to(cr, num(&r), num(&r)); break;
    case 2: {
      double a = num(&r), b = num(&r), c = num(&r), d = num(&r), e = num(&r), f = num(&r);
      cairo_curve_to(cr, a, b, c, d, e, f);
      break;
    }
    case 3: {
      double x = num(&r), y = num(&r), w = num(&r), h = num(&r);
      cairo_rectangle(cr, x, y, w, h);
      break;
    }
    case 4: cairo_close_path(cr); break;
    case 5: cairo_fill(cr); break;
    case 6: cairo_stroke(cr); break;
    case 7: cairo_clip(cr); break;
    case 8:
      if (depth < 64)
        cairo_save(cr), depth++;
      break;
    case 9:
      if (depth > 0)
        cairo_restore(cr), depth--;
      break;
    case 10: {
      double red = byte(&r) / 255.0, g = byte(&r) / 255.0, b = byte(&r) / 255.0;
      cairo_set_source_rgba(cr, red, g, b, byte(&r) / 255.0);
      break;
    }
    case 11: cairo_paint(cr); break;
    case 12: cairo_set_line_width(cr, num(&r)); break;
    case 13: {
      cairo_matrix_t m;
      double a = num(&r), b = num(&r), c = num(&r), d = num(&r), e = num(&r), f = num(&r);
      cairo_matrix_init(&m, a, b, c, d, e, f);
      cairo_status_t st = cairo_matrix_invert(&m); /* cairo refuses singular matrices */
      if (st == CAIRO_STATUS_SUCCESS) {
        cairo_matrix_init(&m, a, b, c, d, e, f);
        cairo_transform(cr, &m);
      }
      break;
    }
    case 14:
      if (groups < 8)
        cairo_push_group(cr), groups++;
      break;
    case 15:
      if (groups > 0)
        cairo_pop_group_to_source(cr), groups--, cairo_paint(cr);
      break;
    case 16: {
      double x = num(&r), y = num(&r), rad = num(&r), a1 = num(&r), a2 = num(&r);
      /* cairo itself subdivides a huge arc for ever; poppler draws PDF paths (which have
       * no arcs) as curves, so arcs stay page-sized here, and within one turn: further
       * turns retrace the others' curves and the area sweep pays for every crossing of
       * the near-coincident turns (9 turns took up to 30 ms, one turn 0.1 ms); such
       * inputs took 93% of the fuzzer's time. Repeated arcs still overlap turns (seed
       * clip-area-spiral: 5.7 turns as six arcs, about 10 ms). */
      if (fabs(a2 - a1) <= MAX_ARC_SWEEP && fabs(rad) < MAX_ARC_RADIUS && isfinite(x) &&
          isfinite(y) && arc_page_sized(cr, rad))
        cairo_arc(cr, x, y, rad, a1, a2);
      break;
    }
    case 17: cairo_new_path(cr); break;
    }
  }
  while (groups-- > 0)
    cairo_pattern_destroy(cairo_pop_group(cr));
  pp_tap_end();
  cairo_destroy(cr);
  cairo_surface_destroy(target);
  pp_scene_measure(scene);
  pp_page_charts *charts = pp_page_charts_find(scene);
  GPtrArray *findings = g_ptr_array_new_with_free_func((GDestroyNotify)pp_finding_free);
  pp_thresholds t = pp_thresholds_default();
  for (guint i = 0; charts && charts->figures && i < charts->figures->len; i++)
    pp_rules_check_figure(g_ptr_array_index(charts->figures, i), &t, findings);
  pp_document_info info = {.path = "fuzz.pdf", .size = 1, .sha256 = "00", .n_pages = 1};
  pp_report *report = pp_report_new(&info, &t);
  pp_report_add_page(report, scene, charts, findings);
  char *json = pp_report_to_string(report, FALSE, NULL);
  g_free(json);
  pp_report_free(report);
  g_ptr_array_unref(findings);
  pp_page_charts_free(charts);
  pp_scene_free(scene);
  return 0;
}
