/* SPDX-License-Identifier: MIT */
// The public header must be usable from C++: it compiles here as C++11
// with -Wall -Wextra -Wpedantic -Wold-style-cast -Werror, its functions
// link with C linkage (extern "C"), and a few calls give the same results
// as from C.
#include "natremia.h"
#include "natremia.h" // include guard: a second inclusion is harmless

#include <cmath>
#include <cstdio>
#include <limits>

static int failures = 0;

static void expect(bool ok, const char *what)
{
    if (!ok) {
        std::printf("FAIL: %s\n", what);
        ++failures;
    }
}

static bool near(double a, double b, double tol)
{
    return std::fabs(a - b) <= tol;
}

int main()
{
    // Version macros and the library agree (major*10000 + minor*100 + patch).
    const unsigned long header_version =
        NTR_VERSION_MAJOR * 10000UL + NTR_VERSION_MINOR * 100UL + NTR_VERSION_PATCH;
    expect(ntr_version_number() == header_version, "version number matches header macros");
    expect(ntr_version_string() != nullptr && ntr_version_string()[0] != '\0', "version string");

    // Status codes are usable as C++ constant expressions.
    switch (ntr_unit_parse("mg/dL", nullptr)) {
    case NTR_ERR_NULL:
        break;
    default:
        expect(false, "ntr_unit_parse with NULL output gives NTR_ERR_NULL");
    }
    int unit = -1;
    expect(ntr_unit_parse("mg/dL", &unit) == NTR_OK && unit == NTR_UNIT_MG_DL,
           "ntr_unit_parse(\"mg/dL\")");
    expect(ntr_status_message(NTR_ERR_RANGE) != nullptr, "status message is never NULL");

    // Effective osmolality 2*Na + glucose; Na 140, glucose 5 mmol/L -> 285.
    // Source: definition of effective osmolality, Spasovski et al.,
    // Eur J Endocrinol 2014 (European hyponatraemia guideline).
    double osm = 0.0;
    expect(ntr_osm_effective(140.0, 5.0, &osm) == NTR_OK && near(osm, 285.0, 1e-9),
           "ntr_osm_effective(140, 5) = 285");

    // Glucose 180 mg/dL is 180/18.016 = 9.99 mmol/L with the IUPAC molar
    // mass of glucose, 180.156 g/mol (C6H12O6 from standard atomic weights).
    double glucose = 0.0;
    expect(ntr_convert(NTR_ANALYTE_GLUCOSE, 180.0, NTR_UNIT_MG_DL, NTR_UNIT_MMOL_L, &glucose)
               == NTR_OK && near(glucose, 180.0 / 18.0156, 1e-3),
           "ntr_convert glucose 180 mg/dL to mmol/L");

    // A NaN input is refused and the output left untouched.
    double untouched = 123.0;
    expect(ntr_osm_effective(std::numeric_limits<double>::quiet_NaN(), 5.0, &untouched)
               == NTR_ERR_NONFINITE && untouched == 123.0,
           "NaN sodium gives NTR_ERR_NONFINITE, output untouched");

    // A struct whose tag is also a function name (as with POSIX stat) is
    // written with its elaborated name in C++, just as in C.
    struct ntr_method_info info;
    info.name = nullptr;
    expect(ntr_method_info(NTR_METHOD_OSM_EFFECTIVE, &info) == NTR_OK
               && info.method == NTR_METHOD_OSM_EFFECTIVE && info.name != nullptr,
           "ntr_method_info fills struct ntr_method_info");

    if (failures == 0) {
        std::printf("C++ header test passed\n");
    }
    return failures == 0 ? 0 : 1;
}
