# SPDX-License-Identifier: MIT
"""Tests of the Python binding (bindings/python): published values, errors,
constants in step with the C header, and hypothesis properties (unit
invariance, monotonicity, round trips, arrays equal to scalars).

Run through tests/python/run.py, which finds the fresh build through
NATREMIA_LIBRARY and the package through PYTHONPATH.
"""

import math
import os
import re
import struct
import unittest

import numpy as np
from hypothesis import assume, given, settings, HealthCheck
from hypothesis import strategies as st

import natremia as ntr
from natremia import arrays

# Deterministic and leaving no example database in the tree.
settings.register_profile("natremia", derandomize=True, database=None,
                          deadline=None, max_examples=150,
                          suppress_health_check=[HealthCheck.too_slow])
settings.load_profile("natremia")

HEADER = os.environ.get("NATREMIA_HEADER") or os.path.join(
    os.path.dirname(__file__), "..", "..", "include", "natremia.h")


def in_range(lo, hi):
    return st.floats(min_value=lo, max_value=hi, allow_nan=False,
                     allow_infinity=False)


def anything_near(lo, hi):
    """Values inside, outside and at the edges of [lo, hi], and non-finite
    ones: for properties that must hold for valid and invalid rows alike."""
    width = hi - lo
    return st.one_of(in_range(lo, hi), st.sampled_from([lo, hi]),
                     in_range(lo - width, lo), in_range(hi, hi + width),
                     st.sampled_from([math.nan, math.inf, -math.inf]))


def same_bits(a, b):
    return struct.pack("<d", a) == struct.pack("<d", b)


class PublishedValues(unittest.TestCase):
    def test_osmolality(self):
        # Source: Dorwart & Chalmers, Clin Chem 1975 (1.86*Na + glucose +
        # urea + 9) and the conventional 2*Na formula.
        self.assertEqual(ntr.osm_calculated(na_mmol_l=140, glucose_mmol_l=5,
                                            urea_mmol_l=5), 290.0)
        self.assertAlmostEqual(ntr.osm_calculated(
            na_mmol_l=140, glucose_mmol_l=5, urea_mmol_l=5,
            formula="dorwart_chalmers"), 279.4, places=9)

    def test_glucose_correction(self):
        # Source: Katz, N Engl J Med 1973 (1.6 per 100 mg/dL over 100) and
        # Hillier et al., Am J Med 1999 (2.4): Na 125 at glucose 600 mg/dL.
        glucose = ntr.convert(600, analyte="glucose", from_unit="mg/dL",
                              to_unit="mmol/L")
        self.assertAlmostEqual(ntr.na_corrected_glucose(
            na_mmol_l=125, glucose_mmol_l=glucose, method="katz"), 133.0, places=9)
        self.assertAlmostEqual(ntr.na_corrected_glucose(
            na_mmol_l=125, glucose_mmol_l=glucose, method="hillier"), 137.0,
            places=9)

    def test_hypernatraemia_example(self):
        # Source: Adrogue & Madias, N Engl J Med 2000;342:1493-9, worked
        # example (from memory): man of 78, 68 kg, Na 165; 1 L of 5%
        # dextrose changes Na by (0 - 165)/(34 + 1) = -4.7 mmol/L.
        tbw = ntr.tbw_fraction(sex="male", age_years=78, weight_kg=68)
        self.assertEqual(tbw, 34.0)
        d5 = ntr.fluid_preset("dextrose_5")
        delta = ntr.infusate_change_per_litre(
            na_mmol_l=165, tbw_l=tbw, infusate_na_mmol_l=d5.na_mmol_l,
            infusate_k_mmol_l=d5.k_mmol_l)
        self.assertAlmostEqual(delta, -4.7, delta=0.05)

    def test_watson(self):
        # Source: Watson, Watson & Batt, Am J Clin Nutr 1980 (men):
        # 2.447 - 0.09516*40 + 0.1074*180 + 0.3362*80 = 44.8686 L.
        self.assertAlmostEqual(ntr.tbw_watson(sex="male", age_years=40,
                                              height_cm=180, weight_kg=80),
                               44.8686, places=9)

    def test_furst_and_efwc(self):
        # Source: Furst et al., Am J Med Sci 2000 (ratio and its table);
        # EFWC from Rose & Post, 5th ed.: U_Na 60, U_K 20, S_Na 120, 2 L.
        ratio = ntr.furst_ratio(urine_na_mmol_l=60, urine_k_mmol_l=20,
                                serum_na_mmol_l=120)
        self.assertAlmostEqual(ratio, 2 / 3, places=15)
        self.assertIs(ntr.restriction_from_ratio(ratio),
                      ntr.Restriction.UNDER_1000_ML)
        self.assertIs(ntr.restriction_from_ratio(1.2), ntr.Restriction.UNDER_500_ML)
        self.assertAlmostEqual(ntr.efwc(urine_volume_l=2, urine_na_mmol_l=60,
                                        urine_k_mmol_l=20, serum_na_mmol_l=120),
                               2 / 3, places=15)

    def test_workup(self):
        # Source: Spasovski et al., Eur J Endocrinol 2014 (severity bands;
        # measured osmolality below 275 is hypotonic).
        self.assertIs(ntr.na_severity(na_mmol_l=124), ntr.Severity.PROFOUND)
        self.assertIs(ntr.na_severity(na_mmol_l=127), ntr.Severity.MODERATE)
        self.assertIs(ntr.na_severity(na_mmol_l=132), ntr.Severity.MILD)
        self.assertIs(ntr.tonicity_class(measured_osm_mosm_kg=260),
                      ntr.Tonicity.HYPOTONIC)
        low = ntr.low_na_tonicity(na_mmol_l=125, glucose_mmol_l=5,
                                  measured_osm_mosm_kg=260)
        self.assertIs(low.tonicity, ntr.Tonicity.HYPOTONIC)
        # Source: standard fractional-excretion formula, hand-worked.
        self.assertAlmostEqual(ntr.fractional_excretion(
            urine_x=40, plasma_x=130, urine_creatinine=8000,
            plasma_creatinine=80), 40 * 80 / (130 * 8000) * 100, places=12)

    def test_three_percent_saline_example(self):
        # Hand-worked exact inverse of the mass balance on the inputs of the
        # Furst et al. (Am J Med Sci 2000) example: Na 108, TBW 30 L, 3%
        # saline (513 mmol/L); a rise of 4 needs 4*30/(513 - 108 - 4) =
        # 120/401 = 0.299 L. (The paper itself dosed a rise of 5 by the
        # sodium-deficit step, 292 mL, which reaches only about 112.)
        volume = ntr.infusate_volume_for_change(
            na_mmol_l=108, tbw_l=30, infusate_na_mmol_l=513,
            target_delta_mmol_l=4)
        self.assertAlmostEqual(volume, 0.3, delta=0.01)


