/* concepts.c — the geometric notions several recognizers share, defined once: the same
 * drawn edge, the same column, page-sized boxes, an axis' reach, and whether an axis
 * already belongs to a figure. Their tolerances are named in internal.h. */
#include <math.h>

#include "internal.h"

gboolean pp_same_edge(double a, double b) {
  return fabs(a - b) < PP_SAME_EDGE_TOL;
}

gboolean pp_on_edge(double u0, double u1, double c) {
  return pp_same_edge(u0, c) || pp_same_edge(u1, c);
}

gboolean pp_page_sized(const pp_scene *scene, pp_rect r) {
  return pp_rect_area(r) > PP_PAGE_SIZED_SHARE * scene->width * scene->height;
}

gboolean pp_within_reach(const pp_axis_candidate *axis, double u0, double u1, double slack,
                         double floor) {
  double reach = fmax(PP_AXIS_REACH_SHARE * (axis->span1 - axis->span0) + slack, floor);
  return u0 >= axis->span0 - reach && u1 <= axis->span1 + reach;
}

gboolean pp_same_column(pp_frame_rect a, pp_frame_rect b) {
  return fabs(a.w0 - b.w0) <= PP_SAME_COLUMN_TOL && fabs(a.w1 - b.w1) <= PP_SAME_COLUMN_TOL;
}

void pp_axis_claim_labels(pp_recognize_ctx *ctx, const pp_axis_candidate *axis) {
  for (guint k = 0; k < axis->labels->len; k++) {
    const pp_label *l = g_ptr_array_index(axis->labels, k);
    pp_claims_take_label_if_free(ctx->claims, l->index, PP_OWNER_VALUE_AXIS);
  }
}

gboolean pp_axis_taken(const pp_recognize_ctx *ctx, const pp_axis_candidate *axis) {
  for (guint k = 0; k < axis->labels->len; k++) {
    const pp_label *l = g_ptr_array_index(axis->labels, k);
    if (pp_claims_label_free(ctx->claims, l->index))
      return FALSE;
  }
  return axis->labels->len > 0;
}
