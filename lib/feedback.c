/* SPDX-License-Identifier: MIT */
/* Urine feedback and the fitted prediction (docs/feedback.md): measured
 * urine as an electrolyte-free water balance and a re-projected course,
 * body water and an unmeasured free-water loss fitted to the measured
 * sodium, and the remaining plan re-projected with them. Every prediction
 * goes through the mass balance of lib/balance.c. */
#include "balance_engine.h"
#include "correction_engine.h"

/* ---- the clock -------------------------------------------------------------- */

/* Hours of sample i after the first: the clock of flows and intervals. */
static double clock_h(const ntr_sample *history, size_t i)
{
    return history[i].hours - history[0].hours;
}

static int history_span(const ntr_sample *history, size_t n)
{
    return clock_h(history, n - 1) <= NTR_PLAN_HOURS_MAX ? NTR_OK : NTR_ERR_DOMAIN;
}

/* ---- urine intervals ------------------------------------------------------------ */

static int interval_reserved(const ntr_urine_interval *u)
{
    if (u->reserved_d[0] != 0.0 || u->reserved_d[1] != 0.0 ||
        u->reserved[0] != 0u || u->reserved[1] != 0u) {
        return NTR_ERR_ARG;
    }
    return NTR_OK;
}

static int interval_values(const ntr_urine_interval *u)
{
    NTR_TRY(ntr_check(u->start_h, 0.0, NTR_PLAN_HOURS_MAX));
    NTR_TRY(ntr_check(u->end_h, 0.0, NTR_PLAN_HOURS_MAX));
    NTR_TRY(ntr_check(u->volume_ml, 0.0, NTR_URINE_ML_MAX));
    NTR_TRY(ntr_check(u->na_mmol_l, 0.0, NTR_URINE_NA_MAX));
    NTR_TRY(ntr_check(u->k_mmol_l, 0.0, NTR_URINE_K_MAX));
    return ntr_check(u->osm_mosm_kg, NTR_URINE_OSM_MIN, NTR_URINE_OSM_MAX);
}

static int interval_length(const ntr_urine_interval *u)
{
    return u->end_h - u->start_h >= NTR_PLAN_STEP_MIN ? NTR_OK : NTR_ERR_ORDER;
}

/* The interval as a loss at a steady rate over its span (checked input). */
static ntr_timed_flow interval_as_flow(const ntr_urine_interval *u)
{
    ntr_timed_flow f;
    f.start_h = u->start_h;
    f.end_h = u->end_h;
    f.rate_ml_h = -(u->volume_ml / (u->end_h - u->start_h));
    f.na_mmol_l = u->na_mmol_l;
    f.k_mmol_l = u->k_mmol_l;
    f.reserved[0] = 0u;
    f.reserved[1] = 0u;
    return f;
}

static int interval_rate(const ntr_urine_interval *u)
{
    const ntr_timed_flow f = interval_as_flow(u);
    return f.rate_ml_h >= -NTR_FLOW_RATE_MAX ? NTR_OK : NTR_ERR_DOMAIN;
}

