/* SPDX-License-Identifier: MIT */
/* Predicting a fluid plan: ntr_balance_predict, ntr_balance_course,
 * ntr_plan_check and ntr_relower_estimate (docs/balance.md).
 *
 * Patients and plans below are invented examples. */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>
#include <cmocka.h>

#include "natremia_test.h"

#define COUNT(a) (sizeof(a) / sizeof((a)[0]))

static ntr_limits standard(void)
{
    ntr_limits lim;
    assert_int_equal(ntr_limits_preset(NTR_LIMITS_STANDARD, &lim), NTR_OK);
    return lim;
}

static double predict_na(double na, double tbw, const ntr_flow *f, size_t n)
{
    double na_out = NTR_TEST_SENTINEL, tbw_out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_balance_predict(na, tbw, f, n, &na_out, &tbw_out), NTR_OK);
    return na_out;
}

/* xorshift64*: deterministic random inputs. */
static uint64_t rng_state = 0x2545f4914f6cdd1du;
static double rng_unit(void)
{
    rng_state ^= rng_state >> 12;
    rng_state ^= rng_state << 25;
    rng_state ^= rng_state >> 27;
    return (double)((rng_state * 0x2545f4914f6cdd1du) >> 11) / 9007199254740992.0;
}
static double rng_in(double lo, double hi) { return lo + (hi - lo) * rng_unit(); }

static void struct_layouts_are_as_specified(void **state)
{
    (void)state;
    assert_int_equal(offsetof(ntr_flow, volume_l), 0);
    assert_int_equal(offsetof(ntr_flow, na_mmol_l), 8);
    assert_int_equal(offsetof(ntr_flow, k_mmol_l), 16);
    assert_int_equal(sizeof(ntr_flow), 24);
    assert_int_equal(offsetof(ntr_timed_flow, reserved), 40);
    assert_int_equal(sizeof(ntr_timed_flow), 48);
    assert_int_equal(offsetof(ntr_plan_result, final_na_mmol_l), sizeof(ntr_correction));
    assert_int_equal(sizeof(ntr_plan_result), 104);
}

/* ---- ntr_balance_predict -------------------------------------------------- */

/* Source: Furst H et al., Am J Med Sci 2000;319:240-4, worked example:
 * sodium 108 mmol/L, body water 30 L, 292 mL of 3% saline gives about
 * 112. Mass balance: (108*30 + 0.292*513) / (30 + 0.292)
 * = (3240 + 149.796) / 30.292 = 111.904. */
static void furst_worked_example(void **state)
{
    const ntr_flow bolus = {0.292, 513.0, 0.0};
    double na = NTR_TEST_SENTINEL, tbw = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_balance_predict(108.0, 30.0, &bolus, 1, &na, &tbw), NTR_OK);
    assert_near(na, 3389.796 / 30.292, 1e-9);
    assert_near(na, 112.0, 0.5);
    assert_near(tbw, 30.292, 1e-12);
}

/* Source: Adrogue HJ, Madias NE, N Engl J Med 2000;342:1581-9: the change
 * from 1 L of infusate is (infusate Na + K - serum Na) / (TBW + 1). The
 * review's example, from memory: a 60 kg woman (TBW 0.5 * 60 = 30 L) with
 * sodium 108 given 1 L of 3% saline: (513 - 108) / 31 = 13.1 mmol/L. */
static void adrogue_madias_example(void **state)
{
    const ntr_flow litre = {1.0, 513.0, 0.0};
    (void)state;
    assert_near(predict_na(108.0, 30.0, &litre, 1) - 108.0, 13.1, 0.05);
}

/* The identity the issue asks for: one 1 L inflow and nothing else equals
 * ntr_infusate_change_per_litre (P1), on 20000 random patients and fluids.
 * Algebra: Na0 + (c - Na0)/(TBW0 + 1) = (Na0*TBW0 + c)/(TBW0 + 1). */
static void one_litre_equals_adrogue_madias(void **state)
{
    int i;
    (void)state;
    for (i = 0; i < 20000; i++) {
        /* Ranges kept so the result stays within 80-220 mmol/L. */
        const double na = rng_in(100.0, 170.0), tbw = rng_in(10.0, 80.0);
        const ntr_flow f = {1.0, rng_in(0.0, 513.0), rng_in(0.0, 40.0)};
        double delta = NTR_TEST_SENTINEL;
        assert_int_equal(ntr_infusate_change_per_litre(na, tbw, f.na_mmol_l, f.k_mmol_l, &delta),
                         NTR_OK);
        assert_near(predict_na(na, tbw, &f, 1), na + delta, 1e-11);
    }
}

/* Property (Edelman: serum Na tracks (Na_e + K_e)/TBW): losing urine of
 * volume V whose Na + K is c is the same as losing its electrolyte-free
 * water clearance EFWC = V(1 - c/Na) as pure water plus V - EFWC of
 * isotonic fluid, which leaves sodium at Na*(TBW - V + EFWC)/(TBW - V).
 * EFWC comes from P1's ntr_efwc (Rose & Post, standard renal physiology). */
static void urine_loss_agrees_with_efwc(void **state)
{
    int i;
    (void)state;
    for (i = 0; i < 2000; i++) {
        const double na = rng_in(115.0, 160.0), tbw = rng_in(20.0, 60.0);
        const double v = rng_in(0.1, 5.0), u_na = rng_in(5.0, 100.0), u_k = rng_in(0.0, 40.0);
        const ntr_flow urine = {-v, u_na, u_k};
        double efwc = NTR_TEST_SENTINEL;
        assert_int_equal(ntr_efwc(v, u_na, u_k, na, &efwc), NTR_OK);
        assert_near(predict_na(na, tbw, &urine, 1), na * (tbw - v + efwc) / (tbw - v), 1e-9);
    }
}

/* Properties: the order of the flows does not matter; a flow split in two
 * is the same flow; a flow then its exact reverse returns to the start; an
 * isotonic loss (its Na + K equal to serum) leaves sodium unchanged. */
static void balance_properties(void **state)
{
    int i;
    (void)state;
    for (i = 0; i < 2000; i++) {
        const double na = rng_in(110.0, 150.0), tbw = rng_in(20.0, 60.0);
        ntr_flow f[3], g[3], split[4], pair[2];
        double a, b;
        f[0].volume_l = rng_in(0.0, 2.0);
        f[0].na_mmol_l = rng_in(0.0, 513.0);
        f[0].k_mmol_l = rng_in(0.0, 40.0);
        f[1].volume_l = -rng_in(0.0, 3.0);
        f[1].na_mmol_l = rng_in(10.0, 150.0);
        f[1].k_mmol_l = rng_in(5.0, 60.0);
        f[2].volume_l = rng_in(0.0, 1.0);
        f[2].na_mmol_l = rng_in(0.0, 154.0);
        f[2].k_mmol_l = 0.0;
        g[0] = f[2];
        g[1] = f[0];
        g[2] = f[1];
        a = predict_na(na, tbw, f, 3);
        b = predict_na(na, tbw, g, 3);
        assert_near(a, b, 1e-10);
        split[0] = f[0];
        split[0].volume_l = f[0].volume_l * 0.25;
        split[1] = f[0];
        split[1].volume_l = f[0].volume_l * 0.75;
        split[2] = f[1];
        split[3] = f[2];
        assert_near(predict_na(na, tbw, split, 4), a, 1e-10);
        pair[0] = f[0];
        pair[1] = f[0];
        pair[1].volume_l = -f[0].volume_l;
        assert_near(predict_na(na, tbw, pair, 2), na, 1e-10);
        pair[0].volume_l = -rng_in(0.0, 5.0);
        pair[0].na_mmol_l = na - 4.0;
        pair[0].k_mmol_l = 4.0;
        assert_near(predict_na(na, tbw, pair, 1), na, 1e-10);
    }
    /* No flows: the inputs come back. */
    {
        double na = 0.0, tbw = 0.0;
        assert_int_equal(ntr_balance_predict(123.0, 33.0, NULL, 0, &na, &tbw), NTR_OK);
        assert_true(na == 123.0);
        assert_true(tbw == 33.0);
    }
}

