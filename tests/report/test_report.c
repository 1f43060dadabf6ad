/* test_report.c — the findings writer: valid JSON (parsed back by json-glib), NaN and
 * infinities as null (RFC 8259 §6 has no literal for them), the schema's required fields
 * present (read from docs/findings.schema.json, path given as argv[1]), the PDF-space box. */
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <string.h>

#include <cmocka.h>
#include <glib/gstdio.h>

#include "report/json_util.h"
#include "sample.h"

static const char *schema_path;

static JsonNode *parse_or_fail(const char *text) {
  g_autoptr(JsonParser) p = json_parser_new();
  GError *error = NULL;
  gboolean ok = json_parser_load_from_data(p, text, -1, &error);
  if (!ok)
    fail_msg("not JSON: %s", error->message);
  return json_node_copy(json_parser_get_root(p));
}

static JsonObject *first_finding(JsonNode *root) {
  JsonArray *f = json_object_get_array_member(json_node_get_object(root), "findings");
  assert_int_equal(json_array_get_length(f), 1);
  return json_array_get_object_element(f, 0);
}

static void test_nan_and_inf_are_null(void **state) {
  (void)state;
  pp_sample *s = pp_sample_new(NAN, INFINITY);
  pp_report *r = pp_sample_report(s);
  char *text = pp_report_to_string(r, TRUE, NULL);
  /* RFC 8259 §6: numbers are digits only; json-glib would otherwise print "nan.0"/"inf". */
  GRegex *literal = g_regex_new("[:\\[,]\\s*-?(nan|inf)", G_REGEX_CASELESS, 0, NULL);
  assert_false(g_regex_match(literal, text, 0, NULL));
  g_regex_unref(literal);
  JsonNode *root = parse_or_fail(text);
  JsonObject *m = json_object_get_object_member(first_finding(root), "measures");
  assert_true(JSON_NODE_HOLDS_NULL(json_object_get_member(m, "lie_factor")));
  assert_true(JSON_NODE_HOLDS_NULL(json_object_get_member(m, "gdi")));
  assert_float_equal(json_object_get_double_member(m, "ink_growth_ratio"), 2.0, 0);
  json_node_unref(root);
  g_free(text);
  pp_report_free(r);
  pp_sample_free(s);
}

static void test_values_round_trip(void **state) {
  (void)state;
  pp_sample *s = pp_sample_new(1.0 / 3.0, 250.0);
  pp_report *r = pp_sample_report(s);
  char *text = pp_report_to_string(r, FALSE, NULL);
  assert_null(strchr(text, '\n')); /* compact output is one JSON Lines record */
  JsonNode *root = parse_or_fail(text);
  JsonObject *f = first_finding(root);
  JsonObject *m = json_object_get_object_member(f, "measures");
  /* Exact: 17 significant digits round-trip an IEEE double (IEEE 754-2008 §5.12.2). */
  assert_true(json_object_get_double_member(m, "lie_factor") == 1.0 / 3.0);
  assert_float_equal(json_object_get_double_member(m, "gdi"), 250.0, 0);
  assert_string_equal(
      json_object_get_string_member(m, "lie_factor_definition"),
      "Tufte: ((ink_last-ink_first)/ink_first)/((value_last-value_first)/value_first)");
  JsonArray *el = json_object_get_array_member(f, "elements");
  assert_int_equal(json_array_get_length(el), 3);
  JsonObject *e0 = json_array_get_object_element(el, 0), *e1 = json_array_get_object_element(el, 1);
  assert_string_equal(json_object_get_string_member(e0, "category"), "2021");
  assert_true(json_object_get_null_member(e1, "category"));
  assert_float_equal(json_object_get_double_member(e1, "ink"), 5000, 0);
  const char *bad = json_object_get_string_member(json_array_get_object_element(el, 2), "category");
  assert_true(g_utf8_validate(bad, -1, NULL)); /* RFC 8259 §8.1: JSON text is UTF-8 */
  assert_int_equal(json_object_get_int_member(f, "page"), 1);
  assert_string_equal(json_object_get_string_member(f, "severity"), "severe");
  json_node_unref(root);
  g_free(text);
  pp_report_free(r);
  pp_sample_free(s);
}

