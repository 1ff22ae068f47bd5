#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""Assemble the benchmark results of run-bench.sh into docs/performance.md.

Usage: report.py RESULTS_DIR OUTPUT_MD
Reads the files run-bench.sh wrote in RESULTS_DIR (a missing file means the
step was skipped and is reported as such), prints the summary table and
writes the full page. The explanations of the limits come from
tests/bench/notes.md, included as written.
"""
import json
import os
import sys

SCALAR_TARGET = 50          # instructions per call
# Targets against the skilled baselines (issue 16):
BATCH_TARGET = 0.90         # batch throughput / same-stream plain C loop
NUMPY_TARGET = 3.0          # times faster than lean numpy, same results
COHORT_TARGET = 10.0        # times faster than skilled numpy, same results
SCALING_TARGET = 1.10       # slowest / fastest time per sample
PG_BARE_TARGET = 1.2        # extension time / bare SQL arithmetic, at most
PG_SQLFN_TARGET = 1.0       # SQL-language function (same checks) / extension, above
CODE_TARGET = 12 * 1024     # bytes of .text + .rodata, Cortex-M4 -Os
STACK_TARGET = 256          # bytes, largest frame of an entry point
PY_SCALAR_TARGET = 0.5      # microseconds per Python scalar call (accelerated)

# Entry points whose cost grows with their input (a series, a plan, a
# findings record, a whole watcher state): reported, not held to the
# per-call target of the scalar formulas.
SERIES = {
    "ntr_correction_assess": "12-sample series",
    "ntr_balance_predict": "2 flows",
    "ntr_balance_course": "2 flows, 25 points",
    "ntr_plan_check": "3 samples of history, 2 flows, 24 points",
    "ntr_course_plan_check": "3 samples of history, 2 flows, 24 points, both directions",
    "ntr_unit_parse_lenient": "' µMOL/L ' (the micro sign as UTF-8): blanks, capitals and the micro sign folded, the last of 11 spellings",
    "ntr_loinc_lookup": "the last of 12 codes",
}


def load(results, name):
    path = os.path.join(results, name)
    if not os.path.exists(path):
        return None
    with open(path) as f:
        if name.endswith(".json"):
            return json.load(f)
        return f.read()


def yes(ok):
    return "yes" if ok else "**no**"


def fmt(x, digits=2):
    return ("%." + str(digits) + "f") % x


class Page:
    def __init__(self):
        self.lines = []
        self.summary = []

    def add(self, *lines):
        self.lines.extend(lines)

    def table(self, header, rows):
        self.add("| " + " | ".join(header) + " |",
                 "|" + "|".join("---" for _ in header) + "|")
        for r in rows:
            self.add("| " + " | ".join(str(c) for c in r) + " |")
        self.add("")

    def result(self, what, target, measured, ok):
        shown = ok if isinstance(ok, str) else ("skipped" if ok is None else yes(ok))
        self.summary.append((what, target, measured, shown))


def scalar_section(page, d):
    page.add("## 1. Instructions per call of the scalar functions", "")
    if d is None:
        page.add("Skipped (valgrind not installed).", "")
        page.result("scalar functions, instructions per call", "<= %d" % SCALAR_TARGET, "skipped", None)
        return
    page.add("Counted by `valgrind --tool=callgrind` (instructions, not time, so "
             "the count is the same on every run). Each function is called %d "
             "times in a loop with valid inputs that take its full computing "
             "path; an identical loop calls a do-nothing function of the same "
             "signature, compiled apart so it cannot be inlined. **Per call** = "
             "(instructions of the loop - instructions of the empty-call loop) / "
             "calls: the library's own work, with the loop, the argument set-up "
             "and the call instruction subtracted. **Callee** is callgrind's "
             "inclusive count inside the function divided by its calls (it "
             "includes the two instructions of a bare `ret` path and is shown as "
             "a cross-check; for ntr_watch_result it also averages the calls "
             "ntr_watch_push makes). Library built as the project builds it "
             "(meson debugoptimized: -O2), x86-64." % d["calls_per_loop"], "")
    rows, series_rows, worst = [], [], None
    for r in sorted(d["functions"], key=lambda r: r["function"]):
        name = r["function"]
        per = r["loop_minus_base"]
        callee = r["callee_inclusive"]
        callee_s = "-" if callee is None else fmt(callee, 1)
        if name in SERIES:
            series_rows.append((name, SERIES[name], fmt(per, 0), callee_s))
            continue
        ok = per <= SCALAR_TARGET
        rows.append((name, fmt(per, 1), callee_s, yes(ok)))
        if worst is None or per > worst[1]:
            worst = (name, per)
    page.table(["function", "per call", "callee", "<= %d" % SCALAR_TARGET], rows)
    met = sum(1 for r in rows if r[3] == "yes")
    page.add("Series and record functions (cost grows with the input; no "
             "per-call target):", "")
    page.table(["function", "input", "per call", "callee"], series_rows)
    page.result("scalar functions, instructions per call (%d functions)" % len(rows),
                "<= %d each" % SCALAR_TARGET,
                "%d of %d meet it; highest %s %.0f" % (met, len(rows), worst[0], worst[1]),
                met == len(rows))


def push_section(page, d):
    if d is None:
        page.add("Worst single push of the watchers: skipped (valgrind or its "
                 "callgrind.h header missing).", "")
        return
    page.add("### Worst single push of the watchers", "",
             "`tests/bench/bench_push_worst` under callgrind with one dump after "
             "every push (`--toggle-collect` on the push functions, so a dump "
             "is one push, inclusive of what it calls; tests/bench/push_worst.py). "
             "Invented streams: *steady*, a result every 4 h (about 12 kept in "
             "48 h, the stream of the table above); *fill*, a rising result every "
             "0.4 h so every result stays a window-minimum candidate (120 kept; "
             "ntr_watch holds 128, the course watcher 96 and compacts), then one "
             "6 mmol/L lower; *gap*, the same fill then one result 100 h later. "
             "Median = the typical push of that stream; worst = its single most "
             "expensive push (which push, counted from 0).", "")
    rows = []
    for watcher in sorted(d):
        for stream in ("steady", "fill", "gap"):
            r = d[watcher].get(stream)
            if r is None:
                continue
            rows.append((watcher, stream, r["pushes"], fmt(r["median"], 0), r["worst"],
                         r["worst_push"], fmt(r["worst"] / d[watcher]["steady"]["median"], 1) + "x"))
    page.table(["function", "stream", "pushes", "median push", "worst push", "at push",
                "worst / steady median"], rows)
    page.result("watchers' worst single push (instructions, beside the steady median)",
                "reported (no target)",
                "; ".join("%s steady %.0f, worst %d" % (
                    w, d[w]["steady"]["median"], max(r["worst"] for r in d[w].values()))
                          for w in sorted(d)), "reported")


def batch_section(page, text):
    page.add("## 2. Batch throughput against a same-stream loop", "")
    if text is None:
        page.add("Skipped.", "")
        page.result("batch throughput vs a same-stream loop", ">= %.0f%%" % (BATCH_TARGET * 100),
                    "skipped", None)
        return
    rows_n = None
    rows, worst, met = [], None, 0
    for line in text.splitlines():
        if line.startswith("#") or not line.strip():
            if line.startswith("# rows="):
                rows_n = line.split()[1].split("=")[1]
            continue
        name, n, per_row, tb, tc, gb_b, gb_c, ratio, failed, tl, loop_ratio = line.split()
        loop_ratio = float(loop_ratio)
        ok = loop_ratio >= BATCH_TARGET
        met += ok
        rows.append((name, per_row, fmt(float(tb) * 1e3, 1), fmt(float(tl) * 1e3, 1),
                     fmt(loop_ratio * 100, 0) + "%", yes(ok),
                     fmt(float(tc) * 1e3, 1), fmt(float(ratio) * 100, 0) + "%"))
        if worst is None or loop_ratio < worst[1]:
            worst = (name, loop_ratio)
    page.add("`tests/bench/bench_batch`: every `ntr_batch_*` function on %s invented "
             "valid rows. The yardstick (issue 16) is a plain C loop a skilled "
             "programmer would write, compiled in the same program: it reads the "
             "same input columns and writes a result and a status column per "
             "row, in one pass, with no checks and the cheapest arithmetic (the "
             "sum of the inputs). *Of loop* = loop time / batch time (100%% = "
             "the batch call costs no more than streaming its bytes). The older "
             "yardstick, `memcpy` of as many bytes as the call moves (bytes/row), "
             "is kept for reference. Buffers are touched before timing; batch, "
             "copy and loop take turns and the fastest of the repeats of each "
             "is kept (thread CPU time)." % rows_n, "")
    page.table(["function", "bytes/row", "batch ms", "loop ms", "of loop",
                ">= %.0f%%" % (BATCH_TARGET * 100), "memcpy ms", "of memcpy"], rows)
    page.result("batch throughput, %s rows, vs a same-stream plain loop" % rows_n,
                ">= %.0f%% each" % (BATCH_TARGET * 100),
                "%d of %d meet it; lowest %s %.0f%%" % (met, len(rows), worst[0], worst[1] * 100),
                met == len(rows))


def numpy_section(page, d, default_heap=None):
    page.add("## 3. Python binding against numpy with the same validation", "")
    if d is None:
        page.add("Skipped (numpy or the binding missing).", "")
        page.result("Python array calls vs lean numpy", ">= %gx" % NUMPY_TARGET, "skipped", None)
        return
    page.add("`tests/bench/bench_numpy.py`: each array function of "
             "`natremia.arrays` (one C batch call) against the same formula and "
             "the same per-row validation written in numpy %s, on %d invented "
             "rows of which about 1 in 1000 is broken, two ways. *Lean numpy* "
             "(the skilled baseline, issue 16): one combined in-range mask for "
             "all inputs (a NaN fails every comparison), the formula over all "
             "rows, and the per-input grading only for the rows that fail. "
             "*Graded numpy*: a status graded for every row and input with "
             "`np.where` (the earlier baseline). Both give the same status codes "
             "and NaN in failed rows. Taking turns, fastest of %d runs each, "
             "process CPU time. *Same* = values and statuses identical to the "
             "binding's (checked, not assumed). *C call ms*: the binding's own "
             "batch call alone, repeated into outputs it has already written; "
             "*binding / C* is what the Python side adds. %s" % (
                 d["numpy"], d["rows"], d["repeats"],
                 "Freed memory stays in the process for both sides (glibc "
                 "`mallopt`: no trimming, arrays up to 32 MiB from the heap), so "
                 "no side is timed on fresh pages by the luck of the allocation "
                 "order (see the notes)." if d.get("heap") == "kept" else
                 "glibc's default heap (fresh pages for some calls, by the "
                 "allocation order)."), "")
    fresh = {r["function"]: r["lean_ratio"] for r in default_heap["functions"]} \
        if default_heap and default_heap.get("heap") == "default" else {}
    rows, worst, met, same = [], None, 0, True
    for r in d["functions"]:
        ok = r["lean_ratio"] >= NUMPY_TARGET and r["lean_same_result"]
        met += ok
        same &= r["same_result"] and r["lean_same_result"]
        rows.append((r["function"], fmt(r["binding_s"] * 1e3, 2), fmt(r["lean_s"] * 1e3, 2),
                     fmt(r["lean_ratio"], 1) + "x", "yes" if r["lean_same_result"] else "**no**",
                     yes(ok), fmt(r["numpy_s"] * 1e3, 2), fmt(r["ratio"], 1) + "x",
                     "yes" if r["same_result"] else "**no**")
                    + ((fmt(r["c_call_s"] * 1e3, 2), fmt(r["binding_s"] / r["c_call_s"], 2))
                       if "c_call_s" in r else ())
                    + ((fmt(fresh[r["function"]], 1) + "x" if r["function"] in fresh else "-",)
                       if fresh else ()))
        if worst is None or r["lean_ratio"] < worst[1]:
            worst = (r["function"], r["lean_ratio"])
    page.table(["function", "natremia ms", "lean numpy ms", "faster", "same",
                ">= %gx" % NUMPY_TARGET, "graded numpy ms", "faster", "same"]
               + (["C call ms", "binding / C"] if "c_call_s" in d["functions"][0] else [])
               + (["faster, glibc default heap"] if fresh else []),
               rows)
    if fresh:
        page.add("*Faster, glibc default heap*: natremia against lean numpy in a "
                 "second run of the same script with glibc's default allocator "
                 "settings, where some calls of either side start on fresh pages "
                 "depending on the order of allocations.", "")
    page.result("Python array calls vs lean numpy, same values and statuses (%d functions)"
                % len(rows), ">= %gx each" % NUMPY_TARGET,
                "%d of %d meet it; lowest %s %.1fx%s" % (
                    met, len(rows), worst[0], worst[1],
                    "" if same else "; some results differ (see section 3)"),
                met == len(rows) and same)


def cohort_section(page, d):
    page.add("## 4. Correction assessment of a cohort against numpy and pandas", "")
    if d is None:
        page.add("Skipped (pandas, the binding or ntr_batch_correction_assess missing).", "")
        page.result("cohort correction assessment vs skilled numpy", ">= %gx" % COHORT_TARGET,
                    "skipped", None)
        return
    all_same = d["same_result"] and d["numpy_same_result"] and d["flat_pandas_same_result"]
    ok = d["numpy_ratio"] >= COHORT_TARGET and d["numpy_same_result"]
    page.add("`tests/bench/bench_cohort.py`: %d invented patients, %d sodium "
             "results (8 to 16 each). natremia: one "
             "`natremia.arrays.correction_assess_groups` call (C "
             "`ntr_batch_correction_assess`), offsets included. Three baselines "
             "compute the 24 h and 48 h largest rises, the first-24-h rise, the "
             "last interval's rate, validation of values and time order, and the "
             "four basic flags (less than natremia computes): *skilled numpy* "
             "(the baseline of the target, issue 16): window starts by "
             "`np.searchsorted` on a patient-and-time key, window minima from a "
             "sparse table (range minimum), per-patient maxima by "
             "`np.maximum.reduceat`; *flat pandas*: one `rolling` over the whole "
             "frame on a time column with a gap of over 48 h between patients; "
             "*groupby pandas* %s: `groupby` per patient with time-based "
             "`rolling('24h')`/`rolling('48h')` (the earlier baseline). Process "
             "CPU time; natremia, numpy and flat pandas take turns, fastest of "
             "their runs; groupby pandas one run. Results agree with natremia "
             "(rises, rate and the four flags): numpy %s, flat pandas %s, "
             "groupby pandas %s; %d series are over the 24 h limit."
             % (d["patients"], d["results"], d["pandas"],
                "yes" if d["numpy_same_result"] else "**no**",
                "yes" if d["flat_pandas_same_result"] else "**no**",
                "yes" if d["same_result"] else "**no**", d["flagged_over_24h"]), "")
    page.table(["baseline", "baseline s", "natremia s", "natremia faster", "target"],
               [("skilled numpy (searchsorted + range minimum)", fmt(d["numpy_s"], 3),
                 fmt(d["natremia_s"], 3), fmt(d["numpy_ratio"], 1) + "x",
                 ">= %gx: %s" % (COHORT_TARGET, yes(ok))),
                ("flat pandas rolling", fmt(d["flat_pandas_s"], 3), fmt(d["natremia_s"], 3),
                 fmt(d["flat_pandas_ratio"], 1) + "x", "-"),
                ("pandas groupby().rolling", fmt(d["pandas_s"], 1), fmt(d["natremia_s"], 3),
                 fmt(d["ratio"], 0) + "x", "-")])
    page.result("cohort assessment, %d patients x ~12 results, vs skilled numpy" % d["patients"],
                ">= %gx" % COHORT_TARGET,
                "%.1fx (flat pandas %.1fx, groupby pandas %.0fx)%s" % (
                    d["numpy_ratio"], d["flat_pandas_ratio"], d["ratio"],
                    "" if all_same else "; results differ"),
                ok and all_same)


def scaling_rows(text):
    per = []
    for line in text.splitlines():
        if line.startswith("#") or not line.strip():
            continue
        n, series, samples, best, ns, flagged = line.split()
        per.append((int(n), float(ns)))
    return per


def scaling_section(page, dense, sparse, ir):
    page.add("## 5. Scaling of the correction assessment with series length", "")
    if dense is None:
        page.add("Skipped.", "")
        page.result("assessment time per sample, 10 to 100,000", "within 10%", "skipped", None)
        return
    page.add("`tests/bench/bench_scaling`: `ntr_correction_assess` on runs of n "
             "consecutive results of one invented series of 100,000 results "
             "drifting between 112 and 148 mmol/L, about the same number of "
             "samples for every n; lengths take turns and the fastest pass of "
             "each is kept (thread CPU time). Two series: *dense*, a result "
             "every 2 to 6 h (a ward correcting a low sodium), and *sparse*, "
             "every 8 to 12 h. Instructions per sample: callgrind, counting "
             "only inside `ntr_correction_assess`.", "")
    spreads = {}
    rows = []
    tables = {"dense": scaling_rows(dense)}
    if sparse is not None:
        tables["sparse"] = scaling_rows(sparse)
    ir = ir or {}
    ns_by = {k: dict(v) for k, v in tables.items()}
    for spacing, per in tables.items():
        spreads[spacing] = max(p[1] for p in per) / min(p[1] for p in per)
    for n, _ in tables["dense"]:
        row = [n]
        for spacing in tables:
            base = tables[spacing][0][1]
            ns = ns_by[spacing][n]
            irv = ir.get("%s %d" % (spacing, n))
            row += [fmt(ns, 1), fmt(ns / base, 2), "-" if irv is None else fmt(irv, 1)]
        rows.append(row)
    header = ["samples per series"]
    for spacing in tables:
        header += ["%s ns/sample" % spacing, "vs n=10", "%s instructions/sample" % spacing]
    page.table(header, rows)
    ir_spread = {}
    for spacing in tables:
        vals = [v for k, v in ir.items() if k.startswith(spacing + " ")]
        if vals:
            ir_spread[spacing] = max(vals) / min(vals)
    measured = "time, slowest/fastest: dense %.2f" % spreads["dense"]
    if "sparse" in spreads:
        measured += ", sparse %.2f" % spreads["sparse"]
    if ir_spread:
        measured += "; instructions: " + ", ".join(
            "%s %.3f" % kv for kv in ir_spread.items())
    page.result("assessment cost per sample, series of 10 to 100,000", "within 10%",
                measured, max(spreads.values()) <= SCALING_TARGET)


def div(a, b):
    """a / b, NaN when b is 0 (a query shorter than one clock tick)."""
    return a / b if b else float("nan")


def pg_section(page, d):
    page.add("## 6. PostgreSQL", "")
    if d is None:
        page.add("Skipped (PostgreSQL 15 server or development files missing).", "")
        page.result("PostgreSQL extension vs bare SQL / SQL function", "", "skipped", None)
        return
    s = d["seconds"]
    page.add("`tests/bench/pg-bench.sh`: a throwaway %s on a Unix socket, the "
             "extension built from this tree, %d invented rows, parallel query "
             "and JIT off. `sum()` over the table of: the extension's function; "
             "the bare arithmetic in SQL (no validation at all); a SQL-language "
             "function with the same validation (one `CASE` with a `BETWEEN` per "
             "input, which also rejects NaN and infinities; not STRICT, so the "
             "planner inlines it: the skilled baseline, issue 16); a PL/pgSQL "
             "function with the same validation (the earlier baseline). Backend "
             "CPU time (%.0f ms ticks, so small tables show coarse ratios), "
             "fastest of %d runs; the results agree on the table and NULL on "
             "invalid inputs: %s." % (d["server"], d["rows"], d["clock_tick_s"] * 1e3,
                                      d["repeats"], d["agreement"]), "")
    rows = []
    for f in ("effective", "calculated"):
        ext, sql, fn, plp = s["ext_" + f], s["sql_" + f], s["sqlfn_" + f], s["plpgsql_" + f]
        r_bare, r_fn = div(ext, sql), div(fn, ext)
        rows.append(("ntr_osm_" + f, fmt(ext, 2), fmt(sql, 2), fmt(fn, 2), fmt(plp, 2),
                     fmt(r_bare, 2) + " " + yes(r_bare <= PG_BARE_TARGET),
                     fmt(r_fn, 2) + "x " + yes(r_fn > PG_SQLFN_TARGET),
                     fmt(div(plp, ext), 1) + "x"))
    page.table(["function", "extension s", "bare SQL s", "SQL function s", "PL/pgSQL s",
                "extension / bare (<= %.1f)" % PG_BARE_TARGET,
                "SQL function / extension (> 1)", "PL/pgSQL / extension"], rows)
    fs = ("effective", "calculated")
    worst_bare = max(div(s["ext_" + f], s["sql_" + f]) for f in fs)
    worst_fn = min(div(s["sqlfn_" + f], s["ext_" + f]) for f in fs)
    worst_plp = min(div(s["plpgsql_" + f], s["ext_" + f]) for f in fs)
    agree = d["agreement"] == "agree"
    page.result("PostgreSQL, %d rows: extension time / bare SQL arithmetic" % d["rows"],
                "<= %.1f" % PG_BARE_TARGET, "%.2f (worst)" % worst_bare,
                worst_bare <= PG_BARE_TARGET and agree)
    page.result("PostgreSQL: SQL-language function with the same checks / extension",
                "> 1 (extension faster)",
                "%.2fx (worst; PL/pgSQL %.1fx)" % (worst_fn, worst_plp),
                worst_fn > PG_SQLFN_TARGET and agree)


def firmware_section(page, d):
    page.add("## 7. Firmware: Cortex-M4 code size and stack", "")
    if d is None:
        page.add("Skipped (arm-none-eabi-gcc not installed).", "")
        page.result("Cortex-M4 code size", "<= 12 KiB", "skipped", None)
        page.result("largest stack frame", "<= 256 B", "skipped", None)
        return
    page.add("`tests/bench/firmware.py`: every library source compiled with "
             "%s `%s`; sizes from `arm-none-eabi-size -A` of the objects "
             "(.text* + .rodata*; writable data %d bytes); frames from "
             "`-fstack-usage`. The linked image keeps every entry point "
             "(`--gc-sections`, `-u` for each) with libgcc's software "
             "double-precision routines a Cortex-M4 needs; the chain is the "
             "deepest path through the library's own functions (`-fcallgraph-info`), "
             "libgcc helpers not counted." % (d["compiler"], d["flags"], d["writable_bytes"]), "")
    code_ok = d["code_bytes"] <= CODE_TARGET
    stack_ok = d["largest_frame_bytes"] <= STACK_TARGET
    page.table(["measure", "bytes", "target", "met"], [
        ("library .text + .rodata", d["code_bytes"], CODE_TARGET, yes(code_ok)),
        ("  of which .text / .rodata", "%d / %d" % (d["text"], d["rodata"]), "", ""),
        ("linked image, every entry point + libgcc", d["image_code_bytes"], "", ""),
        ("largest frame of an entry point (%s)" % d["largest_frame_function"],
         d["largest_frame_bytes"], STACK_TARGET, yes(stack_ok)),
        ("deepest call chain in the library (%s)" % " > ".join(d["deepest_chain"]),
         d["deepest_chain_bytes"], "", ""),
    ])
    page.add("Linked images (`--gc-sections`) keeping only some entry points: "
             "a firmware links what it calls.", "")
    prof_rows = []
    for name, p in sorted(d["profiles"].items(), key=lambda kv: kv[1]["library"]):
        prof_rows.append((name, p["entry_points"], p["library"], p["other"],
                          yes(p["library"] <= CODE_TARGET)))
    page.table(["image", "entry points", "library bytes", "libgcc/newlib bytes",
                "library <= 12 KiB"], prof_rows)
    page.add("Per source file (.text + .rodata):", "")
    page.table(["object", "bytes"], sorted(d["objects"].items(), key=lambda kv: -kv[1]))
    frames = sorted(d["entry_frames"].items(), key=lambda kv: (-kv[1], kv[0]))[:10]
    page.add("Largest entry-point frames:", "")
    page.table(["entry point", "frame bytes"], frames)
    page.result("Cortex-M4 -Os code size (.text + .rodata, whole library)", "<= 12 KiB",
                "%.1f KiB" % (d["code_bytes"] / 1024.0), code_ok)
    page.result("largest stack frame of an entry point", "<= %d B" % STACK_TARGET,
                "%d B (%s)" % (d["largest_frame_bytes"], d["largest_frame_function"]), stack_ok)


def pyscalar_section(page, d):
    page.add("## 8. Python scalar calls against plain Python", "")
    if d is None:
        page.add("Skipped (python3-dev, python3-venv or pip missing: the "
                 "accelerator natremia._speed cannot be built).", "")
        page.result("Python scalar call (accelerated)", "<= %g us" % PY_SCALAR_TARGET,
                    "skipped", None)
        return
    on, off = d["installed"], d["ctypes_only"]
    page.add("`tests/bench/python-scalar.sh`: the package pip-installed from this "
             "tree into a throwaway venv (it builds the bundled library and the "
             "accelerator `natremia._speed`: %s), then "
             "`tests/bench/bench_python_scalar.py`: each public call against the "
             "same work in plain Python written the way a skilled user would "
             "(the same checks in the same order: finite, then range; the "
             "enumeration from its name; the same formula; a ValueError on "
             "failure), in one process, taking turns, fastest of %d rounds of %d "
             "calls (wall clock). *General path*: the binding's ctypes route "
             "(what every call cost before the accelerator; now only taken to "
             "name a failure); *ctypes floor*: the bare ctypes call with "
             "prototypes bound once and no checks. *ctypes only*: the same "
             "package with `NATREMIA_NO_SPEEDUP=1`, as on a machine without "
             "python3-dev. For many rows a loop of scalar calls is the wrong "
             "tool: the array calls of section 3 cost a few nanoseconds a row."
             % ("on" if d["accelerator"] == "on" else "**off**",
                on["repeats"], on["calls"]), "")
    rows, worst, met = [], None, 0
    for name, r in on["results"].items():
        o = off["results"][name]
        ok = d["accelerator"] == "on" and r["natremia"] <= PY_SCALAR_TARGET
        met += ok
        rows.append((name, fmt(r["natremia"], 3), fmt(r["plain"], 3),
                     fmt(r["ratio_to_plain"], 2), yes(ok), fmt(o["natremia"], 3),
                     fmt(r["general path"], 3), fmt(r["ctypes floor"], 3)))
        if worst is None or r["natremia"] > worst[1]:
            worst = (name, r["natremia"])
    page.table(["function", "natremia us", "plain Python us", "natremia / plain",
                "<= %g us" % PY_SCALAR_TARGET, "ctypes only us", "general path us",
                "ctypes floor us"], rows)
    page.result("Python scalar call, accelerated, beside plain Python (%d functions)"
                % len(rows), "<= %g us each" % PY_SCALAR_TARGET,
                "%d of %d; slowest %s %.3f us (plain Python %.3f us)" % (
                    met, len(rows), worst[0], worst[1],
                    on["results"][worst[0]]["plain"]), met == len(rows))


def dask_section(page, d, machine):
    page.add("## 9. Dask: the cohort example on 1 and 2 workers", "")
    if d is None:
        page.add("Skipped (python3-dask, python3-distributed or pandas missing).", "")
        page.result("Dask cohort example, 1 worker / 2 workers", "reported", "skipped", None)
        return
    m = d["median"]
    page.add("`tests/bench/bench_dask.py --scaling`: `examples/cohort_dask.py`'s "
             "computation (each worker generates its partitions of invented "
             "patients and assesses them with one natremia batch call per "
             "partition, `map_partitions`) on %d patients (%d sodium results, %d "
             "partitions), on a `LocalCluster` of 1 worker process and of 2 "
             "(one thread each), and serially in one process with pandas and "
             "natremia alone (`run_serial`). Clusters are started and their "
             "workers have imported pandas, numpy and natremia and run the "
             "computation once on a tiny cohort before the clock starts; the three take turns, median elapsed time of %d runs. "
             "*Scaling* = 1-worker time / 2-worker time (2.0 would be perfect). "
             "This machine has %s cores, shared with other jobs while measured: "
             "the 2-worker figure has no core to spare for the scheduler, the "
             "client or anything else, so it shows a lower bound of what two "
             "dedicated cores give. Results equal to the serial one, bit for "
             "bit: %s." % (d["patients"], d["samples"], d["partitions"],
                            d["repeats"], d.get("cores", machine.get("cores", "?")),
                            "yes" if d["same_result"] else "**no**"), "")
    c = d.get("median_cpu", {})
    rows = []
    for key, label in (("serial", "serial, one process"), ("1 worker", "Dask, 1 worker"),
                       ("2 workers", "Dask, 2 workers")):
        rows.append((label, fmt(m[key], 3), ", ".join(fmt(x, 3) for x in d["elapsed"][key]),
                     fmt(m["serial"] / m[key], 2), fmt(c[key], 3) if key in c else "-"))
    page.table(["run", "elapsed s (median)", "runs", "serial / this",
                "CPU s (median; workers summed)"], rows)
    page.add("Scaling (1 worker / 2 workers): **%.2f**." % d["scaling"], "")
    page.result("Dask cohort example: 1-worker / 2-worker time (%d patients, %s shared cores)"
                % (d["patients"], d.get("cores", "?")), "reported (2.0 = perfect)",
                "%.2f (serial / 2 workers %.2f)%s" % (
                    d["scaling"], d["serial_over_2_workers"],
                    "" if d["same_result"] else "; results differ"),
                "reported" if d["same_result"] else False)


def machine_lines(m):
    return ["- CPU: %s, %s logical cores (shared with other jobs while measured)" % (m["model"], m["cores"]),
            "- Memory: %s" % m["memory"],
            "- System: %s; compiler: %s; Python %s" % (m["kernel"], m["cc"], m["python"]),
            "- Commit: %s; measured %s; script run time %s s" % (m["commit"], m["date"], m.get("seconds", "?"))]


def main():
    results, output = sys.argv[1], sys.argv[2]
    page = Page()
    scalar_section(page, load(results, "scalar.json"))
    push_section(page, load(results, "push.json"))
    batch_section(page, load(results, "batch.txt"))
    numpy_section(page, load(results, "numpy.json"), load(results, "numpy_default.json"))
    cohort_section(page, load(results, "cohort.json"))
    scaling_section(page, load(results, "scaling_dense.txt"),
                    load(results, "scaling_sparse.txt"), load(results, "scaling_ir.json"))
    pg_section(page, load(results, "pg.json"))
    firmware_section(page, load(results, "firmware.json"))
    machine = load(results, "machine.json")
    pyscalar_section(page, load(results, "pyscalar.json"))
    dask_section(page, load(results, "dask.json"), machine or {})

    head = ["# Performance", "",
            "Every result natremia computes is an estimate for decision support, "
            "not an order: verify with measured values, follow local protocols "
            "and licensed clinical judgement. This page is about speed and size "
            "only.", "",
            "Written by `bash tests/bench/run-bench.sh` (issue P7); do not edit by "
            "hand: rerun the script. Every comparison is measured side by side in "
            "the same run on the same machine and reported as a ratio; absolute "
            "times are only for orientation. All data are invented.", "",
            "## Machine", ""] + machine_lines(machine) + ["", "## Summary", ""]
    summary = ["| measurement | target | measured | met |", "|---|---|---|---|"]
    summary += ["| %s | %s | %s | %s |" % row for row in page.summary]
    notes_path = os.path.join(os.path.dirname(os.path.abspath(__file__)), "notes.md")
    notes = open(notes_path).read().rstrip("\n").splitlines() if os.path.exists(notes_path) else []
    text = "\n".join(head + summary + [""] + page.lines + notes) + "\n"
    with open(output, "w") as f:
        f.write(text)
    print("\n".join(["Machine:"] + machine_lines(machine) + [""] + summary))


if __name__ == "__main__":
    main()
