#!/usr/bin/env python3
"""Correction-rate screening of a whole cohort on Dask (invented data).

Every patient here is invented: the cohort is generated from a seeded
random number generator, partition by partition, on the workers
themselves. Low sodiums are being raised and high sodiums lowered, and
both directions are screened: each patient is assessed against the course
preset its goal calls for (hypo_standard when the first sodium is below
140 mmol/L, hyper_chronic otherwise) or against one
preset for the whole cohort (--preset). Each partition is assessed with
one call of the C batch entry point ntr_batch_course_assess per preset
present (through natremia.arrays), never a Python loop per patient.

    python3 examples/cohort_dask.py                       # 1,000,000 patients, LocalCluster
    python3 examples/cohort_dask.py --patients 20000 --check-serial
    python3 examples/cohort_dask.py --preset hypo_high_risk
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

# The flags reported in the summary, in bit order, by readable name.
FLAGS = [(int(flag), natremia.FLAG_LABELS[flag]) for flag in natremia.CourseFlag
         if flag is not natremia.CourseFlag.NONE]
PER_PATIENT = "per_patient"
# Goal by the first sodium: below this (mmol/L) it is raised, else lowered.
# The invented patients start at 105 to 130 or at 150 to 175.
RAISE_BELOW = 140.0


def partition_sizes(patients, partitions):
    """Patients per partition: as equal as possible, summing to patients."""
    base, extra = divmod(patients, partitions)
    return [base + (1 if i < extra else 0) for i in range(partitions)]


def make_partition(index, n_patients, seed):
    """An invented partition: for each patient 2 to 8 sodium results over
    up to about four days. Three patients in four start low (105 to 130
    mmol/L) and mostly rise, one in four starts high (150 to 175) and
    mostly falls; about one patient in eight corrects fast, and a very few
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
    high = rng.random(n_patients) < 0.25
    baseline = np.where(high, rng.uniform(150.0, 175.0, n_patients),
                        rng.uniform(105.0, 130.0, n_patients))
    rate = np.where(high, -rate, rate)  # high sodiums are being lowered
    na = np.clip(baseline[patient] + rate[patient] * hours + noise, 95.0, 185.0)
    # About one result in 500,000 is a data-entry slip (decimal point lost):
    # those patients come back "not assessable" with their own status.
    slip = rng.random(total) < 2e-6
    na[slip] *= 10.0
    return counts, hours, np.round(na, 1)


def row_presets(counts, na, preset):
    """The preset of every row (a numpy array of names): one for all, or
    (per_patient) the preset of the goal the patient's first sodium calls
    for, repeated over the patient's rows."""
    if preset != PER_PATIENT:
        return np.full(na.size, preset)
    starts = np.concatenate(([0], np.cumsum(counts)[:-1])).astype(np.intp)
    goal = np.where(na[starts] < RAISE_BELOW, "hypo_standard", "hyper_chronic")
    return np.repeat(goal, counts)


def partition_rows(index, n_patients, seed, preset):
    """One invented partition as long rows: (ids, hours, na, preset per
    row), ids numbering the patients across the whole cohort."""
    counts, hours, na = make_partition(index, n_patients, seed)
    first_id = index * 10_000_000  # room for ten million patients a partition
    ids = np.repeat(first_id + np.arange(counts.size), counts)
    return ids, hours, na, row_presets(counts, na, preset)


# The report fields gathered per patient.
FIELDS = ("max_rise_24h", "max_fall_24h", "excess_mmol_l")


def assess_partition(index, n_patients, seed, preset):
    """Generate and assess one partition: one C batch call per distinct
    preset. Returns per-patient ids, flags, largest rise and fall within
    24 h, excess over a limit and status."""
    ids, hours, na, per_row = partition_rows(index, n_patients, seed, preset)
    table = arrays.course_assess_table(ids=ids, hours=hours, na_mmol_l=na,
                                       limits=per_row, errors="nan")
    part = {"index": index, "samples": int(hours.size),
            "id": table["id"].copy(), "flags": table["flags"].copy(),
            "status": table["status"].copy()}
    for field in FIELDS:
        part[field] = table[field].copy()
    return part


