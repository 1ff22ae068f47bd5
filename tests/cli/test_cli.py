#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""Test of natremia-course, the command-line program (bindings/cli,
docs/cli.md).

    test_cli.py <path of natremia-course> <docs/cli.md> [--update-docs]

with the Python binding importable (PYTHONPATH=bindings/python) and
NATREMIA_LIBRARY naming the built library, as meson sets them.

1. Its figures against the library's own results computed here
   independently: the same series, the hours worked out with Python's
   datetime from the same text, passed to natremia.course_assess (the
   Python binding, ctypes on the C library) and compared exactly.
2. Guideline thresholds, sources beside each check.
3. Bad input: every refusal names the line and column, with the exit
   status docs/cli.md documents.
4. The caution on every output.
5. The examples of docs/cli.md: each command is run again on the page's
   own input files and its output compared with the page's text
   (--update-docs writes the program's output into the page instead).

All patients and results below are invented for this test.
"""

import csv
import io
import json
import math
import os
import re
import subprocess
import sys
import tempfile
from datetime import datetime

import natremia

PROGRAM = os.path.abspath(sys.argv[1])
DOCS_PAGE = sys.argv[2]
UPDATE_DOCS = "--update-docs" in sys.argv[3:]
CAUTION = ("estimates for decision support, not orders; verify with measured "
           "values; follow local protocols and licensed clinical judgement")
FIGURES = ("elapsed_h", "max_rise_24h", "max_rise_48h", "max_fall_24h",
           "max_fall_48h", "rise_first_24h", "fall_first_24h", "rise_now_24h",
           "fall_now_24h", "last_rate_per_h", "excess_mmol_l")

failures = 0


def check(ok, what):
    global failures
    print(("OK: " if ok else "FAIL: ") + what)
    if not ok:
        failures += 1


def run(args, stdin_text=None):
    p = subprocess.run([PROGRAM] + args, input=stdin_text, capture_output=True,
                       text=True, timeout=60)
    return p.returncode, p.stdout, p.stderr


def csv_rows(text):
    body = [line for line in text.splitlines() if not line.startswith("#")]
    return list(csv.DictReader(io.StringIO("\n".join(body) + "\n")))


def as_number(text):
    return None if text == "" else float(text)


def compare(label, row, report, from_json=False):
    """Every figure and the flags of one output row against a report."""
    bad = []
    for name in FIGURES:
        got = row[name] if from_json else as_number(row[name])
        if got != getattr(report, name):
            bad.append("%s %r != %r" % (name, got, getattr(report, name)))
    worst = row["worst_at_h"] if from_json else as_number(row["worst_at_h"])
    if worst != report.worst_at_h:
        bad.append("worst_at_h %r != %r" % (worst, report.worst_at_h))
    bits = row["flag_bits"] if from_json else int(row["flag_bits"])
    if bits != int(report.flags):
        bad.append("flag_bits %r != %r" % (bits, int(report.flags)))
    names = tuple(row["flags"]) if from_json else tuple(row["flags"].split())
    if names != report.flag_names:
        bad.append("flags %r != %r" % (names, report.flag_names))
    check(not bad, "%s: the program's figures equal natremia.course_assess's%s"
          % (label, "" if not bad else " (" + "; ".join(bad) + ")"))


# ---- 1. against the library, computed independently -----------------------

# Invented series: hours since the first sample, sodium mmol/L. Patients are
# interleaved in the file; each one's rows stay in time order.
SERIES = {
    "inv-raise": [(0, 112.0), (4, 115.5), (10, 118.2), (22, 121.9), (30, 124.0), (47.5, 128.3)],
    "inv-slow": [(0, 118.0), (8, 119.1), (20, 121.0), (26, 122.4)],
    "inv-lower": [(0, 163.0), (6, 160.5), (18, 155.1), (24, 151.8), (40, 149.0)],
    "inv-one": [(5.25, 131.0)],
    "inv,quoted": [(0, 120.0), (6, 126.5)],
}


def interleaved():
    rows = []
    for pid, series in SERIES.items():
        for k, (h, na) in enumerate(series):
            rows.append((k, pid, h, na))
    rows.sort(key=lambda r: r[0])
    return [(pid, h, na) for _, pid, h, na in rows]


def hours_csv():
    out = io.StringIO()
    w = csv.writer(out, lineterminator="\n")
    w.writerow(["note", "patient", "hours", "sodium"])  # an extra column is ignored
    for pid, h, na in interleaved():
        w.writerow(["invented", pid, repr(float(h)), repr(na)])
    return out.getvalue()


for preset in ("hypo_standard", "hypo_high_risk", "hyper_chronic", "hyper_acute", "hold"):
    rc, out, err = run(["--preset", preset, "-"], hours_csv())
    check(rc == 0, "CSV (hours), --preset %s: exit 0 (stderr: %r)" % (preset, err))
    rows = {r["patient"]: r for r in csv_rows(out)}
    check(list(rows) == list(SERIES), "CSV: one row per patient, in order of first appearance")
    for pid, series in SERIES.items():
        report = natremia.course_assess(hours=[h for h, _ in series],
                                        na_mmol_l=[na for _, na in series], limits=preset)
        r = rows[pid]
        check(r["status"] == "assessed" and int(r["samples"]) == len(series),
              "%s %s: assessed, %d samples" % (preset, pid, len(series)))
        compare("CSV %s %s" % (preset, pid), r, report)

    rc, out, err = run(["--preset", preset, "--format", "json"], hours_csv())
    doc = json.loads(out)
    check(rc == 0 and doc["limits"]["preset"] == preset, "JSON, --preset %s: exit 0" % preset)
    lim = natremia.course_limits_preset(preset)
    check(all(doc["limits"][k] == getattr(lim, k) for k in
              ("max_rise_24h", "max_rise_48h", "max_fall_24h", "max_fall_48h", "min_change_24h")),
          "JSON: the limits printed are ntr_course_limits_preset(%s)'s" % preset)
    for r in doc["patients"]:
        series = SERIES[r["patient"]]
        report = natremia.course_assess(hours=[h for h, _ in series],
                                        na_mmol_l=[na for _, na in series], limits=preset)
        compare("JSON %s %s" % (preset, r["patient"]), r, report, from_json=True)

# --goal alone picks the goal's usual preset; an override makes it "custom".
rc, out, _ = run(["--goal", "lower", "--format", "json"], hours_csv())
check(json.loads(out)["limits"]["preset"] == "hyper_chronic", "--goal lower means hyper_chronic")
rc, out, _ = run(["--goal", "raise", "--max-rise-24h", "6", "--min-change-24h=4", "--format", "json"],
                 hours_csv())
doc = json.loads(out)
custom = natremia.CourseLimits(goal="raise", max_rise_24h=6, max_rise_48h=18, min_change_24h=4)
check(doc["limits"]["preset"] == "custom" and doc["limits"]["max_rise_24h"] == 6,
      "an overridden limit is shown as custom")
for r in doc["patients"]:
    series = SERIES[r["patient"]]
    compare("JSON custom limits %s" % r["patient"], r,
            natremia.course_assess(hours=[h for h, _ in series],
                                   na_mmol_l=[na for _, na in series], limits=custom),
            from_json=True)

# Date-times with zones (CSV time column and FHIR effectiveDateTime): the
# hours are worked out here with datetime from the same text.
TIMED = {
    "inv-t1": [("2026-03-28T22:00:00+01:00", 114.0, "mmol/L"),
               ("2026-03-29T04:30+02:00", 117.0, "mEq/L"),     # a clock change in between
               ("2026-03-29T20:15:30.5Z", 123.5, "mmol/L"),
               ("2026-03-30T21:00:00+02:00", 129.0, "meq/L")],
    "inv-t2": [("2026-05-01 08:00Z", 158.0, "mmol/L"),
               ("2026-05-01T20:00:00-04:00", 149.5, "mmol/L")],
}


def timed_hours(series):
    t0 = datetime.fromisoformat(series[0][0].replace("Z", "+00:00"))
    return [(datetime.fromisoformat(t.replace("Z", "+00:00")) - t0).total_seconds() / 3600.0
            for t, _, _ in series]


def timed_csv():
    lines = ["patient,time,sodium,unit"]
    for pid, series in TIMED.items():
        lines += ["%s,%s,%r,%s" % (pid, t, na, u) for t, na, u in series]
    return "\n".join(lines) + "\n"


def observation(pid, t, na, unit, code="2951-2", **extra):
    obs = {"resourceType": "Observation", "status": "final",
           "code": {"coding": [{"system": "http://loinc.org", "code": code}]},
           "subject": {"reference": "Patient/" + pid}, "effectiveDateTime": t,
           "valueQuantity": {"value": na, "unit": unit, "system": "http://unitsofmeasure.org",
                             "code": unit}}
    obs.update(extra)
    return json.dumps(obs)


def timed_ndjson():
    lines = []
    for pid, series in TIMED.items():
        for k, (t, na, u) in enumerate(series):
            lines.append(observation(pid, t, na, u, code="2947-0" if k == 1 else "2951-2"))
    # not sodium: skipped, counted on stderr
    lines.append(observation("inv-t1", "2026-03-29T04:30+02:00", 4.1, "mmol/L", code="2823-3"))
    lines.append(json.dumps({"resourceType": "Patient", "id": "inv-t1"}))
    return "\n".join(lines) + "\n"


for label, text, prefix in (("CSV (time)", timed_csv(), ""), ("FHIR NDJSON", timed_ndjson(), "Patient/")):
    rc, out, err = run(["--preset", "hypo_standard", "--format", "json"], text)
    doc = json.loads(out)
    check(rc == 0, "%s: exit 0 (stderr: %r)" % (label, err))
    got = {r["patient"]: r for r in doc["patients"]}
    for pid, series in TIMED.items():
        r = got[prefix + pid]
        check(r["origin"] == series[0][0], "%s %s: origin is the first time as written" % (label, pid))
        compare("%s %s" % (label, pid), r,
                natremia.course_assess(hours=timed_hours(series),
                                       na_mmol_l=[na for _, na, _ in series], limits="hypo_standard"),
                from_json=True)
    if prefix:
        check("skipped 2 line(s): 1 not an Observation, 1 not LOINC 2951-2 or 2947-0\n" in err,
              "NDJSON: the potassium result and the Patient are skipped and counted")
# hours across the clock change: 22:00+01:00 to 04:30+02:00 is 5.5 h
check(math.isclose(timed_hours(TIMED["inv-t1"])[1], 5.5), "the test's own hours are right (5.5 h)")


# ---- 2. guideline thresholds ------------------------------------------------

def one(preset, series):
    text = "patient,hours,sodium\n" + "".join("g,%r,%r\n" % s for s in series)
    rc, out, err = run(["--preset", preset], text)
    rows = csv_rows(out)
    return rc, rows[0]["flags"].split() if rows else None


# A rise of more than 10 mmol/L within 24 h is over the limit of the
# European guideline (Spasovski G et al. Eur J Endocrinol 2014;170:G1-G47,
# as summarised in George JC et al. Clin J Am Soc Nephrol 2018; checked
# in the project's shared source list, "correction limits"); exactly 10 is not.
rc, flags = one("hypo_standard", [(0, 110.0), (24, 121.0)])
check("rise_over_24h" in flags, "110 -> 121 in 24 h flagged rise_over_24h (Spasovski 2014)")
rc, flags = one("hypo_standard", [(0, 110.0), (24, 120.0)])
check("rise_over_24h" not in flags, "110 -> 120 in 24 h (10, the limit) not flagged (Spasovski 2014)")
# US panel at high risk of osmotic demyelination: at most 8 in any 24 h
# (Verbalis JG et al. Am J Med 2013;126 Suppl 1, as summarised in George
# 2018; shared source list, "correction limits").
rc, flags = one("hypo_high_risk", [(0, 110.0), (12, 114.0), (24, 119.0)])
check("rise_over_24h" in flags, "a rise of 9 in 24 h flagged at high risk (Verbalis 2013)")
rc, flags = one("hypo_standard", [(0, 110.0), (12, 114.0), (24, 119.0)])
check("rise_over_24h" not in flags, "the same rise of 9 within the standard limit of 10")
# Chronic hypernatraemia: lower by at most about 10 mmol/L a day; hours-old
# faster, about 1 mmol/L/h (Adrogue HJ, Madias NE. N Engl J Med
# 2000;342:1493-9; shared source list, "hypernatraemia pace").
rc, flags = one("hyper_chronic", [(0, 160.0), (12, 154.0), (24, 148.0)])
check("fall_over_24h" in flags, "160 -> 148 in 24 h flagged fall_over_24h, chronic (Adrogue 2000)")
rc, flags = one("hyper_acute", [(0, 160.0), (12, 154.0), (24, 148.0)])
check("fall_over_24h" not in flags, "160 -> 148 in 24 h (0.5/h) within the acute pace of 1/h (Adrogue 2000)")


# ---- 3. bad input -------------------------------------------------------------

def refused(args, text, status, *needles, label):
    rc, out, err = run(args, text)
    ok = rc == status and all(n in err for n in needles)
    check(ok, "%s: exit %d, stderr names %s%s" % (label, status, needles,
                                                  "" if ok else " (got %d, %r)" % (rc, err)))
    return out


refused(["--goal", "raise"], "patient,hours,na\nA,0,120\n", 3,
        "line 1 (the header)", "no column 'sodium'", label="missing column")
refused(["--goal", "raise"], "patient,sodium\nA,120\n", 3,
        "line 1 (the header)", "'hours'", "'time'", label="no time column")
out = refused(["--goal", "raise"], "patient,hours,sodium\nA,0,120\nA,6,12O\nB,0,121\n", 1,
              "line 3, column sodium: '12O' is not a number", label="non-numeric sodium")
rows = {r["patient"]: r for r in csv_rows(out)}
check(rows["A"]["status"] == "refused" and "line 3, column sodium" in rows["A"]["error"]
      and rows["B"]["status"] == "assessed",
      "the patient with the bad row is refused (error in its row), the other assessed")
refused(["--goal", "raise"], "patient,hours,sodium\nA,six,120\n", 1,
        "line 2, column hours: 'six' is not a number", label="non-numeric hours")
refused(["--goal", "raise"], "patient,hours,sodium\nA,0,120\nA,5,250\n", 1,
        "line 3, column sodium", "plausible range", label="sodium out of the library's range")
refused(["--goal", "raise"], "patient,hours,sodium\nA,0,120\nA,12,124\nA,6,126\n", 1,
        "line 4, column hours: earlier than line 3", "not in time order", label="unsorted times")
refused(["--goal", "raise"], "patient,time,sodium\nA,2026-01-01T08:00,120\n", 1,
        "line 2, column time", "no zone", label="a time without a zone")
refused(["--goal", "raise"], "patient,hours,sodium,unit\nA,0,120,mg/dL\n", 1,
        "line 2, column unit: unit 'mg/dL'", label="an unknown unit")
refused(["--goal", "raise"], "patient,hours,sodium\n,0,120\n", 1,
        "line 2, column patient: empty patient id", label="an empty patient id")
refused(["--goal", "raise"], "patient,hours,sodium\nA,0\n", 1,
        "line 2, field 3: 2 fields, the header (line 1) has 3", label="a short row")
refused(["--goal", "raise"], "", 3, "the input is empty", label="empty file")
refused(["--goal", "raise"], "\n\n", 3, "the input is empty", label="blank lines only")
refused(["--goal", "raise", "--frobnicate"], "", 2, "unknown option '--frobnicate'", label="unknown option")
refused(["--goal", "sideways"], "", 2, "--goal 'sideways'", label="unknown goal")
refused([], "", 2, "--goal", label="no goal or preset")
refused(["--goal", "raise", "--max-rise-24h", "70"], "", 2, "the limits are refused",
        label="limits the library refuses")
refused(["--goal", "raise", "/nonexistent/natremia-course-input"], "", 3, "cannot open",
        label="unreadable file")
refused(["--preset", "hypo_standard"],
        observation("x", "2026-01-01T08:00Z", 120, "mmol/L") + "\n" + '{"resourceType": "Obs\n', 1,
        "line 2, character", "not JSON", label="NDJSON syntax error")
refused(["--preset", "hypo_standard"],
        observation("x", "2026-01-01T08:00Z", "120", "mmol/L") + "\n", 1,
        "line 1, member valueQuantity.value: missing or not a number", label="NDJSON value as a string")
refused(["--preset", "hypo_standard"],
        observation("x", "2026-01-01T08:00Z", 120, "mg/dL") + "\n", 1,
        "line 1, member valueQuantity.code: unit 'mg/dL'", label="NDJSON unit")
refused(["--preset", "hypo_standard"],
        observation("x", "2026-01-01", 120, "mmol/L") + "\n", 1,
        "line 1, member effectiveDateTime", "too coarse", label="NDJSON date without a time")
refused(["--preset", "hypo_standard"],
        observation("x", "2026-01-01T08:00Z", 120, "mmol/L", subject={}) + "\n", 1,
        "line 1, member subject.reference", label="NDJSON without a subject")
refused(["--preset", "hypo_standard"],
        observation("x", "2026-01-01T09:00Z", 120, "mmol/L") + "\n" +
        observation("x", "2026-01-01T08:00Z", 121, "mmol/L") + "\n", 1,
        "line 2, member effectiveDateTime: earlier than line 1", label="NDJSON out of time order")
refused(["--goal", "raise"], "patient,hours,sodium,Sodium\nA,0,120,121\n", 3,
        "line 1 (the header): column 'sodium' appears twice", label="a column twice")
refused(["--goal", "raise"], "patient,hours,time,sodium\nA,0,2026-01-01T00:00Z,120\n", 3,
        "both column 'hours' and 'time'", label="both hours and time")
refused(["--goal", "raise"], "patient,hours,sodium\nA,0,12\0\n", 1,
        "line 2, character 1: a NUL byte", label="a NUL byte")
refused(["--preset", "hypo_standard"],
        observation("x", "2026-01-01T08:00Z", 120, "mmol/L").replace('"status"', '"subject": {}, "status"', 1)
        + "\n", 1, "line 1, member subject.reference: appears twice", label="NDJSON member twice")
refused(["--preset", "hypo_standard"],
        observation("x", "2026-01-01T08:00Z", 120, "mmol/L").replace('"value"', '"comparator": "<", "value"')
        + "\n", 1, "line 1, member valueQuantity.comparator", label="NDJSON comparator")
refused(["--preset", "hypo_standard"], '{"a": ' * 40 + "1" + "}" * 40 + "\n", 1,
        "line 1, character", "nested too deeply", label="NDJSON nested beyond the bound")
# renamed columns are found by their names, and named in refusals
rc, out, err = run(["--goal", "raise", "--column", "patient=mrn", "--column=sodium=na_mmol_l"],
                   "MRN,hours,NA_mmol_l\ninv-9,0,118\ninv-9,4,x\n")
check(rc == 1 and "line 3, column na_mmol_l: 'x' is not a number" in err,
      "--column: the renamed column is read, and named in a refusal")
refused(["--goal", "raise", "--column", "sodium=na"], "patient,hours,na\nA,0,120\nA,6,300\n", 1,
        "line 3, column na: 300 mmol/L", label="a range refusal names the renamed column")
refused(["--goal", "raise", "--column", "weight=kg"], "", 2, "--column 'weight=kg'", label="unknown role")
# a byte order mark, CRLF, names in another case, quoted fields, a patient
# id starting with # below the header (data, not a comment)
rc, out, err = run(["--goal", "raise"],
                   "\ufeff# invented\r\nPatient , Hours,SODIUM\r\n\"#7\",0,\"118.5\"\r\n#7,24,126\r\n")
rows = csv_rows(out)
check(rc == 0 and len(rows) == 1 and rows[0]["patient"] == "#7" and rows[0]["samples"] == "2"
      and float(rows[0]["max_rise_24h"]) == 126 - 118.5,
      "BOM, CRLF, header case and spaces, quotes, '#' ids below the header (stderr %r)" % err)
# an entered-in-error result is not a measurement: skipped, not assessed
rc, out, err = run(["--preset", "hypo_standard"],
                   observation("x", "2026-01-01T08:00Z", 120, "mmol/L") + "\n" +
                   observation("x", "2026-01-01T10:00Z", 135, "mmol/L", status="entered-in-error") + "\n")
check(rc == 0 and csv_rows(out)[0]["samples"] == "1" and "1 entered-in-error" in err,
      "an entered-in-error Observation is skipped and counted")


# ---- 4. the caution on every output ---------------------------------------------

rc, out, _ = run(["--goal", "raise"], "patient,hours,sodium\nA,0,120\n")
check(rc == 0 and out.splitlines()[0] == "# caution: " + CAUTION + ".", "CSV: the caution is the first line")
rc, out, _ = run(["--goal", "raise", "--format", "json"], "patient,hours,sodium\nA,0,120\n")
check(CAUTION in json.loads(out)["caution"], "JSON: the caution member")
rc, out, _ = run(["--goal", "raise"], "patient,hours,sodium\n")
check(rc == 0 and CAUTION in out and csv_rows(out) == [], "a header alone: no patient, the caution still printed")
for opt in ("--help", "--version"):
    rc, out, _ = run([opt])
    check(rc == 0 and CAUTION in out, "%s: exit 0 with the caution" % opt)


# ---- 5. the examples of docs/cli.md ----------------------------------------------

MARKER = re.compile(r"^<!-- cli-example (input (\S+)|run|output) -->$")


def doc_examples(lines):
    """(kind, name, first line, end line) of each marked fenced block; the
    block's body is lines[first:end]."""
    found, k = [], 0
    while k < len(lines):
        m = MARKER.match(lines[k])
        if m and k + 1 < len(lines) and lines[k + 1].startswith("```"):
            end = k + 2
            while end < len(lines) and lines[end] != "```":
                end += 1
            found.append((m.group(1).split()[0], m.group(2), k + 2, end))
            k = end
        k += 1
    return found


with open(DOCS_PAGE, encoding="utf-8") as fh:
    page = fh.read().split("\n")
blocks = doc_examples(page)
check(sum(1 for b in blocks if b[0] == "run") >= 4, "docs/cli.md has its examples marked")
replacements = []
with tempfile.TemporaryDirectory() as scratch:
    env = dict(os.environ, PATH=os.path.dirname(PROGRAM) + os.pathsep + os.environ.get("PATH", ""))
    for n, (kind, name, first, end) in enumerate(blocks):
        body = "\n".join(page[first:end])
        if kind == "input":
            with open(os.path.join(scratch, name), "w", encoding="utf-8") as fh:
                fh.write(body + "\n")
        elif kind == "run":
            nxt = blocks[n + 1] if n + 1 < len(blocks) else None
            if nxt is None or nxt[0] != "output":
                check(False, "docs/cli.md: the command %r has its output block" % body)
                continue
            got = subprocess.run(["bash", "-c", body], cwd=scratch, env=env, capture_output=True,
                                 text=True, timeout=60).stdout.rstrip("\n")
            shown = "\n".join(page[nxt[2]:nxt[3]])
            if UPDATE_DOCS:
                replacements.append((nxt[2], nxt[3], got.split("\n")))
            else:
                check(got == shown, "docs/cli.md: the output of %r is the program's%s"
                      % (body, "" if got == shown else "\n--- page:\n%s\n--- program:\n%s" % (shown, got)))
if UPDATE_DOCS:
    for first, end, text in reversed(replacements):
        page[first:end] = text
    with open(DOCS_PAGE, "w", encoding="utf-8") as fh:
        fh.write("\n".join(page))
    print("docs/cli.md: %d outputs written" % len(replacements))

if failures:
    print("%d check(s) failed" % failures)
    sys.exit(1)
print("all natremia-course checks passed")
