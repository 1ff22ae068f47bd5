#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Long fuzzing run of tests/fuzz/fuzz_natremia.c (every public entry point),
# for the figures in docs/reliability.md.
#
# Runs libFuzzer in fork mode with -ignore_crashes, so one finding does not
# end the run: each crashing input is saved and the run goes on. At the end
# it prints executions, time, coverage and the distinct findings (one line
# per distinct breach message or sanitizer report) and appends a line to
# <out>/history.txt. The corpus is kept in <out>/corpus-long between runs.
#
# Usage: tests/fuzz-long.sh [--record] [SECONDS]     (default 1800)
#   --record  add this run as a row of the table of long runs in
#             docs/reliability.md (block "fuzz-long.sh", through
#             tests/lib/record_block.py); earlier rows are kept
# Environment: NTR_FUZZ_OUT (default <NTR_BUILD_PREFIX or "build">-fuzz-long),
# NTR_FUZZ_JOBS (parallel workers, default 1; the machine has 2 cores),
# NTR_FUZZ_SEED (default 1), NTR_FUZZ_CFLAGS (extra compiler flags),
# NTR_FUZZ_EXTRA_SANITIZE (default ",implicit-conversion"; see
# tests/fuzz/build.sh).
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
record=0
command="tests/fuzz-long.sh${*:+ $*}"
if [ "${1:-}" = "--record" ]; then
  record=1
  shift
fi
seconds="${1:-1800}"
out="${NTR_FUZZ_OUT:-${NTR_BUILD_PREFIX:-build}-fuzz-long}"
jobs="${NTR_FUZZ_JOBS:-1}"
seed="${NTR_FUZZ_SEED:-1}"
mkdir -p "$out/corpus-long" "$out/findings"
source tests/lib/record.sh
record_stamp "$out/record-stamp.json"

tests/fuzz/build.sh "$out" >"$out/build.log" 2>&1 || { cat "$out/build.log"; exit 1; }
tests/fuzz/seeds.sh "$out/fuzz_natremia" "$out/corpus-long" >/dev/null
log="$out/fuzz-long.log"
start=$(date +%s)
touch "$out/.run-start"
"$out/fuzz_natremia" -fork="$jobs" -ignore_crashes=1 -ignore_timeouts=1 -ignore_ooms=1 \
  -max_total_time="$seconds" -seed="$seed" -timeout=10 -rss_limit_mb=2048 \
  -artifact_prefix="$out/findings/" "$out/corpus-long" >"$log" 2>&1 || true
elapsed=$(( $(date +%s) - start ))

# Fork mode reports "#<execs>: cov: <edges> ft: <features> corp: <n> ..."
last=$(grep -E '^#[0-9]+: cov:' "$log" | tail -n 1 || true)
execs=$(sed -n 's/^#\([0-9]*\):.*/\1/p' <<<"$last")
cov=$(sed -n 's/.* cov: \([0-9]*\).*/\1/p' <<<"$last")
corp=$(sed -n 's/.* corp: \([0-9]*\).*/\1/p' <<<"$last")
# Findings of this run only (older ones stay in findings/ for reference).
crashes=$(find "$out/findings" -name 'crash-*' -newer "$out/.run-start" | wc -l)
distinct=$( { grep -hoE 'CONTRACT BREACH in [a-z_0-9]+: [^(]*' "$log" || true;
              grep -hoE 'runtime error: .*|ERROR: AddressSanitizer: [a-z-]+' "$log" | sed 's/0x[0-9a-f]*//g' || true; } |
            sort | uniq -c | sort -rn)
n_distinct=$(grep -c . <<<"$distinct" || true)
echo "fuzz-long: ${elapsed}s, ${execs:-?} executions, ${cov:-?} edges covered, corpus ${corp:-?}, ${crashes} crashing inputs, ${n_distinct} distinct findings"
[ -n "$distinct" ] && echo "$distinct"
echo "$(date -u +%Y-%m-%dT%H:%MZ) seconds=$elapsed jobs=$jobs seed=$seed execs=${execs:-?} edges=${cov:-?} corpus=${corp:-?} crashes=$crashes distinct=$n_distinct cflags='${NTR_FUZZ_CFLAGS:-}'" >>"$out/history.txt"
if [ "$record" -eq 1 ]; then
  if [ "$crashes" -eq 0 ]; then found="none (0 crashing inputs)"; else found="$n_distinct distinct ($crashes crashing inputs, in $out/findings)"; fi
  extra="${NTR_FUZZ_EXTRA_SANITIZE-,implicit-conversion}"
  extra="${extra#,}"
  config="fork mode, $jobs job(s), seed $seed, ASan + UBSan${extra:+ + ${extra//,/ + }}"
  [ -n "${NTR_FUZZ_CFLAGS:-}" ] && config+=", \`NTR_FUZZ_CFLAGS=$NTR_FUZZ_CFLAGS\`"
  commit_cell=$(/usr/bin/python3 -c 'import json, sys; s = json.load(open(sys.argv[1])); print("`%s`%s" % (s["commit"], " + uncommitted changes" if s["dirty"] else ""))' "$out/record-stamp.json")
  row="| $(date -u +%Y-%m-%d) | $commit_cell | $config | ${elapsed} s | ${execs:-?} | ${cov:-?} (fork-mode counter) | $found |"
  # The new row goes under the rows already recorded (a history of runs).
  /usr/bin/python3 - "$row" <<'EOF' |
import os, sys
sys.path.insert(0, os.path.join("tests", "lib"))
import record_block
text = open(record_block.doc_path(), encoding="utf-8").read()
body = record_block.block_body(text, "fuzz-long.sh") or ""
rows = [l for l in body.splitlines() if l.startswith("| ") and not l.startswith("| date")]
print("| date (UTC) | commit | configuration | time | executions | edges | findings |")
print("|---|---|---|---|---|---|---|")
print("\n".join(rows + [sys.argv[1]]))
EOF
    record_write fuzz-long.sh tests/fuzz-long.sh "$command" \
      "the last row of the table, $(clang --version | head -1)" Fuzzing "$out/record-stamp.json"
fi
[ "$crashes" -eq 0 ]
