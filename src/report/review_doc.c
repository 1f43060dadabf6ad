/* review_doc.c — reading a findings document back: tolerant accessors, the figure
 * behind a finding, severity order and number formatting for people. Every reviewer
 * output reads the JSON through these, never the C structs of the earlier stages. */
#include <math.h>
#include <string.h>

#include "report.h"
#include "review.h"

/* A finding's box and its figure's plot box are the same rectangle written twice by
 * the report; 0.5 pt absorbs the printing of doubles. Common practice, no source. */
#define PP_RV_BOX_MATCH_PT 0.5

static JsonNode *member(JsonObject *o, const char *name) {
  return o && json_object_has_member(o, name) ? json_object_get_member(o, name) : NULL;
}

const char *pp_rv_str(JsonObject *o, const char *name) {
  JsonNode *n = member(o, name);
  return n && JSON_NODE_HOLDS_VALUE(n) && json_node_get_value_type(n) == G_TYPE_STRING
             ? json_node_get_string(n)
             : NULL;
}

double pp_rv_num(JsonObject *o, const char *name) {
  JsonNode *n = member(o, name);
  if (!n || !JSON_NODE_HOLDS_VALUE(n))
    return NAN;
  GType t = json_node_get_value_type(n);
  if (t == G_TYPE_INT64)
    return (double)json_node_get_int(n);
  if (t == G_TYPE_DOUBLE)
    return json_node_get_double(n);
  return NAN;
}

gint64 pp_rv_int(JsonObject *o, const char *name) {
  double v = pp_rv_num(o, name);
  return isfinite(v) ? (gint64)v : 0;
}

JsonArray *pp_rv_arr(JsonObject *o, const char *name) {
  JsonNode *n = member(o, name);
  return n && JSON_NODE_HOLDS_ARRAY(n) ? json_node_get_array(n) : NULL;
}

JsonObject *pp_rv_obj(JsonObject *o, const char *name) {
  JsonNode *n = member(o, name);
  return n && JSON_NODE_HOLDS_OBJECT(n) ? json_node_get_object(n) : NULL;
}

gboolean pp_rv_rect(JsonObject *o, const char *name, double r[4]) {
  JsonArray *a = pp_rv_arr(o, name);
  if (!a || json_array_get_length(a) != 4)
    return FALSE;
  for (guint i = 0; i < 4; i++) {
    JsonNode *n = json_array_get_element(a, i);
    if (!JSON_NODE_HOLDS_VALUE(n))
      return FALSE;
    r[i] = json_node_get_double(n);
    if (!isfinite(r[i]))
      return FALSE;
  }
  return TRUE;
}

static gboolean same_box(const double a[4], const double b[4]) {
  for (int i = 0; i < 4; i++)
    if (fabs(a[i] - b[i]) > PP_RV_BOX_MATCH_PT)
      return FALSE;
  return TRUE;
}

JsonObject *pp_rv_finding_figure(JsonObject *doc, JsonObject *finding) {
  JsonObject *own = pp_rv_obj(finding, "figure");
  if (own)
    return own;
  double box[4], fbox[4];
  if (!pp_rv_rect(finding, "bbox", box))
    return NULL;
  gint64 page = pp_rv_int(finding, "page");
  JsonArray *pages = pp_rv_arr(doc, "pages");
  for (guint i = 0; pages && i < json_array_get_length(pages); i++) {
    JsonObject *p = json_array_get_object_element(pages, i);
    if (pp_rv_int(p, "page") != page)
      continue;
    JsonArray *figs = pp_rv_arr(p, "figures");
    for (guint j = 0; figs && j < json_array_get_length(figs); j++) {
      JsonObject *f = json_array_get_object_element(figs, j);
      if (pp_rv_rect(f, "bbox", fbox) && same_box(box, fbox))
        return f;
    }
  }
  return NULL;
}

