/* SPDX-License-Identifier: MIT */
/* Correction-rate safety: limit presets, risk of osmotic demyelination,
 * assessing a measured sodium series in both directions (one engine: the
 * 1.0 rise-only functions are wrappers over it), and two streaming
 * watchers on one ring engine that give the same answers one result at a
 * time (docs/correction.md). */
#include "correction_engine.h"
#include "sodium_kernels.h"

/* Window lengths with the time tolerance folded in: a pair exactly W hours
 * apart is inside the window even if rounding makes it a hair more. */
#define WINDOW_6H (NTR_CF_RAPID_WINDOW_H + NTR_CF_TIME_TOLERANCE_H)
#define WINDOW_24H (24.0 + NTR_CF_TIME_TOLERANCE_H)
#define WINDOW_48H (48.0 + NTR_CF_TIME_TOLERANCE_H)

/* Baseline sodium at or below which osmotic demyelination risk is high
 * (Verbalis et al. 2013). */
#define ODS_NA_THRESHOLD 105.0

/* Marks an initialised ntr_watch ("NTRW"). */
#define WATCH_MAGIC 0x4e545257u

/* ---- limits ------------------------------------------------------------ */

int ntr_limits_preset(int preset, ntr_limits *out)
{
    if (out == NULL) {
        return NTR_ERR_NULL;
    }
    switch (preset) {
    case NTR_LIMITS_STANDARD:
        /* Verbalis 2013: at most 10-12 in any 24 h and 18 in 48 h, at
         * least 4-8; Spasovski 2014: 10 in the first 24 h, 18 by 48 h. */
        out->max_rise_24h = 10.0;
        out->max_rise_48h = 18.0;
        out->min_rise_24h = 4.0;
        return NTR_OK;
    case NTR_LIMITS_HIGH_RISK:
        /* Verbalis 2013: at most 8 in any 24 h, at least 4-6; 16 over 48 h
         * is twice that (the library's own choice). */
        out->max_rise_24h = 8.0;
        out->max_rise_48h = 16.0;
        out->min_rise_24h = 4.0;
        return NTR_OK;
    default:
        return NTR_ERR_ARG;
    }
}

static int check_max_limit(double x)
{
    NTR_TRY(ntr_check(x, 0.0, NTR_LIMIT_MAX));
    /* A zero limit would flag every measurement; it is not a limit. */
    return x > 0.0 ? NTR_OK : NTR_ERR_RANGE;
}

/* The checks in order, naming the first that fails. */
static int limits_status(const ntr_limits *lim)
{
    NTR_TRY(check_max_limit(lim->max_rise_24h));
    NTR_TRY(check_max_limit(lim->max_rise_48h));
    NTR_TRY(ntr_check(lim->min_rise_24h, 0.0, NTR_LIMIT_MAX));
    /* Any 24 h lies inside some 48 h, so a looser 24 h limit is meaningless,
     * and a target above the ceiling could never be met safely. */
    if (lim->max_rise_24h > lim->max_rise_48h ||
        lim->min_rise_24h > lim->max_rise_24h) {
        return NTR_ERR_RANGE;
    }
    return NTR_OK;
}

/* Whether limits_status() accepts the limits, as one chain of ordered
 * comparisons (each false for NaN): 0 <= min <= max24 <= max48 <=
 * NTR_LIMIT_MAX and max24 > 0. Every condition of limits_status() follows
 * from the chain (max24 and max48 lie in (0, 50], min in [0, 50]) and the
 * chain from them; tests/test_correction.c compares the two on every
 * combination of edge values. Valid limits, the common case, then cost a
 * third of the instructions: the watcher asks on every push and result,
 * and every assessment and plan check once. */
static int limits_sound(const ntr_limits *lim)
{
#if defined(__OPTIMIZE_SIZE__)
    /* Built for size, the one full check serves: on a processor without
     * double-precision hardware every comparison is a library call. */
    return limits_status(lim) == NTR_OK;
#else
    return lim->min_rise_24h >= 0.0 &&
           lim->min_rise_24h <= lim->max_rise_24h &&
           lim->max_rise_24h <= lim->max_rise_48h &&
           lim->max_rise_48h <= NTR_LIMIT_MAX && lim->max_rise_24h > 0.0;
#endif
}

int ntri_limits_check(const ntr_limits *lim)
{
    return limits_sound(lim) ? NTR_OK : limits_status(lim);
}

/* ---- course limits (both directions) ------------------------------------ */

int ntr_course_limits_preset(int preset, ntr_course_limits *out)
{
    ntr_course_limits c;
    if (out == NULL) {
        return NTR_ERR_NULL;
    }
    c.struct_size = sizeof c;
    c.max_rise_24h = 0.0;
    c.max_rise_48h = 0.0;
    c.max_fall_24h = 0.0;
    c.max_fall_48h = 0.0;
    c.min_change_24h = 0.0; /* a target is the caller's choice (issue P1) */
    switch (preset) {
    case NTR_COURSE_HYPO_STANDARD:
        /* As NTR_LIMITS_STANDARD (Verbalis 2013, Spasovski 2014). */
        c.goal = NTR_GOAL_RAISE;
        c.max_rise_24h = 10.0;
        c.max_rise_48h = 18.0;
        break;
    case NTR_COURSE_HYPO_HIGH_RISK:
        /* As NTR_LIMITS_HIGH_RISK (Verbalis 2013; 16 = 2 x 8). */
        c.goal = NTR_GOAL_RAISE;
        c.max_rise_24h = 8.0;
        c.max_rise_48h = 16.0;
        break;
    case NTR_COURSE_HYPER_CHRONIC:
        /* Adrogue & Madias 2000: chronic or unknown duration, about 10 per
         * day. No 48 h limit: 10 in every 24 h already bounds it. */
        c.goal = NTR_GOAL_LOWER;
        c.max_fall_24h = 10.0;
        break;
    case NTR_COURSE_HYPER_ACUTE:
        /* Adrogue & Madias 2000: hours-old, about 1 per hour; 24 h of it. */
        c.goal = NTR_GOAL_LOWER;
        c.max_fall_24h = 24.0;
        break;
    case NTR_COURSE_HOLD:
        /* The library's choice: no move beyond analytical error. */
        c.goal = NTR_GOAL_HOLD;
        c.max_rise_24h = NTR_CF_WRONG_WAY_MARGIN;
        c.max_fall_24h = NTR_CF_WRONG_WAY_MARGIN;
        break;
    default:
        return NTR_ERR_ARG;
    }
    *out = c;
    return NTR_OK;
}

int ntri_course_limits_kind(const ntr_course_limits *lim)
{
    if (lim->struct_size < sizeof(ntr_course_limits)) {
        return NTR_ERR_ARG;
    }
    return lim->goal >= NTR_GOAL_RAISE && lim->goal <= NTR_GOAL_HOLD ? NTR_OK : NTR_ERR_ARG;
}

int ntri_course_report_check(const ntr_course_report *out)
{
    return out->struct_size < sizeof(ntr_course_report) ? NTR_ERR_ARG : NTR_OK;
}

/* A 24 h and a 48 h limit of one direction: a looser 24 h limit is
 * meaningless where both are set (any 24 h lies inside some 48 h). */
static int pair_consistent(double limit_24h, double limit_48h)
{
    return limit_24h <= 0.0 || limit_48h <= 0.0 || limit_24h <= limit_48h;
}

/* A target above a ceiling of its own direction could never be met
 * safely; a hold has no direction to aim at. */
static int target_consistent(const ntr_course_limits *lim)
{
    const double t = lim->min_change_24h;
    if (lim->goal == NTR_GOAL_HOLD) {
        return t <= 0.0;
    }
    if (lim->goal == NTR_GOAL_RAISE) {
        return pair_consistent(t, lim->max_rise_24h) && pair_consistent(t, lim->max_rise_48h);
    }
    return pair_consistent(t, lim->max_fall_24h) && pair_consistent(t, lim->max_fall_48h);
}

int ntri_course_limits_values(const ntr_course_limits *lim)
{
    NTR_TRY(ntr_check(lim->max_rise_24h, 0.0, NTR_LIMIT_MAX));
    NTR_TRY(ntr_check(lim->max_rise_48h, 0.0, NTR_LIMIT_MAX));
    NTR_TRY(ntr_check(lim->max_fall_24h, 0.0, NTR_LIMIT_MAX));
    NTR_TRY(ntr_check(lim->max_fall_48h, 0.0, NTR_LIMIT_MAX));
    NTR_TRY(ntr_check(lim->min_change_24h, 0.0, NTR_LIMIT_MAX));
    if (!pair_consistent(lim->max_rise_24h, lim->max_rise_48h) ||
        !pair_consistent(lim->max_fall_24h, lim->max_fall_48h) ||
        !target_consistent(lim)) {
        return NTR_ERR_RANGE;
    }
    return NTR_OK;
}

int ntri_course_limits_check(const ntr_course_limits *lim)
{
    NTR_TRY(ntri_course_limits_kind(lim));
    return ntri_course_limits_values(lim);
}

/* ---- risk of osmotic demyelination ------------------------------------- */

/* NTR_TRI_UNKNOWN, _NO and _YES are 0, 1 and 2. */
static int is_tri(int answer)
{
    return answer >= NTR_TRI_UNKNOWN && answer <= NTR_TRI_YES;
}

