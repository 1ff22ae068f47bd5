/* SPDX-License-Identifier: MIT */
/* Over-reads and over-writes caught by the plain test suite (issue 14).
 *
 * Every buffer a public function takes (batch columns, sample series,
 * flow and urine lists, the series a course is written into, watcher
 * states, limit structs, unit strings, method descriptions) is placed so
 * that it ends exactly where an inaccessible page begins (mmap, then
 * mprotect PROT_NONE on the page after), and in a second pass so that it
 * starts right after one. A function that reads or writes one element
 * past either end then dies with SIGSEGV, and this test program with it:
 * no sanitizer build is needed to see an off-by-one.
 *
 * Lengths run over 1 to 7 rows, odd and even, so both the two-lane path
 * of the batch kernels and their one-row tail meet the guard. */
#define _DEFAULT_SOURCE
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <string.h>
#include <math.h>
#include <sys/mman.h>
#include <unistd.h>
#include <cmocka.h>

#include "natremia.h"
#include "natremia_test.h"
#include "batch_table.h"

#define MAX_GUARDED 32

/* One mapping: the data pages between two PROT_NONE pages. */
struct guarded {
    unsigned char *map;
    size_t map_len;
};

static struct guarded live[MAX_GUARDED];
static size_t n_live;
static int at_start; /* 0: buffers end at the guard, 1: start after one */

/* bytes of caller memory whose last byte is followed by (or whose first
 * byte is preceded by) an inaccessible page. Freed by release_all(). */
static void *guard(size_t bytes)
{
    size_t page = (size_t)sysconf(_SC_PAGESIZE);
    size_t data = (bytes + page - 1) / page * page;
    unsigned char *m;
    assert_true(n_live < MAX_GUARDED);
    if (data == 0) {
        data = page;
    }
    m = mmap(NULL, data + 2 * page, PROT_READ | PROT_WRITE,
             MAP_PRIVATE | MAP_ANONYMOUS, -1, 0);
    assert_true(m != MAP_FAILED);
    assert_int_equal(mprotect(m, page, PROT_NONE), 0);
    assert_int_equal(mprotect(m + page + data, page, PROT_NONE), 0);
    live[n_live].map = m;
    live[n_live].map_len = data + 2 * page;
    n_live++;
    /* bytes is a multiple of the element's alignment for every caller
     * below, so the end-aligned pointer is aligned too. */
    return at_start ? m + page : m + page + data - bytes;
}

static void release_all(void)
{
    while (n_live > 0) {
        n_live--;
        munmap(live[n_live].map, live[n_live].map_len);
    }
}

/* Guarded storage for one struct with a struct_size member, set. */
#define GUARD_SIZED(T, var)       \
    T *var = guard(sizeof(T));    \
    var->struct_size = sizeof(T)

/* A copy of src in guarded memory. */
static void *guarded_copy(const void *src, size_t bytes)
{
    void *p = guard(bytes);
    memcpy(p, src, bytes);
    return p;
}

/* ---- batch functions ----------------------------------------------------- */

static void batch_rows(const struct bt_entry *e, size_t n, int last_bad)
{
    const double *cols[BT_MAX_COLS];
    double *c[BT_MAX_COLS];
    int *sex = guard(n * sizeof(int));
    void *out = guard(n * (e->int_out ? sizeof(int) : sizeof(double)));
    int *status = guard(n * sizeof(int));
    size_t *failed = guard(sizeof(size_t));
    size_t i;
    int k, ret;
    for (k = 0; k < e->ncol; k++) {
        c[k] = guard(n * sizeof(double));
        for (i = 0; i < n; i++) {
            c[k][i] = e->base[k];
        }
        cols[k] = c[k];
    }
    for (i = 0; i < n; i++) {
        sex[i] = (i % 2u) ? NTR_SEX_FEMALE : NTR_SEX_MALE;
    }
    if (last_bad) {
        c[0][n - 1] = (double)NAN;
    }
    ret = e->batch(n, cols, sex, out, status, failed);
    assert_int_equal(ret, last_bad ? NTR_ERR_NONFINITE : NTR_OK);
    assert_int_equal(*failed, last_bad ? 1u : 0u);
    for (i = 0; i < n; i++) {
        assert_int_equal(status[i], (last_bad && i == n - 1) ? NTR_ERR_NONFINITE : NTR_OK);
    }
    release_all();
}

