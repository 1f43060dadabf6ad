/* demo_shapes.c — the demo report's 3D bars, pyramid and bubble chart. Each is misleading
 * in the way docs/rules.md describes; expected measures use the closed forms of
 * scripts/corpus/truth_shapes.py (parallelogram and trapezoid areas, frustum volumes, the
 * log-log fit), so `truth.py check` recomputes them independently. */
#include "demo_shapes.h"

#include <math.h>
#include <stdio.h>

#include "cairo_text.h"

static const double blue[3][3] = {{0.13, 0.36, 0.55}, {0.38, 0.60, 0.78}, {0.08, 0.24, 0.38}};

static void poly(cairo_t *cr, const double *xy, int n, const double *rgb) {
  cairo_move_to(cr, xy[0], xy[1]);
  for (int i = 1; i < n; i++)
    cairo_line_to(cr, xy[2 * i], xy[2 * i + 1]);
  cairo_close_path(cr);
  cairo_set_source_rgb(cr, rgb[0], rgb[1], rgb[2]);
  cairo_fill(cr);
}

/* "%.9g": the precision truth.py rounds to. */
static void num(GString *s, double v) {
  if (isnan(v))
    g_string_append(s, "null");
  else
    g_string_append_printf(s, "%.9g", v);
}

static void nums(GString *s, const double *v, int n) {
  g_string_append_c(s, '[');
  for (int i = 0; i < n; i++) {
    if (i)
      g_string_append(s, ", ");
    num(s, v[i]);
  }
  g_string_append_c(s, ']');
}

/* (g_i/g_j)/(v_i/v_j) at its largest over pairs, ≥ 1. */
static double worst_pair(const double *v, const double *g, int n) {
  double worst = 1;
  for (int i = 0; i < n; i++)
    for (int j = i + 1; j < n; j++) {
      double r = (g[i] / g[j]) / (v[i] / v[j]);
      worst = fmax(worst, fmax(r, 1 / r));
    }
  return worst;
}

/* (ink of the largest value / ink of the smallest) / (largest / smallest); first of ties. */
static double lie_extremes(const double *v, const double *g, int n) {
  int lo = 0, hi = 0;
  for (int i = 1; i < n; i++) {
    if (v[i] > v[hi])
      hi = i;
    if (v[i] < v[lo])
      lo = i;
  }
  return (g[hi] / g[lo]) / (v[hi] / v[lo]);
}

static pp_gen_figure *record(pp_gen_truth *truth, int page, const char *kind, const char *rule,
                             const double *v, const char *const *labels, int n, double x, double y,
                             double w, double h) {
  pp_gen_figure *f = pp_gen_truth_add(truth, page, kind);
  f->misleading = TRUE;
  f->rule = rule;
  for (int i = 0; i < n; i++) {
    g_array_append_val(f->values, v[i]);
    g_ptr_array_add(f->labels, g_strdup(labels[i]));
  }
  pp_gen_figure_set_bbox(f, x, y, w, h);
  pp_gen_figure_add_style(f, "multi-chart-page");
  return f;
}

