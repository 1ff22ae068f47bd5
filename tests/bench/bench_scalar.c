/* Per-call instruction cost of natremia's scalar entry points.
 *
 * Run under valgrind --tool=callgrind (tests/bench/run-bench.sh does). For
 * every entry point there are two loops of identical shape: loop_<name>
 * calls the library with valid inputs that take the full computing path, and
 * base_<name> calls a do-nothing function with the same signature from
 * bench_stubs.c. Callgrind counts the instructions each loop executes; the
 * per-call cost is (Ir(loop_<name>) - Ir(base_<name>)) / N, i.e. the work
 * the library does beyond an empty call (argument passing, the loop and the
 * call instruction cancel out). Callgrind's own inclusive count of the
 * library function divided by its call count is printed beside it as a
 * cross-check by the script.
 *
 * Usage: bench_scalar [N]   (default 20000 calls per loop)
 * Prints the number of non-OK statuses per loop (all must be 0, proving the
 * inputs were valid) and exits 1 otherwise. */
#include <stdio.h>
#include <stdlib.h>

#include "natremia.h"
#include "bench_stubs.h"

#define NOINLINE __attribute__((noinline, noclone, used))

/* One pair of loops: the library call and the stub call. `real` and `stub`
 * are complete call expressions that may use the locals d, i, s. */
#define PAIR(name, real, stub)                                   \
    NOINLINE long loop_##name(long n);                           \
    NOINLINE long base_##name(long n);                           \
    NOINLINE long loop_##name(long n)                            \
    {                                                            \
        long bad = 0;                                            \
        double d = 0.0, d2 = 0.0;                                \
        int i = 0;                                               \
        for (long k = 0; k < n; k++) {                           \
            bad += (real) != 0;                                  \
        }                                                        \
        (void)d; (void)d2; (void)i;                              \
        return bad;                                              \
    }                                                            \
    NOINLINE long base_##name(long n)                            \
    {                                                            \
        long bad = 0;                                            \
        double d = 0.0, d2 = 0.0;                                \
        int i = 0;                                               \
        for (long k = 0; k < n; k++) {                           \
            bad += (stub) != 0;                                  \
        }                                                        \
        (void)d; (void)d2; (void)i;                              \
        return bad;                                              \
    }

/* Invented, clinically plausible inputs that take the full computing path
 * of each function (glucose above the correction threshold, the last UCUM
 * code in the table, and so on). */
PAIR(ntr_unit_parse, ntr_unit_parse("umol/L", &i), stub_p_ip("umol/L", &i))
PAIR(ntr_convert,
     ntr_convert(NTR_ANALYTE_GLUCOSE, 250.0, NTR_UNIT_MG_DL, NTR_UNIT_MMOL_L, &d),
     stub_idiid_p(NTR_ANALYTE_GLUCOSE, 250.0, NTR_UNIT_MG_DL, NTR_UNIT_MMOL_L, &d))
PAIR(ntr_osm_calculated,
     ntr_osm_calculated(128.0, 12.0, 8.0, 0.0, NTR_OSM_DORWART_CHALMERS, &d),
     stub_ddddi_p(128.0, 12.0, 8.0, 0.0, NTR_OSM_DORWART_CHALMERS, &d))
PAIR(ntr_osm_effective, ntr_osm_effective(128.0, 12.0, &d),
     stub_dd_p(128.0, 12.0, &d))
PAIR(ntr_osm_gap, ntr_osm_gap(300.0, 285.0, &d), stub_dd_p(300.0, 285.0, &d))
PAIR(ntr_na_corrected_glucose,
     ntr_na_corrected_glucose(128.0, 30.0, NTR_GLUCOSE_HILLIER, &d),
     stub_ddi_p(128.0, 30.0, NTR_GLUCOSE_HILLIER, &d))
PAIR(ntr_na_corrected_glucose_factor,
     ntr_na_corrected_glucose_factor(128.0, 30.0, 2.0, &d),
     stub_ddd_p(128.0, 30.0, 2.0, &d))
PAIR(ntr_na_deficit, ntr_na_deficit(30.0, 118.0, 124.0, &d),
     stub_ddd_p(30.0, 118.0, 124.0, &d))