const char *pp_rv_finding_title(JsonObject *doc, JsonObject *finding) {
  const char *t = pp_rv_str(finding, "figure_title");
  if (t)
    return t;
  JsonObject *fig = pp_rv_finding_figure(doc, finding);
  t = pp_rv_str(fig, "title");
  return t ? t : pp_rv_str(fig, "caption");
}

const char *pp_rv_finding_figure_id(JsonObject *doc, JsonObject *finding) {
  const char *id = pp_rv_str(finding, "figure_id");
  return id ? id : pp_rv_str(pp_rv_finding_figure(doc, finding), "id");
}

const char *pp_rv_finding_headline(JsonObject *finding) {
  const char *h = pp_rv_str(finding, "headline");
  if (h)
    return h;
  h = pp_rv_str(finding, "message");
  return h ? h : "";
}

/* Format 3 calls Tufte's measure "lie_factor" and the growth variant "ink_growth_ratio";
 * formats 1 and 2 called them "lie_factor_change" and "lie_factor". */
double pp_rv_lie_factor(JsonObject *m) {
  return json_object_has_member(m, "ink_growth_ratio") ||
                 !json_object_has_member(m, "lie_factor_change")
             ? pp_rv_num(m, "lie_factor")
             : pp_rv_num(m, "lie_factor_change");
}

double pp_rv_growth_ratio(JsonObject *m) {
  return json_object_has_member(m, "ink_growth_ratio") ? pp_rv_num(m, "ink_growth_ratio")
                                                       : pp_rv_num(m, "lie_factor");
}

/* The words come from the rules stage, so a renamed scale follows automatically. */
const char *const *pp_rv_severity_words(void) {
  static const char *words[PP_SEVERITY_SEVERE + 2];
  if (!words[0])
    for (int s = 0; s <= PP_SEVERITY_SEVERE; s++)
      words[s] = pp_severity_name((pp_severity)s);
  return words;
}

int pp_rv_severity_rank(const char *severity) {
  const char *const *w = pp_rv_severity_words();
  for (int i = 0; severity && w[i]; i++)
    if (strcmp(w[i], severity) == 0)
      return i;
  return -1;
}

/* Groups the integer digits of a plain decimal string in threes. */
static char *group_thousands(const char *s) {
  GString *out = g_string_new(NULL);
  const char *p = s;
  if (*p == '-')
    g_string_append_c(out, *p++);
  size_t n = strspn(p, "0123456789");
  for (size_t i = 0; i < n; i++) {
    if (i > 0 && (n - i) % 3 == 0)
      g_string_append_c(out, ',');
    g_string_append_c(out, p[i]);
  }
  g_string_append(out, p + n);
  return g_string_free(out, FALSE);
}

/* Four significant digits: the precision of an axis reading on a printed chart is
 * rarely better than a tenth of a percent of its span. Common practice, no source. */
#define PP_RV_SIGNIFICANT 4

char *pp_rv_format_value(double v) {
  if (!isfinite(v))
    return g_strdup("–");
  if (v == 0)
    return g_strdup("0");
  int mag = (int)floor(log10(fabs(v)));
  int decimals = PP_RV_SIGNIFICANT - 1 - mag;
  char buf[G_ASCII_DTOSTR_BUF_SIZE + 32];
  if (decimals <= 0) {
    double unit = pow(10, -decimals);
    g_snprintf(buf, sizeof buf, "%.0f", round(v / unit) * unit);
  } else {
    g_snprintf(buf, sizeof buf, "%.*f", MIN(decimals, 12), v);
    /* Trailing zeros say nothing a reader needs. */
    char *dot = strchr(buf, '.');
    if (dot) {
      char *end = buf + strlen(buf) - 1;
      while (end > dot && *end == '0')
        *end-- = '\0';
      if (end == dot)
        *end = '\0';
    }
  }
  return fabs(v) >= 1000 ? group_thousands(buf) : g_strdup(buf);
}
