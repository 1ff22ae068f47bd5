/* SPDX-License-Identifier: MIT */
/* Predicting a fluid plan by mass balance: sodium after a set of flows, the
 * course over time under steady rates, the check of a plan against the
 * correction limits, and the fluid to re-lower after overcorrection
 * (docs/balance.md). */
#include "correction_engine.h"
#include "balance_engine.h"

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
int ntri_timed_flows_reserved(const ntr_timed_flow *flows, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        if (flows[i].reserved[0] != 0u || flows[i].reserved[1] != 0u) {
            return NTR_ERR_ARG;
        }
    }
    return NTR_OK;
}

int ntri_timed_flows_values(const ntr_timed_flow *flows, size_t n)
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

int ntri_timed_flows_order(const ntr_timed_flow *flows, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        if (flows[i].end_h < flows[i].start_h) {
            return NTR_ERR_ORDER;
        }
    }
    return NTR_OK;
}

int ntri_plan_span_check(double duration_h, double step_h)
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
    /* Flow-clock time of the plan's start (0: flow times are plan times),
     * and flows described otherwise than by the list (NULL: none). */
    double shift_h;
    ntri_flow_source_fn extra;
    const void *extra_ctx;
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
    p->shift_h = 0.0;
    p->extra = NULL;
    p->extra_ctx = NULL;
}

static double plan_offset(const struct plan *p, size_t j)
{
    return j < p->grid ? (double)j * p->step_h : p->duration_h;
}

/* Every flow contributes rate/1000 * (time it has run between from_h and
 * to_h) litres. With from_h 0 and flows starting at or after 0 the time
 * run is min(to, end) - start, bit for bit. */
void ntri_timed_flows_add(const ntr_timed_flow *flows, size_t n, double from_h,
                          double to_h, double na0, double *gain, double *excess)
{
    size_t i;
    for (i = 0; i < n; i++) {
        const ntr_timed_flow *f = &flows[i];
        const double stop = to_h < f->end_h ? to_h : f->end_h;
        const double begin = f->start_h > from_h ? f->start_h : from_h;
        const double ran = stop - begin;
        if (ran > 0.0) {
            const double v = f->rate_ml_h / 1000.0 * ran;
            *gain += v;
            *excess += v * ((f->na_mmol_l + f->k_mmol_l) - na0);
        }
    }
}

/* Sodium and water tau hours into the plan. */
static int plan_state(const struct plan *p, double tau, double *na, double *tbw)
{
    double gain = 0.0;
    double excess = 0.0;
    const double to = tau + p->shift_h;
    ntri_timed_flows_add(p->flows, p->n_flows, p->shift_h, to, p->na0, &gain,
                         &excess);
    if (p->extra != NULL) {
        p->extra(p->extra_ctx, p->shift_h, to, p->na0, &gain, &excess);
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
    /* The points are written while the flows are still read: a series
     * buffer (or count) over the flows would change the plan under way. */
    if (ntri_overlap(series, ntri_bytes(capacity, sizeof *series), flows,
                     ntri_bytes(n_flows, sizeof *flows)) ||
        ntri_overlap(count, sizeof *count, flows, ntri_bytes(n_flows, sizeof *flows)) ||
        ntri_overlap(count, sizeof *count, series, ntri_bytes(capacity, sizeof *series))) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntri_timed_flows_reserved(flows, n_flows));
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check_tbw(tbw_l));
    NTR_TRY(ntri_timed_flows_values(flows, n_flows));
    NTR_TRY(ntri_plan_span_check(duration_h, step_h));
    NTR_TRY(ntri_timed_flows_order(flows, n_flows));

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

/* ---- plan checks ------------------------------------------------------------ */

/* The series a plan check assesses: the history, then the points of the
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

/* A plan ready to be assessed: the plan, the series of history and
 * predicted points, and the state at its end. */
struct plan_run {
    struct plan p;
    ntri_series v;
    double final_na;
    double final_tbw;
};

