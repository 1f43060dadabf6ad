/* json_util.c — the few JsonBuilder helpers every report writer needs, so the rule
 * "non-finite numbers are null" is enforced in exactly one place. */
#include <math.h>
#include <string.h>

#include "json_util.h"

/* Below 2^63 an integral double is written as an integer: "3" reads better than "3.0". */
#define PP_JSON_INT_LIMIT 9.2e18

/* json-glib 1.6 writes a double as g_ascii_dtostr() and appends ".0" when the text has no
 * '.', so 1e20 becomes "1e+20.0", which RFC 8259 §6 does not allow (a fraction cannot follow
 * the exponent). Such a value (one mantissa digit with an exponent) is moved one unit in the
 * last place toward zero, a relative change of 2^-52, whose text always has a '.'. */
double pp_json_writable_double(double v) {
  /* g_ascii_dtostr() is printf's "%.17g" (GLib's gstrfuncs.c), which uses an exponent only
   * when the decimal exponent is below -4 or at least 17 (C17 §7.21.6.1): values in between
   * need no formatting to be known safe. */
  if (fabs(v) >= 1e-4 && fabs(v) < 1e16)
    return v;
  char buf[G_ASCII_DTOSTR_BUF_SIZE];
  for (int i = 0; i < 4 && v != 0; i++) {
    g_ascii_dtostr(buf, sizeof buf, v);
    if (strchr(buf, '.') || !strpbrk(buf, "eE"))
      break;
    v = nextafter(v, 0.0);
  }
  return v;
}

void pp_json_add_number(JsonBuilder *b, double v) {
  if (!isfinite(v))
    json_builder_add_null_value(b);
  else if (v == floor(v) && fabs(v) < PP_JSON_INT_LIMIT)
    json_builder_add_int_value(b, (gint64)v);
  else
    json_builder_add_double_value(b, pp_json_writable_double(v));
}

void pp_json_member_number(JsonBuilder *b, const char *name, double v) {
  json_builder_set_member_name(b, name);
  pp_json_add_number(b, v);
}

void pp_json_member_string(JsonBuilder *b, const char *name, const char *s) {
  json_builder_set_member_name(b, name);
  if (!s) {
    json_builder_add_null_value(b);
  } else if (g_utf8_validate(s, -1, NULL)) {
    json_builder_add_string_value(b, s);
  } else {
    /* Text from a PDF is not guaranteed UTF-8; JSON strings must be. */
    char *valid = g_utf8_make_valid(s, -1);
    json_builder_add_string_value(b, valid);
    g_free(valid);
  }
}

void pp_json_member_int(JsonBuilder *b, const char *name, gint64 v) {
  json_builder_set_member_name(b, name);
  json_builder_add_int_value(b, v);
}

void pp_json_member_bool(JsonBuilder *b, const char *name, gboolean v) {
  json_builder_set_member_name(b, name);
  json_builder_add_boolean_value(b, v);
}

static gboolean rect_usable(pp_rect r) {
  return !pp_rect_is_empty(r) && isfinite(r.x0) && isfinite(r.y0) && isfinite(r.x1) &&
         isfinite(r.y1);
}

void pp_json_member_rect(JsonBuilder *b, const char *name, pp_rect r) {
  json_builder_set_member_name(b, name);
  if (!rect_usable(r)) {
    json_builder_add_null_value(b);
    return;
  }
  json_builder_begin_array(b);
  pp_json_add_number(b, r.x0);
  pp_json_add_number(b, r.y0);
  pp_json_add_number(b, r.x1);
  pp_json_add_number(b, r.y1);
  json_builder_end_array(b);
}

pp_rect pp_json_rect_map(pp_rect r, pp_matrix m) {
  return rect_usable(r) ? pp_rect_transform(r, m) : pp_rect_empty();
}

void pp_json_member_mapped_rect(JsonBuilder *b, const char *name, pp_rect r, pp_matrix m) {
  pp_json_member_rect(b, name, pp_json_rect_map(r, m));
}

void pp_json_member_evidence(JsonBuilder *b, const pp_figure *f) {
  json_builder_set_member_name(b, "evidence");
  json_builder_begin_array(b);
  for (guint i = 0; f->evidence && i < f->evidence->len; i++) {
    const pp_evidence *ev = &g_array_index(f->evidence, pp_evidence, i);
    json_builder_begin_object(b);
    pp_json_member_string(b, "what", ev->what);
    pp_json_member_number(b, "score", ev->score);
    json_builder_end_object(b);
  }
  json_builder_end_array(b);
}

/* The same rules, written as text (pp_json_out). */
void pp_json_out_number(pp_json_out *o, double v) {
  if (!isfinite(v))
    pp_json_out_null(o);
  else if (v == floor(v) && fabs(v) < PP_JSON_INT_LIMIT)
    pp_json_out_int(o, (gint64)v);
  else
    pp_json_out_double(o, pp_json_writable_double(v));
}

void pp_json_out_text(pp_json_out *o, const char *s) {
  if (!s) {
    pp_json_out_null(o);
  } else if (g_utf8_validate(s, -1, NULL)) {
    pp_json_out_string(o, s);
  } else {
    char *valid = g_utf8_make_valid(s, -1);
    pp_json_out_string(o, valid);
    g_free(valid);
  }
}

void pp_json_out_member_number(pp_json_out *o, const char *name, double v) {
  pp_json_out_name(o, name);
  pp_json_out_number(o, v);
}

void pp_json_out_member_text(pp_json_out *o, const char *name, const char *s) {
  pp_json_out_name(o, name);
  pp_json_out_text(o, s);
}

void pp_json_out_member_int(pp_json_out *o, const char *name, gint64 v) {
  pp_json_out_name(o, name);
  pp_json_out_int(o, v);
}

void pp_json_out_member_bool(pp_json_out *o, const char *name, gboolean v) {
  pp_json_out_name(o, name);
  pp_json_out_bool(o, v);
}

void pp_json_out_member_rect(pp_json_out *o, const char *name, pp_rect r) {
  pp_json_out_name(o, name);
  if (!rect_usable(r)) {
    pp_json_out_null(o);
    return;
  }
  pp_json_out_begin_array(o);
  pp_json_out_number(o, r.x0);
  pp_json_out_number(o, r.y0);
  pp_json_out_number(o, r.x1);
  pp_json_out_number(o, r.y1);
  pp_json_out_end_array(o);
}

void pp_json_out_member_evidence(pp_json_out *o, const pp_figure *f) {
  pp_json_out_name(o, "evidence");
  pp_json_out_begin_array(o);
  for (guint i = 0; f->evidence && i < f->evidence->len; i++) {
    const pp_evidence *ev = &g_array_index(f->evidence, pp_evidence, i);
    pp_json_out_begin_object(o);
    pp_json_out_member_text(o, "what", ev->what);
    pp_json_out_member_number(o, "score", ev->score);
    pp_json_out_end_object(o);
  }
  pp_json_out_end_array(o);
}
