/* SPDX-License-Identifier: MIT */
/* Reference vectors: every public function's results on a fixed input set,
 * written as exact hexadecimal doubles (%a), one call a line.
 *
 *   refvectors              print the vectors
 *   refvectors --check FILE compare with FILE; exit 1 on any difference
 *
 * Doubles are written by put_hex_double(), which gives exactly the GNU C
 * library's %a text from the bits, so a C library without %a (newlib on
 * the Cortex-M4) prints the same file.
 *
 * The input set comes from the contract table (tests/fuzz/ntr_contract.c):
 * each function's valid baseline, the ends of every documented range, a
 * spread of points inside it for every enumerator choice, and series built
 * by a deterministic generator. Every input is made with integer arithmetic
 * and exactly rounded IEEE operations (no libm), and is printed as well, so
 * the file is the same on every IEEE-754 target whose double arithmetic
 * rounds each operation once. tests/cross.sh runs this program on 32-bit
 * x86 (SSE2 arithmetic), 32-bit ARM and big-endian s390x and requires the
 * committed file bit for bit (docs/reliability.md).
 */
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "natremia.h"
#include "ntr_contract.h"

#define LINE_MAX_CHARS 8192

typedef struct out_buf {
    char text[LINE_MAX_CHARS];
    size_t len;
} out_buf;

static void put_str(out_buf *b, const char *s);

/* A double as C99's %a prints it with the GNU C library ("0x1.8p+1",
 * "0x0.0000000000001p-1022", "-0x0p+0", "inf", "-nan"), written out here
 * from the bits so that every C library -- newlib on the Cortex-M4 has no
 * %a -- gives the same text. */
static void put_hex_double(out_buf *b, double x)
{
    static const char digits[] = "0123456789abcdef";
    char text[40];
    size_t n = 0;
    uint64_t bits;
    uint64_t mant;
    int exp;
    int lead;
    int i;
    int last;
    memcpy(&bits, &x, sizeof bits);
    mant = bits & 0xfffffffffffffull;
    exp = (int)((bits >> 52) & 0x7ffu);
    if (bits >> 63) {
        text[n++] = '-';
    }
    if (exp == 0x7ff) {
        memcpy(text + n, mant ? "nan" : "inf", 4);
        put_str(b, text);
        return;
    }
    if (exp == 0 && mant == 0) {
        memcpy(text + n, "0x0p+0", 7);
        put_str(b, text);
        return;
    }
    lead = exp == 0 ? 0 : 1;
    exp = exp == 0 ? -1022 : exp - 1023;
    text[n++] = '0';
    text[n++] = 'x';
    text[n++] = (char)('0' + lead);
    last = -1;
    for (i = 0; i < 13; i++) {
        if ((mant >> (48 - 4 * i)) & 0xfu) {
            last = i;
        }
    }
    if (last >= 0) {
        text[n++] = '.';
        for (i = 0; i <= last; i++) {
            text[n++] = digits[(mant >> (48 - 4 * i)) & 0xfu];
        }
    }
    text[n++] = 'p';
    text[n++] = exp < 0 ? '-' : '+';
    {
        char rev[8];
        int k = 0;
        unsigned int e = (unsigned int)(exp < 0 ? -exp : exp);
        do {
            rev[k++] = (char)('0' + e % 10u);
            e /= 10u;
        } while (e != 0u);
        while (k > 0) {
            text[n++] = rev[--k];
        }
    }
    text[n] = '\0';
    put_str(b, text);
}

/* " " followed by the double. */
static void put(out_buf *b, const char *fmt, double x)
{
    (void)fmt;
    put_str(b, " ");
    put_hex_double(b, x);
}

static void put_int(out_buf *b, const char *fmt, long x)
{
    int k = snprintf(b->text + b->len, sizeof b->text - b->len, fmt, x);
    if (k > 0 && b->len + (size_t)k < sizeof b->text) {
        b->len += (size_t)k;
    }
}

static void put_str(out_buf *b, const char *s)
{
    size_t n = strlen(s);
    if (b->len + n < sizeof b->text) {
        memcpy(b->text + b->len, s, n + 1);
        b->len += n;
    }
}

