/* SPDX-License-Identifier: MIT */
/* Per-call instruction cost of natremia's scalar entry points.
 *
 * Run under valgrind --tool=callgrind (tests/bench/run-bench.sh does). For
 * every entry point there are two loops of identical shape: loop_<name>
 * calls the library with valid inputs that take the full computing path, and
 * base_<name> calls a do-nothing function with the same signature from
 * bench_stubs.c. Callgrind counts the instructions each loop executes; the
 * per-call cost is (Ir(loop_<name>) - Ir(base_<name>)) / N, i.e. the work
 * the library does beyond an empty call (argument passing, the loop and the
 * call instruction cancel out). Callgrind's own inclusive count of the
 * library function divided by its call count is printed beside it as a
 * cross-check by the script.
 *
 * Usage: bench_scalar [N]   (default 20000 calls per loop)
 * Prints the number of non-OK statuses per loop (all must be 0, proving the
 * inputs were valid) and exits 1 otherwise. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "natremia.h"
#include "bench_stubs.h"

#define NOINLINE __attribute__((noinline, noclone, used))

/* One pair of loops: the library call and the stub call. `real` and `stub`
 * are complete call expressions that may use the locals d, i, s. */
#define PAIR(name, real, stub)                                   \
    NOINLINE long loop_##name(long n);                           \
    NOINLINE long base_##name(long n);                           \
    NOINLINE long loop_##name(long n)                            \
    {                                                            \
        long bad = 0;                                            \
        double d = 0.0, d2 = 0.0;                                \
        int i = 0;                                               \
        for (long k = 0; k < n; k++) {                           \
            bad += (real) != 0;                                  \
        }                                                        \
        (void)d; (void)d2; (void)i;                              \
        return bad;                                              \
    }                                                            \
    NOINLINE long base_##name(long n)                            \
    {                                                            \
        long bad = 0;                                            \
        double d = 0.0, d2 = 0.0;                                \
        int i = 0;                                               \
        for (long k = 0; k < n; k++) {                           \
            bad += (stub) != 0;                                  \
        }                                                        \
        (void)d; (void)d2; (void)i;                              \
        return bad;                                              \
    }

/* Inputs and outputs of the functions that take or fill structs. Filled by
 * setup() before any loop runs; invented values (no patient). */
static ntr_limits g_limits;
static ntr_siad_findings g_siad;
static ntr_siad_result g_siad_result;
static ntr_outlook g_outlook;
static ntr_watch g_watch_fresh;
static ntr_watch g_watch;
static ntr_correction g_correction;
static struct ntr_method_info g_method;
static unsigned int g_u1, g_u2;
static ntr_sample g_series[12];
static ntr_flow g_flows[2];
static ntr_timed_flow g_plan_flows[2];
static ntr_sample g_course[32];
static size_t g_count;
static ntr_sample g_history[3];
static ntr_plan_result g_plan;
static ntr_course_limits g_course_limits;
static ntr_course_plan_result g_course_plan;
static ntr_course_limits g_course_limits_out;
static ntr_course_watch g_course_watch;
static ntr_course_report g_course_report;
static ntr_vaptan_watch g_vaptan;

static ntr_finding_value known(double value)
{
    ntr_finding_value v;
    v.known = 1;
    v.reserved = 0;
    v.value = value;
    return v;
}

