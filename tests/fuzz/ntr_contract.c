/* SPDX-License-Identifier: MIT */
/* The contract table: see ntr_contract.h. Bounds below come from each
 * function's documented equation evaluated at the ends of its documented
 * input ranges (the header's Doxygen blocks); they are deliberately loose
 * enough to be obviously right and tight enough to catch a result that is
 * off by orders of magnitude, of the wrong sign, or not finite. */
#include "ntr_contract.h"

#include <fenv.h>
#include <math.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

#include "natremia.h"


#define BIT(s) (1u << (s))
#define COMMON_ERR (BIT(NTR_ERR_NULL) | BIT(NTR_ERR_NONFINITE) | BIT(NTR_ERR_RANGE))

/* Output pointer i, or NULL when the case asks for NULL there. */

void ntrc_setup_ok(int status)
{
    if (status != NTR_OK) {
        abort();
    }
}

static double *od(ntrc_case *c, int i)
{
    return (c->out_null & NTRC_NULL_D(i)) ? NULL : &c->out.d[i];
}

static int *oi(ntrc_case *c, int j)
{
    return (c->out_null & NTRC_NULL_I(j)) ? NULL : &c->out.i[j];
}

static int in_null(const ntrc_case *c, int k)
{
    return (c->out_null & NTRC_NULL_IN(k)) != 0u;
}

/* Output storage is filled with this byte before every call; as a double
 * it reads as a tiny negative number no function returns. */
#define SENTINEL_BYTE 0xA5

void ntrc_fill_sentinel(ntrc_case *c)
{
    memset(&c->out, SENTINEL_BYTE, sizeof c->out);
}

static int all_bytes(const void *p, size_t n, unsigned char v)
{
    const unsigned char *b = (const unsigned char *)p;
    size_t i;
    for (i = 0; i < n; i++) {
        if (b[i] != v) {
            return 0;
        }
    }
    return 1;
}

int ntrc_outputs_untouched(const ntrc_case *c)
{
    return all_bytes(&c->out, sizeof c->out, SENTINEL_BYTE);
}

/* ---- helpers for bounds ------------------------------------------------ */

static int within(double x, double lo, double hi)
{
    return isfinite(x) && x >= lo && x <= hi;
}

/* |a - b| small relative to the larger magnitude (or absolutely near 0). */
static int close_to(double a, double b, double rel)
{
    double scale = fabs(a) > fabs(b) ? fabs(a) : fabs(b);
    return fabs(a - b) <= rel * (scale > 1.0 ? scale : 1.0);
}

/* ---- units --------------------------------------------------------------- */

/* The strings ntr_unit_parse is called with (en[0] picks one). The first
 * six are the accepted codes, in NTR_UNIT_* order. */
static const char *const unit_strings[] = {
    "mmol/L", "mg/dL", "meq/L", "mosm/kg", "g/L", "umol/L",
    "", "mmol/l", "MMOL/L", "mg/dl", "mmol/L ", " mmol/L", "mmol", "mosm/kg/",
    "g/L\n", "mEq/L", "umol/L\x01", "mmol/Lmmol/Lmmol/Lmmol/Lmmol/L",
};
#define N_UNIT_STRINGS ((int)(sizeof unit_strings / sizeof unit_strings[0]))

static int call_unit_parse(ntrc_case *c)
{
    int k = c->en[0];
    const char *s = (k >= 0 && k < N_UNIT_STRINGS) ? unit_strings[k] : "?";
    return ntr_unit_parse(in_null(c, 0) ? NULL : s, oi(c, 0));
}

static int predict_unit_parse(const ntrc_fn *f, const ntrc_case *c)
{
    (void)f;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    return (c->en[0] >= 0 && c->en[0] < 6) ? NTR_OK : NTR_ERR_UNIT;
}

static const char *ok_unit_parse(const ntrc_case *c)
{
    return c->out.i[0] == c->en[0] + 1 ? NULL : "parsed to the wrong unit";
}

/* ntr_unit_parse_lenient (1.1): en[0] picks a string; the first twelve are
 * accepted spellings (header list) with the unit each gives. */
static const char *const lenient_strings[] = {
    "mEq/L", "mmol/l", "MMOL/L", "mg/dl", "mOsm/kg", "mosm/kg H2O", "mOsm/kg{H2O}",
    "\xc2\xb5mol/L", "\xce\xbcmol/L", "g/l", " mmol/L\t", "mOsmol/kg",
    "mOsm/L", "Mmol/L", "mmol/kg", "mg%", "\xb5mol/L", "\xc2", "mmol / L", "",
    "                                 mmol/L", "mosm/kg  H2O", "U/L",
};
static const int lenient_units[] = {
    NTR_UNIT_MEQ_L, NTR_UNIT_MMOL_L, NTR_UNIT_MMOL_L, NTR_UNIT_MG_DL, NTR_UNIT_MOSM_KG,
    NTR_UNIT_MOSM_KG, NTR_UNIT_MOSM_KG, NTR_UNIT_UMOL_L, NTR_UNIT_UMOL_L, NTR_UNIT_G_L,
    NTR_UNIT_MMOL_L, NTR_UNIT_MOSM_KG,
};
#define N_LENIENT_STRINGS ((int)(sizeof lenient_strings / sizeof lenient_strings[0]))
#define N_LENIENT_OK ((int)(sizeof lenient_units / sizeof lenient_units[0]))

static int call_unit_parse_lenient(ntrc_case *c)
{
    int k = c->en[0];
    const char *s = (k >= 0 && k < N_LENIENT_STRINGS) ? lenient_strings[k] : "?";
    return ntr_unit_parse_lenient(in_null(c, 0) ? NULL : s, oi(c, 0));
}

static int predict_unit_parse_lenient(const ntrc_fn *f, const ntrc_case *c)
{
    (void)f;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    return (c->en[0] >= 0 && c->en[0] < N_LENIENT_OK) ? NTR_OK : NTR_ERR_UNIT;
}

static const char *ok_unit_parse_lenient(const ntrc_case *c)
{
    return c->out.i[0] == lenient_units[c->en[0]] ? NULL : "parsed to the wrong unit";
}

/* ntr_loinc_lookup (1.1): the twelve checked codes (tests/test_units.c
 * cites the source of each) with their analyte, specimen and unit, then
 * strings that are not codes of the table. */
static const char *const loinc_strings[] = {
    "2951-2", "2947-0", "2823-3", "2075-0", "2345-7", "14749-6", "15074-8", "14937-7",
    "2160-0", "14682-9", "2161-8", "14933-6",
    "", "2951-3", "2951", "2951-2 ", "14682-99", "LOINC:2951-2", "0000-0",
};
static const int loinc_expected[][3] = {
    {NTR_ANALYTE_SODIUM, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MMOL_L},
    {NTR_ANALYTE_SODIUM, NTR_SPECIMEN_BLOOD, NTR_UNIT_MMOL_L},
    {NTR_ANALYTE_POTASSIUM, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MMOL_L},
    {NTR_ANALYTE_CHLORIDE, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MMOL_L},
    {NTR_ANALYTE_GLUCOSE, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MG_DL},
    {NTR_ANALYTE_GLUCOSE, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MMOL_L},
    {NTR_ANALYTE_GLUCOSE, NTR_SPECIMEN_BLOOD, NTR_UNIT_MMOL_L},
    {NTR_ANALYTE_UREA_NITROGEN, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MMOL_L},
    {NTR_ANALYTE_CREATININE, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MG_DL},
    {NTR_ANALYTE_CREATININE, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MMOL_L},
    {NTR_ANALYTE_CREATININE, NTR_SPECIMEN_URINE, NTR_UNIT_MG_DL},
    {NTR_ANALYTE_URIC_ACID, NTR_SPECIMEN_SERUM_PLASMA, NTR_UNIT_MMOL_L},
};
#define N_LOINC_STRINGS ((int)(sizeof loinc_strings / sizeof loinc_strings[0]))
#define N_LOINC_OK ((int)(sizeof loinc_expected / sizeof loinc_expected[0]))

static int call_loinc_lookup(ntrc_case *c)
{
    int k = c->en[0];
    const char *s = (k >= 0 && k < N_LOINC_STRINGS) ? loinc_strings[k] : "?";
    return ntr_loinc_lookup(in_null(c, 0) ? NULL : s, oi(c, 0), oi(c, 1), oi(c, 2));
}

static int predict_loinc_lookup(const ntrc_fn *f, const ntrc_case *c)
{
    (void)f;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    return (c->en[0] >= 0 && c->en[0] < N_LOINC_OK) ? NTR_OK : NTR_ERR_UNIT;
}

static const char *ok_loinc_lookup(const ntrc_case *c)
{
    const int *want = loinc_expected[c->en[0]];
    double out;
    if (c->out.i[0] != want[0] || c->out.i[1] != want[1] || c->out.i[2] != want[2]) {
        return "code mapped to the wrong analyte, specimen or unit";
    }
    if (ntr_convert(c->out.i[0], 1.0, c->out.i[2], c->out.i[2], &out) != NTR_OK) {
        return "the code's unit does not fit its analyte";
    }
    return NULL;
}

/* Units each analyte accepts (header, ntr_convert). */
static int unit_fits(int analyte, int unit)
{
    static const unsigned int accepts[] = {
        0u,
        BIT(NTR_UNIT_MMOL_L) | BIT(NTR_UNIT_MEQ_L) | BIT(NTR_UNIT_MG_DL) | BIT(NTR_UNIT_UMOL_L),
        BIT(NTR_UNIT_MMOL_L) | BIT(NTR_UNIT_MEQ_L) | BIT(NTR_UNIT_MG_DL) | BIT(NTR_UNIT_UMOL_L),
        BIT(NTR_UNIT_MMOL_L) | BIT(NTR_UNIT_MEQ_L) | BIT(NTR_UNIT_MG_DL) | BIT(NTR_UNIT_UMOL_L),
        BIT(NTR_UNIT_MMOL_L) | BIT(NTR_UNIT_MG_DL) | BIT(NTR_UNIT_G_L) | BIT(NTR_UNIT_UMOL_L),
        BIT(NTR_UNIT_MMOL_L) | BIT(NTR_UNIT_MG_DL) | BIT(NTR_UNIT_G_L) | BIT(NTR_UNIT_UMOL_L),
        BIT(NTR_UNIT_MMOL_L) | BIT(NTR_UNIT_MG_DL) | BIT(NTR_UNIT_G_L) | BIT(NTR_UNIT_UMOL_L),
        BIT(NTR_UNIT_MMOL_L) | BIT(NTR_UNIT_MG_DL) | BIT(NTR_UNIT_G_L) | BIT(NTR_UNIT_UMOL_L),
        BIT(NTR_UNIT_MMOL_L) | BIT(NTR_UNIT_MG_DL) | BIT(NTR_UNIT_G_L) | BIT(NTR_UNIT_UMOL_L),
        BIT(NTR_UNIT_MOSM_KG), /* osmolality (1.1): itself only */
        BIT(NTR_UNIT_MMOL_L) | BIT(NTR_UNIT_MG_DL) | BIT(NTR_UNIT_G_L) | BIT(NTR_UNIT_UMOL_L),
    };
    if (analyte < 1 || analyte > 10 || unit < 1 || unit > 30) {
        return 0;
    }
    return (accepts[analyte] & BIT(unit)) != 0u;
}

static int predict_convert(const ntrc_fn *f, const ntrc_case *c)
{
    (void)f;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    if (c->en[0] < 1 || c->en[0] > 10) {
        return NTR_ERR_ARG;
    }
    if (!unit_fits(c->en[0], c->en[1]) || !unit_fits(c->en[0], c->en[2])) {
        return NTR_ERR_UNIT;
    }
    return -1; /* the numeric input: generic */
}

static int call_convert(ntrc_case *c)
{
    return ntr_convert(c->en[0], c->num[0], c->en[1], c->en[2], od(c, 0));
}

static const char *ok_convert(const ntrc_case *c)
{
    double back;
    /* The largest factor between two accepted units of one analyte is
     * g/L <-> umol/L for the heaviest solute: 1e6 / 28.014 per unit. */
    if (!within(c->out.d[0], 0.0, c->num[0] * 1.0e6)) {
        return "converted value not finite, negative or implausibly large";
    }
    if (ntr_convert(c->en[0], c->out.d[0], c->en[2], c->en[1], &back) == NTR_OK &&
        !close_to(back, c->num[0], 1e-12)) {
        return "conversion does not round-trip";
    }
    return NULL;
}

/* ntr_glucose_unit_check (1.1). The glucose range is 0 to 200 mmol/L once
 * converted, so the prediction converts with ntr_convert (its own entry
 * checks it); the osmolality is 0 (not measured) or 150 to 600. */
static int predict_glucose_unit_check(const ntrc_fn *f, const ntrc_case *c)
{
    int unit = c->en[0];
    double g, osm = c->num[2];
    int st;
    (void)f;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    if (unit != NTR_UNIT_MMOL_L && unit != NTR_UNIT_MG_DL && unit != NTR_UNIT_G_L &&
        unit != NTR_UNIT_UMOL_L) {
        return NTR_ERR_UNIT;
    }
    st = ntr_convert(NTR_ANALYTE_GLUCOSE, c->num[0], unit, NTR_UNIT_MMOL_L, &g);
    if (st != NTR_OK) {
        return st;
    }
    if (g > 200.0) {
        return NTR_ERR_RANGE;
    }
    if (!isfinite(c->num[1])) {
        return NTR_ERR_NONFINITE;
    }
    if (c->num[1] < 80.0 || c->num[1] > 220.0) {
        return NTR_ERR_RANGE;
    }
    if (osm != 0.0) {
        if (!isfinite(osm)) {
            return NTR_ERR_NONFINITE;
        }
        if (osm < 150.0 || osm > 600.0) {
            return NTR_ERR_RANGE;
        }
    }
    return NTR_OK; /* then NTR_OK or, by the rules, NTR_ERR_UNIT */
}

static int call_glucose_unit_check(ntrc_case *c)
{
    return ntr_glucose_unit_check(c->num[0], c->en[0], c->num[1], c->num[2], od(c, 0));
}

static const char *ok_glucose_unit_check(const ntrc_case *c)
{
    double g, floor_osm;
    if (ntr_convert(NTR_ANALYTE_GLUCOSE, c->num[0], c->en[0], NTR_UNIT_MMOL_L, &g) != NTR_OK ||
        c->out.d[0] != g) {
        return "glucose not the ntr_convert value in mmol/L";
    }
    floor_osm = 1.86 * c->num[1] + g + 9.0;
    if (floor_osm > 600.0 + 1e-9 || (c->num[2] != 0.0 && floor_osm > c->num[2] + 20.0 + 1e-9)) {
        return "passed a glucose whose Dorwart-Chalmers floor breaks a rule";
    }
    return NULL;
}

/* ---- osmolality ----------------------------------------------------------- */

static int call_osm_calculated(ntrc_case *c)
{
    return ntr_osm_calculated(c->num[0], c->num[1], c->num[2], c->num[3],
                              c->en[0], od(c, 0));
}

static const char *ok_osm_calculated(const ntrc_case *c)
{
    const double *x = c->num;
    double na_coeff = c->en[0] == NTR_OSM_2NA ? 2.0 : 1.86;
    double intercept = c->en[0] == NTR_OSM_2NA ? 0.0 : 9.0;
    double expect = na_coeff * x[0] + x[1] + x[2] + x[3] + intercept;
    if (!within(c->out.d[0], 1.86 * 80.0 + 9.0, 2.0 * 220.0 + 200.0 + 200.0 + 400.0)) {
        return "osmolality outside [157.8, 1240]";
    }
    return close_to(c->out.d[0], expect, 1e-14) ? NULL : "osmolality off its equation";
}

static int call_osm_effective(ntrc_case *c)
{
    return ntr_osm_effective(c->num[0], c->num[1], od(c, 0));
}

static const char *ok_osm_effective(const ntrc_case *c)
{
    if (!within(c->out.d[0], 160.0, 640.0)) {
        return "effective osmolality outside [160, 640]";
    }
    return close_to(c->out.d[0], 2.0 * c->num[0] + c->num[1], 1e-14) ? NULL
                                                                    : "off 2Na + glucose";
}

static int call_osm_gap(ntrc_case *c)
{
    return ntr_osm_gap(c->num[0], c->num[1], od(c, 0));
}

static const char *ok_osm_gap(const ntrc_case *c)
{
    return within(c->out.d[0], -450.0, 450.0) ? NULL : "gap outside [-450, 450]";
}

/* ---- sodium ----------------------------------------------------------------- */

/* Largest glucose correction: factor 5 over (200 mmol/L = 3603 mg/dL). */
#define MAX_GLUCOSE_SHIFT (5.0 * (200.0 * 18.0156 - 100.0) / 100.0)

static int call_na_corrected_glucose(ntrc_case *c)
{
    return ntr_na_corrected_glucose(c->num[0], c->num[1], c->en[0], od(c, 0));
}

static int call_na_corrected_glucose_factor(ntrc_case *c)
{
    return ntr_na_corrected_glucose_factor(c->num[0], c->num[1], c->num[2], od(c, 0));
}

static const char *ok_na_corrected(const ntrc_case *c)
{
    /* Never below the measured sodium, never more than the largest shift. */
    return within(c->out.d[0], c->num[0], c->num[0] + MAX_GLUCOSE_SHIFT)
               ? NULL
               : "corrected sodium below measured or implausibly high";
}

static int call_na_deficit(ntrc_case *c)
{
    return ntr_na_deficit(c->num[0], c->num[1], c->num[2], od(c, 0));
}

static const char *ok_na_deficit(const ntrc_case *c)
{
    return within(c->out.d[0], 0.0, 400.0 * 140.0) ? NULL : "deficit outside [0, 56000] mmol";
}

/* ---- water ----------------------------------------------------------------- */

static int call_tbw_fraction(ntrc_case *c)
{
    return ntr_tbw_fraction(c->en[0], c->num[0], c->num[1], od(c, 0));
}

static const char *ok_tbw_fraction(const ntrc_case *c)
{
    return within(c->out.d[0], 0.45 * c->num[1], 0.6 * c->num[1]) ? NULL
                                                                  : "TBW not 45-60% of weight";
}

static int call_tbw_watson(ntrc_case *c)
{
    return ntr_tbw_watson(c->en[0], c->num[0], c->num[1], c->num[2], od(c, 0));
}

static const char *ok_tbw_watson(const ntrc_case *c)
{
    /* A usable body water (0.1 to 400 L) between 20% and 80% of the
     * weight (docs/water.md), and below the male equation at the youngest
     * adult age and the largest height and weight. */
    double most = 2.447 - 0.09516 * 18.0 + 0.1074 * 275.0 + 0.3362 * 650.0;
    double w = c->num[2];
    return (within(c->out.d[0], 0.1, most) && within(c->out.d[0], 0.2 * w, 0.8 * w))
               ? NULL
               : "Watson TBW outside [0.1, 250] L or outside 20-80% of weight";
}

static int call_free_water_deficit(ntrc_case *c)
{
    return ntr_free_water_deficit(c->num[0], c->num[1], od(c, 0));
}

static const char *ok_free_water_deficit(const ntrc_case *c)
{
    return within(c->out.d[0], 0.0, 400.0 * (220.0 / 140.0 - 1.0)) ? NULL
                                                                    : "water deficit outside [0, 229] L";
}

/* ---- infusion ----------------------------------------------------------------- */

static int call_fluid_preset(ntrc_case *c)
{
    return ntr_fluid_preset(c->en[0], od(c, 0), od(c, 1));
}

static const char *ok_fluid_preset(const ntrc_case *c)
{
    return (within(c->out.d[0], 0.0, 1100.0) && within(c->out.d[1], 0.0, 400.0))
               ? NULL
               : "preset outside the infusate ranges";
}

/* Delta of a mix: between 0 and the gap between infusate and serum. */
static int delta_between(double delta, double gap)
{
    return gap >= 0.0 ? within(delta, 0.0, gap) : within(delta, gap, 0.0);
}

static int call_infusate_change_per_litre(ntrc_case *c)
{
    return ntr_infusate_change_per_litre(c->num[0], c->num[1], c->num[2], c->num[3],
                                         od(c, 0));
}

static const char *ok_infusate_change_per_litre(const ntrc_case *c)
{
    double gap = c->num[2] + c->num[3] - c->num[0];
    return delta_between(c->out.d[0], gap) ? NULL
                                           : "change outside [0, infusate - serum]";
}

static int call_infusate_change(ntrc_case *c)
{
    return ntr_infusate_change(c->num[0], c->num[1], c->num[2], c->num[3], c->num[4],
                               od(c, 0));
}

static const char *ok_infusate_change(const ntrc_case *c)
{
    double gap = c->num[2] + c->num[3] - c->num[0];
    if (!within(c->num[0] + c->out.d[0], 80.0, 220.0)) {
        return "predicted sodium outside 80 to 220 (ntr_balance_predict refuses it)";
    }
    return delta_between(c->out.d[0], gap) ? NULL
                                           : "change outside [0, infusate - serum]";
}

static int call_infusate_volume_for_change(ntrc_case *c)
{
    return ntr_infusate_volume_for_change(c->num[0], c->num[1], c->num[2], c->num[3],
                                          c->num[4], od(c, 0));
}

static const char *ok_infusate_volume_for_change(const ntrc_case *c)
{
    double delta;
    if (!within(c->out.d[0], 0.0, 20.0)) {
        return "volume outside [0, 20] L";
    }
    /* Round trip through the forward mass balance. */
    if (ntr_infusate_change(c->num[0], c->num[1], c->num[2], c->num[3], c->out.d[0],
                            &delta) != NTR_OK) {
        return "forward model rejects the returned volume";
    }
    return fabs(delta - c->num[4]) <= 1e-9 * (1.0 + fabs(c->num[4]))
               ? NULL
               : "volume does not reproduce the target change";
}

/* ---- urine ----------------------------------------------------------------- */

static int call_furst_ratio(ntrc_case *c)
{
    return ntr_furst_ratio(c->num[0], c->num[1], c->num[2], od(c, 0));
}

static const char *ok_furst_ratio(const ntrc_case *c)
{
    return within(c->out.d[0], 0.0, 800.0 / 80.0) ? NULL : "ratio outside [0, 10]";
}

static int call_restriction_from_ratio(ntrc_case *c)
{
    return ntr_restriction_from_ratio(c->num[0], oi(c, 0));
}

static const char *ok_restriction_from_ratio(const ntrc_case *c)
{
    int want = c->num[0] < NTR_FURST_ABOUT_ONE_LOW    ? NTR_RESTRICT_1000ML
               : c->num[0] <= NTR_FURST_ABOUT_ONE_HIGH ? NTR_RESTRICT_500_700ML
                                                       : NTR_RESTRICT_500ML;
    return c->out.i[0] == want ? NULL : "advice does not match its band";
}

static int call_efwc(ntrc_case *c)
{
    return ntr_efwc(c->num[0], c->num[1], c->num[2], c->num[3], od(c, 0));
}

static const char *ok_efwc(const ntrc_case *c)
{
    /* V * (1 - ratio) with ratio in [0, 10] and V in [0, 30]. */
    return within(c->out.d[0], -9.0 * c->num[0], c->num[0]) ? NULL
                                                            : "EFWC outside [-9V, V]";
}

/* ---- work-up ----------------------------------------------------------------- */

static int call_na_severity(ntrc_case *c)
{
    return ntr_na_severity(c->num[0], oi(c, 0));
}

static const char *ok_na_severity(const ntrc_case *c)
{
    double na = c->num[0];
    int want = na >= 135.0   ? NTR_SEVERITY_NONE
               : na >= 130.0 ? NTR_SEVERITY_MILD
               : na >= 125.0 ? NTR_SEVERITY_MODERATE
                             : NTR_SEVERITY_PROFOUND;
    return c->out.i[0] == want ? NULL : "severity does not match its band";
}

static int tonicity_of(double osm)
{
    return osm < NTR_TONICITY_HYPOTONIC_BELOW     ? NTR_TONICITY_HYPOTONIC
           : osm <= NTR_TONICITY_HYPERTONIC_ABOVE ? NTR_TONICITY_ISOTONIC
                                                  : NTR_TONICITY_HYPERTONIC;
}

static int call_tonicity_class(ntrc_case *c)
{
    return ntr_tonicity_class(c->num[0], oi(c, 0));
}

static const char *ok_tonicity_class(const ntrc_case *c)
{
    return c->out.i[0] == tonicity_of(c->num[0]) ? NULL : "tonicity does not match its band";
}

static int call_low_na_tonicity(ntrc_case *c)
{
    return ntr_low_na_tonicity(c->num[0], c->num[1], c->num[2], c->en[0], oi(c, 0),
                               (c->out_null & NTRC_NULL_I(1)) ? NULL
                                                              : (unsigned int *)&c->out.i[1]);
}

static const char *ok_low_na_tonicity(const ntrc_case *c)
{
    unsigned int flags = (unsigned int)c->out.i[1];
    if (c->out.i[0] != tonicity_of(c->num[2])) {
        return "tonicity does not match its band";
    }
    if ((flags & ~0x1fu) != 0u) {
        return "undefined flag bits";
    }
    if (c->num[0] >= 135.0 && flags != 0u) {
        return "flags set although sodium is not low";
    }
    if ((flags & NTR_LOW_NA_NOT_HYPOTONIC) && c->num[2] < NTR_TONICITY_HYPOTONIC_BELOW) {
        return "not-hypotonic flag on a hypotonic osmolality";
    }
    return NULL;
}

/* The effective osmolality as the header states it (measured less urea
 * and 1.25 * ethanol, floored at min(2*Na + glucose, measured)); the
 * subtraction is grouped as the library groups it, so the class edge at
 * 275 is judged on the same double. */
static double effective_expected(const double *x)
{
    double calculated = 2.0 * x[0] + x[1];
    double floor_osm = calculated < x[4] ? calculated : x[4];
    double subtracted = x[4] - (x[2] + 1.25 * x[3]);
    return subtracted > floor_osm ? subtracted : floor_osm;
}

static int call_effective_osm_measured(ntrc_case *c)
{
    return ntr_effective_osm_measured(c->num[0], c->num[1], c->num[2], c->num[3], c->num[4],
                                      od(c, 0));
}

static const char *ok_effective_osm_measured(const ntrc_case *c)
{
    double e = c->out.d[0];
    if (!within(e, 150.0, 600.0)) {
        return "effective osmolality outside [150, 600]";
    }
    if (e > c->num[4]) {
        return "effective osmolality above the measured one";
    }
    return close_to(e, effective_expected(c->num), 1e-14) ? NULL
                                                         : "effective osmolality off its equation";
}

static int call_low_na_effective_tonicity(ntrc_case *c)
{
    return ntr_low_na_effective_tonicity(
        c->num[0], c->num[1], c->num[2], c->num[3], c->num[4], c->en[0], oi(c, 0),
        (c->out_null & NTRC_NULL_I(1)) ? NULL : (unsigned int *)&c->out.i[1]);
}

static const char *ok_low_na_effective_tonicity(const ntrc_case *c)
{
    unsigned int flags = (unsigned int)c->out.i[1];
    double e = effective_expected(c->num);
    int hidden = c->num[4] >= NTR_TONICITY_HYPOTONIC_BELOW && e < NTR_TONICITY_HYPOTONIC_BELOW;
    if (c->out.i[0] != tonicity_of(e)) {
        return "tonicity does not match the band of the effective osmolality";
    }
    if ((flags & ~0x3fu) != 0u) {
        return "undefined flag bits";
    }
    if (c->num[0] >= 135.0 && (flags & ~NTR_LOW_NA_INEFFECTIVE_OSMOLES) != 0u) {
        return "low-sodium flags set although sodium is not low";
    }
    if (((flags & NTR_LOW_NA_INEFFECTIVE_OSMOLES) != 0u) != hidden) {
        return "ineffective-osmoles flag not set exactly when measured >= 275 > effective";
    }
    if ((flags & NTR_LOW_NA_PSEUDO) && e < NTR_TONICITY_HYPOTONIC_BELOW) {
        return "pseudo flag on a hypotonic effective osmolality";
    }
    if ((flags & NTR_LOW_NA_NOT_HYPOTONIC) && e < NTR_TONICITY_HYPOTONIC_BELOW) {
        return "not-hypotonic flag on a hypotonic effective osmolality";
    }
    return NULL;
}

