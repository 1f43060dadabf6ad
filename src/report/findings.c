/* findings.c — the findings file: document identity, per-page coverage and findings,
 * accumulated as compact JSON text so scenes can be freed page by page. Boxes
 * are mapped to PDF space here (pp_rect_transform), never by the rules.
 * The layout is specified in docs/findings-format.md and docs/findings.schema.json. */
#include <math.h>
#include <string.h>

#include "json_util.h"
#include "report.h"

struct pp_report {
  pp_document_info info; /* deep copy */
  pp_thresholds thresholds;
  /* The page entries and the findings as compact JSON text, elements joined by ',': written
   * straight from the model (pp_json_out), they cost no tree to build, write and free. */
  GString *pages, *findings;
  guint n_pages, n_findings;
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
  r->pages = g_string_sized_new(4096);
  r->findings = g_string_new(NULL);
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
  g_string_free(r->pages, TRUE);
  g_string_free(r->findings, TRUE);
  g_free(r);
}

guint pp_report_n_pages_added(const pp_report *r) {
  return r->n_pages;
}
guint pp_report_n_pages_failed(const pp_report *r) {
  return r->n_pages_failed;
}
guint pp_report_n_findings(const pp_report *r) {
  return r->n_findings;
}

static void add_mark_counts(pp_json_out *o, const pp_scene *scene) {
  guint n[PP_MARK_GLYPHS + 1] = {0};
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    if (m->kind <= PP_MARK_GLYPHS)
      n[m->kind]++;
  }
  pp_json_out_name(o, "marks");
  pp_json_out_begin_object(o);
  for (int k = PP_MARK_FILL; k <= PP_MARK_GLYPHS; k++)
    pp_json_out_member_int(o, pp_mark_kind_name(k), n[k]);
  pp_json_out_member_int(o, "total", scene->marks->len);
  pp_json_out_end_object(o);
}

static void add_scale(pp_json_out *o, const pp_scale *scale) {
  pp_json_out_name(o, "scale");
  if (!scale) {
    pp_json_out_null(o);
    return;
  }
  pp_json_out_begin_object(o);
  pp_json_out_member_text(o, "orientation", scale->vertical ? "vertical" : "horizontal");
  pp_json_out_member_text(o, "kind", scale->kind == PP_SCALE_LOG ? "log" : "linear");
  pp_json_out_member_int(o, "ticks", scale->ticks ? scale->ticks->len : 0);
  pp_json_out_name(o, "range");
  pp_json_out_begin_array(o);
  pp_json_out_number(o, scale->min_value);
  pp_json_out_number(o, scale->max_value);
  pp_json_out_end_array(o);
  pp_json_out_end_object(o);
}

/* Both boxes of one region: page points as found, PDF user space through the page's
 * mapping. */
static void add_boxes(pp_json_out *o, pp_rect r, const pp_scene *scene) {
  pp_json_out_member_rect(o, "bbox", r);
  pp_json_out_member_rect(o, "pdf_bbox", pp_rect_transform(r, scene->to_pdf));
}

static void add_figures(pp_json_out *o, const pp_scene *scene, const pp_page_charts *charts) {
  pp_json_out_name(o, "figures");
  pp_json_out_begin_array(o);
  for (guint i = 0; charts && charts->figures && i < charts->figures->len; i++) {
    const pp_figure *f = g_ptr_array_index(charts->figures, i);
    pp_json_out_begin_object(o);
    pp_json_out_member_text(o, "id", f->fingerprint);
    pp_json_out_member_text(o, "kind", pp_figure_kind_name(f->kind));
    pp_json_out_member_text(o, "recognizer", f->recognizer);
    pp_json_out_member_text(o, "title", f->title);
    add_boxes(o, f->bbox, scene);
    add_scale(o, f->scale);
    pp_json_out_member_int(o, "elements", f->elements ? f->elements->len : 0);
    pp_json_out_member_int(o, "series", f->n_series);
    pp_json_out_member_bool(o, "judged", f->judged);
    pp_json_out_member_number(o, "confidence", f->confidence);
    pp_json_out_member_evidence(o, f);
    pp_json_out_member_text(o, "not_judged_reason", f->judged ? NULL : f->not_judged_reason);
    pp_json_out_end_object(o);
  }
  pp_json_out_end_array(o);
}

