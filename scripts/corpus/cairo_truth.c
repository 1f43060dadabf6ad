/* Truth records and the expected distortion measures, written as JSON by
 * hand (GString) so the generator only needs glib and cairo. */
#include "cairo_truth.h"

#include <cairo.h>
#include <math.h>

static void figure_free(gpointer p) {
  pp_gen_figure *fig = p;
  g_array_unref(fig->values);
  g_ptr_array_unref(fig->labels);
  if (fig->data_labels)
    g_array_unref(fig->data_labels);
  if (fig->drawn)
    g_array_unref(fig->drawn);
  if (fig->series_names) {
    g_ptr_array_unref(fig->series_names);
    g_ptr_array_unref(fig->series_values);
  }
  g_ptr_array_unref(fig->styles);
  g_free(fig->note);
  g_free(fig->extra_json);
  g_free(fig->expected_json);
  g_free(fig);
}

pp_gen_truth *pp_gen_truth_new(const char *file, guint64 seed) {
  pp_gen_truth *t = g_new0(pp_gen_truth, 1);
  t->file = g_strdup(file);
  t->producer = g_strdup_printf("cairo %s", cairo_version_string());
  t->seed = seed;
  t->pages = 1;
  t->figures = g_ptr_array_new_with_free_func(figure_free);
  return t;
}

void pp_gen_truth_free(pp_gen_truth *truth) {
  if (!truth)
    return;
  g_free(truth->file);
  g_free(truth->producer);
  g_ptr_array_unref(truth->figures);
  g_free(truth);
}

pp_gen_figure *pp_gen_truth_add(pp_gen_truth *truth, int page, const char *kind) {
  pp_gen_figure *fig = g_new0(pp_gen_figure, 1);
  fig->page = page;
  fig->kind = kind;
  fig->values = g_array_new(FALSE, FALSE, sizeof(double));
  fig->labels = g_ptr_array_new_with_free_func(g_free);
  fig->baseline = NAN;
  fig->orientation = 'y';
  fig->styles = g_ptr_array_new_with_free_func(g_free);
  g_ptr_array_add(truth->figures, fig);
  if (page > truth->pages)
    truth->pages = page;
  return fig;
}

void pp_gen_figure_add_style(pp_gen_figure *fig, const char *style) {
  for (guint i = 0; i < fig->styles->len; i++)
    if (g_str_equal(g_ptr_array_index(fig->styles, i), style))
      return;
  g_ptr_array_add(fig->styles, g_strdup(style));
}

void pp_gen_figure_add_series(pp_gen_figure *fig, const char *name, const double *values, int n) {
  if (!fig->series_names) {
    fig->series_names = g_ptr_array_new_with_free_func(g_free);
    fig->series_values = g_ptr_array_new_with_free_func((GDestroyNotify)g_array_unref);
  }
  GArray *a = g_array_new(FALSE, FALSE, sizeof(double));
  g_array_append_vals(a, values, (guint)n);
  g_ptr_array_add(fig->series_names, g_strdup(name));
  g_ptr_array_add(fig->series_values, a);
}

void pp_gen_figure_set_note(pp_gen_figure *fig, const char *note) {
  g_free(fig->note);
  fig->note = g_strdup(note);
}

void pp_gen_figure_set_bbox(pp_gen_figure *fig, double x, double y, double w, double h) {
  fig->bbox[0] = x;
  fig->bbox[1] = y;
  fig->bbox[2] = x + w;
  fig->bbox[3] = y + h;
}

/* Tufte (1983), The Visual Display of Quantitative Information, p.57:
 * Lie Factor = size of effect shown in graphic / size of effect in data,
 * effect = (last - first) / first. Steinbart (1989), "The auditor's
 * responsibility for the accuracy of graphs in annual reports": GDI =
 * 100 (a/b - 1) with a, b the graphic and data percentage changes, i.e.
 * 100 (LF_change - 1). Growth ratio and pairwise departure are the same
 * idea applied to ratios instead of changes (project definition). */
