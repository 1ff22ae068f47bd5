/* SPDX-License-Identifier: MIT */
/* Batch entry points (lib/batch.c, docs/batch.md).
 *
 * Three kinds of check:
 * - published values pushed through the batch functions (source beside each);
 * - the batch contract: NULL and unknown enumerators write nothing, failed
 *   rows get NaN (or 0) and their status, the first failing status is
 *   returned, the optional counter counts, n == 0 is fine, in-place works;
 * - the property that every row equals the scalar function bit for bit,
 *   on thousands of random rows of which many are invalid on purpose. */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>
#include <math.h>
#include <cmocka.h>

#include "natremia.h"
#include "batch_table.h"

#define ROWS 4096
#define SENTINEL (-7777.25)

/* |a - b| <= tol, printing both on failure. */
#define assert_close(a, b, tol)                                              \
    do {                                                                     \
        double a_ = (a), b_ = (b);                                           \
        if (!(fabs(a_ - b_) <= (tol))) {                                     \
            print_error("%s = %.17g, expected %.17g\n", #a, a_, b_);         \
            fail();                                                          \
        }                                                                    \
    } while (0)

/* ---- deterministic random inputs ------------------------------------ */

/* xorshift64*: reproducible across platforms, no libc rand(). */
static uint64_t rng_state = 0x9E3779B97F4A7C15u;

static double uniform01(void)
{
    uint64_t x = rng_state;
    x ^= x >> 12;
    x ^= x << 25;
    x ^= x >> 27;
    rng_state = x;
    return (double)((x * 0x2545F4914F6CDD1Du) >> 11) * (1.0 / 9007199254740992.0);
}

/* A value for an input whose range is [lo, hi]: mostly inside, sometimes
 * just outside, at an edge, NaN or an infinity, so every status and every
 * check order gets exercised. */
static double draw(double lo, double hi)
{
    double u = uniform01();
    double width = hi - lo;
    if (u < 0.02) {
        return (double)NAN;
    }
    if (u < 0.03) {
        return HUGE_VAL;
    }
    if (u < 0.04) {
        return -HUGE_VAL;
    }
    if (u < 0.07) {
        return lo - 0.1 * width * uniform01() - 1e-9;
    }
    if (u < 0.10) {
        return hi + 0.1 * width * uniform01() + 1e-9;
    }
    if (u < 0.11) {
        return lo;
    }
    if (u < 0.12) {
        return hi;
    }
    return lo + width * uniform01();
}

static int draw_sex(void)
{
    double u = uniform01();
    return u < 0.47 ? NTR_SEX_MALE : u < 0.94 ? NTR_SEX_FEMALE : (u < 0.97 ? 0 : 3);
}

static void fill(double *a, size_t n, double lo, double hi)
{
    size_t i;
    for (i = 0; i < n; i++) {
        a[i] = draw(lo, hi);
    }
}

/* Same double, bit for bit (NaN equal to NaN). */
static int same_double(double a, double b)
{
    return memcmp(&a, &b, sizeof a) == 0 || (isnan(a) && isnan(b));
}

/* Compares a batch row with the scalar call on the same inputs: same status;
 * when OK the same bits, otherwise NaN in the batch output and the scalar
 * output untouched. Returns the number of failed rows seen. */
static size_t check_row(size_t i, int scalar_status, double scalar_out,
                        int batch_status, double batch_out)
{
    if (scalar_status != batch_status) {
        print_error("row %zu: scalar status %d, batch status %d\n", i,
                    scalar_status, batch_status);
        fail();
    }
    if (scalar_status == NTR_OK) {
        if (!same_double(scalar_out, batch_out)) {
            print_error("row %zu: scalar %.17g, batch %.17g\n", i, scalar_out,
                        batch_out);
            fail();
        }
        return 0;
    }
    assert_true(isnan(batch_out));
    assert_true(scalar_out == SENTINEL);
    return 1;
}

/* The return value and counter agree with the per-row statuses. */
static void check_summary(int ret, size_t failed, const int *status, size_t n,
                          size_t expected_failed)
{
    size_t i;
    int first = NTR_OK;
    for (i = 0; i < n; i++) {
        if (status[i] != NTR_OK) {
            first = status[i];
            break;
        }
    }
    assert_int_equal(ret, first);
    assert_int_equal(failed, expected_failed);
}

static double a1[ROWS], a2[ROWS], a3[ROWS], a4[ROWS], a5[ROWS];
static int sexes[ROWS];
static double out[ROWS];
static int status[ROWS];

/* ---- published values through the batch API -------------------------- */

static void published_values(void **state)
{
    size_t failed = 99;
    (void)state;

    /* Source: Dorwart & Chalmers, Clin Chem 1975 (their regression
     * 1.86*Na + glucose + urea + 9) and the conventional 2*Na formula:
     * Na 140, glucose 5, urea 5 mmol/L -> 290 and 279.4 mOsm/kg. */
    {
        double na[2] = {140.0, 140.0}, glu[2] = {5.0, 5.0}, urea[2] = {5.0, 5.0},
               eth[2] = {0.0, 0.0}, o[2];
        int s[2];
        assert_int_equal(ntr_batch_osm_calculated(2, na, glu, urea, eth, NTR_OSM_2NA,
                                                  o, s, &failed), NTR_OK);
        assert_int_equal(failed, 0);
        assert_close(o[0], 290.0, 1e-12);
        assert_int_equal(ntr_batch_osm_calculated(2, na, glu, urea, eth,
                                                  NTR_OSM_DORWART_CHALMERS, o, s,
                                                  NULL), NTR_OK);
        assert_close(o[1], 279.4, 1e-9);
    }

    /* Source: Katz, N Engl J Med 1973 (1.6 per 100 mg/dL) and Hillier et al.,
     * Am J Med 1999 (2.4): Na 125 with glucose 600 mg/dL (33.305 mmol/L,
     * 600/18.0156) corrects to 125 + 5*1.6 = 133 and 125 + 5*2.4 = 137. */
    {
        double na[1] = {125.0}, glu[1] = {600.0 / 18.0156}, o[1];
        int s[1];
        assert_int_equal(ntr_batch_na_corrected_glucose(1, na, glu, NTR_GLUCOSE_KATZ,
                                                        o, s, NULL), NTR_OK);
        assert_close(o[0], 133.0, 1e-9);
        assert_int_equal(ntr_batch_na_corrected_glucose(1, na, glu,
                                                        NTR_GLUCOSE_HILLIER, o, s,
                                                        NULL), NTR_OK);
        assert_close(o[0], 137.0, 1e-9);
    }

    /* Source: Adrogue & Madias, N Engl J Med 2000;342:1493-9 (hypernatremia),
     * worked example from memory: man of 78 years, 68 kg, Na 165; TBW
     * 0.5*68 = 34 L; 1 L of 5% dextrose changes Na by (0 - 165)/(34 + 1)
     * = -4.7 mmol/L. */
    {
        int sex[1] = {NTR_SEX_MALE};
        double age[1] = {78.0}, weight[1] = {68.0}, tbw[1], na[1] = {165.0},
               inf_na[1] = {0.0}, inf_k[1] = {0.0}, o[1];
        int s[1];
        assert_int_equal(ntr_batch_tbw_fraction(1, sex, age, weight, tbw, s, NULL),
                         NTR_OK);
        assert_close(tbw[0], 34.0, 1e-12);
        assert_int_equal(ntr_batch_infusate_change_per_litre(1, na, tbw, inf_na,
                                                             inf_k, o, s, NULL),
                         NTR_OK);
        assert_close(o[0], -4.714285714285714, 1e-12);
        assert_close(o[0], -4.7, 0.05);
    }

    /* Source: Watson, Watson & Batt, Am J Clin Nutr 1980 (men's equation):
     * 40 years, 180 cm, 80 kg -> 2.447 - 3.8064 + 19.332 + 26.896
     * = 44.8686 L; women's equation, 170 cm, 60 kg -> -2.097 + 18.173
     * + 14.796 = 30.872 L. */
    {
        int sex[2] = {NTR_SEX_MALE, NTR_SEX_FEMALE};
        double age[2] = {40.0, 40.0}, height[2] = {180.0, 170.0},
               weight[2] = {80.0, 60.0}, o[2];
        int s[2];
        assert_int_equal(ntr_batch_tbw_watson(2, sex, age, height, weight, o, s,
                                              NULL), NTR_OK);
        assert_close(o[0], 44.8686, 1e-9);
        assert_close(o[1], 30.872, 1e-9);
    }

    /* Source: Furst et al., Am J Med Sci 2000 (ratio (U_Na + U_K)/S_Na and
     * its table); EFWC from Rose & Post, 5th ed.: urine 2 L with Na 60,
     * K 20, serum Na 120 -> ratio 0.667 (restrict to under 1 L/day) and
     * EFWC = 2*(1 - 80/120) = 0.667 L. */
    {
        double v[1] = {2.0}, una[1] = {60.0}, uk[1] = {20.0}, sna[1] = {120.0},
               o[1];
        int s[1], advice[1];
        assert_int_equal(ntr_batch_furst_ratio(1, una, uk, sna, o, s, NULL), NTR_OK);
        assert_close(o[0], 2.0 / 3.0, 1e-15);
        assert_int_equal(ntr_batch_restriction_from_ratio(1, o, advice, s, NULL),
                         NTR_OK);
        assert_int_equal(advice[0], NTR_RESTRICT_1000ML);
        assert_int_equal(ntr_batch_efwc(1, v, una, uk, sna, o, s, NULL), NTR_OK);
        assert_close(o[0], 2.0 / 3.0, 1e-15);
    }

    /* Source: the textbook water-deficit formula (common practice): TBW
     * 40 L at Na 154 -> 40*(154/140 - 1) = 4 L. Sodium deficit (common
     * practice): TBW 30 L from 120 to 126 -> 180 mmol. */
    {
        double tbw[1] = {40.0}, na[1] = {154.0}, o[1];
        double tbw2[1] = {30.0}, na2[1] = {120.0}, target[1] = {126.0};
        int s[1];
        assert_int_equal(ntr_batch_free_water_deficit(1, tbw, na, o, s, NULL),
                         NTR_OK);
        assert_close(o[0], 4.0, 1e-12);
        assert_int_equal(ntr_batch_na_deficit(1, tbw2, na2, target, o, s, NULL),
                         NTR_OK);
        assert_close(o[0], 180.0, 1e-12);
    }

    /* Source: Adrogue & Madias 2000 mass balance: 3% saline (513) into
     * TBW 30 L at Na 108; a 4 mmol/L rise needs 4*30/(513 - 108 - 4)
     * = 0.29925 L, and that volume gives back exactly +4. */
    {
        double na[1] = {108.0}, tbw[1] = {30.0}, inf_na[1] = {513.0},
               inf_k[1] = {0.0}, delta[1] = {4.0}, vol[1], o[1];
        int s[1];
        assert_int_equal(ntr_batch_infusate_volume_for_change(1, na, tbw, inf_na,
                                                              inf_k, delta, vol, s,
                                                              NULL), NTR_OK);
        assert_close(vol[0], 120.0 / 401.0, 1e-15);
        assert_int_equal(ntr_batch_infusate_change(1, na, tbw, inf_na, inf_k, vol,
                                                   o, s, NULL), NTR_OK);
        assert_close(o[0], 4.0, 1e-12);
    }
}

/* ---- contract --------------------------------------------------------- */

static void prefill(void)
{
    size_t i;
    for (i = 0; i < ROWS; i++) {
        out[i] = SENTINEL;
        status[i] = -1;
    }
}

static void untouched(size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        assert_true(out[i] == SENTINEL);
        assert_int_equal(status[i], -1);
    }
}

