/* html_util.c — the HTML pieces every page of the review pack shares: escaping (all
 * text from a PDF passes through pp_html_append_escaped), the page frame, the
 * stylesheet, and the small Markdown subset the rule pages are written in. */
#include <string.h>

#include "review.h"

void pp_html_append_escaped(GString *out, const char *s) {
  if (!s)
    return;
  char *valid = g_utf8_make_valid(s, -1);
  for (const char *p = valid; *p; p++) {
    switch (*p) {
    case '&': g_string_append(out, "&amp;"); break;
    case '<': g_string_append(out, "&lt;"); break;
    case '>': g_string_append(out, "&gt;"); break;
    case '"': g_string_append(out, "&quot;"); break;
    case '\'': g_string_append(out, "&#39;"); break;
    default: g_string_append_c(out, *p);
    }
  }
  g_free(valid);
}

const char *pp_html_stylesheet(void) {
  return "body{font:15px/1.45 system-ui,sans-serif;margin:0 auto;max-width:1100px;"
         "padding:1em 2em;color:#1b1b1f;background:#fff}\n"
         "h1{font-size:1.6em;margin:.3em 0}h2{font-size:1.2em;margin:1.4em 0 .3em}"
         "h3{font-size:1.05em;margin:1em 0 .3em}\n"
         "table{border-collapse:collapse;margin:.5em 0}"
         "th,td{border:1px solid #c9ccd3;padding:.25em .6em;text-align:left;vertical-align:top}\n"
         "th{background:#eef0f4}td.n{text-align:right;font-variant-numeric:tabular-nums}\n"
         "th a{color:inherit}th.sorted{background:#dde3f0}\n"
         ".sev{display:inline-block;padding:0 .5em;border-radius:3px;font-weight:600;"
         "font-size:.9em}\n"
         ".sev-0{background:#e8eef7;color:#23436b}.sev-1{background:#fff1cc;color:#6b4a00}"
         ".sev-2{background:#fbdada;color:#7a1111}\n"
         ".finding{border-top:2px solid #c9ccd3;margin-top:1.5em;padding-top:.5em}\n"
         ".headline{font-size:1.15em;font-weight:600;margin:.4em 0}\n"
         ".cols{display:flex;flex-wrap:wrap;gap:1.5em;align-items:flex-start}\n"
         ".crop{border:1px solid #c9ccd3;max-width:100%;height:auto}\n"
         ".legend{font-size:.9em;color:#444}.legend span{white-space:nowrap;margin-right:1em}\n"
         ".key{display:inline-block;width:1.6em;height:.7em;vertical-align:middle;"
         "margin-right:.3em}\n"
         ".note{color:#555;font-size:.9em}nav{margin:.5em 0 1em}nav a{margin-right:1em}\n"
         "code{background:#f2f3f6;padding:0 .2em}\n";
}

void pp_html_begin(GString *out, const char *title, const char *css_href) {
  g_string_append(out, "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n"
                       "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n"
                       "<title>");
  pp_html_append_escaped(out, title);
  g_string_append(out, "</title>\n");
  if (css_href) {
    g_string_append(out, "<link rel=\"stylesheet\" href=\"");
    pp_html_append_escaped(out, css_href);
    g_string_append(out, "\">\n");
  } else {
    g_string_append_printf(out, "<style>\n%s</style>\n", pp_html_stylesheet());
  }
  g_string_append(out, "</head>\n<body>\n");
}

void pp_html_end(GString *out) {
  g_string_append(out, "</body>\n</html>\n");
}

/* Inline markup: `code`, **bold**, *emphasis*, [text](url); everything else escaped. */
static void append_inline(GString *out, const char *s) {
  while (*s) {
    const char *close;
    if (*s == '`' && (close = strchr(s + 1, '`'))) {
      char *t = g_strndup(s + 1, (gsize)(close - s - 1));
      g_string_append(out, "<code>");
      pp_html_append_escaped(out, t);
      g_string_append(out, "</code>");
      g_free(t);
      s = close + 1;
    } else if (g_str_has_prefix(s, "**") && (close = strstr(s + 2, "**"))) {
      char *t = g_strndup(s + 2, (gsize)(close - s - 2));
      g_string_append(out, "<strong>");
      append_inline(out, t);
      g_string_append(out, "</strong>");
      g_free(t);
      s = close + 2;
    } else if (*s == '*' && s[1] != ' ' && (close = strchr(s + 1, '*'))) {
      char *t = g_strndup(s + 1, (gsize)(close - s - 1));
      g_string_append(out, "<em>");
      append_inline(out, t);
      g_string_append(out, "</em>");
      g_free(t);
      s = close + 1;
    } else {
      const char *mid, *end;
      if (*s == '[' && (mid = strstr(s, "](")) && (end = strchr(mid, ')'))) {
        char *text = g_strndup(s + 1, (gsize)(mid - s - 1));
        char *url = g_strndup(mid + 2, (gsize)(end - mid - 2));
        g_string_append(out, "<a href=\"");
        pp_html_append_escaped(out, url);
        g_string_append(out, "\">");
        append_inline(out, text);
        g_string_append(out, "</a>");
        g_free(text);
        g_free(url);
        s = end + 1;
        continue;
      }
      char one[2] = {*s, 0};
      pp_html_append_escaped(out, one);
      s++;
    }
  }
}

static gboolean is_blank(const char *line) {
  for (; *line; line++)
    if (!g_ascii_isspace(*line))
      return FALSE;
  return TRUE;
}

char *pp_html_from_markdown(const char *markdown) {
  GString *out = g_string_new(NULL);
  char **lines = g_strsplit(markdown ? markdown : "", "\n", -1);
  GString *para = g_string_new(NULL);
  gboolean in_list = FALSE;
  for (guint i = 0;; i++) {
    const char *line = lines[i];
    gboolean blank = !line || is_blank(line);
    gboolean item = line && (g_str_has_prefix(line, "- ") || g_str_has_prefix(line, "* "));
    gboolean heading = line && line[0] == '#';
    gboolean cont = line && in_list && !item && !blank && !heading && line[0] == ' ';
    if (para->len && (blank || item || heading || !line)) {
      g_string_append(out, in_list ? "" : "<p>");
      append_inline(out, para->str);
      g_string_append(out, in_list ? "</li>\n" : "</p>\n");
      g_string_truncate(para, 0);
    }
    if (in_list && !item && !cont && (blank || heading || !line)) {
      g_string_append(out, "</ul>\n");
      in_list = FALSE;
    }
    if (!line)
      break;
    if (heading) {
      int level = (int)strspn(line, "#");
      const char *text = line + level;
      while (*text == ' ')
        text++;
      level = CLAMP(level, 1, 6);
      g_string_append_printf(out, "<h%d>", level);
      append_inline(out, text);
      g_string_append_printf(out, "</h%d>\n", level);
    } else if (item) {
      if (!in_list)
        g_string_append(out, "<ul>\n");
      in_list = TRUE;
      g_string_append(out, "<li>");
      g_string_append(para, line + 2);
    } else if (!blank) {
      if (para->len)
        g_string_append_c(para, ' ');
      const char *t = line;
      while (*t == ' ')
        t++;
      g_string_append(para, t);
    }
  }
  g_string_free(para, TRUE);
  g_strfreev(lines);
  return g_string_free(out, FALSE);
}
