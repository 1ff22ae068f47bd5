#!/bin/sh
# SPDX-License-Identifier: MIT
# Builds the R package's source tarball natremia_<version>.tar.gz in OUTDIR:
# copies bindings/r to OUTDIR/stage/natremia, puts the C library's sources
# (lib/*.c, lib/*.h, include/natremia.h) into its src/ and the reference
# vectors (tests/refvectors/expected.txt) into its tests, and runs R CMD build
# there. The tarball then installs and checks anywhere, with no source tree
# beside it (configure finds the sources already in src/).
#   sh tests/r/build-package.sh SOURCE_ROOT OUTDIR
set -eu
root=$(cd "$1" && pwd)
mkdir -p "$2"
out=$(cd "$2" && pwd)
stage="$out/stage"
rm -rf "$stage"
mkdir -p "$stage"
cp -R "$root/bindings/r" "$stage/natremia"
# Leftovers of an in-place R CMD INSTALL bindings/r must not travel along.
(cd "$stage/natremia" && sh ./cleanup)
cp "$root/include/natremia.h" "$stage/natremia/src/"
cp "$root"/lib/*.c "$root"/lib/*.h "$stage/natremia/src/"
mkdir -p "$stage/natremia/tests/testthat/refvectors"
cp "$root/tests/refvectors/expected.txt" "$stage/natremia/tests/testthat/refvectors/"
cd "$out"
R CMD build --no-build-vignettes "$stage/natremia"
ls "$out"/natremia_*.tar.gz
