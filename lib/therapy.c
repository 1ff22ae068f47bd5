/* SPDX-License-Identifier: MIT */
/* Whole-therapy helpers built on the mass balance: a loop diuretic, the
 * desmopressin clamp and its stop rule, re-lowering after a breach, vaptan
 * monitoring, lowering a high sodium with hypotonic fluid, and the
 * symptom-driven 3% saline bolus plan (docs/therapy.md). Every prediction
 * goes through the balance functions (lib/balance.c), so no second copy of
 * the mass balance lives here. */
#include "ntr_internal.h"

/* ---- loop diuretic ---------------------------------------------------------- */

int ntr_loop_diuretic(double na_mmol_l, double tbw_l, double urine_l,
                      double urine_na_k_mmol_l, double replace_l,
                      double replace_na_mmol_l, double *na_without_mmol_l,
                      double *na_with_mmol_l)
{
    ntr_flow flows[2];
    double na_without, na_with, tbw;

    if (na_without_mmol_l == NULL || na_with_mmol_l == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check_tbw(tbw_l));
    NTR_TRY(ntr_check(urine_l, 0.0, NTR_URINE_VOLUME_MAX));
    NTR_TRY(ntr_check(urine_na_k_mmol_l, 0.0, NTR_URINE_NA_MAX));
    NTR_TRY(ntr_check(replace_l, 0.0, NTR_INFUSE_VOLUME_MAX));
    NTR_TRY(ntr_check(replace_na_mmol_l, 0.0, NTR_INFUSATE_NA_MAX));

    flows[0].volume_l = -urine_l;
    flows[0].na_mmol_l = urine_na_k_mmol_l;
    flows[0].k_mmol_l = 0.0;
    flows[1].volume_l = replace_l;
    flows[1].na_mmol_l = replace_na_mmol_l;
    flows[1].k_mmol_l = 0.0;
    NTR_TRY(ntr_balance_predict(na_mmol_l, tbw_l, flows, 1, &na_without, &tbw));
    NTR_TRY(ntr_balance_predict(na_mmol_l, tbw_l, flows, 2, &na_with, &tbw));
    *na_without_mmol_l = na_without;
    *na_with_mmol_l = na_with;
    return NTR_OK;
}

/* ---- desmopressin clamp ------------------------------------------------------ */

/* The clamp as a plan: saline in, urine out, both steady from hour 0. */
static void clamp_flows(ntr_timed_flow f[2], double saline_ml_h,
                        double saline_na_mmol_l, double urine_ml_h,
                        double urine_na_k_mmol_l)
{
    f[0].start_h = 0.0;
    f[0].end_h = NTR_PLAN_HOURS_MAX;
    f[0].rate_ml_h = saline_ml_h;
    f[0].na_mmol_l = saline_na_mmol_l;
    f[0].k_mmol_l = 0.0;
    f[0].reserved[0] = 0u;
    f[0].reserved[1] = 0u;
    f[1] = f[0];
    f[1].rate_ml_h = -urine_ml_h;
    f[1].na_mmol_l = urine_na_k_mmol_l;
}

/* Hour at which steady rates move sodium by d: the mass balance
 * Na(t) = Na0 + t*A / (TBW0 + t*B), with A the cation excess and B the net
 * water per hour, solved for Na(t) = Na0 + d. NTR_THERAPY_NEVER when the
 * sodium never gets there within the longest plan. */
static int hours_to_rise(double na0, double tbw0, const ntr_timed_flow f[2],
                         double d, double *hours)
{
    double a = 0.0, b = 0.0, denom, t, na1, tbw1;
    int i;
    for (i = 0; i < 2; i++) {
        const double v = f[i].rate_ml_h / 1000.0;
        a += v * (f[i].na_mmol_l + f[i].k_mmol_l - na0);
        b += v;
    }
    denom = a - d * b;
    if (!(denom > 0.0)) {
        *hours = NTR_THERAPY_NEVER;
        return NTR_OK;
    }
    t = d * tbw0 / denom;
    if (t > NTR_PLAN_HOURS_MAX) {
        *hours = NTR_THERAPY_NEVER;
        return NTR_OK;
    }
    /* The state at that hour must be one the model holds. */
    NTR_TRY(ntri_mass_balance(na0, tbw0, t * b, t * a, &na1, &tbw1));
    *hours = t;
    return NTR_OK;
}

