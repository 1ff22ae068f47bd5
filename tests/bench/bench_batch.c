/* SPDX-License-Identifier: MIT */
/* Batch throughput of natremia's array entry points against this machine's
 * own memory bandwidth, measured side by side in the same process.
 *
 * For every ntr_batch_* function: fill its input columns with N invented,
 * valid rows, then time (a) the batch call over all N rows and (b) a plain
 * memcpy that moves the same amount of memory traffic: a batch call reads
 * R bytes (its input columns) and writes W bytes (result and status
 * columns), a memcpy of (R + W) / 2 bytes reads and writes that many, so
 * both touch R + W bytes. Bandwidth = (R + W) / time for both; the ratio of
 * the two bandwidths is the figure of merit. All buffers are written once
 * before timing so page faults are not measured. The two are timed
 * alternately REPEATS times and the fastest run of each is kept (the
 * machine is shared; the minimum is the least disturbed run).
 *
 * A third yardstick, the one a skilled C programmer would hold a batch call
 * against (issue 16): a plain loop over the same columns, in the same
 * order, reading every input column and writing one double (or int) result
 * and one int status per row, with no checks at all and the cheapest
 * arithmetic (the sum of the inputs). It streams exactly the bytes the
 * batch call streams; loop_ratio = loop time / batch time (1.0 = the batch
 * call costs nothing beyond its memory traffic).
 *
 * A diagnostic baseline for the functions whose batch call is slower than
 * the loop (issue 16, tests/bench/notes.md): the same loop, but computing
 * the function's value with the arithmetic its formula does per row, in
 * plain C, still with no checks. It tells the cost of the arithmetic
 * itself (a division per row, the two Watson equations) from the cost of
 * the checks. The arithmetic is restated here for timing only; nothing
 * compares its values (the formulas are defined in the kernel headers, lib/).
 *
 * Usage: bench_batch [rows] [repeats]   (defaults 10000000 and 5)
 * Output: one line per function,
 *   name rows bytes_per_row batch_s copy_s batch_gb_s copy_gb_s ratio failed
 *   loop_s loop_ratio
 * and, after the line of a function with a diagnostic baseline, a comment
 * line (skipped by tests/bench/report.py):
 *   # arith name arith_s loop_s/arith_s arith_s/batch_s */
#define _POSIX_C_SOURCE 200809L
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "natremia.h"

#define MAX_DOUBLE_COLUMNS 5

struct columns {
    int *sex;
    double *in[MAX_DOUBLE_COLUMNS];
    double *out;
    int *iout;
    int *status;
};

/* A column of invented values, uniform in [lo, hi]. */
struct span {
    double lo;
    double hi;
};

struct batch {
    const char *name;
    int has_sex;     /* first input is an int sex column */
    int n_double;    /* number of double input columns */
    int int_result;  /* result column is int (advice) instead of double */
    struct span spans[MAX_DOUBLE_COLUMNS];
    int (*call)(const struct columns *c, size_t n, size_t *failed);
    /* the diagnostic baseline (same columns, the formula's arithmetic, no
     * checks), or NULL */
    void (*arith)(const struct columns *c, size_t n);
};