static int call_urine_maximally_dilute(ntrc_case *c)
{
    return ntr_urine_maximally_dilute(c->num[0], oi(c, 0));
}

static const char *ok_urine_maximally_dilute(const ntrc_case *c)
{
    return c->out.i[0] == (c->num[0] <= NTR_URINE_OSM_DILUTE_MAX ? 1 : 0) ? NULL
                                                                         : "wrong side of 100";
}

static int call_urine_na_high(ntrc_case *c)
{
    return ntr_urine_na_high(c->num[0], oi(c, 0));
}

static const char *ok_urine_na_high(const ntrc_case *c)
{
    return c->out.i[0] == (c->num[0] > NTR_URINE_NA_HIGH_ABOVE ? 1 : 0) ? NULL
                                                                       : "wrong side of 30";
}

static int call_fractional_excretion(ntrc_case *c)
{
    return ntr_fractional_excretion(c->num[0], c->num[1], c->num[2], c->num[3], od(c, 0));
}

static const char *ok_fractional_excretion(const ntrc_case *c)
{
    const double *x = c->num;
    double expect = 100.0 * (x[0] * x[3]) / (x[1] * x[2]);
    if (!(c->out.d[0] >= 0.0)) {
        return "negative fractional excretion";
    }
    return close_to(c->out.d[0], expect, 1e-12) ? NULL : "off 100*Ux*Pcr/(Px*Ucr)";
}

/* SIAD: enumerators in the library's documented check order (all give
 * NTR_ERR_ARG, so their order among themselves does not change a status):
 * struct sizes, known flags, volume status and yes/no findings. */
enum {
    SE_FSIZE, SE_RSIZE, SE_K_EOSM, SE_K_UOSM, SE_K_UNA, SE_VOLUME, SE_INTAKE, SE_THYROID,
    SE_ADRENAL, SE_PITUITARY, SE_KIDNEY, SE_DIURETIC, SE_SALINE, SE_RESTRICTION,
    SE_K_URIC, SE_K_UREA, SE_K_FENA, SE_K_FEUREA, SE_K_FEURIC, SE_COUNT
};
/* Index in num[] of each value and the enumerator holding its known flag. */
static const int siad_known_en[8] = {SE_K_EOSM, SE_K_UOSM, SE_K_UNA, SE_K_URIC,
                                     SE_K_UREA, SE_K_FENA, SE_K_FEUREA, SE_K_FEURIC};

static size_t siad_size(int mode, size_t real)
{
    switch (mode) {
    case 0: return real;
    case 2: return real + 64; /* a caller built against a newer header */
    case 1: return real - 1;
    default: return mode < 0 ? 0 : sizeof(size_t);
    }
}

static void siad_value(ntr_finding_value *v, int known, double value)
{
    v->known = known;
    v->reserved = 0;
    v->value = value;
}

static void base_siad(ntrc_case *c)
{
    ntr_siad_findings *f = &c->findings;
    const int *e = c->en;
    memset(f, 0, sizeof *f);
    f->struct_size = siad_size(e[SE_FSIZE], sizeof *f);
    siad_value(&f->effective_osm_mosm_kg, e[SE_K_EOSM], c->num[0]);
    siad_value(&f->urine_osm_mosm_kg, e[SE_K_UOSM], c->num[1]);
    siad_value(&f->urine_na_mmol_l, e[SE_K_UNA], c->num[2]);
    f->volume_status = e[SE_VOLUME];
    f->normal_salt_water_intake = e[SE_INTAKE];
    f->thyroid_normal = e[SE_THYROID];
    f->adrenal_normal = e[SE_ADRENAL];
    f->pituitary_normal = e[SE_PITUITARY];
    f->kidney_normal = e[SE_KIDNEY];
    f->recent_diuretic = e[SE_DIURETIC];
    f->saline_corrected = e[SE_SALINE];
    f->restriction_corrected = e[SE_RESTRICTION];
    siad_value(&f->uric_acid_mmol_l, e[SE_K_URIC], c->num[3]);
    siad_value(&f->urea_mmol_l, e[SE_K_UREA], c->num[4]);
    siad_value(&f->fe_na_percent, e[SE_K_FENA], c->num[5]);
    siad_value(&f->fe_urea_percent, e[SE_K_FEUREA], c->num[6]);
    siad_value(&f->fe_uric_acid_percent, e[SE_K_FEURIC], c->num[7]);
}

static void prepare_siad(ntrc_case *c)
{
    /* The findings follow the case's numbers and enumerators. */
    base_siad(c);
    c->out.s.siad.struct_size = siad_size(c->en[SE_RSIZE], sizeof c->out.s.siad);
}

static int call_siad_evaluate(ntrc_case *c)
{
    return ntr_siad_evaluate(in_null(c, 0) ? NULL : &c->findings,
                             in_null(c, 1) ? NULL : &c->out.s.siad);
}

static int predict_siad(const ntrc_fn *f, const ntrc_case *c)
{
    int i;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < f->n_enum; i++) {
        if (!ntrc_enum_is_valid(f, i, c->en[i])) {
            return NTR_ERR_ARG;
        }
    }
    for (i = 0; i < 8; i++) {
        if (c->en[siad_known_en[i]] != 1) {
            continue; /* not known: the value is ignored, even NaN */
        }
        if (!isfinite(c->num[i])) {
            return NTR_ERR_NONFINITE;
        }
        if (c->num[i] < f->num[i].lo || c->num[i] > f->num[i].hi) {
            return NTR_ERR_RANGE;
        }
    }
    return NTR_OK;
}

static int popcount_ul(unsigned long x)
{
    int n = 0;
    while (x != 0ul) {
        n += (int)(x & 1ul);
        x >>= 1;
    }
    return n;
}

static const char *ok_siad(const ntrc_case *c)
{
    const ntr_siad_result *r = &c->out.s.siad;
    unsigned long all = r->met | r->not_met | r->not_known | r->not_assessable;
    int sum = popcount_ul(r->met) + popcount_ul(r->not_met) + popcount_ul(r->not_known) +
              popcount_ul(r->not_assessable);
    if (r->struct_size != siad_size(c->en[SE_RSIZE], sizeof *r)) {
        return "struct_size of the result was written";
    }
    if (all != r->evaluated || sum != popcount_ul(r->evaluated)) {
        return "criteria not partitioned into met / not met / not known / not assessable";
    }
    if (r->supplemental_met_count != popcount_ul(r->met & NTR_SIAD_SUPPLEMENTAL_BITS)) {
        return "supplemental count differs from the met mask";
    }
    if ((r->not_met & NTR_SIAD_ESSENTIAL_BITS) != 0ul) {
        return r->verdict == NTR_SIAD_NOT_CONSISTENT ? NULL : "essential not met, wrong verdict";
    }
    if ((r->met & r->evaluated & NTR_SIAD_ESSENTIAL_BITS) == (r->evaluated & NTR_SIAD_ESSENTIAL_BITS)) {
        return r->verdict == NTR_SIAD_CONSISTENT ? NULL : "all essential met, wrong verdict";
    }
    return r->verdict == NTR_SIAD_INCOMPLETE ? NULL : "unsettled essentials, wrong verdict";
}

static void extra_siad(const ntrc_fn *f, void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    int k;
    /* A value that is not known is ignored, whatever it holds. */
    for (k = 0; k < 8; k++) {
        const double junk[] = {NAN, HUGE_VAL, -HUGE_VAL, -1e300, 1e300};
        size_t j;
        for (j = 0; j < sizeof junk / sizeof junk[0]; j++) {
            ntrc_baseline(f, &c);
            c.en[siad_known_en[k]] = 0;
            c.num[k] = junk[j];
            judge(f, &c, NTRC_KIND_SERIES);
        }
    }
    /* Nothing known at all: an incomplete verdict, no error. */
    ntrc_baseline(f, &c);
    for (k = 0; k < 8; k++) {
        c.en[siad_known_en[k]] = 0;
        c.num[k] = NAN;
    }
    for (k = SE_VOLUME; k <= SE_RESTRICTION; k++) {
        c.en[k] = 0;
    }
    judge(f, &c, NTRC_KIND_SERIES);
}

static int call_siad_findings_init(ntrc_case *c)
{
    return ntr_siad_findings_init(in_null(c, 0) ? NULL : &c->out.s.findings);
}

static const char *ok_siad_findings_init(const ntrc_case *c)
{
    const ntr_siad_findings *f = &c->out.s.findings;
    if (f->struct_size != sizeof *f) {
        return "struct_size not set";
    }
    if (f->effective_osm_mosm_kg.known || f->urine_osm_mosm_kg.known || f->urine_na_mmol_l.known ||
        f->uric_acid_mmol_l.known || f->urea_mmol_l.known || f->fe_na_percent.known ||
        f->fe_urea_percent.known || f->fe_uric_acid_percent.known) {
        return "a value marked known";
    }
    if (f->volume_status != NTR_VOLUME_UNKNOWN || f->normal_salt_water_intake != 0 ||
        f->thyroid_normal != 0 || f->adrenal_normal != 0 || f->pituitary_normal != 0 ||
        f->kidney_normal != 0 || f->recent_diuretic != 0 || f->saline_corrected != 0 ||
        f->restriction_corrected != 0) {
        return "a finding not set to unknown";
    }
    return NULL;
}

static int results_siad(const ntrc_case *c, double *v, int max)
{
    const ntr_siad_result *r = &c->out.s.siad;
    if (max < 7) {
        return 0;
    }
    v[0] = r->verdict;
    v[1] = r->supplemental_met_count;
    v[2] = (double)r->evaluated;
    v[3] = (double)r->met;
    v[4] = (double)r->not_met;
    v[5] = (double)r->not_known;
    v[6] = (double)r->missing;
    return 7;
}

/* Fractional uric acid excretion: the bands as the header states them
 * (Fenske et al. 2008), both edges strict. */
static int fe_uric_acid_band(double percent)
{
    return percent > 12.0  ? NTR_FE_URIC_ACID_SUPPORTS_SIAD
           : percent < 8.0 ? NTR_FE_URIC_ACID_AGAINST_SIAD
                           : NTR_FE_URIC_ACID_INDETERMINATE;
}

static int call_fe_uric_acid_class(ntrc_case *c)
{
    return ntr_fe_uric_acid_class(c->num[0], oi(c, 0));
}

static const char *ok_fe_uric_acid_class(const ntrc_case *c)
{
    return c->out.i[0] == fe_uric_acid_band(c->num[0]) ? NULL : "class does not match its band";
}

static int call_fe_uric_acid_after_correction(ntrc_case *c)
{
    return ntr_fe_uric_acid_after_correction(c->num[0], c->num[1], c->num[2], oi(c, 0));
}

static const char *ok_fe_uric_acid_after_correction(const ntrc_case *c)
{
    int want;
    if (c->num[2] < 135.0) {
        want = NTR_URIC_ACID_COURSE_NOT_CORRECTED;
    } else if (!(c->num[0] > 12.0)) {
        want = NTR_URIC_ACID_COURSE_NOT_HIGH_BEFORE;
    } else if (c->num[1] > 12.0) {
        want = NTR_URIC_ACID_COURSE_PERSISTENT_HIGH;
    } else if (c->num[1] < 8.0) {
        want = NTR_URIC_ACID_COURSE_NORMALISED;
    } else {
        want = NTR_URIC_ACID_COURSE_UNSETTLED;
    }
    return c->out.i[0] == want ? NULL : "reading does not follow the documented rule";
}

/* ---- solute ------------------------------------------------------------------- */

/* The header's figures: urea 60.056 g/mol, NaCl 58.443 g/mol (2 osmoles per
 * mole); the tolerance below allows for the rounding of those figures. */
static double mosm_per_gram_doc(int solute)
{
    return solute == NTR_SOLUTE_UREA ? 1000.0 / 60.056 : 2000.0 / 58.443;
}

/* V*(1 - (U_Na + U_K)/S_Na) + insensible from the documented equation. */
static double allowance_doc(const double *x)
{
    return x[0] / x[1] * (1.0 - (x[2] + x[3]) / x[4]) + x[5];
}

static int call_urine_volume_from_solute(ntrc_case *c)
{
    return ntr_urine_volume_from_solute(c->num[0], c->num[1], od(c, 0));
}

static const char *ok_urine_volume_from_solute(const ntrc_case *c)
{
    if (!within(c->out.d[0], 0.0, 30.0)) {
        return "urine volume outside [0, 30] L/day";
    }
    return close_to(c->out.d[0], c->num[0] / c->num[1], 1e-14) ? NULL : "off solute / U_osm";
}

static int call_fluid_allowance(ntrc_case *c)
{
    return ntr_fluid_allowance(c->num[0], c->num[1], c->num[2], c->num[3], c->num[4], c->num[5],
                               od(c, 0));
}

static const char *ok_fluid_allowance(const ntrc_case *c)
{
    /* V <= 30 L/day, 1 - ratio in [-9, 1], insensible 0 to 10. */
    if (!within(c->out.d[0], -270.0, 40.0)) {
        return "allowance outside [-270, 40] L/day";
    }
    return close_to(c->out.d[0], allowance_doc(c->num), 1e-12) ? NULL
                                                              : "off V(1 - ratio) + insensible";
}

static int call_solute_dose_osmoles(ntrc_case *c)
{
    return ntr_solute_dose_osmoles(c->en[0], c->num[0], od(c, 0));
}

static const char *ok_solute_dose_osmoles(const ntrc_case *c)
{
    if (!within(c->out.d[0], 0.0, 200.0 * 34.23)) {
        return "osmoles outside [0, 6846] mOsm";
    }
    return close_to(c->out.d[0], c->num[0] * mosm_per_gram_doc(c->en[0]), 1e-4)
               ? NULL
               : "off 1000 g n / M";
}

static int call_fluid_allowance_with_dose(ntrc_case *c)
{
    return ntr_fluid_allowance_with_dose(c->en[0], c->num[0], c->num[1], c->num[2], c->num[3],
                                         c->num[4], c->num[5], c->num[6], od(c, 0));
}

static const char *ok_fluid_allowance_with_dose(const ntrc_case *c)
{
    const double *x = c->num;
    double expect = allowance_doc(x + 1) + x[0] * mosm_per_gram_doc(c->en[0]) / x[2];
    if (!within(c->out.d[0], -270.0, 40.0)) {
        return "allowance outside [-270, 40] L/day";
    }
    return close_to(c->out.d[0], expect, 1e-4) ? NULL : "off A0 + dose osmoles / U_osm";
}

static int call_solute_dose_for_allowance(ntrc_case *c)
{
    return ntr_solute_dose_for_allowance(c->en[0], c->num[0], c->num[1], c->num[2], c->num[3],
                                         c->num[4], c->num[5], c->num[6], od(c, 0));
}

static const char *ok_solute_dose_for_allowance(const ntrc_case *c)
{
    const double *x = c->num;
    double a;
    if (!within(c->out.d[0], 0.0, 200.0)) {
        return "dose outside [0, 200] g/day";
    }
    if (c->out.d[0] == 0.0) {
        return allowance_doc(x) >= x[6] - 1e-12 * (1.0 + fabs(x[6])) ? NULL
                                                                     : "no dose but target not met";
    }
    if (ntr_fluid_allowance_with_dose(c->en[0], c->out.d[0], x[0], x[1], x[2], x[3], x[4], x[5],
                                      &a) != NTR_OK) {
        return "the dose is rejected by the forward function";
    }
    return close_to(a, x[6], 1e-9) ? NULL : "dose does not reproduce the target allowance";
}

static void prepare_outlook(ntrc_case *c)
{
    c->out.s.outlook.struct_size = siad_size(c->en[0], sizeof c->out.s.outlook);
}

static int call_restriction_outlook(ntrc_case *c)
{
    return ntr_restriction_outlook(c->num[0], c->num[1], c->num[2], c->num[3], c->num[4],
                                   c->num[5], c->num[6],
                                   in_null(c, 0) ? NULL : &c->out.s.outlook);
}

static const char *ok_outlook_dose(double g, unsigned int flags, unsigned int flag)
{
    if (g == NTR_OUTLOOK_NO_DOSE) {
        return (flags & flag) != 0u ? NULL : "no dose without its flag";
    }
    if ((flags & flag) != 0u) {
        return "out-of-range flag with a dose";
    }
    return within(g, 0.0, 200.0) ? NULL : "dose outside [0, 200] g/day";
}

static const char *ok_restriction_outlook(const ntrc_case *c)
{
    const ntr_outlook *o = &c->out.s.outlook;
    const double *x = c->num;
    int want;
    const char *why;
    if (o->struct_size != siad_size(c->en[0], sizeof *o)) {
        return "struct_size of the outlook was written";
    }
    if (!close_to(o->allowance_l_day, allowance_doc(x), 1e-12) ||
        !close_to(o->urine_l_day, x[0] / x[1], 1e-14) ||
        !close_to(o->furst_ratio, (x[2] + x[3]) / x[4], 1e-14) ||
        !close_to(o->efwc_l_day, o->allowance_l_day - x[5], 1e-12)) {
        return "outlook figures off their equations";
    }
    want = o->allowance_l_day <= 0.0     ? NTR_OUTLOOK_RESTRICTION_FAILS
           : o->allowance_l_day >= x[6] ? NTR_OUTLOOK_TARGET_HOLDS
                                        : NTR_OUTLOOK_STRICTER_OR_SOLUTE;
    if (o->verdict != want || o->target_intake_l_day != x[6]) {
        return "verdict does not follow the allowance";
    }
    if (((o->flags & NTR_OUTLOOK_FURST_ABOVE_ONE) != 0u) != (o->furst_ratio > 1.0) ||
        (o->flags & ~0x7u) != 0u || o->reserved != 0u) {
        return "flags or reserved wrong";
    }
    why = ok_outlook_dose(o->urea_g_day, o->flags, NTR_OUTLOOK_UREA_OUT_OF_RANGE);
    return why != NULL ? why : ok_outlook_dose(o->nacl_g_day, o->flags, NTR_OUTLOOK_NACL_OUT_OF_RANGE);
}

static int results_outlook(const ntrc_case *c, double *v, int max)
{
    const ntr_outlook *o = &c->out.s.outlook;
    if (max < 10) {
        return 0;
    }
    v[0] = o->verdict;
    v[1] = o->furst_advice;
    v[2] = o->furst_ratio;
    v[3] = o->urine_l_day;
    v[4] = o->efwc_l_day;
    v[5] = o->allowance_l_day;
    v[6] = o->target_intake_l_day;
    v[7] = o->urea_g_day;
    v[8] = o->nacl_g_day;
    v[9] = (double)o->flags;
    return 10;
}

/* ---- input ranges ---------------------------------------------------------------- */

/* NTR_INPUT_* kinds of this version: 1 to 39 without gaps. */
#define INPUT_KINDS 39

static int call_input_range(ntrc_case *c)
{
    return ntr_input_range(c->en[0], od(c, 0), od(c, 1));
}

static int predict_input_range(const ntrc_fn *f, const ntrc_case *c)
{
    (void)f;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    return (c->en[0] >= 1 && c->en[0] <= INPUT_KINDS) ? NTR_OK : NTR_ERR_ARG;
}

static const char *ok_input_range(const ntrc_case *c)
{
    double lo = c->out.d[0], hi = c->out.d[1];
    return (isfinite(lo) && isfinite(hi) && lo < hi && lo >= -1.0e6 && hi <= 1.0e6)
               ? NULL
               : "range not finite, empty or beyond the largest constant (1e6)";
}

/* ---- provenance ---------------------------------------------------------------- */

/* Whether the running library knows a method id, by its own iterator. */
static int method_known(int id)
{
    int walk = 0;
    int next;
    while (ntr_method_next(walk, &next) == NTR_OK) {
        if (next == id) {
            return 1;
        }
        if (next <= walk) {
            return 0; /* not increasing: judged in ok_method_next */
        }
        walk = next;
    }
    return 0;
}

static int call_method_info(ntrc_case *c)
{
    return ntr_method_info(c->en[0], in_null(c, 0) ? NULL : &c->out.s.info);
}

static int predict_method_info(const ntrc_fn *f, const ntrc_case *c)
{
    (void)f;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    return method_known(c->en[0]) ? NTR_OK : NTR_ERR_ARG;
}

static int printable_string(const char *s)
{
    size_t i;
    if (s == NULL || s[0] == '\0') {
        return 0;
    }
    for (i = 0; s[i] != '\0'; i++) {
        if ((unsigned char)s[i] < 0x20 || (unsigned char)s[i] > 0x7e || i > 2000) {
            return 0;
        }
    }
    return 1;
}

static const char *ok_method_info(const ntrc_case *c)
{
    const struct ntr_method_info *m = &c->out.s.info;
    int i;
    if (m->method != c->en[0] || m->reserved_int != 0) {
        return "method id or reserved_int wrong";
    }
    if (!printable_string(m->name) || !printable_string(m->equation) ||
        !printable_string(m->reference) || !printable_string(m->population)) {
        return "a string is NULL, empty or not printable ASCII";
    }
    for (i = 0; i < 4; i++) {
        if (m->reserved[i] != NULL) {
            return "a reserved pointer is not NULL";
        }
    }
    return NULL;
}

static int call_method_next(ntrc_case *c)
{
    return ntr_method_next(c->en[0], oi(c, 0));
}

static int predict_method_next(const ntrc_fn *f, const ntrc_case *c)
{
    (void)f;
    return c->out_null != 0u ? NTR_ERR_NULL : NTR_OK;
}

static const char *ok_method_next(const ntrc_case *c)
{
    struct ntr_method_info m;
    int next = c->out.i[0];
    if (next <= c->en[0] || next <= 0 || next >= 1000) {
        return "next id not above the one given, or outside 1..999";
    }
    if (ntr_method_info(next, &m) != NTR_OK) {
        return "ntr_method_info does not know the id the iterator gave";
    }
    return NULL;
}

static const char *err_method_next(const ntrc_case *c, const ntrc_outs *before, int status)
{
    int id;
    if (memcmp(&c->out, before, sizeof *before) != 0) {
        return "an output was written on error";
    }
    if (status == NTR_ERR_RANGE && c->en[0] < 999) {
        /* End of the walk: no known id above. */
        for (id = c->en[0] < 0 ? 1 : c->en[0] + 1; id < 1000; id++) {
            struct ntr_method_info m;
            if (ntr_method_info(id, &m) == NTR_OK) {
                return "end of walk although a larger id is known";
            }
        }
    }
    return NULL;
}

/* ---- correction ------------------------------------------------------------------ */

#define LIMITS_NUMS(first)                                                              \
    {"max_rise_24h", 0.0, 50.0, 1}, {"max_rise_48h", 0.0, 50.0, 1},                     \
    {"min_rise_24h", 0.0, 50.0, 0}

static void limits_from(const double *x, ntr_limits *lim)
{
    lim->max_rise_24h = x[0];
    lim->max_rise_48h = x[1];
    lim->min_rise_24h = x[2];
}

/* NTR_OK, or the status the limits checks give (field order, then the
 * relations between them). */
static int limits_status(const double *x)
{
    int i;
    for (i = 0; i < 3; i++) {
        if (!isfinite(x[i])) {
            return NTR_ERR_NONFINITE;
        }
        if (x[i] < 0.0 || x[i] > 50.0 || (i < 2 && x[i] == 0.0)) {
            return NTR_ERR_RANGE;
        }
    }
    if (x[0] > x[1] || x[2] > x[0]) {
        return NTR_ERR_RANGE;
    }
    return NTR_OK;
}

static int check_value(double x, double lo, double hi)
{
    if (!isfinite(x)) {
        return NTR_ERR_NONFINITE;
    }
    return (x < lo || x > hi) ? NTR_ERR_RANGE : NTR_OK;
}

static int samples_status(const ntr_sample *s, size_t n)
{
    size_t i;
    int st;
    for (i = 0; i < n; i++) {
        if ((st = check_value(s[i].hours, -1e6, 1e6)) != NTR_OK ||
            (st = check_value(s[i].na_mmol_l, 80.0, 220.0)) != NTR_OK) {
            return st;
        }
    }
    return NTR_OK;
}

static int samples_sorted(const ntr_sample *s, size_t n)
{
    size_t i;
    for (i = 1; i < n; i++) {
        if (s[i].hours < s[i - 1].hours) {
            return 0;
        }
    }
    return 1;
}

/* A rising series with a plateau: 6 samples over 30 h. */
static void base_samples(ntrc_case *c)
{
    static const double hours[] = {0.0, 4.0, 8.0, 12.0, 24.0, 30.0};
    static const double na[] = {115.0, 118.0, 121.0, 123.0, 124.0, 126.0};
    size_t i;
    c->n = 6;
    for (i = 0; i < c->n; i++) {
        c->samples[i].hours = hours[i];
        c->samples[i].na_mmol_l = na[i];
    }
}

/* A series from the fuzzer: times mostly increasing. */
static void fuzz_samples(ntrc_case *c, ntrc_source *src)
{
    size_t i;
    double t = src->number(src, -100.0, 100.0);
    c->n = src->byte(src) % (NTRC_MAX_SERIES + 1);
    for (i = 0; i < c->n; i++) {
        c->samples[i].hours = t;
        c->samples[i].na_mmol_l = src->number(src, 100.0, 150.0);
        t += src->number(src, 0.0, 12.0);
    }
}

static int call_correction_assess(ntrc_case *c)
{
    ntr_limits lim;
    limits_from(c->num, &lim);
    return ntr_correction_assess(in_null(c, 0) ? NULL : c->samples, c->n,
                                 in_null(c, 1) ? NULL : &lim,
                                 in_null(c, 2) ? NULL : &c->out.s.corr);
}

static int predict_correction_assess(const ntrc_fn *f, const ntrc_case *c)
{
    int st;
    (void)f;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    if (c->n == 0) {
        return NTR_ERR_ARG;
    }
    if ((st = samples_status(c->samples, c->n)) != NTR_OK ||
        (st = limits_status(c->num)) != NTR_OK) {
        return st;
    }
    return samples_sorted(c->samples, c->n) ? NTR_OK : NTR_ERR_ORDER;
}

/* Largest rise over pairs i < j at most w hours apart, by brute force. */
static double brute_rise(const ntr_sample *s, size_t n, double w)
{
    double best = 0.0;
    size_t i;
    size_t j;
    for (i = 0; i < n; i++) {
        for (j = i + 1; j < n; j++) {
            if (s[j].hours - s[i].hours <= w && s[j].na_mmol_l - s[i].na_mmol_l > best) {
                best = s[j].na_mmol_l - s[i].na_mmol_l;
            }
        }
    }
    return best;
}

static double brute_first(const ntr_sample *s, size_t n, double w)
{
    double best = 0.0;
    size_t j;
    for (j = 1; j < n; j++) {
        if (s[j].hours - s[0].hours <= w && s[j].na_mmol_l - s[0].na_mmol_l > best) {
            best = s[j].na_mmol_l - s[0].na_mmol_l;
        }
    }
    return best;
}

/* The value must lie between the brute-force answers for a window a
 * little shorter and a little longer (the library's time tolerance). */