int ntr_urine_interval_flow(const ntr_urine_interval *urine, ntr_timed_flow *flow)
{
    if (urine == NULL || flow == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(interval_reserved(urine));
    NTR_TRY(interval_values(urine));
    NTR_TRY(interval_length(urine));
    NTR_TRY(interval_rate(urine));
    *flow = interval_as_flow(urine);
    return NTR_OK;
}

static int intervals_check(const ntr_urine_interval *u, size_t n, int stage)
{
    size_t i;
    for (i = 0; i < n; i++) {
        if (stage == 0) {
            NTR_TRY(interval_reserved(&u[i]));
        } else if (stage == 1) {
            NTR_TRY(interval_values(&u[i]));
        } else if (stage == 2) {
            NTR_TRY(interval_length(&u[i]));
            if (i > 0 && u[i].start_h < u[i - 1].end_h) {
                return NTR_ERR_ORDER;
            }
        } else {
            NTR_TRY(interval_rate(&u[i]));
        }
    }
    return NTR_OK;
}

/* ---- urine feedback ------------------------------------------------------------- */

/* The measured urine, and the latest interval continued from now to the
 * horizon, as a flow source for the plan engine (flow clock). */
struct urine_source {
    const ntr_urine_interval *urine;
    size_t n_urine;
    ntr_timed_flow continued;
};

static void urine_add(const void *ctx, double from_h, double to_h, double na0,
                      double *gain, double *excess)
{
    const struct urine_source *src = (const struct urine_source *)ctx;
    size_t i;
    for (i = 0; i < src->n_urine; i++) {
        const ntr_timed_flow f = interval_as_flow(&src->urine[i]);
        ntri_timed_flows_add(&f, 1, from_h, to_h, na0, gain, excess);
    }
    ntri_timed_flows_add(&src->continued, 1, from_h, to_h, na0, gain, excess);
}

/* EFW (mL) of one flow's volume between from_h and to_h, relative to na:
 * added to *in for an input, to *out (as a positive loss) for a loss. */
static void flow_efw(const ntr_timed_flow *f, double from_h, double to_h,
                     double na, double *in, double *out)
{
    double v = 0.0;
    double content = 0.0;
    ntri_timed_flows_add(f, 1, from_h, to_h, 0.0, &v, &content);
    if (v > 0.0) {
        *in += 1000.0 * ntri_efw(v, f->na_mmol_l + f->k_mmol_l, na);
    } else if (v < 0.0) {
        *out += 1000.0 * ntri_efw(-v, f->na_mmol_l + f->k_mmol_l, na);
    }
}

/* The EFW rate (mL/h) of the inputs running at time t, relative to na. */
static double inputs_efw_rate(const ntr_timed_flow *flows, size_t n, double t,
                              double na)
{
    double rate = 0.0;
    size_t i;
    for (i = 0; i < n; i++) {
        const ntr_timed_flow *f = &flows[i];
        if (f->rate_ml_h > 0.0 && f->start_h <= t && t < f->end_h) {
            rate += ntri_efw(f->rate_ml_h, f->na_mmol_l + f->k_mmol_l, na);
        }
    }
    return rate;
}

static int feedback_kind(size_t n_history, size_t n_urine,
                         const ntr_course_limits *lim,
                         const ntr_urine_feedback_result *out)
{
    if (n_history == 0 || n_urine == 0) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntri_course_limits_kind(lim));
    if (out->struct_size < sizeof(ntr_urine_feedback_result)) {
        return NTR_ERR_ARG;
    }
    return NTR_OK;
}

static unsigned int feedback_flags(const ntr_urine_interval *latest,
                                   double urine_efw_ml_h, double breach_h,
                                   double now_offset_h,
                                   const ntr_course_plan_result *plan)
{
    unsigned int flags = 0u;
    if (latest->osm_mosm_kg <= NTR_URINE_OSM_DILUTE_MAX) {
        flags |= NTR_FB_DILUTE_URINE;
    }
    if (breach_h == NTR_PLAN_NO_BREACH) {
        return flags;
    }
    flags |= NTR_FB_LIMIT_AHEAD;
    if (plan->first_breach_h <= now_offset_h) {
        flags |= NTR_FB_OVER_NOW;
    }
    if (plan->first_breach_direction == NTR_PLAN_BREACH_RISE && urine_efw_ml_h > 0.0) {
        flags |= NTR_FB_WATER_DIURESIS;
    }
    if (plan->first_breach_direction == NTR_PLAN_BREACH_FALL && urine_efw_ml_h < 0.0) {
        flags |= NTR_FB_SALT_LOSS;
    }
    return flags;
}

