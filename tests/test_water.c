/* SPDX-License-Identifier: MIT */
/* Body water and free-water deficit: ntr_tbw_fraction, ntr_tbw_watson,
 * ntr_free_water_deficit (docs/water.md). */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <cmocka.h>

#include "natremia_test.h"

static double fraction_tbw(int sex, double age, double weight)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_tbw_fraction(sex, age, weight, &out), NTR_OK);
    return out;
}

static double watson(int sex, double age, double height, double weight)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_tbw_watson(sex, age, height, weight, &out), NTR_OK);
    return out;
}

/* ---- ntr_tbw_fraction ---------------------------------------------------- */

/* Source: Adrogue HJ, Madias NE, N Engl J Med 2000;342:1581-9: body water
 * is 0.6 of weight in children, 0.6 and 0.5 in non-elderly men and women,
 * 0.5 and 0.45 in elderly men and women. Hand-worked: 70 kg man aged 40 ->
 * 42 L; 60 kg woman aged 40 -> 30 L; 70 kg man aged 70 -> 35 L; 60 kg woman
 * aged 75 -> 27 L; 20 kg child aged 7 -> 12 L. */
static void fraction_published_fractions(void **state)
{
    (void)state;
    assert_near(fraction_tbw(NTR_SEX_MALE, 40.0, 70.0), 42.0, 1e-9);
    assert_near(fraction_tbw(NTR_SEX_FEMALE, 40.0, 60.0), 30.0, 1e-9);
    assert_near(fraction_tbw(NTR_SEX_MALE, 70.0, 70.0), 35.0, 1e-9);
    assert_near(fraction_tbw(NTR_SEX_FEMALE, 75.0, 60.0), 27.0, 1e-9);
    assert_near(fraction_tbw(NTR_SEX_MALE, 7.0, 20.0), 12.0, 1e-9);
    assert_near(fraction_tbw(NTR_SEX_FEMALE, 7.0, 20.0), 12.0, 1e-9);
}

/* The age bands are the library's documented choice (docs/water.md):
 * child below 18 years, elderly from 65 years. Both edges, both sexes. */
static void fraction_age_band_edges(void **state)
{
    double just_below_18 = nextafter(18.0, 0.0);
    double just_below_65 = nextafter(65.0, 0.0);
    (void)state;
    assert_near(fraction_tbw(NTR_SEX_FEMALE, just_below_18, 100.0), 60.0, 1e-9);
    assert_near(fraction_tbw(NTR_SEX_FEMALE, 18.0, 100.0), 50.0, 1e-9);
    assert_near(fraction_tbw(NTR_SEX_MALE, just_below_18, 100.0), 60.0, 1e-9);
    assert_near(fraction_tbw(NTR_SEX_MALE, 18.0, 100.0), 60.0, 1e-9);
    assert_near(fraction_tbw(NTR_SEX_FEMALE, just_below_65, 100.0), 50.0, 1e-9);
    assert_near(fraction_tbw(NTR_SEX_FEMALE, 65.0, 100.0), 45.0, 1e-9);
    assert_near(fraction_tbw(NTR_SEX_MALE, just_below_65, 100.0), 60.0, 1e-9);
    assert_near(fraction_tbw(NTR_SEX_MALE, 65.0, 100.0), 50.0, 1e-9);
}

/* Property: proportional to weight; never rises with age; a woman's
 * estimate never exceeds a man's of the same age and weight. */
static void fraction_proportional_and_monotone(void **state)
{
    double age;
    (void)state;
    for (age = 1.0; age <= 130.0; age += 0.5) {
        double m = fraction_tbw(NTR_SEX_MALE, age, 50.0);
        double f = fraction_tbw(NTR_SEX_FEMALE, age, 50.0);
        assert_near(fraction_tbw(NTR_SEX_MALE, age, 100.0), 2.0 * m, 1e-12);
        assert_true(f <= m);
        if (age >= 1.5) {
            assert_true(m <= fraction_tbw(NTR_SEX_MALE, age - 0.5, 50.0));
            assert_true(f <= fraction_tbw(NTR_SEX_FEMALE, age - 0.5, 50.0));
        }
    }
}

static int call_fraction_male(const double *a, double *out)
{
    return ntr_tbw_fraction(NTR_SEX_MALE, a[0], a[1], out);
}

static int call_fraction_female(const double *a, double *out)
{
    return ntr_tbw_fraction(NTR_SEX_FEMALE, a[0], a[1], out);
}