static void balance_rejects_bad_inputs(void **state)
{
    const double nonfinite[] = {(double)NAN, HUGE_VAL, -HUGE_VAL};
    const ntr_flow good[2] = {{1.0, 154.0, 0.0}, {-0.5, 60.0, 20.0}};
    double na = NTR_TEST_SENTINEL, tbw = NTR_TEST_SENTINEL;
    size_t i, k, field;
    (void)state;
    assert_int_equal(ntr_balance_predict(120.0, 30.0, NULL, 1, &na, &tbw), NTR_ERR_NULL);
    assert_int_equal(ntr_balance_predict(120.0, 30.0, good, 2, NULL, &tbw), NTR_ERR_NULL);
    assert_int_equal(ntr_balance_predict(120.0, 30.0, good, 2, &na, NULL), NTR_ERR_NULL);
    for (k = 0; k < COUNT(nonfinite); k++) {
        assert_int_equal(ntr_balance_predict(nonfinite[k], 30.0, good, 2, &na, &tbw),
                         NTR_ERR_NONFINITE);
        assert_int_equal(ntr_balance_predict(120.0, nonfinite[k], good, 2, &na, &tbw),
                         NTR_ERR_NONFINITE);
        for (i = 0; i < 2; i++) {
            for (field = 0; field < 3; field++) {
                ntr_flow f[2];
                memcpy(f, good, sizeof good);
                if (field == 0) f[i].volume_l = nonfinite[k];
                if (field == 1) f[i].na_mmol_l = nonfinite[k];
                if (field == 2) f[i].k_mmol_l = nonfinite[k];
                assert_int_equal(ntr_balance_predict(120.0, 30.0, f, 2, &na, &tbw),
                                 NTR_ERR_NONFINITE);
            }
        }
    }
    /* Ranges: sodium 80-220, TBW 0.1-400 L, volume -30 to 20 L, flow Na
     * 0-1100, K 0-400 mmol/L (docs/ranges.md). */
    assert_int_equal(ntr_balance_predict(79.9, 30.0, good, 2, &na, &tbw), NTR_ERR_RANGE);
    assert_int_equal(ntr_balance_predict(120.0, 0.09, good, 2, &na, &tbw), NTR_ERR_RANGE);
    {
        ntr_flow f[2];
        memcpy(f, good, sizeof good);
        f[1].volume_l = nextafter(-30.0, -HUGE_VAL);
        assert_int_equal(ntr_balance_predict(120.0, 300.0, f, 2, &na, &tbw), NTR_ERR_RANGE);
        f[1].volume_l = -30.0;
        f[1].na_mmol_l = 120.0;
        f[1].k_mmol_l = 0.0;
        assert_int_equal(ntr_balance_predict(120.0, 300.0, f, 2, &na, &tbw), NTR_OK);
        na = tbw = NTR_TEST_SENTINEL;
        memcpy(f, good, sizeof good);
        f[0].volume_l = nextafter(20.0, HUGE_VAL);
        assert_int_equal(ntr_balance_predict(120.0, 30.0, f, 2, &na, &tbw), NTR_ERR_RANGE);
        memcpy(f, good, sizeof good);
        f[0].na_mmol_l = 1100.5;
        assert_int_equal(ntr_balance_predict(120.0, 30.0, f, 2, &na, &tbw), NTR_ERR_RANGE);
        memcpy(f, good, sizeof good);
        f[1].k_mmol_l = -0.1;
        assert_int_equal(ntr_balance_predict(120.0, 30.0, f, 2, &na, &tbw), NTR_ERR_RANGE);
        /* Domain: losing more water than the body holds. */
        memcpy(f, good, sizeof good);
        f[1].volume_l = -12.0;
        assert_int_equal(ntr_balance_predict(120.0, 10.0, f, 2, &na, &tbw), NTR_ERR_DOMAIN);
        /* Domain: a result beyond 220 mmol/L (5 L of 5% saline into 10 L). */
        f[0].volume_l = 5.0;
        f[0].na_mmol_l = 855.0;
        assert_int_equal(ntr_balance_predict(140.0, 10.0, f, 1, &na, &tbw), NTR_ERR_DOMAIN);
    }
    assert_true(na == NTR_TEST_SENTINEL);
    assert_true(tbw == NTR_TEST_SENTINEL);
}

/* ---- ntr_balance_course ---------------------------------------------------- */

/* 3% saline (Na 513) at 100 mL/h into 40 L at sodium 115, hourly for 3 h:
 *   1 h: 115 + 0.1*398/40.1 = 115.99252
 *   2 h: 115 + 0.2*398/40.2 = 116.98010
 *   3 h: 115 + 0.3*398/40.3 = 117.96278
 * (Adrogue-Madias mass balance, Adrogue & Madias 2000.) */
static void course_hand_worked(void **state)
{
    const ntr_timed_flow f = ntr_test_timed(0.0, 3.0, 100.0, 513.0, 0.0);
    ntr_sample s[4];
    size_t count = 0;
    (void)state;
    assert_int_equal(ntr_balance_course(115.0, 40.0, &f, 1, 3.0, 1.0, s, 4, &count), NTR_OK);
    assert_int_equal(count, 4);
    assert_true(s[0].hours == 0.0 && s[0].na_mmol_l == 115.0);
    assert_true(s[1].hours == 1.0 && s[2].hours == 2.0 && s[3].hours == 3.0);
    assert_near(s[1].na_mmol_l, 115.0 + 39.8 / 40.1, 1e-12);
    assert_near(s[2].na_mmol_l, 115.0 + 79.6 / 40.2, 1e-12);
    assert_near(s[3].na_mmol_l, 115.0 + 119.4 / 40.3, 1e-12);
}

/* Grid: points at 0, step, ... below the duration, then the duration.
 * 2.5 h at 1 h: 0, 1, 2, 2.5 (4 points). 1 h at 0.1 h: 11 points ending
 * exactly at 1 h, strictly increasing (no doubled end point from the
 * rounding of 1/0.1). Step longer than the plan: 0 and the end. */
static void course_grid(void **state)
{
    ntr_sample s[16];
    size_t count = 0, i;
    (void)state;
    assert_int_equal(ntr_balance_course(120.0, 30.0, NULL, 0, 2.5, 1.0, s, 16, &count), NTR_OK);
    assert_int_equal(count, 4);
    assert_true(s[3].hours == 2.5);
    assert_int_equal(ntr_balance_course(120.0, 30.0, NULL, 0, 1.0, 0.1, s, 16, &count), NTR_OK);
    assert_int_equal(count, 11);
    assert_true(s[10].hours == 1.0);
    for (i = 1; i < count; i++) {
        assert_true(s[i].hours > s[i - 1].hours);
        assert_true(s[i].na_mmol_l == 120.0);
    }
    assert_int_equal(ntr_balance_course(120.0, 30.0, NULL, 0, 0.5, 2.0, s, 16, &count), NTR_OK);
    assert_int_equal(count, 2);
    /* Many durations and steps: the grid never repeats its end point and
     * never runs past it. */
    for (i = 0; i < 3000; i++) {
        const double duration = rng_in(0.01, 100.0), step = rng_in(1.0 / 60.0, 10.0);
        size_t need = 0, j;
        static ntr_sample big[8000];
        int st = ntr_balance_course(120.0, 30.0, NULL, 0, duration, step, NULL, 0, &need);
        assert_int_equal(st, NTR_ERR_CAPACITY);
        if (need > COUNT(big)) {
            continue;
        }
        assert_int_equal(ntr_balance_course(120.0, 30.0, NULL, 0, duration, step, big, need, &count),
                         NTR_OK);
        assert_int_equal(count, need);
        assert_true(big[count - 1].hours == duration);
        for (j = 1; j < count; j++) {
            assert_true(big[j].hours > big[j - 1].hours);
        }
        assert_true(big[count - 2].hours < duration);
    }
}

/* Property: the last point equals ntr_balance_predict of the volumes each
 * flow has delivered by then; flows beyond the plan's end are cut there. */
static void course_end_equals_balance(void **state)
{
    int round;
    (void)state;
    for (round = 0; round < 500; round++) {
        ntr_timed_flow f[3];
        ntr_flow v[3];
        ntr_sample s[200];
        size_t count = 0, i;
        const double duration = rng_in(1.0, 48.0);
        const double na0 = rng_in(110.0, 150.0), tbw0 = rng_in(30.0, 50.0);
        double na1, tbw1;
        /* Rates kept so every point stays within 80-220 mmol/L. */
        f[0] = ntr_test_timed(rng_in(0.0, 10.0), 0.0, rng_in(0.0, 30.0), 513.0, 0.0);
        f[0].end_h = f[0].start_h + rng_in(0.0, 40.0);
        f[1] = ntr_test_timed(rng_in(0.0, 5.0), 0.0, -rng_in(0.0, 100.0), rng_in(10.0, 100.0), rng_in(0.0, 40.0));
        f[1].end_h = f[1].start_h + rng_in(0.0, 50.0);
        f[2] = ntr_test_timed(0.0, rng_in(0.0, 60.0), rng_in(0.0, 100.0), 0.0, 0.0);
        for (i = 0; i < 3; i++) {
            double stop = f[i].end_h < duration ? f[i].end_h : duration;
            double ran = stop - f[i].start_h;
            v[i].volume_l = ran > 0.0 ? f[i].rate_ml_h / 1000.0 * ran : 0.0;
            v[i].na_mmol_l = f[i].na_mmol_l;
            v[i].k_mmol_l = f[i].k_mmol_l;
        }
        assert_int_equal(ntr_balance_course(na0, tbw0, f, 3, duration, 0.5, s, 200, &count), NTR_OK);
        assert_int_equal(ntr_balance_predict(na0, tbw0, v, 3, &na1, &tbw1), NTR_OK);
        assert_near(s[count - 1].na_mmol_l, na1, 1e-10);
    }
}

