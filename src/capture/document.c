/* document.c — opening a PDF with a precise error for each way it can fail, its
 * identity (size, SHA-256, metadata), and the per-page capture driver around the tap. */
#include <errno.h>
#include <fcntl.h>
#include <math.h>
#include <string.h>
#include <unistd.h>

#include "internal.h"

/* Device units per page point while tapping. cairo keeps paths in 24.8 fixed point,
 * so 4× gives 1/1024 pt resolution and still leaves ±2 million pt of range. */
#define PP_CAPTURE_SCALE 4.0

struct pp_document {
  PopplerDocument *poppler;
  pp_document_info info;
  GPtrArray *tree_warnings; /* poppler's messages while walking the page tree, for page 1 */
};

G_DEFINE_QUARK(pp - capture - error - quark, pp_capture_error)

const char *pp_capture_error_word(int code) {
  switch (code) {
  case PP_CAPTURE_ERROR_UNREADABLE: return "unreadable";
  case PP_CAPTURE_ERROR_EMPTY: return "empty";
  case PP_CAPTURE_ERROR_NOT_PDF: return "not a PDF";
  case PP_CAPTURE_ERROR_DAMAGED: return "damaged";
  case PP_CAPTURE_ERROR_ENCRYPTED: return "encrypted";
  case PP_CAPTURE_ERROR_PAGE: return "page failed";
  case PP_CAPTURE_ERROR_TAP: return "capture unavailable";
  default: return "error";
  }
}

/* ISO 32000-1 §7.5.2: the header "%PDF-" should open the file, but readers accept
 * it within the first 1024 bytes (common practice, e.g. a mail header before it). */
static gboolean has_pdf_header(const char *data, gsize len) {
  gsize limit = MIN(len, 1024);
  for (gsize i = 0; i + 5 <= limit; i++)
    if (memcmp(data + i, "%PDF-", 5) == 0)
      return TRUE;
  return FALSE;
}

static GPtrArray *current_warnings;
static void collect_poppler_log(const char *domain, GLogLevelFlags level, const char *message,
                                gpointer user_data);

static pp_document *open_poppler(const char *path, const char *password, char *sha, guint64 len,
                                 GError **error);

static char *dup_or_null(char *s) {
  if (s && !*s) {
    g_free(s);
    return NULL;
  }
  return s;
}

/* The known digest, when the file at path still has the identity it was read with and
 * starts like a PDF; NULL sends the caller to read and hash every byte. */
static char *known_digest(const char *path, const pp_file_digest *known, guint64 *size) {
  if (!known || !known->trusted)
    return NULL;
  int fd = open(path, O_RDONLY | O_CLOEXEC | O_NONBLOCK);
  if (fd < 0)
    return NULL;
  pp_file_identity now;
  char head[1024];
  ssize_t n = 0;
  gboolean same =
      pp_file_identity_of_fd(fd, &now) && pp_file_identity_equal(&now, &known->identity);
  if (same)
    n = pread(fd, head, sizeof head, 0);
  close(fd);
  if (!same || n <= 0 || !has_pdf_header(head, (gsize)n))
    return NULL;
  *size = now.size;
  return g_strdup(known->sha256);
}

pp_document *pp_document_open(const char *path, const char *password, GError **error) {
  return pp_document_open_digested(path, password, NULL, error);
}

pp_document *pp_document_open_digested(const char *path, const char *password,
                                       const pp_file_digest *known, GError **error) {
  g_return_val_if_fail(path != NULL, NULL);
  GError *local = NULL;
  guint64 known_size = 0;
  char *sha = known_digest(path, known, &known_size);
  if (sha)
    return open_poppler(path, password, sha, known_size, error);
  GMappedFile *mapped = g_mapped_file_new(path, FALSE, &local);
  if (!mapped) {
    g_set_error(error, PP_CAPTURE_ERROR, PP_CAPTURE_ERROR_UNREADABLE, "%s", local->message);
    g_error_free(local);
    return NULL;
  }
  const char *data = g_mapped_file_get_contents(mapped);
  gsize len = g_mapped_file_get_length(mapped);
  if (len == 0) {
    g_mapped_file_unref(mapped);
    g_set_error(error, PP_CAPTURE_ERROR, PP_CAPTURE_ERROR_EMPTY, "the file is empty (0 bytes)");
    return NULL;
  }
  if (!has_pdf_header(data, len)) {
    g_mapped_file_unref(mapped);
    g_set_error(error, PP_CAPTURE_ERROR, PP_CAPTURE_ERROR_NOT_PDF,
                "no %%PDF- header in the first 1024 bytes");
    return NULL;
  }
  sha = pp_sha256_hex(data, len);
  g_mapped_file_unref(mapped);
  return open_poppler(path, password, sha, len, error);
}

