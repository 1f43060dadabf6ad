/* html_crop.c — the pictures of the review pack: a crop of a finding's figure rendered
 * by poppler at 150 dpi with cairo overlays (the marks measured, where the value axis
 * reaches zero, where the drawing's baseline sits), and a small honest bar chart of each
 * element's ink share against its value share, bars from zero on one linear scale. */
#include <math.h>
#include <poppler.h>

#include "review.h"

#define PP_CROP_DPI 150.0 /* the resolution: enough to read tick labels */
#define PP_CROP_SCALE (PP_CROP_DPI / 72.0)
/* Room around the plot box for tick labels (left, below) and the title (above), in pt:
 * typical of report charts, common practice, no source. */
#define PP_CROP_MARGIN_LEFT 60.0
#define PP_CROP_MARGIN_TOP 64.0
#define PP_CROP_MARGIN_RIGHT 24.0
#define PP_CROP_MARGIN_BOTTOM 36.0
/* The crop grows to show the value 0 when it lies at most this far outside, pt. */
#define PP_CROP_MAX_EXTEND 90.0
/* More rows than this make the share chart unreadable; the table still lists all. */
#define PP_SHARES_MAX_ROWS 24

/* Element boxes in magenta over a white halo: charts are rarely drawn in magenta. */
static const double orange[3] = {0.88, 0.48, 0.0}, blue[3] = {0.75, 0.0, 0.55},
                    red[3] = {0.75, 0.09, 0.11}, green[3] = {0.07, 0.54, 0.21},
                    grey[3] = {0.55, 0.57, 0.62};

static void rgb(cairo_t *cr, const double c[3]) {
  cairo_set_source_rgb(cr, c[0], c[1], c[2]);
}

/* Text with a white backing so it stays legible over the chart; size in device px. */
static void label(cairo_t *cr, double x, double y, const char *text, const double c[3], double px) {
  cairo_save(cr);
  double ux = x, uy = y;
  cairo_user_to_device(cr, &ux, &uy);
  cairo_identity_matrix(cr);
  cairo_select_font_face(cr, "sans-serif", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_BOLD);
  cairo_set_font_size(cr, px);
  cairo_text_extents_t e;
  cairo_text_extents(cr, text, &e);
  cairo_set_source_rgba(cr, 1, 1, 1, 0.85);
  cairo_rectangle(cr, ux - 2, uy + e.y_bearing - 2, e.x_advance + 4, e.height + 4);
  cairo_fill(cr);
  rgb(cr, c);
  cairo_move_to(cr, ux, uy);
  cairo_show_text(cr, text);
  cairo_restore(cr);
}

typedef struct {
  gboolean have, vertical, log;
  double min, max;
} axis_info;

static axis_info read_axis(JsonObject *doc, JsonObject *finding) {
  axis_info a = {0};
  JsonObject *fig = pp_rv_finding_figure(doc, finding);
  /* Format 1 wrote "value_axis" with a "log" flag, format 2 "scale" with a "kind". */
  JsonObject *ax = pp_rv_obj(fig, "scale") ? pp_rv_obj(fig, "scale") : pp_rv_obj(fig, "value_axis");
  JsonArray *range = pp_rv_arr(ax, "range");
  if (!ax || !range || json_array_get_length(range) != 2)
    return a;
  a.min = json_array_get_double_element(range, 0);
  a.max = json_array_get_double_element(range, 1);
  const char *o = pp_rv_str(ax, "orientation");
  a.vertical = !o || g_strcmp0(o, "horizontal") != 0;
  JsonNode *lg = json_object_has_member(ax, "log") ? json_object_get_member(ax, "log") : NULL;
  a.log = (lg && JSON_NODE_HOLDS_VALUE(lg) && json_node_get_boolean(lg)) ||
          g_strcmp0(pp_rv_str(ax, "kind"), "log") == 0;
  a.have = isfinite(a.min) && isfinite(a.max) && a.max > a.min;
  return a;
}

