/* SPDX-License-Identifier: MIT */
/* Osmolality formulas, written once (docs/osmolality.md): the kernels of
 * ntr_osm_calculated(), ntr_osm_effective() and ntr_osm_gap(), used by
 * those functions (lib/osmolality.c) and by their batch entry points
 * (lib/batch.c, one row and two rows at a time). Lane-generic, see
 * lib/kernel_lanes.h. Not installed. */
#ifndef NTR_OSMOLALITY_KERNELS_ONCE
#define NTR_OSMOLALITY_KERNELS_ONCE

/* Dorwart & Chalmers 1975 regression: 1.86*Na + glucose + urea + 9. */
#define NTR_DC_NA_COEFFICIENT 1.86
#define NTR_DC_INTERCEPT 9.0

/* The sodium coefficient and intercept of a calculated-osmolality formula
 * (NTR_OSM_*), or NTR_ERR_ARG for an unknown one (outputs left alone). The
 * batch resolves the formula once per call with this. */
static inline int ntri_osm_formula(int formula, double *coefficient,
                                   double *intercept)
{
    if (formula == NTR_OSM_2NA) {
        *coefficient = 2.0;
        *intercept = 0.0;
    } else if (formula == NTR_OSM_DORWART_CHALMERS) {
        *coefficient = NTR_DC_NA_COEFFICIENT;
        *intercept = NTR_DC_INTERCEPT;
    } else {
        return NTR_ERR_ARG;
    }
    return NTR_OK;
}
#endif

#if (NTRK_FLAVOUR == 0 && !defined(NTR_OSMOLALITY_KERNELS_0)) || \
    (NTRK_FLAVOUR == 1 && !defined(NTR_OSMOLALITY_KERNELS_1)) || \
    (NTRK_FLAVOUR == 2 && !defined(NTR_OSMOLALITY_KERNELS_2))
#if NTRK_FLAVOUR == 0
#define NTR_OSMOLALITY_KERNELS_0
#elif NTRK_FLAVOUR == 1
#define NTR_OSMOLALITY_KERNELS_1
#else
#define NTR_OSMOLALITY_KERNELS_2
#endif

/* coefficient*Na + glucose + urea + intercept + ethanol (mOsm/kg), the
 * coefficient and intercept from ntri_osm_formula(). Term order: sodium
 * term, glucose, urea, intercept, ethanol (for 2*Na the intercept is 0.0,
 * which changes no value). */
static inline NTRK_VERDICT NTRK(osm_calculated)(NTRK_REAL na_mmol_l,
                                                NTRK_REAL glucose_mmol_l,
                                                NTRK_REAL urea_mmol_l,
                                                NTRK_REAL ethanol_mmol_l,
                                                NTRK_REAL coefficient,
                                                NTRK_REAL intercept,
                                                NTRK_REAL *mosm_kg)
{
    NTRK_BEGIN;
    NTRK_CHECK(na_mmol_l, NTR_NA_MIN, NTR_NA_MAX);
    NTRK_CHECK(glucose_mmol_l, 0.0, NTR_GLUCOSE_MAX);
    NTRK_CHECK(urea_mmol_l, 0.0, NTR_UREA_MAX);
    NTRK_CHECK(ethanol_mmol_l, 0.0, NTR_ETHANOL_MAX);
    *mosm_kg = coefficient * na_mmol_l + glucose_mmol_l + urea_mmol_l +
               intercept + ethanol_mmol_l;
    NTRK_END;
}

/* Effective osmolality (tonicity): 2*Na + glucose. */
static inline NTRK_VERDICT NTRK(osm_effective)(NTRK_REAL na_mmol_l,
                                               NTRK_REAL glucose_mmol_l,
                                               NTRK_REAL *mosm_kg)
{
    NTRK_BEGIN;
    NTRK_CHECK(na_mmol_l, NTR_NA_MIN, NTR_NA_MAX);
    NTRK_CHECK(glucose_mmol_l, 0.0, NTR_GLUCOSE_MAX);
    *mosm_kg = 2.0 * na_mmol_l + glucose_mmol_l;
    NTRK_END;
}

/* Osmolal gap: measured - calculated. */
static inline NTRK_VERDICT NTRK(osm_gap)(NTRK_REAL measured_mosm_kg,
                                         NTRK_REAL calculated_mosm_kg,
                                         NTRK_REAL *gap_mosm_kg)
{
    NTRK_BEGIN;
    NTRK_CHECK(measured_mosm_kg, NTR_OSM_MIN, NTR_OSM_MAX);
    NTRK_CHECK(calculated_mosm_kg, NTR_OSM_MIN, NTR_OSM_MAX);
    *gap_mosm_kg = measured_mosm_kg - calculated_mosm_kg;
    NTRK_END;
}

#endif
