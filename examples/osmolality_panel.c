/* SPDX-License-Identifier: MIT */
/* Osmolality of a serum panel given in mixed units.
 *
 *   osmolality_panel SODIUM GLUCOSE UNIT UREA_NITROGEN UNIT [MEASURED_OSM]
 *   osmolality_panel 128 540 mg/dL 30 mg/dL 292
 *
 * Sodium in mmol/L; glucose and urea nitrogen (BUN) in any unit the
 * library accepts (mmol/L, mg/dL, g/L, umol/L); measured osmolality in
 * mOsm/kg. Without arguments it uses an invented panel. */
#include <natremia.h>
#include <stdio.h>

#include "example_cli.h"

static const char usage[] =
    "usage: osmolality_panel SODIUM GLUCOSE UNIT UREA_NITROGEN UNIT [MEASURED_OSM]\n"
    "  sodium in mmol/L; glucose and urea nitrogen with a UCUM unit (mmol/L,\n"
    "  mg/dL, g/L, umol/L); measured osmolality in mOsm/kg.\n"
    "  Without arguments: an invented panel. --help: this text.\n";

/* Parse "value unit" and convert to mmol/L, naming the argument on error. */
static int to_mmol_l(const cli *c, const char *name, int analyte, const char *value,
                     const char *ucum, double *out)
{
    double v;
    int unit, st;
    if (!cli_number(c, name, value, &v)) return CLI_EXIT_USAGE;
    if ((st = ntr_unit_parse(ucum, &unit)) != NTR_OK ||
        (st = ntr_convert(analyte, v, unit, NTR_UNIT_MMOL_L, out)) != NTR_OK) {
        fprintf(stderr, "osmolality_panel: %s %s %s refused: %s\n", name, value, ucum,
                ntr_status_message(st));
        return CLI_EXIT_REFUSED;
    }
    return 0;
}

int main(int argc, char **argv)
{
    static char *invented[] = {"128", "540", "mg/dL", "30", "mg/dL", "292"};
    double na, glucose, urea, simple, dorwart, effective, gap, corrected, measured;
    int st, band;
    cli c;

    if ((st = cli_start(&c, "osmolality_panel", usage, argc, argv)) >= 0) return st;
    if (c.argc == 0) {
        printf("(no arguments: using an invented panel)\n");
        c.argv = invented;
        c.argc = 6;
    }
    if (c.argc != 5 && c.argc != 6) return cli_usage_error(&c, "expected 5 or 6 arguments");
    if (!cli_number(&c, "SODIUM", c.argv[0], &na)) return CLI_EXIT_USAGE;
    /* Each value is checked on its own so that a refusal names it. */
    if ((st = ntr_na_severity(na, &band)) != NTR_OK)
        return cli_refused(&c, "SODIUM", c.argv[0], st);
    if ((st = to_mmol_l(&c, "GLUCOSE", NTR_ANALYTE_GLUCOSE, c.argv[1], c.argv[2], &glucose)) ||
        (st = to_mmol_l(&c, "UREA_NITROGEN", NTR_ANALYTE_UREA_NITROGEN, c.argv[3], c.argv[4],
                        &urea)))
        return st;
    if ((st = ntr_osm_effective(na, glucose, &effective)) ||
        (st = ntr_na_corrected_glucose(na, glucose, NTR_GLUCOSE_HILLIER, &corrected)))
        return cli_refused(&c, "GLUCOSE", c.argv[1], st);
    if ((st = ntr_osm_calculated(na, glucose, urea, 0.0, NTR_OSM_2NA, &simple)) ||
        (st = ntr_osm_calculated(na, glucose, urea, 0.0, NTR_OSM_DORWART_CHALMERS, &dorwart)))
        return cli_refused(&c, "UREA_NITROGEN", c.argv[3], st);
    printf("glucose %.2f mmol/L, urea %.2f mmol/L\n", glucose, urea);
    printf("calculated osmolality (2 Na + glucose + urea): %.1f mOsm/kg\n", simple);
    printf("calculated osmolality (Dorwart-Chalmers):      %.1f mOsm/kg\n", dorwart);
    printf("effective osmolality (2 Na + glucose):         %.1f mOsm/kg\n", effective);
    printf("sodium corrected for glucose (Hillier):        %.1f mmol/L\n", corrected);
    if (c.argc == 6) {
        if (!cli_number(&c, "MEASURED_OSM", c.argv[5], &measured)) return CLI_EXIT_USAGE;
        if ((st = ntr_osm_gap(measured, simple, &gap)) != NTR_OK)
            return cli_refused(&c, "MEASURED_OSM", c.argv[5], st);
        printf("osmolal gap (measured - calculated):           %.1f mOsm/kg\n", gap);
    }
    printf("Estimates for decision support, not orders; verify with measured "
           "values and\nfollow local protocols and licensed clinical judgement.\n");
    return 0;
}
