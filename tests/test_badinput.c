/* SPDX-License-Identifier: MIT */
/* Bad-input matrix: every public function, every kind of bad input.
 *
 * For each entry of the contract table (tests/fuzz/ntr_contract.c) the
 * valid baseline call is taken and then spoilt one way at a time, and in
 * pairs to prove the checking order: each output/input pointer NULL; every
 * enumerator set to values outside its documented set; every number set to
 * NaN, -NaN, +-infinity, negative, zero, -0, each range edge and the double
 * just past it, absurdly large and tiny values and subnormals; series
 * functions get n = 0, unsorted series and too-small buffers through their
 * table hooks. Every call is judged by the shared contract: the exact
 * status the documented checking order demands, outputs untouched (their
 * sentinel bit pattern intact) on error, finite and within documented
 * bounds on success.
 *
 * The test also reads include/natremia.h (path given as the first
 * argument) and fails if any NTR_API function is missing from the table,
 * and proves the judge is not vacuous by feeding it deliberately broken
 * stand-in functions. It prints how many cases it tried.
 */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <float.h>
#include <limits.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <cmocka.h>

#include "natremia.h"
#include "ntr_contract.h"

static const char *header_path = NULL;
static unsigned long cases_tried = 0;
static unsigned long cases_by_kind[8];

/* Judge one case; on a breach, fail with a description of the call. */
static void judge(const ntrc_fn *f, ntrc_case *c, int kind)
{
    int status = -1;
    const char *breach = ntrc_run_and_judge(f, c, &status);
    int i;
    cases_tried++;
    cases_by_kind[kind]++;
    if (breach == NULL) {
        return;
    }
    print_error("%s: %s (status %d, expected %d)\n", f->name, breach, status,
                ntrc_predict(f, c));
    for (i = 0; i < f->n_enum; i++) {
        print_error("  %s = %d\n", f->en[i].name, c->en[i]);
    }
    for (i = 0; i < f->n_num; i++) {
        print_error("  %s = %a\n", f->num[i].name, c->num[i]);
    }
    print_error("  null mask 0x%x, n %lu, n2 %lu, capacity %lu\n", c->out_null,
                (unsigned long)c->n, (unsigned long)c->n2, (unsigned long)c->capacity);
    fail();
}

/* Numbers that are bad (or edge) for an input documented as lo..hi. */
static size_t number_matrix(const ntrc_num *spec, double *v)
{
    size_t k = 0;
    v[k++] = NAN;
    v[k++] = -NAN;
    v[k++] = HUGE_VAL;
    v[k++] = -HUGE_VAL;
    v[k++] = -1.0;
    v[k++] = 0.0;
    v[k++] = -0.0;
    v[k++] = spec->lo;
    v[k++] = spec->hi;
    v[k++] = nextafter(spec->lo, -HUGE_VAL);
    v[k++] = nextafter(spec->hi, HUGE_VAL);
    v[k++] = spec->lo - 1.0;
    v[k++] = spec->hi + 1.0;
    v[k++] = -spec->hi;
    v[k++] = spec->hi * 1e3;
    v[k++] = 1e300;
    v[k++] = -1e300;
    v[k++] = DBL_MAX;
    v[k++] = -DBL_MAX;
    v[k++] = DBL_MIN;
    v[k++] = -DBL_MIN;
    v[k++] = 4.9406564584124654e-324; /* smallest subnormal */
    v[k++] = -4.9406564584124654e-324;
    v[k++] = (spec->lo + spec->hi) / 2.0;
    return k;
}

/* Enumerator values outside (and the whole of) the documented set. */
static size_t enum_matrix(const ntrc_enum *spec, int *v)
{
    size_t k = 0;
    int i;
    int top = 0;
    for (i = 0; i < spec->n_valid; i++) {
        v[k++] = spec->valid[i];
        if (spec->valid[i] > top) {
            top = spec->valid[i];
        }
    }
    v[k++] = 0;
    v[k++] = -1;
    v[k++] = top + 1;
    v[k++] = top + 2;
    v[k++] = 99;
    v[k++] = 1000;
    v[k++] = -1000;
    v[k++] = INT_MAX;
    v[k++] = INT_MIN;
    return k;
}