void pp_demo_bars_3d(cairo_t *cr, pp_gen_truth *truth, int page, double x, double y, double w,
                     double h) {
  static const double v[] = {12, 18, 15, 24, 30};
  static const char *const cats[] = {"2027", "2028", "2029", "2030", "2031"};
  const int n = 5;
  const double top = 35, k = h / top;     /* pt per million passengers */
  const double bw = 30, dx = 12, dy = 14; /* front width and depth, pt */
  pp_gen_font(cr, 8, FALSE);
  for (int t = 0; t <= 35; t += 5) { /* front-plane axis with gridlines */
    double ty = y + h - k * t;
    cairo_set_source_rgb(cr, 0.8, 0.8, 0.8);
    cairo_set_line_width(cr, 0.5);
    cairo_move_to(cr, x, ty);
    cairo_line_to(cr, x + w, ty);
    cairo_stroke(cr);
    char buf[16];
    g_snprintf(buf, sizeof buf, "%d", t);
    cairo_set_source_rgb(cr, 0.2, 0.2, 0.2);
    pp_gen_text_at(cr, buf, x - 6, ty, 1, 0.5);
  }
  double ink[5], front[5], fixed[5];
  for (int i = 0; i < n; i++) {
    double x0 = x + (i + 0.5) * w / n - bw / 2, base = y + h, hh = k * v[i];
    double f[] = {x0, base, x0 + bw, base, x0 + bw, base - hh, x0, base - hh};
    double cap[] = {x0,           base - hh,      x0 + bw, base - hh,
                    x0 + bw + dx, base - hh - dy, x0 + dx, base - hh - dy};
    double side[] = {x0 + bw,      base,           x0 + bw + dx, base - dy,
                     x0 + bw + dx, base - hh - dy, x0 + bw,      base - hh};
    poly(cr, f, 4, blue[0]);
    poly(cr, cap, 4, blue[1]);
    poly(cr, side, 4, blue[2]);
    cairo_set_source_rgb(cr, 0.2, 0.2, 0.2);
    pp_gen_text_at(cr, cats[i], x0 + bw / 2, base + 5, 0.5, 0);
    /* parallelograms: front w·h, side |dx|·h, cap w·|dy| (in value units, dy/k) */
    front[i] = bw * v[i];
    fixed[i] = bw * dy / k;
    ink[i] = front[i] + dx * v[i] + fixed[i];
  }
  pp_gen_figure *f = record(truth, page, "bar-3d", "bars-3d-ink", v, cats, n, x, y - dy, w, h + dy);
  f->has_axis = TRUE, f->axis_min = 0, f->axis_max = top, f->orientation = 'y';
  f->baseline = 0;
  pp_gen_figure_add_style(f, "oblique");
  pp_gen_figure_add_style(f, "gridlines");
  f->extra_json = g_strdup_printf("\"solid\": {\"projection\": \"oblique\", \"front_width\": %.9g, "
                                  "\"depth\": [%.9g, %.9g], \"base\": 0.0}",
                                  bw, dx, dy / k);
  double share = 0;
  for (int i = 0; i < n; i++)
    share = fmax(share, fixed[i] / ink[i]);
  GString *e = g_string_new("{\"lie_factor_growth\": ");
  num(e, lie_extremes(v, ink, n));
  g_string_append(e, ", \"nonprop_share\": ");
  num(e, share);
  g_string_append(e, ", \"front_departure\": ");
  num(e, worst_pair(v, front, n));
  g_string_append(e, ", \"max_pair_departure\": ");
  num(e, worst_pair(v, ink, n));
  g_string_append(e, ", \"baseline\": 0.0}");
  f->expected_json = g_string_free(e, FALSE);
}

void pp_demo_pyramid(cairo_t *cr, pp_gen_truth *truth, int page, double x, double y, double w,
                     double h) {
  static const double v[] = {8, 17, 30, 45};
  static const char *const tiers[] = {"Gold", "Silver", "Bronze", "Basic"};
  const int n = 4;
  const double total = 100, half = 0.35 * w, cx = x + 0.4 * w;
  double depth = 0, areas[4], shape[4][3], vols[4];
  for (int i = 0; i < n; i++) { /* slice heights ∝ values: the misleading cut */
    double d2 = depth + h * v[i] / total;
    double a1 = half * depth / h, a2 = half * d2 / h;
    double xy[] = {cx - a1, y + depth, cx + a1, y + depth, cx + a2, y + d2, cx - a2, y + d2};
    poly(cr, xy, 4, blue[i % 2 ? 1 : 0]);
    char buf[16];
    g_snprintf(buf, sizeof buf, "%.0f%%", v[i]);
    pp_gen_font(cr, 8, TRUE);
    cairo_set_source_rgb(cr, 1, 1, 1);
    pp_gen_text_at(cr, buf, cx, y + (depth + d2) / 2, 0.5, 0.5);
    pp_gen_font(cr, 8, FALSE);
    cairo_set_source_rgb(cr, 0.2, 0.2, 0.2);
    pp_gen_text_at(cr, tiers[i], cx + half + 10, y + (depth + d2) / 2, 0, 0.5);
    shape[i][0] = 2 * a1, shape[i][1] = 2 * a2, shape[i][2] = d2 - depth;
    areas[i] = (shape[i][0] + shape[i][1]) / 2 * shape[i][2]; /* trapezoid */
    double r1 = a1, r2 = a2; /* cone frustum πh/3 (r1² + r1 r2 + r2²) */
    vols[i] = G_PI * (d2 - depth) / 3 * (r1 * r1 + r1 * r2 + r2 * r2);
    depth = d2;
  }
  pp_gen_figure *f =
      record(truth, page, "pyramid", "slices-vs-values", v, tiers, n, cx - half, y, 2 * half, h);
  f->data_labels = g_array_new(FALSE, FALSE, sizeof(double));
  g_array_append_vals(f->data_labels, v, n);
  pp_gen_figure_add_style(f, "triangle");
  pp_gen_figure_add_style(f, "percent");
  GString *s = g_string_new("\"slices\": {\"shape\": [");
  for (int i = 0; i < n; i++) {
    g_string_append(s, i ? ", " : "");
    nums(s, shape[i], 3);
  }
  g_string_append(s, "], \"solid\": \"cone\", \"order\": \"top-to-bottom\"}");
  f->extra_json = g_string_free(s, FALSE);
  double ta = 0, tvol = 0, infl[4], vinfl[4], ashare[4], vshare[4], volshare[4];
  for (int i = 0; i < n; i++)
    ta += areas[i], tvol += vols[i];
  int most = 0, least = 0;
  double vmax = 0, vmin = INFINITY;
  for (int i = 0; i < n; i++) {
    ashare[i] = areas[i] / ta, vshare[i] = v[i] / total, volshare[i] = vols[i] / tvol;
    infl[i] = ashare[i] / vshare[i];
    vinfl[i] = volshare[i] / vshare[i];
    if (infl[i] > infl[most])
      most = i;
    if (infl[i] < infl[least])
      least = i;
    vmax = fmax(vmax, vinfl[i]), vmin = fmin(vmin, vinfl[i]);
  }
  GString *e = g_string_new("{\"lie_factor_growth\": ");
  num(e, infl[most] / infl[least]);
  g_string_append_printf(
      e, ", \"most_inflated\": %d, \"least_inflated\": %d, \"area_share\": ", most, least);
  nums(e, ashare, n);
  g_string_append(e, ", \"value_share\": ");
  nums(e, vshare, n);
  g_string_append(e, ", \"solid\": \"cone\", \"volume_share\": ");
  nums(e, volshare, n);
  g_string_append(e, ", \"volume_ratio\": ");
  num(e, vmax / vmin);
  g_string_append(e, ", \"baseline\": null}");
  f->expected_json = g_string_free(e, FALSE);
}

