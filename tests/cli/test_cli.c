/* test_cli.c — units of the batch: terminal escaping (ECMA-48 control functions), the
 * password file, shard stability, the batch record reader, output names within NAME_MAX
 * (POSIX), and the joining of page results into document totals, reading malformed worker
 * lines without json-glib warnings. */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <string.h>

#include <cmocka.h>

#include "cli/assemble.h"
#include "cli/cli.h"
#include "cli/inputs.h"
#include "cli/json_text.h"
#include "cli/passwords.h"
#include "cli/record.h"

static void escape_controls(void **state) {
  (void)state;
  /* ECMA-48 §5: C0 (0x00-0x1F), DEL and C1 (U+0080-U+009F) are control functions. */
  char *s = pp_cli_escape("a\x1b[31mb\nc\x07\x7f\xc2\x9b"
                          "d");
  assert_string_equal(s, "a\\x1B[31mb\\x0Ac\\x07\\x7F\\u009Bd");
  g_free(s);
  s = pp_cli_escape("caf\xc3\xa9 \xff"); /* é kept, an invalid byte shown */
  assert_string_equal(s, "caf\xc3\xa9 \\xFF");
  g_free(s);
}

static void passwords(void **state) {
  (void)state;
  pp_passwords *pw = pp_passwords_parse("# c\n\nsha256:ABCD secret one\r\n*.pdf  two\n"
                                        "reports/*.pdf three\nlonely\n",
                                        "fallback");
  assert_string_equal(pp_passwords_lookup(pw, "x/y.pdf", "abcd"), "secret one");
  assert_string_equal(pp_passwords_lookup(pw, "reports/y.pdf", "00"), "two"); /* first wins */
  assert_string_equal(pp_passwords_lookup(pw, "y.txt", "00"), "fallback");
  pp_passwords_free(pw);
  pw = pp_passwords_parse("", NULL);
  assert_null(pp_passwords_lookup(pw, "a.pdf", "00"));
  pp_passwords_free(pw);
}

static void shards(void **state) {
  (void)state;
  /* A stable function of the hash: 0x0000000a % 3 = 1 → shard 2. */
  assert_int_equal(pp_inputs_shard_of("0000000aff", 3), 2);
  assert_int_equal(pp_inputs_shard_of("ffffffff", 1), 1);
  guint count[4] = {0};
  for (int i = 0; i < 3000; i++) {
    char *h = g_compute_checksum_for_data(G_CHECKSUM_SHA256, (const guchar *)&i, sizeof i);
    count[pp_inputs_shard_of(h, 3)]++;
    g_free(h);
  }
  for (int k = 1; k <= 3; k++) /* binomial(3000, 1/3): mean 1000, sd 26; 6 sd margin */
    assert_true(count[k] > 840 && count[k] < 1160);
}

static void record_reader(void **state) {
  (void)state;
  const char *text = "{\"output\":\"a.findings.json\",\"status\":\"failed\"}\n"
                     "garbage\n"
                     "{\"output\":\"b.findings.json\",\"status\":\"ok\"}\n"
                     "{\"output\":\"a.findings.json\",\"status\":\"ok\"}\n"
                     "{\"summary\":{\"shard\":\"2/3\"}}\n"
                     "{\"output\":\"c.findings.json\",\"sta"; /* cut by kill -9 */
  JsonObject *summary = NULL;
  GHashTable *t = pp_records_parse(text, strlen(text), &summary);
  assert_int_equal(g_hash_table_size(t), 2);
  JsonObject *a = g_hash_table_lookup(t, "a.findings.json");
  assert_string_equal(json_object_get_string_member(a, "status"), "ok"); /* the later line */
  assert_non_null(summary);
  assert_string_equal(json_object_get_string_member(summary, "shard"), "2/3");
  json_object_unref(summary);
  g_hash_table_unref(t);
  pp_record r = {.path = "p\n.pdf", .output = "o", .status = "ok", .seconds = 1.5};
  char *line = pp_record_to_line(&r);
  assert_null(strchr(line, '\n')); /* JSON Lines: one line per record */
  t = pp_records_parse(line, strlen(line), NULL);
  assert_int_equal(g_hash_table_size(t), 1);
  g_hash_table_unref(t);
  g_free(line);
  /* Two objects glued on one line (found by fuzz_records): not a record, and json-glib 1.6
   * keeps the last object and loses the first unfreed (seen with valgrind). */
  const char *glued = "{\"output\":\"a\"}{\"output\":\"b\"}\n{\"output\":\"c\"} \n";
  t = pp_records_parse(glued, strlen(glued), NULL);
  assert_int_equal(g_hash_table_size(t), 1);
  assert_non_null(g_hash_table_lookup(t, "c"));
  g_hash_table_unref(t);
}