static void null_cases(const ntrc_fn *f)
{
    ntrc_case c;
    int i;
    unsigned int all = 0u;
    for (i = 0; i < f->n_out_d; i++) {
        all |= NTRC_NULL_D(i);
    }
    for (i = 0; i < f->n_out_i; i++) {
        all |= NTRC_NULL_I(i);
    }
    for (i = 0; i < f->n_in_ptr; i++) {
        all |= NTRC_NULL_IN(i);
    }
    for (i = 0; i < 32; i++) {
        unsigned int bit = 1u << i;
        if ((all & bit) == 0u) {
            continue;
        }
        /* One pointer NULL, everything else valid. */
        ntrc_baseline(f, &c);
        c.out_null = bit;
        judge(f, &c, NTRC_KIND_NULL);
        /* NULL beats every later check: bad enumerators and NaN numbers. */
        ntrc_baseline(f, &c);
        c.out_null = bit;
        {
            int e;
            int n;
            for (e = 0; e < f->n_enum; e++) {
                c.en[e] = INT_MIN;
            }
            for (n = 0; n < f->n_num; n++) {
                c.num[n] = NAN;
            }
        }
        judge(f, &c, NTRC_KIND_ORDER);
    }
    if (all != 0u) {
        ntrc_baseline(f, &c);
        c.out_null = all;
        judge(f, &c, NTRC_KIND_NULL);
    }
}

static void enum_cases(const ntrc_fn *f)
{
    ntrc_case c;
    int values[NTRC_MAX_VALID + 16];
    int i;
    for (i = 0; i < f->n_enum; i++) {
        size_t nv = enum_matrix(&f->en[i], values);
        size_t k;
        for (k = 0; k < nv; k++) {
            int n;
            ntrc_baseline(f, &c);
            c.en[i] = values[k];
            judge(f, &c, NTRC_KIND_ENUM);
            /* A bad enumerator beats bad numbers. */
            ntrc_baseline(f, &c);
            c.en[i] = values[k];
            for (n = 0; n < f->n_num; n++) {
                c.num[n] = HUGE_VAL;
            }
            judge(f, &c, NTRC_KIND_ORDER);
        }
        /* Every valid value together with every valid value of the others
         * is covered by the sweep below; here the earlier enumerator must
         * win when two are bad. */
        if (i + 1 < f->n_enum) {
            ntrc_baseline(f, &c);
            c.en[i] = -7;
            c.en[i + 1] = -7;
            judge(f, &c, NTRC_KIND_ORDER);
        }
    }
}

static void number_cases(const ntrc_fn *f)
{
    ntrc_case c;
    double values[32];
    int i;
    int j;
    for (i = 0; i < f->n_num; i++) {
        size_t nv = number_matrix(&f->num[i], values);
        size_t k;
        for (k = 0; k < nv; k++) {
            ntrc_baseline(f, &c);
            c.num[i] = values[k];
            judge(f, &c, NTRC_KIND_NUMBER);
        }
    }
    /* Order between numbers: the earlier bad argument decides. */
    for (i = 0; i < f->n_num; i++) {
        for (j = 0; j < f->n_num; j++) {
            if (i == j) {
                continue;
            }
            ntrc_baseline(f, &c);
            c.num[i] = NAN;
            c.num[j] = f->num[j].hi * 2.0 + 1.0;
            judge(f, &c, NTRC_KIND_ORDER);
            ntrc_baseline(f, &c);
            c.num[i] = f->num[i].lo - 1.0;
            c.num[j] = -HUGE_VAL;
            judge(f, &c, NTRC_KIND_ORDER);
        }
    }
}

/* Deterministic pseudo-random values (an LCG; no global state). */
static uint32_t lcg(uint32_t *s)
{
    *s = *s * 1664525u + 1013904223u;
    return *s >> 8;
}

/* Every valid enumerator combination, each with in-range numbers spread
 * over the whole documented box (so DOMAIN errors and bounds are met). */
