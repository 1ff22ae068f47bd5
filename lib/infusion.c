/* Infusates and their predicted effect on serum sodium (docs/infusion.md). */
#include "ntr_internal.h"

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

static int check_infusate(double na_mmol_l, double tbw_l,
                          double infusate_na_mmol_l, double infusate_k_mmol_l)
{
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check_tbw(tbw_l));
    NTR_TRY(ntr_check(infusate_na_mmol_l, 0.0, NTR_INFUSATE_NA_MAX));
    return ntr_check(infusate_k_mmol_l, 0.0, NTR_INFUSATE_K_MAX);
}

/* The prediction's domain, by the rule ntr_balance_predict() applies to the
 * same flow (ntri_mass_balance): sodium after within 80 to 220 mmol/L and
 * body water after within 0.1 to 400 L, else NTR_ERR_DOMAIN. excess_mmol
 * is volume * (Na_inf + K_inf - Na), as the prediction computes it. */
static int check_prediction(double na_mmol_l, double tbw_l, double volume_l,
                            double excess_mmol)
{
    double na_after, tbw_after;
    return ntri_mass_balance(na_mmol_l, tbw_l, volume_l, excess_mmol,
                             &na_after, &tbw_after);
}

int ntr_infusate_change_per_litre(double na_mmol_l, double tbw_l,
                                  double infusate_na_mmol_l,
                                  double infusate_k_mmol_l, double *delta_mmol_l)
{
    if (delta_mmol_l == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(check_infusate(na_mmol_l, tbw_l, infusate_na_mmol_l, infusate_k_mmol_l));
    NTR_TRY(check_prediction(na_mmol_l, tbw_l, 1.0,
                             infusate_na_mmol_l + infusate_k_mmol_l - na_mmol_l));
    /* Adrogue & Madias 2000 as published. Written out on its own rather than
     * as ntr_infusate_change(..., 1.0, ...), so the test that the two agree
     * at 1 L compares two independent expressions. */
    *delta_mmol_l = (infusate_na_mmol_l + infusate_k_mmol_l - na_mmol_l) /
                    (tbw_l + 1.0);
    return NTR_OK;
}

int ntr_infusate_change(double na_mmol_l, double tbw_l,
                        double infusate_na_mmol_l, double infusate_k_mmol_l,
                        double volume_l, double *delta_mmol_l)
{
    double excess;
    if (delta_mmol_l == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(check_infusate(na_mmol_l, tbw_l, infusate_na_mmol_l, infusate_k_mmol_l));
    NTR_TRY(ntr_check(volume_l, 0.0, NTR_INFUSE_VOLUME_MAX));
    excess = volume_l * (infusate_na_mmol_l + infusate_k_mmol_l - na_mmol_l);
    NTR_TRY(check_prediction(na_mmol_l, tbw_l, volume_l, excess));
    /* (Na*TBW + C*V)/(TBW + V) - Na rearranged so Na does not cancel. */
    *delta_mmol_l = excess / (tbw_l + volume_l);
    return NTR_OK;
}

int ntr_infusate_volume_for_change(double na_mmol_l, double tbw_l,
                                   double infusate_na_mmol_l,
                                   double infusate_k_mmol_l,
                                   double target_delta_mmol_l, double *volume_l)
{
    double headroom;
    double volume;
    if (volume_l == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(check_infusate(na_mmol_l, tbw_l, infusate_na_mmol_l, infusate_k_mmol_l));
    NTR_TRY(ntr_check(target_delta_mmol_l, -NTR_DELTA_MAX, NTR_DELTA_MAX));
    /* The sodium aimed at must be one the model predicts, by the rule
     * ntr_relower_estimate() applies to its target. */
    NTR_TRY(ntri_model_na(na_mmol_l + target_delta_mmol_l));
    if (target_delta_mmol_l == 0.0) {
        *volume_l = 0.0;
        return NTR_OK;
    }
    /* The infusate must lie beyond the target sodium, on the same side. */
    headroom = infusate_na_mmol_l + infusate_k_mmol_l - na_mmol_l - target_delta_mmol_l;
    if (target_delta_mmol_l > 0.0 ? !(headroom > 0.0) : !(headroom < 0.0)) {
        return NTR_ERR_DOMAIN;
    }
    volume = target_delta_mmol_l * tbw_l / headroom;
    if (volume > NTR_INFUSE_VOLUME_MAX) {
        return NTR_ERR_DOMAIN;
    }
    /* The volume given to ntr_infusate_change() must not be refused there:
     * a target at the edge of the range can round to just outside it. */
    NTR_TRY(check_prediction(na_mmol_l, tbw_l, volume,
                             volume * (infusate_na_mmol_l + infusate_k_mmol_l -
                                       na_mmol_l)));
    *volume_l = volume;
    return NTR_OK;
}
