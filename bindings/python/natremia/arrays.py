# SPDX-License-Identifier: MIT
"""Array API: the formulas over numpy arrays, one C batch call per function.

Arguments are keyword-only, as in the scalar API, and broadcast against
each other (a scalar infusate against a column of patients, say). The
result has the broadcast shape. No Python loop runs per row: the inputs are
made contiguous float64 (int32 for sex; no copy when they already are),
handed to an ntr_batch_* function, and its output array is returned. A
scalar input over many rows is not spread over a column: the call is made
block by block (_BLOCK rows) with the value written once. The exceptions are the 1.1 solute
functions at the end (no batch entry point in the library): they call the
scalar C function once per row.

Errors: with ``errors="raise"`` (the default) any failing row raises
NatremiaError naming the first failing row (flattened index) and the
number of failed rows. With ``errors="nan"`` failed rows hold NaN (0 for
integer results). ``with_status=True`` also returns the int32 array of
per-row C status codes (0 = NTR_OK).
"""

import ctypes
import math
from typing import Any

import numpy as np

from . import _core
from ._core import (NatremiaError, GlucoseMethod, LimitsPreset, OsmFormula,
                    Sex, _enum, _limits_struct)
from ._course import (CourseReportStruct, CourseLimitsStruct, CoursePreset,
                      _course_limits_struct, flag_labels)

_P = ctypes.POINTER
_PD = _P(ctypes.c_double)
_PI = _P(ctypes.c_int)
_PSZ = _P(ctypes.c_size_t)
_SIZE_MAX = ctypes.c_size_t(-1).value

# Anything numpy.asarray takes, a pandas Series, or a masked array.
ArrayLike = Any

# dtype of one ntr_correction (5 doubles, 2 unsigned ints: 48 bytes) and of
# one ntr_sample, laid out as the C structs.
CORRECTION_DTYPE = np.dtype([
    ("rise_first_24h", np.float64), ("max_rise_24h", np.float64),
    ("max_rise_48h", np.float64), ("last_rate_per_h", np.float64),
    ("excess_mmol_l", np.float64), ("flags", np.uint32),
    ("reserved", np.uint32)], align=True)
SAMPLE_DTYPE = np.dtype([("hours", np.float64), ("na_mmol_l", np.float64)],
                        align=True)
assert CORRECTION_DTYPE.itemsize == ctypes.sizeof(_core.CorrectionStruct)
assert SAMPLE_DTYPE.itemsize == ctypes.sizeof(_core.SampleStruct)

_declared = {}


def _batch_fn(cname, n_double_inputs, int_first=False, enum_arg=False,
              int_output=False):
    fn = _declared.get(cname)
    if fn is None:
        fn = _core._lib_function(cname)
        args = [ctypes.c_size_t]
        if int_first:
            args.append(_PI)
        args += [_PD] * n_double_inputs
        if enum_arg:
            args.append(ctypes.c_int)
        args += [_PI if int_output else _PD, _PI, _PSZ]
        # Pointers are passed as addresses (plain ints): cheaper than a
        # ctypes pointer object per argument, and offsets are simple.
        args = [ctypes.c_void_p if a in (_PI, _PD, _PSZ) else a for a in args]
        fn.argtypes = args
        fn.restype = ctypes.c_int
        _declared[cname] = fn
    return fn


def _ptr(array, ctype):
    return array.ctypes.data_as(_P(ctype))


def _finish(function, status_code, failed, out, status, shape, errors,
            with_status, blame=None):
    """Raise or return, following the errors / with_status choice.
    ``blame(row)`` names the argument that failed in a row (the scalar
    binding's rule) for the error message."""
    failed = failed if isinstance(failed, int) or failed is None else \
        (None if failed.value == _SIZE_MAX else failed.value)
    if failed is None:  # a call-level error: nothing was written
        raise NatremiaError(status_code, function)
    if failed and errors == "raise":
        row = int(np.flatnonzero(status)[0])
        argument = value = accepted = None
        if blame is not None:
            argument, value, accepted = blame(row, int(status[row]))
        raise NatremiaError(int(status[row]), function, row=row,
                            failed=int(failed), argument=argument,
                            value=value, accepted=accepted)
    out = out.reshape(shape)
    if with_status:
        return out, status.reshape(shape)
    return out


def _check_errors_choice(errors):
    if errors not in ("raise", "nan"):
        raise ValueError("errors must be 'raise' or 'nan', not %r" % (errors,))


# ---------------------------------------------------------------------------
# Inputs as they come from data frames: pandas Series (index kept, indexes
# must agree), masked arrays (masked rows fail), missing values (pd.NA,
# None, NaN: failed rows), enumerations as strings, categories or objects.
# ---------------------------------------------------------------------------

def _pandas():
    """pandas if it is already imported by the caller (never imported here:
    a Series can only come from a program that did)."""
    import sys
    return sys.modules.get("pandas")


def _is_series(value):
    pd = _pandas()
    return pd is not None and isinstance(value, pd.Series)


class _Frame:
    """What the inputs of one call share: the pandas index (when any input
    is a Series) and the mask of masked-array inputs."""

    def __init__(self, function):
        self.function = function
        self.index = None
        self.index_from = None
        self.masks = []

    def take_index(self, value, argument):
        if not _is_series(value):
            return
        if self.index is None:
            self.index, self.index_from = value.index, argument
        elif not self.index.equals(value.index):
            raise ValueError(
                "%s: the pandas indexes of %s and %s differ; natremia pairs "
                "rows by index and refuses to guess: align them first (for "
                "example columns of one DataFrame, or .reindex)"
                % (self.function, self.index_from, argument))

    def wrap(self, array, name=None):
        """The result as the inputs came: a Series on their index, a
        masked array under their mask, else the plain array."""
        if self.index is not None and array.ndim == 1 and \
                array.shape[0] == len(self.index):
            return _pandas().Series(array, index=self.index, name=name)
        if self.masks:
            mask = np.zeros(array.shape, dtype=bool)
            for m in self.masks:
                mask |= np.broadcast_to(m, array.shape)
            return np.ma.MaskedArray(array, mask=mask)
        return array