int ntr_urine_feedback(const ntr_sample *history, size_t n_history,
                       double tbw_l, const ntr_timed_flow *flows,
                       size_t n_flows, const ntr_urine_interval *urine,
                       size_t n_urine, double horizon_h, double step_h,
                       const ntr_course_limits *lim,
                       ntr_urine_feedback_result *out)
{
    struct urine_source src;
    ntri_plan_spec spec;
    ntr_course_plan_result plan;
    const ntr_urine_interval *latest;
    double t_last, now, na_last, gain = 0.0, excess = 0.0, na_now, tbw_now;
    double efw_in = 0.0, efw_out = 0.0, urine_rate, urine_efw, input_efw;
    double breach;
    int order;
    size_t i;

    if (history == NULL || urine == NULL || lim == NULL || out == NULL ||
        (flows == NULL && n_flows > 0)) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(feedback_kind(n_history, n_urine, lim, out));
    NTR_TRY(ntri_timed_flows_reserved(flows, n_flows));
    NTR_TRY(intervals_check(urine, n_urine, 0));
    NTR_TRY(ntri_samples_check(history, n_history, &order));
    NTR_TRY(ntr_check_tbw(tbw_l));
    NTR_TRY(ntri_timed_flows_values(flows, n_flows));
    NTR_TRY(intervals_check(urine, n_urine, 1));
    NTR_TRY(ntri_plan_span_check(horizon_h, step_h));
    NTR_TRY(ntri_course_limits_values(lim));
    NTR_TRY(order);
    NTR_TRY(ntri_timed_flows_order(flows, n_flows));
    NTR_TRY(intervals_check(urine, n_urine, 2));
    NTR_TRY(history_span(history, n_history));
    NTR_TRY(intervals_check(urine, n_urine, 3));

    latest = &urine[n_urine - 1];
    t_last = clock_h(history, n_history - 1);
    now = latest->end_h > t_last ? latest->end_h : t_last;
    if (now - t_last + horizon_h > NTR_PLAN_HOURS_MAX) {
        return NTR_ERR_DOMAIN;
    }
    na_last = history[n_history - 1].na_mmol_l;

    src.urine = urine;
    src.n_urine = n_urine;
    src.continued = interval_as_flow(latest);
    urine_rate = -src.continued.rate_ml_h;
    src.continued.start_h = now;
    src.continued.end_h = now + horizon_h;

    /* The balance from the last sample to now. */
    ntri_timed_flows_add(flows, n_flows, t_last, now, na_last, &gain, &excess);
    urine_add(&src, t_last, now, na_last, &gain, &excess);
    NTR_TRY(ntri_mass_balance(na_last, tbw_l, gain, excess, &na_now, &tbw_now));
    for (i = 0; i < n_flows; i++) {
        flow_efw(&flows[i], t_last, now, na_last, &efw_in, &efw_out);
    }
    for (i = 0; i < n_urine; i++) {
        const ntr_timed_flow f = interval_as_flow(&urine[i]);
        flow_efw(&f, t_last, now, na_last, &efw_in, &efw_out);
    }

    spec.history = history;
    spec.n_history = n_history;
    spec.tbw_l = tbw_l;
    spec.flows = flows;
    spec.n_flows = n_flows;
    spec.shift_h = t_last;
    spec.extra = urine_add;
    spec.extra_ctx = &src;
    spec.duration_h = now - t_last + horizon_h;
    spec.step_h = step_h;
    NTR_TRY(ntri_course_plan_run(&spec, lim, &plan));

    urine_efw = ntri_efw(urine_rate, latest->na_mmol_l + latest->k_mmol_l, na_now);
    input_efw = inputs_efw_rate(flows, n_flows, now, na_now);
    if (plan.first_breach_h == NTR_PLAN_NO_BREACH) {
        breach = NTR_PLAN_NO_BREACH;
    } else {
        breach = plan.first_breach_h - (now - t_last);
        breach = breach > 0.0 ? breach : 0.0;
    }

    out->struct_size = sizeof(ntr_urine_feedback_result);
    out->now_h = now;
    out->na_now_mmol_l = na_now;
    out->tbw_now_l = tbw_now;
    out->efw_in_ml = efw_in;
    out->efw_out_ml = efw_out;
    out->efw_balance_ml = efw_in - efw_out;
    out->urine_ml_h = urine_rate;
    out->urine_efw_ml_h = urine_efw;
    out->input_efw_ml_h = input_efw;
    out->na_rate_mmol_l_h = -na_now * ((input_efw - urine_efw) / 1000.0) / tbw_now;
    out->breach_h = breach;
    out->flags = feedback_flags(latest, urine_efw, breach, now - t_last, &plan);
    out->reserved = 0u;
    out->plan = plan;
    return NTR_OK;
}

