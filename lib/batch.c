/* Batch (array) entry points (docs/batch.md).
 *
 * Each function applies one scalar formula to n rows of caller-owned
 * columns. The row kernels below repeat the scalar expressions operation
 * for operation (the build forbids contraction), so a row's result is the
 * scalar function's result bit for bit; tests/test_batch.c checks that on
 * random rows, valid and invalid.
 *
 * Why the kernels are written out here instead of calling the scalar
 * function per row: the loop bodies stay small and free of calls, so the
 * compiler can keep them in registers and stream the columns at memory
 * speed. Each kernel computes its value unconditionally (NaN or infinity in
 * a bad row is harmless: the value is then replaced) and its status as a
 * chain of checks in argument order, the same order the scalar functions
 * use. Builds for size (-Os) are the exception: there code, not speed, is
 * scarce, and each entry point is a loop over the scalar function
 * (NTR_BATCH_LOOPS below). */
#include "ntr_internal.h"

/* Same constants as the scalar areas use (lib/water.c and the
 * Dorwart-Chalmers regression in lib/osmolality.c; the glucose correction's
 * are shared through ntr_internal.h). */
#define DC_NA_COEFFICIENT 1.86
#define DC_INTERCEPT 9.0
#define NORMAL_NA_MMOL_L 140.0

/* The value written into out[i] for a failed row. */
#define FAILED_ROW ((double)NAN)

/* First non-OK status of two checks made in order. */
static inline int first_error(int earlier, int later)
{
    return earlier != NTR_OK ? earlier : later;
}

/* The row result, or NaN when the row failed. */
static inline double row_value(int status, double value)
{
    return status == NTR_OK ? value : FAILED_ROW;
}

/* ---- two rows at a time ------------------------------------------------
 *
 * On processors with two-lane double-precision vectors (x86-64 SSE2,
 * AArch64) each kernel first tries rows i and i+1 together: load both,
 * check every input of both against its range with vector comparisons,
 * and when all pass, compute both values with the same operations in the
 * same order as the scalar kernel (lane by lane the same IEEE results) and
 * store them with status NTR_OK. When anything fails, row i goes through
 * the scalar kernel below, which finds the exact status, and the pair is
 * tried again from row i+1. Valid cohorts, the common case, then cost a
 * third of the instructions per row, which is what brings the batch calls
 * near memory speed (tests/bench/run-bench.sh). GCC and Clang vector
 * extensions; any other compiler or target uses the scalar kernels alone.
 */
