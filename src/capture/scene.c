/* scene.c — lifetime of a captured page and the names of its enums. */
#include <math.h>

#include "internal.h"

static void mark_free(gpointer p) {
  pp_mark *m = p;
  pp_path_free(m->path);
  pp_clip_unref(m->clip);
  g_free(m);
}

static void run_free(gpointer p) {
  pp_text_run *r = p;
  g_free(r->text);
  g_free(r->font_name);
  g_free(r);
}

static void line_free(gpointer p) {
  pp_text_line *l = p;
  g_free(l->text);
  g_free(l);
}

pp_scene *pp_scene_new(guint page_index, double width, double height) {
  pp_scene *s = g_new0(pp_scene, 1);
  s->page_index = page_index;
  s->width = width;
  s->height = height;
  s->to_pdf = (pp_matrix){1, 0, 0, -1, 0, height};
  s->marks = g_ptr_array_new_with_free_func(mark_free);
  s->words = g_ptr_array_new_with_free_func(run_free);
  s->lines = g_ptr_array_new_with_free_func(line_free);
  s->warnings = g_ptr_array_new_with_free_func(g_free);
  return s;
}

void pp_scene_free(pp_scene *scene) {
  if (!scene)
    return;
  g_ptr_array_unref(scene->marks);
  g_ptr_array_unref(scene->words);
  g_ptr_array_unref(scene->lines);
  g_ptr_array_unref(scene->warnings);
  g_free(scene);
}

const char *pp_mark_kind_name(pp_mark_kind kind) {
  static const char *names[] = {"fill", "stroke", "image", "glyphs"};
  return kind <= PP_MARK_GLYPHS ? names[kind] : "unknown";
}

const char *pp_paint_kind_name(pp_paint_kind kind) {
  static const char *names[] = {"solid",         "linear-gradient", "radial-gradient",
                                "mesh-gradient", "surface",         "other"};
  return kind <= PP_PAINT_OTHER ? names[kind] : "other";
}
