/* SPDX-License-Identifier: MIT */
/* Work-up of a low sodium: severity, tonicity, urine findings, fractional
 * excretion, the criteria for inappropriate antidiuresis and what the
 * fractional uric acid excretion adds to them (docs/workup.md).
 * Thresholds: Spasovski et al., Eur J Endocrinol 2014; Fenske et al.,
 * J Clin Endocrinol Metab 2008. */
#include "ntr_internal.h"
#include "sodium_kernels.h"

/* Severity band edges, mmol/L (each band includes its lower edge). */
#define SEVERITY_MILD_BELOW 135.0
#define SEVERITY_MODERATE_BELOW 130.0
#define SEVERITY_PROFOUND_BELOW 125.0

/* SIAD table thresholds (all strict inequalities in the table). The
 * effective osmolality criterion uses the hypotonic edge of the header,
 * NTR_TONICITY_HYPOTONIC_BELOW, so it agrees with the tonicity class. */
#define SIAD_URINE_OSM_ABOVE 100.0       /* mOsm/kg */
#define SIAD_URINE_NA_ABOVE 30.0         /* mmol/L */
#define SIAD_URIC_ACID_BELOW 0.24        /* mmol/L (4 mg/dL) */
#define SIAD_UREA_BELOW 3.6              /* mmol/L (21.6 mg/dL) */
#define SIAD_FE_NA_ABOVE 0.5             /* % */
#define SIAD_FE_UREA_ABOVE 55.0          /* % */
/* Fractional uric acid excretion: the public edge, shared with
 * ntr_fe_uric_acid_class() so the criterion and the class cannot drift. */
#define SIAD_FE_URIC_ACID_ABOVE NTR_FE_URIC_ACID_HIGH_ABOVE

/* Sizes of the first published layouts. They stay fixed when members are
 * appended later, so a caller built against this header keeps working. */
#define FINDINGS_V1_SIZE \
    (offsetof(ntr_siad_findings, fe_uric_acid_percent) + sizeof(ntr_finding_value))
#define RESULT_V1_SIZE \
    (offsetof(ntr_siad_result, missing) + sizeof(unsigned long))

int ntr_na_severity(double na_mmol_l, int *severity)
{
    if (severity == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check_na(na_mmol_l));
    if (na_mmol_l >= SEVERITY_MILD_BELOW) {
        *severity = NTR_SEVERITY_NONE;
    } else if (na_mmol_l >= SEVERITY_MODERATE_BELOW) {
        *severity = NTR_SEVERITY_MILD;
    } else if (na_mmol_l >= SEVERITY_PROFOUND_BELOW) {
        *severity = NTR_SEVERITY_MODERATE;
    } else {
        *severity = NTR_SEVERITY_PROFOUND;
    }
    return NTR_OK;
}

/* The class of an already range-checked osmolality. */
static int tonicity_of(double osm_mosm_kg)
{
    if (osm_mosm_kg < NTR_TONICITY_HYPOTONIC_BELOW) {
        return NTR_TONICITY_HYPOTONIC;
    }
    if (osm_mosm_kg > NTR_TONICITY_HYPERTONIC_ABOVE) {
        return NTR_TONICITY_HYPERTONIC;
    }
    return NTR_TONICITY_ISOTONIC;
}

int ntr_tonicity_class(double measured_osm_mosm_kg, int *tonicity)
{
    if (tonicity == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check(measured_osm_mosm_kg, NTR_OSM_MIN, NTR_OSM_MAX));
    *tonicity = tonicity_of(measured_osm_mosm_kg);
    return NTR_OK;
}

/* Ethanol's share of a freezing-point osmolality, mOsm/kg per mmol/L:
 * the empirical coefficient of Purssell et al., Ann Emerg Med 2001 (from
 * memory; docs/workup.md). Above the ideal 1.0 that ntr_osm_calculated()
 * uses: there the smaller value leaves the osmolal gap conservative, here
 * the larger one does, since it is subtracted and the floor below stops
 * any excess. */
