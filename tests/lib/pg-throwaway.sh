# SPDX-License-Identifier: MIT
# A throwaway PostgreSQL server with the natremia extension, for
# tests/postgresql/run.sh and tests/bench/pg-bench.sh. Sourced, not run.
#
# Nothing is installed system-wide. The extension is built out of tree and
# goes into a staging tree (make install DESTDIR=...), and the server runs
# from a copy of the postgres executable placed in that tree: PostgreSQL
# finds its share and library directories relative to its own executable,
# so the copy sees the staged extension next to links to the system's own
# files. The server listens only on a Unix socket in a temporary directory
# (no TCP). As root it runs as the user "postgres" (created by the
# postgresql-common package), or "nobody" when that user does not exist.
#
#   pg_require
#       Exits 77 (skipped), with a note on stderr, when the PostgreSQL
#       server, psql, PGXS or make is missing.
#   pg_throwaway_start SOURCE_ROOT NAME SUPERUSER [SERVER_OPTION...]
#       Makes a temporary directory /tmp/NAME.XXXXXX, builds and stages the
#       extension from SOURCE_ROOT (make's output on stderr), runs initdb
#       with SUPERUSER (trust authentication) and starts the server with
#       fsync off and the extra "-c name=value" options. Stops the server
#       and removes the directory on exit. Sets:
#         pg_tmp     the temporary directory (server.log is in it)
#         pg_socket  the socket directory, for psql -h
#   pg_config is the pg_config used: $PG_CONFIG when set, else that of the
#   newest PostgreSQL under /usr/lib/postgresql/N whose server is installed
#   (Debian 12: 15, Debian 13: 17), else pg_config on the PATH.
#   pg_bin is that PostgreSQL's program directory (psql, postgres, ...),
#   from pg_config --bindir.

pg_find_config() {
    local dir major newest=""
    for dir in /usr/lib/postgresql/*/bin; do
        major=${dir#/usr/lib/postgresql/}
        major=${major%/bin}
        [[ $major =~ ^[0-9]+$ && -x $dir/pg_config && -x $dir/postgres ]] || continue
        if [[ -z $newest || $major -gt $newest ]]; then
            newest=$major
        fi
    done
    if [[ -n $newest ]]; then
        echo "/usr/lib/postgresql/$newest/bin/pg_config"
    else
        command -v pg_config || echo pg_config
    fi
}

pg_config=${PG_CONFIG:-$(pg_find_config)}
pg_bin=$("$pg_config" --bindir 2>/dev/null || echo "(pg_config not found)")

pg_require() {
    local tool
    for tool in "$pg_config" "$pg_bin/initdb" "$pg_bin/pg_ctl" "$pg_bin/postgres" "$pg_bin/psql"; do
        if [[ ! -x $tool ]]; then
            echo "skipped: $tool not found (apt-get install postgresql-N postgresql-server-dev-N, N the major version your Debian ships: 15 on Debian 12, 17 on Debian 13)" >&2
            exit 77
        fi
    done
    if ! command -v make >/dev/null || [[ ! -f $("$pg_config" --pgxs) ]]; then
        echo "skipped: make or PGXS missing (apt-get install make postgresql-server-dev-N)" >&2
        exit 77
    fi
}

pg_server_user=""
pg_started=no

pg_run_as_server() {
    if [[ -n $pg_server_user ]]; then
        runuser -u "$pg_server_user" -- "$@"
    else
        "$@"
    fi
}

pg_throwaway_stop() {
    if [[ $pg_started == yes ]]; then
        pg_run_as_server "$pg_stage_bindir/pg_ctl" -D "$pg_tmp/data" -m immediate -w stop \
            >/dev/null 2>&1 || true
    fi
    rm -rf "$pg_tmp"
}

# link_all FROM_DIR TO_DIR: link the entries of FROM_DIR not already in TO_DIR
pg_link_all() {
    local entry
    for entry in "$1"/*; do
        [[ -e "$2/$(basename "$entry")" ]] || ln -s "$entry" "$2/"
    done
}

pg_throwaway_start() {
    local src="$1" name="$2" superuser="$3" options="-c listen_addresses= -c fsync=off" opt
    shift 3
    for opt in "$@"; do
        options+=" -c $opt"
    done
    pg_tmp=$(mktemp -d "/tmp/$name.XXXXXX")
    chmod 755 "$pg_tmp"
    pg_socket=$pg_tmp/socket
    if [[ $(id -u) -eq 0 ]]; then
        pg_server_user=postgres
        id -u "$pg_server_user" >/dev/null 2>&1 || pg_server_user=nobody
    fi
    trap pg_throwaway_stop EXIT

    # ---- build and stage the extension
    mkdir "$pg_tmp/build"
    make -s -j2 -C "$pg_tmp/build" -f "$src/bindings/postgresql/Makefile" \
        PG_CONFIG="$pg_config" NATREMIA_ROOT="$src" >&2
    make -s -j2 -C "$pg_tmp/build" -f "$src/bindings/postgresql/Makefile" \
        PG_CONFIG="$pg_config" NATREMIA_ROOT="$src" install DESTDIR="$pg_tmp/stage" >&2

    # ---- a server tree inside the stage: the postgres executable (copied,
    # as PostgreSQL resolves symbolic links to find itself), links to every
    # other file of the system's share and library directories
    local bindir sharedir pkglibdir tool
    bindir=$("$pg_config" --bindir)
    sharedir=$("$pg_config" --sharedir)
    pkglibdir=$("$pg_config" --pkglibdir)
    pg_stage_bindir=$pg_tmp/stage$bindir
    mkdir -p "$pg_stage_bindir" "$pg_tmp/stage$sharedir/extension" "$pg_tmp/stage$pkglibdir"
    cp "$bindir/postgres" "$pg_stage_bindir/postgres"
    for tool in pg_ctl initdb; do
        ln -s "$bindir/$tool" "$pg_stage_bindir/$tool"
    done
    pg_link_all "$sharedir/extension" "$pg_tmp/stage$sharedir/extension"
    pg_link_all "$sharedir" "$pg_tmp/stage$sharedir"
    pg_link_all "$pkglibdir" "$pg_tmp/stage$pkglibdir"

    # ---- initdb, start on the private socket, as the server user (from
    # inside the temporary directory: the server user may not be allowed
    # into the directory the script was started from)
    mkdir "$pg_socket"
    [[ -z $pg_server_user ]] || chown -R "$pg_server_user" "$pg_tmp"
    (cd "$pg_tmp" && pg_run_as_server "$pg_bin/initdb" -D "$pg_tmp/data" -U "$superuser" \
        --auth=trust --no-instructions >"$pg_tmp/initdb.log" 2>&1) ||
        { cat "$pg_tmp/initdb.log" >&2; exit 1; }
    (cd "$pg_tmp" && pg_run_as_server "$pg_stage_bindir/pg_ctl" -D "$pg_tmp/data" -w -t 60 \
        -l "$pg_tmp/server.log" -p "$pg_stage_bindir/postgres" \
        -o "-k $pg_socket $options" start >/dev/null) ||
        { cat "$pg_tmp/server.log" >&2; exit 1; }
    pg_started=yes
}
