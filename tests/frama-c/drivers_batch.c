/* SPDX-License-Identifier: MIT */
/* Frama-C EVA drivers of the batch entry points (tests/frama-c.sh;
 * docs/reliability.md, "Static proof").
 *
 * Each driver hands a batch call ROWS rows whose every element takes the
 * whole documented range of its column (Frama_C_double_interval; the
 * bounds are the constants of lib/ntr_internal.h that the scalar checks
 * use, which ntr_input_range() reports), a row count of 0 to ROWS, and
 * enumerators over valid and invalid codes. tests/frama-c.sh parses
 * lib/batch.c without the two-lane path (see there), so EVA follows the
 * row loops through the scalar kernels, as on targets without SSE2 or
 * AArch64.
 *
 * A failed row's out[i] is NaN by contract (lib/batch.c, FAILED_ROW), and
 * EVA stops a path at the first NaN it cannot exclude, so tests/frama-c.sh
 * runs these drivers with -warn-special-float none. In its place each
 * driver asserts after the call that no output is infinite (results()):
 * tests/frama-c.sh counts such an assertion that EVA cannot prove as an
 * alarm. A NaN computed by a kernel on a valid row would not be told from
 * the failed-row NaN here; the scalar drivers (tests/frama-c/drivers.c),
 * which run the same kernels with NaN alarms on, cover that. */
#include "__fc_builtin.h"
#include "natremia.h"
#include "ntr_internal.h"

#define D(lo, hi) Frama_C_double_interval((lo), (hi))
#define I(lo, hi) Frama_C_interval((lo), (hi))
#define ROWS 3

/* A column of ROWS values, each anywhere in [lo, hi]. */
static void column(double *c, double lo, double hi)
{
    int i;
    for (i = 0; i < ROWS; i++) {
        c[i] = D(lo, hi);
    }
}

/* No row of the result is infinite (NaN marks a failed row). */
static void results(const double *out)
{
    int i;
    for (i = 0; i < ROWS; i++) {
        /*@ assert no_infinity: !\is_infinite(out[i]); */
    }
}

/* The row count: a full batch. (With a count of 0 to ROWS, EVA cannot
 * relate the count to the status cells the row loop wrote, and reports
 * the scan of them in finish() as a read of uninitialised memory.) */
static size_t rows(void)
{
    return ROWS;
}

void drv_batch_osm_calculated(void)
{
    double na[ROWS], glu[ROWS], urea[ROWS], eth[ROWS], out[ROWS] = {0.0};
    int st[ROWS];
    size_t failed;
    column(na, NTR_NA_MIN, NTR_NA_MAX);
    column(glu, 0.0, NTR_GLUCOSE_MAX);
    column(urea, 0.0, NTR_UREA_MAX);
    column(eth, 0.0, NTR_ETHANOL_MAX);
    (void)ntr_batch_osm_calculated(rows(), na, glu, urea, eth, I(-1, 4), out, st, &failed);
    results(out);
}

void drv_batch_osm_effective(void)
{
    double na[ROWS], glu[ROWS], out[ROWS] = {0.0};
    int st[ROWS];
    size_t failed;
    column(na, NTR_NA_MIN, NTR_NA_MAX);
    column(glu, 0.0, NTR_GLUCOSE_MAX);
    (void)ntr_batch_osm_effective(rows(), na, glu, out, st, &failed);
    results(out);
}

void drv_batch_osm_gap(void)
{
    double m[ROWS], c[ROWS], out[ROWS] = {0.0};
    int st[ROWS];
    size_t failed;
    column(m, NTR_OSM_MIN, NTR_OSM_MAX);
    column(c, NTR_OSM_MIN, NTR_OSM_MAX);
    (void)ntr_batch_osm_gap(rows(), m, c, out, st, &failed);
    results(out);
}

void drv_batch_na_corrected_glucose(void)
{
    double na[ROWS], glu[ROWS], out[ROWS] = {0.0};
    int st[ROWS];
    size_t failed;
    column(na, NTR_NA_MIN, NTR_NA_MAX);
    column(glu, 0.0, NTR_GLUCOSE_MAX);
    (void)ntr_batch_na_corrected_glucose(rows(), na, glu, I(-1, 4), out, st, &failed);
    results(out);
}

void drv_batch_tbw_fraction(void)
{
    int sex[ROWS], st[ROWS], i;
    double age[ROWS], wt[ROWS], out[ROWS] = {0.0};
    size_t failed;
    for (i = 0; i < ROWS; i++) {
        sex[i] = I(-1, 4);
    }
    column(age, NTR_TBW_FRACTION_AGE_MIN, NTR_AGE_MAX);
    column(wt, NTR_WEIGHT_MIN, NTR_WEIGHT_MAX);
    (void)ntr_batch_tbw_fraction(rows(), sex, age, wt, out, st, &failed);
    results(out);
}

