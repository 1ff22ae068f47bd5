#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""The Dask cohort example with and without Dask's worker allocator setting.

Dask's nanny puts MALLOC_TRIM_THRESHOLD_=65536 into every worker's
environment (distributed.nanny.pre-spawn-environ); examples/cohort_dask.py
starts its LocalCluster workers without it unless --dask-malloc-trim is
given. Measured side by side on the same invented cohort (same seed):

1. "example": the example's map_partitions computation (run_dask) on a
   LocalCluster of 2 worker processes, both ways, alternating so that a
   busy moment of the machine hits both alike (imports done beforehand):
   the elapsed time and the workers' CPU time (user + system, getrusage in each worker, summed),
   median of REPEATS runs each. Each cluster's workers are asked for their
   MALLOC_TRIM_THRESHOLD_ so the configuration is checked, not assumed.
   With --before FILE, an earlier version of the example (for instance
   `git show 60cda71:examples/cohort_dask.py > /tmp/before.py`) is run the
   same way on a cluster with Dask's defaults, as a third configuration.
2. "worker": what one worker does, alone: generating and assessing 8
   partitions of 31,250 patients in a fresh process, with and without
   MALLOC_TRIM_THRESHOLD_=65536 in its environment; the figure is the
   process CPU time (user + system), which other jobs on a shared machine
   disturb less than the elapsed time. Median of REPEATS runs each.

    NATREMIA_LIBRARY=build/lib/libnatremia.so.1 PYTHONPATH=bindings/python \\
        /usr/bin/python3 tests/bench/bench_dask.py [--patients N] [--repeats R] [--before FILE]

Prints JSON (defaults: 200000 patients, 3 repeats). Every patient is
invented.

