/* Template sentence generator for the demo report's body text. */
#include "demo_prose.h"

static const char *subjects[] = {"Our crews",
                                 "The board",
                                 "Fjordhaven",
                                 "The freight division",
                                 "Our passenger routes",
                                 "The new hybrid vessels",
                                 "The harbour services unit",
                                 "The management team",
                                 "Our shipyard partners",
                                 "The northern network"};
static const char *verbs[] = {"delivered", "strengthened", "maintained", "secured",
                              "expanded",  "improved",     "reviewed",   "supported"};
static const char *objects[] = {
    "a steady rise in bookings",          "the reliability of the timetable",
    "our position on the coastal routes", "the efficiency of every crossing",
    "the safety record of the fleet",     "cooperation with the municipal port offices",
    "the digital ticketing platform",     "the training programme for deck officers",
    "the renewal of the older ferries",   "long-term charter agreements"};
static const char *tails[] = {"during the year",
                              "despite a demanding winter season",
                              "ahead of the plan adopted in 2029",
                              "while keeping costs under firm control",
                              "across all five regions",
                              "in line with our long-term strategy",
                              "with the support of our employees",
                              "as the new terminals came into service"};
static const char *extras[] = {
    "Weather disruptions were below the ten-year average.",
    "No serious injuries were recorded on board our vessels.",
    "We thank our customers for their continued loyalty.",
    "Investment decisions follow the capital allocation policy set out on page 14.",
    "The outlook for the coming year remains cautiously positive.",
    "Two older vessels were sold for recycling at certified yards."};

char *pp_demo_prose_paragraph(pp_gen_rng *rng, int n_sentences) {
  GString *s = g_string_new(NULL);
  for (int i = 0; i < n_sentences; i++) {
    if (i)
      g_string_append_c(s, ' ');
    if (pp_gen_rng_int(rng, 0, 4) == 0) {
      g_string_append(s, extras[pp_gen_rng_int(rng, 0, G_N_ELEMENTS(extras) - 1)]);
      continue;
    }
    g_string_append_printf(s, "%s %s %s %s.",
                           subjects[pp_gen_rng_int(rng, 0, G_N_ELEMENTS(subjects) - 1)],
                           verbs[pp_gen_rng_int(rng, 0, G_N_ELEMENTS(verbs) - 1)],
                           objects[pp_gen_rng_int(rng, 0, G_N_ELEMENTS(objects) - 1)],
                           tails[pp_gen_rng_int(rng, 0, G_N_ELEMENTS(tails) - 1)]);
  }
  return g_string_free(s, FALSE);
}
