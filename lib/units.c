/* Units: UCUM parsing and analyte conversion (docs/units.md). */
#include "ntr_internal.h"

/* IUPAC standard atomic weights, g/mol (abridged values; the molar masses
 * built from them are checked against Debian's python3-periodictable by
 * tests/check_molar_masses.py). */
#define AW_H 1.008
#define AW_C 12.011
#define AW_N 14.007
#define AW_O 15.999
#define AW_NA 22.98977
#define AW_K 39.0983
#define AW_CL 35.453

#define MM_GLUCOSE (6.0 * AW_C + 12.0 * AW_H + 6.0 * AW_O)
#define MM_UREA (AW_C + 4.0 * AW_H + 2.0 * AW_N + AW_O)
#define MM_UREA_NITROGEN (2.0 * AW_N)
#define MM_CREATININE (4.0 * AW_C + 7.0 * AW_H + 3.0 * AW_N + AW_O)
#define MM_ETHANOL (2.0 * AW_C + 6.0 * AW_H + AW_O)

#define UBIT(u) (1u << (u))
#define IONS (UBIT(NTR_UNIT_MMOL_L) | UBIT(NTR_UNIT_MEQ_L) | UBIT(NTR_UNIT_MG_DL) | UBIT(NTR_UNIT_UMOL_L))
#define SOLUTES (UBIT(NTR_UNIT_MMOL_L) | UBIT(NTR_UNIT_MG_DL) | UBIT(NTR_UNIT_G_L) | UBIT(NTR_UNIT_UMOL_L))

struct analyte {
    double molar_mass_g_mol;
    unsigned int units; /* UBIT() of every unit the analyte accepts */
};

/* Indexed by NTR_ANALYTE_*; entry 0 is unused. */
static const struct analyte analytes[] = {
    {0.0, 0u},
    {AW_NA, IONS},
    {AW_K, IONS},
    {AW_CL, IONS},
    {MM_GLUCOSE, SOLUTES},
    {MM_UREA, SOLUTES},
    {MM_UREA_NITROGEN, SOLUTES},
    {MM_CREATININE, SOLUTES},
    {MM_ETHANOL, SOLUTES},
};

#define N_ANALYTES (sizeof analytes / sizeof analytes[0])

struct ucum_code {
    const char *code;
    int unit;
};

static const struct ucum_code ucum_codes[] = {
    {"mmol/L", NTR_UNIT_MMOL_L}, {"mg/dL", NTR_UNIT_MG_DL},
    {"meq/L", NTR_UNIT_MEQ_L},   {"mosm/kg", NTR_UNIT_MOSM_KG},
    {"g/L", NTR_UNIT_G_L},       {"umol/L", NTR_UNIT_UMOL_L},
};

/* Compares without reading s past its NUL or past the code's length + 1. */
static int same_code(const char *s, const char *code)
{
    size_t i = 0;
    while (code[i] != '\0') {
        if (s[i] != code[i]) {
            return 0;
        }
        i++;
    }
    return s[i] == '\0';
}

int ntr_unit_parse(const char *ucum, int *unit)
{
    size_t i;
    if (ucum == NULL || unit == NULL) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < sizeof ucum_codes / sizeof ucum_codes[0]; i++) {
        if (same_code(ucum, ucum_codes[i].code)) {
            *unit = ucum_codes[i].unit;
            return NTR_OK;
        }
    }
    return NTR_ERR_UNIT;
}

/* Multiplier that turns a value in `unit` into mmol/L. */
static double to_mmol_l(int unit, double molar_mass_g_mol)
{
    switch (unit) {
    case NTR_UNIT_MG_DL: return 10.0 / molar_mass_g_mol;
    case NTR_UNIT_G_L: return 1000.0 / molar_mass_g_mol;
    case NTR_UNIT_UMOL_L: return 0.001;
    default: return 1.0; /* mmol/L, meq/L of a monovalent ion */
    }
}

static int unit_fits(const struct analyte *a, int unit)
{
    return unit >= NTR_UNIT_MMOL_L && unit <= NTR_UNIT_UMOL_L &&
           (a->units & UBIT(unit)) != 0u;
}

int ntr_convert(int analyte, double value, int from_unit, int to_unit,
                double *out)
{
    const struct analyte *a;
    if (out == NULL) {
        return NTR_ERR_NULL;
    }
    if (analyte < 1 || (size_t)analyte >= N_ANALYTES) {
        return NTR_ERR_ARG;
    }
    a = &analytes[analyte];
    if (!unit_fits(a, from_unit) || !unit_fits(a, to_unit)) {
        return NTR_ERR_UNIT;
    }
    NTR_TRY(ntr_check(value, 0.0, NTR_CONVERT_MAX));
    if (from_unit == to_unit) {
        *out = value;
    } else {
        *out = value * to_mmol_l(from_unit, a->molar_mass_g_mol) /
               to_mmol_l(to_unit, a->molar_mass_g_mol);
    }
    return NTR_OK;
}
