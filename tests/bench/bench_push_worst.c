/* SPDX-License-Identifier: MIT */
/* Worst single push of the two watchers (issue 16), next to their steady
 * cost: ntr_watch_push and ntr_course_watch_push fed invented streams that
 * exercise their slow paths, one callgrind dump after every push.
 *
 * Run under valgrind --tool=callgrind --toggle-collect=ntr_watch_push
 * --toggle-collect=ntr_course_watch_push (tests/bench/run-bench.sh does);
 * outside valgrind the client requests do nothing. Each dump then holds the
 * instructions of exactly one push (inclusive of what it calls), labelled
 * "<watcher> <stream> <index>"; tests/bench/push_worst.py reads them.
 *
 * Streams (invented, no patient; every push must return NTR_OK):
 *   steady  one result every 4 h, a saw tooth of 32 steps of 0.25 mmol/L
 *           (the stream of bench_scalar's per-call figure);
 *   fill    one result every 0.4 h rising 0.05 mmol/L each time, so every
 *           result stays a candidate window minimum: the ring fills to its
 *           capacity (120 results cover 48 h; ntr_watch keeps 128, the course watcher 96 and compacts), then a
 *           result 6 mmol/L lower that removes every candidate at once;
 *   gap     the same rising fill, then one result 100 h later, so the start
 *           of every window moves past all kept results in one push.
 * Usage: bench_push_worst   (prints the pushes per stream; exits 1 if a
 * push failed). */
#include <stdio.h>

#include <valgrind/callgrind.h>

#include "natremia.h"

#define FILL 400

static int failed;

static void check(int status, const char *what)
{
    if (status != NTR_OK) {
        fprintf(stderr, "bench_push_worst: %s returned %d\n", what, status);
        failed = 1;
    }
}

/* One stream through both watchers, a dump after each push. */
static void stream(const char *name, int n, double (*hours)(int),
                   double (*na)(int))
{
    ntr_limits lim;
    ntr_course_limits clim;
    ntr_watch w;
    ntr_course_watch cw;
    ntr_correction c;
    ntr_course_report r;
    char label[64];
    int k;
    check(ntr_limits_preset(NTR_LIMITS_STANDARD, &lim), "ntr_limits_preset");
    check(ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, &clim),
          "ntr_course_limits_preset");
    check(ntr_watch_init(&lim, &w), "ntr_watch_init");
    check(ntr_course_watch_init(&clim, &cw), "ntr_course_watch_init");
    r.struct_size = sizeof r;
    CALLGRIND_DUMP_STATS_AT("setup");
    for (k = 0; k < n; k++) {
        check(ntr_watch_push(&w, hours(k), na(k), &c), "ntr_watch_push");
        snprintf(label, sizeof label, "ntr_watch_push %s %d", name, k);
        CALLGRIND_DUMP_STATS_AT(label);
    }
    for (k = 0; k < n; k++) {
        check(ntr_course_watch_push(&cw, hours(k), na(k), &r),
              "ntr_course_watch_push");
        snprintf(label, sizeof label, "ntr_course_watch_push %s %d", name, k);
        CALLGRIND_DUMP_STATS_AT(label);
    }
    printf("%s %d\n", name, n);
}

static double steady_h(int k) { return 4.0 * (double)k; }
static double steady_na(int k) { return 118.0 + 0.25 * (double)(k % 32); }
static double fill_h(int k) { return 0.4 * (double)k; }
static double fill_na(int k)
{
    return k < FILL ? 112.0 + 0.05 * (double)k : 112.0 + 0.05 * FILL - 6.0;
}
static double gap_h(int k) { return k < FILL ? 0.4 * (double)k : 0.4 * FILL + 100.0; }
static double gap_na(int k) { return 112.0 + 0.05 * (double)(k < FILL ? k : FILL); }

int main(void)
{
    stream("steady", 400, steady_h, steady_na);
    stream("fill", FILL + 1, fill_h, fill_na);
    stream("gap", FILL + 1, gap_h, gap_na);
    return failed;
}
