#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Runs the README's instructions on freshly bootstrapped Debian machines:
# Debian 12 (bookworm) and Debian 13 (trixie), each a chroot made by
# debootstrap --variant=minbase (plus git, ca-certificates and sudo) from
# Debian's mirror, with a clean clone of the committed HEAD of this
# repository. In each: the two commands (the demo, then the test command),
# then, as written in README.md, the install-and-link recipe of "Using it
# from C" (with the program it builds), the Python line and the SQL line:
# each is the fenced block after its marker <!-- fresh-machine: NAME -->
# (install, python, sql-install, sql; tests/lib/readme-blocks.sh), so what
# runs is what the README says. The SQL runs on a throwaway server (Unix
# socket only) against an invented `results` table, after the README's own
# build-and-install lines. This catches an install step that a developer
# machine hides because a package is already there.
# Needs root and the Debian mirror; takes about ten minutes a release. Not
# part of CI. The chroots run one after the other, never side by side.
#
#   bash tests/fresh-machine.sh [--record] [bookworm|trixie|both] [workdir]
#       (default both; workdir default: a new temp dir; each release gets
#       workdir/<release>, its logs workdir/<release>.*.log)
#
# Ends with one line per release: the test command's "N passed, N failed,
# N skipped", its time, and whether the demo, the recipe, the Python line
# and the SQL line passed. Exit status non-zero when anything failed on any
# release. The same results go to workdir/results.tsv as the run goes
# (format: tests/lib/fresh_machine_record.py); with --record they are
# written into docs/reliability.md, one table row per release, by
# tests/lib/fresh_machine_record.py (failed steps too: the table says so).
set -euo pipefail
[ "$(id -u)" -eq 0 ] || { echo "fresh-machine.sh: run as root (debootstrap, chroot)" >&2; exit 2; }
repo=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
. "$repo/tests/lib/apt-missing.sh"
apt_missing debootstrap git

record=0
command="bash tests/fresh-machine.sh${*:+ $*}"
if [[ ${1:-} == --record ]]; then
    record=1
    shift
fi
case ${1:-both} in
    bookworm | 12) releases=(bookworm) ;;
    trixie | 13) releases=(trixie) ;;
    both) releases=(bookworm trixie) ;;
    *) echo "usage: $0 [bookworm|trixie|both] [workdir]" >&2; exit 2 ;;
esac
base=${2:-$(mktemp -d /tmp/natremia-fresh.XXXXXX)}
mkdir -p "$base"
results=$base/results.tsv
printf 'run\tcommand\t%s\nrun\tdate\t%s\n' "$command" "$(date -u +%Y-%m-%d)" > "$results"
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
       readme_marked README.md install > /root/recipe.sh; then
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

# Then the Python line and the SQL line, as the README writes them, after
# the recipe (the binding loads the library it installed). A quoted
# here-document, so that these lines may hold single quotes.
read -r -d '' inside_bindings <<'INSIDE' || true
    cd /root/natremia
    if readme_marked README.md python > /root/python.sh; then
        echo "--- python"; cat /root/python.sh
        if bash -e /root/python.sh > /root/python.log 2>&1 && grep -q "fall_over_24h" /root/python.log; then
            echo "result: python ok ($(tail -1 /root/python.log))"
        else
            tail -30 /root/python.log; echo "result: python FAILED"
        fi
    else
        echo "result: python FAILED (not found in README.md)"
    fi

    # The README's build-and-install lines, then its SQL on a throwaway
    # server of the newest PostgreSQL installed (the test command installed
    # it), run as the postgres user, listening on a Unix socket only. The
    # table the query reads is invented: one patient lowered from 165 to
    # 140 mmol/L in 24 h (a fall of 25, over the 10 of hyper_chronic), one
    # from 160 to 152 (within it).
    if readme_marked README.md sql-install > /root/sql-install.sh &&
       readme_marked README.md sql > /root/readme.sql; then
        echo "--- sql"; cat /root/sql-install.sh /root/readme.sql
        pgbin=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1)
        pgdir=$(mktemp -d /tmp/fresh-pg.XXXXXX)
        chown postgres "$pgdir"
        cat > /root/results.sql <<'SQL'
CREATE TABLE results (patient_id text, hours float8, na float8);
-- invented patients, not data
INSERT INTO results VALUES ('A', 0, 165), ('A', 24, 140), ('B', 0, 160), ('B', 24, 152);
SQL
        chmod 644 /root/results.sql /root/readme.sql
        cp /root/results.sql /root/readme.sql "$pgdir/"
        if { bash -e /root/sql-install.sh &&
             su postgres -s /bin/bash -c "$pgbin/initdb -D $pgdir/data -U postgres -A trust &&
                 $pgbin/pg_ctl -D $pgdir/data -w -l $pgdir/server.log -o \"-k $pgdir -c listen_addresses=\" start" &&
             su postgres -s /bin/bash -c "$pgbin/psql -h $pgdir -U postgres -d postgres -v ON_ERROR_STOP=1 -X -A -F , \
                 -f $pgdir/results.sql -f $pgdir/readme.sql"; } > /root/sql.log 2>&1 &&
           grep -q "^A,.*fall_over_24h" /root/sql.log && grep "^B," /root/sql.log | grep -vq "fall_over_24h"; then
            echo "result: sql ok ($pgbin; $(grep -c "^[AB]," /root/sql.log) patients assessed)"
        else
            tail -30 /root/sql.log; cat "$pgdir/server.log" 2>/dev/null | tail -10
            echo "result: sql FAILED"
        fi
        su postgres -s /bin/bash -c "$pgbin/pg_ctl -D $pgdir/data -m fast stop" > /dev/null 2>&1 || true
    else
        echo "result: sql FAILED (not found in README.md)"
    fi
INSIDE

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
    commit=$(git -C "$root/root/natremia" rev-parse --short=12 HEAD)

    chroot "$root" /bin/bash -c "$inside
$inside_bindings" 2>&1 | tee "$base/$release.run.log"
    for log in demo tests recipe python sql; do
        cp "$root/root/$log.log" "$base/$release.$log.log" 2>/dev/null || true
    done
    cleanup
    root=""

    version=$(cat "$base/$release/etc/debian_version")
    line="$release ($version, commit $commit):"
    printf '%s\tversion\t%s\n%s\tcommit\t%s\n' "$release" "$version" "$release" "$commit" >> "$results"
    for part in demo tests recipe python sql; do
        result=$(sed -n "s/^result: $part //p" "$base/$release.run.log" | head -1)
        [[ $result == ok* ]] || any_failed=1
        line+=" $part ${result:-FAILED (no result)};"
        printf '%s\t%s\t%s\n' "$release" "$part" "${result:-FAILED (no result)}" >> "$results"
    done
    summary+=("$line")
done

for line in "${summary[@]}"; do
    echo "fresh-machine.sh: $line"
done
echo "fresh-machine.sh: results in $results"
if [[ $record -eq 1 ]]; then
    /usr/bin/python3 "$repo/tests/lib/fresh_machine_record.py" "$results" || any_failed=1
fi
exit $any_failed
