#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""Correction assessment of a whole cohort: natremia vs pandas.

An invented cohort (no real patient): PATIENTS series of 8 to 16 sodium
results each (about 12 on average), taken 1 to 8 hours apart (whole
minutes), starting between 108 and 130 mmol/L and drifting up at a rate of
its own with measurement noise, so some series correct too fast.

natremia: one call of natremia.arrays.correction_assess_groups (the C entry
point ntr_batch_correction_assess over all series), offsets included.

pandas: what a data team would write without natremia: a groupby over the
patient id with time-based rolling windows ('24h' and '48h', both ends
closed) for the window minima, the largest rise in 24 h and 48 h per
patient, the rise over the first 24 h, the last interval's rate, the
validation of every value (finite, in range) and of the time order, and
the four basic flags (over 24 h, over 48 h, below target, falling). It
does less than natremia (no near-limit, projected or 6-hour flags).
Both results are compared: the rises and the four flags must agree.

Two skilled baselines do the same work faster (issue 16), and the run
reports natremia against them too:
- numpy: the rows sorted by patient and time, one int64 key per row
  (patient * 2**32 + minutes), the start of every row's 24 h and 48 h
  window by np.searchsorted(key, key - window) (the key gap keeps windows
  inside a patient), the window minimum by a sparse table (range minimum
  in two lookups; one table for both windows, its levels gathered level by
  level instead of stacked into one array: about half the time of a table
  per window stacked, the earlier version of this baseline), and
  per-patient maxima by np.maximum.reduceat;
- flat pandas: one rolling window (24 h, 48 h) over the whole frame on a
  time column that puts a gap of over 48 h between patients (one minute
  counted as one nanosecond so a million patients fit), so one flat
  rolling never crosses a patient and no groupby().rolling is needed.
Both must give the same rises, rate and four flags as natremia.

