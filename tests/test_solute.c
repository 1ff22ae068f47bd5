/* SPDX-License-Identifier: MIT */
/* Solute and restriction: ntr_urine_volume_from_solute, ntr_fluid_allowance,
 * ntr_solute_dose_osmoles, ntr_fluid_allowance_with_dose,
 * ntr_solute_dose_for_allowance, ntr_restriction_outlook (docs/solute.md).
 *
 * Berl T, J Am Soc Nephrol 2008;19:1076-8 gives the relation (urine volume
 * = osmoles excreted / urine osmolality; added urea or salt raises the
 * volume at a fixed urine osmolality) but no worked numbers
 * (/work/shared/sources.md), so the values below are hand-worked from the
 * published formulas, each case written out beside its check. */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <string.h>
#include <cmocka.h>

#include "natremia_test.h"

/* Molar masses hand-worked from the abridged IUPAC atomic weights
 * (H 1.008, C 12.011, N 14.007, O 15.999, Na 22.98977, Cl 35.453):
 * urea CH4N2O 12.011 + 4*1.008 + 2*14.007 + 15.999 = 60.056 g/mol;
 * NaCl 22.98977 + 35.453 = 58.44277 g/mol. tests/check_molar_masses.py
 * compares both with python3-periodictable (urea 60.0553, NaCl 58.4428). */
#define UREA_G_MOL 60.056
#define NACL_G_MOL 58.44277

static double volume(double solute, double uosm)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_urine_volume_from_solute(solute, uosm, &out), NTR_OK);
    return out;
}

static double allowance(double solute, double uosm, double una, double uk, double sna,
                        double insensible)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_fluid_allowance(solute, uosm, una, uk, sna, insensible, &out), NTR_OK);
    return out;
}

static double osmoles(int solute, double grams)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_solute_dose_osmoles(solute, grams, &out), NTR_OK);
    return out;
}

static double with_dose(int solute, double grams, double s, double uosm, double una,
                        double uk, double sna, double ins)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_fluid_allowance_with_dose(solute, grams, s, uosm, una, uk, sna, ins, &out),
                     NTR_OK);
    return out;
}

static double dose_for(int solute, double s, double uosm, double una, double uk, double sna,
                       double ins, double target)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_solute_dose_for_allowance(solute, s, uosm, una, uk, sna, ins, target, &out),
                     NTR_OK);
    return out;
}

static ntr_outlook outlook(double s, double uosm, double una, double uk, double sna, double ins,
                           double target)
{
    ntr_outlook o;
    memset(&o, 0xA5, sizeof o);
    o.struct_size = sizeof o;
    assert_int_equal(ntr_restriction_outlook(s, uosm, una, uk, sna, ins, target, &o), NTR_OK);
    assert_true(o.struct_size == sizeof o);
    return o;
}

/* ---- ntr_urine_volume_from_solute ---------------------------------------- */

/* Hand-worked from Berl's relation V = solute / U_osm: 600 mOsm/day at
 * 600 mOsm/kg gives 1 L/day; 900 at 300 gives 3; a low-solute diet of
 * 250 mOsm/day at 500 gives 0.5; no solute, no urine. */
static void volume_hand_worked(void **state)
{
    (void)state;
    assert_near(volume(600.0, 600.0), 1.0, 1e-15);
    assert_near(volume(900.0, 300.0), 3.0, 1e-15);
    assert_near(volume(250.0, 500.0), 0.5, 1e-15);
    assert_true(volume(0.0, 600.0) == 0.0);
}

/* Property (Berl): at a fixed urine osmolality more solute makes more
 * urine; at a fixed solute a more concentrated urine is less of it. */
static void volume_monotone(void **state)
{
    double s, u;
    (void)state;
    for (s = 100.0; s <= 3000.0; s += 100.0) {
        for (u = 150.0; u <= 1200.0; u += 50.0) { /* V stays below 30 L */
            double v = volume(s, u);
            assert_true(volume(s + 50.0, u) > v);
            assert_true(volume(s, u + 25.0) < v);
            assert_near(v * u, s, 1e-9 * s);
        }
    }
}

static int call_volume(const double *a, double *out)
{
    return ntr_urine_volume_from_solute(a[0], a[1], out);
}