static void sweep_cases(const ntrc_fn *f)
{
    ntrc_case c;
    uint32_t seed = 12345u;
    long combos = 1;
    long combo;
    int i;
    for (i = 0; i < f->n_enum; i++) {
        combos *= f->en[i].n_valid > 0 ? f->en[i].n_valid : 1;
        if (combos > 64) {
            combos = 65; /* too many to enumerate: 64 random combinations */
        }
    }
    for (combo = 0; combo < (combos > 64 ? 64 : combos); combo++) {
        int rep;
        for (rep = 0; rep < 40; rep++) {
            long rest = combo;
            ntrc_baseline(f, &c);
            for (i = 0; i < f->n_enum; i++) {
                int nv = f->en[i].n_valid;
                if (nv > 0) {
                    long pick = combos > 64 ? (long)(lcg(&seed) % (uint32_t)nv) : rest % nv;
                    c.en[i] = f->en[i].valid[pick];
                    rest /= nv;
                }
            }
            for (i = 0; i < f->n_num; i++) {
                double u = (double)(lcg(&seed) % 1001u) / 1000.0;
                c.num[i] = f->num[i].lo + (f->num[i].hi - f->num[i].lo) * u;
            }
            judge(f, &c, NTRC_KIND_SWEEP);
        }
    }
}

static void walk_function(void **state)
{
    const ntrc_fn *f = (const ntrc_fn *)*state;
    ntrc_case c;
    int status;
    /* The baseline itself must succeed. */
    ntrc_baseline(f, &c);
    assert_null(ntrc_run_and_judge(f, &c, &status));
    assert_int_equal(status, NTR_OK);
    cases_tried++;
    cases_by_kind[NTRC_KIND_OTHER]++;
    null_cases(f);
    enum_cases(f);
    number_cases(f);
    sweep_cases(f);
    if (f->extra_cases != NULL) {
        f->extra_cases(f, judge);
    }
}

/* ---- functions without a status ------------------------------------------ */

static void statusless_functions(void **state)
{
    const int codes[] = {INT_MIN, -1000, -1, 0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 255, INT_MAX};
    size_t i;
    (void)state;
    for (i = 0; i < sizeof codes / sizeof codes[0]; i++) {
        const char *m = ntr_status_message(codes[i]);
        assert_non_null(m);
        assert_true(strlen(m) > 0 && strlen(m) < 200);
        cases_tried++;
        cases_by_kind[NTRC_KIND_OTHER]++;
    }
    assert_non_null(ntr_version_string());
    assert_true(ntr_version_number() > 0ul);
    cases_tried += 2;
    cases_by_kind[NTRC_KIND_OTHER] += 2;
}

/* ---- unit strings the table does not hold ---------------------------------- */

/* The 1.1 text readers on exact-size heap copies too: ntr_unit_parse_lenient
 * (unit 0 = refused) and ntr_loinc_lookup (analyte 0 = unknown). */
