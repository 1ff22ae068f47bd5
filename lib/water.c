/* SPDX-License-Identifier: MIT */
/* Total body water and free-water deficit (docs/water.md). The formulas
 * and their checks are the kernels in lib/water_kernels.h. */
#include "ntr_internal.h"
#include "water_kernels.h"

int ntr_tbw_fraction(int sex, double age_years, double weight_kg, double *litres)
{
    if (litres == NULL) {
        return NTR_ERR_NULL;
    }
    return ntri_tbw_fraction(sex, age_years, weight_kg, litres);
}

int ntr_tbw_watson(int sex, double age_years, double height_cm,
                   double weight_kg, double *litres)
{
    if (litres == NULL) {
        return NTR_ERR_NULL;
    }
    return ntri_tbw_watson(sex, age_years, height_cm, weight_kg, litres);
}

int ntr_free_water_deficit(double tbw_l, double na_mmol_l, double *litres)
{
    if (litres == NULL) {
        return NTR_ERR_NULL;
    }
    return ntri_free_water_deficit(tbw_l, na_mmol_l, litres);
}
