/* SPDX-License-Identifier: MIT */
/* Sodium formulas, written once (docs/sodium.md): the glucose correction
 * and the sodium deficit, used by lib/sodium.c, by the batch entry points
 * (lib/batch.c) and, for the correction itself, by the work-up and the
 * glucose-aware correction check (lib/workup.c, lib/correction.c).
 * Lane-generic, see lib/kernel_lanes.h. Not installed. */
#ifndef NTR_SODIUM_KERNELS_ONCE
#define NTR_SODIUM_KERNELS_ONCE

/* Glucose molar mass 180.156 g/mol / 10 (mg/dL per mmol/L); both published
 * corrections start at 100 mg/dL. */
#define NTR_GLUCOSE_MG_DL_PER_MMOL_L 18.0156
#define NTR_GLUCOSE_REFERENCE_MG_DL 100.0
#define NTR_KATZ_FACTOR 1.6
#define NTR_HILLIER_FACTOR 2.4

/* The factor of a published glucose correction (NTR_GLUCOSE_*), or
 * NTR_ERR_ARG for an unknown method; *factor is left alone then. */
static inline int ntri_glucose_factor(int method, double *factor)
{
    if (method == NTR_GLUCOSE_KATZ) {
        *factor = NTR_KATZ_FACTOR;
    } else if (method == NTR_GLUCOSE_HILLIER) {
        *factor = NTR_HILLIER_FACTOR;
    } else {
        return NTR_ERR_ARG;
    }
    return NTR_OK;
}
#endif

#if (NTRK_FLAVOUR == 0 && !defined(NTR_SODIUM_KERNELS_0)) || \
    (NTRK_FLAVOUR == 1 && !defined(NTR_SODIUM_KERNELS_1)) || \
    (NTRK_FLAVOUR == 2 && !defined(NTR_SODIUM_KERNELS_2))
#if NTRK_FLAVOUR == 0
#define NTR_SODIUM_KERNELS_0
#elif NTRK_FLAVOUR == 1
#define NTR_SODIUM_KERNELS_1
#else
#define NTR_SODIUM_KERNELS_2
#endif

/* Glucose-corrected sodium (Katz, Hillier, or a caller's factor per
 * 100 mg/dL) of inputs already checked: no correction up to 100 mg/dL,
 * then factor per 100 mg/dL above it. */
static inline NTRK_REAL NTRK(glucose_corrected)(NTRK_REAL na_mmol_l,
                                                NTRK_REAL glucose_mmol_l,
                                                NTRK_REAL factor_per_100mg_dl)
{
    NTRK_REAL glucose_mg_dl = glucose_mmol_l * NTR_GLUCOSE_MG_DL_PER_MMOL_L;
    return NTRK_SELECT(NTRK_LE(glucose_mg_dl, NTRK_K(NTR_GLUCOSE_REFERENCE_MG_DL)),
                       na_mmol_l,
                       na_mmol_l + factor_per_100mg_dl *
                                       (glucose_mg_dl - NTR_GLUCOSE_REFERENCE_MG_DL) /
                                       100.0);
}

/* ntr_na_corrected_glucose_factor(): the inputs checked, then corrected. */
static inline NTRK_VERDICT NTRK(na_corrected_glucose_factor)(
    NTRK_REAL na_mmol_l, NTRK_REAL glucose_mmol_l,
    NTRK_REAL factor_per_100mg_dl, NTRK_REAL *na_corrected_mmol_l)
{
    NTRK_BEGIN;
    NTRK_CHECK(na_mmol_l, NTR_NA_MIN, NTR_NA_MAX);
    NTRK_CHECK(glucose_mmol_l, 0.0, NTR_GLUCOSE_MAX);
    NTRK_CHECK(factor_per_100mg_dl, 0.0, NTR_GLUCOSE_FACTOR_MAX);
    *na_corrected_mmol_l = NTRK(glucose_corrected)(na_mmol_l, glucose_mmol_l,
                                                   factor_per_100mg_dl);
    NTRK_END;
}

/* Sodium deficit to a higher target: TBW * (target - Na), mmol. */
static inline NTRK_VERDICT NTRK(na_deficit)(NTRK_REAL tbw_l, NTRK_REAL na_mmol_l,
                                            NTRK_REAL target_na_mmol_l,
                                            NTRK_REAL *mmol)
{
    NTRK_BEGIN;
    NTRK_CHECK(tbw_l, NTR_TBW_MIN, NTR_TBW_MAX);
    NTRK_CHECK(na_mmol_l, NTR_NA_MIN, NTR_NA_MAX);
    NTRK_CHECK(target_na_mmol_l, NTR_NA_MIN, NTR_NA_MAX);
    NTRK_REQUIRE(NTRK_GE(target_na_mmol_l, na_mmol_l), NTR_ERR_DOMAIN);
    *mmol = tbw_l * (target_na_mmol_l - na_mmol_l);
    NTRK_END;
}

#endif
