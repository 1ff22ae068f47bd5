/* SPDX-License-Identifier: MIT */
/* Therapy steps of the demo: the solute decision for patient A.
 * The patient and every value are invented. */
#include "demo_therapy.h"

#include <natremia.h>
#include <stdio.h>
#include <stdlib.h>

/* Invented for patient A: a poor diet gives little solute to excrete. */
#define SOLUTE_MOSM_DAY 600.0
/* Net insensible loss of a resting adult (common practice, docs/solute.md). */
#define INSENSIBLE_L_DAY 0.5
/* The restriction the team would like to keep to. */
#define TARGET_L_DAY 1.0
/* A round urea dose the team might choose (sachets of 15 g). */
#define UREA_CHOSEN_G_DAY 15.0

static void check(int status, const char *what)
{
    if (status != NTR_OK) {
        fprintf(stderr, "natremia-demo: %s failed (status %d)\n", what, status);
        exit(1);
    }
}

static const char *verdict_words(int verdict)
{
    switch (verdict) {
    case NTR_OUTLOOK_TARGET_HOLDS:
        return "restricting to the target holds the sodium";
    case NTR_OUTLOOK_STRICTER_OR_SOLUTE:
        return "the target is too much: restrict further, or add solute";
    default:
        return "restriction alone cannot hold the sodium: add solute or other treatment";
    }
}

static void print_dose(const char *name, double grams)
{
    if (grams == NTR_OUTLOOK_NO_DOSE) {
        printf("    %-24s no dose up to 200 g/day reaches it\n", name);
    } else {
        printf("    %-24s %6.1f g/day\n", name, grams);
    }
}

void therapy_solute_step(const char *title, const struct therapy_urine *u)
{
    ntr_outlook o;
    double with_urea;
    o.struct_size = sizeof o;
    check(ntr_restriction_outlook(SOLUTE_MOSM_DAY, u->urine_osm_mosm_kg, u->urine_na_mmol_l,
                                  u->urine_k_mmol_l, u->serum_na_mmol_l, INSENSIBLE_L_DAY,
                                  TARGET_L_DAY, &o),
          "ntr_restriction_outlook");
    check(ntr_fluid_allowance_with_dose(NTR_SOLUTE_UREA, UREA_CHOSEN_G_DAY, SOLUTE_MOSM_DAY,
                                        u->urine_osm_mosm_kg, u->urine_na_mmol_l,
                                        u->urine_k_mmol_l, u->serum_na_mmol_l,
                                        INSENSIBLE_L_DAY, &with_urea),
          "ntr_fluid_allowance_with_dose");

    printf("\n== %s ==\n", title);
    printf("  Solute excreted (invented, a poor diet): %.0f mOsm/day; net insensible "
           "loss\n  %.1f L/day (common practice); urine osmolality %.0f mOsm/kg.\n",
           SOLUTE_MOSM_DAY, INSENSIBLE_L_DAY, u->urine_osm_mosm_kg);
    printf("  Urine the solute makes: %.0f / %.0f = %.2f L/day (Berl)\n", SOLUTE_MOSM_DAY,
           u->urine_osm_mosm_kg, o.urine_l_day);
    printf("  Its electrolyte-free water clearance: %.2f L/day (Furst ratio %.2f)\n",
           o.efwc_l_day, o.furst_ratio);
    printf("  Fluid allowance with the current solute: %.2f L/day\n", o.allowance_l_day);
    printf("  Target restriction %.1f L/day ->\n    %s.\n", o.target_intake_l_day,
           verdict_words(o.verdict));
    printf("  Daily solute that makes %.1f L/day hold:\n", o.target_intake_l_day);
    print_dose("of urea", o.urea_g_day);
    print_dose("or of NaCl tablets", o.nacl_g_day);
    printf("  With urea %.0f g/day the allowance becomes %.2f L/day.\n", UREA_CHOSEN_G_DAY,
           with_urea);
    printf("  Steady state at a fixed urine osmolality: recheck the urine as the sodium\n"
           "  corrects; thirst and adherence are not in the sums.\n");
}

/* Invented urine collections of patient A: concentrated at first, then,
 * from hour 6, a water diuresis starting (more urine, little Na + K). */
