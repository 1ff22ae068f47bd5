/* SPDX-License-Identifier: MIT */
/* Built by CMake against the installed natremia (find_package, imported
 * target natremia::natremia); tests/check_cmake_consumer.sh runs it.
 * Exits 0 only when the library it loaded answers two published checks:
 *
 * - effective osmolality 2*Na + glucose (Spasovski G et al., Eur J
 *   Endocrinol 2014;170:G1-47, the guideline's definition): sodium 125,
 *   glucose 40 mmol/L give 290 mOsm/kg;
 * - Furst H et al., Am J Med Sci 2000;319:240-4, worked example: sodium
 *   108 mmol/L, body water 30 L, 292 mL of 3% saline give about 112 mmol/L
 *   (accepted within the paper's precision, 112 +- 0.5).
 *
 * The inputs are the sources' figures, not a patient. */
#include <natremia.h>
#include <stdio.h>

int main(void)
{
    double osm = 0.0, saline_na = 0.0, saline_k = 0.0, delta = 0.0;
    int failed = 0;

    printf("natremia %s, found by CMake\n", ntr_version_string());
    if (ntr_version_number() / 10000UL != NTR_VERSION_MAJOR) {
        printf("FAIL: header and library major versions differ\n");
        return 1;
    }
    if (ntr_osm_effective(125.0, 40.0, &osm) != NTR_OK || osm < 289.999 || osm > 290.001) {
        printf("FAIL: effective osmolality %.3f, want 290 (Spasovski 2014)\n", osm);
        failed = 1;
    } else {
        printf("OK: effective osmolality %.1f mOsm/kg (Spasovski 2014: 290)\n", osm);
    }
    if (ntr_fluid_preset(NTR_FLUID_NACL_3, &saline_na, &saline_k) != NTR_OK
        || ntr_infusate_change(108.0, 30.0, saline_na, saline_k, 0.292, &delta) != NTR_OK
        || 108.0 + delta < 111.5 || 108.0 + delta > 112.5) {
        printf("FAIL: 292 mL of 3%% saline from 108 gives %.2f, want about 112 (Furst 2000)\n",
               108.0 + delta);
        failed = 1;
    } else {
        printf("OK: expected sodium %.1f mmol/L (Furst 2000: about 112)\n", 108.0 + delta);
    }
    printf("Caution: estimates for decision support, not orders. Verify with"
           " measured values;\nfollow local protocols and licensed clinical"
           " judgement.\n");
    return failed;
}
