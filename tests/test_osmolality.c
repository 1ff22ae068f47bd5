/* SPDX-License-Identifier: MIT */
/* Osmolality and tonicity: ntr_osm_calculated, ntr_osm_effective,
 * ntr_osm_gap (docs/osmolality.md). */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <cmocka.h>

#include "natremia_test.h"

static double mmol_from_mg_dl(int analyte, double mg_dl)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_convert(analyte, mg_dl, NTR_UNIT_MG_DL, NTR_UNIT_MMOL_L, &out), NTR_OK);
    return out;
}

static double osm(double na, double glucose, double urea, double ethanol, int formula)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_osm_calculated(na, glucose, urea, ethanol, formula, &out), NTR_OK);
    return out;
}

/* ---- ntr_osm_calculated ----------------------------------------------- */

/* Source: the conventional bedside formula in US units,
 * Osm = 2*Na + glucose(mg/dL)/18 + BUN(mg/dL)/2.8, as printed in general
 * medical texts. The library takes mmol/L, so the mg/dL inputs go through
 * ntr_convert. The divisors 18 and 2.8 are rounded molar masses / 10
 * (18.016, 2.8014): up to glucose 1000 mg/dL and BUN 150 mg/dL that
 * rounding is under 0.1 mOsm/kg, the tolerance used. */
static void calculated_2na_matches_the_mg_dl_bedside_formula(void **state)
{
    static const double na[] = {110.0, 125.0, 140.0, 160.0};
    static const double glucose_mg_dl[] = {70.0, 90.0, 250.0, 600.0, 1000.0};
    static const double bun_mg_dl[] = {7.0, 14.0, 40.0, 100.0, 150.0};
    size_t i, j, k;
    (void)state;
    for (i = 0; i < 4; i++) {
        for (j = 0; j < 5; j++) {
            for (k = 0; k < 5; k++) {
                double expected = 2.0 * na[i] + glucose_mg_dl[j] / 18.0 + bun_mg_dl[k] / 2.8;
                double got = osm(na[i], mmol_from_mg_dl(NTR_ANALYTE_GLUCOSE, glucose_mg_dl[j]),
                                 mmol_from_mg_dl(NTR_ANALYTE_UREA_NITROGEN, bun_mg_dl[k]), 0.0,
                                 NTR_OSM_2NA);
                assert_near(got, expected, 0.1);
            }
        }
    }
    /* Hand-worked: Na 140, glucose 90 mg/dL, BUN 14 mg/dL -> 290. */
    assert_near(osm(140.0, mmol_from_mg_dl(NTR_ANALYTE_GLUCOSE, 90.0),
                    mmol_from_mg_dl(NTR_ANALYTE_UREA_NITROGEN, 14.0), 0.0, NTR_OSM_2NA),
                290.0, 0.02);
}

/* Source: Dorwart WV, Chalmers L, Clin Chem 1975;21:190-4: their best
 * formula 1.86*Na + glucose/18 + BUN/2.8 + 9 (mg/dL). Hand-worked with the
 * published coefficients: Na 140, glucose 90 mg/dL, BUN 14 mg/dL gives
 * 260.4 + 5 + 5 + 9 = 279.4. Same 0.1 tolerance for the divisor rounding. */
static void calculated_dorwart_chalmers_published_coefficients(void **state)
{
    static const double na[] = {105.0, 132.0, 140.0, 175.0};
    static const double glucose_mg_dl[] = {80.0, 400.0, 900.0};
    static const double bun_mg_dl[] = {10.0, 60.0, 140.0};
    size_t i, j, k;
    (void)state;
    assert_near(osm(140.0, mmol_from_mg_dl(NTR_ANALYTE_GLUCOSE, 90.0),
                    mmol_from_mg_dl(NTR_ANALYTE_UREA_NITROGEN, 14.0), 0.0,
                    NTR_OSM_DORWART_CHALMERS),
                279.4, 0.02);
    for (i = 0; i < 4; i++) {
        for (j = 0; j < 3; j++) {
            for (k = 0; k < 3; k++) {
                double expected =
                    1.86 * na[i] + glucose_mg_dl[j] / 18.0 + bun_mg_dl[k] / 2.8 + 9.0;
                double got = osm(na[i], mmol_from_mg_dl(NTR_ANALYTE_GLUCOSE, glucose_mg_dl[j]),
                                 mmol_from_mg_dl(NTR_ANALYTE_UREA_NITROGEN, bun_mg_dl[k]), 0.0,
                                 NTR_OSM_DORWART_CHALMERS);
                assert_near(got, expected, 0.1);
            }
        }
    }
}

