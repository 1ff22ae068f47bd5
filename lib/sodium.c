/* Sodium: glucose correction and sodium deficit (docs/sodium.md). */
#include "ntr_internal.h"

/* The correction itself, ntri_glucose_corrected(), and its constants are
 * in ntr_internal.h: the work-up applies it too. */

int ntr_na_corrected_glucose_factor(double na_mmol_l, double glucose_mmol_l,
                                    double factor_per_100mg_dl,
                                    double *na_corrected_mmol_l)
{
    if (na_corrected_mmol_l == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check(glucose_mmol_l, 0.0, NTR_GLUCOSE_MAX));
    NTR_TRY(ntr_check(factor_per_100mg_dl, 0.0, NTR_GLUCOSE_FACTOR_MAX));
    *na_corrected_mmol_l =
        ntri_glucose_corrected(na_mmol_l, glucose_mmol_l, factor_per_100mg_dl);
    return NTR_OK;
}

int ntr_na_corrected_glucose(double na_mmol_l, double glucose_mmol_l,
                             int method, double *na_corrected_mmol_l)
{
    double factor;
    if (na_corrected_mmol_l == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntri_glucose_factor(method, &factor));
    return ntr_na_corrected_glucose_factor(na_mmol_l, glucose_mmol_l, factor,
                                           na_corrected_mmol_l);
}

int ntr_na_deficit(double tbw_l, double na_mmol_l, double target_na_mmol_l,
                   double *mmol)
{
    if (mmol == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check_tbw(tbw_l));
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check_na(target_na_mmol_l));
    if (target_na_mmol_l < na_mmol_l) {
        return NTR_ERR_DOMAIN;
    }
    *mmol = tbw_l * (target_na_mmol_l - na_mmol_l);
    return NTR_OK;
}
