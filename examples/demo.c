/* natremia-demo: one invented patient walked through the whole job.
 *
 * Usage: natremia-demo [chart.svg]   (default: natremia-demo.svg here)
 *
 * Everything about the patient is invented for this demo. The program
 * shows how the library's functions fit together; it is example code and
 * prints, which the library itself never does. */
#if defined(__unix__) || defined(__APPLE__)
#define _POSIX_C_SOURCE 200112L /* getcwd(), to show where the chart went */
#include <unistd.h>
#endif

#include <natremia.h>

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "svg_chart.h"

/* Stop with the library's own message if a call fails: a demo that
 * printed a number after a failed call would teach the wrong habit. */
static void must(int status, const char *what)
{
    if (status != NTR_OK) {
        fprintf(stderr, "natremia-demo: %s failed: %s\n", what,
                ntr_status_message(status));
        exit(1);
    }
}

static void heading(const char *title)
{
    printf("\n== %s ==\n", title);
}

/* ---- the invented patient ---------------------------------------------- */

#define PATIENT_SEX NTR_SEX_FEMALE
#define PATIENT_AGE_YEARS 68.0
#define PATIENT_HEIGHT_CM 160.0
#define PATIENT_WEIGHT_KG 58.0

/* The panel as a laboratory system might send it: each value with the
 * UCUM code of its unit, not all of them in mmol/L. */
struct lab_value {
    const char *name;
    int analyte;
    double value;
    const char *ucum;
};

static const struct lab_value serum_panel[] = {
    {"sodium", NTR_ANALYTE_SODIUM, 114.0, "meq/L"},
    {"potassium", NTR_ANALYTE_POTASSIUM, 3.6, "mmol/L"},
    {"glucose", NTR_ANALYTE_GLUCOSE, 162.0, "mg/dL"},
    {"urea nitrogen (BUN)", NTR_ANALYTE_UREA_NITROGEN, 8.0, "mg/dL"},
    {"creatinine", NTR_ANALYTE_CREATININE, 0.7, "mg/dL"},
};
enum { PANEL_NA, PANEL_K, PANEL_GLUCOSE, PANEL_BUN, PANEL_CREATININE,
       PANEL_COUNT };

#define MEASURED_OSM_MOSM_KG 243.0
#define URINE_OSM_MOSM_KG 460.0
#define URINE_NA_MMOL_L 82.0
#define URINE_K_MMOL_L 38.0
#define URINE_UREA_MMOL_L 180.0
#define URINE_CREATININE_UMOL_L 6000.0
#define SERUM_URIC_ACID_MMOL_L 0.16

/* The invented plan: two boluses of 150 mL of 3% saline, 20 minutes each,
 * checked over 24 h; then the same plan with a water diuresis that starts
 * at hour 6, as often happens once the cause of the antidiuresis resolves. */
#define BOLUS_L 0.150
#define BOLUS_COUNT 2
#define BOLUS_MINUTES 20.0
#define PLAN_HOURS 24.0
#define PLAN_STEP_H 0.5
#define PLAN_POINTS 49 /* PLAN_HOURS / PLAN_STEP_H + 1 */
#define DIURESIS_START_H 6.0
#define DIURESIS_ML_H 250.0
#define DIURESIS_NA_MMOL_L 40.0
#define DIURESIS_K_MMOL_L 20.0

/* The invented measured series, hours since the first sample. The first
 * six come before the re-lowering decision, the rest after it. */
static const ntr_sample measured[] = {
    {0.0, 114.0},  {1.0, 118.0},  {4.0, 118.5},  {8.0, 120.5},
    {12.0, 123.0}, {16.0, 125.5}, {20.0, 123.0}, {24.0, 122.5},
    {30.0, 124.0}, {36.0, 125.5}, {42.0, 126.5}, {48.0, 128.0},
};
#define MEASURED_COUNT (sizeof measured / sizeof measured[0])
#define MEASURED_BEFORE_RELOWER 6

/* Re-lowering: 5% dextrose over 4 h, to 2 mmol/L under the 24 h limit,
 * with the urine expected once the diuresis is stopped. */
#define RELOWER_HOURS 4.0
#define RELOWER_MARGIN_MMOL_L 2.0
#define RELOWER_URINE_ML_H 60.0
#define RELOWER_URINE_NA_MMOL_L 80.0
#define RELOWER_URINE_K_MMOL_L 40.0