static void course_capacity_and_bad_inputs(void **state)
{
    const ntr_timed_flow good = ntr_test_timed(0.0, 3.0, 100.0, 513.0, 0.0);
    ntr_sample s[3];
    ntr_sample ref[3];
    size_t count = 12345;
    size_t field;
    (void)state;
    memset(s, 0x5a, sizeof s);
    memcpy(ref, s, sizeof s);

    /* Capacity: 4 points needed, room for 3. */
    assert_int_equal(ntr_balance_course(115.0, 40.0, &good, 1, 3.0, 1.0, s, 3, &count),
                     NTR_ERR_CAPACITY);
    assert_int_equal(count, 4);
    assert_memory_equal(s, ref, sizeof s);
    count = 12345;
    assert_int_equal(ntr_balance_course(115.0, 40.0, &good, 1, 3.0, 1.0, NULL, 0, &count),
                     NTR_ERR_CAPACITY);
    assert_int_equal(count, 4);

    count = 12345;
    assert_int_equal(ntr_balance_course(115.0, 40.0, &good, 1, 3.0, 1.0, s, 3, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_balance_course(115.0, 40.0, &good, 1, 3.0, 1.0, NULL, 3, &count), NTR_ERR_NULL);
    assert_int_equal(ntr_balance_course(115.0, 40.0, NULL, 1, 3.0, 1.0, s, 3, &count), NTR_ERR_NULL);
    {
        ntr_timed_flow f = good;
        f.reserved[1] = 1u;
        assert_int_equal(ntr_balance_course(115.0, 40.0, &f, 1, 3.0, 1.0, s, 3, &count), NTR_ERR_ARG);
        /* The reserved field is checked before any number. */
        assert_int_equal(ntr_balance_course((double)NAN, 40.0, &f, 1, 3.0, 1.0, s, 3, &count),
                         NTR_ERR_ARG);
    }
    assert_int_equal(ntr_balance_course((double)NAN, 40.0, &good, 1, 3.0, 1.0, s, 3, &count),
                     NTR_ERR_NONFINITE);
    assert_int_equal(ntr_balance_course(115.0, HUGE_VAL, &good, 1, 3.0, 1.0, s, 3, &count),
                     NTR_ERR_NONFINITE);
    assert_int_equal(ntr_balance_course(115.0, 40.0, &good, 1, -HUGE_VAL, 1.0, s, 3, &count),
                     NTR_ERR_NONFINITE);
    assert_int_equal(ntr_balance_course(115.0, 40.0, &good, 1, 3.0, (double)NAN, s, 3, &count),
                     NTR_ERR_NONFINITE);
    for (field = 0; field < 5; field++) {
        ntr_timed_flow f = good;
        double *slot = field == 0 ? &f.start_h : field == 1 ? &f.end_h
                     : field == 2 ? &f.rate_ml_h : field == 3 ? &f.na_mmol_l : &f.k_mmol_l;
        *slot = (double)NAN;
        assert_int_equal(ntr_balance_course(115.0, 40.0, &f, 1, 3.0, 1.0, s, 3, &count),
                         NTR_ERR_NONFINITE);
        *slot = -0.5;
        assert_int_equal(ntr_balance_course(115.0, 40.0, &f, 1, 3.0, 1.0, s, 3, &count),
                         field == 2 ? NTR_ERR_CAPACITY : NTR_ERR_RANGE);
        count = 12345; /* a -0.5 mL/h loss is valid: it got as far as the capacity */
        *slot = 5001.0;
        assert_int_equal(ntr_balance_course(115.0, 40.0, &f, 1, 3.0, 1.0, s, 3, &count),
                         NTR_ERR_RANGE);
    }
    assert_int_equal(ntr_balance_course(115.0, 40.0, &good, 1, 0.0, 1.0, s, 3, &count), NTR_ERR_RANGE);
    assert_int_equal(ntr_balance_course(115.0, 40.0, &good, 1, 720.5, 1.0, s, 3, &count), NTR_ERR_RANGE);
    assert_int_equal(ntr_balance_course(115.0, 40.0, &good, 1, 3.0, 0.01, s, 3, &count), NTR_ERR_RANGE);
    {
        ntr_timed_flow f = ntr_test_timed(5.0, 4.0, 100.0, 513.0, 0.0);
        assert_int_equal(ntr_balance_course(115.0, 40.0, &f, 1, 3.0, 1.0, s, 3, &count), NTR_ERR_ORDER);
        /* Domain: 5 L/h of urine for 10 h empties a 40 L body. */
        f = ntr_test_timed(0.0, 10.0, -5000.0, 50.0, 0.0);
        assert_int_equal(ntr_balance_course(115.0, 40.0, &f, 1, 10.0, 5.0, s, 3, &count), NTR_ERR_DOMAIN);
    }
    assert_int_equal(count, 12345);
    assert_memory_equal(s, ref, sizeof s);
}

/* ---- ntr_plan_check ------------------------------------------------------------ */

/* The scenario (invented patient): sodium 115 mmol/L, body water
 * 40 L, standard limits (10 per 24 h: Verbalis 2013; Spasovski 2014).
 * Plan: 3% saline 150 mL over 20 min, twice (the European guideline's
 * bolus for severe symptoms, Spasovski 2014): 450 mL/h for 2/3 h = 0.3 L.
 *
 * On its own: 115 + 0.3*(513 - 115)/40.3 = 115 + 119.4/40.3 = 117.963;
 * rise 2.96 < 10: safe (and below the 4 mmol/L target after 24 h).
 *
 * With a water diuresis of 250 mL/h (urine Na 30 + K 10 = 40) from 4 h:
 * x hours into it, Na = 115 + (119.4 + 0.25x*(115 - 40)) / (40.3 - 0.25x)
 *   = 115 + (119.4 + 18.75x) / (40.3 - 0.25x).
 * Over 10 when 119.4 + 18.75x > 403 - 2.5x, x > 283.6/21.25 = 13.346:
 * after 17.346 h, so on a half-hour grid the first breach is at 17.5 h
 * (x = 13.5: 372.525/36.925 = 10.089; at 17.0 h: 363.15/37.05 = 9.802).
 * At 24 h (x = 20): 494.4/35.3 = 14.006: max_rise_24h 14.006, excess
 * 4.006; the 48 h limit of 18 is not reached. */
static void bolus_safe_alone_breaches_with_diuresis(void **state)
{
    const ntr_sample now = {0.0, 115.0};
    const ntr_timed_flow plan[2] = {
        ntr_test_timed(0.0, 2.0 / 3.0, 450.0, 513.0, 0.0),
        ntr_test_timed(4.0, 24.0, -250.0, 30.0, 10.0),
    };
    ntr_limits lim = standard();
    ntr_plan_result r;
    (void)state;

    memset(&r, 0x5a, sizeof r);
    assert_int_equal(ntr_plan_check(&now, 1, 40.0, plan, 1, 24.0, 0.5, &lim, &r), NTR_OK);
    assert_near(r.final_na_mmol_l, 115.0 + 119.4 / 40.3, 1e-9);
    assert_near(r.final_tbw_l, 40.3, 1e-12);
    assert_near(r.course.max_rise_24h, 119.4 / 40.3, 1e-9);
    assert_int_equal(r.course.flags & (NTR_CF_OVER_24H | NTR_CF_OVER_48H), 0u);
    assert_int_equal(r.course.flags & NTR_CF_BELOW_TARGET, NTR_CF_BELOW_TARGET);
    assert_true(r.breach_24h_h == NTR_PLAN_NO_BREACH);
    assert_true(r.breach_48h_h == NTR_PLAN_NO_BREACH);
    assert_int_equal(r.points, 48);
    assert_int_equal(r.reserved, 0);
    assert_true(r.reserved_d[0] == 0.0 && r.reserved_d[1] == 0.0);

    assert_int_equal(ntr_plan_check(&now, 1, 40.0, plan, 2, 24.0, 0.5, &lim, &r), NTR_OK);
    assert_true(r.breach_24h_h == 17.5);
    assert_true(r.breach_48h_h == NTR_PLAN_NO_BREACH);
    assert_near(r.course.max_rise_24h, 494.4 / 35.3, 1e-9);
    assert_near(r.course.excess_mmol_l, 494.4 / 35.3 - 10.0, 1e-9);
    assert_near(r.final_na_mmol_l, 115.0 + 494.4 / 35.3, 1e-9);
    assert_near(r.final_tbw_l, 35.3, 1e-12);
    assert_int_equal(r.course.flags & (NTR_CF_OVER_24H | NTR_CF_OVER_48H), NTR_CF_OVER_24H);
}

/* A rise already measured counts: history 112 at -12 h, 115 now. The 24 h
 * window of a point tau hours ahead reaches back to the 112 only while
 * tau <= 12. With the diuresis plan above: at 12 h (x = 8)
 * 115 + (119.4 + 150)/(40.3 - 2) = 122.034, 10.034 above 112: breach at
 * exactly 12 h, the window's edge (at 11.5 h: 121.767, 9.767). */
static void measured_history_counts_against_the_plan(void **state)
{
    const ntr_sample history[2] = {{-12.0, 112.0}, {0.0, 115.0}};
    const ntr_timed_flow plan[2] = {
        ntr_test_timed(0.0, 2.0 / 3.0, 450.0, 513.0, 0.0),
        ntr_test_timed(4.0, 24.0, -250.0, 30.0, 10.0),
    };
    ntr_limits lim = standard();
    ntr_plan_result r;
    (void)state;
    assert_int_equal(ntr_plan_check(history, 2, 40.0, plan, 2, 24.0, 0.5, &lim, &r), NTR_OK);
    assert_true(r.breach_24h_h == 12.0);
    /* The course includes the history: the first 24 h run from -12 h. */
    assert_near(r.course.rise_first_24h, 122.03394255874673 - 112.0, 1e-9);
}

/* Property: the plan check's assessment is exactly ntr_correction_assess
 * of the series ntr_balance_course writes, and the breach time is the
 * first point whose window breaches, found by assessing growing prefixes. */
static void plan_check_equals_course_then_assess(void **state)
{
    int round, breaches = 0;
    (void)state;
    for (round = 0; round < 300; round++) {
        static ntr_sample s[400];
        const ntr_sample now = {0.0, rng_in(108.0, 130.0)};
        const double tbw = rng_in(25.0, 50.0);
        ntr_timed_flow plan[3];
        ntr_limits lim = standard();
        ntr_plan_result r;
        ntr_correction c;
        size_t count = 0, k;
        double first_breach = NTR_PLAN_NO_BREACH;
        double first_breach_48 = NTR_PLAN_NO_BREACH;
        plan[0] = ntr_test_timed(0.0, rng_in(0.1, 3.0), rng_in(0.0, 500.0), 513.0, 0.0);
        plan[1] = ntr_test_timed(rng_in(0.0, 10.0), 48.0, -rng_in(0.0, 300.0), rng_in(10.0, 60.0), 10.0);
        plan[2] = ntr_test_timed(0.0, 48.0, rng_in(0.0, 80.0), 154.0, 0.0);
        assert_int_equal(ntr_plan_check(&now, 1, tbw, plan, 3, 48.0, 0.25, &lim, &r), NTR_OK);
        assert_int_equal(ntr_balance_course(now.na_mmol_l, tbw, plan, 3, 48.0, 0.25, s, COUNT(s), &count),
                         NTR_OK);
        assert_int_equal(ntr_correction_assess(s, count, &lim, &c), NTR_OK);
        assert_memory_equal(&r.course, &c, sizeof c);
        assert_int_equal(r.points, count - 1);
        assert_true(r.final_na_mmol_l == s[count - 1].na_mmol_l);
        for (k = 2; k <= count; k++) {
            ntr_correction pc;
            assert_int_equal(ntr_correction_assess(s, k, &lim, &pc), NTR_OK);
            if ((pc.flags & NTR_CF_OVER_24H) && first_breach == NTR_PLAN_NO_BREACH) {
                first_breach = s[k - 1].hours;
            }
            if ((pc.flags & NTR_CF_OVER_48H) && first_breach_48 == NTR_PLAN_NO_BREACH) {
                first_breach_48 = s[k - 1].hours;
            }
        }
        assert_true(r.breach_24h_h == first_breach);
        assert_true(r.breach_48h_h == first_breach_48);
        if (first_breach != NTR_PLAN_NO_BREACH) {
            breaches++;
        }
    }
    /* The random plans include both safe and breaching ones. */
    assert_true(breaches > 30 && breaches < 270);
}

static void plan_check_rejects_bad_inputs(void **state)
{
    const ntr_sample now[2] = {{-2.0, 118.0}, {0.0, 119.0}};
    const ntr_timed_flow plan = ntr_test_timed(0.0, 2.0, 100.0, 513.0, 0.0);
    ntr_limits lim = standard();
    ntr_plan_result r, ref;
    (void)state;
    memset(&r, 0x5a, sizeof r);
    memcpy(&ref, &r, sizeof r);
    assert_int_equal(ntr_plan_check(NULL, 1, 40.0, &plan, 1, 24.0, 1.0, &lim, &r), NTR_ERR_NULL);
    assert_int_equal(ntr_plan_check(now, 2, 40.0, NULL, 1, 24.0, 1.0, &lim, &r), NTR_ERR_NULL);
    assert_int_equal(ntr_plan_check(now, 2, 40.0, &plan, 1, 24.0, 1.0, NULL, &r), NTR_ERR_NULL);
    assert_int_equal(ntr_plan_check(now, 2, 40.0, &plan, 1, 24.0, 1.0, &lim, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_plan_check(now, 0, 40.0, &plan, 1, 24.0, 1.0, &lim, &r), NTR_ERR_ARG);
    {
        ntr_timed_flow f = plan;
        f.reserved[0] = 7u;
        assert_int_equal(ntr_plan_check(now, 2, 40.0, &f, 1, 24.0, 1.0, &lim, &r), NTR_ERR_ARG);
    }
    {
        ntr_sample h[2] = {{-2.0, 118.0}, {0.0, (double)NAN}};
        assert_int_equal(ntr_plan_check(h, 2, 40.0, &plan, 1, 24.0, 1.0, &lim, &r), NTR_ERR_NONFINITE);
        h[1].na_mmol_l = 119.0;
        h[1].hours = -3.0;
        assert_int_equal(ntr_plan_check(h, 2, 40.0, &plan, 1, 24.0, 1.0, &lim, &r), NTR_ERR_ORDER);
    }
    assert_int_equal(ntr_plan_check(now, 2, 0.0, &plan, 1, 24.0, 1.0, &lim, &r), NTR_ERR_RANGE);
    assert_int_equal(ntr_plan_check(now, 2, 40.0, &plan, 1, (double)NAN, 1.0, &lim, &r), NTR_ERR_NONFINITE);
    assert_int_equal(ntr_plan_check(now, 2, 40.0, &plan, 1, 24.0, 1000.0, &lim, &r), NTR_ERR_RANGE);
    lim.max_rise_48h = 5.0;
    assert_int_equal(ntr_plan_check(now, 2, 40.0, &plan, 1, 24.0, 1.0, &lim, &r), NTR_ERR_RANGE);
    lim = standard();
    {
        ntr_timed_flow f = ntr_test_timed(0.0, 20.0, -3000.0, 50.0, 0.0);
        assert_int_equal(ntr_plan_check(now, 2, 40.0, &f, 1, 24.0, 1.0, &lim, &r), NTR_ERR_DOMAIN);
        f = ntr_test_timed(3.0, 2.0, 100.0, 513.0, 0.0);
        assert_int_equal(ntr_plan_check(now, 2, 40.0, &f, 1, 24.0, 1.0, &lim, &r), NTR_ERR_ORDER);
    }
    assert_memory_equal(&r, &ref, sizeof r);
}

/* ---- ntr_course_plan_check (both directions) ---------------------------- */

/* Same bits in every member of two course reports (padding not compared). */
static int same_bits(double a, double b)
{
    return memcmp(&a, &b, sizeof a) == 0;
}

static void assert_same_report(const ntr_course_report *a, const ntr_course_report *b)
{
    assert_int_equal(a->struct_size, b->struct_size);
    assert_true(same_bits(a->max_rise_24h, b->max_rise_24h));
    assert_true(same_bits(a->max_rise_48h, b->max_rise_48h));
    assert_true(same_bits(a->max_fall_24h, b->max_fall_24h));
    assert_true(same_bits(a->max_fall_48h, b->max_fall_48h));
    assert_true(same_bits(a->excess_mmol_l, b->excess_mmol_l));
    assert_int_equal(a->flags, b->flags);
    assert_int_equal(a->reserved, b->reserved);
    assert_true(same_bits(a->rise_first_24h, b->rise_first_24h));
    assert_true(same_bits(a->fall_first_24h, b->fall_first_24h));
    assert_true(same_bits(a->rise_now_24h, b->rise_now_24h));
    assert_true(same_bits(a->fall_now_24h, b->fall_now_24h));
    assert_true(same_bits(a->last_rate_per_h, b->last_rate_per_h));
    assert_true(same_bits(a->elapsed_h, b->elapsed_h));
    assert_true(same_bits(a->worst_at_h, b->worst_at_h));
}


static ntr_course_limits course_preset(int preset)
{
    ntr_course_limits lim;
    memset(&lim, 0, sizeof lim);
    assert_int_equal(ntr_course_limits_preset(preset, &lim), NTR_OK);
    return lim;
}

static ntr_course_limits course_limits(int goal, double rise24, double rise48,
                                       double fall24, double fall48, double min_change)
{
    ntr_course_limits lim;
    memset(&lim, 0, sizeof lim);
    lim.struct_size = sizeof lim;
    lim.goal = goal;
    lim.max_rise_24h = rise24;
    lim.max_rise_48h = rise48;
    lim.max_fall_24h = fall24;
    lim.max_fall_48h = fall48;
    lim.min_change_24h = min_change;
    return lim;
}

/* The 1.0 limits as course limits: raise, the same rise limits and target,
 * no fall limit. */
static ntr_course_limits course_from_1_0(const ntr_limits *old)
{
    return course_limits(NTR_GOAL_RAISE, old->max_rise_24h, old->max_rise_48h, 0.0, 0.0,
                         old->min_rise_24h);
}

/* A result struct filled with a byte pattern, its struct_size set. */
static ntr_course_plan_result course_plan_blank(void)
{
    ntr_course_plan_result r;
    memset(&r, 0x5a, sizeof r);
    r.struct_size = sizeof r;
    return r;
}

static int course_plan(const ntr_sample *history, size_t n_history, double tbw,
                       const ntr_timed_flow *flows, size_t n_flows, double duration,
                       double step, const ntr_course_limits *lim,
                       ntr_course_plan_result *r)
{
    *r = course_plan_blank();
    return ntr_course_plan_check(history, n_history, tbw, flows, n_flows, duration, step,
                                 lim, r);
}

/* The report is the last member, so a later, larger ntr_course_report
 * only lengthens the struct; a caller's larger struct_size (a later
 * header) is accepted, the tail past the 1.1 size left alone, and
 * struct_size comes back as the size filled. */
static void course_plan_result_layout(void **state)
{
    union {
        ntr_course_plan_result r;
        unsigned char bytes[sizeof(ntr_course_plan_result) + 64];
    } big;
    const ntr_sample now = {0.0, 150.0};
    const ntr_course_limits lim = course_preset(NTR_COURSE_HYPER_CHRONIC);
    size_t i;
    (void)state;
    assert_int_equal(offsetof(ntr_course_plan_result, struct_size), 0);
    assert_int_equal(offsetof(ntr_course_plan_result, course) + sizeof(ntr_course_report),
                     sizeof(ntr_course_plan_result));
    memset(&big, 0x5a, sizeof big);
    big.r.struct_size = sizeof big;
    assert_int_equal(ntr_course_plan_check(&now, 1, 40.0, NULL, 0, 6.0, 1.0, &lim, &big.r), NTR_OK);
    assert_int_equal(big.r.struct_size, sizeof(ntr_course_plan_result));
    assert_int_equal(big.r.course.struct_size, sizeof(ntr_course_report));
    assert_int_equal(big.r.reserved, 0u);
    for (i = sizeof(ntr_course_plan_result); i < sizeof big; i++) {
        assert_int_equal(big.bytes[i], 0x5a);
    }
}

/* The hypernatraemia plan (invented patient): sodium 165 mmol/L,
 * body water 34 L, 5% dextrose (Na 0, counted as water) at 500 mL/h for
 * 24 h, half-hour grid, chronic hypernatraemia: falls at most 10 mmol/L in
 * any 24 h (Adrogue HJ, Madias NE. Hypernatremia. N Engl J Med
 * 2000;342:1493-9; ../shared/sources.md).
 *
 * Hand-worked mass balance: after t hours 0.5 t L of water has been added
 * and no cation, so Na(t) = 165 x 34 / (34 + 0.5 t) = 5610 / (34 + 0.5 t).
 *   24 h: 5610 / 46 = 121.957 (the "about 122" of the issue), a fall of
 *         43.043, 33.043 over the limit.
 * The series only falls, so the largest 24 h fall into the point at t is
 * 165 - Na(t); it exceeds 10 when Na(t) < 155, i.e. 34 + 0.5 t > 5610/155
 * = 36.1935, t > 4.387 h. On the half-hour grid the first point over is
 * 4.5 h (5610 / 36.25 = 154.759, fall 10.241); at 4.0 h 5610 / 36 =
 * 155.833, fall 9.167. */
static void hypernatraemia_dextrose_plan_breaches_the_fall_limit(void **state)
{
    const ntr_sample now = {0.0, 165.0};
    const ntr_timed_flow plan = ntr_test_timed(0.0, 24.0, 500.0, 0.0, 0.0);
    const ntr_course_limits lim = course_preset(NTR_COURSE_HYPER_CHRONIC);
    ntr_course_plan_result r;
    (void)state;
    assert_int_equal(lim.goal, NTR_GOAL_LOWER);
    assert_true(lim.max_fall_24h == 10.0);
    assert_int_equal(course_plan(&now, 1, 34.0, &plan, 1, 24.0, 0.5, &lim, &r), NTR_OK);
    assert_int_equal(r.struct_size, sizeof r);
    assert_near(r.final_na_mmol_l, 5610.0 / 46.0, 1e-9);
    assert_near(r.final_na_mmol_l, 122.0, 0.05);
    assert_near(r.final_tbw_l, 46.0, 1e-12);
    assert_int_equal(r.points, 48);

    assert_true(r.breach_fall_24h_h == 4.5);
    assert_true(r.breach_rise_24h_h == NTR_PLAN_NO_BREACH);
    assert_true(r.breach_rise_48h_h == NTR_PLAN_NO_BREACH);
    assert_true(r.first_breach_h == 4.5);
    assert_int_equal(r.first_breach_direction, NTR_PLAN_BREACH_FALL);
    assert_int_equal(r.first_breach_flag, NTR_CF_FALL_OVER_24H);

    assert_near(r.course.max_fall_24h, 165.0 - 5610.0 / 46.0, 1e-9);
    assert_near(r.course.max_rise_24h, 0.0, 0.0);
    assert_near(r.course.excess_mmol_l, 165.0 - 5610.0 / 46.0 - 10.0, 1e-9);
    assert_int_equal(r.course.flags & NTR_CF_FALL_OVER_24H, NTR_CF_FALL_OVER_24H);
    assert_int_equal(r.course.flags & (NTR_CF_OVER_24H | NTR_CF_OVER_48H | NTR_CF_WRONG_WAY), 0u);

    /* The 48 h fall limit of the preset, whatever its value, is judged on
     * the same monotone series: the first point with 165 - Na > limit. */
    if (lim.max_fall_48h > 0.0) {
        double expect = NTR_PLAN_NO_BREACH;
        int j;
        for (j = 1; j <= 48; j++) {
            const double t = 0.5 * j;
            if (165.0 - 5610.0 / (34.0 + 0.5 * t) > lim.max_fall_48h + 1e-6) {
                expect = t;
                break;
            }
        }
        assert_true(r.breach_fall_48h_h == expect);
    } else {
        assert_true(r.breach_fall_48h_h == NTR_PLAN_NO_BREACH);
    }

    /* The same plan at a tenth of the rate (50 mL/h, 1.2 L in 24 h):
     * 5610 / 35.2 = 159.375, a fall of 5.625: within the limit. */
    {
        const ntr_timed_flow slow = ntr_test_timed(0.0, 24.0, 50.0, 0.0, 0.0);
        assert_int_equal(course_plan(&now, 1, 34.0, &slow, 1, 24.0, 0.5, &lim, &r), NTR_OK);
        assert_near(r.final_na_mmol_l, 5610.0 / 35.2, 1e-9);
        assert_true(r.breach_fall_24h_h == NTR_PLAN_NO_BREACH);
        assert_true(r.first_breach_h == NTR_PLAN_NO_BREACH);
        assert_int_equal(r.first_breach_direction, NTR_PLAN_BREACH_NONE);
        assert_int_equal(r.first_breach_flag, 0u);
        assert_int_equal(r.course.flags & (NTR_CF_FALL_OVER_24H | NTR_CF_FALL_OVER_48H), 0u);
    }
}

/* A fall already measured counts: 170 at -12 h, 165 now, the same plan.
 * The 24 h window of a point tau hours ahead reaches the 170 while
 * tau <= 12; a fall over 10 from 170 needs Na < 160: 34 + 0.5 t > 35.0625,
 * t > 2.125 h, so 2.5 h on the grid (5610 / 35.25 = 159.149, 10.851 below
 * 170; at 2.0 h 5610 / 35 = 160.286, 9.714). Hand-worked. */
static void measured_fall_counts_against_the_plan(void **state)
{
    const ntr_sample history[2] = {{-12.0, 170.0}, {0.0, 165.0}};
    const ntr_timed_flow plan = ntr_test_timed(0.0, 24.0, 500.0, 0.0, 0.0);
    const ntr_course_limits lim = course_preset(NTR_COURSE_HYPER_CHRONIC);
    ntr_course_plan_result r;
    (void)state;
    assert_int_equal(course_plan(history, 2, 34.0, &plan, 1, 24.0, 0.5, &lim, &r), NTR_OK);
    assert_true(r.breach_fall_24h_h == 2.5);
    assert_true(r.first_breach_h == 2.5);
    assert_int_equal(r.first_breach_direction, NTR_PLAN_BREACH_FALL);
    /* 170 at -12 h to 121.957 at 24 h is 36 h apart: outside 24 h; the
     * largest 24 h fall is still 165 -> 121.957 from time 0, or from 170
     * at -12 h to Na(12) = 5610/40 = 140.25 (29.75): the former wins. */
    assert_near(r.course.max_fall_24h, 165.0 - 5610.0 / 46.0, 1e-9);
}

/* The hyponatraemia plan of bolus_safe_alone_breaches_with_diuresis()
 * (standard limits: 10 in 24 h, 18 in 48 h; Verbalis 2013, Spasovski
 * 2014): the rise breach at 17.5 h (hand-worked there), the same as the
 * 1.0 ntr_plan_check reports; and 12.0 h with the measured rise from 112. */
static void hyponatraemia_plan_breaches_the_rise_limit_as_in_1_0(void **state)
{
    const ntr_sample now = {0.0, 115.0};
    const ntr_sample history[2] = {{-12.0, 112.0}, {0.0, 115.0}};
    const ntr_timed_flow plan[2] = {
        ntr_test_timed(0.0, 2.0 / 3.0, 450.0, 513.0, 0.0),
        ntr_test_timed(4.0, 24.0, -250.0, 30.0, 10.0),
    };
    const ntr_course_limits lim = course_preset(NTR_COURSE_HYPO_STANDARD);
    const ntr_limits old = standard();
    ntr_course_plan_result r;
    ntr_plan_result p;
    (void)state;
    assert_int_equal(course_plan(&now, 1, 40.0, plan, 2, 24.0, 0.5, &lim, &r), NTR_OK);
    assert_int_equal(ntr_plan_check(&now, 1, 40.0, plan, 2, 24.0, 0.5, &old, &p), NTR_OK);
    assert_true(r.breach_rise_24h_h == 17.5);
    assert_true(r.breach_rise_24h_h == p.breach_24h_h);
    assert_true(r.breach_rise_48h_h == NTR_PLAN_NO_BREACH);
    assert_true(r.breach_fall_24h_h == NTR_PLAN_NO_BREACH);
    assert_true(r.breach_fall_48h_h == NTR_PLAN_NO_BREACH);
    assert_true(r.first_breach_h == 17.5);
    assert_int_equal(r.first_breach_direction, NTR_PLAN_BREACH_RISE);
    assert_int_equal(r.first_breach_flag, NTR_CF_OVER_24H);
    assert_near(r.course.max_rise_24h, 494.4 / 35.3, 1e-9);
    assert_near(r.course.excess_mmol_l, 494.4 / 35.3 - 10.0, 1e-9);
    assert_true(r.final_na_mmol_l == p.final_na_mmol_l);
    assert_true(r.final_tbw_l == p.final_tbw_l);
    assert_int_equal(r.points, p.points);

    assert_int_equal(course_plan(history, 2, 40.0, plan, 2, 24.0, 0.5, &lim, &r), NTR_OK);
    assert_true(r.breach_rise_24h_h == 12.0);
    assert_true(r.first_breach_h == 12.0);

    /* A tie: with 10 in 24 h and 10 in 48 h (invented limits) the 24 h
     * plan breaches both at the same point, 17.5 h; the 24 h limit is
     * reported first, as documented. */
    {
        const ntr_course_limits tie = course_limits(NTR_GOAL_RAISE, 10.0, 10.0, 0.0, 0.0, 0.0);
        assert_int_equal(course_plan(&now, 1, 40.0, plan, 2, 24.0, 0.5, &tie, &r), NTR_OK);
        assert_true(r.breach_rise_24h_h == 17.5);
        assert_true(r.breach_rise_48h_h == 17.5);
        assert_true(r.first_breach_h == 17.5);
        assert_int_equal(r.first_breach_flag, NTR_CF_OVER_24H);
    }
}

/* Goal HOLD with limits of 6 mmol/L per 24 h and 12 per 48 h in both
 * directions (invented limits for the test). Invented patient: sodium
 * 140, body water 40 L. Hand-worked mass balance on a 1 h grid:
 * - 3% saline (513) at 100 mL/h: Na = 140 + 37.3 t / (40 + 0.1 t); over 6
 *   when 36.7 t > 240, t > 6.54: 7 h (6.415; at 6 h 5.512).
 * - 5% dextrose at 500 mL/h: Na = 5600 / (40 + 0.5 t); a fall over 6 when
 *   Na < 134, t > 3.58: 4 h (fall 6.667; at 3 h 5.060).
 * - dextrose 500 mL/h for 6 h, then 3% saline at 400 mL/h: the fall as
 *   above to 5600/43 = 130.233 at 6 h (9.767: under 12, no 48 h fall
 *   breach); x hours into the saline Na = (5600 + 205.2 x)/(43 + 0.4 x),
 *   its rise over the 130.233: 6.991 at 8 h (3.528 at 7 h), 13.732 at 10 h
 *   (10.392 at 9 h). So rise 24 h at 8 h, rise 48 h at 10 h, fall 24 h at
 *   4 h: the first breach is the fall. */
static void hold_goal_breaches_either_way(void **state)
{
    const ntr_sample now = {0.0, 140.0};
    const ntr_course_limits lim = course_limits(NTR_GOAL_HOLD, 6.0, 12.0, 6.0, 12.0, 0.0);
    const ntr_timed_flow saline = ntr_test_timed(0.0, 12.0, 100.0, 513.0, 0.0);
    const ntr_timed_flow water = ntr_test_timed(0.0, 12.0, 500.0, 0.0, 0.0);
    const ntr_timed_flow both[2] = {
        ntr_test_timed(0.0, 6.0, 500.0, 0.0, 0.0),
        ntr_test_timed(6.0, 12.0, 400.0, 513.0, 0.0),
    };
    ntr_course_plan_result r;
    (void)state;

    assert_int_equal(course_plan(&now, 1, 40.0, &saline, 1, 12.0, 1.0, &lim, &r), NTR_OK);
    assert_true(r.breach_rise_24h_h == 7.0);
    assert_true(r.breach_fall_24h_h == NTR_PLAN_NO_BREACH);
    assert_true(r.first_breach_h == 7.0);
    assert_int_equal(r.first_breach_direction, NTR_PLAN_BREACH_RISE);
    assert_int_equal(r.first_breach_flag, NTR_CF_OVER_24H);
    assert_near(r.final_na_mmol_l, 140.0 + 37.3 * 12.0 / 41.2, 1e-9);
    assert_int_equal(r.course.flags & NTR_CF_OVER_24H, NTR_CF_OVER_24H);

    assert_int_equal(course_plan(&now, 1, 40.0, &water, 1, 12.0, 1.0, &lim, &r), NTR_OK);
    assert_true(r.breach_fall_24h_h == 4.0);
    assert_true(r.breach_rise_24h_h == NTR_PLAN_NO_BREACH);
    assert_true(r.first_breach_h == 4.0);
    assert_int_equal(r.first_breach_direction, NTR_PLAN_BREACH_FALL);
    assert_int_equal(r.first_breach_flag, NTR_CF_FALL_OVER_24H);
    assert_int_equal(r.course.flags & NTR_CF_FALL_OVER_24H, NTR_CF_FALL_OVER_24H);

    assert_int_equal(course_plan(&now, 1, 40.0, both, 2, 12.0, 1.0, &lim, &r), NTR_OK);
    assert_true(r.breach_fall_24h_h == 4.0);
    assert_true(r.breach_fall_48h_h == NTR_PLAN_NO_BREACH);
    assert_true(r.breach_rise_24h_h == 8.0);
    assert_true(r.breach_rise_48h_h == 10.0);
    assert_true(r.first_breach_h == 4.0);
    assert_int_equal(r.first_breach_direction, NTR_PLAN_BREACH_FALL);
    assert_int_equal(r.first_breach_flag, NTR_CF_FALL_OVER_24H);
    assert_near(r.course.max_fall_24h, 140.0 - 5600.0 / 43.0, 1e-9);
    assert_int_equal(r.course.flags & (NTR_CF_OVER_24H | NTR_CF_OVER_48H | NTR_CF_FALL_OVER_24H),
                     NTR_CF_OVER_24H | NTR_CF_OVER_48H | NTR_CF_FALL_OVER_24H);
    assert_int_equal(r.course.flags & NTR_CF_FALL_OVER_48H, 0u);
}

/* Property: the direction-aware check's report is exactly
 * ntr_course_assess() of the series ntr_balance_course() writes; each
 * breach time is the first point whose prefix assessment carries that
 * limit's flag; the first breach is the earliest of the four; and under
 * the 1.0 limits (raise, no fall limit) the rise breach times equal the
 * 1.0 ntr_plan_check's. Random plans that raise or lower sodium, under a
 * preset or random limits of either goal. */
static void course_plan_equals_course_then_assess(void **state)
{
    static const unsigned int bits[4] = {NTR_CF_OVER_24H, NTR_CF_OVER_48H,
                                         NTR_CF_FALL_OVER_24H, NTR_CF_FALL_OVER_48H};
    int round, rises = 0, falls = 0, clean = 0;
    (void)state;
    for (round = 0; round < 400; round++) {
        static ntr_sample s[400];
        const int hyper = round % 2;
        const ntr_sample now = {0.0, hyper ? rng_in(150.0, 175.0) : rng_in(108.0, 130.0)};
        const double tbw = rng_in(25.0, 50.0);
        ntr_timed_flow plan[3];
        ntr_course_limits lim;
        ntr_course_plan_result r;
        ntr_course_report c;
        double first[4] = {NTR_PLAN_NO_BREACH, NTR_PLAN_NO_BREACH, NTR_PLAN_NO_BREACH,
                           NTR_PLAN_NO_BREACH};
        double times[4];
        double earliest = NTR_PLAN_NO_BREACH;
        unsigned int earliest_bit = 0u;
        size_t count = 0, k;
        int b;
        if (hyper) {
            plan[0] = ntr_test_timed(0.0, 48.0, rng_in(0.0, 600.0), 0.0, 0.0);
            plan[1] = ntr_test_timed(rng_in(0.0, 10.0), 48.0, -rng_in(0.0, 200.0), rng_in(10.0, 60.0), 10.0);
            plan[2] = ntr_test_timed(0.0, rng_in(0.0, 48.0), rng_in(0.0, 150.0), 77.0, 0.0);
            lim = round % 4 == 1 ? course_preset(NTR_COURSE_HYPER_CHRONIC)
                                 : course_limits(NTR_GOAL_LOWER, 0.0, 0.0, rng_in(6.0, 12.0),
                                                 0.0, 0.0);
            if (round % 8 == 3) {
                lim = course_limits(NTR_GOAL_HOLD, 4.0, 8.0, 6.0, 12.0, 0.0);
            }
        } else {
            plan[0] = ntr_test_timed(0.0, rng_in(0.1, 3.0), rng_in(0.0, 500.0), 513.0, 0.0);
            plan[1] = ntr_test_timed(rng_in(0.0, 10.0), 48.0, -rng_in(0.0, 300.0), rng_in(10.0, 60.0), 10.0);
            plan[2] = ntr_test_timed(0.0, 48.0, rng_in(0.0, 80.0), round % 3 == 0 ? 0.0 : 154.0, 0.0);
            lim = round % 4 == 0 ? course_preset(NTR_COURSE_HYPO_STANDARD)
                                 : course_limits(NTR_GOAL_RAISE, 8.0, 16.0, rng_in(3.0, 8.0),
                                                 0.0, 0.0);
        }
        assert_int_equal(course_plan(&now, 1, tbw, plan, 3, 48.0, 0.25, &lim, &r), NTR_OK);
        assert_int_equal(ntr_balance_course(now.na_mmol_l, tbw, plan, 3, 48.0, 0.25, s,
                                            COUNT(s), &count), NTR_OK);
        memset(&c, 0x5a, sizeof c);
        c.struct_size = sizeof c;
        assert_int_equal(ntr_course_assess(s, count, &lim, &c), NTR_OK);
        assert_same_report(&r.course, &c);
        assert_int_equal(r.points, count - 1);
        assert_true(r.final_na_mmol_l == s[count - 1].na_mmol_l);
        for (k = 2; k <= count; k++) {
            ntr_course_report pc;
            memset(&pc, 0, sizeof pc);
            pc.struct_size = sizeof pc;
            assert_int_equal(ntr_course_assess(s, k, &lim, &pc), NTR_OK);
            for (b = 0; b < 4; b++) {
                if ((pc.flags & bits[b]) && first[b] == NTR_PLAN_NO_BREACH) {
                    first[b] = s[k - 1].hours;
                }
            }
        }
        times[0] = r.breach_rise_24h_h;
        times[1] = r.breach_rise_48h_h;
        times[2] = r.breach_fall_24h_h;
        times[3] = r.breach_fall_48h_h;
        for (b = 0; b < 4; b++) {
            assert_true(times[b] == first[b]);
            if (first[b] != NTR_PLAN_NO_BREACH &&
                (earliest == NTR_PLAN_NO_BREACH || first[b] < earliest)) {
                earliest = first[b];
                earliest_bit = bits[b];
            }
        }
        assert_true(r.first_breach_h == earliest);
        assert_int_equal(r.first_breach_flag, earliest_bit);
        assert_int_equal(r.first_breach_direction,
                         earliest_bit == 0u ? NTR_PLAN_BREACH_NONE
                         : earliest_bit <= NTR_CF_OVER_48H ? NTR_PLAN_BREACH_RISE
                                                           : NTR_PLAN_BREACH_FALL);
        rises += earliest_bit == NTR_CF_OVER_24H || earliest_bit == NTR_CF_OVER_48H;
        falls += earliest_bit == NTR_CF_FALL_OVER_24H || earliest_bit == NTR_CF_FALL_OVER_48H;
        clean += earliest_bit == 0u;

        if (!hyper) {
            /* The 1.0 check on the 1.0 limits: the same rise breaches. */
            const ntr_limits old = standard();
            const ntr_course_limits same = course_from_1_0(&old);
            ntr_plan_result p;
            assert_int_equal(ntr_plan_check(&now, 1, tbw, plan, 3, 48.0, 0.25, &old, &p), NTR_OK);
            assert_int_equal(course_plan(&now, 1, tbw, plan, 3, 48.0, 0.25, &same, &r), NTR_OK);
            assert_true(r.breach_rise_24h_h == p.breach_24h_h);
            assert_true(r.breach_rise_48h_h == p.breach_48h_h);
            assert_true(r.breach_fall_24h_h == NTR_PLAN_NO_BREACH);
            assert_true(r.final_na_mmol_l == p.final_na_mmol_l);
            assert_true(r.course.max_rise_24h == p.course.max_rise_24h);
            assert_true(r.course.max_rise_48h == p.course.max_rise_48h);
            assert_int_equal(r.course.flags & 0x7fu & ~(unsigned int)NTR_CF_BELOW_TARGET,
                             p.course.flags & ~(unsigned int)NTR_CF_BELOW_TARGET);
        }
    }
    /* The random plans breach up, breach down, and stay within. */
    assert_true(rises > 20);
    assert_true(falls > 20);
    assert_true(clean > 20);
}

static void course_plan_rejects_bad_inputs(void **state)
{
    const ntr_sample now[2] = {{-2.0, 160.0}, {0.0, 158.0}};
    const ntr_timed_flow plan = ntr_test_timed(0.0, 2.0, 100.0, 0.0, 0.0);
    ntr_course_limits lim = course_preset(NTR_COURSE_HYPER_CHRONIC);
    ntr_course_plan_result r = course_plan_blank(), ref;
    (void)state;
    memcpy(&ref, &r, sizeof r);
    assert_int_equal(ntr_course_plan_check(NULL, 1, 40.0, &plan, 1, 24.0, 1.0, &lim, &r), NTR_ERR_NULL);
    assert_int_equal(ntr_course_plan_check(now, 2, 40.0, NULL, 1, 24.0, 1.0, &lim, &r), NTR_ERR_NULL);
    assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &plan, 1, 24.0, 1.0, NULL, &r), NTR_ERR_NULL);
    assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &plan, 1, 24.0, 1.0, &lim, NULL), NTR_ERR_NULL);
    /* No flows is a plan (nothing given): fine with flows NULL. */
    {
        ntr_course_plan_result ok = course_plan_blank();
        assert_int_equal(ntr_course_plan_check(now, 2, 40.0, NULL, 0, 24.0, 1.0, &lim, &ok), NTR_OK);
        assert_true(ok.final_na_mmol_l == 158.0);
        assert_true(ok.first_breach_h == NTR_PLAN_NO_BREACH);
    }
    assert_int_equal(ntr_course_plan_check(now, 0, 40.0, &plan, 1, 24.0, 1.0, &lim, &r), NTR_ERR_ARG);
    {
        ntr_timed_flow f = plan;
        f.reserved[1] = 3u;
        assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &f, 1, 24.0, 1.0, &lim, &r), NTR_ERR_ARG);
    }
    /* The result's struct_size must be one the library knows. */
    {
        ntr_course_plan_result small = r;
        small.struct_size = sizeof small - 1;
        assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &plan, 1, 24.0, 1.0, &lim, &small),
                         NTR_ERR_ARG);
        assert_true(small.struct_size == sizeof small - 1);
        small.struct_size = 0;
        assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &plan, 1, 24.0, 1.0, &lim, &small),
                         NTR_ERR_ARG);
    }
    /* Limits: an unknown goal, a wrong struct_size, a non-finite limit. */
    lim.goal = 7;
    assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &plan, 1, 24.0, 1.0, &lim, &r), NTR_ERR_ARG);
    lim = course_preset(NTR_COURSE_HYPER_CHRONIC);
    lim.struct_size = 3;
    assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &plan, 1, 24.0, 1.0, &lim, &r), NTR_ERR_ARG);
    lim = course_preset(NTR_COURSE_HYPER_CHRONIC);
    lim.max_fall_24h = (double)NAN;
    assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &plan, 1, 24.0, 1.0, &lim, &r),
                     NTR_ERR_NONFINITE);
    lim.max_fall_24h = -1.0;
    assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &plan, 1, 24.0, 1.0, &lim, &r), NTR_ERR_RANGE);
    lim = course_preset(NTR_COURSE_HYPER_CHRONIC);
    {
        ntr_sample h[2] = {{-2.0, 160.0}, {0.0, HUGE_VAL}};
        assert_int_equal(ntr_course_plan_check(h, 2, 40.0, &plan, 1, 24.0, 1.0, &lim, &r),
                         NTR_ERR_NONFINITE);
        h[1].na_mmol_l = 230.0;
        assert_int_equal(ntr_course_plan_check(h, 2, 40.0, &plan, 1, 24.0, 1.0, &lim, &r), NTR_ERR_RANGE);
        h[1].na_mmol_l = 158.0;
        h[1].hours = -3.0;
        assert_int_equal(ntr_course_plan_check(h, 2, 40.0, &plan, 1, 24.0, 1.0, &lim, &r), NTR_ERR_ORDER);
        /* Every numeric error outranks the time order. */
        assert_int_equal(ntr_course_plan_check(h, 2, (double)NAN, &plan, 1, 24.0, 1.0, &lim, &r),
                         NTR_ERR_NONFINITE);
    }
    assert_int_equal(ntr_course_plan_check(now, 2, 0.05, &plan, 1, 24.0, 1.0, &lim, &r), NTR_ERR_RANGE);
    assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &plan, 1, -HUGE_VAL, 1.0, &lim, &r),
                     NTR_ERR_NONFINITE);
    assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &plan, 1, 0.0, 1.0, &lim, &r), NTR_ERR_RANGE);
    assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &plan, 1, 24.0, 0.001, &lim, &r), NTR_ERR_RANGE);
    {
        ntr_timed_flow f = plan;
        f.rate_ml_h = (double)NAN;
        assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &f, 1, 24.0, 1.0, &lim, &r),
                         NTR_ERR_NONFINITE);
        f = ntr_test_timed(4.0, 3.0, 100.0, 0.0, 0.0);
        assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &f, 1, 24.0, 1.0, &lim, &r), NTR_ERR_ORDER);
        /* Domain: 5 L/h of urine for 10 h empties a 40 L body. */
        f = ntr_test_timed(0.0, 10.0, -5000.0, 50.0, 0.0);
        assert_int_equal(ntr_course_plan_check(now, 2, 40.0, &f, 1, 24.0, 1.0, &lim, &r), NTR_ERR_DOMAIN);
        /* Domain: 3% saline at 5 L/h for 12 h into 10 L passes 220. */
        f = ntr_test_timed(0.0, 12.0, 5000.0, 513.0, 0.0);
        assert_int_equal(ntr_course_plan_check(now, 2, 10.0, &f, 1, 12.0, 1.0, &lim, &r), NTR_ERR_DOMAIN);
    }
    assert_memory_equal(&r, &ref, sizeof r);
}

