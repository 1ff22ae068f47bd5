/* SPDX-License-Identifier: MIT */
/* Frama-C EVA drivers of the remaining scalar entry points: units and
 * LOINC codes, input ranges, the method registry, version, the work-up
 * classifications and SIAD criteria, and the therapy plans
 * (tests/frama-c.sh; docs/reliability.md, "Static proof"). As in
 * tests/frama-c/drivers.c: every number over its whole documented range
 * (the constants of lib/ntr_internal.h), every enumerator over valid and
 * invalid codes, strings from a fixed list of valid and invalid ones. */
#include "__fc_builtin.h"
#include "natremia.h"
#include "ntr_internal.h"

#define D(lo, hi) Frama_C_double_interval((lo), (hi))
#define I(lo, hi) Frama_C_interval((lo), (hi))
#define NA D(NTR_NA_MIN, NTR_NA_MAX)
#define TBW D(NTR_TBW_MIN, NTR_TBW_MAX)
#define CHANGE D(0.0, NTR_DELTA_MAX)
#define HOURS D(NTR_PLAN_STEP_MIN, NTR_PLAN_HOURS_MAX)
#define RATE D(0.0, NTR_FLOW_RATE_MAX)
#define URINE_NA_K D(0.0, NTR_URINE_NA_MAX)

void drv_version(void)
{
    unsigned long number = ntr_version_number();
    const char *text = ntr_version_string();
    (void)number;
    (void)text;
}

/* One call site per text, so that EVA reads each string on its own (with
 * a pointer to any of them it cannot tell where the shorter ones end). */
static void lenient(const char *text)
{
    int unit;
    (void)ntr_unit_parse_lenient(text, &unit);
}

void drv_unit_parse_lenient(void)
{
    lenient("mmol/l");
    lenient(" MG/DL ");
    lenient("mEq/L");
    lenient("mOsm/kg H2O");
    lenient("Mmol/L");
    lenient("\xc2\xb5mol/L");
    lenient("\xce\xbcmol/L\t");
    lenient("\xc2mol/L");
    lenient("");
    lenient("mmol/L/L");
    lenient("xxxxxxxxxxxxxxxxxxxxxxxxxxxxxxx");
    lenient("xxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxx");
}

static void loinc(const char *code)
{
    int analyte, specimen, unit;
    (void)ntr_loinc_lookup(code, &analyte, &specimen, &unit);
}

void drv_loinc_lookup(void)
{
    loinc("2951-2");
    loinc("2345-7");
    loinc("14749-6");
    loinc("2951-3");
    loinc("");
    loinc("2951");
    loinc("29512-2-1");
}

void drv_glucose_unit_check(void)
{
    double out;
    (void)ntr_glucose_unit_check(D(0.0, 2.0e5), I(-1, 8), NA, D(NTR_OSM_MIN, NTR_OSM_MAX),
                                 &out);
}

void drv_input_range(void)
{
    double lo, hi;
    (void)ntr_input_range(I(-1, 45), &lo, &hi);
}

void drv_method_info(void)
{
    struct ntr_method_info out;
    (void)ntr_method_info(I(-1, 120), &out);
}

void drv_method_next(void)
{
    int next;
    (void)ntr_method_next(I(-1, 120), &next);
}

void drv_na_severity(void)
{
    int out;
    (void)ntr_na_severity(NA, &out);
}

void drv_tonicity_class(void)
{
    int out;
    (void)ntr_tonicity_class(D(NTR_OSM_MIN, NTR_OSM_MAX), &out);
}

void drv_low_na_tonicity(void)
{
    int tonicity;
    unsigned int flags;
    (void)ntr_low_na_tonicity(NA, D(0.0, NTR_GLUCOSE_MAX), D(NTR_OSM_MIN, NTR_OSM_MAX),
                              I(-1, 4), &tonicity, &flags);
}

void drv_effective_osm_measured(void)
{
    double out;
    (void)ntr_effective_osm_measured(NA, D(0.0, NTR_GLUCOSE_MAX), D(0.0, NTR_UREA_MAX),
                                     D(0.0, NTR_ETHANOL_MAX), D(NTR_OSM_MIN, NTR_OSM_MAX),
                                     &out);
}

void drv_low_na_effective_tonicity(void)
{
    int tonicity;
    unsigned int flags;
    (void)ntr_low_na_effective_tonicity(NA, D(0.0, NTR_GLUCOSE_MAX), D(0.0, NTR_UREA_MAX),
                                        D(0.0, NTR_ETHANOL_MAX),
                                        D(NTR_OSM_MIN, NTR_OSM_MAX), I(-1, 4), &tonicity,
                                        &flags);
}

