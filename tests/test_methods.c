/* SPDX-License-Identifier: MIT */
/* Provenance: ntr_method_info and ntr_method_next (docs/methods.md).
 *
 * Run with the path of include/natremia.h as its argument (tests/meson.build
 * passes it): the test reads every `#define NTR_METHOD_<NAME> <id>` there and
 * proves the running library describes each one, and that every public
 * computing function's doc block names the method id(s) it uses. Ids added
 * later are picked up without editing this file. */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <limits.h>
#include <cmocka.h>

#include "natremia_test.h"

static const char *header_path;

/* ---- reading the header --------------------------------------------------- */

static char *read_file(const char *path)
{
    FILE *fp = fopen(path, "rb");
    char *text;
    long size;
    assert_non_null(fp);
    assert_int_equal(fseek(fp, 0, SEEK_END), 0);
    size = ftell(fp);
    assert_true(size > 0);
    assert_int_equal(fseek(fp, 0, SEEK_SET), 0);
    text = malloc((size_t)size + 1);
    assert_non_null(text);
    assert_int_equal(fread(text, 1, (size_t)size, fp), (size_t)size);
    text[size] = '\0';
    fclose(fp);
    return text;
}

#define MAX_HEADER_IDS 256

struct header_id {
    char name[64];
    int id;
};

/* Every "#define NTR_METHOD_<NAME> <digits>" at the start of a line. */
static size_t header_method_ids(const char *text, struct header_id *ids)
{
    static const char prefix[] = "#define NTR_METHOD_";
    size_t n = 0;
    const char *p = text;
    while ((p = strstr(p, prefix)) != NULL) {
        const char *name = p + strlen("#define ");
        const char *q = name;
        size_t len;
        if (p != text && p[-1] != '\n') {
            p++;
            continue;
        }
        while ((*q >= 'A' && *q <= 'Z') || (*q >= '0' && *q <= '9') || *q == '_') {
            q++;
        }
        len = (size_t)(q - name);
        while (*q == ' ' || *q == '\t') {
            q++;
        }
        if (*q >= '0' && *q <= '9') {
            assert_true(n < MAX_HEADER_IDS);
            assert_true(len < sizeof ids[n].name);
            memcpy(ids[n].name, name, len);
            ids[n].name[len] = '\0';
            ids[n].id = atoi(q);
            n++;
        }
        p = q;
    }
    return n;
}

/* ---- ntr_method_info ------------------------------------------------------ */

static int printable_ascii(const char *s)
{
    for (; *s != '\0'; s++) {
        if ((unsigned char)*s < 0x20 || (unsigned char)*s > 0x7e) {
            return 0;
        }
    }
    return 1;
}

/* A reference names a year (four digits from 1900 to 2099), or a
 * standards body whose current table is meant (IUPAC), or says it is
 * common practice, a textbook definition or derived. */
static int reference_is_traceable(const char *ref)
{
    const char *p;
    for (p = ref; p[0] != '\0' && p[1] != '\0' && p[2] != '\0' && p[3] != '\0'; p++) {
        if ((p[0] == '1' && p[1] == '9') || (p[0] == '2' && p[1] == '0')) {
            if (p[2] >= '0' && p[2] <= '9' && p[3] >= '0' && p[3] <= '9' &&
                (p == ref || p[-1] < '0' || p[-1] > '9') && (p[4] < '0' || p[4] > '9')) {
                return 1;
            }
        }
    }
    return strstr(ref, "ommon practice") != NULL || strstr(ref, "extbook") != NULL ||
           strstr(ref, "erived") != NULL || strstr(ref, "IUPAC") != NULL;
}

