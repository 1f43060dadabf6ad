/* tap.c — the call tap: this executable defines the cairo entry points poppler's cairo
 * output device calls, records those made on the page being captured and forwards
 * the rest to the real cairo through dlsym(RTLD_NEXT). See ../shared capture notes §11. */
#include <dlfcn.h>
#include <math.h>
#include <string.h>

#include "internal.h"

/* Ops on the page context are recorded but not forwarded: nothing needs the
 * pixels, and skipping them is what makes the tap faster than a recording surface.
 * State changes (clip, save/restore, groups) are forwarded so cairo stays consistent. */

typedef struct {
  pp_clip *clip;
  gboolean is_group;
} saved_state;

static struct {
  cairo_t *cr;
  pp_scene *scene;
  double scale;
  pp_clip *clip;
  GArray *saved; /* of saved_state */
  guint group_depth;
  guint calls;
  gboolean base_seen;
} tap;

#define REAL(name)                                                                                 \
  static __typeof__(&name) real_##name;                                                            \
  if (!real_##name)                                                                                \
  real_##name = (__typeof__(&name))dlsym(RTLD_NEXT, #name)

void pp_tap_begin(cairo_t *cr, double scale, pp_scene *scene) {
  tap.cr = cr;
  tap.scene = scene;
  tap.scale = scale;
  tap.clip = NULL;
  tap.saved = g_array_new(FALSE, FALSE, sizeof(saved_state));
  tap.group_depth = 0;
  tap.calls = 0;
}

guint pp_tap_end(void) {
  for (guint i = 0; i < tap.saved->len; i++)
    pp_clip_unref(g_array_index(tap.saved, saved_state, i).clip);
  g_array_free(tap.saved, TRUE);
  pp_clip_unref(tap.clip);
  guint calls = tap.calls;
  memset(&tap, 0, sizeof tap);
  return calls;
}

static gboolean tapped(cairo_t *cr) {
  if (!tap.cr || cr != tap.cr)
    return FALSE;
  tap.calls++;
  return TRUE;
}

/* Device space of the page context is page points × scale, so device → page is a
 * uniform division. Reading the path under the identity matrix gives cairo's own
 * device coordinates (24.8 fixed point), with no round trip through the inverse CTM. */
static pp_path *copy_device_path(cairo_t *cr) {
  cairo_matrix_t ctm;
  cairo_get_matrix(cr, &ctm);
  cairo_identity_matrix(cr);
  cairo_path_t *cp = cairo_copy_path(cr);
  cairo_set_matrix(cr, &ctm);
  pp_path *path = pp_path_new();
  if (cp->status == CAIRO_STATUS_SUCCESS) {
    double k = 1.0 / tap.scale;
    for (int i = 0; i < cp->num_data; i += cp->data[i].header.length) {
      cairo_path_data_t *d = &cp->data[i];
      switch (d->header.type) {
      case CAIRO_PATH_MOVE_TO:
        /* cairo adds a move-to after every close-path; it draws nothing. */
        if (path->n_segs > 0 && path->segs[path->n_segs - 1].kind == PP_SEG_CLOSE &&
            (i + d->header.length >= cp->num_data ||
             cp->data[i + d->header.length].header.type == CAIRO_PATH_MOVE_TO))
          break;
        pp_path_move_to(path, d[1].point.x * k, d[1].point.y * k);
        break;
      case CAIRO_PATH_LINE_TO: pp_path_line_to(path, d[1].point.x * k, d[1].point.y * k); break;
      case CAIRO_PATH_CURVE_TO:
        pp_path_curve_to(path, d[1].point.x * k, d[1].point.y * k, d[2].point.x * k,
                         d[2].point.y * k, d[3].point.x * k, d[3].point.y * k);
        break;
      case CAIRO_PATH_CLOSE_PATH: pp_path_close(path); break;
      }
    }
  }
  cairo_path_destroy(cp);
  return path;
}

static double mean_stops(cairo_pattern_t *p, double *r, double *g, double *b, double *a) {
  int n = 0;
  *r = *g = *b = *a = 0;
  if (cairo_pattern_get_color_stop_count(p, &n) != CAIRO_STATUS_SUCCESS || n == 0)
    return 0;
  for (int i = 0; i < n; i++) {
    double off, sr, sg, sb, sa;
    cairo_pattern_get_color_stop_rgba(p, i, &off, &sr, &sg, &sb, &sa);
    *r += sr, *g += sg, *b += sb, *a += sa;
  }
  *r /= n, *g /= n, *b /= n, *a /= n;
  return n;
}

static pp_paint read_paint(cairo_t *cr) {
  pp_paint paint = {PP_PAINT_OTHER, 0, 0, 0, 1};
  cairo_pattern_t *src = cairo_get_source(cr);
  switch (cairo_pattern_get_type(src)) {
  case CAIRO_PATTERN_TYPE_SOLID:
    paint.kind = PP_PAINT_SOLID;
    cairo_pattern_get_rgba(src, &paint.r, &paint.g, &paint.b, &paint.a);
    break;
  case CAIRO_PATTERN_TYPE_LINEAR:
    paint.kind = PP_PAINT_LINEAR;
    mean_stops(src, &paint.r, &paint.g, &paint.b, &paint.a);
    break;
  case CAIRO_PATTERN_TYPE_RADIAL:
    paint.kind = PP_PAINT_RADIAL;
    mean_stops(src, &paint.r, &paint.g, &paint.b, &paint.a);
    break;
  case CAIRO_PATTERN_TYPE_MESH: paint.kind = PP_PAINT_MESH; break;
  case CAIRO_PATTERN_TYPE_SURFACE: paint.kind = PP_PAINT_SURFACE; break;
  default: break;
  }
  return paint;
}

static pp_mark *add_mark(pp_mark_kind kind, pp_path *path) {
  pp_mark *m = g_new0(pp_mark, 1);
  m->kind = kind;
  m->index = tap.scene->marks->len;
  m->path = path;
  m->clip = pp_clip_ref(tap.clip);
  m->group_depth = tap.group_depth;
  m->ink = NAN;
  m->bbox = m->visible_bbox = pp_rect_empty();
  m->line_width = 0;
  g_ptr_array_add(tap.scene->marks, m);
  return m;
}

static void record_fill(cairo_t *cr) {
  pp_path *path = copy_device_path(cr);
  if (path->n_segs == 0) {
    pp_path_free(path);
    return;
  }
  pp_mark *m = add_mark(PP_MARK_FILL, path);
  m->rule =
      cairo_get_fill_rule(cr) == CAIRO_FILL_RULE_EVEN_ODD ? PP_FILL_EVEN_ODD : PP_FILL_NONZERO;
  m->paint = read_paint(cr);
}

static void record_stroke(cairo_t *cr) {
  pp_path *path = copy_device_path(cr);
  if (path->n_segs == 0) {
    pp_path_free(path);
    return;
  }
  pp_mark *m = add_mark(PP_MARK_STROKE, path);
  m->paint = read_paint(cr);
  /* Pen width in user units times the CTM's area scale, back in page points. */
  cairo_matrix_t ctm;
  cairo_get_matrix(cr, &ctm);
  double det = fabs(ctm.xx * ctm.yy - ctm.yx * ctm.xy);
  m->line_width = cairo_get_line_width(cr) * sqrt(det) / tap.scale;
  m->dashed = cairo_get_dash_count(cr) > 0;
}

/* poppler's first clip on a page is the crop box, set under the page's base matrix
 * (PDF user space → device, /Rotate included), so its CTM is the exact way back to PDF
 * user space: measured for /Rotate 0, 90, 180 and 270 (poppler 22.12). */
static void record_base_matrix(cairo_t *cr) {
  cairo_matrix_t m;
  cairo_get_matrix(cr, &m);
  pp_matrix to_page = {m.xx / tap.scale, m.yx / tap.scale, m.xy / tap.scale,
                       m.yy / tap.scale, m.x0 / tap.scale, m.y0 / tap.scale};
  pp_matrix to_pdf;
  if (!pp_matrix_invert(to_page, &to_pdf))
    return;
  tap.scene->to_pdf = to_pdf;
  if (fabs(m.xx) >= fabs(m.yx))
    tap.scene->rotation = m.xx > 0 ? 0 : 180;
  else
    tap.scene->rotation = m.yx > 0 ? 90 : 270;
}

static void record_clip(cairo_t *cr) {
  if (!tap.base_seen) {
    tap.base_seen = TRUE;
    record_base_matrix(cr);
  }
  pp_path *path = copy_device_path(cr);
  pp_fill_rule rule =
      cairo_get_fill_rule(cr) == CAIRO_FILL_RULE_EVEN_ODD ? PP_FILL_EVEN_ODD : PP_FILL_NONZERO;
  pp_clip *next = pp_clip_new(tap.clip, path, rule);
  pp_clip_unref(tap.clip);
  tap.clip = next;
}

/* An image surface painted through a pattern: its placement is the unit image
 * rectangle mapped pattern → user (inverse pattern matrix) → device (CTM). */
static void record_surface_paint(cairo_t *cr, cairo_pattern_t *pattern) {
  cairo_surface_t *surface = NULL;
  if (cairo_pattern_get_surface(pattern, &surface) != CAIRO_STATUS_SUCCESS)
    return;
  if (cairo_surface_get_type(surface) != CAIRO_SURFACE_TYPE_IMAGE) {
    tap.scene->n_groups++; /* a group or tiling cell composited back; its marks are recorded */
    return;
  }
  int w = cairo_image_surface_get_width(surface), h = cairo_image_surface_get_height(surface);
  cairo_matrix_t pm, ctm;
  cairo_pattern_get_matrix(pattern, &pm);
  if (cairo_matrix_invert(&pm) != CAIRO_STATUS_SUCCESS)
    return;
  cairo_get_matrix(cr, &ctm);
  cairo_matrix_t to_dev;
  cairo_matrix_multiply(&to_dev, &pm, &ctm);
  pp_path *path = pp_path_new();
  double corners[4][2] = {{0, 0}, {w, 0}, {w, h}, {0, h}};
  for (int i = 0; i < 4; i++) {
    double x = corners[i][0], y = corners[i][1];
    cairo_matrix_transform_point(&to_dev, &x, &y);
    if (i == 0)
      pp_path_move_to(path, x / tap.scale, y / tap.scale);
    else
      pp_path_line_to(path, x / tap.scale, y / tap.scale);
  }
  pp_path_close(path);
  pp_mark *m = add_mark(PP_MARK_IMAGE, path);
  m->paint = (pp_paint){PP_PAINT_SURFACE, 0, 0, 0, 1};
  m->image_width = w;
  m->image_height = h;
  tap.scene->n_images++;
}

/* A solid or gradient paint fills the current clip: record it as a fill of the
 * innermost clip path, clipped by the rest of the chain. */
static void record_clip_paint(cairo_t *cr, gboolean masked) {
  pp_path *path;
  pp_clip *outer = NULL;
  if (tap.clip) {
    path = pp_path_copy(tap.clip->path);
    outer = tap.clip->parent;
  } else {
    path = pp_path_new();
    pp_path_rectangle(path, 0, 0, tap.scene->width, tap.scene->height);
  }
  pp_mark *m = add_mark(PP_MARK_FILL, path);
  pp_clip_unref(m->clip);
  m->clip = pp_clip_ref(outer);
  m->rule = tap.clip ? tap.clip->rule : PP_FILL_NONZERO;
  m->paint = read_paint(cr);
  m->soft_masked = masked;
}

static void record_paint(cairo_t *cr, gboolean masked) {
  cairo_pattern_t *src = cairo_get_source(cr);
  if (cairo_pattern_get_type(src) == CAIRO_PATTERN_TYPE_SURFACE &&
      cairo_pattern_get_extend(src) == CAIRO_EXTEND_NONE)
    record_surface_paint(cr, src);
  else
    record_clip_paint(cr, masked);
}

static void record_glyphs(cairo_t *cr, const cairo_glyph_t *glyphs, int n) {
  if (n <= 0)
    return;
  cairo_matrix_t ctm, fm;
  cairo_get_matrix(cr, &ctm);
  cairo_get_font_matrix(cr, &fm);
  cairo_matrix_t font_dev;
  cairo_matrix_multiply(&font_dev, &fm, &ctm);
  double size = sqrt(fabs(font_dev.xx * font_dev.yy - font_dev.yx * font_dev.xy)) / tap.scale;
  /* Box from glyph origins and the em square; exact outlines are not needed because
   * text geometry comes from poppler's text API. */
  pp_rect box = pp_rect_empty();
  for (int i = 0; i < n; i++) {
    double x = glyphs[i].x, y = glyphs[i].y;
    cairo_matrix_transform_point(&ctm, &x, &y);
    box = pp_rect_add_point(box, (pp_point){x / tap.scale, y / tap.scale});
  }
  box.y0 -= 0.8 * size;
  box.y1 += 0.2 * size;
  box.x1 += 0.6 * size;
  pp_path *path = pp_path_new();
  pp_path_rectangle(path, box.x0, box.y0, box.x1 - box.x0, box.y1 - box.y0);
  pp_mark *m = add_mark(PP_MARK_GLYPHS, path);
  m->paint = read_paint(cr);
  m->glyph_count = (guint)n;
  m->font_size = size;
}

static void push_state(gboolean is_group) {
  saved_state s = {pp_clip_ref(tap.clip), is_group};
  g_array_append_val(tap.saved, s);
  if (is_group)
    tap.group_depth++;
}

static void pop_state(void) {
  if (tap.saved->len == 0)
    return;
  saved_state s = g_array_index(tap.saved, saved_state, tap.saved->len - 1);
  g_array_set_size(tap.saved, tap.saved->len - 1);
  pp_clip_unref(tap.clip);
  tap.clip = s.clip;
  if (s.is_group && tap.group_depth > 0)
    tap.group_depth--;
}

/* ---- interposed entry points ---- */

void cairo_fill(cairo_t *cr) {
  REAL(cairo_fill);
  if (!tapped(cr))
    return real_cairo_fill(cr);
  record_fill(cr);
  cairo_new_path(cr);
}

void cairo_fill_preserve(cairo_t *cr) {
  REAL(cairo_fill_preserve);
  if (!tapped(cr))
    return real_cairo_fill_preserve(cr);
  record_fill(cr);
}

void cairo_stroke(cairo_t *cr) {
  REAL(cairo_stroke);
  if (!tapped(cr))
    return real_cairo_stroke(cr);
  record_stroke(cr);
  cairo_new_path(cr);
}

void cairo_stroke_preserve(cairo_t *cr) {
  REAL(cairo_stroke_preserve);
  if (!tapped(cr))
    return real_cairo_stroke_preserve(cr);
  record_stroke(cr);
}

void cairo_clip(cairo_t *cr) {
  REAL(cairo_clip);
  if (tapped(cr))
    record_clip(cr);
  real_cairo_clip(cr);
}

void cairo_clip_preserve(cairo_t *cr) {
  REAL(cairo_clip_preserve);
  if (tapped(cr))
    record_clip(cr);
  real_cairo_clip_preserve(cr);
}

void cairo_reset_clip(cairo_t *cr) {
  REAL(cairo_reset_clip);
  if (tapped(cr)) {
    pp_clip_unref(tap.clip);
    tap.clip = NULL;
  }
  real_cairo_reset_clip(cr);
}

void cairo_save(cairo_t *cr) {
  REAL(cairo_save);
  if (tapped(cr))
    push_state(FALSE);
  real_cairo_save(cr);
}

void cairo_restore(cairo_t *cr) {
  REAL(cairo_restore);
  if (tapped(cr))
    pop_state();
  real_cairo_restore(cr);
}

void cairo_push_group(cairo_t *cr) {
  REAL(cairo_push_group);
  if (tapped(cr))
    push_state(TRUE);
  real_cairo_push_group(cr);
}

void cairo_push_group_with_content(cairo_t *cr, cairo_content_t content) {
  REAL(cairo_push_group_with_content);
  if (tapped(cr))
    push_state(TRUE);
  real_cairo_push_group_with_content(cr, content);
}

cairo_pattern_t *cairo_pop_group(cairo_t *cr) {
  REAL(cairo_pop_group);
  if (tapped(cr))
    pop_state();
  return real_cairo_pop_group(cr);
}

void cairo_pop_group_to_source(cairo_t *cr) {
  REAL(cairo_pop_group_to_source);
  if (tapped(cr))
    pop_state();
  real_cairo_pop_group_to_source(cr);
}

void cairo_paint(cairo_t *cr) {
  REAL(cairo_paint);
  if (!tapped(cr))
    return real_cairo_paint(cr);
  record_paint(cr, FALSE);
}

void cairo_paint_with_alpha(cairo_t *cr, double alpha) {
  REAL(cairo_paint_with_alpha);
  if (!tapped(cr))
    return real_cairo_paint_with_alpha(cr, alpha);
  record_paint(cr, alpha < 1.0);
}

void cairo_mask(cairo_t *cr, cairo_pattern_t *pattern) {
  REAL(cairo_mask);
  if (!tapped(cr))
    return real_cairo_mask(cr, pattern);
  record_paint(cr, TRUE);
}

void cairo_mask_surface(cairo_t *cr, cairo_surface_t *surface, double x, double y) {
  REAL(cairo_mask_surface);
  if (!tapped(cr))
    return real_cairo_mask_surface(cr, surface, x, y);
  record_paint(cr, TRUE);
}

void cairo_show_glyphs(cairo_t *cr, const cairo_glyph_t *glyphs, int num_glyphs) {
  REAL(cairo_show_glyphs);
  if (!tapped(cr))
    return real_cairo_show_glyphs(cr, glyphs, num_glyphs);
  record_glyphs(cr, glyphs, num_glyphs);
}

void cairo_show_text_glyphs(cairo_t *cr, const char *utf8, int utf8_len,
                            const cairo_glyph_t *glyphs, int num_glyphs,
                            const cairo_text_cluster_t *clusters, int num_clusters,
                            cairo_text_cluster_flags_t cluster_flags) {
  REAL(cairo_show_text_glyphs);
  if (!tapped(cr))
    return real_cairo_show_text_glyphs(cr, utf8, utf8_len, glyphs, num_glyphs, clusters,
                                       num_clusters, cluster_flags);
  record_glyphs(cr, glyphs, num_glyphs);
}
