/* SPDX-License-Identifier: MIT */
/* Rows grouped by patient, refusals with their line and column, and the
 * bounded line reader (course_cli.h). */
#include "course_cli.h"

#include <natremia.h>

#include <stdarg.h>
#include <stdlib.h>
#include <string.h>

void nc_table_init(nc_table *t, const char *source)
{
    memset(t, 0, sizeof *t);
    t->source = source;
}

void nc_table_free(nc_table *t)
{
    size_t i;
    for (i = 0; i < t->patients; ++i) {
        free(t->patient[i].id);
        free(t->patient[i].origin);
        free(t->patient[i].error);
    }
    free(t->patient);
    free(t->row);
    free(t->slot);
    memset(t, 0, sizeof *t);
}

static char *copy_text(const char *s)
{
    size_t n = strlen(s) + 1;
    char *c = malloc(n);
    if (c != NULL) memcpy(c, s, n);
    return c;
}

/* FNV-1a over the id's bytes: spreads ids like "P1", "P2" well enough. */
static size_t id_hash(const char *id)
{
    unsigned long h = 2166136261ul;
    for (; *id != '\0'; ++id) h = ((h ^ (unsigned char)*id) * 16777619ul) & 0xfffffffful;
    return (size_t)h;
}

static int grow_slots(nc_table *t)
{
    size_t cap = t->slot_cap ? t->slot_cap * 2 : 64, i;
    size_t *slot = calloc(cap, sizeof *slot);
    if (slot == NULL) return -1;
    for (i = 0; i < t->patients; ++i) {
        size_t s = id_hash(t->patient[i].id) & (cap - 1);
        while (slot[s] != 0) s = (s + 1) & (cap - 1);
        slot[s] = i + 1;
    }
    free(t->slot);
    t->slot = slot;
    t->slot_cap = cap;
    return 0;
}

size_t nc_table_patient(nc_table *t, const char *id)
{
    size_t s;
    nc_patient *p;
    /* keep the table at most half full so probes stay short */
    if (2 * (t->patients + 1) > t->slot_cap && grow_slots(t) != 0) {
        t->out_of_memory = 1;
        return NC_NO_PATIENT;
    }
    for (s = id_hash(id) & (t->slot_cap - 1); t->slot[s] != 0; s = (s + 1) & (t->slot_cap - 1))
        if (strcmp(t->patient[t->slot[s] - 1].id, id) == 0) return t->slot[s] - 1;
    if (t->patients == t->patient_cap) {
        size_t cap = t->patient_cap ? 2 * t->patient_cap : 16;
        nc_patient *grown = realloc(t->patient, cap * sizeof *grown);
        if (grown == NULL) {
            t->out_of_memory = 1;
            return NC_NO_PATIENT;
        }
        t->patient = grown;
        t->patient_cap = cap;
    }
    p = &t->patient[t->patients];
    memset(p, 0, sizeof *p);
    if ((p->id = copy_text(id)) == NULL) {
        t->out_of_memory = 1;
        return NC_NO_PATIENT;
    }
    t->slot[s] = ++t->patients;
    return t->patients - 1;
}

int nc_table_add(nc_table *t, const nc_row *r, const char *origin_text)
{
    nc_patient *p = &t->patient[r->patient];
    if (t->rows == t->row_cap) {
        size_t cap = t->row_cap ? 2 * t->row_cap : 256;
        nc_row *grown = realloc(t->row, cap * sizeof *grown);
        if (grown == NULL) {
            t->out_of_memory = 1;
            return -1;
        }
        t->row = grown;
        t->row_cap = cap;
    }
    /* the origin of the hours is the patient's first row in the input */
    if (origin_text != NULL && p->origin == NULL && p->rows == 0) {
        if ((p->origin = copy_text(origin_text)) == NULL) {
            t->out_of_memory = 1;
            return -1;
        }
    }
    t->row[t->rows++] = *r;
    p->rows++;
    return 0;
}

