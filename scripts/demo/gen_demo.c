/* Generates corpus/demo/fjordhaven-annual-report-2031.pdf, a 20-page annual
 * report of an invented ferry operator, and its truth JSON (one entry per
 * chart, photo, table and text block). Usage: gen-demo [OUT_DIR] [--draft2]
 * --draft2 writes <name>-draft2.pdf, a later draft for `plotproof compare`: one page
 * inserted after the letter (every later figure moves a page), the fuel chart fixed
 * (axis from 0), the 2031 revenue restated, and a new truncated operating-profit chart. */
#include <math.h>
#include <stdio.h>

#include "cairo_chart.h"
#include "cairo_doc.h"
#include "cairo_rng.h"
#include "cairo_text.h"
#include "demo_photo.h"
#include "demo_prose.h"
#include "demo_shapes.h"

#define SEED G_GUINT64_CONSTANT(2031)
#define PAGE_W 595.0
#define PAGE_H 842.0
#define MARGIN 56.0
#define CONTENT_W (PAGE_W - 2 * MARGIN)
#define COMPANY "Fjordhaven Coastal Lines ASA"
#define NAME "fjordhaven-annual-report-2031"

static gboolean draft2; /* see the usage above */

typedef struct {
  pp_gen_doc *doc;
  cairo_t *cr;
  pp_gen_rng rng;
  int photo_seq;
} demo;

static const double navy[3] = {0.07, 0.18, 0.33};
static const char *years5[] = {"2027", "2028", "2029", "2030", "2031"};
static const char *years6[] = {"2026", "2027", "2028", "2029", "2030", "2031"};
static const char *regions[] = {"Nordvik", "Eastmarch", "Solbakken", "Harrowgate", "Lowfield"};

static void set_rgb(cairo_t *cr, const double *rgb) {
  cairo_set_source_rgb(cr, rgb[0], rgb[1], rgb[2]);
}

static void page_frame(demo *d, const char *section) {
  cairo_t *cr = d->cr;
  cairo_set_source_rgb(cr, 1, 1, 1);
  cairo_paint(cr);
  char num[16];
  g_snprintf(num, sizeof num, "%d", d->doc->page);
  pp_gen_font(cr, 7.5, FALSE);
  cairo_set_source_rgb(cr, 0.4, 0.4, 0.45);
  pp_gen_text_at(cr, COMPANY " | Annual Report 2031", MARGIN, PAGE_H - 30, 0, 1);
  pp_gen_text_at(cr, num, PAGE_W - MARGIN, PAGE_H - 30, 1, 1);
  if (section) {
    pp_gen_text_at(cr, section, PAGE_W - MARGIN, 28, 1, 1);
    set_rgb(cr, navy);
    cairo_rectangle(cr, MARGIN, 20, 24, 4);
    cairo_fill(cr);
  }
}

static void next_page(demo *d, const char *section) {
  pp_gen_doc_next_page(d->doc);
  page_frame(d, section);
}

static double heading(demo *d, const char *text, double y) {
  pp_gen_font(d->cr, 18, TRUE);
  set_rgb(d->cr, navy);
  pp_gen_text_at(d->cr, text, MARGIN, y, 0, 0);
  return y + 34;
}

static void add_block(demo *d, const char *kind, double x, double y, double w, double h,
                      const char *note) {
  pp_gen_figure *f = pp_gen_truth_add(d->doc->truth, d->doc->page, kind);
  pp_gen_figure_set_bbox(f, x, y, w, h);
  pp_gen_figure_set_note(f, note);
}

/* Paragraphs of invented prose; records one text block in the truth. */
static double body(demo *d, double x, double y, double w, int paras) {
  double top = y;
  pp_gen_font(d->cr, 9.5, FALSE);
  cairo_set_source_rgb(d->cr, 0.12, 0.12, 0.14);
  for (int p = 0; p < paras; p++) {
    char *text = pp_demo_prose_paragraph(&d->rng, pp_gen_rng_int(&d->rng, 4, 6));
    y = pp_gen_text_wrap(d->cr, text, x, y, w, 9.5, 13.5) + 7;
    g_free(text);
  }
  add_block(d, "text", x, top, w, y - top - 7, "body text paragraphs");
  return y;
}

static void photo(demo *d, pp_demo_photo kind, double x, double y, double w, double h,
                  const char *caption) {
  pp_demo_photo_paint(d->cr, kind, SEED * 100 + (guint64)d->photo_seq++, x, y, w, h, 1.25);
  add_block(d, "raster", x, y, w, h, "procedurally drawn photo painted as an image; not a chart");
  if (caption) {
    pp_gen_font(d->cr, 7.5, FALSE);
    cairo_set_source_rgb(d->cr, 0.35, 0.35, 0.4);
    pp_gen_text_at(d->cr, caption, x, y + h + 5, 0, 0);
  }
}

static pp_gen_figure *chart(demo *d, pp_gen_chart *c) {
  pp_gen_chart_draw(d->cr, c);
  return pp_gen_chart_truth(c, d->doc->truth, d->doc->page);
}

