#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Short fuzzing run (part of tests/run-all.sh): builds the libFuzzer driver
# tests/fuzz/fuzz_natremia.c with ASan+UBSan and runs it for a few seconds
# per public function, starting from one seed per function so every entry
# point is reached from the first second. Fails on any contract breach or
# sanitizer report. Figures for long runs: tests/fuzz-long.sh,
# docs/reliability.md.
#
# Registered as the meson test 'fuzz-short' (suite 'fuzz'), so the README
# test command runs it; exits 77 (skipped) when clang or its fuzzer runtime
# is missing.
#
# Usage: tests/fuzz-short.sh [--record]   (--record, when run by hand: a
# run without finding writes its figures into docs/reliability.md, block
# "fuzz-short.sh", through tests/lib/record_block.py)
# Environment: NTR_FUZZ_OUT names the build dir (default
# <NTR_BUILD_PREFIX or "build">-fuzz); NTR_FUZZ_SECONDS_PER_TARGET
# (default 1) sets the budget per entry point.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
record=0
command="tests/fuzz-short.sh${*:+ $*}"
if [ "${1:-}" = "--record" ]; then
  record=1
  shift
fi
start=$SECONDS
out="${NTR_FUZZ_OUT:-${NTR_BUILD_PREFIX:-build}-fuzz}"
per="${NTR_FUZZ_SECONDS_PER_TARGET:-1}"

if ! command -v "${NTR_FUZZ_CC:-clang}" >/dev/null 2>&1 ||
   ! echo 'int LLVMFuzzerTestOneInput(const char *d, unsigned long n){(void)d;(void)n;return 0;}' |
     "${NTR_FUZZ_CC:-clang}" -x c -fsanitize=fuzzer,address,undefined - -o /dev/null >/dev/null 2>&1; then
  echo "fuzz-short: clang with libFuzzer not available (apt-get install clang libclang-rt-14-dev): skipped"
  exit 77
fi
mkdir -p "$out"
source tests/lib/record.sh
record_stamp "$out/record-stamp.json"

tests/fuzz/build.sh "$out" >"$out/build.log" 2>&1 || { cat "$out/build.log"; exit 1; }
corpus="$out/corpus-short"
rm -rf "$corpus" && mkdir -p "$corpus"
n_seeds=$(tests/fuzz/seeds.sh "$out/fuzz_natremia" "$corpus")
total=$(( per * n_seeds ))
[ "$total" -lt 10 ] && total=10

log="$out/fuzz-short.log"
echo "fuzz-short: $n_seeds entry points, ${total}s, seed 1"
if ! "$out/fuzz_natremia" -max_total_time="$total" -seed=1 -print_final_stats=1 \
      -timeout=10 -rss_limit_mb=1024 -artifact_prefix="$out/" "$corpus" >"$log" 2>&1; then
  tail -n 40 "$log"
  echo "fuzz-short: FAILED (crash input saved under $out/)"
  exit 1
fi
runs=$(sed -n 's/^stat::number_of_executed_units: *//p' "$log")
echo "fuzz-short: ${runs} executions in ${total}s, no contract breach, no sanitizer report"
if [ "$record" -eq 1 ]; then
  cc_version=$("${NTR_FUZZ_CC:-clang}" --version | head -1)
  echo "| entry points | seconds each | seed | executions | fuzzing time | findings |
|---|---|---|---|---|---|
| $n_seeds | $per | 1 | $runs | ${total} s | none |" |
    record_write fuzz-short.sh tests/fuzz-short.sh "$command" \
      "libFuzzer driver tests/fuzz/fuzz_natremia.c built by $cc_version, ASan + UBSan, one seed per entry point [$((SECONDS - start))s with the build]" \
      Fuzzing "$out/record-stamp.json"
fi
