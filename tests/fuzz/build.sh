#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Build the libFuzzer driver with clang, AddressSanitizer and
# UndefinedBehaviorSanitizer (every UB check fatal), plus implicit integer
# conversions (the library must never truncate silently).
# NTR_FUZZ_EXTRA_SANITIZE replaces the extra checks (default
# ",implicit-conversion"); ",float-divide-by-zero,implicit-conversion" also
# traps IEEE division by zero. That one is off by default: the batch entry
# points evaluate every row without data-dependent branches and discard
# the result of a rejected row, which IEEE 754 defines but which raises the
# divide-by-zero flag (docs/reliability.md, "Floating-point exceptions"). Warnings are shown but
# not fatal here: the meson build (gcc, -Werror) owns the warning policy,
# and clang warns about a few things gcc accepts (unused static inline).
# Usage: tests/fuzz/build.sh OUTDIR   -> OUTDIR/fuzz_natremia
set -euo pipefail
root="$(cd "$(dirname "$0")/../.." && pwd)"
out="${1:?usage: build.sh OUTDIR}"
mkdir -p "$out"
cc="${NTR_FUZZ_CC:-clang}"
"$cc" ${NTR_FUZZ_CFLAGS:-} -std=c99 -g -O1 -fno-omit-frame-pointer -ffp-contract=off \
  -Wall -Wextra -Wpedantic \
  -fsanitize=fuzzer,address,undefined${NTR_FUZZ_EXTRA_SANITIZE-,implicit-conversion} \
  -fno-sanitize-recover=all \
  -I"$root/include" -I"$root/lib" -I"$root/tests/fuzz" \
  "$root"/lib/*.c "$root/tests/fuzz/ntr_contract.c" "$root/tests/fuzz/fuzz_natremia.c" \
  -lm -o "$out/fuzz_natremia"
echo "built $out/fuzz_natremia"