/* Ruled table: cells are row-major, row 0 is the header; numbers right-aligned. */
static double table(demo *d, double x, double y, double w, int rows, int cols,
                    const char *const *cells, double first_col_w) {
  cairo_t *cr = d->cr;
  double row_h = 17, colw = (w - first_col_w) / (cols - 1);
  for (int r = 0; r < rows; r++) {
    double cy = y + r * row_h + row_h / 2;
    pp_gen_font(cr, 8.5, r == 0);
    cairo_set_source_rgb(cr, 0.1, 0.1, 0.12);
    for (int c = 0; c < cols; c++) {
      const char *s = cells[r * cols + c];
      if (c == 0)
        pp_gen_text_at(cr, s, x + 3, cy, 0, 0.5);
      else
        pp_gen_text_at(cr, s, x + first_col_w + colw * c - 4, cy, 1, 0.5);
    }
    cairo_set_line_width(cr, r == 0 || r == 1 ? 0.9 : 0.3);
    set_rgb(cr, r <= 1 ? navy : (double[]){0.6, 0.6, 0.65});
    cairo_move_to(cr, x, y + r * row_h);
    cairo_line_to(cr, x + w, y + r * row_h);
    cairo_stroke(cr);
  }
  double bottom = y + rows * row_h;
  set_rgb(cr, navy);
  cairo_set_line_width(cr, 0.9);
  cairo_move_to(cr, x, bottom);
  cairo_line_to(cr, x + w, bottom);
  cairo_stroke(cr);
  add_block(d, "table", x, y, w, bottom - y, "ruled table with numbers");
  return bottom;
}

static void chart_caption(demo *d, const char *text, double x, double y, double w) {
  pp_gen_font(d->cr, 7.5, FALSE);
  cairo_set_source_rgb(d->cr, 0.35, 0.35, 0.4);
  pp_gen_text_wrap(d->cr, text, x, y, w, 7.5, 10);
}

static void page_cover(demo *d) {
  cairo_t *cr = d->cr;
  cairo_set_source_rgb(cr, 1, 1, 1);
  cairo_paint(cr);
  photo(d, PP_DEMO_PHOTO_FJORD, 0, 0, PAGE_W, 520, NULL);
  set_rgb(cr, navy);
  cairo_rectangle(cr, 0, 520, PAGE_W, PAGE_H - 520);
  cairo_fill(cr);
  cairo_set_source_rgb(cr, 1, 1, 1);
  pp_gen_font(cr, 13, FALSE);
  pp_gen_text_at(cr, COMPANY, MARGIN, 570, 0, 0);
  pp_gen_font(cr, 38, TRUE);
  pp_gen_text_at(cr, "Annual Report 2031", MARGIN, 600, 0, 0);
  pp_gen_font(cr, 12, FALSE);
  cairo_set_source_rgb(cr, 0.75, 0.83, 0.92);
  pp_gen_text_at(cr, "Connecting the coast, one crossing at a time", MARGIN, 660, 0, 0);
  pp_gen_font(cr, 7.5, FALSE);
  pp_gen_text_at(cr,
                 "A fictional company. All names and figures are invented for software testing.",
                 MARGIN, 780, 0, 0);
  pp_gen_text_at(cr, "1", PAGE_W - MARGIN, PAGE_H - 30, 1, 1);
}

static void page_contents(demo *d) {
  next_page(d, "Contents");
  double y = heading(d, "Contents", 60);
  static const char *toc[] = {"Letter from the chair",
                              "3",
                              "Chief executive's review",
                              "5",
                              "Financial highlights",
                              "6",
                              "Operations",
                              "7",
                              "Markets",
                              "8",
                              "Our fleet",
                              "9",
                              "Sustainability",
                              "10",
                              "People",
                              "11",
                              "Five-year summary",
                              "12",
                              "Segments",
                              "13",
                              "Risk management",
                              "14",
                              "Shareholder information",
                              "15",
                              "Financial statements",
                              "16",
                              "Notes",
                              "18",
                              "Governance",
                              "19"};
  pp_gen_font(d->cr, 10, FALSE);
  cairo_set_source_rgb(d->cr, 0.15, 0.15, 0.2);
  for (gsize i = 0; i < G_N_ELEMENTS(toc); i += 2) {
    pp_gen_text_at(d->cr, toc[i], MARGIN, y, 0, 0);
    pp_gen_text_at(d->cr, toc[i + 1], MARGIN + 240, y, 1, 0);
    y += 17;
  }
  add_block(d, "text", MARGIN, 94, 240, y - 94, "table of contents");
  y = heading(d, "2031 at a glance", y + 30);
  static const char *cells[] = {
      "Key figures",
      "2030",
      "2031",
      "Change",
      "Revenue (EUR m)",
      "134.7",
      "140.2",
      "+4.1%",
      "Operating profit (EUR m)",
      "12.4",
      "13.7",
      "+10.5%",
      "Passengers (thousand)",
      "4,820",
      "5,135",
      "+6.5%",
      "Freight (thousand t)",
      "2,115",
      "2,240",
      "+5.9%",
      "Vessels in service",
      "31",
      "33",
      "+2",
      "Employees",
      "1,006",
      "1,042",
      "+3.6%",
      "Fuel use (kt)",
      "53.0",
      "50.4",
      "-4.9%",
  };
  table(d, MARGIN, y, CONTENT_W, 8, 4, cells, 200);
}

static void page_letter(demo *d) {
  next_page(d, "Letter from the chair");
  double y = heading(d, "Letter from the chair", 60);
  pp_gen_font(d->cr, 12, FALSE);
  set_rgb(d->cr, navy);
  y = pp_gen_text_wrap(d->cr,
                       "A year in which the coast kept moving: more passengers, more freight and "
                       "a cleaner fleet than at any time in our history.",
                       MARGIN, y, CONTENT_W, 12, 16) +
      14;
  y = body(d, MARGIN, y, CONTENT_W, 7);
  next_page(d, "Letter from the chair");
  y = body(d, MARGIN, 60, CONTENT_W, 4);
  pp_gen_font(d->cr, 9.5, FALSE);
  cairo_set_source_rgb(d->cr, 0.12, 0.12, 0.14);
  pp_gen_text_at(d->cr, "Ingrid Solvang-Marrow, Chair of the Board (a fictional person)", MARGIN,
                 y + 6, 0, 0);
  photo(d, PP_DEMO_PHOTO_DUSK, MARGIN, y + 40, CONTENT_W, 300,
        "Evening departure from Solbakken terminal.");
}

