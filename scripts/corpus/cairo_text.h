/* Text helpers for the generators: cairo toy text API with DejaVu Sans,
 * number formatting in several locales' styles, and greedy word wrap. */
#pragma once

#include <cairo.h>
#include <glib.h>

typedef enum {
  PP_GEN_FMT_PLAIN,         /* 1250 */
  PP_GEN_FMT_THOUSANDS,     /* 1,250 */
  PP_GEN_FMT_CURRENCY_M,    /* €1.2m (value already in millions) */
  PP_GEN_FMT_PERCENT,       /* 45% */
  PP_GEN_FMT_DECIMAL_COMMA, /* 2,5 */
} pp_gen_fmt;

void pp_gen_font(cairo_t *cr, double size, gboolean bold);
void pp_gen_format(double v, pp_gen_fmt fmt, int decimals, char *buf, gsize len);
/* ax: fraction of the ink width; ay: fraction of the cap height (0 = left/top). */
void pp_gen_text_at(cairo_t *cr, const char *s, double x, double y, double ax, double ay);
/* y is the top of the first line; returns the top of the line after the last. */
double pp_gen_text_wrap(cairo_t *cr, const char *text, double x, double y, double width,
                        double size, double leading);
