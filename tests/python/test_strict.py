# SPDX-License-Identifier: MIT
"""Input strictness, ranges as API and data-frame inputs of the Python
binding (issue P3): exact integer codes, pandas Series/category/string
columns, masked arrays, missing values, errors that name the argument and
its accepted range (ntr_input_range), the long-DataFrame helper, and the
scalar fast path equal to the general one.

Clinical values, where any: Watson PE, Watson ID, Batt RD, Am J Clin Nutr
1980;33:27-39 (men: 2.447 - 0.09516*age + 0.1074*height + 0.3362*weight;
checked, /work/shared/sources.md); Adrogue & Madias, N Engl J Med
2000;342:1581-9, body-water fractions 0.6 of weight for adult men and 0.5
for adult women (from memory). The ranges are the library's own
plausibility nets (docs/ranges.md); the checks here are that the binding
reports exactly what the library accepts.
"""

import math
import os
import re
import unittest

import numpy as np
from hypothesis import given, settings, HealthCheck
from hypothesis import strategies as st

import natremia as ntr
from natremia import arrays, _core

try:
    import pandas as pd
except ImportError:  # pragma: no cover - run.py requires numpy only
    pd = None

settings.register_profile("natremia-strict", derandomize=True, database=None,
                          deadline=None, max_examples=200,
                          suppress_health_check=[HealthCheck.too_slow])
settings.load_profile("natremia-strict")

HEADER = os.environ.get("NATREMIA_HEADER") or os.path.join(
    os.path.dirname(__file__), "..", "..", "include", "natremia.h")

# Watson, men, 40 y, 175 cm, 75 kg (Watson 1980): hand-worked 2.447 - 3.8064
# + 18.795 + 25.215 = 42.6506 L.
WATSON_MAN = 2.447 - 0.09516 * 40 + 0.1074 * 175 + 0.3362 * 75


class RangesAsApi(unittest.TestCase):
    def test_docstring_ranges_are_the_library_ranges(self):
        # The numpy-style docstrings state each argument's accepted range
        # in words; the numbers are the library's (ntr_input_range), shown
        # with %g, so a range changed in lib/ntr_internal.h fails here
        # instead of leaving the docs behind.
        stated = re.compile(r"accepted\s+(\S+)\s+to\s+(\S+)[^()]*?\(NTR_INPUT_([A-Z_0-9]+)\)")
        checked = 0
        for module in (ntr, arrays):
            for name, obj in vars(module).items():
                if not callable(obj) or not obj.__doc__:
                    continue
                for m in stated.finditer(obj.__doc__):
                    r = ntr.input_range(m.group(3).lower())
                    self.assertEqual((m.group(1), m.group(2)),
                                     (f"{r.min:g}", f"{r.max:g}"),
                                     f"{module.__name__}.{name}: {m.group(0)}")
                    checked += 1
        self.assertGreater(checked, 100)

    def test_kinds_match_the_header(self):
        with open(HEADER, encoding="utf-8") as f:
            header = dict(re.findall(r"#define NTR_INPUT_(\w+) (\d+)", f.read()))
        self.assertEqual({k: int(v) for k, v in header.items()},
                         {m.name: int(m) for m in ntr.InputKind})

    def test_every_kind_has_a_range_and_unknown_kinds_fail(self):
        for kind in ntr.InputKind:
            r = ntr.input_range(kind)
            self.assertLess(r.min, r.max, kind)
            self.assertEqual(r.kind, kind)
        self.assertEqual(ntr.input_range("na")[:3], (ntr.InputKind.NA, 80.0, 220.0))
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.input_range(len(ntr.InputKind) + 1)
        self.assertEqual(cm.exception.argument, "kind")

    def test_scalar_functions_accept_exactly_the_range(self):
        # (kind, call with x) for a few consumers: at each end accepted,
        # just outside refused with NTR_ERR_RANGE.
        cases = [
            (ntr.InputKind.NA, lambda x: ntr.osm_effective(
                na_mmol_l=x, glucose_mmol_l=5.0)),
            (ntr.InputKind.GLUCOSE, lambda x: ntr.osm_effective(
                na_mmol_l=140.0, glucose_mmol_l=x)),
            (ntr.InputKind.AGE_FRACTION, lambda x: ntr.tbw_fraction(
                sex="male", age_years=x, weight_kg=70.0)),
            (ntr.InputKind.AGE_WATSON, lambda x: ntr.tbw_watson(
                sex="male", age_years=x, height_cm=175.0, weight_kg=75.0)),
            (ntr.InputKind.WEIGHT, lambda x: ntr.tbw_fraction(
                sex="male", age_years=40.0, weight_kg=x)),
            (ntr.InputKind.URINE_OSM, lambda x: ntr.urine_maximally_dilute(
                urine_osm_mosm_kg=x)),
            (ntr.InputKind.SOLUTE_GRAMS, lambda x: ntr.solute_dose_osmoles(
                solute="urea", grams=x)),
        ]
        for kind, call in cases:
            r = ntr.input_range(kind)
            call(r.min)
            call(r.max)
            for outside in (math.nextafter(r.min, -math.inf),
                            math.nextafter(r.max, math.inf)):
                with self.assertRaises(ntr.NatremiaError) as cm:
                    call(outside)
                self.assertEqual(cm.exception.status, ntr.ERR_RANGE, kind)
                # The message names the argument's accepted range.
                self.assertIn("%g to %g" % (r.min, r.max), str(cm.exception))