static int call_osm_calculated(const struct columns *c, size_t n, size_t *failed)
{
    return ntr_batch_osm_calculated(n, c->in[0], c->in[1], c->in[2], c->in[3],
                                    NTR_OSM_2NA, c->out, c->status, failed);
}
static int call_osm_effective(const struct columns *c, size_t n, size_t *failed)
{
    return ntr_batch_osm_effective(n, c->in[0], c->in[1], c->out, c->status,
                                   failed);
}
static int call_osm_gap(const struct columns *c, size_t n, size_t *failed)
{
    return ntr_batch_osm_gap(n, c->in[0], c->in[1], c->out, c->status, failed);
}
static int call_na_corrected_glucose(const struct columns *c, size_t n,
                                     size_t *failed)
{
    return ntr_batch_na_corrected_glucose(n, c->in[0], c->in[1],
                                          NTR_GLUCOSE_HILLIER, c->out,
                                          c->status, failed);
}
static int call_tbw_fraction(const struct columns *c, size_t n, size_t *failed)
{
    return ntr_batch_tbw_fraction(n, c->sex, c->in[0], c->in[1], c->out,
                                  c->status, failed);
}
static int call_tbw_watson(const struct columns *c, size_t n, size_t *failed)
{
    return ntr_batch_tbw_watson(n, c->sex, c->in[0], c->in[1], c->in[2],
                                c->out, c->status, failed);
}
static int call_free_water_deficit(const struct columns *c, size_t n,
                                   size_t *failed)
{
    return ntr_batch_free_water_deficit(n, c->in[0], c->in[1], c->out,
                                        c->status, failed);
}
static int call_na_deficit(const struct columns *c, size_t n, size_t *failed)
{
    return ntr_batch_na_deficit(n, c->in[0], c->in[1], c->in[2], c->out,
                                c->status, failed);
}
static int call_infusate_change_per_litre(const struct columns *c, size_t n,
                                          size_t *failed)
{
    return ntr_batch_infusate_change_per_litre(n, c->in[0], c->in[1], c->in[2],
                                               c->in[3], c->out, c->status,
                                               failed);
}
static int call_infusate_change(const struct columns *c, size_t n,
                                size_t *failed)
{
    return ntr_batch_infusate_change(n, c->in[0], c->in[1], c->in[2], c->in[3],
                                     c->in[4], c->out, c->status, failed);
}
static int call_infusate_volume_for_change(const struct columns *c, size_t n,
                                           size_t *failed)
{
    return ntr_batch_infusate_volume_for_change(n, c->in[0], c->in[1],
                                                c->in[2], c->in[3], c->in[4],
                                                c->out, c->status, failed);
}
static int call_furst_ratio(const struct columns *c, size_t n, size_t *failed)
{
    return ntr_batch_furst_ratio(n, c->in[0], c->in[1], c->in[2], c->out,
                                 c->status, failed);
}
static int call_restriction_from_ratio(const struct columns *c, size_t n,
                                       size_t *failed)
{
    return ntr_batch_restriction_from_ratio(n, c->in[0], c->iout, c->status,
                                            failed);
}
static int call_efwc(const struct columns *c, size_t n, size_t *failed)
{
    return ntr_batch_efwc(n, c->in[0], c->in[1], c->in[2], c->in[3], c->out,
                          c->status, failed);
}

/* ---- diagnostic baselines: the arithmetic, no checks ------------------ */

static void arith_osm_effective(const struct columns *c, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        c->out[i] = 2.0 * c->in[0][i] + c->in[1][i];
        c->status[i] = 0;
    }
}
/* Hillier: na + 2.4 * (glucose * 18.0156 - 100) / 100 above 100 mg/dL. */
static void arith_na_corrected_glucose(const struct columns *c, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        double mg = c->in[1][i] * 18.0156;
        c->out[i] = mg <= 100.0 ? c->in[0][i]
                                : c->in[0][i] + 2.4 * (mg - 100.0) / 100.0;
        c->status[i] = 0;
    }
}
/* The Adrogue-Madias fraction picked by age and sex, times the weight. */
static void arith_tbw_fraction(const struct columns *c, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        double age = c->in[0][i];
        int female = c->sex[i] == NTR_SEX_FEMALE;
        double f = age < 18.0 ? 0.6
                   : female   ? (age >= 65.0 ? 0.45 : 0.5)
                              : (age >= 65.0 ? 0.5 : 0.6);
        c->out[i] = f * c->in[1][i];
        c->status[i] = 0;
    }
}
/* Both Watson equations, one picked by sex. */
static void arith_tbw_watson(const struct columns *c, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        double age = c->in[0][i], height = c->in[1][i], weight = c->in[2][i];
        c->out[i] = c->sex[i] == NTR_SEX_MALE
                        ? 2.447 - 0.09516 * age + 0.1074 * height +
                              0.3362 * weight
                        : -2.097 + 0.1069 * height + 0.2466 * weight;
        c->status[i] = 0;
    }
}
/* (Na_inf + K_inf - Na) / (TBW + 1): one division per row. */
static void arith_infusate_change_per_litre(const struct columns *c, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        c->out[i] = (c->in[2][i] + c->in[3][i] - c->in[0][i]) /
                    (c->in[1][i] + 1.0);
        c->status[i] = 0;
    }
}
/* V * (Na_inf + K_inf - Na) / (TBW + V): one division per row. */
static void arith_infusate_change(const struct columns *c, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        c->out[i] = c->in[4][i] * (c->in[2][i] + c->in[3][i] - c->in[0][i]) /
                    (c->in[1][i] + c->in[4][i]);
        c->status[i] = 0;
    }
}
/* delta * TBW / (Na_inf + K_inf - Na - delta): one division per row. */
static void arith_infusate_volume_for_change(const struct columns *c, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        c->out[i] = c->in[4][i] * c->in[1][i] /
                    (c->in[2][i] + c->in[3][i] - c->in[0][i] - c->in[4][i]);
        c->status[i] = 0;
    }
}

/* Invented, plausible inputs; every row valid (the run checks failed == 0;
 * infusate_change stops at 770 mmol/L so 2 L never lifts 160 past the
 * 220 mmol/L the mass-balance rule accepts). */
