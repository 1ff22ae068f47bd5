/* Predicting a fluid plan by mass balance: sodium after a set of flows, the
 * course over time under steady rates, the check of a plan against the
 * correction limits, and the fluid to re-lower after overcorrection
 * (docs/balance.md). */
#include "correction_engine.h"

/* ---- mass balance --------------------------------------------------------- */

/* The mass balance and its domain (sodium after within 80 to 220, body
 * water after within 0.1 to 400 L) are ntri_mass_balance() in
 * ntr_internal.h: the infusate functions and the re-lowering estimate
 * apply the same rule, so no function predicts a state another refuses. */

static int check_flow(const ntr_flow *f)
{
    NTR_TRY(ntr_check(f->volume_l, NTR_FLOW_VOLUME_MIN, NTR_INFUSE_VOLUME_MAX));
    NTR_TRY(ntr_check(f->na_mmol_l, 0.0, NTR_INFUSATE_NA_MAX));
    return ntr_check(f->k_mmol_l, 0.0, NTR_INFUSATE_K_MAX);
}

int ntr_balance_predict(double na_mmol_l, double tbw_l, const ntr_flow *flows,
                        size_t n, double *na_out, double *tbw_out)
{
    double gain = 0.0;
    double excess = 0.0;
    size_t i;

    if (na_out == NULL || tbw_out == NULL || (flows == NULL && n > 0)) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check_tbw(tbw_l));
    for (i = 0; i < n; i++) {
        NTR_TRY(check_flow(&flows[i]));
    }
    for (i = 0; i < n; i++) {
        const double v = flows[i].volume_l;
        gain += v;
        excess += v * ((flows[i].na_mmol_l + flows[i].k_mmol_l) - na_mmol_l);
    }
    return ntri_mass_balance(na_mmol_l, tbw_l, gain, excess, na_out, tbw_out);
}

/* ---- course over time ------------------------------------------------------ */

/* Reserved fields, then numbers in struct order. */
static int check_timed_flows_reserved(const ntr_timed_flow *flows, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        if (flows[i].reserved[0] != 0u || flows[i].reserved[1] != 0u) {
            return NTR_ERR_ARG;
        }
    }
    return NTR_OK;
}

static int check_timed_flows(const ntr_timed_flow *flows, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        const ntr_timed_flow *f = &flows[i];
        NTR_TRY(ntr_check(f->start_h, 0.0, NTR_PLAN_HOURS_MAX));
        NTR_TRY(ntr_check(f->end_h, 0.0, NTR_PLAN_HOURS_MAX));
        NTR_TRY(ntr_check(f->rate_ml_h, -NTR_FLOW_RATE_MAX, NTR_FLOW_RATE_MAX));
        NTR_TRY(ntr_check(f->na_mmol_l, 0.0, NTR_INFUSATE_NA_MAX));
        NTR_TRY(ntr_check(f->k_mmol_l, 0.0, NTR_INFUSATE_K_MAX));
    }
    return NTR_OK;
}

static int timed_flows_order(const ntr_timed_flow *flows, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        if (flows[i].end_h < flows[i].start_h) {
            return NTR_ERR_ORDER;
        }
    }
    return NTR_OK;
}

static int check_span(double duration_h, double step_h)
{
    NTR_TRY(ntr_check(duration_h, 0.0, NTR_PLAN_HOURS_MAX));
    if (!(duration_h > 0.0)) {
        return NTR_ERR_RANGE;
    }
    return ntr_check(step_h, NTR_PLAN_STEP_MIN, NTR_PLAN_HOURS_MAX);
}

/* A plan: where it starts and what flows, and its time grid. Points are at
 * offsets j*step for j < grid (all below the duration) and at the duration
 * itself for j == grid. */
struct plan {
    double na0;
    double tbw0;
    const ntr_timed_flow *flows;
    size_t n_flows;
    double duration_h;
    double step_h;
    size_t grid;
    /* For the plan check: the measured history in front of the points. */
    const ntr_sample *history;
    size_t n_history;
};

/* ceil(duration/step), then nudged so that exactly the offsets j*step with
 * j < grid lie below the duration, whatever the rounding of the division.
 * No libm: the library imports none. */
static size_t grid_count(double duration_h, double step_h)
{
    const double q = duration_h / step_h; /* at most 720 * 60 */
    size_t k = (size_t)q;
    if ((double)k < q) {
        k++;
    }
    while (k > 1 && (double)(k - 1) * step_h >= duration_h) {
        k--;
    }
    while ((double)k * step_h < duration_h) {
        k++;
    }
    return k;
}

/* A plan starting at sodium na0 with body water tbw0; history (may be
 * NULL with n_history 0) is the measured series the plan continues. */