static void page_ceo(demo *d) {
  next_page(d, "Chief executive's review");
  double y = heading(d, "Chief executive's review", 60);
  y = body(d, MARGIN, y, CONTENT_W, 4);
  /* Misleading: severe truncation makes 19% growth look like a fourfold rise. */
  static const double rev1[] = {118.2, 123.6, 129.1, 134.7, 140.2};
  static const double rev2[] = {118.2, 123.6, 129.1, 134.7, 141.0};
  const double *rev = draft2 ? rev2 : rev1;
  pp_gen_chart c = {.title = "Revenue (EUR m)",
                    .n = 5,
                    .cats = years5,
                    .values = rev,
                    .x = MARGIN + 60,
                    .y = y + 30,
                    .w = CONTENT_W - 80,
                    .h = 220,
                    .fmt = PP_GEN_FMT_CURRENCY_M,
                    .gridlines = TRUE,
                    .data_labels = TRUE};
  pp_gen_chart_fit_axis(&c, 0.9);
  c.label_decimals = 1;
  chart(d, &c);
  chart_caption(d, "Revenue grew for the fifth consecutive year.", MARGIN, c.y + c.h + 24,
                CONTENT_W);
}

static void page_highlights(demo *d) {
  next_page(d, "Financial highlights");
  double y = heading(d, "Financial highlights", 60);
  static const double margin_pct[] = {8.1, 8.6, 7.9, 9.2, 9.8, 10.4};
  pp_gen_chart l = {.title = "EBIT margin (%)",
                    .n = 6,
                    .cats = years6,
                    .values = margin_pct,
                    .mark = PP_GEN_MARK_LINE,
                    .markers = TRUE,
                    .gridlines = TRUE,
                    .x = MARGIN + 40,
                    .y = y + 20,
                    .w = CONTENT_W - 50,
                    .h = 190,
                    .fmt = PP_GEN_FMT_PERCENT};
  pp_gen_chart_fit_axis(&l, 0.85);
  chart(d, &l);
  double y2 = l.y + l.h + 75;
  static const double op[] = {9.6, 10.6, 10.2, 12.4, 13.7};
  pp_gen_chart a = {.title = "Operating profit",
                    .n = 5,
                    .cats = years5,
                    .values = op,
                    .x = MARGIN + 40,
                    .y = y2,
                    .w = 185,
                    .h = 200,
                    .fmt = PP_GEN_FMT_CURRENCY_M,
                    .bar_style = PP_GEN_BAR_PATH4};
  pp_gen_chart_fit_axis(&a, 0);
  if (draft2) { /* the new misleading chart: bars cut at 8 */
    a.axis_min = 8, a.axis_max = 14, a.tick_step = 2, a.bar_from = 8;
  }
  chart(d, &a);
  static const double dps[] = {0.42, 0.45, 0.46, 0.50, 0.54};
  pp_gen_chart b = {.title = "Dividend per share (EUR)",
                    .n = 5,
                    .cats = years5,
                    .values = dps,
                    .x = MARGIN + 290,
                    .y = y2,
                    .w = 185,
                    .h = 200,
                    .bar_style = PP_GEN_BAR_FILL_STROKE,
                    .gridlines = TRUE};
  pp_gen_chart_fit_axis(&b, 0.5);
  chart(d, &b);
  for (int i = 0; i < 3; i++)
    pp_gen_figure_add_style(
        g_ptr_array_index(d->doc->truth->figures, d->doc->truth->figures->len - 1 - i),
        "multi-chart-page");
  body(d, MARGIN, y2 + 250, CONTENT_W, 1);
}

static void page_operations(demo *d) {
  next_page(d, "Operations");
  double y = heading(d, "Operations", 60);
  y = body(d, MARGIN, y, CONTENT_W, 2);
  /* Misleading: the fill stops at 45 kt, so a 18% fuel saving looks like 70%. */
  static const double fuel[] = {61.2, 59.8, 58.1, 55.9, 53.0, 50.4};
  pp_gen_chart a = {.title = "Fleet fuel use (kilotonnes)",
                    .n = 6,
                    .cats = years6,
                    .values = fuel,
                    .mark = PP_GEN_MARK_AREA,
                    .gridlines = TRUE,
                    .x = MARGIN + 40,
                    .y = y + 25,
                    .w = CONTENT_W - 50,
                    .h = 170,
                    .axis_min = 45,
                    .axis_max = 65,
                    .tick_step = 5,
                    .bar_from = 45};
  if (draft2) /* fixed in the later draft */
    a.axis_min = 0, a.axis_max = 70, a.tick_step = 10, a.bar_from = 0;
  pp_gen_figure_add_style(chart(d, &a), "multi-chart-page");
  static const double heads[] = {412, 236, 188, 74, 132};
  static const char *divisions[] = {"Deck crew", "Engineering", "Terminals", "Freight sales",
                                    "Head office"};
  pp_gen_chart h = {.title = "Employees by division, 31 December",
                    .n = 5,
                    .cats = divisions,
                    .values = heads,
                    .horizontal = TRUE,
                    .x = MARGIN + 90,
                    .y = a.y + a.h + 70,
                    .w = CONTENT_W - 110,
                    .h = 170,
                    .data_labels = TRUE};
  pp_gen_chart_fit_axis(&h, 0);
  pp_gen_figure_add_style(chart(d, &h), "multi-chart-page");
  body(d, MARGIN, h.y + h.h + 35, CONTENT_W, 1);
}

