/* The contract table: see ntr_contract.h. Bounds below come from each
 * function's documented equation evaluated at the ends of its documented
 * input ranges (the header's Doxygen blocks); they are deliberately loose
 * enough to be obviously right and tight enough to catch a result that is
 * off by orders of magnitude, of the wrong sign, or not finite. */
#include "ntr_contract.h"

#include <math.h>
#include <stdint.h>
#include <string.h>

#include "natremia.h"

#define BIT(s) (1u << (s))
#define COMMON_ERR (BIT(NTR_ERR_NULL) | BIT(NTR_ERR_NONFINITE) | BIT(NTR_ERR_RANGE))

/* Output pointer i, or NULL when the case asks for NULL there. */
static double *od(ntrc_case *c, int i)
{
    return (c->out_null & NTRC_NULL_D(i)) ? NULL : &c->out_d[i];
}

static int *oi(ntrc_case *c, int j)
{
    return (c->out_null & NTRC_NULL_I(j)) ? NULL : &c->out_i[j];
}

static int in_null(const ntrc_case *c, int k)
{
    return (c->out_null & NTRC_NULL_IN(k)) != 0u;
}

/* A sentinel no function computes: a NaN with a recognisable payload. */
static const uint64_t SENTINEL_D = 0x7ff5a5a5deadbeefull;
#define SENTINEL_I ((int)0x5a5a5a5a)

void ntrc_fill_sentinel(ntrc_case *c)
{
    int i;
    for (i = 0; i < NTRC_MAX_OUT_D; i++) {
        memcpy(&c->out_d[i], &SENTINEL_D, sizeof c->out_d[i]);
    }
    for (i = 0; i < NTRC_MAX_OUT_I; i++) {
        c->out_i[i] = SENTINEL_I;
    }
    for (i = 0; i < NTRC_MAX_SERIES; i++) {
        memcpy(&c->buf[i], &SENTINEL_D, sizeof c->buf[i]);
    }
}

static int is_sentinel_d(const double *x)
{
    uint64_t bits;
    memcpy(&bits, x, sizeof bits);
    return bits == SENTINEL_D;
}

