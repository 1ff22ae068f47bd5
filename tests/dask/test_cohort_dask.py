#!/usr/bin/env python3
"""Runs examples/cohort_dask.py small on a LocalCluster of worker processes
(loopback) and checks that its result equals the serial computation, and
that the serial batch computation equals one scalar ntr_correction_assess
call per invented patient.

Exit 77 (skipped) only when numpy, dask or distributed is not installed
(apt-get install python3-numpy python3-dask python3-distributed).
"""

import os
import sys

try:
    import numpy as np
    import dask  # noqa: F401
    import distributed  # noqa: F401
except ImportError as exc:
    print("skipped: %s (apt-get install python3-dask python3-distributed)" % exc)
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
LIMITS = "high_risk"


def check(condition, message):
    if not condition:
        print("FAIL: " + message)
        sys.exit(1)
    print("ok: " + message)


def scalar_reference():
    """One scalar call per patient, partition by partition."""
    flags, rise, excess, status = [], [], [], []
    for index, n in enumerate(cohort_dask.partition_sizes(PATIENTS, PARTITIONS)):
        counts, hours, na = cohort_dask.make_partition(index, n, SEED)
        start = 0
        for count in counts:
            end = start + int(count)
            try:
                c = natremia.correction_assess(hours=hours[start:end],
                                               na_mmol_l=na[start:end],
                                               limits=LIMITS)
                flags.append(int(c.flags))
                rise.append(c.max_rise_24h)
                excess.append(c.excess_mmol_l)
                status.append(0)
            except natremia.NatremiaError as err:
                flags.append(0)
                rise.append(float("nan"))
                excess.append(float("nan"))
                status.append(err.status)
            start = end
    return flags, rise, excess, status


def main():
    serial = cohort_dask.run_serial(PATIENTS, PARTITIONS, SEED, LIMITS)
    check(serial["flags"].size == PATIENTS, "serial result has one row per patient")
    check(np.count_nonzero(serial["flags"]) > 0, "some invented patients are flagged")

    flags, rise, excess, status = scalar_reference()
    check(serial["flags"].tolist() == flags and serial["status"].tolist() == status,
          "batch flags and statuses equal the scalar calls")
    check(np.array_equal(serial["max_rise_24h"], np.array(rise), equal_nan=True)
          and np.array_equal(serial["excess_mmol_l"], np.array(excess), equal_nan=True),
          "batch figures equal the scalar calls")

    cluster, client = cohort_dask.local_cluster(workers=2, threads=1)
    try:
        check(all(addr.startswith("tcp://127.0.0.1:")
                  for addr in client.scheduler_info()["workers"]),
              "workers listen on loopback")
        result = cohort_dask.run_dask(client, PATIENTS, PARTITIONS, SEED, LIMITS)
    finally:
        client.close()
        cluster.close()
    check(cohort_dask.same_result(result, serial),
          "Dask result equals the serial computation bit for bit")
    print("\n".join(cohort_dask.summary_lines(result, LIMITS)))
    return 0


if __name__ == "__main__":
    sys.exit(main())
