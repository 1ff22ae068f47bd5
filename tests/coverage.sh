#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Coverage of lib/ with gcovr, enforced: 100% of lines and at least 95% of
# branches (docs/reliability.md). Builds with -Db_coverage=true (no
# optimisation, so lines map one to one), runs the unit suite (every
# area's tests, the bad-input matrix, the reference vectors) and the
# examples, then asks gcovr for lib/ only. Branches the compiler adds and
# that no input can take (gcovr --exclude-unreachable-branches) are not
# counted. Where coverage falls short, add cases to tests/test_badinput.c
# or a tests/test_coverage_<area>.c, never exclusions.
#
# Usage: tests/coverage.sh [--record]   (--record: a run that meets both
# limits writes its figures into docs/reliability.md, block "coverage.sh",
# through tests/lib/record_block.py)   Environment: NTR_BUILD_PREFIX (default
# "build"): the build dirs are <prefix>-coverage and <prefix>-coverage-size;
# the report is written to <prefix>-coverage/coverage.txt (per file, with
# uncovered lines).
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
record=0
command="tests/coverage.sh${*:+ $*}"
if [ "${1:-}" = "--record" ]; then
  record=1
  shift
fi
start=$SECONDS
dir="${NTR_BUILD_PREFIX:-build}-coverage"
line_min="${NTR_COVERAGE_LINES:-100}"
branch_min="${NTR_COVERAGE_BRANCHES:-95}"

source tests/lib/build-steps.sh  # quiet, meson_setup_dir
source tests/lib/apt-missing.sh
source tests/lib/record.sh
apt_missing --quiet meson ninja-build gcc libcmocka-dev gcovr
mkdir -p "$dir"
record_stamp "$dir/record-stamp.json"

# Two configurations, because the library compiles some checks differently
# when built for size (__OPTIMIZE_SIZE__, as firmware is: one shared range
# check, the full limits check): a debug build, and a debug build with
# __OPTIMIZE_SIZE__ defined by hand, so both paths are measured with exact
# line numbers (no optimisation in either). gcovr merges the two.
run_config() { # builddir extra-c-args
  local d="$1"
  # Atomic counters: tests/test_threads.c runs the library on several
  # threads at once, and plain counters lose increments (gcov then reads
  # negative branch counts and gcovr stops).
  quiet meson_setup_dir "$d" -Db_coverage=true -Dbuildtype=debug -Dc_args="$2 -fprofile-update=atomic"
  # meson 1.0 keeps a build dir's former c_args on setup --reconfigure.
  quiet meson configure "$d" -Dc_args="$2 -fprofile-update=atomic"
  quiet ninja -C "$d"
  find "$d" -name '*.gcda' -delete
  # Atomic counters at -O0 slow the heaviest programs several times over.
  meson test -C "$d" --suite unit --suite examples --num-processes 2 --timeout-multiplier 5 \
    >"$d/coverage-tests.log" 2>&1 ||
    echo "coverage.sh: note: some tests failed in $d (see $d/coverage-tests.log); coverage counts what ran"
  gcovr --root "$root" --object-directory "$d" --filter "$root/lib/" "$d" \
    --exclude-unreachable-branches --json "$d/coverage.json" >/dev/null
  # The two configurations define some functions at different lines
  # (batch.c has a size-optimised body for each), which gcovr 5 cannot
  # merge; lines and branches are what is enforced, so drop the function
  # records before merging.
  /usr/bin/python3 - "$d/coverage.json" <<'EOF'
import json, sys
path = sys.argv[1]
with open(path, encoding="utf-8") as f:
    data = json.load(f)
for record in data.get("files", []):
    record["functions"] = []
with open(path, "w", encoding="utf-8") as f:
    json.dump(data, f)
EOF
}
run_config "$dir" ""
run_config "$dir-size" "-D__OPTIMIZE_SIZE__=1"
gcovr --root "$root" --add-tracefile "$dir/coverage.json" --add-tracefile "$dir-size/coverage.json" \
  --txt "$dir/coverage.txt" --print-summary >"$dir/coverage-summary.txt"
cat "$dir/coverage-summary.txt"
gcovr --root "$root" --add-tracefile "$dir/coverage.json" --add-tracefile "$dir-size/coverage.json" \
  --branches --txt "$dir/coverage-branches.txt" >/dev/null
lines=$(sed -n 's/^lines: *\([0-9.]*\)%.*/\1/p' "$dir/coverage-summary.txt")
branches=$(sed -n 's/^branches: *\([0-9.]*\)%.*/\1/p' "$dir/coverage-summary.txt")
met=no
if awk -v l="$lines" -v b="$branches" -v lm="$line_min" -v bm="$branch_min" 'BEGIN{exit !(l >= lm && b >= bm)}'; then
  met=yes
fi
if [ "$record" -eq 1 ]; then
  # A run that misses the limits is recorded too, with what it missed: the
  # page must not keep an older, better figure.
  # "lines: 100.0% (1965 out of 1965)" -> "1965 of 1965"
  of() { sed -n "s/^$1: *[0-9.]*% (\([0-9]*\) out of \([0-9]*\)).*/\1 of \2/p" "$dir/coverage-summary.txt"; }
  {
    printf '| | covered | required |\n|---|---|---|\n| lines | **%s %%** (%s) | %s %% |\n| branches | **%s %%** (%s) | %s %% |\n' \
      "$lines" "$(of lines)" "$line_min" "$branches" "$(of branches)" "$branch_min"
    if [ "$met" = no ]; then
      echo
      echo "Limits not met."
      if awk '/^lib\// && $5 != "" { found = 1 } END { exit !found }' "$dir/coverage.txt"; then
        echo
        echo "Lines not run (gcovr's report):"
        echo
        awk '/^lib\// && $5 != "" { printf "- `%s`: %s\n", $1, $5 }' "$dir/coverage.txt"
      fi
      echo
      echo "Branches per file below 100 % (gcovr --branches: taken of all):"
      echo
      awk '/^lib\// && $4 != "100%" { printf "- `%s`: %s of %s (%s)\n", $1, $3, $2, $4 }' "$dir/coverage-branches.txt"
    fi
  } | record_write coverage.sh tests/coverage.sh "$command" \
      "lib/ under $(gcovr --version | head -1), a debug build and one with \`__OPTIMIZE_SIZE__\` merged, unit suite and examples: limits $( [ "$met" = yes ] && echo met || echo NOT met) [$((SECONDS - start))s]" \
      Coverage "$dir/record-stamp.json"
fi
if [ "$met" = yes ]; then
  echo "coverage.sh: lib/ lines ${lines}% (>= ${line_min}), branches ${branches}% (>= ${branch_min})"
else
  grep -E '^lib/' "$dir/coverage.txt" | awk '$4 != "100%" || $7 != "100%"' | head -40
  echo "coverage.sh: FAILED: lib/ lines ${lines}% (need ${line_min}), branches ${branches}% (need ${branch_min}); report: $dir/coverage.txt"
  exit 1
fi
