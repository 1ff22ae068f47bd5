/* SPDX-License-Identifier: MIT */
/* Body-water formulas, written once (docs/water.md): the kernels of
 * ntr_tbw_fraction(), ntr_tbw_watson() and ntr_free_water_deficit(), used
 * by those functions (lib/water.c) and by their batch entry points
 * (lib/batch.c). Lane-generic, see lib/kernel_lanes.h. Not installed. */
#ifndef NTR_WATER_KERNELS_ONCE
#define NTR_WATER_KERNELS_ONCE

/* The normal serum sodium the free-water deficit restores, mmol/L. */
#define NTR_NORMAL_NA_MMOL_L 140.0

/* Adrogue & Madias 2000: fraction of body weight that is water. */
#define NTR_WATER_MAN 0.6          /* and children from 1 year */
#define NTR_WATER_WOMAN 0.5        /* and men from 65 */
#define NTR_WATER_OLDER_WOMAN 0.45 /* from 65 */

/* Weights, kg, for which every Watson body water inside the accepted share
 * of weight (NTR_TBW_SHARE_MIN..NTR_TBW_SHARE_MAX) is also inside the
 * model's NTR_TBW_MIN..NTR_TBW_MAX: in doubles 0.20 * 0.5 rounds to
 * exactly 0.1 and 0.80 * 500 to exactly 400, and rounding is monotonic.
 * The two-lane Watson kernel tests this instead of the body water. */
#define NTR_WATSON_SURE_WEIGHT_MIN 0.5
#define NTR_WATSON_SURE_WEIGHT_MAX 500.0
#endif

#if (NTRK_FLAVOUR == 0 && !defined(NTR_WATER_KERNELS_0)) || \
    (NTRK_FLAVOUR == 1 && !defined(NTR_WATER_KERNELS_1)) || \
    (NTRK_FLAVOUR == 2 && !defined(NTR_WATER_KERNELS_2))
#if NTRK_FLAVOUR == 0
#define NTR_WATER_KERNELS_0
#elif NTRK_FLAVOUR == 1
#define NTR_WATER_KERNELS_1
#else
#define NTR_WATER_KERNELS_2
#endif

static inline NTRK_TEST NTRK(sex_known)(NTRK_SEX sex)
{
    return NTRK_OR(NTRK_SEX_IS(sex, NTR_SEX_MALE), NTRK_SEX_IS(sex, NTR_SEX_FEMALE));
}

/* Adrogue & Madias 2000 fraction for an age the caller checked: children
 * (from 1 year; infants are refused before this, their water share is
 * higher and falls over the first year, docs/water.md), men, men from 65,
 * women, women from 65: 0.6, 0.6, 0.5, 0.5, 0.45. Two choices pick among
 * the three values (branch-free in the two lanes of lib/batch.c): an adult
 * woman or an older man has 0.5, or 0.45 for a woman from 65; everyone
 * else (children, men under 65) 0.6. Any sex other than female takes the male value: such a row is
 * refused with NTR_ERR_ARG anyway. */
static inline NTRK_REAL NTRK(water_fraction)(NTRK_SEX sex, NTRK_REAL age_years)
{
    NTRK_TEST adult = NTRK_GE(age_years, NTRK_K(NTR_ADULT_AGE));
    NTRK_TEST elderly = NTRK_GE(age_years, NTRK_K(NTR_ELDERLY_AGE));
    NTRK_TEST female = NTRK_SEX_IS(sex, NTR_SEX_FEMALE);
    NTRK_REAL lower = NTRK_SELECT(NTRK_AND(female, elderly),
                                  NTRK_K(NTR_WATER_OLDER_WOMAN),
                                  NTRK_K(NTR_WATER_WOMAN));
    return NTRK_SELECT(NTRK_AND(adult, NTRK_OR(female, elderly)), lower,
                       NTRK_K(NTR_WATER_MAN));
}

