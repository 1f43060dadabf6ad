/* test_claims.c — the claims ledger: what a transaction takes, a rollback gives back and
 * a commit keeps, nested the way recognizers nest their attempts. The expected states
 * follow from the ledger's contract in src/recognize/internal.h alone. */
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>

#include <cmocka.h>

#include "recognize/internal.h"

static void test_free_and_owner(void **state) {
  (void)state;
  g_autoptr(pp_claims) c = pp_claims_new(4, 3);
  assert_true(pp_claims_mark_free(c, 0));
  assert_true(pp_claims_label_free(c, 2));
  assert_false(pp_claims_mark_free(c, 4)); /* out of range is never free */
  pp_claims_take_mark(c, 1, "bars");
  pp_claims_take_label(c, 2, "value-axis");
  assert_false(pp_claims_mark_free(c, 1));
  assert_string_equal(pp_claims_mark_owner(c, 1), "bars");
  assert_string_equal(pp_claims_label_owner(c, 2), "value-axis");
  assert_null(pp_claims_mark_owner(c, 0));
  /* marks and labels are separate spaces: label 1 is still free */
  assert_true(pp_claims_label_free(c, 1));
  assert_false(pp_claims_take_mark_if_free(c, 1, "areas"));
  assert_string_equal(pp_claims_mark_owner(c, 1), "bars");
  assert_true(pp_claims_take_mark_if_free(c, 3, "areas"));
}

static void test_rollback_gives_back_only_the_attempt(void **state) {
  (void)state;
  g_autoptr(pp_claims) c = pp_claims_new(5, 5);
  pp_claims_take_mark(c, 0, "before"); /* outside any transaction: final */
  pp_claims_begin(c);
  assert_int_equal(pp_claims_depth(c), 1);
  pp_claims_take_mark(c, 1, "try");
  pp_claims_take_label(c, 4, "try");
  pp_claims_rollback(c);
  assert_int_equal(pp_claims_depth(c), 0);
  assert_true(pp_claims_mark_free(c, 1));
  assert_true(pp_claims_label_free(c, 4));
  assert_string_equal(pp_claims_mark_owner(c, 0), "before");
}

static void test_commit_keeps(void **state) {
  (void)state;
  g_autoptr(pp_claims) c = pp_claims_new(3, 0);
  pp_claims_begin(c);
  pp_claims_take_mark(c, 2, "bars");
  pp_claims_commit(c);
  assert_int_equal(pp_claims_depth(c), 0);
  assert_string_equal(pp_claims_mark_owner(c, 2), "bars");
  /* a later failed attempt does not undo an earlier committed one */
  pp_claims_begin(c);
  pp_claims_take_mark(c, 1, "areas");
  pp_claims_rollback(c);
  assert_string_equal(pp_claims_mark_owner(c, 2), "bars");
  assert_true(pp_claims_mark_free(c, 1));
}

/* Nested: an inner commit hands its claims to the outer transaction, whose rollback
 * then frees them too; an inner rollback leaves the outer claims alone. */
static void test_nested(void **state) {
  (void)state;
  g_autoptr(pp_claims) c = pp_claims_new(6, 0);
  pp_claims_begin(c);
  pp_claims_take_mark(c, 0, "outer");
  pp_claims_begin(c);
  pp_claims_take_mark(c, 1, "inner");
  pp_claims_commit(c);
  pp_claims_begin(c);
  pp_claims_take_mark(c, 2, "inner2");
  pp_claims_rollback(c);
  assert_int_equal(pp_claims_depth(c), 1);
  assert_string_equal(pp_claims_mark_owner(c, 1), "inner");
  assert_true(pp_claims_mark_free(c, 2));
  pp_claims_rollback(c);
  for (guint i = 0; i < 3; i++)
    assert_true(pp_claims_mark_free(c, i));
  /* the same again, committed at both levels: everything stays */
  pp_claims_begin(c);
  pp_claims_take_mark(c, 3, "outer");
  pp_claims_begin(c);
  pp_claims_take_mark(c, 4, "inner");
  pp_claims_commit(c);
  pp_claims_commit(c);
  assert_false(pp_claims_mark_free(c, 3));
  assert_false(pp_claims_mark_free(c, 4));
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_free_and_owner),
      cmocka_unit_test(test_rollback_gives_back_only_the_attempt),
      cmocka_unit_test(test_commit_keeps),
      cmocka_unit_test(test_nested),
  };
  return cmocka_run_group_tests_name("recognize/claims", tests, NULL, NULL);
}
