# SPDX-License-Identifier: MIT
"""Units as laboratory feeds send them (issue 13, library 1.1).

``unit_parse_lenient`` reads the unit spellings lab systems use (``mEq/L``,
``mg/dl``, ``mOsm/kg H2O``, ``µmol/L``; the C function
ntr_unit_parse_lenient() decides, docs/units.md lists every spelling and
every refusal). ``loinc_lookup`` maps a checked LOINC code to analyte,
specimen and unit (ntr_loinc_lookup()). ``glucose_unit_check`` converts a
glucose to mmol/L and refuses it when the sodium and the measured
osmolality contradict its unit (ntr_glucose_unit_check()).
``convert_array`` converts a column of values, one ntr_convert() call per
value (the library has no batch converter; the prototype is bound once).

Every result is an estimate for decision support, not an order. Verify
with measured values; follow local protocols and licensed clinical
judgement.
"""

import ctypes
import enum
from collections import namedtuple

from . import _core
from ._core import Analyte, NatremiaError, Unit

__all__ = ["Specimen", "LoincInfo", "ANALYTE_OSMOLALITY", "ANALYTE_URIC_ACID",
           "UNIT_TEXT_MAX", "unit_parse_lenient", "loinc_lookup",
           "glucose_unit_check", "convert_array"]

_PI = ctypes.POINTER(ctypes.c_int)
_PD = ctypes.POINTER(ctypes.c_double)

# Values fixed by issue 13 (include/natremia.h).
ANALYTE_OSMOLALITY = 9
ANALYTE_URIC_ACID = 10
UNIT_TEXT_MAX = 32  # NTR_UNIT_TEXT_MAX: longest unit text the parser reads

# Analyte names this module accepts beyond the Analyte enumeration.
_EXTRA_ANALYTES = {"osmolality": ANALYTE_OSMOLALITY,
                   "uric_acid": ANALYTE_URIC_ACID,
                   "uric acid": ANALYTE_URIC_ACID,
                   "urate": ANALYTE_URIC_ACID}
_ANALYTE_NAMES = {int(m): m.name.lower() for m in Analyte}
_ANALYTE_NAMES.update({ANALYTE_OSMOLALITY: "osmolality",
                       ANALYTE_URIC_ACID: "uric_acid"})


class Specimen(enum.IntEnum):
    """NTR_SPECIMEN_*: the system a LOINC code names."""
    SERUM_PLASMA = 1
    BLOOD = 2
    URINE = 3


LoincInfo = namedtuple("LoincInfo", "analyte analyte_name specimen unit")
LoincInfo.__doc__ = ("What a LOINC code means: analyte (int, NTR_ANALYTE_*), "
                     "its name, specimen (Specimen) and the unit its property "
                     "implies (Unit).")

_PROTOTYPES = {
    "ntr_unit_parse_lenient": (ctypes.c_int, [ctypes.c_char_p, _PI]),
    "ntr_loinc_lookup": (ctypes.c_int, [ctypes.c_char_p, _PI, _PI, _PI]),
    "ntr_glucose_unit_check": (ctypes.c_int, [ctypes.c_double, ctypes.c_int,
                                              ctypes.c_double, ctypes.c_double,
                                              _PD]),
    "ntr_convert": (ctypes.c_int, [ctypes.c_int, ctypes.c_double, ctypes.c_int,
                                   ctypes.c_int, _PD]),
}
_declared = {}


def _fn(cname):
    """The C function with its prototype, declared once."""
    fn = _declared.get(cname)
    if fn is None:
        try:
            fn = _core._lib_function(cname)
        except AttributeError:
            raise AttributeError(
                "%s is not in the loaded libnatremia (version %s); it needs "
                "1.1" % (cname, _core.version())) from None
        fn.restype, fn.argtypes = _PROTOTYPES[cname]
        _declared[cname] = fn
    return fn


def _text_bytes(text, argument, function):
    if isinstance(text, bytes):
        return text
    if not isinstance(text, str):
        raise NatremiaError(_core.ERR_ARG, function, "expected a string",
                            argument=argument, value=text)
    if "\0" in text:
        raise NatremiaError(_core.ERR_UNIT, function, "text holds a NUL",
                            argument=argument, value=text)
    return text.encode("utf-8")


