#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Builds the reference manual: Doxygen with the configuration meson wrote
# (build/docs/Doxyfile), then a copy of Debian's MathJax (libjs-mathjax)
# into html/mathjax, where the pages load it from (MATHJAX_RELPATH in
# docs/Doxyfile.in). The copy makes the manual whole: it typesets its
# equations offline and keeps working when the html directory is moved or
# served elsewhere. Only what a browser loads is copied (about 35 MB; not
# the package's unpacked sources or its test pages). Prints nothing when
# all goes well (QUIET = YES), so that tests/check_manual.sh can fail on any
# output.
#
#   build-manual.sh <Doxyfile> <mathjax-dir> <output-dir>
#       (`ninja docs` and tests/check_manual.sh both run it)
set -euo pipefail

if [[ $# -ne 3 ]]; then
    echo "usage: $0 <Doxyfile> <mathjax-dir> <output-dir>" >&2
    exit 2
fi
doxyfile=$1
mathjax=$2
out=$3
if [[ ! -f $mathjax/MathJax.js ]]; then
    echo "build-manual: no MathJax.js in $mathjax (apt-get install libjs-mathjax)" >&2
    exit 1
fi

mkdir -p "$out"
{ cat "$doxyfile"; echo "OUTPUT_DIRECTORY = $out"; } | doxygen -

# -L: Debian links some of MathJax's fonts in from other packages; the copy
# holds the files themselves. -u: a rebuild copies only what changed.
mkdir -p "$out/html/mathjax"
for part in "$mathjax"/*; do
    case ${part##*/} in
        unpacked | test) ;;
        *) cp -rLu "$part" "$out/html/mathjax/" ;;
    esac
done
