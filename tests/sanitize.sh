#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# The test suite under AddressSanitizer + UndefinedBehaviorSanitizer, then
# under valgrind (docs/reliability.md).
#
# 1. A separate build with -Db_sanitize=address,undefined (every UBSan
#    finding fatal) runs every suite whose programs are ours: unit (all
#    areas, the bad-input matrix, the reference vectors), examples and docs,
#    but the cli test (its Python driver cannot load an instrumented
#    library; the same holds for the ThreadSanitizer run below).
#    Left out: 'build' (it inspects the plain library's exports and ABI,
#    which instrumentation changes), 'bindings' (Python and PostgreSQL
#    load the library into uninstrumented processes), and 'fuzz' and
#    'cross' (they make builds of their own: the fuzz driver is already
#    ASan+UBSan, the cross builds run under qemu).
# 2. A plain build runs the unit suite with every test program under
#    valgrind --error-exitcode=1 --leak-check=full.
# 3. A ThreadSanitizer build (-Db_sanitize=thread) runs the unit suite,
#    among it tests/test_threads.c: several threads calling the library at
#    once; any data race is fatal (halt_on_error).
#
# Usage: tests/sanitize.sh [--record] [asan|valgrind|tsan]   (default: all
# three; --record: each mode that passes writes its figures into
# docs/reliability.md, block "sanitize.sh MODE", through
# tests/lib/record_block.py; a mode that fails is recorded as failed, with
# the first lines of what failed, so the page never keeps an older pass)
# Environment: NTR_BUILD_PREFIX (default "build"): build dirs are
# <prefix>-sanitize, <prefix>-valgrind and <prefix>-tsan.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
prefix="${NTR_BUILD_PREFIX:-build}"
record=0
command="tests/sanitize.sh${*:+ $*}"
if [ "${1:-}" = "--record" ]; then
  record=1
  shift
