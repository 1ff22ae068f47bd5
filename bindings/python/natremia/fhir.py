# SPDX-License-Identifier: MIT
"""Reading HL7 FHIR R4 laboratory Observations into natremia's inputs.

A FHIR server or a bulk export sends laboratory results as Observation
resources: a Bundle (JSON, "searchset", "collection", "transaction"...)
or NDJSON, one Observation per line, as the bulk data export writes it.
This module reads those with the standard library's json alone and keeps
each Observation that natremia can use:

- ``code.coding`` with system ``http://loinc.org``: the code is looked up
  by the C library (``ntr_loinc_lookup``), which gives the analyte, the
  specimen and the kind of unit the code's property implies. Codes the
  library does not map are skipped: it maps only codes checked against a
  published source (docs/units.md).
- ``valueQuantity`` with ``system`` ``http://unitsofmeasure.org``, its
  ``code`` and ``value``. The unit is read by the library's lenient parser
  (``ntr_unit_parse_lenient``: "mmol/L", "mmol/l", "mEq/L", "mg/dl"...).
  A quantity without a system is read from its ``code``, else its ``unit``
  text, by the same parser; another system is refused. The value is
  converted to natremia's input unit (``ntr_convert``): mmol/L, or mOsm/kg
  for an osmolality.
- the time: ``effectiveDateTime``, else ``effectiveInstant``, else
  ``effectivePeriod.start``; else, in a Bundle, the effectiveDateTime (or
  effectivePeriod.start) of a DiagnosticReport of the same Bundle that
  lists the Observation in its ``result``; else ``issued`` (when the result
  was released, later than the sample). The element used is recorded in
  ``Result.time_source``. A
  time must carry its time of day and its offset, as FHIR requires of a
  dateTime with a time; a date alone is refused.
- ``subject.reference`` names the patient (the reference text as sent,
  such as "Patient/123" or "urn:uuid:...").

Nothing is dropped in silence: every Observation that is not kept is
returned in ``Reading.skipped`` with the reason (unknown or unmapped code,
no value, a ``dataAbsentReason``, status ``entered-in-error`` or
``cancelled`` or any status other than final, amended, corrected or
preliminary, an unknown unit or one that does not fit the code, a value
with a comparator such as "<", no time, no patient, a line that is not
JSON). Resources that are not Observations (Patient, DiagnosticReport...)
are counted in ``Reading.other_resources``; Bundles inside a Bundle are
read too.

``Reading.sodium_series()`` gives each patient's sodium series (times,
hours since the patient's first sample, values in mmol/L) ready for
``natremia.course_assess`` and ``natremia.CourseWatch``;
``Reading.latest()`` gives a patient's latest value of each analyte, in
the units the work-up functions take (``osm_calculated``,
``na_corrected_glucose``...).

Every result is an estimate for decision support, not an order. Verify
with measured values; follow local protocols and licensed clinical
judgement.
"""

import datetime as _dt
import json
import math
import re
from dataclasses import dataclass, field

from . import _core, _units
from ._core import NatremiaError, ERR_UNIT

LOINC_SYSTEM = "http://loinc.org"
UCUM_SYSTEM = "http://unitsofmeasure.org"

# Observation.status values whose value may be used. "preliminary" is
# kept (and marked in Result.status): a preliminary sodium is what a ward
# acts on; the others (registered, cancelled, entered-in-error, unknown)
# carry no usable result.
USABLE_STATUS = ("final", "amended", "corrected", "preliminary")

# NTR_SPECIMEN_* (natremia.Specimen) by the name Result.specimen carries.
SPECIMENS = {int(m): m.name.lower() for m in _units.Specimen}

# NTR_ANALYTE_* added in 1.1, which the Analyte enum may not list.
_ANALYTES_1_1 = {_units.ANALYTE_OSMOLALITY: "osmolality",
                 _units.ANALYTE_URIC_ACID: "uric_acid"}

# The kind of unit a LOINC property implies (the unit ntr_loinc_lookup
# gives) and the units of the same kind a value may be sent in.
_UNIT_KIND = {
    int(_core.Unit.MMOL_L): "substance concentration",
    int(_core.Unit.UMOL_L): "substance concentration",
    int(_core.Unit.MEQ_L): "substance concentration",
    int(_core.Unit.MG_DL): "mass concentration",
    int(_core.Unit.G_L): "mass concentration",
    int(_core.Unit.MOSM_KG): "osmolality",
}