/* ---- ntr_relower_estimate ---------------------------------------------------------- */

/* Overcorrected to 131 mmol/L, TBW 40 L, lower by 3 (target 128) with 5%
 * dextrose (Na 0) over 6 h:
 *   no urine: V = 3*40 / (128 - 0) = 0.9375 L, 156.25 mL/h; this is the
 *   Adrogue-Madias inverse (P1's ntr_infusate_volume_for_change, -3);
 *   with urine 100 mL/h (0.6 L) of Na + K 50:
 *   V = (3*40 + 0.6*(128 - 50)) / 128 = 166.8/128 = 1.303125 L. */
static void relower_hand_worked(void **state)
{
    double v = NTR_TEST_SENTINEL, rate = NTR_TEST_SENTINEL, p1 = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_relower_estimate(131.0, 40.0, 0.0, 0.0, 3.0, 6.0, 0.0, 0.0, 0.0, &v, &rate),
                     NTR_OK);
    assert_near(v, 0.9375, 1e-12);
    assert_near(rate, 156.25, 1e-9);
    assert_int_equal(ntr_infusate_volume_for_change(131.0, 40.0, 0.0, 0.0, -3.0, &p1), NTR_OK);
    assert_near(v, p1, 1e-12);
    assert_int_equal(ntr_relower_estimate(131.0, 40.0, 0.0, 0.0, 3.0, 6.0, 100.0, 40.0, 10.0, &v, &rate),
                     NTR_OK);
    assert_near(v, 1.303125, 1e-12);
    assert_near(rate, 1303.125 / 6.0, 1e-9);
}

