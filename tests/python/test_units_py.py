# SPDX-License-Identifier: MIT
"""Python binding: units as laboratory feeds send them (issue 13).

Sources beside each check:
- UCUM (Regenstrief): the codes and their case-insensitive forms; the HL7
  FHIR R4 example Observation-f001.json (hl7.fhir.r4.examples 4.0.1) sends
  "mmol/l" as a display unit; other lab spellings are common practice.
- LOINC codes: the HL7 FHIR R4 examples, Bundle
  72ac8493-52ac-41bd-8d5d-7258c289b5ea (14933-6 Urate [Moles/volume] in
  Serum or Plasma, 2823-3 Potassium) and the project's checked-sources
  table (2345-7 Glucose [Mass/volume] in Serum or Plasma, 2161-8
  Creatinine [Mass/volume] in Urine).
- Dorwart WV, Chalmers L. Clin Chem 1975;21:190-4: the floor
  1.86*Na + glucose + 9 the glucose check uses.
- Spasovski G et al. Eur J Endocrinol 2014;170:G1-G47: uric acid 0.24 mmol/L
  is given as 4 mg/dL.
- IUPAC molar mass of glucose, 180.156 g/mol (90 mg/dL = 4.996 mmol/L).
"""

import unittest

import numpy as np
from hypothesis import given, settings
from hypothesis import strategies as st

import natremia as ntr


class LenientParse(unittest.TestCase):
    def test_lab_spellings(self):
        cases = {"mEq/L": ntr.Unit.MEQ_L, "mmol/l": ntr.Unit.MMOL_L,
                 "MMOL/L": ntr.Unit.MMOL_L, "mg/dl": ntr.Unit.MG_DL,
                 "mOsm/kg": ntr.Unit.MOSM_KG, "mosm/kg H2O": ntr.Unit.MOSM_KG,
                 "mOsm/kg{H2O}": ntr.Unit.MOSM_KG, "\u00b5mol/L": ntr.Unit.UMOL_L,
                 "\u03bcmol/L": ntr.Unit.UMOL_L, "g/l": ntr.Unit.G_L,
                 "  mg/dL ": ntr.Unit.MG_DL}
        for text, unit in cases.items():
            self.assertIs(ntr.unit_parse_lenient(text), unit, text)
        # bytes in UTF-8 are read the same way
        self.assertIs(ntr.unit_parse_lenient("\u00b5mol/L".encode("utf-8")),
                      ntr.Unit.UMOL_L)

    def test_refusals_name_the_text(self):
        # mOsm/L is an osmolarity; Mmol/L a megamole in case-sensitive UCUM.
        for text in ("mOsm/L", "Mmol/L", "mmol/kg", "mg%", "\u00b5", "x" * 40,
                     "mmol/L\0", ""):
            with self.assertRaises(ntr.NatremiaError) as cm:
                ntr.unit_parse_lenient(text)
            self.assertEqual(cm.exception.status, ntr.ERR_UNIT)
            self.assertEqual(cm.exception.argument, "text")
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.unit_parse_lenient(4)
        self.assertEqual(cm.exception.argument, "text")

    def test_strict_parser_unchanged(self):
        with self.assertRaises(ntr.NatremiaError):
            ntr.unit_parse("mEq/L")


class Loinc(unittest.TestCase):
    def test_checked_codes(self):
        info = ntr.loinc_lookup("14933-6")  # FHIR R4 Bundle: Urate [Moles/volume]
        self.assertEqual(info, (ntr.ANALYTE_URIC_ACID, "uric_acid",
                                ntr.Specimen.SERUM_PLASMA, ntr.Unit.MMOL_L))
        info = ntr.loinc_lookup("2823-3")  # FHIR R4 Bundle: Potassium [Moles/volume]
        self.assertEqual((info.analyte, info.unit),
                         (int(ntr.Analyte.POTASSIUM), ntr.Unit.MMOL_L))
        info = ntr.loinc_lookup("2345-7")  # checked table: Glucose [Mass/volume]
        self.assertEqual((info.analyte_name, info.unit), ("glucose", ntr.Unit.MG_DL))
        info = ntr.loinc_lookup("2161-8")  # checked table: Creatinine in Urine
        self.assertIs(info.specimen, ntr.Specimen.URINE)

    def test_unknown(self):
        for code in ("2951-3", " 2951-2", "LOINC:2951-2", ""):
            with self.assertRaises(ntr.NatremiaError) as cm:
                ntr.loinc_lookup(code)
            self.assertEqual(cm.exception.status, ntr.ERR_UNIT)
            self.assertEqual(cm.exception.argument, "code")


