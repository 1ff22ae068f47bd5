/* SPDX-License-Identifier: MIT */
/* natremia-course: the library's shell interface (not part of the library;
 * it may print and allocate). Shared types of its source files:
 *   main.c       options, the assessment per patient, exit status
 *   table.c      rows grouped by patient, refusals, the line reader
 *   csv_input.c  CSV with a header line
 *   fhir_input.c FHIR R4 Observations, one per line (NDJSON)
 *   json_lite.c  a small, bounded JSON reader (json_lite.h)
 *   datetime.c   ISO 8601 date-times with a zone
 *   output.c     CSV and JSON writers
 * docs/cli.md documents the behaviour. */
#ifndef NC_COURSE_CLI_H
#define NC_COURSE_CLI_H

#include <stddef.h>
#include <stdio.h>

#include <natremia.h>

#define NC_PROGRAM "natremia-course"

/* Exit statuses (docs/cli.md). */
#define NC_EXIT_OK 0      /* every patient assessed */
#define NC_EXIT_REFUSED 1 /* some rows or patients refused; the rest printed */
#define NC_EXIT_USAGE 2   /* the command line is wrong */
#define NC_EXIT_INPUT 3   /* the input cannot be read or used at all */

/* The caution every output carries. */
#define NC_CAUTION "estimates for decision support, not orders; verify with " \
    "measured values; follow local protocols and licensed clinical judgement"

/* Longest input line accepted (bytes): bounds the memory one line takes. */
#define NC_MAX_LINE (1024u * 1024u)

/* A point in time: whole seconds since 1970-01-01T00:00Z plus a fraction,
 * kept apart so that subtracting two nearby times loses nothing. */
typedef struct nc_instant {
    long long sec;
    double frac; /* 0 <= frac < 1 */
} nc_instant;

/* One accepted input row. */
typedef struct nc_row {
    size_t patient;   /* index into nc_table.patient */
    size_t line;      /* input line number, from 1 */
    double hours;     /* the hours column (hours input) */
    nc_instant when;  /* the time (time or FHIR input) */
    double na_mmol_l; /* sodium, mmol/L */
} nc_row;

typedef struct nc_patient {
    char *id;
    char *origin;   /* the first row's time as written (timed input), else NULL */
    size_t rows;    /* rows of this patient in the input, accepted or not */
    size_t refused; /* rows refused */
    char *error;    /* the first refusal (line, column, reason), else NULL */
} nc_patient;

typedef struct nc_table {
    const char *source;   /* input name in messages ("stdin" or the path) */
    int timed;            /* 1: times are date-times, hours counted per patient */
    nc_row *row;
    size_t rows, row_cap;
    nc_patient *patient;
    size_t patients, patient_cap;
    size_t *slot;         /* open-addressing hash of patient ids: index + 1, 0 empty */
    size_t slot_cap;      /* a power of two */
    size_t unattributed;  /* refused rows with no usable patient id */
    size_t skipped;       /* rows skipped on purpose (FHIR: not a sodium result) */
    char time_place[96];  /* where a row's time is: "column hours", "member effectiveDateTime" */
    char sodium_place[96];
    int out_of_memory;
} nc_table;

#define NC_NO_PATIENT ((size_t)-1)

void nc_table_init(nc_table *t, const char *source);
void nc_table_free(nc_table *t);
/* Find or add a patient; returns its index, NC_NO_PATIENT when out of memory. */
size_t nc_table_patient(nc_table *t, const char *id);
/* Add an accepted row (its patient counted); 0 on success, -1 out of memory. */
int nc_table_add(nc_table *t, const nc_row *r, const char *origin_text);
/* Count a row of patient p (NC_NO_PATIENT: unknown) as refused and say why
 * on standard error: "<source> line L, KIND PLACE: reason", KIND being
 * "column" (CSV), "member" (FHIR) or "character" (a JSON syntax error).
 * The first refusal of a patient is kept as its error. */
void nc_refuse(nc_table *t, size_t p, size_t line, const char *kind,
               const char *place, const char *fmt, ...)
#if defined(__GNUC__)
    __attribute__((format(printf, 6, 7)))
#endif
    ;

/* Reads lines of at most NC_MAX_LINE bytes, without the line end (LF or
 * CRLF), a UTF-8 byte order mark removed from the first. */
