/* SPDX-License-Identifier: MIT */
/* natremia for R: the .Call glue. Every vectorised entry takes columns that
 * R/natremia.R has already recycled to one length n, calls the library's
 * batch function once and returns list(out, status). R turns failed rows
 * into NA; the row statuses become the "status" attribute.
 *
 * The library sources are compiled into this shared object (configure or
 * tests/r/build-package.sh copies lib/ and include/ into src/). */
#include <stddef.h>
#include <string.h>

#include <R.h>
#include <Rinternals.h>
#include <R_ext/Rdynload.h>

#include "natremia.h"

/* Which batch function r_batch() runs; the numbers are private to this
 * package (R/natremia.R uses the same ones). */
enum {
    RB_OSM_CALCULATED = 1,
    RB_OSM_EFFECTIVE,
    RB_OSM_GAP,
    RB_NA_CORRECTED_GLUCOSE,
    RB_TBW_FRACTION,
    RB_TBW_WATSON,
    RB_FREE_WATER_DEFICIT,
    RB_NA_DEFICIT,
    RB_INFUSATE_CHANGE_PER_LITRE,
    RB_INFUSATE_CHANGE,
    RB_INFUSATE_VOLUME_FOR_CHANGE,
    RB_FURST_RATIO,
    RB_RESTRICTION_FROM_RATIO,
    RB_EFWC
};

/* A row status the library never writes: marks rows a call left alone. */
#define STATUS_UNWRITTEN (-1000)

/* Column k of the list as a double pointer (R has checked type and length). */
static const double *col(SEXP cols, int k)
{
    return REAL(VECTOR_ELT(cols, k));
}

/* Failed rows: the library writes a quiet NaN; R's NA is the value R users
 * test with is.na() and print as NA, so it replaces the NaN. */
static void na_failed_rows(double *out, const int *status, R_xlen_t n)
{
    R_xlen_t i;
    for (i = 0; i < n; i++) {
        if (status[i] != NTR_OK) {
            out[i] = NA_REAL;
        }
    }
}

/* r_batch(which, cols, call_en, row_en): one batch call over n rows. */
SEXP r_batch(SEXP s_which, SEXP cols, SEXP s_call_en, SEXP s_row_en)
{
    int which = asInteger(s_which);
    int call_en = asInteger(s_call_en);
    R_xlen_t n = XLENGTH(VECTOR_ELT(cols, 0));
    size_t un = (size_t)n;
    const int *row_en = isNull(s_row_en) ? NULL : INTEGER(s_row_en);
    SEXP out = PROTECT(allocVector(REALSXP, n));
    SEXP st = PROTECT(allocVector(INTSXP, n));
    SEXP iout = PROTECT(allocVector(INTSXP, n));
    SEXP res = PROTECT(allocVector(VECSXP, 3));
    double *o = REAL(out);
    int *s = INTEGER(st);
    int rc = NTR_ERR_ARG;
    R_xlen_t i;
    /* Zero rows: nothing to call; the library accepts n == 0, but R may
     * give a NULL data pointer for an empty vector. */
    if (n == 0) {
        SET_VECTOR_ELT(res, 0, out);
        SET_VECTOR_ELT(res, 1, st);
        SET_VECTOR_ELT(res, 2, iout);
        UNPROTECT(4);
        return res;
    }
    for (i = 0; i < n; i++) {
        s[i] = STATUS_UNWRITTEN;
    }
    switch (which) {
    case RB_OSM_CALCULATED:
        rc = ntr_batch_osm_calculated(un, col(cols, 0), col(cols, 1), col(cols, 2),
                                      col(cols, 3), call_en, o, s, NULL);
        break;
    case RB_OSM_EFFECTIVE:
        rc = ntr_batch_osm_effective(un, col(cols, 0), col(cols, 1), o, s, NULL);
        break;
    case RB_OSM_GAP:
        rc = ntr_batch_osm_gap(un, col(cols, 0), col(cols, 1), o, s, NULL);
        break;
    case RB_NA_CORRECTED_GLUCOSE:
        rc = ntr_batch_na_corrected_glucose(un, col(cols, 0), col(cols, 1), call_en, o, s,
                                            NULL);
        break;
    case RB_TBW_FRACTION:
        rc = ntr_batch_tbw_fraction(un, row_en, col(cols, 0), col(cols, 1), o, s, NULL);
        break;
    case RB_TBW_WATSON:
        rc = ntr_batch_tbw_watson(un, row_en, col(cols, 0), col(cols, 1), col(cols, 2), o, s,
                                  NULL);
        break;
    case RB_FREE_WATER_DEFICIT:
        rc = ntr_batch_free_water_deficit(un, col(cols, 0), col(cols, 1), o, s, NULL);
        break;
    case RB_NA_DEFICIT:
        rc = ntr_batch_na_deficit(un, col(cols, 0), col(cols, 1), col(cols, 2), o, s, NULL);
        break;
    case RB_INFUSATE_CHANGE_PER_LITRE:
        rc = ntr_batch_infusate_change_per_litre(un, col(cols, 0), col(cols, 1), col(cols, 2),
                                                 col(cols, 3), o, s, NULL);
        break;
    case RB_INFUSATE_CHANGE:
        rc = ntr_batch_infusate_change(un, col(cols, 0), col(cols, 1), col(cols, 2),
                                       col(cols, 3), col(cols, 4), o, s, NULL);
        break;
    case RB_INFUSATE_VOLUME_FOR_CHANGE:
        rc = ntr_batch_infusate_volume_for_change(un, col(cols, 0), col(cols, 1), col(cols, 2),
                                                  col(cols, 3), col(cols, 4), o, s, NULL);
        break;
    case RB_FURST_RATIO:
        rc = ntr_batch_furst_ratio(un, col(cols, 0), col(cols, 1), col(cols, 2), o, s, NULL);
        break;
    case RB_RESTRICTION_FROM_RATIO:
        rc = ntr_batch_restriction_from_ratio(un, col(cols, 0), INTEGER(iout), s, NULL);
        for (i = 0; i < n; i++) {
            o[i] = (double)INTEGER(iout)[i];
        }
        break;
    case RB_EFWC:
        rc = ntr_batch_efwc(un, col(cols, 0), col(cols, 1), col(cols, 2), col(cols, 3), o, s,
                            NULL);
        break;
    default:
        UNPROTECT(4);
        error("natremia: unknown batch function %d", which);
    }
    /* Call-level refusals (a NULL array, an unknown formula or method)
     * write no row at all: the sentinel is still in place. */
    if (s[0] == STATUS_UNWRITTEN) {
        UNPROTECT(4);
        error("natremia: %s", ntr_status_message(rc));
    }
    na_failed_rows(o, s, n);
    if (which == RB_RESTRICTION_FROM_RATIO) {
        for (i = 0; i < n; i++) {
            if (s[i] != NTR_OK) {
                INTEGER(iout)[i] = NA_INTEGER;
            }
        }
    }
    SET_VECTOR_ELT(res, 0, out);
    SET_VECTOR_ELT(res, 1, st);
    SET_VECTOR_ELT(res, 2, iout);
    UNPROTECT(4);
    return res;
}