/* Infants are refused (docs/water.md): newborns hold about 0.75 to 0.8 of
 * their weight as water, falling to about 0.6 by one year (from memory; a
 * paediatric body-composition reference, not the adult rule's source),
 * so 0.6 under-reads a neonate by a fifth. A 3.2 kg term neonate, a
 * 6-month-old and the last double below 1 year give NTR_ERR_RANGE; from 1
 * year the child fraction 0.6 applies: 10 kg at 1 year -> 6 L
 * (hand-worked). */
static void fraction_refuses_infants(void **state)
{
    double out = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_tbw_fraction(NTR_SEX_MALE, 0.0, 3.2, &out), NTR_ERR_RANGE);
    assert_int_equal(ntr_tbw_fraction(NTR_SEX_FEMALE, 0.5, 7.5, &out), NTR_ERR_RANGE);
    assert_int_equal(ntr_tbw_fraction(NTR_SEX_FEMALE, nextafter(1.0, 0.0), 10.0, &out),
                     NTR_ERR_RANGE);
    assert_true(out == NTR_TEST_SENTINEL);
    assert_near(fraction_tbw(NTR_SEX_FEMALE, 1.0, 10.0), 6.0, 1e-12);
}

static void fraction_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges: age 1-130 years, weight 0.3-650 kg. */
    struct ntr_test_inputs in = {call_fraction_male, 2, {50.0, 70.0}, {1.0, 0.3}, {130.0, 650.0}};
    double out = NTR_TEST_SENTINEL;
    (void)state;
    ntr_test_bad_inputs(&in);
    in.call = call_fraction_female;
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_tbw_fraction(NTR_SEX_MALE, 50.0, 70.0, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_tbw_fraction(0, (double)NAN, 70.0, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_tbw_fraction(0, 50.0, 70.0, &out), NTR_ERR_ARG);
    assert_int_equal(ntr_tbw_fraction(3, 50.0, 70.0, &out), NTR_ERR_ARG);
    assert_int_equal(ntr_tbw_fraction(-1, (double)NAN, -1.0, &out), NTR_ERR_ARG);
    assert_true(out == NTR_TEST_SENTINEL);
}

/* ---- ntr_tbw_watson ------------------------------------------------------ */

/* Source: Watson PE, Watson ID, Batt RD, Am J Clin Nutr 1980;33:27-39
 * (coefficients checked against the published abstract):
 *   men   2.447 - 0.09516*age + 0.1074*height + 0.3362*weight
 *   women -2.097 + 0.1069*height + 0.2466*weight.
 * Hand-worked: man 40 y, 175 cm, 75 kg:
 *   2.447 - 3.8064 + 18.795 + 25.215 = 42.6506 L;
 * woman 40 y, 165 cm, 60 kg: -2.097 + 17.6385 + 14.796 = 30.3375 L;
 * man 80 y, 160 cm, 55 kg: 2.447 - 7.6128 + 17.184 + 18.491 = 30.5092 L. */
static void watson_published_equations(void **state)
{
    (void)state;
    assert_near(watson(NTR_SEX_MALE, 40.0, 175.0, 75.0), 42.6506, 1e-9);
    assert_near(watson(NTR_SEX_FEMALE, 40.0, 165.0, 60.0), 30.3375, 1e-9);
    assert_near(watson(NTR_SEX_MALE, 80.0, 160.0, 55.0), 30.5092, 1e-9);
}

/* Cross-method plausibility: for average adults the Watson estimate lies
 * within 10% of the Adrogue-Madias fraction (0.6 men, 0.5 women), as both
 * sources describe typical adults. */
static void watson_agrees_roughly_with_the_fraction_rule(void **state)
{
    double m = watson(NTR_SEX_MALE, 40.0, 175.0, 75.0);
    double f = watson(NTR_SEX_FEMALE, 40.0, 165.0, 60.0);
    (void)state;
    assert_true(ntr_test_rel_close(m, fraction_tbw(NTR_SEX_MALE, 40.0, 75.0), 0.10));
    assert_true(ntr_test_rel_close(f, fraction_tbw(NTR_SEX_FEMALE, 40.0, 60.0), 0.10));
}

/* Property: the women's equation has no age term; the men's falls by
 * 0.09516 L per year; both rise with height and weight by their slopes. */
static void watson_slopes(void **state)
{
    (void)state;
    assert_true(watson(NTR_SEX_FEMALE, 20.0, 160.0, 55.0) ==
                watson(NTR_SEX_FEMALE, 90.0, 160.0, 55.0));
    assert_near(watson(NTR_SEX_MALE, 50.0, 170.0, 80.0) - watson(NTR_SEX_MALE, 60.0, 170.0, 80.0),
                0.9516, 1e-9);
    assert_near(watson(NTR_SEX_MALE, 50.0, 180.0, 80.0) - watson(NTR_SEX_MALE, 50.0, 170.0, 80.0),
                1.074, 1e-9);
    assert_near(watson(NTR_SEX_FEMALE, 50.0, 170.0, 90.0) -
                    watson(NTR_SEX_FEMALE, 50.0, 170.0, 80.0),
                2.466, 1e-9);
}