/* Results carried from one step to the next. */
struct workup {
    double mmol_l[PANEL_COUNT]; /* creatinine in umol/L */
    double osm_calculated, osm_effective;
    double tbw_fraction_l, tbw_watson_l;
    double furst;
    ntr_limits limits;
    /* Predicted courses of the plan, for the chart. */
    ntr_sample bolus_only[PLAN_POINTS], with_diuresis[PLAN_POINTS];
    size_t n_bolus_only, n_with_diuresis;
    /* 1 for each measured sample that made a rise over its limit worse. */
    int flagged[MEASURED_COUNT];
};

/* ---- steps ------------------------------------------------------------- */

static void introduce(void)
{
    printf("natremia %s demo: one invented patient, start to finish\n",
           ntr_version_string());
    printf("The patient, every value and the course below are invented for "
           "this demo.\n\n");
    printf("Patient: woman, %.0f years, %.0f cm, %.0f kg; admitted confused "
           "and nauseated.\n",
           PATIENT_AGE_YEARS, PATIENT_HEIGHT_CM, PATIENT_WEIGHT_KG);
}

static void convert_panel(struct workup *w)
{
    size_t i;
    heading("1. Laboratory panel, as received and in SI units");
    for (i = 0; i < PANEL_COUNT; ++i) {
        const struct lab_value *v = &serum_panel[i];
        int unit, target = NTR_UNIT_MMOL_L;
        const char *target_name = "mmol/L";
        must(ntr_unit_parse(v->ucum, &unit), "ntr_unit_parse");
        if (v->analyte == NTR_ANALYTE_CREATININE) {
            target = NTR_UNIT_UMOL_L;
            target_name = "umol/L";
        }
        must(ntr_convert(v->analyte, v->value, unit, target, &w->mmol_l[i]),
             "ntr_convert");
        printf("  %-22s %7.1f %-7s -> %7.2f %s%s\n", v->name, v->value, v->ucum,
               w->mmol_l[i], target_name,
               v->analyte == NTR_ANALYTE_UREA_NITROGEN ? " of urea" : "");
    }
    printf("  %-22s %7.0f mosm/kg (measured)\n", "serum osmolality",
           MEASURED_OSM_MOSM_KG);
    printf("  %-22s %7.2f mmol/L\n", "uric acid",
           SERUM_URIC_ACID_MMOL_L);
    printf("  urine: osmolality %.0f mosm/kg, sodium %.0f mmol/L, potassium "
           "%.0f mmol/L,\n         urea %.0f mmol/L, creatinine %.0f umol/L\n",
           URINE_OSM_MOSM_KG, URINE_NA_MMOL_L, URINE_K_MMOL_L, URINE_UREA_MMOL_L,
           URINE_CREATININE_UMOL_L);
}

static void tonicity(struct workup *w)
{
    double gap, katz, hillier;
    int tonicity_class;
    unsigned int flags;
    const double na = w->mmol_l[PANEL_NA], glucose = w->mmol_l[PANEL_GLUCOSE];
    heading("2. Is the low sodium truly hypotonic?");
    must(ntr_osm_calculated(na, glucose, w->mmol_l[PANEL_BUN], 0.0, NTR_OSM_2NA,
                            &w->osm_calculated), "ntr_osm_calculated");
    must(ntr_osm_effective(na, glucose, &w->osm_effective), "ntr_osm_effective");
    must(ntr_osm_gap(MEASURED_OSM_MOSM_KG, w->osm_calculated, &gap), "ntr_osm_gap");
    printf("  calculated osmolality  2*Na + glucose + urea = %6.1f mOsm/kg\n",
           w->osm_calculated);
    printf("  effective osmolality   2*Na + glucose        = %6.1f mOsm/kg\n",
           w->osm_effective);
    printf("  osmolal gap            measured - calculated = %6.1f mOsm/kg%s\n",
           gap, gap > 10.0 ? "  (raised: look for other osmoles)"
                           : "  (not raised)");
    must(ntr_na_corrected_glucose(na, glucose, NTR_GLUCOSE_KATZ, &katz),
         "ntr_na_corrected_glucose");
    must(ntr_na_corrected_glucose(na, glucose, NTR_GLUCOSE_HILLIER, &hillier),
         "ntr_na_corrected_glucose");
    printf("  sodium corrected for glucose: %.1f mmol/L (Katz), %.1f mmol/L "
           "(Hillier)\n", katz, hillier);
    must(ntr_low_na_tonicity(na, glucose, MEASURED_OSM_MOSM_KG,
                             NTR_GLUCOSE_HILLIER, &tonicity_class, &flags),
         "ntr_low_na_tonicity");
    if (tonicity_class == NTR_TONICITY_HYPOTONIC && flags == 0u) {
        printf("  -> measured osmolality %.0f mOsm/kg is below 275 and glucose "
               "does not explain\n     the sodium: a true hypotonic low "
               "sodium.\n", MEASURED_OSM_MOSM_KG);
    } else {
        printf("  -> not a plain hypotonic low sodium (class %d, flags 0x%02x): "
               "recheck before treating.\n", tonicity_class, flags);
    }
}

