/* SPDX-License-Identifier: MIT */
/* Input ranges as API: ntr_input_range() (lib/ranges.c, docs/ranges.md).
 *
 * Two kinds of check per input kind. (1) The range it reports is the
 * library's one definition in lib/ntr_internal.h (compared constant by
 * constant). (2) The range is what a consuming function really accepts:
 * the function is called with the input at each end (accepted) and at
 * the next double outside each end (NTR_ERR_RANGE), the other inputs held
 * at ordinary values. No clinical value is checked here: the ranges are
 * the library's own plausibility nets, sourced in docs/ranges.md. */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <float.h>
#include <string.h>
#include <cmocka.h>

#include "natremia_test.h"
#include "ntr_internal.h"

/* One consumer per kind: the status of a call with the input set to x. */
typedef int (*probe_fn)(double x);

static int p_na(double x) { double o; return ntr_osm_effective(x, 5.0, &o); }
static int p_glucose(double x) { double o; return ntr_osm_effective(140.0, x, &o); }
static int p_urea(double x) { double o; return ntr_osm_calculated(140.0, 5.0, x, 0.0, NTR_OSM_2NA, &o); }
static int p_ethanol(double x) { double o; return ntr_effective_osm_measured(80.0, 0.0, 0.0, x, 600.0, &o); }
static int p_osm(double x) { double o; return ntr_osm_gap(x, 290.0, &o); }
static int p_age_fraction(double x) { double o; return ntr_tbw_fraction(NTR_SEX_MALE, x, 70.0, &o); }
static int p_age_watson(double x) { double o; return ntr_tbw_watson(NTR_SEX_MALE, x, 175.0, 75.0, &o); }
static int p_height(double x) { double o; return ntr_tbw_watson(NTR_SEX_MALE, 18.0, x, 75.0, &o); }
static int p_weight(double x) { double o; return ntr_tbw_fraction(NTR_SEX_MALE, 40.0, x, &o); }
static int p_tbw(double x) { double o; return ntr_na_deficit(x, 120.0, 125.0, &o); }
static int p_inf_na(double x) { double o; return ntr_infusate_change_per_litre(140.0, 40.0, x, 0.0, &o); }
static int p_inf_k(double x) { double o; return ntr_infusate_change_per_litre(140.0, 40.0, 0.0, x, &o); }
static int p_volume(double x) { double o; return ntr_infusate_change(140.0, 40.0, 154.0, 0.0, x, &o); }

/* A fall needs a hypotonic fluid, a rise a hypertonic one. */
static int p_delta(double x)
{
    double o;
    if (x < 0.0) {
        return ntr_infusate_volume_for_change(200.0, 40.0, 0.0, 0.0, x, &o);
    }
    return ntr_infusate_volume_for_change(100.0, 10.0, 1100.0, 0.0, x, &o);
}

static int p_urine_na(double x) { double o; return ntr_furst_ratio(x, 0.0, 140.0, &o); }
static int p_urine_k(double x) { double o; return ntr_furst_ratio(0.0, x, 140.0, &o); }
static int p_urine_volume(double x) { double o; return ntr_efwc(x, 60.0, 20.0, 140.0, &o); }
static int p_urine_osm(double x) { int o; return ntr_urine_maximally_dilute(x, &o); }
static int p_ratio(double x) { int o; return ntr_restriction_from_ratio(x, &o); }
static int p_factor(double x) { double o; return ntr_na_corrected_glucose_factor(140.0, 30.0, x, &o); }
static int p_convert(double x)
{
    double o;
    return ntr_convert(NTR_ANALYTE_SODIUM, x, NTR_UNIT_MMOL_L, NTR_UNIT_MEQ_L, &o);
}

static int p_hours(double x)
{
    ntr_sample s[1];
    ntr_correction o;
    ntr_limits lim;
    s[0].hours = x;
    s[0].na_mmol_l = 120.0;
    assert_int_equal(ntr_limits_preset(NTR_LIMITS_STANDARD, &lim), NTR_OK);
    return ntr_correction_assess(s, 1, &lim, &o);
}

