#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# CMake package test: installs this build's library, header and CMake
# package into a staging directory (meson install --destdir, tags runtime
# and devel), moves the installed prefix somewhere else as a whole (the
# package must work out its paths from where it lies), then configures,
# builds and runs tests/consumers/cmake/ with find_package(natremia) and
# the imported target natremia::natremia, finding nothing but the moved
# tree. Then checks which version requests the version file accepts
# (same major version, not newer than this one).
#
#   check_cmake_consumer.sh <build-dir> <source-dir>
#
# Exit 77 (skipped) when cmake is not installed (apt-get install cmake).
# The C compiler is $CC (meson passes its own), else CMake's default.
set -euo pipefail

if [[ $# -ne 2 ]]; then
    echo "usage: $0 <build-dir> <source-dir>" >&2
    exit 1
fi
builddir=$(cd "$1" && pwd)
srcdir=$(cd "$2" && pwd)
if ! command -v cmake >/dev/null 2>&1; then
    echo "check_cmake_consumer: cmake not found (apt-get install cmake): skipped"
    exit 77
fi
for tool in meson ninja readelf ldd; do
    command -v "$tool" >/dev/null 2>&1 || { echo "check_cmake_consumer: $tool not found" >&2; exit 1; }
done

work=$(mktemp -d "$builddir/check-cmake.XXXXXX")
trap 'rm -rf "$work"' EXIT
failures=0
fail() { echo "FAIL: $*"; failures=$((failures + 1)); }
ok() { echo "OK: $*"; }

option() {
    meson introspect --buildoptions "$builddir" | /usr/bin/env python3 -c '
import json, sys
print(next(o["value"] for o in json.load(sys.stdin) if o["name"] == sys.argv[1]))' "$1"
}
prefix=$(option prefix)
libdir=$(option libdir)
includedir=$(option includedir)
version=$(meson introspect --projectinfo "$builddir" | /usr/bin/env python3 -c '
import json, sys; print(json.load(sys.stdin)["version"])')
[[ $libdir == /* ]] || libdir=$prefix/$libdir
[[ $includedir == /* ]] || includedir=$prefix/$includedir

if ! meson install -C "$builddir" --no-rebuild --destdir "$work/stage" \
        --tags runtime,devel > "$work/install.log" 2>&1; then
    cat "$work/install.log"
    echo "FAIL: meson install --destdir"
    exit 1
fi
config=$work/stage$libdir/cmake/natremia/natremiaConfig.cmake
if [[ -f $config && -f ${config%Config.cmake}ConfigVersion.cmake ]]; then
    ok "natremiaConfig.cmake and natremiaConfigVersion.cmake in $libdir/cmake/natremia"
else
    echo "FAIL: the CMake package is not in $libdir/cmake/natremia; installed files:"
    find "$work/stage" | sed 's/^/  /'
    exit 1
fi

# The whole installed prefix moves; nothing of the configured prefix stays.
moved=$work/moved-prefix
mv "$work/stage$prefix" "$moved"
echo "installed tree moved from $prefix to $moved"

# Only the moved tree may be found: no system prefixes, no user package
# registry, no natremia_DIR from the environment.
unset natremia_DIR natremia_ROOT
# meson test points LD_LIBRARY_PATH at the build tree; the consumer must
# load the installed copy through what CMake linked into it.
unset LD_LIBRARY_PATH
cmake_find=(-DCMAKE_PREFIX_PATH="$moved"
            -DCMAKE_FIND_USE_CMAKE_SYSTEM_PATH=OFF
            -DCMAKE_FIND_USE_SYSTEM_ENVIRONMENT_PATH=OFF
            -DCMAKE_FIND_USE_PACKAGE_REGISTRY=OFF
            -DCMAKE_FIND_USE_SYSTEM_PACKAGE_REGISTRY=OFF)
generator=(-G Ninja -DCMAKE_MAKE_PROGRAM="$(command -v ninja)")
# PATH is out of CMake's search (its bin/.. directories would be package
# prefixes), so the compiler is named by its full path too.
read -r -a cc_words <<< "${CC:-cc}"
cc_path=$(command -v "${cc_words[0]}") || { echo "check_cmake_consumer: no C compiler ${cc_words[0]}" >&2; exit 1; }
generator+=(-DCMAKE_C_COMPILER="$cc_path")
consumer=$srcdir/tests/consumers/cmake
cbuild=$work/consumer-build

if cmake -S "$consumer" -B "$cbuild" "${generator[@]}" "${cmake_find[@]}" \
        > "$work/configure.log" 2>&1; then
    ok "find_package(natremia 1.0) configured"
else
    cat "$work/configure.log"
    echo "FAIL: the consumer did not configure against the moved tree"
    exit 1
fi
found_dir=$(sed -n 's/^-- natremia .* from //p' "$work/configure.log")
found_version=$(sed -n 's/^-- natremia \([^ ]*\) from .*/\1/p' "$work/configure.log")
[[ $found_dir == "$moved/"* ]] && ok "package found in the moved tree ($found_dir)" \
    || fail "package found in '$found_dir', not under $moved"
[[ $found_version == "$version" ]] && ok "natremia_VERSION is $version" \
    || fail "natremia_VERSION is '$found_version', not $version"

if cmake --build "$cbuild" > "$work/build.log" 2>&1; then
    ok "consumer built with target_link_libraries(... natremia::natremia)"
else
    cat "$work/build.log"
    echo "FAIL: the consumer did not build"
    exit 1
fi
exe=$cbuild/cmake_consumer
needed=$(readelf -d "$exe" | sed -n 's/.*Shared library: \[\(libnatremia[^]]*\)\].*/\1/p')
[[ $needed == libnatremia.so.1 ]] && ok "consumer needs libnatremia.so.1 (shared library)" \
    || fail "consumer should need libnatremia.so.1, needs '$needed'"
# CMake puts the imported library's directory in the build tree's RPATH.
resolved=$(ldd "$exe" | sed -n 's/.*libnatremia.so.1 => \([^ ]*\).*/\1/p')
[[ $resolved == "$moved/"* ]] && ok "consumer loads the moved copy ($resolved)" \
    || fail "consumer loads libnatremia.so.1 from '$resolved', not from $moved"
if "$exe" > "$work/run.txt"; then
    ok "consumer's published checks passed"
else
    fail "consumer exited with an error"
fi
cat "$work/run.txt"
grep -q "^Caution: estimates for decision support, not orders" "$work/run.txt" \
    || fail "consumer printed no caution"

# Version requests (re-configuring the same build directory): the same
# major version and no newer than $version is met, anything else refused.
major=${version%%.*}
minor=${version#*.}; minor=${minor%%.*}
accepted=("$major" "$major.0" "$major.$minor" "$version" "$major.0...<$((major + 1))")
refused=("$major.$((minor + 1))" "$((major + 1))" "$((major + 1)).0...<$((major + 2))")
[[ $major -gt 0 ]] && refused+=("$((major - 1)).9")
for want in "${accepted[@]}" "${refused[@]}"; do
    if cmake -S "$consumer" -B "$cbuild" "${cmake_find[@]}" -DNTR_WANT="$want" \
            > "$work/want.log" 2>&1; then
        result=accepted
    elif tr -s ' \n' '  ' < "$work/want.log" | grep -q "compatible with requested version"; then
        result=refused
    else
        result="failed for another reason"
    fi
    expect=refused
    for a in "${accepted[@]}"; do [[ $a == "$want" ]] && expect=accepted; done
    if [[ $result == "$expect" ]]; then
        ok "find_package(natremia $want) $result"
    else
        cat "$work/want.log"
        fail "find_package(natremia $want) $result, should be $expect"
    fi
done

# A tree copied in parts: the package says which file is missing.
rm "$moved${includedir#"$prefix"}/natremia.h"
if cmake -S "$consumer" -B "$cbuild" "${cmake_find[@]}" -DNTR_WANT="$version" \
        > "$work/partial.log" 2>&1; then
    fail "configured although natremia.h was removed"
elif tr -s ' \n' '  ' < "$work/partial.log" | grep -q "natremia.h is missing"; then
    ok "a missing natremia.h is reported by name"
else
    cat "$work/partial.log"
    fail "a missing natremia.h fails without naming it"
fi

if [[ $failures -ne 0 ]]; then
    echo "$failures CMake package check(s) failed"
    exit 1
fi
echo "CMake package test passed"
