/* SPDX-License-Identifier: MIT */
/* Solute, urine volume and fluid restriction (docs/solute.md).
 *
 * Everything here rests on two relations written once each: Berl's urine
 * volume (solute / urine osmolality, urine_volume_of below) and the
 * electrolyte-free water clearance with the Furst ratio (ntr_efwc and
 * ntr_furst_ratio in lib/urine.c, called rather than re-derived). */
#include "ntr_internal.h"

/* NaCl from the same IUPAC atomic weights lib/units.c converts with. */
#define MM_NACL (NTR_AW_NA + NTR_AW_CL)

struct solute_kind {
    double molar_mass_g_mol;
    double osmoles_per_mole; /* NaCl: 2, full dissociation (an idealisation) */
};

/* Indexed by NTR_SOLUTE_*; entry 0 is unused. */
static const struct solute_kind solute_kinds[] = {
    {0.0, 0.0},
    {NTR_MM_UREA, 1.0},
    {MM_NACL, 2.0},
};

#define N_SOLUTE_KINDS (sizeof solute_kinds / sizeof solute_kinds[0])

static const struct solute_kind *kind_of(int solute)
{
    if (solute < 1 || (size_t)solute >= N_SOLUTE_KINDS) {
        return NULL;
    }
    return &solute_kinds[solute];
}

/* mOsm per gram of the solute. */
static double mosm_per_gram(const struct solute_kind *k)
{
    return 1000.0 * k->osmoles_per_mole / k->molar_mass_g_mol;
}

/* Berl: V (L/day) = solute (mOsm/day) / urine osmolality (mOsm/kg). */
static double urine_volume_of(double solute_mosm_day, double urine_osm_mosm_kg)
{
    return solute_mosm_day / urine_osm_mosm_kg;
}

static int check_solute_and_osm(double solute_mosm_day, double urine_osm_mosm_kg)
{
    NTR_TRY(ntr_check(solute_mosm_day, 0.0, NTR_SOLUTE_MOSM_DAY_MAX));
    return ntr_check(urine_osm_mosm_kg, NTR_URINE_OSM_MIN, NTR_URINE_OSM_MAX);
}

/* The six inputs every allowance starts from, checked in argument order.
 * ntr_furst_ratio checks the urine and serum values exactly as ntr_efwc
 * will (same ranges, same order), and its ratio is the outlook's. */
static int check_urine_day(double solute_mosm_day, double urine_osm_mosm_kg,
                           double urine_na_mmol_l, double urine_k_mmol_l,
                           double serum_na_mmol_l, double insensible_l_day,
                           double *ratio)
{
    NTR_TRY(check_solute_and_osm(solute_mosm_day, urine_osm_mosm_kg));
    NTR_TRY(ntr_furst_ratio(urine_na_mmol_l, urine_k_mmol_l, serum_na_mmol_l, ratio));
    return ntr_check(insensible_l_day, 0.0, NTR_INSENSIBLE_L_DAY_MAX);
}

struct urine_day {
    double urine_l_day;
    double efwc_l_day;
    double allowance_l_day;
};

/* The allowance of inputs already checked: NTR_ERR_DOMAIN when the urine
 * volume leaves the range every urine volume of the library keeps to. */
static int allowance_of(double solute_mosm_day, double urine_osm_mosm_kg,
                        double urine_na_mmol_l, double urine_k_mmol_l,
                        double serum_na_mmol_l, double insensible_l_day,
                        struct urine_day *day)
{
    double v = urine_volume_of(solute_mosm_day, urine_osm_mosm_kg);
    double efwc;
    if (v > NTR_URINE_VOLUME_MAX) {
        return NTR_ERR_DOMAIN;
    }
    NTR_TRY(ntr_efwc(v, urine_na_mmol_l, urine_k_mmol_l, serum_na_mmol_l, &efwc));
    day->urine_l_day = v;
    day->efwc_l_day = efwc;
    day->allowance_l_day = efwc + insensible_l_day;
    return NTR_OK;
}

