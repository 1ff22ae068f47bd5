/* SPDX-License-Identifier: MIT */
/* libFuzzer driver for every public entry point of natremia.
 *
 * The first byte picks a function from the contract table
 * (tests/fuzz/ntr_contract.c) or one of the special modes below; the rest
 * is decoded into its arguments. Numbers come out mostly inside their
 * documented range (so the arithmetic is reached), sometimes at or just past
 * its edges, sometimes as NaN, infinities, subnormals or raw bit patterns.
 * Each call is judged against the contract (defined status, the documented
 * checking order, outputs untouched on error, finite and within documented
 * bounds on success); a breach aborts with a description, and the
 * sanitizers report any memory or undefined-behaviour fault.
 *
 * Build and run: tests/fuzz-short.sh (seconds), tests/fuzz-long.sh.
 */
#include <float.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "natremia.h"
#include "ntr_contract.h"

typedef struct reader {
    const uint8_t *p;
    size_t n;
} reader;

static uint8_t rd_u8(reader *r)
{
    uint8_t b;
    if (r->n == 0) {
        return 0;
    }
    b = r->p[0];
    r->p++;
    r->n--;
    return b;
}

static uint64_t rd_bits(reader *r, int bytes)
{
    uint64_t v = 0;
    int i;
    for (i = 0; i < bytes; i++) {
        v = (v << 8) | rd_u8(r);
    }
    return v;
}

static double bits_to_double(uint64_t bits)
{
    double d;
    memcpy(&d, &bits, sizeof d);
    return d;
}

/* A number for an input documented as lo..hi. */
static double rd_range(reader *r, double lo, double hi)
{
    uint8_t sel = rd_u8(r);
    if (sel < 150) {
        double u = (double)rd_bits(r, 2) / 65535.0;
        return lo + (hi - lo) * u;
    }
    if (sel < 190) {
        const double edges[] = {
            lo, hi, nextafter(lo, -HUGE_VAL), nextafter(hi, HUGE_VAL),
            nextafter(lo, HUGE_VAL), nextafter(hi, -HUGE_VAL), 0.0, -0.0,
            lo - 1.0, hi + 1.0, -hi, hi * 1e6, DBL_MAX, -DBL_MAX,
            DBL_MIN, -DBL_MIN, 4.9406564584124654e-324, -4.9406564584124654e-324,
            (lo + hi) / 2.0, 1.0,
        };
        return edges[(size_t)(sel - 150) % (sizeof edges / sizeof edges[0])];
    }
    if (sel < 205) {
        const double specials[] = {NAN, -NAN, HUGE_VAL, -HUGE_VAL};
        return specials[(size_t)(sel - 190) % 4u];
    }
    return bits_to_double(rd_bits(r, 8));
}

static double src_number(ntrc_source *src, double lo, double hi)
{
    return rd_range((reader *)src->ctx, lo, hi);
}

static unsigned int src_byte(ntrc_source *src)
{
    return rd_u8((reader *)src->ctx);
}

/* A value for an enumerator: mostly valid, sometimes anything. */
static int rd_enum(reader *r, const ntrc_enum *spec)
{
    uint8_t sel = rd_u8(r);
    if (sel < 200 && spec->n_valid > 0) {
        return spec->valid[sel % spec->n_valid];
    }
    if (sel < 235) {
        return (int)sel - 217; /* -17 .. 17 */
    }
    return (int)(int32_t)(uint32_t)rd_bits(r, 4);
}

static void report(const ntrc_fn *f, const ntrc_case *c, int status, const char *what)
{
    int i;
    fprintf(stderr, "CONTRACT BREACH in %s: %s (status %d, model %d)\n", f->name, what, status,
            ntrc_predict(f, c));
    for (i = 0; i < f->n_enum; i++) {
        fprintf(stderr, "  %s = %d\n", f->en[i].name, c->en[i]);
    }
    for (i = 0; i < f->n_num; i++) {
        fprintf(stderr, "  %s = %a (%.17g)\n", f->num[i].name, c->num[i], c->num[i]);
    }
    fprintf(stderr, "  null mask = 0x%x, n = %lu, n2 = %lu, capacity = %lu\n", c->out_null,
            (unsigned long)c->n, (unsigned long)c->n2, (unsigned long)c->capacity);
    for (i = 0; i < (int)c->n && i < NTRC_MAX_SERIES; i++) {
        fprintf(stderr, "  sample %d: %a h, %a mmol/L\n", i, c->samples[i].hours,
                c->samples[i].na_mmol_l);
    }
    abort();
}

static ntrc_case the_case; /* large; one call at a time */