/* Source: the conventional ethanol term ethanol(mg/dL)/4.6 (ideal solute,
 * molar mass 46.07 g/mol; common practice). 230 mg/dL adds about 50. */
static void calculated_ethanol_term_is_mg_dl_over_4_6(void **state)
{
    double ethanol = mmol_from_mg_dl(NTR_ANALYTE_ETHANOL, 230.0);
    (void)state;
    assert_near(osm(140.0, 5.0, 5.0, ethanol, NTR_OSM_2NA) - osm(140.0, 5.0, 5.0, 0.0, NTR_OSM_2NA),
                230.0 / 4.6, 0.1);
    assert_near(osm(140.0, 5.0, 5.0, ethanol, NTR_OSM_DORWART_CHALMERS) -
                    osm(140.0, 5.0, 5.0, 0.0, NTR_OSM_DORWART_CHALMERS),
                230.0 / 4.6, 0.1);
}

/* Property: each solute adds one-for-one; sodium adds 2 (or 1.86). */
static void calculated_is_monotone_with_the_published_slopes(void **state)
{
    int f;
    (void)state;
    for (f = NTR_OSM_2NA; f <= NTR_OSM_DORWART_CHALMERS; f++) {
        double base = osm(130.0, 10.0, 8.0, 4.0, f);
        double na_slope = f == NTR_OSM_2NA ? 2.0 : 1.86;
        assert_near(osm(131.0, 10.0, 8.0, 4.0, f) - base, na_slope, 1e-9);
        assert_near(osm(130.0, 11.0, 8.0, 4.0, f) - base, 1.0, 1e-9);
        assert_near(osm(130.0, 10.0, 9.0, 4.0, f) - base, 1.0, 1e-9);
        assert_near(osm(130.0, 10.0, 8.0, 5.0, f) - base, 1.0, 1e-9);
    }
}

static int call_osm_2na(const double *a, double *out)
{
    return ntr_osm_calculated(a[0], a[1], a[2], a[3], NTR_OSM_2NA, out);
}

static int call_osm_dc(const double *a, double *out)
{
    return ntr_osm_calculated(a[0], a[1], a[2], a[3], NTR_OSM_DORWART_CHALMERS, out);
}

static void calculated_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges (docs/ranges.md): Na 80-220, glucose 0-200, urea 0-200,
     * ethanol 0-400 mmol/L. */
    const struct ntr_test_inputs two_na = {
        call_osm_2na, 4, {140.0, 5.0, 5.0, 0.0}, {80.0, 0.0, 0.0, 0.0},
        {220.0, 200.0, 200.0, 400.0}};
    struct ntr_test_inputs dc = two_na;
    double out = NTR_TEST_SENTINEL;
    (void)state;
    dc.call = call_osm_dc;
    ntr_test_bad_inputs(&two_na);
    ntr_test_bad_inputs(&dc);

    assert_int_equal(ntr_osm_calculated(140.0, 5.0, 5.0, 0.0, NTR_OSM_2NA, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_osm_calculated((double)NAN, 5.0, 5.0, 0.0, 0, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_osm_calculated(140.0, 5.0, 5.0, 0.0, 0, &out), NTR_ERR_ARG);
    assert_int_equal(ntr_osm_calculated(140.0, 5.0, 5.0, 0.0, 3, &out), NTR_ERR_ARG);
    assert_int_equal(ntr_osm_calculated(140.0, 5.0, 5.0, 0.0, -1, &out), NTR_ERR_ARG);
    /* Unknown formula is reported before bad numbers. */
    assert_int_equal(ntr_osm_calculated((double)NAN, -1.0, 5.0, 0.0, 7, &out), NTR_ERR_ARG);
    assert_true(out == NTR_TEST_SENTINEL);
}

/* ---- ntr_osm_effective ------------------------------------------------- */

/* Source: Spasovski G et al., Eur J Endocrinol 2014;170:G1-47 (European
 * hyponatraemia guideline): effective osmolality = 2*Na + glucose, mmol/L;
 * urea is an ineffective osmole. Hand-worked: Na 140, glucose 5 -> 285;
 * Na 125 with glucose 40 (hyperglycaemia) -> 290, i.e. not hypotonic. */
static void effective_is_2na_plus_glucose(void **state)
{
    double out = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_osm_effective(140.0, 5.0, &out), NTR_OK);
    assert_near(out, 285.0, 1e-9);
    assert_int_equal(ntr_osm_effective(125.0, 40.0, &out), NTR_OK);
    assert_near(out, 290.0, 1e-9);
}

/* Property: effective + urea equals the 2*Na calculated osmolality (no
 * ethanol), and effective osmolality rises one-for-one with glucose. */
