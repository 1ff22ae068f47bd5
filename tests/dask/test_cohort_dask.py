#!/usr/bin/env python3
# SPDX-License-Identifier: MIT
"""Runs examples/cohort_dask.py small on a LocalCluster of worker processes
(loopback) and checks that its result equals the serial computation, and
that the serial batch computation equals one scalar course_assess() call
per invented patient (ntr_course_assess, the 1.1 engine), both with a
preset per patient (by its goal) and with one preset for the cohort.

Exit 77 (skipped) only when numpy, dask or distributed is not installed
(apt-get install python3-numpy python3-pandas python3-dask
python3-distributed).
"""

import os
import sys

try:
    import numpy as np
    import pandas  # noqa: F401
    import dask  # noqa: F401
    import dask.dataframe  # noqa: F401
    import distributed  # noqa: F401
except ImportError as exc:
    print("skipped: %s (apt-get install python3-pandas python3-dask "
          "python3-distributed)" % exc)
    sys.exit(77)

here = os.path.dirname(os.path.abspath(__file__))
examples = os.path.normpath(os.path.join(here, "..", "..", "examples"))
sys.path.insert(0, examples)
# Worker processes import the example module by name: give them the path.
os.environ["PYTHONPATH"] = os.pathsep.join(
    [examples] + [p for p in os.environ.get("PYTHONPATH", "").split(os.pathsep) if p])

import natremia  # noqa: E402
import cohort_dask  # noqa: E402

PATIENTS = 3000
PARTITIONS = 6
SEED = 7
# Both ways of choosing limits: each patient's goal, and one for all.
PRESETS = (cohort_dask.PER_PATIENT, "hypo_high_risk")
F = natremia.CourseFlag


def check(condition, message):
    if not condition:
        print("FAIL: " + message)
        sys.exit(1)
    print("ok: " + message)


def scalar_reference(preset):
    """One scalar course_assess call per patient, partition by partition."""
    ref = {"flags": [], "status": [], "id": []}
    for field in cohort_dask.FIELDS:
        ref[field] = []
    for index, n in enumerate(cohort_dask.partition_sizes(PATIENTS, PARTITIONS)):
        ids, hours, na, presets = cohort_dask.partition_rows(index, n, SEED,
                                                             preset)
        start = 0
        while start < ids.size:
            end = start + int(np.count_nonzero(ids == ids[start]))
            ref["id"].append(int(ids[start]))
            try:
                r = natremia.course_assess(hours=hours[start:end],
                                           na_mmol_l=na[start:end],
                                           limits=str(presets[start]))
                ref["flags"].append(int(r.flags))
                ref["status"].append(0)
                for field in cohort_dask.FIELDS:
                    ref[field].append(getattr(r, field))
            except natremia.NatremiaError as err:
                ref["flags"].append(0)
                ref["status"].append(err.status)
                for field in cohort_dask.FIELDS:
                    ref[field].append(float("nan"))
            start = end
    return ref


def check_serial(preset):
    serial = cohort_dask.run_serial(PATIENTS, PARTITIONS, SEED, preset)
    check(len(serial) == PATIENTS,
          "%s: serial result has one row per patient" % preset)
    ref = scalar_reference(preset)
    check(serial.index.name == "patient_id"
          and serial.index.tolist() == ref["id"],
          "%s: patient ids kept (the result's index)" % preset)
    check(serial["flags"].tolist() == ref["flags"]
          and serial["status"].tolist() == ref["status"],
          "%s: batch flags and statuses equal the scalar calls" % preset)
    check(all(np.array_equal(serial[f].to_numpy(), np.array(ref[f]),
                             equal_nan=True)
              for f in cohort_dask.FIELDS),
          "%s: batch figures equal the scalar calls" % preset)
    counts = {}
    for pid in ref["id"]:
        counts[pid] = 0
    for index, n in enumerate(cohort_dask.partition_sizes(PATIENTS, PARTITIONS)):
        ids = cohort_dask.partition_rows(index, n, SEED, preset)[0]
        for pid in ids.tolist():
            counts[pid] += 1
    check(serial["samples"].tolist() == [counts[p] for p in ref["id"]],
          "%s: results counted per patient" % preset)
    return serial


def main():
    serials = {preset: check_serial(preset) for preset in PRESETS}
    per_patient = serials[cohort_dask.PER_PATIENT]
    flags = per_patient["flags"].to_numpy()
    # The invented cohort has falling high sodiums and rising low ones:
    # both directions are flagged when each patient has its goal's preset.
    check(np.count_nonzero(flags & int(F.FALL_OVER_24H)) > 0,
          "some invented high-sodium patients fall too fast")
    check(np.count_nonzero(flags & int(F.OVER_24H)) > 0,
          "some invented low-sodium patients rise too fast")
    one_goal = serials["hypo_high_risk"]["flags"].to_numpy()
    check(np.count_nonzero(one_goal & int(F.WRONG_WAY)) > 0,
          "one raise preset for all: the falling patients move the wrong way")

    frame = cohort_dask.cohort(PATIENTS, PARTITIONS, SEED,
                               cohort_dask.PER_PATIENT)
    check(frame.npartitions == PARTITIONS and frame.known_divisions
          and frame.index.name == "patient_id",
          "the cohort is a dask.dataframe partitioned by patient id "
          "(known divisions)")

    cluster, client = cohort_dask.local_cluster(workers=2, threads=1)
    try:
        check(all(addr.startswith("tcp://127.0.0.1:")
                  for addr in client.scheduler_info()["workers"]),
              "workers listen on loopback")
        trim = client.run(cohort_dask.environ_value,
                          cohort_dask.MALLOC_VARIABLE)
        check(len(trim) == 2 and all(v is None for v in trim.values()),
              "the workers run without Dask's MALLOC_TRIM_THRESHOLD_ (%r)"
              % (trim,))
        omp = client.run(cohort_dask.environ_value, "OMP_NUM_THREADS")
        check(all(v == "1" for v in omp.values()),
              "Dask's other worker settings are kept (OMP_NUM_THREADS=1)")
        results = {preset: cohort_dask.run_dask(PATIENTS, PARTITIONS, SEED,
                                                preset)
                   for preset in PRESETS}
    finally:
        client.close()
        cluster.close()
    for preset in PRESETS:
        check(cohort_dask.same_result(results[preset], serials[preset]),
              "%s: Dask result equals the serial computation bit for bit, "
              "patient ids matched" % preset)
    print("\n".join(cohort_dask.summary_lines(results[cohort_dask.PER_PATIENT],
                                              cohort_dask.PER_PATIENT)))
    return 0


if __name__ == "__main__":
    sys.exit(main())
