/* Units: ntr_unit_parse and ntr_convert (docs/units.md).
 * The molar masses themselves are checked against Debian's
 * python3-periodictable by tests/check_molar_masses.py. */
#define _DEFAULT_SOURCE /* mmap, MAP_ANONYMOUS for the guard-page test */
#include <stdarg.h>
#include <stddef.h>
#include <setjmp.h>
#include <stdint.h>
#include <string.h>
#include <sys/mman.h>
#include <unistd.h>
#include <cmocka.h>

#include "natremia_test.h"

static const int all_units[] = {NTR_UNIT_MMOL_L, NTR_UNIT_MG_DL, NTR_UNIT_MEQ_L,
                                NTR_UNIT_MOSM_KG, NTR_UNIT_G_L, NTR_UNIT_UMOL_L};
#define N_UNITS (sizeof all_units / sizeof all_units[0])

static double convert_or_fail(int analyte, double value, int from, int to)
{
    double out = NTR_TEST_SENTINEL;
    assert_int_equal(ntr_convert(analyte, value, from, to, &out), NTR_OK);
    return out;
}

/* ---- ntr_unit_parse ------------------------------------------------- */

/* Source: UCUM (Regenstrief), case-sensitive codes; the mapping to
 * NTR_UNIT_* values is fixed by issue P1. */
static void parse_accepts_the_six_ucum_codes(void **state)
{
    static const struct {
        const char *code;
        int unit;
    } cases[] = {
        {"mmol/L", NTR_UNIT_MMOL_L}, {"mg/dL", NTR_UNIT_MG_DL},
        {"meq/L", NTR_UNIT_MEQ_L},   {"mosm/kg", NTR_UNIT_MOSM_KG},
        {"g/L", NTR_UNIT_G_L},       {"umol/L", NTR_UNIT_UMOL_L},
    };
    size_t i;
    (void)state;
    for (i = 0; i < sizeof cases / sizeof cases[0]; i++) {
        int unit = NTR_TEST_SENTINEL_INT;
        assert_int_equal(ntr_unit_parse(cases[i].code, &unit), NTR_OK);
        assert_int_equal(unit, cases[i].unit);
    }
}

/* UCUM is case-sensitive: "mmol/l" and "MG/DL" are not the codes. Prefixes,
 * extensions and surrounding blanks are rejected; the output is untouched. */
static void parse_rejects_near_misses(void **state)
{
    static const char *const bad[] = {
        "", "mmol/l", "MMOL/L", "mg/dl", "MG/DL", "mEq/L", "mOsm/kg", "G/L",
        "µmol/L", "mmol", "mmol/", "mmol/LL", "mmol/L ", " mmol/L", "g/L\t",
        "mosm/k", "mosm/kgx", "mg/dL/", "mol/L", "meq/l", "umol/l", "mosm/L",
    };
    size_t i;
    (void)state;
    for (i = 0; i < sizeof bad / sizeof bad[0]; i++) {
        int unit = NTR_TEST_SENTINEL_INT;
        assert_int_equal(ntr_unit_parse(bad[i], &unit), NTR_ERR_UNIT);
        assert_int_equal(unit, NTR_TEST_SENTINEL_INT);
    }
}

static void parse_null_pointers(void **state)
{
    int unit = NTR_TEST_SENTINEL_INT;
    (void)state;
    assert_int_equal(ntr_unit_parse(NULL, &unit), NTR_ERR_NULL);
    assert_int_equal(unit, NTR_TEST_SENTINEL_INT);
    assert_int_equal(ntr_unit_parse("mmol/L", NULL), NTR_ERR_NULL);
    assert_int_equal(ntr_unit_parse(NULL, NULL), NTR_ERR_NULL);
}

/* Property: the parser never reads past the terminating NUL. Each string is
 * placed so that its NUL is the last readable byte before a page mapped
 * PROT_NONE; one byte too far would crash the test. */
