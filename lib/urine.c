/* Urine indices and fluid restriction (docs/urine.md). */
#include "ntr_internal.h"

static int check_urine(double urine_na_mmol_l, double urine_k_mmol_l,
                       double serum_na_mmol_l)
{
    NTR_TRY(ntr_check(urine_na_mmol_l, 0.0, NTR_URINE_NA_MAX));
    NTR_TRY(ntr_check(urine_k_mmol_l, 0.0, NTR_URINE_K_MAX));
    return ntr_check_na(serum_na_mmol_l);
}

int ntr_furst_ratio(double urine_na_mmol_l, double urine_k_mmol_l,
                    double serum_na_mmol_l, double *ratio)
{
    if (ratio == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(check_urine(urine_na_mmol_l, urine_k_mmol_l, serum_na_mmol_l));
    *ratio = (urine_na_mmol_l + urine_k_mmol_l) / serum_na_mmol_l;
    return NTR_OK;
}

int ntr_restriction_from_ratio(double ratio, int *advice)
{
    if (advice == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check(ratio, 0.0, NTR_RATIO_MAX));
    if (ratio < NTR_FURST_ABOUT_ONE_LOW) {
        *advice = NTR_RESTRICT_1000ML;
    } else if (ratio <= NTR_FURST_ABOUT_ONE_HIGH) {
        *advice = NTR_RESTRICT_500_700ML;
    } else {
        *advice = NTR_RESTRICT_500ML;
    }
    return NTR_OK;
}

int ntr_efwc(double urine_volume_l, double urine_na_mmol_l,
             double urine_k_mmol_l, double serum_na_mmol_l, double *litres)
{
    if (litres == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check(urine_volume_l, 0.0, NTR_URINE_VOLUME_MAX));
    NTR_TRY(check_urine(urine_na_mmol_l, urine_k_mmol_l, serum_na_mmol_l));
    *litres = ntri_efw(urine_volume_l, urine_na_mmol_l + urine_k_mmol_l,
                       serum_na_mmol_l);
    return NTR_OK;
}
