#!/bin/sh
# SPDX-License-Identifier: MIT
# Build natremia.wasm: lib/ compiled for wasm32 with clang, freestanding,
# with the project's warning and floating-point flags, plus the shim in
# shim/ (memset and friends, the argument arena). Nothing is imported.
#
# With wasi-libc present it also builds refvectors.wasm, the reference-vector
# program tests/refvectors/refvectors.c over the same lib/ objects, for the
# test that compares all of tests/refvectors/expected.txt under node.
#
# Needs clang and lld (wasm-ld); Debian: apt-get install clang lld
# (and wasi-libc libclang-rt-14-dev-wasm32 for refvectors.wasm).
# Usage: sh build.sh [OUTDIR]   (default: this directory)
#        NATREMIA_REFVECTORS=no sh build.sh ...   builds natremia.wasm alone
set -eu
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/../.." && pwd)"
outdir="${1:-$here}"
cc="${CLANG:-clang}"
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT INT TERM
mkdir -p "$outdir"

warn="-Wall -Wextra -Wpedantic -Wconversion -Wshadow -Wdouble-promotion -Werror"
flags="-std=c99 -O2 -ffp-contract=off $warn -I$root/include"

# lib/ as the library build compiles it (NTR_BUILDING, hidden symbols but
# NTR_API), freestanding, with shim/math.h for <math.h>.
libflags="$flags -ffreestanding -fvisibility=hidden -DNTR_BUILDING -isystem $here/shim -I$root/lib"

objs=""
for src in "$root"/lib/*.c; do
    obj="$tmp/$(basename "$src" .c).o"
    # shellcheck disable=SC2086
    "$cc" --target=wasm32 $libflags -c "$src" -o "$obj"
    objs="$objs $obj"
done
# shellcheck disable=SC2086
"$cc" --target=wasm32 $libflags -c "$here/shim/ntrjs_shim.c" -o "$tmp/shim.o"
# --export-dynamic exports what NTR_API marks (default visibility) and the
# shim's export_name functions.
# shellcheck disable=SC2086
"$cc" --target=wasm32 -nostdlib -Wl,--no-entry -Wl,--export-dynamic \
    -Wl,-z,stack-size=1048576 -o "$outdir/natremia.wasm.tmp" $objs "$tmp/shim.o"
mv "$outdir/natremia.wasm.tmp" "$outdir/natremia.wasm"
echo "built $outdir/natremia.wasm"

# The reference-vector program: the same lib/ objects, the C test code
# linked with wasi-libc (WASI has no tmpfile(); only --check needs it).
if [ "${NATREMIA_REFVECTORS:-yes}" = no ]; then
    :
elif [ -e /usr/lib/wasm32-wasi/libc.a ] || [ -e /usr/lib/wasm32-wasip1/libc.a ] || [ -n "${WASI_SYSROOT:-}" ]; then
    sysroot="${WASI_SYSROOT:-/usr}"
    # Debian 12's wasi-libc is laid out for wasm32-wasi; newer ones may use
    # the preview-1 name.
    triple=wasm32-wasi
    if [ ! -e "$sysroot/lib/wasm32-wasi/libc.a" ] && [ -e "$sysroot/lib/wasm32-wasip1/libc.a" ]; then
        triple=wasm32-wasip1
    fi
    tflags="-std=c99 -O2 -ffp-contract=off --sysroot=$sysroot -I$root/include -I$root/tests/fuzz"
    # shellcheck disable=SC2086
    "$cc" --target=$triple $tflags -Wno-deprecated-declarations \
        -Dtmpfile=refvectors_wasi_tmpfile -o "$outdir/refvectors.wasm.tmp" \
        "$root/tests/refvectors/refvectors.c" "$root/tests/fuzz/ntr_contract.c" \
        "$here/testsupport/wasi_tmpfile.c" $objs
    mv "$outdir/refvectors.wasm.tmp" "$outdir/refvectors.wasm"
    echo "built $outdir/refvectors.wasm"
else
    echo "wasi-libc not found: refvectors.wasm not built (its test will be skipped)"
fi