void pp_gen_measures_compute(const double *v, const double *g, int n, double baseline,
                             pp_gen_measures *out) {
  out->lie_factor_growth = NAN;
  out->lie_factor_change = NAN;
  out->gdi = NAN;
  out->baseline = baseline;
  out->max_pair_departure = NAN;
  if (n < 2)
    return;
  double vf = v[0], vl = v[n - 1], gf = g[0], gl = g[n - 1];
  if (vf != 0 && gf != 0 && vl != 0 && gl != 0)
    out->lie_factor_growth = (gl / gf) / (vl / vf);
  if (vl != vf && vf != 0 && gf != 0) {
    out->lie_factor_change = ((gl - gf) / gf) / ((vl - vf) / vf);
    out->gdi = 100.0 * (out->lie_factor_change - 1.0);
  }
  double worst = NAN;
  for (int i = 0; i < n; i++)
    for (int j = 0; j < n; j++) {
      if (i == j || v[i] <= 0 || v[j] <= 0 || g[i] <= 0 || g[j] <= 0)
        continue;
      double d = (g[i] / g[j]) / (v[i] / v[j]);
      if (isnan(worst) || d > worst)
        worst = d;
    }
  out->max_pair_departure = worst;
}

static void json_string(GString *s, const char *str) {
  if (!str) {
    g_string_append(s, "null");
    return;
  }
  g_string_append_c(s, '"');
  for (const unsigned char *p = (const unsigned char *)str; *p; p++) {
    if (*p == '"' || *p == '\\')
      g_string_append_printf(s, "\\%c", *p);
    else if (*p < 0x20)
      g_string_append_printf(s, "\\u%04x", *p);
    else
      g_string_append_c(s, (char)*p);
  }
  g_string_append_c(s, '"');
}

static void json_number(GString *s, double v) {
  if (isnan(v) || isinf(v)) {
    g_string_append(s, "null");
    return;
  }
  /* Locale-independent, round-trippable enough for 1e-9 comparisons. */
  char buf[G_ASCII_DTOSTR_BUF_SIZE];
  if (v == floor(v) && fabs(v) < 1e15)
    g_snprintf(buf, sizeof buf, "%.0f", v);
  else
    g_ascii_formatd(buf, sizeof buf, "%.12g", v);
  g_string_append(s, buf);
}

/* Measures use 9 significant digits, as scripts/corpus/truth.py does, so
 * `truth.py check` can compare them exactly. */
static void json_measure(GString *s, double v) {
  if (isnan(v) || isinf(v)) {
    g_string_append(s, "null");
    return;
  }
  char buf[G_ASCII_DTOSTR_BUF_SIZE];
  g_ascii_formatd(buf, sizeof buf, "%.9g", v);
  g_string_append(s, buf);
}

static void json_numbers(GString *s, const GArray *a) {
  if (!a) {
    g_string_append(s, "null");
    return;
  }
  g_string_append_c(s, '[');
  for (guint i = 0; i < a->len; i++) {
    if (i)
      g_string_append(s, ", ");
    json_number(s, g_array_index(a, double, i));
  }
  g_string_append_c(s, ']');
}

static void json_strings(GString *s, const GPtrArray *a) {
  g_string_append_c(s, '[');
  for (guint i = 0; i < a->len; i++) {
    if (i)
      g_string_append(s, ", ");
    json_string(s, g_ptr_array_index(a, i));
  }
  g_string_append_c(s, ']');
}

