/* SPDX-License-Identifier: MIT */
/* Urine indices: ntr_furst_ratio, ntr_restriction_from_ratio, ntr_efwc
 * (docs/urine.md). */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <cmocka.h>

#include "natremia_test.h"

static double furst(double una, double uk, double sna)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_furst_ratio(una, uk, sna, &out), NTR_OK);
    return out;
}

static int advice_for(double ratio)
{
    int advice = NTR_TEST_SENTINEL_INT;
    assert_int_equal(ntr_restriction_from_ratio(ratio, &advice), NTR_OK);
    return advice;
}

static double efwc(double volume, double una, double uk, double sna)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_efwc(volume, una, uk, sna, &out), NTR_OK);
    return out;
}

/* ---- ntr_furst_ratio -------------------------------------------------------- */

/* Source: Furst H et al., Am J Med Sci 2000;319:240-4: the ratio is
 * (urine Na + urine K) / serum Na. Hand-worked: U_Na 60, U_K 20, S_Na 125
 * -> 0.64 (< 1); U_Na 80, U_K 40, S_Na 120 -> 1.0; U_Na 130, U_K 50,
 * S_Na 125 -> 1.44 (> 1). */
static void ratio_worked_examples(void **state)
{
    (void)state;
    assert_near(furst(60.0, 20.0, 125.0), 0.64, 1e-12);
    assert_near(furst(80.0, 40.0, 120.0), 1.0, 1e-12);
    assert_near(furst(130.0, 50.0, 125.0), 1.44, 1e-12);
}

/* Property: rises with urine Na and K, falls with serum Na; Na and K count
 * alike. */
static void ratio_monotone(void **state)
{
    (void)state;
    assert_true(furst(81.0, 40.0, 120.0) > furst(80.0, 40.0, 120.0));
    assert_true(furst(80.0, 41.0, 120.0) > furst(80.0, 40.0, 120.0));
    assert_true(furst(80.0, 40.0, 121.0) < furst(80.0, 40.0, 120.0));
    assert_true(furst(70.0, 50.0, 120.0) == furst(80.0, 40.0, 120.0));
}

static int call_ratio(const double *a, double *out)
{
    return ntr_furst_ratio(a[0], a[1], a[2], out);
}

static void ratio_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges: urine Na 0-500, urine K 0-300, serum Na 80-220 mmol/L. */
    const struct ntr_test_inputs in = {call_ratio, 3, {80.0, 40.0, 120.0}, {0.0, 0.0, 80.0},
                                       {500.0, 300.0, 220.0}};
    (void)state;
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_furst_ratio(80.0, 40.0, 120.0, NULL), NTR_ERR_NULL);
}

/* ---- ntr_restriction_from_ratio --------------------------------------------- */

/* Source: Furst et al. 2000 table: ratio < 1 -> under 1 L/day; about 1 ->
 * 500-700 mL/day; > 1 -> under 500 mL/day. Verbalis JG et al., Am J Med
 * 2013;126(10 Suppl 1):S1-42 list a ratio > 1 as a predictor that
 * restriction will fail. The library's "about 1" band is 0.9 to 1.0
 * inclusive (its own choice, docs/urine.md). */
static void restriction_bands_from_the_paper(void **state)
{
    (void)state;
    assert_int_equal(advice_for(0.5), NTR_RESTRICT_1000ML);
    assert_int_equal(advice_for(0.95), NTR_RESTRICT_500_700ML);
    assert_int_equal(advice_for(1.5), NTR_RESTRICT_500ML);
    assert_int_equal(advice_for(furst(130.0, 50.0, 125.0)), NTR_RESTRICT_500ML);
    assert_int_equal(advice_for(furst(60.0, 20.0, 125.0)), NTR_RESTRICT_1000ML);
}

/* Both edges of the "about 1" band: 0.9 and 1.0 are inside (inclusive); the
 * nearest doubles outside fall into the neighbouring bands. */
static void restriction_about_one_band_edges(void **state)
{
    (void)state;
    assert_true(NTR_FURST_ABOUT_ONE_LOW == 0.9);
    assert_true(NTR_FURST_ABOUT_ONE_HIGH == 1.0);
    assert_int_equal(advice_for(0.9), NTR_RESTRICT_500_700ML);
    assert_int_equal(advice_for(1.0), NTR_RESTRICT_500_700ML);
    assert_int_equal(advice_for(nextafter(0.9, 0.0)), NTR_RESTRICT_1000ML);
    assert_int_equal(advice_for(nextafter(1.0, 2.0)), NTR_RESTRICT_500ML);
    assert_int_equal(advice_for(0.89), NTR_RESTRICT_1000ML);
    assert_int_equal(advice_for(1.01), NTR_RESTRICT_500ML);
    /* The range ends. */
    assert_int_equal(advice_for(0.0), NTR_RESTRICT_1000ML);
    assert_int_equal(advice_for(20.0), NTR_RESTRICT_500ML);
}