int ntr_dda_clamp(double na_mmol_l, double tbw_l, double saline_ml_h,
                  double saline_na_mmol_l, double urine_ml_h,
                  double urine_na_k_mmol_l, double stop_rise_mmol_l,
                  double *rise_24h_mmol_l, double *stop_h)
{
    ntr_timed_flow f[2];
    ntr_sample day[2];
    size_t count;
    double stop;

    if (rise_24h_mmol_l == NULL || stop_h == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check_tbw(tbw_l));
    NTR_TRY(ntr_check(saline_ml_h, 0.0, NTR_FLOW_RATE_MAX));
    NTR_TRY(ntr_check(saline_na_mmol_l, 0.0, NTR_INFUSATE_NA_MAX));
    NTR_TRY(ntr_check(urine_ml_h, 0.0, NTR_FLOW_RATE_MAX));
    NTR_TRY(ntr_check(urine_na_k_mmol_l, 0.0, NTR_URINE_NA_MAX));
    NTR_TRY(ntr_check(stop_rise_mmol_l, 0.0, NTR_DELTA_MAX));
    if (!(stop_rise_mmol_l > 0.0)) {
        return NTR_ERR_RANGE;
    }
    clamp_flows(f, saline_ml_h, saline_na_mmol_l, urine_ml_h, urine_na_k_mmol_l);
    NTR_TRY(ntr_balance_course(na_mmol_l, tbw_l, f, 2, 24.0, 24.0, day, 2, &count));
    NTR_TRY(hours_to_rise(na_mmol_l, tbw_l, f, stop_rise_mmol_l, &stop));
    *rise_24h_mmol_l = day[1].na_mmol_l - na_mmol_l;
    *stop_h = stop;
    return NTR_OK;
}

int ntr_dda_relower(double na_mmol_l, double tbw_l, double excess_mmol_l,
                    double margin_mmol_l, double hours, double urine_ml_h,
                    double urine_na_k_mmol_l, double *volume_l,
                    double *rate_ml_h)
{
    double water_na, water_k, volume, rate;
    double lower_by;

    if (volume_l == NULL || rate_ml_h == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check_tbw(tbw_l));
    NTR_TRY(ntr_check(excess_mmol_l, 0.0, NTR_LIMIT_MAX));
    NTR_TRY(ntr_check(margin_mmol_l, 0.0, NTR_RELOWER_MARGIN_MAX));
    NTR_TRY(ntr_check(hours, NTR_PLAN_STEP_MIN, NTR_PLAN_HOURS_MAX));
    NTR_TRY(ntr_check(urine_ml_h, 0.0, NTR_FLOW_RATE_MAX));
    NTR_TRY(ntr_check(urine_na_k_mmol_l, 0.0, NTR_URINE_NA_MAX));
    if (excess_mmol_l == 0.0) {
        /* No window over its limit: nothing to take back, margin or not. */
        *volume_l = 0.0;
        *rate_ml_h = 0.0;
        return NTR_OK;
    }
    lower_by = excess_mmol_l + margin_mmol_l;
    if (lower_by > NTR_DELTA_MAX) {
        return NTR_ERR_DOMAIN;
    }
    /* Cannot fail (the preset exists); checked all the same. */
    NTR_TRY(ntr_fluid_preset(NTR_FLUID_DEXTROSE_5, &water_na, &water_k));
    NTR_TRY(ntr_relower_estimate(na_mmol_l, tbw_l, water_na, water_k, lower_by,
                                 hours, urine_ml_h, urine_na_k_mmol_l, 0.0,
                                 &volume, &rate));
    *volume_l = volume;
    *rate_ml_h = rate;
    return NTR_OK;
}

