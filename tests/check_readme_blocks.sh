#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# The README blocks that tests/fresh-machine.sh runs on fresh Debian
# machines are there and are taken out whole (tests/lib/readme-blocks.sh):
# the fenced blocks after <!-- fresh-machine: install | python |
# sql-install | sql -->. fresh-machine.sh itself needs root and the
# network; this checks, in a second, that what it would run exists and is
# what the README shows, and that the extraction refuses a missing or
# doubled marker and a marker with no block after it.
#
#   check_readme_blocks.sh <source-dir>
set -euo pipefail
srcdir=$1
readme=$srcdir/README.md
source "$srcdir/tests/lib/readme-blocks.sh"
failures=0
fail() { echo "FAIL: $*"; failures=$((failures + 1)); }
ok() { echo "OK: $*"; }

# block name, then strings the block must contain
expect() {
    local name=$1 text
    shift
    if ! text=$(readme_marked "$readme" "$name"); then
        fail "no '$name' block"
        return
    fi
    echo "--- $name:"; sed 's/^/    /' <<< "$text"
    for want in "$@"; do
        grep -Fq -- "$want" <<< "$text" && ok "'$name' holds $want" || fail "'$name' lacks $want"
    done
}
expect install "meson setup" "meson install" "ldconfig" "pkg-config --cflags --libs natremia" "myprog.c"
expect python "python3 -m venv" "pip install" "./bindings/python" "import natremia" "flag_names"
expect sql-install "make -C bindings/postgresql" "install"
expect sql "CREATE EXTENSION natremia;" "ntr_course_assess(" "GROUP BY"

# The marked install block is the one tests/check_install.sh runs.
if [[ $(readme_marked "$readme" install) == "$(readme_block "$readme" "Install the library" sh)" ]]; then
    ok "the marked install block is the recipe tests/check_install.sh runs"
else
    fail "the marked install block and the 'Install the library' block differ"
fi

# The extraction refuses what it cannot take out whole.
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
printf '<!-- fresh-machine: a -->\n\n```sh\necho one\n```\n' > "$work/good.md"
printf '<!-- fresh-machine: a -->\ntext\n```sh\necho one\n```\n' > "$work/text.md"
printf '<!-- fresh-machine: a -->\n```sh\necho one\n```\n<!-- fresh-machine: a -->\n```sh\necho two\n```\n' > "$work/twice.md"
printf '<!-- fresh-machine: a -->\n```sh\necho one\n' > "$work/open.md"
[[ $(readme_marked "$work/good.md" a) == "echo one" ]] && ok "a marked block is taken out" \
    || fail "a marked block is not taken out"
for bad in text twice open; do
    if readme_marked "$work/$bad.md" a > /dev/null 2>&1; then
        fail "readme_marked accepted a marker ($bad)"
    else
        ok "readme_marked refuses a marker ($bad)"
    fi
done
readme_marked "$work/good.md" b > /dev/null 2>&1 && fail "readme_marked accepted a missing marker" \
    || ok "readme_marked refuses a missing marker"

if [[ $failures -ne 0 ]]; then
    echo "$failures README block check(s) failed"
    exit 1
fi
echo "README block test passed"