def combine(parts):
    """Partition results (any order) into cohort-wide arrays, by index."""
    parts = sorted(parts, key=lambda p: p["index"])
    result = {"samples": sum(p["samples"] for p in parts)}
    for key in ("id", "flags", "status") + FIELDS:
        result[key] = np.concatenate([p[key] for p in parts])
    return result


def run_serial(patients, partitions, seed, preset):
    """The same computation in this process, partition after partition."""
    sizes = partition_sizes(patients, partitions)
    return combine([assess_partition(i, n, seed, preset)
                    for i, n in enumerate(sizes)])


def run_dask(client, patients, partitions, seed, preset):
    """One Dask task per partition; the workers generate and assess."""
    sizes = partition_sizes(patients, partitions)
    futures = client.map(assess_partition, range(partitions), sizes,
                         [seed] * partitions, [preset] * partitions,
                         pure=False)
    return combine(client.gather(futures))


def same_result(a, b):
    """Bit-for-bit equality of two combined results (NaN equal to NaN)."""
    return (a["samples"] == b["samples"]
            and all(np.array_equal(a[k], b[k]) for k in ("id", "flags", "status"))
            and all(np.array_equal(a[k].view(np.uint64), b[k].view(np.uint64))
                    for k in FIELDS))


def summary_lines(result, preset, seconds=None):
    flags = result["flags"]
    patients = flags.size
    limits = ("by each patient's goal (hypo_standard when the first sodium "
              "is below %g mmol/L, else hyper_chronic)" % RAISE_BELOW
              if preset == PER_PATIENT else preset)
    lines = [
        "Invented cohort (synthetic data, no real patients): %d patients, "
        "%d sodium results; limits %s." % (patients, result["samples"], limits),
    ]
    if seconds is not None:
        lines.append("Assessed in %.2f s." % seconds)
    lines.append("%-20s %10s %8s" % ("flag", "patients", "share"))
    for bit, name in FLAGS:
        count = int(np.count_nonzero(flags & bit))
        lines.append("%-20s %10d %7.2f%%" % (name, count,
                                             100.0 * count / max(patients, 1)))
    failed = int(np.count_nonzero(result["status"]))
    lines.append("%-20s %10d" % ("not assessable", failed))
    over = result["excess_mmol_l"][result["excess_mmol_l"] > 0]
    if over.size:
        lines.append("Excess over a limit (rise or fall): median %.1f, "
                     "largest %.1f mmol/L." % (float(np.median(over)),
                                               float(over.max())))
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
    parser = argparse.ArgumentParser(description=__doc__.split("\n\n")[0],
                                     epilog="Caution: " + natremia.CAUTION)
    parser.add_argument("--patients", type=int, default=1_000_000)
    parser.add_argument("--partitions", type=int, default=32)
    parser.add_argument("--workers", type=int, default=2,
                        help="LocalCluster worker processes (default 2)")
    parser.add_argument("--threads", type=int, default=1,
                        help="threads per worker (default 1)")
    parser.add_argument("--seed", type=int, default=20240607)
    parser.add_argument("--preset", default=PER_PATIENT,
                        choices=[PER_PATIENT] + sorted(
                            natremia.course_preset_names()),
                        help="one course preset for the whole cohort, or "
                        "per_patient (default): each patient's goal by its "
                        "first sodium")
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
                          args.preset)
        seconds = time.perf_counter() - start
    finally:
        client.close()
        if cluster is not None:
            cluster.close()
    print("\n".join(summary_lines(result, args.preset, seconds)))

    if args.check_serial:
        serial = run_serial(args.patients, args.partitions, args.seed,
                            args.preset)
        if not same_result(result, serial):
            print("MISMATCH: the Dask result differs from the serial one")
            return 1
        print("Dask result equals the serial computation.")
    return 0


if __name__ == "__main__":
    sys.exit(main())
