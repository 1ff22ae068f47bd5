/* SPDX-License-Identifier: MIT */
/* Status messages and version. */
#include "ntr_internal.h"

#define NTR_STR2(x) #x
#define NTR_STR(x) NTR_STR2(x)

const char *ntr_status_message(int status)
{
    switch (status) {
    case NTR_OK: return "success";
    case NTR_ERR_NULL: return "a required pointer argument was NULL";
    case NTR_ERR_NONFINITE: return "an input was NaN or infinite";
    case NTR_ERR_RANGE: return "an input was outside its plausible range";
    case NTR_ERR_UNIT: return "unknown unit, or a unit that does not fit the analyte";
    case NTR_ERR_DOMAIN: return "the formula is undefined for these inputs";
    case NTR_ERR_ORDER: return "the series is not in time order";
    case NTR_ERR_CAPACITY: return "the output buffer is too small";
    case NTR_ERR_ARG: return "unknown option or count";
    default: return "unknown status";
    }
}

const char *ntr_version_string(void)
{
    return NTR_STR(NTR_VERSION_MAJOR) "." NTR_STR(NTR_VERSION_MINOR) "."
           NTR_STR(NTR_VERSION_PATCH);
}

unsigned long ntr_version_number(void)
{
    return (unsigned long)NTR_VERSION_MAJOR * 10000ul +
           (unsigned long)NTR_VERSION_MINOR * 100ul +
           (unsigned long)NTR_VERSION_PATCH;
}

/* The out-of-line range check that size-optimised builds share
 * (lib/ntr_internal.h). Internal: hidden, not in the version script. */
int ntri_check_range(double x, double lo, double hi)
{
    if (x >= lo && x <= hi) {
        return NTR_OK;
    }
    return isfinite(x) ? NTR_ERR_RANGE : NTR_ERR_NONFINITE;
}
