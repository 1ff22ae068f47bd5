#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Frama-C value analysis (EVA) of lib/ (docs/reliability.md, "Static proof").
#
# Parses lib/*.c with the drivers of tests/frama-c/drivers*.c once, then
# runs EVA from each driver: one public
# entry point over the whole documented range of every input. Prints the
# alarms of each entry point (each is a place where EVA cannot exclude an
# overflow, NaN or infinity, division by zero, invalid memory access or
# uninitialised read for some input in those ranges) and the totals.
#
# lib/batch.c is parsed twice. First with __SSE2__ and __aarch64__
# undefined, so EVA follows the row loops through the scalar kernels, the
# code other targets run. Then the two-lane path: EVA does not model GCC
# vector extensions or SSE2 intrinsics, so a copy of lib/batch.c has its
# block of vector types and pair primitives replaced, line for line, by
# the plain-C model tests/frama-c/lanes_model.h (one abstract lane stands
# for both, see there); the two-lane kernels, pair functions and pair
# loops are lib/batch.c's own. Every batch driver of
# tests/frama-c/drivers_batch.c runs on both (the second as
# lanes:drv_batch_NAME, printed lanes_batch_NAME).
#
# Usage: tests/frama-c.sh [--record] [driver ...]   (default: every drv_*
#        and lanes:drv_batch_*; the extra_* drivers of
#        tests/frama-c/drivers_series.c run only when named, see there)
#   --record  write the figures into docs/reliability.md (between markers)
# Environment: NTR_FRAMA_PRECISION (EVA -eva-precision, default 8: below it
# EVA merges the paths of a status check and reports outputs of failed
# helper calls as uninitialised); NTR_FRAMA_PLAN_PRECISION (default 5) for
# the plan-check, course-watcher, fit, lowering-plan and urine-feedback
# drivers (see "Per-driver tuning").
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
source tests/lib/apt-missing.sh
apt_missing --quiet frama-c-base

record=0
if [ "${1:-}" = "--record" ]; then
  record=1
  shift
fi
precision="${NTR_FRAMA_PRECISION:-8}"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
start=$SECONDS
/usr/bin/python3 tests/lib/record_block.py stamp >"$work/stamp.json"

frama-c -cpp-extra-args="-Iinclude -Ilib -DNTR_BUILDING -U__SSE2__ -U__aarch64__" lib/*.c \
  tests/frama-c/drivers*.c -save "$work/ast.sav" >"$work/parse.log" 2>&1 || {
  cat "$work/parse.log"; echo "frama-c.sh: parsing failed"; exit 1; }

# The two-lane copy of lib/batch.c: the #if that selects the two-lane
# path, and the block from its vector types to the last target-specific
# primitive, become the model (blank lines keep every line number).
mkdir "$work/lanes"
awk '
  state == 0 && /^#if !NTR_BATCH_LOOPS && defined\(__GNUC__\) && \\$/ {
    print "#if !NTR_BATCH_LOOPS /* frama-c.sh: the two-lane model */"; state = 1; next }
  state == 1 { print ""; if ($0 !~ /\\$/) state = 2; next }
  state == 2 && /^#if defined\(__SSE2__\)$/ { print "#include \"lanes_model.h\""; state = 3; next }
  state == 3 && /^\/\* Both lanes: lo <= x <= hi/ { state = 4 }
  state == 3 { print ""; next }
  { print }
  END { if (state != 4) { print "frama-c.sh: lib/batch.c: two-lane block not found" > "/dev/stderr"; exit 1 } }
' lib/batch.c >"$work/lanes/batch.c"
if grep -q vector_size "$work/lanes/batch.c"; then
  echo "frama-c.sh: the two-lane copy of lib/batch.c still has vector types"; exit 1
