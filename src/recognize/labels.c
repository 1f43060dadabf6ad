/* labels.c — numeric phrases from the page's words. Tick labels are often split by
 * poppler at spaces ("30 000", "€ 1.2 bn"), so neighbouring words on one baseline are
 * tried together before alone. */
#include <math.h>
#include <string.h>

#include "internal.h"

/* Words of one number share a baseline within this share of the text height, and are
 * closer than PP_JOIN_GAP of it, overlapping by at most PP_JOIN_OVERLAP (a word space;
 * common practice, no source). */
#define PP_BASELINE_TOL 0.25
#define PP_JOIN_GAP 0.6
#define PP_JOIN_OVERLAP 0.1
/* A minus drawn as a bar: thicker than PP_MINUS_MIN_THICK pt and thinner than a tenth
 * of the text height, between 0.15 and 0.6 of it wide, at most 0.3 of it left of the
 * digits (overlapping by at most PP_MINUS_OVERLAP pt), its middle between 0.3 and 0.8 of
 * the height from the top: the proportions of a minus sign in text fonts (from memory,
 * no source). */
#define PP_MINUS_MIN_THICK 0.05
#define PP_MINUS_MAX_THICK 0.1
#define PP_MINUS_MIN_WIDTH 0.15
#define PP_MINUS_MAX_WIDTH 0.6
#define PP_MINUS_OVERLAP 0.5
#define PP_MINUS_MAX_GAP 0.3
#define PP_MINUS_LOW 0.3
#define PP_MINUS_HIGH 0.8

static void label_free(gpointer p) {
  pp_label *l = p;
  g_free(l->text);
  g_free(l);
}

static void add_label(GPtrArray *out, const char *text, pp_rect box, double size, double angle,
                      const pp_number_reading *reading) {
  pp_label *l = g_new0(pp_label, 1);
  l->text = g_strdup(text);
  l->box = box;
  l->centre = (pp_point){(box.x0 + box.x1) / 2, (box.y0 + box.y1) / 2};
  l->size = size > 0 ? size : pp_rect_height(box);
  l->angle = angle;
  l->reading = *reading;
  pp_number_reading_alone(reading, &l->number);
  l->index = out->len;
  g_ptr_array_add(out, l);
}

/* The separator between two words of one number: none when the second continues a digit
 * group after a grouping mark ("8," then "000": TeX's kerning reaches the text API as a
 * space), else a space, so "(1," "2)" stays a pair and never becomes −1,2. */
static const char *joiner(const char *prev, const char *next) {
  size_t n = strlen(prev);
  gboolean mark_end = n > 0 && strchr(",.'", prev[n - 1]) != NULL;
  gboolean quote_end = n >= 3 && strcmp(prev + n - 3, "\u2019") == 0;
  size_t digits = strspn(next, "0123456789");
  return (mark_end || quote_end) && n >= 2 && g_ascii_isdigit(prev[n - (quote_end ? 4 : 2)]) &&
                 digits == 3
             ? ""
             : " ";
}

static gboolean same_baseline(const pp_text_run *a, const pp_text_run *b) {
  double h = fmax(pp_rect_height(a->box), 1.0);
  return a->line == b->line && fabs(a->box.y1 - b->box.y1) < PP_BASELINE_TOL * h &&
         b->box.x0 - a->box.x1 < PP_JOIN_GAP * h && b->box.x0 - a->box.x1 > -PP_JOIN_OVERLAP * h &&
         a->angle == 0 && b->angle == 0;
}

/* A minus sign drawn as a filled bar just left of the digits: matplotlib's Type 3
 * fonts draw U+2212 as a path, so the text API never sees it (capture notes §7).
 * Thin (under a tenth of the text height), about a digit wide, at mid-height. */
typedef struct {
  guint mark;
  pp_rect r;
} rect_fill;

/* The page's rectangular fills in paint order, found once per page rather than once per
 * label (a page of labelled tiles has as many labels as fills). */
static GArray *rect_fills(const pp_scene *scene) {
  GArray *out = g_array_new(FALSE, FALSE, sizeof(rect_fill));
  for (guint i = 0; i < scene->marks->len; i++) {
    const pp_mark *m = g_ptr_array_index(scene->marks, i);
    rect_fill f = {i, pp_rect_empty()};
    if (m->kind == PP_MARK_FILL && pp_path_is_rectangle(m->path, PP_RECT_TOL, &f.r))
      g_array_append_val(out, f);
  }
  return out;
}

/* The page's rectangle fills by right edge, so that a label looks only at the fills
 * ending where its minus could (a page of a thousand labelled tiles has thousands of
 * labels and fills). */
typedef struct {
  GArray *fills;      /* rect_fill */
  pp_coord_index *x1; /* fills by r.x1 */
  GArray *near;       /* guint: scratch */
} minus_lookup;

/* A margin around the right-edge search, pt: far above a double's spacing at page
 * coordinates, so rounding never leaves out a fill the exact test would take. */
#define PP_MINUS_SEARCH_SLACK 1e-6

