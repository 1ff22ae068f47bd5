/* SPDX-License-Identifier: MIT */
/* Every row-wise batch function behind one calling shape, with its scalar
 * counterpart, a valid row and the documented range of each column
 * (include/natremia.h). Shared by tests/test_batch.c (batch against scalar
 * at every range and band edge) and tests/test_guard.c (columns that end
 * at an inaccessible page). Include after natremia.h. */
#ifndef NTR_BATCH_TABLE_H
#define NTR_BATCH_TABLE_H

#include <stddef.h>

#include "natremia.h"

#define BT_MAX_COLS 5
#define BT_MAX_EDGES 6

/* col[c] is column c; sex is the sex column (tbw functions) or unused;
 * out is a double column, or an int column when int_out is set. */
typedef int (*bt_batch_fn)(size_t n, const double *const *col, const int *sex,
                           void *out, int *status, size_t *failed);
/* The scalar function on one row; out as above (one element). */
typedef int (*bt_scalar_fn)(const double *row, int sex, void *out);

struct bt_entry {
    const char *name;
    int ncol;
    int has_sex;
    int int_out;
    double base[BT_MAX_COLS];
    double lo[BT_MAX_COLS];
    double hi[BT_MAX_COLS];
    /* Band edges inside the range, per column (0-terminated count). */
    int nedges[BT_MAX_COLS];
    double edges[BT_MAX_COLS][BT_MAX_EDGES];
    bt_batch_fn batch;
    bt_scalar_fn scalar;
};

#define BT_D(p) ((double *)(p))

static int bt_osm_2na(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    (void)s;
    return ntr_batch_osm_calculated(n, c[0], c[1], c[2], c[3], NTR_OSM_2NA, BT_D(o), st, f);
}
static int bt_osm_2na_1(const double *r, int s, void *o)
{
    (void)s;
    return ntr_osm_calculated(r[0], r[1], r[2], r[3], NTR_OSM_2NA, BT_D(o));
}
static int bt_osm_dc(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    (void)s;
    return ntr_batch_osm_calculated(n, c[0], c[1], c[2], c[3], NTR_OSM_DORWART_CHALMERS, BT_D(o), st, f);
}
static int bt_osm_dc_1(const double *r, int s, void *o)
{
    (void)s;
    return ntr_osm_calculated(r[0], r[1], r[2], r[3], NTR_OSM_DORWART_CHALMERS, BT_D(o));
}
static int bt_osm_eff(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    (void)s;
    return ntr_batch_osm_effective(n, c[0], c[1], BT_D(o), st, f);
}
static int bt_osm_eff_1(const double *r, int s, void *o)
{
    (void)s;
    return ntr_osm_effective(r[0], r[1], BT_D(o));
}
static int bt_osm_gap(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    (void)s;
    return ntr_batch_osm_gap(n, c[0], c[1], BT_D(o), st, f);
}
static int bt_osm_gap_1(const double *r, int s, void *o)
{
    (void)s;
    return ntr_osm_gap(r[0], r[1], BT_D(o));
}
static int bt_katz(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    (void)s;
    return ntr_batch_na_corrected_glucose(n, c[0], c[1], NTR_GLUCOSE_KATZ, BT_D(o), st, f);
}
static int bt_katz_1(const double *r, int s, void *o)
{
    (void)s;
    return ntr_na_corrected_glucose(r[0], r[1], NTR_GLUCOSE_KATZ, BT_D(o));
}
static int bt_hillier(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    (void)s;
    return ntr_batch_na_corrected_glucose(n, c[0], c[1], NTR_GLUCOSE_HILLIER, BT_D(o), st, f);
}
static int bt_hillier_1(const double *r, int s, void *o)
{
    (void)s;
    return ntr_na_corrected_glucose(r[0], r[1], NTR_GLUCOSE_HILLIER, BT_D(o));
}
static int bt_fraction(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    return ntr_batch_tbw_fraction(n, s, c[0], c[1], BT_D(o), st, f);
}
static int bt_fraction_1(const double *r, int s, void *o)
{
    return ntr_tbw_fraction(s, r[0], r[1], BT_D(o));
}
static int bt_watson(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    return ntr_batch_tbw_watson(n, s, c[0], c[1], c[2], BT_D(o), st, f);
}
static int bt_watson_1(const double *r, int s, void *o)
{
    return ntr_tbw_watson(s, r[0], r[1], r[2], BT_D(o));
}
static int bt_fwd(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    (void)s;
    return ntr_batch_free_water_deficit(n, c[0], c[1], BT_D(o), st, f);
}
static int bt_fwd_1(const double *r, int s, void *o)
{
    (void)s;
    return ntr_free_water_deficit(r[0], r[1], BT_D(o));
}
static int bt_nad(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    (void)s;
    return ntr_batch_na_deficit(n, c[0], c[1], c[2], BT_D(o), st, f);
}
static int bt_nad_1(const double *r, int s, void *o)
{
    (void)s;
    return ntr_na_deficit(r[0], r[1], r[2], BT_D(o));
}
static int bt_perl(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    (void)s;
    return ntr_batch_infusate_change_per_litre(n, c[0], c[1], c[2], c[3], BT_D(o), st, f);
}
static int bt_perl_1(const double *r, int s, void *o)
{
    (void)s;
    return ntr_infusate_change_per_litre(r[0], r[1], r[2], r[3], BT_D(o));
}
static int bt_change(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    (void)s;
    return ntr_batch_infusate_change(n, c[0], c[1], c[2], c[3], c[4], BT_D(o), st, f);
}
static int bt_change_1(const double *r, int s, void *o)
{
    (void)s;
    return ntr_infusate_change(r[0], r[1], r[2], r[3], r[4], BT_D(o));
}
static int bt_volume(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    (void)s;
    return ntr_batch_infusate_volume_for_change(n, c[0], c[1], c[2], c[3], c[4], BT_D(o), st, f);
}
static int bt_volume_1(const double *r, int s, void *o)
{
    (void)s;
    return ntr_infusate_volume_for_change(r[0], r[1], r[2], r[3], r[4], BT_D(o));
}
static int bt_furst(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    (void)s;
    return ntr_batch_furst_ratio(n, c[0], c[1], c[2], BT_D(o), st, f);
}
static int bt_furst_1(const double *r, int s, void *o)
{
    (void)s;
    return ntr_furst_ratio(r[0], r[1], r[2], BT_D(o));
}
static int bt_restrict(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    (void)s;
    return ntr_batch_restriction_from_ratio(n, c[0], (int *)o, st, f);
}
static int bt_restrict_1(const double *r, int s, void *o)
{
    (void)s;
    return ntr_restriction_from_ratio(r[0], (int *)o);
}
static int bt_efwc(size_t n, const double *const *c, const int *s, void *o, int *st, size_t *f)
{
    (void)s;
    return ntr_batch_efwc(n, c[0], c[1], c[2], c[3], BT_D(o), st, f);
}
static int bt_efwc_1(const double *r, int s, void *o)
{
    (void)s;
    return ntr_efwc(r[0], r[1], r[2], r[3], BT_D(o));
}