PAIR(ntr_tbw_fraction, ntr_tbw_fraction(NTR_SEX_FEMALE, 70.0, 60.0, &d),
     stub_idd_p(NTR_SEX_FEMALE, 70.0, 60.0, &d))
PAIR(ntr_tbw_watson, ntr_tbw_watson(NTR_SEX_MALE, 50.0, 175.0, 80.0, &d),
     stub_iddd_p(NTR_SEX_MALE, 50.0, 175.0, 80.0, &d))
PAIR(ntr_free_water_deficit, ntr_free_water_deficit(40.0, 158.0, &d),
     stub_dd_p(40.0, 158.0, &d))
PAIR(ntr_fluid_preset, ntr_fluid_preset(NTR_FLUID_NACL_3, &d, &d2),
     stub_i_pp(NTR_FLUID_NACL_3, &d, &d2))
PAIR(ntr_infusate_change_per_litre,
     ntr_infusate_change_per_litre(118.0, 30.0, 513.0, 0.0, &d),
     stub_dddd_p(118.0, 30.0, 513.0, 0.0, &d))
PAIR(ntr_infusate_change, ntr_infusate_change(118.0, 30.0, 513.0, 0.0, 0.5, &d),
     stub_ddddd_p(118.0, 30.0, 513.0, 0.0, 0.5, &d))
PAIR(ntr_infusate_volume_for_change,
     ntr_infusate_volume_for_change(118.0, 30.0, 513.0, 0.0, 6.0, &d),
     stub_ddddd_p(118.0, 30.0, 513.0, 0.0, 6.0, &d))
PAIR(ntr_furst_ratio, ntr_furst_ratio(80.0, 40.0, 125.0, &d),
     stub_ddd_p(80.0, 40.0, 125.0, &d))
PAIR(ntr_restriction_from_ratio, ntr_restriction_from_ratio(0.95, &i),
     stub_d_ip(0.95, &i))
PAIR(ntr_efwc, ntr_efwc(2.0, 60.0, 30.0, 125.0, &d),
     stub_dddd_p(2.0, 60.0, 30.0, 125.0, &d))
PAIR(ntr_status_message, ntr_status_message(NTR_ERR_RANGE) == NULL,
     stub_i_str(NTR_ERR_RANGE) == NULL)
PAIR(ntr_version_string, ntr_version_string() == NULL, stub_v_str() == NULL)
PAIR(ntr_version_number, ntr_version_number() == 0ul, stub_v_ul() == 0ul)

struct pair {
    const char *name;
    long (*loop)(long);
    long (*base)(long);
};

#define ENTRY(name) {#name, loop_##name, base_##name}

static const struct pair pairs[] = {
    ENTRY(ntr_unit_parse),
    ENTRY(ntr_convert),
    ENTRY(ntr_osm_calculated),
    ENTRY(ntr_osm_effective),
    ENTRY(ntr_osm_gap),
    ENTRY(ntr_na_corrected_glucose),
    ENTRY(ntr_na_corrected_glucose_factor),
    ENTRY(ntr_na_deficit),
    ENTRY(ntr_tbw_fraction),
    ENTRY(ntr_tbw_watson),
    ENTRY(ntr_free_water_deficit),
    ENTRY(ntr_fluid_preset),
    ENTRY(ntr_infusate_change_per_litre),
    ENTRY(ntr_infusate_change),
    ENTRY(ntr_infusate_volume_for_change),
    ENTRY(ntr_furst_ratio),
    ENTRY(ntr_restriction_from_ratio),
    ENTRY(ntr_efwc),
    ENTRY(ntr_status_message),
    ENTRY(ntr_version_string),
    ENTRY(ntr_version_number),
};

int main(int argc, char **argv)
{
    long n = argc > 1 ? strtol(argv[1], NULL, 10) : 20000;
    size_t k;
    int failed = 0;
    if (n <= 0) {
        fprintf(stderr, "bench_scalar: N must be positive\n");
        return 2;
    }
    printf("calls_per_loop %ld\n", n);
    for (k = 0; k < sizeof pairs / sizeof pairs[0]; k++) {
        long bad = pairs[k].loop(n);
        long base_bad = pairs[k].base(n);
        printf("%s bad=%ld base_bad=%ld\n", pairs[k].name, bad, base_bad);
        if (bad != 0 || base_bad != 0) {
            failed = 1;
        }
    }
    return failed;
}
