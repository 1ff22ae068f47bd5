/* SPDX-License-Identifier: MIT */
/* Infusates and their predicted effect on serum sodium (docs/infusion.md).
 * The predictions and their checks are the kernels in
 * lib/infusion_kernels.h. */
#include "ntr_internal.h"
#include "infusion_kernels.h"

struct fluid {
    double na_mmol_l;
    double k_mmol_l;
};

/* Indexed by NTR_FLUID_*; Adrogue & Madias 2000, table of infusates. */
static const struct fluid fluids[] = {
    {0.0, 0.0},   /* unused */
    {154.0, 0.0}, /* 0.9% NaCl */
    {513.0, 0.0}, /* 3% NaCl */
    {855.0, 0.0}, /* 5% NaCl */
    {77.0, 0.0},  /* 0.45% NaCl */
    {130.0, 4.0}, /* Ringer's lactate */
    {0.0, 0.0},   /* 5% dextrose */
    {34.0, 0.0},  /* 0.2% NaCl in 5% dextrose */
};

int ntr_fluid_preset(int fluid, double *na_mmol_l, double *k_mmol_l)
{
    if (na_mmol_l == NULL || k_mmol_l == NULL) {
        return NTR_ERR_NULL;
    }
    if (fluid < 1 || (size_t)fluid >= sizeof fluids / sizeof fluids[0]) {
        return NTR_ERR_ARG;
    }
    *na_mmol_l = fluids[fluid].na_mmol_l;
    *k_mmol_l = fluids[fluid].k_mmol_l;
    return NTR_OK;
}

int ntr_infusate_change_per_litre(double na_mmol_l, double tbw_l,
                                  double infusate_na_mmol_l,
                                  double infusate_k_mmol_l, double *delta_mmol_l)
{
    if (delta_mmol_l == NULL) {
        return NTR_ERR_NULL;
    }
    return ntri_infusate_change_per_litre(na_mmol_l, tbw_l, infusate_na_mmol_l,
                                          infusate_k_mmol_l, delta_mmol_l);
}

int ntr_infusate_change(double na_mmol_l, double tbw_l,
                        double infusate_na_mmol_l, double infusate_k_mmol_l,
                        double volume_l, double *delta_mmol_l)
{
    if (delta_mmol_l == NULL) {
        return NTR_ERR_NULL;
    }
    return ntri_infusate_change(na_mmol_l, tbw_l, infusate_na_mmol_l,
                                infusate_k_mmol_l, volume_l, delta_mmol_l);
}

int ntr_infusate_volume_for_change(double na_mmol_l, double tbw_l,
                                   double infusate_na_mmol_l,
                                   double infusate_k_mmol_l,
                                   double target_delta_mmol_l, double *volume_l)
{
    if (volume_l == NULL) {
        return NTR_ERR_NULL;
    }
    return ntri_infusate_volume_for_change(na_mmol_l, tbw_l, infusate_na_mmol_l,
                                           infusate_k_mmol_l,
                                           target_delta_mmol_l, volume_l);
}