static int rise_ok(double got, const ntr_sample *s, size_t n, double w, int first)
{
    double lo = first ? brute_first(s, n, w - 1e-5) : brute_rise(s, n, w - 1e-5);
    double hi = first ? brute_first(s, n, w + 1e-5) : brute_rise(s, n, w + 1e-5);
    return got >= lo && got <= hi;
}

static const char *judge_correction(const ntr_correction *r, const ntr_sample *s, size_t n,
                                    const ntr_limits *lim)
{
    if (!isfinite(r->rise_first_24h) || !isfinite(r->max_rise_24h) ||
        !isfinite(r->max_rise_48h) || !isfinite(r->last_rate_per_h) ||
        !isfinite(r->excess_mmol_l)) {
        return "a non-finite field";
    }
    if ((r->flags & ~NTR_CF_ALL) != 0u || r->reserved != 0u) {
        return "undefined flag bits or reserved field set";
    }
    if (!rise_ok(r->max_rise_24h, s, n, 24.0, 0) || !rise_ok(r->max_rise_48h, s, n, 48.0, 0) ||
        !rise_ok(r->rise_first_24h, s, n, 24.0, 1)) {
        return "window rise differs from the brute-force maximum";
    }
    if (r->excess_mmol_l < 0.0 || r->excess_mmol_l > 140.0) {
        return "excess outside [0, 140]";
    }
    if (((r->flags & NTR_CF_OVER_24H) != 0u) !=
        (r->max_rise_24h > lim->max_rise_24h + NTR_CF_TOLERANCE)) {
        return "24 h over-limit flag disagrees with the rise";
    }
    if (((r->flags & NTR_CF_OVER_48H) != 0u) !=
        (r->max_rise_48h > lim->max_rise_48h + NTR_CF_TOLERANCE)) {
        return "48 h over-limit flag disagrees with the rise";
    }
    if (n == 1 && (r->flags != 0u || r->max_rise_24h != 0.0 || r->last_rate_per_h != 0.0)) {
        return "one sample must give zeros and no flag";
    }
    return NULL;
}

static const char *ok_correction_assess(const ntrc_case *c)
{
    ntr_limits lim;
    limits_from(c->num, &lim);
    return judge_correction(&c->out.s.corr, c->samples, c->n, &lim);
}

static int results_correction(const ntrc_case *c, double *v, int max)
{
    const ntr_correction *r = &c->out.s.corr;
    if (max < 6) {
        return 0;
    }
    v[0] = r->rise_first_24h;
    v[1] = r->max_rise_24h;
    v[2] = r->max_rise_48h;
    v[3] = r->last_rate_per_h;
    v[4] = r->excess_mmol_l;
    v[5] = r->flags;
    return 6;
}

static void extra_series(const ntrc_fn *f, void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    size_t k;
    /* n = 0 */
    ntrc_baseline(f, &c);
    c.n = 0;
    judge(f, &c, NTRC_KIND_SERIES);
    /* One sample; two at the same time (a tie is allowed). */
    ntrc_baseline(f, &c);
    c.n = 1;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.samples[2].hours = c.samples[1].hours;
    judge(f, &c, NTRC_KIND_SERIES);
    /* Unsorted at every position, alone and with a later bad value (which
     * must win: order is checked last). */
    ntrc_baseline(f, &c);
    for (k = 1; k < c.n; k++) {
        ntrc_case u = c;
        double t = u.samples[k].hours;
        u.samples[k].hours = u.samples[k - 1].hours;
        u.samples[k - 1].hours = t + 0.5;
        judge(f, &u, NTRC_KIND_SERIES);
        u.samples[u.n - 1].na_mmol_l = NAN;
        judge(f, &u, NTRC_KIND_ORDER);
    }
    /* Each field of each sample spoilt. */
    for (k = 0; k < c.n; k++) {
        const double bad[] = {NAN, HUGE_VAL, -HUGE_VAL, 1e7, -1e7, 79.9, 220.1};
        size_t b;
        for (b = 0; b < sizeof bad / sizeof bad[0]; b++) {
            ntrc_case u = c;
            if (b < 5) {
                u.samples[k].hours = bad[b];
            } else {
                u.samples[k].na_mmol_l = bad[b];
            }
            judge(f, &u, NTRC_KIND_SERIES);
            u.samples[k].na_mmol_l = NAN;
            judge(f, &u, NTRC_KIND_ORDER);
        }
    }
    /* Contradicting limits. */
    ntrc_baseline(f, &c);
    c.num[0] = 20.0; /* 24 h above 48 h */
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.num[2] = c.num[0] + 1.0; /* target above ceiling */
    judge(f, &c, NTRC_KIND_SERIES);
    /* A long steady series filling the whole buffer. */
    ntrc_baseline(f, &c);
    c.n = NTRC_MAX_SERIES;
    for (k = 0; k < c.n; k++) {
        c.samples[k].hours = 0.75 * (double)k;
        c.samples[k].na_mmol_l = 110.0 + 0.3 * (double)k;
    }
    judge(f, &c, NTRC_KIND_SERIES);
}

/* ---- course limits and assessment (1.1, both directions) ---------------------------- */

#define COURSE_NUMS                                                                     \
    {"max_rise_24h", 0.0, 50.0, 0}, {"max_rise_48h", 0.0, 50.0, 0},                     \
    {"max_fall_24h", 0.0, 50.0, 0}, {"max_fall_48h", 0.0, 50.0, 0},                     \
    {"min_change_24h", 0.0, 50.0, 0}
/* en[] of ntr_course_assess: the goal, then the two struct sizes (as for
 * the SIAD structs: 0 right, 2 larger, 1 one byte short, -1 zero). */
#define COURSE_ENUMS                                                                    \
    {"goal", NTR_ERR_ARG, 3, {NTR_GOAL_RAISE, NTR_GOAL_LOWER, NTR_GOAL_HOLD}},          \
    {"limits_struct_size", NTR_ERR_ARG, 2, {0, 2}},                                     \
    {"report_struct_size", NTR_ERR_ARG, 2, {0, 2}}

static void course_limits_from(const ntrc_case *c, ntr_course_limits *lim)
{
    lim->struct_size = siad_size(c->en[1], sizeof *lim);
    lim->goal = c->en[0];
    lim->max_rise_24h = c->num[0];
    lim->max_rise_48h = c->num[1];
    lim->max_fall_24h = c->num[2];
    lim->max_fall_48h = c->num[3];
    lim->min_change_24h = c->num[4];
}

static int course_pair_ok(double a24, double a48)
{
    return a24 <= 0.0 || a48 <= 0.0 || a24 <= a48;
}

/* The numeric checks of course limits, as the header documents them. */
static int course_limits_status(int goal, const double *x)
{
    int i, st;
    for (i = 0; i < 5; i++) {
        if ((st = check_value(x[i], 0.0, 50.0)) != NTR_OK) {
            return st;
        }
    }
    if (!course_pair_ok(x[0], x[1]) || !course_pair_ok(x[2], x[3])) {
        return NTR_ERR_RANGE;
    }
    if (goal == NTR_GOAL_HOLD) {
        return x[4] > 0.0 ? NTR_ERR_RANGE : NTR_OK;
    }
    i = goal == NTR_GOAL_RAISE ? 0 : 2;
    return course_pair_ok(x[4], x[i]) && course_pair_ok(x[4], x[i + 1]) ? NTR_OK : NTR_ERR_RANGE;
}

static void prepare_course(ntrc_case *c)
{
    c->out.s.course.struct_size = siad_size(c->en[2], sizeof c->out.s.course);
}

static int call_course_assess(ntrc_case *c)
{
    ntr_course_limits lim;
    course_limits_from(c, &lim);
    return ntr_course_assess(in_null(c, 0) ? NULL : c->samples, c->n,
                             in_null(c, 1) ? NULL : &lim,
                             in_null(c, 2) ? NULL : &c->out.s.course);
}

static int predict_course_assess(const ntrc_fn *f, const ntrc_case *c)
{
    int st, i;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    if (c->n == 0) {
        return NTR_ERR_ARG;
    }
    for (i = 0; i < 3; i++) {
        if (!ntrc_enum_is_valid(f, i, c->en[i])) {
            return NTR_ERR_ARG;
        }
    }
    if ((st = samples_status(c->samples, c->n)) != NTR_OK ||
        (st = course_limits_status(c->en[0], c->num)) != NTR_OK) {
        return st;
    }
    return samples_sorted(c->samples, c->n) ? NTR_OK : NTR_ERR_ORDER;
}

/* Largest fall over pairs i < j at most w hours apart, by brute force. */
static double brute_fall(const ntr_sample *s, size_t n, double w)
{
    double best = 0.0;
    size_t i;
    size_t j;
    for (i = 0; i < n; i++) {
        for (j = i + 1; j < n; j++) {
            if (s[j].hours - s[i].hours <= w && s[i].na_mmol_l - s[j].na_mmol_l > best) {
                best = s[i].na_mmol_l - s[j].na_mmol_l;
            }
        }
    }
    return best;
}

static int fall_ok(double got, const ntr_sample *s, size_t n, double w)
{
    return got >= brute_fall(s, n, w - 1e-5) && got <= brute_fall(s, n, w + 1e-5);
}

static const char *judge_course(const ntr_course_report *r, const ntr_sample *s, size_t n,
                                const ntr_course_limits *lim)
{
    const double v[] = {r->max_rise_24h, r->max_rise_48h, r->max_fall_24h, r->max_fall_48h,
                        r->excess_mmol_l, r->rise_first_24h, r->fall_first_24h,
                        r->rise_now_24h, r->fall_now_24h};
    size_t i;
    for (i = 0; i < sizeof v / sizeof v[0]; i++) {
        if (!within(v[i], 0.0, 140.0)) {
            return "a change outside [0, 140] or not finite";
        }
    }
    if (!isfinite(r->last_rate_per_h) || !isfinite(r->elapsed_h) || !isfinite(r->worst_at_h)) {
        return "a non-finite field";
    }
    if ((r->flags & ~NTR_CF_COURSE_ALL) != 0u || r->reserved != 0u ||
        r->struct_size != sizeof *r) {
        return "undefined flag bits, reserved field or struct_size wrong";
    }
    if (!rise_ok(r->max_rise_24h, s, n, 24.0, 0) || !rise_ok(r->max_rise_48h, s, n, 48.0, 0) ||
        !fall_ok(r->max_fall_24h, s, n, 24.0) || !fall_ok(r->max_fall_48h, s, n, 48.0)) {
        return "window change differs from the brute-force maximum";
    }
    if (((r->flags & NTR_CF_FALL_OVER_24H) != 0u) !=
        (lim->max_fall_24h > 0.0 && r->max_fall_24h > lim->max_fall_24h + NTR_CF_TOLERANCE)) {
        return "24 h fall flag disagrees with the fall";
    }
    if (((r->flags & NTR_CF_OVER_24H) != 0u) !=
        (lim->max_rise_24h > 0.0 && r->max_rise_24h > lim->max_rise_24h + NTR_CF_TOLERANCE)) {
        return "24 h rise flag disagrees with the rise";
    }
    if ((r->excess_mmol_l > 0.0) != (r->worst_at_h != NTR_COURSE_NO_TIME)) {
        return "worst window time without an excess, or an excess without it";
    }
    if ((r->flags & NTR_CF_APPROXIMATE) != 0u) {
        return "an assessment of a whole series marked approximate";
    }
    return NULL;
}

static const char *ok_course_assess(const ntrc_case *c)
{
    ntr_course_limits lim;
    course_limits_from(c, &lim);
    return judge_course(&c->out.s.course, c->samples, c->n, &lim);
}

static int results_course_report(const ntrc_case *c, double *v, int max)
{
    const ntr_course_report *r = &c->out.s.course;
    if (max < 14) {
        return 0;
    }
    v[0] = r->max_rise_24h;
    v[1] = r->max_rise_48h;
    v[2] = r->max_fall_24h;
    v[3] = r->max_fall_48h;
    v[4] = r->excess_mmol_l;
    v[5] = r->flags;
    v[6] = r->rise_first_24h;
    v[7] = r->fall_first_24h;
    v[8] = r->rise_now_24h;
    v[9] = r->fall_now_24h;
    v[10] = r->last_rate_per_h;
    v[11] = r->elapsed_h;
    v[12] = r->worst_at_h;
    v[13] = (double)r->struct_size;
    return 14;
}

static void extra_course_series(const ntrc_fn *f,
                                void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    /* n = 0; one sample; a falling series over the fall limit. */
    ntrc_baseline(f, &c);
    c.n = 0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.n = 1;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.samples[3].na_mmol_l = 100.0;
    judge(f, &c, NTRC_KIND_SERIES);
    /* Contradicting limits: 24 h above 48 h per direction; targets above a
     * ceiling; a target on a hold. */
    ntrc_baseline(f, &c);
    c.num[0] = 20.0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.num[2] = 30.0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.num[4] = 11.0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.en[0] = NTR_GOAL_HOLD;
    c.num[4] = 1.0;
    judge(f, &c, NTRC_KIND_SERIES);
    /* Unsorted, with a bad limit (which must win). */
    ntrc_baseline(f, &c);
    c.samples[1].hours = 50.0;
    judge(f, &c, NTRC_KIND_ORDER);
    c.num[3] = NAN;
    judge(f, &c, NTRC_KIND_ORDER);
}

static int call_course_limits_preset(ntrc_case *c)
{
    return ntr_course_limits_preset(c->en[0], in_null(c, 0) ? NULL : &c->out.s.clim);
}

static const char *ok_course_limits_preset(const ntrc_case *c)
{
    const ntr_course_limits *l = &c->out.s.clim;
    double x[5];
    x[0] = l->max_rise_24h;
    x[1] = l->max_rise_48h;
    x[2] = l->max_fall_24h;
    x[3] = l->max_fall_48h;
    x[4] = l->min_change_24h;
    if (l->struct_size != sizeof *l || l->min_change_24h != 0.0) {
        return "struct_size not set or a target in a preset";
    }
    return course_limits_status(l->goal, x) == NTR_OK ? NULL : "preset limits are not valid";
}

static int results_course_limits(const ntrc_case *c, double *v, int max)
{
    const ntr_course_limits *l = &c->out.s.clim;
    if (max < 6) {
        return 0;
    }
    v[0] = l->goal;
    v[1] = l->max_rise_24h;
    v[2] = l->max_rise_48h;
    v[3] = l->max_fall_24h;
    v[4] = l->max_fall_48h;
    v[5] = l->min_change_24h;
    return 6;
}

/* ---- course watcher (1.1) ---------------------------------------------------------- */

/* en[0] of the course watch entries: 0 an intact state; 1 never
 * initialised (zeroed); 2 a broken marker; 3 a kept count beyond the ring;
 * 4 all bytes 0xff; 5-8 one inconsistent private member each; 9-11 a
 * stored number NaN, infinite or out of range. en[1]: the report's
 * struct_size (as for the SIAD structs). */
static void damage_course_watch(ntr_course_watch *w, int mode)
{
    switch (mode) {
    case 0: break;
    case 1: memset(w, 0, sizeof *w); break;
    case 2: w->magic ^= 0x10101010u; break;
    case 3: w->low.kept = NTR_COURSE_WATCH_CAPACITY + 5u; break;
    case 4: memset(w, 0xff, sizeof *w); break;
    case 5:
        if (w->high.kept > 0u) {
            w->high.front24 = w->high.kept;
        } else {
            w->seen = 1u;
        }
        break;
    case 6: w->seen = w->low.kept > 0u ? 0u : 2u; break;
    case 7: w->limits.goal = 7; break;
    case 8: w->high.head = NTR_COURSE_WATCH_CAPACITY; break;
    case 9: w->max_fall_24h = NAN; break;
    case 10: w->rise_first_24h = HUGE_VAL; break;
    default: w->limits.max_rise_24h = -1.0; break;
    }
}

#define COURSE_WATCH_MODES                                                              \
    {"watch_state", NTR_ERR_ARG, 1, {0}}, {"report_struct_size", NTR_ERR_ARG, 2, {0, 2}}

static void prime_course_watch(ntrc_case *c)
{
    ntr_course_limits lim;
    ntr_course_report out;
    size_t i;
    size_t kept = 0;
    ntrc_setup_ok(ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, &lim));
    memset(&c->cwatch, 0, sizeof c->cwatch); /* every byte defined for the comparisons */
    ntrc_setup_ok(ntr_course_watch_init(&lim, &c->cwatch));
    out.struct_size = sizeof out;
    for (i = 0; i < c->n; i++) {
        if (ntr_course_watch_push(&c->cwatch, c->samples[i].hours, c->samples[i].na_mmol_l,
                                  &out) == NTR_OK) {
            c->samples[kept++] = c->samples[i];
        }
    }
    c->n = kept;
    c->cwatch_clean = c->cwatch;
}

static void prepare_course_watch(ntrc_case *c)
{
    c->cwatch = c->cwatch_clean;
    damage_course_watch(&c->cwatch, c->en[0]);
    c->out.s.course.struct_size = siad_size(c->en[1], sizeof c->out.s.course);
}

static void base_course_watch(ntrc_case *c)
{
    base_samples(c);
    c->n = 4; /* the pushed sample comes after hour 12 */
    prime_course_watch(c);
}

static void fuzz_course_watch(ntrc_case *c, ntrc_source *src)
{
    fuzz_samples(c, src);
    prime_course_watch(c);
}

static int call_course_watch_init(ntrc_case *c)
{
    ntr_course_limits lim;
    course_limits_from(c, &lim);
    return ntr_course_watch_init(in_null(c, 0) ? NULL : &lim,
                                 in_null(c, 1) ? NULL : &c->out.s.cwatch);
}

static int predict_course_watch_init(const ntrc_fn *f, const ntrc_case *c)
{
    int i;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    for (i = 0; i < 2; i++) {
        if (!ntrc_enum_is_valid(f, i, c->en[i])) {
            return NTR_ERR_ARG;
        }
    }
    return course_limits_status(c->en[0], c->num);
}

static const char *ok_course_watch_init(const ntrc_case *c)
{
    ntr_course_report r;
    ntr_course_watch w = c->out.s.cwatch;
    r.struct_size = sizeof r;
    return ntr_course_watch_result(&w, &r) == NTR_ERR_ARG ? NULL
                                                          : "fresh course watcher reports a result";
}

static int results_course_watch_init(const ntrc_case *c, double *v, int max)
{
    static ntrc_case probe; /* large: kept off the stack */
    ntr_course_watch w = c->out.s.cwatch;
    probe.out.s.course.struct_size = sizeof probe.out.s.course;
    if (ntr_course_watch_push(&w, 0.0, 120.0, &probe.out.s.course) != NTR_OK) {
        return 0;
    }
    return results_course_report(&probe, v, max);
}

static int call_course_watch_push(ntrc_case *c)
{
    return ntr_course_watch_push(in_null(c, 0) ? NULL : &c->cwatch, c->num[0], c->num[1],
                                 in_null(c, 1) ? NULL : &c->out.s.course);
}

static int predict_course_watch_push(const ntrc_fn *f, const ntrc_case *c)
{
    int st;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    if (!ntrc_enum_is_valid(f, 0, c->en[0]) || !ntrc_enum_is_valid(f, 1, c->en[1])) {
        return NTR_ERR_ARG;
    }
    if ((st = check_value(c->num[0], -1e6, 1e6)) != NTR_OK ||
        (st = check_value(c->num[1], 80.0, 220.0)) != NTR_OK) {
        return st;
    }
    if (c->n > 0 && c->num[0] < c->samples[c->n - 1].hours) {
        return NTR_ERR_ORDER;
    }
    return NTR_OK;
}

/* While its memory holds (always, for series this short), the watcher
 * equals ntr_course_assess over the same samples bit for bit. */
static const char *same_as_course_assess(const ntr_course_report *got, const ntr_sample *s,
                                         size_t n)
{
    ntr_course_limits lim;
    ntr_course_report want;
    ntrc_setup_ok(ntr_course_limits_preset(NTR_COURSE_HYPO_STANDARD, &lim));
    want.struct_size = sizeof want;
    if (ntr_course_assess(s, n, &lim, &want) != NTR_OK) {
        return "ntr_course_assess rejects the series the course watcher accepted";
    }
    if (memcmp(&want, got, sizeof want) != 0) {
        return "course watcher differs from ntr_course_assess on the same series";
    }
    return judge_course(got, s, n, &lim);
}

static const char *ok_course_watch_push(const ntrc_case *c)
{
    ntr_sample s[NTRC_MAX_SERIES + 1];
    memcpy(s, c->samples, c->n * sizeof s[0]);
    s[c->n].hours = c->num[0];
    s[c->n].na_mmol_l = c->num[1];
    return same_as_course_assess(&c->out.s.course, s, c->n + 1);
}

static int call_course_watch_push_glucose(ntrc_case *c)
{
    return ntr_course_watch_push_glucose(in_null(c, 0) ? NULL : &c->cwatch, c->num[0],
                                         c->num[1], c->num[2], c->en[2],
                                         in_null(c, 1) ? NULL : &c->out.s.course);
}

/* As the plain push, with the glucose third; the corrected sodium must
 * still be a watchable one (80-220), checked before the order. */
static int predict_course_watch_push_glucose(const ntrc_fn *f, const ntrc_case *c)
{
    int st;
    double corrected;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    if (!ntrc_enum_is_valid(f, 0, c->en[0]) || !ntrc_enum_is_valid(f, 1, c->en[1]) ||
        !ntrc_enum_is_valid(f, 2, c->en[2])) {
        return NTR_ERR_ARG;
    }
    if ((st = check_value(c->num[0], -1e6, 1e6)) != NTR_OK ||
        (st = check_value(c->num[1], 80.0, 220.0)) != NTR_OK ||
        (st = check_value(c->num[2], 0.0, 200.0)) != NTR_OK) {
        return st;
    }
    if (ntr_na_corrected_glucose(c->num[1], c->num[2], c->en[2], &corrected) != NTR_OK) {
        return NTR_ERR_ARG; /* cannot happen after the checks above */
    }
    if (corrected > 220.0) {
        return NTR_ERR_RANGE;
    }
    if (c->n > 0 && c->num[0] < c->samples[c->n - 1].hours) {
        return NTR_ERR_ORDER;
    }
    return NTR_OK;
}

/* The glucose push equals the plain push of ntr_na_corrected_glucose()'s
 * value, so the series with the corrected last sample is the oracle. */
static const char *ok_course_watch_push_glucose(const ntrc_case *c)
{
    ntr_sample s[NTRC_MAX_SERIES + 1];
    double corrected;
    if (ntr_na_corrected_glucose(c->num[1], c->num[2], c->en[2], &corrected) != NTR_OK) {
        return "ntr_na_corrected_glucose rejects what the glucose push accepted";
    }
    memcpy(s, c->samples, c->n * sizeof s[0]);
    s[c->n].hours = c->num[0];
    s[c->n].na_mmol_l = corrected;
    return same_as_course_assess(&c->out.s.course, s, c->n + 1);
}

static int call_course_watch_result(ntrc_case *c)
{
    return ntr_course_watch_result(in_null(c, 0) ? NULL : &c->cwatch,
                                   in_null(c, 1) ? NULL : &c->out.s.course);
}

static int predict_course_watch_result(const ntrc_fn *f, const ntrc_case *c)
{
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    if (!ntrc_enum_is_valid(f, 0, c->en[0]) || !ntrc_enum_is_valid(f, 1, c->en[1]) ||
        c->n == 0) {
        return NTR_ERR_ARG;
    }
    return NTR_OK;
}

static const char *ok_course_watch_result(const ntrc_case *c)
{
    return same_as_course_assess(&c->out.s.course, c->samples, c->n);
}

static void extra_course_watch(const ntrc_fn *f,
                               void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    int mode;
    ntrc_baseline(f, &c);
    c.n = 0;
    prime_course_watch(&c);
    judge(f, &c, NTRC_KIND_SERIES);
    for (mode = 1; mode <= 11; mode++) {
        ntrc_baseline(f, &c);
        c.en[0] = mode;
        judge(f, &c, NTRC_KIND_SERIES);
    }
}

static void extra_course_watch_push(const ntrc_fn *f,
                                    void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    extra_course_watch(f, judge);
    ntrc_baseline(f, &c);
    c.num[0] = c.samples[c.n - 1].hours - 0.25;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.num[0] = c.samples[c.n - 1].hours;
    judge(f, &c, NTRC_KIND_SERIES);
}

/* ---- streaming watcher ------------------------------------------------------------ */

/* en[0] of the watch entries: 0 an intact state; 1 never initialised
 * (zeroed); 2 a broken marker; 3 a kept count beyond the ring; 4 all
 * bytes 0xff; 5-8 one inconsistent private member each. */
static void damage_watch(ntr_watch *w, int mode)
{
    switch (mode) {
    case 0: break;
    case 1: memset(w, 0, sizeof *w); break;
    case 2: w->magic ^= 0x10101010u; break;
    case 3: w->kept = NTR_WATCH_CAPACITY + 5u; break;
    case 4: memset(w, 0xff, sizeof *w); break;
    case 5: /* window front past the kept samples (or a front with none kept) */
        if (w->kept > 0u) {
            w->front24 = w->kept;
        } else {
            w->seen = 1u;
        }
        break;
    case 6: w->seen = w->kept > 0u ? 0u : 2u; break; /* "seen" disagrees with "kept" */
    case 7: w->limits.max_rise_24h = -1.0; break; /* limits no longer valid */
    default: w->head = NTR_WATCH_CAPACITY; break;  /* ring index outside the ring */
    }
}

/* Initialise with the standard limits and push c->samples[0..n-1],
 * keeping only those the watcher accepts (so c->samples is exactly the
 * accepted series). */
static void prime_watch(ntrc_case *c)
{
    ntr_limits lim;
    ntr_correction out;
    size_t i;
    size_t kept = 0;
    ntrc_setup_ok(ntr_limits_preset(NTR_LIMITS_STANDARD, &lim));
    ntrc_setup_ok(ntr_watch_init(&lim, &c->watch));
    for (i = 0; i < c->n; i++) {
        if (ntr_watch_push(&c->watch, c->samples[i].hours, c->samples[i].na_mmol_l, &out) ==
            NTR_OK) {
            c->samples[kept++] = c->samples[i];
        }
    }
    c->n = kept;
    c->watch_clean = c->watch;
}

/* Before each call: the primed state, damaged as en[0] asks. */
static void prepare_watch(ntrc_case *c)
{
    c->watch = c->watch_clean;
    damage_watch(&c->watch, c->en[0]);
}

static void base_watch(ntrc_case *c)
{
    base_samples(c);
    c->n = 4; /* leave room: the pushed sample comes after hour 12 */
    prime_watch(c);
}

static void fuzz_watch(ntrc_case *c, ntrc_source *src)
{
    fuzz_samples(c, src);
    prime_watch(c);
}

static int call_watch_init(ntrc_case *c)
{
    ntr_limits lim;
    limits_from(c->num, &lim);
    return ntr_watch_init(in_null(c, 0) ? NULL : &lim, in_null(c, 1) ? NULL : &c->out.s.watch);
}

static int predict_watch_init(const ntrc_fn *f, const ntrc_case *c)
{
    (void)f;
    return c->out_null != 0u ? NTR_ERR_NULL : limits_status(c->num);
}

static const char *ok_watch_init(const ntrc_case *c)
{
    ntr_correction r;
    ntr_watch w = c->out.s.watch;
    /* Initialised with nothing pushed: no result yet. */
    return ntr_watch_result(&w, &r) == NTR_ERR_ARG ? NULL : "fresh watcher reports a result";
}

/* The state is opaque (and its bytes depend on the target): show what a
 * first push into it gives instead. */
