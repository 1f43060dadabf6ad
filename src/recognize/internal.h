/* internal.h — shared by the recognition stage's files only.
 * Labels → axes → candidates → the recognizer table (one file per chart family, each
 * claiming marks and labels through the ledger) → figures (figure.c). */
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
  pp_number_reading reading; /* under each decimal convention, for axes to choose between */
  guint index;               /* position in the page's label list: the ledger's key */
} pp_label;

/* Every numeric phrase of the page, words merged where a number was split by
 * spaces ("30 000", "€ 1.2 bn"). Free with g_ptr_array_unref. Marks that turn out
 * to be parts of labels (a minus sign drawn as a path) are added to glyph_marks. */
GPtrArray *pp_labels_collect(const pp_scene *scene, GHashTable *glyph_marks);

/* Value-axis candidates (fitted or not) from aligned labels. Candidates whose fit
 * failed carry fit_failed and a reason. The labels are claimed only when a figure is
 * built on the axis. */
typedef struct {
  pp_scale *scale;
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
/* TRUE when it was free and is now held by owner. */
gboolean pp_claims_take_mark_if_free(pp_claims *claims, guint mark, const char *owner);
gboolean pp_claims_take_label_if_free(pp_claims *claims, guint label, const char *owner);
void pp_claims_begin(pp_claims *claims);
void pp_claims_commit(pp_claims *claims);
void pp_claims_rollback(pp_claims *claims);
/* Open transactions (0 outside any). */
guint pp_claims_depth(const pp_claims *claims);

/* ---- What every recognizer sees ------------------------------------------------------ */
typedef struct {
  const pp_scene *scene;
  GHashTable *glyph_marks;      /* marks that are parts of text (path-drawn minus signs) */
  GPtrArray *labels;            /* pp_label*, every numeric phrase */
  GPtrArray *axes;              /* pp_axis_candidate*, fitted or not */
  GArray *bars;                 /* pp_bar_candidate */
  GPtrArray *areas;             /* pp_area_candidate* */
  pp_claims *claims;            /* the ledger */
  GArray *wedges;               /* pp_wedge_candidate of every fill, claimed or not (wedges.c) */
  struct pp_bar_text *bar_text; /* words and labels in coordinate order (bar_group.c) */
  struct pp_legend_words *legend_words; /* words by position for legend keys (legend.c) */
  pp_page_charts *out;                  /* figures found so far */
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
/* Whether a bar or area figure is a chart at all (evidence.c): when it shows what tables,
 * listings, tags, tiles, rules, shadows or text boxes have, judged becomes FALSE with the
 * reason. Called by pp_figure_finish(). */
void pp_figure_weigh(pp_recognize_ctx *ctx, pp_figure *figure);

/* The content hash of a figure: values, labels, kind, no position (model.c). */
void pp_figure_set_fingerprint(pp_figure *figure);

/* ---- Shared concepts (concepts.c): one definition each ---------------------------- */

/* Two edge coordinates are the same drawn edge: producers write coordinates to a few
 * hundredths of a point (LibreOffice rounds to 1/100 mm, 0.028 pt), so closer than
 * this is one edge (common practice, no source). */
#define PP_SAME_EDGE_TOL 0.05
/* Two bars are in the same column when both their sides agree this well, pt: wider than
 * PP_SAME_EDGE_TOL because stacked segments are often drawn with their own outline
 * rounding (common practice, no source). */
#define PP_SAME_COLUMN_TOL 0.2
/* A segment sits on the one below when the gap between them is under this, pt: a thin
 * white separator stroke is not a gap (common practice, no source). */
#define PP_STACK_GAP 0.3
/* A box covering more than this share of the page is a page background or frame, not a
 * mark that stands for a value (common practice, no source). */
#define PP_PAGE_SIZED_SHARE 0.6
/* Marks belong to an axis when they lie within this share of its tick span beyond its
 * end ticks (plots extend past the last labelled tick; common practice, no source). */
#define PP_AXIS_REACH_SHARE 0.6

/* A path whose corners are within this of an axis-aligned rectangle's is one, pt
 * (producers' rounding; common practice, no source). */
#define PP_RECT_TOL 0.01

gboolean pp_same_edge(double a, double b);
/* One of the two edges u0, u1 is the edge c. */
gboolean pp_on_edge(double u0, double u1, double c);
gboolean pp_page_sized(const pp_scene *scene, pp_rect r);
/* Along the axis: [u0, u1] lies within the axis' tick span widened on each side by
 * PP_AXIS_REACH_SHARE of it plus slack points, and by at least floor points. */
gboolean pp_within_reach(const pp_axis_candidate *axis, double u0, double u1, double slack,
                         double floor);

/* A rectangle in an axis' frame: u along the value axis, w across it. */
typedef struct {
  double u0, u1, w0, w1;
} pp_frame_rect;

pp_frame_rect pp_frame_of(pp_rect r, gboolean vertical);
/* Both sides across the axis agree within PP_SAME_COLUMN_TOL. */
gboolean pp_same_column(pp_frame_rect a, pp_frame_rect b);

/* ---- Bars (bar_group.c): shared by the bar recognizers ------------------------------ */

/* Ledger owners (static strings). */
#define PP_OWNER_VALUE_AXIS "value-axis"
#define PP_OWNER_CATEGORY_AXIS "category-axis"
#define PP_OWNER_DATA_LABEL "data-label"

/* The figure of the selected bars (indices into ctx->bars) standing on base: one element
 * per column with its stacked segments as parts, series by colour, category labels,
 * data labels at the tips. Values read on scale when it is not NULL. Claims the bars'
 * marks and the data labels for owner; the caller runs it inside a transaction. */
pp_figure *pp_bars_build(pp_recognize_ctx *ctx, GArray *sel, const pp_scale *scale,
                         gboolean vertical, double base, const char *owner);
/* pp_bars_build in two steps, for a caller that may reject the figure by its elements'
 * boxes alone (they do not change in the second step): the elements (columns, stacks,
 * series, values), then their categories and data labels. */
pp_figure *pp_bars_stack(pp_recognize_ctx *ctx, GArray *sel, const pp_scale *scale,
                         gboolean vertical, double base, const char *owner);
void pp_bars_annotate(pp_recognize_ctx *ctx, pp_figure *fig, gboolean vertical, double base);
typedef struct pp_bar_text pp_bar_text;
void pp_bar_text_free(pp_bar_text *t);
/* Legend keys: swatches of one size, each named beside it (legend.c). */
gboolean pp_bars_legend_like(pp_recognize_ctx *ctx, const pp_figure *fig);
typedef struct pp_legend_words pp_legend_words;
void pp_legend_words_free(pp_legend_words *lw);
/* Evidence of a bar layout: the shared baseline and how regularly the bars of each series
 * are spaced (pp_bars_spacing_regularity: share of regular gaps, NAN with too few bars). */
double pp_bars_spacing_regularity(const pp_figure *fig);
void pp_bars_weigh_layout(pp_figure *fig);
/* Claims the free labels of an axis for a figure built on it. */
void pp_axis_claim_labels(pp_recognize_ctx *ctx, const pp_axis_candidate *axis);
/* An axis is taken when every one of its labels is held (by a figure built on it). */
gboolean pp_axis_taken(const pp_recognize_ctx *ctx, const pp_axis_candidate *axis);

/* ---- Circles (wedges.c): shared by the pie, tilted-pie and radial recognizers -------- */
/* A filled mark's subpath read as a wedge, with its share of the mark's ink. */
typedef struct {
  guint mark;
  pp_wedge w;
  double ink;
  pp_paint paint;
  pp_rect box; /* the mark's visible box */
} pp_wedge_candidate;

/* Every free filled mark's wedges (geometry's reading, no shared shape). The page's
 * wedges are read on the first call and kept in ctx->wedges. */
GArray *pp_wedge_candidates_collect(pp_recognize_ctx *ctx);
gboolean pp_paint_same(const pp_paint *a, const pp_paint *b);
/* a lies in [a0, a1] modulo a turn. */
gboolean pp_angle_within(double a, double a0, double a1);

#define PP_SLICE_MAX_PARTS 8
/* One slice (a pie wedge, a ring, a tilted pie's slice with its rim) being assembled. */
typedef struct {
  pp_ellipse ellipse; /* outer ellipse, centred on the slice's apex */
  double inner;       /* inner radius / outer radius (donuts, rings) */
  double a0, a1;      /* parametric angles, y up */
  double offset;      /* pulled out from the common centre by this, pt */
  pp_paint paint;
  guint n_parts;
  guint marks[PP_SLICE_MAX_PARTS];
  pp_part_role roles[PP_SLICE_MAX_PARTS];
  double inks[PP_SLICE_MAX_PARTS];
  pp_rect box;
  const pp_label *label; /* its printed number, NULL if none */
  char *category;        /* owned */
  pp_rect face;          /* perspective: the whole pie's top-face box, distances then read
                          * on quarter ellipses about the apex; empty: on ellipse */
  double drop;           /* depth of the rim below the face, pt (names sit below it) */
} pp_slice;

void pp_slice_coords(const pp_ellipse *e, pp_point p, double *angle, double *dist);
/* Finds each slice's printed number (inside, at a leader line's end, just beyond it, or in
 * a legend matched by colour) and claims it (and the legend swatch) for owner. Returns
 * how many slices got one; *legend tells whether the legend was used. */
guint pp_slices_attach_labels(pp_recognize_ctx *ctx, GArray *slices, const char *owner,
                              gboolean *legend);
void pp_slices_clear(GArray *slices);
void pp_slices_sort_clockwise(GArray *slices);
/* The slices' angles add up to a turn within tol (share of a turn) and each ends where
 * another starts. */
gboolean pp_slices_tile_turn(GArray *slices, double tol);
/* The element's value, label, share and category from its slice's printed number. */
void pp_slice_set_value(pp_element *el, const pp_slice *s);
/* Shares of numbers printed as values (not percentages): value / sum. */
void pp_slices_value_shares(pp_figure *fig);
/* Every pie family ends alike: value shares, the tiling evidence, then judged only when
 * every one of the n slices carries a printed number (labels_evidence names how), the
 * claims committed and the figure finished. */
void pp_slices_finish(pp_recognize_ctx *ctx, pp_figure *fig, guint labelled, guint n,
                      const char *labels_evidence);

/* ---- The recognizers (one file each; listed in recognizers.c) ----------------------- */
void pp_recognize_bars(pp_recognize_ctx *ctx);          /* bars.c */
void pp_recognize_areas(pp_recognize_ctx *ctx);         /* areas.c */
void pp_recognize_labelled_bars(pp_recognize_ctx *ctx); /* labelled.c */
void pp_recognize_lines(pp_recognize_ctx *ctx);         /* lines.c */
void pp_recognize_solid_bars(pp_recognize_ctx *ctx);    /* solids.c */
void pp_recognize_cylinders(pp_recognize_ctx *ctx);     /* cylinders.c */
void pp_recognize_boxes(pp_recognize_ctx *ctx);         /* boxes.c */
void pp_recognize_dots(pp_recognize_ctx *ctx);          /* dots.c */
void pp_recognize_two_sided(pp_recognize_ctx *ctx);     /* two_sided.c */
/* Shared by the solid recognizers (solids.c): the free vertical linear value axis beside
 * a group of solids, the word under a front (its category), the plot frame around them. */
const pp_axis_candidate *pp_solid_value_axis(const pp_recognize_ctx *ctx, pp_rect all);
char *pp_solid_category(const pp_scene *scene, pp_rect front, double base);
pp_rect pp_solid_frame(const pp_scene *scene, pp_rect all);
/* The view of a 3D chart's box in perspective (box_view.c): page ~ p · (X, Y, Z, 1) over
 * the box's unit cube (Z up), the value scale value = offset + slope·Z read from the ticks
 * of one vertical edge, and the labels (indices into ctx->labels) it read. */
typedef struct {
  double p[3][4];
  pp_rect frame;      /* the panes' extent */
  guint panes[3];     /* which of the candidate panes are the floor and walls */
  double depth_ratio; /* largest over smallest depth of the box's corners: 1 orthographic */
  double offset, slope, tick_lo, tick_hi;
  guint n_ticks;
  GArray *labels;   /* guint */
  GArray *tick_pos; /* pp_point, where each labelled tick meets the edge */
} pp_box_view;
/* The first three of the quads that meet as a floor and two walls and carry a value scale
 * on a vertical edge; the labels are not claimed. */
gboolean pp_box_view_find(const pp_recognize_ctx *ctx, const pp_quad *quads, guint n,
                          pp_box_view *view);
pp_point pp_box_view_project(const pp_box_view *view, double x, double y, double z);
gboolean pp_box_view_on_plane(const pp_box_view *view, pp_point page, double z, double *x,
                              double *y);
double pp_box_view_height(const pp_box_view *view, double x, double y, pp_point page);
void pp_box_view_clear(pp_box_view *view);
/* boxes.c's perspective half (box_persp.c): faces (quads) with their mark indices, and the
 * panes (quads holding others) among which the floor and two walls are looked for. FALSE
 * when they show no view in perspective (the orthographic reading is boxes.c's). */
gboolean pp_recognize_boxes_in_perspective(pp_recognize_ctx *ctx, const pp_quad *faces,
                                           const guint *marks, guint n, const pp_quad *panes,
                                           const guint *pane_marks, guint n_panes);
/* The ink of a fill as it shows on the page: less what opaque fills painted after it cover
 * (painter's order), measured exactly by the geometry stage. */
double pp_solid_visible_ink(const pp_recognize_ctx *ctx, guint mark);
void pp_recognize_pyramids(pp_recognize_ctx *ctx);    /* pyramids.c */
void pp_recognize_symbols(pp_recognize_ctx *ctx);     /* symbols.c */
void pp_recognize_pies(pp_recognize_ctx *ctx);        /* pies.c */
void pp_recognize_tilted_pies(pp_recognize_ctx *ctx); /* tilted_pies.c */
void pp_recognize_radial(pp_recognize_ctx *ctx);      /* radial.c */

/* ---- A bucket grid over fixed boxes (box_grid.c) ------------------------------------ */
typedef struct pp_box_grid pp_box_grid;
/* Boxes that are empty are never returned. */
pp_box_grid *pp_box_grid_new(const pp_rect *boxes, guint n);
void pp_box_grid_free(pp_box_grid *grid);
/* Sets out (guint) to the indices, ascending and once each, of every box that touches q,
 * plus possibly some that do not: callers apply their exact test to each. */
void pp_box_grid_query(pp_box_grid *grid, pp_rect q, GArray *out);
/* The same ids in no particular order, for callers whose answer does not depend on it. */
void pp_box_grid_query_any(pp_box_grid *grid, pp_rect q, GArray *out);
/* Whether accept takes one of the ids pp_box_grid_query_any would give for q, each asked
 * at most once, in no particular order; stops at the first taken. */
typedef gboolean (*pp_box_grid_accept)(guint id, gpointer data);
gboolean pp_box_grid_find(pp_box_grid *grid, pp_rect q, pp_box_grid_accept accept, gpointer data);
/* Sets out likewise to a superset of the boxes b with pp_rect_contains(outer, b, tol),
 * empty ones included. */
void pp_box_grid_query_inside(pp_box_grid *grid, pp_rect outer, double tol, GArray *out);
G_DEFINE_AUTOPTR_CLEANUP_FUNC(pp_box_grid, pp_box_grid_free)
/* The items of each of n_groups groups (group[i] < n_groups; others in none), in index
 * order: members[start[g] .. start[g + 1]), so a recognizer visits a group's items
 * without a pass over all of them. */
typedef struct {
  guint *start, *members;
} pp_group_lists;
void pp_group_lists_init(pp_group_lists *gl, const guint *group, guint n, guint n_groups);
void pp_group_lists_clear(pp_group_lists *gl);
/* Item ids sorted by one finite coordinate each (non-finite ones are left out, as they
 * pass no tolerance test): pp_coord_index_range appends to out the ids whose value lies
 * in [lo, hi], in value order; callers apply their exact test to each. */
typedef struct pp_coord_index pp_coord_index;
pp_coord_index *pp_coord_index_new(const double *values, guint n);
void pp_coord_index_free(pp_coord_index *index);
void pp_coord_index_range(const pp_coord_index *index, double lo, double hi, GArray *out);
/* Fills out with the ids whose value lies in [lo, hi] and those whose value is not finite
 * (which no range can rule out), in id order: the candidates, in page order, for a caller
 * that marks with NaN the items its range cannot answer for. */
void pp_coord_index_within(const pp_coord_index *index, double lo, double hi, GArray *out);
G_DEFINE_AUTOPTR_CLEANUP_FUNC(pp_coord_index, pp_coord_index_free)

/* ---- Bubbles and their size keys (symbols.c, size_key.c) ---------------------------- */
/* A size key shows at most this many sizes (a key, not a chart; common practice). */
#define PP_SYMBOL_KEY_MAX 16

/* A filled circle or icon outline, or an outlined circle (keys only). */
typedef struct {
  guint mark;
  gboolean circle;
  gboolean outline; /* a stroked circle: a key's symbol, never a bubble */
  pp_point centre;
  double r; /* circles: radius; icons: half the bbox diagonal */
  pp_rect box;
  double ink; /* outlines: the area they enclose */
  pp_paint paint;
  int family;
  const pp_label *label;
} pp_symbol;

/* What every family's build shares on one page, built once, so that the work grows with
 * the symbols, labels and words rather than with their products (dense scatters hold
 * 10^5 symbols in 10^3 colours). */
typedef struct {
  pp_recognize_ctx *ctx;
  GArray *syms;            /* pp_symbol */
  GPtrArray *members;      /* per family: GArray of guint indices into syms, ascending */
  pp_box_grid *labels;     /* item k: ctx->labels[k], its box with its centre */
  double label_size;       /* the largest label's font size */
  pp_box_grid *centres;    /* item i: syms[i]'s centre */
  pp_box_grid *words;      /* item k: scene->words[k] at (centre x, top); on first use */
  double word_size;        /* the largest word's font size */
  GArray *frames;          /* pp_rect: rectangle marks that may frame a plot; on first use */
  GHashTable *tick_labels; /* labels of evenly stepped fitted axes: never a symbol's */
  GArray *key_families;    /* int: families that may still be a size key, ascending */
} pp_symbol_page;

/* A size key for the bubbles of family: the first other family whose every symbol has its
 * own free number (beside, above or below it, or at the top of nested circles), with
 * area growing with value. Sets each key symbol's label, fills key_members (indices into
 * pg->syms) and fits area against value; FALSE when there is none. */
gboolean pp_size_key_find(pp_symbol_page *pg, int family, pp_power_fit *fit, GArray *key_members);
