# SPDX-License-Identifier: MIT
"""natremia.fhir: FHIR R4 Observations (Bundle and NDJSON) into natremia's
inputs and per-patient sodium series.

The fixtures under fixtures/ are invented (no real patient). The LOINC
codes in them are those checked against HL7 FHIR R4 published examples
and LOINC as listed in docs/units.md; the reader takes every LOINC
decision from the C library (ntr_loinc_lookup), so these tests also check
that the library maps those codes as their published names say.
"""

import datetime as dt
import json
import os
import unittest

import natremia
from natremia import fhir

HERE = os.path.dirname(os.path.abspath(__file__))
BUNDLE = os.path.join(HERE, "fixtures", "fhir-invented-bundle.json")
NDJSON = os.path.join(HERE, "fixtures", "fhir-invented-observations.ndjson")
A, B = "Patient/invented-a", "Patient/invented-b"


def by_id(reading):
    return {r.id: r for r in reading.results}


def skipped_by_id(reading):
    return {s.id: s for s in reading.skipped}


class LoincFromTheLibrary(unittest.TestCase):
    """Each code against its published LOINC name (component [property]
    in system), as listed in HL7 FHIR R4 examples (hl7.fhir.r4.examples
    4.0.1) and LOINC (Regenstrief); the unit is the one the property
    implies (moles/volume: mmol/L, mass/volume: mg/dL)."""

    PUBLISHED = {
        # code: (analyte, specimen, NTR_UNIT_*) by the published name
        "2951-2": ("sodium", "serum_plasma", 1),      # Sodium [Moles/volume] in Serum or Plasma
        "2947-0": ("sodium", "blood", 1),             # Sodium [Moles/volume] in Blood
        "2823-3": ("potassium", "serum_plasma", 1),   # Potassium [Moles/volume] in Serum or Plasma
        "2345-7": ("glucose", "serum_plasma", 2),     # Glucose [Mass/volume] in Serum or Plasma
        "14749-6": ("glucose", "serum_plasma", 1),    # Glucose [Moles/volume] in Serum or Plasma
        "15074-8": ("glucose", "blood", 1),           # Glucose [Moles/volume] in Blood
        "14937-7": ("urea_nitrogen", "serum_plasma", 1),  # Urea nitrogen [Moles/volume] in Serum or Plasma
        "2160-0": ("creatinine", "serum_plasma", 2),  # Creatinine [Mass/volume] in Serum or Plasma
        "14682-9": ("creatinine", "serum_plasma", 1),  # Creatinine [Moles/volume] in Serum or Plasma
        "2161-8": ("creatinine", "urine", 2),         # Creatinine [Mass/volume] in Urine
        "14933-6": ("uric_acid", "serum_plasma", 1),  # Urate [Moles/volume] in Serum or Plasma
    }

    def test_published_codes(self):
        for code, (analyte, specimen, unit) in self.PUBLISHED.items():
            got = fhir.loinc_lookup(code)
            self.assertIsNotNone(got, code)
            self.assertEqual((fhir._analyte_name(got[0]),
                              fhir.SPECIMENS[got[1]], got[2]),
                             (analyte, specimen, unit), code)

    def test_unknown_codes(self):
        for code in ("99999-99", "2951", "2951-2 ", "", "NA-SERUM", None, 2951):
            self.assertIsNone(fhir.loinc_lookup(code), repr(code))


class Units(unittest.TestCase):
    def test_lenient_spellings(self):
        # Spellings as laboratory feeds send them; UCUM (Regenstrief)
        # codes mmol/L, meq/L, mg/dL, umol/L, and their case variants.
        U = natremia.Unit
        for text, unit in (("mmol/L", U.MMOL_L), ("mmol/l", U.MMOL_L),
                           ("mEq/L", U.MEQ_L), ("mg/dl", U.MG_DL),
                           ("mg/dL", U.MG_DL), ("umol/L", U.UMOL_L)):
            self.assertEqual(fhir.unit_lenient(text), int(unit), text)
        for text in ("mmol/kg", "mosm/L", "", "mmol/L\0", None):
            self.assertIsNone(fhir.unit_lenient(text), repr(text))


class DateTimes(unittest.TestCase):
    def test_offsets(self):
        # RFC 3339 / FHIR dateTime: the same instant in two offsets.
        a = fhir.parse_datetime("2026-03-01T12:00:00+01:00")
        b = fhir.parse_datetime("2026-03-01T11:00:00Z")
        self.assertEqual(a, b)
        c = fhir.parse_datetime("2026-03-01T06:30:15.25-05:00")
        self.assertEqual(c.astimezone(dt.timezone.utc),
                         dt.datetime(2026, 3, 1, 11, 30, 15, 250000,
                                     dt.timezone.utc))

    def test_refused(self):
        for text in ("2026-03-01", "2026-03", "2026", "2026-03-01T12:00:00",
                     "01/03/2026 12:00", "", None):
            with self.assertRaises(ValueError, msg=repr(text)):
                fhir.parse_datetime(text)