static const struct batch batches[] = {
    {"ntr_batch_osm_calculated", 0, 4, 0,
     {{110, 160}, {3, 40}, {2, 30}, {0, 20}}, call_osm_calculated, NULL},
    {"ntr_batch_osm_effective", 0, 2, 0, {{110, 160}, {3, 40}},
     call_osm_effective, arith_osm_effective},
    {"ntr_batch_osm_gap", 0, 2, 0, {{270, 330}, {260, 300}}, call_osm_gap, NULL},
    {"ntr_batch_na_corrected_glucose", 0, 2, 0, {{110, 160}, {3, 60}},
     call_na_corrected_glucose, arith_na_corrected_glucose},
    {"ntr_batch_tbw_fraction", 1, 2, 0, {{1, 95}, {10, 120}},
     call_tbw_fraction, arith_tbw_fraction},
    {"ntr_batch_tbw_watson", 1, 3, 0, {{18, 95}, {150, 195}, {50, 120}},
     call_tbw_watson, arith_tbw_watson},
    {"ntr_batch_free_water_deficit", 0, 2, 0, {{20, 50}, {141, 175}},
     call_free_water_deficit, NULL},
    {"ntr_batch_na_deficit", 0, 3, 0, {{20, 50}, {105, 125}, {126, 135}},
     call_na_deficit, NULL},
    {"ntr_batch_infusate_change_per_litre", 0, 4, 0,
     {{105, 160}, {20, 50}, {0, 855}, {0, 40}}, call_infusate_change_per_litre, arith_infusate_change_per_litre},
    {"ntr_batch_infusate_change", 0, 5, 0,
     {{105, 160}, {20, 50}, {0, 770}, {0, 40}, {0.1, 2}}, call_infusate_change, arith_infusate_change},
    {"ntr_batch_infusate_volume_for_change", 0, 5, 0,
     {{105, 130}, {20, 50}, {300, 855}, {0, 40}, {1, 8}},
     call_infusate_volume_for_change, arith_infusate_volume_for_change},
    {"ntr_batch_furst_ratio", 0, 3, 0, {{20, 150}, {10, 80}, {115, 145}},
     call_furst_ratio, NULL},
    {"ntr_batch_restriction_from_ratio", 0, 1, 1, {{0, 2}},
     call_restriction_from_ratio, NULL},
    {"ntr_batch_efwc", 0, 4, 0, {{0.5, 3}, {20, 150}, {10, 80}, {115, 145}},
     call_efwc, NULL},
};

/* The same-stream loop: reads the inputs a batch call of this shape reads,
 * writes its result and status columns, checks nothing. */
static void same_stream_loop(const struct batch *t, const struct columns *c,
                             size_t n)
{
    size_t i;
    int k;
    if (t->int_result) {
        for (i = 0; i < n; i++) {
            c->iout[i] = c->in[0][i] < 1.0 ? 1 : 2;
            c->status[i] = 0;
        }
        return;
    }
    switch (t->n_double + (t->has_sex ? 10 : 0)) {
    case 2:
        for (i = 0; i < n; i++) {
            c->out[i] = c->in[0][i] + c->in[1][i];
            c->status[i] = 0;
        }
        break;
    case 3:
        for (i = 0; i < n; i++) {
            c->out[i] = c->in[0][i] + c->in[1][i] + c->in[2][i];
            c->status[i] = 0;
        }
        break;
    case 4:
        for (i = 0; i < n; i++) {
            c->out[i] = c->in[0][i] + c->in[1][i] + c->in[2][i] + c->in[3][i];
            c->status[i] = 0;
        }
        break;
    case 5:
        for (i = 0; i < n; i++) {
            c->out[i] = c->in[0][i] + c->in[1][i] + c->in[2][i] + c->in[3][i] +
                        c->in[4][i];
            c->status[i] = 0;
        }
        break;
    case 12:
        for (i = 0; i < n; i++) {
            c->out[i] = (double)c->sex[i] + c->in[0][i] + c->in[1][i];
            c->status[i] = 0;
        }
        break;
    case 13:
        for (i = 0; i < n; i++) {
            c->out[i] = (double)c->sex[i] + c->in[0][i] + c->in[1][i] +
                        c->in[2][i];
            c->status[i] = 0;
        }
        break;
    default: /* any other shape: column by column, same bytes */
        for (i = 0; i < n; i++) {
            double sum = t->has_sex ? (double)c->sex[i] : 0.0;
            for (k = 0; k < t->n_double; k++) {
                sum += c->in[k][i];
            }
            c->out[i] = sum;
            c->status[i] = 0;
        }
        break;
    }
}

/* CPU time of this thread: on a shared machine, time other processes run
 * is not counted (their effect on caches and memory bandwidth still is). */