def unit_parse_lenient(text):
    """The Unit of a unit text as lab feeds spell it.

    Parameters
    ----------
    text : str
        For example ``"mEq/L"``, ``"mmol/l"``, ``"MG/DL"``, ``"mOsm/kg H2O"``,
        ``"µmol/L"``; blanks around it are ignored. At most 32 bytes.

    Returns
    -------
    Unit

    Raises
    ------
    NatremiaError
        ERR_UNIT for anything not listed in docs/units.md, including the
        ambiguous ``"mOsm/L"`` (an osmolarity) and ``"Mmol/L"``.
    """
    fn = "unit_parse_lenient"
    out = ctypes.c_int()
    status = _fn("ntr_unit_parse_lenient")(_text_bytes(text, "text", fn),
                                            ctypes.byref(out))
    if status != _core.OK:
        raise NatremiaError(status, fn, "unit %r is not known (docs/units.md "
                            "lists the spellings read)" % (text,),
                            argument="text", value=text)
    return Unit(out.value)


def loinc_lookup(code):
    """Analyte, specimen and unit of a LOINC code checked against a
    published source.

    Parameters
    ----------
    code : str
        The code exactly, e.g. ``"2951-2"`` (no blanks, no prefix).

    Returns
    -------
    LoincInfo
        ``unit`` is the one the code's property implies (moles/volume
        mmol/L, mass/volume mg/dL): it names the kind, not the prefix the
        value comes with.

    Raises
    ------
    NatremiaError
        ERR_UNIT for a code not mapped (unknown, or not checked yet).
    """
    fn = "loinc_lookup"
    analyte, specimen, unit = ctypes.c_int(), ctypes.c_int(), ctypes.c_int()
    status = _fn("ntr_loinc_lookup")(_text_bytes(code, "code", fn),
                                      ctypes.byref(analyte),
                                      ctypes.byref(specimen), ctypes.byref(unit))
    if status != _core.OK:
        raise NatremiaError(status, fn, "LOINC code %r is not mapped "
                            "(docs/units.md lists the checked codes)" % (code,),
                            argument="code", value=code)
    return LoincInfo(analyte.value, _ANALYTE_NAMES.get(analyte.value, "?"),
                     Specimen(specimen.value), Unit(unit.value))


def _analyte(value, function):
    """An analyte as int: a member, an exact integer, or a name."""
    if isinstance(value, str):
        key = value.strip().lower()
        if key in _EXTRA_ANALYTES:
            return _EXTRA_ANALYTES[key]
        return _core._enum(Analyte, value, "analyte", function)
    if isinstance(value, bool) or not hasattr(value, "__index__"):
        raise NatremiaError(_core.ERR_ARG, function, "expected an analyte "
                            "member, an integer or a name", argument="analyte",
                            value=value)
    return int(value.__index__())  # exact integers only: 1.9 raises


def _unit(value, argument, function):
    """A unit: a Unit member, an int, or a text read leniently."""
    if isinstance(value, (str, bytes)):
        try:
            return int(unit_parse_lenient(value))
        except NatremiaError as exc:
            raise NatremiaError(exc.status, function, exc.detail,
                                argument=argument, value=value) from None
    if isinstance(value, bool) or not hasattr(value, "__index__"):
        raise NatremiaError(_core.ERR_UNIT, function, "expected a Unit member, "
                            "int or unit text", argument=argument, value=value)
    return int(value.__index__())