/* `bit` when the answer is `value`, else 0. */
static unsigned int bit_if(int answer, int value, unsigned int bit)
{
    return answer == value ? bit : 0u;
}

int ntr_ods_risk(double baseline_na_mmol_l, int low_potassium,
                 int alcohol_use_disorder, int malnutrition,
                 int advanced_liver_disease, int *preset,
                 unsigned int *drivers, unsigned int *unknowns)
{
    unsigned int present;
    unsigned int not_known;

    if (preset == NULL || drivers == NULL || unknowns == NULL) {
        return NTR_ERR_NULL;
    }
    if (!is_tri(low_potassium) || !is_tri(alcohol_use_disorder) ||
        !is_tri(malnutrition) || !is_tri(advanced_liver_disease)) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntr_check_na(baseline_na_mmol_l));

    /* Straight-line bit arithmetic (no local arrays and loops): a third of
     * the instructions per call (tests/bench/run-bench.sh). */
    present = (baseline_na_mmol_l <= ODS_NA_THRESHOLD ? NTR_ODS_NA_105 : 0u) |
              bit_if(low_potassium, NTR_TRI_YES, NTR_ODS_LOW_K) |
              bit_if(alcohol_use_disorder, NTR_TRI_YES, NTR_ODS_ALCOHOL) |
              bit_if(malnutrition, NTR_TRI_YES, NTR_ODS_MALNUTRITION) |
              bit_if(advanced_liver_disease, NTR_TRI_YES, NTR_ODS_LIVER);
    not_known = bit_if(low_potassium, NTR_TRI_UNKNOWN, NTR_ODS_LOW_K) |
                bit_if(alcohol_use_disorder, NTR_TRI_UNKNOWN, NTR_ODS_ALCOHOL) |
                bit_if(malnutrition, NTR_TRI_UNKNOWN, NTR_ODS_MALNUTRITION) |
                bit_if(advanced_liver_disease, NTR_TRI_UNKNOWN, NTR_ODS_LIVER);
    /* An unknown factor may be present: it must not loosen the limits. */
    *preset = (present | not_known) != 0u ? NTR_LIMITS_HIGH_RISK
                                          : NTR_LIMITS_STANDARD;
    *drivers = present;
    *unknowns = not_known;
    return NTR_OK;
}

/* ---- checks of a series ------------------------------------------------ */

int ntri_samples_check(const ntr_sample *s, size_t n, int *order)
{
    double previous = -HUGE_VAL;
    int ordered = 1;
    size_t i;
    /* One pass: numbers are checked in index order; the time order is only
     * noted, because every numeric error outranks it. */
    for (i = 0; i < n; i++) {
        NTR_TRY(ntr_check(s[i].hours, -NTR_HOURS_MAX, NTR_HOURS_MAX));
        NTR_TRY(ntr_check_na(s[i].na_mmol_l));
        ordered &= s[i].hours >= previous;
        previous = s[i].hours;
    }
    *order = ordered ? NTR_OK : NTR_ERR_ORDER;
    return NTR_OK;
}

/* ---- the figures both the batch and the streaming paths produce -------- */

/*
 * One engine for both directions. A fall of the series is a rise of its
 * mirror image (every sodium negated), and (-a) - (-b) is b - a exactly in
 * IEEE arithmetic, so the same code, run on the mirror, counts falls
 * exactly as it counts rises. Everything is computed per direction into a
 * struct direction; finish() turns the two into a report.
 */

/* Which directions to compute. The 1.0 functions need only the rises: their
 * flags are limited to the 1.0 bits. */
#define DIR_RISE 1u
#define DIR_FALL 2u
#define DIR_BOTH (DIR_RISE | DIR_FALL)
/* With either: the caller reads neither worst_at_h nor breach indices. */
#define DIR_MAX_ONLY 4u

/* The figures of one direction ("rise" meaning a rise of the series read in
 * that direction: a fall for the mirror). */
struct direction {
    double max_24h;      /* largest rise within 24 h */
    double max_48h;
    double at_24h;       /* time of the earliest later sample reaching max_24h */
    double at_48h;
    double first_24h;    /* highest within 24 h of the first sample, minus the first */
    double open_6h;      /* last minus the lowest in the 6 h ending at it */
    double open_24h;
    double open_48h;
    double projected_24h; /* the same for the projected next sample */
    double projected_48h;
    int moving;          /* the last interval rises (projection defined) */
};

/* Everything the flags depend on. The batch engine and the watchers fill it
 * by different routes with the same floating-point operations on the same
 * values, so finish() gives identical results. */
struct figures {
    struct direction up;   /* the series */
    struct direction down; /* its mirror image: falls */
    double elapsed_h;      /* last time minus first time */
    double rate_per_h;
    int falling;           /* the last interval falls */
};

static const struct direction no_direction = {0.0, 0.0, NTR_COURSE_NO_TIME,
                                              NTR_COURSE_NO_TIME, 0.0, 0.0, 0.0,
                                              0.0, 0.0, 0.0, 0};

/* Later sample at most w after the earlier (w includes the tolerance). */
static int within(double t_earlier, double t_later, double w)
{
    return t_later - t_earlier <= w;
}

/* Over a limit; a limit of 0 is no limit (the 1.0 limits are never 0). */
static int over(double rise, double limit)
{
    return limit > 0.0 && rise > limit + NTR_CF_TOLERANCE;
}

/* Near a limit: something has risen, to within the margin below the limit
 * and not over it. (Without the first test a flat series would be "near" a
 * limit smaller than the margin.) */
static int near(double rise, double limit)
{
    return limit > 0.0 && rise > NTR_CF_TOLERANCE &&
           rise >= limit - NTR_CF_NEAR_MARGIN - NTR_CF_TOLERANCE &&
           rise <= limit + NTR_CF_TOLERANCE;
}

/* The breach threshold of a window scan: nothing is over a limit of 0. */
static double bar_of(double limit)
{
    return limit > 0.0 ? limit + NTR_CF_TOLERANCE : HUGE_VAL;
}

/* The 1.0 limits as course limits: raise, no fall limit. The 1.0 target
 * fires whenever its rise is short; with min_rise_24h 0 it never can, so
 * "only when the target is above 0" changes nothing. */
static ntr_course_limits course_of(const ntr_limits *lim)
{
    ntr_course_limits c;
    c.struct_size = sizeof c;
    c.goal = NTR_GOAL_RAISE;
    c.max_rise_24h = lim->max_rise_24h;
    c.max_rise_48h = lim->max_rise_48h;
    c.max_fall_24h = 0.0;
    c.max_fall_48h = 0.0;
    c.min_change_24h = lim->min_rise_24h;
    return c;
}

/* The 1.0 result read from a course report. */
static void correction_of(const ntr_course_report *r, ntr_correction *out)
{
    out->rise_first_24h = r->rise_first_24h;
    out->max_rise_24h = r->max_rise_24h;
    out->max_rise_48h = r->max_rise_48h;
    out->last_rate_per_h = r->last_rate_per_h;
    out->excess_mmol_l = r->excess_mmol_l;
    out->flags = r->flags & NTR_CF_ALL;
    out->reserved = 0u;
}

/* Flags of one direction's near and projected tests. */
static unsigned int trend_flags(const struct direction *d, double limit_24h,
                                double limit_48h, unsigned int near_bit,
                                unsigned int projected_bit)
{
    unsigned int flags = 0u;
    if (near(d->open_24h, limit_24h) || near(d->open_48h, limit_48h)) {
        flags |= near_bit;
    }
    if (d->moving && (over(d->projected_24h, limit_24h) ||
                      over(d->projected_48h, limit_48h))) {
        flags |= projected_bit;
    }
    return flags;
}

/* A window over its limit: sets its bit and, when it is the worst so far,
 * the excess and the time. Called in the documented tie order. */
static void judge_window(double figure, double limit, double at,
                         unsigned int bit, unsigned int *flags,
                         double *excess, double *worst_at)
{
    if (over(figure, limit)) {
        double e = figure - limit;
        *flags |= bit;
        if (e > *excess) { /* e > 0: the first window over always counts */
            *excess = e;
            *worst_at = at;
        }
    }
}

static int moved_more_than_margin(double change)
{
    return change > NTR_CF_WRONG_WAY_MARGIN + NTR_CF_TOLERANCE;
}

static unsigned int wrong_way(const struct figures *f, const ntr_course_limits *lim,
                              unsigned int flags)
{
    const unsigned int any_over = NTR_CF_OVER_24H | NTR_CF_OVER_48H |
                                  NTR_CF_FALL_OVER_24H | NTR_CF_FALL_OVER_48H;
    int moved;
    switch (lim->goal) {
    case NTR_GOAL_RAISE:
        moved = moved_more_than_margin(f->down.max_48h);
        break;
    case NTR_GOAL_LOWER:
        moved = moved_more_than_margin(f->up.max_48h);
        break;
    default: /* hold */
        moved = (flags & any_over) != 0u ||
                (lim->max_rise_24h <= 0.0 && lim->max_rise_48h <= 0.0 &&
                 moved_more_than_margin(f->up.max_48h)) ||
                (lim->max_fall_24h <= 0.0 && lim->max_fall_48h <= 0.0 &&
                 moved_more_than_margin(f->down.max_48h));
        break;
    }
    return moved ? NTR_CF_WRONG_WAY : 0u;
}

