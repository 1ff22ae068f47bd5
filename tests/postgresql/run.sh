#!/usr/bin/env bash
# Builds the PostgreSQL extension (bindings/postgresql) out of tree, starts
# a throwaway server on a Unix socket in a temporary directory, installs the
# extension there, runs tests/postgresql/checks.sql and stops the server.
#
#   run.sh SOURCE_ROOT
#
# Nothing is installed system-wide. The extension goes into a staging tree
# (make install DESTDIR=...), and the server runs from a copy of the
# postgres executable placed in that tree: PostgreSQL finds its share and
# library directories relative to its own executable, so the copy sees the
# staged extension next to links to the system's own files.
#
# As root the server runs as the user "postgres" (created by the
# postgresql-common package), or "nobody" when that user does not exist.
#
# Exit 77 (skipped) only when PostgreSQL 15's server or its development
# files are not installed (apt-get install postgresql-15
# postgresql-server-dev-15 make).
set -euo pipefail

src=$(cd "$1" && pwd)
pgbin=/usr/lib/postgresql/15/bin
pg_config=$pgbin/pg_config

for tool in "$pg_config" "$pgbin/initdb" "$pgbin/pg_ctl" "$pgbin/postgres" "$pgbin/psql"; do
    if [[ ! -x $tool ]]; then
        echo "skipped: $tool not found (apt-get install postgresql-15 postgresql-server-dev-15)"
        exit 77
    fi
done
if ! command -v make >/dev/null || [[ ! -f $("$pg_config" --pgxs) ]]; then
    echo "skipped: make or PGXS missing (apt-get install make postgresql-server-dev-15)"
    exit 77
fi

tmp=$(mktemp -d /tmp/natremia-pg.XXXXXX)
chmod 755 "$tmp"
server_user=""
run_as() { "$@"; }
if [[ $(id -u) -eq 0 ]]; then
    server_user=postgres
    id -u "$server_user" >/dev/null 2>&1 || server_user=nobody
    run_as() { runuser -u "$server_user" -- "$@"; }
fi

pgdata=$tmp/data
sockdir=$tmp/socket
started=no
cleanup() {
    if [[ $started == yes ]]; then
        run_as "$stage_bindir/pg_ctl" -D "$pgdata" -m immediate -w stop >/dev/null 2>&1 || true
    fi
    rm -rf "$tmp"
}
trap cleanup EXIT

# ---- build and stage the extension
mkdir "$tmp/build"
make -s -j2 -C "$tmp/build" -f "$src/bindings/postgresql/Makefile" \
    PG_CONFIG="$pg_config" NATREMIA_ROOT="$src"
make -s -j2 -C "$tmp/build" -f "$src/bindings/postgresql/Makefile" \
    PG_CONFIG="$pg_config" NATREMIA_ROOT="$src" install DESTDIR="$tmp/stage"

# ---- a server tree inside the stage: the postgres executable (copied, as
# PostgreSQL resolves symbolic links to find itself), links to every other
# file of the system's share and library directories
bindir=$("$pg_config" --bindir)
sharedir=$("$pg_config" --sharedir)
pkglibdir=$("$pg_config" --pkglibdir)
stage_bindir=$tmp/stage$bindir
mkdir -p "$stage_bindir" "$tmp/stage$sharedir/extension" "$tmp/stage$pkglibdir"
cp "$bindir/postgres" "$stage_bindir/postgres"
for tool in pg_ctl initdb; do
    ln -s "$bindir/$tool" "$stage_bindir/$tool"
done
link_all() {  # link_all FROM_DIR TO_DIR: link entries not already there
    local entry
    for entry in "$1"/*; do
        [[ -e "$2/$(basename "$entry")" ]] || ln -s "$entry" "$2/"
    done
}
link_all "$sharedir/extension" "$tmp/stage$sharedir/extension"
link_all "$sharedir" "$tmp/stage$sharedir"
link_all "$pkglibdir" "$tmp/stage$pkglibdir"

# ---- initdb, start on a private socket (no TCP), as the server user
# (from inside the temporary directory: the server user may not be allowed
# into the directory the test was started from)
cd "$tmp"
mkdir "$sockdir"
if [[ -n $server_user ]]; then
    chown -R "$server_user" "$tmp"
fi
run_as "$pgbin/initdb" -D "$pgdata" -U natremia_test --auth=trust \
    --no-instructions >"$tmp/initdb.log" 2>&1 || { cat "$tmp/initdb.log"; exit 1; }
run_as "$stage_bindir/pg_ctl" -D "$pgdata" -w -t 60 -l "$tmp/server.log" \
    -p "$stage_bindir/postgres" \
    -o "-k $sockdir -c listen_addresses= -c fsync=off -c max_parallel_workers_per_gather=2" \
    start >/dev/null || { cat "$tmp/server.log"; exit 1; }
started=yes

# CREATE EXTENSION in checks.sql finds natremia only if the staged
# executable is the one running: that also proves the relocation worked.
if ! "$pgbin/psql" -X -q -v ON_ERROR_STOP=1 -h "$sockdir" -U natremia_test \
        -d postgres -f "$src/tests/postgresql/checks.sql"; then
    echo "--- server log"
    tail -n 30 "$tmp/server.log"
    exit 1
fi
echo "postgresql extension: ok"
