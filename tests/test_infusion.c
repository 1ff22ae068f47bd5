/* SPDX-License-Identifier: MIT */
/* Infusates: ntr_fluid_preset, ntr_infusate_change_per_litre,
 * ntr_infusate_change, ntr_infusate_volume_for_change (docs/infusion.md). */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <cmocka.h>

#include "natremia_test.h"

static double per_litre(double na, double tbw, double inf_na, double inf_k)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_infusate_change_per_litre(na, tbw, inf_na, inf_k, &out), NTR_OK);
    return out;
}

static double change(double na, double tbw, double inf_na, double inf_k, double volume)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_infusate_change(na, tbw, inf_na, inf_k, volume, &out), NTR_OK);
    return out;
}

static double volume_for(double na, double tbw, double inf_na, double inf_k, double target)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_infusate_volume_for_change(na, tbw, inf_na, inf_k, target, &out), NTR_OK);
    return out;
}

/* ---- ntr_fluid_preset ----------------------------------------------------- */

/* Source: Adrogue HJ, Madias NE, N Engl J Med 2000;342:1581-9, table of
 * infusates (sodium, mmol/L): 5% NaCl 855, 3% NaCl 513, 0.9% NaCl 154,
 * Ringer's lactate 130, 0.45% NaCl 77, 0.2% NaCl in 5% dextrose 34,
 * 5% dextrose 0. Potassium 4 mmol/L in Ringer's lactate is the usual
 * US Pharmacopeia composition (common practice). */
static void preset_matches_the_published_table(void **state)
{
    static const struct {
        int fluid;
        double na, k;
    } table[] = {
        {NTR_FLUID_NACL_0_9, 154.0, 0.0},  {NTR_FLUID_NACL_3, 513.0, 0.0},
        {NTR_FLUID_NACL_5, 855.0, 0.0},    {NTR_FLUID_NACL_0_45, 77.0, 0.0},
        {NTR_FLUID_RINGER_LACTATE, 130.0, 4.0}, {NTR_FLUID_DEXTROSE_5, 0.0, 0.0},
        {NTR_FLUID_NACL_0_2_DEXTROSE_5, 34.0, 0.0},
    };
    size_t i;
    (void)state;
    for (i = 0; i < sizeof table / sizeof table[0]; i++) {
        double na = NTR_TEST_SENTINEL, k = NTR_TEST_SENTINEL;
        assert_int_equal(ntr_fluid_preset(table[i].fluid, &na, &k), NTR_OK);
        assert_true(na == table[i].na);
        assert_true(k == table[i].k);
    }
}

/* Property: each saline's sodium is its w/v strength in g/L divided by the
 * molar mass of NaCl (IUPAC: 22.990 + 35.45 = 58.44 g/mol), rounded down
 * to whole mmol/L as tables print it (so within 1 mmol/L below). */
static void preset_salines_follow_from_their_strength(void **state)
{
    static const struct {
        int fluid;
        double percent;
    } salines[] = {
        {NTR_FLUID_NACL_0_9, 0.9}, {NTR_FLUID_NACL_3, 3.0}, {NTR_FLUID_NACL_5, 5.0},
        {NTR_FLUID_NACL_0_45, 0.45}, {NTR_FLUID_NACL_0_2_DEXTROSE_5, 0.2},
    };
    size_t i;
    (void)state;
    for (i = 0; i < sizeof salines / sizeof salines[0]; i++) {
        double na = NTR_TEST_SENTINEL, k = NTR_TEST_SENTINEL;
        double from_strength = salines[i].percent * 10.0 * 1000.0 / 58.44;
        assert_int_equal(ntr_fluid_preset(salines[i].fluid, &na, &k), NTR_OK);
        assert_true(na <= from_strength);
        assert_true(from_strength - na < 1.0);
    }
}

