/* Units: UCUM parsing and analyte conversion (docs/units.md). */
#include "ntr_internal.h"

/* Molar masses from the IUPAC atomic weights in ntr_internal.h (urea's,
 * NTR_MM_UREA, is there too: lib/solute.c doses it). */
#define MM_GLUCOSE (6.0 * NTR_AW_C + 12.0 * NTR_AW_H + 6.0 * NTR_AW_O)
#define MM_UREA_NITROGEN (2.0 * NTR_AW_N)
#define MM_CREATININE (4.0 * NTR_AW_C + 7.0 * NTR_AW_H + 3.0 * NTR_AW_N + NTR_AW_O)
#define MM_ETHANOL (2.0 * NTR_AW_C + 6.0 * NTR_AW_H + NTR_AW_O)

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
    {NTR_AW_NA, IONS},
    {NTR_AW_K, IONS},
    {NTR_AW_CL, IONS},
    {MM_GLUCOSE, SOLUTES},
    {NTR_MM_UREA, SOLUTES},
    {MM_UREA_NITROGEN, SOLUTES},
    {MM_CREATININE, SOLUTES},
    {MM_ETHANOL, SOLUTES},
};

#define N_ANALYTES (sizeof analytes / sizeof analytes[0])

/* The unit whose UCUM code s is, or 0. The six codes differ in their first
 * two characters, which pick the one candidate; the rest is compared
 * character by character with && so that s is never read past a mismatch
 * (and so never past its NUL). Spelt out rather than looped over a table
 * of strings: a parse then costs a couple of instructions per character
 * (tests/bench/run-bench.sh measures the per-call cost). */
static int unit_of_code(const char *s)
{
    switch (s[0]) {
    case 'g': /* "g/L" */
        return (s[1] == '/' && s[2] == 'L' && s[3] == '\0') ? NTR_UNIT_G_L : 0;
    case 'u': /* "umol/L" */
        return (s[1] == 'm' && s[2] == 'o' && s[3] == 'l' && s[4] == '/' &&
                s[5] == 'L' && s[6] == '\0')
                   ? NTR_UNIT_UMOL_L
                   : 0;
    case 'm':
        break;
    default:
        return 0;
    }
    switch (s[1]) {
    case 'm': /* "mmol/L" */
        return (s[2] == 'o' && s[3] == 'l' && s[4] == '/' && s[5] == 'L' &&
                s[6] == '\0')
                   ? NTR_UNIT_MMOL_L
                   : 0;
    case 'g': /* "mg/dL" */
        return (s[2] == '/' && s[3] == 'd' && s[4] == 'L' && s[5] == '\0')
                   ? NTR_UNIT_MG_DL
                   : 0;
    case 'e': /* "meq/L" */
        return (s[2] == 'q' && s[3] == '/' && s[4] == 'L' && s[5] == '\0')
                   ? NTR_UNIT_MEQ_L
                   : 0;
    case 'o': /* "mosm/kg" */
        return (s[2] == 's' && s[3] == 'm' && s[4] == '/' && s[5] == 'k' &&
                s[6] == 'g' && s[7] == '\0')
                   ? NTR_UNIT_MOSM_KG
                   : 0;
    default:
        return 0;
    }
}

int ntr_unit_parse(const char *ucum, int *unit)
{
    int found;
    if (ucum == NULL || unit == NULL) {
        return NTR_ERR_NULL;
    }
    found = unit_of_code(ucum);
    if (found == 0) {
        return NTR_ERR_UNIT;
    }
    *unit = found;
    return NTR_OK;
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