/* The shortcut of pp_json_writable_double(): between 1e-4 and 1e16 "%.17g" has no exponent
 * (C17 §7.21.6.1: style e only for an exponent below -4 or at least the precision, 17), so the
 * value is returned as it is; outside, a one-digit mantissa with an exponent is moved one ulp
 * so that the text has a '.' (RFC 8259 §6: no fraction after the exponent). */
static void test_writable_double_ranges(void **state) {
  (void)state;
  char buf[G_ASCII_DTOSTR_BUF_SIZE];
  GRand *r = g_rand_new_with_seed(12);
  double edges[] = {1e-4, nextafter(1e-4, 1), 1.0, 9.999999999999999e15, nextafter(1e16, 0)};
  for (int i = 0; i < 20000 + (int)G_N_ELEMENTS(edges); i++) {
    double v = i < (int)G_N_ELEMENTS(edges) ? edges[i] : pow(10, g_rand_double_range(r, -4, 16));
    if (v < 1e-4 || v >= 1e16)
      continue;
    for (int sign = -1; sign <= 1; sign += 2) {
      g_ascii_dtostr(buf, sizeof buf, sign * v);
      assert_null(strpbrk(buf, "eE"));
      assert_true(pp_json_writable_double(sign * v) == sign * v);
    }
  }
  g_rand_free(r);
  double outside[] = {1e16, 1e20, -1e20, 5e-7, 9.99e-5, 1e300, 2e-300};
  for (size_t i = 0; i < G_N_ELEMENTS(outside); i++) {
    double w = pp_json_writable_double(outside[i]);
    g_ascii_dtostr(buf, sizeof buf, w);
    assert_true(strchr(buf, '.') || !strpbrk(buf, "eE"));
    assert_true(fabs(w - outside[i]) <= fabs(outside[i]) * 1e-15);
  }
}

/* pp_json_write_compact() against json-glib's own generator (the reference; json-generator.c)
 * on random trees: every byte from 0x01 to 0xff in strings and names, integers to both ends of
 * the 64-bit range, doubles of every magnitude (and one that prints without a '.'), empty and
 * nested containers. */
static JsonNode *random_node(GRand *r, int depth) {
  JsonNode *n;
  int kind = depth > 3 ? g_rand_int_range(r, 0, 5) : g_rand_int_range(r, 0, 7);
  if (kind == 0) {
    n = json_node_new(JSON_NODE_NULL);
  } else if (kind == 1) {
    n = json_node_new(JSON_NODE_VALUE);
    gint64 pick[] = {0, -1, 7, G_MAXINT64, G_MININT64, (gint64)g_rand_int(r) - G_MAXINT32};
    json_node_set_int(n, pick[g_rand_int_range(r, 0, 6)]);
  } else if (kind == 2) {
    n = json_node_new(JSON_NODE_VALUE);
    double pick[] = {0.1,
                     -0.0,
                     1e-7,
                     1e16,
                     1e20,
                     5e-324,
                     -1.7976931348623157e308,
                     g_rand_double_range(r, -1e6, 1e6) * pow(10, g_rand_int_range(r, -30, 30)),
                     (double)g_rand_int(r) / (1 << g_rand_int_range(r, 0, 24))};
    json_node_set_double(n, pick[g_rand_int_range(r, 0, 9)]);
  } else if (kind == 3) {
    n = json_node_new(JSON_NODE_VALUE);
    json_node_set_boolean(n, g_rand_boolean(r));
  } else if (kind == 4) {
    char s[12];
    int len = g_rand_int_range(r, 0, 11);
    for (int i = 0; i < len; i++)
      s[i] = (char)g_rand_int_range(r, 1, 256);
    s[len] = '\0';
    n = json_node_new(JSON_NODE_VALUE);
    json_node_set_string(n, s);
  } else if (kind == 5) {
    JsonArray *a = json_array_new();
    for (int i = g_rand_int_range(r, 0, 4); i > 0; i--)
      json_array_add_element(a, random_node(r, depth + 1));
    n = json_node_new(JSON_NODE_ARRAY);
    json_node_take_array(n, a);
  } else {
    JsonObject *o = json_object_new();
    for (int i = g_rand_int_range(r, 0, 4); i > 0; i--) {
      char name[4] = {(char)g_rand_int_range(r, 1, 256), (char)g_rand_int_range(r, 'a', 'z'),
                      (char)g_rand_int_range(r, 1, 128), '\0'};
      json_object_set_member(o, name, random_node(r, depth + 1));
    }
    n = json_node_new(JSON_NODE_OBJECT);
    json_node_take_object(n, o);
  }
  return n;
}