class Errors(unittest.TestCase):
    def test_error_carries_status_name_and_message(self):
        with self.assertRaises(ntr.NatremiaError) as caught:
            ntr.osm_effective(na_mmol_l=300, glucose_mmol_l=5)
        err = caught.exception
        self.assertEqual(err.status, ntr.ERR_RANGE)
        self.assertEqual(err.status_name, "NTR_ERR_RANGE")
        self.assertEqual(err.message, ntr.status_message(ntr.ERR_RANGE))
        self.assertEqual(err.function, "osm_effective")
        self.assertIn("NTR_ERR_RANGE", str(err))
        self.assertIsInstance(err, ValueError)

    def test_nonfinite_domain_and_unknown_names(self):
        with self.assertRaises(ntr.NatremiaError) as caught:
            ntr.osm_effective(na_mmol_l=math.nan, glucose_mmol_l=5)
        self.assertEqual(caught.exception.status_name, "NTR_ERR_NONFINITE")
        with self.assertRaises(ntr.NatremiaError) as caught:
            ntr.free_water_deficit(tbw_l=40, na_mmol_l=130)
        self.assertEqual(caught.exception.status_name, "NTR_ERR_DOMAIN")
        with self.assertRaises(ntr.NatremiaError) as caught:
            ntr.osm_calculated(na_mmol_l=140, glucose_mmol_l=5, urea_mmol_l=5,
                               formula="three_na")
        self.assertEqual(caught.exception.status_name, "NTR_ERR_ARG")
        with self.assertRaises(ntr.NatremiaError) as caught:
            ntr.tbw_fraction(sex=7, age_years=40, weight_kg=70)
        self.assertEqual(caught.exception.status_name, "NTR_ERR_ARG")
        with self.assertRaises(ntr.NatremiaError) as caught:
            ntr.unit_parse("MMOL/L")
        self.assertEqual(caught.exception.status_name, "NTR_ERR_UNIT")

    def test_keywords_are_required(self):
        with self.assertRaises(TypeError):
            ntr.osm_effective(140, 5)  # pylint: disable=too-many-function-args

    def test_array_errors(self):
        with self.assertRaises(ntr.NatremiaError) as caught:
            arrays.osm_effective(na_mmol_l=[140, 300, math.nan], glucose_mmol_l=5)
        self.assertEqual(caught.exception.row, 1)
        self.assertEqual(caught.exception.failed, 2)
        self.assertEqual(caught.exception.status_name, "NTR_ERR_RANGE")
        values, status = arrays.osm_effective(
            na_mmol_l=[140, 300, math.nan], glucose_mmol_l=5, errors="nan",
            with_status=True)
        self.assertEqual(values[0], 285.0)
        self.assertTrue(np.isnan(values[1:]).all())
        self.assertEqual(status.tolist(), [0, ntr.ERR_RANGE, ntr.ERR_NONFINITE])
        with self.assertRaises(ntr.NatremiaError) as caught:
            arrays.na_corrected_glucose(na_mmol_l=[140], glucose_mmol_l=[5],
                                        method=9)
        self.assertEqual(caught.exception.status_name, "NTR_ERR_ARG")
        with self.assertRaises(ValueError):
            arrays.osm_effective(na_mmol_l=[140], glucose_mmol_l=5, errors="x")

    def test_broadcasting_and_shape(self):
        out = arrays.osm_calculated(na_mmol_l=[[140.0], [130.0]],
                                    glucose_mmol_l=[5.0, 10.0], urea_mmol_l=5)
        self.assertEqual(out.shape, (2, 2))
        self.assertEqual(out.tolist(), [[290.0, 295.0], [270.0, 275.0]])
        empty = arrays.osm_effective(na_mmol_l=[], glucose_mmol_l=[])
        self.assertEqual(empty.shape, (0,))

    def test_scalar_inputs_over_many_rows(self):
        """A scalar (or a default such as ethanol 0) over more rows than one
        block (arrays._BLOCK) is handed to the library block by block: the
        values, statuses, failed count and first failing row must be those
        of the same value spread over a full column, including failures in
        later blocks and a last, partial block."""
        n = 3 * arrays._BLOCK + 5
        rng = np.random.default_rng(7)
        na = rng.uniform(110.0, 160.0, n)
        glucose = rng.uniform(3.0, 40.0, n)
        na[[arrays._BLOCK + 1, 2 * arrays._BLOCK, n - 1]] = [np.nan, 300.0, 70.0]
        for ethanol in (0.0, 15.0, 500.0, np.nan):
            got = arrays.osm_calculated(na_mmol_l=na, glucose_mmol_l=glucose,
                                        urea_mmol_l=5.0, ethanol_mmol_l=ethanol,
                                        errors="nan", with_status=True)
            want = arrays.osm_calculated(na_mmol_l=na, glucose_mmol_l=glucose,
                                         urea_mmol_l=np.full(n, 5.0),
                                         ethanol_mmol_l=np.full(n, ethanol),
                                         errors="nan", with_status=True)
            np.testing.assert_array_equal(got[1], want[1])
            np.testing.assert_array_equal(got[0], want[0])
        default = arrays.osm_calculated(na_mmol_l=na, glucose_mmol_l=glucose,
                                        urea_mmol_l=5.0, errors="nan")
        # 2 Na + glucose + urea + ethanol 0 (lib/osmolality.c, 2*Na formula)
        ok = np.isfinite(default)
        np.testing.assert_array_equal(default[ok], 2.0 * na[ok] + glucose[ok] + 5.0)
        self.assertEqual(int(np.count_nonzero(~ok)), 3)
        with self.assertRaises(ntr.NatremiaError) as caught:
            arrays.osm_calculated(na_mmol_l=na, glucose_mmol_l=glucose,
                                  urea_mmol_l=5.0)
        self.assertEqual(caught.exception.row, arrays._BLOCK + 1)
        self.assertEqual(caught.exception.failed, 3)
        with self.assertRaises(ntr.NatremiaError) as caught:
            arrays.osm_calculated(na_mmol_l=140.0, glucose_mmol_l=glucose,
                                  urea_mmol_l=5.0, ethanol_mmol_l=-1.0)
        self.assertEqual((caught.exception.row, caught.exception.failed), (0, n))
        self.assertEqual(caught.exception.argument, "ethanol_mmol_l")
        # Sex as one name for every row, against the codes spread out.
        age = rng.uniform(1.0, 95.0, n)
        weight = rng.uniform(10.0, 120.0, n)
        for sex in ("female", 1, 9):
            got = arrays.tbw_fraction(sex=sex, age_years=age, weight_kg=weight,
                                      errors="nan", with_status=True)
            code = {"female": 2}.get(sex, sex)
            want = arrays.tbw_fraction(sex=np.full(n, code, dtype=np.int64),
                                       age_years=age, weight_kg=weight,
                                       errors="nan", with_status=True)
            np.testing.assert_array_equal(got[1], want[1])
            np.testing.assert_array_equal(got[0], want[0])
        with self.assertRaises(ntr.NatremiaError) as caught:
            arrays.tbw_fraction(sex=9, age_years=age, weight_kg=weight)
        self.assertEqual((caught.exception.argument, caught.exception.failed),
                         ("sex", n))

    def test_integer_codes_beyond_c_int(self):
        """Codes are range-checked without a widened copy; still refused."""
        for dtype in (np.int64, np.uint32, np.uint64):
            sex = np.array([1, 2, 2 ** 31 + 5], dtype=dtype)
            with self.assertRaises(ntr.NatremiaError) as caught:
                arrays.tbw_fraction(sex=sex, age_years=40.0, weight_kg=70.0)
            self.assertEqual(caught.exception.value, 2 ** 31 + 5)
        low = np.array([1, -2 ** 31 - 1], dtype=np.int64)
        with self.assertRaises(ntr.NatremiaError):
            arrays.tbw_fraction(sex=low, age_years=40.0, weight_kg=70.0)
        codes = np.array([1, 2], dtype=np.int32)
        out = arrays.tbw_fraction(sex=codes, age_years=40.0, weight_kg=70.0)
        self.assertEqual(out.tolist(), [42.0, 35.0])  # 0.6 and 0.5 of 70 kg


