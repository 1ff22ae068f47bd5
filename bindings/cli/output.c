/* SPDX-License-Identifier: MIT */
/* CSV and JSON writers of natremia-course (course_cli.h, docs/cli.md).
 * Numbers are written in the fewest digits that read back as the same
 * double, so a script gets the library's figures exactly. */
#include "course_cli.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

/* Flag names, in bit order; the Python binding uses the same words
 * (bindings/python/natremia/_course.py, FLAG_LABELS). */
static const struct { unsigned int bit; const char *name; } flag_names[] = {
    {NTR_CF_OVER_24H, "rise_over_24h"},
    {NTR_CF_OVER_48H, "rise_over_48h"},
    {NTR_CF_BELOW_TARGET, "below_target"},
    {NTR_CF_FALLING, "falling"},
    {NTR_CF_NEAR_LIMIT, "near_limit"},
    {NTR_CF_PROJECTED_OVER, "projected_over"},
    {NTR_CF_RAPID_6H, "rapid_6h"},
    {NTR_CF_FALL_OVER_24H, "fall_over_24h"},
    {NTR_CF_FALL_OVER_48H, "fall_over_48h"},
    {NTR_CF_WRONG_WAY, "wrong_way"},
    {NTR_CF_APPROXIMATE, "approximate"},
    {NTR_CF_FALL_NEAR_LIMIT, "fall_near_limit"},
    {NTR_CF_FALL_PROJECTED_OVER, "fall_projected_over"},
};
#define FLAG_COUNT (sizeof flag_names / sizeof flag_names[0])

/* The report's figures, in output order (the member names of
 * ntr_course_report; mmol/L, hours, mmol/L/h). */
static const char *const figure_names[] = {
    "elapsed_h", "max_rise_24h", "max_rise_48h", "max_fall_24h", "max_fall_48h",
    "rise_first_24h", "fall_first_24h", "rise_now_24h", "fall_now_24h",
    "last_rate_per_h", "excess_mmol_l",
};
#define FIGURE_COUNT (sizeof figure_names / sizeof figure_names[0])

static void figures(const ntr_course_report *r, double v[FIGURE_COUNT])
{
    v[0] = r->elapsed_h;
    v[1] = r->max_rise_24h;
    v[2] = r->max_rise_48h;
    v[3] = r->max_fall_24h;
    v[4] = r->max_fall_48h;
    v[5] = r->rise_first_24h;
    v[6] = r->fall_first_24h;
    v[7] = r->rise_now_24h;
    v[8] = r->fall_now_24h;
    v[9] = r->last_rate_per_h;
    v[10] = r->excess_mmol_l;
}

/* The shortest %g text that strtod reads back as v (15 digits usually). */
static void number(FILE *out, double v)
{
    char buf[40];
    int digits;
    if (v == 0.0) v = fabs(v); /* no "-0" */
    for (digits = 15; digits < 17; ++digits) {
        snprintf(buf, sizeof buf, "%.*g", digits, v);
        if (strtod(buf, NULL) == v) break;
    }
    if (digits == 17) snprintf(buf, sizeof buf, "%.17g", v);
    fputs(buf, out);
}

/* A CSV field, quoted when it holds a comma, quote, line break or edge
 * space, or starts with # (a row would otherwise read as a comment). */
static void csv_text(FILE *out, const char *s)
{
    size_t n = strlen(s);
    if (strpbrk(s, ",\"\r\n") == NULL && (n == 0 || (s[0] != ' ' && s[0] != '#' && s[n - 1] != ' '))) {
        fputs(s, out);
        return;
    }
    fputc('"', out);
    for (; *s != '\0'; ++s) {
        if (*s == '"') fputc('"', out);
        fputc(*s, out);
    }
    fputc('"', out);
}

static void json_text(FILE *out, const char *s)
{
    fputc('"', out);
    for (; *s != '\0'; ++s) {
        unsigned char c = (unsigned char)*s;
        if (c == '"' || c == '\\') fprintf(out, "\\%c", c);
        else if (c == '\n') fputs("\\n", out);
        else if (c == '\t') fputs("\\t", out);
        else if (c < 0x20 || c == 0x7f) fprintf(out, "\\u%04x", c);
        else fputc(c, out);
    }
    fputc('"', out);
}

static void flag_list(FILE *out, unsigned int flags, int json)
{
    size_t k;
    int first = 1;
    for (k = 0; k < FLAG_COUNT; ++k) {
        if (!(flags & flag_names[k].bit)) continue;
        if (!first) fputs(json ? ", " : " ", out);
        if (json) json_text(out, flag_names[k].name);
        else fputs(flag_names[k].name, out);
        first = 0;
    }
}

static void limit(FILE *out, const char *what, double v)
{
    fprintf(out, "%s ", what);
    if (v > 0.0) number(out, v);
    else fputs("none", out);
}