def glucose_unit_check(glucose, *, unit, na_mmol_l, measured_osm_mosm_kg=None):
    """Glucose in mmol/L, refused when it contradicts its unit.

    Parameters
    ----------
    glucose : float
        The glucose in ``unit``; 0 to 200 mmol/L once converted.
    unit : Unit, int or str
        mmol/L, mg/dL, g/L or umol/L (text read leniently).
    na_mmol_l : float
        Serum sodium, 80 to 220 mmol/L.
    measured_osm_mosm_kg : float or None
        Measured serum osmolality, 150 to 600 mOsm/kg; None (or 0) when
        not measured, in which case only values whose Dorwart-Chalmers
        floor 1.86*Na + g + 9 passes 600 can be refused.

    Returns
    -------
    float
        The glucose in mmol/L.

    Raises
    ------
    NatremiaError
        ERR_UNIT when the unit is not a glucose unit or the floor exceeds
        600 or the measured osmolality + 20 (the slip of a mg/dL value sent
        as mmol/L); ERR_RANGE / ERR_NONFINITE for an input out of range.
    """
    fn = "glucose_unit_check"
    osm = 0.0 if measured_osm_mosm_kg is None else float(measured_osm_mosm_kg)
    out = ctypes.c_double()
    status = _fn("ntr_glucose_unit_check")(float(glucose),
                                            _unit(unit, "unit", fn),
                                            float(na_mmol_l), osm,
                                            ctypes.byref(out))
    if status != _core.OK:
        detail = None
        if status == _core.ERR_UNIT:
            detail = ("the glucose does not fit unit %r with this sodium and "
                      "osmolality (or the unit is not a glucose unit)" % (unit,))
        raise NatremiaError(status, fn, detail)
    return out.value


def convert_array(analyte, values, from_unit, to_unit, *, errors="raise",
                  with_status=False):
    """Values of one analyte converted between units, element by element.

    Parameters
    ----------
    analyte : Analyte, int or str
        An Analyte member, its int, or a name (``"glucose"``,
        ``"uric_acid"``, ``"osmolality"``).
    values : array_like
        The values in ``from_unit``; each finite, 0 to 1e6.
    from_unit, to_unit : Unit, int or str
        Unit members, ints, or unit text read leniently (``"mg/dl"``).
    errors : {"raise", "nan"}
        "raise": NatremiaError naming the first failing element (flattened
        index) and the number that failed. "nan": failed elements are NaN.
    with_status : bool
        Also return the int array of per-element C status codes.

    Returns
    -------
    numpy.ndarray
        float64, the shape of ``values``.

    Raises
    ------
    NatremiaError
        ERR_ARG (unknown analyte) or ERR_UNIT (unknown unit, or one the
        analyte does not take) for the call, before any value is looked at;
        a failing value as described under ``errors``.
    """
    import numpy as np

    fn = "convert_array"
    if errors not in ("raise", "nan"):
        raise NatremiaError(_core.ERR_ARG, fn, 'errors must be "raise" or "nan"',
                            argument="errors", value=errors)
    code = _analyte(analyte, fn)
    source = _unit(from_unit, "from_unit", fn)
    target = _unit(to_unit, "to_unit", fn)
    c_convert = _fn("ntr_convert")
    result = ctypes.c_double()
    # The analyte and the units are the same for every element: a probe with
    # a valid value reports them once, naming the argument.
    status = c_convert(code, 1.0, source, target, ctypes.byref(result))
    if status == _core.ERR_ARG:
        raise NatremiaError(status, fn, argument="analyte", value=analyte)
    if status == _core.ERR_UNIT:
        alone = c_convert(code, 1.0, source, source, ctypes.byref(result))
        argument, given = (("to_unit", to_unit) if alone == _core.OK
                           else ("from_unit", from_unit))
        raise NatremiaError(status, fn, "unit does not fit the analyte",
                            argument=argument, value=given)
    array = np.asarray(values, dtype=np.float64)
    flat = np.ascontiguousarray(array).ravel()
    out = np.full(flat.size, np.nan)
    status_array = np.zeros(flat.size, dtype=np.intc)
    for i in range(flat.size):
        st = c_convert(code, float(flat[i]), source, target, ctypes.byref(result))
        status_array[i] = st
        if st == _core.OK:
            out[i] = result.value
    failed = int(np.count_nonzero(status_array))
    if failed and errors == "raise":
        row = int(np.flatnonzero(status_array)[0])
        raise NatremiaError(int(status_array[row]), fn, argument="values",
                            row=row, failed=failed)
    out = out.reshape(array.shape)
    if with_status:
        return out, status_array.reshape(array.shape)
    return out
