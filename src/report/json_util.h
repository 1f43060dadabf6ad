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
