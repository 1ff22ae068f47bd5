#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Installs bindings/python with pip, offline and with Debian's own tools,
# into throwaway virtual environments, and proves the package carries its
# own compiled library:
#
# 1. From a copy of the repository (lib/, include/, bindings/python: the
#    build finds the C sources two levels up), into a fresh venv. With no
#    NATREMIA_LIBRARY, no pkg-config file, no LD_LIBRARY_PATH and no
#    natremia in the loader cache, the import loads the copy inside the
#    venv's site-packages, and computes.
# 2. NATREMIA_LIBRARY still wins over the bundled copy.
# 3. With the bundled copy removed, pkg-config and then the system loader
#    are used, as before.
# 4. From an sdist built from the copy and unpacked away from it (the sdist
#    carries the C sources in csrc/), into a second fresh venv.
#
#   check_pip_install.sh SOURCE_ROOT LIBRARY_PATH
#
# Exit 77 (skipped) only when python3's venv module, pip or setuptools is
# not installed, or no C compiler is (apt-get install python3-venv
# python3-pip python3-setuptools python3-wheel gcc).
set -euo pipefail

src=$1
lib=$2
python=/usr/bin/python3

for module in venv pip setuptools wheel; do
    if ! "$python" -c "import $module" 2>/dev/null; then
        echo "skipped: python3 module $module is missing"
        exit 77
    fi
done
if ! command -v "${CC:-cc}" >/dev/null; then
    echo "skipped: no C compiler (${CC:-cc})"
    exit 77
fi

tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT

# pip builds in the directory it is given: copy the parts the build needs,
# in the repository's layout, so the tree stays clean.
mkdir -p "$tmp/repo/bindings"
cp -r "$src/lib" "$src/include" "$src/LICENSE" "$tmp/repo/"
cp -r "$src/bindings/python" "$tmp/repo/bindings/python"
rm -rf "$tmp/repo/bindings/python/build" "$tmp/repo/bindings/python/"*.egg-info \
    "$tmp/repo/bindings/python/natremia/libnatremia.so"*

# No natremia reachable outside the package: nothing in the loader cache,
# no pkg-config file, no variable.
unset NATREMIA_LIBRARY PYTHONPATH LD_LIBRARY_PATH
export PKG_CONFIG_PATH="$tmp/empty" PKG_CONFIG_LIBDIR="$tmp/empty"
export PYTHONDONTWRITEBYTECODE=1
if /sbin/ldconfig -p 2>/dev/null | grep -q libnatremia; then
    echo "note: a system libnatremia is in the loader cache; the bundled copy must still win"
fi

install() {  # install VENV WHAT
    "$python" -m venv --without-pip --system-site-packages "$1"
    # The venv sees Debian's pip and setuptools through --system-site-packages.
    "$1/bin/python" -m pip install --quiet --no-build-isolation --no-index \
        --no-cache-dir "$2"
}

check() {  # check VENV EXPECTED_HOW [EXPECTED_PATH]
    (cd "$tmp" && "$1/bin/python" - "$1" "$2" "${3:-}" <<'PY'
import os
import sys
import natremia
venv, how, path = sys.argv[1:4]
assert natremia.__file__.startswith(venv), natremia.__file__
loaded = natremia.library_path()
found_by = natremia._core._lib.natremia_found_by
assert found_by == how, (found_by, how, loaded)
if how == "bundled":
    here = os.path.dirname(natremia.__file__)
    assert loaded == os.path.join(here, "libnatremia.so.1"), loaded
    assert loaded.startswith(venv), loaded
    # The loaded copy is the one in this process's maps, not another.
    with open("/proc/self/maps") as maps:
        mapped = {line.split()[-1] for line in maps if "libnatremia" in line}
    assert mapped == {os.path.realpath(loaded)}, mapped
elif path:
    assert loaded == path, (loaded, path)
# With Python's headers at build time the accelerator is built and used.
import sysconfig
headers = os.path.isfile(os.path.join(sysconfig.get_paths()["include"], "Python.h"))
assert natremia._core.speedup_active() == headers, headers
assert natremia.__version__ == natremia.version(), (natremia.__version__,
                                                    natremia.version())
# Source: the conventional 2*Na formula (Dorwart & Chalmers, Clin Chem 1975).
assert natremia.osm_calculated(na_mmol_l=140, glucose_mmol_l=5, urea_mmol_l=5) == 290.0
print("ok: natremia", natremia.__version__, "found by", found_by, "at", loaded)
PY
    )
}