def _float_input(value, argument, frame):
    """An input as float64, missing values (pd.NA, None, NaT) as NaN, so
    that their rows fail with NTR_ERR_NONFINITE like any NaN."""
    frame.take_index(value, argument)
    if _is_series(value):
        if value.dtype.kind == "b" or str(value.dtype) == "boolean":
            raise TypeError("%s: argument %s is boolean, not numbers"
                            % (frame.function, argument))
        if value.dtype == np.float64:  # numpy-backed: missing is NaN already
            return value.to_numpy()  # no copy (na_value= would make one)
        try:
            return value.to_numpy(dtype=np.float64, na_value=np.nan)
        except (TypeError, ValueError):
            raise TypeError("%s: argument %s holds values that are not "
                            "numbers (dtype %s)" % (frame.function, argument,
                                                    value.dtype)) from None
    if isinstance(value, np.ma.MaskedArray):
        mask = np.ma.getmaskarray(value)
        frame.masks.append(mask)
        return np.where(mask, np.nan, np.ma.getdata(value).astype(np.float64))
    a = np.asarray(value)
    if a.dtype.kind == "b":
        raise TypeError("%s: argument %s is boolean, not numbers"
                        % (frame.function, argument))
    if a.dtype.kind == "O":
        return np.array([_missing_to_nan(v, argument, frame.function)
                         for v in a.ravel()], dtype=np.float64).reshape(a.shape)
    try:
        return a.astype(np.float64, copy=False)
    except (TypeError, ValueError):
        raise TypeError("%s: argument %s holds values that are not numbers "
                        "(dtype %s)" % (frame.function, argument, a.dtype)) \
            from None


def _is_missing(v):
    if v is None:
        return True
    pd = _pandas()
    if pd is not None and (v is pd.NA or v is pd.NaT):
        return True
    return isinstance(v, float) and v != v


def _missing_to_nan(v, argument, function):
    if _is_missing(v):
        return np.nan
    if isinstance(v, (bool, np.bool_)) or isinstance(v, str):
        raise TypeError("%s: argument %s holds %r, not a number"
                        % (function, argument, v))
    return float(v)


def _enum_input(value, cls, argument, frame):
    """An enumeration column as int32 codes: members, exact integer codes
    or names (strings, pandas string, category and object columns).
    Missing entries become 0, which the library refuses (NTR_ERR_ARG), so
    their rows fail; a non-integral number or a bool raises TypeError, a
    code beyond C int or an unknown name raises NatremiaError, both naming
    the argument."""
    f = frame.function
    frame.take_index(value, argument)
    mask = None
    if isinstance(value, np.ma.MaskedArray):
        mask = np.ma.getmaskarray(value)
        frame.masks.append(mask)
        value = np.ma.getdata(value)
    if _is_series(value):
        if str(value.dtype) == "category":
            cats = [_enum(cls, c, argument, f) for c in value.cat.categories]
            lookup = np.array(cats + [0], dtype=np.intc)  # code -1: missing
            return lookup[value.cat.codes.to_numpy()]
        value = value.to_numpy(dtype=object) if value.dtype.kind in "OUSb" or \
            str(value.dtype) in ("string", "boolean") or \
            value.hasnans else value.to_numpy()
    a = np.asarray(value)
    if a.dtype.kind == "b":
        raise TypeError("%s: argument %s is boolean, not codes (accepted: %s)"
                        % (f, argument, _core._enum_names(cls)))
    if a.dtype.kind in "USO":
        flat = a.ravel()
        codes = {}
        out = np.empty(flat.shape, dtype=np.intc)
        for i, v in enumerate(flat.tolist()):
            key = (type(v), v) if not _is_missing(v) else None
            code = codes.get(key)
            if code is None:
                code = codes[key] = 0 if key is None else \
                    _enum(cls, v, argument, f)
            out[i] = code
        out = out.reshape(a.shape)
    elif a.dtype.kind in "iu":
        # Only types wider than C int can hold a code beyond it; the check
        # reads the column once, without a widened copy.
        if a.size and np.iinfo(a.dtype).max > _core._INT_MAX and \
                (int(a.min()) < _core._INT_MIN or int(a.max()) > _core._INT_MAX):
            wide = a.astype(np.int64) if a.dtype != np.uint64 else a
            bad = wide[(wide < _core._INT_MIN) | (wide > _core._INT_MAX)][0]
            raise NatremiaError(_core.ERR_ARG, f, "code %d is beyond C int"
                                % bad, argument=argument, value=int(bad),
                                accepted=_core._enum_names(cls))
        out = a.astype(np.intc, copy=False)
    elif a.dtype.kind == "f":
        finite = np.isfinite(a)
        if not np.all(np.floor(a[finite]) == a[finite]):
            bad = a[finite][np.floor(a[finite]) != a[finite]][0]
            raise TypeError("%s: argument %s must hold exact integer codes, "
                            "not %r (accepted: %s)" % (
                                f, argument, float(bad),
                                _core._enum_names(cls)))
        if np.any(np.abs(a[finite]) > _core._INT_MAX):
            raise NatremiaError(_core.ERR_ARG, f, "a code is beyond C int",
                                argument=argument,
                                accepted=_core._enum_names(cls))
        out = np.where(finite, a, 0).astype(np.intc)
    else:
        raise TypeError("%s: argument %s must hold codes or names, not dtype "
                        "%s" % (f, argument, a.dtype))
    if mask is not None:
        out = np.where(mask, 0, out).astype(np.intc)
    return out


def _sex_array(sex, function):
    """Sex as int32 codes (kept for callers of 1.1.0; see _enum_input)."""
    return _enum_input(sex, Sex, "sex", _Frame(function))


def _input_names(cname):
    """Argument names of a batch function's numeric inputs, from the
    scalar binding's table (sex first when it has one)."""
    scalar = cname.replace("ntr_batch_", "ntr_")
    names, examples = _core._ARGUMENTS.get(scalar, ((), ()))
    return scalar, [n for n, e in zip(names, examples)
                    if e is not None or n == "sex"]


# Rows per C call when an input is one value for every row (a scalar, or a
# default such as ethanol 0): the value is written once into a block of this
# many rows and the batch function is called block by block, instead of
# being spread over a whole column (8 MB of fresh memory per million rows,
# which can cost more than the formula). Small enough to stay in the cache,
# large enough that the calls cost little next to the rows.
_BLOCK = 16384


def _broadcast(arrays):
    """The broadcast shape, and each array (as given, or as its broadcast
    view) with its own size. Arrays of one shape and 0-d scalars, the usual
    case, skip numpy's general broadcasting (a few microseconds per input);
    anything else goes through np.broadcast_arrays and its errors."""
    shapes = {a.shape for a in arrays if a.ndim}
    if len(shapes) <= 1:
        shape = shapes.pop() if shapes else ()
        return shape, [(a, a.size) for a in arrays]
    sizes = [a.size for a in arrays]
    views = np.broadcast_arrays(*arrays)
    return views[0].shape, list(zip(views, sizes))


