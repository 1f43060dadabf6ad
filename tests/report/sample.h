/* sample.h — a hand-built page (scene, one recognised figure, one finding) for the
 * report tests; the values are invented and chosen so every field is exercised. */
#pragma once

#include "report/report.h"

typedef struct {
  pp_scene *scene;
  pp_page_charts *charts;
  GPtrArray *findings; /* of pp_finding* */
  pp_document_info info;
} pp_sample;

/* lie_factor and gdi let a test put NaN or infinities where the rules stage may. */
pp_sample *pp_sample_new(double lie_factor, double gdi);
void pp_sample_free(pp_sample *s);
/* A report of the sample's page plus one failed page. */
pp_report *pp_sample_report(const pp_sample *s);