class ExactCodes(unittest.TestCase):
    def test_non_integral_and_bool_codes_raise_type_error(self):
        for bad in (1.9, True, np.float64(1.5), None, [1]):
            with self.assertRaises(TypeError) as cm:
                ntr.tbw_fraction(sex=bad, age_years=40, weight_kg=70)
            self.assertIn("sex", str(cm.exception))
            self.assertIn("female (2)", str(cm.exception))

    def test_unknown_or_wrapping_codes_raise_value_error(self):
        for bad in (2 ** 32 + 2, 2 ** 32 + 1, np.int64(2 ** 40), -1, 7):
            with self.assertRaises(ValueError) as cm:
                ntr.osm_calculated(na_mmol_l=140, glucose_mmol_l=5,
                                   urea_mmol_l=5, formula=bad)
            self.assertIn("formula", str(cm.exception))
            self.assertEqual(cm.exception.argument, "formula")

    def test_exact_codes_in_any_integer_type_are_taken(self):
        # Watson 1980 / Adrogue-Madias fractions (module docstring).
        for code in (1, np.int32(1), np.uint8(1), 1.0, np.float64(1.0),
                     ntr.Sex.MALE, "male", "M"):
            self.assertAlmostEqual(ntr.tbw_fraction(sex=code, age_years=40,
                                                    weight_kg=70), 42.0)
            self.assertAlmostEqual(ntr.tbw_watson(sex=code, age_years=40,
                                                  height_cm=175, weight_kg=75),
                                   WATSON_MAN, places=9)

    def test_course_preset_codes(self):
        kw = dict(hours=[0.0, 24.0], na_mmol_l=[120.0, 124.0])
        for bad in (1.9, True):
            with self.assertRaises(TypeError):
                ntr.course_assess(limits=bad, **kw)
        with self.assertRaises(ValueError) as cm:
            ntr.course_assess(limits=2 ** 32 + 1, **kw)
        self.assertEqual(cm.exception.argument, "limits")
        self.assertEqual(ntr.course_assess(limits=np.int64(1), **kw),
                         ntr.course_assess(limits="hypo_standard", **kw))

    def test_numbers_that_are_not_numbers_raise(self):
        for bad in ("140", None, True, [140.0]):
            with self.assertRaises(TypeError) as cm:
                ntr.osm_effective(na_mmol_l=bad, glucose_mmol_l=5)
            self.assertIn("na_mmol_l", str(cm.exception))
            self.assertIn("80 to 220 mmol/L", str(cm.exception))

    def test_array_codes(self):
        with self.assertRaises(TypeError) as cm:
            arrays.tbw_fraction(sex=[1.9, 2], age_years=40, weight_kg=70)
        self.assertIn("sex", str(cm.exception))
        with self.assertRaises(ValueError) as cm:
            arrays.tbw_fraction(sex=np.array([1, 2 ** 32 + 2]), age_years=40,
                                weight_kg=70)
        self.assertEqual(cm.exception.argument, "sex")
        with self.assertRaises(TypeError):
            arrays.tbw_fraction(sex=np.array([True, False]), age_years=40,
                                weight_kg=70)
        got = arrays.tbw_fraction(sex=np.array([1.0, 2.0]), age_years=40,
                                  weight_kg=70)
        np.testing.assert_allclose(got, [42.0, 35.0])
        with self.assertRaises(ValueError):
            arrays.osm_calculated(na_mmol_l=[140], glucose_mmol_l=5,
                                  urea_mmol_l=5, formula=2 ** 32 + 2)

    def test_grouped_offsets_must_be_exact(self):
        kw = dict(hours=[0.0, 6.0, 12.0], na_mmol_l=[120.0, 122.0, 124.0],
                  limits="hypo_standard")
        for bad in ([0, 1.7, 3], [0.0, 1.5, 3.0], [True, False]):
            with self.assertRaises(TypeError) as cm:
                arrays.course_assess_groups(offsets=bad, **kw)
            self.assertIn("offsets", str(cm.exception))
        with self.assertRaises(ValueError):
            arrays.course_assess_groups(offsets=[0, -1, 3], **kw)
        with self.assertRaises(TypeError):
            arrays.correction_assess_groups(offsets=[0, 1.7, 3],
                                            hours=kw["hours"],
                                            na_mmol_l=kw["na_mmol_l"])
        exact = arrays.course_assess_groups(offsets=[0.0, 1.0, 3.0], **kw)
        same = arrays.course_assess_groups(offsets=np.array([0, 1, 3]), **kw)
        np.testing.assert_array_equal(exact, same)