static void json_figure(GString *s, const pp_gen_figure *f) {
  g_string_append_printf(s, "    {\n      \"page\": %d,\n      \"bbox\": [", f->page);
  for (int i = 0; i < 4; i++) {
    if (i)
      g_string_append(s, ", ");
    json_number(s, round(f->bbox[i] * 1000.0) / 1000.0);
  }
  g_string_append(s, "],\n      \"kind\": ");
  json_string(s, f->kind);
  g_string_append_printf(
      s, ",\n      \"misleading\": %s,\n      \"rule\": ", f->misleading ? "true" : "false");
  json_string(s, f->rule);
  g_string_append(s, ",\n      \"values\": ");
  json_numbers(s, f->values);
  g_string_append(s, ",\n      \"labels\": ");
  json_strings(s, f->labels);
  g_string_append(s, ",\n      \"axis\": ");
  if (f->has_axis && f->axis_hidden)
    g_string_append(s, "null,\n      \"axis_hidden\": ");
  if (f->has_axis) {
    g_string_append(s, "{\"min\": ");
    json_number(s, f->axis_min);
    g_string_append(s, ", \"max\": ");
    json_number(s, f->axis_max);
    g_string_append_printf(s, ", \"scale\": \"%s\", \"orientation\": \"%c\"}",
                           f->axis_log ? "log" : "linear", f->orientation);
  } else {
    g_string_append(s, "null");
  }
  g_string_append(s, ",\n      \"baseline\": ");
  json_number(s, f->baseline);
  g_string_append(s, ",\n      \"data_labels\": ");
  json_numbers(s, f->data_labels);
  if (f->drawn) {
    g_string_append(s, ",\n      \"drawn_values\": ");
    json_numbers(s, f->drawn);
  }
  if (f->series_names) {
    g_string_append(s, ",\n      \"series\": [");
    for (guint i = 0; i < f->series_names->len; i++) {
      g_string_append(s, i ? ", {\"name\": " : "{\"name\": ");
      json_string(s, g_ptr_array_index(f->series_names, i));
      g_string_append(s, ", \"values\": ");
      json_numbers(s, g_ptr_array_index(f->series_values, i));
      g_string_append_c(s, '}');
    }
    g_string_append_c(s, ']');
  }
  g_string_append(s, ",\n      \"expected\": ");
  if (f->expected_json) {
    g_string_append(s, f->expected_json);
  } else if (f->has_expected) {
    const pp_gen_measures *m = &f->expected;
    g_string_append(s, "{\"lie_factor_growth\": ");
    json_measure(s, m->lie_factor_growth);
    g_string_append(s, ", \"lie_factor_change\": ");
    json_measure(s, m->lie_factor_change);
    g_string_append(s, ", \"gdi\": ");
    json_measure(s, m->gdi);
    g_string_append(s, ", \"baseline\": ");
    json_number(s, m->baseline);
    g_string_append(s, ", \"max_pair_departure\": ");
    json_measure(s, m->max_pair_departure);
    g_string_append_c(s, '}');
  } else {
    g_string_append(s, "null");
  }
  g_string_append(s, ",\n      \"style\": ");
  json_strings(s, f->styles);
  if (f->note) {
    g_string_append(s, ",\n      \"notes\": ");
    json_string(s, f->note);
  }
  if (f->extra_json)
    g_string_append_printf(s, ",\n      %s", f->extra_json);
  g_string_append(s, "\n    }");
}

gboolean pp_gen_truth_write(const pp_gen_truth *truth, const char *path, GError **error) {
  GString *s = g_string_new("{\n  \"file\": ");
  json_string(s, truth->file);
  g_string_append(s, ",\n  \"producer\": ");
  json_string(s, truth->producer);
  g_string_append_printf(s, ",\n  \"seed\": %" G_GUINT64_FORMAT ",\n  \"pages\": %d,\n",
                         truth->seed, truth->pages);
  g_string_append(s, "  \"figures\": [\n");
  for (guint i = 0; i < truth->figures->len; i++) {
    if (i)
      g_string_append(s, ",\n");
    json_figure(s, g_ptr_array_index(truth->figures, i));
  }
  g_string_append(s, "\n  ]\n}\n");
  gboolean ok = g_file_set_contents(path, s->str, (gssize)s->len, error);
  g_string_free(s, TRUE);
  return ok;
}
