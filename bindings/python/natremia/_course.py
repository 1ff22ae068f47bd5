# SPDX-License-Identifier: MIT
"""Direction-aware course limits (natremia 1.1): rises and falls, a goal,
presets for low and high sodium, the assessment of a measured series and
the direction-aware plan check.

The 1.0 calls (limits_preset, correction_assess, Watch, plan_check) stay as
they were; in the library they are thin wrappers over this same engine.

Every result is an estimate for decision support, not an order. Verify
with measured values; follow local protocols and licensed clinical
judgement.
"""

import ctypes
import enum
import functools
import numbers
from dataclasses import dataclass, fields

from . import _core
from ._core import (NatremiaError, SampleStruct, TimedFlowStruct, ERR_ARG,
                    ERR_ORDER, ERR_NONFINITE, ERR_RANGE, OK, _enum, _fn,
                    _timed_flows, c_double, c_int, c_size_t, c_uint)

_P = ctypes.POINTER


# ---------------------------------------------------------------------------
# Enumerators (values from include/natremia.h; ABI)
# ---------------------------------------------------------------------------

class Goal(enum.IntEnum):
    """What the treatment wants the sodium to do (NTR_GOAL_*)."""
    RAISE = 1  # a low sodium being raised
    LOWER = 2  # a high sodium being lowered
    HOLD = 3   # neither direction wanted


class CoursePreset(enum.IntEnum):
    """Preset course limits (NTR_COURSE_*); course_limits_preset() gives
    the figures and course_preset_names() what the loaded library knows."""
    HYPO_STANDARD = 1   # raise; rises at most 10 in 24 h, 18 in 48 h
    HYPO_HIGH_RISK = 2  # raise; rises at most 8 in 24 h, 16 in 48 h
    HYPER_CHRONIC = 3   # lower; falls at most 10 in any 24 h
    HYPER_ACUTE = 4     # lower; falls at most 24 in any 24 h
    HOLD = 5            # hold; rises and falls at most 4 in any 24 h


class CourseFlag(enum.IntFlag):
    """Bits of CourseReport.flags (NTR_CF_* in the C header). The first
    seven keep their 1.0 meaning and concern rises; the 1.1 bits add the
    falls, a move against the goal, and a watcher's approximation."""
    NONE = 0
    OVER_24H = 0x1          # rise over the 24 h limit
    OVER_48H = 0x2          # rise over the 48 h limit
    BELOW_TARGET = 0x4      # less change in the goal's direction than wanted by 24 h
    FALLING = 0x8           # the last interval falls
    NEAR_LIMIT = 0x10       # a rise within the near-limit margin of its limit
    PROJECTED_OVER = 0x20   # the same rise again would pass a rise limit
    RAPID_6H = 0x40         # 6 mmol/L or more within 6 h
    FALL_OVER_24H = 0x80    # fall over the 24 h limit
    FALL_OVER_48H = 0x100   # fall over the 48 h limit
    WRONG_WAY = 0x200       # moved against the goal by more than the margin
    APPROXIMATE = 0x400     # a watcher compacted its memory: upper bounds
    FALL_NEAR_LIMIT = 0x800       # a fall within the near-limit margin of its limit
    FALL_PROJECTED_OVER = 0x1000  # the same fall again would pass a fall limit


# Readable names of the flags, in bit order: the rise bits say "rise", so a
# screen never shows a bare "over_24h" next to "fall_over_24h".
FLAG_LABELS = {
    CourseFlag.OVER_24H: "rise_over_24h",
    CourseFlag.OVER_48H: "rise_over_48h",
    CourseFlag.BELOW_TARGET: "below_target",
    CourseFlag.FALLING: "falling",
    CourseFlag.NEAR_LIMIT: "near_limit",
    CourseFlag.PROJECTED_OVER: "projected_over",
    CourseFlag.RAPID_6H: "rapid_6h",
    CourseFlag.FALL_OVER_24H: "fall_over_24h",
    CourseFlag.FALL_OVER_48H: "fall_over_48h",
    CourseFlag.WRONG_WAY: "wrong_way",
    CourseFlag.APPROXIMATE: "approximate",
    CourseFlag.FALL_NEAR_LIMIT: "fall_near_limit",
    CourseFlag.FALL_PROJECTED_OVER: "fall_projected_over",
}


