/* SPDX-License-Identifier: MIT */
/* Watch a sodium series as it arrives, one "hours,sodium" line per result
 * on standard input, with the library's streaming course watcher (rises and
 * falls); one CSV line per result, exit 1 if a limit was exceeded.
 *   printf '0,112\n6,116\n12,121\n' | correction_watch
 *   correction_watch chronic-high < series.csv   (a high sodium being lowered) */
#include <natremia.h>
#include <stdio.h>
#include <string.h>
#include "example_cli.h"

static const char usage[] =
    "usage: correction_watch [standard|high-risk|chronic-high|acute-high|hold] < CSV\n"
    "  one hours,sodium line (mmol/L) a result; blank and # lines skipped. Prints the\n"
    "  largest rise and fall so far in any 24 h and 48 h, the rise and fall into the\n"
    "  result over the 24 h ending at it (now), the last rate, whether now is over a\n"
    "  limit, the flags so far. Exit 1 if a limit was exceeded, 2 on bad input.\n";

static const struct { const char *name; int preset; } presets[] = {
    {"standard", NTR_COURSE_HYPO_STANDARD}, {"high-risk", NTR_COURSE_HYPO_HIGH_RISK},
    {"chronic-high", NTR_COURSE_HYPER_CHRONIC}, {"acute-high", NTR_COURSE_HYPER_ACUTE},
    {"hold", NTR_COURSE_HOLD}};
static const struct { unsigned int bit; const char *word; } flag_words[] = {
    {NTR_CF_OVER_24H, "OVER-24H"}, {NTR_CF_OVER_48H, "OVER-48H"}, {NTR_CF_FALL_OVER_24H,
    "FALL-OVER-24H"}, {NTR_CF_FALL_OVER_48H, "FALL-OVER-48H"}, {NTR_CF_NEAR_LIMIT |
    NTR_CF_FALL_NEAR_LIMIT, "near-limit"}, {NTR_CF_PROJECTED_OVER | NTR_CF_FALL_PROJECTED_OVER,
    "projected-over"}, {NTR_CF_RAPID_6H, "6-in-6h"}, {NTR_CF_FALLING, "falling"},
    {NTR_CF_WRONG_WAY, "wrong-way"}, {NTR_CF_BELOW_TARGET, "below-target"},
    {NTR_CF_APPROXIMATE, "approximate"}};
#define OVER_BITS (NTR_CF_OVER_24H | NTR_CF_OVER_48H | NTR_CF_FALL_OVER_24H | NTR_CF_FALL_OVER_48H)
int main(int argc, char **argv)
{
    int preset = NTR_COURSE_HYPO_STANDARD, st, now_over;
    double hours, na;
    size_t i, line_no = 0;
    ntr_course_limits lim;
    ntr_course_watch watch;
    ntr_course_report r = {0};
    char line[256], extra;
    cli cl;

    if ((st = cli_start(&cl, "correction_watch", usage, argc, argv)) >= 0) return st;
    if (cl.argc > 1) return cli_usage_error(&cl, "expected at most one argument");
    for (i = 0, preset = cl.argc ? 0 : preset; cl.argc && i < sizeof presets / sizeof presets[0]; ++i)
        if (strcmp(cl.argv[0], presets[i].name) == 0) preset = presets[i].preset;
    if (preset == 0) return cli_bad_choice(&cl, "LIMITS", cl.argv[0], "those --help lists");
    if ((st = ntr_course_limits_preset(preset, &lim)) || (st = ntr_course_watch_init(&lim, &watch))) {
        fprintf(stderr, "correction_watch: %s\n", ntr_status_message(st));
        return 2;
    }
    printf("limits (mmol/L; 0 = none): rise %.0f in 24 h, %.0f in 48 h; fall %.0f in 24 h, %.0f in 48 h\n",
           lim.max_rise_24h, lim.max_rise_48h, lim.max_fall_24h, lim.max_fall_48h);
    printf("hours,sodium_mmol_l,rise_24h_mmol_l,rise_48h_mmol_l,fall_24h_mmol_l,fall_48h_mmol_l,"
           "rise_now_24h_mmol_l,fall_now_24h_mmol_l,rate_mmol_l_per_h,now,flags_so_far\n");
    while (fgets(line, sizeof line, stdin) != NULL) {
        ++line_no;
        if (line[0] == '#' || strspn(line, " \t\r\n") == strlen(line)) continue;
        if (sscanf(line, "%lf , %lf %c", &hours, &na, &extra) != 2) {
            fprintf(stderr, "correction_watch: line %zu: expected hours,sodium\n", line_no);
            return 2;
        }
        r.struct_size = sizeof r;
        if ((st = ntr_course_watch_push(&watch, hours, na, &r)) != NTR_OK) {
            fprintf(stderr, "correction_watch: line %zu (%g,%g) refused: %s\n", line_no,
                    hours, na, ntr_status_message(st));
            return 2;
        }
        now_over = (lim.max_rise_24h > 0.0 && r.rise_now_24h > lim.max_rise_24h + NTR_CF_TOLERANCE) ||
                   (lim.max_fall_24h > 0.0 && r.fall_now_24h > lim.max_fall_24h + NTR_CF_TOLERANCE);
        printf("%g,%g,%.1f,%.1f,%.1f,%.1f,%.1f,%.1f,%+.2f,%s,", hours, na, r.max_rise_24h,
               r.max_rise_48h, r.max_fall_24h, r.max_fall_48h, r.rise_now_24h, r.fall_now_24h,
               r.last_rate_per_h, now_over ? "OVER" : "within");
        for (i = 0; i < sizeof flag_words / sizeof flag_words[0]; ++i)
            if (r.flags & flag_words[i].bit) printf(" %s", flag_words[i].word);
        printf("\n");
    }
    printf("Estimates for decision support, not orders; verify with measured values\n"
           "and follow local protocols and licensed clinical judgement.\n");
    return (r.flags & OVER_BITS) ? 1 : 0;
}
