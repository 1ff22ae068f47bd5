/* SPDX-License-Identifier: MIT */
/* natremia-course: assess each patient's sodium course from a CSV or FHIR
 * NDJSON file with ntr_course_assess() and print one row per patient
 * (docs/cli.md). The library decides every figure and every refusal; this
 * program only reads, groups, names the failing line and column, and
 * writes. */
#include "course_cli.h"

#include <stdlib.h>
#include <string.h>

static const char usage_text[] =
    "usage: " NC_PROGRAM " (--goal raise|lower|hold | --preset NAME) [options] [FILE]\n"
    "\n"
    "Assess each patient's serum sodium course in FILE (or standard input, or\n"
    "'-') against limits on its rise and fall in any 24 h and 48 h, and print\n"
    "one row per patient.\n"
    "\n"
    "Input (detected from the first line, or set with --input):\n"
    "  csv     a header line, then one result a line; columns found by name:\n"
    "          patient, sodium (mmol/L), and either hours (a number) or time\n"
    "          (ISO 8601 with a zone, 2026-03-01T08:30+01:00); optional unit\n"
    "          (mmol/L or mEq/L). Lines starting with # are comments.\n"
    "  ndjson  FHIR R4 Observations, one a line; LOINC 2951-2 or 2947-0,\n"
    "          valueQuantity in mmol/L or mEq/L, subject.reference,\n"
    "          effectiveDateTime. Other lines are skipped and counted.\n"
    "Date-times become hours since the patient's first result.\n"
    "\n"
    "Limits (one of --goal or --preset is required):\n"
    "  --goal raise|lower|hold   the direction the sodium should take; alone it\n"
    "                            picks the preset hypo_standard, hyper_chronic or hold\n"
    "  --preset NAME             hypo_standard, hypo_high_risk, hyper_chronic,\n"
    "                            hyper_acute or hold\n"
    "  --max-rise-24h N, --max-rise-48h N, --max-fall-24h N, --max-fall-48h N,\n"
    "  --min-change-24h N        change one limit of the preset (mmol/L; 0 = none)\n"
    "\n"
    "Other options:\n"
    "  --format csv|json         output format (default csv)\n"
    "  --input auto|csv|ndjson   input format (default auto)\n"
    "  --column ROLE=NAME        read CSV column NAME as ROLE (patient, hours,\n"
    "                            time, sodium or unit)\n"
    "  --help, --version\n"
    "\n"
    "Exit status: 0 every patient assessed; 1 some rows or patients refused\n"
    "(each named on standard error by line and column; the others printed);\n"
    "2 a usage error; 3 the input cannot be read or used.\n"
    "\n"
    "Caution: " NC_CAUTION ".\n";

static const struct { const char *name; int preset; int goal; } presets[] = {
    {"hypo_standard", NTR_COURSE_HYPO_STANDARD, NTR_GOAL_RAISE},
    {"hypo_high_risk", NTR_COURSE_HYPO_HIGH_RISK, NTR_GOAL_RAISE},
    {"hyper_chronic", NTR_COURSE_HYPER_CHRONIC, NTR_GOAL_LOWER},
    {"hyper_acute", NTR_COURSE_HYPER_ACUTE, NTR_GOAL_LOWER},
    {"hold", NTR_COURSE_HOLD, NTR_GOAL_HOLD},
};
#define PRESET_COUNT (sizeof presets / sizeof presets[0])

static const char *const goal_names[] = {"", "raise", "lower", "hold"};

/* What the command line asks for. */
typedef struct nc_options {
    int goal;                 /* NTR_GOAL_*, 0 unset */
    long preset;              /* index into presets, -1 unset */
    int json;
    int input;                /* 0 auto, 1 csv, 2 ndjson */
    const char *column[NC_ROLES];
    const char *file;
    int overridden[5];
    double override_value[5]; /* rise 24, rise 48, fall 24, fall 48, target */
} nc_options;

static const char *const override_option[5] = {
    "--max-rise-24h", "--max-rise-48h", "--max-fall-24h", "--max-fall-48h", "--min-change-24h"};