/* ---- the fit ----------------------------------------------------------------------- */

/* Parameters: sodium at history[0], body water at history[0], loss. */
enum { P_NA0, P_TBW, P_LOSS, NP };

struct fit_problem {
    const ntr_sample *history;
    size_t n;
    const ntr_timed_flow *flows;
    size_t n_flows;
    double lo[NP];
    double hi[NP];
};

/* Fitted sodium m and body water d at clock time t: the known flows and the
 * loss (a timed flow of rate -L without sodium) through the mass balance. */
static int model_at(const struct fit_problem *fp, const double p[NP], double t,
                    double *m, double *d)
{
    ntr_timed_flow loss;
    double gain = 0.0;
    double excess = 0.0;
    loss.start_h = 0.0;
    loss.end_h = t;
    loss.rate_ml_h = -p[P_LOSS];
    loss.na_mmol_l = 0.0;
    loss.k_mmol_l = 0.0;
    loss.reserved[0] = 0u;
    loss.reserved[1] = 0u;
    ntri_timed_flows_add(fp->flows, fp->n_flows, 0.0, t, p[P_NA0], &gain, &excess);
    ntri_timed_flows_add(&loss, 1, 0.0, t, p[P_NA0], &gain, &excess);
    return ntri_mass_balance(p[P_NA0], p[P_TBW], gain, excess, m, d);
}

/* Sum of squared residuals and, when a is not NULL, the normal matrix
 * a = J'J and g = J'r, J the derivatives of the model:
 * dm/dNa0 = W/D, dm/dW = (Na0 - m)/D, dm/dL = m*t/(1000*D). */
static int evaluate(const struct fit_problem *fp, const double p[NP],
                    double *ssr, double a[NP][NP], double g[NP])
{
    double sum = 0.0;
    size_t k;
    int i, j;
    if (a != NULL) {
        for (i = 0; i < NP; i++) {
            g[i] = 0.0;
            for (j = 0; j < NP; j++) {
                a[i][j] = 0.0;
            }
        }
    }
    for (k = 0; k < fp->n; k++) {
        const double t = clock_h(fp->history, k);
        double m, d, r, jac[NP];
        NTR_TRY(model_at(fp, p, t, &m, &d));
        r = fp->history[k].na_mmol_l - m;
        sum += r * r;
        if (a != NULL) {
            jac[P_NA0] = p[P_TBW] / d;
            jac[P_TBW] = (p[P_NA0] - m) / d;
            jac[P_LOSS] = m * t / (1000.0 * d);
            for (i = 0; i < NP; i++) {
                g[i] += jac[i] * r;
                for (j = 0; j < NP; j++) {
                    a[i][j] += jac[i] * jac[j];
                }
            }
        }
    }
    *ssr = sum;
    return NTR_OK;
}

/* Square root by Newton's iteration on the mantissa scaled into [1/4, 4]
 * (the library imports no libm); x >= 0 and finite. */
static double fit_sqrt(double x)
{
    double scale = 1.0;
    double y;
    int k;
    if (!(x > 0.0)) {
        return 0.0;
    }
    while (x > 4.0) {
        x *= 0.25;
        scale *= 2.0;
    }
    while (x < 0.25) {
        x *= 4.0;
        scale *= 0.5;
    }
    y = 0.5 * (1.0 + x);
    for (k = 0; k < 8; k++) {
        y = 0.5 * (y + x / y);
    }
    return y * scale;
}

/* Solves the symmetric positive definite 3x3 system m*x = b by Cholesky;
 * NTR_ERR_DOMAIN when m is not positive definite. */
