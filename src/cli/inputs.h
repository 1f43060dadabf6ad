/* inputs.h — turns the PATH arguments and --from lists of `scan` into documents: files
 * as given, directories searched recursively for *.pdf, each hashed (SHA-256) so that
 * duplicates are scanned once, shards are stable and reruns can resume. */
#pragma once

#include <glib.h>

#include "capture/capture.h"

typedef struct {
  char *path;            /* as the user would recognise it (argument or argument/sub/file) */
  char *canonical;       /* realpath(), for deduplication and collision suffixes */
  char *rel_dir;         /* folder below the output directory mirroring the input's, or "" */
  char *output_name;     /* relative to the output directory: "[rel_dir/]<name>.findings.json" */
  char *sha256;          /* lowercase hex; NULL until hashed */
  pp_file_digest digest; /* the same, with the file's identity for the worker */
  guint64 size;
  int primary; /* index of the first input with the same SHA-256, or -1 when this is it */
} pp_input;

void pp_input_free(pp_input *input);

/* Prints one stderr line per path that cannot be used and counts it in *n_failed.
 * from: a list file with one path per line ("-" for stdin), or NULL.
 * Returns the documents, of pp_input*, in argument order, directories sorted, hashed,
 * named, with duplicates marked. Returns NULL when the --from list cannot be read. */
GPtrArray *pp_inputs_collect(char **paths, int n_paths, const char *from, guint *n_failed);

/* Gives the input the "-<hash>" form of its name (when an earlier run into the same
 * directory used the plain name for another document). */
void pp_input_retag(pp_input *input);

/* The stable shard (1..n) of a document, from its SHA-256. */
guint pp_inputs_shard_of(const char *sha256, guint n);

/* "<base>.findings.json" for a file named path: .pdf dropped, the base cut at
 * 200 bytes (on a UTF-8 boundary), "-<tag>" added when tag is not NULL. */
char *pp_inputs_output_base(const char *path, const char *tag);
