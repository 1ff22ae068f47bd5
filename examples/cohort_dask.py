#!/usr/bin/env python3
"""Correction-rate screening of a whole cohort on Dask (invented data).

Every patient here is invented: the cohort is generated from a seeded
random number generator, partition by partition, on the workers
themselves. Each partition is assessed with ONE call of the C batch entry
point ntr_batch_correction_assess (through natremia.arrays), never a
Python loop per patient.

    python3 examples/cohort_dask.py                       # 1,000,000 patients, LocalCluster
    python3 examples/cohort_dask.py --patients 20000 --check-serial
    python3 examples/cohort_dask.py --scheduler tcp://10.0.0.5:8786   # an existing cluster

Needs the natremia Python package (bindings/python, or PYTHONPATH pointing
at it), the C library (NATREMIA_LIBRARY, pkg-config or the loader path),
and Debian's python3-numpy, python3-dask and python3-distributed.
docs/bindings.md explains the multi-machine set-up.

Every result is an estimate for decision support, not an order. Verify
with measured values; follow local protocols and licensed clinical
judgement.
"""

import argparse
import logging
import sys
import time

import numpy as np

import natremia
from natremia import arrays

# The flags reported in the summary, in bit order.
FLAG_NAMES = [flag.name.lower() for flag in natremia.CorrectionFlag
              if flag is not natremia.CorrectionFlag.NONE]


def partition_sizes(patients, partitions):
    """Patients per partition: as equal as possible, summing to patients."""
    base, extra = divmod(patients, partitions)
    return [base + (1 if i < extra else 0) for i in range(partitions)]


def make_partition(index, n_patients, seed):
    """An invented partition: for each patient 2 to 8 sodium results over
    up to about four days, starting low (105 to 130 mmol/L) and mostly
    rising; about one patient in eight corrects fast, and a very few
    results carry a data-entry slip (ten times the value). Deterministic in
    (seed, index), so any machine regenerates the same partition.

    Returns (counts, hours, na_mmol_l): samples per patient and the
    samples back to back, each patient's in time order."""
    rng = np.random.default_rng([seed, index])
    counts = rng.integers(2, 9, size=n_patients)
    total = int(counts.sum())
    starts = np.concatenate(([0], np.cumsum(counts)[:-1]))
    patient = np.repeat(np.arange(n_patients), counts)
    first = np.zeros(total, dtype=bool)
    first[starts] = True

    gaps = rng.uniform(2.0, 14.0, size=total)
    gaps[first] = 0.0
    hours = np.cumsum(gaps)
    hours -= np.repeat(hours[starts], counts)  # each patient starts at 0 h

    fast = rng.random(n_patients) < 0.125
    rate = np.where(fast, rng.uniform(0.5, 1.2, n_patients),
                    rng.uniform(-0.05, 0.35, n_patients))  # mmol/L per hour
    noise = rng.normal(0.0, 1.0, size=total)
    noise[first] = 0.0
    baseline = rng.uniform(105.0, 130.0, size=n_patients)
    na = np.minimum(baseline[patient] + rate[patient] * hours + noise, 170.0)
    # About one result in 500,000 is a data-entry slip (decimal point lost):
    # those patients come back "not assessable" with their own status.
    slip = rng.random(total) < 2e-6
    na[slip] *= 10.0
    return counts, hours, np.round(na, 1)


def assess_partition(index, n_patients, seed, limits):
    """Generate and assess one partition: one C batch call for all of its
    patients. Returns the per-patient flags, largest 24 h rise and excess."""
    counts, hours, na = make_partition(index, n_patients, seed)
    offsets = np.concatenate(([0], np.cumsum(counts))).astype(np.uintp)
    out, status = arrays.correction_assess_groups(
        hours=hours, na_mmol_l=na, offsets=offsets, limits=limits,
        errors="nan", with_status=True)
    return {
        "index": index,
        "samples": int(counts.sum()),
        "flags": out["flags"].copy(),
        "max_rise_24h": out["max_rise_24h"].copy(),
        "excess_mmol_l": out["excess_mmol_l"].copy(),
        "status": status,
    }


def combine(parts):
    """Partition results (any order) into cohort-wide arrays, by index."""
    parts = sorted(parts, key=lambda p: p["index"])
    return {
        "samples": sum(p["samples"] for p in parts),
        "flags": np.concatenate([p["flags"] for p in parts]),
        "max_rise_24h": np.concatenate([p["max_rise_24h"] for p in parts]),
        "excess_mmol_l": np.concatenate([p["excess_mmol_l"] for p in parts]),
        "status": np.concatenate([p["status"] for p in parts]),
    }