static void lenient_and_loinc_strings(void)
{
    static const struct {
        const char *text;
        int unit;
    } lenient[] = {
        {"", 0}, {" ", 0}, {"m", 0}, {"mEq/L", NTR_UNIT_MEQ_L}, {"mmol/l ", NTR_UNIT_MMOL_L},
        {"\xc2", 0}, {"\xc2\xb5", 0}, {"\xc2\xb5mol/L", NTR_UNIT_UMOL_L}, {"\xce\xbc", 0},
        {"mOsm/kg{H2O}", NTR_UNIT_MOSM_KG}, {"mosm/kg H2O", NTR_UNIT_MOSM_KG},
        {"mosm/kg H", 0}, {"mOsm/L", 0}, {"\xff", 0},
        {"                          g/l", NTR_UNIT_G_L},
        {"                                 g/l", 0},
    };
    static const struct {
        const char *code;
        int analyte;
    } loinc[] = {
        {"", 0}, {"2", 0}, {"2951-", 0}, {"2951-2", NTR_ANALYTE_SODIUM}, {"2951-2x", 0},
        {"14933-6", NTR_ANALYTE_URIC_ACID}, {"14933-", 0}, {"\xff", 0},
    };
    size_t i;
    for (i = 0; i < sizeof lenient / sizeof lenient[0]; i++) {
        size_t len = strlen(lenient[i].text);
        char *s = malloc(len + 1);
        int unit = -77;
        assert_non_null(s);
        memcpy(s, lenient[i].text, len + 1);
        assert_int_equal(ntr_unit_parse_lenient(s, &unit),
                         lenient[i].unit != 0 ? NTR_OK : NTR_ERR_UNIT);
        assert_int_equal(unit, lenient[i].unit != 0 ? lenient[i].unit : -77);
        free(s);
        cases_tried++;
        cases_by_kind[NTRC_KIND_OTHER]++;
    }
    for (i = 0; i < sizeof loinc / sizeof loinc[0]; i++) {
        size_t len = strlen(loinc[i].code);
        char *s = malloc(len + 1);
        int analyte = -77, specimen = -77, unit = -77;
        assert_non_null(s);
        memcpy(s, loinc[i].code, len + 1);
        assert_int_equal(ntr_loinc_lookup(s, &analyte, &specimen, &unit),
                         loinc[i].analyte != 0 ? NTR_OK : NTR_ERR_UNIT);
        assert_int_equal(analyte, loinc[i].analyte != 0 ? loinc[i].analyte : -77);
        free(s);
        cases_tried++;
        cases_by_kind[NTRC_KIND_OTHER]++;
    }
}

static void unit_parse_strings(void **state)
{
    /* Exact-size heap copies, so a read past the NUL is caught by ASan or
     * valgrind when the suite runs under tests/sanitize.sh. */
    const char *strings[] = {"", "m", "mm", "mmol", "mmol/", "mmol/L", "mmol/LL", "mg/dL",
                             "mg/dL\x7f", "g", "g/", "g/L", "umol/L", "umol/l", "\xff",
                             "meq/L", "mosm/kg", "mosm/kgX"};
    const char *accepted[] = {"mmol/L", "mg/dL", "meq/L", "mosm/kg", "g/L", "umol/L"};
    size_t i;
    (void)state;
    for (i = 0; i < sizeof strings / sizeof strings[0]; i++) {
        size_t len = strlen(strings[i]);
        char *s = malloc(len + 1);
        int unit = -77;
        int want = NTR_ERR_UNIT;
        int want_unit = -77;
        size_t a;
        assert_non_null(s);
        memcpy(s, strings[i], len + 1);
        for (a = 0; a < 6; a++) {
            if (strcmp(s, accepted[a]) == 0) {
                want = NTR_OK;
                want_unit = (int)a + 1;
            }
        }
        assert_int_equal(ntr_unit_parse(s, &unit), want);
        assert_int_equal(unit, want_unit);
        free(s);
        cases_tried++;
        cases_by_kind[NTRC_KIND_OTHER]++;
    }
    lenient_and_loinc_strings();
}

/* ---- the table covers the header ------------------------------------------- */

static int in_table(const char *name)
{
    size_t i;
    for (i = 0; i < ntrc_n_functions; i++) {
        if (strcmp(ntrc_functions[i].name, name) == 0) {
            return 1;
        }
    }
    for (i = 0; i < ntrc_n_batch_functions; i++) {
        if (strcmp(ntrc_batch_functions[i].name, name) == 0) {
            return 1;
        }
    }
    for (i = 0; i < ntrc_n_statusless; i++) {
        if (strcmp(ntrc_statusless[i], name) == 0) {
            return 1;
        }
    }
    return 0;
}

/* Every NTR_API declaration in the header: the identifier just before the
 * first '(' after the macro (declarations may span lines). */