/* Inline (a hint): in the watchers' calls the figures then stay in
 * registers instead of going through memory (tests/bench/run-bench.sh). */
static inline void finish(const struct figures *f, const ntr_course_limits *lim,
                          unsigned int dirs, unsigned int extra_flags,
                          ntr_course_report *out)
{
    unsigned int flags = 0u;
    double excess = 0.0;
    double worst_at = NTR_COURSE_NO_TIME;
    double toward;

    judge_window(f->up.max_24h, lim->max_rise_24h, f->up.at_24h, NTR_CF_OVER_24H,
                 &flags, &excess, &worst_at);
    judge_window(f->up.max_48h, lim->max_rise_48h, f->up.at_48h, NTR_CF_OVER_48H,
                 &flags, &excess, &worst_at);
    /* Rises only (the 1.0 callers, whose flags stop at NTR_CF_ALL): the
     * fall figures are zeros and no fall bit could survive. */
    if ((dirs & DIR_FALL) != 0u) {
        judge_window(f->down.max_24h, lim->max_fall_24h, f->down.at_24h,
                     NTR_CF_FALL_OVER_24H, &flags, &excess, &worst_at);
        judge_window(f->down.max_48h, lim->max_fall_48h, f->down.at_48h,
                     NTR_CF_FALL_OVER_48H, &flags, &excess, &worst_at);
    }

    toward = lim->goal == NTR_GOAL_LOWER ? f->down.first_24h : f->up.first_24h;
    if (lim->min_change_24h > 0.0 && f->elapsed_h >= 24.0 - NTR_CF_TIME_TOLERANCE_H &&
        toward < lim->min_change_24h - NTR_CF_TOLERANCE) {
        flags |= NTR_CF_BELOW_TARGET;
    }
    if (f->falling) {
        flags |= NTR_CF_FALLING;
    }
    flags |= trend_flags(&f->up, lim->max_rise_24h, lim->max_rise_48h,
                         NTR_CF_NEAR_LIMIT, NTR_CF_PROJECTED_OVER);
    if (f->up.open_6h >= NTR_CF_RAPID_RISE - NTR_CF_TOLERANCE) {
        flags |= NTR_CF_RAPID_6H;
    }
    if ((dirs & DIR_FALL) != 0u) {
        flags |= trend_flags(&f->down, lim->max_fall_24h, lim->max_fall_48h,
                             NTR_CF_FALL_NEAR_LIMIT, NTR_CF_FALL_PROJECTED_OVER);
        flags |= wrong_way(f, lim, flags);
    }

    out->struct_size = sizeof *out;
    out->max_rise_24h = f->up.max_24h;
    out->max_rise_48h = f->up.max_48h;
    out->max_fall_24h = f->down.max_24h;
    out->max_fall_48h = f->down.max_48h;
    out->excess_mmol_l = excess;
    out->flags = flags | extra_flags;
    out->reserved = 0u;
    out->rise_first_24h = f->up.first_24h;
    out->fall_first_24h = f->down.first_24h;
    out->rise_now_24h = f->up.open_24h;
    out->fall_now_24h = f->down.open_24h;
    out->last_rate_per_h = f->rate_per_h;
    out->elapsed_h = f->elapsed_h;
    out->worst_at_h = worst_at;
}

/* The next sample "due" after the same interval as the last one, changed by
 * the same amount again. */
static ntr_sample projected_next(ntr_sample prev, ntr_sample last)
{
    ntr_sample next;
    next.hours = last.hours + (last.hours - prev.hours);
    next.na_mmol_l = last.na_mmol_l + (last.na_mmol_l - prev.na_mmol_l);
    return next;
}

/* Whether prev and last are a last interval: two time points closer than
 * the time tolerance count as one (as in the windows), so they give no
 * rate: this also keeps the rate finite when times are a subnormal apart. */
static int has_interval(int has_prev, ntr_sample prev, ntr_sample last)
{
    return has_prev && last.hours - prev.hours > NTR_CF_TIME_TOLERANCE_H;
}

/* The last interval, read on the series itself: the rate and the falling
 * flag. */
static void last_interval(int has_prev, ntr_sample prev, ntr_sample last,
                          struct figures *f)
{
    f->rate_per_h = 0.0;
    f->falling = 0;
    if (has_interval(has_prev, prev, last)) {
        f->rate_per_h = (last.na_mmol_l - prev.na_mmol_l) / (last.hours - prev.hours);
        f->falling = last.na_mmol_l < prev.na_mmol_l;
    }
}

/* Rise of the projected sample over the lowest kept sodium in its window
 * (HUGE_VAL when the window holds no real sample: then no rise). */
static double projected_rise(double projected_na, double window_min)
{
    double rise = projected_na - window_min;
    return rise > 0.0 ? rise : 0.0;
}

/* ---- batch engine ------------------------------------------------------- */

/* The scans' helpers are inlined even where the compiler's estimate says
 * no (it left point_at, a load, as a call on every read): the wrappers
 * below rely on it to compile the scans once per way of reading. Builds
 * for size (-Os, firmware) leave the choice to the compiler, which then
 * keeps one copy. */
#if defined(__GNUC__) && !defined(__OPTIMIZE_SIZE__)
#define ENGINE_INLINE static inline __attribute__((always_inline))
#else
#define ENGINE_INLINE static inline
#endif

/* a when c is true, else b, without a branch (ntri_select for an index). */
ENGINE_INLINE size_t select_index(int c, size_t a, size_t b)
{
    const size_t mask = (size_t)0 - (size_t)(c != 0);
    return (a & mask) | (b & ~mask);
}

static ntri_series array_series(const ntr_sample *s, size_t n)
{
    ntri_series v;
    v.samples = s;
    v.point = NULL;
    v.ctx = NULL;
    v.n = n;
    return v;
}

/* How a scan reads the series: READ_MIRROR reads its mirror image;
 * READ_ARRAY promises an array series (v->point NULL), so that the
 * compiler, seeing a constant, drops the call path from the loops. */
#define READ_MIRROR 1
#define READ_ARRAY 2
/* Only the largest rises are wanted: not which sample reaches them first
 * (worst_at_h) nor the first breach (the 1.0 assessment without breach,
 * which reads neither), so the scans skip that bookkeeping. */
#define READ_MAX_ONLY 4

/* Sample i of the series, or of its mirror image. */
ENGINE_INLINE ntr_sample point_at(const ntri_series *v, size_t i, int read)
{
    ntr_sample s = (read & READ_ARRAY) != 0 || v->point == NULL
                       ? v->samples[i]
                       : v->point(v->ctx, i);
    if ((read & READ_MIRROR) != 0) {
        s.na_mmol_l = -s.na_mmol_l;
    }
    return s;
}

struct window_scan {
    double max_rise;
    size_t at;         /* smallest later index of a pair reaching max_rise */
    size_t first_over; /* first index >= from whose window rise is over bar */
};

/* A pair's rise, ending at index j: keeps the largest and, among the pairs
 * reaching it, the smallest j (the order the pairs are visited in does not
 * matter, so the watcher, which visits them by j, agrees). Written as
 * selects, not branches: whether a pair beats the best so far depends on
 * the data, and on short series (a cohort, tests/bench/bench_cohort.py)
 * the branch on it had a quarter of the mispredictions (tests/bench/notes.md,
 * "Correction assessment per sample").
 * The larger of rise and *best is taken with the plain comparison, which
 * the compiler makes a max instruction: on a tie it keeps *best instead of
 * rise, the same number (two equal doubles differ in bits only as +0 and
 * -0, and a rise is never -0: x - y is -0 only for x = -0, and no sodium,
 * negated or not, is 0). With READ_MAX_ONLY the index is not kept. */
ENGINE_INLINE void take_rise(int read, double rise, size_t j, double *best,
                             size_t *at)
{
    if ((read & READ_MAX_ONLY) == 0) {
        const int better = (rise > *best) | ((rise == *best) & (j < *at));
        *at = select_index(better, j, *at);
    }
    *best = rise > *best ? rise : *best;
}

/*
 * The pairs between a block [start, end) and the one before it
 * [prev_start, start) (see scan_window_body): walking the later block
 * backwards, the earlier samples within w of p form a suffix
 * [taken, start) of the earlier block that only grows, so a running
 * minimum of that suffix suffices. The loops stay loops: written as one
 * merge with selects (no branch on the times at all), each step's read
 * waited for the previous step's comparison, and series of regular
 * spacing, whose loop exits the processor predicts, became slower
 * (tests/bench/notes.md, "Correction assessment per sample").
 */
ENGINE_INLINE void cross_pairs(const ntri_series *v, int read, double w,
                               double bar, size_t from, size_t prev_start,
                               size_t start, size_t end, double *best,
                               size_t *at, size_t *block_first)
{
    size_t taken = start; /* [taken, start) of the earlier block is in reach */
    double cross_min = HUGE_VAL;
    size_t p = end;
    double b = *best;
    size_t a = *at;
    size_t bf = *block_first;
    while (p > start) {
        ntr_sample sp;
        p--;
        sp = point_at(v, p, read);
        while (taken > prev_start) {
            const ntr_sample sq = point_at(v, taken - 1, read);
            if (!within(sq.hours, sp.hours, w)) {
                break;
            }
            taken--;
            if (sq.na_mmol_l < cross_min) {
                cross_min = sq.na_mmol_l;
            }
        }
        if (taken < start) {
            const double rise = sp.na_mmol_l - cross_min;
            take_rise(read, rise, p, &b, &a);
            if ((read & READ_MAX_ONLY) == 0 && rise > bar && p >= from && p < bf) {
                bf = p;
            }
        }
    }
    *best = b;
    *at = a;
    *block_first = bf;
}

