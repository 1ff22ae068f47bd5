/* SPDX-License-Identifier: MIT */
/* Batch throughput of two builds of lib/batch.c in one process (issue 14):
 * this tree's entry points (ntr_batch_*) against another commit's, whose
 * object tests/bench/batch-ab.sh renamed to old_ntr_batch_*. Same inputs,
 * same process, the two calls alternated (which goes first alternates too),
 * so both see the same machine; for each function the fastest of the
 * rounds of each side is kept (thread CPU time: on a shared machine the
 * minimum is the least disturbed run), and the median of the per-round
 * ratios is printed beside it.
 *
 * Two data sets of invented rows: "valid" (every row valid, as in
 * tests/bench/bench_batch.c) and "mixed" (sexes mixed, ages across the
 * 18 and 65 edges, and about one row in 50 spoilt with a NaN or an
 * out-of-range value, so pairs fall back to the row path).
 *
 * Usage: bench_batch_ab [rows] [rounds] [valid|mixed|both]
 *        (defaults 4000000, 21, both)
 * Output: one line per function and data set:
 *   name data rows new_ms old_ms new/old median_new/old same */
#define _POSIX_C_SOURCE 200809L
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "natremia.h"

#define NCOL 5

struct columns {
    int *sex;
    double *in[NCOL];
    double *out;
    int *iout;
    int *status;
};

typedef int (*call_fn)(const struct columns *c, size_t n, size_t *failed);

/* The old entry points have the new ones' types (the 1.0 ABI). */
#define OLD_DECLARE(name) extern __typeof__(ntr_batch_##name) old_ntr_batch_##name;
OLD_DECLARE(osm_calculated)
OLD_DECLARE(osm_effective)
OLD_DECLARE(osm_gap)
OLD_DECLARE(na_corrected_glucose)
OLD_DECLARE(na_deficit)
OLD_DECLARE(tbw_fraction)
OLD_DECLARE(tbw_watson)
OLD_DECLARE(free_water_deficit)
OLD_DECLARE(infusate_change_per_litre)
OLD_DECLARE(infusate_change)
OLD_DECLARE(infusate_volume_for_change)
OLD_DECLARE(furst_ratio)
OLD_DECLARE(restriction_from_ratio)
OLD_DECLARE(efwc)

/* One wrapper per side and function: P is "" or "old_". */
#define CALLS(P)                                                              \
    static int P##osm_calculated(const struct columns *c, size_t n, size_t *f) \
    {                                                                         \
        return P##ntr_batch_osm_calculated(n, c->in[0], c->in[1], c->in[2],   \
                                           c->in[3], NTR_OSM_DORWART_CHALMERS, \
                                           c->out, c->status, f);             \
    }                                                                         \
    static int P##osm_effective(const struct columns *c, size_t n, size_t *f) \
    {                                                                         \
        return P##ntr_batch_osm_effective(n, c->in[0], c->in[1], c->out,      \
                                          c->status, f);                      \
    }                                                                         \
    static int P##osm_gap(const struct columns *c, size_t n, size_t *f)       \
    {                                                                         \
        return P##ntr_batch_osm_gap(n, c->in[0], c->in[1], c->out, c->status, \
                                    f);                                       \
    }                                                                         \
    static int P##na_corrected_glucose(const struct columns *c, size_t n,     \
                                       size_t *f)                             \
    {                                                                         \
        return P##ntr_batch_na_corrected_glucose(n, c->in[0], c->in[1],       \
                                                 NTR_GLUCOSE_HILLIER, c->out, \
                                                 c->status, f);               \
    }                                                                         \
    static int P##na_deficit(const struct columns *c, size_t n, size_t *f)    \
    {                                                                         \
        return P##ntr_batch_na_deficit(n, c->in[0], c->in[1], c->in[2],       \
                                       c->out, c->status, f);                 \
    }                                                                         \
    static int P##tbw_fraction(const struct columns *c, size_t n, size_t *f)  \
    {                                                                         \
        return P##ntr_batch_tbw_fraction(n, c->sex, c->in[0], c->in[1],       \
                                         c->out, c->status, f);               \
    }                                                                         \
    static int P##tbw_watson(const struct columns *c, size_t n, size_t *f)    \
    {                                                                         \
        return P##ntr_batch_tbw_watson(n, c->sex, c->in[0], c->in[1],         \
                                       c->in[2], c->out, c->status, f);       \
    }                                                                         \
    static int P##free_water_deficit(const struct columns *c, size_t n,       \
                                     size_t *f)                               \
    {                                                                         \
        return P##ntr_batch_free_water_deficit(n, c->in[0], c->in[1], c->out, \
                                               c->status, f);                 \
    }                                                                         \
    static int P##infusate_change_per_litre(const struct columns *c, size_t n, \
                                            size_t *f)                        \
    {                                                                         \
        return P##ntr_batch_infusate_change_per_litre(                        \
            n, c->in[0], c->in[1], c->in[2], c->in[3], c->out, c->status, f); \
    }                                                                         \
    static int P##infusate_change(const struct columns *c, size_t n, size_t *f) \
    {                                                                         \
        return P##ntr_batch_infusate_change(n, c->in[0], c->in[1], c->in[2],  \
                                            c->in[3], c->in[4], c->out,       \
                                            c->status, f);                    \
    }                                                                         \
    static int P##infusate_volume_for_change(const struct columns *c,         \
                                             size_t n, size_t *f)             \
    {                                                                         \
        return P##ntr_batch_infusate_volume_for_change(                       \
            n, c->in[0], c->in[1], c->in[2], c->in[3], c->in[4], c->out,      \
            c->status, f);                                                    \
    }                                                                         \
    static int P##furst_ratio(const struct columns *c, size_t n, size_t *f)   \
    {                                                                         \
        return P##ntr_batch_furst_ratio(n, c->in[0], c->in[1], c->in[2],      \
                                        c->out, c->status, f);                \
    }                                                                         \
    static int P##restriction_from_ratio(const struct columns *c, size_t n,   \
                                         size_t *f)                           \
    {                                                                         \
        return P##ntr_batch_restriction_from_ratio(n, c->in[0], c->iout,      \
                                                   c->status, f);             \
    }                                                                         \
    static int P##efwc(const struct columns *c, size_t n, size_t *f)          \
    {                                                                         \
        return P##ntr_batch_efwc(n, c->in[0], c->in[1], c->in[2], c->in[3],   \
                                 c->out, c->status, f);                       \
    }

