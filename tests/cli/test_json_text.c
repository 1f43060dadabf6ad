/* test_json_text.c — the scheduler's text walk against json-glib (the reference the findings
 * file was always written with): random trees written compact by json-glib are checked,
 * walked member by member and indented, and random page reports read the fast way (text) give
 * the same findings file as the same lines read by json-glib (the slow way). */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <string.h>

#include <cmocka.h>
#include <json-glib/json-glib.h>

#include "cli/assemble.h"
#include "cli/json_text.h"

static char *pretty(JsonNode *n) {
  g_autoptr(JsonGenerator) g = json_generator_new();
  json_generator_set_pretty(g, TRUE);
  json_generator_set_indent(g, 2);
  json_generator_set_root(g, n);
  return json_generator_to_data(g, NULL);
}

static void random_text(GRand *r, char *s, int max) {
  int len = g_rand_int_range(r, 0, max);
  for (int i = 0; i < len; i++) {
    s[i] = (char)g_rand_int_range(r, 1, 128); /* controls, quotes, backslashes: escaped */
    if (s[i] == 0x1f) /* json-glib 1.6 leaves it raw, not JSON: the check sends it to json-glib */
      s[i] = 0x1e;
  }
  s[len] = '\0';
}

static JsonNode *random_node(GRand *r, int depth) {
  int kind = g_rand_int_range(r, 0, depth > 5 ? 5 : 7);
  JsonNode *n;
  char s[16];
  if (kind == 0) {
    n = json_node_new(JSON_NODE_NULL);
  } else if (kind == 1) {
    n = json_node_init_int(json_node_alloc(), (gint64)g_rand_int(r) - G_MAXINT32);
  } else if (kind == 2) {
    n = json_node_init_double(json_node_alloc(), g_rand_double_range(r, -1e6, 1e6));
  } else if (kind == 3) {
    n = json_node_init_boolean(json_node_alloc(), g_rand_boolean(r));
  } else if (kind == 4) {
    random_text(r, s, 12);
    n = json_node_init_string(json_node_alloc(), g_rand_boolean(r) ? s : "caf\xc3\xa9");
  } else if (kind == 5) {
    JsonArray *a = json_array_new();
    for (int i = g_rand_int_range(r, 0, 5); i > 0; i--)
      json_array_add_element(a, random_node(r, depth + 1));
    n = json_node_init_array(json_node_alloc(), a);
    json_array_unref(a);
  } else {
    JsonObject *o = json_object_new();
    for (int i = g_rand_int_range(r, 0, 5); i > 0; i--) {
      random_text(r, s, 6);
      json_object_set_member(o, s, random_node(r, depth + 1));
    }
    n = json_node_init_object(json_node_alloc(), o);
    json_object_unref(o);
  }
  return n;
}

/* Checked, walked and indented: the members' names and values in order, as json-glib has
 * them, and the indented text as json-glib's pretty generator writes it (after a prefix). */
static void random_trees(void **state) {
  (void)state;
  GRand *r = g_rand_new_with_seed(31);
  for (int i = 0; i < 20000; i++) {
    JsonNode *n = random_node(r, 0);
    char *compact = json_to_string(n, FALSE);
    const char *end = compact + strlen(compact);
    if (pp_json_text_skip(compact, end) != end)
      fail_msg("not checked: %s", compact);
    assert_ptr_equal(pp_json_text_end(compact, end), end);
    if (JSON_NODE_HOLDS_OBJECT(n) || JSON_NODE_HOLDS_ARRAY(n)) {
      gboolean object = JSON_NODE_HOLDS_OBJECT(n);
      GList *members = object ? json_object_get_members(json_node_get_object(n)) : NULL;
      guint k = 0, len = object ? json_object_get_size(json_node_get_object(n))
                                : json_array_get_length(json_node_get_array(n));
      const char *p = compact, *nm, *nm_end, *v, *v_end;
      while (pp_json_text_next(&p, end, object ? &nm : NULL, &nm_end, &v, &v_end)) {
        assert_true(k < len);
        JsonNode *want =
            object ? json_object_get_member(json_node_get_object(n), g_list_nth_data(members, k))
                   : json_array_get_element(json_node_get_array(n), k);
        char *wv = json_to_string(want, FALSE);
        assert_int_equal(v_end - v, strlen(wv));
        assert_memory_equal(v, wv, strlen(wv));
        g_free(wv);
        k++;
      }
      assert_int_equal(k, len);
      assert_ptr_equal(p + 1, end); /* left at the close */
      g_list_free(members);
    }
    GString *out = g_string_new("prefix ");
    pp_json_text_indent(out, compact, end, 0);
    char *want = pretty(n);
    assert_string_equal(out->str + 7, want);
    assert_int_equal(out->len, 7 + strlen(want));
    g_free(want);
    g_string_free(out, TRUE);
    g_free(compact);
    json_node_unref(n);
  }
  g_rand_free(r);
}