typedef struct nc_lines {
    FILE *f;
    char *buf;
    size_t cap;
    size_t line_no; /* of the line just read */
} nc_lines;

#define NC_LINE_OK 1
#define NC_LINE_EOF 0
#define NC_LINE_ERROR (-1)    /* read error or out of memory */
#define NC_LINE_TOO_LONG (-2) /* the line was skipped to its end */
#define NC_LINE_NUL (-3)      /* the line holds a NUL byte */
int nc_read_line(nc_lines *in, char **line, size_t *len);

/* ---- input readers: fed one line at a time (blank lines never reach them) */

/* Column names of the CSV input (--column ROLE=NAME changes them). */
#define NC_ROLE_PATIENT 0
#define NC_ROLE_HOURS 1
#define NC_ROLE_TIME 2
#define NC_ROLE_SODIUM 3
#define NC_ROLE_UNIT 4
#define NC_ROLES 5
extern const char *const nc_role_word[NC_ROLES];

typedef struct nc_csv {
    nc_table *t;
    const char *name[NC_ROLES]; /* column names sought */
    int have_header;
    size_t header_line;
    size_t fields;              /* in the header */
    long col[NC_ROLES];         /* field index of each role, -1 absent */
    char **field;               /* scratch: one pointer per field */
    size_t field_cap;
} nc_csv;

void nc_csv_init(nc_csv *c, nc_table *t, const char *const names[NC_ROLES]);
void nc_csv_free(nc_csv *c);
/* Returns 0 to go on, NC_EXIT_INPUT when the input cannot be used (a bad
 * header); a refused row returns 0 (nc_refuse counted it). */
int nc_csv_line(nc_csv *c, char *line, size_t len, size_t line_no);
/* Called at the end: NC_EXIT_INPUT when no header was seen. */
int nc_csv_finish(nc_csv *c);

typedef struct nc_fhir nc_fhir;
nc_fhir *nc_fhir_new(nc_table *t);
void nc_fhir_free(nc_fhir *f);
int nc_fhir_line(nc_fhir *f, const char *line, size_t len, size_t line_no);
/* How many lines were not sodium Observations, and why (for a note). */
void nc_fhir_report(const nc_fhir *f, FILE *to);

/* ---- date-times and numbers */

/* "YYYY-MM-DDThh:mm[:ss[.fff...]]" with "Z" or "+hh:mm"/"-hh:mm" (also
 * "+hhmm"); a space may stand for the T. A time without a zone is refused:
 * a clock change inside a series would move it by an hour. Returns 0, or
 * -1 with *why set to a static reason. */
int nc_parse_datetime(const char *text, nc_instant *out, const char **why);
double nc_hours_between(nc_instant from, nc_instant to);

/* The whole text as a decimal number (sign, digits, point, exponent; no
 * hexadecimal, inf, nan or spaces inside). Returns 0 or -1. */
int nc_parse_decimal(const char *text, double *out);

/* Sodium in a unit: "mmol/L" or "mEq/L" (any case) to mmol/L with
 * ntr_convert(). Returns NTR_OK or the status; *unit_known 0 when the
 * unit is neither. */
int nc_sodium_to_mmol_l(double value, const char *unit, double *out, int *unit_known);

/* ---- output (output.c) */

/* The limits every patient is assessed against, as the user chose them. */
typedef struct nc_setup {
    const char *preset_name; /* a preset's name, or "custom" after an override */
    const char *goal_name;
    ntr_course_limits limits;
} nc_setup;

/* One output row. */
typedef struct nc_result {
    const nc_patient *patient;
    int assessed;             /* 1: report holds the assessment */
    const char *error;        /* refused: why (line, column, reason) */
    ntr_course_report report;
} nc_result;

typedef struct nc_writer {
    FILE *out;
    int json;
    size_t written; /* patients written */
} nc_writer;

/* The caution, the limits and the CSV header (or the JSON opening). */
void nc_out_begin(nc_writer *w, const nc_setup *s);
void nc_out_patient(nc_writer *w, const nc_result *r);
/* The JSON closing with the counts; for CSV a closing comment line. */
void nc_out_end(nc_writer *w, size_t assessed, size_t refused_patients, size_t refused_rows);

#endif
