#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# ABI guard: compares the freshly built shared library with the committed
# baseline in tests/abi/ and fails on ANY difference, compatible or not,
# so that every change to the public interface is a deliberate, reviewed
# step (see DEVELOPERS.md and tests/update-abi-baseline.sh).
#
#   check_abi.sh <libnatremia.so> <baseline-dir> <include-dir>           check
#   check_abi.sh --update <libnatremia.so> <baseline-dir> <include-dir>  rewrite
#
# Two baselines are kept (and a frozen copy of the 1.0.0 pair in
# tests/abi/1.0.0/, against which only additions are allowed):
#   natremia.abi     abidw's description of the exported functions and the
#                    public types they use (only types declared in
#                    include/ count, through --headers-dir). abidiff compares
#                    it with the fresh library; its exit status is non-zero
#                    for added, removed or changed functions and types.
#   natremia.macros  every NTR_* macro of the public header with its value.
#                    Status codes, unit, analyte, method and other
#                    enumerators are macros, which abidiff cannot see, yet
#                    their values are ABI too.
#
# Needs abigail-tools (abidw, abidiff) and a library built with debug
# information (-g; the project's default buildtype debugoptimized has it).
# Exit status: 0 identical, 1 changed or cannot check, 77 skipped (the
# baseline was made for another architecture).
set -euo pipefail

mode=check
if [[ "${1:-}" == "--update" ]]; then
    mode=update
    shift
fi
if [[ $# -ne 3 ]]; then
    echo "usage: $0 [--update] <libnatremia.so> <baseline-dir> <include-dir>" >&2
    exit 1
fi
lib=$1
baseline_dir=$2
include_dir=$3
header=$include_dir/natremia.h

for tool in abidw abidiff readelf; do
    if ! command -v "$tool" >/dev/null 2>&1; then
        echo "check_abi: $tool not found; install it: apt-get install abigail-tools binutils" >&2
        exit 1
    fi
done
if ! readelf -S -W "$lib" | grep -q '\.debug_info'; then
    echo "check_abi: $lib has no debug information, so its types cannot be compared." >&2
    echo "check_abi: configure the build with -Ddebug=true (buildtype debugoptimized, the default)." >&2
    exit 1
fi

work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT

# Options chosen so that the description depends only on the interface:
# no paths of the build machine, no source line numbers.
abidw --no-corpus-path --no-comp-dir-path --no-show-locs \
    --headers-dir "$include_dir" --out-file "$work/natremia.abi" "$lib"

# NTR_API and NTR_MUST_CHECK expand to compiler-specific attributes, so they
# are left out.
${CC:-cc} -std=c99 -dM -E -x c "$header" \
    | grep -E '^#define NTR_' | grep -v -E '^#define (NTR_API|NTR_MUST_CHECK) ' \
    | LC_ALL=C sort > "$work/natremia.macros"

if [[ "$mode" == update ]]; then
    mkdir -p "$baseline_dir"
    cp "$work/natremia.abi" "$baseline_dir/natremia.abi"
    cp "$work/natremia.macros" "$baseline_dir/natremia.macros"
    echo "check_abi: baseline written to $baseline_dir (natremia.abi, natremia.macros)"
    exit 0
fi

for f in natremia.abi natremia.macros; do
    if [[ ! -f "$baseline_dir/$f" ]]; then
        echo "check_abi: no baseline $baseline_dir/$f; create it with tests/update-abi-baseline.sh" >&2
        exit 1
    fi
done

arch_of() { grep -o -m1 "architecture='[^']*'" "$1" || true; }
if [[ "$(arch_of "$baseline_dir/natremia.abi")" != "$(arch_of "$work/natremia.abi")" ]]; then
    echo "check_abi: baseline is for $(arch_of "$baseline_dir/natremia.abi"), this build is" \
         "$(arch_of "$work/natremia.abi"); the ABI is only compared on the baseline's architecture."
    exit 77
fi

status=0
abi_rc=0
abidiff "$baseline_dir/natremia.abi" "$work/natremia.abi" > "$work/abidiff.txt" 2>&1 || abi_rc=$?
if [[ $abi_rc -ne 0 ]]; then
    echo "FAIL: abidiff reports a change (exit status $abi_rc):"
    cat "$work/abidiff.txt"
    status=1
else
    echo "OK: abidiff finds no change in functions or types"
fi

if ! diff -u "$baseline_dir/natremia.macros" "$work/natremia.macros" > "$work/macros.diff"; then
    echo "FAIL: public NTR_* macros differ from the baseline (- baseline, + now):"
    cat "$work/macros.diff"
    status=1
else
    echo "OK: $(wc -l < "$work/natremia.macros") public NTR_* macros unchanged"
fi

# ---- against the first release: additions only -------------------------
# tests/abi/1.0.0/ is frozen. Every 1.0.0 function and type must be there
# unchanged (abidiff with added symbols ignored finds nothing), and every
# 1.0.0 macro keeps its value; only the version numbers may move on.
released=$baseline_dir/1.0.0
if [[ -d "$released" ]]; then
    rel_rc=0
    abidiff --no-added-syms "$released/natremia.abi" "$work/natremia.abi" \
        > "$work/released.txt" 2>&1 || rel_rc=$?
    if [[ $rel_rc -ne 0 ]]; then
        echo "FAIL: against 1.0.0, something other than an addition changed (exit status $rel_rc):"
        cat "$work/released.txt"
        status=1
    else
        added=$(abidiff --added-fns "$released/natremia.abi" "$work/natremia.abi" 2>/dev/null \
                | grep -cE "^  \[A\] 'function" || true)
        echo "OK: against 1.0.0, additions only ($added functions added)"
    fi
    # The version macros are the only 1.0.0 macros allowed to change value.
    version_macro='^#define NTR_VERSION_(MINOR|PATCH) '
    missing=$(LC_ALL=C comm -23 <(grep -vE "$version_macro" "$released/natremia.macros") \
                                 "$work/natremia.macros")
    if [[ -n "$missing" ]]; then
        echo "FAIL: 1.0.0 macros removed or changed in value:"
        echo "$missing"
        status=1
    else
        echo "OK: all $(grep -cvE "$version_macro" "$released/natremia.macros") 1.0.0 macros keep their values"
    fi
fi

if [[ $status -ne 0 ]]; then
    echo
    echo "If (and only if) the change is a deliberate, compatible addition, regenerate"
    echo "the baseline with 'bash tests/update-abi-baseline.sh' and commit tests/abi/."
    echo "Removing or changing anything released is an ABI break (see DEVELOPERS.md)."
fi
exit $status