def _batch_call(fn, n, columns, enum_value, out, status):
    """Call a batch function over n rows. ``columns`` are contiguous arrays
    of n rows, or blocks of _BLOCK rows holding one value (``const``).
    Returns (return code, failed rows, or None after a call-level error)."""
    failed = ctypes.c_size_t(_SIZE_MAX)
    failed_at = ctypes.addressof(failed)
    tail = [enum_value] if enum_value is not None else []
    if not any(const for _, const in columns):
        code = fn(n, *[c.ctypes.data for c, _ in columns], *tail,
                  out.ctypes.data, status.ctypes.data, failed_at)
        return code, (None if failed.value == _SIZE_MAX else failed.value)
    bases = [(c.ctypes.data, 0 if const else c.itemsize) for c, const in columns]
    out_at, out_size = out.ctypes.data, out.itemsize
    status_at, status_size = status.ctypes.data, status.itemsize
    first = 0
    total = 0
    for start in range(0, n, _BLOCK):
        rows = min(_BLOCK, n - start)
        failed.value = _SIZE_MAX
        code = fn(rows, *[at + start * size for at, size in bases], *tail,
                  out_at + start * out_size, status_at + start * status_size,
                  failed_at)
        if failed.value == _SIZE_MAX:  # call-level: the same for every block
            return code, None
        if code and not first:
            first = code
        total += failed.value
    return first, total


def _run(function, cname, inputs, *, sex=None, enum_value=None,
         int_output=False, errors="raise", with_status=False):
    """Broadcast, call the batch entry point (once, or block by block when
    a scalar input covers many rows), check the outcome."""
    _check_errors_choice(errors)
    scalar, names = _input_names(cname)
    value_names = names[1:] if sex is not None else names
    if len(value_names) != len(inputs):
        value_names = ["input %d" % i for i in range(len(inputs))]
    frame = _Frame(function)
    arrays = [_float_input(v, n, frame) for v, n in zip(inputs, value_names)]
    if sex is not None:
        arrays.insert(0, _enum_input(sex, Sex, "sex", frame))
    shape, arrays = _broadcast(arrays)
    n = math.prod(shape)
    columns = []  # (array, const): n rows, or a block of one value
    for i, (a, size) in enumerate(arrays):
        dtype = np.intc if sex is not None and i == 0 else np.float64
        if size == 1 and n > _BLOCK:
            columns.append((np.full(_BLOCK, a.flat[0], dtype=dtype), True))
        else:
            if a.shape != shape:
                a = np.broadcast_to(a, shape)
            columns.append((np.ascontiguousarray(a, dtype=dtype).ravel(), False))
    out = np.empty(n, dtype=np.intc if int_output else np.float64)
    status = np.empty(n, dtype=np.intc)
    fn = _batch_fn(cname, len(columns) - (sex is not None),
                   int_first=sex is not None,
                   enum_arg=enum_value is not None, int_output=int_output)
    code, failed = _batch_call(fn, n, columns, enum_value, out, status)

    def row_value(i, row):
        column, const = columns[i]
        return column[0] if const else column[row]

    def blame(row, row_status):
        """The argument that failed in one row, by the scalar rule."""
        first = 1 if sex is not None else 0
        row_args = [float(row_value(i, row)) for i in range(first, len(columns))]
        if sex is not None:
            sex_code = int(row_value(0, row))
            row_args.insert(0, sex_code)
        if enum_value is not None:
            row_args.append(enum_value)
        argument, value = _core._blame(scalar, row_args, row_status)
        if argument is None and sex is not None and row_status == _core.ERR_ARG:
            argument, value = "sex", sex_code
        if argument == "sex" and value == 0:
            value = "missing"  # a missing entry is passed as code 0
        accepted = (_core._enum_names(Sex) if argument == "sex" else
                    _core._accepted_text(cname, argument))
        return argument, value, accepted

    result = _finish(function, code, failed, out, status, shape, errors,
                     with_status, blame=blame)
    if with_status:
        return frame.wrap(result[0]), frame.wrap(result[1], "status")
    return frame.wrap(result)


# ---------------------------------------------------------------------------
# Formulas
# ---------------------------------------------------------------------------

def osm_calculated(*, na_mmol_l: ArrayLike, glucose_mmol_l: ArrayLike, urea_mmol_l: ArrayLike, ethanol_mmol_l: ArrayLike = 0.0,
                   formula: ArrayLike = OsmFormula.TWO_NA, errors: str = "raise", with_status: bool = False):
    """Calculated serum osmolality, mOsm/kg, per row.

    Parameters
    ----------
    na_mmol_l : array-like, pandas Series or scalar
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    glucose_mmol_l : array-like, pandas Series or scalar
        Serum glucose, mmol/L; accepted 0 to 200 mmol/L (NTR_INPUT_GLUCOSE).
    urea_mmol_l : array-like, pandas Series or scalar
        Serum urea, mmol/L; accepted 0 to 200 mmol/L (NTR_INPUT_UREA).
    ethanol_mmol_l : array-like, pandas Series or scalar
        Serum ethanol, mmol/L; accepted 0 to 400 mmol/L (NTR_INPUT_ETHANOL).
    formula : scalar of OsmFormula codes or names
        One of two_na (1), dorwart_chalmers (2); strings, pandas string, category
        and object columns are taken; missing entries fail their row.
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    f = "arrays.osm_calculated"
    return _run(f, "ntr_batch_osm_calculated",
                [na_mmol_l, glucose_mmol_l, urea_mmol_l, ethanol_mmol_l],
                enum_value=_enum(OsmFormula, formula, "formula", f),
                errors=errors, with_status=with_status)


def osm_effective(*, na_mmol_l: ArrayLike, glucose_mmol_l: ArrayLike, errors: str = "raise",
                  with_status: bool = False):
    """Effective osmolality 2*Na + glucose, mOsm/kg, per row.

    Parameters
    ----------
    na_mmol_l : array-like, pandas Series or scalar
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    glucose_mmol_l : array-like, pandas Series or scalar
        Serum glucose, mmol/L; accepted 0 to 200 mmol/L (NTR_INPUT_GLUCOSE).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    return _run("arrays.osm_effective", "ntr_batch_osm_effective",
                [na_mmol_l, glucose_mmol_l], errors=errors,
                with_status=with_status)


def osm_gap(*, measured_mosm_kg: ArrayLike, calculated_mosm_kg: ArrayLike, errors: str = "raise",
            with_status: bool = False):
    """Osmolal gap, mOsm/kg, per row.

    Parameters
    ----------
    measured_mosm_kg : array-like, pandas Series or scalar
        Serum osmolality, measured or calculated, mOsm/kg; accepted 150 to 600 mOsm/kg (NTR_INPUT_OSMOLALITY).
    calculated_mosm_kg : array-like, pandas Series or scalar
        Serum osmolality, measured or calculated, mOsm/kg; accepted 150 to 600 mOsm/kg (NTR_INPUT_OSMOLALITY).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    return _run("arrays.osm_gap", "ntr_batch_osm_gap",
                [measured_mosm_kg, calculated_mosm_kg], errors=errors,
                with_status=with_status)


def na_corrected_glucose(*, na_mmol_l: ArrayLike, glucose_mmol_l: ArrayLike, method: ArrayLike = GlucoseMethod.KATZ,
                         errors: str = "raise", with_status: bool = False):
    """Glucose-corrected sodium, mmol/L, per row.

    Parameters
    ----------
    na_mmol_l : array-like, pandas Series or scalar
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    glucose_mmol_l : array-like, pandas Series or scalar
        Serum glucose, mmol/L; accepted 0 to 200 mmol/L (NTR_INPUT_GLUCOSE).
    method : scalar of GlucoseMethod codes or names
        One of katz (1), hillier (2); strings, pandas string, category
        and object columns are taken; missing entries fail their row.
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    f = "arrays.na_corrected_glucose"
    return _run(f, "ntr_batch_na_corrected_glucose", [na_mmol_l, glucose_mmol_l],
                enum_value=_enum(GlucoseMethod, method, "method", f),
                errors=errors, with_status=with_status)