/* Opens the checked file with poppler; takes sha. */
static pp_document *open_poppler(const char *path, const char *password, char *sha, guint64 len,
                                 GError **error) {
  GError *local = NULL;
  GFile *file = g_file_new_for_path(path);
  char *uri = g_file_get_uri(file);
  g_object_unref(file);
  PopplerDocument *pd = poppler_document_new_from_file(uri, password, &local);
  g_free(uri);
  if (!pd) {
    gboolean enc = g_error_matches(local, POPPLER_ERROR, POPPLER_ERROR_ENCRYPTED);
    if (enc)
      g_set_error(error, PP_CAPTURE_ERROR, PP_CAPTURE_ERROR_ENCRYPTED,
                  password ? "encrypted, and the given --password is wrong"
                           : "encrypted; give the password with --password");
    else
      g_set_error(error, PP_CAPTURE_ERROR, PP_CAPTURE_ERROR_DAMAGED, "damaged: %s",
                  local ? local->message : "poppler cannot parse it");
    g_clear_error(&local);
    g_free(sha);
    return NULL;
  }
  /* fontconfig is left to load on first use (about 28 M instructions): a document whose
   * fonts are all embedded never needs it, and one page process now takes a whole
   * document, so loading it here would save nothing. */
  int n_pages = poppler_document_get_n_pages(pd);
  if (n_pages <= 0) {
    g_object_unref(pd);
    g_free(sha);
    g_set_error(error, PP_CAPTURE_ERROR, PP_CAPTURE_ERROR_DAMAGED, "damaged: no pages");
    return NULL;
  }
  pp_document *doc = g_new0(pp_document, 1);
  doc->poppler = pd;
  /* poppler finds page i by walking the page tree up to it, keeping what it walked. Walked
   * here once, before the page processes fork, it is not walked again by each of them up to
   * its first page (on the 300-page report 124 M instructions against 22 M, and quadratic
   * in the length). What poppler says on the way is page 1's warning. */
  doc->tree_warnings = g_ptr_array_new_with_free_func(g_free);
  current_warnings = doc->tree_warnings;
  guint handler = g_log_set_handler("Poppler", G_LOG_LEVEL_MASK, collect_poppler_log, NULL);
  PopplerPage *last = poppler_document_get_page(pd, n_pages - 1);
  g_log_remove_handler("Poppler", handler);
  current_warnings = NULL;
  if (last)
    g_object_unref(last);
  doc->info.path = g_strdup(path);
  doc->info.size = len;
  doc->info.sha256 = sha;
  doc->info.n_pages = (guint)n_pages;
  doc->info.pdf_version = dup_or_null(poppler_document_get_pdf_version_string(pd));
  doc->info.producer = dup_or_null(poppler_document_get_producer(pd));
  doc->info.creator = dup_or_null(poppler_document_get_creator(pd));
  doc->info.title = dup_or_null(poppler_document_get_title(pd));
  return doc;
}

void pp_document_free(pp_document *doc) {
  if (!doc)
    return;
  g_clear_object(&doc->poppler);
  g_clear_pointer(&doc->tree_warnings, g_ptr_array_unref);
  g_free(doc->info.path);
  g_free(doc->info.sha256);
  g_free(doc->info.pdf_version);
  g_free(doc->info.producer);
  g_free(doc->info.creator);
  g_free(doc->info.title);
  g_free(doc);
}

const pp_document_info *pp_document_get_info(const pp_document *doc) {
  return &doc->info;
}

/* A first guess at the way back to PDF space, before the page is drawn: poppler-glib has
 * no /Rotate getter, and a W/H swap against the crop box reveals only 90/270 on non-square
 * pages. The tap replaces it with poppler's own base matrix as soon as it sees it. */