static void setup(void)
{
    size_t k;
    ntr_limits_preset(NTR_LIMITS_STANDARD, &g_limits);
    /* A complete, consistent SIAD work-up (every branch of the evaluator). */
    ntr_siad_findings_init(&g_siad);
    g_siad.effective_osm_mosm_kg = known(255.0);
    g_siad.urine_osm_mosm_kg = known(450.0);
    g_siad.urine_na_mmol_l = known(60.0);
    g_siad.volume_status = NTR_VOLUME_EUVOLAEMIC;
    g_siad.normal_salt_water_intake = NTR_FINDING_YES;
    g_siad.thyroid_normal = NTR_FINDING_YES;
    g_siad.adrenal_normal = NTR_FINDING_YES;
    g_siad.pituitary_normal = NTR_FINDING_YES;
    g_siad.kidney_normal = NTR_FINDING_YES;
    g_siad.recent_diuretic = NTR_FINDING_NO;
    g_siad.saline_corrected = NTR_FINDING_NO;
    g_siad.restriction_corrected = NTR_FINDING_YES;
    g_siad.uric_acid_mmol_l = known(0.18);
    g_siad.urea_mmol_l = known(2.5);
    g_siad.fe_na_percent = known(0.8);
    g_siad.fe_urea_percent = known(60.0);
    g_siad.fe_uric_acid_percent = known(14.0);
    g_siad_result.struct_size = sizeof g_siad_result;
    g_outlook.struct_size = sizeof g_outlook;
    ntr_watch_init(&g_limits, &g_watch);
    g_course_report.struct_size = sizeof g_course_report;
    g_vaptan.struct_size = sizeof g_vaptan;
    /* Twelve results over 44 h, rising about 8 mmol/L a day. */
    for (k = 0; k < 12; k++) {
        g_series[k].hours = 4.0 * (double)k;
        g_series[k].na_mmol_l = 116.0 + 1.3 * (double)k;
    }
    /* 1 L of 0.9% saline in, 0.8 L of urine (Na+K 90) out. */
    g_flows[0].volume_l = 1.0;
    g_flows[0].na_mmol_l = 154.0;
    g_flows[0].k_mmol_l = 0.0;
    g_flows[1].volume_l = -0.8;
    g_flows[1].na_mmol_l = 60.0;
    g_flows[1].k_mmol_l = 30.0;
    /* 3% saline at 30 mL/h for 6 h; urine 150 mL/h (Na+K 80) for 24 h. */
    memset(g_plan_flows, 0, sizeof g_plan_flows);
    g_plan_flows[0].start_h = 0.0;
    g_plan_flows[0].end_h = 6.0;
    g_plan_flows[0].rate_ml_h = 30.0;
    g_plan_flows[0].na_mmol_l = 513.0;
    g_plan_flows[1].start_h = 0.0;
    g_plan_flows[1].end_h = 24.0;
    g_plan_flows[1].rate_ml_h = -150.0;
    g_plan_flows[1].na_mmol_l = 50.0;
    g_plan_flows[1].k_mmol_l = 30.0;
    for (k = 0; k < 3; k++) {
        g_history[k].hours = 3.0 * (double)k;
        g_history[k].na_mmol_l = 114.0 + 0.5 * (double)k;
    }
    ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, &g_course_limits);
    g_course_plan.struct_size = sizeof g_course_plan;
    ntr_course_watch_init(&g_course_limits, &g_course_watch);
}

/* Invented, clinically plausible inputs that take the full computing path
 * of each function (glucose above the correction threshold, the last UCUM
 * code in the table, and so on). */
PAIR(ntr_unit_parse, ntr_unit_parse("umol/L", &i), stub_p_ip("umol/L", &i))
/* Since 1.1 (issue 13): the lenient parser on the last spelling of its
 * table, with blanks to drop, capitals to fold and a micro sign; the LOINC
 * lookup on the last code of its table; the glucose check with a measured
 * osmolality (both rules evaluated). */
PAIR(ntr_unit_parse_lenient, ntr_unit_parse_lenient(" \xc2\xb5MOL/L ", &i),
     stub_p_ip(" \xc2\xb5MOL/L ", &i))
PAIR(ntr_loinc_lookup, ntr_loinc_lookup("14933-6", &i, &i, &i),
     stub_p_ippp("14933-6", &i, &i, &i))
PAIR(ntr_glucose_unit_check,
     ntr_glucose_unit_check(150.0, NTR_UNIT_MG_DL, 135.0, 290.0, &d),
     stub_didd_p(150.0, NTR_UNIT_MG_DL, 135.0, 290.0, &d))
PAIR(ntr_convert,
     ntr_convert(NTR_ANALYTE_GLUCOSE, 250.0, NTR_UNIT_MG_DL, NTR_UNIT_MMOL_L, &d),
     stub_idiid_p(NTR_ANALYTE_GLUCOSE, 250.0, NTR_UNIT_MG_DL, NTR_UNIT_MMOL_L, &d))
PAIR(ntr_osm_calculated,
     ntr_osm_calculated(128.0, 12.0, 8.0, 0.0, NTR_OSM_DORWART_CHALMERS, &d),
     stub_ddddi_p(128.0, 12.0, 8.0, 0.0, NTR_OSM_DORWART_CHALMERS, &d))
PAIR(ntr_osm_effective, ntr_osm_effective(128.0, 12.0, &d),
     stub_dd_p(128.0, 12.0, &d))