/* Source: Adrogue & Madias 2000 (per-litre formula): 1 L of 5% dextrose
 * changes sodium by (0 - Na)/(TBW + 1). So lowering by Na/(TBW + 1) takes
 * exactly 1 L: for 131 and 40 L, 131/41 = 3.195 mmol/L per litre. */
static void relower_one_litre_of_dextrose(void **state)
{
    double v, rate, per_litre = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_infusate_change_per_litre(131.0, 40.0, 0.0, 0.0, &per_litre), NTR_OK);
    assert_near(per_litre, -131.0 / 41.0, 1e-12);
    assert_int_equal(ntr_relower_estimate(131.0, 40.0, 0.0, 0.0, -per_litre, 2.0, 0.0, 0.0, 0.0,
                                          &v, &rate),
                     NTR_OK);
    assert_near(v, 1.0, 1e-12);
}

/* Round trip: giving the estimated volume alongside the expected urine, by
 * ntr_balance_predict, lands on the target, for random cases and fluids
 * (5% dextrose, 0.2% saline in dextrose, 0.45% saline). */
static void relower_round_trip(void **state)
{
    const double fluids[3] = {0.0, 34.0, 77.0};
    int i;
    (void)state;
    for (i = 0; i < 3000; i++) {
        const double na = rng_in(125.0, 150.0), tbw = rng_in(20.0, 60.0);
        const double d = rng_in(0.5, 8.0), hours = rng_in(1.0, 24.0);
        const double urine = rng_in(0.0, 300.0), u_na = rng_in(5.0, 80.0), u_k = rng_in(0.0, 40.0);
        const double c = fluids[i % 3];
        double v, rate;
        int st = ntr_relower_estimate(na, tbw, c, 0.0, d, hours, urine, u_na, u_k, &v, &rate);
        if (st == NTR_ERR_DOMAIN) {
            continue; /* more than 20 L: not a plan */
        }
        assert_int_equal(st, NTR_OK);
        {
            ntr_flow f[2] = {{v, c, 0.0}, {-urine / 1000.0 * hours, u_na, u_k}};
            assert_near(predict_na(na, tbw, f, 2), na - d, 1e-9);
            assert_near(rate, v / hours * 1000.0, 1e-9);
        }
    }
}

