/* shares.c — what the share rules (pies, tilted pies) have in common: each element's
 * printed share and how far rounding lets it be off, read from the label as printed. */
#include <math.h>
#include <string.h>

#include "internal.h"

int pp_label_decimals(const char *text) {
  if (!text)
    return 0;
  /* Digits after the last decimal mark that is followed by a digit. */
  int best = 0;
  for (const char *p = text; *p; p++) {
    if ((*p == '.' || *p == ',') && p[1] >= '0' && p[1] <= '9') {
      int n = 0;
      while (p[1 + n] >= '0' && p[1 + n] <= '9')
        n++;
      best = n == 3 && *p == ',' ? best : n; /* "1,250" groups thousands */
    }
  }
  return best;
}

gboolean pp_rule_shares(const pp_figure *fig, double *printed, double *half_unit) {
  guint n = fig->elements->len;
  double total = 0;
  for (guint i = 0; i < n; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    if (isnan(e->share) || !(e->ink > 0))
      return FALSE;
    total += e->label_value;
  }
  for (guint i = 0; i < n; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    printed[i] = e->share;
    double unit = 0.5 * pow(10, -pp_label_decimals(e->label_text));
    /* Half a unit of the last printed digit, as a share of the whole. */
    half_unit[i] = e->source == PP_VALUE_PERCENT_LABEL ? unit / 100 : unit / total;
  }
  return n >= 2;
}