void drv_batch_tbw_watson(void)
{
    int sex[ROWS], st[ROWS], i;
    double age[ROWS], ht[ROWS], wt[ROWS], out[ROWS] = {0.0};
    size_t failed;
    for (i = 0; i < ROWS; i++) {
        sex[i] = I(-1, 4);
    }
    column(age, NTR_ADULT_AGE, NTR_AGE_MAX);
    column(ht, NTR_HEIGHT_MIN, NTR_HEIGHT_MAX);
    column(wt, NTR_WEIGHT_MIN, NTR_WEIGHT_MAX);
    (void)ntr_batch_tbw_watson(rows(), sex, age, ht, wt, out, st, &failed);
    results(out);
}

void drv_batch_free_water_deficit(void)
{
    double tbw[ROWS], na[ROWS], out[ROWS] = {0.0};
    int st[ROWS];
    size_t failed;
    column(tbw, NTR_TBW_MIN, NTR_TBW_MAX);
    column(na, NTR_NA_MIN, NTR_NA_MAX);
    (void)ntr_batch_free_water_deficit(rows(), tbw, na, out, st, &failed);
    results(out);
}

void drv_batch_na_deficit(void)
{
    double tbw[ROWS], na[ROWS], target[ROWS], out[ROWS] = {0.0};
    int st[ROWS];
    size_t failed;
    column(tbw, NTR_TBW_MIN, NTR_TBW_MAX);
    column(na, NTR_NA_MIN, NTR_NA_MAX);
    column(target, NTR_NA_MIN, NTR_NA_MAX);
    (void)ntr_batch_na_deficit(rows(), tbw, na, target, out, st, &failed);
    results(out);
}

void drv_batch_infusate_change_per_litre(void)
{
    double na[ROWS], tbw[ROWS], ina[ROWS], ik[ROWS], out[ROWS] = {0.0};
    int st[ROWS];
    size_t failed;
    column(na, NTR_NA_MIN, NTR_NA_MAX);
    column(tbw, NTR_TBW_MIN, NTR_TBW_MAX);
    column(ina, 0.0, NTR_INFUSATE_NA_MAX);
    column(ik, 0.0, NTR_INFUSATE_K_MAX);
    (void)ntr_batch_infusate_change_per_litre(rows(), na, tbw, ina, ik, out, st, &failed);
    results(out);
}

void drv_batch_infusate_change(void)
{
    double na[ROWS], tbw[ROWS], ina[ROWS], ik[ROWS], vol[ROWS], out[ROWS] = {0.0};
    int st[ROWS];
    size_t failed;
    column(na, NTR_NA_MIN, NTR_NA_MAX);
    column(tbw, NTR_TBW_MIN, NTR_TBW_MAX);
    column(ina, 0.0, NTR_INFUSATE_NA_MAX);
    column(ik, 0.0, NTR_INFUSATE_K_MAX);
    column(vol, 0.0, NTR_INFUSE_VOLUME_MAX);
    (void)ntr_batch_infusate_change(rows(), na, tbw, ina, ik, vol, out, st, &failed);
    results(out);
}

void drv_batch_infusate_volume_for_change(void)
{
    double na[ROWS], tbw[ROWS], ina[ROWS], ik[ROWS], delta[ROWS], out[ROWS] = {0.0};
    int st[ROWS];
    size_t failed;
    column(na, NTR_NA_MIN, NTR_NA_MAX);
    column(tbw, NTR_TBW_MIN, NTR_TBW_MAX);
    column(ina, 0.0, NTR_INFUSATE_NA_MAX);
    column(ik, 0.0, NTR_INFUSATE_K_MAX);
    column(delta, -NTR_DELTA_MAX, NTR_DELTA_MAX);
    (void)ntr_batch_infusate_volume_for_change(rows(), na, tbw, ina, ik, delta, out, st, &failed);
    results(out);
}

void drv_batch_furst_ratio(void)
{
    double una[ROWS], uk[ROWS], na[ROWS], out[ROWS] = {0.0};
    int st[ROWS];
    size_t failed;
    column(una, 0.0, NTR_URINE_NA_MAX);
    column(uk, 0.0, NTR_URINE_K_MAX);
    column(na, NTR_NA_MIN, NTR_NA_MAX);
    (void)ntr_batch_furst_ratio(rows(), una, uk, na, out, st, &failed);
    results(out);
}

void drv_batch_restriction_from_ratio(void)
{
    double ratio[ROWS];
    int advice[ROWS], st[ROWS];
    size_t failed;
    column(ratio, 0.0, NTR_RATIO_MAX);
    (void)ntr_batch_restriction_from_ratio(rows(), ratio, advice, st, &failed);
}

void drv_batch_efwc(void)
{
    double vol[ROWS], una[ROWS], uk[ROWS], na[ROWS], out[ROWS] = {0.0};
    int st[ROWS];
    size_t failed;
    column(vol, 0.0, NTR_URINE_VOLUME_MAX);
    column(una, 0.0, NTR_URINE_NA_MAX);
    column(uk, 0.0, NTR_URINE_K_MAX);
    column(na, NTR_NA_MIN, NTR_NA_MAX);
    (void)ntr_batch_efwc(rows(), vol, una, uk, na, out, st, &failed);
    results(out);
}