static void batch_columns_end_at_guard(void **state)
{
    size_t t, n;
    (void)state;
    for (at_start = 0; at_start < 2; at_start++) {
        for (t = 0; t < BT_COUNT; t++) {
            for (n = 1; n <= 7; n++) {
                batch_rows(&bt_table[t], n, 0);
                batch_rows(&bt_table[t], n, 1);
            }
        }
    }
}

/* ---- batch series --------------------------------------------------------- */

/* A slowly rising series: n samples 4 h apart. */
static void series(ntr_sample *s, size_t n, double t0, double na0)
{
    size_t i;
    for (i = 0; i < n; i++) {
        s[i].hours = t0 + 4.0 * (double)i;
        s[i].na_mmol_l = na0 + 0.5 * (double)i;
    }
}

static void batch_groups_end_at_guard(void **state)
{
    size_t groups;
    (void)state;
    for (at_start = 0; at_start < 2; at_start++) {
        for (groups = 1; groups <= 4; groups++) {
            size_t n_samples = 3 * groups, g;
            size_t *offsets = guard((groups + 1) * sizeof(size_t));
            ntr_sample *s = guard(n_samples * sizeof(ntr_sample));
            ntr_limits *lim = guard(sizeof(ntr_limits));
            GUARD_SIZED(ntr_course_limits, clim);
            ntr_correction *out = guard(groups * sizeof(ntr_correction));
            ntr_course_report *reports = guard(groups * sizeof(ntr_course_report));
            int *status = guard(groups * sizeof(int));
            size_t failed = 99;
            for (g = 0; g <= groups; g++) {
                offsets[g] = 3 * g;
            }
            for (g = 0; g < groups; g++) {
                series(s + 3 * g, 3, 0.0, 120.0 + (double)g);
            }
            assert_int_equal(ntr_limits_preset(NTR_LIMITS_STANDARD, lim), NTR_OK);
            assert_int_equal(ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, clim), NTR_OK);
            assert_int_equal(ntr_batch_correction_assess(groups, offsets, s, n_samples, lim,
                                                         out, status, &failed),
                             NTR_OK);
            assert_int_equal(failed, 0u);
            assert_int_equal(ntr_batch_course_assess(groups, offsets, s, n_samples, clim,
                                                     sizeof(ntr_course_report), reports,
                                                     status, &failed),
                             NTR_OK);
            assert_int_equal(failed, 0u);
            release_all();
        }
    }
}

/* ---- series, courses and plans ---------------------------------------------- */

static void series_functions_end_at_guard(void **state)
{
    size_t n;
    (void)state;
    for (at_start = 0; at_start < 2; at_start++) {
        for (n = 1; n <= 6; n++) {
            ntr_sample *s = guard(n * sizeof(ntr_sample));
            ntr_limits *lim = guard(sizeof(ntr_limits));
            GUARD_SIZED(ntr_course_limits, clim);
            ntr_correction *corr = guard(sizeof(ntr_correction));
            GUARD_SIZED(ntr_course_report, rep);
            series(s, n, 0.0, 120.0);
            assert_int_equal(ntr_limits_preset(NTR_LIMITS_STANDARD, lim), NTR_OK);
            assert_int_equal(ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, clim), NTR_OK);
            assert_int_equal(ntr_correction_assess(s, n, lim, corr), NTR_OK);
            assert_int_equal(ntr_course_assess(s, n, clim, rep), NTR_OK);
            release_all();
        }
    }
}

static void flows_and_courses_end_at_guard(void **state)
{
    size_t n;
    (void)state;
    for (at_start = 0; at_start < 2; at_start++) {
        for (n = 1; n <= 4; n++) {
            const ntr_timed_flow plan[4] = {
                ntr_test_timed(0.0, 2.0, 60.0, 513.0, 0.0),
                ntr_test_timed(0.0, 24.0, 40.0, 154.0, 20.0),
                ntr_test_timed(2.0, 12.0, -100.0, 60.0, 30.0),
                ntr_test_timed(6.0, 24.0, 20.0, 0.0, 0.0),
            };
            const ntr_flow given[4] = {{0.5, 154.0, 0.0}, {0.2, 513.0, 0.0},
                                       {-0.3, 50.0, 20.0}, {0.1, 0.0, 0.0}};
            ntr_timed_flow *tf = guarded_copy(plan, n * sizeof plan[0]);
            ntr_flow *fl = guarded_copy(given, n * sizeof given[0]);
            double *na = guard(sizeof(double)), *tbw = guard(sizeof(double));
            size_t *count = guard(sizeof(size_t));
            size_t need = 0;
            ntr_sample *course;
            assert_int_equal(ntr_balance_predict(118.0, 40.0, fl, n, na, tbw), NTR_OK);
            /* Ask for the size, then give exactly that many points. */
            assert_int_equal(ntr_balance_course(118.0, 40.0, tf, n, 24.0, 0.5, NULL, 0, &need),
                             NTR_ERR_CAPACITY);
            course = guard(need * sizeof(ntr_sample));
            assert_int_equal(ntr_balance_course(118.0, 40.0, tf, n, 24.0, 0.5, course, need,
                                                count),
                             NTR_OK);
            assert_int_equal(*count, need);
            release_all();
        }
    }
}

