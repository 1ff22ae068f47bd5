/* SPDX-License-Identifier: MIT */
/* A minimal Cortex-M4 "firmware" that calls the library, linked bare metal
 * by tests/cross.sh to prove every symbol resolves without an operating
 * system (the library needs only libgcc's double-precision helpers). The
 * numbers are an invented example; results go to a volatile sink so the
 * calls are not optimised away. Never run: only linked and measured. */
#include "natremia.h"

volatile double ntr_image_sink[8];
volatile int ntr_image_status;

int main(void)
{
    double tbw = 0.0;
    double delta = 0.0;
    double osm = 0.0;
    ntr_limits lim;
    ntr_correction assessment;
    ntr_watch watch;
    static const ntr_sample series[3] = {{0.0, 112.0}, {6.0, 116.0}, {24.0, 121.0}};
    int st = ntr_tbw_fraction(NTR_SEX_FEMALE, 70.0, 60.0, &tbw);
    st |= ntr_infusate_change_per_litre(112.0, tbw, 513.0, 0.0, &delta);
    st |= ntr_osm_calculated(112.0, 5.0, 6.0, 0.0, NTR_OSM_2NA, &osm);
    st |= ntr_limits_preset(NTR_LIMITS_STANDARD, &lim);
    st |= ntr_correction_assess(series, 3, &lim, &assessment);
    st |= ntr_watch_init(&lim, &watch);
    st |= ntr_watch_push(&watch, 0.0, 112.0, &assessment);
    ntr_image_sink[0] = tbw;
    ntr_image_sink[1] = delta;
    ntr_image_sink[2] = osm;
    ntr_image_sink[3] = assessment.max_rise_24h;
    ntr_image_status = st;
    for (;;) {
    }
}