static void parse_never_reads_past_the_nul(void **state)
{
    static const char *const probes[] = {
        "", "m", "mm", "mmol", "mmol/", "mmol/L", "mg/d", "mg/dL", "meq/",
        "mosm/k", "mosm/kg", "g/", "g/L", "umol/", "umol/L", "x",
    };
    long page_long = sysconf(_SC_PAGESIZE);
    size_t page, i;
    unsigned char *base;
    (void)state;
    assert_true(page_long > 0);
    page = (size_t)page_long;
    base = mmap(NULL, 2 * page, PROT_READ | PROT_WRITE, MAP_PRIVATE | MAP_ANONYMOUS,
                -1, 0);
    assert_true(base != MAP_FAILED);
    assert_int_equal(mprotect(base + page, page, PROT_NONE), 0);
    for (i = 0; i < sizeof probes / sizeof probes[0]; i++) {
        size_t len = strlen(probes[i]);
        char *at = (char *)base + page - (len + 1);
        int unit = NTR_TEST_SENTINEL_INT;
        int expected_status;
        memcpy(at, probes[i], len + 1);
        expected_status = (strcmp(probes[i], "mmol/L") == 0 || strcmp(probes[i], "mg/dL") == 0 ||
                           strcmp(probes[i], "mosm/kg") == 0 || strcmp(probes[i], "g/L") == 0 ||
                           strcmp(probes[i], "umol/L") == 0)
                              ? NTR_OK
                              : NTR_ERR_UNIT;
        assert_int_equal(ntr_unit_parse(at, &unit), expected_status);
    }
    assert_int_equal(munmap(base, 2 * page), 0);
}

/* ---- ntr_convert: external checks ------------------------------------ */

/* Source: common practice conversion factors of clinical chemistry
 * (SI-unit tables): glucose mmol/L x 18 = mg/dL; creatinine
 * 1 mg/dL = 88.4 umol/L (the factor KDIGO 2012 CKD guideline uses);
 * urea mg/dL x 0.1665 = mmol/L (molar mass 60.06); BUN mg/dL / 2.8 =
 * mmol/L of urea; ethanol mg/dL / 4.6 = mmol/L (molar mass 46.07). The
 * tolerances allow for the factors' own rounding. */
static void convert_matches_clinical_conversion_factors(void **state)
{
    (void)state;
    assert_near(convert_or_fail(NTR_ANALYTE_GLUCOSE, 1.0, NTR_UNIT_MMOL_L, NTR_UNIT_MG_DL),
                18.0, 0.02);
    assert_near(convert_or_fail(NTR_ANALYTE_GLUCOSE, 90.0, NTR_UNIT_MG_DL, NTR_UNIT_MMOL_L),
                5.0, 0.005);
    assert_near(convert_or_fail(NTR_ANALYTE_CREATININE, 1.0, NTR_UNIT_MG_DL, NTR_UNIT_UMOL_L),
                88.4, 0.01);
    assert_near(convert_or_fail(NTR_ANALYTE_UREA, 100.0, NTR_UNIT_MG_DL, NTR_UNIT_MMOL_L),
                16.65, 0.01);
    assert_near(convert_or_fail(NTR_ANALYTE_UREA_NITROGEN, 28.0, NTR_UNIT_MG_DL, NTR_UNIT_MMOL_L),
                10.0, 0.01);
    /* 4.6 is 46.069/10 rounded (0.15%): 0.2% of the value. */
    assert_near(convert_or_fail(NTR_ANALYTE_ETHANOL, 100.0, NTR_UNIT_MG_DL, NTR_UNIT_MMOL_L),
                100.0 / 4.6, 0.002 * 100.0 / 4.6);
}

/* Source: IUPAC standard atomic weights (abridged): Na 22.990, K 39.098,
 * Cl 35.45. For a monovalent ion 1 mmol/L is M/10 mg/dL and 1 meq/L. */
static void convert_ions_follow_iupac_atomic_weights(void **state)
{
    (void)state;
    assert_near(convert_or_fail(NTR_ANALYTE_SODIUM, 1.0, NTR_UNIT_MMOL_L, NTR_UNIT_MG_DL),
                2.2990, 0.0001);
    assert_near(convert_or_fail(NTR_ANALYTE_POTASSIUM, 1.0, NTR_UNIT_MMOL_L, NTR_UNIT_MG_DL),
                3.9098, 0.0001);
    assert_near(convert_or_fail(NTR_ANALYTE_CHLORIDE, 1.0, NTR_UNIT_MMOL_L, NTR_UNIT_MG_DL),
                3.545, 0.0005);
    assert_near(convert_or_fail(NTR_ANALYTE_SODIUM, 140.0, NTR_UNIT_MMOL_L, NTR_UNIT_MEQ_L),
                140.0, 0.0);
    assert_near(convert_or_fail(NTR_ANALYTE_POTASSIUM, 4.2, NTR_UNIT_MEQ_L, NTR_UNIT_MMOL_L),
                4.2, 0.0);
}