# natremia's input unit of each analyte: mmol/L, or mOsm/kg.
_OSMOLALITY = _units.ANALYTE_OSMOLALITY


def _analyte_name(code):
    try:
        return _core.Analyte(code).name.lower()
    except ValueError:
        return _ANALYTES_1_1.get(code, "analyte_%d" % code)


# ---------------------------------------------------------------------------
# The C library's decisions: LOINC code and unit text (natremia._units)
# ---------------------------------------------------------------------------

def loinc_lookup(code):
    """(analyte, specimen, unit) of a LOINC code as ints (NTR_ANALYTE_*,
    NTR_SPECIMEN_*, NTR_UNIT_*), decided by ntr_loinc_lookup through
    natremia.loinc_lookup; None when the library does not map the code."""
    if not isinstance(code, str):
        return None
    try:
        info = _units.loinc_lookup(code)
    except NatremiaError as err:
        if err.status == ERR_UNIT:
            return None
        raise
    return int(info.analyte), int(info.specimen), int(info.unit)


def unit_lenient(text):
    """NTR_UNIT_* of a unit text as laboratories spell it, decided by
    ntr_unit_parse_lenient through natremia.unit_parse_lenient; None when
    the library does not read it."""
    if not isinstance(text, str):
        return None
    try:
        return int(_units.unit_parse_lenient(text))
    except NatremiaError:
        return None


# ---------------------------------------------------------------------------
# What comes out
# ---------------------------------------------------------------------------

@dataclass(frozen=True)
class Result:
    """One Observation natremia can use.

    ``value`` is in natremia's input unit ``unit`` ("mmol/L", or "mOsm/kg"
    for an osmolality); ``sent_value`` and ``sent_unit`` are as the
    Observation sent them. ``time`` is a timezone-aware datetime;
    ``time_source`` the element it came from ("effectiveDateTime",
    "effectiveInstant", "effectivePeriod.start",
    "DiagnosticReport.effectiveDateTime",
    "DiagnosticReport.effectivePeriod.start" or "issued").
    ``where`` locates the Observation in the input ("entry[3]", "line 7")."""
    patient: str
    analyte: str
    specimen: str
    value: float
    unit: str
    time: _dt.datetime
    time_source: str
    loinc: str
    sent_value: float
    sent_unit: str
    status: str
    id: object
    where: str


@dataclass(frozen=True)
class Skipped:
    """An Observation (or an input line) not used, and why."""
    where: str
    id: object
    reason: str


@dataclass(frozen=True)
class SodiumSeries:
    """One patient's sodium series in time order: ``times`` (aware
    datetimes), ``hours`` since ``origin`` (the patient's first sample
    unless given), ``na_mmol_l``, and the Results they came from. Pass
    ``hours`` and ``na_mmol_l`` to natremia.course_assess or push them to a
    natremia.CourseWatch."""
    patient: str
    origin: _dt.datetime
    times: tuple
    hours: tuple
    na_mmol_l: tuple
    results: tuple


@dataclass
class Reading:
    """What read_bundle / read_ndjson / read found: the usable
    ``results``, the ``skipped`` Observations with their reasons, and a
    count of the other resource types met."""
    results: list = field(default_factory=list)
    skipped: list = field(default_factory=list)
    other_resources: dict = field(default_factory=dict)

    def patients(self):
        """Patient references with at least one result, in first-seen order."""
        seen = {}
        for r in self.results:
            seen.setdefault(r.patient, None)
        return list(seen)

    def sodium_series(self, specimens=("serum_plasma",), origin=None):
        """{patient: SodiumSeries} of the sodium results of the specimens
        named (default serum or plasma only: whole-blood sodium from a
        blood-gas analyser can differ from the laboratory's by a few
        mmol/L, so it is mixed in only when asked, specimens=("serum_plasma",
        "blood")). Results of equal time keep their input order.
        ``origin``: a datetime from which hours count for every patient;
        default each patient's first sample."""
        by_patient = {}
        for r in self.results:
            if r.analyte == "sodium" and r.specimen in specimens:
                by_patient.setdefault(r.patient, []).append(r)
        series = {}
        for patient, rows in by_patient.items():
            rows.sort(key=lambda r: r.time)  # stable
            start = origin if origin is not None else rows[0].time
            series[patient] = SodiumSeries(
                patient, start, tuple(r.time for r in rows),
                tuple(_hours(r.time, start) for r in rows),
                tuple(r.value for r in rows), tuple(rows))
        return series

    def latest(self, patient, specimen="serum_plasma", at=None):
        """{analyte: Result} of a patient: the latest result of each
        analyte of one specimen (at or before ``at`` when given)."""
        found = {}
        for r in self.results:
            if r.patient != patient or r.specimen != specimen:
                continue
            if at is not None and r.time > at:
                continue
            if r.analyte not in found or r.time >= found[r.analyte].time:
                found[r.analyte] = r
        return found

    def rows(self):
        """The results as plain dicts (for pandas.DataFrame(rows))."""
        return [dict(r.__dict__) for r in self.results]


