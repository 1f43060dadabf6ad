/* Generates corpus/cairo: ~60 charts drawn directly with cairo's PDF surface
 * (many drawing idioms, honest and misleading twins) plus one truth JSON per PDF.
 * Usage: gen-corpus-cairo [OUT_DIR]   (default corpus/cairo) */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "cairo_chart.h"
#include "cairo_doc.h"
#include "cairo_rng.h"
#include "cairo_text.h"

#define SEED G_GUINT64_CONSTANT(20310314)
#define A4_W 595.0
#define A4_H 842.0

enum { V_HONEST = 1, V_MILD = 2, V_SEVERE = 4, V_ALL = 7 };

typedef struct {
  const char *out_dir;
  const char *rel_dir;
  guint64 next_seed;
  int files;
  GError *error;
} gen_ctx;

static const char *years[] = {"2026", "2027", "2028", "2029", "2030", "2031"};
static const char *quarters[] = {"Q1 30", "Q2 30", "Q3 30", "Q4 30",
                                 "Q1 31", "Q2 31", "Q3 31", "Q4 31"};
static const char *regions[] = {"Nordvik", "Eastmarch", "Solbakken", "Harrowgate", "Lowfield"};
static const char *products[] = {"Harbour tugs",     "Cargo ferries", "Pilot boats",
                                 "Survey vessels",   "Crew transfer", "Icebreakers",
                                 "Passenger ferries"};

static const char *lorem[] = {
    "The figure summarises results for the period under review.",
    "Values are reported in the units stated in the axis title.",
    "Comparatives have been restated where the segment definition changed.",
    "All figures are unaudited and presented for illustration only.",
    "The trend reflects volume growth in the core service lines.",
    "Management monitors this indicator monthly against the budget.",
};

static void caption(cairo_t *cr, pp_gen_rng *rng, double x, double y, double w) {
  GString *s = g_string_new(NULL);
  for (int i = 0; i < 3; i++) {
    g_string_append(s, lorem[pp_gen_rng_int(rng, 0, G_N_ELEMENTS(lorem) - 1)]);
    g_string_append_c(s, ' ');
  }
  pp_gen_font(cr, 9, FALSE);
  cairo_set_source_rgb(cr, 0.25, 0.25, 0.25);
  pp_gen_text_wrap(cr, s->str, x, y, w, 9, 12);
  g_string_free(s, TRUE);
}

/* Rounds to a number of decimals so printed labels equal the truth values. */
static double round_to(double v, int decimals) {
  double p = pow(10, decimals);
  return round(v * p) / p;
}

static void gen_series(pp_gen_rng *rng, double *out, int n, double base, double trend, double noise,
                       int decimals) {
  for (int i = 0; i < n; i++) {
    double t = n > 1 ? (double)i / (n - 1) : 0;
    out[i] =
        round_to(base * (1 + trend * t) * (1 + pp_gen_rng_uniform(rng, -noise, noise)), decimals);
  }
}

static pp_gen_doc *begin(gen_ctx *ctx, const char *name, double w, double h, pp_gen_rng *rng) {
  guint64 seed = SEED + ctx->next_seed++;
  pp_gen_rng_init(rng, seed);
  pp_gen_doc *d = pp_gen_doc_new(ctx->out_dir, ctx->rel_dir, name, seed, w, h, name);
  cairo_set_source_rgb(d->cr, 1, 1, 1);
  cairo_paint(d->cr);
  return d;
}

static void finish(gen_ctx *ctx, pp_gen_doc *d) {
  if (!ctx->error && !pp_gen_doc_finish(d, &ctx->error))
    g_prefix_error(&ctx->error, "writing: ");
  ctx->files++;
  pp_gen_doc_free(d);
}

static void page_heading(cairo_t *cr, const char *text, double w) {
  pp_gen_font(cr, 14, TRUE);
  cairo_set_source_rgb(cr, 0.1, 0.1, 0.15);
  pp_gen_text_at(cr, text, 60, 50, 0, 0);
  cairo_set_line_width(cr, 0.5);
  cairo_move_to(cr, 60, 74);
  cairo_line_to(cr, w - 60, 74);
  cairo_stroke(cr);
}

