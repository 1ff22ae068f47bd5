# SPDX-License-Identifier: MIT
"""Python binding: the course fit and its re-projection (ntr_course_fit,
ntr_fit_reproject).

The synthetic patients are invented; their sodium is hand-worked here from
the published mass balance (Edelman IS et al. J Clin Invest 1958;37:1236-56;
Adrogue HJ, Madias NE. N Engl J Med 2000;342:1581-9):
    Na(t) = (Na0*W + S(t)) / (W + V(t) - L*t/1000),
S the sodium + potassium given by t, V the volume given by t, L the
free-water loss in mL/h. The fit must recover the hidden W and L.
"""

import unittest

import natremia as ntr

W, L, NA0 = 30.0, 150.0, 120.0           # hidden truth (invented patient)
SALINE = (0.0, 6.0, 100.0, 513.0, 0.0)    # 3 % saline 100 mL/h for 6 h, then stopped


def _truth(t):
    given_l = 0.1 * min(t, 6.0)
    return (NA0 * W + 513.0 * given_l) / (W + given_l - L * t / 1000.0)


HOURS = [0.0, 2.0, 4.0, 6.0, 9.0, 12.0, 16.0]
NA = [_truth(t) for t in HOURS]


class CourseFitRecovery(unittest.TestCase):
    def test_recovers_hidden_truth(self):
        fit = ntr.course_fit(history_hours=HOURS, history_na_mmol_l=NA,
                             tbw_guess_l=40.0, flows=[SALINE])
        self.assertAlmostEqual(fit.tbw_l, W, delta=0.05)
        self.assertAlmostEqual(fit.free_water_loss_ml_h, L, delta=1.0)
        self.assertAlmostEqual(fit.na0_mmol_l, NA0, delta=0.01)
        self.assertLess(fit.rms_residual_mmol_l, 1e-3)
        self.assertFalse(fit.flags & ntr.FitFlag.NOT_CONVERGED)
        self.assertIn("body water 30.0 L", str(fit))
        self.assertIn("not orders", str(fit))

    def test_reprojection_follows_the_truth(self):
        # From 16 h, 8 h more with no flow but the fitted loss: hand-worked
        # truth at 24 h from the same balance.
        fit = ntr.course_fit(history_hours=HOURS, history_na_mmol_l=NA,
                             tbw_guess_l=40.0, flows=[SALINE])
        res = ntr.fit_reproject(history_hours=HOURS, history_na_mmol_l=NA,
                                fit=fit, flows=[SALINE], duration_h=8.0,
                                step_h=1.0, limits="hypo_standard")
        self.assertAlmostEqual(res.final_na_mmol_l, _truth(24.0), delta=0.02)
        # Hand-worked: the measured rise is already 18.6 mmol/L by 16 h
        # (120 -> 138.6), over the 10 mmol/L in 24 h of hypo_standard, so
        # the first predicted point (1 h after the last sample) breaches it.
        self.assertEqual(res.first_breach_h, 1.0)
        self.assertEqual(res.direction, ntr.BreachDirection.RISE)
        self.assertAlmostEqual(res.final_tbw_l, W + 0.6 - L * 24.0 / 1000.0,
                               delta=0.05)


class CourseFitRefusals(unittest.TestCase):
    def test_two_samples_names_history(self):
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.course_fit(history_hours=[0.0, 4.0],
                           history_na_mmol_l=[120.0, 122.0],
                           tbw_guess_l=40.0, flows=[SALINE])
        self.assertEqual(cm.exception.status, ntr.ERR_ARG)
        self.assertEqual(cm.exception.argument, "history_hours")

    def test_no_flows_cannot_separate(self):
        # Header rule: without flows the series fixes only L/W -> domain.
        hours = [0.0, 6.0, 12.0, 18.0]
        na = [120.0 * W / (W - L * t / 1000.0) for t in hours]
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.course_fit(history_hours=hours, history_na_mmol_l=na,
                           tbw_guess_l=40.0)
        self.assertEqual(cm.exception.status, ntr.ERR_DOMAIN)
        self.assertIn("cannot tell", str(cm.exception))

    def test_guess_out_of_range_named(self):
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.course_fit(history_hours=HOURS, history_na_mmol_l=NA,
                           tbw_guess_l=900.0, flows=[SALINE])
        self.assertEqual(cm.exception.status, ntr.ERR_RANGE)
        self.assertEqual(cm.exception.argument, "tbw_guess_l")

    def test_bad_sodium_named_as_history(self):
        na = list(NA)
        na[2] = float("nan")
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.course_fit(history_hours=HOURS, history_na_mmol_l=na,
                           tbw_guess_l=40.0, flows=[SALINE])
        self.assertEqual(cm.exception.status, ntr.ERR_NONFINITE)
        self.assertIn("history", cm.exception.argument)


if __name__ == "__main__":
    unittest.main()