static void volume_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges: solute 0-10000 mOsm/day, urine osmolality 10-2000 mOsm/kg. */
    const struct ntr_test_inputs in = {call_volume, 2, {600.0, 600.0}, {0.0, 10.0},
                                       {10000.0, 2000.0}};
    double out = NTR_TEST_SENTINEL;
    (void)state;
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_urine_volume_from_solute(600.0, 600.0, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_urine_volume_from_solute((double)NAN, 600.0, NULL), NTR_ERR_NULL);
    /* Above 30 L/day the result leaves the library's urine volume range:
     * 10000 / 100 = 100 L/day. 3000 / 100 = 30 exactly still passes. */
    assert_int_equal(ntr_urine_volume_from_solute(10000.0, 100.0, &out), NTR_ERR_DOMAIN);
    assert_true(out == NTR_TEST_SENTINEL);
    assert_near(volume(3000.0, 100.0), 30.0, 0.0);
}

/* ---- ntr_fluid_allowance ------------------------------------------------- */

/* Hand-worked from intake = V (1 - (U_Na + U_K)/S_Na) + insensible:
 * 900 mOsm/day at 450 -> V 2 L; (60 + 20)/128 = 0.625; 2 * 0.375 + 0.5
 * = 1.25 L/day. 600 at 600 -> V 1; (80 + 40)/120 = 1: the urine is
 * electrolyte-isotonic, only the insensible 0.5 L/day can be drunk. */
static void allowance_hand_worked(void **state)
{
    (void)state;
    assert_near(allowance(900.0, 450.0, 60.0, 20.0, 128.0, 0.5), 1.25, 1e-12);
    assert_near(allowance(600.0, 600.0, 80.0, 40.0, 120.0, 0.5), 0.5, 1e-12);
}

/* The negative case, hand-worked: 600 mOsm/day at 500 -> V 1.2 L;
 * (150 + 60)/125 = 1.68; 1.2 * (1 - 1.68) + 0.4 = -0.416 L/day. Returned
 * as such: restriction alone cannot hold this sodium. */
static void allowance_negative_returned(void **state)
{
    double out = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_fluid_allowance(600.0, 500.0, 150.0, 60.0, 125.0, 0.4, &out), NTR_OK);
    assert_near(out, -0.416, 1e-12);
}

/* Property: the allowance is the EFWC of the urine Berl's relation gives,
 * plus the insensible loss; with no insensible loss it is negative exactly
 * when the Furst ratio is above 1. */
static void allowance_agrees_with_efwc_and_furst(void **state)
{
    static const double una[] = {0.0, 20.0, 60.0, 90.0, 140.0, 250.0, 500.0};
    static const double uk[] = {0.0, 10.0, 35.0, 80.0, 300.0};
    size_t i, j;
    (void)state;
    for (i = 0; i < sizeof una / sizeof una[0]; i++) {
        for (j = 0; j < sizeof uk / sizeof uk[0]; j++) {
            double ratio, efwc;
            double a0 = allowance(700.0, 350.0, una[i], uk[j], 126.0, 0.0);
            assert_int_equal(ntr_furst_ratio(una[i], uk[j], 126.0, &ratio), NTR_OK);
            assert_int_equal(ntr_efwc(2.0, una[i], uk[j], 126.0, &efwc), NTR_OK);
            assert_true(a0 == efwc);
            assert_true((a0 < 0.0) == (ratio > 1.0));
            assert_true(allowance(700.0, 350.0, una[i], uk[j], 126.0, 0.6) == efwc + 0.6);
        }
    }
}

/* Property: at a fixed urine composition the allowance moves with the
 * solute in the direction of 1 - Furst ratio (more of a dilute urine
 * allows more; more of an electrolyte-rich urine allows less), and falls
 * as the urine osmolality rises when the ratio is below 1. */
static void allowance_monotone_in_solute(void **state)
{
    double s;
    (void)state;
    for (s = 100.0; s <= 4000.0; s += 100.0) {
        /* ratio (50 + 20)/130 < 1 */
        assert_true(allowance(s + 10.0, 400.0, 50.0, 20.0, 130.0, 0.5) >
                    allowance(s, 400.0, 50.0, 20.0, 130.0, 0.5));
        assert_true(allowance(s, 410.0, 50.0, 20.0, 130.0, 0.5) <
                    allowance(s, 400.0, 50.0, 20.0, 130.0, 0.5));
        /* ratio (120 + 40)/130 > 1 */
        assert_true(allowance(s + 10.0, 400.0, 120.0, 40.0, 130.0, 0.5) <
                    allowance(s, 400.0, 120.0, 40.0, 130.0, 0.5));
        /* ratio exactly 1: the insensible loss alone */
        assert_near(allowance(s, 400.0, 100.0, 30.0, 130.0, 0.5), 0.5, 1e-12);
    }
}

static int call_allowance(const double *a, double *out)
{
    return ntr_fluid_allowance(a[0], a[1], a[2], a[3], a[4], a[5], out);
}