/* FNV-1a over the values (not the bytes) of the series inputs, so the
 * fingerprint does not depend on byte order. */
static uint64_t fnv(uint64_t h, uint64_t v)
{
    int i;
    for (i = 0; i < 8; i++) {
        h ^= (v >> (8 * i)) & 0xffu;
        h *= 1099511628211ull;
    }
    return h;
}

static uint64_t dbits(double x)
{
    uint64_t u;
    memcpy(&u, &x, sizeof u);
    return u;
}

static uint64_t series_print(const ntrc_case *c)
{
    uint64_t h = 14695981039346656037ull;
    size_t i;
    h = fnv(h, (uint64_t)c->n);
    for (i = 0; i < c->n && i < NTRC_MAX_SERIES; i++) {
        h = fnv(h, dbits(c->samples[i].hours));
        h = fnv(h, dbits(c->samples[i].na_mmol_l));
    }
    for (i = 0; i < c->n && i < NTRC_MAX_FLOWS; i++) {
        h = fnv(h, dbits(c->flows[i].volume_l));
        h = fnv(h, dbits(c->flows[i].na_mmol_l));
        h = fnv(h, dbits(c->flows[i].k_mmol_l));
    }
    h = fnv(h, (uint64_t)c->n2);
    for (i = 0; i < c->n2; i++) {
        h = fnv(h, dbits(c->tflows[i].start_h));
        h = fnv(h, dbits(c->tflows[i].end_h));
        h = fnv(h, dbits(c->tflows[i].rate_ml_h));
        h = fnv(h, dbits(c->tflows[i].na_mmol_l));
        h = fnv(h, dbits(c->tflows[i].k_mmol_l));
        h = fnv(h, (uint64_t)c->tflows[i].reserved[0] ^ ((uint64_t)c->tflows[i].reserved[1] << 32));
    }
    return fnv(h, (uint64_t)c->capacity);
}

/* ---- a deterministic source of inputs ---------------------------------- */

typedef struct lcg_state {
    uint32_t s;
} lcg_state;

static uint32_t lcg_next(lcg_state *g)
{
    g->s = g->s * 1664525u + 1013904223u;
    return g->s >> 8;
}

/* A grid point of lo..hi: lo + (hi - lo) * k / 1000, k = 0..1000. */
static double grid(lcg_state *g, double lo, double hi)
{
    return lo + (hi - lo) * ((double)(lcg_next(g) % 1001u) / 1000.0);
}

static double src_number(ntrc_source *src, double lo, double hi)
{
    return grid((lcg_state *)src->ctx, lo, hi);
}

static unsigned int src_byte(ntrc_source *src)
{
    return lcg_next((lcg_state *)src->ctx) & 0xffu;
}

/* ---- the vectors --------------------------------------------------------- */

static void emit_case(const ntrc_fn *f, ntrc_case *c, int idx, int with_series, FILE *to)
{
    out_buf b;
    int st;
    int i;
    double vals[2 * NTRC_MAX_SERIES + 16];
    int nv = 0;
    b.len = 0;
    b.text[0] = '\0';
    put_str(&b, f->name);
    put_int(&b, " #%ld", idx);
    for (i = 0; i < f->n_enum; i++) {
        put_int(&b, " %ld", c->en[i]);
    }
    put_str(&b, " |");
    for (i = 0; i < f->n_num; i++) {
        put(&b, "%a", c->num[i]);
    }
    if (with_series) {
        static const char digits[] = "0123456789abcdef";
        char hex[20];
        uint64_t h = series_print(c);
        int k;
        hex[0] = ' ';
        hex[1] = 's';
        for (k = 0; k < 16; k++) {
            hex[2 + k] = digits[(h >> (60 - 4 * k)) & 0xfu];
        }
        hex[18] = '\0';
        put_str(&b, hex);
    }
    ntrc_fill_sentinel(c);
    if (f->prepare_out != NULL) {
        f->prepare_out(c);
    }
    st = f->call(c);
    put_int(&b, " -> %ld", st);
    if (st == NTR_OK) {
        if (f->results != NULL) {
            nv = f->results(c, vals, (int)(sizeof vals / sizeof vals[0]));
        } else {
            for (i = 0; i < f->n_out_d; i++) {
                vals[nv++] = c->out.d[i];
            }
            for (i = 0; i < f->n_out_i; i++) {
                vals[nv++] = (double)c->out.i[i];
            }
        }
        for (i = 0; i < nv; i++) {
            put(&b, "%a", vals[i]);
        }
    }
    fprintf(to, "%s\n", b.text);
}