static void output_names(void **state) {
  (void)state;
  char *n = pp_inputs_output_base("dir/report.PDF", NULL);
  assert_string_equal(n, "report.findings.json");
  g_free(n);
  GString *long_name = g_string_new("dir/");
  for (int i = 0; i < 120; i++)
    g_string_append(long_name, "\xc3\xa9"); /* 240 bytes of é */
  g_string_append(long_name, ".pdf");
  n = pp_inputs_output_base(long_name->str, "0123abcd");
  assert_true(strlen(n) <= 255 - 20);        /* NAME_MAX 255 (POSIX), with room to spare */
  assert_true(g_utf8_validate(n, -1, NULL)); /* cut on a character boundary */
  g_free(n);
  n = pp_inputs_output_base("../..", NULL);
  assert_null(strchr(n, '/'));
  assert_false(g_str_has_prefix(n, ".."));
  g_free(n);
  g_string_free(long_name, TRUE);
}

static void feed(pp_assembly *as, const char *line) {
  pp_assembly_feed(as, line, strlen(line));
}

static void assembly_totals(void **state) {
  (void)state;
  pp_assembly *as = pp_assembly_new();
  feed(as, "{\"open\":{\"document\":{\"pages\":3},\"pages\":[],\"findings\":[],\"totals\":{}}}");
  feed(as, "{\"start\":0}");
  feed(as, "{\"page\":0,\"rss_kib\":900,\"report\":{\"pages\":[{\"page\":1,\"error\":null,"
           "\"figures\":[{},{}]}],\"findings\":[{\"severity\":\"severe\"},"
           /* found by fuzz_events: a severity that is no string, a finding that is no object */
           "{\"severity\":1},{\"severity\":null},7]}}");
  feed(as, "{\"start\":1}");
  feed(as, "{\"page\":1,\"error\":\"too complex: over the page budget of 1 s\"}");
  feed(as, "{\"start\":2}");
  feed(as, "not json");
  /* Beyond the header's 3 pages: refused, or the totals below would count 2,222,223 pages. */
  feed(as, "{\"page\":2222222,\"error\":\"too complex\"}");
  const char *word, *reason;
  JsonNode *root = pp_assembly_finish(as, "timed out after 3 s", &word, &reason);
  assert_non_null(root);
  JsonObject *t = json_object_get_object_member(json_node_get_object(root), "totals");
  assert_int_equal(json_object_get_int_member(t, "pages"), 3);
  assert_int_equal(json_object_get_int_member(t, "pages_analysed"), 1);
  assert_int_equal(json_object_get_int_member(t, "pages_failed"), 2);
  assert_int_equal(json_object_get_int_member(t, "figures"), 2);
  assert_int_equal(json_object_get_int_member(t, "findings"), 3);
  assert_int_equal(
      json_object_get_int_member(json_object_get_object_member(t, "by_severity"), "severe"), 1);
  JsonArray *pages = json_object_get_array_member(json_node_get_object(root), "pages");
  assert_string_equal(
      json_object_get_string_member(json_array_get_object_element(pages, 2), "error"),
      "not analysed: timed out after 3 s");
  assert_int_equal(pp_assembly_last_page(as), 3);
  assert_int_equal(pp_assembly_max_rss_kib(as), 900);
  json_node_unref(root);
  pp_assembly_free(as);
  as = pp_assembly_new();
  feed(as, "{\"error\":{\"code\":4,\"word\":\"encrypted\",\"message\":\"needs a password\"}}");
  assert_null(pp_assembly_finish(as, NULL, &word, &reason));
  assert_string_equal(word, "encrypted");
  pp_assembly_free(as);
}

/* Warnings and criticals printed while reading worker lines: json-glib's typed getters print
 * a critical (g_return_val_if_fail) for a member that is an object or array. */
static void count_warnings(const char *domain, GLogLevelFlags level, const char *message,
                           gpointer data) {
  (void)domain, (void)level, (void)message;
  (*(guint *)data)++;
}

