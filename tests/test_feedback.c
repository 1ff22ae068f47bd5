/* SPDX-License-Identifier: MIT */
/* Urine feedback and the fitted prediction: ntr_urine_feedback,
 * ntr_urine_interval_flow, ntr_course_fit and ntr_fit_reproject
 * (docs/feedback.md).
 *
 * Patients, plans and urine collections below are invented examples. The
 * synthetic patients are made with ntr_balance_course() from a hidden body
 * water and loss; the external checks are hand-worked from the published
 * electrolyte-free water balance (Shah SR, Bhave G. Front Med 2018;5:103)
 * and the mass balance (Adrogue HJ, Madias NE. N Engl J Med
 * 2000;342:1581-9), each worked beside its check. */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>
#include <cmocka.h>

#include "natremia_test.h"

#define COUNT(a) (sizeof(a) / sizeof((a)[0]))


static ntr_course_limits preset(int p)
{
    ntr_course_limits lim;
    memset(&lim, 0, sizeof lim);
    lim.struct_size = sizeof lim;
    assert_int_equal(ntr_course_limits_preset(p, &lim), NTR_OK);
    return lim;
}

static ntr_urine_feedback_result fresh_feedback(void)
{
    ntr_urine_feedback_result r;
    memset(&r, 0xA5, sizeof r);
    r.struct_size = sizeof r;
    return r;
}

static ntr_fit fresh_fit(void)
{
    ntr_fit f;
    memset(&f, 0xA5, sizeof f);
    f.struct_size = sizeof f;
    return f;
}

static ntr_course_plan_result fresh_plan(void)
{
    ntr_course_plan_result p;
    memset(&p, 0xA5, sizeof p);
    p.struct_size = sizeof p;
    return p;
}

/* ---- urine feedback ------------------------------------------------------------ */

/* Hand-worked (Shah & Bhave's EFW = V*(1 - (U_Na + U_K)/S_Na); mass
 * balance): sodium 120 at 0 h, body water 40 L, no infusion; urine 0-4 h
 * 2000 mL with Na 10 + K 10, osmolality 80 (a water diuresis).
 * EFW out = 2000*(1 - 20/120) = 1666.67 mL; balance -1666.67 mL;
 * body water now 40 - 2 = 38 L; sodium now 120 + 120*1.66667/38 = 125.263.
 * Continued at 500 mL/h: sodium 130 (the standard 10 in 24 h) when
 * 100*V/(40 - V) = 10, V = 400/110 = 3.636 L, at 7.27 h: 3.27 h after now.
 * With a step of 0.25 h the first point over is 7.5 h (3.5 h after now). */
static void feedback_water_diuresis_hand_worked(void **state)
{
    const ntr_sample h[] = {{0.0, 120.0}};
    const ntr_urine_interval u[] = {ntr_test_urine(0.0, 4.0, 2000.0, 10.0, 10.0, 80.0)};
    const ntr_course_limits lim = preset(NTR_COURSE_HYPO_STANDARD);
    ntr_urine_feedback_result r = fresh_feedback();
    (void)state;
    assert_int_equal(ntr_urine_feedback(h, 1, 40.0, NULL, 0, u, 1, 6.0, 0.25, &lim, &r), NTR_OK);
    assert_true(r.struct_size == sizeof r);
    assert_near(r.now_h, 4.0, 1e-12);
    assert_near(r.efw_out_ml, 2000.0 * (1.0 - 20.0 / 120.0), 1e-9);
    assert_near(r.efw_in_ml, 0.0, 0.0);
    assert_near(r.efw_balance_ml, -2000.0 * (1.0 - 20.0 / 120.0), 1e-9);
    assert_near(r.tbw_now_l, 38.0, 1e-12);
    assert_near(r.na_now_mmol_l, 120.0 + 200.0 / 38.0, 1e-9);
    assert_near(r.urine_ml_h, 500.0, 1e-12);
    assert_near(r.urine_efw_ml_h, 500.0 * (1.0 - 20.0 / r.na_now_mmol_l), 1e-9);
    /* Rate form: dNa/dt = Na*EFWC/TBW = 125.263*0.41684/38 = 1.374 mmol/L/h. */
    assert_near(r.na_rate_mmol_l_h,
                        r.na_now_mmol_l * (r.urine_efw_ml_h / 1000.0) / 38.0, 1e-12);
    assert_near(r.breach_h, 3.5, 1e-9);
    assert_true(r.flags == (NTR_FB_LIMIT_AHEAD | NTR_FB_WATER_DIURESIS | NTR_FB_DILUTE_URINE));
    assert_true(r.plan.first_breach_flag == NTR_CF_OVER_24H);
    /* The hand-worked projection at now + 6 h: V = 5 L, 120 + 500/35. */
    assert_near(r.plan.final_na_mmol_l, 120.0 + 500.0 / 35.0, 1e-9);
    assert_true(r.reserved == 0u);

    /* A horizon of 1 h ends before the breach: no alert, still dilute. */
    r = fresh_feedback();
    assert_int_equal(ntr_urine_feedback(h, 1, 40.0, NULL, 0, u, 1, 1.0, 0.25, &lim, &r), NTR_OK);
    assert_true(r.flags == NTR_FB_DILUTE_URINE);
    assert_true(r.breach_h == NTR_PLAN_NO_BREACH);
    /* Hand-worked at 5 h: V = 2.5 L, 120 + 250/37.5 = 126.667. */
    assert_near(r.plan.final_na_mmol_l, 120.0 + 250.0 / 37.5, 1e-9);
}

/* The alert comes before the measured breach: the same patient measured
 * every 4 h would show sodium 130 only at 8 h (hand-worked above: 7.27 h);
 * the feedback at 4 h already raises it. Then an already-passed limit: a
 * collection of 0-8 h at 500 mL/h puts the estimate now at
 * 120 + 400/36 = 131.1, over the limit before now. */
static void feedback_over_now(void **state)
{
    const ntr_sample h[] = {{0.0, 120.0}};
    const ntr_urine_interval u[] = {ntr_test_urine(0.0, 8.0, 4000.0, 10.0, 10.0, 80.0)};
    const ntr_course_limits lim = preset(NTR_COURSE_HYPO_STANDARD);
    ntr_urine_feedback_result r = fresh_feedback();
    (void)state;
    assert_int_equal(ntr_urine_feedback(h, 1, 40.0, NULL, 0, u, 1, 6.0, 0.25, &lim, &r), NTR_OK);
    assert_near(r.na_now_mmol_l, 120.0 + 400.0 / 36.0, 1e-9);
    assert_true((r.flags & NTR_FB_OVER_NOW) != 0u);
    assert_true((r.flags & NTR_FB_WATER_DIURESIS) != 0u);
    assert_near(r.breach_h, 0.0, 0.0);
}

/* Identity (hand-derived from the mass balance): with flows and several
 * intervals, one straddling the last sample (pro rata), the estimate now
 * is Na_L - Na_L*EFW balance/TBW_now, and equals ntr_balance_predict() of
 * the same volumes. History 118 at 0 h, 121 at 3 h; body water 30 L at
 * 3 h; 3% saline 60 mL/h 0-6 h; 5% dextrose 20 mL/h throughout; urine
 * 2-4 h 300 mL (Na 60 K 30), 4-5 h 250 mL (Na 20 K 15). */