/* Page position of a value, assuming the axis range spans the plot box (the report
 * gives the range at the plot box edges). NAN for log axes and non-finite values. */
static double pos_of(const axis_info *a, const double box[4], double v) {
  if (!a->have || a->log || !isfinite(v))
    return NAN;
  double t = (v - a->min) / (a->max - a->min);
  return a->vertical ? box[3] - t * (box[3] - box[1]) : box[0] + t * (box[2] - box[0]);
}

static void page_size(JsonObject *doc, gint64 page, double *w, double *h) {
  JsonArray *pages = pp_rv_arr(doc, "pages");
  for (guint i = 0; pages && i < json_array_get_length(pages); i++) {
    JsonObject *p = json_array_get_object_element(pages, i);
    if (pp_rv_int(p, "page") == page) {
      *w = pp_rv_num(p, "width");
      *h = pp_rv_num(p, "height");
    }
  }
}

static void draw_elements(cairo_t *cr, JsonObject *finding) {
  JsonArray *els = pp_rv_arr(finding, "elements");
  for (guint i = 0; els && i < json_array_get_length(els); i++) {
    JsonObject *e = json_array_get_object_element(els, i);
    double r[4];
    if (!pp_rv_rect(e, "bbox", r) && !pp_rv_rect(e, "box", r))
      continue;
    cairo_rectangle(cr, r[0], r[1], r[2] - r[0], r[3] - r[1]);
    cairo_set_source_rgb(cr, 1, 1, 1);
    cairo_set_line_width(cr, 4.0 / PP_CROP_SCALE);
    cairo_stroke_preserve(cr);
    rgb(cr, blue);
    cairo_set_line_width(cr, 2.0 / PP_CROP_SCALE);
    cairo_stroke(cr);
    char num[16];
    g_snprintf(num, sizeof num, "%u", i + 1);
    label(cr, r[0] + 1, r[1] - 2, num, blue, 13);
  }
}

/* A horizontal (vertical axis) or vertical line across the plot at position p. */
static void axis_line(cairo_t *cr, const axis_info *a, const double box[4], double p) {
  if (a->vertical) {
    cairo_move_to(cr, box[0] - 8, p);
    cairo_line_to(cr, box[2] + 8, p);
  } else {
    cairo_move_to(cr, p, box[1] - 8);
    cairo_line_to(cr, p, box[3] + 8);
  }
  cairo_stroke(cr);
}