static void page_markets(demo *d) {
  next_page(d, "Markets");
  double y = heading(d, "Markets", 60);
  static const double digital[] = {12, 85, 640, 2900, 11800};
  static const char *channels[] = {"Kiosk app", "Partner sites", "Web shop", "Mobile app",
                                   "Corporate portal"};
  pp_gen_chart lg = {.title = "Digital sales by channel (EUR thousand)",
                     .n = 5,
                     .cats = channels,
                     .values = digital,
                     .log_axis = TRUE,
                     .axis_min = 1,
                     .axis_max = 100000,
                     .bar_from = 1,
                     .gridlines = TRUE,
                     .x = MARGIN + 40,
                     .y = y + 10,
                     .w = CONTENT_W - 50,
                     .h = 150};
  pp_gen_figure_add_style(chart(d, &lg), "multi-chart-page");
  static const double sat[] = {71, 74, 76, 79, 83};
  double drawn[5];
  /* Lengths drawn from 60 and rescaled: the printed scores rise 17%,
   * the bars almost fourfold. */
  for (int i = 0; i < 5; i++)
    drawn[i] = round((sat[i] - 60) * 83 / 23.0 * 100) / 100;
  pp_gen_chart lb = {.title = "Customer satisfaction index by region",
                     .n = 5,
                     .cats = regions,
                     .values = sat,
                     .drawn = drawn,
                     .data_labels = TRUE,
                     .hide_value_axis = TRUE,
                     .horizontal = TRUE,
                     .axis_min = 0,
                     .axis_max = 90,
                     .bar_from = 0,
                     .x = MARGIN + 70,
                     .y = lg.y + lg.h + 60,
                     .w = CONTENT_W - 90,
                     .h = 150};
  pp_gen_figure_add_style(chart(d, &lb), "multi-chart-page");
  static const double ontime[] = {91, 94, 88, 96, 93};
  pp_gen_chart pc = {.title = "Sailings departing on time (%)",
                     .n = 5,
                     .cats = regions,
                     .values = ontime,
                     .fmt = PP_GEN_FMT_PERCENT,
                     .axis_min = 0,
                     .axis_max = 100,
                     .tick_step = 25,
                     .gridlines = TRUE,
                     .x = MARGIN + 40,
                     .y = lb.y + lb.h + 50,
                     .w = CONTENT_W - 50,
                     .h = 150,
                     .bar_style = PP_GEN_BAR_FILL_STROKE};
  pp_gen_figure_add_style(chart(d, &pc), "multi-chart-page");
  chart_caption(d,
                "Digital sales are shown on a logarithmic scale. Satisfaction index: annual "
                "passenger survey, 0-100.",
                MARGIN, pc.y + pc.h + 26, CONTENT_W);
}

static void page_fleet(demo *d) {
  next_page(d, "Our fleet");
  double y = heading(d, "Our fleet", 60);
  photo(d, PP_DEMO_PHOTO_SNOW, MARGIN, y, CONTENT_W, 290, "MF Harrowgate Star in the inner fjord.");
  body(d, MARGIN, y + 320, CONTENT_W, 4);
}

static void page_sustainability(demo *d) {
  next_page(d, "Sustainability");
  double y = heading(d, "Sustainability", 60);
  y = body(d, MARGIN, y, CONTENT_W, 1);
  static const double co2[] = {98, 95, 93, 90, 86, 44, 43, 41, 40, 38, 12, 12, 11, 10, 10};
  pp_gen_chart s = {.title = "CO2 emissions by vessel type (kt)",
                    .n = 5,
                    .n_series = 3,
                    .stacked = TRUE,
                    .cats = years5,
                    .values = co2,
                    .series_names = (const char *const[]){"Ferries", "Freight", "Service boats"},
                    .x = MARGIN + 40,
                    .y = y + 35,
                    .w = CONTENT_W - 50,
                    .h = 190,
                    .gridlines = TRUE};
  pp_gen_chart_fit_axis(&s, 0);
  pp_gen_figure_add_style(chart(d, &s), "multi-chart-page");
  static const double intensity[] = {2.9, 2.7, 2.6, 2.4, 2.3};
  pp_gen_chart dc = {.title = "Utslipp, kg CO2 per vessel-km (Norwegian filing format)",
                     .n = 5,
                     .cats = years5,
                     .values = intensity,
                     .fmt = PP_GEN_FMT_DECIMAL_COMMA,
                     .axis_min = 0,
                     .axis_max = 3.5,
                     .tick_step = 0.5,
                     .decimals = 1,
                     .data_labels = TRUE,
                     .x = MARGIN + 40,
                     .y = s.y + s.h + 65,
                     .w = CONTENT_W - 50,
                     .h = 170};
  pp_gen_figure_add_style(chart(d, &dc), "multi-chart-page");
  body(d, MARGIN, dc.y + dc.h + 35, CONTENT_W, 1);
}

