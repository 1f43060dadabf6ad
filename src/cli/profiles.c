/* profiles.c — profiles: named GLib key files of thresholds and rules (data/profiles/, the
 * user's $XDG_CONFIG_HOME/plotproof/profiles/). A profile becomes option words placed
 * before the configuration file's and the command line's, so both can override it. */
#include <stdio.h>
#include <string.h>

#include "cli.h"

/* Where profiles are looked for, first match wins. */
typedef struct {
  char *dir;
  const char *source; /* "user", "installed", "source tree" */
} profile_dir;

static GArray *profile_dirs(void) {
  GArray *dirs = g_array_new(FALSE, FALSE, sizeof(profile_dir));
  profile_dir user = {g_build_filename(g_get_user_config_dir(), "plotproof", "profiles", NULL),
                      "user"};
  profile_dir installed = {g_strdup(PP_PROFILES_DATADIR), "installed"};
  /* The source tree's data/profiles, so tests and a build that is not installed work. */
  profile_dir source = {g_strdup(PP_PROFILES_SRCDIR), "source tree"};
  g_array_append_val(dirs, user);
  g_array_append_val(dirs, installed);
  g_array_append_val(dirs, source);
  return dirs;
}

static void profile_dirs_free(GArray *dirs) {
  for (guint i = 0; i < dirs->len; i++)
    g_free(g_array_index(dirs, profile_dir, i).dir);
  g_array_unref(dirs);
}

/* The file of a profile: NAME in the profile directories, or a path to a .ini file. */
static char *profile_path(const char *name, const char **source) {
  *source = "file";
  if (strchr(name, '/') || g_str_has_suffix(name, ".ini"))
    return g_file_test(name, G_FILE_TEST_IS_REGULAR) ? g_strdup(name) : NULL;
  GArray *dirs = profile_dirs();
  char *file = g_strconcat(name, ".ini", NULL), *found = NULL;
  for (guint i = 0; !found && i < dirs->len; i++) {
    const profile_dir *d = &g_array_index(dirs, profile_dir, i);
    char *path = g_build_filename(d->dir, file, NULL);
    if (g_file_test(path, G_FILE_TEST_IS_REGULAR)) {
      found = path;
      *source = d->source;
    } else {
      g_free(path);
    }
  }
  g_free(file);
  profile_dirs_free(dirs);
  return found;
}

gboolean pp_cli_profile_words(const char *name, GPtrArray *words) {
  const char *source;
  char *path = profile_path(name, &source);
  if (!path) {
    fprintf(stderr, "plotproof: no profile '%s'; 'plotproof profiles' lists them\n", name);
    return FALSE;
  }
  g_autoptr(GKeyFile) kf = g_key_file_new();
  GError *error = NULL;
  if (!g_key_file_load_from_file(kf, path, G_KEY_FILE_NONE, &error)) {
    pp_cli_print_file_error(path, "unreadable profile", error->message);
    g_error_free(error);
    g_free(path);
    return FALSE;
  }
  g_free(path);
  gsize n = 0;
  char **keys = g_key_file_get_keys(kf, "thresholds", &n, NULL);
  for (gsize i = 0; i < n; i++) {
    char *value = g_key_file_get_value(kf, "thresholds", keys[i], NULL);
    g_ptr_array_add(words, g_strdup_printf("--%s=%s", keys[i], value));
    g_free(value);
  }
  g_strfreev(keys);
  n = 0; /* left as it was when the group is missing */
  keys = g_key_file_get_keys(kf, "rules", &n, NULL);
  for (gsize i = 0; i < n; i++) {
    gboolean on = g_key_file_get_boolean(kf, "rules", keys[i], NULL);
    g_ptr_array_add(words, g_strdup_printf("--%s-rule=%s", on ? "enable" : "disable", keys[i]));
  }
  g_strfreev(keys);
  return TRUE;
}

static int compare_names(gconstpointer a, gconstpointer b) {
  return strcmp(*(char *const *)a, *(char *const *)b);
}

int pp_cli_profiles(void) {
  GArray *dirs = profile_dirs();
  GPtrArray *names = g_ptr_array_new_with_free_func(g_free);
  for (guint i = 0; i < dirs->len; i++) {
    GDir *dir = g_dir_open(g_array_index(dirs, profile_dir, i).dir, 0, NULL);
    const char *entry;
    while (dir && (entry = g_dir_read_name(dir)))
      if (g_str_has_suffix(entry, ".ini"))
        g_ptr_array_add(names, g_strndup(entry, strlen(entry) - 4));
    if (dir)
      g_dir_close(dir);
  }
  g_ptr_array_sort(names, compare_names);
  for (guint i = 0; i < names->len; i++) {
    const char *name = g_ptr_array_index(names, i);
    if (i > 0 && strcmp(name, g_ptr_array_index(names, i - 1)) == 0)
      continue; /* a user profile of the same name hides the shipped one */
    const char *source;
    char *path = profile_path(name, &source);
    g_autoptr(GKeyFile) kf = g_key_file_new();
    char *summary = NULL;
    if (g_key_file_load_from_file(kf, path, G_KEY_FILE_NONE, NULL))
      summary = g_key_file_get_string(kf, "profile", "summary", NULL);
    printf("%-22s %s\n%-22s   %s: %s\n", name, summary ? summary : "(no summary)", "", source,
           path);
    g_free(summary);
    g_free(path);
  }
  g_ptr_array_unref(names);
  profile_dirs_free(dirs);
  return PP_EXIT_CLEAN;
}

gboolean pp_cli_enable_rule(pp_cli_options *opt, const char *id) {
  if (pp_thresholds_enable_rule(&opt->thresholds, id))
    return TRUE;
  guint n = 0;
  const pp_rule_info *rules = pp_rules_list(&n);
  gboolean known = FALSE;
  for (guint i = 0; i < n; i++)
    known |= strcmp(rules[i].id, id) == 0;
  /* A rule of the main table is on unless disabled: undo earlier --disable-rule words. */
  for (guint i = opt->disabled_rules ? opt->disabled_rules->len : 0; known && i-- > 0;)
    if (strcmp(g_ptr_array_index(opt->disabled_rules, i), id) == 0)
      g_ptr_array_remove_index(opt->disabled_rules, i);
  if (!known)
    fprintf(stderr, "plotproof: no rule '%s'; 'plotproof rules' lists them\n", id);
  return known;
}
