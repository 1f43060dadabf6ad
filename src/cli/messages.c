/* messages.c — the single stderr line per failed file, and the escaping of everything a
 * PDF or a file name can put on a terminal. Keeping the format in one place is what lets
 * scripts (and the tests) rely on "plotproof: FILE: reason". */
#include <stdio.h>
#include <string.h>

#include "cli.h"

char *pp_cli_escape(const char *text) {
  GString *out = g_string_new(NULL);
  const char *p = text ? text : "";
  while (*p) {
    gunichar c = g_utf8_get_char_validated(p, -1);
    if (c == (gunichar)-1 || c == (gunichar)-2) { /* invalid UTF-8: show the byte */
      g_string_append_printf(out, "\\x%02X", (guchar)*p);
      p++;
      continue;
    }
    const char *next = g_utf8_next_char(p);
    /* C0 controls, DEL and C1 controls (ECMA-48 §5) would be acted on by a terminal. */
    if (c < 0x20 || c == 0x7F || (c >= 0x80 && c < 0xA0)) {
      if (c < 0x80)
        g_string_append_printf(out, "\\x%02X", (guint)c);
      else
        g_string_append_printf(out, "\\u%04X", (guint)c);
    } else if (c == '\\') {
      g_string_append(out, "\\\\");
    } else {
      g_string_append_len(out, p, next - p);
    }
    p = next;
  }
  return g_string_free(out, FALSE);
}

void pp_cli_print_file_error(const char *file, const char *word, const char *message) {
  char *name = pp_cli_escape(file);
  char *flat = g_strdup(message ? message : "");
  g_strdelimit(flat, "\r\n", ' ');
  g_strstrip(flat);
  char *safe = pp_cli_escape(flat);
  if (!*safe)
    fprintf(stderr, "plotproof: %s: %s\n", name, word);
  else if (g_str_has_prefix(safe, word))
    fprintf(stderr, "plotproof: %s: %s\n", name, safe); /* "damaged: ...", "encrypted; ..." */
  else if (strchr(safe, '('))
    fprintf(stderr, "plotproof: %s: %s: %s\n", name, word, safe); /* no nested parentheses */
  else
    fprintf(stderr, "plotproof: %s: %s (%s)\n", name, word, safe);
  fflush(stderr);
  g_free(safe);
  g_free(flat);
  g_free(name);
}