/* list(out, status, int_out) for the element-wise scalar entries below. */
static SEXP make_result(R_xlen_t n, SEXP *out, SEXP *st, SEXP *iout)
{
    SEXP res = PROTECT(allocVector(VECSXP, 3));
    *out = allocVector(REALSXP, n);
    SET_VECTOR_ELT(res, 0, *out);
    *st = allocVector(INTSXP, n);
    SET_VECTOR_ELT(res, 1, *st);
    *iout = allocVector(INTSXP, n);
    SET_VECTOR_ELT(res, 2, *iout);
    UNPROTECT(1);
    return res;
}

/* r_convert(analyte, value, from, to): ntr_convert row by row (the library
 * has no batch form); all four recycled to one length. */
SEXP r_convert(SEXP analyte, SEXP value, SEXP from, SEXP to)
{
    R_xlen_t n = XLENGTH(value);
    R_xlen_t i;
    SEXP out, st, iout;
    SEXP res = PROTECT(make_result(n, &out, &st, &iout));
    for (i = 0; i < n; i++) {
        double v = NA_REAL;
        int rc = ntr_convert(INTEGER(analyte)[i], REAL(value)[i], INTEGER(from)[i],
                             INTEGER(to)[i], &v);
        INTEGER(st)[i] = rc;
        REAL(out)[i] = rc == NTR_OK ? v : NA_REAL;
        INTEGER(iout)[i] = NA_INTEGER;
    }
    UNPROTECT(1);
    return res;
}

/* r_unit_parse(ucum): unit codes of UCUM strings (NA where unknown). */
SEXP r_unit_parse(SEXP ucum)
{
    R_xlen_t n = XLENGTH(ucum);
    R_xlen_t i;
    SEXP out, st, iout;
    SEXP res = PROTECT(make_result(n, &out, &st, &iout));
    for (i = 0; i < n; i++) {
        int unit = 0;
        int rc = NTR_ERR_UNIT;
        SEXP e = STRING_ELT(ucum, i);
        if (e != NA_STRING) {
            rc = ntr_unit_parse(CHAR(e), &unit);
        }
        INTEGER(st)[i] = rc;
        INTEGER(iout)[i] = rc == NTR_OK ? unit : NA_INTEGER;
        REAL(out)[i] = rc == NTR_OK ? (double)unit : NA_REAL;
    }
    UNPROTECT(1);
    return res;
}