int ntr_urine_volume_from_solute(double solute_mosm_day, double urine_osm_mosm_kg,
                                 double *urine_l_day)
{
    double v;
    if (urine_l_day == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(check_solute_and_osm(solute_mosm_day, urine_osm_mosm_kg));
    v = urine_volume_of(solute_mosm_day, urine_osm_mosm_kg);
    if (v > NTR_URINE_VOLUME_MAX) {
        return NTR_ERR_DOMAIN;
    }
    *urine_l_day = v;
    return NTR_OK;
}

int ntr_fluid_allowance(double solute_mosm_day, double urine_osm_mosm_kg,
                        double urine_na_mmol_l, double urine_k_mmol_l,
                        double serum_na_mmol_l, double insensible_l_day,
                        double *intake_l_day)
{
    struct urine_day day;
    double ratio;
    if (intake_l_day == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(check_urine_day(solute_mosm_day, urine_osm_mosm_kg, urine_na_mmol_l,
                            urine_k_mmol_l, serum_na_mmol_l, insensible_l_day, &ratio));
    NTR_TRY(allowance_of(solute_mosm_day, urine_osm_mosm_kg, urine_na_mmol_l,
                         urine_k_mmol_l, serum_na_mmol_l, insensible_l_day, &day));
    *intake_l_day = day.allowance_l_day;
    return NTR_OK;
}

int ntr_solute_dose_osmoles(int solute, double grams, double *mosm)
{
    const struct solute_kind *k;
    if (mosm == NULL) {
        return NTR_ERR_NULL;
    }
    k = kind_of(solute);
    if (k == NULL) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntr_check(grams, 0.0, NTR_SOLUTE_GRAMS_MAX));
    *mosm = grams * mosm_per_gram(k);
    return NTR_OK;
}

int ntr_fluid_allowance_with_dose(int solute, double grams_day, double solute_mosm_day,
                                  double urine_osm_mosm_kg, double urine_na_mmol_l,
                                  double urine_k_mmol_l, double serum_na_mmol_l,
                                  double insensible_l_day, double *intake_l_day)
{
    const struct solute_kind *k;
    struct urine_day day;
    double ratio, added_l_day;
    if (intake_l_day == NULL) {
        return NTR_ERR_NULL;
    }
    k = kind_of(solute);
    if (k == NULL) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntr_check(grams_day, 0.0, NTR_SOLUTE_GRAMS_MAX));
    NTR_TRY(check_urine_day(solute_mosm_day, urine_osm_mosm_kg, urine_na_mmol_l,
                            urine_k_mmol_l, serum_na_mmol_l, insensible_l_day, &ratio));
    NTR_TRY(allowance_of(solute_mosm_day, urine_osm_mosm_kg, urine_na_mmol_l,
                         urine_k_mmol_l, serum_na_mmol_l, insensible_l_day, &day));
    /* The dose's osmoles leave in extra urine at the same osmolality; that
     * urine carries no net electrolyte (urea is none; the tablets' sodium
     * is taken in and excreted alike), so all of it is free water. */
    added_l_day = urine_volume_of(grams_day * mosm_per_gram(k), urine_osm_mosm_kg);
    if (day.urine_l_day + added_l_day > NTR_URINE_VOLUME_MAX) {
        return NTR_ERR_DOMAIN;
    }
    *intake_l_day = day.allowance_l_day + added_l_day;
    return NTR_OK;
}

/* The daily dose that lifts a checked allowance to the target: 0 when it
 * is there already; NTR_ERR_DOMAIN past the dose or urine volume range. */
static int dose_for(const struct solute_kind *k, const struct urine_day *day,
                    double urine_osm_mosm_kg, double target_intake_l_day,
                    double *grams_day)
{
    double added_l_day = target_intake_l_day - day->allowance_l_day;
    double grams;
    if (added_l_day <= 0.0) {
        *grams_day = 0.0;
        return NTR_OK;
    }
    if (day->urine_l_day + added_l_day > NTR_URINE_VOLUME_MAX) {
        return NTR_ERR_DOMAIN;
    }
    /* Berl's relation read backwards: solute = V * urine osmolality. */
    grams = added_l_day * urine_osm_mosm_kg / mosm_per_gram(k);
    if (grams > NTR_SOLUTE_GRAMS_MAX) {
        return NTR_ERR_DOMAIN;
    }
    *grams_day = grams;
    return NTR_OK;
}

static int check_target(double target_intake_l_day)
{
    /* Above 0: a target of no intake at all is not a fluid allowance. */
    NTR_TRY(ntr_check(target_intake_l_day, 0.0, NTR_INTAKE_L_DAY_MAX));
    return target_intake_l_day > 0.0 ? NTR_OK : NTR_ERR_RANGE;
}