static void plan_init(struct plan *p, double na0, double tbw0,
                      const ntr_timed_flow *flows, size_t n_flows,
                      double duration_h, double step_h,
                      const ntr_sample *history, size_t n_history)
{
    p->na0 = na0;
    p->tbw0 = tbw0;
    p->flows = flows;
    p->n_flows = n_flows;
    p->duration_h = duration_h;
    p->step_h = step_h;
    p->grid = grid_count(duration_h, step_h);
    p->history = history;
    p->n_history = n_history;
}

static double plan_offset(const struct plan *p, size_t j)
{
    return j < p->grid ? (double)j * p->step_h : p->duration_h;
}

/* Sodium and water tau hours into the plan: every flow contributes
 * rate/1000 * (time it has run so far) litres. */
static int plan_state(const struct plan *p, double tau, double *na, double *tbw)
{
    double gain = 0.0;
    double excess = 0.0;
    size_t i;
    for (i = 0; i < p->n_flows; i++) {
        const ntr_timed_flow *f = &p->flows[i];
        const double stop = tau < f->end_h ? tau : f->end_h;
        const double ran = stop - f->start_h;
        if (ran > 0.0) {
            const double v = f->rate_ml_h / 1000.0 * ran;
            gain += v;
            excess += v * ((f->na_mmol_l + f->k_mmol_l) - p->na0);
        }
    }
    return ntri_mass_balance(p->na0, p->tbw0, gain, excess, na, tbw);
}

/* Every point of the plan (j = 0 .. grid) inside the model's range?
 * Reports the state at the end. */
static int plan_validate(const struct plan *p, double *final_na, double *final_tbw)
{
    double na = p->na0;
    double tbw = p->tbw0;
    size_t j;
    for (j = 1; j <= p->grid; j++) {
        NTR_TRY(plan_state(p, plan_offset(p, j), &na, &tbw));
    }
    *final_na = na;
    *final_tbw = tbw;
    return NTR_OK;
}

int ntr_balance_course(double na_mmol_l, double tbw_l,
                       const ntr_timed_flow *flows, size_t n_flows,
                       double duration_h, double step_h, ntr_sample *series,
                       size_t capacity, size_t *count)
{
    struct plan p;
    double final_na, final_tbw;
    size_t j;

    if (count == NULL || (series == NULL && capacity > 0) ||
        (flows == NULL && n_flows > 0)) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(check_timed_flows_reserved(flows, n_flows));
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check_tbw(tbw_l));
    NTR_TRY(check_timed_flows(flows, n_flows));
    NTR_TRY(check_span(duration_h, step_h));
    NTR_TRY(timed_flows_order(flows, n_flows));

    plan_init(&p, na_mmol_l, tbw_l, flows, n_flows, duration_h, step_h,
              NULL, 0);

    if (capacity < p.grid + 1) {
        *count = p.grid + 1;
        return NTR_ERR_CAPACITY;
    }
    NTR_TRY(plan_validate(&p, &final_na, &final_tbw));
    for (j = 0; j <= p.grid; j++) {
        double tbw;
        series[j].hours = plan_offset(&p, j);
        /* Checked by plan_validate(): cannot fail here. */
        (void)plan_state(&p, series[j].hours, &series[j].na_mmol_l, &tbw);
    }
    *count = p.grid + 1;
    return NTR_OK;
}

/* ---- plan check ------------------------------------------------------------- */

/* The series the plan check assesses: the history, then the points of the
 * plan after its start, placed after the last measured sample. */
static ntr_sample plan_point(const void *ctx, size_t i)
{
    const struct plan *p = (const struct plan *)ctx;
    ntr_sample s;
    double tau, tbw;
    if (i < p->n_history) {
        return p->history[i];
    }
    tau = plan_offset(p, i - p->n_history + 1);
    s.hours = p->history[p->n_history - 1].hours + tau;
    s.na_mmol_l = p->na0;
    /* Validated before the assessment runs: cannot fail here. */
    (void)plan_state(p, tau, &s.na_mmol_l, &tbw);
    return s;
}

static double breach_time(const struct plan *p, size_t index)
{
    if (index == NTRI_NONE) {
        return NTR_PLAN_NO_BREACH;
    }
    return plan_offset(p, index - p->n_history + 1);
}

