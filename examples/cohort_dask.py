#!/usr/bin/env python3
# SPDX-License-Identifier: MIT
"""Correction-rate screening of a whole cohort on Dask (invented data).

Every patient here is invented: the cohort is generated from a seeded
random number generator, partition by partition, on the workers
themselves. It is a dask.dataframe of long rows (patient id, hours,
sodium, preset) partitioned by patient: every partition holds whole
patients, a range of ids (known divisions), so ``map_partitions`` can
assess each partition on its own and the result, one row per patient, is
indexed by patient id. Low sodiums are being raised and high sodiums
lowered, and both directions are screened: each patient is assessed
against the course preset its goal calls for (hypo_standard when the first
sodium is below 140 mmol/L, hyper_chronic otherwise) or against one preset
for the whole cohort (--preset). Each partition is assessed with one call
of the C batch entry point ntr_batch_course_assess per preset present
(through natremia.arrays), never a Python loop per patient.

The LocalCluster workers start without the MALLOC_TRIM_THRESHOLD_ that
Dask's nanny otherwise sets (see local_cluster; --dask-malloc-trim keeps
it, for comparison). With real data, read a partition per file of whole
patients (dd.read_parquet) or set_index("patient_id") first, then apply
the same map_partitions(assess_frame).

    python3 examples/cohort_dask.py                       # 1,000,000 patients, LocalCluster
    python3 examples/cohort_dask.py --patients 20000 --check-serial
    python3 examples/cohort_dask.py --preset hypo_high_risk
    python3 examples/cohort_dask.py --scheduler tcp://10.0.0.5:8786   # an existing cluster

Needs the natremia Python package (bindings/python, or PYTHONPATH pointing
at it), the C library (NATREMIA_LIBRARY, pkg-config or the loader path),
and Debian's python3-numpy, python3-pandas, python3-dask and
python3-distributed.
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
# Room for ten million patients a partition: partition i holds the ids
# i * ID_STRIDE onwards, so the partitions are ranges of patient ids.
ID_STRIDE = 10_000_000


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


def row_preset_codes(counts, na, preset):
    """(preset names, code of every row into them): one preset for all,
    or (per_patient) the preset of the goal the patient's first sodium
    calls for, repeated over the patient's rows."""
    if preset != PER_PATIENT:
        return [preset], np.zeros(na.size, dtype=np.int8)
    starts = np.concatenate(([0], np.cumsum(counts)[:-1])).astype(np.intp)
    goal = np.where(na[starts] < RAISE_BELOW, 0, 1).astype(np.int8)
    return ["hypo_standard", "hyper_chronic"], np.repeat(goal, counts)


def partition_columns(index, n_patients, seed, preset):
    """One invented partition as long rows: (ids, hours, na, preset names,
    preset code per row), ids numbering the patients across the cohort
    (partition index * ID_STRIDE onwards)."""
    counts, hours, na = make_partition(index, n_patients, seed)
    ids = np.repeat(index * ID_STRIDE + np.arange(counts.size), counts)
    names, codes = row_preset_codes(counts, na, preset)
    return ids, hours, na, names, codes


def partition_rows(index, n_patients, seed, preset):
    """The same rows with the preset name of each row (numpy strings)."""
    ids, hours, na, names, codes = partition_columns(index, n_patients, seed,
                                                     preset)
    return ids, hours, na, np.asarray(names)[codes]


# The report fields kept per patient, beside the flags and the status.
FIELDS = ("max_rise_24h", "max_fall_24h", "excess_mmol_l")
# Columns of the per-patient result and their dtypes (Dask's "meta").
RESULT_COLUMNS = ([("samples", "int64"), ("flags", "uint32"),
                   ("status", "int32")] + [(f, "float64") for f in FIELDS])


def partition_frame(index, n_patients, seed, preset):
    """One invented partition as a pandas DataFrame of long rows, indexed
    by patient id (every patient's rows in this partition, in time
    order): hours, na_mmol_l and the preset (categorical) of each row."""
    import pandas as pd
    ids, hours, na, names, codes = partition_columns(index, n_patients, seed,
                                                     preset)
    return pd.DataFrame({"hours": hours, "na_mmol_l": na,
                         "preset": pd.Categorical.from_codes(codes, names)},
                        index=pd.Index(ids, name="patient_id"))


def result_meta():
    """An empty per-patient result: the columns and dtypes map_partitions
    returns, indexed by patient id."""
    import pandas as pd
    return pd.DataFrame({name: np.empty(0, dtype=dtype)
                         for name, dtype in RESULT_COLUMNS},
                        index=pd.Index(np.empty(0, dtype=np.int64),
                                       name="patient_id"))