/*
 * Largest rise between samples at most w apart, in O(n) time and O(1)
 * memory, without the window-minimum deque (which needs O(n) memory).
 *
 * Cut the series into blocks: a block starts at sample b and holds every
 * later sample within w of b. Inside a block every pair is within w.
 * Samples two or more blocks apart are never within w (if i is before the
 * start c of the next block and j at or after the start of the one after,
 * within(i, j) would imply within(c, that start), which failed). So only
 * two kinds of pair remain:
 *  - inside a block: a forward pass with a running minimum;
 *  - between a block and the one before: walk the later block backwards;
 *    the earlier samples within w of it form a suffix of the earlier block
 *    that only grows, so a running minimum of that suffix suffices.
 * Each sample is read about three times per window length. The same
 * within() test defines blocks and pairs, so rounding cannot open a gap.
 * The backward walk also yields, per sample, whether its window breaches
 * `bar`; the first such index at or after `from` is reported (the earliest
 * block with one wins, and inside a block the smaller of the two kinds).
 */
ENGINE_INLINE void scan_window_body(const ntri_series *v, int read, double w,
                                    double bar, size_t from,
                                    struct window_scan *res)
{
    const size_t n = v->n;
    size_t prev_start = 0;
    size_t start = 0;
    int have_prev = 0;
    double best = 0.0;
    size_t at = NTRI_NONE;
    size_t first = NTRI_NONE;

    while (start < n) {
        const ntr_sample s0 = point_at(v, start, read);
        double run_min = s0.na_mmol_l;
        size_t end = start + 1;
        size_t block_first = NTRI_NONE;

        for (; end < n; end++) {
            const ntr_sample sj = point_at(v, end, read);
            double rise;
            if (!within(s0.hours, sj.hours, w)) {
                break;
            }
            rise = sj.na_mmol_l - run_min;
            take_rise(read, rise, end, &best, &at);
            if ((read & READ_MAX_ONLY) == 0 && rise > bar && end >= from &&
                block_first == NTRI_NONE) {
                block_first = end;
            }
            if (sj.na_mmol_l < run_min) {
                run_min = sj.na_mmol_l;
            }
        }

        if (have_prev) {
            cross_pairs(v, read, w, bar, from, prev_start, start, end, &best,
                        &at, &block_first);
        }

        if (first == NTRI_NONE) {
            first = block_first;
        }
        prev_start = start;
        start = end;
        have_prev = 1;
    }
    res->max_rise = best;
    res->at = at;
    res->first_over = first;
}

/* Time of the sample at index `at`, or NTR_COURSE_NO_TIME for none or when
 * nothing rose (then no window can be over its limit). */
static double time_at(const ntri_series *v, size_t at, double rise)
{
    return at != NTRI_NONE && rise > 0.0 ? point_at(v, at, 0).hours : NTR_COURSE_NO_TIME;
}

/* Walks back from index `end` (exclusive) over the samples within w
 * before time t, lowering *lowest to their lowest sodium; returns the index
 * where it stopped (the first sample of the stretch). */
ENGINE_INLINE size_t extend_min_back(const ntri_series *v, int read, size_t end,
                              double t, double w, double *lowest)
{
    double m = *lowest;
    while (end > 0) {
        const ntr_sample s = point_at(v, end - 1, read);
        if (!within(s.hours, t, w)) {
            break;
        }
        if (s.na_mmol_l < m) {
            m = s.na_mmol_l;
        }
        end--;
    }
    *lowest = m;
    return end;
}

/* The latest sample taken strictly before the last one's time. */
ENGINE_INLINE int previous_time_point(const ntri_series *v, int read, ntr_sample *prev)
{
    const ntr_sample last = point_at(v, v->n - 1, read);
    size_t i;
    for (i = v->n - 1; i > 0; i--) {
        const ntr_sample s = point_at(v, i - 1, read);
        if (s.hours < last.hours) {
            *prev = s;
            return 1;
        }
    }
    *prev = last;
    return 0;
}

/* first_24h, and the windows ending at the last sample and at the
 * projected next one: a walk forward over the first 24 h and one backward
 * over the last 48 h. */
ENGINE_INLINE void scan_ends_body(const ntri_series *v, int read,
                                  struct direction *d)
{
    const size_t n = v->n;
    const ntr_sample first = point_at(v, 0, read);
    const ntr_sample last = point_at(v, n - 1, read);
    ntr_sample prev;
    ntr_sample next = last;
    int has_prev;
    double min_6, min_24, min_48;
    double next_min_24 = HUGE_VAL;
    double next_min_48 = HUGE_VAL;
    double rise_first = 0.0;
    double lowest;
    size_t i;

    for (i = 1; i < n; i++) {
        const ntr_sample s = point_at(v, i, read);
        if (!within(first.hours, s.hours, WINDOW_24H)) {
            break;
        }
        if (s.na_mmol_l - first.na_mmol_l > rise_first) {
            rise_first = s.na_mmol_l - first.na_mmol_l;
        }
    }

    has_prev = previous_time_point(v, read, &prev);
    d->moving = has_interval(has_prev, prev, last) && last.na_mmol_l > prev.na_mmol_l;

    /* The 6 h, 24 h and 48 h windows ending at the last sample are nested
     * suffixes of the series: one backward walk in three stretches. */
    lowest = last.na_mmol_l;
    i = n - 1;
    i = extend_min_back(v, read, i, last.hours, WINDOW_6H, &lowest);
    min_6 = lowest;
    i = extend_min_back(v, read, i, last.hours, WINDOW_24H, &lowest);
    min_24 = lowest;
    (void)extend_min_back(v, read, i, last.hours, WINDOW_48H, &lowest);
    min_48 = lowest;

    /* The windows ending at the projected next sample: shorter suffixes. */
    if (d->moving) {
        next = projected_next(prev, last);
        lowest = HUGE_VAL;
        i = extend_min_back(v, read, n, next.hours, WINDOW_24H, &lowest);
        next_min_24 = lowest;
        (void)extend_min_back(v, read, i, next.hours, WINDOW_48H, &lowest);
        next_min_48 = lowest;
    }

    d->first_24h = rise_first;
    d->open_6h = last.na_mmol_l - min_6;
    d->open_24h = last.na_mmol_l - min_24;
    d->open_48h = last.na_mmol_l - min_48;
    d->projected_24h = d->moving ? projected_rise(next.na_mmol_l, next_min_24) : 0.0;
    d->projected_48h = d->moving ? projected_rise(next.na_mmol_l, next_min_48) : 0.0;
}

/* The scans compiled once per way of reading: for a series in an array,
 * where every read is a load the compiler can keep in registers (rises
 * only for the 1.0 assessment, rises or falls with all the bookkeeping for
 * the course), and for points computed on demand (the plan checks), where
 * a read is a call. Same code, same operations, same order. */
static void scan_window(const ntri_series *v, int read, double w, double bar,
                        size_t from, struct window_scan *res)
{
    if (v->point != NULL) {
        scan_window_body(v, read, w, bar, from, res);
    } else if (read == READ_MAX_ONLY) { /* the 1.0 assessment: rises only */
        scan_window_body(v, READ_ARRAY | READ_MAX_ONLY, w, bar, from, res);
    } else {
        scan_window_body(v, (read & READ_MIRROR) | READ_ARRAY, w, bar, from, res);
    }
}

static void scan_ends(const ntri_series *v, int read, struct direction *d)
{
    if (v->point != NULL) {
        scan_ends_body(v, read & READ_MIRROR, d);
    } else if ((read & READ_MIRROR) == 0) {
        scan_ends_body(v, READ_ARRAY, d);
    } else {
        scan_ends_body(v, READ_MIRROR | READ_ARRAY, d);
    }
}

/* One direction of the series: both windows, their first breaches, and
 * the ends. */
static void scan_direction(const ntri_series *v, int read, double limit_24h,
                           double limit_48h, size_t from, struct direction *d,
                           size_t *first_24h, size_t *first_48h)
{
    struct window_scan w24;
    struct window_scan w48;
    scan_window(v, read, WINDOW_24H, bar_of(limit_24h), from, &w24);
    scan_window(v, read, WINDOW_48H, bar_of(limit_48h), from, &w48);
    scan_ends(v, read, d);
    d->max_24h = w24.max_rise;
    d->max_48h = w48.max_rise;
    d->at_24h = time_at(v, w24.at, w24.max_rise);
    d->at_48h = time_at(v, w48.at, w48.max_rise);
    *first_24h = w24.first_over;
    *first_48h = w48.first_over;
}

