/* ink.c — measures every mark of a captured scene: its bounding box, the part the
 * clip leaves visible and the ink it puts on the page (fills and images by area,
 * strokes by width × length; glyph runs are not measured). Clip chains are shared by
 * many marks, so each is digested once per scene. */
#include <math.h>

#include "capture/capture.h"
#include "internal.h"

typedef struct {
  pp_rect bbox;
  pp_clip_info *info;
} clip_entry;

static void clip_entry_free(clip_entry *e) {
  pp_clip_info_free(e->info);
  g_free(e);
}

void pp_scene_measure(pp_scene *scene) {
  /* Keyed by pointer: the scene holds a reference on every clip while this runs. */
  GHashTable *clips =
      g_hash_table_new_full(g_direct_hash, g_direct_equal, NULL, (GDestroyNotify)clip_entry_free);
  for (guint i = 0; i < scene->marks->len; i++) {
    pp_mark *m = g_ptr_array_index(scene->marks, i);
    m->bbox = pp_path_bbox(m->path);
    clip_entry *ce = g_hash_table_lookup(clips, m->clip);
    if (!ce) {
      ce = g_new0(clip_entry, 1);
      ce->bbox = pp_clip_bbox(m->clip);
      g_hash_table_insert(clips, m->clip, ce);
    }
    pp_rect clip = ce->bbox;
    if (m->kind == PP_MARK_STROKE) {
      double half = m->line_width / 2;
      pp_rect wide = {m->bbox.x0 - half, m->bbox.y0 - half, m->bbox.x1 + half, m->bbox.y1 + half};
      m->visible_bbox = pp_rect_intersect(wide, clip);
      m->ink = pp_stroke_ink(m->path, m->line_width, m->clip);
    } else if (m->kind == PP_MARK_GLYPHS) {
      m->visible_bbox = pp_rect_intersect(m->bbox, clip);
      m->ink = NAN;
    } else {
      m->visible_bbox = pp_rect_intersect(m->bbox, clip);
      if (pp_rect_is_empty(m->visible_bbox)) {
        m->ink = 0.0;
      } else {
        if (!ce->info)
          ce->info = pp_clip_info_new(m->clip);
        m->ink = pp_clip_info_area(ce->info, m->path, m->rule);
      }
    }
  }
  g_hash_table_unref(clips);
}
