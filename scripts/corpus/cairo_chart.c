/* Chart drawing and the matching truth record. Everything a detector could
 * measure (frame, ticks, bar ends) is derived from the same pp_gen_chart. */
#include "cairo_chart.h"

#include <math.h>

static const double palette[][3] = {
    {0.16, 0.38, 0.62}, {0.90, 0.52, 0.16}, {0.30, 0.62, 0.36}, {0.62, 0.30, 0.52}};

static double axis_t(const pp_gen_chart *c, double v) {
  return c->log_axis ? log10(v) : v;
}

static double axis_frac(const pp_gen_chart *c, double v) {
  return (axis_t(c, v) - axis_t(c, c->axis_min)) /
         (axis_t(c, c->axis_max) - axis_t(c, c->axis_min));
}

/* Value position along the value axis in page units. */
static double value_pos(const pp_gen_chart *c, double v) {
  double f = axis_frac(c, v);
  return c->horizontal ? c->x + f * c->w : c->y + c->h - f * c->h;
}

static void set_series_colour(cairo_t *cr, const pp_gen_chart *c, int s) {
  const double *rgb = palette[s % 4];
  cairo_set_source_rgba(cr, rgb[0], rgb[1], rgb[2], c->alpha > 0 ? c->alpha : 1.0);
}

static GArray *value_ticks(const pp_gen_chart *c) {
  GArray *t = g_array_new(FALSE, FALSE, sizeof(double));
  if (c->log_axis) {
    for (int k = (int)ceil(log10(c->axis_min) - 1e-9); k <= (int)floor(log10(c->axis_max) + 1e-9);
         k++) {
      double v = pow(10, k);
      g_array_append_val(t, v);
    }
    return t;
  }
  double first = ceil(c->axis_min / c->tick_step - 1e-9) * c->tick_step;
  /* Label the frame edge too when no regular tick sits near it, as most
   * plotting tools do for a user-set minimum. */
  if (first - c->axis_min > 0.4 * c->tick_step)
    g_array_append_val(t, c->axis_min);
  for (double v = first; v <= c->axis_max + 1e-9 * fabs(c->axis_max); v += c->tick_step) {
    double r = fabs(v) < 1e-9 ? 0 : v;
    g_array_append_val(t, r);
  }
  return t;
}

/* Enough decimals to print v as drawn: the step's decimals for a regular tick, more for
 * a frame-edge label off the step (0.21 printed "0.2" would put a label where its value
 * is not, and the truth records 0.21). Six at most: common practice, no source. */
static int label_decimals(double v, int decimals) {
  while (decimals < 6 && fabs(round(v * pow(10, decimals)) - v * pow(10, decimals)) > 1e-6)
    decimals++;
  return decimals;
}

static void draw_value_axis(cairo_t *cr, const pp_gen_chart *c, gboolean grid_only) {
  GArray *ticks = value_ticks(c);
  pp_gen_font(cr, 7.5, FALSE);
  for (guint i = 0; i < ticks->len; i++) {
    double v = g_array_index(ticks, double, i);
    double p = value_pos(c, v);
    char buf[64];
    if (grid_only) {
      if (!c->gridlines)
        continue;
      cairo_set_source_rgb(cr, 0.85, 0.85, 0.85);
      cairo_set_line_width(cr, 0.5);
      if (c->horizontal) {
        cairo_move_to(cr, p, c->y);
        cairo_line_to(cr, p, c->y + c->h);
      } else {
        cairo_move_to(cr, c->x, p);
        cairo_line_to(cr, c->x + c->w, p);
      }
      cairo_stroke(cr);
      continue;
    }
    cairo_set_source_rgb(cr, 0.2, 0.2, 0.2);
    cairo_set_line_width(cr, 0.6);
    pp_gen_format(v, c->log_axis ? PP_GEN_FMT_THOUSANDS : c->fmt,
                  c->log_axis ? 0 : label_decimals(v, c->decimals), buf, sizeof buf);
    if (c->horizontal) {
      cairo_move_to(cr, p, c->y + c->h);
      cairo_line_to(cr, p, c->y + c->h + 4);
      cairo_stroke(cr);
      pp_gen_text_at(cr, buf, p, c->y + c->h + 6, 0.5, 0);
    } else {
      cairo_move_to(cr, c->x - 4, p);
      cairo_line_to(cr, c->x, p);
      cairo_stroke(cr);
      pp_gen_text_at(cr, buf, c->x - 6, p, 1, 0.5);
    }
  }
  g_array_unref(ticks);
}

