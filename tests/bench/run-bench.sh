#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Reproduces the whole performance table of natremia (issue P7) and writes
# docs/performance.md.
#
#   bash tests/bench/run-bench.sh [BUILD_DIR]      (default: build-bench)
#
# Builds the library and the bench programs with meson in BUILD_DIR (the
# project's default build type, -O2), then measures side by side:
#   1. instructions per call of every scalar function (valgrind callgrind),
#      and the watchers' worst single push beside their steady one
#   2. batch throughput on 10 million rows against a same-stream loop (and memcpy) of the same bytes
#   3. the Python binding's array calls against lean and graded numpy
#      with the same values and statuses
#   4. correction assessment of 1 million invented patients against skilled
#      numpy, one flat pandas rolling and pandas groupby().rolling
#   5. assessment cost per sample for series of 10 to 100,000 samples
#   6. the PostgreSQL extension against bare SQL, a SQL-language function
#      and PL/pgSQL with the same checks (5 million rows)
#   7. Cortex-M4 code size and stack frames (arm-none-eabi-gcc -Os)
#   8. Python scalar calls of the pip-installed package (accelerator
#      natremia._speed, and ctypes only) against plain Python with the same
#      checks (tests/bench/python-scalar.sh)
#   9. the Dask cohort example on 1 and 2 worker processes and serially in
#      one process (tests/bench/bench_dask.py --scaling)
# A step whose tools are missing is reported as skipped. Sizes can be
# lowered for a quick look (the page then says what was run):
#   BENCH_ROWS (10000000) BENCH_NUMPY_ROWS (1000000) BENCH_PATIENTS (1000000)
#   BENCH_PG_ROWS (5000000) BENCH_REPEATS (7) BENCH_PY_CALLS (300000)
#   BENCH_DASK_PATIENTS (200000) BENCH_DASK_REPEATS (3)
# Packages: meson ninja-build valgrind python3-numpy python3-pandas
# gcc-arm-none-eabi postgresql-15 postgresql-server-dev-15 make
# python3-dev python3-venv python3-pip python3-setuptools python3-wheel
# python3-dask python3-distributed.
# Takes a few minutes; the pandas side of step 4 is the longest part.
set -euo pipefail