/* The engine: the directions asked for (the others read as no change). */
static void course_engine(const ntri_series *v, const ntr_course_limits *lim,
                          size_t from, unsigned int dirs, ntr_course_report *out,
                          ntri_course_breach *breach)
{
    struct figures f;
    ntri_course_breach b = {NTRI_NONE, NTRI_NONE, NTRI_NONE, NTRI_NONE};
    const int only = (dirs & DIR_MAX_ONLY) != 0u ? READ_MAX_ONLY : 0;
    ntr_sample prev;
    int has_prev;

    f.up = no_direction;
    f.down = no_direction;
    if ((dirs & DIR_RISE) != 0u) {
        scan_direction(v, only, lim->max_rise_24h, lim->max_rise_48h, from, &f.up,
                       &b.rise_24h, &b.rise_48h);
    }
    if ((dirs & DIR_FALL) != 0u) {
        scan_direction(v, only | READ_MIRROR, lim->max_fall_24h, lim->max_fall_48h,
                       from, &f.down,
                       &b.fall_24h, &b.fall_48h);
    }
    f.elapsed_h = point_at(v, v->n - 1, 0).hours - point_at(v, 0, 0).hours;
    has_prev = previous_time_point(v, 0, &prev);
    last_interval(has_prev, prev, point_at(v, v->n - 1, 0), &f);
    finish(&f, lim, dirs, 0u, out);
    if (breach != NULL) {
        *breach = b;
    }
}

void ntri_course_assess(const ntri_series *v, const ntr_course_limits *lim,
                        size_t from, ntr_course_report *out,
                        ntri_course_breach *breach)
{
    course_engine(v, lim, from, DIR_BOTH, out, breach);
}

void ntri_assess(const ntri_series *v, const ntr_limits *lim, size_t from,
                 ntr_correction *out, ntri_breach *breach)
{
    const ntr_course_limits course = course_of(lim);
    ntr_course_report r;
    ntri_course_breach b;
    /* Without breach nothing reads where the windows peak: the 1.0 result
     * has no worst_at_h. */
    course_engine(v, &course, from, breach != NULL ? DIR_RISE : DIR_RISE | DIR_MAX_ONLY,
                  &r, breach != NULL ? &b : NULL);
    correction_of(&r, out);
    if (breach != NULL) {
        breach->first_over_24h = b.rise_24h;
        breach->first_over_48h = b.rise_48h;
    }
}

int ntr_correction_assess(const ntr_sample *s, size_t n, const ntr_limits *lim,
                          ntr_correction *out)
{
    ntri_series v;
    int order;
    if (s == NULL || lim == NULL || out == NULL) {
        return NTR_ERR_NULL;
    }
    if (n == 0) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntri_samples_check(s, n, &order));
    NTR_TRY(ntri_limits_check(lim));
    NTR_TRY(order);
    v = array_series(s, n);
    /* from = n: no breach index is wanted. */
    ntri_assess(&v, lim, n, out, NULL);
    return NTR_OK;
}

int ntr_course_assess(const ntr_sample *s, size_t n, const ntr_course_limits *lim,
                      ntr_course_report *out)
{
    ntri_series v;
    int order;
    if (s == NULL || lim == NULL || out == NULL) {
        return NTR_ERR_NULL;
    }
    if (n == 0) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntri_course_limits_kind(lim));
    NTR_TRY(ntri_course_report_check(out));
    NTR_TRY(ntri_samples_check(s, n, &order));
    NTR_TRY(ntri_course_limits_values(lim));
    NTR_TRY(order);
    v = array_series(s, n);
    ntri_course_assess(&v, lim, n, out, NULL);
    return NTR_OK;
}

/* ---- streaming watchers ---------------------------------------------------- */

/*
 * Both watchers (1.0 ntr_watch, rises only; 1.1 ntr_course_watch, both
 * directions) share one ring engine. A ring holds a monotonic deque: the
 * samples of the last 48 h that are lower than every sample after them,
 * oldest first, so sodium strictly increases along it. The lowest sodium
 * of any window ending at the last sample is the first ring entry inside
 * that window; front24 and front6 remember where the 24 h and 6 h windows
 * begin. A sample that is not in the ring was pushed out by a later, lower
 * (or equal) one, which lies in every window the first one lies in, so no
 * minimum is lost. The course watcher's second ring holds the mirror image
 * (sodium negated), whose minima are the series' maxima: its falls.
 *
 * Cost of a push (issue 16), k entries kept: the state check reads each
 * entry once (O(k): the header promises to refuse a state damaged
 * anywhere, so no entry can be trusted from an earlier call); each window
 * start and the back drop is a search of the ordered ring, O(log k); a
 * compaction reads the k - 1 pairs and moves at most (k - 2) / 2 entries.
 */

/* Where a ring's entries are, in whichever state holds them. */
struct ring_pos {
    unsigned int cap;
    unsigned int head;
    unsigned int kept;
    unsigned int front24;
    unsigned int front6;
};

/* Ring index of offset k (k <= cap, head < cap): a compare instead of a
 * division, since the capacity is not a constant here. */
static unsigned int ring_index(const struct ring_pos *p, unsigned int k)
{
    const unsigned int i = p->head + k;
    return i >= p->cap ? i - p->cap : i;
}

static const ntr_sample *ring_get(const ntr_sample *e, const struct ring_pos *p,
                                  unsigned int k)
{
    return &e[ring_index(p, k)];
}

/* Structural checks, so a damaged state can never make an index leave the
 * ring. */
static int ring_shape_sound(const struct ring_pos *p, unsigned int seen)
{
    if (p->head >= p->cap || p->kept > p->cap || (seen == 0u) != (p->kept == 0u)) {
        return 0;
    }
    return p->kept == 0u ||
           (p->front24 < p->kept && p->front6 < p->kept && p->front6 >= p->front24);
}

/* A stored time, or a stored sodium read in direction `sign` (+1 the
 * series, -1 its mirror image): finite and inside the accepted ranges
 * (each comparison fails for NaN). */
static int time_sound(double hours)
{
    return hours >= -NTR_HOURS_MAX && hours <= NTR_HOURS_MAX;
}

static int na_sound(double na, double sign)
{
    const double v = sign * na;
    return v >= NTR_NA_MIN && v <= NTR_NA_MAX;
}

static int sample_sound(ntr_sample s, double sign)
{
    return time_sound(s.hours) && na_sound(s.na_mmol_l, sign);
}

/* A stored change: 0 up to the widest the sodium range allows. */
static int change_sound(double x)
{
    return x >= 0.0 && x <= NTR_NA_MAX - NTR_NA_MIN;
}

/* Entries [from, to) of the ring array, each in order after *before (the
 * last of them returned in *before). */
static int stretch_in_order(const ntr_sample *e, unsigned int from, unsigned int to,
                            ntr_sample *before)
{
    double hours = before->hours;
    double na = before->na_mmol_l;
    unsigned int k;
    for (k = from; k < to; k++) {
        if (!(e[k].hours >= hours && e[k].na_mmol_l > na)) {
            return 0;
        }
        hours = e[k].hours;
        na = e[k].na_mmol_l;
    }
    before->hours = hours;
    before->na_mmol_l = na;
    return 1;
}

/*
 * Every kept entry, in one walk from the oldest. Each push keeps a ring in
 * order: times never decrease (results come in time order; a merge keeps
 * the later time of its pair) and sodium strictly increases (a new sample
 * pushes out every entry not lower than it; a merge keeps the lower
 * sodium). So a ring is sound when the oldest entry is at or above the
 * lower ends of the ranges, each entry is in order after the one before,
 * and the newest is at or below the upper ends: one ordered comparison per
 * entry and number (each false for NaN) proves every entry finite and in
 * range, and proves the order the searches below rely on (issue 16). A
 * ring out of order cannot come from pushes and is refused as damaged.
 * `sign` +1 reads the series, -1 its mirror image (stored negated).
 */
static int ring_numbers_sound(const ntr_sample *e, const struct ring_pos *p, double sign)
{
    const unsigned int end = p->head + p->kept;
    ntr_sample before;
    if (p->kept == 0u) {
        return 1;
    }
    before = e[p->head];
    if (!(before.hours >= -NTR_HOURS_MAX &&
          before.na_mmol_l >= (sign > 0.0 ? NTR_NA_MIN : -NTR_NA_MAX))) {
        return 0;
    }
    /* The walk starts by comparing the oldest entry with itself: its time
     * passes (equal), and its sodium passes against -infinity. */
    before.na_mmol_l = -HUGE_VAL;
    if (end <= p->cap) {
        if (!stretch_in_order(e, p->head, end, &before)) {
            return 0;
        }
    } else if (!stretch_in_order(e, p->head, p->cap, &before) ||
               !stretch_in_order(e, 0u, end - p->cap, &before)) {
        return 0;
    }
    return before.hours <= NTR_HOURS_MAX &&
           before.na_mmol_l <= (sign > 0.0 ? NTR_NA_MAX : -NTR_NA_MIN);
}

/* Spans [from, to) of the ring array, each change_sound(). Compared as
 * doubles: a float comparison is widened anyway on targets that evaluate
 * floats in double (FLT_EVAL_METHOD 1, such as s390x). */
static int stretch_spans_sound(const float *span, unsigned int from, unsigned int to)
{
    unsigned int k;
    for (k = from; k < to; k++) {
        if (!change_sound((double)span[k])) {
            return 0;
        }
    }
    return 1;
}

/* The course watcher's spans of the kept entries, as the two contiguous
 * stretches of the ring. */
static int spans_sound(const float *span, const struct ring_pos *p)
{
    const unsigned int end = p->head + p->kept;
    if (end <= p->cap) {
        return stretch_spans_sound(span, p->head, end);
    }
    return stretch_spans_sound(span, p->head, p->cap) &&
           stretch_spans_sound(span, 0u, end - p->cap);
}

