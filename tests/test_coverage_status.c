/* SPDX-License-Identifier: MIT */
/* Coverage of lib/status.c's shared range check (P6).
 *
 * Builds optimised for size (__OPTIMIZE_SIZE__, as firmware builds are)
 * route every range check through the out-of-line ntri_check_range();
 * other builds inline the same test (lib/ntr_internal.h). The unit suite
 * normally runs the inline one, so this test calls the out-of-line one
 * directly (linked from the static library, where the hidden symbol is
 * visible) and requires it to agree with the inline check on every edge:
 * the two must give the same status for every input, or a firmware build
 * would check ranges differently from a server build.
 */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <float.h>
#include <math.h>
#include <cmocka.h>

#include "ntr_internal.h"

static void shared_check_agrees_with_inline_check(void **state)
{
    const double values[] = {NAN, -NAN, HUGE_VAL, -HUGE_VAL, -1.0, 0.0, -0.0, 80.0, 220.0,
                             79.99999999999999, 220.00000000000003, 150.0, DBL_MAX, -DBL_MAX,
                             DBL_MIN, 4.9406564584124654e-324, 1e300};
    const double ranges[][2] = {{80.0, 220.0}, {0.0, 200.0}, {-1e6, 1e6}, {0.0, 0.0}};
    size_t i;
    size_t r;
    int tried = 0;
    (void)state;
    for (r = 0; r < sizeof ranges / sizeof ranges[0]; r++) {
        for (i = 0; i < sizeof values / sizeof values[0]; i++) {
            double x = values[i];
            double lo = ranges[r][0];
            double hi = ranges[r][1];
            int want = !isfinite(x) ? NTR_ERR_NONFINITE
                       : (x < lo || x > hi) ? NTR_ERR_RANGE
                                            : NTR_OK;
            assert_int_equal(ntri_check_range(x, lo, hi), want);
            assert_int_equal(ntr_check(x, lo, hi), want);
            tried++;
        }
    }
    assert_int_equal(tried, 68);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(shared_check_agrees_with_inline_check),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