/* One chart per A4 page with heading and caption; the chart is a template
 * whose axis is fitted per variant. */
typedef struct {
  const char *name;
  const char *title;
  pp_gen_chart chart;
  double base, trend, noise;
  int value_decimals;
  int variants;
  const char *extra_style;
} single_spec;

static void place_single(pp_gen_chart *c) {
  if (c->horizontal) {
    c->x = 170;
    c->w = 350;
  } else {
    c->x = 100;
    c->w = 420;
  }
  c->y = 140;
  c->h = c->rotated ? 240 : 280;
}

static void gen_single(gen_ctx *ctx, const single_spec *spec) {
  static const struct {
    int bit;
    const char *suffix;
    double frac;
  } var[] = {{V_HONEST, "honest", 0}, {V_MILD, "mild", 0.5}, {V_SEVERE, "severe", 0.9}};
  for (int k = 0; k < 3; k++) {
    if (!(spec->variants & var[k].bit))
      continue;
    char *name = g_strdup_printf("%s-%s", spec->name, var[k].suffix);
    pp_gen_rng rng;
    pp_gen_doc *d = begin(ctx, name, A4_W, A4_H, &rng);
    pp_gen_chart c = spec->chart;
    int ns = c.n_series > 0 ? c.n_series : 1;
    double *vals = g_new0(double, c.n *ns);
    for (int s = 0; s < ns; s++)
      gen_series(&rng, vals + s * c.n, c.n, spec->base * (1 - 0.25 * s), spec->trend, spec->noise,
                 spec->value_decimals);
    c.values = vals;
    c.title = spec->title;
    place_single(&c);
    pp_gen_chart_fit_axis(&c, var[k].frac);
    if (c.bar_style == PP_GEN_BAR_CLIPPED)
      c.bar_from = 0;
    page_heading(d->cr, spec->title, A4_W);
    pp_gen_chart_draw(d->cr, &c);
    caption(d->cr, &rng, 60, c.y + c.h + (c.rotated ? 90 : 50), A4_W - 120);
    pp_gen_figure *f = pp_gen_chart_truth(&c, d->truth, 1);
    if (spec->extra_style)
      pp_gen_figure_add_style(f, spec->extra_style);
    if (var[k].frac > 0)
      pp_gen_figure_add_style(f, var[k].suffix);
    finish(ctx, d);
    g_free(vals);
    g_free(name);
  }
}

#define CH(...) ((pp_gen_chart){__VA_ARGS__}) /* n_series 0 means one series */

