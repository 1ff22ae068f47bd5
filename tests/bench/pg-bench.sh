#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# PostgreSQL side of the natremia benchmarks (issue P7).
#
#   pg-bench.sh SOURCE_ROOT ROWS REPEATS   -> one JSON object on stdout
#
# Starts the throwaway server that tests/postgresql/run.sh uses too
# (tests/lib/pg-throwaway.sh: extension built and staged out of tree, a copy
# of the postgres executable in the stage, initdb and pg_ctl on a Unix
# socket in a temporary directory, run as the "postgres" user, or "nobody",
# when started as root), fills a table of
# ROWS invented rows and times, in one session with parallel query off:
#   extension  SELECT sum(ntr_osm_effective(na, glucose)) FROM t
#   bare SQL   SELECT sum(2*na + glucose) FROM t            (no validation)
#   PL/pgSQL   the same formula with the same validation in PL/pgSQL
#   SQL fn     the same formula and validation as a LANGUAGE sql function
#              (one CASE with BETWEEN; not STRICT, so the planner inlines
#              it into the query: the fastest checked SQL a skilled user
#              writes, issue 16)
# and the same three for ntr_osm_calculated (four inputs and the formula
# name). Each query runs REPEATS times in turn with the others; the time is
# the backend's CPU time (utime + stime from /proc, 10 ms ticks), so other
# processes on a shared machine do not count; the least is kept.
# Exit 77 when PostgreSQL 15 or its development files are missing.
set -euo pipefail

src=$(cd "$1" && pwd)
rows=${2:-5000000}
repeats=${3:-3}
source "$src/tests/lib/pg-throwaway.sh"
pg_require
pg_throwaway_start "$src" natremia-pgbench natremia_bench \
    shared_buffers=512MB max_parallel_workers_per_gather=0 jit=off
tmp=$pg_tmp

# ---- one session: data, functions, then the timed queries
queries=(
  "ext_effective|SELECT sum(ntr_osm_effective(na, glucose)) FROM t"
  "sql_effective|SELECT sum(2 * na + glucose) FROM t"
  "plpgsql_effective|SELECT sum(plpgsql_osm_effective(na, glucose)) FROM t"
  "sqlfn_effective|SELECT sum(sqlfn_osm_effective(na, glucose)) FROM t"
  "ext_calculated|SELECT sum(ntr_osm_calculated(na, glucose, urea, ethanol)) FROM t"
  "sql_calculated|SELECT sum(2 * na + glucose + urea + ethanol) FROM t"
  "plpgsql_calculated|SELECT sum(plpgsql_osm_calculated(na, glucose, urea, ethanol)) FROM t"
  "sqlfn_calculated|SELECT sum(sqlfn_osm_calculated(na, glucose, urea, ethanol)) FROM t"
)
script=$tmp/bench.sql
cat >"$script" <<SQL
\set ON_ERROR_STOP 1
\pset tuples_only on
\pset format unaligned
SET client_min_messages = warning;
CREATE EXTENSION natremia;
SELECT setseed(0.2026);
-- Invented rows: plausible sodium, glucose, urea and ethanol, mmol/L.
CREATE TABLE t AS
SELECT 110 + 50 * random() AS na, 3 + 37 * random() AS glucose,
       2 + 28 * random() AS urea, CASE WHEN random() < 0.1 THEN 20 * random() ELSE 0 END AS ethanol
FROM generate_series(1, $rows);
VACUUM ANALYZE t;
-- What a careful team would write without natremia: the same checks
-- (finite, then inside the documented range, in argument order), NULL for
-- invalid input, then the formula.
CREATE FUNCTION plpgsql_osm_effective(na float8, glucose float8)
RETURNS float8 LANGUAGE plpgsql IMMUTABLE STRICT PARALLEL SAFE AS \$\$
BEGIN
    IF na IN ('NaN', 'Infinity', '-Infinity') OR na < 80 OR na > 220 THEN
        RETURN NULL;
    END IF;
    IF glucose IN ('NaN', 'Infinity', '-Infinity') OR glucose < 0 OR glucose > 200 THEN
        RETURN NULL;
    END IF;
    RETURN 2 * na + glucose;
END \$\$;
CREATE FUNCTION plpgsql_osm_calculated(na float8, glucose float8, urea float8,
                                       ethanol float8)
RETURNS float8 LANGUAGE plpgsql IMMUTABLE STRICT PARALLEL SAFE AS \$\$
BEGIN
    IF na IN ('NaN', 'Infinity', '-Infinity') OR na < 80 OR na > 220 THEN
        RETURN NULL;
    END IF;
    IF glucose IN ('NaN', 'Infinity', '-Infinity') OR glucose < 0 OR glucose > 200 THEN
        RETURN NULL;
    END IF;
    IF urea IN ('NaN', 'Infinity', '-Infinity') OR urea < 0 OR urea > 200 THEN
        RETURN NULL;
    END IF;
    IF ethanol IN ('NaN', 'Infinity', '-Infinity') OR ethanol < 0 OR ethanol > 400 THEN
        RETURN NULL;
    END IF;
    RETURN 2 * na + glucose + urea + ethanol;