static void assert_entry_complete(int id)
{
    struct ntr_method_info info;
    const char *strings[4];
    size_t i;
    memset(&info, 0x5A, sizeof info);
    if (ntr_method_info(id, &info) != NTR_OK) {
        print_error("method id %d has no ntr_method_info entry (add it to lib/methods.c)\n", id);
        fail();
    }
    assert_int_equal(info.method, id);
    assert_int_equal(info.reserved_int, 0);
    for (i = 0; i < 4; i++) {
        assert_null(info.reserved[i]);
    }
    strings[0] = info.name;
    strings[1] = info.equation;
    strings[2] = info.reference;
    strings[3] = info.population;
    for (i = 0; i < 4; i++) {
        assert_non_null(strings[i]);
        if (strings[i][0] == '\0' || !printable_ascii(strings[i])) {
            print_error("method %d: string %u is empty or not printable ASCII\n", id,
                        (unsigned)i);
            fail();
        }
    }
    if (!reference_is_traceable(info.reference)) {
        print_error("method %d: reference names no year and no basis: %s\n", id, info.reference);
        fail();
    }
}

/* Walk every id with ntr_method_next: increasing, each fully described. */
static void walk_describes_every_id(void **state)
{
    int id = 0, previous = 0, count = 0;
    (void)state;
    while (ntr_method_next(id, &id) == NTR_OK) {
        assert_true(id > previous);
        assert_true(id < 1000);
        assert_entry_complete(id);
        previous = id;
        count++;
    }
    /* 18 core ids and 7 work-up ids at least. */
    assert_true(count >= 25);
}

/* Every id the header defines is described, and the walk finds exactly the
 * header's ids (no undocumented id in the library, none missing). */
static void every_header_id_has_an_entry(void **state)
{
    struct header_id ids[MAX_HEADER_IDS];
    char *text = read_file(header_path);
    size_t n = header_method_ids(text, ids), i, j;
    int id = 0, walked = 0;
    (void)state;
    assert_true(n >= 25);
    for (i = 0; i < n; i++) {
        for (j = i + 1; j < n; j++) {
            if (ids[i].id == ids[j].id) {
                print_error("NTR_METHOD_%s and NTR_METHOD_%s share id %d\n", ids[i].name,
                            ids[j].name, ids[i].id);
                fail();
            }
        }
        assert_entry_complete(ids[i].id);
    }
    while (ntr_method_next(id, &id) == NTR_OK) {
        int in_header = 0;
        for (i = 0; i < n; i++) {
            in_header |= ids[i].id == id;
        }
        if (!in_header) {
            print_error("the library describes id %d, which the header does not define\n", id);
            fail();
        }
        walked++;
    }
    assert_int_equal((size_t)walked, n);
    free(text);
}

/* Every `NTR_API NTR_MUST_CHECK int ntr_...(` declaration's doc block names an
 * NTR_METHOD_* id, or says "Method: none" (bookkeeping functions). The
 * status and version functions return other types and are not computing
 * functions. */
static void every_computing_function_names_its_method(void **state)
{
    static const char decl[] = "NTR_API NTR_MUST_CHECK int ";
    char *text = read_file(header_path);
    const char *p = text;
    int functions = 0, missing = 0;
    (void)state;
    while ((p = strstr(p, decl)) != NULL) {
        const char *name = p + strlen(decl);
        const char *end = strstr(name, "(");
        const char *doc_end = p;
        const char *doc_start;
        char doc_name[96];
        size_t len;
        int named = 0;
        assert_non_null(end);
        len = (size_t)(end - name);
        assert_true(len < sizeof doc_name);
        memcpy(doc_name, name, len);
        doc_name[len] = '\0';
        /* The doc block is the comment that ends right before the
         * declaration (only white space between). */
        while (doc_end > text && (doc_end[-1] == ' ' || doc_end[-1] == '\n')) {
            doc_end--;
        }
        if (doc_end - text >= 2 && doc_end[-1] == '/' && doc_end[-2] == '*') {
            const char *q = doc_end - 2;
            doc_start = NULL;
            while (q > text + 2) {
                if (q[0] == '*' && q[-1] == '*' && q[-2] == '/') {
                    doc_start = q - 2;
                    break;
                }
                q--;
            }
            if (doc_start != NULL) {
                size_t doc_len = (size_t)(doc_end - doc_start);
                char *doc = malloc(doc_len + 1);
                assert_non_null(doc);
                memcpy(doc, doc_start, doc_len);
                doc[doc_len] = '\0';
                named = strstr(doc, "NTR_METHOD_") != NULL || strstr(doc, "Method: none") != NULL ||
                        strstr(doc, "Methods: none") != NULL;
                free(doc);
            }
        }
        if (!named) {
            print_error("%s: its doc block names no NTR_METHOD_* id (nor \"Method: none\")\n",
                        doc_name);
            missing++;
        }
        functions++;
        p = end;
    }
    assert_true(functions > 20);
    assert_int_equal(missing, 0);
    free(text);
}

