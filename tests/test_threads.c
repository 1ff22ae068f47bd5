/* SPDX-License-Identifier: MIT */
/* The library from several threads at once (issue 14; docs/reliability.md).
 *
 * natremia keeps no mutable globals: every call works on its arguments
 * alone. This program computes one reference result per function on the
 * main thread, then runs THREADS threads that repeat the same calls on
 * shared read-only inputs with outputs of their own and compare each
 * result with the reference byte for byte. In the plain build it checks
 * that results do not depend on concurrency; in the ThreadSanitizer build
 * of tests/sanitize.sh (mode tsan) any data race inside the library is
 * reported and fails the run. */
#include <pthread.h>
#include <stdio.h>
#include <string.h>

#include "natremia.h"

#define THREADS 4
#define ROUNDS 40
#define ROWS 1001 /* odd: the two-lane batch path and its one-row tail */
#define SERIES 40

/* Shared inputs (written before the threads start, then only read). */
static double na[ROWS], glucose[ROWS], urea[ROWS], ethanol[ROWS], tbw[ROWS];
static double age[ROWS], weight[ROWS];
static int sex[ROWS];
static ntr_sample samples[SERIES];
static ntr_timed_flow plan[2];
static ntr_limits limits;
static ntr_course_limits course_limits;

static ntr_timed_flow timed(double start_h, double end_h, double rate_ml_h,
                            double na_mmol_l)
{
    ntr_timed_flow f;
    memset(&f, 0, sizeof f);
    f.start_h = start_h;
    f.end_h = end_h;
    f.rate_ml_h = rate_ml_h;
    f.na_mmol_l = na_mmol_l;
    return f;
}

/* Everything one round computes. */
struct results {
    double osm[ROWS], fraction[ROWS], deficit[ROWS];
    int status[3][ROWS];
    ntr_correction correction, watched;
    ntr_course_report report, course_watched;
    ntr_sample course[64];
    size_t course_count;
    ntr_course_plan_result plan_result;
    struct ntr_method_info info;
    int unit;
    int ret[12];
};

static struct results reference;

static void compute(struct results *r, ntr_watch *w, ntr_course_watch *cw)
{
    size_t i;
    int k = 0;
    /* Struct outputs with struct_size, and padding, set the same way. */
    memset(r, 0, sizeof *r);
    r->report.struct_size = sizeof r->report;
    r->course_watched.struct_size = sizeof r->course_watched;
    r->plan_result.struct_size = sizeof r->plan_result;
    r->ret[k++] = ntr_batch_osm_calculated(ROWS, na, glucose, urea, ethanol,
                                           NTR_OSM_DORWART_CHALMERS, r->osm,
                                           r->status[0], NULL);
    r->ret[k++] = ntr_batch_tbw_fraction(ROWS, sex, age, weight, r->fraction,
                                         r->status[1], NULL);
    r->ret[k++] = ntr_batch_free_water_deficit(ROWS, tbw, na, r->deficit,
                                               r->status[2], NULL);
    r->ret[k++] = ntr_correction_assess(samples, SERIES, &limits, &r->correction);
    r->ret[k++] = ntr_course_assess(samples, SERIES, &course_limits, &r->report);
    r->ret[k++] = ntr_watch_init(&limits, w);
    r->ret[k++] = ntr_course_watch_init(&course_limits, cw);
    for (i = 0; i < SERIES; i++) {
        int a = ntr_watch_push(w, samples[i].hours, samples[i].na_mmol_l, &r->watched);
        int b = ntr_course_watch_push(cw, samples[i].hours, samples[i].na_mmol_l,
                                      &r->course_watched);
        if (a != NTR_OK || b != NTR_OK) {
            r->ret[k] = a != NTR_OK ? a : b;
        }
    }
    k++;
    r->ret[k++] = ntr_balance_course(118.0, 40.0, plan, 2, 24.0, 0.5, r->course, 64,
                                     &r->course_count);
    r->ret[k++] = ntr_course_plan_check(samples, 1, 40.0, plan, 2, 24.0, 0.5,
                                        &course_limits, &r->plan_result);
    r->ret[k++] = ntr_method_info(NTR_METHOD_FURST, &r->info);
    r->ret[k++] = ntr_unit_parse("mg/dL", &r->unit);
}

static void *worker(void *arg)
{
    /* Each thread's own output and watcher storage. */
    static struct results mine[THREADS];
    static ntr_watch watch[THREADS];
    static ntr_course_watch cwatch[THREADS];
    size_t t = (size_t)arg;
    int round;
    for (round = 0; round < ROUNDS; round++) {
        compute(&mine[t], &watch[t], &cwatch[t]);
        if (memcmp(&mine[t], &reference, sizeof reference) != 0) {
            return (void *)1;
        }
    }
    return NULL;
}

int main(void)
{
    pthread_t th[THREADS];
    static ntr_watch w;
    static ntr_course_watch cw;
    size_t i;
    int k, failures = 0;

    /* Invented inputs (fixture data, not patients). */
    for (i = 0; i < ROWS; i++) {
        double u = (double)i / ROWS;
        na[i] = 110.0 + 50.0 * u;
        glucose[i] = 4.0 + 30.0 * u;
        urea[i] = 3.0 + 20.0 * u;
        ethanol[i] = (i % 5u) ? 0.0 : 10.0;
        tbw[i] = 20.0 + 30.0 * u;
        age[i] = 10.0 + 80.0 * u;
        weight[i] = 40.0 + 60.0 * u;
        sex[i] = (i % 3u) ? NTR_SEX_FEMALE : NTR_SEX_MALE;
    }
    na[500] = -1.0; /* one failed row in the middle */
    for (i = 0; i < SERIES; i++) {
        samples[i].hours = 2.0 * (double)i;
        samples[i].na_mmol_l = 118.0 + 0.3 * (double)i;
    }
    plan[0] = timed(0.0, 2.0, 60.0, 513.0);
    plan[1] = timed(0.0, 24.0, 20.0, 0.0);
    if (ntr_limits_preset(NTR_LIMITS_STANDARD, &limits) != NTR_OK) {
        return 1;
    }
    course_limits.struct_size = sizeof course_limits;
    if (ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, &course_limits) != NTR_OK) {
        return 1;
    }

    compute(&reference, &w, &cw);
    /* The reference itself must be a real result, not a row of errors. */
    for (k = 0; k < 12; k++) {
        /* row 500 is out of range; the free-water deficit of the hyponatraemic
         * rows is undefined (DOMAIN) from row 0 */
        int expected = k == 0 ? NTR_ERR_RANGE : k == 2 ? NTR_ERR_DOMAIN : NTR_OK;
        if (reference.ret[k] != expected) {
            fprintf(stderr, "threads: call %d returned %d\n", k, reference.ret[k]);
            return 1;
        }
    }

    for (i = 0; i < THREADS; i++) {
        if (pthread_create(&th[i], NULL, worker, (void *)i) != 0) {
            return 1;
        }
    }
    for (i = 0; i < THREADS; i++) {
        void *r = NULL;
        pthread_join(th[i], &r);
        failures += r != NULL;
    }
    if (failures != 0) {
        fprintf(stderr, "threads: %d threads got results other than the reference\n", failures);
        return 1;
    }
    printf("threads: %d threads x %d rounds, every result equal to the reference\n",
           THREADS, ROUNDS);
    return 0;
}
