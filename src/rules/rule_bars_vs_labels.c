/* rule_bars_vs_labels.c — bars whose printed data labels disagree with their lengths.
 * With a value scale, a label off the scale reading at its bar's tip by more than the
 * label tolerance makes the labels the values; without a scale they are the values.
 * A stack's segments are judged the same way against the numbers printed in them. */
#include <math.h>

#include "internal.h"

/* How many labelled elements there are, and whether one disagrees with its reading. */
static gboolean labels_disagree(const pp_figure *fig, const pp_thresholds *t, guint *n_labelled) {
  guint bad = 0, n = 0;
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    if (isnan(e->label_value))
      continue;
    n++;
    double ref = fmax(fabs(e->label_value), 1e-12);
    if (fabs(e->scale_value - e->label_value) / ref > t->label_tolerance)
      bad++;
  }
  *n_labelled = n;
  return bad > 0;
}

/* ---- Stacked segments ------------------------------------------------------------------ */

/* A printed number's digits after the point are read back from its value: at most this
 * many (labels print fewer; common practice, no source). */
#define PP_SEGMENT_MAX_DECIMALS 4

/* A reading of the labels (the whole chart, or stack by stack) is preferred to the
 * other only when it departs less by more than the GDI's materiality (10%; Steinbart
 * 1989): ties go to the whole chart, whose labels share one unit. */
#define PP_SEGMENT_READING_MARGIN 1.10

/* One labelled segment: its printed number (magnitude), its ink, its stack and place. */
typedef struct {
  double value, ink, allowance;
  guint element, part;
} pp_segment;

/* Half a unit of the last decimal the value needs: the rounding its label may hide (a
 * label printed with trailing zeros is allowed more, never less). */
static double half_unit(double v) {
  for (int d = 0; d < PP_SEGMENT_MAX_DECIMALS; d++) {
    double s = fabs(v) * pow(10, d);
    if (fabs(s - round(s)) < 1e-6 * fmax(1, s))
      return 0.5 * pow(10, -d);
  }
  return 0.5 * pow(10, -PP_SEGMENT_MAX_DECIMALS);
}

/* The labelled segments of the figure's stacks, base to tip, stacks in category order. */
static GArray *labelled_segments(const pp_figure *fig, const pp_thresholds *t) {
  GArray *out = g_array_new(FALSE, FALSE, sizeof(pp_segment));
  for (guint i = 0; i < fig->elements->len; i++) {
    const pp_element *e = &g_array_index(fig->elements, pp_element, i);
    for (guint k = 0; e->stacked && k < e->parts->len; k++) {
      const pp_part *p = &g_array_index(e->parts, pp_part, k);
      if (!isfinite(p->label_value) || p->label_value == 0 || !(p->ink > 0))
        continue;
      double v = fabs(p->label_value);
      /* The rule's label tolerance, or the label's rounding where that is more. */
      pp_segment s = {v, p->ink, fmax(t->label_tolerance * v, half_unit(v)), i, k};
      g_array_append_val(out, s);
    }
  }
  return out;
}

/* A label agrees with its segment when it is, within the allowance, the segment's
 * thickness on the scale, or its end's reading: the value from 0 of a bottom segment on
 * a cut axis (the floor's part is bars-off-zero's to judge), or a running total. */
static gboolean segment_agrees(const pp_figure *fig, const pp_segment *s) {
  const pp_element *e = &g_array_index(fig->elements, pp_element, s->element);
  const pp_part *p = &g_array_index(e->parts, pp_part, s->part);
  return fabs(fabs(p->end - p->start) - s->value) <= s->allowance ||
         fabs(fabs(p->end) - s->value) <= s->allowance;
}

/* Measures of segments sel (n of them) on their labels, or, adjusted, on the values
 * their labels may stand for: each label moved within its allowance towards the value
 * its ink stands for at the group's ink per unit value. */
static void segment_measures(const GArray *segs, const guint *sel, guint n, gboolean adjusted,
                             pp_measures *m) {
  g_autofree double *v = g_new0(double, MAX(n, 1));
  g_autofree double *g = g_new0(double, MAX(n, 1));
  g_autofree guint *series = g_new0(guint, MAX(n, 1));
  double sv = 0, sg = 0;
  for (guint i = 0; i < n; i++) {
    const pp_segment *s = &g_array_index(segs, pp_segment, sel[i]);
    v[i] = s->value, g[i] = s->ink;
    sv += v[i], sg += g[i];
  }
  for (guint i = 0; adjusted && i < n; i++) {
    const pp_segment *s = &g_array_index(segs, pp_segment, sel[i]);
    v[i] = fmin(fmax(g[i] * sv / sg, s->value - s->allowance), s->value + s->allowance);
  }
  *m = (pp_measures){0};
  pp_measures_compute(v, g, series, n, 0, m);
}

/* Distortion within the allowance (1 when faithful, NAN when nothing to compare). */
static double adjusted_distortion(const GArray *segs, const guint *sel, guint n,
                                  const pp_thresholds *t) {
  if (n < 2)
    return NAN;
  pp_measures m;
  pp_severity sev;
  segment_measures(segs, sel, n, TRUE, &m);
  return pp_rule_grade(&m, t, &sev) ? pp_measures_distortion(&m) : 1;
}

/* The segment's box: the stack's box cut at its share of the ink, counted from the base
 * end (segments of one stack are drawn at one width, so ink shares are length shares). */
