/* SPDX-License-Identifier: MIT */
/* Predicted effect of an infusion on serum sodium.
 *
 *   infusion_plan SEX AGE WEIGHT_KG SODIUM FLUID VOLUME_ML
 *   infusion_plan f 40 60 108 saline-3 292
 *
 * SEX is m or f; FLUID one of the names below. Body water is the
 * fraction-of-weight estimate. Without arguments an invented patient. */
#include <natremia.h>
#include <stdio.h>
#include <string.h>

#include "example_cli.h"

static const struct { const char *name; int fluid; } fluids[] = {
    {"saline-0.9", NTR_FLUID_NACL_0_9}, {"saline-3", NTR_FLUID_NACL_3},
    {"saline-5", NTR_FLUID_NACL_5},     {"saline-0.45", NTR_FLUID_NACL_0_45},
    {"ringer-lactate", NTR_FLUID_RINGER_LACTATE},
    {"dextrose-5", NTR_FLUID_DEXTROSE_5},
    {"saline-0.2-dextrose-5", NTR_FLUID_NACL_0_2_DEXTROSE_5},
};

static const char usage[] =
    "usage: infusion_plan m|f AGE WEIGHT_KG SODIUM FLUID VOLUME_ML\n"
    "  age in years, weight in kg, serum sodium in mmol/L, volume in mL; FLUID is\n"
    "  saline-0.9, saline-3, saline-5, saline-0.45, ringer-lactate, dextrose-5\n"
    "  or saline-0.2-dextrose-5. Without arguments: an invented patient.\n";

int main(int argc, char **argv)
{
    static char *invented[] = {"f", "40", "60", "108", "saline-3", "292"};
    static const char *names[] = {"AGE", "WEIGHT_KG", "SODIUM", "", "VOLUME_ML"};
    int sex, fluid = 0, st, i;
    double v[5], tbw, fna, fk, per_litre, change;
    cli c;

    if ((st = cli_start(&c, "infusion_plan", usage, argc, argv)) >= 0) return st;
    if (c.argc == 0) {
        printf("(no arguments: using an invented patient)\n");
        c.argv = invented;
        c.argc = 6;
    }
    if (c.argc != 6) return cli_usage_error(&c, "expected 6 arguments");
    sex = strcmp(c.argv[0], "m") == 0 ? NTR_SEX_MALE : strcmp(c.argv[0], "f") == 0 ? NTR_SEX_FEMALE : 0;
    if (sex == 0) return cli_bad_choice(&c, "SEX", c.argv[0], "m, f");
    for (i = 0; i < (int)(sizeof fluids / sizeof fluids[0]); ++i)
        if (strcmp(c.argv[4], fluids[i].name) == 0) fluid = fluids[i].fluid;
    if (fluid == 0) return cli_bad_choice(&c, "FLUID", c.argv[4], "the names --help lists");
    for (i = 0; i < 5; ++i)
        if (i != 3 && !cli_number(&c, names[i], c.argv[i + 1], &v[i])) return CLI_EXIT_USAGE;
    if ((st = ntr_tbw_fraction(sex, v[0], v[1], &tbw)) != NTR_OK) {
        fprintf(stderr, "infusion_plan: AGE %s or WEIGHT_KG %s refused: %s\n", c.argv[1],
                c.argv[2], ntr_status_message(st));
        return CLI_EXIT_REFUSED;
    }
    if ((st = ntr_fluid_preset(fluid, &fna, &fk)) ||
        (st = ntr_infusate_change_per_litre(v[2], tbw, fna, fk, &per_litre)))
        return cli_refused(&c, "SODIUM", c.argv[3], st);
    if ((st = ntr_infusate_change(v[2], tbw, fna, fk, v[4] / 1000.0, &change)) != NTR_OK)
        return cli_refused(&c, "VOLUME_ML", c.argv[5], st);
    printf("total body water:           %.1f L\n", tbw);
    printf("%s: sodium %.0f, potassium %.0f mmol/L\n", c.argv[4], fna, fk);
    printf("change per litre:           %+.1f mmol/L\n", per_litre);
    printf("change after %s mL:        %+.1f mmol/L\n", c.argv[5], change);
    printf("predicted sodium:           %.1f mmol/L\n", v[2] + change);
    printf("Ignores urine and other losses. Estimates for decision support, not "
           "orders;\nverify with measured values and follow local protocols and "
           "licensed clinical judgement.\n");
    return 0;
}