static void effective_plus_urea_is_calculated_and_monotone(void **state)
{
    static const double glucose[] = {0.0, 3.0, 5.5, 20.0, 60.0, 200.0};
    double previous = -1.0;
    size_t i;
    (void)state;
    for (i = 0; i < sizeof glucose / sizeof glucose[0]; i++) {
        double eff = NTR_TEST_SENTINEL;
        assert_int_equal(ntr_osm_effective(118.0, glucose[i], &eff), NTR_OK);
        assert_near(eff + 12.0, osm(118.0, glucose[i], 12.0, 0.0, NTR_OSM_2NA), 1e-9);
        assert_true(eff > previous);
        previous = eff;
    }
}

static int call_effective(const double *a, double *out)
{
    return ntr_osm_effective(a[0], a[1], out);
}

static void effective_bad_inputs_leave_output_untouched(void **state)
{
    const struct ntr_test_inputs in = {call_effective, 2, {140.0, 5.0}, {80.0, 0.0}, {220.0, 200.0}};
    (void)state;
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_osm_effective(140.0, 5.0, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_osm_effective((double)NAN, -HUGE_VAL, NULL), NTR_ERR_NULL);
}

/* ---- ntr_osm_gap -------------------------------------------------------- */

/* Source: textbook definition, gap = measured - calculated; a gap under
 * about 10 mOsm/kg is normal (common practice). Hand-worked: measured 295,
 * calculated 290 -> 5 (normal); measured 330, calculated 290 -> 40. */
static void gap_is_measured_minus_calculated(void **state)
{
    double gap = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_osm_gap(295.0, 290.0, &gap), NTR_OK);
    assert_near(gap, 5.0, 1e-9);
    assert_true(gap < 10.0);
    assert_int_equal(ntr_osm_gap(330.0, 290.0, &gap), NTR_OK);
    assert_near(gap, 40.0, 1e-9);
}

/* Property: antisymmetry gap(a, b) = -gap(b, a); zero for equal values. */
static void gap_is_antisymmetric(void **state)
{
    static const double values[] = {150.0, 250.5, 290.0, 333.3, 600.0};
    size_t i, j;
    (void)state;
    for (i = 0; i < 5; i++) {
        for (j = 0; j < 5; j++) {
            double ab = NTR_TEST_SENTINEL, ba = NTR_TEST_SENTINEL;
            assert_int_equal(ntr_osm_gap(values[i], values[j], &ab), NTR_OK);
            assert_int_equal(ntr_osm_gap(values[j], values[i], &ba), NTR_OK);
            assert_true(ab == -ba);
            if (i == j) {
                assert_true(ab == 0.0);
            }
        }
    }
}

/* Property chained with the calculated osmolality: a measured value equal to
 * the calculated one plus an ethanol term leaves a gap equal to that term. */
static void gap_recovers_an_unmeasured_ethanol_load(void **state)
{
    double with = osm(138.0, 6.0, 4.0, 25.0, NTR_OSM_2NA);
    double without = osm(138.0, 6.0, 4.0, 0.0, NTR_OSM_2NA);
    double gap = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_osm_gap(with, without, &gap), NTR_OK);
    assert_near(gap, 25.0, 1e-9);
}

static int call_gap(const double *a, double *out)
{
    return ntr_osm_gap(a[0], a[1], out);
}

static void gap_bad_inputs_leave_output_untouched(void **state)
{
    /* Range of both: 150 to 600 mOsm/kg. */
    const struct ntr_test_inputs in = {call_gap, 2, {300.0, 290.0}, {150.0, 150.0}, {600.0, 600.0}};
    (void)state;
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_osm_gap(300.0, 290.0, NULL), NTR_ERR_NULL);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(calculated_2na_matches_the_mg_dl_bedside_formula),
        cmocka_unit_test(calculated_dorwart_chalmers_published_coefficients),
        cmocka_unit_test(calculated_ethanol_term_is_mg_dl_over_4_6),
        cmocka_unit_test(calculated_is_monotone_with_the_published_slopes),
        cmocka_unit_test(calculated_bad_inputs_leave_output_untouched),
        cmocka_unit_test(effective_is_2na_plus_glucose),
        cmocka_unit_test(effective_plus_urea_is_calculated_and_monotone),
        cmocka_unit_test(effective_bad_inputs_leave_output_untouched),
        cmocka_unit_test(gap_is_measured_minus_calculated),
        cmocka_unit_test(gap_is_antisymmetric),
        cmocka_unit_test(gap_recovers_an_unmeasured_ethanol_load),
        cmocka_unit_test(gap_bad_inputs_leave_output_untouched),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
