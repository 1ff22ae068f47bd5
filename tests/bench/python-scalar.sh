#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# The Python scalar-call benchmark on the package as users get it: pip
# installs bindings/python (offline, Debian's tools, into a throwaway venv;
# the build compiles the bundled library and, with python3-dev, the
# accelerator natremia._speed), then runs bench_python_scalar.py there:
# natremia against plain Python with the same checks, side by side in one
# process. A second run with NATREMIA_NO_SPEEDUP=1 measures the ctypes-only
# path of a machine without python3-dev.
#
#   tests/bench/python-scalar.sh [--json OUT] [CALLS [REPEATS]]
#
# With --json the two runs are written to OUT as one JSON object (step 8 of
# run-bench.sh) instead of printed as tables. Exits 77 (skipped) when
# python3-dev (Python.h, needed for the accelerator), venv or pip is
# missing.
set -euo pipefail
root=$(cd "$(dirname "$0")/../.." && pwd)
python=/usr/bin/python3
json=
if [[ ${1:-} == --json ]]; then
    json=$2
    shift 2
fi
include=$("$python" -c 'import sysconfig; print(sysconfig.get_paths()["include"])')
if [[ ! -f $include/Python.h ]]; then
    echo "skipped: python3-dev not installed (no $include/Python.h)" >&2
    exit 77
fi
for module in venv pip setuptools; do
    if ! "$python" -c "import $module" 2>/dev/null; then
        echo "skipped: python3 module $module missing" >&2
        exit 77
    fi
done
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
mkdir -p "$tmp/repo/bindings"
cp -r "$root/lib" "$root/include" "$tmp/repo/"
cp -r "$root/bindings/python" "$tmp/repo/bindings/python"
rm -rf "$tmp/repo/bindings/python/build" "$tmp/repo/bindings/python/"*.egg-info
"$python" -m venv --without-pip --system-site-packages "$tmp/venv"
"$tmp/venv/bin/python" -m pip install --quiet --no-build-isolation --no-index \
    --no-cache-dir "$tmp/repo/bindings/python" >/dev/null 2>&1
cd "$tmp"
unset NATREMIA_LIBRARY PYTHONPATH
accel=$("$tmp/venv/bin/python" -c 'import natremia; print("on" if natremia._core.speedup_active() else "off")')
if [[ -n $json ]]; then
    "$tmp/venv/bin/python" "$root/tests/bench/bench_python_scalar.py" --json "$@" >"$tmp/on.json"
    NATREMIA_NO_SPEEDUP=1 "$tmp/venv/bin/python" "$root/tests/bench/bench_python_scalar.py" \
        --json "$@" >"$tmp/off.json"
    "$python" - "$tmp/on.json" "$tmp/off.json" "$accel" >"$json" <<'PY'
import json, sys
on, off = (json.load(open(p)) for p in sys.argv[1:3])
json.dump({"accelerator": sys.argv[3], "installed": on, "ctypes_only": off},
          sys.stdout, indent=1)
PY
    exit 0
fi
echo "== as installed (accelerator: $accel)"
"$tmp/venv/bin/python" "$root/tests/bench/bench_python_scalar.py" "$@"
echo "== NATREMIA_NO_SPEEDUP=1 (ctypes only)"
NATREMIA_NO_SPEEDUP=1 "$tmp/venv/bin/python" "$root/tests/bench/bench_python_scalar.py" "$@"
