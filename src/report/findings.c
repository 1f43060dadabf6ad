/* findings.c — the findings file, version 2: document identity, per-page coverage and
 * findings, accumulated as small JSON nodes so scenes can be freed page by page. Boxes
 * are mapped to PDF space here (pp_rect_transform), never by the rules.
 * The layout is specified in docs/findings-format.md and docs/findings.schema.json. */
#include <math.h>

#include "json_util.h"
#include "report.h"

struct pp_report {
  pp_document_info info; /* deep copy */
  pp_thresholds thresholds;
  JsonArray *pages;
  JsonArray *findings;
  guint n_pages_failed, n_figures, n_raster, n_scale_failures;
  guint by_severity[PP_SEVERITY_SEVERE + 1];
};

pp_report *pp_report_new(const pp_document_info *info, const pp_thresholds *thresholds) {
  pp_report *r = g_new0(pp_report, 1);
  r->info = *info;
  r->info.path = g_strdup(info->path);
  r->info.sha256 = g_strdup(info->sha256);
  r->info.pdf_version = g_strdup(info->pdf_version);
  r->info.producer = g_strdup(info->producer);
  r->info.creator = g_strdup(info->creator);
  r->info.title = g_strdup(info->title);
  r->thresholds = thresholds ? *thresholds : pp_thresholds_default();
  r->pages = json_array_new();
  r->findings = json_array_new();
  return r;
}

void pp_report_free(pp_report *r) {
  if (!r)
    return;
  g_free(r->info.path);
  g_free(r->info.sha256);
  g_free(r->info.pdf_version);
  g_free(r->info.producer);
  g_free(r->info.creator);
  g_free(r->info.title);
  json_array_unref(r->pages);
  json_array_unref(r->findings);
  g_free(r);
}

guint pp_report_n_pages_added(const pp_report *r) {
  return json_array_get_length(r->pages);
}
guint pp_report_n_pages_failed(const pp_report *r) {
  return r->n_pages_failed;
}
guint pp_report_n_findings(const pp_report *r) {
  return json_array_get_length(r->findings);
}

static void add_mark_counts(JsonBuilder *b, const pp_scene *scene) {
  guint n[PP_MARK_GLYPHS + 1] = {0};
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    if (m->kind <= PP_MARK_GLYPHS)
      n[m->kind]++;
  }
  json_builder_set_member_name(b, "marks");
  json_builder_begin_object(b);
  for (int k = PP_MARK_FILL; k <= PP_MARK_GLYPHS; k++)
    pp_json_member_int(b, pp_mark_kind_name(k), n[k]);
  pp_json_member_int(b, "total", scene->marks->len);
  json_builder_end_object(b);
}

static void add_scale(JsonBuilder *b, const pp_scale *scale) {
  json_builder_set_member_name(b, "scale");
  if (!scale) {
    json_builder_add_null_value(b);
    return;
  }
  json_builder_begin_object(b);
  pp_json_member_string(b, "orientation", scale->vertical ? "vertical" : "horizontal");
  pp_json_member_string(b, "kind", scale->kind == PP_SCALE_LOG ? "log" : "linear");
  pp_json_member_int(b, "ticks", scale->ticks ? scale->ticks->len : 0);
  json_builder_set_member_name(b, "range");
  json_builder_begin_array(b);
  pp_json_add_number(b, scale->min_value);
  pp_json_add_number(b, scale->max_value);
  json_builder_end_array(b);
  json_builder_end_object(b);
}

/* Both boxes of one region: page points as found, PDF user space through the page's
 * mapping. */
static void add_boxes(JsonBuilder *b, pp_rect r, const pp_scene *scene) {
  pp_json_member_rect(b, "bbox", r);
  pp_json_member_rect(b, "pdf_bbox", pp_rect_transform(r, scene->to_pdf));
}