static void severity(const struct workup *w)
{
    static const char *const names[] = {"none (135 or more)", "mild (130-134.9)",
                                        "moderate (125-129.9)",
                                        "profound (below 125)"};
    int band;
    heading("3. Severity of the low sodium");
    must(ntr_na_severity(w->mmol_l[PANEL_NA], &band), "ntr_na_severity");
    printf("  measured sodium %.0f mmol/L: %s\n", w->mmol_l[PANEL_NA], names[band]);
}

static void body_water(struct workup *w)
{
    heading("4. Total body water, two ways");
    must(ntr_tbw_fraction(PATIENT_SEX, PATIENT_AGE_YEARS, PATIENT_WEIGHT_KG,
                          &w->tbw_fraction_l), "ntr_tbw_fraction");
    must(ntr_tbw_watson(PATIENT_SEX, PATIENT_AGE_YEARS, PATIENT_HEIGHT_CM,
                        PATIENT_WEIGHT_KG, &w->tbw_watson_l), "ntr_tbw_watson");
    printf("  fraction of weight (0.45 for a woman of 65 or more): %5.1f L\n",
           w->tbw_fraction_l);
    printf("  Watson anthropometric equation:                      %5.1f L\n",
           w->tbw_watson_l);
    printf("  -> the plan below uses the smaller value, which predicts the "
           "larger change.\n");
}

static const char *criterion_state(const ntr_siad_result *r, int criterion)
{
    unsigned long bit = 1ul << criterion;
    if (r->met & bit) return "met";
    if (r->not_met & bit) return "NOT met";
    if (r->not_assessable & bit) return "cannot be judged";
    return "not known";
}

static void known(ntr_finding_value *f, double value)
{
    f->known = 1;
    f->value = value;
}