class ReadBundle(unittest.TestCase):
    @classmethod
    def setUpClass(cls):
        cls.reading = fhir.read(BUNDLE)
        cls.results = by_id(cls.reading)
        cls.skipped = skipped_by_id(cls.reading)

    def test_bundle_says_invented(self):
        with open(BUNDLE, encoding="utf-8") as f:
            self.assertIn("Invented", f.read())

    def test_kept(self):
        self.assertEqual(sorted(self.results), sorted([
            "a-na-1", "a-na-2", "a-na-3", "a-na-4", "a-na-blood", "a-glu",
            "a-bun", "a-crea", "a-k", "a-ucrea", "b-na-1", "b-na-2", "b-na-3",
            "b-glu", "b-bun"]))
        self.assertEqual(self.reading.other_resources, {"Patient": 1})
        self.assertEqual(self.reading.patients(), [A, B])

    def test_every_other_observation_is_skipped_with_its_reason(self):
        want = {
            "x-error": "status 'entered-in-error'",
            "x-cancelled": "status 'cancelled'",
            "x-absent": "dataAbsentReason 'error'",
            "x-local-code": "no LOINC coding",
            "x-unmapped": "LOINC code '99999-99' not mapped",
            "x-unit": "unknown unit 'mmol/kg'",
            "x-kind": "unit 'mg/dL' (mass concentration) does not fit LOINC 2951-2",
            "x-comparator": "comparator '<'",
            "x-novalue": "valueQuantity.value is missing",
            "x-string": "no valueQuantity (has valueString)",
            "x-nosubject": "no subject.reference",
            "x-dateonly": "a date without a time of day",
            "x-notime": "no time",
            "x-system": "unit system 'urn:invented:units' is not UCUM",
            "x-glucose-meq": "not converted",
        }
        self.assertEqual(sorted(self.skipped), sorted(want))
        for oid, text in want.items():
            self.assertIn(text, self.skipped[oid].reason, oid)
        # Nothing vanishes: kept + skipped = every Observation of the file.
        with open(BUNDLE, encoding="utf-8") as f:
            doc = json.load(f)
        observations = [e["resource"]["id"] for e in doc["entry"]
                        if e["resource"]["resourceType"] == "Observation"]
        self.assertEqual(sorted(observations),
                         sorted(list(self.results) + list(self.skipped)))
        self.assertTrue(self.skipped["x-error"].where.startswith("entry["))

    def test_units_converted(self):
        r = self.results
        # meq/L equals mmol/L for a monovalent ion (UCUM; IUPAC).
        self.assertEqual((r["a-na-2"].value, r["a-na-2"].sent_unit),
                         (122.0, "mEq/L"))
        self.assertEqual(r["a-na-3"].value, 129.0)  # sent as "mmol/l"
        # Glucose 540 mg/dL: the conventional glucose/18 of Dorwart &
        # Chalmers, Clin Chem 1975, gives 30.0 mmol/L; natremia uses the
        # molar mass 180.156 g/mol (29.97).
        self.assertAlmostEqual(r["a-glu"].value, 540 / 18.0, delta=0.05)
        self.assertEqual((r["a-glu"].sent_value, r["a-glu"].sent_unit),
                         (540.0, "mg/dL"))
        # 88 umol/L is 0.088 mmol/L (the SI prefix micro, 1e-6).
        self.assertAlmostEqual(r["a-crea"].value, 0.088, places=12)
        self.assertEqual(r["a-ucrea"].specimen, "urine")
        self.assertEqual(r["a-na-blood"].specimen, "blood")
        self.assertTrue(all(x.unit == "mmol/L" for x in r.values()))

    def test_time_sources(self):
        r = self.results
        self.assertEqual(r["a-na-1"].time_source, "effectiveDateTime")
        self.assertEqual(r["a-na-3"].time_source, "effectivePeriod.start")
        self.assertEqual(r["a-na-4"].time_source, "issued")
        self.assertEqual(r["a-na-3"].status, "amended")

    def test_sodium_series(self):
        series = self.reading.sodium_series()
        self.assertEqual(sorted(series), [A, B])
        a = series[A]
        # Hand-worked from the timestamps (06:00+01:00 first): 11:00Z is
        # 12:00+01:00 (6 h), 18:00 (12 h), the next day 06:30 (24.5 h).
        self.assertEqual(a.hours, (0.0, 6.0, 12.0, 24.5))
        self.assertEqual(a.na_mmol_l, (118.0, 122.0, 129.0, 130.5))
        self.assertEqual([x.id for x in a.results],
                         ["a-na-1", "a-na-2", "a-na-3", "a-na-4"])
        b = series[B]
        # 08:00-05:00 first; 01:00Z the next day is 20:00-05:00 (12 h).
        self.assertEqual(b.hours, (0.0, 6.0, 12.0))
        self.assertEqual(b.na_mmol_l, (162.0, 158.0, 151.0))
        # Whole-blood sodium only when asked for, in time order (20:00
        # is 14 h after 06:00).
        mixed = self.reading.sodium_series(specimens=("serum_plasma", "blood"))
        self.assertEqual(mixed[A].hours, (0.0, 6.0, 12.0, 14.0, 24.5))
        self.assertEqual(mixed[A].na_mmol_l[3], 127.0)
        # A common origin for all patients.
        origin = fhir.parse_datetime("2026-03-01T00:00:00Z")
        common = self.reading.sodium_series(origin=origin)
        self.assertEqual(common[A].hours[0], 5.0)  # 06:00+01:00 is 05:00Z

    def test_series_ready_for_the_course_assessment(self):
        series = self.reading.sodium_series()
        a, b = series[A], series[B]
        # A low sodium raised: 118 -> 129 in 12 h is a rise of 11, over the
        # 10 mmol/L in 24 h limit (Verbalis et al. 2013; Spasovski et al.
        # 2014).
        ra = natremia.course_assess(hours=a.hours, na_mmol_l=a.na_mmol_l,
                                    limits="hypo_standard")
        self.assertAlmostEqual(ra.max_rise_24h, 11.0, places=9)
        self.assertTrue(ra.flags & natremia.CourseFlag.OVER_24H)
        # A high sodium lowered: 162 -> 151 in 12 h is a fall of 11, over
        # the 10 mmol/L a day for chronic hypernatraemia (Adrogue & Madias,
        # N Engl J Med 2000).
        rb = natremia.course_assess(hours=b.hours, na_mmol_l=b.na_mmol_l,
                                    limits="hyper_chronic")
        self.assertAlmostEqual(rb.max_fall_24h, 11.0, places=9)
        self.assertTrue(rb.flags & natremia.CourseFlag.FALL_OVER_24H)
        # The streaming watcher fed one result at a time agrees.
        watch = natremia.CourseWatch("hyper_chronic")
        for h, na in zip(b.hours, b.na_mmol_l):
            last = watch.push(hours=h, na_mmol_l=na)
        self.assertEqual(last, rb)

    def test_latest_panel_for_the_work_up(self):
        panel = self.reading.latest(A)
        self.assertEqual(panel["sodium"].id, "a-na-4")
        self.assertEqual(set(panel), {"sodium", "glucose", "urea_nitrogen",
                                      "creatinine", "potassium"})
        at = fhir.parse_datetime("2026-03-01T06:00:00+01:00")
        first = self.reading.latest(A, at=at)
        self.assertEqual(first["sodium"].id, "a-na-1")
        # 2 Na + glucose + urea with glucose 540 mg/dL (Dorwart & Chalmers
        # 1975 conventional form, 2*Na + glucose/18 + BUN/2.8 in mg/dL):
        # 2 * 118 + 30.0 + 5.0 = 271.0 (natremia's 180.156 g/mol: 270.97).
        osm = natremia.osm_calculated(
            na_mmol_l=first["sodium"].value,
            glucose_mmol_l=first["glucose"].value,
            urea_mmol_l=first["urea_nitrogen"].value)
        self.assertAlmostEqual(osm, 271.0, delta=0.05)
        self.assertEqual(self.reading.latest(A, specimen="urine")["creatinine"].id,
                         "a-ucrea")

    def test_rows(self):
        rows = self.reading.rows()
        self.assertEqual(len(rows), len(self.reading.results))
        self.assertEqual(set(rows[0]) >= {"patient", "analyte", "value",
                                          "time"}, True)