static int call_watson_male(const double *a, double *out)
{
    return ntr_tbw_watson(NTR_SEX_MALE, a[0], a[1], a[2], out);
}

static int call_watson_female(const double *a, double *out)
{
    return ntr_tbw_watson(NTR_SEX_FEMALE, a[0], a[1], a[2], out);
}

static void watson_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges: age 18-130 years (adults only), height 30-275 cm, weight
     * 0.3-650 kg. */
    struct ntr_test_inputs in = {call_watson_male, 3, {40.0, 175.0, 75.0}, {18.0, 30.0, 0.3},
                                 {130.0, 275.0, 650.0}};
    double out = NTR_TEST_SENTINEL;
    (void)state;
    ntr_test_bad_inputs(&in);
    in.call = call_watson_female;
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_tbw_watson(NTR_SEX_MALE, 40.0, 175.0, 75.0, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_tbw_watson(0, 40.0, 175.0, 75.0, &out), NTR_ERR_ARG);
    assert_int_equal(ntr_tbw_watson(3, (double)NAN, 175.0, 75.0, &out), NTR_ERR_ARG);
    /* A child's age is out of the equations' range. */
    assert_int_equal(ntr_tbw_watson(NTR_SEX_FEMALE, 12.0, 150.0, 40.0, &out), NTR_ERR_RANGE);
    /* Inputs in range whose equation gives no water:
     * 2.447 - 12.3708 + 3.222 + 0.10086 < 0. */
    assert_int_equal(ntr_tbw_watson(NTR_SEX_MALE, 130.0, 30.0, 0.3, &out), NTR_ERR_DOMAIN);
    assert_true(out == NTR_TEST_SENTINEL);
}

/* The share of weight Watson may give: 20% to 80% (docs/water.md: adult
 * body water is roughly 40 to 75% of weight, lower in severe obesity,
 * from memory; lean tissue itself holds about 73%, from memory).
 * Hand-worked:
 *   woman 150 cm, 10 kg: -2.097 + 16.035 + 2.466 = 16.404 L, 164%: refused;
 *   man 130 y, 30 cm, 20 kg: 2.447 - 12.3708 + 3.222 + 6.724 = 0.0222 L,
 *     0.1%: refused;
 *   woman 40 y, 150 cm, 25.5 kg: 20.2263 L, 79.3%: accepted;
 *   woman 150 cm, 24.5 kg: 19.9797 L, 81.6%: refused;
 *   man 130 y, 30 cm, 50 kg: -6.7018 + 16.81 = 10.1082 L, 20.2%: accepted;
 *   man 130 y, 30 cm, 48 kg: -6.7018 + 16.1376 = 9.4358 L, 19.7%: refused;
 *   man 60 y, 30 cm, 0.3 kg: -0.0406 + 0.10086 = 0.0603 L, 20.1% but below
 *     the 0.1 L every function taking a body water needs: refused. */
static void watson_refuses_implausible_shares(void **state)
{
    double out = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_tbw_watson(NTR_SEX_FEMALE, 40.0, 150.0, 10.0, &out), NTR_ERR_DOMAIN);
    assert_int_equal(ntr_tbw_watson(NTR_SEX_MALE, 130.0, 30.0, 20.0, &out), NTR_ERR_DOMAIN);
    assert_int_equal(ntr_tbw_watson(NTR_SEX_FEMALE, 40.0, 150.0, 24.5, &out), NTR_ERR_DOMAIN);
    assert_int_equal(ntr_tbw_watson(NTR_SEX_MALE, 130.0, 30.0, 48.0, &out), NTR_ERR_DOMAIN);
    assert_int_equal(ntr_tbw_watson(NTR_SEX_MALE, 60.0, 30.0, 0.3, &out), NTR_ERR_DOMAIN);
    assert_true(out == NTR_TEST_SENTINEL);
    assert_near(watson(NTR_SEX_FEMALE, 40.0, 150.0, 25.5), 20.2263, 1e-9);
    assert_near(watson(NTR_SEX_MALE, 130.0, 30.0, 50.0), 10.1082, 1e-9);
}

/* Property: every adult of ordinary build keeps the 1.0 result. Over
 * heights 145 to 210 cm, body-mass index 17 to 80 kg/m2 and ages 18 to
 * 110, both sexes, Watson answers, with the published equation's value
 * (recomputed here) at 30 to 80% of weight. */