class ErrorsNameTheArgument(unittest.TestCase):
    def test_scalar(self):
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.infusate_change(na_mmol_l=120, tbw_l=30, infusate_na_mmol_l=513,
                                volume_l=200)
        e = cm.exception
        self.assertEqual((e.argument, e.status), ("volume_l", ntr.ERR_RANGE))
        self.assertIn("0 to 20 L", e.accepted)
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.tbw_watson(sex=1, age_years=10, height_cm=140, weight_kg=30)
        self.assertEqual(cm.exception.argument, "age_years")
        self.assertIn("18 to 130 years", str(cm.exception))

    def test_series_and_limits_name_their_range(self):
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.course_assess(hours=[0, 24], na_mmol_l=[120, 400],
                              limits="hypo_standard")
        self.assertEqual(cm.exception.argument, "na_mmol_l[1]")
        self.assertIn("80 to 220 mmol/L", cm.exception.accepted)
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.course_assess(hours=[0, 24], na_mmol_l=[120, 124],
                              limits=ntr.CourseLimits("raise", 60, 0, 0, 0, 0))
        self.assertEqual(cm.exception.argument, "limits.max_rise_24h")
        r = ntr.input_range("limit")
        self.assertIn("%g to %g" % (r.min, r.max), str(cm.exception))

    def test_array_names_the_argument_of_the_first_failing_row(self):
        with self.assertRaises(ntr.NatremiaError) as cm:
            arrays.infusate_change(na_mmol_l=[120, 120], tbw_l=[30, 30],
                                   infusate_na_mmol_l=[513, 513],
                                   volume_l=[1, 200])
        e = cm.exception
        self.assertEqual((e.row, e.argument, e.value), (1, "volume_l", 200.0))
        self.assertIn("0 to 20 L", str(e))