static void draw_categories(cairo_t *cr, const pp_gen_chart *c) {
  pp_gen_font(cr, 7.5, FALSE);
  cairo_set_source_rgb(cr, 0.2, 0.2, 0.2);
  int every = c->label_every > 0 ? c->label_every : 1;
  gboolean spread = c->mark != PP_GEN_MARK_BARS;
  for (int i = 0; i < c->n; i += every) {
    double centre = spread ? (c->n > 1 ? (double)i / (c->n - 1) : 0.5) : (i + 0.5) / c->n;
    if (c->horizontal) {
      pp_gen_text_at(cr, c->cats[i], c->x - 6, c->y + centre * c->h, 1, 0.5);
    } else if (c->rotated) {
      cairo_save(cr);
      cairo_translate(cr, c->x + centre * c->w, c->y + c->h + 6);
      cairo_rotate(cr, -G_PI / 4);
      pp_gen_text_at(cr, c->cats[i], 0, 0, 1, 0.5);
      cairo_restore(cr);
    } else {
      pp_gen_text_at(cr, c->cats[i], c->x + centre * c->w, c->y + c->h + 6, 0.5, 0);
    }
  }
}

static void bar_path(cairo_t *cr, const pp_gen_chart *c, double x0, double y0, double x1,
                     double y1) {
  if (c->bar_style == PP_GEN_BAR_PATH4) {
    cairo_move_to(cr, x0, y0);
    cairo_line_to(cr, x1, y0);
    cairo_line_to(cr, x1, y1);
    cairo_line_to(cr, x0, y1);
    cairo_close_path(cr);
  } else {
    cairo_rectangle(cr, fmin(x0, x1), fmin(y0, y1), fabs(x1 - x0), fabs(y1 - y0));
  }
}

static void fill_bar(cairo_t *cr, const pp_gen_chart *c, int s, double x0, double y0, double x1,
                     double y1) {
  bar_path(cr, c, x0, y0, x1, y1);
  if (c->gradient) {
    const double *rgb = palette[s % 4];
    cairo_pattern_t *pat = c->horizontal ? cairo_pattern_create_linear(x0, 0, x1, 0)
                                         : cairo_pattern_create_linear(0, y0, 0, y1);
    cairo_pattern_add_color_stop_rgb(pat, 0, rgb[0] * 0.6, rgb[1] * 0.6, rgb[2] * 0.6);
    cairo_pattern_add_color_stop_rgb(pat, 1, 0.5 + rgb[0] * 0.5, 0.5 + rgb[1] * 0.5,
                                     0.5 + rgb[2] * 0.5);
    cairo_set_source(cr, pat);
    cairo_pattern_destroy(pat);
  } else {
    set_series_colour(cr, c, s);
  }
  if (c->bar_style == PP_GEN_BAR_FILL_STROKE) {
    cairo_fill_preserve(cr);
    cairo_set_source_rgb(cr, 0.1, 0.1, 0.1);
    cairo_set_line_width(cr, 0.8);
    cairo_stroke(cr);
  } else {
    cairo_fill(cr);
  }
}

static double series_value(const pp_gen_chart *c, int s, int i) {
  if (s == 0 && c->drawn)
    return c->drawn[i];
  return c->values[s * c->n + i];
}

static double printed_value(const pp_gen_chart *c, int i) {
  if (!c->stacked)
    return c->values[i];
  double total = 0;
  for (int s = 0; s < c->n_series; s++)
    total += c->values[s * c->n + i];
  return total;
}

