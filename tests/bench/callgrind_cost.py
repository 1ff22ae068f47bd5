#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""Per-call instruction counts from a callgrind profile of bench_scalar.

Reads a profile written with
    valgrind --tool=callgrind --dump-line=no --dump-instr=no
             --compress-strings=no --compress-pos=no
and, for every pair of loops loop_<fn> / base_<fn> in bench_scalar, reports
  loop_minus_base = (Ir(loop_<fn>) - Ir(base_<fn>)) / N
      the instructions the library spends per call beyond a do-nothing call
      with the same signature (the headline figure; the loop, the argument
      set-up and the call instruction cancel out);
  callee_inclusive = Ir inside <fn> and everything it calls / calls of <fn>
      callgrind's own per-call count, a cross-check (it is the figure above
      plus the two instructions of the empty stub, `xor eax,eax; ret`).

Usage: callgrind_cost.py PROFILE N  -> JSON on stdout.
"""
import json
import sys


def parse(path):
    inclusive, calls = {}, {}
    npos = 1
    fn = None
    pending_call = None
    for raw in open(path):
        line = raw.strip()
        if line.startswith("positions:"):
            npos = len(line.split()[1:])
            continue
        if line.startswith("fn="):
            fn = line[3:]
            inclusive.setdefault(fn, 0)
            continue
        if line.startswith("cfn="):
            pending_call = line[4:]
            continue
        if line.startswith("calls="):
            count = int(line[6:].split()[0])
            calls[pending_call] = calls.get(pending_call, 0) + count
            continue
        if not line or not (line[0].isdigit() or line[0] in "+-*"):
            continue
        fields = line.split()
        cost = sum(int(x) for x in fields[npos:])
        if fn is not None:
            # A cost line right after calls= is the callee's inclusive cost
            # charged to the caller: counted in the caller's inclusive total
            # either way.
            inclusive[fn] += cost
        pending_call = None
    return inclusive, calls


def main():
    path, n = sys.argv[1], int(sys.argv[2])
    inclusive, calls = parse(path)
    rows = []
    for name in sorted(k[5:] for k in inclusive if k.startswith("loop_")):
        loop, base = inclusive["loop_" + name], inclusive.get("base_" + name)
        callee = None
        if calls.get(name):
            callee = inclusive.get(name, 0) / calls[name]
        rows.append({
            "function": name,
            "loop_minus_base": (loop - base) / n,
            "callee_inclusive": callee,
            "baseline_loop_per_iteration": base / n,
        })
    print(json.dumps({"calls_per_loop": n, "functions": rows}, indent=1))


if __name__ == "__main__":
    main()
