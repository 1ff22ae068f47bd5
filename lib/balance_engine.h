/* SPDX-License-Identifier: MIT */
/* Internal interface of the mass-balance engine in lib/balance.c, for
 * lib/feedback.c (urine feedback and the fitted re-projection, which add
 * flows that are not a list of ntr_timed_flow and run the plan on the clock
 * of the first measured sample). Not installed; hidden ntri_ names. */
#ifndef NTR_BALANCE_ENGINE_H
#define NTR_BALANCE_ENGINE_H

#include "ntr_internal.h"

/* Adds to *gain (L) and *excess (mmol of Na + K beyond na0 per litre) the
 * flows of some source that ran between flow-clock times from_h and to_h. */
typedef void (*ntri_flow_source_fn)(const void *ctx, double from_h,
                                    double to_h, double na0, double *gain,
                                    double *excess);

/* Checks of a plan's timed flows, shared by every function that takes
 * them, in the documented order: reserved fields (NTR_ERR_ARG), numbers in
 * struct order (NTR_ERR_NONFINITE, NTR_ERR_RANGE), then each flow's end not
 * before its start (NTR_ERR_ORDER). */
int ntri_timed_flows_reserved(const ntr_timed_flow *flows, size_t n);
int ntri_timed_flows_values(const ntr_timed_flow *flows, size_t n);
int ntri_timed_flows_order(const ntr_timed_flow *flows, size_t n);
/* A plan's length (above 0, at most 720 h) and step (1 min to 720 h). */
int ntri_plan_span_check(double duration_h, double step_h);

/* The mass balance itself and its domain are ntri_mass_balance() in
 * ntr_internal.h, shared with the infusate functions. */

/* Adds the checked timed flows' volume (rate/1000 * time run within
 * [from_h, to_h]) to *gain and their excess over na0 to *excess. */
void ntri_timed_flows_add(const ntr_timed_flow *flows, size_t n, double from_h,
                          double to_h, double na0, double *gain, double *excess);

/* A direction-aware plan check whose inputs are already checked: the plan
 * starts at the last history sample (body water tbw_l) at flow-clock time
 * shift_h; flows' times are on the flow clock; extra (may be NULL) adds
 * other flows. */
typedef struct ntri_plan_spec {
    const ntr_sample *history; /* checked, time-ordered, n_history >= 1 */
    size_t n_history;
    double tbw_l;
    const ntr_timed_flow *flows; /* checked and ordered */
    size_t n_flows;
    double shift_h;
    ntri_flow_source_fn extra;
    const void *extra_ctx;
    double duration_h; /* checked as ntr_course_plan_check() checks them */
    double step_h;
} ntri_plan_spec;

/* ntr_course_plan_check()'s verdict for the spec, under checked limits
 * (out->struct_size checked by the caller); NTR_OK or NTR_ERR_DOMAIN (a
 * point leaves the model's range; nothing written). */
int ntri_course_plan_run(const ntri_plan_spec *spec,
                         const ntr_course_limits *lim,
                         ntr_course_plan_result *out);

#endif