static double now_s(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_THREAD_CPUTIME_ID, &ts);
    return (double)ts.tv_sec + (double)ts.tv_nsec * 1e-9;
}

/* xorshift64: reproducible invented data without libc's rand state. */
static double uniform(uint64_t *state, double lo, double hi)
{
    uint64_t x = *state;
    x ^= x << 13;
    x ^= x >> 7;
    x ^= x << 17;
    *state = x;
    return lo + (hi - lo) * ((double)(x >> 11) / 9007199254740992.0);
}

static void *must_alloc(size_t bytes)
{
    void *p = malloc(bytes);
    if (p == NULL) {
        fprintf(stderr, "bench_batch: out of memory (%zu bytes)\n", bytes);
        exit(2);
    }
    memset(p, 0, bytes); /* fault every page in before timing */
    return p;
}

int main(int argc, char **argv)
{
    size_t rows = argc > 1 ? (size_t)strtoull(argv[1], NULL, 10) : 10000000u;
    int repeats = argc > 2 ? atoi(argv[2]) : 5;
    size_t max_traffic = rows * (MAX_DOUBLE_COLUMNS * 8 + 8 + 4 + 4);
    struct columns c;
    unsigned char *copy_src = must_alloc(max_traffic / 2 + 64);
    unsigned char *copy_dst = must_alloc(max_traffic / 2 + 64);
    uint64_t seed = 0x9e3779b97f4a7c15u;
    size_t b, i;
    int k, all_ok = 1;

    c.sex = must_alloc(rows * sizeof *c.sex);
    for (k = 0; k < MAX_DOUBLE_COLUMNS; k++) {
        c.in[k] = must_alloc(rows * sizeof *c.in[k]);
    }
    c.out = must_alloc(rows * sizeof *c.out);
    c.iout = must_alloc(rows * sizeof *c.iout);
    c.status = must_alloc(rows * sizeof *c.status);
    for (i = 0; i < rows; i++) {
        c.sex[i] = (i & 1u) ? NTR_SEX_FEMALE : NTR_SEX_MALE;
    }
    memset(copy_src, 0x5a, max_traffic / 2 + 64);

    printf("# rows=%zu repeats=%d\n", rows, repeats);
    printf("# name rows bytes_per_row batch_s copy_s batch_gb_s copy_gb_s "
           "ratio failed loop_s loop_ratio\n");
    for (b = 0; b < sizeof batches / sizeof batches[0]; b++) {
        const struct batch *t = &batches[b];
        size_t read = (size_t)t->n_double * 8u + (t->has_sex ? 4u : 0u);
        size_t written = (t->int_result ? 4u : 8u) + 4u;
        size_t per_row = read + written;
        size_t copy_bytes = rows * per_row / 2;
        double best_batch = 1e30, best_copy = 1e30, best_loop = 1e30;
        double best_arith = 1e30;
        size_t failed = 0;
        int status = NTR_OK;
        for (k = 0; k < t->n_double; k++) {
            for (i = 0; i < rows; i++) {
                c.in[k][i] = uniform(&seed, t->spans[k].lo, t->spans[k].hi);
            }
        }
        for (k = 0; k < repeats; k++) {
            double t0 = now_s();
            status = t->call(&c, rows, &failed);
            double t1 = now_s();
            memcpy(copy_dst, copy_src, copy_bytes);
            double t2 = now_s();
            same_stream_loop(t, &c, rows);
            double t3 = now_s();
            if (t1 - t0 < best_batch) best_batch = t1 - t0;
            if (t2 - t1 < best_copy) best_copy = t2 - t1;
            if (t3 - t2 < best_loop) best_loop = t3 - t2;
            if (t->arith != NULL) {
                double t4 = now_s();
                t->arith(&c, rows);
                double t5 = now_s();
                if (t5 - t4 < best_arith) best_arith = t5 - t4;
            }
            /* keep the copy observable so it cannot be dropped */
            copy_src[(size_t)k % copy_bytes] ^= copy_dst[copy_bytes - 1u];
        }
        if (status != NTR_OK || failed != 0) {
            all_ok = 0;
        }
        printf("%s %zu %zu %.6f %.6f %.3f %.3f %.4f %zu %.6f %.4f\n", t->name, rows,
               per_row, best_batch, best_copy,
               (double)(rows * per_row) / best_batch / 1e9,
               (double)(2u * copy_bytes) / best_copy / 1e9,
               best_copy / best_batch *
                   ((double)(rows * per_row) / (double)(2u * copy_bytes)),
               failed, best_loop, best_loop / best_batch);
        if (t->arith != NULL) {
            printf("# arith %s %.6f %.4f %.4f\n", t->name, best_arith,
                   best_loop / best_arith, best_arith / best_batch);
        }
    }
    return all_ok ? 0 : 1;
}