class ConstantsMatchHeader(unittest.TestCase):
    """The Python enumerations repeat C values; read them from the header."""

    @classmethod
    def setUpClass(cls):
        with open(HEADER, encoding="utf-8") as f:
            text = f.read()
        cls.defines = {m.group(1): int(m.group(2), 0) for m in re.finditer(
            r"#define\s+(NTR_\w+)\s+(0x[0-9A-Fa-f]+|\d+)u?l?\b", text)}

    def check(self, enum_cls, prefix):
        for member in enum_cls:
            if member.name == "NONE":
                continue
            name = prefix + member.name
            self.assertIn(name, self.defines, name)
            self.assertEqual(int(member), self.defines[name], name)

    def test_enumerations(self):
        self.check(ntr.Unit, "NTR_UNIT_")
        self.check(ntr.Analyte, "NTR_ANALYTE_")
        self.check(ntr.GlucoseMethod, "NTR_GLUCOSE_")
        self.check(ntr.Sex, "NTR_SEX_")
        self.check(ntr.Fluid, "NTR_FLUID_")
        self.check(ntr.LimitsPreset, "NTR_LIMITS_")
        self.check(ntr.CorrectionFlag, "NTR_CF_")
        self.check(ntr.OdsFactor, "NTR_ODS_")
        self.check(ntr.Severity, "NTR_SEVERITY_")
        self.check(ntr.Tonicity, "NTR_TONICITY_")
        self.check(ntr.LowNaFlag, "NTR_LOW_NA_")
        self.check(ntr.Goal, "NTR_GOAL_")
        self.check(ntr.CoursePreset, "NTR_COURSE_")
        self.check(ntr.CourseFlag, "NTR_CF_")
        self.check(ntr.BreachDirection, "NTR_PLAN_BREACH_")
        self.assertEqual(self.defines["NTR_PLAN_BREACH_NONE"],
                         ntr.BreachDirection.NONE)
        self.assertEqual(self.defines["NTR_SEVERITY_NONE"], ntr.Severity.NONE)
        self.assertEqual(self.defines["NTR_OSM_2NA"], ntr.OsmFormula.TWO_NA)
        self.assertEqual(self.defines["NTR_OSM_DORWART_CHALMERS"],
                         ntr.OsmFormula.DORWART_CHALMERS)
        self.assertEqual(self.defines["NTR_RESTRICT_1000ML"],
                         ntr.Restriction.UNDER_1000_ML)
        self.assertEqual(self.defines["NTR_RESTRICT_500_700ML"],
                         ntr.Restriction.FROM_500_TO_700_ML)
        self.assertEqual(self.defines["NTR_RESTRICT_500ML"],
                         ntr.Restriction.UNDER_500_ML)
        self.assertEqual(self.defines["NTR_WATCH_CAPACITY"],
                         ntr._core.WATCH_CAPACITY)
        self.assertEqual(self.defines["NTR_COURSE_WATCH_CAPACITY"],
                         ntr._course.COURSE_WATCH_CAPACITY)
        all_flags = 0
        for flag in ntr.CorrectionFlag:
            all_flags |= int(flag)
        self.assertEqual(all_flags, self.defines["NTR_CF_ALL"])
        course_flags = 0
        for flag in ntr.CourseFlag:
            course_flags |= int(flag)
        self.assertEqual(course_flags, self.defines["NTR_CF_COURSE_ALL"])
        with open(HEADER, encoding="utf-8") as f:
            no_time = re.search(r"#define\s+NTR_COURSE_NO_TIME\s+\(([^)]+)\)",
                                f.read())
        self.assertIsNotNone(no_time)
        self.assertEqual(float(no_time.group(1)), ntr._course.COURSE_NO_TIME)

    def test_status_codes(self):
        for code, name in ntr.STATUS_NAMES.items():
            self.assertEqual(self.defines[name], code)
            self.assertEqual(ntr.status_name(code), name)

    def test_struct_sizes(self):
        # Sizes the header states or that follow from its layouts.
        self.assertEqual(ntr._core.ctypes.sizeof(ntr._core.CorrectionStruct), 48)
        self.assertEqual(ntr._core.ctypes.sizeof(ntr._core.WatchStruct), 2200)
        self.assertEqual(arrays.CORRECTION_DTYPE.itemsize, 48)
        # ntr_course_limits: size_t, int (+ padding), 5 doubles; the
        # report: size_t, 5 doubles, 2 unsigned ints, 7 doubles (LP64).
        if ntr._core.ctypes.sizeof(ntr._core.c_size_t) == 8:
            self.assertEqual(ntr._core.ctypes.sizeof(ntr._course.CourseLimitsStruct), 56)
            self.assertEqual(ntr._core.ctypes.sizeof(ntr._course.CourseReportStruct), 112)
        if ntr._core.ctypes.sizeof(ntr._core.c_size_t) == 8:
            # The header states 4072 bytes on common 64-bit targets.
            self.assertEqual(ntr._core.ctypes.sizeof(ntr._course.CourseWatchStruct), 4072)
        self.assertEqual(arrays.COURSE_REPORT_DTYPE.itemsize,
                         ntr._core.ctypes.sizeof(ntr._course.CourseReportStruct))


