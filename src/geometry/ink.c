/* ink.c — measures every mark of a captured scene: its bounding box, the part the
 * clip leaves visible and the ink it puts on the page (fills and images by area,
 * strokes by width × length; glyph runs are not measured). */
#include <math.h>

#include "capture/capture.h"
#include "geometry.h"

void pp_scene_measure(pp_scene *scene) {
  for (guint i = 0; i < scene->marks->len; i++) {
    pp_mark *m = g_ptr_array_index(scene->marks, i);
    m->bbox = pp_path_bbox(m->path);
    pp_rect clip = pp_clip_bbox(m->clip);
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
      m->ink =
          pp_rect_is_empty(m->visible_bbox) ? 0.0 : pp_path_clipped_area(m->path, m->rule, m->clip);
    }
  }
}
