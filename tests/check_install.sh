#!/usr/bin/env bash
# Install test: installs the built library into a temporary staging
# directory, then builds examples/pkgconfig_consumer.c against the INSTALLED
# copy using nothing but `pkg-config --cflags --libs natremia`, runs it and
# checks what it prints.
#
#   check_install.sh <build-dir> <source-dir>
#
# `meson install --destdir` keeps the configured prefix inside the staging
# directory; PKG_CONFIG_SYSROOT_DIR makes pkg-config put the staging
# directory in front of the -I and -L paths it prints, and
# PKG_CONFIG_LIBDIR hides any natremia.pc installed on the machine itself.
# The compiler is $CC (meson passes its own), else cc.
set -euo pipefail

if [[ $# -ne 2 ]]; then
    echo "usage: $0 <build-dir> <source-dir>" >&2
    exit 1
fi
builddir=$(cd "$1" && pwd)
srcdir=$(cd "$2" && pwd)
read -r -a cc_cmd <<< "${CC:-cc}"

for tool in meson pkg-config readelf ldd; do
    command -v "$tool" >/dev/null 2>&1 || { echo "check_install: $tool not found" >&2; exit 1; }
done

work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
stage=$work/stage
failures=0
fail() { echo "FAIL: $*"; failures=$((failures + 1)); }
ok() { echo "OK: $*"; }

# Only the library's own files: runtime (.so) and devel (header, .a, .pc).
meson install -C "$builddir" --destdir "$stage" --tags runtime,devel >"$work/install.log" 2>&1 || {
    cat "$work/install.log"
    echo "FAIL: meson install"
    exit 1
}

mapfile -t pcs < <(find "$stage" -name natremia.pc)
if [[ ${#pcs[@]} -ne 1 ]]; then
    echo "FAIL: expected one installed natremia.pc, found ${#pcs[@]}:"
    find "$stage" | sed 's/^/  /'
    exit 1
fi
pcdir=$(dirname "${pcs[0]}")
libdir=$(dirname "$pcdir")
export PKG_CONFIG_LIBDIR=$pcdir
export PKG_CONFIG_PATH=$pcdir
export PKG_CONFIG_SYSROOT_DIR=$stage

# pkgconf also puts the sysroot in front of variables; older pkg-config
# does not. Strip it so both give the configured prefix.
prefix=$(pkg-config --variable=prefix natremia)
prefix=${prefix#"$stage"}
includedir=$stage${prefix}/include
echo "installed under prefix $prefix, libraries in ${libdir#"$stage"}"

# Installed files.
if cmp -s "$srcdir/include/natremia.h" "$includedir/natremia.h"; then
    ok "header installed unchanged"
else
    fail "natremia.h missing from $includedir or different from include/natremia.h"
fi
for f in libnatremia.so libnatremia.so.1 libnatremia.a; do
    [[ -e "$libdir/$f" ]] && ok "$f installed" || fail "$f not installed in $libdir"
done
soname=$(readelf -d "$libdir/libnatremia.so.1" | sed -n 's/.*Library soname: \[\(.*\)\].*/\1/p')
[[ "$soname" == libnatremia.so.1 ]] && ok "SONAME $soname" || fail "SONAME is '$soname', not libnatremia.so.1"

# Build the consumer with pkg-config's flags only.
flags=$(pkg-config --cflags --libs natremia)
echo "pkg-config --cflags --libs natremia: $flags"
[[ "$flags" == *"-L$stage"* && "$flags" == *"-lnatremia"* ]] \
    || fail "pkg-config flags do not point at the installed library"
# shellcheck disable=SC2086  # the flags are meant to be split into words
if "${cc_cmd[@]}" -std=c99 -Wall -Wextra -Wpedantic -Werror \
        "$srcdir/examples/pkgconfig_consumer.c" $flags -o "$work/consumer"; then
    ok "consumer compiled and linked"
else
    fail "consumer did not compile against the installed library"
    exit 1
fi
needed=$(readelf -d "$work/consumer" | sed -n 's/.*Shared library: \[\(libnatremia[^]]*\)\].*/\1/p')
[[ "$needed" == libnatremia.so.1 ]] && ok "consumer needs libnatremia.so.1" \
    || fail "consumer should need libnatremia.so.1, needs '$needed'"

export LD_LIBRARY_PATH=$libdir
resolved=$(ldd "$work/consumer" | sed -n 's/.*libnatremia.so.1 => \([^ ]*\).*/\1/p')
[[ "$resolved" == "$libdir/"* ]] && ok "consumer loads the installed copy" \
    || fail "consumer loads libnatremia.so.1 from '$resolved', not from $libdir"

if ! "$work/consumer" > "$work/out.txt"; then
    cat "$work/out.txt"
    fail "consumer exited with an error"
    exit 1
fi
cat "$work/out.txt"

# The library reports the version pkg-config announces.
modversion=$(pkg-config --modversion natremia)
grep -q "^natremia $modversion," "$work/out.txt" && ok "version $modversion reported" \
    || fail "consumer did not report version $modversion"

# Source: Furst H et al., Am J Med Sci 2000;319:240-4, worked example:
# sodium 108 mmol/L, body water 30 L, 292 mL of 3% saline gives "about
# 112" mmol/L. Accept 112 +- 0.5, the precision the paper states.
predicted=$(sed -n 's/.*expected sodium \([0-9.]*\) mmol\/L.*/\1/p' "$work/out.txt")
if [[ -n "$predicted" ]] && awk -v x="$predicted" 'BEGIN { exit !(x >= 111.5 && x <= 112.5) }'; then
    ok "predicted sodium $predicted is about 112 (Furst et al. 2000 worked example)"
else
    fail "predicted sodium '$predicted' is not about 112 mmol/L"
fi
grep -q "^Caution: estimates for decision support, not orders" "$work/out.txt" \
    && ok "safety caution printed" || fail "safety caution missing"

if [[ $failures -ne 0 ]]; then
    echo "$failures install check(s) failed"
    exit 1
fi
echo "install test passed"
