/* Osmolality and tonicity (docs/osmolality.md). */
#include "ntr_internal.h"

/* Dorwart & Chalmers 1975 regression: 1.86*Na + glucose + urea + 9. */
#define DC_NA_COEFFICIENT 1.86
#define DC_INTERCEPT 9.0

int ntr_osm_calculated(double na_mmol_l, double glucose_mmol_l,
                       double urea_mmol_l, double ethanol_mmol_l, int formula,
                       double *mosm_kg)
{
    double sodium_term;
    double intercept;
    if (mosm_kg == NULL) {
        return NTR_ERR_NULL;
    }
    if (formula == NTR_OSM_2NA) {
        sodium_term = 2.0 * na_mmol_l;
        intercept = 0.0;
    } else if (formula == NTR_OSM_DORWART_CHALMERS) {
        sodium_term = DC_NA_COEFFICIENT * na_mmol_l;
        intercept = DC_INTERCEPT;
    } else {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check(glucose_mmol_l, 0.0, NTR_GLUCOSE_MAX));
    NTR_TRY(ntr_check(urea_mmol_l, 0.0, NTR_UREA_MAX));
    NTR_TRY(ntr_check(ethanol_mmol_l, 0.0, NTR_ETHANOL_MAX));
    *mosm_kg = sodium_term + glucose_mmol_l + urea_mmol_l + intercept +
               ethanol_mmol_l;
    return NTR_OK;
}

int ntr_osm_effective(double na_mmol_l, double glucose_mmol_l, double *mosm_kg)
{
    if (mosm_kg == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check(glucose_mmol_l, 0.0, NTR_GLUCOSE_MAX));
    *mosm_kg = 2.0 * na_mmol_l + glucose_mmol_l;
    return NTR_OK;
}

int ntr_osm_gap(double measured_mosm_kg, double calculated_mosm_kg,
                double *gap_mosm_kg)
{
    if (gap_mosm_kg == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check(measured_mosm_kg, NTR_OSM_MIN, NTR_OSM_MAX));
    NTR_TRY(ntr_check(calculated_mosm_kg, NTR_OSM_MIN, NTR_OSM_MAX));
    *gap_mosm_kg = measured_mosm_kg - calculated_mosm_kg;
    return NTR_OK;
}
