/* clip_info.c — the clipped area of a fill: the clip chain digested once (rectangles
 * merged into one box), the fill cut into groups of subpaths that cannot meet, and each
 * group measured by the cheapest exact means: rect ∩ box, a convex outline's signed
 * area, or the sweep of clip_area.c. */
#include "internal.h"

#include <math.h>

pp_clip_info *pp_clip_info_new(const pp_clip *clip) {
  pp_clip_info *info = g_new0(pp_clip_info, 1);
  info->finite = TRUE;
  info->box = (pp_rect){-INFINITY, -INFINITY, INFINITY, INFINITY};
  info->regions = g_array_new(FALSE, FALSE, sizeof(pp_region));
  for (const pp_clip *c = clip; c; c = c->parent) {
    pp_rect r;
    if (!c->path)
      continue;
    if (!pp_path_is_finite(c->path)) {
      info->finite = FALSE;
    } else if (pp_path_is_rectangle(c->path, 0, &r)) {
      info->box = pp_rect_intersect(info->box, r);
    } else {
      pp_region g = {c->path, c->rule, pp_path_bbox(c->path)};
      info->empty = info->empty || pp_rect_is_empty(g.box);
      g_array_append_val(info->regions, g);
    }
  }
  return info;
}

void pp_clip_info_free(pp_clip_info *info) {
  if (!info)
    return;
  g_array_free(info->regions, TRUE);
  g_free(info);
}

/* One group of subpaths (or the whole path) under the digested clip. */
static double group_area(const pp_clip_info *info, const pp_path *path, pp_fill_rule rule) {
  pp_rect pbox = pp_path_bbox(path);
  pp_rect hit = pp_rect_intersect(info->box, pbox);
  if (pp_rect_is_empty(pbox) || pp_rect_is_empty(hit))
    return 0;
  guint n_clip = info->regions->len;
  for (guint i = 0; i < n_clip; i++)
    if (pp_rect_is_empty(pp_rect_intersect(g_array_index(info->regions, pp_region, i).box, pbox)))
      return 0; /* outside one member's box: outside the clip */
  pp_rect prect;
  if (n_clip == 0 && pp_path_is_rectangle(path, 0, &prect))
    return pp_rect_area(pp_rect_intersect(prect, info->box)); /* rect ∩ rect: O(1) */
  gboolean box_contains = pp_rect_contains(info->box, pbox, 0);
  if (n_clip == 0 && box_contains && pp_path_is_convex(path))
    return fabs(pp_path_signed_area(path)); /* circles, ellipses, wedges: closed form */
  GArray *regs = g_array_sized_new(FALSE, FALSE, sizeof(pp_region), n_clip + 2);
  pp_region main = {path, rule, pbox};
  g_array_append_val(regs, main);
  g_array_append_vals(regs, info->regions->data, n_clip);
  pp_path *box_path = NULL;
  if (!box_contains) {
    box_path = pp_path_new();
    pp_path_rectangle(box_path, hit.x0, hit.y0, hit.x1 - hit.x0, hit.y1 - hit.y0);
    pp_region b = {box_path, PP_FILL_NONZERO, hit};
    g_array_append_val(regs, b);
  }
  double area = pp_sweep_area((const pp_region *)regs->data, regs->len);
  pp_path_free(box_path);
  g_array_free(regs, TRUE);
  return area;
}

double pp_clip_info_area(const pp_clip_info *info, const pp_path *path, pp_fill_rule rule) {
  if (!path)
    return 0;
  if (!pp_path_is_finite(path) || !info->finite)
    return NAN;
  if (info->empty)
    return 0;
  GPtrArray *groups = pp_path_split_disjoint(path);
  double area = 0;
  if (groups->len == 0)
    area = group_area(info, path, rule);
  for (guint i = 0; i < groups->len; i++)
    area += group_area(info, g_ptr_array_index(groups, i), rule);
  g_ptr_array_unref(groups);
  return area;
}

double pp_path_clipped_area(const pp_path *path, pp_fill_rule rule, const pp_clip *clip) {
  pp_clip_info *info = pp_clip_info_new(clip);
  double area = pp_clip_info_area(info, path, rule);
  pp_clip_info_free(info);
  return area;
}
