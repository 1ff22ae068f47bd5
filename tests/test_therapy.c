/* SPDX-License-Identifier: MIT */
/* Whole-therapy helpers: ntr_loop_diuretic, ntr_dda_clamp, ntr_dda_relower,
 * ntr_vaptan_watch_preset, ntr_hyper_lower_plan, ntr_bolus_plan
 * (docs/therapy.md).
 *
 * Patients below are invented scenarios. Expected values are hand-worked
 * from the published mass balance (Adrogue HJ, Madias NE, N Engl J Med
 * 2000;342:1581-9 and, for hypernatraemia, 2000;342:1493-9): total cation
 * Na*TBW plus what goes in minus what goes out, over the water left. */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <string.h>
#include <cmocka.h>

#include "natremia_test.h"

#define COUNT(a) (sizeof(a) / sizeof((a)[0]))

/* ---- a bad-input walk for functions with several outputs ----------------- */

#define MAX_ARGS 9
typedef int (*multi_call)(const double *a, double *d, int *i);

struct multi {
    multi_call call;
    size_t n;
    double good[MAX_ARGS];
    double lo[MAX_ARGS];
    double hi[MAX_ARGS];
    int lo_open[MAX_ARGS]; /* 1: lo itself is refused (NTR_ERR_RANGE) */
};

static int run(const struct multi *m, const double *a, int *untouched)
{
    double d[3] = {NTR_TEST_SENTINEL, NTR_TEST_SENTINEL, NTR_TEST_SENTINEL};
    int i[2] = {NTR_TEST_SENTINEL_INT, NTR_TEST_SENTINEL_INT};
    int st = m->call(a, d, i);
    *untouched = d[0] == NTR_TEST_SENTINEL && d[1] == NTR_TEST_SENTINEL &&
                 d[2] == NTR_TEST_SENTINEL && i[0] == NTR_TEST_SENTINEL_INT &&
                 i[1] == NTR_TEST_SENTINEL_INT;
    return st;
}

static void expect(const struct multi *m, const double *a, int want)
{
    int untouched;
    assert_int_equal(run(m, a, &untouched), want);
    if (want != NTR_OK) {
        assert_true(untouched);
    }
}

/* NaN and infinities, the doubles just outside each range, and a range
 * error before a NaN later on (argument order). */
static void walk(const struct multi *m)
{
    const double bad[3] = {(double)NAN, HUGE_VAL, -HUGE_VAL};
    double a[MAX_ARGS];
    size_t k, j, b;
    memcpy(a, m->good, sizeof a);
    expect(m, a, NTR_OK);
    for (k = 0; k < m->n; k++) {
        for (b = 0; b < 3; b++) {
            memcpy(a, m->good, sizeof a);
            a[k] = bad[b];
            expect(m, a, NTR_ERR_NONFINITE);
        }
        memcpy(a, m->good, sizeof a);
        a[k] = m->lo_open[k] ? m->lo[k] : nextafter(m->lo[k], -HUGE_VAL);
        expect(m, a, NTR_ERR_RANGE);
        a[k] = nextafter(m->hi[k], HUGE_VAL);
        expect(m, a, NTR_ERR_RANGE);
        for (j = k + 1; j < m->n; j++) {
            a[j] = (double)NAN;
            expect(m, a, NTR_ERR_RANGE);
            a[j] = m->good[j];
        }
    }
}

/* ---- loop diuretic ----------------------------------------------------------- */

static void loop_diuretic_hand_worked(void **state)
{
    double without = NTR_TEST_SENTINEL, with = NTR_TEST_SENTINEL;
    (void)state;
    /* Hand-worked: Na 120, TBW 40 L, 2 L of urine at Na+K 75 (common
     * practice): (4800 - 150) / 38 = 122.3684...; replacing 1 L of 0.9%
     * saline (154): (4800 - 150 + 154) / 39 = 123.1795... */
    assert_int_equal(ntr_loop_diuretic(120.0, 40.0, 2.0, NTR_LOOP_URINE_NA_K, 1.0, 154.0,
                                       &without, &with), NTR_OK);
    assert_near(without, 4650.0 / 38.0, 1e-12);
    assert_near(with, 4804.0 / 39.0, 1e-12);
    /* No replacement volume: the two agree. */
    assert_int_equal(ntr_loop_diuretic(120.0, 40.0, 2.0, 75.0, 0.0, 154.0, &without, &with),
                     NTR_OK);
    assert_true(without == with);
}

static void loop_diuretic_equals_balance(void **state)
{
    ntr_flow f[2] = {{-3.0, 60.0, 0.0}, {2.0, 513.0, 0.0}};
    double na, tbw, without, with;
    (void)state;
    /* Through the balance function, not a second copy of it. */
    assert_int_equal(ntr_balance_predict(125.0, 33.0, f, 2, &na, &tbw), NTR_OK);
    assert_int_equal(ntr_loop_diuretic(125.0, 33.0, 3.0, 60.0, 2.0, 513.0, &without, &with),
                     NTR_OK);
    assert_true(with == na);
    assert_int_equal(ntr_balance_predict(125.0, 33.0, f, 1, &na, &tbw), NTR_OK);
    assert_true(without == na);
}

