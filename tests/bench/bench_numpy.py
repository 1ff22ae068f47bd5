#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""natremia's Python array calls against numpy with the same validation.

For every array function of the binding (natremia.arrays), the same
formula and the same per-row validation are written in plain numpy, the
way a data team would without natremia: each input is checked for being
finite and inside its documented range, in argument order, giving the same
per-row status code (NTR_ERR_NONFINITE 2, NTR_ERR_RANGE 3, NTR_ERR_DOMAIN 5,
NTR_ERR_ARG 8); failed rows hold NaN. Both run on the same invented rows
in the same process, alternately, REPEATS times; the fastest run of each is
kept (process CPU time). The numpy result and status are checked to equal
the binding's, so both did the same work.

The binding's C batch call is also timed alone (bare_call), into output
arrays it has already written: binding time / that time is what the
Python side adds (conversion, allocation, status check, wrapping).

A second, lean numpy version of every function (issue 16) is what a skilled
numpy user writes: one combined "all inputs in range" mask (a NaN fails
every comparison, so it also catches non-finite values), the formula over
all rows, and the exact per-input grading only for the few rows that fail
(np.flatnonzero of the mask), which gives the same status codes and NaNs.
It must give values and statuses identical to the binding's too; the run
reports the binding against both.

Freed memory is kept in the process for both sides (glibc mallopt, see
keep_heap); a third argument "default" leaves glibc's defaults, to see the
cost of fresh pages.

