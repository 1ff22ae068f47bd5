/* SPDX-License-Identifier: MIT */
/* A program outside the natremia source tree that finds the INSTALLED
 * library only through pkg-config:
 *
 *   cc -std=c99 pkgconfig_consumer.c $(pkg-config --cflags --libs natremia)
 *
 * tests/check_install.sh installs the library into a temporary prefix and
 * builds and runs this file exactly that way.
 *
 * The numbers are an invented scenario with the figures of the worked
 * example of Furst et al. (Am J Med Sci 2000): serum sodium 108 mmol/L,
 * body water 30 L, 292 mL of 3% saline. The paper chose 292 mL by the
 * sodium-deficit step for a wanted rise of 5; by mass balance it gives
 * about 112 (a rise of about 3.9), so that step under-doses (hand-worked:
 * (108 * 30 + 0.292 * 513) / 30.292 = 111.9).
 *
 * It takes no arguments; --help says so, and any other argument is
 * refused (exit 2). Standalone on purpose: it shares no code with the
 * other examples, so that it builds from this one file. */
#include <natremia.h>
#include <stdio.h>
#include <string.h>

int main(int argc, char **argv)
{
    const double na_mmol_l = 108.0;
    const double tbw_l = 30.0;
    const double volume_l = 0.292;
    double saline_na = 0.0, saline_k = 0.0, delta = 0.0;
    int status;

    if (argc > 1) {
        if (strcmp(argv[1], "--help") == 0 || strcmp(argv[1], "-h") == 0) {
            printf("usage: pkgconfig_consumer   (no arguments: an invented patient)\n");
            return 0;
        }
        fprintf(stderr, "pkgconfig_consumer: unknown %s '%s' (it takes none; see --help)\n",
                argv[1][0] == '-' ? "option" : "argument", argv[1]);
        return 2;
    }
    printf("natremia %s, found through pkg-config\n", ntr_version_string());
    if (ntr_version_number() / 10000UL != NTR_VERSION_MAJOR) {
        printf("header and library major versions differ\n");
        return 1;
    }

    status = ntr_fluid_preset(NTR_FLUID_NACL_3, &saline_na, &saline_k);
    if (status == NTR_OK) {
        status = ntr_infusate_change(na_mmol_l, tbw_l, saline_na, saline_k,
                                     volume_l, &delta);
    }
    if (status != NTR_OK) {
        printf("natremia error %d: %s\n", status, ntr_status_message(status));
        return 1;
    }

    printf("Invented patient: sodium %.0f mmol/L, body water %.0f L\n",
           na_mmol_l, tbw_l);
    printf("After %.0f mL of 3%% saline (Na %.0f mmol/L): change %+.1f mmol/L,"
           " expected sodium %.1f mmol/L\n",
           volume_l * 1000.0, saline_na, delta, na_mmol_l + delta);
    printf("Caution: estimates for decision support, not orders. Verify with"
           " measured values;\nfollow local protocols and licensed clinical"
           " judgement.\n");
    return 0;
}
