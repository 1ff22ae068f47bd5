/* Correction-rate safety: limit presets, risk of osmotic demyelination,
 * assessing a measured sodium series, and a streaming watcher that gives
 * the same answers one result at a time (docs/correction.md). */
#include "correction_engine.h"

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

/* Everything the flags depend on. The batch engine and the watcher fill it
 * by different routes with the same floating-point operations on the same
 * values, so finish() gives identical results. */
struct figures {
    double rise_first_24h;
    double max_rise_24h;
    double max_rise_48h;
    double open_6h;    /* last sodium minus the lowest in the 6 h ending at it */
    double open_24h;
    double open_48h;
    double projected_24h; /* the same for the projected next sample */
    double projected_48h;
    double elapsed_h;  /* last time minus first time */
    double rate_per_h;
    int rising;        /* last interval rises (projection defined) */
    int falling;
};

/* Later sample at most w after the earlier (w includes the tolerance). */
static int within(double t_earlier, double t_later, double w)
{
    return t_later - t_earlier <= w;
}

static int over(double rise, double limit)
{
    return rise > limit + NTR_CF_TOLERANCE;
}

/* Near a limit: something has risen, to within the margin below the limit
 * and not over it. (Without the first test a flat series would be "near" a
 * limit smaller than the margin.) */
static int near(double rise, double limit)
{
    return rise > NTR_CF_TOLERANCE &&
           rise >= limit - NTR_CF_NEAR_MARGIN - NTR_CF_TOLERANCE &&
           rise <= limit + NTR_CF_TOLERANCE;
}

/* Inline (a hint): in the watcher's calls the figures then stay in
 * registers instead of going through memory, about 40 instructions per
 * push or result (tests/bench/run-bench.sh). */