static void loop_diuretic_properties(void **state)
{
    double prev = 0.0, without, with;
    double u;
    (void)state;
    /* Half-isotonic urine: more of it raises the sodium more. */
    for (u = 0.0; u <= 6.0; u += 0.5) {
        assert_int_equal(ntr_loop_diuretic(118.0, 35.0, u, 75.0, 0.0, 0.0, &without, &with),
                         NTR_OK);
        assert_true(without >= prev);
        prev = without;
    }
}

static int call_loop(const double *a, double *d, int *i)
{
    (void)i;
    return ntr_loop_diuretic(a[0], a[1], a[2], a[3], a[4], a[5], &d[0], &d[1]);
}

static void loop_diuretic_bad_inputs(void **state)
{
    const struct multi m = {call_loop, 6, {120.0, 40.0, 2.0, 75.0, 1.0, 154.0},
                            {80.0, 0.1, 0.0, 0.0, 0.0, 0.0},
                            {220.0, 400.0, 30.0, 500.0, 20.0, 1100.0}, {0}};
    double d = NTR_TEST_SENTINEL;
    (void)state;
    walk(&m);
    assert_int_equal(ntr_loop_diuretic(120.0, 40.0, 2.0, 75.0, 1.0, 154.0, NULL, &d),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_loop_diuretic(120.0, 40.0, 2.0, 75.0, 1.0, 154.0, &d, NULL),
                     NTR_ERR_NULL);
    assert_true(d == NTR_TEST_SENTINEL);
    /* 30 L of urine from 20 L of body water: no water left. */
    assert_int_equal(ntr_loop_diuretic(120.0, 20.0, 30.0, 75.0, 0.0, 0.0, &d, &d),
                     NTR_ERR_DOMAIN);
    assert_true(d == NTR_TEST_SENTINEL);
}

/* ---- desmopressin clamp ---------------------------------------------------- */

static void clamp_hand_worked(void **state)
{
    double rise = NTR_TEST_SENTINEL, stop = NTR_TEST_SENTINEL;
    (void)state;
    /* Hand-worked: Na 115, TBW 40 L, 3% saline 30 mL/h, urine 30 mL/h at
     * Na+K 100. Over 24 h: in 0.72*513 = 369.36, out 0.72*100 = 72 mmol,
     * water unchanged: (4600 + 297.36) / 40 = 122.434, a rise of 7.434.
     * Stop at +6: A = 0.03*398 + 0.03*15 = 12.39 mmol/h, B = 0:
     * t = 6*40/12.39 = 19.3705 h. */
    assert_int_equal(ntr_dda_clamp(115.0, 40.0, 30.0, 513.0, 30.0, 100.0, 6.0, &rise, &stop),
                     NTR_OK);
    assert_near(rise, 297.36 / 40.0, 1e-9);
    assert_near(stop, 240.0 / 12.39, 1e-9);
}

static void clamp_stop_hour_reaches_target(void **state)
{
    static const double rates[] = {10.0, 20.0, 40.0, 80.0};
    static const double urines[] = {0.0, 25.0, 60.0};
    size_t i, j;
    (void)state;
    /* At the stop hour the course (ntr_balance_course) is at the target. */
    for (i = 0; i < COUNT(rates); i++) {
        for (j = 0; j < COUNT(urines); j++) {
            ntr_timed_flow f[2];
            ntr_sample s[2];
            size_t n;
            double rise, stop;
            memset(f, 0, sizeof f);
            assert_int_equal(ntr_dda_clamp(112.0, 36.0, rates[i], 513.0, urines[j], 80.0, 8.0,
                                           &rise, &stop), NTR_OK);
            assert_true(stop > 0.0);
            f[0].end_h = 720.0;
            f[0].rate_ml_h = rates[i];
            f[0].na_mmol_l = 513.0;
            f[1].end_h = 720.0;
            f[1].rate_ml_h = -urines[j];
            f[1].na_mmol_l = 80.0;
            assert_int_equal(ntr_balance_course(112.0, 36.0, f, 2, stop, stop, s, 2, &n), NTR_OK);
            assert_near(s[1].na_mmol_l, 120.0, 1e-9);
        }
    }
}