static void allowance_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges: solute 0-10000, urine osmolality 10-2000, urine Na 0-500,
     * urine K 0-300, serum Na 80-220, insensible 0-10 L/day. The edges of
     * the good case keep V = solute/600 at or below 30 L/day. */
    const struct ntr_test_inputs in = {call_allowance, 6, {900.0, 600.0, 60.0, 20.0, 128.0, 0.5},
                                       {0.0, 10.0, 0.0, 0.0, 80.0, 0.0},
                                       {10000.0, 2000.0, 500.0, 300.0, 220.0, 10.0}};
    double out = NTR_TEST_SENTINEL;
    (void)state;
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_fluid_allowance(900.0, 600.0, 60.0, 20.0, 128.0, 0.5, NULL), NTR_ERR_NULL);
    /* 2000 mOsm/day at 50 mOsm/kg would be 40 L/day of urine. */
    assert_int_equal(ntr_fluid_allowance(2000.0, 50.0, 60.0, 20.0, 128.0, 0.5, &out),
                     NTR_ERR_DOMAIN);
    assert_true(out == NTR_TEST_SENTINEL);
    /* Range errors come before the domain, whatever the volume. */
    assert_int_equal(ntr_fluid_allowance(2000.0, 50.0, 60.0, 20.0, 128.0, -1.0, &out),
                     NTR_ERR_RANGE);
    assert_int_equal(ntr_fluid_allowance(2000.0, 50.0, (double)NAN, 20.0, 128.0, 0.5, &out),
                     NTR_ERR_NONFINITE);
    assert_true(out == NTR_TEST_SENTINEL);
}

/* ---- ntr_solute_dose_osmoles --------------------------------------------- */

/* Hand-worked: 30 g urea / 60.056 g/mol = 0.4995338 mol = 499.53 mOsm
 * (about 500, periodictable's 60.0553 g/mol gives 499.54); 1 g NaCl =
 * 2 * 1000 / 58.44277 = 34.2215 mOsm; 9 g NaCl (nine 1 g tablets) =
 * 307.99 mOsm. */
static void dose_osmoles_hand_worked(void **state)
{
    (void)state;
    assert_near(osmoles(NTR_SOLUTE_UREA, 30.0), 499.53377, 1e-5);
    assert_near(osmoles(NTR_SOLUTE_UREA, 30.0), 30000.0 / UREA_G_MOL, 1e-9);
    assert_near(osmoles(NTR_SOLUTE_UREA, 30.0), 30000.0 / 60.05526, 0.01); /* periodictable */
    assert_near(osmoles(NTR_SOLUTE_NACL, 1.0), 34.22151, 1e-5);
    assert_near(osmoles(NTR_SOLUTE_NACL, 9.0), 2.0 * 9000.0 / NACL_G_MOL, 1e-9);
    assert_true(osmoles(NTR_SOLUTE_UREA, 0.0) == 0.0);
    assert_true(osmoles(NTR_SOLUTE_NACL, 0.0) == 0.0);
}

/* Property: linear in the dose; a gram of NaCl (two osmoles per 58.4 g)
 * carries more osmoles than a gram of urea (one per 60.1 g). */
static void dose_osmoles_linear(void **state)
{
    double g;
    (void)state;
    for (g = 0.5; g <= 200.0; g += 0.5) {
        assert_near(osmoles(NTR_SOLUTE_UREA, g), g * osmoles(NTR_SOLUTE_UREA, 1.0), 1e-9 * g);
        assert_near(osmoles(NTR_SOLUTE_NACL, g), g * osmoles(NTR_SOLUTE_NACL, 1.0), 1e-9 * g);
        assert_true(osmoles(NTR_SOLUTE_NACL, g) > osmoles(NTR_SOLUTE_UREA, g));
    }
}

static int call_osmoles_urea(const double *a, double *out)
{
    return ntr_solute_dose_osmoles(NTR_SOLUTE_UREA, a[0], out);
}