def na_deficit(*, tbw_l: ArrayLike, na_mmol_l: ArrayLike, target_na_mmol_l: ArrayLike, errors: str = "raise",
               with_status: bool = False):
    """Sodium deficit TBW*(target - Na), mmol, per row.

    Parameters
    ----------
    tbw_l : array-like, pandas Series or scalar
        Total body water, L; accepted 0.1 to 400 L (NTR_INPUT_TBW).
    na_mmol_l : array-like, pandas Series or scalar
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    target_na_mmol_l : array-like, pandas Series or scalar
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    return _run("arrays.na_deficit", "ntr_batch_na_deficit",
                [tbw_l, na_mmol_l, target_na_mmol_l], errors=errors,
                with_status=with_status)


def tbw_fraction(*, sex: ArrayLike, age_years: ArrayLike, weight_kg: ArrayLike, errors: str = "raise",
                 with_status: bool = False):
    """Total body water as a fraction of weight, L, per row (sex as codes
    1/2 or names).

    Parameters
    ----------
    sex : array-like or scalar of Sex codes or names
        One of male (1), female (2); strings, pandas string, category
        and object columns are taken; missing entries fail their row.
    age_years : array-like, pandas Series or scalar
        Age in ntr_tbw_fraction(), years; accepted 1 to 130 years (NTR_INPUT_AGE_FRACTION).
    weight_kg : array-like, pandas Series or scalar
        Body weight, kg; accepted 0.3 to 650 kg (NTR_INPUT_WEIGHT).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    return _run("arrays.tbw_fraction", "ntr_batch_tbw_fraction",
                [age_years, weight_kg], sex=sex, errors=errors,
                with_status=with_status)


def tbw_watson(*, sex: ArrayLike, age_years: ArrayLike, height_cm: ArrayLike, weight_kg: ArrayLike, errors: str = "raise",
               with_status: bool = False):
    """Watson total body water, L, per row.

    Parameters
    ----------
    sex : array-like or scalar of Sex codes or names
        One of male (1), female (2); strings, pandas string, category
        and object columns are taken; missing entries fail their row.
    age_years : array-like, pandas Series or scalar
        Age in ntr_tbw_watson() (adults), years; accepted 18 to 130 years (NTR_INPUT_AGE_WATSON).
    height_cm : array-like, pandas Series or scalar
        Height, cm; accepted 30 to 275 cm (NTR_INPUT_HEIGHT).
    weight_kg : array-like, pandas Series or scalar
        Body weight, kg; accepted 0.3 to 650 kg (NTR_INPUT_WEIGHT).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    return _run("arrays.tbw_watson", "ntr_batch_tbw_watson",
                [age_years, height_cm, weight_kg], sex=sex, errors=errors,
                with_status=with_status)


def free_water_deficit(*, tbw_l: ArrayLike, na_mmol_l: ArrayLike, errors: str = "raise", with_status: bool = False):
    """Free-water deficit, L, per row.

    Parameters
    ----------
    tbw_l : array-like, pandas Series or scalar
        Total body water, L; accepted 0.1 to 400 L (NTR_INPUT_TBW).
    na_mmol_l : array-like, pandas Series or scalar
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    return _run("arrays.free_water_deficit", "ntr_batch_free_water_deficit",
                [tbw_l, na_mmol_l], errors=errors, with_status=with_status)


def infusate_change_per_litre(*, na_mmol_l: ArrayLike, tbw_l: ArrayLike, infusate_na_mmol_l: ArrayLike,
                              infusate_k_mmol_l: ArrayLike = 0.0, errors: str = "raise",
                              with_status: bool = False):
    """Change in sodium from 1 L of infusate, mmol/L, per row.

    Parameters
    ----------
    na_mmol_l : array-like, pandas Series or scalar
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    tbw_l : array-like, pandas Series or scalar
        Total body water, L; accepted 0.1 to 400 L (NTR_INPUT_TBW).
    infusate_na_mmol_l : array-like, pandas Series or scalar
        Sodium of an infusate or flow, mmol/L; accepted 0 to 1100 mmol/L (NTR_INPUT_INFUSATE_NA).
    infusate_k_mmol_l : array-like, pandas Series or scalar
        Potassium of an infusate or flow, mmol/L; accepted 0 to 400 mmol/L (NTR_INPUT_INFUSATE_K).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    return _run("arrays.infusate_change_per_litre",
                "ntr_batch_infusate_change_per_litre",
                [na_mmol_l, tbw_l, infusate_na_mmol_l, infusate_k_mmol_l],
                errors=errors, with_status=with_status)


def infusate_change(*, na_mmol_l: ArrayLike, tbw_l: ArrayLike, infusate_na_mmol_l: ArrayLike, volume_l: ArrayLike,
                    infusate_k_mmol_l: ArrayLike = 0.0, errors: str = "raise", with_status: bool = False):
    """Change in sodium from a volume of infusate, mmol/L, per row.

    Parameters
    ----------
    na_mmol_l : array-like, pandas Series or scalar
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    tbw_l : array-like, pandas Series or scalar
        Total body water, L; accepted 0.1 to 400 L (NTR_INPUT_TBW).
    infusate_na_mmol_l : array-like, pandas Series or scalar
        Sodium of an infusate or flow, mmol/L; accepted 0 to 1100 mmol/L (NTR_INPUT_INFUSATE_NA).
    volume_l : array-like, pandas Series or scalar
        Volume of one infusion, L; accepted 0 to 20 L (NTR_INPUT_VOLUME).
    infusate_k_mmol_l : array-like, pandas Series or scalar
        Potassium of an infusate or flow, mmol/L; accepted 0 to 400 mmol/L (NTR_INPUT_INFUSATE_K).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    return _run("arrays.infusate_change", "ntr_batch_infusate_change",
                [na_mmol_l, tbw_l, infusate_na_mmol_l, infusate_k_mmol_l,
                 volume_l], errors=errors, with_status=with_status)