class Properties(unittest.TestCase):
    @given(na=in_range(80, 220), glucose_mg_dl=in_range(0, 3600))
    def test_unit_invariance_of_glucose(self, na, glucose_mg_dl):
        # The same glucose given in mg/dL, g/L or umol/L (converted by the
        # library) corrects sodium alike.
        via_mg = ntr.convert(glucose_mg_dl, analyte="glucose", from_unit="mg/dL",
                             to_unit="mmol/L")
        via_g = ntr.convert(glucose_mg_dl / 100.0, analyte="glucose",
                            from_unit="g/L", to_unit="mmol/L")
        via_umol = ntr.convert(via_mg * 1000.0, analyte="glucose",
                               from_unit="umol/L", to_unit="mmol/L")
        assume(via_mg <= 200 and via_g <= 200 and via_umol <= 200)
        a = ntr.na_corrected_glucose(na_mmol_l=na, glucose_mmol_l=via_mg)
        b = ntr.na_corrected_glucose(na_mmol_l=na, glucose_mmol_l=via_g)
        c = ntr.na_corrected_glucose(na_mmol_l=na, glucose_mmol_l=via_umol)
        self.assertAlmostEqual(a, b, delta=1e-9 * a)
        self.assertAlmostEqual(a, c, delta=1e-9 * a)

    @given(na=in_range(80, 220), bun_mg_dl=in_range(0, 500))
    def test_unit_invariance_of_urea(self, na, bun_mg_dl):
        # Urea given as BUN in mg/dL equals the same urea in mmol/L: the
        # conventional BUN/2.8 divisor (Source: Dorwart & Chalmers 1975,
        # mg/dL form) agrees within the 0.05% its rounding allows.
        urea = ntr.convert(bun_mg_dl, analyte="urea_nitrogen", from_unit="mg/dL",
                           to_unit="mmol/L")
        assume(urea <= 200)
        osm = ntr.osm_calculated(na_mmol_l=na, glucose_mmol_l=5, urea_mmol_l=urea)
        conventional = 2 * na + 5 + bun_mg_dl / 2.8
        self.assertAlmostEqual(osm, conventional, delta=1e-3 * bun_mg_dl / 2.8 + 1e-9)

    @given(na=in_range(80, 219), glucose=in_range(0, 199), urea=in_range(0, 199),
           step=in_range(0.01, 1))
    def test_osmolality_monotonic(self, na, glucose, urea, step):
        base = ntr.osm_calculated(na_mmol_l=na, glucose_mmol_l=glucose,
                                  urea_mmol_l=urea)
        self.assertGreater(ntr.osm_calculated(na_mmol_l=na + step,
                                              glucose_mmol_l=glucose,
                                              urea_mmol_l=urea), base)
        self.assertGreater(ntr.osm_calculated(na_mmol_l=na,
                                              glucose_mmol_l=glucose + step,
                                              urea_mmol_l=urea), base)

    @given(na=in_range(80, 220), g1=in_range(0, 200), g2=in_range(0, 200))
    def test_corrected_sodium_monotonic_in_glucose(self, na, g1, g2):
        lo, hi = min(g1, g2), max(g1, g2)
        for method in ("katz", "hillier"):
            self.assertLessEqual(
                ntr.na_corrected_glucose(na_mmol_l=na, glucose_mmol_l=lo,
                                         method=method),
                ntr.na_corrected_glucose(na_mmol_l=na, glucose_mmol_l=hi,
                                         method=method))

    @given(na=in_range(100, 160), tbw=in_range(5, 80),
           infusate=st.sampled_from(list(ntr.Fluid)), v1=in_range(0, 20),
           v2=in_range(0, 20))
    def test_infusate_change_monotonic_in_volume(self, na, tbw, infusate, v1, v2):
        fluid = ntr.fluid_preset(infusate)
        lo, hi = min(v1, v2), max(v1, v2)
        assume(self.accepted_or_outside(na, tbw, fluid.na_mmol_l,
                                        fluid.k_mmol_l, hi))
        d_lo = ntr.infusate_change(na_mmol_l=na, tbw_l=tbw,
                                   infusate_na_mmol_l=fluid.na_mmol_l,
                                   infusate_k_mmol_l=fluid.k_mmol_l, volume_l=lo)
        d_hi = ntr.infusate_change(na_mmol_l=na, tbw_l=tbw,
                                   infusate_na_mmol_l=fluid.na_mmol_l,
                                   infusate_k_mmol_l=fluid.k_mmol_l, volume_l=hi)
        if fluid.na_mmol_l + fluid.k_mmol_l > na:
            self.assertLessEqual(d_lo, d_hi)
        else:
            self.assertGreaterEqual(d_lo, d_hi)

    def accepted_or_outside(self, na, tbw, infusate_na, infusate_k, volume):
        """True when infusate_change answers for this volume. When it
        refuses, the refusal must be NTR_ERR_DOMAIN and the mass balance
        (Na*TBW + (Na_inf + K_inf)*V)/(TBW + V), worked here, must leave
        80 to 220 mmol/L or the body water TBW + V must pass 400 L: the
        rule ntr_balance_predict applies (docs/infusion.md)."""
        try:
            ntr.infusate_change(na_mmol_l=na, tbw_l=tbw,
                                infusate_na_mmol_l=infusate_na,
                                infusate_k_mmol_l=infusate_k, volume_l=volume)
            return True
        except ntr.NatremiaError as err:
            self.assertEqual(err.status_name, "NTR_ERR_DOMAIN")
            after = (na * tbw + (infusate_na + infusate_k) * volume) / (tbw + volume)
            self.assertTrue(after < 80.0 + 1e-9 or after > 220.0 - 1e-9
                            or tbw + volume > 400.0)
            return False

    @given(na=in_range(80, 220), tbw=in_range(1, 400),
           infusate_na=in_range(0, 1100), infusate_k=in_range(0, 40),
           delta=in_range(-50, 50))
    def test_volume_then_change_round_trip(self, na, tbw, infusate_na,
                                           infusate_k, delta):
        try:
            volume = ntr.infusate_volume_for_change(
                na_mmol_l=na, tbw_l=tbw, infusate_na_mmol_l=infusate_na,
                infusate_k_mmol_l=infusate_k, target_delta_mmol_l=delta)
        except ntr.NatremiaError as err:
            self.assertEqual(err.status_name, "NTR_ERR_DOMAIN")
            return
        back = ntr.infusate_change(na_mmol_l=na, tbw_l=tbw,
                                   infusate_na_mmol_l=infusate_na,
                                   infusate_k_mmol_l=infusate_k, volume_l=volume)
        self.assertAlmostEqual(back, delta, delta=1e-9 * max(1.0, abs(delta)))

    @given(na=in_range(80, 220), tbw=in_range(1, 400),
           infusate_na=in_range(0, 1100), volume=in_range(0.001, 19.5))
    def test_change_then_volume_round_trip(self, na, tbw, infusate_na, volume):
        assume(self.accepted_or_outside(na, tbw, infusate_na, 0.0, volume))
        delta = ntr.infusate_change(na_mmol_l=na, tbw_l=tbw,
                                    infusate_na_mmol_l=infusate_na,
                                    volume_l=volume)
        assume(abs(delta) <= 50 and abs(delta) > 1e-6)
        back = ntr.infusate_volume_for_change(
            na_mmol_l=na, tbw_l=tbw, infusate_na_mmol_l=infusate_na,
            target_delta_mmol_l=delta)
        self.assertAlmostEqual(back, volume, delta=1e-7 * max(1.0, volume))

    @given(sex=st.sampled_from(["male", "female"]), age=in_range(18, 130),
           height=in_range(140, 210), w1=in_range(40, 200), w2=in_range(40, 200))
    def test_watson_monotonic_in_weight(self, sex, age, height, w1, w2):
        lo, hi = min(w1, w2), max(w1, w2)
        for w in (lo, hi):
            # Watson, Watson & Batt 1980 (checked against the abstract),
            # worked here: results outside 20% to 80% of the weight are
            # refused (docs/water.md); check that refusal, then skip.
            tbw = (2.447 - 0.09516 * age + 0.1074 * height + 0.3362 * w
                   if sex == "male" else -2.097 + 0.1069 * height + 0.2466 * w)
            if not 0.2 * w <= tbw <= 0.8 * w:
                with self.assertRaises(ntr.NatremiaError) as caught:
                    ntr.tbw_watson(sex=sex, age_years=age, height_cm=height,
                                   weight_kg=w)
                self.assertEqual(caught.exception.status_name, "NTR_ERR_DOMAIN")
                assume(False)
        self.assertLessEqual(
            ntr.tbw_watson(sex=sex, age_years=age, height_cm=height, weight_kg=lo),
            ntr.tbw_watson(sex=sex, age_years=age, height_cm=height, weight_kg=hi))


