#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Runs the example programs and the demo on known input and checks the
# numbers they print against published values (P5).
#
#   check_examples.sh examples <build/examples>   the small examples, the demo's text and
#                                                 examples/fhir_bundle.py (Python)
#   check_examples.sh chart    <build/examples>   the demo's SVG chart, rendered to PNG
#
# The chart check needs rsvg-convert (Debian package librsvg2-bin); without
# it that test is skipped (exit 77). tests/run-all.sh installs it.
set -euo pipefail

if [[ $# -ne 2 ]]; then
    echo "usage: $0 examples|chart <build/examples>" >&2
    exit 1
fi
mode=$1
bin=$(cd "$2" && pwd)
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
failures=0
checks=0

ok() { checks=$((checks + 1)); echo "OK: $*"; }
fail() { checks=$((checks + 1)); failures=$((failures + 1)); echo "FAIL: $*"; }

# The number printed on the first line matching a pattern: the first
# number after the pattern and after the last ":", "=" or "->" that
# follows it. (Patterns contain no "/".)
number_after() { # file pattern
    grep -m1 -E -- "$2" "$1" | sed -E "s/.*($2)//; s/.*(:|=|->)//" \
        | grep -o -E '[-+]?[0-9]+(\.[0-9]+)?' | head -1
}

# expect_near file pattern expected tolerance what
expect_near() {
    local got
    got=$(number_after "$1" "$2" || true)
    if [[ -z "$got" ]]; then
        fail "$5: no line matching '$2' in the output"
        return
    fi
    if awk -v g="$got" -v e="$3" -v t="$4" 'BEGIN { d = g - e; if (d < 0) d = -d; exit !(d <= t) }'; then
        ok "$5: $got (expected $3 +- $4)"
    else
        fail "$5: got $got, expected $3 +- $4"
    fi
}

expect_text() { # file pattern what
    if grep -q -E -- "$2" "$1"; then ok "$3"; else fail "$3: '$2' not found"; fi
}

expect_no_text() { # file pattern what
    if grep -q -E -- "$2" "$1"; then fail "$3: found '$(grep -m1 -E -- "$2" "$1")'"
    else ok "$3"; fi
}

# run_expect_status status output-file program args...
run_expect_status() {
    local want=$1 out=$2 rc=0
    shift 2
    "$@" > "$out" 2>&1 || rc=$?
    if [[ $rc -eq $want ]]; then ok "$(basename "$1") exits $want"; else
        fail "$(basename "$1") ${*:2} exited $rc, expected $want"; cat "$out"; fi
}

check_osmolality_panel() {
    local out=$work/osm.txt
    run_expect_status 0 "$out" "$bin/osmolality_panel" 140 90 mg/dL 14 mg/dL 295
    # Source: the conventional mg/dL form 2*Na + glucose/18 + BUN/2.8, as
    # compared by Dorwart & Chalmers, Clin Chem 1975: 280 + 5 + 5 = 290.
    expect_near "$out" '2 Na \+ glucose \+ urea' 290.0 0.1 "osmolality_panel 2*Na formula"
    # Source: Dorwart & Chalmers, Clin Chem 1975: 1.86*140 + 5 + 5 + 9 = 279.4.
    expect_near "$out" 'Dorwart-Chalmers' 279.4 0.1 "osmolality_panel Dorwart-Chalmers"
    # Source: effective osmolality 2*Na + glucose (Spasovski et al., Eur J
    # Endocrinol 2014): 280 + 5 = 285.
    expect_near "$out" 'effective osmolality' 285.0 0.1 "osmolality_panel effective"
    # Source: osmolal gap = measured - calculated (textbook): 295 - 290 = 5.
    expect_near "$out" 'osmolal gap' 5.0 0.1 "osmolality_panel gap"
    expect_text "$out" 'not orders' "osmolality_panel prints the caution"

    run_expect_status 0 "$out" "$bin/osmolality_panel" 128 540 mg/dL 30 mg/dL
    # Source: Hillier et al., Am J Med 1999, 2.4 mmol/L per 100 mg/dL above
    # 100: 128 + 2.4 * 4.4 = 138.56.
    expect_near "$out" 'corrected for glucose' 138.56 0.05 "osmolality_panel Hillier correction"

    run_expect_status 0 "$out" "$bin/osmolality_panel"
    expect_text "$out" 'invented' "osmolality_panel without arguments says its panel is invented"

    # A unit the analyte does not take, and a value that is not a number.
    run_expect_status 1 "$out" "$bin/osmolality_panel" 140 90 mg/L 14 mg/dL
    expect_text "$out" 'unit' "osmolality_panel refuses mg/L"
    run_expect_status 2 "$out" "$bin/osmolality_panel" 140 ninety mg/dL 14 mg/dL
    expect_text "$out" "GLUCOSE 'ninety' is not a number" "osmolality_panel names the argument that is not a number"
    # Sodium 300 is outside the library's 80-220 mmol/L (docs/ranges.md).
    run_expect_status 1 "$out" "$bin/osmolality_panel" 300 90 mg/dL 14 mg/dL
    expect_text "$out" 'SODIUM 300 refused' "osmolality_panel names the refused sodium"
    # A negative number is a value (refused by range), not an option.
    run_expect_status 1 "$out" "$bin/osmolality_panel" -5 90 mg/dL 14 mg/dL
    expect_text "$out" 'SODIUM -5 refused' "osmolality_panel reads -5 as a value, not an option"
}

check_infusion_plan() {
    local out=$work/inf.txt
    # A woman under 65 weighing 60 kg: body water 0.5 * 60 = 30 L.
    run_expect_status 0 "$out" "$bin/infusion_plan" f 40 60 108 saline-3 292
    # Source: Adrogue & Madias, N Engl J Med 2000: TBW 0.5 * weight.
    expect_near "$out" 'total body water' 30.0 0.05 "infusion_plan body water"
    # Source: Adrogue & Madias, N Engl J Med 2000, worked example for 3%
    # saline (from memory): (513 - 108) / (30 + 1) = 13.1 mmol/L per litre.
    expect_near "$out" 'change per litre' 13.1 0.05 "infusion_plan Adrogue-Madias per litre"
    # The figures of the worked example of Furst et al., Am J Med Sci 2000
    # (sodium 108, body water 30 L, 292 mL of 3% saline, which the paper
    # chose by the sodium-deficit step for a wanted rise of 5). Hand-worked
    # mass balance (Adrogue & Madias 2000): (108 * 30 + 0.292 * 513) /
    # 30.292 = 111.90 mmol/L, a rise of 3.9: the deficit step under-doses.
    expect_near "$out" 'predicted sodium' 111.90 0.05 "infusion_plan mass balance on the Furst figures"
    expect_text "$out" 'not orders' "infusion_plan prints the caution"
    run_expect_status 2 "$out" "$bin/infusion_plan" f 40 60 108 seawater 292
    expect_text "$out" "FLUID 'seawater'" "infusion_plan names the unknown fluid"
    run_expect_status 2 "$out" "$bin/infusion_plan" x 40 60 108 saline-3 292
    expect_text "$out" "SEX 'x'" "infusion_plan names the unknown sex"
    run_expect_status 2 "$out" "$bin/infusion_plan" f 40 sixty 108 saline-3 292
    expect_text "$out" "WEIGHT_KG 'sixty' is not a number" "infusion_plan names the weight that is not a number"
}

# watch_series output-file expected-status [high-risk] <<< lines
watch_series() {
    local out=$1 want=$2 rc=0
    shift 2
    "$bin/correction_watch" "$@" > "$out" 2>&1 || rc=$?
    if [[ $rc -eq $want ]]; then ok "correction_watch $* exits $want"; else
        fail "correction_watch $* exited $rc, expected $want"; cat "$out"; fi
}

check_correction_watch() {
    local out=$work/watch.txt
    # Source: Verbalis et al., Am J Med 2013 and Spasovski et al., Eur J
    # Endocrinol 2014: at most 10 mmol/L in any 24 h, 18 in any 48 h.
    # 112 -> 121 at 12 h is a rise of 9 (within); 112 -> 122.5 at 18 h is
    # 10.5 (over); the exit status 1 reports the breach.
    watch_series "$out" 1 <<< $'# invented series\n0,112\n6,116\n\n12,121\n18,122.5\n24,123.5'
    expect_text "$out" '^12,121,9\.0,9\.0,[^O]*$' "watch: a rise of 9 in 12 h is within the 24 h limit"
    expect_text "$out" '^18,122\.5,10\.5,10\.5,.*OVER-24H' "watch: a rise of 10.5 in 18 h is over the 24 h limit"
    expect_text "$out" 'not orders' "correction_watch prints the caution"
    # Source: Verbalis et al. 2013, high risk of osmotic demyelination: at
    # most 8 mmol/L in 24 h. 112 -> 120.5 is 8.5: over at high risk only.
    watch_series "$out" 1 high-risk <<< $'0,112\n12,119\n24,120.5'
    expect_text "$out" '^24,120\.5,8\.5,.*OVER-24H' "watch: 8.5 in 24 h is over the high-risk limit"
    watch_series "$out" 0 <<< $'0,112\n12,119\n24,120.5'
    expect_text "$out" '^24,120\.5,8\.5,8\.5,[^O]*$' "watch: 8.5 in 24 h is within the standard limit"
    # Source: as above, 18 in 48 h. 110 -> 119 (9 in 24 h), 119 -> 129
    # (exactly 10 in the next 24 h: at the limit is not over it), 110 -> 129
    # is 19 in 48 h: over the 48 h limit.
    watch_series "$out" 1 <<< $'0,110\n24,119\n48,129'
    expect_text "$out" '^48,129,10\.0,19\.0,.*OVER-48H' "watch: 19 in 48 h is over the 48 h limit"
    if grep -q 'OVER-24H' "$out"; then fail "watch: a rise of exactly 10 in 24 h was flagged over"
    else ok "watch: a rise of exactly 10 in 24 h is not over the limit"; fi
    # Falls (issue P1's case): 165 -> 140 in 24 h is a fall of 25, over the
    # 10 mmol/L a day of Adrogue & Madias, Hypernatremia, N Engl J Med 2000.
    watch_series "$out" 1 chronic-high <<< $'0,165\n12,152\n24,140'
    expect_text "$out" '^24,140,0\.0,0\.0,25\.0,25\.0,0\.0,25\.0,-1\.00,OVER,.*FALL-OVER-24H' "watch chronic-high: 165 -> 140 in 24 h is over the fall limit"
    # Now versus so far, hand-worked: 165, 160 (6 h), 156 (12 h), 152 (24 h:
    # 13 below 165, over); at 30 h the highest of the 24 h before is 160,
    # a fall of exactly 10: within now, while FALL-OVER-24H stays so far.
    watch_series "$out" 1 chronic-high <<< $'0,165\n6,160\n12,156\n24,152\n30,150'
    expect_text "$out" '^24,152,0\.0,0\.0,13\.0,13\.0,0\.0,13\.0,-0\.33,OVER,.*FALL-OVER-24H' "watch chronic-high: 13 in 24 h over now"
    expect_text "$out" '^30,150,0\.0,0\.0,13\.0,15\.0,0\.0,10\.0,-0\.33,within,.*FALL-OVER-24H' "watch chronic-high: within now at 30 h, over so far"
    # The same fall under the standard (raise) limits is no breach of a
    # limit: those limits have no fall limit (exit 0).
    watch_series "$out" 0 <<< $'0,125\n24,121'
    expect_text "$out" '^24,121,0\.0,0\.0,4\.0,4\.0,0\.0,4\.0,-0\.17,within,' "watch standard: a fall of 4 is reported, no limit breached"
    # Bad input: out of time order, and a line that is not hours,sodium.
    watch_series "$out" 2 <<< $'0,112\n6,116\n4,117'
    expect_text "$out" 'line 3' "watch names the line out of time order"
    watch_series "$out" 2 <<< $'0,112\n6;116'
    watch_series "$out" 2 <<< $'0,112\n6,nan'
    watch_series "$out" 2 bogus <<< $'0,112'
    expect_text "$out" "LIMITS 'bogus'" "correction_watch names the unknown limits"
    watch_series "$out" 2 <<< $'0,112\n6,300'
    expect_text "$out" 'line 2 \(6,300\) refused' "correction_watch names the refused line and its values"
}

# Every example program: --help and -h print the usage on standard output
# and exit 0; an unknown option is refused by name with exit 2 and writes
# no file (the demo's operands are file names).
check_command_lines() {
    local prog out=$work/cli.txt err=$work/cli-err.txt dir rc
    for prog in osmolality_panel infusion_plan correction_watch natremia-demo pkgconfig_consumer; do
        for opt in --help -h; do
            rc=0
            "$bin/$prog" "$opt" > "$out" 2> "$err" < /dev/null || rc=$?
            if [[ $rc -eq 0 ]] && grep -q '^usage: ' "$out" && [[ ! -s "$err" ]]; then
                ok "$prog $opt prints the usage and exits 0"
            else fail "$prog $opt exited $rc, stdout '$(head -1 "$out")', stderr '$(head -1 "$err")'"; fi
        done
        dir=$work/cwd-$prog
        mkdir -p "$dir"
        rc=0
        (cd "$dir" && "$bin/$prog" --chart-file > "$out" 2> "$err" < /dev/null) || rc=$?
        if [[ $rc -eq 2 ]] && grep -q -- "unknown option '--chart-file'" "$err"; then
            ok "$prog refuses an unknown option by name (exit 2)"
        else fail "$prog --chart-file exited $rc, stderr '$(head -1 "$err")'"; fi
        if [[ -z "$(ls -A "$dir")" ]]; then ok "$prog wrote no file after an unknown option"
        else fail "$prog wrote $(ls -A "$dir" | tr '\n' ' ')after an unknown option"; fi
    done
    # "--" ends the options: a chart name starting with "-" is then a file.
    dir=$work/cwd-dashdash
    mkdir -p "$dir"
    rc=0
    (cd "$dir" && "$bin/natremia-demo" -- -a.svg -b.svg > "$out" 2>&1) || rc=$?
    if [[ $rc -eq 0 && -s "$dir/-a.svg" && -s "$dir/-b.svg" ]]; then ok "natremia-demo -- -a.svg -b.svg writes both charts"
    else fail "natremia-demo -- -a.svg -b.svg exited $rc or wrote no charts"; fi
    run_expect_status 2 "$out" "$bin/natremia-demo" a.svg b.svg c.svg
    expect_text "$out" 'at most two chart file names' "natremia-demo refuses a third operand"
    check_cohort_command_line
}

# The Dask example (argparse) under the same rules; it imports the Python
# binding first, so it is checked only where numpy is installed.
check_cohort_command_line() {
    local src py=/usr/bin/python3 out=$work/cohort.txt rc
    src=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
    if ! "$py" -c 'import numpy' > /dev/null 2>&1; then
        echo "SKIP: cohort_dask.py command line (python3-numpy not installed)"
        return
    fi
    export PYTHONPATH=$src/bindings/python NATREMIA_LIBRARY=$bin/../lib/libnatremia.so.1
    # A sanitizer build of the library cannot be loaded into python3.
    if ! "$py" -c 'import natremia' > /dev/null 2>&1; then
        echo "SKIP: cohort_dask.py command line (the binding cannot load this build's library)"
        unset PYTHONPATH NATREMIA_LIBRARY
        return
    fi
    rc=0
    "$py" "$src/examples/cohort_dask.py" --help > "$out" 2>&1 || rc=$?
    if [[ $rc -eq 0 ]] && grep -q '^usage: ' "$out"; then ok "cohort_dask.py --help prints the usage and exits 0"
    else fail "cohort_dask.py --help exited $rc: $(head -3 "$out")"; fi
    rc=0
    "$py" "$src/examples/cohort_dask.py" --chart-file > "$out" 2>&1 || rc=$?
    if [[ $rc -eq 2 ]] && grep -q -- '--chart-file' "$out"; then ok "cohort_dask.py refuses an unknown option by name (exit 2)"
    else fail "cohort_dask.py --chart-file exited $rc: $(tail -1 "$out")"; fi
    rc=0
    "$py" "$src/examples/cohort_dask.py" --patients many > "$out" 2>&1 || rc=$?
    if [[ $rc -eq 2 ]] && grep -q -- "--patients: invalid int value: 'many'" "$out"; then ok "cohort_dask.py names the argument that is not a number"
    else fail "cohort_dask.py --patients many exited $rc: $(tail -1 "$out")"; fi
    unset PYTHONPATH NATREMIA_LIBRARY
}

check_demo_text() {
    local out=$work/demo.txt
    (cd "$work" && "$bin/natremia-demo" > "$out" 2>&1) || { fail "natremia-demo failed"; cat "$out"; return; }
    ok "natremia-demo exits 0"
    expect_text "$out" 'invented' "demo says its patients are invented"
    expect_text "$out" '^ *Caution: every figure here is an estimate for decision support' "demo opens with the caution"
    # Units spelled one way; sodium never beyond 0.1 mmol/L.
    expect_no_text "$out" 'mosm|MOSM|mOsm/L|mosmol' "demo spells the osmolality unit mOsm/kg only"
    expect_no_text "$out" '(sodium|Na)[^;]*[0-9]\.[0-9]{2,} mmol/L( |$|,|\))' "demo shows no sodium to more than 0.1 mmol/L"
    expect_no_text "$out" 'safe on its own|is safe' "demo claims no safety the caution does not allow"

    # ---- patient A: low sodium, raised ----
    # Source: conversion of mg/dL with glucose 180.16 g/mol (IUPAC weights):
    # 162 mg/dL = 8.99 mmol/L, shown to 0.1; BUN 8 mg/dL over 28.014 g/mol
    # = 2.86 mmol/L of urea, shown 2.9.
    expect_near "$out" '^ *glucose .*->' 9.0 0.001 "demo glucose conversion, to 0.1 mmol/L"
    expect_near "$out" '^ *urea nitrogen .*->' 2.9 0.001 "demo urea conversion, to 0.1 mmol/L"
    # Source: Oster & Singer, Arch Intern Med 1999; Milionis et al., CMAJ
    # 2002: effective osmolality is measured less urea: 243 - 2.856 = 240.1.
    expect_near "$out" 'effective osmolality +measured - urea' 240.1 0.05 "demo effective osmolality (measured less urea)"
    expect_text "$out" 'effective osmolality below 275 mOsm/kg +240\.1 mOsm/kg +met$' "demo SIAD uses the same effective osmolality"
    # Findings entered by the clinician are passed on, not tested: "reported".
    expect_text "$out" '^ +clinically euvolaemic +by clinician +reported$' "demo: volume status reads 'reported'"
    expect_text "$out" '^ +thyroid function normal +by clinician +reported$' "demo: thyroid function reads 'reported'"
    expect_no_text "$out" '(euvolaemic|thyroid|adrenal|pituitary|kidney|diuretic).* met$' "demo: no clinician finding reads 'met'"
    # Source: Adrogue & Madias 2000: TBW 0.45 * 58 kg for a woman over 65.
    expect_near "$out" 'fraction of weight' 26.1 0.05 "demo body water (fraction)"
    # Source: Furst et al. 2000: (82 + 38) / 114 = 1.05, above 1.
    expect_near "$out" 'urine Na \+ urine K' 1.05 0.005 "demo Furst ratio"
    # Solute decision, hand-worked from the published formulas with the
    # demo's invented 600 mOsm/day, urine 460 mOsm/kg, Na + K 120, serum 114,
    # net insensible 0.5 L/day. Berl 2008: V = 600 / 460 = 1.304 L/day.
    expect_near "$out" 'Urine the solute makes' 1.30 0.005 "demo urine volume from solute (Berl 2008)"
    # EFWC = V (1 - 120/114) = -0.0687 L/day (standard renal physiology).
    expect_near "$out" 'Its electrolyte-free water clearance' -0.07 0.005 "demo EFWC of that urine"
    # Allowance = EFWC + insensible = 0.431 L/day: below the 1.0 L/day target.
    expect_near "$out" 'allowance with the current solute' 0.43 0.005 "demo fluid allowance (hand-worked)"
    expect_text "$out" 'the target is too much: restrict further, or add solute' "demo outlook: 0 < allowance < target"
    # Dose for 1.0 L/day: (1.0 - 0.4313) x 460 = 261.6 mOsm/day; urea
    # 261.6 x 60.056 / 1000 = 15.71 g; NaCl 261.6 x 58.443 / 2000 = 7.64 g
    # (IUPAC weights; 2 osmoles per mole of NaCl).
    expect_near "$out" '^ +of urea +' 15.7 0.05 "demo urea dose for a 1 L/day allowance (hand-worked)"
    expect_near "$out" '^ +or of NaCl tablets +' 7.6 0.05 "demo NaCl dose for a 1 L/day allowance (hand-worked)"
    # 15 g urea = 249.8 mOsm; allowance 0.4313 + 249.8 / 460 = 0.974 L/day.
    expect_near "$out" 'With urea 15 g' 0.97 0.005 "demo allowance with 15 g/day urea (hand-worked)"
    # Urine feedback, hand-worked from the EFW balance (Shah & Bhave, Front
    # Med 2018): at 8 h, urine 250 mL/h with Na + K 45 at serum 120.5:
    # EFW clearance 250 (1 - 45/120.5) = 156.6 mL/h; rate of change
    # 120.5 x 0.1566 / 26.1 = +0.72 mmol/L/h. At 4 h the urine (Na + K 110
    # at 118.5) clears almost no free water: no alert.
    expect_text "$out" '^ +4 +118\.5 .* none in 6 h$' "demo feedback: no alert at 4 h"
    expect_near "$out" '^ +8 +120\.5 +' 157 0.5 "demo feedback EFW clearance at 8 h (hand-worked)"
    expect_text "$out" '^ +8 +120\.5 +157 +\+0\.72 ' "demo feedback sodium rate at 8 h (hand-worked)"
    # Limit 114 + 10 = 124 (lowest of the past 24 h plus the standard 10 in
    # 24 h, Verbalis et al. 2013). Mass balance with the urine continued:
    # (120.5 x 26.1 - 45 x 0.25 t) / (26.1 - 0.25 t) = 124 at t = 4.63 h;
    # the 0.25 h grid puts the first point over at 4.75 h (printed 4.8).
    expect_near "$out" '^ +8 +120\.5 .*limit in' 4.8 0.05 "demo feedback breach ahead (hand-worked, 0.25 h grid)"
    expect_text "$out" 'ALERT: water diuresis under way' "demo feedback raises the water-diuresis alert"
    # The alert must come before the measured breach: hour of the alert
    # result versus the first measured result over the limit in A10.
    alert_h=$(grep -m1 -E -- '-> alert at the [0-9.]+ h result' "$out" \
        | sed -E 's/.*alert at the ([0-9.]+) h result.*/\1/' || true)
    breach_h=$(grep -m1 -E '^ +[0-9.]+ +[0-9.]+ .*OVER 24 h rise limit' "$out" | awk '{print $1}' || true)
    if [[ -n "$alert_h" && -n "$breach_h" ]] && awk -v a="$alert_h" -v b="$breach_h" 'BEGIN{exit !(a < b)}'; then
        ok "demo feedback alert at ${alert_h} h comes before the measured breach at ${breach_h} h"
    else
        fail "demo feedback alert ('${alert_h}') not before the measured breach ('${breach_h}')"
    fi
    expect_text "$out" 'measured results so far: within the limits' "demo feedback: measured results within at the alert"
    # Fitted re-projection. The fit itself (least squares) is checked in
    # tests/test_feedback.c on synthetic patients; here the re-projection is
    # hand-worked from the printed fit with the mass balance (Adrogue &
    # Madias 2000): body water at 8 h = 34.6 + 0.3 L saline - 0.106 x 8 =
    # 34.07 L; Na(12 h) = 120.5 x 34.07 / (34.07 - 0.106 x 4) = 122.0;
    # Na(16 h) = 120.5 x 34.07 / (34.07 - 0.106 x 8) = 123.6. The original
    # (boluses alone, TBW 26.1 L): (114 x 26.1 + 0.3 x 513) / 26.4 = 118.5.
    expect_near "$out" 'apparent body water' 34.6 0.05 "demo fit: apparent body water (printed, used below)"
    expect_near "$out" 'unmeasured water loss' 106 0.5 "demo fit: unmeasured loss (printed, used below)"
    expect_text "$out" '^ +12 +118\.5 +122\.0 +123\.0$' "demo re-projection at 12 h beside the original (hand-worked)"
    expect_text "$out" '^ +16 +118\.5 +123\.6 +125\.5$' "demo re-projection at 16 h beside the original (hand-worked)"
    # Residual between 0 and 1 mmol/L: within the analytical SD of about
    # 1 mmol/L (common practice; docs/feedback.md uses the same SD).
    expect_near "$out" 'residual \(root mean sq\.\)' 0.5 0.5 "demo fit residual within 1 mmol/L"
    expect_text "$out" 'profound' "demo severity is profound (Spasovski et al. 2014: below 125)"
    expect_text "$out" 'consistent with SIAD' "demo SIAD verdict"
    # Risk factors (Verbalis et al. 2013): all asked about and absent.
    expect_text "$out" 'risk factors for osmotic demyelination: none known' "demo: 'none known' when every factor is known absent"
    expect_text "$out" 'standard limits, because no risk factor is present or' "demo says why the standard limits apply"
    expect_text "$out" 'alcohol use disorder: not recorded' "demo: an unknown factor reads 'not recorded'"
    expect_text "$out" 'high-risk limits, because a risk factor is not recorded' "demo says why the high-risk limits were chosen"
    # Source: Adrogue & Madias 2000 mass balance: 300 mL of 3% saline into
    # 26.1 L: 114 + 0.3 * (513 - 114) / 26.4 = 118.53 mmol/L, shown 118.5.
    expect_near "$out" 'both boluses' 118.5 0.05 "demo predicted sodium after the boluses"
    expect_text "$out" 'boluses alone' "demo checks the plan without a diuresis"
    expect_text "$out" 'predicted to BREACH the 24 h rise limit' "demo plan check with a water diuresis breaches the 24 h limit"
    # "now" and "so far" (limits: Verbalis et al. 2013 / Spasovski et al.
    # 2014, 10 mmol/L in 24 h). Hand-worked: 114 -> 125.5 at 16 h is 11.5,
    # over now; at 30 h the lowest of the past 24 h is 120.5 (8 h), a rise
    # of 3.5, within now, while the breach at 16 h stays "so far".
    expect_text "$out" '^ +12\.0 +123\.0 +9\.0 +9\.0 +\+0\.62 +within, near a limit +none$' "demo: 9 in 12 h is near the limit, no breach so far"
    expect_text "$out" '^ +16\.0 +125\.5 +11\.5 +11\.5 +\+0\.62 +OVER 24 h rise limit +over at 16 h$' "demo flags the over-rapid rise at 16 h, now"
    expect_text "$out" '^ +30\.0 +124\.0 +3\.5 +10\.0 +\+0\.25 +within the limits +over at 16 h$' "demo: at 30 h within now, over so far"
    expect_text "$out" '^ +48\.0 +128\.0 +5\.5 +14\.0 +\+0\.25 +within the limits +over at 16 h$' "demo: at 48 h within now (5.5 in 24 h, 14 in 48 h)"
    expect_near "$out" 'exceeds the limit by' 1.5 0.05 "demo excess over the 24 h limit"
    # Source: Adrogue & Madias 2000, the infusate formula solved for volume:
    # lowering 125.5 by 3.5 with 5% dextrose (Na 0) into 26.1 L needs
    # 3.5 * 26.1 / (125.5 - 3.5) = 0.749 L. The demo also counts 0.24 L of
    # urine at Na + K 120 mmol/L, nearly the target's 122, which changes
    # the volume by only a few mL: hence the 10 mL tolerance.
    expect_near "$out" '5% dextrose' 749 10 "demo re-lowering volume"
    expect_text "$out" 'so far: over a limit from 16 h; the worst window, over the 24 h rise limit' "demo: patient A so far, over from 16 h"
    if [[ $(grep -c 'agrees with the streaming watcher' "$out") -eq 2 ]]; then ok "demo batch and streaming assessments agree for both patients"
    else fail "demo: batch and streaming assessments do not agree for both patients"; fi

    # ---- patient B: high sodium, lowered ----
    # Source: Oster & Singer 1999; Milionis et al. 2002 (effective = measured
    # less urea): 350 - 16 = 334.0 mOsm/kg, above 295: hypertonic.
    expect_text "$out" 'effective osmolality +measured - urea +334\.0 mOsm/kg' "demo patient B effective osmolality 334.0"
    expect_text "$out" 'hypertonic \(above 295 mOsm/kg\)' "demo patient B is hypertonic"
    # Source: Adrogue & Madias 2000 (from memory): 0.5 * 70 kg for a man
    # over 65 = 35.0 L. Water deficit, the textbook formula (Adrogue &
    # Madias, Hypernatremia, N Engl J Med 2000): 35 * (162/140 - 1) = 5.5 L.
    expect_near "$out" 'fraction of weight \(0\.5 for a man' 35.0 0.05 "demo patient B body water"
    expect_near "$out" 'water deficit  TBW' 5.5 0.05 "demo patient B water deficit"
    # Limits: Adrogue & Madias, Hypernatremia, N Engl J Med 2000: chronic
    # or unknown duration, a fall of at most 10 mmol/L a day.
    expect_text "$out" 'a fall of at most 10 mmol/L in any 24 h' "demo patient B fall limit"
    # Hand-worked mass balance, the deficit over 24 h: 5.5 L / 24 h = 229
    # mL/h of 5% dextrose, urine 50 mL/h at Na + K 70: at 24 h
    # (162*35 - 1.2*70) / (35 + 5.5 - 1.2) = 142.1 mmol/L; the fall first
    # exceeds 10 when (5670 - 3.5 t) / (35 + 0.1792 t) < 152, t > 11.39 h:
    # the first 0.5 h point is 11.5 h.
    expect_text "$out" 'the deficit over 24 h: 5% dextrose 229 mL/h' "demo patient B 24 h plan rate"
    expect_text "$out" 'predicted sodium at 24 h: 142\.1 mmol/L \(fall 19\.9 mmol/L\)' "demo patient B 24 h plan: 142.1 at 24 h, a fall of 19.9"
    expect_text "$out" 'predicted to BREACH the 24 h fall limit from hour 11\.5' "demo patient B: the 24 h water plan breaches the fall limit at 11.5 h"
    # The deficit over 48 h, 115 mL/h: at 24 h (5670 - 84) / 36.55 = 152.8
    # (a fall of 9.2, within); at 48 h (5670 - 168) / 38.1 = 144.4.
    expect_near "$out" 'predicted sodium at 48 h' 144.4 0.05 "demo patient B 48 h plan, sodium at 48 h"
    expect_text "$out" 'predicted to stay within the limits \(largest fall 9\.2 mmol/L in 24 h\)' "demo patient B: the 48 h water plan stays within"
    # The measured fall (limit 10 in 24 h, Adrogue & Madias 2000), hand-worked:
    # 162 -> 152 at 12 h is exactly 10 (at the limit, not over); 150.5 at
    # 16 h is 11.5, over; at 30 h the highest of the past 24 h is 155 (8 h),
    # a fall of 6.0: within now, over so far.
    expect_text "$out" '^ +12\.0 +152\.0 +10\.0 +10\.0 +-0\.75 +within, near a limit +none$' "demo patient B: 10 in 12 h is at the limit, not over"
    expect_text "$out" '^ +16\.0 +150\.5 +11\.5 +11\.5 +-0\.38 +OVER 24 h fall limit +over at 16 h$' "demo patient B: the too-fast fall flagged at 16 h"
    expect_text "$out" '^ +30\.0 +149\.0 +6\.0 +13\.0 +-0\.17 +within the limits +over at 16 h$' "demo patient B: at 30 h within now, over so far"
    expect_text "$out" 'still over: the 162\.0 mmol/L of hour 0 is within the last 24 h' "demo patient B says why 20 h is still over"
    expect_text "$out" 'too fast a fall: 11\.5 mmol/L in 24 h, over the limit by 1\.5' "demo patient B too-fast fall message"
    expect_text "$out" 'over the 24 h fall limit$' "demo patient B so far names the fall limit"
    expect_text "$out" 'by 2\.0 mmol/L, ends at 24 h' "demo patient B worst window: 162 -> 150 by 24 h, 2.0 over"
    expect_text "$out" 'Patient B \(invented\)' "demo says patient B is invented"
    # Provenance through ntr_method_info: Watson's paper is the source of
    # the anthropometric body water (Watson, Watson & Batt, Am J Clin Nutr 1980).
    expect_text "$out" 'Watson PE, Watson ID, Batt RD' "demo names the source of the Watson equations"
    if [[ $(grep -c 'Caution: every figure here is an estimate for decision support, not an' "$out") -ge 3 ]]; then
        ok "demo shows the caution at the start and after each patient"
    else fail "demo shows the caution fewer than 3 times"; fi
    if [[ -s "$work/natremia-demo.svg" && -s "$work/natremia-demo-high-sodium.svg" ]]; then
        ok "demo writes natremia-demo.svg and natremia-demo-high-sodium.svg by default"
    else fail "demo wrote not both default charts in its working directory"; fi
}

# The FHIR example (examples/fhir_bundle.py) on its invented Bundle, with
# the library of this build and the package of this tree.
check_fhir_example() {
    local out=$work/fhir.txt rc=0 root python=/usr/bin/python3
    root=$(cd "$(dirname "$0")/.." && pwd)
    [[ -x $python ]] || python=$(command -v python3)
    # As for the cohort example: a sanitizer build of the library cannot be
    # loaded into python3 (the binding itself is tested by python-binding).
    if ! NATREMIA_LIBRARY=$bin/../lib/libnatremia.so.1 PYTHONPATH=$root/bindings/python \
            "$python" -c 'import natremia' > /dev/null 2>&1; then
        echo "SKIP: fhir_bundle.py (the binding cannot load this build's library)"
        return
    fi
    NATREMIA_LIBRARY=$bin/../lib/libnatremia.so.1 PYTHONPATH=$root/bindings/python \
        PYTHONDONTWRITEBYTECODE=1 "$python" "$root/examples/fhir_bundle.py" > "$out" 2>&1 || rc=$?
    if [[ $rc -eq 0 ]]; then ok "fhir_bundle.py exits 0"; else fail "fhir_bundle.py exited $rc"; cat "$out"; return; fi
    expect_text "$out" 'Invented Bundle \(no real patient\)' "fhir_bundle says its Bundle is invented"
    if [[ $(grep -c 'not orders' "$out") -ge 2 ]]; then ok "fhir_bundle prints the caution at the start and the end"
    else fail "fhir_bundle prints the caution fewer than 2 times"; fi
    # 16 invented Observations: an entered-in-error sodium and a haemolysed
    # sample (dataAbsentReason) are listed as not used, with their reasons.
    expect_text "$out" '^14 Observations used, 2 not used; other resources: Patient 2$' "fhir_bundle counts used and unused Observations"
    expect_text "$out" "id c-err.*status 'entered-in-error'" "fhir_bundle reports the entered-in-error result"
    expect_text "$out" "id c-haem.*dataAbsentReason 'sample haemolysed'" "fhir_bundle reports the absent value and why"
    # Patient C, sodium 112 mmol/L: profound (Spasovski et al. 2014: below 125).
    expect_text "$out" 'severity of the low sodium: profound' "fhir_bundle: patient C severity profound"
    # Glucose 180 mg/dL is 180/18 = 10.0 mmol/L (Dorwart & Chalmers 1975,
    # glucose/18): effective 2 x 112 + 10.0 = 234.0 (Spasovski et al. 2014);
    # with urea 4.0 mmol/L: 238.0 (the 2 Na form, Dorwart & Chalmers 1975).
    expect_near "$out" 'effective osmolality 2 Na \+ glucose' 234.0 0.05 "fhir_bundle: patient C effective osmolality"
    expect_near "$out" 'calculated osmolality 2 Na \+ glucose \+ urea' 238.0 0.05 "fhir_bundle: patient C calculated osmolality"
    # Katz 1973 (as restated by Hillier et al. 1999): 1.6 per 100 mg/dL
    # above 100: 112 + 1.6 x 0.8 = 113.28.
    expect_near "$out" 'corrected for glucose \(Katz\)' 113.3 0.05 "fhir_bundle: patient C Katz-corrected sodium"
    # Times hand-worked from the offsets: 08:00+02:00 first, 12:00Z is 6 h,
    # 20:00+02:00 12 h, the next day 08:00+02:00 (issued, the documented
    # fallback) 24 h. 112 -> 123 in 24 h is a rise of 11, over the 10 in
    # 24 h limit by 1.0 (Verbalis et al. 2013; Spasovski et al. 2014).
    expect_text "$out" '^ +24\.0 +123\.0 +issued +.*rise_over_24h' "fhir_bundle: patient C over the 24 h rise limit at 24 h (time from issued)"
    expect_text "$out" '^ +6\.0 +116\.0 +effectiveDateTime +within the limits$' "fhir_bundle: patient C 6 h result (sent in mEq/L, 12:00Z)"
    expect_text "$out" 'over a limit by 1\.0 mmol/L, worst window ending at 24\.0 h' "fhir_bundle: patient C excess 1.0 at 24 h"
    # Patient D, 160 lowered to 151 in 24 h: a fall of 9, within the 10 a
    # day of Adrogue & Madias, N Engl J Med 2000 (chronic hypernatraemia).
    expect_text "$out" 'being lowered: hyper_chronic limits' "fhir_bundle: patient D is being lowered"
    expect_text "$out" 'largest rise in 24 h: 0\.0 mmol/L; largest fall in 24 h: 9\.0 mmol/L' "fhir_bundle: patient D falls 9.0 in 24 h"
    expect_text "$out" 'no 24 h or 48 h window over a limit' "fhir_bundle: patient D within the limits"
    expect_text "$out" 'whole-blood sodium kept out of the course: 158\.0 at 4\.0 h' "fhir_bundle: patient D blood-gas sodium kept apart"
    if [[ $(grep -c 'the watcher and the whole-series assessment agree' "$out") -eq 2 ]]; then
        ok "fhir_bundle: watcher and whole-series assessment agree for both patients"
    else fail "fhir_bundle: watcher and assessment do not agree for both patients"; fi
}

# The PNG's width and height from its IHDR chunk (bytes 16-23, big-endian).
png_size() {
    local sig
    sig=$(od -A n -t x1 -N 16 "$1" | tr -d ' \n')
    [[ "$sig" == 89504e470d0a1a0a0000000d49484452 ]] || return 1
    od -A n -t u1 -j 16 -N 8 "$1" | awk '{ printf "%d %d\n", $1*16777216 + $2*65536 + $3*256 + $4, $5*16777216 + $6*65536 + $7*256 + $8 }'
}

check_chart() {
    local svg=$work/chart.svg png=$work/chart.png size
    if ! command -v rsvg-convert > /dev/null 2>&1; then
        echo "SKIP: rsvg-convert not found (apt-get install librsvg2-bin)"
        exit 77
    fi
    "$bin/natremia-demo" "$svg" "$work/chart2.svg" > "$work/demo.txt" 2>&1 || { fail "natremia-demo $svg failed"; return; }
    if [[ -s "$svg" ]]; then ok "demo writes the chart to the path given"
    else fail "demo wrote nothing to $svg"; return; fi
    expect_text "$svg" '<svg ' "chart is an SVG document"
    expect_text "$svg" 'Serum sodium \(mmol/L\)' "chart labels the sodium axis with its unit"
    expect_text "$svg" 'Time since the first sample \(hours\)' "chart labels the time axis with its unit"
    expect_text "$svg" 'not orders.*licensed clinical judgement' "chart carries the caution"
    expect_text "$svg" 'Invented patient' "chart says the patient is invented"
    # 12 measured samples, one legend entry per marker kind. A diamond marks
    # a result over a limit when it was taken, as the table's "now" column
    # does: by the 10 mmol/L in 24 h limit (Verbalis et al. 2013) only the
    # 16 h result (125.5, 11.5 above the lowest of the 24 h before it):
    # 11 dots and 1 diamond, plus one of each in the legend.
    local dots diamonds
    dots=$(grep -c '<circle ' "$svg" || true)
    diamonds=$(grep -c '<polygon fill="#c0392b"' "$svg" || true)
    if [[ "$dots" == 12 && "$diamonds" == 2 ]]; then ok "chart draws 11 measured dots and 1 flagged diamond (plus legend)"
    else fail "chart draws $dots dots and $diamonds diamonds, expected 12 and 2 with the legend"; fi
    # The chart says what the table's last row says.
    expect_text "$svg" '>So far: over the 24 h rise limit<' "chart: so far, over the 24 h rise limit"
    expect_text "$svg" '>first at 16 h; worst 16 h, by 1\.5 mmol/L<' "chart: the breach at 16 h, by 1.5"
    expect_text "$svg" '>Now \(48 h\): within the limits<' "chart: now within the limits"
    # Patient B (Adrogue & Madias 2000, a fall of at most 10 in 24 h): 13
    # results, over now at 16 h (11.5), 20 h (11.5) and 24 h (12.0): 10
    # dots and 3 diamonds, plus one of each in the legend.
    local svg2=$work/chart2.svg png2=$work/chart2.png
    if [[ -s "$svg2" ]]; then ok "demo writes the second chart to the second path"
    else fail "demo wrote nothing to $svg2"; return; fi
    dots=$(grep -c '<circle ' "$svg2" || true)
    diamonds=$(grep -c '<polygon fill="#c0392b"' "$svg2" || true)
    if [[ "$dots" == 11 && "$diamonds" == 4 ]]; then ok "chart B draws 10 measured dots and 3 flagged diamonds (plus legend)"
    else fail "chart B draws $dots dots and $diamonds diamonds, expected 11 and 4 with the legend"; fi
    expect_text "$svg2" 'fall limit' "chart B names the fall limit"
    expect_text "$svg2" '>So far: over the 24 h fall limit<' "chart B: so far, over the 24 h fall limit"
    expect_text "$svg2" '>Now \(72 h\): within the limits<' "chart B: now within the limits"
    expect_text "$svg2" 'not orders.*licensed clinical judgement' "chart B carries the caution"
    expect_text "$svg2" 'Invented patient' "chart B says the patient is invented"
    for pair in "$svg:$png" "$svg2:$png2"; do
        if rsvg-convert -f png -o "${pair#*:}" "${pair%%:*}" 2> "$work/rsvg.txt"; then ok "rsvg-convert renders $(basename "${pair%%:*}")"
        else fail "rsvg-convert failed: $(cat "$work/rsvg.txt")"; continue; fi
        if size=$(png_size "${pair#*:}"); then
            if [[ "$size" == "960 560" ]]; then ok "$(basename "${pair#*:}") is a valid PNG, 960 x 560 pixels"
            else fail "$(basename "${pair#*:}") is $size pixels, expected 960 560"; fi
        else
            fail "rsvg-convert output is not a PNG"
        fi
    done
}

case $mode in
    examples) check_command_lines; check_osmolality_panel; check_infusion_plan; check_correction_watch; check_demo_text; check_fhir_example ;;
    chart) check_chart ;;
    *) echo "unknown mode $mode" >&2; exit 1 ;;
esac
echo "$checks checks, $failures failed"
[[ $failures -eq 0 ]]