static int solve3(double m[NP][NP], const double b[NP], double x[NP])
{
    double l[NP][NP] = {{0.0}};
    double y[NP];
    int i, j, k;
    for (i = 0; i < NP; i++) {
        for (j = 0; j <= i; j++) {
            double s = m[i][j];
            for (k = 0; k < j; k++) {
                s -= l[i][k] * l[j][k];
            }
            if (i == j) {
                if (!(s > 0.0)) {
                    return NTR_ERR_DOMAIN;
                }
                l[i][i] = fit_sqrt(s);
            } else {
                l[i][j] = s / l[j][j];
            }
        }
    }
    for (i = 0; i < NP; i++) {
        double s = b[i];
        for (k = 0; k < i; k++) {
            s -= l[i][k] * y[k];
        }
        y[i] = s / l[i][i];
    }
    for (i = NP - 1; i >= 0; i--) {
        double s = y[i];
        for (k = i + 1; k < NP; k++) {
            s -= l[k][i] * x[k];
        }
        x[i] = s / l[i][i];
    }
    return NTR_OK;
}

static double clamp(double x, double lo, double hi)
{
    return x < lo ? lo : (x > hi ? hi : x);
}

struct fit_state {
    double p[NP];
    double ssr;
    unsigned int iterations;
    int converged;
};

/* Levenberg-Marquardt from p0 within the box: damping lambda on the
 * diagonal of J'J (Marquardt's scaling), a step clipped to the box and
 * accepted only when the sum of squares falls. */
static int levenberg_marquardt(const struct fit_problem *fp, const double p0[NP],
                               struct fit_state *st)
{
    double a[NP][NP], g[NP];
    double lambda = 1e-3;
    int i, it;
    for (i = 0; i < NP; i++) {
        st->p[i] = clamp(p0[i], fp->lo[i], fp->hi[i]);
    }
    /* evaluate() writes it on NTR_OK; set first anyway, because clang's
     * path-sensitive analyser (tests/static-analysis.sh) does not follow
     * that write into the loop below and would report a garbage read. */
    st->ssr = 0.0;
    NTR_TRY(evaluate(fp, st->p, &st->ssr, a, g));
    st->iterations = 0u;
    st->converged = 0;
    for (it = 0; it < NTR_FIT_ITER_MAX; it++) {
        double m[NP][NP], step[NP], trial[NP], ssr_trial, biggest = 0.0;
        double moved = 0.0;
        int j, solved;
        st->iterations++;
        if (st->ssr == 0.0) {
            st->converged = 1;
            break;
        }
        for (i = 0; i < NP; i++) {
            biggest = a[i][i] > biggest ? a[i][i] : biggest;
        }
        for (i = 0; i < NP; i++) {
            for (j = 0; j < NP; j++) {
                m[i][j] = a[i][j];
            }
            /* A parameter the data say nothing about still gets a damped
             * diagonal, so the system stays solvable. */
            m[i][i] += lambda * (a[i][i] > 1e-12 * biggest ? a[i][i] : 1e-12 * biggest + 1e-300);
        }
        /* A step the damped system cannot give is refused like a step
         * that does not lower the sum of squares (below): more damping. */
        solved = solve3(m, g, step) == NTR_OK;
        for (i = 0; solved && i < NP; i++) {
            const double scale = st->p[i] < 0.0 ? -st->p[i] : st->p[i];
            double rel;
            trial[i] = clamp(st->p[i] + step[i], fp->lo[i], fp->hi[i]);
            rel = (trial[i] - st->p[i]) / (scale > 1.0 ? scale : 1.0);
            rel = rel < 0.0 ? -rel : rel;
            moved = rel > moved ? rel : moved;
        }
        if (solved && evaluate(fp, trial, &ssr_trial, NULL, NULL) == NTR_OK &&
            ssr_trial < st->ssr) {
            const double before = st->ssr;
            for (i = 0; i < NP; i++) {
                st->p[i] = trial[i];
            }
            /* Cannot fail (the same point was just evaluated); checked
             * anyway, so that no failure could leave a and g half made. */
            NTR_TRY(evaluate(fp, st->p, &st->ssr, a, g));
            lambda = lambda > 1e-12 ? lambda * 0.1 : lambda;
            if (before - st->ssr <= 1e-14 * before || moved < 1e-12) {
                st->converged = 1;
                break;
            }
        } else {
            lambda *= 10.0;
            if (lambda > 1e16 || (solved && moved < 1e-15)) {
                st->converged = 1;
                break;
            }
        }
    }
    return NTR_OK;
}

