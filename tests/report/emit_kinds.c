/* emit_kinds.c — prints the figure kinds of PP_FIGURE_KINDS, one name per line, for
 * check_kinds.py. */
#include <stdio.h>

#include "recognize/recognize.h"

int main(void) {
  for (guint i = 0; i < PP_FIGURE_N_KINDS; i++)
    printf("%s\n", pp_figure_kind_name((pp_figure_kind)i));
  return 0;
}
