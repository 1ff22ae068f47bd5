# SPDX-License-Identifier: MIT
"""Scalar API: one Python function per C function, names without the ntr_
prefix, keyword-only arguments whose names carry their units.

Every call checks the C status and raises NatremiaError on anything but
NTR_OK, so a result that comes back is always a valid one.
"""

import ctypes
import enum
import math
import numbers
import operator
import os
import re
from collections import namedtuple
from dataclasses import dataclass
from typing import Union

from ._loader import load

_lib = load()

try:  # the optional accelerator of the scalar calls (src/_speed.c)
    from . import _speed
except ImportError:
    _speed = None

c_double = ctypes.c_double
c_int = ctypes.c_int
c_uint = ctypes.c_uint
c_size_t = ctypes.c_size_t
c_char_p = ctypes.c_char_p
_P = ctypes.POINTER

# ---------------------------------------------------------------------------
# Status codes and the exception
# ---------------------------------------------------------------------------

OK = 0
ERR_NULL = 1
ERR_NONFINITE = 2
ERR_RANGE = 3
ERR_UNIT = 4
ERR_DOMAIN = 5
ERR_ORDER = 6
ERR_CAPACITY = 7
ERR_ARG = 8

STATUS_NAMES = {
    OK: "NTR_OK",
    ERR_NULL: "NTR_ERR_NULL",
    ERR_NONFINITE: "NTR_ERR_NONFINITE",
    ERR_RANGE: "NTR_ERR_RANGE",
    ERR_UNIT: "NTR_ERR_UNIT",
    ERR_DOMAIN: "NTR_ERR_DOMAIN",
    ERR_ORDER: "NTR_ERR_ORDER",
    ERR_CAPACITY: "NTR_ERR_CAPACITY",
    ERR_ARG: "NTR_ERR_ARG",
}


def status_name(status):
    """The C name of a status code, e.g. 'NTR_ERR_RANGE'."""
    return STATUS_NAMES.get(int(status), "unknown status %d" % int(status))


def status_message(status):
    """The library's short English description of a status code."""
    return _fn("ntr_status_message")(int(status)).decode("ascii")


class NatremiaError(ValueError):
    """A natremia function refused its inputs.

    Attributes: ``status`` (the C status code), ``status_name`` (such as
    'NTR_ERR_RANGE'), ``message`` (the library's description), ``function``
    (the Python name that failed), ``argument`` and ``value`` (the input
    that failed, when one did), ``accepted`` (its accepted range or
    values, from ntr_input_range) and, for array functions, ``row`` (index
    of the first failing row in the flattened input) and ``failed`` (how many
    rows failed). ``detail`` holds any extra explanation from the binding.
    """

    def __init__(self, status, function, detail=None, row=None, failed=None,
                 argument=None, group_id=None, value=None, accepted=None):
        if accepted is None and isinstance(argument, str):
            accepted = _accepted_for_name(argument)
        self.accepted = accepted
        self.status = int(status)
        self.status_name = status_name(status)
        self.message = status_message(status)
        self.function = function
        self.detail = detail
        self.row = row
        self.failed = failed
        self.argument = argument
        self.value = value
        self.group_id = group_id
        text = "%s: %s (%s)" % (function, self.status_name, self.message)
        if argument is not None:
            text += " in argument %s" % (argument,)
            if value is not None:
                text += " (given %r)" % (value,)
        if accepted is not None:
            text += "; accepted: %s" % (accepted,)
        if row is not None:
            text += "; first failing row %d, %d row(s) failed" % (row, failed)
        if group_id is not None:
            text += " (id %r)" % (group_id,)
        if detail:
            text += ": " + detail
        super().__init__(text)


def _check(status, function):
    if status != OK:
        raise NatremiaError(status, function)


# ---------------------------------------------------------------------------
# Naming the argument that failed
#
# The library reports only a status, but it checks its numeric inputs one
# at a time in argument order (each: non-finite, then out of range; see
# DEVELOPERS.md). So the culprit of NTR_ERR_NONFINITE or NTR_ERR_RANGE is
# the first argument i for which the call with the caller's arguments up to
# i, and valid example values after it, fails with that status. The library
# stays the only judge of every range: the binding holds no limits, only
# one valid example input per function.
# ---------------------------------------------------------------------------

# C function -> (argument names in C order, a valid example of each; None
# marks an enumerator, which is always taken from the caller).
_ARGUMENTS = {
    "ntr_osm_calculated": (("na_mmol_l", "glucose_mmol_l", "urea_mmol_l",
                            "ethanol_mmol_l", "formula"),
                           (140.0, 5.0, 5.0, 0.0, None)),
    "ntr_osm_effective": (("na_mmol_l", "glucose_mmol_l"), (140.0, 5.0)),
    "ntr_osm_gap": (("measured_mosm_kg", "calculated_mosm_kg"), (290.0, 290.0)),
    "ntr_na_corrected_glucose": (("na_mmol_l", "glucose_mmol_l", "method"),
                                 (140.0, 5.0, None)),
    "ntr_na_corrected_glucose_factor": (("na_mmol_l", "glucose_mmol_l",
                                         "factor_per_100mg_dl"),
                                        (140.0, 5.0, 1.6)),
    "ntr_na_deficit": (("tbw_l", "na_mmol_l", "target_na_mmol_l"),
                       (30.0, 120.0, 125.0)),
    "ntr_tbw_fraction": (("sex", "age_years", "weight_kg"), (None, 40.0, 70.0)),
    "ntr_tbw_watson": (("sex", "age_years", "height_cm", "weight_kg"),
                       (None, 40.0, 170.0, 70.0)),
    "ntr_free_water_deficit": (("tbw_l", "na_mmol_l"), (40.0, 150.0)),
    "ntr_infusate_change_per_litre": (("na_mmol_l", "tbw_l", "infusate_na_mmol_l",
                                       "infusate_k_mmol_l"),
                                      (120.0, 30.0, 513.0, 0.0)),
    "ntr_infusate_change": (("na_mmol_l", "tbw_l", "infusate_na_mmol_l",
                             "infusate_k_mmol_l", "volume_l"),
                            (120.0, 30.0, 513.0, 0.0, 1.0)),
    "ntr_infusate_volume_for_change": (("na_mmol_l", "tbw_l",
                                        "infusate_na_mmol_l",
                                        "infusate_k_mmol_l",
                                        "target_delta_mmol_l"),
                                       (120.0, 30.0, 513.0, 0.0, 4.0)),
    "ntr_furst_ratio": (("urine_na_mmol_l", "urine_k_mmol_l", "serum_na_mmol_l"),
                        (60.0, 20.0, 120.0)),
    "ntr_efwc": (("urine_volume_l", "urine_na_mmol_l", "urine_k_mmol_l",
                  "serum_na_mmol_l"), (2.0, 60.0, 20.0, 120.0)),
    "ntr_na_severity": (("na_mmol_l",), (130.0,)),
    "ntr_tonicity_class": (("measured_osm_mosm_kg",), (280.0,)),
    "ntr_low_na_tonicity": (("na_mmol_l", "glucose_mmol_l",
                             "measured_osm_mosm_kg", "glucose_method"),
                            (125.0, 5.0, 260.0, None)),
    "ntr_low_na_effective_tonicity": (("na_mmol_l", "glucose_mmol_l",
                                       "urea_mmol_l", "ethanol_mmol_l",
                                       "measured_osm_mosm_kg",
                                       "glucose_method"),
                                      (125.0, 5.0, 5.0, 0.0, 260.0, None)),
    "ntr_restriction_from_ratio": (("ratio",), (0.5,)),
    "ntr_effective_osm_measured": (("na_mmol_l", "glucose_mmol_l",
                                    "urea_mmol_l", "ethanol_mmol_l",
                                    "measured_osm_mosm_kg"),
                                   (125.0, 5.0, 5.0, 0.0, 260.0)),
    "ntr_urine_maximally_dilute": (("urine_osm_mosm_kg",), (80.0,)),
    "ntr_urine_na_high": (("urine_na_mmol_l",), (20.0,)),
    "ntr_fractional_excretion": (("urine_x", "plasma_x", "urine_creatinine",
                                  "plasma_creatinine"),
                                 (40.0, 130.0, 8000.0, 80.0)),
    "ntr_relower_estimate": (("na_mmol_l", "tbw_l", "fluid_na_mmol_l",
                              "fluid_k_mmol_l", "lower_by_mmol_l", "hours",
                              "urine_ml_h", "urine_na_mmol_l", "urine_k_mmol_l"),
                             (125.5, 26.1, 0.0, 0.0, 3.5, 6.0, 0.0, 0.0, 0.0)),
    "ntr_urine_volume_from_solute": (("solute_mosm_day", "urine_osm_mosm_kg"),
                                     (600.0, 300.0)),
    "ntr_fluid_allowance": (("solute_mosm_day", "urine_osm_mosm_kg",
                             "urine_na_mmol_l", "urine_k_mmol_l",
                             "serum_na_mmol_l", "insensible_l_day"),
                            (600.0, 300.0, 60.0, 20.0, 125.0, 0.5)),
    "ntr_solute_dose_osmoles": (("solute", "grams"), (None, 15.0)),
    "ntr_fe_uric_acid_class": (("fe_uric_acid_percent",), (10.0,)),
}

_VALUE_STATUSES = (ERR_NONFINITE, ERR_RANGE)


def _probe_status(cname, args):
    """Status of a call with throw-away outputs."""
    fn = _fn(cname)
    outs = [t._type_() for t in fn.argtypes[len(args):]]
    return fn(*args, *[ctypes.byref(o) for o in outs])


def _blame(cname, args, status):
    """(name, value) of the argument that made a call fail, or (None,
    None) when the status is not about one value."""
    names, examples = _ARGUMENTS.get(cname, ((), ()))
    if status in _VALUE_STATUSES and len(names) == len(args):
        for i in range(len(args)):
            probe = list(args[:i + 1]) + [
                given if example is None else example
                for given, example in zip(args[i + 1:], examples[i + 1:])]
            if _probe_status(cname, probe) == status:
                return names[i], args[i]
    if status == ERR_ARG and len(names) == len(args):
        enums = [n for n, e in zip(names, examples) if e is None]
        if len(enums) == 1:
            return enums[0], args[names.index(enums[0])]
    return None, None