/* The parameters from the linearised solution x (x[0] and x[1] > 0) into
 * p; whether all are finite. */
static int finite_start(const double x[NP], double p[NP])
{
    int i, finite = 1;
    p[P_NA0] = x[0];
    p[P_TBW] = 1.0 / x[1];
    p[P_LOSS] = 1000.0 * x[2] * p[P_TBW] / x[0];
    for (i = 0; i < NP; i++) {
        finite = finite && p[i] - p[i] == 0.0;
    }
    return finite;
}

/* A start from the model linearised around the first sample:
 * m_k ~ a + u*X_k + q*t_k with X_k the known flows' excess over Na(0),
 * u = 1/W and q = a*L/(1000*W); NTR_ERR_DOMAIN when that fails. */
static int linear_start(const struct fit_problem *fp, double p[NP])
{
    double a[NP][NP] = {{0.0}}, b[NP] = {0.0}, x[NP];
    const double na0 = fp->history[0].na_mmol_l;
    size_t k;
    int i, j;
    for (k = 0; k < fp->n; k++) {
        const double t = clock_h(fp->history, k);
        double gain = 0.0, excess = 0.0, row[NP];
        ntri_timed_flows_add(fp->flows, fp->n_flows, 0.0, t, na0, &gain, &excess);
        row[0] = 1.0;
        row[1] = excess;
        row[2] = t;
        for (i = 0; i < NP; i++) {
            b[i] += row[i] * fp->history[k].na_mmol_l;
            for (j = 0; j < NP; j++) {
                a[i][j] += row[i] * row[j];
            }
        }
    }
    NTR_TRY(solve3(a, b, x));
    /* A start with no positive sodium or body water, or a non-finite one
     * (a near-singular solve), is not used. */
    if (!(x[1] > 0.0) || !(x[0] > 0.0) || !finite_start(x, p)) {
        return NTR_ERR_DOMAIN;
    }
    return NTR_OK;
}

/* Correlation of the W and L estimates and their standard errors from the
 * normal matrix scaled to unit diagonal; NTR_ERR_DOMAIN when the two cannot
 * be told apart. */
static int separability(double a[NP][NP], double s2, double *corr,
                        double *se_tbw, double *se_loss)
{
    double d[NP], r[NP][NP], c[NP][NP], det;
    int i, j;
    for (i = 0; i < NP; i++) {
        if (!(a[i][i] > 0.0)) {
            return NTR_ERR_DOMAIN;
        }
        d[i] = fit_sqrt(a[i][i]);
    }
    for (i = 0; i < NP; i++) {
        for (j = 0; j < NP; j++) {
            r[i][j] = a[i][j] / (d[i] * d[j]);
        }
    }
    /* The inverse by cofactors (symmetric). */
    c[0][0] = r[1][1] * r[2][2] - r[1][2] * r[2][1];
    c[0][1] = r[0][2] * r[2][1] - r[0][1] * r[2][2];
    c[0][2] = r[0][1] * r[1][2] - r[0][2] * r[1][1];
    c[1][1] = r[0][0] * r[2][2] - r[0][2] * r[2][0];
    c[1][2] = r[0][2] * r[1][0] - r[0][0] * r[1][2];
    c[2][2] = r[0][0] * r[1][1] - r[0][1] * r[1][0];
    det = r[0][0] * c[0][0] + r[0][1] * c[0][1] + r[0][2] * c[0][2];
    if (!(det > 1e-12) || !(c[1][1] > 0.0) || !(c[2][2] > 0.0)) {
        return NTR_ERR_DOMAIN;
    }
    *corr = c[1][2] / fit_sqrt(c[1][1] * c[2][2]);
    if (!(*corr <= NTR_FIT_CORR_MAX && *corr >= -NTR_FIT_CORR_MAX)) {
        return NTR_ERR_DOMAIN;
    }
    *se_tbw = fit_sqrt(s2 * c[1][1] / det) / d[P_TBW];
    *se_loss = fit_sqrt(s2 * c[2][2] / det) / d[P_LOSS];
    return NTR_OK;
}