static const ntr_urine_interval a_urine[] = {
    {0.0, 4.0, 320.0, 90.0, 35.0, 420.0, {0.0, 0.0}, {0u, 0u}},
    {4.0, 6.0, 200.0, 80.0, 30.0, 360.0, {0.0, 0.0}, {0u, 0u}},
    {6.0, 8.0, 500.0, 30.0, 15.0, 150.0, {0.0, 0.0}, {0u, 0u}},
};
#define A_URINE_COUNT (sizeof a_urine / sizeof a_urine[0])
#define FEEDBACK_HORIZON_H 6.0
#define FEEDBACK_STEP_H 0.25

/* The intervals that have ended by hour t. */
static size_t urine_ended_by(double t)
{
    size_t k = 0;
    while (k < A_URINE_COUNT && a_urine[k].end_h <= t) {
        ++k;
    }
    return k;
}

static void print_alert(const ntr_urine_feedback_result *r)
{
    if (r->flags & NTR_FB_LIMIT_AHEAD) {
        printf("  limit in %.1f h\n", r->breach_h);
        if (r->flags & NTR_FB_WATER_DIURESIS) {
            printf("              ALERT: water diuresis under way\n");
        }
    } else {
        printf("  none in %.0f h\n", FEEDBACK_HORIZON_H);
    }
}

/* Whether the measured results alone (the first n) are over a limit so far. */
static int measured_over_by(const ntr_sample *measured, size_t n, const ntr_course_limits *lim)
{
    ntr_course_report r;
    r.struct_size = sizeof r;
    check(ntr_course_assess(measured, n, lim, &r), "ntr_course_assess");
    return (r.flags & (NTR_CF_OVER_24H | NTR_CF_OVER_48H | NTR_CF_FALL_OVER_24H |
                       NTR_CF_FALL_OVER_48H)) != 0u;
}

double therapy_feedback_step(const char *title, const ntr_sample *measured, size_t n,
                             double tbw_l, const ntr_timed_flow *flows, size_t n_flows,
                             const ntr_course_limits *lim)
{
    double first_alert_h = -1.0;
    size_t i, k;
    printf("\n== %s ==\n", title);
    printf("  Invented urine collections (a water diuresis starts at hour 6):\n");
    printf("    from-to (h)  volume (mL)  rate (mL/h)  Na + K (mmol/L)  osm (mOsm/kg)\n");
    for (k = 0; k < A_URINE_COUNT; ++k) {
        const ntr_urine_interval *u = &a_urine[k];
        printf("    %4.0f-%-4.0f   %8.0f     %8.0f     %8.0f         %6.0f\n", u->start_h,
               u->end_h, u->volume_ml, u->volume_ml / (u->end_h - u->start_h),
               u->na_mmol_l + u->k_mmol_l, u->osm_mosm_kg);
    }
    printf("  At each result, the latest urine continued for %.0f h (body water %.1f L):\n",
           FEEDBACK_HORIZON_H, tbw_l);
    printf("    time (h)  Na (mmol/L)  EFW clearance (mL/h)  Na rate (mmol/L/h)  ahead\n");
    for (i = 1; i < n; ++i) {
        ntr_urine_feedback_result r;
        size_t have = urine_ended_by(measured[i].hours);
        if (have == 0) {
            continue;
        }
        r.struct_size = sizeof r;
        check(ntr_urine_feedback(measured, i + 1, tbw_l, flows, n_flows, a_urine, have,
                                 FEEDBACK_HORIZON_H, FEEDBACK_STEP_H, lim, &r),
              "ntr_urine_feedback");
        printf("    %6.0f    %9.1f    %12.0f        %+10.2f    ", measured[i].hours,
               measured[i].na_mmol_l, r.urine_efw_ml_h, r.na_rate_mmol_l_h);
        print_alert(&r);
        if (r.flags & NTR_FB_LIMIT_AHEAD) {
            first_alert_h = measured[i].hours;
            break;
        }
    }
    if (first_alert_h >= 0.0) {
        printf("  -> alert at the %.0f h result; measured results so far: %s.\n"
               "     Measure sodium within 1 to 2 h and plan how to stop the diuresis.\n",
               first_alert_h, measured_over_by(measured, i + 1, lim)
                                  ? "over a limit"
                                  : "within the limits");
    }
    return first_alert_h;
}

#define REPROJECT_STEP_H 0.25

