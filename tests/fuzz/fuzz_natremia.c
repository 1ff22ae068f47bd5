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
static double rd_number(reader *r, const ntrc_num *spec)
{
    uint8_t sel = rd_u8(r);
    if (sel < 150) {
        double u = (double)rd_bits(r, 2) / 65535.0;
        return spec->lo + (spec->hi - spec->lo) * u;
    }
    if (sel < 190) {
        const double edges[] = {
            spec->lo, spec->hi, nextafter(spec->lo, -HUGE_VAL), nextafter(spec->hi, HUGE_VAL),
            nextafter(spec->lo, HUGE_VAL), nextafter(spec->hi, -HUGE_VAL), 0.0, -0.0,
            spec->lo - 1.0, spec->hi + 1.0, -spec->hi, spec->hi * 1e6, DBL_MAX, -DBL_MAX,
            DBL_MIN, -DBL_MIN, 4.9406564584124654e-324, -4.9406564584124654e-324,
            (spec->lo + spec->hi) / 2.0, 1.0,
        };
        return edges[(size_t)(sel - 150) % (sizeof edges / sizeof edges[0])];
    }
    if (sel < 205) {
        const double specials[] = {NAN, -NAN, HUGE_VAL, -HUGE_VAL};
        return specials[(size_t)(sel - 190) % 4u];
    }
    return bits_to_double(rd_bits(r, 8));
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
    fprintf(stderr, "CONTRACT BREACH in %s: %s (status %d)\n", f->name, what, status);
    for (i = 0; i < f->n_enum; i++) {
        fprintf(stderr, "  %s = %d\n", f->en[i].name, c->en[i]);
    }
    for (i = 0; i < f->n_num; i++) {
        fprintf(stderr, "  %s = %a (%.17g)\n", f->num[i].name, c->num[i], c->num[i]);
    }
    fprintf(stderr, "  null mask = 0x%x\n", c->out_null);
    abort();
}

static void fuzz_table_entry(const ntrc_fn *f, reader *r)
{
    ntrc_case c;
    int i;
    int status;
    const char *breach;
    uint8_t nullsel;
    memset(&c, 0, sizeof c);
    for (i = 0; i < f->n_enum; i++) {
        c.en[i] = rd_enum(r, &f->en[i]);
    }
    for (i = 0; i < f->n_num; i++) {
        c.num[i] = rd_number(r, &f->num[i]);
    }
    if (f->base_series != NULL) {
        f->base_series(&c);
    }
    nullsel = rd_u8(r);
    if (nullsel >= 240) {
        int slots = f->n_out_d + f->n_out_i + f->n_in_ptr;
        int k = slots > 0 ? (nullsel - 240) % slots : 0;
        if (k < f->n_out_d) {
            c.out_null = NTRC_NULL_D(k);
        } else if (k < f->n_out_d + f->n_out_i) {
            c.out_null = NTRC_NULL_I(k - f->n_out_d);
        } else {
            c.out_null = NTRC_NULL_IN(k - f->n_out_d - f->n_out_i);
        }
    }
    breach = ntrc_run_and_judge(f, &c, &status);
    if (breach != NULL) {
        report(f, &c, status, breach);
    }
}

/* ntr_unit_parse on an arbitrary NUL-terminated string held in a buffer of
 * exactly its size, so any read past the NUL is an ASan report. */
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

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);
int LLVMFuzzerInitialize(int *argc, char ***argv);

/* With NTR_FUZZ_PRINT_ENTRIES set, print the number of entry points (the
 * selector modulus) and exit: tests/fuzz/seeds.sh writes one seed each. */
int LLVMFuzzerInitialize(int *argc, char ***argv)
{
    (void)argc;
    (void)argv;
    if (getenv("NTR_FUZZ_PRINT_ENTRIES") != NULL) {
        printf("%lu\n", (unsigned long)(ntrc_n_functions + 2));
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
    pick = data[0] % (ntrc_n_functions + 2);
    if (pick < ntrc_n_functions) {
        fuzz_table_entry(&ntrc_functions[pick], &r);
    } else if (pick == ntrc_n_functions) {
        fuzz_unit_string(&r);
    } else {
        fuzz_statusless(&r);
    }
    return 0;
}