static void every_header_function_is_in_the_table(void **state)
{
    FILE *h;
    static char text[1 << 20];
    size_t len;
    const char *p;
    int found = 0;
    int missing = 0;
    (void)state;
    if (header_path == NULL) {
        skip();
    }
    h = fopen(header_path, "r");
    assert_non_null(h);
    len = fread(text, 1, sizeof text - 1, h);
    fclose(h);
    text[len] = '\0';
    for (p = strstr(text, "NTR_API "); p != NULL; p = strstr(p + 1, "NTR_API ")) {
        const char *paren = strchr(p, '(');
        const char *end;
        const char *start;
        char buf[128];
        size_t n;
        if (p > text && p[-1] != '\n') {
            continue; /* not at the start of a line: the macro's definition */
        }
        if (paren == NULL) {
            break;
        }
        end = paren;
        while (end > p && end[-1] == ' ') {
            end--;
        }
        start = end;
        while (start > p && ((start[-1] >= 'a' && start[-1] <= 'z') ||
                             (start[-1] >= '0' && start[-1] <= '9') || start[-1] == '_')) {
            start--;
        }
        n = (size_t)(end - start);
        if (n == 0 || n >= sizeof buf || strncmp(start, "ntr_", 4) != 0) {
            continue;
        }
        memcpy(buf, start, n);
        buf[n] = '\0';
        found++;
        if (!in_table(buf)) {
            print_error("%s is declared in the header but has no entry in the contract "
                        "table (tests/fuzz/ntr_contract.c)\n", buf);
            missing++;
        }
    }
    print_message("header: %d public functions, %lu in the table, %lu without status\n", found,
                  (unsigned long)ntrc_n_functions, (unsigned long)ntrc_n_statusless);
    assert_true(found >= (int)(ntrc_n_functions + ntrc_n_batch_functions + ntrc_n_statusless));
    assert_int_equal(missing, 0);
}

/* ---- the judge catches breaches --------------------------------------------- */

/* Stand-ins that break the contract in one way each. */
static int writes_on_error(ntrc_case *c)
{
    c->out.d[0] = 1.0;
    return NTR_ERR_RANGE;
}

static int wrong_order(ntrc_case *c)
{
    (void)c;
    return NTR_ERR_RANGE; /* even for NaN, which must give NONFINITE */
}

static int nonfinite_success(ntrc_case *c)
{
    c->out.d[0] = HUGE_VAL;
    return NTR_OK;
}

static int undefined_status(ntrc_case *c)
{
    (void)c;
    return 42;
}

static int forgets_output(ntrc_case *c)
{
    (void)c;
    return NTR_OK;
}

static const char *never_ok(const ntrc_case *c)
{
    (void)c;
    return "out of bounds";
}

static int well_behaved(ntrc_case *c)
{
    if (c->out_null != 0u) {
        return NTR_ERR_NULL;
    }
    if (!isfinite(c->num[0])) {
        return NTR_ERR_NONFINITE;
    }
    if (c->num[0] < 0.0 || c->num[0] > 1.0) {
        return NTR_ERR_RANGE;
    }
    c->out.d[0] = c->num[0];
    return NTR_OK;
}

static void the_judge_catches_breaches(void **state)
{
    ntrc_fn f;
    ntrc_case c;
    int status;
    (void)state;
    memset(&f, 0, sizeof f);
    f.name = "stand-in";
    f.n_num = 1;
    f.num[0].name = "x";
    f.num[0].lo = 0.0;
    f.num[0].hi = 1.0;
    f.n_out_d = 1;
    f.statuses = 0x0fu; /* OK, NULL, NONFINITE, RANGE */
    f.base_num[0] = 0.5;

    f.call = well_behaved;
    ntrc_baseline(&f, &c);
    assert_null(ntrc_run_and_judge(&f, &c, &status));
    c.num[0] = NAN;
    assert_null(ntrc_run_and_judge(&f, &c, &status));
    assert_int_equal(status, NTR_ERR_NONFINITE);

    f.call = writes_on_error;
    ntrc_baseline(&f, &c);
    c.num[0] = 2.0;
    assert_non_null(ntrc_run_and_judge(&f, &c, &status));

    f.call = wrong_order;
    ntrc_baseline(&f, &c);
    c.num[0] = NAN;
    assert_non_null(ntrc_run_and_judge(&f, &c, &status));

    f.call = nonfinite_success;
    ntrc_baseline(&f, &c);
    assert_non_null(ntrc_run_and_judge(&f, &c, &status));

    f.call = undefined_status;
    ntrc_baseline(&f, &c);
    assert_non_null(ntrc_run_and_judge(&f, &c, &status));

    f.call = forgets_output;
    ntrc_baseline(&f, &c);
    assert_non_null(ntrc_run_and_judge(&f, &c, &status));

    f.call = well_behaved;
    f.check_ok = never_ok;
    ntrc_baseline(&f, &c);
    assert_non_null(ntrc_run_and_judge(&f, &c, &status));
}