static void dose_osmoles_bad_inputs_leave_output_untouched(void **state)
{
    /* Range: 0-200 g. */
    const struct ntr_test_inputs in = {call_osmoles_urea, 1, {30.0}, {0.0}, {200.0}};
    static const int unknown[] = {0, 3, -1, 100};
    size_t i;
    (void)state;
    ntr_test_bad_inputs(&in);
    for (i = 0; i < sizeof unknown / sizeof unknown[0]; i++) {
        double out = NTR_TEST_SENTINEL;
        assert_int_equal(ntr_solute_dose_osmoles(unknown[i], 30.0, &out), NTR_ERR_ARG);
        /* An unknown solute is reported before a bad number. */
        assert_int_equal(ntr_solute_dose_osmoles(unknown[i], (double)NAN, &out), NTR_ERR_ARG);
        assert_true(out == NTR_TEST_SENTINEL);
    }
    assert_int_equal(ntr_solute_dose_osmoles(NTR_SOLUTE_NACL, 1.0, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_solute_dose_osmoles(0, (double)NAN, NULL), NTR_ERR_NULL);
}

/* ---- ntr_fluid_allowance_with_dose --------------------------------------- */

/* Hand-worked: the urine of allowance_hand_worked (600 mOsm/day at 600,
 * ratio 1, insensible 0.5) allows 0.5 L/day; 30 g of urea adds 499.53
 * mOsm, which leave in 499.53/600 = 0.83256 L of extra urine carrying no
 * electrolyte: 1.33256 L/day. 9 g of NaCl adds 307.99/600 = 0.51332 L. */
static void with_dose_hand_worked(void **state)
{
    (void)state;
    assert_near(with_dose(NTR_SOLUTE_UREA, 30.0, 600.0, 600.0, 80.0, 40.0, 120.0, 0.5),
                1.3325563, 1e-7);
    assert_near(with_dose(NTR_SOLUTE_NACL, 9.0, 600.0, 600.0, 80.0, 40.0, 120.0, 0.5),
                0.5 + 307.99361 / 600.0, 1e-7);
    /* No dose: the plain allowance, bit for bit. */
    assert_true(with_dose(NTR_SOLUTE_UREA, 0.0, 900.0, 450.0, 60.0, 20.0, 128.0, 0.5) ==
                allowance(900.0, 450.0, 60.0, 20.0, 128.0, 0.5));
}

/* Property: the allowance rises with the dose for both solutes, also when
 * the Furst ratio is above 1 (the negative case of
 * allowance_negative_returned becomes positive with 30 g of urea:
 * -0.416 + 499.53/500 = 0.583 L/day). */
static void with_dose_monotone(void **state)
{
    double g;
    (void)state;
    for (g = 0.0; g < 120.0; g += 2.0) {
        assert_true(with_dose(NTR_SOLUTE_UREA, g + 2.0, 600.0, 500.0, 150.0, 60.0, 125.0, 0.4) >
                    with_dose(NTR_SOLUTE_UREA, g, 600.0, 500.0, 150.0, 60.0, 125.0, 0.4));
        assert_true(with_dose(NTR_SOLUTE_NACL, g + 2.0, 600.0, 500.0, 150.0, 60.0, 125.0, 0.4) >
                    with_dose(NTR_SOLUTE_NACL, g, 600.0, 500.0, 150.0, 60.0, 125.0, 0.4));
    }
    assert_near(with_dose(NTR_SOLUTE_UREA, 30.0, 600.0, 500.0, 150.0, 60.0, 125.0, 0.4),
                -0.416 + 499.53377 / 500.0, 1e-7);
}

static int call_with_dose(const double *a, double *out)
{
    return ntr_fluid_allowance_with_dose(NTR_SOLUTE_UREA, a[0], a[1], a[2], a[3], a[4], a[5], a[6],
                                         out);
}

static void with_dose_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges: dose 0-200 g/day, then as ntr_fluid_allowance. Urine
     * osmolality 2000 keeps every edge (10000 + 200 g urea = 13330 mOsm)
     * at or below 30 L/day. */
    const struct ntr_test_inputs in = {call_with_dose, 7,
                                       {30.0, 900.0, 2000.0, 60.0, 20.0, 128.0, 0.5},
                                       {0.0, 0.0, 10.0, 0.0, 0.0, 80.0, 0.0},
                                       {200.0, 10000.0, 2000.0, 500.0, 300.0, 220.0, 10.0}};
    double out = NTR_TEST_SENTINEL;
    (void)state;
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_fluid_allowance_with_dose(3, 30.0, 900.0, 600.0, 60.0, 20.0, 128.0, 0.5,
                                                   &out),
                     NTR_ERR_ARG);
    assert_int_equal(ntr_fluid_allowance_with_dose(NTR_SOLUTE_UREA, 30.0, 900.0, 600.0, 60.0,
                                                   20.0, 128.0, 0.5, NULL),
                     NTR_ERR_NULL);
    /* 1200 mOsm/day at 50 is 24 L; 200 g of urea add 3330 mOsm, 66.6 L. */
    assert_int_equal(ntr_fluid_allowance_with_dose(NTR_SOLUTE_UREA, 200.0, 1200.0, 50.0, 60.0,
                                                   20.0, 128.0, 0.5, &out),
                     NTR_ERR_DOMAIN);
    assert_true(out == NTR_TEST_SENTINEL);
}

/* ---- ntr_solute_dose_for_allowance --------------------------------------- */

