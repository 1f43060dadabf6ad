/* geometry.h — contract of the geometry stage: exact areas of painted paths under
 * both fill rules, intersected with clip chains, plus lengths and bounding boxes.
 * Input is core's pp_path in page points; nothing here knows about PDF or cairo. */
#pragma once

#include "capture/capture.h"
#include "core/core.h"

G_BEGIN_DECLS

/* Signed area enclosed by the path by Green's theorem, each subpath implicitly
 * closed; closed form for cubic segments, so there is no flattening error.
 * Positive for counter-clockwise in a y-up frame (clockwise on a y-down page). */
double pp_path_signed_area(const pp_path *path);

/* Area of the region the path fills under the rule, self-intersections and
 * multiple subpaths included. */
double pp_path_fill_area(const pp_path *path, pp_fill_rule rule);

/* Area of (path filled under rule) ∩ every region of the clip chain.
 * clip may be NULL. This is the visible ink of a fill. */
double pp_path_clipped_area(const pp_path *path, pp_fill_rule rule, const pp_clip *clip);

/* Arc length, cubics by adaptive Gauss–Legendre quadrature. Closing segments count. */
double pp_path_length(const pp_path *path);

/* Arc length of the cubic p[0..3] between parameters t0 and t1 (same quadrature). */
double pp_cubic_length(const pp_point p[4], double t0, double t1);

/* Length of the part of the path inside the clip chain (NULL = whole length). */
double pp_path_clipped_length(const pp_path *path, const pp_clip *clip);

/* Stroke ink = line width × clipped length. Joins, caps and dashes are ignored
 * (see docs/architecture.md): a documented approximation, not a hidden one. */
double pp_stroke_ink(const pp_path *path, double line_width, const pp_clip *clip);

/* Tight bounding box; cubic extrema from the roots of the derivative. */
pp_rect pp_path_bbox(const pp_path *path);

/* Bounding box of the clip chain's region (intersection of member bboxes);
 * pp_rect_empty() never, an infinite box when clip is NULL. */
pp_rect pp_clip_bbox(const pp_clip *clip);

/* If the path is one axis-aligned rectangle (4 or 5 points, optional close,
 * repeated points and collinear points tolerated), store it and return TRUE. */
gboolean pp_path_is_rectangle(const pp_path *path, double tol, pp_rect *out);

/* Flatten into polygons (one per subpath) with the given maximum chord
 * deviation, for consumers that need vertices (recognition of area tops). */
GPtrArray *pp_path_flatten(const pp_path *path, double tolerance); /* of GArray<pp_point> */

/* Measures every mark of a captured scene in place: bbox, visible bbox and ink
 * (fills and images by clipped area, strokes by width × clipped length). */
void pp_scene_measure(pp_scene *scene);

/* ---- Arcs, ellipses and wedges (conic.c, wedge.c) ------------------------------------
 * Angles are in a y-up frame (counter-clockwise as seen on the page), radians. */

/* An ellipse: semi-axis rx along direction rot (from the page's +x, counter-clockwise as
 * seen), ry across it. A circle has rx == ry and rot 0. */
typedef struct {
  pp_point centre; /* page points */
  double rx, ry;
  double rot;
} pp_ellipse;

/* Fits whose axis ratio is above this are circles (rx = ry, rot = 0): a tilt of
 * acos(0.995) ≈ 5.7° changes no share by more than 0.5%: derived. */
#define PP_CIRCLE_AXIS_RATIO 0.995

/* Algebraic least-squares fits (circle: Kåsa; ellipse: general conic with the trace
 * normalised; centred: A x² + B xy + C y² = 1). FALSE when the points do not fix one. */
gboolean pp_circle_fit(const pp_point *pts, size_t n, pp_point *centre, double *r);
gboolean pp_ellipse_fit(const pp_point *pts, size_t n, pp_ellipse *out);
gboolean pp_ellipse_fit_centred(const pp_point *pts, size_t n, pp_point centre, pp_ellipse *out);
/* Parametric angle t of p, the angle in the un-tilted circle: p = centre + R(rot)·(rx cos t,
 * ry sin t); and p's distance from the centre in units of the ellipse (1 on it). */
double pp_ellipse_param(const pp_ellipse *e, pp_point p);
double pp_ellipse_scale(const pp_ellipse *e, pp_point p);
pp_point pp_ellipse_point(const pp_ellipse *e, double t);

/* Closed forms: sector r²θ/2; annular sector (R² − r²)θ/2; ellipse sector between the
 * parametric angles t1 and t2, ab(t2 − t1)/2 (the affine image of a circle's sector). */
double pp_sector_area(double r, double theta);
double pp_annular_sector_area(double r_outer, double r_inner, double theta);
double pp_ellipse_sector_area(double a, double b, double t1, double t2);

