/* gen_dense.c — one-page PDFs of many marks of one kind, for scripts/bench-speed: dense
 * scatters, tilings, hatching, text, one long path, a random-walk polygon, and grids of
 * labelled tiles (a periodic-table or calendar-like page). Invented data, fixed seed.
 *   gen-dense KIND N OUT.pdf [PAGES]   KIND: circles rects strokes glyphs path walk tiles
 * PAGES (default 1) pages of the same kind and size, each drawn from its own seed, so light
 * pages can be timed over several. */
#include <cairo-pdf.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cairo_rng.h"

/* A4 in points; the marks shrink as N grows so every page holds all of them. */
#define PAGE_W 595.0
#define PAGE_H 842.0
#define MARGIN 36.0

/* Cell side of a square grid of n cells inside the page margins. */
static double cell_side(guint n, guint *cols) {
  double w = PAGE_W - 2 * MARGIN, h = PAGE_H - 2 * MARGIN;
  double side = sqrt(w * h / n);
  *cols = (guint)floor(w / side);
  while (*cols > 0 && (guint)floor(h / side) * *cols < n) {
    side *= 0.99;
    *cols = (guint)floor(w / side);
  }
  return side;
}

static void cell_origin(guint i, guint cols, double side, double *x, double *y) {
  *x = MARGIN + (i % cols) * side;
  *y = MARGIN + (i / cols) * side;
}

static void colour(cairo_t *cr, pp_gen_rng *rng) {
  cairo_set_source_rgb(cr, pp_gen_rng_uniform(rng, 0.1, 0.9), pp_gen_rng_uniform(rng, 0.1, 0.9),
                       pp_gen_rng_uniform(rng, 0.1, 0.9));
}

static void draw_circles(cairo_t *cr, pp_gen_rng *rng, guint n) {
  for (guint i = 0; i < n; i++) {
    double x = pp_gen_rng_uniform(rng, MARGIN, PAGE_W - MARGIN);
    double y = pp_gen_rng_uniform(rng, MARGIN, PAGE_H - MARGIN);
    if (i % 64 == 0)
      colour(cr, rng);
    cairo_new_path(cr);
    cairo_arc(cr, x, y, pp_gen_rng_uniform(rng, 0.3, 1.5), 0, 2 * G_PI);
    cairo_fill(cr);
  }
}

static void draw_rects(cairo_t *cr, pp_gen_rng *rng, guint n) {
  guint cols;
  double side = cell_side(n, &cols);
  for (guint i = 0; i < n; i++) {
    double x, y;
    cell_origin(i, cols, side, &x, &y);
    colour(cr, rng);
    cairo_rectangle(cr, x, y, side * 0.9, side * 0.9);
    cairo_fill(cr);
  }
}

static void draw_strokes(cairo_t *cr, pp_gen_rng *rng, guint n) {
  cairo_set_line_width(cr, 0.2);
  for (guint i = 0; i < n; i++) {
    double x = pp_gen_rng_uniform(rng, MARGIN, PAGE_W - MARGIN);
    double y = pp_gen_rng_uniform(rng, MARGIN, PAGE_H - MARGIN);
    if (i % 64 == 0)
      colour(cr, rng);
    cairo_move_to(cr, x, y);
    cairo_line_to(cr, x + pp_gen_rng_uniform(rng, -4, 4), y + pp_gen_rng_uniform(rng, -4, 4));
    cairo_stroke(cr);
  }
}

/* Invented syllables: words that look like prose without being any real text. */
static void make_word(pp_gen_rng *rng, char *buf, int len) {
  static const char *syl[] = {"ka", "lo", "ven", "tri", "mor", "sa", "dul", "ne", "fa", "rin"};
  buf[0] = '\0';
  while ((int)strlen(buf) < len)
    strcat(buf, syl[pp_gen_rng_int(rng, 0, 9)]);
  buf[len] = '\0';
}

static void draw_glyphs(cairo_t *cr, pp_gen_rng *rng, guint n) {
  guint cols;
  double side = cell_side(n, &cols);
  cairo_select_font_face(cr, "DejaVu Sans", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_NORMAL);
  cairo_set_font_size(cr, fmax(side * 0.3, 0.5));
  cairo_set_source_rgb(cr, 0.1, 0.1, 0.1);
  char word[8];
  for (guint i = 0; i < n; i++) {
    double x, y;
    cell_origin(i, cols, side, &x, &y);
    make_word(rng, word, 5);
    cairo_move_to(cr, x, y + side * 0.6);
    cairo_show_text(cr, word);
  }
}

/* One stroked polyline of n segments: a long time series. */
static void draw_path(cairo_t *cr, pp_gen_rng *rng, guint n) {
  double w = PAGE_W - 2 * MARGIN, y = PAGE_H / 2;
  cairo_move_to(cr, MARGIN, y);
  for (guint i = 1; i <= n; i++) {
    y = fmin(fmax(y + pp_gen_rng_uniform(rng, -3, 3), MARGIN), PAGE_H - MARGIN);
    cairo_line_to(cr, MARGIN + w * i / n, y);
  }
  cairo_set_line_width(cr, 0.3);
  cairo_set_source_rgb(cr, 0.1, 0.2, 0.6);
  cairo_stroke(cr);
}