/* The series of a plan run: history, then points computed on demand. */
static void plan_run_series(struct plan_run *run)
{
    run->v.samples = NULL;
    run->v.point = plan_point;
    run->v.ctx = &run->p;
    run->v.n = run->p.n_history + run->p.grid;
}

/*
 * Everything both plan checks do but the assessment, whose limits differ
 * in type (ntr_limits, ntr_course_limits): the checks in the documented
 * order, the prediction and the series. The caller checks its own limits
 * and output first, since the checks are pure, and passes the verdicts:
 * kind_status (NTR_ERR_ARG checks) in the counts stage, values_status
 * (numeric limit checks) after the plan's numbers. Pointers are checked
 * by the caller.
 */
static int plan_run_start(struct plan_run *run, const ntr_sample *history,
                          size_t n_history, double tbw_l,
                          const ntr_timed_flow *flows, size_t n_flows,
                          double duration_h, double step_h, int kind_status,
                          int values_status)
{
    int history_order;
    if (n_history == 0) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(kind_status);
    NTR_TRY(ntri_timed_flows_reserved(flows, n_flows));
    NTR_TRY(ntri_samples_check(history, n_history, &history_order));
    NTR_TRY(ntr_check_tbw(tbw_l));
    NTR_TRY(ntri_timed_flows_values(flows, n_flows));
    NTR_TRY(ntri_plan_span_check(duration_h, step_h));
    NTR_TRY(values_status);
    NTR_TRY(history_order);
    NTR_TRY(ntri_timed_flows_order(flows, n_flows));

    plan_init(&run->p, history[n_history - 1].na_mmol_l, tbw_l, flows, n_flows,
              duration_h, step_h, history, n_history);
    NTR_TRY(plan_validate(&run->p, &run->final_na, &run->final_tbw));
    plan_run_series(run);
    return NTR_OK;
}

int ntr_plan_check(const ntr_sample *history, size_t n_history, double tbw_l,
                   const ntr_timed_flow *flows, size_t n_flows,
                   double duration_h, double step_h, const ntr_limits *lim,
                   ntr_plan_result *out)
{
    struct plan_run run;
    ntri_breach breach;

    if (history == NULL || lim == NULL || out == NULL ||
        (flows == NULL && n_flows > 0)) {
        return NTR_ERR_NULL;
    }
    /* The 1.0 limits have no ARG stage. */
    NTR_TRY(plan_run_start(&run, history, n_history, tbw_l, flows, n_flows,
                           duration_h, step_h, NTR_OK, ntri_limits_check(lim)));
    /* Every check has passed: nothing can fail from here, so the
     * assessment goes straight into *out (no copy on the stack, which
     * firmware builds keep small: tests/bench/firmware.py). */
    ntri_assess(&run.v, lim, n_history, &out->course, &breach);
    out->final_na_mmol_l = run.final_na;
    out->final_tbw_l = run.final_tbw;
    out->breach_24h_h = breach_time(&run.p, breach.first_over_24h);
    out->breach_48h_h = breach_time(&run.p, breach.first_over_48h);
    out->reserved_d[0] = 0.0;
    out->reserved_d[1] = 0.0;
    out->points = (unsigned int)run.p.grid;
    out->reserved = 0u;
    return NTR_OK;
}

/* The NTR_ERR_ARG checks of the direction-aware check, in order: limits'
 * struct_size and goal, then the result's struct_size. */
static int course_plan_kind(const ntr_course_limits *lim,
                            const ntr_course_plan_result *out)
{
    NTR_TRY(ntri_course_limits_kind(lim));
    return out->struct_size < sizeof(ntr_course_plan_result) ? NTR_ERR_ARG : NTR_OK;
}

/* Which limit a predicted point breaches first. Indices grow with time, so
 * the smallest index is the earliest breach; on a tie the earlier entry of
 * the list wins (rise before fall, 24 h before 48 h). */
