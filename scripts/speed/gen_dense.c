/* gen_dense.c — PDFs of many marks of one kind per page, for scripts/bench-speed: dense
 * scatters, tilings, hatching, text, one long path, a random-walk polygon, and grids of
 * labelled tiles (a periodic-table or calendar-like page). Invented data, fixed seeds.
 * The PDF is written directly (ISO 32000-1 §7.5 file structure, §8.5 path operators,
 * §9.4 text objects, the standard Helvetica font): cairo's PDF surface slows down
 * beyond about 50,000 fills, and the benchmark needs a million.
 *   gen-dense KIND N OUT.pdf [PAGES]   KIND: circles rects strokes glyphs path walk tiles
 * PAGES (default 1) pages of the same kind and size, each from its own seed. */
#include <glib.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <zlib.h>

#include "cairo_rng.h"

/* A4 in points; the marks shrink as N grows so every page holds all of them. */
#define PAGE_W 595.0
#define PAGE_H 842.0
#define MARGIN 36.0
/* Bézier control distance for a quarter circle of radius 1 (4(√2−1)/3). */
#define KAPPA 0.5522847498

/* Cell side of a grid of n square cells inside the page margins; *cols per row. */
static double cell_side(guint n, guint *cols) {
  double w = PAGE_W - 2 * MARGIN, h = PAGE_H - 2 * MARGIN;
  double side = sqrt(w * h / n);
  *cols = (guint)floor(w / side);
  while (*cols == 0 || (guint)floor(h / side) * *cols < n) {
    side *= 0.99;
    *cols = (guint)floor(w / side);
  }
  return side;
}

/* Top-left corner of cell i, in PDF space (y up): y is the cell's top edge. */
static void cell_origin(guint i, guint cols, double side, double *x, double *y) {
  *x = MARGIN + (i % cols) * side;
  *y = PAGE_H - MARGIN - (i / cols) * side;
}

static void fill_colour(GString *s, pp_gen_rng *rng) {
  g_string_append_printf(s, "%.3f %.3f %.3f rg\n", pp_gen_rng_uniform(rng, 0.1, 0.9),
                         pp_gen_rng_uniform(rng, 0.1, 0.9), pp_gen_rng_uniform(rng, 0.1, 0.9));
}

static void draw_circles(GString *s, pp_gen_rng *rng, guint n) {
  for (guint i = 0; i < n; i++) {
    double x = pp_gen_rng_uniform(rng, MARGIN, PAGE_W - MARGIN);
    double y = pp_gen_rng_uniform(rng, MARGIN, PAGE_H - MARGIN);
    double r = pp_gen_rng_uniform(rng, 0.3, 1.5), k = KAPPA * r;
    if (i % 64 == 0)
      fill_colour(s, rng);
    g_string_append_printf(s,
                           "%.2f %.2f m %.2f %.2f %.2f %.2f %.2f %.2f c %.2f %.2f %.2f %.2f %.2f "
                           "%.2f c %.2f %.2f %.2f %.2f %.2f %.2f c %.2f %.2f %.2f %.2f %.2f %.2f "
                           "c f\n",
                           x + r, y, x + r, y + k, x + k, y + r, x, y + r, x - k, y + r, x - r,
                           y + k, x - r, y, x - r, y - k, x - k, y - r, x, y - r, x + k, y - r,
                           x + r, y - k, x + r, y);
  }
}

static void draw_rects(GString *s, pp_gen_rng *rng, guint n) {
  guint cols;
  double side = cell_side(n, &cols);
  for (guint i = 0; i < n; i++) {
    double x, y;
    cell_origin(i, cols, side, &x, &y);
    fill_colour(s, rng);
    g_string_append_printf(s, "%.2f %.2f %.2f %.2f re f\n", x, y - side * 0.9, side * 0.9,
                           side * 0.9);
  }
}