/* r_classify(which, x): the work-up classifications of one number
 * (1 ntr_na_severity, 2 ntr_tonicity_class). */
SEXP r_classify(SEXP s_which, SEXP x)
{
    int which = asInteger(s_which);
    R_xlen_t n = XLENGTH(x);
    R_xlen_t i;
    SEXP out, st, iout;
    SEXP res = PROTECT(make_result(n, &out, &st, &iout));
    for (i = 0; i < n; i++) {
        int code = 0;
        int rc = which == 1 ? ntr_na_severity(REAL(x)[i], &code)
                            : ntr_tonicity_class(REAL(x)[i], &code);
        INTEGER(st)[i] = rc;
        INTEGER(iout)[i] = rc == NTR_OK ? code : NA_INTEGER;
        REAL(out)[i] = rc == NTR_OK ? (double)code : NA_REAL;
    }
    UNPROTECT(1);
    return res;
}

/* r_fluid_preset(fluid): sodium and potassium of preset fluids; the
 * potassium comes back in the int_out slot's place as a double column. */
SEXP r_fluid_preset(SEXP fluid)
{
    R_xlen_t n = XLENGTH(fluid);
    R_xlen_t i;
    SEXP res = PROTECT(allocVector(VECSXP, 3));
    SEXP na = allocVector(REALSXP, n);
    SET_VECTOR_ELT(res, 0, na);
    SEXP st = allocVector(INTSXP, n);
    SET_VECTOR_ELT(res, 1, st);
    SEXP k = allocVector(REALSXP, n);
    SET_VECTOR_ELT(res, 2, k);
    for (i = 0; i < n; i++) {
        double vna = NA_REAL;
        double vk = NA_REAL;
        int rc = ntr_fluid_preset(INTEGER(fluid)[i], &vna, &vk);
        INTEGER(st)[i] = rc;
        REAL(na)[i] = rc == NTR_OK ? vna : NA_REAL;
        REAL(k)[i] = rc == NTR_OK ? vk : NA_REAL;
    }
    UNPROTECT(1);
    return res;
}

/* r_status_message(status): the library's message for each status. */
SEXP r_status_message(SEXP status)
{
    R_xlen_t n = XLENGTH(status);
    R_xlen_t i;
    SEXP out = PROTECT(allocVector(STRSXP, n));
    for (i = 0; i < n; i++) {
        int s = INTEGER(status)[i];
        SET_STRING_ELT(out, i, s == NA_INTEGER ? NA_STRING : mkChar(ntr_status_message(s)));
    }
    UNPROTECT(1);
    return out;
}

SEXP r_version(void)
{
    return mkString(ntr_version_string());
}

/* The course limits in the order R/natremia.R uses: goal, then the five
 * numbers. */
#define N_LIMIT_FIELDS 6

static void limits_to_doubles(const ntr_course_limits *lim, double *v)
{
    v[0] = (double)lim->goal;
    v[1] = lim->max_rise_24h;
    v[2] = lim->max_rise_48h;
    v[3] = lim->max_fall_24h;
    v[4] = lim->max_fall_48h;
    v[5] = lim->min_change_24h;
}

/* r_course_limits_preset(preset): the preset's limits as 6 doubles. */
SEXP r_course_limits_preset(SEXP s_preset)
{
    ntr_course_limits lim;
    int rc = ntr_course_limits_preset(asInteger(s_preset), &lim);
    SEXP out;
    if (rc != NTR_OK) {
        error("natremia: %s", ntr_status_message(rc));
    }
    out = PROTECT(allocVector(REALSXP, N_LIMIT_FIELDS));
    limits_to_doubles(&lim, REAL(out));
    UNPROTECT(1);
    return out;
}

/* The report columns, in the order of R/natremia.R's .course_columns. */
#define N_REPORT_FIELDS 14

static void report_to_row(const ntr_course_report *r, double *m, R_xlen_t groups, R_xlen_t g)
{
    const double v[N_REPORT_FIELDS] = {
        r->max_rise_24h,   r->max_rise_48h,   r->max_fall_24h,    r->max_fall_48h,
        r->excess_mmol_l,  r->rise_first_24h, r->fall_first_24h,  r->rise_now_24h,
        r->fall_now_24h,   r->last_rate_per_h, r->elapsed_h,      r->worst_at_h,
        (double)r->flags,  (double)r->reserved};
    int k;
    for (k = 0; k < N_REPORT_FIELDS; k++) {
        m[g + (R_xlen_t)k * groups] = v[k];
    }
}