root=$(cd "$(dirname "$0")/../.." && pwd)
build=${1:-$root/build-bench}
[[ $build == /* ]] || build=$root/$build
rows=${BENCH_ROWS:-10000000}
numpy_rows=${BENCH_NUMPY_ROWS:-1000000}
patients=${BENCH_PATIENTS:-1000000}
pg_rows=${BENCH_PG_ROWS:-5000000}
repeats=${BENCH_REPEATS:-7}
py_calls=${BENCH_PY_CALLS:-300000}
dask_patients=${BENCH_DASK_PATIENTS:-200000}
dask_repeats=${BENCH_DASK_REPEATS:-3}
python=/usr/bin/python3
started=$(date +%s)

step() { printf '\n== %s\n' "$*" >&2; }
have() { command -v "$1" >/dev/null 2>&1; }

step "build ($build)"
if [[ ! -f $build/build.ninja ]]; then
    meson setup "$build" "$root" >/dev/null
fi
# The shared library's file name carries the version (1.1.0 and later).
libtarget=$(ninja -C "$build" -t targets all | grep -o '^lib/libnatremia\.so\.[0-9.]*[0-9]:' \
    | tr -d : | head -n 1)
ninja -C "$build" tests/bench/bench_scalar tests/bench/bench_batch \
    tests/bench/bench_scaling "$libtarget" >/dev/null
# (grep reads all of ninja's output: with grep -q, ninja could die of SIGPIPE and
# pipefail would count the target as missing.)
if ninja -C "$build" -t targets all | grep '^tests/bench/bench_push_worst:' >/dev/null; then
    ninja -C "$build" tests/bench/bench_push_worst >/dev/null
fi
bench=$build/tests/bench
out=$build/bench-results
rm -rf "$out"
mkdir -p "$out"
lib=$build/lib/libnatremia.so.1

step "machine"
"$python" - "$out/machine.json" "$root" <<'PY'
import json, os, platform, subprocess, sys, time
def run(*cmd):
    try:
        return subprocess.run(cmd, capture_output=True, text=True, check=True).stdout
    except (OSError, subprocess.CalledProcessError):
        return ""
model = "unknown"
for line in run("lscpu").splitlines():
    if line.startswith("Model name:"):
        model = line.split(":", 1)[1].strip()
mem_kib = 0
for line in open("/proc/meminfo"):
    if line.startswith("MemTotal:"):
        mem_kib = int(line.split()[1])
json.dump({
    "model": model, "cores": os.cpu_count(),
    "memory": "%.1f GiB" % (mem_kib / 1048576.0),
    "kernel": platform.system() + " " + platform.release(),
    "cc": (run("cc", "--version").splitlines() or ["?"])[0],
    "python": platform.python_version(),
    "commit": (run("git", "-C", sys.argv[2], "rev-parse", "--short", "HEAD").strip() or "?")
              + (" with uncommitted changes in lib/ or include/"
                 if run("git", "-C", sys.argv[2], "status", "--porcelain", "--",
                        "lib", "include").strip() else ""),
    "date": time.strftime("%Y-%m-%d %H:%M UTC", time.gmtime()),
}, open(sys.argv[1], "w"))
PY

step "1. scalar instructions per call (callgrind)"
if have valgrind; then
    valgrind --tool=callgrind --dump-line=no --dump-instr=no \
        --compress-strings=no --compress-pos=no \
        --callgrind-out-file="$out/scalar.callgrind" \
        "$bench/bench_scalar" 20000 >"$out/scalar.log" 2>&1
    "$python" "$root/tests/bench/callgrind_cost.py" "$out/scalar.callgrind" 20000 >"$out/scalar.json"
    # The watchers' single most expensive push, one dump per push (issue 16).
    if [[ -x $bench/bench_push_worst ]]; then
        mkdir -p "$out/push"
        valgrind --tool=callgrind --dump-line=no --dump-instr=no \
            --toggle-collect=ntr_watch_push --toggle-collect=ntr_course_watch_push \
            --callgrind-out-file="$out/push/push.callgrind" \
            "$bench/bench_push_worst" >"$out/push.log" 2>&1
        "$python" "$root/tests/bench/push_worst.py" "$out"/push/push.callgrind.* >"$out/push.json"
        rm -rf "$out/push"
    fi
else
    echo "skipped: valgrind not installed" >&2
fi

step "2. batch throughput, $rows rows, against a same-stream loop and memcpy"
"$bench/bench_batch" "$rows" "$repeats" >"$out/batch.txt"

step "3. Python array calls against numpy ($numpy_rows rows)"
export NATREMIA_LIBRARY=$lib
export PYTHONPATH=$root/bindings/python${PYTHONPATH:+:$PYTHONPATH}
if "$python" -c "import numpy" 2>/dev/null; then
    "$python" "$root/tests/bench/bench_numpy.py" "$numpy_rows" 5 >"$out/numpy.json"
    # Again with glibc's default heap (fresh pages by the allocation order),
    # shown beside the steady-heap figures.
    "$python" "$root/tests/bench/bench_numpy.py" "$numpy_rows" 5 default \
        >"$out/numpy_default.json"
else
    echo "skipped: python3-numpy not installed" >&2
fi

step "4. cohort correction assessment against pandas ($patients patients)"
if "$python" -c "import pandas" 2>/dev/null; then
    "$python" "$root/tests/bench/bench_cohort.py" "$patients" >"$out/cohort.json"
else
    echo "skipped: python3-pandas not installed" >&2
fi

step "5. assessment cost per sample, series of 10 to 100,000"
for spacing in dense sparse; do
    "$bench/bench_scaling" 1000000 15 "$spacing" >"$out/scaling_$spacing.txt"
done
if have valgrind; then
    {
        echo "{"
        sep=""
        for spacing in dense sparse; do
            for n in 10 100 1000 10000 100000; do
                valgrind --tool=callgrind --toggle-collect=ntr_correction_assess \
                    --callgrind-out-file="$out/scaling.$spacing.$n.callgrind" \
                    "$bench/bench_scaling" one "$n" 200000 "$spacing" \
                    >"$out/scaling.$spacing.$n.log" 2>/dev/null
                samples=$(awk '{print $3}' "$out/scaling.$spacing.$n.log")
                ir=$(awk '/^(summary|totals):/ {print $2; exit}' "$out/scaling.$spacing.$n.callgrind")
                printf '%s "%s %s": %s\n' "$sep" "$spacing" "$n" \
                    "$(awk -v a="$ir" -v b="$samples" 'BEGIN {printf "%.3f", a / b}')"
                sep=","
            done
        done
        echo "}"
    } >"$out/scaling_ir.json"
fi

step "6. PostgreSQL ($pg_rows rows)"
status=0
bash "$root/tests/bench/pg-bench.sh" "$root" "$pg_rows" 3 >"$out/pg.json" || status=$?
if [[ $status -ne 0 ]]; then
    rm -f "$out/pg.json"
    [[ $status -eq 77 ]] || { echo "pg-bench.sh failed ($status)" >&2; exit 1; }
fi

step "7. Cortex-M4 code size and stack"
if have arm-none-eabi-gcc; then
    "$python" "$root/tests/bench/firmware.py" "$root" "$build/bench-m4" >"$out/firmware.json"
else
    echo "skipped: gcc-arm-none-eabi not installed" >&2
fi

step "8. Python scalar calls against plain Python ($py_calls calls a round)"
status=0
bash "$root/tests/bench/python-scalar.sh" --json "$out/pyscalar.json" "$py_calls" "$repeats" \
    || status=$?
if [[ $status -ne 0 ]]; then
    rm -f "$out/pyscalar.json"
    [[ $status -eq 77 ]] || { echo "python-scalar.sh failed ($status)" >&2; exit 1; }
fi

step "9. Dask cohort example: 1 and 2 workers, and serial ($dask_patients patients)"
if "$python" -c "import dask.dataframe, distributed, pandas" 2>/dev/null; then
    "$python" "$root/tests/bench/bench_dask.py" --scaling --patients "$dask_patients" \
        --repeats "$dask_repeats" >"$out/dask.json"
else
    echo "skipped: python3-dask, python3-distributed or python3-pandas not installed" >&2
fi

step "report"
"$python" - "$out/machine.json" "$(( $(date +%s) - started ))" <<'PY'
import json, sys
m = json.load(open(sys.argv[1]))
m["seconds"] = int(sys.argv[2])
json.dump(m, open(sys.argv[1], "w"))
PY
"$python" "$root/tests/bench/report.py" "$out" "$root/docs/performance.md"
echo "written: docs/performance.md" >&2