/* Source: SI prefix definitions: 1 mmol = 1000 umol; 1 g/L = 100 mg/dL. */
static void convert_prefixes_are_exact_powers_of_ten(void **state)
{
    int analyte;
    (void)state;
    for (analyte = NTR_ANALYTE_SODIUM; analyte <= NTR_ANALYTE_ETHANOL; analyte++) {
        assert_near(convert_or_fail(analyte, 2.5, NTR_UNIT_MMOL_L, NTR_UNIT_UMOL_L), 2500.0,
                    1e-9);
    }
    for (analyte = NTR_ANALYTE_GLUCOSE; analyte <= NTR_ANALYTE_ETHANOL; analyte++) {
        assert_near(convert_or_fail(analyte, 1.25, NTR_UNIT_G_L, NTR_UNIT_MG_DL), 125.0, 1e-9);
    }
}

/* ---- ntr_convert: which units fit which analyte ----------------------- */

/* docs/units.md: ions take mmol/L, meq/L, mg/dL, umol/L; solutes take
 * mmol/L, mg/dL, g/L, umol/L; nothing converts to or from mosm/kg. */
static int unit_fits(int analyte, int unit)
{
    int ion = analyte <= NTR_ANALYTE_CHLORIDE;
    switch (unit) {
    case NTR_UNIT_MMOL_L:
    case NTR_UNIT_MG_DL:
    case NTR_UNIT_UMOL_L: return 1;
    case NTR_UNIT_MEQ_L: return ion;
    case NTR_UNIT_G_L: return !ion;
    default: return 0;
    }
}

static void convert_accepts_exactly_the_documented_units(void **state)
{
    int analyte;
    size_t i, j;
    (void)state;
    for (analyte = NTR_ANALYTE_SODIUM; analyte <= NTR_ANALYTE_ETHANOL; analyte++) {
        for (i = 0; i < N_UNITS; i++) {
            for (j = 0; j < N_UNITS; j++) {
                int from = all_units[i], to = all_units[j];
                double out = NTR_TEST_SENTINEL;
                int expected = unit_fits(analyte, from) && unit_fits(analyte, to)
                                   ? NTR_OK
                                   : NTR_ERR_UNIT;
                assert_int_equal(ntr_convert(analyte, 10.0, from, to, &out), expected);
                if (expected != NTR_OK) {
                    assert_true(out == NTR_TEST_SENTINEL);
                }
            }
        }
    }
}

/* ---- ntr_convert: properties ------------------------------------------ */

/* Round trip A -> B -> A and transitivity A -> B -> C == A -> C, for every
 * analyte and every pair of units it accepts. */
static void convert_round_trips_and_is_transitive(void **state)
{
    static const double values[] = {0.0, 0.001, 1.0, 5.5, 140.0, 987.0};
    int analyte;
    size_t a, b, c, v;
    (void)state;
    for (analyte = NTR_ANALYTE_SODIUM; analyte <= NTR_ANALYTE_ETHANOL; analyte++) {
        for (a = 0; a < N_UNITS; a++) {
            for (b = 0; b < N_UNITS; b++) {
                int ua = all_units[a], ub = all_units[b];
                if (!unit_fits(analyte, ua) || !unit_fits(analyte, ub)) {
                    continue;
                }
                for (v = 0; v < sizeof values / sizeof values[0]; v++) {
                    double x = values[v];
                    double there = convert_or_fail(analyte, x, ua, ub);
                    double back;
                    if (there > 1.0e6) {
                        /* e.g. 987 g/L of urea in umol/L: beyond the
                         * documented input range, so it cannot go back. */
                        double out = NTR_TEST_SENTINEL;
                        assert_int_equal(ntr_convert(analyte, there, ub, ua, &out),
                                         NTR_ERR_RANGE);
                        continue;
                    }
                    back = convert_or_fail(analyte, there, ub, ua);
                    assert_true(ntr_test_rel_close(back, x, 1e-12) || (x == 0.0 && back == 0.0));
                    for (c = 0; c < N_UNITS; c++) {
                        int uc = all_units[c];
                        if (!unit_fits(analyte, uc)) {
                            continue;
                        }
                        assert_true(ntr_test_rel_close(convert_or_fail(analyte, there, ub, uc),
                                                       convert_or_fail(analyte, x, ua, uc),
                                                       1e-12) ||
                                    x == 0.0);
                    }
                }
            }
        }
    }
}

