#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Write one seed input per entry point of the fuzz driver FUZZER into DIR:
# the selector byte followed by zeros, which decodes to a call with in-range
# arguments (see rd_number/rd_enum in tests/fuzz/fuzz_natremia.c).
# Prints the number of entry points.
set -euo pipefail
fuzzer="${1:?usage: seeds.sh FUZZER DIR}"
dir="${2:?usage: seeds.sh FUZZER DIR}"
mkdir -p "$dir"
n=$(NTR_FUZZ_PRINT_ENTRIES=1 "$fuzzer")
for i in $(seq 0 $((n - 1))); do
  { printf "\\$(printf %03o "$i")"; head -c 40 /dev/zero; } > "$dir/seed-$i"
done
echo "$n"
