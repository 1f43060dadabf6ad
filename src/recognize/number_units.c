/* number_units.c — the vocabulary of number labels: currency symbols and codes, magnitude
 * suffixes in English, German, French and Indian usage, percent and permille signs, and the
 * longest-match lookup the label reader (number.c) uses on both sides of the digits. */
#include "recognize/number_units.h"

#include <glib.h>
#include <string.h>

static const pp_number_unit units[] = {
    {"%", PP_UNIT_PERCENT, 0},
    {"\u066a", PP_UNIT_PERCENT, 0},
    {"\uff05", PP_UNIT_PERCENT, 0},
    {"\u2030", PP_UNIT_PERMILLE, 0},
    /* magnitudes: English, German, French compact forms (see CLDR compact decimals) */
    {"k", PP_UNIT_MULT, 3},
    {"K", PP_UNIT_MULT, 3},
    {"Tsd.", PP_UNIT_MULT, 3},
    {"Tsd", PP_UNIT_MULT, 3},
    {"thousand", PP_UNIT_MULT, 3},
    {"Tausend", PP_UNIT_MULT, 3},
    {"mille", PP_UNIT_MULT, 3},
    {"millier", PP_UNIT_MULT, 3},
    {"milliers", PP_UNIT_MULT, 3},
    {"L", PP_UNIT_MULT, 5},
    {"lakh", PP_UNIT_MULT, 5},
    {"Lakh", PP_UNIT_MULT, 5},
    {"lac", PP_UNIT_MULT, 5},
    {"m", PP_UNIT_MULT, 6},
    {"M", PP_UNIT_MULT, 6},
    {"mn", PP_UNIT_MULT, 6},
    {"Mn", PP_UNIT_MULT, 6},
    {"MN", PP_UNIT_MULT, 6},
    {"MM", PP_UNIT_MULT, 6},
    {"Mio.", PP_UNIT_MULT, 6},
    {"Mio", PP_UNIT_MULT, 6},
    {"million", PP_UNIT_MULT, 6},
    {"millions", PP_UNIT_MULT, 6},
    {"Million", PP_UNIT_MULT, 6},
    {"Millionen", PP_UNIT_MULT, 6},
    {"Cr", PP_UNIT_MULT, 7},
    {"crore", PP_UNIT_MULT, 7},
    {"Crore", PP_UNIT_MULT, 7},
    {"bn", PP_UNIT_MULT, 9},
    {"Bn", PP_UNIT_MULT, 9},
    {"BN", PP_UNIT_MULT, 9},
    {"B", PP_UNIT_MULT, 9},
    {"Mrd.", PP_UNIT_MULT, 9},
    {"Mrd", PP_UNIT_MULT, 9},
    {"Md", PP_UNIT_MULT, 9},
    {"Mds", PP_UNIT_MULT, 9},
    {"billion", PP_UNIT_MULT, 9},
    {"Milliarde", PP_UNIT_MULT, 9},
    {"Milliarden", PP_UNIT_MULT, 9},
    {"milliard", PP_UNIT_MULT, 9},
    {"milliards", PP_UNIT_MULT, 9},
    {"tn", PP_UNIT_MULT, 12},
    {"Tn", PP_UNIT_MULT, 12},
    {"T", PP_UNIT_MULT, 12},
    {"Bio.", PP_UNIT_MULT, 12},
    {"Bio", PP_UNIT_MULT, 12},
    {"trillion", PP_UNIT_MULT, 12},
    {"Billionen", PP_UNIT_MULT, 12},
    /* currency symbols, then ISO 4217 codes in common use ("RMB" is not ISO but is printed) */
    {"$", PP_UNIT_CURRENCY, 0},
    {"\u20ac", PP_UNIT_CURRENCY, 0},
    {"\u00a3", PP_UNIT_CURRENCY, 0},
    {"\u00a5", PP_UNIT_CURRENCY, 0},
    {"\u20b9", PP_UNIT_CURRENCY, 0},
    {"\u20a9", PP_UNIT_CURRENCY, 0},
    {"\u20bd", PP_UNIT_CURRENCY, 0},
    {"\u20ba", PP_UNIT_CURRENCY, 0},
    {"\u20aa", PP_UNIT_CURRENCY, 0},
    {"\u20ab", PP_UNIT_CURRENCY, 0},
    {"\u20a6", PP_UNIT_CURRENCY, 0},
    {"\u20b1", PP_UNIT_CURRENCY, 0},
    {"\u20b4", PP_UNIT_CURRENCY, 0},
    {"\u0e3f", PP_UNIT_CURRENCY, 0},
    {"\u00a2", PP_UNIT_CURRENCY, 0},
    {"US$", PP_UNIT_CURRENCY, 0},
    {"A$", PP_UNIT_CURRENCY, 0},
    {"AU$", PP_UNIT_CURRENCY, 0},
    {"C$", PP_UNIT_CURRENCY, 0},
    {"CA$", PP_UNIT_CURRENCY, 0},
    {"NZ$", PP_UNIT_CURRENCY, 0},
    {"HK$", PP_UNIT_CURRENCY, 0},
    {"S$", PP_UNIT_CURRENCY, 0},
    {"R$", PP_UNIT_CURRENCY, 0},
    {"MX$", PP_UNIT_CURRENCY, 0},
    {"$US", PP_UNIT_CURRENCY, 0},
    {"$CA", PP_UNIT_CURRENCY, 0},
    {"$AU", PP_UNIT_CURRENCY, 0},
    {"Fr.", PP_UNIT_CURRENCY, 0},
    {"fr.", PP_UNIT_CURRENCY, 0},
    {"kr", PP_UNIT_CURRENCY, 0},
    {"kr.", PP_UNIT_CURRENCY, 0},
    {"Kr", PP_UNIT_CURRENCY, 0},
    {"z\u0142", PP_UNIT_CURRENCY, 0},
    {"K\u010d", PP_UNIT_CURRENCY, 0},
    {"Ft", PP_UNIT_CURRENCY, 0},
    {"Rs", PP_UNIT_CURRENCY, 0},
    {"Rs.", PP_UNIT_CURRENCY, 0},
    {"USD", PP_UNIT_CURRENCY, 0},
    {"EUR", PP_UNIT_CURRENCY, 0},
    {"GBP", PP_UNIT_CURRENCY, 0},
    {"JPY", PP_UNIT_CURRENCY, 0},
    {"CHF", PP_UNIT_CURRENCY, 0},
    {"CNY", PP_UNIT_CURRENCY, 0},
    {"RMB", PP_UNIT_CURRENCY, 0},
    {"CAD", PP_UNIT_CURRENCY, 0},
    {"AUD", PP_UNIT_CURRENCY, 0},
    {"NZD", PP_UNIT_CURRENCY, 0},
    {"SEK", PP_UNIT_CURRENCY, 0},
    {"NOK", PP_UNIT_CURRENCY, 0},
    {"DKK", PP_UNIT_CURRENCY, 0},
    {"ISK", PP_UNIT_CURRENCY, 0},
    {"INR", PP_UNIT_CURRENCY, 0},
    {"RUB", PP_UNIT_CURRENCY, 0},
    {"BRL", PP_UNIT_CURRENCY, 0},
    {"ZAR", PP_UNIT_CURRENCY, 0},
    {"HKD", PP_UNIT_CURRENCY, 0},
    {"SGD", PP_UNIT_CURRENCY, 0},
    {"KRW", PP_UNIT_CURRENCY, 0},
    {"MXN", PP_UNIT_CURRENCY, 0},
    {"PLN", PP_UNIT_CURRENCY, 0},
    {"CZK", PP_UNIT_CURRENCY, 0},
    {"HUF", PP_UNIT_CURRENCY, 0},
    {"TRY", PP_UNIT_CURRENCY, 0},
    {"ILS", PP_UNIT_CURRENCY, 0},
    {"AED", PP_UNIT_CURRENCY, 0},
    {"SAR", PP_UNIT_CURRENCY, 0},
    {"THB", PP_UNIT_CURRENCY, 0},
    {"IDR", PP_UNIT_CURRENCY, 0},
    {"MYR", PP_UNIT_CURRENCY, 0},
    {"PHP", PP_UNIT_CURRENCY, 0},
    {"TWD", PP_UNIT_CURRENCY, 0},
    {"ARS", PP_UNIT_CURRENCY, 0},
    {"CLP", PP_UNIT_CURRENCY, 0},
    {"COP", PP_UNIT_CURRENCY, 0},
    {"PEN", PP_UNIT_CURRENCY, 0},
    {"UAH", PP_UNIT_CURRENCY, 0},
    {"RON", PP_UNIT_CURRENCY, 0},
    {"BGN", PP_UNIT_CURRENCY, 0},
    {"EGP", PP_UNIT_CURRENCY, 0},
    {"NGN", PP_UNIT_CURRENCY, 0},
    {"KES", PP_UNIT_CURRENCY, 0},
    {"PKR", PP_UNIT_CURRENCY, 0},
    {"VND", PP_UNIT_CURRENCY, 0},
};