typedef enum {
  PP_WEDGE_SECTOR,  /* arc and two radial edges meeting at the centre (or a half pie) */
  PP_WEDGE_ANNULAR, /* outer arc, inner arc and two radial edges: a donut slice */
  PP_WEDGE_FULL,    /* a whole ellipse */
  PP_WEDGE_ARC,     /* an open arc (a stroke) */
  PP_WEDGE_BAND,    /* two equal arcs one above the other: a tilted pie's rim */
} pp_wedge_kind;

typedef struct {
  pp_wedge_kind kind;
  pp_ellipse outer;      /* the outer (band: top) arc's ellipse, centred on the wedge's apex */
  double inner;          /* annular: inner radius / outer radius; 0 otherwise */
  double a0, a1;         /* parametric angles, 0 ≤ a0 < 2π, a0 < a1 ≤ a0 + 2π */
  gboolean clockwise;    /* drawn clockwise as seen on the page */
  double fit_error;      /* max |scale − 1| of the outer arc's points: 0 for a true arc */
  gboolean shape_fitted; /* axes fixed by this arc; FALSE: a circle or the given shape */
  pp_point depth;        /* band: offset of the bottom arc's centre from the top's */
  guint subpath;         /* which subpath of the path, from 0 */
} pp_wedge;

/* Every subpath that reads as a wedge (others are skipped). filled: subpaths close
 * implicitly. shape, when not NULL, gives the axis ratio and rotation to use (a pie's
 * shared ellipse), so short arcs get the angles of their tilted pie. */
GArray *pp_path_wedges(const pp_path *path, gboolean filled, const pp_ellipse *shape);
/* Area of a sector or annular sector, ab(1 − inner²)(a1 − a0)/2; 0 for arcs and bands. */
double pp_wedge_area(const pp_wedge *w);
/* Two pieces of one slice (same centre and radii within tol·radius, abutting angles
 * within tol radians) as one wedge. */
gboolean pp_wedge_join(const pp_wedge *a, const pp_wedge *b, double tol, pp_wedge *out);
/* ---- Faces and solids (quads.c, power_fit.c) ---- */

typedef enum {
  PP_QUAD_NONE,
  PP_QUAD_TRIANGLE,      /* p[3] == p[0] */
  PP_QUAD_RECTANGLE,     /* right angles, any rotation */
  PP_QUAD_PARALLELOGRAM, /* both pairs of sides parallel: oblique caps and sides */
  PP_QUAD_TRAPEZOID,     /* p[0]p[1] ∥ p[3]p[2]: pyramid slices, perspective faces */
  PP_QUAD_CONVEX,        /* any other convex quadrilateral */
} pp_quad_kind;

const char *pp_quad_kind_name(pp_quad_kind kind);

typedef struct {
  pp_quad_kind kind;
  pp_point p[4]; /* corners in drawing order */
  double area;   /* pt², by the shoelace formula */
} pp_quad;

/* If the path is one convex subpath with 3 or 4 corners (straight curves, repeated and
 * collinear points within tol tolerated), classify it and store its corners. */
gboolean pp_path_as_quad(const pp_path *path, double tol, pp_quad *out);
double pp_quad_area(const pp_quad *quad);

/* Do two faces meet along an edge (collinear within tol, overlapping over most of the
 * shorter one)? */
gboolean pp_quads_share_edge(const pp_quad *a, const pp_quad *b, double tol);
/* Faces joined by shared edges, transitively: group[i] for each face, numbered in order
 * of first appearance. Returns the number of groups. */
guint pp_quads_group_by_edges(const pp_quad *quads, guint n, double tol, guint *group);

/* Convex polygons (a box's silhouette, the part of a face a nearer box hides). The hull of
 * n points into out (room for n), counter-clockwise in page coordinates; returns its
 * corner count. Clipping: the part of subject inside the convex polygon clip (either
 * turn) into out (room for PP_CONVEX_MAX); returns its corner count, 0 when empty. */
#define PP_CONVEX_MAX 64
guint pp_convex_hull(const pp_point *pts, guint n, pp_point *out);
guint pp_convex_clip(const pp_point *subject, guint ns, const pp_point *clip, guint nc,
                     pp_point *out);
double pp_polygon_area(const pp_point *pts, guint n);

/* size = exp(log_coeff) · value^exponent, least squares on logs over the positive pairs. */
typedef struct {
  double exponent, log_coeff;
  double r2; /* coefficient of determination of the log-log fit */
  guint n;   /* pairs used */
} pp_power_fit;

/* FALSE with fewer than two usable pairs or when the values do not vary. */
gboolean pp_power_fit_compute(const double *x, const double *y, guint n, pp_power_fit *out);

typedef enum {
  PP_SOLID_CONE,           /* base_* are radii */
  PP_SOLID_SQUARE_PYRAMID, /* base_* are half-sides */
} pp_solid_kind;

/* Volume of the solid's slice between two parallel cuts of the given half-widths. */
double pp_frustum_volume(pp_solid_kind kind, double base_top, double base_bottom, double height);

G_END_DECLS