static void plans_end_at_guard(void **state)
{
    size_t nh, nf;
    (void)state;
    for (at_start = 0; at_start < 2; at_start++) {
        for (nh = 1; nh <= 4; nh++) {
            for (nf = 1; nf <= 2; nf++) {
                const ntr_timed_flow plan[2] = {
                    ntr_test_timed(0.0, 1.0, 60.0, 513.0, 0.0),
                    ntr_test_timed(0.0, 24.0, 20.0, 0.0, 0.0),
                };
                ntr_sample *h = guard(nh * sizeof(ntr_sample));
                ntr_timed_flow *tf = guarded_copy(plan, nf * sizeof plan[0]);
                ntr_limits *lim = guard(sizeof(ntr_limits));
                GUARD_SIZED(ntr_course_limits, clim);
                ntr_plan_result *pr = guard(sizeof(ntr_plan_result));
                GUARD_SIZED(ntr_course_plan_result, cpr);
                series(h, nh, -4.0 * (double)(nh - 1), 118.0);
                assert_int_equal(ntr_limits_preset(NTR_LIMITS_STANDARD, lim), NTR_OK);
                assert_int_equal(ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, clim),
                                 NTR_OK);
                assert_int_equal(ntr_plan_check(h, nh, 40.0, tf, nf, 24.0, 0.5, lim, pr),
                                 NTR_OK);
                assert_int_equal(ntr_course_plan_check(h, nh, 40.0, tf, nf, 24.0, 0.5, clim,
                                                       cpr),
                                 NTR_OK);
                release_all();
            }
        }
    }
}

static void feedback_and_fit_end_at_guard(void **state)
{
    size_t nu, nh;
    (void)state;
    for (at_start = 0; at_start < 2; at_start++) {
        for (nu = 1; nu <= 3; nu++) {
            const ntr_timed_flow plan[2] = {
                ntr_test_timed(0.0, 6.0, 60.0, 513.0, 0.0),
                ntr_test_timed(0.0, 48.0, 20.0, 0.0, 0.0),
            };
            const ntr_urine_interval u3[3] = {ntr_test_urine(0.0, 2.0, 200.0, 60.0, 30.0, 500.0),
                                              ntr_test_urine(2.0, 4.0, 300.0, 60.0, 30.0, 500.0),
                                              ntr_test_urine(4.0, 5.0, 250.0, 20.0, 15.0, 180.0)};
            ntr_sample *h = guard(2 * sizeof(ntr_sample));
            ntr_timed_flow *tf = guarded_copy(plan, sizeof plan);
            ntr_urine_interval *u = guarded_copy(u3, nu * sizeof u3[0]);
            GUARD_SIZED(ntr_course_limits, clim);
            GUARD_SIZED(ntr_urine_feedback_result, r);
            h[0].hours = 10.0;
            h[0].na_mmol_l = 118.0;
            h[1].hours = 13.0;
            h[1].na_mmol_l = 121.0;
            assert_int_equal(ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, clim), NTR_OK);
            assert_int_equal(ntr_urine_feedback(h, 2, 30.0, tf, 2, u, nu, 6.0, 0.5, clim, r),
                             NTR_OK);
            release_all();
        }
        for (nh = 3; nh <= 6; nh++) {
            /* Series from the forward model itself (ntr_balance_course),
             * so the fit has an exact answer. */
            const ntr_timed_flow plan[2] = {
                ntr_test_timed(0.0, 6.0, 100.0, 513.0, 0.0),
                ntr_test_timed(0.0, 48.0, -120.0, 0.0, 0.0),
            };
            ntr_sample all[64];
            size_t count = 0, i;
            ntr_sample *h = guard(nh * sizeof(ntr_sample));
            ntr_timed_flow *tf = guarded_copy(plan, sizeof plan);
            GUARD_SIZED(ntr_course_limits, clim);
            GUARD_SIZED(ntr_fit, fit);
            GUARD_SIZED(ntr_course_plan_result, cpr);
            assert_int_equal(ntr_balance_course(120.0, 35.0, tf, 2, 24.0, 1.0, all, 64, &count),
                             NTR_OK);
            for (i = 0; i < nh; i++) {
                h[i] = all[i * (count - 1) / (nh - 1)];
            }
            assert_int_equal(ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, clim), NTR_OK);
            assert_int_equal(ntr_course_fit(h, nh, 40.0, tf, 2, fit), NTR_OK);
            assert_int_equal(ntr_fit_reproject(h, nh, fit, tf, 2, 12.0, 0.5, clim, cpr), NTR_OK);
            release_all();
        }
    }
}

