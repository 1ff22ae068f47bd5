/* SPDX-License-Identifier: MIT */
/* Units: UCUM parsing and analyte conversion (docs/units.md). */
#include "ntr_internal.h"

/* Molar masses from the IUPAC atomic weights in ntr_internal.h (urea's,
 * NTR_MM_UREA, is there too: lib/solute.c doses it). */
#define MM_GLUCOSE (6.0 * NTR_AW_C + 12.0 * NTR_AW_H + 6.0 * NTR_AW_O)
#define MM_UREA_NITROGEN (2.0 * NTR_AW_N)
#define MM_CREATININE (4.0 * NTR_AW_C + 7.0 * NTR_AW_H + 3.0 * NTR_AW_N + NTR_AW_O)
#define MM_ETHANOL (2.0 * NTR_AW_C + 6.0 * NTR_AW_H + NTR_AW_O)
#define MM_URIC_ACID (5.0 * NTR_AW_C + 4.0 * NTR_AW_H + 4.0 * NTR_AW_N + 3.0 * NTR_AW_O)

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
    /* Osmolality takes only mosm/kg, so only the identity conversion runs
     * and the molar mass is never used. */
    {0.0, UBIT(NTR_UNIT_MOSM_KG)},
    {MM_URIC_ACID, SOLUTES},
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

/* ---- lenient parsing ------------------------------------------------- */

/* The folded spellings ntr_unit_parse_lenient() accepts (header). Arrays,
 * not pointers, so the table needs no relocation. */
#define SPELLING(text, unit) {text, (unsigned char)(sizeof(text) - 1u), unit}
static const struct {
    char text[16];
    unsigned char length; /* so only spellings of the folded length are compared */
    int unit;
} spellings[] = {
    SPELLING("mmol/l", NTR_UNIT_MMOL_L),
    SPELLING("mg/dl", NTR_UNIT_MG_DL),
    SPELLING("meq/l", NTR_UNIT_MEQ_L),
    SPELLING("mosm/kg", NTR_UNIT_MOSM_KG),
    SPELLING("mosm/kg{h2o}", NTR_UNIT_MOSM_KG),
    SPELLING("mosm/kg h2o", NTR_UNIT_MOSM_KG),
    SPELLING("mosmol/kg", NTR_UNIT_MOSM_KG),
    SPELLING("mosmol/kg{h2o}", NTR_UNIT_MOSM_KG),
    SPELLING("mosmol/kg h2o", NTR_UNIT_MOSM_KG),
    SPELLING("g/l", NTR_UNIT_G_L),
    SPELLING("umol/l", NTR_UNIT_UMOL_L),
};

static int is_blank(unsigned char c)
{
    return c == ' ' || c == '\t';
}

/* Folds text into buf (NTR_UNIT_TEXT_MAX bytes): surrounding blanks
 * dropped, ASCII upper case lowered, UTF-8 micro sign (C2 B5) and Greek mu
 * (CE BC) read as 'u'. Returns the folded length, or -1 when the text is
 * refused before matching: too long, a control or other non-ASCII byte,
 * or a leading capital M in a text that also has lower-case letters (in
 * case-sensitive UCUM "Mmol" is a megamole; only the all-capital
 * case-insensitive form reads M as milli). Each byte is read only after
 * the one before it was seen not to be the NUL. */
static int fold_unit_text(const char *text, char *buf)
{
    size_t i = 0, n = 0, kept = 0;
    int lower_seen = 0, capital_m_first = 0;
    while (i < NTR_UNIT_TEXT_MAX && is_blank((unsigned char)text[i])) {
        i++;
    }
    for (; i < NTR_UNIT_TEXT_MAX && text[i] != '\0'; i++) {
        unsigned char c = (unsigned char)text[i];
        if (c == 0xC2u || c == 0xCEu) {
            unsigned char next;
            if (i + 1 >= NTR_UNIT_TEXT_MAX) {
                return -1; /* the pair would pass the limit */
            }
            next = (unsigned char)text[i + 1]; /* text[i] is not the NUL */
            if (!((c == 0xC2u && next == 0xB5u) || (c == 0xCEu && next == 0xBCu))) {
                return -1;
            }
            c = (unsigned char)'u';
            i++; /* the pair is one character */
        } else if (c >= 'A' && c <= 'Z') {
            capital_m_first |= n == 0 && c == 'M';
            c = (unsigned char)(c - 'A' + 'a');
        } else if (c >= 'a' && c <= 'z') {
            lower_seen = 1;
        } else if ((c < 0x20u && c != '\t') || c >= 0x7Fu) {
            return -1;
        }
        buf[n++] = (char)c;
        if (!is_blank(c)) {
            kept = n;
        }
    }
    /* i counts bytes read; at the limit, one more byte tells whether the
     * text ends there (it exists: the byte before was not the NUL). */
    if (i >= NTR_UNIT_TEXT_MAX && text[i] != '\0') {
        return -1;
    }
    if (capital_m_first && lower_seen) {
        return -1;
    }
    return (int)kept;
}

static int spelling_matches(const char *want, const char *buf, int n)
{
    int k;
    for (k = 0; k < n; k++) {
        if (want[k] != buf[k]) {
            return 0;
        }
    }
    return 1;
}

