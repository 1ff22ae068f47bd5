#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""Check natremia's unit conversion factors and its fixed enumerator values.

Usage: check_molar_masses.py LIBNATREMIA_SO NATREMIA_H

1. Molar masses. For every analyte, the molar mass is recomputed from the
   atomic weights in Debian's python3-periodictable and compared with the
   molar mass the built library implies: ntr_convert(analyte, 1, mg/dL ->
   mmol/L) returns 10/M (and g/L -> mmol/L returns 1000/M).

   Tolerance, relative: 1e-4. The library uses the abridged IUPAC standard
   atomic weights (H 1.008, C 12.011, N 14.007, O 15.999); periodictable
   1.6 carries the older IUPAC values (H 1.00794, C 12.0107, N 14.0067,
   O 15.9994). The largest relative difference of any element is hydrogen's,
   6.0e-5, and a molar mass is a positive weighted sum of atomic weights, so
   its relative difference cannot exceed that. A real mistake is far larger:
   one hydrogen atom too many or too few in the heaviest molecule
   (creatinine, 113 g/mol) is 8.9e-3, ninety times the tolerance.

   Uric acid (analyte 10, since 1.1) is checked the same way as the 1.0
   analytes; osmolality (analyte 9) has no molar mass and is checked to
   convert mosm/kg to itself and nothing else.

   The solute doses (issue P2) are checked the same way:
   ntr_solute_dose_osmoles(solute, 1 g) returns 1000 n / M mOsm, n the
   osmoles per mole (urea 1; NaCl 2, full dissociation), and M is compared
   with periodictable's CH4N2O and NaCl.

2. Enumerators. Every NTR_* value that issue P1 fixes as ABI is read from
   the public header and compared with the issue's table; the library's
   parser and its status messages are checked to agree with the header.