/* The original prediction at hour t (NaN-free: -1 when it does not reach t). */
static double original_at(const ntr_sample *original, size_t n, double t)
{
    size_t k;
    for (k = 0; k < n; ++k) {
        if (original[k].hours >= t - 1e-9 && original[k].hours <= t + 1e-9) {
            return original[k].na_mmol_l;
        }
    }
    return -1.0;
}

/* The re-projection hour by hour (each point one ntr_fit_reproject call,
 * whose end sodium is the point), starting at the last fitted result. */
static void fill_curve(const ntr_sample *measured, size_t n_fit, const ntr_fit *fit,
                       const ntr_timed_flow *flows, size_t n_flows,
                       const ntr_course_limits *lim, double span_h, struct therapy_curve *c)
{
    const ntr_sample *last = &measured[n_fit - 1];
    double d;
    c->n = 0;
    c->hours[c->n] = last->hours;
    c->na_mmol_l[c->n++] = last->na_mmol_l;
    for (d = 1.0; d <= span_h + 1e-9 && c->n < THERAPY_CURVE_MAX; d += 1.0) {
        ntr_course_plan_result r;
        r.struct_size = sizeof r;
        check(ntr_fit_reproject(measured, n_fit, fit, flows, n_flows, d, REPROJECT_STEP_H, lim,
                                &r), "ntr_fit_reproject");
        c->hours[c->n] = last->hours + d;
        c->na_mmol_l[c->n++] = r.final_na_mmol_l;
    }
}

void therapy_fit_step(const char *title, const ntr_sample *measured, size_t n_fit,
                      size_t n_all, double tbw_guess_l, const ntr_timed_flow *flows,
                      size_t n_flows, const ntr_course_limits *lim,
                      const ntr_sample *original, size_t n_orig,
                      struct therapy_curve *curve)
{
    const double t_last = measured[n_fit - 1].hours;
    ntr_course_plan_result whole;
    ntr_fit fit;
    size_t k;
    fit.struct_size = sizeof fit;
    check(ntr_course_fit(measured, n_fit, tbw_guess_l, flows, n_flows, &fit), "ntr_course_fit");
    printf("\n== %s ==\n", title);
    printf("  Fitted to the %u results up to %.0f h and the saline given (least squares\n"
           "  on the mass balance):\n", (unsigned)n_fit, t_last);
    printf("    apparent body water      %5.1f L     (standard error %.1f; start guess %.1f)\n",
           fit.tbw_l, fit.tbw_se_l, tbw_guess_l);
    printf("    unmeasured water loss    %5.0f mL/h  (standard error %.0f)\n",
           fit.free_water_loss_ml_h, fit.free_water_loss_se_ml_h);
    printf("    residual (root mean sq.) %5.2f mmol/L\n", fit.rms_residual_mmol_l);
    printf("  The rest of the plan (no more saline) from the %.0f h result:\n", t_last);
    printf("    time (h)  original (mmol/L)  re-projected (mmol/L)  measured (mmol/L)\n");
    for (k = n_fit; k < n_all; ++k) {
        ntr_course_plan_result r;
        const double t = measured[k].hours;
        r.struct_size = sizeof r;
        check(ntr_fit_reproject(measured, n_fit, &fit, flows, n_flows, t - t_last,
                                REPROJECT_STEP_H, lim, &r), "ntr_fit_reproject");
        printf("    %6.0f    %13.1f      %15.1f        %13.1f\n", t,
               original_at(original, n_orig, t), r.final_na_mmol_l, measured[k].na_mmol_l);
    }
    whole.struct_size = sizeof whole;
    check(ntr_fit_reproject(measured, n_fit, &fit, flows, n_flows,
                            measured[n_all - 1].hours - t_last, REPROJECT_STEP_H, lim, &whole),
          "ntr_fit_reproject");
    if (whole.first_breach_h != NTR_PLAN_NO_BREACH) {
        printf("  -> re-projected: over a limit at %.1f h (the original plan never was).\n",
               t_last + whole.first_breach_h);
    } else {
        printf("  -> re-projected: within the limits to %.0f h.\n", measured[n_all - 1].hours);
    }
    fill_curve(measured, n_fit, &fit, flows, n_flows, lim,
               measured[n_all - 1].hours - t_last, curve);
    printf("     The fit assumes the loss stays steady; a diuresis that grows outruns\n"
           "     it. Keep measuring; refit with each result.\n");
}