/* Size-optimised builds (-Os) use plain loops over the scalar functions
 * instead of the kernels (see below). */
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
/* A comparison result as two 64-bit integer lanes (0 or -1). */
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
static inline ntr_pair pair_splat(double x)
{
    return _mm_set1_pd(x);
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
#else
typedef long long ntr_mask __attribute__((vector_size(16)));
static inline ntr_pair pair_splat(double x)
{
    ntr_pair v = {x, x};
    return v;
}
static inline ntr_mask pair_ge(ntr_pair a, ntr_pair b) { return a >= b; }
static inline ntr_mask pair_gt(ntr_pair a, ntr_pair b) { return a > b; }
static inline ntr_mask pair_le(ntr_pair a, ntr_pair b) { return a <= b; }
static inline ntr_mask pair_lt(ntr_pair a, ntr_pair b) { return a < b; }
static inline ntr_mask pair_and(ntr_mask a, ntr_mask b) { return a & b; }
static inline ntr_mask pair_or(ntr_mask a, ntr_mask b) { return a | b; }
static inline int pair_all(ntr_mask m) { return (m[0] & m[1]) != 0; }
static inline ntr_pair pair_select(ntr_mask m, ntr_pair a, ntr_pair b)
{
    return (ntr_pair)(((ntr_mask)a & m) | ((ntr_mask)b & ~m));
}
static inline ntr_mask pair_from_ints(int lane0, int lane1)
{
    ntr_mask m = {-(long long)lane0, -(long long)lane1};
    return m;
}
#endif

static inline ntr_mask pair_and3(ntr_mask a, ntr_mask b, ntr_mask c)
{
    return pair_and(pair_and(a, b), c);
}

static inline ntr_mask pair_and4(ntr_mask a, ntr_mask b, ntr_mask c, ntr_mask d)
{
    return pair_and(pair_and(a, b), pair_and(c, d));
}

/* Both lanes: lo <= x <= hi (false for NaN and the infinities). */
static inline ntr_mask pair_in(ntr_pair x, double lo, double hi)
{
    return pair_and(pair_ge(x, pair_splat(lo)), pair_le(x, pair_splat(hi)));
}

/* Lanes whose sex code (sex[i], sex[i + 1]) is `which`. */
static inline ntr_mask pair_sex_is(const int *sex, size_t i, int which)
{
#if defined(__SSE2__)
    /* Both codes in one load and compare, widened to the double lanes. */
    __m128i codes = _mm_loadl_epi64((const __m128i *)(const void *)(sex + i));
    __m128i same = _mm_cmpeq_epi32(codes, _mm_set1_epi32(which));
    return _mm_castsi128_pd(_mm_unpacklo_epi32(same, same));
#else
    return pair_from_ints(sex[i] == which, sex[i + 1] == which);
#endif
}

static inline void pair_ok(int *status)
{
    status[0] = NTR_OK;
    status[1] = NTR_OK;
}

/* The scalar kernels (rows_*) stay out of line in this build: they run
 * only for a pair with a failing row and for the last odd row, and keeping
 * them out of the pair loop leaves it its registers, so its constants are
 * loaded once per call instead of once per pair. */
#define NTR_ROWS __attribute__((noinline))
#else
#define NTR_PAIRS 0
#define NTR_ROWS
#endif

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

#if NTR_BATCH_LOOPS
/* ---- size-optimised builds: a loop over the scalar function ----------
 *
 * Built for size (-Os, as firmware is), each entry point is a plain loop
 * that calls the scalar function row by row: identical results and
 * statuses by construction, in a fraction of the code of the kernels
 * below (tests/bench/firmware.py). A failed row's value is FAILED_ROW
 * because every scalar function leaves its output untouched on an error.
 * Each row's inputs are passed by value before its output is written, so
 * an output column may be one of the input columns, as documented. */

/* Store one row's status and count it when it failed. */
static size_t row_status(int st, int *status, size_t i)
{
    status[i] = st;
    return st != NTR_OK;
}

int ntr_batch_osm_calculated(size_t n, const double *na_mmol_l,
                             const double *glucose_mmol_l,
                             const double *urea_mmol_l,
                             const double *ethanol_mmol_l, int formula,
                             double *out, int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (na_mmol_l == NULL || glucose_mmol_l == NULL || urea_mmol_l == NULL ||
        ethanol_mmol_l == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    if (formula != NTR_OSM_2NA && formula != NTR_OSM_DORWART_CHALMERS) {
        return NTR_ERR_ARG;
    }
    for (i = 0; i < n; i++) {
        double v = FAILED_ROW;
        int st = ntr_osm_calculated(na_mmol_l[i], glucose_mmol_l[i],
                                    urea_mmol_l[i], ethanol_mmol_l[i],
                                    formula, &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return finish(n, status, bad, failed);
}

int ntr_batch_osm_effective(size_t n, const double *na_mmol_l,
                            const double *glucose_mmol_l, double *out,
                            int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (na_mmol_l == NULL || glucose_mmol_l == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < n; i++) {
        double v = FAILED_ROW;
        int st = ntr_osm_effective(na_mmol_l[i], glucose_mmol_l[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return finish(n, status, bad, failed);
}

int ntr_batch_osm_gap(size_t n, const double *measured_mosm_kg,
                      const double *calculated_mosm_kg, double *out,
                      int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (measured_mosm_kg == NULL || calculated_mosm_kg == NULL ||
        out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < n; i++) {
        double v = FAILED_ROW;
        int st = ntr_osm_gap(measured_mosm_kg[i], calculated_mosm_kg[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return finish(n, status, bad, failed);
}

int ntr_batch_na_corrected_glucose(size_t n, const double *na_mmol_l,
                                   const double *glucose_mmol_l, int method,
                                   double *out, int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (na_mmol_l == NULL || glucose_mmol_l == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
    if (method != NTR_GLUCOSE_KATZ && method != NTR_GLUCOSE_HILLIER) {
        return NTR_ERR_ARG;
    }
    for (i = 0; i < n; i++) {
        double v = FAILED_ROW;
        int st = ntr_na_corrected_glucose(na_mmol_l[i], glucose_mmol_l[i],
                                          method, &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return finish(n, status, bad, failed);
}

int ntr_batch_na_deficit(size_t n, const double *tbw_l,
                         const double *na_mmol_l,
                         const double *target_na_mmol_l, double *out,
                         int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (tbw_l == NULL || na_mmol_l == NULL || target_na_mmol_l == NULL ||
        out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < n; i++) {
        double v = FAILED_ROW;
        int st = ntr_na_deficit(tbw_l[i], na_mmol_l[i], target_na_mmol_l[i],
                                &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return finish(n, status, bad, failed);
}

int ntr_batch_tbw_fraction(size_t n, const int *sex, const double *age_years,
                           const double *weight_kg, double *out, int *status,
                           size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (sex == NULL || age_years == NULL || weight_kg == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < n; i++) {
        double v = FAILED_ROW;
        int st = ntr_tbw_fraction(sex[i], age_years[i], weight_kg[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return finish(n, status, bad, failed);
}

int ntr_batch_tbw_watson(size_t n, const int *sex, const double *age_years,
                         const double *height_cm, const double *weight_kg,
                         double *out, int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (sex == NULL || age_years == NULL || height_cm == NULL ||
        weight_kg == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < n; i++) {
        double v = FAILED_ROW;
        int st = ntr_tbw_watson(sex[i], age_years[i], height_cm[i],
                                weight_kg[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return finish(n, status, bad, failed);
}

int ntr_batch_free_water_deficit(size_t n, const double *tbw_l,
                                 const double *na_mmol_l, double *out,
                                 int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (tbw_l == NULL || na_mmol_l == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < n; i++) {
        double v = FAILED_ROW;
        int st = ntr_free_water_deficit(tbw_l[i], na_mmol_l[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return finish(n, status, bad, failed);
}

int ntr_batch_infusate_change_per_litre(size_t n, const double *na_mmol_l,
                                        const double *tbw_l,
                                        const double *infusate_na_mmol_l,
                                        const double *infusate_k_mmol_l,
                                        double *out, int *status,
                                        size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (na_mmol_l == NULL || tbw_l == NULL || infusate_na_mmol_l == NULL ||
        infusate_k_mmol_l == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < n; i++) {
        double v = FAILED_ROW;
        int st = ntr_infusate_change_per_litre(na_mmol_l[i], tbw_l[i],
                                               infusate_na_mmol_l[i],
                                               infusate_k_mmol_l[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return finish(n, status, bad, failed);
}

int ntr_batch_infusate_change(size_t n, const double *na_mmol_l,
                              const double *tbw_l,
                              const double *infusate_na_mmol_l,
                              const double *infusate_k_mmol_l,
                              const double *volume_l, double *out,
                              int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (na_mmol_l == NULL || tbw_l == NULL || infusate_na_mmol_l == NULL ||
        infusate_k_mmol_l == NULL || volume_l == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < n; i++) {
        double v = FAILED_ROW;
        int st = ntr_infusate_change(na_mmol_l[i], tbw_l[i],
                                     infusate_na_mmol_l[i],
                                     infusate_k_mmol_l[i], volume_l[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return finish(n, status, bad, failed);
}

int ntr_batch_infusate_volume_for_change(size_t n, const double *na_mmol_l,
                                         const double *tbw_l,
                                         const double *infusate_na_mmol_l,
                                         const double *infusate_k_mmol_l,
                                         const double *target_delta_mmol_l,
                                         double *out, int *status,
                                         size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (na_mmol_l == NULL || tbw_l == NULL || infusate_na_mmol_l == NULL ||
        infusate_k_mmol_l == NULL || target_delta_mmol_l == NULL ||
        out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < n; i++) {
        double v = FAILED_ROW;
        int st = ntr_infusate_volume_for_change(na_mmol_l[i], tbw_l[i],
                                                infusate_na_mmol_l[i],
                                                infusate_k_mmol_l[i],
                                                target_delta_mmol_l[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return finish(n, status, bad, failed);
}

int ntr_batch_furst_ratio(size_t n, const double *urine_na_mmol_l,
                          const double *urine_k_mmol_l,
                          const double *serum_na_mmol_l, double *out,
                          int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (urine_na_mmol_l == NULL || urine_k_mmol_l == NULL ||
        serum_na_mmol_l == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < n; i++) {
        double v = FAILED_ROW;
        int st = ntr_furst_ratio(urine_na_mmol_l[i], urine_k_mmol_l[i],
                                 serum_na_mmol_l[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return finish(n, status, bad, failed);
}

int ntr_batch_restriction_from_ratio(size_t n, const double *ratio,
                                     int *advice, int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (ratio == NULL || advice == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < n; i++) {
        int a = 0; /* a failed row's advice */
        int st = ntr_restriction_from_ratio(ratio[i], &a);
        advice[i] = a;
        bad += row_status(st, status, i);
    }
    return finish(n, status, bad, failed);
}

int ntr_batch_efwc(size_t n, const double *urine_volume_l,
                   const double *urine_na_mmol_l, const double *urine_k_mmol_l,
                   const double *serum_na_mmol_l, double *out, int *status,
                   size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (urine_volume_l == NULL || urine_na_mmol_l == NULL ||
        urine_k_mmol_l == NULL || serum_na_mmol_l == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < n; i++) {
        double v = FAILED_ROW;
        int st = ntr_efwc(urine_volume_l[i], urine_na_mmol_l[i],
                          urine_k_mmol_l[i], serum_na_mmol_l[i], &v);
        out[i] = v;
        bad += row_status(st, status, i);
    }
    return finish(n, status, bad, failed);
}

#else /* !NTR_BATCH_LOOPS: the row kernels */

/* ---- osmolality ------------------------------------------------------ */

static inline int osm_inputs_status(double na, double glucose, double urea,
                                    double ethanol)
{
    int st = ntr_check_na(na);
    st = first_error(st, ntr_check(glucose, 0.0, NTR_GLUCOSE_MAX));
    st = first_error(st, ntr_check(urea, 0.0, NTR_UREA_MAX));
    return first_error(st, ntr_check(ethanol, 0.0, NTR_ETHANOL_MAX));
}

#if NTR_PAIRS
static inline int pair_osm_calculated(const double *na, const double *glucose,
                                      const double *urea, const double *ethanol,
                                      double coefficient, double intercept,
                                      double *out, int *status, size_t i)
{
    ntr_pair a = pair_load(na + i), g = pair_load(glucose + i);
    ntr_pair u = pair_load(urea + i), e = pair_load(ethanol + i);
    if (!pair_all(pair_and4(pair_in(a, NTR_NA_MIN, NTR_NA_MAX),
                            pair_in(g, 0.0, NTR_GLUCOSE_MAX),
                            pair_in(u, 0.0, NTR_UREA_MAX),
                            pair_in(e, 0.0, NTR_ETHANOL_MAX)))) {
        return 0;
    }
    pair_store(out + i, pair_splat(coefficient) * a + g + u +
                            pair_splat(intercept) + e);
    pair_ok(status + i);
    return 1;
}
#endif

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
        double na = na_mmol_l[i];
        double glucose = glucose_mmol_l[i];
        double urea = urea_mmol_l[i];
        double ethanol = ethanol_mmol_l[i];
        int st = osm_inputs_status(na, glucose, urea, ethanol);
        /* Term order as in ntr_osm_calculated(): sodium term, glucose,
         * urea, intercept, ethanol (adding 0.0 changes no value). */
        out[i] = row_value(st, coefficient * na + glucose + urea + intercept +
                                   ethanol);
        status[i] = st;
        bad += (st != NTR_OK);
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
    size_t i;
    size_t bad = 0;
    if (na_mmol_l == NULL || glucose_mmol_l == NULL || urea_mmol_l == NULL ||
        ethanol_mmol_l == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    if (formula == NTR_OSM_2NA) {
        coefficient = 2.0;
        intercept = 0.0;
    } else if (formula == NTR_OSM_DORWART_CHALMERS) {
        coefficient = DC_NA_COEFFICIENT;
        intercept = DC_INTERCEPT;
    } else {
        return NTR_ERR_ARG;
    }
    i = 0;
#if NTR_PAIRS
    while (i + 1 < n) {
        if (pair_osm_calculated(na_mmol_l, glucose_mmol_l, urea_mmol_l,
                                ethanol_mmol_l, coefficient, intercept,
                                out, status, i)) {
            i += 2;
        } else {
            bad += rows_osm_calculated(i, i + 1, na_mmol_l, glucose_mmol_l,
                                       urea_mmol_l, ethanol_mmol_l,
                                       coefficient, intercept, out, status);
            i++;
        }
    }
#endif
    bad += rows_osm_calculated(i, n, na_mmol_l, glucose_mmol_l, urea_mmol_l,
                               ethanol_mmol_l, coefficient, intercept, out,
                               status);
    return finish(n, status, bad, failed);
}

#if NTR_PAIRS
static inline int pair_osm_effective(const double *na, const double *glucose,
                                     double *out, int *status, size_t i)
{
    ntr_pair a = pair_load(na + i), g = pair_load(glucose + i);
    if (!pair_all(pair_and(pair_in(a, NTR_NA_MIN, NTR_NA_MAX),
                           pair_in(g, 0.0, NTR_GLUCOSE_MAX)))) {
        return 0;
    }
    pair_store(out + i, pair_splat(2.0) * a + g);
    pair_ok(status + i);
    return 1;
}
#endif

static NTR_ROWS size_t rows_osm_effective(size_t from, size_t to,
                                          const double *na_mmol_l,
                                          const double *glucose_mmol_l,
                                          double *out, int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double na = na_mmol_l[i];
        double glucose = glucose_mmol_l[i];
        int st = first_error(ntr_check_na(na),
                             ntr_check(glucose, 0.0, NTR_GLUCOSE_MAX));
        out[i] = row_value(st, 2.0 * na + glucose);
        status[i] = st;
        bad += (st != NTR_OK);
    }
    return bad;
}

int ntr_batch_osm_effective(size_t n, const double *na_mmol_l,
                            const double *glucose_mmol_l, double *out,
                            int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (na_mmol_l == NULL || glucose_mmol_l == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
    i = 0;
#if NTR_PAIRS
    while (i + 1 < n) {
        if (pair_osm_effective(na_mmol_l, glucose_mmol_l, out, status, i)) {
            i += 2;
        } else {
            bad += rows_osm_effective(i, i + 1, na_mmol_l, glucose_mmol_l, out,
                                      status);
            i++;
        }
    }
#endif
    bad += rows_osm_effective(i, n, na_mmol_l, glucose_mmol_l, out, status);
    return finish(n, status, bad, failed);
}

#if NTR_PAIRS
static inline int pair_osm_gap(const double *measured, const double *calculated,
                               double *out, int *status, size_t i)
{
    ntr_pair m = pair_load(measured + i), c = pair_load(calculated + i);
    if (!pair_all(pair_and(pair_in(m, NTR_OSM_MIN, NTR_OSM_MAX),
                           pair_in(c, NTR_OSM_MIN, NTR_OSM_MAX)))) {
        return 0;
    }
    pair_store(out + i, m - c);
    pair_ok(status + i);
    return 1;
}
#endif

static NTR_ROWS size_t rows_osm_gap(size_t from, size_t to,
                                    const double *measured_mosm_kg,
                                    const double *calculated_mosm_kg,
                                    double *out, int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double measured = measured_mosm_kg[i];
        double calculated = calculated_mosm_kg[i];
        int st = first_error(ntr_check(measured, NTR_OSM_MIN, NTR_OSM_MAX),
                             ntr_check(calculated, NTR_OSM_MIN, NTR_OSM_MAX));
        out[i] = row_value(st, measured - calculated);
        status[i] = st;
        bad += (st != NTR_OK);
    }
    return bad;
}

int ntr_batch_osm_gap(size_t n, const double *measured_mosm_kg,
                      const double *calculated_mosm_kg, double *out,
                      int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (measured_mosm_kg == NULL || calculated_mosm_kg == NULL ||
        out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    i = 0;
#if NTR_PAIRS
    while (i + 1 < n) {
        if (pair_osm_gap(measured_mosm_kg, calculated_mosm_kg, out, status,
                         i)) {
            i += 2;
        } else {
            bad += rows_osm_gap(i, i + 1, measured_mosm_kg, calculated_mosm_kg,
                                out, status);
            i++;
        }
    }
#endif
    bad += rows_osm_gap(i, n, measured_mosm_kg, calculated_mosm_kg, out,
                        status);
    return finish(n, status, bad, failed);
}

/* ---- sodium ---------------------------------------------------------- */

#if NTR_PAIRS
static inline int pair_na_corrected_glucose(const double *na,
                                            const double *glucose,
                                            double factor,
                                            double *out, int *status, size_t i)
{
    ntr_pair a = pair_load(na + i), g = pair_load(glucose + i);
    ntr_pair mg_dl, reference = pair_splat(NTR_GLUCOSE_REFERENCE_MG_DL);
    if (!pair_all(pair_and(pair_in(a, NTR_NA_MIN, NTR_NA_MAX),
                           pair_in(g, 0.0, NTR_GLUCOSE_MAX)))) {
        return 0;
    }
    mg_dl = g * pair_splat(NTR_GLUCOSE_MG_DL_PER_MMOL_L);
    pair_store(out + i,
               pair_select(pair_le(mg_dl, reference), a,
                           a + pair_splat(factor) * (mg_dl - reference) /
                                   pair_splat(100.0)));
    pair_ok(status + i);
    return 1;
}
#endif

static NTR_ROWS size_t rows_na_corrected_glucose(size_t from, size_t to,
                                                 const double *na_mmol_l,
                                                 const double *glucose_mmol_l,
                                                 double factor, double *out,
                                                 int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double na = na_mmol_l[i];
        double glucose = glucose_mmol_l[i];
        double glucose_mg_dl = glucose * NTR_GLUCOSE_MG_DL_PER_MMOL_L;
        double corrected =
            glucose_mg_dl <= NTR_GLUCOSE_REFERENCE_MG_DL
                ? na
                : na + factor * (glucose_mg_dl - NTR_GLUCOSE_REFERENCE_MG_DL) / 100.0;
        int st = first_error(ntr_check_na(na),
                             ntr_check(glucose, 0.0, NTR_GLUCOSE_MAX));
        out[i] = row_value(st, corrected);
        status[i] = st;
        bad += (st != NTR_OK);
    }
    return bad;
}

int ntr_batch_na_corrected_glucose(size_t n, const double *na_mmol_l,
                                   const double *glucose_mmol_l, int method,
                                   double *out, int *status, size_t *failed)
{
    double factor;
    size_t i;
    size_t bad = 0;
    if (na_mmol_l == NULL || glucose_mmol_l == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntri_glucose_factor(method, &factor));
    i = 0;
#if NTR_PAIRS
    while (i + 1 < n) {
        if (pair_na_corrected_glucose(na_mmol_l, glucose_mmol_l, factor, out,
                                      status, i)) {
            i += 2;
        } else {
            bad += rows_na_corrected_glucose(i, i + 1, na_mmol_l,
                                             glucose_mmol_l, factor, out,
                                             status);
            i++;
        }
    }
#endif
    bad += rows_na_corrected_glucose(i, n, na_mmol_l, glucose_mmol_l, factor,
                                     out, status);
    return finish(n, status, bad, failed);
}

#if NTR_PAIRS
static inline int pair_na_deficit(const double *tbw, const double *na,
                                  const double *target, double *out,
                                  int *status, size_t i)
{
    ntr_pair w = pair_load(tbw + i), a = pair_load(na + i);
    ntr_pair t = pair_load(target + i);
    if (!pair_all(pair_and4(pair_in(w, NTR_TBW_MIN, NTR_TBW_MAX),
                            pair_in(a, NTR_NA_MIN, NTR_NA_MAX),
                            pair_in(t, NTR_NA_MIN, NTR_NA_MAX),
                            pair_ge(t, a)))) {
        return 0;
    }
    pair_store(out + i, w * (t - a));
    pair_ok(status + i);
    return 1;
}
#endif

static NTR_ROWS size_t rows_na_deficit(size_t from, size_t to,
                                       const double *tbw_l,
                                       const double *na_mmol_l,
                                       const double *target_na_mmol_l,
                                       double *out, int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double tbw = tbw_l[i];
        double na = na_mmol_l[i];
        double target = target_na_mmol_l[i];
        int st = ntr_check_tbw(tbw);
        st = first_error(st, ntr_check_na(na));
        st = first_error(st, ntr_check_na(target));
        st = first_error(st, target < na ? NTR_ERR_DOMAIN : NTR_OK);
        out[i] = row_value(st, tbw * (target - na));
        status[i] = st;
        bad += (st != NTR_OK);
    }
    return bad;
}

int ntr_batch_na_deficit(size_t n, const double *tbw_l,
                         const double *na_mmol_l,
                         const double *target_na_mmol_l, double *out,
                         int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (tbw_l == NULL || na_mmol_l == NULL || target_na_mmol_l == NULL ||
        out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    i = 0;
#if NTR_PAIRS
    while (i + 1 < n) {
        if (pair_na_deficit(tbw_l, na_mmol_l, target_na_mmol_l, out, status,
                            i)) {
            i += 2;
        } else {
            bad += rows_na_deficit(i, i + 1, tbw_l, na_mmol_l,
                                   target_na_mmol_l, out, status);
            i++;
        }
    }
#endif
    bad += rows_na_deficit(i, n, tbw_l, na_mmol_l, target_na_mmol_l, out,
                           status);
    return finish(n, status, bad, failed);
}

/* ---- water ----------------------------------------------------------- */

static inline int sex_status(int sex)
{
    return (sex == NTR_SEX_MALE || sex == NTR_SEX_FEMALE) ? NTR_OK : NTR_ERR_ARG;
}

/* Adrogue & Madias 2000 fractions, as in lib/water.c: child, man, man
 * from 65, woman, woman from 65. Picked by an index computed from the
 * comparisons rather than by nested conditionals, which mispredicted on
 * about every other row of a real cohort's mixed ages and ran at a fifth
 * of memory speed (tests/bench/run-bench.sh); same constants, same results.
 * Any sex other than female takes the male entries: such a row fails with
 * NTR_ERR_ARG anyway. */
static const double water_fractions[5] = {0.6, 0.6, 0.5, 0.5, 0.45};

static inline double water_fraction(int sex, double age_years)
{
    int adult = age_years >= NTR_ADULT_AGE;
    int elderly = age_years >= NTR_ELDERLY_AGE;
    int female = sex == NTR_SEX_FEMALE;
    return water_fractions[adult * (1 + 2 * female + elderly)];
}

#if NTR_PAIRS
static inline int pair_tbw_fraction(const int *sex, const double *age,
                                    const double *weight, double *out,
                                    int *status, size_t i)
{
    ntr_pair y = pair_load(age + i), w = pair_load(weight + i);
    ntr_pair zero = pair_splat(0.0);
    ntr_mask female = pair_sex_is(sex, i, NTR_SEX_FEMALE);
    ntr_mask known = pair_or(pair_sex_is(sex, i, NTR_SEX_MALE), female);
    ntr_mask adult = pair_ge(y, pair_splat(NTR_ADULT_AGE));
    ntr_mask elderly = pair_ge(y, pair_splat(NTR_ELDERLY_AGE));
    /* The entry of water_fractions[] lane by lane, with two choices instead
     * of a choice per entry, as the table holds three values: entries 0
     * and 1 (a child, a man under 65) are equal, and so are 2 and 3 (a man
     * from 65, a woman under 65); entry 4 is a woman from 65 (elderly
     * implies adult). The test of batch against scalar rows checks that.
     * An unknown sex code gets 0, and the check asks for a positive
     * fraction rather than for a known code (the same test: every entry is
     * positive), so the fraction is worked out before the check on every
     * pass and the compiler keeps its constants in registers across the
     * loop instead of loading them again for each pair. */
    ntr_pair grown = pair_select(pair_and(female, elderly),
                                 pair_splat(water_fractions[4]),
                                 pair_splat(water_fractions[2]));
    ntr_pair fraction =
        pair_select(known,
                    pair_select(pair_and(adult, pair_or(female, elderly)), grown,
                                pair_splat(water_fractions[0])),
                    zero);
    if (!pair_all(pair_and3(pair_gt(fraction, zero),
                            pair_in(y, NTR_TBW_FRACTION_AGE_MIN, NTR_AGE_MAX),
                            pair_in(w, NTR_WEIGHT_MIN, NTR_WEIGHT_MAX)))) {
        return 0;
    }
    pair_store(out + i, fraction * w);
    pair_ok(status + i);
    return 1;
}
#endif

static NTR_ROWS size_t rows_tbw_fraction(size_t from, size_t to,
                                         const int *sex,
                                         const double *age_years,
                                         const double *weight_kg, double *out,
                                         int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        int s = sex[i];
        double age = age_years[i];
        double weight = weight_kg[i];
        int st = sex_status(s);
        st = first_error(st, ntr_check(age, NTR_TBW_FRACTION_AGE_MIN, NTR_AGE_MAX));
        st = first_error(st, ntr_check(weight, NTR_WEIGHT_MIN, NTR_WEIGHT_MAX));
        out[i] = row_value(st, water_fraction(s, age) * weight);
        status[i] = st;
        bad += (st != NTR_OK);
    }
    return bad;
}

int ntr_batch_tbw_fraction(size_t n, const int *sex, const double *age_years,
                           const double *weight_kg, double *out, int *status,
                           size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (sex == NULL || age_years == NULL || weight_kg == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
    i = 0;
#if NTR_PAIRS
    while (i + 1 < n) {
        if (pair_tbw_fraction(sex, age_years, weight_kg, out, status, i)) {
            i += 2;
        } else {
            bad += rows_tbw_fraction(i, i + 1, sex, age_years, weight_kg, out,
                                     status);
            i++;
        }
    }
#endif
    bad += rows_tbw_fraction(i, n, sex, age_years, weight_kg, out, status);
    return finish(n, status, bad, failed);
}

#if NTR_PAIRS
static inline int pair_tbw_watson(const int *sex, const double *age,
                                  const double *height, const double *weight,
                                  double *out, int *status, size_t i)
{
    ntr_pair y = pair_load(age + i), h = pair_load(height + i);
    ntr_pair w = pair_load(weight + i);
    ntr_mask male = pair_sex_is(sex, i, NTR_SEX_MALE);
    ntr_mask known = pair_or(male, pair_sex_is(sex, i, NTR_SEX_FEMALE));
    ntr_pair men, women, tbw;
    /* Watson, Watson & Batt 1980, term order as in the scalar kernel. */
    men = pair_splat(2.447) - pair_splat(0.09516) * y + pair_splat(0.1074) * h +
          pair_splat(0.3362) * w;
    women = pair_splat(-2.097) + pair_splat(0.1069) * h +
            pair_splat(0.2466) * w;
    tbw = pair_select(male, men, women);
    ntr_mask measures = pair_and3(pair_in(y, NTR_ADULT_AGE, NTR_AGE_MAX),
                                  pair_in(h, NTR_HEIGHT_MIN, NTR_HEIGHT_MAX),
                                  pair_in(w, NTR_WEIGHT_MIN, NTR_WEIGHT_MAX));
    /* ntri_tbw_share() and ntri_model_tbw() lane by lane. */
    ntr_mask share = pair_and(pair_ge(tbw, pair_splat(NTR_TBW_SHARE_MIN) * w),
                              pair_le(tbw, pair_splat(NTR_TBW_SHARE_MAX) * w));
    if (!pair_all(pair_and4(known, measures, share,
                            pair_in(tbw, NTR_TBW_MIN, NTR_TBW_MAX)))) {
        return 0;
    }
    pair_store(out + i, tbw);
    pair_ok(status + i);
    return 1;
}
#endif

static NTR_ROWS size_t rows_tbw_watson(size_t from, size_t to, const int *sex,
                                       const double *age_years,
                                       const double *height_cm,
                                       const double *weight_kg, double *out,
                                       int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        int s = sex[i];
        double age = age_years[i];
        double height = height_cm[i];
        double weight = weight_kg[i];
        /* Watson, Watson & Batt 1980, as in lib/water.c. */
        double tbw = s == NTR_SEX_MALE
                         ? 2.447 - 0.09516 * age + 0.1074 * height +
                               0.3362 * weight
                         : -2.097 + 0.1069 * height + 0.2466 * weight;
        int st = sex_status(s);
        st = first_error(st, ntr_check(age, NTR_ADULT_AGE, NTR_AGE_MAX));
        st = first_error(st, ntr_check(height, NTR_HEIGHT_MIN, NTR_HEIGHT_MAX));
        st = first_error(st, ntr_check(weight, NTR_WEIGHT_MIN, NTR_WEIGHT_MAX));
        st = first_error(st, ntri_tbw_share(tbw, weight));
        st = first_error(st, ntri_model_tbw(tbw));
        out[i] = row_value(st, tbw);
        status[i] = st;
        bad += (st != NTR_OK);
    }
    return bad;
}

int ntr_batch_tbw_watson(size_t n, const int *sex, const double *age_years,
                         const double *height_cm, const double *weight_kg,
                         double *out, int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (sex == NULL || age_years == NULL || height_cm == NULL ||
        weight_kg == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    i = 0;
#if NTR_PAIRS
    while (i + 1 < n) {
        if (pair_tbw_watson(sex, age_years, height_cm, weight_kg, out, status,
                            i)) {
            i += 2;
        } else {
            bad += rows_tbw_watson(i, i + 1, sex, age_years, height_cm,
                                   weight_kg, out, status);
            i++;
        }
    }
#endif
    bad += rows_tbw_watson(i, n, sex, age_years, height_cm, weight_kg, out,
                           status);
    return finish(n, status, bad, failed);
}

#if NTR_PAIRS
static inline int pair_free_water_deficit(const double *tbw, const double *na,
                                          double *out, int *status, size_t i)
{
    ntr_pair w = pair_load(tbw + i), a = pair_load(na + i);
    if (!pair_all(pair_and(pair_in(w, NTR_TBW_MIN, NTR_TBW_MAX),
                           pair_in(a, NORMAL_NA_MMOL_L, NTR_NA_MAX)))) {
        return 0;
    }
    pair_store(out + i,
               w * (a / pair_splat(NORMAL_NA_MMOL_L) - pair_splat(1.0)));
    pair_ok(status + i);
    return 1;
}
#endif

static NTR_ROWS size_t rows_free_water_deficit(size_t from, size_t to,
                                               const double *tbw_l,
                                               const double *na_mmol_l,
                                               double *out, int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double tbw = tbw_l[i];
        double na = na_mmol_l[i];
        int st = first_error(ntr_check_tbw(tbw), ntr_check_na(na));
        st = first_error(st, na < NORMAL_NA_MMOL_L ? NTR_ERR_DOMAIN : NTR_OK);
        out[i] = row_value(st, tbw * (na / NORMAL_NA_MMOL_L - 1.0));
        status[i] = st;
        bad += (st != NTR_OK);
    }
    return bad;
}

int ntr_batch_free_water_deficit(size_t n, const double *tbw_l,
                                 const double *na_mmol_l, double *out,
                                 int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (tbw_l == NULL || na_mmol_l == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    i = 0;
#if NTR_PAIRS
    while (i + 1 < n) {
        if (pair_free_water_deficit(tbw_l, na_mmol_l, out, status, i)) {
            i += 2;
        } else {
            bad += rows_free_water_deficit(i, i + 1, tbw_l, na_mmol_l, out,
                                           status);
            i++;
        }
    }
#endif
    bad += rows_free_water_deficit(i, n, tbw_l, na_mmol_l, out, status);
    return finish(n, status, bad, failed);
}

/* ---- infusion -------------------------------------------------------- */

static inline int infusate_status(double na, double tbw, double infusate_na,
                                  double infusate_k)
{
    int st = ntr_check_na(na);
    st = first_error(st, ntr_check_tbw(tbw));
    st = first_error(st, ntr_check(infusate_na, 0.0, NTR_INFUSATE_NA_MAX));
    return first_error(st, ntr_check(infusate_k, 0.0, NTR_INFUSATE_K_MAX));
}

/* The domain of a prediction after volume v, by the rule of
 * ntr_balance_predict() (ntri_mass_balance), as lib/infusion.c applies it. */
static inline int prediction_status(double na, double tbw, double volume,
                                    double excess)
{
    double na_after, tbw_after;
    return ntri_mass_balance(na, tbw, volume, excess, &na_after, &tbw_after);
}

#if NTR_PAIRS
/* ntri_mass_balance()'s domain lane by lane: sodium na + excess/(tbw + v)
 * within 80 to 220, body water tbw + v within 0.1 to 400. */
static inline ntr_mask pair_prediction_in(ntr_pair na, ntr_pair tbw,
                                          ntr_pair volume, ntr_pair excess)
{
    ntr_pair tbw_after = tbw + volume;
    return pair_and(pair_in(tbw_after, NTR_TBW_MIN, NTR_TBW_MAX),
                    pair_in(na + excess / tbw_after, NTR_NA_MIN, NTR_NA_MAX));
}

static inline ntr_mask pair_infusate_in(ntr_pair na, ntr_pair tbw,
                                        ntr_pair infusate_na,
                                        ntr_pair infusate_k)
{
    return pair_and4(pair_in(na, NTR_NA_MIN, NTR_NA_MAX),
                     pair_in(tbw, NTR_TBW_MIN, NTR_TBW_MAX),
                     pair_in(infusate_na, 0.0, NTR_INFUSATE_NA_MAX),
                     pair_in(infusate_k, 0.0, NTR_INFUSATE_K_MAX));
}

static inline int pair_infusate_change_per_litre(const double *na,
                                                 const double *tbw,
                                                 const double *infusate_na,
                                                 const double *infusate_k,
                                                 double *out, int *status,
                                                 size_t i)
{
    ntr_pair a = pair_load(na + i), w = pair_load(tbw + i);
    ntr_pair c = pair_load(infusate_na + i), k = pair_load(infusate_k + i);
    ntr_pair one = pair_splat(1.0);
    if (!pair_all(pair_and(pair_infusate_in(a, w, c, k),
                           pair_prediction_in(a, w, one, c + k - a)))) {
        return 0;
    }
    pair_store(out + i, (c + k - a) / (w + one));
    pair_ok(status + i);
    return 1;
}

static inline int pair_infusate_change(const double *na, const double *tbw,
                                       const double *infusate_na,
                                       const double *infusate_k,
                                       const double *volume, double *out,
                                       int *status, size_t i)
{
    ntr_pair a = pair_load(na + i), w = pair_load(tbw + i);
    ntr_pair c = pair_load(infusate_na + i), k = pair_load(infusate_k + i);
    ntr_pair v = pair_load(volume + i);
    ntr_pair excess = v * (c + k - a);
    if (!pair_all(pair_and3(pair_infusate_in(a, w, c, k),
                            pair_in(v, 0.0, NTR_INFUSE_VOLUME_MAX),
                            pair_prediction_in(a, w, v, excess)))) {
        return 0;
    }
    pair_store(out + i, excess / (w + v));
    pair_ok(status + i);
    return 1;
}

/* Only a change other than 0 that the infusate can reach within the volume
 * limit takes this path; the rest (including delta 0) is left to the
 * scalar kernel. */
static inline int pair_infusate_volume(const double *na, const double *tbw,
                                       const double *infusate_na,
                                       const double *infusate_k,
                                       const double *delta, double *out,
                                       int *status, size_t i)
{
    ntr_pair a = pair_load(na + i), w = pair_load(tbw + i);
    ntr_pair c = pair_load(infusate_na + i), k = pair_load(infusate_k + i);
    ntr_pair d = pair_load(delta + i);
    ntr_pair zero = pair_splat(0.0);
    ntr_pair headroom = c + k - a - d;
    ntr_pair volume = d * w / headroom;
    ntr_mask reaches =
        pair_or(pair_and(pair_gt(d, zero), pair_gt(headroom, zero)),
                pair_and(pair_lt(d, zero), pair_lt(headroom, zero)));
    ntr_pair volume_max = pair_splat(NTR_INFUSE_VOLUME_MAX);
    /* The target sodium (ntri_model_na) and the forward prediction of the
     * volume found (ntri_mass_balance), as in lib/infusion.c. */
    ntr_mask coherent =
        pair_and(pair_in(a + d, NTR_NA_MIN, NTR_NA_MAX),
                 pair_prediction_in(a, w, volume, volume * (c + k - a)));
    if (!pair_all(pair_and(pair_and4(pair_infusate_in(a, w, c, k),
                                     pair_in(d, -NTR_DELTA_MAX, NTR_DELTA_MAX),
                                     reaches, pair_le(volume, volume_max)),
                           coherent))) {
        return 0;
    }
    pair_store(out + i, volume);
    pair_ok(status + i);
    return 1;
}
#endif

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
        double na = na_mmol_l[i];
        double tbw = tbw_l[i];
        double infusate_na = infusate_na_mmol_l[i];
        double infusate_k = infusate_k_mmol_l[i];
        int st = infusate_status(na, tbw, infusate_na, infusate_k);
        st = first_error(st, prediction_status(na, tbw, 1.0,
                                               infusate_na + infusate_k - na));
        out[i] = row_value(st, (infusate_na + infusate_k - na) / (tbw + 1.0));
        status[i] = st;
        bad += (st != NTR_OK);
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
    size_t i;
    size_t bad = 0;
    if (na_mmol_l == NULL || tbw_l == NULL || infusate_na_mmol_l == NULL ||
        infusate_k_mmol_l == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    i = 0;
#if NTR_PAIRS
    while (i + 1 < n) {
        if (pair_infusate_change_per_litre(na_mmol_l, tbw_l, infusate_na_mmol_l,
                                           infusate_k_mmol_l, out, status, i)) {
            i += 2;
        } else {
            bad += rows_infusate_change_per_litre(i, i + 1, na_mmol_l, tbw_l,
                                                  infusate_na_mmol_l,
                                                  infusate_k_mmol_l, out,
                                                  status);
            i++;
        }
    }
#endif
    bad += rows_infusate_change_per_litre(i, n, na_mmol_l, tbw_l,
                                          infusate_na_mmol_l,
                                          infusate_k_mmol_l, out, status);
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
        double na = na_mmol_l[i];
        double tbw = tbw_l[i];
        double infusate_na = infusate_na_mmol_l[i];
        double infusate_k = infusate_k_mmol_l[i];
        double volume = volume_l[i];
        double excess = volume * (infusate_na + infusate_k - na);
        int st = infusate_status(na, tbw, infusate_na, infusate_k);
        st = first_error(st, ntr_check(volume, 0.0, NTR_INFUSE_VOLUME_MAX));
        st = first_error(st, prediction_status(na, tbw, volume, excess));
        out[i] = row_value(st, excess / (tbw + volume));
        status[i] = st;
        bad += (st != NTR_OK);
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
    size_t i;
    size_t bad = 0;
    if (na_mmol_l == NULL || tbw_l == NULL || infusate_na_mmol_l == NULL ||
        infusate_k_mmol_l == NULL || volume_l == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
    i = 0;
#if NTR_PAIRS
    while (i + 1 < n) {
        if (pair_infusate_change(na_mmol_l, tbw_l, infusate_na_mmol_l,
                                 infusate_k_mmol_l, volume_l, out, status, i)) {
            i += 2;
        } else {
            bad += rows_infusate_change(i, i + 1, na_mmol_l, tbw_l,
                                        infusate_na_mmol_l, infusate_k_mmol_l,
                                        volume_l, out, status);
            i++;
        }
    }
#endif
    bad += rows_infusate_change(i, n, na_mmol_l, tbw_l, infusate_na_mmol_l,
                                infusate_k_mmol_l, volume_l, out, status);
    return finish(n, status, bad, failed);
}

/* Whether the infusate lies beyond the target, on the side of the change
 * (the domain rule of ntr_infusate_volume_for_change()). */
static inline int reachable(double delta, double headroom)
{
    return delta > 0.0 ? headroom > 0.0 : headroom < 0.0;
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
        double na = na_mmol_l[i];
        double tbw = tbw_l[i];
        double infusate_na = infusate_na_mmol_l[i];
        double infusate_k = infusate_k_mmol_l[i];
        double delta = target_delta_mmol_l[i];
        double headroom = infusate_na + infusate_k - na - delta;
        double volume = delta == 0.0 ? 0.0 : delta * tbw / headroom;
        int domain = delta == 0.0 || (reachable(delta, headroom) &&
                                      volume <= NTR_INFUSE_VOLUME_MAX)
                         ? NTR_OK
                         : NTR_ERR_DOMAIN;
        int st = infusate_status(na, tbw, infusate_na, infusate_k);
        st = first_error(st, ntr_check(delta, -NTR_DELTA_MAX, NTR_DELTA_MAX));
        st = first_error(st, ntri_model_na(na + delta));
        st = first_error(st, domain);
        if (delta != 0.0) {
            st = first_error(st, prediction_status(
                                     na, tbw, volume,
                                     volume * (infusate_na + infusate_k - na)));
        }
        out[i] = row_value(st, volume);
        status[i] = st;
        bad += (st != NTR_OK);
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
    size_t i;
    size_t bad = 0;
    if (na_mmol_l == NULL || tbw_l == NULL || infusate_na_mmol_l == NULL ||
        infusate_k_mmol_l == NULL || target_delta_mmol_l == NULL ||
        out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    i = 0;
#if NTR_PAIRS
    while (i + 1 < n) {
        if (pair_infusate_volume(na_mmol_l, tbw_l, infusate_na_mmol_l,
                                 infusate_k_mmol_l, target_delta_mmol_l,
                                 out, status, i)) {
            i += 2;
        } else {
            bad += rows_infusate_volume_for_change(i, i + 1, na_mmol_l, tbw_l,
                                                   infusate_na_mmol_l,
                                                   infusate_k_mmol_l,
                                                   target_delta_mmol_l, out,
                                                   status);
            i++;
        }
    }
#endif
    bad += rows_infusate_volume_for_change(i, n, na_mmol_l, tbw_l,
                                           infusate_na_mmol_l,
                                           infusate_k_mmol_l,
                                           target_delta_mmol_l, out, status);
    return finish(n, status, bad, failed);
}

/* ---- urine ----------------------------------------------------------- */

static inline int urine_status(double urine_na, double urine_k,
                               double serum_na)
{
    int st = ntr_check(urine_na, 0.0, NTR_URINE_NA_MAX);
    st = first_error(st, ntr_check(urine_k, 0.0, NTR_URINE_K_MAX));
    return first_error(st, ntr_check_na(serum_na));
}

#if NTR_PAIRS
static inline ntr_mask pair_urine_in(ntr_pair urine_na, ntr_pair urine_k,
                                     ntr_pair serum_na)
{
    return pair_and3(pair_in(urine_na, 0.0, NTR_URINE_NA_MAX),
                     pair_in(urine_k, 0.0, NTR_URINE_K_MAX),
                     pair_in(serum_na, NTR_NA_MIN, NTR_NA_MAX));
}

static inline int pair_furst_ratio(const double *urine_na,
                                   const double *urine_k,
                                   const double *serum_na, double *out,
                                   int *status, size_t i)
{
    ntr_pair u = pair_load(urine_na + i), k = pair_load(urine_k + i);
    ntr_pair s = pair_load(serum_na + i);
    if (!pair_all(pair_urine_in(u, k, s))) {
        return 0;
    }
    pair_store(out + i, (u + k) / s);
    pair_ok(status + i);
    return 1;
}

static inline int pair_restriction(const double *ratio, int *advice,
                                   int *status, size_t i)
{
    ntr_pair r = pair_load(ratio + i);
    /* NTR_RESTRICT_1000ML (1) plus one for each edge reached, as in the
     * scalar kernel, in integer lanes: a true comparison lane is all ones,
     * -1, so subtracting it adds one. */
    ntr_lanes at_least_low = (ntr_lanes)pair_ge(r, pair_splat(NTR_FURST_ABOUT_ONE_LOW));
    ntr_lanes above_high = (ntr_lanes)pair_gt(r, pair_splat(NTR_FURST_ABOUT_ONE_HIGH));
    ntr_lanes band = NTR_RESTRICT_1000ML - at_least_low - above_high;
    /* Stored before the check (a failed pair's rows are written again by
     * the scalar kernel and the next pair), so the band is worked out on
     * every pass and its constants stay in registers across the loop. */
    *(ntr_int_pair *)(advice + i) = __builtin_convertvector(band, ntr_int_pair);
    if (!pair_all(pair_in(r, 0.0, NTR_RATIO_MAX))) {
        return 0;
    }
    pair_ok(status + i);
    return 1;
}

static inline int pair_efwc(const double *volume, const double *urine_na,
                            const double *urine_k, const double *serum_na,
                            double *out, int *status, size_t i)
{
    ntr_pair v = pair_load(volume + i), u = pair_load(urine_na + i);
    ntr_pair k = pair_load(urine_k + i), s = pair_load(serum_na + i);
    if (!pair_all(pair_and(pair_in(v, 0.0, NTR_URINE_VOLUME_MAX),
                           pair_urine_in(u, k, s)))) {
        return 0;
    }
    pair_store(out + i, v * (pair_splat(1.0) - (u + k) / s));
    pair_ok(status + i);
    return 1;
}
#endif

static NTR_ROWS size_t rows_furst_ratio(size_t from, size_t to,
                                        const double *urine_na_mmol_l,
                                        const double *urine_k_mmol_l,
                                        const double *serum_na_mmol_l,
                                        double *out, int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double urine_na = urine_na_mmol_l[i];
        double urine_k = urine_k_mmol_l[i];
        double serum_na = serum_na_mmol_l[i];
        int st = urine_status(urine_na, urine_k, serum_na);
        out[i] = row_value(st, (urine_na + urine_k) / serum_na);
        status[i] = st;
        bad += (st != NTR_OK);
    }
    return bad;
}

int ntr_batch_furst_ratio(size_t n, const double *urine_na_mmol_l,
                          const double *urine_k_mmol_l,
                          const double *serum_na_mmol_l, double *out,
                          int *status, size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (urine_na_mmol_l == NULL || urine_k_mmol_l == NULL ||
        serum_na_mmol_l == NULL || out == NULL || status == NULL) {
        return NTR_ERR_NULL;
    }
    i = 0;
#if NTR_PAIRS
    while (i + 1 < n) {
        if (pair_furst_ratio(urine_na_mmol_l, urine_k_mmol_l, serum_na_mmol_l,
                             out, status, i)) {
            i += 2;
        } else {
            bad += rows_furst_ratio(i, i + 1, urine_na_mmol_l, urine_k_mmol_l,
                                    serum_na_mmol_l, out, status);
            i++;
        }
    }
#endif
    bad += rows_furst_ratio(i, n, urine_na_mmol_l, urine_k_mmol_l,
                            serum_na_mmol_l, out, status);
    return finish(n, status, bad, failed);
}

static NTR_ROWS size_t rows_restriction_from_ratio(size_t from, size_t to,
                                                   const double *ratio,
                                                   int *advice, int *status)
{
    size_t i;
    size_t bad = 0;
    for (i = from; i < to; i++) {
        double r = ratio[i];
        /* NTR_RESTRICT_1000ML, _500_700ML, _500ML are 1, 2, 3: the band is
         * a sum of two comparisons, with no branch to mispredict on ratios
         * that scatter around 1 (tests/bench/run-bench.sh). */
        int band = NTR_RESTRICT_1000ML + (r >= NTR_FURST_ABOUT_ONE_LOW) +
                   (r > NTR_FURST_ABOUT_ONE_HIGH);
        int st = ntr_check(r, 0.0, NTR_RATIO_MAX);
        advice[i] = st == NTR_OK ? band : 0;
        status[i] = st;
        bad += (st != NTR_OK);
    }
    return bad;
}

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
        double volume = urine_volume_l[i];
        double urine_na = urine_na_mmol_l[i];
        double urine_k = urine_k_mmol_l[i];
        double serum_na = serum_na_mmol_l[i];
        int st = first_error(ntr_check(volume, 0.0, NTR_URINE_VOLUME_MAX),
                             urine_status(urine_na, urine_k, serum_na));
        out[i] = row_value(st, volume * (1.0 - (urine_na + urine_k) / serum_na));
        status[i] = st;
        bad += (st != NTR_OK);
    }
    return bad;
}

int ntr_batch_efwc(size_t n, const double *urine_volume_l,
                   const double *urine_na_mmol_l, const double *urine_k_mmol_l,
                   const double *serum_na_mmol_l, double *out, int *status,
                   size_t *failed)
{
    size_t i;
    size_t bad = 0;
    if (urine_volume_l == NULL || urine_na_mmol_l == NULL ||
        urine_k_mmol_l == NULL || serum_na_mmol_l == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
    i = 0;
#if NTR_PAIRS
    while (i + 1 < n) {
        if (pair_efwc(urine_volume_l, urine_na_mmol_l, urine_k_mmol_l,
                      serum_na_mmol_l, out, status, i)) {
            i += 2;
        } else {
            bad += rows_efwc(i, i + 1, urine_volume_l, urine_na_mmol_l,
                             urine_k_mmol_l, serum_na_mmol_l, out, status);
            i++;
        }
    }
#endif
    bad += rows_efwc(i, n, urine_volume_l, urine_na_mmol_l, urine_k_mmol_l,
                     serum_na_mmol_l, out, status);
    return finish(n, status, bad, failed);
}

#endif /* NTR_BATCH_LOOPS */

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
