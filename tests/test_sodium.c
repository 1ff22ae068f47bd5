/* SPDX-License-Identifier: MIT */
/* Sodium: glucose-corrected sodium and sodium deficit (docs/sodium.md). */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <cmocka.h>

#include "natremia_test.h"

static double glucose_mmol_from_mg_dl(double mg_dl)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_convert(NTR_ANALYTE_GLUCOSE, mg_dl, NTR_UNIT_MG_DL, NTR_UNIT_MMOL_L, &out),
                     NTR_OK);
    return out;
}

static double corrected(double na, double glucose_mmol_l, int method)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_na_corrected_glucose(na, glucose_mmol_l, method, &out), NTR_OK);
    return out;
}

static double corrected_factor(double na, double glucose_mmol_l, double factor)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_na_corrected_glucose_factor(na, glucose_mmol_l, factor, &out), NTR_OK);
    return out;
}

/* ---- ntr_na_corrected_glucose ------------------------------------------ */

/* Source: Katz MA, N Engl J Med 1973;289:843-4: sodium falls 1.6 mmol/L per
 * 100 mg/dL of glucose above 100 mg/dL. Hillier TA et al., Am J Med
 * 1999;106:399-403: 2.4 per 100 mg/dL (both factors checked against
 * Hillier's published abstract). Hand-worked from them:
 * Na 130 with glucose 600 mg/dL -> Katz 130 + 1.6*5 = 138.0,
 * Hillier 130 + 2.4*5 = 142.0; glucose 400 mg/dL -> +4.8 and +7.2. */
static void corrected_glucose_katz_and_hillier_worked(void **state)
{
    (void)state;
    assert_near(corrected(130.0, glucose_mmol_from_mg_dl(600.0), NTR_GLUCOSE_KATZ), 138.0, 1e-9);
    assert_near(corrected(130.0, glucose_mmol_from_mg_dl(600.0), NTR_GLUCOSE_HILLIER), 142.0,
                1e-9);
    assert_near(corrected(125.0, glucose_mmol_from_mg_dl(400.0), NTR_GLUCOSE_KATZ), 129.8, 1e-9);
    assert_near(corrected(125.0, glucose_mmol_from_mg_dl(400.0), NTR_GLUCOSE_HILLIER), 132.2,
                1e-9);
    /* The same case with glucose as a laboratory reports it in SI units,
     * 33.3 mmol/L (about 600 mg/dL): within 0.01 of the worked result. */
    assert_near(corrected(130.0, 33.3, NTR_GLUCOSE_KATZ), 138.0, 0.01);
    assert_near(corrected(130.0, 33.3, NTR_GLUCOSE_HILLIER), 142.0, 0.01);
}

/* Both papers take 100 mg/dL as the reference: no correction at or below
 * it (both sources). */
static void corrected_glucose_no_change_at_or_below_100_mg_dl(void **state)
{
    static const double glucose_mg_dl[] = {0.0, 40.0, 72.0, 99.9, 100.0};
    size_t i;
    (void)state;
    for (i = 0; i < sizeof glucose_mg_dl / sizeof glucose_mg_dl[0]; i++) {
        double g = glucose_mmol_from_mg_dl(glucose_mg_dl[i]);
        assert_near(corrected(128.0, g, NTR_GLUCOSE_KATZ), 128.0, 1e-9);
        assert_near(corrected(128.0, g, NTR_GLUCOSE_HILLIER), 128.0, 1e-9);
    }
}

/* Property (unit invariance): converting mg/dL to mmol/L with ntr_convert
 * and correcting gives Na + factor*(G_mg_dl - 100)/100 computed here in
 * mg/dL, for a grid of values. */
