#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""Cost of one Python scalar call of natremia against plain Python.

Side by side in one process, alternately, REPEATS rounds of CALLS calls
each; the fastest round of each contender is kept (wall-clock
perf_counter, on an otherwise idle core), reported per call in
microseconds and as a ratio to the plain-Python baseline:

- ``natremia``: natremia.osm_effective(na_mmol_l=140.0, glucose_mmol_l=5.0)
  and natremia.tbw_fraction(sex="female", age_years=40.0, weight_kg=70.0),
  the public functions as users call them;
- ``plain``: the same work in plain Python, the way a skilled user would
  write it without natremia: the same checks in the same order (finite,
  then range, the ranges of lib/ntr_internal.h; the enumeration mapped
  from its name), the same formula, a ValueError on failure;
- ``general path``: the binding's general ctypes route (what every call
  took before the hot path, natremia 1.1.0 as merged: prototype looked up
  per call, output allocated, status checked; now only taken to name a
  failure), for the before/after ratio;
- ``ctypes floor``: the bare ctypes call of the C function with prototypes
  bound once and a preallocated output (no checks, no keyword arguments):
  the least any ctypes binding can cost.

Results are checked equal before timing, so all did the same work.

Usage: bench_python_scalar.py [CALLS [REPEATS]]  -> table on stdout, and
JSON with --json. Needs NATREMIA_LIBRARY (or an installed library) and
bindings/python on PYTHONPATH, e.g.

    NATREMIA_LIBRARY=build/lib/libnatremia.so.1 PYTHONPATH=bindings/python \\
        /usr/bin/python3 tests/bench/bench_python_scalar.py 200000 7
"""
import ctypes
import json
import math
import sys
import time

import natremia
from natremia import _core

NA_MIN, NA_MAX = 80.0, 220.0       # lib/ntr_internal.h
GLUCOSE_MAX = 200.0
AGE_MIN, AGE_MAX = 1.0, 130.0      # NTR_TBW_FRACTION_AGE_MIN, NTR_AGE_MAX
WEIGHT_MIN, WEIGHT_MAX = 0.3, 650.0
SEXES = {"male": 1, "m": 1, "female": 2, "f": 2}


def _value(x, lo, hi, name):
    if not math.isfinite(x):
        raise ValueError("%s is not finite" % name)
    if not lo <= x <= hi:
        raise ValueError("%s outside %g..%g" % (name, lo, hi))


def plain_osm_effective(*, na_mmol_l, glucose_mmol_l):
    """2*Na + glucose with natremia's checks, in plain Python."""
    _value(na_mmol_l, NA_MIN, NA_MAX, "na_mmol_l")
    _value(glucose_mmol_l, 0.0, GLUCOSE_MAX, "glucose_mmol_l")
    return 2.0 * na_mmol_l + glucose_mmol_l


def plain_tbw_fraction(*, sex, age_years, weight_kg):
    """Adrogue-Madias fraction of weight with natremia's checks."""
    code = SEXES.get(sex.lower()) if isinstance(sex, str) else sex
    if code not in (1, 2):
        raise ValueError("sex")
    _value(age_years, AGE_MIN, AGE_MAX, "age_years")
    _value(weight_kg, WEIGHT_MIN, WEIGHT_MAX, "weight_kg")
    if age_years < 18.0:
        fraction = 0.6
    elif age_years < 65.0:
        fraction = 0.6 if code == 1 else 0.5
    else:
        fraction = 0.5 if code == 1 else 0.45
    return fraction * weight_kg


def _floor_functions():
    lib = ctypes.CDLL(natremia.library_path())
    d, pd = ctypes.c_double, ctypes.POINTER(ctypes.c_double)
    osm = lib.ntr_osm_effective
    osm.restype, osm.argtypes = ctypes.c_int, [d, d, pd]
    tbw = lib.ntr_tbw_fraction
    tbw.restype, tbw.argtypes = ctypes.c_int, [ctypes.c_int, d, d, pd]
    out = d()
    ref = ctypes.byref(out)

    def floor_osm_effective(na, glucose):
        osm(na, glucose, ref)
        return out.value

    def floor_tbw_fraction(sex, age, weight):
        tbw(sex, age, weight, ref)
        return out.value

    return floor_osm_effective, floor_tbw_fraction


def _round(fn, calls):
    start = time.perf_counter()
    for _ in range(calls):
        fn()
    return (time.perf_counter() - start) / calls * 1e6


def main(argv):
    as_json = "--json" in argv
    args = [a for a in argv if a != "--json"]
    calls = int(args[0]) if args else 200000
    repeats = int(args[1]) if len(args) > 1 else 7
    floor_osm, floor_tbw = _floor_functions()
    cases = {
        "osm_effective": {
            "natremia": lambda: natremia.osm_effective(na_mmol_l=140.0,
                                                       glucose_mmol_l=5.0),
            "plain": lambda: plain_osm_effective(na_mmol_l=140.0,
                                                 glucose_mmol_l=5.0),
            "general path": lambda: _core._double_result(
                "ntr_osm_effective", "osm_effective", 140.0, 5.0),
            "ctypes floor": lambda: floor_osm(140.0, 5.0),
        },
        "tbw_fraction": {
            "natremia": lambda: natremia.tbw_fraction(sex="female", age_years=40.0,
                                                      weight_kg=70.0),
            "plain": lambda: plain_tbw_fraction(sex="female", age_years=40.0,
                                                weight_kg=70.0),
            "general path": lambda: _core._double_result(
                "ntr_tbw_fraction", "tbw_fraction",
                _core._enum(natremia.Sex, "female", "sex", "tbw_fraction"),
                40.0, 70.0),
            "ctypes floor": lambda: floor_tbw(2, 40.0, 70.0),
        },
    }
    report = {}
    for name, contenders in cases.items():
        values = {k: f() for k, f in contenders.items()}
        assert len(set(values.values())) == 1, (name, values)
        best = {k: math.inf for k in contenders}
        for _ in range(repeats):
            for k, f in contenders.items():
                best[k] = min(best[k], _round(f, calls))
        report[name] = {k: round(v, 4) for k, v in best.items()}
        report[name]["ratio_to_plain"] = round(best["natremia"] / best["plain"], 3)
        report[name]["general_to_natremia"] = round(
            best["general path"] / best["natremia"], 2)
    if as_json:
        json.dump({"calls": calls, "repeats": repeats, "results": report},
                  sys.stdout, indent=1)
        print()
        return 0
    print("Python scalar call, best of %d rounds of %d calls (us per call)"
          % (repeats, calls))
    print("accelerator natremia._speed: %s" % (
        "on" if _core.speedup_active() else "off (ctypes only)"))
    print("%-14s %9s %9s %9s %9s %12s %12s" % (
        "function", "natremia", "plain", "general", "ctypes", "natremia/",
        "general/"))
    print("%-14s %9s %9s %9s %9s %12s %12s" % ("", "", "", "path", "floor",
                                               "plain", "natremia"))
    for name, r in report.items():
        print("%-14s %9.3f %9.3f %9.3f %9.3f %11.2fx %11.1fx" % (
            name, r["natremia"], r["plain"], r["general path"],
            r["ctypes floor"], r["ratio_to_plain"], r["general_to_natremia"]))
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
