/* Therapy steps of the demo (solute and restriction), kept apart from
 * demo.c so that each file stays readable. Invented patient data only. */
#ifndef NATREMIA_DEMO_THERAPY_H
#define NATREMIA_DEMO_THERAPY_H

/* Patient A's measured urine and serum sodium, as demo.c holds them. */
struct therapy_urine {
    double serum_na_mmol_l;
    double urine_na_mmol_l;
    double urine_k_mmol_l;
    double urine_osm_mosm_kg;
};

/* "Will restriction, with or without urea, work?": the restriction
 * outlook, the allowance with current solute and with a chosen urea dose. */
void therapy_solute_step(const char *title, const struct therapy_urine *u);

#endif
