/* Predicting a fluid plan: ntr_balance_predict, ntr_balance_course,
 * ntr_plan_check and ntr_relower_estimate (docs/balance.md).
 *
 * Patients and plans below are invented examples. */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
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

static ntr_timed_flow timed(double start, double end, double rate, double na, double k)
{
    ntr_timed_flow f;
    memset(&f, 0, sizeof f);
    f.start_h = start;
    f.end_h = end;
    f.rate_ml_h = rate;
    f.na_mmol_l = na;
    f.k_mmol_l = k;
    return f;
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
    const ntr_timed_flow f = timed(0.0, 3.0, 100.0, 513.0, 0.0);
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
        f[0] = timed(rng_in(0.0, 10.0), 0.0, rng_in(0.0, 30.0), 513.0, 0.0);
        f[0].end_h = f[0].start_h + rng_in(0.0, 40.0);
        f[1] = timed(rng_in(0.0, 5.0), 0.0, -rng_in(0.0, 100.0), rng_in(10.0, 100.0), rng_in(0.0, 40.0));
        f[1].end_h = f[1].start_h + rng_in(0.0, 50.0);
        f[2] = timed(0.0, rng_in(0.0, 60.0), rng_in(0.0, 100.0), 0.0, 0.0);
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
    const ntr_timed_flow good = timed(0.0, 3.0, 100.0, 513.0, 0.0);
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
        ntr_timed_flow f = timed(5.0, 4.0, 100.0, 513.0, 0.0);
        assert_int_equal(ntr_balance_course(115.0, 40.0, &f, 1, 3.0, 1.0, s, 3, &count), NTR_ERR_ORDER);
        /* Domain: 5 L/h of urine for 10 h empties a 40 L body. */
        f = timed(0.0, 10.0, -5000.0, 50.0, 0.0);
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
        timed(0.0, 2.0 / 3.0, 450.0, 513.0, 0.0),
        timed(4.0, 24.0, -250.0, 30.0, 10.0),
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
        timed(0.0, 2.0 / 3.0, 450.0, 513.0, 0.0),
        timed(4.0, 24.0, -250.0, 30.0, 10.0),
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
        plan[0] = timed(0.0, rng_in(0.1, 3.0), rng_in(0.0, 500.0), 513.0, 0.0);
        plan[1] = timed(rng_in(0.0, 10.0), 48.0, -rng_in(0.0, 300.0), rng_in(10.0, 60.0), 10.0);
        plan[2] = timed(0.0, 48.0, rng_in(0.0, 80.0), 154.0, 0.0);
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
    const ntr_timed_flow plan = timed(0.0, 2.0, 100.0, 513.0, 0.0);
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
        ntr_timed_flow f = timed(0.0, 20.0, -3000.0, 50.0, 0.0);
        assert_int_equal(ntr_plan_check(now, 2, 40.0, &f, 1, 24.0, 1.0, &lim, &r), NTR_ERR_DOMAIN);
        f = timed(3.0, 2.0, 100.0, 513.0, 0.0);
        assert_int_equal(ntr_plan_check(now, 2, 40.0, &f, 1, 24.0, 1.0, &lim, &r), NTR_ERR_ORDER);
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
        cmocka_unit_test(relower_hand_worked),
        cmocka_unit_test(relower_one_litre_of_dextrose),
        cmocka_unit_test(relower_round_trip),
        cmocka_unit_test(relower_edges_and_bad_inputs),
        cmocka_unit_test(relower_walk_inputs),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
