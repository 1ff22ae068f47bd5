#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Rewrite tests/refvectors/expected.txt from a host build, after a
# deliberate change of results (say why in the commit message). Then run
# tests/cross.sh: every architecture must reproduce the new file bit for bit.
# Usage: tests/refvectors/regenerate.sh [BUILDDIR]   (default build-refvectors)
set -euo pipefail
root="$(cd "$(dirname "$0")/../.." && pwd)"
build="${1:-$root/build-refvectors}"
[ -d "$build" ] || meson setup "$build" "$root" >/dev/null
ninja -C "$build" tests/refvectors/refvectors >/dev/null
"$build/tests/refvectors/refvectors" > "$root/tests/refvectors/expected.txt"
wc -l "$root/tests/refvectors/expected.txt"
