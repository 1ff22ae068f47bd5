#!/usr/bin/env bash
# Runs the README's two commands on a freshly bootstrapped Debian 12
# (debootstrap --variant=minbase, plus git, ca-certificates and sudo) in a
# chroot, from a clean clone of the committed main. This catches an install
# step that a developer machine hides because the package is already there.
# Needs root and the Debian mirror; takes about six minutes. Not part of CI.
#
#   bash tests/fresh-machine.sh [workdir]      (default: a new temp dir)
set -euo pipefail
[ "$(id -u)" -eq 0 ] || { echo "fresh-machine.sh: run as root (debootstrap, chroot)" >&2; exit 2; }
repo=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
. "$repo/tests/lib/apt-missing.sh"
apt_missing debootstrap git

root=${1:-$(mktemp -d /tmp/natremia-fresh.XXXXXX)}
cleanup() {
    umount -R "$root/dev" 2>/dev/null || true
    umount -R "$root/sys" 2>/dev/null || true
    umount "$root/proc" 2>/dev/null || true
}
trap cleanup EXIT

# mktemp makes the directory 0700; as the chroot's "/" it must be 0755, or
# no user but root (the PostgreSQL test's server user) can reach anything.
chmod 755 "$root"
debootstrap --variant=minbase --include=git,ca-certificates,sudo bookworm \
    "$root" http://deb.debian.org/debian > "$root.debootstrap.log" 2>&1
cp /etc/resolv.conf "$root/etc/resolv.conf"
mount -t proc proc "$root/proc"
mount --rbind /sys "$root/sys"
mount --rbind /dev "$root/dev"
git clone -q "$repo" "$root/root/natremia"

chroot "$root" /bin/bash -c '
    set -e
    export HOME=/root
    cd /root/natremia
    bash examples/run-demo.sh > /root/demo.log 2>&1 || { tail -30 /root/demo.log; exit 1; }
    grep -q "decision support" /root/demo.log
    echo "fresh-machine.sh: demo command ok"
    bash tests/run-all.sh > /root/tests.log 2>&1 || { tail -40 /root/tests.log; exit 1; }
    tail -1 /root/tests.log
'
echo "fresh-machine.sh: both README commands pass on a fresh Debian 12 ($root)"