static void siad_criteria(const struct workup *w)
{
    static const struct { int criterion; const char *text; } shown[] = {
        {NTR_SIAD_OSM_LOW, "effective osmolality below 275 mOsm/kg"},
        {NTR_SIAD_URINE_CONCENTRATED, "urine osmolality above 100 mOsm/kg"},
        {NTR_SIAD_EUVOLAEMIA, "clinically euvolaemic"},
        {NTR_SIAD_URINE_NA_HIGH, "urine sodium above 30 mmol/L"},
        {NTR_SIAD_THYROID_NORMAL, "thyroid function normal"},
        {NTR_SIAD_ADRENAL_NORMAL, "adrenal function normal"},
        {NTR_SIAD_PITUITARY_NORMAL, "pituitary function normal"},
        {NTR_SIAD_KIDNEY_NORMAL, "kidney function normal"},
        {NTR_SIAD_NO_DIURETIC, "no recent diuretic"},
        {NTR_SIAD_UREA_LOW, "(supporting) serum urea below 3.6 mmol/L"},
        {NTR_SIAD_URIC_ACID_LOW, "(supporting) uric acid below 0.24 mmol/L"},
        {NTR_SIAD_FE_UREA_HIGH, "(supporting) urea excretion above 55%"},
    };
    ntr_siad_findings f;
    ntr_siad_result r;
    double fe_urea;
    size_t i;

    heading("5. Does it fit inappropriate antidiuresis (SIAD)?");
    must(ntr_fractional_excretion(URINE_UREA_MMOL_L, w->mmol_l[PANEL_BUN],
                                  URINE_CREATININE_UMOL_L,
                                  w->mmol_l[PANEL_CREATININE], &fe_urea),
         "ntr_fractional_excretion");
    printf("  fractional excretion of urea: %.0f%%\n", fe_urea);
    must(ntr_siad_findings_init(&f), "ntr_siad_findings_init");
    known(&f.effective_osm_mosm_kg, w->osm_effective);
    known(&f.urine_osm_mosm_kg, URINE_OSM_MOSM_KG);
    known(&f.urine_na_mmol_l, URINE_NA_MMOL_L);
    known(&f.urea_mmol_l, w->mmol_l[PANEL_BUN]);
    known(&f.uric_acid_mmol_l, SERUM_URIC_ACID_MMOL_L);
    known(&f.fe_urea_percent, fe_urea);
    f.volume_status = NTR_VOLUME_EUVOLAEMIC;
    f.normal_salt_water_intake = NTR_FINDING_YES;
    f.thyroid_normal = NTR_FINDING_YES;
    f.adrenal_normal = NTR_FINDING_YES;
    f.pituitary_normal = NTR_FINDING_YES;
    f.kidney_normal = NTR_FINDING_YES;
    f.recent_diuretic = NTR_FINDING_NO;
    r.struct_size = sizeof r;
    must(ntr_siad_evaluate(&f, &r), "ntr_siad_evaluate");
    for (i = 0; i < sizeof shown / sizeof shown[0]; ++i) {
        printf("  %-44s %s\n", shown[i].text, criterion_state(&r, shown[i].criterion));
    }
    printf("  -> %s\n", r.verdict == NTR_SIAD_CONSISTENT
                            ? "consistent with SIAD: every essential criterion is met"
                        : r.verdict == NTR_SIAD_NOT_CONSISTENT
                            ? "not consistent with SIAD"
                            : "incomplete: some essential findings are missing");
}

static void fluid_restriction(struct workup *w)
{
    int advice;
    heading("6. Will fluid restriction work? (Furst ratio)");
    must(ntr_furst_ratio(URINE_NA_MMOL_L, URINE_K_MMOL_L, w->mmol_l[PANEL_NA],
                         &w->furst), "ntr_furst_ratio");
    must(ntr_restriction_from_ratio(w->furst, &advice), "ntr_restriction_from_ratio");
    printf("  (urine Na + urine K) / serum Na = (%.0f + %.0f) / %.0f = %.2f\n",
           URINE_NA_MMOL_L, URINE_K_MMOL_L, w->mmol_l[PANEL_NA], w->furst);
    switch (advice) {
    case NTR_RESTRICT_1000ML:
        printf("  -> ratio below 1: restrict fluid to under 1 L per day.\n");
        break;
    case NTR_RESTRICT_500_700ML:
        printf("  -> ratio about 1: restrict fluid to 500-700 mL per day.\n");
        break;
    default:
        printf("  -> ratio above 1: even under 500 mL per day, restriction "
               "alone is likely to fail.\n");
        break;
    }
}

static void bolus_plan(struct workup *w)
{
    double na_inf, k_inf, per_litre, one, both, both_watson, for_five;
    const double na = w->mmol_l[PANEL_NA];
    heading("8. Planned hypertonic saline and its predicted effect");
    must(ntr_fluid_preset(NTR_FLUID_NACL_3, &na_inf, &k_inf), "ntr_fluid_preset");
    must(ntr_infusate_change_per_litre(na, w->tbw_fraction_l, na_inf, k_inf,
                                       &per_litre), "ntr_infusate_change_per_litre");
    must(ntr_infusate_change(na, w->tbw_fraction_l, na_inf, k_inf, BOLUS_L, &one),
         "ntr_infusate_change");
    must(ntr_infusate_change(na, w->tbw_fraction_l, na_inf, k_inf,
                             BOLUS_COUNT * BOLUS_L, &both), "ntr_infusate_change");
    must(ntr_infusate_change(na, w->tbw_watson_l, na_inf, k_inf,
                             BOLUS_COUNT * BOLUS_L, &both_watson),
         "ntr_infusate_change");
    must(ntr_infusate_volume_for_change(na, w->tbw_fraction_l, na_inf, k_inf, 5.0,
                                        &for_five), "ntr_infusate_volume_for_change");
    printf("  plan: %d boluses of %.0f mL of 3%% saline (Na %.0f mmol/L), %.0f "
           "minutes each\n", BOLUS_COUNT, BOLUS_L * 1000.0, na_inf, BOLUS_MINUTES);
    printf("  1 L of it would change sodium by    %+5.1f mmol/L "
           "(Adrogue-Madias, TBW %.1f L)\n", per_litre, w->tbw_fraction_l);
    printf("  one bolus:                          %+5.1f mmol/L\n", one);
    printf("  both boluses:                       %+5.1f mmol/L -> %.1f mmol/L\n",
           both, na + both);
    printf("  both, if body water is Watson's:    %+5.1f mmol/L\n", both_watson);
    printf("  volume for a rise of 5 mmol/L:      %5.0f mL\n", for_five * 1000.0);
    printf("  (these figures count no urine output: see the next step)\n");
}