static void fuzz_table_entry(const ntrc_fn *f, reader *r)
{
    ntrc_case *c = &the_case;
    ntrc_source src;
    int i;
    int status;
    const char *breach;
    uint8_t nullsel;
    src.number = src_number;
    src.byte = src_byte;
    src.ctx = r;
    memset(c, 0, sizeof *c);
    for (i = 0; i < f->n_enum; i++) {
        c->en[i] = rd_enum(r, &f->en[i]);
    }
    for (i = 0; i < f->n_num; i++) {
        c->num[i] = rd_range(r, f->num[i].lo, f->num[i].hi);
    }
    if (f->fuzz_series != NULL) {
        f->fuzz_series(c, &src);
    } else if (f->base_series != NULL) {
        f->base_series(c);
    }
    nullsel = rd_u8(r);
    if (nullsel >= 240) {
        int slots = f->n_out_d + f->n_out_i + f->n_in_ptr;
        int k = slots > 0 ? (nullsel - 240) % slots : 0;
        if (k < f->n_out_d) {
            c->out_null = NTRC_NULL_D(k);
        } else if (k < f->n_out_d + f->n_out_i) {
            c->out_null = NTRC_NULL_I(k - f->n_out_d);
        } else {
            c->out_null = NTRC_NULL_IN(k - f->n_out_d - f->n_out_i);
        }
    }
    breach = ntrc_run_and_judge(f, c, &status);
    if (breach != NULL) {
        report(f, c, status, breach);
    }
}

static ntrc_batch_case the_batch;

static void fuzz_batch(const ntrc_batch_fn *bf, reader *r)
{
    ntrc_batch_case *b = &the_batch;
    const ntrc_fn *f = ntrc_find(bf->scalar);
    size_t i;
    int k;
    int status;
    const char *breach;
    uint8_t sel;
    memset(b, 0, sizeof *b);
    b->n = rd_u8(r) % (NTRC_MAX_ROWS + 1);
    for (i = 0; i < b->n; i++) {
        for (k = 0; k < bf->n_cols; k++) {
            b->col[k][i] = rd_range(r, f->num[k].lo, f->num[k].hi);
        }
        if (bf->row_enum) {
            b->row_en[i] = rd_enum(r, &f->en[0]);
        }
    }
    if (bf->call_enum) {
        b->call_en = rd_enum(r, &f->en[0]);
    }
    sel = rd_u8(r);
    if (sel >= 244) {
        b->null_mask = 1u << (sel % 12u);
    } else if (sel >= 230 && !bf->int_out) {
        b->in_place = 1 + (int)(sel % (unsigned)bf->n_cols);
    }
    breach = ntrc_batch_run_and_judge(bf, b, &status);
    if (breach != NULL) {
        fprintf(stderr, "CONTRACT BREACH in %s: %s (status %d, n %lu, null 0x%x, in place %d)\n",
                bf->name, breach, status, (unsigned long)b->n, b->null_mask, b->in_place);
        for (i = 0; i < b->n; i++) {
            fprintf(stderr, "  row %lu:", (unsigned long)i);
            for (k = 0; k < bf->n_cols; k++) {
                fprintf(stderr, " %a", b->col[k][i]);
            }
            fprintf(stderr, " en %d\n", bf->row_enum ? b->row_en[i] : b->call_en);
        }
        abort();
    }
}

/* A stream of results into ntr_watch_push, compared after every accepted
 * push with ntr_correction_assess over the same samples. */
static void fuzz_watch_stream(reader *r)
{
    ntr_sample s[NTRC_MAX_SERIES];
    ntr_limits lim;
    size_t n = rd_u8(r) % (NTRC_MAX_SERIES + 1);
    size_t i;
    size_t accepted;
    double t = rd_range(r, -50.0, 50.0);
    const char *breach;
    if (rd_u8(r) < 128) {
        ntrc_setup_ok(ntr_limits_preset(NTR_LIMITS_STANDARD, &lim));
    } else {
        lim.max_rise_24h = rd_range(r, 0.0, 50.0);
        lim.max_rise_48h = rd_range(r, 0.0, 50.0);
        lim.min_rise_24h = rd_range(r, 0.0, 50.0);
    }
    for (i = 0; i < n; i++) {
        uint8_t step = rd_u8(r);
        /* Mostly dense steady rises (the ring's worst case), sometimes
         * anything. */
        t += step < 200 ? (double)(step % 8u) * 0.125 : rd_range(r, -5.0, 30.0);
        s[i].hours = t;
        s[i].na_mmol_l = step < 200 ? 110.0 + 0.2 * (double)i : rd_range(r, 80.0, 220.0);
    }
    breach = ntrc_watch_replay(&lim, s, n, &accepted);
    if (breach != NULL) {
        fprintf(stderr, "CONTRACT BREACH in ntr_watch_push: %s\n", breach);
        for (i = 0; i < n; i++) {
            fprintf(stderr, "  %a h, %a mmol/L\n", s[i].hours, s[i].na_mmol_l);
        }
        abort();
    }
}