PAIR(ntr_osm_gap, ntr_osm_gap(300.0, 285.0, &d), stub_dd_p(300.0, 285.0, &d))
PAIR(ntr_na_corrected_glucose,
     ntr_na_corrected_glucose(128.0, 30.0, NTR_GLUCOSE_HILLIER, &d),
     stub_ddi_p(128.0, 30.0, NTR_GLUCOSE_HILLIER, &d))
PAIR(ntr_na_corrected_glucose_factor,
     ntr_na_corrected_glucose_factor(128.0, 30.0, 2.0, &d),
     stub_ddd_p(128.0, 30.0, 2.0, &d))
PAIR(ntr_na_deficit, ntr_na_deficit(30.0, 118.0, 124.0, &d),
     stub_ddd_p(30.0, 118.0, 124.0, &d))
PAIR(ntr_tbw_fraction, ntr_tbw_fraction(NTR_SEX_FEMALE, 70.0, 60.0, &d),
     stub_idd_p(NTR_SEX_FEMALE, 70.0, 60.0, &d))
PAIR(ntr_tbw_watson, ntr_tbw_watson(NTR_SEX_MALE, 50.0, 175.0, 80.0, &d),
     stub_iddd_p(NTR_SEX_MALE, 50.0, 175.0, 80.0, &d))
PAIR(ntr_free_water_deficit, ntr_free_water_deficit(40.0, 158.0, &d),
     stub_dd_p(40.0, 158.0, &d))
PAIR(ntr_fluid_preset, ntr_fluid_preset(NTR_FLUID_NACL_3, &d, &d2),
     stub_i_pp(NTR_FLUID_NACL_3, &d, &d2))
PAIR(ntr_infusate_change_per_litre,
     ntr_infusate_change_per_litre(118.0, 30.0, 513.0, 0.0, &d),
     stub_dddd_p(118.0, 30.0, 513.0, 0.0, &d))
PAIR(ntr_infusate_change, ntr_infusate_change(118.0, 30.0, 513.0, 0.0, 0.5, &d),
     stub_ddddd_p(118.0, 30.0, 513.0, 0.0, 0.5, &d))
PAIR(ntr_infusate_volume_for_change,
     ntr_infusate_volume_for_change(118.0, 30.0, 513.0, 0.0, 6.0, &d),
     stub_ddddd_p(118.0, 30.0, 513.0, 0.0, 6.0, &d))
PAIR(ntr_furst_ratio, ntr_furst_ratio(80.0, 40.0, 125.0, &d),
     stub_ddd_p(80.0, 40.0, 125.0, &d))
PAIR(ntr_restriction_from_ratio, ntr_restriction_from_ratio(0.95, &i),
     stub_d_ip(0.95, &i))
PAIR(ntr_efwc, ntr_efwc(2.0, 60.0, 30.0, 125.0, &d),
     stub_dddd_p(2.0, 60.0, 30.0, 125.0, &d))
PAIR(ntr_status_message, ntr_status_message(NTR_ERR_RANGE) == NULL,
     stub_i_str(NTR_ERR_RANGE) == NULL)
PAIR(ntr_version_string, ntr_version_string() == NULL, stub_v_str() == NULL)
PAIR(ntr_version_number, ntr_version_number() == 0ul, stub_v_ul() == 0ul)

PAIR(ntr_na_severity, ntr_na_severity(128.0, &i), stub_d_ip(128.0, &i))
PAIR(ntr_tonicity_class, ntr_tonicity_class(265.0, &i), stub_d_ip(265.0, &i))
PAIR(ntr_low_na_tonicity,
     ntr_low_na_tonicity(122.0, 30.0, 290.0, NTR_GLUCOSE_HILLIER, &i, &g_u1),
     stub_dddi_pp(122.0, 30.0, 290.0, NTR_GLUCOSE_HILLIER, &i, &g_u1))
PAIR(ntr_effective_osm_measured,
     ntr_effective_osm_measured(125.0, 5.0, 40.0, 10.0, 295.0, &d),
     stub_ddddd_p(125.0, 5.0, 40.0, 10.0, 295.0, &d))
PAIR(ntr_low_na_effective_tonicity,
     ntr_low_na_effective_tonicity(122.0, 30.0, 20.0, 10.0, 310.0, NTR_GLUCOSE_HILLIER, &i,
                                   &g_u1),
     stub_dddddi_pp(122.0, 30.0, 20.0, 10.0, 310.0, NTR_GLUCOSE_HILLIER, &i, &g_u1))
