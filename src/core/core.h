/* core.h — the vocabulary every pipeline stage shares: points, rectangles,
 * affine matrices, paths of lines and cubic Béziers, fill rules and clip chains.
 * Pure value types with no PDF or cairo knowledge; stages depend on this, never the reverse. */
#pragma once

#include <glib.h>
#include <stddef.h>

G_BEGIN_DECLS

typedef struct {
  double x, y;
} pp_point;

/* Axis-aligned box, x0 <= x1 and y0 <= y1 when not empty. An empty box has
 * x0 > x1 (see pp_rect_empty()), so unions start from it naturally. */
typedef struct {
  double x0, y0, x1, y1;
} pp_rect;

pp_rect pp_rect_empty(void);
gboolean pp_rect_is_empty(pp_rect r);
pp_rect pp_rect_union(pp_rect a, pp_rect b);
pp_rect pp_rect_intersect(pp_rect a, pp_rect b);
pp_rect pp_rect_add_point(pp_rect r, pp_point p);
double pp_rect_width(pp_rect r);
double pp_rect_height(pp_rect r);
double pp_rect_area(pp_rect r);
gboolean pp_rect_contains(pp_rect outer, pp_rect inner, double tol);

/* cairo's order: x' = xx·x + xy·y + x0, y' = yx·x + yy·y + y0. */
typedef struct {
  double xx, yx, xy, yy, x0, y0;
} pp_matrix;

pp_matrix pp_matrix_identity(void);
/* The matrix that applies a first, then b. */
pp_matrix pp_matrix_multiply(pp_matrix a, pp_matrix b);
gboolean pp_matrix_invert(pp_matrix m, pp_matrix *out);
pp_point pp_matrix_apply(pp_matrix m, pp_point p);
/* Apply only the linear part (for distances and pen widths). */
pp_point pp_matrix_apply_distance(pp_matrix m, pp_point d);
/* The bounding box of a box mapped through m (page points → PDF user space); empty when
 * r is empty or not finite. The one place boxes change coordinate systems. */
pp_rect pp_rect_transform(pp_rect r, pp_matrix m);

typedef enum {
  PP_FILL_NONZERO,
  PP_FILL_EVEN_ODD,
} pp_fill_rule;

const char *pp_fill_rule_name(pp_fill_rule rule);

typedef enum {
  PP_SEG_MOVE,  /* pt[0] */
  PP_SEG_LINE,  /* pt[0] */
  PP_SEG_CURVE, /* pt[0], pt[1] control points, pt[2] end point */
  PP_SEG_CLOSE, /* no points; returns to the subpath start */
} pp_seg_kind;

typedef struct {
  pp_seg_kind kind;
  pp_point pt[3];
} pp_seg;

/* A path as painted: subpaths of lines and cubic Béziers. Growable array of
 * segments; owned by whoever called pp_path_new() or pp_path_copy(). */
typedef struct {
  pp_seg *segs;
  size_t n_segs;
  size_t cap;
} pp_path;

pp_path *pp_path_new(void);
pp_path *pp_path_copy(const pp_path *path);
void pp_path_free(pp_path *path);
void pp_path_move_to(pp_path *path, double x, double y);
void pp_path_line_to(pp_path *path, double x, double y);
void pp_path_curve_to(pp_path *path, double x1, double y1, double x2, double y2, double x3,
                      double y3);
void pp_path_close(pp_path *path);
void pp_path_rectangle(pp_path *path, double x, double y, double w, double h);
void pp_path_transform(pp_path *path, pp_matrix m);
/* Number of subpaths (MOVE segments). */
size_t pp_path_n_subpaths(const pp_path *path);

G_DEFINE_AUTOPTR_CLEANUP_FUNC(pp_path, pp_path_free)

/* The clip in force when a mark was painted: the intersection of every
 * region on the chain. Shared between marks, so reference counted and
 * immutable once made. NULL means "no clip". */
typedef struct pp_clip pp_clip;
struct pp_clip {
  int ref_count;
  pp_clip *parent;
  pp_path *path;
  pp_fill_rule rule;
};

/* Takes ownership of path and a reference on parent (which may be NULL). */
pp_clip *pp_clip_new(pp_clip *parent, pp_path *path, pp_fill_rule rule);
pp_clip *pp_clip_ref(pp_clip *clip);
void pp_clip_unref(pp_clip *clip);
size_t pp_clip_depth(const pp_clip *clip);

G_DEFINE_AUTOPTR_CLEANUP_FUNC(pp_clip, pp_clip_unref)

G_END_DECLS
