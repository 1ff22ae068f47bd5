#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Deliberately regenerates the ABI baseline in tests/abi/ from a fresh
# build. Run it only for a compatible addition (a new function or a new
# macro), review `git diff tests/abi/`, and commit the result together with
# the change that caused it. DEVELOPERS.md explains the rules.
#
#   bash tests/update-abi-baseline.sh [build-dir]     (default: build-test)
set -euo pipefail

cd "$(dirname "$0")/.."
builddir=${1:-build-test}

if [[ ! -f "$builddir/meson-private/coredata.dat" ]]; then
    meson setup "$builddir" -Dbuildtype=debugoptimized
fi
ninja -C "$builddir"
bash tests/check_abi.sh --update "$builddir/lib/libnatremia.so" tests/abi include
git --no-pager diff --stat -- tests/abi || true
