/* SPDX-License-Identifier: MIT */
/* Urine indices and fluid restriction (docs/urine.md). The formulas and
 * their checks are the kernels in lib/urine_kernels.h. */
#include "ntr_internal.h"
#include "urine_kernels.h"

int ntr_furst_ratio(double urine_na_mmol_l, double urine_k_mmol_l,
                    double serum_na_mmol_l, double *ratio)
{
    if (ratio == NULL) {
        return NTR_ERR_NULL;
    }
    return ntri_furst_ratio(urine_na_mmol_l, urine_k_mmol_l, serum_na_mmol_l,
                            ratio);
}

int ntr_restriction_from_ratio(double ratio, int *advice)
{
    if (advice == NULL) {
        return NTR_ERR_NULL;
    }
    return ntri_restriction_from_ratio(ratio, advice);
}

int ntr_efwc(double urine_volume_l, double urine_na_mmol_l,
             double urine_k_mmol_l, double serum_na_mmol_l, double *litres)
{
    if (litres == NULL) {
        return NTR_ERR_NULL;
    }
    return ntri_efwc(urine_volume_l, urine_na_mmol_l, urine_k_mmol_l,
                     serum_na_mmol_l, litres);
}
