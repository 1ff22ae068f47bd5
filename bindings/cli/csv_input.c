/* SPDX-License-Identifier: MIT */
/* CSV input with a header line (course_cli.h; docs/cli.md): columns found
 * by name, fields separated by commas, a field in double quotes may hold
 * commas and doubled quotes (""), but not a line break. */
#include "course_cli.h"

#include <natremia.h>

#include <stdlib.h>
#include <string.h>

const char *const nc_role_word[NC_ROLES] = {"patient", "hours", "time", "sodium", "unit"};

void nc_csv_init(nc_csv *c, nc_table *t, const char *const names[NC_ROLES])
{
    int r;
    memset(c, 0, sizeof *c);
    c->t = t;
    for (r = 0; r < NC_ROLES; ++r) {
        c->name[r] = names[r];
        c->col[r] = -1;
    }
}

void nc_csv_free(nc_csv *c)
{
    free(c->field);
    c->field = NULL;
}

/* Split line into fields in place (quotes removed, each field
 * NUL-terminated). Returns the number of fields, or -1 with *bad set to
 * the 1-based field that is malformed, or -2 when out of memory. */
static long split(nc_csv *c, char *line, size_t len, size_t *bad)
{
    size_t n = 0, r = 0;
    for (;;) {
        char *w = line + r, *start = w;
        if (n == c->field_cap) {
            size_t cap = c->field_cap ? 2 * c->field_cap : 16;
            char **grown = realloc(c->field, cap * sizeof *grown);
            if (grown == NULL) return -2;
            c->field = grown;
            c->field_cap = cap;
        }
        if (r < len && line[r] == '"') {
            ++r;
            for (;;) {
                if (r >= len) { *bad = n + 1; return -1; } /* no closing quote */
                if (line[r] == '"') {
                    if (r + 1 < len && line[r + 1] == '"') { *w++ = '"'; r += 2; continue; }
                    ++r;
                    break;
                }
                *w++ = line[r++];
            }
            if (r < len && line[r] != ',') { *bad = n + 1; return -1; } /* text after the quote */
        } else {
            while (r < len && line[r] != ',') {
                if (line[r] == '"') { *bad = n + 1; return -1; } /* a quote inside a bare field */
                *w++ = line[r++];
            }
        }
        c->field[n++] = start;
        if (r >= len) {
            *w = '\0';
            return (long)n;
        }
        *w = '\0'; /* overwrites the comma (w <= line + r) */
        ++r;
    }
}

/* Leading and trailing spaces and tabs are not part of a value. */
static char *trim(char *s)
{
    size_t n;
    while (*s == ' ' || *s == '\t') ++s;
    n = strlen(s);
    while (n > 0 && (s[n - 1] == ' ' || s[n - 1] == '\t')) s[--n] = '\0';
    return s;
}

static int same_name(const char *a, const char *b)
{
    for (; *a && *b; ++a, ++b) {
        char x = (*a >= 'A' && *a <= 'Z') ? (char)(*a - 'A' + 'a') : *a;
        char y = (*b >= 'A' && *b <= 'Z') ? (char)(*b - 'A' + 'a') : *b;
        if (x != y) return 0;
    }
    return *a == *b;
}

static int header_error(nc_csv *c, size_t line_no, const char *fmt, const char *what)
{
    fprintf(stderr, "%s: %s line %zu (the header): ", NC_PROGRAM, c->t->source, line_no);
    fprintf(stderr, fmt, what);
    fputc('\n', stderr);
    return NC_EXIT_INPUT;
}

static int read_header(nc_csv *c, char *line, size_t len, size_t line_no)
{
    size_t bad = 0, i;
    long n = split(c, line, len, &bad);
    int r;
    if (n == -2) return header_error(c, line_no, "%s", "out of memory");
    if (n < 0) {
        fprintf(stderr, "%s: %s line %zu (the header), column %zu: misplaced double quote\n",
                NC_PROGRAM, c->t->source, line_no, bad);
        return NC_EXIT_INPUT;
    }
    for (i = 0; i < (size_t)n; ++i) {
        const char *name = trim(c->field[i]);
        for (r = 0; r < NC_ROLES; ++r) {
            if (!same_name(name, c->name[r])) continue;
            if (c->col[r] >= 0)
                return header_error(c, line_no, "column '%s' appears twice", c->name[r]);
            c->col[r] = (long)i;
        }
    }
    if (c->col[NC_ROLE_PATIENT] < 0)
        return header_error(c, line_no, "no column '%s' (the patient id)", c->name[NC_ROLE_PATIENT]);
    if (c->col[NC_ROLE_SODIUM] < 0)
        return header_error(c, line_no, "no column '%s' (sodium)", c->name[NC_ROLE_SODIUM]);
    if (c->col[NC_ROLE_HOURS] < 0 && c->col[NC_ROLE_TIME] < 0) {
        fprintf(stderr, "%s: %s line %zu (the header): neither column '%s' (hours) nor '%s' "
                "(date-time)\n", NC_PROGRAM, c->t->source, line_no, c->name[NC_ROLE_HOURS],
                c->name[NC_ROLE_TIME]);
        return NC_EXIT_INPUT;
    }
    if (c->col[NC_ROLE_HOURS] >= 0 && c->col[NC_ROLE_TIME] >= 0) {
        fprintf(stderr, "%s: %s line %zu (the header): both column '%s' and '%s'; keep one "
                "(or rename the other with --column)\n", NC_PROGRAM, c->t->source, line_no,
                c->name[NC_ROLE_HOURS], c->name[NC_ROLE_TIME]);
        return NC_EXIT_INPUT;
    }
    c->t->timed = c->col[NC_ROLE_TIME] >= 0;
    snprintf(c->t->time_place, sizeof c->t->time_place, "column %s",
             c->name[c->t->timed ? NC_ROLE_TIME : NC_ROLE_HOURS]);
    snprintf(c->t->sodium_place, sizeof c->t->sodium_place, "column %s", c->name[NC_ROLE_SODIUM]);
    c->fields = (size_t)n;
    c->have_header = 1;
    c->header_line = line_no;
    return 0;
}

