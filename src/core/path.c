/* path.c — growable segment arrays for painted paths.
 * Coordinates stay doubles end to end so the measured area is never rounded. */
#include "core.h"

#include <string.h>

pp_path *pp_path_new(void) {
  return g_new0(pp_path, 1);
}

pp_path *pp_path_copy(const pp_path *path) {
  pp_path *copy = pp_path_new();
  if (path->n_segs > 0) {
    copy->segs = g_new(pp_seg, path->n_segs);
    memcpy(copy->segs, path->segs, path->n_segs * sizeof(pp_seg));
  }
  copy->n_segs = copy->cap = path->n_segs;
  return copy;
}

void pp_path_free(pp_path *path) {
  if (!path)
    return;
  g_free(path->segs);
  g_free(path);
}

static pp_seg *push(pp_path *path, pp_seg_kind kind) {
  if (path->n_segs == path->cap) {
    path->cap = path->cap ? path->cap * 2 : 8;
    path->segs = g_renew(pp_seg, path->segs, path->cap);
  }
  pp_seg *s = &path->segs[path->n_segs++];
  memset(s, 0, sizeof *s);
  s->kind = kind;
  return s;
}

void pp_path_move_to(pp_path *path, double x, double y) {
  pp_seg *s = push(path, PP_SEG_MOVE);
  s->pt[0] = (pp_point){x, y};
}

void pp_path_line_to(pp_path *path, double x, double y) {
  pp_seg *s = push(path, PP_SEG_LINE);
  s->pt[0] = (pp_point){x, y};
}

void pp_path_curve_to(pp_path *path, double x1, double y1, double x2, double y2, double x3,
                      double y3) {
  pp_seg *s = push(path, PP_SEG_CURVE);
  s->pt[0] = (pp_point){x1, y1};
  s->pt[1] = (pp_point){x2, y2};
  s->pt[2] = (pp_point){x3, y3};
}

void pp_path_close(pp_path *path) {
  push(path, PP_SEG_CLOSE);
}

void pp_path_rectangle(pp_path *path, double x, double y, double w, double h) {
  pp_path_move_to(path, x, y);
  pp_path_line_to(path, x + w, y);
  pp_path_line_to(path, x + w, y + h);
  pp_path_line_to(path, x, y + h);
  pp_path_close(path);
}

void pp_path_transform(pp_path *path, pp_matrix m) {
  for (size_t i = 0; i < path->n_segs; i++) {
    pp_seg *s = &path->segs[i];
    int n = s->kind == PP_SEG_CURVE ? 3 : s->kind == PP_SEG_CLOSE ? 0 : 1;
    for (int k = 0; k < n; k++)
      s->pt[k] = pp_matrix_apply(m, s->pt[k]);
  }
}

size_t pp_path_n_subpaths(const pp_path *path) {
  size_t n = 0;
  for (size_t i = 0; i < path->n_segs; i++)
    n += path->segs[i].kind == PP_SEG_MOVE;
  return n;
}

const char *pp_fill_rule_name(pp_fill_rule rule) {
  return rule == PP_FILL_EVEN_ODD ? "even-odd" : "nonzero";
}