def assess_frame(frame):
    """Assess every patient of one partition (a pandas DataFrame of long
    rows indexed by patient id, as partition_frame makes; "preset" a
    categorical or string column, the same within a patient): one C batch
    call (ntr_batch_course_assess) per preset present, no Python loop per
    patient. Returns one row per patient, indexed by patient id in
    increasing order, with the number of results, the flags, the status
    (0: assessed) and FIELDS."""
    import pandas as pd
    if len(frame) == 0:
        return result_meta()
    preset = pd.Categorical(frame["preset"])
    codes = preset.codes
    ids = frame.index.to_numpy()
    hours = frame["hours"].to_numpy()
    na = frame["na_mmol_l"].to_numpy()
    parts = []
    for code, name in enumerate(preset.categories):
        rows = codes == code
        if not rows.any():
            continue
        table = arrays.course_assess_table(ids=ids[rows], hours=hours[rows],
                                           na_mmol_l=na[rows],
                                           limits=str(name), errors="nan")
        _, first = np.unique(ids[rows], return_counts=True)
        parts.append((table, first))
    table = np.concatenate([t for t, _ in parts])
    samples = np.concatenate([n for _, n in parts])
    order = np.argsort(table["id"], kind="stable")
    table, samples = table[order], samples[order]
    if table.size > 1 and np.any(table["id"][1:] == table["id"][:-1]):
        dup = table["id"][1:][table["id"][1:] == table["id"][:-1]][0]
        raise ValueError("patient %r has rows with different presets" % dup)
    columns = {"samples": samples.astype(np.int64),
               "flags": table["flags"].astype(np.uint32),
               "status": table["status"].astype(np.int32)}
    for field in FIELDS:
        columns[field] = table[field]
    return pd.DataFrame(columns, index=pd.Index(table["id"].astype(np.int64),
                                                name="patient_id"))


def cohort(patients, partitions, seed, preset):
    """The invented cohort as a dask.dataframe partitioned by patient:
    partition i is generated on a worker by partition_frame(i, ...) and
    holds whole patients, ids from i * ID_STRIDE (known divisions)."""
    import dask.dataframe as dd
    sizes = partition_sizes(patients, partitions)
    divisions = [i * ID_STRIDE for i in range(partitions)]
    divisions.append(divisions[-1] + sizes[-1] - 1)
    meta = partition_frame(0, 1, seed, preset).iloc[:0]
    return dd.from_map(partition_frame, range(partitions), sizes,
                       args=(seed, preset), meta=meta, divisions=divisions,
                       label="invented-cohort", enforce_metadata=False)


def run_dask(patients, partitions, seed, preset):
    """The per-patient result (pandas, indexed by patient id) computed by
    map_partitions on the current Dask scheduler (the Client in use)."""
    frame = cohort(patients, partitions, seed, preset)
    return frame.map_partitions(assess_frame, meta=result_meta(),
                                align_dataframes=False).compute()


def run_serial(patients, partitions, seed, preset):
    """The same computation with pandas alone, partition after partition."""
    import pandas as pd
    sizes = partition_sizes(patients, partitions)
    return pd.concat([assess_frame(partition_frame(i, n, seed, preset))
                      for i, n in enumerate(sizes)])


def same_result(a, b):
    """Equality of two per-patient results, bit for bit: the same patient
    ids in the same order, the same integers, the same float bits (NaN
    equal to NaN)."""
    if not a.index.equals(b.index) or list(a.columns) != list(b.columns):
        return False
    for name, dtype in RESULT_COLUMNS:
        x, y = a[name].to_numpy(), b[name].to_numpy()
        if x.dtype != np.dtype(dtype) or y.dtype != np.dtype(dtype):
            return False
        if dtype == "float64":
            x, y = x.view(np.uint64), y.view(np.uint64)
        if not np.array_equal(x, y):
            return False
    return True


def summary_lines(result, preset, seconds=None):
    flags = result["flags"].to_numpy()
    patients = flags.size
    limits = ("by each patient's goal (hypo_standard when the first sodium "
              "is below %g mmol/L, else hyper_chronic)" % RAISE_BELOW
              if preset == PER_PATIENT else preset)
    lines = [
        "Invented cohort (synthetic data, no real patients): %d patients, "
        "%d sodium results; limits %s." % (patients,
                                           int(result["samples"].sum()),
                                           limits),
    ]
    if seconds is not None:
        lines.append("Assessed in %.2f s." % seconds)
    lines.append("%-20s %10s %8s" % ("flag", "patients", "share"))
    for bit, name in FLAGS:
        count = int(np.count_nonzero(flags & bit))
        lines.append("%-20s %10d %7.2f%%" % (name, count,
                                             100.0 * count / max(patients, 1)))
    failed = result.index[result["status"].to_numpy() != 0]
    lines.append("%-20s %10d%s" % ("not assessable", failed.size,
                                   "  (patient ids %s)" % ", ".join(
                                       str(i) for i in failed[:5])
                                   + (", ..." if failed.size > 5 else "")
                                   if failed.size else ""))
    excess = result["excess_mmol_l"].to_numpy()
    over = excess[excess > 0]
    if over.size:
        lines.append("Excess over a limit (rise or fall): median %.1f, "
                     "largest %.1f mmol/L." % (float(np.median(over)),
                                               float(over.max())))
    lines.append("Caution: " + natremia.CAUTION)
    return lines


