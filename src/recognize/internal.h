/* internal.h — shared by the recognition stage's files only.
 * Labels → axes → bar and area groups → figures; each file is one of those steps. */
#pragma once

#include "geometry/geometry.h"
#include "number.h"
#include "recognize.h"

/* A text phrase that reads as a number (a tick label or a data label). */
typedef struct {
  char *text;
  pp_rect box;
  pp_point centre;
  double size;
  double angle;
  pp_number number;
  guint index; /* position in the page's label list: the ledger's key */
} pp_label;

/* Every numeric phrase of the page, words merged where a number was split by
 * spaces ("30 000", "€ 1.2 bn"). Free with g_ptr_array_unref. Marks that turn out
 * to be parts of labels (a minus sign drawn as a path) are added to glyph_marks. */
GPtrArray *pp_labels_collect(const pp_scene *scene, GHashTable *glyph_marks);

/* Value-axis candidates (pp_axis*, fitted or not) from aligned labels. Labels used
 * get on_axis. Candidates whose fit failed carry fit_failed and a reason. */
typedef struct {
  pp_axis *axis;
  gboolean fit_failed;
  gboolean category; /* consecutive years: labels of categories, never a value scale */
  char *reason;
  double label_edge; /* x of the label column's inner edge (vertical) or y (horizontal) */
  int side; /* +1: plot lies towards larger coordinates from the labels, −1 smaller, 0 unknown */
  double span0, span1; /* extent of the tick positions along the axis */
  GPtrArray *labels;   /* pp_label* (borrowed) */
} pp_axis_candidate;

GPtrArray *pp_axes_find(const pp_scene *scene, GPtrArray *labels);

/* How far across the axis its plot may reach on one side (+1 towards larger x, or y for
 * a horizontal axis): from the labels to the next fitted axis of the same orientation. */
void pp_axis_reach(const pp_axis_candidate *axis, GPtrArray *all_axes, int side, double *lo,
                   double *hi);

/* A filled axis-aligned rectangle that could be a bar. */
typedef struct {
  guint mark;
  pp_rect rect; /* visible part: path rectangle ∩ clip bbox */
  pp_rect clip; /* clip bbox (infinite when unclipped) */
  double ink;
  pp_paint paint;
} pp_bar_candidate;

/* glyph_marks: mark indices that are parts of text, never bars. */
GArray *pp_bar_candidates_collect(const pp_scene *scene, GHashTable *glyph_marks);

/* A filled non-rectangular polygon that could be an area under a series. */
typedef struct {
  guint mark;
  GArray *points; /* pp_point, flattened outline */
  pp_rect rect;   /* visible bbox */
  pp_rect clip;
  double ink;
  pp_paint paint;
} pp_area_candidate;

GPtrArray *pp_area_candidates_collect(const pp_scene *scene);
void pp_area_candidate_free(gpointer p);

/* Builds a figure from the bars on one side of an axis (+1: towards larger x, or y for
 * a horizontal axis; −1: smaller). Returns NULL when no bar group is found there. */
pp_figure *pp_bar_figure_build(const pp_scene *scene, GArray *bars, const pp_axis_candidate *axis,
                               int side, GPtrArray *labels, GPtrArray *all_axes);
pp_figure *pp_bar_figure_from_labels(const pp_scene *scene, GArray *bars, GPtrArray *labels);
pp_figure *pp_area_figure_build(const pp_scene *scene, GPtrArray *areas,
                                const pp_axis_candidate *axis, int side, GPtrArray *all_axes);

void pp_figure_set_fingerprint(pp_figure *figure);

/* ---- The claims ledger -------------------------------------------------------------
 * Every mark of the scene and every label of the page can belong to at most one figure
 * (or one axis). Recognizers claim through the ledger, inside a transaction that they
 * commit when their figure is accepted and roll back when it is rejected, so a later
 * recognizer can still use what a failed attempt touched. Transactions nest. */
typedef struct pp_claims pp_claims;

pp_claims *pp_claims_new(guint n_marks, guint n_labels);
void pp_claims_free(pp_claims *claims);
G_DEFINE_AUTOPTR_CLEANUP_FUNC(pp_claims, pp_claims_free)

gboolean pp_claims_mark_free(const pp_claims *claims, guint mark);
gboolean pp_claims_label_free(const pp_claims *claims, guint label);
/* Who holds it: the static owner string given at claim time, NULL when free. */
const char *pp_claims_mark_owner(const pp_claims *claims, guint mark);
const char *pp_claims_label_owner(const pp_claims *claims, guint label);
/* Claiming what is already held is a programmer error (g_return_if_fail). */
void pp_claims_take_mark(pp_claims *claims, guint mark, const char *owner);
void pp_claims_take_label(pp_claims *claims, guint label, const char *owner);
void pp_claims_begin(pp_claims *claims);
void pp_claims_commit(pp_claims *claims);
void pp_claims_rollback(pp_claims *claims);

/* ---- What every recognizer sees ------------------------------------------------------ */
typedef struct {
  const pp_scene *scene;
  GHashTable *glyph_marks;   /* marks that are parts of text (path-drawn minus signs) */
  GPtrArray *labels;         /* pp_label*, every numeric phrase */
  GPtrArray *axes;           /* pp_axis_candidate*, fitted or not */
  GArray *bars;              /* pp_bar_candidate */
  GPtrArray *areas;          /* pp_area_candidate* */
  pp_claims *claims;         /* the ledger */
  pp_page_charts *out;       /* figures found so far */
} pp_recognize_ctx;

/* A recognizer finds every figure of its family on the page, claiming marks and labels
 * through ctx->claims, and hands each accepted figure to pp_figure_finish(). */
typedef struct {
  pp_recognizer_info info;
  void (*run)(pp_recognize_ctx *ctx);
} pp_recognizer;

/* The table, in priority order (recognizers.c). */
extern const pp_recognizer pp_recognizers[];
extern const guint pp_n_recognizers;

/* Titles, fingerprint, scale range, evidence → confidence; adds it to ctx->out
 * (figure.c). scale_source may be NULL. */
void pp_figure_finish(pp_recognize_ctx *ctx, pp_figure *figure,
                      const pp_axis_candidate *scale_source);