def flag_labels(flags):
    """The readable names of the set bits, in bit order; an unknown bit
    (a newer library) reads "bit_0x...."."""
    flags = int(flags)
    names = []
    bit = 1
    while bit <= flags:
        if flags & bit:
            try:
                names.append(FLAG_LABELS[CourseFlag(bit)])
            except (KeyError, ValueError):
                names.append("bit_0x%x" % bit)
        bit <<= 1
    return tuple(names)


# ---------------------------------------------------------------------------
# C structures (layouts mirror include/natremia.h)
# ---------------------------------------------------------------------------

class CourseLimitsStruct(ctypes.Structure):
    _fields_ = [("struct_size", c_size_t), ("goal", c_int),
                ("max_rise_24h", c_double), ("max_rise_48h", c_double),
                ("max_fall_24h", c_double), ("max_fall_48h", c_double),
                ("min_change_24h", c_double)]


class CourseReportStruct(ctypes.Structure):
    _fields_ = [("struct_size", c_size_t),
                ("max_rise_24h", c_double), ("max_rise_48h", c_double),
                ("max_fall_24h", c_double), ("max_fall_48h", c_double),
                ("excess_mmol_l", c_double), ("flags", c_uint),
                ("reserved", c_uint),
                ("rise_first_24h", c_double), ("fall_first_24h", c_double),
                ("rise_now_24h", c_double), ("fall_now_24h", c_double),
                ("last_rate_per_h", c_double), ("elapsed_h", c_double),
                ("worst_at_h", c_double)]


# ntr_course_report.worst_at_h when no window is over (NTR_COURSE_NO_TIME).
COURSE_NO_TIME = -1.0e9


def _new_report():
    out = CourseReportStruct()
    out.struct_size = ctypes.sizeof(CourseReportStruct)
    return out


class CoursePlanResultStruct(ctypes.Structure):
    _fields_ = [("struct_size", c_size_t), ("final_na_mmol_l", c_double),
                ("final_tbw_l", c_double), ("breach_rise_24h_h", c_double),
                ("breach_rise_48h_h", c_double),
                ("breach_fall_24h_h", c_double),
                ("breach_fall_48h_h", c_double), ("first_breach_h", c_double),
                ("first_breach_flag", c_uint),
                ("first_breach_direction", c_int), ("points", c_uint),
                ("reserved", c_uint), ("course", CourseReportStruct)]


COURSE_WATCH_CAPACITY = 96  # NTR_COURSE_WATCH_CAPACITY


class _CourseWatchRing(ctypes.Structure):
    _fields_ = [("private_u", c_uint * 4),
                ("entry", SampleStruct * COURSE_WATCH_CAPACITY),
                ("span", ctypes.c_float * COURSE_WATCH_CAPACITY)]


class CourseWatchStruct(ctypes.Structure):
    """Opaque to Python; the layout only fixes its size and alignment."""
    _fields_ = [("private_u", c_uint * 4), ("limits", CourseLimitsStruct),
                ("samples", SampleStruct * 3), ("private_d", c_double * 10),
                ("low", _CourseWatchRing), ("high", _CourseWatchRing)]


_PROTOTYPES = {
    "ntr_course_limits_preset": (c_int, [c_int, _P(CourseLimitsStruct)]),
    "ntr_course_assess": (c_int, [_P(SampleStruct), c_size_t,
                                  _P(CourseLimitsStruct),
                                  _P(CourseReportStruct)]),
    "ntr_course_watch_init": (c_int, [_P(CourseLimitsStruct),
                                      _P(CourseWatchStruct)]),
    "ntr_course_watch_push": (c_int, [_P(CourseWatchStruct), c_double,
                                      c_double, _P(CourseReportStruct)]),
    "ntr_course_watch_result": (c_int, [_P(CourseWatchStruct),
                                        _P(CourseReportStruct)]),
    "ntr_course_plan_check": (c_int, [_P(SampleStruct), c_size_t, c_double,
                                      _P(TimedFlowStruct), c_size_t, c_double,
                                      c_double, _P(CourseLimitsStruct),
                                      _P(CoursePlanResultStruct)]),
}
_core._PROTOTYPES.update(_PROTOTYPES)


