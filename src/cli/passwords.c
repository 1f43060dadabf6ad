/* passwords.c — the password file reader and lookup. */
#include <fnmatch.h>
#include <string.h>

#include "passwords.h"

struct pp_passwords {
  GPtrArray *keys, *values;
  char *fallback;
};

pp_passwords *pp_passwords_parse(const char *text, const char *fallback) {
  pp_passwords *pw = g_new0(pp_passwords, 1);
  pw->keys = g_ptr_array_new_with_free_func(g_free);
  pw->values = g_ptr_array_new_with_free_func(g_free);
  pw->fallback = g_strdup(fallback);
  char **lines = g_strsplit(text ? text : "", "\n", -1);
  for (char **l = lines; *l; l++) {
    char *line = *l;
    size_t n = strlen(line);
    if (n > 0 && line[n - 1] == '\r')
      line[--n] = '\0';
    while (*line == ' ' || *line == '\t')
      line++;
    if (!*line || *line == '#')
      continue;
    size_t k = strcspn(line, " \t");
    if (!line[k])
      continue; /* a key without a password */
    char *value = line + k;
    while (*value == ' ' || *value == '\t')
      value++;
    g_ptr_array_add(pw->keys, g_strndup(line, k));
    g_ptr_array_add(pw->values, g_strdup(value));
  }
  g_strfreev(lines);
  return pw;
}

pp_passwords *pp_passwords_load(const char *file, const char *fallback, GError **error) {
  char *text = NULL;
  if (file && !g_file_get_contents(file, &text, NULL, error))
    return NULL;
  pp_passwords *pw = pp_passwords_parse(text, fallback);
  if (text) /* do not leave passwords in freed memory longer than needed */
    memset(text, 0, strlen(text));
  g_free(text);
  return pw;
}

void pp_passwords_free(pp_passwords *pw) {
  if (!pw)
    return;
  g_ptr_array_unref(pw->keys);
  g_ptr_array_unref(pw->values);
  g_free(pw->fallback);
  g_free(pw);
}

const char *pp_passwords_lookup(const pp_passwords *pw, const char *path, const char *sha256) {
  if (!pw)
    return NULL;
  char *base = g_path_get_basename(path);
  const char *found = NULL;
  for (guint i = 0; !found && i < pw->keys->len; i++) {
    const char *key = g_ptr_array_index(pw->keys, i);
    if (g_str_has_prefix(key, "sha256:"))
      found = sha256 && g_ascii_strcasecmp(key + 7, sha256) == 0 ? g_ptr_array_index(pw->values, i)
                                                                 : NULL;
    else if (fnmatch(key, path, 0) == 0 || fnmatch(key, base, 0) == 0)
      found = g_ptr_array_index(pw->values, i);
  }
  g_free(base);
  return found ? found : pw->fallback;
}