static void assembly_member_types(void **state) {
  (void)state;
  guint warnings = 0;
  GLogFunc old = g_log_set_default_handler(count_warnings, &warnings);
  guint json = g_log_set_handler("Json", G_LOG_LEVEL_WARNING | G_LOG_LEVEL_CRITICAL, count_warnings,
                                 &warnings);
  pp_assembly *as = pp_assembly_new();
  feed(as, "{\"open\":{\"document\":{\"pages\":4},\"pages\":[],\"findings\":[],\"totals\":{}}}");
  /* members that are objects or arrays where a string, an integer or a boolean belongs */
  feed(as, "{\"page\":0,\"rss_kib\":{},\"error\":[]}");
  feed(as, "{\"page\":1,\"rss_kib\":7,\"report\":{\"pages\":[[]],\"findings\":[]}}");
  feed(as, "{\"page\":2,\"report\":{\"pages\":[{\"page\":3,\"error\":{}}],"
           "\"findings\":[{\"severity\":{}},{\"severity\":[\"severe\"]}]}}");
  feed(as, "{\"end\":[]}");
  feed(as, "{\"end\":{}}");
  const char *word, *reason;
  JsonNode *root = pp_assembly_finish(as, "the worker stopped", &word, &reason);
  assert_int_equal(warnings, 0);
  assert_non_null(root);
  JsonObject *t = json_object_get_object_member(json_node_get_object(root), "totals");
  assert_int_equal(json_object_get_int_member(t, "pages"), 4);
  /* page 1: "error" is no text, so the fallback reason; page 2: its entry is no object;
   * page 3: analysed (its error is no text); page 4: never reported */
  assert_int_equal(json_object_get_int_member(t, "pages_failed"), 3);
  assert_int_equal(json_object_get_int_member(t, "findings"), 2);
  assert_int_equal(
      json_object_get_int_member(json_object_get_object_member(t, "by_severity"), "severe"), 0);
  JsonArray *pages = json_object_get_array_member(json_node_get_object(root), "pages");
  assert_string_equal(
      json_object_get_string_member(json_array_get_object_element(pages, 0), "error"),
      "not analysed");
  assert_false(pp_assembly_ended(as));
  assert_int_equal(pp_assembly_max_rss_kib(as), 7);
  json_node_unref(root);
  pp_assembly_free(as);
  /* a header whose page count is an array, and a document error with object members */
  as = pp_assembly_new();
  feed(as, "{\"open\":{\"document\":{\"pages\":[3]}}}");
  feed(as, "{\"page\":0,\"error\":\"x\"}");
  assert_int_equal(pp_assembly_pages(as), 0);
  pp_assembly_free(as);
  as = pp_assembly_new();
  feed(as, "{\"error\":{\"code\":4,\"word\":{},\"message\":[1]}}");
  assert_null(pp_assembly_finish(as, NULL, &word, &reason));
  assert_string_equal(word, "damaged");
  assert_string_equal(reason, "");
  pp_assembly_free(as);
  g_log_remove_handler("Json", json);
  g_log_set_default_handler(old, NULL);
  assert_int_equal(warnings, 0);
}

/* json-glib's own pretty generator (json_generator_set_pretty, indent 2) is the reference the
 * findings file was always written with; the indenter must give the same bytes. */
static char *pretty(JsonNode *n) {
  g_autoptr(JsonGenerator) g = json_generator_new();
  json_generator_set_pretty(g, TRUE);
  json_generator_set_indent(g, 2);
  json_generator_set_root(g, n);
  return json_generator_to_data(g, NULL);
}

static void json_text_like_json_glib(void **state) {
  (void)state;
  const char *cases[] = {
      "{}",
      "[]",
      "\"x\"",
      "{\"a\":{},\"b\":[],\"c\":[[],{},[1,[2.5,-3e-07]],{\"x\":null,\"y\":true}]}",
      "[{\"a\":\"q\\\"\\\\/\\u0001\xc3\xa9\\t]}{,:\"},{\"b\":[{}]}]",
      "{\"pages\":[{\"page\":1,\"figures\":[{\"bbox\":[0,1.5,2,3],\"e\":{}}],\"w\":[]}]}",
  };
  for (size_t i = 0; i < G_N_ELEMENTS(cases); i++) {
    JsonNode *n = json_from_string(cases[i], NULL);
    assert_non_null(n);
    char *compact = json_to_string(n, FALSE);
    const char *end = compact + strlen(compact);
    assert_ptr_equal(pp_json_text_skip(compact, end), end);
    GString *out = g_string_new(NULL);
    pp_json_text_indent(out, compact, end, 0);
    char *want = pretty(n);
    assert_string_equal(out->str, want);
    g_free(want);
    g_string_free(out, TRUE);
    g_free(compact);
    json_node_unref(n);
  }
  /* RFC 8259 §6-§8: none of these is one JSON value in the compact form (or it nests deeper
   * than the indenter goes); json-glib then reads the line. */
  const char *bad[] = {"01",      "1.",         "-",        "1e",      "[1,]",      "{\"a\" :1}",
                       "{\"a\"}", "[1 ]",       "\"\x01\"", "\"\\x\"", "\"\\u12\"", "\"\xff\"",
                       "tru",     "{\"a\":1,}", "[",        "\"abc",   "nul"};
  for (size_t i = 0; i < G_N_ELEMENTS(bad); i++)
    assert_ptr_not_equal(pp_json_text_skip(bad[i], bad[i] + strlen(bad[i])),
                         bad[i] + strlen(bad[i]));
  GString *deep = g_string_new(NULL);
  for (int i = 0; i < 300; i++)
    g_string_append_c(deep, '[');
  for (int i = 0; i < 300; i++)
    g_string_append_c(deep, ']');
  assert_null(pp_json_text_skip(deep->str, deep->str + deep->len));
  g_string_free(deep, TRUE);
  const char *ok = "[-0.5e+3,0,true,false,null,\"\\ud83d\"]";
  assert_ptr_equal(pp_json_text_skip(ok, ok + strlen(ok)), ok + strlen(ok));
}