class ArraysEqualScalars(unittest.TestCase):
    """Every row of an array call equals the scalar call on its inputs:
    same status, same bits, for valid and invalid rows alike."""

    def compare(self, scalar, values, status, rows):
        for i, kwargs in enumerate(rows):
            try:
                expected = scalar(**kwargs)
            except ntr.NatremiaError as err:
                self.assertEqual(status[i], err.status, kwargs)
                continue
            self.assertEqual(status[i], ntr.OK, kwargs)
            if isinstance(expected, float):
                self.assertTrue(same_bits(float(values[i]), expected), kwargs)
            else:
                self.assertEqual(int(values[i]), int(expected), kwargs)

    def run_case(self, array_fn, scalar_fn, columns, **fixed):
        names = list(columns)
        n = len(columns[names[0]])
        rows = [dict({k: columns[k][i] for k in names}, **fixed) for i in range(n)]
        values, status = array_fn(errors="nan", with_status=True, **fixed,
                                  **{k: np.asarray(columns[k]) for k in names})
        self.assertEqual(values.shape, (n,))
        self.compare(scalar_fn, values, status, rows)

    @settings(max_examples=40)
    @given(st.data())
    def test_osmolality(self, data):
        n = data.draw(st.integers(1, 30))
        col = lambda lo, hi: data.draw(st.lists(anything_near(lo, hi),
                                                min_size=n, max_size=n))
        formula = data.draw(st.sampled_from(["2na", "dorwart_chalmers"]))
        self.run_case(arrays.osm_calculated, ntr.osm_calculated,
                      {"na_mmol_l": col(80, 220), "glucose_mmol_l": col(0, 200),
                       "urea_mmol_l": col(0, 200), "ethanol_mmol_l": col(0, 400)},
                      formula=formula)
        self.run_case(arrays.osm_effective, ntr.osm_effective,
                      {"na_mmol_l": col(80, 220), "glucose_mmol_l": col(0, 200)})
        self.run_case(arrays.osm_gap, ntr.osm_gap,
                      {"measured_mosm_kg": col(150, 600),
                       "calculated_mosm_kg": col(150, 600)})

    @settings(max_examples=40)
    @given(st.data())
    def test_sodium_and_water(self, data):
        n = data.draw(st.integers(1, 30))
        col = lambda lo, hi: data.draw(st.lists(anything_near(lo, hi),
                                                min_size=n, max_size=n))
        method = data.draw(st.sampled_from(["katz", "hillier"]))
        self.run_case(arrays.na_corrected_glucose, ntr.na_corrected_glucose,
                      {"na_mmol_l": col(80, 220), "glucose_mmol_l": col(0, 200)},
                      method=method)
        self.run_case(arrays.na_deficit, ntr.na_deficit,
                      {"tbw_l": col(0.1, 400), "na_mmol_l": col(80, 220),
                       "target_na_mmol_l": col(80, 220)})
        self.run_case(arrays.free_water_deficit, ntr.free_water_deficit,
                      {"tbw_l": col(0.1, 400), "na_mmol_l": col(80, 220)})
        sexes = data.draw(st.lists(st.sampled_from([1, 2, 0, 5]), min_size=n,
                                   max_size=n))
        self.run_case(arrays.tbw_fraction, ntr.tbw_fraction,
                      {"sex": sexes, "age_years": col(0, 130),
                       "weight_kg": col(0.3, 650)})
        self.run_case(arrays.tbw_watson, ntr.tbw_watson,
                      {"sex": sexes, "age_years": col(18, 130),
                       "height_cm": col(30, 275), "weight_kg": col(0.3, 650)})

    @settings(max_examples=40)
    @given(st.data())
    def test_infusion_and_urine(self, data):
        n = data.draw(st.integers(1, 30))
        col = lambda lo, hi: data.draw(st.lists(anything_near(lo, hi),
                                                min_size=n, max_size=n))
        infusate = {"na_mmol_l": col(80, 220), "tbw_l": col(0.1, 400),
                    "infusate_na_mmol_l": col(0, 1100),
                    "infusate_k_mmol_l": col(0, 400)}
        self.run_case(arrays.infusate_change_per_litre,
                      ntr.infusate_change_per_litre, infusate)
        self.run_case(arrays.infusate_change, ntr.infusate_change,
                      dict(infusate, volume_l=col(0, 20)))
        self.run_case(arrays.infusate_volume_for_change,
                      ntr.infusate_volume_for_change,
                      dict(infusate, target_delta_mmol_l=col(-50, 50)))
        urine = {"urine_na_mmol_l": col(0, 500), "urine_k_mmol_l": col(0, 300),
                 "serum_na_mmol_l": col(80, 220)}
        self.run_case(arrays.furst_ratio, ntr.furst_ratio, urine)
        self.run_case(arrays.efwc, ntr.efwc, dict(urine, urine_volume_l=col(0, 30)))
        ratios = col(0, 20)
        values, status = arrays.restriction_from_ratio(np.asarray(ratios),
                                                       errors="nan",
                                                       with_status=True)
        self.compare(lambda ratio: ntr.restriction_from_ratio(ratio), values,
                     status, [{"ratio": r} for r in ratios])