# ---------------------------------------------------------------------------
# Limits
# ---------------------------------------------------------------------------

@dataclass(frozen=True)
class CourseLimits:
    """Limits on a sodium course in both directions, mmol/L (0: no limit
    in that direction; min_change_24h 0: no target). ``goal`` is a Goal
    member, its int value or its name ("raise", "lower", "hold")."""
    goal: Goal
    max_rise_24h: float = 0.0
    max_rise_48h: float = 0.0
    max_fall_24h: float = 0.0
    max_fall_48h: float = 0.0
    min_change_24h: float = 0.0

    def __post_init__(self):
        code = _enum(Goal, self.goal, "goal", "CourseLimits")
        try:
            goal = Goal(code)
        except ValueError:
            raise NatremiaError(ERR_ARG, "CourseLimits", argument="goal",
                                value=self.goal, detail="one of raise, "
                                "lower, hold") from None
        object.__setattr__(self, "goal", goal)

    def _struct(self):
        return CourseLimitsStruct(ctypes.sizeof(CourseLimitsStruct),
                                  int(self.goal), self.max_rise_24h,
                                  self.max_rise_48h, self.max_fall_24h,
                                  self.max_fall_48h, self.min_change_24h)


_LIMIT_MEMBERS = ("max_rise_24h", "max_rise_48h", "max_fall_24h",
                  "max_fall_48h", "min_change_24h")


def course_limits_preset(preset):
    """Preset course limits as a CourseLimits: a CoursePreset member, its
    int value, or its name ("hypo_standard", "hypo_high_risk",
    "hyper_chronic", or any preset the loaded library adds)."""
    fn = "course_limits_preset"
    code = _preset_code(preset, fn)
    out = CourseLimitsStruct()
    out.struct_size = ctypes.sizeof(CourseLimitsStruct)
    status = _fn("ntr_course_limits_preset")(code, ctypes.byref(out))
    if status != OK:
        raise NatremiaError(status, fn, argument="preset", value=preset)
    return CourseLimits(Goal(out.goal), out.max_rise_24h, out.max_rise_48h,
                        out.max_fall_24h, out.max_fall_48h, out.min_change_24h)


def _preset_code(preset, function):
    if isinstance(preset, str):
        key = preset.strip().lower().replace("-", "_").replace(" ", "_")
        code = _preset_names().get(key)
        if code is None:
            raise NatremiaError(ERR_ARG, function, argument="preset",
                                value=preset, detail="one of " + ", ".join(
                                    sorted(_preset_names())))
        return code
    return _core._exact_int(preset, "preset", function,
                           ", ".join(sorted(_preset_names())))


@functools.lru_cache(maxsize=1)
def _preset_names():
    return _probe_preset_names()


def course_preset_names():
    """{name: code} of the presets: those this binding names, plus any the
    loaded library defines beyond them (named "preset_N")."""
    return dict(_preset_names())


def _probe_preset_names():
    """{name: code} of the presets: those this binding names, plus any the
    loaded library defines beyond them (named "preset_N")."""
    names = {m.name.lower(): int(m) for m in CoursePreset}
    code = max(names.values()) + 1
    probe = CourseLimitsStruct()
    probe.struct_size = ctypes.sizeof(CourseLimitsStruct)
    # Presets are numbered from 1 without gaps (ABI: added at fresh values).
    while code < 64 and _fn("ntr_course_limits_preset")(
            code, ctypes.byref(probe)) == OK:
        names.setdefault("preset_%d" % code, code)
        code += 1
    return names


def _course_limits_struct(limits, function):
    """A CourseLimitsStruct from a CourseLimits or a preset."""
    if isinstance(limits, CourseLimits):
        return limits._struct()
    if isinstance(limits, (str, numbers.Integral)):
        try:
            return course_limits_preset(limits)._struct()
        except NatremiaError as err:
            raise NatremiaError(err.status, function, argument="limits",
                                value=limits, detail=err.detail) from None
    raise TypeError("%s: limits must be a CourseLimits or a preset "
                    "(CoursePreset member, int or name), not %r"
                    % (function, limits))