static int at_bound(double x, double lo, double hi)
{
    const double tol = 1e-9 * (hi - lo);
    return x <= lo + tol || x >= hi - tol;
}

int ntr_course_fit(const ntr_sample *history, size_t n, double tbw_guess_l,
                   const ntr_timed_flow *flows, size_t n_flows, ntr_fit *out)
{
    struct fit_problem fp;
    struct fit_state best, other;
    double start[NP], a[NP][NP], g[NP], corr, se_tbw, se_loss, s2, late = 0.0;
    double m_last, d_last;
    unsigned int flags = 0u;
    int order, have_best, k_late;
    size_t k;

    if (history == NULL || out == NULL || (flows == NULL && n_flows > 0)) {
        return NTR_ERR_NULL;
    }
    if (n < NTR_FIT_MIN_SAMPLES || out->struct_size < sizeof(ntr_fit)) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntri_timed_flows_reserved(flows, n_flows));
    NTR_TRY(ntri_samples_check(history, n, &order));
    NTR_TRY(ntr_check_tbw(tbw_guess_l));
    NTR_TRY(ntri_timed_flows_values(flows, n_flows));
    NTR_TRY(order);
    NTR_TRY(ntri_timed_flows_order(flows, n_flows));
    NTR_TRY(history_span(history, n));

    fp.history = history;
    fp.n = n;
    fp.flows = flows;
    fp.n_flows = n_flows;
    fp.lo[P_NA0] = NTR_NA_MIN;
    fp.hi[P_NA0] = NTR_NA_MAX;
    fp.lo[P_TBW] = clamp(tbw_guess_l / NTR_FIT_TBW_SPAN, NTR_TBW_MIN, NTR_TBW_MAX);
    fp.hi[P_TBW] = clamp(tbw_guess_l * NTR_FIT_TBW_SPAN, NTR_TBW_MIN, NTR_TBW_MAX);
    fp.lo[P_LOSS] = -NTR_FIT_LOSS_MAX;
    fp.hi[P_LOSS] = NTR_FIT_LOSS_MAX;

    start[P_NA0] = history[0].na_mmol_l;
    start[P_TBW] = tbw_guess_l;
    start[P_LOSS] = 0.0;
    have_best = levenberg_marquardt(&fp, start, &best) == NTR_OK;
    if (linear_start(&fp, start) == NTR_OK &&
        levenberg_marquardt(&fp, start, &other) == NTR_OK) {
        if (!have_best || other.ssr < best.ssr) {
            other.iterations += have_best ? best.iterations : 0u;
            best = other;
        } else {
            best.iterations += other.iterations;
        }
        have_best = 1;
    }
    if (!have_best) {
        return NTR_ERR_DOMAIN;
    }
    /* These cannot fail (the search evaluated this point at every sample
     * time), but a status is never dropped: an impossible failure gives
     * an error, not outputs from unset numbers. */
    NTR_TRY(evaluate(&fp, best.p, &best.ssr, a, g));
    s2 = n > NTR_FIT_MIN_SAMPLES ? best.ssr / (double)(n - NTR_FIT_MIN_SAMPLES) : 0.0;
    NTR_TRY(separability(a, s2, &corr, &se_tbw, &se_loss));
    NTR_TRY(model_at(&fp, best.p, clock_h(history, n - 1), &m_last, &d_last));

    for (k = n - NTR_FIT_MIN_SAMPLES, k_late = 0; k < n; k++, k_late++) {
        double m, d;
        NTR_TRY(model_at(&fp, best.p, clock_h(history, k), &m, &d));
        late += history[k].na_mmol_l - m;
    }
    late /= (double)k_late;

    if (at_bound(best.p[P_TBW], fp.lo[P_TBW], fp.hi[P_TBW])) {
        flags |= NTR_FIT_TBW_AT_BOUND;
    }
    if (at_bound(best.p[P_LOSS], fp.lo[P_LOSS], fp.hi[P_LOSS])) {
        flags |= NTR_FIT_LOSS_AT_BOUND;
    }
    if (!best.converged) {
        flags |= NTR_FIT_NOT_CONVERGED;
    }
    if (n == NTR_FIT_MIN_SAMPLES) {
        flags |= NTR_FIT_EXACT;
    }
    if (late > NTR_FIT_DRIFT_MMOL_L || late < -NTR_FIT_DRIFT_MMOL_L) {
        flags |= NTR_FIT_DRIFT;
    }

    out->struct_size = sizeof(ntr_fit);
    out->tbw_l = best.p[P_TBW];
    out->free_water_loss_ml_h = best.p[P_LOSS];
    out->rms_residual_mmol_l = fit_sqrt(best.ssr / (double)n);
    out->flags = flags;
    out->iterations = best.iterations;
    out->na0_mmol_l = best.p[P_NA0];
    out->tbw_se_l = se_tbw;
    out->free_water_loss_se_ml_h = se_loss;
    out->correlation = corr;
    out->tbw_last_l = d_last;
    out->na_last_fit_mmol_l = m_last;
    out->late_residual_mmol_l = late;
    return NTR_OK;
}