static int p_limit(double x)
{
    ntr_sample s[2] = {{0.0, 120.0}, {6.0, 122.0}};
    ntr_course_limits lim;
    ntr_course_report o;
    memset(&lim, 0, sizeof lim);
    lim.struct_size = sizeof lim;
    lim.goal = NTR_GOAL_RAISE;
    lim.max_fall_48h = x; /* the 24 h fall limit 0 (none): no pairing rule */
    memset(&o, 0, sizeof o);
    o.struct_size = sizeof o;
    return ntr_course_assess(s, 2, &lim, &o);
}

static int p_flow_rate(double x)
{
    ntr_timed_flow f;
    ntr_sample series[8];
    size_t count;
    memset(&f, 0, sizeof f);
    f.start_h = 0.0;
    f.end_h = 1.0;
    f.rate_ml_h = x;
    f.na_mmol_l = 140.0;
    return ntr_balance_course(140.0, 40.0, &f, 1, 1.0, 1.0, series, 8, &count);
}

static int p_urine_rate(double x)
{
    double v, r;
    return ntr_relower_estimate(150.0, 40.0, 0.0, 0.0, 0.1, 1.0, x, 77.0, 0.0, &v, &r);
}

/* Flow start times take 0..720 h (a plan's length must also be above 0). */
static int p_plan_hours(double x)
{
    ntr_timed_flow f;
    ntr_sample series[8];
    size_t count;
    memset(&f, 0, sizeof f);
    f.start_h = x;
    f.end_h = NTR_PLAN_HOURS_MAX;
    f.rate_ml_h = 100.0;
    f.na_mmol_l = 154.0;
    return ntr_balance_course(140.0, 40.0, &f, 1, 1.0, 1.0, series, 8, &count);
}

static int p_plan_step(double x)
{
    double v, r;
    return ntr_relower_estimate(150.0, 40.0, 0.0, 0.0, 0.1, x, 0.0, 0.0, 0.0, &v, &r);
}

static int p_flow_volume(double x)
{
    ntr_flow f;
    double na, tbw;
    f.volume_l = x;
    f.na_mmol_l = 140.0;
    f.k_mmol_l = 0.0;
    return ntr_balance_predict(140.0, 40.0, &f, 1, &na, &tbw);
}

static int p_urine_ml(double x)
{
    const ntr_urine_interval u = ntr_test_urine(0.0, 12.0, x, 60.0, 20.0, 300.0);
    ntr_timed_flow f;
    return ntr_urine_interval_flow(&u, &f);
}

static int p_uric_acid(double x)
{
    ntr_siad_findings f;
    ntr_siad_result r;
    assert_int_equal(ntr_siad_findings_init(&f), NTR_OK);
    f.uric_acid_mmol_l.known = 1;
    f.uric_acid_mmol_l.value = x;
    memset(&r, 0, sizeof r);
    r.struct_size = sizeof r;
    return ntr_siad_evaluate(&f, &r);
}