# ---------------------------------------------------------------------------
# The report
# ---------------------------------------------------------------------------

@dataclass(frozen=True)
class CourseReport:
    """What the assessment of a sodium series found, mmol/L (rates
    mmol/L/h, times hours). The max_* figures are "so far": the largest
    increase / decrease between two samples at most 24 h (48 h) apart (both
    >= 0); rise_now_24h / fall_now_24h are "now", over the 24 h ending at
    the last sample; rise_first_24h / fall_first_24h over the first 24 h.
    excess_mmol_l is the worst window's excess over its limit in either
    direction, worst_at_h the time of its later sample (None when no window
    is over). ``flags`` is a CourseFlag; ``flag_names`` the same bits by
    readable name."""
    max_rise_24h: float
    max_rise_48h: float
    max_fall_24h: float
    max_fall_48h: float
    excess_mmol_l: float
    flags: CourseFlag
    rise_first_24h: float
    fall_first_24h: float
    rise_now_24h: float
    fall_now_24h: float
    last_rate_per_h: float
    elapsed_h: float
    worst_at_h: object  # hours, or None

    @property
    def flag_names(self):
        return flag_labels(self.flags)

    @classmethod
    def _from_struct(cls, s):
        values = {}
        for f in fields(cls):
            values[f.name] = getattr(s, f.name)
        values["flags"] = CourseFlag(values["flags"])
        if values["worst_at_h"] == COURSE_NO_TIME:
            values["worst_at_h"] = None
        return cls(**values)

    def as_dict(self):
        """The fields and the readable flag names, for a table row."""
        row = {f.name: getattr(self, f.name) for f in fields(self)}
        row["flags"] = int(self.flags)
        row["flag_names"] = self.flag_names
        return row


# ---------------------------------------------------------------------------
# Assessment
# ---------------------------------------------------------------------------

_GOOD_SAMPLE = (0.0, 140.0)


def _blame_series(hours, na, lim, status, function):
    """(argument, value) that made a series call fail (see _core._blame:
    one valid example stands in for everything but the value probed)."""
    if status == ERR_ORDER:
        for i in range(1, len(hours)):
            if hours[i] < hours[i - 1]:
                return "hours[%d]" % i, hours[i]
        return "hours", None
    if status not in (ERR_NONFINITE, ERR_RANGE):
        return (None, None) if len(hours) else ("hours", [])
    good = course_limits_preset(CoursePreset.HYPO_STANDARD)._struct()
    for i in range(len(hours)):
        for name, sample in (("hours", (hours[i], _GOOD_SAMPLE[1])),
                             ("na_mmol_l", (_GOOD_SAMPLE[0], na[i]))):
            one = (SampleStruct * 1)(SampleStruct(*sample))
            if _course_status(one, 1, good) == status:
                return "%s[%d]" % (name, i), sample[0 if name == "hours" else 1]
    one = (SampleStruct * 1)(SampleStruct(*_GOOD_SAMPLE))
    for name in _LIMIT_MEMBERS:
        probe = CourseLimitsStruct.from_buffer_copy(good)
        setattr(probe, name, getattr(lim, name))
        if _course_status(one, 1, probe) == status:
            return "limits." + name, getattr(lim, name)
    return "limits", None


def _course_status(samples, n, lim):
    out = _new_report()
    return _fn("ntr_course_assess")(samples, n, ctypes.byref(lim),
                                    ctypes.byref(out))


def course_assess(*, hours, na_mmol_l, limits):
    """Assess a measured sodium series in both directions.

    ``hours`` (non-decreasing) and ``na_mmol_l`` are sequences of equal
    length; ``limits`` is a CourseLimits or a preset (CoursePreset member,
    int or name such as "hyper_chronic"): there is no default, because the
    direction the sodium should take is the caller's to state. Returns a
    CourseReport; raises NatremiaError naming the failing argument
    (``hours[3]``, ``na_mmol_l[0]``, ``limits.max_fall_24h``...)."""
    fn = "course_assess"
    samples, n = _core._samples(hours, na_mmol_l, fn)
    lim = _course_limits_struct(limits, fn)
    out = _new_report()
    status = _fn("ntr_course_assess")(samples, n, ctypes.byref(lim),
                                      ctypes.byref(out))
    if status != OK:
        argument, value = _blame_series(list(hours), list(na_mmol_l), lim,
                                        status, fn)
        raise NatremiaError(status, fn, argument=argument, value=value)
    return CourseReport._from_struct(out)