def run_serial(patients, partitions, seed, limits):
    """The same computation in this process, partition after partition."""
    sizes = partition_sizes(patients, partitions)
    return combine([assess_partition(i, n, seed, limits)
                    for i, n in enumerate(sizes)])


def run_dask(client, patients, partitions, seed, limits):
    """One Dask task per partition; the workers generate and assess."""
    sizes = partition_sizes(patients, partitions)
    futures = client.map(assess_partition, range(partitions), sizes,
                         [seed] * partitions, [limits] * partitions,
                         pure=False)
    return combine(client.gather(futures))


def same_result(a, b):
    """Bit-for-bit equality of two combined results (NaN equal to NaN)."""
    return (a["samples"] == b["samples"]
            and np.array_equal(a["flags"], b["flags"])
            and np.array_equal(a["status"], b["status"])
            and np.array_equal(a["max_rise_24h"].view(np.uint64),
                               b["max_rise_24h"].view(np.uint64))
            and np.array_equal(a["excess_mmol_l"].view(np.uint64),
                               b["excess_mmol_l"].view(np.uint64)))


def summary_lines(result, limits, seconds=None):
    flags = result["flags"]
    patients = flags.size
    lines = [
        "Invented cohort (synthetic data, no real patients): %d patients, "
        "%d sodium results; limits %s." % (patients, result["samples"], limits),
    ]
    if seconds is not None:
        lines.append("Assessed in %.2f s." % seconds)
    lines.append("%-16s %10s %8s" % ("flag", "patients", "share"))
    for bit, name in enumerate(FLAG_NAMES):
        count = int(np.count_nonzero(flags & (1 << bit)))
        lines.append("%-16s %10d %7.2f%%" % (name, count,
                                             100.0 * count / max(patients, 1)))
    failed = int(np.count_nonzero(result["status"]))
    lines.append("%-16s %10d" % ("not assessable", failed))
    over = result["excess_mmol_l"][result["excess_mmol_l"] > 0]
    if over.size:
        lines.append("Excess over a limit: median %.1f, largest %.1f mmol/L."
                     % (float(np.median(over)), float(over.max())))
    lines.append("Caution: " + natremia.CAUTION)
    return lines


def local_cluster(workers, threads):
    """Worker processes on loopback only; no dashboard (it would need
    bokeh, and nothing here serves a web page)."""
    from dask.distributed import Client, LocalCluster
    cluster = LocalCluster(n_workers=workers, threads_per_worker=threads,
                           processes=True, host="127.0.0.1",
                           dashboard_address=None,
                           silence_logs=logging.ERROR)
    return cluster, Client(cluster)


def main(argv=None):
    parser = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    parser.add_argument("--patients", type=int, default=1_000_000)
    parser.add_argument("--partitions", type=int, default=32)
    parser.add_argument("--workers", type=int, default=2,
                        help="LocalCluster worker processes (default 2)")
    parser.add_argument("--threads", type=int, default=1,
                        help="threads per worker (default 1)")
    parser.add_argument("--seed", type=int, default=20240607)
    parser.add_argument("--limits", default="standard",
                        choices=["standard", "high_risk"])
    parser.add_argument("--scheduler", metavar="ADDRESS",
                        help="use a running Dask scheduler (tcp://host:8786) "
                        "instead of a LocalCluster")
    parser.add_argument("--check-serial", action="store_true",
                        help="also compute serially and require equality")
    args = parser.parse_args(argv)
    if args.patients < 1 or args.partitions < 1:
        parser.error("--patients and --partitions must be positive")
    args.partitions = min(args.partitions, args.patients)

    from dask.distributed import Client
    cluster = None
    if args.scheduler:
        client = Client(args.scheduler)
    else:
        cluster, client = local_cluster(args.workers, args.threads)
    try:
        start = time.perf_counter()
        result = run_dask(client, args.patients, args.partitions, args.seed,
                          args.limits)
        seconds = time.perf_counter() - start
    finally:
        client.close()
        if cluster is not None:
            cluster.close()
    print("\n".join(summary_lines(result, args.limits, seconds)))

    if args.check_serial:
        serial = run_serial(args.patients, args.partitions, args.seed,
                            args.limits)
        if not same_result(result, serial):
            print("MISMATCH: the Dask result differs from the serial one")
            return 1
        print("Dask result equals the serial computation.")
    return 0


if __name__ == "__main__":
    sys.exit(main())