static void gen_singles(gen_ctx *ctx) {
  const single_spec specs[] = {
      {"col-rect", "Net revenue (NOK m)", CH(.n = 6, .cats = years), 420, 0.6, 0.05, 0, V_ALL,
       NULL},
      {"bar-path4", "Orders by region",
       CH(.n = 5, .cats = regions, .horizontal = TRUE, .bar_style = PP_GEN_BAR_PATH4), 300, 0.5,
       0.08, 0, V_ALL, NULL},
      {"col-edges", "Vessel calls per quarter",
       CH(.n = 8, .cats = quarters, .bar_style = PP_GEN_BAR_FILL_STROKE, .gridlines = TRUE), 140,
       0.4, 0.06, 0, V_ALL, NULL},
      {"col-clipped", "Tonnes handled (thousand)",
       CH(.n = 6, .cats = years, .bar_style = PP_GEN_BAR_CLIPPED, .gridlines = TRUE), 82, 0.3, 0.04,
       0, V_ALL, NULL},
      {"bar-clipped", "Berth utilisation hours",
       CH(.n = 5, .cats = regions, .horizontal = TRUE, .bar_style = PP_GEN_BAR_CLIPPED), 640, 0.35,
       0.05, 0, V_ALL, NULL},
      {"area-fill", "Fuel use (kilotonnes)",
       CH(.n = 8, .cats = quarters, .mark = PP_GEN_MARK_AREA, .gridlines = TRUE), 56, 0.3, 0.06, 0,
       V_ALL, NULL},
      {"fmt-thousands", "Passengers per day",
       CH(.n = 6, .cats = years, .fmt = PP_GEN_FMT_THOUSANDS, .gridlines = TRUE), 1250, 0.5, 0.05,
       0, V_ALL, NULL},
      {"fmt-currency", "Operating profit",
       CH(.n = 6, .cats = years, .fmt = PP_GEN_FMT_CURRENCY_M, .bar_style = PP_GEN_BAR_PATH4), 1.2,
       0.6, 0.05, 1, V_ALL, NULL},
      {"fmt-percent", "On-time departures",
       CH(.n = 5, .cats = regions, .horizontal = TRUE, .fmt = PP_GEN_FMT_PERCENT,
          .gridlines = TRUE),
       72, 0.2, 0.04, 0, V_ALL, NULL},
      {"fmt-decimal-comma", "Ladetid i timer",
       CH(.n = 6, .cats = years, .fmt = PP_GEN_FMT_DECIMAL_COMMA,
          .bar_style = PP_GEN_BAR_FILL_STROKE),
       2.5, 0.4, 0.05, 1, V_ALL, NULL},
      {"rotated", "Fleet availability by vessel class",
       CH(.n = 7, .cats = products, .rotated = TRUE, .gridlines = TRUE), 310, 0.3, 0.15, 0,
       V_HONEST | V_MILD, NULL},
      {"alpha", "Cargo volume (TEU thousand)",
       CH(.n = 6, .cats = years, .alpha = 0.55, .gridlines = TRUE), 48, 0.5, 0.05, 0,
       V_HONEST | V_SEVERE, NULL},
      {"gradient", "Charter income (NOK m)", CH(.n = 5, .cats = regions, .gradient = TRUE), 210,
       0.4, 0.1, 0, V_HONEST | V_MILD, NULL},
      {"gradient-bar", "Maintenance spend (NOK m)",
       CH(.n = 5, .cats = regions, .gradient = TRUE, .horizontal = TRUE), 95, 0.5, 0.1, 0, V_SEVERE,
       NULL},
      {"stacked", "Revenue by segment (NOK m)",
       CH(.n = 6, .cats = years, .n_series = 3, .stacked = TRUE,
          .series_names = (const char *const[]){"Freight", "Passenger", "Services"}),
       180, 0.4, 0.05, 0, V_HONEST | V_MILD, NULL},
      {"grouped", "Crew hours by region (thousand)",
       CH(.n = 5, .cats = regions, .n_series = 2,
          .series_names = (const char *const[]){"2030", "2031"}, .gridlines = TRUE),
       66, 0.3, 0.08, 0, V_HONEST | V_SEVERE, NULL},
  };
  for (gsize i = 0; i < G_N_ELEMENTS(specs); i++)
    gen_single(ctx, &specs[i]);
}

/* 60 thin bars: daily sailings over two months. */
static void gen_many_bars(gen_ctx *ctx) {
  char cat_buf[60][8];
  const char *cats[60];
  for (int i = 0; i < 60; i++) {
    g_snprintf(cat_buf[i], sizeof cat_buf[i], "%d", i + 1);
    cats[i] = cat_buf[i];
  }
  for (int severe = 0; severe < 2; severe++) {
    pp_gen_rng rng;
    pp_gen_doc *d = begin(ctx, severe ? "many-bars-severe" : "many-bars-honest", A4_W, A4_H, &rng);
    double vals[60];
    for (int i = 0; i < 60; i++)
      vals[i] = round(200 + 40 * sin(i / 6.0) + pp_gen_rng_uniform(&rng, -15, 15) + i);
    pp_gen_chart c = CH(.n = 60, .cats = cats, .values = vals, .label_every = 5,
                        .title = "Daily sailings, day of period", .x = 80, .y = 140, .w = 450,
                        .h = 260, .gridlines = TRUE);
    pp_gen_chart_fit_axis(&c, severe ? 0.9 : 0);
    page_heading(d->cr, "Daily sailings", A4_W);
    pp_gen_chart_draw(d->cr, &c);
    caption(d->cr, &rng, 60, 440, A4_W - 120);
    pp_gen_figure *f = pp_gen_chart_truth(&c, d->truth, 1);
    if (severe)
      pp_gen_figure_add_style(f, "severe");
    finish(ctx, d);
  }
}

