/* batch.h — the scheduler: up to --jobs document workers at once, each a process forked
 * by the launcher and watched from a GLib main loop (its pipe, the launcher's reports, a
 * deadline), with SIGINT, SIGTERM and SIGHUP stopping the workers while every finished
 * result is kept. */
#pragma once

#include <json-glib/json-glib.h>

#include "cli.h"
#include "launcher.h"
#include "progress.h"

typedef struct {
  const char *path;
  const char *password;
  const pp_file_digest *digest; /* the scheduler's reading of the file, or NULL */
  guint id;                     /* the caller's index, handed back in the result */
} pp_batch_item;

typedef struct {
  guint id;
  JsonNode *root;   /* the findings object without its page entries, or NULL when the document
                     * failed (pp_assembly_finish_text) */
  const char *text; /* with root: the whole findings object as text (json-glib's pretty form) */
  const char *word, *reason; /* why it failed, or why pages are missing (NULL if complete) */
  gboolean complete;         /* every page reported and the worker ended normally */
  gboolean interrupted;      /* stopped by a signal to the batch */
  guint pages, pages_done, pages_failed;
  int last_page; /* 1-based page last started, 0 when none */
  double seconds;
  long max_rss_kib;
  const char *first_page_error;
} pp_batch_result;

/* Called once per item as it finishes (in completion order); root is borrowed. */
typedef void (*pp_batch_done_func)(const pp_batch_result *result, gpointer user_data);

/* Runs every item, its worker forked by launcher; returns TRUE when the batch was
 * interrupted. */
gboolean pp_batch_run(const pp_cli_options *opt, pp_launcher *launcher, const GArray *items,
                      pp_batch_done_func done, gpointer user_data, pp_progress *progress);