/* Hand-worked: from 0.5 L/day (600 mOsm/day at 600, ratio 1, insensible
 * 0.5) to 1 L/day needs 0.5 L more urine, 0.5 * 600 = 300 mOsm/day:
 * 300 mmol of urea = 300 * 0.060056 = 18.0168 g/day, or 150 mmol of NaCl
 * = 150 * 0.05844277 = 8.7664 g/day. */
static void dose_for_hand_worked(void **state)
{
    (void)state;
    assert_near(dose_for(NTR_SOLUTE_UREA, 600.0, 600.0, 80.0, 40.0, 120.0, 0.5, 1.0), 18.0168,
                1e-9);
    assert_near(dose_for(NTR_SOLUTE_NACL, 600.0, 600.0, 80.0, 40.0, 120.0, 0.5, 1.0), 8.7664155,
                1e-9);
    /* The negative case needs 1.416 L/day more for a 1 L/day target:
     * 708 mOsm = 42.5196 g urea or 20.6887 g NaCl. */
    assert_near(dose_for(NTR_SOLUTE_UREA, 600.0, 500.0, 150.0, 60.0, 125.0, 0.4, 1.0), 42.519648,
                1e-9);
    assert_near(dose_for(NTR_SOLUTE_NACL, 600.0, 500.0, 150.0, 60.0, 125.0, 0.4, 1.0), 20.688741,
                1e-6);
    /* Already allowed (1.25 L/day >= 1): no dose. */
    assert_true(dose_for(NTR_SOLUTE_UREA, 900.0, 450.0, 60.0, 20.0, 128.0, 0.5, 1.0) == 0.0);
    assert_true(dose_for(NTR_SOLUTE_NACL, 900.0, 450.0, 60.0, 20.0, 128.0, 0.5, 1.25) == 0.0);
}

/* Property: the inverse round-trips through the forward function, and the
 * dose rises with the target and with the urine osmolality. */
static void dose_for_round_trips(void **state)
{
    static const double uosm[] = {150.0, 300.0, 450.0, 600.0, 800.0};
    static const double una[] = {20.0, 80.0, 140.0};
    static const double target[] = {0.5, 0.8, 1.0, 1.5};
    static const int solutes[] = {NTR_SOLUTE_UREA, NTR_SOLUTE_NACL};
    size_t i, j, k, m;
    size_t dosed = 0;
    (void)state;
    for (m = 0; m < 2; m++) {
        for (i = 0; i < sizeof uosm / sizeof uosm[0]; i++) {
            for (j = 0; j < sizeof una / sizeof una[0]; j++) {
                for (k = 0; k < sizeof target / sizeof target[0]; k++) {
                    double g, a0 = allowance(500.0, uosm[i], una[j], 30.0, 124.0, 0.4);
                    int st;
                    double out = NTR_TEST_SENTINEL;
                    st = ntr_solute_dose_for_allowance(solutes[m], 500.0, uosm[i], una[j], 30.0,
                                                       124.0, 0.4, target[k], &out);
                    if (st == NTR_ERR_DOMAIN) {
                        /* Only when the dose would pass 200 g/day. */
                        assert_true((target[k] - a0) * uosm[i] >
                                    osmoles(solutes[m], 200.0) - 1e-9);
                        assert_true(out == NTR_TEST_SENTINEL);
                        continue;
                    }
                    assert_int_equal(st, NTR_OK);
                    g = out;
                    if (a0 >= target[k]) {
                        assert_true(g == 0.0);
                        continue;
                    }
                    dosed++;
                    assert_near(with_dose(solutes[m], g, 500.0, uosm[i], una[j], 30.0, 124.0, 0.4),
                                target[k], 1e-12);
                    if (k > 0 && target[k - 1] > a0) {
                        assert_true(g > dose_for(solutes[m], 500.0, uosm[i], una[j], 30.0, 124.0,
                                                 0.4, target[k - 1]));
                    }
                }
            }
        }
    }
    assert_true(dosed >= 40); /* the grid does exercise the inverse */
    /* Higher urine osmolality, same electrolytes and allowance gap: more
     * solute is needed per litre (Berl). */
    assert_true(dose_for(NTR_SOLUTE_UREA, 600.0, 700.0, 150.0, 60.0, 125.0, 0.4, 1.0) >
                dose_for(NTR_SOLUTE_UREA, 600.0, 600.0, 150.0, 60.0, 125.0, 0.4, 1.0));
}

static int call_dose_for(const double *a, double *out)
{
    return ntr_solute_dose_for_allowance(NTR_SOLUTE_NACL, a[0], a[1], a[2], a[3], a[4], a[5], a[6],
                                         out);
}

