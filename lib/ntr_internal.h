/* SPDX-License-Identifier: MIT */
/* Internal helpers shared by the lib/ sources. Not installed. */
#ifndef NTR_INTERNAL_H
#define NTR_INTERNAL_H

#include "natremia.h"
#include <math.h>
#include <stdint.h>

/* Plausible input ranges. docs/ranges.md says where each comes from; keep
 * the two in step. */
#define NTR_NA_MIN 80.0            /* serum sodium, mmol/L */
#define NTR_NA_MAX 220.0
#define NTR_GLUCOSE_MAX 200.0      /* mmol/L */
#define NTR_UREA_MAX 200.0         /* mmol/L */
#define NTR_ETHANOL_MAX 400.0      /* mmol/L */
#define NTR_OSM_MIN 150.0          /* serum osmolality, mOsm/kg */
#define NTR_OSM_MAX 600.0
#define NTR_AGE_MAX 130.0          /* years */
#define NTR_ADULT_AGE 18.0         /* years */
#define NTR_ELDERLY_AGE 65.0       /* years */
#define NTR_HEIGHT_MIN 30.0        /* cm */
#define NTR_HEIGHT_MAX 275.0
#define NTR_WEIGHT_MIN 0.3         /* kg */
#define NTR_WEIGHT_MAX 650.0
#define NTR_TBW_MIN 0.1            /* L */
#define NTR_TBW_MAX 400.0
#define NTR_TBW_FRACTION_AGE_MIN 1.0 /* years: ntr_tbw_fraction() refuses infants */
#define NTR_TBW_SHARE_MIN 0.20     /* Watson body water / weight accepted */
#define NTR_TBW_SHARE_MAX 0.80
#define NTR_INFUSATE_NA_MAX 1100.0 /* mmol/L; 8.4% NaHCO3 is 1000 */
#define NTR_INFUSATE_K_MAX 400.0   /* mmol/L */
#define NTR_INFUSE_VOLUME_MAX 20.0 /* L in one plan step */
#define NTR_DELTA_MAX 50.0         /* |wanted change|, mmol/L */
#define NTR_URINE_NA_MAX 500.0     /* mmol/L */
#define NTR_URINE_K_MAX 300.0      /* mmol/L */
#define NTR_URINE_VOLUME_MAX 30.0  /* L */
#define NTR_RATIO_MAX 20.0
#define NTR_CONVERT_MAX 1.0e6
/* How far the Dorwart-Chalmers floor of a glucose may exceed the measured
 * osmolality before ntr_glucose_unit_check() refuses its unit (since 1.1). */
#define NTR_GLUCOSE_UNIT_TOLERANCE 20.0 /* mOsm/kg */
#define NTR_GLUCOSE_FACTOR_MAX 5.0 /* mmol/L Na per 100 mg/dL glucose; why: docs/sodium.md */
/* Work-up (lib/workup.c). Wide nets that catch unit slips, not clinical
 * limits; docs/ranges.md gives the reasoning. */
#define NTR_URINE_OSM_MIN 10.0     /* urine osmolality, mOsm/kg */
#define NTR_URINE_OSM_MAX 2000.0
#define NTR_URIC_ACID_MAX 2.0      /* serum uric acid, mmol/L (33.6 mg/dL) */
#define NTR_FE_PERCENT_MAX 200.0   /* a fractional excretion given as input, % */
#define NTR_FE_INPUT_MAX 1.0e6     /* any concentration in ntr_fractional_excretion */
/* Correction and balance (lib/correction.c, lib/balance.c); docs/ranges.md. */
#define NTR_HOURS_MAX 1.0e6          /* |sample time|, h: about 114 years, epoch-based hours fit */
#define NTR_LIMIT_MAX 50.0           /* a correction limit, mmol/L (as NTR_DELTA_MAX) */
#define NTR_FLOW_RATE_MAX 5000.0     /* |rate| of a timed flow, and urine rate, mL/h */
#define NTR_PLAN_HOURS_MAX 720.0     /* plan length and flow times, h (30 days) */
#define NTR_PLAN_STEP_MIN (1.0 / 60.0) /* plan step and re-lowering period, h (one minute) */
#define NTR_FLOW_VOLUME_MIN (-30.0)  /* a loss in ntr_balance_predict, L (as NTR_URINE_VOLUME_MAX) */
/* Urine feedback and the fit (lib/feedback.c); docs/ranges.md. */
#define NTR_URINE_ML_MAX 30000.0     /* one measured urine interval, mL (NTR_URINE_VOLUME_MAX) */
#define NTR_FIT_TBW_SPAN 3.0         /* fitted body water within guess/3 .. 3*guess */
#define NTR_FIT_LOSS_MAX 2000.0      /* |fitted free-water loss|, mL/h */
#define NTR_FIT_ITER_MAX 100         /* iterations from each start */
#define NTR_FIT_CORR_MAX 0.999       /* |correlation| of the two estimates beyond which they are not separable */
#define NTR_FIT_DRIFT_MMOL_L 1.5     /* mean of the last three residuals that sets NTR_FIT_DRIFT */
#define NTR_FIT_MIN_SAMPLES 3u

/* Solute and restriction (lib/solute.c); docs/ranges.md. The urine
 * osmolality uses NTR_URINE_OSM_MIN/MAX above, and the urine volume a
 * solute makes is held to NTR_URINE_VOLUME_MAX (L/day). */