/* 3D columns, a tier pyramid and route bubbles: the shapes that misstate their numbers. */
static void page_network(demo *d) {
  next_page(d, "Network and customers");
  double y = heading(d, "Network and customers", 60);
  y = body(d, MARGIN, y, CONTENT_W, 1);
  pp_gen_font(d->cr, 10, TRUE);
  set_rgb(d->cr, navy);
  pp_gen_text_at(d->cr, "Passengers carried (million)", MARGIN, y + 10, 0, 0);
  pp_demo_bars_3d(d->cr, d->doc->truth, d->doc->page, MARGIN + 30, y + 45, 240, 160);
  pp_gen_font(d->cr, 10, TRUE);
  set_rgb(d->cr, navy);
  pp_gen_text_at(d->cr, "Loyalty members by tier", MARGIN + 300, y + 10, 0, 0);
  pp_demo_pyramid(d->cr, d->doc->truth, d->doc->page, MARGIN + 290, y + 40, 190, 170);
  double yb = y + 250;
  pp_gen_font(d->cr, 10, TRUE);
  set_rgb(d->cr, navy);
  pp_gen_text_at(d->cr, "Departures per week by route", MARGIN, yb, 0, 0);
  pp_demo_bubbles(d->cr, d->doc->truth, d->doc->page, MARGIN, yb + 20, CONTENT_W, 200);
  body(d, MARGIN, yb + 240, CONTENT_W, 1);
}

static void page_people(demo *d) {
  next_page(d, "People");
  double y = heading(d, "People", 60);
  y = body(d, MARGIN, y, CONTENT_W, 1);
  static const double gender[] = {118, 61, 102, 31, 70, 294, 175, 86, 43, 62};
  static const char *divisions[] = {"Deck", "Engineering", "Terminals", "Sales", "Office"};
  pp_gen_chart g = {.title = "Employees by division and gender",
                    .n = 5,
                    .n_series = 2,
                    .cats = divisions,
                    .values = gender,
                    .series_names = (const char *const[]){"Women", "Men"},
                    .gridlines = TRUE,
                    .x = MARGIN + 40,
                    .y = y + 35,
                    .w = CONTENT_W - 50,
                    .h = 180};
  pp_gen_chart_fit_axis(&g, 0);
  pp_gen_figure_add_style(chart(d, &g), "multi-chart-page");
  /* Misleading: bars start at 0 but the frame clips them at 28 hours. */
  static const double training[] = {31, 33, 34, 36, 38};
  pp_gen_chart t = {.title = "Training hours per employee",
                    .n = 5,
                    .cats = years5,
                    .values = training,
                    .bar_style = PP_GEN_BAR_CLIPPED,
                    .axis_min = 28,
                    .axis_max = 40,
                    .tick_step = 2,
                    .bar_from = 0,
                    .x = MARGIN + 40,
                    .y = g.y + g.h + 60,
                    .w = CONTENT_W - 50,
                    .h = 170};
  pp_gen_figure_add_style(chart(d, &t), "multi-chart-page");
  body(d, MARGIN, t.y + t.h + 35, CONTENT_W, 1);
}

static void page_five_year(demo *d) {
  next_page(d, "Five-year summary");
  double y = heading(d, "Five-year summary", 60);
  static const char *cells[] = {
      "EUR m",
      "2027",
      "2028",
      "2029",
      "2030",
      "2031",
      "Revenue",
      "118.2",
      "123.6",
      "129.1",
      "134.7",
      "140.2",
      "Operating costs",
      "-99.4",
      "-103.0",
      "-108.1",
      "-110.1",
      "-113.9",
      "EBITDA",
      "18.8",
      "20.6",
      "21.0",
      "24.6",
      "26.3",
      "Depreciation",
      "-9.2",
      "-10.0",
      "-10.8",
      "-12.2",
      "-12.6",
      "Operating profit",
      "9.6",
      "10.6",
      "10.2",
      "12.4",
      "13.7",
      "Net finance",
      "-2.1",
      "-2.3",
      "-2.0",
      "-2.4",
      "-2.2",
      "Profit before tax",
      "7.5",
      "8.3",
      "8.2",
      "10.0",
      "11.5",
      "Investments",
      "21.4",
      "35.0",
      "18.2",
      "41.7",
      "29.9",
      "Net debt",
      "48.0",
      "61.3",
      "57.9",
      "72.4",
      "70.1",
      "Equity ratio (%)",
      "41.2",
      "39.8",
      "41.0",
      "38.5",
      "40.3",
      "Dividend per share (EUR)",
      "0.42",
      "0.45",
      "0.46",
      "0.50",
      "0.54",
  };
  y = table(d, MARGIN, y, CONTENT_W, 12, 6, cells, 170);
  body(d, MARGIN, y + 30, CONTENT_W, 3);
}

static void page_segments(demo *d) {
  next_page(d, "Segments");
  double y = heading(d, "Segments", 60);
  static const char *cells[] = {
      "2031, EUR m",      "Passenger", "Freight", "Harbour", "Group",
      "Revenue",          "71.8",      "49.6",    "18.8",    "140.2",
      "EBITDA",           "13.9",      "8.7",     "3.7",     "26.3",
      "Operating profit", "7.6",       "4.5",     "1.6",     "13.7",
      "Vessels",          "21",        "9",       "3",       "33",
      "Employees",        "588",       "301",     "153",     "1,042",
  };
  y = table(d, MARGIN, y, CONTENT_W, 6, 5, cells, 150);
  static const double pax[] = {4120, 4405, 4310, 4820, 5135};
  pp_gen_chart a = {.title = "Passengers carried (thousand)",
                    .n = 5,
                    .cats = years5,
                    .values = pax,
                    .mark = PP_GEN_MARK_AREA,
                    .fmt = PP_GEN_FMT_THOUSANDS,
                    .gridlines = TRUE,
                    .x = MARGIN + 50,
                    .y = y + 60,
                    .w = CONTENT_W - 60,
                    .h = 200};
  pp_gen_chart_fit_axis(&a, 0);
  chart(d, &a);
  body(d, MARGIN, a.y + a.h + 40, CONTENT_W, 2);
}

