/* SPDX-License-Identifier: MIT */
/* Batch (array) entry points (docs/batch.md).
 *
 * Each function applies one scalar formula to n rows of caller-owned
 * columns. No formula and no input check is written here: each row goes
 * through the kernel of its scalar function (lib/<area>_kernels.h, the one
 * definition, docs/batch.md "Where each formula lives"), so a row's result
 * and status are the scalar function's bit for bit by construction;
 * tests/test_batch.c checks that on random rows, valid and invalid.
 *
 * Why the loops call the kernels instead of the public scalar functions:
 * the kernels are static inline, so the loop bodies stay free of calls and
 * the compiler can keep them in registers and stream the columns at memory
 * speed. Builds for size (-Os) are the exception: there code, not speed,
 * is scarce, and each row calls the public scalar function instead, which
 * holds the library's one copy of the kernel (NTR_BATCH_LOOPS below). */
#include "ntr_internal.h"
#include "osmolality_kernels.h"
#include "sodium_kernels.h"
#include "water_kernels.h"
#include "infusion_kernels.h"
#include "urine_kernels.h"

/* The value written into out[i] for a failed row. */
#define FAILED_ROW ((double)NAN)

/* ---- two rows at a time ------------------------------------------------
 *
 * On processors with two-lane double-precision vectors (x86-64 SSE2,
 * AArch64) each entry point first tries rows i and i+1 together: the
 * kernels are compiled a second time for two lanes (lib/kernel_lanes.h),
 * which load both rows, check every input of both against its range with
 * vector comparisons, and compute both values with the same operations in
 * the same order as the scalar kernel (lane by lane the same IEEE
 * results). When both rows pass, the pair is stored with status NTR_OK.
 * When anything fails, row i goes through the scalar kernel, which finds
 * the exact status, and the pair is tried again from row i+1. Valid
 * cohorts, the common case, then cost a third of the instructions per
 * row, which is what brings the batch calls near memory speed
 * (tests/bench/run-bench.sh). GCC and Clang vector extensions; any other
 * compiler or target uses the scalar kernels alone.
 */
/* Size-optimised builds (-Os) loop over the scalar functions instead of
 * inlining the kernels (see above). */
#if defined(__OPTIMIZE_SIZE__)
#define NTR_BATCH_LOOPS 1
#else
#define NTR_BATCH_LOOPS 0
#endif

#if !NTR_BATCH_LOOPS && defined(__GNUC__) && \
    (defined(__SSE2__) || defined(__aarch64__)) && \
    (defined(__clang__) || __GNUC__ >= 9)
#define NTR_PAIRS 1
#if defined(__SSE2__)
#include <emmintrin.h>
#endif
/* Two doubles in a register; in memory (ntr_pair_mem) at any 8-byte
 * aligned address, aliasing double. */
typedef double ntr_pair __attribute__((vector_size(16)));
typedef double ntr_pair_mem
    __attribute__((vector_size(16), aligned(8), may_alias));
/* Two ints, for the advice column. */
typedef int ntr_int_pair __attribute__((vector_size(8), aligned(4), may_alias));
/* Integers in two 64-bit lanes (a comparison result is 0 or -1). */
typedef long long ntr_lanes __attribute__((vector_size(16)));

static inline ntr_pair pair_load(const double *p)
{
    return *(const ntr_pair_mem *)p;
}

static inline void pair_store(double *p, ntr_pair v)
{
    *(ntr_pair_mem *)p = v;
}

/* Lane masks (all bits set where true). The comparisons are ordered:
 * false when either side is NaN. On x86 the SSE2 intrinsics keep masks in
 * registers; the generic vector operators serve other targets. */
#if defined(__SSE2__)
typedef __m128d ntr_mask;
/* Two sex codes (two ints, in the low half). */
typedef __m128i ntr_sex_pair;
static inline ntr_pair pair_splat(double x)
{
    return _mm_set1_pd(x);
}
/* A kernel's starting verdict, and each check ANDed into it. The verdict
 * uses the generic operator on the integer view so that the compiler
 * folds the all-ones start away (_mm_and_pd with a constant is not
 * folded); the rest of the mask logic stays in SSE2 intrinsics, with
 * which GCC 12 spills fewer registers in the longer kernels. */
static inline ntr_mask pair_true(void)
{
    ntr_lanes all = {-1, -1};
    return (ntr_mask)all;
}
static inline ntr_mask pair_verdict_and(ntr_mask verdict, ntr_mask m)
{
    return (ntr_mask)((ntr_lanes)verdict & (ntr_lanes)m);
}

static inline ntr_mask pair_ge(ntr_pair a, ntr_pair b)
{
    return _mm_cmpge_pd(a, b);
}
static inline ntr_mask pair_gt(ntr_pair a, ntr_pair b)
{
    return _mm_cmpgt_pd(a, b);
}
static inline ntr_mask pair_le(ntr_pair a, ntr_pair b)
{
    return _mm_cmple_pd(a, b);
}
static inline ntr_mask pair_lt(ntr_pair a, ntr_pair b)
{
    return _mm_cmplt_pd(a, b);
}
/* For NTRK_EQ; no kernel needs it in two lanes today (the zero-change
 * early return tests nothing there), hence "unused" for Clang. */