static void preset_bad_inputs_leave_outputs_untouched(void **state)
{
    static const int unknown[] = {0, 8, -1, 100};
    double na = NTR_TEST_SENTINEL, k = NTR_TEST_SENTINEL;
    size_t i;
    (void)state;
    assert_int_equal(ntr_fluid_preset(NTR_FLUID_NACL_3, NULL, &k), NTR_ERR_NULL);
    assert_int_equal(ntr_fluid_preset(NTR_FLUID_NACL_3, &na, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_fluid_preset(0, NULL, NULL), NTR_ERR_NULL);
    for (i = 0; i < sizeof unknown / sizeof unknown[0]; i++) {
        assert_int_equal(ntr_fluid_preset(unknown[i], &na, &k), NTR_ERR_ARG);
    }
    assert_true(na == NTR_TEST_SENTINEL);
    assert_true(k == NTR_TEST_SENTINEL);
}

/* ---- ntr_infusate_change_per_litre --------------------------------------- */

/* Source: Adrogue & Madias 2000, change = (infusate Na + K - serum Na) /
 * (TBW + 1). Hand-worked with the published formula and table:
 * Na 108, TBW 30 L, 3% NaCl: 405/31 = 13.06;
 * Na 160, TBW 35 L, 5% dextrose: -160/36 = -4.44;
 * Na 160, TBW 35 L, 0.45% NaCl: -83/36 = -2.31;
 * Na 120, TBW 40 L, Ringer's lactate: (130 + 4 - 120)/41 = 0.341. */
static void per_litre_worked_examples(void **state)
{
    (void)state;
    assert_near(per_litre(108.0, 30.0, 513.0, 0.0), 13.06, 0.005);
    assert_near(per_litre(160.0, 35.0, 0.0, 0.0), -4.44, 0.005);
    assert_near(per_litre(160.0, 35.0, 77.0, 0.0), -2.31, 0.005);
    assert_near(per_litre(120.0, 40.0, 130.0, 4.0), 0.341, 0.0005);
}

/* Property: potassium counts like sodium (Adrogue & Madias): 1 L of saline
 * with 40 mmol/L KCl changes sodium as saline 40 mmol/L stronger would. */
static void per_litre_potassium_counts_like_sodium(void **state)
{
    (void)state;
    assert_near(per_litre(118.0, 33.0, 154.0, 40.0), per_litre(118.0, 33.0, 194.0, 0.0), 1e-12);
}

static int call_per_litre(const double *a, double *out)
{
    return ntr_infusate_change_per_litre(a[0], a[1], a[2], a[3], out);
}

static void per_litre_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges: Na 80-220, TBW 0.1-400 L, infusate Na 0-1100, K 0-400. */
    const struct ntr_test_inputs in = {call_per_litre, 4, {120.0, 30.0, 513.0, 0.0},
                                       {80.0, 0.1, 0.0, 0.0}, {220.0, 400.0, 1100.0, 400.0}};
    (void)state;
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_infusate_change_per_litre(120.0, 30.0, 513.0, 0.0, NULL), NTR_ERR_NULL);
}

/* ---- ntr_infusate_change --------------------------------------------------- */

/* Source: Furst H et al., Am J Med Sci 2000;319:240-4, worked example
 * (checked against the paper), the forward step only: the paper
 * wanted a rise of 5 from 108 in a body water of 30 L and sized the dose
 * by the sodium-deficit step, 5 x 30 = 150 mmol / 513 mmol/L = 292 mL of
 * 3% saline; its own mass-balance check then gives about 112, a rise of
 * about 3.9. Hand-worked: 0.29240 x 405 / 30.29240 = 3.9093. "About 112"
 * is taken as within 0.5 mmol/L. */
static void change_furst_worked_example(void **state)
{
    double deficit = NTR_TEST_SENTINEL;
    double dose_l;
    (void)state;
    assert_int_equal(ntr_na_deficit(30.0, 108.0, 113.0, &deficit), NTR_OK);
    assert_near(deficit, 150.0, 1e-12);
    dose_l = deficit / 513.0;
    assert_near(dose_l, 0.292, 0.0005);
    assert_near(change(108.0, 30.0, 513.0, 0.0, dose_l), 3.9093, 0.0001);
    assert_near(108.0 + change(108.0, 30.0, 513.0, 0.0, dose_l), 112.0, 0.5);
    /* The deficit step under-doses: it ignores the water given with the
     * salt, so the rise falls short of the 5 wanted. */
    assert_true(change(108.0, 30.0, 513.0, 0.0, dose_l) < 5.0 - 1.0);
}

