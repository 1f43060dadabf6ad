/* text.c — words and lines from poppler's text API, one box per run.
 * poppler's layout rectangles match the UTF-8 characters of poppler_page_get_text()
 * one to one (newlines included), so characters are grouped by walking both together. */
#include <math.h>
#include <string.h>

#include "internal.h"

typedef struct {
  GString *text;
  pp_rect box;
  double font_size;
  const char *font_name;
  pp_point first_centre, last_centre;
  guint n_chars;
  gboolean raised;
} word_builder;

/* fmin and fmax as libm defines them (a NaN loses), without the call: this loop runs for every
 * character of every page. */
static inline double min_num(double a, double b) {
  return isnan(a) ? b : isnan(b) ? a : b < a ? b : a;
}

static inline double max_num(double a, double b) {
  return isnan(a) ? b : isnan(b) ? a : b > a ? b : a;
}

/* pp_rect_union and pp_rect_is_empty (core/rect.c) with the above. */
static inline pp_rect union_rect(pp_rect a, pp_rect b) {
  if (!(a.x0 <= a.x1 && a.y0 <= a.y1))
    return b;
  if (!(b.x0 <= b.x1 && b.y0 <= b.y1))
    return a;
  return (pp_rect){min_num(a.x0, b.x0), min_num(a.y0, b.y0), max_num(a.x1, b.x1),
                   max_num(a.y1, b.y1)};
}

/* g_unichar_isspace, answered for ASCII without its table: tab, line feed, form feed, carriage
 * return and space (GLib's guniprop.c; vertical tab is not a space there). */
static inline gboolean is_space(gunichar c) {
  return c < 0x80 ? c == ' ' || c == '\t' || c == '\n' || c == '\f' || c == '\r'
                  : g_unichar_isspace(c);
}

static inline void append_char(GString *s, gunichar c) {
  if (c < 0x80)
    g_string_append_c(s, (char)c);
  else
    g_string_append_unichar(s, c);
}

static pp_rect to_rect(const PopplerRectangle *r) {
  return (pp_rect){MIN(r->x1, r->x2), MIN(r->y1, r->y2), MAX(r->x1, r->x2), MAX(r->y1, r->y2)};
}

static pp_point centre(pp_rect r) {
  return (pp_point){(r.x0 + r.x1) / 2, (r.y0 + r.y1) / 2};
}

/* Gap between two boxes along whichever axis separates them most. */
static double box_gap(pp_rect a, pp_rect b) {
  double gx = max_num(b.x0 - a.x1, a.x0 - b.x1);
  double gy = max_num(b.y0 - a.y1, a.y0 - b.y1);
  return max_num(gx, gy);
}

static void flush_word(word_builder *wb, pp_scene *scene, guint line) {
  if (wb->n_chars == 0)
    return;
  pp_text_run *run = g_new0(pp_text_run, 1);
  run->text = g_string_free(wb->text, FALSE);
  run->box = wb->box;
  run->font_size = wb->font_size;
  run->font_name = g_strdup(wb->font_name ? wb->font_name : "");
  run->line = line;
  double dx = wb->last_centre.x - wb->first_centre.x, dy = wb->last_centre.y - wb->first_centre.y;
  /* y grows downwards on the page, so reading upwards is a negative dy. */
  /* An exponent is raised on purpose; it does not turn the word. */
  run->angle = wb->n_chars > 1 && !wb->raised ? atan2(-dy, dx) * 180.0 / G_PI : 0.0;
  if (fabs(run->angle) < 1e-9)
    run->angle = 0.0;
  g_ptr_array_add(scene->words, run);
  memset(wb, 0, sizeof *wb);
}

static void flush_line(GString **line_text, pp_rect *line_box, pp_scene *scene) {
  if ((*line_text)->len > 0) {
    pp_text_line *l = g_new0(pp_text_line, 1);
    l->text = g_string_free(*line_text, FALSE);
    l->box = *line_box;
    g_ptr_array_add(scene->lines, l);
  } else {
    g_string_free(*line_text, TRUE);
  }
  *line_text = g_string_new(NULL);
  *line_box = pp_rect_empty();
}

void pp_text_capture(PopplerPage *page, pp_scene *scene) {
  char *text = poppler_page_get_text(page);
  PopplerRectangle *rects = NULL;
  guint n_rects = 0;
  if (!text || !poppler_page_get_text_layout(page, &rects, &n_rects)) {
    g_free(text);
    g_free(rects);
    return;
  }
  GList *attrs = poppler_page_get_text_attributes(page);
  GList *attr = attrs;

  word_builder wb = {0};
  GString *line_text = g_string_new(NULL);
  pp_rect line_box = pp_rect_empty();
  guint i = 0;
  for (const char *p = text; *p && i < n_rects; p = g_utf8_next_char(p), i++) {
    gunichar c = g_utf8_get_char(p);
    while (attr && ((PopplerTextAttributes *)attr->data)->end_index < (int)i)
      attr = attr->next;
    PopplerTextAttributes *a = attr ? attr->data : NULL;
    if (c == '\n' || c == '\r') {
      flush_word(&wb, scene, scene->lines->len);
      flush_line(&line_text, &line_box, scene);
      continue;
    }
    pp_rect r = to_rect(&rects[i]);
    double size = a ? a->font_size : pp_rect_height(r);
    if (is_space(c) && c != 0x202F && c != 0x00A0) {
      flush_word(&wb, scene, scene->lines->len);
      append_char(line_text, c);
      continue;
    }
    /* Same-line characters far apart are separate words even without a space
     * (tick labels laid out on one baseline often come back as one line). */
    if (wb.n_chars > 0 && box_gap(wb.box, r) > 0.6 * max_num(size, 1.0) &&
        box_gap((pp_rect){wb.last_centre.x, wb.last_centre.y, wb.last_centre.x, wb.last_centre.y},
                r) > 0.6 * max_num(size, 1.0)) {
      flush_word(&wb, scene, scene->lines->len);
      g_string_append_c(line_text, ' ');
    }
    /* A smaller glyph raised above the word is an exponent ("10" then a raised "3"
     * on a log axis); mark it so the reading is 10^3, not 103. */
    /* Judged by the bottom edge: Type 3 boxes come from the font bbox and scale with the
     * size, which hides the raise in the centres but not in where the glyph ends. */
    if (wb.n_chars > 0 && size < 0.85 * wb.font_size && r.y1 < wb.box.y1 - 0.15 * wb.font_size &&
        !wb.raised) {
      g_string_append_c(wb.text, '^');
      wb.raised = TRUE;
    }
    if (wb.n_chars == 0) {
      wb.text = g_string_new(NULL);
      wb.box = r;
      wb.font_size = size;
      wb.font_name = a ? a->font_name : NULL;
      wb.first_centre = centre(r);
    } else {
      wb.box = union_rect(wb.box, r);
    }
    wb.last_centre = centre(r);
    append_char(wb.text, c);
    wb.n_chars++;
    append_char(line_text, c);
    line_box = union_rect(line_box, r);
  }
  flush_word(&wb, scene, scene->lines->len);
  flush_line(&line_text, &line_box, scene);
  g_string_free(line_text, TRUE);
  poppler_page_free_text_attributes(attrs);
  g_free(rects);
  g_free(text);
}
