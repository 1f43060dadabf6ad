/* capture.h — contract of the capture stage: open a PDF and turn each page into a
 * scene of painted marks (fills, strokes, images, glyph runs) and text runs.
 * Coordinates are page points, origin at the top-left of the displayed page, y down
 * (the same space as poppler's text boxes); pp_scene.to_pdf maps back to PDF user space. */
#pragma once

#include "core/core.h"

G_BEGIN_DECLS

#define PP_CAPTURE_ERROR (pp_capture_error_quark())
GQuark pp_capture_error_quark(void);

typedef enum {
  PP_CAPTURE_ERROR_UNREADABLE, /* cannot be opened or read from disk */
  PP_CAPTURE_ERROR_EMPTY,      /* zero bytes */
  PP_CAPTURE_ERROR_NOT_PDF,    /* no %PDF- header */
  PP_CAPTURE_ERROR_DAMAGED,    /* poppler cannot parse it */
  PP_CAPTURE_ERROR_ENCRYPTED,  /* needs a password, or the given one is wrong */
  PP_CAPTURE_ERROR_PAGE,       /* one page cannot be captured */
  PP_CAPTURE_ERROR_TAP,        /* the cairo call tap does not work in this process */
} pp_capture_error;

/* Short stable word for each code ("damaged", "encrypted", ...), used in messages. */
const char *pp_capture_error_word(int code);

typedef enum {
  PP_MARK_FILL,
  PP_MARK_STROKE,
  PP_MARK_IMAGE,
  PP_MARK_GLYPHS,
} pp_mark_kind;

const char *pp_mark_kind_name(pp_mark_kind kind);

typedef enum {
  PP_PAINT_SOLID,
  PP_PAINT_LINEAR,
  PP_PAINT_RADIAL,
  PP_PAINT_MESH,
  PP_PAINT_SURFACE, /* image or tiling-pattern source */
  PP_PAINT_OTHER,
} pp_paint_kind;

const char *pp_paint_kind_name(pp_paint_kind kind);

/* Colour is not premultiplied. For gradients it is the mean of the colour stops,
 * which is what grouping marks by colour needs. */
typedef struct {
  pp_paint_kind kind;
  double r, g, b, a;
} pp_paint;

typedef struct {
  pp_mark_kind kind;
  guint index;   /* paint order on the page, from 0 */
  pp_path *path; /* page points; for images the placement parallelogram */
  pp_fill_rule rule;
  pp_paint paint;
  double line_width; /* page points; strokes only */
  gboolean dashed;
  pp_clip *clip;     /* reference, NULL when unclipped */
  guint group_depth; /* > 0 inside transparency groups */
  gboolean soft_masked;
  guint glyph_count;             /* glyph runs */
  double font_size;              /* glyph runs: em size in page points */
  int image_width, image_height; /* images: pixels */
  /* Filled in by the geometry stage (pp_scene_measure()); NAN until then. */
  double ink;           /* visible ink area in pt² after clipping */
  pp_rect bbox;         /* of the path itself, unclipped */
  pp_rect visible_bbox; /* bbox ∩ clip bbox */
} pp_mark;

typedef struct {
  char *text; /* UTF-8 */
  pp_rect box;
  double font_size; /* points, from poppler's text attributes */
  char *font_name;
  guint line;   /* index into pp_scene.lines */
  double angle; /* reading direction in degrees, 0 = left to right, 90 = bottom to top */
} pp_text_run;

typedef struct {
  char *text;
  pp_rect box;
} pp_text_line;

typedef struct {
  guint page_index; /* 0-based */
  double width, height;
  pp_rect crop_box;    /* in PDF user space */
  int rotation;        /* /Rotate as far as it can be inferred (see docs/architecture.md) */
  pp_matrix to_pdf;    /* page points → PDF default user space */
  GPtrArray *marks;    /* of pp_mark* */
  GPtrArray *words;    /* of pp_text_run*: words, in reading order */
  GPtrArray *lines;    /* of pp_text_line* */
  GPtrArray *warnings; /* of char*: things poppler or the tap reported on this page */
  guint n_images;
  guint n_groups;
} pp_scene;

/* An empty scene of a page; capture backends fill it. to_pdf starts as the plain
 * y flip of a page without crop offset or rotation. */
pp_scene *pp_scene_new(guint page_index, double width, double height);
void pp_scene_free(pp_scene *scene);
G_DEFINE_AUTOPTR_CLEANUP_FUNC(pp_scene, pp_scene_free)

typedef struct {
  char *path;
  guint64 size;
  char *sha256; /* lowercase hex */
  guint n_pages;
  char *pdf_version;
  char *producer, *creator, *title; /* NULL when absent */
} pp_document_info;

/* SHA-256, the documents' identity (FIPS 180-4), as lowercase hex: fed in pieces, then
 * freed into its digest (g_free it). */
typedef struct pp_sha256 pp_sha256;
pp_sha256 *pp_sha256_new(void);
void pp_sha256_update(pp_sha256 *sum, const void *data, gsize len);
char *pp_sha256_free_to_hex(pp_sha256 *sum);
char *pp_sha256_hex(const void *data, gsize len);

/* What the file system says about a file's bytes without reading them. Every write to a
 * file moves its change time (ctime) to the current time, and nobody can set it back, so the
 * same identity means the same bytes, unless a write fell in the clock tick of the reading. */
typedef struct {
  guint64 device, inode, size;
  gint64 mtime_ns, ctime_ns;
} pp_file_identity;

/* A file's SHA-256 with its identity while it was read. trusted is FALSE when the identity
 * cannot vouch for the bytes: it changed during the reading, or its ctime was too close to
 * the reading's start (pp_file_digest_compute). */
typedef struct {
  pp_file_identity identity;
  char sha256[65]; /* lowercase hex */
  gboolean trusted;
} pp_file_digest;

/* Reads the whole file at path and hashes it (G_FILE_ERROR when it cannot be read). */
gboolean pp_file_digest_compute(const char *path, pp_file_digest *out, GError **error);
/* The identity of an open file descriptor (FALSE when fstat fails). */
gboolean pp_file_identity_of_fd(int fd, pp_file_identity *out);
gboolean pp_file_identity_equal(const pp_file_identity *a, const pp_file_identity *b);

typedef struct pp_document pp_document;

/* Opens and checks the file; a clean GError for every way it can fail. */
pp_document *pp_document_open(const char *path, const char *password, GError **error);
/* The same, taking the SHA-256 from known (may be NULL) instead of reading every byte again
 * when known is trusted and the file still has its identity. */
pp_document *pp_document_open_digested(const char *path, const char *password,
                                       const pp_file_digest *known, GError **error);
void pp_document_free(pp_document *doc);
G_DEFINE_AUTOPTR_CLEANUP_FUNC(pp_document, pp_document_free)

const pp_document_info *pp_document_get_info(const pp_document *doc);

/* Captures one page (0-based). Each call is independent: memory is bounded per page. */
pp_scene *pp_document_capture_page(pp_document *doc, guint index, GError **error);

/* Checks once per process that cairo calls made by poppler reach the tap,
 * by capturing a built-in one-page PDF. */
gboolean pp_capture_self_test(GError **error);

G_END_DECLS