int ntr_solute_dose_for_allowance(int solute, double solute_mosm_day,
                                  double urine_osm_mosm_kg, double urine_na_mmol_l,
                                  double urine_k_mmol_l, double serum_na_mmol_l,
                                  double insensible_l_day, double target_intake_l_day,
                                  double *grams_day)
{
    const struct solute_kind *k;
    struct urine_day day;
    double ratio;
    if (grams_day == NULL) {
        return NTR_ERR_NULL;
    }
    k = kind_of(solute);
    if (k == NULL) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(check_urine_day(solute_mosm_day, urine_osm_mosm_kg, urine_na_mmol_l,
                            urine_k_mmol_l, serum_na_mmol_l, insensible_l_day, &ratio));
    NTR_TRY(check_target(target_intake_l_day));
    NTR_TRY(allowance_of(solute_mosm_day, urine_osm_mosm_kg, urine_na_mmol_l,
                         urine_k_mmol_l, serum_na_mmol_l, insensible_l_day, &day));
    return dose_for(k, &day, urine_osm_mosm_kg, target_intake_l_day, grams_day);
}

/* A dose for the outlook: the grams, or NTR_OUTLOOK_NO_DOSE with the flag. */
static double outlook_dose(int solute, const struct urine_day *day,
                           double urine_osm_mosm_kg, double target_intake_l_day,
                           unsigned int out_of_range_flag, unsigned int *flags)
{
    double grams;
    if (dose_for(kind_of(solute), day, urine_osm_mosm_kg, target_intake_l_day, &grams) !=
        NTR_OK) {
        *flags |= out_of_range_flag;
        return NTR_OUTLOOK_NO_DOSE;
    }
    return grams;
}

static int verdict_of(double allowance_l_day, double target_intake_l_day)
{
    if (allowance_l_day <= 0.0) {
        return NTR_OUTLOOK_RESTRICTION_FAILS;
    }
    return allowance_l_day >= target_intake_l_day ? NTR_OUTLOOK_TARGET_HOLDS
                                                  : NTR_OUTLOOK_STRICTER_OR_SOLUTE;
}

int ntr_restriction_outlook(double solute_mosm_day, double urine_osm_mosm_kg,
                            double urine_na_mmol_l, double urine_k_mmol_l,
                            double serum_na_mmol_l, double insensible_l_day,
                            double target_intake_l_day, ntr_outlook *out)
{
    struct urine_day day;
    double ratio, urea_g, nacl_g;
    int advice;
    unsigned int flags = 0u;
    if (out == NULL) {
        return NTR_ERR_NULL;
    }
    if (out->struct_size < sizeof(ntr_outlook)) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(check_urine_day(solute_mosm_day, urine_osm_mosm_kg, urine_na_mmol_l,
                            urine_k_mmol_l, serum_na_mmol_l, insensible_l_day, &ratio));
    NTR_TRY(check_target(target_intake_l_day));
    NTR_TRY(allowance_of(solute_mosm_day, urine_osm_mosm_kg, urine_na_mmol_l,
                         urine_k_mmol_l, serum_na_mmol_l, insensible_l_day, &day));
    /* In range by construction: (500 + 300) / 80 = 10 <= NTR_RATIO_MAX. */
    NTR_TRY(ntr_restriction_from_ratio(ratio, &advice));
    if (ratio > NTR_FURST_ABOUT_ONE_HIGH) {
        flags |= NTR_OUTLOOK_FURST_ABOVE_ONE;
    }
    urea_g = outlook_dose(NTR_SOLUTE_UREA, &day, urine_osm_mosm_kg, target_intake_l_day,
                          NTR_OUTLOOK_UREA_OUT_OF_RANGE, &flags);
    nacl_g = outlook_dose(NTR_SOLUTE_NACL, &day, urine_osm_mosm_kg, target_intake_l_day,
                          NTR_OUTLOOK_NACL_OUT_OF_RANGE, &flags);

    out->verdict = verdict_of(day.allowance_l_day, target_intake_l_day);
    out->furst_advice = advice;
    out->furst_ratio = ratio;
    out->urine_l_day = day.urine_l_day;
    out->efwc_l_day = day.efwc_l_day;
    out->allowance_l_day = day.allowance_l_day;
    out->target_intake_l_day = target_intake_l_day;
    out->urea_g_day = urea_g;
    out->nacl_g_day = nacl_g;
    out->flags = flags;
    out->reserved = 0u;
    return NTR_OK;
}