static void draw_axis_marks(cairo_t *cr, JsonObject *doc, JsonObject *finding, const double box[4],
                            const double crop[4]) {
  axis_info a = read_axis(doc, finding);
  JsonObject *m = pp_rv_obj(finding, "measures");
  double base = pp_rv_num(m, "baseline_value");
  double bpos = pos_of(&a, box, base);
  if (isfinite(bpos)) {
    rgb(cr, red);
    cairo_set_line_width(cr, 2.5 / PP_CROP_SCALE);
    cairo_set_dash(cr, NULL, 0, 0);
    axis_line(cr, &a, box, bpos);
    char *v = pp_rv_format_value(base);
    char *t = g_strdup_printf("baseline of the drawing = %s", v);
    label(cr, a.vertical ? box[0] + 4 : bpos + 3, a.vertical ? bpos - 4 : box[1] + 12, t, red, 13);
    g_free(t);
    g_free(v);
  }
  if (a.have && a.log) {
    label(cr, box[0] + 4, box[3] - 6, "log axis: the value 0 is never reached", green, 13);
    return;
  }
  double zpos = pos_of(&a, box, 0);
  if (!isfinite(zpos))
    return;
  double lo = a.vertical ? crop[1] : crop[0], hi = a.vertical ? crop[3] : crop[2];
  double dash[2] = {6.0 / PP_CROP_SCALE, 4.0 / PP_CROP_SCALE};
  rgb(cr, green);
  cairo_set_line_width(cr, 2.5 / PP_CROP_SCALE);
  if (zpos >= lo && zpos <= hi) {
    cairo_set_dash(cr, dash, 2, 0);
    axis_line(cr, &a, box, zpos);
    cairo_set_dash(cr, NULL, 0, 0);
    if (!isfinite(bpos) || fabs(zpos - bpos) > 1)
      label(cr, a.vertical ? box[0] + 4 : zpos + 3, a.vertical ? zpos + 14 : box[3] - 6,
            "value 0 on the axis", green, 13);
    return;
  }
  /* Zero lies outside the crop: an arrow at the edge says how far. */
  double edge = zpos > hi ? hi - 3 : lo + 3, dir = zpos > hi ? 1 : -1;
  double dist = fabs(zpos - (isfinite(bpos) ? bpos : edge));
  char *t = g_strdup_printf("value 0 lies %.0f pt %s the baseline, off this crop", dist,
                            a.vertical ? (dir > 0 ? "below" : "above")
                                       : (dir > 0 ? "right of" : "left of"));
  double mid = a.vertical ? (box[0] + box[2]) / 2 : (box[1] + box[3]) / 2;
  double ah = 8 / PP_CROP_SCALE * 1.5;
  if (a.vertical) {
    cairo_move_to(cr, mid, edge - dir * 18);
    cairo_line_to(cr, mid, edge);
    cairo_stroke(cr);
    cairo_move_to(cr, mid - ah / 2, edge - dir * ah);
    cairo_line_to(cr, mid + ah / 2, edge - dir * ah);
    cairo_line_to(cr, mid, edge);
    cairo_close_path(cr);
    cairo_fill(cr);
    label(cr, mid + 6, edge - dir * 6, t, green, 13);
  } else {
    cairo_move_to(cr, edge - dir * 18, mid);
    cairo_line_to(cr, edge, mid);
    cairo_stroke(cr);
    label(cr, edge - dir * 150, mid - 6, t, green, 13);
  }
  g_free(t);
}

/* The crop rectangle: plot box plus margins, grown to show 0 when it is close. */
static void crop_rect(JsonObject *doc, JsonObject *finding, const double box[4], double pw,
                      double ph, double crop[4]) {
  crop[0] = box[0] - PP_CROP_MARGIN_LEFT, crop[1] = box[1] - PP_CROP_MARGIN_TOP;
  crop[2] = box[2] + PP_CROP_MARGIN_RIGHT, crop[3] = box[3] + PP_CROP_MARGIN_BOTTOM;
  axis_info a = read_axis(doc, finding);
  double z = pos_of(&a, box, 0);
  if (isfinite(z)) {
    int lo = a.vertical ? 1 : 0, hi = a.vertical ? 3 : 2;
    if (z > crop[hi] && z - crop[hi] <= PP_CROP_MAX_EXTEND)
      crop[hi] = z + 12;
    if (z < crop[lo] && crop[lo] - z <= PP_CROP_MAX_EXTEND)
      crop[lo] = z - 12;
  }
  if (isfinite(pw) && isfinite(ph)) {
    crop[0] = MAX(crop[0], 0), crop[1] = MAX(crop[1], 0);
    crop[2] = MIN(crop[2], pw), crop[3] = MIN(crop[3], ph);
  }
}

static gboolean write_png(cairo_surface_t *s, const char *path, GError **error) {
  cairo_status_t st = cairo_surface_write_to_png(s, path);
  if (st != CAIRO_STATUS_SUCCESS) {
    g_set_error(error, G_FILE_ERROR, G_FILE_ERROR_FAILED, "cannot write %s: %s", path,
                cairo_status_to_string(st));
    return FALSE;
  }
  return TRUE;
}