static pp_rect segment_box(const pp_figure *fig, const pp_element *e, guint k) {
  double before = 0, total = 0;
  for (guint i = 0; i < e->parts->len; i++) {
    double ink = g_array_index(e->parts, pp_part, i).ink;
    before += i < k ? ink : 0;
    total += ink;
  }
  double a = total > 0 ? before / total : 0;
  double b = total > 0 ? (before + g_array_index(e->parts, pp_part, k).ink) / total : 1;
  pp_rect r = e->box;
  gboolean vertical = fig->kind == PP_FIGURE_COLUMN;
  /* Columns grow up and bars right unless the scale puts the base at the other end. */
  gboolean flip = FALSE;
  if (fig->scale && fig->scale->slope != 0 && isfinite(e->base_value)) {
    double base = pp_scale_pos_of(fig->scale, e->base_value);
    flip = vertical ? fabs(base - r.y0) < fabs(base - r.y1) : fabs(base - r.x1) < fabs(base - r.x0);
  }
  if (vertical) {
    double h = r.y1 - r.y0, y1 = r.y1;
    r.y1 = flip ? r.y0 + b * h : y1 - a * h;
    r.y0 = flip ? r.y0 + a * h : y1 - b * h;
  } else {
    double w = r.x1 - r.x0, x0 = r.x0;
    r.x0 = flip ? r.x1 - b * w : x0 + a * w;
    r.x1 = flip ? r.x1 - a * w : x0 + b * w;
  }
  return r;
}

/* The finding over segments sel: their labels against their ink. */
static void fill_segments(const pp_figure *fig, const GArray *segs, const guint *sel, guint n,
                          pp_finding *f) {
  for (guint i = 0; i < n; i++) {
    const pp_segment *s = &g_array_index(segs, pp_segment, sel[i]);
    const pp_element *e = &g_array_index(fig->elements, pp_element, s->element);
    char *name = e->category && *e->category
                     ? g_strdup_printf("segment %u of %s", s->part + 1, e->category)
                     : g_strdup_printf("segment %u of stack %u", s->part + 1, s->element + 1);
    pp_finding_element fe = {s->value, s->ink, segment_box(fig, e, s->part), name, NULL};
    g_array_append_val(f->elements, fe);
  }
  segment_measures(segs, sel, n, FALSE, &f->measures);
  f->measures.baseline_value = pp_rule_baseline(fig, FALSE);
  pp_measures_add_extra(&f->measures, "segments_judged", n);
}

/* Stacked segments against their own labels. Their ink must follow the labels across the
 * chart, or at least within each stack (100% stacks, labels printed as shares of their
 * stack); a departure the labels' allowance explains is none. With a scale, only when a
 * label disagrees with its segment's reading. TRUE with f filled when they depart. */
static gboolean segments_depart(const pp_figure *fig, const pp_thresholds *t, pp_finding *f) {
  g_autoptr(GArray) segs = labelled_segments(fig, t);
  guint n = segs->len, disagree = 0;
  if (n < 2)
    return FALSE;
  for (guint i = 0; fig->scale && i < n; i++)
    disagree += !segment_agrees(fig, &g_array_index(segs, pp_segment, i));
  if (fig->scale && disagree == 0)
    return FALSE;
  g_autofree guint *all = g_new(guint, n);
  for (guint i = 0; i < n; i++)
    all[i] = i;
  double whole = adjusted_distortion(segs, all, n, t);
  if (!(whole > 1))
    return FALSE;
  /* Stack by stack: segments of one element are contiguous in segs. */
  double worst = NAN;
  guint worst_from = 0, worst_n = 0, judged = 0;
  for (guint from = 0, to; from < n; from = to) {
    guint el = g_array_index(segs, pp_segment, from).element;
    for (to = from; to < n && g_array_index(segs, pp_segment, to).element == el; to++)
      ;
    double d = adjusted_distortion(segs, all + from, to - from, t);
    if (isnan(d))
      continue;
    judged++;
    if (isnan(worst) || d > worst)
      worst = d, worst_from = from, worst_n = to - from;
  }
  if (judged > 0 && !(worst > 1))
    return FALSE; /* every stack is faithful on its own: shares of their stacks */
  /* Reported on the reading that departs less: the whole chart, or the worst stack. */
  if (judged > 0 && worst * PP_SEGMENT_READING_MARGIN < whole)
    fill_segments(fig, segs, all + worst_from, worst_n, f);
  else
    fill_segments(fig, segs, all, n, f);
  return TRUE;
}

gboolean pp_rule_bars_vs_labels_measure(const pp_figure *fig, const pp_thresholds *t,
                                        pp_finding *f) {
  guint n_labelled = 0;
  gboolean totals = labels_disagree(fig, t, &n_labelled) && n_labelled >= 2;
  if (!(fig->scale && totals) && segments_depart(fig, t, f))
    return TRUE;
  if (fig->scale && !totals)
    return FALSE;
  /* The printed labels are the values; the ink must follow them. */
  pp_rule_measure_elements(fig, f, PP_JUDGE_LABEL, FALSE, pp_rule_baseline(fig, FALSE));
  return TRUE;
}

static gboolean judged_segments(const pp_finding *f) {
  for (guint i = 0; i < f->measures.n_extra; i++)
    if (g_strcmp0(f->measures.extra[i].name, "segments_judged") == 0)
      return TRUE;
  return FALSE;
}

char *pp_rule_bars_vs_labels_sentence(const pp_figure *fig, const pp_finding *f,
                                      const pp_thresholds *t) {
  (void)fig;
  if (judged_segments(f))
    return pp_rule_sentence(
        f, t, g_strdup("stacked segments' lengths disagree with the numbers printed in them"),
        "segment");
  return pp_rule_sentence(f, t, g_strdup("bar lengths disagree with their printed labels"), "bar");
}
