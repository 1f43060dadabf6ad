/* bar_layout.c — evidence from how bars stand: on one shared baseline, and at one pitch
 * series by series (the regular spacing of a bar chart, which tables of shaded cells and
 * tag clouds seldom have). */
#include "internal.h"

#include <math.h>

/* How much a shared baseline says on its own: table cells and tags share edges too
 * (common practice, no source). */
#define PP_EVIDENCE_BASELINE_WEIGHT 0.5
/* How much bars at one pitch say: the weight of the evidence when every gap of every
 * series is regular (common practice, no source)... */
#define PP_EVIDENCE_SPACING_WEIGHT 0.6
/* ...a gap being regular when within this share of the series' median gap (producers
 * round positions to a pixel or a point; common practice, no source). */
#define PP_EVIDENCE_SPACING_TOL 0.1

static int cmp_double(gconstpointer a, gconstpointer b) {
  double x = *(const double *)a, y = *(const double *)b;
  return (x > y) - (x < y);
}

/* The share of a series' gaps (centre to centre across the axis) within
 * PP_EVIDENCE_SPACING_TOL of its median gap, over the series with two gaps or more; NAN
 * when no series has. Grouped bars are regular series by series. */
double pp_bars_spacing_regularity(const pp_figure *fig) {
  gboolean vertical = fig->kind == PP_FIGURE_COLUMN;
  guint regular = 0, gaps = 0;
  for (guint s = 0; s < fig->n_series; s++) {
    g_autoptr(GArray) c = g_array_new(FALSE, FALSE, sizeof(double));
    for (guint i = 0; i < fig->elements->len; i++) {
      const pp_element *e = &g_array_index(fig->elements, pp_element, i);
      pp_frame_rect r = pp_frame_of(e->box, vertical);
      double mid = (r.w0 + r.w1) / 2;
      if (e->series == s)
        g_array_append_val(c, mid);
    }
    if (c->len < 3)
      continue;
    g_array_sort(c, cmp_double);
    g_autoptr(GArray) d = g_array_new(FALSE, FALSE, sizeof(double));
    for (guint i = 1; i < c->len; i++) {
      double gap = g_array_index(c, double, i) - g_array_index(c, double, i - 1);
      g_array_append_val(d, gap);
    }
    g_autoptr(GArray) sorted = g_array_copy(d);
    g_array_sort(sorted, cmp_double);
    double median = g_array_index(sorted, double, sorted->len / 2);
    for (guint i = 0; i < d->len; i++)
      regular += fabs(g_array_index(d, double, i) - median) <= PP_EVIDENCE_SPACING_TOL * median;
    gaps += d->len;
  }
  return gaps ? (double)regular / gaps : NAN;
}

void pp_bars_weigh_layout(pp_figure *fig) {
  pp_figure_add_evidence(fig, "shared-baseline", PP_EVIDENCE_BASELINE_WEIGHT);
  double regular = pp_bars_spacing_regularity(fig);
  if (!isnan(regular))
    pp_figure_add_evidence(fig, "regular-spacing", PP_EVIDENCE_SPACING_WEIGHT * regular);
}