/* ---- batch entry points --------------------------------------------------- */

static void judge_batch(const ntrc_batch_fn *bf, ntrc_batch_case *b)
{
    int status = -1;
    const char *breach = ntrc_batch_run_and_judge(bf, b, &status);
    cases_tried++;
    cases_by_kind[NTRC_KIND_BATCH]++;
    if (breach != NULL) {
        print_error("%s: %s (status %d, n %lu, null 0x%x, in place %d)\n", bf->name, breach,
                    status, (unsigned long)b->n, b->null_mask, b->in_place);
        fail();
    }
}

/* Rows: the scalar baseline, then each row spoilt in one column. */
static void batch_rows(const ntrc_batch_fn *bf, const ntrc_fn *f, ntrc_batch_case *b, size_t n)
{
    const double bad[] = {NAN, HUGE_VAL, -HUGE_VAL, -1e300, 1e300, -1.0};
    size_t i;
    int k;
    memset(b, 0, sizeof *b);
    b->n = n;
    b->call_en = f->base_en[0];
    for (i = 0; i < n; i++) {
        for (k = 0; k < bf->n_cols; k++) {
            b->col[k][i] = f->base_num[k];
        }
        b->row_en[i] = f->base_en[0];
        if (i % 3 == 1 && bf->n_cols > 0) {
            b->col[i % (size_t)bf->n_cols][i] = bad[i % 6];
        }
        if (bf->row_enum && i % 5 == 4) {
            b->row_en[i] = 77;
        }
    }
}

static void batch_function(void **state)
{
    const ntrc_batch_fn *bf = (const ntrc_batch_fn *)*state;
    const ntrc_fn *f = ntrc_find(bf->scalar);
    ntrc_batch_case b;
    size_t n;
    unsigned int bit;
    int k;
    assert_non_null(f);
    /* All rows valid; n = 0; mixed rows of every length. */
    for (n = 0; n <= NTRC_MAX_ROWS; n += (n < 4 ? 1 : 5)) {
        batch_rows(bf, f, &b, n);
        judge_batch(bf, &b);
    }
    batch_rows(bf, f, &b, 3);
    for (k = 0; k < 3; k++) {
        for (n = 0; n < 3; n++) {
            b.col[0][n] = f->base_num[0];
        }
        judge_batch(bf, &b);
    }
    /* Every pointer NULL in turn, with n rows and with n = 0. */
    for (bit = 0; bit < 12; bit++) {
        for (n = 0; n <= 4; n += 4) {
            batch_rows(bf, f, &b, n);
            b.null_mask = 1u << bit;
            judge_batch(bf, &b);
        }
    }
    /* A bad call-level enumerator, alone and with NULL (NULL wins). */
    if (bf->call_enum) {
        const int bad[] = {0, -1, 3, 99, INT_MIN, INT_MAX};
        size_t j;
        for (j = 0; j < sizeof bad / sizeof bad[0]; j++) {
            batch_rows(bf, f, &b, 5);
            b.call_en = bad[j];
            judge_batch(bf, &b);
            b.null_mask = 1u << 10;
            judge_batch(bf, &b);
        }
    }
    /* In place over each input column. */
    if (!bf->int_out) {
        for (k = 0; k < bf->n_cols; k++) {
            batch_rows(bf, f, &b, 7);
            b.in_place = k + 1;
            judge_batch(bf, &b);
        }
    }
}

/* ---- streaming watcher: every prefix equals the whole-series answer ------------ */