static void dose_for_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges: as ntr_fluid_allowance, then the target above 0 and at most
     * 10 L/day (its lower edge is the smallest positive double). */
    const struct ntr_test_inputs in = {call_dose_for, 7,
                                       {600.0, 600.0, 80.0, 40.0, 120.0, 0.5, 1.0},
                                       {0.0, 10.0, 0.0, 0.0, 80.0, 0.0, 0.0},
                                       {10000.0, 2000.0, 500.0, 300.0, 220.0, 10.0, 10.0}};
    struct ntr_test_inputs open_target = in;
    double out = NTR_TEST_SENTINEL;
    (void)state;
    open_target.lo[6] = nextafter(0.0, 1.0);
    ntr_test_bad_inputs(&open_target);
    assert_int_equal(call_dose_for((const double[]){600.0, 600.0, 80.0, 40.0, 120.0, 0.5, 0.0},
                                   &out),
                     NTR_ERR_RANGE);
    assert_int_equal(call_dose_for((const double[]){600.0, 600.0, 80.0, 40.0, 120.0, 0.5, -0.0},
                                   &out),
                     NTR_ERR_RANGE);
    assert_int_equal(ntr_solute_dose_for_allowance(0, 600.0, 600.0, 80.0, 40.0, 120.0, 0.5, 1.0,
                                                   &out),
                     NTR_ERR_ARG);
    assert_true(out == NTR_TEST_SENTINEL);
    assert_int_equal(ntr_solute_dose_for_allowance(NTR_SOLUTE_UREA, 600.0, 600.0, 80.0, 40.0,
                                                   120.0, 0.5, 1.0, NULL),
                     NTR_ERR_NULL);
    /* A urine at 1800 mOsm/kg with ratio 1 needs (10 - 0.5) * 1800 =
     * 17100 mOsm/day for a 10 L/day target: 1027 g of urea, out of range. */
    assert_int_equal(ntr_solute_dose_for_allowance(NTR_SOLUTE_UREA, 1800.0, 1800.0, 80.0, 40.0,
                                                   120.0, 0.5, 10.0, &out),
                     NTR_ERR_DOMAIN);
    /* A target that needs more than 30 L/day of urine: 2900 mOsm at 100 is
     * 29 L already. */
    assert_int_equal(ntr_solute_dose_for_allowance(NTR_SOLUTE_NACL, 2900.0, 100.0, 120.0, 0.0,
                                                   120.0, 0.0, 5.0, &out),
                     NTR_ERR_DOMAIN);
    assert_true(out == NTR_TEST_SENTINEL);
}

/* ---- ntr_restriction_outlook --------------------------------------------- */

/* The negative case (hand-worked above): ratio 1.68 (> 1, strictest Furst
 * band), V 1.2 L, EFWC -0.816, allowance -0.416 L/day: restriction fails;
 * for 1 L/day, 42.52 g urea or 20.69 g NaCl. */
static void outlook_restriction_fails(void **state)
{
    ntr_outlook o = outlook(600.0, 500.0, 150.0, 60.0, 125.0, 0.4, 1.0);
    (void)state;
    assert_int_equal(o.verdict, NTR_OUTLOOK_RESTRICTION_FAILS);
    assert_int_equal(o.furst_advice, NTR_RESTRICT_500ML);
    assert_near(o.furst_ratio, 1.68, 1e-12);
    assert_near(o.urine_l_day, 1.2, 1e-12);
    assert_near(o.efwc_l_day, -0.816, 1e-12);
    assert_near(o.allowance_l_day, -0.416, 1e-12);
    assert_true(o.target_intake_l_day == 1.0);
    assert_near(o.urea_g_day, 42.519648, 1e-9);
    assert_near(o.nacl_g_day, 20.688741, 1e-6);
    assert_true(o.flags == NTR_OUTLOOK_FURST_ABOVE_ONE);
    assert_true(o.reserved == 0u);
}

/* Hand-worked: 1.25 L/day (ratio 0.625, under-1-L band) holds a 1 L/day
 * target; the same urine with a 1.5 L/day target needs 0.25 L more:
 * 0.25 * 450 = 112.5 mOsm = 6.7563 g urea. */