/* Every function that returns a status carries NTR_MUST_CHECK, so that a
 * dropped status warns (issue 13: an ignored status must not pass
 * quietly): no declaration may start "NTR_API int" without it. */
static void every_status_function_warns_when_its_result_is_dropped(void **state)
{
    char *text = read_file(header_path);
    const char *p = text;
    int bare = 0;
    (void)state;
    while ((p = strstr(p, "\nNTR_API int ")) != NULL) {
        const char *name = p + strlen("\nNTR_API int ");
        const char *end = strchr(name, '(');
        print_error("%.*s: declared without NTR_MUST_CHECK\n",
                    end != NULL ? (int)(end - name) : 20, name);
        bare++;
        p = name;
    }
    assert_non_null(strstr(text, "define NTR_MUST_CHECK __attribute__((warn_unused_result))"));
    assert_int_equal(bare, 0);
    free(text);
}

/* Source: Watson PE, Watson ID, Batt RD. Am J Clin Nutr 1980;33:27-39, the
 * published equations (men 2.447 - 0.09516 age + 0.1074 height + 0.3362
 * weight; women -2.097 + 0.1069 height + 0.2466 weight): the provenance
 * text quotes the same coefficients, digit by digit. */
static void watson_entry_quotes_the_published_coefficients(void **state)
{
    static const char *const coefficients[] = {"2.447", "0.09516", "0.1074", "0.3362",
                                               "-2.097", "0.1069", "0.2466"};
    struct ntr_method_info info;
    size_t i;
    (void)state;
    assert_int_equal(ntr_method_info(NTR_METHOD_TBW_WATSON, &info), NTR_OK);
    for (i = 0; i < 7; i++) {
        assert_non_null(strstr(info.equation, coefficients[i]));
    }
    assert_non_null(strstr(info.reference, "Am J Clin Nutr 1980"));
    assert_non_null(strstr(info.population, "adults"));
}

/* Source: Katz, N Engl J Med 1973 (1.6 per 100 mg/dL) and Hillier et al.,
 * Am J Med 1999 (2.4 per 100 mg/dL). */
static void glucose_entries_quote_the_published_factors(void **state)
{
    struct ntr_method_info info;
    (void)state;
    assert_int_equal(ntr_method_info(NTR_METHOD_GLUCOSE_KATZ, &info), NTR_OK);
    assert_non_null(strstr(info.equation, "1.6*"));
    assert_non_null(strstr(info.reference, "N Engl J Med 1973"));
    assert_int_equal(ntr_method_info(NTR_METHOD_GLUCOSE_HILLIER, &info), NTR_OK);
    assert_non_null(strstr(info.equation, "2.4*"));
    assert_non_null(strstr(info.reference, "Am J Med 1999"));
}

/* Source: Spasovski G et al., Eur J Endocrinol 2014, table of SIAD
 * criteria (checked against the published table), itself from Schwartz et al. 1957 and Bartter &
 * Schwartz 1967: the entry states every threshold and cites all three. */
