/* emit_sample.c — prints the sample report (pretty) on stdout, for validate_schema.py. */
#include <math.h>
#include <stdio.h>

#include "sample.h"

int main(void) {
  pp_sample *s = pp_sample_new(NAN, INFINITY);
  pp_report *r = pp_sample_report(s);
  char *text = pp_report_to_string(r, TRUE, NULL);
  puts(text);
  g_free(text);
  pp_report_free(r);
  pp_sample_free(s);
  return 0;
}
