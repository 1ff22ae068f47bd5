"""Array API: the formulas over numpy arrays, one C batch call per function.

Arguments are keyword-only, as in the scalar API, and broadcast against
each other (a scalar infusate against a column of patients, say). The
result has the broadcast shape. No Python loop runs per row: the inputs are
made contiguous float64 (int32 for sex), handed to an ntr_batch_* function,
and its output array is returned. The exceptions are the 1.1 solute
functions at the end (no batch entry point in the library): they call the
scalar C function once per row.

Errors: with ``errors="raise"`` (the default) any failing row raises
NatremiaError naming the first failing row (flattened index) and the
number of failed rows. With ``errors="nan"`` failed rows hold NaN (0 for
integer results). ``with_status=True`` also returns the int32 array of
per-row C status codes (0 = NTR_OK).
"""

import ctypes

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
        fn.argtypes = args
        fn.restype = ctypes.c_int
        _declared[cname] = fn
    return fn


def _ptr(array, ctype):
    return array.ctypes.data_as(_P(ctype))


def _finish(function, status_code, failed, out, status, shape, errors,
            with_status):
    """Raise or return, following the errors / with_status choice."""
    if failed.value == _SIZE_MAX:  # a call-level error: nothing was written
        raise NatremiaError(status_code, function)
    if failed.value and errors == "raise":
        row = int(np.flatnonzero(status)[0])
        raise NatremiaError(int(status[row]), function, row=row,
                            failed=int(failed.value))
    out = out.reshape(shape)
    if with_status:
        return out, status.reshape(shape)
    return out


def _check_errors_choice(errors):
    if errors not in ("raise", "nan"):
        raise ValueError("errors must be 'raise' or 'nan', not %r" % (errors,))


def _sex_array(sex, function):
    """Sex as int32 codes; strings ("male", "f", ...) are mapped first."""
    a = np.asarray(sex)
    if a.dtype.kind in "US":
        codes = {name: _enum(Sex, name, "sex", function)
                 for name in np.unique(a).tolist()}
        mapped = np.empty(a.shape, dtype=np.intc)
        for name, code in codes.items():
            mapped[a == name] = code
        return mapped
    return a


def _run(function, cname, inputs, *, sex=None, enum_value=None,
         int_output=False, errors="raise", with_status=False):
    """Broadcast, call the batch entry point once, check the outcome."""
    _check_errors_choice(errors)
    arrays = [np.asarray(v, dtype=np.float64) for v in inputs]
    if sex is not None:
        arrays.insert(0, _sex_array(sex, function))
    arrays = np.broadcast_arrays(*arrays)
    shape = arrays[0].shape
    if sex is not None:
        sex_col = np.ascontiguousarray(arrays[0], dtype=np.intc).ravel()
        arrays = arrays[1:]
    columns = [np.ascontiguousarray(a, dtype=np.float64).ravel() for a in arrays]
    n = int(np.prod(shape, dtype=np.int64))
    out = np.empty(n, dtype=np.intc if int_output else np.float64)
    status = np.empty(n, dtype=np.intc)
    failed = ctypes.c_size_t(_SIZE_MAX)
    fn = _batch_fn(cname, len(columns), int_first=sex is not None,
                   enum_arg=enum_value is not None, int_output=int_output)
    args = [n]
    if sex is not None:
        args.append(_ptr(sex_col, ctypes.c_int))
    args += [_ptr(c, ctypes.c_double) for c in columns]
    if enum_value is not None:
        args.append(enum_value)
    args += [_ptr(out, ctypes.c_int if int_output else ctypes.c_double),
             _ptr(status, ctypes.c_int), ctypes.byref(failed)]
    code = fn(*args)
    return _finish(function, code, failed, out, status, shape, errors,
                   with_status)


# ---------------------------------------------------------------------------
# Formulas
# ---------------------------------------------------------------------------

def osm_calculated(*, na_mmol_l, glucose_mmol_l, urea_mmol_l, ethanol_mmol_l=0.0,
                   formula=OsmFormula.TWO_NA, errors="raise", with_status=False):
    """Calculated serum osmolality, mOsm/kg, per row."""
    f = "arrays.osm_calculated"
    return _run(f, "ntr_batch_osm_calculated",
                [na_mmol_l, glucose_mmol_l, urea_mmol_l, ethanol_mmol_l],
                enum_value=_enum(OsmFormula, formula, "formula", f),
                errors=errors, with_status=with_status)


