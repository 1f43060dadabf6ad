/* inputs.c — argument expansion. Directories are walked with stat() (so symlinks are
 * followed) while remembering each directory's (device, inode): a symlink loop or a
 * directory reached twice is visited once. Entries are sorted for reproducible runs;
 * special files (FIFOs, sockets, devices) get a line instead of silence. */
#include <errno.h>
#include <fcntl.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "cli.h"
#include "inputs.h"

/* NAME_MAX is 255 bytes on Linux file systems; ".findings.json" (14), "-" and an 8-hex tag
 * (9) and a margin for editors' backup suffixes leave about 200 for the base. */
#define PP_INPUTS_BASE_MAX 200

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
  g_free(input->rel_dir);
  g_free(input->output_name);
  g_free(input->sha256);
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

static void add_file(collector *c, const char *path, const char *rel_dir) {
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
  in->rel_dir = g_strdup(rel_dir);
  in->primary = -1;
  free(canonical);
  g_hash_table_add(c->seen_files, g_strdup(in->canonical));
  g_ptr_array_add(c->inputs, in);
}

static int compare_names(gconstpointer a, gconstpointer b) {
  return strcmp(*(const char *const *)a, *(const char *const *)b);
}

static const char *special_kind(mode_t mode) {
  if (S_ISFIFO(mode))
    return "a FIFO";
  if (S_ISSOCK(mode))
    return "a socket";
  if (S_ISCHR(mode) || S_ISBLK(mode))
    return "a device";
  return "not a regular file";
}

static void walk(collector *c, const char *dir, const char *rel, const struct stat *st) {
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
    char *sub = *rel ? g_build_filename(rel, entry, NULL) : g_strdup(entry);
    struct stat est;
    if (stat(path, &est) != 0) {
      if (has_pdf_suffix(entry)) /* a dangling link named like a PDF is worth a line */
        fail(c, path, "unreadable", g_strerror(errno));
    } else if (S_ISDIR(est.st_mode)) {
      walk(c, path, sub, &est);
    } else if (S_ISREG(est.st_mode)) {
      if (has_pdf_suffix(entry))
        add_file(c, path, rel);
    } else {
      /* Reading a FIFO would block the batch; say why it is left out. */
      pp_cli_print_file_error(path, "skipped", special_kind(est.st_mode));
    }
    g_free(sub);
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
    add_file(c, arg, ""); /* any name: the header check decides whether it is a PDF */
  } else if (S_ISDIR(st.st_mode)) {
    guint before = c->inputs->len, failed_before = *c->n_failed;
    walk(c, arg, "", &st);
    if (c->inputs->len == before && *c->n_failed == failed_before)
      fail(c, arg, "no PDFs", "no *.pdf file found in this directory or below it");
  } else {
    /* FIFOs and devices would block or never end. */
    fail(c, arg, "unreadable", special_kind(st.st_mode));
  }
}

/* One path per line; blank lines ignored; a trailing CR (from Windows editors) dropped. */
static gboolean add_list(collector *c, const char *from) {
  FILE *f = strcmp(from, "-") == 0 ? stdin : fopen(from, "r");
  if (!f) {
    fail(c, from, "unreadable", g_strerror(errno));
    return FALSE;
  }
  char *line = NULL;
  size_t cap = 0;
  ssize_t n;
  while ((n = getline(&line, &cap, f)) >= 0) {
    while (n > 0 && (line[n - 1] == '\n' || line[n - 1] == '\r'))
      line[--n] = '\0';
    if (n > 0)
      add_argument(c, line);
  }
  gboolean ok = !ferror(f);
  if (!ok)
    fail(c, from, "unreadable", g_strerror(errno));
  free(line);
  if (f != stdin)
    fclose(f);
  return ok;
}

char *pp_inputs_output_base(const char *path, const char *tag) {
  char *base = g_path_get_basename(path);
  if (has_pdf_suffix(base))
    base[strlen(base) - 4] = '\0';
  if (!*base || strcmp(base, ".") == 0 || strcmp(base, "..") == 0 || strchr(base, '/')) {
    g_free(base);
    base = g_strdup("document");
  }
  gboolean cut = strlen(base) > PP_INPUTS_BASE_MAX;
  if (cut) {
    size_t n = PP_INPUTS_BASE_MAX;
    while (n > 0 && ((guchar)base[n] & 0xC0) == 0x80) /* never split a UTF-8 sequence */
      n--;
    base[n] = '\0';
  }
  (void)cut; /* a cut base is made unique by the caller's tag */
  char *name = tag ? g_strdup_printf("%s-%s.findings.json", base, tag)
                   : g_strdup_printf("%s.findings.json", base);
  g_free(base);
  return name;
}

