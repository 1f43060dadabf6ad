/* Generates corpus/demo/larchwood-horizon-kid-2031.pdf: the two-page key investor
 * information document of an invented UCITS fund (Larchwood Horizon Equity Fund, of the
 * fictional Brackenridge Fund Management S.A.), and its truth JSON. Page 2 holds the
 * past-performance chart: ten years, the first two blank (launched 2023), a benchmark bar
 * beside each of the fund's, linear axis from 0%, every bar labelled; one label printed
 * with two decimals ("-4.35%"), the flaw `--profile fund-past-performance` reports
 * (Regulation (EU) No 583/2010, Annex III point 5). Usage: gen-demo-kid [OUT_DIR] */
#include <math.h>
#include <stdio.h>

#include "cairo_doc.h"
#include "cairo_text.h"

#define SEED G_GUINT64_CONSTANT(2031)
#define PAGE_W 595.0
#define PAGE_H 842.0
#define MARGIN 50.0
#define NAME "larchwood-horizon-kid-2031"
#define FUND "Larchwood Horizon Equity Fund"
#define N_YEARS 10

static const double navy[3] = {0.09, 0.20, 0.36};
static const double sky[3] = {0.62, 0.74, 0.86};
static const char *years[N_YEARS] = {"2021", "2022", "2023", "2024", "2025",
                                     "2026", "2027", "2028", "2029", "2030"};
/* Invented returns, percent; NAN before the fund's launch in 2023. */
static const double fund[N_YEARS] = {NAN, NAN, 7.2, 11.5, -4.35, 8.9, 3.1, -9.8, 14.2, 6.6};
static const double bench[N_YEARS] = {NAN, NAN, 6.1, 10.2, -3.7, 9.4, 2.5, -8.1, 12.9, 5.8};

static void rgb(cairo_t *cr, const double *c) {
  cairo_set_source_rgb(cr, c[0], c[1], c[2]);
}

static double section(cairo_t *cr, const char *title, double y) {
  pp_gen_font(cr, 11, TRUE);
  rgb(cr, navy);
  pp_gen_text_at(cr, title, MARGIN, y, 0, 0);
  cairo_set_line_width(cr, 0.8);
  cairo_move_to(cr, MARGIN, y + 15);
  cairo_line_to(cr, PAGE_W - MARGIN, y + 15);
  cairo_stroke(cr);
  return y + 22;
}

static double para(pp_gen_doc *doc, const char *text, double y) {
  pp_gen_font(doc->cr, 8.5, FALSE);
  cairo_set_source_rgb(doc->cr, 0.1, 0.1, 0.12);
  double end = pp_gen_text_wrap(doc->cr, text, MARGIN, y, PAGE_W - 2 * MARGIN, 8.5, 11.5);
  pp_gen_figure *f = pp_gen_truth_add(doc->truth, doc->page, "text");
  pp_gen_figure_set_bbox(f, MARGIN, y, PAGE_W - 2 * MARGIN, end - y);
  return end + 6;
}