def infusate_volume_for_change(*, na_mmol_l: ArrayLike, tbw_l: ArrayLike, infusate_na_mmol_l: ArrayLike,
                               target_delta_mmol_l: ArrayLike, infusate_k_mmol_l: ArrayLike = 0.0,
                               errors: str = "raise", with_status: bool = False):
    """Volume of infusate for a wanted change, L, per row.

    Parameters
    ----------
    na_mmol_l : array-like, pandas Series or scalar
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    tbw_l : array-like, pandas Series or scalar
        Total body water, L; accepted 0.1 to 400 L (NTR_INPUT_TBW).
    infusate_na_mmol_l : array-like, pandas Series or scalar
        Sodium of an infusate or flow, mmol/L; accepted 0 to 1100 mmol/L (NTR_INPUT_INFUSATE_NA).
    target_delta_mmol_l : array-like, pandas Series or scalar
        A wanted signed change of sodium, mmol/L; accepted -50 to 50 mmol/L (NTR_INPUT_DELTA).
    infusate_k_mmol_l : array-like, pandas Series or scalar
        Potassium of an infusate or flow, mmol/L; accepted 0 to 400 mmol/L (NTR_INPUT_INFUSATE_K).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    return _run("arrays.infusate_volume_for_change",
                "ntr_batch_infusate_volume_for_change",
                [na_mmol_l, tbw_l, infusate_na_mmol_l, infusate_k_mmol_l,
                 target_delta_mmol_l], errors=errors, with_status=with_status)


def furst_ratio(*, urine_na_mmol_l: ArrayLike, urine_k_mmol_l: ArrayLike, serum_na_mmol_l: ArrayLike,
                errors: str = "raise", with_status: bool = False):
    """Furst ratio (U_Na + U_K)/S_Na per row.

    Parameters
    ----------
    urine_na_mmol_l : array-like, pandas Series or scalar
        Urine sodium, mmol/L; accepted 0 to 500 mmol/L (NTR_INPUT_URINE_NA).
    urine_k_mmol_l : array-like, pandas Series or scalar
        Urine potassium, mmol/L; accepted 0 to 300 mmol/L (NTR_INPUT_URINE_K).
    serum_na_mmol_l : array-like, pandas Series or scalar
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    return _run("arrays.furst_ratio", "ntr_batch_furst_ratio",
                [urine_na_mmol_l, urine_k_mmol_l, serum_na_mmol_l],
                errors=errors, with_status=with_status)