gboolean pp_html_render_crop(const char *pdf_path, const char *password, JsonObject *doc,
                             JsonObject *finding, const char *png_path, int *w, int *h,
                             GError **error) {
  double box[4];
  if (!pp_rv_rect(finding, "bbox", box)) {
    g_set_error(error, G_FILE_ERROR, G_FILE_ERROR_INVAL, "the finding has no box");
    return FALSE;
  }
  char *abs = g_canonicalize_filename(pdf_path, NULL);
  char *uri = g_filename_to_uri(abs, NULL, error);
  g_free(abs);
  if (!uri)
    return FALSE;
  PopplerDocument *pdoc = poppler_document_new_from_file(uri, password, error);
  g_free(uri);
  if (!pdoc)
    return FALSE;
  gint64 page_no = pp_rv_int(finding, "page");
  PopplerPage *page = poppler_document_get_page(pdoc, (int)page_no - 1);
  if (!page) {
    g_set_error(error, G_FILE_ERROR, G_FILE_ERROR_INVAL, "no page %" G_GINT64_FORMAT, page_no);
    g_object_unref(pdoc);
    return FALSE;
  }
  double pw = NAN, ph = NAN, crop[4];
  page_size(doc, page_no, &pw, &ph);
  crop_rect(doc, finding, box, pw, ph, crop);
  *w = (int)ceil((crop[2] - crop[0]) * PP_CROP_SCALE);
  *h = (int)ceil((crop[3] - crop[1]) * PP_CROP_SCALE);
  cairo_surface_t *s = cairo_image_surface_create(CAIRO_FORMAT_RGB24, *w, *h);
  cairo_t *cr = cairo_create(s);
  cairo_set_source_rgb(cr, 1, 1, 1);
  cairo_paint(cr);
  cairo_scale(cr, PP_CROP_SCALE, PP_CROP_SCALE);
  cairo_translate(cr, -crop[0], -crop[1]);
  cairo_save(cr);
  /* The same call the capture stage uses, so page points here are the findings' points. */
  poppler_page_render_for_printing(page, cr);
  cairo_restore(cr);
  /* The plot box the rule measured. */
  double dash[2] = {5.0 / PP_CROP_SCALE, 3.0 / PP_CROP_SCALE};
  rgb(cr, orange);
  cairo_set_line_width(cr, 1.5 / PP_CROP_SCALE);
  cairo_set_dash(cr, dash, 2, 0);
  cairo_rectangle(cr, box[0], box[1], box[2] - box[0], box[3] - box[1]);
  cairo_stroke(cr);
  cairo_set_dash(cr, NULL, 0, 0);
  draw_elements(cr, finding);
  draw_axis_marks(cr, doc, finding, box, crop);
  cairo_destroy(cr);
  gboolean ok = write_png(s, png_path, error);
  cairo_surface_destroy(s);
  g_object_unref(page);
  g_object_unref(pdoc);
  return ok;
}