# Dask's nanny sets MALLOC_TRIM_THRESHOLD_=65536 in every worker's
# environment (distributed.nanny.pre-spawn-environ) to hand freed memory
# back to the system sooner. Setting that variable at all also turns off
# glibc's adaptive mmap threshold, so every large numpy temporary is a
# fresh mmap that page-faults on first touch: with it, this workload took
# 2.0 to 2.6 times the worker CPU time (tests/bench/bench_dask.py; figures
# in docs/bindings.md).
MALLOC_VARIABLE = "MALLOC_TRIM_THRESHOLD_"


def worker_environ_without_trim():
    """Dask's pre-spawn environment for workers, less MALLOC_TRIM_THRESHOLD_
    (the other entries, such as OMP_NUM_THREADS=1, are kept)."""
    import dask
    environ = dict(dask.config.get("distributed.nanny.pre-spawn-environ",
                                   default={}) or {})
    environ.pop(MALLOC_VARIABLE, None)
    return environ


def environ_value(name):
    """An environment variable of the process that runs this: give it to
    client.run to read each worker's own (os.environ.get itself would be
    pickled with the caller's environment)."""
    import os
    return os.environ.get(name)


def local_cluster(workers, threads, dask_malloc_trim=False):
    """Worker processes on loopback only; no dashboard (it would need
    bokeh, and nothing here serves a web page). Without dask_malloc_trim
    the workers start without Dask's MALLOC_TRIM_THRESHOLD_ (glibc's
    default allocator behaviour); a value the caller's own environment
    sets is inherited either way."""
    import dask
    from dask.distributed import Client, LocalCluster
    import os
    config = {} if dask_malloc_trim else {
        "distributed.nanny.pre-spawn-environ": worker_environ_without_trim()}
    # The nannies of a LocalCluster run in this process and write their
    # pre-spawn environment into os.environ, where any worker started
    # later (another cluster's) would inherit it: put ours back.
    saved = os.environ.get(MALLOC_VARIABLE)
    try:
        with dask.config.set(config):
            cluster = LocalCluster(n_workers=workers,
                                   threads_per_worker=threads,
                                   processes=True, host="127.0.0.1",
                                   dashboard_address=None,
                                   silence_logs=logging.ERROR)
    finally:
        if saved is None:
            os.environ.pop(MALLOC_VARIABLE, None)
        else:
            os.environ[MALLOC_VARIABLE] = saved
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
    parser.add_argument("--dask-malloc-trim", action="store_true",
                        help="keep Dask's MALLOC_TRIM_THRESHOLD_ in the "
                        "LocalCluster workers (slower; for comparison)")
    parser.add_argument("--check-serial", action="store_true",
                        help="also compute serially and require equality")
    parser.add_argument("--csv", metavar="FILE",
                        help="also write the per-patient result as CSV")
    args = parser.parse_args(argv)
    if args.patients < 1 or args.partitions < 1:
        parser.error("--patients and --partitions must be positive")
    args.partitions = min(args.partitions, args.patients)

    from dask.distributed import Client
    cluster = None
    if args.scheduler:
        client = Client(args.scheduler)
    else:
        cluster, client = local_cluster(args.workers, args.threads,
                                        args.dask_malloc_trim)
    try:
        start = time.perf_counter()
        result = run_dask(args.patients, args.partitions, args.seed,
                          args.preset)
        seconds = time.perf_counter() - start
    finally:
        client.close()
        if cluster is not None:
            cluster.close()
    print("\n".join(summary_lines(result, args.preset, seconds)))
    if args.csv:
        result.to_csv(args.csv)

    if args.check_serial:
        serial = run_serial(args.patients, args.partitions, args.seed,
                            args.preset)
        if not same_result(result, serial):
            print("MISMATCH: the Dask result differs from the serial one")
            return 1
        print("Dask result equals the serial computation (patient ids "
              "matched).")
    return 0


if __name__ == "__main__":
    sys.exit(main())