if __name__ == "__main__":
    unittest.main()


class CorrectionSafety(unittest.TestCase):
    def test_presets(self):
        # Source: Verbalis et al., Am J Med 2013 and Spasovski et al., Eur J
        # Endocrinol 2014: 10 mmol/L in 24 h, 18 in 48 h, at least 4; high
        # risk 8 in 24 h (16 in 48 h, the library's choice).
        self.assertEqual(ntr.limits_preset("standard"), ntr.Limits(10, 18, 4))
        self.assertEqual(ntr.limits_preset("high_risk"), ntr.Limits(8, 16, 4))

    def test_hand_worked_series(self):
        # Invented series, worked by hand against the standard limits:
        # 110, 116, 122, 124 at 0, 6, 12, 24 h rises 14 within 24 h (> 10).
        c = ntr.correction_assess(hours=[0, 6, 12, 24],
                                  na_mmol_l=[110, 116, 122, 124])
        self.assertEqual(c.max_rise_24h, 14.0)
        self.assertEqual(c.excess_mmol_l, 4.0)
        self.assertAlmostEqual(c.last_rate_per_h, 2 / 12, places=15)
        self.assertEqual(c.flags, ntr.CorrectionFlag.OVER_24H)
        with self.assertRaises(ntr.NatremiaError) as caught:
            ntr.correction_assess(hours=[0, 6, 3], na_mmol_l=[110, 112, 113])
        self.assertEqual(caught.exception.status_name, "NTR_ERR_ORDER")

    def test_groups_hand_worked(self):
        hours = [0, 6, 12, 24, 0, 12, 24, 30]
        na = [110, 116, 122, 124, 118, 120, 121, 121]
        out = arrays.correction_assess_groups(hours=hours, na_mmol_l=na,
                                              offsets=[0, 4, 8])
        self.assertEqual(out["max_rise_24h"].tolist(), [14.0, 3.0])
        self.assertEqual(out["flags"].tolist(), [int(ntr.CorrectionFlag.OVER_24H),
                                                 int(ntr.CorrectionFlag.BELOW_TARGET)])
        ids, h, v = arrays.sort_series([7, 3, 7, 3], [5, 1, 0, 0], [111, 121, 110, 120])
        offsets, group_ids = arrays.offsets_from_ids(ids)
        self.assertEqual(offsets.tolist(), [0, 2, 4])
        self.assertEqual(group_ids.tolist(), [3, 7])
        self.assertEqual(h.tolist(), [0, 1, 0, 5])
        with self.assertRaises(ntr.NatremiaError) as caught:
            arrays.correction_assess_groups(hours=hours, na_mmol_l=na,
                                            offsets=[0, 4, 9])
        self.assertEqual(caught.exception.status_name, "NTR_ERR_ARG")

    @settings(max_examples=60)
    @given(st.lists(st.lists(st.tuples(in_range(0, 30), in_range(-3, 9)),
                             min_size=0, max_size=8), min_size=1, max_size=12),
           st.sampled_from(["standard", "high_risk"]))
    def test_groups_equal_scalar(self, groups, limits):
        hours, na, offsets = [], [], [0]
        for steps in groups:
            t, v = 0.0, 110.0
            for dt, dv in steps:
                t += dt
                v = min(max(v + dv, 80.0), 220.0)
                hours.append(t)
                na.append(v)
            offsets.append(len(hours))
        out, status = arrays.correction_assess_groups(
            hours=hours, na_mmol_l=na, offsets=offsets, limits=limits,
            errors="nan", with_status=True)
        for g in range(len(groups)):
            lo, hi = offsets[g], offsets[g + 1]
            try:
                expected = ntr.correction_assess(hours=hours[lo:hi],
                                                 na_mmol_l=na[lo:hi], limits=limits)
            except ntr.NatremiaError as err:
                self.assertEqual(status[g], err.status)
                self.assertEqual(hi, lo)  # only an empty series fails here
                continue
            self.assertEqual(status[g], ntr.OK)
            for field in ("rise_first_24h", "max_rise_24h", "max_rise_48h",
                          "last_rate_per_h", "excess_mmol_l"):
                self.assertTrue(same_bits(float(out[field][g]),
                                          getattr(expected, field)), field)
            self.assertEqual(int(out["flags"][g]), int(expected.flags))

    @settings(max_examples=40)
    @given(st.lists(st.tuples(in_range(0, 12), in_range(-3, 6)), min_size=1,
                    max_size=15))
    def test_watch_equals_assessment_of_prefix(self, steps):
        watch = ntr.Watch("standard")
        hours, na = [], []
        t, v = 0.0, 115.0
        for dt, dv in steps:
            t += dt
            v += dv
            hours.append(t)
            na.append(v)
            self.assertEqual(watch.push(hours=t, na_mmol_l=v),
                             ntr.correction_assess(hours=hours, na_mmol_l=na))

    @given(na=in_range(100, 160), tbw=in_range(5, 80),
           infusate_na=in_range(0, 1100), infusate_k=in_range(0, 40))
    def test_balance_one_litre_is_adrogue_madias(self, na, tbw, infusate_na,
                                                 infusate_k):
        # Source: Adrogue & Madias, N Engl J Med 2000: one litre of infusate
        # is the mass balance of one inflow of 1 L.
        try:
            after = ntr.balance_predict(na_mmol_l=na, tbw_l=tbw,
                                        flows=[(1.0, infusate_na, infusate_k)])
        except ntr.NatremiaError as err:
            self.assertEqual(err.status_name, "NTR_ERR_DOMAIN")
            return
        delta = ntr.infusate_change_per_litre(
            na_mmol_l=na, tbw_l=tbw, infusate_na_mmol_l=infusate_na,
            infusate_k_mmol_l=infusate_k)
        self.assertAlmostEqual(after.na_mmol_l, na + delta, delta=1e-9 * na)
        self.assertAlmostEqual(after.tbw_l, tbw + 1.0, delta=1e-12 * tbw)

    def test_ods_risk_unknown_counts(self):
        # Verbalis et al. 2013 list the risk factors; a factor not known is
        # treated as present (the library's cautious choice).
        risk = ntr.ods_risk(baseline_na_mmol_l=118, low_potassium=False,
                            alcohol_use_disorder=None, malnutrition=False,
                            advanced_liver_disease=False)
        self.assertIs(risk.preset, ntr.LimitsPreset.HIGH_RISK)
        self.assertEqual(risk.unknowns, ntr.OdsFactor.ALCOHOL)
        low = ntr.ods_risk(baseline_na_mmol_l=118, low_potassium=False,
                           alcohol_use_disorder=False, malnutrition=False,
                           advanced_liver_disease=False)
        self.assertIs(low.preset, ntr.LimitsPreset.STANDARD)