fi
modes=("$@")
[ ${#modes[@]} -eq 0 ] && modes=(asan valgrind tsan)

source tests/lib/build-steps.sh  # quiet, meson_setup_dir
source tests/lib/apt-missing.sh
source tests/lib/record.sh
apt_missing --quiet meson ninja-build pkg-config gcc libcmocka-dev valgrind
stamp="$(mktemp)"
trap 'rm -f "$stamp"' EXIT
record_stamp "$stamp"

# record_mode MODE BUILDDIR SUMMARY: the block of one mode that passed,
# with the tests it ran (meson's own log of that run: testlog.json, or
# testlog-valgrind.json when meson test wraps the programs).
record_mode() {
  [ "$record" -eq 1 ] || return 0
  /usr/bin/python3 - "$(ls -t "$2"/meson-logs/testlog*.json | head -1)" <<'EOF' |
import json, sys
runs = [json.loads(line) for line in open(sys.argv[1], encoding="utf-8") if line.strip()]
print("Tests: " + ", ".join(sorted(r["name"] for r in runs)) + ".")
EOF
    record_write "sanitize.sh $1" tests/sanitize.sh "$command" "$3" \
      "Sanitizers and valgrind" "$stamp"
}

# record_failed MODE WHAT LOG PATTERN: the block of a mode that failed:
# WHAT, then the first lines of LOG matching PATTERN.
record_failed() {
  [ "$record" -eq 1 ] || return 0
  {
    echo "First lines of the failure:"
    echo
    grep -E "$4" "$3" | head -8 | sed 's/`/'"'"'/g; s/^[[:space:]]*//; s/^/- `/; s/$/`/'
  } | record_write "sanitize.sh $1" tests/sanitize.sh "$command" "$2" \
        "Sanitizers and valgrind" "$stamp"
}

# instrumented_tests DIR SUITE...: the names of the tests of those suites
# whose programs can run an instrumented library: all but 'cli', whose
# Python driver loads the library into an uninstrumented interpreter
# (ASan wants to be loaded first; TSan's runtime does not fit in the static
# TLS of a library loaded late).
instrumented_tests() {
  local d="$1"
  shift
  meson introspect --tests "$d" | /usr/bin/python3 -c '
import json, sys
want = set(sys.argv[1:])
for t in json.load(sys.stdin):
    if want & set(s.split(":")[-1] for s in t["suite"]) and t["name"] != "cli":
        print(t["name"])' "$@"
}

# build_mode MODE DIR: the build of a mode; a failed build is reported (and
# recorded) and the mode counts as failed.
build_mode() {
  if ! ninja -C "$2" >"$2/build.log" 2>&1; then
    grep -E 'error:|FAILED' "$2/build.log" | head -20
    echo "sanitize.sh: $1: the build FAILED (log: $2/build.log)"
    record_failed "$1" "$1: FAILED, the build did not finish ($(gcc -dumpfullversion)) [$((SECONDS - start))s]" \
      "$2/build.log" 'error:'
    return 1
  fi
}

status=0
for m in "${modes[@]}"; do
  start=$SECONDS
  case "$m" in
  asan)
    dir="$prefix-sanitize"
    quiet meson_setup_dir "$dir" -Db_sanitize=address,undefined -Db_lundef=false -Dbuildtype=debugoptimized
    build_mode asan "$dir" || { status=1; continue; }
    if ASAN_OPTIONS=detect_leaks=1:abort_on_error=1:strict_string_checks=1:detect_stack_use_after_return=1 \
       UBSAN_OPTIONS=halt_on_error=1:print_stacktrace=1 \
       meson test -C "$dir" $(instrumented_tests "$dir" unit examples docs) --num-processes 2 \
         --print-errorlogs >"$dir/sanitize.log" 2>&1; then
      echo "sanitize.sh: ASan+UBSan: $(grep -E '^Ok:' "$dir/sanitize.log" | tr -s ' ') tests, no report [$((SECONDS - start))s]"
      record_mode asan "$dir" \
        "ASan + UBSan ($(gcc -dumpfullversion)), suites unit (but cli), examples and docs: $(meson_counts "$dir/sanitize.log"), no report [$((SECONDS - start))s with the build]"
    else
      grep -E 'ERROR|runtime error|FAIL' "$dir/sanitize.log" | head -20
      echo "sanitize.sh: ASan+UBSan FAILED (log: $dir/sanitize.log)"
      record_failed asan "ASan + UBSan: FAILED [$((SECONDS - start))s]" "$dir/sanitize.log" 'ERROR|runtime error|FAIL'
      status=1
    fi
    ;;
  valgrind)
    dir="$prefix-valgrind"
    quiet meson_setup_dir "$dir" -Dbuildtype=debugoptimized
    build_mode valgrind "$dir" || { status=1; continue; }
    if meson test -C "$dir" --suite unit --num-processes 2 --timeout-multiplier 10 \
         --wrap='valgrind --error-exitcode=1 --leak-check=full --errors-for-leak-kinds=definite,indirect --quiet' \
         --print-errorlogs >"$dir/valgrind.log" 2>&1; then
      echo "sanitize.sh: valgrind: $(grep -E '^Ok:' "$dir/valgrind.log" | tr -s ' ') tests, no error [$((SECONDS - start))s]"
      record_mode valgrind "$dir" \
        "$(valgrind --version) --leak-check=full, unit suite: $(meson_counts "$dir/valgrind.log"), no error [$((SECONDS - start))s with the build]"
    else
      grep -E '==[0-9]+==|FAIL' "$dir/valgrind.log" | head -20
      echo "sanitize.sh: valgrind FAILED (log: $dir/valgrind.log)"
      record_failed valgrind "valgrind: FAILED [$((SECONDS - start))s]" "$dir/valgrind.log" '==[0-9]+==|FAIL'
      status=1
    fi
    ;;
  tsan)
    # lib/meson.build drops -Wl,-z,defs when b_sanitize is set: the
    # library's __tsan_* references resolve in the executable.
    dir="$prefix-tsan"
    quiet meson_setup_dir "$dir" -Db_sanitize=thread -Db_lundef=false -Dbuildtype=debugoptimized
    build_mode tsan "$dir" || { status=1; continue; }
    if TSAN_OPTIONS=halt_on_error=1:second_deadlock_stack=1 \
       meson test -C "$dir" $(instrumented_tests "$dir" unit) --num-processes 2 --timeout-multiplier 4 \
         --print-errorlogs >"$dir/tsan.log" 2>&1; then
      echo "sanitize.sh: ThreadSanitizer: $(grep -E '^Ok:' "$dir/tsan.log" | tr -s ' ') tests (threads among them), no race [$((SECONDS - start))s]"
      record_mode tsan "$dir" \
        "ThreadSanitizer ($(gcc -dumpfullversion)), unit suite (but cli) with the threads test: $(meson_counts "$dir/tsan.log"), no race [$((SECONDS - start))s with the build]"
    else
      grep -E 'WARNING: ThreadSanitizer|SUMMARY|FAIL' "$dir/tsan.log" | head -20
      echo "sanitize.sh: ThreadSanitizer FAILED (log: $dir/tsan.log)"
      record_failed tsan "ThreadSanitizer: FAILED [$((SECONDS - start))s]" "$dir/tsan.log" 'WARNING: ThreadSanitizer|SUMMARY|FAIL'
      status=1
    fi
    ;;
  *) echo "sanitize.sh: unknown mode $m" >&2; exit 2 ;;
  esac
done
exit $status
