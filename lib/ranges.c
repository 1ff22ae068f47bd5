/* SPDX-License-Identifier: MIT */
/* Input ranges as API: the accepted range of each kind of numeric input,
 * read from the one definition of each range in lib/ntr_internal.h (the
 * constants the computing functions check against), so a caller and the
 * library can never disagree. docs/ranges.md. */
#include "ntr_internal.h"

typedef struct ntri_range {
    double min;
    double max;
} ntri_range;

/* Indexed by kind - 1: the order of the NTR_INPUT_* values in the header. */
static const ntri_range ntri_ranges[] = {
    {NTR_NA_MIN, NTR_NA_MAX},                      /* NTR_INPUT_NA */
    {0.0, NTR_GLUCOSE_MAX},                        /* NTR_INPUT_GLUCOSE */
    {0.0, NTR_UREA_MAX},                           /* NTR_INPUT_UREA */
    {0.0, NTR_ETHANOL_MAX},                        /* NTR_INPUT_ETHANOL */
    {NTR_OSM_MIN, NTR_OSM_MAX},                    /* NTR_INPUT_OSMOLALITY */
    {NTR_TBW_FRACTION_AGE_MIN, NTR_AGE_MAX},       /* NTR_INPUT_AGE_FRACTION */
    {NTR_ADULT_AGE, NTR_AGE_MAX},                  /* NTR_INPUT_AGE_WATSON */
    {NTR_HEIGHT_MIN, NTR_HEIGHT_MAX},              /* NTR_INPUT_HEIGHT */
    {NTR_WEIGHT_MIN, NTR_WEIGHT_MAX},              /* NTR_INPUT_WEIGHT */
    {NTR_TBW_MIN, NTR_TBW_MAX},                    /* NTR_INPUT_TBW */
    {0.0, NTR_INFUSATE_NA_MAX},                    /* NTR_INPUT_INFUSATE_NA */
    {0.0, NTR_INFUSATE_K_MAX},                     /* NTR_INPUT_INFUSATE_K */
    {0.0, NTR_INFUSE_VOLUME_MAX},                  /* NTR_INPUT_VOLUME */
    {-NTR_DELTA_MAX, NTR_DELTA_MAX},               /* NTR_INPUT_DELTA */
    {0.0, NTR_URINE_NA_MAX},                       /* NTR_INPUT_URINE_NA */
    {0.0, NTR_URINE_K_MAX},                        /* NTR_INPUT_URINE_K */
    {0.0, NTR_URINE_VOLUME_MAX},                   /* NTR_INPUT_URINE_VOLUME */
    {NTR_URINE_OSM_MIN, NTR_URINE_OSM_MAX},        /* NTR_INPUT_URINE_OSM */
    {0.0, NTR_RATIO_MAX},                          /* NTR_INPUT_RATIO */
    {0.0, NTR_GLUCOSE_FACTOR_MAX},                 /* NTR_INPUT_GLUCOSE_FACTOR */
    {0.0, NTR_CONVERT_MAX},                        /* NTR_INPUT_CONVERT_VALUE */
    {-NTR_HOURS_MAX, NTR_HOURS_MAX},               /* NTR_INPUT_HOURS */
    {0.0, NTR_LIMIT_MAX},                          /* NTR_INPUT_LIMIT */
    {-NTR_FLOW_RATE_MAX, NTR_FLOW_RATE_MAX},       /* NTR_INPUT_FLOW_RATE */
    {0.0, NTR_FLOW_RATE_MAX},                      /* NTR_INPUT_URINE_RATE */
    {0.0, NTR_PLAN_HOURS_MAX},                     /* NTR_INPUT_PLAN_HOURS */
    {NTR_PLAN_STEP_MIN, NTR_PLAN_HOURS_MAX},       /* NTR_INPUT_PLAN_STEP */
    {NTR_FLOW_VOLUME_MIN, NTR_INFUSE_VOLUME_MAX},  /* NTR_INPUT_FLOW_VOLUME */
    {0.0, NTR_URINE_ML_MAX},                       /* NTR_INPUT_URINE_ML */
    {0.0, NTR_URIC_ACID_MAX},                      /* NTR_INPUT_URIC_ACID */
    {0.0, NTR_FE_PERCENT_MAX},                     /* NTR_INPUT_FE_PERCENT */
    {0.0, NTR_FE_INPUT_MAX},                       /* NTR_INPUT_FE_VALUE */
    {0.0, NTR_SOLUTE_MOSM_DAY_MAX},                /* NTR_INPUT_SOLUTE_MOSM_DAY */
    {0.0, NTR_INSENSIBLE_L_DAY_MAX},               /* NTR_INPUT_INSENSIBLE_L_DAY */
    {0.0, NTR_SOLUTE_GRAMS_MAX},                   /* NTR_INPUT_SOLUTE_GRAMS */
    {0.0, NTR_INTAKE_L_DAY_MAX},                   /* NTR_INPUT_INTAKE_L_DAY (0 open) */
    {0.0, NTR_RELOWER_MARGIN_MAX},                 /* NTR_INPUT_RELOWER_MARGIN */
    {0.0, NTR_INSENSIBLE_MAX},                     /* NTR_INPUT_INSENSIBLE_ML_H */
    {0.0, NTR_DELTA_MAX},                          /* NTR_INPUT_CHANGE (0 open) */
};

#define NTRI_RANGE_KINDS (sizeof ntri_ranges / sizeof ntri_ranges[0])

int ntr_input_range(int kind, double *min, double *max)
{
    const ntri_range *r;
    if (min == NULL || max == NULL) {
        return NTR_ERR_NULL;
    }
    if (kind < 1 || (unsigned int)kind > NTRI_RANGE_KINDS) {
        return NTR_ERR_ARG;
    }
    r = &ntri_ranges[kind - 1];
    *min = r->min;
    *max = r->max;
    return NTR_OK;
}
