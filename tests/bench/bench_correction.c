/* SPDX-License-Identifier: MIT */
/* Side-by-side timing of the correction-series assessment (issue P2).
 *
 * Three ways to get the same ntr_correction for the same series, timed in
 * interleaved rounds on the same invented series:
 *   linear   ntr_correction_assess (block scheme, O(n), O(1) memory)
 *   pairwise the definitions read literally, every pair (O(n^2)):
 *            correction_oracle from tests/correction_oracle.h, the same
 *            code the unit test uses as its oracle
 *   watcher  ntr_watch_init + ntr_watch_push per sample (O(n) amortised)
 * and, since 1.1, the direction-aware engine under the same limits (goal
 * raise, no fall limit):
 *   course   ntr_course_assess (both directions: about twice the work)
 *   cwatch   ntr_course_watch_init + ntr_course_watch_push per sample
 * The checks outside the timed loops confirm that they agree (the course
 * watcher exactly while it has not compacted, never below after), so the
 * timing is of correct work.
 * Then the grouped and plan entry points of 1.1: ntr_course_assess per
 * series against ntr_batch_course_assess over the same cohort (which must
 * agree bit for bit), and ntr_course_plan_check against the rise-only
 * ntr_plan_check on the same plan.
 *
 * Usage: bench_correction [rounds]   (default 5)
 * Prints, per series length, nanoseconds per series for each way and the
 * ratios pairwise/linear and watcher/linear (medians over the rounds), then
 * course/linear and cwatch/linear.
 * Only the ratios mean anything across machines. */
#define _POSIX_C_SOURCE 199309L
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "natremia.h"
#include "../correction_oracle.h"

static double now_ns(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_MONOTONIC, &ts);
    return (double)ts.tv_sec * 1e9 + (double)ts.tv_nsec;
}

static uint64_t rng = 0x853c49e6748fea9bu;
static double unit(void)
{
    rng ^= rng >> 12;
    rng ^= rng << 25;
    rng ^= rng >> 27;
    return (double)((rng * 0x2545f4914f6cdd1du) >> 11) / 9007199254740992.0;
}

/* ---- workload ----------------------------------------------------------- */

/* `patients` invented series of n samples each, every `spacing_h` hours on
 * average, sodium drifting upwards from a low start. */
static void make_series(ntr_sample *s, size_t patients, size_t n, double spacing_h)
{
    for (size_t p = 0; p < patients; p++) {
        double t = 0.0, na = 110.0 + 10.0 * unit();
        for (size_t i = 0; i < n; i++) {
            s[p * n + i].hours = t;
            s[p * n + i].na_mmol_l = na;
            t += spacing_h * (0.5 + unit());
            /* drifts up about 0.3 per sample, pulled back towards 130 */
            na += unit() * 1.6 - 0.5 - 0.02 * (na - 130.0);
        }
    }
}

static int same(const ntr_correction *a, const ntr_correction *b)
{
    return a->rise_first_24h == b->rise_first_24h && a->max_rise_24h == b->max_rise_24h &&
           a->max_rise_48h == b->max_rise_48h && a->last_rate_per_h == b->last_rate_per_h &&
           a->excess_mmol_l == b->excess_mmol_l && a->flags == b->flags;
}

/* The course report against the exact one: equal unless the watcher
 * compacted, then never below. */
static int course_agrees(const ntr_course_report *exact, const ntr_course_report *w)
{
    if ((w->flags & NTR_CF_APPROXIMATE) == 0u) {
        return memcmp(exact, w, sizeof *w) == 0;
    }
    return w->max_rise_24h >= exact->max_rise_24h && w->max_rise_48h >= exact->max_rise_48h &&
           w->max_fall_24h >= exact->max_fall_24h && w->max_fall_48h >= exact->max_fall_48h;
}

static int cmp(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return (x > y) - (x < y);
}

static double median(double *v, int n)
{
    qsort(v, (size_t)n, sizeof v[0], cmp);
    return v[n / 2];
}

