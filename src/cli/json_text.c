/* json_text.c — compact JSON text checked, walked and indented without a tree. Reading every
 * page's report into json-glib nodes and writing them out again cost the scheduler more than
 * half its time on a long document; the page entries only travel from the page process into
 * the findings file, so they stay text, indented here exactly as json-glib's generator does. */
#include <string.h>

#include "json_text.h"

/* Deeper nesting is left to json-glib (the caller's slow path); a findings file nests about 8
 * deep, and the bound keeps the recursion here small. No outside source. */
#define PP_JSON_TEXT_MAX_DEPTH 256

/* The bytes that open, close or separate values in compact text; the others (digits, letters,
 * the ':' after a name) are passed over by one table look-up each. */
static const guchar structural[256] = {
    ['"'] = 1, ['{'] = 1, ['['] = 1, ['}'] = 1, [']'] = 1, [','] = 1};

#define PP_ROW(x) x, x, x, x, x, x, x, x, x, x, x, x, x, x, x, x
/* The bytes a string holds as they are: printable ASCII but '"' (0x22) and '\\' (0x5c). */
static const guchar string_plain[256] = {
    PP_ROW(0), PP_ROW(0), 1, 1, 0, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, /* 0x20 */
    PP_ROW(1), PP_ROW(1), 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 0, 1, 1, 1, /* 0x50 */
    PP_ROW(1), PP_ROW(1)};
#undef PP_ROW

static gboolean is_digit(char c) {
  return c >= '0' && c <= '9';
}

/* RFC 8259 §7; the content must be UTF-8 (§8.1). */
static const char *skip_string(const char *p, const char *end) {
  const char *start = ++p;
  gboolean ascii = TRUE;
  while (p < end) {
    guchar c = (guchar)*p;
    if (string_plain[c]) { /* most of the text */
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
const char *pp_json_text_end(const char *p, const char *end) {
  int depth = 0;
  for (;;) {
    while (p < end && !structural[(guchar)*p])
      p++;
    if (p >= end)
      return p;
    char c = *p;
    if (c == '"') {
      for (p++; *p != '"'; p++)
        if (*p == '\\')
          p++;
      p++;
      if (depth == 0)
        return p;
    } else if (c == '{' || c == '[') {
      depth++;
      p++;
    } else if (depth == 0) { /* the ',' after a value, or its container's close */
      return p;
    } else if (c == ',') {
      p++;
    } else if (--depth == 0) {
      return p + 1;
    } else {
      p++;
    }
  }
}

gboolean pp_json_text_member(const char **p, const char *end, const char **name,
                             const char **name_end) {
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
    q = *name_end = pp_json_text_end(q, end);
    q++; /* ':' */
  }
  *p = q;
  return TRUE;
}

gboolean pp_json_text_next(const char **p, const char *end, const char **name,
                           const char **name_end, const char **value, const char **value_end) {
  if (!pp_json_text_member(p, end, name, name_end))
    return FALSE;
  *value = *p;
  *p = *value_end = pp_json_text_end(*p, end);
  return TRUE;
}

gboolean pp_json_text_name_is(const char *name, const char *name_end, const char *word) {
  size_t n = strlen(word);
  return (size_t)(name_end - name) == n + 2 && memcmp(name + 1, word, n) == 0;
}

/* Room for n more bytes at offset w of out: the text is written through a pointer, and out's
 * length runs ahead of w (cut back at the end), so that most bytes cost no call. */
#define PP_JSON_TEXT_SLACK 4096 /* bytes grown ahead at a time; no outside source */

static char *room(GString *out, gsize w, gsize n) {
  if (w + n > out->len)
    g_string_set_size(out, w + n + PP_JSON_TEXT_SLACK);
  return out->str + w;
}

/* A line break and the indent of level lv after the byte c. */
static gsize newline(GString *out, gsize w, char c, guint lv) {
  char *o = room(out, w, 2 + 2 * (gsize)lv);
  o[0] = c;
  o[1] = '\n';
  memset(o + 2, ' ', 2 * (gsize)lv);
  return w + 2 + 2 * (gsize)lv;
}

/* json-glib 1.6 json-generator.c: two spaces a level; a member as "name" : value; an
 * empty array "[]", an empty object "{" and its level's indent "}"; members and elements one
 * a line. Strings, numbers and literals are the same text as in the compact form. */
void pp_json_text_indent(GString *out, const char *p, const char *end, guint level) {
  guint lv = level;
  gsize w = out->len;
  while (p < end) {
    char c = *p;
    const char *q = p;
    if (c == '"') {
      for (q++; *q != '"'; q++)
        if (*q == '\\')
          q++;
      q++;
    } else if (c == '{' || c == '[') {
      char close = c == '{' ? '}' : ']';
      if (p + 1 < end && p[1] == close) {
        guint pad = c == '{' ? 2 * lv : 0;
        char *o = room(out, w, 2 + pad);
        o[0] = c;
        memset(o + 1, ' ', pad);
        o[1 + pad] = close;
        w += 2 + pad;
        p += 2;
      } else {
        w = newline(out, w, c, ++lv);
        p++;
      }
      continue;
    } else if (c == '}' || c == ']') {
      char *o = room(out, w, 2 + 2 * (gsize)--lv);
      o[0] = '\n';
      memset(o + 1, ' ', 2 * (gsize)lv);
      o[1 + 2 * lv] = c;
      w += 2 + 2 * (gsize)lv;
      p++;
      continue;
    } else if (c == ',') {
      w = newline(out, w, ',', lv);
      p++;
      continue;
    } else if (c == ':') {
      memcpy(room(out, w, 3), " : ", 3);
      w += 3;
      p++;
      continue;
    } else {
      while (q < end && !structural[(guchar)*q]) /* a scalar ends at ',' ']' '}' */
        q++;
    }
    memcpy(room(out, w, (gsize)(q - p)), p, (gsize)(q - p));
    w += (gsize)(q - p);
    p = q;
  }
  g_string_truncate(out, w);
}
