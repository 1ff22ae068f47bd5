#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# The README's test command: installs whatever Debian/Ubuntu package the
# tests need and is missing, builds in build-test/ and runs the whole suite.
# Ends with one line "N passed, N failed, N skipped"; the exit status is
# non-zero when anything failed.
#
#   bash tests/run-all.sh
set -euo pipefail

# Every Debian package the build and the tests use. Extend this list when a
# test starts using a new tool or library. Names that carry a release's
# version (PostgreSQL's major version, the clang runtime) are not written
# here: they are found on the machine below (tests/lib/debian-names.sh).
packages=(
    meson
    ninja-build
    pkg-config
    gcc
    g++
    libc6-dev
    binutils
    libcmocka-dev
    abigail-tools
    python3
    python3-periodictable
    python3-numpy
    python3-hypothesis
    python3-setuptools
    python3-wheel
    python3-pip
    python3-venv
    python3-dev
    python3-dask
    python3-pandas
    python3-distributed
    make
    cmake
    # + postgresql-N and postgresql-server-dev-N (found below)
    doxygen
    libjs-mathjax
    librsvg2-bin
    # reliability (P6): short fuzzing (suite 'fuzz') and the s390x cross
    # test (suite 'cross'; tests/cross.sh adds the s390x architecture and
    # its libcmocka-dev itself)
    clang
    # + clang's runtime with libFuzzer, libclang-rt-N-dev (found below)
    gcc-s390x-linux-gnu
    libc6-dev-s390x-cross
    qemu-user
    # the JavaScript binding (issue 15): clang (above) for wasm32 with lld's
    # wasm-ld, wasi-libc for the reference-vector program, node to run them
    # (+ libclang-rt-N-dev-wasm32, found below; npm where node has none);
    # the web page test opens examples/web in headless Chromium
    lld
    wasi-libc
    nodejs
    chromium
    # the R package (issue 15): R, its headers and toolchain for the .Call
    # glue, and testthat for its tests
    r-base-core
    r-base-dev
    r-cran-testthat
)

cd "$(dirname "${BASH_SOURCE[0]}")/.."
builddir=build-test

# ---- dependencies: apt-get only when something is missing
source tests/lib/apt-missing.sh
source tests/lib/debian-names.sh
pg_major=$(deb_pg_major)
if [[ -n $pg_major ]]; then
    packages+=("postgresql-$pg_major" "postgresql-server-dev-$pg_major")
else
    echo "run-all.sh: no PostgreSQL server package known to apt: the extension test will be skipped"
fi
clang_major=$(deb_clang_major)
clang_rt=${clang_major:+$(deb_clang_rt_package "$clang_major")}
if [[ -n $clang_rt ]]; then
    packages+=("$clang_rt")
else
    echo "run-all.sh: no runtime package for clang ${clang_major:-?} known to apt: fuzzing will be skipped"
fi
if [[ -n $clang_major ]] && deb_known "libclang-rt-$clang_major-dev-wasm32"; then
    packages+=("libclang-rt-$clang_major-dev-wasm32")
fi
# Debian's nodejs comes without npm; a node that brings its own (as
# NodeSource's package does, which conflicts with Debian's npm) is left alone.
if ! command -v npm >/dev/null 2>&1; then
    packages+=(npm)
fi
echo "run-all.sh: PostgreSQL ${pg_major:-none}, clang ${clang_major:-none} (${clang_rt:-no runtime package})"
apt_missing "${packages[@]}"

# ---- configure (debugoptimized: the ABI check needs -g), build, test
source tests/lib/build-steps.sh
# tests and docs enabled: a missing cmocka, doxygen or MathJax fails the
# setup instead of silently switching the unit tests or the manual off.
meson_setup_dir "$builddir" -Dbuildtype=debugoptimized -Dtests=enabled -Ddocs=enabled
ninja -C "$builddir"

test_status=0
meson test -C "$builddir" --print-errorlogs --num-processes 2 || test_status=$?

# ---- summary from meson's machine-readable log (one JSON object a line)
summary=$(python3 - "$builddir/meson-logs/testlog.json" <<'EOF'
import json, sys
counts = {"passed": 0, "failed": 0, "skipped": 0}
with open(sys.argv[1], encoding="utf-8") as log:
    for line in log:
        if not line.strip():
            continue
        result = json.loads(line)["result"]
        if result in ("OK", "EXPECTEDFAIL"):
            counts["passed"] += 1
        elif result == "SKIP":
            counts["skipped"] += 1
        else:  # FAIL, ERROR, TIMEOUT, UNEXPECTEDPASS, ...
            counts["failed"] += 1
print(f"{counts['passed']} passed, {counts['failed']} failed, {counts['skipped']} skipped")
sys.exit(1 if counts["failed"] else 0)
EOF
) && summary_status=0 || summary_status=$?
echo "$summary"

if [[ $test_status -ne 0 || $summary_status -ne 0 ]]; then
    exit 1
fi