#define NTR_SOLUTE_MOSM_DAY_MAX 10000.0 /* osmoles excreted per day, mOsm/day */
#define NTR_INSENSIBLE_L_DAY_MAX 10.0   /* net insensible loss, L/day */
#define NTR_SOLUTE_GRAMS_MAX 200.0      /* a daily dose of urea or NaCl, g */
#define NTR_INTAKE_L_DAY_MAX 10.0       /* a target fluid intake, L/day (above 0) */

/* IUPAC standard atomic weights, g/mol (abridged values), written once for
 * every molar mass the library uses (lib/units.c, lib/solute.c); the molar
 * masses built from them are checked against Debian's python3-periodictable
 * by tests/check_molar_masses.py. */
#define NTR_AW_H 1.008
#define NTR_AW_C 12.011
#define NTR_AW_N 14.007
#define NTR_AW_O 15.999
#define NTR_AW_NA 22.98977
#define NTR_AW_K 39.0983
#define NTR_AW_CL 35.453
/* Urea, CH4N2O: converted by lib/units.c, dosed by lib/solute.c. */
#define NTR_MM_UREA (NTR_AW_C + 4.0 * NTR_AW_H + 2.0 * NTR_AW_N + NTR_AW_O)
/* Therapy (lib/therapy.c); docs/ranges.md. */
#define NTR_RELOWER_MARGIN_MAX 10.0  /* margin below a limit when re-lowering, mmol/L */
#define NTR_INSENSIBLE_MAX 500.0     /* insensible water loss, mL/h (12 L/day) */
#define NTR_HYPER_CHECK_POINTS 48.0  /* predicted points the lowering plan is checked at */

/* NTR_OK when x is finite and lo <= x <= hi; lo and hi must be finite.
 * The valid case costs one pair of comparisons: NaN fails both and an
 * infinity fails one, so only a value that is already rejected needs the
 * finiteness test that tells NTR_ERR_NONFINITE from NTR_ERR_RANGE
 * (tests/bench/run-bench.sh measures the per-call cost this keeps low).
 * Built for size (-Os, as firmware is), every check calls the one copy in
 * lib/status.c instead: on a processor without double-precision hardware
 * each inlined comparison is a library call, and sharing them saves about
 * 5 KB on a Cortex-M4 (tests/bench/firmware.py). */
int ntri_check_range(double x, double lo, double hi);

#if defined(__OPTIMIZE_SIZE__)
static inline int ntr_check(double x, double lo, double hi)
{
    return ntri_check_range(x, lo, hi);
}
#else
static inline int ntr_check(double x, double lo, double hi)
{
    if (x >= lo && x <= hi) {
        return NTR_OK;
    }
    return isfinite(x) ? NTR_ERR_RANGE : NTR_ERR_NONFINITE;
}
#endif

static inline int ntr_check_na(double na_mmol_l)
{
    return ntr_check(na_mmol_l, NTR_NA_MIN, NTR_NA_MAX);
}

static inline int ntr_check_tbw(double tbw_l)
{
    return ntr_check(tbw_l, NTR_TBW_MIN, NTR_TBW_MAX);
}

/* Bytes of count elements of size bytes, saturated (a count a caller
 * claims can be any size_t). */
static inline size_t ntri_bytes(size_t count, size_t size)
{
    return count > SIZE_MAX / size ? SIZE_MAX : count * size;
}

/* Whether the byte ranges [a, a + a_bytes) and [b, b + b_bytes) share a
 * byte: the aliasing rule of include/natremia.h ("Overlapping buffers").
 * Compared as integers, which is defined for any two pointers (relational
 * operators are not, between separate objects). */
static inline int ntri_overlap(const void *a, size_t a_bytes, const void *b,
                               size_t b_bytes)
{
    const uintptr_t x = (uintptr_t)a;
    const uintptr_t y = (uintptr_t)b;
    if (a_bytes == 0 || b_bytes == 0) {
        return 0;
    }
    return x <= y ? y - x < a_bytes : x - y < b_bytes;
}

/* Evaluate a check and return its status from the caller if it failed. */
#define NTR_TRY(expr)                     \
    do {                                  \
        int ntr_try_status_ = (expr);     \
        if (ntr_try_status_ != NTR_OK) {  \
            return ntr_try_status_;       \
        }                                 \
    } while (0)

/* a where t is true, else b, without a branch, for the batch row loops
 * (lib/kernel_lanes.h, flavour 2): the kernels' choices depend on the data
 * (age bands, sex, a glucose threshold), and a branch on them mispredicts
 * on about every other row of a mixed cohort; the row loops are the only
 * loops on targets without two-lane vectors (docs/performance.md). The
 * bits of a or b, exactly. */
static inline double ntri_select(int t, double a, double b)
{
    union {
        double d;
        uint64_t u;
    } x, y;
    const uint64_t take_a = (uint64_t)0 - (uint64_t)(t != 0);
    x.d = a;
    y.d = b;
    x.u = (x.u & take_a) | (y.u & ~take_a);
    return x.d;
}

/* ---- formula kernels ----------------------------------------------------
 *
 * Formulas and their input checks are written once, as lane-generic
 * kernels (lib/kernel_lanes.h): the shared model rules in
 * lib/model_kernels.h (ntri_model_na, ntri_model_tbw, ntri_mass_balance,
 * ntri_efw), each area's formulas in lib/<area>_kernels.h. Here the scalar
 * flavour is selected and the model rules compiled for it; lib/batch.c
 * compiles the same kernels for its row loops and for two lanes as well. */
#define NTRK_FLAVOUR 0
#include "kernel_lanes.h"
#include "model_kernels.h"

#endif
