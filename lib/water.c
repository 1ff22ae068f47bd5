/* Total body water and free-water deficit (docs/water.md). */
#include "ntr_internal.h"

#define NORMAL_NA_MMOL_L 140.0

static int check_sex(int sex)
{
    return (sex == NTR_SEX_MALE || sex == NTR_SEX_FEMALE) ? NTR_OK : NTR_ERR_ARG;
}

/* Adrogue & Madias 2000: fraction of body weight that is water. Children
 * from 1 year take 0.6; infants are refused before this (their water
 * share is higher and falls over the first year, docs/water.md). */
static double water_fraction(int sex, double age_years)
{
    if (age_years < NTR_ADULT_AGE) {
        return 0.6;
    }
    if (sex == NTR_SEX_MALE) {
        return age_years < NTR_ELDERLY_AGE ? 0.6 : 0.5;
    }
    return age_years < NTR_ELDERLY_AGE ? 0.5 : 0.45;
}

int ntr_tbw_fraction(int sex, double age_years, double weight_kg, double *litres)
{
    if (litres == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(check_sex(sex));
    NTR_TRY(ntr_check(age_years, NTR_TBW_FRACTION_AGE_MIN, NTR_AGE_MAX));
    NTR_TRY(ntr_check(weight_kg, NTR_WEIGHT_MIN, NTR_WEIGHT_MAX));
    *litres = water_fraction(sex, age_years) * weight_kg;
    return NTR_OK;
}

int ntr_tbw_watson(int sex, double age_years, double height_cm,
                   double weight_kg, double *litres)
{
    double tbw;
    if (litres == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(check_sex(sex));
    NTR_TRY(ntr_check(age_years, NTR_ADULT_AGE, NTR_AGE_MAX));
    NTR_TRY(ntr_check(height_cm, NTR_HEIGHT_MIN, NTR_HEIGHT_MAX));
    NTR_TRY(ntr_check(weight_kg, NTR_WEIGHT_MIN, NTR_WEIGHT_MAX));
    if (sex == NTR_SEX_MALE) {
        tbw = 2.447 - 0.09516 * age_years + 0.1074 * height_cm +
              0.3362 * weight_kg;
    } else {
        tbw = -2.097 + 0.1069 * height_cm + 0.2466 * weight_kg;
    }
    /* A regression extrapolated past the bodies it was fitted on can give
     * any number (0.02 L for a 20 kg man 30 cm tall, 164% of the weight
     * of a 10 kg woman 150 cm tall): refuse what is no body water, and
     * what no function taking a body water would accept. */
    NTR_TRY(ntri_tbw_share(tbw, weight_kg));
    NTR_TRY(ntri_model_tbw(tbw));
    *litres = tbw;
    return NTR_OK;
}

int ntr_free_water_deficit(double tbw_l, double na_mmol_l, double *litres)
{
    if (litres == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check_tbw(tbw_l));
    NTR_TRY(ntr_check_na(na_mmol_l));
    if (na_mmol_l < NORMAL_NA_MMOL_L) {
        return NTR_ERR_DOMAIN;
    }
    *litres = tbw_l * (na_mmol_l / NORMAL_NA_MMOL_L - 1.0);
    return NTR_OK;
}
