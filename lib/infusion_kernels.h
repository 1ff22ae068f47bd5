/* SPDX-License-Identifier: MIT */
/* Infusate predictions, written once (docs/infusion.md): the kernels of
 * ntr_infusate_change_per_litre(), ntr_infusate_change() and
 * ntr_infusate_volume_for_change(), used by those functions
 * (lib/infusion.c) and by their batch entry points (lib/batch.c).
 * Lane-generic, see lib/kernel_lanes.h. Not installed. */
#ifndef NTR_INFUSION_KERNELS_ONCE
#define NTR_INFUSION_KERNELS_ONCE
/* How far inside the model's sodium range (NTR_NA_MIN..NTR_NA_MAX) a
 * target sodium must lie for the two-lane volume kernel to take the mass
 * balance of its volume as accepted without computing it, mmol/L (see
 * infusate_volume_for_change below): far above the bound on the rounding
 * error, far below any sodium a caller can tell apart. */
#define NTR_VOLUME_SURE_MARGIN 1e-9
#endif

#if (NTRK_FLAVOUR == 0 && !defined(NTR_INFUSION_KERNELS_0)) || \
    (NTRK_FLAVOUR == 1 && !defined(NTR_INFUSION_KERNELS_1)) || \
    (NTRK_FLAVOUR == 2 && !defined(NTR_INFUSION_KERNELS_2))
#if NTRK_FLAVOUR == 0
#define NTR_INFUSION_KERNELS_0
#elif NTRK_FLAVOUR == 1
#define NTR_INFUSION_KERNELS_1
#else
#define NTR_INFUSION_KERNELS_2
#endif

/* The inputs every infusate prediction takes, in argument order. */
static inline NTRK_VERDICT NTRK(infusate_inputs)(NTRK_REAL na_mmol_l,
                                                 NTRK_REAL tbw_l,
                                                 NTRK_REAL infusate_na_mmol_l,
                                                 NTRK_REAL infusate_k_mmol_l)
{
    NTRK_BEGIN;
    NTRK_CHECK(na_mmol_l, NTR_NA_MIN, NTR_NA_MAX);
    NTRK_CHECK(tbw_l, NTR_TBW_MIN, NTR_TBW_MAX);
    NTRK_CHECK(infusate_na_mmol_l, 0.0, NTR_INFUSATE_NA_MAX);
    NTRK_CHECK(infusate_k_mmol_l, 0.0, NTR_INFUSATE_K_MAX);
    NTRK_END;
}

/* The prediction's domain, by the rule ntr_balance_predict() applies to the
 * same flow (ntri_mass_balance): sodium after within 80 to 220 mmol/L and
 * body water after within 0.1 to 400 L, else NTR_ERR_DOMAIN. excess_mmol
 * is volume * (Na_inf + K_inf - Na), as the prediction computes it. */
static inline NTRK_VERDICT NTRK(prediction)(NTRK_REAL na_mmol_l, NTRK_REAL tbw_l,
                                            NTRK_REAL volume_l,
                                            NTRK_REAL excess_mmol)
{
    NTRK_REAL na_after, tbw_after;
    return NTRK(mass_balance)(na_mmol_l, tbw_l, volume_l, excess_mmol,
                              &na_after, &tbw_after);
}

/* Adrogue & Madias 2000 as published: (Na_inf + K_inf - Na)/(TBW + 1).
 * Written out on its own rather than as the change after 1 L, so the test
 * that the two agree at 1 L compares two independent expressions. */
static inline NTRK_VERDICT NTRK(infusate_change_per_litre)(
    NTRK_REAL na_mmol_l, NTRK_REAL tbw_l, NTRK_REAL infusate_na_mmol_l,
    NTRK_REAL infusate_k_mmol_l, NTRK_REAL *delta_mmol_l)
{
    NTRK_BEGIN;
    NTRK_TRY(NTRK(infusate_inputs)(na_mmol_l, tbw_l, infusate_na_mmol_l,
                                   infusate_k_mmol_l));
    NTRK_TRY(NTRK(prediction)(na_mmol_l, tbw_l, NTRK_K(1.0),
                              infusate_na_mmol_l + infusate_k_mmol_l - na_mmol_l));
    *delta_mmol_l = (infusate_na_mmol_l + infusate_k_mmol_l - na_mmol_l) /
                    (tbw_l + 1.0);
    NTRK_END;
}

/* The change after volume_l: (Na*TBW + C*V)/(TBW + V) - Na, rearranged as
 * V*(C - Na)/(TBW + V) so Na does not cancel. */