static void relower_edges_and_bad_inputs(void **state)
{
    double v = NTR_TEST_SENTINEL, rate = NTR_TEST_SENTINEL;
    (void)state;
    /* Concentrated urine (Na + K 300) at 500 mL/h for 10 h lowers sodium
     * by itself: 5 L * (130 - 300) outweighs 1 * 40: no fluid needed. */
    assert_int_equal(ntr_relower_estimate(131.0, 40.0, 0.0, 0.0, 1.0, 10.0, 500.0, 200.0, 100.0,
                                          &v, &rate),
                     NTR_OK);
    assert_true(v == 0.0 && rate == 0.0);
    v = rate = NTR_TEST_SENTINEL;
    /* The 20 L cap of one plan step (NTR_INFUSE_VOLUME_MAX) is inclusive.
     * Mass balance (Adrogue & Madias 2000): lowering 150 by 10 in 280 L
     * with water takes 10 * 280 / 140 = 20 L exactly (over 24 h, 20/24 L/h);
     * in a hair more body water it takes more than 20 L and is refused. */
    assert_int_equal(ntr_relower_estimate(150.0, 280.0, 0.0, 0.0, 10.0, 24.0, 0.0, 0.0, 0.0,
                                          &v, &rate),
                     NTR_OK);
    assert_true(v == 20.0);
    assert_near(rate, 20000.0 / 24.0, 1e-9);
    v = rate = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_relower_estimate(150.0, nextafter(280.0, 400.0), 0.0, 0.0, 10.0, 24.0,
                                          0.0, 0.0, 0.0, &v, &rate),
                     NTR_ERR_DOMAIN);
    assert_true(v == NTR_TEST_SENTINEL && rate == NTR_TEST_SENTINEL);
    /* 0.9% saline (154) cannot lower 131. */
    assert_int_equal(ntr_relower_estimate(131.0, 40.0, 154.0, 0.0, 3.0, 6.0, 0.0, 0.0, 0.0, &v, &rate),
                     NTR_ERR_DOMAIN);
    /* Fluid equal to the target: never gets there. */
    assert_int_equal(ntr_relower_estimate(131.0, 40.0, 124.0, 4.0, 3.0, 6.0, 0.0, 0.0, 0.0, &v, &rate),
                     NTR_ERR_DOMAIN);
    /* Target below 80. */
    assert_int_equal(ntr_relower_estimate(100.0, 40.0, 0.0, 0.0, 25.0, 6.0, 0.0, 0.0, 0.0, &v, &rate),
                     NTR_ERR_DOMAIN);
    /* More than 20 L. */
    assert_int_equal(ntr_relower_estimate(131.0, 300.0, 0.0, 0.0, 10.0, 6.0, 0.0, 0.0, 0.0, &v, &rate),
                     NTR_ERR_DOMAIN);
    assert_int_equal(ntr_relower_estimate(131.0, 40.0, 0.0, 0.0, 3.0, 6.0, 0.0, 0.0, 0.0, NULL, &rate),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_relower_estimate(131.0, 40.0, 0.0, 0.0, 3.0, 6.0, 0.0, 0.0, 0.0, &v, NULL),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_relower_estimate(131.0, 40.0, 0.0, 0.0, 0.0, 6.0, 0.0, 0.0, 0.0, &v, &rate),
                     NTR_ERR_RANGE);
    assert_int_equal(ntr_relower_estimate(131.0, 40.0, 0.0, 0.0, 3.0, 0.01, 0.0, 0.0, 0.0, &v, &rate),
                     NTR_ERR_RANGE);
    assert_int_equal(ntr_relower_estimate(131.0, 40.0, 0.0, 0.0, 3.0, 6.0, -1.0, 0.0, 0.0, &v, &rate),
                     NTR_ERR_RANGE);
    assert_true(v == NTR_TEST_SENTINEL && rate == NTR_TEST_SENTINEL);
}