int ntr_plan_check(const ntr_sample *history, size_t n_history, double tbw_l,
                   const ntr_timed_flow *flows, size_t n_flows,
                   double duration_h, double step_h, const ntr_limits *lim,
                   ntr_plan_result *out)
{
    struct plan p;
    ntri_series v;
    ntri_breach breach;
    ntr_correction course;
    double final_na, final_tbw;
    int history_order;

    if (history == NULL || lim == NULL || out == NULL ||
        (flows == NULL && n_flows > 0)) {
        return NTR_ERR_NULL;
    }
    if (n_history == 0) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(check_timed_flows_reserved(flows, n_flows));
    NTR_TRY(ntri_samples_check(history, n_history, &history_order));
    NTR_TRY(ntr_check_tbw(tbw_l));
    NTR_TRY(check_timed_flows(flows, n_flows));
    NTR_TRY(check_span(duration_h, step_h));
    NTR_TRY(ntri_limits_check(lim));
    NTR_TRY(history_order);
    NTR_TRY(timed_flows_order(flows, n_flows));

    plan_init(&p, history[n_history - 1].na_mmol_l, tbw_l, flows, n_flows,
              duration_h, step_h, history, n_history);
    NTR_TRY(plan_validate(&p, &final_na, &final_tbw));

    v.samples = NULL;
    v.point = plan_point;
    v.ctx = &p;
    v.n = n_history + p.grid;
    ntri_assess(&v, lim, n_history, &course, &breach);

    out->course = course;
    out->final_na_mmol_l = final_na;
    out->final_tbw_l = final_tbw;
    out->breach_24h_h = breach_time(&p, breach.first_over_24h);
    out->breach_48h_h = breach_time(&p, breach.first_over_48h);
    out->reserved_d[0] = 0.0;
    out->reserved_d[1] = 0.0;
    out->points = (unsigned int)p.grid;
    out->reserved = 0u;
    return NTR_OK;
}

/* ---- re-lowering ------------------------------------------------------------ */

int ntr_relower_estimate(double na_mmol_l, double tbw_l, double fluid_na_mmol_l,
                         double fluid_k_mmol_l, double lower_by_mmol_l,
                         double hours, double urine_ml_h,
                         double urine_na_mmol_l, double urine_k_mmol_l,
                         double *volume_l, double *rate_ml_h)
{
    double target, fluid_c, urine_c, urine_l, volume, rate, end_na, end_tbw;

    if (volume_l == NULL || rate_ml_h == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check_tbw(tbw_l));
    NTR_TRY(ntr_check(fluid_na_mmol_l, 0.0, NTR_INFUSATE_NA_MAX));
    NTR_TRY(ntr_check(fluid_k_mmol_l, 0.0, NTR_INFUSATE_K_MAX));
    NTR_TRY(ntr_check(lower_by_mmol_l, 0.0, NTR_DELTA_MAX));
    if (!(lower_by_mmol_l > 0.0)) {
        return NTR_ERR_RANGE;
    }
    /* At least a minute, so the rate stays finite. */
    NTR_TRY(ntr_check(hours, NTR_PLAN_STEP_MIN, NTR_PLAN_HOURS_MAX));
    NTR_TRY(ntr_check(urine_ml_h, 0.0, NTR_FLOW_RATE_MAX));
    NTR_TRY(ntr_check(urine_na_mmol_l, 0.0, NTR_URINE_NA_MAX));
    NTR_TRY(ntr_check(urine_k_mmol_l, 0.0, NTR_URINE_K_MAX));

    target = na_mmol_l - lower_by_mmol_l;
    NTR_TRY(ntri_model_na(target));
    fluid_c = fluid_na_mmol_l + fluid_k_mmol_l;
    urine_c = urine_na_mmol_l + urine_k_mmol_l;
    /* Only a fluid weaker than the target can bring sodium down to it. */
    if (!(fluid_c < target)) {
        return NTR_ERR_DOMAIN;
    }
    urine_l = urine_ml_h / 1000.0 * hours;
    /* Solve (Na0*TBW0 + V*cf - U*cu)/(TBW0 + V - U) = target for V. */
    volume = (lower_by_mmol_l * tbw_l + urine_l * (target - urine_c)) /
             (target - fluid_c);
    if (volume < 0.0) {
        /* The losses alone already lower sodium by at least that much. */
        volume = 0.0;
    }
    if (volume > NTR_INFUSE_VOLUME_MAX) {
        return NTR_ERR_DOMAIN;
    }
    /* The state the plan ends in, by the rule ntr_balance_predict() and the
     * course apply: refused here when they would refuse it (body water
     * outside 0.1 to 400 L, or, when the losses alone overshoot, a sodium
     * below 80). Sodium moves monotonically between the start and this end under
     * steady rates, so the course in between is inside too. */
    NTR_TRY(ntri_mass_balance(na_mmol_l, tbw_l, volume - urine_l,
                              volume * (fluid_c - na_mmol_l) -
                                  urine_l * (urine_c - na_mmol_l),
                              &end_na, &end_tbw));
    rate = volume / hours * 1000.0;
    /* A rate a timed flow would refuse (ntr_balance_course(),
     * ntr_plan_check()) is no plan. */
    if (rate > NTR_FLOW_RATE_MAX) {
        return NTR_ERR_DOMAIN;
    }
    *volume_l = volume;
    *rate_ml_h = rate;
    return NTR_OK;
}