gboolean pp_html_render_shares(JsonObject *finding, const char *png_path, int *w, int *h,
                               GError **error) {
  JsonArray *els = pp_rv_arr(finding, "elements");
  guint n = els ? MIN(json_array_get_length(els), PP_SHARES_MAX_ROWS) : 0;
  double sum_v = 0, sum_g = 0, top = 0;
  for (guint i = 0; i < n; i++) {
    JsonObject *e = json_array_get_object_element(els, i);
    double v = pp_rv_num(e, "value"), g = pp_rv_num(e, "ink");
    /* Shares of a whole only mean something for positive amounts. */
    if (!(v > 0) || !(g >= 0)) {
      g_set_error(error, G_FILE_ERROR, G_FILE_ERROR_INVAL, "values are not all positive");
      return FALSE;
    }
    sum_v += v, sum_g += g;
  }
  if (n == 0 || sum_v <= 0 || sum_g <= 0) {
    g_set_error(error, G_FILE_ERROR, G_FILE_ERROR_INVAL, "no elements to chart");
    return FALSE;
  }
  for (guint i = 0; i < n; i++) {
    JsonObject *e = json_array_get_object_element(els, i);
    top = fmax(top, fmax(pp_rv_num(e, "value") / sum_v, pp_rv_num(e, "ink") / sum_g));
  }
  /* Axis end: the next multiple of 10% above the largest share. */
  double axis_end = fmin(1.0, ceil(top * 10 + 1e-9) / 10);
  const double left = 130, right = 60, row = 30, bar = 11, head = 34, foot = 30;
  double plot_w = 300;
  *w = (int)(left + plot_w + right);
  *h = (int)(head + n * row + foot);
  cairo_surface_t *s = cairo_image_surface_create(CAIRO_FORMAT_RGB24, *w, *h);
  cairo_t *cr = cairo_create(s);
  cairo_set_source_rgb(cr, 1, 1, 1);
  cairo_paint(cr);
  cairo_select_font_face(cr, "sans-serif", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_NORMAL);
  cairo_set_font_size(cr, 12);
  /* Legend. */
  rgb(cr, red);
  cairo_rectangle(cr, left, 8, 14, 10);
  cairo_fill(cr);
  cairo_set_source_rgb(cr, 0.1, 0.1, 0.12);
  cairo_move_to(cr, left + 18, 18);
  cairo_show_text(cr, "share of the ink");
  rgb(cr, grey);
  cairo_rectangle(cr, left + 140, 8, 14, 10);
  cairo_fill(cr);
  cairo_set_source_rgb(cr, 0.1, 0.1, 0.12);
  cairo_move_to(cr, left + 158, 18);
  cairo_show_text(cr, "share of the value");
  /* Grid at every 10% from 0, on one linear scale. */
  for (int k = 0; k <= (int)round(axis_end * 10); k++) {
    double x = left + plot_w * (k / 10.0) / axis_end;
    cairo_set_source_rgb(cr, 0.85, 0.86, 0.88);
    cairo_set_line_width(cr, 1);
    cairo_move_to(cr, round(x) + 0.5, head - 4);
    cairo_line_to(cr, round(x) + 0.5, head + n * row);
    cairo_stroke(cr);
    char t[16];
    g_snprintf(t, sizeof t, "%d%%", k * 10);
    cairo_set_source_rgb(cr, 0.3, 0.3, 0.35);
    cairo_move_to(cr, x - 10, head + n * row + 16);
    cairo_show_text(cr, t);
  }
  for (guint i = 0; i < n; i++) {
    JsonObject *e = json_array_get_object_element(els, i);
    double vs = pp_rv_num(e, "value") / sum_v, gs = pp_rv_num(e, "ink") / sum_g;
    double y = head + i * row + 3;
    const char *cat = pp_rv_str(e, "category");
    char *name = cat ? g_utf8_substring(cat, 0, MIN(g_utf8_strlen(cat, -1), 18))
                     : g_strdup_printf("element %u", i + 1);
    cairo_set_source_rgb(cr, 0.1, 0.1, 0.12);
    cairo_move_to(cr, 6, y + bar + 4);
    cairo_show_text(cr, name);
    g_free(name);
    const double *colors[2] = {red, grey};
    double shares[2] = {gs, vs};
    for (int k = 0; k < 2; k++) {
      double len = plot_w * shares[k] / axis_end;
      rgb(cr, colors[k]);
      cairo_rectangle(cr, left, y + k * bar, len, bar - 1);
      cairo_fill(cr);
      char t[16];
      g_snprintf(t, sizeof t, "%.1f%%", 100 * shares[k]);
      cairo_set_source_rgb(cr, 0.2, 0.2, 0.25);
      cairo_set_font_size(cr, 10);
      cairo_move_to(cr, left + len + 4, y + k * bar + bar - 2);
      cairo_show_text(cr, t);
      cairo_set_font_size(cr, 12);
    }
  }
  cairo_destroy(cr);
  gboolean ok = write_png(s, png_path, error);
  cairo_surface_destroy(s);
  return ok;
}