static int usage_error(const char *fmt, const char *what)
{
    fprintf(stderr, "%s: ", NC_PROGRAM);
    fprintf(stderr, fmt, what);
    fprintf(stderr, "\n(%s --help shows the usage)\n", NC_PROGRAM);
    return NC_EXIT_USAGE;
}

/* "--name value" or "--name=value": the value, or NULL when this is not
 * the option (*i moves past the value). */
static const char *option_value(int argc, char **argv, int *i, const char *name, int *missing)
{
    size_t n = strlen(name);
    const char *a = argv[*i];
    if (strncmp(a, name, n) != 0) return NULL;
    if (a[n] == '=') return a + n + 1;
    if (a[n] != '\0') return NULL;
    if (*i + 1 >= argc) {
        *missing = 1;
        return NULL;
    }
    return argv[++*i];
}

static int pick(const char *value, const char *const *words, int count)
{
    int k;
    for (k = 0; k < count; ++k)
        if (strcmp(value, words[k]) == 0) return k;
    return -1;
}

static int set_column(nc_options *o, const char *value)
{
    const char *eq = strchr(value, '=');
    int r;
    if (eq == NULL || eq[1] == '\0') return usage_error("--column '%s' is not ROLE=NAME", value);
    for (r = 0; r < NC_ROLES; ++r) {
        if (strlen(nc_role_word[r]) == (size_t)(eq - value) &&
            strncmp(value, nc_role_word[r], (size_t)(eq - value)) == 0) {
            o->column[r] = eq + 1;
            return 0;
        }
    }
    return usage_error("--column '%s': the role is not patient, hours, time, sodium or unit", value);
}

/* Returns -1 to go on, else the exit status (0 after --help/--version). */
static int parse_options(int argc, char **argv, nc_options *o)
{
    static const char *const formats[] = {"csv", "json"};
    static const char *const inputs[] = {"auto", "csv", "ndjson"};
    int i, k, operands_only = 0;
    memset(o, 0, sizeof *o);
    o->preset = -1;
    for (k = 0; k < NC_ROLES; ++k) o->column[k] = nc_role_word[k];
    for (i = 1; i < argc; ++i) {
        const char *a = argv[i], *v;
        int missing = 0, handled = 0;
        if (operands_only || a[0] != '-' || strcmp(a, "-") == 0) {
            if (o->file != NULL) return usage_error("one input file at most ('%s' is a second)", a);
            o->file = a;
            continue;
        }
        if (strcmp(a, "--") == 0) { operands_only = 1; continue; }
        if (strcmp(a, "--help") == 0 || strcmp(a, "-h") == 0) {
            fputs(usage_text, stdout);
            return NC_EXIT_OK;
        }
        if (strcmp(a, "--version") == 0) {
            printf("%s (natremia %s)\nCaution: %s.\n", NC_PROGRAM, ntr_version_string(), NC_CAUTION);
            return NC_EXIT_OK;
        }
        if ((v = option_value(argc, argv, &i, "--goal", &missing)) != NULL) {
            if ((k = pick(v, goal_names + 1, 3)) < 0) return usage_error("--goal '%s' is not raise, lower or hold", v);
            o->goal = k + 1;
            handled = 1;
        } else if (!missing && (v = option_value(argc, argv, &i, "--preset", &missing)) != NULL) {
            k = 0;
            while (k < (int)PRESET_COUNT && strcmp(v, presets[k].name) != 0) ++k;
            if (k == (int)PRESET_COUNT)
                return usage_error("--preset '%s' is not hypo_standard, hypo_high_risk, "
                                   "hyper_chronic, hyper_acute or hold", v);
            o->preset = k;
            handled = 1;
        } else if (!missing && (v = option_value(argc, argv, &i, "--format", &missing)) != NULL) {
            if ((k = pick(v, formats, 2)) < 0) return usage_error("--format '%s' is not csv or json", v);
            o->json = k == 1;
            handled = 1;
        } else if (!missing && (v = option_value(argc, argv, &i, "--input", &missing)) != NULL) {
            if ((k = pick(v, inputs, 3)) < 0) return usage_error("--input '%s' is not auto, csv or ndjson", v);
            o->input = k;
            handled = 1;
        } else if (!missing && (v = option_value(argc, argv, &i, "--column", &missing)) != NULL) {
            if (set_column(o, v) != 0) return NC_EXIT_USAGE;
            handled = 1;
        }
        for (k = 0; !handled && !missing && k < 5; ++k) {
            if ((v = option_value(argc, argv, &i, override_option[k], &missing)) == NULL) continue;
            if (nc_parse_decimal(v, &o->override_value[k]) != 0)
                return usage_error("'%s' is not a number", v);
            o->overridden[k] = 1;
            handled = 1;
        }
        if (missing) return usage_error("%s needs a value", a);
        if (!handled) return usage_error("unknown option '%s'", a);
    }
    if (o->goal == 0 && o->preset < 0)
        return usage_error("%s", "say which way the sodium should go: --goal raise|lower|hold or --preset NAME");
    return -1;
}