void pp_demo_bubbles(cairo_t *cr, pp_gen_truth *truth, int page, double x, double y, double w,
                     double h) {
  static const double v[] = {9, 26, 14, 31, 19};
  static const char *const routes[] = {"Skarvik", "Lysefjord", "Oddholm", "Brekke", "Tindnes"};
  static const double px[] = {0.12, 0.33, 0.52, 0.72, 0.9}, py[] = {0.7, 0.4, 0.72, 0.42, 0.68};
  const int n = 5;
  double r[5], area[5];
  cairo_set_source_rgb(cr, 0.55, 0.55, 0.55);
  cairo_set_line_width(cr, 0.6);
  cairo_rectangle(cr, x, y, w, h);
  cairo_stroke(cr);
  for (int i = 0; i < n; i++) {
    r[i] = 1.2 * v[i]; /* radius ∝ value: the misleading scaling */
    area[i] = r[i] * r[i];
    cairo_new_sub_path(cr);
    cairo_arc(cr, x + px[i] * w, y + py[i] * h, r[i], 0, 2 * G_PI);
    cairo_close_path(cr);
    cairo_set_source_rgb(cr, 0.55, 0.36, 0.66);
    cairo_fill(cr);
    char buf[16];
    g_snprintf(buf, sizeof buf, "%.0f", v[i]);
    pp_gen_font(cr, 8, TRUE);
    cairo_set_source_rgb(cr, 1, 1, 1);
    pp_gen_text_at(cr, buf, x + px[i] * w, y + py[i] * h, 0.5, 0.5);
    pp_gen_font(cr, 7, FALSE);
    cairo_set_source_rgb(cr, 0.2, 0.2, 0.2);
    pp_gen_text_at(cr, routes[i], x + px[i] * w, y + py[i] * h + r[i] + 4, 0.5, 0);
  }
  pp_gen_figure *f = record(truth, page, "bubble", "symbols-not-by-area", v, routes, n, x, y, w, h);
  f->data_labels = g_array_new(FALSE, FALSE, sizeof(double));
  g_array_append_vals(f->data_labels, v, n);
  pp_gen_figure_add_style(f, "data-labels");
  pp_gen_figure_add_style(f, "by-radius");
  GString *s = g_string_new("\"symbols\": {\"measure\": \"radius\", \"sizes\": ");
  nums(s, r, n);
  g_string_append(s, ", \"shape\": \"circle\"}");
  f->extra_json = g_string_free(s, FALSE);
  /* least squares of log(area) on log(value) */
  double mx = 0, my = 0, sxx = 0, sxy = 0, syy = 0;
  for (int i = 0; i < n; i++)
    mx += log(v[i]) / n, my += log(area[i]) / n;
  for (int i = 0; i < n; i++) {
    double a = log(v[i]) - mx, b = log(area[i]) - my;
    sxx += a * a, sxy += a * b, syy += b * b;
  }
  GString *e = g_string_new("{\"lie_factor_growth\": ");
  num(e, lie_extremes(v, area, n));
  g_string_append(e, ", \"size_exponent\": ");
  num(e, sxy / sxx);
  g_string_append(e, ", \"size_r2\": ");
  num(e, syy == 0 ? 1.0 : sxy * sxy / (sxx * syy));
  g_string_append(e, ", \"max_pair_departure\": ");
  num(e, worst_pair(v, area, n));
  g_string_append(e, ", \"baseline\": null}");
  f->expected_json = g_string_free(e, FALSE);
}
