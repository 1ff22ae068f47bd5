#!/usr/bin/env bash
# Build the libFuzzer driver with clang, AddressSanitizer and
# UndefinedBehaviorSanitizer (every UB check fatal; float division by zero
# and implicit integer conversions are checked too, since the library must
# never produce an infinity or truncate silently).
# Usage: tests/fuzz/build.sh OUTDIR   -> OUTDIR/fuzz_natremia
set -euo pipefail
root="$(cd "$(dirname "$0")/../.." && pwd)"
out="${1:?usage: build.sh OUTDIR}"
mkdir -p "$out"
cc="${NTR_FUZZ_CC:-clang}"
"$cc" ${NTR_FUZZ_CFLAGS:-} -std=c99 -g -O1 -fno-omit-frame-pointer -ffp-contract=off \
  -Wall -Wextra -Wpedantic -Werror \
  -fsanitize=fuzzer,address,undefined${NTR_FUZZ_EXTRA_SANITIZE-,float-divide-by-zero,implicit-conversion} \
  -fno-sanitize-recover=all \
  -I"$root/include" -I"$root/lib" -I"$root/tests/fuzz" \
  "$root"/lib/*.c "$root/tests/fuzz/ntr_contract.c" "$root/tests/fuzz/fuzz_natremia.c" \
  -lm -o "$out/fuzz_natremia"
echo "built $out/fuzz_natremia"