static void add_not_analysed(pp_json_out *o, const pp_scene *scene, const pp_page_charts *charts) {
  pp_json_out_name(o, "raster_images_not_analysed");
  pp_json_out_begin_array(o);
  for (guint i = 0; charts && charts->raster_images && i < charts->raster_images->len; i++) {
    pp_rect r = g_array_index(charts->raster_images, pp_rect, i);
    pp_json_out_begin_object(o);
    add_boxes(o, r, scene);
    pp_json_out_end_object(o);
  }
  pp_json_out_end_array(o);
  pp_json_out_name(o, "scale_failures");
  pp_json_out_begin_array(o);
  for (guint i = 0; charts && charts->scale_failures && i < charts->scale_failures->len; i++) {
    const pp_scale_failure *s = g_ptr_array_index(charts->scale_failures, i);
    pp_json_out_begin_object(o);
    add_boxes(o, s->bbox, scene);
    pp_json_out_member_text(o, "reason", s->reason ? s->reason : "unknown");
    pp_json_out_end_object(o);
  }
  pp_json_out_end_array(o);
}

static void add_warnings(pp_json_out *o, const GPtrArray *warnings) {
  pp_json_out_name(o, "warnings");
  pp_json_out_begin_array(o);
  /* poppler messages are not guaranteed UTF-8; JSON strings must be. */
  for (guint i = 0; warnings && i < warnings->len; i++)
    pp_json_out_text(o, g_ptr_array_index(warnings, i));
  pp_json_out_end_array(o);
}

static void add_page_entry(pp_json_out *o, const pp_scene *scene, const pp_page_charts *charts) {
  pp_json_out_begin_object(o);
  pp_json_out_member_int(o, "page", scene->page_index + 1);
  pp_json_out_member_number(o, "width", scene->width);
  pp_json_out_member_number(o, "height", scene->height);
  pp_json_out_member_int(o, "rotation", scene->rotation);
  add_mark_counts(o, scene);
  pp_json_out_member_int(o, "text_runs", scene->words->len);
  pp_json_out_member_int(o, "raster_images", scene->n_images);
  add_figures(o, scene, charts);
  add_not_analysed(o, scene, charts);
  add_warnings(o, scene->warnings);
  pp_json_out_name(o, "error");
  pp_json_out_null(o);
  pp_json_out_end_object(o);
}

/* One measure; a name given twice keeps its first place and its last value, as a JSON object
 * built member by member does (json-glib's json_object_set_member). */
typedef struct {
  const char *name, *text;
  double value;
} measure;

static void put_measure(measure *list, guint *n, const char *name, double value, const char *text) {
  if (!name)
    return;
  guint i = 0;
  while (i < *n && strcmp(list[i].name, name) != 0)
    i++;
  list[i] = (measure){name, text, value};
  if (i == *n)
    (*n)++;
}

static void add_measures(pp_json_out *o, const pp_measures *m) {
  measure list[7 + PP_MEASURES_MAX_EXTRA];
  guint n = 0;
  put_measure(list, &n, "lie_factor", m->lie_factor, NULL);
  put_measure(list, &n, "lie_factor_definition", 0, PP_REPORT_LIE_FACTOR_DEFINITION);
  put_measure(list, &n, "ink_growth_ratio", m->growth_ratio, NULL);
  put_measure(list, &n, "gdi", m->gdi, NULL);
  put_measure(list, &n, "baseline_value", m->baseline_value, NULL);
  put_measure(list, &n, "max_pair_departure", m->max_pair_departure, NULL);
  put_measure(list, &n, "distortion", m->distortion, NULL);
  for (guint i = 0; i < m->n_extra && i < PP_MEASURES_MAX_EXTRA; i++)
    put_measure(list, &n, m->extra[i].name, m->extra[i].value, NULL);
  pp_json_out_name(o, "measures");
  pp_json_out_begin_object(o);
  for (guint i = 0; i < n; i++) {
    if (list[i].text)
      pp_json_out_member_text(o, list[i].name, list[i].text);
    else
      pp_json_out_member_number(o, list[i].name, list[i].value);
  }
  pp_json_out_end_object(o);
}

