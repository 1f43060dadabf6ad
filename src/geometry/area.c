/* area.c — signed area by Green's theorem, A = ½∮(x dy − y dx), with cubic segments
 * integrated in closed form, and the fill-rule area as the unclipped sweep. */
#include "internal.h"

#include <math.h>

/* ½∫(x y' − y x') dt over one cubic in power basis, coordinates relative to o so
 * that far-from-origin paths keep their digits. ∫ t^(i+j−1) dt = 1/(i+j): exact. */
static double cubic_term(pp_point o, pp_point a, pp_point b, pp_point c, pp_point d) {
  double px[4] = {a.x - o.x, b.x - o.x, c.x - o.x, d.x - o.x};
  double py[4] = {a.y - o.y, b.y - o.y, c.y - o.y, d.y - o.y};
  double X[4] = {px[0], 3 * (px[1] - px[0]), 3 * (px[0] - 2 * px[1] + px[2]),
                 -px[0] + 3 * px[1] - 3 * px[2] + px[3]};
  double Y[4] = {py[0], 3 * (py[1] - py[0]), 3 * (py[0] - 2 * py[1] + py[2]),
                 -py[0] + 3 * py[1] - 3 * py[2] + py[3]};
  double sum = 0;
  for (int i = 0; i < 4; i++)
    for (int j = 1; j < 4; j++)
      sum += j * (X[i] * Y[j] - Y[i] * X[j]) / (i + j);
  return 0.5 * sum;
}

static double line_term(pp_point o, pp_point a, pp_point b) {
  double x0 = a.x - o.x, y0 = a.y - o.y, x1 = b.x - o.x, y1 = b.y - o.y;
  return 0.5 * (x0 * y1 - x1 * y0);
}

double pp_path_signed_area(const pp_path *path) {
  if (!path)
    return 0;
  double sum = 0;
  pp_point o = {0, 0}, start = {0, 0}, cur = {0, 0};
  gboolean have_origin = FALSE;
  for (size_t i = 0; i < path->n_segs; i++) {
    const pp_seg *s = &path->segs[i];
    if (s->kind != PP_SEG_CLOSE && !have_origin) {
      o = s->pt[0];
      have_origin = TRUE;
    }
    switch (s->kind) {
    case PP_SEG_MOVE:
      sum += line_term(o, cur, start); /* implicit close of the previous subpath */
      start = cur = s->pt[0];
      break;
    case PP_SEG_LINE:
      sum += line_term(o, cur, s->pt[0]);
      cur = s->pt[0];
      break;
    case PP_SEG_CURVE:
      sum += cubic_term(o, cur, s->pt[0], s->pt[1], s->pt[2]);
      cur = s->pt[2];
      break;
    case PP_SEG_CLOSE:
      sum += line_term(o, cur, start);
      cur = start;
      break;
    }
  }
  sum += line_term(o, cur, start);
  return sum; /* NaN input propagates to NaN */
}

double pp_path_fill_area(const pp_path *path, pp_fill_rule rule) {
  return pp_path_clipped_area(path, rule, NULL);
}
