# SPDX-License-Identifier: MIT
"""Python binding: urine feedback (ntr_urine_feedback) and measured urine
as a flow (ntr_urine_interval_flow).

Invented patient: sodium 118 then 121 mmol/L at 0 and 6 h, body water 30 L
at 6 h, then a measured urine of 600 mL from 6 to 8 h with Na 20 + K 10 and
osmolality 80. Hand-worked from the electrolyte-free water balance (Shah SR,
Bhave G. Front Med 2018;5:103) and the mass balance (Adrogue HJ, Madias NE.
N Engl J Med 2000;342:1581-9):
  EFW out = 0.6 * (1 - 30/121) = 0.45124 L;
  Na now  = (121*30 - 0.6*30) / 29.4 = 122.857 mmol/L at 8 h;
  the same urine continued at 300 mL/h reaches 128 (10 above 118, the
  hypo_standard limit) when 3840 - 38.4 s = 3630 - 9 s, s = 7.143 h after
  6 h: 5.14 h after now.
"""

import unittest

import natremia as ntr

HOURS, NA = [0.0, 6.0], [118.0, 121.0]
URINE = [(6.0, 8.0, 600.0, 20.0, 10.0, 80.0)]


class UrineFeedback(unittest.TestCase):
    def run_feedback(self, horizon_h):
        return ntr.urine_feedback(history_hours=HOURS, history_na_mmol_l=NA,
                                  tbw_l=30.0, urine=URINE, horizon_h=horizon_h,
                                  step_h=0.25, limits="hypo_standard")

    def test_balance_hand_worked(self):
        fb = self.run_feedback(6.0)
        self.assertAlmostEqual(fb.now_h, 8.0, places=9)
        self.assertAlmostEqual(fb.efw_out_ml, 600.0 * (1 - 30.0 / 121.0),
                               delta=1e-6)
        self.assertAlmostEqual(fb.na_now_mmol_l, 3612.0 / 29.4, delta=1e-9)
        self.assertAlmostEqual(fb.tbw_now_l, 29.4, delta=1e-9)
        self.assertAlmostEqual(fb.urine_ml_h, 300.0, delta=1e-9)

    def test_water_diuresis_before_the_breach(self):
        fb = self.run_feedback(6.0)
        self.assertTrue(fb.water_diuresis)
        self.assertIn("water diuresis under way", fb.flag_labels)
        self.assertTrue(fb.flags & ntr.FeedbackFlag.DILUTE_URINE)
        # hand-worked crossing 5.14 h after now, found on a 0.25 h grid
        self.assertGreaterEqual(fb.breach_h, 5.14)
        self.assertLess(fb.breach_h, 5.14 + 0.26)

    def test_short_horizon_no_warning(self):
        fb = self.run_feedback(4.0)     # 12 h: still below 128 (hand-worked)
        self.assertFalse(fb.water_diuresis)
        self.assertIsNone(fb.breach_h)

    def test_no_interval_refused(self):
        with self.assertRaises(ntr.NatremiaError) as cm:
            ntr.urine_feedback(history_hours=HOURS, history_na_mmol_l=NA,
                               tbw_l=30.0, urine=[], limits="hypo_standard")
        self.assertEqual(cm.exception.status, ntr.ERR_ARG)
        self.assertEqual(cm.exception.argument, "urine")

    def test_interval_as_flow(self):
        # 600 mL over 2 h is a loss of 300 mL/h carrying Na 20 and K 10.
        flow = ntr.urine_interval_flow(URINE[0])
        self.assertEqual((flow.start_h, flow.end_h), (6.0, 8.0))
        self.assertAlmostEqual(flow.rate_ml_h, -300.0, places=9)
        self.assertEqual((flow.na_mmol_l, flow.k_mmol_l), (20.0, 10.0))


if __name__ == "__main__":
    unittest.main()
