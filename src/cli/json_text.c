/* json_text.c — compact JSON text checked, walked and indented without a tree. Reading every
 * page's report into json-glib nodes and writing them out again cost the scheduler more than
 * half its time on a long document; the page entries only travel from the page process into
 * the findings file, so they stay text, indented here exactly as json-glib's generator does. */
#include <string.h>

#include "json_text.h"

/* Deeper nesting is left to json-glib (the caller's slow path); a findings file nests about 8
 * deep, and the bound keeps the recursion here small. No outside source. */
#define PP_JSON_TEXT_MAX_DEPTH 256

static gboolean is_digit(char c) {
  return c >= '0' && c <= '9';
}

/* RFC 8259 §7; the content must be UTF-8 (§8.1). */
static const char *skip_string(const char *p, const char *end) {
  const char *start = ++p;
  gboolean ascii = TRUE;
  while (p < end) {
    guchar c = (guchar)*p;
    if (c >= 0x20 && c < 0x80 && c != '"' && c != '\\') { /* most of the text */
      p++;
      continue;
    }
    if (c == '"')
      return ascii || g_utf8_validate(start, p - start, NULL) ? p + 1 : NULL;
    if (c < 0x20)
      return NULL;
    if (c >= 0x80)
      ascii = FALSE;
    if (c != '\\') {
      p++;
      continue;
    }
    if (++p >= end)
      return NULL;
    if (*p == 'u') {
      for (int i = 1; i <= 4; i++)
        if (p + i >= end || !g_ascii_isxdigit(p[i]))
          return NULL;
      p += 5;
    } else if (strchr("\"\\/bfnrt", *p) && *p) {
      p++;
    } else {
      return NULL;
    }
  }
  return NULL;
}

/* RFC 8259 §6. */
static const char *skip_digits(const char *p, const char *end) {
  if (p >= end || !is_digit(*p))
    return NULL;
  while (p < end && is_digit(*p))
    p++;
  return p;
}

static const char *skip_number(const char *p, const char *end) {
  if (*p == '-')
    p++;
  if (p < end && *p == '0')
    p++;
  else if (!(p = skip_digits(p, end)))
    return NULL;
  if (p < end && *p == '.' && !(p = skip_digits(p + 1, end)))
    return NULL;
  if (p < end && (*p == 'e' || *p == 'E')) {
    p++;
    if (p < end && (*p == '+' || *p == '-'))
      p++;
    p = skip_digits(p, end);
  }
  return p;
}

static const char *skip_word(const char *p, const char *end, const char *word) {
  size_t n = strlen(word);
  return (size_t)(end - p) >= n && memcmp(p, word, n) == 0 ? p + n : NULL;
}

static const char *skip_value(const char *p, const char *end, int depth) {
  if (p >= end)
    return NULL;
  switch (*p) {
  case '"': return skip_string(p, end);
  case 't': return skip_word(p, end, "true");
  case 'f': return skip_word(p, end, "false");
  case 'n': return skip_word(p, end, "null");
  case '{':
  case '[': {
    char close = *p == '{' ? '}' : ']';
    if (depth >= PP_JSON_TEXT_MAX_DEPTH)
      return NULL;
    if (++p < end && *p == close)
      return p + 1;
    for (;;) {
      if (close == '}') {
        if (p >= end || *p != '"' || !(p = skip_string(p, end)) || p >= end || *p != ':')
          return NULL;
        p++;
      }
      if (!(p = skip_value(p, end, depth + 1)) || p >= end)
        return NULL;
      if (*p == close)
        return p + 1;
      if (*p != ',')
        return NULL;
      p++;
    }
  }
  default: return *p == '-' || is_digit(*p) ? skip_number(p, end) : NULL;
  }
}

const char *pp_json_text_skip(const char *p, const char *end) {
  return skip_value(p, end, 0);
}

/* The end of the value at p in text already checked: strings and nesting only. */
static const char *skip_checked(const char *p, const char *end) {
  int depth = 0;
  while (p < end) {
    char c = *p;
    if (c == '"') {
      for (p++; *p != '"'; p++)
        if (*p == '\\')
          p++;
      p++;
    } else if (c == '{' || c == '[') {
      depth++;
      p++;
    } else if (c == '}' || c == ']') {
      if (depth == 0)
        return p;
      depth--;
      p++;
    } else if (c == ',' && depth == 0) {
      return p;
    } else {
      p++;
    }
    if (depth == 0 && (c == '"' || c == '}' || c == ']'))
      return p;
  }
  return p;
}

gboolean pp_json_text_next(const char **p, const char *end, const char **name,
                           const char **name_end, const char **value, const char **value_end) {
  const char *q = *p;
  if (q >= end || *q == '}' || *q == ']')
    return FALSE;
  q++; /* past '{', '[' or ',' */
  if (*q == '}' || *q == ']') {
    *p = q;
    return FALSE;
  }
  if (name) {
    *name = q;
    q = *name_end = skip_checked(q, end);
    q++; /* ':' */
  }
  *value = q;
  *p = *value_end = skip_checked(q, end);
  return TRUE;
}

gboolean pp_json_text_name_is(const char *name, const char *name_end, const char *word) {
  size_t n = strlen(word);
  return (size_t)(name_end - name) == n + 2 && memcmp(name + 1, word, n) == 0;
}

static void spaces(GString *out, guint n) {
  static const char blank[] = "                                ";
  while (n > 0) {
    guint k = MIN(n, sizeof blank - 1);
    g_string_append_len(out, blank, k);
    n -= k;
  }
}

/* json-glib 1.6 json-generator.c: two spaces a level; a member as "name" : value; an
 * empty array "[]", an empty object "{" and its level's indent "}"; members and elements one
 * a line. Strings, numbers and literals are the same text as in the compact form. */
void pp_json_text_indent(GString *out, const char *p, const char *end, guint level) {
  guint lv = level;
  while (p < end) {
    char c = *p;
    if (c == '"') {
      const char *q = p + 1;
      while (*q != '"')
        q += *q == '\\' ? 2 : 1;
      g_string_append_len(out, p, q + 1 - p);
      p = q + 1;
    } else if (c == '{' || c == '[') {
      char close = c == '{' ? '}' : ']';
      g_string_append_c(out, c);
      if (p + 1 < end && p[1] == close) {
        if (c == '{')
          spaces(out, 2 * lv);
        g_string_append_c(out, close);
        p += 2;
      } else {
        g_string_append_c(out, '\n');
        spaces(out, 2 * ++lv);
        p++;
      }
    } else if (c == '}' || c == ']') {
      g_string_append_c(out, '\n');
      spaces(out, 2 * --lv);
      g_string_append_c(out, c);
      p++;
    } else if (c == ',') {
      g_string_append_len(out, ",\n", 2);
      spaces(out, 2 * lv);
      p++;
    } else if (c == ':') {
      g_string_append_len(out, " : ", 3);
      p++;
    } else {
      const char *q = p;
      while (q < end && *q != ',' && *q != ']' && *q != '}')
        q++;
      g_string_append_len(out, p, q - p);
      p = q;
    }
  }
}