def restriction_from_ratio(ratio: ArrayLike, *, errors: str = "raise", with_status: bool = False):
    """Restriction codes (1, 2, 3 as natremia.Restriction; 0 in failed
    rows) per Furst ratio.

    Parameters
    ----------
    ratio : array-like, pandas Series or scalar
        Furst ratio given to ntr_restriction_from_ratio(); accepted 0 to 20 (NTR_INPUT_RATIO).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    return _run("arrays.restriction_from_ratio",
                "ntr_batch_restriction_from_ratio", [ratio], int_output=True,
                errors=errors, with_status=with_status)


def efwc(*, urine_volume_l: ArrayLike, urine_na_mmol_l: ArrayLike, urine_k_mmol_l: ArrayLike, serum_na_mmol_l: ArrayLike,
         errors: str = "raise", with_status: bool = False):
    """Electrolyte-free water clearance, L, per row.

    Parameters
    ----------
    urine_volume_l : array-like, pandas Series or scalar
        Urine volume (in ntr_efwc(), a day's urine), L; accepted 0 to 30 L (NTR_INPUT_URINE_VOLUME).
    urine_na_mmol_l : array-like, pandas Series or scalar
        Urine sodium, mmol/L; accepted 0 to 500 mmol/L (NTR_INPUT_URINE_NA).
    urine_k_mmol_l : array-like, pandas Series or scalar
        Urine potassium, mmol/L; accepted 0 to 300 mmol/L (NTR_INPUT_URINE_K).
    serum_na_mmol_l : array-like, pandas Series or scalar
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    return _run("arrays.efwc", "ntr_batch_efwc",
                [urine_volume_l, urine_na_mmol_l, urine_k_mmol_l,
                 serum_na_mmol_l], errors=errors, with_status=with_status)


# ---------------------------------------------------------------------------
# Correction assessment of many series at once
# ---------------------------------------------------------------------------

def _offsets_input(offsets, function):
    """CSR offsets as size_t: exact non-negative integers only (1.7, -1,
    bools and missing values raise, naming the argument)."""
    a = np.asarray(offsets)
    if a.dtype.kind == "b":
        raise TypeError("%s: argument offsets is boolean, not row offsets"
                        % function)
    if a.dtype.kind == "O":
        a = np.asarray(a.tolist())
    if a.dtype.kind == "f":
        if not np.all(np.isfinite(a)) or not np.all(np.floor(a) == a):
            bad = a[~np.isfinite(a) | (np.floor(a) != a)][0]
            raise TypeError("%s: argument offsets must hold exact integers, "
                            "not %r" % (function, float(bad)))
    elif a.dtype.kind not in "iu":
        raise TypeError("%s: argument offsets must hold integers, not dtype %s"
                        % (function, a.dtype))
    if a.size and a.min() < 0:
        raise NatremiaError(_core.ERR_ARG, function, "offsets must not be "
                            "negative", argument="offsets", value=int(a.min()))
    return np.ascontiguousarray(a, dtype=np.uintp).ravel()


def offsets_from_ids(ids):
    """CSR offsets (length groups + 1) of runs of equal ids in a grouped
    (for example sorted) id column; also returns the id of each group."""
    ids = np.asarray(ids)
    if ids.size == 0:
        return np.zeros(1, dtype=np.uintp), ids[:0]
    starts = np.flatnonzero(ids[1:] != ids[:-1]) + 1
    offsets = np.concatenate(([0], starts, [ids.size])).astype(np.uintp)
    return offsets, ids[offsets[:-1].astype(np.intp)]


def sort_series(ids, hours, na_mmol_l):
    """Rows sorted by (id, hours), stable: returns (ids, hours, na_mmol_l)
    ready for offsets_from_ids and correction_assess_groups."""
    ids = np.asarray(ids)
    hours = np.asarray(hours, dtype=np.float64)
    na = np.asarray(na_mmol_l, dtype=np.float64)
    order = np.lexsort((hours, ids))
    return ids[order], hours[order], na[order]


def correction_assess_groups(*, hours, na_mmol_l, offsets,
                             limits=LimitsPreset.STANDARD, errors="raise",
                             with_status=False):
    """Assess many sodium series in one C call (ntr_batch_correction_assess).

    Series g is rows offsets[g] to offsets[g+1] - 1 of ``hours`` and
    ``na_mmol_l`` (each series in non-decreasing time). Returns a numpy
    structured array with one record per series, fields rise_first_24h,
    max_rise_24h, max_rise_48h, last_rate_per_h, excess_mmol_l, flags
    (natremia.CorrectionFlag bits) and reserved; failed series hold NaN and
    flags 0. ``pandas.DataFrame(result)`` gives a table.
    """
    f = "arrays.correction_assess_groups"
    _check_errors_choice(errors)
    hours = np.asarray(hours, dtype=np.float64).ravel()
    na = np.asarray(na_mmol_l, dtype=np.float64).ravel()
    if hours.shape != na.shape:
        raise NatremiaError(_core.ERR_ARG, f, "hours and na_mmol_l differ in "
                            "length (%d and %d)" % (hours.size, na.size))
    offsets = _offsets_input(offsets, f)
    if offsets.size < 1:
        raise NatremiaError(_core.ERR_ARG, f, "offsets needs groups + 1 entries")
    samples = np.empty(hours.size, dtype=SAMPLE_DTYPE)
    samples["hours"] = hours
    samples["na_mmol_l"] = na
    groups = offsets.size - 1
    out = np.empty(groups, dtype=CORRECTION_DTYPE)
    status = np.empty(groups, dtype=np.intc)
    failed = ctypes.c_size_t(_SIZE_MAX)
    lim = _limits_struct(limits)
    fn = _declared.get("ntr_batch_correction_assess")
    if fn is None:
        fn = _core._lib_function("ntr_batch_correction_assess")
        fn.argtypes = [ctypes.c_size_t, _P(ctypes.c_size_t),
                       _P(_core.SampleStruct), ctypes.c_size_t,
                       _P(_core.LimitsStruct), _P(_core.CorrectionStruct),
                       _PI, _PSZ]
        fn.restype = ctypes.c_int
        _declared["ntr_batch_correction_assess"] = fn
    code = fn(groups, _ptr(offsets, ctypes.c_size_t),
              _ptr(samples, _core.SampleStruct), hours.size, ctypes.byref(lim),
              _ptr(out, _core.CorrectionStruct), _ptr(status, ctypes.c_int),
              ctypes.byref(failed))
    return _finish(f, code, failed, out, status, (groups,), errors, with_status)


# ---------------------------------------------------------------------------
# Course assessment in both directions, many series at once (natremia 1.1)
# ---------------------------------------------------------------------------

# One ntr_course_report per record, laid out as the C struct.
COURSE_REPORT_DTYPE = np.dtype(CourseReportStruct)


def _course_batch_fn():
    fn = _declared.get("ntr_batch_course_assess")
    if fn is None:
        fn = _core._lib_function("ntr_batch_course_assess")
        fn.argtypes = [ctypes.c_size_t, _P(ctypes.c_size_t),
                       _P(_core.SampleStruct), ctypes.c_size_t,
                       _P(CourseLimitsStruct), ctypes.c_size_t,
                       _P(CourseReportStruct), _PI, _PSZ]
        fn.restype = ctypes.c_int
        _declared["ntr_batch_course_assess"] = fn
    return fn


def _samples_array(hours, na, function):
    hours = np.asarray(hours, dtype=np.float64).ravel()
    na = np.asarray(na, dtype=np.float64).ravel()
    if hours.shape != na.shape:
        raise NatremiaError(_core.ERR_ARG, function, "hours and na_mmol_l "
                            "differ in length (%d and %d)" % (hours.size,
                                                              na.size),
                            argument="na_mmol_l")
    samples = np.empty(hours.size, dtype=SAMPLE_DTYPE)
    samples["hours"] = hours
    samples["na_mmol_l"] = na
    return samples


def course_assess_groups(*, hours, na_mmol_l, offsets, limits, errors="raise",
                         with_status=False):
    """Assess many sodium series in both directions in one C call
    (ntr_batch_course_assess).

    Series g is rows offsets[g] to offsets[g+1] - 1 (each in non-decreasing
    time). ``limits`` is a CourseLimits or a preset (CoursePreset member,
    int or name), the same for every series; course_assess_table() takes
    one per patient. Returns a numpy structured array (COURSE_REPORT_DTYPE:
    the fields of ntr_course_report); failed series hold NaN and flags 0.
    """
    f = "arrays.course_assess_groups"
    _check_errors_choice(errors)
    samples = _samples_array(hours, na_mmol_l, f)
    offsets = _offsets_input(offsets, f)
    if offsets.size < 1:
        raise NatremiaError(_core.ERR_ARG, f, "offsets needs groups + 1 "
                            "entries", argument="offsets")
    lim = _course_limits_struct(limits, f)
    groups = offsets.size - 1
    out = np.zeros(groups, dtype=COURSE_REPORT_DTYPE)
    out["struct_size"] = ctypes.sizeof(CourseReportStruct)
    status = np.empty(groups, dtype=np.intc)
    failed = ctypes.c_size_t(_SIZE_MAX)
    code = _course_batch_fn()(
        groups, _ptr(offsets, ctypes.c_size_t),
        _ptr(samples, _core.SampleStruct), samples.size, ctypes.byref(lim),
        COURSE_REPORT_DTYPE.itemsize, _ptr(out, CourseReportStruct),
        _ptr(status, ctypes.c_int),
        ctypes.byref(failed))
    if failed.value == _SIZE_MAX:
        raise NatremiaError(code, f, argument="offsets" if code ==
                            _core.ERR_ARG else None)
    return _finish(f, code, failed, out, status, (groups,), errors,
                   with_status)


def _plain(x):
    """A numpy scalar as a Python one; an object (a str id) as it is."""
    return x.item() if isinstance(x, np.generic) else x


def _limits_key(limits):
    """A hashable key for grouping patients by their limits."""
    if isinstance(limits, (str, int)):
        return ("preset", limits)
    return ("limits", limits)


def _factorize_limits(limits, n_rows, function):
    """(codes per row, distinct limits) for a per-row sequence of limits:
    vectorised for an array of preset names, a loop over the rows only
    for other objects (CourseLimits)."""
    a = np.asarray(limits) if not isinstance(limits, np.ndarray) else limits
    if a.shape != (n_rows,):
        raise NatremiaError(_core.ERR_ARG, function, "limits needs one entry "
                            "per row (%d, not %s)" % (n_rows, a.shape),
                            argument="limits")
    if a.dtype.kind in "US":
        distinct, codes = np.unique(a, return_inverse=True)
        return codes, [str(x) for x in distinct]
    index = {}
    distinct = []
    codes = np.empty(n_rows, dtype=np.intp)
    for i, lim in enumerate(limits):
        key = _limits_key(lim)
        code = index.get(key)
        if code is None:
            code = index[key] = len(distinct)
            distinct.append(lim)
        codes[i] = code
    return codes, distinct


def course_assess_table(*, ids, hours, na_mmol_l, limits, errors="nan"):
    """Assess a long table of (patient id, time, sodium) rows, one series
    per patient, in both directions; the patient ids are kept.

    Rows may come in any order: they are sorted by (id, hours), stably.
    ``limits`` is one CourseLimits or preset for the whole cohort, or a
    sequence with one per row (the same within a patient; a numpy array of
    preset names is handled without a Python loop), or a dict {id: limits}.
    Patients sharing limits go to the C batch together: one call of
    ntr_batch_course_assess per distinct limits. Returns a structured
    array: "id", "status" (0 = NTR_OK), then the fields of
    COURSE_REPORT_DTYPE, one record per patient in id order. With
    ``errors="raise"`` the first failing patient raises NatremiaError with
    its ``group_id``.
    """
    f = "arrays.course_assess_table"
    _check_errors_choice(errors)
    ids = np.asarray(ids).ravel()
    hours = np.asarray(hours, dtype=np.float64).ravel()
    na = np.asarray(na_mmol_l, dtype=np.float64).ravel()
    if not (ids.size == hours.size == na.size):
        raise NatremiaError(_core.ERR_ARG, f, "ids, hours and na_mmol_l "
                            "differ in length (%d, %d, %d)"
                            % (ids.size, hours.size, na.size), argument="ids")
    order = np.lexsort((hours, ids))
    ids, hours, na = ids[order], hours[order], na[order]
    offsets, group_ids = offsets_from_ids(ids)
    groups = group_ids.size
    counts = np.diff(offsets.astype(np.intp))
    firsts = offsets[:-1].astype(np.intp)

    # code of each patient's limits, and the distinct limits
    if isinstance(limits, dict):
        index, distinct = {}, []
        patient_code = np.empty(groups, dtype=np.intp)
        for g, pid in enumerate(group_ids.tolist()):
            if pid not in limits:
                raise NatremiaError(_core.ERR_ARG, f, "no limits for "
                                    "patient %r" % (pid,), argument="limits",
                                    group_id=pid)
            key = _limits_key(limits[pid])
            if key not in index:
                index[key] = len(distinct)
                distinct.append(limits[pid])
            patient_code[g] = index[key]
    elif isinstance(limits, (str, int)) or hasattr(limits, "_struct"):
        patient_code = np.zeros(groups, dtype=np.intp)
        distinct = [limits]
    else:
        codes, distinct = _factorize_limits(limits, ids.size, f)
        codes = codes[order]
        patient_code = codes[firsts] if groups else codes[:0]
        differs = codes != np.repeat(patient_code, counts)
        if differs.any():
            g = int(np.searchsorted(offsets, np.flatnonzero(differs)[0],
                                    side="right")) - 1
            raise NatremiaError(_core.ERR_ARG, f, "patient %r has rows with "
                                "different limits" % (_plain(group_ids[g]),),
                                argument="limits",
                                group_id=_plain(group_ids[g]))

    table = np.zeros(groups, dtype=[("id", group_ids.dtype),
                                    ("status", np.intc)] +
                     [(name, COURSE_REPORT_DTYPE.fields[name][0])
                      for name in COURSE_REPORT_DTYPE.names
                      if name not in ("struct_size", "reserved")])
    table["id"] = group_ids
    for code, lim in enumerate(distinct):
        members = patient_code == code
        if not members.any():
            continue
        rows = np.repeat(members, counts)
        sub_offsets = np.concatenate(([0], np.cumsum(counts[members])))
        out, status = course_assess_groups(
            hours=hours[rows], na_mmol_l=na[rows], offsets=sub_offsets,
            limits=lim, errors="nan", with_status=True)
        table["status"][members] = status
        for name in table.dtype.names[2:]:
            table[name][members] = out[name]
    bad = np.flatnonzero(table["status"])
    if bad.size and errors == "raise":
        g = int(bad[0])
        raise NatremiaError(int(table["status"][g]), f, row=g,
                            failed=int(bad.size),
                            group_id=_plain(table["id"][g]))
    return table


def _frame_hours(times, ids, column):
    """A time column as hours: numbers as they are; datetimes (naive or
    with a time zone) and timedeltas as hours since each patient's first
    sample, so no epoch enters the arithmetic (NTR_INPUT_HOURS); NaT as
    NaN, which fails that patient. Also returns each patient's first time
    (None for numeric hours)."""
    pd = _pandas()
    kind = times.dtype.kind
    if kind in "Mm" or isinstance(times.dtype, pd.DatetimeTZDtype):
        first = times.groupby(ids.to_numpy(), sort=False).transform("min")
        hours = ((times - first) / pd.Timedelta(hours=1)).to_numpy(
            dtype=np.float64, na_value=np.nan)
        starts = times.groupby(ids.to_numpy()).min() if kind == "M" or \
            isinstance(times.dtype, pd.DatetimeTZDtype) else None
        return hours, starts
    return _float_input(times, column, _Frame("arrays.course_assess_frame")), \
        None


def course_assess_frame(frame, *, id: str = "patient_id", hours: str = "hours",
                        na_mmol_l: str = "na_mmol_l", limits,
                        errors: str = "nan"):
    """Assess a long DataFrame of sodium results, one row per patient.

    Parameters
    ----------
    frame : pandas.DataFrame
        Long rows: one sodium result per row, any order.
    id : str
        Column of patient ids (kept as the result's index).
    hours : str
        Column of sample times: hours (numbers, any origin), or datetimes
        (``datetime64``, with or without a time zone) or timedeltas, taken
        as hours since each patient's first sample.
    na_mmol_l : str
        Column of serum sodium, mmol/L (80 to 220). Missing values
        (NaN, ``pd.NA``, ``None``) fail their patient (status
        NTR_ERR_NONFINITE) under ``errors="nan"``.
    limits : CourseLimits, CoursePreset, str, or column name
        One set of limits for everyone, or the name of a column holding
        each row's preset (the same within a patient).
    errors : {"nan", "raise"}
        "nan": failed patients get NaN fields and their status; "raise":
        the first failed patient raises NatremiaError with its id.

    Returns
    -------
    pandas.DataFrame
        Indexed by patient id: the status, the fields of
        ntr_course_report, "flag_names" (readable flags) and, for datetime
        times, "first_time" (the time hours count from).
    """
    import pandas as pd
    if isinstance(limits, str) and limits in frame.columns:
        limits = frame[limits].tolist()
    ids = frame[id]
    times, starts = _frame_hours(frame[hours], ids, hours)
    sodium = _float_input(frame[na_mmol_l], na_mmol_l,
                          _Frame("arrays.course_assess_frame"))
    table = course_assess_table(ids=ids.to_numpy(), hours=times,
                                na_mmol_l=sodium, limits=limits, errors=errors)
    result = pd.DataFrame({name: table[name] for name in table.dtype.names})
    result["flag_names"] = [flag_labels(x) for x in table["flags"]]
    result = result.set_index("id").rename_axis(id)
    if starts is not None:
        result["first_time"] = starts.reindex(result.index)
    return result


__all__ = [
    "CORRECTION_DTYPE", "SAMPLE_DTYPE", "osm_calculated", "osm_effective",
    "osm_gap", "na_corrected_glucose", "na_deficit", "tbw_fraction",
    "tbw_watson", "free_water_deficit", "infusate_change_per_litre",
    "infusate_change", "infusate_volume_for_change", "furst_ratio",
    "restriction_from_ratio", "efwc", "offsets_from_ids", "sort_series",
    "correction_assess_groups", "LimitsPreset", "COURSE_REPORT_DTYPE",
    "course_assess_groups", "course_assess_table", "course_assess_frame",
    "CoursePreset",
]


# ---------------------------------------------------------------------------
# Solute and restriction (since 1.1). The library has no batch entry point
# for these, so they loop over the rows in Python, one C call each; errors,
# broadcasting and with_status behave as for the batch functions above.
# ---------------------------------------------------------------------------

def _loop(function, cname, inputs, lead=(), errors="raise", with_status=False):
    _check_errors_choice(errors)
    frame = _Frame(function)
    _, names = _input_names(cname)
    names = [n for n in names if n != "solute"]
    if len(names) != len(inputs):
        names = ["input %d" % i for i in range(len(inputs))]
    arrays = np.broadcast_arrays(*[_float_input(v, n, frame)
                                   for v, n in zip(inputs, names)])
    shape = arrays[0].shape
    columns = [np.ascontiguousarray(a).ravel() for a in arrays]
    n = columns[0].size
    out = np.full(n, np.nan)
    status = np.zeros(n, dtype=np.intc)
    fn = _core._fn(cname)
    value = ctypes.c_double()
    for i in range(n):
        code = fn(*lead, *[float(c[i]) for c in columns], ctypes.byref(value))
        status[i] = code
        if code == _core.OK:
            out[i] = value.value
    failed = int(np.count_nonzero(status))
    if failed and errors == "raise":
        row = int(np.flatnonzero(status)[0])
        row_args = list(lead) + [float(c[row]) for c in columns]
        argument, value = _core._blame(cname, row_args, int(status[row]))
        raise NatremiaError(int(status[row]), function, row=row, failed=failed,
                            argument=argument, value=value,
                            accepted=_core._accepted_text(cname, argument))
    out = out.reshape(shape)
    if with_status:
        return frame.wrap(out), frame.wrap(status.reshape(shape), "status")
    return frame.wrap(out)


def urine_volume_from_solute(*, solute_mosm_day: ArrayLike, urine_osm_mosm_kg: ArrayLike,
                             errors: str = "raise", with_status: bool = False):
    """Daily urine volume, L/day: solute / U_osm (Berl 2008), per row.

    Parameters
    ----------
    solute_mosm_day : array-like, pandas Series or scalar
        Osmoles excreted per day, mOsm/day; accepted 0 to 10000 mOsm/day (NTR_INPUT_SOLUTE_MOSM_DAY).
    urine_osm_mosm_kg : array-like, pandas Series or scalar
        Urine osmolality, mOsm/kg; accepted 10 to 2000 mOsm/kg (NTR_INPUT_URINE_OSM).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    return _loop("urine_volume_from_solute", "ntr_urine_volume_from_solute",
                 [solute_mosm_day, urine_osm_mosm_kg], errors=errors,
                 with_status=with_status)


def fluid_allowance(*, solute_mosm_day: ArrayLike, urine_osm_mosm_kg: ArrayLike, urine_na_mmol_l: ArrayLike,
                    urine_k_mmol_l: ArrayLike, serum_na_mmol_l: ArrayLike, insensible_l_day: ArrayLike = 0.0,
                    errors: str = "raise", with_status: bool = False):
    """The most fluid per day that does not lower the sodium, L/day, per
    row (negative: restriction alone cannot hold it).

    Parameters
    ----------
    solute_mosm_day : array-like, pandas Series or scalar
        Osmoles excreted per day, mOsm/day; accepted 0 to 10000 mOsm/day (NTR_INPUT_SOLUTE_MOSM_DAY).
    urine_osm_mosm_kg : array-like, pandas Series or scalar
        Urine osmolality, mOsm/kg; accepted 10 to 2000 mOsm/kg (NTR_INPUT_URINE_OSM).
    urine_na_mmol_l : array-like, pandas Series or scalar
        Urine sodium, mmol/L; accepted 0 to 500 mmol/L (NTR_INPUT_URINE_NA).
    urine_k_mmol_l : array-like, pandas Series or scalar
        Urine potassium, mmol/L; accepted 0 to 300 mmol/L (NTR_INPUT_URINE_K).
    serum_na_mmol_l : array-like, pandas Series or scalar
        Serum sodium (also a target sodium), mmol/L; accepted 80 to 220 mmol/L (NTR_INPUT_NA).
    insensible_l_day : array-like, pandas Series or scalar
        Net insensible loss, L/day; accepted 0 to 10 L/day (NTR_INPUT_INSENSIBLE_L_DAY).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    return _loop("fluid_allowance", "ntr_fluid_allowance",
                 [solute_mosm_day, urine_osm_mosm_kg, urine_na_mmol_l,
                  urine_k_mmol_l, serum_na_mmol_l, insensible_l_day],
                 errors=errors, with_status=with_status)


def solute_dose_osmoles(*, solute: ArrayLike, grams: ArrayLike, errors: str = "raise", with_status: bool = False):
    """Osmoles, mOsm, of doses of one solute (urea or NaCl), per row.

    Parameters
    ----------
    solute : scalar of Solute codes or names
        One of urea (1), nacl (2); strings, pandas string, category
        and object columns are taken; missing entries fail their row.
    grams : array-like, pandas Series or scalar
        A daily dose of urea or NaCl, g; accepted 0 to 200 g (NTR_INPUT_SOLUTE_GRAMS).
    errors : {"raise", "nan"}
        "raise": any failed row raises NatremiaError naming the first
        failing row and argument; "nan": failed rows hold NaN.
    with_status : bool
        Also return the int32 per-row status (0 = NTR_OK).

    Returns
    -------
    numpy.ndarray, pandas.Series or numpy.ma.MaskedArray
        The broadcast shape; a Series on the inputs' index when any
        input is a Series, a masked array when any is masked (and the
        status alike with ``with_status=True``).

    Raises
    ------
    NatremiaError
        A failed row under ``errors="raise"``, or an unknown code.
    TypeError, ValueError
        Inputs that are not numbers or exact codes; Series whose
        indexes differ.
    """
    code = _enum(_core.Solute, solute, "solute", "solute_dose_osmoles")
    return _loop("solute_dose_osmoles", "ntr_solute_dose_osmoles", [grams],
                 lead=(code,), errors=errors, with_status=with_status)