/* A page process's report with random parts: entries with figures, raster images and scale
 * failures of several sizes (or not arrays), errors, findings that are objects or not, with
 * severities of every kind, and now and then a name or a value json-glib must unescape. */
static char *random_report(GRand *r, guint page) {
  GString *s = g_string_new(NULL);
  const char *counted[] = {"figures", "raster_images_not_analysed", "scale_failures"};
  g_string_append_printf(s, "{\"pages\":[{\"page\":%u", page + 1);
  for (int k = 0; k < 3; k++) {
    int m = g_rand_int_range(r, -1, 4);
    if (m < 0) {
      g_string_append_printf(s, ",\"%s\":null", counted[k]);
      continue;
    }
    g_string_append_printf(s, ",\"%s\":[", counted[k]);
    for (int j = 0; j < m; j++)
      g_string_append_printf(s, "%s{\"bbox\":[1,2.5,3,4],\"x\":\"a,]}\"}", j ? "," : "");
    g_string_append_c(s, ']');
  }
  const char *errors[] = {"null", "\"too complex\"", "\"esc\\\"aped\"", "3"};
  g_string_append_printf(s, ",\"warnings\":[],\"error\":%s}]", errors[g_rand_int_range(r, 0, 4)]);
  g_string_append(s, ",\"findings\":[");
  for (int j = g_rand_int_range(r, 0, 4); j > 0; j--) {
    const char *sev[] = {"\"minor\"", "\"major\"", "\"severe\"",
                         "null",      "\"odd\"",   "\"m\\u0069nor\""};
    int pick = g_rand_int_range(r, 0, 20);
    if (pick == 0)
      g_string_append(s, "7");
    else if (pick == 1)
      g_string_append(s, "{\"sev\\u0065rity\":\"minor\"}");
    else
      g_string_append_printf(s, "{\"id\":\"f%d\",\"severity\":%s,\"m\":{\"a\":[1,{}]}}", j,
                             sev[pick % 6]);
    if (j > 1)
      g_string_append_c(s, ',');
  }
  g_string_append(s, "]}");
  return g_string_free(s, FALSE);
}

static void fast_and_slow_agree(void **state) {
  (void)state;
  GRand *r = g_rand_new_with_seed(8);
  const char *header = "{\"open\":{\"format\":\"f\",\"document\":{\"pages\":6},\"pages\":[],"
                       "\"findings\":[],\"totals\":{}}}";
  for (int round = 0; round < 300; round++) {
    pp_assembly *fast = pp_assembly_new(), *slow = pp_assembly_new();
    pp_assembly_feed(fast, header, strlen(header));
    pp_assembly_feed(slow, header, strlen(header));
    for (guint page = 0; page < 6; page++) {
      char *report = random_report(r, page);
      /* the document worker's exact form, and one space more: json-glib reads that one */
      char *a = g_strdup_printf("{\"page\":%u,\"rss_kib\":1,\"report\":%s}", page, report);
      char *b = g_strdup_printf("{\"page\":%u, \"rss_kib\":1,\"report\":%s}", page, report);
      pp_assembly_feed(fast, a, strlen(a));
      pp_assembly_feed(slow, b, strlen(b));
      g_free(a);
      g_free(b);
      g_free(report);
    }
    const char *word, *reason;
    char *ta, *tb;
    JsonNode *na = pp_assembly_finish_text(fast, "stopped", &word, &reason, &ta);
    JsonNode *nb = pp_assembly_finish_text(slow, "stopped", &word, &reason, &tb);
    assert_non_null(na);
    assert_string_equal(ta, tb);
    char *ja = json_to_string(na, FALSE), *jb = json_to_string(nb, FALSE);
    assert_string_equal(ja, jb); /* the totals */
    assert_int_equal(pp_assembly_pages_failed(fast), pp_assembly_pages_failed(slow));
    g_free(ja);
    g_free(jb);
    g_free(ta);
    g_free(tb);
    json_node_unref(na);
    json_node_unref(nb);
    pp_assembly_free(fast);
    pp_assembly_free(slow);
  }
  g_rand_free(r);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(random_trees),
      cmocka_unit_test(fast_and_slow_agree),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
