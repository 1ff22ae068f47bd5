/* SPDX-License-Identifier: MIT */
/* Urine indices, written once (docs/urine.md): the kernels of
 * ntr_furst_ratio(), ntr_restriction_from_ratio() and ntr_efwc(), used by
 * those functions (lib/urine.c) and by their batch entry points
 * (lib/batch.c). Lane-generic, see lib/kernel_lanes.h. Not installed. */
#ifndef NTR_URINE_KERNELS_ONCE
#define NTR_URINE_KERNELS_ONCE
/* The advice bands are 1, 2, 3 in order, which ntri_restriction_from_ratio
 * counts on (a negative array size stops the build otherwise). */
typedef char ntri_restriction_bands_in_order
    [(NTR_RESTRICT_500_700ML == NTR_RESTRICT_1000ML + 1 &&
      NTR_RESTRICT_500ML == NTR_RESTRICT_1000ML + 2) ? 1 : -1];
#endif

#if (NTRK_FLAVOUR == 0 && !defined(NTR_URINE_KERNELS_0)) || \
    (NTRK_FLAVOUR == 1 && !defined(NTR_URINE_KERNELS_1)) || \
    (NTRK_FLAVOUR == 2 && !defined(NTR_URINE_KERNELS_2))
#if NTRK_FLAVOUR == 0
#define NTR_URINE_KERNELS_0
#elif NTRK_FLAVOUR == 1
#define NTR_URINE_KERNELS_1
#else
#define NTR_URINE_KERNELS_2
#endif

static inline NTRK_VERDICT NTRK(urine_inputs)(NTRK_REAL urine_na_mmol_l,
                                              NTRK_REAL urine_k_mmol_l,
                                              NTRK_REAL serum_na_mmol_l)
{
    NTRK_BEGIN;
    NTRK_CHECK(urine_na_mmol_l, 0.0, NTR_URINE_NA_MAX);
    NTRK_CHECK(urine_k_mmol_l, 0.0, NTR_URINE_K_MAX);
    NTRK_CHECK(serum_na_mmol_l, NTR_NA_MIN, NTR_NA_MAX);
    NTRK_END;
}

/* Furst 2000: (U_Na + U_K) / S_Na. */
static inline NTRK_VERDICT NTRK(furst_ratio)(NTRK_REAL urine_na_mmol_l,
                                             NTRK_REAL urine_k_mmol_l,
                                             NTRK_REAL serum_na_mmol_l,
                                             NTRK_REAL *ratio)
{
    NTRK_BEGIN;
    NTRK_TRY(NTRK(urine_inputs)(urine_na_mmol_l, urine_k_mmol_l, serum_na_mmol_l));
    *ratio = (urine_na_mmol_l + urine_k_mmol_l) / serum_na_mmol_l;
    NTRK_END;
}

/* Furst 2000 bands: below NTR_FURST_ABOUT_ONE_LOW 1000 mL/day, up to
 * NTR_FURST_ABOUT_ONE_HIGH 500-700 mL/day, above it 500 mL/day. The band
 * is NTR_RESTRICT_1000ML plus one for each edge reached, a sum of two
 * comparisons: no branch to mispredict on ratios that scatter around 1
 * (tests/bench/run-bench.sh). */
static inline NTRK_VERDICT NTRK(restriction_from_ratio)(NTRK_REAL ratio,
                                                        NTRK_INT *advice)
{
    NTRK_BEGIN;
    NTRK_CHECK(ratio, 0.0, NTR_RATIO_MAX);
    *advice = NTR_RESTRICT_1000ML +
              NTRK_COUNT(NTRK_GE(ratio, NTRK_K(NTR_FURST_ABOUT_ONE_LOW))) +
              NTRK_COUNT(NTRK_GT(ratio, NTRK_K(NTR_FURST_ABOUT_ONE_HIGH)));
    NTRK_END;
}

/* Electrolyte-free water clearance: V * (1 - (U_Na + U_K)/S_Na). */
static inline NTRK_VERDICT NTRK(efwc)(NTRK_REAL urine_volume_l,
                                      NTRK_REAL urine_na_mmol_l,
                                      NTRK_REAL urine_k_mmol_l,
                                      NTRK_REAL serum_na_mmol_l,
                                      NTRK_REAL *litres)
{
    NTRK_BEGIN;
    NTRK_CHECK(urine_volume_l, 0.0, NTR_URINE_VOLUME_MAX);
    NTRK_TRY(NTRK(urine_inputs)(urine_na_mmol_l, urine_k_mmol_l, serum_na_mmol_l));
    *litres = NTRK(efw)(urine_volume_l, urine_na_mmol_l + urine_k_mmol_l,
                        serum_na_mmol_l);
    NTRK_END;
}

#endif