static inline __attribute__((unused)) ntr_mask pair_eq(ntr_pair a, ntr_pair b)
{
    return _mm_cmpeq_pd(a, b);
}
static inline ntr_mask pair_and(ntr_mask a, ntr_mask b)
{
    return _mm_and_pd(a, b);
}
static inline ntr_mask pair_or(ntr_mask a, ntr_mask b)
{
    return _mm_or_pd(a, b);
}
static inline int pair_all(ntr_mask m)
{
    return _mm_movemask_pd(m) == 3;
}
static inline ntr_pair pair_select(ntr_mask m, ntr_pair a, ntr_pair b)
{
    return _mm_or_pd(_mm_and_pd(m, a), _mm_andnot_pd(m, b));
}
static inline ntr_sex_pair pair_sex_load(const int *sex)
{
    return _mm_loadl_epi64((const __m128i *)(const void *)sex);
}
/* Lanes whose sex code is `which`: both codes in one compare, widened to
 * the double lanes. */
static inline ntr_mask pair_sex_is(ntr_sex_pair codes, int which)
{
    __m128i same = _mm_cmpeq_epi32(codes, _mm_set1_epi32(which));
    return _mm_castsi128_pd(_mm_unpacklo_epi32(same, same));
}
#else
typedef long long ntr_mask __attribute__((vector_size(16)));
typedef ntr_int_pair ntr_sex_pair;
static inline ntr_pair pair_splat(double x)
{
    ntr_pair v = {x, x};
    return v;
}
static inline ntr_mask pair_true(void)
{
    ntr_mask m = {-1, -1};
    return m;
}
static inline ntr_mask pair_ge(ntr_pair a, ntr_pair b) { return a >= b; }
static inline ntr_mask pair_gt(ntr_pair a, ntr_pair b) { return a > b; }
static inline ntr_mask pair_le(ntr_pair a, ntr_pair b) { return a <= b; }
static inline ntr_mask pair_lt(ntr_pair a, ntr_pair b) { return a < b; }
static inline __attribute__((unused)) ntr_mask pair_eq(ntr_pair a, ntr_pair b)
{
    return a == b;
}
static inline ntr_mask pair_and(ntr_mask a, ntr_mask b) { return a & b; }
static inline ntr_mask pair_or(ntr_mask a, ntr_mask b) { return a | b; }
static inline ntr_mask pair_verdict_and(ntr_mask v, ntr_mask m) { return v & m; }
static inline int pair_all(ntr_mask m) { return (m[0] & m[1]) != 0; }
static inline ntr_pair pair_select(ntr_mask m, ntr_pair a, ntr_pair b)
{
    return (ntr_pair)(((ntr_mask)a & m) | ((ntr_mask)b & ~m));
}
static inline ntr_sex_pair pair_sex_load(const int *sex)
{
    return *(const ntr_sex_pair *)sex;
}
static inline ntr_mask pair_sex_is(ntr_sex_pair codes, int which)
{
    ntr_mask m = {-(long long)(codes[0] == which),
                  -(long long)(codes[1] == which)};
    return m;
}
#endif

/* Both lanes: lo <= x <= hi (false for NaN and the infinities). */
static inline ntr_mask pair_in(ntr_pair x, double lo, double hi)
{
    return pair_and(pair_ge(x, pair_splat(lo)), pair_le(x, pair_splat(hi)));
}

static inline void pair_ok(int *status)
{
    status[0] = NTR_OK;
    status[1] = NTR_OK;
}

/* Both rows valid: store their values and statuses. */
static inline int pair_put(double *out, int *status, size_t i, ntr_pair value)
{
    pair_store(out + i, value);
    pair_ok(status + i);
    return 1;
}

/* The kernels of every batch formula for two lanes (ntrp_*). */
#undef NTRK_FLAVOUR
#define NTRK_FLAVOUR 1
#include "kernel_lanes.h"
#include "model_kernels.h"
#include "osmolality_kernels.h"
#include "sodium_kernels.h"
#include "water_kernels.h"
#include "infusion_kernels.h"
#include "urine_kernels.h"

/* The row loops (rows_*) stay out of line in this build: they run only
 * for a pair with a failing row and for the last odd row, and keeping
 * them out of the pair loop leaves it its registers (NTR_DRIVE). */
#define NTR_ROWS __attribute__((noinline))
#else
#define NTR_PAIRS 0
#define NTR_ROWS
#endif

/* The kernels of every batch formula for the row loops (ntrr_*: the
 * scalar kernels with branch-free choices), then back to the scalar
 * flavour (lib/kernel_lanes.h). */
#undef NTRK_FLAVOUR
#define NTRK_FLAVOUR 2
#include "kernel_lanes.h"
#include "model_kernels.h"
#include "osmolality_kernels.h"
#include "sodium_kernels.h"
#include "water_kernels.h"
#include "infusion_kernels.h"
#include "urine_kernels.h"
#undef NTRK_FLAVOUR
#define NTRK_FLAVOUR 0
#include "kernel_lanes.h"

/* What a row loop calls: the inlined row kernel, or in a size-optimised
 * build the public scalar function (the same kernel behind a NULL check
 * that cannot fail here). Either leaves the value alone on an error, so a
 * failed row keeps FAILED_ROW. */
#if NTR_BATCH_LOOPS
#define NTR_ROW(name) ntr_##name
#else
#define NTR_ROW(name) ntrr_##name
#endif

