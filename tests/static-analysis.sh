#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Static analysis of lib/ (docs/reliability.md): cppcheck and clang-tidy
# must both be clean. Fails on any finding that is not in the reviewed
# list below.
#
# Checks: cppcheck --enable=warning,style,performance,portability (C99);
# clang-tidy with clang-analyzer-* (path-sensitive: NULL dereference,
# uninitialised reads, dead stores, ...), bugprone-*, cert-*, misc-*,
# performance-* and portability-*. Left out:
#   bugprone-easily-swappable-parameters  every formula takes several
#       doubles in a row by design (units are in the parameter names);
#   cert-err33-c and misc-unused-parameters do not apply (the library
#       calls no function whose result it could ignore; none unused).
#
# Reviewed false positives (each names file and check; the script prints
# how many it suppressed). Add one only with a comment saying why the
# finding cannot happen.
#
# Usage: tests/static-analysis.sh [--record]   (--record: the run's figures,
# and any finding, go into docs/reliability.md, block "static-analysis.sh",
# through tests/lib/record_block.py)   Environment: NTR_BUILD_PREFIX
# (default "build"): compile commands come from <prefix>-analysis.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
record=0
command="tests/static-analysis.sh${*:+ $*}"
if [ "${1:-}" = "--record" ]; then
  record=1
  shift
fi
start=$SECONDS
dir="${NTR_BUILD_PREFIX:-build}-analysis"

source tests/lib/build-steps.sh  # quiet, meson_setup_dir
source tests/lib/apt-missing.sh
source tests/lib/record.sh
apt_missing --quiet meson ninja-build gcc cppcheck clang-tidy
stamp="/tmp/ntr-analysis-stamp.$$"
found="/tmp/ntr-analysis-found.$$"
trap 'rm -f "$stamp" "$found"' EXIT
: >"$found"
record_stamp "$stamp"

# cppcheck suppressions: id:file
cppcheck_suppress=(
  # infusion.c: the index is checked by "fluid < 1 || (size_t)fluid >= N"
  # just above; cppcheck 2.10 does not follow the cast in the second half.
  "arrayIndexOutOfBoundsCond:lib/infusion.c"
  # units.c ntr_convert: the same pattern ("analyte < 1 || (size_t)analyte
  # >= N_ANALYTES" guards the index).
  "arrayIndexOutOfBoundsCond:lib/units.c"
  # solute.c kind_of: the same pattern again ("solute < 1 || (size_t)solute
  # >= N_SOLUTE_KINDS" returns NULL before the index).
  "arrayIndexOutOfBoundsCond:lib/solute.c"
  # feedback.c solve3: the forward substitution reads y[k] only for k < i,
  # each written at the end of an earlier pass of the same loop; cppcheck
  # 2.10 does not follow the loop. (clang-tidy's path-sensitive
  # clang-analyzer-core uninitialised-read checks still cover the file.)
  "uninitvar:lib/feedback.c"
)
# clang-tidy suppressions: file:check
tidy_suppress=(
  # balance.c ntr_balance_course: series may be NULL only with capacity 0,
  # and the grid always has at least 2 points, so the capacity check
  # returns before any write; the analyzer does not know grid_count() >= 1.
  "lib/balance.c:clang-analyzer-core.NullDereference"
  # batch.c body-water fraction table: the index adult*(1 + 2*female +
  # elderly) is built from three 0/1 flags, so it is 0 to 4 and the int
  # product cannot overflow before it widens.
  "lib/batch.c:bugprone-implicit-widening-of-multiplication-result"
)

status=0
supp_args=()
for s in "${cppcheck_suppress[@]}"; do supp_args+=("--suppress=$s"); done
if cppcheck --std=c99 --enable=warning,style,performance,portability --inline-suppr \
     --error-exitcode=1 -q --suppress=missingIncludeSystem "${supp_args[@]}" \
     -I include -I lib lib/*.c >"/tmp/ntr-cppcheck.$$" 2>&1; then
  echo "static-analysis.sh: cppcheck clean on $(ls lib/*.c | wc -l) files (${#cppcheck_suppress[@]} reviewed false positive(s) suppressed)"
else
  cat "/tmp/ntr-cppcheck.$$"
  echo "static-analysis.sh: cppcheck FAILED"
  grep -E '^[^ ]+:[0-9]+:[0-9]+: (error|warning|style|performance|portability): ' "/tmp/ntr-cppcheck.$$" |
    sed 's/^/cppcheck /' >>"$found" || true
  status=1
fi
rm -f "/tmp/ntr-cppcheck.$$"

if [ ! -f "$dir/compile_commands.json" ]; then
  rm -rf "$dir"
  quiet meson setup "$dir"
fi
checks='-*,clang-analyzer-*,bugprone-*,-bugprone-easily-swappable-parameters,cert-*,-cert-err33-c,misc-*,-misc-unused-parameters,performance-*,portability-*'
findings=0
suppressed=0
for f in lib/*.c; do
  out=$(clang-tidy -p "$dir" --quiet --checks="$checks" "$f" 2>/dev/null || true)
  while IFS= read -r line; do
    [ -z "$line" ] && continue
    check=$(sed -n 's/.*\[\([^]]*\)\]$/\1/p' <<<"$line")
    skip=0
    for s in "${tidy_suppress[@]}"; do
      [ "$s" = "$f:$check" ] && skip=1
    done
    if [ $skip -eq 1 ]; then
      suppressed=$((suppressed + 1))
    else
      echo "$line"
      echo "clang-tidy $line" >>"$found"
      findings=$((findings + 1))
    fi
  done < <(grep -E '(warning|error):' <<<"$out" || true)
done
if [ $findings -eq 0 ]; then
  echo "static-analysis.sh: clang-tidy clean on $(ls lib/*.c | wc -l) files ($suppressed reviewed false positive(s) suppressed)"
else
  echo "static-analysis.sh: clang-tidy FAILED ($findings finding(s))"
  status=1
fi
if [ "$record" -eq 1 ]; then
  files=$(ls lib/*.c | wc -l)
  n_cpp=$(grep -c '^cppcheck ' "$found" || true)
  n_tidy=$(grep -c '^clang-tidy ' "$found" || true)
  {
    echo "| tool | files | findings | reviewed false positives suppressed |"
    echo "|---|---|---|---|"
    echo "| $(cppcheck --version) | $files | $n_cpp | ${#cppcheck_suppress[@]} |"
    echo "| clang-tidy $(clang-tidy --version | sed -n 's/.*LLVM version \([0-9.]*\).*/\1/p' | head -1) | $files | $n_tidy | $suppressed |"
    if [ -s "$found" ]; then
      echo
      echo "Findings (not reviewed yet):"
      echo
      bt='`'
      sed -e "s|$root/||g" -e 's|[^ ]*\.\./lib/|lib/|' -e "s/$bt/'/g" -e "s/^\([^ ]*\) \(.*\)\$/- \1: $bt\2$bt/" "$found"
    fi
  } | record_write static-analysis.sh tests/static-analysis.sh "$command" \
        "$( [ $status -eq 0 ] && echo "cppcheck and clang-tidy clean on lib/*.c" || echo "FAILED: $((n_cpp + n_tidy)) finding(s) on lib/*.c") [$((SECONDS - start))s]" \
        "Static analysis" "$stamp"
fi
exit $status