static void watson_accepts_ordinary_adults(void **state)
{
    int h, b, a, sex;
    (void)state;
    for (sex = NTR_SEX_MALE; sex <= NTR_SEX_FEMALE; sex++) {
        for (h = 145; h <= 210; h += 5) {
            for (b = 17; b <= 80; b += 3) {
                for (a = 18; a <= 110; a += 4) {
                    double height = (double)h, age = (double)a;
                    double weight = (double)b * height * height / 10000.0;
                    double expected = sex == NTR_SEX_MALE
                                          ? 2.447 - 0.09516 * age + 0.1074 * height +
                                                0.3362 * weight
                                          : -2.097 + 0.1069 * height + 0.2466 * weight;
                    double tbw = watson(sex, age, height, weight);
                    assert_true(tbw == expected);
                    assert_true(tbw >= 0.30 * weight && tbw <= 0.80 * weight);
                }
            }
        }
    }
}

/* ---- ntr_free_water_deficit ---------------------------------------------- */

/* Source: the textbook water-deficit formula TBW*(Na/140 - 1) (common
 * practice). Hand-worked: 70 kg man, TBW 0.6*70 = 42 L, Na 160 ->
 * 42*(160/140 - 1) = 6.0 L; elderly woman 60 kg, TBW 27 L, Na 154 ->
 * 27*0.1 = 2.7 L. */
static void deficit_worked_examples(void **state)
{
    double litres = NTR_TEST_SENTINEL;
    (void)state;
    assert_int_equal(ntr_free_water_deficit(42.0, 160.0, &litres), NTR_OK);
    assert_near(litres, 6.0, 1e-9);
    assert_int_equal(ntr_free_water_deficit(27.0, 154.0, &litres), NTR_OK);
    assert_near(litres, 2.7, 1e-9);
    assert_int_equal(ntr_free_water_deficit(27.0, 140.0, &litres), NTR_OK);
    assert_true(litres == 0.0);
}

/* Property (mass balance): giving exactly the deficit as sodium-free water
 * (5% dextrose, Adrogue & Madias 2000 hypernatremia review) brings the
 * sodium to 140, by ntr_infusate_change. */
static void deficit_volume_of_water_restores_140(void **state)
{
    static const double na[] = {141.0, 150.0, 160.0, 175.0};
    size_t i;
    (void)state;
    for (i = 0; i < sizeof na / sizeof na[0]; i++) {
        double litres = NTR_TEST_SENTINEL, delta = NTR_TEST_SENTINEL;
        assert_int_equal(ntr_free_water_deficit(35.0, na[i], &litres), NTR_OK);
        assert_int_equal(ntr_infusate_change(na[i], 35.0, 0.0, 0.0, litres, &delta), NTR_OK);
        assert_near(na[i] + delta, 140.0, 1e-9);
    }
}

static int call_water_deficit(const double *a, double *out)
{
    return ntr_free_water_deficit(a[0], a[1], out);
}

static void deficit_bad_inputs_leave_output_untouched(void **state)
{
    /* Ranges: TBW 0.1-400 L, Na 80-220 mmol/L. */
    const struct ntr_test_inputs in = {call_water_deficit, 2, {40.0, 155.0}, {0.1, 80.0},
                                       {400.0, 220.0}};
    double out = NTR_TEST_SENTINEL;
    (void)state;
    ntr_test_bad_inputs(&in);
    assert_int_equal(ntr_free_water_deficit(40.0, 155.0, NULL), NTR_ERR_NULL);
    /* Below 140 there is no water deficit. */
    assert_int_equal(ntr_free_water_deficit(40.0, nextafter(140.0, 0.0), &out), NTR_ERR_DOMAIN);
    assert_true(out == NTR_TEST_SENTINEL);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(fraction_published_fractions),
        cmocka_unit_test(fraction_age_band_edges),
        cmocka_unit_test(fraction_proportional_and_monotone),
        cmocka_unit_test(fraction_refuses_infants),
        cmocka_unit_test(fraction_bad_inputs_leave_output_untouched),
        cmocka_unit_test(watson_published_equations),
        cmocka_unit_test(watson_agrees_roughly_with_the_fraction_rule),
        cmocka_unit_test(watson_slopes),
        cmocka_unit_test(watson_bad_inputs_leave_output_untouched),
        cmocka_unit_test(watson_refuses_implausible_shares),
        cmocka_unit_test(watson_accepts_ordinary_adults),
        cmocka_unit_test(deficit_worked_examples),
        cmocka_unit_test(deficit_volume_of_water_restores_140),
        cmocka_unit_test(deficit_bad_inputs_leave_output_untouched),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