static void add_elements(pp_json_out *o, const pp_finding *f, const pp_scene *scene) {
  pp_json_out_name(o, "elements");
  pp_json_out_begin_array(o);
  for (guint i = 0; f->elements && i < f->elements->len; i++) {
    const pp_finding_element *e = &g_array_index(f->elements, pp_finding_element, i);
    pp_json_out_begin_object(o);
    pp_json_out_member_text(o, "category", e->category);
    pp_json_out_member_number(o, "value", e->value);
    pp_json_out_member_text(o, "printed", e->printed);
    pp_json_out_member_number(o, "ink", e->ink);
    add_boxes(o, e->box, scene);
    pp_json_out_end_object(o);
  }
  pp_json_out_end_array(o);
}

static void add_finding(pp_json_out *o, const pp_finding *f, const pp_scene *scene) {
  pp_json_out_begin_object(o);
  pp_json_out_member_text(o, "id", f->id ? f->id : "");
  pp_json_out_member_int(o, "page", scene->page_index + 1);
  add_boxes(o, f->bbox, scene);
  pp_json_out_member_text(o, "figure_id", f->figure_id);
  pp_json_out_member_text(o, "figure_title", f->figure_title);
  pp_json_out_member_text(o, "figure_kind", pp_figure_kind_name(f->figure_kind));
  pp_json_out_member_text(o, "rule", f->rule ? f->rule : "unknown");
  pp_json_out_member_text(o, "severity", pp_severity_name(f->severity));
  add_measures(o, &f->measures);
  add_elements(o, f, scene);
  pp_json_out_member_text(o, "headline", f->headline ? f->headline : "");
  pp_json_out_member_text(o, "message", f->message ? f->message : "");
  pp_json_out_end_object(o);
}

void pp_report_add_page(pp_report *r, const pp_scene *scene, const pp_page_charts *charts,
                        const GPtrArray *findings) {
  pp_json_out pages = {r->pages, r->n_pages > 0};
  add_page_entry(&pages, scene, charts);
  r->n_pages++;
  if (charts) {
    r->n_figures += charts->figures ? charts->figures->len : 0;
    r->n_raster += charts->raster_images ? charts->raster_images->len : 0;
    r->n_scale_failures += charts->scale_failures ? charts->scale_failures->len : 0;
  }
  pp_json_out found = {r->findings, r->n_findings > 0};
  for (guint i = 0; findings && i < findings->len; i++) {
    const pp_finding *f = g_ptr_array_index((GPtrArray *)findings, i);
    add_finding(&found, f, scene);
    r->n_findings++;
    if (f->severity <= PP_SEVERITY_SEVERE)
      r->by_severity[f->severity]++;
  }
}