PAIR(ntr_urine_maximally_dilute, ntr_urine_maximally_dilute(80.0, &i),
     stub_d_ip(80.0, &i))
PAIR(ntr_urine_na_high, ntr_urine_na_high(45.0, &i), stub_d_ip(45.0, &i))
PAIR(ntr_fractional_excretion,
     ntr_fractional_excretion(60.0, 128.0, 8000.0, 90.0, &d),
     stub_dddd_p(60.0, 128.0, 8000.0, 90.0, &d))
PAIR(ntr_siad_findings_init, ntr_siad_findings_init(&g_siad),
     stub_v_p(&g_siad))
PAIR(ntr_siad_evaluate, ntr_siad_evaluate(&g_siad, &g_siad_result),
     stub_pp(&g_siad, &g_siad_result))
PAIR(ntr_method_info, ntr_method_info(NTR_METHOD_FURST, &g_method),
     stub_i_vp(NTR_METHOD_FURST, &g_method))
PAIR(ntr_method_next, ntr_method_next(NTR_METHOD_FURST, &i),
     stub_i_vp(NTR_METHOD_FURST, &i))
PAIR(ntr_limits_preset, ntr_limits_preset(NTR_LIMITS_HIGH_RISK, &g_limits),
     stub_i_vp(NTR_LIMITS_HIGH_RISK, &g_limits))
PAIR(ntr_ods_risk,
     ntr_ods_risk(112.0, NTR_TRI_NO, NTR_TRI_YES, NTR_TRI_NO, NTR_TRI_UNKNOWN,
                  &i, &g_u1, &g_u2),
     stub_diiii_ppp(112.0, NTR_TRI_NO, NTR_TRI_YES, NTR_TRI_NO,
                    NTR_TRI_UNKNOWN, &i, &g_u1, &g_u2))
PAIR(ntr_watch_init, ntr_watch_init(&g_limits, &g_watch_fresh),
     stub_pp(&g_limits, &g_watch_fresh))
PAIR(ntr_watch_result, ntr_watch_result(&g_watch, &g_correction),
     stub_pp(&g_watch, &g_correction))
PAIR(ntr_urine_volume_from_solute, ntr_urine_volume_from_solute(600.0, 600.0, &d),
     stub_dd_p(600.0, 600.0, &d))
PAIR(ntr_fluid_allowance, ntr_fluid_allowance(900.0, 450.0, 60.0, 20.0, 128.0, 0.5, &d),
     stub_d6_p(900.0, 450.0, 60.0, 20.0, 128.0, 0.5, &d))
PAIR(ntr_solute_dose_osmoles, ntr_solute_dose_osmoles(NTR_SOLUTE_UREA, 30.0, &d),
     stub_id_p(NTR_SOLUTE_UREA, 30.0, &d))
PAIR(ntr_fluid_allowance_with_dose,
     ntr_fluid_allowance_with_dose(NTR_SOLUTE_UREA, 30.0, 600.0, 500.0, 150.0, 60.0, 125.0,
                                   0.4, &d),
     stub_id7_p(NTR_SOLUTE_UREA, 30.0, 600.0, 500.0, 150.0, 60.0, 125.0, 0.4, &d))
PAIR(ntr_solute_dose_for_allowance,
     ntr_solute_dose_for_allowance(NTR_SOLUTE_NACL, 600.0, 500.0, 150.0, 60.0, 125.0, 0.4,
                                   1.0, &d),
     stub_id7_p(NTR_SOLUTE_NACL, 600.0, 500.0, 150.0, 60.0, 125.0, 0.4, 1.0, &d))
PAIR(ntr_restriction_outlook,
     ntr_restriction_outlook(600.0, 500.0, 150.0, 60.0, 125.0, 0.4, 1.0, &g_outlook),
     stub_d7_vp(600.0, 500.0, 150.0, 60.0, 125.0, 0.4, 1.0, &g_outlook))
PAIR(ntr_relower_estimate,
     ntr_relower_estimate(131.0, 30.0, 0.0, 0.0, 3.0, 6.0, 100.0, 40.0, 20.0,
                          &d, &d2),
     stub_d9_pp(131.0, 30.0, 0.0, 0.0, 3.0, 6.0, 100.0, 40.0, 20.0, &d, &d2))

/* The watcher is fed a stream: one result every 4 h, rising 0.25 mmol/L
 * each time for 32 results and then stepping back down, so the pushes see
 * rises, falls and a full 48 h window. Both loops compute the same inputs. */