static void test_compact_like_json_glib(void **state) {
  (void)state;
  GRand *r = g_rand_new_with_seed(7);
  for (int i = 0; i < 3000; i++) {
    JsonNode *n = random_node(r, 0);
    gsize len = 0;
    char *mine = pp_json_write_compact(n, &len);
    char *want = json_to_string(n, FALSE);
    assert_string_equal(mine, want);
    assert_int_equal(len, strlen(want));
    g_free(mine);
    g_free(want);
    json_node_unref(n);
  }
  /* doubles alone, many of them multiples of a power of two (the shortcut of json_write.c), and
   * its edges: 18 significant digits, just under 1e15, 1e-4 and the first power of two below,
   * 20 and 19 binary places (10^20 does not fit in 64 bits) */
  double edges[] = {
      999999999999999.875, 99999999999999.9921875, 1e15 - 1, 1e-4,          0x1p-14,
      0.0001220703125,     123456.0009765625,      1.0 / 3,  105 * 0x1p-20, 81543 * 0x1p-20,
      12345 * 0x1p-19};
  for (int i = 0; i < 200000; i++) {
    JsonNode *n = json_node_new(JSON_NODE_VALUE);
    double v = i < (int)G_N_ELEMENTS(edges)
                   ? edges[i]
                   : (double)(gint64)(g_rand_double(r) * pow(10, g_rand_int_range(r, 0, 19))) /
                         pow(2, g_rand_int_range(r, 0, 30));
    json_node_set_double(n, g_rand_boolean(r) ? -v : v);
    char *mine = pp_json_write_compact(n, NULL), *want = json_to_string(n, FALSE);
    assert_string_equal(mine, want);
    g_free(mine);
    g_free(want);
    json_node_unref(n);
  }
  g_rand_free(r);
}

/* The report keeps its pages and findings as text (pp_json_out): the tree pp_report_to_json()
 * reads back from it must write out, by json-glib's own generator, as the same compact text,
 * with every byte from 0x01 to 0xff in a warning and a failed page's reason. A measure named
 * twice keeps its first place and last value, as json-glib's builder makes the object
 * (json_object_set_member replaces a member in place). */
static void test_text_and_tree_agree(void **state) {
  (void)state;
  pp_sample *s = pp_sample_new(1.0 / 7.0, 1e-9);
  char bytes[256];
  for (int i = 1; i < 256; i++)
    bytes[i - 1] = (char)i;
  bytes[255] = '\0';
  g_ptr_array_add(s->scene->warnings, g_strdup(bytes));
  pp_finding *f = g_ptr_array_index(s->findings, 0);
  pp_measures_add_extra(&f->measures, "gdi", 12.5);
  pp_measures_add_extra(&f->measures, "share", 0.1 * 3);
  pp_measures_add_extra(&f->measures, "share", -2.0);
  pp_report *r = pp_sample_report(s);
  pp_report_add_failed_page(r, 2, bytes);
  char *text = pp_report_to_string(r, FALSE, NULL);
  JsonNode *tree = pp_report_to_json(r);
  char *want = json_to_string(tree, FALSE);
  assert_string_equal(text, want);
  /* the parts a page process sends: the same arrays */
  JsonObject *o = json_node_get_object(tree);
  char *parts = pp_report_parts_to_string(r, NULL);
  char *pages = json_to_string(json_object_get_member(o, "pages"), FALSE);
  char *found = json_to_string(json_object_get_member(o, "findings"), FALSE);
  char *joined = g_strdup_printf("{\"pages\":%s,\"findings\":%s}", pages, found);
  assert_string_equal(parts, joined);
  /* the measures against JsonBuilder given the same members in the same order */
  g_autoptr(JsonBuilder) b = json_builder_new();
  json_builder_begin_object(b);
  pp_json_member_number(b, "lie_factor", 1.0 / 7.0);
  pp_json_member_string(b, "lie_factor_definition", PP_REPORT_LIE_FACTOR_DEFINITION);
  pp_json_member_number(b, "ink_growth_ratio", f->measures.growth_ratio);
  pp_json_member_number(b, "gdi", 1e-9);
  pp_json_member_number(b, "baseline_value", f->measures.baseline_value);
  pp_json_member_number(b, "max_pair_departure", f->measures.max_pair_departure);
  pp_json_member_number(b, "distortion", f->measures.distortion);
  for (guint i = 0; i < f->measures.n_extra; i++)
    pp_json_member_number(b, f->measures.extra[i].name, f->measures.extra[i].value);
  json_builder_end_object(b);
  JsonNode *m = json_builder_get_root(b);
  char *want_m = json_to_string(m, FALSE);
  JsonObject *f0 = json_array_get_object_element(json_object_get_array_member(o, "findings"), 0);
  char *got_m = json_to_string(json_object_get_member(f0, "measures"), FALSE);
  assert_string_equal(got_m, want_m);
  assert_non_null(strstr(got_m, "\"gdi\":12.5,"));
  assert_non_null(strstr(got_m, "\"share\":-2}"));
  g_free(got_m);
  g_free(want_m);
  json_node_unref(m);
  g_free(joined);
  g_free(found);
  g_free(pages);
  g_free(parts);
  g_free(want);
  json_node_unref(tree);
  g_free(text);
  pp_report_free(r);
  pp_sample_free(s);
}