static gboolean base_too_long(const char *path) {
  char *base = g_path_get_basename(path);
  size_t n = strlen(base) - (has_pdf_suffix(base) ? 4 : 0);
  g_free(base);
  return n > PP_INPUTS_BASE_MAX;
}

static char *short_tag(const char *canonical) {
  char *hash = g_compute_checksum_for_string(G_CHECKSUM_SHA256, canonical, -1);
  hash[8] = '\0';
  return hash;
}

static char *relative_name(const pp_input *in, const char *tag) {
  char *base = pp_inputs_output_base(in->path, tag);
  char *name = *in->rel_dir ? g_build_filename(in->rel_dir, base, NULL) : g_strdup(base);
  g_free(base);
  return name;
}

/* Names mirror the input folders; names that would still collide (case-folded, since the
 * output may be on a case-insensitive file system) or were cut get "-<8 hex of
 * sha256(realpath)>" so none overwrites another, in this run or the next. */
static void name_outputs(GPtrArray *inputs) {
  GHashTable *count = g_hash_table_new_full(g_str_hash, g_str_equal, g_free, NULL);
  char **names = g_new0(char *, inputs->len + 1);
  for (guint i = 0; i < inputs->len; i++) {
    names[i] = relative_name(g_ptr_array_index(inputs, i), NULL);
    char *key = g_utf8_casefold(names[i], -1);
    guint n = GPOINTER_TO_UINT(g_hash_table_lookup(count, key));
    g_hash_table_replace(count, key, GUINT_TO_POINTER(n + 1));
  }
  for (guint i = 0; i < inputs->len; i++) {
    pp_input *in = g_ptr_array_index(inputs, i);
    char *key = g_utf8_casefold(names[i], -1);
    gboolean clash = GPOINTER_TO_UINT(g_hash_table_lookup(count, key)) > 1;
    g_free(key);
    if (clash || base_too_long(in->path)) {
      char *tag = short_tag(in->canonical);
      in->output_name = relative_name(in, tag);
      g_free(tag);
    } else {
      in->output_name = g_strdup(names[i]);
    }
  }
  g_strfreev(names);
  g_hash_table_unref(count);
}

/* Hashes every input; an unreadable one is reported and dropped; later copies of the same
 * content point to the first (primary). */
static void hash_inputs(GPtrArray *inputs, guint *n_failed) {
  GHashTable *first = g_hash_table_new(g_str_hash, g_str_equal);
  for (guint i = 0; i < inputs->len;) {
    pp_input *in = g_ptr_array_index(inputs, i);
    GError *error = NULL;
    if (pp_file_digest_compute(in->path, &in->digest, &error)) {
      in->sha256 = g_strdup(in->digest.sha256);
      in->size = in->digest.identity.size;
    }
    if (!in->sha256) {
      pp_cli_print_file_error(in->path, "unreadable", error->message);
      g_error_free(error);
      (*n_failed)++;
      g_ptr_array_remove_index(inputs, i);
      continue;
    }
    i++;
  }
  for (guint i = 0; i < inputs->len; i++) {
    pp_input *in = g_ptr_array_index(inputs, i);
    gpointer idx;
    if (g_hash_table_lookup_extended(first, in->sha256, NULL, &idx))
      in->primary = GPOINTER_TO_INT(idx);
    else
      g_hash_table_insert(first, in->sha256, GINT_TO_POINTER((int)i));
  }
  g_hash_table_unref(first);
}

GPtrArray *pp_inputs_collect(char **paths, int n_paths, const char *from, guint *n_failed) {
  collector c = {g_ptr_array_new_with_free_func((GDestroyNotify)pp_input_free),
                 g_hash_table_new_full(g_str_hash, g_str_equal, g_free, NULL),
                 g_hash_table_new_full(g_str_hash, g_str_equal, g_free, NULL), n_failed};
  for (int i = 0; i < n_paths; i++)
    add_argument(&c, paths[i]);
  gboolean list_ok = !from || add_list(&c, from);
  g_hash_table_unref(c.seen_files);
  g_hash_table_unref(c.seen_dirs);
  if (!list_ok) {
    g_ptr_array_unref(c.inputs);
    return NULL;
  }
  hash_inputs(c.inputs, n_failed);
  name_outputs(c.inputs);
  return c.inputs;
}

guint pp_inputs_shard_of(const char *sha256, guint n) {
  /* The first 8 hex digits are uniformly distributed (SHA-256 output, FIPS 180-4). */
  char head[9] = {0};
  memcpy(head, sha256, MIN(strlen(sha256), 8));
  guint64 v = g_ascii_strtoull(head, NULL, 16);
  return n ? (guint)(v % n) + 1 : 1;
}

void pp_input_retag(pp_input *in) {
  char *tag = short_tag(in->canonical);
  g_free(in->output_name);
  in->output_name = relative_name(in, tag);
  g_free(tag);
}
