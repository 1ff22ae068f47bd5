/* SPDX-License-Identifier: MIT */
/* A model of lib/batch.c's two-lane primitives (pair_*) in plain C, for
 * Frama-C EVA only (tests/frama-c.sh; docs/reliability.md, "Static
 * proof"). EVA does not model GCC vector extensions or SSE2 intrinsics,
 * so tests/frama-c.sh analyses a copy of lib/batch.c in which the block
 * that defines the vector types and primitives is replaced by this file
 * (line for line: every other line, so every line number, is the one of
 * lib/batch.c). The two-lane kernels (lib/kernel_lanes.h, flavour 1), the
 * pair functions and the pair loops of lib/batch.c are then the code EVA
 * follows, exactly as written.
 *
 * Both lanes run the same operations on their own row, so one abstract
 * lane stands for both: a load reads both rows (EVA checks both accesses)
 * and yields either one (the join of the two values), a store writes the
 * value to both rows. A mask is 0 or -1 (all bits set), as a lane of the
 * real masks is; a verdict is "true" when its lane is. Since every
 * driver gives all rows of a column the same range, the join of two rows
 * is that range: no value is lost by standing one lane for both. */
#ifndef NTR_FRAMA_LANES_MODEL_H
#define NTR_FRAMA_LANES_MODEL_H

#include "__fc_builtin.h"

typedef double ntr_pair;
typedef long long ntr_lanes;
typedef long long ntr_mask;
typedef int ntr_sex_pair;
/* The advice column's two ints (lib/batch.c stores them through a cast). */
typedef struct {
    int lane[2];
} ntr_int_pair;

static inline ntr_pair pair_load(const double *p)
{
    const double row0 = p[0];
    const double row1 = p[1];
    return Frama_C_interval(0, 1) ? row0 : row1;
}

static inline void pair_store(double *p, ntr_pair v)
{
    p[0] = v;
    p[1] = v;
}

static inline ntr_pair pair_splat(double x)
{
    return x;
}

static inline ntr_mask lanes_mask(int t)
{
    return t ? -1LL : 0LL;
}

static inline ntr_mask pair_true(void)
{
    return -1LL;
}

static inline ntr_mask pair_verdict_and(ntr_mask verdict, ntr_mask m)
{
    return verdict & m;
}

static inline ntr_mask pair_ge(ntr_pair a, ntr_pair b)
{
    return lanes_mask(a >= b);
}

static inline ntr_mask pair_gt(ntr_pair a, ntr_pair b)
{
    return lanes_mask(a > b);
}

static inline ntr_mask pair_le(ntr_pair a, ntr_pair b)
{
    return lanes_mask(a <= b);
}

static inline ntr_mask pair_lt(ntr_pair a, ntr_pair b)
{
    return lanes_mask(a < b);
}

static inline ntr_mask pair_eq(ntr_pair a, ntr_pair b)
{
    return lanes_mask(a == b);
}

static inline ntr_mask pair_and(ntr_mask a, ntr_mask b)
{
    return a & b;
}

static inline ntr_mask pair_or(ntr_mask a, ntr_mask b)
{
    return a | b;
}

static inline int pair_all(ntr_mask m)
{
    return m == -1LL;
}

static inline ntr_pair pair_select(ntr_mask m, ntr_pair a, ntr_pair b)
{
    return m ? a : b;
}

static inline ntr_sex_pair pair_sex_load(const int *sex)
{
    const int row0 = sex[0];
    const int row1 = sex[1];
    return Frama_C_interval(0, 1) ? row0 : row1;
}

static inline ntr_mask pair_sex_is(ntr_sex_pair codes, int which)
{
    return lanes_mask(codes == which);
}

/* lib/batch.c narrows the advice lanes with __builtin_convertvector. */
static inline ntr_int_pair lanes_model_ints(ntr_lanes band)
{
    ntr_int_pair r;
    r.lane[0] = (int)band;
    r.lane[1] = (int)band;
    return r;
}
#define __builtin_convertvector(v, type) lanes_model_ints(v)

#endif
