/* passwords.h — passwords for encrypted PDFs from a file (so they never appear on a
 * command line that `ps` shows) or from $PLOTPROOF_PASSWORD. File lines:
 *   sha256:<64 hex>  PASSWORD      a document by content
 *   <glob>           PASSWORD      a document by path or base name (fnmatch(3) pattern)
 * Blank lines and lines starting with '#' are ignored; the first matching line wins;
 * PASSWORD is the rest of the line after the blanks that follow the key. */
#pragma once

#include <glib.h>

typedef struct pp_passwords pp_passwords;

/* file may be NULL; fallback (env or --password) may be NULL. NULL with error when the
 * file cannot be read. */
pp_passwords *pp_passwords_load(const char *file, const char *fallback, GError **error);
/* From text (for tests and fuzzing). */
pp_passwords *pp_passwords_parse(const char *text, const char *fallback);
void pp_passwords_free(pp_passwords *pw);
/* The password for a document, or NULL. */
const char *pp_passwords_lookup(const pp_passwords *pw, const char *path, const char *sha256);