def _number(value, argument, cname, function):
    """A numeric input as float: int, float and numpy numbers; bool, None,
    pd.NA, strings and the like raise a TypeError naming the argument."""
    if value.__class__ is float:
        return value
    if (isinstance(value, numbers.Real) and not isinstance(value, bool)
            and type(value).__name__ != "bool_"):
        return float(value)
    accepted = _accepted_text(cname, argument)
    raise TypeError("%s: argument %s must be a number%s, not %r" % (
        function, argument, " (%s)" % accepted if accepted else "", value))


def _numbers(cname, pyname, args):
    """Every double input of a call through _number (enumerators, already
    converted by _enum, pass as they are)."""
    names = _ARGUMENTS.get(cname, ((), ()))
    argtypes = _PROTOTYPES[cname][1]
    out = list(args)
    for i, value in enumerate(args):
        if argtypes[i] is c_double and value.__class__ is not float:
            name = names[0][i] if i < len(names[0]) else "argument %d" % i
            out[i] = _number(value, name, cname, pyname)
    return out


def _call(cname, pyname, args, outs):
    """Call a C function with inputs and output objects; raise a
    NatremiaError naming the failing argument and its accepted range on
    any status but NTR_OK."""
    args = _numbers(cname, pyname, args)
    status = _fn(cname)(*args, *[ctypes.byref(o) for o in outs])
    if status != OK:
        detail = None
        if status == ERR_DOMAIN and cname in _ARGUMENTS:
            detail = ("the inputs are each in range, but the formula is not "
                      "defined for them together")
        argument, value = _blame(cname, args, status)
        raise NatremiaError(status, pyname, detail=detail, argument=argument,
                            value=value,
                            accepted=_accepted_text(cname, argument))


def _defer(*args):
    """Stand-in of an accelerated call: always leaves it to ctypes."""
    return None


def _fast(cname, signature):
    """The accelerated callable of a C function (natremia._speed), bound
    once at import to the function's address in the loaded library; or
    _defer when the accelerator is absent, switched off
    (NATREMIA_NO_SPEEDUP=1) or the library lacks the function."""
    try:
        fn = _fn(cname)
    except AttributeError:
        return _defer
    if _speed is None or os.environ.get("NATREMIA_NO_SPEEDUP"):
        return _ctypes_fast(fn, signature)
    return _speed.bind(ctypes.cast(fn, ctypes.c_void_p).value,
                       getattr(_speed, signature))


# Positions of the int input in each signature of natremia._speed.
_INT_POSITION = {"SIG_I_D1": 0, "SIG_I_D2": 0, "SIG_I_D3": 0, "SIG_D2_I": -1,
                 "SIG_D4_I": -1}


def _ctypes_fast(fn, signature):
    """The ctypes form of an accelerated call, for when natremia._speed is
    not built: the same contract (result, status, or None to defer), with
    the prototype bound once; only exact floats and ints (an int input
    within C int) are taken, so ctypes never wraps or coerces."""
    where = _INT_POSITION.get(signature)
    int_out = signature == "SIG_D1_OI"
    byref = ctypes.byref
    out_type = c_int if int_out else c_double

    def call(*args):
        for i, a in enumerate(args):
            cls = a.__class__
            if cls is float:
                if where is not None and (i == where or i - len(args) == where):
                    return None
            elif cls is int:
                if not _INT_MIN <= a <= _INT_MAX:
                    return None
            else:
                return None
        out = out_type()
        status = fn(*args, byref(out))
        return out.value if status == OK else status

    return call


def speedup_active() -> bool:
    """True when the scalar calls run through the compiled accelerator
    (natremia._speed) rather than ctypes alone."""
    return _speed is not None and not os.environ.get("NATREMIA_NO_SPEEDUP")


# ---------------------------------------------------------------------------
# C structures (layouts mirror include/natremia.h, which is ABI)
# ---------------------------------------------------------------------------

class SampleStruct(ctypes.Structure):
    _fields_ = [("hours", c_double), ("na_mmol_l", c_double)]


class LimitsStruct(ctypes.Structure):
    _fields_ = [("max_rise_24h", c_double), ("max_rise_48h", c_double),
                ("min_rise_24h", c_double)]


class CorrectionStruct(ctypes.Structure):
    _fields_ = [("rise_first_24h", c_double), ("max_rise_24h", c_double),
                ("max_rise_48h", c_double), ("last_rate_per_h", c_double),
                ("excess_mmol_l", c_double), ("flags", c_uint),
                ("reserved", c_uint)]


class FlowStruct(ctypes.Structure):
    _fields_ = [("volume_l", c_double), ("na_mmol_l", c_double),
                ("k_mmol_l", c_double)]


class TimedFlowStruct(ctypes.Structure):
    _fields_ = [("start_h", c_double), ("end_h", c_double),
                ("rate_ml_h", c_double), ("na_mmol_l", c_double),
                ("k_mmol_l", c_double), ("reserved", c_uint * 2)]


class PlanResultStruct(ctypes.Structure):
    _fields_ = [("course", CorrectionStruct), ("final_na_mmol_l", c_double),
                ("final_tbw_l", c_double), ("breach_24h_h", c_double),
                ("breach_48h_h", c_double), ("reserved_d", c_double * 2),
                ("points", c_uint), ("reserved", c_uint)]


WATCH_CAPACITY = 128


class WatchStruct(ctypes.Structure):
    """Opaque to Python; the layout only fixes its size and alignment."""
    _fields_ = [("private_u", c_uint * 8), ("limits", LimitsStruct),
                ("first", SampleStruct), ("prev", SampleStruct),
                ("last", SampleStruct), ("private_d", c_double * 6),
                ("ring", SampleStruct * WATCH_CAPACITY)]


class MethodInfoStruct(ctypes.Structure):
    _fields_ = [("method", c_int), ("reserved_int", c_int),
                ("name", c_char_p), ("equation", c_char_p),
                ("reference", c_char_p), ("population", c_char_p),
                ("reserved", c_char_p * 4)]


# ---------------------------------------------------------------------------
# Prototypes, declared on first use (so a library without some later
# function still serves every other one)
# ---------------------------------------------------------------------------

_D = c_double
_PD = _P(c_double)
_PI = _P(c_int)
_PU = _P(c_uint)
_PSZ = _P(c_size_t)

_PROTOTYPES = {
    "ntr_status_message": (c_char_p, [c_int]),
    "ntr_version_string": (c_char_p, []),
    "ntr_version_number": (ctypes.c_ulong, []),
    "ntr_unit_parse": (c_int, [c_char_p, _PI]),
    "ntr_convert": (c_int, [c_int, _D, c_int, c_int, _PD]),
    "ntr_osm_calculated": (c_int, [_D, _D, _D, _D, c_int, _PD]),
    "ntr_osm_effective": (c_int, [_D, _D, _PD]),
    "ntr_osm_gap": (c_int, [_D, _D, _PD]),
    "ntr_na_corrected_glucose": (c_int, [_D, _D, c_int, _PD]),
    "ntr_na_corrected_glucose_factor": (c_int, [_D, _D, _D, _PD]),
    "ntr_na_deficit": (c_int, [_D, _D, _D, _PD]),
    "ntr_tbw_fraction": (c_int, [c_int, _D, _D, _PD]),
    "ntr_tbw_watson": (c_int, [c_int, _D, _D, _D, _PD]),
    "ntr_free_water_deficit": (c_int, [_D, _D, _PD]),
    "ntr_fluid_preset": (c_int, [c_int, _PD, _PD]),
    "ntr_infusate_change_per_litre": (c_int, [_D, _D, _D, _D, _PD]),
    "ntr_infusate_change": (c_int, [_D, _D, _D, _D, _D, _PD]),
    "ntr_infusate_volume_for_change": (c_int, [_D, _D, _D, _D, _D, _PD]),
    "ntr_furst_ratio": (c_int, [_D, _D, _D, _PD]),
    "ntr_restriction_from_ratio": (c_int, [_D, _PI]),
    "ntr_efwc": (c_int, [_D, _D, _D, _D, _PD]),
    "ntr_na_severity": (c_int, [_D, _PI]),
    "ntr_tonicity_class": (c_int, [_D, _PI]),
    "ntr_low_na_tonicity": (c_int, [_D, _D, _D, c_int, _PI, _PU]),
    "ntr_low_na_effective_tonicity": (c_int, [_D, _D, _D, _D, _D, c_int, _PI,
                                              _PU]),
    "ntr_effective_osm_measured": (c_int, [_D, _D, _D, _D, _D, _PD]),
    "ntr_urine_maximally_dilute": (c_int, [_D, _PI]),
    "ntr_urine_na_high": (c_int, [_D, _PI]),
    "ntr_fractional_excretion": (c_int, [_D, _D, _D, _D, _PD]),
    "ntr_method_info": (c_int, [c_int, _P(MethodInfoStruct)]),
    "ntr_method_next": (c_int, [c_int, _PI]),
    "ntr_limits_preset": (c_int, [c_int, _P(LimitsStruct)]),
    "ntr_ods_risk": (c_int, [_D, c_int, c_int, c_int, c_int, _PI, _PU, _PU]),
    "ntr_correction_assess": (c_int, [_P(SampleStruct), c_size_t,
                                      _P(LimitsStruct), _P(CorrectionStruct)]),
    "ntr_watch_init": (c_int, [_P(LimitsStruct), _P(WatchStruct)]),
    "ntr_watch_push": (c_int, [_P(WatchStruct), _D, _D, _P(CorrectionStruct)]),
    "ntr_watch_result": (c_int, [_P(WatchStruct), _P(CorrectionStruct)]),
    "ntr_balance_predict": (c_int, [_D, _D, _P(FlowStruct), c_size_t, _PD, _PD]),
    "ntr_balance_course": (c_int, [_D, _D, _P(TimedFlowStruct), c_size_t, _D,
                                   _D, _P(SampleStruct), c_size_t, _PSZ]),
    "ntr_plan_check": (c_int, [_P(SampleStruct), c_size_t, _D,
                               _P(TimedFlowStruct), c_size_t, _D, _D,
                               _P(LimitsStruct), _P(PlanResultStruct)]),
    "ntr_relower_estimate": (c_int, [_D, _D, _D, _D, _D, _D, _D, _D, _D, _PD,
                                     _PD]),
    "ntr_urine_volume_from_solute": (c_int, [_D, _D, _PD]),
    "ntr_fluid_allowance": (c_int, [_D, _D, _D, _D, _D, _D, _PD]),
    "ntr_solute_dose_osmoles": (c_int, [c_int, _D, _PD]),
    "ntr_fe_uric_acid_class": (c_int, [_D, _PI]),
    "ntr_input_range": (c_int, [c_int, _PD, _PD]),
}

