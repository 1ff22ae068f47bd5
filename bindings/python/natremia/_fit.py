# SPDX-License-Identifier: MIT
"""The learning prediction (natremia 1.1): the patient's apparent body
water and an unmeasured free-water loss fitted to the measured sodium
series (ntr_course_fit), and the remaining plan re-projected with them
(ntr_fit_reproject).

Every result is an estimate for decision support, not an order. Verify
with measured values; follow local protocols and licensed clinical
judgement.
"""

import ctypes
import enum
from dataclasses import dataclass

from . import _core
from ._core import (NatremiaError, SampleStruct, TimedFlowStruct, ERR_ARG,
                    ERR_DOMAIN, ERR_NONFINITE, ERR_RANGE, OK, _fn,
                    _timed_flows, c_double, c_size_t, c_uint)
from ._course import (CourseLimitsStruct, CoursePlanResult,
                      CoursePlanResultStruct, CourseReport, CourseReportStruct,
                      CourseFlag, BreachDirection, _breach,
                      _course_limits_struct)

_P = ctypes.POINTER


class FitFlag(enum.IntFlag):
    """Bits of the fit's flags (NTR_FIT_*; ABI)."""
    TBW_AT_BOUND = 0x1
    LOSS_AT_BOUND = 0x2
    NOT_CONVERGED = 0x4
    EXACT = 0x8
    DRIFT = 0x10


FIT_FLAG_LABELS = {
    FitFlag.TBW_AT_BOUND: "body water at an end of its search range",
    FitFlag.LOSS_AT_BOUND: "free-water loss at an end of its search range",
    FitFlag.NOT_CONVERGED: "iteration limit reached",
    FitFlag.EXACT: "three samples: no residual left, no standard errors",
    FitFlag.DRIFT: "late residuals drift: the series is leaving the model",
}


class FitStruct(ctypes.Structure):
    _fields_ = [("struct_size", c_size_t), ("tbw_l", c_double),
                ("free_water_loss_ml_h", c_double),
                ("rms_residual_mmol_l", c_double), ("flags", c_uint),
                ("iterations", c_uint), ("na0_mmol_l", c_double),
                ("tbw_se_l", c_double), ("free_water_loss_se_ml_h", c_double),
                ("correlation", c_double), ("tbw_last_l", c_double),
                ("na_last_fit_mmol_l", c_double),
                ("late_residual_mmol_l", c_double)]


_core._PROTOTYPES.update({
    "ntr_course_fit": (ctypes.c_int, [_P(SampleStruct), c_size_t, c_double,
                                      _P(TimedFlowStruct), c_size_t,
                                      _P(FitStruct)]),
    "ntr_fit_reproject": (ctypes.c_int, [_P(SampleStruct), c_size_t,
                                         _P(FitStruct), _P(TimedFlowStruct),
                                         c_size_t, c_double, c_double,
                                         _P(CourseLimitsStruct),
                                         _P(CoursePlanResultStruct)]),
})


@dataclass(frozen=True)
class CourseFit:
    """Fitted body water (L, at the first sample) and unmeasured free-water
    loss (mL/h; positive a loss, negative a gain), with their approximate
    standard errors, the residual and the flags in words."""
    tbw_l: float
    free_water_loss_ml_h: float
    rms_residual_mmol_l: float
    flags: FitFlag
    flag_labels: tuple
    iterations: int
    na0_mmol_l: float
    tbw_se_l: float
    free_water_loss_se_ml_h: float
    correlation: float
    tbw_last_l: float
    na_last_fit_mmol_l: float
    late_residual_mmol_l: float

    def __str__(self):
        text = ("body water %.1f L (SE %.1f), unmeasured free-water %s %.0f "
                "mL/h (SE %.0f), residual %.2f mmol/L" % (
                    self.tbw_l, self.tbw_se_l,
                    "loss" if self.free_water_loss_ml_h >= 0 else "gain",
                    abs(self.free_water_loss_ml_h),
                    self.free_water_loss_se_ml_h, self.rms_residual_mmol_l))
        if self.flag_labels:
            text += "; " + "; ".join(self.flag_labels)
        return text + ". " + _core_caution()


def _core_caution():
    return ("Estimates for decision support, not orders. Verify with measured "
            "values; follow local protocols and licensed clinical judgement.")


def _fit_from_struct(s):
    flags = FitFlag(s.flags)
    labels = tuple(label for bit, label in FIT_FLAG_LABELS.items()
                   if flags & bit)
    return CourseFit(s.tbw_l, s.free_water_loss_ml_h, s.rms_residual_mmol_l,
                     flags, labels, s.iterations, s.na0_mmol_l, s.tbw_se_l,
                     s.free_water_loss_se_ml_h, s.correlation, s.tbw_last_l,
                     s.na_last_fit_mmol_l, s.late_residual_mmol_l)


_SEPARABILITY = ("the data cannot tell a smaller body water from a free-water "
                 "loss (estimates correlated beyond 0.999: give a series "
                 "spanning a bolus, a stop or a change of rate), or the model "
                 "leaves its range")