/* ntr_unit_parse (and, since 1.1, ntr_unit_parse_lenient and
 * ntr_loinc_lookup) on an arbitrary NUL-terminated string held in a buffer
 * of exactly its size, so any read past the NUL is an ASan report. */
static void fuzz_unit_string(reader *r)
{
    static const char *const codes[] = {"mmol/L", "mg/dL", "meq/L", "mosm/kg", "g/L", "umol/L"};
    char *s = malloc(r->n + 1);
    int unit = -12345;
    int st;
    int want = NTR_ERR_UNIT;
    int want_unit = 0;
    size_t i;
    if (s == NULL) {
        return;
    }
    memcpy(s, r->p, r->n);
    s[r->n] = '\0';
    for (i = 0; i < 6; i++) {
        if (strcmp(s, codes[i]) == 0) {
            want = NTR_OK;
            want_unit = (int)i + 1;
        }
    }
    st = ntr_unit_parse(s, &unit);
    if (st != want || (st == NTR_OK && unit != want_unit) || (st != NTR_OK && unit != -12345)) {
        fprintf(stderr, "CONTRACT BREACH in ntr_unit_parse: status %d unit %d for \"%s\"\n",
                st, unit, s);
        abort();
    }
    /* The 1.1 readers on the same exact-size buffer: the lenient parser
     * agrees with the strict one wherever that one accepts, gives a known
     * unit or NTR_ERR_UNIT with the output untouched; the LOINC lookup
     * gives known enumerators or NTR_ERR_UNIT with all three untouched. */
    {
        int lenient = -12345, a = -12345, sp = -12345, u = -12345;
        int ls = ntr_unit_parse_lenient(s, &lenient);
        int cs = ntr_loinc_lookup(s, &a, &sp, &u);
        if ((st == NTR_OK && (ls != NTR_OK || lenient != unit)) ||
            (ls == NTR_OK && (lenient < NTR_UNIT_MMOL_L || lenient > NTR_UNIT_UMOL_L)) ||
            (ls != NTR_OK && (ls != NTR_ERR_UNIT || lenient != -12345))) {
            fprintf(stderr, "CONTRACT BREACH in ntr_unit_parse_lenient: status %d unit %d\n",
                    ls, lenient);
            abort();
        }
        if ((cs == NTR_OK && (a < 1 || a > NTR_ANALYTE_URIC_ACID || sp < 1 ||
                              sp > NTR_SPECIMEN_URINE || u < 1 || u > NTR_UNIT_UMOL_L)) ||
            (cs != NTR_OK && (cs != NTR_ERR_UNIT || a != -12345 || sp != -12345 || u != -12345))) {
            fprintf(stderr, "CONTRACT BREACH in ntr_loinc_lookup: status %d\n", cs);
            abort();
        }
    }
    free(s);
}

static void fuzz_statusless(reader *r)
{
    int code = (int)(int32_t)(uint32_t)rd_bits(r, 4);
    const char *m = ntr_status_message(code);
    const char *v = ntr_version_string();
    if (m == NULL || strlen(m) == 0 || strlen(m) > 200 || v == NULL ||
        ntr_version_number() != (unsigned long)NTR_VERSION_MAJOR * 10000ul +
                                    (unsigned long)NTR_VERSION_MINOR * 100ul +
                                    (unsigned long)NTR_VERSION_PATCH) {
        fprintf(stderr, "CONTRACT BREACH in the status/version functions (code %d)\n", code);
        abort();
    }
}

/* Selector values: the scalar table, the batch table, then the modes. */
#define ENTRIES (ntrc_n_functions + ntrc_n_batch_functions + 3)

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);
int LLVMFuzzerInitialize(int *argc, char ***argv);

/* With NTR_FUZZ_PRINT_ENTRIES set, print the number of entry points (the
 * selector modulus) and exit: tests/fuzz/seeds.sh writes one seed each. */
int LLVMFuzzerInitialize(int *argc, char ***argv)
{
    (void)argc;
    (void)argv;
    if (getenv("NTR_FUZZ_PRINT_ENTRIES") != NULL) {
        printf("%lu\n", (unsigned long)ENTRIES);
        exit(0);
    }
    return 0;
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    reader r;
    size_t pick;
    if (size == 0) {
        return 0;
    }
    r.p = data + 1;
    r.n = size - 1;
    pick = data[0] % ENTRIES;
    if (pick < ntrc_n_functions) {
        fuzz_table_entry(&ntrc_functions[pick], &r);
        return 0;
    }
    pick -= ntrc_n_functions;
    if (pick < ntrc_n_batch_functions) {
        fuzz_batch(&ntrc_batch_functions[pick], &r);
        return 0;
    }
    pick -= ntrc_n_batch_functions;
    if (pick == 0) {
        fuzz_unit_string(&r);
    } else if (pick == 1) {
        fuzz_watch_stream(&r);
    } else {
        fuzz_statusless(&r);
    }
    return 0;
}