static void feedback_efw_identity(void **state)
{
    const ntr_sample h[] = {{10.0, 118.0}, {13.0, 121.0}};
    const ntr_timed_flow f[] = {ntr_test_timed(0.0, 6.0, 60.0, 513.0, 0.0),
                                ntr_test_timed(0.0, 48.0, 20.0, 0.0, 0.0)};
    const ntr_urine_interval u[] = {ntr_test_urine(2.0, 4.0, 300.0, 60.0, 30.0, 500.0),
                                    ntr_test_urine(4.0, 5.0, 250.0, 20.0, 15.0, 180.0)};
    const ntr_course_limits lim = preset(NTR_COURSE_HYPO_STANDARD);
    /* From 3 h to now (5 h): saline 0.12 L, dextrose 0.04 L, urine 0.15 L
     * (half of the first collection) and 0.25 L. */
    const ntr_flow same[] = {{0.120, 513.0, 0.0}, {0.040, 0.0, 0.0},
                             {-0.150, 60.0, 30.0}, {-0.250, 20.0, 15.0}};
    ntr_urine_feedback_result r = fresh_feedback();
    double na_b, tbw_b, in, out;
    (void)state;
    assert_int_equal(ntr_urine_feedback(h, 2, 30.0, f, 2, u, 2, 6.0, 0.5, &lim, &r), NTR_OK);
    assert_near(r.now_h, 5.0, 0.0);
    assert_int_equal(ntr_balance_predict(121.0, 30.0, same, 4, &na_b, &tbw_b), NTR_OK);
    assert_near(r.na_now_mmol_l, na_b, 1e-9);
    assert_near(r.tbw_now_l, tbw_b, 1e-12);
    in = 120.0 * (1.0 - 513.0 / 121.0) + 40.0;
    out = 150.0 * (1.0 - 90.0 / 121.0) + 250.0 * (1.0 - 35.0 / 121.0);
    assert_near(r.efw_in_ml, in, 1e-9);
    assert_near(r.efw_out_ml, out, 1e-9);
    assert_near(r.na_now_mmol_l,
                        121.0 - 121.0 * (r.efw_balance_ml / 1000.0) / r.tbw_now_l, 1e-9);
    /* At now (5 h) both inputs run: their EFW rate relative to Na now. */
    assert_near(r.input_efw_ml_h,
                        60.0 * (1.0 - 513.0 / r.na_now_mmol_l) + 20.0, 1e-9);
    /* Electrolyte-poor urine (35 < Na): it loses free water. */
    assert_true(r.urine_efw_ml_h > 0.0);
    /* Every input running at now counts, however slow: 5% dextrose (no
     * cation) at 1e-9 mL/h alone is an EFW rate of exactly 1e-9 mL/h
     * (EFW = V*(1 - 0/Na)). */
    {
        const ntr_timed_flow slow[] = {ntr_test_timed(0.0, 48.0, 1e-9, 0.0, 0.0)};
        ntr_urine_feedback_result q = fresh_feedback();
        assert_int_equal(ntr_urine_feedback(h, 2, 30.0, slow, 1, u, 2, 6.0, 0.5, &lim, &q),
                         NTR_OK);
        assert_true(q.input_efw_ml_h == 1e-9);
    }
}

/* The re-projection is the plan check of the same plan written on the
 * plan clock (hours after the last sample): the feedback with one interval
 * ending at the last sample equals ntr_course_plan_check() with the flows
 * shifted by hand and the urine continued as one more flow. */
static void feedback_equals_plan_check(void **state)
{
    const ntr_sample h[] = {{0.0, 125.0}, {6.0, 127.0}};
    const ntr_timed_flow f[] = {ntr_test_timed(4.0, 10.0, 100.0, 154.0, 0.0)};
    const ntr_urine_interval u[] = {ntr_test_urine(3.0, 6.0, 600.0, 40.0, 20.0, 250.0)};
    const ntr_timed_flow shifted[] = {ntr_test_timed(0.0, 4.0, 100.0, 154.0, 0.0),
                                      ntr_test_timed(0.0, 8.0, -200.0, 40.0, 20.0)};
    const ntr_course_limits lim = preset(NTR_COURSE_HYPO_HIGH_RISK);
    ntr_urine_feedback_result r = fresh_feedback();
    ntr_course_plan_result p = fresh_plan();
    (void)state;
    assert_int_equal(ntr_urine_feedback(h, 2, 35.0, f, 1, u, 1, 8.0, 0.5, &lim, &r), NTR_OK);
    assert_int_equal(ntr_course_plan_check(h, 2, 35.0, shifted, 2, 8.0, 0.5, &lim, &p), NTR_OK);
    assert_near(r.plan.final_na_mmol_l, p.final_na_mmol_l, 1e-12);
    assert_near(r.plan.final_tbw_l, p.final_tbw_l, 1e-12);
    assert_true(r.plan.points == p.points);
    assert_true(r.plan.first_breach_h == p.first_breach_h);
    assert_true(r.plan.course.flags == p.course.flags);
    assert_near(r.plan.course.max_rise_24h, p.course.max_rise_24h, 1e-12);
}

/* Electrolyte-rich urine lowering sodium in hypernatraemia treatment
 * (hand-worked: sodium 160, body water 30 L, urine 0-2 h 1000 mL with
 * Na 200 + K 60 = 260 > 160: EFW out = 1000*(1 - 260/160) = -625 mL;
 * sodium now 160 + (-1)*(260 - 160)/29 = 156.55), and 5% dextrose
 * 400 mL/h: the fall limit of 10 in 24 h is passed within 6 h. */
static void feedback_salt_loss(void **state)
{
    const ntr_sample h[] = {{0.0, 160.0}};
    const ntr_timed_flow f[] = {ntr_test_timed(0.0, 24.0, 400.0, 0.0, 0.0)};
    const ntr_urine_interval u[] = {ntr_test_urine(0.0, 2.0, 1000.0, 200.0, 60.0, 700.0)};
    const ntr_course_limits lim = preset(NTR_COURSE_HYPER_CHRONIC);
    ntr_urine_feedback_result r = fresh_feedback();
    const ntr_flow same[] = {{0.8, 0.0, 0.0}, {-1.0, 200.0, 60.0}};
    double na_b, tbw_b;
    (void)state;
    assert_int_equal(ntr_urine_feedback(h, 1, 30.0, f, 1, u, 1, 6.0, 0.25, &lim, &r), NTR_OK);
    assert_near(r.efw_out_ml, -625.0, 1e-9);
    assert_int_equal(ntr_balance_predict(160.0, 30.0, same, 2, &na_b, &tbw_b), NTR_OK);
    assert_near(r.na_now_mmol_l, na_b, 1e-9);
    assert_true(r.urine_efw_ml_h < 0.0);
    assert_true((r.flags & NTR_FB_LIMIT_AHEAD) != 0u);
    assert_true((r.flags & NTR_FB_SALT_LOSS) != 0u);
    assert_true((r.flags & (NTR_FB_WATER_DIURESIS | NTR_FB_DILUTE_URINE)) == 0u);
    assert_true(r.plan.first_breach_direction == NTR_PLAN_BREACH_FALL);
}

/* Property: more urine (the same composition) never lowers the projected
 * sodium or delays the alert, for a water diuresis. */
static void feedback_monotonic_in_urine(void **state)
{
    const ntr_sample h[] = {{0.0, 122.0}};
    const ntr_course_limits lim = preset(NTR_COURSE_HYPO_STANDARD);
    double last_na = 0.0, last_breach = 1e9;
    double ml;
    (void)state;
    for (ml = 0.0; ml <= 3000.0; ml += 100.0) {
        const ntr_urine_interval u[] = {ntr_test_urine(0.0, 3.0, ml, 25.0, 15.0, 120.0)};
        ntr_urine_feedback_result r = fresh_feedback();
        assert_int_equal(ntr_urine_feedback(h, 1, 36.0, NULL, 0, u, 1, 6.0, 0.25, &lim, &r), NTR_OK);
        assert_true(r.plan.final_na_mmol_l >= last_na);
        last_na = r.plan.final_na_mmol_l;
        if (r.breach_h != NTR_PLAN_NO_BREACH) {
            assert_true(r.breach_h <= last_breach);
            last_breach = r.breach_h;
        } else {
            assert_true(last_breach == 1e9);
        }
    }
    assert_true(last_breach < 1e9); /* the largest diuresis does breach */
}

