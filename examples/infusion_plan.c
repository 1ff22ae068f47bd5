/* Predicted effect of an infusion on serum sodium.
 *
 *   infusion_plan SEX AGE WEIGHT_KG SODIUM FLUID VOLUME_ML
 *   infusion_plan f 40 60 108 saline-3 292
 *
 * SEX is m or f; FLUID one of the names below. Body water is the
 * fraction-of-weight estimate. Without arguments an invented patient. */
#include <natremia.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

static const struct { const char *name; int fluid; } fluids[] = {
    {"saline-0.9", NTR_FLUID_NACL_0_9}, {"saline-3", NTR_FLUID_NACL_3},
    {"saline-5", NTR_FLUID_NACL_5},     {"saline-0.45", NTR_FLUID_NACL_0_45},
    {"ringer-lactate", NTR_FLUID_RINGER_LACTATE},
    {"dextrose-5", NTR_FLUID_DEXTROSE_5},
    {"saline-0.2-dextrose-5", NTR_FLUID_NACL_0_2_DEXTROSE_5},
};

static double number(const char *text) /* NaN unless the whole text is a number */
{
    char *end;
    double v = strtod(text, &end);
    return (end == text || *end != '\0') ? (double)NAN : v;
}

int main(int argc, char **argv)
{
    static const char *invented[] = {"", "f", "40", "60", "108", "saline-3", "292"};
    int sex, fluid = 0, st;
    size_t i;
    double tbw, fna, fk, per_litre, change, na;

    if (argc == 1) {
        printf("(no arguments: using an invented patient)\n");
        argv = (char **)invented;
        argc = 7;
    }
    if (argc != 7) {
        fprintf(stderr, "usage: infusion_plan m|f AGE WEIGHT_KG SODIUM FLUID VOLUME_ML\n");
        return 2;
    }
    sex = strcmp(argv[1], "m") == 0 ? NTR_SEX_MALE : strcmp(argv[1], "f") == 0 ? NTR_SEX_FEMALE : 0;
    for (i = 0; i < sizeof fluids / sizeof fluids[0]; ++i)
        if (strcmp(argv[5], fluids[i].name) == 0) fluid = fluids[i].fluid;
    na = number(argv[4]);
    if ((st = ntr_tbw_fraction(sex, number(argv[2]), number(argv[3]), &tbw)) ||
        (st = ntr_fluid_preset(fluid, &fna, &fk)) ||
        (st = ntr_infusate_change_per_litre(na, tbw, fna, fk, &per_litre)) ||
        (st = ntr_infusate_change(na, tbw, fna, fk, number(argv[6]) / 1000.0, &change))) {
        fprintf(stderr, "infusion_plan: %s\n", ntr_status_message(st));
        return 1;
    }
    printf("total body water:           %.1f L\n", tbw);
    printf("%s: sodium %.0f, potassium %.0f mmol/L\n", argv[5], fna, fk);
    printf("change per litre:           %+.1f mmol/L\n", per_litre);
    printf("change after %s mL:        %+.1f mmol/L\n", argv[6], change);
    printf("predicted sodium:           %.1f mmol/L\n", na + change);
    printf("Ignores urine and other losses. Estimates for decision support, not "
           "orders;\nverify with measured values and follow local protocols and "
           "licensed clinical judgement.\n");
    return 0;
}