/* Converting to the same unit returns the value bit for bit; conversion is
 * linear (doubling the input doubles the output). */
static void convert_identity_and_linearity(void **state)
{
    int analyte;
    (void)state;
    for (analyte = NTR_ANALYTE_SODIUM; analyte <= NTR_ANALYTE_ETHANOL; analyte++) {
        double one = convert_or_fail(analyte, 3.0, NTR_UNIT_MMOL_L, NTR_UNIT_MG_DL);
        double two = convert_or_fail(analyte, 6.0, NTR_UNIT_MMOL_L, NTR_UNIT_MG_DL);
        assert_true(convert_or_fail(analyte, 0.1, NTR_UNIT_MG_DL, NTR_UNIT_MG_DL) == 0.1);
        assert_true(ntr_test_rel_close(two, 2.0 * one, 1e-15));
    }
}

/* ---- ntr_convert: bad inputs ------------------------------------------ */

static int call_convert_glucose(const double *args, double *out)
{
    return ntr_convert(NTR_ANALYTE_GLUCOSE, args[0], NTR_UNIT_MG_DL, NTR_UNIT_MMOL_L, out);
}

static void convert_bad_inputs_leave_output_untouched(void **state)
{
    /* Documented range of the value: 0 to 1e6 in any unit. */
    const struct ntr_test_inputs in = {call_convert_glucose, 1, {100.0}, {0.0}, {1.0e6}};
    double out = NTR_TEST_SENTINEL;
    (void)state;
    ntr_test_bad_inputs(&in);

    /* NULL output comes first, whatever else is wrong. */
    assert_int_equal(ntr_convert(0, (double)NAN, 99, 99, NULL), NTR_ERR_NULL);
    /* Unknown analyte: NTR_ERR_ARG, before unit and value checks. */
    assert_int_equal(ntr_convert(0, 1.0, NTR_UNIT_MMOL_L, NTR_UNIT_MG_DL, &out), NTR_ERR_ARG);
    assert_int_equal(ntr_convert(9, 1.0, NTR_UNIT_MMOL_L, NTR_UNIT_MG_DL, &out), NTR_ERR_ARG);
    assert_int_equal(ntr_convert(-1, (double)NAN, 99, 99, &out), NTR_ERR_ARG);
    /* Unknown units: NTR_ERR_UNIT, before the value check. */
    assert_int_equal(ntr_convert(NTR_ANALYTE_SODIUM, 1.0, 0, NTR_UNIT_MMOL_L, &out), NTR_ERR_UNIT);
    assert_int_equal(ntr_convert(NTR_ANALYTE_SODIUM, 1.0, NTR_UNIT_MMOL_L, 7, &out), NTR_ERR_UNIT);
    assert_int_equal(ntr_convert(NTR_ANALYTE_SODIUM, 1.0, -3, 40, &out), NTR_ERR_UNIT);
    assert_int_equal(ntr_convert(NTR_ANALYTE_SODIUM, (double)NAN, 99, NTR_UNIT_MMOL_L, &out),
                     NTR_ERR_UNIT);
    assert_true(out == NTR_TEST_SENTINEL);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(parse_accepts_the_six_ucum_codes),
        cmocka_unit_test(parse_rejects_near_misses),
        cmocka_unit_test(parse_null_pointers),
        cmocka_unit_test(parse_never_reads_past_the_nul),
        cmocka_unit_test(convert_matches_clinical_conversion_factors),
        cmocka_unit_test(convert_ions_follow_iupac_atomic_weights),
        cmocka_unit_test(convert_prefixes_are_exact_powers_of_ten),
        cmocka_unit_test(convert_accepts_exactly_the_documented_units),
        cmocka_unit_test(convert_round_trips_and_is_transitive),
        cmocka_unit_test(convert_identity_and_linearity),
        cmocka_unit_test(convert_bad_inputs_leave_output_untouched),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