static int results_watch_init(const ntrc_case *c, double *v, int max)
{
    ntrc_case probe;
    ntr_watch w = c->out.s.watch;
    if (ntr_watch_push(&w, 0.0, 120.0, &probe.out.s.corr) != NTR_OK) {
        return 0;
    }
    return results_correction(&probe, v, max);
}

static int call_watch_push(ntrc_case *c)
{
    return ntr_watch_push(in_null(c, 0) ? NULL : &c->watch, c->num[0], c->num[1],
                          in_null(c, 1) ? NULL : &c->out.s.corr);
}

static int predict_watch_push(const ntrc_fn *f, const ntrc_case *c)
{
    int st;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    if (!ntrc_enum_is_valid(f, 0, c->en[0])) {
        return NTR_ERR_ARG;
    }
    if ((st = check_value(c->num[0], -1e6, 1e6)) != NTR_OK ||
        (st = check_value(c->num[1], 80.0, 220.0)) != NTR_OK) {
        return st;
    }
    if (c->n > 0 && c->num[0] < c->samples[c->n - 1].hours) {
        return NTR_ERR_ORDER;
    }
    return NTR_OK;
}

/* The watcher's answer must equal ntr_correction_assess over the same
 * samples, field for field and bit for bit (as documented). */
static const char *same_as_assess(const ntr_correction *got, const ntr_sample *s, size_t n)
{
    ntr_limits lim;
    ntr_correction want;
    ntrc_setup_ok(ntr_limits_preset(NTR_LIMITS_STANDARD, &lim));
    if (ntr_correction_assess(s, n, &lim, &want) != NTR_OK) {
        return "ntr_correction_assess rejects the series the watcher accepted";
    }
    if (memcmp(&want.rise_first_24h, &got->rise_first_24h, sizeof(double)) != 0 ||
        memcmp(&want.max_rise_24h, &got->max_rise_24h, sizeof(double)) != 0 ||
        memcmp(&want.max_rise_48h, &got->max_rise_48h, sizeof(double)) != 0 ||
        memcmp(&want.last_rate_per_h, &got->last_rate_per_h, sizeof(double)) != 0 ||
        memcmp(&want.excess_mmol_l, &got->excess_mmol_l, sizeof(double)) != 0 ||
        want.flags != got->flags || want.reserved != got->reserved) {
        return "watcher differs from ntr_correction_assess on the same series";
    }
    return judge_correction(got, s, n, &lim);
}

static const char *ok_watch_push(const ntrc_case *c)
{
    ntr_sample s[NTRC_MAX_SERIES + 1];
    memcpy(s, c->samples, c->n * sizeof s[0]);
    s[c->n].hours = c->num[0];
    s[c->n].na_mmol_l = c->num[1];
    return same_as_assess(&c->out.s.corr, s, c->n + 1);
}

static int call_watch_result(ntrc_case *c)
{
    return ntr_watch_result(in_null(c, 0) ? NULL : &c->watch,
                            in_null(c, 1) ? NULL : &c->out.s.corr);
}

static int predict_watch_result(const ntrc_fn *f, const ntrc_case *c)
{
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    if (!ntrc_enum_is_valid(f, 0, c->en[0]) || c->n == 0) {
        return NTR_ERR_ARG;
    }
    return NTR_OK;
}

static const char *ok_watch_result(const ntrc_case *c)
{
    return same_as_assess(&c->out.s.corr, c->samples, c->n);
}

static void extra_watch(const ntrc_fn *f, void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    int mode;
    /* Nothing pushed yet. */
    ntrc_baseline(f, &c);
    c.n = 0;
    prime_watch(&c);
    judge(f, &c, NTRC_KIND_SERIES);
    /* Damaged states with every input otherwise valid. */
    for (mode = 1; mode <= 8; mode++) {
        ntrc_baseline(f, &c);
        c.en[0] = mode;
        judge(f, &c, NTRC_KIND_SERIES);
    }
}

static void extra_watch_push(const ntrc_fn *f, void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    extra_watch(f, judge);
    /* Earlier than the last result; equal to it (allowed). */
    ntrc_baseline(f, &c);
    c.num[0] = c.samples[c.n - 1].hours - 0.25;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.num[0] = c.samples[c.n - 1].hours;
    judge(f, &c, NTRC_KIND_SERIES);
}

static size_t replay_accepted;

const char *ntrc_watch_replay(const ntr_limits *lim, const ntr_sample *s, size_t n,
                              size_t *accepted)
{
    ntr_watch w;
    ntr_watch before;
    ntr_sample kept[NTRC_MAX_SERIES];
    ntr_correction out;
    ntr_correction sentinel;
    ntr_correction want;
    size_t i;
    size_t k = 0;
    *accepted = 0;
    /* The ring entries a watcher has not used yet are left as they were
     * (header: ntr_watch); clearing the state first makes every byte of
     * the comparison below defined. */
    memset(&w, 0, sizeof w);
    if (ntr_watch_init(lim, &w) != NTR_OK) {
        return NULL; /* bad limits: judged by the ntr_watch_init entry */
    }
    memset(&sentinel, SENTINEL_BYTE, sizeof sentinel);
    for (i = 0; i < n && i < NTRC_MAX_SERIES; i++) {
        int st;
        before = w;
        out = sentinel;
        st = ntr_watch_push(&w, s[i].hours, s[i].na_mmol_l, &out);
        if (st != NTR_OK) {
            if (memcmp(&w, &before, sizeof w) != 0) {
                return "watcher state changed by a rejected push";
            }
            if (memcmp(&out, &sentinel, sizeof out) != 0) {
                return "output written by a rejected push";
            }
            if (st != NTR_ERR_NONFINITE && st != NTR_ERR_RANGE && st != NTR_ERR_ORDER &&
                st != NTR_ERR_CAPACITY) {
                return "push gave an undocumented status";
            }
            if (st == NTR_ERR_ORDER && !(k > 0 && s[i].hours < kept[k - 1].hours)) {
                return "push reported ORDER for a sample in time order";
            }
            continue;
        }
        if (k > 0 && s[i].hours < kept[k - 1].hours) {
            return "push accepted a sample out of time order";
        }
        kept[k++] = s[i];
        if (ntr_correction_assess(kept, k, lim, &want) != NTR_OK ||
            memcmp(&want.rise_first_24h, &out.rise_first_24h, 5 * sizeof(double)) != 0 ||
            want.flags != out.flags) {
            return "watcher differs from ntr_correction_assess on the same series";
        }
        {
            ntr_correction again;
            if (ntr_watch_result(&w, &again) != NTR_OK ||
                memcmp(&again, &out, sizeof out) != 0) {
                return "ntr_watch_result differs from the last push";
            }
        }
    }
    *accepted = k;
    replay_accepted += k;
    return NULL;
}

/* ---- balance ------------------------------------------------------------------------ */

static void base_flows(ntrc_case *c)
{
    c->n = 2;
    c->flows[0].volume_l = 0.5;
    c->flows[0].na_mmol_l = 513.0;
    c->flows[0].k_mmol_l = 0.0;
    c->flows[1].volume_l = -1.2;
    c->flows[1].na_mmol_l = 60.0;
    c->flows[1].k_mmol_l = 40.0;
}

static void fuzz_flows(ntrc_case *c, ntrc_source *src)
{
    size_t i;
    c->n = src->byte(src) % (NTRC_MAX_FLOWS + 1);
    for (i = 0; i < c->n; i++) {
        c->flows[i].volume_l = src->number(src, -30.0, 20.0);
        c->flows[i].na_mmol_l = src->number(src, 0.0, 1100.0);
        c->flows[i].k_mmol_l = src->number(src, 0.0, 400.0);
    }
}

static int flows_status(const ntr_flow *f, size_t n)
{
    size_t i;
    int st;
    for (i = 0; i < n; i++) {
        if ((st = check_value(f[i].volume_l, -30.0, 20.0)) != NTR_OK ||
            (st = check_value(f[i].na_mmol_l, 0.0, 1100.0)) != NTR_OK ||
            (st = check_value(f[i].k_mmol_l, 0.0, 400.0)) != NTR_OK) {
            return st;
        }
    }
    return NTR_OK;
}

static int call_balance_predict(ntrc_case *c)
{
    return ntr_balance_predict(c->num[0], c->num[1], in_null(c, 0) ? NULL : c->flows, c->n,
                               od(c, 0), od(c, 1));
}

static int predict_balance_predict(const ntrc_fn *f, const ntrc_case *c)
{
    int st;
    (void)f;
    if ((c->out_null & ~NTRC_NULL_IN(0)) != 0u || (in_null(c, 0) && c->n > 0)) {
        return NTR_ERR_NULL;
    }
    if ((st = check_value(c->num[0], 80.0, 220.0)) != NTR_OK ||
        (st = check_value(c->num[1], 0.1, 400.0)) != NTR_OK) {
        return st;
    }
    return flows_status(c->flows, c->n);
}

static const char *ok_balance_predict(const ntrc_case *c)
{
    double tbw = c->num[1];
    double cation = c->num[0] * c->num[1];
    size_t i;
    for (i = 0; i < c->n; i++) {
        tbw += c->flows[i].volume_l;
        cation += c->flows[i].volume_l * (c->flows[i].na_mmol_l + c->flows[i].k_mmol_l);
    }
    if (!within(c->out.d[0], 80.0, 220.0) || !(c->out.d[1] >= 0.1)) {
        return "sodium after outside 80..220 or body water below 0.1 L";
    }
    if (!close_to(c->out.d[1], tbw, 1e-12)) {
        return "body water after is not the sum of volumes";
    }
    return fabs(c->out.d[0] * c->out.d[1] - cation) <= 1e-9 * (fabs(cation) + 1000.0)
               ? NULL
               : "cation mass not conserved";
}

static void extra_flows(const ntrc_fn *f, void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    size_t k;
    ntrc_baseline(f, &c);
    c.n = 0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.n = 0;
    c.out_null = NTRC_NULL_IN(0); /* NULL flows with nothing to read: fine */
    judge(f, &c, NTRC_KIND_SERIES);
    for (k = 0; k < 2; k++) {
        const double bad[] = {NAN, HUGE_VAL, -HUGE_VAL, -31.0, 21.0, -1.0, 1101.0, 401.0};
        size_t b;
        for (b = 0; b < sizeof bad / sizeof bad[0]; b++) {
            ntrc_baseline(f, &c);
            if (b < 5) {
                c.flows[k].volume_l = bad[b];
            } else if (b < 7) {
                c.flows[k].na_mmol_l = bad[b];
            } else {
                c.flows[k].k_mmol_l = bad[b];
            }
            judge(f, &c, NTRC_KIND_SERIES);
        }
    }
    /* Losing all the water; a huge hypertonic gain (DOMAIN). */
    ntrc_baseline(f, &c);
    c.flows[1].volume_l = -30.0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.num[1] = 0.1;
    c.flows[0].volume_l = 20.0;
    c.flows[0].na_mmol_l = 1100.0;
    judge(f, &c, NTRC_KIND_SERIES);
}

static int results_two(const ntrc_case *c, double *v, int max)
{
    if (max < 2) {
        return 0;
    }
    v[0] = c->out.d[0];
    v[1] = c->out.d[1];
    return 2;
}

/* Timed flows: a 3% saline infusion and a urine loss. */
static void base_tflows(ntrc_case *c)
{
    memset(c->tflows, 0, sizeof c->tflows);
    c->n2 = 2;
    c->tflows[0].start_h = 0.0;
    c->tflows[0].end_h = 6.0;
    c->tflows[0].rate_ml_h = 30.0;
    c->tflows[0].na_mmol_l = 513.0;
    c->tflows[1].start_h = 0.0;
    c->tflows[1].end_h = 24.0;
    c->tflows[1].rate_ml_h = -80.0;
    c->tflows[1].na_mmol_l = 50.0;
    c->tflows[1].k_mmol_l = 30.0;
}

static void fuzz_tflows(ntrc_case *c, ntrc_source *src)
{
    size_t i;
    memset(c->tflows, 0, sizeof c->tflows);
    c->n2 = src->byte(src) % (NTRC_MAX_FLOWS + 1);
    for (i = 0; i < c->n2; i++) {
        c->tflows[i].start_h = src->number(src, 0.0, 48.0);
        c->tflows[i].end_h = c->tflows[i].start_h + src->number(src, 0.0, 48.0);
        c->tflows[i].rate_ml_h = src->number(src, -300.0, 300.0);
        c->tflows[i].na_mmol_l = src->number(src, 0.0, 1100.0);
        c->tflows[i].k_mmol_l = src->number(src, 0.0, 400.0);
        if (src->byte(src) > 250u) {
            c->tflows[i].reserved[src->byte(src) & 1u] = 1u;
        }
    }
}

static int tflows_reserved_ok(const ntr_timed_flow *f, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        if (f[i].reserved[0] != 0u || f[i].reserved[1] != 0u) {
            return 0;
        }
    }
    return 1;
}

static int tflows_status(const ntr_timed_flow *f, size_t n)
{
    size_t i;
    int st;
    for (i = 0; i < n; i++) {
        if ((st = check_value(f[i].start_h, 0.0, 720.0)) != NTR_OK ||
            (st = check_value(f[i].end_h, 0.0, 720.0)) != NTR_OK ||
            (st = check_value(f[i].rate_ml_h, -5000.0, 5000.0)) != NTR_OK ||
            (st = check_value(f[i].na_mmol_l, 0.0, 1100.0)) != NTR_OK ||
            (st = check_value(f[i].k_mmol_l, 0.0, 400.0)) != NTR_OK) {
            return st;
        }
    }
    return NTR_OK;
}

static int tflows_ordered(const ntr_timed_flow *f, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        if (f[i].end_h < f[i].start_h) {
            return 0;
        }
    }
    return 1;
}

static int span_status(double duration, double step)
{
    int st = check_value(duration, 0.0, 720.0);
    if (st != NTR_OK) {
        return st;
    }
    if (!(duration > 0.0)) {
        return NTR_ERR_RANGE;
    }
    return check_value(step, 1.0 / 60.0, 720.0);
}

/* Points of a course: tau = 0, step, ... below duration, and duration. */
static size_t points_needed(double duration, double step)
{
    size_t k = 0;
    while ((double)k * step < duration && k < 100000) {
        k++;
    }
    return k + 1;
}

/* The state the plan predicts at tau, from the flows, by the documented
 * equations (volumes so far, then mass balance). */
static int state_at(double na, double tbw, const ntr_timed_flow *f, size_t n, double tau,
                    double *na_out, double *tbw_out)
{
    ntr_flow v[NTRC_MAX_FLOWS];
    size_t i;
    for (i = 0; i < n; i++) {
        double end = f[i].end_h < tau ? f[i].end_h : tau;
        v[i].volume_l = tau > f[i].start_h ? f[i].rate_ml_h / 1000.0 * (end - f[i].start_h) : 0.0;
        v[i].na_mmol_l = f[i].na_mmol_l;
        v[i].k_mmol_l = f[i].k_mmol_l;
    }
    return ntr_balance_predict(na, tbw, v, n, na_out, tbw_out);
}

static void base_course(ntrc_case *c)
{
    base_tflows(c);
    c->capacity = NTRC_MAX_SERIES;
}

static void fuzz_course(ntrc_case *c, ntrc_source *src)
{
    fuzz_tflows(c, src);
    c->capacity = src->byte(src) % (NTRC_MAX_SERIES + 1);
}

static int call_balance_course(ntrc_case *c)
{
    return ntr_balance_course(c->num[0], c->num[1], in_null(c, 0) ? NULL : c->tflows, c->n2,
                              c->num[2], c->num[3], in_null(c, 1) ? NULL : c->out.samples,
                              c->capacity, in_null(c, 2) ? NULL : &c->out.z[0]);
}

static int predict_balance_course(const ntrc_fn *f, const ntrc_case *c)
{
    int st;
    (void)f;
    if (in_null(c, 2) || (in_null(c, 1) && c->capacity > 0) || (in_null(c, 0) && c->n2 > 0)) {
        return NTR_ERR_NULL;
    }
    if (!tflows_reserved_ok(c->tflows, c->n2)) {
        return NTR_ERR_ARG;
    }
    if ((st = check_value(c->num[0], 80.0, 220.0)) != NTR_OK ||
        (st = check_value(c->num[1], 0.1, 400.0)) != NTR_OK ||
        (st = tflows_status(c->tflows, c->n2)) != NTR_OK ||
        (st = span_status(c->num[2], c->num[3])) != NTR_OK) {
        return st;
    }
    if (!tflows_ordered(c->tflows, c->n2)) {
        return NTR_ERR_ORDER;
    }
    /* One point of slack either way for rounding in the count. */
    if (c->capacity + 1 < points_needed(c->num[2], c->num[3])) {
        return NTR_ERR_CAPACITY;
    }
    return NTR_OK; /* or DOMAIN, or CAPACITY at the edge */
}

static const char *ok_balance_course(const ntrc_case *c)
{
    size_t count = c->out.z[0];
    size_t need = points_needed(c->num[2], c->num[3]);
    size_t i;
    double na_end;
    double tbw_end;
    if (count > c->capacity || count + 1 < need || count > need + 1 || count < 2) {
        return "point count wrong or beyond the capacity";
    }
    if (c->out.samples[0].hours != 0.0 || c->out.samples[0].na_mmol_l != c->num[0]) {
        return "first point is not (0, starting sodium)";
    }
    for (i = 1; i < count; i++) {
        if (!(c->out.samples[i].hours > c->out.samples[i - 1].hours) ||
            !within(c->out.samples[i].na_mmol_l, 80.0, 220.0)) {
            return "times not increasing or sodium outside 80..220";
        }
    }
    if (!close_to(c->out.samples[count - 1].hours, c->num[2], 1e-12)) {
        return "last point is not at the duration";
    }
    if (state_at(c->num[0], c->num[1], c->tflows, c->n2, c->num[2], &na_end, &tbw_end) ==
            NTR_OK &&
        !close_to(c->out.samples[count - 1].na_mmol_l, na_end, 1e-9)) {
        return "last point differs from the mass balance of the volumes given";
    }
    return NULL;
}

static const char *err_balance_course(const ntrc_case *c, const ntrc_outs *before, int status)
{
    ntrc_outs expect = *before;
    if (status == NTR_ERR_CAPACITY) {
        size_t need = points_needed(c->num[2], c->num[3]);
        /* Only the count is written: the number needed. */
        if (c->out.z[0] <= c->capacity || c->out.z[0] + 1 < need || c->out.z[0] > need + 1) {
            return "CAPACITY without the number of points needed";
        }
        expect.z[0] = c->out.z[0];
    }
    return memcmp(&c->out, &expect, sizeof expect) == 0 ? NULL : "an output was written on error";
}

static int results_course(const ntrc_case *c, double *v, int max)
{
    int k = 0;
    size_t i;
    v[k++] = (double)c->out.z[0];
    for (i = 0; i < c->out.z[0] && k + 2 <= max; i++) {
        v[k++] = c->out.samples[i].hours;
        v[k++] = c->out.samples[i].na_mmol_l;
    }
    return k;
}

static void extra_tflows(const ntrc_fn *f, void (*judge)(const ntrc_fn *, ntrc_case *, int),
                         int is_plan)
{
    ntrc_case c;
    size_t k;
    ntrc_baseline(f, &c);
    c.n2 = 0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.n2 = 0;
    c.out_null = NTRC_NULL_IN(is_plan ? 1 : 0); /* NULL flows, none to read */
    judge(f, &c, NTRC_KIND_SERIES);
    for (k = 0; k < 2; k++) {
        /* Reserved fields: ARG before any number. */
        ntrc_baseline(f, &c);
        c.tflows[k].reserved[1] = 7u;
        judge(f, &c, NTRC_KIND_SERIES);
        c.tflows[0].start_h = NAN;
        judge(f, &c, NTRC_KIND_ORDER);
        /* A flow that ends before it starts: ORDER, after number checks. */
        ntrc_baseline(f, &c);
        c.tflows[k].end_h = c.tflows[k].start_h;
        c.tflows[k].start_h += 1.0;
        judge(f, &c, NTRC_KIND_SERIES);
        c.num[1] = -1.0;
        judge(f, &c, NTRC_KIND_ORDER);
        {
            const double bad[] = {NAN, HUGE_VAL, -1.0, 721.0, 5001.0, -5001.0, 1101.0, 401.0};
            size_t b;
            for (b = 0; b < sizeof bad / sizeof bad[0]; b++) {
                ntrc_baseline(f, &c);
                switch (b) {
                case 0: c.tflows[k].rate_ml_h = bad[b]; break;
                case 1: c.tflows[k].end_h = bad[b]; break;
                case 2: c.tflows[k].start_h = bad[b]; break;
                case 3: c.tflows[k].end_h = bad[b]; break;
                case 4: case 5: c.tflows[k].rate_ml_h = bad[b]; break;
                case 6: c.tflows[k].na_mmol_l = bad[b]; break;
                default: c.tflows[k].k_mmol_l = bad[b]; break;
                }
                judge(f, &c, NTRC_KIND_SERIES);
            }
        }
    }
    /* Driving body water below the model's range (DOMAIN). */
    ntrc_baseline(f, &c);
    c.tflows[1].rate_ml_h = -5000.0;
    c.tflows[1].end_h = 720.0;
    judge(f, &c, NTRC_KIND_SERIES);
}

static void extra_course(const ntrc_fn *f, void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    size_t cap;
    extra_tflows(f, judge, 0);
    /* Too-small buffers of every size, and asking for the count. */
    for (cap = 0; cap < 12; cap++) {
        ntrc_baseline(f, &c);
        c.capacity = cap;
        judge(f, &c, NTRC_KIND_SERIES);
    }
    ntrc_baseline(f, &c);
    c.capacity = 0;
    c.out_null = NTRC_NULL_IN(1);
    judge(f, &c, NTRC_KIND_SERIES);
    /* Durations whose quotient by the step rounds just above a whole
     * number (0.27 / 0.03 = 9.000000000000002): the point count must still
     * be ceil of the exact quotient plus one. */
    ntrc_baseline(f, &c);
    c.num[2] = 0.27;
    c.num[3] = 0.03;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.num[2] = 4.15;
    c.num[3] = 1.0 / 60.0;
    c.capacity = NTRC_MAX_SERIES;
    judge(f, &c, NTRC_KIND_SERIES);
    /* A step longer than the plan; a step that divides it exactly. */
    ntrc_baseline(f, &c);
    c.num[3] = 700.0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.num[2] = 24.0;
    c.num[3] = 0.5;
    judge(f, &c, NTRC_KIND_SERIES);
}

/* ---- plan check ------------------------------------------------------------------------ */

static void base_plan(ntrc_case *c)
{
    base_samples(c);
    c->n = 3;
    base_tflows(c);
}

static void fuzz_plan(ntrc_case *c, ntrc_source *src)
{
    fuzz_samples(c, src);
    if (c->n > 16) {
        c->n = 16;
    }
    fuzz_tflows(c, src);
}

static int call_plan_check(ntrc_case *c)
{
    ntr_limits lim;
    limits_from(&c->num[3], &lim);
    return ntr_plan_check(in_null(c, 0) ? NULL : c->samples, c->n, c->num[0],
                          in_null(c, 1) ? NULL : c->tflows, c->n2, c->num[1], c->num[2],
                          in_null(c, 2) ? NULL : &lim, in_null(c, 3) ? NULL : &c->out.s.plan);
}

static int predict_plan_check(const ntrc_fn *f, const ntrc_case *c)
{
    int st;
    (void)f;
    if (in_null(c, 0) || in_null(c, 2) || in_null(c, 3) || (in_null(c, 1) && c->n2 > 0)) {
        return NTR_ERR_NULL;
    }
    if (c->n == 0 || !tflows_reserved_ok(c->tflows, c->n2)) {
        return NTR_ERR_ARG;
    }
    if ((st = samples_status(c->samples, c->n)) != NTR_OK ||
        (st = check_value(c->num[0], 0.1, 400.0)) != NTR_OK ||
        (st = tflows_status(c->tflows, c->n2)) != NTR_OK ||
        (st = span_status(c->num[1], c->num[2])) != NTR_OK ||
        (st = limits_status(&c->num[3])) != NTR_OK) {
        return st;
    }
    if (!samples_sorted(c->samples, c->n) || !tflows_ordered(c->tflows, c->n2)) {
        return NTR_ERR_ORDER;
    }
    return NTR_OK;
}

static const char *ok_plan_check(const ntrc_case *c)
{
    const ntr_plan_result *p = &c->out.s.plan;
    double na_end;
    double tbw_end;
    size_t need = points_needed(c->num[1], c->num[2]);
    if ((p->course.flags & ~NTR_CF_ALL) != 0u || p->reserved != 0u ||
        p->reserved_d[0] != 0.0 || p->reserved_d[1] != 0.0) {
        return "undefined flags or reserved fields written";
    }
    if (p->points + 2u < need || p->points > need + 1u) {
        return "number of predicted points wrong";
    }
    if (!within(p->final_na_mmol_l, 80.0, 220.0) || !(p->final_tbw_l >= 0.1)) {
        return "final state outside the model's range";
    }
    if ((p->breach_24h_h != NTR_PLAN_NO_BREACH &&
         !(p->breach_24h_h > 0.0 && p->breach_24h_h <= c->num[1] + 1e-9)) ||
        (p->breach_48h_h != NTR_PLAN_NO_BREACH &&
         !(p->breach_48h_h > 0.0 && p->breach_48h_h <= c->num[1] + 1e-9))) {
        return "breach time outside the plan";
    }
    if (state_at(c->samples[c->n - 1].na_mmol_l, c->num[0], c->tflows, c->n2, c->num[1],
                 &na_end, &tbw_end) == NTR_OK &&
        (!close_to(p->final_na_mmol_l, na_end, 1e-9) || !close_to(p->final_tbw_l, tbw_end, 1e-9))) {
        return "final state differs from the mass balance of the volumes given";
    }
    if (!isfinite(p->course.max_rise_24h) || p->course.max_rise_24h < 0.0) {
        return "course assessment not finite";
    }
    return NULL;
}

static int results_plan(const ntrc_case *c, double *v, int max)
{
    const ntr_plan_result *p = &c->out.s.plan;
    if (max < 8) {
        return 0;
    }
    v[0] = p->final_na_mmol_l;
    v[1] = p->final_tbw_l;
    v[2] = p->breach_24h_h;
    v[3] = p->breach_48h_h;
    v[4] = p->points;
    v[5] = p->course.max_rise_24h;
    v[6] = p->course.max_rise_48h;
    v[7] = p->course.flags;
    return 8;
}

static void extra_plan(const ntrc_fn *f, void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    extra_tflows(f, judge, 1);
    ntrc_baseline(f, &c);
    c.n = 0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.samples[1].hours = 100.0; /* history out of order */
    judge(f, &c, NTRC_KIND_SERIES);
    c.num[3] = NAN;             /* ... a bad limit wins */
    judge(f, &c, NTRC_KIND_ORDER);
    ntrc_baseline(f, &c);
    c.samples[0].na_mmol_l = HUGE_VAL;
    judge(f, &c, NTRC_KIND_SERIES);
    /* A plan fast enough to breach the 24 h limit. */
    ntrc_baseline(f, &c);
    c.tflows[0].rate_ml_h = 400.0;
    c.tflows[0].end_h = 24.0;
    judge(f, &c, NTRC_KIND_SERIES);
}

/* ---- re-lowering ---------------------------------------------------------------------- */

static int call_relower_estimate(ntrc_case *c)
{
    const double *x = c->num;
    return ntr_relower_estimate(x[0], x[1], x[2], x[3], x[4], x[5], x[6], x[7], x[8], od(c, 0),
                                od(c, 1));
}