@unittest.skipIf(pd is None, "pandas not installed (apt-get install python3-pandas)")
class PandasInputs(unittest.TestCase):
    def test_series_in_series_out_index_kept(self):
        df = pd.DataFrame({"na": [140.0, 150.0], "glu": [5.0, 10.0]},
                          index=pd.Index(["bed 4", "bed 7"], name="bed"))
        got = arrays.osm_effective(na_mmol_l=df.na, glucose_mmol_l=df.glu)
        self.assertIsInstance(got, pd.Series)
        self.assertTrue(got.index.equals(df.index))
        self.assertEqual(got.tolist(), [285.0, 310.0])
        # A scalar broadcast against a Series keeps the index too.
        got = arrays.osm_effective(na_mmol_l=df.na, glucose_mmol_l=5.0)
        self.assertTrue(got.index.equals(df.index))
        values, status = arrays.osm_effective(na_mmol_l=df.na, glucose_mmol_l=5.0,
                                              with_status=True)
        self.assertTrue(status.index.equals(df.index))

    def test_differing_indexes_are_refused(self):
        a = pd.Series([140.0, 150.0], index=[1, 2])
        for other in (pd.Series([5.0, 6.0], index=[2, 1]),
                      pd.Series([5.0, 6.0], index=[1, 3])):
            with self.assertRaises(ValueError) as cm:
                arrays.osm_effective(na_mmol_l=a, glucose_mmol_l=other)
            self.assertIn("indexes", str(cm.exception))
        # Aligned first, the pairing is by label.
        b = pd.Series([6.0, 5.0], index=[2, 1]).reindex(a.index)
        self.assertEqual(arrays.osm_effective(na_mmol_l=a, glucose_mmol_l=b)
                         .tolist(), [285.0, 306.0])

    def test_enumerations_from_string_category_and_object_columns(self):
        # Adrogue-Madias fractions (module docstring): women 0.5, men 0.6.
        sex = ["female", "male", "F", "m"]
        want = [35.0, 42.0, 35.0, 42.0]
        for column in (pd.Series(sex), pd.Series(sex, dtype="string"),
                       pd.Series(sex, dtype="category"),
                       pd.Series(sex, dtype=object),
                       pd.Series([2, 1, 2, 1], dtype=object),
                       pd.Series([2, 1, 2, 1], dtype="Int64")):
            got = arrays.tbw_fraction(sex=column, age_years=40.0, weight_kg=70.0)
            self.assertEqual(got.tolist(), want, column.dtype)
        with self.assertRaises(ntr.NatremiaError) as cm:
            arrays.tbw_fraction(sex=pd.Series(["female", "other"]),
                                age_years=40.0, weight_kg=70.0)
        self.assertEqual(cm.exception.argument, "sex")

    def test_missing_values_are_failed_rows(self):
        na = pd.Series([140.0, None, 150.0], dtype="Float64")
        self.assertIs(na[1], pd.NA)
        got, status = arrays.osm_effective(na_mmol_l=na, glucose_mmol_l=5.0,
                                           errors="nan", with_status=True)
        self.assertEqual(got[0], 285.0)
        self.assertTrue(math.isnan(got[1]))
        self.assertEqual(status.tolist(), [0, ntr.ERR_NONFINITE, 0])
        with self.assertRaises(ntr.NatremiaError) as cm:
            arrays.osm_effective(na_mmol_l=na, glucose_mmol_l=5.0)
        self.assertEqual((cm.exception.row, cm.exception.argument), (1, "na_mmol_l"))
        # Lists and object arrays with None or pd.NA, and a missing sex.
        got = arrays.osm_effective(na_mmol_l=[140.0, None, pd.NA],
                                   glucose_mmol_l=5.0, errors="nan")
        self.assertEqual(np.isnan(got).tolist(), [False, True, True])
        got = arrays.tbw_fraction(sex=pd.Series(["male", None, pd.NA]),
                                  age_years=40.0, weight_kg=70.0, errors="nan")
        self.assertEqual(np.isnan(got.to_numpy()).tolist(), [False, True, True])

    def test_long_frame_one_row_per_patient_datetime_or_hours(self):
        t0 = pd.Timestamp("2026-03-01 07:30", tz="Europe/Vienna")
        h = pd.Timedelta(hours=1)
        # Invented data (not patients): p1 rises 12 mmol/L in 24 h, p2 has
        # a missing sodium, p3 one sample.
        frame = pd.DataFrame({
            "patient_id": ["p2", "p1", "p3", "p1", "p1", "p2"],
            "time": [t0, t0, t0 + 5 * h, t0 + 12 * h, t0 + 24 * h, t0 + 6 * h],
            "na_mmol_l": pd.array([118.0, 112.0, 125.0, 118.0, 124.0, None],
                                  dtype="Float64"),
        })
        by_time = arrays.course_assess_frame(frame, hours="time",
                                             limits="hypo_standard")
        frame["hours"] = (frame["time"] - t0) / h
        by_hours = arrays.course_assess_frame(frame, hours="hours",
                                              limits="hypo_standard")
        self.assertEqual(list(by_time.index), ["p1", "p2", "p3"])
        self.assertEqual(by_time.index.name, "patient_id")
        self.assertEqual(by_time["status"].tolist(), [0, ntr.ERR_NONFINITE, 0])
        self.assertEqual(by_time.loc["p1", "max_rise_24h"], 12.0)
        for column in ("status", "max_rise_24h", "flags"):
            np.testing.assert_array_equal(by_time[column].to_numpy(),
                                          by_hours[column].to_numpy())
        self.assertEqual(by_time.loc["p3", "first_time"], t0 + 5 * h)
        with self.assertRaises(ntr.NatremiaError) as cm:
            arrays.course_assess_frame(frame, hours="time",
                                       limits="hypo_standard", errors="raise")
        self.assertEqual(cm.exception.group_id, "p2")