/* Ranges as the header documents them; band edges where a result changes
 * branch (age 18 and 65: Adrogue & Madias 2000 fractions; Furst ratio 0.9
 * and 1.0: NTR_FURST_ABOUT_ONE_LOW/HIGH; a wanted change of 0). */
static const struct bt_entry bt_table[] = {
    {"osm_calculated 2Na", 4, 0, 0, {140.0, 5.0, 5.0, 0.0},
     {80.0, 0.0, 0.0, 0.0}, {220.0, 200.0, 200.0, 400.0}, {0}, {{0}}, bt_osm_2na, bt_osm_2na_1},
    {"osm_calculated Dorwart-Chalmers", 4, 0, 0, {140.0, 5.0, 5.0, 0.0},
     {80.0, 0.0, 0.0, 0.0}, {220.0, 200.0, 200.0, 400.0}, {0}, {{0}}, bt_osm_dc, bt_osm_dc_1},
    {"osm_effective", 2, 0, 0, {140.0, 5.0}, {80.0, 0.0}, {220.0, 200.0}, {0}, {{0}},
     bt_osm_eff, bt_osm_eff_1},
    {"osm_gap", 2, 0, 0, {300.0, 290.0}, {150.0, 150.0}, {600.0, 600.0}, {0}, {{0}},
     bt_osm_gap, bt_osm_gap_1},
    {"na_corrected_glucose Katz", 2, 0, 0, {130.0, 30.0}, {80.0, 0.0}, {220.0, 200.0},
     {0, 1}, {{0}, {5.5}}, bt_katz, bt_katz_1},
    {"na_corrected_glucose Hillier", 2, 0, 0, {130.0, 30.0}, {80.0, 0.0}, {220.0, 200.0},
     {0, 1}, {{0}, {5.5}}, bt_hillier, bt_hillier_1},
    {"tbw_fraction", 2, 1, 0, {50.0, 70.0}, {1.0, 0.3}, {130.0, 650.0},
     {2, 0}, {{18.0, 65.0}}, bt_fraction, bt_fraction_1},
    {"tbw_watson", 3, 1, 0, {50.0, 170.0, 70.0}, {18.0, 30.0, 0.3}, {130.0, 275.0, 650.0},
     {1, 0, 0}, {{65.0}}, bt_watson, bt_watson_1},
    {"free_water_deficit", 2, 0, 0, {40.0, 160.0}, {0.1, 80.0}, {400.0, 220.0}, {0, 1},
     {{0}, {140.0}}, bt_fwd, bt_fwd_1},
    {"na_deficit", 3, 0, 0, {40.0, 120.0, 130.0}, {0.1, 80.0, 80.0}, {400.0, 220.0, 220.0},
     {0}, {{0}}, bt_nad, bt_nad_1},
    {"infusate_change_per_litre", 4, 0, 0, {110.0, 40.0, 513.0, 0.0},
     {80.0, 0.1, 0.0, 0.0}, {220.0, 400.0, 1100.0, 400.0}, {0}, {{0}}, bt_perl, bt_perl_1},
    {"infusate_change", 5, 0, 0, {110.0, 40.0, 513.0, 0.0, 1.0},
     {80.0, 0.1, 0.0, 0.0, 0.0}, {220.0, 400.0, 1100.0, 400.0, 20.0}, {0}, {{0}},
     bt_change, bt_change_1},
    {"infusate_volume_for_change", 5, 0, 0, {110.0, 40.0, 513.0, 0.0, 8.0},
     {80.0, 0.1, 0.0, 0.0, -50.0}, {220.0, 400.0, 1100.0, 400.0, 50.0}, {0, 0, 0, 0, 1},
     {{0}, {0}, {0}, {0}, {0.0}}, bt_volume, bt_volume_1},
    {"furst_ratio", 3, 0, 0, {60.0, 40.0, 125.0}, {0.0, 0.0, 80.0}, {500.0, 300.0, 220.0},
     {0}, {{0}}, bt_furst, bt_furst_1},
    {"restriction_from_ratio", 1, 0, 1, {0.7}, {0.0}, {20.0}, {3}, {{0.5, 0.9, 1.0}},
     bt_restrict, bt_restrict_1},
    {"efwc", 4, 0, 0, {2.0, 60.0, 40.0, 125.0}, {0.0, 0.0, 0.0, 80.0},
     {30.0, 500.0, 300.0, 220.0}, {0}, {{0}}, bt_efwc, bt_efwc_1},
};