_declared = {}


def _fn(cname):
    """The C function, with its prototype declared."""
    fn = _declared.get(cname)
    if fn is None:
        try:
            fn = getattr(_lib, cname)
        except AttributeError:
            raise AttributeError(
                "%s is not in the loaded libnatremia (version %s); update the "
                "library" % (cname, version())) from None
        restype, argtypes = _PROTOTYPES[cname]
        fn.restype = restype
        fn.argtypes = argtypes
        _declared[cname] = fn
    return fn


def _lib_function(cname):
    """The raw CDLL attribute (used by natremia.arrays, which declares its
    own prototypes)."""
    return getattr(_lib, cname)


def _double_result(cname, pyname, *args):
    out = c_double()
    _call(cname, pyname, args, [out])
    return out.value


def _dbl(fast, cname, pyname, *args):
    """A double result: the accelerated call when it can take the
    arguments and succeeds, else the ctypes call that names any failure."""
    r = fast(*args)
    if r.__class__ is float:
        return r
    return _double_result(cname, pyname, *args)


# Accelerated callables, bound once at import (see _fast).
_FAST_OSM_EFFECTIVE = _fast("ntr_osm_effective", "SIG_D2")
_FAST_TBW_FRACTION = _fast("ntr_tbw_fraction", "SIG_I_D2")
_FAST_OSM_GAP = _fast("ntr_osm_gap", "SIG_D2")
_FAST_NA_CORRECTED_GLUCOSE_FACTOR = _fast("ntr_na_corrected_glucose_factor", "SIG_D3")
_FAST_NA_DEFICIT = _fast("ntr_na_deficit", "SIG_D3")
_FAST_TBW_WATSON = _fast("ntr_tbw_watson", "SIG_I_D3")
_FAST_FREE_WATER_DEFICIT = _fast("ntr_free_water_deficit", "SIG_D2")
_FAST_INFUSATE_CHANGE_PER_LITRE = _fast("ntr_infusate_change_per_litre", "SIG_D4")
_FAST_INFUSATE_CHANGE = _fast("ntr_infusate_change", "SIG_D5")
_FAST_INFUSATE_VOLUME_FOR_CHANGE = _fast("ntr_infusate_volume_for_change", "SIG_D5")
_FAST_FURST_RATIO = _fast("ntr_furst_ratio", "SIG_D3")
_FAST_EFWC = _fast("ntr_efwc", "SIG_D4")
_FAST_EFFECTIVE_OSM_MEASURED = _fast("ntr_effective_osm_measured", "SIG_D5")
_FAST_FRACTIONAL_EXCRETION = _fast("ntr_fractional_excretion", "SIG_D4")
_FAST_URINE_VOLUME_FROM_SOLUTE = _fast("ntr_urine_volume_from_solute", "SIG_D2")
_FAST_FLUID_ALLOWANCE = _fast("ntr_fluid_allowance", "SIG_D6")
_FAST_OSM_CALCULATED = _fast("ntr_osm_calculated", "SIG_D4_I")
_FAST_NA_CORRECTED_GLUCOSE = _fast("ntr_na_corrected_glucose", "SIG_D2_I")
_FAST_SOLUTE_DOSE_OSMOLES = _fast("ntr_solute_dose_osmoles", "SIG_I_D1")


# ---------------------------------------------------------------------------
# Enumerators: IntEnum members, their int values, or their names as strings
# ---------------------------------------------------------------------------

class Unit(enum.IntEnum):
    MMOL_L = 1
    MG_DL = 2
    MEQ_L = 3
    MOSM_KG = 4
    G_L = 5
    UMOL_L = 6


class Analyte(enum.IntEnum):
    SODIUM = 1
    POTASSIUM = 2
    CHLORIDE = 3
    GLUCOSE = 4
    UREA = 5
    UREA_NITROGEN = 6
    CREATININE = 7
    ETHANOL = 8
    OSMOLALITY = 9   # since 1.1 (mosm/kg only)
    URIC_ACID = 10   # since 1.1


class OsmFormula(enum.IntEnum):
    TWO_NA = 1
    DORWART_CHALMERS = 2


class GlucoseMethod(enum.IntEnum):
    KATZ = 1
    HILLIER = 2


class Sex(enum.IntEnum):
    MALE = 1
    FEMALE = 2


class Fluid(enum.IntEnum):
    NACL_0_9 = 1
    NACL_3 = 2
    NACL_5 = 3
    NACL_0_45 = 4
    RINGER_LACTATE = 5
    DEXTROSE_5 = 6
    NACL_0_2_DEXTROSE_5 = 7


class Restriction(enum.IntEnum):
    """Fluid restriction advice from the Furst ratio."""
    UNDER_1000_ML = 1
    FROM_500_TO_700_ML = 2
    UNDER_500_ML = 3


class LimitsPreset(enum.IntEnum):
    STANDARD = 1
    HIGH_RISK = 2


class CorrectionFlag(enum.IntFlag):
    """Bits of Correction.flags (NTR_CF_* in the C header)."""
    NONE = 0
    OVER_24H = 1
    OVER_48H = 2
    BELOW_TARGET = 4
    FALLING = 8
    NEAR_LIMIT = 16
    PROJECTED_OVER = 32
    RAPID_6H = 64


class OdsFactor(enum.IntFlag):
    """Risk factors for osmotic demyelination (NTR_ODS_* bits)."""
    NONE = 0
    NA_105 = 1
    LOW_K = 2
    ALCOHOL = 4
    MALNUTRITION = 8
    LIVER = 16


# Extra spellings accepted for string enumerators.
_ALIASES = {
    OsmFormula: {"2na": OsmFormula.TWO_NA, "2*na": OsmFormula.TWO_NA},
    Sex: {"m": Sex.MALE, "f": Sex.FEMALE},
    Unit: {"mmol/l": Unit.MMOL_L, "mg/dl": Unit.MG_DL, "meq/l": Unit.MEQ_L,
           "mosm/kg": Unit.MOSM_KG, "g/l": Unit.G_L, "umol/l": Unit.UMOL_L},
}


_INT_MIN, _INT_MAX = -2 ** 31, 2 ** 31 - 1
_NAME_CODES = {}  # (enumeration, string) -> code, filled on first use


# Spellings of sex the hot path maps without a call (others go to _enum).
_SEX_NAMES = {}
for _name, _code in (("male", 1), ("m", 1), ("female", 2), ("f", 2)):
    for _spelling in (_name, _name.upper(), _name.title()):
        _SEX_NAMES[_spelling] = _code
del _name, _code, _spelling


def _enum_names(cls):
    return ", ".join("%s (%d)" % (m.name.lower(), int(m)) for m in cls)


def _enum_name(cls, value, argname, function):
    key = value.strip().lower()
    alias = _ALIASES.get(cls, {}).get(key)
    if alias is not None:
        return int(alias)
    for member in cls:
        if member.name.lower() == key.replace("-", "_").replace(" ", "_"):
            return int(member)
    raise NatremiaError(ERR_ARG, function, "unknown %s %r" % (argname, value),
                        argument=argname, value=value,
                        accepted=_enum_names(cls))


def _exact_int(value, argname, function, accepted):
    """An integer code given exactly: a Python or numpy integer, or a float
    holding an integer exactly (2.0 from a pandas column). A bool or a
    non-integral number (1.9) raises TypeError; a code beyond C int (which
    ctypes would wrap: 2**32 + 2 becomes 2) raises NatremiaError
    (NTR_ERR_ARG). Both name the argument and what it accepts."""
    if isinstance(value, bool) or type(value).__name__ == "bool_":
        raise TypeError("%s: argument %s must be an integer code or a name, "
                        "not a bool (accepted: %s)" % (function, argname,
                                                       accepted))
    if isinstance(value, numbers.Integral):
        code = operator.index(value)
    elif (isinstance(value, numbers.Real) and math.isfinite(value)
          and float(value).is_integer()):
        code = int(value)
    else:
        raise TypeError("%s: argument %s must be an exact integer code or a "
                        "name, not %r (accepted: %s)" % (
                            function, argname, value, accepted))
    if not _INT_MIN <= code <= _INT_MAX:
        raise NatremiaError(ERR_ARG, function, "code %d is beyond C int"
                            % code, argument=argname, value=value,
                            accepted=accepted)
    return code


def _enum(cls, value, argname, function):
    """An enumerator as int: a member, an exact integer code (int, numpy
    integer, or a float holding an integer exactly), or a case-blind name.
    Anything else is refused: a non-integral number (1.9) or a bool with
    TypeError, a code the enumeration does not have (2**32 + 2, 7) with
    NatremiaError (a ValueError, status NTR_ERR_ARG); both name the
    argument and its accepted values."""
    if isinstance(value, str):
        code = _NAME_CODES.get((cls, value))
        if code is None:
            code = _NAME_CODES[(cls, value)] = _enum_name(cls, value, argname,
                                                          function)
        return code
    if isinstance(value, cls):
        return int(value)
    code = _exact_int(value, argname, function, _enum_names(cls))
    if code not in cls._value2member_map_:
        raise NatremiaError(ERR_ARG, function, "unknown %s code %d" % (
            argname, code), argument=argname, value=value,
            accepted=_enum_names(cls))
    return code


