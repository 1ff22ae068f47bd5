# SPDX-License-Identifier: MIT
"""Python binding: solute and restriction, fractional urate excretion.

Every value is checked against an outside source or hand-worked from the
published formula (named beside each check):
- Berl T. J Am Soc Nephrol 2008;19:1076-8: urine volume = osmoles
  excreted / urine osmolality.
- Furst H et al. Am J Med Sci 2000;319:240-4: the ratio (U_Na + U_K)/S_Na;
  the allowance V * (1 - ratio) + insensible is the electrolyte-free water
  clearance of that urine plus the insensible loss.
- IUPAC standard atomic weights, checked here against python3-periodictable.
- Fenske W et al. J Clin Endocrinol Metab 2008;93:2991-7: FEurate below 8 %
  argues against SIAD, above 12 % supports it.
"""

import unittest

import numpy as np
from hypothesis import given, settings
from hypothesis import strategies as st

import natremia as ntr
from natremia import arrays


class UrineVolumeFromSolute(unittest.TestCase):
    def test_berl_hand_worked(self):
        # Berl: 600 mOsm/day at 600 mOsm/kg -> 1 L/day; at 100 -> 6 L/day
        # (hand-worked from V = solute / U_osm).
        self.assertAlmostEqual(ntr.urine_volume_from_solute(
            solute_mosm_day=600.0, urine_osm_mosm_kg=600.0), 1.0, places=12)
        self.assertAlmostEqual(ntr.urine_volume_from_solute(
            solute_mosm_day=600.0, urine_osm_mosm_kg=100.0), 6.0, places=12)

    def test_error_names_argument(self):
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.urine_volume_from_solute(solute_mosm_day=600.0,
                                         urine_osm_mosm_kg=float("nan"))
        self.assertEqual(cm.exception.status, ntr.ERR_NONFINITE)
        self.assertEqual(cm.exception.argument, "urine_osm_mosm_kg")
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.urine_volume_from_solute(solute_mosm_day=-1.0,
                                         urine_osm_mosm_kg=300.0)
        self.assertEqual(cm.exception.status, ntr.ERR_RANGE)
        self.assertEqual(cm.exception.argument, "solute_mosm_day")

    def test_array_form(self):
        # Hand-worked (Berl): 900/300 = 3, 900/450 = 2, 900/900 = 1 L/day.
        got = arrays.urine_volume_from_solute(
            solute_mosm_day=900.0, urine_osm_mosm_kg=[300.0, 450.0, 900.0])
        np.testing.assert_allclose(got, [3.0, 2.0, 1.0], rtol=1e-12)

    def test_array_errors(self):
        u = [300.0, -5.0, 900.0]
        with self.assertRaises(ntr.NatremiaError) as cm:
            arrays.urine_volume_from_solute(solute_mosm_day=900.0,
                                            urine_osm_mosm_kg=u)
        self.assertEqual(cm.exception.row, 1)
        self.assertEqual(cm.exception.failed, 1)
        got, status = arrays.urine_volume_from_solute(
            solute_mosm_day=900.0, urine_osm_mosm_kg=u, errors="nan",
            with_status=True)
        self.assertTrue(np.isnan(got[1]))
        self.assertEqual(status.tolist(), [0, ntr.ERR_RANGE, 0])

    @settings(max_examples=60, deadline=None)
    @given(st.floats(0.0, 5000.0), st.floats(0.0, 5000.0),
           st.floats(200.0, 2000.0))
    def test_monotone_in_solute(self, a, b, u):
        # Berl: at a fixed urine osmolality more solute makes more urine.
        lo, hi = min(a, b), max(a, b)
        self.assertLessEqual(
            ntr.urine_volume_from_solute(solute_mosm_day=lo, urine_osm_mosm_kg=u),
            ntr.urine_volume_from_solute(solute_mosm_day=hi, urine_osm_mosm_kg=u))

    @settings(max_examples=60, deadline=None)
    @given(st.floats(0.0, 3000.0), st.floats(100.0, 2000.0),
           st.floats(100.0, 2000.0))
    def test_monotone_in_urine_osmolality(self, s, a, b):
        # Berl: the same solute in a more concentrated urine is less urine.
        lo, hi = min(a, b), max(a, b)
        self.assertGreaterEqual(
            ntr.urine_volume_from_solute(solute_mosm_day=s, urine_osm_mosm_kg=lo),
            ntr.urine_volume_from_solute(solute_mosm_day=s, urine_osm_mosm_kg=hi))