static void siad_entry_quotes_the_table(void **state)
{
    static const char *const parts[] = {"< 275", "> 100", "> 30", "< 0.24", "< 3.6",
                                        "> 0.5%", "> 55%", "> 12%", "euvolaemia", "diuretic",
                                        "pituitary"};
    struct ntr_method_info info;
    size_t i;
    (void)state;
    assert_int_equal(ntr_method_info(NTR_METHOD_SIAD_CRITERIA, &info), NTR_OK);
    for (i = 0; i < sizeof parts / sizeof parts[0]; i++) {
        if (strstr(info.equation, parts[i]) == NULL) {
            print_error("SIAD entry lacks \"%s\"\n", parts[i]);
            fail();
        }
    }
    assert_non_null(strstr(info.reference, "Eur J Endocrinol 2014"));
    assert_non_null(strstr(info.reference, "1957"));
    assert_non_null(strstr(info.reference, "1967"));
    assert_int_equal(ntr_method_info(NTR_METHOD_NA_SEVERITY, &info), NTR_OK);
    assert_non_null(strstr(info.equation, "125"));
    assert_non_null(strstr(info.equation, "130"));
    assert_non_null(strstr(info.equation, "135"));
}

/* Property: ntr_method_info and ntr_method_next agree on which ids exist,
 * over the whole id space and beyond. */
static void info_and_next_agree(void **state)
{
    int id, expected_next = 0;
    (void)state;
    for (id = -5; id <= 1100; id++) {
        struct ntr_method_info info;
        int exists = ntr_method_info(id, &info) == NTR_OK;
        if (exists) {
            int next = 0;
            assert_int_equal(ntr_method_next(expected_next, &next), NTR_OK);
            assert_int_equal(next, id);
            expected_next = id;
        }
    }
}

static void unknown_ids_and_null(void **state)
{
    /* The last slot is the first gap in the id space, found at run time
     * (ids may be added anywhere below 1000, so no gap is hard-coded). */
    int unknown[] = {0, -1, 1000, INT_MIN, INT_MAX, 1};
    struct ntr_method_info info, before;
    int next = NTR_TEST_SENTINEL_INT, last = 0, id = 0;
    size_t i;
    (void)state;
    while (ntr_method_info(unknown[5], &info) == NTR_OK) {
        unknown[5]++;
    }
    assert_true(unknown[5] > 1 && unknown[5] < 1000);
    memset(&info, 0x5A, sizeof info);
    before = info;
    for (i = 0; i < sizeof unknown / sizeof unknown[0]; i++) {
        assert_int_equal(ntr_method_info(unknown[i], &info), NTR_ERR_ARG);
        assert_memory_equal(&info, &before, sizeof info);
    }
    assert_int_equal(ntr_method_info(NTR_METHOD_FURST, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_method_info(-1, NULL), NTR_ERR_NULL);

    assert_int_equal(ntr_method_next(0, NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_method_next(INT_MIN, &next), NTR_OK);
    assert_int_equal(next, NTR_METHOD_UNIT_CONVERSION);
    while (ntr_method_next(id, &id) == NTR_OK) {
        last = id;
    }
    next = NTR_TEST_SENTINEL_INT;
    assert_int_equal(ntr_method_next(last, &next), NTR_ERR_RANGE);
    assert_int_equal(ntr_method_next(INT_MAX, &next), NTR_ERR_RANGE);
    assert_int_equal(ntr_method_next(999, &next), NTR_ERR_RANGE);
    assert_int_equal(next, NTR_TEST_SENTINEL_INT);
}

int main(int argc, char **argv)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(walk_describes_every_id),
        cmocka_unit_test(every_header_id_has_an_entry),
        cmocka_unit_test(every_computing_function_names_its_method),
        cmocka_unit_test(every_status_function_warns_when_its_result_is_dropped),
        cmocka_unit_test(watson_entry_quotes_the_published_coefficients),
        cmocka_unit_test(glucose_entries_quote_the_published_factors),
        cmocka_unit_test(siad_entry_quotes_the_table),
        cmocka_unit_test(info_and_next_agree),
        cmocka_unit_test(unknown_ids_and_null),
    };
    if (argc != 2) {
        fprintf(stderr, "usage: %s path/to/include/natremia.h\n", argv[0]);
        return 2;
    }
    header_path = argv[1];
    return cmocka_run_group_tests(tests, NULL, NULL);
}