static void outlook_target_holds_or_needs_solute(void **state)
{
    ntr_outlook a = outlook(900.0, 450.0, 60.0, 20.0, 128.0, 0.5, 1.0);
    ntr_outlook b = outlook(900.0, 450.0, 60.0, 20.0, 128.0, 0.5, 1.5);
    (void)state;
    assert_int_equal(a.verdict, NTR_OUTLOOK_TARGET_HOLDS);
    assert_int_equal(a.furst_advice, NTR_RESTRICT_1000ML);
    assert_true(a.urea_g_day == 0.0 && a.nacl_g_day == 0.0);
    assert_true(a.flags == 0u);
    assert_int_equal(b.verdict, NTR_OUTLOOK_STRICTER_OR_SOLUTE);
    assert_near(b.urea_g_day, 112.5 * UREA_G_MOL / 1000.0, 1e-9);
    assert_near(b.nacl_g_day, 112.5 * NACL_G_MOL / 2000.0, 1e-9);
    assert_true(b.flags == 0u);
    /* A target equal to the allowance itself holds (the header: the
     * target holds when the allowance is at least the target), with no
     * dose needed; the next double above it needs solute. */
    {
        const double edge = a.allowance_l_day;
        ntr_outlook c = outlook(900.0, 450.0, 60.0, 20.0, 128.0, 0.5, edge);
        ntr_outlook d = outlook(900.0, 450.0, 60.0, 20.0, 128.0, 0.5, nextafter(edge, 10.0));
        assert_true(c.allowance_l_day == edge);
        assert_int_equal(c.verdict, NTR_OUTLOOK_TARGET_HOLDS);
        assert_true(c.urea_g_day == 0.0 && c.nacl_g_day == 0.0);
        assert_int_equal(d.verdict, NTR_OUTLOOK_STRICTER_OR_SOLUTE);
    }
}

/* The outlook is the single functions combined, bit for bit, over a grid;
 * the verdict follows the allowance and the flags follow the ratio and the
 * dose range. */
static void outlook_agrees_with_the_parts(void **state)
{
    static const double uosm[] = {80.0, 300.0, 600.0, 1100.0, 1900.0};
    static const double una[] = {10.0, 70.0, 130.0, 260.0};
    static const double target[] = {0.3, 1.0, 2.5, 5.0};
    size_t i, j, k;
    unsigned int seen = 0u;
    (void)state;
    for (i = 0; i < sizeof uosm / sizeof uosm[0]; i++) {
        for (j = 0; j < sizeof una / sizeof una[0]; j++) {
            for (k = 0; k < sizeof target / sizeof target[0]; k++) {
                ntr_outlook o = outlook(700.0, uosm[i], una[j], 40.0, 122.0, 0.5, target[k]);
                double ratio, v, efwc, a, g;
                int advice, st;
                assert_int_equal(ntr_furst_ratio(una[j], 40.0, 122.0, &ratio), NTR_OK);
                assert_int_equal(ntr_restriction_from_ratio(ratio, &advice), NTR_OK);
                v = volume(700.0, uosm[i]);
                assert_int_equal(ntr_efwc(v, una[j], 40.0, 122.0, &efwc), NTR_OK);
                a = allowance(700.0, uosm[i], una[j], 40.0, 122.0, 0.5);
                assert_true(o.furst_ratio == ratio && o.furst_advice == advice);
                assert_true(o.urine_l_day == v && o.efwc_l_day == efwc && o.allowance_l_day == a);
                assert_int_equal(o.verdict, a <= 0.0          ? NTR_OUTLOOK_RESTRICTION_FAILS
                                            : a >= target[k] ? NTR_OUTLOOK_TARGET_HOLDS
                                                             : NTR_OUTLOOK_STRICTER_OR_SOLUTE);
                assert_true(((o.flags & NTR_OUTLOOK_FURST_ABOVE_ONE) != 0u) == (ratio > 1.0));
                st = ntr_solute_dose_for_allowance(NTR_SOLUTE_UREA, 700.0, uosm[i], una[j], 40.0,
                                                   122.0, 0.5, target[k], &g);
                if (st == NTR_OK) {
                    assert_true(o.urea_g_day == g);
                    assert_true((o.flags & NTR_OUTLOOK_UREA_OUT_OF_RANGE) == 0u);
                } else {
                    assert_int_equal(st, NTR_ERR_DOMAIN);
                    assert_true(o.urea_g_day == NTR_OUTLOOK_NO_DOSE);
                    assert_true((o.flags & NTR_OUTLOOK_UREA_OUT_OF_RANGE) != 0u);
                }
                st = ntr_solute_dose_for_allowance(NTR_SOLUTE_NACL, 700.0, uosm[i], una[j], 40.0,
                                                   122.0, 0.5, target[k], &g);
                if (st == NTR_OK) {
                    assert_true(o.nacl_g_day == g);
                } else {
                    assert_true(o.nacl_g_day == NTR_OUTLOOK_NO_DOSE);
                    assert_true((o.flags & NTR_OUTLOOK_NACL_OUT_OF_RANGE) != 0u);
                }
                seen |= 1u << o.verdict;
                seen |= o.flags << 4;
            }
        }
    }
    /* Every verdict and every flag occurs in the grid. */
    assert_true(seen == ((1u << 1) | (1u << 2) | (1u << 3) | (0x7u << 4)));
}