def _hours(time, origin):
    return (time - origin).total_seconds() / 3600.0


# ---------------------------------------------------------------------------
# FHIR dateTime
# ---------------------------------------------------------------------------

_DATETIME = re.compile(
    r"^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2})(\.\d+)?)?"
    r"(Z|[+-]\d{2}:\d{2})?$")
_DATE_ONLY = re.compile(r"^\d{4}(-\d{2}(-\d{2})?)?$")


def parse_datetime(text):
    """A FHIR dateTime / instant with a time of day as an aware datetime.
    Raises ValueError for a date without a time, a time without an offset
    (FHIR requires one), or anything else that is not such a dateTime."""
    if not isinstance(text, str):
        raise ValueError("not a text")
    if _DATE_ONLY.match(text):
        raise ValueError("a date without a time of day")
    m = _DATETIME.match(text)
    if m is None:
        raise ValueError("not a FHIR dateTime")
    if m.group(8) is None:
        raise ValueError("a time without a UTC offset")
    year, month, day, hour, minute = (int(m.group(i)) for i in range(1, 6))
    second = int(m.group(6) or 0)
    micro = int(round(float(m.group(7)) * 1e6)) if m.group(7) else 0
    micro = min(micro, 999999)
    zone = m.group(8)
    if zone == "Z":
        tz = _dt.timezone.utc
    else:
        sign = 1 if zone[0] == "+" else -1
        tz = _dt.timezone(sign * _dt.timedelta(hours=int(zone[1:3]),
                                               minutes=int(zone[4:6])))
    if second == 60:  # a leap second: FHIR allows it, datetime does not
        second = 59
        micro = 999999
    return _dt.datetime(year, month, day, hour, minute, second, micro, tz)


_TIME_ELEMENTS = (("effectiveDateTime", lambda o: o.get("effectiveDateTime")),
                  ("effectiveInstant", lambda o: o.get("effectiveInstant")),
                  ("effectivePeriod.start",
                   lambda o: (o.get("effectivePeriod") or {}).get("start")
                   if isinstance(o.get("effectivePeriod"), dict) else None),
                  ("issued", lambda o: o.get("issued")))


def _time(obs, report_time=None):
    """(datetime, element) of the first time element present, or raise
    _Skip naming the element that is unreadable or that none is there.
    ``report_time``, (text, element) from a DiagnosticReport of the same
    Bundle listing this Observation, comes after the Observation's own
    effective[x] and before its issued."""
    elements = list(_TIME_ELEMENTS)
    if report_time is not None:
        elements.insert(3, (report_time[1], lambda o: report_time[0]))
    for name, get in elements:
        text = get(obs)
        if text is None:
            continue
        try:
            return parse_datetime(text), name
        except ValueError as err:
            raise _Skip("%s %r is unusable: %s" % (name, text, err)) from None
    raise _Skip("no time (effectiveDateTime, effectiveInstant, "
                "effectivePeriod.start, a DiagnosticReport's effective time "
                "or issued)")


def _reference_key(text):
    """A reference or fullUrl reduced to what both forms share: a urn as
    it is, a URL or relative reference to its last "Type/id"."""
    if not isinstance(text, str) or not text:
        return None
    if text.startswith("urn:"):
        return text
    parts = text.rstrip("/").split("/")
    if len(parts) >= 4 and parts[-2] == "_history":  # Type/id/_history/v
        parts = parts[:-2]
    return "/".join(parts[-2:]) if len(parts) >= 2 else None


