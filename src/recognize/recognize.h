/* recognize.h — contract of the chart-recognition stage: from a measured scene, the
 * figures on the page. A figure has a family, a plot region, an optional value scale and
 * its elements; an element is one thing that stands for a number, with its value, where
 * that value came from, the marks it is made of and the ink they really put on the page. */
#pragma once

#include "capture/capture.h"

G_BEGIN_DECLS

/* The one list of figure kinds. Everything that names a kind (JSON writers, schema,
 * accuracy script, corpus truth) takes it from here or is checked against it by a test.
 * X(ENUM, "json-name", "what it is") */
#define PP_FIGURE_KINDS(X)                                                                         \
  X(COLUMN, "column", "vertical bars on a value axis or with data labels")                         \
  X(BAR, "bar", "horizontal bars on a value axis or with data labels")                             \
  X(AREA, "area", "filled areas under a series")                                                   \
  X(LINE, "line", "unfilled lines and markers (counted, never judged)")                            \
  X(PIE, "pie", "a pie or donut: wedges whose angles stand for shares of a whole")                 \
  X(TILTED_PIE, "tilted-pie", "a pie drawn tilted or in perspective, with or without a rim")       \
  X(RADIAL_BAR, "radial-bar", "concentric rings whose sweep angle stands for a value")             \
  X(POLAR_AREA, "polar-area", "wedges of equal angle whose radius stands for a value")             \
  X(BAR_3D, "bar-3d", "bars drawn with oblique or perspective faces, cylinders, cones")            \
  X(PYRAMID, "pyramid", "stacked trapezoid or triangle slices: pyramids and funnels")              \
  X(BUBBLE, "bubble", "circles or symbols whose size stands for a value")                          \
  X(OTHER, "other", "a chart-like figure of no known family")

typedef enum {
#define PP_X_ENUM(e, name, what) PP_FIGURE_##e,
  PP_FIGURE_KINDS(PP_X_ENUM)
#undef PP_X_ENUM
      PP_FIGURE_N_KINDS
} pp_figure_kind;

const char *pp_figure_kind_name(pp_figure_kind kind);
const char *pp_figure_kind_summary(pp_figure_kind kind);
/* FALSE when name is not a kind. */
gboolean pp_figure_kind_from_name(const char *name, pp_figure_kind *kind);

typedef struct {
  double pos;   /* page points along the axis (x for a horizontal axis, y for vertical) */
  double value; /* as printed */
  char *label;
} pp_tick;

typedef enum {
  PP_SCALE_LINEAR, /* value = offset + slope·pos */
  PP_SCALE_LOG,    /* log10(value) = offset + slope·pos */
} pp_scale_kind;

/* A value scale read from a drawn axis: ticks, their labels and the fitted mapping. */
typedef struct {
  pp_scale_kind kind;
  gboolean vertical; /* values change along y */
  double offset, slope;
  double rms_residual; /* of the least-squares fit, in value units (log10 units on log scales) */
  double min_value, max_value; /* of the visible range (plot area edges) */
  GArray *ticks;               /* of pp_tick */
  pp_rect box;                 /* the tick labels' extent */
} pp_scale;

/* An empty linear scale (no ticks yet); freed with its tick labels. */
pp_scale *pp_scale_new(gboolean vertical);
pp_scale *pp_scale_copy(const pp_scale *scale);
void pp_scale_free(pp_scale *scale);
double pp_scale_value_at(const pp_scale *scale, double pos);
double pp_scale_pos_of(const pp_scale *scale, double value);

/* How an element's ink is meant to stand for its number. */
typedef enum {
  PP_ENCODING_LENGTH, /* length along a value scale: bars, heights of an area */
  PP_ENCODING_AREA,   /* the area itself: bubbles, pyramid slices, 3D faces */
  PP_ENCODING_ANGLE,  /* sweep angle: pie wedges, radial bars */
  PP_ENCODING_RADIUS, /* radius or side: polar-area wedges, symbols scaled by size */
  PP_ENCODING_SHARE,  /* share of a whole, however drawn */
} pp_encoding;

const char *pp_encoding_name(pp_encoding encoding);

/* Where an element's value came from. */
typedef enum {
  PP_VALUE_NONE,          /* not known */
  PP_VALUE_SCALE,         /* read on the figure's value scale */
  PP_VALUE_DATA_LABEL,    /* a printed number at or in the mark */
  PP_VALUE_PERCENT_LABEL, /* a printed percentage */
  PP_VALUE_LEGEND,        /* a legend entry matched by colour */
  PP_VALUE_SIZE_KEY,      /* a size key (bubble legend) */
} pp_value_source;

const char *pp_value_source_name(pp_value_source source);

/* What a mark is to its element: a 3D bar's front, cap and side faces, a tilted pie's
 * top and rim, a stacked segment, or just the mark. */
typedef enum {
  PP_PART_BODY,    /* the mark that carries the value (a flat bar, a wedge, a bubble) */
  PP_PART_FRONT,   /* front face of a 3D bar */
  PP_PART_CAP,     /* top or end cap (parallelogram, ellipse) */
  PP_PART_SIDE,    /* side face */
  PP_PART_TOP,     /* top face of a tilted pie slice */
  PP_PART_RIM,     /* side wall of a tilted pie slice */
  PP_PART_SEGMENT, /* one segment of a stacked bar */
} pp_part_role;

const char *pp_part_role_name(pp_part_role role);

typedef struct {
  guint mark; /* index into the scene's marks */
  pp_part_role role;
  double ink; /* visible ink this mark adds to the element, pt² */
} pp_part;