/*
 * Searches of a ring in order (ring_numbers_sound). "Within w before time
 * t" fails for the entries before some offset and holds from it on (t -
 * hours never increases along the ring, as IEEE subtraction is monotone
 * in each operand), and so does "sodium at least x" (sodium strictly
 * increases). A walk one entry at a time finds that offset in d + 1 steps,
 * d its distance from where the walk starts; galloping (probes at d = 0,
 * 1, 3, 7, ..., then bisection of the last step) finds the same offset in
 * at most 2 log2(d + 1) + 2 probes, and in one when d = 0, the common case
 * of a steady push.
 */

/* Probes a search makes one entry at a time before it gallops: a steady
 * push moves each window start by a step or two, and a plain step costs
 * less than a galloping one. */
#define WALK_STEPS 4u

/* The first offset in [lo, hi) within w before t (hi when none), given
 * that "within" fails at lo (galloping, then bisection). */
static unsigned int gallop_within(const ntr_sample *e, const struct ring_pos *p,
                                  unsigned int lo, unsigned int hi, double t, double w)
{
    unsigned int step = 1u;
    unsigned int failed = lo; /* "within" fails here and before */
    while (hi - failed > step && !within(ring_get(e, p, failed + step)->hours, t, w)) {
        failed += step;
        step *= 2u;
    }
    lo = failed + 1u;
    if (hi - failed > step) {
        hi = failed + step; /* holds there */
    }
    while (lo < hi) {
        const unsigned int mid = lo + (hi - lo) / 2u;
        if (within(ring_get(e, p, mid)->hours, t, w)) {
            hi = mid;
        } else {
            lo = mid + 1u;
        }
    }
    return lo;
}

/* The first offset in [lo, hi) within w before t (hi when none). Inline
 * (a hint), so the walk stays close to the plain loops it replaced. */
static inline unsigned int first_within(const ntr_sample *e, const struct ring_pos *p,
                                 unsigned int lo, unsigned int hi, double t, double w)
{
    const unsigned int stop = lo + WALK_STEPS; /* lo <= the capacity: no overflow */
    while (lo < hi && !within(ring_get(e, p, lo)->hours, t, w)) {
        lo++;
        if (lo == stop && lo < hi) {
            return gallop_within(e, p, lo - 1u, hi, t, w); /* it failed at lo - 1 */
        }
    }
    return lo;
}

/* The first offset in [lo, hi) whose sodium is at least na (hi when
 * none), given that it holds from hi on: galloping backward, then
 * bisection. */
static unsigned int gallop_not_lower(const ntr_sample *e, const struct ring_pos *p,
                                     unsigned int lo, unsigned int hi, double na)
{
    unsigned int step = 1u;
    unsigned int held = hi; /* the test holds from here on */
    while (held - lo >= step && ring_get(e, p, held - step)->na_mmol_l >= na) {
        held -= step;
        step *= 2u;
    }
    if (held - lo >= step) {
        lo = held - step + 1u; /* fails at held - step */
    }
    while (lo < held) {
        const unsigned int mid = lo + (held - lo) / 2u;
        if (ring_get(e, p, mid)->na_mmol_l >= na) {
            held = mid;
        } else {
            lo = mid + 1u;
        }
    }
    return held;
}

/* The first offset in [lo, hi) whose sodium is at least na (hi when
 * none), walking back from hi - 1: the entries a new sample pushes out
 * from the back. */
static inline unsigned int first_not_lower(const ntr_sample *e, const struct ring_pos *p,
                                           unsigned int lo, unsigned int hi, double na)
{
    const unsigned int stop = hi - WALK_STEPS; /* below 0 it wraps: then never met */
    while (hi > lo && ring_get(e, p, hi - 1u)->na_mmol_l >= na) {
        hi--;
        if (hi == stop && hi > lo) {
            return gallop_not_lower(e, p, lo, hi, na); /* it holds from hi on */
        }
    }
    return hi;
}

/* How many entries a new sample pushes out: from the front, those no
 * longer within 48 h; from the back, those not lower than it. */
static void ring_drops(const ntr_sample *e, const struct ring_pos *p, ntr_sample s,
                       unsigned int *drop_front, unsigned int *drop_back)
{
    const unsigned int f = first_within(e, p, 0u, p->kept, s.hours, WINDOW_48H);
    *drop_front = f;
    *drop_back = p->kept - first_not_lower(e, p, f, p->kept, s.na_mmol_l);
}

static unsigned int front_after(unsigned int front, unsigned int dropped)
{
    return front >= dropped ? front - dropped : 0u;
}

/* Entries before a front were already outside its window; if the front
 * itself was pushed out, the next sample is the first inside. */
static void ring_drop(struct ring_pos *p, unsigned int drop_front, unsigned int drop_back)
{
    p->head = ring_index(p, drop_front);
    p->front24 = front_after(p->front24, drop_front);
    p->front6 = front_after(p->front6, drop_front);
    p->kept -= drop_front + drop_back;
    if (p->front24 > p->kept) {
        p->front24 = p->kept;
    }
    if (p->front6 > p->kept) {
        p->front6 = p->kept;
    }
}

/* The pairs whose second entry is at ring index from .. to - 1 (one
 * contiguous stretch): merged span (m2 + span2) - m1, m1 the sodium before
 * (carried in *before); keeps the smallest, the first on ties, as the ring
 * index of its second entry. */
static void scan_pairs(const ntr_sample *e, const float *span, unsigned int from,
                       unsigned int to, double *before, double *best_span,
                       unsigned int *best_second)
{
    double m1 = *before;
    double smallest = *best_span;
    unsigned int at = *best_second;
    unsigned int i;
    for (i = from; i < to; i++) {
        const double merged = e[i].na_mmol_l + (double)span[i] - m1;
        if (merged < smallest) {
            smallest = merged;
            at = i;
        }
        m1 = e[i].na_mmol_l;
    }
    *before = m1;
    *best_span = smallest;
    *best_second = at;
}

/*
 * Makes room for one entry (kept >= 2): merges an adjacent pair into one
 * entry with the later time and the lower sodium. A window that holds the
 * later time then sees a minimum no higher than its true one (the true
 * minimum lies at or after the merged pair's first entry, and the ring
 * increases), so no rise is under-reported. An entry stands for a group of
 * original samples; span[] holds, per entry, its highest original sodium
 * minus its stored one: the most it can over-report by. The pair merged is
 * the one whose merged span is smallest (spans are float: they only choose
 * the pair, never enter a result). Fronts keep pointing at the first entry
 * inside their window.
 */
static void ring_compact(ntr_sample *e, float *span, struct ring_pos *p)
{
    const unsigned int end = p->head + p->kept;
    double best_span = HUGE_VAL;
    double before = e[p->head].na_mmol_l;
    unsigned int second = p->head + 1u; /* ring index of the best pair's second */
    unsigned int best;
    unsigned int k;
    if (end <= p->cap) {
        scan_pairs(e, span, p->head + 1u, end, &before, &best_span, &second);
    } else {
        scan_pairs(e, span, p->head + 1u, p->cap, &before, &best_span, &second);
        scan_pairs(e, span, 0u, end - p->cap, &before, &best_span, &second);
    }
    /* Offset of the pair's first entry. */
    best = (second >= p->head ? second - p->head : second + p->cap - p->head) - 1u;
    /* The merged entry (later time, lower sodium) takes one slot of the
     * pair; the entries on the shorter side of it move up by one slot, so
     * a compaction moves at most (kept - 2) / 2 entries. */
    if (best <= p->kept - 2u - best) {
        const unsigned int to = ring_index(p, best + 1u);
        e[to].na_mmol_l = ring_get(e, p, best)->na_mmol_l;
        span[to] = (float)best_span;
        for (k = best; k > 0u; k--) {
            const unsigned int dst = ring_index(p, k);
            const unsigned int src = ring_index(p, k - 1u);
            e[dst] = e[src];
            span[dst] = span[src];
        }
        p->head = ring_index(p, 1u);
    } else {
        const unsigned int to = ring_index(p, best);
        e[to].hours = ring_get(e, p, best + 1u)->hours;
        span[to] = (float)best_span;
        for (k = best + 1u; k + 1u < p->kept; k++) {
            const unsigned int dst = ring_index(p, k);
            const unsigned int src = ring_index(p, k + 1u);
            e[dst] = e[src];
            span[dst] = span[src];
        }
    }
    p->kept--;
    if (p->front24 > best) {
        p->front24--;
    }
    if (p->front6 > best) {
        p->front6--;
    }
}

/* Appends the sample (room made) and moves the fronts to the first entry
 * inside each window ending at it. */
static void ring_insert(ntr_sample *e, struct ring_pos *p, ntr_sample s)
{
    e[ring_index(p, p->kept)] = s;
    p->kept++;
    /* The new entry is inside both windows, so each front stays below kept. */
    p->front24 = first_within(e, p, p->front24, p->kept, s.hours, WINDOW_24H);
    if (p->front6 < p->front24) {
        p->front6 = p->front24;
    }
    p->front6 = first_within(e, p, p->front6, p->kept, s.hours, WINDOW_6H);
}

/* The largest rises so far, with the window ending at the new sample s
 * (already inserted). Strictly larger only: the time kept is that of the
 * earliest sample reaching the maximum, as the batch engine keeps. */