def osm_effective(*, na_mmol_l, glucose_mmol_l, errors="raise",
                  with_status=False):
    """Effective osmolality 2*Na + glucose, mOsm/kg, per row."""
    return _run("arrays.osm_effective", "ntr_batch_osm_effective",
                [na_mmol_l, glucose_mmol_l], errors=errors,
                with_status=with_status)


def osm_gap(*, measured_mosm_kg, calculated_mosm_kg, errors="raise",
            with_status=False):
    """Osmolal gap, mOsm/kg, per row."""
    return _run("arrays.osm_gap", "ntr_batch_osm_gap",
                [measured_mosm_kg, calculated_mosm_kg], errors=errors,
                with_status=with_status)


def na_corrected_glucose(*, na_mmol_l, glucose_mmol_l, method=GlucoseMethod.KATZ,
                         errors="raise", with_status=False):
    """Glucose-corrected sodium, mmol/L, per row."""
    f = "arrays.na_corrected_glucose"
    return _run(f, "ntr_batch_na_corrected_glucose", [na_mmol_l, glucose_mmol_l],
                enum_value=_enum(GlucoseMethod, method, "method", f),
                errors=errors, with_status=with_status)


def na_deficit(*, tbw_l, na_mmol_l, target_na_mmol_l, errors="raise",
               with_status=False):
    """Sodium deficit TBW*(target - Na), mmol, per row."""
    return _run("arrays.na_deficit", "ntr_batch_na_deficit",
                [tbw_l, na_mmol_l, target_na_mmol_l], errors=errors,
                with_status=with_status)


def tbw_fraction(*, sex, age_years, weight_kg, errors="raise",
                 with_status=False):
    """Total body water as a fraction of weight, L, per row (sex as codes
    1/2 or names)."""
    return _run("arrays.tbw_fraction", "ntr_batch_tbw_fraction",
                [age_years, weight_kg], sex=sex, errors=errors,
                with_status=with_status)


def tbw_watson(*, sex, age_years, height_cm, weight_kg, errors="raise",
               with_status=False):
    """Watson total body water, L, per row."""
    return _run("arrays.tbw_watson", "ntr_batch_tbw_watson",
                [age_years, height_cm, weight_kg], sex=sex, errors=errors,
                with_status=with_status)


def free_water_deficit(*, tbw_l, na_mmol_l, errors="raise", with_status=False):
    """Free-water deficit, L, per row."""
    return _run("arrays.free_water_deficit", "ntr_batch_free_water_deficit",
                [tbw_l, na_mmol_l], errors=errors, with_status=with_status)


def infusate_change_per_litre(*, na_mmol_l, tbw_l, infusate_na_mmol_l,
                              infusate_k_mmol_l=0.0, errors="raise",
                              with_status=False):
    """Change in sodium from 1 L of infusate, mmol/L, per row."""
    return _run("arrays.infusate_change_per_litre",
                "ntr_batch_infusate_change_per_litre",
                [na_mmol_l, tbw_l, infusate_na_mmol_l, infusate_k_mmol_l],
                errors=errors, with_status=with_status)


def infusate_change(*, na_mmol_l, tbw_l, infusate_na_mmol_l, volume_l,
                    infusate_k_mmol_l=0.0, errors="raise", with_status=False):
    """Change in sodium from a volume of infusate, mmol/L, per row."""
    return _run("arrays.infusate_change", "ntr_batch_infusate_change",
                [na_mmol_l, tbw_l, infusate_na_mmol_l, infusate_k_mmol_l,
                 volume_l], errors=errors, with_status=with_status)


def infusate_volume_for_change(*, na_mmol_l, tbw_l, infusate_na_mmol_l,
                               target_delta_mmol_l, infusate_k_mmol_l=0.0,
                               errors="raise", with_status=False):
    """Volume of infusate for a wanted change, L, per row."""
    return _run("arrays.infusate_volume_for_change",
                "ntr_batch_infusate_volume_for_change",
                [na_mmol_l, tbw_l, infusate_na_mmol_l, infusate_k_mmol_l,
                 target_delta_mmol_l], errors=errors, with_status=with_status)