static const char *ok_relower_estimate(const ntrc_case *c)
{
    const double *x = c->num;
    ntr_flow fl[2];
    double na1;
    double tbw1;
    double want = x[0] - x[4];
    if (!within(c->out.d[0], 0.0, 20.0)) {
        return "volume outside [0, 20] L";
    }
    if (!close_to(c->out.d[1], c->out.d[0] * 1000.0 / x[5], 1e-12)) {
        return "rate is not volume / hours";
    }
    fl[0].volume_l = c->out.d[0];
    fl[0].na_mmol_l = x[2];
    fl[0].k_mmol_l = x[3];
    fl[1].volume_l = -x[6] * x[5] / 1000.0;
    fl[1].na_mmol_l = x[7];
    fl[1].k_mmol_l = x[8];
    if (fl[1].volume_l < -30.0 ||
        ntr_balance_predict(x[0], x[1], fl, 2, &na1, &tbw1) != NTR_OK) {
        return NULL; /* outside what the forward model takes */
    }
    if (c->out.d[0] > 0.0) {
        return fabs(na1 - want) <= 1e-6 * (1.0 + fabs(want)) ? NULL
                                                               : "volume does not reach the target";
    }
    return na1 <= want + 1e-6 ? NULL : "zero volume although losses do not reach the target";
}

/* ---- limits and ODS risk ---------------------------------------------------------------- */

static int call_limits_preset(ntrc_case *c)
{
    return ntr_limits_preset(c->en[0], in_null(c, 0) ? NULL : &c->out.s.lim);
}

static const char *ok_limits_preset(const ntrc_case *c)
{
    const ntr_limits *l = &c->out.s.lim;
    double want24 = c->en[0] == NTR_LIMITS_STANDARD ? 10.0 : 8.0;
    double want48 = c->en[0] == NTR_LIMITS_STANDARD ? 18.0 : 16.0;
    return (l->max_rise_24h == want24 && l->max_rise_48h == want48 && l->min_rise_24h == 4.0)
               ? NULL
               : "preset values differ from the documented ones";
}

static int results_limits(const ntrc_case *c, double *v, int max)
{
    if (max < 3) {
        return 0;
    }
    v[0] = c->out.s.lim.max_rise_24h;
    v[1] = c->out.s.lim.max_rise_48h;
    v[2] = c->out.s.lim.min_rise_24h;
    return 3;
}

static int call_ods_risk(ntrc_case *c)
{
    return ntr_ods_risk(c->num[0], c->en[0], c->en[1], c->en[2], c->en[3], oi(c, 0),
                        (c->out_null & NTRC_NULL_I(1)) ? NULL : (unsigned int *)&c->out.i[1],
                        (c->out_null & NTRC_NULL_I(2)) ? NULL : (unsigned int *)&c->out.i[2]);
}

static const char *ok_ods_risk(const ntrc_case *c)
{
    static const unsigned int bit[4] = {NTR_ODS_LOW_K, NTR_ODS_ALCOHOL, NTR_ODS_MALNUTRITION,
                                        NTR_ODS_LIVER};
    unsigned int drivers = c->num[0] <= 105.0 ? NTR_ODS_NA_105 : 0u;
    unsigned int unknowns = 0u;
    int k;
    for (k = 0; k < 4; k++) {
        if (c->en[k] == NTR_TRI_YES) {
            drivers |= bit[k];
        } else if (c->en[k] == NTR_TRI_UNKNOWN) {
            unknowns |= bit[k];
        }
    }
    if ((unsigned int)c->out.i[1] != drivers || (unsigned int)c->out.i[2] != unknowns) {
        return "drivers or unknowns differ from the answers";
    }
    return c->out.i[0] == ((drivers | unknowns) != 0u ? NTR_LIMITS_HIGH_RISK : NTR_LIMITS_STANDARD)
               ? NULL
               : "preset does not follow the risk factors";
}

/* ---- grouped correction assessment ---------------------------------------------- */

static void base_groups(ntrc_case *c)
{
    base_samples(c);
    c->groups = 3;
    c->offsets[0] = 0;
    c->offsets[1] = 2;
    c->offsets[2] = 2; /* an empty group: NTR_ERR_ARG for that group only */
    c->offsets[3] = 6;
    c->capacity = 6;   /* n_samples */
}

/* The base case has an empty group; the valid baseline drops it. */
static void base_groups_valid(ntrc_case *c)
{
    base_groups(c);
    c->offsets[2] = 4;
}

static void fuzz_groups(ntrc_case *c, ntrc_source *src)
{
    size_t g;
    fuzz_samples(c, src);
    c->groups = src->byte(src) % 9u;
    c->capacity = c->n;
    c->offsets[0] = c->n > 0 ? src->byte(src) % (c->n + 1) % 3u : 0;
    for (g = 1; g <= c->groups; g++) {
        size_t left = c->n - c->offsets[g - 1];
        c->offsets[g] = c->offsets[g - 1] + (left > 0 ? src->byte(src) % (left + 1) : 0);
    }
    if (src->byte(src) > 245u) {
        /* Spoil the offsets: decreasing, or past n_samples. */
        c->offsets[src->byte(src) % (c->groups + 1)] += 1 + src->byte(src) % 4u;
    }
    if (src->byte(src) > 245u && c->capacity > 0) {
        c->capacity--;
    }
}

static int call_batch_correction_assess(ntrc_case *c)
{
    ntr_limits lim;
    limits_from(c->num, &lim);
    return ntr_batch_correction_assess(
        c->groups, in_null(c, 0) ? NULL : c->offsets, in_null(c, 1) ? NULL : c->samples,
        c->capacity, in_null(c, 2) ? NULL : &lim, in_null(c, 3) ? NULL : c->out.s.groups.out,
        in_null(c, 4) ? NULL : c->out.s.groups.status, in_null(c, 5) ? NULL : &c->out.z[1]);
}

static int groups_call_level(const ntrc_case *c)
{
    size_t g;
    if ((c->out_null & ~NTRC_NULL_IN(5)) != 0u) {
        return NTR_ERR_NULL;
    }
    for (g = 0; g < c->groups; g++) {
        if (c->offsets[g + 1] < c->offsets[g]) {
            return NTR_ERR_ARG;
        }
    }
    if (c->offsets[c->groups] > c->capacity) {
        return NTR_ERR_ARG;
    }
    return NTR_OK;
}

static int group_status(const ntrc_case *c, size_t g, ntr_correction *r)
{
    ntr_limits lim;
    limits_from(c->num, &lim);
    return ntr_correction_assess(&c->samples[c->offsets[g]], c->offsets[g + 1] - c->offsets[g],
                                 &lim, r);
}

static int predict_batch_correction(const ntrc_fn *f, const ntrc_case *c)
{
    size_t g;
    int st = groups_call_level(c);
    (void)f;
    if (st != NTR_OK) {
        return st;
    }
    for (g = 0; g < c->groups; g++) {
        ntr_correction r;
        st = group_status(c, g, &r);
        if (st != NTR_OK) {
            return st;
        }
    }
    return NTR_OK;
}

/* Every group equals the scalar call; failed groups NaN and zero flags;
 * nothing past the last group. */
static const char *judge_groups(const ntrc_case *c, const ntrc_outs *before)
{
    size_t g;
    size_t bad = 0;
    for (g = 0; g < 8; g++) {
        const ntr_correction *o = &c->out.s.groups.out[g];
        ntr_correction want;
        int st;
        if (g >= c->groups) {
            if (memcmp(o, &before->s.groups.out[g], sizeof *o) != 0 ||
                c->out.s.groups.status[g] != before->s.groups.status[g]) {
                return "a group past the last was written";
            }
            continue;
        }
        st = group_status(c, g, &want);
        if (c->out.s.groups.status[g] != st) {
            return "group status differs from ntr_correction_assess";
        }
        if (st == NTR_OK) {
            if (memcmp(&o->rise_first_24h, &want.rise_first_24h, 5 * sizeof(double)) != 0 ||
                o->flags != want.flags || o->reserved != want.reserved) {
                return "group result differs (bits) from ntr_correction_assess";
            }
        } else {
            bad++;
            if (!isnan(o->rise_first_24h) || !isnan(o->max_rise_24h) || !isnan(o->max_rise_48h) ||
                !isnan(o->last_rate_per_h) || !isnan(o->excess_mmol_l) || o->flags != 0u ||
                o->reserved != 0u) {
                return "failed group not NaN with zero flags";
            }
        }
    }
    if (!in_null(c, 5) && c->out.z[1] != bad) {
        return "failed count wrong";
    }
    return NULL;
}

static const char *ok_batch_correction(const ntrc_case *c)
{
    ntrc_outs before;
    memset(&before, SENTINEL_BYTE, sizeof before);
    return judge_groups(c, &before);
}

static const char *err_batch_correction(const ntrc_case *c, const ntrc_outs *before, int status)
{
    (void)status;
    if (groups_call_level(c) != NTR_OK) {
        return memcmp(&c->out, before, sizeof *before) == 0
                   ? NULL
                   : "something was written on a call-level error";
    }
    return judge_groups(c, before);
}

static int results_groups(const ntrc_case *c, double *v, int max)
{
    int k = 0;
    size_t g;
    for (g = 0; g < c->groups && k + 3 <= max; g++) {
        v[k++] = c->out.s.groups.status[g];
        v[k++] = c->out.s.groups.out[g].max_rise_24h;
        v[k++] = c->out.s.groups.out[g].flags;
    }
    return k;
}

static void extra_groups(const ntrc_fn *f, void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    unsigned int k;
    /* An empty group; groups = 0 (with and without NULLs). */
    ntrc_baseline(f, &c);
    base_groups(&c);
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.groups = 0;
    judge(f, &c, NTRC_KIND_SERIES);
    for (k = 0; k < 6; k++) {
        ntrc_baseline(f, &c);
        c.groups = 0;
        c.out_null = NTRC_NULL_IN(k);
        judge(f, &c, NTRC_KIND_NULL);
    }
    /* Offsets that decrease, or run past n_samples. */
    ntrc_baseline(f, &c);
    c.offsets[1] = 5;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.capacity = 5;
    judge(f, &c, NTRC_KIND_SERIES);
    /* A bad sample in one group only; an unsorted group; bad limits. */
    ntrc_baseline(f, &c);
    c.samples[3].na_mmol_l = NAN;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.samples[5].hours = 1.0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.num[0] = 40.0;
    judge(f, &c, NTRC_KIND_SERIES);
}

/* ---- direction-aware plan check and grouped course assessment ------------------ */

/* Course limits as in ntr_course_assess()'s entry (COURSE_NUMS,
 * COURSE_ENUMS, course_limits_from, course_limits_status): the plan check
 * has its limits at num[3..7], after body water, duration and step. */
static void plan_course_limits(const ntrc_case *c, ntr_course_limits *lim)
{
    course_limits_from(c, lim);
    lim->max_rise_24h = c->num[3];
    lim->max_rise_48h = c->num[4];
    lim->max_fall_24h = c->num[5];
    lim->max_fall_48h = c->num[6];
    lim->min_change_24h = c->num[7];
}

static int size_mode_ok(int mode)
{
    return mode == 0 || mode == 2;
}

/* en[0] goal, en[1] limits' size mode, en[2] result's (or report's) size
 * mode, as in COURSE_ENUMS. */
enum { CP_GOAL, CP_LIM_SIZE, CP_OUT_SIZE };

static void base_course_plan(ntrc_case *c)
{
    base_plan(c);
}

static void prepare_course_plan(ntrc_case *c)
{
    c->out.s.course_plan.struct_size = siad_size(c->en[CP_OUT_SIZE], sizeof c->out.s.course_plan);
}

static int call_course_plan_check(ntrc_case *c)
{
    ntr_course_limits lim;
    plan_course_limits(c, &lim);
    return ntr_course_plan_check(in_null(c, 0) ? NULL : c->samples, c->n, c->num[0],
                                 in_null(c, 1) ? NULL : c->tflows, c->n2, c->num[1], c->num[2],
                                 in_null(c, 2) ? NULL : &lim,
                                 in_null(c, 3) ? NULL : &c->out.s.course_plan);
}

static int predict_course_plan_check(const ntrc_fn *f, const ntrc_case *c)
{
    int st;
    (void)f;
    if (in_null(c, 0) || in_null(c, 2) || in_null(c, 3) || (in_null(c, 1) && c->n2 > 0)) {
        return NTR_ERR_NULL;
    }
    if (c->n == 0 || !size_mode_ok(c->en[CP_LIM_SIZE]) ||
        !ntrc_enum_is_valid(f, CP_GOAL, c->en[CP_GOAL]) || !size_mode_ok(c->en[CP_OUT_SIZE]) ||
        !tflows_reserved_ok(c->tflows, c->n2)) {
        return NTR_ERR_ARG;
    }
    if ((st = samples_status(c->samples, c->n)) != NTR_OK ||
        (st = check_value(c->num[0], 0.1, 400.0)) != NTR_OK ||
        (st = tflows_status(c->tflows, c->n2)) != NTR_OK ||
        (st = span_status(c->num[1], c->num[2])) != NTR_OK ||
        (st = course_limits_status(c->en[CP_GOAL], &c->num[3])) != NTR_OK) {
        return st;
    }
    if (!samples_sorted(c->samples, c->n) || !tflows_ordered(c->tflows, c->n2)) {
        return NTR_ERR_ORDER;
    }
    return NTR_OK;
}

static int breach_time_ok(double t, double duration)
{
    return t == NTR_PLAN_NO_BREACH || (t > 0.0 && t <= duration + 1e-9);
}

static const char *ok_course_plan_check(const ntrc_case *c)
{
    static const unsigned int bits[4] = {NTR_CF_OVER_24H, NTR_CF_OVER_48H,
                                         NTR_CF_FALL_OVER_24H, NTR_CF_FALL_OVER_48H};
    const ntr_course_plan_result *p = &c->out.s.course_plan;
    const double t[4] = {p->breach_rise_24h_h, p->breach_rise_48h_h, p->breach_fall_24h_h,
                         p->breach_fall_48h_h};
    double first = NTR_PLAN_NO_BREACH;
    unsigned int first_bit = 0u;
    size_t need = points_needed(c->num[1], c->num[2]);
    double na_end, tbw_end;
    int k;
    if (p->struct_size != sizeof *p || p->course.struct_size != sizeof p->course) {
        return "struct_size not set to the size filled";
    }
    if ((p->course.flags & ~NTR_CF_COURSE_ALL) != 0u || p->reserved != 0u ||
        p->course.reserved != 0u) {
        return "undefined flags or reserved fields written";
    }
    if (p->points + 2u < need || p->points > need + 1u) {
        return "number of predicted points wrong";
    }
    if (!within(p->final_na_mmol_l, 80.0, 220.0) || !(p->final_tbw_l >= 0.1)) {
        return "final state outside the model's range";
    }
    for (k = 0; k < 4; k++) {
        if (!breach_time_ok(t[k], c->num[1])) {
            return "breach time outside the plan";
        }
        if (t[k] != NTR_PLAN_NO_BREACH && (p->course.flags & bits[k]) == 0u) {
            return "a breach time without its limit's flag";
        }
        if (t[k] != NTR_PLAN_NO_BREACH && c->num[3 + k] == 0.0) {
            return "a breach of a limit of 0 (no limit)";
        }
        if (t[k] != NTR_PLAN_NO_BREACH && (first == NTR_PLAN_NO_BREACH || t[k] < first)) {
            first = t[k];
            first_bit = bits[k];
        }
    }
    if (p->first_breach_h != first || p->first_breach_flag != first_bit) {
        return "first breach is not the earliest of the four";
    }
    if (p->first_breach_direction !=
        (first_bit == 0u ? NTR_PLAN_BREACH_NONE
         : (first_bit & (NTR_CF_OVER_24H | NTR_CF_OVER_48H)) ? NTR_PLAN_BREACH_RISE
                                                           : NTR_PLAN_BREACH_FALL)) {
        return "direction differs from the first breach's limit";
    }
    if (state_at(c->samples[c->n - 1].na_mmol_l, c->num[0], c->tflows, c->n2, c->num[1],
                 &na_end, &tbw_end) == NTR_OK &&
        (!close_to(p->final_na_mmol_l, na_end, 1e-9) || !close_to(p->final_tbw_l, tbw_end, 1e-9))) {
        return "final state differs from the mass balance of the volumes given";
    }
    if (!within(p->course.max_rise_24h, 0.0, 140.0) || !within(p->course.max_fall_24h, 0.0, 140.0) ||
        p->course.max_rise_48h < p->course.max_rise_24h ||
        p->course.max_fall_48h < p->course.max_fall_24h) {
        return "course figures not finite, negative or out of order";
    }
    return NULL;
}

static int results_course_plan(const ntrc_case *c, double *v, int max)
{
    const ntr_course_plan_result *p = &c->out.s.course_plan;
    if (max < 12) {
        return 0;
    }
    v[0] = p->final_na_mmol_l;
    v[1] = p->final_tbw_l;
    v[2] = p->breach_rise_24h_h;
    v[3] = p->breach_rise_48h_h;
    v[4] = p->breach_fall_24h_h;
    v[5] = p->breach_fall_48h_h;
    v[6] = p->first_breach_h;
    v[7] = p->first_breach_flag;
    v[8] = p->first_breach_direction;
    v[9] = p->points;
    v[10] = p->course.max_fall_24h;
    v[11] = p->course.flags;
    return 12;
}

static void extra_course_plan(const ntrc_fn *f, void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    int mode;
    extra_tflows(f, judge, 1);
    ntrc_baseline(f, &c);
    c.n = 0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.samples[1].hours = 100.0; /* history out of order */
    judge(f, &c, NTRC_KIND_SERIES);
    c.num[5] = NAN;             /* ... a bad limit wins */
    judge(f, &c, NTRC_KIND_ORDER);
    c.en[CP_GOAL] = 9;          /* ... and an unknown goal wins over both */
    judge(f, &c, NTRC_KIND_ORDER);
    ntrc_baseline(f, &c);
    c.samples[0].na_mmol_l = HUGE_VAL;
    judge(f, &c, NTRC_KIND_SERIES);
    c.en[CP_OUT_SIZE] = 1;      /* a short result struct wins over the numbers */
    judge(f, &c, NTRC_KIND_ORDER);
    for (mode = -1; mode <= 3; mode++) {
        ntrc_baseline(f, &c);
        c.en[CP_LIM_SIZE] = mode;
        judge(f, &c, NTRC_KIND_SERIES);
        ntrc_baseline(f, &c);
        c.en[CP_OUT_SIZE] = mode;
        judge(f, &c, NTRC_KIND_SERIES);
    }
    /* Contradicting limits: a 24 h limit looser than the 48 h one, a
     * target above the goal's ceiling, a target under hold. */
    ntrc_baseline(f, &c);
    c.num[3] = 20.0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.num[7] = 12.0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.en[CP_GOAL] = NTR_GOAL_HOLD;
    c.num[7] = 1.0;
    judge(f, &c, NTRC_KIND_SERIES);
    /* Plans that breach: a fast rise; a fast fall (5% dextrose) under each
     * goal; no limits at all. */
    ntrc_baseline(f, &c);
    c.tflows[0].rate_ml_h = 400.0;
    c.tflows[0].end_h = 24.0;
    judge(f, &c, NTRC_KIND_SERIES);
    for (mode = NTR_GOAL_RAISE; mode <= NTR_GOAL_HOLD; mode++) {
        ntrc_baseline(f, &c);
        c.en[CP_GOAL] = mode;
        c.num[7] = 0.0;
        c.tflows[0].rate_ml_h = 300.0; /* 121 falls to about 99 by 24 h */
        c.tflows[0].na_mmol_l = 0.0;
        c.tflows[0].end_h = 24.0;
        judge(f, &c, NTRC_KIND_SERIES);
    }
    ntrc_baseline(f, &c);
    c.num[3] = c.num[4] = c.num[5] = c.num[6] = c.num[7] = 0.0;
    judge(f, &c, NTRC_KIND_SERIES);
}

/* Grouped: en[0] goal, en[1] limits' size mode, en[2] report size mode
 * (the stride). */
static size_t course_report_stride(const ntrc_case *c)
{
    return siad_size(c->en[CP_OUT_SIZE], sizeof(ntr_course_report));
}

static int call_batch_course_assess(ntrc_case *c)
{
    ntr_course_limits lim;
    course_limits_from(c, &lim);
    return ntr_batch_course_assess(
        c->groups, in_null(c, 0) ? NULL : c->offsets, in_null(c, 1) ? NULL : c->samples,
        c->capacity, in_null(c, 2) ? NULL : &lim, course_report_stride(c),
        in_null(c, 3) ? NULL : (ntr_course_report *)(void *)c->out.s.course_groups.out,
        in_null(c, 4) ? NULL : c->out.s.course_groups.status, in_null(c, 5) ? NULL : &c->out.z[1]);
}

/* The call-level status: NULL pointers, the stride, the offsets. */
static int course_groups_call_level(const ntrc_case *c)
{
    if ((c->out_null & ~NTRC_NULL_IN(5)) != 0u) {
        return NTR_ERR_NULL;
    }
    if (!size_mode_ok(c->en[CP_OUT_SIZE])) {
        return NTR_ERR_ARG;
    }
    return groups_call_level(c);
}

static int course_group_status(const ntrc_case *c, size_t g, ntr_course_report *r)
{
    ntr_course_limits lim;
    course_limits_from(c, &lim);
    r->struct_size = sizeof *r;
    return ntr_course_assess(&c->samples[c->offsets[g]], c->offsets[g + 1] - c->offsets[g], &lim,
                             r);
}

static int predict_batch_course(const ntrc_fn *f, const ntrc_case *c)
{
    size_t g;
    int st = course_groups_call_level(c);
    (void)f;
    if (st != NTR_OK) {
        return st;
    }
    for (g = 0; g < c->groups; g++) {
        ntr_course_report r;
        st = course_group_status(c, g, &r);
        if (st != NTR_OK) {
            return st;
        }
    }
    return NTR_OK;
}

static int same_double_bits(double a, double b)
{
    return memcmp(&a, &b, sizeof a) == 0;
}

/* Every group equals the scalar call (member by member, bits); failed
 * groups NaN with zero flags; the bytes between reports and the groups
 * past the last untouched. */
static const char *judge_course_groups(const ntrc_case *c, const ntrc_outs *before)
{
    const size_t stride = course_report_stride(c);
    const unsigned char *now = c->out.s.course_groups.out;
    const unsigned char *was = before->s.course_groups.out;
    size_t g;
    size_t bad = 0;
    for (g = 0; g < 8; g++) {
        ntr_course_report o, want;
        const double *od_, *wd_;
        int st;
        size_t k;
        if (g >= c->groups) {
            if (memcmp(now + g * stride, was + g * stride, sizeof o) != 0 ||
                c->out.s.course_groups.status[g] != before->s.course_groups.status[g]) {
                return "a group past the last was written";
            }
            continue;
        }
        if (memcmp(now + g * stride + sizeof o, was + g * stride + sizeof o, stride - sizeof o) !=
            0) {
            return "bytes past a report's 1.1 size were written";
        }
        memcpy(&o, now + g * stride, sizeof o);
        st = course_group_status(c, g, &want);
        if (c->out.s.course_groups.status[g] != st) {
            return "group status differs from ntr_course_assess";
        }
        if (o.struct_size != sizeof o || o.reserved != 0u) {
            return "group report's struct_size or reserved wrong";
        }
        if (st == NTR_OK) {
            if (!same_double_bits(o.max_rise_24h, want.max_rise_24h) ||
                !same_double_bits(o.max_rise_48h, want.max_rise_48h) ||
                !same_double_bits(o.max_fall_24h, want.max_fall_24h) ||
                !same_double_bits(o.max_fall_48h, want.max_fall_48h) ||
                !same_double_bits(o.excess_mmol_l, want.excess_mmol_l) || o.flags != want.flags ||
                !same_double_bits(o.rise_first_24h, want.rise_first_24h) ||
                !same_double_bits(o.fall_first_24h, want.fall_first_24h) ||
                !same_double_bits(o.rise_now_24h, want.rise_now_24h) ||
                !same_double_bits(o.fall_now_24h, want.fall_now_24h) ||
                !same_double_bits(o.last_rate_per_h, want.last_rate_per_h) ||
                !same_double_bits(o.elapsed_h, want.elapsed_h) ||
                !same_double_bits(o.worst_at_h, want.worst_at_h)) {
                return "group report differs (bits) from ntr_course_assess";
            }
            continue;
        }
        bad++;
        od_ = &o.max_rise_24h;
        wd_ = &o.rise_first_24h;
        for (k = 0; k < 5; k++) {
            if (!isnan(od_[k])) {
                return "failed group not NaN";
            }
        }
        for (k = 0; k < 7; k++) {
            if (!isnan(wd_[k])) {
                return "failed group not NaN";
            }
        }
        if (o.flags != 0u) {
            return "failed group with flags";
        }
    }
    if (!in_null(c, 5) && c->out.z[1] != bad) {
        return "failed count wrong";
    }
    return NULL;
}

static const char *ok_batch_course(const ntrc_case *c)
{
    ntrc_outs before;
    memset(&before, SENTINEL_BYTE, sizeof before);
    return judge_course_groups(c, &before);
}

static const char *err_batch_course(const ntrc_case *c, const ntrc_outs *before, int status)
{
    (void)status;
    if (course_groups_call_level(c) != NTR_OK) {
        return memcmp(&c->out, before, sizeof *before) == 0
                   ? NULL
                   : "something was written on a call-level error";
    }
    return judge_course_groups(c, before);
}

static int results_course_groups(const ntrc_case *c, double *v, int max)
{
    const size_t stride = course_report_stride(c);
    int k = 0;
    size_t g;
    for (g = 0; g < c->groups && k + 4 <= max; g++) {
        ntr_course_report o;
        memcpy(&o, c->out.s.course_groups.out + g * stride, sizeof o);
        v[k++] = c->out.s.course_groups.status[g];
        v[k++] = o.max_rise_24h;
        v[k++] = o.max_fall_24h;
        v[k++] = o.flags;
    }
    return k;
}

static void extra_course_groups(const ntrc_fn *f, void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    unsigned int k;
    int mode;
    /* An empty group; groups = 0 (with and without NULLs). */
    ntrc_baseline(f, &c);
    base_groups(&c);
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.groups = 0;
    judge(f, &c, NTRC_KIND_SERIES);
    for (k = 0; k < 6; k++) {
        ntrc_baseline(f, &c);
        c.groups = 0;
        c.out_null = NTRC_NULL_IN(k);
        judge(f, &c, NTRC_KIND_NULL);
    }
    /* Offsets that decrease, or run past n_samples; strides of every mode
     * (a bad stride wins over bad offsets: both are call-level ARG). */
    ntrc_baseline(f, &c);
    c.offsets[1] = 5;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.capacity = 5;
    judge(f, &c, NTRC_KIND_SERIES);
    for (mode = -1; mode <= 3; mode++) {
        ntrc_baseline(f, &c);
        c.en[CP_OUT_SIZE] = mode;
        judge(f, &c, NTRC_KIND_SERIES);
        ntrc_baseline(f, &c);
        c.en[CP_LIM_SIZE] = mode;
        judge(f, &c, NTRC_KIND_SERIES);
    }
    /* A bad sample in one group only; an unsorted group; bad limits; an
     * unknown goal (every group fails with it). */
    ntrc_baseline(f, &c);
    c.samples[3].na_mmol_l = NAN;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.samples[5].hours = 1.0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.num[0] = 40.0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.en[CP_GOAL] = 0;
    judge(f, &c, NTRC_KIND_SERIES);
    /* A falling cohort under each goal. */
    for (mode = NTR_GOAL_RAISE; mode <= NTR_GOAL_HOLD; mode++) {
        size_t i;
        ntrc_baseline(f, &c);
        c.en[CP_GOAL] = mode;
        c.num[4] = 0.0;
        for (i = 0; i < c.n; i++) {
            c.samples[i].na_mmol_l = 170.0 - 4.0 * (double)i;
        }
        judge(f, &c, NTRC_KIND_SERIES);
    }
}