/* Every numeric input: NaN, +-inf, just outside its range (the shared
 * walker also checks argument order). */
static int relower_call(const double *a, double *out)
{
    double rate;
    return ntr_relower_estimate(a[0], a[1], a[2], a[3], a[4], a[5], a[6], a[7], a[8], out, &rate);
}

/* The shared walker passes NTR_TEST_MAX_ARGS (6) inputs: the urine ones
 * are fixed here. */
static int relower_call_first6(const double *a, double *out)
{
    const double all[9] = {a[0], a[1], a[2], a[3], a[4], a[5], 100.0, 40.0, 10.0};
    return relower_call(all, out);
}

static void relower_walk_inputs(void **state)
{
    /* The shared walker handles up to NTR_TEST_MAX_ARGS inputs: walk the
     * first six, then the last three with the others fixed. */
    struct ntr_test_inputs first = {
        relower_call_first6, 6,
        {131.0, 40.0, 0.0, 0.0, 3.0, 6.0},
        {80.0, 0.1, 0.0, 0.0, 0.0, 1.0 / 60.0},
        {220.0, 400.0, 1100.0, 400.0, 50.0, 720.0},
    };
    const double nonfinite[3] = {(double)NAN, HUGE_VAL, -HUGE_VAL};
    const double lo[3] = {0.0, 0.0, 0.0}, hi[3] = {5000.0, 500.0, 300.0};
    size_t i, k;
    (void)state;
    /* The fall must be above 0: its range starts at the smallest positive
     * double. */
    first.lo[4] = nextafter(0.0, 1.0);
    ntr_test_bad_inputs(&first);
    for (i = 0; i < 3; i++) {
        double a[9] = {131.0, 40.0, 0.0, 0.0, 3.0, 6.0, 100.0, 40.0, 10.0};
        double out = NTR_TEST_SENTINEL;
        for (k = 0; k < 3; k++) {
            a[6 + i] = nonfinite[k];
            assert_int_equal(relower_call(a, &out), NTR_ERR_NONFINITE);
        }
        a[6 + i] = nextafter(lo[i], -HUGE_VAL);
        assert_int_equal(relower_call(a, &out), NTR_ERR_RANGE);
        a[6 + i] = nextafter(hi[i], HUGE_VAL);
        assert_int_equal(relower_call(a, &out), NTR_ERR_RANGE);
        assert_true(out == NTR_TEST_SENTINEL);
    }
}