static void corrected_glucose_unit_invariance(void **state)
{
    static const double glucose_mg_dl[] = {150.0, 250.0, 500.0, 1000.0, 2000.0, 3500.0};
    static const double factors[] = {0.0, 1.6, 2.0, 2.4, 4.0, 5.0};
    size_t i, j;
    (void)state;
    for (i = 0; i < sizeof glucose_mg_dl / sizeof glucose_mg_dl[0]; i++) {
        for (j = 0; j < sizeof factors / sizeof factors[0]; j++) {
            double expected = 120.0 + factors[j] * (glucose_mg_dl[i] - 100.0) / 100.0;
            assert_near(corrected_factor(120.0, glucose_mmol_from_mg_dl(glucose_mg_dl[i]),
                                         factors[j]),
                        expected, 1e-6);
        }
    }
}

/* Property: the named methods equal the factor form with 1.6 and 2.4; the
 * correction rises monotonically with glucose and is continuous at the
 * 100 mg/dL reference; Hillier's correction is 1.5 times Katz's. */
static void corrected_glucose_monotone_and_consistent(void **state)
{
    double previous = 0.0;
    double g;
    (void)state;
    for (g = 0.0; g <= 200.0; g += 0.5) {
        double katz = corrected(131.0, g, NTR_GLUCOSE_KATZ);
        double hillier = corrected(131.0, g, NTR_GLUCOSE_HILLIER);
        assert_true(katz == corrected_factor(131.0, g, 1.6));
        assert_true(hillier == corrected_factor(131.0, g, 2.4));
        assert_true(katz >= previous);
        assert_true(hillier >= katz);
        if (katz > 131.0) {
            assert_near((hillier - 131.0) / (katz - 131.0), 1.5, 1e-9);
        }
        previous = katz;
    }
    /* Continuity: just above the reference the correction is tiny. */
    assert_near(corrected(131.0, glucose_mmol_from_mg_dl(100.001), NTR_GLUCOSE_HILLIER), 131.0,
                1e-4);
}

static int call_corrected_katz(const double *a, double *out)
{
    return ntr_na_corrected_glucose(a[0], a[1], NTR_GLUCOSE_KATZ, out);
}

static int call_corrected_hillier(const double *a, double *out)
{
    return ntr_na_corrected_glucose(a[0], a[1], NTR_GLUCOSE_HILLIER, out);
}

static int call_corrected_factor(const double *a, double *out)
{
    return ntr_na_corrected_glucose_factor(a[0], a[1], a[2], out);
}

static void corrected_glucose_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges: Na 80-220, glucose 0-200 mmol/L, factor 0-5. */
    struct ntr_test_inputs in = {call_corrected_katz, 2, {125.0, 30.0}, {80.0, 0.0}, {220.0, 200.0}};
    const struct ntr_test_inputs factor = {call_corrected_factor, 3, {125.0, 30.0, 2.0},
                                           {80.0, 0.0, 0.0}, {220.0, 200.0, 5.0}};
    double out = NTR_TEST_SENTINEL;
    (void)state;
    ntr_test_bad_inputs(&in);
    in.call = call_corrected_hillier;
    ntr_test_bad_inputs(&in);
    ntr_test_bad_inputs(&factor);

    assert_int_equal(ntr_na_corrected_glucose(125.0, 30.0, NTR_GLUCOSE_KATZ, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_na_corrected_glucose((double)NAN, 30.0, 9, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_na_corrected_glucose_factor(125.0, 30.0, 2.0, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_na_corrected_glucose(125.0, 30.0, 0, &out), NTR_ERR_ARG);
    assert_int_equal(ntr_na_corrected_glucose(125.0, 30.0, 3, &out), NTR_ERR_ARG);
    assert_int_equal(ntr_na_corrected_glucose((double)NAN, -5.0, -2, &out), NTR_ERR_ARG);
    assert_true(out == NTR_TEST_SENTINEL);
}

/* ---- ntr_na_deficit ------------------------------------------------------ */

/* Source: common practice (sodium-deficit formula of general medical
 * texts), hand-worked: TBW 30 L, Na 120, target 130 -> 30*10 = 300 mmol,
 * which is 300/513 = 0.585 L of 3% saline (513 mmol/L, Adrogue & Madias
 * 2000 table). */
static void deficit_worked_example(void **state)
{
    double mmol = NTR_TEST_SENTINEL;
    double na3 = NTR_TEST_SENTINEL, k3 = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_na_deficit(30.0, 120.0, 130.0, &mmol), NTR_OK);
    assert_near(mmol, 300.0, 1e-9);
    assert_int_equal(ntr_fluid_preset(NTR_FLUID_NACL_3, &na3, &k3), NTR_OK);
    assert_near(mmol / na3, 0.585, 0.001);
}

/* The deficit ignores the water the sodium comes in. Hand-worked by mass
 * balance: 300 mmol as 0.585 L of 3% saline on Na 120 and TBW 30 L gives
 * (120 x 30 + 0.585 x 513) / 30.585 = 3900.105 / 30.585 = 127.52, not the
 * 130 aimed at; with the unrounded 300/513 L, 3900 / 30.5848 = 127.51. The
 * same shortfall as the Furst example (tests/test_infusion.c). */
static void deficit_ignores_the_water_given(void **state)
{
    double mmol = NTR_TEST_SENTINEL, delta = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_na_deficit(30.0, 120.0, 130.0, &mmol), NTR_OK);
    assert_int_equal(ntr_infusate_change(120.0, 30.0, 513.0, 0.0, 0.585, &delta), NTR_OK);
    assert_near(120.0 + delta, 127.52, 0.005);
    assert_int_equal(ntr_infusate_change(120.0, 30.0, 513.0, 0.0, mmol / 513.0, &delta),
                     NTR_OK);
    assert_near(120.0 + delta, 127.51, 0.005);
    assert_true(120.0 + delta < 130.0 - 2.0);
}

