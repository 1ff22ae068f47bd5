#!/usr/bin/env python3
# SPDX-License-Identifier: MIT
"""Work-up and correction watch from a FHIR R4 Bundle (invented data).

Reads laboratory Observations (LOINC-coded, UCUM valueQuantity) from a
FHIR Bundle or an NDJSON bulk-export file with natremia.fhir, lists what it
could not use and why, then for each patient: the first panel's work-up
(severity, calculated and effective osmolality, sodium corrected for
glucose) and the sodium course, pushed result by result to a
natremia.CourseWatch and assessed as a whole with natremia.course_assess.
The goal follows the first sodium: raised when below 140 mmol/L
(hypo_standard limits), lowered otherwise (hyper_chronic).

    python3 examples/fhir_bundle.py                      # examples/data/invented-bundle.json
    python3 examples/fhir_bundle.py export/Observation.ndjson

The default Bundle is invented: two invented patients, no real data.
Needs the natremia Python package (PYTHONPATH=bindings/python) and the C
library (NATREMIA_LIBRARY, or installed); nothing beyond the standard
library.

Every result is an estimate for decision support, not an order. Verify
with measured values; follow local protocols and licensed clinical
judgement.
"""

import os
import sys

import natremia
from natremia import fhir

DEFAULT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "data",
                       "invented-bundle.json")
RAISE_BELOW = 140.0  # mmol/L: the first sodium below this is being raised


def work_up(reading, patient, at):
    """Lines of the work-up on the panel at the first sodium's time."""
    panel = reading.latest(patient, at=at)
    na = panel["sodium"].value
    lines = ["  work-up on the panel of %s:" % at.isoformat()]
    shown = ", ".join("%s %.4g %s" % (name, r.value, r.unit)
                      for name, r in sorted(panel.items()))
    lines.append("    results used: " + shown)
    if na < RAISE_BELOW:
        lines.append("    severity of the low sodium: %s"
                     % natremia.na_severity(na_mmol_l=na).name.lower())
    glucose = panel.get("glucose")
    urea = panel.get("urea_nitrogen")
    if glucose is not None:
        lines.append("    effective osmolality 2 Na + glucose: %.1f mOsm/kg"
                     % natremia.osm_effective(na_mmol_l=na,
                                              glucose_mmol_l=glucose.value))
        lines.append("    sodium corrected for glucose (Katz): %.1f mmol/L"
                     % natremia.na_corrected_glucose(
                         na_mmol_l=na, glucose_mmol_l=glucose.value,
                         method="katz"))
        if urea is not None:
            lines.append("    calculated osmolality 2 Na + glucose + urea: "
                         "%.1f mOsm/kg" % natremia.osm_calculated(
                             na_mmol_l=na, glucose_mmol_l=glucose.value,
                             urea_mmol_l=urea.value))
    return lines


def course(series):
    """Lines of the sodium course: the watcher after each result, then
    the assessment of the whole series."""
    raise_it = series.na_mmol_l[0] < RAISE_BELOW
    preset = "hypo_standard" if raise_it else "hyper_chronic"
    lines = ["  sodium course (%s: %s limits):"
             % ("being raised" if raise_it else "being lowered", preset),
             "    %7s %7s  %-22s %s" % ("hours", "mmol/L", "time source",
                                        "watch")]
    watch = natremia.CourseWatch(preset)
    for h, na, r in zip(series.hours, series.na_mmol_l, series.results):
        report = watch.push(hours=h, na_mmol_l=na)
        names = ", ".join(report.flag_names) or "within the limits"
        lines.append("    %7.1f %7.1f  %-22s %s" % (h, na, r.time_source,
                                                     names))
    whole = natremia.course_assess(hours=series.hours,
                                   na_mmol_l=series.na_mmol_l, limits=preset)
    lines.append("    largest rise in 24 h: %.1f mmol/L; largest fall in "
                 "24 h: %.1f mmol/L" % (whole.max_rise_24h, whole.max_fall_24h))
    if whole.worst_at_h is not None:
        lines.append("    over a limit by %.1f mmol/L, worst window ending "
                     "at %.1f h" % (whole.excess_mmol_l, whole.worst_at_h))
    else:
        lines.append("    no 24 h or 48 h window over a limit")
    lines.append("    the watcher and the whole-series assessment %s"
                 % ("agree" if whole == watch.result() else "DIFFER"))
    return lines


def main(argv):
    path = argv[1] if len(argv) > 1 else DEFAULT
    caution = "Caution: " + natremia.CAUTION
    print(caution)
    reading = fhir.read(path)
    if path == DEFAULT:
        print("Invented Bundle (no real patient): %s" % os.path.basename(path))
    print("%d Observations used, %d not used; other resources: %s"
          % (len(reading.results), len(reading.skipped),
             ", ".join("%s %d" % kv for kv in sorted(
                 reading.other_resources.items())) or "none"))
    for s in reading.skipped:
        print("  not used: %s (id %s): %s" % (s.where, s.id, s.reason))
    serum = reading.sodium_series()
    blood = reading.sodium_series(specimens=("blood",))
    for patient in reading.patients():
        print()
        print("Patient %s" % patient)
        series = serum.get(patient)
        if series is None:
            print("  no serum or plasma sodium")
            continue
        for line in work_up(reading, patient, series.times[0]):
            print(line)
        for line in course(series):
            print(line)
        if patient in blood:
            print("  whole-blood sodium kept out of the course: %s"
                  % ", ".join("%.1f at %.1f h" % (na, (t - series.origin)
                                                  .total_seconds() / 3600)
                              for na, t in zip(blood[patient].na_mmol_l,
                                               blood[patient].times)))
    print()
    print(caution)
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