static void first_breach(const ntri_course_breach *b, size_t *index,
                         unsigned int *flag)
{
    const size_t at[4] = {b->rise_24h, b->rise_48h, b->fall_24h, b->fall_48h};
    static const unsigned int bits[4] = {NTR_CF_OVER_24H, NTR_CF_OVER_48H,
                                         NTR_CF_FALL_OVER_24H,
                                         NTR_CF_FALL_OVER_48H};
    size_t k;
    *index = NTRI_NONE;
    *flag = 0u;
    for (k = 0; k < 4; k++) {
        if (at[k] < *index) { /* NTRI_NONE is the largest size_t */
            *index = at[k];
            *flag = bits[k];
        }
    }
}

static int direction_of(unsigned int flag)
{
    if (flag == 0u) {
        return NTR_PLAN_BREACH_NONE;
    }
    return (flag & (NTR_CF_OVER_24H | NTR_CF_OVER_48H)) != 0u ? NTR_PLAN_BREACH_RISE
                                                             : NTR_PLAN_BREACH_FALL;
}

/* The assessment and verdict of a started direction-aware plan check. */
static void course_plan_finish(const struct plan_run *run,
                               const ntr_course_limits *lim,
                               ntr_course_plan_result *out)
{
    ntri_course_breach breach;
    size_t first;
    unsigned int flag;

    /* Nothing can fail from here: the report is written in place. */
    ntri_course_assess(&run->v, lim, run->p.n_history, &out->course, &breach);
    first_breach(&breach, &first, &flag);

    out->struct_size = sizeof(ntr_course_plan_result);
    out->final_na_mmol_l = run->final_na;
    out->final_tbw_l = run->final_tbw;
    out->breach_rise_24h_h = breach_time(&run->p, breach.rise_24h);
    out->breach_rise_48h_h = breach_time(&run->p, breach.rise_48h);
    out->breach_fall_24h_h = breach_time(&run->p, breach.fall_24h);
    out->breach_fall_48h_h = breach_time(&run->p, breach.fall_48h);
    out->first_breach_h = breach_time(&run->p, first);
    out->first_breach_flag = flag;
    out->first_breach_direction = direction_of(flag);
    out->points = (unsigned int)run->p.grid;
    out->reserved = 0u;
}

int ntr_course_plan_check(const ntr_sample *history, size_t n_history,
                          double tbw_l, const ntr_timed_flow *flows,
                          size_t n_flows, double duration_h, double step_h,
                          const ntr_course_limits *lim,
                          ntr_course_plan_result *out)
{
    struct plan_run run;
    int kind;

    if (history == NULL || lim == NULL || out == NULL ||
        (flows == NULL && n_flows > 0)) {
        return NTR_ERR_NULL;
    }
    kind = course_plan_kind(lim, out);
    /* The values are read only when their kind is right (the struct may be
     * shorter than this header's). */
    NTR_TRY(plan_run_start(&run, history, n_history, tbw_l, flows, n_flows,
                           duration_h, step_h, kind,
                           kind == NTR_OK ? ntri_course_limits_values(lim) : kind));
    course_plan_finish(&run, lim, out);
    return NTR_OK;
}

int ntri_course_plan_run(const ntri_plan_spec *spec,
                         const ntr_course_limits *lim,
                         ntr_course_plan_result *out)
{
    struct plan_run run;
    const ntr_sample *now = &spec->history[spec->n_history - 1];
    plan_init(&run.p, now->na_mmol_l, spec->tbw_l, spec->flows, spec->n_flows,
              spec->duration_h, spec->step_h, spec->history, spec->n_history);
    run.p.shift_h = spec->shift_h;
    run.p.extra = spec->extra;
    run.p.extra_ctx = spec->extra_ctx;
    NTR_TRY(plan_validate(&run.p, &run.final_na, &run.final_tbw));
    plan_run_series(&run);
    course_plan_finish(&run, lim, out);
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