int ntrc_outputs_untouched(const ntrc_case *c)
{
    int i;
    for (i = 0; i < NTRC_MAX_OUT_D; i++) {
        if (!is_sentinel_d(&c->out_d[i])) {
            return 0;
        }
    }
    for (i = 0; i < NTRC_MAX_OUT_I; i++) {
        if (c->out_i[i] != SENTINEL_I) {
            return 0;
        }
    }
    for (i = 0; i < NTRC_MAX_SERIES; i++) {
        if (!is_sentinel_d(&c->buf[i])) {
            return 0;
        }
    }
    return 1;
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
    return c->out_i[0] == c->en[0] + 1 ? NULL : "parsed to the wrong unit";
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
    };
    if (analyte < 1 || analyte > 8 || unit < 1 || unit > 30) {
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
    if (c->en[0] < 1 || c->en[0] > 8) {
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
    if (!within(c->out_d[0], 0.0, c->num[0] * 1.0e6)) {
        return "converted value not finite, negative or implausibly large";
    }
    if (ntr_convert(c->en[0], c->out_d[0], c->en[2], c->en[1], &back) == NTR_OK &&
        !close_to(back, c->num[0], 1e-12)) {
        return "conversion does not round-trip";
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
    if (!within(c->out_d[0], 1.86 * 80.0 + 9.0, 2.0 * 220.0 + 200.0 + 200.0 + 400.0)) {
        return "osmolality outside [157.8, 1240]";
    }
    return close_to(c->out_d[0], expect, 1e-14) ? NULL : "osmolality off its equation";
}

static int call_osm_effective(ntrc_case *c)
{
    return ntr_osm_effective(c->num[0], c->num[1], od(c, 0));
}

static const char *ok_osm_effective(const ntrc_case *c)
{
    if (!within(c->out_d[0], 160.0, 640.0)) {
        return "effective osmolality outside [160, 640]";
    }
    return close_to(c->out_d[0], 2.0 * c->num[0] + c->num[1], 1e-14) ? NULL
                                                                    : "off 2Na + glucose";
}

static int call_osm_gap(ntrc_case *c)
{
    return ntr_osm_gap(c->num[0], c->num[1], od(c, 0));
}

static const char *ok_osm_gap(const ntrc_case *c)
{
    return within(c->out_d[0], -450.0, 450.0) ? NULL : "gap outside [-450, 450]";
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
    return within(c->out_d[0], c->num[0], c->num[0] + MAX_GLUCOSE_SHIFT)
               ? NULL
               : "corrected sodium below measured or implausibly high";
}

static int call_na_deficit(ntrc_case *c)
{
    return ntr_na_deficit(c->num[0], c->num[1], c->num[2], od(c, 0));
}

static const char *ok_na_deficit(const ntrc_case *c)
{
    return within(c->out_d[0], 0.0, 400.0 * 140.0) ? NULL : "deficit outside [0, 56000] mmol";
}

/* ---- water ----------------------------------------------------------------- */

static int call_tbw_fraction(ntrc_case *c)
{
    return ntr_tbw_fraction(c->en[0], c->num[0], c->num[1], od(c, 0));
}

static const char *ok_tbw_fraction(const ntrc_case *c)
{
    return within(c->out_d[0], 0.45 * c->num[1], 0.6 * c->num[1]) ? NULL
                                                                  : "TBW not 45-60% of weight";
}

static int call_tbw_watson(ntrc_case *c)
{
    return ntr_tbw_watson(c->en[0], c->num[0], c->num[1], c->num[2], od(c, 0));
}

static const char *ok_tbw_watson(const ntrc_case *c)
{
    /* Positive, and below the male equation at the youngest adult age and
     * the largest height and weight. */
    double most = 2.447 - 0.09516 * 18.0 + 0.1074 * 275.0 + 0.3362 * 650.0;
    return (c->out_d[0] > 0.0 && within(c->out_d[0], 0.0, most)) ? NULL
                                                                 : "Watson TBW outside (0, 250]";
}

static int call_free_water_deficit(ntrc_case *c)
{
    return ntr_free_water_deficit(c->num[0], c->num[1], od(c, 0));
}

static const char *ok_free_water_deficit(const ntrc_case *c)
{
    return within(c->out_d[0], 0.0, 400.0 * (220.0 / 140.0 - 1.0)) ? NULL
                                                                    : "water deficit outside [0, 229] L";
}

/* ---- infusion ----------------------------------------------------------------- */

static int call_fluid_preset(ntrc_case *c)
{
    return ntr_fluid_preset(c->en[0], od(c, 0), od(c, 1));
}

static const char *ok_fluid_preset(const ntrc_case *c)
{
    return (within(c->out_d[0], 0.0, 1100.0) && within(c->out_d[1], 0.0, 400.0))
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
    return delta_between(c->out_d[0], gap) ? NULL
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
    return delta_between(c->out_d[0], gap) ? NULL
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
    if (!within(c->out_d[0], 0.0, 20.0)) {
        return "volume outside [0, 20] L";
    }
    /* Round trip through the forward mass balance. */
    if (ntr_infusate_change(c->num[0], c->num[1], c->num[2], c->num[3], c->out_d[0],
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
    return within(c->out_d[0], 0.0, 800.0 / 80.0) ? NULL : "ratio outside [0, 10]";
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
    return c->out_i[0] == want ? NULL : "advice does not match its band";
}

static int call_efwc(ntrc_case *c)
{
    return ntr_efwc(c->num[0], c->num[1], c->num[2], c->num[3], od(c, 0));
}

static const char *ok_efwc(const ntrc_case *c)
{
    /* V * (1 - ratio) with ratio in [0, 10] and V in [0, 30]. */
    return within(c->out_d[0], -9.0 * c->num[0], c->num[0]) ? NULL
                                                            : "EFWC outside [-9V, V]";
}

/* ---- the table --------------------------------------------------------------- */

#define NA {"na_mmol_l", 80.0, 220.0}
#define TBW {"tbw_l", 0.1, 400.0}
#define GLU {"glucose_mmol_l", 0.0, 200.0}
#define INF_NA {"infusate_na_mmol_l", 0.0, 1100.0}
#define INF_K {"infusate_k_mmol_l", 0.0, 400.0}
#define U_NA {"urine_na_mmol_l", 0.0, 500.0}
#define U_K {"urine_k_mmol_l", 0.0, 300.0}
#define SEX {"sex", NTR_ERR_ARG, 2, {NTR_SEX_MALE, NTR_SEX_FEMALE}}
#define UNIT_ENUM(nm) {nm, NTR_ERR_UNIT, 6, {1, 2, 3, 4, 5, 6}}

const ntrc_fn ntrc_functions[] = {
    {"ntr_unit_parse", 1, {{"ucum", NTR_ERR_UNIT, 6, {0, 1, 2, 3, 4, 5}}}, 0, {{0}},
     0, 1, 1, BIT(NTR_OK) | BIT(NTR_ERR_NULL) | BIT(NTR_ERR_UNIT),
     {0}, {0}, call_unit_parse, predict_unit_parse, NULL, ok_unit_parse},
    {"ntr_convert", 3,
     {{"analyte", NTR_ERR_ARG, 8, {1, 2, 3, 4, 5, 6, 7, 8}}, UNIT_ENUM("from_unit"),
      UNIT_ENUM("to_unit")},
     1, {{"value", 0.0, 1.0e6}}, 1, 0, 0,
     BIT(NTR_OK) | COMMON_ERR | BIT(NTR_ERR_ARG) | BIT(NTR_ERR_UNIT),
     {5.5}, {NTR_ANALYTE_GLUCOSE, NTR_UNIT_MMOL_L, NTR_UNIT_MG_DL},
     call_convert, predict_convert, NULL, ok_convert},
    {"ntr_osm_calculated", 1, {{"formula", NTR_ERR_ARG, 2, {NTR_OSM_2NA, NTR_OSM_DORWART_CHALMERS}}},
     4, {NA, GLU, {"urea_mmol_l", 0.0, 200.0}, {"ethanol_mmol_l", 0.0, 400.0}}, 1, 0, 0,
     BIT(NTR_OK) | COMMON_ERR | BIT(NTR_ERR_ARG),
     {120.0, 5.0, 6.0, 0.0}, {NTR_OSM_2NA}, call_osm_calculated, NULL, NULL, ok_osm_calculated},
    {"ntr_osm_effective", 0, {{0}}, 2, {NA, GLU}, 1, 0, 0, BIT(NTR_OK) | COMMON_ERR,
     {120.0, 5.0}, {0}, call_osm_effective, NULL, NULL, ok_osm_effective},
    {"ntr_osm_gap", 0, {{0}}, 2,
     {{"measured_mosm_kg", 150.0, 600.0}, {"calculated_mosm_kg", 150.0, 600.0}}, 1, 0, 0,
     BIT(NTR_OK) | COMMON_ERR, {300.0, 290.0}, {0}, call_osm_gap, NULL, NULL, ok_osm_gap},
    {"ntr_na_corrected_glucose", 1,
     {{"method", NTR_ERR_ARG, 2, {NTR_GLUCOSE_KATZ, NTR_GLUCOSE_HILLIER}}}, 2, {NA, GLU}, 1, 0, 0,
     BIT(NTR_OK) | COMMON_ERR | BIT(NTR_ERR_ARG), {125.0, 30.0}, {NTR_GLUCOSE_KATZ},
     call_na_corrected_glucose, NULL, NULL, ok_na_corrected},
    {"ntr_na_corrected_glucose_factor", 0, {{0}}, 3,
     {NA, GLU, {"factor_per_100mg_dl", 0.0, 5.0}}, 1, 0, 0, BIT(NTR_OK) | COMMON_ERR,
     {125.0, 30.0, 2.0}, {0}, call_na_corrected_glucose_factor, NULL, NULL, ok_na_corrected},
    {"ntr_na_deficit", 0, {{0}}, 3, {TBW, NA, {"target_na_mmol_l", 80.0, 220.0}}, 1, 0, 0,
     BIT(NTR_OK) | COMMON_ERR | BIT(NTR_ERR_DOMAIN), {30.0, 115.0, 123.0}, {0},
     call_na_deficit, NULL, NULL, ok_na_deficit},
    {"ntr_tbw_fraction", 1, {SEX}, 2, {{"age_years", 0.0, 130.0}, {"weight_kg", 0.3, 650.0}},
     1, 0, 0, BIT(NTR_OK) | COMMON_ERR | BIT(NTR_ERR_ARG), {70.0, 60.0}, {NTR_SEX_FEMALE},
     call_tbw_fraction, NULL, NULL, ok_tbw_fraction},
    {"ntr_tbw_watson", 1, {SEX}, 3,
     {{"age_years", 18.0, 130.0}, {"height_cm", 30.0, 275.0}, {"weight_kg", 0.3, 650.0}},
     1, 0, 0, BIT(NTR_OK) | COMMON_ERR | BIT(NTR_ERR_ARG) | BIT(NTR_ERR_DOMAIN),
     {50.0, 175.0, 75.0}, {NTR_SEX_MALE}, call_tbw_watson, NULL, NULL, ok_tbw_watson},
    {"ntr_free_water_deficit", 0, {{0}}, 2, {TBW, NA}, 1, 0, 0,
     BIT(NTR_OK) | COMMON_ERR | BIT(NTR_ERR_DOMAIN), {42.0, 160.0}, {0},
     call_free_water_deficit, NULL, NULL, ok_free_water_deficit},
    {"ntr_fluid_preset", 1, {{"fluid", NTR_ERR_ARG, 7, {1, 2, 3, 4, 5, 6, 7}}}, 0, {{0}}, 2, 0, 0,
     BIT(NTR_OK) | BIT(NTR_ERR_NULL) | BIT(NTR_ERR_ARG), {0}, {NTR_FLUID_NACL_3},
     call_fluid_preset, NULL, NULL, ok_fluid_preset},
    {"ntr_infusate_change_per_litre", 0, {{0}}, 4, {NA, TBW, INF_NA, INF_K}, 1, 0, 0,
     BIT(NTR_OK) | COMMON_ERR, {112.0, 30.0, 513.0, 0.0}, {0},
     call_infusate_change_per_litre, NULL, NULL, ok_infusate_change_per_litre},
    {"ntr_infusate_change", 0, {{0}}, 5, {NA, TBW, INF_NA, INF_K, {"volume_l", 0.0, 20.0}},
     1, 0, 0, BIT(NTR_OK) | COMMON_ERR, {108.0, 30.0, 513.0, 0.0, 0.292}, {0},
     call_infusate_change, NULL, NULL, ok_infusate_change},
    {"ntr_infusate_volume_for_change", 0, {{0}}, 5,
     {NA, TBW, INF_NA, INF_K, {"target_delta_mmol_l", -50.0, 50.0}}, 1, 0, 0,
     BIT(NTR_OK) | COMMON_ERR | BIT(NTR_ERR_DOMAIN), {108.0, 30.0, 513.0, 0.0, 4.0}, {0},
     call_infusate_volume_for_change, NULL, NULL, ok_infusate_volume_for_change},
    {"ntr_furst_ratio", 0, {{0}}, 3, {U_NA, U_K, {"serum_na_mmol_l", 80.0, 220.0}}, 1, 0, 0,
     BIT(NTR_OK) | COMMON_ERR, {90.0, 40.0, 125.0}, {0}, call_furst_ratio, NULL, NULL,
     ok_furst_ratio},
    {"ntr_restriction_from_ratio", 0, {{0}}, 1, {{"ratio", 0.0, 20.0}}, 0, 1, 0,
     BIT(NTR_OK) | COMMON_ERR, {0.8}, {0}, call_restriction_from_ratio, NULL, NULL,
     ok_restriction_from_ratio},
    {"ntr_efwc", 0, {{0}}, 4,
     {{"urine_volume_l", 0.0, 30.0}, U_NA, U_K, {"serum_na_mmol_l", 80.0, 220.0}}, 1, 0, 0,
     BIT(NTR_OK) | COMMON_ERR, {1.5, 60.0, 30.0, 130.0}, {0}, call_efwc, NULL, NULL, ok_efwc},
};

const size_t ntrc_n_functions = sizeof ntrc_functions / sizeof ntrc_functions[0];

const char *const ntrc_statusless[] = {
    "ntr_status_message",
    "ntr_version_string",
    "ntr_version_number",
};

const size_t ntrc_n_statusless = sizeof ntrc_statusless / sizeof ntrc_statusless[0];

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
        if (!isfinite(c->num[i])) {
            return NTR_ERR_NONFINITE;
        }
        if (c->num[i] < f->num[i].lo || c->num[i] > f->num[i].hi) {
            return NTR_ERR_RANGE;
        }
    }
    return NTR_OK;
}

static int all_outputs_written(const ntrc_fn *f, const ntrc_case *c)
{
    int i;
    for (i = 0; i < f->n_out_d; i++) {
        if (is_sentinel_d(&c->out_d[i])) {
            return 0;
        }
    }
    for (i = 0; i < f->n_out_i; i++) {
        if (c->out_i[i] == SENTINEL_I) {
            return 0;
        }
    }
    return 1;
}

static int finite_outputs(const ntrc_fn *f, const ntrc_case *c)
{
    int i;
    for (i = 0; i < f->n_out_d; i++) {
        if (!isfinite(c->out_d[i])) {
            return 0;
        }
    }
    return 1;
}

const char *ntrc_run_and_judge(const ntrc_fn *f, ntrc_case *c, int *status)
{
    int want = ntrc_predict(f, c);
    int got;
    ntrc_fill_sentinel(c);
    got = f->call(c);
    *status = got;
    if (got < NTR_OK || got > NTR_ERR_ARG) {
        return "status is not a defined code";
    }
    if ((f->statuses & BIT(got)) == 0u) {
        return "status is not among the documented ones";
    }
    if (want != NTR_OK && got != want) {
        return "status differs from the documented checking order";
    }
    if (want == NTR_OK && got != NTR_OK && got != NTR_ERR_DOMAIN) {
        return "valid inputs rejected";
    }
    if (got != NTR_OK) {
        return ntrc_outputs_untouched(c) ? NULL : "an output was written on error";
    }
    if (!all_outputs_written(f, c)) {
        return "success without writing every output";
    }
    if (!finite_outputs(f, c)) {
        return "success with a non-finite output";
    }
    return f->check_ok != NULL ? f->check_ok(c) : NULL;
}
