/* Side-by-side timing of the correction-series assessment (issue P2).
 *
 * Three ways to get the same ntr_correction for the same series, timed in
 * interleaved rounds on the same invented series:
 *   linear   ntr_correction_assess (block scheme, O(n), O(1) memory)
 *   pairwise the definitions read literally, every pair (O(n^2)):
 *            correction_oracle from tests/correction_oracle.h, the same
 *            code the unit test uses as its oracle
 *   watcher  ntr_watch_init + ntr_watch_push per sample (O(n) amortised)
 * Each round checks that the three agree, so the timing is of correct work.
 * Then, in both directions (1.1): ntr_course_assess per series against
 * ntr_batch_course_assess over the same cohort (which must agree bit for
 * bit), and ntr_course_plan_check against the rise-only ntr_plan_check on
 * the same plan.
 *
 * Usage: bench_correction [rounds]   (default 5)
 * Prints, per series length, nanoseconds per series for each way and the
 * ratios pairwise/linear and watcher/linear (medians over the rounds).
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
    double t_lin[32], t_pair[32], t_watch[32], r_pair[32], r_watch[32];
    volatile unsigned int sink = 0;
    int bad = 0;
    if (s == NULL) {
        return 1;
    }
    ntr_limits_preset(NTR_LIMITS_STANDARD, &lim);
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
    }
    printf("%7zu %9zu %12.1f %12.1f %12.1f %10.2f %10.2f%s\n", n, patients,
           median(t_lin, rounds), median(t_pair, rounds), median(t_watch, rounds),
           median(r_pair, rounds), median(r_watch, rounds), bad ? "  DISAGREE" : "");
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
    printf("#     n  patients       linear     pairwise      watcher  pair/lin  watch/lin\n");
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
