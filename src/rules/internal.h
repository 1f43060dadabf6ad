/* internal.h — shared by the scoring stage's files only. */
#pragma once

#include "rules.h"

void pp_measures_compute(const double *values, const double *inks, const guint *series, guint n,
                         double baseline, pp_measures *out);

/* "30,000", "1.25", "0.004": a value as a reviewer reads it (en grouping). */
char *pp_format_value(double v);