#define ETHANOL_MOSM_PER_MMOL_L 1.25

/* The effective osmolality of checked inputs: measured minus urea and
 * ethanol, never below the calculated effective osmolality 2*Na + glucose
 * and never above the measured value. Sodium salts and glucose are
 * effective osmoles measured in the same sample, so a subtraction that
 * lands below what they supply removed more than the sample held (an
 * osmometer that does not see ethanol, a coefficient too high for this
 * patient, samples drawn apart, the errors of several assays adding up).
 * The floor is itself below 275 whenever 2*Na + glucose is, so it never
 * hides a hypotonicity that sodium and glucose show; and with no urea or
 * ethanol the result is the measured value, bit for bit. 2*Na + glucose
 * comes from ntr_osm_effective(), where that formula lives. */
static int effective_of_checked(double na_mmol_l, double glucose_mmol_l,
                                double urea_mmol_l, double ethanol_mmol_l,
                                double measured_osm_mosm_kg, double *mosm_kg)
{
    double calculated;
    double floor_mosm_kg;
    double subtracted;
    NTR_TRY(ntr_osm_effective(na_mmol_l, glucose_mmol_l, &calculated));
    floor_mosm_kg = calculated < measured_osm_mosm_kg ? calculated : measured_osm_mosm_kg;
    subtracted = measured_osm_mosm_kg -
                 (urea_mmol_l + ETHANOL_MOSM_PER_MMOL_L * ethanol_mmol_l);
    *mosm_kg = subtracted > floor_mosm_kg ? subtracted : floor_mosm_kg;
    return NTR_OK;
}

/* The numeric checks both effective-osmolality functions share, in
 * argument order. */
static int check_effective_inputs(double na_mmol_l, double glucose_mmol_l,
                                  double urea_mmol_l, double ethanol_mmol_l,
                                  double measured_osm_mosm_kg)
{
    NTR_TRY(ntr_check_na(na_mmol_l));
    NTR_TRY(ntr_check(glucose_mmol_l, 0.0, NTR_GLUCOSE_MAX));
    NTR_TRY(ntr_check(urea_mmol_l, 0.0, NTR_UREA_MAX));
    NTR_TRY(ntr_check(ethanol_mmol_l, 0.0, NTR_ETHANOL_MAX));
    return ntr_check(measured_osm_mosm_kg, NTR_OSM_MIN, NTR_OSM_MAX);
}

