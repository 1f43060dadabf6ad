/* scene_json.c — `plotproof scene`: one captured page as JSON, for developers checking
 * what the capture and geometry stages saw. Every mark with its path in page points. */
#include "json_util.h"
#include "report.h"

static void add_point(JsonBuilder *b, pp_point p) {
  json_builder_begin_array(b);
  pp_json_add_number(b, p.x);
  pp_json_add_number(b, p.y);
  json_builder_end_array(b);
}

static void add_path(JsonBuilder *b, const char *name, const pp_path *path) {
  static const char *kinds[] = {"move", "line", "curve", "close"};
  static const int n_points[] = {1, 1, 3, 0};
  json_builder_set_member_name(b, name);
  if (!path) {
    json_builder_add_null_value(b);
    return;
  }
  json_builder_begin_array(b);
  for (size_t i = 0; i < path->n_segs; i++) {
    const pp_seg *s = &path->segs[i];
    if (s->kind > PP_SEG_CLOSE)
      continue;
    json_builder_begin_object(b);
    pp_json_member_string(b, "op", kinds[s->kind]);
    json_builder_set_member_name(b, "points");
    json_builder_begin_array(b);
    for (int k = 0; k < n_points[s->kind]; k++)
      add_point(b, s->pt[k]);
    json_builder_end_array(b);
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
}

/* Innermost region first, as the chain is linked. */
static void add_clip(JsonBuilder *b, const pp_clip *clip) {
  json_builder_set_member_name(b, "clip");
  json_builder_begin_array(b);
  for (const pp_clip *c = clip; c; c = c->parent) {
    json_builder_begin_object(b);
    pp_json_member_string(b, "rule", pp_fill_rule_name(c->rule));
    add_path(b, "path", c->path);
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
}

static void add_mark(JsonBuilder *b, const pp_mark *m) {
  json_builder_begin_object(b);
  pp_json_member_string(b, "kind", pp_mark_kind_name(m->kind));
  pp_json_member_int(b, "index", m->index);
  add_path(b, "path", m->path);
  json_builder_set_member_name(b, "paint");
  json_builder_begin_object(b);
  pp_json_member_string(b, "kind", pp_paint_kind_name(m->paint.kind));
  json_builder_set_member_name(b, "rgba");
  json_builder_begin_array(b);
  pp_json_add_number(b, m->paint.r);
  pp_json_add_number(b, m->paint.g);
  pp_json_add_number(b, m->paint.b);
  pp_json_add_number(b, m->paint.a);
  json_builder_end_array(b);
  json_builder_end_object(b);
  pp_json_member_string(b, "fill_rule", pp_fill_rule_name(m->rule));
  pp_json_member_number(b, "line_width", m->line_width);
  pp_json_member_bool(b, "dashed", m->dashed);
  add_clip(b, m->clip);
  pp_json_member_int(b, "group_depth", m->group_depth);
  pp_json_member_bool(b, "soft_masked", m->soft_masked);
  if (m->kind == PP_MARK_GLYPHS) {
    pp_json_member_int(b, "glyph_count", m->glyph_count);
    pp_json_member_number(b, "font_size", m->font_size);
  }
  if (m->kind == PP_MARK_IMAGE) {
    pp_json_member_int(b, "image_width", m->image_width);
    pp_json_member_int(b, "image_height", m->image_height);
  }
  pp_json_member_number(b, "ink", m->ink);
  pp_json_member_rect(b, "bbox", m->bbox);
  pp_json_member_rect(b, "visible_bbox", m->visible_bbox);
  json_builder_end_object(b);
}

static void add_words(JsonBuilder *b, const pp_scene *scene) {
  json_builder_set_member_name(b, "words");
  json_builder_begin_array(b);
  for (guint i = 0; i < scene->words->len; i++) {
    const pp_text_run *w = g_ptr_array_index(scene->words, i);
    json_builder_begin_object(b);
    pp_json_member_string(b, "text", w->text);
    pp_json_member_rect(b, "box", w->box);
    pp_json_member_number(b, "font_size", w->font_size);
    pp_json_member_string(b, "font", w->font_name);
    pp_json_member_int(b, "line", w->line);
    pp_json_member_number(b, "angle", w->angle);
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
  json_builder_set_member_name(b, "lines");
  json_builder_begin_array(b);
  for (guint i = 0; i < scene->lines->len; i++) {
    const pp_text_line *l = g_ptr_array_index(scene->lines, i);
    json_builder_begin_object(b);
    pp_json_member_string(b, "text", l->text);
    pp_json_member_rect(b, "box", l->box);
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
}

JsonNode *pp_report_scene_to_json(const pp_scene *scene) {
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  pp_json_member_int(b, "page", scene->page_index + 1);
  pp_json_member_number(b, "width", scene->width);
  pp_json_member_number(b, "height", scene->height);
  pp_json_member_rect(b, "crop_box", scene->crop_box);
  pp_json_member_int(b, "rotation", scene->rotation);
  const pp_matrix *m = &scene->to_pdf;
  json_builder_set_member_name(b, "to_pdf");
  json_builder_begin_object(b);
  pp_json_member_number(b, "xx", m->xx);
  pp_json_member_number(b, "yx", m->yx);
  pp_json_member_number(b, "xy", m->xy);
  pp_json_member_number(b, "yy", m->yy);
  pp_json_member_number(b, "x0", m->x0);
  pp_json_member_number(b, "y0", m->y0);
  json_builder_end_object(b);
  pp_json_member_int(b, "images", scene->n_images);
  pp_json_member_int(b, "groups", scene->n_groups);
  json_builder_set_member_name(b, "marks");
  json_builder_begin_array(b);
  for (guint i = 0; i < scene->marks->len; i++)
    add_mark(b, g_ptr_array_index(scene->marks, i));
  json_builder_end_array(b);
  add_words(b, scene);
  json_builder_set_member_name(b, "warnings");
  json_builder_begin_array(b);
  for (guint i = 0; i < scene->warnings->len; i++) {
    char *valid = g_utf8_make_valid(g_ptr_array_index(scene->warnings, i), -1);
    json_builder_add_string_value(b, valid);
    g_free(valid);
  }
  json_builder_end_array(b);
  json_builder_end_object(b);
  return json_builder_get_root(b);
}