/* r_course_assess(offsets, hours, na, limits): ntr_batch_course_assess over
 * CSR groups; returns list(matrix groups x 14, status). */
SEXP r_course_assess(SEXP s_offsets, SEXP s_hours, SEXP s_na, SEXP s_limits)
{
    R_xlen_t groups = XLENGTH(s_offsets) - 1;
    R_xlen_t n = XLENGTH(s_hours);
    R_xlen_t i;
    const double *lv = REAL(s_limits);
    ntr_course_limits lim;
    size_t *offsets;
    ntr_sample *samples;
    ntr_course_report *reports;
    SEXP mat;
    SEXP st;
    SEXP res;
    int rc;
    if (groups < 0 || XLENGTH(s_limits) != N_LIMIT_FIELDS || XLENGTH(s_na) != n) {
        error("natremia: bad arguments to r_course_assess");
    }
    memset(&lim, 0, sizeof lim);
    lim.struct_size = sizeof lim;
    lim.goal = ISNAN(lv[0]) ? 0 : (int)lv[0];
    lim.max_rise_24h = lv[1];
    lim.max_rise_48h = lv[2];
    lim.max_fall_24h = lv[3];
    lim.max_fall_48h = lv[4];
    lim.min_change_24h = lv[5];
    /* Limits the library refuses fail every group in the batch call; here
     * they stop the call instead, found by assessing one plain sample. */
    {
        const ntr_sample probe = {0.0, 140.0};
        ntr_course_report rep;
        memset(&rep, 0, sizeof rep);
        rep.struct_size = sizeof rep;
        rc = ntr_course_assess(&probe, 1, &lim, &rep);
        if (rc != NTR_OK) {
            error("natremia: limits refused: %s", ntr_status_message(rc));
        }
    }
    offsets = (size_t *)R_alloc((size_t)groups + 1, sizeof *offsets);
    samples = (ntr_sample *)R_alloc(n > 0 ? (size_t)n : 1, sizeof *samples);
    reports = (ntr_course_report *)R_alloc(groups > 0 ? (size_t)groups : 1, sizeof *reports);
    for (i = 0; i <= groups; i++) {
        offsets[i] = (size_t)REAL(s_offsets)[i];
    }
    for (i = 0; i < n; i++) {
        samples[i].hours = REAL(s_hours)[i];
        samples[i].na_mmol_l = REAL(s_na)[i];
    }
    res = PROTECT(allocVector(VECSXP, 2));
    mat = allocMatrix(REALSXP, (int)groups, N_REPORT_FIELDS);
    SET_VECTOR_ELT(res, 0, mat);
    st = allocVector(INTSXP, groups);
    SET_VECTOR_ELT(res, 1, st);
    for (i = 0; i < groups; i++) {
        INTEGER(st)[i] = STATUS_UNWRITTEN;
    }
    rc = ntr_batch_course_assess((size_t)groups, offsets, samples, (size_t)n, &lim,
                                 sizeof(ntr_course_report), reports, INTEGER(st), NULL);
    if (groups > 0 && INTEGER(st)[0] == STATUS_UNWRITTEN) {
        UNPROTECT(1);
        error("natremia: %s", ntr_status_message(rc));
    }
    for (i = 0; i < groups; i++) {
        if (INTEGER(st)[i] == NTR_OK) {
            report_to_row(&reports[i], REAL(mat), groups, i);
        } else {
            int k;
            for (k = 0; k < N_REPORT_FIELDS; k++) {
                REAL(mat)[i + (R_xlen_t)k * groups] = NA_REAL;
            }
        }
    }
    UNPROTECT(1);
    return res;
}

static const R_CallMethodDef call_methods[] = {
    {"r_batch", (DL_FUNC)&r_batch, 4},
    {"r_convert", (DL_FUNC)&r_convert, 4},
    {"r_unit_parse", (DL_FUNC)&r_unit_parse, 1},
    {"r_classify", (DL_FUNC)&r_classify, 2},
    {"r_fluid_preset", (DL_FUNC)&r_fluid_preset, 1},
    {"r_status_message", (DL_FUNC)&r_status_message, 1},
    {"r_version", (DL_FUNC)&r_version, 0},
    {"r_course_limits_preset", (DL_FUNC)&r_course_limits_preset, 1},
    {"r_course_assess", (DL_FUNC)&r_course_assess, 4},
    {NULL, NULL, 0}};

void R_init_natremia(DllInfo *dll)
{
    R_registerRoutines(dll, NULL, call_methods, NULL, NULL);
    R_useDynamicSymbols(dll, FALSE);
    R_forceSymbols(dll, TRUE);
}
