/* SPDX-License-Identifier: MIT */
/* An independent oracle for the correction-series assessment: a
 * straightforward O(n^2) reading of the definitions in include/natremia.h
 * (section correction), pair by pair. tests/test_correction.c checks the
 * linear algorithm and the watcher against it on random series, and
 * tests/bench/bench_correction.c times it beside them, so the benchmark's
 * "pairwise" column is exactly the code the unit test trusts.
 *
 * correction_oracle(s, n, lim) expects what ntr_correction_assess accepts
 * (n >= 1, times non-decreasing, valid limits); it does no checking. */
#ifndef NATREMIA_CORRECTION_ORACLE_H
#define NATREMIA_CORRECTION_ORACLE_H

#include <math.h>
#include <stddef.h>
#include <string.h>

#include "natremia.h"

static int oracle_in_window(double t_earlier, double t_later, double w)
{
    return t_later - t_earlier <= w + NTR_CF_TIME_TOLERANCE_H;
}

/* Lowest sodium among samples 0..j within w hours before time t (j's own
 * sodium included when it is in the window). HUGE_VAL if none. */
static double oracle_window_min(const ntr_sample *s, size_t j, double t, double w)
{
    double m = HUGE_VAL;
    size_t i;
    for (i = 0; i <= j; i++) {
        if (oracle_in_window(s[i].hours, t, w) && s[i].na_mmol_l < m) {
            m = s[i].na_mmol_l;
        }
    }
    return m;
}

static ntr_correction correction_oracle(const ntr_sample *s, size_t n, const ntr_limits *lim)
{
    ntr_correction c;
    const double tol = NTR_CF_TOLERANCE;
    size_t i, j, last = n - 1, prev = n;
    double open6, open24, open48;
    memset(&c, 0, sizeof c);
    for (j = 0; j < n; j++) {
        for (i = 0; i <= j; i++) {
            double rise = s[j].na_mmol_l - s[i].na_mmol_l;
            if (oracle_in_window(s[i].hours, s[j].hours, 24.0) && rise > c.max_rise_24h) {
                c.max_rise_24h = rise;
            }
            if (oracle_in_window(s[i].hours, s[j].hours, 48.0) && rise > c.max_rise_48h) {
                c.max_rise_48h = rise;
            }
        }
        if (oracle_in_window(s[0].hours, s[j].hours, 24.0) &&
            s[j].na_mmol_l - s[0].na_mmol_l > c.rise_first_24h) {
            c.rise_first_24h = s[j].na_mmol_l - s[0].na_mmol_l;
        }
    }
    for (i = 0; i < n; i++) {
        if (s[i].hours < s[last].hours) {
            prev = i;
        }
    }
    if (c.max_rise_24h > lim->max_rise_24h + tol) {
        c.flags |= NTR_CF_OVER_24H;
        c.excess_mmol_l = c.max_rise_24h - lim->max_rise_24h;
    }
    if (c.max_rise_48h > lim->max_rise_48h + tol) {
        c.flags |= NTR_CF_OVER_48H;
        if (c.max_rise_48h - lim->max_rise_48h > c.excess_mmol_l) {
            c.excess_mmol_l = c.max_rise_48h - lim->max_rise_48h;
        }
    }
    if (s[last].hours - s[0].hours >= 24.0 - NTR_CF_TIME_TOLERANCE_H &&
        c.rise_first_24h < lim->min_rise_24h - tol) {
        c.flags |= NTR_CF_BELOW_TARGET;
    }
    open6 = s[last].na_mmol_l - oracle_window_min(s, last, s[last].hours, NTR_CF_RAPID_WINDOW_H);
    open24 = s[last].na_mmol_l - oracle_window_min(s, last, s[last].hours, 24.0);
    open48 = s[last].na_mmol_l - oracle_window_min(s, last, s[last].hours, 48.0);
    if ((open24 > tol && open24 >= lim->max_rise_24h - NTR_CF_NEAR_MARGIN - tol &&
         open24 <= lim->max_rise_24h + tol) ||
        (open48 > tol && open48 >= lim->max_rise_48h - NTR_CF_NEAR_MARGIN - tol &&
         open48 <= lim->max_rise_48h + tol)) {
        c.flags |= NTR_CF_NEAR_LIMIT;
    }
    if (open6 >= NTR_CF_RAPID_RISE - tol) {
        c.flags |= NTR_CF_RAPID_6H;
    }
    if (prev < n && s[last].hours - s[prev].hours > NTR_CF_TIME_TOLERANCE_H) {
        const ntr_sample a = s[prev], b = s[last];
        c.last_rate_per_h = (b.na_mmol_l - a.na_mmol_l) / (b.hours - a.hours);
        if (b.na_mmol_l < a.na_mmol_l) {
            c.flags |= NTR_CF_FALLING;
        }
        if (b.na_mmol_l > a.na_mmol_l) {
            double t = b.hours + (b.hours - a.hours);
            double na = b.na_mmol_l + (b.na_mmol_l - a.na_mmol_l);
            double p24 = na - oracle_window_min(s, last, t, 24.0);
            double p48 = na - oracle_window_min(s, last, t, 48.0);
            if (p24 > lim->max_rise_24h + tol || p48 > lim->max_rise_48h + tol) {
                c.flags |= NTR_CF_PROJECTED_OVER;
            }
        }
    }
    return c;
}