/* ---- watchers --------------------------------------------------------------- */

static void watchers_end_at_guard(void **state)
{
    (void)state;
    for (at_start = 0; at_start < 2; at_start++) {
        ntr_limits *lim = guard(sizeof(ntr_limits));
        GUARD_SIZED(ntr_course_limits, clim);
        ntr_watch *w = guard(sizeof(ntr_watch));
        ntr_course_watch *cw = guard(sizeof(ntr_course_watch));
        ntr_correction *corr = guard(sizeof(ntr_correction));
        GUARD_SIZED(ntr_course_report, rep);
        int i;
        assert_int_equal(ntr_limits_preset(NTR_LIMITS_STANDARD, lim), NTR_OK);
        assert_int_equal(ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, clim), NTR_OK);
        assert_int_equal(ntr_watch_init(lim, w), NTR_OK);
        assert_int_equal(ntr_course_watch_init(clim, cw), NTR_OK);
        /* Ten minutes apart, up and down, for 100 h: far more samples than
         * the rings hold, so they wrap and compact many times. */
        for (i = 0; i < 600; i++) {
            double t = (double)i / 6.0;
            double na = 120.0 + 0.05 * (double)i + ((i % 7) == 0 ? -0.4 : 0.0);
            if (na > 200.0) {
                na = 200.0;
            }
            assert_int_equal(ntr_watch_push(w, t, na, corr), NTR_OK);
            assert_int_equal(ntr_course_watch_push(cw, t, na, rep), NTR_OK);
            assert_int_equal(ntr_course_watch_push_glucose(cw, t + 0.01, na, 6.0,
                                                           NTR_GLUCOSE_KATZ, rep),
                             NTR_OK);
        }
        assert_int_equal(ntr_watch_result(w, corr), NTR_OK);
        assert_int_equal(ntr_course_watch_result(cw, rep), NTR_OK);
        release_all();
    }
}

/* ---- strings and descriptions ------------------------------------------------- */

static void strings_end_at_guard(void **state)
{
    static const char *const names[] = {"mmol/L", "mg/dL", "mEq/L", "mosm/kg", "", "x",
                                        "mmol/Lx", "mmol"};
    size_t k;
    int m;
    (void)state;
    for (at_start = 0; at_start < 2; at_start++) {
        for (k = 0; k < sizeof names / sizeof names[0]; k++) {
            /* The terminating NUL is the last accessible byte. */
            size_t len = strlen(names[k]) + 1;
            char *s = guarded_copy(names[k], len);
            int *unit = guard(sizeof(int));
            int st = ntr_unit_parse(s, unit);
            assert_true(st == NTR_OK || st == NTR_ERR_UNIT);
            release_all();
        }
        /* Every method id the library knows: its description struct at the
         * guard. */
        for (m = 0; m < 1000; m++) {
            struct ntr_method_info *info = guard(sizeof(struct ntr_method_info));
            int st = ntr_method_info(m, info);
            assert_true(st == NTR_OK || st == NTR_ERR_ARG);
            release_all();
        }
    }
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(batch_columns_end_at_guard),
        cmocka_unit_test(batch_groups_end_at_guard),
        cmocka_unit_test(series_functions_end_at_guard),
        cmocka_unit_test(flows_and_courses_end_at_guard),
        cmocka_unit_test(plans_end_at_guard),
        cmocka_unit_test(feedback_and_fit_end_at_guard),
        cmocka_unit_test(watchers_end_at_guard),
        cmocka_unit_test(strings_end_at_guard),
    };
    return cmocka_run_group_tests_name("guard", tests, NULL, NULL);
}
