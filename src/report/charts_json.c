/* charts_json.c — `plotproof charts`: the recognised figures of one page in full
 * (axis fit, ticks, every element), for developers tuning the recognition stage. */
#include "json_util.h"
#include "report.h"

static void add_axis(JsonBuilder *b, const pp_axis *a) {
  json_builder_set_member_name(b, "axis");
  if (!a) {
    json_builder_add_null_value(b);
    return;
  }
  json_builder_begin_object(b);
  pp_json_member_string(b, "orientation", a->vertical ? "vertical" : "horizontal");
  pp_json_member_bool(b, "log", a->log);
  pp_json_member_number(b, "offset", a->offset);
  pp_json_member_number(b, "slope", a->slope);
  pp_json_member_number(b, "rms_residual", a->rms_residual);
  pp_json_member_number(b, "min_value", a->min_value);
  pp_json_member_number(b, "max_value", a->max_value);
  pp_json_member_rect(b, "box", a->box);
  json_builder_set_member_name(b, "ticks");
  json_builder_begin_array(b);
  for (guint i = 0; a->ticks && i < a->ticks->len; i++) {
    const pp_tick *t = &g_array_index(a->ticks, pp_tick, i);
    json_builder_begin_object(b);
    pp_json_member_number(b, "pos", t->pos);
    pp_json_member_number(b, "value", t->value);
    pp_json_member_string(b, "label", t->label);
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
  json_builder_end_object(b);
}

static void add_element(JsonBuilder *b, const pp_element *e) {
  json_builder_begin_object(b);
  pp_json_member_string(b, "kind", e->kind == PP_ELEMENT_BAR ? "bar" : "area");
  pp_json_member_int(b, "mark_index", e->mark_index);
  pp_json_member_rect(b, "box", e->box);
  pp_json_member_number(b, "tip_value", e->tip_value);
  pp_json_member_number(b, "base_value", e->base_value);
  pp_json_member_number(b, "ink", e->ink);
  pp_json_member_number(b, "extent", e->extent);
  pp_json_member_number(b, "label_value", e->label_value);
  pp_json_member_string(b, "label_text", e->label_text);
  pp_json_member_string(b, "category", e->category);
  pp_json_member_int(b, "series", e->series);
  pp_json_member_bool(b, "stacked", e->stacked);
  json_builder_end_object(b);
}

static void add_figure(JsonBuilder *b, const pp_scene *scene, const pp_figure *f) {
  json_builder_begin_object(b);
  pp_json_member_string(b, "id", f->fingerprint);
  pp_json_member_string(b, "kind", pp_figure_kind_name(f->kind));
  pp_json_member_string(b, "title", f->title);
  pp_json_member_rect(b, "bbox", f->bbox);
  pp_json_member_mapped_rect(b, "pdf_bbox", f->bbox, scene->to_pdf);
  pp_json_member_int(b, "series", f->n_series);
  add_axis(b, f->axis);
  json_builder_set_member_name(b, "elements");
  json_builder_begin_array(b);
  for (guint i = 0; f->elements && i < f->elements->len; i++)
    add_element(b, &g_array_index(f->elements, pp_element, i));
  json_builder_end_array(b);
  json_builder_end_object(b);
}

JsonNode *pp_report_charts_to_json(const pp_scene *scene, const pp_page_charts *charts) {
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  pp_json_member_int(b, "page", scene->page_index + 1);
  json_builder_set_member_name(b, "figures");
  json_builder_begin_array(b);
  for (guint i = 0; charts && charts->figures && i < charts->figures->len; i++)
    add_figure(b, scene, g_ptr_array_index(charts->figures, i));
  json_builder_end_array(b);
  json_builder_set_member_name(b, "scale_failures");
  json_builder_begin_array(b);
  for (guint i = 0; charts && charts->scale_failures && i < charts->scale_failures->len; i++) {
    const pp_scale_failure *s = g_ptr_array_index(charts->scale_failures, i);
    json_builder_begin_object(b);
    pp_json_member_rect(b, "bbox", s->bbox);
    pp_json_member_string(b, "reason", s->reason);
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
  json_builder_set_member_name(b, "raster_images");
  json_builder_begin_array(b);
  for (guint i = 0; charts && charts->raster_images && i < charts->raster_images->len; i++) {
    json_builder_begin_object(b);
    pp_json_member_rect(b, "bbox", g_array_index(charts->raster_images, pp_rect, i));
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
  json_builder_end_object(b);
  return json_builder_get_root(b);
}
