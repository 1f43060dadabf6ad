/* claims.c — the claims ledger: who holds each mark and each label of a page. Claims
 * made inside a transaction are journalled, so a rollback frees exactly what the
 * attempt took and a commit hands it to the enclosing transaction (or makes it final). */
#include "internal.h"

typedef struct {
  gboolean is_label;
  guint index;
} claim;

struct pp_claims {
  const char **mark_owner; /* n_marks entries, NULL when free */
  const char **label_owner;
  guint n_marks, n_labels;
  GArray *journal; /* of claim: every claim made inside an open transaction */
  GArray *starts;  /* of guint: journal length when each open transaction began */
};

pp_claims *pp_claims_new(guint n_marks, guint n_labels) {
  pp_claims *c = g_new0(pp_claims, 1);
  c->n_marks = n_marks;
  c->n_labels = n_labels;
  c->mark_owner = g_new0(const char *, MAX(n_marks, 1));
  c->label_owner = g_new0(const char *, MAX(n_labels, 1));
  c->journal = g_array_new(FALSE, FALSE, sizeof(claim));
  c->starts = g_array_new(FALSE, FALSE, sizeof(guint));
  return c;
}

void pp_claims_free(pp_claims *c) {
  if (!c)
    return;
  g_free(c->mark_owner);
  g_free(c->label_owner);
  g_array_unref(c->journal);
  g_array_unref(c->starts);
  g_free(c);
}

gboolean pp_claims_mark_free(const pp_claims *c, guint mark) {
  return mark < c->n_marks && c->mark_owner[mark] == NULL;
}

gboolean pp_claims_label_free(const pp_claims *c, guint label) {
  return label < c->n_labels && c->label_owner[label] == NULL;
}

const char *pp_claims_mark_owner(const pp_claims *c, guint mark) {
  return mark < c->n_marks ? c->mark_owner[mark] : NULL;
}

const char *pp_claims_label_owner(const pp_claims *c, guint label) {
  return label < c->n_labels ? c->label_owner[label] : NULL;
}

static void take(pp_claims *c, gboolean is_label, guint index, const char *owner) {
  const char **slot = is_label ? &c->label_owner[index] : &c->mark_owner[index];
  g_return_if_fail(owner != NULL && *slot == NULL);
  *slot = owner;
  if (c->starts->len > 0) {
    claim k = {is_label, index};
    g_array_append_val(c->journal, k);
  }
}

void pp_claims_take_mark(pp_claims *c, guint mark, const char *owner) {
  g_return_if_fail(mark < c->n_marks);
  take(c, FALSE, mark, owner);
}

void pp_claims_take_label(pp_claims *c, guint label, const char *owner) {
  g_return_if_fail(label < c->n_labels);
  take(c, TRUE, label, owner);
}

gboolean pp_claims_take_mark_if_free(pp_claims *c, guint mark, const char *owner) {
  if (!pp_claims_mark_free(c, mark))
    return FALSE;
  pp_claims_take_mark(c, mark, owner);
  return TRUE;
}

gboolean pp_claims_take_label_if_free(pp_claims *c, guint label, const char *owner) {
  if (!pp_claims_label_free(c, label))
    return FALSE;
  pp_claims_take_label(c, label, owner);
  return TRUE;
}

void pp_claims_begin(pp_claims *c) {
  guint start = c->journal->len;
  g_array_append_val(c->starts, start);
}

/* The claims stay; an enclosing transaction still journals them, so its rollback
 * frees them too. */
void pp_claims_commit(pp_claims *c) {
  g_return_if_fail(c->starts->len > 0);
  g_array_set_size(c->starts, c->starts->len - 1);
  if (c->starts->len == 0)
    g_array_set_size(c->journal, 0);
}

void pp_claims_rollback(pp_claims *c) {
  g_return_if_fail(c->starts->len > 0);
  guint start = g_array_index(c->starts, guint, c->starts->len - 1);
  for (guint i = c->journal->len; i-- > start;) {
    claim k = g_array_index(c->journal, claim, i);
    if (k.is_label)
      c->label_owner[k.index] = NULL;
    else
      c->mark_owner[k.index] = NULL;
  }
  g_array_set_size(c->journal, start);
  g_array_set_size(c->starts, c->starts->len - 1);
}

guint pp_claims_depth(const pp_claims *c) {
  return c->starts->len;
}