/* Property: deficits add along a path (a -> b -> c equals a -> c), scale
 * with TBW, and are zero when the target is the current value. */
static void deficit_is_additive_and_proportional(void **state)
{
    double ab = 0.0, bc = 0.0, ac = 0.0, doubled = 0.0, zero = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_na_deficit(27.5, 112.0, 119.0, &ab), NTR_OK);
    assert_int_equal(ntr_na_deficit(27.5, 119.0, 126.5, &bc), NTR_OK);
    assert_int_equal(ntr_na_deficit(27.5, 112.0, 126.5, &ac), NTR_OK);
    assert_near(ab + bc, ac, 1e-9);
    assert_int_equal(ntr_na_deficit(55.0, 112.0, 126.5, &doubled), NTR_OK);
    assert_near(doubled, 2.0 * ac, 1e-9);
    assert_int_equal(ntr_na_deficit(27.5, 126.5, 126.5, &zero), NTR_OK);
    assert_true(zero == 0.0);
}

static int call_deficit(const double *a, double *out)
{
    return ntr_na_deficit(a[0], a[1], a[2], out);
}

static void deficit_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges: TBW 0.1-400 L, Na and target 80-220 mmol/L. */
    const struct ntr_test_inputs in = {call_deficit, 3, {30.0, 120.0, 130.0}, {0.1, 80.0, 80.0},
                                       {400.0, 220.0, 220.0}};
    double out = NTR_TEST_SENTINEL;
    (void)state;
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_na_deficit(30.0, 120.0, 130.0, NULL), NTR_ERR_NULL);
    /* A target below the current sodium is not a deficit. */
    assert_int_equal(ntr_na_deficit(30.0, 130.0, 129.9, &out), NTR_ERR_DOMAIN);
    assert_true(out == NTR_TEST_SENTINEL);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(corrected_glucose_katz_and_hillier_worked),
        cmocka_unit_test(corrected_glucose_no_change_at_or_below_100_mg_dl),
        cmocka_unit_test(corrected_glucose_unit_invariance),
        cmocka_unit_test(corrected_glucose_monotone_and_consistent),
        cmocka_unit_test(corrected_glucose_bad_inputs_leave_output_untouched),
        cmocka_unit_test(deficit_worked_example),
        cmocka_unit_test(deficit_ignores_the_water_given),
        cmocka_unit_test(deficit_is_additive_and_proportional),
        cmocka_unit_test(deficit_bad_inputs_leave_output_untouched),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