static void gen_log_charts(gen_ctx *ctx) {
  static const double col_vals[] = {12, 85, 420, 2600, 9100};
  static const char *col_cats[] = {"Kiosk", "Café", "Shop", "Charter", "Freight"};
  static const double line_vals[] = {3, 14, 55, 240, 900, 3100};
  for (int k = 0; k < 3; k++) {
    static const char *names[] = {"log-column", "log-bar", "log-line"};
    pp_gen_rng rng;
    pp_gen_doc *d = begin(ctx, names[k], A4_W, A4_H, &rng);
    pp_gen_chart c = CH(.n = 5, .cats = col_cats, .values = col_vals, .log_axis = TRUE,
                        .axis_min = 1, .axis_max = 10000, .bar_from = 1, .gridlines = TRUE,
                        .title = "Revenue by business line (NOK thousand, log scale)");
    if (k == 1)
      c.horizontal = TRUE;
    if (k == 2) {
      c = CH(.n = 6, .cats = years, .values = line_vals, .log_axis = TRUE, .axis_min = 1,
             .axis_max = 10000, .mark = PP_GEN_MARK_LINE, .markers = TRUE, .gridlines = TRUE,
             .title = "Digital bookings (log scale)");
    }
    place_single(&c);
    page_heading(d->cr, c.title, A4_W);
    pp_gen_chart_draw(d->cr, &c);
    caption(d->cr, &rng, 60, c.y + c.h + 50, A4_W - 120);
    pp_gen_chart_truth(&c, d->truth, 1);
    finish(ctx, d);
  }
}

/* Bars with printed value labels and no value axis; two of three draw
 * lengths that do not match their labels. */
static void gen_label_charts(gen_ctx *ctx) {
  static const double labels_v[] = {52, 55, 58, 61, 64};
  static const char *names[] = {"labels-column-disagree", "labels-bar-disagree",
                                "labels-bar-agree"};
  for (int k = 0; k < 3; k++) {
    pp_gen_rng rng;
    pp_gen_doc *d = begin(ctx, names[k], A4_W, A4_H, &rng);
    double drawn[5];
    /* Drawn as if from 80% of the smallest label, rescaled so the largest
     * bar matches its label: the visual growth is exaggerated. */
    double from = 0.8 * labels_v[0];
    for (int i = 0; i < 5; i++)
      drawn[i] = round_to((labels_v[i] - from) * labels_v[4] / (labels_v[4] - from), 3);
    pp_gen_chart c = CH(.n = 5, .cats = regions, .values = labels_v, .data_labels = TRUE,
                        .hide_value_axis = TRUE, .axis_min = 0, .axis_max = 70, .bar_from = 0,
                        .horizontal = k > 0, .drawn = k < 2 ? drawn : NULL,
                        .title = "Customer satisfaction score");
    place_single(&c);
    page_heading(d->cr, c.title, A4_W);
    pp_gen_chart_draw(d->cr, &c);
    caption(d->cr, &rng, 60, c.y + c.h + 50, A4_W - 120);
    pp_gen_chart_truth(&c, d->truth, 1);
    finish(ctx, d);
  }
}

static void gen_negative(gen_ctx *ctx) {
  static const double vals[] = {-32, 18, -12, 41, 27, -8};
  for (int k = 0; k < 2; k++) {
    pp_gen_rng rng;
    pp_gen_doc *d = begin(ctx, k ? "negative-floor" : "negative-honest", A4_W, A4_H, &rng);
    pp_gen_chart c =
        CH(.n = 6, .cats = years, .values = vals, .axis_min = -40, .axis_max = 50, .tick_step = 10,
           .bar_from = k ? -40 : 0, .gridlines = TRUE, .title = "Net cash flow (NOK m)");
    place_single(&c);
    page_heading(d->cr, c.title, A4_W);
    pp_gen_chart_draw(d->cr, &c);
    caption(d->cr, &rng, 60, c.y + c.h + 50, A4_W - 120);
    pp_gen_figure *f = pp_gen_chart_truth(&c, d->truth, 1);
    if (k)
      pp_gen_figure_set_note(f, "bars rise from the frame floor (-40) instead of from zero");
    finish(ctx, d);
  }
}