/* Outlook adapter for the shared walker: the struct is prefilled, and on
 * an error every byte of it must be as it was. */
static int call_outlook(const double *a, double *out)
{
    ntr_outlook o, before;
    int st;
    memset(&o, 0x5A, sizeof o);
    o.struct_size = sizeof o;
    before = o;
    st = ntr_restriction_outlook(a[0], a[1], a[2], a[3], a[4], a[5], a[6], &o);
    if (st != NTR_OK) {
        assert_memory_equal(&o, &before, sizeof o);
    } else {
        *out = o.allowance_l_day;
    }
    return st;
}

static void outlook_bad_inputs_leave_output_untouched(void **state)
{
    struct ntr_test_inputs in = {call_outlook, 7,
                                 {600.0, 600.0, 80.0, 40.0, 120.0, 0.5, 1.0},
                                 {0.0, 10.0, 0.0, 0.0, 80.0, 0.0, 0.0},
                                 {10000.0, 2000.0, 500.0, 300.0, 220.0, 10.0, 10.0}};
    ntr_outlook o, before;
    (void)state;
    in.lo[6] = nextafter(0.0, 1.0);
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_restriction_outlook(600.0, 600.0, 80.0, 40.0, 120.0, 0.5, 1.0, NULL),
                     NTR_ERR_NULL);
    /* A struct_size below this version's size: NTR_ERR_ARG before any
     * number is looked at; nothing written. */
    memset(&o, 0x5A, sizeof o);
    o.struct_size = sizeof o - 1;
    before = o;
    assert_int_equal(ntr_restriction_outlook(600.0, 600.0, 80.0, 40.0, 120.0, 0.5, 1.0, &o),
                     NTR_ERR_ARG);
    assert_int_equal(ntr_restriction_outlook((double)NAN, 600.0, 80.0, 40.0, 120.0, 0.5, 1.0, &o),
                     NTR_ERR_ARG);
    o.struct_size = 0;
    before.struct_size = 0;
    assert_int_equal(ntr_restriction_outlook(600.0, 600.0, 80.0, 40.0, 120.0, 0.5, 1.0, &o),
                     NTR_ERR_ARG);
    assert_memory_equal(&o, &before, sizeof o);
    /* A caller built against a newer, larger struct is served. */
    o.struct_size = sizeof o + 64;
    assert_int_equal(ntr_restriction_outlook(600.0, 600.0, 80.0, 40.0, 120.0, 0.5, 1.0, &o),
                     NTR_OK);
    assert_true(o.struct_size == sizeof o + 64);
    /* Domain: 2000 mOsm/day at 50 would be 40 L/day of urine. */
    memset(&o, 0x5A, sizeof o);
    o.struct_size = sizeof o;
    before = o;
    assert_int_equal(ntr_restriction_outlook(2000.0, 50.0, 80.0, 40.0, 120.0, 0.5, 1.0, &o),
                     NTR_ERR_DOMAIN);
    assert_memory_equal(&o, &before, sizeof o);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(volume_hand_worked),
        cmocka_unit_test(volume_monotone),
        cmocka_unit_test(volume_bad_inputs_leave_output_untouched),
        cmocka_unit_test(allowance_hand_worked),
        cmocka_unit_test(allowance_negative_returned),
        cmocka_unit_test(allowance_agrees_with_efwc_and_furst),
        cmocka_unit_test(allowance_monotone_in_solute),
        cmocka_unit_test(allowance_bad_inputs_leave_output_untouched),
        cmocka_unit_test(dose_osmoles_hand_worked),
        cmocka_unit_test(dose_osmoles_linear),
        cmocka_unit_test(dose_osmoles_bad_inputs_leave_output_untouched),
        cmocka_unit_test(with_dose_hand_worked),
        cmocka_unit_test(with_dose_monotone),
        cmocka_unit_test(with_dose_bad_inputs_leave_output_untouched),
        cmocka_unit_test(dose_for_hand_worked),
        cmocka_unit_test(dose_for_round_trips),
        cmocka_unit_test(dose_for_bad_inputs_leave_output_untouched),
        cmocka_unit_test(outlook_restriction_fails),
        cmocka_unit_test(outlook_target_holds_or_needs_solute),
        cmocka_unit_test(outlook_agrees_with_the_parts),
        cmocka_unit_test(outlook_bad_inputs_leave_output_untouched),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