/* The limits: the preset (or the goal's usual one), then the overrides,
 * checked by the library on a one-sample series before any input is read. */
static int make_setup(const nc_options *o, nc_setup *s)
{
    static const ntr_sample probe = {0.0, 140.0};
    ntr_course_report r;
    double *member[5];
    long idx = o->preset;
    int k, st, changed = 0;
    if (idx < 0) { /* the goal's first preset */
        idx = 0;
        while (presets[idx].goal != o->goal) ++idx;
    }
    if (o->goal != 0 && presets[idx].goal != o->goal) {
        fprintf(stderr, "%s: --preset %s is for goal %s, not %s\n(%s --help shows the usage)\n",
                NC_PROGRAM, presets[idx].name, goal_names[presets[idx].goal],
                goal_names[o->goal], NC_PROGRAM);
        return NC_EXIT_USAGE;
    }
    if ((st = ntr_course_limits_preset(presets[idx].preset, &s->limits)) != NTR_OK) {
        fprintf(stderr, "%s: preset %s: %s\n", NC_PROGRAM, presets[idx].name, ntr_status_message(st));
        return NC_EXIT_USAGE;
    }
    member[0] = &s->limits.max_rise_24h;
    member[1] = &s->limits.max_rise_48h;
    member[2] = &s->limits.max_fall_24h;
    member[3] = &s->limits.max_fall_48h;
    member[4] = &s->limits.min_change_24h;
    for (k = 0; k < 5; ++k) {
        if (!o->overridden[k]) continue;
        *member[k] = o->override_value[k];
        changed = 1;
    }
    s->preset_name = changed ? "custom" : presets[idx].name;
    s->goal_name = goal_names[s->limits.goal];
    r.struct_size = sizeof r;
    if ((st = ntr_course_assess(&probe, 1, &s->limits, &r)) != NTR_OK) {
        fprintf(stderr, "%s: the limits are refused: %s (each 0 to 50 mmol/L, 24 h at most the "
                "48 h limit, the target at most the goal's limit)\n", NC_PROGRAM, ntr_status_message(st));
        return NC_EXIT_USAGE;
    }
    return 0;
}

/* ---- reading ----------------------------------------------------------- */

static int blank(const char *line, size_t len)
{
    size_t k;
    for (k = 0; k < len; ++k)
        if (line[k] != ' ' && line[k] != '\t') return 0;
    return 1;
}