int ntr_effective_osm_measured(double na_mmol_l, double glucose_mmol_l,
                               double urea_mmol_l, double ethanol_mmol_l,
                               double measured_osm_mosm_kg, double *mosm_kg)
{
    if (mosm_kg == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(check_effective_inputs(na_mmol_l, glucose_mmol_l, urea_mmol_l,
                                   ethanol_mmol_l, measured_osm_mosm_kg));
    return effective_of_checked(na_mmol_l, glucose_mmol_l, urea_mmol_l,
                                ethanol_mmol_l, measured_osm_mosm_kg, mosm_kg);
}

/* The flags that explain a low sodium, judged on the effective class. */
static unsigned int low_na_flags(int effective_class, int glucose_explains)
{
    unsigned int found = glucose_explains ? NTR_LOW_NA_GLUCOSE_EXPLAINS : 0u;
    if (effective_class == NTR_TONICITY_HYPOTONIC) {
        return glucose_explains ? found | NTR_LOW_NA_DISCORDANT : found;
    }
    found |= NTR_LOW_NA_NOT_HYPOTONIC;
    if (effective_class == NTR_TONICITY_HYPERTONIC || glucose_explains) {
        return found | NTR_LOW_NA_TRANSLOCATIONAL;
    }
    return found | NTR_LOW_NA_PSEUDO;
}

int ntr_low_na_effective_tonicity(double na_mmol_l, double glucose_mmol_l,
                                  double urea_mmol_l, double ethanol_mmol_l,
                                  double measured_osm_mosm_kg, int glucose_method,
                                  int *tonicity, unsigned int *flags)
{
    double factor;
    double effective;
    int effective_class;
    unsigned int found = 0u;
    if (tonicity == NULL || flags == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntri_glucose_factor(glucose_method, &factor));
    NTR_TRY(check_effective_inputs(na_mmol_l, glucose_mmol_l, urea_mmol_l,
                                   ethanol_mmol_l, measured_osm_mosm_kg));
    NTR_TRY(effective_of_checked(na_mmol_l, glucose_mmol_l, urea_mmol_l,
                                 ethanol_mmol_l, measured_osm_mosm_kg, &effective));
    effective_class = tonicity_of(effective);

    if (na_mmol_l < SEVERITY_MILD_BELOW) {
        /* The inputs are checked: the same correction as
         * ntr_na_corrected_glucose() gives, without checking them again. */
        double na_corrected = ntri_glucose_corrected(na_mmol_l, glucose_mmol_l, factor);
        found = low_na_flags(effective_class, na_corrected >= SEVERITY_MILD_BELOW);
    }
    /* About the osmolality, not the sodium: set whatever the sodium, so a
     * hypotonic class beside a normal measured value is always explained. */
    if (measured_osm_mosm_kg >= NTR_TONICITY_HYPOTONIC_BELOW &&
        effective_class == NTR_TONICITY_HYPOTONIC) {
        found |= NTR_LOW_NA_INEFFECTIVE_OSMOLES;
    }
    *tonicity = effective_class;
    *flags = found;
    return NTR_OK;
}

int ntr_low_na_tonicity(double na_mmol_l, double glucose_mmol_l,
                        double measured_osm_mosm_kg, int glucose_method,
                        int *tonicity, unsigned int *flags)
{
    /* Without urea and ethanol the effective value is the measured one, so
     * this gives the 1.0 results bit for bit (tests/refvectors). */
    return ntr_low_na_effective_tonicity(na_mmol_l, glucose_mmol_l, 0.0, 0.0,
                                         measured_osm_mosm_kg, glucose_method,
                                         tonicity, flags);
}

int ntr_urine_maximally_dilute(double urine_osm_mosm_kg, int *dilute)
{
    if (dilute == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check(urine_osm_mosm_kg, NTR_URINE_OSM_MIN, NTR_URINE_OSM_MAX));
    *dilute = urine_osm_mosm_kg <= NTR_URINE_OSM_DILUTE_MAX;
    return NTR_OK;
}

int ntr_urine_na_high(double urine_na_mmol_l, int *high)
{
    if (high == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check(urine_na_mmol_l, 0.0, NTR_URINE_NA_MAX));
    *high = urine_na_mmol_l > NTR_URINE_NA_HIGH_ABOVE;
    return NTR_OK;
}

int ntr_fractional_excretion(double urine_x, double plasma_x,
                             double urine_creatinine, double plasma_creatinine,
                             double *percent)
{
    double denominator;
    double fraction;
    if (percent == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check(urine_x, 0.0, NTR_FE_INPUT_MAX));
    NTR_TRY(ntr_check(plasma_x, 0.0, NTR_FE_INPUT_MAX));
    NTR_TRY(ntr_check(urine_creatinine, 0.0, NTR_FE_INPUT_MAX));
    NTR_TRY(ntr_check(plasma_creatinine, 0.0, NTR_FE_INPUT_MAX));
    /* A zero plasma creatinine would give a finite 0%, which reads as a
     * result; it only ever means a missing value, so it is refused too. */
    if (plasma_x == 0.0 || urine_creatinine == 0.0 || plasma_creatinine == 0.0) {
        return NTR_ERR_DOMAIN;
    }
    /* The unit is the caller's, so there is no positive lower bound; a
     * denominator near the smallest doubles can underflow to 0 or push the
     * quotient past the largest double. Neither is a fraction. */
    denominator = plasma_x * urine_creatinine;
    if (denominator == 0.0) {
        return NTR_ERR_DOMAIN; /* checked first: never divide by zero */
    }
    fraction = 100.0 * (urine_x * plasma_creatinine) / denominator;
    if (!isfinite(fraction)) {
        return NTR_ERR_DOMAIN;
    }
    *percent = fraction;
    return NTR_OK;
}

/* ---- SIAD criteria ------------------------------------------------------ */

int ntr_siad_findings_init(ntr_siad_findings *findings)
{
    const ntr_finding_value unknown = {0, 0, 0.0};
    if (findings == NULL) {
        return NTR_ERR_NULL;
    }
    findings->struct_size = sizeof(ntr_siad_findings);
    findings->effective_osm_mosm_kg = unknown;
    findings->urine_osm_mosm_kg = unknown;
    findings->urine_na_mmol_l = unknown;
    findings->volume_status = NTR_VOLUME_UNKNOWN;
    findings->normal_salt_water_intake = NTR_FINDING_UNKNOWN;
    findings->thyroid_normal = NTR_FINDING_UNKNOWN;
    findings->adrenal_normal = NTR_FINDING_UNKNOWN;
    findings->pituitary_normal = NTR_FINDING_UNKNOWN;
    findings->kidney_normal = NTR_FINDING_UNKNOWN;
    findings->recent_diuretic = NTR_FINDING_UNKNOWN;
    findings->saline_corrected = NTR_FINDING_UNKNOWN;
    findings->restriction_corrected = NTR_FINDING_UNKNOWN;
    findings->reserved = 0;
    findings->uric_acid_mmol_l = unknown;
    findings->urea_mmol_l = unknown;
    findings->fe_na_percent = unknown;
    findings->fe_urea_percent = unknown;
    findings->fe_uric_acid_percent = unknown;
    return NTR_OK;
}

static int check_known_flag(const ntr_finding_value *v)
{
    return (v->known == 0 || v->known == 1) ? NTR_OK : NTR_ERR_ARG;
}

static int check_tristate(int answer)
{
    return (answer >= NTR_FINDING_UNKNOWN && answer <= NTR_FINDING_YES)
               ? NTR_OK
               : NTR_ERR_ARG;
}

static int check_known_value(const ntr_finding_value *v, double lo, double hi)
{
    return v->known ? ntr_check(v->value, lo, hi) : NTR_OK;
}

/* Every enumerator-like member: NTR_ERR_ARG on the first bad one. */
static int check_siad_enumerators(const ntr_siad_findings *f)
{
    NTR_TRY(check_known_flag(&f->effective_osm_mosm_kg));
    NTR_TRY(check_known_flag(&f->urine_osm_mosm_kg));
    NTR_TRY(check_known_flag(&f->urine_na_mmol_l));
    if (f->volume_status < NTR_VOLUME_UNKNOWN ||
        f->volume_status > NTR_VOLUME_HYPERVOLAEMIC) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(check_tristate(f->normal_salt_water_intake));
    NTR_TRY(check_tristate(f->thyroid_normal));
    NTR_TRY(check_tristate(f->adrenal_normal));
    NTR_TRY(check_tristate(f->pituitary_normal));
    NTR_TRY(check_tristate(f->kidney_normal));
    NTR_TRY(check_tristate(f->recent_diuretic));
    NTR_TRY(check_tristate(f->saline_corrected));
    NTR_TRY(check_tristate(f->restriction_corrected));
    NTR_TRY(check_known_flag(&f->uric_acid_mmol_l));
    NTR_TRY(check_known_flag(&f->urea_mmol_l));
    NTR_TRY(check_known_flag(&f->fe_na_percent));
    NTR_TRY(check_known_flag(&f->fe_urea_percent));
    return check_known_flag(&f->fe_uric_acid_percent);
}

/* Known values in member order: NTR_ERR_NONFINITE or NTR_ERR_RANGE. */
static int check_siad_values(const ntr_siad_findings *f)
{
    NTR_TRY(check_known_value(&f->effective_osm_mosm_kg, NTR_OSM_MIN, NTR_OSM_MAX));
    NTR_TRY(check_known_value(&f->urine_osm_mosm_kg, NTR_URINE_OSM_MIN,
                              NTR_URINE_OSM_MAX));
    NTR_TRY(check_known_value(&f->urine_na_mmol_l, 0.0, NTR_URINE_NA_MAX));
    NTR_TRY(check_known_value(&f->uric_acid_mmol_l, 0.0, NTR_URIC_ACID_MAX));
    NTR_TRY(check_known_value(&f->urea_mmol_l, 0.0, NTR_UREA_MAX));
    NTR_TRY(check_known_value(&f->fe_na_percent, 0.0, NTR_FE_PERCENT_MAX));
    NTR_TRY(check_known_value(&f->fe_urea_percent, 0.0, NTR_FE_PERCENT_MAX));
    return check_known_value(&f->fe_uric_acid_percent, 0.0, NTR_FE_PERCENT_MAX);
}

/* The state of one criterion while the result is assembled. */
enum criterion_state { STATE_MET, STATE_NOT_MET, STATE_NOT_KNOWN, STATE_NOT_ASSESSABLE };

/* Masks built criterion by criterion; copied to the caller at the end so
 * nothing is written on error. */
struct tally {
    unsigned long evaluated;
    unsigned long met;
    unsigned long not_met;
    unsigned long not_known;
    unsigned long not_assessable;
    unsigned long missing;
};

static unsigned long bit(int number)
{
    return 1ul << number;
}

static void record(struct tally *t, int criterion, enum criterion_state state)
{
    t->evaluated |= bit(criterion);
    switch (state) {
    case STATE_MET: t->met |= bit(criterion); break;
    case STATE_NOT_MET: t->not_met |= bit(criterion); break;
    case STATE_NOT_KNOWN: t->not_known |= bit(criterion); break;
    case STATE_NOT_ASSESSABLE: t->not_assessable |= bit(criterion); break;
    }
}

/* A criterion "value < limit" (below = 1) or "value > limit" (below = 0). */
static void value_criterion(struct tally *t, int criterion,
                            const ntr_finding_value *v, double limit, int below)
{
    if (!v->known) {
        record(t, criterion, STATE_NOT_KNOWN);
        t->missing |= bit(criterion);
    } else if (below ? v->value < limit : v->value > limit) {
        record(t, criterion, STATE_MET);
    } else {
        record(t, criterion, STATE_NOT_MET);
    }
}

/* A yes/no finding; the criterion is met when the answer equals `wanted`. */
static void answer_criterion(struct tally *t, int criterion, int answer, int wanted)
{
    if (answer == NTR_FINDING_UNKNOWN) {
        record(t, criterion, STATE_NOT_KNOWN);
        t->missing |= bit(criterion);
    } else {
        record(t, criterion, answer == wanted ? STATE_MET : STATE_NOT_MET);
    }
}

static void volume_criterion(struct tally *t, int volume_status)
{
    if (volume_status == NTR_VOLUME_UNKNOWN) {
        record(t, NTR_SIAD_EUVOLAEMIA, STATE_NOT_KNOWN);
        t->missing |= bit(NTR_SIAD_EUVOLAEMIA);
    } else {
        record(t, NTR_SIAD_EUVOLAEMIA, volume_status == NTR_VOLUME_EUVOLAEMIC
                                           ? STATE_MET
                                           : STATE_NOT_MET);
    }
}

/* Urine sodium > 30 counts only on normal salt and water intake: a low
 * intake lowers urine sodium and a high one (or saline) raises it. */
static void urine_na_criterion(struct tally *t, const ntr_siad_findings *f)
{
    int intake = f->normal_salt_water_intake;
    if (intake == NTR_FINDING_NO) {
        record(t, NTR_SIAD_URINE_NA_HIGH, STATE_NOT_ASSESSABLE);
        return;
    }
    if (!f->urine_na_mmol_l.known || intake == NTR_FINDING_UNKNOWN) {
        record(t, NTR_SIAD_URINE_NA_HIGH, STATE_NOT_KNOWN);
        if (!f->urine_na_mmol_l.known) {
            t->missing |= bit(NTR_SIAD_URINE_NA_HIGH);
        }
        if (intake == NTR_FINDING_UNKNOWN) {
            t->missing |= bit(NTR_SIAD_INTAKE_NORMAL);
        }
        return;
    }
    record(t, NTR_SIAD_URINE_NA_HIGH,
           f->urine_na_mmol_l.value > SIAD_URINE_NA_ABOVE ? STATE_MET : STATE_NOT_MET);
}

static int popcount(unsigned long x)
{
    int n = 0;
    while (x != 0ul) {
        x &= x - 1ul;
        n++;
    }
    return n;
}

int ntr_siad_evaluate(const ntr_siad_findings *findings, ntr_siad_result *result)
{
    struct tally t = {0ul, 0ul, 0ul, 0ul, 0ul, 0ul};
    unsigned long essential_unsettled;
    int verdict;
    if (findings == NULL || result == NULL) {
        return NTR_ERR_NULL;
    }
    if (findings->struct_size < FINDINGS_V1_SIZE ||
        result->struct_size < RESULT_V1_SIZE) {
        return NTR_ERR_ARG;
    }
    NTR_TRY(check_siad_enumerators(findings));
    NTR_TRY(check_siad_values(findings));

    /* Essential criteria. */
    value_criterion(&t, NTR_SIAD_OSM_LOW, &findings->effective_osm_mosm_kg,
                    NTR_TONICITY_HYPOTONIC_BELOW, 1);
    value_criterion(&t, NTR_SIAD_URINE_CONCENTRATED, &findings->urine_osm_mosm_kg,
                    SIAD_URINE_OSM_ABOVE, 0);
    volume_criterion(&t, findings->volume_status);
    urine_na_criterion(&t, findings);
    answer_criterion(&t, NTR_SIAD_THYROID_NORMAL, findings->thyroid_normal, NTR_FINDING_YES);
    answer_criterion(&t, NTR_SIAD_ADRENAL_NORMAL, findings->adrenal_normal, NTR_FINDING_YES);
    answer_criterion(&t, NTR_SIAD_PITUITARY_NORMAL, findings->pituitary_normal, NTR_FINDING_YES);
    answer_criterion(&t, NTR_SIAD_KIDNEY_NORMAL, findings->kidney_normal, NTR_FINDING_YES);
    answer_criterion(&t, NTR_SIAD_NO_DIURETIC, findings->recent_diuretic, NTR_FINDING_NO);

    /* Supplemental criteria. */
    value_criterion(&t, NTR_SIAD_URIC_ACID_LOW, &findings->uric_acid_mmol_l,
                    SIAD_URIC_ACID_BELOW, 1);
    value_criterion(&t, NTR_SIAD_UREA_LOW, &findings->urea_mmol_l, SIAD_UREA_BELOW, 1);
    answer_criterion(&t, NTR_SIAD_SALINE_FAILS, findings->saline_corrected, NTR_FINDING_NO);
    value_criterion(&t, NTR_SIAD_FE_NA_HIGH, &findings->fe_na_percent, SIAD_FE_NA_ABOVE, 0);
    value_criterion(&t, NTR_SIAD_FE_UREA_HIGH, &findings->fe_urea_percent,
                    SIAD_FE_UREA_ABOVE, 0);
    value_criterion(&t, NTR_SIAD_FE_URIC_ACID_HIGH, &findings->fe_uric_acid_percent,
                    SIAD_FE_URIC_ACID_ABOVE, 0);
    answer_criterion(&t, NTR_SIAD_RESTRICTION_CORRECTS, findings->restriction_corrected,
                     NTR_FINDING_YES);

    essential_unsettled = (t.not_known | t.not_assessable) & NTR_SIAD_ESSENTIAL_BITS;
    if ((t.not_met & NTR_SIAD_ESSENTIAL_BITS) != 0ul) {
        verdict = NTR_SIAD_NOT_CONSISTENT;
    } else if (essential_unsettled != 0ul) {
        verdict = NTR_SIAD_INCOMPLETE;
    } else {
        verdict = NTR_SIAD_CONSISTENT;
    }

    result->verdict = verdict;
    result->supplemental_met_count = popcount(t.met & NTR_SIAD_SUPPLEMENTAL_BITS);
    result->evaluated = t.evaluated;
    result->met = t.met;
    result->not_met = t.not_met;
    result->not_known = t.not_known;
    result->not_assessable = t.not_assessable;
    result->missing = t.missing;
    return NTR_OK;
}

/* ---- fractional uric acid excretion (Fenske et al. 2008) ----------------- */

/* The class of an already range-checked percentage. Both edges strict, as
 * the source writes them. */
static int fe_uric_acid_class_of(double percent)
{
    if (percent > NTR_FE_URIC_ACID_HIGH_ABOVE) {
        return NTR_FE_URIC_ACID_SUPPORTS_SIAD;
    }
    if (percent < NTR_FE_URIC_ACID_LOW_BELOW) {
        return NTR_FE_URIC_ACID_AGAINST_SIAD;
    }
    return NTR_FE_URIC_ACID_INDETERMINATE;
}

int ntr_fe_uric_acid_class(double fe_uric_acid_percent, int *fe_class)
{
    if (fe_class == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check(fe_uric_acid_percent, 0.0, NTR_FE_PERCENT_MAX));
    *fe_class = fe_uric_acid_class_of(fe_uric_acid_percent);
    return NTR_OK;
}

/* The reading of checked inputs. "Corrected" is the end of hyponatraemia
 * in the severity bands, so the two functions agree on when a sodium is
 * no longer low. */
static int uric_acid_course_of(double fe_low_na_percent, double fe_corrected_percent,
                               double na_corrected_mmol_l)
{
    int after;
    if (na_corrected_mmol_l < SEVERITY_MILD_BELOW) {
        return NTR_URIC_ACID_COURSE_NOT_CORRECTED;
    }
    if (fe_uric_acid_class_of(fe_low_na_percent) != NTR_FE_URIC_ACID_SUPPORTS_SIAD) {
        return NTR_URIC_ACID_COURSE_NOT_HIGH_BEFORE;
    }
    after = fe_uric_acid_class_of(fe_corrected_percent);
    if (after == NTR_FE_URIC_ACID_SUPPORTS_SIAD) {
        return NTR_URIC_ACID_COURSE_PERSISTENT_HIGH;
    }
    return after == NTR_FE_URIC_ACID_AGAINST_SIAD ? NTR_URIC_ACID_COURSE_NORMALISED
                                                  : NTR_URIC_ACID_COURSE_UNSETTLED;
}

int ntr_fe_uric_acid_after_correction(double fe_low_na_percent,
                                      double fe_corrected_percent,
                                      double na_corrected_mmol_l, int *course)
{
    if (course == NULL) {
        return NTR_ERR_NULL;
    }
    NTR_TRY(ntr_check(fe_low_na_percent, 0.0, NTR_FE_PERCENT_MAX));
    NTR_TRY(ntr_check(fe_corrected_percent, 0.0, NTR_FE_PERCENT_MAX));
    NTR_TRY(ntr_check_na(na_corrected_mmol_l));
    *course = uric_acid_course_of(fe_low_na_percent, fe_corrected_percent,
                                  na_corrected_mmol_l);
    return NTR_OK;
}