Timing: process CPU time of one run of each (pandas runs for a while, so
one run suffices). Usage: bench_cohort.py PATIENTS -> JSON on stdout.
"""
import json
import sys
import time

import numpy as np
import pandas as pd

import natremia
import natremia.arrays as A

LIMIT_24H, LIMIT_48H, MIN_24H = 10.0, 18.0, 4.0  # NTR_LIMITS_STANDARD
TOL = 1e-6  # NTR_CF_TOLERANCE and NTR_CF_TIME_TOLERANCE_H


def invent_cohort(patients, seed=20260102):
    rng = np.random.default_rng(seed)
    counts = rng.integers(8, 17, patients)
    n = int(counts.sum())
    ids = np.repeat(np.arange(patients, dtype=np.int64), counts)
    starts = np.concatenate(([0], np.cumsum(counts)[:-1]))
    step_min = rng.integers(60, 481, n)
    step_min[starts] = 0
    minutes = np.cumsum(step_min)
    minutes -= np.repeat(minutes[starts], counts)
    hours = minutes / 60.0
    baseline = np.repeat(rng.uniform(108.0, 130.0, patients), counts)
    rate = np.repeat(rng.uniform(0.05, 0.45, patients), counts)
    na = np.round(baseline + rate * hours + rng.normal(0.0, 0.8, n), 1)
    na = np.clip(na, 80.0, 220.0)
    return ids, minutes, hours, na


def with_natremia(ids, hours, na):
    offsets, _ = A.offsets_from_ids(ids)
    return A.correction_assess_groups(hours=hours, na_mmol_l=na, offsets=offsets,
                                      errors="nan")


def with_pandas(ids, minutes, na):
    df = pd.DataFrame({"id": ids,
                       "time": pd.to_datetime(minutes * 60_000_000_000),
                       "na": na})
    # Validation: every value finite and in range, times in order per patient.
    value_ok = np.isfinite(df["na"]) & df["na"].between(80.0, 220.0)
    g = df.groupby("id", sort=False)
    order_ok = g["time"].diff().fillna(pd.Timedelta(0)) >= pd.Timedelta(0)
    bad = (~(value_ok & order_ok)).groupby(df["id"]).any()
    # Largest rise within 24 h and 48 h: sodium minus the window minimum.
    rises = {}
    for hours in (24, 48):
        window_min = g.rolling("%dh" % hours, on="time", closed="both")["na"].min()
        rise = df["na"].to_numpy() - window_min.to_numpy()
        rises[hours] = pd.Series(rise).groupby(df["id"].to_numpy()).max().clip(lower=0.0)
    # Rise over the first 24 h.
    first_time = g["time"].transform("first")
    first_na = g["na"].transform("first")
    early = df["time"] - first_time <= pd.Timedelta(hours=24)
    rise_first = (df["na"] - first_na).where(early, 0.0).groupby(df["id"]).max()
    elapsed = (g["time"].last() - g["time"].first()) / pd.Timedelta(hours=1)
    # The last interval.
    prev = g[["time", "na"]].shift(1)
    last = df.assign(prev_time=prev["time"], prev_na=prev["na"]).groupby(
        "id", sort=False).tail(1).set_index("id")
    dt = (last["time"] - last["prev_time"]) / pd.Timedelta(hours=1)
    rate = ((last["na"] - last["prev_na"]) / dt).fillna(0.0)
    out = pd.DataFrame({"rise_first_24h": rise_first,
                        "max_rise_24h": rises[24], "max_rise_48h": rises[48],
                        "last_rate_per_h": rate})
    flags = ((out["max_rise_24h"] > LIMIT_24H + TOL) * 1 +
             (out["max_rise_48h"] > LIMIT_48H + TOL) * 2 +
             ((elapsed >= 24.0 - TOL) & (out["rise_first_24h"] < MIN_24H - TOL)) * 4 +
             (out["last_rate_per_h"] < 0.0) * 8)
    out["flags"] = flags.astype(np.uint32)
    out[bad] = np.nan
    return out


GAP_MIN = 1 << 32  # minutes between two patients on the flat key (far over 48 h)


def flags_of(max24, max48, rise_first, elapsed, rate):
    return ((max24 > LIMIT_24H + TOL) * 1 + (max48 > LIMIT_48H + TOL) * 2 +
            ((elapsed >= 24.0 - TOL) & (rise_first < MIN_24H - TOL)) * 4 +
            (rate < 0.0) * 8).astype(np.uint32)


def finish(ids, minutes, na, starts, window_min, out_cls=dict):
    """Per-patient results from the window minima, shared by the numpy and
    the flat pandas versions (plain numpy reductions over patient runs)."""
    counts = np.diff(np.append(starts, na.size))
    last = starts + counts - 1
    value_ok = np.isfinite(na) & (na >= 80.0) & (na <= 220.0)
    step = np.diff(minutes, prepend=minutes[0])
    step[starts] = 0
    bad = np.minimum.reduceat((value_ok & (step >= 0)).astype(np.int8), starts) == 0
    rises = {h: np.maximum(np.maximum.reduceat(na - window_min[h], starts), 0.0)
             for h in (24, 48)}
    first_na = np.repeat(na[starts], counts)
    first_min = np.repeat(minutes[starts], counts)
    early = minutes - first_min <= 24 * 60
    rise_first = np.maximum.reduceat(np.where(early, na - first_na, 0.0), starts)
    elapsed = (minutes[last] - minutes[starts]) / 60.0
    dt = (minutes[last] - minutes[last - 1]) / 60.0
    rate = (na[last] - na[last - 1]) / dt
    rate = np.where(np.isnan(rate), 0.0, rate)
    out = {"rise_first_24h": rise_first, "max_rise_24h": rises[24],
           "max_rise_48h": rises[48], "last_rate_per_h": rate}
    flags = flags_of(rises[24], rises[48], rise_first, elapsed, rate)
    for k in out:
        out[k] = np.where(bad, np.nan, out[k])
    out["flags"] = np.where(bad, 0, flags).astype(np.uint32)
    return out


def window_mins(values, key, windows_min):
    """For every row i and each window w (minutes), min(values[lo:i + 1])
    with lo = np.searchsorted(key, key - w): one sparse table of minima over
    runs of 2**k (built once, shared by the windows, levels kept apart
    rather than stacked into one copy), and per window two lookups per row,
    the rows gathered level by level."""
    n = values.size
    rows = np.arange(n)
    los = [np.searchsorted(key, key - w, side="left") for w in windows_min]
    longest = int(max((rows - lo).max() for lo in los)) + 1
    levels = [values]
    span = 1
    while 2 * span <= longest:
        prev = levels[-1]
        nxt = prev.copy()
        np.minimum(prev[:-span], prev[span:], out=nxt[:-span])
        levels.append(nxt)
        span *= 2
    mins = []
    for lo in los:
        level = np.frexp(rows - lo + 1)[1] - 1  # floor(log2(length)), exact
        res = np.empty(n)
        for k, table in enumerate(levels):
            idx = np.flatnonzero(level == k)
            res[idx] = np.minimum(table[lo[idx]], table[idx - (1 << k) + 1])
        mins.append(res)
    return mins


def with_numpy(ids, minutes, na):
    starts = np.flatnonzero(np.diff(ids, prepend=ids[0] - 1))
    key = ids * GAP_MIN + minutes
    m24, m48 = window_mins(na, key, (24 * 60, 48 * 60))
    return finish(ids, minutes, na, starts, {24: m24, 48: m48})


def with_pandas_flat(ids, minutes, na):
    starts = np.flatnonzero(np.diff(ids, prepend=ids[0] - 1))
    # One minute is one nanosecond on this clock, so a million patients,
    # 2**14 minutes apart (over a series' span plus 48 h), fit in int64.
    df = pd.DataFrame({"time": pd.to_datetime(ids * (1 << 14) + minutes, unit="ns"),
                       "na": na})
    window_min = {h: df.rolling("%dns" % (h * 60), on="time",
                                closed="both")["na"].min().to_numpy()
                  for h in (24, 48)}
    return finish(ids, minutes, na, starts, window_min)


def agree_with(c, other):
    basic = natremia.CorrectionFlag.OVER_24H | natremia.CorrectionFlag.OVER_48H | \
        natremia.CorrectionFlag.BELOW_TARGET | natremia.CorrectionFlag.FALLING
    col = (lambda k: np.asarray(other[k].to_numpy() if hasattr(other[k], "to_numpy")
                                else other[k]))
    return bool(all(np.allclose(c[k], col(k), rtol=0, atol=1e-9, equal_nan=True)
                    for k in ("max_rise_24h", "max_rise_48h", "rise_first_24h",
                              "last_rate_per_h")) and
                np.array_equal(c["flags"] & int(basic), col("flags")))


def timed(fn, *args):
    t0 = time.process_time()
    result = fn(*args)
    return time.process_time() - t0, result


def main():
    patients = int(sys.argv[1])
    ids, minutes, hours, na = invent_cohort(patients)
    t_c, c = timed(with_natremia, ids, hours, na)
    # The fast ones take turns with natremia, fastest of 3 each.
    t_n, t_f, t_c2 = [], [], [t_c]
    for _ in range(3):
        t, n = timed(with_numpy, ids, minutes, na)
        t_n.append(t)
        t, f = timed(with_pandas_flat, ids, minutes, na)
        t_f.append(t)
        t, c = timed(with_natremia, ids, hours, na)
        t_c2.append(t)
    t_c = min(t_c2)
    t_p, p = timed(with_pandas, ids, minutes, na)
    print(json.dumps({
        "patients": patients, "results": int(na.size),
        "natremia_s": t_c, "pandas_s": t_p, "ratio": t_p / t_c,
        "same_result": agree_with(c, p),
        "numpy_s": min(t_n), "numpy_ratio": min(t_n) / t_c,
        "numpy_same_result": agree_with(c, n),
        "flat_pandas_s": min(t_f), "flat_pandas_ratio": min(t_f) / t_c,
        "flat_pandas_same_result": agree_with(c, f),
        "flagged_over_24h": int(np.count_nonzero(c["flags"] & 1)),
        "pandas": pd.__version__}, indent=1))


if __name__ == "__main__":
    main()