static void clamp_never_and_properties(void **state)
{
    double rise, stop, prev_rise = -100.0, prev_stop = 1e9, r;
    (void)state;
    /* No saline, dilute urine (Na+K 40) escaping the clamp: losing it
     * concentrates. Hand-worked: A = -0.03*(40 - 115) = 2.25, B = -0.03,
     * t = 6*40 / (2.25 + 6*0.03) = 240 / 2.43 h. */
    assert_int_equal(ntr_dda_clamp(115.0, 40.0, 0.0, 513.0, 30.0, 40.0, 6.0, &rise, &stop),
                     NTR_OK);
    assert_near(stop, 240.0 / 2.43, 1e-9);
    assert_near(rise, 0.72 * 75.0 / 39.28, 1e-9);
    /* Concentrated urine (300) and no saline: the sodium falls; never +6. */
    assert_int_equal(ntr_dda_clamp(115.0, 40.0, 0.0, 513.0, 30.0, 300.0, 6.0, &rise, &stop),
                     NTR_OK);
    assert_true(rise < 0.0 && stop == NTR_THERAPY_NEVER);
    /* Faster saline: more rise per day, an earlier stop. */
    for (r = 5.0; r <= 100.0; r += 5.0) {
        assert_int_equal(ntr_dda_clamp(115.0, 40.0, r, 513.0, 20.0, 60.0, 6.0, &rise, &stop),
                         NTR_OK);
        assert_true(rise > prev_rise);
        assert_true(stop != NTR_THERAPY_NEVER && stop < prev_stop);
        prev_rise = rise;
        prev_stop = stop;
    }
}

/* The stop hour past the longest plan. The rise d is reachable in principle
 * (A - d*B > 0), but t = d*TBW0 / (A - d*B) lies beyond 720 h, so the
 * header's Doxygen block for ntr_dda_clamp() gives NTR_THERAPY_NEVER
 * ("when A - d*B <= 0 or t > 720 h"); this input reaches that second case.
 * Hand-worked: Na 120, 3% saline (513) at 10 mL/h, no urine, d = 50:
 * A = 0.01*(513 - 120) = 3.93 mmol/h, B = 0.01 L/h, A - d*B = 3.43.
 * TBW 100 L: t = 5000 / 3.43 = 1457.7 h > 720: never. Over 24 h the
 * 2.4 dL of saline add 0.24*393 mmol above Na0 to 100.24 L: a rise of
 * 94.32 / 100.24. TBW 40 L: t = 2000 / 3.43 = 583.1 h, within the plan
 * and returned as it is. */
static void clamp_never_beyond_the_longest_plan(void **state)
{
    double rise = NTR_TEST_SENTINEL, stop = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_dda_clamp(120.0, 100.0, 10.0, 513.0, 0.0, 0.0, 50.0, &rise, &stop),
                     NTR_OK);
    assert_true(stop == NTR_THERAPY_NEVER);
    assert_near(rise, 0.24 * 393.0 / 100.24, 1e-9);
    assert_int_equal(ntr_dda_clamp(120.0, 40.0, 10.0, 513.0, 0.0, 0.0, 50.0, &rise, &stop),
                     NTR_OK);
    assert_near(stop, 2000.0 / 3.43, 1e-9);
    assert_true(stop < 720.0);
}

static int call_clamp(const double *a, double *d, int *i)
{
    (void)i;
    return ntr_dda_clamp(a[0], a[1], a[2], a[3], a[4], a[5], a[6], &d[0], &d[1]);
}

static void clamp_bad_inputs(void **state)
{
    const struct multi m = {call_clamp, 7, {115.0, 40.0, 30.0, 513.0, 30.0, 100.0, 6.0},
                            {80.0, 0.1, 0.0, 0.0, 0.0, 0.0, 0.0},
                            {220.0, 400.0, 5000.0, 1100.0, 5000.0, 500.0, 50.0},
                            {0, 0, 0, 0, 0, 0, 1}};
    double d = NTR_TEST_SENTINEL;
    (void)state;
    walk(&m);
    assert_int_equal(ntr_dda_clamp(115.0, 40.0, 30.0, 513.0, 30.0, 100.0, 6.0, NULL, &d),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_dda_clamp(115.0, 40.0, 30.0, 513.0, 30.0, 100.0, 6.0, &d, NULL),
                     NTR_ERR_NULL);
    /* 5 L/h of 3% into 1 L of water: past 220 within the day. */
    assert_int_equal(ntr_dda_clamp(115.0, 1.0, 5000.0, 1100.0, 0.0, 0.0, 6.0, &d, &d),
                     NTR_ERR_DOMAIN);
    assert_true(d == NTR_TEST_SENTINEL);
}

/* ---- re-lowering ------------------------------------------------------------ */