/* Aliasing rule (include/natremia.h, "Overlapping buffers"): the course is
 * written while the flows are read, so a series buffer or count that
 * shares a byte with the flows (or with each other) is refused with
 * NTR_ERR_ARG and nothing is written; a buffer that merely touches the end
 * of another is fine. Before the check, a series over the flows returned
 * NTR_OK with other numbers. One malloc'd block holds every buffer. */
static void course_refuses_overlapping_buffers(void **state)
{
    const ntr_timed_flow f = ntr_test_timed(0.0, 3.0, 100.0, 513.0, 0.0);
    const size_t block = 1024;
    unsigned char *m = malloc(block);
    unsigned char *before = malloc(block);
    ntr_sample want[4];
    ntr_timed_flow *flows;
    size_t want_count = 0, *count;
    (void)state;
    assert_non_null(m);
    assert_non_null(before);
    assert_int_equal(ntr_balance_course(115.0, 40.0, &f, 1, 3.0, 1.0, want, 4, &want_count),
                     NTR_OK);
    memset(m, 0x5a, block);
    flows = (ntr_timed_flow *)(void *)m;
    *flows = f;
    memcpy(before, m, block);
    /* Series from the flow's first byte, and from its last double. */
    assert_int_equal(ntr_balance_course(115.0, 40.0, flows, 1, 3.0, 1.0,
                                        (ntr_sample *)(void *)m, 4, &want_count),
                     NTR_ERR_ARG);
    assert_int_equal(ntr_balance_course(115.0, 40.0, flows, 1, 3.0, 1.0,
                                        (ntr_sample *)(void *)(m + sizeof f - 8), 4,
                                        &want_count),
                     NTR_ERR_ARG);
    /* The series ending one byte into the flow (it starts before it). */
    assert_int_equal(ntr_balance_course(115.0, 40.0, (ntr_timed_flow *)(void *)(m + 64), 1,
                                        3.0, 1.0, (ntr_sample *)(void *)(m + 64 + 8 - 4 * 16),
                                        4, &want_count),
                     NTR_ERR_ARG);
    /* count inside the flow; count inside the series. */
    assert_int_equal(ntr_balance_course(115.0, 40.0, flows, 1, 3.0, 1.0,
                                        (ntr_sample *)(void *)(m + 256), 4,
                                        (size_t *)(void *)(m + 16)),
                     NTR_ERR_ARG);
    assert_int_equal(ntr_balance_course(115.0, 40.0, flows, 1, 3.0, 1.0,
                                        (ntr_sample *)(void *)(m + 256), 4,
                                        (size_t *)(void *)(m + 256 + 3 * 16 + 8)),
                     NTR_ERR_ARG);
    assert_memory_equal(m, before, block);
    assert_int_equal(want_count, 4);
    /* Touching is not overlapping: series right after the flow, count
     * right after the series; the same points as from separate buffers. */
    count = (size_t *)(void *)(m + sizeof f + 4 * 16);
    assert_int_equal(ntr_balance_course(115.0, 40.0, flows, 1, 3.0, 1.0,
                                        (ntr_sample *)(void *)(m + sizeof f), 4, count),
                     NTR_OK);
    assert_int_equal(*count, 4);
    assert_memory_equal(m + sizeof f, want, sizeof want);
    free(m);
    free(before);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(struct_layouts_are_as_specified),
        cmocka_unit_test(furst_worked_example),
        cmocka_unit_test(adrogue_madias_example),
        cmocka_unit_test(one_litre_equals_adrogue_madias),
        cmocka_unit_test(urine_loss_agrees_with_efwc),
        cmocka_unit_test(balance_properties),
        cmocka_unit_test(balance_rejects_bad_inputs),
        cmocka_unit_test(course_hand_worked),
        cmocka_unit_test(course_grid),
        cmocka_unit_test(course_end_equals_balance),
        cmocka_unit_test(course_capacity_and_bad_inputs),
        cmocka_unit_test(bolus_safe_alone_breaches_with_diuresis),
        cmocka_unit_test(measured_history_counts_against_the_plan),
        cmocka_unit_test(plan_check_equals_course_then_assess),
        cmocka_unit_test(plan_check_rejects_bad_inputs),
        cmocka_unit_test(course_plan_result_layout),
        cmocka_unit_test(hypernatraemia_dextrose_plan_breaches_the_fall_limit),
        cmocka_unit_test(measured_fall_counts_against_the_plan),
        cmocka_unit_test(hyponatraemia_plan_breaches_the_rise_limit_as_in_1_0),
        cmocka_unit_test(hold_goal_breaches_either_way),
        cmocka_unit_test(course_plan_equals_course_then_assess),
        cmocka_unit_test(course_plan_rejects_bad_inputs),
        cmocka_unit_test(relower_hand_worked),
        cmocka_unit_test(relower_one_litre_of_dextrose),
        cmocka_unit_test(relower_round_trip),
        cmocka_unit_test(relower_edges_and_bad_inputs),
        cmocka_unit_test(relower_walk_inputs),
        cmocka_unit_test(course_refuses_overlapping_buffers),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
