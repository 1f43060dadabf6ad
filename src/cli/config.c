/* config.c — the configuration file: a GLib key file (--config FILE, else
 * $XDG_CONFIG_HOME/plotproof/config when it exists) whose keys are the long options of
 * `scan`. They are turned into "--key=value" words placed before the user's own, so the
 * one option parser checks them and the command line wins (the last value counts).
 *
 *   [thresholds]   lie-band=0.95:1.05  gdi-limit=10
 *   [output]       output=out/  html=pack/  csv=all.csv  sarif=all.sarif  annotate=true
 *   [scan]         timeout=120  baseline=accepted.ini  profile=strict
 *   [rules]        bars-on-log=false            (a rule off)
 *   [rule bars-off-zero]  min-severity=major (per-rule option)
 */
#include <stdio.h>
#include <string.h>

#include "cli.h"

static const char *const option_groups[] = {"thresholds", "output", "scan"};

/* true/false keys are switches: true adds --key, false adds nothing. */
static void add_key(GPtrArray *words, GKeyFile *kf, const char *group, const char *key) {
  char *value = g_key_file_get_value(kf, group, key, NULL);
  if (!value)
    return;
  if (g_ascii_strcasecmp(value, "true") == 0)
    g_ptr_array_add(words, g_strdup_printf("--%s", key));
  else if (g_ascii_strcasecmp(value, "false") != 0)
    g_ptr_array_add(words, g_strdup_printf("--%s=%s", key, value));
  g_free(value);
}

static void add_rules(GPtrArray *words, GKeyFile *kf) {
  gsize n = 0;
  char **keys = g_key_file_get_keys(kf, "rules", &n, NULL);
  for (gsize i = 0; i < n; i++)
    if (!g_key_file_get_boolean(kf, "rules", keys[i], NULL))
      g_ptr_array_add(words, g_strdup_printf("--disable-rule=%s", keys[i]));
  g_strfreev(keys);
  char **groups = g_key_file_get_groups(kf, NULL);
  for (guint i = 0; groups[i]; i++) {
    if (!g_str_has_prefix(groups[i], "rule "))
      continue;
    char *value = g_key_file_get_string(kf, groups[i], "min-severity", NULL);
    if (value)
      g_ptr_array_add(words, g_strdup_printf("--min-severity=%s=%s", groups[i] + 5, value));
    g_free(value);
  }
  g_strfreev(groups);
}

/* The value of the last --profile NAME (or --profile=NAME) on the command line, else NULL. */
static const char *profile_argument(int argc, char **argv) {
  const char *name = NULL;
  for (int i = 2; i < argc; i++) {
    if (strcmp(argv[i], "--profile") == 0 && i + 1 < argc)
      name = argv[++i];
    else if (g_str_has_prefix(argv[i], "--profile="))
      name = argv[i] + 10;
  }
  return name;
}

/* The file named by --config (or --config=FILE), "" for --no-config, else NULL. */
static const char *config_argument(int argc, char **argv) {
  for (int i = 1; i < argc; i++) {
    if (strcmp(argv[i], "--no-config") == 0)
      return "";
    if (strcmp(argv[i], "--config") == 0 && i + 1 < argc)
      return argv[i + 1];
    if (g_str_has_prefix(argv[i], "--config="))
      return argv[i] + 9;
  }
  return NULL;
}

char **pp_cli_config_argv(int argc, char **argv, int *new_argc) {
  const char *given = config_argument(argc, argv);
  char *path = given ? g_strdup(given)
                     : g_build_filename(g_get_user_config_dir(), "plotproof", "config", NULL);
  GPtrArray *words = g_ptr_array_new_with_free_func(g_free);
  g_ptr_array_add(words, g_strdup(argv[0]));
  if (argc > 1)
    g_ptr_array_add(words, g_strdup(argv[1]));
  /* Only `scan` reads the file: its keys are scan options. */
  gboolean scan = argc > 1 && strcmp(argv[1], "scan") == 0;
  char *profile = NULL; /* the configuration's [scan] profile */
  GPtrArray *config = g_ptr_array_new_with_free_func(g_free), *user = words;
  words = config;
  if (scan && path[0] && (given || g_file_test(path, G_FILE_TEST_EXISTS))) {
    g_autoptr(GKeyFile) kf = g_key_file_new();
    GError *error = NULL;
    if (!g_key_file_load_from_file(kf, path, G_KEY_FILE_NONE, &error)) {
      pp_cli_print_file_error(path, "unreadable configuration", error->message);
      g_error_free(error);
      g_free(path);
      g_ptr_array_unref(config);
      g_ptr_array_unref(user);
      return NULL;
    }
    profile = g_key_file_get_string(kf, "scan", "profile", NULL);
    for (guint g = 0; g < G_N_ELEMENTS(option_groups); g++) {
      gsize n = 0;
      char **keys = g_key_file_get_keys(kf, option_groups[g], &n, NULL);
      for (gsize i = 0; i < n; i++)
        add_key(words, kf, option_groups[g], keys[i]);
      g_strfreev(keys);
    }
    add_rules(words, kf);
  }
  g_free(path);
  /* The profile's words first, then the configuration's, then the command line's: the
   * last value of an option counts. */
  words = user;
  const char *name = profile_argument(argc, argv);
  if (scan && (name || profile) && !pp_cli_profile_words(name ? name : profile, words)) {
    g_free(profile);
    g_ptr_array_unref(config);
    g_ptr_array_unref(words);
    return NULL;
  }
  g_free(profile);
  for (guint i = 0; i < config->len; i++)
    g_ptr_array_add(words, g_strdup(g_ptr_array_index(config, i)));
  g_ptr_array_unref(config);
  for (int i = 2; i < argc; i++)
    g_ptr_array_add(words, g_strdup(argv[i]));
  *new_argc = (int)words->len;
  g_ptr_array_add(words, NULL);
  g_ptr_array_set_free_func(words, NULL);
  return (char **)g_ptr_array_free(words, FALSE);
}
