/* annotate.c — `scan --annotate`: <name>.annotated.pdf, a copy of a flagged PDF with a
 * square annotation (ISO 32000-1 §12.5.6.8) around each flagged figure, its note holding
 * the headline and the measures. Written with poppler-glib; the original is only read. */
#include <math.h>
#include <poppler.h>

#include "review.h"

static char *note_text(JsonObject *doc, JsonObject *f) {
  JsonObject *m = pp_rv_obj(f, "measures");
  GString *s = g_string_new(NULL);
  const char *title = pp_rv_finding_title(doc, f);
  g_string_append_printf(s, "plotproof: %s (%s)\n", pp_rv_str(f, "rule"), pp_rv_str(f, "severity"));
  if (title)
    g_string_append_printf(s, "Figure: %s\n", title);
  g_string_append_printf(s, "%s\n", pp_rv_finding_headline(f));
  if (pp_rv_str(f, "headline") && pp_rv_str(f, "message"))
    g_string_append_printf(s, "%s\n", pp_rv_str(f, "message"));
  char *lf = pp_rv_format_value(pp_rv_lie_factor(m));
  char *gdi = pp_rv_format_value(pp_rv_num(m, "gdi"));
  char *base = pp_rv_format_value(pp_rv_num(m, "baseline_value"));
  char *pair = pp_rv_format_value(pp_rv_num(m, "max_pair_departure"));
  g_string_append_printf(s, "Lie Factor %s; GDI %s%%; baseline %s; worst pair %s\n", lf, gdi, base,
                         pair);
  g_string_append_printf(s, "Finding %s. An aid to a reviewer, not an audit opinion.",
                         pp_rv_str(f, "id") ? pp_rv_str(f, "id") : "?");
  g_free(lf), g_free(gdi), g_free(base), g_free(pair);
  char *valid = g_utf8_make_valid(s->str, -1);
  g_string_free(s, TRUE);
  return valid;
}

static double page_height(JsonObject *doc, gint64 page) {
  JsonArray *pages = pp_rv_arr(doc, "pages");
  for (guint i = 0; pages && i < json_array_get_length(pages); i++) {
    JsonObject *p = json_array_get_object_element(pages, i);
    if (pp_rv_int(p, "page") == page)
      return pp_rv_num(p, "height");
  }
  return NAN;
}

static char *uri_of(const char *path, GError **error) {
  char *abs = g_canonicalize_filename(path, NULL);
  char *uri = g_filename_to_uri(abs, NULL, error);
  g_free(abs);
  return uri;
}

gboolean pp_annotate_write(const char *pdf_path, const char *password, JsonObject *doc,
                           const char *out_path, guint *n_added, GError **error) {
  *n_added = 0;
  char *uri = uri_of(pdf_path, error);
  if (!uri)
    return FALSE;
  PopplerDocument *pdoc = poppler_document_new_from_file(uri, password, error);
  g_free(uri);
  if (!pdoc)
    return FALSE;
  JsonArray *list = pp_rv_arr(doc, "findings");
  for (guint i = 0; list && i < json_array_get_length(list); i++) {
    JsonObject *f = json_array_get_object_element(list, i);
    double b[4];
    gint64 page_no = pp_rv_int(f, "page");
    double h = page_height(doc, page_no);
    PopplerPage *page = poppler_document_get_page(pdoc, (int)page_no - 1);
    if (!page || !pp_rv_rect(f, "bbox", b) || !isfinite(h)) {
      if (page)
        g_object_unref(page);
      continue;
    }
    /* poppler-glib takes annotation boxes on the displayed page, y up from its bottom edge,
     * and itself undoes /Rotate and adds the crop box origin. */
    PopplerRectangle rect = {b[0], h - b[3], b[2], h - b[1]};
    PopplerAnnot *a = poppler_annot_square_new(pdoc, &rect);
    char *note = note_text(doc, f);
    poppler_annot_set_contents(a, note);
    g_free(note);
    poppler_annot_markup_set_label(POPPLER_ANNOT_MARKUP(a), "plotproof");
    PopplerColor red = {52000, 4000, 6000};
    poppler_annot_set_color(a, &red);
    poppler_page_add_annot(page, a);
    g_object_unref(a);
    g_object_unref(page);
    (*n_added)++;
  }
  char *out_uri = uri_of(out_path, error);
  gboolean ok = out_uri && poppler_document_save(pdoc, out_uri, error);
  g_free(out_uri);
  g_object_unref(pdoc);
  return ok;
}