/* Property: at V = 1 L the mass balance equals Adrogue-Madias per litre
 * (two separately written expressions), over a grid; where the predicted
 * sodium leaves 80 to 220, or body water after leaves 0.1 to 400 L, both
 * refuse it (NTR_ERR_DOMAIN), as ntr_balance_predict() refuses the same
 * 1 L flow. */
static void change_at_one_litre_equals_per_litre(void **state)
{
    static const double na[] = {80.0, 108.0, 125.0, 160.0, 220.0};
    static const double tbw[] = {0.1, 5.0, 30.0, 42.0, 400.0};
    static const double inf_na[] = {0.0, 34.0, 154.0, 513.0, 1100.0};
    size_t i, j, k, refused = 0;
    (void)state;
    for (i = 0; i < 5; i++) {
        for (j = 0; j < 5; j++) {
            for (k = 0; k < 5; k++) {
                double a = NTR_TEST_SENTINEL, b = NTR_TEST_SENTINEL;
                double na1 = NTR_TEST_SENTINEL, tbw1 = NTR_TEST_SENTINEL;
                ntr_flow flow;
                int sa = ntr_infusate_change(na[i], tbw[j], inf_na[k], 4.0, 1.0, &a);
                int sb = ntr_infusate_change_per_litre(na[i], tbw[j], inf_na[k], 4.0, &b);
                /* The mass balance, written out. */
                double predicted = (na[i] * tbw[j] + (inf_na[k] + 4.0)) / (tbw[j] + 1.0);
                int inside = predicted >= 80.0 && predicted <= 220.0 && tbw[j] + 1.0 <= 400.0;
                flow.volume_l = 1.0;
                flow.na_mmol_l = inf_na[k];
                flow.k_mmol_l = 4.0;
                assert_int_equal(sa, sb);
                assert_int_equal(sa,
                                 ntr_balance_predict(na[i], tbw[j], &flow, 1, &na1, &tbw1));
                if (sa == NTR_OK) {
                    assert_true(inside);
                    assert_near(a, b, 1e-12 * (1.0 + fabs(b)));
                } else {
                    assert_int_equal(sa, NTR_ERR_DOMAIN);
                    assert_false(inside);
                    assert_true(a == NTR_TEST_SENTINEL && b == NTR_TEST_SENTINEL);
                    refused++;
                }
            }
        }
    }
    /* The grid reaches both sides: e.g. Na 80, TBW 0.1 L, 1 L of water
     * (about 7) and Na 220, TBW 42 L, 1100 + 4 (about 240). */
    assert_true(refused > 0);
}

/* ntr_infusate_change refuses what ntr_balance_predict refuses: 20 L of 3%
 * saline on Na 140 and TBW 40 L predicts 140 + 20 x 373 / 60 = 264.3
 * (hand-worked), above 220; 1 L of 5% dextrose on Na 85 and TBW 1 L
 * predicts 42.5. Both functions give NTR_ERR_DOMAIN; the outputs stay. */
