/* rule_pages.c — the rule pages of docs/rules/<id>.md, compiled in with
 * glib-compile-resources, so `plotproof explain` and the HTML pack never depend on
 * files beside the binary. */
#include <string.h>

#include "review.h"
#include "rule_pages_res.h"

#define PP_RULE_PAGES_PATH "/org/plotproof/rules/"

char *pp_rule_page_get(const char *rule_id) {
  if (!rule_id || strchr(rule_id, '/'))
    return NULL;
  char *path = g_strconcat(PP_RULE_PAGES_PATH, rule_id, ".md", NULL);
  GBytes *bytes = g_resource_lookup_data(pp_rule_pages_get_resource(), path,
                                         G_RESOURCE_LOOKUP_FLAGS_NONE, NULL);
  g_free(path);
  if (!bytes)
    return NULL;
  gsize len = 0;
  const char *data = g_bytes_get_data(bytes, &len);
  char *text = g_strndup(data, len);
  g_bytes_unref(bytes);
  return text;
}

static int compare_ids(gconstpointer a, gconstpointer b) {
  return strcmp(*(char *const *)a, *(char *const *)b);
}

char **pp_rule_page_list(void) {
  char **names = g_resource_enumerate_children(pp_rule_pages_get_resource(), PP_RULE_PAGES_PATH,
                                               G_RESOURCE_LOOKUP_FLAGS_NONE, NULL);
  GPtrArray *ids = g_ptr_array_new();
  for (guint i = 0; names && names[i]; i++)
    if (g_str_has_suffix(names[i], ".md"))
      g_ptr_array_add(ids, g_strndup(names[i], strlen(names[i]) - 3));
  g_strfreev(names);
  g_ptr_array_sort(ids, compare_ids);
  g_ptr_array_add(ids, NULL);
  return (char **)g_ptr_array_free(ids, FALSE);
}

char *pp_rule_page_summary(const char *rule_id) {
  char *page = pp_rule_page_get(rule_id);
  if (!page)
    return NULL;
  const char *start = strstr(page, "## What it detects");
  char *out = NULL;
  if (start) {
    start = strchr(start, '\n');
    while (start && (*start == '\n' || *start == ' '))
      start++;
    const char *end = start ? strstr(start, "\n\n") : NULL;
    if (start) {
      out = end ? g_strndup(start, (gsize)(end - start)) : g_strdup(start);
      g_strdelimit(out, "\n", ' ');
    }
  }
  g_free(page);
  return out;
}