def _report_times(entries):
    """{reference key: (time text, element)} of the Observations each
    DiagnosticReport among the entries lists in ``result``, with the
    report's effectiveDateTime or effectivePeriod.start."""
    times = {}
    for entry in entries:
        report = entry.get("resource") if isinstance(entry, dict) else None
        if not isinstance(report, dict) or \
                report.get("resourceType") != "DiagnosticReport":
            continue
        when, element = report.get("effectiveDateTime"), \
            "DiagnosticReport.effectiveDateTime"
        if when is None and isinstance(report.get("effectivePeriod"), dict):
            when, element = report["effectivePeriod"].get("start"), \
                "DiagnosticReport.effectivePeriod.start"
        if when is None:
            continue
        for ref in report.get("result") or ():
            key = _reference_key(ref.get("reference")
                                 if isinstance(ref, dict) else None)
            if key is not None:
                times.setdefault(key, (when, element))
    return times


# ---------------------------------------------------------------------------
# One Observation
# ---------------------------------------------------------------------------

class _Skip(Exception):
    pass


def _loinc(obs):
    """(code, (analyte, specimen, unit)) of the first LOINC coding the
    library maps."""
    code = obs.get("code")
    codings = code.get("coding") if isinstance(code, dict) else None
    loinc = [c.get("code") for c in codings or () if isinstance(c, dict)
             and c.get("system") == LOINC_SYSTEM]
    if not loinc:
        raise _Skip("no LOINC coding (system %s)" % LOINC_SYSTEM)
    for text in loinc:
        mapped = loinc_lookup(text)
        if mapped is not None:
            return text, mapped
    raise _Skip("LOINC code %s not mapped by natremia (unknown, or not "
                "checked yet; docs/units.md)" % ", ".join(repr(c) for c in loinc))


def _unit_of(quantity):
    """(NTR_UNIT_*, text as sent) of a valueQuantity."""
    system = quantity.get("system")
    code = quantity.get("code")
    text = quantity.get("unit")
    if system is not None and system != UCUM_SYSTEM:
        raise _Skip("unit system %r is not UCUM (%s)" % (system, UCUM_SYSTEM))
    sent = code if code is not None else (None if system else text)
    if sent is None:
        raise _Skip("valueQuantity has no unit code")
    unit = unit_lenient(sent)
    if unit is None:
        raise _Skip("unknown unit %r" % (sent,))
    return unit, sent


def _value(obs):
    """(value as sent, NTR_UNIT_*, unit text) of the valueQuantity."""
    if "dataAbsentReason" in obs:
        reason = obs["dataAbsentReason"]
        label = None
        if isinstance(reason, dict):
            label = reason.get("text") or next(
                (c.get("code") for c in reason.get("coding") or ()
                 if isinstance(c, dict) and c.get("code")), None)
        raise _Skip("dataAbsentReason %r" % (label or reason,))
    quantity = obs.get("valueQuantity")
    if not isinstance(quantity, dict):
        other = [k for k in obs if k.startswith("value")]
        raise _Skip("no valueQuantity" + (" (has %s)" % ", ".join(other)
                                          if other else ""))
    if quantity.get("comparator") is not None:
        raise _Skip("value has comparator %r: not an exact value"
                    % quantity["comparator"])
    value = quantity.get("value")
    if isinstance(value, bool) or not isinstance(value, (int, float)):
        raise _Skip("valueQuantity.value is missing or not a number (%r)"
                    % (value,))
    value = float(value)
    if not math.isfinite(value):
        raise _Skip("valueQuantity.value is not finite")
    unit, text = _unit_of(quantity)
    return value, unit, text


_UNIT_TEXT = {int(_core.Unit.MMOL_L): "mmol/L",
              int(_core.Unit.MOSM_KG): "mOsm/kg"}


def _observation(obs, where, report_time=None):
    """A Result from one Observation, or raise _Skip."""
    status = obs.get("status")
    if status not in USABLE_STATUS:
        raise _Skip("status %r" % (status,) if status is not None
                    else "no status")
    code, (analyte, specimen, implied) = _loinc(obs)
    value, unit, unit_text = _value(obs)
    kind, wanted = _UNIT_KIND.get(unit), _UNIT_KIND.get(implied)
    if kind != wanted:
        raise _Skip("unit %r (%s) does not fit LOINC %s (%s)"
                    % (unit_text, kind, code, wanted))
    subject = obs.get("subject")
    patient = subject.get("reference") if isinstance(subject, dict) else None
    if not isinstance(patient, str) or not patient:
        raise _Skip("no subject.reference")
    time, source = _time(obs, report_time)
    target = int(_core.Unit.MOSM_KG) if analyte == _OSMOLALITY \
        else int(_core.Unit.MMOL_L)
    try:
        converted = _core.convert(value, analyte=analyte, from_unit=unit,
                                  to_unit=target)
    except NatremiaError as err:
        raise _Skip("value %r %s not converted: %s" % (value, unit_text,
                                                      err.message)) from None
    return Result(patient, _analyte_name(analyte),
                  SPECIMENS.get(specimen, "specimen_%d" % specimen),
                  converted, _UNIT_TEXT[target], time, source, code, value,
                  unit_text, status, obs.get("id"), where)


