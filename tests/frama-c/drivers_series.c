/* SPDX-License-Identifier: MIT */
/* Frama-C EVA drivers of the series entry points: correction and course
 * assessment, the watchers, balance predictions and plan checks, urine
 * feedback and the fitted course (tests/frama-c.sh; docs/reliability.md,
 * "Static proof").
 *
 * A series is short (SAMPLES samples; the 1.0 watcher gets as many pushes,
 * the course watcher COURSE_PUSHES) so
 * that EVA can follow it, but each value spans its whole documented range:
 * the first time anywhere in -1e6 to 1e6 h, each later one the previous
 * plus 0 to 2e6 h (every non-decreasing series in range, and some past
 * the end, which the range check refuses), every sodium 80 to 220 mmol/L,
 * every limit 0 to 50 mmol/L, every flow field its documented interval
 * (ntr_timed_flow, ntr_urine_interval). The bounds are lib/ntr_internal.h's
 * constants, the ones the checks use.
 *
 * The plan checks, the course watcher, the fit, the lowering plan (a
 * course of 49 points) and the urine feedback run at the precision
 * tests/frama-c.sh sets for them; the plan checks and the urine feedback
 * on a bounded grid (PLAN_HOURS, PLAN_POINTS, FEEDBACK_HOURS below).
 * tests/frama-c.sh runs a function named extra_* only when named, outside
 * the recorded figure; there is none at present. */
#include "__fc_builtin.h"
#include "natremia.h"
#include "ntr_internal.h"

#define D(lo, hi) Frama_C_double_interval((lo), (hi))
#define I(lo, hi) Frama_C_interval((lo), (hi))
#define NA D(NTR_NA_MIN, NTR_NA_MAX)
#define TBW D(NTR_TBW_MIN, NTR_TBW_MAX)
#define LIMIT D(0.0, NTR_LIMIT_MAX)
#define SAMPLES 4
#define FLOWS 2
/* The plan checks' grid, bounded: a duration of at most PLAN_HOURS and a
 * step of at least PLAN_HOURS / PLAN_POINTS, so at most PLAN_POINTS + 1
 * predicted points (the documented range, up to 720 h at a 1-minute step,
 * is up to 43201: EVA did not finish those within minutes). Every other
 * input of these drivers spans its documented range. */
#define PLAN_HOURS 48.0
#define PLAN_POINTS 4.0
#define PLAN_DURATION D(0.0, PLAN_HOURS)
#define PLAN_STEP D(PLAN_HOURS / PLAN_POINTS, NTR_PLAN_HOURS_MAX)

/* A non-decreasing series of SAMPLES samples over the documented ranges. */
static void series(ntr_sample *s)
{
    int i;
    s[0].hours = D(-NTR_HOURS_MAX, NTR_HOURS_MAX);
    s[0].na_mmol_l = NA;
    for (i = 1; i < SAMPLES; i++) {
        s[i].hours = s[i - 1].hours + D(0.0, 2.0 * NTR_HOURS_MAX);
        s[i].na_mmol_l = NA;
    }
}

/* A series for the plan checks: their flow times count from history[0],
 * so the series starts at 0 and spans at most the plan length. */
static void plan_history(ntr_sample *s)
{
    int i;
    s[0].hours = 0.0;
    s[0].na_mmol_l = NA;
    for (i = 1; i < SAMPLES; i++) {
        s[i].hours = s[i - 1].hours + D(0.0, NTR_PLAN_HOURS_MAX / SAMPLES);
        s[i].na_mmol_l = NA;
    }
}

static void limits(ntr_limits *lim)
{
    lim->max_rise_24h = LIMIT;
    lim->max_rise_48h = LIMIT;
    lim->min_rise_24h = LIMIT;
}

static void course_limits(ntr_course_limits *lim)
{
    lim->struct_size = sizeof *lim;
    lim->goal = I(0, 4);
    lim->max_rise_24h = LIMIT;
    lim->max_rise_48h = LIMIT;
    lim->max_fall_24h = LIMIT;
    lim->max_fall_48h = LIMIT;
    lim->min_change_24h = LIMIT;
}

