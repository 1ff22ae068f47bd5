/* SPDX-License-Identifier: MIT */
/* Status codes and version: values fixed by the ABI (issue P1). */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <stdio.h>
#include <string.h>
#include <cmocka.h>

#include "natremia.h"

/* The status values are part of the ABI and may never change. */
static void status_values_are_fixed(void **state)
{
    (void)state;
    assert_int_equal(NTR_OK, 0);
    assert_int_equal(NTR_ERR_NULL, 1);
    assert_int_equal(NTR_ERR_NONFINITE, 2);
    assert_int_equal(NTR_ERR_RANGE, 3);
    assert_int_equal(NTR_ERR_UNIT, 4);
    assert_int_equal(NTR_ERR_DOMAIN, 5);
    assert_int_equal(NTR_ERR_ORDER, 6);
    assert_int_equal(NTR_ERR_CAPACITY, 7);
    assert_int_equal(NTR_ERR_ARG, 8);
}

static void every_status_has_its_own_message(void **state)
{
    int a, b;
    (void)state;
    for (a = NTR_OK; a <= NTR_ERR_ARG; a++) {
        assert_non_null(ntr_status_message(a));
        assert_string_not_equal(ntr_status_message(a), "unknown status");
        for (b = a + 1; b <= NTR_ERR_ARG; b++) {
            assert_string_not_equal(ntr_status_message(a), ntr_status_message(b));
        }
    }
    assert_string_equal(ntr_status_message(-1), "unknown status");
    assert_string_equal(ntr_status_message(9), "unknown status");
}

static void version_agrees_with_header(void **state)
{
    char expected[32];
    (void)state;
    assert_int_equal(ntr_version_number(),
                     NTR_VERSION_MAJOR * 10000 + NTR_VERSION_MINOR * 100 + NTR_VERSION_PATCH);
    /* snprintf lives in the test, never in the library. */
    expected[0] = '\0';
    {
        int n = 0;
        n = sprintf(expected, "%d.%d.%d", NTR_VERSION_MAJOR, NTR_VERSION_MINOR,
                    NTR_VERSION_PATCH);
        assert_true(n > 0);
    }
    assert_string_equal(ntr_version_string(), expected);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(status_values_are_fixed),
        cmocka_unit_test(every_status_has_its_own_message),
        cmocka_unit_test(version_agrees_with_header),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
