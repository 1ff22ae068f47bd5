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
#   tests/bench/python-scalar.sh [CALLS [REPEATS]]
set -euo pipefail
root=$(cd "$(dirname "$0")/../.." && pwd)
python=/usr/bin/python3
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
echo "== as installed (accelerator: $("$tmp/venv/bin/python" -c 'import natremia; print("on" if natremia._core.speedup_active() else "off")'))"
"$tmp/venv/bin/python" "$root/tests/bench/bench_python_scalar.py" "$@"
echo "== NATREMIA_NO_SPEEDUP=1 (ctypes only)"
NATREMIA_NO_SPEEDUP=1 "$tmp/venv/bin/python" "$root/tests/bench/bench_python_scalar.py" "$@"