def _add(reading, resource, where, report_time=None):
    if not isinstance(resource, dict):
        reading.skipped.append(Skipped(where, None, "not a JSON object"))
        return
    kind = resource.get("resourceType")
    if kind == "Bundle":
        _read_bundle(reading, resource, where + ".")
        return
    if kind != "Observation":
        key = kind if isinstance(kind, str) else "(no resourceType)"
        reading.other_resources[key] = reading.other_resources.get(key, 0) + 1
        return
    try:
        reading.results.append(_observation(resource, where, report_time))
    except _Skip as skip:
        reading.skipped.append(Skipped(where, resource.get("id"), str(skip)))


def _read_bundle(reading, bundle, prefix=""):
    entries = bundle.get("entry") or []
    if not isinstance(entries, list):
        reading.skipped.append(Skipped(prefix + "entry", None,
                                       "Bundle.entry is not a list"))
        return
    report_times = _report_times(entries)
    for i, entry in enumerate(entries):
        where = "%sentry[%d]" % (prefix, i)
        if not isinstance(entry, dict) or "resource" not in entry:
            reading.skipped.append(Skipped(where, None, "entry without a "
                                           "resource"))
            continue
        resource = entry["resource"]
        report_time = None
        if report_times and isinstance(resource, dict):
            for key in (_reference_key(entry.get("fullUrl")),
                        _reference_key("Observation/%s" % resource.get("id"))
                        if resource.get("id") is not None else None):
                if key in report_times:
                    report_time = report_times[key]
                    break
        _add(reading, resource, where, report_time)


# ---------------------------------------------------------------------------
# Entry points
# ---------------------------------------------------------------------------

def read_bundle(bundle):
    """Read a FHIR Bundle: a dict (parsed JSON) or its JSON text. Returns
    a Reading. Raises ValueError when the input is not a Bundle."""
    if isinstance(bundle, (str, bytes)):
        bundle = json.loads(bundle)
    if not isinstance(bundle, dict) or bundle.get("resourceType") != "Bundle":
        raise ValueError("fhir.read_bundle: not a FHIR Bundle (resourceType %r)"
                         % (bundle.get("resourceType")
                            if isinstance(bundle, dict) else type(bundle)))
    reading = Reading()
    _read_bundle(reading, bundle)
    return reading


def read_ndjson(lines):
    """Read NDJSON as a FHIR bulk export writes it (one resource per line):
    an iterable of lines (an open text file) or the whole text. Blank lines
    are ignored; a line that is not JSON is reported in skipped."""
    if isinstance(lines, bytes):
        lines = lines.decode("utf-8")
    if isinstance(lines, str):
        lines = lines.splitlines()
    reading = Reading()
    for number, line in enumerate(lines, start=1):
        if isinstance(line, bytes):
            line = line.decode("utf-8")
        if not line.strip():
            continue
        where = "line %d" % number
        try:
            resource = json.loads(line)
        except ValueError as err:
            reading.skipped.append(Skipped(where, None, "not JSON: %s" % err))
            continue
        _add(reading, resource, where)
    return reading


def read(path):
    """Read a file: a Bundle (one JSON document) or NDJSON. A file whose
    name ends in .ndjson is NDJSON; otherwise one JSON document is a
    Bundle or a single resource, and anything else is read as NDJSON."""
    with open(path, encoding="utf-8") as f:
        text = f.read()
    if not str(path).endswith(".ndjson"):
        try:
            doc = json.loads(text)
        except ValueError:
            doc = None
        if isinstance(doc, dict) and doc.get("resourceType") == "Bundle":
            return read_bundle(doc)
        if isinstance(doc, dict):  # one resource, perhaps pretty-printed
            reading = Reading()
            _add(reading, doc, "resource")
            return reading
    return read_ndjson(text)


__all__ = ["LOINC_SYSTEM", "UCUM_SYSTEM", "USABLE_STATUS", "SPECIMENS",
           "Result", "Skipped", "SodiumSeries", "Reading", "loinc_lookup",
           "unit_lenient", "parse_datetime", "read_bundle", "read_ndjson",
           "read"]