/* Store one row's status and count it when it failed. */
static inline size_t row_status(int st, int *status, size_t i)
{
    status[i] = st;
    return st != NTR_OK;
}

/* Shared ending of every batch call: the number of failed rows goes to
 * the optional counter, and the status of the first failed row (found by
 * a second scan that runs only when something failed, so the hot loop
 * carries nothing but a counter) is the return value. */
static int finish(size_t n, const int *status, size_t bad, size_t *failed)
{
    size_t i;
    if (failed != NULL) {
        *failed = bad;
    }
    if (bad == 0) {
        return NTR_OK;
    }
    /* bad > 0, so n >= 1 and some row failed: stop at the first one (the
     * bound only guards against a status array changed under our feet). */
    for (i = 0; i + 1 < n && status[i] == NTR_OK; i++) {
    }
    return status[i];
}

/* The row loop of every entry point with a double result. Before it, the
 * entry point defines NTR_PAIR_EVAL(i, v), its two-lane kernel on rows i
 * and i+1 (the verdict, the two values into *v), and
 * NTR_ROW_RANGE(from, to), its row loop over [from, to) (the number of
 * failed rows); bad counts the failed rows.
 *
 * Pairs while both rows pass, with no call inside that loop, so the
 * kernel's constants stay in registers (a call would clobber them). When
 * a pair fails, its first row goes through the row kernel, which finds the
 * exact status, and the pairs resume at the next row; the last odd row
 * goes through the row kernel too. A pair's values are stored only when
 * both rows pass, so an out column that is also an input column (in
 * place) is read before it is written, as in the row loop. (Two pairs per
 * test were tried: no faster on valid rows, up to 40% slower on mixed
 * ones, tests/bench/batch-ab.sh.) */
#if NTR_PAIRS
#define NTR_DRIVE(n, out, status, bad)                                       \
    do {                                                                     \
        size_t i_ = 0;                                                       \
        while (i_ + 1 < (n)) {                                               \
            ntr_pair v_;                                                     \
            while (i_ + 1 < (n) && pair_all(NTR_PAIR_EVAL(i_, &v_))) {      \
                (void)pair_put((out), (status), i_, v_);                     \
                i_ += 2;                                                     \
            }                                                                \
            if (i_ + 1 < (n)) {                                              \
                (bad) += NTR_ROW_RANGE(i_, i_ + 1);                          \
                i_++;                                                        \
            }                                                                \
        }                                                                    \
        (bad) += NTR_ROW_RANGE(i_, (n));                                     \
    } while (0)
#else
#define NTR_DRIVE(n, out, status, bad) ((bad) += NTR_ROW_RANGE(0, (n)))
#endif

/* ---- osmolality (lib/osmolality_kernels.h) ---------------------------- */

/* The formula's coefficients are resolved once per call, so the row loop
 * calls the kernel in every build. */