# ---------------------------------------------------------------------------
# Accepted ranges as the library states them (ntr_input_range, since 1.1)
# ---------------------------------------------------------------------------

class InputKind(enum.IntEnum):
    """Kinds of numeric input (NTR_INPUT_* in the C header)."""
    NA = 1
    GLUCOSE = 2
    UREA = 3
    ETHANOL = 4
    OSMOLALITY = 5
    AGE_FRACTION = 6
    AGE_WATSON = 7
    HEIGHT = 8
    WEIGHT = 9
    TBW = 10
    INFUSATE_NA = 11
    INFUSATE_K = 12
    VOLUME = 13
    DELTA = 14
    URINE_NA = 15
    URINE_K = 16
    URINE_VOLUME = 17
    URINE_OSM = 18
    RATIO = 19
    GLUCOSE_FACTOR = 20
    CONVERT_VALUE = 21
    HOURS = 22
    LIMIT = 23
    FLOW_RATE = 24
    URINE_RATE = 25
    PLAN_HOURS = 26
    PLAN_STEP = 27
    FLOW_VOLUME = 28
    URINE_ML = 29
    URIC_ACID = 30
    FE_PERCENT = 31
    FE_VALUE = 32
    SOLUTE_MOSM_DAY = 33
    INSENSIBLE_L_DAY = 34
    SOLUTE_GRAMS = 35
    INTAKE_L_DAY = 36
    RELOWER_MARGIN = 37
    INSENSIBLE_ML_H = 38
    CHANGE = 39


# The unit of each kind (the header's NTR_INPUT_* comments), and the two
# kinds whose lower end itself is refused.
_KIND_UNITS = {
    1: "mmol/L", 2: "mmol/L", 3: "mmol/L", 4: "mmol/L", 5: "mOsm/kg",
    6: "years", 7: "years", 8: "cm", 9: "kg", 10: "L", 11: "mmol/L",
    12: "mmol/L", 13: "L", 14: "mmol/L", 15: "mmol/L", 16: "mmol/L", 17: "L",
    18: "mOsm/kg", 19: "", 20: "mmol/L per 100 mg/dL", 21: "(its own unit)",
    22: "h", 23: "mmol/L", 24: "mL/h", 25: "mL/h", 26: "h", 27: "h", 28: "L",
    29: "mL", 30: "mmol/L", 31: "%", 32: "(any one unit per pair)",
    33: "mOsm/day", 34: "L/day", 35: "g", 36: "L/day", 37: "mmol/L",
    38: "mL/h", 39: "mmol/L",
}
_OPEN_MIN = frozenset({InputKind.INTAKE_L_DAY, InputKind.CHANGE})

InputRange = namedtuple("InputRange", "kind min max min_open unit")


def input_range(kind) -> InputRange:
    """The accepted range of one kind of numeric input.

    Parameters
    ----------
    kind : InputKind, int or str
        The kind (``InputKind.NA``, ``1`` or ``"na"``).

    Returns
    -------
    InputRange
        ``(kind, min, max, min_open, unit)``: both ends are accepted
        unless ``min_open`` (then only values above ``min``); read from the
        library (ntr_input_range), which checks every input against them.
    """
    code = _enum(InputKind, kind, "kind", "input_range")
    lo, hi = c_double(), c_double()
    _check(_fn("ntr_input_range")(code, ctypes.byref(lo), ctypes.byref(hi)),
           "input_range")
    return InputRange(InputKind(code), lo.value, hi.value, code in _OPEN_MIN,
                      _KIND_UNITS.get(code, ""))


_K = InputKind
# Argument name -> kind, for every name the scalar and array functions use;
# (C function, argument) overrides where one name means another kind.
_ARGUMENT_KINDS = {
    "na_mmol_l": _K.NA, "target_na_mmol_l": _K.NA, "serum_na_mmol_l": _K.NA,
    "baseline_na_mmol_l": _K.NA, "history_na_mmol_l": _K.NA,
    "glucose_mmol_l": _K.GLUCOSE, "urea_mmol_l": _K.UREA,
    "ethanol_mmol_l": _K.ETHANOL, "measured_mosm_kg": _K.OSMOLALITY,
    "calculated_mosm_kg": _K.OSMOLALITY, "measured_osm_mosm_kg": _K.OSMOLALITY,
    "age_years": _K.AGE_FRACTION, "height_cm": _K.HEIGHT,
    "weight_kg": _K.WEIGHT, "tbw_l": _K.TBW,
    "infusate_na_mmol_l": _K.INFUSATE_NA, "fluid_na_mmol_l": _K.INFUSATE_NA,
    "infusate_k_mmol_l": _K.INFUSATE_K, "fluid_k_mmol_l": _K.INFUSATE_K,
    "volume_l": _K.VOLUME, "target_delta_mmol_l": _K.DELTA,
    "urine_na_mmol_l": _K.URINE_NA, "urine_k_mmol_l": _K.URINE_K,
    "urine_volume_l": _K.URINE_VOLUME, "urine_osm_mosm_kg": _K.URINE_OSM,
    "ratio": _K.RATIO, "factor_per_100mg_dl": _K.GLUCOSE_FACTOR,
    "value": _K.CONVERT_VALUE, "hours": _K.HOURS,
    "history_hours": _K.HOURS, "lower_by_mmol_l": _K.CHANGE,
    "urine_ml_h": _K.URINE_RATE, "urine_x": _K.FE_VALUE,
    "plasma_x": _K.FE_VALUE, "urine_creatinine": _K.FE_VALUE,
    "plasma_creatinine": _K.FE_VALUE, "solute_mosm_day": _K.SOLUTE_MOSM_DAY,
    "insensible_l_day": _K.INSENSIBLE_L_DAY, "grams": _K.SOLUTE_GRAMS,
    "fe_uric_acid_percent": _K.FE_PERCENT, "duration_h": _K.PLAN_HOURS,
    "step_h": _K.PLAN_STEP, "limits.": _K.LIMIT, "horizon_h": _K.PLAN_HOURS,
}
_ARGUMENT_KIND_OVERRIDES = {
    ("ntr_tbw_watson", "age_years"): _K.AGE_WATSON,
    ("ntr_batch_tbw_watson", "age_years"): _K.AGE_WATSON,
    ("ntr_relower_estimate", "hours"): _K.PLAN_STEP,
}
del _K
_RANGE_CACHE = {}


def _accepted_for_name(argument):
    """The accepted range of an argument named the way errors name them:
    "na_mmol_l[2]" (a sample), "limits.max_fall_24h" (a limit), "tbw_l"."""
    base = re.sub(r"\[\d+\]", "", argument)
    if base.startswith("limits."):
        return _accepted_text(None, "limits.")
    return _accepted_text(None, base)


def _accepted_text(cname, argument):
    """'80 to 220 mmol/L' for an argument with a known kind, else None."""
    if argument is None:
        return None
    kind = _ARGUMENT_KIND_OVERRIDES.get((cname, argument),
                                        _ARGUMENT_KINDS.get(argument))
    if kind is None:
        return None
    text = _RANGE_CACHE.get(kind)
    if text is None:
        try:
            r = input_range(kind)
        except (AttributeError, NatremiaError):  # a library before 1.1
            return None
        text = "%s%g to %g%s (%s)" % ("above " if r.min_open else "", r.min,
                                       r.max, " " + r.unit if r.unit else "",
                                       "NTR_INPUT_" + r.kind.name)
        _RANGE_CACHE[kind] = text
    return text


# ---------------------------------------------------------------------------
# Version and provenance
# ---------------------------------------------------------------------------

def library_path() -> str:
    """Path (or soname) of the libnatremia this process loaded; see
    natremia._loader for the search order."""
    return _lib._name


def version():
    """The loaded library's version string, "MAJOR.MINOR.PATCH"."""
    return _fn("ntr_version_string")().decode("ascii")


MethodInfo = namedtuple("MethodInfo",
                        "method name equation reference population")


def method_info(method):
    """Name, equation, reference and population of an NTR_METHOD_* id."""
    info = MethodInfoStruct()
    _check(_fn("ntr_method_info")(int(method), ctypes.byref(info)),
           "method_info")
    return MethodInfo(info.method, info.name.decode(), info.equation.decode(),
                      info.reference.decode(), info.population.decode())


def methods():
    """Every method id the loaded library knows, in increasing order."""
    ids = []
    current = c_int(0)
    while _fn("ntr_method_next")(current.value, ctypes.byref(current)) == OK:
        ids.append(current.value)
    return ids


# ---------------------------------------------------------------------------
# Units
# ---------------------------------------------------------------------------

def unit_parse(ucum):
    """The Unit of a case-sensitive UCUM code such as "mmol/L"."""
    out = c_int()
    _check(_fn("ntr_unit_parse")(ucum.encode("ascii"), ctypes.byref(out)),
           "unit_parse")
    return Unit(out.value)


def _unit(value, function):
    if isinstance(value, str) and "/" in value:
        return int(unit_parse(value))  # exact UCUM codes first
    return _enum(Unit, value, "unit", function)