CALLS()
CALLS(old_)

struct span {
    double lo;
    double hi;
};

struct batch {
    const char *name;
    int n_double;
    int int_result;
    struct span spans[NCOL];
    call_fn new_call;
    call_fn old_call;
};

#define ENTRY(name, nd, ir, ...) \
    {"ntr_batch_" #name, nd, ir, __VA_ARGS__, name, old_##name}

/* Invented, plausible inputs (the valid set; the mixed set spoils some). */
static const struct batch batches[] = {
    ENTRY(osm_calculated, 4, 0, {{110, 160}, {3, 40}, {2, 30}, {0, 20}}),
    ENTRY(osm_effective, 2, 0, {{110, 160}, {3, 40}}),
    ENTRY(osm_gap, 2, 0, {{270, 330}, {260, 300}}),
    ENTRY(na_corrected_glucose, 2, 0, {{110, 160}, {3, 60}}),
    ENTRY(na_deficit, 3, 0, {{20, 50}, {105, 125}, {126, 135}}),
    ENTRY(tbw_fraction, 2, 0, {{1, 95}, {10, 120}}),
    ENTRY(tbw_watson, 3, 0, {{18, 95}, {150, 195}, {45, 120}}),
    ENTRY(free_water_deficit, 2, 0, {{20, 50}, {141, 175}}),
    ENTRY(infusate_change_per_litre, 4, 0,
          {{105, 160}, {20, 50}, {0, 855}, {0, 40}}),
    ENTRY(infusate_change, 5, 0, {{105, 160}, {20, 50}, {0, 855}, {0, 40}, {0.1, 2}}),
    ENTRY(infusate_volume_for_change, 5, 0,
          {{105, 130}, {20, 50}, {300, 855}, {0, 40}, {1, 8}}),
    ENTRY(furst_ratio, 3, 0, {{20, 150}, {10, 80}, {115, 145}}),
    ENTRY(restriction_from_ratio, 1, 1, {{0, 2}}),
    ENTRY(efwc, 4, 0, {{0.5, 3}, {20, 150}, {10, 80}, {115, 145}}),
};

static double now_s(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_THREAD_CPUTIME_ID, &ts);
    return (double)ts.tv_sec + (double)ts.tv_nsec * 1e-9;
}

static uint64_t next(uint64_t *state)
{
    uint64_t x = *state;
    x ^= x << 13;
    x ^= x >> 7;
    x ^= x << 17;
    *state = x;
    return x;
}

static double uniform(uint64_t *state, double lo, double hi)
{
    return lo + (hi - lo) * ((double)(next(state) >> 11) / 9007199254740992.0);
}

static void *must_alloc(size_t bytes)
{
    void *p = malloc(bytes);
    if (p == NULL) {
        fprintf(stderr, "bench_batch_ab: out of memory\n");
        exit(2);
    }
    memset(p, 0, bytes);
    return p;
}

