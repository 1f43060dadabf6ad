/* model.c — the figure model itself: names of kinds, encodings and sources (from the
 * one list in recognize.h), building and freeing figures and elements, evidence and the
 * content fingerprint. It calls nothing else of the stage. */
#include <math.h>
#include <string.h>

#include "internal.h"

static const char *const kind_names[] = {
#define PP_X_NAME(e, name, what) name,
    PP_FIGURE_KINDS(PP_X_NAME)
#undef PP_X_NAME
};

static const char *const kind_summaries[] = {
#define PP_X_WHAT(e, name, what) what,
    PP_FIGURE_KINDS(PP_X_WHAT)
#undef PP_X_WHAT
};

const char *pp_figure_kind_name(pp_figure_kind kind) {
  return (guint)kind < PP_FIGURE_N_KINDS ? kind_names[kind] : "other";
}

const char *pp_figure_kind_summary(pp_figure_kind kind) {
  return (guint)kind < PP_FIGURE_N_KINDS ? kind_summaries[kind] : "";
}

gboolean pp_figure_kind_from_name(const char *name, pp_figure_kind *kind) {
  for (guint i = 0; name && i < PP_FIGURE_N_KINDS; i++)
    if (strcmp(name, kind_names[i]) == 0) {
      *kind = (pp_figure_kind)i;
      return TRUE;
    }
  return FALSE;
}

const char *pp_encoding_name(pp_encoding encoding) {
  static const char *const names[] = {"length", "area", "angle", "radius", "share"};
  return (guint)encoding < G_N_ELEMENTS(names) ? names[encoding] : "length";
}

const char *pp_value_source_name(pp_value_source source) {
  static const char *const names[] = {"none",          "scale",  "data-label",
                                      "percent-label", "legend", "size-key"};
  return (guint)source < G_N_ELEMENTS(names) ? names[source] : "none";
}

const char *pp_part_role_name(pp_part_role role) {
  static const char *const names[] = {"body", "front", "cap", "side", "top", "rim", "segment"};
  return (guint)role < G_N_ELEMENTS(names) ? names[role] : "body";
}

pp_figure *pp_figure_new(pp_figure_kind kind) {
  pp_figure *f = g_new0(pp_figure, 1);
  f->kind = kind;
  f->recognizer = "";
  f->elements = g_array_new(FALSE, TRUE, sizeof(pp_element));
  f->evidence = g_array_new(FALSE, FALSE, sizeof(pp_evidence));
  f->bbox = pp_rect_empty();
  f->projection.kind = PP_PROJECTION_FLAT;
  f->projection.ratio = 1;
  f->judged = TRUE;
  return f;
}

void pp_figure_free(pp_figure *f) {
  if (!f)
    return;
  for (guint i = 0; i < f->elements->len; i++) {
    pp_element *e = &g_array_index(f->elements, pp_element, i);
    g_free(e->label_text);
    g_free(e->category);
    if (e->parts)
      g_array_unref(e->parts);
  }
  g_array_unref(f->elements);
  g_array_unref(f->evidence);
  pp_scale_free(f->scale);
  g_free(f->not_judged_reason);
  g_free(f->fingerprint);
  g_free(f->title);
  g_free(f);
}

pp_element pp_element_init(pp_encoding encoding) {
  pp_element e = {0};
  e.encoding = encoding;
  e.shape.kind = PP_SHAPE_NONE;
  e.parts = g_array_new(FALSE, FALSE, sizeof(pp_part));
  e.box = pp_rect_empty();
  e.value = e.scale_value = e.base_value = e.label_value = e.share = NAN;
  e.source = PP_VALUE_NONE;
  return e;
}

void pp_element_add_part(pp_element *e, guint mark, pp_part_role role, double ink) {
  pp_part p = {mark, role, ink, NAN, NAN, NAN};
  g_array_append_val(e->parts, p);
}

double pp_element_ink_of(const pp_element *e, pp_part_role role) {
  double ink = 0;
  for (guint i = 0; e->parts && i < e->parts->len; i++) {
    const pp_part *p = &g_array_index(e->parts, pp_part, i);
    if (p->role == role)
      ink += p->ink;
  }
  return ink;
}

void pp_figure_add_evidence(pp_figure *f, const char *what, double score) {
  pp_evidence ev = {what, CLAMP(score, 0, 1)};
  g_array_append_val(f->evidence, ev);
}

/* Content, not position: the same chart moved to another page keeps its id. */
void pp_figure_set_fingerprint(pp_figure *f) {
  GChecksum *ck = g_checksum_new(G_CHECKSUM_SHA256);
  const char *kind = pp_figure_kind_name(f->kind);
  g_checksum_update(ck, (const guchar *)kind, -1);
  for (guint i = 0; i < f->elements->len; i++) {
    const pp_element *e = &g_array_index(f->elements, pp_element, i);
    char buf[96];
    g_snprintf(buf, sizeof buf, "|%.4g|%.4g|%.4g", e->value, e->base_value,
               e->extent > 0 ? e->ink / e->extent : 0);
    g_checksum_update(ck, (const guchar *)buf, -1);
    if (e->category)
      g_checksum_update(ck, (const guchar *)e->category, -1);
  }
  if (f->scale)
    for (guint i = 0; i < f->scale->ticks->len; i++) {
      const pp_tick *t = &g_array_index(f->scale->ticks, pp_tick, i);
      g_checksum_update(ck, (const guchar *)t->label, -1);
    }
  g_free(f->fingerprint);
  f->fingerprint = g_strndup(g_checksum_get_string(ck), 16);
  g_checksum_free(ck);
}