/* The first fill in page order drawn as this label's minus sign, or -1. */
static gint find_path_minus(minus_lookup *ml, const pp_label *l) {
  double h = pp_rect_height(l->box);
  /* the gap test bounds the right edge: l.x0 - PP_MINUS_MAX_GAP h < x1 < l.x0 + overlap */
  g_array_set_size(ml->near, 0);
  pp_coord_index_range(ml->x1, l->box.x0 - PP_MINUS_MAX_GAP * h - PP_MINUS_SEARCH_SLACK,
                       l->box.x0 + PP_MINUS_OVERLAP + PP_MINUS_SEARCH_SLACK, ml->near);
  guint best = G_MAXUINT;
  for (guint k = 0; k < ml->near->len; k++) {
    guint i = g_array_index(ml->near, guint, k);
    if (i >= best)
      continue;
    pp_rect r = g_array_index(ml->fills, rect_fill, i).r;
    double w = pp_rect_width(r), t = pp_rect_height(r), cy = (r.y0 + r.y1) / 2;
    double gap = l->box.x0 - r.x1;
    if (t > PP_MINUS_MIN_THICK && t < PP_MINUS_MAX_THICK * h && w > PP_MINUS_MIN_WIDTH * h &&
        w < PP_MINUS_MAX_WIDTH * h && gap > -PP_MINUS_OVERLAP && gap < PP_MINUS_MAX_GAP * h &&
        cy > l->box.y0 + PP_MINUS_LOW * h && cy < l->box.y0 + PP_MINUS_HIGH * h)
      best = i;
  }
  return best == G_MAXUINT ? -1 : (gint)g_array_index(ml->fills, rect_fill, best).mark;
}

static void recover_minus_signs(const pp_scene *scene, GPtrArray *labels, GHashTable *glyph_marks) {
  minus_lookup ml = {NULL, NULL, NULL};
  for (guint k = 0; k < labels->len; k++) {
    pp_label *l = g_ptr_array_index(labels, k);
    if (!g_ascii_isdigit(l->text[0]) || l->number.value <= 0 || l->angle != 0)
      continue;
    if (!ml.fills) {
      ml.fills = rect_fills(scene);
      g_autofree double *x1 = g_new(double, MAX(ml.fills->len, 1));
      for (guint i = 0; i < ml.fills->len; i++)
        x1[i] = g_array_index(ml.fills, rect_fill, i).r.x1;
      ml.x1 = pp_coord_index_new(x1, ml.fills->len);
      ml.near = g_array_new(FALSE, FALSE, sizeof(guint));
    }
    gint mark = find_path_minus(&ml, l);
    if (mark < 0)
      continue;
    const pp_mark *m = g_ptr_array_index(scene->marks, (guint)mark);
    char *text = g_strconcat("\u2212", l->text, NULL);
    g_free(l->text);
    l->text = text;
    l->number.value = -l->number.value;
    pp_number_read(l->text, &l->reading); /* the signed text, as an axis reads it */
    l->box = pp_rect_union(l->box, m->bbox);
    l->centre = (pp_point){(l->box.x0 + l->box.x1) / 2, (l->box.y0 + l->box.y1) / 2};
    g_hash_table_add(glyph_marks, GUINT_TO_POINTER((guint)mark));
  }
  if (ml.fills) {
    g_array_unref(ml.fills);
    pp_coord_index_free(ml.x1);
    g_array_unref(ml.near);
  }
}

GPtrArray *pp_labels_collect(const pp_scene *scene, GHashTable *glyph_marks) {
  GPtrArray *out = g_ptr_array_new_with_free_func(label_free);
  guint n = scene->words->len;
  /* Every number in number.c's grammar holds an ASCII digit: a phrase without one is not
   * parsed (most words of a text page), which spares the parser's unit search. */
  gboolean *digit = g_new(gboolean, MAX(n, 1));
  for (guint i = 0; i < n; i++)
    digit[i] = strpbrk(((const pp_text_run *)g_ptr_array_index(scene->words, i))->text,
                       "0123456789") != NULL;
  GString *phrase = g_string_new(NULL);
  for (guint i = 0; i < n;) {
    /* Longest run of up to four words on one baseline that parses as one number. */
    guint len = 1;
    gboolean any_digit = digit[i];
    while (len < 4 && i + len < n &&
           same_baseline(g_ptr_array_index(scene->words, i + len - 1),
                         g_ptr_array_index(scene->words, i + len))) {
      any_digit = any_digit || digit[i + len];
      len++;
    }
    if (!any_digit) {
      i++;
      continue;
    }
    guint best = 0;
    gsize best_len = 0;
    pp_number_reading best_reading;
    gboolean has_digit = FALSE;
    g_string_truncate(phrase, 0);
    for (guint k = 0; k < len; k++) {
      const pp_text_run *w = g_ptr_array_index(scene->words, i + k);
      if (k > 0)
        g_string_append(phrase, joiner(phrase->str, w->text));
      g_string_append(phrase, w->text);
      has_digit = has_digit || digit[i + k];
      pp_number_reading reading;
      if (has_digit && pp_number_read(phrase->str, &reading)) {
        best = k + 1;
        best_len = phrase->len;
        best_reading = reading;
      }
    }
    if (best == 0) {
      i++;
      continue;
    }
    const pp_text_run *first = g_ptr_array_index(scene->words, i);
    pp_rect box = pp_rect_empty();
    for (guint k = 0; k < best; k++)
      box = pp_rect_union(box, ((const pp_text_run *)g_ptr_array_index(scene->words, i + k))->box);
    /* the label's text is the phrase as it stood when it last parsed */
    g_string_truncate(phrase, best_len);
    add_label(out, phrase->str, box, first->font_size, first->angle, &best_reading);
    i += best;
  }
  g_string_free(phrase, TRUE);
  g_free(digit);
  recover_minus_signs(scene, out, glyph_marks);
  return out;
}