Exit status: 0 pass, 1 fail, 77 skip (python3-periodictable not installed).
"""
import ctypes
import re
import sys

try:
    import periodictable
except ImportError:
    print("SKIP: python3-periodictable is not installed (apt-get install python3-periodictable)")
    sys.exit(77)

RELATIVE_TOLERANCE = 1e-4

# Values fixed by issue P1 (ABI).
FIXED = {
    # status codes
    "NTR_OK": 0, "NTR_ERR_NULL": 1, "NTR_ERR_NONFINITE": 2, "NTR_ERR_RANGE": 3,
    "NTR_ERR_UNIT": 4, "NTR_ERR_DOMAIN": 5, "NTR_ERR_ORDER": 6,
    "NTR_ERR_CAPACITY": 7, "NTR_ERR_ARG": 8,
    # units
    "NTR_UNIT_MMOL_L": 1, "NTR_UNIT_MG_DL": 2, "NTR_UNIT_MEQ_L": 3,
    "NTR_UNIT_MOSM_KG": 4, "NTR_UNIT_G_L": 5, "NTR_UNIT_UMOL_L": 6,
    # analytes
    "NTR_ANALYTE_SODIUM": 1, "NTR_ANALYTE_POTASSIUM": 2,
    "NTR_ANALYTE_CHLORIDE": 3, "NTR_ANALYTE_GLUCOSE": 4, "NTR_ANALYTE_UREA": 5,
    "NTR_ANALYTE_UREA_NITROGEN": 6, "NTR_ANALYTE_CREATININE": 7,
    "NTR_ANALYTE_ETHANOL": 8,
    # formulas and methods chosen by enumerator
    "NTR_OSM_2NA": 1, "NTR_OSM_DORWART_CHALMERS": 2,
    "NTR_GLUCOSE_KATZ": 1, "NTR_GLUCOSE_HILLIER": 2,
    "NTR_SEX_MALE": 1, "NTR_SEX_FEMALE": 2,
    "NTR_RESTRICT_1000ML": 1, "NTR_RESTRICT_500_700ML": 2,
    "NTR_RESTRICT_500ML": 3,
}

# Released with P1 in the header (not listed in the issue, ABI from then on):
# the infusate presets and the core method ids 1-18.
RELEASED = {
    "NTR_FLUID_NACL_0_9": 1, "NTR_FLUID_NACL_3": 2, "NTR_FLUID_NACL_5": 3,
    "NTR_FLUID_NACL_0_45": 4, "NTR_FLUID_RINGER_LACTATE": 5,
    "NTR_FLUID_DEXTROSE_5": 6, "NTR_FLUID_NACL_0_2_DEXTROSE_5": 7,
    "NTR_METHOD_UNIT_CONVERSION": 1, "NTR_METHOD_OSM_2NA": 2,
    "NTR_METHOD_OSM_DORWART_CHALMERS": 3, "NTR_METHOD_OSM_EFFECTIVE": 4,
    "NTR_METHOD_OSM_GAP": 5, "NTR_METHOD_GLUCOSE_KATZ": 6,
    "NTR_METHOD_GLUCOSE_HILLIER": 7, "NTR_METHOD_GLUCOSE_FACTOR": 8,
    "NTR_METHOD_NA_DEFICIT": 9, "NTR_METHOD_TBW_FRACTION": 10,
    "NTR_METHOD_TBW_WATSON": 11, "NTR_METHOD_FREE_WATER_DEFICIT": 12,
    "NTR_METHOD_FLUID_PRESETS": 13, "NTR_METHOD_ADROGUE_MADIAS": 14,
    "NTR_METHOD_INFUSATE_MASS_BALANCE": 15, "NTR_METHOD_INFUSATE_VOLUME": 16,
    "NTR_METHOD_FURST": 17, "NTR_METHOD_EFWC": 18,
}

# Added with 1.1 (issue P2, solute area): ABI from then on.
SOLUTE_ENUMS = {"NTR_SOLUTE_UREA": 1, "NTR_SOLUTE_NACL": 2}

# Added with 1.1 (issue 13, units and LOINC): values fixed by the issue.
UNITS_ENUMS = {
    "NTR_ANALYTE_OSMOLALITY": 9, "NTR_ANALYTE_URIC_ACID": 10,
    "NTR_SPECIMEN_SERUM_PLASMA": 1, "NTR_SPECIMEN_BLOOD": 2,
    "NTR_SPECIMEN_URINE": 3,
}

# Solute enumerator -> (name, formula for periodictable, osmoles per mole).
SOLUTES = {
    1: ("urea", "CH4N2O", 1.0),
    2: ("sodium chloride", "NaCl", 2.0),
}

# Analyte id -> (name, formula for periodictable, accepts g/L).
# Urea nitrogen (BUN) is reported per mmol of urea, whose two N atoms weigh
# 2 x N: that is the molar mass mg/dL of BUN converts with.
ANALYTES = {
    1: ("sodium", "Na", False),
    2: ("potassium", "K", False),
    3: ("chloride", "Cl", False),
    4: ("glucose", "C6H12O6", True),
    5: ("urea", "CH4N2O", True),
    6: ("urea nitrogen", "N2", True),
    7: ("creatinine", "C4H7N3O", True),
    8: ("ethanol", "C2H6O", True),
    10: ("uric acid", "C5H4N4O3", True),  # since 1.1 (issue 13)
}

failures = []


def check(condition, message):
    if condition:
        print("ok   " + message)
    else:
        print("FAIL " + message)
        failures.append(message)


def header_defines(path):
    values = {}
    pattern = re.compile(r"^\s*#\s*define\s+(NTR_\w+)\s+\(?(-?\d+)\)?\s*(?:/\*.*)?$")
    with open(path, encoding="utf-8") as header:
        for line in header:
            match = pattern.match(line)
            if match:
                values[match.group(1)] = int(match.group(2))
    return values


def main():
    if len(sys.argv) != 3:
        print(__doc__)
        return 2
    lib = ctypes.CDLL(sys.argv[1])
    lib.ntr_convert.argtypes = [ctypes.c_int, ctypes.c_double, ctypes.c_int,
                                ctypes.c_int, ctypes.POINTER(ctypes.c_double)]
    lib.ntr_convert.restype = ctypes.c_int
    lib.ntr_unit_parse.argtypes = [ctypes.c_char_p, ctypes.POINTER(ctypes.c_int)]
    lib.ntr_unit_parse.restype = ctypes.c_int
    lib.ntr_status_message.argtypes = [ctypes.c_int]
    lib.ntr_status_message.restype = ctypes.c_char_p

    defines = header_defines(sys.argv[2])
    ok, mg_dl, mmol_l, g_l = (FIXED["NTR_OK"], FIXED["NTR_UNIT_MG_DL"],
                              FIXED["NTR_UNIT_MMOL_L"], FIXED["NTR_UNIT_G_L"])

    print("# molar masses (periodictable %s), relative tolerance %g"
          % (periodictable.__version__, RELATIVE_TOLERANCE))
    for analyte, (name, formula, takes_g_l) in sorted(ANALYTES.items()):
        reference = periodictable.formula(formula).mass
        out = ctypes.c_double(float("nan"))
        status = lib.ntr_convert(analyte, 1.0, mg_dl, mmol_l, ctypes.byref(out))
        check(status == ok, "%s: mg/dL -> mmol/L status %d" % (name, status))
        if status == ok:
            implied = 10.0 / out.value
            rel = abs(implied - reference) / reference
            check(rel <= RELATIVE_TOLERANCE,
                  "%s (%s): library %.5f g/mol, periodictable %.5f g/mol, rel diff %.2e"
                  % (name, formula, implied, reference, rel))
        status = lib.ntr_convert(analyte, 1.0, g_l, mmol_l, ctypes.byref(out))
        if takes_g_l:
            check(status == ok, "%s: g/L -> mmol/L status %d" % (name, status))
            if status == ok:
                implied = 1000.0 / out.value
                rel = abs(implied - reference) / reference
                check(rel <= RELATIVE_TOLERANCE,
                      "%s g/L factor: library %.5f g/mol, rel diff %.2e" % (name, implied, rel))
        else:
            check(status == FIXED["NTR_ERR_UNIT"],
                  "%s: g/L is not a unit for an ion (status %d)" % (name, status))

    out = ctypes.c_double(float("nan"))
    mosm_kg = FIXED["NTR_UNIT_MOSM_KG"]
    status = lib.ntr_convert(9, 287.5, mosm_kg, mosm_kg, ctypes.byref(out))
    check(status == ok and out.value == 287.5,
          "osmolality: mosm/kg -> mosm/kg is the identity (status %d)" % status)
    status = lib.ntr_convert(9, 287.5, mosm_kg, mmol_l, ctypes.byref(out))
    check(status == FIXED["NTR_ERR_UNIT"],
          "osmolality: mosm/kg -> mmol/L gives NTR_ERR_UNIT (%d)" % status)

    print("# solute doses: ntr_solute_dose_osmoles(solute, 1 g) = 1000 n / M")
    lib.ntr_solute_dose_osmoles.argtypes = [ctypes.c_int, ctypes.c_double,
                                            ctypes.POINTER(ctypes.c_double)]
    lib.ntr_solute_dose_osmoles.restype = ctypes.c_int
    for solute, (name, formula, per_mole) in sorted(SOLUTES.items()):
        reference = periodictable.formula(formula).mass
        out = ctypes.c_double(float("nan"))
        status = lib.ntr_solute_dose_osmoles(solute, 1.0, ctypes.byref(out))
        check(status == ok, "%s: dose osmoles status %d" % (name, status))
        if status == ok:
            implied = 1000.0 * per_mole / out.value
            rel = abs(implied - reference) / reference
            check(rel <= RELATIVE_TOLERANCE,
                  "%s (%s, %g osmol/mol): library %.5f g/mol, periodictable %.5f g/mol, "
                  "rel diff %.2e" % (name, formula, per_mole, implied, reference, rel))
    out = ctypes.c_double(float("nan"))
    status = lib.ntr_solute_dose_osmoles(30, 1.0, ctypes.byref(out))
    check(status == FIXED["NTR_ERR_ARG"], "unknown solute 30 gives NTR_ERR_ARG (%d)" % status)

    print("# enumerator values in the header")
    for table, label in ((FIXED, "fixed by issue P1"), (RELEASED, "released with P1"),
                         (SOLUTE_ENUMS, "added with 1.1, solute area"),
                         (UNITS_ENUMS, "fixed by issue 13")):
        for name, value in table.items():
            check(defines.get(name) == value,
                  "%s = %s (%s: %d)" % (name, defines.get(name), label, value))

    print("# the library agrees with the header")
    for code, name in (("mmol/L", "NTR_UNIT_MMOL_L"), ("mg/dL", "NTR_UNIT_MG_DL"),
                       ("meq/L", "NTR_UNIT_MEQ_L"), ("mosm/kg", "NTR_UNIT_MOSM_KG"),
                       ("g/L", "NTR_UNIT_G_L"), ("umol/L", "NTR_UNIT_UMOL_L")):
        unit = ctypes.c_int(-1)
        status = lib.ntr_unit_parse(code.encode("ascii"), ctypes.byref(unit))
        check(status == ok and unit.value == FIXED[name],
              "ntr_unit_parse(%r) -> %d (%s = %d)" % (code, unit.value, name, FIXED[name]))
    messages = [lib.ntr_status_message(FIXED[name]) for name in
                ("NTR_OK", "NTR_ERR_NULL", "NTR_ERR_NONFINITE", "NTR_ERR_RANGE",
                 "NTR_ERR_UNIT", "NTR_ERR_DOMAIN", "NTR_ERR_ORDER", "NTR_ERR_CAPACITY",
                 "NTR_ERR_ARG")]
    check(len(set(messages)) == 9 and lib.ntr_status_message(9) not in messages,
          "status codes 0-8 each have their own message; 9 is unknown")

    if failures:
        print("%d check(s) failed" % len(failures))
        return 1
    print("all checks passed")
    return 0


if __name__ == "__main__":
    sys.exit(main())