static void null_and_bad_enumerators_write_nothing(void **state)
{
    double x[2] = {140.0, 140.0}, y[2] = {5.0, 5.0};
    int sx[2] = {NTR_SEX_MALE, NTR_SEX_FEMALE};
    int advice[2] = {-1, -1};
    size_t failed = 12345;
    (void)state;

    prefill();
    assert_int_equal(ntr_batch_osm_calculated(2, NULL, y, y, y, NTR_OSM_2NA, out,
                                              status, &failed), NTR_ERR_NULL);
    assert_int_equal(ntr_batch_osm_calculated(2, x, y, y, y, NTR_OSM_2NA, NULL,
                                              status, &failed), NTR_ERR_NULL);
    assert_int_equal(ntr_batch_osm_calculated(2, x, y, y, y, NTR_OSM_2NA, out,
                                              NULL, &failed), NTR_ERR_NULL);
    /* NULL is checked even with no rows; NULL beats a bad enumerator. */
    assert_int_equal(ntr_batch_osm_calculated(0, x, y, NULL, y, 99, out, status,
                                              &failed), NTR_ERR_NULL);
    assert_int_equal(ntr_batch_osm_calculated(2, x, y, y, y, 0, out, status,
                                              &failed), NTR_ERR_ARG);
    assert_int_equal(ntr_batch_osm_calculated(2, x, y, y, y, 3, out, status,
                                              &failed), NTR_ERR_ARG);
    assert_int_equal(ntr_batch_osm_effective(2, x, NULL, out, status, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_osm_gap(2, NULL, x, out, status, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_na_corrected_glucose(2, x, y, 0, out, status,
                                                    &failed), NTR_ERR_ARG);
    assert_int_equal(ntr_batch_na_corrected_glucose(2, x, y, 3, out, status,
                                                    &failed), NTR_ERR_ARG);
    assert_int_equal(ntr_batch_na_corrected_glucose(2, x, NULL, NTR_GLUCOSE_KATZ,
                                                    out, status, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_tbw_fraction(2, NULL, x, x, out, status, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_tbw_watson(2, sx, x, x, NULL, out, status, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_free_water_deficit(2, x, x, out, NULL, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_na_deficit(2, x, x, NULL, out, status, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_infusate_change_per_litre(2, x, x, x, NULL, out,
                                                         status, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_infusate_change(2, x, x, x, x, NULL, out, status,
                                               &failed), NTR_ERR_NULL);
    assert_int_equal(ntr_batch_infusate_volume_for_change(2, x, x, x, x, NULL,
                                                          out, status, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_furst_ratio(2, x, x, NULL, out, status, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_restriction_from_ratio(2, x, NULL, status, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_restriction_from_ratio(2, x, advice, NULL, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_efwc(2, NULL, x, x, x, out, status, &failed),
                     NTR_ERR_NULL);
    untouched(2);
    assert_int_equal(advice[0], -1);
    assert_int_equal(failed, 12345);
}

static void empty_batch_is_ok(void **state)
{
    double x[1] = {140.0};
    size_t failed = 12345;
    (void)state;
    prefill();
    assert_int_equal(ntr_batch_osm_effective(0, x, x, out, status, &failed), NTR_OK);
    assert_int_equal(failed, 0);
    untouched(1);
}

static void failed_rows_get_nan_and_status(void **state)
{
    /* Rows: ok, NaN sodium, sodium out of range, glucose +inf, ok,
     * sodium 79 with NaN glucose (sodium is checked first: RANGE). */
    double na[6] = {140.0, (double)NAN, 230.0, 130.0, 120.0, 79.0};
    double glu[6] = {5.0, 5.0, 5.0, HUGE_VAL, 10.0, (double)NAN};
    int expected[6] = {NTR_OK, NTR_ERR_NONFINITE, NTR_ERR_RANGE,
                       NTR_ERR_NONFINITE, NTR_OK, NTR_ERR_RANGE};
    size_t failed = 0;
    size_t i;
    (void)state;
    prefill();
    assert_int_equal(ntr_batch_osm_effective(6, na, glu, out, status, &failed),
                     NTR_ERR_NONFINITE);
    assert_int_equal(failed, 4);
    for (i = 0; i < 6; i++) {
        assert_int_equal(status[i], expected[i]);
        assert_true(expected[i] == NTR_OK ? !isnan(out[i]) : isnan(out[i]));
    }
    assert_close(out[0], 285.0, 0.0);
    assert_close(out[4], 250.0, 0.0);
    for (i = 6; i < ROWS; i++) { /* nothing beyond the n rows is written */
        assert_true(out[i] == SENTINEL);
    }

    /* The return value is the status of the lowest failing row, not the
     * most severe: here a DOMAIN row comes before a NONFINITE row. */
    {
        double tbw[3] = {40.0, 40.0, 40.0}, na2[3] = {150.0, 130.0, (double)NAN};
        assert_int_equal(ntr_batch_free_water_deficit(3, tbw, na2, out, status,
                                                      NULL), NTR_ERR_DOMAIN);
        assert_int_equal(status[2], NTR_ERR_NONFINITE);
    }

    /* Integer outputs of failed rows are 0. */
    {
        double r[4] = {0.5, -0.1, 0.95, (double)NAN};
        int advice[4] = {-1, -1, -1, -1};
        assert_int_equal(ntr_batch_restriction_from_ratio(4, r, advice, status,
                                                          &failed), NTR_ERR_RANGE);
        assert_int_equal(failed, 2);
        assert_int_equal(advice[0], NTR_RESTRICT_1000ML);
        assert_int_equal(advice[1], 0);
        assert_int_equal(advice[2], NTR_RESTRICT_500_700ML);
        assert_int_equal(advice[3], 0);
    }
}

static void in_place_output(void **state)
{
    double tbw[3] = {40.0, 30.0, 20.0};
    double na[3] = {154.0, 168.0, 100.0};
    double expected[3];
    int s[3];
    (void)state;
    assert_int_equal(ntr_batch_free_water_deficit(3, tbw, na, expected, s, NULL),
                     NTR_ERR_DOMAIN);
    /* Writing over the sodium column gives the same values. */
    assert_int_equal(ntr_batch_free_water_deficit(3, tbw, na, na, s, NULL),
                     NTR_ERR_DOMAIN);
    assert_true(same_double(na[0], expected[0]));
    assert_true(same_double(na[1], expected[1]));
    assert_true(isnan(na[2]));
}

/* ---- property: every row equals the scalar function ----------------- */

static void osmolality_rows_equal_scalar(void **state)
{
    size_t i, failed, bad;
    int ret, f;
    (void)state;
    for (f = NTR_OSM_2NA; f <= NTR_OSM_DORWART_CHALMERS; f++) {
        fill(a1, ROWS, 80.0, 220.0);
        fill(a2, ROWS, 0.0, 200.0);
        fill(a3, ROWS, 0.0, 200.0);
        fill(a4, ROWS, 0.0, 400.0);
        ret = ntr_batch_osm_calculated(ROWS, a1, a2, a3, a4, f, out, status, &failed);
        bad = 0;
        for (i = 0; i < ROWS; i++) {
            double s = SENTINEL;
            int st = ntr_osm_calculated(a1[i], a2[i], a3[i], a4[i], f, &s);
            bad += check_row(i, st, s, status[i], out[i]);
        }
        assert_true(bad > 0 && bad < ROWS);
        check_summary(ret, failed, status, ROWS, bad);
    }

    ret = ntr_batch_osm_effective(ROWS, a1, a2, out, status, &failed);
    bad = 0;
    for (i = 0; i < ROWS; i++) {
        double s = SENTINEL;
        int st = ntr_osm_effective(a1[i], a2[i], &s);
        bad += check_row(i, st, s, status[i], out[i]);
    }
    check_summary(ret, failed, status, ROWS, bad);

    fill(a1, ROWS, 150.0, 600.0);
    fill(a2, ROWS, 150.0, 600.0);
    ret = ntr_batch_osm_gap(ROWS, a1, a2, out, status, &failed);
    bad = 0;
    for (i = 0; i < ROWS; i++) {
        double s = SENTINEL;
        int st = ntr_osm_gap(a1[i], a2[i], &s);
        bad += check_row(i, st, s, status[i], out[i]);
    }
    check_summary(ret, failed, status, ROWS, bad);
}

static void sodium_rows_equal_scalar(void **state)
{
    size_t i, failed, bad;
    int ret, m;
    (void)state;
    for (m = NTR_GLUCOSE_KATZ; m <= NTR_GLUCOSE_HILLIER; m++) {
        fill(a1, ROWS, 80.0, 220.0);
        /* Half the glucose values below the 100 mg/dL reference. */
        fill(a2, ROWS / 2, 0.0, 5.55);
        fill(a2 + ROWS / 2, ROWS / 2, 0.0, 200.0);
        ret = ntr_batch_na_corrected_glucose(ROWS, a1, a2, m, out, status, &failed);
        bad = 0;
        for (i = 0; i < ROWS; i++) {
            double s = SENTINEL;
            int st = ntr_na_corrected_glucose(a1[i], a2[i], m, &s);
            bad += check_row(i, st, s, status[i], out[i]);
        }
        check_summary(ret, failed, status, ROWS, bad);
    }

    fill(a1, ROWS, 0.1, 400.0);
    fill(a2, ROWS, 80.0, 220.0);
    fill(a3, ROWS, 80.0, 220.0);
    ret = ntr_batch_na_deficit(ROWS, a1, a2, a3, out, status, &failed);
    bad = 0;
    for (i = 0; i < ROWS; i++) {
        double s = SENTINEL;
        int st = ntr_na_deficit(a1[i], a2[i], a3[i], &s);
        bad += check_row(i, st, s, status[i], out[i]);
    }
    check_summary(ret, failed, status, ROWS, bad);
}

static void water_rows_equal_scalar(void **state)
{
    size_t i, failed, bad;
    int ret;
    (void)state;
    for (i = 0; i < ROWS; i++) {
        sexes[i] = draw_sex();
    }
    fill(a1, ROWS, 0.0, 130.0);
    fill(a2, ROWS, 0.3, 650.0);
    ret = ntr_batch_tbw_fraction(ROWS, sexes, a1, a2, out, status, &failed);
    bad = 0;
    for (i = 0; i < ROWS; i++) {
        double s = SENTINEL;
        int st = ntr_tbw_fraction(sexes[i], a1[i], a2[i], &s);
        bad += check_row(i, st, s, status[i], out[i]);
    }
    check_summary(ret, failed, status, ROWS, bad);

    /* Small heights and weights make some women's Watson volumes <= 0
     * (DOMAIN). */
    fill(a1, ROWS, 18.0, 130.0);
    fill(a2, ROWS, 30.0, 275.0);
    fill(a3, ROWS / 2, 0.3, 20.0);
    fill(a3 + ROWS / 2, ROWS / 2, 0.3, 650.0);
    ret = ntr_batch_tbw_watson(ROWS, sexes, a1, a2, a3, out, status, &failed);
    bad = 0;
    {
        size_t domain = 0;
        for (i = 0; i < ROWS; i++) {
            double s = SENTINEL;
            int st = ntr_tbw_watson(sexes[i], a1[i], a2[i], a3[i], &s);
            bad += check_row(i, st, s, status[i], out[i]);
            domain += (st == NTR_ERR_DOMAIN);
        }
        assert_true(domain > 0);
    }
    check_summary(ret, failed, status, ROWS, bad);

    fill(a1, ROWS, 0.1, 400.0);
    fill(a2, ROWS, 80.0, 220.0);
    ret = ntr_batch_free_water_deficit(ROWS, a1, a2, out, status, &failed);
    bad = 0;
    for (i = 0; i < ROWS; i++) {
        double s = SENTINEL;
        int st = ntr_free_water_deficit(a1[i], a2[i], &s);
        bad += check_row(i, st, s, status[i], out[i]);
    }
    check_summary(ret, failed, status, ROWS, bad);
}

static void infusion_rows_equal_scalar(void **state)
{
    size_t i, failed, bad, domain = 0, zero = 0;
    int ret;
    (void)state;
    fill(a1, ROWS, 80.0, 220.0);
    fill(a2, ROWS, 0.1, 400.0);
    fill(a3, ROWS, 0.0, 1100.0);
    fill(a4, ROWS, 0.0, 400.0);
    fill(a5, ROWS, 0.0, 20.0);

    ret = ntr_batch_infusate_change_per_litre(ROWS, a1, a2, a3, a4, out, status,
                                              &failed);
    bad = 0;
    for (i = 0; i < ROWS; i++) {
        double s = SENTINEL;
        int st = ntr_infusate_change_per_litre(a1[i], a2[i], a3[i], a4[i], &s);
        bad += check_row(i, st, s, status[i], out[i]);
    }
    check_summary(ret, failed, status, ROWS, bad);

    ret = ntr_batch_infusate_change(ROWS, a1, a2, a3, a4, a5, out, status, &failed);
    bad = 0;
    for (i = 0; i < ROWS; i++) {
        double s = SENTINEL;
        int st = ntr_infusate_change(a1[i], a2[i], a3[i], a4[i], a5[i], &s);
        bad += check_row(i, st, s, status[i], out[i]);
    }
    check_summary(ret, failed, status, ROWS, bad);

    /* Wanted changes of both signs, some exactly 0, many unreachable. */
    fill(a5, ROWS, -50.0, 50.0);
    for (i = 0; i < ROWS; i += 97) {
        a5[i] = 0.0;
    }
    ret = ntr_batch_infusate_volume_for_change(ROWS, a1, a2, a3, a4, a5, out,
                                               status, &failed);
    bad = 0;
    for (i = 0; i < ROWS; i++) {
        double s = SENTINEL;
        int st = ntr_infusate_volume_for_change(a1[i], a2[i], a3[i], a4[i], a5[i],
                                                &s);
        bad += check_row(i, st, s, status[i], out[i]);
        domain += (st == NTR_ERR_DOMAIN);
        zero += (st == NTR_OK && s == 0.0);
    }
    assert_true(domain > 0);
    assert_true(zero > 0);
    check_summary(ret, failed, status, ROWS, bad);
}

/* A wanted change of exactly 0 needs no infusate: +0.0 L with NTR_OK, as
 * ntr_infusate_volume_for_change() says, whatever the infusate. Rows in
 * valid pairs (so the two-row path sees them) whose formula
 * delta*TBW/headroom would give -0.0 (infusate below the sodium) or NaN
 * (infusate equal to it) if the zero case were not handled. Source: the
 * header's definition (no volume changes nothing), common practice. */
static void infusion_zero_change_in_pairs(void **state)
{
    const double na[6] = {140.0, 140.0, 140.0, 140.0, 120.0, 120.0};
    const double tbw[6] = {40.0, 40.0, 40.0, 40.0, 30.0, 30.0};
    const double inf_na[6] = {0.0, 0.0, 140.0, 140.0, 513.0, 0.0};
    const double inf_k[6] = {0.0, 0.0, 0.0, 0.0, 0.0, 0.0};
    const double delta[6] = {0.0, -0.0, 0.0, -0.0, 0.0, -0.0};
    const double plus_zero = 0.0;
    double vol[6];
    int st[6];
    size_t i, failed = 99;
    (void)state;
    assert_int_equal(ntr_batch_infusate_volume_for_change(6, na, tbw, inf_na,
                                                          inf_k, delta, vol,
                                                          st, &failed),
                     NTR_OK);
    assert_int_equal(failed, 0);
    for (i = 0; i < 6; i++) {
        assert_int_equal(st[i], NTR_OK);
        assert_memory_equal(&vol[i], &plus_zero, sizeof plus_zero);
    }
}

/* The two-row Watson kernel takes the model's body-water range as implied
 * by the share-of-weight check for weights from 0.5 to 500 kg (0.20 * 0.5
 * kg is 0.1 L, the lowest body water the model accepts; lib/water_kernels.h).
 * A 30 cm man of 0.5 kg (or 0.4 kg, outside those weights) aged about 60
 * years has a Watson body water crossing 0.1 L (5.8371 - 0.09516 * age at
 * 0.5 kg; at 0.4 kg it also crosses the 0.08 L share of weight): ages swept
 * across them in pairs of rows, every row equal to the scalar function,
 * both statuses present. Source: the scalar function (the definition), Watson et al.
 * 1980 men's equation. */
static void watson_rows_near_lowest_water(void **state)
{
    size_t i, failed, bad = 0, ok = 0, domain = 0;
    int ret;
    (void)state;
    for (i = 0; i < 512; i++) {
        sexes[i] = NTR_SEX_MALE;
        a1[i] = 59.5 + 1.5 * (double)(i / 2) / 256.0;
        a2[i] = 30.0;
        a3[i] = (i % 4 < 2) ? 0.5 : 0.4;
    }
    ret = ntr_batch_tbw_watson(512, sexes, a1, a2, a3, out, status, &failed);
    for (i = 0; i < 512; i++) {
        double s = SENTINEL;
        int st = ntr_tbw_watson(sexes[i], a1[i], a2[i], a3[i], &s);
        bad += check_row(i, st, s, status[i], out[i]);
        ok += (st == NTR_OK);
        domain += (st == NTR_ERR_DOMAIN);
    }
    check_summary(ret, failed, status, 512, bad);
    assert_true(ok > 0);
    assert_true(domain > 0);
    assert_int_equal(ok + domain, 512);
}

/* One scenario of infusion_volume_near_model_edges: n rows of the same
 * sodium, water and infusate, wanted changes from first upwards in steps of
 * one unit in the last place, every row equal to the scalar function.
 * across_edge: the scalar function must accept some rows and refuse others
 * with NTR_ERR_DOMAIN; else it must accept them all. */
static void volume_edge_rows(double na, double tbw, double inf_na,
                             double first_delta, size_t n, int across_edge)
{
    size_t i, failed, bad = 0, ok = 0, domain = 0;
    int ret;
    double d = first_delta;
    for (i = 0; i < n; i++) {
        a1[i] = na;
        a2[i] = tbw;
        a3[i] = inf_na;
        a4[i] = 0.0;
        a5[i] = d;
        d = nextafter(d, 1e9);
    }
    ret = ntr_batch_infusate_volume_for_change(n, a1, a2, a3, a4, a5, out,
                                               status, &failed);
    for (i = 0; i < n; i++) {
        double s = SENTINEL;
        int st = ntr_infusate_volume_for_change(a1[i], a2[i], a3[i], a4[i],
                                                a5[i], &s);
        bad += check_row(i, st, s, status[i], out[i]);
        ok += (st == NTR_OK);
        domain += (st == NTR_ERR_DOMAIN);
    }
    check_summary(ret, failed, status, n, bad);
    if (across_edge) {
        assert_true(ok > 0);
        assert_true(domain > 0);
        assert_int_equal(ok + domain, n);
    } else {
        assert_int_equal(ok, n);
    }
}

/* The two-row volume kernel accepts the mass balance of its volume by a
 * sufficient test (the target at least NTR_VOLUME_SURE_MARGIN = 1e-9
 * mmol/L inside 80..220 mmol/L, lib/infusion_kernels.h) instead of
 * computing it. Targets swept across the range edges themselves and across
 * that margin, and volumes whose water after crosses 400 L, in pairs of
 * rows: each row's status and value must be the scalar function's.
 * Source: the scalar function (the definition), the model range of
 * docs/ranges.md. */
static void infusion_volume_near_model_edges(void **state)
{
    (void)state;
    /* rise towards 220 mmol/L: target 200 + delta, delta near 20 */
    volume_edge_rows(200.0, 40.0, 1000.0, 20.0 - 32 * 3.6e-15, 64, 1);
    volume_edge_rows(200.0, 40.0, 1000.0, 20.0 - 1e-9 - 32 * 3.6e-15, 64, 0);
    /* fall towards 80 mmol/L: target 100 + delta, delta near -20 */
    volume_edge_rows(100.0, 40.0, 0.0, -20.0 - 32 * 3.6e-15, 64, 1);
    volume_edge_rows(100.0, 40.0, 0.0, -20.0 + 1e-9 - 32 * 3.6e-15, 64, 0);
    /* water after near 400 L: 395 L + V, V = x*395/(140 - x) = 5 L at
     * x = 1.75 */
    volume_edge_rows(140.0, 395.0, 0.0, -1.75 - 100 * 2.22e-16, 200, 1);
}

static void urine_rows_equal_scalar(void **state)
{
    size_t i, failed, bad;
    int ret;
    int advice[ROWS];
    (void)state;
    fill(a1, ROWS, 0.0, 30.0);
    fill(a2, ROWS, 0.0, 500.0);
    fill(a3, ROWS, 0.0, 300.0);
    fill(a4, ROWS, 80.0, 220.0);

    ret = ntr_batch_furst_ratio(ROWS, a2, a3, a4, out, status, &failed);
    bad = 0;
    for (i = 0; i < ROWS; i++) {
        double s = SENTINEL;
        int st = ntr_furst_ratio(a2[i], a3[i], a4[i], &s);
        bad += check_row(i, st, s, status[i], out[i]);
    }
    check_summary(ret, failed, status, ROWS, bad);

    ret = ntr_batch_efwc(ROWS, a1, a2, a3, a4, out, status, &failed);
    bad = 0;
    for (i = 0; i < ROWS; i++) {
        double s = SENTINEL;
        int st = ntr_efwc(a1[i], a2[i], a3[i], a4[i], &s);
        bad += check_row(i, st, s, status[i], out[i]);
    }
    check_summary(ret, failed, status, ROWS, bad);

    /* Ratios around the 0.9 and 1.0 band edges, plus the edges exactly. */
    fill(a1, ROWS, 0.0, 2.0);
    a1[0] = 0.9;
    a1[1] = 1.0;
    a1[2] = nextafter(0.9, 0.0);
    a1[3] = nextafter(1.0, 2.0);
    ret = ntr_batch_restriction_from_ratio(ROWS, a1, advice, status, &failed);
    bad = 0;
    for (i = 0; i < ROWS; i++) {
        int s = NTR_RESTRICT_500ML + 100;
        int st = ntr_restriction_from_ratio(a1[i], &s);
        assert_int_equal(st, status[i]);
        if (st == NTR_OK) {
            assert_int_equal(s, advice[i]);
        } else {
            assert_int_equal(advice[i], 0);
            bad++;
        }
    }
    assert_int_equal(advice[0], NTR_RESTRICT_500_700ML);
    assert_int_equal(advice[1], NTR_RESTRICT_500_700ML);
    assert_int_equal(advice[2], NTR_RESTRICT_1000ML);
    assert_int_equal(advice[3], NTR_RESTRICT_500ML);
    check_summary(ret, failed, status, ROWS, bad);
}

/* ---- correction assessment of many series ----------------------------- */

/* Same bits in every member (NaN equal to NaN). */
static int same_correction(const ntr_correction *a, const ntr_correction *b)
{
    return same_double(a->rise_first_24h, b->rise_first_24h) &&
           same_double(a->max_rise_24h, b->max_rise_24h) &&
           same_double(a->max_rise_48h, b->max_rise_48h) &&
           same_double(a->last_rate_per_h, b->last_rate_per_h) &&
           same_double(a->excess_mmol_l, b->excess_mmol_l) &&
           a->flags == b->flags && a->reserved == b->reserved;
}

static void correction_groups_published(void **state)
{
    /* Limits 10 / 18 / 4 mmol/L: Verbalis et al., Am J Med 2013; Spasovski
     * et al., Eur J Endocrinol 2014. Invented series, worked by hand:
     * group 0: 110, 116, 122, 124 at 0, 6, 12, 24 h: largest 24 h rise
     *   124 - 110 = 14 > 10, excess 4, last rate 2/12 per hour;
     * group 1: 118, 120, 121, 121 at 0, 12, 24, 30 h: first-24 h rise 3,
     *   below the 4 wanted: below target;
     * group 2: empty (NTR_ERR_ARG); group 3: one sample, all zero. */
    const ntr_sample s[9] = {{0, 110}, {6, 116}, {12, 122}, {24, 124},
                             {0, 118}, {12, 120}, {24, 121}, {30, 121},
                             {5, 130}};
    const size_t offsets[5] = {0, 4, 8, 8, 9};
    ntr_limits lim;
    ntr_correction c[4];
    int st[4];
    size_t failed = 0;
    (void)state;
    assert_int_equal(ntr_limits_preset(NTR_LIMITS_STANDARD, &lim), NTR_OK);
    assert_int_equal(ntr_batch_correction_assess(4, offsets, s, 9, &lim, c, st,
                                                 &failed), NTR_ERR_ARG);
    assert_int_equal(failed, 1);
    assert_int_equal(st[0], NTR_OK);
    assert_close(c[0].max_rise_24h, 14.0, 1e-12);
    assert_close(c[0].excess_mmol_l, 4.0, 1e-12);
    assert_close(c[0].last_rate_per_h, 2.0 / 12.0, 1e-15);
    assert_int_equal(c[0].flags, NTR_CF_OVER_24H);
    assert_int_equal(st[1], NTR_OK);
    assert_close(c[1].rise_first_24h, 3.0, 1e-12);
    assert_int_equal(c[1].flags, NTR_CF_BELOW_TARGET);
    assert_int_equal(st[2], NTR_ERR_ARG);
    assert_true(isnan(c[2].max_rise_24h) && isnan(c[2].excess_mmol_l));
    assert_int_equal(c[2].flags, 0);
    assert_int_equal(st[3], NTR_OK);
    assert_close(c[3].max_rise_48h, 0.0, 0.0);
    assert_int_equal(c[3].flags, 0);

    /* Offsets need not start at 0: groups 1 and 3 alone. */
    {
        const size_t tail[3] = {4, 8, 8};
        ntr_correction c2[2];
        int st2[2];
        assert_int_equal(ntr_batch_correction_assess(2, tail, s, 9, &lim, c2, st2,
                                                     NULL), NTR_ERR_ARG);
        assert_true(same_correction(&c2[0], &c[1]));
    }
}

static void correction_groups_contract(void **state)
{
    const ntr_sample s[3] = {{0, 120}, {6, 124}, {12, 126}};
    const size_t decreasing[3] = {0, 2, 1};
    const size_t decreasing_first[3] = {2, 1, 3};
    const size_t beyond[3] = {0, 2, 4};
    const size_t fine[3] = {0, 2, 3};
    ntr_limits lim;
    ntr_correction c[2];
    int st[2] = {-1, -1};
    size_t failed = 77;
    (void)state;
    assert_int_equal(ntr_limits_preset(NTR_LIMITS_STANDARD, &lim), NTR_OK);
    c[0].flags = 99u;
    c[1].flags = 99u;
    assert_int_equal(ntr_batch_correction_assess(2, NULL, s, 3, &lim, c, st, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_correction_assess(2, fine, NULL, 3, &lim, c, st, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_correction_assess(2, fine, s, 3, NULL, c, st, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_correction_assess(0, fine, s, 3, &lim, NULL, st, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_correction_assess(2, fine, s, 3, &lim, c, NULL, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_correction_assess(2, decreasing, s, 3, &lim, c, st,
                                                 &failed), NTR_ERR_ARG);
    /* A decrease between the first two offsets too (offsets[0] need not
     * be 0): group 0 would run from 2 back to 1. */
    assert_int_equal(ntr_batch_correction_assess(2, decreasing_first, s, 3, &lim, c, st,
                                                 &failed), NTR_ERR_ARG);
    assert_int_equal(ntr_batch_correction_assess(2, beyond, s, 3, &lim, c, st,
                                                 &failed), NTR_ERR_ARG);
    assert_int_equal(c[0].flags, 99u);
    assert_int_equal(c[1].flags, 99u);
    assert_int_equal(st[0], -1);
    assert_int_equal(failed, 77);
    /* No groups: fine, nothing written but the counter. */
    assert_int_equal(ntr_batch_correction_assess(0, fine, s, 0, &lim, c, st,
                                                 &failed), NTR_OK);
    assert_int_equal(failed, 0);
    assert_int_equal(st[0], -1);
    /* Bad limits fail every group, as they fail every scalar call. */
    lim.max_rise_24h = (double)NAN;
    assert_int_equal(ntr_batch_correction_assess(2, fine, s, 3, &lim, c, st,
                                                 &failed), NTR_ERR_NONFINITE);
    assert_int_equal(failed, 2);
}

#define SERIES_SAMPLES 6000
#define SERIES_GROUPS 1200

static ntr_sample series[SERIES_SAMPLES];
static size_t series_offsets[SERIES_GROUPS + 1];
static ntr_correction series_out[SERIES_GROUPS];
static int series_status[SERIES_GROUPS];

static void correction_groups_equal_scalar(void **state)
{
    size_t g, i = 0, failed, bad = 0, flagged = 0;
    int ret;
    ntr_limits lim;
    (void)state;
    assert_int_equal(ntr_limits_preset(NTR_LIMITS_HIGH_RISK, &lim), NTR_OK);
    /* Random series of 0 to 9 samples, mostly rising from a low sodium,
     * with occasional bad values and out-of-order times. */
    for (g = 0; g < SERIES_GROUPS; g++) {
        size_t k, len = (size_t)(uniform01() * 10.0);
        double t = -24.0 + 48.0 * uniform01();
        double na = 105.0 + 20.0 * uniform01();
        series_offsets[g] = i;
        for (k = 0; k < len && i < SERIES_SAMPLES; k++, i++) {
            double u = uniform01();
            t += u < 0.02 ? -1.0 : 24.0 * uniform01();
            na += -2.0 + 8.0 * uniform01();
            series[i].hours = t;
            series[i].na_mmol_l = u > 0.99 ? (double)NAN : u > 0.98 ? 300.0 : na;
        }
    }
    series_offsets[SERIES_GROUPS] = i;
    ret = ntr_batch_correction_assess(SERIES_GROUPS, series_offsets, series, i, &lim,
                                      series_out, series_status, &failed);
    for (g = 0; g < SERIES_GROUPS; g++) {
        ntr_correction expected;
        size_t n = series_offsets[g + 1] - series_offsets[g];
        int st = ntr_correction_assess(series + series_offsets[g], n, &lim, &expected);
        assert_int_equal(st, series_status[g]);
        if (st == NTR_OK) {
            assert_true(same_correction(&expected, &series_out[g]));
            flagged += series_out[g].flags != 0u;
        } else {
            assert_true(isnan(series_out[g].max_rise_24h));
            assert_int_equal(series_out[g].flags, 0u);
            bad++;
        }
    }
    assert_true(bad > 0 && bad < SERIES_GROUPS);
    assert_true(flagged > 0);
    check_summary(ret, failed, series_status, SERIES_GROUPS, bad);
}

/* ---- course assessment of many series (both directions) -------------- */

static ntr_course_limits course_preset(int preset)
{
    ntr_course_limits lim;
    memset(&lim, 0, sizeof lim);
    assert_int_equal(ntr_course_limits_preset(preset, &lim), NTR_OK);
    return lim;
}

/* Same bits in every member (NaN equal to NaN). */
static int same_report(const ntr_course_report *a, const ntr_course_report *b)
{
    return a->struct_size == b->struct_size &&
           same_double(a->max_rise_24h, b->max_rise_24h) &&
           same_double(a->max_rise_48h, b->max_rise_48h) &&
           same_double(a->max_fall_24h, b->max_fall_24h) &&
           same_double(a->max_fall_48h, b->max_fall_48h) &&
           same_double(a->excess_mmol_l, b->excess_mmol_l) &&
           a->flags == b->flags && a->reserved == b->reserved &&
           same_double(a->rise_first_24h, b->rise_first_24h) &&
           same_double(a->fall_first_24h, b->fall_first_24h) &&
           same_double(a->rise_now_24h, b->rise_now_24h) &&
           same_double(a->fall_now_24h, b->fall_now_24h) &&
           same_double(a->last_rate_per_h, b->last_rate_per_h) &&
           same_double(a->elapsed_h, b->elapsed_h) &&
           same_double(a->worst_at_h, b->worst_at_h);
}

/* A failed group: every double NaN, no flag, the 1.1 size. */
static int failed_report_values(const ntr_course_report *r)
{
    return r->struct_size == sizeof(ntr_course_report) && isnan(r->max_rise_24h) &&
           isnan(r->max_rise_48h) && isnan(r->max_fall_24h) && isnan(r->max_fall_48h) &&
           isnan(r->excess_mmol_l) && r->flags == 0u && r->reserved == 0u &&
           isnan(r->rise_first_24h) && isnan(r->fall_first_24h) && isnan(r->rise_now_24h) &&
           isnan(r->fall_now_24h) && isnan(r->last_rate_per_h) && isnan(r->elapsed_h) &&
           isnan(r->worst_at_h);
}

static void course_groups_published(void **state)
{
    /* Chronic hypernatraemia limits: falls at most 10 in any 24 h
     * (Adrogue & Madias, Hypernatremia, N Engl J Med 2000;342:1493-9).
     * Invented series, worked by hand:
     * group 0: 165, 158, 150 at 0, 8, 20 h: largest 24 h fall 165 - 150 =
     *   15 > 10, excess 5, at 20 h; last rate -8/12 per hour;
     * group 1: 110, 116, 122, 124 at 0, 6, 12, 24 h, a low sodium rising
     *   under a lowering goal: a 48 h rise of 14, over the 4 mmol/L margin
     *   of NTR_CF_WRONG_WAY; no fall limit is touched;
     * group 2: empty (NTR_ERR_ARG); group 3: one sample, all zero. */
    const ntr_sample s[8] = {{0, 165}, {8, 158}, {20, 150},
                             {0, 110}, {6, 116}, {12, 122}, {24, 124},
                             {5, 150}};
    const size_t offsets[5] = {0, 3, 7, 7, 8};
    const ntr_course_limits lim = course_preset(NTR_COURSE_HYPER_CHRONIC);
    ntr_course_report c[4];
    int st[4];
    size_t failed = 0;
    (void)state;
    memset(c, 0x5a, sizeof c);
    assert_int_equal(ntr_batch_course_assess(4, offsets, s, 8, &lim, sizeof c[0], c, st,
                                             &failed), NTR_ERR_ARG);
    assert_int_equal(failed, 1);
    assert_int_equal(st[0], NTR_OK);
    assert_int_equal(c[0].struct_size, sizeof c[0]);
    assert_close(c[0].max_fall_24h, 15.0, 1e-12);
    assert_close(c[0].excess_mmol_l, 5.0, 1e-12);
    assert_close(c[0].worst_at_h, 20.0, 0.0);
    assert_close(c[0].last_rate_per_h, -8.0 / 12.0, 1e-15);
    assert_close(c[0].max_rise_48h, 0.0, 0.0);
    assert_int_equal(c[0].flags & NTR_CF_FALL_OVER_24H, NTR_CF_FALL_OVER_24H);
    assert_int_equal(c[0].flags & (NTR_CF_WRONG_WAY | NTR_CF_OVER_24H), 0u);
    assert_int_equal(st[1], NTR_OK);
    assert_close(c[1].max_rise_48h, 14.0, 1e-12);
    assert_int_equal(c[1].flags & NTR_CF_WRONG_WAY, NTR_CF_WRONG_WAY);
    assert_int_equal(c[1].flags & (NTR_CF_FALL_OVER_24H | NTR_CF_FALL_OVER_48H), 0u);
    assert_int_equal(st[2], NTR_ERR_ARG);
    assert_true(failed_report_values(&c[2]));
    assert_int_equal(st[3], NTR_OK);
    assert_close(c[3].max_fall_48h, 0.0, 0.0);
    assert_close(c[3].max_rise_48h, 0.0, 0.0);
    assert_int_equal(c[3].flags, 0u);

    /* Offsets need not start at 0: group 1 alone gives the same report. */
    {
        const size_t tail[2] = {3, 7};
        ntr_course_report c2;
        int st2;
        assert_int_equal(ntr_batch_course_assess(1, tail, s, 8, &lim, sizeof c2, &c2, &st2,
                                                 NULL), NTR_OK);
        assert_true(same_report(&c2, &c[1]));
    }
}

/* A stride larger than the 1.1 report (a caller built against a later,
 * longer struct): each report lands at its stride, the bytes between are
 * left alone. */
static void course_groups_stride(void **state)
{
    enum { STRIDE = sizeof(ntr_course_report) + 4 * sizeof(double) };
    static unsigned char buf[3 * STRIDE];
    const ntr_sample s[4] = {{0, 160}, {24, 148}, {0, 120}, {10, 126}};
    const size_t offsets[4] = {0, 2, 2, 4};
    const ntr_course_limits lim = course_preset(NTR_COURSE_HYPER_CHRONIC);
    int st[3];
    size_t g, i;
    (void)state;
    memset(buf, 0x5a, sizeof buf);
    assert_int_equal(ntr_batch_course_assess(3, offsets, s, 4, &lim, STRIDE,
                                             (ntr_course_report *)(void *)buf, st, NULL),
                     NTR_ERR_ARG);
    for (g = 0; g < 3; g++) {
        ntr_course_report got, want;
        memcpy(&got, buf + g * STRIDE, sizeof got);
        memset(&want, 0, sizeof want);
        want.struct_size = sizeof want;
        assert_int_equal(st[g], ntr_course_assess(s + offsets[g], offsets[g + 1] - offsets[g],
                                                  &lim, &want));
        if (st[g] == NTR_OK) {
            assert_true(same_report(&got, &want));
        } else {
            assert_true(failed_report_values(&got));
        }
        for (i = sizeof(ntr_course_report); i < STRIDE; i++) {
            assert_int_equal(buf[g * STRIDE + i], 0x5a);
        }
    }
    /* 160 -> 148 in exactly 24 h: a fall of 12, over 10 (hand-worked). */
    assert_int_equal(st[0], NTR_OK);
    assert_int_equal(st[1], NTR_ERR_ARG);
    assert_int_equal(st[2], NTR_OK);
}

static void course_groups_contract(void **state)
{
    const ntr_sample s[3] = {{0, 160}, {6, 156}, {12, 153}};
    const size_t decreasing[3] = {0, 2, 1};
    const size_t decreasing_first[3] = {2, 1, 3};
    const size_t beyond[3] = {0, 2, 4};
    const size_t fine[3] = {0, 2, 3};
    const size_t size = sizeof(ntr_course_report);
    ntr_course_limits lim = course_preset(NTR_COURSE_HYPER_CHRONIC);
    ntr_course_report c[2], ref[2];
    int st[2] = {-1, -1};
    size_t failed = 77;
    (void)state;
    memset(c, 0x5a, sizeof c);
    memcpy(ref, c, sizeof c);
    assert_int_equal(ntr_batch_course_assess(2, NULL, s, 3, &lim, size, c, st, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_course_assess(2, fine, NULL, 3, &lim, size, c, st, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_course_assess(2, fine, s, 3, NULL, size, c, st, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_course_assess(0, fine, s, 3, &lim, size, NULL, st, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_course_assess(2, fine, s, 3, &lim, size, c, NULL, &failed),
                     NTR_ERR_NULL);
    assert_int_equal(ntr_batch_course_assess(2, decreasing, s, 3, &lim, size, c, st, &failed),
                     NTR_ERR_ARG);
    /* A decrease between the first two offsets too (offsets[0] need not
     * be 0): group 0 would run from 2 back to 1. */
    assert_int_equal(ntr_batch_course_assess(2, decreasing_first, s, 3, &lim, size, c, st, &failed),
                     NTR_ERR_ARG);
    assert_int_equal(ntr_batch_course_assess(2, beyond, s, 3, &lim, size, c, st, &failed),
                     NTR_ERR_ARG);
    /* Report sizes: too small, not a multiple of the alignment, so large
     * that groups x size does not fit in a size_t (no caller can own such
     * an array). */
    assert_int_equal(ntr_batch_course_assess(2, fine, s, 3, &lim, size - sizeof(double), c, st,
                                             &failed), NTR_ERR_ARG);
    assert_int_equal(ntr_batch_course_assess(2, fine, s, 3, &lim, size + 1, c, st, &failed),
                     NTR_ERR_ARG);
    assert_int_equal(ntr_batch_course_assess(2, fine, s, 3, &lim, 0, c, st, &failed),
                     NTR_ERR_ARG);
    {
        const size_t three[4] = {0, 1, 2, 3};
        assert_int_equal(ntr_batch_course_assess(3, three, s, 3, &lim,
                                                 ((size_t)-1) / 2 - ((size_t)-1) / 2 % 8, c, st,
                                                 &failed), NTR_ERR_ARG);
    }
    assert_memory_equal(c, ref, sizeof c);
    assert_int_equal(st[0], -1);
    assert_int_equal(failed, 77);
    /* No groups: fine, nothing written but the counter. */
    assert_int_equal(ntr_batch_course_assess(0, fine, s, 0, &lim, size, c, st, &failed), NTR_OK);
    assert_int_equal(failed, 0);
    assert_int_equal(st[0], -1);
    assert_memory_equal(c, ref, sizeof c);
    /* Limits the scalar call refuses fail every group with its status. */
    lim.max_fall_24h = (double)NAN;
    assert_int_equal(ntr_batch_course_assess(2, fine, s, 3, &lim, size, c, st, &failed),
                     NTR_ERR_NONFINITE);
    assert_int_equal(failed, 2);
    assert_int_equal(st[0], NTR_ERR_NONFINITE);
    assert_int_equal(st[1], NTR_ERR_NONFINITE);
    assert_true(failed_report_values(&c[0]) && failed_report_values(&c[1]));
    lim = course_preset(NTR_COURSE_HYPER_CHRONIC);
    lim.goal = 0;
    assert_int_equal(ntr_batch_course_assess(2, fine, s, 3, &lim, size, c, st, &failed),
                     NTR_ERR_ARG);
    assert_int_equal(failed, 2);
    lim = course_preset(NTR_COURSE_HYPER_CHRONIC);
    lim.struct_size = sizeof lim - 1;
    assert_int_equal(ntr_batch_course_assess(2, fine, s, 3, &lim, size, c, st, &failed),
                     NTR_ERR_ARG);
    assert_int_equal(st[1], NTR_ERR_ARG);
    /* Good limits: both groups OK (160 -> 153: a fall of 7, within 10). */
    lim = course_preset(NTR_COURSE_HYPER_CHRONIC);
    assert_int_equal(ntr_batch_course_assess(2, fine, s, 3, &lim, size, c, st, &failed), NTR_OK);
    assert_int_equal(failed, 0);
    assert_close(c[0].max_fall_24h, 4.0, 1e-12);
}

static ntr_course_report course_out[SERIES_GROUPS];

/* Random cohorts, rising and falling, with bad values and out-of-order
 * times, under every preset and a HOLD with a target-free random limit:
 * every group equals the scalar ntr_course_assess() bit for bit. */
static void course_groups_equal_scalar(void **state)
{
    static const int presets[5] = {NTR_COURSE_HYPO_STANDARD, NTR_COURSE_HYPO_HIGH_RISK,
                                   NTR_COURSE_HYPER_CHRONIC, NTR_COURSE_HYPER_ACUTE,
                                   NTR_COURSE_HOLD};
    size_t round;
    size_t flagged_fall = 0, flagged_rise = 0;
    (void)state;
    for (round = 0; round < 6; round++) {
        size_t g, i = 0, failed, bad = 0;
        int ret;
        ntr_course_limits lim = round < 5 ? course_preset(presets[round])
                                          : course_preset(NTR_COURSE_HOLD);
        if (round == 5) {
            lim.max_rise_48h = 6.0 + 6.0 * uniform01();
            lim.max_fall_48h = 6.0 + 6.0 * uniform01();
        }
        for (g = 0; g < SERIES_GROUPS; g++) {
            size_t k, len = (size_t)(uniform01() * 10.0);
            const int down = uniform01() < 0.5;
            double t = -24.0 + 48.0 * uniform01();
            double na = down ? 150.0 + 20.0 * uniform01() : 105.0 + 20.0 * uniform01();
            series_offsets[g] = i;
            for (k = 0; k < len && i < SERIES_SAMPLES; k++, i++) {
                double u = uniform01();
                t += u < 0.02 ? -1.0 : 24.0 * uniform01();
                na += down ? 2.0 - 8.0 * uniform01() : -2.0 + 8.0 * uniform01();
                series[i].hours = t;
                series[i].na_mmol_l = u > 0.99 ? (double)NAN : u > 0.98 ? 300.0 : na;
            }
        }
        series_offsets[SERIES_GROUPS] = i;
        memset(course_out, 0x5a, sizeof course_out);
        ret = ntr_batch_course_assess(SERIES_GROUPS, series_offsets, series, i, &lim,
                                      sizeof course_out[0], course_out, series_status, &failed);
        for (g = 0; g < SERIES_GROUPS; g++) {
            ntr_course_report expected;
            size_t n = series_offsets[g + 1] - series_offsets[g];
            int st;
            memset(&expected, 0, sizeof expected);
            expected.struct_size = sizeof expected;
            st = ntr_course_assess(series + series_offsets[g], n, &lim, &expected);
            assert_int_equal(st, series_status[g]);
            if (st == NTR_OK) {
                assert_true(same_report(&expected, &course_out[g]));
                flagged_fall += (course_out[g].flags &
                                 (NTR_CF_FALL_OVER_24H | NTR_CF_FALL_OVER_48H)) != 0u;
                flagged_rise += (course_out[g].flags & (NTR_CF_OVER_24H | NTR_CF_OVER_48H)) != 0u;
            } else {
                assert_true(failed_report_values(&course_out[g]));
                bad++;
            }
        }
        assert_true(bad > 0 && bad < SERIES_GROUPS);
        check_summary(ret, failed, series_status, SERIES_GROUPS, bad);
    }
    assert_true(flagged_fall > 0);
    assert_true(flagged_rise > 0);
}

/* ---- batch against scalar at every range and band edge ---------------- */

/* Rows of one table entry: the valid base row with one column at a time
 * set to a range end or a band edge, and to the doubles just beside each. */
static size_t edge_rows(const struct bt_entry *e, double rows[][BT_MAX_COLS],
                        int *row_sex)
{
    static const int sex_values[2] = {NTR_SEX_MALE, NTR_SEX_FEMALE};
    size_t n = 0;
    int si, c, k, side;
    for (si = 0; si < (e->has_sex ? 2 : 1); si++) {
        for (c = 0; c < e->ncol; c++) {
            double points[2 + BT_MAX_EDGES];
            int np = 0;
            points[np++] = e->lo[c];
            points[np++] = e->hi[c];
            for (k = 0; k < e->nedges[c]; k++) {
                points[np++] = e->edges[c][k];
            }
            for (k = 0; k < np; k++) {
                for (side = -1; side <= 1; side++) {
                    int j;
                    for (j = 0; j < e->ncol; j++) {
                        rows[n][j] = e->base[j];
                    }
                    rows[n][c] = side == 0 ? points[k]
                                           : nextafter(points[k], side * HUGE_VAL);
                    row_sex[n] = sex_values[si];
                    n++;
                }
            }
        }
        for (k = 0; k < (int)BT_EXTRA_COUNT; k++) {
            if (strcmp(bt_extra[k].name, e->name) == 0) {
                memcpy(rows[n], bt_extra[k].row, sizeof rows[n]);
                row_sex[n] = sex_values[si];
                n++;
            }
        }
    }
    return n;
}

static double edge_row_values[512][BT_MAX_COLS];
static int edge_row_sex[512];
static int int_out[ROWS];

/* Runs the batch function on the rows laid out three ways and compares
 * every row with the scalar function, bit for bit:
 *   0: as listed (pairs of mixed valid and invalid rows),
 *   1: each row twice in a row (a valid row then goes through the
 *      two-lane path of builds that have one),
 *   2: each row followed by a NaN row (the one-row path). */
static void check_edges(const struct bt_entry *e)
{
    size_t nrows = edge_rows(e, edge_row_values, edge_row_sex);
    double *cols[BT_MAX_COLS] = {a1, a2, a3, a4, a5};
    int layout;
    for (layout = 0; layout < 3; layout++) {
        size_t n = 0, i, bad = 0, failed = 0;
        int c, ret;
        for (i = 0; i < nrows; i++) {
            int copies = layout == 0 ? 1 : 2;
            int k;
            for (k = 0; k < copies; k++) {
                for (c = 0; c < e->ncol; c++) {
                    cols[c][n] = (layout == 2 && k == 1 && c == 0) ? (double)NAN
                                                                  : edge_row_values[i][c];
                }
                sexes[n] = edge_row_sex[i];
                n++;
            }
        }
        ret = e->batch(n, (const double *const *)cols, sexes,
                       e->int_out ? (void *)int_out : (void *)out, status, &failed);
        for (i = 0; i < n; i++) {
            double row[BT_MAX_COLS];
            for (c = 0; c < e->ncol; c++) {
                row[c] = cols[c][i];
            }
            if (e->int_out) {
                int s = -7777;
                int st = e->scalar(row, sexes[i], &s);
                if (st != status[i] || (st == NTR_OK && s != int_out[i])) {
                    print_error("%s layout %d row %zu: scalar %d/%d, batch %d/%d\n",
                                e->name, layout, i, st, s, status[i], int_out[i]);
                    fail();
                }
                bad += st != NTR_OK;
            } else {
                double s = SENTINEL;
                int st = e->scalar(row, sexes[i], &s);
                if (st != status[i]) {
                    print_error("%s layout %d row %zu:\n", e->name, layout, i);
                }
                bad += check_row(i, st, s, status[i], out[i]);
            }
        }
        check_summary(ret, failed, status, n, bad);
    }
}

static void band_edges_equal_scalar(void **state)
{
    size_t i;
    int ret;
    (void)state;
    for (i = 0; i < BT_COUNT; i++) {
        check_edges(&bt_table[i]);
    }
    /* Adrogue & Madias, N Engl J Med 2000;342:1581-9: a woman from 65
     * years has 0.45 of her weight as water, a man from 65 0.5; through
     * the two-lane path (two rows) and the one-row path (third row). */
    for (i = 0; i < 3; i++) {
        sexes[i] = i == 1 ? NTR_SEX_MALE : NTR_SEX_FEMALE;
        a1[i] = 65.0;
        a2[i] = 100.0;
    }
    ret = ntr_batch_tbw_fraction(3, sexes, a1, a2, out, status, NULL);
    assert_int_equal(ret, NTR_OK);
    assert_close(out[0], 45.0, 1e-12);
    assert_close(out[1], 50.0, 1e-12);
    assert_close(out[2], 45.0, 1e-12);
    /* Adults from 18 years: a man 0.6, a woman 0.5 (same source). */
    for (i = 0; i < 3; i++) {
        a1[i] = 18.0;
    }
    ret = ntr_batch_tbw_fraction(3, sexes, a1, a2, out, status, NULL);
    assert_int_equal(ret, NTR_OK);
    assert_close(out[0], 50.0, 1e-12);
    assert_close(out[1], 60.0, 1e-12);
    assert_close(out[2], 50.0, 1e-12);
}

/* Aliasing rule (include/natremia.h): each group's result is written while
 * later groups are still read, so outputs sharing a byte with the inputs
 * or with each other are refused (NTR_ERR_ARG, nothing written); buffers
 * that only touch are accepted. One malloc'd block holds them all. */
static void groups_refuse_overlapping_buffers(void **state)
{
    const ntr_sample s3[3] = {{0, 120}, {6, 124}, {12, 126}};
    const size_t off3[3] = {0, 2, 3};
    const size_t block = 4096;
    unsigned char *m = malloc(block);
    unsigned char *before = malloc(block);
    ntr_sample *s;
    size_t *off;
    ntr_limits *lim;
    ntr_course_limits *clim;
    ntr_correction *c;
    ntr_course_report *r;
    int *st;
    (void)state;
    assert_non_null(m);
    assert_non_null(before);
    memset(m, 0x5a, block);
    /* Inputs: samples at 0, offsets at 48, limits at 72 and 96. */
    s = (ntr_sample *)(void *)m;
    memcpy(s, s3, sizeof s3);
    off = (size_t *)(void *)(m + 48);
    memcpy(off, off3, sizeof off3);
    lim = (ntr_limits *)(void *)(m + 72);
    assert_int_equal(ntr_limits_preset(NTR_LIMITS_STANDARD, lim), NTR_OK);
    clim = (ntr_course_limits *)(void *)(m + 96);
    clim->struct_size = sizeof *clim;
    assert_int_equal(ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, clim), NTR_OK);
    memcpy(before, m, block);
    /* Outputs over the samples, the offsets, the limits; status over the
     * samples, over the outputs. */
    assert_int_equal(ntr_batch_correction_assess(2, off, s, 3, lim,
                                                 (ntr_correction *)(void *)(m + 40),
                                                 (int *)(void *)(m + 2048), NULL),
                     NTR_ERR_ARG);
    assert_int_equal(ntr_batch_correction_assess(2, off, s, 3, lim,
                                                 (ntr_correction *)(void *)(m + 1024),
                                                 (int *)(void *)(m + 44), NULL),
                     NTR_ERR_ARG);
    assert_int_equal(ntr_batch_correction_assess(2, off, s, 3, lim,
                                                 (ntr_correction *)(void *)(m + 1024),
                                                 (int *)(void *)(m + 1024 + sizeof *c), NULL),
                     NTR_ERR_ARG);
    assert_int_equal(ntr_batch_course_assess(2, off, s, 3, clim, sizeof *r,
                                             (ntr_course_report *)(void *)(m + 64),
                                             (int *)(void *)(m + 3072), NULL),
                     NTR_ERR_ARG);
    assert_int_equal(ntr_batch_course_assess(2, off, s, 3, clim, sizeof *r,
                                             (ntr_course_report *)(void *)(m + 104),
                                             (int *)(void *)(m + 3072), NULL),
                     NTR_ERR_ARG);
    assert_int_equal(ntr_batch_course_assess(2, off, s, 3, clim, sizeof *r,
                                             (ntr_course_report *)(void *)(m + 1024),
                                             (int *)(void *)(m + 1024 + sizeof *r), NULL),
                     NTR_ERR_ARG);
    assert_memory_equal(m, before, block);
    /* Touching only: outputs right after the inputs, status right after
     * the outputs. */
    c = (ntr_correction *)(void *)(m + 1024);
    st = (int *)(void *)(m + 1024 + 2 * sizeof *c);
    assert_int_equal(ntr_batch_correction_assess(2, off, s, 3, lim, c, st, NULL), NTR_OK);
    assert_int_equal(st[0], NTR_OK);
    r = (ntr_course_report *)(void *)(m + 96 + sizeof *clim);
    st = (int *)(void *)((unsigned char *)r + 2 * sizeof *r);
    assert_true((unsigned char *)(st + 2) <= m + block);
    r[0].struct_size = sizeof *r;
    r[1].struct_size = sizeof *r;
    assert_int_equal(ntr_batch_course_assess(2, off, s, 3, clim, sizeof *r, r, st, NULL),
                     NTR_OK);
    assert_int_equal(st[1], NTR_OK);
    free(m);
    free(before);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(published_values),
        cmocka_unit_test(null_and_bad_enumerators_write_nothing),
        cmocka_unit_test(empty_batch_is_ok),
        cmocka_unit_test(failed_rows_get_nan_and_status),
        cmocka_unit_test(in_place_output),
        cmocka_unit_test(osmolality_rows_equal_scalar),
        cmocka_unit_test(sodium_rows_equal_scalar),
        cmocka_unit_test(water_rows_equal_scalar),
        cmocka_unit_test(infusion_rows_equal_scalar),
        cmocka_unit_test(infusion_zero_change_in_pairs),
        cmocka_unit_test(infusion_volume_near_model_edges),
        cmocka_unit_test(watson_rows_near_lowest_water),
        cmocka_unit_test(urine_rows_equal_scalar),
        cmocka_unit_test(correction_groups_published),
        cmocka_unit_test(correction_groups_contract),
        cmocka_unit_test(correction_groups_equal_scalar),
        cmocka_unit_test(course_groups_published),
        cmocka_unit_test(course_groups_stride),
        cmocka_unit_test(course_groups_contract),
        cmocka_unit_test(course_groups_equal_scalar),
        cmocka_unit_test(band_edges_equal_scalar),
        cmocka_unit_test(groups_refuse_overlapping_buffers),
    };
    return cmocka_run_group_tests_name("batch", tests, NULL, NULL);
}