def convert(value: float, *, analyte: Union[Analyte, int, str], from_unit: Union[Unit, int, str], to_unit: Union[Unit, int, str]) -> float:
    """A laboratory value of an analyte converted between units.

    Units are Unit members, ints or UCUM codes ("mg/dL"); analytes are
    Analyte members, ints or names ("glucose").

    Parameters
    ----------
    analyte : Analyte, int or str
        One of sodium (1), potassium (2), chloride (3), glucose (4), urea (5), urea_nitrogen (6), creatinine (7), ethanol (8) (member, exact integer code, or
        name); other values raise.
    from_unit : Unit, int or str
        One of mmol_l (1), mg_dl (2), meq_l (3), mosm_kg (4), g_l (5), umol_l (6) (member, exact integer code, or
        name); other values raise.
    to_unit : Unit, int or str
        One of mmol_l (1), mg_dl (2), meq_l (3), mosm_kg (4), g_l (5), umol_l (6) (member, exact integer code, or
        name); other values raise.
    value : float
        The value given to ntr_convert(), in its own unit; accepted 0 to 1e+06 (its own unit) (NTR_INPUT_CONVERT_VALUE).

    Returns
    -------
    float
        As above (ntr_convert).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    fn = "convert"
    return _double_result("ntr_convert", fn, _enum(Analyte, analyte, "analyte", fn),
                          value, _unit(from_unit, fn), _unit(to_unit, fn))


# ---------------------------------------------------------------------------
# Core formulas
# ---------------------------------------------------------------------------

def osm_calculated(*, na_mmol_l: float, glucose_mmol_l: float, urea_mmol_l: float, ethanol_mmol_l: float = 0.0,
                   formula: Union[OsmFormula, int, str] = OsmFormula.TWO_NA) -> float:
    """Calculated serum osmolality, mOsm/kg ("2na" or "dorwart_chalmers").

    Parameters
    ----------
    na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    glucose_mmol_l : float
        Serum glucose, mmol/L; accepted 0 to 200 mmol/L (NTR_INPUT_GLUCOSE).
    urea_mmol_l : float
        Serum urea, mmol/L; accepted 0 to 200 mmol/L (NTR_INPUT_UREA).
    ethanol_mmol_l : float
        Serum ethanol, mmol/L; accepted 0 to 400 mmol/L (NTR_INPUT_ETHANOL).
    formula : OsmFormula, int or str
        One of two_na (1), dorwart_chalmers (2) (member, exact integer code, or
        name); other values raise.

    Returns
    -------
    float
        As above (ntr_osm_calculated).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    fn = "osm_calculated"
    return _dbl(_FAST_OSM_CALCULATED, "ntr_osm_calculated", fn, na_mmol_l, glucose_mmol_l,
                          urea_mmol_l, ethanol_mmol_l,
                          _enum(OsmFormula, formula, "formula", fn))


def osm_effective(*, na_mmol_l: float, glucose_mmol_l: float) -> float:
    """Effective osmolality (tonicity) 2*Na + glucose, mOsm/kg.

    Parameters
    ----------
    na_mmol_l : float
        Serum sodium, mmol/L (80 to 220).
    glucose_mmol_l : float
        Serum glucose, mmol/L (0 to 200).

    Returns
    -------
    float
        2 * na_mmol_l + glucose_mmol_l, mOsm/kg (ntr_osm_effective).

    Raises
    ------
    NatremiaError
        An input is not finite or out of range; names it and its range.
    TypeError
        An input is not a number.
    """
    # Hot path: one call of the bound accelerator; anything it does not
    # return as a float goes through ctypes, which names the failure.
    r = _FAST_OSM_EFFECTIVE(na_mmol_l, glucose_mmol_l)
    if r.__class__ is float:
        return r
    return _double_result("ntr_osm_effective", "osm_effective", na_mmol_l,
                          glucose_mmol_l)


def osm_gap(*, measured_mosm_kg: float, calculated_mosm_kg: float) -> float:
    """Osmolal gap, measured minus calculated, mOsm/kg.

    Parameters
    ----------
    measured_mosm_kg : float
        Serum osmolality, measured or calculated, mOsm/kg; accepted 150 to 600 mOsm/kg (NTR_INPUT_OSMOLALITY).
    calculated_mosm_kg : float
        Serum osmolality, measured or calculated, mOsm/kg; accepted 150 to 600 mOsm/kg (NTR_INPUT_OSMOLALITY).

    Returns
    -------
    float
        As above (ntr_osm_gap).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return _dbl(_FAST_OSM_GAP, "ntr_osm_gap", "osm_gap", measured_mosm_kg,
                          calculated_mosm_kg)


def na_corrected_glucose(*, na_mmol_l: float, glucose_mmol_l: float, method: Union[GlucoseMethod, int, str] = GlucoseMethod.KATZ) -> float:
    """Sodium corrected for hyperglycaemia ("katz" 1.6 or "hillier" 2.4).

    Parameters
    ----------
    na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    glucose_mmol_l : float
        Serum glucose, mmol/L; accepted 0 to 200 mmol/L (NTR_INPUT_GLUCOSE).
    method : GlucoseMethod, int or str
        One of katz (1), hillier (2) (member, exact integer code, or
        name); other values raise.

    Returns
    -------
    float
        As above (ntr_na_corrected_glucose).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    fn = "na_corrected_glucose"
    return _dbl(_FAST_NA_CORRECTED_GLUCOSE, "ntr_na_corrected_glucose", fn, na_mmol_l,
                          glucose_mmol_l,
                          _enum(GlucoseMethod, method, "method", fn))


def na_corrected_glucose_factor(*, na_mmol_l: float, glucose_mmol_l: float,
                                factor_per_100mg_dl: float) -> float:
    """Sodium corrected for hyperglycaemia with a caller's factor.

    Parameters
    ----------
    na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    glucose_mmol_l : float
        Serum glucose, mmol/L; accepted 0 to 200 mmol/L (NTR_INPUT_GLUCOSE).
    factor_per_100mg_dl : float
        Factor of ntr_na_corrected_glucose_factor(), mmol/L per 100 mg/dL; accepted 0 to 5 mmol/L per 100 mg/dL (NTR_INPUT_GLUCOSE_FACTOR).

    Returns
    -------
    float
        As above (ntr_na_corrected_glucose_factor).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return _dbl(_FAST_NA_CORRECTED_GLUCOSE_FACTOR, "ntr_na_corrected_glucose_factor", "na_corrected_glucose_factor", na_mmol_l,
                          glucose_mmol_l, factor_per_100mg_dl)


def na_deficit(*, tbw_l: float, na_mmol_l: float, target_na_mmol_l: float) -> float:
    """Sodium needed to reach a target, TBW*(target - Na), mmol.

    Parameters
    ----------
    tbw_l : float
        Total body water, L; accepted 0.1 to 400 L (NTR_INPUT_TBW).
    na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    target_na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).

    Returns
    -------
    float
        As above (ntr_na_deficit).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return _dbl(_FAST_NA_DEFICIT, "ntr_na_deficit", "na_deficit", tbw_l, na_mmol_l,
                          target_na_mmol_l)


def tbw_fraction(*, sex: Union[Sex, int, str], age_years: float,
                 weight_kg: float) -> float:
    """Total body water as a fraction of weight (Adrogue-Madias), L.

    Parameters
    ----------
    sex : Sex, int or str
        ``Sex.MALE`` (1) or ``Sex.FEMALE`` (2), or a name ("male", "f").
        Exact codes only: 1.9 or True raise TypeError.
    age_years : float
        Age, 1 to 130 years (child, adult and elderly bands).
    weight_kg : float
        Body weight, 0.3 to 650 kg.

    Returns
    -------
    float
        fraction * weight, L (ntr_tbw_fraction).

    Raises
    ------
    NatremiaError
        An unknown sex code or an input out of range; names the argument.
    TypeError
        A non-integral or bool sex, or a non-numeric input.
    """
    code = _SEX_NAMES.get(sex, 0) if sex.__class__ is str else sex
    r = _FAST_TBW_FRACTION(code, age_years, weight_kg)
    if r.__class__ is float:
        return r
    fn = "tbw_fraction"
    return _double_result("ntr_tbw_fraction", fn, _enum(Sex, sex, "sex", fn),
                          age_years, weight_kg)


def tbw_watson(*, sex: Union[Sex, int, str], age_years: float, height_cm: float, weight_kg: float) -> float:
    """Total body water by the Watson equations (adults), L.

    Parameters
    ----------
    sex : Sex, int or str
        One of male (1), female (2) (member, exact integer code, or
        name); other values raise.
    age_years : float
        Age in ntr_tbw_watson() (adults), years; accepted 18 to 130 years (NTR_INPUT_AGE_WATSON).
    height_cm : float
        Height, cm; accepted 30 to 275 cm (NTR_INPUT_HEIGHT).
    weight_kg : float
        Body weight, kg; accepted 0.3 to 650 kg (NTR_INPUT_WEIGHT).

    Returns
    -------
    float
        As above (ntr_tbw_watson).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    fn = "tbw_watson"
    return _dbl(_FAST_TBW_WATSON, "ntr_tbw_watson", fn, _enum(Sex, sex, "sex", fn),
                          age_years, height_cm, weight_kg)


def free_water_deficit(*, tbw_l: float, na_mmol_l: float) -> float:
    """Free-water deficit TBW*(Na/140 - 1), L.

    Parameters
    ----------
    tbw_l : float
        Total body water, L; accepted 0.1 to 400 L (NTR_INPUT_TBW).
    na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).

    Returns
    -------
    float
        As above (ntr_free_water_deficit).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return _dbl(_FAST_FREE_WATER_DEFICIT, "ntr_free_water_deficit", "free_water_deficit",
                          tbw_l, na_mmol_l)


FluidComposition = namedtuple("FluidComposition", "na_mmol_l k_mmol_l")


def fluid_preset(fluid):
    """Sodium and potassium of a common infusate (Fluid member or name)."""
    na, k = c_double(), c_double()
    fn = "fluid_preset"
    _check(_fn("ntr_fluid_preset")(_enum(Fluid, fluid, "fluid", fn),
                                   ctypes.byref(na), ctypes.byref(k)), fn)
    return FluidComposition(na.value, k.value)


