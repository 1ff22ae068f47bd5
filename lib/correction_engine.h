/* SPDX-License-Identifier: MIT */
/* Internal interface of the one correction engine in lib/correction.c, for
 * lib/balance.c (the plan checks, which assess a predicted series without
 * storing it) and lib/batch.c (assessment of many series). Not installed.
 * The functions have hidden visibility and the prefix ntri_ so they can
 * clash neither with the exported ntr_* names nor with a program that
 * links the static library. */
#ifndef NTR_CORRECTION_ENGINE_H
#define NTR_CORRECTION_ENGINE_H

#include "ntr_internal.h"

/* Index meaning "no such sample". */
#define NTRI_NONE ((size_t)-1)

/* A series read by index: an array, or points computed on demand. */
typedef ntr_sample (*ntri_point_fn)(const void *ctx, size_t i);
typedef struct ntri_series {
    const ntr_sample *samples; /* the series when point is NULL */
    ntri_point_fn point;       /* NULL for an array, else called per read */
    const void *ctx;
    size_t n;
} ntri_series;

/* First index (>= from) of a point whose 24 h / 48 h window rise exceeds
 * the limit, or NTRI_NONE (1.0 limits, ntri_assess()). */
typedef struct ntri_breach {
    size_t first_over_24h;
    size_t first_over_48h;
} ntri_breach;

/* First index (>= from) of a point whose window ending at it is over each
 * of the four course limits, or NTRI_NONE (always NTRI_NONE for a limit of
 * 0, which is no limit). A window "ending at" index j holds the samples at
 * most 24 h (48 h) before it, j included. */
typedef struct ntri_course_breach {
    size_t rise_24h;
    size_t rise_48h;
    size_t fall_24h;
    size_t fall_48h;
} ntri_course_breach;

/* NTR_OK or the first failing status of the 1.0 limit checks. */
int ntri_limits_check(const ntr_limits *lim);

/* The NTR_ERR_ARG checks of course limits (the "enumerator" stage of the
 * documented check order): struct_size at least the 1.1 size, goal an
 * NTR_GOAL_* value. */
int ntri_course_limits_kind(const ntr_course_limits *lim);

/* The numeric checks of course limits (NTR_ERR_NONFINITE, NTR_ERR_RANGE),
 * for limits whose kind is checked: each limit, the target, then their
 * consistency. */
int ntri_course_limits_values(const ntr_course_limits *lim);

/* Both, kind first: NTR_OK or the first failing status. */
int ntri_course_limits_check(const ntr_course_limits *lim);

/* NTR_ERR_ARG when a report's struct_size is below the 1.1 size. */
int ntri_course_report_check(const ntr_course_report *out);

/* Numeric checks of samples (each: hours, then sodium, in index order).
 * On NTR_OK, *order is NTR_OK when the times never decrease, else
 * NTR_ERR_ORDER (for the caller to return after its other checks). */
int ntri_samples_check(const ntr_sample *s, size_t n, int *order);

/* Assess a checked, ordered, non-empty series under checked 1.0 limits (a
 * wrapper over ntri_course_assess with goal raise and no fall limits).
 * When breach is not NULL, also finds the first points at or after `from`
 * that breach each limit. */
void ntri_assess(const ntri_series *v, const ntr_limits *lim, size_t from,
                 ntr_correction *out, ntri_breach *breach);

/* Assess a checked, ordered, non-empty series under checked course limits
 * (what ntr_course_assess() reports; out->struct_size is set). When breach
 * is not NULL, also finds the first points at or after `from` whose
 * windows are over each of the four limits. Linear time, O(1) memory. */
void ntri_course_assess(const ntri_series *v, const ntr_course_limits *lim,
                        size_t from, ntr_course_report *out,
                        ntri_course_breach *breach);

#endif
