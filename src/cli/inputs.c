/* inputs.c — argument expansion. Directories are walked with stat() (so symlinks are
 * followed) while remembering each directory's (device, inode): a symlink loop or a
 * directory reached twice is visited once. Entries are sorted for reproducible runs. */
#include <errno.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>

#include "cli.h"
#include "inputs.h"

typedef struct {
  GPtrArray *inputs;
  GHashTable *seen_files; /* canonical path set */
  GHashTable *seen_dirs;  /* "dev:ino" set */
  guint *n_failed;
} collector;

void pp_input_free(pp_input *input) {
  if (!input)
    return;
  g_free(input->path);
  g_free(input->canonical);
  g_free(input->output_name);
  g_free(input);
}

static gboolean has_pdf_suffix(const char *name) {
  size_t n = strlen(name);
  return n > 4 && g_ascii_strcasecmp(name + n - 4, ".pdf") == 0;
}

static void fail(collector *c, const char *path, const char *word, const char *message) {
  pp_cli_print_file_error(path, word, message);
  (*c->n_failed)++;
}

static void add_file(collector *c, const char *path) {
  char *canonical = realpath(path, NULL);
  if (!canonical) {
    fail(c, path, "unreadable", g_strerror(errno));
    return;
  }
  if (g_hash_table_contains(c->seen_files, canonical)) {
    free(canonical);
    return;
  }
  pp_input *in = g_new0(pp_input, 1);
  in->path = g_strdup(path);
  in->canonical = g_strdup(canonical);
  free(canonical);
  g_hash_table_add(c->seen_files, g_strdup(in->canonical));
  g_ptr_array_add(c->inputs, in);
}

static int compare_names(gconstpointer a, gconstpointer b) {
  return strcmp(*(const char *const *)a, *(const char *const *)b);
}

static void walk(collector *c, const char *dir, const struct stat *st) {
  char *key = g_strdup_printf("%ju:%ju", (uintmax_t)st->st_dev, (uintmax_t)st->st_ino);
  if (!g_hash_table_add(c->seen_dirs, key))
    return; /* already visited: a loop or a second route to the same directory */
  GError *error = NULL;
  GDir *d = g_dir_open(dir, 0, &error);
  if (!d) {
    fail(c, dir, "unreadable", error->message);
    g_error_free(error);
    return;
  }
  GPtrArray *names = g_ptr_array_new_with_free_func(g_free);
  const char *name;
  while ((name = g_dir_read_name(d)))
    g_ptr_array_add(names, g_strdup(name));
  g_dir_close(d);
  g_ptr_array_sort(names, compare_names);
  for (guint i = 0; i < names->len; i++) {
    const char *entry = g_ptr_array_index(names, i);
    char *path = g_build_filename(dir, entry, NULL);
    struct stat est;
    if (stat(path, &est) != 0) {
      if (has_pdf_suffix(entry)) /* a dangling link named like a PDF is worth a line */
        fail(c, path, "unreadable", g_strerror(errno));
    } else if (S_ISDIR(est.st_mode)) {
      walk(c, path, &est);
    } else if (S_ISREG(est.st_mode) && has_pdf_suffix(entry)) {
      add_file(c, path);
    }
    g_free(path);
  }
  g_ptr_array_unref(names);
}

static void add_argument(collector *c, const char *arg) {
  struct stat st;
  if (stat(arg, &st) != 0) {
    fail(c, arg, "unreadable", g_strerror(errno));
    return;
  }
  if (S_ISREG(st.st_mode)) {
    add_file(c, arg); /* any name: the header check decides whether it is a PDF */
  } else if (S_ISDIR(st.st_mode)) {
    guint before = c->inputs->len, failed_before = *c->n_failed;
    walk(c, arg, &st);
    if (c->inputs->len == before && *c->n_failed == failed_before)
      fail(c, arg, "no PDFs", "no *.pdf file found in this directory or below it");
  } else {
    /* FIFOs and devices would block or never end. */
    fail(c, arg, "unreadable", "not a regular file or a directory");
  }
}

/* "<base>.findings.json", base without a .pdf suffix; same-named documents from
 * different places get "-<8 hex of sha256(realpath)>" so none overwrites another. */
static void name_outputs(GPtrArray *inputs) {
  GHashTable *count = g_hash_table_new_full(g_str_hash, g_str_equal, g_free, NULL);
  char **bases = g_new0(char *, inputs->len + 1);
  for (guint i = 0; i < inputs->len; i++) {
    pp_input *in = g_ptr_array_index(inputs, i);
    char *base = g_path_get_basename(in->path);
    if (has_pdf_suffix(base))
      base[strlen(base) - 4] = '\0';
    bases[i] = base;
    /* Case-folded, because the output directory may be on a case-insensitive file system. */
    char *key = g_utf8_casefold(base, -1);
    guint n = GPOINTER_TO_UINT(g_hash_table_lookup(count, key));
    g_hash_table_replace(count, key, GUINT_TO_POINTER(n + 1));
  }
  for (guint i = 0; i < inputs->len; i++) {
    pp_input *in = g_ptr_array_index(inputs, i);
    char *key = g_utf8_casefold(bases[i], -1);
    gboolean clash = GPOINTER_TO_UINT(g_hash_table_lookup(count, key)) > 1;
    g_free(key);
    if (clash) {
      char *hash = g_compute_checksum_for_string(G_CHECKSUM_SHA256, in->canonical, -1);
      hash[8] = '\0';
      in->output_name = g_strdup_printf("%s-%s.findings.json", bases[i], hash);
      g_free(hash);
    } else {
      in->output_name = g_strdup_printf("%s.findings.json", bases[i]);
    }
  }
  g_strfreev(bases);
  g_hash_table_unref(count);
}

GPtrArray *pp_inputs_collect(char **paths, int n_paths, guint *n_failed) {
  collector c = {g_ptr_array_new_with_free_func((GDestroyNotify)pp_input_free),
                 g_hash_table_new_full(g_str_hash, g_str_equal, g_free, NULL),
                 g_hash_table_new_full(g_str_hash, g_str_equal, g_free, NULL), n_failed};
  for (int i = 0; i < n_paths; i++)
    add_argument(&c, paths[i]);
  g_hash_table_unref(c.seen_files);
  g_hash_table_unref(c.seen_dirs);
  name_outputs(c.inputs);
  return c.inputs;
}