def infusate_change_per_litre(*, na_mmol_l: float, tbw_l: float, infusate_na_mmol_l: float,
                              infusate_k_mmol_l: float = 0.0) -> float:
    """Change in serum sodium from 1 L of infusate (Adrogue-Madias), mmol/L.

    Parameters
    ----------
    na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    tbw_l : float
        Total body water, L; accepted 0.1 to 400 L (NTR_INPUT_TBW).
    infusate_na_mmol_l : float
        Sodium of an infusate or flow, mmol/L; accepted 0 to 1100 mmol/L (NTR_INPUT_INFUSATE_NA).
    infusate_k_mmol_l : float
        Potassium of an infusate or flow, mmol/L; accepted 0 to 400 mmol/L (NTR_INPUT_INFUSATE_K).

    Returns
    -------
    float
        As above (ntr_infusate_change_per_litre).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return _dbl(_FAST_INFUSATE_CHANGE_PER_LITRE, "ntr_infusate_change_per_litre", "infusate_change_per_litre", na_mmol_l, tbw_l,
                          infusate_na_mmol_l, infusate_k_mmol_l)


def infusate_change(*, na_mmol_l: float, tbw_l: float, infusate_na_mmol_l: float, volume_l: float,
                    infusate_k_mmol_l: float = 0.0) -> float:
    """Change in serum sodium from any volume of infusate, mmol/L.

    Parameters
    ----------
    na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    tbw_l : float
        Total body water, L; accepted 0.1 to 400 L (NTR_INPUT_TBW).
    infusate_na_mmol_l : float
        Sodium of an infusate or flow, mmol/L; accepted 0 to 1100 mmol/L (NTR_INPUT_INFUSATE_NA).
    volume_l : float
        Volume of one infusion, L; accepted 0 to 20 L (NTR_INPUT_VOLUME).
    infusate_k_mmol_l : float
        Potassium of an infusate or flow, mmol/L; accepted 0 to 400 mmol/L (NTR_INPUT_INFUSATE_K).

    Returns
    -------
    float
        As above (ntr_infusate_change).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return _dbl(_FAST_INFUSATE_CHANGE, "ntr_infusate_change", "infusate_change", na_mmol_l,
                          tbw_l, infusate_na_mmol_l, infusate_k_mmol_l,
                          volume_l)


def infusate_volume_for_change(*, na_mmol_l: float, tbw_l: float, infusate_na_mmol_l: float,
                               target_delta_mmol_l: float, infusate_k_mmol_l: float = 0.0) -> float:
    """Volume of infusate expected to change sodium by a target, L.

    Parameters
    ----------
    na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    tbw_l : float
        Total body water, L; accepted 0.1 to 400 L (NTR_INPUT_TBW).
    infusate_na_mmol_l : float
        Sodium of an infusate or flow, mmol/L; accepted 0 to 1100 mmol/L (NTR_INPUT_INFUSATE_NA).
    target_delta_mmol_l : float
        A wanted signed change of sodium, mmol/L; accepted -50 to 50 mmol/L (NTR_INPUT_DELTA).
    infusate_k_mmol_l : float
        Potassium of an infusate or flow, mmol/L; accepted 0 to 400 mmol/L (NTR_INPUT_INFUSATE_K).

    Returns
    -------
    float
        As above (ntr_infusate_volume_for_change).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return _dbl(_FAST_INFUSATE_VOLUME_FOR_CHANGE, "ntr_infusate_volume_for_change", "infusate_volume_for_change", na_mmol_l, tbw_l,
                          infusate_na_mmol_l, infusate_k_mmol_l,
                          target_delta_mmol_l)


def furst_ratio(*, urine_na_mmol_l: float, urine_k_mmol_l: float, serum_na_mmol_l: float) -> float:
    """The Furst ratio (U_Na + U_K) / S_Na.

    Parameters
    ----------
    urine_na_mmol_l : float
        Urine sodium, mmol/L; accepted 0 to 500 mmol/L (NTR_INPUT_URINE_NA).
    urine_k_mmol_l : float
        Urine potassium, mmol/L; accepted 0 to 300 mmol/L (NTR_INPUT_URINE_K).
    serum_na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).

    Returns
    -------
    float
        As above (ntr_furst_ratio).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return _dbl(_FAST_FURST_RATIO, "ntr_furst_ratio", "furst_ratio", urine_na_mmol_l,
                          urine_k_mmol_l, serum_na_mmol_l)


def restriction_from_ratio(ratio: float) -> Restriction:
    """Fluid restriction advice (a Restriction) for a Furst ratio.

    Parameters
    ----------
    ratio : float
        Furst ratio given to ntr_restriction_from_ratio(); accepted 0 to 20 (NTR_INPUT_RATIO).

    Returns
    -------
    Restriction
        As above (ntr_restriction_from_ratio).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    out = c_int()
    _call("ntr_restriction_from_ratio", "restriction_from_ratio", (ratio,),
          [out])
    return Restriction(out.value)


def efwc(*, urine_volume_l: float, urine_na_mmol_l: float, urine_k_mmol_l: float, serum_na_mmol_l: float) -> float:
    """Electrolyte-free water clearance V*(1 - (U_Na + U_K)/S_Na), L.

    Parameters
    ----------
    urine_volume_l : float
        Urine volume (in ntr_efwc(), a day's urine), L; accepted 0 to 30 L (NTR_INPUT_URINE_VOLUME).
    urine_na_mmol_l : float
        Urine sodium, mmol/L; accepted 0 to 500 mmol/L (NTR_INPUT_URINE_NA).
    urine_k_mmol_l : float
        Urine potassium, mmol/L; accepted 0 to 300 mmol/L (NTR_INPUT_URINE_K).
    serum_na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).

    Returns
    -------
    float
        As above (ntr_efwc).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return _dbl(_FAST_EFWC, "ntr_efwc", "efwc", urine_volume_l, urine_na_mmol_l,
                          urine_k_mmol_l, serum_na_mmol_l)


# ---------------------------------------------------------------------------
# Work-up of a low sodium
# ---------------------------------------------------------------------------

class Severity(enum.IntEnum):
    """Biochemical severity of a low sodium (NTR_SEVERITY_*)."""
    NONE = 0
    MILD = 1
    MODERATE = 2
    PROFOUND = 3


class Tonicity(enum.IntEnum):
    """Class of a measured serum osmolality (NTR_TONICITY_*)."""
    HYPOTONIC = 1
    ISOTONIC = 2
    HYPERTONIC = 3


class LowNaFlag(enum.IntFlag):
    """Bits from low_na_tonicity (NTR_LOW_NA_*)."""
    NONE = 0
    NOT_HYPOTONIC = 0x01
    PSEUDO = 0x02
    TRANSLOCATIONAL = 0x04
    GLUCOSE_EXPLAINS = 0x08
    DISCORDANT = 0x10
    INEFFECTIVE_OSMOLES = 0x20  # since 1.1: urea/ethanol hide a hypotonic state


def _int_result(cname, pyname, *args):
    out = c_int()
    _call(cname, pyname, args, [out])
    return out.value


def na_severity(*, na_mmol_l: float) -> Severity:
    """Severity band of a sodium (a Severity).

    Parameters
    ----------
    na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).

    Returns
    -------
    Severity
        As above (ntr_na_severity).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return Severity(_int_result("ntr_na_severity", "na_severity", na_mmol_l))


def tonicity_class(*, measured_osm_mosm_kg: float) -> Tonicity:
    """Hypo-, iso- or hypertonic measured osmolality (a Tonicity).

    Parameters
    ----------
    measured_osm_mosm_kg : float
        Serum osmolality, measured or calculated, mOsm/kg; accepted 150 to 600 mOsm/kg (NTR_INPUT_OSMOLALITY).

    Returns
    -------
    Tonicity
        As above (ntr_tonicity_class).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return Tonicity(_int_result("ntr_tonicity_class", "tonicity_class",
                                measured_osm_mosm_kg))


LowNaTonicity = namedtuple("LowNaTonicity", "tonicity flags")


def low_na_tonicity(*, na_mmol_l: float, glucose_mmol_l: float, measured_osm_mosm_kg: float,
                    glucose_method: Union[GlucoseMethod, int, str] = GlucoseMethod.KATZ) -> LowNaTonicity:
    """Whether a low sodium is truly hypotonic, and why not.

    Parameters
    ----------
    na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    glucose_mmol_l : float
        Serum glucose, mmol/L; accepted 0 to 200 mmol/L (NTR_INPUT_GLUCOSE).
    measured_osm_mosm_kg : float
        Serum osmolality, measured or calculated, mOsm/kg; accepted 150 to 600 mOsm/kg (NTR_INPUT_OSMOLALITY).
    glucose_method : GlucoseMethod, int or str
        One of katz (1), hillier (2) (member, exact integer code, or
        name); other values raise.

    Returns
    -------
    LowNaTonicity
        As above (ntr_low_na_tonicity).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    fn = "low_na_tonicity"
    tonicity, flags = c_int(), c_uint()
    _call("ntr_low_na_tonicity", fn,
          (na_mmol_l, glucose_mmol_l, measured_osm_mosm_kg,
           _enum(GlucoseMethod, glucose_method, "glucose_method", fn)),
          [tonicity, flags])
    return LowNaTonicity(Tonicity(tonicity.value), LowNaFlag(flags.value))


def low_na_effective_tonicity(*, na_mmol_l: float, glucose_mmol_l: float, urea_mmol_l: float,
                              measured_osm_mosm_kg: float, ethanol_mmol_l: float = 0.0,
                              glucose_method: Union[GlucoseMethod, int, str] = GlucoseMethod.KATZ) -> LowNaTonicity:
    """Whether a low sodium is truly hypotonic, judged on the effective
    measured osmolality (measured minus urea and ethanol, which cross cell
    membranes and so do not hold water out of cells): the library's
    ntr_low_na_effective_tonicity(). ``tonicity`` is the class of the
    effective value; ``flags`` has LowNaFlag.INEFFECTIVE_OSMOLES when the
    measured value is 275 or more but the effective one is below 275.
    Use it rather than low_na_tonicity() whenever urea or ethanol is known.

    Parameters
    ----------
    na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    glucose_mmol_l : float
        Serum glucose, mmol/L; accepted 0 to 200 mmol/L (NTR_INPUT_GLUCOSE).
    urea_mmol_l : float
        Serum urea, mmol/L; accepted 0 to 200 mmol/L (NTR_INPUT_UREA).
    measured_osm_mosm_kg : float
        Serum osmolality, measured or calculated, mOsm/kg; accepted 150 to 600 mOsm/kg (NTR_INPUT_OSMOLALITY).
    ethanol_mmol_l : float
        Serum ethanol, mmol/L; accepted 0 to 400 mmol/L (NTR_INPUT_ETHANOL).
    glucose_method : GlucoseMethod, int or str
        One of katz (1), hillier (2) (member, exact integer code, or
        name); other values raise.

    Returns
    -------
    LowNaTonicity
        As above (ntr_low_na_effective_tonicity).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    fn = "low_na_effective_tonicity"
    tonicity, flags = c_int(), c_uint()
    _call("ntr_low_na_effective_tonicity", fn,
          (na_mmol_l, glucose_mmol_l, urea_mmol_l, ethanol_mmol_l,
           measured_osm_mosm_kg,
           _enum(GlucoseMethod, glucose_method, "glucose_method", fn)),
          [tonicity, flags])
    return LowNaTonicity(Tonicity(tonicity.value), LowNaFlag(flags.value))