void drv_urine_maximally_dilute(void)
{
    int out;
    (void)ntr_urine_maximally_dilute(D(NTR_URINE_OSM_MIN, NTR_URINE_OSM_MAX), &out);
}

void drv_urine_na_high(void)
{
    int out;
    (void)ntr_urine_na_high(D(0.0, NTR_URINE_NA_MAX), &out);
}

void drv_fractional_excretion(void)
{
    double out;
    (void)ntr_fractional_excretion(D(0.0, NTR_FE_INPUT_MAX), D(0.0, NTR_FE_INPUT_MAX),
                                   D(0.0, NTR_FE_INPUT_MAX), D(0.0, NTR_FE_INPUT_MAX), &out);
}

void drv_fe_uric_acid_class(void)
{
    int out;
    (void)ntr_fe_uric_acid_class(D(0.0, NTR_FE_PERCENT_MAX), &out);
}

void drv_fe_uric_acid_after_correction(void)
{
    int out;
    (void)ntr_fe_uric_acid_after_correction(D(0.0, NTR_FE_PERCENT_MAX),
                                            D(0.0, NTR_FE_PERCENT_MAX), NA, &out);
}

/* One finding value: known (or not, or an invalid flag) and a value over
 * its documented range. */
static ntr_finding_value finding(double lo, double hi)
{
    ntr_finding_value v;
    v.known = I(-1, 2);
    v.reserved = 0;
    v.value = D(lo, hi);
    return v;
}

void drv_siad(void)
{
    ntr_siad_findings f;
    ntr_siad_result r;
    if (ntr_siad_findings_init(&f) != NTR_OK) {
        return;
    }
    f.effective_osm_mosm_kg = finding(NTR_OSM_MIN, NTR_OSM_MAX);
    f.urine_osm_mosm_kg = finding(NTR_URINE_OSM_MIN, NTR_URINE_OSM_MAX);
    f.urine_na_mmol_l = finding(0.0, NTR_URINE_NA_MAX);
    f.volume_status = I(-1, 4);
    f.normal_salt_water_intake = I(-1, 3);
    f.thyroid_normal = I(-1, 3);
    f.adrenal_normal = I(-1, 3);
    f.pituitary_normal = I(-1, 3);
    f.kidney_normal = I(-1, 3);
    f.recent_diuretic = I(-1, 3);
    f.saline_corrected = I(-1, 3);
    f.restriction_corrected = I(-1, 3);
    f.uric_acid_mmol_l = finding(0.0, NTR_URIC_ACID_MAX);
    f.urea_mmol_l = finding(0.0, NTR_UREA_MAX);
    f.fe_na_percent = finding(0.0, NTR_FE_PERCENT_MAX);
    f.fe_urea_percent = finding(0.0, NTR_FE_PERCENT_MAX);
    f.fe_uric_acid_percent = finding(0.0, NTR_FE_PERCENT_MAX);
    r.struct_size = sizeof r;
    (void)ntr_siad_evaluate(&f, &r);
}

void drv_loop_diuretic(void)
{
    double without, with;
    (void)ntr_loop_diuretic(NA, TBW, D(0.0, NTR_URINE_VOLUME_MAX), URINE_NA_K,
                            D(0.0, NTR_INFUSE_VOLUME_MAX), D(0.0, NTR_INFUSATE_NA_MAX),
                            &without, &with);
}

void drv_dda_clamp(void)
{
    double rise, stop;
    (void)ntr_dda_clamp(NA, TBW, RATE, D(0.0, NTR_INFUSATE_NA_MAX), RATE, URINE_NA_K, CHANGE,
                        &rise, &stop);
}

void drv_dda_relower(void)
{
    double volume, rate;
    (void)ntr_dda_relower(NA, TBW, D(0.0, NTR_LIMIT_MAX), D(0.0, NTR_RELOWER_MARGIN_MAX), HOURS,
                          RATE, URINE_NA_K, &volume, &rate);
}

void drv_vaptan_watch_preset(void)
{
    ntr_vaptan_watch out;
    out.struct_size = sizeof out;
    (void)ntr_vaptan_watch_preset(I(-1, 2), I(-1, 2), &out);
}

void drv_bolus_plan(void)
{
    int boluses, held;
    double rise;
    (void)ntr_bolus_plan(NA, TBW, CHANGE, CHANGE, &boluses, &rise, &held);
}