With --scaling (step 9 of run-bench.sh) it measures instead how the
example scales: the same cohort (same seed, 32 partitions) computed by
run_dask on a LocalCluster of 1 worker process and of 2 worker processes
(one thread each, the example's allocator setting), and by run_serial in
this process (pandas and natremia alone, partition after partition: the
time Dask has to beat). Each cluster is started, and its workers have
imported pandas, numpy and natremia and run the computation once on a
tiny cohort, before the clock starts; the three
take turns REPEATS times and the median elapsed time of each is kept.
The results must equal the serial one bit for bit. Scaling = 1-worker
time / 2-worker time (2.0 would be perfect on two cores). The CPU time
(user + system) of the workers, summed, or of this process for the serial
run, is reported beside it: other jobs on a shared machine disturb it
less than the elapsed time.
"""
import argparse
import json
import os
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


def rusage_seconds():
    import resource
    r = resource.getrusage(resource.RUSAGE_SELF)
    return r.ru_utime + r.ru_stime


def load_module(path, name):
    import importlib.util
    spec = importlib.util.spec_from_file_location(name, path)
    module = importlib.util.module_from_spec(spec)
    sys.modules[name] = module
    spec.loader.exec_module(module)
    # The workers cannot import it by name: send its functions by value.
    import cloudpickle
    cloudpickle.register_pickle_by_value(module)
    return module


def example_run(module, trim, patients):
    """(elapsed s, workers' CPU s) of one run_dask on a fresh cluster."""
    import time
    now = sys.modules["cohort_dask"]
    cluster, client = now.local_cluster(2, 1, dask_malloc_trim=trim)
    try:
        seen = set(client.run(now.environ_value, VARIABLE).values())
        if seen != {DASK_VALUE if trim else None}:
            sys.exit("workers have %s=%r, expected %r" % (
                VARIABLE, seen, DASK_VALUE if trim else None))
        # Imports out of the measurement (a fresh worker imports pandas,
        # numpy and natremia on its first task).
        import importlib
        for name in ("pandas", "numpy", "natremia.arrays", "dask.dataframe"):
            client.run(importlib.import_module, name)
        before = sum(client.run(rusage_seconds).values())
        start = time.perf_counter()
        if hasattr(module, "cohort"):
            module.run_dask(patients, 32, 20240607, "per_patient")
        else:  # the earlier example: client.map over partitions
            module.run_dask(client, patients, 32, 20240607, "per_patient")
        elapsed = time.perf_counter() - start
        cpu = sum(client.run(rusage_seconds).values()) - before
    finally:
        client.close()
        cluster.close()
    return elapsed, cpu


def worker_seconds(trim):
    path = os.pathsep.join([examples, os.environ.get("PYTHONPATH", "")])
    env = clean_env(PYTHONPATH=path, **({VARIABLE: DASK_VALUE} if trim else {}))
    out = subprocess.run([sys.executable, "-c", WORKER], env=env, check=True,
                         capture_output=True, text=True).stdout
    return float(out.split()[-1])


def warmed_cluster(workers, partitions, seed, preset):
    """A started cluster whose workers have imported the modules and run
    the computation once on a tiny cohort (so that neither side's first
    use of the code is timed)."""
    now = sys.modules["cohort_dask"]
    cluster, client = now.local_cluster(workers, 1)
    import importlib
    for name in ("pandas", "numpy", "natremia.arrays", "dask.dataframe"):
        client.run(importlib.import_module, name)
    now.run_dask(10 * partitions, partitions, seed, preset)
    return cluster, client


def scaling(patients, repeats):
    """Elapsed seconds of the serial run and of 1- and 2-worker clusters."""
    import time
    import cohort_dask
    seed, partitions, preset = 20240607, 32, "per_patient"
    # Untimed: the reference result, and this process's first use of
    # pandas and natremia (the workers are warmed the same way).
    reference = cohort_dask.run_serial(patients, partitions, seed, preset)
    times = {"serial": [], "1 worker": [], "2 workers": []}
    cpu = {"serial": [], "1 worker": [], "2 workers": []}
    same = True
    for _ in range(repeats):
        before = rusage_seconds()
        start = time.perf_counter()
        result = cohort_dask.run_serial(patients, partitions, seed, preset)
        times["serial"].append(time.perf_counter() - start)
        cpu["serial"].append(rusage_seconds() - before)
        same &= cohort_dask.same_result(result, reference)
        for workers in (1, 2):
            name = "%d worker%s" % (workers, "s" if workers > 1 else "")
            cluster, client = warmed_cluster(workers, partitions, seed, preset)
            try:
                before = sum(client.run(rusage_seconds).values())
                start = time.perf_counter()
                result = cohort_dask.run_dask(patients, partitions, seed, preset)
                times[name].append(time.perf_counter() - start)
                cpu[name].append(sum(client.run(rusage_seconds).values()) - before)
            finally:
                client.close()
                cluster.close()
            same &= cohort_dask.same_result(result, reference)
    median = {k: round(statistics.median(v), 3) for k, v in times.items()}
    return {"patients": patients, "partitions": partitions, "repeats": repeats,
            "samples": int(reference["samples"].sum()),
            "cores": os.cpu_count(), "elapsed": {k: [round(x, 3) for x in v]
                                                 for k, v in times.items()},
            "median": median, "same_result": bool(same),
            "cpu": {k: [round(x, 3) for x in v] for k, v in cpu.items()},
            "median_cpu": {k: round(statistics.median(v), 3) for k, v in cpu.items()},
            "scaling": round(median["1 worker"] / median["2 workers"], 2),
            "serial_over_2_workers": round(median["serial"] / median["2 workers"], 2)}


def main():
    parser = argparse.ArgumentParser()
    parser.add_argument("--patients", type=int, default=200_000)
    parser.add_argument("--repeats", type=int, default=3)
    parser.add_argument("--before", metavar="FILE",
                        help="an earlier cohort_dask.py, run with Dask's defaults")
    parser.add_argument("--scaling", action="store_true",
                        help="1 and 2 workers and the serial run instead")
    args = parser.parse_args()
    os.environ.pop(VARIABLE, None)
    # Worker processes import the example module by name.
    os.environ["PYTHONPATH"] = os.pathsep.join(
        [examples] + [p for p in os.environ.get("PYTHONPATH", "").split(os.pathsep) if p])
    sys.path.insert(0, examples)
    import cohort_dask
    if args.scaling:
        print(json.dumps(scaling(args.patients, args.repeats), indent=1))
        return
    configs = {"with_dask_malloc_trim": (cohort_dask, True),
               "without_malloc_trim": (cohort_dask, False)}
    if args.before:
        configs["before_with_dask_defaults"] = (
            load_module(args.before, "cohort_dask_before"), True)

    runs = {name: {"elapsed": [], "worker_cpu": []} for name in configs}
    worker = {"with_malloc_trim": [], "without_malloc_trim": []}
    for _ in range(args.repeats):
        for name, (module, trim) in configs.items():
            elapsed, cpu = example_run(module, trim, args.patients)
            runs[name]["elapsed"].append(round(elapsed, 3))
            runs[name]["worker_cpu"].append(round(cpu, 3))
        worker["with_malloc_trim"].append(round(worker_seconds(True), 3))
        worker["without_malloc_trim"].append(round(worker_seconds(False), 3))

    def med(name, key):
        return statistics.median(runs[name][key])

    example = {"patients": args.patients, "partitions": 32, "workers": 2,
               "repeats": args.repeats, "runs": runs}
    for key in ("elapsed", "worker_cpu"):
        example["ratio_with_over_without_" + key] = round(
            med("with_dask_malloc_trim", key) / med("without_malloc_trim", key), 2)
        if args.before:
            example["ratio_before_over_now_" + key] = round(
                med("before_with_dask_defaults", key)
                / med("without_malloc_trim", key), 2)
    wmed = {name: statistics.median(v) for name, v in worker.items()}
    report = {
        "example": example,
        "worker": {"partitions": 8, "patients_per_partition": 31250,
                   "cpu_seconds": worker,
                   "ratio_with_over_without": round(
                       wmed["with_malloc_trim"] / wmed["without_malloc_trim"],
                       2)},
    }
    print(json.dumps(report, indent=2))


if __name__ == "__main__":
    main()