static void emit_function(const ntrc_fn *f, FILE *to)
{
    lcg_state g;
    ntrc_source src;
    ntrc_case c;
    long combos = 1;
    long combo;
    int idx = 0;
    int i;
    int with_series = f->base_series != NULL || f->fuzz_series != NULL;
    g.s = 2024u;
    src.number = src_number;
    src.byte = src_byte;
    src.ctx = &g;
    for (i = 0; i < f->n_enum; i++) {
        combos *= f->en[i].n_valid > 0 ? f->en[i].n_valid : 1;
        if (combos > 8) {
            combos = 9;
        }
    }
    for (combo = 0; combo < (combos > 8 ? 8 : combos); combo++) {
        int tuple;
        /* Functions of enumerators alone need one call per choice. */
        int tuples = (f->n_num == 0 && !with_series) ? 1 : 8;
        for (tuple = 0; tuple < tuples; tuple++) {
            long rest = combo;
            ntrc_baseline(f, &c);
            for (i = 0; i < f->n_enum; i++) {
                int nv = f->en[i].n_valid;
                if (nv > 0) {
                    long pick = combos > 8 ? (long)(lcg_next(&g) % (uint32_t)nv) : rest % nv;
                    c.en[i] = f->en[i].valid[pick];
                    rest /= nv;
                }
            }
            /* 0 baseline, 1 low ends, 2 high ends, 3.. grid points */
            for (i = 0; i < f->n_num && tuple > 0; i++) {
                const ntrc_num *spec = &f->num[i];
                if (tuple == 1) {
                    c.num[i] = spec->lo_open ? nextafter(spec->lo, spec->hi) : spec->lo;
                } else if (tuple == 2) {
                    c.num[i] = spec->hi;
                } else {
                    c.num[i] = grid(&g, spec->lo, spec->hi);
                }
            }
            if (tuple >= 4 && f->fuzz_series != NULL) {
                f->fuzz_series(&c, &src);
            }
            emit_case(f, &c, idx++, with_series, to);
        }
    }
}

static void emit_batch(const ntrc_batch_fn *bf, FILE *to)
{
    const ntrc_fn *f = ntrc_find(bf->scalar);
    ntrc_batch_case b;
    lcg_state g;
    size_t i;
    int k;
    int st;
    out_buf line;
    g.s = 77u;
    memset(&b, 0, sizeof b);
    b.n = 12;
    b.call_en = f->base_en[0];
    for (i = 0; i < b.n; i++) {
        for (k = 0; k < bf->n_cols; k++) {
            /* one row in four steps past the top of the range */
            double hi = f->num[k].hi * (i % 4 == 3 ? 1.5 : 1.0) + (i % 4 == 3 ? 1.0 : 0.0);
            b.col[k][i] = grid(&g, f->num[k].lo, hi);
        }
        b.row_en[i] = f->en[0].n_valid > 0 ? f->en[0].valid[i % (size_t)f->en[0].n_valid] : 0;
    }
    st = bf->call(&b);
    line.len = 0;
    line.text[0] = '\0';
    put_str(&line, bf->name);
    put_int(&line, " -> %ld", st);
    put_int(&line, " failed %ld", (long)b.failed);
    fprintf(to, "%s\n", line.text);
    for (i = 0; i < b.n; i++) {
        line.len = 0;
        line.text[0] = '\0';
        put_str(&line, bf->name);
        put_int(&line, " row %ld |", (long)i);
        for (k = 0; k < bf->n_cols; k++) {
            put(&line, "%a", b.col[k][i]);
        }
        put_int(&line, " -> %ld", b.status[i]);
        if (bf->int_out) {
            put_int(&line, " %ld", b.out_i[i]);
        } else {
            put(&line, "%a", b.out[i]);
        }
        fprintf(to, "%s\n", line.text);
    }
}

