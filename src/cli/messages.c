/* messages.c — the single stderr line per failed file. Keeping the format in one place
 * is what lets scripts (and the e2e tests) rely on "plotproof: FILE: reason". */
#include <stdio.h>
#include <string.h>

#include "cli.h"

void pp_cli_print_file_error(const char *file, const char *word, const char *message) {
  char *name = g_filename_display_name(file);
  char *flat = g_strdup(message ? message : "");
  g_strdelimit(flat, "\r\n", ' ');
  g_strstrip(flat);
  if (!*flat)
    fprintf(stderr, "plotproof: %s: %s\n", name, word);
  else if (g_str_has_prefix(flat, word))
    fprintf(stderr, "plotproof: %s: %s\n", name, flat); /* "damaged: ...", "encrypted; ..." */
  else if (strchr(flat, '('))
    fprintf(stderr, "plotproof: %s: %s: %s\n", name, word, flat); /* avoid nested parentheses */
  else
    fprintf(stderr, "plotproof: %s: %s (%s)\n", name, word, flat);
  fflush(stderr);
  g_free(flat);
  g_free(name);
}