/* ---- vaptan monitoring -------------------------------------------------------- */

int ntr_vaptan_watch_preset(int high_risk, int liver_disease,
                            ntr_vaptan_watch *out)
{
    ntr_course_limits lim;
    unsigned int cautions = NTR_VAPTAN_NO_RESTRICTION_24H;
    int preset = NTR_COURSE_HYPO_STANDARD;

    if (out == NULL) {
        return NTR_ERR_NULL;
    }
    if ((high_risk != 0 && high_risk != 1) ||
        (liver_disease != 0 && liver_disease != 1) ||
        out->struct_size < sizeof(ntr_vaptan_watch)) {
        return NTR_ERR_ARG;
    }
    /* Liver disease is itself a risk factor for osmotic demyelination. */
    if (high_risk || liver_disease) {
        preset = NTR_COURSE_HYPO_HIGH_RISK;
        cautions |= NTR_VAPTAN_HIGH_RISK_LIMITS;
    }
    if (liver_disease) {
        cautions |= NTR_VAPTAN_LIVER_DISEASE;
    }
    /* Cannot fail (the preset exists); checked all the same. */
    NTR_TRY(ntr_course_limits_preset(preset, &lim));
    out->struct_size = sizeof(ntr_vaptan_watch);
    out->limits = lim;
    out->horizon_h = NTR_VAPTAN_HORIZON_H;
    out->resample_h = NTR_VAPTAN_RESAMPLE_H;
    out->cautions = cautions;
    out->reserved = 0u;
    return NTR_OK;
}

/* ---- lowering a high sodium ---------------------------------------------------- */

static void timed(ntr_timed_flow *f, double hours, double rate_ml_h,
                  double na_mmol_l, double k_mmol_l)
{
    f->start_h = 0.0;
    f->end_h = hours;
    f->rate_ml_h = rate_ml_h;
    f->na_mmol_l = na_mmol_l;
    f->k_mmol_l = k_mmol_l;
    f->reserved[0] = 0u;
    f->reserved[1] = 0u;
}

int ntr_hyper_lower_plan(double na_mmol_l, double tbw_l, int fluid,
                         int limits_preset, double fall_mmol_l, double hours,
                         double urine_ml_h, double urine_na_k_mmol_l,
                         double insensible_ml_h, double *rate_ml_h,
                         double *volume_l, double *first_breach_h)
{
    double fluid_na, fluid_k, loss_ml_h, loss_c, volume, rate, step;
    ntr_course_limits lim;
    ntr_course_plan_result check;
    ntr_timed_flow plan[3];
    ntr_sample now;

    if (rate_ml_h == NULL || volume_l == NULL || first_breach_h == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_fluid_preset(fluid, &fluid_na, &fluid_k));
    if (limits_preset != NTR_COURSE_HYPER_CHRONIC &&
        limits_preset != NTR_COURSE_HYPER_ACUTE) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check_tbw(tbw_l));
    NTR_TRY(ntr_check(fall_mmol_l, 0.0, NTR_DELTA_MAX));
    if (!(fall_mmol_l > 0.0)) {
        return NTR_ERR_RANGE;
    }
    NTR_TRY(ntr_check(hours, NTR_PLAN_STEP_MIN, NTR_PLAN_HOURS_MAX));
    NTR_TRY(ntr_check(urine_ml_h, 0.0, NTR_FLOW_RATE_MAX));
    NTR_TRY(ntr_check(urine_na_k_mmol_l, 0.0, NTR_URINE_NA_MAX));
    NTR_TRY(ntr_check(insensible_ml_h, 0.0, NTR_INSENSIBLE_MAX));

    /* Urine and insensible loss as one loss of their pooled cation
     * concentration: the same water and cation leave either way. */
    loss_ml_h = urine_ml_h + insensible_ml_h;
    if (loss_ml_h > NTR_FLOW_RATE_MAX) {
        return NTR_ERR_DOMAIN;
    }
    loss_c = loss_ml_h > 0.0 ? urine_ml_h * urine_na_k_mmol_l / loss_ml_h : 0.0;
    /* The pooled concentration is at most the urine's; rounding can put it
     * a hair above (urine at the range's top, no insensible loss), where
     * ntr_relower_estimate() would refuse it as out of range. */
    if (loss_c > urine_na_k_mmol_l) {
        loss_c = urine_na_k_mmol_l;
    }
    NTR_TRY(ntr_relower_estimate(na_mmol_l, tbw_l, fluid_na, fluid_k,
                                 fall_mmol_l, hours, loss_ml_h, loss_c, 0.0,
                                 &volume, &rate));

    /* The plan as given, checked against the fall limits. */
    timed(&plan[0], hours, rate, fluid_na, fluid_k);
    timed(&plan[1], hours, -urine_ml_h, urine_na_k_mmol_l, 0.0);
    timed(&plan[2], hours, -insensible_ml_h, 0.0, 0.0);
    now.hours = 0.0;
    now.na_mmol_l = na_mmol_l;
    NTR_TRY(ntr_course_limits_preset(limits_preset, &lim));
    step = hours / NTR_HYPER_CHECK_POINTS;
    if (step < NTR_PLAN_STEP_MIN) {
        step = NTR_PLAN_STEP_MIN;
    }
    check.struct_size = sizeof check;
    NTR_TRY(ntr_course_plan_check(&now, 1, tbw_l, plan, 3, hours, step, &lim,
                                  &check));
    *rate_ml_h = rate;
    *volume_l = volume;
    *first_breach_h = check.breach_fall_24h_h;
    return NTR_OK;
}