/* The table by first byte, in table order within a byte, built once: the lookup runs for every
 * character around the digits of every numeric word, and the first byte rules out nearly every
 * unit. */
static guint8 by_byte[G_N_ELEMENTS(units)];
static guint8 by_byte_len[G_N_ELEMENTS(units)];
static guint16 byte_start[257];
G_STATIC_ASSERT(G_N_ELEMENTS(units) < 256);

static void index_units(void) {
  static gsize indexed = 0;
  if (!g_once_init_enter(&indexed))
    return;
  guint16 fill[256] = {0};
  for (size_t i = 0; i < G_N_ELEMENTS(units); i++)
    byte_start[(guchar)units[i].text[0] + 1]++;
  for (int b = 0; b < 256; b++)
    byte_start[b + 1] += byte_start[b];
  for (size_t i = 0; i < G_N_ELEMENTS(units); i++) {
    guchar b = (guchar)units[i].text[0];
    guint16 k = byte_start[b] + fill[b]++;
    by_byte[k] = (guint8)i;
    by_byte_len[k] = (guint8)strlen(units[i].text);
  }
  g_once_init_leave(&indexed, 1);
}

/* Longest unit at p, the first in table order among equals (the scan of one byte's units keeps
 * table order). A unit ending in a letter must not run on into another letter, so "km" is
 * neither "k" nor "kr" and "EURO" is not "EUR". */
const pp_number_unit *pp_number_unit_match(const char *p, const char *end, size_t *len) {
  const pp_number_unit *best = NULL;
  size_t best_len = 0;
  index_units();
  guchar b = p < end ? (guchar)*p : 0;
  for (guint k = byte_start[b]; p < end && k < byte_start[b + 1]; k++) {
    const pp_number_unit *u = &units[by_byte[k]];
    size_t n = by_byte_len[k];
    if (n <= best_len || (size_t)(end - p) < n || memcmp(p, u->text, n) != 0)
      continue;
    if (g_ascii_isalpha(p[n - 1]) && p + n < end && g_ascii_isalpha(p[n]))
      continue;
    best = u;
    best_len = n;
  }
  *len = best_len;
  return best;
}