static void gen_lines_bands(gen_ctx *ctx) {
  static const char *const route_names[] = {"Day routes", "Night routes"};
  for (int k = 0; k < 5; k++) {
    static const char *names[] = {"line-truncated", "line-truncated-grid", "line-zero",
                                  "band-truncated", "band-zero"};
    pp_gen_rng rng;
    pp_gen_doc *d = begin(ctx, names[k], A4_W, A4_H, &rng);
    double vals[16], lower[8];
    gen_series(&rng, vals, 8, 480, 0.25, 0.03, 0);
    gen_series(&rng, vals + 8, 8, 400, 0.2, 0.03, 0);
    for (int i = 0; i < 8; i++)
      lower[i] = vals[i] - round(40 + pp_gen_rng_uniform(&rng, 0, 30));
    pp_gen_chart c = CH(.n = 8, .cats = quarters, .values = vals, .mark = PP_GEN_MARK_LINE,
                        .title = "Average fare (NOK)");
    if (k == 0)
      c.markers = TRUE;
    if (k == 1) {
      c.gridlines = TRUE;
      c.n_series = 2;
      c.series_names = route_names;
    }
    if (k >= 3) {
      c.mark = PP_GEN_MARK_BAND;
      c.lower = lower;
      c.title = "Fare range, lowest to highest (NOK)";
    }
    place_single(&c);
    pp_gen_chart_fit_axis(&c, (k == 2 || k == 4) ? 0 : 0.8);
    page_heading(d->cr, c.title, A4_W);
    pp_gen_chart_draw(d->cr, &c);
    caption(d->cr, &rng, 60, c.y + c.h + 50, A4_W - 120);
    pp_gen_chart_truth(&c, d->truth, 1);
    finish(ctx, d);
  }
}

/* Two charts on one page: one honest and one truncated twin, then a line
 * above a truncated area. */
static void gen_two_per_page(gen_ctx *ctx) {
  for (int k = 0; k < 2; k++) {
    pp_gen_rng rng;
    pp_gen_doc *d = begin(ctx, k ? "two-charts-line-area" : "two-charts-columns", A4_W, A4_H, &rng);
    double a[6], b[6];
    gen_series(&rng, a, 6, 260, 0.5, 0.05, 0);
    gen_series(&rng, b, 6, 90, 0.3, 0.05, 0);
    pp_gen_chart c1 = CH(.n = 6, .cats = years, .values = a, .x = 100, .y = 120, .w = 420, .h = 220,
                         .title = "Gross tonnage transported (thousand t)");
    pp_gen_chart c2 = CH(.n = 6, .cats = years, .values = b, .x = 100, .y = 480, .w = 420, .h = 220,
                         .title = "Ticket revenue (NOK m)", .bar_style = PP_GEN_BAR_PATH4);
    if (k) {
      c1.mark = PP_GEN_MARK_LINE;
      c1.markers = TRUE;
      c2.mark = PP_GEN_MARK_AREA;
    }
    pp_gen_chart_fit_axis(&c1, k ? 0.7 : 0);
    pp_gen_chart_fit_axis(&c2, k ? 0.6 : 0.9);
    page_heading(d->cr, "Operating review", A4_W);
    pp_gen_chart_draw(d->cr, &c1);
    pp_gen_chart_draw(d->cr, &c2);
    caption(d->cr, &rng, 60, 380, A4_W - 120);
    caption(d->cr, &rng, 60, 740, A4_W - 120);
    pp_gen_figure_add_style(pp_gen_chart_truth(&c1, d->truth, 1), "multi-chart-page");
    pp_gen_figure_add_style(pp_gen_chart_truth(&c2, d->truth, 1), "multi-chart-page");
    finish(ctx, d);
  }
}