static void relower_hand_worked(void **state)
{
    double v = NTR_TEST_SENTINEL, rate = NTR_TEST_SENTINEL, na, tbw;
    ntr_flow f[2];
    (void)state;
    /* Hand-worked: Na 131 after a rise 3 over the limit, TBW 35 L, over 6 h
     * with urine 100 mL/h at Na+K 60, margin 1: aim 127;
     * V = (4*35 + 0.6*(127 - 60)) / 127 = 180.2 / 127 L of 5% dextrose. */
    assert_int_equal(ntr_dda_relower(131.0, 35.0, 3.0, 1.0, 6.0, 100.0, 60.0, &v, &rate),
                     NTR_OK);
    assert_near(v, 180.2 / 127.0, 1e-12);
    assert_near(rate, v / 6.0 * 1000.0, 1e-9);
    f[0].volume_l = v;
    f[0].na_mmol_l = 0.0;
    f[0].k_mmol_l = 0.0;
    f[1].volume_l = -0.6;
    f[1].na_mmol_l = 60.0;
    f[1].k_mmol_l = 0.0;
    assert_int_equal(ntr_balance_predict(131.0, 35.0, f, 2, &na, &tbw), NTR_OK);
    assert_near(na, 127.0, 1e-9);
    /* Margin 0 aims at the limit: (3*35 + 0.6*68) / 128. */
    assert_int_equal(ntr_dda_relower(131.0, 35.0, 3.0, 0.0, 6.0, 100.0, 60.0, &v, &rate),
                     NTR_OK);
    assert_near(v, 145.8 / 128.0, 1e-12);
    /* No excess: nothing to give, margin or not. */
    assert_int_equal(ntr_dda_relower(131.0, 35.0, 0.0, 2.0, 6.0, 100.0, 60.0, &v, &rate),
                     NTR_OK);
    assert_true(v == 0.0 && rate == 0.0);
}

static void relower_from_course_report(void **state)
{
    /* An invented course 10 in 24 h over the standard limit by 4: the
     * report's excess feeds the re-lowering, and a larger margin needs more
     * water. */
    const ntr_sample s[] = {{0.0, 118.0}, {12.0, 126.0}, {24.0, 132.0}};
    ntr_course_limits lim;
    ntr_course_report rep;
    double v0, v1, rate;
    (void)state;
    assert_int_equal(ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, &lim), NTR_OK);
    rep.struct_size = sizeof rep;
    assert_int_equal(ntr_course_assess(s, COUNT(s), &lim, &rep), NTR_OK);
    assert_near(rep.excess_mmol_l, 4.0, 1e-12);
    assert_int_equal(ntr_dda_relower(132.0, 30.0, rep.excess_mmol_l, 0.0, 8.0, 50.0, 50.0, &v0,
                                     &rate), NTR_OK);
    assert_int_equal(ntr_dda_relower(132.0, 30.0, rep.excess_mmol_l, 2.0, 8.0, 50.0, 50.0, &v1,
                                     &rate), NTR_OK);
    assert_true(v0 > 0.0 && v1 > v0);
}

static int call_relower(const double *a, double *d, int *i)
{
    (void)i;
    return ntr_dda_relower(a[0], a[1], a[2], a[3], a[4], a[5], a[6], &d[0], &d[1]);
}

static void relower_bad_inputs(void **state)
{
    const struct multi m = {call_relower, 7, {131.0, 35.0, 3.0, 1.0, 6.0, 100.0, 60.0},
                            {80.0, 0.1, 0.0, 0.0, 1.0 / 60.0, 0.0, 0.0},
                            {220.0, 400.0, 50.0, 10.0, 720.0, 5000.0, 500.0}, {0}};
    double d = NTR_TEST_SENTINEL;
    (void)state;
    walk(&m);
    assert_int_equal(ntr_dda_relower(131.0, 35.0, 3.0, 1.0, 6.0, 100.0, 60.0, NULL, &d),
                     NTR_ERR_NULL);
    /* 45 over plus a margin of 10 is more than a 50 mmol/L fall. */
    assert_int_equal(ntr_dda_relower(200.0, 35.0, 45.0, 10.0, 6.0, 100.0, 60.0, &d, &d),
                     NTR_ERR_DOMAIN);
    assert_true(d == NTR_TEST_SENTINEL);
}

/* ---- vaptan monitoring ------------------------------------------------------ */

static void limits_equal(const ntr_course_limits *a, const ntr_course_limits *b)
{
    assert_true(a->struct_size == b->struct_size && a->goal == b->goal);
    assert_true(a->max_rise_24h == b->max_rise_24h && a->max_rise_48h == b->max_rise_48h);
    assert_true(a->max_fall_24h == b->max_fall_24h && a->max_fall_48h == b->max_fall_48h);
    assert_true(a->min_change_24h == b->min_change_24h);
}

