/* make_pdf.c — writes the e2e test document with cairo's PDF surface (an external
 * producer, not plotproof): page 1 a small column chart for the invented "Quillmere
 * Textiles", page 2 text only. With --truncated the value axis starts at 30 instead of
 * 0 and the columns are drawn from there (misleading). Prints the rectangles it filled
 * and the axis start as JSON on stdout. */
#include <cairo-pdf.h>
#include <stdio.h>
#include <string.h>

/* Invented revenue figures (scenario only, no real data). */
static const double values[] = {40, 55, 70};
static const char *years[] = {"2021", "2022", "2023"};

int main(int argc, char **argv) {
  if (argc < 2 || argc > 3 || (argc == 3 && strcmp(argv[2], "--truncated") != 0)) {
    fprintf(stderr, "usage: make_pdf OUT.pdf [--truncated]\n");
    return 2;
  }
  int truncated = argc == 3;
  /* Honest: axis 0–80, 1 value unit = 2.5 pt. Truncated: axis 30–80, 1 unit = 4 pt. */
  const double w = 400, h = 300, base_y = 250, scale = truncated ? 4 : 2.5;
  const double from = truncated ? 30 : 0, step = truncated ? 10 : 20;
  cairo_surface_t *s = cairo_pdf_surface_create(argv[1], w, h);
  cairo_t *cr = cairo_create(s);
  cairo_select_font_face(cr, "DejaVu Sans", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_NORMAL);
  cairo_set_font_size(cr, 12);
  cairo_move_to(cr, 60, 30);
  cairo_show_text(cr, "Revenue");
  printf("{\"rects\": [");
  for (int i = 0; i < 3; i++) {
    double x = 80 + i * 90, bw = 50, bh = (values[i] - from) * scale;
    cairo_set_source_rgb(cr, 0.2, 0.4, 0.7);
    cairo_rectangle(cr, x, base_y - bh, bw, bh);
    cairo_fill(cr);
    printf("%s[%g, %g, %g, %g]", i ? ", " : "", x, base_y - bh, x + bw, base_y);
    cairo_set_source_rgb(cr, 0, 0, 0);
    cairo_move_to(cr, x + 10, base_y + 15);
    cairo_show_text(cr, years[i]);
  }
  printf("], \"values\": [40, 55, 70], \"axis_from\": %g, "
         "\"words\": [\"Revenue\", \"2021\", \"2022\", \"2023\"], \"pages\": 2}\n",
         from);
  /* Value axis with ticks from `from` to 80 */
  cairo_set_line_width(cr, 1);
  cairo_move_to(cr, 70, base_y);
  cairo_line_to(cr, 70, base_y - (80 - from) * scale);
  cairo_stroke(cr);
  for (double v = from; v <= 80; v += step) {
    char label[32];
    double y = base_y - (v - from) * scale;
    cairo_move_to(cr, 66, y); /* a tick mark, so the label's position is exact */
    cairo_line_to(cr, 70, y);
    cairo_stroke(cr);
    snprintf(label, sizeof label, "%g", v);
    cairo_move_to(cr, 45, y + 4);
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