/* ---- the table --------------------------------------------------------------- */


#define NA {"na_mmol_l", 80.0, 220.0, 0}
/* ---- urine feedback and the fit (lib/feedback.c) ------------------------------------ */

#define FB_FLAGS_ALL (NTR_FB_LIMIT_AHEAD | NTR_FB_WATER_DIURESIS | NTR_FB_DILUTE_URINE | \
                      NTR_FB_OVER_NOW | NTR_FB_SALT_LOSS)
#define FIT_FLAGS_ALL (NTR_FIT_TBW_AT_BOUND | NTR_FIT_LOSS_AT_BOUND | NTR_FIT_NOT_CONVERGED | \
                       NTR_FIT_EXACT | NTR_FIT_DRIFT)

/* The documented checks of one interval's members, in struct order. */
static int urine_status(const ntr_urine_interval *u)
{
    int st;
    if ((st = check_value(u->start_h, 0.0, 720.0)) != NTR_OK ||
        (st = check_value(u->end_h, 0.0, 720.0)) != NTR_OK ||
        (st = check_value(u->volume_ml, 0.0, 30000.0)) != NTR_OK ||
        (st = check_value(u->na_mmol_l, 0.0, 500.0)) != NTR_OK ||
        (st = check_value(u->k_mmol_l, 0.0, 300.0)) != NTR_OK) {
        return st;
    }
    return check_value(u->osm_mosm_kg, 10.0, 2000.0);
}

static int urine_reserved_ok(const ntr_urine_interval *u)
{
    return u->reserved_d[0] == 0.0 && u->reserved_d[1] == 0.0 && u->reserved[0] == 0u &&
           u->reserved[1] == 0u;
}

static int urine_long_enough(const ntr_urine_interval *u)
{
    return u->end_h - u->start_h >= 1.0 / 60.0;
}

/* ntr_urine_interval_flow: num[0..5] are the interval's members, en[0]
 * its first reserved field. */
static int call_urine_interval_flow(ntrc_case *c)
{
    ntr_urine_interval u;
    memset(&u, 0, sizeof u);
    u.start_h = c->num[0];
    u.end_h = c->num[1];
    u.volume_ml = c->num[2];
    u.na_mmol_l = c->num[3];
    u.k_mmol_l = c->num[4];
    u.osm_mosm_kg = c->num[5];
    u.reserved[0] = (unsigned int)c->en[0];
    return ntr_urine_interval_flow(in_null(c, 0) ? NULL : &u,
                                   in_null(c, 1) ? NULL : &c->out.s.tflow);
}

static int predict_urine_interval_flow(const ntrc_fn *f, const ntrc_case *c)
{
    int i, st;
    (void)f;
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    if (c->en[0] != 0) {
        return NTR_ERR_ARG;
    }
    for (i = 0; i < 6; i++) {
        if ((st = check_value(c->num[i], f->num[i].lo, f->num[i].hi)) != NTR_OK) {
            return st;
        }
    }
    return c->num[1] - c->num[0] >= 1.0 / 60.0 ? NTR_OK : NTR_ERR_ORDER;
}

static const char *ok_urine_interval_flow(const ntrc_case *c)
{
    const ntr_timed_flow *t = &c->out.s.tflow;
    if (t->start_h != c->num[0] || t->end_h != c->num[1] || t->na_mmol_l != c->num[3] ||
        t->k_mmol_l != c->num[4] || t->reserved[0] != 0u || t->reserved[1] != 0u) {
        return "span, composition or reserved fields not copied";
    }
    if (!close_to(t->rate_ml_h, -c->num[2] / (c->num[1] - c->num[0]), 1e-12) ||
        !within(t->rate_ml_h, -5000.0, 0.0)) {
        return "rate is not -volume/duration within -5000..0 mL/h";
    }
    return NULL;
}

static int results_urine_interval_flow(const ntrc_case *c, double *v, int max)
{
    if (max < 3) {
        return 0;
    }
    v[0] = c->out.s.tflow.rate_ml_h;
    v[1] = c->out.s.tflow.start_h;
    v[2] = c->out.s.tflow.end_h;
    return 3;
}

/* ntr_urine_feedback: the plan check's history, flows and limits (num[0]
 * body water, num[1] horizon, num[2] step, num[3..7] limits; en as the
 * plan check's), and two measured intervals after the last sample. */
static void base_urine(ntrc_case *c)
{
    memset(c->urine, 0, sizeof c->urine);
    c->n3 = 2;
    c->urine[0].start_h = 6.0;
    c->urine[0].end_h = 8.0;
    c->urine[0].volume_ml = 300.0;
    c->urine[0].na_mmol_l = 40.0;
    c->urine[0].k_mmol_l = 20.0;
    c->urine[0].osm_mosm_kg = 300.0;
    c->urine[1].start_h = 8.0;
    c->urine[1].end_h = 10.0;
    c->urine[1].volume_ml = 500.0;
    c->urine[1].na_mmol_l = 20.0;
    c->urine[1].k_mmol_l = 10.0;
    c->urine[1].osm_mosm_kg = 90.0;
}

static void base_feedback(ntrc_case *c)
{
    base_plan(c);
    base_urine(c);
}

static void fuzz_feedback(ntrc_case *c, ntrc_source *src)
{
    size_t i;
    double t = src->number(src, 0.0, 24.0);
    fuzz_plan(c, src);
    memset(c->urine, 0, sizeof c->urine);
    c->n3 = src->byte(src) % (NTRC_MAX_FLOWS + 1);
    for (i = 0; i < c->n3; i++) {
        c->urine[i].start_h = t;
        t += src->number(src, 0.0, 6.0);
        c->urine[i].end_h = t;
        c->urine[i].volume_ml = src->number(src, 0.0, 3000.0);
        c->urine[i].na_mmol_l = src->number(src, 0.0, 500.0);
        c->urine[i].k_mmol_l = src->number(src, 0.0, 300.0);
        c->urine[i].osm_mosm_kg = src->number(src, 10.0, 2000.0);
        if (src->byte(src) > 250u) {
            c->urine[i].reserved_d[src->byte(src) & 1u] = 1.0;
        }
    }
}

static void prepare_feedback(ntrc_case *c)
{
    c->out.s.feedback.struct_size = siad_size(c->en[CP_OUT_SIZE], sizeof c->out.s.feedback);
}

static int call_urine_feedback(ntrc_case *c)
{
    ntr_course_limits lim;
    plan_course_limits(c, &lim);
    return ntr_urine_feedback(in_null(c, 0) ? NULL : c->samples, c->n, c->num[0],
                              in_null(c, 1) ? NULL : c->tflows, c->n2,
                              in_null(c, 2) ? NULL : c->urine, c->n3, c->num[1], c->num[2],
                              in_null(c, 3) ? NULL : &lim,
                              in_null(c, 4) ? NULL : &c->out.s.feedback);
}

static int predict_urine_feedback(const ntrc_fn *f, const ntrc_case *c)
{
    size_t i;
    int st;
    if (in_null(c, 0) || in_null(c, 2) || in_null(c, 3) || in_null(c, 4) ||
        (in_null(c, 1) && c->n2 > 0)) {
        return NTR_ERR_NULL;
    }
    if (c->n == 0 || c->n3 == 0 || !size_mode_ok(c->en[CP_LIM_SIZE]) ||
        !ntrc_enum_is_valid(f, CP_GOAL, c->en[CP_GOAL]) || !size_mode_ok(c->en[CP_OUT_SIZE]) ||
        !tflows_reserved_ok(c->tflows, c->n2)) {
        return NTR_ERR_ARG;
    }
    for (i = 0; i < c->n3; i++) {
        if (!urine_reserved_ok(&c->urine[i])) {
            return NTR_ERR_ARG;
        }
    }
    if ((st = samples_status(c->samples, c->n)) != NTR_OK ||
        (st = check_value(c->num[0], 0.1, 400.0)) != NTR_OK ||
        (st = tflows_status(c->tflows, c->n2)) != NTR_OK) {
        return st;
    }
    for (i = 0; i < c->n3; i++) {
        if ((st = urine_status(&c->urine[i])) != NTR_OK) {
            return st;
        }
    }
    if ((st = span_status(c->num[1], c->num[2])) != NTR_OK ||
        (st = course_limits_status(c->en[CP_GOAL], &c->num[3])) != NTR_OK) {
        return st;
    }
    if (!samples_sorted(c->samples, c->n) || !tflows_ordered(c->tflows, c->n2)) {
        return NTR_ERR_ORDER;
    }
    for (i = 0; i < c->n3; i++) {
        if (!urine_long_enough(&c->urine[i]) ||
            (i > 0 && c->urine[i].start_h < c->urine[i - 1].end_h)) {
            return NTR_ERR_ORDER;
        }
    }
    return NTR_OK;
}

static const char *ok_urine_feedback(const ntrc_case *c)
{
    const ntr_urine_feedback_result *r = &c->out.s.feedback;
    const double horizon = c->num[1];
    if (r->struct_size != sizeof *r || r->plan.struct_size != sizeof r->plan) {
        return "struct_size not set to the size filled";
    }
    if ((r->flags & ~FB_FLAGS_ALL) != 0u || r->reserved != 0u) {
        return "undefined flags or reserved field written";
    }
    if (!within(r->na_now_mmol_l, 80.0, 220.0) || !(r->tbw_now_l >= 0.1) ||
        !within(r->plan.final_na_mmol_l, 80.0, 220.0)) {
        return "estimate outside the model's range";
    }
    if (!close_to(r->efw_balance_ml, r->efw_in_ml - r->efw_out_ml, 1e-9) ||
        !within(r->urine_ml_h, 0.0, 5000.0) || !isfinite(r->na_rate_mmol_l_h)) {
        return "EFW figures inconsistent or not finite";
    }
    if (r->breach_h != NTR_PLAN_NO_BREACH && !(r->breach_h >= 0.0 && r->breach_h <= horizon + 1e-9)) {
        return "breach time outside the horizon";
    }
    if (((r->flags & NTR_FB_LIMIT_AHEAD) != 0u) != (r->breach_h != NTR_PLAN_NO_BREACH)) {
        return "limit-ahead flag disagrees with the breach time";
    }
    if ((r->flags & (NTR_FB_WATER_DIURESIS | NTR_FB_OVER_NOW | NTR_FB_SALT_LOSS)) != 0u &&
        (r->flags & NTR_FB_LIMIT_AHEAD) == 0u) {
        return "a breach flag without a breach";
    }
    return NULL;
}

static int results_urine_feedback(const ntrc_case *c, double *v, int max)
{
    const ntr_urine_feedback_result *r = &c->out.s.feedback;
    if (max < 8) {
        return 0;
    }
    v[0] = r->now_h;
    v[1] = r->na_now_mmol_l;
    v[2] = r->tbw_now_l;
    v[3] = r->efw_balance_ml;
    v[4] = r->na_rate_mmol_l_h;
    v[5] = r->breach_h;
    v[6] = r->flags;
    v[7] = r->plan.final_na_mmol_l;
    return 8;
}

static void extra_urine_feedback(const ntrc_fn *f, void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    size_t k;
    extra_tflows(f, judge, 1);
    ntrc_baseline(f, &c);
    c.n = 0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.n3 = 0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.samples[1].hours = 100.0; /* history out of order */
    judge(f, &c, NTRC_KIND_SERIES);
    c.urine[1].osm_mosm_kg = NAN; /* ... a bad interval wins */
    judge(f, &c, NTRC_KIND_ORDER);
    c.urine[0].reserved[1] = 1u; /* ... and a reserved field over both */
    judge(f, &c, NTRC_KIND_ORDER);
    for (k = 0; k < 2; k++) {
        const double bad[] = {NAN, HUGE_VAL, -1.0, 721.0, 30001.0, 501.0, 301.0, 9.0, 2001.0};
        size_t b;
        ntrc_baseline(f, &c);
        c.urine[k].reserved_d[0] = 0.5;
        judge(f, &c, NTRC_KIND_SERIES);
        for (b = 0; b < sizeof bad / sizeof bad[0]; b++) {
            ntrc_baseline(f, &c);
            switch (b) {
            case 0: c.urine[k].volume_ml = bad[b]; break;
            case 1: c.urine[k].end_h = bad[b]; break;
            case 2: c.urine[k].start_h = bad[b]; break;
            case 3: c.urine[k].end_h = bad[b]; break;
            case 4: c.urine[k].volume_ml = bad[b]; break;
            case 5: c.urine[k].na_mmol_l = bad[b]; break;
            case 6: c.urine[k].k_mmol_l = bad[b]; break;
            default: c.urine[k].osm_mosm_kg = bad[b]; break;
            }
            judge(f, &c, NTRC_KIND_SERIES);
        }
    }
    /* Overlapping intervals; one shorter than a minute; a rate over
     * 5000 mL/h (domain); a horizon past 720 h after the last sample. */
    ntrc_baseline(f, &c);
    c.urine[1].start_h = 7.0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.urine[1].end_h = 8.01;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.urine[1].volume_ml = 12000.0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.num[1] = 719.0;
    c.num[2] = 1.0;
    judge(f, &c, NTRC_KIND_SERIES);
    for (k = 0; k < 4; k++) {
        ntrc_baseline(f, &c);
        c.en[k < 2 ? CP_LIM_SIZE : CP_OUT_SIZE] = (k & 1u) ? 1 : -1;
        judge(f, &c, NTRC_KIND_SERIES);
    }
}

/* ntr_course_fit: a design-A patient (3% saline 250 mL/h over 2 h, hidden
 * body water 35 L and loss 120 mL/h), 7 exact samples every 2 h; num[0]
 * the guess, en[0] the fit's struct size mode. */
static void base_fit(ntrc_case *c)
{
    static const double na[] = {120.0, 126.389676687465, 127.255853797830, 128.133985048879,
                                129.024319629415, 129.927113702624, 130.842630651791};
    size_t i;
    c->n = sizeof na / sizeof na[0];
    for (i = 0; i < c->n; i++) {
        c->samples[i].hours = 2.0 * (double)i;
        c->samples[i].na_mmol_l = na[i];
    }
    memset(c->tflows, 0, sizeof c->tflows);
    c->n2 = 1;
    c->tflows[0].end_h = 2.0;
    c->tflows[0].rate_ml_h = 250.0;
    c->tflows[0].na_mmol_l = 513.0;
}

static void prepare_fit(ntrc_case *c)
{
    c->out.s.fit.struct_size = siad_size(c->en[0], sizeof c->out.s.fit);
}

static int call_course_fit(ntrc_case *c)
{
    return ntr_course_fit(in_null(c, 0) ? NULL : c->samples, c->n, c->num[0],
                          in_null(c, 1) ? NULL : c->tflows, c->n2,
                          in_null(c, 2) ? NULL : &c->out.s.fit);
}

static int predict_course_fit(const ntrc_fn *f, const ntrc_case *c)
{
    int st;
    (void)f;
    if (in_null(c, 0) || in_null(c, 2) || (in_null(c, 1) && c->n2 > 0)) {
        return NTR_ERR_NULL;
    }
    if (c->n < 3 || !size_mode_ok(c->en[0]) || !tflows_reserved_ok(c->tflows, c->n2)) {
        return NTR_ERR_ARG;
    }
    if ((st = samples_status(c->samples, c->n)) != NTR_OK ||
        (st = check_value(c->num[0], 0.1, 400.0)) != NTR_OK ||
        (st = tflows_status(c->tflows, c->n2)) != NTR_OK) {
        return st;
    }
    if (!samples_sorted(c->samples, c->n) || !tflows_ordered(c->tflows, c->n2)) {
        return NTR_ERR_ORDER;
    }
    return NTR_OK;
}

static const char *ok_course_fit(const ntrc_case *c)
{
    const ntr_fit *r = &c->out.s.fit;
    const double lo = c->num[0] / 3.0 > 0.1 ? c->num[0] / 3.0 : 0.1;
    const double hi = c->num[0] * 3.0 < 400.0 ? c->num[0] * 3.0 : 400.0;
    if (r->struct_size != sizeof *r) {
        return "struct_size not set to the size filled";
    }
    if ((r->flags & ~FIT_FLAGS_ALL) != 0u) {
        return "undefined flags written";
    }
    if (!within(r->tbw_l, lo * (1.0 - 1e-12), hi * (1.0 + 1e-12)) ||
        !within(r->free_water_loss_ml_h, -2000.0, 2000.0) ||
        !within(r->na0_mmol_l, 80.0, 220.0)) {
        return "a fitted value outside its search range";
    }
    if (!within(r->rms_residual_mmol_l, 0.0, 140.0) || !within(r->correlation, -0.999, 0.999) ||
        !(r->tbw_se_l >= 0.0) || !(r->free_water_loss_se_ml_h >= 0.0) ||
        !isfinite(r->tbw_se_l) || !isfinite(r->free_water_loss_se_ml_h)) {
        return "residual, correlation or standard errors out of bounds";
    }
    if (r->iterations < 1u || r->iterations > 200u || !(r->tbw_last_l >= 0.1) ||
        !within(r->na_last_fit_mmol_l, 80.0, 220.0) || !isfinite(r->late_residual_mmol_l)) {
        return "iterations or the fitted state at the last sample out of bounds";
    }
    if (((r->flags & NTR_FIT_EXACT) != 0u) != (c->n == 3)) {
        return "exact flag disagrees with the sample count";
    }
    return NULL;
}

static int results_course_fit(const ntrc_case *c, double *v, int max)
{
    const ntr_fit *r = &c->out.s.fit;
    if (max < 6) {
        return 0;
    }
    v[0] = r->tbw_l;
    v[1] = r->free_water_loss_ml_h;
    v[2] = r->na0_mmol_l;
    v[3] = r->rms_residual_mmol_l;
    v[4] = r->correlation;
    v[5] = r->flags;
    return 6;
}

static void extra_course_fit(const ntrc_fn *f, void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    int mode;
    extra_tflows(f, judge, 1);
    ntrc_baseline(f, &c);
    c.n = 2;
    judge(f, &c, NTRC_KIND_SERIES);
    c.samples[0].na_mmol_l = NAN; /* the count wins over the numbers */
    judge(f, &c, NTRC_KIND_ORDER);
    ntrc_baseline(f, &c);
    c.n = 3;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.samples[2].hours = 100.0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.samples[6].hours = 800.0; /* the span past 720 h: domain */
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.n2 = 0;                     /* nothing separates the two: domain */
    judge(f, &c, NTRC_KIND_SERIES);
    for (mode = -1; mode <= 3; mode++) {
        ntrc_baseline(f, &c);
        c.en[0] = mode;
        judge(f, &c, NTRC_KIND_SERIES);
    }
}

/* ntr_fit_reproject: the plan check's history, flows and limits; num[0]
 * the fit's body water, num[8] its loss; en[3] the fit's struct size. */
static int call_fit_reproject(ntrc_case *c)
{
    ntr_course_limits lim;
    ntr_fit fit;
    memset(&fit, 0, sizeof fit);
    fit.struct_size = siad_size(c->en[3], sizeof fit);
    fit.tbw_l = c->num[0];
    fit.free_water_loss_ml_h = c->num[8];
    plan_course_limits(c, &lim);
    return ntr_fit_reproject(in_null(c, 0) ? NULL : c->samples, c->n,
                             in_null(c, 4) ? NULL : &fit,
                             in_null(c, 1) ? NULL : c->tflows, c->n2, c->num[1], c->num[2],
                             in_null(c, 2) ? NULL : &lim,
                             in_null(c, 3) ? NULL : &c->out.s.course_plan);
}

static int predict_fit_reproject(const ntrc_fn *f, const ntrc_case *c)
{
    int st;
    if (in_null(c, 0) || in_null(c, 2) || in_null(c, 3) || in_null(c, 4) ||
        (in_null(c, 1) && c->n2 > 0)) {
        return NTR_ERR_NULL;
    }
    if (c->n == 0 || !size_mode_ok(c->en[3]) || !size_mode_ok(c->en[CP_LIM_SIZE]) ||
        !ntrc_enum_is_valid(f, CP_GOAL, c->en[CP_GOAL]) || !size_mode_ok(c->en[CP_OUT_SIZE]) ||
        !tflows_reserved_ok(c->tflows, c->n2)) {
        return NTR_ERR_ARG;
    }
    if ((st = samples_status(c->samples, c->n)) != NTR_OK ||
        (st = check_value(c->num[0], 0.1, 400.0)) != NTR_OK ||
        (st = check_value(c->num[8], -2000.0, 2000.0)) != NTR_OK ||
        (st = tflows_status(c->tflows, c->n2)) != NTR_OK ||
        (st = span_status(c->num[1], c->num[2])) != NTR_OK ||
        (st = course_limits_status(c->en[CP_GOAL], &c->num[3])) != NTR_OK) {
        return st;
    }
    if (!samples_sorted(c->samples, c->n) || !tflows_ordered(c->tflows, c->n2)) {
        return NTR_ERR_ORDER;
    }
    return NTR_OK;
}

static const char *ok_fit_reproject(const ntrc_case *c)
{
    const ntr_course_plan_result *p = &c->out.s.course_plan;
    size_t need = points_needed(c->num[1], c->num[2]);
    if (p->struct_size != sizeof *p || p->course.struct_size != sizeof p->course) {
        return "struct_size not set to the size filled";
    }
    if ((p->course.flags & ~NTR_CF_COURSE_ALL) != 0u || p->reserved != 0u) {
        return "undefined flags or reserved fields written";
    }
    if (p->points + 2u < need || p->points > need + 1u) {
        return "number of predicted points wrong";
    }
    if (!within(p->final_na_mmol_l, 80.0, 220.0) || !(p->final_tbw_l >= 0.1)) {
        return "final state outside the model's range";
    }
    if (!breach_time_ok(p->first_breach_h, c->num[1])) {
        return "breach time outside the plan";
    }
    return NULL;
}

static void extra_fit_reproject(const ntrc_fn *f, void (*judge)(const ntrc_fn *, ntrc_case *, int))
{
    ntrc_case c;
    int mode;
    extra_tflows(f, judge, 1);
    ntrc_baseline(f, &c);
    c.n = 0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.samples[1].hours = 100.0;
    judge(f, &c, NTRC_KIND_SERIES);
    ntrc_baseline(f, &c);
    c.num[0] = 0.5;   /* a loss that drains the body water: domain */
    c.num[8] = 2000.0;
    judge(f, &c, NTRC_KIND_SERIES);
    for (mode = -1; mode <= 3; mode++) {
        ntrc_baseline(f, &c);
        c.en[3] = mode;
        judge(f, &c, NTRC_KIND_SERIES);
    }
}

#define TBW {"tbw_l", 0.1, 400.0, 0}
#define GLU {"glucose_mmol_l", 0.0, 200.0, 0}
#define INF_NA {"infusate_na_mmol_l", 0.0, 1100.0, 0}
#define INF_K {"infusate_k_mmol_l", 0.0, 400.0, 0}
#define U_NA {"urine_na_mmol_l", 0.0, 500.0, 0}
#define U_K {"urine_k_mmol_l", 0.0, 300.0, 0}
#define S_NA {"serum_na_mmol_l", 80.0, 220.0, 0}
#define OSM(nm) {nm, 150.0, 600.0, 0}
#define SEX {"sex", NTR_ERR_ARG, 2, {NTR_SEX_MALE, NTR_SEX_FEMALE}}
#define UNIT_ENUM(nm) {nm, NTR_ERR_UNIT, 6, {1, 2, 3, 4, 5, 6}}
#define TRI(nm) {nm, NTR_ERR_ARG, 3, {0, 1, 2}}
#define KNOWN(nm) {nm, NTR_ERR_ARG, 2, {1, 0}}
#define SIZE_MODE(nm) {nm, NTR_ERR_ARG, 2, {0, 2}}
#define WATCH_MODE {"watch_state", NTR_ERR_ARG, 1, {0}}
#define SOLUTE_DAY {"solute_mosm_day", 0.0, 10000.0, 0}
#define U_OSM {"urine_osm_mosm_kg", 10.0, 2000.0, 0}
#define INSENSIBLE {"insensible_l_day", 0.0, 10.0, 0}
#define TARGET_INTAKE {"target_intake_l_day", 0.0, 10.0, 1}
#define SOLUTE_KIND {"solute", NTR_ERR_ARG, 2, {NTR_SOLUTE_UREA, NTR_SOLUTE_NACL}}
#define ST(x) BIT(NTR_##x)
#define OK_COMMON (ST(OK) | COMMON_ERR)
#define CALL(fn) .name = "ntr_" #fn, .call = call_##fn

/* ---- therapy (1.1) ------------------------------------------------------------------ */

static int call_loop_diuretic(ntrc_case *c)
{
    const double *x = c->num;
    return ntr_loop_diuretic(x[0], x[1], x[2], x[3], x[4], x[5], od(c, 0), od(c, 1));
}

static const char *ok_loop_diuretic(const ntrc_case *c)
{
    const double *x = c->num;
    ntr_flow fl[2];
    double na, tbw;
    fl[0].volume_l = -x[2];
    fl[0].na_mmol_l = x[3];
    fl[0].k_mmol_l = 0.0;
    fl[1].volume_l = x[4];
    fl[1].na_mmol_l = x[5];
    fl[1].k_mmol_l = 0.0;
    if (ntr_balance_predict(x[0], x[1], fl, 1, &na, &tbw) != NTR_OK || na != c->out.d[0]) {
        return "sodium without replacement differs from the mass balance";
    }
    if (ntr_balance_predict(x[0], x[1], fl, 2, &na, &tbw) != NTR_OK || na != c->out.d[1]) {
        return "sodium with replacement differs from the mass balance";
    }
    return NULL;
}

static int call_dda_clamp(ntrc_case *c)
{
    const double *x = c->num;
    return ntr_dda_clamp(x[0], x[1], x[2], x[3], x[4], x[5], x[6], od(c, 0), od(c, 1));
}

static const char *ok_dda_clamp(const ntrc_case *c)
{
    if (!within(c->out.d[0], -140.0, 140.0)) {
        return "24 h change outside the model's range";
    }
    /* A stop rise of a denormal reaches its hour at 0 (the product underflows). */
    if (c->out.d[1] != NTR_THERAPY_NEVER && !(c->out.d[1] >= 0.0 && c->out.d[1] <= 720.0)) {
        return "stop hour neither never nor within 720 h";
    }
    return NULL;
}

static int call_dda_relower(ntrc_case *c)
{
    const double *x = c->num;
    return ntr_dda_relower(x[0], x[1], x[2], x[3], x[4], x[5], x[6], od(c, 0), od(c, 1));
}

static const char *ok_dda_relower(const ntrc_case *c)
{
    if (!within(c->out.d[0], 0.0, 20.0) || !within(c->out.d[1], 0.0, 5000.0)) {
        return "volume or rate outside what a plan takes";
    }
    if (c->num[2] == 0.0 && (c->out.d[0] != 0.0 || c->out.d[1] != 0.0)) {
        return "fluid given with no excess";
    }
    return NULL;
}

static void prepare_vaptan(ntrc_case *c)
{
    c->out.s.vaptan.struct_size = siad_size(c->en[2], sizeof c->out.s.vaptan);
}

static int call_vaptan_watch_preset(ntrc_case *c)
{
    return ntr_vaptan_watch_preset(c->en[0], c->en[1], in_null(c, 0) ? NULL : &c->out.s.vaptan);
}