static void feedback_bad_inputs(void **state)
{
    const ntr_sample h[] = {{0.0, 120.0}, {2.0, 121.0}};
    const ntr_timed_flow f[] = {ntr_test_timed(0.0, 4.0, 100.0, 513.0, 0.0)};
    ntr_urine_interval u[] = {ntr_test_urine(0.0, 2.0, 300.0, 20.0, 10.0, 150.0),
                              ntr_test_urine(2.0, 3.0, 200.0, 20.0, 10.0, 150.0)};
    ntr_course_limits lim = preset(NTR_COURSE_HYPO_STANDARD);
    ntr_urine_feedback_result r = fresh_feedback(), before;
    ntr_sample bad_h[2];
    ntr_timed_flow bad_f[1];
    (void)state;
    before = r;
#define FB_EXPECT(st, H, NH, TBW, F, NF, U, NU, HOR, STEP, LIM, OUT)                     \
    do {                                                                                   \
        r = before;                                                                        \
        assert_int_equal(ntr_urine_feedback(H, NH, TBW, F, NF, U, NU, HOR, STEP, LIM, OUT), \
                         st);                                                              \
        assert_memory_equal(&r, &before, sizeof r);                                        \
    } while (0)
    FB_EXPECT(NTR_ERR_NULL, NULL, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    FB_EXPECT(NTR_ERR_NULL, h, 2, 35.0, NULL, 1, u, 2, 6.0, 0.5, &lim, &r);
    FB_EXPECT(NTR_ERR_NULL, h, 2, 35.0, f, 1, NULL, 2, 6.0, 0.5, &lim, &r);
    FB_EXPECT(NTR_ERR_NULL, h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, NULL, &r);
    assert_int_equal(ntr_urine_feedback(h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, NULL),
                     NTR_ERR_NULL);
    FB_EXPECT(NTR_ERR_ARG, h, 0, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    FB_EXPECT(NTR_ERR_ARG, h, 2, 35.0, f, 1, u, 0, 6.0, 0.5, &lim, &r);
    before.struct_size = sizeof r - 1;
    FB_EXPECT(NTR_ERR_ARG, h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    before.struct_size = sizeof r;
    lim.goal = 99;
    FB_EXPECT(NTR_ERR_ARG, h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    lim = preset(NTR_COURSE_HYPO_STANDARD);
    u[1].reserved_d[1] = 1.0;
    FB_EXPECT(NTR_ERR_ARG, h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    u[1].reserved_d[1] = 0.0;
    u[0].reserved[0] = 1u;
    FB_EXPECT(NTR_ERR_ARG, h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    u[0].reserved[0] = 0u;
    memcpy(bad_h, h, sizeof h);
    bad_h[1].na_mmol_l = NAN;
    FB_EXPECT(NTR_ERR_NONFINITE, bad_h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    FB_EXPECT(NTR_ERR_RANGE, h, 2, 0.05, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    FB_EXPECT(NTR_ERR_NONFINITE, h, 2, INFINITY, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    memcpy(bad_f, f, sizeof f);
    bad_f[0].rate_ml_h = 6000.0;
    FB_EXPECT(NTR_ERR_RANGE, h, 2, 35.0, bad_f, 1, u, 2, 6.0, 0.5, &lim, &r);
    u[1].osm_mosm_kg = 5.0;
    FB_EXPECT(NTR_ERR_RANGE, h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    u[1].osm_mosm_kg = NAN;
    FB_EXPECT(NTR_ERR_NONFINITE, h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    u[1].osm_mosm_kg = 150.0;
    u[1].volume_ml = -1.0;
    FB_EXPECT(NTR_ERR_RANGE, h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    u[1].volume_ml = 200.0;
    FB_EXPECT(NTR_ERR_RANGE, h, 2, 35.0, f, 1, u, 2, 0.0, 0.5, &lim, &r);
    FB_EXPECT(NTR_ERR_RANGE, h, 2, 35.0, f, 1, u, 2, 6.0, 0.001, &lim, &r);
    lim.max_rise_24h = NAN;
    FB_EXPECT(NTR_ERR_NONFINITE, h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    lim = preset(NTR_COURSE_HYPO_STANDARD);
    /* Order: history, flow, intervals overlapping or under a minute. */
    bad_h[0] = h[1];
    bad_h[1] = h[0];
    FB_EXPECT(NTR_ERR_ORDER, bad_h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    bad_f[0] = ntr_test_timed(4.0, 3.0, 100.0, 513.0, 0.0);
    FB_EXPECT(NTR_ERR_ORDER, h, 2, 35.0, bad_f, 1, u, 2, 6.0, 0.5, &lim, &r);
    u[1].start_h = 1.5;
    FB_EXPECT(NTR_ERR_ORDER, h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    u[1].start_h = 2.0;
    u[1].end_h = 2.0 + 1.0 / 120.0;
    FB_EXPECT(NTR_ERR_ORDER, h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    /* Domain: a rate above 5000 mL/h; the horizon past 720 h; a model
     * point out of range (a huge diuresis in a small body). */
    u[1].end_h = 3.0;
    u[1].volume_ml = 6000.0;
    FB_EXPECT(NTR_ERR_DOMAIN, h, 2, 35.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
    u[1].volume_ml = 200.0;
    FB_EXPECT(NTR_ERR_DOMAIN, h, 2, 35.0, f, 1, u, 2, 719.0, 1.0, &lim, &r);
    u[1].volume_ml = 4000.0;
    FB_EXPECT(NTR_ERR_DOMAIN, h, 2, 5.0, f, 1, u, 2, 6.0, 0.5, &lim, &r);
#undef FB_EXPECT
}

static void interval_flow(void **state)
{
    ntr_urine_interval u = ntr_test_urine(2.0, 6.0, 1000.0, 40.0, 20.0, 300.0);
    ntr_timed_flow f, before;
    (void)state;
    assert_int_equal(ntr_urine_interval_flow(&u, &f), NTR_OK);
    /* Hand-worked: 1000 mL over 4 h is a loss of 250 mL/h. */
    assert_near(f.rate_ml_h, -250.0, 0.0);
    assert_near(f.start_h, 2.0, 0.0);
    assert_near(f.end_h, 6.0, 0.0);
    assert_near(f.na_mmol_l, 40.0, 0.0);
    assert_near(f.k_mmol_l, 20.0, 0.0);
    assert_true(f.reserved[0] == 0u && f.reserved[1] == 0u);
    memset(&before, 0x5A, sizeof before);
    f = before;
    assert_int_equal(ntr_urine_interval_flow(NULL, &f), NTR_ERR_NULL);
    assert_int_equal(ntr_urine_interval_flow(&u, NULL), NTR_ERR_NULL);
    u.reserved[1] = 3u;
    assert_int_equal(ntr_urine_interval_flow(&u, &f), NTR_ERR_ARG);
    u.reserved[1] = 0u;
    u.na_mmol_l = 501.0;
    assert_int_equal(ntr_urine_interval_flow(&u, &f), NTR_ERR_RANGE);
    u.na_mmol_l = 40.0;
    u.end_h = 2.0;
    assert_int_equal(ntr_urine_interval_flow(&u, &f), NTR_ERR_ORDER);
    u.end_h = 2.1;
    assert_int_equal(ntr_urine_interval_flow(&u, &f), NTR_ERR_DOMAIN);
    assert_memory_equal(&f, &before, sizeof f);
    /* The rate limit itself is accepted: 5000 mL over exactly 1 h is a
     * loss of 5000 mL/h, the largest timed-flow rate the header allows;
     * one more millilitre is over it. */
    u = ntr_test_urine(2.0, 3.0, 5000.0, 40.0, 20.0, 300.0);
    assert_int_equal(ntr_urine_interval_flow(&u, &f), NTR_OK);
    assert_near(f.rate_ml_h, -5000.0, 0.0);
    f = before;
    u.volume_ml = 5001.0;
    assert_int_equal(ntr_urine_interval_flow(&u, &f), NTR_ERR_DOMAIN);
    assert_memory_equal(&f, &before, sizeof f);
}

/* ---- the fit: synthetic patients -------------------------------------------------- */

/* A fixed-seed generator (xorshift64, Marsaglia 2003) and Box-Muller
 * normal deviates: the noisy series are the same on every run. */
struct rng {
    uint64_t s;
};

static double rng_uniform(struct rng *g)
{
    g->s ^= g->s << 13;
    g->s ^= g->s >> 7;
    g->s ^= g->s << 17;
    return ((double)(g->s >> 11) + 0.5) / 9007199254740992.0;
}

static double rng_normal(struct rng *g)
{
    const double a = rng_uniform(g);
    const double b = rng_uniform(g);
    return sqrt(-2.0 * log(a)) * cos(6.283185307179586 * b);
}

/* A hidden patient: sodium na0, body water tbw, free-water loss loss_ml_h,
 * under the known flows; measured every step hours to 24 h. */
static size_t synthetic(double na0, double tbw, double loss_ml_h,
                        const ntr_timed_flow *known, size_t n_known, double step,
                        ntr_sample *out, size_t capacity)
{
    ntr_timed_flow all[8];
    size_t count;
    assert_true(n_known < COUNT(all));
    if (n_known > 0) {
        memcpy(all, known, n_known * sizeof *known);
    }
    all[n_known] = ntr_test_timed(0.0, 720.0, -loss_ml_h, 0.0, 0.0);
    assert_int_equal(ntr_balance_course(na0, tbw, all, n_known + 1, 24.0, step, out,
                                        capacity, &count), NTR_OK);
    return count;
}

/* Design A: 3% saline 250 mL/h over the first 2 h, then nothing known;
 * sodium every 2 h. Design B: two 150 mL boluses of 3% saline (0-1 h and
 * 6-7 h) with 0.9% saline at 80 mL/h throughout. */
static const ntr_timed_flow design_a[] = {{0.0, 2.0, 250.0, 513.0, 0.0, {0u, 0u}}};
static const ntr_timed_flow design_b[] = {{0.0, 1.0, 150.0, 513.0, 0.0, {0u, 0u}},
                                          {6.0, 7.0, 150.0, 513.0, 0.0, {0u, 0u}},
                                          {0.0, 24.0, 80.0, 154.0, 0.0, {0u, 0u}}};

/* Exact data: the fit returns the hidden values (tolerance 1e-6 relative
 * for body water, 1e-4 mL/h for the loss), with a zero residual. Truth
 * from the library's own forward model: a recovery check, not an external
 * one. */
static void fit_recovers_exact_truth(void **state)
{
    static const struct {
        double na0, tbw, loss, guess;
        int design;
    } cases[] = {
        {120.0, 35.0, 120.0, 40.0, 0}, {120.0, 35.0, 120.0, 25.0, 0},
        {112.0, 28.0, 60.0, 40.0, 0},  {125.0, 45.0, -50.0, 40.0, 0},
        {118.0, 35.0, 120.0, 40.0, 1}, {128.0, 22.0, 200.0, 30.0, 1},
        {120.0, 50.0, 0.0, 40.0, 1},
    };
    size_t i;
    (void)state;
    for (i = 0; i < COUNT(cases); i++) {
        const ntr_timed_flow *known = cases[i].design == 0 ? design_a : design_b;
        const size_t nk = cases[i].design == 0 ? COUNT(design_a) : COUNT(design_b);
        ntr_sample h[32];
        const size_t n = synthetic(cases[i].na0, cases[i].tbw, cases[i].loss, known, nk,
                                   2.0, h, COUNT(h));
        ntr_fit f = fresh_fit();
        assert_int_equal(ntr_course_fit(h, n, cases[i].guess, known, nk, &f), NTR_OK);
        assert_true(f.struct_size == sizeof f);
        assert_near(f.tbw_l, cases[i].tbw, 1e-6 * cases[i].tbw);
        assert_near(f.free_water_loss_ml_h, cases[i].loss, 1e-4);
        assert_near(f.na0_mmol_l, cases[i].na0, 1e-6);
        assert_true(f.rms_residual_mmol_l < 1e-6);
        assert_true(f.flags == 0u);
        assert_true(f.iterations > 0u && f.iterations <= 2u * 100u);
        assert_true(f.correlation > -0.999 && f.correlation < 0.999);
        assert_near(f.na_last_fit_mmol_l, h[n - 1].na_mmol_l, 1e-6);
        /* Body water at 24 h: the hidden one carried through the flows. */
        {
            ntr_timed_flow all[4];
            ntr_sample s[2];
            size_t c;
            double na_end, tbw_end;
            ntr_plan_result unused;
            (void)s;
            (void)c;
            (void)unused;
            memcpy(all, known, nk * sizeof *known);
            all[nk] = ntr_test_timed(0.0, 720.0, -cases[i].loss, 0.0, 0.0);
            {
                const ntr_sample one[] = {{0.0, cases[i].na0}};
                ntr_course_plan_result p = fresh_plan();
                ntr_course_limits lim = preset(NTR_COURSE_HYPO_STANDARD);
                lim.max_rise_24h = 0.0;
                lim.max_rise_48h = 0.0;
                lim.min_change_24h = 0.0;
                assert_int_equal(ntr_course_plan_check(one, 1, cases[i].tbw, all, nk + 1,
                                                       24.0, 24.0, &lim, &p), NTR_OK);
                na_end = p.final_na_mmol_l;
                tbw_end = p.final_tbw_l;
            }
            assert_near(f.tbw_last_l, tbw_end, 1e-5);
            assert_near(na_end, h[n - 1].na_mmol_l, 1e-9);
        }
    }
}

/* Three samples: as many as parameters. Too few: NTR_ERR_ARG. */
static void fit_three_samples_exact(void **state)
{
    ntr_sample all[32], h[3];
    ntr_fit f = fresh_fit(), before = fresh_fit();
    size_t n = synthetic(120.0, 35.0, 120.0, design_a, 1, 2.0, all, COUNT(all));
    (void)state;
    (void)n;
    h[0] = all[0];
    h[1] = all[1];
    h[2] = all[6];
    assert_int_equal(ntr_course_fit(h, 3, 40.0, design_a, 1, &f), NTR_OK);
    assert_true((f.flags & NTR_FIT_EXACT) != 0u);
    assert_near(f.tbw_l, 35.0, 1e-5);
    assert_near(f.free_water_loss_ml_h, 120.0, 1e-3);
    assert_near(f.tbw_se_l, 0.0, 0.0);
    f = before;
    assert_int_equal(ntr_course_fit(h, 2, 40.0, design_a, 1, &f), NTR_ERR_ARG);
    assert_memory_equal(&f, &before, sizeof f);
}

/* Analytical noise, SD 1 mmol/L (common practice for a laboratory sodium),
 * 200 series of design A from the fixed seed, hidden body water 35 L and
 * loss 120 mL/h, guess 40 L. Stated tolerances (measured values in
 * docs/feedback.md): body water within 25% in half the series and within
 * 50% in 90%; the loss within 30 mL/h in half and 75 mL/h in 90%; the
 * re-projected 12 h rise after the last sample within 0.6 mmol/L in half
 * and 1.5 in 90%, where the plan as planned (guess, no loss) misses it by
 * more than 3 mmol/L in every series. No series is refused. */
static int by_magnitude(const void *a, const void *b)
{
    const double x = fabs(*(const double *)a), y = fabs(*(const double *)b);
    return (x > y) - (x < y);
}

static void fit_recovers_truth_under_noise(void **state)
{
    enum { REPS = 200 };
    static double err_tbw[REPS], err_loss[REPS], err_proj[REPS];
    struct rng g = {0x9E3779B97F4A7C15ull};
    ntr_sample truth[32], ahead[4];
    const ntr_course_limits lim = preset(NTR_COURSE_HYPO_STANDARD);
    ntr_timed_flow all[2];
    size_t n = synthetic(120.0, 35.0, 120.0, design_a, 1, 2.0, truth, COUNT(truth));
    size_t c, r, k;
    double true_rise;
    (void)state;
    /* The true rise from 24 h to 36 h. */
    all[0] = design_a[0];
    all[1] = ntr_test_timed(0.0, 720.0, -120.0, 0.0, 0.0);
    assert_int_equal(ntr_balance_course(120.0, 35.0, all, 2, 36.0, 12.0, ahead, 4, &c), NTR_OK);
    true_rise = ahead[c - 1].na_mmol_l - ahead[c - 2].na_mmol_l;
    for (r = 0; r < REPS; r++) {
        ntr_sample h[32];
        ntr_fit f = fresh_fit(), planned = fresh_fit();
        ntr_course_plan_result p = fresh_plan(), q = fresh_plan();
        for (k = 0; k < n; k++) {
            h[k] = truth[k];
            h[k].na_mmol_l += rng_normal(&g);
        }
        assert_int_equal(ntr_course_fit(h, n, 40.0, design_a, 1, &f), NTR_OK);
        assert_int_equal(ntr_fit_reproject(h, n, &f, design_a, 1, 12.0, 1.0, &lim, &p), NTR_OK);
        planned.tbw_l = 40.0;
        planned.free_water_loss_ml_h = 0.0;
        assert_int_equal(ntr_fit_reproject(h, n, &planned, design_a, 1, 12.0, 1.0, &lim, &q),
                         NTR_OK);
        err_tbw[r] = f.tbw_l / 35.0 - 1.0;
        err_loss[r] = f.free_water_loss_ml_h - 120.0;
        err_proj[r] = (p.final_na_mmol_l - h[n - 1].na_mmol_l) - true_rise;
        assert_true(fabs((q.final_na_mmol_l - h[n - 1].na_mmol_l) - true_rise) > 3.0);
        assert_true(f.rms_residual_mmol_l > 0.2 && f.rms_residual_mmol_l < 2.0);
    }
    qsort(err_tbw, REPS, sizeof(double), by_magnitude);
    qsort(err_loss, REPS, sizeof(double), by_magnitude);
    qsort(err_proj, REPS, sizeof(double), by_magnitude);
    print_message("noise SD 1: |tbw err| p50 %.3f p90 %.3f; |loss err| p50 %.1f p90 %.1f mL/h; "
                  "|12 h projection err| p50 %.2f p90 %.2f mmol/L\n",
                  fabs(err_tbw[REPS / 2]), fabs(err_tbw[REPS * 9 / 10]),
                  fabs(err_loss[REPS / 2]), fabs(err_loss[REPS * 9 / 10]),
                  fabs(err_proj[REPS / 2]), fabs(err_proj[REPS * 9 / 10]));
    assert_true(fabs(err_tbw[REPS / 2]) < 0.25);
    assert_true(fabs(err_tbw[REPS * 9 / 10]) < 0.50);
    assert_true(fabs(err_loss[REPS / 2]) < 30.0);
    assert_true(fabs(err_loss[REPS * 9 / 10]) < 75.0);
    assert_true(fabs(err_proj[REPS / 2]) < 0.6);
    assert_true(fabs(err_proj[REPS * 9 / 10]) < 1.5);
}

/* The model of the header for design A, written out here: by t h the
 * 3% saline (250 mL/h, 513 mmol/L, 0-2 h) has given V = 0.25*min(t, 2) L
 * with S = 513*V mmol, so Na(t) = (Na0*W + S) / (W + V - L*t/1000). The
 * row holds its derivatives by Na0, W and L (by hand from the quotient). */
static double design_a_model(double na0, double w, double loss, double t, double row[3])
{
    const double v = 0.25 * (t < 2.0 ? t : 2.0);
    const double num = na0 * w + 513.0 * v;
    const double den = w + v - loss * t / 1000.0;
    row[0] = w / den;
    row[1] = na0 / den - num / (den * den);
    row[2] = num * (t / 1000.0) / (den * den);
    return num / den;
}

/* Inverse of a symmetric positive definite 3x3 matrix by Gauss-Jordan
 * elimination with partial pivoting (a different route from the
 * library's cofactors). */
static void invert3(double a[3][3], double inv[3][3])
{
    double m[3][6];
    int i, j, k;
    for (i = 0; i < 3; i++) {
        for (j = 0; j < 3; j++) {
            m[i][j] = a[i][j];
            m[i][j + 3] = i == j ? 1.0 : 0.0;
        }
    }
    for (k = 0; k < 3; k++) {
        int piv = k;
        for (i = k + 1; i < 3; i++) {
            if (fabs(m[i][k]) > fabs(m[piv][k])) {
                piv = i;
            }
        }
        for (j = 0; j < 6; j++) {
            const double tmp = m[k][j];
            m[k][j] = m[piv][j];
            m[piv][j] = tmp;
        }
        for (j = 5; j >= k; j--) {
            m[k][j] /= m[k][k];
        }
        for (i = 0; i < 3; i++) {
            if (i != k) {
                const double f = m[i][k];
                for (j = k; j < 6; j++) {
                    m[i][j] -= f * m[k][j];
                }
            }
        }
    }
    for (i = 0; i < 3; i++) {
        for (j = 0; j < 3; j++) {
            inv[i][j] = m[i][j + 3];
        }
    }
}

/* The standard errors and the correlation are the header's equations:
 * s*sqrt(diag((J'J)^-1)) with s^2 = SSR/(n - 3), and the correlation of
 * W and L from (J'J)^-1 (the usual least-squares covariance, e.g. Bates
 * and Watts, Nonlinear Regression Analysis, 1988, ch. 2). Checked on noisy
 * series of design A against J computed here from the model by hand and
 * inverted by another method, at the fitted point the library reports.
 * That point is the least-squares minimum: the gradient J'r, scaled by
 * the column and residual norms, is zero to 1e-6 (Levenberg 1944 and
 * Marquardt 1963 stop there). The rms residual is the one of the
 * reported parameters. */
static void fit_standard_errors_by_the_equation(void **state)
{
    struct rng g = {0x2545F4914F6CDD1Dull};
    ntr_sample truth[32];
    const size_t n = synthetic(120.0, 35.0, 120.0, design_a, 1, 2.0, truth, COUNT(truth));
    int rep;
    (void)state;
    for (rep = 0; rep < 8; rep++) {
        ntr_sample h[32];
        ntr_fit f = fresh_fit();
        double a[3][3] = {{0.0}}, inv[3][3], jr[3] = {0.0}, col[3] = {0.0};
        double ssr = 0.0, s2, corr;
        size_t k;
        int i, j;
        for (k = 0; k < n; k++) {
            h[k] = truth[k];
            h[k].na_mmol_l += 0.5 * rng_normal(&g);
        }
        assert_int_equal(ntr_course_fit(h, n, 40.0, design_a, 1, &f), NTR_OK);
        assert_true((f.flags & (NTR_FIT_NOT_CONVERGED | NTR_FIT_TBW_AT_BOUND |
                                NTR_FIT_LOSS_AT_BOUND)) == 0u);
        for (k = 0; k < n; k++) {
            double row[3];
            const double r = h[k].na_mmol_l -
                             design_a_model(f.na0_mmol_l, f.tbw_l, f.free_water_loss_ml_h,
                                            h[k].hours - h[0].hours, row);
            ssr += r * r;
            for (i = 0; i < 3; i++) {
                jr[i] += row[i] * r;
                col[i] += row[i] * row[i];
                for (j = 0; j < 3; j++) {
                    a[i][j] += row[i] * row[j];
                }
            }
        }
        for (i = 0; i < 3; i++) {
            assert_true(fabs(jr[i]) <= 1e-6 * sqrt(col[i] * ssr));
        }
        invert3(a, inv);
        s2 = ssr / (double)(n - 3);
        corr = inv[1][2] / sqrt(inv[1][1] * inv[2][2]);
        assert_near(f.rms_residual_mmol_l, sqrt(ssr / (double)n), 1e-9);
        assert_near(f.tbw_se_l, sqrt(s2 * inv[1][1]), 1e-6 * f.tbw_se_l);
        assert_near(f.free_water_loss_se_ml_h, sqrt(s2 * inv[2][2]),
                    1e-6 * f.free_water_loss_se_ml_h);
        assert_near(f.correlation, corr, 1e-6);
        assert_true(f.tbw_se_l > 0.0 && f.free_water_loss_se_ml_h > 0.0);
    }
}

/* The data cannot separate the two: no flows at all (the series fixes only
 * L/W), one steady infusion from the first sample (to first order a
 * smaller W and a larger loss give the same course), and nothing moving.
 * Each gives NTR_ERR_DOMAIN with the output untouched. */
static void fit_refuses_inseparable_data(void **state)
{
    const ntr_timed_flow steady[] = {{0.0, 24.0, 40.0, 513.0, 0.0, {0u, 0u}}};
    ntr_sample h[32];
    ntr_fit f = fresh_fit(), before = fresh_fit();
    size_t n;
    (void)state;
    n = synthetic(120.0, 35.0, 120.0, NULL, 0, 2.0, h, COUNT(h));
    assert_int_equal(ntr_course_fit(h, n, 40.0, NULL, 0, &f), NTR_ERR_DOMAIN);
    assert_memory_equal(&f, &before, sizeof f);
    n = synthetic(120.0, 35.0, 120.0, steady, 1, 2.0, h, COUNT(h));
    assert_int_equal(ntr_course_fit(h, n, 40.0, steady, 1, &f), NTR_ERR_DOMAIN);
    assert_memory_equal(&f, &before, sizeof f);
    n = synthetic(120.0, 35.0, 0.0, NULL, 0, 2.0, h, COUNT(h));
    assert_int_equal(ntr_course_fit(h, n, 40.0, NULL, 0, &f), NTR_ERR_DOMAIN);
    assert_memory_equal(&f, &before, sizeof f);
}

/* The model is wrong: urine output steps from 100 to 250 mL/h at 12 h
 * (with 40 mL/h insensible loss; design A's bolus). The fit of one
 * constant loss, not told about the urine, ends between the two regimes
 * with a body water pushed up (measured: 58.5 L for 35, loss 323 mL/h for
 * 140 then 290) and a residual near 1 mmol/L on exact data, which the
 * noise of a real series would hide; NTR_FIT_DRIFT stays clear here (mean
 * of the last three residuals 0.76). Given the measured urine as flows
 * (ntr_urine_interval_flow), the fit recovers the hidden 35 L and 40 mL/h
 * exactly. A late and large step (600 mL/h from 18 h) does set
 * NTR_FIT_DRIFT. */
static void fit_when_the_model_is_wrong(void **state)
{
    const ntr_urine_interval u[] = {ntr_test_urine(0.0, 12.0, 1200.0, 30.0, 10.0, 400.0),
                                    ntr_test_urine(12.0, 24.0, 3000.0, 15.0, 5.0, 150.0)};
    ntr_timed_flow known[3], all[4];
    ntr_sample h[32];
    ntr_fit f = fresh_fit();
    size_t n, c;
    (void)state;
    known[0] = design_a[0];
    assert_int_equal(ntr_urine_interval_flow(&u[0], &known[1]), NTR_OK);
    assert_int_equal(ntr_urine_interval_flow(&u[1], &known[2]), NTR_OK);
    memcpy(all, known, sizeof known);
    all[3] = ntr_test_timed(0.0, 720.0, -40.0, 0.0, 0.0);
    assert_int_equal(ntr_balance_course(120.0, 35.0, all, 4, 24.0, 2.0, h, COUNT(h), &n), NTR_OK);

    assert_int_equal(ntr_course_fit(h, n, 40.0, design_a, 1, &f), NTR_OK);
    print_message("step, urine not given: tbw %.2f loss %.1f rms %.3f late %.3f flags 0x%x\n",
                  f.tbw_l, f.free_water_loss_ml_h, f.rms_residual_mmol_l,
                  f.late_residual_mmol_l, f.flags);
    assert_true(f.free_water_loss_ml_h > 140.0);
    assert_true(f.tbw_l > 45.0);
    assert_true(f.rms_residual_mmol_l > 0.5 && f.rms_residual_mmol_l < 1.5);
    assert_true((f.flags & NTR_FIT_DRIFT) == 0u);

    f = fresh_fit();
    assert_int_equal(ntr_course_fit(h, n, 40.0, known, 3, &f), NTR_OK);
    assert_near(f.tbw_l, 35.0, 1e-6 * 35.0);
    assert_near(f.free_water_loss_ml_h, 40.0, 1e-4);

    /* A late, large step. */
    all[1] = ntr_test_timed(0.0, 18.0, -100.0, 30.0, 10.0);
    all[2] = ntr_test_timed(18.0, 720.0, -600.0, 15.0, 5.0);
    assert_int_equal(ntr_balance_course(120.0, 35.0, all, 4, 24.0, 2.0, h, COUNT(h), &c), NTR_OK);
    f = fresh_fit();
    assert_int_equal(ntr_course_fit(h, c, 40.0, design_a, 1, &f), NTR_OK);
    print_message("late step, urine not given: tbw %.2f loss %.1f rms %.3f late %.3f flags 0x%x\n",
                  f.tbw_l, f.free_water_loss_ml_h, f.rms_residual_mmol_l,
                  f.late_residual_mmol_l, f.flags);
    assert_true((f.flags & NTR_FIT_DRIFT) != 0u);
    assert_true(f.late_residual_mmol_l > 1.5);
}

/* Properties: the fit does not depend on the clock's origin; a larger
 * hidden loss gives a larger fitted loss; the residual never drops below
 * 0 and grows with the noise. */
static void fit_properties(void **state)
{
    ntr_sample h[32], moved[32];
    ntr_fit a = fresh_fit(), b = fresh_fit();
    double loss, last = -1e9;
    size_t n, k;
    (void)state;
    n = synthetic(121.0, 33.0, 90.0, design_b, COUNT(design_b), 2.0, h, COUNT(h));
    for (k = 0; k < n; k++) {
        moved[k] = h[k];
        moved[k].hours += 5000.0;
    }
    assert_int_equal(ntr_course_fit(h, n, 40.0, design_b, COUNT(design_b), &a), NTR_OK);
    assert_int_equal(ntr_course_fit(moved, n, 40.0, design_b, COUNT(design_b), &b), NTR_OK);
    assert_near(a.tbw_l, b.tbw_l, 1e-9 * a.tbw_l);
    assert_near(a.free_water_loss_ml_h, b.free_water_loss_ml_h, 1e-6);
    for (loss = -200.0; loss <= 400.0; loss += 50.0) {
        ntr_fit f = fresh_fit();
        n = synthetic(121.0, 33.0, loss, design_a, 1, 2.0, h, COUNT(h));
        assert_int_equal(ntr_course_fit(h, n, 40.0, design_a, 1, &f), NTR_OK);
        assert_true(f.free_water_loss_ml_h > last);
        last = f.free_water_loss_ml_h;
        assert_true(f.rms_residual_mmol_l >= 0.0);
    }
    /* A noisier copy has the larger residual. */
    {
        struct rng g = {12345u};
        ntr_sample small[32], large[32];
        ntr_fit fs = fresh_fit(), fl = fresh_fit();
        n = synthetic(121.0, 33.0, 90.0, design_a, 1, 2.0, h, COUNT(h));
        for (k = 0; k < n; k++) {
            const double e = rng_normal(&g);
            small[k] = h[k];
            large[k] = h[k];
            small[k].na_mmol_l += 0.3 * e;
            large[k].na_mmol_l += 1.5 * e;
        }
        assert_int_equal(ntr_course_fit(small, n, 40.0, design_a, 1, &fs), NTR_OK);
        assert_int_equal(ntr_course_fit(large, n, 40.0, design_a, 1, &fl), NTR_OK);
        assert_true(fl.rms_residual_mmol_l > fs.rms_residual_mmol_l);
        assert_true(fl.tbw_se_l > fs.tbw_se_l);
    }
}

/* A guess far from the truth ends at its search bound, flagged. */
static void fit_flags_a_bound(void **state)
{
    ntr_sample h[32];
    ntr_fit f = fresh_fit();
    size_t n = synthetic(120.0, 35.0, 120.0, design_a, 1, 2.0, h, COUNT(h));
    (void)state;
    assert_int_equal(ntr_course_fit(h, n, 200.0, design_a, 1, &f), NTR_OK);
    assert_true((f.flags & NTR_FIT_TBW_AT_BOUND) != 0u);
    assert_near(f.tbw_l, 200.0 / 3.0, 1e-6);
}

/* A free-water flow beyond the loss's search range: the fit stops at the
 * range's end and flags it. The box is L in [-2000, 2000] mL/h and
 * NTR_FIT_LOSS_AT_BOUND means "free_water_loss_ml_h is at -2000 or 2000
 * mL/h" (the header's Doxygen blocks of ntr_course_fit() and the fit
 * flags). The hidden patients (sodium 120, body water 60 L, design A,
 * hourly for 8 h; invented, from the library's own forward model) gain
 * 2500 mL/h of free water, or lose 2500 mL/h: no L inside the box fits,
 * so the best point found lies on its edge. */
static void fit_flags_the_loss_bound(void **state)
{
    static const double hidden[] = {-2500.0, 2500.0};
    static const double guess[] = {60.0, 40.0};
    size_t i;
    (void)state;
    for (i = 0; i < COUNT(hidden); i++) {
        ntr_timed_flow all[2];
        ntr_sample h[16];
        size_t n;
        ntr_fit f = fresh_fit();
        all[0] = design_a[0];
        all[1] = ntr_test_timed(0.0, 720.0, -hidden[i], 0.0, 0.0);
        assert_int_equal(ntr_balance_course(120.0, 60.0, all, 2, 8.0, 1.0, h, COUNT(h), &n),
                         NTR_OK);
        assert_int_equal(ntr_course_fit(h, n, guess[i], design_a, 1, &f), NTR_OK);
        assert_true((f.flags & NTR_FIT_LOSS_AT_BOUND) != 0u);
        assert_near(f.free_water_loss_ml_h, hidden[i] < 0.0 ? -2000.0 : 2000.0, 1e-6);
        assert_true((f.flags & NTR_FIT_NOT_CONVERGED) == 0u);
    }
}

static void fit_bad_inputs(void **state)
{
    ntr_sample h[32], bad[32];
    ntr_timed_flow fl[1];
    ntr_fit f = fresh_fit(), before = fresh_fit();
    size_t n = synthetic(120.0, 35.0, 120.0, design_a, 1, 2.0, h, COUNT(h));
    (void)state;
#define FIT_EXPECT(st, H, N, G, F, NF)                                   \
    do {                                                                 \
        f = before;                                                      \
        assert_int_equal(ntr_course_fit(H, N, G, F, NF, &f), st);        \
        assert_memory_equal(&f, &before, sizeof f);                      \
    } while (0)
    FIT_EXPECT(NTR_ERR_NULL, NULL, n, 40.0, design_a, 1);
    FIT_EXPECT(NTR_ERR_NULL, h, n, 40.0, NULL, 1);
    assert_int_equal(ntr_course_fit(h, n, 40.0, design_a, 1, NULL), NTR_ERR_NULL);
    FIT_EXPECT(NTR_ERR_ARG, h, 2, 40.0, design_a, 1);
    FIT_EXPECT(NTR_ERR_ARG, h, 0, 40.0, design_a, 1);
    before.struct_size = sizeof before - 8;
    FIT_EXPECT(NTR_ERR_ARG, h, n, 40.0, design_a, 1);
    before.struct_size = sizeof before;
    fl[0] = design_a[0];
    fl[0].reserved[1] = 1u;
    FIT_EXPECT(NTR_ERR_ARG, h, n, 40.0, fl, 1);
    memcpy(bad, h, n * sizeof *h);
    bad[4].hours = NAN;
    FIT_EXPECT(NTR_ERR_NONFINITE, bad, n, 40.0, design_a, 1);
    bad[4] = h[4];
    bad[5].na_mmol_l = 79.0;
    FIT_EXPECT(NTR_ERR_RANGE, bad, n, 40.0, design_a, 1);
    bad[5] = h[5];
    FIT_EXPECT(NTR_ERR_NONFINITE, h, n, NAN, design_a, 1);
    FIT_EXPECT(NTR_ERR_RANGE, h, n, 401.0, design_a, 1);
    fl[0] = design_a[0];
    fl[0].na_mmol_l = -1.0;
    FIT_EXPECT(NTR_ERR_RANGE, h, n, 40.0, fl, 1);
    bad[3].hours = 100.0;
    FIT_EXPECT(NTR_ERR_ORDER, bad, n, 40.0, design_a, 1);
    bad[3] = h[3];
    fl[0] = ntr_test_timed(2.0, 1.0, 250.0, 513.0, 0.0);
    FIT_EXPECT(NTR_ERR_ORDER, h, n, 40.0, fl, 1);
    bad[n - 1].hours = 800.0;
    FIT_EXPECT(NTR_ERR_DOMAIN, bad, n, 40.0, design_a, 1);
#undef FIT_EXPECT
}

/* ---- re-projection ------------------------------------------------------------------ */

/* With one sample at the clock's origin and no loss, the re-projection is
 * ntr_course_plan_check() itself, bit for bit. */
static void reproject_equals_plan_check(void **state)
{
    const ntr_sample h[] = {{7.0, 119.0}};
    const ntr_timed_flow f[] = {ntr_test_timed(0.0, 3.0, 100.0, 513.0, 0.0),
                                ntr_test_timed(2.0, 30.0, 60.0, 77.0, 20.0)};
    const ntr_course_limits lim = preset(NTR_COURSE_HYPO_HIGH_RISK);
    ntr_fit fit = fresh_fit();
    ntr_course_plan_result a = fresh_plan(), b = fresh_plan();
    (void)state;
    fit.tbw_l = 31.0;
    fit.free_water_loss_ml_h = 0.0;
    assert_int_equal(ntr_fit_reproject(h, 1, &fit, f, 2, 24.0, 0.5, &lim, &a), NTR_OK);
    assert_int_equal(ntr_course_plan_check(h, 1, 31.0, f, 2, 24.0, 0.5, &lim, &b), NTR_OK);
    assert_memory_equal(&a, &b, sizeof a);
}

/* Hand-worked: sodium 124 at 12 h after the first sample, fitted body
 * water 36 L at the first sample and a loss of 100 mL/h, no flows: body
 * water at 12 h is 36 - 1.2 = 34.8 L; 12 h on, 1.2 L more lost:
 * 124 * 34.8 / 33.6 = 128.43. */
static void reproject_hand_worked(void **state)
{
    const ntr_sample h[] = {{0.0, 121.0}, {12.0, 124.0}};
    const ntr_course_limits lim = preset(NTR_COURSE_HYPO_STANDARD);
    ntr_fit fit = fresh_fit();
    ntr_course_plan_result p = fresh_plan(), before;
    (void)state;
    fit.tbw_l = 36.0;
    fit.free_water_loss_ml_h = 100.0;
    assert_int_equal(ntr_fit_reproject(h, 2, &fit, NULL, 0, 12.0, 1.0, &lim, &p), NTR_OK);
    assert_near(p.final_tbw_l, 33.6, 1e-12);
    assert_near(p.final_na_mmol_l, 124.0 * 34.8 / 33.6, 1e-9);
    assert_true(p.first_breach_h == NTR_PLAN_NO_BREACH);
    /* Bad inputs leave the verdict untouched. */
    before = fresh_plan();
    p = before;
    assert_int_equal(ntr_fit_reproject(NULL, 2, &fit, NULL, 0, 12.0, 1.0, &lim, &p), NTR_ERR_NULL);
    assert_int_equal(ntr_fit_reproject(h, 2, NULL, NULL, 0, 12.0, 1.0, &lim, &p), NTR_ERR_NULL);
    assert_int_equal(ntr_fit_reproject(h, 0, &fit, NULL, 0, 12.0, 1.0, &lim, &p), NTR_ERR_ARG);
    fit.struct_size = 8;
    assert_int_equal(ntr_fit_reproject(h, 2, &fit, NULL, 0, 12.0, 1.0, &lim, &p), NTR_ERR_ARG);
    fit.struct_size = sizeof fit;
    fit.free_water_loss_ml_h = 2500.0;
    assert_int_equal(ntr_fit_reproject(h, 2, &fit, NULL, 0, 12.0, 1.0, &lim, &p), NTR_ERR_RANGE);
    fit.free_water_loss_ml_h = NAN;
    assert_int_equal(ntr_fit_reproject(h, 2, &fit, NULL, 0, 12.0, 1.0, &lim, &p),
                     NTR_ERR_NONFINITE);
    fit.free_water_loss_ml_h = 100.0;
    assert_int_equal(ntr_fit_reproject(h, 2, &fit, NULL, 0, 0.0, 1.0, &lim, &p), NTR_ERR_RANGE);
    /* A loss that drains the body water before the last sample. */
    fit.tbw_l = 1.0;
    fit.free_water_loss_ml_h = 2000.0;
    assert_int_equal(ntr_fit_reproject(h, 2, &fit, NULL, 0, 12.0, 1.0, &lim, &p), NTR_ERR_DOMAIN);
    assert_memory_equal(&p, &before, sizeof p);
}

/* The loop closed: the plan as planned (the guess, no loss) says the
 * remaining 12 h stay within the limit; fitted to the measured series of a
 * patient with a hidden 60 mL/h water loss (34 L, sodium 118), the re-projection finds the
 * breach ahead. */
static void reproject_finds_the_breach_the_plan_missed(void **state)
{
    ntr_sample h[32];
    const ntr_course_limits lim = preset(NTR_COURSE_HYPO_STANDARD);
    ntr_fit fit = fresh_fit(), planned = fresh_fit();
    ntr_course_plan_result p = fresh_plan(), q = fresh_plan();
    size_t n = synthetic(118.0, 34.0, 60.0, design_a, 1, 2.0, h, COUNT(h));
    size_t k, m = 0;
    (void)state;
    /* Keep the first 12 h of the series. */
    for (k = 0; k < n && h[k].hours <= 12.0; k++) {
        m++;
    }
    assert_int_equal(ntr_course_fit(h, m, 38.0, design_a, 1, &fit), NTR_OK);
    assert_int_equal(ntr_fit_reproject(h, m, &fit, design_a, 1, 12.0, 0.5, &lim, &p), NTR_OK);
    planned.tbw_l = 38.0;
    planned.free_water_loss_ml_h = 0.0;
    assert_int_equal(ntr_fit_reproject(h, m, &planned, design_a, 1, 12.0, 0.5, &lim, &q), NTR_OK);
    print_message("12 h ahead: fitted %.2f, planned %.2f, breach at %.1f h\n",
                  p.final_na_mmol_l, q.final_na_mmol_l, p.first_breach_h);
    assert_true(q.first_breach_h == NTR_PLAN_NO_BREACH);
    assert_true(p.first_breach_h != NTR_PLAN_NO_BREACH);
    assert_true(p.first_breach_flag == NTR_CF_OVER_24H);
    /* The fitted projection is the hidden truth's. */
    assert_near(p.final_na_mmol_l, h[m - 1 + 6].na_mmol_l, 1e-6);
}

/* A fall over the limit with no urine at all (one interval of 0 mL): the
 * urine's EFW rate is exactly 0, neither water diuresis nor salt loss, so
 * NTR_FB_SALT_LOSS (urine EFW below 0) stays clear while the breach is
 * reported. 5% dextrose at 1 L/h into 40 L from 160 mmol/L lowers sodium
 * by about 160 / 41 = 3.9 mmol/L in the first hour (mass balance), beyond
 * the chronic hypernatraemia limit of 10 in 24 h within a few hours.
 * Invented case. */
static void feedback_fall_without_urine(void **state)
{
    const ntr_sample h[] = {{0.0, 160.0}};
    const ntr_timed_flow f[] = {ntr_test_timed(0.0, 24.0, 1000.0, 0.0, 0.0)};
    const ntr_urine_interval u[] = {ntr_test_urine(0.0, 1.0, 0.0, 40.0, 20.0, 300.0)};
    const ntr_course_limits lim = preset(NTR_COURSE_HYPER_CHRONIC);
    ntr_urine_feedback_result r = fresh_feedback();
    (void)state;
    assert_int_equal(ntr_urine_feedback(h, 1, 40.0, f, 1, u, 1, 12.0, 0.25, &lim, &r), NTR_OK);
    assert_true(r.urine_efw_ml_h == 0.0);
    assert_true((r.flags & NTR_FB_LIMIT_AHEAD) != 0u);
    assert_true(r.plan.first_breach_direction == NTR_PLAN_BREACH_FALL);
    assert_int_equal(r.flags & NTR_FB_SALT_LOSS, 0u);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(feedback_water_diuresis_hand_worked),
        cmocka_unit_test(feedback_over_now),
        cmocka_unit_test(feedback_efw_identity),
        cmocka_unit_test(feedback_fall_without_urine),
        cmocka_unit_test(feedback_equals_plan_check),
        cmocka_unit_test(feedback_salt_loss),
        cmocka_unit_test(feedback_monotonic_in_urine),
        cmocka_unit_test(feedback_bad_inputs),
        cmocka_unit_test(interval_flow),
        cmocka_unit_test(fit_recovers_exact_truth),
        cmocka_unit_test(fit_three_samples_exact),
        cmocka_unit_test(fit_recovers_truth_under_noise),
        cmocka_unit_test(fit_standard_errors_by_the_equation),
        cmocka_unit_test(fit_refuses_inseparable_data),
        cmocka_unit_test(fit_when_the_model_is_wrong),
        cmocka_unit_test(fit_properties),
        cmocka_unit_test(fit_flags_a_bound),
        cmocka_unit_test(fit_flags_the_loss_bound),
        cmocka_unit_test(fit_bad_inputs),
        cmocka_unit_test(reproject_equals_plan_check),
        cmocka_unit_test(reproject_hand_worked),
        cmocka_unit_test(reproject_finds_the_breach_the_plan_missed),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