/* ---- course (both directions): the pairwise reading of ntr_course_assess */

/* Highest sodium among samples 0..j within w hours before time t
 * (-HUGE_VAL if none). */
static double oracle_window_max(const ntr_sample *s, size_t j, double t, double w)
{
    double m = -HUGE_VAL;
    size_t i;
    for (i = 0; i <= j; i++) {
        if (oracle_in_window(s[i].hours, t, w) && s[i].na_mmol_l > m) {
            m = s[i].na_mmol_l;
        }
    }
    return m;
}

static int oracle_over(double x, double limit)
{
    return limit > 0.0 && x > limit + NTR_CF_TOLERANCE;
}

static int oracle_near(double x, double limit)
{
    return limit > 0.0 && x > NTR_CF_TOLERANCE &&
           x >= limit - NTR_CF_NEAR_MARGIN - NTR_CF_TOLERANCE && x <= limit + NTR_CF_TOLERANCE;
}

/* Largest change (sign +1: rise, -1: fall) between two samples i < j at
 * most w apart, and the time of the smallest j reaching it. */
static double oracle_largest(const ntr_sample *s, size_t n, double w, int sign, double *at)
{
    double best = 0.0;
    size_t i, j;
    *at = NTR_COURSE_NO_TIME;
    for (j = 0; j < n; j++) {
        for (i = 0; i < j; i++) {
            double d = sign > 0 ? s[j].na_mmol_l - s[i].na_mmol_l : s[i].na_mmol_l - s[j].na_mmol_l;
            if (oracle_in_window(s[i].hours, s[j].hours, w) && d > best) {
                best = d;
                *at = s[j].hours;
            }
        }
    }
    return best;
}

static void oracle_window_over(double x, double limit, double at, unsigned int bit,
                               ntr_course_report *c)
{
    if (oracle_over(x, limit)) {
        c->flags |= bit;
        if (x - limit > c->excess_mmol_l) {
            c->excess_mmol_l = x - limit;
            c->worst_at_h = at;
        }
    }
}

