/* Therapy steps of the demo: the solute decision for patient A.
 * The patient and every value are invented. */
#include "demo_therapy.h"

#include <natremia.h>
#include <stdio.h>
#include <stdlib.h>

/* Invented for patient A: a poor diet gives little solute to excrete. */
#define SOLUTE_MOSM_DAY 600.0
/* Net insensible loss of a resting adult (common practice, docs/solute.md). */
#define INSENSIBLE_L_DAY 0.5
/* The restriction the team would like to keep to. */
#define TARGET_L_DAY 1.0
/* A round urea dose the team might choose (sachets of 15 g). */
#define UREA_CHOSEN_G_DAY 15.0

static void check(int status, const char *what)
{
    if (status != NTR_OK) {
        fprintf(stderr, "natremia-demo: %s failed (status %d)\n", what, status);
        exit(1);
    }
}

static const char *verdict_words(int verdict)
{
    switch (verdict) {
    case NTR_OUTLOOK_TARGET_HOLDS:
        return "restricting to the target holds the sodium";
    case NTR_OUTLOOK_STRICTER_OR_SOLUTE:
        return "the target is too much: restrict further, or add solute";
    default:
        return "restriction alone cannot hold the sodium: add solute or other treatment";
    }
}

static void print_dose(const char *name, double grams)
{
    if (grams == NTR_OUTLOOK_NO_DOSE) {
        printf("    %-24s no dose up to 200 g/day reaches it\n", name);
    } else {
        printf("    %-24s %6.1f g/day\n", name, grams);
    }
}

void therapy_solute_step(const char *title, const struct therapy_urine *u)
{
    ntr_outlook o;
    double with_urea;
    o.struct_size = sizeof o;
    check(ntr_restriction_outlook(SOLUTE_MOSM_DAY, u->urine_osm_mosm_kg, u->urine_na_mmol_l,
                                  u->urine_k_mmol_l, u->serum_na_mmol_l, INSENSIBLE_L_DAY,
                                  TARGET_L_DAY, &o),
          "ntr_restriction_outlook");
    check(ntr_fluid_allowance_with_dose(NTR_SOLUTE_UREA, UREA_CHOSEN_G_DAY, SOLUTE_MOSM_DAY,
                                        u->urine_osm_mosm_kg, u->urine_na_mmol_l,
                                        u->urine_k_mmol_l, u->serum_na_mmol_l,
                                        INSENSIBLE_L_DAY, &with_urea),
          "ntr_fluid_allowance_with_dose");

    printf("\n== %s ==\n", title);
    printf("  Solute excreted (invented, a poor diet): %.0f mOsm/day; net insensible "
           "loss\n  %.1f L/day (common practice); urine osmolality %.0f mOsm/kg.\n",
           SOLUTE_MOSM_DAY, INSENSIBLE_L_DAY, u->urine_osm_mosm_kg);
    printf("  Urine the solute makes: %.0f / %.0f = %.2f L/day (Berl)\n", SOLUTE_MOSM_DAY,
           u->urine_osm_mosm_kg, o.urine_l_day);
    printf("  Its electrolyte-free water clearance: %.2f L/day (Furst ratio %.2f)\n",
           o.efwc_l_day, o.furst_ratio);
    printf("  Fluid allowance with the current solute: %.2f L/day\n", o.allowance_l_day);
    printf("  Target restriction %.1f L/day ->\n    %s.\n", o.target_intake_l_day,
           verdict_words(o.verdict));
    printf("  Daily solute that makes %.1f L/day hold:\n", o.target_intake_l_day);
    print_dose("of urea", o.urea_g_day);
    print_dose("or of NaCl tablets", o.nacl_g_day);
    printf("  With urea %.0f g/day the allowance becomes %.2f L/day.\n", UREA_CHOSEN_G_DAY,
           with_urea);
    printf("  Steady state at a fixed urine osmolality: recheck the urine as the sodium\n"
           "  corrects; thirst and adherence are not in the sums.\n");
}