def effective_osm_measured(*, na_mmol_l: float, glucose_mmol_l: float, urea_mmol_l: float,
                           measured_osm_mosm_kg: float, ethanol_mmol_l: float = 0.0) -> float:
    """Effective serum osmolality from a measured one, mOsm/kg: measured
    less urea and the library's ethanol term, floored at the calculated
    effective osmolality (ntr_effective_osm_measured; the header gives the
    equation, the coefficient and why the floor).

    Parameters
    ----------
    na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    glucose_mmol_l : float
        Serum glucose, mmol/L; accepted 0 to 200 mmol/L (NTR_INPUT_GLUCOSE).
    urea_mmol_l : float
        Serum urea, mmol/L; accepted 0 to 200 mmol/L (NTR_INPUT_UREA).
    measured_osm_mosm_kg : float
        Serum osmolality, measured or calculated, mOsm/kg; accepted 150 to 600 mOsm/kg (NTR_INPUT_OSMOLALITY).
    ethanol_mmol_l : float
        Serum ethanol, mmol/L; accepted 0 to 400 mmol/L (NTR_INPUT_ETHANOL).

    Returns
    -------
    float
        As above (ntr_effective_osm_measured).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return _dbl(_FAST_EFFECTIVE_OSM_MEASURED, "ntr_effective_osm_measured", "effective_osm_measured",
                          na_mmol_l, glucose_mmol_l, urea_mmol_l,
                          ethanol_mmol_l, measured_osm_mosm_kg)


def urine_maximally_dilute(*, urine_osm_mosm_kg: float) -> bool:
    """True when the urine is maximally dilute.

    Parameters
    ----------
    urine_osm_mosm_kg : float
        Urine osmolality, mOsm/kg; accepted 10 to 2000 mOsm/kg (NTR_INPUT_URINE_OSM).

    Returns
    -------
    bool
        As above (ntr_urine_maximally_dilute).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return bool(_int_result("ntr_urine_maximally_dilute",
                            "urine_maximally_dilute", urine_osm_mosm_kg))


def urine_na_high(*, urine_na_mmol_l: float) -> bool:
    """True when urine sodium is above the work-up threshold.

    Parameters
    ----------
    urine_na_mmol_l : float
        Urine sodium, mmol/L; accepted 0 to 500 mmol/L (NTR_INPUT_URINE_NA).

    Returns
    -------
    bool
        As above (ntr_urine_na_high).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return bool(_int_result("ntr_urine_na_high", "urine_na_high",
                            urine_na_mmol_l))


def fractional_excretion(*, urine_x: float, plasma_x: float, urine_creatinine: float,
                         plasma_creatinine: float) -> float:
    """Fractional excretion of a solute, percent (each pair in one unit).

    Parameters
    ----------
    urine_x : float
        A concentration given to ntr_fractional_excretion(); accepted 0 to 1e+06 (any one unit per pair) (NTR_INPUT_FE_VALUE).
    plasma_x : float
        A concentration given to ntr_fractional_excretion(); accepted 0 to 1e+06 (any one unit per pair) (NTR_INPUT_FE_VALUE).
    urine_creatinine : float
        A concentration given to ntr_fractional_excretion(); accepted 0 to 1e+06 (any one unit per pair) (NTR_INPUT_FE_VALUE).
    plasma_creatinine : float
        A concentration given to ntr_fractional_excretion(); accepted 0 to 1e+06 (any one unit per pair) (NTR_INPUT_FE_VALUE).

    Returns
    -------
    float
        As above (ntr_fractional_excretion).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return _dbl(_FAST_FRACTIONAL_EXCRETION, "ntr_fractional_excretion", "fractional_excretion",
                          urine_x, plasma_x, urine_creatinine,
                          plasma_creatinine)


# ---------------------------------------------------------------------------
# Correction safety
# ---------------------------------------------------------------------------

@dataclass(frozen=True)
class Limits:
    """Limits on the rise of serum sodium, mmol/L."""
    max_rise_24h: float
    max_rise_48h: float
    min_rise_24h: float

    def _struct(self):
        return LimitsStruct(self.max_rise_24h, self.max_rise_48h,
                            self.min_rise_24h)


@dataclass(frozen=True)
class Correction:
    """What the assessment of a sodium series found (mmol/L, mmol/L/h)."""
    rise_first_24h: float
    max_rise_24h: float
    max_rise_48h: float
    last_rate_per_h: float
    excess_mmol_l: float
    flags: CorrectionFlag

    @classmethod
    def _from_struct(cls, s):
        return cls(s.rise_first_24h, s.max_rise_24h, s.max_rise_48h,
                   s.last_rate_per_h, s.excess_mmol_l, CorrectionFlag(s.flags))


def limits_preset(preset=LimitsPreset.STANDARD):
    """Preset limits ("standard" or "high_risk") as a Limits."""
    out = LimitsStruct()
    fn = "limits_preset"
    _check(_fn("ntr_limits_preset")(_enum(LimitsPreset, preset, "preset", fn),
                                    ctypes.byref(out)), fn)
    return Limits(out.max_rise_24h, out.max_rise_48h, out.min_rise_24h)


def _limits_struct(limits):
    """A LimitsStruct from a Limits, a preset (member, int or name), or a
    (max_24h, max_48h, min_24h) triple."""
    if isinstance(limits, Limits):
        return limits._struct()
    if isinstance(limits, (str, int, LimitsPreset)):
        return limits_preset(limits)._struct()
    return Limits(*limits)._struct()


OdsRisk = namedtuple("OdsRisk", "preset drivers unknowns")


def _tri(value):
    return {None: 0, False: 1, True: 2}[None if value is None else bool(value)]


def ods_risk(*, baseline_na_mmol_l, low_potassium=None, alcohol_use_disorder=None,
             malnutrition=None, advanced_liver_disease=None):
    """Whether the high-risk limits apply. Each factor is True (present),
    False (absent) or None (not known: counts as a risk)."""
    preset, drivers, unknowns = c_int(), c_uint(), c_uint()
    _check(_fn("ntr_ods_risk")(baseline_na_mmol_l, _tri(low_potassium),
                               _tri(alcohol_use_disorder), _tri(malnutrition),
                               _tri(advanced_liver_disease),
                               ctypes.byref(preset), ctypes.byref(drivers),
                               ctypes.byref(unknowns)), "ods_risk")
    return OdsRisk(LimitsPreset(preset.value), OdsFactor(drivers.value),
                   OdsFactor(unknowns.value))


def _samples(hours, na_mmol_l, function):
    hours = list(hours)
    na = list(na_mmol_l)
    if len(hours) != len(na):
        raise NatremiaError(ERR_ARG, function, "hours and na_mmol_l differ in "
                            "length (%d and %d)" % (len(hours), len(na)))
    array = (SampleStruct * max(len(hours), 1))()
    for i, (t, v) in enumerate(zip(hours, na)):
        array[i].hours = t
        array[i].na_mmol_l = v
    return array, len(hours)


def correction_assess(*, hours, na_mmol_l, limits=LimitsPreset.STANDARD):
    """Assess a measured sodium series (times in hours, non-decreasing)
    against correction limits; returns a Correction."""
    fn = "correction_assess"
    samples, n = _samples(hours, na_mmol_l, fn)
    lim = _limits_struct(limits)
    out = CorrectionStruct()
    _check(_fn("ntr_correction_assess")(samples, n, ctypes.byref(lim),
                                        ctypes.byref(out)), fn)
    return Correction._from_struct(out)


class Watch:
    """Streaming watcher: push one result at a time, get the assessment of
    the series so far (equal to correction_assess on the same samples)."""

    def __init__(self, limits=LimitsPreset.STANDARD):
        self._state = WatchStruct()
        lim = _limits_struct(limits)
        _check(_fn("ntr_watch_init")(ctypes.byref(lim),
                                     ctypes.byref(self._state)), "Watch")

    def push(self, *, hours, na_mmol_l):
        out = CorrectionStruct()
        _check(_fn("ntr_watch_push")(ctypes.byref(self._state), hours,
                                     na_mmol_l, ctypes.byref(out)),
               "Watch.push")
        return Correction._from_struct(out)

    def result(self):
        out = CorrectionStruct()
        _check(_fn("ntr_watch_result")(ctypes.byref(self._state),
                                       ctypes.byref(out)), "Watch.result")
        return Correction._from_struct(out)


# ---------------------------------------------------------------------------
# Balance and plans
# ---------------------------------------------------------------------------

Flow = namedtuple("Flow", "volume_l na_mmol_l k_mmol_l", defaults=(0.0,))
TimedFlow = namedtuple("TimedFlow", "start_h end_h rate_ml_h na_mmol_l k_mmol_l",
                       defaults=(0.0,))
BalanceResult = namedtuple("BalanceResult", "na_mmol_l tbw_l")


