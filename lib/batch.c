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
 * use. */
#include "ntr_internal.h"

/* Same constants as the scalar areas use (lib/sodium.c, lib/water.c and the
 * Dorwart-Chalmers regression in lib/osmolality.c). */
#define GLUCOSE_MG_DL_PER_MMOL_L 18.0156
#define GLUCOSE_REFERENCE_MG_DL 100.0
#define KATZ_FACTOR 1.6
#define HILLIER_FACTOR 2.4
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
    for (i = 0; i < n; i++) {
        if (status[i] != NTR_OK) {
            return status[i];
        }
    }
    return NTR_OK; /* not reached: bad > 0 means some status is set */
}

/* ---- osmolality ------------------------------------------------------ */

static inline int osm_inputs_status(double na, double glucose, double urea,
                                    double ethanol)
{
    int st = ntr_check_na(na);
    st = first_error(st, ntr_check(glucose, 0.0, NTR_GLUCOSE_MAX));
    st = first_error(st, ntr_check(urea, 0.0, NTR_UREA_MAX));
    return first_error(st, ntr_check(ethanol, 0.0, NTR_ETHANOL_MAX));
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
    for (i = 0; i < n; i++) {
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
        double na = na_mmol_l[i];
        double glucose = glucose_mmol_l[i];
        int st = first_error(ntr_check_na(na),
                             ntr_check(glucose, 0.0, NTR_GLUCOSE_MAX));
        out[i] = row_value(st, 2.0 * na + glucose);
        status[i] = st;
        bad += (st != NTR_OK);
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
        double measured = measured_mosm_kg[i];
        double calculated = calculated_mosm_kg[i];
        int st = first_error(ntr_check(measured, NTR_OSM_MIN, NTR_OSM_MAX),
                             ntr_check(calculated, NTR_OSM_MIN, NTR_OSM_MAX));
        out[i] = row_value(st, measured - calculated);
        status[i] = st;
        bad += (st != NTR_OK);
    }
    return finish(n, status, bad, failed);
}

/* ---- sodium ---------------------------------------------------------- */

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
    if (method == NTR_GLUCOSE_KATZ) {
        factor = KATZ_FACTOR;
    } else if (method == NTR_GLUCOSE_HILLIER) {
        factor = HILLIER_FACTOR;
    } else {
        return NTR_ERR_ARG;
    }
    for (i = 0; i < n; i++) {
        double na = na_mmol_l[i];
        double glucose = glucose_mmol_l[i];
        double glucose_mg_dl = glucose * GLUCOSE_MG_DL_PER_MMOL_L;
        double corrected =
            glucose_mg_dl <= GLUCOSE_REFERENCE_MG_DL
                ? na
                : na + factor * (glucose_mg_dl - GLUCOSE_REFERENCE_MG_DL) / 100.0;
        int st = first_error(ntr_check_na(na),
                             ntr_check(glucose, 0.0, NTR_GLUCOSE_MAX));
        out[i] = row_value(st, corrected);
        status[i] = st;
        bad += (st != NTR_OK);
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
        int s = sex[i];
        double age = age_years[i];
        double weight = weight_kg[i];
        int st = sex_status(s);
        st = first_error(st, ntr_check(age, 0.0, NTR_AGE_MAX));
        st = first_error(st, ntr_check(weight, NTR_WEIGHT_MIN, NTR_WEIGHT_MAX));
        out[i] = row_value(st, water_fraction(s, age) * weight);
        status[i] = st;
        bad += (st != NTR_OK);
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
        st = first_error(st, tbw > 0.0 ? NTR_OK : NTR_ERR_DOMAIN);
        out[i] = row_value(st, tbw);
        status[i] = st;
        bad += (st != NTR_OK);
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
        double tbw = tbw_l[i];
        double na = na_mmol_l[i];
        int st = first_error(ntr_check_tbw(tbw), ntr_check_na(na));
        st = first_error(st, na < NORMAL_NA_MMOL_L ? NTR_ERR_DOMAIN : NTR_OK);
        out[i] = row_value(st, tbw * (na / NORMAL_NA_MMOL_L - 1.0));
        status[i] = st;
        bad += (st != NTR_OK);
    }
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
        double na = na_mmol_l[i];
        double tbw = tbw_l[i];
        double infusate_na = infusate_na_mmol_l[i];
        double infusate_k = infusate_k_mmol_l[i];
        int st = infusate_status(na, tbw, infusate_na, infusate_k);
        out[i] = row_value(st, (infusate_na + infusate_k - na) / (tbw + 1.0));
        status[i] = st;
        bad += (st != NTR_OK);
    }
    return finish(n, status, bad, failed);
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
    for (i = 0; i < n; i++) {
        double na = na_mmol_l[i];
        double tbw = tbw_l[i];
        double infusate_na = infusate_na_mmol_l[i];
        double infusate_k = infusate_k_mmol_l[i];
        double volume = volume_l[i];
        int st = infusate_status(na, tbw, infusate_na, infusate_k);
        st = first_error(st, ntr_check(volume, 0.0, NTR_INFUSE_VOLUME_MAX));
        out[i] = row_value(st, volume * (infusate_na + infusate_k - na) /
                                   (tbw + volume));
        status[i] = st;
        bad += (st != NTR_OK);
    }
    return finish(n, status, bad, failed);
}

/* Whether the infusate lies beyond the target, on the side of the change
 * (the domain rule of ntr_infusate_volume_for_change()). */
static inline int reachable(double delta, double headroom)
{
    return delta > 0.0 ? headroom > 0.0 : headroom < 0.0;
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
        st = first_error(st, domain);
        out[i] = row_value(st, volume);
        status[i] = st;
        bad += (st != NTR_OK);
    }
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
        double urine_na = urine_na_mmol_l[i];
        double urine_k = urine_k_mmol_l[i];
        double serum_na = serum_na_mmol_l[i];
        int st = urine_status(urine_na, urine_k, serum_na);
        out[i] = row_value(st, (urine_na + urine_k) / serum_na);
        status[i] = st;
        bad += (st != NTR_OK);
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
    return finish(n, status, bad, failed);
}

/* ---- correction assessment of many series ---------------------------- */

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

int ntr_batch_correction_assess(size_t groups, const size_t *offsets,
                                const ntr_sample *samples, size_t n_samples,
                                const ntr_limits *lim, ntr_correction *out,
                                int *status, size_t *failed)
{
    size_t g;
    size_t bad = 0;
    if (offsets == NULL || samples == NULL || lim == NULL || out == NULL ||
        status == NULL) {
        return NTR_ERR_NULL;
    }
    if (!offsets_valid(groups, offsets, n_samples)) {
        return NTR_ERR_ARG;
    }
    for (g = 0; g < groups; g++) {
        size_t first = offsets[g];
        ntr_correction result;
        int st = ntr_correction_assess(samples + first, offsets[g + 1] - first,
                                       lim, &result);
        out[g] = st == NTR_OK ? result : failed_correction();
        status[g] = st;
        bad += (st != NTR_OK);
    }
    return finish(groups, status, bad, failed);
}
