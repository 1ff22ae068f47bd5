#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Subproject test: a consumer project (tests/consumers/meson-subproject/)
# with this source tree as subprojects/natremia, in a scratch directory.
# Checks that
#   - dependency('natremia', fallback : 'natremia') resolves through
#     natremia's meson.override_dependency, and the consumer builds and
#     passes its test;
#   - as a subproject natremia registers no test, builds no benchmark,
#     example, fuzzer or manual: its only targets are the library itself
#     (shared and static);
#   - its options still switch those parts on when a parent asks
#     (-Dnatremia:benchmarks=enabled, and -Dnatremia:tests=enabled when
#     cmocka is installed), so the check above can fail.
#
#   check_meson_subproject.sh <build-dir> <source-dir>
#
# --force-fallback-for=natremia keeps an installed natremia.pc on the
# machine from being used instead of the subproject.
set -euo pipefail

if [[ $# -ne 2 ]]; then
    echo "usage: $0 <build-dir> <source-dir>" >&2
    exit 1
fi
builddir=$(cd "$1" && pwd)
srcdir=$(cd "$2" && pwd)
for tool in meson ninja; do
    command -v "$tool" >/dev/null 2>&1 || { echo "check_meson_subproject: $tool not found" >&2; exit 1; }
done

work=$(mktemp -d "$builddir/check-subproject.XXXXXX")
trap 'rm -rf "$work"' EXIT
failures=0
fail() { echo "FAIL: $*"; failures=$((failures + 1)); }
ok() { echo "OK: $*"; }

parent=$work/parent
cp -r "$srcdir/tests/consumers/meson-subproject" "$parent"
mkdir "$parent/subprojects"
ln -s "$srcdir" "$parent/subprojects/natremia"

# Prints, from `meson introspect` of build directory $1, one line per test
# ("project: name") or per target of natremia ("type name").
introspect() {
    meson introspect "$2" "$1" | /usr/bin/python3 -c '
import json, sys
items = json.load(sys.stdin)
if sys.argv[1] == "--tests":
    for t in items:
        print("%s: %s" % (t["suite"][0].split(":")[0], t["name"]))
else:
    for t in items:
        if t["subproject"] == "natremia":
            print("%s %s" % (t["type"], t["name"]))' "$2"
}

# ---- defaults: natremia as a plain subproject
if ! meson setup "$work/b" "$parent" --force-fallback-for=natremia \
        > "$work/setup.log" 2>&1; then
    cat "$work/setup.log"
    echo "FAIL: the consumer project did not configure with natremia as a subproject"
    exit 1
fi
grep -Eq "^Dependency natremia found: YES [0-9.]+ \(overridden\)" "$work/setup.log" \
    && ok "dependency('natremia') found the subproject (override_dependency)" \
    || { cat "$work/setup.log"; fail "dependency('natremia') did not come from the subproject"; }

tests=$(introspect "$work/b" --tests)
echo "tests registered in the parent:"; sed 's/^/    /' <<< "$tests"
[[ $tests == "natremia-consumer: consumer" ]] \
    && ok "only the consumer's own test is registered" \
    || fail "natremia registers tests in the parent"
targets=$(introspect "$work/b" --targets | sort)
echo "natremia's targets in the parent:"; sed 's/^/    /' <<< "$targets"
[[ $targets == $'shared library natremia\nstatic library natremia' ]] \
    && ok "natremia builds only its library (no benchmark, example, fuzzer or manual)" \
    || fail "natremia builds more than its library as a subproject"

if ninja -C "$work/b" -j 2 > "$work/build.log" 2>&1 && meson test -C "$work/b" > "$work/test.log" 2>&1; then
    ok "consumer built and its test passed"
else
    cat "$work/build.log" "$work/test.log"
    meson test -C "$work/b" --print-errorlogs 2>&1 | tail -20 || true
    fail "consumer did not build or its test failed"
fi
ran=$(/usr/bin/python3 -c '
import json, sys
for line in open(sys.argv[1]):
    t = json.loads(line)
    print("%s %s" % (t["name"], t["result"]))' "$work/b/meson-logs/testlog.json" 2>/dev/null || true)
[[ $ran == "consumer OK" ]] && ok "the parent ran one test: consumer OK" \
    || fail "the parent's test run was '$ran', not 'consumer OK'"

# ---- the options still work from the parent (configure only)
asked=(-Dnatremia:benchmarks=enabled)
want_test=""
if pkg-config --exists cmocka 2>/dev/null; then
    asked+=(-Dnatremia:tests=enabled)
    want_test="natremia: osmolality"
else
    echo "cmocka not installed: only -Dnatremia:benchmarks=enabled is tried"
fi
if meson setup "$work/b2" "$parent" --force-fallback-for=natremia "${asked[@]}" \
        > "$work/setup2.log" 2>&1; then
    targets2=$(introspect "$work/b2" --targets)
    tests2=$(introspect "$work/b2" --tests)
    grep -qx "executable bench_scalar" <<< "$targets2" \
        && ok "-Dnatremia:benchmarks=enabled builds the benchmarks" \
        || fail "-Dnatremia:benchmarks=enabled builds no benchmark"
    if [[ -n $want_test ]]; then
        grep -qx "$want_test" <<< "$tests2" \
            && ok "-Dnatremia:tests=enabled registers natremia's tests" \
            || fail "-Dnatremia:tests=enabled registers no natremia test"
    fi
else
    cat "$work/setup2.log"
    fail "the consumer did not configure with ${asked[*]}"
fi

if [[ $failures -ne 0 ]]; then
    echo "$failures subproject check(s) failed"
    exit 1
fi
echo "meson subproject test passed"