static int p_fe_percent(double x) { int o; return ntr_fe_uric_acid_class(x, &o); }
static int p_fe_value(double x) { double o; return ntr_fractional_excretion(x, 130.0, 8000.0, 80.0, &o); }
static int p_solute_day(double x) { double o; return ntr_urine_volume_from_solute(x, 600.0, &o); }
static int p_insensible_day(double x)
{
    double o;
    return ntr_fluid_allowance(600.0, 300.0, 60.0, 20.0, 125.0, x, &o);
}
static int p_grams(double x) { double o; return ntr_solute_dose_osmoles(NTR_SOLUTE_UREA, x, &o); }
static int p_intake(double x)
{
    double o;
    /* Dilute urine: the allowance (about 1.3 L/day) already exceeds any
     * small target, so no dose is needed; 10 L/day needs about 90 g urea. */
    return ntr_solute_dose_for_allowance(NTR_SOLUTE_UREA, 600.0, 300.0, 20.0, 10.0, 125.0,
                                         0.5, x, &o);
}
static int p_margin(double x)
{
    double v, r;
    return ntr_dda_relower(130.0, 40.0, 2.0, x, 6.0, 0.0, 0.0, &v, &r);
}
static int p_insensible_h(double x)
{
    double rate, vol, breach;
    return ntr_hyper_lower_plan(160.0, 40.0, NTR_FLUID_DEXTROSE_5, NTR_COURSE_HYPER_CHRONIC, 5.0,
                                24.0, 0.0, 0.0, x, &rate, &vol, &breach);
}
static int p_change(double x)
{
    double v, r;
    return ntr_relower_estimate(200.0, 10.0, 0.0, 0.0, x, 24.0, 0.0, 0.0, 0.0, &v, &r);
}

struct kind_case {
    const char *name;
    int kind;
    double min; /* the constants of lib/ntr_internal.h */
    double max;
    probe_fn probe;
    int min_open; /* 1: min itself is refused, every value above it taken */
};