/* Property: the advice never loosens as the ratio rises (the enumerator
 * values rise with strictness). */
static void restriction_monotone_in_ratio(void **state)
{
    int previous = NTR_RESTRICT_1000ML;
    double r;
    (void)state;
    for (r = 0.0; r <= 3.0; r += 0.001) {
        int advice = advice_for(r);
        assert_true(advice >= previous);
        previous = advice;
    }
    assert_int_equal(previous, NTR_RESTRICT_500ML);
}

static void restriction_bad_inputs_leave_output_untouched(void **state)
{
    /* Range: 0 to 20. */
    const double bad[] = {(double)NAN, HUGE_VAL, -HUGE_VAL, nextafter(0.0, -1.0),
                          nextafter(20.0, 21.0), -1.0};
    const int expected[] = {NTR_ERR_NONFINITE, NTR_ERR_NONFINITE, NTR_ERR_NONFINITE,
                            NTR_ERR_RANGE,     NTR_ERR_RANGE,     NTR_ERR_RANGE};
    size_t i;
    (void)state;
    for (i = 0; i < sizeof bad / sizeof bad[0]; i++) {
        int advice = NTR_TEST_SENTINEL_INT;
        assert_int_equal(ntr_restriction_from_ratio(bad[i], &advice), expected[i]);
        assert_int_equal(advice, NTR_TEST_SENTINEL_INT);
    }
    assert_int_equal(ntr_restriction_from_ratio(1.0, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_restriction_from_ratio((double)NAN, NULL), NTR_ERR_NULL);
}

/* ---- ntr_efwc -------------------------------------------------------------- */

/* Source: standard renal physiology (e.g. Rose & Post, Clinical Physiology
 * of Acid-Base and Electrolyte Disorders): EFWC = V*(1 - (U_Na+U_K)/S_Na).
 * Hand-worked: 2 L urine, U_Na 50, U_K 20, S_Na 140 -> 2*(1 - 0.5) =
 * 1.0 L cleared; 1 L, U_Na 150, U_K 60, S_Na 120 -> 1*(1 - 1.75) =
 * -0.75 L (water retained). */
static void efwc_worked_examples(void **state)
{
    (void)state;
    assert_near(efwc(2.0, 50.0, 20.0, 140.0), 1.0, 1e-12);
    assert_near(efwc(1.0, 150.0, 60.0, 120.0), -0.75, 1e-12);
}

/* Property: EFWC = V*(1 - Furst ratio); it is positive exactly when the
 * ratio is below 1; it scales with the urine volume and is 0 at V = 0. */
static void efwc_agrees_with_the_ratio(void **state)
{
    static const double una[] = {0.0, 20.0, 60.0, 100.0, 180.0, 500.0};
    static const double uk[] = {0.0, 15.0, 40.0, 300.0};
    size_t i, j;
    (void)state;
    for (i = 0; i < sizeof una / sizeof una[0]; i++) {
        for (j = 0; j < sizeof uk / sizeof uk[0]; j++) {
            double ratio = furst(una[i], uk[j], 128.0);
            double cleared = efwc(1.6, una[i], uk[j], 128.0);
            assert_near(cleared, 1.6 * (1.0 - ratio), 1e-12);
            assert_true((cleared > 0.0) == (ratio < 1.0));
            assert_near(efwc(3.2, una[i], uk[j], 128.0), 2.0 * cleared, 1e-12);
            assert_true(efwc(0.0, una[i], uk[j], 128.0) == 0.0);
        }
    }
}

static int call_efwc(const double *a, double *out)
{
    return ntr_efwc(a[0], a[1], a[2], a[3], out);
}

static void efwc_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges: urine volume 0-30 L, urine Na 0-500, urine K 0-300, serum Na
     * 80-220 mmol/L. */
    const struct ntr_test_inputs in = {call_efwc, 4, {1.5, 80.0, 40.0, 120.0},
                                       {0.0, 0.0, 0.0, 80.0}, {30.0, 500.0, 300.0, 220.0}};
    (void)state;
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_efwc(1.5, 80.0, 40.0, 120.0, NULL), NTR_ERR_NULL);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(ratio_worked_examples),
        cmocka_unit_test(ratio_monotone),
        cmocka_unit_test(ratio_bad_inputs_leave_output_untouched),
        cmocka_unit_test(restriction_bands_from_the_paper),
        cmocka_unit_test(restriction_about_one_band_edges),
        cmocka_unit_test(restriction_monotone_in_ratio),
        cmocka_unit_test(restriction_bad_inputs_leave_output_untouched),
        cmocka_unit_test(efwc_worked_examples),
        cmocka_unit_test(efwc_agrees_with_the_ratio),
        cmocka_unit_test(efwc_bad_inputs_leave_output_untouched),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
