/* SPDX-License-Identifier: MIT */
/* The words the formula kernels are written in (docs/batch.md, "Where each
 * formula lives"). Not installed.
 *
 * Each formula's input checks and arithmetic are written once, in the
 * kernel header of its area (lib/<area>_kernels.h), with the NTRK_* words
 * below instead of C types and branches. Including a kernel header after
 * this file compiles its kernels for one "flavour", chosen by NTRK_FLAVOUR:
 *
 *   0  one row of doubles; the kernels are named ntri_<name>. A check that
 *      fails returns its status at once and the output is left untouched:
 *      exactly the scalar code the library always had (NTR_TRY style).
 *      The public scalar functions use this flavour, and so does the
 *      size-optimised build's batch (through them).
 *   2  the same for the batch row loops (lib/batch.c), named ntrr_<name>,
 *      with one difference: a choice between values (NTRK_SELECT) and the
 *      combined tests are computed without a branch, as a choice that
 *      depends on the data (age band, sex) would mispredict on about every
 *      other row of a mixed cohort. The values are the same bits.
 *   1  two rows at a time in two-lane vectors (lib/batch.c, GCC/Clang
 *      vector extensions); the kernels are named ntrp_<name>. Every check
 *      becomes a lane mask, all of them are ANDed into the verdict, and the
 *      value is computed unconditionally with the same operations in the
 *      same order, so each lane is the scalar result bit for bit. A false
 *      lane only means "not both rows are plainly valid": the batch loop
 *      then sends the row through flavour 2, which finds the exact status.
 *
 * lib/ntr_internal.h selects flavour 0, so every lib/ file sees the scalar
 * kernels; lib/batch.c defines the pair primitives (pair_*), includes the
 * kernel headers again for flavours 1 and 2, and switches back. This file
 * has no include guard on purpose: including it again redefines the words
 * for the flavour NTRK_FLAVOUR now names.
 *
 * Vocabulary (T = a test: int 0/1 or a lane mask; V = a verdict: a status
 * or a lane mask; R = a real: double or two lanes):
 *   NTRK(name)                 the kernel's name in this flavour
 *   NTRK_REAL, NTRK_SEX, NTRK_INT, NTRK_TEST, NTRK_VERDICT   the types
 *   NTRK_K(x)                  a constant as a real (for tests and selects;
 *                              plain arithmetic takes constants as they are)
 *   NTRK_BEGIN; ... NTRK_END;  open and close a kernel's checks
 *   NTRK_CHECK(x, lo, hi)      input range check: NTR_ERR_NONFINITE or
 *                              NTR_ERR_RANGE (ntr_check)
 *   NTRK_CHECK_DEFINED(x, lo, hi, from, to)
 *                              NTRK_CHECK(x, lo, hi), then NTR_ERR_DOMAIN
 *                              unless from <= x <= to, where
 *                              lo <= from <= to <= hi: pairs test the one
 *                              narrower range
 *   NTRK_REQUIRE(t, status)    fail with status unless t
 *   NTRK_TRY(v)                fail with the verdict of a sub-kernel
 *   NTRK_RETURN_IF(t, out, x)  scalar: succeed early with *out = x when t.
 *                              Pairs test nothing here: a kernel using it
 *                              must fail such rows in a later check of its
 *                              own (its comment says which), so that they
 *                              go to flavour 2
 *   NTRK_TRY_SURE(v, t)        scalar: NTRK_TRY(v). Pairs evaluate the
 *                              test t instead, which must imply that v
 *                              succeeds (a sufficient condition that is
 *                              cheaper, e.g. without a division): a row
 *                              it fails goes to flavour 2, which finds
 *                              the exact verdict; the kernel's comment
 *                              shows why t implies v
 *   NTRK_TRY_IMPLIED(v)        scalar: NTRK_TRY(v). Pairs test nothing:
 *                              the pair checks before it imply that v
 *                              succeeds (the kernel's comment shows why)
 *   NTRK_CHECK_NARROW(x, lo, hi, from, to)
 *                              scalar: NTRK_CHECK(x, lo, hi). Pairs test
 *                              the narrower from <= x <= to (lo <= from,
 *                              to <= hi), inside which a later
 *                              NTRK_TRY_IMPLIED holds; rows outside it go
 *                              to flavour 2
 *   NTRK_GE/GT/LE/LT/EQ(a, b)  comparisons of reals (false for NaN)
 *   NTRK_WITHIN(x, lo, hi)     lo <= x <= hi as a test
 *   NTRK_AND/OR(t, u)          tests combined
 *   NTRK_SELECT(t, a, b)       a where t, else b
 *   NTRK_SEX_IS(sex, code)     a per-row sex code compared
 *   NTRK_COUNT(t)              1 where t, else 0, as NTRK_INT
 */

#undef NTRK
#undef NTRK_REAL
#undef NTRK_SEX
#undef NTRK_INT
#undef NTRK_TEST
#undef NTRK_VERDICT
#undef NTRK_K
#undef NTRK_BEGIN
#undef NTRK_END
#undef NTRK_CHECK
#undef NTRK_CHECK_DEFINED
#undef NTRK_REQUIRE
#undef NTRK_TRY
#undef NTRK_RETURN_IF
#undef NTRK_TRY_SURE
#undef NTRK_TRY_IMPLIED
#undef NTRK_CHECK_NARROW
#undef NTRK_GE
#undef NTRK_GT
#undef NTRK_LE
#undef NTRK_LT
#undef NTRK_EQ
#undef NTRK_WITHIN
#undef NTRK_AND
#undef NTRK_OR
#undef NTRK_SELECT
#undef NTRK_SEX_IS
#undef NTRK_COUNT