/* The geometry of an element in the form its family needs. */
typedef enum {
  PP_SHAPE_NONE,
  PP_SHAPE_RECT,    /* rect */
  PP_SHAPE_SAMPLE,  /* a vertical slice of a filled area at x: rect.x0 == rect.x1 */
  PP_SHAPE_SECTOR,  /* sector */
  PP_SHAPE_QUAD,    /* quad: trapezoid, parallelogram, triangle (p[3] == p[0]) */
  PP_SHAPE_CIRCLE,  /* circle */
  PP_SHAPE_POLYGON, /* only box and ink are known */
} pp_shape_kind;

typedef struct {
  pp_shape_kind kind;
  union {
    pp_rect rect;
    struct {
      pp_point centre;
      double rx, ry; /* outer radii; rx == ry for a circle, ry < rx when tilted */
      double inner;  /* inner radius as a fraction of the outer one (donut), 0 for a pie */
      double a0, a1; /* parametric start and sweep end, radians, a1 > a0 (the angle in the
                      * un-tilted circle, not the apparent one) */
      double offset; /* explosion: distance of the centre from the pie's common centre */
    } sector;
    struct {
      pp_point p[4]; /* corners in drawing order */
    } quad;
    struct {
      pp_point centre;
      double r;
    } circle;
  };
} pp_shape;

/* One thing that stands for a number. */
typedef struct {
  pp_encoding encoding;
  pp_shape shape;
  GArray *parts; /* of pp_part: the marks it is made of, at least one */
  pp_rect box;   /* visible extent, page points */

  double value;           /* the number it stands for, NAN when unknown */
  pp_value_source source; /* where value came from */
  double scale_value;     /* reading on the figure's scale at its far end (NAN without a scale) */
  double base_value;      /* reading at the drawn baseline, where the ink starts (NAN if none) */
  double label_value;     /* printed number attached to it, NAN if none */
  char *label_text;       /* as printed ("€100m", "12.5%"), NULL if none */
  double share;           /* printed or implied share of the whole, 0–1, NAN if not a share */

  double ink;       /* visible ink of all parts, pt² */
  double extent;    /* visible length along the scale (bars), mean height (areas), sweep (angles,
                     * radians), radius (symbols): the size the encoding reads */
  char *category;   /* category or slice name, NULL if none was found */
  guint series;     /* colour group, 0-based */
  gboolean stacked; /* sits on another element of its column */
} pp_element;

/* Evidence that a group of marks is a chart, recorded on the figure (see docs/rules.md). */
typedef struct {
  const char *what; /* static: "scale-fits", "shared-baseline", "regular-spacing",
                     * "category-labels", "data-labels", "legend", "percent-sum", ... */
  double score;     /* 0–1: how strongly it holds */
} pp_evidence;

/* How the figure is projected, for families that tilt or extrude. */
typedef struct {
  enum {
    PP_PROJECTION_FLAT,
    PP_PROJECTION_OBLIQUE,
    PP_PROJECTION_PERSPECTIVE,
    PP_PROJECTION_TILTED, /* orthographic tilt of a plane: ellipses of axis ratio `ratio` */
  } kind;
  double ratio; /* tilted: minor/major axis ratio = cos(tilt); oblique: depth/width;
                 * box bars (boxes.c): the largest share of a bar nearer bars hide */
} pp_projection;

typedef struct {
  pp_figure_kind kind;
  const char *recognizer; /* static: the recognizer that built it */
  pp_rect bbox;           /* plot region, page points */
  pp_scale *scale;        /* NULL when the chart has no readable value scale */
  GArray *elements; /* of pp_element, category order (left→right, top→bottom, clockwise) */
  guint n_series;
  pp_projection projection;
  GArray *evidence;  /* of pp_evidence */
  double confidence; /* 0–1, from the evidence */
  gboolean judged;   /* FALSE: seen, not judged (evidence too weak); see not_judged_reason */
  char *not_judged_reason;
  char *fingerprint; /* stable content hash: values, labels, kind; no page number */
  char *title;       /* nearest title-like text, NULL if none */
} pp_figure;

/* An empty figure; frees its scale, elements (parts, strings), evidence, strings. */
pp_figure *pp_figure_new(pp_figure_kind kind);
void pp_figure_free(pp_figure *figure);
G_DEFINE_AUTOPTR_CLEANUP_FUNC(pp_figure, pp_figure_free)

/* An element with no value yet (NANs, no label), holding a copy of nothing; append parts
 * with pp_element_add_part(). Elements are owned by their figure's array. */
pp_element pp_element_init(pp_encoding encoding);
void pp_element_add_part(pp_element *element, guint mark, pp_part_role role, double ink);
/* The ink of the parts with one role. */
double pp_element_ink_of(const pp_element *element, pp_part_role role);
void pp_figure_add_evidence(pp_figure *figure, const char *what, double score);

typedef struct {
  pp_rect bbox;
  char *reason;
} pp_scale_failure;

typedef struct {
  GPtrArray *figures;        /* of pp_figure*: judged and seen-not-judged */
  GPtrArray *scale_failures; /* of pp_scale_failure* */
  GArray *raster_images;     /* of pp_rect: images big enough to be figures, not analysed */
} pp_page_charts;

/* Empty result lists, owning what is added: figures, scale failures (bbox, reason). */
pp_page_charts *pp_page_charts_new(void);
pp_page_charts *pp_page_charts_find(const pp_scene *scene);
void pp_scale_failure_free(pp_scale_failure *failure);
void pp_page_charts_free(pp_page_charts *charts);
G_DEFINE_AUTOPTR_CLEANUP_FUNC(pp_page_charts, pp_page_charts_free)

/* The recognizers in the order they run, for docs and --help. */
typedef struct {
  const char *name;
  const char *summary;
  const char *evidence; /* what it requires before a figure is judged */
} pp_recognizer_info;
const pp_recognizer_info *pp_recognizers_list(guint *n);

G_END_DECLS