static void correction_limits(struct workup *w)
{
    int preset;
    unsigned int drivers, unknowns;
    heading("7. Which correction limits apply?");
    /* Potassium 3.6 mmol/L is not low; the other risk factors were asked
     * about and are absent in this invented history. */
    must(ntr_ods_risk(w->mmol_l[PANEL_NA], NTR_TRI_NO, NTR_TRI_NO, NTR_TRI_NO,
                      NTR_TRI_NO, &preset, &drivers, &unknowns), "ntr_ods_risk");
    must(ntr_limits_preset(preset, &w->limits), "ntr_limits_preset");
    printf("  risk factors for osmotic demyelination: %s\n",
           drivers == 0u && unknowns == 0u ? "none known"
                                           : "present or not known");
    printf("  %s limits: rise at most %.0f mmol/L in any 24 h and %.0f in any "
           "48 h;\n  aim for at least %.0f mmol/L in the first 24 h.\n",
           preset == NTR_LIMITS_HIGH_RISK ? "high-risk" : "standard",
           w->limits.max_rise_24h, w->limits.max_rise_48h, w->limits.min_rise_24h);
}

/* The plan as steady-rate flows: the boluses back to back, then (only in
 * the second plan) the urine of a water diuresis. */
static size_t plan_flows(int with_diuresis, ntr_timed_flow flows[2])
{
    const ntr_timed_flow urine = {DIURESIS_START_H, PLAN_HOURS, -DIURESIS_ML_H,
                                  DIURESIS_NA_MMOL_L, DIURESIS_K_MMOL_L, {0u, 0u}};
    ntr_timed_flow saline = {0.0, 0.0, 0.0, 0.0, 0.0, {0u, 0u}};
    saline.end_h = BOLUS_COUNT * BOLUS_MINUTES / 60.0;
    saline.rate_ml_h = BOLUS_L * 1000.0 / (BOLUS_MINUTES / 60.0);
    must(ntr_fluid_preset(NTR_FLUID_NACL_3, &saline.na_mmol_l, &saline.k_mmol_l),
         "ntr_fluid_preset");
    flows[0] = saline;
    flows[1] = urine;
    return with_diuresis ? 2u : 1u;
}

static void report_plan(const char *label, const ntr_plan_result *r, double na0)
{
    printf("  %s\n    predicted sodium at %.0f h: %.1f mmol/L (rise %.1f), "
           "body water %.1f L\n", label, PLAN_HOURS, r->final_na_mmol_l,
           r->final_na_mmol_l - na0, r->final_tbw_l);
    if (r->breach_24h_h == NTR_PLAN_NO_BREACH && r->breach_48h_h == NTR_PLAN_NO_BREACH) {
        printf("    -> stays within the limits (largest 24 h rise %.1f mmol/L)\n",
               r->course.max_rise_24h);
    } else {
        printf("    -> BREACHES the 24 h limit from hour %.1f; largest 24 h rise "
               "%.1f mmol/L\n", r->breach_24h_h, r->course.max_rise_24h);
    }
}