#define PUSH_HOURS(k) (4.0 * (double)(k))
#define PUSH_NA(k) (118.0 + 0.25 * (double)((k) % 32))
NOINLINE long loop_ntr_watch_push(long n);
NOINLINE long base_ntr_watch_push(long n);
NOINLINE long loop_ntr_watch_push(long n)
{
    long bad = 0;
    for (long k = 0; k < n; k++) {
        bad += ntr_watch_push(&g_watch, PUSH_HOURS(k), PUSH_NA(k),
                              &g_correction) != 0;
    }
    return bad;
}
NOINLINE long base_ntr_watch_push(long n)
{
    long bad = 0;
    for (long k = 0; k < n; k++) {
        bad += stub_pdd_p(&g_watch, PUSH_HOURS(k), PUSH_NA(k),
                          &g_correction) != 0;
    }
    return bad;
}

/* The course watcher (1.1) fed the same stream as ntr_watch_push. */
NOINLINE long loop_ntr_course_watch_push(long n);
NOINLINE long base_ntr_course_watch_push(long n);
NOINLINE long loop_ntr_course_watch_push(long n)
{
    long bad = 0;
    for (long k = 0; k < n; k++) {
        bad += ntr_course_watch_push(&g_course_watch, PUSH_HOURS(k), PUSH_NA(k),
                                     &g_course_report) != 0;
    }
    return bad;
}
NOINLINE long base_ntr_course_watch_push(long n)
{
    long bad = 0;
    for (long k = 0; k < n; k++) {
        bad += stub_pdd_p(&g_course_watch, PUSH_HOURS(k), PUSH_NA(k),
                          &g_course_report) != 0;
    }
    return bad;
}

/* 1.1 scalar functions (issue 16); invented, valid inputs. */
PAIR(ntr_input_range, ntr_input_range(NTR_INPUT_NA, &d, &d2),
     stub_i_pp(NTR_INPUT_NA, &d, &d2))
PAIR(ntr_fe_uric_acid_class, ntr_fe_uric_acid_class(12.0, &i),
     stub_d_ip(12.0, &i))
PAIR(ntr_fe_uric_acid_after_correction,
     ntr_fe_uric_acid_after_correction(12.0, 8.0, 138.0, &i),
     stub_ddd_ip(12.0, 8.0, 138.0, &i))
PAIR(ntr_loop_diuretic,
     ntr_loop_diuretic(128.0, 30.0, 2.0, 80.0, 1.0, 154.0, &d, &d2),
     stub_d6_pp(128.0, 30.0, 2.0, 80.0, 1.0, 154.0, &d, &d2))
PAIR(ntr_dda_clamp,
     ntr_dda_clamp(118.0, 30.0, 30.0, 513.0, 60.0, 80.0, 6.0, &d, &d2),
     stub_d7_pp(118.0, 30.0, 30.0, 513.0, 60.0, 80.0, 6.0, &d, &d2))
PAIR(ntr_course_limits_preset,
     ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, &g_course_limits_out),
     stub_i_vp(NTR_COURSE_HYPO_STANDARD, &g_course_limits_out))
PAIR(ntr_vaptan_watch_preset, ntr_vaptan_watch_preset(0, 0, &g_vaptan),
     stub_ii_vp(0, 0, &g_vaptan))

/* Series functions: the cost depends on the length of the series, so the
 * script reports these apart from the scalar target, per call and per
 * sample (ntr_correction_assess scaling is measured by bench_correction). */
PAIR(ntr_correction_assess,
     ntr_correction_assess(g_series, 12, &g_limits, &g_correction),
     stub_pz_pp(g_series, 12, &g_limits, &g_correction))
PAIR(ntr_balance_predict,
     ntr_balance_predict(125.0, 30.0, g_flows, 2, &d, &d2),
     stub_ddpz_pp(125.0, 30.0, g_flows, 2, &d, &d2))
PAIR(ntr_balance_course,
     ntr_balance_course(118.0, 30.0, g_plan_flows, 2, 24.0, 1.0, g_course, 32,
                        &g_count),
     stub_ddpzdd_pzp(118.0, 30.0, g_plan_flows, 2, 24.0, 1.0, g_course, 32,
                     &g_count))
PAIR(ntr_plan_check,
     ntr_plan_check(g_history, 3, 30.0, g_plan_flows, 2, 24.0, 1.0, &g_limits,
                    &g_plan),
     stub_pzdpzddp_p(g_history, 3, 30.0, g_plan_flows, 2, 24.0, 1.0,
                     &g_limits, &g_plan))