class FluidAllowance(unittest.TestCase):
    def test_negative_hand_worked(self):
        # Hand-worked (Berl, Furst): 600 mOsm/day at 500 -> V = 1.2 L; urine
        # Na+K 170 over serum 125, ratio 1.36; 1.2 * (1 - 1.36) = -0.432 L:
        # restriction alone cannot hold the sodium.
        self.assertAlmostEqual(ntr.fluid_allowance(
            solute_mosm_day=600.0, urine_osm_mosm_kg=500.0,
            urine_na_mmol_l=130.0, urine_k_mmol_l=40.0,
            serum_na_mmol_l=125.0), -0.432, places=12)

    def test_positive_with_insensible_hand_worked(self):
        # Hand-worked: 800/400 = 2 L; ratio (50+25)/125 = 0.6;
        # 2 * 0.4 + 0.5 insensible = 1.3 L/day.
        kw = dict(solute_mosm_day=800.0, urine_osm_mosm_kg=400.0,
                  urine_na_mmol_l=50.0, urine_k_mmol_l=25.0,
                  serum_na_mmol_l=125.0, insensible_l_day=0.5)
        self.assertAlmostEqual(ntr.fluid_allowance(**kw), 1.3, places=12)
        got = arrays.fluid_allowance(**dict(kw, insensible_l_day=[0.0, 0.5]))
        np.testing.assert_allclose(got, [0.8, 1.3], rtol=1e-12)

    def test_equals_efwc_plus_insensible(self):
        # The allowance is the EFWC of Berl's urine volume plus insensible
        # loss (definition in the header; ntr_efwc is the 1.0 function).
        v = ntr.urine_volume_from_solute(solute_mosm_day=700.0,
                                         urine_osm_mosm_kg=350.0)
        e = ntr.efwc(urine_volume_l=v, urine_na_mmol_l=70.0,
                     urine_k_mmol_l=30.0, serum_na_mmol_l=128.0)
        a = ntr.fluid_allowance(solute_mosm_day=700.0, urine_osm_mosm_kg=350.0,
                                urine_na_mmol_l=70.0, urine_k_mmol_l=30.0,
                                serum_na_mmol_l=128.0, insensible_l_day=0.4)
        self.assertAlmostEqual(a, e + 0.4, places=12)

    def test_error_names_argument(self):
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.fluid_allowance(solute_mosm_day=600.0, urine_osm_mosm_kg=500.0,
                                urine_na_mmol_l=130.0, urine_k_mmol_l=40.0,
                                serum_na_mmol_l=5.0)
        self.assertEqual(cm.exception.status, ntr.ERR_RANGE)
        self.assertEqual(cm.exception.argument, "serum_na_mmol_l")


class SoluteDose(unittest.TestCase):
    def test_urea_against_periodictable(self):
        # IUPAC atomic weights via python3-periodictable: urea CH4N2O, one
        # osmole per mole; 30 g is about 500 mOsm.
        import periodictable
        mass = periodictable.formula("CH4N2O").mass
        got = ntr.solute_dose_osmoles(solute="urea", grams=30.0)
        self.assertAlmostEqual(got, 30000.0 / mass, delta=0.05)

    def test_nacl_against_periodictable(self):
        # NaCl: two osmoles per mole (full dissociation, as the header says).
        import periodictable
        mass = periodictable.formula("NaCl").mass
        got = arrays.solute_dose_osmoles(solute=ntr.Solute.NACL,
                                         grams=[1.0, 9.0])
        np.testing.assert_allclose(got, 2000.0 * np.array([1.0, 9.0]) / mass,
                                   rtol=1e-4)

    def test_unknown_solute_names_argument(self):
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.solute_dose_osmoles(solute=7, grams=3.0)
        self.assertEqual(cm.exception.status, ntr.ERR_ARG)
        self.assertEqual(cm.exception.argument, "solute")
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.solute_dose_osmoles(solute="sugar", grams=3.0)
        self.assertEqual(cm.exception.argument, "solute")

    def test_grams_out_of_range_names_argument(self):
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.solute_dose_osmoles(solute="nacl", grams=-1.0)
        self.assertEqual(cm.exception.status, ntr.ERR_RANGE)
        self.assertEqual(cm.exception.argument, "grams")


class FeUricAcid(unittest.TestCase):
    def test_fenske_cut_offs(self):
        # Fenske 2008: below 8 % against SIAD, above 12 % supports it; the
        # header keeps 8 and 12 themselves in the middle band.
        C = ntr.FeUricAcidClass
        for fe, want in ((5.0, C.AGAINST_SIAD), (7.99, C.AGAINST_SIAD),
                         (8.0, C.INDETERMINATE), (12.0, C.INDETERMINATE),
                         (12.01, C.SUPPORTS_SIAD), (20.0, C.SUPPORTS_SIAD)):
            self.assertEqual(ntr.fe_uric_acid_class(fe_uric_acid_percent=fe),
                             want, fe)

    def test_error_names_argument(self):
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.fe_uric_acid_class(fe_uric_acid_percent=float("inf"))
        self.assertEqual(cm.exception.status, ntr.ERR_NONFINITE)
        self.assertEqual(cm.exception.argument, "fe_uric_acid_percent")


if __name__ == "__main__":
    unittest.main()
