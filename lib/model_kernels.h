/* SPDX-License-Identifier: MIT */
/* The model's shared rules, lane-generic (lib/kernel_lanes.h): the domain
 * of a predicted sodium and body water, the mass balance, and the
 * electrolyte-free water of a fluid. Not installed.
 *
 * A result that another function would refuse as an input is refused where
 * it is made (docs/ranges.md, "Coherent results"). Every function that
 * predicts a sodium by mass balance or aims at one goes through these, so
 * the rule is written once: a sodium predicted or aimed at lies within the
 * input range NTR_NA_MIN..NTR_NA_MAX and body water after a mix within
 * NTR_TBW_MIN..NTR_TBW_MAX; outside, the status is NTR_ERR_DOMAIN (the
 * inputs were each in range, the model is not defined there). Every lib/
 * file gets the scalar kernels (ntri_model_na, ntri_mass_balance, ...)
 * through lib/ntr_internal.h; lib/batch.c also compiles them for two lanes.
 *
 * Compiled once per flavour (the guard below), so no ordinary include
 * guard. */
#if (NTRK_FLAVOUR == 0 && !defined(NTR_MODEL_KERNELS_0)) || \
    (NTRK_FLAVOUR == 1 && !defined(NTR_MODEL_KERNELS_1)) || \
    (NTRK_FLAVOUR == 2 && !defined(NTR_MODEL_KERNELS_2))
#if NTRK_FLAVOUR == 0
#define NTR_MODEL_KERNELS_0
#elif NTRK_FLAVOUR == 1
#define NTR_MODEL_KERNELS_1
#else
#define NTR_MODEL_KERNELS_2
#endif

static inline NTRK_VERDICT NTRK(model_na)(NTRK_REAL na_mmol_l)
{
    NTRK_BEGIN;
    NTRK_REQUIRE(NTRK_WITHIN(na_mmol_l, NTR_NA_MIN, NTR_NA_MAX), NTR_ERR_DOMAIN);
    NTRK_END;
}

static inline NTRK_VERDICT NTRK(model_tbw)(NTRK_REAL tbw_l)
{
    NTRK_BEGIN;
    NTRK_REQUIRE(NTRK_WITHIN(tbw_l, NTR_TBW_MIN, NTR_TBW_MAX), NTR_ERR_DOMAIN);
    NTRK_END;
}

/* Sodium and water after a net volume gain_l whose cation content exceeds
 * that of the same volume of serum by excess_mmol (sum of v*(c - Na0)).
 * Written as Na0 + excess/TBW1, the mass balance
 * (Na0*TBW0 + sum v*c)/(TBW0 + sum v) without cancellation of Na0. The
 * scalar kernel checks water before the division, so it never divides by
 * 0. Used by ntr_balance_predict() and the course (lib/balance.c), the
 * infusate functions (lib/infusion_kernels.h), the feedback fit and the
 * re-lowering estimate. */
static inline NTRK_VERDICT NTRK(mass_balance)(NTRK_REAL na0, NTRK_REAL tbw0,
                                              NTRK_REAL gain_l,
                                              NTRK_REAL excess_mmol,
                                              NTRK_REAL *na1, NTRK_REAL *tbw1)
{
    const NTRK_REAL tbw = tbw0 + gain_l;
    NTRK_REAL na;
    NTRK_BEGIN;
    NTRK_TRY(NTRK(model_tbw)(tbw));
    na = na0 + excess_mmol / tbw;
    NTRK_TRY(NTRK(model_na)(na));
    *na1 = na;
    *tbw1 = tbw;
    NTRK_END;
}

/* Electrolyte-free water in a volume of fluid whose sodium + potassium is
 * cation_mmol_l, at serum sodium na_mmol_l: V*(1 - c/Na) (Shah & Bhave
 * 2018; for urine, the electrolyte-free water clearance). Same unit as the
 * volume. */
static inline NTRK_REAL NTRK(efw)(NTRK_REAL volume, NTRK_REAL cation_mmol_l,
                                  NTRK_REAL na_mmol_l)
{
    return volume * (1.0 - cation_mmol_l / na_mmol_l);
}

#endif