#if NTRK_FLAVOUR == 0 || NTRK_FLAVOUR == 2

#if NTRK_FLAVOUR == 0
#define NTRK(name) ntri_##name
#else
#define NTRK(name) ntrr_##name
#endif
#define NTRK_REAL double
#define NTRK_SEX int
#define NTRK_INT int
#define NTRK_TEST int
#define NTRK_VERDICT int
#define NTRK_K(x) (x)
#define NTRK_BEGIN ((void)0)
#define NTRK_END return NTR_OK
#define NTRK_CHECK(x, lo, hi) NTR_TRY(ntr_check((x), (lo), (hi)))
#define NTRK_CHECK_DEFINED(x, lo, hi, from, to)              \
    do {                                                     \
        NTR_TRY(ntr_check((x), (lo), (hi)));                 \
        if (!((x) >= (from) && (x) <= (to))) {               \
            return NTR_ERR_DOMAIN;                           \
        }                                                    \
    } while (0)
#define NTRK_REQUIRE(t, status) \
    do {                        \
        if (!(t)) {             \
            return (status);    \
        }                       \
    } while (0)
#define NTRK_TRY(v) NTR_TRY(v)
#define NTRK_RETURN_IF(t, out, x) \
    do {                          \
        if (t) {                  \
            *(out) = (x);         \
            return NTR_OK;        \
        }                         \
    } while (0)
#define NTRK_TRY_SURE(v, t) NTR_TRY(v)
#define NTRK_TRY_IMPLIED(v) NTR_TRY(v)
#define NTRK_CHECK_NARROW(x, lo, hi, from, to) NTRK_CHECK(x, lo, hi)
#define NTRK_GE(a, b) ((a) >= (b))
#define NTRK_GT(a, b) ((a) > (b))
#define NTRK_LE(a, b) ((a) <= (b))
#define NTRK_LT(a, b) ((a) < (b))
#define NTRK_EQ(a, b) ((a) == (b))
#if NTRK_FLAVOUR == 0
#define NTRK_WITHIN(x, lo, hi) ((x) >= (lo) && (x) <= (hi))
#define NTRK_AND(t, u) ((t) && (u))
#define NTRK_OR(t, u) ((t) || (u))
#define NTRK_SELECT(t, a, b) ((t) ? (a) : (b))
#else
/* Tests are 0 or 1 and have no side effects: & and | need no branch. */
#define NTRK_WITHIN(x, lo, hi) (((x) >= (lo)) & ((x) <= (hi)))
#define NTRK_AND(t, u) ((t) & (u))
#define NTRK_OR(t, u) ((t) | (u))
#define NTRK_SELECT(t, a, b) ntri_select((t), (a), (b))
#endif
#define NTRK_SEX_IS(sex, code) ((sex) == (code))
#define NTRK_COUNT(t) ((t) ? 1 : 0)

#else /* NTRK_FLAVOUR 1, two lanes: the primitives are lib/batch.c's pair_* */

#define NTRK(name) ntrp_##name
#define NTRK_REAL ntr_pair
#define NTRK_SEX ntr_sex_pair
#define NTRK_INT ntr_lanes
#define NTRK_TEST ntr_mask
#define NTRK_VERDICT ntr_mask
#define NTRK_K(x) pair_splat(x)
#define NTRK_BEGIN ntr_mask ntrk_ok_ = pair_true()
#define NTRK_END return ntrk_ok_
#define NTRK_CHECK(x, lo, hi) \
    (ntrk_ok_ = pair_verdict_and(ntrk_ok_, pair_in((x), (lo), (hi))))
#define NTRK_CHECK_DEFINED(x, lo, hi, from, to) \
    (ntrk_ok_ = pair_verdict_and(ntrk_ok_, pair_in((x), (from), (to))))
#define NTRK_REQUIRE(t, status) (ntrk_ok_ = pair_verdict_and(ntrk_ok_, (t)))
#define NTRK_TRY(v) (ntrk_ok_ = pair_verdict_and(ntrk_ok_, (v)))
/* No lane test (see the vocabulary above): a later check fails such rows. */
#define NTRK_RETURN_IF(t, out, x) ((void)0)
/* The sufficient test only (see the vocabulary above). */
#define NTRK_TRY_SURE(v, t) (ntrk_ok_ = pair_verdict_and(ntrk_ok_, (t)))
#define NTRK_TRY_IMPLIED(v) ((void)0)
#define NTRK_CHECK_NARROW(x, lo, hi, from, to) \
    (ntrk_ok_ = pair_verdict_and(ntrk_ok_, pair_in((x), (from), (to))))
#define NTRK_GE(a, b) pair_ge((a), (b))
#define NTRK_GT(a, b) pair_gt((a), (b))
#define NTRK_LE(a, b) pair_le((a), (b))
#define NTRK_LT(a, b) pair_lt((a), (b))
#define NTRK_EQ(a, b) pair_eq((a), (b))
#define NTRK_WITHIN(x, lo, hi) pair_in((x), (lo), (hi))
#define NTRK_AND(t, u) pair_and((t), (u))
#define NTRK_OR(t, u) pair_or((t), (u))
#define NTRK_SELECT(t, a, b) pair_select((t), (a), (b))
#define NTRK_SEX_IS(sex, code) pair_sex_is((sex), (code))
/* A true lane is all ones, -1: its negation is 1. */
#define NTRK_COUNT(t) (-(ntr_lanes)(t))

#endif
