/* size_key.c — the size key of a bubble chart: a few symbols of another family, each with
 * the value it stands for printed beside, above or below it, or nested circles sharing
 * one bottom point with the values at their tops (beside them or at leader lines). Inside
 * or outside the plot alike: only the key's own geometry is read. */
#include <math.h>

#include "internal.h"

/* A key's number beside it starts within this many of its font sizes of the key's right
 * edge (common practice, no source). */
#define PP_KEY_LABEL_REACH 4.0
/* Leader lines of a nested key may carry its numbers this many largest radii beyond the
 * key's right edge (common practice, no source). */
#define PP_KEY_LEADER_REACH 2.0
/* Nested circles share their bottom point within this share of the largest radius plus
 * half a point (producers' rounding; common practice, no source). */
#define PP_KEY_NESTED_SHARE 0.02
/* A number under or over a symbol is centred on it within this share of its radius or
 * its font size, whichever is larger (common practice, no source). */
#define PP_KEY_CENTRED_SHARE 0.5

typedef enum {
  KEY_RIGHT,  /* numbers to the right, level with each centre (column or row) */
  KEY_BELOW,  /* numbers centred under each symbol */
  KEY_ABOVE,  /* numbers centred over each symbol */
  KEY_NESTED, /* nested circles on one bottom point, numbers level with each top */
} key_layout;

/* How far the label is from where the layout puts a symbol's number; INFINITY when it is
 * not there. big: the key's largest radius; right: the key's right edge. */
static double placement(key_layout layout, const pp_symbol *s, const pp_label *l, double big,
                        double right) {
  double cx = s->centre.x, half = fmax(PP_KEY_CENTRED_SHARE * s->r, l->size);
  switch (layout) {
  case KEY_RIGHT:
    /* numbers may line up beside the key's largest symbol */
    if (l->box.x0 >= cx && l->box.x0 - right <= PP_KEY_LABEL_REACH * l->size &&
        fabs(l->centre.y - s->centre.y) <= fmax(0.5 * s->r, l->size))
      return l->box.x0 - s->box.x1;
    return INFINITY;
  case KEY_BELOW:
  case KEY_ABOVE: {
    /* numbers may share one line under (over) a row of centred symbols */
    double gap = layout == KEY_BELOW ? l->box.y0 - s->box.y1 : s->box.y0 - l->box.y1;
    if (fabs(l->centre.x - cx) <= half && gap >= -0.5 && gap <= 2 * l->size + (big - s->r))
      return gap;
    return INFINITY;
  }
  case KEY_NESTED: {
    double dy = fabs(l->centre.y - s->box.y0);
    if (l->box.x0 >= cx &&
        l->box.x0 - right <= fmax(PP_KEY_LABEL_REACH * l->size, PP_KEY_LEADER_REACH * big) &&
        dy <= l->size)
      return dy;
    return INFINITY;
  }
  }
  return INFINITY;
}

/* Where a layout looks for a symbol's number. */
static pp_rect search_box(key_layout layout, const pp_symbol *s, double size, double big,
                          double right) {
  double half = fmax(PP_KEY_CENTRED_SHARE * s->r, size), far = 2 * size + (big - s->r);
  switch (layout) {
  case KEY_RIGHT: {
    double band = fmax(0.5 * s->r, size);
    return (pp_rect){s->centre.x, s->centre.y - band, right + PP_KEY_LABEL_REACH * size,
                     s->centre.y + band};
  }
  case KEY_BELOW:
    return (pp_rect){s->centre.x - half, s->box.y1 - 0.5, s->centre.x + half, s->box.y1 + far};
  case KEY_ABOVE:
    return (pp_rect){s->centre.x - half, s->box.y0 - far, s->centre.x + half, s->box.y0 + 0.5};
  case KEY_NESTED:
    return (pp_rect){s->centre.x, s->box.y0 - size,
                     right + fmax(PP_KEY_LABEL_REACH * size, PP_KEY_LEADER_REACH * big),
                     s->box.y0 + size};
  }
  return pp_rect_empty();
}