/* The findings file's text (page entries and findings kept as text and indented) is exactly
 * what json-glib writes for the same object read back: pages read the fast way and the slow
 * way (a failed page, a finding with an escaped name) side by side. */
static void assembly_text_like_json_glib(void **state) {
  (void)state;
  pp_assembly *as = pp_assembly_new();
  feed(as, "{\"open\":{\"format\":\"f\",\"document\":{\"pages\":4,\"title\":\"\\\"pages\\\" : "
           "[]\"},\"pages\":[],\"findings\":[],\"totals\":{}}}");
  feed(as, "{\"page\":0,\"rss_kib\":1,\"report\":{\"pages\":[{\"page\":1,\"error\":null,"
           "\"figures\":[{\"b\":[1,2.5]},{}],\"warnings\":[]}],\"findings\":[{\"severity\":"
           "\"major\",\"e\":{}},5]}}");
  feed(as, "{\"page\":1,\"error\":\"too complex\"}");
  feed(as, "{\"page\":2,\"rss_kib\":1,\"report\":{\"pages\":[{\"page\":3,\"scale_failures\":[1]}],"
           "\"findings\":[{\"sev\\u0065rity\":\"severe\"}]}}");
  const char *word, *reason;
  char *text;
  JsonNode *bare = pp_assembly_finish_text(as, "stopped", &word, &reason, &text);
  assert_non_null(bare);
  JsonNode *root = json_from_string(text, NULL);
  assert_non_null(root);
  char *want = pretty(root);
  assert_string_equal(text, want);
  JsonObject *t = json_object_get_object_member(json_node_get_object(root), "totals");
  assert_int_equal(json_object_get_int_member(t, "pages_failed"), 2);
  assert_int_equal(json_object_get_int_member(t, "figures"), 2);
  assert_int_equal(json_object_get_int_member(t, "scale_failures"), 1);
  assert_int_equal(json_object_get_int_member(t, "findings"), 2);
  JsonObject *by = json_object_get_object_member(t, "by_severity");
  assert_int_equal(json_object_get_int_member(by, "major"), 1);
  assert_int_equal(json_object_get_int_member(by, "severe"), 1);
  /* the object without page entries carries the same totals */
  JsonObject *bt = json_object_get_object_member(json_node_get_object(bare), "totals");
  assert_int_equal(json_object_get_int_member(bt, "findings"), 2);
  g_free(want);
  g_free(text);
  json_node_unref(root);
  json_node_unref(bare);
  pp_assembly_free(as);
  /* a header with "findings" before "pages" (the scheduler's own always has them the other way) */
  as = pp_assembly_new();
  feed(as, "{\"open\":{\"findings\":[],\"document\":{\"pages\":1},\"pages\":[]}}");
  feed(as, "{\"page\":0,\"rss_kib\":1,\"report\":{\"pages\":[{\"page\":1}],"
           "\"findings\":[{\"severity\":\"minor\"}]}}");
  bare = pp_assembly_finish_text(as, "stopped", &word, &reason, &text);
  root = json_from_string(text, NULL);
  assert_non_null(root);
  want = pretty(root);
  assert_string_equal(text, want);
  assert_int_equal(
      json_array_get_length(json_object_get_array_member(json_node_get_object(root), "findings")),
      1);
  g_free(want);
  g_free(text);
  json_node_unref(root);
  json_node_unref(bare);
  pp_assembly_free(as);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(escape_controls),
      cmocka_unit_test(passwords),
      cmocka_unit_test(shards),
      cmocka_unit_test(record_reader),
      cmocka_unit_test(output_names),
      cmocka_unit_test(assembly_totals),
      cmocka_unit_test(assembly_member_types),
      cmocka_unit_test(json_text_like_json_glib),
      cmocka_unit_test(assembly_text_like_json_glib),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