static void change_refuses_what_balance_refuses(void **state)
{
    double out = NTR_TEST_SENTINEL, na1 = NTR_TEST_SENTINEL, tbw1 = NTR_TEST_SENTINEL;
    ntr_flow saline = {20.0, 513.0, 0.0};
    ntr_flow water = {1.0, 0.0, 0.0};
    (void)state;
    assert_int_equal(ntr_infusate_change(140.0, 40.0, 513.0, 0.0, 20.0, &out), NTR_ERR_DOMAIN);
    assert_int_equal(ntr_balance_predict(140.0, 40.0, &saline, 1, &na1, &tbw1), NTR_ERR_DOMAIN);
    assert_int_equal(ntr_infusate_change(85.0, 1.0, 0.0, 0.0, 1.0, &out), NTR_ERR_DOMAIN);
    assert_int_equal(ntr_infusate_change_per_litre(85.0, 1.0, 0.0, 0.0, &out), NTR_ERR_DOMAIN);
    assert_int_equal(ntr_balance_predict(85.0, 1.0, &water, 1, &na1, &tbw1), NTR_ERR_DOMAIN);
    assert_true(out == NTR_TEST_SENTINEL && na1 == NTR_TEST_SENTINEL);
    /* At exactly 220 both accept: 10 L of 3% on Na 140, TBW 40 gives
     * 140 + 10 x 373 / 50 = 214.6; Na 200, TBW 10, 1 L of Na 420 gives
     * 200 + 220/11 = 220 exactly (hand-worked). */
    assert_near(140.0 + change(140.0, 40.0, 513.0, 0.0, 10.0), 214.6, 1e-9);
    assert_true(200.0 + change(200.0, 10.0, 420.0, 0.0, 1.0) == 220.0);
}

/* Property: the library's cancellation-free form equals the mass balance as
 * the issue states it, (Na*TBW + (Na_inf + K_inf)*V)/(TBW + V) - Na. */
static void change_equals_the_mass_balance(void **state)
{
    static const double volumes[] = {0.0, 0.05, 0.292, 1.0, 2.5, 20.0};
    size_t v;
    (void)state;
    for (v = 0; v < sizeof volumes / sizeof volumes[0]; v++) {
        double vol = volumes[v];
        double expected = (118.0 * 36.0 + (154.0 + 20.0) * vol) / (36.0 + vol) - 118.0;
        assert_near(change(118.0, 36.0, 154.0, 20.0, vol), expected, 1e-9);
    }
}

/* Property: the change grows with volume, has the sign of
 * (infusate - serum) and never overshoots the infusate's own value. 3%
 * saline on Na 115 and TBW 25 L passes 220 beyond 2625/293 = 8.96 L
 * (hand-worked: 115 + v x 398 / (25 + v) = 220); from there on every
 * volume is refused. Water on Na 165 stays above 80 up to 20 L. */
static void change_is_monotone_and_bounded(void **state)
{
    double previous_up = 0.0, previous_down = 0.0, vol;
    (void)state;
    for (vol = 0.0; vol <= 20.0; vol += 0.25) {
        double up = NTR_TEST_SENTINEL;
        double down = change(165.0, 25.0, 0.0, 0.0, vol);
        int st = ntr_infusate_change(115.0, 25.0, 513.0, 0.0, vol, &up);
        if (vol <= 8.75) {
            assert_int_equal(st, NTR_OK);
            assert_true(up >= previous_up);
            assert_true(115.0 + up <= 220.0);
            previous_up = up;
        } else {
            assert_int_equal(st, NTR_ERR_DOMAIN);
            assert_true(up == NTR_TEST_SENTINEL);
        }
        assert_true(down <= previous_down);
        assert_true(165.0 + down >= 80.0);
        previous_down = down;
    }
    assert_true(change(140.0, 25.0, 140.0, 0.0, 3.0) == 0.0);
}

static int call_change(const double *a, double *out)
{
    return ntr_infusate_change(a[0], a[1], a[2], a[3], a[4], out);
}

static void change_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges as per litre, plus volume 0-20 L. */
    const struct ntr_test_inputs in = {call_change, 5, {120.0, 30.0, 513.0, 0.0, 0.5},
                                       {80.0, 0.1, 0.0, 0.0, 0.0},
                                       {220.0, 400.0, 1100.0, 400.0, 20.0}};
    (void)state;
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_infusate_change(120.0, 30.0, 513.0, 0.0, 0.5, NULL), NTR_ERR_NULL);
}

/* ---- ntr_infusate_volume_for_change --------------------------------------- */