void nc_out_begin(nc_writer *w, const nc_setup *s)
{
    FILE *out = w->out;
    const ntr_course_limits *l = &s->limits;
    size_t k;
    if (w->json) {
        fputs("{\n  \"caution\": ", out);
        json_text(out, "Caution: " NC_CAUTION ".");
        fprintf(out, ",\n  \"program\": \"%s\",\n  \"library_version\": ", NC_PROGRAM);
        json_text(out, ntr_version_string());
        fputs(",\n  \"limits\": {\"preset\": ", out);
        json_text(out, s->preset_name);
        fputs(", \"goal\": ", out);
        json_text(out, s->goal_name);
        fputs(", \"max_rise_24h\": ", out);
        number(out, l->max_rise_24h);
        fputs(", \"max_rise_48h\": ", out);
        number(out, l->max_rise_48h);
        fputs(", \"max_fall_24h\": ", out);
        number(out, l->max_fall_24h);
        fputs(", \"max_fall_48h\": ", out);
        number(out, l->max_fall_48h);
        fputs(", \"min_change_24h\": ", out);
        number(out, l->min_change_24h);
        fputs("},\n  \"patients\": [", out);
        return;
    }
    fprintf(out, "# caution: %s.\n", NC_CAUTION);
    fprintf(out, "# %s, natremia %s; limits %s, goal %s (mmol/L): ", NC_PROGRAM,
            ntr_version_string(), s->preset_name, s->goal_name);
    limit(out, "rise 24 h", l->max_rise_24h);
    limit(out, ", rise 48 h", l->max_rise_48h);
    limit(out, ", fall 24 h", l->max_fall_24h);
    limit(out, ", fall 48 h", l->max_fall_48h);
    limit(out, ", target 24 h", l->min_change_24h);
    fputs("\npatient,status,samples,origin", out);
    for (k = 0; k < FIGURE_COUNT; ++k) fprintf(out, ",%s", figure_names[k]);
    fputs(",worst_at_h,flag_bits,flags,error\n", out);
}

static void patient_csv(FILE *out, const nc_result *r)
{
    double v[FIGURE_COUNT];
    size_t k;
    csv_text(out, r->patient->id);
    fprintf(out, ",%s,%zu,", r->assessed ? "assessed" : "refused", r->patient->rows);
    csv_text(out, r->patient->origin != NULL ? r->patient->origin : "");
    if (!r->assessed) {
        for (k = 0; k < FIGURE_COUNT + 3; ++k) fputc(',', out);
        fputc(',', out);
        csv_text(out, r->error != NULL ? r->error : "");
        fputc('\n', out);
        return;
    }
    figures(&r->report, v);
    for (k = 0; k < FIGURE_COUNT; ++k) {
        fputc(',', out);
        number(out, v[k]);
    }
    fputc(',', out);
    if (r->report.worst_at_h != NTR_COURSE_NO_TIME) number(out, r->report.worst_at_h);
    fprintf(out, ",%u,", r->report.flags);
    flag_list(out, r->report.flags, 0);
    fputs(",\n", out);
}

static void patient_json(FILE *out, const nc_result *r)
{
    double v[FIGURE_COUNT];
    size_t k;
    fputs("    {\"patient\": ", out);
    json_text(out, r->patient->id);
    fprintf(out, ", \"status\": \"%s\", \"samples\": %zu, \"origin\": ",
            r->assessed ? "assessed" : "refused", r->patient->rows);
    if (r->patient->origin != NULL) json_text(out, r->patient->origin);
    else fputs("null", out);
    if (!r->assessed) {
        fputs(", \"error\": ", out);
        json_text(out, r->error != NULL ? r->error : "");
        fputs("}", out);
        return;
    }
    figures(&r->report, v);
    for (k = 0; k < FIGURE_COUNT; ++k) {
        fprintf(out, ", \"%s\": ", figure_names[k]);
        number(out, v[k]);
    }
    fputs(", \"worst_at_h\": ", out);
    if (r->report.worst_at_h != NTR_COURSE_NO_TIME) number(out, r->report.worst_at_h);
    else fputs("null", out);
    fprintf(out, ", \"flag_bits\": %u, \"flags\": [", r->report.flags);
    flag_list(out, r->report.flags, 1);
    fputs("], \"error\": null}", out);
}

void nc_out_patient(nc_writer *w, const nc_result *r)
{
    if (w->json) {
        fputs(w->written ? ",\n" : "\n", w->out);
        patient_json(w->out, r);
    } else {
        patient_csv(w->out, r);
    }
    w->written++;
}

void nc_out_end(nc_writer *w, size_t assessed, size_t refused_patients, size_t refused_rows)
{
    if (!w->json) return;
    fprintf(w->out, "%s],\n  \"assessed\": %zu,\n  \"refused_patients\": %zu,\n"
            "  \"refused_rows\": %zu\n}\n", w->written ? "\n  " : "", assessed,
            refused_patients, refused_rows);
}
