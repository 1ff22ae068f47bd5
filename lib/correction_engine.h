/* Internal interface between lib/correction.c (the assessment engine) and
 * lib/balance.c (the plan check, which assesses a predicted series without
 * storing it). Not installed. The functions have hidden visibility and the
 * prefix ntri_ so they can clash neither with the exported ntr_* names nor
 * with a program that links the static library. */
#ifndef NTR_CORRECTION_ENGINE_H
#define NTR_CORRECTION_ENGINE_H

#include "ntr_internal.h"

/* Index meaning "no such sample". */
#define NTRI_NONE ((size_t)-1)

/* A series read by index: an array, or points computed on demand. */
typedef ntr_sample (*ntri_point_fn)(const void *ctx, size_t i);
typedef struct ntri_series {
    const ntr_sample *samples; /* the series, or NULL to call point() */
    ntri_point_fn point;
    const void *ctx;
    size_t n;
} ntri_series;

/* First index (>= from) of a point whose 24 h / 48 h window rise exceeds
 * the limit, or NTRI_NONE. */
typedef struct ntri_breach {
    size_t first_over_24h;
    size_t first_over_48h;
} ntri_breach;

/* NTR_OK or the first failing status of the limit checks. */
int ntri_limits_check(const ntr_limits *lim);

/* Numeric checks of samples (each: hours, then sodium, in index order).
 * On NTR_OK, *order is NTR_OK when the times never decrease, else
 * NTR_ERR_ORDER (for the caller to return after its other checks). */
int ntri_samples_check(const ntr_sample *s, size_t n, int *order);

/* Assess a checked, ordered, non-empty series under checked limits. When
 * breach is not NULL, also finds the first points at or after `from` that
 * breach each limit. */
void ntri_assess(const ntri_series *v, const ntr_limits *lim, size_t from,
                 ntr_correction *out, ntri_breach *breach);

#endif
