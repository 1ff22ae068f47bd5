/* SPDX-License-Identifier: MIT */
/* Osmolality and tonicity (docs/osmolality.md). The formulas and their
 * checks are the kernels in lib/osmolality_kernels.h. */
#include "ntr_internal.h"
#include "osmolality_kernels.h"

int ntr_osm_calculated(double na_mmol_l, double glucose_mmol_l,
                       double urea_mmol_l, double ethanol_mmol_l, int formula,
                       double *mosm_kg)
{
    double coefficient;
    double intercept;
    if (mosm_kg == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntri_osm_formula(formula, &coefficient, &intercept));
    return ntri_osm_calculated(na_mmol_l, glucose_mmol_l, urea_mmol_l,
                               ethanol_mmol_l, coefficient, intercept, mosm_kg);
}

int ntr_osm_effective(double na_mmol_l, double glucose_mmol_l, double *mosm_kg)
{
    if (mosm_kg == NULL) {
        return NTR_ERR_NULL;
    }
    return ntri_osm_effective(na_mmol_l, glucose_mmol_l, mosm_kg);
}

int ntr_osm_gap(double measured_mosm_kg, double calculated_mosm_kg,
                double *gap_mosm_kg)
{
    if (gap_mosm_kg == NULL) {
        return NTR_ERR_NULL;
    }
    return ntri_osm_gap(measured_mosm_kg, calculated_mosm_kg, gap_mosm_kg);
}
