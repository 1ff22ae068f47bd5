/* SPDX-License-Identifier: MIT */
/* FHIR R4 Observations, one JSON object per line (NDJSON, as a bulk export
 * writes them); course_cli.h, docs/cli.md. A line is a sodium result when
 * code.coding holds LOINC 2951-2 (serum or plasma) or 2947-0 (blood);
 * other resources and other codes are skipped and counted. */
#include "course_cli.h"
#include "json_lite.h"

#include <natremia.h>

#include <stdlib.h>
#include <string.h>

/* Values of one line fit in this many nodes; a longer line is refused. */
#define NC_FHIR_NODES 4096
#define NC_FHIR_TEXT 512 /* longest id, code, unit or date-time read */

static const char loinc_system[] = "http://loinc.org";
static const char *const sodium_codes[] = {"2951-2", "2947-0"};

struct nc_fhir {
    nc_table *t;
    jl_doc doc;
    size_t not_observation, other_code, withdrawn;
};

nc_fhir *nc_fhir_new(nc_table *t)
{
    nc_fhir *f = calloc(1, sizeof *f);
    if (f == NULL) return NULL;
    f->doc.node = malloc(NC_FHIR_NODES * sizeof *f->doc.node);
    if (f->doc.node == NULL) {
        free(f);
        return NULL;
    }
    f->doc.cap = NC_FHIR_NODES;
    f->t = t;
    t->timed = 1; /* effectiveDateTime: hours counted from each patient's first */
    snprintf(t->time_place, sizeof t->time_place, "member effectiveDateTime");
    snprintf(t->sodium_place, sizeof t->sodium_place, "member valueQuantity.value");
    return f;
}

void nc_fhir_free(nc_fhir *f)
{
    if (f == NULL) return;
    free(f->doc.node);
    free(f);
}

/* The string at path, or NULL (absent, not a string, or undecodable). */
static const char *text_at(const nc_fhir *f, long from, const char *path, char *buf)
{
    long v = jl_path(&f->doc, from, path);
    return v >= 0 && jl_string(&f->doc, v, buf, NC_FHIR_TEXT) == 0 ? buf : NULL;
}

/* Whether code.coding names a sodium code of LOINC. */
static int is_sodium(const nc_fhir *f, long root)
{
    char system[NC_FHIR_TEXT], code[NC_FHIR_TEXT];
    long coding = jl_path(&f->doc, root, "code.coding"), c;
    size_t k;
    if (coding < 0 || f->doc.node[coding].type != JL_ARRAY) return 0;
    for (c = f->doc.node[coding].child; c >= 0; c = f->doc.node[c].next) {
        if (text_at(f, c, "system", system) == NULL || strcmp(system, loinc_system) != 0) continue;
        if (text_at(f, c, "code", code) == NULL) continue;
        for (k = 0; k < sizeof sodium_codes / sizeof sodium_codes[0]; ++k)
            if (strcmp(code, sodium_codes[k]) == 0) return 1;
    }
    return 0;
}

/* Refuse a member that is absent, doubled or of the wrong kind. */
static void refuse_member(nc_fhir *f, size_t p, size_t line_no, const char *path, long v,
                          const char *wanted)
{
    if (v == -2) nc_refuse(f->t, p, line_no, "member", path, "appears twice");
    else nc_refuse(f->t, p, line_no, "member", path, "missing or not %s", wanted);
}