void nc_refuse(nc_table *t, size_t p, size_t line, const char *kind,
               const char *place, const char *fmt, ...)
{
    char reason[512], where[640];
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(reason, sizeof reason, fmt, ap);
    va_end(ap);
    snprintf(where, sizeof where, "line %zu, %s %s: %s", line, kind, place, reason);
    fprintf(stderr, "%s: %s %s\n", NC_PROGRAM, t->source, where);
    if (p == NC_NO_PATIENT) {
        t->unattributed++;
        return;
    }
    t->patient[p].rows++;
    t->patient[p].refused++;
    if (t->patient[p].error == NULL && (t->patient[p].error = copy_text(where)) == NULL)
        t->out_of_memory = 1;
}

/* ---- the line reader ------------------------------------------------- */

int nc_read_line(nc_lines *in, char **line, size_t *len)
{
    size_t n = 0;
    int c, too_long = 0, nul = 0;
    if (in->buf == NULL) {
        in->cap = 4096;
        if ((in->buf = malloc(in->cap)) == NULL) return NC_LINE_ERROR;
    }
    while ((c = getc(in->f)) != EOF && c != '\n') {
        if (c == '\0') nul = 1;
        if (n >= NC_MAX_LINE) {
            too_long = 1; /* read on to the line's end, keep nothing more */
            continue;
        }
        if (n + 1 >= in->cap) {
            size_t cap = 2 * in->cap;
            char *grown = realloc(in->buf, cap);
            if (grown == NULL) return NC_LINE_ERROR;
            in->buf = grown;
            in->cap = cap;
        }
        in->buf[n++] = (char)c;
    }
    if (ferror(in->f)) return NC_LINE_ERROR;
    if (c == EOF && n == 0 && !too_long) return NC_LINE_EOF;
    in->line_no++;
    if (n > 0 && in->buf[n - 1] == '\r') --n;
    in->buf[n] = '\0';
    if (in->line_no == 1 && n >= 3 && memcmp(in->buf, "\xEF\xBB\xBF", 3) == 0) {
        memmove(in->buf, in->buf + 3, n - 2);
        n -= 3;
    }
    *line = in->buf;
    *len = n;
    if (too_long) return NC_LINE_TOO_LONG;
    if (nul) return NC_LINE_NUL;
    return NC_LINE_OK;
}

/* ---- numbers and units ------------------------------------------------ */

int nc_parse_decimal(const char *text, double *out)
{
    const char *p = text;
    char *end;
    size_t digits = 0;
    double v;
    if (*p == '+' || *p == '-') ++p;
    while (*p >= '0' && *p <= '9') ++p, ++digits;
    if (*p == '.') {
        ++p;
        while (*p >= '0' && *p <= '9') ++p, ++digits;
    }
    if (digits == 0) return -1;
    if (*p == 'e' || *p == 'E') {
        ++p;
        if (*p == '+' || *p == '-') ++p;
        if (!(*p >= '0' && *p <= '9')) return -1;
        while (*p >= '0' && *p <= '9') ++p;
    }
    if (*p != '\0') return -1;
    /* the syntax is plain decimal, so strtod (in the "C" locale: the
     * program never calls setlocale) reads exactly these characters */
    v = strtod(text, &end);
    if (*end != '\0') return -1;
    *out = v;
    return 0;
}

static int same_word(const char *a, const char *b)
{
    for (; *a != '\0' && *b != '\0'; ++a, ++b) {
        int x = (*a >= 'A' && *a <= 'Z') ? *a - 'A' + 'a' : *a;
        int y = (*b >= 'A' && *b <= 'Z') ? *b - 'A' + 'a' : *b;
        if (x != y) return 0;
    }
    return *a == *b;
}

int nc_sodium_to_mmol_l(double value, const char *unit, double *out, int *unit_known)
{
    int from;
    /* mEq/L equals mmol/L for a monovalent ion; ntr_convert() says so once */
    if (same_word(unit, "mmol/L")) from = NTR_UNIT_MMOL_L;
    else if (same_word(unit, "meq/L")) from = NTR_UNIT_MEQ_L;
    else {
        *unit_known = 0;
        return NTR_ERR_UNIT;
    }
    *unit_known = 1;
    return ntr_convert(NTR_ANALYTE_SODIUM, value, from, NTR_UNIT_MMOL_L, out);
}