PAIR(ntr_course_plan_check,
     ntr_course_plan_check(g_history, 3, 30.0, g_plan_flows, 2, 24.0, 1.0,
                           &g_course_limits, &g_course_plan),
     stub_pzdpzddp_p(g_history, 3, 30.0, g_plan_flows, 2, 24.0, 1.0,
                     &g_course_limits, &g_course_plan))

struct pair {
    const char *name;
    long (*loop)(long);
    long (*base)(long);
};

#define ENTRY(name) {#name, loop_##name, base_##name}

static const struct pair pairs[] = {
    ENTRY(ntr_unit_parse),
    ENTRY(ntr_unit_parse_lenient),
    ENTRY(ntr_loinc_lookup),
    ENTRY(ntr_glucose_unit_check),
    ENTRY(ntr_convert),
    ENTRY(ntr_osm_calculated),
    ENTRY(ntr_osm_effective),
    ENTRY(ntr_osm_gap),
    ENTRY(ntr_na_corrected_glucose),
    ENTRY(ntr_na_corrected_glucose_factor),
    ENTRY(ntr_na_deficit),
    ENTRY(ntr_tbw_fraction),
    ENTRY(ntr_tbw_watson),
    ENTRY(ntr_free_water_deficit),
    ENTRY(ntr_fluid_preset),
    ENTRY(ntr_infusate_change_per_litre),
    ENTRY(ntr_infusate_change),
    ENTRY(ntr_infusate_volume_for_change),
    ENTRY(ntr_furst_ratio),
    ENTRY(ntr_restriction_from_ratio),
    ENTRY(ntr_efwc),
    ENTRY(ntr_status_message),
    ENTRY(ntr_version_string),
    ENTRY(ntr_version_number),
    ENTRY(ntr_na_severity),
    ENTRY(ntr_tonicity_class),
    ENTRY(ntr_low_na_tonicity),
    ENTRY(ntr_effective_osm_measured),
    ENTRY(ntr_low_na_effective_tonicity),
    ENTRY(ntr_urine_maximally_dilute),
    ENTRY(ntr_urine_na_high),
    ENTRY(ntr_fractional_excretion),
    ENTRY(ntr_siad_findings_init),
    ENTRY(ntr_siad_evaluate),
    ENTRY(ntr_method_info),
    ENTRY(ntr_method_next),
    ENTRY(ntr_limits_preset),
    ENTRY(ntr_ods_risk),
    ENTRY(ntr_watch_init),
    ENTRY(ntr_watch_push),
    ENTRY(ntr_watch_result),
    ENTRY(ntr_urine_volume_from_solute),
    ENTRY(ntr_fluid_allowance),
    ENTRY(ntr_solute_dose_osmoles),
    ENTRY(ntr_fluid_allowance_with_dose),
    ENTRY(ntr_solute_dose_for_allowance),
    ENTRY(ntr_restriction_outlook),
    ENTRY(ntr_relower_estimate),
    ENTRY(ntr_correction_assess),
    ENTRY(ntr_balance_predict),
    ENTRY(ntr_balance_course),
    ENTRY(ntr_plan_check),
    ENTRY(ntr_course_plan_check),
    ENTRY(ntr_course_watch_push),
    ENTRY(ntr_input_range),
    ENTRY(ntr_fe_uric_acid_class),
    ENTRY(ntr_fe_uric_acid_after_correction),
    ENTRY(ntr_loop_diuretic),
    ENTRY(ntr_dda_clamp),
    ENTRY(ntr_course_limits_preset),
    ENTRY(ntr_vaptan_watch_preset),
};

int main(int argc, char **argv)
{
    long n = argc > 1 ? strtol(argv[1], NULL, 10) : 20000;
    size_t k;
    int failed = 0;
    if (n <= 0) {
        fprintf(stderr, "bench_scalar: N must be positive\n");
        return 2;
    }
    setup();
    printf("calls_per_loop %ld\n", n);
    for (k = 0; k < sizeof pairs / sizeof pairs[0]; k++) {
        long bad = pairs[k].loop(n);
        long base_bad = pairs[k].base(n);
        printf("%s bad=%ld base_bad=%ld\n", pairs[k].name, bad, base_bad);
        if (bad != 0 || base_bad != 0) {
            failed = 1;
        }
    }
    return failed;
}
