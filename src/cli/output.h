/* output.h — every byte plotproof writes, checked: findings files and records written
 * atomically (temporary file in the same directory, then rename), standard output
 * written with its errors noticed (a full disk, a pipe closed early). */
#pragma once

#include <glib.h>

/* Creates the parent directories of path, writes data to a temporary file beside it
 * with a short name (so long names still fit NAME_MAX), syncs and renames. */
gboolean pp_output_write_atomic(const char *path, const char *data, gsize len, GError **error);

/* Writes to stdout and flushes. After the first failure prints one stderr line and
 * returns FALSE from then on, writing nothing more. */
gboolean pp_output_stdout(const char *data, gsize len);
/* Flushes stdout (for printf users); FALSE once standard output has failed. */
gboolean pp_output_stdout_flush(void);
gboolean pp_output_stdout_failed(void);