static void page_one(pp_gen_doc *doc) {
  cairo_t *cr = doc->cr;
  pp_gen_font(cr, 16, TRUE);
  rgb(cr, navy);
  pp_gen_text_at(cr, "Key Investor Information", MARGIN, 50, 0, 0);
  double y = para(doc,
                  "This document provides you with key investor information about this fund. "
                  "It is not marketing material. The fund, its manager and every figure in "
                  "this document are invented for a demonstration.",
                  78);
  pp_gen_font(cr, 10, TRUE);
  pp_gen_text_at(cr, FUND ", class A accumulation (fictional)", MARGIN, y + 4, 0, 0);
  y = para(doc, "Managed by Brackenridge Fund Management S.A. (fictional).", y + 20);
  y = section(cr, "Objectives and investment policy", y + 10);
  y = para(doc,
           "The fund aims to grow the value of your investment over at least five years. It "
           "invests mainly in shares of companies of the invented Northern Ridge region and "
           "measures its performance against the Northern Ridge Equity Index (an invented "
           "benchmark). Income is reinvested. You can buy and sell shares on any business day.",
           y);
  y = section(cr, "Risk and reward profile", y + 10);
  /* The synthetic indicator: seven outlined boxes, the fund's category filled. */
  double bw = 40, bx = MARGIN;
  pp_gen_font(cr, 9, TRUE);
  for (int i = 0; i < 7; i++) {
    cairo_rectangle(cr, bx + i * (bw + 4), y + 16, bw, 18);
    if (i == 5) {
      rgb(cr, navy);
      cairo_fill_preserve(cr);
    }
    cairo_set_line_width(cr, 0.6);
    rgb(cr, navy);
    cairo_stroke(cr);
    char num[4];
    g_snprintf(num, sizeof num, "%d", i + 1);
    if (i == 5)
      cairo_set_source_rgb(cr, 1, 1, 1);
    pp_gen_text_at(cr, num, bx + i * (bw + 4) + bw / 2, y + 25, 0.5, 0.5);
  }
  pp_gen_font(cr, 7.5, FALSE);
  cairo_set_source_rgb(cr, 0.2, 0.2, 0.22);
  pp_gen_text_at(cr, "Lower risk, typically lower rewards", MARGIN, y + 6, 0, 0.5);
  pp_gen_text_at(cr, "Higher risk, typically higher rewards", bx + 7 * (bw + 4) - 4, y + 6, 1, 0.5);
  pp_gen_figure *f = pp_gen_truth_add(doc->truth, doc->page, "other");
  pp_gen_figure_set_bbox(f, bx, y + 16, 7 * (bw + 4), 18);
  pp_gen_figure_set_note(f, "risk indicator: seven outlined boxes, one filled; not a chart");
  y = para(doc,
           "The fund is in category 6 because shares of one region have risen and fallen "
           "sharply in the past. The category is not guaranteed and may change over time.",
           y + 44);
  y = section(cr, "Charges", y + 10);
  y = para(doc,
           "Entry charge 3.0%. Exit charge none. Ongoing charges 1.4% a year. These are the "
           "largest amounts that may be taken; you may pay less.",
           y);
}