static double text_block(cairo_t *cr, pp_gen_rng *rng, double x, double y, double w, int paras) {
  pp_gen_font(cr, 10, FALSE);
  cairo_set_source_rgb(cr, 0.1, 0.1, 0.1);
  for (int p = 0; p < paras; p++) {
    GString *s = g_string_new(NULL);
    int n = pp_gen_rng_int(rng, 4, 7);
    for (int i = 0; i < n; i++) {
      g_string_append(s, lorem[pp_gen_rng_int(rng, 0, G_N_ELEMENTS(lorem) - 1)]);
      g_string_append_printf(s, " Volumes in 2031 reached %d,%03d units. ",
                             pp_gen_rng_int(rng, 1, 9), pp_gen_rng_int(rng, 0, 999));
    }
    y = pp_gen_text_wrap(cr, s->str, x, y, w, 10, 13.5) + 8;
    g_string_free(s, TRUE);
  }
  return y;
}

static void add_block(pp_gen_truth *t, int page, const char *kind, double x, double y, double w,
                      double h, const char *note) {
  pp_gen_figure *f = pp_gen_truth_add(t, page, kind);
  pp_gen_figure_set_bbox(f, x, y, w, h);
  pp_gen_figure_set_note(f, note);
}

static double draw_table(cairo_t *cr, pp_gen_rng *rng, double x, double y, double w) {
  static const char *head[] = {"NOK m", "2027", "2028", "2029", "2030", "2031"};
  static const char *rows[] = {"Revenue",          "Operating costs",  "EBITDA",
                               "Depreciation",     "Operating profit", "Net finance",
                               "Profit before tax"};
  double row_h = 18, col0 = 150, colw = (w - col0) / 5;
  pp_gen_font(cr, 9, TRUE);
  cairo_set_source_rgb(cr, 0.1, 0.1, 0.1);
  for (int j = 0; j < 6; j++)
    pp_gen_text_at(cr, head[j], j ? x + col0 + colw * j - 6 : x + 4, y + row_h / 2, j ? 1 : 0, 0.5);
  pp_gen_font(cr, 9, FALSE);
  for (int i = 0; i < (int)G_N_ELEMENTS(rows); i++) {
    double ry = y + row_h * (i + 1);
    pp_gen_text_at(cr, rows[i], x + 4, ry + row_h / 2, 0, 0.5);
    for (int j = 1; j < 6; j++) {
      char buf[32];
      pp_gen_format(pp_gen_rng_uniform(rng, 80, 2400), PP_GEN_FMT_THOUSANDS, 1, buf, sizeof buf);
      pp_gen_text_at(cr, buf, x + col0 + colw * j - 6, ry + row_h / 2, 1, 0.5);
    }
  }
  double bottom = y + row_h * (G_N_ELEMENTS(rows) + 1);
  cairo_set_line_width(cr, 0.6);
  for (int i = 0; i <= (int)G_N_ELEMENTS(rows) + 1; i++) {
    cairo_set_line_width(cr, i <= 1 || i == (int)G_N_ELEMENTS(rows) + 1 ? 1.0 : 0.4);
    cairo_move_to(cr, x, y + row_h * i);
    cairo_line_to(cr, x + w, y + row_h * i);
    cairo_stroke(cr);
  }
  return bottom;
}