/* Times one series length; returns 0 when all three ways agreed. */
static int run(size_t n, size_t patients, double spacing_h, int rounds)
{
    ntr_sample *s = malloc(sizeof *s * n * patients);
    ntr_limits lim;
    ntr_course_limits clim;
    double t_lin[32], t_pair[32], t_watch[32], r_pair[32], r_watch[32];
    double r_course[32], r_cwatch[32];
    volatile unsigned int sink = 0;
    int bad = 0;
    if (s == NULL) {
        return 1;
    }
    ntr_limits_preset(NTR_LIMITS_STANDARD, &lim);
    ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, &clim);
    clim.min_change_24h = lim.min_rise_24h; /* the 1.0 preset's target, so flags compare */
    make_series(s, patients, n, spacing_h);
    for (int r = 0; r < rounds; r++) {
        double t0 = now_ns();
        for (size_t p = 0; p < patients; p++) {
            ntr_correction c;
            bad |= ntr_correction_assess(s + p * n, n, &lim, &c) != NTR_OK;
            sink += c.flags;
        }
        double t1 = now_ns();
        for (size_t p = 0; p < patients; p++) {
            ntr_correction c = correction_oracle(s + p * n, n, &lim);
            sink += c.flags;
        }
        double t2 = now_ns();
        for (size_t p = 0; p < patients; p++) {
            ntr_watch w;
            ntr_correction c;
            ntr_watch_init(&lim, &w);
            for (size_t i = 0; i < n; i++) {
                bad |= ntr_watch_push(&w, s[p * n + i].hours, s[p * n + i].na_mmol_l, &c) != NTR_OK;
            }
            sink += c.flags;
        }
        double t3 = now_ns();
        for (size_t p = 0; p < patients; p++) {
            ntr_course_report c;
            c.struct_size = sizeof c;
            bad |= ntr_course_assess(s + p * n, n, &clim, &c) != NTR_OK;
            sink += c.flags;
        }
        double t4 = now_ns();
        for (size_t p = 0; p < patients; p++) {
            ntr_course_watch w;
            ntr_course_report c;
            c.struct_size = sizeof c;
            ntr_course_watch_init(&clim, &w);
            for (size_t i = 0; i < n; i++) {
                bad |= ntr_course_watch_push(&w, s[p * n + i].hours, s[p * n + i].na_mmol_l,
                                             &c) != NTR_OK;
            }
            sink += c.flags;
        }
        double t5 = now_ns();
        r_course[r] = (t4 - t3) / (t1 - t0);
        r_cwatch[r] = (t5 - t4) / (t1 - t0);
        t_lin[r] = (t1 - t0) / (double)patients;
        t_pair[r] = (t2 - t1) / (double)patients;
        t_watch[r] = (t3 - t2) / (double)patients;
        r_pair[r] = t_pair[r] / t_lin[r];
        r_watch[r] = t_watch[r] / t_lin[r];
    }
    /* Agreement, outside the timed loops. */
    for (size_t p = 0; p < patients && p < 2000; p++) {
        ntr_correction a, b = correction_oracle(s + p * n, n, &lim), c;
        ntr_watch w;
        ntr_correction_assess(s + p * n, n, &lim, &a);
        ntr_watch_init(&lim, &w);
        for (size_t i = 0; i < n; i++) {
            ntr_watch_push(&w, s[p * n + i].hours, s[p * n + i].na_mmol_l, &c);
        }
        bad |= !same(&a, &b) || !same(&a, &c);
        {
            ntr_course_report exact, streamed;
            ntr_course_watch cw;
            exact.struct_size = sizeof exact;
            streamed.struct_size = sizeof streamed;
            ntr_course_assess(s + p * n, n, &clim, &exact);
            ntr_course_watch_init(&clim, &cw);
            for (size_t i = 0; i < n; i++) {
                ntr_course_watch_push(&cw, s[p * n + i].hours, s[p * n + i].na_mmol_l, &streamed);
            }
            bad |= exact.max_rise_24h != a.max_rise_24h || exact.max_rise_48h != a.max_rise_48h ||
                   (exact.flags & NTR_CF_ALL) != a.flags || !course_agrees(&exact, &streamed);
        }
    }
    printf("%7zu %9zu %12.1f %12.1f %12.1f %10.2f %10.2f %11.2f %11.2f%s\n", n, patients,
           median(t_lin, rounds), median(t_pair, rounds), median(t_watch, rounds),
           median(r_pair, rounds), median(r_watch, rounds), median(r_course, rounds),
           median(r_cwatch, rounds), bad ? "  DISAGREE" : "");
    free(s);
    (void)sink;
    return bad;
}

/* ---- both directions (1.1) ---------------------------------------------- */

static int same_report(const ntr_course_report *a, const ntr_course_report *b)
{
    return memcmp(&a->max_rise_24h, &b->max_rise_24h, 5 * sizeof(double)) == 0 &&
           a->flags == b->flags &&
           memcmp(&a->rise_first_24h, &b->rise_first_24h, 7 * sizeof(double)) == 0;
}

/* ns per series: the scalar course assessment in a loop, and the grouped
 * call over the same cohort; returns 0 when every group agreed. */