static void vaptan_presets(void **state)
{
    ntr_vaptan_watch w;
    ntr_course_limits standard, high;
    (void)state;
    assert_int_equal(ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, &standard), NTR_OK);
    assert_int_equal(ntr_course_limits_preset(NTR_COURSE_HYPO_HIGH_RISK, &high), NTR_OK);
    w.struct_size = sizeof w;
    assert_int_equal(ntr_vaptan_watch_preset(0, 0, &w), NTR_OK);
    assert_true(w.struct_size == sizeof w);
    limits_equal(&w.limits, &standard);
    assert_true(w.cautions == NTR_VAPTAN_NO_RESTRICTION_24H && w.reserved == 0u);
    assert_true(w.horizon_h == 6.0 && w.resample_h == 6.0);
    /* Liver disease: its caution and the high-risk limits (Verbalis 2013
     * lists liver disease among the risk factors for demyelination). */
    assert_int_equal(ntr_vaptan_watch_preset(0, 1, &w), NTR_OK);
    limits_equal(&w.limits, &high);
    assert_true(w.cautions == NTR_VAPTAN_CAUTION_ALL);
    assert_int_equal(ntr_vaptan_watch_preset(1, 0, &w), NTR_OK);
    limits_equal(&w.limits, &high);
    assert_true(w.cautions == (NTR_VAPTAN_NO_RESTRICTION_24H | NTR_VAPTAN_HIGH_RISK_LIMITS));
    /* Shorter than the 24 h the limits are written over. */
    assert_true(w.horizon_h < 24.0);
}