static void plan_check(struct workup *w)
{
    const ntr_sample now = {0.0, w->mmol_l[PANEL_NA]};
    ntr_timed_flow flows[2];
    ntr_plan_result alone, diuresis;
    char label[160];
    size_t n;
    heading("9. Checking the plan, with and without a water diuresis");
    n = plan_flows(0, flows);
    must(ntr_plan_check(&now, 1, w->tbw_fraction_l, flows, n, PLAN_HOURS,
                        PLAN_STEP_H, &w->limits, &alone), "ntr_plan_check");
    must(ntr_balance_course(now.na_mmol_l, w->tbw_fraction_l, flows, n, PLAN_HOURS,
                            PLAN_STEP_H, w->bolus_only, PLAN_POINTS,
                            &w->n_bolus_only), "ntr_balance_course");
    report_plan("boluses alone:", &alone, now.na_mmol_l);
    n = plan_flows(1, flows);
    must(ntr_plan_check(&now, 1, w->tbw_fraction_l, flows, n, PLAN_HOURS,
                        PLAN_STEP_H, &w->limits, &diuresis), "ntr_plan_check");
    must(ntr_balance_course(now.na_mmol_l, w->tbw_fraction_l, flows, n, PLAN_HOURS,
                            PLAN_STEP_H, w->with_diuresis, PLAN_POINTS,
                            &w->n_with_diuresis), "ntr_balance_course");
    snprintf(label, sizeof label, "boluses, then from hour %.0f a water "
             "diuresis of %.0f mL/h (urine Na %.0f + K %.0f mmol/L):",
             DIURESIS_START_H, DIURESIS_ML_H, DIURESIS_NA_MMOL_L, DIURESIS_K_MMOL_L);
    report_plan(label, &diuresis, now.na_mmol_l);
    printf("  -> the bolus is safe on its own; a diuresis like this needs "
           "sodium checked\n     every few hours and a plan to stop it.\n");
}

static void describe_flags(unsigned int flags, char *text, size_t size)
{
    static const struct { unsigned int bit; const char *word; } words[] = {
        {NTR_CF_OVER_24H, "OVER 24 h LIMIT"}, {NTR_CF_OVER_48H, "OVER 48 h LIMIT"},
        {NTR_CF_NEAR_LIMIT, "near a limit"},
        {NTR_CF_PROJECTED_OVER, "next result projected over"},
        {NTR_CF_RAPID_6H, "6 or more in 6 h"}, {NTR_CF_FALLING, "falling"},
        {NTR_CF_BELOW_TARGET, "below the 24 h target"},
    };
    size_t i, used = 0;
    text[0] = '\0';
    for (i = 0; i < sizeof words / sizeof words[0]; ++i) {
        if ((flags & words[i].bit) != 0u && used < size) {
            int k = snprintf(text + used, size - used, "%s%s", used ? ", " : "",
                             words[i].word);
            used += k > 0 ? (size_t)k : 0u;
        }
    }
}

/* Feed samples [from, to) to the watcher and print one line each. */
static void watch_samples(struct workup *w, ntr_watch *watch, size_t from, size_t to,
                          ntr_correction *last)
{
    size_t i;
    char flags[160];
    for (i = from; i < to; ++i) {
        double before24 = last->max_rise_24h, before48 = last->max_rise_48h;
        must(ntr_watch_push(watch, measured[i].hours, measured[i].na_mmol_l, last),
             "ntr_watch_push");
        /* Mark the samples that made a rise over its limit worse. */
        w->flagged[i] = ((last->flags & NTR_CF_OVER_24H) && last->max_rise_24h > before24) ||
                        ((last->flags & NTR_CF_OVER_48H) && last->max_rise_48h > before48);
        describe_flags(last->flags, flags, sizeof flags);
        printf("  %5.1f  %6.1f  %8.1f  %+7.2f   %s\n", measured[i].hours,
               measured[i].na_mmol_l, last->max_rise_24h, last->last_rate_per_h, flags);
    }
}

static void watch_header(void)
{
    printf("   hour  sodium  max rise   change   flags\n"
           "         mmol/L  in 24 h    per h\n");
}

static void watch_series(struct workup *w, ntr_watch *watch, ntr_correction *last)
{
    heading("10. Watching the measured series");
    must(ntr_watch_init(&w->limits, watch), "ntr_watch_init");
    watch_header();
    watch_samples(w, watch, 0, MEASURED_BEFORE_RELOWER, last);
    if (last->flags & NTR_CF_OVER_24H) {
        printf("  -> over-rapid correction: the 24 h rise exceeds the limit by "
               "%.1f mmol/L.\n", last->excess_mmol_l);
    }
}