static int run_course(size_t n, size_t patients, double spacing_h, int rounds)
{
    ntr_sample *s = malloc(sizeof *s * n * patients);
    size_t *offsets = malloc(sizeof *offsets * (patients + 1));
    ntr_course_report *grouped = malloc(sizeof *grouped * patients);
    int *status = malloc(sizeof *status * patients);
    ntr_course_limits lim;
    double t_one[32], t_batch[32];
    volatile unsigned int sink = 0;
    int bad = 0;
    if (s == NULL || offsets == NULL || grouped == NULL || status == NULL) {
        return 1;
    }
    ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, &lim);
    make_series(s, patients, n, spacing_h);
    /* Touch the output pages before timing: the first writes to freshly
     * mapped memory would otherwise be charged to the grouped call. */
    memset(grouped, 0, sizeof *grouped * patients);
    memset(status, 0, sizeof *status * patients);
    for (size_t p = 0; p <= patients; p++) {
        offsets[p] = p * n;
    }
    for (int r = 0; r < rounds; r++) {
        double t0 = now_ns();
        for (size_t p = 0; p < patients; p++) {
            ntr_course_report c;
            c.struct_size = sizeof c;
            bad |= ntr_course_assess(s + p * n, n, &lim, &c) != NTR_OK;
            sink += c.flags;
        }
        double t1 = now_ns();
        bad |= ntr_batch_course_assess(patients, offsets, s, n * patients, &lim, sizeof grouped[0],
                                       grouped, status, NULL) != NTR_OK;
        double t2 = now_ns();
        t_one[r] = (t1 - t0) / (double)patients;
        t_batch[r] = (t2 - t1) / (double)patients;
    }
    for (size_t p = 0; p < patients; p++) {
        ntr_course_report c;
        c.struct_size = sizeof c;
        ntr_course_assess(s + p * n, n, &lim, &c);
        bad |= !same_report(&c, &grouped[p]);
    }
    printf("%7zu %9zu %12.1f %12.1f%s\n", n, patients, median(t_one, rounds),
           median(t_batch, rounds), bad ? "  DISAGREE" : "");
    free(s);
    free(offsets);
    free(grouped);
    free(status);
    (void)sink;
    return bad;
}

/* ns per call of the two plan checks on an invented plan: 3% saline
 * 150 mL twice over 40 min and a water diuresis from 4 h, 24 h at
 * 0.5 h steps, three samples of history. */
static int run_plans(int rounds)
{
    const ntr_sample history[3] = {{-12.0, 112.0}, {-6.0, 113.5}, {0.0, 115.0}};
    ntr_timed_flow plan[2];
    ntr_limits lim;
    ntr_course_limits course;
    double t_old[32], t_new[32];
    const int calls = 2000;
    int bad = 0;
    memset(plan, 0, sizeof plan);
    plan[0].end_h = 2.0 / 3.0;
    plan[0].rate_ml_h = 450.0;
    plan[0].na_mmol_l = 513.0;
    plan[1].start_h = 4.0;
    plan[1].end_h = 24.0;
    plan[1].rate_ml_h = -250.0;
    plan[1].na_mmol_l = 30.0;
    plan[1].k_mmol_l = 10.0;
    ntr_limits_preset(NTR_LIMITS_STANDARD, &lim);
    ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, &course);
    for (int r = 0; r < rounds; r++) {
        ntr_plan_result a;
        ntr_course_plan_result b;
        double t0 = now_ns();
        for (int k = 0; k < calls; k++) {
            bad |= ntr_plan_check(history, 3, 40.0, plan, 2, 24.0, 0.5, &lim, &a) != NTR_OK;
        }
        double t1 = now_ns();
        for (int k = 0; k < calls; k++) {
            b.struct_size = sizeof b;
            bad |= ntr_course_plan_check(history, 3, 40.0, plan, 2, 24.0, 0.5, &course, &b) != NTR_OK;
        }
        double t2 = now_ns();
        bad |= a.breach_24h_h != b.breach_rise_24h_h;
        t_old[r] = (t1 - t0) / calls;
        t_new[r] = (t2 - t1) / calls;
    }
    printf("# plan check, ns per call: ntr_plan_check %.1f, ntr_course_plan_check %.1f%s\n",
           median(t_old, rounds), median(t_new, rounds), bad ? "  DISAGREE" : "");
    return bad;
}

int main(int argc, char **argv)
{
    int rounds = argc > 1 ? atoi(argv[1]) : 5;
    int bad = 0;
    if (rounds < 1 || rounds > 32) {
        fprintf(stderr, "rounds: 1 to 32\n");
        return 2;
    }
    printf("# ns per series (median of %d rounds); ratios are per-round medians\n", rounds);
    printf("#     n  patients       linear     pairwise      watcher  pair/lin  watch/lin"
           " course/lin cwatch/lin\n");
    /* A cohort: a dozen results per admission, a few hours apart. */
    bad |= run(12, 200000, 6.0, rounds);
    bad |= run(48, 50000, 2.0, rounds);
    /* Long, dense series (monitoring): where O(n^2) hurts. */
    bad |= run(1000, 200, 0.5, rounds);
    bad |= run(10000, 4, 0.5, rounds);
    printf("# both directions (1.1), ns per series (median of %d rounds)\n", rounds);
    printf("#     n  patients  course_assess  batch_course\n");
    bad |= run_course(12, 200000, 6.0, rounds);
    bad |= run_course(1000, 200, 0.5, rounds);
    bad |= run_plans(rounds);
    return bad;
}