fi
frama-c -cpp-extra-args="-Iinclude -Ilib -Itests/frama-c -DNTR_BUILDING -U__SSE2__ -U__aarch64__" \
  $(ls lib/*.c | grep -v '^lib/batch\.c$') "$work/lanes/batch.c" \
  tests/frama-c/drivers*.c -save "$work/lanes.sav" >"$work/parse-lanes.log" 2>&1 || {
  cat "$work/parse-lanes.log"; echo "frama-c.sh: parsing the two-lane copy failed"; exit 1; }

drivers=("$@")
if [ ${#drivers[@]} -eq 0 ]; then
  mapfile -t drivers < <(sed -n 's/^void \(drv_[a-z0-9_]*\)(void)$/\1/p' tests/frama-c/drivers*.c
    sed -n 's/^void \(drv_batch_[a-z0-9_]*\)(void)$/lanes:\1/p' tests/frama-c/drivers_batch.c)
fi

total=0
clean=0
report="$work/report.md"
: >"$report"
for entry in "${drivers[@]}"; do
  d="${entry#lanes:}"
  ast="$work/ast.sav"
  name="${d#drv_}"
  if [ "$entry" != "$d" ]; then
    ast="$work/lanes.sav"
    name="lanes_$name"
  fi
  log="$work/$name.log"
  # Special floats the code uses on purpose: a failed batch row is NaN by
  # contract, so for the batch drivers NaN and infinity alarms are off and
  # each driver asserts instead that no output is infinite
  # (tests/frama-c/drivers_batch.c); the series code starts its minima and
  # maxima at +-HUGE_VAL, so for the series drivers only NaN raises an
  # alarm (tests/frama-c/drivers_series.c). EVA stops a path at an alarm it
  # is sure of, so without this it would not look past those constants.
  # Per-driver tuning: the plan checks (tests/frama-c/drivers_series.c)
  # run the correction engine's window scans over history and plan points,
  # and the course watcher judges both directions after every push; at
  # precision 8 EVA follows them path by path (not finished in 400 s,
  # even on the bounded grid); precision 5 with the last branch kept apart
  # (-eva-partition-history 1, as precision 8 sets) finishes in 90 to 270 s
  # each on the shared machine, without the uninitialised-output alarms of
  # a plain precision 5. The same for the fit (its iterations), the
  # lowering plan (a course of 49 points, not finished in 4 min at
  # precision 8; 88 s so) and the urine feedback (its plan check).
  prec="$precision"
  tuning=()
  case "$d" in
    drv_plan_check | drv_course_plan_check | drv_fit_reproject | drv_course_watch | \
      drv_course_fit | drv_hyper_lower_plan | drv_urine_feedback)
      prec="${NTR_FRAMA_PLAN_PRECISION:-5}"
      tuning=(-eva-partition-history 1) ;;
  esac
  special=()
  if [[ "$d" == drv_batch_* ]]; then
    special=(-warn-special-float none)
  elif grep -q "^void $d(void)$" tests/frama-c/drivers_series.c; then
    special=(-warn-special-float nan)
  fi
  frama-c -load "$ast" -eva -main "$d" -eva-precision "$prec" \
    "${special[@]}" "${tuning[@]}" -eva-msg-key=-initial-state,-final-states >"$log" 2>&1 || true
  # The copy's path is lib/batch.c's (same line numbers).
  sed -i "s|$work/lanes/batch\.c|lib/batch.c|g" "$log"
  if ! grep -q 'ANALYSIS SUMMARY' "$log"; then
    echo "frama-c.sh: $name: analysis did not finish"; tail -5 "$log"; exit 1
  fi
  n="$(sed -n 's/^ *\([0-9][0-9]*\) alarms\{0,1\} generated by the analysis.*/\1/p' "$log" | head -1)"
  n="${n:-0}"
  # A driver's own assertion that EVA cannot prove counts as an alarm.
  a="$(sed -n 's/^ *Assertions *[0-9]* valid *\([0-9]*\) unknown *\([0-9]*\) invalid.*/\1 \2/p' "$log" | head -1)"
  for k in $a; do n=$((n + k)); done
  total=$((total + n))
  [ "$n" -eq 0 ] && clean=$((clean + 1))
  printf '%-36s %s alarm(s)\n' "$name" "$n"
  # Each alarm: file:line and the assertion EVA could not prove (the line
  # after the [eva:alarm] one), then the drivers' own assertions not proved.
  { awk '/\[eva:alarm\]/ { loc = $2; sub(/:$/, "", loc); getline; gsub(/^ +| +$/, ""); print loc ": " $0 }' "$log"
    sed -n "s/^\[eva\] \([^ ]*\): assertion '\([^']*\)' got final status \(unknown\|invalid\)\..*/\1 assertion \2 \3/p" "$log"
    awk '/^\[eva\] [^ ]*:[0-9]*: *$/ { loc = $2; sub(/:$/, "", loc); getline; if ($0 ~ /assertion .* got final status (unknown|invalid)/) { gsub(/^ +| +$/, ""); print loc " " $0 } }' "$log"; } |
    { grep -v "assertion '*Eva," || true; } |
    sort -u >"$work/$name.alarms"
  while read -r line; do
    echo "    $line"
    # In a code span, with each backslash doubled: EVA writes ACSL such as
    # \initialized, which Doxygen would otherwise read as a command.
    md=${line//\`/}
    md=${md//\\/\\\\}
    echo "  - \`$name\` \`$md\`" >>"$report"
  done <"$work/$name.alarms"
done
elapsed=$((SECONDS - start))
lanes=0
for entry in "${drivers[@]}"; do
  if [[ "$entry" == lanes:* ]]; then
    lanes=$((lanes + 1))
  fi
done
summary="EVA (Frama-C $(frama-c -version 2>/dev/null | head -1), -eva-precision $precision, ${NTR_FRAMA_PLAN_PRECISION:-5} with -eva-partition-history 1 for the plan checks, the course watcher, the fit, the lowering plan and the urine feedback) from ${#drivers[@]} driver runs ($lanes of them on the two-lane path): $total alarms; $clean of ${#drivers[@]} runs without an alarm [${elapsed}s]"
echo "frama-c.sh: $summary"

if [ "$record" -eq 1 ]; then
  {
    if [ -s "$report" ]; then
      echo "Remaining alarms (each explained in the section \"Static proof: Frama-C value analysis\" above):"
      echo
      cat "$report"
    else
      echo "No alarm."
    fi
  } | /usr/bin/python3 tests/lib/record_block.py write --name frama-c.sh --script tests/frama-c.sh \
        --command "tests/frama-c.sh --record${*:+ $*}" --summary "$summary" --stamp-file "$work/stamp.json"
fi
