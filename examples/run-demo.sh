#!/usr/bin/env bash
# The README's demo command: installs any missing build dependency
# (Debian/Ubuntu, apt-get), builds the library and the demo in build/, and
# runs the demo on its built-in invented patient.
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

missing=()
for p in "${packages[@]}"; do
    if ! dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q 'ok installed'; then
        missing+=("$p")
    fi
done
if [[ ${#missing[@]} -gt 0 ]]; then
    echo "Installing missing packages: ${missing[*]}"
    if [[ $(id -u) -eq 0 ]]; then
        as_root=()
    elif command -v sudo >/dev/null 2>&1; then
        as_root=(sudo)
    else
        echo "Not root and no sudo: please install ${missing[*]}" >&2
        exit 1
    fi
    "${as_root[@]}" env DEBIAN_FRONTEND=noninteractive apt-get update
    "${as_root[@]}" env DEBIAN_FRONTEND=noninteractive apt-get install -y "${missing[@]}"
fi

# An existing build/ is reused (ninja re-runs meson itself when needed).
if [[ ! -f "$builddir/meson-private/coredata.dat" ]]; then
    rm -rf "$builddir"
    meson setup "$builddir"
fi
ninja -C "$builddir" examples/natremia-demo

cd "$builddir"
exec ./examples/natremia-demo "$@"