/* One data row: every cell checked, the first problem refuses the row. */
static void read_row(nc_csv *c, char *line, size_t len, size_t line_no)
{
    nc_table *t = c->t;
    size_t bad = 0, p;
    long n = split(c, line, len, &bad);
    const char *id, *sodium, *unit = "mmol/L", *time_text = NULL;
    nc_row row;
    double value;
    int st, unit_known;

    if (n == -2) {
        t->out_of_memory = 1;
        return;
    }
    if (n < 0) {
        char place[32];
        snprintf(place, sizeof place, "%zu", bad);
        nc_refuse(t, NC_NO_PATIENT, line_no, "field", place, "misplaced double quote");
        return;
    }
    /* the patient first, so later refusals are the patient's */
    id = (size_t)c->col[NC_ROLE_PATIENT] < (size_t)n ? trim(c->field[c->col[NC_ROLE_PATIENT]]) : "";
    if (*id == '\0') {
        nc_refuse(t, NC_NO_PATIENT, line_no, "column", c->name[NC_ROLE_PATIENT], "empty patient id");
        return;
    }
    if ((p = nc_table_patient(t, id)) == NC_NO_PATIENT) return;
    if ((size_t)n != c->fields) {
        char place[32];
        snprintf(place, sizeof place, "%zu", ((size_t)n < c->fields ? (size_t)n : c->fields) + 1);
        nc_refuse(t, p, line_no, "field", place, "%ld fields, the header (line %zu) has %zu",
                  n, c->header_line, c->fields);
        return;
    }
    memset(&row, 0, sizeof row);
    row.patient = p;
    row.line = line_no;
    if (t->timed) {
        const char *why = "";
        time_text = trim(c->field[c->col[NC_ROLE_TIME]]);
        if (nc_parse_datetime(time_text, &row.when, &why) != 0) {
            nc_refuse(t, p, line_no, "column", c->name[NC_ROLE_TIME], "'%s': %s", time_text, why);
            return;
        }
    } else {
        const char *hours = trim(c->field[c->col[NC_ROLE_HOURS]]);
        if (nc_parse_decimal(hours, &row.hours) != 0) {
            nc_refuse(t, p, line_no, "column", c->name[NC_ROLE_HOURS], "'%s' is not a number", hours);
            return;
        }
    }
    sodium = trim(c->field[c->col[NC_ROLE_SODIUM]]);
    if (nc_parse_decimal(sodium, &value) != 0) {
        nc_refuse(t, p, line_no, "column", c->name[NC_ROLE_SODIUM], "'%s' is not a number", sodium);
        return;
    }
    if (c->col[NC_ROLE_UNIT] >= 0) unit = trim(c->field[c->col[NC_ROLE_UNIT]]);
    st = nc_sodium_to_mmol_l(value, unit, &row.na_mmol_l, &unit_known);
    if (!unit_known) {
        nc_refuse(t, p, line_no, "column", c->name[NC_ROLE_UNIT], "unit '%s' is not mmol/L or mEq/L", unit);
        return;
    }
    if (st != NTR_OK) {
        nc_refuse(t, p, line_no, "column", c->name[NC_ROLE_SODIUM], "'%s': %s", sodium, ntr_status_message(st));
        return;
    }
    (void)nc_table_add(t, &row, time_text);
}

int nc_csv_line(nc_csv *c, char *line, size_t len, size_t line_no)
{
    if (!c->have_header) return read_header(c, line, len, line_no);
    read_row(c, line, len, line_no);
    return 0;
}

int nc_csv_finish(nc_csv *c)
{
    if (c->have_header) return 0;
    fprintf(stderr, "%s: %s: no header line (the input is empty)\n", NC_PROGRAM, c->t->source);
    return NC_EXIT_INPUT;
}