static const struct kind_case kinds[] = {
    {"NA", NTR_INPUT_NA, NTR_NA_MIN, NTR_NA_MAX, p_na, 0},
    {"GLUCOSE", NTR_INPUT_GLUCOSE, 0.0, NTR_GLUCOSE_MAX, p_glucose, 0},
    {"UREA", NTR_INPUT_UREA, 0.0, NTR_UREA_MAX, p_urea, 0},
    {"ETHANOL", NTR_INPUT_ETHANOL, 0.0, NTR_ETHANOL_MAX, p_ethanol, 0},
    {"OSMOLALITY", NTR_INPUT_OSMOLALITY, NTR_OSM_MIN, NTR_OSM_MAX, p_osm, 0},
    {"AGE_FRACTION", NTR_INPUT_AGE_FRACTION, NTR_TBW_FRACTION_AGE_MIN, NTR_AGE_MAX,
     p_age_fraction, 0},
    {"AGE_WATSON", NTR_INPUT_AGE_WATSON, NTR_ADULT_AGE, NTR_AGE_MAX, p_age_watson, 0},
    {"HEIGHT", NTR_INPUT_HEIGHT, NTR_HEIGHT_MIN, NTR_HEIGHT_MAX, p_height, 0},
    {"WEIGHT", NTR_INPUT_WEIGHT, NTR_WEIGHT_MIN, NTR_WEIGHT_MAX, p_weight, 0},
    {"TBW", NTR_INPUT_TBW, NTR_TBW_MIN, NTR_TBW_MAX, p_tbw, 0},
    {"INFUSATE_NA", NTR_INPUT_INFUSATE_NA, 0.0, NTR_INFUSATE_NA_MAX, p_inf_na, 0},
    {"INFUSATE_K", NTR_INPUT_INFUSATE_K, 0.0, NTR_INFUSATE_K_MAX, p_inf_k, 0},
    {"VOLUME", NTR_INPUT_VOLUME, 0.0, NTR_INFUSE_VOLUME_MAX, p_volume, 0},
    {"DELTA", NTR_INPUT_DELTA, -NTR_DELTA_MAX, NTR_DELTA_MAX, p_delta, 0},
    {"URINE_NA", NTR_INPUT_URINE_NA, 0.0, NTR_URINE_NA_MAX, p_urine_na, 0},
    {"URINE_K", NTR_INPUT_URINE_K, 0.0, NTR_URINE_K_MAX, p_urine_k, 0},
    {"URINE_VOLUME", NTR_INPUT_URINE_VOLUME, 0.0, NTR_URINE_VOLUME_MAX, p_urine_volume, 0},
    {"URINE_OSM", NTR_INPUT_URINE_OSM, NTR_URINE_OSM_MIN, NTR_URINE_OSM_MAX, p_urine_osm, 0},
    {"RATIO", NTR_INPUT_RATIO, 0.0, NTR_RATIO_MAX, p_ratio, 0},
    {"GLUCOSE_FACTOR", NTR_INPUT_GLUCOSE_FACTOR, 0.0, NTR_GLUCOSE_FACTOR_MAX, p_factor, 0},
    {"CONVERT_VALUE", NTR_INPUT_CONVERT_VALUE, 0.0, NTR_CONVERT_MAX, p_convert, 0},
    {"HOURS", NTR_INPUT_HOURS, -NTR_HOURS_MAX, NTR_HOURS_MAX, p_hours, 0},
    {"LIMIT", NTR_INPUT_LIMIT, 0.0, NTR_LIMIT_MAX, p_limit, 0},
    {"FLOW_RATE", NTR_INPUT_FLOW_RATE, -NTR_FLOW_RATE_MAX, NTR_FLOW_RATE_MAX, p_flow_rate, 0},
    {"URINE_RATE", NTR_INPUT_URINE_RATE, 0.0, NTR_FLOW_RATE_MAX, p_urine_rate, 0},
    {"PLAN_HOURS", NTR_INPUT_PLAN_HOURS, 0.0, NTR_PLAN_HOURS_MAX, p_plan_hours, 0},
    {"PLAN_STEP", NTR_INPUT_PLAN_STEP, NTR_PLAN_STEP_MIN, NTR_PLAN_HOURS_MAX, p_plan_step, 0},
    {"FLOW_VOLUME", NTR_INPUT_FLOW_VOLUME, NTR_FLOW_VOLUME_MIN, NTR_INFUSE_VOLUME_MAX,
     p_flow_volume, 0},
    {"URINE_ML", NTR_INPUT_URINE_ML, 0.0, NTR_URINE_ML_MAX, p_urine_ml, 0},
    {"URIC_ACID", NTR_INPUT_URIC_ACID, 0.0, NTR_URIC_ACID_MAX, p_uric_acid, 0},
    {"FE_PERCENT", NTR_INPUT_FE_PERCENT, 0.0, NTR_FE_PERCENT_MAX, p_fe_percent, 0},
    {"FE_VALUE", NTR_INPUT_FE_VALUE, 0.0, NTR_FE_INPUT_MAX, p_fe_value, 0},
    {"SOLUTE_MOSM_DAY", NTR_INPUT_SOLUTE_MOSM_DAY, 0.0, NTR_SOLUTE_MOSM_DAY_MAX, p_solute_day, 0},
    {"INSENSIBLE_L_DAY", NTR_INPUT_INSENSIBLE_L_DAY, 0.0, NTR_INSENSIBLE_L_DAY_MAX,
     p_insensible_day, 0},
    {"SOLUTE_GRAMS", NTR_INPUT_SOLUTE_GRAMS, 0.0, NTR_SOLUTE_GRAMS_MAX, p_grams, 0},
    {"INTAKE_L_DAY", NTR_INPUT_INTAKE_L_DAY, 0.0, NTR_INTAKE_L_DAY_MAX, p_intake, 1},
    {"RELOWER_MARGIN", NTR_INPUT_RELOWER_MARGIN, 0.0, NTR_RELOWER_MARGIN_MAX, p_margin, 0},
    {"INSENSIBLE_ML_H", NTR_INPUT_INSENSIBLE_ML_H, 0.0, NTR_INSENSIBLE_MAX, p_insensible_h, 0},
    {"CHANGE", NTR_INPUT_CHANGE, 0.0, NTR_DELTA_MAX, p_change, 1},
};

#define N_KINDS (sizeof kinds / sizeof kinds[0])