static void assert_rect(JsonArray *a, double x0, double y0, double x1, double y1) {
  assert_non_null(a);
  assert_int_equal(json_array_get_length(a), 4);
  assert_float_equal(json_array_get_double_element(a, 0), x0, 1e-9);
  assert_float_equal(json_array_get_double_element(a, 1), y0, 1e-9);
  assert_float_equal(json_array_get_double_element(a, 2), x1, 1e-9);
  assert_float_equal(json_array_get_double_element(a, 3), y1, 1e-9);
}

static void test_figure_boxes_and_coverage(void **state) {
  (void)state;
  pp_sample *s = pp_sample_new(7.0 / 1.75, 300);
  pp_report *r = pp_sample_report(s);
  JsonNode *root = pp_report_to_json(r);
  char *text = pp_report_node_to_string(root, FALSE, NULL);
  json_node_unref(root);
  root = parse_or_fail(text);
  JsonArray *pages = json_object_get_array_member(json_node_get_object(root), "pages");
  assert_int_equal(json_array_get_length(pages), 2);
  JsonObject *p1 = json_array_get_object_element(pages, 0);
  JsonObject *fig = json_array_get_object_element(json_object_get_array_member(p1, "figures"), 0);
  assert_rect(json_object_get_array_member(fig, "bbox"), 10, 20, 110, 120);
  /* ISO 32000-1 §8.3.2.3: default user space has its origin at the lower left, y up, so
   * on a 300 pt page top-left y=20..120 is y=180..280. */
  assert_rect(json_object_get_array_member(fig, "pdf_bbox"), 10, 180, 110, 280);
  JsonObject *scale = json_object_get_object_member(fig, "scale");
  assert_int_equal(json_object_get_int_member(scale, "ticks"), 4);
  assert_string_equal(json_object_get_string_member(scale, "kind"), "linear");
  assert_int_equal(json_object_get_int_member(fig, "elements"), 3);
  JsonObject *marks = json_object_get_object_member(p1, "marks");
  assert_int_equal(json_object_get_int_member(marks, "fill"), 2);
  assert_int_equal(json_object_get_int_member(marks, "stroke"), 1);
  assert_int_equal(json_object_get_int_member(marks, "total"), 3);
  JsonArray *sf = json_object_get_array_member(p1, "scale_failures");
  assert_string_equal(json_object_get_string_member(json_array_get_object_element(sf, 0), "reason"),
                      "tick labels are not numbers");
  JsonObject *p2 = json_array_get_object_element(pages, 1);
  assert_int_equal(json_object_get_int_member(p2, "page"), 2);
  assert_string_equal(json_object_get_string_member(p2, "error"), "page 2 cannot be loaded");
  JsonObject *t = json_object_get_object_member(json_node_get_object(root), "totals");
  assert_int_equal(json_object_get_int_member(t, "pages_failed"), 1);
  assert_int_equal(json_object_get_int_member(t, "findings"), 1);
  assert_int_equal(json_object_get_int_member(t, "figures"), 1);
  json_node_unref(root);
  g_free(text);
  pp_report_free(r);
  pp_sample_free(s);
}

/* Every "required" list of the schema's objects must be present in the output: a small
 * checker of the schema's own statement (JSON Schema 2020-12 §10.3.1 / validation §6.5.3). */