/* ---- symptom-driven bolus plan -------------------------------------------------- */

int ntr_bolus_plan(double na_mmol_l, double tbw_l, double aim_rise_mmol_l,
                   double max_rise_mmol_l, int *boluses, double *rise_mmol_l,
                   int *held_by_limit)
{
    ntr_flow dose;
    double saline_na, saline_k, rise = 0.0;
    int k;

    if (boluses == NULL || rise_mmol_l == NULL || held_by_limit == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check_tbw(tbw_l));
    NTR_TRY(ntr_check(aim_rise_mmol_l, 0.0, NTR_DELTA_MAX));
    if (!(aim_rise_mmol_l > 0.0)) {
        return NTR_ERR_RANGE;
    }
    NTR_TRY(ntr_check(max_rise_mmol_l, 0.0, NTR_LIMIT_MAX));
    if (!(max_rise_mmol_l > 0.0)) {
        return NTR_ERR_RANGE;
    }
    if (aim_rise_mmol_l > max_rise_mmol_l) {
        return NTR_ERR_DOMAIN;
    }
    /* Cannot fail (the preset exists); checked all the same. */
    NTR_TRY(ntr_fluid_preset(NTR_FLUID_NACL_3, &saline_na, &saline_k));
    dose.na_mmol_l = saline_na;
    dose.k_mmol_l = saline_k;
    for (k = 1; k <= NTR_BOLUS_COUNT_MAX; k++) {
        double na1, tbw1, next;
        dose.volume_l = (double)k * NTR_BOLUS_VOLUME_ML / 1000.0;
        NTR_TRY(ntr_balance_predict(na_mmol_l, tbw_l, &dose, 1, &na1, &tbw1));
        next = na1 - na_mmol_l;
        if (next > max_rise_mmol_l + NTR_CF_TOLERANCE) {
            /* This bolus would pass the limit: stop before it. */
            if (k == 1) {
                return NTR_ERR_DOMAIN;
            }
            *boluses = k - 1;
            *rise_mmol_l = rise;
            *held_by_limit = 1;
            return NTR_OK;
        }
        rise = next;
        if (rise >= aim_rise_mmol_l - NTR_CF_TOLERANCE) {
            *boluses = k;
            *rise_mmol_l = rise;
            *held_by_limit = 0;
            return NTR_OK;
        }
    }
    /* The aim is out of reach of the guideline's small boluses. */
    return NTR_ERR_DOMAIN;
}