static void emit_all(FILE *to)
{
    size_t i;
    int code;
    fprintf(to, "# natremia reference vectors: function #case enumerators | inputs -> status results\n");
    for (code = -1; code <= 9; code++) {
        fprintf(to, "ntr_status_message %d -> %s\n", code, ntr_status_message(code));
    }
    for (i = 0; i < ntrc_n_functions; i++) {
        emit_function(&ntrc_functions[i], to);
    }
    for (i = 0; i < ntrc_n_batch_functions; i++) {
        emit_batch(&ntrc_batch_functions[i], to);
    }
}

/* Where the C library has %a (glibc), require put_hex_double() to write
 * exactly its text for special values and 100000 random bit patterns. */
static int formatter_matches_libc(void)
{
#ifdef __GLIBC__
    const double special[] = {0.0, -0.0, 1.0, -1.5, 0.1, 4.9406564584124654e-324,
                              2.2250738585072009e-308, 2.2250738585072014e-308,
                              1.7976931348623157e308, HUGE_VAL, -HUGE_VAL, NAN, -NAN};
    lcg_state g;
    size_t i;
    g.s = 99u;
    for (i = 0; i < 100000 + sizeof special / sizeof special[0]; i++) {
        out_buf mine;
        char libc[64];
        double x;
        if (i < sizeof special / sizeof special[0]) {
            x = special[i];
        } else {
            uint64_t bits = ((uint64_t)lcg_next(&g) << 40) ^ ((uint64_t)lcg_next(&g) << 20) ^
                            (uint64_t)lcg_next(&g);
            memcpy(&x, &bits, sizeof x);
        }
        mine.len = 0;
        mine.text[0] = '\0';
        put_hex_double(&mine, x);
        snprintf(libc, sizeof libc, "%a", x);
        if (strcmp(mine.text, libc) != 0) {
            fprintf(stderr, "refvectors: hex formatter wrote %s where %%a writes %s\n", mine.text,
                    libc);
            return 0;
        }
    }
#endif
    return 1;
}

/* Compare the vectors with a file, line by line. */
static int check(const char *path)
{
    FILE *want = fopen(path, "r");
    FILE *got = tmpfile();
    char a[LINE_MAX_CHARS];
    char b[LINE_MAX_CHARS];
    long line = 0;
    long differ = 0;
    if (want == NULL || got == NULL) {
        fprintf(stderr, "refvectors: cannot open %s or a temporary file\n", path);
        return 1;
    }
    if (!formatter_matches_libc()) {
        return 1;
    }
    emit_all(got);
    rewind(got);
    for (;;) {
        char *ra = fgets(a, sizeof a, want);
        char *rb = fgets(b, sizeof b, got);
        if (ra == NULL && rb == NULL) {
            break;
        }
        line++;
        if (ra == NULL || rb == NULL || strcmp(a, b) != 0) {
            if (++differ <= 10) {
                fprintf(stderr, "line %ld differs\n  expected: %s  computed: %s", line,
                        ra ? a : "(end of file)\n", rb ? b : "(end of output)\n");
            }
        }
    }
    fclose(want);
    fclose(got);
    if (differ != 0) {
        fprintf(stderr, "refvectors: %ld of %ld lines differ from %s\n", differ, line, path);
        return 1;
    }
    printf("refvectors: %ld lines identical to %s\n", line, path);
    return 0;
}

int main(int argc, char **argv)
{
    if (argc == 3 && strcmp(argv[1], "--check") == 0) {
        return check(argv[2]);
    }
    if (argc != 1) {
        fprintf(stderr, "usage: refvectors [--check FILE]\n");
        return 2;
    }
    emit_all(stdout);
    return 0;
}