def balance_predict(*, na_mmol_l, tbw_l, flows):
    """Sodium and body water after gains (volume_l > 0) and losses (< 0);
    flows are Flow(volume_l, na_mmol_l, k_mmol_l) or plain triples."""
    flows = [Flow(*f) for f in flows]
    array = (FlowStruct * max(len(flows), 1))(*[FlowStruct(*f) for f in flows])
    na, tbw = c_double(), c_double()
    _check(_fn("ntr_balance_predict")(na_mmol_l, tbw_l, array, len(flows),
                                      ctypes.byref(na), ctypes.byref(tbw)),
           "balance_predict")
    return BalanceResult(na.value, tbw.value)


def _timed_flows(flows):
    flows = [TimedFlow(*f) for f in flows]
    array = (TimedFlowStruct * max(len(flows), 1))(
        *[TimedFlowStruct(f.start_h, f.end_h, f.rate_ml_h, f.na_mmol_l,
                          f.k_mmol_l) for f in flows])
    return array, len(flows)


def balance_course(*, na_mmol_l, tbw_l, flows, duration_h, step_h):
    """Predicted (hours, na_mmol_l) points under rate-based flows
    (TimedFlow(start_h, end_h, rate_ml_h, na_mmol_l, k_mmol_l))."""
    fn = "balance_course"
    array, n = _timed_flows(flows)
    count = c_size_t()
    status = _fn("ntr_balance_course")(na_mmol_l, tbw_l, array, n, duration_h,
                                       step_h, None, 0, ctypes.byref(count))
    if status not in (OK, ERR_CAPACITY):
        raise NatremiaError(status, fn)
    series = (SampleStruct * max(count.value, 1))()
    _check(_fn("ntr_balance_course")(na_mmol_l, tbw_l, array, n, duration_h,
                                     step_h, series, count.value,
                                     ctypes.byref(count)), fn)
    return [(series[i].hours, series[i].na_mmol_l) for i in range(count.value)]


@dataclass(frozen=True)
class PlanResult:
    course: Correction
    final_na_mmol_l: float
    final_tbw_l: float
    breach_24h_h: object  # hours after the plan starts, or None
    breach_48h_h: object
    points: int


def plan_check(*, history_hours, history_na_mmol_l, tbw_l, flows, duration_h,
               step_h, limits=LimitsPreset.STANDARD):
    """Check a fluid plan against the correction limits before giving it."""
    fn = "plan_check"
    history, n_history = _samples(history_hours, history_na_mmol_l, fn)
    array, n = _timed_flows(flows)
    lim = _limits_struct(limits)
    out = PlanResultStruct()
    _check(_fn("ntr_plan_check")(history, n_history, tbw_l, array, n,
                                 duration_h, step_h, ctypes.byref(lim),
                                 ctypes.byref(out)), fn)

    def breach(h):
        return None if h < 0 else h

    return PlanResult(Correction._from_struct(out.course), out.final_na_mmol_l,
                      out.final_tbw_l, breach(out.breach_24h_h),
                      breach(out.breach_48h_h), out.points)


RelowerEstimate = namedtuple("RelowerEstimate", "volume_l rate_ml_h")


def relower_estimate(*, na_mmol_l: float, tbw_l: float, fluid_na_mmol_l: float, lower_by_mmol_l: float,
                     hours: float, fluid_k_mmol_l: float = 0.0, urine_ml_h: float = 0.0,
                     urine_na_mmol_l: float = 0.0, urine_k_mmol_l: float = 0.0) -> RelowerEstimate:
    """Fluid needed to bring sodium back down by lower_by_mmol_l.

    Parameters
    ----------
    na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    tbw_l : float
        Total body water, L; accepted 0.1 to 400 L (NTR_INPUT_TBW).
    fluid_na_mmol_l : float
        Sodium of an infusate or flow, mmol/L; accepted 0 to 1100 mmol/L (NTR_INPUT_INFUSATE_NA).
    lower_by_mmol_l : float
        The size of a change (a fall, a rise aimed at, a lowering), mmol/L, above the lower end (0 itself is refused); accepted above 0 to 50 mmol/L (NTR_INPUT_CHANGE).
    hours : float
        Plan step, re-lowering or lowering period, h; accepted 0.0166667 to 720 h (NTR_INPUT_PLAN_STEP).
    fluid_k_mmol_l : float
        Potassium of an infusate or flow, mmol/L; accepted 0 to 400 mmol/L (NTR_INPUT_INFUSATE_K).
    urine_ml_h : float
        A urine (or saline) rate given alone, mL/h; accepted 0 to 5000 mL/h (NTR_INPUT_URINE_RATE).
    urine_na_mmol_l : float
        Urine sodium, mmol/L; accepted 0 to 500 mmol/L (NTR_INPUT_URINE_NA).
    urine_k_mmol_l : float
        Urine potassium, mmol/L; accepted 0 to 300 mmol/L (NTR_INPUT_URINE_K).

    Returns
    -------
    RelowerEstimate
        As above (ntr_relower_estimate).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    volume, rate = c_double(), c_double()
    _call("ntr_relower_estimate", "relower_estimate",
          (na_mmol_l, tbw_l, fluid_na_mmol_l, fluid_k_mmol_l, lower_by_mmol_l,
           hours, urine_ml_h, urine_na_mmol_l, urine_k_mmol_l), [volume, rate])
    return RelowerEstimate(volume.value, rate.value)


# ---------------------------------------------------------------------------
# Solute and fluid restriction (since 1.1)
# ---------------------------------------------------------------------------

class Solute(enum.IntEnum):
    """A solute given by mouth (NTR_SOLUTE_*)."""
    UREA = 1
    NACL = 2


def urine_volume_from_solute(*, solute_mosm_day: float, urine_osm_mosm_kg: float) -> float:
    """Daily urine volume, L/day, that a solute load makes at a fixed urine
    osmolality: V = solute / U_osm (Berl 2008).

    Parameters
    ----------
    solute_mosm_day : float
        Osmoles excreted per day, mOsm/day; accepted 0 to 10000 mOsm/day (NTR_INPUT_SOLUTE_MOSM_DAY).
    urine_osm_mosm_kg : float
        Urine osmolality, mOsm/kg; accepted 10 to 2000 mOsm/kg (NTR_INPUT_URINE_OSM).

    Returns
    -------
    float
        As above (ntr_urine_volume_from_solute).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return _dbl(_FAST_URINE_VOLUME_FROM_SOLUTE, "ntr_urine_volume_from_solute", "urine_volume_from_solute", solute_mosm_day,
                          urine_osm_mosm_kg)


def fluid_allowance(*, solute_mosm_day: float, urine_osm_mosm_kg: float, urine_na_mmol_l: float,
                    urine_k_mmol_l: float, serum_na_mmol_l: float, insensible_l_day: float = 0.0) -> float:
    """The most fluid per day, L/day, that does not lower the sodium:
    V * (1 - (U_Na + U_K) / S_Na) + insensible, V from the solute. A
    negative result means restriction alone cannot hold the sodium.

    Parameters
    ----------
    solute_mosm_day : float
        Osmoles excreted per day, mOsm/day; accepted 0 to 10000 mOsm/day (NTR_INPUT_SOLUTE_MOSM_DAY).
    urine_osm_mosm_kg : float
        Urine osmolality, mOsm/kg; accepted 10 to 2000 mOsm/kg (NTR_INPUT_URINE_OSM).
    urine_na_mmol_l : float
        Urine sodium, mmol/L; accepted 0 to 500 mmol/L (NTR_INPUT_URINE_NA).
    urine_k_mmol_l : float
        Urine potassium, mmol/L; accepted 0 to 300 mmol/L (NTR_INPUT_URINE_K).
    serum_na_mmol_l : float
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    insensible_l_day : float
        Net insensible loss, L/day; accepted 0 to 10 L/day (NTR_INPUT_INSENSIBLE_L_DAY).

    Returns
    -------
    float
        As above (ntr_fluid_allowance).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return _dbl(_FAST_FLUID_ALLOWANCE, "ntr_fluid_allowance", "fluid_allowance",
                          solute_mosm_day, urine_osm_mosm_kg, urine_na_mmol_l,
                          urine_k_mmol_l, serum_na_mmol_l, insensible_l_day)


def solute_dose_osmoles(*, solute: Union[Solute, int, str], grams: float) -> float:
    """Osmoles, mOsm, in a dose of urea (1 per mole) or NaCl (2 per mole),
    molar masses from the IUPAC atomic weights.

    Parameters
    ----------
    solute : Solute, int or str
        One of urea (1), nacl (2) (member, exact integer code, or
        name); other values raise.
    grams : float
        A daily dose of urea or NaCl, g; accepted 0 to 200 g (NTR_INPUT_SOLUTE_GRAMS).

    Returns
    -------
    float
        As above (ntr_solute_dose_osmoles).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return _dbl(_FAST_SOLUTE_DOSE_OSMOLES, "ntr_solute_dose_osmoles", "solute_dose_osmoles",
                          _enum(Solute, solute, "solute", "solute_dose_osmoles"), grams)


class FeUricAcidClass(enum.IntEnum):
    """Reading of the fractional uric acid excretion (NTR_FE_URIC_ACID_*)."""
    AGAINST_SIAD = 1
    INDETERMINATE = 2
    SUPPORTS_SIAD = 3


def fe_uric_acid_class(*, fe_uric_acid_percent: float) -> FeUricAcidClass:
    """Fractional uric acid excretion at the low sodium: below 8 % argues
    against SIAD, above 12 % supports it (Fenske 2008).

    Parameters
    ----------
    fe_uric_acid_percent : float
        A fractional excretion given as input, %; accepted 0 to 200 % (NTR_INPUT_FE_PERCENT).

    Returns
    -------
    FeUricAcidClass
        As above (ntr_fe_uric_acid_class).

    Raises
    ------
    NatremiaError
        An input not finite, out of its range or an unknown code, or
        inputs the formula is not defined for together; names the
        argument and its accepted range.
    TypeError
        An input that is not a number (or a non-integral code).
    """
    return FeUricAcidClass(_int_result("ntr_fe_uric_acid_class",
                                       "fe_uric_acid_class",
                                       fe_uric_acid_percent))
