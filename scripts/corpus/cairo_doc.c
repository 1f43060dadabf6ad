/* PDF document lifetime plus axis fitting shared by both generators. */
#include "cairo_doc.h"

#include <cairo-pdf.h>
#include <math.h>

pp_gen_doc *pp_gen_doc_new(const char *out_dir, const char *rel_dir, const char *name, guint64 seed,
                           double width, double height, const char *title) {
  pp_gen_doc *d = g_new0(pp_gen_doc, 1);
  d->pdf_path = g_strdup_printf("%s/%s.pdf", out_dir, name);
  d->truth_path = g_strdup_printf("%s/%s.truth.json", out_dir, name);
  char *rel = g_strdup_printf("%s/%s.pdf", rel_dir, name);
  d->truth = pp_gen_truth_new(rel, seed);
  g_free(rel);
  d->width = width;
  d->height = height;
  d->surface = cairo_pdf_surface_create(d->pdf_path, width, height);
  /* A fixed date keeps the files identical between runs and machines. */
  cairo_pdf_surface_set_metadata(d->surface, CAIRO_PDF_METADATA_CREATE_DATE,
                                 "2031-03-14T09:00:00Z");
  cairo_pdf_surface_set_metadata(d->surface, CAIRO_PDF_METADATA_CREATOR,
                                 "plotproof corpus generator");
  if (title)
    cairo_pdf_surface_set_metadata(d->surface, CAIRO_PDF_METADATA_TITLE, title);
  d->cr = cairo_create(d->surface);
  d->page = 1;
  return d;
}

void pp_gen_doc_next_page(pp_gen_doc *doc) {
  cairo_show_page(doc->cr);
  doc->page++;
}

gboolean pp_gen_doc_finish(pp_gen_doc *doc, GError **error) {
  cairo_show_page(doc->cr);
  doc->truth->pages = doc->page;
  if (doc->page > 1)
    for (guint i = 0; i < doc->truth->figures->len; i++)
      pp_gen_figure_add_style(g_ptr_array_index(doc->truth->figures, i), "multi-page");
  cairo_destroy(doc->cr);
  doc->cr = NULL;
  cairo_surface_finish(doc->surface);
  cairo_status_t st = cairo_surface_status(doc->surface);
  cairo_surface_destroy(doc->surface);
  doc->surface = NULL;
  if (st != CAIRO_STATUS_SUCCESS) {
    g_set_error(error, G_FILE_ERROR, G_FILE_ERROR_FAILED, "%s: %s", doc->pdf_path,
                cairo_status_to_string(st));
    return FALSE;
  }
  return pp_gen_truth_write(doc->truth, doc->truth_path, error);
}

void pp_gen_doc_free(pp_gen_doc *doc) {
  if (!doc)
    return;
  if (doc->cr)
    cairo_destroy(doc->cr);
  if (doc->surface)
    cairo_surface_destroy(doc->surface);
  pp_gen_truth_free(doc->truth);
  g_free(doc->pdf_path);
  g_free(doc->truth_path);
  g_free(doc);
}

double pp_gen_nice_step(double raw) {
  double mag = pow(10, floor(log10(raw)));
  static const double mult[] = {1, 2, 2.5, 5, 10};
  for (int i = 0; i < 5; i++)
    if (mult[i] * mag >= raw * (1 - 1e-9))
      return mult[i] * mag;
  return 10 * mag;
}

void pp_gen_chart_fit_axis(pp_gen_chart *c, double frac) {
  double vmin = INFINITY, vmax = -INFINITY;
  for (int i = 0; i < c->n; i++) {
    double v = 0;
    int ns = c->n_series > 0 ? c->n_series : 1;
    for (int s = 0; s < ns; s++) {
      double x = c->values[s * c->n + i];
      if (c->stacked)
        v += x;
      else {
        vmin = fmin(vmin, x);
        vmax = fmax(vmax, x);
      }
    }
    if (c->stacked) {
      vmin = fmin(vmin, v);
      vmax = fmax(vmax, v);
    }
  }
  double lo = 0;
  if (frac > 0) {
    double target = frac * vmin;
    double q = pow(10, floor(log10(target)) - 1);
    lo = floor(target / q) * q;
  }
  double step = pp_gen_nice_step((vmax - lo) / 5);
  double hi = ceil(vmax * 1.02 / step) * step;
  if (hi <= vmax)
    hi += step;
  c->axis_min = lo;
  c->axis_max = hi;
  c->tick_step = step;
  c->decimals = step >= 1 ? 0 : (step >= 0.1 ? 1 : 2);
  if (fabs(step * pow(10, c->decimals) - round(step * pow(10, c->decimals))) > 1e-9)
    c->decimals++;
  c->bar_from = lo;
}
