/* SPDX-License-Identifier: MIT */
/* Sodium: glucose correction and sodium deficit (docs/sodium.md). The
 * formulas and their checks are the kernels in lib/sodium_kernels.h. */
#include "ntr_internal.h"
#include "sodium_kernels.h"

int ntr_na_corrected_glucose_factor(double na_mmol_l, double glucose_mmol_l,
                                    double factor_per_100mg_dl,
                                    double *na_corrected_mmol_l)
{
    if (na_corrected_mmol_l == NULL) {
        return NTR_ERR_NULL;
    }
    return ntri_na_corrected_glucose_factor(na_mmol_l, glucose_mmol_l,
                                            factor_per_100mg_dl,
                                            na_corrected_mmol_l);
}

int ntr_na_corrected_glucose(double na_mmol_l, double glucose_mmol_l,
                             int method, double *na_corrected_mmol_l)
{
    double factor;
    if (na_corrected_mmol_l == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntri_glucose_factor(method, &factor));
    return ntri_na_corrected_glucose_factor(na_mmol_l, glucose_mmol_l, factor,
                                            na_corrected_mmol_l);
}

int ntr_na_deficit(double tbw_l, double na_mmol_l, double target_na_mmol_l,
                   double *mmol)
{
    if (mmol == NULL) {
        return NTR_ERR_NULL;
    }
    return ntri_na_deficit(tbw_l, na_mmol_l, target_na_mmol_l, mmol);
}