static void set_pdf_mapping(PopplerPage *page, pp_scene *scene) {
  PopplerRectangle crop;
  poppler_page_get_crop_box(page, &crop);
  scene->crop_box = (pp_rect){MIN(crop.x1, crop.x2), MIN(crop.y1, crop.y2), MAX(crop.x1, crop.x2),
                              MAX(crop.y1, crop.y2)};
  double cw = pp_rect_width(scene->crop_box), ch = pp_rect_height(scene->crop_box);
  gboolean swapped =
      fabs(cw - ch) > 0.5 && fabs(scene->width - ch) < 0.5 && fabs(scene->height - cw) < 0.5;
  scene->rotation = swapped ? 90 : 0;
  double cx1 = scene->crop_box.x0, cy1 = scene->crop_box.y0, cy2 = scene->crop_box.y1;
  if (scene->rotation == 90) /* device (u,v) = (y − cy1, x − cx1) → x = v + cx1, y = u + cy1 */
    scene->to_pdf = (pp_matrix){0, 1, 1, 0, cx1, cy1};
  else /* device (u,v) = (x − cx1, cy2 − y) → x = u + cx1, y = cy2 − v */
    scene->to_pdf = (pp_matrix){1, 0, 0, -1, cx1, cy2};
}

/* poppler reports syntax errors through g_log at INFO level in domain "Poppler";
 * we collect them per page so damage never passes silently. */

static void collect_poppler_log(const char *domain, GLogLevelFlags level, const char *message,
                                gpointer user_data) {
  (void)domain, (void)level, (void)user_data;
  if (current_warnings && current_warnings->len < 50)
    g_ptr_array_add(current_warnings, g_strdup(message));
}

pp_scene *pp_document_capture_page(pp_document *doc, guint index, GError **error) {
  g_return_val_if_fail(doc != NULL, NULL);
  if (index >= doc->info.n_pages) {
    g_set_error(error, PP_CAPTURE_ERROR, PP_CAPTURE_ERROR_PAGE, "page %u does not exist (%u pages)",
                index + 1, doc->info.n_pages);
    return NULL;
  }
  PopplerPage *page = poppler_document_get_page(doc->poppler, (int)index);
  if (!page) {
    g_set_error(error, PP_CAPTURE_ERROR, PP_CAPTURE_ERROR_PAGE, "page %u cannot be loaded",
                index + 1);
    return NULL;
  }
  double w, h;
  poppler_page_get_size(page, &w, &h);
  pp_scene *scene = pp_scene_new(index, w, h);
  set_pdf_mapping(page, scene);

  for (guint i = 0; index == 0 && i < doc->tree_warnings->len; i++)
    g_ptr_array_add(scene->warnings, g_strdup(g_ptr_array_index(doc->tree_warnings, i)));
  current_warnings = scene->warnings;
  guint handler = g_log_set_handler("Poppler", G_LOG_LEVEL_MASK, collect_poppler_log, NULL);

  /* An unbounded recording surface: nothing reaches it (the tap swallows drawing
   * ops), but it accepts any coordinates, unlike an image surface. */
  cairo_surface_t *target = cairo_recording_surface_create(CAIRO_CONTENT_COLOR_ALPHA, NULL);
  cairo_t *cr = cairo_create(target);
  cairo_scale(cr, PP_CAPTURE_SCALE, PP_CAPTURE_SCALE);
  pp_tap_begin(cr, PP_CAPTURE_SCALE, scene);
  poppler_page_render_for_printing(page, cr);
  pp_tap_end();
  cairo_status_t status = cairo_status(cr);
  cairo_destroy(cr);
  cairo_surface_destroy(target);

  /* Text extraction parses the page again: its warnings would repeat the render's. */
  g_log_remove_handler("Poppler", handler);
  current_warnings = NULL;
  pp_text_capture(page, scene);
  g_object_unref(page);

  if (status != CAIRO_STATUS_SUCCESS)
    g_ptr_array_add(scene->warnings,
                    g_strdup_printf("cairo stopped drawing this page: %s; later marks are lost",
                                    cairo_status_to_string(status)));
  /* A page with text but no marks at all usually means the content stream was lost. */
  if (scene->marks->len == 0 && scene->words->len > 0)
    g_ptr_array_add(scene->warnings, g_strdup("text but no painted marks: content may be lost"));
  return scene;
}