static void check_required(JsonObject *schema_obj, JsonObject *data, const char *where) {
  if (!json_object_has_member(schema_obj, "required"))
    return;
  JsonArray *req = json_object_get_array_member(schema_obj, "required");
  for (guint i = 0; i < json_array_get_length(req); i++) {
    const char *name = json_array_get_string_element(req, i);
    if (!json_object_has_member(data, name))
      fail_msg("%s lacks required member '%s'", where, name);
  }
}

static void test_schema_required_fields(void **state) {
  (void)state;
  assert_non_null(schema_path);
  g_autoptr(JsonParser) sp = json_parser_new();
  GError *error = NULL;
  if (!json_parser_load_from_file(sp, schema_path, &error))
    fail_msg("schema: %s", error->message);
  JsonObject *schema = json_node_get_object(json_parser_get_root(sp));
  JsonObject *defs = json_object_get_object_member(schema, "$defs");
  pp_sample *s = pp_sample_new(4.0, 300);
  pp_report *r = pp_sample_report(s);
  char *text = pp_report_to_string(r, TRUE, NULL);
  JsonNode *root = parse_or_fail(text);
  JsonObject *doc = json_node_get_object(root);
  check_required(schema, doc, "top level");
  JsonObject *props = json_object_get_object_member(schema, "properties");
  const char *objects[] = {"tool", "coordinates", "thresholds", "document", "totals"};
  for (guint i = 0; i < G_N_ELEMENTS(objects); i++)
    check_required(json_object_get_object_member(props, objects[i]),
                   json_object_get_object_member(doc, objects[i]), objects[i]);
  assert_string_equal(json_object_get_string_member(doc, "format"), "plotproof-findings");
  assert_int_equal(json_object_get_int_member(doc, "version"), 3);
  JsonObject *finding_schema = json_object_get_object_member(defs, "finding");
  JsonObject *f = first_finding(root);
  check_required(finding_schema, f, "finding");
  check_required(json_object_get_object_member(defs, "boxed"), f, "finding box");
  JsonObject *fprops = json_object_get_object_member(finding_schema, "properties");
  check_required(json_object_get_object_member(fprops, "measures"),
                 json_object_get_object_member(f, "measures"), "measures");
  JsonObject *page_schema = json_object_get_object_member(defs, "page");
  JsonObject *p1 = json_array_get_object_element(json_object_get_array_member(doc, "pages"), 0);
  check_required(page_schema, p1, "page");
  check_required(json_object_get_object_member(page_schema, "then"), p1, "analysed page");
  JsonObject *fig = json_array_get_object_element(json_object_get_array_member(p1, "figures"), 0);
  check_required(json_object_get_object_member(defs, "figure"), fig, "figure");
  json_node_unref(root);
  g_free(text);
  pp_report_free(r);
  pp_sample_free(s);
}

static void test_write_file(void **state) {
  (void)state;
  char *dir = g_dir_make_tmp("pp-report-XXXXXX", NULL);
  assert_non_null(dir);
  char *path = g_build_filename(dir, "quillmere.findings.json", NULL);
  pp_sample *s = pp_sample_new(4.0, 300);
  pp_report *r = pp_sample_report(s);
  GError *error = NULL;
  assert_true(pp_report_write_file(r, path, &error));
  char *text = NULL;
  gsize len = 0;
  assert_true(g_file_get_contents(path, &text, &len, NULL));
  assert_true(len > 0 && text[len - 1] == '\n');
  json_node_unref(parse_or_fail(text));
  /* Writing into a missing directory is a GError, not a crash. */
  char *bad = g_build_filename(dir, "missing", "x.json", NULL);
  assert_false(pp_report_write_file(r, bad, &error));
  assert_non_null(error);
  g_clear_error(&error);
  g_unlink(path);
  g_rmdir(dir);
  g_free(bad);
  g_free(text);
  g_free(path);
  g_free(dir);
  pp_report_free(r);
  pp_sample_free(s);
}