int ntr_unit_parse_lenient(const char *text, int *unit)
{
    char buf[NTR_UNIT_TEXT_MAX];
    int n;
    size_t k;
    if (text == NULL || unit == NULL) {
        return NTR_ERR_NULL;
    }
    n = fold_unit_text(text, buf);
    for (k = 0; n > 0 && k < sizeof spellings / sizeof spellings[0]; k++) {
        if (spellings[k].length == n && spelling_matches(spellings[k].text, buf, n)) {
            *unit = spellings[k].unit;
            return NTR_OK;
        }
    }
    return NTR_ERR_UNIT;
}

/* ---- LOINC ------------------------------------------------------------ */

/* Only codes checked against a published source (docs/units.md names the
 * source of each; tests/test_units.c cites it beside each check). The
 * unit is the one the code's property implies. */
static const struct {
    char code[8];
    unsigned char analyte;
    unsigned char specimen;
    unsigned char unit;
} loinc_codes[] = {
    {"2951-2", NTR_ANALYTE_SODIUM, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MMOL_L},
    {"2947-0", NTR_ANALYTE_SODIUM, NTR_SPECIMEN_BLOOD, NTR_UNIT_MMOL_L},
    {"2823-3", NTR_ANALYTE_POTASSIUM, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MMOL_L},
    {"2075-0", NTR_ANALYTE_CHLORIDE, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MMOL_L},
    {"2345-7", NTR_ANALYTE_GLUCOSE, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MG_DL},
    {"14749-6", NTR_ANALYTE_GLUCOSE, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MMOL_L},
    {"15074-8", NTR_ANALYTE_GLUCOSE, NTR_SPECIMEN_BLOOD, NTR_UNIT_MMOL_L},
    {"14937-7", NTR_ANALYTE_UREA_NITROGEN, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MMOL_L},
    {"2160-0", NTR_ANALYTE_CREATININE, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MG_DL},
    {"14682-9", NTR_ANALYTE_CREATININE, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MMOL_L},
    {"2161-8", NTR_ANALYTE_CREATININE, NTR_SPECIMEN_URINE, NTR_UNIT_MG_DL},
    {"14933-6", NTR_ANALYTE_URIC_ACID, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MMOL_L},
};

/* Whether code is exactly want. Compares up to the first difference, so
 * code is never read past its NUL (which differs from every code byte). */
static int code_is(const char *code, const char *want)
{
    size_t k = 0;
    while (want[k] != '\0' && code[k] == want[k]) {
        k++;
    }
    return want[k] == '\0' && code[k] == '\0';
}

int ntr_loinc_lookup(const char *code, int *analyte, int *specimen, int *unit)
{
    size_t k;
    if (code == NULL || analyte == NULL || specimen == NULL || unit == NULL) {
        return NTR_ERR_NULL;
    }
    for (k = 0; k < sizeof loinc_codes / sizeof loinc_codes[0]; k++) {
        if (code_is(code, loinc_codes[k].code)) {
            *analyte = loinc_codes[k].analyte;
            *specimen = loinc_codes[k].specimen;
            *unit = loinc_codes[k].unit;
            return NTR_OK;
        }
    }
    return NTR_ERR_UNIT;
}

/* ---- conversion ------------------------------------------------------- */

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

/* ---- glucose against its unit ------------------------------------------ */

int ntr_glucose_unit_check(double glucose, int unit, double na_mmol_l,
                           double measured_osm_mosm_kg, double *glucose_mmol_l)
{
    double g, floor_osm;
    if (glucose_mmol_l == NULL) {
        return NTR_ERR_NULL;
    }
    if (unit != NTR_UNIT_MMOL_L && unit != NTR_UNIT_MG_DL && unit != NTR_UNIT_G_L &&
        unit != NTR_UNIT_UMOL_L) {
        return NTR_ERR_UNIT;
    }
    NTR_TRY(ntr_convert(NTR_ANALYTE_GLUCOSE, glucose, unit, NTR_UNIT_MMOL_L, &g));
    NTR_TRY(ntr_check(g, 0.0, NTR_GLUCOSE_MAX));
    NTR_TRY(ntr_check_na(na_mmol_l));
    if (measured_osm_mosm_kg != 0.0) { /* 0: not measured */
        NTR_TRY(ntr_check(measured_osm_mosm_kg, NTR_OSM_MIN, NTR_OSM_MAX));
    }
    /* The osmolality g implies with no urea and no ethanol: both only add,
     * so the measured value cannot lie much below it. */
    NTR_TRY(ntr_osm_calculated(na_mmol_l, g, 0.0, 0.0, NTR_OSM_DORWART_CHALMERS, &floor_osm));
    if (floor_osm > NTR_OSM_MAX) {
        return NTR_ERR_UNIT;
    }
    if (measured_osm_mosm_kg != 0.0 &&
        floor_osm > measured_osm_mosm_kg + NTR_GLUCOSE_UNIT_TOLERANCE) {
        return NTR_ERR_UNIT;
    }
    *glucose_mmol_l = g;
    return NTR_OK;
}
