/* SPDX-License-Identifier: MIT */
/* Frama-C EVA drivers (tests/frama-c.sh; docs/reliability.md).
 *
 * One function per public entry point of the scalar formula areas: every
 * numeric input takes the whole interval the header documents for it
 * (Frama_C_double_interval), every enumerator a range of valid and
 * invalid codes (Frama_C_interval), every output a valid object. EVA then
 * computes, for all those inputs at once, whether any operation can
 * overflow, divide by zero, produce NaN or infinity, read uninitialised
 * memory or go out of bounds: each such possibility is an alarm. */
#include "__fc_builtin.h"
#include "natremia.h"

#define D(lo, hi) Frama_C_double_interval((lo), (hi))
#define I(lo, hi) Frama_C_interval((lo), (hi))
#define NA D(80.0, 220.0)
#define TBW D(0.1, 400.0)

void drv_osm_calculated(void)
{
    double out;
    (void)ntr_osm_calculated(NA, D(0.0, 200.0), D(0.0, 200.0), D(0.0, 400.0), I(-1, 4), &out);
}

void drv_osm_effective(void)
{
    double out;
    (void)ntr_osm_effective(NA, D(0.0, 200.0), &out);
}

void drv_osm_gap(void)
{
    double out;
    (void)ntr_osm_gap(D(150.0, 600.0), D(150.0, 600.0), &out);
}

void drv_na_corrected_glucose_factor(void)
{
    double out;
    (void)ntr_na_corrected_glucose_factor(NA, D(0.0, 200.0), D(0.0, 5.0), &out);
}

void drv_na_corrected_glucose(void)
{
    double out;
    (void)ntr_na_corrected_glucose(NA, D(0.0, 200.0), I(-1, 4), &out);
}

void drv_na_deficit(void)
{
    double out;
    (void)ntr_na_deficit(TBW, NA, NA, &out);
}

void drv_tbw_fraction(void)
{
    double out;
    (void)ntr_tbw_fraction(I(-1, 4), D(1.0, 130.0), D(0.3, 650.0), &out);
}

void drv_tbw_watson(void)
{
    double out;
    (void)ntr_tbw_watson(I(-1, 4), D(18.0, 130.0), D(30.0, 275.0), D(0.3, 650.0), &out);
}

void drv_free_water_deficit(void)
{
    double out;
    (void)ntr_free_water_deficit(TBW, NA, &out);
}

void drv_fluid_preset(void)
{
    double na, k;
    (void)ntr_fluid_preset(I(-2, 40), &na, &k);
}

void drv_infusate_change_per_litre(void)
{
    double out;
    (void)ntr_infusate_change_per_litre(NA, TBW, D(0.0, 1100.0), D(0.0, 400.0), &out);
}

void drv_infusate_change(void)
{
    double out;
    (void)ntr_infusate_change(NA, TBW, D(0.0, 1100.0), D(0.0, 400.0), D(0.0, 20.0), &out);
}

void drv_infusate_volume_for_change(void)
{
    double out;
    (void)ntr_infusate_volume_for_change(NA, TBW, D(0.0, 1100.0), D(0.0, 400.0),
                                         D(-50.0, 50.0), &out);
}

void drv_furst_ratio(void)
{
    double out;
    (void)ntr_furst_ratio(D(0.0, 500.0), D(0.0, 300.0), NA, &out);
}

void drv_restriction_from_ratio(void)
{
    int out;
    (void)ntr_restriction_from_ratio(D(0.0, 20.0), &out);
}

void drv_efwc(void)
{
    double out;
    (void)ntr_efwc(D(0.0, 30.0), D(0.0, 500.0), D(0.0, 300.0), NA, &out);
}

/* The analyte codes -1 to 12 in three calls: osmolality (9) has no molar
 * mass (0 in the table) and takes only mosm/kg, so its conversion is the
 * identity; in one call EVA would merge its table row with the others'
 * and divide by that 0 for mg/dL. */
void drv_convert(void)
{
    double out;
    (void)ntr_convert(I(-1, 8), D(0.0, 1.0e6), I(-1, 20), I(-1, 20), &out);
    (void)ntr_convert(NTR_ANALYTE_OSMOLALITY, D(0.0, 1.0e6), I(-1, 20), I(-1, 20), &out);
    (void)ntr_convert(I(10, 12), D(0.0, 1.0e6), I(-1, 20), I(-1, 20), &out);
}

void drv_unit_parse(void)
{
    static const char *const names[] = {"mmol/L", "mg/dL", "mEq/L", "mosm/kg", "", "mmol"};
    int unit;
    (void)ntr_unit_parse(names[I(0, 5)], &unit);
}

void drv_status_message(void)
{
    (void)ntr_status_message(I(-1000, 1000));
}

void drv_urine_volume_from_solute(void)
{
    double out;
    (void)ntr_urine_volume_from_solute(D(0.0, 10000.0), D(10.0, 2000.0), &out);
}

void drv_fluid_allowance(void)
{
    double out;
    (void)ntr_fluid_allowance(D(0.0, 10000.0), D(10.0, 2000.0), D(0.0, 500.0), D(0.0, 300.0),
                              NA, D(0.0, 10.0), &out);
}

void drv_solute_dose_osmoles(void)
{
    double out;
    (void)ntr_solute_dose_osmoles(I(-1, 4), D(0.0, 200.0), &out);
}

void drv_fluid_allowance_with_dose(void)
{
    double out;
    (void)ntr_fluid_allowance_with_dose(I(-1, 4), D(0.0, 200.0), D(0.0, 10000.0),
                                        D(10.0, 2000.0), D(0.0, 500.0), D(0.0, 300.0), NA,
                                        D(0.0, 10.0), &out);
}

void drv_solute_dose_for_allowance(void)
{
    double out;
    (void)ntr_solute_dose_for_allowance(I(-1, 4), D(0.0, 10000.0), D(10.0, 2000.0),
                                        D(0.0, 500.0), D(0.0, 300.0), NA, D(0.0, 10.0),
                                        D(0.0, 10.0), &out);
}

void drv_restriction_outlook(void)
{
    ntr_outlook out;
    out.struct_size = sizeof out;
    (void)ntr_restriction_outlook(D(0.0, 10000.0), D(10.0, 2000.0), D(0.0, 500.0),
                                  D(0.0, 300.0), NA, D(0.0, 10.0), D(0.0, 10.0), &out);
}

void drv_relower_estimate(void)
{
    double v, r;
    (void)ntr_relower_estimate(NA, TBW, D(0.0, 1100.0), D(0.0, 400.0), D(0.0, 50.0),
                               D(1.0 / 60.0, 720.0), D(0.0, 5000.0), D(0.0, 500.0),
                               D(0.0, 300.0), &v, &r);
}