# ---------------------------------------------------------------------------
# The plan check in both directions
# ---------------------------------------------------------------------------

class BreachDirection(enum.IntEnum):
    """Direction of the first predicted breach (NTR_PLAN_BREACH_*)."""
    NONE = 0
    RISE = 1
    FALL = 2


_NO_BREACH = -1.0  # NTR_PLAN_NO_BREACH


def _breach(hours):
    return None if hours == _NO_BREACH else hours


@dataclass(frozen=True)
class CoursePlanResult:
    """What a fluid plan is predicted to do, checked against limits in both
    directions. Breach times are hours after the plan starts (None: no
    predicted point over that limit); ``first_breach_h`` is the earliest,
    ``first_breach`` its limit as a CourseFlag (OVER_24H, OVER_48H,
    FALL_OVER_24H or FALL_OVER_48H; NONE when there is none) and
    ``direction`` a BreachDirection. ``course`` is the CourseReport of the
    measured history followed by the predicted points."""
    final_na_mmol_l: float
    final_tbw_l: float
    breach_rise_24h_h: object
    breach_rise_48h_h: object
    breach_fall_24h_h: object
    breach_fall_48h_h: object
    first_breach_h: object
    first_breach: CourseFlag
    direction: BreachDirection
    points: int
    course: CourseReport

    @property
    def first_breach_name(self):
        """Readable name of the limit breached first, or None."""
        return flag_labels(self.first_breach)[0] if self.first_breach else None


_PLAN_ARGUMENTS = ("tbw_l", "flows", "duration_h", "step_h")


def _blame_plan(hours, na, tbw_l, flows, duration_h, step_h, lim, status):
    """(argument, value) that made a plan check fail: the history through
    the series rules, then each scalar with the rest at valid examples."""
    if status == ERR_ORDER:
        for i in range(1, len(hours)):
            if hours[i] < hours[i - 1]:
                return "history_hours[%d]" % i, hours[i]
        return "flows", None
    if status not in (ERR_NONFINITE, ERR_RANGE):
        return None, None
    good_lim = course_limits_preset(CoursePreset.HYPO_STANDARD)._struct()
    ok_history = (SampleStruct * 1)(SampleStruct(*_GOOD_SAMPLE))
    good = (30.0, None, 24.0, 1.0)
    given = (tbw_l, flows, duration_h, step_h)
    # The history alone, as a course assessment checks it.
    for i in range(len(hours)):
        for name, sample in (("history_hours", (hours[i], _GOOD_SAMPLE[1])),
                             ("history_na_mmol_l", (_GOOD_SAMPLE[0], na[i]))):
            one = (SampleStruct * 1)(SampleStruct(*sample))
            if _course_status(one, 1, good_lim) == status:
                return "%s[%d]" % (name, i), sample[0 if name == "history_hours" else 1]
    empty, _ = _timed_flows([])
    for k, name in enumerate(_PLAN_ARGUMENTS):
        args = [g if j <= k else e for j, (g, e) in enumerate(zip(given, good))]
        flow_array, n_flows = (flows if k >= 1 else (empty, 0))
        out = CoursePlanResultStruct()
        out.struct_size = ctypes.sizeof(CoursePlanResultStruct)
        out.course.struct_size = ctypes.sizeof(CourseReportStruct)
        st = _fn("ntr_course_plan_check")(ok_history, 1, args[0], flow_array,
                                          n_flows, args[2], args[3],
                                          ctypes.byref(good_lim),
                                          ctypes.byref(out))
        if st == status:
            return name, None if name == "flows" else given[k]
    return "limits", None