# 1. The bundled copy, from the repository layout.
install "$tmp/venv" "$tmp/repo/bindings/python"
check "$tmp/venv" bundled

# 1b. The accelerated scalar path (natremia._speed, when built) gives what
# the general ctypes path gives, value or error, on valid and invalid
# inputs, and is as strict about codes.
(cd "$tmp" && "$tmp/venv/bin/python" - <<'PY'
import itertools, math
import natremia
from natremia import _core

def outcome(call):
    try:
        return ("ok", call())
    except natremia.NatremiaError as e:
        return ("error", e.status, e.argument)

grid = [79.9, 80, 140, 220, 220.1, math.nan, math.inf, 0, -5, 300, 2 ** 70]
for na, glucose in itertools.product(grid, grid):
    fast = outcome(lambda: natremia.osm_effective(na_mmol_l=na, glucose_mmol_l=glucose))
    slow = outcome(lambda: _core._double_result("ntr_osm_effective", "osm_effective",
                                                na, glucose))
    assert str(fast) == str(slow), (na, glucose, fast, slow)
for sex, age, weight in itertools.product([1, 2, 0, 3, 2 ** 32 + 1, "female"], grid, grid):
    fast = outcome(lambda: natremia.tbw_fraction(sex=sex, age_years=age, weight_kg=weight))
    try:
        code = _core._enum(natremia.Sex, sex, "sex", "tbw_fraction")
    except natremia.NatremiaError as e:
        slow = ("error", e.status, e.argument)
    else:
        slow = outcome(lambda: _core._double_result("ntr_tbw_fraction", "tbw_fraction",
                                                    code, age, weight))
    assert str(fast) == str(slow), (sex, age, weight, fast, slow)
for bad in (1.9, True):
    try:
        natremia.tbw_fraction(sex=bad, age_years=40.0, weight_kg=70.0)
        raise AssertionError("sex=%r accepted" % (bad,))
    except TypeError as e:
        assert "sex" in str(e)
print("ok: fast path equals the general path (accelerator %s)"
      % ("on" if _core.speedup_active() else "off"))
PY
)

# 2. The environment variable wins.
NATREMIA_LIBRARY=$lib check "$tmp/venv" NATREMIA_LIBRARY "$lib"

# 3. Without the bundled copy: pkg-config, then the system loader.
find "$tmp/venv" -name 'libnatremia.so*' -delete
test -z "$(find "$tmp/venv" -name 'libnatremia.so*')"
mkdir -p "$tmp/pc"
cat > "$tmp/pc/natremia.pc" <<PC
libdir=$(dirname "$lib")
Name: natremia
Description: test copy
Version: 1.1.0
Libs: -L\${libdir} -lnatremia
PC
if command -v pkg-config >/dev/null; then
    PKG_CONFIG_PATH="$tmp/pc" PKG_CONFIG_LIBDIR="$tmp/pc" \
        check "$tmp/venv" pkg-config "$(dirname "$lib")/libnatremia.so.1"
fi
LD_LIBRARY_PATH="$(dirname "$lib")" check "$tmp/venv" loader libnatremia.so.1

# 4. An sdist, unpacked far from the repository copy, which is then removed.
(cd "$tmp/repo/bindings/python" && "$python" setup.py --quiet sdist -d "$tmp/dist" >/dev/null 2>&1)
mkdir "$tmp/unpacked"
tar -xzf "$tmp"/dist/natremia-*.tar.gz -C "$tmp/unpacked"
rm -rf "$tmp/repo"
install "$tmp/venv2" "$(echo "$tmp"/unpacked/natremia-*)"
check "$tmp/venv2" bundled
echo "pip install: ok"