/* The exact inverse on the inputs of the Furst et al. 2000 example
 * (hand-worked): a rise of 5 from 108 in 30 L of
 * body water needs 5 x 30 / (513 - 108 - 5) = 150/400 = 0.375 L of 3%
 * saline, not the 292 mL the paper's sodium-deficit step gave (that dose
 * reaches about 112, test change_furst_worked_example). The 375 mL
 * returns the rise of 5 through ntr_infusate_change. */
static void volume_furst_worked_example(void **state)
{
    double v;
    (void)state;
    v = volume_for(108.0, 30.0, 513.0, 0.0, 5.0);
    assert_near(v, 0.375, 1e-12);
    assert_near(change(108.0, 30.0, 513.0, 0.0, v), 5.0, 1e-12);
    assert_true(v > 150.0 / 513.0 + 0.08);
}

/* Property: round trips volume -> change -> volume and change -> volume ->
 * change, raising with hypertonic saline and lowering with water. */
static void volume_round_trips(void **state)
{
    static const double targets[] = {0.5, 2.0, 6.0, 10.0, 12.0};
    size_t i;
    (void)state;
    for (i = 0; i < sizeof targets / sizeof targets[0]; i++) {
        double t = targets[i];
        double up = volume_for(112.0, 28.0, 513.0, 0.0, t);
        double down = volume_for(168.0, 28.0, 0.0, 0.0, -t);
        assert_near(change(112.0, 28.0, 513.0, 0.0, up), t, 1e-9);
        assert_near(change(168.0, 28.0, 0.0, 0.0, down), -t, 1e-9);
    }
    {
        double delta = change(126.0, 41.0, 154.0, 20.0, 2.0);
        assert_near(volume_for(126.0, 41.0, 154.0, 20.0, delta), 2.0, 1e-9);
    }
    /* A zero target needs no fluid, even from a fluid that moves nothing. */
    assert_true(volume_for(140.0, 30.0, 140.0, 0.0, 0.0) == 0.0);
}

/* Targets no infusate can reach give NTR_ERR_DOMAIN and leave the output. */
static void volume_unreachable_targets(void **state)
{
    double out = NTR_TEST_SENTINEL;
    (void)state;
    /* Water cannot raise sodium. */
    assert_int_equal(ntr_infusate_volume_for_change(120.0, 30.0, 0.0, 0.0, 2.0, &out),
                     NTR_ERR_DOMAIN);
    /* 0.9% saline (154) cannot take 150 to 155 or beyond. */
    assert_int_equal(ntr_infusate_volume_for_change(150.0, 30.0, 154.0, 0.0, 5.0, &out),
                     NTR_ERR_DOMAIN);
    /* Exactly reaching the infusate's own sodium needs infinite volume. */
    assert_int_equal(ntr_infusate_volume_for_change(120.0, 30.0, 154.0, 0.0, 34.0, &out),
                     NTR_ERR_DOMAIN);
    /* Hypertonic saline cannot lower sodium. */
    assert_int_equal(ntr_infusate_volume_for_change(160.0, 30.0, 513.0, 0.0, -3.0, &out),
                     NTR_ERR_DOMAIN);
    /* Reachable in principle but above 20 L: 30*33.9/0.1 = 10170 L. */
    assert_int_equal(ntr_infusate_volume_for_change(120.0, 30.0, 154.0, 0.0, 33.9, &out),
                     NTR_ERR_DOMAIN);
    assert_true(out == NTR_TEST_SENTINEL);
}

/* A target sodium outside 80 to 220 is refused, by the rule
 * ntr_relower_estimate() applies: 90 lowered by 15 with water (75) is
 * refused by both; 215 raised by 10 with 5% saline (225) is refused.
 * Exactly 80 is accepted by both with the same volume (hand-worked:
 * 10 x 30 / 80 = 3.75 L, and back: 90 - 3.75 x 90 / 33.75 = 80). */