static void gen_text_table_raster(gen_ctx *ctx) {
  pp_gen_rng rng;
  pp_gen_doc *d = begin(ctx, "text-page", A4_W, A4_H, &rng);
  page_heading(d->cr, "Report of the board", A4_W);
  double end = text_block(d->cr, &rng, 60, 90, A4_W - 120, 7);
  add_block(d->truth, 1, "text", 60, 90, A4_W - 120, end - 90, "body text only, no chart");
  finish(ctx, d);

  d = begin(ctx, "table-page", A4_W, A4_H, &rng);
  page_heading(d->cr, "Five-year summary", A4_W);
  end = draw_table(d->cr, &rng, 60, 100, A4_W - 120);
  add_block(d->truth, 1, "table", 60, 100, A4_W - 120, end - 100,
            "ruled table with numbers; rules are strokes, not bars");
  text_block(d->cr, &rng, 60, end + 30, A4_W - 120, 2);
  finish(ctx, d);

  /* Chart rendered to pixels first: nothing vector remains to measure. */
  d = begin(ctx, "raster-chart", A4_W, A4_H, &rng);
  page_heading(d->cr, "Charter days (image)", A4_W);
  double vals[6];
  gen_series(&rng, vals, 6, 300, 0.4, 0.05, 0);
  int scale = 2, iw = 440 * scale, ih = 320 * scale;
  cairo_surface_t *img = cairo_image_surface_create(CAIRO_FORMAT_RGB24, iw, ih);
  cairo_t *icr = cairo_create(img);
  cairo_set_source_rgb(icr, 1, 1, 1);
  cairo_paint(icr);
  cairo_scale(icr, scale, scale);
  pp_gen_chart c = CH(.n = 6, .cats = years, .values = vals, .x = 50, .y = 30, .w = 370, .h = 250,
                      .title = "Charter days", .gridlines = TRUE);
  pp_gen_chart_fit_axis(&c, 0);
  pp_gen_chart_draw(icr, &c);
  cairo_destroy(icr);
  cairo_save(d->cr);
  cairo_translate(d->cr, 80, 110);
  cairo_scale(d->cr, 1.0 / scale, 1.0 / scale);
  cairo_set_source_surface(d->cr, img, 0, 0);
  cairo_paint(d->cr);
  cairo_restore(d->cr);
  cairo_surface_destroy(img);
  pp_gen_figure *f = pp_gen_truth_add(d->truth, 1, "raster");
  pp_gen_figure_set_bbox(f, 80, 110, 440, 320);
  /* docs/corpus.md: raster figures carry no values; record them in the note. */
  GString *note = g_string_new("zero-based column chart painted as an RGB image; values:");
  for (int i = 0; i < 6; i++)
    g_string_append_printf(note, " %s=%g", years[i], vals[i]);
  pp_gen_figure_set_note(f, note->str);
  g_string_free(note, TRUE);
  caption(d->cr, &rng, 60, 460, A4_W - 120);
  finish(ctx, d);
}

/* A three-page document: text, a chart page, a table page. */
static void gen_mini_report(gen_ctx *ctx) {
  pp_gen_rng rng;
  pp_gen_doc *d = begin(ctx, "mini-report", A4_W, A4_H, &rng);
  page_heading(d->cr, "Quarterly letter", A4_W);
  double end = text_block(d->cr, &rng, 60, 90, A4_W - 120, 5);
  add_block(d->truth, 1, "text", 60, 90, A4_W - 120, end - 90, "body text only");
  pp_gen_doc_next_page(d);
  page_heading(d->cr, "Key figures", A4_W);
  double vals[4];
  gen_series(&rng, vals, 4, 760, 0.2, 0.03, 0);
  pp_gen_chart c =
      CH(.n = 4, .cats = quarters + 4, .values = vals, .x = 100, .y = 120, .w = 400, .h = 240,
         .title = "Bookings (thousand)", .bar_style = PP_GEN_BAR_FILL_STROKE, .data_labels = TRUE);
  pp_gen_chart_fit_axis(&c, 0.9);
  pp_gen_chart_draw(d->cr, &c);
  pp_gen_chart_truth(&c, d->truth, 2);
  pp_gen_doc_next_page(d);
  page_heading(d->cr, "Income statement", A4_W);
  end = draw_table(d->cr, &rng, 60, 100, A4_W - 120);
  add_block(d->truth, 3, "table", 60, 100, A4_W - 120, end - 100, "ruled table with numbers");
  finish(ctx, d);
}

int main(int argc, char **argv) {
  gen_ctx ctx = {.out_dir = argc > 1 ? argv[1] : "corpus/cairo", .rel_dir = "corpus/cairo"};
  if (g_mkdir_with_parents(ctx.out_dir, 0755) != 0) {
    fprintf(stderr, "gen-corpus-cairo: cannot create %s\n", ctx.out_dir);
    return 1;
  }
  gen_singles(&ctx);
  gen_many_bars(&ctx);
  gen_log_charts(&ctx);
  gen_label_charts(&ctx);
  gen_negative(&ctx);
  gen_lines_bands(&ctx);
  gen_two_per_page(&ctx);
  gen_text_table_raster(&ctx);
  gen_mini_report(&ctx);
  if (ctx.error) {
    fprintf(stderr, "gen-corpus-cairo: %s\n", ctx.error->message);
    g_error_free(ctx.error);
    return 1;
  }
  printf("gen-corpus-cairo: wrote %d PDFs to %s\n", ctx.files, ctx.out_dir);
  return 0;
}