int nc_fhir_line(nc_fhir *f, const char *line, size_t len, size_t line_no)
{
    char buf[NC_FHIR_TEXT], subject[NC_FHIR_TEXT], when_text[NC_FHIR_TEXT], unit[NC_FHIR_TEXT];
    const char *when_member = "effectiveDateTime", *why = "";
    nc_table *t = f->t;
    nc_row row;
    long v, q;
    size_t p;
    double value;
    int st, unit_known;

    if (jl_parse(&f->doc, line, len) != 0) {
        char where[32];
        snprintf(where, sizeof where, "%zu", f->doc.error_at + 1);
        nc_refuse(t, NC_NO_PATIENT, line_no, "character", where, "not JSON: %s", f->doc.error);
        return 0;
    }
    if (f->doc.node[0].type != JL_OBJECT) {
        nc_refuse(t, NC_NO_PATIENT, line_no, "character", "1", "not a JSON object");
        return 0;
    }
    if (text_at(f, 0, "resourceType", buf) == NULL || strcmp(buf, "Observation") != 0) {
        f->not_observation++;
        t->skipped++;
        return 0;
    }
    if (!is_sodium(f, 0)) {
        f->other_code++;
        t->skipped++;
        return 0;
    }
    /* a result withdrawn or never made is not a measurement */
    if (text_at(f, 0, "status", buf) != NULL &&
        (strcmp(buf, "entered-in-error") == 0 || strcmp(buf, "cancelled") == 0)) {
        f->withdrawn++;
        t->skipped++;
        return 0;
    }
    v = jl_path(&f->doc, 0, "subject.reference");
    if (text_at(f, 0, "subject.reference", subject) == NULL || subject[0] == '\0') {
        refuse_member(f, NC_NO_PATIENT, line_no, "subject.reference", v, "a string");
        return 0;
    }
    if ((p = nc_table_patient(t, subject)) == NC_NO_PATIENT) return 0;

    memset(&row, 0, sizeof row);
    row.patient = p;
    row.line = line_no;
    if (jl_member(&f->doc, 0, when_member) == -1 && jl_member(&f->doc, 0, "effectiveInstant") != -1)
        when_member = "effectiveInstant";
    v = jl_member(&f->doc, 0, when_member);
    if (text_at(f, 0, when_member, when_text) == NULL) {
        refuse_member(f, p, line_no, when_member, v, "a string (effectivePeriod is not read)");
        return 0;
    }
    if (nc_parse_datetime(when_text, &row.when, &why) != 0) {
        nc_refuse(t, p, line_no, "member", when_member, "'%s': %s", when_text, why);
        return 0;
    }
    q = jl_member(&f->doc, 0, "valueQuantity");
    if (q < 0 || f->doc.node[q].type != JL_OBJECT) {
        refuse_member(f, p, line_no, "valueQuantity", q, "an object");
        return 0;
    }
    if (jl_member(&f->doc, q, "comparator") != -1) {
        nc_refuse(t, p, line_no, "member", "valueQuantity.comparator", "a bound (<, >), not a measured value");
        return 0;
    }
    v = jl_member(&f->doc, q, "value");
    if (jl_number(&f->doc, v, &value) != 0) {
        refuse_member(f, p, line_no, "valueQuantity.value", v, "a number");
        return 0;
    }
    /* the UCUM code when given, else the printed unit */
    if (text_at(f, q, "code", unit) == NULL && text_at(f, q, "unit", unit) == NULL) {
        nc_refuse(t, p, line_no, "member", "valueQuantity.code", "no unit (code or unit)");
        return 0;
    }
    st = nc_sodium_to_mmol_l(value, unit, &row.na_mmol_l, &unit_known);
    if (!unit_known) {
        nc_refuse(t, p, line_no, "member", "valueQuantity.code", "unit '%s' is not mmol/L or mEq/L", unit);
        return 0;
    }
    if (st != NTR_OK) {
        nc_refuse(t, p, line_no, "member", "valueQuantity.value", "%g: %s", value, ntr_status_message(st));
        return 0;
    }
    (void)nc_table_add(t, &row, when_text);
    return 0;
}

void nc_fhir_report(const nc_fhir *f, FILE *to)
{
    const char *sep = "";
    size_t all = f->not_observation + f->other_code + f->withdrawn;
    if (all == 0) return;
    fprintf(to, "%s: %s: skipped %zu line(s):", NC_PROGRAM, f->t->source, all);
    if (f->not_observation) fprintf(to, " %zu not an Observation", f->not_observation), sep = ",";
    if (f->other_code) fprintf(to, "%s %zu not LOINC 2951-2 or 2947-0", sep, f->other_code), sep = ",";
    if (f->withdrawn) fprintf(to, "%s %zu entered-in-error or cancelled", sep, f->withdrawn);
    fputc('\n', to);
}
