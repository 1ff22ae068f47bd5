#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Batch throughput of this tree's lib/batch.c against another commit's,
# side by side in one process (issue 14: the formulas moved into kernels,
# the throughput must stay within 5%).
#
#   bash tests/bench/batch-ab.sh [BASE] [ROWS] [ROUNDS]
#        (defaults: 60cda71, the commit before the kernels; 4000000; 21)
#
# Compiles the base commit's lib/batch.c (git archive, with its own
# headers) and this tree's lib/ with the same compiler and the library's
# release flags (-O2, as tests/bench/run-bench.sh builds), renames the
# base object's ntr_batch_* to old_ntr_batch_* (objcopy), links both into
# tests/bench/bench_batch_ab.c and runs it: for every batch function, both
# versions on the same invented rows, alternating, fastest round of each,
# and whether both wrote the same bytes. Exit status 1 if any output
# differs. CC overrides the compiler (default cc). Takes about a minute.
# With AB_CALLGRIND=1 (valgrind installed) it also counts instructions per
# row of each side under callgrind on the same rows, which no other load
# on the machine can disturb (tests/bench/callgrind_ab.py prints them).
# With AB_LOOP=1 it also builds tests/bench/bench_batch.c twice, against the
# base's lib/batch.c and against this tree's (the rest of lib/ from this
# tree in both), runs the two programs in turn AB_LOOP_RUNS times (default
# 3) on AB_LOOP_ROWS rows (default 10000000, as run-bench.sh) and prints,
# per function, the best "of loop" figure (same-stream loop time / batch
# time, each measured inside its own program) of each side: the before and
# after of docs/performance.md section 2 from one run.
set -euo pipefail
root=$(cd "$(dirname "$0")/../.." && pwd)
base=${1:-60cda71}
rows=${2:-4000000}
rounds=${3:-21}
cc=${CC:-cc}
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT

flags=(-std=c99 -O2 -Wall -Wextra -Wpedantic -Werror -Wconversion -Wshadow
       -Wdouble-promotion -ffp-contract=off -DNTR_BUILDING -fvisibility=hidden)

mkdir -p "$work/old" "$work/new"
git -C "$root" archive "$base" lib include | tar -x -C "$work/old"
"$cc" "${flags[@]}" -I"$work/old/include" -I"$work/old/lib" \
    -c "$work/old/lib/batch.c" -o "$work/old_batch.o"
renames=()
for sym in $(nm --defined-only "$work/old_batch.o" | awk '$2 == "T" && $3 ~ /^ntr_batch_/ {print $3}'); do
    renames+=(--redefine-sym "$sym=old_$sym")
done
objcopy "${renames[@]}" "$work/old_batch.o"

for src in "$root"/lib/*.c; do
    "$cc" "${flags[@]}" -I"$root/include" -I"$root/lib" -c "$src" \
        -o "$work/new/$(basename "$src" .c).o"
done
"$cc" -std=c99 -O2 -Wall -Wextra -I"$root/include" \
    "$root/tests/bench/bench_batch_ab.c" "$work/old_batch.o" "$work"/new/*.o \
    -lm -o "$work/bench_batch_ab"

echo "# base $base ($(git -C "$root" rev-parse --short "$base")) against $(git -C "$root" rev-parse --short HEAD)$(git -C "$root" status --porcelain -- lib include | grep -q . && echo ' with uncommitted changes in lib/ or include/'); $("$cc" --version | head -n 1)"
"$work/bench_batch_ab" "$rows" "$rounds"
if [[ ${AB_LOOP:-0} == 1 ]]; then
    loop_rows=${AB_LOOP_ROWS:-10000000}
    loop_runs=${AB_LOOP_RUNS:-3}
    "$cc" "${flags[@]}" -I"$work/old/include" -I"$work/old/lib" \
        -c "$work/old/lib/batch.c" -o "$work/old_batch_plain.o"
    others=()
    for obj in "$work"/new/*.o; do
        [[ $(basename "$obj") == batch.o ]] || others+=("$obj")
    done
    for side in old new; do
        if [[ $side == old ]]; then objs=("$work/old_batch_plain.o" "${others[@]}")
        else objs=("$work"/new/*.o); fi
        "$cc" -std=c99 -O2 -Wall -Wextra -DNTR_NO_MUST_CHECK -I"$root/include" \
            "$root/tests/bench/bench_batch.c" "${objs[@]}" -lm \
            -o "$work/bench_batch_$side"
    done
    for ((run = 0; run < loop_runs; run++)); do
        for side in old new; do
            "$work/bench_batch_$side" "$loop_rows" 5 | grep -v '^#' |
                awk -v side="$side" '{print side, $1, $11}' >>"$work/loop.txt"
        done
    done
    echo "# of loop (loop time / batch time, best of $loop_runs runs of bench_batch, $loop_rows rows, each side in its own program)"
    echo "# name old_of_loop new_of_loop"
    awk '{ k = $1 " " $2; if (!(k in best) || $3 > best[k]) best[k] = $3
           if (!($2 in seen)) { seen[$2] = 1; order[++n] = $2 } }
         END { for (i = 1; i <= n; i++)
                   printf "%s %.0f%% %.0f%%\n", order[i], 100 * best["old " order[i]],
                          100 * best["new " order[i]] }' "$work/loop.txt"
fi
if [[ ${AB_CALLGRIND:-0} == 1 ]]; then
    cg_rows=200000
    echo "# instructions per row under callgrind ($cg_rows rows, one call of each side)"
    echo "# name data old_ir_per_row new_ir_per_row new/old"
    for set in valid mixed; do
        valgrind --tool=callgrind --callgrind-out-file="$work/ab.$set.callgrind" \
            "$work/bench_batch_ab" "$cg_rows" 1 "$set" >/dev/null 2>"$work/valgrind.log"
        callgrind_annotate --inclusive=yes --threshold=100 "$work/ab.$set.callgrind" |
            awk -v rows="$cg_rows" -v set="$set" '
                { gsub(",", "", $1) }
                $4 ~ /:(old_)?ntr_batch_[a-z_]+$/ && $4 !~ /assess$/ {
                    name = $4; sub(/.*:/, "", name); ir[name] += $1 }
                END {
                    for (n in ir) if (n !~ /^old_/ && ("old_" n) in ir)
                        printf "%s %s %.2f %.2f %.4f\n", n, set, ir["old_" n] / rows,
                               ir[n] / rows, ir[n] / ir["old_" n]
                }' | sort
    done
fi
