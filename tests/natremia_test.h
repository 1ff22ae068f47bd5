/* SPDX-License-Identifier: MIT */
/* Shared helpers for the cmocka unit tests (tests/test_<area>.c).
 *
 * The library promises that on any error status no output is written. The
 * helpers here prefill outputs with a sentinel and check it survives, and
 * walk every numeric input of a function through NaN, +-infinity and the
 * values just outside its documented range. Include after <cmocka.h>. */
#ifndef NATREMIA_TEST_H
#define NATREMIA_TEST_H

#include <math.h>
#include <stddef.h>
#include <string.h>

#include "natremia.h"

/* An output value no function could produce by accident. */
#define NTR_TEST_SENTINEL (-7777.25)
#define NTR_TEST_SENTINEL_INT (-7777)

/* The largest number of numeric inputs the walker takes (the solute
 * area's dose and outlook functions take seven). */
#define NTR_TEST_MAX_ARGS 8

/* Calls the function under test with args[0..n-1] (and any fixed
 * enumerator the adapter chooses) and writes its single double output. */
typedef int (*ntr_test_call)(const double *args, double *out);

/* Description of one function's numeric inputs: a set of good values and
 * the documented range of each (docs/ranges.md). */
struct ntr_test_inputs {
    ntr_test_call call;
    size_t n;
    double good[NTR_TEST_MAX_ARGS];
    double lo[NTR_TEST_MAX_ARGS];
    double hi[NTR_TEST_MAX_ARGS];
};

static inline void ntr_test_copy(const struct ntr_test_inputs *in, double *args)
{
    size_t i;
    for (i = 0; i < in->n; i++) {
        args[i] = in->good[i];
    }
}

/* Calls with args and checks the status; on an error status also checks
 * that the output still holds the sentinel. */
static inline void ntr_test_expect(const struct ntr_test_inputs *in,
                                   const double *args, int expected)
{
    double out = NTR_TEST_SENTINEL;
    int status = in->call(args, &out);
    assert_int_equal(status, expected);
    if (expected != NTR_OK) {
        assert_true(out == NTR_TEST_SENTINEL);
    }
}

/* Every input in turn: NaN and +-infinity give NTR_ERR_NONFINITE, the
 * nearest doubles outside [lo, hi] give NTR_ERR_RANGE, the edges
 * themselves pass the range check (they may still give NTR_ERR_DOMAIN).
 * Then, for every pair i < j, a range error in i with NaN in j gives
 * NTR_ERR_RANGE: inputs are checked in argument order. */
static inline void ntr_test_bad_inputs(const struct ntr_test_inputs *in)
{
    const double nonfinite[3] = {(double)NAN, HUGE_VAL, -HUGE_VAL};
    double args[NTR_TEST_MAX_ARGS];
    size_t i, j, k;

    ntr_test_copy(in, args);
    ntr_test_expect(in, args, NTR_OK);

    for (i = 0; i < in->n; i++) {
        for (k = 0; k < 3; k++) {
            ntr_test_copy(in, args);
            args[i] = nonfinite[k];
            ntr_test_expect(in, args, NTR_ERR_NONFINITE);
        }
        ntr_test_copy(in, args);
        args[i] = nextafter(in->lo[i], -HUGE_VAL);
        ntr_test_expect(in, args, NTR_ERR_RANGE);
        args[i] = nextafter(in->hi[i], HUGE_VAL);
        ntr_test_expect(in, args, NTR_ERR_RANGE);
        args[i] = in->lo[i];
        {
            double out = NTR_TEST_SENTINEL;
            int status = in->call(args, &out);
            assert_true(status == NTR_OK || status == NTR_ERR_DOMAIN);
        }
        args[i] = in->hi[i];
        {
            double out = NTR_TEST_SENTINEL;
            int status = in->call(args, &out);
            assert_true(status == NTR_OK || status == NTR_ERR_DOMAIN);
        }
    }

    for (i = 0; i < in->n; i++) {
        for (j = i + 1; j < in->n; j++) {
            ntr_test_copy(in, args);
            args[i] = nextafter(in->hi[i], HUGE_VAL);
            args[j] = (double)NAN;
            ntr_test_expect(in, args, NTR_ERR_RANGE);
        }
    }
}

/* |a - b| <= tol in double precision (cmocka's float assert is too
 * coarse), with both values shown on failure. */
static inline void ntr_test_assert_near(double a, double b, double tol,
                                        const char *expr, const char *file,
                                        int line)
{
    if (!(fabs(a - b) <= tol)) {
        print_error("%s = %.17g, expected %.17g within %g\n", expr, a, b, tol);
        _fail(file, line);
    }
}
#define assert_near(a, b, tol) \
    ntr_test_assert_near((a), (b), (tol), #a, __FILE__, __LINE__)

/* Relative closeness for values far from zero. */
static inline int ntr_test_rel_close(double a, double b, double rel)
{
    return fabs(a - b) <= rel * fmax(fabs(a), fabs(b));
}

/* A timed flow with its reserved fields zero, for the plan and feedback
 * tests. */
static inline ntr_timed_flow ntr_test_timed(double start_h, double end_h,
                                            double rate_ml_h, double na_mmol_l,
                                            double k_mmol_l)
{
    ntr_timed_flow f;
    f.start_h = start_h;
    f.end_h = end_h;
    f.rate_ml_h = rate_ml_h;
    f.na_mmol_l = na_mmol_l;
    f.k_mmol_l = k_mmol_l;
    f.reserved[0] = 0u;
    f.reserved[1] = 0u;
    return f;
}

/* A urine interval with its other members zero, for the feedback, guard
 * and range tests. */
static inline ntr_urine_interval ntr_test_urine(double start_h, double end_h,
                                               double volume_ml, double na_mmol_l,
                                               double k_mmol_l, double osm_mosm_kg)
{
    ntr_urine_interval u;
    memset(&u, 0, sizeof u);
    u.start_h = start_h;
    u.end_h = end_h;
    u.volume_ml = volume_ml;
    u.na_mmol_l = na_mmol_l;
    u.k_mmol_l = k_mmol_l;
    u.osm_mosm_kg = osm_mosm_kg;
    return u;
}

#endif