static void ring_track(const ntr_sample *e, const struct ring_pos *p, ntr_sample s,
                       double *max_24h, double *max_48h, double *at_24h, double *at_48h)
{
    double open = s.na_mmol_l - ring_get(e, p, 0u)->na_mmol_l;
    if (open > *max_48h) {
        *max_48h = open;
        *at_48h = s.hours;
    }
    open = s.na_mmol_l - ring_get(e, p, p->front24)->na_mmol_l;
    if (open > *max_24h) {
        *max_24h = open;
        *at_24h = s.hours;
    }
}

/* The windows ending at the last sample and at the projected next one,
 * read from a ring (the last sample and prev in the ring's direction). */
static void ring_direction(const ntr_sample *e, const struct ring_pos *p, int has_prev,
                           ntr_sample prev, ntr_sample last, struct direction *d)
{
    d->open_48h = last.na_mmol_l - ring_get(e, p, 0u)->na_mmol_l;
    d->open_24h = last.na_mmol_l - ring_get(e, p, p->front24)->na_mmol_l;
    d->open_6h = last.na_mmol_l - ring_get(e, p, p->front6)->na_mmol_l;
    d->moving = has_interval(has_prev, prev, last) && last.na_mmol_l > prev.na_mmol_l;
    d->projected_24h = 0.0;
    d->projected_48h = 0.0;
    if (d->moving) {
        const ntr_sample next = projected_next(prev, last);
        /* The first entry inside the projected window is its minimum (none
         * inside: no rise). The projected windows start at or after the
         * current ones, so the searches start at their fronts (0 for 48 h). */
        unsigned int k = first_within(e, p, 0u, p->kept, next.hours, WINDOW_48H);
        if (k < p->kept) {
            d->projected_48h = projected_rise(next.na_mmol_l, ring_get(e, p, k)->na_mmol_l);
        }
        k = first_within(e, p, p->front24, p->kept, next.hours, WINDOW_24H);
        if (k < p->kept) {
            d->projected_24h = projected_rise(next.na_mmol_l, ring_get(e, p, k)->na_mmol_l);
        }
    }
}

static ntr_sample mirrored(ntr_sample s)
{
    s.na_mmol_l = -s.na_mmol_l;
    return s;
}

/* ---- the 1.0 watcher (ntr_watch; layout fixed) -------------------------- */

static struct ring_pos watch_pos(const ntr_watch *w)
{
    struct ring_pos p;
    p.cap = NTR_WATCH_CAPACITY;
    p.head = w->head;
    p.kept = w->kept;
    p.front24 = w->front24;
    p.front6 = w->front6;
    return p;
}

static void watch_store_pos(ntr_watch *w, const struct ring_pos *p)
{
    w->head = p->head;
    w->kept = p->kept;
    w->front24 = p->front24;
    w->front6 = p->front6;
}

/* The numbers a state's samples and figures may hold: damaged ones (NaN,
 * infinities, out of range) are refused rather than reported. */
static int watch_numbers_sound(const ntr_watch *w, const struct ring_pos *p)
{
    if (w->seen >= 1u && (!sample_sound(w->first, 1.0) || !sample_sound(w->last, 1.0))) {
        return 0;
    }
    if (w->seen == 2u && !sample_sound(w->prev, 1.0)) {
        return 0;
    }
    return change_sound(w->rise_first_24h) && change_sound(w->max_rise_24h) &&
           change_sound(w->max_rise_48h) && ring_numbers_sound(w->ring, p, 1.0);
}

/* Cheap structural checks first, so a damaged or uninitialised state can
 * never make an index leave the ring. */
static int watch_sound(const ntr_watch *w)
{
    struct ring_pos p;
    if (w->magic != WATCH_MAGIC || w->seen > 2u || w->first_open > 1u) {
        return 0;
    }
    p = watch_pos(w);
    if (!ring_shape_sound(&p, w->seen) || !limits_sound(&w->limits)) {
        return 0;
    }
    return watch_numbers_sound(w, &p);
}

int ntr_watch_init(const ntr_limits *lim, ntr_watch *w)
{
    static const ntr_sample zero_sample = {0.0, 0.0};
    ntr_limits limits;
    unsigned int k;
    if (lim == NULL || w == NULL) {
        return NTR_ERR_NULL;
    }
    if (!limits_sound(lim)) {
        return limits_status(lim); /* as ntri_limits_check(), inlined */
    }
    limits = *lim; /* lim may point into *w */
    /* Member by member, after the checks, rather than through a zeroed
     * local copy: that put the whole 2.2 KB state on the stack, far over a
     * firmware stack budget (tests/bench/run-bench.sh measures frames). */
    w->magic = WATCH_MAGIC;
    w->kept = 0u;
    w->head = 0u;
    w->front24 = 0u;
    w->front6 = 0u;
    w->seen = 0u;
    w->first_open = 0u;
    w->reserved_u = 0u;
    w->limits = limits;
    w->first = zero_sample;
    w->prev = zero_sample;
    w->last = zero_sample;
    w->rise_first_24h = 0.0;
    w->max_rise_24h = 0.0;
    w->max_rise_48h = 0.0;
    for (k = 0; k < 3u; k++) {
        w->reserved_d[k] = 0.0;
    }
    /* The ring is left as it is: an entry is read only at offsets below
     * `kept`, and each of those was written by the push that kept it.
     * Clearing 2 KB would be nine tenths of the cost of this call
     * (tests/bench/run-bench.sh); the header documents that the unused
     * entries' bytes are unspecified. */
    return NTR_OK;
}

/* The assessment of a sound state that holds at least one sample. */
static void watch_report(const ntr_watch *w, ntr_correction *out)
{
    const ntr_course_limits course = course_of(&w->limits);
    const struct ring_pos p = watch_pos(w);
    struct figures f;
    ntr_course_report r;

    f.up = no_direction;
    f.down = no_direction;
    f.up.first_24h = w->rise_first_24h;
    f.up.max_24h = w->max_rise_24h;
    f.up.max_48h = w->max_rise_48h;
    f.elapsed_h = w->last.hours - w->first.hours;
    last_interval(w->seen == 2u, w->prev, w->last, &f);
    ring_direction(w->ring, &p, w->seen == 2u, w->prev, w->last, &f.up);
    finish(&f, &course, DIR_RISE, 0u, &r);
    correction_of(&r, out);
}

int ntr_watch_result(const ntr_watch *w, ntr_correction *out)
{
    if (w == NULL || out == NULL) {
        return NTR_ERR_NULL;
    }
    if (!watch_sound(w) || w->seen == 0u) {
        return NTR_ERR_ARG;
    }
    watch_report(w, out);
    return NTR_OK;
}

/* first, prev, last and the change over the first 24 h, after a push of s
 * (shared by both watchers; fall_first NULL for the 1.0 one). */
static void track_ends(unsigned int *seen, unsigned int *first_open, ntr_sample *first,
                       ntr_sample *prev, ntr_sample *last, double *rise_first,
                       double *fall_first, ntr_sample s)
{
    if (*seen == 0u) {
        *first = s;
        *first_open = 1u;
        *rise_first = 0.0;
        if (fall_first != NULL) {
            *fall_first = 0.0;
        }
        *last = s;
        *seen = 1u;
        return;
    }
    if (*first_open) {
        if (within(first->hours, s.hours, WINDOW_24H)) {
            if (s.na_mmol_l - first->na_mmol_l > *rise_first) {
                *rise_first = s.na_mmol_l - first->na_mmol_l;
            }
            if (fall_first != NULL && first->na_mmol_l - s.na_mmol_l > *fall_first) {
                *fall_first = first->na_mmol_l - s.na_mmol_l;
            }
        } else {
            *first_open = 0u;
        }
    }
    if (s.hours > last->hours) {
        *prev = *last;
        *seen = 2u;
    }
    *last = s;
}

int ntr_watch_push(ntr_watch *w, double hours, double na_mmol_l,
                   ntr_correction *out)
{
    unsigned int drop_front;
    unsigned int drop_back;
    struct ring_pos p;
    ntr_sample s;
    double at_24h = 0.0; /* the 1.0 state keeps no times */
    double at_48h = 0.0;

    if (w == NULL || out == NULL) {
        return NTR_ERR_NULL;
    }
    if (!watch_sound(w)) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntr_check(hours, -NTR_HOURS_MAX, NTR_HOURS_MAX));
    NTR_TRY(ntr_check_na(na_mmol_l));
    if (w->seen != 0u && hours < w->last.hours) {
        return NTR_ERR_ORDER;
    }

    s.hours = hours;
    s.na_mmol_l = na_mmol_l;
    p = watch_pos(w);
    /* Work out the new ring before touching anything, so a full ring
     * leaves the state as it was (the 1.0 contract: NTR_ERR_CAPACITY). */
    ring_drops(w->ring, &p, s, &drop_front, &drop_back);
    if (p.kept - drop_front - drop_back >= NTR_WATCH_CAPACITY) {
        return NTR_ERR_CAPACITY;
    }
    ring_drop(&p, drop_front, drop_back);
    ring_insert(w->ring, &p, s);
    ring_track(w->ring, &p, s, &w->max_rise_24h, &w->max_rise_48h, &at_24h, &at_48h);
    watch_store_pos(w, &p);
    track_ends(&w->seen, &w->first_open, &w->first, &w->prev, &w->last,
               &w->rise_first_24h, NULL, s);
    /* The state was sound on entry and a push keeps it so: no need to
     * check it again as ntr_watch_result() would. */
    watch_report(w, out);
    return NTR_OK;
}