static void draw_bars(cairo_t *cr, const pp_gen_chart *c) {
  int ns = c->n_series > 0 ? c->n_series : 1;
  double slot = (c->horizontal ? c->h : c->w) / c->n;
  double thick = slot * (c->n >= 40 ? 0.8 : 0.62);
  double sub = c->stacked ? thick : thick / ns;
  cairo_save(cr);
  /* Stacked segments below a truncated axis would hang under the frame: plotting
   * software clips to the plot area, so does this generator. */
  if (c->bar_style == PP_GEN_BAR_CLIPPED || c->stacked) {
    cairo_rectangle(cr, c->x, c->y, c->w, c->h);
    cairo_clip(cr);
  }
  for (int i = 0; i < c->n; i++) {
    /* Stacked segments sit at their cumulative values from zero; only the
     * bottom one starts at bar_from, so a truncated axis cuts that one. */
    double acc = 0;
    for (int s = 0; s < ns; s++) {
      double v = series_value(c, s, i);
      double lo = c->stacked && s > 0 ? acc : c->bar_from;
      double hi = c->stacked ? acc + v : v;
      acc = hi;
      double off = (slot - thick) / 2 + (c->stacked ? 0 : s * sub);
      double a0 = (c->horizontal ? c->y : c->x) + i * slot + off, a1 = a0 + sub;
      /* value_pos of a start below a log axis is undefined; clamp to frame. */
      double p0 = value_pos(c, lo), p1 = value_pos(c, hi);
      if (c->horizontal)
        fill_bar(cr, c, s, p0, a0, p1, a1);
      else
        fill_bar(cr, c, s, a0, p0, a1, p1);
    }
    if (c->data_labels) {
      char buf[64];
      pp_gen_format(printed_value(c, i), c->fmt, MAX(c->decimals, c->label_decimals), buf,
                    sizeof buf);
      double end = value_pos(c, acc);
      double mid = (c->horizontal ? c->y : c->x) + (i + 0.5) * slot;
      pp_gen_font(cr, 7.5, TRUE);
      cairo_set_source_rgb(cr, 0.15, 0.15, 0.15);
      if (c->horizontal)
        pp_gen_text_at(cr, buf, end + 4, mid, 0, 0.5);
      else
        pp_gen_text_at(cr, buf, mid, end - 3, 0.5, 1);
    }
  }
  cairo_restore(cr);
}

static double point_x(const pp_gen_chart *c, int i) {
  return c->x + (c->n > 1 ? c->w * i / (c->n - 1) : c->w / 2);
}

static void draw_area(cairo_t *cr, const pp_gen_chart *c) {
  cairo_move_to(cr, point_x(c, 0), value_pos(c, c->values[0]));
  for (int i = 1; i < c->n; i++)
    cairo_line_to(cr, point_x(c, i), value_pos(c, c->values[i]));
  for (int i = c->n - 1; i >= 0; i--) {
    double lo = c->mark == PP_GEN_MARK_BAND ? c->lower[i] : c->bar_from;
    cairo_line_to(cr, point_x(c, i), value_pos(c, lo));
    if (c->mark != PP_GEN_MARK_BAND) {
      cairo_line_to(cr, point_x(c, 0), value_pos(c, lo));
      break;
    }
  }
  cairo_close_path(cr);
  const double *rgb = palette[0];
  cairo_set_source_rgba(cr, rgb[0], rgb[1], rgb[2], c->alpha > 0 ? c->alpha : 0.55);
  cairo_fill(cr);
}

static void draw_lines(cairo_t *cr, const pp_gen_chart *c) {
  int ns = c->mark == PP_GEN_MARK_LINE && c->n_series > 0 ? c->n_series : 1;
  for (int s = 0; s < ns; s++) {
    const double *v = c->values + s * c->n;
    cairo_move_to(cr, point_x(c, 0), value_pos(c, v[0]));
    for (int i = 1; i < c->n; i++)
      cairo_line_to(cr, point_x(c, i), value_pos(c, v[i]));
    const double *rgb = palette[s % 4];
    cairo_set_source_rgb(cr, rgb[0] * 0.8, rgb[1] * 0.8, rgb[2] * 0.8);
    cairo_set_line_width(cr, 1.6);
    cairo_set_line_join(cr, CAIRO_LINE_JOIN_ROUND);
    cairo_stroke(cr);
    if (c->markers)
      for (int i = 0; i < c->n; i++) {
        cairo_arc(cr, point_x(c, i), value_pos(c, v[i]), 2.2, 0, 2 * G_PI);
        cairo_fill(cr);
      }
  }
}

static void draw_legend(cairo_t *cr, const pp_gen_chart *c) {
  if (!c->series_names)
    return;
  pp_gen_font(cr, 7, FALSE);
  double lx = c->x + c->w;
  for (int s = c->n_series - 1; s >= 0; s--) {
    cairo_text_extents_t te;
    cairo_text_extents(cr, c->series_names[s], &te);
    lx -= te.x_advance;
    cairo_set_source_rgb(cr, 0.2, 0.2, 0.2);
    pp_gen_text_at(cr, c->series_names[s], lx, c->y - 8, 0, 0.5);
    lx -= 10;
    set_series_colour(cr, c, s);
    cairo_rectangle(cr, lx, c->y - 11.5, 7, 7);
    cairo_fill(cr);
    lx -= 10;
  }
}

