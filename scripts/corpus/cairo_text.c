/* Text helpers: toy text API (no pango needed; cairo embeds DejaVu Sans
 * subsets that poppler extracts back), number formats, word wrap. */
#include "cairo_text.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

void pp_gen_font(cairo_t *cr, double size, gboolean bold) {
  cairo_select_font_face(cr, "DejaVu Sans", CAIRO_FONT_SLANT_NORMAL,
                         bold ? CAIRO_FONT_WEIGHT_BOLD : CAIRO_FONT_WEIGHT_NORMAL);
  cairo_set_font_size(cr, size);
}

/* Groups the integer part in threes with sep; decimals use dec. */
static void format_grouped(double v, int decimals, char sep, char dec, char *buf, gsize len) {
  char raw[64];
  g_snprintf(raw, sizeof raw, "%.*f", decimals, fabs(v));
  char *dot = strchr(raw, '.');
  gsize int_len = dot ? (gsize)(dot - raw) : strlen(raw);
  GString *out = g_string_new(v < 0 && fabs(v) >= 0.5 * pow(10, -decimals) ? "-" : "");
  for (gsize i = 0; i < int_len; i++) {
    if (sep && i > 0 && (int_len - i) % 3 == 0)
      g_string_append_c(out, sep);
    g_string_append_c(out, raw[i]);
  }
  if (dot) {
    g_string_append_c(out, dec);
    g_string_append(out, dot + 1);
  }
  g_strlcpy(buf, out->str, len);
  g_string_free(out, TRUE);
}

void pp_gen_format(double v, pp_gen_fmt fmt, int decimals, char *buf, gsize len) {
  char tmp[64];
  switch (fmt) {
  case PP_GEN_FMT_THOUSANDS: format_grouped(v, decimals, ',', '.', buf, len); break;
  case PP_GEN_FMT_CURRENCY_M:
    format_grouped(v, decimals, ',', '.', tmp, sizeof tmp);
    g_snprintf(buf, len, "€%sm", tmp);
    break;
  case PP_GEN_FMT_PERCENT:
    format_grouped(v, decimals, 0, '.', tmp, sizeof tmp);
    g_snprintf(buf, len, "%s%%", tmp);
    break;
  case PP_GEN_FMT_DECIMAL_COMMA:
    /* Continental style (CLDR de/nb/fr use ',' as decimal separator). */
    format_grouped(v, decimals, 0, ',', buf, len);
    break;
  case PP_GEN_FMT_PLAIN:
  default: format_grouped(v, decimals, 0, '.', buf, len); break;
  }
}

void pp_gen_text_at(cairo_t *cr, const char *s, double x, double y, double ax, double ay) {
  /* Vertical anchoring uses the font's cap-height box (the extents of "H"),
   * not the string's ink, so labels with and without descenders share a
   * baseline. */
  cairo_text_extents_t te, cap;
  cairo_text_extents(cr, s, &te);
  cairo_text_extents(cr, "H", &cap);
  cairo_move_to(cr, x - te.x_bearing - ax * te.width, y - cap.y_bearing - ay * cap.height);
  cairo_show_text(cr, s);
}

double pp_gen_text_wrap(cairo_t *cr, const char *text, double x, double y, double width,
                        double size, double leading) {
  cairo_set_font_size(cr, size);
  gchar **words = g_strsplit(text, " ", -1);
  GString *line = g_string_new(NULL);
  double baseline = y + size;
  for (int i = 0; words[i]; i++) {
    if (!*words[i])
      continue;
    GString *trial = g_string_new(line->str);
    if (trial->len)
      g_string_append_c(trial, ' ');
    g_string_append(trial, words[i]);
    cairo_text_extents_t te;
    cairo_text_extents(cr, trial->str, &te);
    if (te.x_advance > width && line->len) {
      cairo_move_to(cr, x, baseline);
      cairo_show_text(cr, line->str);
      baseline += leading;
      g_string_assign(line, words[i]);
    } else {
      g_string_assign(line, trial->str);
    }
    g_string_free(trial, TRUE);
  }
  if (line->len) {
    cairo_move_to(cr, x, baseline);
    cairo_show_text(cr, line->str);
    baseline += leading;
  }
  g_string_free(line, TRUE);
  g_strfreev(words);
  return baseline - size;
}