static int read_input(FILE *f, const nc_options *o, nc_table *t)
{
    nc_lines in;
    nc_csv csv;
    nc_fhir *fhir = NULL;
    int input = o->input, status = 0, got;
    char *line;
    size_t len, seen = 0;

    memset(&in, 0, sizeof in);
    in.f = f;
    nc_csv_init(&csv, t, o->column);
    while (status == 0 && (got = nc_read_line(&in, &line, &len)) != NC_LINE_EOF) {
        if (got == NC_LINE_ERROR) {
            fprintf(stderr, "%s: %s line %zu: cannot read (%s)\n", NC_PROGRAM, t->source,
                    in.line_no + 1, ferror(f) ? "read error" : "out of memory");
            status = NC_EXIT_INPUT;
            break;
        }
        if (got == NC_LINE_TOO_LONG || got == NC_LINE_NUL) {
            if (seen == 0 && input != 2 && !(input == 0 && line[0] == '{')) {
                fprintf(stderr, "%s: %s line %zu: %s\n", NC_PROGRAM, t->source, in.line_no,
                        got == NC_LINE_NUL ? "a NUL byte in the header" : "the header is too long");
                status = NC_EXIT_INPUT;
                break;
            }
            nc_refuse(t, NC_NO_PATIENT, in.line_no, "character", "1",
                      got == NC_LINE_NUL ? "a NUL byte (not text)" : "longer than 1 MiB");
            continue;
        }
        if (blank(line, len)) continue;
        if (input == 0) input = line[strspn(line, " \t")] == '{' ? 2 : 1;
        ++seen;
        if (input == 1) {
            if (line[0] == '#' && !csv.have_header) continue; /* comments only above the header */
            status = nc_csv_line(&csv, line, len, in.line_no);
        } else {
            if (fhir == NULL && (fhir = nc_fhir_new(t)) == NULL) t->out_of_memory = 1;
            else status = nc_fhir_line(fhir, line, len, in.line_no);
        }
        if (t->out_of_memory) {
            fprintf(stderr, "%s: %s line %zu: out of memory\n", NC_PROGRAM, t->source, in.line_no);
            status = NC_EXIT_INPUT;
        }
    }
    if (status == 0 && seen == 0 && t->unattributed == 0) {
        fprintf(stderr, "%s: %s: the input is empty\n", NC_PROGRAM, t->source);
        status = NC_EXIT_INPUT;
    }
    if (status == 0 && input == 1) status = nc_csv_finish(&csv);
    if (fhir != NULL) nc_fhir_report(fhir, stderr);
    nc_fhir_free(fhir);
    nc_csv_free(&csv);
    free(in.buf);
    return status;
}

/* ---- assessing --------------------------------------------------------- */

/* The input line and column of a refused sample: the library checks each
 * sample alone, so the first one it refuses alone is the culprit, and
 * which of its two values by pairing each with a value surely accepted. */
static void blame_sample(const nc_table *t, const nc_row *const *rows, const ntr_sample *s,
                         size_t n, const ntr_course_limits *lim, int status,
                         char *why, size_t cap)
{
    ntr_course_report r;
    size_t i;
    for (i = 0; i < n; ++i) {
        ntr_sample alone = s[i], na_only = {0.0, s[i].na_mmol_l};
        r.struct_size = sizeof r;
        if (ntr_course_assess(&alone, 1, lim, &r) == NTR_OK) continue;
        r.struct_size = sizeof r;
        if (ntr_course_assess(&na_only, 1, lim, &r) != NTR_OK)
            snprintf(why, cap, "line %zu, %s: %.17g mmol/L: %s", rows[i]->line,
                     t->sodium_place, s[i].na_mmol_l, ntr_status_message(status));
        else
            snprintf(why, cap, "line %zu, %s: %.17g h: %s", rows[i]->line, t->time_place,
                     s[i].hours, ntr_status_message(status));
        return;
    }
    for (i = 1; i < n; ++i) {
        if (s[i].hours >= s[i - 1].hours) continue;
        snprintf(why, cap, "line %zu, %s: earlier than line %zu (%.17g h before it): "
                 "%s; sort each patient's results by time", rows[i]->line, t->time_place,
                 rows[i - 1]->line, s[i - 1].hours - s[i].hours, ntr_status_message(status));
        return;
    }
    snprintf(why, cap, "line %zu onwards: %s", rows[0]->line, ntr_status_message(status));
}

/* Rows of each patient, in input order: a counting sort by patient. */
static int group_rows(const nc_table *t, size_t **start, const nc_row ***ordered)
{
    size_t *first = calloc(t->patients + 1, sizeof *first), i, *fill;
    const nc_row **by = malloc((t->rows ? t->rows : 1) * sizeof *by);
    if (first == NULL || by == NULL || (fill = calloc(t->patients + 1, sizeof *fill)) == NULL) {
        free(first);
        free(by);
        return -1;
    }
    for (i = 0; i < t->rows; ++i) first[t->row[i].patient + 1]++;
    for (i = 0; i < t->patients; ++i) first[i + 1] += first[i];
    memcpy(fill, first, (t->patients + 1) * sizeof *fill);
    for (i = 0; i < t->rows; ++i) by[fill[t->row[i].patient]++] = &t->row[i];
    free(fill);
    *start = first;
    *ordered = by;
    return 0;
}