static void page_two(pp_gen_doc *doc) {
  cairo_t *cr = doc->cr;
  pp_gen_doc_next_page(doc);
  cairo_set_source_rgb(cr, 1, 1, 1);
  cairo_paint(cr);
  double y = section(cr, "Past performance", 50);
  /* Plot area and a linear axis from -15% to 20%, the X-axis at 0%. */
  double x0 = MARGIN + 25, w = PAGE_W - 2 * MARGIN - 25, top = y + 30, h = 250;
  double lo = -15, hi = 20;
#define POS(v) (top + h * (hi - (v)) / (hi - lo))
  pp_gen_font(cr, 7.5, FALSE);
  for (double v = lo; v <= hi + 1e-9; v += 5) {
    char buf[16];
    g_snprintf(buf, sizeof buf, "%g%%", v);
    cairo_set_source_rgb(cr, 0.82, 0.82, 0.85);
    cairo_set_line_width(cr, 0.4);
    cairo_move_to(cr, x0, POS(v));
    cairo_line_to(cr, x0 + w, POS(v));
    cairo_stroke(cr);
    cairo_set_source_rgb(cr, 0.15, 0.15, 0.18);
    cairo_move_to(cr, x0 - 4, POS(v));
    cairo_line_to(cr, x0, POS(v));
    cairo_stroke(cr);
    pp_gen_text_at(cr, buf, x0 - 6, POS(v), 1, 0.5);
  }
  /* Fund and benchmark bars side by side, each under half its year's slot; labels of
   * 5.5 pt then stay apart by more than a word space. */
  double slot = w / N_YEARS, bar = slot * 0.46;
  pp_gen_figure *f = pp_gen_truth_add(doc->truth, doc->page, "column");
  pp_gen_figure_set_bbox(f, x0, top, w, h);
  GArray *g = g_array_new(FALSE, FALSE, sizeof(double));
  for (int i = 0; i < N_YEARS; i++) {
    double cx = x0 + (i + 0.5) * slot;
    pp_gen_font(cr, 7.5, FALSE);
    cairo_set_source_rgb(cr, 0.15, 0.15, 0.18);
    pp_gen_text_at(cr, years[i], cx, top + h + 6, 0.5, 0);
    if (isnan(fund[i]))
      continue; /* a year before launch: a blank slot (Article 15, from memory) */
    for (int s = 0; s < 2; s++) {
      double v = s == 0 ? fund[i] : bench[i];
      double bx = s == 0 ? cx - bar : cx;
      rgb(cr, s == 0 ? navy : sky);
      cairo_rectangle(cr, bx, fmin(POS(0), POS(v)), bar, fabs(POS(v) - POS(0)));
      cairo_fill(cr);
      /* One decimal, except the fund's 2025 return: the flaw of this document. */
      char buf[16];
      g_snprintf(buf, sizeof buf, "%.*f%%", s == 0 && i == 4 ? 2 : 1, v);
      pp_gen_font(cr, 5.5, FALSE);
      cairo_set_source_rgb(cr, 0.1, 0.1, 0.12);
      pp_gen_text_at(cr, buf, bx + bar / 2, v >= 0 ? POS(v) - 3 : POS(v) + 3, 0.5, v >= 0 ? 1 : 0);
      g_array_append_val(f->values, v);
      g_ptr_array_add(f->labels, g_strdup_printf("%s/%s", years[i], s == 0 ? "Fund" : "Index"));
      g_array_append_val(g, v);
    }
  }
  cairo_set_source_rgb(cr, 0.1, 0.1, 0.12);
  cairo_set_line_width(cr, 0.9);
  cairo_move_to(cr, x0, POS(0));
  cairo_line_to(cr, x0 + w, POS(0));
  cairo_stroke(cr);
  /* Legend, above the plot. */
  for (int s = 0; s < 2; s++) {
    rgb(cr, s == 0 ? navy : sky);
    cairo_rectangle(cr, x0 + s * 170, y + 6, 9, 9);
    cairo_fill(cr);
    pp_gen_font(cr, 8, FALSE);
    cairo_set_source_rgb(cr, 0.1, 0.1, 0.12);
    pp_gen_text_at(cr, s == 0 ? FUND : "Northern Ridge Equity Index", x0 + s * 170 + 13, y + 10.5,
                   0, 0.5);
  }
#undef POS
  f->has_axis = TRUE;
  f->axis_min = lo;
  f->axis_max = hi;
  f->orientation = 'y';
  f->baseline = 0;
  f->data_labels = g_array_new(FALSE, FALSE, sizeof(double));
  g_array_append_vals(f->data_labels, f->values->data, f->values->len);
  f->has_expected = TRUE;
  pp_gen_measures_compute((const double *)(void *)f->values->data, (const double *)(void *)g->data,
                          (int)g->len, 0, &f->expected);
  g_array_unref(g);
  pp_gen_figure_add_style(f, "grouped");
  pp_gen_figure_add_style(f, "percent");
  pp_gen_figure_add_style(f, "negative");
  pp_gen_figure_add_style(f, "data-labels");
  pp_gen_figure_set_note(f, "past performance, fund and benchmark: values flattened "
                            "category-major; 2021-2022 blank (before launch); honest ink, one "
                            "two-decimal label (fund-label-decimals under the fund profile)");
  y = para(doc,
           "Past performance is not a reliable guide to future performance. Performance is "
           "shown after ongoing charges, in euro. The fund was launched in 2023; there is no "
           "performance for earlier years. The benchmark is shown for the years the fund "
           "existed.",
           top + h + 30);
  y = section(cr, "Practical information", y + 10);
  para(doc,
       "Depositary: Quayside Trustee Bank S.A. (fictional). The prospectus, the latest "
       "reports and prices are available free of charge at www.brackenridge.example. This "
       "key investor information is accurate as at 15 February 2031 (invented date).",
       y);
}

int main(int argc, char **argv) {
  const char *out_dir = argc > 1 ? argv[1] : "corpus/demo";
  if (g_mkdir_with_parents(out_dir, 0755) != 0) {
    fprintf(stderr, "gen-demo-kid: cannot create %s\n", out_dir);
    return 1;
  }
  pp_gen_doc *doc = pp_gen_doc_new(out_dir, "corpus/demo", NAME, SEED, PAGE_W, PAGE_H,
                                   FUND " Key Investor Information");
  cairo_set_source_rgb(doc->cr, 1, 1, 1);
  cairo_paint(doc->cr);
  page_one(doc);
  page_two(doc);
  GError *error = NULL;
  gboolean ok = pp_gen_doc_finish(doc, &error);
  pp_gen_doc_free(doc);
  if (!ok) {
    fprintf(stderr, "gen-demo-kid: %s\n", error->message);
    g_error_free(error);
    return 1;
  }
  printf("gen-demo-kid: wrote %s/%s.pdf\n", out_dir, NAME);
  return 0;
}
