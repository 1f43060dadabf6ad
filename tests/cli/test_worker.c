/* test_worker.c — a child that reports in lines (pp_worker_run_lines): every line it wrote
 * reaches the parent whole and in order, lines longer than a pipe's 64 KiB included; the
 * parent hears of a batch's end (NULL) only after lines; a line cut short by the child's
 * death never arrives; "stop" from the handler ends the child; the wall limit counts from
 * the last line. The reference is what the test's own child wrote, byte for byte; the end
 * states follow POSIX.1-2017 wait() (WIFSIGNALED, WTERMSIG). */
#include <setjmp.h>
#include <signal.h>
#include <stdarg.h>
#include <stddef.h>
#include <string.h>
#include <unistd.h>

#include <cmocka.h>
#include <glib.h>

#include "cli/worker.h"

/* The child's script: n lines, line i of size_of(i) bytes of a pattern, then an ending. */
typedef struct {
  guint n_lines;
  gboolean huge;        /* line 3 is 3 MiB, far past a pipe's capacity */
  gboolean die_in_line; /* after the lines, half a line, then SIGKILL on itself */
  guint sleep_after;    /* after this many lines, sleeps for good (0: never) */
} script;

static gsize size_of(const script *s, guint i) {
  return s->huge && i == 3 ? 3u << 20 : 1 + (i * 7919u) % 5000;
}

static char *make_line(const script *s, guint i) {
  gsize n = size_of(s, i);
  char *line = g_malloc(n + 1);
  for (gsize k = 0; k < n; k++)
    line[k] = (char)('a' + (i + k) % 26);
  line[n] = '\0';
  return line;
}

static gboolean child_lines(int fd, gpointer data) {
  const script *s = data;
  for (guint i = 0; i < s->n_lines; i++) {
    if (s->sleep_after && i == s->sleep_after)
      for (;;)
        pause();
    char *line = make_line(s, i);
    char *with_nl = g_strconcat(line, "\n", NULL);
    gboolean ok = pp_worker_write_all(fd, with_nl, strlen(with_nl));
    g_free(with_nl);
    g_free(line);
    if (!ok)
      return FALSE;
  }
  if (s->die_in_line) {
    const char half[] = "half a line that never ends";
    if (!pp_worker_write_all(fd, half, sizeof half - 1))
      return FALSE;
    kill(getpid(), SIGKILL);
  }
  return TRUE;
}

typedef struct {
  const script *s;
  guint got;        /* lines received */
  guint batch_ends; /* NULL calls */
  gboolean null_without_line;
  gboolean since_null; /* a line came since the last NULL */
  guint stop_at;       /* say stop on this line (G_MAXUINT: never) */
  gboolean mismatch;
} received;

static gboolean on_line(const char *line, gpointer data) {
  received *r = data;
  if (!line) {
    r->batch_ends++;
    if (!r->since_null)
      r->null_without_line = TRUE;
    r->since_null = FALSE;
    return TRUE;
  }
  r->since_null = TRUE;
  char *want = make_line(r->s, r->got);
  if (strcmp(line, want) != 0)
    r->mismatch = TRUE;
  g_free(want);
  r->got++;
  return r->got - 1 != r->stop_at;
}

static void run(const script *s, guint stop_at, guint wall_s, received *r, pp_worker_result *res) {
  *r = (received){s, 0, 0, FALSE, FALSE, stop_at, FALSE};
  pp_worker_limits limits = {wall_s, 0, 0};
  pp_worker_run_lines(child_lines, (gpointer)s, &limits, on_line, r, res);
}

static void test_every_line_whole_and_in_order(void **state) {
  (void)state;
  script s = {2000, TRUE, FALSE, 0};
  received r;
  pp_worker_result res;
  run(&s, G_MAXUINT, 60, &r, &res);
  assert_int_equal(res.outcome, PP_WORKER_DONE);
  assert_int_equal(r.got, 2000);
  assert_false(r.mismatch);
  assert_true(r.batch_ends >= 1);
  assert_false(r.null_without_line);
  assert_false(r.since_null); /* the last lines were followed by a NULL too */
  g_string_free(res.payload, TRUE);
}

static void test_cut_line_never_arrives(void **state) {
  (void)state;
  script s = {5, FALSE, TRUE, 0};
  received r;
  pp_worker_result res;
  run(&s, G_MAXUINT, 60, &r, &res);
  assert_int_equal(res.outcome, PP_WORKER_SIGNALLED);
  assert_int_equal(res.signal, SIGKILL);
  assert_int_equal(r.got, 5); /* not 6: the half line is dropped */
  assert_false(r.mismatch);
  g_string_free(res.payload, TRUE);
}

static void test_stop_ends_the_child(void **state) {
  (void)state;
  script s = {50, FALSE, FALSE, 10}; /* would sleep for good after 10 lines */
  received r;
  pp_worker_result res;
  gint64 t0 = g_get_monotonic_time();
  run(&s, 4, 60, &r, &res);
  assert_int_equal(r.got, 5);                         /* lines 0..4; line 4 said stop */
  assert_int_equal(res.outcome, PP_WORKER_TIMED_OUT); /* killed by the parent */
  assert_true(g_get_monotonic_time() - t0 < 10 * G_USEC_PER_SEC);
  g_string_free(res.payload, TRUE);
}

static void test_wall_limit_from_last_line(void **state) {
  (void)state;
  script s = {50, FALSE, FALSE, 3}; /* three lines, then silence */
  received r;
  pp_worker_result res;
  gint64 t0 = g_get_monotonic_time();
  run(&s, G_MAXUINT, 1, &r, &res);
  gint64 took = g_get_monotonic_time() - t0;
  assert_int_equal(res.outcome, PP_WORKER_TIMED_OUT);
  assert_int_equal(r.got, 3);
  assert_false(r.mismatch);
  /* One second of silence, then the kill; well under the child's own alarm (1 + 5 s). */
  assert_true(took >= G_USEC_PER_SEC);
  assert_true(took < 4 * G_USEC_PER_SEC);
  g_string_free(res.payload, TRUE);
}

int main(void) {
  const struct CMUnitTest tests[] = {
      cmocka_unit_test(test_every_line_whole_and_in_order),
      cmocka_unit_test(test_cut_line_never_arrives),
      cmocka_unit_test(test_stop_ends_the_child),
      cmocka_unit_test(test_wall_limit_from_last_line),
  };
  return cmocka_run_group_tests(tests, NULL, NULL);
}
