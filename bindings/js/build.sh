#!/bin/sh
# Build natremia.wasm: lib/ compiled for wasm32 with clang, freestanding,
# with the project's warning and floating-point flags, plus the shim in
# shim/ (memset and friends, the argument arena). Needs clang and lld
# (wasm-ld); Debian: apt-get install clang lld.
# Usage: sh build.sh [OUTPUT]   (default: natremia.wasm beside this script)
set -eu
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/../.." && pwd)"
out="${1:-$here/natremia.wasm}"
cc="${CLANG:-clang}"
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT INT TERM

flags="--target=wasm32 -std=c99 -O2 -ffp-contract=off -ffreestanding -nostdlib
 -Wall -Wextra -Wpedantic -Wconversion -Wshadow -Wdouble-promotion -Werror
 -fvisibility=hidden -DNTR_BUILDING
 -isystem $here/shim -I$root/include -I$root/lib"

objs=""
for src in "$root"/lib/*.c "$here"/shim/ntrjs_shim.c; do
    obj="$tmp/$(basename "$src" .c).o"
    # shellcheck disable=SC2086
    "$cc" $flags -c "$src" -o "$obj"
    objs="$objs $obj"
done
# --export-dynamic exports what NTR_API marks (default visibility) and the
# shim's export_name functions; nothing is imported.
# shellcheck disable=SC2086
"$cc" --target=wasm32 -nostdlib -Wl,--no-entry -Wl,--export-dynamic \
    -Wl,--stack-first -Wl,-z,stack-size=1048576 -o "$out.tmp" $objs
mv "$out.tmp" "$out"
