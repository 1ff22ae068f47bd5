#!/usr/bin/python3
"""The Dask cohort example with and without Dask's worker allocator setting.

Dask's nanny puts MALLOC_TRIM_THRESHOLD_=65536 into every worker's
environment (distributed.nanny.pre-spawn-environ); examples/cohort_dask.py
starts its LocalCluster workers without it unless --dask-malloc-trim is
given. This script runs the example both ways on the same invented cohort
(same seed, patients and partitions), alternating the two so that a busy
moment of the machine hits both alike, and prints the median of the
example's own "Assessed in" time (the map_partitions computation, cluster
start-up excluded) and the ratio as JSON:

    NATREMIA_LIBRARY=build/lib/libnatremia.so.1 PYTHONPATH=bindings/python \\
        /usr/bin/python3 tests/bench/bench_dask.py [PATIENTS [REPEATS]]

(defaults 1000000 patients, 3 repeats of each). Every patient is invented.
"""
import json
import os
import re
import statistics
import subprocess
import sys

here = os.path.dirname(os.path.abspath(__file__))
example = os.path.normpath(os.path.join(here, "..", "..", "examples",
                                        "cohort_dask.py"))
patients = int(sys.argv[1]) if len(sys.argv) > 1 else 1_000_000
repeats = int(sys.argv[2]) if len(sys.argv) > 2 else 3

# The example must not inherit a value from this shell either way.
env = {k: v for k, v in os.environ.items() if k != "MALLOC_TRIM_THRESHOLD_"}
configs = {"dask_default_malloc_trim": ["--dask-malloc-trim"],
           "without_malloc_trim": []}
seconds = {name: [] for name in configs}
for _ in range(repeats):
    for name, extra in configs.items():
        out = subprocess.run([sys.executable, example, "--patients",
                              str(patients), "--partitions", "32"] + extra,
                             env=env, check=True, capture_output=True,
                             text=True).stdout
        match = re.search(r"Assessed in ([0-9.]+) s", out)
        if match is None:
            sys.exit("no timing in the example's output:\n" + out)
        seconds[name].append(float(match.group(1)))

median = {name: statistics.median(v) for name, v in seconds.items()}
print(json.dumps({
    "patients": patients, "partitions": 32, "workers": 2, "repeats": repeats,
    "seconds": seconds, "median_seconds": median,
    "ratio_default_over_without": round(
        median["dask_default_malloc_trim"] / median["without_malloc_trim"], 2),
}, indent=2))