static const char *ok_vaptan_watch_preset(const ntrc_case *c)
{
    const ntr_vaptan_watch *w = &c->out.s.vaptan;
    if (w->struct_size != sizeof *w || w->limits.struct_size != sizeof w->limits ||
        w->reserved != 0u || (w->cautions & ~NTR_VAPTAN_CAUTION_ALL) != 0u ||
        (w->cautions & NTR_VAPTAN_NO_RESTRICTION_24H) == 0u) {
        return "sizes, reserved field or caution bits wrong";
    }
    if (w->limits.goal != NTR_GOAL_RAISE || !within(w->horizon_h, 0.5, 24.0) ||
        !within(w->resample_h, 0.5, 24.0)) {
        return "goal, horizon or resample interval out of bounds";
    }
    return NULL;
}

static int results_vaptan(const ntrc_case *c, double *v, int max)
{
    const ntr_vaptan_watch *w = &c->out.s.vaptan;
    if (max < 5) {
        return 0;
    }
    v[0] = w->limits.max_rise_24h;
    v[1] = w->limits.max_rise_48h;
    v[2] = w->horizon_h;
    v[3] = w->resample_h;
    v[4] = w->cautions;
    return 5;
}

static int call_hyper_lower_plan(ntrc_case *c)
{
    const double *x = c->num;
    return ntr_hyper_lower_plan(x[0], x[1], c->en[0], c->en[1], x[2], x[3], x[4], x[5], x[6],
                                od(c, 0), od(c, 1), od(c, 2));
}

static const char *ok_hyper_lower_plan(const ntrc_case *c)
{
    if (!within(c->out.d[1], 0.0, 20.0) || !within(c->out.d[0], 0.0, 5000.0) ||
        !close_to(c->out.d[0], c->out.d[1] * 1000.0 / c->num[3], 1e-12)) {
        return "volume or rate outside a plan, or rate not volume / hours";
    }
    if (c->out.d[2] != NTR_PLAN_NO_BREACH &&
        !(c->out.d[2] > 0.0 && c->out.d[2] <= c->num[3] + 1e-9)) {
        return "breach time outside the plan";
    }
    return NULL;
}

static int call_bolus_plan(ntrc_case *c)
{
    const double *x = c->num;
    return ntr_bolus_plan(x[0], x[1], x[2], x[3], oi(c, 0), od(c, 0), oi(c, 1));
}

static const char *ok_bolus_plan(const ntrc_case *c)
{
    if (c->out.i[0] < 1 || c->out.i[0] > NTR_BOLUS_COUNT_MAX ||
        (c->out.i[1] != 0 && c->out.i[1] != 1)) {
        return "bolus count or held flag out of bounds";
    }
    if (!within(c->out.d[0], 0.0, c->num[3] + 1e-6) ||
        (c->out.i[1] == 0 && c->out.d[0] < c->num[2] - 1e-6)) {
        return "rise past the limit, or short of the aim without being held";
    }
    return NULL;
}

const ntrc_fn ntrc_functions[] = {
    /* units */
    {CALL(unit_parse), .n_enum = 1, .en = {{"ucum", NTR_ERR_UNIT, 6, {0, 1, 2, 3, 4, 5}}},
     .n_out_i = 1, .n_in_ptr = 1, .statuses = ST(OK) | ST(ERR_NULL) | ST(ERR_UNIT),
     .predict = predict_unit_parse, .check_ok = ok_unit_parse},
    {CALL(convert), .n_enum = 3,
     .en = {{"analyte", NTR_ERR_ARG, 10, {1, 2, 3, 4, 5, 6, 7, 8, 9, 10}}, UNIT_ENUM("from_unit"),
            UNIT_ENUM("to_unit")},
     .n_num = 1, .num = {{"value", 0.0, 1.0e6, 0}}, .n_out_d = 1,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_UNIT), .base_num = {5.5},
     .base_en = {NTR_ANALYTE_GLUCOSE, NTR_UNIT_MMOL_L, NTR_UNIT_MG_DL},
     .predict = predict_convert, .check_ok = ok_convert},
    {CALL(unit_parse_lenient), .n_enum = 1,
     .en = {{"text", NTR_ERR_UNIT, 12, {0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11}}},
     .n_out_i = 1, .n_in_ptr = 1, .statuses = ST(OK) | ST(ERR_NULL) | ST(ERR_UNIT),
     .predict = predict_unit_parse_lenient, .check_ok = ok_unit_parse_lenient},
    {CALL(loinc_lookup), .n_enum = 1,
     .en = {{"code", NTR_ERR_UNIT, 12, {0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11}}},
     .n_out_i = 3, .n_in_ptr = 1, .statuses = ST(OK) | ST(ERR_NULL) | ST(ERR_UNIT),
     .predict = predict_loinc_lookup, .check_ok = ok_loinc_lookup},
    {CALL(glucose_unit_check), .n_enum = 1,
     .en = {{"unit", NTR_ERR_UNIT, 4,
             {NTR_UNIT_MMOL_L, NTR_UNIT_MG_DL, NTR_UNIT_G_L, NTR_UNIT_UMOL_L}}},
     .n_num = 3, .num = {{"glucose", 0.0, 200.0, 0}, NA, {"measured_osm_mosm_kg", 0.0, 600.0, 0}},
     .n_out_d = 1, .statuses = OK_COMMON | ST(ERR_UNIT), .may_fail = ST(ERR_UNIT),
     .base_num = {8.0, 135.0, 280.0}, .base_en = {NTR_UNIT_MMOL_L},
     .predict = predict_glucose_unit_check, .check_ok = ok_glucose_unit_check},
    /* osmolality */
    {CALL(osm_calculated), .n_enum = 1,
     .en = {{"formula", NTR_ERR_ARG, 2, {NTR_OSM_2NA, NTR_OSM_DORWART_CHALMERS}}}, .n_num = 4,
     .num = {NA, GLU, {"urea_mmol_l", 0.0, 200.0, 0}, {"ethanol_mmol_l", 0.0, 400.0, 0}},
     .n_out_d = 1, .statuses = OK_COMMON | ST(ERR_ARG), .base_num = {120.0, 5.0, 6.0, 0.0},
     .base_en = {NTR_OSM_2NA}, .check_ok = ok_osm_calculated},
    {CALL(osm_effective), .n_num = 2, .num = {NA, GLU}, .n_out_d = 1, .statuses = OK_COMMON,
     .base_num = {120.0, 5.0}, .check_ok = ok_osm_effective},
    {CALL(osm_gap), .n_num = 2, .num = {OSM("measured_mosm_kg"), OSM("calculated_mosm_kg")},
     .n_out_d = 1, .statuses = OK_COMMON, .base_num = {300.0, 290.0}, .check_ok = ok_osm_gap},
    /* sodium */
    {CALL(na_corrected_glucose), .n_enum = 1,
     .en = {{"method", NTR_ERR_ARG, 2, {NTR_GLUCOSE_KATZ, NTR_GLUCOSE_HILLIER}}}, .n_num = 2,
     .num = {NA, GLU}, .n_out_d = 1, .statuses = OK_COMMON | ST(ERR_ARG),
     .base_num = {125.0, 30.0}, .base_en = {NTR_GLUCOSE_KATZ}, .check_ok = ok_na_corrected},
    {CALL(na_corrected_glucose_factor), .n_num = 3,
     .num = {NA, GLU, {"factor_per_100mg_dl", 0.0, 5.0, 0}}, .n_out_d = 1,
     .statuses = OK_COMMON, .base_num = {125.0, 30.0, 2.0}, .check_ok = ok_na_corrected},
    {CALL(na_deficit), .n_num = 3, .num = {TBW, NA, {"target_na_mmol_l", 80.0, 220.0, 0}},
     .n_out_d = 1, .statuses = OK_COMMON | ST(ERR_DOMAIN), .base_num = {30.0, 115.0, 123.0},
     .check_ok = ok_na_deficit},
    /* water */
    {CALL(tbw_fraction), .n_enum = 1, .en = {SEX}, .n_num = 2,
     .num = {{"age_years", 1.0, 130.0, 0}, {"weight_kg", 0.3, 650.0, 0}}, .n_out_d = 1,
     .statuses = OK_COMMON | ST(ERR_ARG), .base_num = {70.0, 60.0},
     .base_en = {NTR_SEX_FEMALE}, .check_ok = ok_tbw_fraction},
    {CALL(tbw_watson), .n_enum = 1, .en = {SEX}, .n_num = 3,
     .num = {{"age_years", 18.0, 130.0, 0}, {"height_cm", 30.0, 275.0, 0},
             {"weight_kg", 0.3, 650.0, 0}},
     .n_out_d = 1, .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_DOMAIN),
     .base_num = {50.0, 175.0, 75.0}, .base_en = {NTR_SEX_MALE}, .check_ok = ok_tbw_watson},
    {CALL(free_water_deficit), .n_num = 2, .num = {TBW, NA}, .n_out_d = 1,
     .statuses = OK_COMMON | ST(ERR_DOMAIN), .base_num = {42.0, 160.0},
     .check_ok = ok_free_water_deficit},
    /* infusion */
    {CALL(fluid_preset), .n_enum = 1, .en = {{"fluid", NTR_ERR_ARG, 7, {1, 2, 3, 4, 5, 6, 7}}},
     .n_out_d = 2, .statuses = ST(OK) | ST(ERR_NULL) | ST(ERR_ARG),
     .base_en = {NTR_FLUID_NACL_3}, .check_ok = ok_fluid_preset},
    {CALL(infusate_change_per_litre), .n_num = 4, .num = {NA, TBW, INF_NA, INF_K},
     .n_out_d = 1, .statuses = OK_COMMON | ST(ERR_DOMAIN), .base_num = {112.0, 30.0, 513.0, 0.0},
     .check_ok = ok_infusate_change_per_litre},
    {CALL(infusate_change), .n_num = 5,
     .num = {NA, TBW, INF_NA, INF_K, {"volume_l", 0.0, 20.0, 0}}, .n_out_d = 1,
     .statuses = OK_COMMON | ST(ERR_DOMAIN), .base_num = {108.0, 30.0, 513.0, 0.0, 0.292},
     .check_ok = ok_infusate_change},
    {CALL(infusate_volume_for_change), .n_num = 5,
     .num = {NA, TBW, INF_NA, INF_K, {"target_delta_mmol_l", -50.0, 50.0, 0}}, .n_out_d = 1,
     .statuses = OK_COMMON | ST(ERR_DOMAIN), .base_num = {108.0, 30.0, 513.0, 0.0, 4.0},
     .check_ok = ok_infusate_volume_for_change},
    /* urine */
    {CALL(furst_ratio), .n_num = 3, .num = {U_NA, U_K, S_NA}, .n_out_d = 1,
     .statuses = OK_COMMON, .base_num = {90.0, 40.0, 125.0}, .check_ok = ok_furst_ratio},
    {CALL(restriction_from_ratio), .n_num = 1, .num = {{"ratio", 0.0, 20.0, 0}}, .n_out_i = 1,
     .statuses = OK_COMMON, .base_num = {0.8}, .check_ok = ok_restriction_from_ratio},
    {CALL(efwc), .n_num = 4, .num = {{"urine_volume_l", 0.0, 30.0, 0}, U_NA, U_K, S_NA},
     .n_out_d = 1, .statuses = OK_COMMON, .base_num = {1.5, 60.0, 30.0, 130.0},
     .check_ok = ok_efwc},
    /* work-up */
    {CALL(na_severity), .n_num = 1, .num = {NA}, .n_out_i = 1, .statuses = OK_COMMON,
     .base_num = {127.0}, .check_ok = ok_na_severity},
    {CALL(tonicity_class), .n_num = 1, .num = {OSM("measured_osm_mosm_kg")}, .n_out_i = 1,
     .statuses = OK_COMMON, .base_num = {260.0}, .check_ok = ok_tonicity_class},
    {CALL(low_na_tonicity), .n_enum = 1,
     .en = {{"glucose_method", NTR_ERR_ARG, 2, {NTR_GLUCOSE_KATZ, NTR_GLUCOSE_HILLIER}}},
     .n_num = 3, .num = {NA, GLU, OSM("measured_osm_mosm_kg")}, .n_out_i = 2,
     .statuses = OK_COMMON | ST(ERR_ARG), .base_num = {126.0, 30.0, 290.0},
     .base_en = {NTR_GLUCOSE_HILLIER}, .check_ok = ok_low_na_tonicity},
    {CALL(effective_osm_measured), .n_num = 5,
     .num = {NA, GLU, {"urea_mmol_l", 0.0, 200.0, 0}, {"ethanol_mmol_l", 0.0, 400.0, 0},
             OSM("measured_osm_mosm_kg")},
     .n_out_d = 1, .statuses = OK_COMMON, .base_num = {125.0, 5.0, 40.0, 0.0, 295.0},
     .check_ok = ok_effective_osm_measured},
    {CALL(low_na_effective_tonicity), .n_enum = 1,
     .en = {{"glucose_method", NTR_ERR_ARG, 2, {NTR_GLUCOSE_KATZ, NTR_GLUCOSE_HILLIER}}},
     .n_num = 5,
     .num = {NA, GLU, {"urea_mmol_l", 0.0, 200.0, 0}, {"ethanol_mmol_l", 0.0, 400.0, 0},
             OSM("measured_osm_mosm_kg")},
     .n_out_i = 2, .statuses = OK_COMMON | ST(ERR_ARG),
     .base_num = {118.0, 5.0, 5.0, 45.0, 295.0}, .base_en = {NTR_GLUCOSE_HILLIER},
     .check_ok = ok_low_na_effective_tonicity},
    {CALL(urine_maximally_dilute), .n_num = 1, .num = {{"urine_osm_mosm_kg", 10.0, 2000.0, 0}},
     .n_out_i = 1, .statuses = OK_COMMON, .base_num = {80.0},
     .check_ok = ok_urine_maximally_dilute},
    {CALL(urine_na_high), .n_num = 1, .num = {U_NA}, .n_out_i = 1, .statuses = OK_COMMON,
     .base_num = {45.0}, .check_ok = ok_urine_na_high},
    {CALL(fractional_excretion), .n_num = 4,
     .num = {{"urine_x", 0.0, 1e6, 0}, {"plasma_x", 0.0, 1e6, 0},
             {"urine_creatinine", 0.0, 1e6, 0}, {"plasma_creatinine", 0.0, 1e6, 0}},
     .n_out_d = 1, .statuses = OK_COMMON | ST(ERR_DOMAIN),
     .base_num = {80.0, 128.0, 9000.0, 70.0}, .check_ok = ok_fractional_excretion},
    {CALL(siad_findings_init), .n_in_ptr = 1, .statuses = ST(OK) | ST(ERR_NULL),
     .check_ok = ok_siad_findings_init},
    {CALL(siad_evaluate), .n_enum = SE_COUNT,
     .en = {SIZE_MODE("findings.struct_size"), SIZE_MODE("result.struct_size"),
            KNOWN("effective_osm.known"), KNOWN("urine_osm.known"), KNOWN("urine_na.known"),
            {"volume_status", NTR_ERR_ARG, 4, {2, 0, 1, 3}}, TRI("normal_salt_water_intake"),
            TRI("thyroid_normal"), TRI("adrenal_normal"), TRI("pituitary_normal"),
            TRI("kidney_normal"), TRI("recent_diuretic"), TRI("saline_corrected"),
            TRI("restriction_corrected"), KNOWN("uric_acid.known"), KNOWN("urea.known"),
            KNOWN("fe_na.known"), KNOWN("fe_urea.known"), KNOWN("fe_uric_acid.known")},
     .n_num = 8,
     .num = {OSM("effective_osm_mosm_kg"), {"urine_osm_mosm_kg", 10.0, 2000.0, 0}, U_NA,
             {"uric_acid_mmol_l", 0.0, 2.0, 0}, {"urea_mmol_l", 0.0, 200.0, 0},
             {"fe_na_percent", 0.0, 200.0, 0}, {"fe_urea_percent", 0.0, 200.0, 0},
             {"fe_uric_acid_percent", 0.0, 200.0, 0}},
     .n_in_ptr = 2, .statuses = OK_COMMON | ST(ERR_ARG),
     .base_num = {260.0, 450.0, 60.0, 0.2, 3.0, 0.8, 60.0, 14.0},
     .base_en = {0, 0, 1, 1, 1, NTR_VOLUME_EUVOLAEMIC, 2, 2, 2, 2, 2, 1, 1, 0, 1, 1, 1, 1, 1},
     .predict = predict_siad, .prepare_out = prepare_siad,
     .results = results_siad, .extra_cases = extra_siad, .check_ok = ok_siad},
    {CALL(fe_uric_acid_class), .n_num = 1, .num = {{"fe_uric_acid_percent", 0.0, 200.0, 0}},
     .n_out_i = 1, .statuses = OK_COMMON, .base_num = {10.0}, .check_ok = ok_fe_uric_acid_class},
    {CALL(fe_uric_acid_after_correction), .n_num = 3,
     .num = {{"fe_low_na_percent", 0.0, 200.0, 0}, {"fe_corrected_percent", 0.0, 200.0, 0}, NA},
     .n_out_i = 1, .statuses = OK_COMMON, .base_num = {16.0, 6.0, 137.0},
     .check_ok = ok_fe_uric_acid_after_correction},
    /* solute */
    {CALL(urine_volume_from_solute), .n_num = 2, .num = {SOLUTE_DAY, U_OSM}, .n_out_d = 1,
     .statuses = OK_COMMON | ST(ERR_DOMAIN), .base_num = {600.0, 600.0},
     .check_ok = ok_urine_volume_from_solute},
    {CALL(fluid_allowance), .n_num = 6, .num = {SOLUTE_DAY, U_OSM, U_NA, U_K, S_NA, INSENSIBLE},
     .n_out_d = 1, .statuses = OK_COMMON | ST(ERR_DOMAIN),
     .base_num = {900.0, 450.0, 60.0, 20.0, 128.0, 0.5}, .check_ok = ok_fluid_allowance},
    {CALL(solute_dose_osmoles), .n_enum = 1, .en = {SOLUTE_KIND}, .n_num = 1,
     .num = {{"grams", 0.0, 200.0, 0}}, .n_out_d = 1, .statuses = OK_COMMON | ST(ERR_ARG),
     .base_num = {30.0}, .base_en = {NTR_SOLUTE_UREA}, .check_ok = ok_solute_dose_osmoles},
    {CALL(fluid_allowance_with_dose), .n_enum = 1, .en = {SOLUTE_KIND}, .n_num = 7,
     .num = {{"grams_day", 0.0, 200.0, 0}, SOLUTE_DAY, U_OSM, U_NA, U_K, S_NA, INSENSIBLE},
     .n_out_d = 1, .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_DOMAIN),
     .base_num = {30.0, 600.0, 600.0, 80.0, 40.0, 120.0, 0.5}, .base_en = {NTR_SOLUTE_UREA},
     .check_ok = ok_fluid_allowance_with_dose},
    {CALL(solute_dose_for_allowance), .n_enum = 1, .en = {SOLUTE_KIND}, .n_num = 7,
     .num = {SOLUTE_DAY, U_OSM, U_NA, U_K, S_NA, INSENSIBLE, TARGET_INTAKE}, .n_out_d = 1,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_DOMAIN),
     .base_num = {600.0, 500.0, 150.0, 60.0, 125.0, 0.4, 1.0}, .base_en = {NTR_SOLUTE_NACL},
     .check_ok = ok_solute_dose_for_allowance},
    {CALL(restriction_outlook), .n_enum = 1, .en = {SIZE_MODE("out.struct_size")}, .n_num = 7,
     .num = {SOLUTE_DAY, U_OSM, U_NA, U_K, S_NA, INSENSIBLE, TARGET_INTAKE}, .n_in_ptr = 1,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_DOMAIN),
     .base_num = {600.0, 500.0, 150.0, 60.0, 125.0, 0.4, 1.0}, .base_en = {0},
     .prepare_out = prepare_outlook, .results = results_outlook,
     .check_ok = ok_restriction_outlook},
    /* input ranges */
    {CALL(input_range), .n_enum = 1,
     .en = {{"kind", NTR_ERR_ARG, 10, {1, 2, 5, 10, 14, 22, 27, 36, 38, 39}}}, .n_out_d = 2,
     .statuses = ST(OK) | ST(ERR_NULL) | ST(ERR_ARG), .base_en = {NTR_INPUT_NA},
     .predict = predict_input_range, .check_ok = ok_input_range},
    /* provenance */
    {CALL(method_info), .n_enum = 1,
     .en = {{"method", NTR_ERR_ARG, 10, {1, 11, 18, 30, 39, 50, 56, 14, 70, 74}}}, .n_in_ptr = 1,
     .statuses = ST(OK) | ST(ERR_NULL) | ST(ERR_ARG), .base_en = {NTR_METHOD_TBW_WATSON},
     .predict = predict_method_info, .check_ok = ok_method_info},
    {CALL(method_next), .n_enum = 1,
     .en = {{"after", NTR_ERR_RANGE, 7, {0, -5, 1, 18, 56, 998, 999}}}, .n_out_i = 1,
     .statuses = ST(OK) | ST(ERR_NULL) | ST(ERR_RANGE), .may_fail = ST(ERR_RANGE),
     .base_en = {0}, .predict = predict_method_next, .check_err = err_method_next,
     .check_ok = ok_method_next},
    /* correction */
    {CALL(limits_preset), .n_enum = 1,
     .en = {{"preset", NTR_ERR_ARG, 2, {NTR_LIMITS_STANDARD, NTR_LIMITS_HIGH_RISK}}},
     .n_in_ptr = 1, .statuses = ST(OK) | ST(ERR_NULL) | ST(ERR_ARG),
     .base_en = {NTR_LIMITS_STANDARD}, .results = results_limits, .check_ok = ok_limits_preset},
    {CALL(ods_risk), .n_enum = 4,
     .en = {TRI("low_potassium"), TRI("alcohol_use_disorder"), TRI("malnutrition"),
            TRI("advanced_liver_disease")},
     .n_num = 1, .num = {{"baseline_na_mmol_l", 80.0, 220.0, 0}}, .n_out_i = 3,
     .statuses = OK_COMMON | ST(ERR_ARG), .base_num = {118.0}, .base_en = {1, 1, 1, 1},
     .check_ok = ok_ods_risk},
    {CALL(correction_assess), .n_num = 3, .num = {LIMITS_NUMS(0)}, .n_in_ptr = 3,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_ORDER), .base_num = {10.0, 18.0, 4.0},
     .predict = predict_correction_assess, .base_series = base_samples,
     .fuzz_series = fuzz_samples, .results = results_correction, .extra_cases = extra_series,
     .check_ok = ok_correction_assess},
    {CALL(watch_init), .n_num = 3, .num = {LIMITS_NUMS(0)}, .n_in_ptr = 2,
     .statuses = OK_COMMON, .base_num = {10.0, 18.0, 4.0}, .predict = predict_watch_init,
     .results = results_watch_init, .check_ok = ok_watch_init},
    {CALL(watch_push), .n_enum = 1, .en = {WATCH_MODE}, .n_num = 2,
     .num = {{"hours", -1e6, 1e6, 0}, NA}, .n_in_ptr = 2,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_ORDER) | ST(ERR_CAPACITY),
     .may_fail = ST(ERR_CAPACITY), .base_num = {20.0, 124.5}, .base_en = {0},
     .predict = predict_watch_push, .base_series = base_watch, .fuzz_series = fuzz_watch,
     .prepare_out = prepare_watch, .mutates_input = 1, .results = results_correction,
     .extra_cases = extra_watch_push,
     .check_ok = ok_watch_push},
    {CALL(watch_result), .n_enum = 1, .en = {WATCH_MODE}, .n_in_ptr = 2,
     .statuses = ST(OK) | ST(ERR_NULL) | ST(ERR_ARG), .base_en = {0},
     .predict = predict_watch_result, .base_series = base_watch, .fuzz_series = fuzz_watch,
     .prepare_out = prepare_watch, .results = results_correction, .extra_cases = extra_watch, .check_ok = ok_watch_result},
    {CALL(course_limits_preset), .n_enum = 1,
     .en = {{"preset", NTR_ERR_ARG, 5, {1, 2, 3, 4, 5}}}, .n_in_ptr = 1,
     .statuses = ST(OK) | ST(ERR_NULL) | ST(ERR_ARG), .base_en = {NTR_COURSE_HYPER_CHRONIC},
     .results = results_course_limits, .check_ok = ok_course_limits_preset},
    {CALL(course_assess), .n_enum = 3, .en = {COURSE_ENUMS}, .n_num = 5, .num = {COURSE_NUMS},
     .n_in_ptr = 3, .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_ORDER),
     .base_num = {10.0, 18.0, 10.0, 0.0, 4.0}, .base_en = {NTR_GOAL_RAISE, 0, 0},
     .predict = predict_course_assess, .base_series = base_samples,
     .fuzz_series = fuzz_samples, .prepare_out = prepare_course,
     .results = results_course_report, .extra_cases = extra_course_series,
     .check_ok = ok_course_assess},
    {CALL(course_watch_init), .n_enum = 2,
     .en = {{"goal", NTR_ERR_ARG, 3, {NTR_GOAL_RAISE, NTR_GOAL_LOWER, NTR_GOAL_HOLD}},
            {"limits_struct_size", NTR_ERR_ARG, 2, {0, 2}}},
     .n_num = 5, .num = {COURSE_NUMS}, .n_in_ptr = 2, .statuses = OK_COMMON | ST(ERR_ARG),
     .base_num = {10.0, 18.0, 10.0, 0.0, 4.0}, .base_en = {NTR_GOAL_RAISE, 0},
     .predict = predict_course_watch_init, .results = results_course_watch_init,
     .check_ok = ok_course_watch_init},
    {CALL(course_watch_push), .n_enum = 2, .en = {COURSE_WATCH_MODES}, .n_num = 2,
     .num = {{"hours", -1e6, 1e6, 0}, NA}, .n_in_ptr = 2,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_ORDER), .base_num = {20.0, 124.5},
     .base_en = {0, 0}, .predict = predict_course_watch_push, .base_series = base_course_watch,
     .fuzz_series = fuzz_course_watch, .prepare_out = prepare_course_watch,
     .mutates_input = 1, .results = results_course_report,
     .extra_cases = extra_course_watch_push, .check_ok = ok_course_watch_push},
    {CALL(course_watch_push_glucose), .n_enum = 3,
     .en = {COURSE_WATCH_MODES,
            {"glucose_method", NTR_ERR_ARG, 2, {NTR_GLUCOSE_KATZ, NTR_GLUCOSE_HILLIER}}},
     .n_num = 3, .num = {{"hours", -1e6, 1e6, 0}, NA, GLU}, .n_in_ptr = 2,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_ORDER), .base_num = {20.0, 124.5, 30.0},
     .base_en = {0, 0, NTR_GLUCOSE_HILLIER}, .predict = predict_course_watch_push_glucose,
     .base_series = base_course_watch, .fuzz_series = fuzz_course_watch,
     .prepare_out = prepare_course_watch, .mutates_input = 1,
     .results = results_course_report, .extra_cases = extra_course_watch_push,
     .check_ok = ok_course_watch_push_glucose},
    {CALL(course_watch_result), .n_enum = 2, .en = {COURSE_WATCH_MODES}, .n_in_ptr = 2,
     .statuses = ST(OK) | ST(ERR_NULL) | ST(ERR_ARG), .base_en = {0, 0},
     .predict = predict_course_watch_result, .base_series = base_course_watch,
     .fuzz_series = fuzz_course_watch, .prepare_out = prepare_course_watch,
     .results = results_course_report, .extra_cases = extra_course_watch,
     .check_ok = ok_course_watch_result},
    /* balance */
    {CALL(balance_predict), .n_num = 2, .num = {NA, TBW}, .n_out_d = 2, .n_in_ptr = 1,
     .statuses = OK_COMMON | ST(ERR_DOMAIN), .base_num = {118.0, 35.0},
     .predict = predict_balance_predict, .base_series = base_flows, .fuzz_series = fuzz_flows,
     .results = results_two, .extra_cases = extra_flows, .check_ok = ok_balance_predict},
    {CALL(balance_course), .n_num = 4,
     .num = {NA, TBW, {"duration_h", 0.0, 720.0, 1}, {"step_h", 1.0 / 60.0, 720.0, 0}},
     .n_in_ptr = 3,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_ORDER) | ST(ERR_CAPACITY) | ST(ERR_DOMAIN),
     .may_fail = ST(ERR_DOMAIN) | ST(ERR_CAPACITY), .base_num = {118.0, 35.0, 24.0, 1.0},
     .predict = predict_balance_course, .base_series = base_course,
     .fuzz_series = fuzz_course, .check_err = err_balance_course, .results = results_course,
     .extra_cases = extra_course, .check_ok = ok_balance_course},
    {CALL(plan_check), .n_num = 6,
     .num = {TBW, {"duration_h", 0.0, 720.0, 1}, {"step_h", 1.0 / 60.0, 720.0, 0},
             LIMITS_NUMS(0)},
     .n_in_ptr = 4,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_ORDER) | ST(ERR_DOMAIN),
     .base_num = {35.0, 24.0, 2.0, 10.0, 18.0, 4.0}, .predict = predict_plan_check,
     .base_series = base_plan, .fuzz_series = fuzz_plan, .results = results_plan,
     .extra_cases = extra_plan, .check_ok = ok_plan_check},
    {CALL(batch_correction_assess), .n_num = 3, .num = {LIMITS_NUMS(0)}, .n_in_ptr = 6,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_ORDER), .base_num = {10.0, 18.0, 4.0},
     .predict = predict_batch_correction, .base_series = base_groups_valid,
     .fuzz_series = fuzz_groups, .check_err = err_batch_correction, .results = results_groups,
     .extra_cases = extra_groups, .check_ok = ok_batch_correction},
    {CALL(course_plan_check), .n_enum = 3,
     .en = {{"goal", NTR_ERR_ARG, 3, {NTR_GOAL_RAISE, NTR_GOAL_LOWER, NTR_GOAL_HOLD}},
            SIZE_MODE("limits_struct_size"), SIZE_MODE("result_struct_size")},
     .n_num = 8,
     .num = {TBW, {"duration_h", 0.0, 720.0, 1}, {"step_h", 1.0 / 60.0, 720.0, 0},
             COURSE_NUMS},
     .n_in_ptr = 4,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_ORDER) | ST(ERR_DOMAIN),
     .base_num = {35.0, 24.0, 2.0, 10.0, 18.0, 10.0, 0.0, 4.0},
     .base_en = {NTR_GOAL_RAISE, 0, 0}, .predict = predict_course_plan_check,
     .base_series = base_course_plan, .fuzz_series = fuzz_plan,
     .prepare_out = prepare_course_plan, .results = results_course_plan,
     .extra_cases = extra_course_plan, .check_ok = ok_course_plan_check},
    {CALL(urine_interval_flow), .n_enum = 1, .en = {{"reserved", NTR_ERR_ARG, 1, {0}}},
     .n_num = 6,
     .num = {{"start_h", 0.0, 720.0, 0}, {"end_h", 0.0, 720.0, 0},
             {"volume_ml", 0.0, 30000.0, 0}, {"na_mmol_l", 0.0, 500.0, 0},
             {"k_mmol_l", 0.0, 300.0, 0}, {"osm_mosm_kg", 10.0, 2000.0, 0}},
     .n_in_ptr = 2, .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_ORDER) | ST(ERR_DOMAIN),
     .base_num = {2.0, 6.0, 1000.0, 40.0, 20.0, 300.0},
     .predict = predict_urine_interval_flow, .results = results_urine_interval_flow,
     .check_ok = ok_urine_interval_flow},
    {CALL(urine_feedback), .n_enum = 3,
     .en = {{"goal", NTR_ERR_ARG, 3, {NTR_GOAL_RAISE, NTR_GOAL_LOWER, NTR_GOAL_HOLD}},
            SIZE_MODE("limits_struct_size"), SIZE_MODE("result_struct_size")},
     .n_num = 8,
     .num = {TBW, {"horizon_h", 0.0, 720.0, 1}, {"step_h", 1.0 / 60.0, 720.0, 0},
             COURSE_NUMS},
     .n_in_ptr = 5,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_ORDER) | ST(ERR_DOMAIN),
     .base_num = {35.0, 6.0, 0.5, 10.0, 18.0, 10.0, 0.0, 4.0},
     .base_en = {NTR_GOAL_RAISE, 0, 0}, .predict = predict_urine_feedback,
     .base_series = base_feedback, .fuzz_series = fuzz_feedback,
     .prepare_out = prepare_feedback, .results = results_urine_feedback,
     .extra_cases = extra_urine_feedback, .check_ok = ok_urine_feedback},
    {CALL(course_fit), .n_enum = 1, .en = {SIZE_MODE("fit_struct_size")},
     .n_num = 1, .num = {{"tbw_guess_l", 0.1, 400.0, 0}}, .n_in_ptr = 3,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_ORDER) | ST(ERR_DOMAIN),
     .base_num = {40.0}, .predict = predict_course_fit, .base_series = base_fit,
     .fuzz_series = fuzz_plan, .prepare_out = prepare_fit, .results = results_course_fit,
     .extra_cases = extra_course_fit, .check_ok = ok_course_fit},
    {CALL(fit_reproject), .n_enum = 4,
     .en = {{"goal", NTR_ERR_ARG, 3, {NTR_GOAL_RAISE, NTR_GOAL_LOWER, NTR_GOAL_HOLD}},
            SIZE_MODE("limits_struct_size"), SIZE_MODE("result_struct_size"),
            SIZE_MODE("fit_struct_size")},
     .n_num = 9,
     .num = {{"fit_tbw_l", 0.1, 400.0, 0}, {"duration_h", 0.0, 720.0, 1},
             {"step_h", 1.0 / 60.0, 720.0, 0}, COURSE_NUMS,
             {"fit_loss_ml_h", -2000.0, 2000.0, 0}},
     .n_in_ptr = 5,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_ORDER) | ST(ERR_DOMAIN),
     .base_num = {35.0, 24.0, 2.0, 10.0, 18.0, 10.0, 0.0, 4.0, 50.0},
     .base_en = {NTR_GOAL_RAISE, 0, 0, 0}, .predict = predict_fit_reproject,
     .base_series = base_plan, .fuzz_series = fuzz_plan,
     .prepare_out = prepare_course_plan, .results = results_course_plan,
     .extra_cases = extra_fit_reproject, .check_ok = ok_fit_reproject},
    {CALL(batch_course_assess), .n_enum = 3,
     .en = {COURSE_ENUMS}, .n_num = 5, .num = {COURSE_NUMS}, .n_in_ptr = 6,
     .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_ORDER),
     .base_num = {10.0, 18.0, 10.0, 0.0, 4.0}, .base_en = {NTR_GOAL_RAISE, 0, 0},
     .predict = predict_batch_course, .base_series = base_groups_valid,
     .fuzz_series = fuzz_groups, .check_err = err_batch_course,
     .results = results_course_groups, .extra_cases = extra_course_groups,
     .check_ok = ok_batch_course},
    {CALL(relower_estimate), .n_num = 9,
     .num = {NA, TBW, {"fluid_na_mmol_l", 0.0, 1100.0, 0}, {"fluid_k_mmol_l", 0.0, 400.0, 0},
             {"lower_by_mmol_l", 0.0, 50.0, 1}, {"hours", 1.0 / 60.0, 720.0, 0},
             {"urine_ml_h", 0.0, 5000.0, 0}, U_NA, U_K},
     .n_out_d = 2, .statuses = OK_COMMON | ST(ERR_DOMAIN),
     .base_num = {131.0, 35.0, 0.0, 0.0, 3.0, 6.0, 100.0, 40.0, 20.0},
     .results = results_two, .check_ok = ok_relower_estimate},
    /* therapy */
    {CALL(loop_diuretic), .n_num = 6,
     .num = {NA, TBW, {"urine_l", 0.0, 30.0, 0}, {"urine_na_k_mmol_l", 0.0, 500.0, 0},
             {"replace_l", 0.0, 20.0, 0}, {"replace_na_mmol_l", 0.0, 1100.0, 0}},
     .n_out_d = 2, .statuses = OK_COMMON | ST(ERR_DOMAIN),
     .base_num = {120.0, 40.0, 2.0, 75.0, 1.0, 154.0}, .results = results_two,
     .check_ok = ok_loop_diuretic},
    {CALL(dda_clamp), .n_num = 7,
     .num = {NA, TBW, {"saline_ml_h", 0.0, 5000.0, 0}, {"saline_na_mmol_l", 0.0, 1100.0, 0},
             {"urine_ml_h", 0.0, 5000.0, 0}, {"urine_na_k_mmol_l", 0.0, 500.0, 0},
             {"stop_rise_mmol_l", 0.0, 50.0, 1}},
     .n_out_d = 2, .statuses = OK_COMMON | ST(ERR_DOMAIN),
     .base_num = {115.0, 40.0, 30.0, 513.0, 30.0, 100.0, 6.0}, .results = results_two,
     .check_ok = ok_dda_clamp},
    {CALL(dda_relower), .n_num = 7,
     .num = {NA, TBW, {"excess_mmol_l", 0.0, 50.0, 0}, {"margin_mmol_l", 0.0, 10.0, 0},
             {"hours", 1.0 / 60.0, 720.0, 0}, {"urine_ml_h", 0.0, 5000.0, 0},
             {"urine_na_k_mmol_l", 0.0, 500.0, 0}},
     .n_out_d = 2, .statuses = OK_COMMON | ST(ERR_DOMAIN),
     .base_num = {131.0, 35.0, 3.0, 1.0, 6.0, 100.0, 60.0}, .results = results_two,
     .check_ok = ok_dda_relower},
    {CALL(vaptan_watch_preset), .n_enum = 3,
     .en = {{"high_risk", NTR_ERR_ARG, 2, {0, 1}}, {"liver_disease", NTR_ERR_ARG, 2, {0, 1}},
            SIZE_MODE("result_struct_size")},
     .n_in_ptr = 1, .statuses = ST(OK) | ST(ERR_NULL) | ST(ERR_ARG), .base_en = {0, 1, 0},
     .prepare_out = prepare_vaptan, .results = results_vaptan,
     .check_ok = ok_vaptan_watch_preset},
    {CALL(hyper_lower_plan), .n_enum = 2,
     .en = {{"fluid", NTR_ERR_ARG, 7, {1, 2, 3, 4, 5, 6, 7}},
            {"limits_preset", NTR_ERR_ARG, 2, {NTR_COURSE_HYPER_CHRONIC, NTR_COURSE_HYPER_ACUTE}}},
     .n_num = 7,
     .num = {NA, TBW, {"fall_mmol_l", 0.0, 50.0, 1}, {"hours", 1.0 / 60.0, 720.0, 0},
             {"urine_ml_h", 0.0, 5000.0, 0}, {"urine_na_k_mmol_l", 0.0, 500.0, 0},
             {"insensible_ml_h", 0.0, 500.0, 0}},
     .n_out_d = 3, .statuses = OK_COMMON | ST(ERR_ARG) | ST(ERR_DOMAIN),
     .base_num = {160.0, 40.0, 10.0, 24.0, 50.0, 40.0, 40.0},
     .base_en = {NTR_FLUID_DEXTROSE_5, NTR_COURSE_HYPER_CHRONIC},
     .check_ok = ok_hyper_lower_plan},
    {CALL(bolus_plan), .n_num = 4,
     .num = {NA, TBW, {"aim_rise_mmol_l", 0.0, 50.0, 1}, {"max_rise_mmol_l", 0.0, 50.0, 1}},
     .n_out_d = 1, .n_out_i = 2, .statuses = OK_COMMON | ST(ERR_DOMAIN),
     .base_num = {118.0, 30.0, 5.0, 10.0}, .check_ok = ok_bolus_plan},
};