class MaskedArrays(unittest.TestCase):
    def test_masked_rows_are_failed_rows_and_stay_masked(self):
        na = np.ma.MaskedArray([140.0, 300.0, 150.0], mask=[False, True, False])
        got, status = arrays.osm_effective(na_mmol_l=na, glucose_mmol_l=5.0,
                                           errors="nan", with_status=True)
        self.assertIsInstance(got, np.ma.MaskedArray)
        self.assertEqual(np.ma.getmaskarray(got).tolist(), [False, True, False])
        self.assertEqual(got.compressed().tolist(), [285.0, 305.0])
        self.assertEqual(status.data.tolist(), [0, ntr.ERR_NONFINITE, 0])
        with self.assertRaises(ntr.NatremiaError) as cm:
            arrays.osm_effective(na_mmol_l=na, glucose_mmol_l=5.0)
        self.assertEqual(cm.exception.row, 1)
        sex = np.ma.MaskedArray([1, 2], mask=[True, False])
        got = arrays.tbw_fraction(sex=sex, age_years=40.0, weight_kg=70.0,
                                  errors="nan")
        self.assertTrue(np.isnan(got.data[0]))
        self.assertEqual(got.data[1], 35.0)


def finite_or_not(lo, hi):
    w = hi - lo
    return st.one_of(st.floats(lo - w, hi + w, allow_nan=False),
                     st.sampled_from([lo, hi, math.nan, math.inf, -math.inf]),
                     st.integers(int(lo) - 10, int(hi) + 10))


def outcome(call):
    try:
        return ("ok", call())
    except ntr.NatremiaError as e:
        return ("error", e.status, e.argument)


class FastPathEqualsGeneralPath(unittest.TestCase):
    """The hot path (natremia._speed or its ctypes form) and the general
    ctypes path give the same value or the same error, for valid and
    invalid inputs alike."""

    @given(finite_or_not(80, 220), finite_or_not(0, 200))
    def test_osm_effective(self, na, glucose):
        fast = outcome(lambda: ntr.osm_effective(na_mmol_l=na, glucose_mmol_l=glucose))
        slow = outcome(lambda: _core._double_result(
            "ntr_osm_effective", "osm_effective", na, glucose))
        self.assertEqual(str(fast), str(slow))

    @given(st.sampled_from([1, 2, 0, 3, "male", "female", "f"]),
           finite_or_not(1, 130), finite_or_not(0.3, 650))
    def test_tbw_fraction(self, sex, age, weight):
        fast = outcome(lambda: ntr.tbw_fraction(sex=sex, age_years=age,
                                                weight_kg=weight))
        slow = outcome(lambda: _core._double_result(
            "ntr_tbw_fraction", "tbw_fraction",
            _core._enum(ntr.Sex, sex, "sex", "tbw_fraction"), age, weight))
        self.assertEqual(str(fast), str(slow))


class StrictnessProperties(unittest.TestCase):
    @given(st.floats(allow_nan=False, allow_infinity=False).filter(
        lambda x: not float(x).is_integer()))
    def test_any_non_integral_code_raises_type_error(self, x):
        with self.assertRaises(TypeError):
            ntr.tbw_fraction(sex=x, age_years=40.0, weight_kg=70.0)
        with self.assertRaises(TypeError):
            arrays.tbw_fraction(sex=[x], age_years=40.0, weight_kg=70.0)

    @given(st.integers(min_value=-2 ** 70, max_value=2 ** 70).filter(
        lambda x: x not in (1, 2)))
    def test_any_other_integer_code_raises_value_error(self, x):
        with self.assertRaises(ValueError) as cm:
            ntr.tbw_fraction(sex=x, age_years=40.0, weight_kg=70.0)
        self.assertEqual(cm.exception.argument, "sex")

    @unittest.skipIf(pd is None, "pandas not installed")
    @given(st.lists(st.tuples(st.floats(60, 240), st.floats(-10, 210)),
                    min_size=1, max_size=30), st.randoms(use_true_random=False))
    def test_series_result_is_the_array_result_on_the_index(self, rows, rnd):
        labels = ["r%d" % i for i in range(len(rows))]
        rnd.shuffle(labels)
        na = pd.Series([r[0] for r in rows], index=labels)
        glucose = pd.Series([r[1] for r in rows], index=labels)
        got, status = arrays.osm_effective(na_mmol_l=na, glucose_mmol_l=glucose,
                                           errors="nan", with_status=True)
        want, want_status = arrays.osm_effective(
            na_mmol_l=na.to_numpy(), glucose_mmol_l=glucose.to_numpy(),
            errors="nan", with_status=True)
        self.assertEqual(list(got.index), labels)
        np.testing.assert_array_equal(got.to_numpy(), want)
        np.testing.assert_array_equal(status.to_numpy(), want_status)


if __name__ == "__main__":
    unittest.main()
