/* json_text.h — compact JSON text read and indented without building a tree: the scheduler
 * keeps each page's entry as the text its page process wrote (json_text.c). */
#pragma once

#include <glib.h>

/* The end of the one JSON value at p, or NULL. Strict RFC 8259 in the compact form json-glib
 * writes: no whitespace outside strings, strings valid UTF-8 without raw control characters,
 * nesting at most PP_JSON_TEXT_MAX_DEPTH deep. */
const char *pp_json_text_skip(const char *p, const char *end);

/* Steps through the members of a checked object (or the elements of a checked array): *p
 * starts at its '{' ('['); each call stores the next member's name (with its quotes; NULL for
 * an array) and value span and returns TRUE, or FALSE after the last. */
gboolean pp_json_text_next(const char **p, const char *end, const char **name,
                           const char **name_end, const char **value, const char **value_end);

/* The same step, stopping at the start of the value: *p is left there, and the caller moves it
 * to the value's end (pp_json_text_end, or its own walk through the value) before the next
 * call. Walking into a value this way reads each byte once, where pp_json_text_next() and a
 * walk through the value it returned read them twice. */
gboolean pp_json_text_member(const char **p, const char *end, const char **name,
                             const char **name_end);

/* The end of the one value at p in checked text. */
const char *pp_json_text_end(const char *p, const char *end);

/* Is the quoted name [name, name_end) the plain word (no escapes)? */
gboolean pp_json_text_name_is(const char *name, const char *name_end, const char *word);

/* Appends the checked compact value [p, end) as json-glib's pretty generator writes it at
 * nesting level `level` with an indent of two spaces (the first line not indented). */
void pp_json_text_indent(GString *out, const char *p, const char *end, guint level);
