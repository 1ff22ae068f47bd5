#!/usr/bin/python3
"""The Dask cohort example with and without Dask's worker allocator setting.

Dask's nanny puts MALLOC_TRIM_THRESHOLD_=65536 into every worker's
environment (distributed.nanny.pre-spawn-environ); examples/cohort_dask.py
starts its LocalCluster workers without it unless --dask-malloc-trim is
given. Measured side by side on the same invented cohort (same seed):

1. "example": the example end to end on a LocalCluster of 2 worker
   processes, both ways, alternating so that a busy moment of the machine
   hits both alike; the figure is the example's own "Assessed in" time
   (the map_partitions computation; cluster start-up excluded), the median
   of REPEATS runs each. With --before FILE, an earlier version of the
   example (for instance `git show 60cda71:examples/cohort_dask.py`) is
   run the same way, with Dask's defaults, as a third configuration.
2. "worker": what one worker does, alone: generating and assessing 8
   partitions of 31,250 patients in a fresh process, with and without
   MALLOC_TRIM_THRESHOLD_=65536 in its environment; the figure is the
   process CPU time (user + system), which other jobs on a shared machine
   disturb less than the elapsed time. Median of REPEATS runs each.

    NATREMIA_LIBRARY=build/lib/libnatremia.so.1 PYTHONPATH=bindings/python \\
        /usr/bin/python3 tests/bench/bench_dask.py [--patients N] [--repeats R] [--before FILE]

Prints JSON (defaults: 1000000 patients, 3 repeats). Every patient is
invented.
"""
import argparse
import json
import os
import re
import statistics
import subprocess
import sys

here = os.path.dirname(os.path.abspath(__file__))
examples = os.path.normpath(os.path.join(here, "..", "..", "examples"))
example = os.path.join(examples, "cohort_dask.py")
VARIABLE = "MALLOC_TRIM_THRESHOLD_"
DASK_VALUE = "65536"  # distributed.nanny.pre-spawn-environ (distributed.yaml)

WORKER = """
import time, cohort_dask
start = time.process_time()
for i in range(8):
    cohort_dask.assess_frame(cohort_dask.partition_frame(i, 31250, 20240607,
                                                         "per_patient"))
print(time.process_time() - start)
"""


def clean_env(**extra):
    env = {k: v for k, v in os.environ.items() if k != VARIABLE}
    env.update(extra)
    return env


def example_seconds(script, args, patients):
    out = subprocess.run([sys.executable, script, "--patients", str(patients),
                          "--partitions", "32"] + args, env=clean_env(),
                         check=True, capture_output=True, text=True).stdout
    match = re.search(r"Assessed in ([0-9.]+) s", out)
    if match is None:
        sys.exit("no timing in the output of %s:\n%s" % (script, out))
    return float(match.group(1))


def worker_seconds(trim):
    path = os.pathsep.join([examples, os.environ.get("PYTHONPATH", "")])
    env = clean_env(PYTHONPATH=path, **({VARIABLE: DASK_VALUE} if trim else {}))
    out = subprocess.run([sys.executable, "-c", WORKER], env=env, check=True,
                         capture_output=True, text=True).stdout
    return float(out.split()[-1])


def main():
    parser = argparse.ArgumentParser()
    parser.add_argument("--patients", type=int, default=1_000_000)
    parser.add_argument("--repeats", type=int, default=3)
    parser.add_argument("--before", metavar="FILE",
                        help="an earlier cohort_dask.py, run with Dask's defaults")
    args = parser.parse_args()

    configs = {"with_dask_malloc_trim": (example, ["--dask-malloc-trim"]),
               "without_malloc_trim": (example, [])}
    if args.before:
        configs["before_with_dask_defaults"] = (args.before, [])
    runs = {name: [] for name in configs}
    worker = {"with_malloc_trim": [], "without_malloc_trim": []}
    for _ in range(args.repeats):
        for name, (script, extra) in configs.items():
            runs[name].append(example_seconds(script, extra, args.patients))
        worker["with_malloc_trim"].append(worker_seconds(True))
        worker["without_malloc_trim"].append(worker_seconds(False))

    med = {name: statistics.median(v) for name, v in runs.items()}
    wmed = {name: statistics.median(v) for name, v in worker.items()}
    report = {
        "example": {"patients": args.patients, "partitions": 32,
                    "workers": 2, "repeats": args.repeats,
                    "assessed_in_seconds": runs, "median_seconds": med,
                    "ratio_with_over_without": round(
                        med["with_dask_malloc_trim"]
                        / med["without_malloc_trim"], 2)},
        "worker": {"partitions": 8, "patients_per_partition": 31250,
                   "cpu_seconds": worker, "median_cpu_seconds": wmed,
                   "ratio_with_over_without": round(
                       wmed["with_malloc_trim"] / wmed["without_malloc_trim"],
                       2)},
    }
    if args.before:
        report["example"]["ratio_before_over_now"] = round(
            med["before_with_dask_defaults"] / med["without_malloc_trim"], 2)
    print(json.dumps(report, indent=2))


if __name__ == "__main__":
    main()