#define BT_COUNT (sizeof bt_table / sizeof bt_table[0])

/* Further rows (invented) where a later check of the formula decides: the
 * predicted state leaves the model's range (NTR_ERR_DOMAIN) although every
 * input is in range. Of the volume_for_change rows (found by a search over
 * rows aiming at a sodium of 80 or 220), the first three fail because the
 * body water would pass 400 L, the fourth only by the rounding of the
 * forward prediction of sodium at a target of 220. */
static const struct {
    const char *name;
    double row[BT_MAX_COLS];
} bt_extra[] = {
    {"infusate_change_per_litre", {200.0, 0.1, 1100.0, 400.0}},
    {"infusate_change", {110.0, 10.0, 1100.0, 400.0, 20.0}},
    {"infusate_change", {90.0, 5.0, 0.0, 0.0, 20.0}},
    {"infusate_volume_for_change", {181.59999999999999, 387.30000000000001, 1032.4000000000001,
                                    28.699999999999999, 38.400000000000006}},
    {"infusate_volume_for_change", {209.09999999999999, 394.0, 696.20000000000005,
                                    79.700000000000003, 10.900000000000006}},
    {"infusate_volume_for_change", {207.0, 391.70000000000005, 167.69999999999999,
                                    370.10000000000002, 13.0}},
    {"infusate_volume_for_change", {170.80000000000001, 43.899999999999999, 916.89999999999998,
                                    381.19999999999999, 49.199999999999989}},
    {"infusate_volume_for_change", {110.0, 40.0, 154.0, 0.0, 45.0}},
    {"tbw_watson", {40.0, 30.0, 650.0}},
    {"tbw_watson", {40.0, 275.0, 0.3}},
    {"free_water_deficit", {0.1, 80.0}},
};

#define BT_EXTRA_COUNT (sizeof bt_extra / sizeof bt_extra[0])

#endif
