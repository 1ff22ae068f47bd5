#!/usr/bin/env bash
# Installs bindings/python with pip, offline and with Debian's own tools,
# into a throwaway virtual environment, then imports it from there and
# checks the three ways the binding finds the library (NATREMIA_LIBRARY,
# pkg-config, the system loader).
#
#   check_pip_install.sh SOURCE_ROOT LIBRARY_PATH
#
# Exit 77 (skipped) only when python3's venv module, pip or setuptools is
# not installed (apt-get install python3-venv python3-pip python3-setuptools
# python3-wheel).
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

tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT

# pip builds in the directory it is given: copy so the tree stays clean.
cp -r "$src/bindings/python" "$tmp/src"
"$python" -m venv --without-pip --system-site-packages "$tmp/venv"
# The venv sees Debian's pip and setuptools through --system-site-packages.
"$tmp/venv/bin/python" -m pip install --quiet --no-build-isolation --no-index \
    --no-cache-dir "$tmp/src"

cd "$tmp"  # not the source tree: the installed copy must be the one imported
export PYTHONDONTWRITEBYTECODE=1
unset PYTHONPATH

check() {  # check WHICH_PATH_IS_EXPECTED
    "$tmp/venv/bin/python" - "$tmp/venv" "$1" <<'PY'
import sys
import natremia
venv, expected = sys.argv[1], sys.argv[2]
assert natremia.__file__.startswith(venv), natremia.__file__
loaded = natremia._core._lib._name
assert loaded == expected, (loaded, expected)
# Source: the conventional 2*Na formula (Dorwart & Chalmers, Clin Chem 1975).
assert natremia.osm_calculated(na_mmol_l=140, glucose_mmol_l=5, urea_mmol_l=5) == 290.0
print("ok: natremia", natremia.version(), "from", loaded)
PY
}

# 1. The environment variable.
NATREMIA_LIBRARY=$lib check "$lib"

# 2. pkg-config: a natremia.pc whose libdir is the build's library directory.
mkdir -p "$tmp/pc"
cat > "$tmp/pc/natremia.pc" <<PC
libdir=$(dirname "$lib")
Name: natremia
Description: test copy
Version: 1.0.0
Libs: -L\${libdir} -lnatremia
PC
if command -v pkg-config >/dev/null; then
    env -u NATREMIA_LIBRARY PKG_CONFIG_PATH="$tmp/pc" \
        bash -c "$(declare -f check); tmp='$tmp'; check '$(dirname "$lib")/libnatremia.so.1'"
fi

# 3. The system loader, by soname.
env -u NATREMIA_LIBRARY PKG_CONFIG_PATH="$tmp/empty" PKG_CONFIG_LIBDIR="$tmp/empty" \
    LD_LIBRARY_PATH="$(dirname "$lib")" \
    bash -c "$(declare -f check); tmp='$tmp'; check libnatremia.so.1"
echo "pip install: ok"
