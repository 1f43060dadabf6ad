/* json_util.h — report-stage helpers shared by its writers only: numbers that turn
 * NaN/inf into null (json-glib would print "nan.0", which is not JSON), rectangles, strings, and
 * the figure evidence both writers print. */
#pragma once

#include <json-glib/json-glib.h>

#include "core/core.h"
#include "recognize/recognize.h"

void pp_json_add_number(JsonBuilder *b, double v);
/* v, or its neighbour toward zero when json-glib would print v as invalid JSON ("1e+20.0"). */
double pp_json_writable_double(double v);
void pp_json_member_number(JsonBuilder *b, const char *name, double v);
/* NULL becomes JSON null. */
void pp_json_member_string(JsonBuilder *b, const char *name, const char *s);
void pp_json_member_int(JsonBuilder *b, const char *name, gint64 v);
void pp_json_member_bool(JsonBuilder *b, const char *name, gboolean v);
/* [x0, y0, x1, y1], or null when the box is empty or not finite. */
void pp_json_member_rect(JsonBuilder *b, const char *name, pp_rect r);
/* The same box mapped through m (page points → PDF user space), re-normalised. */
void pp_json_member_mapped_rect(JsonBuilder *b, const char *name, pp_rect r, pp_matrix m);
pp_rect pp_json_rect_map(pp_rect r, pp_matrix m);
/* "evidence": what made the figure a chart, each piece with its score (the confidence
 * combines them); written alike in the findings file and the charts JSON. */
void pp_json_member_evidence(JsonBuilder *b, const pp_figure *f);
/* The compact text json-glib's generator writes for node, written directly (json_write.c). */
char *pp_json_write_compact(JsonNode *node, gsize *length);

/* The text g_ascii_dtostr() writes for v ("%.17g"), into buf of G_ASCII_DTOSTR_BUF_SIZE bytes;
 * worked out without printf where that is exact (json_number.c). Returns buf. */
char *pp_json_format_double(double v, char *buf);

/* Compact JSON text written straight from the model, call for call as the JsonBuilder helpers
 * above, and the same bytes json-glib's generator writes for the tree they would build. Start
 * with more = FALSE, or TRUE to append an element to a list already begun. */
typedef struct {
  GString *text;
  gboolean more; /* a value was written at this level: the next one follows a ',' */
} pp_json_out;

void pp_json_out_begin_object(pp_json_out *o);
void pp_json_out_end_object(pp_json_out *o);
void pp_json_out_begin_array(pp_json_out *o);
void pp_json_out_end_array(pp_json_out *o);
void pp_json_out_name(pp_json_out *o, const char *name);
void pp_json_out_null(pp_json_out *o);
void pp_json_out_int(pp_json_out *o, gint64 v);
/* Always as a double (json-glib's text, ".0" added when it has no '.'). */
void pp_json_out_double(pp_json_out *o, double v);
void pp_json_out_bool(pp_json_out *o, gboolean v);
/* s escaped as it is: the caller makes sure it is UTF-8. */
void pp_json_out_string(pp_json_out *o, const char *s);
/* As pp_json_add_number(): null, an integer, or the writable double. */
void pp_json_out_number(pp_json_out *o, double v);
/* NULL becomes null; text that is not UTF-8 is made valid, as pp_json_member_string(). */
void pp_json_out_text(pp_json_out *o, const char *s);
void pp_json_out_member_number(pp_json_out *o, const char *name, double v);
void pp_json_out_member_text(pp_json_out *o, const char *name, const char *s);
void pp_json_out_member_int(pp_json_out *o, const char *name, gint64 v);
void pp_json_out_member_bool(pp_json_out *o, const char *name, gboolean v);
void pp_json_out_member_rect(pp_json_out *o, const char *name, pp_rect r);
void pp_json_out_member_evidence(pp_json_out *o, const pp_figure *f);