void pp_gen_chart_draw(cairo_t *cr, const pp_gen_chart *c) {
  cairo_save(cr);
  if (c->title) {
    pp_gen_font(cr, 9.5, TRUE);
    cairo_set_source_rgb(cr, 0.1, 0.1, 0.1);
    pp_gen_text_at(cr, c->title, c->x, c->y - (c->series_names ? 22 : 10), 0, 1);
  }
  draw_legend(cr, c);
  if (!c->hide_value_axis)
    draw_value_axis(cr, c, TRUE);
  if (c->mark == PP_GEN_MARK_BARS)
    draw_bars(cr, c);
  else if (c->mark == PP_GEN_MARK_AREA || c->mark == PP_GEN_MARK_BAND)
    draw_area(cr, c);
  if (c->mark != PP_GEN_MARK_BARS)
    draw_lines(cr, c);
  if (c->mark == PP_GEN_MARK_BAND) {
    pp_gen_chart lo = *c;
    lo.values = c->lower;
    lo.markers = FALSE;
    lo.n_series = 1;
    draw_lines(cr, &lo);
  }
  /* Axis lines last so bars never cover them. */
  cairo_set_source_rgb(cr, 0.2, 0.2, 0.2);
  cairo_set_line_width(cr, 0.8);
  cairo_move_to(cr, c->x, c->y);
  cairo_line_to(cr, c->x, c->y + c->h);
  cairo_line_to(cr, c->x + c->w, c->y + c->h);
  cairo_stroke(cr);
  if (!c->log_axis && c->axis_min < 0 && c->axis_max > 0 && c->mark == PP_GEN_MARK_BARS) {
    double p = value_pos(c, 0);
    cairo_set_line_width(cr, 0.8);
    if (c->horizontal) {
      cairo_move_to(cr, p, c->y);
      cairo_line_to(cr, p, c->y + c->h);
    } else {
      cairo_move_to(cr, c->x, p);
      cairo_line_to(cr, c->x + c->w, p);
    }
    cairo_stroke(cr);
  }
  if (!c->hide_value_axis)
    draw_value_axis(cr, c, FALSE);
  draw_categories(cr, c);
  cairo_restore(cr);
}

static void add_auto_styles(pp_gen_figure *f, const pp_gen_chart *c, gboolean any_negative) {
  if (!c->hide_value_axis)
    pp_gen_figure_add_style(f, "tick-marks");
  if (c->gridlines)
    pp_gen_figure_add_style(f, "gridlines");
  if (c->mark == PP_GEN_MARK_BARS) {
    if (c->bar_style == PP_GEN_BAR_PATH4)
      pp_gen_figure_add_style(f, "four-point-paths");
    if (c->bar_style == PP_GEN_BAR_FILL_STROKE) {
      pp_gen_figure_add_style(f, "fill-stroke");
      pp_gen_figure_add_style(f, "edge-strokes");
    }
    if (c->bar_style == PP_GEN_BAR_CLIPPED)
      pp_gen_figure_add_style(f, "clipped");
    if (c->n_series > 1 && !c->stacked)
      pp_gen_figure_add_style(f, "grouped");
  }
  if (c->stacked)
    pp_gen_figure_add_style(f, "stacked");
  if (c->alpha > 0 && c->mark == PP_GEN_MARK_BARS)
    pp_gen_figure_add_style(f, "alpha");
  if (c->gradient)
    pp_gen_figure_add_style(f, "gradient");
  if (c->hide_value_axis)
    pp_gen_figure_add_style(f, "data-labels-only");
  else if (c->data_labels)
    pp_gen_figure_add_style(f, "data-labels");
  static const char *fmt_style[] = {NULL, "thousands-sep", "currency", "percent", "decimal-comma"};
  if (fmt_style[c->fmt])
    pp_gen_figure_add_style(f, fmt_style[c->fmt]);
  if (c->rotated)
    pp_gen_figure_add_style(f, "rotated-labels");
  if (c->n >= 40)
    pp_gen_figure_add_style(f, "many-bars");
  if (any_negative)
    pp_gen_figure_add_style(f, "negative");
  if (c->mark == PP_GEN_MARK_BAND)
    pp_gen_figure_add_style(f, "between-series");
  if (c->markers)
    pp_gen_figure_add_style(f, "markers");
  if (c->log_axis)
    pp_gen_figure_add_style(f, "log");
  else if (c->axis_min > 0)
    pp_gen_figure_add_style(f, "truncated-axis");
}

