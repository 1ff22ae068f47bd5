/* SPDX-License-Identifier: MIT */
/* Built by a meson project that takes natremia as a subproject
 * (tests/check_meson_subproject.sh). Exits 0 only when the library answers
 * a published check: effective osmolality 2*Na + glucose (Spasovski G et
 * al., Eur J Endocrinol 2014;170:G1-47, the guideline's definition):
 * sodium 140, glucose 5 mmol/L give 285 mOsm/kg. The inputs are the
 * definition's figures, not a patient. */
#include <natremia.h>
#include <stdio.h>

int main(void)
{
    double osm = 0.0;
    int status = ntr_osm_effective(140.0, 5.0, &osm);

    if (status != NTR_OK || osm < 284.999 || osm > 285.001) {
        printf("FAIL: effective osmolality %.3f (status %d), want 285\n", osm, status);
        return 1;
    }
    printf("natremia %s as a meson subproject: effective osmolality %.1f mOsm/kg"
           " (Spasovski 2014: 285)\n", ntr_version_string(), osm);
    printf("Caution: estimates for decision support, not orders. Verify with"
           " measured values;\nfollow local protocols and licensed clinical"
           " judgement.\n");
    return 0;
}
