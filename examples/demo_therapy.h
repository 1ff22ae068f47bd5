/* SPDX-License-Identifier: MIT */
/* Therapy steps of the demo (solute and restriction), kept apart from
 * demo.c so that each file stays readable. Invented patient data only. */
#ifndef NATREMIA_DEMO_THERAPY_H
#define NATREMIA_DEMO_THERAPY_H

#include <natremia.h>
#include <stddef.h>

/* Patient A's measured urine and serum sodium, as demo.c holds them. */
struct therapy_urine {
    double serum_na_mmol_l;
    double urine_na_mmol_l;
    double urine_k_mmol_l;
    double urine_osm_mosm_kg;
};

/* "Will restriction, with or without urea, work?": the restriction
 * outlook, the allowance with current solute and with a chosen urea dose. */
void therapy_solute_step(const char *title, const struct therapy_urine *u);

/* Measured urine fed back at each result up to the count given: the
 * first result at which a limit is ahead within the horizon. Returns the
 * hour of that result, or -1 if none. */
double therapy_feedback_step(const char *title, const ntr_sample *measured, size_t n,
                             double tbw_l, const ntr_timed_flow *flows, size_t n_flows,
                             const ntr_course_limits *lim);

/* The re-projected course, hourly from the last fitted result, for the chart. */
#define THERAPY_CURVE_MAX 49
struct therapy_curve {
    double hours[THERAPY_CURVE_MAX];
    double na_mmol_l[THERAPY_CURVE_MAX];
    size_t n;
};

/* The fit on the first n_fit measured results, and the remaining plan
 * re-projected with it, beside the original prediction (original, n_orig:
 * the predicted course from hour 0) and the later measured results. */
void therapy_fit_step(const char *title, const ntr_sample *measured, size_t n_fit,
                      size_t n_all, double tbw_guess_l, const ntr_timed_flow *flows,
                      size_t n_flows, const ntr_course_limits *lim,
                      const ntr_sample *original, size_t n_orig,
                      struct therapy_curve *curve);

#endif