/* One filled polygon of n vertices from a random walk: crosses itself everywhere. */
static void draw_walk(cairo_t *cr, pp_gen_rng *rng, guint n) {
  double x = PAGE_W / 2, y = PAGE_H / 2, step = 200.0 / sqrt(n);
  cairo_move_to(cr, x, y);
  for (guint i = 1; i < n; i++) {
    x = fmin(fmax(x + pp_gen_rng_uniform(rng, -step, step), MARGIN), PAGE_W - MARGIN);
    y = fmin(fmax(y + pp_gen_rng_uniform(rng, -step, step), MARGIN), PAGE_H - MARGIN);
    cairo_line_to(cr, x, y);
  }
  cairo_close_path(cr);
  cairo_set_source_rgb(cr, 0.8, 0.4, 0.1);
  cairo_fill(cr);
}

/* n labelled tiles: a coloured cell with a border, a number, a short word, a name and
 * a decimal, like a periodic table or a calendar. */
static void draw_tiles(cairo_t *cr, pp_gen_rng *rng, guint n) {
  guint cols;
  double side = cell_side(n, &cols);
  cairo_select_font_face(cr, "DejaVu Sans", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_NORMAL);
  char word[12], text[32];
  for (guint i = 0; i < n; i++) {
    double x, y, s = side * 0.94;
    cell_origin(i, cols, side, &x, &y);
    colour(cr, rng);
    cairo_rectangle(cr, x, y, s, s);
    cairo_fill_preserve(cr);
    cairo_set_source_rgb(cr, 0.2, 0.2, 0.2);
    cairo_set_line_width(cr, 0.3);
    cairo_stroke(cr);
    cairo_set_font_size(cr, s * 0.16);
    snprintf(text, sizeof text, "%u", i + 1);
    cairo_move_to(cr, x + s * 0.06, y + s * 0.2);
    cairo_show_text(cr, text);
    cairo_set_font_size(cr, s * 0.3);
    make_word(rng, word, 2);
    word[0] = (char)(word[0] - 'a' + 'A');
    cairo_move_to(cr, x + s * 0.2, y + s * 0.55);
    cairo_show_text(cr, word);
    cairo_set_font_size(cr, s * 0.11);
    make_word(rng, word, 8);
    cairo_move_to(cr, x + s * 0.06, y + s * 0.75);
    cairo_show_text(cr, word);
    snprintf(text, sizeof text, "%.3f", pp_gen_rng_uniform(rng, 1, 300));
    cairo_move_to(cr, x + s * 0.06, y + s * 0.92);
    cairo_show_text(cr, text);
  }
}

int main(int argc, char **argv) {
  if (argc != 4 && argc != 5) {
    fprintf(stderr, "usage: gen-dense KIND N OUT.pdf [PAGES]\n");
    return 2;
  }
  const char *kind = argv[1];
  long n = strtol(argv[2], NULL, 10);
  long pages = argc == 5 ? strtol(argv[4], NULL, 10) : 1;
  if (n <= 0 || pages <= 0) {
    fprintf(stderr, "gen-dense: N and PAGES must be positive\n");
    return 2;
  }
  cairo_surface_t *surface = cairo_pdf_surface_create(argv[3], PAGE_W, PAGE_H);
  cairo_t *cr = cairo_create(surface);
  pp_gen_rng rng;
  static const struct {
    const char *name;
    void (*draw)(cairo_t *, pp_gen_rng *, guint);
  } kinds[] = {{"circles", draw_circles}, {"rects", draw_rects}, {"strokes", draw_strokes},
               {"glyphs", draw_glyphs},   {"path", draw_path},   {"walk", draw_walk},
               {"tiles", draw_tiles}};
  gboolean found = FALSE;
  for (long p = 0; p < pages; p++) {
    pp_gen_rng_init(&rng, 12 + (guint64)p);
    for (size_t i = 0; i < G_N_ELEMENTS(kinds); i++)
      if (strcmp(kind, kinds[i].name) == 0) {
        kinds[i].draw(cr, &rng, (guint)n);
        found = TRUE;
      }
    cairo_show_page(cr);
  }
  cairo_destroy(cr);
  cairo_surface_finish(surface);
  cairo_status_t status = cairo_surface_status(surface);
  cairo_surface_destroy(surface);
  if (!found) {
    fprintf(stderr, "gen-dense: unknown kind %s\n", kind);
    return 2;
  }
  if (status != CAIRO_STATUS_SUCCESS) {
    fprintf(stderr, "gen-dense: %s\n", cairo_status_to_string(status));
    return 1;
  }
  return 0;
}
