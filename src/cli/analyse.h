/* analyse.h — the work done inside a worker child: one document (scan) or one page
 * (scene, charts), returned as a JSON payload for the parent. */
#pragma once

#include "cli.h"

typedef struct {
  const char *path;
  const char *output_file; /* NULL: do not write a findings file */
  const pp_cli_options *opt;
  gboolean charts; /* inspect: recognised charts instead of the scene */
} pp_analyse_job;

/* Payload: the compact findings object, or {"error": {"code", "word", "message"}}. */
char *pp_analyse_document(gpointer job);
/* Payload: the pretty scene or charts object, or the same error object. */
char *pp_analyse_page(gpointer job);

/* Builds the error payload. */
char *pp_analyse_error_payload(int code, const char *word, const char *message);