/* Total body water from the Adrogue & Madias fraction: fraction * weight. */
static inline NTRK_VERDICT NTRK(tbw_fraction)(NTRK_SEX sex, NTRK_REAL age_years,
                                              NTRK_REAL weight_kg,
                                              NTRK_REAL *litres)
{
    NTRK_BEGIN;
    NTRK_REQUIRE(NTRK(sex_known)(sex), NTR_ERR_ARG);
    NTRK_CHECK(age_years, NTR_TBW_FRACTION_AGE_MIN, NTR_AGE_MAX);
    NTRK_CHECK(weight_kg, NTR_WEIGHT_MIN, NTR_WEIGHT_MAX);
    *litres = NTRK(water_fraction)(sex, age_years) * weight_kg;
    NTRK_END;
}

/* Watson's equations are regressions; outside a plausible share of body
 * weight their result is not a body water (docs/water.md). */
static inline NTRK_VERDICT NTRK(tbw_share)(NTRK_REAL tbw_l, NTRK_REAL weight_kg)
{
    NTRK_BEGIN;
    NTRK_REQUIRE(NTRK_AND(NTRK_GE(tbw_l, NTR_TBW_SHARE_MIN * weight_kg),
                          NTRK_LE(tbw_l, NTR_TBW_SHARE_MAX * weight_kg)),
                 NTR_ERR_DOMAIN);
    NTRK_END;
}

/* Watson, Watson & Batt 1980:
 *   men   2.447 - 0.09516*age + 0.1074*height + 0.3362*weight
 *   women -2.097 + 0.1069*height + 0.2466*weight */
static inline NTRK_VERDICT NTRK(tbw_watson)(NTRK_SEX sex, NTRK_REAL age_years,
                                            NTRK_REAL height_cm,
                                            NTRK_REAL weight_kg,
                                            NTRK_REAL *litres)
{
    NTRK_REAL tbw;
    NTRK_BEGIN;
    NTRK_REQUIRE(NTRK(sex_known)(sex), NTR_ERR_ARG);
    NTRK_CHECK(age_years, NTR_ADULT_AGE, NTR_AGE_MAX);
    NTRK_CHECK(height_cm, NTR_HEIGHT_MIN, NTR_HEIGHT_MAX);
    /* Two lanes take only the weights for which the share check below
     * implies the model's body-water range (NTR_WATSON_SURE_WEIGHT_*). */
    NTRK_CHECK_NARROW(weight_kg, NTR_WEIGHT_MIN, NTR_WEIGHT_MAX,
                      NTR_WATSON_SURE_WEIGHT_MIN, NTR_WATSON_SURE_WEIGHT_MAX);
    tbw = NTRK_SELECT(NTRK_SEX_IS(sex, NTR_SEX_MALE),
                      2.447 - 0.09516 * age_years + 0.1074 * height_cm +
                          0.3362 * weight_kg,
                      -2.097 + 0.1069 * height_cm + 0.2466 * weight_kg);
    /* A regression extrapolated past the bodies it was fitted on can give
     * any number (0.02 L for a 20 kg man 30 cm tall, 164% of the weight
     * of a 10 kg woman 150 cm tall): refuse what is no body water, and
     * what no function taking a body water would accept. */
    NTRK_TRY(NTRK(tbw_share)(tbw, weight_kg));
    /* Implied in two lanes by the share check and the narrower weight. */
    NTRK_TRY_IMPLIED(NTRK(model_tbw)(tbw));
    *litres = tbw;
    NTRK_END;
}

/* Free-water deficit of hypernatraemia: TBW * (Na/140 - 1), L. */
static inline NTRK_VERDICT NTRK(free_water_deficit)(NTRK_REAL tbw_l,
                                                    NTRK_REAL na_mmol_l,
                                                    NTRK_REAL *litres)
{
    NTRK_BEGIN;
    NTRK_CHECK(tbw_l, NTR_TBW_MIN, NTR_TBW_MAX);
    /* Defined for a sodium at or above normal only. */
    NTRK_CHECK_DEFINED(na_mmol_l, NTR_NA_MIN, NTR_NA_MAX, NTR_NORMAL_NA_MMOL_L,
                       NTR_NA_MAX);
    *litres = tbw_l * (na_mmol_l / NTR_NORMAL_NA_MMOL_L - 1.0);
    NTRK_END;
}

#endif
