/* inputs.h — turns the PATH arguments of `scan` into a list of documents: files as
 * given, directories searched recursively for *.pdf, duplicates removed, and a
 * findings-file name for each that never collides within the batch. */
#pragma once

#include <glib.h>

typedef struct {
  char *path;        /* as the user would recognise it (argument or argument/sub/file) */
  char *canonical;   /* realpath(), for deduplication and collision suffixes */
  char *output_name; /* "<name>.findings.json" */
} pp_input;

void pp_input_free(pp_input *input);

/* Prints one stderr line per path that cannot be used and counts it in *n_failed.
 * Returns the documents, of pp_input*, in argument order, directories sorted. */
GPtrArray *pp_inputs_collect(char **paths, int n_paths, guint *n_failed);