const size_t ntrc_n_functions = sizeof ntrc_functions / sizeof ntrc_functions[0];

const char *const ntrc_statusless[] = {
    "ntr_status_message",
    "ntr_version_string",
    "ntr_version_number",
};

const size_t ntrc_n_statusless = sizeof ntrc_statusless / sizeof ntrc_statusless[0];

const ntrc_fn *ntrc_find(const char *name)
{
    size_t i;
    for (i = 0; i < ntrc_n_functions; i++) {
        if (strcmp(ntrc_functions[i].name, name) == 0) {
            return &ntrc_functions[i];
        }
    }
    return NULL;
}

/* ---- the model ------------------------------------------------------------------ */

void ntrc_baseline(const ntrc_fn *f, ntrc_case *c)
{
    memset(c, 0, sizeof *c);
    memcpy(c->num, f->base_num, sizeof c->num);
    memcpy(c->en, f->base_en, sizeof c->en);
    if (f->base_series != NULL) {
        f->base_series(c);
    }
    ntrc_fill_sentinel(c);
}

int ntrc_enum_is_valid(const ntrc_fn *f, int i, int value)
{
    int k;
    for (k = 0; k < f->en[i].n_valid; k++) {
        if (f->en[i].valid[k] == value) {
            return 1;
        }
    }
    return 0;
}

static int number_status(const ntrc_num *spec, double x)
{
    if (!isfinite(x)) {
        return NTR_ERR_NONFINITE;
    }
    if (x < spec->lo || x > spec->hi || (spec->lo_open && x == spec->lo)) {
        return NTR_ERR_RANGE;
    }
    return NTR_OK;
}

int ntrc_predict(const ntrc_fn *f, const ntrc_case *c)
{
    int i;
    if (f->predict != NULL) {
        int st = f->predict(f, c);
        if (st >= 0) {
            return st;
        }
    } else {
        if (c->out_null != 0u) {
            return NTR_ERR_NULL;
        }
        for (i = 0; i < f->n_enum; i++) {
            if (!ntrc_enum_is_valid(f, i, c->en[i])) {
                return f->en[i].error;
            }
        }
    }
    for (i = 0; i < f->n_num; i++) {
        int st = number_status(&f->num[i], c->num[i]);
        if (st != NTR_OK) {
            return st;
        }
    }
    return NTR_OK;
}

static int all_outputs_written(const ntrc_fn *f, const ntrc_case *c, const ntrc_outs *before)
{
    int i;
    for (i = 0; i < f->n_out_d; i++) {
        if (memcmp(&c->out.d[i], &before->d[i], sizeof c->out.d[i]) == 0) {
            return 0;
        }
    }
    for (i = 0; i < f->n_out_i; i++) {
        if (c->out.i[i] == before->i[i]) {
            return 0;
        }
    }
    return 1;
}

static int finite_outputs(const ntrc_fn *f, const ntrc_case *c)
{
    int i;
    for (i = 0; i < f->n_out_d; i++) {
        if (!isfinite(c->out.d[i])) {
            return 0;
        }
    }
    return 1;
}

/* Opt-in (NTR_CHECK_FP_FLAGS set in the environment): the call must not
 * raise the invalid, divide-by-zero or overflow flags of the floating-point
 * environment, whatever its inputs, so that a target running with those
 * exceptions trapped gets a status instead of a trap. The header does not
 * promise this; docs/reliability.md lists where it does not hold yet. */
#if defined(FE_INVALID) && defined(FE_DIVBYZERO) && defined(FE_OVERFLOW)
#define NTRC_FP_FLAGS (FE_INVALID | FE_DIVBYZERO | FE_OVERFLOW)
#else
#define NTRC_FP_FLAGS 0 /* no flags to test (soft-float C libraries) */
#endif

static int fp_flags_checked(void)
{
    return getenv("NTR_CHECK_FP_FLAGS") != NULL ? NTRC_FP_FLAGS : 0;
}

static const char *fp_flag_message(int raised)
{
#if NTRC_FP_FLAGS != 0
    if (raised & FE_INVALID) {
        return "raised the invalid-operation flag";
    }
    if (raised & FE_DIVBYZERO) {
        return "raised the divide-by-zero flag";
    }
#endif
    (void)raised;
    return "raised the overflow flag";
}

/* The input half of a case: everything before the outputs. */
#define INPUT_BYTES offsetof(ntrc_case, out)

const char *ntrc_run_and_judge(const ntrc_fn *f, ntrc_case *c, int *status)
{
    static ntrc_case before; /* large: kept off the stack (tests are single-threaded) */
    int want = ntrc_predict(f, c);
    unsigned int allowed_when_valid = BIT(NTR_OK) | (f->may_fail ? f->may_fail : ST(ERR_DOMAIN));
    int got;
    int raised;
    int fp_flags = fp_flags_checked();
    ntrc_fill_sentinel(c);
    if (f->prepare_out != NULL) {
        f->prepare_out(c);
    }
    memcpy(&before, c, sizeof before);
    if (fp_flags != 0) {
        feclearexcept(fp_flags);
    }
    got = f->call(c);
    raised = fp_flags != 0 ? fetestexcept(fp_flags) : 0;
    *status = got;
    if (raised != 0) {
        return fp_flag_message(raised);
    }
    if (got < NTR_OK || got > NTR_ERR_ARG) {
        return "status is not a defined code";
    }
    if ((f->statuses & BIT(got)) == 0u) {
        return "status is not among the documented ones";
    }
    if (want != NTR_OK && got != want) {
        return "status differs from the documented checking order";
    }
    if (want == NTR_OK && (allowed_when_valid & BIT(got)) == 0u) {
        return "valid inputs rejected";
    }
    if ((got != NTR_OK || !f->mutates_input) && memcmp(c, &before, INPUT_BYTES) != 0) {
        return "an input was modified";
    }
    if (got != NTR_OK) {
        if (f->check_err != NULL) {
            return f->check_err(c, &before.out, got);
        }
        return memcmp(&c->out, &before.out, sizeof c->out) == 0 ? NULL
                                                                 : "an output was written on error";
    }
    if (!all_outputs_written(f, c, &before.out)) {
        return "success without writing every output";
    }
    if (!finite_outputs(f, c)) {
        return "success with a non-finite output";
    }
    return f->check_ok != NULL ? f->check_ok(c) : NULL;
}

/* ---- batch entry points ------------------------------------------------------------ */

#define COL(b, k) (((b)->null_mask & (1u << (k))) ? NULL : (b)->col[k])
#define BOUT(b) (((b)->null_mask & (1u << 9)) ? NULL : (b)->in_place ? (b)->col[(b)->in_place - 1] : (b)->out)
#define BSTATUS(b) (((b)->null_mask & (1u << 10)) ? NULL : (b)->status)
#define BFAILED(b) (((b)->null_mask & (1u << 11)) ? NULL : &(b)->failed)
#define BROWEN(b) (((b)->null_mask & (1u << 8)) ? NULL : (b)->row_en)

static int b_osm_calculated(ntrc_batch_case *b)
{
    return ntr_batch_osm_calculated(b->n, COL(b, 0), COL(b, 1), COL(b, 2), COL(b, 3), b->call_en,
                                    BOUT(b), BSTATUS(b), BFAILED(b));
}
static int b_osm_effective(ntrc_batch_case *b)
{
    return ntr_batch_osm_effective(b->n, COL(b, 0), COL(b, 1), BOUT(b), BSTATUS(b), BFAILED(b));
}
static int b_osm_gap(ntrc_batch_case *b)
{
    return ntr_batch_osm_gap(b->n, COL(b, 0), COL(b, 1), BOUT(b), BSTATUS(b), BFAILED(b));
}
static int b_na_corrected_glucose(ntrc_batch_case *b)
{
    return ntr_batch_na_corrected_glucose(b->n, COL(b, 0), COL(b, 1), b->call_en, BOUT(b),
                                          BSTATUS(b), BFAILED(b));
}
static int b_tbw_fraction(ntrc_batch_case *b)
{
    return ntr_batch_tbw_fraction(b->n, BROWEN(b), COL(b, 0), COL(b, 1), BOUT(b), BSTATUS(b),
                                  BFAILED(b));
}
static int b_tbw_watson(ntrc_batch_case *b)
{
    return ntr_batch_tbw_watson(b->n, BROWEN(b), COL(b, 0), COL(b, 1), COL(b, 2), BOUT(b),
                                BSTATUS(b), BFAILED(b));
}
static int b_free_water_deficit(ntrc_batch_case *b)
{
    return ntr_batch_free_water_deficit(b->n, COL(b, 0), COL(b, 1), BOUT(b), BSTATUS(b),
                                        BFAILED(b));
}
static int b_na_deficit(ntrc_batch_case *b)
{
    return ntr_batch_na_deficit(b->n, COL(b, 0), COL(b, 1), COL(b, 2), BOUT(b), BSTATUS(b),
                                BFAILED(b));
}
static int b_infusate_change_per_litre(ntrc_batch_case *b)
{
    return ntr_batch_infusate_change_per_litre(b->n, COL(b, 0), COL(b, 1), COL(b, 2), COL(b, 3),
                                               BOUT(b), BSTATUS(b), BFAILED(b));
}
static int b_infusate_change(ntrc_batch_case *b)
{
    return ntr_batch_infusate_change(b->n, COL(b, 0), COL(b, 1), COL(b, 2), COL(b, 3), COL(b, 4),
                                     BOUT(b), BSTATUS(b), BFAILED(b));
}
static int b_infusate_volume_for_change(ntrc_batch_case *b)
{
    return ntr_batch_infusate_volume_for_change(b->n, COL(b, 0), COL(b, 1), COL(b, 2), COL(b, 3),
                                                COL(b, 4), BOUT(b), BSTATUS(b), BFAILED(b));
}
static int b_furst_ratio(ntrc_batch_case *b)
{
    return ntr_batch_furst_ratio(b->n, COL(b, 0), COL(b, 1), COL(b, 2), BOUT(b), BSTATUS(b),
                                 BFAILED(b));
}
static int b_restriction_from_ratio(ntrc_batch_case *b)
{
    return ntr_batch_restriction_from_ratio(b->n, COL(b, 0),
                                            ((b)->null_mask & (1u << 9)) ? NULL : b->out_i,
                                            BSTATUS(b), BFAILED(b));
}
static int b_efwc(ntrc_batch_case *b)
{
    return ntr_batch_efwc(b->n, COL(b, 0), COL(b, 1), COL(b, 2), COL(b, 3), BOUT(b), BSTATUS(b),
                          BFAILED(b));
}

#define BATCH(fn, cols, row_en, call_en, int_out) \
    {"ntr_batch_" #fn, "ntr_" #fn, cols, row_en, call_en, int_out, b_##fn}

const ntrc_batch_fn ntrc_batch_functions[] = {
    BATCH(osm_calculated, 4, 0, 1, 0),
    BATCH(osm_effective, 2, 0, 0, 0),
    BATCH(osm_gap, 2, 0, 0, 0),
    BATCH(na_corrected_glucose, 2, 0, 1, 0),
    BATCH(tbw_fraction, 2, 1, 0, 0),
    BATCH(tbw_watson, 3, 1, 0, 0),
    BATCH(free_water_deficit, 2, 0, 0, 0),
    BATCH(na_deficit, 3, 0, 0, 0),
    BATCH(infusate_change_per_litre, 4, 0, 0, 0),
    BATCH(infusate_change, 5, 0, 0, 0),
    BATCH(infusate_volume_for_change, 5, 0, 0, 0),
    BATCH(furst_ratio, 3, 0, 0, 0),
    BATCH(restriction_from_ratio, 1, 0, 0, 1),
    BATCH(efwc, 4, 0, 0, 0),
};

const size_t ntrc_n_batch_functions = sizeof ntrc_batch_functions / sizeof ntrc_batch_functions[0];

const char *ntrc_batch_run_and_judge(const ntrc_batch_fn *bf, ntrc_batch_case *b, int *status)
{
    static ntrc_batch_case before;
    const ntrc_fn *f = ntrc_find(bf->scalar);
    int want_call = NTR_OK;
    int want_rows[NTRC_MAX_ROWS];
    double want_out[NTRC_MAX_ROWS];
    int want_iout[NTRC_MAX_ROWS];
    size_t want_failed = 0;
    int first_fail = NTR_OK;
    size_t i;
    int k;
    int got;
    unsigned int required = (1u << 9) | (1u << 10);
    if (f == NULL || b->n > NTRC_MAX_ROWS) {
        return "no scalar entry for this batch function";
    }
    for (k = 0; k < bf->n_cols; k++) {
        required |= 1u << k;
    }
    if (bf->row_enum) {
        required |= 1u << 8;
    }
    /* Call-level checks: NULL (even for n = 0), then the single enumerator. */
    if ((b->null_mask & required) != 0u) {
        want_call = NTR_ERR_NULL;
    } else if (bf->call_enum && !ntrc_enum_is_valid(f, 0, b->call_en)) {
        want_call = f->en[0].error;
    }
    /* Each row through the scalar function, from the inputs as they are
     * now (in-place calls overwrite a column). */
    for (i = 0; i < b->n; i++) {
        ntrc_case c;
        int st;
        memset(&c, 0, sizeof c);
        for (k = 0; k < bf->n_cols; k++) {
            c.num[k] = b->col[k][i];
        }
        c.en[0] = bf->row_enum ? b->row_en[i] : b->call_en;
        ntrc_fill_sentinel(&c);
        st = f->call(&c);
        want_rows[i] = st;
        want_out[i] = c.out.d[0];
        want_iout[i] = st == NTR_OK ? c.out.i[0] : 0;
        if (st != NTR_OK) {
            want_failed++;
            if (first_fail == NTR_OK) {
                first_fail = st;
            }
        }
    }
    memset(b->out, SENTINEL_BYTE, sizeof b->out);
    memset(b->out_i, SENTINEL_BYTE, sizeof b->out_i);
    memset(b->status, SENTINEL_BYTE, sizeof b->status);
    memset(&b->failed, SENTINEL_BYTE, sizeof b->failed);
    before = *b;
    got = bf->call(b);
    *status = got;
    if (want_call != NTR_OK) {
        if (got != want_call) {
            return "call-level status differs from the documented order";
        }
        return memcmp(b, &before, sizeof *b) == 0 ? NULL : "something was written on a call-level error";
    }
    if (got != first_fail) {
        return "return value is not the status of the first failing row";
    }
    if (!(b->null_mask & (1u << 11)) && b->failed != want_failed) {
        return "failed count wrong";
    }
    for (i = 0; i < NTRC_MAX_ROWS; i++) {
        const double *out = b->in_place ? b->col[b->in_place - 1] : b->out;
        if (i >= b->n) {
            /* Rows past n: nothing written. */
            if (b->status[i] != before.status[i] ||
                memcmp(&out[i], b->in_place ? &before.col[b->in_place - 1][i] : &before.out[i],
                       sizeof out[i]) != 0 ||
                b->out_i[i] != before.out_i[i]) {
                return "a row past n was written";
            }
            continue;
        }
        if (b->status[i] != want_rows[i]) {
            return "row status differs from the scalar function";
        }
        if (bf->int_out) {
            if (b->out_i[i] != want_iout[i]) {
                return "row advice differs from the scalar function (0 on failure)";
            }
        } else if (want_rows[i] == NTR_OK) {
            if (memcmp(&out[i], &want_out[i], sizeof out[i]) != 0) {
                return "row result differs (bits) from the scalar function";
            }
        } else if (!isnan(out[i])) {
            return "failed row not set to NaN";
        }
    }
    for (k = 0; k < bf->n_cols; k++) {
        if (b->in_place == k + 1) {
            continue;
        }
        if (memcmp(b->col[k], before.col[k], sizeof b->col[k]) != 0) {
            return "an input column was modified";
        }
    }
    return NULL;
}
