/* emit_review.c — writes the reviewer outputs of one findings file given on the command
 * line, without a PDF: emit_review FINDINGS.json OUT.csv OUT.sarif HTML_DIR. Lets the
 * Python tests feed hostile text (formulas, markup, quotes, line breaks) that no PDF of
 * the corpus carries and read the outputs back with independent parsers. */
#include <stdio.h>

#include "report/review.h"

int main(int argc, char **argv) {
  if (argc != 5) {
    fprintf(stderr, "usage: emit_review FINDINGS.json OUT.csv OUT.sarif HTML_DIR\n");
    return 2;
  }
  g_autoptr(JsonParser) parser = json_parser_new();
  GError *error = NULL;
  if (!json_parser_load_from_file(parser, argv[1], &error)) {
    fprintf(stderr, "emit_review: %s\n", error->message);
    return 1;
  }
  JsonObject *doc = json_node_get_object(json_parser_get_root(parser));
  pp_csv_writer *csv = pp_csv_writer_new();
  pp_sarif_writer *sarif = pp_sarif_writer_new();
  pp_html_index *idx = pp_html_index_new();
  pp_csv_writer_add_document(csv, doc, NULL, NULL);
  pp_sarif_writer_add_document(sarif, doc, NULL, NULL);
  g_mkdir_with_parents(argv[4], 0755);
  pp_html_index_add(idx, doc, "doc.html");
  gboolean ok = pp_csv_writer_finish(csv, argv[2], &error) &&
                pp_sarif_writer_finish(sarif, argv[3], &error) &&
                pp_html_write_document(argv[4], "doc.html", doc, NULL, NULL, &error) &&
                pp_html_index_finish(idx, argv[4], &error);
  if (!ok)
    fprintf(stderr, "emit_review: %s\n", error->message);
  pp_csv_writer_free(csv);
  pp_sarif_writer_free(sarif);
  pp_html_index_free(idx);
  return ok ? 0 : 1;
}