/* Circles of one centre line standing on one bottom point. */
static gboolean nested(const pp_symbol_page *pg, const GArray *mem, double big) {
  const pp_symbol *a = &g_array_index(pg->syms, pp_symbol, g_array_index(mem, guint, 0));
  double tol = PP_KEY_NESTED_SHARE * big + 0.5;
  for (guint i = 0; i < mem->len; i++) {
    const pp_symbol *s = &g_array_index(pg->syms, pp_symbol, g_array_index(mem, guint, i));
    if (!s->circle || fabs(s->centre.x - a->centre.x) > tol || fabs(s->box.y1 - a->box.y1) > tol)
      return FALSE;
  }
  return TRUE;
}

typedef enum { KEY_FITS, KEY_UNFIT, KEY_NEVER } key_verdict;

/* Every symbol of the family gets its own free number in this layout, and area grows
 * with value. KEY_NEVER when some symbol has no free number at all: labels are only ever
 * claimed, so it never will. */
static key_verdict try_layout(pp_symbol_page *pg, const GArray *mem, key_layout layout, double big,
                              double right, pp_power_fit *fit, GArray *key_members) {
  const pp_recognize_ctx *ctx = pg->ctx;
  g_autoptr(GArray) hits = g_array_new(FALSE, FALSE, sizeof(guint));
  double v[PP_SYMBOL_KEY_MAX], a[PP_SYMBOL_KEY_MAX];
  const pp_label *taken[PP_SYMBOL_KEY_MAX];
  g_array_set_size(key_members, 0);
  for (guint i = 0; i < mem->len; i++) {
    guint idx = g_array_index(mem, guint, i);
    pp_symbol *s = &g_array_index(pg->syms, pp_symbol, idx);
    pp_box_grid_query(pg->labels, search_box(layout, s, pg->label_size, big, right), hits);
    const pp_label *best = NULL;
    double best_d = INFINITY;
    for (guint j = 0; j < hits->len; j++) {
      const pp_label *l = g_ptr_array_index(ctx->labels, g_array_index(hits, guint, j));
      gboolean seen = FALSE;
      for (guint k = 0; k < i && !seen; k++)
        seen = taken[k] == l;
      double d = placement(layout, s, l, big, right);
      if (!seen && pp_claims_label_free(ctx->claims, l->index) && d < best_d)
        best_d = d, best = l;
    }
    if (!best)
      return KEY_NEVER;
    s->label = taken[i] = best;
    v[i] = best->number.value, a[i] = s->ink;
    g_array_append_val(key_members, idx);
  }
  if (pp_power_fit_compute(v, a, mem->len, fit) && fit->exponent > 0)
    return KEY_FITS;
  return KEY_UNFIT;
}

gboolean pp_size_key_find(pp_symbol_page *pg, int family, pp_power_fit *fit, GArray *key_members) {
  GArray *cands = pg->key_families;
  guint kept = 0;
  gboolean found = FALSE;
  for (guint c = 0; c < cands->len; c++) {
    int f = g_array_index(cands, int, c);
    g_array_index(cands, int, kept++) = f;
    if (f == family || found)
      continue;
    const GArray *mem = g_ptr_array_index(pg->members, f);
    double big = 0, right = -INFINITY;
    for (guint i = 0; i < mem->len; i++) {
      const pp_symbol *s = &g_array_index(pg->syms, pp_symbol, g_array_index(mem, guint, i));
      big = fmax(big, s->r), right = fmax(right, s->box.x1);
    }
    /* nested circles read only at their tops: beside their centres the numbers of
     * smaller circles would be taken for larger ones */
    static const key_layout flat[] = {KEY_RIGHT, KEY_BELOW, KEY_ABOVE};
    static const key_layout stacked[] = {KEY_NESTED};
    gboolean is_nested = nested(pg, mem, big);
    const key_layout *layouts = is_nested ? stacked : flat;
    guint n_layouts = is_nested ? G_N_ELEMENTS(stacked) : G_N_ELEMENTS(flat);
    guint never = 0;
    for (guint k = 0; k < n_layouts && !found; k++) {
      key_verdict verdict = try_layout(pg, mem, layouts[k], big, right, fit, key_members);
      found = verdict == KEY_FITS;
      never += verdict == KEY_NEVER;
    }
    if (never == n_layouts)
      kept--; /* no layout will ever give every symbol a number */
  }
  g_array_set_size(cands, kept);
  if (!found)
    g_array_set_size(key_members, 0);
  return found;
}
