/* Watch a sodium series as it arrives: one "hours,sodium" line per result
 * on standard input (sodium in mmol/L, hours since any origin you choose).
 * Blank lines and lines starting with # are skipped.
 *
 *   printf '0,112\n6,116\n12,121\n' | correction_watch
 *   correction_watch high-risk < series.csv       (limits 8 / 16 mmol/L)
 *
 * Each result is checked with the library's streaming watcher; one line of
 * output per result, and a non-zero exit if a limit was exceeded. */
#include <natremia.h>
#include <stdio.h>
#include <string.h>

#include "example_cli.h"

static const char usage[] =
    "usage: correction_watch [standard|high-risk] < lines of hours,sodium\n"
    "  hours since any origin, sodium in mmol/L, one result a line; blank lines\n"
    "  and # comments are skipped. Exit 1 if a limit was exceeded, 2 on bad input.\n";

static void print_flags(unsigned int f)
{
    if (f & NTR_CF_OVER_24H) printf(" OVER-24H");
    if (f & NTR_CF_OVER_48H) printf(" OVER-48H");
    if (f & NTR_CF_NEAR_LIMIT) printf(" near-limit");
    if (f & NTR_CF_PROJECTED_OVER) printf(" projected-over");
    if (f & NTR_CF_RAPID_6H) printf(" 6-in-6h");
    if (f & NTR_CF_FALLING) printf(" falling");
    if (f & NTR_CF_BELOW_TARGET) printf(" below-target");
    printf("\n");
}

int main(int argc, char **argv)
{
    int preset = NTR_LIMITS_STANDARD, st;
    ntr_limits lim;
    ntr_watch watch;
    ntr_correction c = {0.0, 0.0, 0.0, 0.0, 0.0, 0u, 0u};
    char line[256];
    unsigned long line_no = 0;
    cli cl;

    if ((st = cli_start(&cl, "correction_watch", usage, argc, argv)) >= 0) return st;
    if (cl.argc > 1) return cli_usage_error(&cl, "expected at most one argument");
    if (cl.argc == 1 && strcmp(cl.argv[0], "high-risk") == 0) preset = NTR_LIMITS_HIGH_RISK;
    else if (cl.argc == 1 && strcmp(cl.argv[0], "standard") != 0)
        return cli_bad_choice(&cl, "LIMITS", cl.argv[0], "standard, high-risk");
    if ((st = ntr_limits_preset(preset, &lim)) || (st = ntr_watch_init(&lim, &watch))) {
        fprintf(stderr, "correction_watch: %s\n", ntr_status_message(st));
        return 2;
    }
    printf("limits: %.0f mmol/L in 24 h, %.0f in 48 h (at least %.0f in the first 24 h)\n",
           lim.max_rise_24h, lim.max_rise_48h, lim.min_rise_24h);
    printf("hours,sodium_mmol_l,rise_24h_mmol_l,rise_48h_mmol_l,rate_mmol_l_per_h,flags\n");
    while (fgets(line, sizeof line, stdin) != NULL) {
        double hours, na;
        char extra;
        ++line_no;
        if (line[0] == '#' || strspn(line, " \t\r\n") == strlen(line)) continue;
        if (sscanf(line, "%lf , %lf %c", &hours, &na, &extra) != 2) {
            fprintf(stderr, "correction_watch: line %lu: expected hours,sodium\n", line_no);
            return 2;
        }
        if ((st = ntr_watch_push(&watch, hours, na, &c)) != NTR_OK) {
            fprintf(stderr, "correction_watch: line %lu (%g,%g) refused: %s\n", line_no,
                    hours, na, ntr_status_message(st));
            return 2;
        }
        printf("%g,%g,%.1f,%.1f,%+.2f,", hours, na, c.max_rise_24h, c.max_rise_48h,
               c.last_rate_per_h);
        print_flags(c.flags);
    }
    printf("Estimates for decision support, not orders; verify with measured values\n"
           "and follow local protocols and licensed clinical judgement.\n");
    return (c.flags & (NTR_CF_OVER_24H | NTR_CF_OVER_48H)) ? 1 : 0;
}
