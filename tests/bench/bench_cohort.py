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


def timed(fn, *args):
    t0 = time.process_time()
    result = fn(*args)
    return time.process_time() - t0, result


def main():
    patients = int(sys.argv[1])
    ids, minutes, hours, na = invent_cohort(patients)
    t_c, c = timed(with_natremia, ids, hours, na)
    t_p, p = timed(with_pandas, ids, minutes, na)
    basic = natremia.CorrectionFlag.OVER_24H | natremia.CorrectionFlag.OVER_48H | \
        natremia.CorrectionFlag.BELOW_TARGET | natremia.CorrectionFlag.FALLING
    agree = bool(
        np.allclose(c["max_rise_24h"], p["max_rise_24h"].to_numpy(), rtol=0, atol=1e-9) and
        np.allclose(c["max_rise_48h"], p["max_rise_48h"].to_numpy(), rtol=0, atol=1e-9) and
        np.allclose(c["rise_first_24h"], p["rise_first_24h"].to_numpy(), rtol=0, atol=1e-9) and
        np.allclose(c["last_rate_per_h"], p["last_rate_per_h"].to_numpy(), rtol=0, atol=1e-9) and
        np.array_equal(c["flags"] & int(basic), p["flags"].to_numpy()))
    print(json.dumps({
        "patients": patients, "results": int(na.size),
        "natremia_s": t_c, "pandas_s": t_p, "ratio": t_p / t_c,
        "same_result": agree,
        "flagged_over_24h": int(np.count_nonzero(c["flags"] & 1)),
        "pandas": pd.__version__}, indent=1))


if __name__ == "__main__":
    main()
