#!/bin/sh
# SPDX-License-Identifier: MIT
# The R package's tests (meson test 'r-package'): builds the source tarball
# with tests/r/build-package.sh (the C library's sources and the reference
# vectors copied in), installs it into a temporary library, runs its
# testthat tests there, then R CMD check --no-manual on the tarball, offline,
# and fails on any ERROR, WARNING or NOTE.
# Exits 77 (skipped) only when R or testthat is absent (Debian: r-base-core
# r-base-dev r-cran-testthat; tests/run-all.sh installs them).
#   sh tests/r/run.sh SOURCE_ROOT BUILDDIR
set -eu
root=$(cd "$1" && pwd)
mkdir -p "$2/r"
out=$(cd "$2/r" && pwd)
if ! command -v R >/dev/null 2>&1 || ! command -v Rscript >/dev/null 2>&1; then
    echo "r-package: R not found (Debian: r-base-core r-base-dev): skipped"
    exit 77
fi
if ! Rscript -e 'quit(status = !requireNamespace("testthat", quietly = TRUE))' >/dev/null 2>&1; then
    echo "r-package: testthat not found (Debian: r-cran-testthat): skipped"
    exit 77
fi

# The reference vectors travel in the tarball's tests (tests/testthat/refvectors).
sh "$root/tests/r/build-package.sh" "$root" "$out"
tarball=$(ls "$out"/natremia_*.tar.gz)

# Inside the test command every test must run: none may skip.
export NATREMIA_R_REQUIRE_ALL=1
# Offline, and nothing from the user's own R setup.
export R_LIBS_USER="$out/no-user-library" R_ENVIRON_USER=/dev/null R_PROFILE_USER=/dev/null
export _R_CHECK_FORCE_SUGGESTS_=false _R_CHECK_CRAN_INCOMING_=false
export _R_CHECK_CRAN_INCOMING_REMOTE_=false _R_CHECK_SYSTEM_CLOCK_=false

lib="$out/library"
rm -rf "$lib"
mkdir -p "$lib"
R CMD INSTALL -l "$lib" "$tarball"
(cd "$out/stage/natremia/tests" && R_LIBS="$lib" Rscript testthat.R)

rm -rf "$out/check"
mkdir -p "$out/check"
cd "$out/check"
R CMD check --no-manual --no-build-vignettes "$tarball"
log="$out/check/natremia.Rcheck/00check.log"
if grep -E '(WARNING|NOTE|ERROR)$' "$log"; then
    echo "r-package: R CMD check reported the lines above ($log)"
    exit 1
fi
grep -E '^Status:' "$log"