static void draw_strokes(GString *s, pp_gen_rng *rng, guint n) {
  g_string_append(s, "0.2 w\n");
  for (guint i = 0; i < n; i++) {
    double x = pp_gen_rng_uniform(rng, MARGIN, PAGE_W - MARGIN);
    double y = pp_gen_rng_uniform(rng, MARGIN, PAGE_H - MARGIN);
    if (i % 64 == 0)
      g_string_append_printf(s, "%.3f %.3f %.3f RG\n", pp_gen_rng_uniform(rng, 0.1, 0.9),
                             pp_gen_rng_uniform(rng, 0.1, 0.9), pp_gen_rng_uniform(rng, 0.1, 0.9));
    g_string_append_printf(s, "%.2f %.2f m %.2f %.2f l S\n", x, y,
                           x + pp_gen_rng_uniform(rng, -4, 4), y + pp_gen_rng_uniform(rng, -4, 4));
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

static void show_text(GString *s, double size, double x, double y, const char *text) {
  g_string_append_printf(s, "BT /F1 %.2f Tf %.2f %.2f Td (%s) Tj ET\n", size, x, y, text);
}

static void draw_glyphs(GString *s, pp_gen_rng *rng, guint n) {
  guint cols;
  double side = cell_side(n, &cols);
  char word[8];
  g_string_append(s, "0.1 0.1 0.1 rg\n");
  for (guint i = 0; i < n; i++) {
    double x, y;
    cell_origin(i, cols, side, &x, &y);
    make_word(rng, word, 5);
    show_text(s, fmax(side * 0.3, 0.5), x, y - side * 0.6, word);
  }
}

/* One stroked polyline of n segments: a long time series. */
static void draw_path(GString *s, pp_gen_rng *rng, guint n) {
  double w = PAGE_W - 2 * MARGIN, y = PAGE_H / 2;
  g_string_append_printf(s, "0.3 w 0.1 0.2 0.6 RG\n%.2f %.2f m\n", MARGIN, y);
  for (guint i = 1; i <= n; i++) {
    y = fmin(fmax(y + pp_gen_rng_uniform(rng, -3, 3), MARGIN), PAGE_H - MARGIN);
    g_string_append_printf(s, "%.3f %.2f l\n", MARGIN + w * i / n, y);
  }
  g_string_append(s, "S\n");
}

/* One filled polygon of n vertices from a random walk: crosses itself everywhere. */
static void draw_walk(GString *s, pp_gen_rng *rng, guint n) {
  double x = PAGE_W / 2, y = PAGE_H / 2, step = 200.0 / sqrt(n);
  g_string_append_printf(s, "0.8 0.4 0.1 rg\n%.2f %.2f m\n", x, y);
  for (guint i = 1; i < n; i++) {
    x = fmin(fmax(x + pp_gen_rng_uniform(rng, -step, step), MARGIN), PAGE_W - MARGIN);
    y = fmin(fmax(y + pp_gen_rng_uniform(rng, -step, step), MARGIN), PAGE_H - MARGIN);
    g_string_append_printf(s, "%.3f %.3f l\n", x, y);
  }
  g_string_append(s, "h f\n");
}

/* n labelled tiles: a coloured cell with a border, a number, a short word, a name and
 * a decimal, like a periodic table or a calendar. */
static void draw_tiles(GString *s, pp_gen_rng *rng, guint n) {
  guint cols;
  double side = cell_side(n, &cols);
  char word[12], text[32];
  g_string_append(s, "0.3 w 0.2 0.2 0.2 RG\n");
  for (guint i = 0; i < n; i++) {
    double x, y, t = side * 0.94;
    cell_origin(i, cols, side, &x, &y);
    fill_colour(s, rng);
    g_string_append_printf(s, "%.2f %.2f %.2f %.2f re B\n0.1 0.1 0.1 rg\n", x, y - t, t, t);
    snprintf(text, sizeof text, "%u", i + 1);
    show_text(s, t * 0.16, x + t * 0.06, y - t * 0.2, text);
    make_word(rng, word, 2);
    word[0] = (char)(word[0] - 'a' + 'A');
    show_text(s, t * 0.3, x + t * 0.2, y - t * 0.55, word);
    make_word(rng, word, 8);
    show_text(s, t * 0.11, x + t * 0.06, y - t * 0.75, word);
    snprintf(text, sizeof text, "%.3f", pp_gen_rng_uniform(rng, 1, 300));
    show_text(s, t * 0.11, x + t * 0.06, y - t * 0.92, text);
  }
}

static void free_stream(gpointer s) {
  g_string_free(s, TRUE);
}

/* Objects: 1 catalog, 2 page tree, 3 font, then a page and its content per page. */
static gboolean write_pdf(const char *path, GPtrArray *streams) {
  FILE *f = fopen(path, "wb");
  if (!f)
    return FALSE;
  guint n_obj = 3 + 2 * streams->len;
  long *offset = g_new0(long, n_obj + 1);
  fputs("%PDF-1.5\n%\xe2\xe3\xcf\xd3\n", f);
  offset[1] = ftell(f);
  fputs("1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj\n", f);
  offset[2] = ftell(f);
  fputs("2 0 obj << /Type /Pages /Kids [", f);
  for (guint p = 0; p < streams->len; p++)
    fprintf(f, " %u 0 R", 4 + 2 * p);
  fprintf(f, " ] /Count %u >> endobj\n", streams->len);
  offset[3] = ftell(f);
  fputs("3 0 obj << /Type /Font /Subtype /Type1 /BaseFont /Helvetica "
        "/Encoding /WinAnsiEncoding >> endobj\n",
        f);
  for (guint p = 0; p < streams->len; p++) {
    GString *s = g_ptr_array_index(streams, p);
    uLongf len = compressBound(s->len);
    Bytef *z = g_malloc(len);
    if (compress2(z, &len, (const Bytef *)s->str, s->len, 1) != Z_OK) {
      g_free(z);
      fclose(f);
      return FALSE;
    }
    offset[4 + 2 * p] = ftell(f);
    fprintf(f,
            "%u 0 obj << /Type /Page /Parent 2 0 R /MediaBox [0 0 %g %g] /Contents %u 0 R "
            "/Resources << /Font << /F1 3 0 R >> >> >> endobj\n",
            4 + 2 * p, PAGE_W, PAGE_H, 5 + 2 * p);
    offset[5 + 2 * p] = ftell(f);
    fprintf(f, "%u 0 obj << /Length %lu /Filter /FlateDecode >> stream\n", 5 + 2 * p,
            (unsigned long)len);
    fwrite(z, 1, len, f);
    fputs("\nendstream endobj\n", f);
    g_free(z);
  }
  long xref = ftell(f);
  fprintf(f, "xref\n0 %u\n0000000000 65535 f \n", n_obj + 1);
  for (guint i = 1; i <= n_obj; i++)
    fprintf(f, "%010ld 00000 n \n", offset[i]);
  fprintf(f, "trailer << /Size %u /Root 1 0 R >>\nstartxref\n%ld\n%%%%EOF\n", n_obj + 1, xref);
  g_free(offset);
  return fclose(f) == 0;
}

int main(int argc, char **argv) {
  if (argc != 4 && argc != 5) {
    fprintf(stderr, "usage: gen-dense KIND N OUT.pdf [PAGES]\n");
    return 2;
  }
  long n = strtol(argv[2], NULL, 10);
  long pages = argc == 5 ? strtol(argv[4], NULL, 10) : 1;
  if (n <= 0 || pages <= 0) {
    fprintf(stderr, "gen-dense: N and PAGES must be positive\n");
    return 2;
  }
  static const struct {
    const char *name;
    void (*draw)(GString *, pp_gen_rng *, guint);
  } kinds[] = {{"circles", draw_circles}, {"rects", draw_rects}, {"strokes", draw_strokes},
               {"glyphs", draw_glyphs},   {"path", draw_path},   {"walk", draw_walk},
               {"tiles", draw_tiles}};
  void (*draw)(GString *, pp_gen_rng *, guint) = NULL;
  for (size_t i = 0; i < G_N_ELEMENTS(kinds); i++)
    if (strcmp(argv[1], kinds[i].name) == 0)
      draw = kinds[i].draw;
  if (!draw) {
    fprintf(stderr, "gen-dense: unknown kind %s\n", argv[1]);
    return 2;
  }
  GPtrArray *streams = g_ptr_array_new_with_free_func(free_stream);
  for (long p = 0; p < pages; p++) {
    pp_gen_rng rng;
    pp_gen_rng_init(&rng, 12 + (guint64)p);
    GString *s = g_string_new(NULL);
    draw(s, &rng, (guint)n);
    g_ptr_array_add(streams, s);
  }
  gboolean ok = write_pdf(argv[3], streams);
  g_ptr_array_unref(streams);
  if (!ok) {
    fprintf(stderr, "gen-dense: cannot write %s\n", argv[3]);
    return 1;
  }
  return 0;
}