/* A pie: slices clockwise from 12 o'clock with the angles of drawn[], the percentages
 * printed[] inside and the names beside. Records a "pie" truth figure; expected lie factor:
 * the worst slice's drawn share over its printed share (scripts/corpus/truth_circles.py). */
static void pie_chart(demo *d, const char *title, double cx, double cy, double r, int n,
                      const char *const *names, const double *values, const double *drawn,
                      const double *printed) {
  static const double colours[][3] = {
      {0.07, 0.18, 0.33}, {0.18, 0.49, 0.64}, {0.55, 0.72, 0.8}, {0.85, 0.55, 0.2}};
  cairo_t *cr = d->cr;
  double total = 0, a = -G_PI / 2;
  for (int i = 0; i < n; i++)
    total += drawn[i];
  pp_gen_font(cr, 10, TRUE);
  set_rgb(cr, navy);
  pp_gen_text_at(cr, title, cx - r, cy - r - 28, 0, 0);
  int worst = 0;
  for (int i = 0; i < n; i++) {
    double sw = 2 * G_PI * drawn[i] / total, mid = a + sw / 2;
    cairo_new_path(cr);
    cairo_move_to(cr, cx, cy);
    cairo_arc(cr, cx, cy, r, a, a + sw);
    cairo_close_path(cr);
    set_rgb(cr, colours[i % 4]);
    cairo_fill(cr);
    char buf[32];
    g_snprintf(buf, sizeof buf, "%.0f%%", printed[i]);
    pp_gen_font(cr, 9, TRUE);
    cairo_set_source_rgb(cr, 1, 1, 1);
    pp_gen_text_at(cr, buf, cx + 0.62 * r * cos(mid), cy + 0.62 * r * sin(mid), 0.5, 0.5);
    pp_gen_font(cr, 8.5, FALSE);
    cairo_set_source_rgb(cr, 0.2, 0.2, 0.25);
    pp_gen_text_at(cr, names[i], cx + 1.12 * r * cos(mid), cy + 1.12 * r * sin(mid),
                   cos(mid) >= 0 ? 0 : 1, 0.5);
    double dw = drawn[i] / total, pw = printed[i] / 100, dw0 = drawn[worst] / total,
           pw0 = printed[worst] / 100;
    if (fabs(log(dw / pw)) > fabs(log(dw0 / pw0)))
      worst = i;
    a += sw;
  }
  pp_gen_figure *f = pp_gen_truth_add(d->doc->truth, d->doc->page, "pie");
  pp_gen_figure_set_bbox(f, cx - r, cy - r, 2 * r, 2 * r);
  f->misleading = TRUE;
  f->rule = "wedges-vs-labels";
  GString *circle = g_string_new("\"circle\": {\"drawn_values\": [");
  for (int i = 0; i < n; i++) {
    g_array_append_val(f->values, values[i]);
    g_ptr_array_add(f->labels, g_strdup(names[i]));
    g_string_append_printf(circle, "%s%g", i ? ", " : "", drawn[i]);
  }
  g_string_append(circle, "], \"printed\": [");
  f->data_labels = g_array_new(FALSE, FALSE, sizeof(double));
  for (int i = 0; i < n; i++) {
    g_array_append_val(f->data_labels, printed[i]);
    g_string_append_printf(circle, "%s%g", i ? ", " : "", printed[i]);
  }
  g_string_append(circle, "], \"printed_kind\": \"percent\", \"decimals\": 0}");
  f->extra_json = g_string_free(circle, FALSE);
  /* The measures of scripts/corpus/truth_circles.py (_pie), same arithmetic, 9 digits. */
  double pairs = 1.0, psum = 0;
  for (int i = 0; i < n; i++) {
    psum += printed[i];
    for (int j = i + 1; j < n; j++) {
      double r =
          ((drawn[i] / total) / (drawn[j] / total)) / ((printed[i] / 100.0) / (printed[j] / 100.0));
      pairs = fmax(pairs, fmax(r, 1 / r));
    }
  }
  f->expected_json = g_strdup_printf(
      "{\"lie_factor_growth\": %.9g, \"worst_wedge\": \"%s\", \"worst_drawn_share\": %.9g, "
      "\"worst_printed_share\": %.9g, \"max_pair_departure\": %.9g, \"percent_sum\": %.9g, "
      "\"percent_allowance\": %.9g}",
      (drawn[worst] / total) / (printed[worst] / 100.0), names[worst], drawn[worst] / total,
      printed[worst] / 100.0, pairs, psum, n * 0.5);
  pp_gen_figure_add_style(f, "multi-chart-page");
}

/* Radial bars: rings of equal width clockwise from 12 o'clock, the innermost first, each
 * sweep value/full of a turn, "name value" printed at each ring's start. Expected lie
 * factor: the outer ring's ink per unit over the inner's, (R₄² − r₄²)/(R₁² − r₁²). */