pp_gen_figure *pp_gen_chart_truth(const pp_gen_chart *c, pp_gen_truth *truth, int page) {
  static const char *kinds[] = {"column", "area", "area", "line"};
  const char *kind = kinds[c->mark];
  if (c->mark == PP_GEN_MARK_BARS && c->horizontal)
    kind = "bar";
  pp_gen_figure *f = pp_gen_truth_add(truth, page, kind);
  pp_gen_figure_set_bbox(f, c->x, c->y, c->w, c->h);
  f->has_axis = TRUE;
  f->axis_hidden = c->hide_value_axis;
  f->axis_min = c->axis_min;
  f->axis_max = c->axis_max;
  f->axis_log = c->log_axis;
  f->orientation = c->horizontal ? 'x' : 'y';
  int ns = c->n_series > 0 ? c->n_series : 1;
  /* docs/corpus.md: grouped bars are flattened category-major with
   * "cat/series" labels; stacked bars record the totals. */
  gboolean grouped = c->mark == PP_GEN_MARK_BARS && ns > 1 && !c->stacked;
  gboolean filled = c->mark == PP_GEN_MARK_BARS || c->mark == PP_GEN_MARK_AREA;
  /* A bar started below the frame and clipped shows ink only from the frame edge. */
  double baseline = c->bar_from < c->axis_min ? c->axis_min : c->bar_from;
  gboolean any_negative = FALSE, labels_disagree = FALSE;
  GArray *g = g_array_new(FALSE, FALSE, sizeof(double));
  for (int i = 0; i < c->n; i++) {
    for (int s = 0; s < (grouped ? ns : 1); s++) {
      double v = grouped ? c->values[s * c->n + i] : printed_value(c, i);
      double end = v;
      if (s == 0 && c->drawn) {
        end = c->drawn[i];
        if (fabs(end - v) > 1e-9 * fmax(1, fabs(v)))
          labels_disagree = TRUE;
      }
      g_array_append_val(f->values, v);
      if (grouped)
        g_ptr_array_add(f->labels, g_strdup_printf("%s/%s", c->cats[i],
                                                   c->series_names ? c->series_names[s] : "?"));
      else
        g_ptr_array_add(f->labels, g_strdup(c->cats[i]));
      any_negative = any_negative || v < 0;
      double gi = c->log_axis ? log10(end) - log10(baseline) : end - baseline;
      g_array_append_val(g, gi);
    }
  }
  if (ns > 1)
    for (int s = 0; s < ns; s++)
      pp_gen_figure_add_series(f, c->series_names ? c->series_names[s] : "", c->values + s * c->n,
                               c->n);
  if (c->data_labels) {
    f->data_labels = g_array_new(FALSE, FALSE, sizeof(double));
    g_array_append_vals(f->data_labels, f->values->data, f->values->len);
  }
  if (c->drawn) {
    f->drawn = g_array_new(FALSE, FALSE, sizeof(double));
    g_array_append_vals(f->drawn, c->drawn, (guint)c->n);
  }
  if (filled) {
    f->baseline = baseline;
    f->has_expected = TRUE;
    pp_gen_measures_compute((const double *)(void *)f->values->data,
                            (const double *)(void *)g->data, (int)g->len, baseline, &f->expected);
    if (c->mark == PP_GEN_MARK_BARS && labels_disagree)
      f->rule = "bars-vs-labels";
    else if (c->mark == PP_GEN_MARK_BARS && c->log_axis)
      f->rule = "bars-on-log";
    else if (baseline != 0)
      f->rule = c->mark == PP_GEN_MARK_BARS ? "bars-off-zero" : "area-off-zero";
  }
  /* Lines and bands encode position, not extent from zero: honest on any
   * axis, and docs/corpus.md gives them no expected measures. */
  f->misleading = f->rule != NULL;
  g_array_unref(g);
  add_auto_styles(f, c, any_negative);
  if (c->stacked)
    pp_gen_figure_set_note(f, "stacked: values are the category totals (sum of all series)");
  else if (grouped)
    pp_gen_figure_set_note(f, "grouped: values flattened category-major (docs/corpus.md)");
  else if (c->mark == PP_GEN_MARK_BAND)
    pp_gen_figure_set_note(f, "band between two series: values are the upper series; the fill "
                              "encodes the gap, not a magnitude from zero");
  else if (c->bar_style == PP_GEN_BAR_CLIPPED && c->mark == PP_GEN_MARK_BARS &&
           c->bar_from < c->axis_min)
    pp_gen_figure_set_note(f, "bar paths start at value 0 below the frame and are clipped to "
                              "the plot area; baseline is the visible start (axis min)");
  return f;
}