static void watch_streams(void **state)
{
    ntr_limits lim;
    ntr_sample s[NTRC_MAX_SERIES];
    size_t accepted;
    size_t i;
    int pattern;
    (void)state;
    assert_int_equal(ntr_limits_preset(NTR_LIMITS_STANDARD, &lim), NTR_OK);
    for (pattern = 0; pattern < 6; pattern++) {
        for (i = 0; i < NTRC_MAX_SERIES; i++) {
            double t = 0.5 * (double)i;
            switch (pattern) {
            case 0: s[i].hours = t; s[i].na_mmol_l = 110.0 + 0.25 * (double)i; break; /* steady rise */
            case 1: s[i].hours = t; s[i].na_mmol_l = 140.0 - 0.5 * (double)i; break;  /* fall */
            case 2: s[i].hours = 6.0 * (double)i; s[i].na_mmol_l = 110.0 + (double)(i % 7); break;
            case 3: s[i].hours = (double)(i / 3); s[i].na_mmol_l = 118.0 + (double)(i % 3); break; /* ties */
            case 4: s[i].hours = t; s[i].na_mmol_l = (i % 9 == 4) ? (double)NAN : 120.0 + 0.1 * (double)i; break;
            default: s[i].hours = (i % 5 == 3) ? t - 10.0 : t; s[i].na_mmol_l = 125.0; break; /* out of order */
            }
        }
        assert_null(ntrc_watch_replay(&lim, s, NTRC_MAX_SERIES, &accepted));
        cases_tried += NTRC_MAX_SERIES;
        cases_by_kind[NTRC_KIND_SERIES] += NTRC_MAX_SERIES;
    }
}

static int report_counts(void **state)
{
    (void)state;
    print_message("bad-input matrix: %lu cases tried over %lu functions "
                  "(NULL %lu, enumerators %lu, numbers %lu, checking order %lu, "
                  "series/buffers/structs %lu, in-range sweep %lu, batch %lu, other %lu)\n",
                  cases_tried,
                  (unsigned long)(ntrc_n_functions + ntrc_n_batch_functions + ntrc_n_statusless),
                  cases_by_kind[NTRC_KIND_NULL], cases_by_kind[NTRC_KIND_ENUM],
                  cases_by_kind[NTRC_KIND_NUMBER], cases_by_kind[NTRC_KIND_ORDER],
                  cases_by_kind[NTRC_KIND_SERIES], cases_by_kind[NTRC_KIND_SWEEP],
                  cases_by_kind[NTRC_KIND_BATCH], cases_by_kind[NTRC_KIND_OTHER]);
    return 0;
}

int main(int argc, char **argv)
{
    struct CMUnitTest *tests;
    size_t n = ntrc_n_functions + ntrc_n_batch_functions + 5;
    size_t i;
    int failed;
    if (argc > 1) {
        header_path = argv[1];
    }
    tests = calloc(n, sizeof *tests);
    if (tests == NULL) {
        return 1;
    }
    for (i = 0; i < ntrc_n_functions; i++) {
        tests[i].name = ntrc_functions[i].name;
        tests[i].test_func = walk_function;
        tests[i].initial_state = (void *)(uintptr_t)&ntrc_functions[i];
    }
    for (; i < ntrc_n_functions + ntrc_n_batch_functions; i++) {
        const ntrc_batch_fn *bf = &ntrc_batch_functions[i - ntrc_n_functions];
        tests[i].name = bf->name;
        tests[i].test_func = batch_function;
        tests[i].initial_state = (void *)(uintptr_t)bf;
    }
    tests[i].name = "watch_streams";
    tests[i++].test_func = watch_streams;
    tests[i].name = "status_and_version";
    tests[i++].test_func = statusless_functions;
    tests[i].name = "unit_parse_strings";
    tests[i++].test_func = unit_parse_strings;
    tests[i].name = "every_header_function_is_in_the_table";
    tests[i++].test_func = every_header_function_is_in_the_table;
    tests[i].name = "the_judge_catches_breaches";
    tests[i++].test_func = the_judge_catches_breaches;
    failed = _cmocka_run_group_tests("badinput", tests, n, NULL, report_counts);
    free(tests);
    return failed;
}