/* FLOWS timed flows, each field over its documented range. */
static void timed_flows(ntr_timed_flow *f)
{
    int i;
    for (i = 0; i < FLOWS; i++) {
        f[i].start_h = D(0.0, NTR_PLAN_HOURS_MAX);
        f[i].end_h = f[i].start_h + D(0.0, NTR_PLAN_HOURS_MAX);
        f[i].rate_ml_h = D(-NTR_FLOW_RATE_MAX, NTR_FLOW_RATE_MAX);
        f[i].na_mmol_l = D(0.0, NTR_INFUSATE_NA_MAX);
        f[i].k_mmol_l = D(0.0, NTR_INFUSATE_K_MAX);
        f[i].reserved[0] = 0;
        f[i].reserved[1] = 0;
    }
}

static void urine_interval(ntr_urine_interval *u, double start_lo, double start_hi)
{
    u->start_h = D(start_lo, start_hi);
    u->end_h = u->start_h + D(0.0, NTR_PLAN_HOURS_MAX);
    u->volume_ml = D(0.0, NTR_URINE_ML_MAX);
    u->na_mmol_l = D(0.0, NTR_URINE_NA_MAX);
    u->k_mmol_l = D(0.0, NTR_URINE_K_MAX);
    u->osm_mosm_kg = D(NTR_URINE_OSM_MIN, NTR_URINE_OSM_MAX);
    u->reserved_d[0] = 0.0;
    u->reserved_d[1] = 0.0;
    u->reserved[0] = 0;
    u->reserved[1] = 0;
}

void drv_limits_preset(void)
{
    ntr_limits out;
    (void)ntr_limits_preset(I(-1, 4), &out);
}

void drv_ods_risk(void)
{
    int preset;
    unsigned int drivers, unknowns;
    (void)ntr_ods_risk(NA, I(-1, 3), I(-1, 3), I(-1, 3), I(-1, 3), &preset, &drivers,
                       &unknowns);
}

void drv_correction_assess(void)
{
    ntr_sample s[SAMPLES];
    ntr_limits lim;
    ntr_correction out;
    series(s);
    limits(&lim);
    (void)ntr_correction_assess(s, (size_t)I(1, SAMPLES), &lim, &out);
}

/* The members of a watcher state other than its rings, set to 0 before
 * the init call: EVA joins the state of a failed ntr_watch_init() (which
 * leaves *w as it was) with the good one, and would then report the
 * members of a caller's never-initialised state as read (the driver
 * stops when init fails, a caller would too). The rings are left
 * uninitialised, as ntr_watch_init() leaves them, so that EVA still checks
 * that no call reads a ring entry no push wrote. */
static void watch_members_zero(ntr_watch *w)
{
    w->magic = 0u;
    w->kept = 0u;
    w->head = 0u;
    w->front24 = 0u;
    w->front6 = 0u;
    w->seen = 0u;
    w->first_open = 0u;
    w->reserved_u = 0u;
}

/* ntr_watch_init, then SAMPLES pushes (each hour the previous plus 0 to
 * 2e6 h, so pushes out of range or order are included) and the result. */
void drv_watch(void)
{
    ntr_limits lim;
    ntr_watch w;
    ntr_correction out;
    double h = D(-NTR_HOURS_MAX, NTR_HOURS_MAX);
    int i;
    limits(&lim);
    watch_members_zero(&w);
    if (ntr_watch_init(&lim, &w) != NTR_OK) {
        return;
    }
    for (i = 0; i < SAMPLES; i++) {
        (void)ntr_watch_push(&w, h, NA, &out);
        h += D(0.0, 2.0 * NTR_HOURS_MAX);
    }
    (void)ntr_watch_result(&w, &out);
}

void drv_course_limits_preset(void)
{
    ntr_course_limits out;
    out.struct_size = sizeof out;
    (void)ntr_course_limits_preset(I(-1, 7), &out);
}

void drv_course_assess(void)
{
    ntr_sample s[SAMPLES];
    ntr_course_limits lim;
    ntr_course_report out;
    series(s);
    course_limits(&lim);
    out.struct_size = sizeof out;
    (void)ntr_course_assess(s, (size_t)I(1, SAMPLES), &lim, &out);
}

static void course_watch_members_zero(ntr_course_watch *w)
{
    w->magic = 0u;
    w->seen = 0u;
    w->first_open = 0u;
    w->approximate = 0u;
    w->low.kept = 0u;
    w->low.head = 0u;
    w->low.front24 = 0u;
    w->low.front6 = 0u;
    w->high.kept = 0u;
    w->high.head = 0u;
    w->high.front24 = 0u;
    w->high.front6 = 0u;
}