END \$\$;
-- The same checks as SQL-language functions. In PostgreSQL NaN sorts above
-- every number and the infinities outside any finite bound, so one BETWEEN
-- per input rejects non-finite values too. Not STRICT: a STRICT function
-- with a CASE body is not inlined.
CREATE FUNCTION sqlfn_osm_effective(na float8, glucose float8)
RETURNS float8 LANGUAGE sql IMMUTABLE PARALLEL SAFE AS \$\$
    SELECT CASE WHEN na BETWEEN 80 AND 220 AND glucose BETWEEN 0 AND 200
                THEN 2 * na + glucose END
\$\$;
CREATE FUNCTION sqlfn_osm_calculated(na float8, glucose float8, urea float8,
                                     ethanol float8)
RETURNS float8 LANGUAGE sql IMMUTABLE PARALLEL SAFE AS \$\$
    SELECT CASE WHEN na BETWEEN 80 AND 220 AND glucose BETWEEN 0 AND 200
                 AND urea BETWEEN 0 AND 200 AND ethanol BETWEEN 0 AND 400
                THEN 2 * na + glucose + urea + ethanol END
\$\$;
-- The ways must agree before they are timed: on the table, and on every
-- kind of invalid input (NULL from all of them).
SELECT CASE WHEN abs(sum(ntr_osm_effective(na, glucose)) - sum(2 * na + glucose)) < 1e-3 * count(*)
             AND abs(sum(plpgsql_osm_effective(na, glucose)) - sum(2 * na + glucose)) < 1e-3 * count(*)
             AND abs(sum(ntr_osm_calculated(na, glucose, urea, ethanol)) - sum(2 * na + glucose + urea + ethanol)) < 1e-3 * count(*)
             AND abs(sum(plpgsql_osm_calculated(na, glucose, urea, ethanol)) - sum(2 * na + glucose + urea + ethanol)) < 1e-3 * count(*)
             AND abs(sum(sqlfn_osm_effective(na, glucose)) - sum(2 * na + glucose)) < 1e-3 * count(*)
             AND abs(sum(sqlfn_osm_calculated(na, glucose, urea, ethanol)) - sum(2 * na + glucose + urea + ethanol)) < 1e-3 * count(*)
             AND (SELECT bool_and(ntr_osm_effective(a, b) IS NULL AND plpgsql_osm_effective(a, b) IS NULL
                                  AND sqlfn_osm_effective(a, b) IS NULL)
                  FROM (VALUES ('NaN'::float8, 5::float8), ('Infinity', 5), ('-Infinity', 5),
                               (79.9, 5), (220.1, 5), (140, -0.1), (140, 200.1), (140, 'NaN')) AS bad(a, b))
        THEN 'agree' ELSE 'DIFFER' END FROM t \g $tmp/agreement.txt
SELECT pg_backend_pid() \g $tmp/pid.txt
SQL
for ((r = 0; r < repeats; r++)); do
    for entry in "${queries[@]}"; do
        name=${entry%%|*}
        query=${entry#*|}
        {
            echo "\\! echo $name \$(awk '{print \$14 + \$15}' /proc/\$(cat $tmp/pid.txt)/stat) >> $tmp/times.txt"
            echo "$query;"
            echo "\\! echo $name \$(awk '{print \$14 + \$15}' /proc/\$(cat $tmp/pid.txt)/stat) >> $tmp/times.txt"
        } >>"$script"
    done
done
chmod 644 "$script"
touch "$tmp/times.txt" "$tmp/agreement.txt" "$tmp/pid.txt"
chmod 666 "$tmp/times.txt" "$tmp/agreement.txt" "$tmp/pid.txt"
"$pg_bin/psql" -X -q -h "$pg_socket" -U natremia_bench -d postgres -f "$script" >/dev/null

python3 - "$tmp/times.txt" "$rows" "$repeats" "$("$pg_bin/postgres" --version)" "$(cat "$tmp/agreement.txt")" <<'PY'
import json, os, sys
path, rows, repeats, version = sys.argv[1], int(sys.argv[2]), int(sys.argv[3]), sys.argv[4]
agreement = sys.argv[5].strip()
tick = os.sysconf("SC_CLK_TCK")
start, best = {}, {}
for line in open(path):
    name, value = line.split()
    if name in start:
        t = (int(value) - start.pop(name)) / tick
        best[name] = min(best.get(name, t), t)
    else:
        start[name] = int(value)
print(json.dumps({"rows": rows, "repeats": repeats, "server": version,
                  "clock_tick_s": 1.0 / tick, "agreement": agreement,
                  "seconds": best}, indent=1))
PY