Usage: bench_numpy.py ROWS REPEATS [default]  -> JSON on stdout.
Needs NATREMIA_LIBRARY (or an installed library) and bindings/python on
PYTHONPATH.
"""
import ctypes
import json
import sys
import time

import numpy as np

import natremia.arrays as A

OK, NONFINITE, RANGE, DOMAIN, ARG = 0, 2, 3, 5, 8


def check(status, x, lo, hi):
    """Next input in argument order: keep an earlier failure, else grade x."""
    grade = np.where(np.isfinite(x), np.where((x >= lo) & (x <= hi), OK, RANGE),
                     NONFINITE)
    return np.where(status == OK, grade, status)


def domain(status, ok):
    return np.where(status == OK, np.where(ok, OK, DOMAIN), status)


def start(n):
    return np.zeros(n, dtype=np.intc)


def finish(status, value):
    return np.where(status == OK, value, np.nan), status


# ---- the formulas in numpy (same expressions, same operation order) --------

def np_osm_calculated(na, glucose, urea, ethanol):
    st = check(start(na.size), na, 80.0, 220.0)
    st = check(st, glucose, 0.0, 200.0)
    st = check(st, urea, 0.0, 200.0)
    st = check(st, ethanol, 0.0, 400.0)
    return finish(st, 2.0 * na + glucose + urea + 0.0 + ethanol)


def np_osm_effective(na, glucose):
    st = check(start(na.size), na, 80.0, 220.0)
    st = check(st, glucose, 0.0, 200.0)
    return finish(st, 2.0 * na + glucose)


def np_osm_gap(measured, calculated):
    st = check(start(measured.size), measured, 150.0, 600.0)
    st = check(st, calculated, 150.0, 600.0)
    return finish(st, measured - calculated)


def np_na_corrected_glucose(na, glucose):  # Katz, 1.6 per 100 mg/dL
    st = check(start(na.size), na, 80.0, 220.0)
    st = check(st, glucose, 0.0, 200.0)
    mg_dl = glucose * 18.0156
    corrected = np.where(mg_dl <= 100.0, na, na + 1.6 * (mg_dl - 100.0) / 100.0)
    return finish(st, corrected)


def np_na_deficit(tbw, na, target):
    st = check(start(tbw.size), tbw, 0.1, 400.0)
    st = check(st, na, 80.0, 220.0)
    st = check(st, target, 80.0, 220.0)
    st = domain(st, ~(target < na))
    return finish(st, tbw * (target - na))


def np_tbw_fraction(sex, age, weight):
    st = np.where((sex == 1) | (sex == 2), OK, ARG).astype(np.intc)
    st = check(st, age, 1.0, 130.0)  # infants refused
    st = check(st, weight, 0.3, 650.0)
    adult = np.where(sex == 1, np.where(age < 65.0, 0.6, 0.5),
                     np.where(age < 65.0, 0.5, 0.45))
    fraction = np.where(age < 18.0, 0.6, adult)
    return finish(st, fraction * weight)


def np_tbw_watson(sex, age, height, weight):
    st = np.where((sex == 1) | (sex == 2), OK, ARG).astype(np.intc)
    st = check(st, age, 18.0, 130.0)
    st = check(st, height, 30.0, 275.0)
    st = check(st, weight, 0.3, 650.0)
    tbw = np.where(sex == 1,
                   2.447 - 0.09516 * age + 0.1074 * height + 0.3362 * weight,
                   -2.097 + 0.1069 * height + 0.2466 * weight)
    st = domain(st, watson_plausible(tbw, weight))
    return finish(st, tbw)


def watson_plausible(tbw, weight):
    """The library refuses a Watson body water outside 20-80% of the weight
    or outside 0.1-400 L (NTR_ERR_DOMAIN)."""
    return ((tbw >= 0.20 * weight) & (tbw <= 0.80 * weight) &
            (tbw >= 0.1) & (tbw <= 400.0))


def np_free_water_deficit(tbw, na):
    st = check(start(tbw.size), tbw, 0.1, 400.0)
    st = check(st, na, 80.0, 220.0)
    st = domain(st, ~(na < 140.0))
    return finish(st, tbw * (na / 140.0 - 1.0))


def infusate_status(na, tbw, inf_na, inf_k):
    st = check(start(na.size), na, 80.0, 220.0)
    st = check(st, tbw, 0.1, 400.0)
    st = check(st, inf_na, 0.0, 1100.0)
    return check(st, inf_k, 0.0, 400.0)


def balance_ok(na, tbw, volume, excess):
    """The library's mass-balance domain: body water after within 0.1-400 L
    and sodium after within 80-220 mmol/L, else NTR_ERR_DOMAIN."""
    tbw_after = tbw + volume
    na_after = na + excess / tbw_after
    return ((tbw_after >= 0.1) & (tbw_after <= 400.0) &
            (na_after >= 80.0) & (na_after <= 220.0))


def np_infusate_change_per_litre(na, tbw, inf_na, inf_k):
    st = infusate_status(na, tbw, inf_na, inf_k)
    st = domain(st, balance_ok(na, tbw, 1.0, inf_na + inf_k - na))
    return finish(st, (inf_na + inf_k - na) / (tbw + 1.0))


def np_infusate_change(na, tbw, inf_na, inf_k, volume):
    st = infusate_status(na, tbw, inf_na, inf_k)
    st = check(st, volume, 0.0, 20.0)
    excess = volume * (inf_na + inf_k - na)
    st = domain(st, balance_ok(na, tbw, volume, excess))
    return finish(st, excess / (tbw + volume))


def np_infusate_volume_for_change(na, tbw, inf_na, inf_k, delta):
    st = infusate_status(na, tbw, inf_na, inf_k)
    st = check(st, delta, -50.0, 50.0)
    headroom = inf_na + inf_k - na - delta
    volume = np.where(delta == 0.0, 0.0, delta * tbw / headroom)
    reachable = np.where(delta > 0.0, headroom > 0.0, headroom < 0.0)
    st = domain(st, (delta == 0.0) | (reachable & (volume <= 20.0)))
    return finish(st, volume)


def urine_status(st, una, uk, sna):
    st = check(st, una, 0.0, 500.0)
    st = check(st, uk, 0.0, 300.0)
    return check(st, sna, 80.0, 220.0)


def np_furst_ratio(una, uk, sna):
    st = urine_status(start(una.size), una, uk, sna)
    return finish(st, (una + uk) / sna)


def np_restriction_from_ratio(ratio):
    st = check(start(ratio.size), ratio, 0.0, 20.0)
    band = np.where(ratio < 0.9, 1, np.where(ratio <= 1.0, 2, 3))
    return np.where(st == OK, band, 0).astype(np.intc), st


def np_efwc(volume, una, uk, sna):
    st = check(start(volume.size), volume, 0.0, 30.0)
    st = urine_status(st, una, uk, sna)
    return finish(st, volume * (1.0 - (una + uk) / sna))


# ---- the lean versions: one mask for all rows, grading only the failures --

def lean(checks, value, domain_ok=None, arg_ok=None):
    """checks: [(x, lo, hi)] in argument order; value: the formula over all
    rows; domain_ok: a mask of rows whose inputs satisfy the formula's
    domain (tested after the ranges); arg_ok: an enumeration check tested
    before the ranges."""
    ok = arg_ok.copy() if arg_ok is not None else None
    for x, lo, hi in checks:
        inside = (x >= lo) & (x <= hi)
        ok = inside if ok is None else (ok & inside)
    if domain_ok is not None:
        ok &= domain_ok
    status = np.zeros(value.size, dtype=np.intc)
    bad = np.flatnonzero(~ok)
    if bad.size:
        st = np.zeros(bad.size, dtype=np.intc)
        if arg_ok is not None:
            st[~arg_ok[bad]] = ARG
        for x, lo, hi in checks:
            st = check(st, x[bad] if np.ndim(x) else x, lo, hi)
        if domain_ok is not None:
            st = domain(st, domain_ok[bad])
        status[bad] = st
        value[bad] = np.nan
    return value, status


def lean_osm_calculated(na, glucose, urea, ethanol):
    return lean([(na, 80.0, 220.0), (glucose, 0.0, 200.0), (urea, 0.0, 200.0),
                 (ethanol, 0.0, 400.0)], 2.0 * na + glucose + urea + 0.0 + ethanol)


def lean_osm_effective(na, glucose):
    return lean([(na, 80.0, 220.0), (glucose, 0.0, 200.0)], 2.0 * na + glucose)


def lean_osm_gap(measured, calculated):
    return lean([(measured, 150.0, 600.0), (calculated, 150.0, 600.0)],
                measured - calculated)


def lean_na_corrected_glucose(na, glucose):
    mg_dl = glucose * 18.0156
    corrected = np.where(mg_dl <= 100.0, na, na + 1.6 * (mg_dl - 100.0) / 100.0)
    return lean([(na, 80.0, 220.0), (glucose, 0.0, 200.0)], corrected)


def lean_na_deficit(tbw, na, target):
    return lean([(tbw, 0.1, 400.0), (na, 80.0, 220.0), (target, 80.0, 220.0)],
                tbw * (target - na), domain_ok=~(target < na))


def lean_tbw_fraction(sex, age, weight):
    adult = np.where(sex == 1, np.where(age < 65.0, 0.6, 0.5),
                     np.where(age < 65.0, 0.5, 0.45))
    fraction = np.where(age < 18.0, 0.6, adult)
    return lean([(age, 1.0, 130.0), (weight, 0.3, 650.0)], fraction * weight,
                arg_ok=(sex == 1) | (sex == 2))


def lean_tbw_watson(sex, age, height, weight):
    tbw = np.where(sex == 1,
                   2.447 - 0.09516 * age + 0.1074 * height + 0.3362 * weight,
                   -2.097 + 0.1069 * height + 0.2466 * weight)
    return lean([(age, 18.0, 130.0), (height, 30.0, 275.0), (weight, 0.3, 650.0)],
                tbw, domain_ok=watson_plausible(tbw, weight), arg_ok=(sex == 1) | (sex == 2))


def lean_free_water_deficit(tbw, na):
    return lean([(tbw, 0.1, 400.0), (na, 80.0, 220.0)], tbw * (na / 140.0 - 1.0),
                domain_ok=~(na < 140.0))


def lean_infusate_checks(na, tbw, inf_na, inf_k):
    return [(na, 80.0, 220.0), (tbw, 0.1, 400.0), (inf_na, 0.0, 1100.0),
            (inf_k, 0.0, 400.0)]


def lean_infusate_change_per_litre(na, tbw, inf_na, inf_k):
    return lean(lean_infusate_checks(na, tbw, inf_na, inf_k),
                (inf_na + inf_k - na) / (tbw + 1.0),
                domain_ok=balance_ok(na, tbw, 1.0, inf_na + inf_k - na))


def lean_infusate_change(na, tbw, inf_na, inf_k, volume):
    excess = volume * (inf_na + inf_k - na)
    return lean(lean_infusate_checks(na, tbw, inf_na, inf_k) + [(volume, 0.0, 20.0)],
                excess / (tbw + volume), domain_ok=balance_ok(na, tbw, volume, excess))


def lean_infusate_volume_for_change(na, tbw, inf_na, inf_k, delta):
    headroom = inf_na + inf_k - na - delta
    volume = np.where(delta == 0.0, 0.0, delta * tbw / headroom)
    reachable = np.where(delta > 0.0, headroom > 0.0, headroom < 0.0)
    return lean(lean_infusate_checks(na, tbw, inf_na, inf_k) + [(delta, -50.0, 50.0)],
                volume, domain_ok=(delta == 0.0) | (reachable & (volume <= 20.0)))


def lean_furst_ratio(una, uk, sna):
    return lean([(una, 0.0, 500.0), (uk, 0.0, 300.0), (sna, 80.0, 220.0)],
                (una + uk) / sna)


def lean_restriction_from_ratio(ratio):
    band = np.where(ratio < 0.9, 1, np.where(ratio <= 1.0, 2, 3)).astype(np.intc)
    ok = (ratio >= 0.0) & (ratio <= 20.0)
    status = np.zeros(ratio.size, dtype=np.intc)
    bad = np.flatnonzero(~ok)
    if bad.size:
        status[bad] = check(np.zeros(bad.size, dtype=np.intc), ratio[bad], 0.0, 20.0)
        band[bad] = 0
    return band, status


def lean_efwc(volume, una, uk, sna):
    return lean([(volume, 0.0, 30.0), (una, 0.0, 500.0), (uk, 0.0, 300.0),
                 (sna, 80.0, 220.0)], volume * (1.0 - (una + uk) / sna))


# ---- invented rows (plausible, mostly valid; 1 in 1000 rows is broken) -----

def columns(rng, n, spans):
    cols = [rng.uniform(lo, hi, n) for lo, hi in spans]
    broken = rng.integers(0, 1000, n) == 0
    cols[0] = np.where(broken, np.nan, cols[0])
    return cols


def cases(rng, n):
    sex = np.where(rng.integers(0, 2, n) == 0, 1, 2).astype(np.intc)
    c = {}
    na, g, u, e = columns(rng, n, [(110, 160), (3, 40), (2, 30), (0, 20)])
    c["osm_calculated"] = (
        lambda: A.osm_calculated(na_mmol_l=na, glucose_mmol_l=g, urea_mmol_l=u,
                                 ethanol_mmol_l=e, errors="nan", with_status=True),
        lambda: np_osm_calculated(na, g, u, e),
        lambda: lean_osm_calculated(na, g, u, e))
    # The same rows without an ethanol column (the argument's default, 0):
    # a scalar for every row, on both sides.
    c["osm_calculated, no ethanol"] = (
        lambda: A.osm_calculated(na_mmol_l=na, glucose_mmol_l=g, urea_mmol_l=u,
                                 errors="nan", with_status=True),
        lambda: np_osm_calculated(na, g, u, 0.0),
        lambda: lean_osm_calculated(na, g, u, 0.0))
    na2, g2 = columns(rng, n, [(110, 160), (3, 40)])
    c["osm_effective"] = (
        lambda: A.osm_effective(na_mmol_l=na2, glucose_mmol_l=g2, errors="nan",
                                with_status=True),
        lambda: np_osm_effective(na2, g2),
        lambda: lean_osm_effective(na2, g2))
    m, k = columns(rng, n, [(270, 330), (260, 300)])
    c["osm_gap"] = (
        lambda: A.osm_gap(measured_mosm_kg=m, calculated_mosm_kg=k,
                          errors="nan", with_status=True),
        lambda: np_osm_gap(m, k),
        lambda: lean_osm_gap(m, k))
    na3, g3 = columns(rng, n, [(110, 160), (3, 60)])
    c["na_corrected_glucose"] = (
        lambda: A.na_corrected_glucose(na_mmol_l=na3, glucose_mmol_l=g3,
                                       errors="nan", with_status=True),
        lambda: np_na_corrected_glucose(na3, g3),
        lambda: lean_na_corrected_glucose(na3, g3))
    t, na4, tg = columns(rng, n, [(20, 50), (105, 125), (126, 135)])
    c["na_deficit"] = (
        lambda: A.na_deficit(tbw_l=t, na_mmol_l=na4, target_na_mmol_l=tg,
                             errors="nan", with_status=True),
        lambda: np_na_deficit(t, na4, tg),
        lambda: lean_na_deficit(t, na4, tg))
    age, w = columns(rng, n, [(1, 95), (10, 120)])
    c["tbw_fraction"] = (
        lambda: A.tbw_fraction(sex=sex, age_years=age, weight_kg=w,
                               errors="nan", with_status=True),
        lambda: np_tbw_fraction(sex, age, w),
        lambda: lean_tbw_fraction(sex, age, w))
    age2, h, w2 = columns(rng, n, [(18, 95), (150, 195), (45, 120)])
    c["tbw_watson"] = (
        lambda: A.tbw_watson(sex=sex, age_years=age2, height_cm=h, weight_kg=w2,
                             errors="nan", with_status=True),
        lambda: np_tbw_watson(sex, age2, h, w2),
        lambda: lean_tbw_watson(sex, age2, h, w2))
    t2, na5 = columns(rng, n, [(20, 50), (141, 175)])
    c["free_water_deficit"] = (
        lambda: A.free_water_deficit(tbw_l=t2, na_mmol_l=na5, errors="nan",
                                     with_status=True),
        lambda: np_free_water_deficit(t2, na5),
        lambda: lean_free_water_deficit(t2, na5))
    na6, t3, i_na, i_k = columns(rng, n, [(105, 160), (20, 50), (0, 855), (0, 40)])
    c["infusate_change_per_litre"] = (
        lambda: A.infusate_change_per_litre(na_mmol_l=na6, tbw_l=t3,
                                            infusate_na_mmol_l=i_na,
                                            infusate_k_mmol_l=i_k,
                                            errors="nan", with_status=True),
        lambda: np_infusate_change_per_litre(na6, t3, i_na, i_k),
        lambda: lean_infusate_change_per_litre(na6, t3, i_na, i_k))
    na7, t4, i_na2, i_k2, vol = columns(
        rng, n, [(105, 160), (20, 50), (0, 855), (0, 40), (0.1, 2)])
    c["infusate_change"] = (
        lambda: A.infusate_change(na_mmol_l=na7, tbw_l=t4,
                                  infusate_na_mmol_l=i_na2,
                                  infusate_k_mmol_l=i_k2, volume_l=vol,
                                  errors="nan", with_status=True),
        lambda: np_infusate_change(na7, t4, i_na2, i_k2, vol),
        lambda: lean_infusate_change(na7, t4, i_na2, i_k2, vol))
    na8, t5, i_na3, i_k3, d = columns(
        rng, n, [(105, 130), (20, 50), (300, 855), (0, 40), (1, 8)])
    c["infusate_volume_for_change"] = (
        lambda: A.infusate_volume_for_change(na_mmol_l=na8, tbw_l=t5,
                                             infusate_na_mmol_l=i_na3,
                                             infusate_k_mmol_l=i_k3,
                                             target_delta_mmol_l=d,
                                             errors="nan", with_status=True),
        lambda: np_infusate_volume_for_change(na8, t5, i_na3, i_k3, d),
        lambda: lean_infusate_volume_for_change(na8, t5, i_na3, i_k3, d))
    una, uk, sna = columns(rng, n, [(20, 150), (10, 80), (115, 145)])
    c["furst_ratio"] = (
        lambda: A.furst_ratio(urine_na_mmol_l=una, urine_k_mmol_l=uk,
                              serum_na_mmol_l=sna, errors="nan",
                              with_status=True),
        lambda: np_furst_ratio(una, uk, sna),
        lambda: lean_furst_ratio(una, uk, sna))
    (ratio,) = columns(rng, n, [(0, 2)])
    c["restriction_from_ratio"] = (
        lambda: A.restriction_from_ratio(ratio, errors="nan", with_status=True),
        lambda: np_restriction_from_ratio(ratio),
        lambda: lean_restriction_from_ratio(ratio))
    v, una2, uk2, sna2 = columns(rng, n, [(0.5, 3), (20, 150), (10, 80), (115, 145)])
    c["efwc"] = (
        lambda: A.efwc(urine_volume_l=v, urine_na_mmol_l=una2,
                       urine_k_mmol_l=uk2, serum_na_mmol_l=sna2,
                       errors="nan", with_status=True),
        lambda: np_efwc(v, una2, uk2, sna2),
        lambda: lean_efwc(v, una2, uk2, sna2))
    return c


def same(a, b):
    (va, sa), (vb, sb) = a, b
    return bool(np.array_equal(sa, sb) and
                np.array_equal(np.asarray(va), np.asarray(vb), equal_nan=True))


def bare_call(binding):
    """The binding's own C batch call(s) alone, for the overhead figure:
    the arguments the binding hands to the library are captured on one
    call, then the same call is repeated into the output arrays it has
    already written (no conversion, allocation, status check or wrapping,
    and no fresh pages)."""
    real = getattr(A, "_batch_call", None)
    if real is None:  # a binding from before it (to measure before/after)
        return None
    captured = []

    def spy(*args):
        captured.append(args)
        return real(*args)

    A._batch_call = spy
    try:
        binding()
    finally:
        A._batch_call = real
    (args,) = captured
    return lambda: real(*args)


def best_time(fn, holder):
    t0 = time.process_time()
    holder.append(fn())
    return time.process_time() - t0


def keep_heap():
    """Ask glibc to keep freed memory in the process (no trimming, blocks
    up to 32 MiB from the heap instead of fresh mmap pages), for both sides
    alike. By default glibc trims or unmaps some freed arrays and not
    others, so which calls of a run start on fresh pages depends on the
    order of allocations; on this virtual machine a fresh 4 KiB page costs
    up to tens of microseconds (the kernel zeroes it, the host backs it),
    more than the formula's work on its 512 rows, so that luck and not
    the code decided the figures (tests/bench/notes.md, "Python array
    calls"). Returns whether glibc took the settings."""
    try:
        libc = ctypes.CDLL(None)
        mallopt = libc.mallopt
    except (OSError, AttributeError):
        return False
    mallopt.argtypes = [ctypes.c_int, ctypes.c_int]
    M_TRIM_THRESHOLD, M_MMAP_THRESHOLD = -1, -3
    return bool(mallopt(M_MMAP_THRESHOLD, 32 << 20)) and \
        bool(mallopt(M_TRIM_THRESHOLD, 1 << 30))


def main():
    rows, repeats = int(sys.argv[1]), int(sys.argv[2])
    heap = "default"
    if (sys.argv[3:4] or ["kept"])[0] != "default" and keep_heap():
        heap = "kept"
    rng = np.random.default_rng(20260101)
    results = []
    with np.errstate(all="ignore"):
        for name, (binding, numpy_version, lean_version) in cases(rng, rows).items():
            bare = bare_call(binding)
            tb, tn, tl, tc = [], [], [], []
            out_b, out_n, out_l, out_c = [], [], [], []
            for _ in range(repeats):
                tb.append(best_time(binding, out_b))
                tn.append(best_time(numpy_version, out_n))
                tl.append(best_time(lean_version, out_l))
                if bare is not None:
                    tc.append(best_time(bare, out_c))
                del out_b[:-1], out_n[:-1], out_l[:-1], out_c[:]
            results.append({"function": name, "binding_s": min(tb),
                            **({"c_call_s": min(tc)} if tc else {}),
                            "numpy_s": min(tn), "ratio": min(tn) / min(tb),
                            "same_result": same(out_b[-1], out_n[-1]),
                            "lean_s": min(tl), "lean_ratio": min(tl) / min(tb),
                            "lean_same_result": same(out_b[-1], out_l[-1]),
                            "failed_rows": int(np.count_nonzero(out_b[-1][1]))})
    print(json.dumps({"rows": rows, "repeats": repeats, "heap": heap,
                      "numpy": np.__version__, "functions": results}, indent=1))


if __name__ == "__main__":
    main()
