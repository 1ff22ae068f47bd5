/* SPDX-License-Identifier: MIT */
/* Scaling of ntr_correction_assess: time per sample for series of 10 to
 * 100,000 samples (issue P7: constant within 10%).
 *
 * One invented series of 100,000 sodium results is built (dense: every 2
 * to 6 h, as on a ward correcting a low sodium; sparse: every 8 to 12 h;
 * drifting up and down between 112 and 148 mmol/L, so windows rise, fall
 * and cross the limits); a series of length n is a run of n consecutive
 * results of it. For each n the program assesses runs one after another
 * until about TOTAL samples have been assessed, REPEATS times, and keeps
 * the fastest pass: time per sample = best pass time / samples assessed.
 *
 * Usage:
 *   bench_scaling [total] [repeats] [SPACING]   table for every length
 *   bench_scaling one N TOTAL [SPACING]         one length only (for
 *       callgrind, which counts the instructions inside
 *       ntr_correction_assess)
 * SPACING: dense (default), sparse, or dense-even / sparse-even (every 4 h /
 * every 10 h exactly, the same mean spacing without the jitter).
 * Output lines: samples_per_series series samples best_s ns_per_sample
 * flagged (series with a flag raised, to show the work is real). */
#define _POSIX_C_SOURCE 200809L
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "natremia.h"

#define LONGEST 100000u

static ntr_sample series[LONGEST];

/* CPU time of this thread: on a shared machine, time other processes run
 * is not counted (their effect on caches and memory bandwidth still is). */
static double now_s(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_THREAD_CPUTIME_ID, &ts);
    return (double)ts.tv_sec + (double)ts.tv_nsec * 1e-9;
}

static double uniform(uint64_t *state)
{
    uint64_t x = *state;
    x ^= x << 13;
    x ^= x >> 7;
    x ^= x << 17;
    *state = x;
    return (double)(x >> 11) / 9007199254740992.0;
}

/* Results every min_gap_h to min_gap_h + jitter_h hours. The random
 * numbers are drawn in the same order whatever the spacing, so every
 * spacing has the same sodium values, index by index. */
static void build_series(double min_gap_h, double jitter_h)
{
    uint64_t seed = 0x2545f4914f6cdd1du;
    double t = 0.0, na = 120.0, drift = 0.35;
    size_t k;
    for (k = 0; k < LONGEST; k++) {
        series[k].hours = t;
        series[k].na_mmol_l = na;
        t += min_gap_h + jitter_h * uniform(&seed);
        na += drift * 4.0 * uniform(&seed) - 0.4 * uniform(&seed);
        if (na > 148.0) {
            drift = -0.2;
        } else if (na < 112.0) {
            drift = 0.35;
        }
    }
}

/* Assess consecutive runs of n samples until `total` samples are done.
 * Returns the number of samples assessed; counts flagged series. */
static size_t assess_runs(size_t n, size_t total, const ntr_limits *lim,
                          size_t *flagged, int *failed)
{
    size_t done = 0, start = 0;
    ntr_correction out;
    *flagged = 0;
    while (done < total) {
        if (start + n > LONGEST) {
            start = 0;
        }
        if (ntr_correction_assess(series + start, n, lim, &out) != NTR_OK) {
            *failed = 1;
        }
        *flagged += out.flags != 0u;
        start += n;
        done += n;
    }
    return done;
}

int main(int argc, char **argv)
{
    static const size_t lengths[] = {10, 100, 1000, 10000, 100000};
    ntr_limits lim;
    size_t flagged = 0;
    int failed = 0;
    int one = argc > 1 && strcmp(argv[1], "one") == 0;
    const char *spacing = argc > (one ? 4 : 3) ? argv[one ? 4 : 3] : "dense";
    /* dense-even and sparse-even: the same mean spacing without jitter
     * (every 4 h, every 10 h), to tell the number of samples in a window
     * from the regularity of the loops (tests/bench/notes.md). */
    if (strcmp(spacing, "dense") == 0) {
        build_series(2.0, 4.0);
    } else if (strcmp(spacing, "sparse") == 0) {
        build_series(8.0, 4.0);
    } else if (strcmp(spacing, "dense-even") == 0) {
        build_series(4.0, 0.0);
    } else if (strcmp(spacing, "sparse-even") == 0) {
        build_series(10.0, 0.0);
    } else {
        fprintf(stderr, "bench_scaling: spacing is dense, sparse, dense-even "
                        "or sparse-even\n");
        return 2;
    }
    ntr_limits_preset(NTR_LIMITS_STANDARD, &lim);
    if (one) {
        size_t n = argc > 2 ? (size_t)strtoull(argv[2], NULL, 10) : 10u;
        size_t total = argc > 3 ? (size_t)strtoull(argv[3], NULL, 10) : 1000000u;
        size_t done = assess_runs(n, total, &lim, &flagged, &failed);
        printf("%zu %zu %zu %zu\n", n, done / n, done, flagged);
        return failed;
    } else {
        size_t total = argc > 1 ? (size_t)strtoull(argv[1], NULL, 10) : 1000000u;
        int repeats = argc > 2 ? atoi(argv[2]) : 15;
        enum { N_LENGTHS = sizeof lengths / sizeof lengths[0] };
        double best[N_LENGTHS];
        size_t done[N_LENGTHS], flags_seen[N_LENGTHS];
        size_t i;
        int r;
        for (i = 0; i < N_LENGTHS; i++) {
            best[i] = 1e30;
        }
        /* Lengths take turns within each repeat, so a disturbance hits
         * one pass of one length, not a whole length. */
        for (r = 0; r < repeats; r++) {
            for (i = 0; i < N_LENGTHS; i++) {
                double t0 = now_s();
                done[i] = assess_runs(lengths[i], total, &lim, &flagged, &failed);
                double t1 = now_s();
                flags_seen[i] = flagged;
                if (t1 - t0 < best[i]) {
                    best[i] = t1 - t0;
                }
            }
        }
        printf("# samples_per_series series samples best_s ns_per_sample flagged\n");
        for (i = 0; i < N_LENGTHS; i++) {
            printf("%zu %zu %zu %.6f %.3f %zu\n", lengths[i], done[i] / lengths[i],
                   done[i], best[i], best[i] / (double)done[i] * 1e9,
                   flags_seen[i]);
        }
    }
    return failed;
}
