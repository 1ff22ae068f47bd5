/* Sodium: glucose correction and sodium deficit (docs/sodium.md). */
#include "ntr_internal.h"

/* mg/dL per mmol/L of glucose: its molar mass (180.156 g/mol) / 10. */
#define GLUCOSE_MG_DL_PER_MMOL_L 18.0156
/* Both published corrections start at a glucose of 100 mg/dL. */
#define GLUCOSE_REFERENCE_MG_DL 100.0
#define KATZ_FACTOR 1.6
#define HILLIER_FACTOR 2.4

static double corrected(double na_mmol_l, double glucose_mmol_l, double factor)
{
    double glucose_mg_dl = glucose_mmol_l * GLUCOSE_MG_DL_PER_MMOL_L;
    if (glucose_mg_dl <= GLUCOSE_REFERENCE_MG_DL) {
        return na_mmol_l;
    }
    return na_mmol_l + factor * (glucose_mg_dl - GLUCOSE_REFERENCE_MG_DL) / 100.0;
}

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
    *na_corrected_mmol_l = corrected(na_mmol_l, glucose_mmol_l, factor_per_100mg_dl);
    return NTR_OK;
}

int ntr_na_corrected_glucose(double na_mmol_l, double glucose_mmol_l,
                             int method, double *na_corrected_mmol_l)
{
    double factor;
    if (na_corrected_mmol_l == NULL) {
        return NTR_ERR_NULL;
    }
    if (method == NTR_GLUCOSE_KATZ) {
        factor = KATZ_FACTOR;
    } else if (method == NTR_GLUCOSE_HILLIER) {
        factor = HILLIER_FACTOR;
    } else {
        return NTR_ERR_ARG;
    }
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
