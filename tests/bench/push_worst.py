#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""Per-push instruction counts from the callgrind dumps of bench_push_worst.

Usage: push_worst.py DUMP_FILE...  -> JSON on stdout: for each watcher and
stream the median push (steady cost), the worst push, which push it was,
and the number of pushes. A dump's "summary"/"totals" line is the
instructions collected since the previous dump: with --toggle-collect on
the push functions, those of exactly one push.
"""
import json
import re
import statistics
import sys

pushes = {}
for path in sys.argv[1:]:
    label, total = None, None
    with open(path) as f:
        for line in f:
            m = re.match(r"desc: Trigger: Client Request: (\S+) (\S+) (\d+)$", line.strip())
            if m:
                label = (m.group(1), m.group(2), int(m.group(3)))
            m = re.match(r"(summary|totals): (\d+)", line)
            if m:
                total = int(m.group(2))
    if label is not None and total is not None:
        pushes.setdefault((label[0], label[1]), []).append((label[2], total))

out = {}
for (watcher, stream), rows in sorted(pushes.items()):
    rows.sort()
    costs = [c for _, c in rows]
    worst = max(rows, key=lambda r: r[1])
    out.setdefault(watcher, {})[stream] = {
        "pushes": len(rows), "median": statistics.median(costs),
        "worst": worst[1], "worst_push": worst[0]}
print(json.dumps(out, indent=1))