static void add_figures(JsonBuilder *b, const pp_scene *scene, const pp_page_charts *charts) {
  json_builder_set_member_name(b, "figures");
  json_builder_begin_array(b);
  for (guint i = 0; charts && charts->figures && i < charts->figures->len; i++) {
    const pp_figure *f = g_ptr_array_index(charts->figures, i);
    json_builder_begin_object(b);
    pp_json_member_string(b, "id", f->fingerprint);
    pp_json_member_string(b, "kind", pp_figure_kind_name(f->kind));
    pp_json_member_string(b, "recognizer", f->recognizer);
    pp_json_member_string(b, "title", f->title);
    add_boxes(b, f->bbox, scene);
    add_scale(b, f->scale);
    pp_json_member_int(b, "elements", f->elements ? f->elements->len : 0);
    pp_json_member_int(b, "series", f->n_series);
    pp_json_member_bool(b, "judged", f->judged);
    pp_json_member_number(b, "confidence", f->confidence);
    pp_json_member_evidence(b, f);
    pp_json_member_string(b, "not_judged_reason", f->judged ? NULL : f->not_judged_reason);
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
}

static void add_not_analysed(JsonBuilder *b, const pp_scene *scene, const pp_page_charts *charts) {
  json_builder_set_member_name(b, "raster_images_not_analysed");
  json_builder_begin_array(b);
  for (guint i = 0; charts && charts->raster_images && i < charts->raster_images->len; i++) {
    pp_rect r = g_array_index(charts->raster_images, pp_rect, i);
    json_builder_begin_object(b);
    add_boxes(b, r, scene);
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
  json_builder_set_member_name(b, "scale_failures");
  json_builder_begin_array(b);
  for (guint i = 0; charts && charts->scale_failures && i < charts->scale_failures->len; i++) {
    const pp_scale_failure *s = g_ptr_array_index(charts->scale_failures, i);
    json_builder_begin_object(b);
    add_boxes(b, s->bbox, scene);
    pp_json_member_string(b, "reason", s->reason ? s->reason : "unknown");
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
}

static void add_warnings(JsonBuilder *b, const GPtrArray *warnings) {
  json_builder_set_member_name(b, "warnings");
  json_builder_begin_array(b);
  for (guint i = 0; warnings && i < warnings->len; i++) {
    const char *w = g_ptr_array_index(warnings, i);
    /* poppler messages are not guaranteed UTF-8; JSON strings must be. */
    char *valid = g_utf8_make_valid(w, -1);
    json_builder_add_string_value(b, valid);
    g_free(valid);
  }
  json_builder_end_array(b);
}

static JsonNode *page_node(const pp_scene *scene, const pp_page_charts *charts) {
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  pp_json_member_int(b, "page", scene->page_index + 1);
  pp_json_member_number(b, "width", scene->width);
  pp_json_member_number(b, "height", scene->height);
  pp_json_member_int(b, "rotation", scene->rotation);
  add_mark_counts(b, scene);
  pp_json_member_int(b, "text_runs", scene->words->len);
  pp_json_member_int(b, "raster_images", scene->n_images);
  add_figures(b, scene, charts);
  add_not_analysed(b, scene, charts);
  add_warnings(b, scene->warnings);
  json_builder_set_member_name(b, "error");
  json_builder_add_null_value(b);
  json_builder_end_object(b);
  return json_builder_get_root(b);
}

static void add_measures(JsonBuilder *b, const pp_measures *m) {
  json_builder_set_member_name(b, "measures");
  json_builder_begin_object(b);
  pp_json_member_number(b, "lie_factor", m->lie_factor);
  pp_json_member_string(b, "lie_factor_definition", PP_REPORT_LIE_FACTOR_DEFINITION);
  pp_json_member_number(b, "ink_growth_ratio", m->growth_ratio);
  pp_json_member_number(b, "gdi", m->gdi);
  pp_json_member_number(b, "baseline_value", m->baseline_value);
  pp_json_member_number(b, "max_pair_departure", m->max_pair_departure);
  pp_json_member_number(b, "distortion", m->distortion);
  for (guint i = 0; i < m->n_extra; i++)
    pp_json_member_number(b, m->extra[i].name, m->extra[i].value);
  json_builder_end_object(b);
}

static void add_elements(JsonBuilder *b, const pp_finding *f, const pp_scene *scene) {
  json_builder_set_member_name(b, "elements");
  json_builder_begin_array(b);
  for (guint i = 0; f->elements && i < f->elements->len; i++) {
    const pp_finding_element *e = &g_array_index(f->elements, pp_finding_element, i);
    json_builder_begin_object(b);
    char *cat = e->category ? g_utf8_make_valid(e->category, -1) : NULL;
    pp_json_member_string(b, "category", cat);
    g_free(cat);
    pp_json_member_number(b, "value", e->value);
    pp_json_member_string(b, "printed", e->printed);
    pp_json_member_number(b, "ink", e->ink);
    add_boxes(b, e->box, scene);
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
}

static JsonNode *finding_node(const pp_finding *f, const pp_scene *scene) {
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  pp_json_member_string(b, "id", f->id ? f->id : "");
  pp_json_member_int(b, "page", scene->page_index + 1);
  add_boxes(b, f->bbox, scene);
  pp_json_member_string(b, "figure_id", f->figure_id);
  pp_json_member_string(b, "figure_title", f->figure_title);
  pp_json_member_string(b, "figure_kind", pp_figure_kind_name(f->figure_kind));
  pp_json_member_string(b, "rule", f->rule ? f->rule : "unknown");
  pp_json_member_string(b, "severity", pp_severity_name(f->severity));
  add_measures(b, &f->measures);
  add_elements(b, f, scene);
  pp_json_member_string(b, "headline", f->headline ? f->headline : "");
  pp_json_member_string(b, "message", f->message ? f->message : "");
  json_builder_end_object(b);
  return json_builder_get_root(b);
}

void pp_report_add_page(pp_report *r, const pp_scene *scene, const pp_page_charts *charts,
                        const GPtrArray *findings) {
  json_array_add_element(r->pages, page_node(scene, charts));
  if (charts) {
    r->n_figures += charts->figures ? charts->figures->len : 0;
    r->n_raster += charts->raster_images ? charts->raster_images->len : 0;
    r->n_scale_failures += charts->scale_failures ? charts->scale_failures->len : 0;
  }
  for (guint i = 0; findings && i < findings->len; i++) {
    const pp_finding *f = g_ptr_array_index((GPtrArray *)findings, i);
    json_array_add_element(r->findings, finding_node(f, scene));
    if (f->severity <= PP_SEVERITY_SEVERE)
      r->by_severity[f->severity]++;
  }
}

void pp_report_add_failed_page(pp_report *r, guint page_index, const char *reason) {
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  pp_json_member_int(b, "page", page_index + 1);
  char *valid = g_utf8_make_valid(reason ? reason : "the page could not be captured", -1);
  pp_json_member_string(b, "error", valid);
  g_free(valid);
  json_builder_end_object(b);
  json_array_add_element(r->pages, json_builder_get_root(b));
  r->n_pages_failed++;
}

static void add_document(JsonBuilder *b, const pp_document_info *info) {
  json_builder_set_member_name(b, "document");
  json_builder_begin_object(b);
  char *path = g_filename_display_name(info->path);
  pp_json_member_string(b, "path", path);
  g_free(path);
  pp_json_member_int(b, "size", (gint64)info->size);
  pp_json_member_string(b, "sha256", info->sha256);
  pp_json_member_int(b, "pages", info->n_pages);
  const char *text[] = {info->pdf_version, info->producer, info->creator, info->title};
  const char *names[] = {"pdf_version", "producer", "creator", "title"};
  for (int i = 0; i < 4; i++) {
    char *valid = text[i] ? g_utf8_make_valid(text[i], -1) : NULL;
    pp_json_member_string(b, names[i], valid);
    g_free(valid);
  }
  json_builder_end_object(b);
}

static void add_header(JsonBuilder *b, const pp_report *r) {
  pp_json_member_string(b, "format", PP_REPORT_FORMAT);
  pp_json_member_int(b, "version", PP_REPORT_VERSION);
  json_builder_set_member_name(b, "tool");
  json_builder_begin_object(b);
  pp_json_member_string(b, "name", "plotproof");
  pp_json_member_string(b, "version", PP_VERSION);
  json_builder_end_object(b);
  pp_json_member_string(b, "disclaimer", PP_REPORT_DISCLAIMER);
  json_builder_set_member_name(b, "coordinates");
  json_builder_begin_object(b);
  pp_json_member_string(b, "rect",
                        "[x0, y0, x1, y1] with x0 <= x1 and y0 <= y1, in points (1/72 in)");
  pp_json_member_string(b, "bbox",
                        "page points, origin at the top-left of the displayed page, y down");
  pp_json_member_string(b, "pdf_bbox", "PDF default user space, origin at the bottom-left, y up");
  json_builder_end_object(b);
  json_builder_set_member_name(b, "thresholds");
  json_builder_begin_object(b);
  json_builder_set_member_name(b, "lie_band");
  json_builder_begin_array(b);
  pp_json_add_number(b, r->thresholds.lie_band_low);
  pp_json_add_number(b, r->thresholds.lie_band_high);
  json_builder_end_array(b);
  pp_json_member_number(b, "gdi_limit_percent", r->thresholds.gdi_limit);
  pp_json_member_number(b, "severe_factor", r->thresholds.severe_factor);
  pp_json_member_number(b, "label_tolerance", r->thresholds.label_tolerance);
  json_builder_end_object(b);
}

static JsonNode *totals_node(const pp_report *r) {
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  guint added = json_array_get_length(r->pages);
  pp_json_member_int(b, "pages", added);
  pp_json_member_int(b, "pages_analysed", added - r->n_pages_failed);
  pp_json_member_int(b, "pages_failed", r->n_pages_failed);
  pp_json_member_int(b, "figures", r->n_figures);
  pp_json_member_int(b, "raster_images_not_analysed", r->n_raster);
  pp_json_member_int(b, "scale_failures", r->n_scale_failures);
  pp_json_member_int(b, "findings", json_array_get_length(r->findings));
  json_builder_set_member_name(b, "by_severity");
  json_builder_begin_object(b);
  for (int s = PP_SEVERITY_MINOR; s <= PP_SEVERITY_SEVERE; s++)
    pp_json_member_int(b, pp_severity_name(s), r->by_severity[s]);
  json_builder_end_object(b);
  json_builder_end_object(b);
  return json_builder_get_root(b);
}

JsonNode *pp_report_to_json(const pp_report *r) {
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  add_header(b, r);
  add_document(b, &r->info);
  json_builder_end_object(b);
  JsonNode *root = json_builder_get_root(b);
  JsonObject *obj = json_node_get_object(root);
  /* The arrays are shared, not copied: serialisation does not modify them. */
  json_object_set_array_member(obj, "pages", json_array_ref(r->pages));
  json_object_set_array_member(obj, "findings", json_array_ref(r->findings));
  json_object_set_member(obj, "totals", totals_node(r));
  return root;
}

char *pp_report_node_to_string(JsonNode *node, gboolean pretty, gsize *length) {
  if (!pretty)
    return pp_json_write_compact(node, length);
  g_autoptr(JsonGenerator) gen = json_generator_new();
  json_generator_set_pretty(gen, pretty);
  json_generator_set_indent(gen, 2);
  json_generator_set_root(gen, node);
  return json_generator_to_data(gen, length);
}

char *pp_report_to_string(const pp_report *r, gboolean pretty, gsize *length) {
  JsonNode *root = pp_report_to_json(r);
  char *s = pp_report_node_to_string(root, pretty, length);
  json_node_unref(root);
  return s;
}

char *pp_report_parts_to_string(const pp_report *r, gsize *length) {
  JsonObject *o = json_object_new();
  json_object_set_array_member(o, "pages", json_array_ref(r->pages));
  json_object_set_array_member(o, "findings", json_array_ref(r->findings));
  JsonNode *n = json_node_new(JSON_NODE_OBJECT);
  json_node_take_object(n, o);
  char *s = pp_json_write_compact(n, length);
  json_node_unref(n);
  return s;
}

gboolean pp_report_write_file(const pp_report *r, const char *path, GError **error) {
  gsize len = 0;
  char *text = pp_report_to_string(r, TRUE, &len);
  /* A trailing newline keeps the file friendly to line tools. */
  char *with_nl = g_strconcat(text, "\n", NULL);
  gboolean ok = g_file_set_contents(path, with_nl, (gssize)len + 1, error);
  g_free(with_nl);
  g_free(text);
  return ok;
}