static void relower(const struct workup *w, const ntr_correction *last)
{
    const double na_now = measured[MEASURED_BEFORE_RELOWER - 1].na_mmol_l;
    const double lower_by = last->excess_mmol_l + RELOWER_MARGIN_MMOL_L;
    double volume_l, rate_ml_h;
    heading("11. Re-lowering estimate");
    must(ntr_relower_estimate(na_now, w->tbw_fraction_l, 0.0, 0.0, lower_by,
                              RELOWER_HOURS, RELOWER_URINE_ML_H,
                              RELOWER_URINE_NA_MMOL_L, RELOWER_URINE_K_MMOL_L,
                              &volume_l, &rate_ml_h), "ntr_relower_estimate");
    printf("  to bring sodium from %.1f down by %.1f mmol/L (2 under the 24 h "
           "limit)\n  over %.0f h, with urine expected at %.0f mL/h once the "
           "diuresis is stopped:\n", na_now, lower_by, RELOWER_HOURS,
           RELOWER_URINE_ML_H);
    printf("  5%% dextrose %.0f mL, that is %.0f mL/h\n", volume_l * 1000.0,
           rate_ml_h);
    printf("  -> re-lowering is a specialist decision; measure sodium every "
           "1-2 hours.\n");
}

static void rest_of_course(struct workup *w, ntr_watch *watch, ntr_correction *last)
{
    ntr_correction batch;
    heading("12. The rest of the course, still watched");
    watch_header();
    watch_samples(w, watch, MEASURED_BEFORE_RELOWER, MEASURED_COUNT, last);
    must(ntr_correction_assess(measured, MEASURED_COUNT, &w->limits, &batch),
         "ntr_correction_assess");
    printf("  whole series: largest rise %.1f mmol/L in 24 h, %.1f in 48 h "
           "(limits %.0f and %.0f)\n", batch.max_rise_24h, batch.max_rise_48h,
           w->limits.max_rise_24h, w->limits.max_rise_48h);
    printf("  the batch assessment %s the streaming watcher.\n",
           batch.flags == last->flags && batch.max_rise_24h == last->max_rise_24h &&
                   batch.max_rise_48h == last->max_rise_48h
               ? "agrees with"
               : "DISAGREES with");
}

/* Say where the chart went even when the demo runs from a build
 * directory: a relative path is shown after the current directory where
 * POSIX getcwd() exists. */
static void print_full_path(const char *path)
{
#if defined(__unix__) || defined(__APPLE__)
    char cwd[4096];
    if (path[0] != '/' && getcwd(cwd, sizeof cwd) != NULL) {
        printf("%s/", cwd);
    }
#endif
    printf("%s", path);
}