def furst_ratio(*, urine_na_mmol_l, urine_k_mmol_l, serum_na_mmol_l,
                errors="raise", with_status=False):
    """Furst ratio (U_Na + U_K)/S_Na per row."""
    return _run("arrays.furst_ratio", "ntr_batch_furst_ratio",
                [urine_na_mmol_l, urine_k_mmol_l, serum_na_mmol_l],
                errors=errors, with_status=with_status)


def restriction_from_ratio(ratio, *, errors="raise", with_status=False):
    """Restriction codes (1, 2, 3 as natremia.Restriction; 0 in failed
    rows) per Furst ratio."""
    return _run("arrays.restriction_from_ratio",
                "ntr_batch_restriction_from_ratio", [ratio], int_output=True,
                errors=errors, with_status=with_status)


def efwc(*, urine_volume_l, urine_na_mmol_l, urine_k_mmol_l, serum_na_mmol_l,
         errors="raise", with_status=False):
    """Electrolyte-free water clearance, L, per row."""
    return _run("arrays.efwc", "ntr_batch_efwc",
                [urine_volume_l, urine_na_mmol_l, urine_k_mmol_l,
                 serum_na_mmol_l], errors=errors, with_status=with_status)


# ---------------------------------------------------------------------------
# Correction assessment of many series at once
# ---------------------------------------------------------------------------

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
    offsets = np.ascontiguousarray(offsets, dtype=np.uintp).ravel()
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
    offsets = np.ascontiguousarray(offsets, dtype=np.uintp).ravel()
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
                                "different limits" % (group_ids[g].item(),),
                                argument="limits",
                                group_id=group_ids[g].item())

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
                            group_id=table["id"][g].item())
    return table


def course_assess_frame(frame, *, id="patient_id", hours="hours",
                        na_mmol_l="na_mmol_l", limits, errors="nan"):
    """course_assess_table() over a pandas DataFrame of long rows; returns
    a DataFrame indexed by patient id with the report fields, the status,
    and a "flag_names" column of readable flag names. ``limits`` may also
    name a column of the frame holding each row's preset."""
    import pandas as pd
    if isinstance(limits, str) and limits in frame.columns:
        limits = frame[limits].tolist()
    table = course_assess_table(ids=frame[id].to_numpy(),
                                hours=frame[hours].to_numpy(),
                                na_mmol_l=frame[na_mmol_l].to_numpy(),
                                limits=limits, errors=errors)
    result = pd.DataFrame({name: table[name] for name in table.dtype.names})
    result["flag_names"] = [flag_labels(x) for x in table["flags"]]
    return result.set_index("id").rename_axis(id)


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
    arrays = np.broadcast_arrays(*[np.asarray(v, dtype=np.float64)
                                   for v in inputs])
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
        raise NatremiaError(int(status[row]), function, row=row, failed=failed)
    out = out.reshape(shape)
    if with_status:
        return out, status.reshape(shape)
    return out


def urine_volume_from_solute(*, solute_mosm_day, urine_osm_mosm_kg,
                             errors="raise", with_status=False):
    """Daily urine volume, L/day: solute / U_osm (Berl 2008), per row."""
    return _loop("urine_volume_from_solute", "ntr_urine_volume_from_solute",
                 [solute_mosm_day, urine_osm_mosm_kg], errors=errors,
                 with_status=with_status)


def fluid_allowance(*, solute_mosm_day, urine_osm_mosm_kg, urine_na_mmol_l,
                    urine_k_mmol_l, serum_na_mmol_l, insensible_l_day=0.0,
                    errors="raise", with_status=False):
    """The most fluid per day that does not lower the sodium, L/day, per
    row (negative: restriction alone cannot hold it)."""
    return _loop("fluid_allowance", "ntr_fluid_allowance",
                 [solute_mosm_day, urine_osm_mosm_kg, urine_na_mmol_l,
                  urine_k_mmol_l, serum_na_mmol_l, insensible_l_day],
                 errors=errors, with_status=with_status)


def solute_dose_osmoles(*, solute, grams, errors="raise", with_status=False):
    """Osmoles, mOsm, of doses of one solute (urea or NaCl), per row."""
    code = _enum(_core.Solute, solute, "solute", "solute_dose_osmoles")
    return _loop("solute_dose_osmoles", "ntr_solute_dose_osmoles", [grams],
                 lead=(code,), errors=errors, with_status=with_status)