/* ---- re-projection ---------------------------------------------------------------- */

static void loss_add(const void *ctx, double from_h, double to_h, double na0,
                     double *gain, double *excess)
{
    ntri_timed_flows_add((const ntr_timed_flow *)ctx, 1, from_h, to_h, na0, gain,
                         excess);
}

int ntr_fit_reproject(const ntr_sample *history, size_t n, const ntr_fit *fit,
                      const ntr_timed_flow *flows, size_t n_flows,
                      double duration_h, double step_h,
                      const ntr_course_limits *lim, ntr_course_plan_result *out)
{
    ntri_plan_spec spec;
    ntr_timed_flow loss;
    double t_last, gain = 0.0, excess = 0.0, na_unused, tbw_last;
    int order;

    if (history == NULL || fit == NULL || lim == NULL || out == NULL ||
        (flows == NULL && n_flows > 0)) {
        return NTR_ERR_NULL;
    }
    if (n == 0 || fit->struct_size < sizeof(ntr_fit)) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntri_course_limits_kind(lim));
    if (out->struct_size < sizeof(ntr_course_plan_result)) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntri_timed_flows_reserved(flows, n_flows));
    NTR_TRY(ntri_samples_check(history, n, &order));
    NTR_TRY(ntr_check_tbw(fit->tbw_l));
    NTR_TRY(ntr_check(fit->free_water_loss_ml_h, -NTR_FIT_LOSS_MAX, NTR_FIT_LOSS_MAX));
    NTR_TRY(ntri_timed_flows_values(flows, n_flows));
    NTR_TRY(ntri_plan_span_check(duration_h, step_h));
    NTR_TRY(ntri_course_limits_values(lim));
    NTR_TRY(order);
    NTR_TRY(ntri_timed_flows_order(flows, n_flows));
    NTR_TRY(history_span(history, n));

    t_last = clock_h(history, n - 1);
    loss.start_h = 0.0;
    loss.end_h = t_last + duration_h;
    loss.rate_ml_h = -fit->free_water_loss_ml_h;
    loss.na_mmol_l = 0.0;
    loss.k_mmol_l = 0.0;
    loss.reserved[0] = 0u;
    loss.reserved[1] = 0u;

    /* Body water at the last sample; the sodium is the measured one. */
    ntri_timed_flows_add(flows, n_flows, 0.0, t_last, history[0].na_mmol_l, &gain,
                         &excess);
    loss_add(&loss, 0.0, t_last, history[0].na_mmol_l, &gain, &excess);
    NTR_TRY(ntri_mass_balance(history[0].na_mmol_l, fit->tbw_l, gain, excess,
                               &na_unused, &tbw_last));

    spec.history = history;
    spec.n_history = n;
    spec.tbw_l = tbw_last;
    spec.flows = flows;
    spec.n_flows = n_flows;
    spec.shift_h = t_last;
    spec.extra = loss_add;
    spec.extra_ctx = &loss;
    spec.duration_h = duration_h;
    spec.step_h = step_h;
    return ntri_course_plan_run(&spec, lim, out);
}