static int assess_all(const nc_table *t, const nc_setup *s, nc_writer *w, size_t *refused)
{
    size_t *start, p, most = 0, assessed = 0, refused_rows = t->unattributed;
    const nc_row **by;
    ntr_sample *samples;
    char why[768];

    if (group_rows(t, &start, &by) != 0) return -1;
    for (p = 0; p < t->patients; ++p)
        if (start[p + 1] - start[p] > most) most = start[p + 1] - start[p];
    if ((samples = malloc((most ? most : 1) * sizeof *samples)) == NULL) {
        free(start);
        free(by);
        return -1;
    }
    *refused = 0;
    for (p = 0; p < t->patients; ++p) {
        const nc_row *const *rows = by + start[p];
        size_t n = start[p + 1] - start[p], i;
        nc_result r;
        int st;
        memset(&r, 0, sizeof r);
        r.patient = &t->patient[p];
        /* a patient with a refused row is not assessed: the course without
         * that result could hide a breach */
        if (r.patient->refused > 0) {
            r.error = r.patient->error;
        } else {
            for (i = 0; i < n; ++i) {
                samples[i].hours = t->timed ? nc_hours_between(rows[0]->when, rows[i]->when) : rows[i]->hours;
                samples[i].na_mmol_l = rows[i]->na_mmol_l;
            }
            r.report.struct_size = sizeof r.report;
            st = ntr_course_assess(samples, n, &s->limits, &r.report);
            if (st == NTR_OK) {
                r.assessed = 1;
            } else {
                blame_sample(t, rows, samples, n, &s->limits, st, why, sizeof why);
                fprintf(stderr, "%s: %s %s (patient %s)\n", NC_PROGRAM, t->source, why, r.patient->id);
                r.error = why;
            }
        }
        refused_rows += r.patient->refused;
        if (r.assessed) ++assessed;
        else ++*refused;
        nc_out_patient(w, &r);
    }
    nc_out_end(w, assessed, *refused, refused_rows);
    free(samples);
    free(start);
    free(by);
    return 0;
}

int main(int argc, char **argv)
{
    nc_options o;
    nc_setup s;
    nc_table t;
    nc_writer w;
    FILE *f = stdin;
    int st;
    size_t refused_patients = 0;

    if ((st = parse_options(argc, argv, &o)) >= 0) return st;
    if ((st = make_setup(&o, &s)) != 0) return st;
    if (o.file != NULL && strcmp(o.file, "-") != 0 && (f = fopen(o.file, "rb")) == NULL) {
        fprintf(stderr, "%s: %s: cannot open\n", NC_PROGRAM, o.file);
        return NC_EXIT_INPUT;
    }
    nc_table_init(&t, f == stdin ? "stdin" : o.file);
    st = read_input(f, &o, &t);
    if (f != stdin) fclose(f);
    if (st == 0) {
        w.out = stdout;
        w.json = o.json;
        w.written = 0;
        nc_out_begin(&w, &s);
        if (assess_all(&t, &s, &w, &refused_patients) != 0) {
            fprintf(stderr, "%s: out of memory\n", NC_PROGRAM);
            st = NC_EXIT_INPUT;
        } else if (refused_patients > 0 || t.unattributed > 0) {
            fprintf(stderr, "%s: %zu patient(s) refused, %zu row(s) with no usable patient id\n",
                    NC_PROGRAM, refused_patients, t.unattributed);
            st = NC_EXIT_REFUSED;
        }
    }
    nc_table_free(&t);
    if (fflush(stdout) != 0 || ferror(stdout)) {
        fprintf(stderr, "%s: cannot write the output\n", NC_PROGRAM);
        return NC_EXIT_INPUT;
    }
    return st;
}
