#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# The README's demo command: installs any missing build dependency
# (Debian/Ubuntu, apt-get), builds the library and the demo in build/, and
# runs the demo on its built-in invented patients.
#
#   bash examples/run-demo.sh [demo arguments]
#
# The demo runs inside build/, so any file it writes lands there.
set -euo pipefail

# Debian packages needed to build the library and the demo.
packages=(
    meson
    ninja-build
    pkg-config
    gcc
    libc6-dev
)

cd "$(dirname "${BASH_SOURCE[0]}")/.."
builddir=build

source tests/lib/apt-missing.sh
apt_missing "${packages[@]}"

# An existing build/ is reused (ninja re-runs meson itself when needed).
if [[ ! -f "$builddir/meson-private/coredata.dat" ]]; then
    rm -rf "$builddir"
    meson setup "$builddir"
fi
ninja -C "$builddir" examples/natremia-demo

cd "$builddir"
exec ./examples/natremia-demo "$@"