def _fit_status(history, n, guess, flows):
    out = FitStruct()
    out.struct_size = ctypes.sizeof(FitStruct)
    status = _fn("ntr_course_fit")(history, n, guess, flows[0], flows[1],
                                   ctypes.byref(out))
    return status, out


def course_fit(*, history_hours, history_na_mmol_l, tbw_guess_l, flows=()):
    """Fit the apparent body water and an unmeasured free-water loss to a
    measured sodium series (at least 3 samples) under the library's mass
    balance, by least squares. ``flows`` are TimedFlow tuples (start_h,
    end_h, rate_ml_h, na_mmol_l, k_mmol_l), hours after the first sample;
    measured urine as negative rates. Returns a CourseFit."""
    fn = "course_fit"
    history, n = _core._samples(history_hours, history_na_mmol_l, fn)
    array = _timed_flows(flows)
    status, out = _fit_status(history, n, tbw_guess_l, array)
    if status == OK:
        return _fit_from_struct(out)
    argument, value, detail = None, None, None
    if status == ERR_ARG and n < 3:
        argument, value = "history_hours", n
        detail = "at least 3 samples are needed, %d given" % n
    elif status in (ERR_NONFINITE, ERR_RANGE):
        # The library checks the history, then the guess, then the flows.
        empty = _timed_flows(())
        if _fit_status(history, n, 40.0, empty)[0] == status:
            argument = "history_hours or history_na_mmol_l"
        elif _fit_status(history, n, tbw_guess_l, empty)[0] == status:
            argument, value = "tbw_guess_l", tbw_guess_l
        else:
            argument = "flows"
    elif status == ERR_DOMAIN:
        detail = _SEPARABILITY
    raise NatremiaError(status, fn, detail=detail, argument=argument,
                        value=value)


def fit_reproject(*, history_hours, history_na_mmol_l, fit, flows=(),
                  duration_h, step_h, limits):
    """Re-project the remaining plan from the last sample with a CourseFit's
    body water and loss, and check it against ``limits`` (a CourseLimits or
    a preset name). Breach times are hours after the last sample. Returns a
    CoursePlanResult."""
    fn = "fit_reproject"
    history, n = _core._samples(history_hours, history_na_mmol_l, fn)
    array, n_flows = _timed_flows(flows)
    lim = _course_limits_struct(limits, fn)
    s = FitStruct()
    s.struct_size = ctypes.sizeof(FitStruct)
    s.tbw_l = fit.tbw_l
    s.free_water_loss_ml_h = fit.free_water_loss_ml_h
    out = CoursePlanResultStruct()
    out.struct_size = ctypes.sizeof(CoursePlanResultStruct)
    out.course.struct_size = ctypes.sizeof(CourseReportStruct)
    status = _fn("ntr_fit_reproject")(history, n, ctypes.byref(s), array,
                                      n_flows, duration_h, step_h,
                                      ctypes.byref(lim), ctypes.byref(out))
    if status != OK:
        raise NatremiaError(status, fn)
    return CoursePlanResult(
        out.final_na_mmol_l, out.final_tbw_l,
        _breach(out.breach_rise_24h_h), _breach(out.breach_rise_48h_h),
        _breach(out.breach_fall_24h_h), _breach(out.breach_fall_48h_h),
        _breach(out.first_breach_h), CourseFlag(out.first_breach_flag),
        BreachDirection(out.first_breach_direction), out.points,
        CourseReport._from_struct(out.course))


# ---------------------------------------------------------------------------
# Urine feedback: measured urine turned into an EFW balance and a
# re-projected course, with the "water diuresis under way" warning
# ---------------------------------------------------------------------------

class FeedbackFlag(enum.IntFlag):
    """Bits of the urine feedback's flags (NTR_FB_*; ABI)."""
    LIMIT_AHEAD = 0x1
    WATER_DIURESIS = 0x2
    DILUTE_URINE = 0x4
    OVER_NOW = 0x8
    SALT_LOSS = 0x10


FEEDBACK_FLAG_LABELS = {
    FeedbackFlag.LIMIT_AHEAD: "a limit is passed within the horizon",
    FeedbackFlag.WATER_DIURESIS: "water diuresis under way",
    FeedbackFlag.DILUTE_URINE: "urine maximally dilute",
    FeedbackFlag.OVER_NOW: "limit already passed by the estimate now",
    FeedbackFlag.SALT_LOSS: "electrolyte-rich urine lowering the sodium",
}


class UrineIntervalStruct(ctypes.Structure):
    _fields_ = [("start_h", c_double), ("end_h", c_double),
                ("volume_ml", c_double), ("na_mmol_l", c_double),
                ("k_mmol_l", c_double), ("osm_mosm_kg", c_double),
                ("reserved_d", c_double * 2), ("reserved", c_uint * 2)]


class UrineFeedbackStruct(ctypes.Structure):
    _fields_ = [("struct_size", c_size_t), ("now_h", c_double),
                ("na_now_mmol_l", c_double), ("tbw_now_l", c_double),
                ("efw_in_ml", c_double), ("efw_out_ml", c_double),
                ("efw_balance_ml", c_double), ("urine_ml_h", c_double),
                ("urine_efw_ml_h", c_double), ("input_efw_ml_h", c_double),
                ("na_rate_mmol_l_h", c_double), ("breach_h", c_double),
                ("flags", c_uint), ("reserved", c_uint),
                ("plan", CoursePlanResultStruct)]


