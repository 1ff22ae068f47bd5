/* natremia-demo: one invented patient walked through the whole job.
 *
 * Usage: natremia-demo [chart.svg]   (default: natremia-demo.svg here)
 *
 * Everything about the patient is invented for this demo. The program
 * shows how the library's functions fit together; it is example code and
 * prints, which the library itself never does. */
#include <natremia.h>

#include <stdio.h>
#include <stdlib.h>

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

/* Results carried from one step to the next. */
struct workup {
    double mmol_l[PANEL_COUNT]; /* creatinine in umol/L */
    double osm_calculated, osm_effective;
    double na_corrected;
    double tbw_fraction_l, tbw_watson_l;
    double furst;
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
    printf("  urine: osmolality %.0f mosm/kg, sodium %.0f mmol/L, "
           "potassium %.0f mmol/L\n",
           URINE_OSM_MOSM_KG, URINE_NA_MMOL_L, URINE_K_MMOL_L);
}

static void tonicity(struct workup *w)
{
    double gap, katz, hillier;
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
    w->na_corrected = hillier;
    printf("  sodium corrected for glucose: %.1f mmol/L (Katz), %.1f mmol/L "
           "(Hillier)\n", katz, hillier);
    printf("  -> glucose explains almost none of the low sodium.\n");
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
    struct workup w;
    (void)chart_path;

    introduce();
    convert_panel(&w);
    tonicity(&w);
    body_water(&w);
    fluid_restriction(&w);
    caution();
    return 0;
}