static int cmp_double(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return (x > y) - (x < y);
}

int main(int argc, char **argv)
{
    size_t rows = argc > 1 ? (size_t)strtoull(argv[1], NULL, 10) : 4000000u;
    int rounds = argc > 2 ? atoi(argv[2]) : 21;
    struct columns c;
    double *keep_out = must_alloc(rows * sizeof(double));
    int *keep_status = must_alloc(rows * sizeof(int));
    int *keep_iout = must_alloc(rows * sizeof(int));
    double *ratios = must_alloc((size_t)rounds * sizeof(double));
    size_t b, i;
    const char *sets = argc > 3 ? argv[3] : "both";
    int k, mixed, all_same = 1;

    c.sex = must_alloc(rows * sizeof *c.sex);
    for (k = 0; k < NCOL; k++) {
        c.in[k] = must_alloc(rows * sizeof *c.in[k]);
    }
    c.out = must_alloc(rows * sizeof *c.out);
    c.iout = must_alloc(rows * sizeof *c.iout);
    c.status = must_alloc(rows * sizeof *c.status);

    printf("# rows=%zu rounds=%d; times are the fastest round, ms\n", rows, rounds);
    printf("# name data rows new_ms old_ms new/old median_new/old same\n");
    for (mixed = 0; mixed <= 1; mixed++) {
        if (strcmp(sets, "both") != 0 && strcmp(sets, mixed ? "mixed" : "valid") != 0) {
            continue;
        }
        for (b = 0; b < sizeof batches / sizeof batches[0]; b++) {
            const struct batch *t = &batches[b];
            uint64_t seed = 0x9e3779b97f4a7c15u + b;
            double best_new = 1e30, best_old = 1e30;
            size_t failed_new = 0, failed_old = 0;
            int same = 1;
            for (i = 0; i < rows; i++) {
                c.sex[i] = mixed ? ((next(&seed) & 1u) ? NTR_SEX_FEMALE : NTR_SEX_MALE)
                                 : ((i & 1u) ? NTR_SEX_FEMALE : NTR_SEX_MALE);
            }
            for (k = 0; k < t->n_double; k++) {
                for (i = 0; i < rows; i++) {
                    c.in[k][i] = uniform(&seed, t->spans[k].lo, t->spans[k].hi);
                }
            }
            if (mixed && strstr(t->name, "tbw_") != NULL) {
                for (i = 0; i < rows; i++) {
                    c.in[0][i] = uniform(&seed, 17.0, 66.0); /* ages across both edges */
                }
            }
            if (mixed) {
                for (i = 0; i < rows; i++) {
                    uint64_t r = next(&seed);
                    if (r % 50u == 0u) {
                        /* spoil one column: NaN, or far out of range */
                        k = (int)((r >> 8) % (uint64_t)t->n_double);
                        c.in[k][i] = ((r >> 16) & 1u) ? (double)NAN : -1.0e9;
                    }
                }
            }
            for (k = 0; k < rounds; k++) {
                int first;
                double dt[2];
                for (first = 0; first < 2; first++) {
                    int side = (first + k) & 1; /* 0 new, 1 old */
                    double t0 = now_s();
                    if (side == 0) {
                        (void)t->new_call(&c, rows, &failed_new);
                    } else {
                        (void)t->old_call(&c, rows, &failed_old);
                    }
                    dt[side] = now_s() - t0;
                    if (k == 0 && side == 0) { /* round 0: new, then old */
                        memcpy(keep_out, c.out, rows * sizeof(double));
                        memcpy(keep_status, c.status, rows * sizeof(int));
                        memcpy(keep_iout, c.iout, rows * sizeof(int));
                    }
                }
                if (k == 0) {
                    /* old wrote last: compare with what new wrote */
                    same = memcmp(keep_status, c.status, rows * sizeof(int)) == 0 &&
                           (t->int_result
                                ? memcmp(keep_iout, c.iout, rows * sizeof(int)) == 0
                                : memcmp(keep_out, c.out, rows * sizeof(double)) == 0);
                }
                if (dt[0] < best_new) best_new = dt[0];
                if (dt[1] < best_old) best_old = dt[1];
                ratios[k] = dt[0] / dt[1];
            }
            qsort(ratios, (size_t)rounds, sizeof ratios[0], cmp_double);
            same = same && failed_new == failed_old;
            all_same = all_same && same;
            printf("%s %s %zu %.3f %.3f %.4f %.4f %s\n", t->name,
                   mixed ? "mixed" : "valid", rows, best_new * 1e3,
                   best_old * 1e3, best_new / best_old, ratios[rounds / 2],
                   same ? "yes" : "NO");
            fflush(stdout);
        }
    }
    return all_same ? 0 : 1;
}