static NTR_ROWS size_t rows_osm_calculated(size_t from, size_t to,
                                           const double *na_mmol_l,
                                           const double *glucose_mmol_l,
                                           const double *urea_mmol_l,
                                           const double *ethanol_mmol_l,
                                           double coefficient,
                                           double intercept, double *out,
                                           int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double v = FAILED_ROW;
        int st = ntrr_osm_calculated(na_mmol_l[i], glucose_mmol_l[i],
                                     urea_mmol_l[i], ethanol_mmol_l[i],
                                     coefficient, intercept, &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return bad;
}

int ntr_batch_osm_calculated(size_t n, const double *na_mmol_l,
                             const double *glucose_mmol_l,
                             const double *urea_mmol_l,
                             const double *ethanol_mmol_l, int formula,
                             double *out, int *status, size_t *failed)
{
    double coefficient;
    double intercept;
    size_t bad = 0;
    if (na_mmol_l == NULL || glucose_mmol_l == NULL || urea_mmol_l == NULL ||
        ethanol_mmol_l == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntri_osm_formula(formula, &coefficient, &intercept));
#define NTR_PAIR_EVAL(i, v) \
    ntrp_osm_calculated(pair_load(na_mmol_l + (i)),                           \
                        pair_load(glucose_mmol_l + (i)),                      \
                        pair_load(urea_mmol_l + (i)),                         \
                        pair_load(ethanol_mmol_l + (i)),                      \
                        pair_splat(coefficient), pair_splat(intercept), (v))
#define NTR_ROW_RANGE(from, to) \
    rows_osm_calculated((from), (to), na_mmol_l, glucose_mmol_l, urea_mmol_l, \
                        ethanol_mmol_l, coefficient, intercept, out, status)
    NTR_DRIVE(n, out, status, bad);
#undef NTR_PAIR_EVAL
#undef NTR_ROW_RANGE
    return finish(n, status, bad, failed);
}

static NTR_ROWS size_t rows_osm_effective(size_t from, size_t to,
                                          const double *na_mmol_l,
                                          const double *glucose_mmol_l,
                                          double *out, int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double v = FAILED_ROW;
        int st = NTR_ROW(osm_effective)(na_mmol_l[i], glucose_mmol_l[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return bad;
}

int ntr_batch_osm_effective(size_t n, const double *na_mmol_l,
                            const double *glucose_mmol_l, double *out,
                            int *status, size_t *failed)
{
    size_t bad = 0;
    if (na_mmol_l == NULL || glucose_mmol_l == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
#define NTR_PAIR_EVAL(i, v) \
    ntrp_osm_effective(pair_load(na_mmol_l + (i)),                            \
                       pair_load(glucose_mmol_l + (i)), (v))
#define NTR_ROW_RANGE(from, to) \
    rows_osm_effective((from), (to), na_mmol_l, glucose_mmol_l, out, status)
    NTR_DRIVE(n, out, status, bad);
#undef NTR_PAIR_EVAL
#undef NTR_ROW_RANGE
    return finish(n, status, bad, failed);
}

static NTR_ROWS size_t rows_osm_gap(size_t from, size_t to,
                                    const double *measured_mosm_kg,
                                    const double *calculated_mosm_kg,
                                    double *out, int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double v = FAILED_ROW;
        int st = NTR_ROW(osm_gap)(measured_mosm_kg[i], calculated_mosm_kg[i],
                                  &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return bad;
}

int ntr_batch_osm_gap(size_t n, const double *measured_mosm_kg,
                      const double *calculated_mosm_kg, double *out,
                      int *status, size_t *failed)
{
    size_t bad = 0;
    if (measured_mosm_kg == NULL || calculated_mosm_kg == NULL ||
        out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
#define NTR_PAIR_EVAL(i, v) \
    ntrp_osm_gap(pair_load(measured_mosm_kg + (i)),                           \
                 pair_load(calculated_mosm_kg + (i)), (v))
#define NTR_ROW_RANGE(from, to) \
    rows_osm_gap((from), (to), measured_mosm_kg, calculated_mosm_kg, out,     \
                 status)
    NTR_DRIVE(n, out, status, bad);
#undef NTR_PAIR_EVAL
#undef NTR_ROW_RANGE
    return finish(n, status, bad, failed);
}

/* ---- sodium (lib/sodium_kernels.h) ------------------------------------ */

/* The method's factor is resolved once per call; each row is then
 * ntr_na_corrected_glucose_factor() with it. */
static NTR_ROWS size_t rows_na_corrected_glucose(size_t from, size_t to,
                                                 const double *na_mmol_l,
                                                 const double *glucose_mmol_l,
                                                 double factor, double *out,
                                                 int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double v = FAILED_ROW;
        int st = NTR_ROW(na_corrected_glucose_factor)(na_mmol_l[i],
                                                      glucose_mmol_l[i],
                                                      factor, &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return bad;
}

int ntr_batch_na_corrected_glucose(size_t n, const double *na_mmol_l,
                                   const double *glucose_mmol_l, int method,
                                   double *out, int *status, size_t *failed)
{
    double factor;
    size_t bad = 0;
    if (na_mmol_l == NULL || glucose_mmol_l == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntri_glucose_factor(method, &factor));
#define NTR_PAIR_EVAL(i, v) \
    ntrp_na_corrected_glucose_factor(pair_load(na_mmol_l + (i)),              \
                                     pair_load(glucose_mmol_l + (i)),         \
                                     pair_splat(factor), (v))
#define NTR_ROW_RANGE(from, to) \
    rows_na_corrected_glucose((from), (to), na_mmol_l, glucose_mmol_l,        \
                              factor, out, status)
    NTR_DRIVE(n, out, status, bad);
#undef NTR_PAIR_EVAL
#undef NTR_ROW_RANGE
    return finish(n, status, bad, failed);
}

static NTR_ROWS size_t rows_na_deficit(size_t from, size_t to,
                                       const double *tbw_l,
                                       const double *na_mmol_l,
                                       const double *target_na_mmol_l,
                                       double *out, int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double v = FAILED_ROW;
        int st = NTR_ROW(na_deficit)(tbw_l[i], na_mmol_l[i],
                                     target_na_mmol_l[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return bad;
}

int ntr_batch_na_deficit(size_t n, const double *tbw_l,
                         const double *na_mmol_l,
                         const double *target_na_mmol_l, double *out,
                         int *status, size_t *failed)
{
    size_t bad = 0;
    if (tbw_l == NULL || na_mmol_l == NULL || target_na_mmol_l == NULL ||
        out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
#define NTR_PAIR_EVAL(i, v) \
    ntrp_na_deficit(pair_load(tbw_l + (i)), pair_load(na_mmol_l + (i)),       \
                    pair_load(target_na_mmol_l + (i)), (v))
#define NTR_ROW_RANGE(from, to) \
    rows_na_deficit((from), (to), tbw_l, na_mmol_l, target_na_mmol_l, out,    \
                    status)
    NTR_DRIVE(n, out, status, bad);
#undef NTR_PAIR_EVAL
#undef NTR_ROW_RANGE
    return finish(n, status, bad, failed);
}

/* ---- water (lib/water_kernels.h) -------------------------------------- */

static NTR_ROWS size_t rows_tbw_fraction(size_t from, size_t to,
                                         const int *sex,
                                         const double *age_years,
                                         const double *weight_kg, double *out,
                                         int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double v = FAILED_ROW;
        int st = NTR_ROW(tbw_fraction)(sex[i], age_years[i], weight_kg[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return bad;
}

int ntr_batch_tbw_fraction(size_t n, const int *sex, const double *age_years,
                           const double *weight_kg, double *out, int *status,
                           size_t *failed)
{
    size_t bad = 0;
    if (sex == NULL || age_years == NULL || weight_kg == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
#define NTR_PAIR_EVAL(i, v) \
    ntrp_tbw_fraction(pair_sex_load(sex + (i)), pair_load(age_years + (i)),   \
                      pair_load(weight_kg + (i)), (v))
#define NTR_ROW_RANGE(from, to) \
    rows_tbw_fraction((from), (to), sex, age_years, weight_kg, out, status)
    NTR_DRIVE(n, out, status, bad);
#undef NTR_PAIR_EVAL
#undef NTR_ROW_RANGE
    return finish(n, status, bad, failed);
}

static NTR_ROWS size_t rows_tbw_watson(size_t from, size_t to, const int *sex,
                                       const double *age_years,
                                       const double *height_cm,
                                       const double *weight_kg, double *out,
                                       int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double v = FAILED_ROW;
        int st = NTR_ROW(tbw_watson)(sex[i], age_years[i], height_cm[i],
                                     weight_kg[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return bad;
}

int ntr_batch_tbw_watson(size_t n, const int *sex, const double *age_years,
                         const double *height_cm, const double *weight_kg,
                         double *out, int *status, size_t *failed)
{
    size_t bad = 0;
    if (sex == NULL || age_years == NULL || height_cm == NULL ||
        weight_kg == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
#define NTR_PAIR_EVAL(i, v) \
    ntrp_tbw_watson(pair_sex_load(sex + (i)), pair_load(age_years + (i)),     \
                    pair_load(height_cm + (i)), pair_load(weight_kg + (i)),   \
                    (v))
#define NTR_ROW_RANGE(from, to) \
    rows_tbw_watson((from), (to), sex, age_years, height_cm, weight_kg, out,  \
                    status)
    NTR_DRIVE(n, out, status, bad);
#undef NTR_PAIR_EVAL
#undef NTR_ROW_RANGE
    return finish(n, status, bad, failed);
}

static NTR_ROWS size_t rows_free_water_deficit(size_t from, size_t to,
                                               const double *tbw_l,
                                               const double *na_mmol_l,
                                               double *out, int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double v = FAILED_ROW;
        int st = NTR_ROW(free_water_deficit)(tbw_l[i], na_mmol_l[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return bad;
}

int ntr_batch_free_water_deficit(size_t n, const double *tbw_l,
                                 const double *na_mmol_l, double *out,
                                 int *status, size_t *failed)
{
    size_t bad = 0;
    if (tbw_l == NULL || na_mmol_l == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
#define NTR_PAIR_EVAL(i, v) \
    ntrp_free_water_deficit(pair_load(tbw_l + (i)),                           \
                            pair_load(na_mmol_l + (i)), (v))
#define NTR_ROW_RANGE(from, to) \
    rows_free_water_deficit((from), (to), tbw_l, na_mmol_l, out, status)
    NTR_DRIVE(n, out, status, bad);
#undef NTR_PAIR_EVAL
#undef NTR_ROW_RANGE
    return finish(n, status, bad, failed);
}

/* ---- infusion (lib/infusion_kernels.h) -------------------------------- */

static NTR_ROWS size_t
rows_infusate_change_per_litre(size_t from, size_t to, const double *na_mmol_l,
                               const double *tbw_l,
                               const double *infusate_na_mmol_l,
                               const double *infusate_k_mmol_l, double *out,
                               int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double v = FAILED_ROW;
        int st = NTR_ROW(infusate_change_per_litre)(
            na_mmol_l[i], tbw_l[i], infusate_na_mmol_l[i],
            infusate_k_mmol_l[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return bad;
}

int ntr_batch_infusate_change_per_litre(size_t n, const double *na_mmol_l,
                                        const double *tbw_l,
                                        const double *infusate_na_mmol_l,
                                        const double *infusate_k_mmol_l,
                                        double *out, int *status,
                                        size_t *failed)
{
    size_t bad = 0;
    if (na_mmol_l == NULL || tbw_l == NULL || infusate_na_mmol_l == NULL ||
        infusate_k_mmol_l == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
#define NTR_PAIR_EVAL(i, v) \
    ntrp_infusate_change_per_litre(pair_load(na_mmol_l + (i)),                \
                                   pair_load(tbw_l + (i)),                    \
                                   pair_load(infusate_na_mmol_l + (i)),       \
                                   pair_load(infusate_k_mmol_l + (i)), (v))
#define NTR_ROW_RANGE(from, to) \
    rows_infusate_change_per_litre((from), (to), na_mmol_l, tbw_l,            \
                                   infusate_na_mmol_l, infusate_k_mmol_l,     \
                                   out, status)
    NTR_DRIVE(n, out, status, bad);
#undef NTR_PAIR_EVAL
#undef NTR_ROW_RANGE
    return finish(n, status, bad, failed);
}

static NTR_ROWS size_t rows_infusate_change(size_t from, size_t to,
                                            const double *na_mmol_l,
                                            const double *tbw_l,
                                            const double *infusate_na_mmol_l,
                                            const double *infusate_k_mmol_l,
                                            const double *volume_l,
                                            double *out, int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double v = FAILED_ROW;
        int st = NTR_ROW(infusate_change)(na_mmol_l[i], tbw_l[i],
                                          infusate_na_mmol_l[i],
                                          infusate_k_mmol_l[i], volume_l[i],
                                          &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return bad;
}

int ntr_batch_infusate_change(size_t n, const double *na_mmol_l,
                              const double *tbw_l,
                              const double *infusate_na_mmol_l,
                              const double *infusate_k_mmol_l,
                              const double *volume_l, double *out, int *status,
                              size_t *failed)
{
    size_t bad = 0;
    if (na_mmol_l == NULL || tbw_l == NULL || infusate_na_mmol_l == NULL ||
        infusate_k_mmol_l == NULL || volume_l == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
#define NTR_PAIR_EVAL(i, v) \
    ntrp_infusate_change(pair_load(na_mmol_l + (i)), pair_load(tbw_l + (i)),  \
                         pair_load(infusate_na_mmol_l + (i)),                 \
                         pair_load(infusate_k_mmol_l + (i)),                  \
                         pair_load(volume_l + (i)), (v))
#define NTR_ROW_RANGE(from, to) \
    rows_infusate_change((from), (to), na_mmol_l, tbw_l, infusate_na_mmol_l,  \
                         infusate_k_mmol_l, volume_l, out, status)
    NTR_DRIVE(n, out, status, bad);
#undef NTR_PAIR_EVAL
#undef NTR_ROW_RANGE
    return finish(n, status, bad, failed);
}

static NTR_ROWS size_t
rows_infusate_volume_for_change(size_t from, size_t to, const double *na_mmol_l,
                                const double *tbw_l,
                                const double *infusate_na_mmol_l,
                                const double *infusate_k_mmol_l,
                                const double *target_delta_mmol_l, double *out,
                                int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double v = FAILED_ROW;
        int st = NTR_ROW(infusate_volume_for_change)(
            na_mmol_l[i], tbw_l[i], infusate_na_mmol_l[i],
            infusate_k_mmol_l[i], target_delta_mmol_l[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return bad;
}

int ntr_batch_infusate_volume_for_change(size_t n, const double *na_mmol_l,
                                         const double *tbw_l,
                                         const double *infusate_na_mmol_l,
                                         const double *infusate_k_mmol_l,
                                         const double *target_delta_mmol_l,
                                         double *out, int *status,
                                         size_t *failed)
{
    size_t bad = 0;
    if (na_mmol_l == NULL || tbw_l == NULL || infusate_na_mmol_l == NULL ||
        infusate_k_mmol_l == NULL || target_delta_mmol_l == NULL ||
        out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
#define NTR_PAIR_EVAL(i, v) \
    ntrp_infusate_volume_for_change(pair_load(na_mmol_l + (i)),               \
                                    pair_load(tbw_l + (i)),                   \
                                    pair_load(infusate_na_mmol_l + (i)),      \
                                    pair_load(infusate_k_mmol_l + (i)),       \
                                    pair_load(target_delta_mmol_l + (i)),     \
                                    (v))
#define NTR_ROW_RANGE(from, to) \
    rows_infusate_volume_for_change((from), (to), na_mmol_l, tbw_l,           \
                                    infusate_na_mmol_l, infusate_k_mmol_l,    \
                                    target_delta_mmol_l, out, status)
    NTR_DRIVE(n, out, status, bad);
#undef NTR_PAIR_EVAL
#undef NTR_ROW_RANGE
    return finish(n, status, bad, failed);
}

/* ---- urine (lib/urine_kernels.h) -------------------------------------- */

static NTR_ROWS size_t rows_furst_ratio(size_t from, size_t to,
                                        const double *urine_na_mmol_l,
                                        const double *urine_k_mmol_l,
                                        const double *serum_na_mmol_l,
                                        double *out, int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double v = FAILED_ROW;
        int st = NTR_ROW(furst_ratio)(urine_na_mmol_l[i], urine_k_mmol_l[i],
                                      serum_na_mmol_l[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return bad;
}

int ntr_batch_furst_ratio(size_t n, const double *urine_na_mmol_l,
                          const double *urine_k_mmol_l,
                          const double *serum_na_mmol_l, double *out,
                          int *status, size_t *failed)
{
    size_t bad = 0;
    if (urine_na_mmol_l == NULL || urine_k_mmol_l == NULL ||
        serum_na_mmol_l == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
#define NTR_PAIR_EVAL(i, v) \
    ntrp_furst_ratio(pair_load(urine_na_mmol_l + (i)),                        \
                     pair_load(urine_k_mmol_l + (i)),                         \
                     pair_load(serum_na_mmol_l + (i)), (v))
#define NTR_ROW_RANGE(from, to) \
    rows_furst_ratio((from), (to), urine_na_mmol_l, urine_k_mmol_l,           \
                     serum_na_mmol_l, out, status)
    NTR_DRIVE(n, out, status, bad);
#undef NTR_PAIR_EVAL
#undef NTR_ROW_RANGE
    return finish(n, status, bad, failed);
}

static NTR_ROWS size_t rows_restriction_from_ratio(size_t from, size_t to,
                                                   const double *ratio,
                                                   int *advice, int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        int a = 0; /* a failed row's advice */
        int st = NTR_ROW(restriction_from_ratio)(ratio[i], &a);
        advice[i] = a;
        bad += row_status(st, status, i);
    }
    return bad;
}

#if NTR_PAIRS
static inline int pair_restriction(const double *ratio, int *advice,
                                   int *status, size_t i)
{
    ntr_lanes band;
    ntr_mask ok = ntrp_restriction_from_ratio(pair_load(ratio + i), &band);
    /* Stored before the check (a failed pair's rows are written again by
     * the scalar kernel and the next pair), so the band is worked out on
     * every pass and its constants stay in registers across the loop. */
    *(ntr_int_pair *)(advice + i) = __builtin_convertvector(band, ntr_int_pair);
    if (!pair_all(ok)) {
        return 0;
    }
    pair_ok(status + i);
    return 1;
}
#endif

int ntr_batch_restriction_from_ratio(size_t n, const double *ratio,
                                     int *advice, int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (ratio == NULL || advice == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    i = 0;
#if NTR_PAIRS
    while (i + 1 < n) {
        if (pair_restriction(ratio, advice, status, i)) {
            i += 2;
        } else {
            bad += rows_restriction_from_ratio(i, i + 1, ratio, advice, status);
            i++;
        }
    }
#endif
    bad += rows_restriction_from_ratio(i, n, ratio, advice, status);
    return finish(n, status, bad, failed);
}

static NTR_ROWS size_t rows_efwc(size_t from, size_t to,
                                 const double *urine_volume_l,
                                 const double *urine_na_mmol_l,
                                 const double *urine_k_mmol_l,
                                 const double *serum_na_mmol_l, double *out,
                                 int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double v = FAILED_ROW;
        int st = NTR_ROW(efwc)(urine_volume_l[i], urine_na_mmol_l[i],
                               urine_k_mmol_l[i], serum_na_mmol_l[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return bad;
}

int ntr_batch_efwc(size_t n, const double *urine_volume_l,
                   const double *urine_na_mmol_l, const double *urine_k_mmol_l,
                   const double *serum_na_mmol_l, double *out, int *status,
                   size_t *failed)
{
    size_t bad = 0;
    if (urine_volume_l == NULL || urine_na_mmol_l == NULL ||
        urine_k_mmol_l == NULL || serum_na_mmol_l == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
#define NTR_PAIR_EVAL(i, v) \
    ntrp_efwc(pair_load(urine_volume_l + (i)),                                \
              pair_load(urine_na_mmol_l + (i)),                               \
              pair_load(urine_k_mmol_l + (i)),                                \
              pair_load(serum_na_mmol_l + (i)), (v))
#define NTR_ROW_RANGE(from, to) \
    rows_efwc((from), (to), urine_volume_l, urine_na_mmol_l, urine_k_mmol_l,  \
              serum_na_mmol_l, out, status)
    NTR_DRIVE(n, out, status, bad);
#undef NTR_PAIR_EVAL
#undef NTR_ROW_RANGE
    return finish(n, status, bad, failed);
}

/* ---- correction assessment of many series ---------------------------- */

/* One group's assessment: reads its series, writes its result (or the
 * failed-group values) into its slot of the caller's array, returns its
 * status. ctx holds what the entry point was given. */
typedef int (*group_fn)(const void *ctx, size_t g, const ntr_sample *s, size_t n);

/* Offsets must not decrease and must stay within the samples: checked
 * before anything is written, so a bad index array cannot make the library
 * read out of bounds. */
static int offsets_valid(size_t groups, const size_t *offsets, size_t n_samples)
{
    size_t g;
    for (g = 0; g < groups; g++) {
        if (offsets[g + 1] < offsets[g]) {
            return 0;
        }
    }
    return offsets[groups] <= n_samples;
}

/* Whether the outputs of a grouped call are clear of its inputs and of
 * each other: each group's result is written while later groups' samples
 * are still to be read (include/natremia.h, "Overlapping buffers"). */
static int groups_disjoint(size_t groups, const size_t *offsets,
                           const ntr_sample *samples, size_t n_samples,
                           const void *lim, size_t lim_bytes, const void *out,
                           size_t out_bytes, const int *status)
{
    const size_t off_b = ntri_bytes(groups + 1u, sizeof *offsets);
    const size_t sam_b = ntri_bytes(n_samples, sizeof *samples);
    const size_t st_b = ntri_bytes(groups, sizeof *status);
    return !ntri_overlap(out, out_bytes, offsets, off_b) &&
           !ntri_overlap(out, out_bytes, samples, sam_b) &&
           !ntri_overlap(out, out_bytes, lim, lim_bytes) &&
           !ntri_overlap(out, out_bytes, status, st_b) &&
           !ntri_overlap(status, st_b, offsets, off_b) &&
           !ntri_overlap(status, st_b, samples, sam_b) &&
           !ntri_overlap(status, st_b, lim, lim_bytes);
}

/* The loop both grouped entry points share, after their call-level checks:
 * every group through `one`, statuses stored and counted. */
static int assess_groups(size_t groups, const size_t *offsets,
                         const ntr_sample *samples, const void *ctx,
                         group_fn one, int *status, size_t *failed)
{
    size_t g;
    size_t bad = 0;
    for (g = 0; g < groups; g++) {
        const size_t first = offsets[g];
        const int st = one(ctx, g, samples + first, offsets[g + 1] - first);
        status[g] = st;
        bad += (st != NTR_OK);
    }
    return finish(groups, status, bad, failed);
}

/* What a failed group's assessment holds: no figure can be mistaken for a
 * result, and no flag is raised. */
static ntr_correction failed_correction(void)
{
    ntr_correction c;
    c.rise_first_24h = FAILED_ROW;
    c.max_rise_24h = FAILED_ROW;
    c.max_rise_48h = FAILED_ROW;
    c.last_rate_per_h = FAILED_ROW;
    c.excess_mmol_l = FAILED_ROW;
    c.flags = 0u;
    c.reserved = 0u;
    return c;
}

struct correction_groups {
    const ntr_limits *lim;
    ntr_correction *out;
};

static int correction_group(const void *ctx, size_t g, const ntr_sample *s, size_t n)
{
    const struct correction_groups *c = (const struct correction_groups *)ctx;
    ntr_correction result;
    const int st = ntr_correction_assess(s, n, c->lim, &result);
    c->out[g] = st == NTR_OK ? result : failed_correction();
    return st;
}

int ntr_batch_correction_assess(size_t groups, const size_t *offsets,
                                const ntr_sample *samples, size_t n_samples,
                                const ntr_limits *lim, ntr_correction *out,
                                int *status, size_t *failed)
{
    struct correction_groups ctx;
    if (offsets == NULL || samples == NULL || lim == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
    if (!offsets_valid(groups, offsets, n_samples) ||
        !groups_disjoint(groups, offsets, samples, n_samples, lim, sizeof *lim,
                         out, ntri_bytes(groups, sizeof *out), status)) {
        return NTR_ERR_ARG;
    }
    ctx.lim = lim;
    ctx.out = out;
    return assess_groups(groups, offsets, samples, &ctx, correction_group,
                         status, failed);
}

/* ---- course assessment of many series (both directions) --------------- */

/* The alignment of a report, as the offset of one after a char (C99 has
 * no alignof). The members are read only through offsetof, which cppcheck
 * does not count as a use. */
struct report_alignment {
    /* cppcheck-suppress unusedStructMember */
    char c;
    /* cppcheck-suppress unusedStructMember */
    ntr_course_report r;
};
#define REPORT_ALIGN offsetof(struct report_alignment, r)

/* A report stride the array can be walked with: at least the 1.1 size, a
 * whole number of alignments, and no group past the end of memory. */
static int report_size_valid(size_t groups, size_t report_size)
{
    return report_size >= sizeof(ntr_course_report) &&
           report_size % REPORT_ALIGN == 0 &&
           (groups == 0 || groups <= ((size_t)-1) / report_size);
}

static ntr_course_report failed_report(void)
{
    ntr_course_report r;
    r.struct_size = sizeof r;
    r.max_rise_24h = FAILED_ROW;
    r.max_rise_48h = FAILED_ROW;
    r.max_fall_24h = FAILED_ROW;
    r.max_fall_48h = FAILED_ROW;
    r.excess_mmol_l = FAILED_ROW;
    r.flags = 0u;
    r.reserved = 0u;
    r.rise_first_24h = FAILED_ROW;
    r.fall_first_24h = FAILED_ROW;
    r.rise_now_24h = FAILED_ROW;
    r.fall_now_24h = FAILED_ROW;
    r.last_rate_per_h = FAILED_ROW;
    r.elapsed_h = FAILED_ROW;
    r.worst_at_h = FAILED_ROW;
    return r;
}

struct course_groups {
    const ntr_course_limits *lim;
    unsigned char *out; /* reports, report_size bytes apart */
    size_t report_size;
};

static int course_group(const void *ctx, size_t g, const ntr_sample *s, size_t n)
{
    const struct course_groups *c = (const struct course_groups *)ctx;
    ntr_course_report result;
    int st;
    result.struct_size = sizeof result;
    st = ntr_course_assess(s, n, c->lim, &result);
    /* The stride is a multiple of the alignment: the slot is aligned. Only
     * the 1.1 members are written; a later header's tail is left alone. */
    *(ntr_course_report *)(void *)(c->out + g * c->report_size) =
        st == NTR_OK ? result : failed_report();
    return st;
}

/* Bytes the reports of a grouped course call occupy: report_size apart,
 * the last one as long as this version's report. */
static size_t reports_bytes(size_t groups, size_t report_size)
{
    size_t before_last;
    if (groups == 0) {
        return 0;
    }
    before_last = ntri_bytes(groups - 1u, report_size);
    return before_last > SIZE_MAX - sizeof(ntr_course_report)
               ? SIZE_MAX
               : before_last + sizeof(ntr_course_report);
}

int ntr_batch_course_assess(size_t groups, const size_t *offsets,
                            const ntr_sample *samples, size_t n_samples,
                            const ntr_course_limits *lim, size_t report_size,
                            ntr_course_report *out, int *status, size_t *failed)
{
    struct course_groups ctx;
    if (offsets == NULL || samples == NULL || lim == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
    if (!report_size_valid(groups, report_size) ||
        !offsets_valid(groups, offsets, n_samples) ||
        !groups_disjoint(groups, offsets, samples, n_samples, lim, sizeof *lim,
                         out, reports_bytes(groups, report_size), status)) {
        return NTR_ERR_ARG;
    }
    ctx.lim = lim;
    ctx.out = (unsigned char *)out;
    ctx.report_size = report_size;
    return assess_groups(groups, offsets, samples, &ctx, course_group, status,
                         failed);
}
