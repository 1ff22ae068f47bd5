/* SPDX-License-Identifier: MIT */
/* The public header compiles on its own as strict ISO C99
 * (-std=c99 -pedantic-errors, plus -Wstrict-prototypes -Wundef), is safe to
 * include twice, and its version macros agree with the linked library. */
#include "natremia.h"
#include "natremia.h"

#include <stdio.h>

int main(void)
{
    unsigned long header_version =
        NTR_VERSION_MAJOR * 10000UL + NTR_VERSION_MINOR * 100UL + NTR_VERSION_PATCH;
    if (ntr_version_number() != header_version) {
        printf("FAIL: header says %lu, library says %lu\n", header_version,
               ntr_version_number());
        return 1;
    }
    printf("C99 header test passed (version %s)\n", ntr_version_string());
    return 0;
}