static void radial_chart(demo *d, const char *title, double cx, double cy, int n,
                         const char *const *names, const double *values, double full) {
  cairo_t *cr = d->cr;
  const double r0 = 34, width = 13, gap = 5;
  pp_gen_font(cr, 10, TRUE);
  set_rgb(cr, navy);
  double ro = r0 + n * (width + gap) - gap;
  pp_gen_text_at(cr, title, cx - ro, cy - ro - 28, 0, 0);
  for (int i = 0; i < n; i++) {
    double ri = r0 + i * (width + gap), sw = 2 * G_PI * values[i] / full;
    cairo_new_path(cr);
    cairo_arc(cr, cx, cy, ri + width, -G_PI / 2, -G_PI / 2 + sw);
    cairo_arc_negative(cr, cx, cy, ri, -G_PI / 2 + sw, -G_PI / 2);
    cairo_close_path(cr);
    cairo_set_source_rgb(cr, 0.18 + 0.12 * i, 0.49 - 0.05 * i, 0.64 - 0.08 * i);
    cairo_fill(cr);
    char buf[64];
    g_snprintf(buf, sizeof buf, "%s %g%%", names[i], values[i]);
    pp_gen_font(cr, 7.5, FALSE);
    cairo_set_source_rgb(cr, 0.2, 0.2, 0.25);
    pp_gen_text_at(cr, buf, cx - 5, cy - ri - width / 2, 1, 0.5);
  }
  pp_gen_figure *f = pp_gen_truth_add(d->doc->truth, d->doc->page, "radial-bar");
  pp_gen_figure_set_bbox(f, cx - ro, cy - ro, 2 * ro, 2 * ro);
  f->misleading = TRUE;
  f->rule = "radial-ring-ink";
  GString *circle = g_string_new("\"circle\": {\"rings\": [");
  f->data_labels = g_array_new(FALSE, FALSE, sizeof(double));
  for (int i = 0; i < n; i++) {
    double ri = r0 + i * (width + gap);
    g_array_append_val(f->values, values[i]);
    g_array_append_val(f->data_labels, values[i]);
    g_ptr_array_add(f->labels, g_strdup(names[i]));
    g_string_append_printf(circle, "%s[%g, %g]", i ? ", " : "", ri, ri + width);
  }
  g_string_append_printf(circle, "], \"full_value\": %g}", full);
  f->extra_json = g_string_free(circle, FALSE);
  /* The measures of scripts/corpus/truth_circles.py (_radial), same arithmetic. */
  double ink[8], pairs = 1.0;
  for (int i = 0; i < n && i < 8; i++) {
    double ri = r0 + i * (width + gap), ro = ri + width;
    ink[i] = (ro * ro - ri * ri) * G_PI * values[i] / full;
  }
  for (int i = 0; i < n && i < 8; i++)
    for (int j = i + 1; j < n && j < 8; j++) {
      double r = (ink[i] / ink[j]) / (values[i] / values[j]);
      pairs = fmax(pairs, fmax(r, 1 / r));
    }
  double ratio = (ink[n - 1] / values[n - 1]) / (ink[0] / values[0]);
  f->expected_json = g_strdup_printf("{\"lie_factor_growth\": %.9g, \"outer_to_inner\": %.9g, "
                                     "\"max_pair_departure\": %.9g}",
                                     ratio, ratio, pairs);
  pp_gen_figure_add_style(f, "multi-chart-page");
}

/* Revenue mix (a pie whose angles were drawn from last year's mix: its labels are this
 * year's) and progress on targets as radial bars; then the risk section's text. */
static void page_mix(demo *d) {
  next_page(d, "Revenue mix and targets");
  double y = heading(d, "Revenue mix and targets", 60);
  static const char *segs[] = {"Passenger", "Freight", "Harbour"};
  static const double revenue[] = {71.8, 49.6, 18.8};
  static const double drawn[] = {44, 34, 22};
  static const double printed[] = {51, 35, 13};
  pie_chart(d, "Revenue by segment, 2031", MARGIN + 110, y + 130, 85, 3, segs, revenue, drawn,
            printed);
  static const char *targets[] = {"Shore power", "Electric ferries", "Waste recycled",
                                  "Biofuel share"};
  static const double progress[] = {72, 58, 44, 30};
  radial_chart(d, "Progress to 2035 targets (full circle = 100%)", MARGIN + 365, y + 130, 4,
               targets, progress, 100);
  y = heading(d, "Risk management", y + 290);
  body(d, MARGIN, y, CONTENT_W, 4);
}

static void page_text(demo *d, const char *section, int paras) {
  next_page(d, section);
  double y = heading(d, section, 60);
  body(d, MARGIN, y, CONTENT_W, paras);
}

static void page_shareholders(demo *d) {
  next_page(d, "Shareholder information");
  double y = heading(d, "Shareholder information", 60);
  y = body(d, MARGIN, y, CONTENT_W, 2);
  static const char *months[] = {"Jan", "Feb", "Mar", "Apr", "May", "Jun",
                                 "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"};
  double price[12];
  for (int i = 0; i < 12; i++)
    price[i] =
        round((14.2 + 0.35 * i + 0.6 * sin(i * 1.3) + pp_gen_rng_uniform(&d->rng, -0.3, 0.3)) *
              100) /
        100;
  pp_gen_chart l = {.title = "Share price 2031, month-end close (EUR)",
                    .n = 12,
                    .cats = months,
                    .values = price,
                    .mark = PP_GEN_MARK_LINE,
                    .gridlines = TRUE,
                    .x = MARGIN + 40,
                    .y = y + 30,
                    .w = CONTENT_W - 50,
                    .h = 210};
  pp_gen_chart_fit_axis(&l, 0.9);
  chart(d, &l);
  static const char *cells[] = {
      "Largest shareholders (fictional)",
      "Shares (m)",
      "Holding",
      "Nordvik Havnefond",
      "4.20",
      "18.3%",
      "Coastal Pension Trust",
      "2.95",
      "12.8%",
      "Solbakken Kommune Invest",
      "1.80",
      "7.8%",
      "Employees' share scheme",
      "0.64",
      "2.8%",
      "Other shareholders",
      "13.41",
      "58.3%",
  };
  table(d, MARGIN, l.y + l.h + 50, CONTENT_W, 6, 3, cells, 250);
}