def course_plan_check(*, history_hours, history_na_mmol_l, tbw_l, flows,
                      duration_h, step_h, limits):
    """Check a fluid plan against limits in both directions before giving
    it (ntr_course_plan_check): the measured history (its last sample is
    "now"), then the predicted sodium under ``flows`` (TimedFlow(start_h,
    end_h, rate_ml_h, na_mmol_l, k_mmol_l), hours after now). ``limits`` is
    a CourseLimits or a preset ("hyper_chronic" for a water plan in
    hypernatraemia). Returns a CoursePlanResult."""
    fn = "course_plan_check"
    history, n_history = _core._samples(history_hours, history_na_mmol_l, fn)
    array, n = _timed_flows(flows)
    lim = _course_limits_struct(limits, fn)
    out = CoursePlanResultStruct()
    out.struct_size = ctypes.sizeof(CoursePlanResultStruct)
    out.course.struct_size = ctypes.sizeof(CourseReportStruct)
    status = _fn("ntr_course_plan_check")(history, n_history, tbw_l, array, n,
                                          duration_h, step_h,
                                          ctypes.byref(lim), ctypes.byref(out))
    if status != OK:
        argument, value = _blame_plan(list(history_hours),
                                      list(history_na_mmol_l), tbw_l,
                                      (array, n), duration_h, step_h, lim,
                                      status)
        raise NatremiaError(status, fn, argument=argument, value=value)
    return CoursePlanResult(
        out.final_na_mmol_l, out.final_tbw_l,
        _breach(out.breach_rise_24h_h), _breach(out.breach_rise_48h_h),
        _breach(out.breach_fall_24h_h), _breach(out.breach_fall_48h_h),
        _breach(out.first_breach_h), CourseFlag(out.first_breach_flag),
        BreachDirection(out.first_breach_direction), out.points,
        CourseReport._from_struct(out.course))


# ---------------------------------------------------------------------------
# The streaming course watcher
# ---------------------------------------------------------------------------

class CourseWatch:
    """Streaming course watcher (ntr_course_watch_*): push one result at a
    time, get the report of the series so far. It never refuses a valid
    sample: while its fixed memory holds, the report equals course_assess()
    on the same samples; after it compacts, the window figures are upper
    bounds and CourseFlag.APPROXIMATE is set. ``limits`` is a CourseLimits
    or a preset, as for course_assess() (no default)."""

    def __init__(self, limits):
        fn = "CourseWatch"
        self._lim = _course_limits_struct(limits, fn)
        self._state = CourseWatchStruct()
        status = _fn("ntr_course_watch_init")(ctypes.byref(self._lim),
                                              ctypes.byref(self._state))
        if status != OK:
            argument, value = _blame_series([], [], self._lim, status, fn) \
                if status in (ERR_NONFINITE, ERR_RANGE) else ("limits", None)
            raise NatremiaError(status, fn, argument=argument, value=value)

    def push(self, *, hours, na_mmol_l):
        out = _new_report()
        status = _fn("ntr_course_watch_push")(ctypes.byref(self._state), hours,
                                              na_mmol_l, ctypes.byref(out))
        if status != OK:
            raise NatremiaError(status, "CourseWatch.push",
                                **self._blame_push(hours, na_mmol_l, status))
        return CourseReport._from_struct(out)

    def _blame_push(self, hours, na_mmol_l, status):
        """hours or na_mmol_l, judged by a fresh watcher (the library checks
        hours first)."""
        if status == ERR_ORDER:
            return {"argument": "hours", "value": hours}
        if status not in (ERR_NONFINITE, ERR_RANGE):
            return {}
        probe = CourseWatchStruct()
        _fn("ntr_course_watch_init")(ctypes.byref(self._lim),
                                     ctypes.byref(probe))
        out = _new_report()
        if _fn("ntr_course_watch_push")(ctypes.byref(probe), hours,
                                        _GOOD_SAMPLE[1],
                                        ctypes.byref(out)) == status:
            return {"argument": "hours", "value": hours}
        return {"argument": "na_mmol_l", "value": na_mmol_l}

    def result(self):
        out = _new_report()
        status = _fn("ntr_course_watch_result")(ctypes.byref(self._state),
                                                ctypes.byref(out))
        if status != OK:
            raise NatremiaError(status, "CourseWatch.result",
                                detail="no result pushed yet"
                                if status == ERR_ARG else None)
        return CourseReport._from_struct(out)
