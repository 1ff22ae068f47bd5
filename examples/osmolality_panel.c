/* Osmolality of a serum panel given in mixed units.
 *
 *   osmolality_panel SODIUM GLUCOSE UNIT UREA_NITROGEN UNIT [MEASURED_OSM]
 *   osmolality_panel 128 540 mg/dL 30 mg/dL 292
 *
 * Sodium in mmol/L; glucose and urea nitrogen (BUN) in any unit the
 * library accepts (mmol/L, mg/dL, g/L, umol/L); measured osmolality in
 * mOsm/kg. Without arguments it uses an invented panel. */
#include <natremia.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>

static int fail(const char *what, int status)
{
    fprintf(stderr, "osmolality_panel: %s: %s\n", what, ntr_status_message(status));
    return 1;
}

/* A whole argument as a number; anything else becomes NaN, which the
 * library refuses (NTR_ERR_NONFINITE) instead of reading it as 0. */
static double number(const char *text)
{
    char *end;
    double v = strtod(text, &end);
    return (end == text || *end != '\0') ? (double)NAN : v;
}

/* Parse "value unit" and convert to mmol/L. */
static int to_mmol_l(int analyte, const char *value, const char *ucum, double *out)
{
    int unit, st = ntr_unit_parse(ucum, &unit);
    if (st != NTR_OK) return st;
    return ntr_convert(analyte, number(value), unit, NTR_UNIT_MMOL_L, out);
}

int main(int argc, char **argv)
{
    static const char *invented[] = {"", "128", "540", "mg/dL", "30", "mg/dL", "292"};
    double na, glucose, urea, simple, dorwart, effective, gap, corrected;
    int st;

    if (argc == 1) {
        printf("(no arguments: using an invented panel)\n");
        argv = (char **)invented;
        argc = 7;
    }
    if (argc != 6 && argc != 7) {
        fprintf(stderr, "usage: osmolality_panel SODIUM GLUCOSE UNIT "
                        "UREA_NITROGEN UNIT [MEASURED_OSM]\n");
        return 2;
    }
    na = number(argv[1]);
    if ((st = to_mmol_l(NTR_ANALYTE_GLUCOSE, argv[2], argv[3], &glucose)) != NTR_OK)
        return fail("glucose", st);
    if ((st = to_mmol_l(NTR_ANALYTE_UREA_NITROGEN, argv[4], argv[5], &urea)) != NTR_OK)
        return fail("urea nitrogen", st);
    if ((st = ntr_osm_calculated(na, glucose, urea, 0.0, NTR_OSM_2NA, &simple)) ||
        (st = ntr_osm_calculated(na, glucose, urea, 0.0, NTR_OSM_DORWART_CHALMERS,
                                 &dorwart)) ||
        (st = ntr_osm_effective(na, glucose, &effective)) ||
        (st = ntr_na_corrected_glucose(na, glucose, NTR_GLUCOSE_HILLIER, &corrected)))
        return fail("osmolality", st);

    printf("glucose %.2f mmol/L, urea %.2f mmol/L\n", glucose, urea);
    printf("calculated osmolality (2 Na + glucose + urea): %.1f mOsm/kg\n", simple);
    printf("calculated osmolality (Dorwart-Chalmers):      %.1f mOsm/kg\n", dorwart);
    printf("effective osmolality (2 Na + glucose):         %.1f mOsm/kg\n", effective);
    printf("sodium corrected for glucose (Hillier):        %.1f mmol/L\n", corrected);
    if (argc == 7) {
        if ((st = ntr_osm_gap(number(argv[6]), simple, &gap)) != NTR_OK)
            return fail("osmolal gap", st);
        printf("osmolal gap (measured - calculated):           %.1f mOsm/kg\n", gap);
    }
    printf("Estimates for decision support, not orders; verify with measured "
           "values and\nfollow local protocols and licensed clinical judgement.\n");
    return 0;
}