static void page_statements(demo *d) {
  next_page(d, "Financial statements");
  double y = heading(d, "Income statement", 60);
  static const char *inc[] = {
      "EUR thousand",
      "Note",
      "2031",
      "2030",
      "Passenger revenue",
      "3",
      "71,812",
      "68,904",
      "Freight revenue",
      "3",
      "49,611",
      "47,388",
      "Harbour services",
      "3",
      "18,777",
      "18,408",
      "Total revenue",
      "",
      "140,200",
      "134,700",
      "Fuel",
      "4",
      "-31,508",
      "-32,960",
      "Personnel expenses",
      "5",
      "-52,114",
      "-49,870",
      "Other operating expenses",
      "6",
      "-30,278",
      "-27,270",
      "EBITDA",
      "",
      "26,300",
      "24,600",
      "Depreciation",
      "8",
      "-12,600",
      "-12,200",
      "Operating profit",
      "",
      "13,700",
      "12,400",
      "Net financial items",
      "9",
      "-2,200",
      "-2,400",
      "Profit before tax",
      "",
      "11,500",
      "10,000",
      "Income tax",
      "10",
      "-2,530",
      "-2,200",
      "Profit for the year",
      "",
      "8,970",
      "7,800",
  };
  y = table(d, MARGIN, y, CONTENT_W, 15, 4, inc, 220);
  body(d, MARGIN, y + 25, CONTENT_W, 2);
  next_page(d, "Financial statements");
  y = heading(d, "Balance sheet, 31 December", 60);
  static const char *bal[] = {
      "EUR thousand",
      "2031",
      "2030",
      "Vessels",
      "168,420",
      "152,900",
      "Terminals and buildings",
      "21,350",
      "21,980",
      "Other non-current assets",
      "6,110",
      "5,870",
      "Trade receivables",
      "14,230",
      "13,640",
      "Cash and equivalents",
      "18,940",
      "16,220",
      "Total assets",
      "229,050",
      "210,610",
      "Share capital",
      "23,000",
      "23,000",
      "Retained earnings",
      "69,300",
      "58,090",
      "Interest-bearing debt",
      "89,040",
      "88,620",
      "Trade payables",
      "12,710",
      "11,900",
      "Other liabilities",
      "35,000",
      "29,000",
      "Total equity and liabilities",
      "229,050",
      "210,610",
  };
  y = table(d, MARGIN, y, CONTENT_W, 13, 3, bal, 280);
  body(d, MARGIN, y + 25, CONTENT_W, 2);
}

static void page_governance(demo *d) {
  next_page(d, "Governance");
  double y = heading(d, "Corporate governance", 60);
  y = body(d, MARGIN, y, CONTENT_W, 4);
  photo(d, PP_DEMO_PHOTO_HARBOUR, MARGIN, y + 10, CONTENT_W, 250, "Nordvik harbour office.");
}

static void page_back(demo *d) {
  next_page(d, NULL);
  cairo_t *cr = d->cr;
  set_rgb(cr, navy);
  cairo_rectangle(cr, 0, 0, PAGE_W, PAGE_H - 60);
  cairo_fill(cr);
  photo(d, PP_DEMO_PHOTO_DUSK, MARGIN, 120, CONTENT_W, 260, NULL);
  cairo_set_source_rgb(cr, 1, 1, 1);
  pp_gen_font(cr, 16, TRUE);
  pp_gen_text_at(cr, COMPANY, MARGIN, 430, 0, 0);
  pp_gen_font(cr, 10, FALSE);
  static const char *lines[] = {"Kaiveien 12, 9990 Nordvik (fictional address)",
                                "post@fjordhaven.example", "www.fjordhaven.example"};
  for (int i = 0; i < 3; i++)
    pp_gen_text_at(cr, lines[i], MARGIN, 460 + i * 16, 0, 0);
}

int main(int argc, char **argv) {
  const char *out_dir = argc > 1 ? argv[1] : "corpus/demo";
  draft2 = argc > 2 && g_strcmp0(argv[2], "--draft2") == 0;
  if (g_mkdir_with_parents(out_dir, 0755) != 0) {
    fprintf(stderr, "gen-demo: cannot create %s\n", out_dir);
    return 1;
  }
  demo d = {0};
  pp_gen_rng_init(&d.rng, SEED);
  d.doc = pp_gen_doc_new(out_dir, "corpus/demo", draft2 ? NAME "-draft2" : NAME, SEED, PAGE_W,
                         PAGE_H, COMPANY " Annual Report 2031");
  d.cr = d.doc->cr;
  page_cover(&d);
  page_contents(&d);
  page_letter(&d);
  if (draft2)
    page_text(&d, "The year in brief", 3);
  page_ceo(&d);
  page_highlights(&d);
  page_operations(&d);
  page_markets(&d);
  page_fleet(&d);
  page_sustainability(&d);
  page_network(&d);
  page_people(&d);
  page_five_year(&d);
  page_segments(&d);
  page_mix(&d);
  page_shareholders(&d);
  page_statements(&d);
  page_text(&d, "Notes", 9);
  page_governance(&d);
  page_back(&d);
  GError *error = NULL;
  gboolean ok = pp_gen_doc_finish(d.doc, &error);
  int pages = d.doc->page;
  pp_gen_doc_free(d.doc);
  if (!ok) {
    fprintf(stderr, "gen-demo: %s\n", error->message);
    g_error_free(error);
    return 1;
  }
  printf("gen-demo: wrote %d pages to %s/%s.pdf\n", pages, out_dir, draft2 ? NAME "-draft2" : NAME);
  return 0;
}