static inline void finish(const struct figures *f, const ntr_limits *lim,
                   ntr_correction *out)
{
    unsigned int flags = 0u;
    double excess = 0.0;

    if (over(f->max_rise_24h, lim->max_rise_24h)) {
        flags |= NTR_CF_OVER_24H;
        excess = f->max_rise_24h - lim->max_rise_24h;
    }
    if (over(f->max_rise_48h, lim->max_rise_48h)) {
        double e = f->max_rise_48h - lim->max_rise_48h;
        flags |= NTR_CF_OVER_48H;
        if (e > excess) {
            excess = e;
        }
    }
    if (f->elapsed_h >= 24.0 - NTR_CF_TIME_TOLERANCE_H &&
        f->rise_first_24h < lim->min_rise_24h - NTR_CF_TOLERANCE) {
        flags |= NTR_CF_BELOW_TARGET;
    }
    if (f->falling) {
        flags |= NTR_CF_FALLING;
    }
    if (near(f->open_24h, lim->max_rise_24h) ||
        near(f->open_48h, lim->max_rise_48h)) {
        flags |= NTR_CF_NEAR_LIMIT;
    }
    if (f->rising && (over(f->projected_24h, lim->max_rise_24h) ||
                      over(f->projected_48h, lim->max_rise_48h))) {
        flags |= NTR_CF_PROJECTED_OVER;
    }
    if (f->open_6h >= NTR_CF_RAPID_RISE - NTR_CF_TOLERANCE) {
        flags |= NTR_CF_RAPID_6H;
    }

    out->rise_first_24h = f->rise_first_24h;
    out->max_rise_24h = f->max_rise_24h;
    out->max_rise_48h = f->max_rise_48h;
    out->last_rate_per_h = f->rate_per_h;
    out->excess_mmol_l = excess;
    out->flags = flags;
    out->reserved = 0u;
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

/* The last interval: from prev (the latest sample strictly before the last
 * one's time) to the last. Two time points closer than the time tolerance
 * count as one (as in the windows), so they give no rate: this also keeps
 * the rate finite when times are a subnormal apart. */
static void last_interval(int has_prev, ntr_sample prev, ntr_sample last,
                          struct figures *f)
{
    f->rate_per_h = 0.0;
    f->rising = 0;
    f->falling = 0;
    if (has_prev && last.hours - prev.hours > NTR_CF_TIME_TOLERANCE_H) {
        f->rate_per_h = (last.na_mmol_l - prev.na_mmol_l) / (last.hours - prev.hours);
        f->rising = last.na_mmol_l > prev.na_mmol_l;
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

static ntr_sample point_at(const ntri_series *v, size_t i)
{
    return v->samples != NULL ? v->samples[i] : v->point(v->ctx, i);
}

struct window_scan {
    double max_rise;
    size_t first_over; /* first index >= from whose window rise is over bar */
};

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
static void scan_window(const ntri_series *v, double w, double bar,
                        size_t from, struct window_scan *res)
{
    const size_t n = v->n;
    size_t prev_start = 0;
    size_t start = 0;
    int have_prev = 0;
    double best = 0.0;
    size_t first = NTRI_NONE;

    while (start < n) {
        const ntr_sample s0 = point_at(v, start);
        double run_min = s0.na_mmol_l;
        size_t end = start + 1;
        size_t block_first = NTRI_NONE;

        for (; end < n; end++) {
            const ntr_sample sj = point_at(v, end);
            double rise;
            if (!within(s0.hours, sj.hours, w)) {
                break;
            }
            rise = sj.na_mmol_l - run_min;
            if (rise > best) {
                best = rise;
            }
            if (rise > bar && end >= from && block_first == NTRI_NONE) {
                block_first = end;
            }
            if (sj.na_mmol_l < run_min) {
                run_min = sj.na_mmol_l;
            }
        }

        if (have_prev) {
            size_t taken = start; /* [taken, start) of the earlier block is in reach */
            double cross_min = HUGE_VAL;
            size_t p = end;
            while (p > start) {
                ntr_sample sp;
                p--;
                sp = point_at(v, p);
                while (taken > prev_start) {
                    const ntr_sample sq = point_at(v, taken - 1);
                    if (!within(sq.hours, sp.hours, w)) {
                        break;
                    }
                    taken--;
                    if (sq.na_mmol_l < cross_min) {
                        cross_min = sq.na_mmol_l;
                    }
                }
                if (taken < start) {
                    double rise = sp.na_mmol_l - cross_min;
                    if (rise > best) {
                        best = rise;
                    }
                    if (rise > bar && p >= from && p < block_first) {
                        block_first = p;
                    }
                }
            }
        }

        if (first == NTRI_NONE) {
            first = block_first;
        }
        prev_start = start;
        start = end;
        have_prev = 1;
    }
    res->max_rise = best;
    res->first_over = first;
}

/* Walks back from index `end` (exclusive) over the samples within w
 * before time t, lowering *lowest to their lowest sodium; returns the index
 * where it stopped (the first sample of the stretch). */
static size_t extend_min_back(const ntri_series *v, size_t end, double t,
                              double w, double *lowest)
{
    double m = *lowest;
    while (end > 0) {
        const ntr_sample s = point_at(v, end - 1);
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

/* rise_first_24h, the last interval, and the windows ending at the last
 * sample and at the projected next one: a walk forward over the first 24 h
 * and one backward over the last 48 h. */
static void scan_ends(const ntri_series *v, struct figures *f)
{
    const size_t n = v->n;
    const ntr_sample first = point_at(v, 0);
    const ntr_sample last = point_at(v, n - 1);
    ntr_sample prev = last;
    ntr_sample next = last;
    int has_prev = 0;
    double min_6, min_24, min_48;
    double next_min_24 = HUGE_VAL;
    double next_min_48 = HUGE_VAL;
    double rise_first = 0.0;
    double lowest;
    size_t i;

    for (i = 1; i < n; i++) {
        const ntr_sample s = point_at(v, i);
        if (!within(first.hours, s.hours, WINDOW_24H)) {
            break;
        }
        if (s.na_mmol_l - first.na_mmol_l > rise_first) {
            rise_first = s.na_mmol_l - first.na_mmol_l;
        }
    }

    for (i = n - 1; i > 0; i--) {
        const ntr_sample s = point_at(v, i - 1);
        if (s.hours < last.hours) {
            prev = s;
            has_prev = 1;
            break;
        }
    }
    last_interval(has_prev, prev, last, f);

    /* The 6 h, 24 h and 48 h windows ending at the last sample are nested
     * suffixes of the series: one backward walk in three stretches. */
    lowest = last.na_mmol_l;
    i = n - 1;
    i = extend_min_back(v, i, last.hours, WINDOW_6H, &lowest);
    min_6 = lowest;
    i = extend_min_back(v, i, last.hours, WINDOW_24H, &lowest);
    min_24 = lowest;
    (void)extend_min_back(v, i, last.hours, WINDOW_48H, &lowest);
    min_48 = lowest;

    /* The windows ending at the projected next sample: shorter suffixes. */
    if (f->rising) {
        next = projected_next(prev, last);
        lowest = HUGE_VAL;
        i = extend_min_back(v, n, next.hours, WINDOW_24H, &lowest);
        next_min_24 = lowest;
        (void)extend_min_back(v, i, next.hours, WINDOW_48H, &lowest);
        next_min_48 = lowest;
    }

    f->rise_first_24h = rise_first;
    f->elapsed_h = last.hours - first.hours;
    f->open_6h = last.na_mmol_l - min_6;
    f->open_24h = last.na_mmol_l - min_24;
    f->open_48h = last.na_mmol_l - min_48;
    f->projected_24h = f->rising ? projected_rise(next.na_mmol_l, next_min_24) : 0.0;
    f->projected_48h = f->rising ? projected_rise(next.na_mmol_l, next_min_48) : 0.0;
}

void ntri_assess(const ntri_series *v, const ntr_limits *lim, size_t from,
                 ntr_correction *out, ntri_breach *breach)
{
    struct figures f;
    struct window_scan w24;
    struct window_scan w48;

    scan_window(v, WINDOW_24H, lim->max_rise_24h + NTR_CF_TOLERANCE, from, &w24);
    scan_window(v, WINDOW_48H, lim->max_rise_48h + NTR_CF_TOLERANCE, from, &w48);
    scan_ends(v, &f);
    f.max_rise_24h = w24.max_rise;
    f.max_rise_48h = w48.max_rise;
    finish(&f, lim, out);
    if (breach != NULL) {
        breach->first_over_24h = w24.first_over;
        breach->first_over_48h = w48.first_over;
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
    v.samples = s;
    v.point = NULL;
    v.ctx = NULL;
    v.n = n;
    /* from = n: no breach index is wanted. */
    ntri_assess(&v, lim, n, out, NULL);
    return NTR_OK;
}

/* ---- streaming watcher --------------------------------------------------- */

/*
 * The ring holds a monotonic deque: the samples of the last 48 h that are
 * lower than every sample after them, oldest first, so sodium strictly
 * increases along it. The lowest sodium of any window ending at the last
 * sample is the first ring entry inside that window; front24 and front6
 * remember where the 24 h and 6 h windows begin. A sample that is not in
 * the ring was pushed out by a later, lower (or equal) one, which lies in
 * every window the first one lies in, so no minimum is lost.
 */

static const ntr_sample *ring_at(const ntr_watch *w, unsigned int k)
{
    return &w->ring[(w->head + k) % NTR_WATCH_CAPACITY];
}

/* Cheap structural checks, so a damaged or uninitialised state can never
 * make an index leave the ring. */
static int watch_sound(const ntr_watch *w)
{
    if (w->magic != WATCH_MAGIC || w->head >= NTR_WATCH_CAPACITY ||
        w->kept > NTR_WATCH_CAPACITY || w->seen > 2u || w->first_open > 1u) {
        return 0;
    }
    if ((w->seen == 0u) != (w->kept == 0u)) {
        return 0;
    }
    if (w->kept > 0u &&
        (w->front24 >= w->kept || w->front6 >= w->kept || w->front6 < w->front24)) {
        return 0;
    }
    return limits_sound(&w->limits);
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
     * `kept` (ring_at() callers: the drop loops, the fronts, which
     * watch_sound() keeps below `kept`, and the projection scans), and each
     * of those was written by the push that kept it. Clearing 2 KB would be
     * nine tenths of the cost of this call (tests/bench/run-bench.sh); the
     * header documents that the unused entries' bytes are unspecified. */
    return NTR_OK;
}

/* The figures of the series so far, from the state alone. */
static inline void watch_figures(const ntr_watch *w, struct figures *f)
{
    const ntr_sample last = w->last;

    f->rise_first_24h = w->rise_first_24h;
    f->max_rise_24h = w->max_rise_24h;
    f->max_rise_48h = w->max_rise_48h;
    f->elapsed_h = last.hours - w->first.hours;
    f->open_48h = last.na_mmol_l - ring_at(w, 0u)->na_mmol_l;
    f->open_24h = last.na_mmol_l - ring_at(w, w->front24)->na_mmol_l;
    f->open_6h = last.na_mmol_l - ring_at(w, w->front6)->na_mmol_l;
    last_interval(w->seen == 2u, w->prev, last, f);
    f->projected_24h = 0.0;
    f->projected_48h = 0.0;
    if (f->rising) {
        const ntr_sample next = projected_next(w->prev, last);
        unsigned int k;
        /* The first entry inside the projected window is its minimum. */
        for (k = 0u; k < w->kept; k++) {
            if (within(ring_at(w, k)->hours, next.hours, WINDOW_48H)) {
                f->projected_48h = projected_rise(next.na_mmol_l, ring_at(w, k)->na_mmol_l);
                break;
            }
        }
        for (k = w->front24; k < w->kept; k++) {
            if (within(ring_at(w, k)->hours, next.hours, WINDOW_24H)) {
                f->projected_24h = projected_rise(next.na_mmol_l, ring_at(w, k)->na_mmol_l);
                break;
            }
        }
    }
}

/* The assessment of a sound state that holds at least one sample. */
static void watch_report(const ntr_watch *w, ntr_correction *out)
{
    struct figures f;
    watch_figures(w, &f);
    finish(&f, &w->limits, out);
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

static unsigned int front_after(unsigned int front, unsigned int dropped)
{
    return front >= dropped ? front - dropped : 0u;
}

int ntr_watch_push(ntr_watch *w, double hours, double na_mmol_l,
                   ntr_correction *out)
{
    unsigned int drop_front = 0u;
    unsigned int drop_back = 0u;
    unsigned int survivors;
    ntr_sample s;
    double open;

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

    /* Work out the new ring before touching anything, so a full ring
     * leaves the state as it was. */
    while (drop_front < w->kept &&
           !within(ring_at(w, drop_front)->hours, hours, WINDOW_48H)) {
        drop_front++;
    }
    while (drop_front + drop_back < w->kept &&
           ring_at(w, w->kept - 1u - drop_back)->na_mmol_l >= na_mmol_l) {
        drop_back++;
    }
    survivors = w->kept - drop_front - drop_back;
    if (survivors >= NTR_WATCH_CAPACITY) {
        return NTR_ERR_CAPACITY;
    }

    s.hours = hours;
    s.na_mmol_l = na_mmol_l;
    w->head = (w->head + drop_front) % NTR_WATCH_CAPACITY;
    w->front24 = front_after(w->front24, drop_front);
    w->front6 = front_after(w->front6, drop_front);
    w->kept = survivors + 1u;
    w->ring[(w->head + survivors) % NTR_WATCH_CAPACITY] = s;
    /* Entries before a front were already outside its window; if the
     * front itself was pushed out, the new sample is the first inside. */
    if (w->front24 > survivors) {
        w->front24 = survivors;
    }
    if (w->front6 > survivors) {
        w->front6 = survivors;
    }
    while (!within(ring_at(w, w->front24)->hours, hours, WINDOW_24H)) {
        w->front24++;
    }
    if (w->front6 < w->front24) {
        w->front6 = w->front24;
    }
    while (!within(ring_at(w, w->front6)->hours, hours, WINDOW_6H)) {
        w->front6++;
    }

    open = na_mmol_l - ring_at(w, 0u)->na_mmol_l;
    if (open > w->max_rise_48h) {
        w->max_rise_48h = open;
    }
    open = na_mmol_l - ring_at(w, w->front24)->na_mmol_l;
    if (open > w->max_rise_24h) {
        w->max_rise_24h = open;
    }

    if (w->seen == 0u) {
        w->first = s;
        w->first_open = 1u;
        w->rise_first_24h = 0.0;
        w->last = s;
        w->seen = 1u;
    } else {
        if (w->first_open) {
            if (within(w->first.hours, hours, WINDOW_24H)) {
                if (na_mmol_l - w->first.na_mmol_l > w->rise_first_24h) {
                    w->rise_first_24h = na_mmol_l - w->first.na_mmol_l;
                }
            } else {
                w->first_open = 0u;
            }
        }
        if (hours > w->last.hours) {
            w->prev = w->last;
            w->seen = 2u;
        }
        w->last = s;
    }
    /* The state was sound on entry and a push keeps it so (at least one
     * sample, fronts inside the kept ones, limits untouched): no need to
     * check it again as ntr_watch_result() would. */
    watch_report(w, out);
    return NTR_OK;
}