static void volume_target_outside_the_sodium_range(void **state)
{
    double out = NTR_TEST_SENTINEL, rate = NTR_TEST_SENTINEL, relower = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_infusate_volume_for_change(90.0, 30.0, 0.0, 0.0, -15.0, &out),
                     NTR_ERR_DOMAIN);
    assert_int_equal(ntr_relower_estimate(90.0, 30.0, 0.0, 0.0, 15.0, 6.0, 0.0, 0.0, 0.0,
                                          &relower, &rate),
                     NTR_ERR_DOMAIN);
    assert_int_equal(ntr_infusate_volume_for_change(215.0, 30.0, 855.0, 0.0, 10.0, &out),
                     NTR_ERR_DOMAIN);
    assert_true(out == NTR_TEST_SENTINEL && relower == NTR_TEST_SENTINEL);
    out = volume_for(90.0, 30.0, 0.0, 0.0, -10.0);
    assert_true(out == 3.75);
    assert_int_equal(ntr_relower_estimate(90.0, 30.0, 0.0, 0.0, 10.0, 6.0, 0.0, 0.0, 0.0,
                                          &relower, &rate),
                     NTR_OK);
    assert_true(relower == out);
    assert_true(90.0 + change(90.0, 30.0, 0.0, 0.0, out) == 80.0);
}

static int call_volume(const double *a, double *out)
{
    return ntr_infusate_volume_for_change(a[0], a[1], a[2], a[3], a[4], out);
}

static void volume_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges as per litre, plus the wanted change -50 to 50 mmol/L. */
    const struct ntr_test_inputs in = {call_volume, 5, {120.0, 30.0, 513.0, 0.0, 6.0},
                                       {80.0, 0.1, 0.0, 0.0, -50.0},
                                       {220.0, 400.0, 1100.0, 400.0, 50.0}};
    (void)state;
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_infusate_volume_for_change(120.0, 30.0, 513.0, 0.0, 6.0, NULL),
                     NTR_ERR_NULL);
}

/* The smallest wanted rise still takes the rising branch: 1e-10 mmol/L
 * with 3% saline (513) from 120 in 40 L needs 1e-10 * 40 / 393 L by the
 * Adrogue-Madias formula (volume = change * TBW / (infusate - Na - change)). */
static void volume_for_a_tiny_rise(void **state)
{
    double v = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_infusate_volume_for_change(120.0, 40.0, 513.0, 0.0, 1e-10, &v), NTR_OK);
    assert_near(v, 1e-10 * 40.0 / (513.0 - 120.0 - 1e-10), 1e-24);
    /* A tiny fall needs an infusate below the target: one a hair above
     * sodium (headroom about +1e-10, the wrong side) is refused, however
     * small the headroom; it must not come back as a negative volume. */
    v = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_infusate_volume_for_change(120.0, 40.0, 120.0000000001, 0.0, -1e-12, &v),
                     NTR_ERR_DOMAIN);
    assert_true(v == NTR_TEST_SENTINEL);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(preset_matches_the_published_table),
        cmocka_unit_test(preset_salines_follow_from_their_strength),
        cmocka_unit_test(preset_bad_inputs_leave_outputs_untouched),
        cmocka_unit_test(per_litre_worked_examples),
        cmocka_unit_test(per_litre_potassium_counts_like_sodium),
        cmocka_unit_test(per_litre_bad_inputs_leave_output_untouched),
        cmocka_unit_test(change_furst_worked_example),
        cmocka_unit_test(change_at_one_litre_equals_per_litre),
        cmocka_unit_test(change_refuses_what_balance_refuses),
        cmocka_unit_test(change_equals_the_mass_balance),
        cmocka_unit_test(change_is_monotone_and_bounded),
        cmocka_unit_test(change_bad_inputs_leave_output_untouched),
        cmocka_unit_test(volume_furst_worked_example),
        cmocka_unit_test(volume_round_trips),
        cmocka_unit_test(volume_unreachable_targets),
        cmocka_unit_test(volume_target_outside_the_sodium_range),
        cmocka_unit_test(volume_bad_inputs_leave_output_untouched),
        cmocka_unit_test(volume_for_a_tiny_rise),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