_core._PROTOTYPES.update({
    "ntr_urine_feedback": (ctypes.c_int, [
        _P(SampleStruct), c_size_t, c_double, _P(TimedFlowStruct), c_size_t,
        _P(UrineIntervalStruct), c_size_t, c_double, c_double,
        _P(CourseLimitsStruct), _P(UrineFeedbackStruct)]),
    "ntr_urine_interval_flow": (ctypes.c_int, [_P(UrineIntervalStruct),
                                               _P(TimedFlowStruct)]),
})


@dataclass(frozen=True)
class UrineFeedback:
    """What the measured urine says (EFW in mL, positive for water gained
    by inputs or lost by outputs; times hours after the first sample, the
    breach hours after now, None for none)."""
    now_h: float
    na_now_mmol_l: float
    tbw_now_l: float
    efw_in_ml: float
    efw_out_ml: float
    efw_balance_ml: float
    urine_ml_h: float
    urine_efw_ml_h: float
    input_efw_ml_h: float
    na_rate_mmol_l_h: float
    breach_h: object
    flags: FeedbackFlag
    flag_labels: tuple
    plan: CoursePlanResult

    @property
    def water_diuresis(self):
        return bool(self.flags & FeedbackFlag.WATER_DIURESIS)


def _intervals(urine):
    rows = [tuple(u) for u in urine]
    array = (UrineIntervalStruct * max(len(rows), 1))()
    for i, (start, end, volume, na, k, osm) in enumerate(rows):
        array[i].start_h, array[i].end_h = start, end
        array[i].volume_ml, array[i].na_mmol_l = volume, na
        array[i].k_mmol_l, array[i].osm_mosm_kg = k, osm
    return array, len(rows)


def _plan_result(out):
    return CoursePlanResult(
        out.final_na_mmol_l, out.final_tbw_l,
        _breach(out.breach_rise_24h_h), _breach(out.breach_rise_48h_h),
        _breach(out.breach_fall_24h_h), _breach(out.breach_fall_48h_h),
        _breach(out.first_breach_h), CourseFlag(out.first_breach_flag),
        BreachDirection(out.first_breach_direction), out.points,
        CourseReport._from_struct(out.course))


def urine_feedback(*, history_hours, history_na_mmol_l, tbw_l, urine,
                   flows=(), horizon_h=6.0, step_h=0.5, limits):
    """Measured urine intervals, each (start_h, end_h, volume_ml, na_mmol_l,
    k_mmol_l, osm_mosm_kg) hours after the first sample, turned into an
    electrolyte-free water balance and a course re-projected ``horizon_h``
    past now; ``water_diuresis`` is set when the urine would carry the
    sodium past a rise limit within it. Returns a UrineFeedback."""
    fn = "urine_feedback"
    history, n = _core._samples(history_hours, history_na_mmol_l, fn)
    array, n_flows = _timed_flows(flows)
    intervals, n_urine = _intervals(urine)
    lim = _course_limits_struct(limits, fn)
    out = UrineFeedbackStruct()
    out.struct_size = ctypes.sizeof(UrineFeedbackStruct)
    out.plan.struct_size = ctypes.sizeof(CoursePlanResultStruct)
    out.plan.course.struct_size = ctypes.sizeof(CourseReportStruct)
    status = _fn("ntr_urine_feedback")(history, n, tbw_l, array, n_flows,
                                       intervals, n_urine, horizon_h, step_h,
                                       ctypes.byref(lim), ctypes.byref(out))
    if status != OK:
        argument = None
        if status == ERR_ARG and n_urine == 0:
            argument = "urine"
        elif status == ERR_ARG and n == 0:
            argument = "history_hours"
        raise NatremiaError(status, fn, argument=argument)
    flags = FeedbackFlag(out.flags)
    labels = tuple(label for bit, label in FEEDBACK_FLAG_LABELS.items()
                   if flags & bit)
    return UrineFeedback(out.now_h, out.na_now_mmol_l, out.tbw_now_l,
                         out.efw_in_ml, out.efw_out_ml, out.efw_balance_ml,
                         out.urine_ml_h, out.urine_efw_ml_h,
                         out.input_efw_ml_h, out.na_rate_mmol_l_h,
                         _breach(out.breach_h), flags, labels,
                         _plan_result(out.plan))


def urine_interval_flow(interval):
    """A measured urine interval (start_h, end_h, volume_ml, na_mmol_l,
    k_mmol_l, osm_mosm_kg) as a TimedFlow (a negative rate), to give to
    course_fit."""
    array, _ = _intervals([interval])
    flow = TimedFlowStruct()
    status = _fn("ntr_urine_interval_flow")(array, ctypes.byref(flow))
    if status != OK:
        raise NatremiaError(status, "urine_interval_flow")
    return _core.TimedFlow(flow.start_h, flow.end_h, flow.rate_ml_h,
                           flow.na_mmol_l, flow.k_mmol_l)
