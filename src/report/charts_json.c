/* charts_json.c — `plotproof charts`: the recognised figures of one page in full (the
 * recognizer that built each, its scale fit and ticks, every element with its encoding,
 * parts, value and where it came from), for developers tuning the recognition stage. */
#include <math.h>

#include "json_util.h"
#include "report.h"

static void add_scale(JsonBuilder *b, const pp_scale *a) {
  json_builder_set_member_name(b, "scale");
  if (!a) {
    json_builder_add_null_value(b);
    return;
  }
  json_builder_begin_object(b);
  pp_json_member_string(b, "orientation", a->vertical ? "vertical" : "horizontal");
  pp_json_member_string(b, "kind", a->kind == PP_SCALE_LOG ? "log" : "linear");
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

static void add_point(JsonBuilder *b, const char *name, pp_point p) {
  json_builder_set_member_name(b, name);
  json_builder_begin_array(b);
  pp_json_add_number(b, p.x);
  pp_json_add_number(b, p.y);
  json_builder_end_array(b);
}

static void add_shape(JsonBuilder *b, const pp_shape *s) {
  static const char *const kinds[] = {"none", "rect",   "sample", "sector",
                                      "quad", "circle", "polygon"};
  json_builder_set_member_name(b, "shape");
  json_builder_begin_object(b);
  pp_json_member_string(b, "kind", (guint)s->kind < G_N_ELEMENTS(kinds) ? kinds[s->kind] : "none");
  switch (s->kind) {
  case PP_SHAPE_RECT:
  case PP_SHAPE_SAMPLE: pp_json_member_rect(b, "rect", s->rect); break;
  case PP_SHAPE_SECTOR:
    add_point(b, "centre", s->sector.centre);
    pp_json_member_number(b, "rx", s->sector.rx);
    pp_json_member_number(b, "ry", s->sector.ry);
    pp_json_member_number(b, "inner", s->sector.inner);
    pp_json_member_number(b, "a0", s->sector.a0);
    pp_json_member_number(b, "a1", s->sector.a1);
    pp_json_member_number(b, "offset", s->sector.offset);
    break;
  case PP_SHAPE_QUAD:
    json_builder_set_member_name(b, "points");
    json_builder_begin_array(b);
    for (int i = 0; i < 4; i++) {
      json_builder_begin_array(b);
      pp_json_add_number(b, s->quad.p[i].x);
      pp_json_add_number(b, s->quad.p[i].y);
      json_builder_end_array(b);
    }
    json_builder_end_array(b);
    break;
  case PP_SHAPE_CIRCLE:
    add_point(b, "centre", s->circle.centre);
    pp_json_member_number(b, "r", s->circle.r);
    break;
  default: break;
  }
  json_builder_end_object(b);
}

/* A stack segment's reading, for a reviewer to check against the page: where the scale
 * puts its ends, the value it gives the segment (its thickness; the bottom segment's is
 * its end's reading, a bar from 0, as the rules read it), its printed number, its box. */
static void add_segment_reading(JsonBuilder *b, const pp_scene *scene, const pp_part *p,
                                gboolean bottom) {
  pp_json_member_number(b, "start", p->start);
  pp_json_member_number(b, "end", p->end);
  pp_json_member_number(b, "scale_value", bottom ? p->end : p->end - p->start);
  pp_json_member_number(b, "label_value", p->label_value);
  if (p->mark < scene->marks->len) {
    const pp_mark *m = g_ptr_array_index(scene->marks, p->mark);
    pp_json_member_rect(b, "box", m->visible_bbox);
    pp_json_member_rect(b, "pdf_box", pp_rect_transform(m->visible_bbox, scene->to_pdf));
  }
}

static void add_element(JsonBuilder *b, const pp_scene *scene, const pp_element *e) {
  json_builder_begin_object(b);
  pp_json_member_string(b, "encoding", pp_encoding_name(e->encoding));
  add_shape(b, &e->shape);
  json_builder_set_member_name(b, "parts");
  json_builder_begin_array(b);
  for (guint i = 0; e->parts && i < e->parts->len; i++) {
    const pp_part *p = &g_array_index(e->parts, pp_part, i);
    json_builder_begin_object(b);
    pp_json_member_int(b, "mark", p->mark);
    pp_json_member_string(b, "role", pp_part_role_name(p->role));
    pp_json_member_number(b, "ink", p->ink);
    if (p->role == PP_PART_SEGMENT)
      add_segment_reading(b, scene, p, i == 0);
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
  pp_json_member_rect(b, "box", e->box);
  pp_json_member_number(b, "value", e->value);
  pp_json_member_string(b, "source", pp_value_source_name(e->source));
  pp_json_member_number(b, "scale_value", e->scale_value);
  pp_json_member_number(b, "base_value", e->base_value);
  pp_json_member_number(b, "label_value", e->label_value);
  pp_json_member_string(b, "label_text", e->label_text);
  pp_json_member_number(b, "share", e->share);
  pp_json_member_number(b, "ink", e->ink);
  pp_json_member_number(b, "extent", e->extent);
  pp_json_member_string(b, "category", e->category);
  pp_json_member_int(b, "series", e->series);
  pp_json_member_bool(b, "stacked", e->stacked);
  json_builder_end_object(b);
}

static void add_figure(JsonBuilder *b, const pp_scene *scene, const pp_figure *f) {
  static const char *const projections[] = {"flat", "oblique", "perspective", "tilted"};
  json_builder_begin_object(b);
  pp_json_member_string(b, "id", f->fingerprint);
  pp_json_member_string(b, "kind", pp_figure_kind_name(f->kind));
  pp_json_member_string(b, "recognizer", f->recognizer);
  pp_json_member_string(b, "title", f->title);
  pp_json_member_rect(b, "bbox", f->bbox);
  pp_json_member_rect(b, "pdf_bbox", pp_rect_transform(f->bbox, scene->to_pdf));
  pp_json_member_int(b, "series", f->n_series);
  pp_json_member_string(b, "projection",
                        (guint)f->projection.kind < G_N_ELEMENTS(projections)
                            ? projections[f->projection.kind]
                            : "flat");
  pp_json_member_number(b, "projection_ratio", f->projection.ratio);
  pp_json_member_bool(b, "judged", f->judged);
  pp_json_member_string(b, "not_judged_reason", f->not_judged_reason);
  pp_json_member_number(b, "confidence", f->confidence);
  pp_json_member_evidence(b, f);
  add_scale(b, f->scale);
  json_builder_set_member_name(b, "elements");
  json_builder_begin_array(b);
  for (guint i = 0; f->elements && i < f->elements->len; i++)
    add_element(b, scene, &g_array_index(f->elements, pp_element, i));
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