static void vaptan_bad_inputs(void **state)
{
    ntr_vaptan_watch w, before;
    (void)state;
    memset(&w, 0x5a, sizeof w);
    w.struct_size = sizeof w;
    before = w;
    assert_int_equal(ntr_vaptan_watch_preset(0, 0, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_vaptan_watch_preset(2, 0, &w), NTR_ERR_ARG);
    assert_int_equal(ntr_vaptan_watch_preset(0, -1, &w), NTR_ERR_ARG);
    w.struct_size = sizeof w - 1;
    before.struct_size = w.struct_size;
    assert_int_equal(ntr_vaptan_watch_preset(0, 0, &w), NTR_ERR_ARG);
    assert_memory_equal(&w, &before, sizeof w);
}

/* ---- lowering a high sodium -------------------------------------------------- */

static void hyper_lower_hand_worked(void **state)
{
    double rate = NTR_TEST_SENTINEL, v = NTR_TEST_SENTINEL, breach = NTR_TEST_SENTINEL;
    ntr_flow f[3];
    double na, tbw;
    (void)state;
    /* Hand-worked (Adrogue & Madias 2000, counting ongoing losses): Na 160,
     * TBW 40 L, lower by 10 over 24 h with 5% dextrose; urine 50 mL/h at
     * Na+K 40, insensible 40 mL/h. Losses L = 2.16 L with Na+K
     * 1.2*40 / 2.16 = 22.22; V = (400 + 2.16*150 - 48) / 150 = 676/150 L. */
    assert_int_equal(ntr_hyper_lower_plan(160.0, 40.0, NTR_FLUID_DEXTROSE_5,
                                          NTR_COURSE_HYPER_CHRONIC, 10.0, 24.0, 50.0, 40.0,
                                          40.0, &rate, &v, &breach), NTR_OK);
    assert_near(v, 676.0 / 150.0, 1e-12);
    assert_near(rate, v / 24.0 * 1000.0, 1e-9);
    /* 10 in 24 h is at the chronic limit (Adrogue & Madias 2000), not over. */
    assert_true(breach == NTR_PLAN_NO_BREACH);
    f[0].volume_l = v;
    f[0].na_mmol_l = 0.0;
    f[0].k_mmol_l = 0.0;
    f[1].volume_l = -1.2;
    f[1].na_mmol_l = 40.0;
    f[1].k_mmol_l = 0.0;
    f[2].volume_l = -0.96;
    f[2].na_mmol_l = 0.0;
    f[2].k_mmol_l = 0.0;
    assert_int_equal(ntr_balance_predict(160.0, 40.0, f, 3, &na, &tbw), NTR_OK);
    assert_near(na, 150.0, 1e-9);
}

static void hyper_lower_checked_against_limits(void **state)
{
    double rate, v, breach;
    (void)state;
    /* 12 in 24 h passes the chronic limit of 10 about when 10 is reached
     * (the sodium falls almost linearly): between 18 and 24 h. */
    assert_int_equal(ntr_hyper_lower_plan(160.0, 40.0, NTR_FLUID_DEXTROSE_5,
                                          NTR_COURSE_HYPER_CHRONIC, 12.0, 24.0, 50.0, 40.0,
                                          40.0, &rate, &v, &breach), NTR_OK);
    assert_true(breach > 18.0 && breach <= 24.0);
    /* Hours-old hypernatraemia (about 1 mmol/L/h allowed): no breach. */
    assert_int_equal(ntr_hyper_lower_plan(160.0, 40.0, NTR_FLUID_DEXTROSE_5,
                                          NTR_COURSE_HYPER_ACUTE, 12.0, 24.0, 50.0, 40.0, 40.0,
                                          &rate, &v, &breach), NTR_OK);
    assert_true(breach == NTR_PLAN_NO_BREACH);
    /* 0.45% saline (77) needs more volume than 5% dextrose for the same fall. */
    {
        double v_half;
        assert_int_equal(ntr_hyper_lower_plan(160.0, 40.0, NTR_FLUID_NACL_0_45,
                                              NTR_COURSE_HYPER_ACUTE, 12.0, 24.0, 50.0, 40.0,
                                              40.0, &rate, &v_half, &breach), NTR_OK);
        assert_true(v_half > v);
    }
    /* 0.9% saline (154) cannot lower 158 to 150: not a plan. */
    assert_int_equal(ntr_hyper_lower_plan(158.0, 40.0, NTR_FLUID_NACL_0_9,
                                          NTR_COURSE_HYPER_CHRONIC, 8.0, 24.0, 50.0, 40.0, 40.0,
                                          &rate, &v, &breach), NTR_ERR_DOMAIN);
}

/* The header's pooling, bit for bit: the plan's volume and rate are
 * ntr_relower_estimate() with one loss of rate u + i and cation
 * u*c_u/(u + i). With no insensible loss the pooled cation is the urine's
 * own, however small the urine rate (here 1e-9 mL/h of urine at 256
 * mmol/L: the cation it carries still counts, and the rate differs from
 * that of pure water in the last digits); and with both losses. */
static void hyper_lower_pools_the_losses(void **state)
{
    static const double urine[][3] = {{1e-9, 256.0, 0.0}, {5e-10, 128.0, 0.0},
                                      {50.0, 40.0, 40.0}, {0.0, 120.0, 30.0}};
    size_t i;
    (void)state;
    for (i = 0; i < sizeof urine / sizeof urine[0]; i++) {
        const double u = urine[i][0], c = urine[i][1], ins = urine[i][2];
        const double pooled = u + ins > 0.0 ? u * c / (u + ins) : 0.0;
        double rate, v, breach, rate_ref, v_ref, v_water, rate_water;
        assert_int_equal(ntr_hyper_lower_plan(160.0, 40.0, NTR_FLUID_DEXTROSE_5,
                                              NTR_COURSE_HYPER_CHRONIC, 10.0, 24.0, u, c, ins,
                                              &rate, &v, &breach), NTR_OK);
        assert_int_equal(ntr_relower_estimate(160.0, 40.0, 0.0, 0.0, 10.0, 24.0, u + ins,
                                              pooled, 0.0, &v_ref, &rate_ref), NTR_OK);
        assert_true(rate == rate_ref);
        assert_true(v == v_ref);
        if (ins == 0.0 && u > 0.0) {
            assert_int_equal(ntr_relower_estimate(160.0, 40.0, 0.0, 0.0, 10.0, 24.0, u, 0.0,
                                                  0.0, &v_water, &rate_water), NTR_OK);
            assert_true(v != v_water);
        }
    }
}

static void hyper_lower_losses_alone(void **state)
{
    double rate = NTR_TEST_SENTINEL, v = NTR_TEST_SENTINEL, breach = NTR_TEST_SENTINEL;
    (void)state;
    /* Hand-worked: Na 160, TBW 40 L, urine 100 mL/h at Na+K 300 for 24 h:
     * 160 - 2.4*(300 - 160) / 37.6 = 151.06, already a fall of more than 5:
     * no fluid; the fall of 8.9 is within the chronic 10 per day. */
    assert_int_equal(ntr_hyper_lower_plan(160.0, 40.0, NTR_FLUID_DEXTROSE_5,
                                          NTR_COURSE_HYPER_CHRONIC, 5.0, 24.0, 100.0, 300.0,
                                          0.0, &rate, &v, &breach), NTR_OK);
    assert_true(v == 0.0 && rate == 0.0);
    assert_true(breach == NTR_PLAN_NO_BREACH);
    /* At 150 mL/h the same urine alone lowers by 13.9 in 24 h: the check
     * reports the breach of the chronic limit although no fluid is given. */
    assert_int_equal(ntr_hyper_lower_plan(160.0, 40.0, NTR_FLUID_DEXTROSE_5,
                                          NTR_COURSE_HYPER_CHRONIC, 5.0, 24.0, 150.0, 300.0,
                                          0.0, &rate, &v, &breach), NTR_OK);
    assert_true(v == 0.0);
    assert_true(breach > 0.0 && breach < 24.0);
}

/* Found by fuzz-short: urine Na+K at the top of its range (500 mmol/L) with
 * no insensible loss pooled to 500.00000000000006 and was refused as out of
 * range. The pooled value equals the urine's (hand-worked: u*c/u = c), and
 * the call must give the same answer as with the urine given straight to
 * ntr_relower_estimate(). */
static void hyper_lower_urine_at_range_top(void **state)
{
    const double na = 0x1.3d507d507d508p+7, tbw = 0x1.932fb062e396p+6;
    const double fall = 0x1.52eef2eef2eefp+4, hours = 0x1.68438a2167ff4p+4;
    const double urine = 0x1.3881388138814p+4;
    double rate = NTR_TEST_SENTINEL, v = NTR_TEST_SENTINEL, breach = NTR_TEST_SENTINEL;
    double fluid_na, fluid_k, v_direct, rate_direct;
    (void)state;
    assert_int_equal(ntr_fluid_preset(NTR_FLUID_NACL_0_2_DEXTROSE_5, &fluid_na, &fluid_k), NTR_OK);
    assert_int_equal(ntr_relower_estimate(na, tbw, fluid_na, fluid_k, fall, hours, urine,
                                          500.0, 0.0, &v_direct, &rate_direct), NTR_OK);
    assert_int_equal(ntr_hyper_lower_plan(na, tbw, NTR_FLUID_NACL_0_2_DEXTROSE_5, NTR_COURSE_HYPER_ACUTE,
                                          fall, hours, urine, 500.0, 0.0, &rate, &v, &breach),
                     NTR_OK);
    assert_true(v == v_direct && rate == rate_direct);
}

static void hyper_lower_properties(void **state)
{
    double prev = -1.0, rate, v, breach, u, i;
    (void)state;
    /* More dilute urine lost: more fluid needed to lower. */
    for (u = 0.0; u <= 300.0; u += 25.0) {
        assert_int_equal(ntr_hyper_lower_plan(162.0, 35.0, NTR_FLUID_DEXTROSE_5,
                                              NTR_COURSE_HYPER_CHRONIC, 10.0, 24.0, u, 30.0,
                                              40.0, &rate, &v, &breach), NTR_OK);
        assert_true(v > prev);
        prev = v;
    }
    /* More insensible loss: more fluid. */
    prev = -1.0;
    for (i = 0.0; i <= 200.0; i += 20.0) {
        assert_int_equal(ntr_hyper_lower_plan(162.0, 35.0, NTR_FLUID_DEXTROSE_5,
                                              NTR_COURSE_HYPER_CHRONIC, 10.0, 24.0, 50.0, 30.0,
                                              i, &rate, &v, &breach), NTR_OK);
        assert_true(v > prev);
        prev = v;
    }
}

static int hyper_fluid = NTR_FLUID_DEXTROSE_5;
static int hyper_preset = NTR_COURSE_HYPER_CHRONIC;

static int call_hyper(const double *a, double *d, int *i)
{
    (void)i;
    return ntr_hyper_lower_plan(a[0], a[1], hyper_fluid, hyper_preset, a[2], a[3], a[4], a[5],
                                a[6], &d[0], &d[1], &d[2]);
}

static void hyper_lower_bad_inputs(void **state)
{
    const struct multi m = {call_hyper, 7, {160.0, 40.0, 10.0, 24.0, 50.0, 40.0, 40.0},
                            {80.0, 0.1, 0.0, 1.0 / 60.0, 0.0, 0.0, 0.0},
                            {220.0, 400.0, 50.0, 720.0, 5000.0, 500.0, 500.0},
                            {0, 0, 1, 0, 0, 0, 0}};
    const double a[7] = {160.0, 40.0, 10.0, 24.0, 50.0, 40.0, 40.0};
    double d = NTR_TEST_SENTINEL;
    (void)state;
    walk(&m);
    hyper_fluid = 99;
    expect(&m, a, NTR_ERR_ARG);
    hyper_fluid = NTR_FLUID_DEXTROSE_5;
    hyper_preset = NTR_COURSE_HYPO_STANDARD;
    expect(&m, a, NTR_ERR_ARG);
    hyper_preset = NTR_COURSE_HYPER_CHRONIC;
    assert_int_equal(ntr_hyper_lower_plan(160.0, 40.0, 6, 3, 10.0, 24.0, 50.0, 40.0, 40.0, &d,
                                          &d, NULL), NTR_ERR_NULL);
    /* Urine 4800 plus insensible 400 mL/h: more than a flow takes. */
    assert_int_equal(ntr_hyper_lower_plan(160.0, 40.0, 6, 3, 10.0, 24.0, 4800.0, 40.0, 400.0,
                                          &d, &d, &d), NTR_ERR_DOMAIN);
    assert_true(d == NTR_TEST_SENTINEL);
}

/* ---- bolus plan ---------------------------------------------------------------- */

static void bolus_hand_worked(void **state)
{
    int n = NTR_TEST_SENTINEL_INT, held = NTR_TEST_SENTINEL_INT;
    double rise = NTR_TEST_SENTINEL;
    (void)state;
    /* Hand-worked: Na 118, TBW 30 L; k boluses of 0.15 L at 513 raise the
     * sodium by 0.15k*395 / (30 + 0.15k): 1.965, 3.911, 5.837. The aim of
     * +5 (Spasovski 2014, from memory) takes 3. */
    assert_int_equal(ntr_bolus_plan(118.0, 30.0, NTR_BOLUS_AIM_MMOL_L, 10.0, &n, &rise, &held),
                     NTR_OK);
    assert_int_equal(n, 3);
    assert_int_equal(held, 0);
    assert_near(rise, 0.45 * 395.0 / 30.45, 1e-12);
    /* A limit of 5 stops before the third (5.837 > 5): two, held. */
    assert_int_equal(ntr_bolus_plan(118.0, 30.0, 4.5, 5.0, &n, &rise, &held), NTR_OK);
    assert_int_equal(n, 2);
    assert_int_equal(held, 1);
    assert_near(rise, 0.3 * 395.0 / 30.3, 1e-12);
    /* TBW 60 L: 0.15k*395 / (60 + 0.15k) >= 5 first at k = 6. */
    assert_int_equal(ntr_bolus_plan(118.0, 60.0, 5.0, 10.0, &n, &rise, &held), NTR_OK);
    assert_int_equal(n, 6);
}

static void bolus_monotone_in_body_water(void **state)
{
    int prev = 0, n, held;
    double rise, tbw;
    (void)state;
    for (tbw = 10.0; tbw <= 110.0; tbw += 0.5) {
        assert_int_equal(ntr_bolus_plan(120.0, tbw, 5.0, 10.0, &n, &rise, &held), NTR_OK);
        assert_true(n >= prev);
        assert_true(rise <= 10.0 + 1e-6);
        assert_true(held || rise >= 5.0 - 1e-6);
        prev = n;
    }
}

static int call_bolus(const double *a, double *d, int *i)
{
    return ntr_bolus_plan(a[0], a[1], a[2], a[3], &i[0], &d[0], &i[1]);
}

static void bolus_bad_inputs(void **state)
{
    const struct multi m = {call_bolus, 4, {118.0, 30.0, 5.0, 10.0}, {80.0, 0.1, 0.0, 0.0},
                            {220.0, 400.0, 50.0, 50.0}, {0, 0, 1, 1}};
    const double aim_over[4] = {118.0, 30.0, 6.0, 5.0};
    const double far[4] = {118.0, 300.0, 5.0, 10.0};
    const double tiny[4] = {118.0, 1.0, 1.0, 2.0};
    int n = NTR_TEST_SENTINEL_INT;
    double r = NTR_TEST_SENTINEL;
    (void)state;
    walk(&m);
    expect(&m, aim_over, NTR_ERR_DOMAIN);
    expect(&m, far, NTR_ERR_DOMAIN);  /* 10 boluses into 300 L: far from +5 */
    expect(&m, tiny, NTR_ERR_DOMAIN); /* one bolus into 1 L passes +2 */
    assert_int_equal(ntr_bolus_plan(118.0, 30.0, 5.0, 10.0, &n, &r, NULL), NTR_ERR_NULL);
    assert_true(n == NTR_TEST_SENTINEL_INT && r == NTR_TEST_SENTINEL);
}

static void methods_described(void **state)
{
    struct ntr_method_info info;
    int id;
    (void)state;
    for (id = NTR_METHOD_LOOP_DIURETIC; id <= NTR_METHOD_BOLUS_PLAN; id++) {
        assert_int_equal(ntr_method_info(id, &info), NTR_OK);
        assert_int_equal(info.method, id);
    }
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(loop_diuretic_hand_worked),
        cmocka_unit_test(loop_diuretic_equals_balance),
        cmocka_unit_test(loop_diuretic_properties),
        cmocka_unit_test(loop_diuretic_bad_inputs),
        cmocka_unit_test(clamp_hand_worked),
        cmocka_unit_test(clamp_stop_hour_reaches_target),
        cmocka_unit_test(clamp_never_and_properties),
        cmocka_unit_test(clamp_never_beyond_the_longest_plan),
        cmocka_unit_test(clamp_bad_inputs),
        cmocka_unit_test(relower_hand_worked),
        cmocka_unit_test(relower_from_course_report),
        cmocka_unit_test(relower_bad_inputs),
        cmocka_unit_test(vaptan_presets),
        cmocka_unit_test(vaptan_bad_inputs),
        cmocka_unit_test(hyper_lower_hand_worked),
        cmocka_unit_test(hyper_lower_checked_against_limits),
        cmocka_unit_test(hyper_lower_pools_the_losses),
        cmocka_unit_test(hyper_lower_losses_alone),
        cmocka_unit_test(hyper_lower_urine_at_range_top),
        cmocka_unit_test(hyper_lower_properties),
        cmocka_unit_test(hyper_lower_bad_inputs),
        cmocka_unit_test(bolus_hand_worked),
        cmocka_unit_test(bolus_monotone_in_body_water),
        cmocka_unit_test(bolus_bad_inputs),
        cmocka_unit_test(methods_described),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