static inline NTRK_VERDICT NTRK(infusate_change)(NTRK_REAL na_mmol_l,
                                                 NTRK_REAL tbw_l,
                                                 NTRK_REAL infusate_na_mmol_l,
                                                 NTRK_REAL infusate_k_mmol_l,
                                                 NTRK_REAL volume_l,
                                                 NTRK_REAL *delta_mmol_l)
{
    NTRK_REAL excess;
    NTRK_BEGIN;
    NTRK_TRY(NTRK(infusate_inputs)(na_mmol_l, tbw_l, infusate_na_mmol_l,
                                   infusate_k_mmol_l));
    NTRK_CHECK(volume_l, 0.0, NTR_INFUSE_VOLUME_MAX);
    excess = volume_l * (infusate_na_mmol_l + infusate_k_mmol_l - na_mmol_l);
    NTRK_TRY(NTRK(prediction)(na_mmol_l, tbw_l, volume_l, excess));
    *delta_mmol_l = excess / (tbw_l + volume_l);
    NTRK_END;
}

/* The volume that changes sodium by target_delta_mmol_l:
 * delta*TBW / (C - Na - delta). */
static inline NTRK_VERDICT NTRK(infusate_volume_for_change)(
    NTRK_REAL na_mmol_l, NTRK_REAL tbw_l, NTRK_REAL infusate_na_mmol_l,
    NTRK_REAL infusate_k_mmol_l, NTRK_REAL target_delta_mmol_l,
    NTRK_REAL *volume_l)
{
    NTRK_REAL headroom;
    NTRK_REAL volume;
    NTRK_TEST rise, fall;
    NTRK_BEGIN;
    NTRK_TRY(NTRK(infusate_inputs)(na_mmol_l, tbw_l, infusate_na_mmol_l,
                                   infusate_k_mmol_l));
    NTRK_CHECK(target_delta_mmol_l, -NTR_DELTA_MAX, NTR_DELTA_MAX);
    /* The sodium aimed at must be one the model predicts, by the rule
     * ntr_relower_estimate() applies to its target. Two lanes require it
     * at least NTR_VOLUME_SURE_MARGIN inside the range, which the
     * prediction's check below relies on (see there). */
    NTRK_TRY_SURE(NTRK(model_na)(na_mmol_l + target_delta_mmol_l),
                  NTRK_WITHIN(na_mmol_l + target_delta_mmol_l,
                              NTR_NA_MIN + NTR_VOLUME_SURE_MARGIN,
                              NTR_NA_MAX - NTR_VOLUME_SURE_MARGIN));
    NTRK_RETURN_IF(NTRK_EQ(target_delta_mmol_l, NTRK_K(0.0)), volume_l, 0.0);
    /* The infusate must lie beyond the target sodium, on the same side.
     * (A change of 0 fails both tests: in two lanes, such a row goes to
     * the scalar kernel, which returned 0.0 above.) */
    headroom = infusate_na_mmol_l + infusate_k_mmol_l - na_mmol_l -
               target_delta_mmol_l;
    rise = NTRK_AND(NTRK_GT(target_delta_mmol_l, NTRK_K(0.0)),
                    NTRK_GT(headroom, NTRK_K(0.0)));
    fall = NTRK_AND(NTRK_LT(target_delta_mmol_l, NTRK_K(0.0)),
                    NTRK_LT(headroom, NTRK_K(0.0)));
    NTRK_REQUIRE(NTRK_OR(rise, fall), NTR_ERR_DOMAIN);
    volume = target_delta_mmol_l * tbw_l / headroom;
    NTRK_REQUIRE(NTRK_LE(volume, NTRK_K(NTR_INFUSE_VOLUME_MAX)), NTR_ERR_DOMAIN);
    /* The volume given to ntr_infusate_change() must not be refused there:
     * a target at the edge of the range can round to just outside it.
     *
     * Two lanes test only the water after the volume here (NTRK_TRY_SURE):
     * the target was found at least NTR_VOLUME_SURE_MARGIN inside the
     * sodium range above, and that implies the prediction's sodium is in
     * range too. That sodium is Na + q with q = V*D/(TBW + V), D the
     * infusate's excess over Na (the same double in the headroom and
     * here) and V = delta*TBW/(D - delta); exactly, q = delta. Each of
     * the six roundings on the way (D - delta, delta*TBW, the quotient,
     * V*D, TBW + V, the quotient) is within a relative 2^-53, and
     * |delta/D| < 1 (D lies beyond delta on the same side, as the headroom
     * test required), so q is delta within a relative 10 * 2^-53, i.e.
     * 6e-14 mmol/L for |delta| <= 50. The predicted sodium and the target
     * (Na + delta) then differ by less than 1e-13 mmol/L with their own
     * roundings, and a target 1e-9 inside the range has a prediction
     * inside it too. Rows nearer the edge go to the scalar kernel, which
     * computes the prediction (tests/test_batch.c sweeps them). */
    NTRK_TRY_SURE(NTRK(prediction)(na_mmol_l, tbw_l, volume,
                                   volume * (infusate_na_mmol_l +
                                             infusate_k_mmol_l - na_mmol_l)),
                  NTRK(model_tbw)(tbw_l + volume));
    *volume_l = volume;
    NTRK_END;
}

#endif
