/* progress.c — the progress line. The rate is documents per second since the start;
 * time left assumes the remaining documents take as long on average. */
#include <stdio.h>
#include <string.h>

#include "cli.h"
#include "progress.h"

struct pp_progress {
  guint total, done, failed, pages, findings;
  gboolean in_place, lines, drawn;
  gint64 start_us;
};

pp_progress *pp_progress_new(guint total, gboolean in_place, gboolean lines) {
  pp_progress *p = g_new0(pp_progress, 1);
  p->total = total;
  p->in_place = in_place && !lines;
  p->lines = lines;
  p->start_us = g_get_monotonic_time();
  return p;
}

void pp_progress_free(pp_progress *p) {
  if (p)
    pp_progress_clear(p);
  g_free(p);
}

guint pp_progress_done(const pp_progress *p) {
  return p->done;
}

void pp_progress_pages(pp_progress *p, guint pages) {
  p->pages += pages;
}

static void format_duration(char *buf, size_t n, double s) {
  if (s < 60)
    snprintf(buf, n, "%.0fs", s);
  else if (s < 3600)
    snprintf(buf, n, "%dm%02ds", (int)(s / 60), (int)s % 60);
  else
    snprintf(buf, n, "%dh%02dm", (int)(s / 3600), (int)(s / 60) % 60);
}

void pp_progress_document(pp_progress *p, const char *path, const char *status, guint pages,
                          guint findings, double seconds) {
  p->done++;
  p->findings += findings;
  if (strcmp(status, "failed") == 0)
    p->failed++;
  if (p->lines) {
    char *name = pp_cli_escape(path);
    fprintf(stderr, "plotproof: [%u/%u] %s: %s, %u pages, %u findings, %.1f s\n", p->done, p->total,
            name, status, pages, findings, seconds);
    fflush(stderr);
    g_free(name);
  }
  pp_progress_draw(p);
}

void pp_progress_draw(pp_progress *p) {
  if (!p->in_place)
    return;
  double elapsed = (g_get_monotonic_time() - p->start_us) / 1e6;
  double rate = elapsed > 0 ? p->done / elapsed : 0;
  char left[32] = "?";
  if (rate > 0)
    format_duration(left, sizeof left, (p->total - p->done) / rate);
  fprintf(stderr, "\r\033[K%u/%u documents, %u pages, %u findings, %u failed, %.2f docs/s, %s left",
          p->done, p->total, p->pages, p->findings, p->failed, rate, left);
  fflush(stderr);
  p->drawn = TRUE;
}

void pp_progress_clear(pp_progress *p) {
  if (p->in_place && p->drawn) {
    fprintf(stderr, "\r\033[K");
    fflush(stderr);
    p->drawn = FALSE;
  }
}