/* As drv_watch, for the course watcher, alternating the plain and the
 * glucose-corrected push (every glucose method code, valid and not), with
 * COURSE_PUSHES pushes (with SAMPLES, EVA did not finish within 400 s at
 * precision 8 on the shared machine; tests/frama-c.sh runs this driver as
 * the plan checks). */
#define COURSE_PUSHES 3
void drv_course_watch(void)
{
    ntr_course_limits lim;
    ntr_course_watch w;
    ntr_course_report out;
    double h = D(-NTR_HOURS_MAX, NTR_HOURS_MAX);
    int i;
    course_limits(&lim);
    out.struct_size = sizeof out;
    course_watch_members_zero(&w);
    if (ntr_course_watch_init(&lim, &w) != NTR_OK) {
        return;
    }
    for (i = 0; i < COURSE_PUSHES; i++) {
        if (i % 2 == 0) {
            (void)ntr_course_watch_push(&w, h, NA, &out);
        } else {
            (void)ntr_course_watch_push_glucose(&w, h, NA, D(0.0, NTR_GLUCOSE_MAX), I(-1, 4),
                                                &out);
        }
        h += D(0.0, 2.0 * NTR_HOURS_MAX);
    }
    (void)ntr_course_watch_result(&w, &out);
}

void drv_batch_correction_assess(void)
{
    ntr_sample s[SAMPLES];
    size_t offsets[3] = {0, 2, SAMPLES};
    ntr_limits lim;
    ntr_correction out[2];
    int st[2];
    size_t failed;
    series(s);
    limits(&lim);
    (void)ntr_batch_correction_assess(2, offsets, s, SAMPLES, &lim, out, st, &failed);
}

void drv_batch_course_assess(void)
{
    ntr_sample s[SAMPLES];
    size_t offsets[3] = {0, 2, SAMPLES};
    ntr_course_limits lim;
    ntr_course_report out[2];
    int st[2];
    size_t failed;
    series(s);
    course_limits(&lim);
    (void)ntr_batch_course_assess(2, offsets, s, SAMPLES, &lim, sizeof out[0], out, st,
                                  &failed);
}

void drv_balance_predict(void)
{
    ntr_flow f[FLOWS];
    double na, tbw;
    int i;
    for (i = 0; i < FLOWS; i++) {
        f[i].volume_l = D(NTR_FLOW_VOLUME_MIN, NTR_INFUSE_VOLUME_MAX);
        f[i].na_mmol_l = D(0.0, NTR_INFUSATE_NA_MAX);
        f[i].k_mmol_l = D(0.0, NTR_INFUSATE_K_MAX);
    }
    (void)ntr_balance_predict(NA, TBW, f, (size_t)I(0, FLOWS), &na, &tbw);
}

/* The course at a coarse step (at least 1/10 of the duration), so that
 * the series buffer of 12 points is long enough, or NTR_ERR_CAPACITY. */
void drv_balance_course(void)
{
    ntr_timed_flow f[FLOWS];
    ntr_sample out[12];
    size_t count;
    double duration = D(0.0, NTR_PLAN_HOURS_MAX);
    timed_flows(f);
    (void)ntr_balance_course(NA, TBW, f, (size_t)I(0, FLOWS), duration,
                             D(NTR_PLAN_STEP_MIN, NTR_PLAN_HOURS_MAX), out, 12, &count);
}

void drv_plan_check(void)
{
    ntr_sample h[SAMPLES];
    ntr_timed_flow f[FLOWS];
    ntr_limits lim;
    ntr_plan_result out;
    plan_history(h);
    timed_flows(f);
    limits(&lim);
    (void)ntr_plan_check(h, (size_t)I(1, SAMPLES), TBW, f, (size_t)I(0, FLOWS),
                         PLAN_DURATION, PLAN_STEP,
                         &lim, &out);
}

void drv_course_plan_check(void)
{
    ntr_sample h[SAMPLES];
    ntr_timed_flow f[FLOWS];
    ntr_course_limits lim;
    ntr_course_plan_result out;
    plan_history(h);
    timed_flows(f);
    course_limits(&lim);
    out.struct_size = sizeof out;
    (void)ntr_course_plan_check(h, (size_t)I(1, SAMPLES), TBW, f, (size_t)I(0, FLOWS),
                                PLAN_DURATION, PLAN_STEP, &lim, &out);
}