static void write_chart(const struct workup *w, const char *path)
{
    double m_hours[MEASURED_COUNT], m_na[MEASURED_COUNT];
    double a_hours[PLAN_POINTS], a_na[PLAN_POINTS], d_hours[PLAN_POINTS], d_na[PLAN_POINTS];
    const double na0 = measured[0].na_mmol_l;
    const double b_hours[] = {0.0, 24.0, 24.0, 48.0};
    const double b_low[] = {na0, na0, na0, na0};
    const double b_high[] = {na0 + w->limits.max_rise_24h, na0 + w->limits.max_rise_24h,
                             na0 + w->limits.max_rise_48h, na0 + w->limits.max_rise_48h};
    chart_line lines[2];
    char subtitle[160];
    chart c;
    size_t i;

    heading("13. Chart");
    for (i = 0; i < MEASURED_COUNT; ++i) {
        m_hours[i] = measured[i].hours;
        m_na[i] = measured[i].na_mmol_l;
    }
    for (i = 0; i < w->n_bolus_only; ++i) {
        a_hours[i] = w->bolus_only[i].hours;
        a_na[i] = w->bolus_only[i].na_mmol_l;
    }
    for (i = 0; i < w->n_with_diuresis; ++i) {
        d_hours[i] = w->with_diuresis[i].hours;
        d_na[i] = w->with_diuresis[i].na_mmol_l;
    }
    lines[0].label = "Predicted: boluses alone";
    lines[0].colour = "#7a7a7a";
    lines[0].hours = a_hours;
    lines[0].na_mmol_l = a_na;
    lines[0].n = w->n_bolus_only;
    lines[1].label = "Predicted: with diuresis";
    lines[1].colour = "#d4780a";
    lines[1].hours = d_hours;
    lines[1].na_mmol_l = d_na;
    lines[1].n = w->n_with_diuresis;

    snprintf(subtitle, sizeof subtitle, "Band: a rise of at most %.0f mmol/L "
             "by 24 h and %.0f by 48 h from the first sample (%s limits)",
             w->limits.max_rise_24h, w->limits.max_rise_48h,
             w->limits.max_rise_24h < 10.0 ? "high-risk" : "standard");
    c.title = "Serum sodium of an invented patient: plan, limits and results";
    c.subtitle = subtitle;
    c.caption = "Invented patient. Estimates for decision support, not orders: "
                "verify with measured values; follow local protocols and licensed "
                "clinical judgement.";
    c.hours_max = 48.0;
    c.na_min = 110.0;
    c.na_max = 140.0;
    c.band.label = "Allowed by the limits";
    c.band.hours = b_hours;
    c.band.low_mmol_l = b_low;
    c.band.high_mmol_l = b_high;
    c.band.n = 4;
    c.lines = lines;
    c.n_lines = 2;
    c.points.label = "Measured";
    c.points.flagged_label = "Measured, over a limit";
    c.points.hours = m_hours;
    c.points.na_mmol_l = m_na;
    c.points.flagged = w->flagged;
    c.points.n = MEASURED_COUNT;
    if (chart_save_svg(path, &c) != 0) {
        fprintf(stderr, "natremia-demo: could not write %s\n", path);
        exit(1);
    }
    printf("  measured sodium, both predicted courses and the band the limits "
           "allow\n  (%.0f in 24 h, %.0f in 48 h) written to ",
           w->limits.max_rise_24h, w->limits.max_rise_48h);
    print_full_path(path);
    printf("\n  (open it in any web browser)\n");
}

/* Print text in lines of at most width columns, each indented. */
static void print_wrapped(const char *text, int indent, int width)
{
    while (*text != '\0') {
        int len = (int)strlen(text), cut = len;
        if (indent + len > width) {
            cut = width - indent;
            while (cut > 0 && text[cut] != ' ') --cut;
            if (cut == 0) cut = width - indent; /* one very long word */
        }
        printf("%*s%.*s\n", indent, "", cut, text);
        text += cut;
        while (*text == ' ') ++text;
    }
}

static void sources(void)
{
    static const int used[] = {NTR_METHOD_TBW_WATSON, NTR_METHOD_SIAD_CRITERIA,
                               NTR_METHOD_FURST, NTR_METHOD_BALANCE_COURSE,
                               NTR_METHOD_CORRECTION_WINDOWS, NTR_METHOD_RELOWER};
    struct ntr_method_info info;
    size_t i;
    heading("14. Where the main numbers come from");
    for (i = 0; i < sizeof used / sizeof used[0]; ++i) {
        must(ntr_method_info(used[i], &info), "ntr_method_info");
        printf("  %s (method %d)\n", info.name, used[i]);
        print_wrapped(info.reference, 6, 78);
    }
}

static void caution(void)
{
    heading("Caution");
    printf("  Every figure above is an estimate for decision support, not an "
           "order.\n  Verify with measured values, follow local protocols and "
           "licensed clinical\n  judgement. The patient and all values are "
           "invented.\n");
}

int main(int argc, char **argv)
{
    const char *chart_path = argc > 1 ? argv[1] : "natremia-demo.svg";
    static struct workup w; /* static: the predicted courses are sizeable */
    ntr_watch watch;
    ntr_correction last = {0.0, 0.0, 0.0, 0.0, 0.0, 0u, 0u};

    introduce();
    convert_panel(&w);
    tonicity(&w);
    severity(&w);
    body_water(&w);
    siad_criteria(&w);
    fluid_restriction(&w);
    correction_limits(&w);
    bolus_plan(&w);
    plan_check(&w);
    watch_series(&w, &watch, &last);
    relower(&w, &last);
    rest_of_course(&w, &watch, &last);
    write_chart(&w, chart_path);
    sources();
    caution();
    return 0;
}