class ReadNdjson(unittest.TestCase):
    def test_bulk_export_lines(self):
        reading = fhir.read(NDJSON)
        self.assertEqual(sorted(r.id for r in reading.results),
                         ["b-bun", "b-glu", "b-na-1", "b-na-2", "b-na-3"])
        reasons = {s.where: s.reason for s in reading.skipped}
        self.assertIn("status 'entered-in-error'", reasons["line 1"])
        self.assertIn("not JSON", reasons["line 4"])  # line 3 is blank
        self.assertEqual(len(reading.skipped), 2)
        self.assertEqual(reading.sodium_series()[B].hours, (0.0, 6.0, 12.0))

    def test_text_and_iterables(self):
        with open(NDJSON, encoding="utf-8") as f:
            text = f.read()
        a = fhir.read_ndjson(text)
        with open(NDJSON, encoding="utf-8") as f:
            b = fhir.read_ndjson(f)
        self.assertEqual(a.results, b.results)
        self.assertEqual(a.skipped, b.skipped)


class Structure(unittest.TestCase):
    def obs(self, **over):
        o = {"resourceType": "Observation", "id": "o", "status": "final",
             "code": {"coding": [{"system": "urn:invented:lab", "code": "N"},
                                 {"system": fhir.LOINC_SYSTEM, "code": "2951-2"}]},
             "subject": {"reference": "Patient/p"},
             "effectiveDateTime": "2026-01-01T00:00:00Z",
             "valueQuantity": {"value": 140, "code": "mmol/L",
                               "system": fhir.UCUM_SYSTEM}}
        o.update(over)
        return o

    def test_nested_bundle_and_second_coding(self):
        inner = {"resourceType": "Bundle", "type": "collection",
                 "entry": [{"resource": self.obs()}]}
        outer = {"resourceType": "Bundle", "type": "searchset",
                 "entry": [{"resource": inner}, {"fullUrl": "x"}]}
        reading = fhir.read_bundle(json.dumps(outer))
        self.assertEqual([r.where for r in reading.results], ["entry[0].entry[0]"])
        self.assertEqual(reading.results[0].loinc, "2951-2")
        self.assertEqual([s.reason for s in reading.skipped],
                         ["entry without a resource"])

    def test_time_from_the_diagnostic_report(self):
        # An invented report listing three Observations without an
        # effective time of their own (as laboratory report Bundles often
        # send them): the report's effectiveDateTime comes after the
        # Observation's own effective[x] and before its issued.
        def bare(oid, **over):
            o = {k: v for k, v in self.obs(id=oid).items()
                 if k != "effectiveDateTime"}
            o.update(over)
            return o
        report = {"resourceType": "DiagnosticReport", "id": "r",
                  "status": "final",
                  "effectiveDateTime": "2026-01-02T03:00:00Z",
                  "result": [{"reference": "Observation/o1"},
                             {"reference": "urn:invented:o2"},
                             {"reference": "Observation/o3"},
                             {"reference": "https://invented.example/fhir/Observation/o4/_history/2"}]}
        bundle = {"resourceType": "Bundle", "type": "collection", "entry": [
            {"fullUrl": "https://invented.example/fhir/DiagnosticReport/r",
             "resource": report},
            {"fullUrl": "https://invented.example/fhir/Observation/o1",
             "resource": bare("o1", issued="2026-01-02T09:00:00Z")},
            {"fullUrl": "urn:invented:o2", "resource": bare("o2")},
            {"resource": bare("o3", effectiveDateTime="2026-01-02T01:00:00Z")},
            {"resource": bare("o4")},
            {"resource": bare("o5", issued="2026-01-02T09:00:00Z")},
            {"resource": bare("o6")},
        ]}
        reading = fhir.read_bundle(bundle)
        got = {r.id: (r.time.hour, r.time_source) for r in reading.results}
        self.assertEqual(got, {
            "o1": (3, "DiagnosticReport.effectiveDateTime"),
            "o2": (3, "DiagnosticReport.effectiveDateTime"),
            "o3": (1, "effectiveDateTime"),
            "o4": (3, "DiagnosticReport.effectiveDateTime"),
            "o5": (9, "issued")})
        self.assertEqual([(s.id, s.reason[:7]) for s in reading.skipped],
                         [("o6", "no time")])
        self.assertEqual(reading.other_resources, {"DiagnosticReport": 1})

    def test_unit_without_system(self):
        obs = self.obs(valueQuantity={"value": 140, "unit": "mEq/L"})
        reading = fhir.read_bundle({"resourceType": "Bundle",
                                    "entry": [{"resource": obs}]})
        self.assertEqual(reading.results[0].value, 140.0)

    def test_no_status_and_bool_value(self):
        reading = fhir.read_ndjson([
            json.dumps({k: v for k, v in self.obs().items() if k != "status"}),
            json.dumps(self.obs(valueQuantity={"value": True, "code": "mmol/L",
                                               "system": fhir.UCUM_SYSTEM})),
            json.dumps(self.obs(status="preliminary")),
        ])
        self.assertEqual([s.reason for s in reading.skipped][0], "no status")
        self.assertIn("not a number", reading.skipped[1].reason)
        self.assertEqual(reading.results[0].status, "preliminary")

    def test_not_a_bundle(self):
        with self.assertRaises(ValueError):
            fhir.read_bundle({"resourceType": "Observation"})


if __name__ == "__main__":
    unittest.main()