class GlucoseUnitCheck(unittest.TestCase):
    def test_mg_dl_passed_as_mmol_l_first(self):
        # Dorwart-Chalmers floor 1.86*135 + 150 + 9 = 410.1 > 290 + 20.
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.glucose_unit_check(150.0, unit="mmol/L", na_mmol_l=135.0,
                                   measured_osm_mosm_kg=290.0)
        self.assertEqual(cm.exception.status, ntr.ERR_UNIT)
        got = ntr.glucose_unit_check(150.0, unit="mg/dl", na_mmol_l=135.0,
                                     measured_osm_mosm_kg=290.0)
        self.assertAlmostEqual(got, 150.0 / 18.0156, places=3)

    def test_without_osmolality_both_readings_pass(self):
        # docs/units.md: without an osmolality 150 "mmol/L" cannot be refused.
        self.assertEqual(ntr.glucose_unit_check(150.0, unit=ntr.Unit.MMOL_L,
                                                na_mmol_l=135.0), 150.0)

    def test_ranges(self):
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.glucose_unit_check(5.0, unit="mmol/L", na_mmol_l=135.0,
                                   measured_osm_mosm_kg=100.0)
        self.assertEqual(cm.exception.status, ntr.ERR_RANGE)
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.glucose_unit_check(5.0, unit="meq/L", na_mmol_l=135.0)
        self.assertEqual(cm.exception.status, ntr.ERR_UNIT)


class ConvertArray(unittest.TestCase):
    def test_glucose_column(self):
        # IUPAC molar mass 180.156: 90 mg/dL = 4.996 mmol/L, 180 = 9.991.
        got = ntr.convert_array("glucose", [[90.0, 180.0]], "mg/dl", "MMOL/L")
        self.assertEqual(got.shape, (1, 2))
        np.testing.assert_allclose(got, [[90 / 18.0156, 180 / 18.0156]], rtol=1e-12)

    def test_new_analytes(self):
        # Spasovski 2014: 4 mg/dL of uric acid is 0.24 mmol/L (rounded).
        got = ntr.convert_array("uric_acid", [4.0], ntr.Unit.MG_DL, ntr.Unit.MMOL_L)
        self.assertAlmostEqual(float(got[0]), 0.24, delta=0.005)
        same = ntr.convert_array(ntr.ANALYTE_OSMOLALITY, [287.5, 301.0],
                                 "mOsm/kg", "mosm/kg H2O")
        np.testing.assert_array_equal(same, [287.5, 301.0])
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.convert_array("osmolality", [290.0], "mosm/kg", "mmol/L")
        self.assertEqual(cm.exception.argument, "to_unit")
        # The scalar convert takes the new ids too.
        self.assertEqual(ntr.convert(290.0, analyte=ntr.ANALYTE_OSMOLALITY,
                                     from_unit="mosm/kg", to_unit="mosm/kg"), 290.0)

    def test_errors(self):
        values = [5.0, -1.0, float("nan"), 7.0]
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.convert_array("glucose", values, "mmol/L", "mg/dL")
        self.assertEqual((cm.exception.row, cm.exception.failed), (1, 2))
        got, status = ntr.convert_array("glucose", values, "mmol/L", "mg/dL",
                                        errors="nan", with_status=True)
        self.assertTrue(np.isnan(got[1]) and np.isnan(got[2]))
        self.assertEqual(list(status), [ntr.OK, ntr.ERR_RANGE, ntr.ERR_NONFINITE, ntr.OK])
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.convert_array("glucose", [1.0], "meq/L", "mmol/L")
        self.assertEqual(cm.exception.argument, "from_unit")
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.convert_array(11, [1.0], "mmol/L", "mmol/L")
        self.assertEqual(cm.exception.status, ntr.ERR_ARG)
        with self.assertRaises(ntr.NatremiaError):
            ntr.convert_array(4.9, [1.0], "mmol/L", "mmol/L")  # not an exact code

    @settings(max_examples=60, deadline=None)
    @given(st.lists(st.floats(min_value=0.0, max_value=1.0e6), min_size=1, max_size=20),
           st.sampled_from([1, 4, 7, 10]))
    def test_equals_scalar_convert(self, values, analyte):
        # Property: each element equals the scalar C conversion bit for bit.
        got = ntr.convert_array(analyte, values, ntr.Unit.MG_DL, ntr.Unit.UMOL_L)
        for v, g in zip(values, got):
            self.assertEqual(g, ntr.convert(v, analyte=analyte, from_unit="mg/dL",
                                            to_unit="umol/L"))


if __name__ == "__main__":
    unittest.main()
