#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Install test: runs the README's install recipe ("Install the library ...",
# taken out of README.md so the two cannot drift) the way a newcomer would,
# except that `meson install` goes into a temporary staging directory
# instead of the system (no sudo, no ldconfig here). Then checks that the
# files land where the README says and where Debian's pkg-config and loader
# look without help (the recipe once installed into /usr/local/lib64 on a
# machine without dpkg-dev, found by neither), builds
# examples/pkgconfig_consumer.c against the INSTALLED copy using nothing
# but `pkg-config --cflags --libs natremia`, runs it and checks what it
# prints.
#
#   check_install.sh <build-dir> <source-dir>
#
# <build-dir> is only where the scratch build lives (the recipe's own build
# directory is made inside it). `meson install --destdir` keeps the
# configured prefix inside the staging directory; PKG_CONFIG_SYSROOT_DIR
# makes pkg-config put the staging directory in front of the -I and -L
# paths it prints, and PKG_CONFIG_LIBDIR hides any natremia.pc installed on
# the machine itself. The compiler is $CC (meson passes its own), else cc.
set -euo pipefail

if [[ $# -ne 2 ]]; then
    echo "usage: $0 <build-dir> <source-dir>" >&2
    exit 1
fi
builddir=$(cd "$1" && pwd)
srcdir=$(cd "$2" && pwd)
read -r -a cc_cmd <<< "${CC:-cc}"
ldconfig_cmd=$(command -v ldconfig || echo /sbin/ldconfig)

for tool in meson ninja pkg-config readelf ldd "$ldconfig_cmd"; do
    command -v "$tool" >/dev/null 2>&1 || { echo "check_install: $tool not found" >&2; exit 1; }
done
source "$srcdir/tests/lib/readme-blocks.sh"

work=$(mktemp -d "$builddir/check-install.XXXXXX")
trap 'rm -rf "$work"' EXIT
stage=$work/stage
failures=0
fail() { echo "FAIL: $*"; failures=$((failures + 1)); }
ok() { echo "OK: $*"; }

# ---- the README's recipe: its `meson setup` line as written (in a scratch
# directory), its build, its install (staged)
recipe=$(readme_block "$srcdir/README.md" "Install the library" sh)
echo "README recipe:"
sed 's/^/    /' <<< "$recipe"
mapfile -t setup_lines < <(grep -E '^meson setup ' <<< "$recipe" || true)
if [[ ${#setup_lines[@]} -ne 1 ]]; then
    echo "FAIL: the README recipe should have one 'meson setup' line, has ${#setup_lines[@]}"
    exit 1
fi
read -r -a setup_words <<< "${setup_lines[0]}"
[[ ${setup_words[2]:-} != -* ]] || { echo "FAIL: 'meson setup' names no build directory first"; exit 1; }
recipe_build=$work/${setup_words[2]}
if ! (cd "$srcdir" && meson setup "$recipe_build" "${setup_words[@]:3}") >"$work/setup.log" 2>&1; then
    cat "$work/setup.log"
    echo "FAIL: the README's meson setup line"
    exit 1
fi
grep -Eq '(^|[ &;])sudo ldconfig($|[ &;])' <<< "$recipe" \
    && ok "the recipe refreshes the loader's cache (ldconfig)" \
    || fail "the recipe does not run ldconfig after installing"

# Only the library's own files: runtime (.so) and devel (header, .a, .pc).
if ! { ninja -C "$recipe_build" && meson install -C "$recipe_build" --no-rebuild \
        --destdir "$stage" --tags runtime,devel; } >"$work/install.log" 2>&1; then
    cat "$work/install.log"
    echo "FAIL: building and installing as the recipe does"
    exit 1
fi

# ---- where the recipe's options put the files
option() {
    meson introspect --buildoptions "$recipe_build" | /usr/bin/env python3 -c '
import json, sys
print(next(o["value"] for o in json.load(sys.stdin) if o["name"] == sys.argv[1]))' "$1"
}
prefix=$(option prefix)
libdir_opt=$(option libdir)
[[ $libdir_opt == /* ]] && sys_libdir=$libdir_opt || sys_libdir=$prefix/$libdir_opt
echo "the recipe installs under prefix $prefix, libraries in $sys_libdir"

grep -Fq "\`$sys_libdir\`" "$srcdir/README.md" \
    && ok "README names $sys_libdir, where the recipe installs" \
    || fail "README does not say the library goes to $sys_libdir"
pc_default=$(pkg-config --variable pc_path pkg-config)
[[ ":$pc_default:" == *":$sys_libdir/pkgconfig:"* ]] \
    && ok "$sys_libdir/pkgconfig is on pkg-config's default path" \
    || fail "pkg-config does not look in $sys_libdir/pkgconfig (its path: $pc_default)"
loader_dirs=$("$ldconfig_cmd" -N -X -v 2>/dev/null | sed -n 's|^\(/[^:]*\):.*|\1|p')
grep -Fxq "$sys_libdir" <<< "$loader_dirs" \
    && ok "$sys_libdir is among the loader's directories (ldconfig)" \
    || fail "the loader does not look in $sys_libdir (it looks in: $(tr '\n' ' ' <<< "$loader_dirs"))"

pcdir=$stage$sys_libdir/pkgconfig
libdir=$stage$sys_libdir
if [[ ! -f $pcdir/natremia.pc ]]; then
    echo "FAIL: natremia.pc not installed in $sys_libdir/pkgconfig; installed files:"
    find "$stage" | sed 's/^/  /'
    exit 1
fi
export PKG_CONFIG_LIBDIR=$pcdir
export PKG_CONFIG_PATH=$pcdir
export PKG_CONFIG_SYSROOT_DIR=$stage

# pkgconf also puts the sysroot in front of variables; older pkg-config
# does not. Strip it so both give the configured prefix.
pc_prefix=$(pkg-config --variable=prefix natremia)
pc_prefix=${pc_prefix#"$stage"}
[[ $pc_prefix == "$prefix" ]] && ok "natremia.pc has prefix $prefix" \
    || fail "natremia.pc has prefix '$pc_prefix', not $prefix"
includedir=$stage${prefix}/include

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

# The command-line program (bindings/cli) is installed into bindir with
# the library and runs from there against the installed copy.
bindir_opt=$(option bindir)
[[ $bindir_opt == /* ]] && sys_bindir=$bindir_opt || sys_bindir=$prefix/$bindir_opt
course=$stage$sys_bindir/natremia-course
if [[ -x $course ]]; then
    ok "natremia-course installed in $sys_bindir"
    resolved=$(ldd "$course" | sed -n 's/.*libnatremia.so.1 => \([^ ]*\).*/\1/p')
    [[ "$resolved" == "$libdir/"* ]] && ok "natremia-course loads the installed copy" \
        || fail "natremia-course loads libnatremia.so.1 from '$resolved', not from $libdir"
    if "$course" --help > "$work/course-help.txt"; then
        grep -q '^usage: natremia-course' "$work/course-help.txt" \
            && grep -q '^Caution: estimates for decision support, not orders' "$work/course-help.txt" \
            && ok "installed natremia-course --help prints its usage and the caution" \
            || fail "installed natremia-course --help lacks the usage or the caution"
    else
        fail "installed natremia-course --help exited with an error"
    fi
    # Invented series: a rise of 11 in 24 h is over the European limit of
    # 10 (Spasovski G et al. Eur J Endocrinol 2014;170:G1-G47).
    course_out=$(printf 'patient,hours,sodium\ninvented,0,110\ninvented,24,121\n' \
        | "$course" --goal raise) || true
    grep -q '^invented,assessed,2,.*rise_over_24h' <<< "$course_out" \
        && ok "installed natremia-course flags a rise of 11 in 24 h (Spasovski 2014)" \
        || fail "installed natremia-course did not assess the invented series: $course_out"
else
    fail "natremia-course not installed in $sys_bindir"
fi

if [[ $failures -ne 0 ]]; then
    echo "$failures install check(s) failed"
    exit 1
fi
echo "install test passed"