void drv_urine_interval_flow(void)
{
    ntr_urine_interval u;
    ntr_timed_flow f;
    urine_interval(&u, 0.0, NTR_PLAN_HOURS_MAX);
    (void)ntr_urine_interval_flow(&u, &f);
}

/* The urine feedback on the plan checks' grid: its plan runs from the
 * last sample to the end of the latest urine interval plus the horizon,
 * so the history spans at most FEEDBACK_HOURS, the one urine interval
 * starts and ends within it and the horizon is at most FEEDBACK_HOURS:
 * at most 2 x FEEDBACK_HOURS = PLAN_HOURS at a step of at least
 * PLAN_HOURS / PLAN_POINTS (with the history and the intervals over
 * 0 to 720 h and one or two intervals, EVA did not finish within 400 s
 * at the plan checks' settings). Every other field spans its
 * documented range. */
#define FEEDBACK_HOURS (PLAN_HOURS / 2.0)
void drv_urine_feedback(void)
{
    ntr_sample h[SAMPLES];
    ntr_timed_flow f[FLOWS];
    ntr_urine_interval u;
    ntr_course_limits lim;
    ntr_urine_feedback_result out;
    int i;
    h[0].hours = 0.0;
    h[0].na_mmol_l = NA;
    for (i = 1; i < SAMPLES; i++) {
        h[i].hours = h[i - 1].hours + D(0.0, FEEDBACK_HOURS / SAMPLES);
        h[i].na_mmol_l = NA;
    }
    timed_flows(f);
    urine_interval(&u, 0.0, FEEDBACK_HOURS / 2.0);
    u.end_h = u.start_h + D(0.0, FEEDBACK_HOURS / 2.0);
    course_limits(&lim);
    out.struct_size = sizeof out;
    (void)ntr_urine_feedback(h, (size_t)I(1, SAMPLES), TBW, f, (size_t)I(0, FLOWS), &u, 1,
                             D(0.0, FEEDBACK_HOURS), PLAN_STEP, &lim, &out);
}

void drv_course_fit(void)
{
    ntr_sample h[SAMPLES];
    ntr_timed_flow f[FLOWS];
    ntr_fit out;
    plan_history(h);
    timed_flows(f);
    out.struct_size = sizeof out;
    (void)ntr_course_fit(h, (size_t)I(3, SAMPLES), TBW, f, (size_t)I(0, FLOWS), &out);
}

void drv_fit_reproject(void)
{
    ntr_sample h[SAMPLES];
    ntr_timed_flow f[FLOWS];
    ntr_fit fit;
    ntr_course_limits lim;
    ntr_course_plan_result out;
    plan_history(h);
    timed_flows(f);
    course_limits(&lim);
    fit.struct_size = sizeof fit;
    fit.tbw_l = TBW;
    fit.free_water_loss_ml_h = D(-NTR_FIT_LOSS_MAX, NTR_FIT_LOSS_MAX);
    fit.rms_residual_mmol_l = D(0.0, NTR_LIMIT_MAX);
    fit.flags = 0;
    fit.iterations = 0;
    fit.na0_mmol_l = NA;
    fit.tbw_se_l = D(0.0, NTR_TBW_MAX);
    fit.free_water_loss_se_ml_h = D(0.0, NTR_FIT_LOSS_MAX);
    fit.correlation = D(-1.0, 1.0);
    fit.tbw_last_l = TBW;
    fit.na_last_fit_mmol_l = NA;
    fit.late_residual_mmol_l = D(-NTR_LIMIT_MAX, NTR_LIMIT_MAX);
    out.struct_size = sizeof out;
    (void)ntr_fit_reproject(h, (size_t)I(1, SAMPLES), &fit, f, (size_t)I(0, FLOWS),
                            PLAN_DURATION, PLAN_STEP,
                            &lim, &out);
}

/* Therapy plan that checks its course against course limits (so the
 * course code's +-HUGE_VAL starts run, see above). */
void drv_hyper_lower_plan(void)
{
    double rate, volume, breach;
    (void)ntr_hyper_lower_plan(NA, TBW, I(-1, 9), I(0, 6), D(0.0, NTR_DELTA_MAX), D(NTR_PLAN_STEP_MIN, NTR_PLAN_HOURS_MAX), D(0.0, NTR_FLOW_RATE_MAX), D(0.0, NTR_URINE_NA_MAX),
                               D(0.0, NTR_INSENSIBLE_MAX), &rate, &volume, &breach);
}