static void test_scene_json(void **state) {
  (void)state;
  pp_sample *s = pp_sample_new(4.0, 300);
  JsonNode *node = pp_report_scene_to_json(s->scene);
  char *text = pp_report_node_to_string(node, FALSE, NULL);
  json_node_unref(node);
  JsonNode *root = parse_or_fail(text);
  JsonObject *o = json_node_get_object(root);
  JsonArray *marks = json_object_get_array_member(o, "marks");
  assert_int_equal(json_array_get_length(marks), 3);
  JsonObject *m0 = json_array_get_object_element(marks, 0);
  assert_string_equal(json_object_get_string_member(m0, "kind"), "fill");
  assert_true(json_object_get_null_member(m0, "ink"));
  assert_true(json_object_get_null_member(m0, "bbox"));
  /* pp_path_rectangle: move + 3 lines + close (cairo_rectangle's shape). */
  JsonArray *path = json_object_get_array_member(m0, "path");
  assert_int_equal(json_array_get_length(path), 5);
  JsonObject *seg0 = json_array_get_object_element(path, 0);
  assert_string_equal(json_object_get_string_member(seg0, "op"), "move");
  JsonArray *pt = json_array_get_array_element(json_object_get_array_member(seg0, "points"), 0);
  assert_float_equal(json_array_get_double_element(pt, 0), 80, 0);
  assert_float_equal(json_array_get_double_element(pt, 1), 100, 0);
  JsonArray *clip = json_object_get_array_member(m0, "clip");
  assert_int_equal(json_array_get_length(clip), 2);
  assert_string_equal(json_object_get_string_member(json_array_get_object_element(clip, 0), "rule"),
                      pp_fill_rule_name(PP_FILL_EVEN_ODD));
  JsonObject *m1 = json_array_get_object_element(marks, 1);
  assert_float_equal(json_object_get_double_member(m1, "ink"), 7500, 0);
  assert_int_equal(json_array_get_length(json_object_get_array_member(m1, "clip")), 0);
  JsonArray *words = json_object_get_array_member(o, "words");
  assert_string_equal(
      json_object_get_string_member(json_array_get_object_element(words, 0), "text"), "Revenue");
  const char *warning =
      json_array_get_string_element(json_object_get_array_member(o, "warnings"), 0);
  assert_true(g_utf8_validate(warning, -1, NULL));
  json_node_unref(root);
  g_free(text);
  node = pp_report_charts_to_json(s->scene, s->charts);
  text = pp_report_node_to_string(node, TRUE, NULL);
  json_node_unref(node);
  root = parse_or_fail(text);
  JsonArray *figs = json_object_get_array_member(json_node_get_object(root), "figures");
  JsonObject *axis = json_object_get_object_member(json_array_get_object_element(figs, 0), "scale");
  assert_int_equal(json_array_get_length(json_object_get_array_member(axis, "ticks")), 4);
  json_node_unref(root);
  g_free(text);
  pp_sample_free(s);
}

/* The schema's list of figure kinds is the one list in recognize.h (PP_FIGURE_KINDS),
 * in the same order, and names round-trip through pp_figure_kind_from_name(). */
static void test_schema_kinds_match_model(void **state) {
  (void)state;
  assert_non_null(schema_path);
  g_autoptr(JsonParser) sp = json_parser_new();
  assert_true(json_parser_load_from_file(sp, schema_path, NULL));
  JsonObject *defs =
      json_object_get_object_member(json_node_get_object(json_parser_get_root(sp)), "$defs");
  JsonArray *kinds =
      json_object_get_array_member(json_object_get_object_member(defs, "figure_kind"), "enum");
  assert_int_equal(json_array_get_length(kinds), PP_FIGURE_N_KINDS);
  for (guint i = 0; i < PP_FIGURE_N_KINDS; i++) {
    const char *name = json_array_get_string_element(kinds, i);
    assert_string_equal(name, pp_figure_kind_name((pp_figure_kind)i));
    pp_figure_kind back;
    assert_true(pp_figure_kind_from_name(name, &back));
    assert_int_equal(back, i);
  }
  pp_figure_kind none;
  assert_false(pp_figure_kind_from_name("donut-chart", &none));
}

int main(int argc, char **argv) {
  schema_path = argc > 1 ? argv[1] : NULL;
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_nan_and_inf_are_null),
      cmocka_unit_test(test_values_round_trip),
      cmocka_unit_test(test_writable_double_ranges),
      cmocka_unit_test(test_compact_like_json_glib),
      cmocka_unit_test(test_text_and_tree_agree),
      cmocka_unit_test(test_figure_boxes_and_coverage),
      cmocka_unit_test(test_schema_required_fields),
      cmocka_unit_test(test_write_file),
      cmocka_unit_test(test_scene_json),
      cmocka_unit_test(test_schema_kinds_match_model),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