static void test_every_kind_reports_its_constants(void **state)
{
    size_t i;
    (void)state;
    for (i = 0; i < N_KINDS; i++) {
        double lo = NTR_TEST_SENTINEL, hi = NTR_TEST_SENTINEL;
        if (ntr_input_range(kinds[i].kind, &lo, &hi) != NTR_OK || lo != kinds[i].min ||
            hi != kinds[i].max) {
            fail_msg("NTR_INPUT_%s: got %g..%g, constants say %g..%g", kinds[i].name, lo, hi,
                     kinds[i].min, kinds[i].max);
        }
    }
}

/* The kinds are 1..N without gaps, and the table above lists each once. */
static void test_kinds_are_contiguous(void **state)
{
    size_t i;
    double lo, hi;
    (void)state;
    for (i = 0; i < N_KINDS; i++) {
        assert_int_equal(kinds[i].kind, (int)i + 1);
    }
    assert_int_equal(ntr_input_range((int)N_KINDS + 1, &lo, &hi), NTR_ERR_ARG);
}

static void check_edges(const struct kind_case *k)
{
    double lo, hi;
    int below, at_lo, at_hi, above;
    assert_int_equal(ntr_input_range(k->kind, &lo, &hi), NTR_OK);
    below = k->probe(nextafter(lo, -INFINITY));
    at_lo = k->probe(k->min_open ? nextafter(lo, INFINITY) : lo);
    at_hi = k->probe(hi);
    above = k->probe(nextafter(hi, INFINITY));
    if (at_lo != NTR_OK || at_hi != NTR_OK || below != NTR_ERR_RANGE || above != NTR_ERR_RANGE) {
        fail_msg("NTR_INPUT_%s %g..%g: below %d, at min %d, at max %d, above %d", k->name, lo, hi,
                 below, at_lo, at_hi, above);
    }
    if (k->min_open) {
        assert_int_equal(k->probe(lo), NTR_ERR_RANGE);
    }
}

static void test_ranges_match_what_functions_accept(void **state)
{
    size_t i;
    (void)state;
    for (i = 0; i < N_KINDS; i++) {
        check_edges(&kinds[i]);
    }
}

static void test_errors_leave_outputs_untouched(void **state)
{
    double lo = NTR_TEST_SENTINEL, hi = NTR_TEST_SENTINEL;
    const int bad[] = {0, -1, (int)N_KINDS + 1, 1000, -2147483647 - 1, 2147483647};
    size_t i;
    (void)state;
    for (i = 0; i < sizeof bad / sizeof bad[0]; i++) {
        assert_int_equal(ntr_input_range(bad[i], &lo, &hi), NTR_ERR_ARG);
        assert_true(lo == NTR_TEST_SENTINEL && hi == NTR_TEST_SENTINEL);
    }
    assert_int_equal(ntr_input_range(NTR_INPUT_NA, NULL, &hi), NTR_ERR_NULL);
    assert_int_equal(ntr_input_range(NTR_INPUT_NA, &lo, NULL), NTR_ERR_NULL);
    assert_true(lo == NTR_TEST_SENTINEL && hi == NTR_TEST_SENTINEL);
    /* NULL is reported before an unknown kind (the library's check order). */
    assert_int_equal(ntr_input_range(0, NULL, NULL), NTR_ERR_NULL);
}

/* The walker of natremia_test.h uses hand-written ranges; here the same
 * edges come from the API for ntr_osm_effective's sodium, and a value in
 * mg/dL (140 mmol/L is about 322 mg/dL) lies outside (docs/ranges.md). */
static void test_sodium_in_mg_dl_is_outside(void **state)
{
    double lo, hi;
    (void)state;
    assert_int_equal(ntr_input_range(NTR_INPUT_NA, &lo, &hi), NTR_OK);
    assert_true(322.0 > hi);
    assert_int_equal(p_na(322.0), NTR_ERR_RANGE);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_every_kind_reports_its_constants),
        cmocka_unit_test(test_kinds_are_contiguous),
        cmocka_unit_test(test_ranges_match_what_functions_accept),
        cmocka_unit_test(test_errors_leave_outputs_untouched),
        cmocka_unit_test(test_sodium_in_mg_dl_is_outside),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
