#!/usr/bin/env bash
# Runs the README's instructions on freshly bootstrapped Debian machines:
# Debian 12 (bookworm) and Debian 13 (trixie), each a chroot made by
# debootstrap --variant=minbase (plus git, ca-certificates and sudo) from
# Debian's mirror, with a clean clone of the committed HEAD of this
# repository. In each: the two commands (the demo, then the test command),
# then the install-and-link recipe of "Using it from C", taken out of
# README.md (tests/lib/readme-blocks.sh) together with the program it
# builds, so what runs is what the README says. This catches an install
# step that a developer machine hides because a package is already there.
# Needs root and the Debian mirror; takes about ten minutes a release. Not
# part of CI. The chroots run one after the other, never side by side.
#
#   bash tests/fresh-machine.sh [bookworm|trixie|both] [workdir]
#       (default both; workdir default: a new temp dir; each release gets
#       workdir/<release>, its logs workdir/<release>.*.log)
#
# Ends with one line per release: the test command's "N passed, N failed,
# N skipped", its time, and whether the demo and the recipe passed. Exit
# status non-zero when anything failed on any release.
set -euo pipefail
[ "$(id -u)" -eq 0 ] || { echo "fresh-machine.sh: run as root (debootstrap, chroot)" >&2; exit 2; }
repo=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
. "$repo/tests/lib/apt-missing.sh"
apt_missing debootstrap git

case ${1:-both} in
    bookworm | 12) releases=(bookworm) ;;
    trixie | 13) releases=(trixie) ;;
    both) releases=(bookworm trixie) ;;
    *) echo "usage: $0 [bookworm|trixie|both] [workdir]" >&2; exit 2 ;;
esac
base=${2:-$(mktemp -d /tmp/natremia-fresh.XXXXXX)}
mkdir -p "$base"
mirror=http://deb.debian.org/debian

root=""
cleanup() {
    [[ -n $root ]] || return 0
    umount -R "$root/dev" 2>/dev/null || true
    umount -R "$root/sys" 2>/dev/null || true
    umount "$root/proc" 2>/dev/null || true
}
trap cleanup EXIT

# What runs inside the chroot, from the clone's top directory. Prints
# "result: NAME ok|FAILED [detail]" lines that the summary reads.
inside='
    set -u
    export HOME=/root
    cd /root/natremia
    if bash examples/run-demo.sh > /root/demo.log 2>&1 && grep -q "decision support" /root/demo.log; then
        echo "result: demo ok"
    else
        tail -30 /root/demo.log; echo "result: demo FAILED"
    fi

    start=$SECONDS
    bash tests/run-all.sh > /root/tests.log 2>&1 && status=ok || status=FAILED
    took=$((SECONDS - start))
    grep -E "^ *[0-9]+/[0-9]+ .*(FAIL|ERROR|TIMEOUT)" /root/tests.log || true
    [[ $status == ok ]] || tail -40 /root/tests.log
    echo "result: tests $status $(tail -1 /root/tests.log) in $((took / 60)) min $((took % 60)) s"

    # The install-and-link recipe exactly as the README writes it, on the
    # README own example program saved as myprog.c, run as root (sudo
    # included, as written).
    . tests/lib/readme-blocks.sh
    if readme_block README.md "## Using it from C" c > myprog.c &&
       readme_block README.md "Install the library" sh > /root/recipe.sh; then
        echo "--- recipe"; cat /root/recipe.sh
        if bash -e /root/recipe.sh > /root/recipe.log 2>&1 && grep -q "3% saline" /root/recipe.log; then
            grep "3% saline" /root/recipe.log
            echo "result: recipe ok (library in $(dirname "$(readlink -f "$(ldconfig -p | sed -n "s/.*libnatremia.so.1 .*=> //p" | head -1)")"))"
        else
            tail -30 /root/recipe.log; echo "result: recipe FAILED"
        fi
    else
        echo "result: recipe FAILED (not found in README.md)"
    fi
'

summary=()
any_failed=0
for release in "${releases[@]}"; do
    root=$base/$release
    echo "fresh-machine.sh: $release: debootstrap into $root"
    mkdir -p "$root"
    # mktemp makes directories 0700; as the chroot's "/" it must be 0755, or
    # no user but root (the PostgreSQL test's server user) can reach anything.
    chmod 755 "$base" "$root"
    debootstrap --variant=minbase --include=git,ca-certificates,sudo "$release" \
        "$root" "$mirror" > "$base/$release.debootstrap.log" 2>&1 ||
        { tail -20 "$base/$release.debootstrap.log"; exit 1; }
    cp /etc/resolv.conf "$root/etc/resolv.conf"
    mount -t proc proc "$root/proc"
    mount --rbind /sys "$root/sys"
    mount --rbind /dev "$root/dev"
    git clone -q "$repo" "$root/root/natremia"
    commit=$(git -C "$root/root/natremia" log -1 --format=%h)

    chroot "$root" /bin/bash -c "$inside" 2>&1 | tee "$base/$release.run.log"
    for log in demo tests recipe; do
        cp "$root/root/$log.log" "$base/$release.$log.log" 2>/dev/null || true
    done
    cleanup
    root=""

    line="$release ($(cat "$base/$release/etc/debian_version"), commit $commit):"
    for part in demo tests recipe; do
        result=$(sed -n "s/^result: $part //p" "$base/$release.run.log")
        [[ $result == ok* ]] || any_failed=1
        line+=" $part ${result:-FAILED (no result)};"
    done
    summary+=("$line")
done

for line in "${summary[@]}"; do
    echo "fresh-machine.sh: $line"
done
exit $any_failed
