/* csv_out.c — `scan --csv FILE`: one row per finding for the whole batch, RFC 4180
 * (comma, CRLF, fields with comma, quote or line break quoted, quotes doubled), safe to
 * open in a spreadsheet: text that would run as a formula is neutralised. */
#include <math.h>
#include <string.h>

#include "review.h"

struct pp_csv_writer {
  GString *text;
};

static const char *const columns[] = {
    "document", "sha256",     "page",         "figure_id",    "figure_title",   "rule",
    "severity", "status",     "accepted_by",  "accepted_why", "accepted_when",  "headline",
    "detail",   "lie_factor", "growth_ratio", "gdi_percent",  "baseline_value", "worst_pair",
    "x0",       "y0",         "x1",           "y1",           "finding_id",
};

/* OWASP's CSV-injection guidance: a cell starting with = + - @ (or tab, CR) may be
 * run as a formula; a leading apostrophe makes spreadsheets show it as text. */
static gboolean formula_like(const char *s) {
  return s[0] == '=' || s[0] == '+' || s[0] == '-' || s[0] == '@' || s[0] == '\t' || s[0] == '\r';
}

void pp_csv_append_field(GString *out, const char *text, gboolean is_number) {
  if (!text)
    return;
  char *valid = g_utf8_make_valid(text, -1);
  /* A number the tool printed itself cannot be a formula; negative numbers stay numbers. */
  gboolean neutralise = !is_number && formula_like(valid);
  gboolean quote = neutralise || strpbrk(valid, ",\"\r\n") != NULL;
  if (quote)
    g_string_append_c(out, '"');
  if (neutralise)
    g_string_append_c(out, '\'');
  for (const char *p = valid; *p; p++) {
    if (*p == '"')
      g_string_append_c(out, '"');
    g_string_append_c(out, *p);
  }
  if (quote)
    g_string_append_c(out, '"');
  g_free(valid);
}

pp_csv_writer *pp_csv_writer_new(void) {
  pp_csv_writer *w = g_new0(pp_csv_writer, 1);
  w->text = g_string_new(NULL);
  for (guint i = 0; i < G_N_ELEMENTS(columns); i++) {
    if (i)
      g_string_append_c(w->text, ',');
    pp_csv_append_field(w->text, columns[i], FALSE);
  }
  g_string_append(w->text, "\r\n");
  return w;
}

static void add_text(GString *row, const char *s) {
  if (row->len)
    g_string_append_c(row, ',');
  pp_csv_append_field(row, s, FALSE);
}

static void add_number(GString *row, double v) {
  if (row->len)
    g_string_append_c(row, ',');
  if (isfinite(v)) {
    char buf[G_ASCII_DTOSTR_BUF_SIZE];
    g_ascii_formatd(buf, sizeof buf, "%.6g", v);
    pp_csv_append_field(row, buf, TRUE);
  }
}

static void add_row(pp_csv_writer *w, JsonObject *doc, JsonObject *f, const char *status,
                    const pp_rv_acceptance *acc) {
  JsonObject *d = pp_rv_obj(doc, "document");
  JsonObject *m = pp_rv_obj(f, "measures");
  GString *row = g_string_new(NULL);
  add_text(row, pp_rv_str(d, "path"));
  g_string_append_c(row, ',');
  pp_csv_append_field(row, pp_rv_str(d, "sha256"), FALSE);
  add_number(row, pp_rv_num(f, "page"));
  add_text(row, pp_rv_finding_figure_id(doc, f));
  add_text(row, pp_rv_finding_title(doc, f));
  add_text(row, pp_rv_str(f, "rule"));
  add_text(row, pp_rv_str(f, "severity"));
  add_text(row, status);
  add_text(row, acc ? acc->who : NULL);
  add_text(row, acc ? acc->why : NULL);
  add_text(row, acc ? acc->when : NULL);
  add_text(row, pp_rv_finding_headline(f));
  add_text(row, pp_rv_str(f, "message"));
  add_number(row, pp_rv_lie_factor(m));
  add_number(row, pp_rv_growth_ratio(m));
  add_number(row, pp_rv_num(m, "gdi"));
  add_number(row, pp_rv_num(m, "baseline_value"));
  add_number(row, pp_rv_num(m, "max_pair_departure"));
  double box[4] = {NAN, NAN, NAN, NAN};
  pp_rv_rect(f, "bbox", box);
  for (int i = 0; i < 4; i++)
    add_number(row, box[i]);
  add_text(row, pp_rv_str(f, "id"));
  g_string_append(w->text, row->str);
  g_string_append(w->text, "\r\n");
  g_string_free(row, TRUE);
}

void pp_csv_writer_add_document(pp_csv_writer *w, JsonObject *doc, pp_rv_accepted_func accepted,
                                gpointer data) {
  JsonArray *list = pp_rv_arr(doc, "findings");
  for (guint i = 0; list && i < json_array_get_length(list); i++) {
    JsonObject *f = json_array_get_object_element(list, i);
    const pp_rv_acceptance *acc = accepted ? accepted(pp_rv_str(f, "id"), data) : NULL;
    add_row(w, doc, f, acc ? "accepted" : "open", acc);
  }
  /* Findings a baseline moved aside are listed too, marked accepted. */
  list = pp_rv_arr(doc, "accepted");
  for (guint i = 0; list && i < json_array_get_length(list); i++) {
    JsonObject *f = json_array_get_object_element(list, i);
    JsonObject *a = pp_rv_obj(f, "acceptance");
    pp_rv_acceptance acc = {pp_rv_str(a, "who"), pp_rv_str(a, "why"), pp_rv_str(a, "when")};
    add_row(w, doc, f, "accepted", &acc);
  }
}

gboolean pp_csv_writer_finish(pp_csv_writer *w, const char *path, GError **error) {
  return g_file_set_contents(path, w->text->str, (gssize)w->text->len, error);
}

void pp_csv_writer_free(pp_csv_writer *w) {
  if (!w)
    return;
  g_string_free(w->text, TRUE);
  g_free(w);
}