void pp_report_add_failed_page(pp_report *r, guint page_index, const char *reason) {
  pp_json_out o = {r->pages, r->n_pages > 0};
  pp_json_out_begin_object(&o);
  pp_json_out_member_int(&o, "page", page_index + 1);
  pp_json_out_member_text(&o, "error", reason ? reason : "the page could not be captured");
  pp_json_out_end_object(&o);
  r->n_pages++;
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
  pp_json_member_int(b, "pages", r->n_pages);
  pp_json_member_int(b, "pages_analysed", r->n_pages - r->n_pages_failed);
  pp_json_member_int(b, "pages_failed", r->n_pages_failed);
  pp_json_member_int(b, "figures", r->n_figures);
  pp_json_member_int(b, "raster_images_not_analysed", r->n_raster);
  pp_json_member_int(b, "scale_failures", r->n_scale_failures);
  pp_json_member_int(b, "findings", r->n_findings);
  json_builder_set_member_name(b, "by_severity");
  json_builder_begin_object(b);
  for (int s = PP_SEVERITY_MINOR; s <= PP_SEVERITY_SEVERE; s++)
    pp_json_member_int(b, pp_severity_name(s), r->by_severity[s]);
  json_builder_end_object(b);
  json_builder_end_object(b);
  return json_builder_get_root(b);
}

/* The members before "pages": format, tool, thresholds, document. */
static JsonNode *header_node(const pp_report *r) {
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  add_header(b, r);
  add_document(b, &r->info);
  json_builder_end_object(b);
  return json_builder_get_root(b);
}

/* A list's text read back by json-glib, for the callers that want a tree: the text holds only
 * what json-glib's parser gives back unchanged (integers, %.17g doubles that round-trip,
 * escaped UTF-8 strings), so the tree writes out as the same text. */
static JsonNode *array_node(const GString *items) {
  GString *t = g_string_sized_new(items->len + 2);
  g_string_append_c(t, '[');
  g_string_append_len(t, items->str, items->len);
  g_string_append_c(t, ']');
  JsonNode *n = json_from_string(t->str, NULL);
  g_string_free(t, TRUE);
  if (n && JSON_NODE_HOLDS_ARRAY(n))
    return n;
  if (n) /* cannot happen: the text was written as an array */
    json_node_unref(n);
  return json_node_init_array(json_node_alloc(), json_array_new());
}

JsonNode *pp_report_to_json(const pp_report *r) {
  JsonNode *root = header_node(r);
  JsonObject *obj = json_node_get_object(root);
  json_object_set_member(obj, "pages", array_node(r->pages));
  json_object_set_member(obj, "findings", array_node(r->findings));
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

/* name:[items] after a ',' */
static void append_list(GString *out, const char *name, const GString *items) {
  g_string_append_printf(out, ",\"%s\":[", name);
  g_string_append_len(out, items->str, items->len);
  g_string_append_c(out, ']');
}

char *pp_report_to_string(const pp_report *r, gboolean pretty, gsize *length) {
  if (pretty) {
    JsonNode *root = pp_report_to_json(r);
    char *s = pp_report_node_to_string(root, TRUE, length);
    json_node_unref(root);
    return s;
  }
  /* The compact text of pp_report_to_json()'s tree, joined from its parts without one. */
  JsonNode *head = header_node(r), *totals = totals_node(r);
  gsize head_len = 0;
  char *h = pp_json_write_compact(head, &head_len), *t = pp_json_write_compact(totals, NULL);
  GString *out = g_string_sized_new(head_len + r->pages->len + r->findings->len + 512);
  g_string_append_len(out, h, (gssize)head_len - 1); /* without its '}' */
  append_list(out, "pages", r->pages);
  append_list(out, "findings", r->findings);
  g_string_append(out, ",\"totals\":");
  g_string_append(out, t);
  g_string_append_c(out, '}');
  g_free(h);
  g_free(t);
  json_node_unref(head);
  json_node_unref(totals);
  if (length)
    *length = out->len;
  return g_string_free(out, FALSE);
}

char *pp_report_parts_to_string(const pp_report *r, gsize *length) {
  GString *out = g_string_sized_new(r->pages->len + r->findings->len + 32);
  g_string_append_len(out, "{\"pages\":[", 10);
  g_string_append_len(out, r->pages->str, r->pages->len);
  g_string_append_len(out, "],\"findings\":[", 14);
  g_string_append_len(out, r->findings->str, r->findings->len);
  g_string_append_len(out, "]}", 2);
  if (length)
    *length = out->len;
  return g_string_free(out, FALSE);
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