static inline ntr_course_report course_oracle(const ntr_sample *s, size_t n, const ntr_course_limits *lim)
{
    ntr_course_report c;
    const double tol = NTR_CF_TOLERANCE;
    const double margin = NTR_CF_WRONG_WAY_MARGIN + NTR_CF_TOLERANCE;
    const unsigned int any_over = NTR_CF_OVER_24H | NTR_CF_OVER_48H | NTR_CF_FALL_OVER_24H |
                                  NTR_CF_FALL_OVER_48H;
    size_t i, last = n - 1, prev = n;
    double at_r24, at_r48, at_f24, at_f48, toward, lo6;
    memset(&c, 0, sizeof c);
    c.struct_size = sizeof c;
    c.worst_at_h = NTR_COURSE_NO_TIME;
    c.max_rise_24h = oracle_largest(s, n, 24.0, 1, &at_r24);
    c.max_rise_48h = oracle_largest(s, n, 48.0, 1, &at_r48);
    c.max_fall_24h = oracle_largest(s, n, 24.0, -1, &at_f24);
    c.max_fall_48h = oracle_largest(s, n, 48.0, -1, &at_f48);
    for (i = 1; i < n; i++) {
        if (oracle_in_window(s[0].hours, s[i].hours, 24.0)) {
            if (s[i].na_mmol_l - s[0].na_mmol_l > c.rise_first_24h) {
                c.rise_first_24h = s[i].na_mmol_l - s[0].na_mmol_l;
            }
            if (s[0].na_mmol_l - s[i].na_mmol_l > c.fall_first_24h) {
                c.fall_first_24h = s[0].na_mmol_l - s[i].na_mmol_l;
            }
        }
    }
    c.rise_now_24h = s[last].na_mmol_l - oracle_window_min(s, last, s[last].hours, 24.0);
    c.fall_now_24h = oracle_window_max(s, last, s[last].hours, 24.0) - s[last].na_mmol_l;
    c.elapsed_h = s[last].hours - s[0].hours;
    oracle_window_over(c.max_rise_24h, lim->max_rise_24h, at_r24, NTR_CF_OVER_24H, &c);
    oracle_window_over(c.max_rise_48h, lim->max_rise_48h, at_r48, NTR_CF_OVER_48H, &c);
    oracle_window_over(c.max_fall_24h, lim->max_fall_24h, at_f24, NTR_CF_FALL_OVER_24H, &c);
    oracle_window_over(c.max_fall_48h, lim->max_fall_48h, at_f48, NTR_CF_FALL_OVER_48H, &c);
    toward = lim->goal == NTR_GOAL_LOWER ? c.fall_first_24h : c.rise_first_24h;
    if (lim->min_change_24h > 0.0 && c.elapsed_h >= 24.0 - NTR_CF_TIME_TOLERANCE_H &&
        toward < lim->min_change_24h - tol) {
        c.flags |= NTR_CF_BELOW_TARGET;
    }
    if (oracle_near(c.rise_now_24h, lim->max_rise_24h) ||
        oracle_near(s[last].na_mmol_l - oracle_window_min(s, last, s[last].hours, 48.0),
                    lim->max_rise_48h)) {
        c.flags |= NTR_CF_NEAR_LIMIT;
    }
    if (oracle_near(c.fall_now_24h, lim->max_fall_24h) ||
        oracle_near(oracle_window_max(s, last, s[last].hours, 48.0) - s[last].na_mmol_l,
                    lim->max_fall_48h)) {
        c.flags |= NTR_CF_FALL_NEAR_LIMIT;
    }
    lo6 = oracle_window_min(s, last, s[last].hours, NTR_CF_RAPID_WINDOW_H);
    if (s[last].na_mmol_l - lo6 >= NTR_CF_RAPID_RISE - tol) {
        c.flags |= NTR_CF_RAPID_6H;
    }
    for (i = 0; i < n; i++) {
        if (s[i].hours < s[last].hours) {
            prev = i;
        }
    }
    if (prev < n && s[last].hours - s[prev].hours > NTR_CF_TIME_TOLERANCE_H) {
        const ntr_sample a = s[prev], b = s[last];
        double t = b.hours + (b.hours - a.hours);
        double na = b.na_mmol_l + (b.na_mmol_l - a.na_mmol_l);
        c.last_rate_per_h = (b.na_mmol_l - a.na_mmol_l) / (b.hours - a.hours);
        if (b.na_mmol_l < a.na_mmol_l) {
            double p24 = oracle_window_max(s, last, t, 24.0) - na;
            double p48 = oracle_window_max(s, last, t, 48.0) - na;
            c.flags |= NTR_CF_FALLING;
            if (oracle_over(p24, lim->max_fall_24h) || oracle_over(p48, lim->max_fall_48h)) {
                c.flags |= NTR_CF_FALL_PROJECTED_OVER;
            }
        }
        if (b.na_mmol_l > a.na_mmol_l) {
            double p24 = na - oracle_window_min(s, last, t, 24.0);
            double p48 = na - oracle_window_min(s, last, t, 48.0);
            if (oracle_over(p24, lim->max_rise_24h) || oracle_over(p48, lim->max_rise_48h)) {
                c.flags |= NTR_CF_PROJECTED_OVER;
            }
        }
    }
    switch (lim->goal) {
    case NTR_GOAL_RAISE:
        if (c.max_fall_48h > margin) {
            c.flags |= NTR_CF_WRONG_WAY;
        }
        break;
    case NTR_GOAL_LOWER:
        if (c.max_rise_48h > margin) {
            c.flags |= NTR_CF_WRONG_WAY;
        }
        break;
    default:
        if ((c.flags & any_over) != 0u ||
            (lim->max_rise_24h <= 0.0 && lim->max_rise_48h <= 0.0 && c.max_rise_48h > margin) ||
            (lim->max_fall_24h <= 0.0 && lim->max_fall_48h <= 0.0 && c.max_fall_48h > margin)) {
            c.flags |= NTR_CF_WRONG_WAY;
        }
        break;
    }
    return c;
}

#endif
