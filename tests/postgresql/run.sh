#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Builds the PostgreSQL extension (bindings/postgresql) out of tree, starts
# a throwaway server on a Unix socket in a temporary directory, installs the
# extension there, runs tests/postgresql/checks.sql and stops the server.
#
#   run.sh SOURCE_ROOT
#
# Nothing is installed system-wide; the server and its staging tree are
# described in tests/lib/pg-throwaway.sh.
#
# Exit 77 (skipped) only when a PostgreSQL server or its development files
# are not installed (apt-get install postgresql-N postgresql-server-dev-N
# make, N the major version the release ships: 15 on Debian 12, 17 on
# Debian 13; tests/run-all.sh finds N). Which PostgreSQL is used:
# tests/lib/pg-throwaway.sh.
set -euo pipefail

src=$(cd "$1" && pwd)
source "$src/tests/lib/pg-throwaway.sh"
pg_require
pg_throwaway_start "$src" natremia-pg natremia_test max_parallel_workers_per_gather=2

# CREATE EXTENSION in checks.sql finds natremia only if the staged
# executable is the one running: that also proves the relocation worked.
if ! "$pg_bin/psql" -X -q -v ON_ERROR_STOP=1 -h "$pg_socket" -U natremia_test \
        -d postgres -f "$src/tests/postgresql/checks.sql"; then
    echo "--- server log"
    tail -n 30 "$pg_tmp/server.log"
    exit 1
fi
echo "postgresql extension: ok ($("$pg_bin/postgres" --version))"