/* ---- the course watcher (ntr_course_watch, both directions) -------------- */

/* Marks an initialised ntr_course_watch ("NTRC"). */
#define COURSE_WATCH_MAGIC 0x4e545243u

static struct ring_pos course_pos(const ntr_course_watch_ring *r)
{
    struct ring_pos p;
    p.cap = NTR_COURSE_WATCH_CAPACITY;
    p.head = r->head;
    p.kept = r->kept;
    p.front24 = r->front24;
    p.front6 = r->front6;
    return p;
}

static void course_store_pos(ntr_course_watch_ring *r, const struct ring_pos *p)
{
    r->head = p->head;
    r->kept = p->kept;
    r->front24 = p->front24;
    r->front6 = p->front6;
}

static int at_sound(double at)
{
    return at == NTR_COURSE_NO_TIME || time_sound(at);
}

static int course_numbers_sound(const ntr_course_watch *w, const struct ring_pos *low,
                                const struct ring_pos *high)
{
    if (w->seen >= 1u && (!sample_sound(w->first, 1.0) || !sample_sound(w->last, 1.0))) {
        return 0;
    }
    if (w->seen == 2u && !sample_sound(w->prev, 1.0)) {
        return 0;
    }
    return change_sound(w->rise_first_24h) && change_sound(w->fall_first_24h) &&
           change_sound(w->max_rise_24h) && change_sound(w->max_rise_48h) &&
           change_sound(w->max_fall_24h) && change_sound(w->max_fall_48h) &&
           at_sound(w->at_rise_24h) && at_sound(w->at_rise_48h) &&
           at_sound(w->at_fall_24h) && at_sound(w->at_fall_48h) &&
           ring_numbers_sound(w->low.entry, low, 1.0) &&
           ring_numbers_sound(w->high.entry, high, -1.0) &&
           spans_sound(w->low.span, low) && spans_sound(w->high.span, high);
}

static int course_watch_sound(const ntr_course_watch *w)
{
    struct ring_pos low;
    struct ring_pos high;
    if (w->magic != COURSE_WATCH_MAGIC || w->seen > 2u || w->first_open > 1u ||
        w->approximate > 1u) {
        return 0;
    }
    low = course_pos(&w->low);
    high = course_pos(&w->high);
    if (!ring_shape_sound(&low, w->seen) || !ring_shape_sound(&high, w->seen) ||
        ntri_course_limits_check(&w->limits) != NTR_OK) {
        return 0;
    }
    return course_numbers_sound(w, &low, &high);
}

static void course_ring_init(ntr_course_watch_ring *r)
{
    r->kept = 0u;
    r->head = 0u;
    r->front24 = 0u;
    r->front6 = 0u;
    /* Entries left as they are, as in ntr_watch_init(). */
}

int ntr_course_watch_init(const ntr_course_limits *lim, ntr_course_watch *w)
{
    static const ntr_sample zero_sample = {0.0, 0.0};
    ntr_course_limits limits;
    if (lim == NULL || w == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntri_course_limits_check(lim));
    limits = *lim; /* lim may point into *w */
    limits.struct_size = sizeof limits; /* only the 1.1 members are kept */
    w->magic = COURSE_WATCH_MAGIC;
    w->seen = 0u;
    w->first_open = 0u;
    w->approximate = 0u;
    w->limits = limits;
    w->first = zero_sample;
    w->prev = zero_sample;
    w->last = zero_sample;
    w->rise_first_24h = 0.0;
    w->fall_first_24h = 0.0;
    w->max_rise_24h = 0.0;
    w->max_rise_48h = 0.0;
    w->max_fall_24h = 0.0;
    w->max_fall_48h = 0.0;
    w->at_rise_24h = NTR_COURSE_NO_TIME;
    w->at_rise_48h = NTR_COURSE_NO_TIME;
    w->at_fall_24h = NTR_COURSE_NO_TIME;
    w->at_fall_48h = NTR_COURSE_NO_TIME;
    course_ring_init(&w->low);
    course_ring_init(&w->high);
    return NTR_OK;
}

static void course_watch_report(const ntr_course_watch *w, ntr_course_report *out)
{
    const struct ring_pos low = course_pos(&w->low);
    const struct ring_pos high = course_pos(&w->high);
    const int has_prev = w->seen == 2u;
    struct figures f;

    f.up = no_direction;
    f.down = no_direction;
    f.up.first_24h = w->rise_first_24h;
    f.up.max_24h = w->max_rise_24h;
    f.up.max_48h = w->max_rise_48h;
    f.up.at_24h = w->at_rise_24h;
    f.up.at_48h = w->at_rise_48h;
    f.down.first_24h = w->fall_first_24h;
    f.down.max_24h = w->max_fall_24h;
    f.down.max_48h = w->max_fall_48h;
    f.down.at_24h = w->at_fall_24h;
    f.down.at_48h = w->at_fall_48h;
    f.elapsed_h = w->last.hours - w->first.hours;
    last_interval(has_prev, w->prev, w->last, &f);
    ring_direction(w->low.entry, &low, has_prev, w->prev, w->last, &f.up);
    ring_direction(w->high.entry, &high, has_prev, mirrored(w->prev), mirrored(w->last),
                   &f.down);
    finish(&f, &w->limits, DIR_BOTH, w->approximate ? NTR_CF_APPROXIMATE : 0u, out);
}

int ntr_course_watch_result(const ntr_course_watch *w, ntr_course_report *out)
{
    if (w == NULL || out == NULL) {
        return NTR_ERR_NULL;
    }
    if (ntri_course_report_check(out) != NTR_OK || !course_watch_sound(w) || w->seen == 0u) {
        return NTR_ERR_ARG;
    }
    course_watch_report(w, out);
    return NTR_OK;
}

/* One direction's ring takes the sample (s already in that direction),
 * compacting first when it is full; returns 1 if it compacted. */
static int course_ring_push(ntr_course_watch_ring *r, ntr_sample s, double *max_24h,
                            double *max_48h, double *at_24h, double *at_48h)
{
    struct ring_pos p = course_pos(r);
    unsigned int drop_front;
    unsigned int drop_back;
    int compacted = 0;
    ring_drops(r->entry, &p, s, &drop_front, &drop_back);
    ring_drop(&p, drop_front, drop_back);
    if (p.kept >= p.cap) {
        ring_compact(r->entry, r->span, &p);
        compacted = 1;
    }
    ring_insert(r->entry, &p, s);
    r->span[ring_index(&p, p.kept - 1u)] = 0.0f;
    ring_track(r->entry, &p, s, max_24h, max_48h, at_24h, at_48h);
    course_store_pos(r, &p);
    return compacted;
}

int ntr_course_watch_push(ntr_course_watch *w, double hours, double na_mmol_l,
                          ntr_course_report *out)
{
    ntr_sample s;
    int compacted;

    if (w == NULL || out == NULL) {
        return NTR_ERR_NULL;
    }
    if (ntri_course_report_check(out) != NTR_OK || !course_watch_sound(w)) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntr_check(hours, -NTR_HOURS_MAX, NTR_HOURS_MAX));
    NTR_TRY(ntr_check_na(na_mmol_l));
    if (w->seen != 0u && hours < w->last.hours) {
        return NTR_ERR_ORDER;
    }

    s.hours = hours;
    s.na_mmol_l = na_mmol_l;
    compacted = course_ring_push(&w->low, s, &w->max_rise_24h, &w->max_rise_48h,
                                 &w->at_rise_24h, &w->at_rise_48h);
    compacted |= course_ring_push(&w->high, mirrored(s), &w->max_fall_24h,
                                  &w->max_fall_48h, &w->at_fall_24h, &w->at_fall_48h);
    if (compacted) {
        w->approximate = 1u;
    }
    track_ends(&w->seen, &w->first_open, &w->first, &w->prev, &w->last,
               &w->rise_first_24h, &w->fall_first_24h, s);
    course_watch_report(w, out);
    return NTR_OK;
}

/* The glucose-corrected push: the library's one correction
 * (ntri_glucose_corrected, as ntr_na_corrected_glucose), then the ordinary
 * push. The state keeps no mode (the 1.1 layout has no spare member), so
 * keeping the series consistently corrected is the caller's part. */
int ntr_course_watch_push_glucose(ntr_course_watch *w, double hours, double na_mmol_l,
                                  double glucose_mmol_l, int glucose_method,
                                  ntr_course_report *out)
{
    double factor;
    double corrected;

    if (w == NULL || out == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntri_glucose_factor(glucose_method, &factor));
    if (ntri_course_report_check(out) != NTR_OK || !course_watch_sound(w)) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(ntr_check(hours, -NTR_HOURS_MAX, NTR_HOURS_MAX));
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check(glucose_mmol_l, 0.0, NTR_GLUCOSE_MAX));
    corrected = ntri_glucose_corrected(na_mmol_l, glucose_mmol_l, factor);
    /* A corrected sodium above the watcher's range is refused by the push
     * (NTR_ERR_RANGE), with the state and report untouched. */
    return ntr_course_watch_push(w, hours, corrected, out);
}
