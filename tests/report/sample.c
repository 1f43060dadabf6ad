/* sample.c — builds the sample page by hand, without capture or recognition, so the
 * report writer is tested alone. Scenario: the invented "Quillmere Textiles" revenue. */
#include <math.h>

#include "sample.h"

static pp_scene *sample_scene(void) {
  pp_scene *s = pp_scene_new(0, 400, 300);
  s->crop_box = (pp_rect){0, 0, 400, 300};
  /* Page points (y down) to PDF user space (y up from the bottom-left, ISO 32000-1 §8.3.2.3). */
  s->to_pdf = (pp_matrix){1, 0, 0, -1, 0, 300};
  pp_path *clip_path = pp_path_new();
  pp_path_rectangle(clip_path, 50, 50, 300, 200);
  pp_clip *clip = pp_clip_new(NULL, clip_path, PP_FILL_NONZERO);
  pp_path *inner = pp_path_new();
  pp_path_rectangle(inner, 60, 60, 280, 180);
  pp_clip *clip2 = pp_clip_new(clip, inner, PP_FILL_EVEN_ODD);
  pp_clip_unref(clip);
  for (int i = 0; i < 3; i++) {
    pp_mark *m = g_new0(pp_mark, 1);
    m->kind = i < 2 ? PP_MARK_FILL : PP_MARK_STROKE;
    m->index = (guint)i;
    m->path = pp_path_new();
    pp_path_rectangle(m->path, 80 + 90 * i, 100, 50, 150);
    m->paint = (pp_paint){PP_PAINT_SOLID, 0.2, 0.4, 0.7, 1};
    m->clip = i == 0 ? pp_clip_ref(clip2) : NULL;
    m->ink = i == 1 ? 7500 : NAN; /* mark 0: geometry not run */
    m->bbox = m->visible_bbox = i == 1 ? (pp_rect){170, 100, 220, 250} : pp_rect_empty();
    m->line_width = i == 2 ? 1.5 : 0;
    g_ptr_array_add(s->marks, m);
  }
  pp_clip_unref(clip2);
  pp_text_run *w = g_new0(pp_text_run, 1);
  w->text = g_strdup("Revenue");
  w->box = (pp_rect){60, 20, 112, 32};
  w->font_size = 12;
  w->font_name = g_strdup("DejaVuSans");
  g_ptr_array_add(s->words, w);
  g_ptr_array_add(s->warnings, g_strdup("Syntax Error: \xff invented warning"));
  s->n_images = 1;
  return s;
}

static pp_page_charts *sample_charts(void) {
  pp_page_charts *c = pp_page_charts_new();
  pp_figure *f = pp_figure_new(PP_FIGURE_COLUMN);
  f->bbox = (pp_rect){10, 20, 110, 120};
  f->recognizer = "bars";
  f->scale = pp_scale_new(TRUE);
  f->scale->min_value = 35;
  f->scale->max_value = 75;
  for (int v = 40; v <= 70; v += 10) {
    pp_tick t = {250.0 - v, v, g_strdup_printf("%d", v)};
    g_array_append_val(f->scale->ticks, t);
  }
  for (int i = 0; i < 3; i++) {
    pp_element e = pp_element_init(PP_ENCODING_LENGTH);
    pp_element_add_part(&e, (guint)i, PP_PART_BODY, 1250 + 3750 * i);
    e.shape.kind = PP_SHAPE_RECT;
    e.shape.rect = e.box = (pp_rect){20 + 30 * i, 100 - 15 * i, 40 + 30 * i, 120};
    e.value = e.scale_value = 40 + 15 * i;
    e.source = PP_VALUE_SCALE;
    g_array_append_val(f->elements, e);
  }
  f->n_series = 1;
  f->fingerprint = g_strdup("fig-0123abcd");
  f->title = g_strdup("Revenue, invented EUR m");
  g_ptr_array_add(c->figures, f);
  pp_scale_failure *sf = g_new0(pp_scale_failure, 1);
  sf->bbox = (pp_rect){200, 20, 390, 120};
  sf->reason = g_strdup("tick labels are not numbers");
  g_ptr_array_add(c->scale_failures, sf);
  pp_rect raster = {10, 150, 110, 290};
  g_array_append_val(c->raster_images, raster);
  return c;
}

static pp_finding *sample_finding(double lie_factor, double gdi) {
  pp_figure *fig = pp_figure_new(PP_FIGURE_COLUMN);
  fig->fingerprint = g_strdup("fig-0123abcd");
  fig->bbox = (pp_rect){10, 20, 110, 120};
  pp_finding *f = pp_finding_new(fig, "bars-off-zero");
  pp_figure_free(fig);
  f->severity = PP_SEVERITY_SEVERE;
  f->measures = (pp_measures){lie_factor, 2.0, gdi, 35, 3.5, 0, 2, 0, 2, 3.5, 0, {{0}}};
  const double values[] = {40, 55, 70}, inks[] = {1250, 5000, 8750};
  const char *cats[] = {"2021", NULL,
                        "20\xff"
                        "23"}; /* a missing and a non-UTF-8 label */
  for (int i = 0; i < 3; i++) {
    pp_finding_element e = {values[i], inks[i],
                            (pp_rect){20 + 30 * i, 100 - 15 * i, 40 + 30 * i, 120},
                            g_strdup(cats[i]), i == 0 ? g_strdup("€40m") : NULL};
    g_array_append_val(f->elements, e);
  }
  f->headline = g_strdup("shows 75% growth as 600% growth");
  f->message = g_strdup("The columns start at 35, not 0: the last is drawn 7.0 times the first "
                        "for a 1.75 times larger value.");
  return f;
}

pp_sample *pp_sample_new(double lie_factor, double gdi) {
  pp_sample *s = g_new0(pp_sample, 1);
  s->scene = sample_scene();
  s->charts = sample_charts();
  s->findings = g_ptr_array_new_with_free_func((GDestroyNotify)pp_finding_free);
  g_ptr_array_add(s->findings, sample_finding(lie_factor, gdi));
  s->info = (pp_document_info){"/invented/quillmere-annual-report.pdf",
                               123456,
                               "9f86d081884c7d659a2feaa0c55ad015a3bf4f1b2b0b822cd15d6c15b0f00a08",
                               2,
                               "1.7",
                               "cairo 1.16.0",
                               NULL,
                               "Quillmere Textiles 2023"};
  return s;
}

void pp_sample_free(pp_sample *s) {
  pp_scene_free(s->scene);
  pp_page_charts_free(s->charts);
  g_ptr_array_unref(s->findings);
  g_free(s);
}

pp_report *pp_sample_report(const pp_sample *s) {
  pp_thresholds t = pp_thresholds_default();
  pp_report *r = pp_report_new(&s->info, &t);
  pp_report_add_page(r, s->scene, s->charts, s->findings);
  pp_report_add_failed_page(r, 1, "page 2 cannot be loaded");
  return r;
}
