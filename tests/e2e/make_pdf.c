/* make_pdf.c — writes the e2e test document with cairo's PDF surface (an external
 * producer, not plotproof): page 1 a small column chart for the invented "Quillmere
 * Textiles", page 2 text only. Prints the rectangles it filled as JSON on stdout. */
#include <cairo-pdf.h>
#include <stdio.h>

/* Invented revenue figures (scenario only, no real data). Zero-based axis: honest. */
static const double values[] = {40, 55, 70};
static const char *years[] = {"2021", "2022", "2023"};

int main(int argc, char **argv) {
  if (argc != 2) {
    fprintf(stderr, "usage: make_pdf OUT.pdf\n");
    return 2;
  }
  const double w = 400, h = 300, base_y = 250, scale = 2.5; /* 1 value unit = 2.5 pt */
  cairo_surface_t *s = cairo_pdf_surface_create(argv[1], w, h);
  cairo_t *cr = cairo_create(s);
  cairo_select_font_face(cr, "DejaVu Sans", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_NORMAL);
  cairo_set_font_size(cr, 12);
  cairo_move_to(cr, 60, 30);
  cairo_show_text(cr, "Revenue");
  printf("{\"rects\": [");
  for (int i = 0; i < 3; i++) {
    double x = 80 + i * 90, bw = 50, bh = values[i] * scale;
    cairo_set_source_rgb(cr, 0.2, 0.4, 0.7);
    cairo_rectangle(cr, x, base_y - bh, bw, bh);
    cairo_fill(cr);
    printf("%s[%g, %g, %g, %g]", i ? ", " : "", x, base_y - bh, x + bw, base_y);
    cairo_set_source_rgb(cr, 0, 0, 0);
    cairo_move_to(cr, x + 10, base_y + 15);
    cairo_show_text(cr, years[i]);
  }
  printf("], \"words\": [\"Revenue\", \"2021\", \"2022\", \"2023\"], \"pages\": 2}\n");
  /* Value axis with ticks 0, 20, ..., 80 */
  cairo_set_line_width(cr, 1);
  cairo_move_to(cr, 70, base_y);
  cairo_line_to(cr, 70, base_y - 80 * scale);
  cairo_stroke(cr);
  for (int v = 0; v <= 80; v += 20) {
    char label[8];
    snprintf(label, sizeof label, "%d", v);
    cairo_move_to(cr, 45, base_y - v * scale + 4);
    cairo_show_text(cr, label);
  }
  cairo_show_page(cr);
  cairo_move_to(cr, 60, 60);
  cairo_show_text(cr, "Appendix: notes to the invented accounts.");
  cairo_show_page(cr);
  cairo_destroy(cr);
  cairo_surface_finish(s);
  int bad = cairo_surface_status(s) != CAIRO_STATUS_SUCCESS;
  cairo_surface_destroy(s);
  return bad;
}
