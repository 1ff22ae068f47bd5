/* SPDX-License-Identifier: MIT */
/* natremia-demo: two invented patients walked through the whole job, one
 * with a low sodium being raised, one with a high sodium being lowered.
 *
 * Usage: natremia-demo [--help] [CHART.svg [CHART2.svg]]
 *
 * Everything about the patients is invented for this demo. The program
 * shows how the library's functions fit together; it is example code and
 * prints, which the library itself never does. */
#if defined(__unix__) || defined(__APPLE__)
#define _POSIX_C_SOURCE 200112L /* getcwd(), to show where the chart went */
#include <unistd.h>
#endif

#include <natremia.h>

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "demo_therapy.h"
#include "example_cli.h"
#include "svg_chart.h"

static const char usage[] =
    "usage: natremia-demo [CHART.svg [CHART2.svg]]\n"
    "  Walks two invented patients through the library: a low sodium being\n"
    "  raised and a high sodium being lowered. Writes a chart for each:\n"
    "  CHART.svg (default natremia-demo.svg) and CHART2.svg (default: the first\n"
    "  name with -high-sodium before .svg). --help: this text.\n";

/* Stop with the library's own message if a call fails: a demo that
 * printed a number after a failed call would teach the wrong habit. */
static void must(int status, const char *what)
{
    if (status != NTR_OK) {
        fprintf(stderr, "natremia-demo: %s failed: %s\n", what,
                ntr_status_message(status));
        exit(1);
    }
}

static void heading(const char *title)
{
    printf("\n== %s ==\n", title);
}

static void caution(void)
{
    printf("\n  Caution: every figure here is an estimate for decision support, "
           "not an order.\n  Verify with measured values; follow local protocols "
           "and licensed clinical\n  judgement. The patients and all values are "
           "invented.\n");
}

/* Print text in lines of at most width columns, each indented. */
static void print_wrapped(const char *text, int indent, int width)
{
    while (*text != '\0') {
        int len = (int)strlen(text), cut = len;
        if (indent + len > width) {
            cut = width - indent;
            while (cut > 0 && text[cut] != ' ') --cut;
            if (cut == 0) cut = width - indent; /* one very long word */
        }
        printf("%*s%.*s\n", indent, "", cut, text);
        text += cut;
        while (*text == ' ') ++text;
    }
}

/* Say where a chart went even when the demo runs from a build directory:
 * a relative path is shown after the current directory where POSIX
 * getcwd() exists. */
static void print_full_path(const char *path)
{
#if defined(__unix__) || defined(__APPLE__)
    char cwd[4096];
    if (path[0] != '/' && getcwd(cwd, sizeof cwd) != NULL) {
        printf("%s/", cwd);
    }
#endif
    printf("%s", path);
}

/* ======================================================================= */
/* A watched series: "now" and "so far"                                     */
/* ======================================================================= */

/* Course limits with a name for the screen. */
typedef struct named_limits {
    ntr_course_limits lim;
    const char *name; /* "standard", "high-risk", "chronic high sodium" */
} named_limits;

/* How the newest result stands NOW: its change from the lowest (highest)
 * result of the 24 h and of the 48 h ending at it. The 24 h figures are
 * the library's (rise_now_24h, fall_now_24h); the 48 h ones the demo reads
 * the same way from the samples, with the library's time tolerance. A
 * breach earlier in the course is "so far" (the report's maxima and OVER
 * flags), so a rise corrected since does not read as a current alarm. */
typedef struct change_now {
    double rise_24h, rise_48h, fall_24h, fall_48h;
} change_now;

static change_now change_now_of(const ntr_sample *s, size_t j, const ntr_course_report *r)
{
    change_now c;
    size_t i;
    c.rise_24h = r->rise_now_24h;
    c.fall_24h = r->fall_now_24h;
    c.rise_48h = 0.0;
    c.fall_48h = 0.0;
    for (i = 0; i <= j; ++i) {
        const double d = s[j].na_mmol_l - s[i].na_mmol_l;
        if (s[j].hours - s[i].hours <= 48.0 + NTR_CF_TIME_TOLERANCE_H) {
            if (d > c.rise_48h) c.rise_48h = d;
            if (-d > c.fall_48h) c.fall_48h = -d;
        }
    }
    return c;
}

static int over(double change, double limit)
{
    return limit > 0.0 && change > limit + NTR_CF_TOLERANCE;
}

/* The words for "now" (at most 21 characters); returns 1 when over. */
static int describe_now(const change_now *c, const ntr_course_limits *l,
                        unsigned int flags, char *text, size_t size)
{
    const char *words = NULL;
    if (over(c->rise_24h, l->max_rise_24h)) words = "OVER 24 h rise limit";
    else if (over(c->rise_48h, l->max_rise_48h)) words = "OVER 48 h rise limit";
    else if (over(c->fall_24h, l->max_fall_24h)) words = "OVER 24 h fall limit";
    else if (over(c->fall_48h, l->max_fall_48h)) words = "OVER 48 h fall limit";
    if (words != NULL) {
        snprintf(text, size, "%s", words);
        return 1;
    }
    /* The library's near-limit flags read the same windows as "now". */
    snprintf(text, size, "%s", (flags & (NTR_CF_NEAR_LIMIT | NTR_CF_FALL_NEAR_LIMIT))
                                   ? "within, near a limit" : "within the limits");
    return 0;
}

#define MAX_WATCHED 32

typedef struct watched {
    const ntr_sample *s;
    size_t n;
    named_limits limits;
    ntr_course_watch watch; /* the streaming watcher: one result at a time */
    ntr_course_report last;
    double first_over_h; /* when a window first went over, NTR_COURSE_NO_TIME before */
    int over_now[MAX_WATCHED]; /* per result: over a limit now (drawn as a diamond) */
} watched;

static void watched_init(watched *w, const ntr_sample *s, size_t n,
                         const named_limits *l)
{
    if (n == 0 || n > MAX_WATCHED) {
        fprintf(stderr, "natremia-demo: a watched series holds 1 to %d results\n",
                MAX_WATCHED);
        exit(1);
    }
    memset(w, 0, sizeof *w);
    w->s = s;
    w->n = n;
    w->limits = *l;
    w->first_over_h = NTR_COURSE_NO_TIME;
    must(ntr_course_watch_init(&w->limits.lim, &w->watch), "ntr_course_watch_init");
}

static void watched_push(watched *w, size_t i)
{
    w->last.struct_size = sizeof w->last;
    must(ntr_course_watch_push(&w->watch, w->s[i].hours, w->s[i].na_mmol_l, &w->last),
         "ntr_course_watch_push");
}

static unsigned int over_bits(unsigned int flags)
{
    return flags & (NTR_CF_OVER_24H | NTR_CF_OVER_48H | NTR_CF_FALL_OVER_24H |
                    NTR_CF_FALL_OVER_48H);
}

/* The limit of the worst window so far, in words. */
static const char *worst_words(const ntr_course_report *r, const ntr_course_limits *l)
{
    static const struct { unsigned int bit; const char *words; } names[] = {
        {NTR_CF_OVER_24H, "24 h rise limit"}, {NTR_CF_OVER_48H, "48 h rise limit"},
        {NTR_CF_FALL_OVER_24H, "24 h fall limit"}, {NTR_CF_FALL_OVER_48H, "48 h fall limit"},
    };
    const double figure[] = {r->max_rise_24h - l->max_rise_24h,
                             r->max_rise_48h - l->max_rise_48h,
                             r->max_fall_24h - l->max_fall_24h,
                             r->max_fall_48h - l->max_fall_48h};
    size_t i;
    for (i = 0; i < 4; ++i) {
        if ((r->flags & names[i].bit) && figure[i] >= r->excess_mmol_l - NTR_CF_TOLERANCE) {
            return names[i].words;
        }
    }
    return "limits";
}

/* Notes from the library's trend flags, on a line under the result. */
static void print_trend_notes(unsigned int flags, const ntr_course_limits *l)
{
    char text[240];
    size_t used = 0;
    text[0] = '\0';
    if (flags & (NTR_CF_PROJECTED_OVER | NTR_CF_FALL_PROJECTED_OVER)) {
        used += (size_t)snprintf(text + used, sizeof text - used, "the next result, "
                                 "at the same pace, would be over a limit");
    }
    if ((flags & NTR_CF_RAPID_6H) && used < sizeof text) {
        used += (size_t)snprintf(text + used, sizeof text - used,
                                 "%s6 mmol/L or more in 6 h", used ? "; " : "");
    }
    if ((flags & NTR_CF_WRONG_WAY) && used < sizeof text) {
        used += (size_t)snprintf(text + used, sizeof text - used, "%smoved against the "
                                 "goal by more than %.0f mmol/L", used ? "; " : "",
                                 NTR_CF_WRONG_WAY_MARGIN);
    } else if ((flags & NTR_CF_FALLING) && l->goal == NTR_GOAL_RAISE && used < sizeof text) {
        used += (size_t)snprintf(text + used, sizeof text - used, "%sfalling",
                                 used ? "; " : "");
    }
    if ((flags & NTR_CF_APPROXIMATE) && used < sizeof text) {
        used += (size_t)snprintf(text + used, sizeof text - used, "%sfigures are upper "
                                 "bounds", used ? "; " : "");
    }
    if (used > 0) {
        printf("%16s(%s)\n", "", text);
    }
}

/* A result over a limit after the first such: say which earlier result
 * keeps the window over, so that a course that has stopped moving is not
 * read as moving on. */
static void print_still_over(const ntr_sample *s, size_t j, int raising)
{
    size_t i, ref = j;
    for (i = 0; i < j; ++i) {
        if (s[j].hours - s[i].hours <= 24.0 + NTR_CF_TIME_TOLERANCE_H &&
            (raising ? s[i].na_mmol_l < s[ref].na_mmol_l : s[i].na_mmol_l > s[ref].na_mmol_l)) {
            ref = i;
        }
    }
    printf("%16s(still over: the %.1f mmol/L of hour %.0f is within the last 24 h)\n", "",
           s[ref].na_mmol_l, s[ref].hours);
}

static void watch_header(const ntr_course_limits *l)
{
    printf("                %s\n"
           "   time sodium  result of the past      rate  now                   so far\n"
           "                  24 h    48 h\n"
           "      h mmol/L  mmol/L  mmol/L  mmol/L/h\n",
           l->goal == NTR_GOAL_RAISE ? "rise from the lowest" : "fall from the highest");
}

/* Feed results [from, to) to the watcher; one line each. */
static void watch_rows(watched *w, size_t from, size_t to)
{
    const ntr_course_limits *l = &w->limits.lim;
    const int raising = l->goal == NTR_GOAL_RAISE;
    size_t i;
    for (i = from; i < to; ++i) {
        change_now now;
        char now_text[40], so_far[40];
        watched_push(w, i);
        now = change_now_of(w->s, i, &w->last);
        w->over_now[i] = describe_now(&now, l, w->last.flags, now_text, sizeof now_text);
        if (over_bits(w->last.flags) != 0u && w->first_over_h == NTR_COURSE_NO_TIME) {
            w->first_over_h = w->s[i].hours;
        }
        if (w->first_over_h == NTR_COURSE_NO_TIME) {
            snprintf(so_far, sizeof so_far, "none");
        } else {
            snprintf(so_far, sizeof so_far, "over at %.0f h", w->first_over_h);
        }
        printf("  %5.1f %6.1f  %6.1f  %6.1f  ", w->s[i].hours, w->s[i].na_mmol_l,
               raising ? now.rise_24h : now.fall_24h, raising ? now.rise_48h : now.fall_48h);
        if (i == 0) {
            printf("%8s  ", "");
        } else {
            printf("%+8.2f  ", w->last.last_rate_per_h);
        }
        printf("%-22s%s\n", now_text, so_far);
        print_trend_notes(w->last.flags, l);
        if (w->over_now[i] && w->first_over_h < w->s[i].hours) {
            print_still_over(w->s, i, raising);
        }
    }
}

/* The whole-course summary: now, so far, and the batch cross-check. */
static void watch_summary(const watched *w)
{
    const ntr_course_limits *l = &w->limits.lim;
    const int raising = l->goal == NTR_GOAL_RAISE;
    const size_t last = w->n - 1;
    const change_now now = change_now_of(w->s, last, &w->last);
    ntr_course_report batch;
    batch.struct_size = sizeof batch;
    must(ntr_course_assess(w->s, w->n, l, &batch), "ntr_course_assess");
    printf("  now (hour %.0f): a %s of %.1f mmol/L in the last 24 h and %.1f in the "
           "last\n  48 h: %s\n", w->s[last].hours, raising ? "rise" : "fall",
           raising ? now.rise_24h : now.fall_24h, raising ? now.rise_48h : now.fall_48h,
           w->over_now[last] ? "OVER a limit" : "within the limits");
    if (over_bits(batch.flags) == 0u) {
        printf("  so far: no limit exceeded (largest %s %.1f mmol/L in any 24 h)\n",
               raising ? "rise" : "fall", raising ? batch.max_rise_24h : batch.max_fall_24h);
    } else {
        printf("  so far: over a limit from %.0f h; the worst window, over the %s\n"
               "  by %.1f mmol/L, ends at %.0f h (largest %s %.1f mmol/L in any 24 h, "
               "%.1f\n  in any 48 h)\n", w->first_over_h, worst_words(&batch, l),
               batch.excess_mmol_l, batch.worst_at_h, raising ? "rise" : "fall",
               raising ? batch.max_rise_24h : batch.max_fall_24h,
               raising ? batch.max_rise_48h : batch.max_fall_48h);
    }
    printf("  the batch assessment %s the streaming watcher.\n",
           batch.flags == w->last.flags && batch.max_rise_24h == w->last.max_rise_24h &&
                   batch.max_rise_48h == w->last.max_rise_48h &&
                   batch.max_fall_24h == w->last.max_fall_24h &&
                   batch.max_fall_48h == w->last.max_fall_48h &&
                   batch.excess_mmol_l == w->last.excess_mmol_l
               ? "agrees with"
               : "DISAGREES with");
}

/* The band the limits allow NOW at time t, from the results up to t: a
 * rise limit caps sodium at the lowest result of the window plus the
 * limit; a fall limit floors it at the highest result minus the limit.
 * The band runs from that reference to the cap (or the floor). */
static int band_at(const ntr_sample *s, size_t n, const ntr_course_limits *l, double t,
                   double *low, double *high)
{
    double lo24 = 0.0, lo48 = 0.0, hi24 = 0.0, hi48 = 0.0;
    int any48 = 0, any24 = 0;
    size_t i;
    for (i = 0; i < n && s[i].hours <= t + NTR_CF_TIME_TOLERANCE_H; ++i) {
        const double na = s[i].na_mmol_l, age = t - s[i].hours;
        if (age <= 48.0 + NTR_CF_TIME_TOLERANCE_H) {
            if (!any48 || na < lo48) lo48 = na;
            if (!any48 || na > hi48) hi48 = na;
            any48 = 1;
        }
        if (age <= 24.0 + NTR_CF_TIME_TOLERANCE_H) {
            if (!any24 || na < lo24) lo24 = na;
            if (!any24 || na > hi24) hi24 = na;
            any24 = 1;
        }
    }
    if (!any24) return 0;
    if (l->goal == NTR_GOAL_RAISE) {
        double cap = lo24 + l->max_rise_24h;
        if (l->max_rise_48h > 0.0 && lo48 + l->max_rise_48h < cap) cap = lo48 + l->max_rise_48h;
        *low = lo24;
        *high = cap;
    } else {
        double floor_na = hi24 - l->max_fall_24h;
        if (l->max_fall_48h > 0.0 && hi48 - l->max_fall_48h > floor_na) {
            floor_na = hi48 - l->max_fall_48h;
        }
        *low = floor_na;
        *high = hi24;
    }
    return 1;
}

#define BAND_STEP_H 0.1
#define BAND_MAX_POINTS 1000

typedef struct band_points {
    double hours[BAND_MAX_POINTS], low[BAND_MAX_POINTS], high[BAND_MAX_POINTS];
    size_t n;
} band_points;

static void band_over(const ntr_sample *s, size_t n, const ntr_course_limits *l,
                      double hours_max, band_points *b)
{
    size_t k;
    b->n = 0;
    for (k = 0; b->n < BAND_MAX_POINTS; ++k) {
        const double t = (double)k * BAND_STEP_H;
        if (t > hours_max + 1e-9) break;
        if (band_at(s, n, l, t, &b->low[b->n], &b->high[b->n])) {
            b->hours[b->n++] = t;
        }
    }
}

/* The chart's notes: the same "so far" and "now" as the summary. */
typedef struct chart_notes {
    char text[5][64];
    const char *lines[5];
} chart_notes;

static void notes_for(const watched *w, chart_notes *n)
{
    const size_t last = w->n - 1;
    const change_now now = change_now_of(w->s, last, &w->last);
    const int raising = w->limits.lim.goal == NTR_GOAL_RAISE;
    size_t i;
    if (over_bits(w->last.flags) == 0u) {
        snprintf(n->text[0], sizeof n->text[0], "So far: no limit exceeded");
        snprintf(n->text[1], sizeof n->text[1], " ");
    } else {
        snprintf(n->text[0], sizeof n->text[0], "So far: over the %s",
                 worst_words(&w->last, &w->limits.lim));
        snprintf(n->text[1], sizeof n->text[1], "first at %.0f h; worst %.0f h, by %.1f mmol/L",
                 w->first_over_h, w->last.worst_at_h, w->last.excess_mmol_l);
    }
    snprintf(n->text[2], sizeof n->text[2], "Now (%.0f h): %s", w->s[last].hours,
             w->over_now[last] ? "OVER a limit" : "within the limits");
    snprintf(n->text[3], sizeof n->text[3], "%s %.1f mmol/L in 24 h, %.1f in 48 h",
             raising ? "rise" : "fall", raising ? now.rise_24h : now.fall_24h,
             raising ? now.rise_48h : now.fall_48h);
    snprintf(n->text[4], sizeof n->text[4], "(each result judged when taken)");
    for (i = 0; i < 5; ++i) n->lines[i] = n->text[i];
}

/* Copy a series into the chart's x and y arrays. */
static void split(const ntr_sample *s, size_t n, double *hours, double *na)
{
    size_t i;
    for (i = 0; i < n; ++i) {
        hours[i] = s[i].hours;
        na[i] = s[i].na_mmol_l;
    }
}

static void sources_step(const char *title, const int *used, size_t n)
{
    struct ntr_method_info info;
    size_t i;
    heading(title);
    for (i = 0; i < n; ++i) {
        must(ntr_method_info(used[i], &info), "ntr_method_info");
        printf("  %s (method %d)\n", info.name, used[i]);
        print_wrapped(info.reference, 6, 78);
    }
}

/* A plan's verdict from the direction-aware plan check. */
static void report_plan(const char *label, const ntr_course_plan_result *r, double na0,
                        double hours)
{
    const double change = r->final_na_mmol_l - na0;
    printf("  %s\n    predicted sodium at %.0f h: %.1f mmol/L (%s %.1f mmol/L), body "
           "water %.1f L\n", label, hours, r->final_na_mmol_l,
           change >= 0.0 ? "rise" : "fall", change >= 0.0 ? change : -change,
           r->final_tbw_l);
    if (r->first_breach_direction == NTR_PLAN_BREACH_NONE) {
        printf("    -> predicted to stay within the limits (largest %s %.1f mmol/L "
               "in 24 h)\n", r->course.max_fall_24h > r->course.max_rise_24h ? "fall" : "rise",
               r->course.max_fall_24h > r->course.max_rise_24h ? r->course.max_fall_24h
                                                               : r->course.max_rise_24h);
    } else {
        const int fall = r->first_breach_direction == NTR_PLAN_BREACH_FALL;
        const int w48 = r->first_breach_flag == NTR_CF_OVER_48H ||
                        r->first_breach_flag == NTR_CF_FALL_OVER_48H;
        printf("    -> predicted to BREACH the %s h %s limit from hour %.1f (largest "
               "%s\n       %.1f mmol/L in 24 h)\n", w48 ? "48" : "24", fall ? "fall" : "rise",
               r->first_breach_h, fall ? "fall" : "rise",
               fall ? r->course.max_fall_24h : r->course.max_rise_24h);
    }
}

/* ======================================================================= */
/* Patient A: a low sodium, raised                                          */
/* ======================================================================= */

#define A_SEX NTR_SEX_FEMALE
#define A_AGE_YEARS 68.0
#define A_HEIGHT_CM 160.0
#define A_WEIGHT_KG 58.0

/* The panel as a laboratory system might send it: each value with the
 * UCUM code of its unit, not all of them in mmol/L, and the number of
 * decimals it is reported with once in SI units. */
struct lab_value {
    const char *name;
    int analyte;
    double value;
    const char *ucum;
    int decimals_in;  /* as received */
    int decimals_si;  /* as shown in SI units */
};

static const struct lab_value a_panel[] = {
    {"sodium", NTR_ANALYTE_SODIUM, 114.0, "meq/L", 0, 0},
    {"potassium", NTR_ANALYTE_POTASSIUM, 3.6, "mmol/L", 1, 1},
    {"glucose", NTR_ANALYTE_GLUCOSE, 162.0, "mg/dL", 0, 1},
    {"urea nitrogen (BUN)", NTR_ANALYTE_UREA_NITROGEN, 8.0, "mg/dL", 0, 1},
    {"creatinine", NTR_ANALYTE_CREATININE, 0.7, "mg/dL", 1, 0},
};
enum { PANEL_NA, PANEL_K, PANEL_GLUCOSE, PANEL_BUN, PANEL_CREATININE,
       PANEL_COUNT };

#define A_MEASURED_OSM_MOSM_KG 243.0
#define A_URINE_OSM_MOSM_KG 460.0
#define A_URINE_NA_MMOL_L 82.0
#define A_URINE_K_MMOL_L 38.0
#define A_URINE_UREA_MMOL_L 180.0
#define A_URINE_CREATININE_UMOL_L 6000.0
#define A_URIC_ACID_MMOL_L 0.16

/* The invented plan: two boluses of 150 mL of 3% saline, 20 minutes each,
 * checked over 24 h; then the same plan with a water diuresis that starts
 * at hour 6, as often happens once the cause of the antidiuresis resolves. */
#define BOLUS_L 0.150
#define BOLUS_COUNT 2
#define BOLUS_MINUTES 20.0
#define PLAN_HOURS 24.0
#define PLAN_STEP_H 0.5
#define PLAN_POINTS 49 /* PLAN_HOURS / PLAN_STEP_H + 1 */
#define DIURESIS_START_H 6.0
#define DIURESIS_ML_H 250.0
#define DIURESIS_NA_MMOL_L 40.0
#define DIURESIS_K_MMOL_L 20.0

/* The invented measured series, hours since the first sample. The first
 * six come before the re-lowering decision, the rest after it. */
static const ntr_sample a_measured[] = {
    {0.0, 114.0},  {1.0, 118.0},  {4.0, 118.5},  {8.0, 120.5},
    {12.0, 123.0}, {16.0, 125.5}, {20.0, 123.0}, {24.0, 122.5},
    {30.0, 124.0}, {36.0, 125.5}, {42.0, 126.5}, {48.0, 128.0},
};
#define A_MEASURED_COUNT (sizeof a_measured / sizeof a_measured[0])
#define A_BEFORE_RELOWER 6
#define A_FIT_COUNT 4 /* the results up to 8 h, when the urine alert comes */

/* Re-lowering: 5% dextrose over 4 h, to 2 mmol/L under the 24 h limit,
 * with the urine expected once the diuresis is stopped. */
#define RELOWER_HOURS 4.0
#define RELOWER_MARGIN_MMOL_L 2.0
#define RELOWER_URINE_ML_H 60.0
#define RELOWER_URINE_NA_MMOL_L 80.0
#define RELOWER_URINE_K_MMOL_L 40.0

/* Results carried from one step to the next. */
struct patient_a {
    double si[PANEL_COUNT]; /* creatinine in umol/L, the rest in mmol/L */
    double osm_calculated, osm_effective; /* effective: measured less urea */
    double tbw_fraction_l, tbw_watson_l;
    double furst;
    named_limits limits;
    /* Predicted courses of the plan, for the chart. */
    ntr_sample bolus_only[PLAN_POINTS], with_diuresis[PLAN_POINTS];
    size_t n_bolus_only, n_with_diuresis;
    struct therapy_curve refit; /* re-projected with the fit (A9b) */
    watched series;
};

static void a_introduce(void)
{
    printf("\n######## Patient A: a low sodium, raised ########\n\n");
    printf("Patient A (invented): woman, %.0f years, %.0f cm, %.0f kg; admitted "
           "confused and\nnauseated.\n", A_AGE_YEARS, A_HEIGHT_CM, A_WEIGHT_KG);
}

static void a_panel_step(struct patient_a *p)
{
    size_t i;
    heading("A1. Laboratory panel, as received and in SI units");
    for (i = 0; i < PANEL_COUNT; ++i) {
        const struct lab_value *v = &a_panel[i];
        int unit, target = NTR_UNIT_MMOL_L;
        const char *target_name = "mmol/L";
        must(ntr_unit_parse(v->ucum, &unit), "ntr_unit_parse");
        if (v->analyte == NTR_ANALYTE_CREATININE) {
            target = NTR_UNIT_UMOL_L;
            target_name = "umol/L";
        }
        must(ntr_convert(v->analyte, v->value, unit, target, &p->si[i]), "ntr_convert");
        printf("  %-22s %6.*f %-7s -> %6.*f %s%s\n", v->name, v->decimals_in, v->value,
               v->ucum, v->decimals_si, p->si[i], target_name,
               v->analyte == NTR_ANALYTE_UREA_NITROGEN ? " of urea" : "");
    }
    printf("  %-22s %6.0f mOsm/kg (measured)\n", "serum osmolality",
           A_MEASURED_OSM_MOSM_KG);
    printf("  %-22s %6.2f mmol/L\n", "uric acid", A_URIC_ACID_MMOL_L);
    printf("  urine: osmolality %.0f mOsm/kg, sodium %.0f mmol/L, potassium "
           "%.0f mmol/L,\n         urea %.0f mmol/L, creatinine %.0f umol/L\n",
           A_URINE_OSM_MOSM_KG, A_URINE_NA_MMOL_L, A_URINE_K_MMOL_L,
           A_URINE_UREA_MMOL_L, A_URINE_CREATININE_UMOL_L);
}

static void a_tonicity_step(struct patient_a *p)
{
    double gap, katz, hillier;
    int tonicity_class;
    unsigned int flags;
    const double na = p->si[PANEL_NA], glucose = p->si[PANEL_GLUCOSE];
    const double urea = p->si[PANEL_BUN];
    heading("A2. Is the low sodium truly hypotonic?");
    must(ntr_osm_calculated(na, glucose, urea, 0.0, NTR_OSM_2NA, &p->osm_calculated),
         "ntr_osm_calculated");
    must(ntr_osm_gap(A_MEASURED_OSM_MOSM_KG, p->osm_calculated, &gap), "ntr_osm_gap");
    /* Urea crosses cell membranes and draws no water: the tonicity the
     * cells feel is the measured value less urea (and less ethanol, which
     * was not measured here and counts as 0). */
    must(ntr_effective_osm_measured(na, glucose, urea, 0.0, A_MEASURED_OSM_MOSM_KG,
                                    &p->osm_effective), "ntr_effective_osm_measured");
    printf("  measured osmolality                            %6.0f mOsm/kg\n",
           A_MEASURED_OSM_MOSM_KG);
    printf("  calculated osmolality  2 x Na + glucose + urea  %6.1f mOsm/kg\n",
           p->osm_calculated);
    printf("  osmolal gap            measured - calculated    %6.1f mOsm/kg%s\n",
           gap, gap > 10.0 ? " (raised)" : " (not raised)");
    printf("  effective osmolality   measured - urea          %6.1f mOsm/kg\n",
           p->osm_effective);
    printf("                         (ethanol not measured: counted as 0)\n");
    must(ntr_na_corrected_glucose(na, glucose, NTR_GLUCOSE_KATZ, &katz),
         "ntr_na_corrected_glucose");
    must(ntr_na_corrected_glucose(na, glucose, NTR_GLUCOSE_HILLIER, &hillier),
         "ntr_na_corrected_glucose");
    printf("  sodium corrected for glucose: %.1f mmol/L (Katz), %.1f mmol/L "
           "(Hillier)\n", katz, hillier);
    must(ntr_low_na_effective_tonicity(na, glucose, urea, 0.0, A_MEASURED_OSM_MOSM_KG,
                                       NTR_GLUCOSE_HILLIER, &tonicity_class, &flags),
         "ntr_low_na_effective_tonicity");
    if (tonicity_class == NTR_TONICITY_HYPOTONIC && flags == 0u) {
        printf("  -> effective osmolality %.0f mOsm/kg is below 275 and glucose "
               "does not explain\n     the sodium: a hypotonic low sodium.\n",
               p->osm_effective);
    } else {
        printf("  -> not a plain hypotonic low sodium (class %d, flags 0x%02x): "
               "recheck before treating.\n", tonicity_class, flags);
    }
}

static void a_severity_step(const struct patient_a *p)
{
    static const char *const names[] = {"none (135 mmol/L or more)",
                                        "mild (130 to 134.9 mmol/L)",
                                        "moderate (125 to 129.9 mmol/L)",
                                        "profound (below 125 mmol/L)"};
    int band;
    heading("A3. Severity of the low sodium");
    must(ntr_na_severity(p->si[PANEL_NA], &band), "ntr_na_severity");
    printf("  sodium %.0f mmol/L: %s\n", p->si[PANEL_NA], names[band]);
    printf("  (by the number alone; the symptoms, confusion and nausea, are judged "
           "at the\n  bedside)\n");
}

static void a_body_water_step(struct patient_a *p)
{
    heading("A4. Total body water, two ways");
    must(ntr_tbw_fraction(A_SEX, A_AGE_YEARS, A_WEIGHT_KG, &p->tbw_fraction_l),
         "ntr_tbw_fraction");
    must(ntr_tbw_watson(A_SEX, A_AGE_YEARS, A_HEIGHT_CM, A_WEIGHT_KG, &p->tbw_watson_l),
         "ntr_tbw_watson");
    printf("  fraction of weight (0.45 for a woman of 65 or more): %5.1f L\n",
           p->tbw_fraction_l);
    printf("  Watson anthropometric equation:                      %5.1f L\n",
           p->tbw_watson_l);
    printf("  -> the plan below uses the smaller value, which predicts the "
           "larger change.\n");
}

/* A criterion's state in words. A finding the clinician entered (volume
 * status, thyroid function, ...) is "reported": the program only passes
 * it on, it did not test it. */
static const char *criterion_state(const ntr_siad_result *r, int criterion,
                                   int clinician_entered)
{
    unsigned long bit = 1ul << criterion;
    if (r->met & bit) return clinician_entered ? "reported" : "met";
    if (r->not_met & bit) return clinician_entered ? "NOT met (reported)" : "NOT met";
    if (r->not_assessable & bit) return "cannot be judged";
    return "not recorded";
}

static void known(ntr_finding_value *f, double value)
{
    f->known = 1;
    f->value = value;
}

static void a_siad_step(const struct patient_a *p)
{
    ntr_siad_findings f;
    ntr_siad_result r;
    double fe_urea;
    size_t i;

    heading("A5. Does it fit inappropriate antidiuresis (SIAD)?");
    must(ntr_fractional_excretion(A_URINE_UREA_MMOL_L, p->si[PANEL_BUN],
                                  A_URINE_CREATININE_UMOL_L, p->si[PANEL_CREATININE],
                                  &fe_urea), "ntr_fractional_excretion");
    must(ntr_siad_findings_init(&f), "ntr_siad_findings_init");
    /* The effective osmolality of step A2, the one the tonicity was judged on. */
    known(&f.effective_osm_mosm_kg, p->osm_effective);
    known(&f.urine_osm_mosm_kg, A_URINE_OSM_MOSM_KG);
    known(&f.urine_na_mmol_l, A_URINE_NA_MMOL_L);
    known(&f.urea_mmol_l, p->si[PANEL_BUN]);
    known(&f.uric_acid_mmol_l, A_URIC_ACID_MMOL_L);
    known(&f.fe_urea_percent, fe_urea);
    /* Entered by the clinician, as the ward records them. */
    f.volume_status = NTR_VOLUME_EUVOLAEMIC;
    f.normal_salt_water_intake = NTR_FINDING_YES;
    f.thyroid_normal = NTR_FINDING_YES;
    f.adrenal_normal = NTR_FINDING_YES;
    f.pituitary_normal = NTR_FINDING_YES;
    f.kidney_normal = NTR_FINDING_YES;
    f.recent_diuretic = NTR_FINDING_NO;
    r.struct_size = sizeof r;
    must(ntr_siad_evaluate(&f, &r), "ntr_siad_evaluate");
    {
        char v[6][24];
        const struct { int criterion; const char *text; const char *value; } shown[] = {
            {NTR_SIAD_OSM_LOW, "effective osmolality below 275 mOsm/kg", v[0]},
            {NTR_SIAD_URINE_CONCENTRATED, "urine osmolality above 100 mOsm/kg", v[1]},
            {NTR_SIAD_URINE_NA_HIGH, "urine sodium above 30 mmol/L (*)", v[2]},
            {NTR_SIAD_EUVOLAEMIA, "clinically euvolaemic", NULL},
            {NTR_SIAD_THYROID_NORMAL, "thyroid function normal", NULL},
            {NTR_SIAD_ADRENAL_NORMAL, "adrenal function normal", NULL},
            {NTR_SIAD_PITUITARY_NORMAL, "pituitary function normal", NULL},
            {NTR_SIAD_KIDNEY_NORMAL, "kidney function normal", NULL},
            {NTR_SIAD_NO_DIURETIC, "no recent diuretic", NULL},
            {NTR_SIAD_UREA_LOW, "(supporting) urea below 3.6 mmol/L", v[3]},
            {NTR_SIAD_URIC_ACID_LOW, "(supporting) uric acid below 0.24 mmol/L", v[4]},
            {NTR_SIAD_FE_UREA_HIGH, "(supporting) fractional urea excretion > 55%", v[5]},
        };
        snprintf(v[0], sizeof v[0], "%.1f mOsm/kg", p->osm_effective);
        snprintf(v[1], sizeof v[1], "%.0f mOsm/kg", A_URINE_OSM_MOSM_KG);
        snprintf(v[2], sizeof v[2], "%.0f mmol/L", A_URINE_NA_MMOL_L);
        snprintf(v[3], sizeof v[3], "%.1f mmol/L", p->si[PANEL_BUN]);
        snprintf(v[4], sizeof v[4], "%.2f mmol/L", A_URIC_ACID_MMOL_L);
        snprintf(v[5], sizeof v[5], "%.0f%%", fe_urea);
        printf("  %-44s %-14s %s\n", "criterion", "finding", "result");
        for (i = 0; i < sizeof shown / sizeof shown[0]; ++i) {
            printf("  %-44s %-14s %s\n", shown[i].text,
                   shown[i].value != NULL ? shown[i].value : "by clinician",
                   criterion_state(&r, shown[i].criterion, shown[i].value == NULL));
        }
    }
    printf("  (*) with salt and water intake reported normal.\n");
    printf("  -> %s\n", r.verdict == NTR_SIAD_CONSISTENT
                            ? "consistent with SIAD: the measured criteria are met "
                              "and the clinical\n     findings are reported as the "
                              "criteria require."
                        : r.verdict == NTR_SIAD_NOT_CONSISTENT
                            ? "not consistent with SIAD."
                            : "incomplete: some essential findings are not recorded.");
}

static void a_restriction_step(struct patient_a *p)
{
    int advice;
    heading("A6. Will fluid restriction work? (Furst ratio)");
    must(ntr_furst_ratio(A_URINE_NA_MMOL_L, A_URINE_K_MMOL_L, p->si[PANEL_NA], &p->furst),
         "ntr_furst_ratio");
    must(ntr_restriction_from_ratio(p->furst, &advice), "ntr_restriction_from_ratio");
    printf("  (urine Na + urine K) / serum Na = (%.0f + %.0f) / %.0f = %.2f\n",
           A_URINE_NA_MMOL_L, A_URINE_K_MMOL_L, p->si[PANEL_NA], p->furst);
    switch (advice) {
    case NTR_RESTRICT_1000ML:
        printf("  -> ratio below 1: restriction to under 1 L a day may work.\n");
        break;
    case NTR_RESTRICT_500_700ML:
        printf("  -> ratio about 1: restriction would need 500 to 700 mL a day.\n");
        break;
    default:
        printf("  -> ratio above 1: restriction alone is unlikely to raise the "
               "sodium, even\n     under 500 mL a day.\n");
        break;
    }
}

/* With or without urea: the solute decision (examples/demo_therapy.c). */
static void a_solute_step(const struct patient_a *p)
{
    struct therapy_urine u;
    u.serum_na_mmol_l = p->si[PANEL_NA];
    u.urine_na_mmol_l = A_URINE_NA_MMOL_L;
    u.urine_k_mmol_l = A_URINE_K_MMOL_L;
    u.urine_osm_mosm_kg = A_URINE_OSM_MOSM_KG;
    therapy_solute_step("A6a. Restriction with or without urea (fluid allowance)", &u);
}

/* The risk factors, each in words, and why the limits were chosen. */
static void describe_risk(unsigned int drivers, unsigned int unknowns, int preset)
{
    static const struct { unsigned int bit; const char *name; } factors[] = {
        {NTR_ODS_NA_105, "sodium 105 mmol/L or below"},
        {NTR_ODS_LOW_K, "low potassium"},
        {NTR_ODS_ALCOHOL, "alcohol use disorder"},
        {NTR_ODS_MALNUTRITION, "malnutrition"},
        {NTR_ODS_LIVER, "advanced liver disease"},
    };
    size_t i;
    int first = 1;
    if (drivers == 0u && unknowns == 0u) {
        printf("  risk factors for osmotic demyelination: none known (each was "
               "asked about\n  and is absent)\n");
    } else {
        printf("  risk factors for osmotic demyelination:");
        for (i = 0; i < sizeof factors / sizeof factors[0]; ++i) {
            if (drivers & factors[i].bit) {
                printf("%s %s: present", first ? "" : ";", factors[i].name);
                first = 0;
            }
        }
        for (i = 0; i < sizeof factors / sizeof factors[0]; ++i) {
            if (unknowns & factors[i].bit) {
                printf("%s %s: not recorded", first ? "" : ";", factors[i].name);
                first = 0;
            }
        }
        printf("\n");
    }
    if (preset == NTR_LIMITS_HIGH_RISK) {
        printf("  -> high-risk limits, because %s\n",
               drivers != 0u ? "a risk factor is present"
                             : "a risk factor is not recorded\n     (a missing "
                               "answer never loosens the limits):");
    } else {
        printf("  -> standard limits, because no risk factor is present or "
               "unrecorded:\n");
    }
}

/* ntr_ods_risk() answers with a 1.0 preset; the course engine has the
 * same limits under its own preset numbers. */
static int course_preset_for(int limits_preset)
{
    return limits_preset == NTR_LIMITS_HIGH_RISK ? NTR_COURSE_HYPO_HIGH_RISK
                                                 : NTR_COURSE_HYPO_STANDARD;
}

static void a_limits_step(struct patient_a *p)
{
    int preset, what_if;
    unsigned int drivers, unknowns, d2, u2;
    ntr_course_limits high;
    heading("A7. Which correction limits apply?");
    /* Potassium 3.6 mmol/L is not low; the other risk factors were asked
     * about and are absent in this invented history. */
    must(ntr_ods_risk(p->si[PANEL_NA], NTR_TRI_NO, NTR_TRI_NO, NTR_TRI_NO, NTR_TRI_NO,
                      &preset, &drivers, &unknowns), "ntr_ods_risk");
    must(ntr_course_limits_preset(course_preset_for(preset), &p->limits.lim),
         "ntr_course_limits_preset");
    p->limits.name = preset == NTR_LIMITS_HIGH_RISK ? "high-risk" : "standard";
    describe_risk(drivers, unknowns, preset);
    printf("     a rise of at most %.0f mmol/L in any 24 h and %.0f in any 48 h.\n",
           p->limits.lim.max_rise_24h, p->limits.lim.max_rise_48h);
    /* What the same call says had alcohol use not been asked about. */
    must(ntr_ods_risk(p->si[PANEL_NA], NTR_TRI_NO, NTR_TRI_UNKNOWN, NTR_TRI_NO,
                      NTR_TRI_NO, &what_if, &d2, &u2), "ntr_ods_risk");
    must(ntr_course_limits_preset(course_preset_for(what_if), &high),
         "ntr_course_limits_preset");
    printf("  had alcohol use not been recorded, the answer would be:\n");
    describe_risk(d2, u2, what_if);
    printf("     a rise of at most %.0f mmol/L in any 24 h and %.0f in any 48 h.\n",
           high.max_rise_24h, high.max_rise_48h);
}

static void a_bolus_step(struct patient_a *p)
{
    double na_inf, k_inf, per_litre, one, both, both_watson, for_five;
    const double na = p->si[PANEL_NA];
    heading("A8. Planned hypertonic saline and its predicted effect");
    must(ntr_fluid_preset(NTR_FLUID_NACL_3, &na_inf, &k_inf), "ntr_fluid_preset");
    must(ntr_infusate_change_per_litre(na, p->tbw_fraction_l, na_inf, k_inf, &per_litre),
         "ntr_infusate_change_per_litre");
    must(ntr_infusate_change(na, p->tbw_fraction_l, na_inf, k_inf, BOLUS_L, &one),
         "ntr_infusate_change");
    must(ntr_infusate_change(na, p->tbw_fraction_l, na_inf, k_inf, BOLUS_COUNT * BOLUS_L,
                             &both), "ntr_infusate_change");
    must(ntr_infusate_change(na, p->tbw_watson_l, na_inf, k_inf, BOLUS_COUNT * BOLUS_L,
                             &both_watson), "ntr_infusate_change");
    must(ntr_infusate_volume_for_change(na, p->tbw_fraction_l, na_inf, k_inf, 5.0,
                                        &for_five), "ntr_infusate_volume_for_change");
    printf("  plan: %d boluses of %.0f mL of 3%% saline (Na %.0f mmol/L), %.0f "
           "minutes each\n", BOLUS_COUNT, BOLUS_L * 1000.0, na_inf, BOLUS_MINUTES);
    printf("  1 L of it would change sodium by    %+5.1f mmol/L "
           "(Adrogue-Madias, TBW %.1f L)\n", per_litre, p->tbw_fraction_l);
    printf("  one bolus:                          %+5.1f mmol/L\n", one);
    printf("  both boluses:                       %+5.1f mmol/L -> %.1f mmol/L\n",
           both, na + both);
    printf("  both, if body water is Watson's:    %+5.1f mmol/L\n", both_watson);
    printf("  3%% saline for a rise of 5 mmol/L:   %5.0f mL\n", for_five * 1000.0);
    printf("  (these figures count no urine output: see the next step)\n");
}

/* The plan as steady-rate flows: the boluses back to back, then (only in
 * the second plan) the urine of a water diuresis. */
static size_t a_plan_flows(int with_diuresis, ntr_timed_flow flows[2])
{
    const ntr_timed_flow urine = {DIURESIS_START_H, PLAN_HOURS, -DIURESIS_ML_H,
                                  DIURESIS_NA_MMOL_L, DIURESIS_K_MMOL_L, {0u, 0u}};
    ntr_timed_flow saline = {0.0, 0.0, 0.0, 0.0, 0.0, {0u, 0u}};
    saline.end_h = BOLUS_COUNT * BOLUS_MINUTES / 60.0;
    saline.rate_ml_h = BOLUS_L * 1000.0 / (BOLUS_MINUTES / 60.0);
    must(ntr_fluid_preset(NTR_FLUID_NACL_3, &saline.na_mmol_l, &saline.k_mmol_l),
         "ntr_fluid_preset");
    flows[0] = saline;
    flows[1] = urine;
    return with_diuresis ? 2u : 1u;
}

static void a_plan_step(struct patient_a *p)
{
    const ntr_sample now = {0.0, p->si[PANEL_NA]};
    ntr_timed_flow flows[2];
    ntr_course_plan_result alone, diuresis;
    char label[160];
    size_t n;
    heading("A9. Checking the plan, with and without a water diuresis");
    n = a_plan_flows(0, flows);
    alone.struct_size = sizeof alone;
    must(ntr_course_plan_check(&now, 1, p->tbw_fraction_l, flows, n, PLAN_HOURS,
                               PLAN_STEP_H, &p->limits.lim, &alone), "ntr_course_plan_check");
    must(ntr_balance_course(now.na_mmol_l, p->tbw_fraction_l, flows, n, PLAN_HOURS,
                            PLAN_STEP_H, p->bolus_only, PLAN_POINTS, &p->n_bolus_only),
         "ntr_balance_course");
    report_plan("boluses alone:", &alone, now.na_mmol_l, PLAN_HOURS);
    n = a_plan_flows(1, flows);
    diuresis.struct_size = sizeof diuresis;
    must(ntr_course_plan_check(&now, 1, p->tbw_fraction_l, flows, n, PLAN_HOURS,
                               PLAN_STEP_H, &p->limits.lim, &diuresis), "ntr_course_plan_check");
    must(ntr_balance_course(now.na_mmol_l, p->tbw_fraction_l, flows, n, PLAN_HOURS,
                            PLAN_STEP_H, p->with_diuresis, PLAN_POINTS,
                            &p->n_with_diuresis), "ntr_balance_course");
    snprintf(label, sizeof label, "boluses, then from hour %.0f a water diuresis of "
             "%.0f mL/h (urine Na %.0f,\n  K %.0f mmol/L):", DIURESIS_START_H,
             DIURESIS_ML_H, DIURESIS_NA_MMOL_L, DIURESIS_K_MMOL_L);
    report_plan(label, &diuresis, now.na_mmol_l, PLAN_HOURS);
    printf("  -> the prediction counts only the fluids listed, and measured rises "
           "after\n     hypertonic saline often exceed it: measure sodium after "
           "each bolus. A\n     diuresis like this needs sodium every few hours "
           "and a plan to stop it.\n");
}

/* Measured urine fed back at each result (examples/demo_therapy.c). */
static void a_feedback_step(const struct patient_a *p)
{
    ntr_timed_flow flows[2];
    size_t n = a_plan_flows(0, flows);
    (void)therapy_feedback_step("A9a. Measured urine fed back at each result", a_measured,
                                A_BEFORE_RELOWER, p->tbw_fraction_l, flows, n,
                                &p->limits.lim);
}

/* The fit on the results to the alert, and the re-projection
 * (examples/demo_therapy.c). */
static void a_fit_step(struct patient_a *p)
{
    ntr_timed_flow flows[2];
    size_t n = a_plan_flows(0, flows);
    therapy_fit_step("A9b. What the results so far say: fitted re-projection", a_measured,
                     A_FIT_COUNT, A_BEFORE_RELOWER, p->tbw_fraction_l, flows, n,
                     &p->limits.lim, p->bolus_only, p->n_bolus_only, &p->refit);
}

static void a_watch_step(struct patient_a *p)
{
    heading("A10. Watching the measured series");
    printf("  \"now\": each result against the %s limits (%.0f mmol/L in 24 h, "
           "%.0f in\n  48 h), counted from the lowest result of the 24 h (48 h) "
           "before it. \"so far\":\n  when the course first went over a limit, "
           "even if it is within now.\n", p->limits.name, p->limits.lim.max_rise_24h,
           p->limits.lim.max_rise_48h);
    watched_init(&p->series, a_measured, A_MEASURED_COUNT, &p->limits);
    watch_header(&p->limits.lim);
    watch_rows(&p->series, 0, A_BEFORE_RELOWER);
    if (p->series.last.flags & NTR_CF_OVER_24H) {
        printf("  -> over-rapid correction: the rise in 24 h exceeds the limit by "
               "%.1f mmol/L.\n", p->series.last.excess_mmol_l);
    }
}

static void a_relower_step(const struct patient_a *p)
{
    const double na_now = a_measured[A_BEFORE_RELOWER - 1].na_mmol_l;
    const double lower_by = p->series.last.excess_mmol_l + RELOWER_MARGIN_MMOL_L;
    double volume_l, rate_ml_h;
    heading("A11. Re-lowering estimate");
    must(ntr_relower_estimate(na_now, p->tbw_fraction_l, 0.0, 0.0, lower_by,
                              RELOWER_HOURS, RELOWER_URINE_ML_H, RELOWER_URINE_NA_MMOL_L,
                              RELOWER_URINE_K_MMOL_L, &volume_l, &rate_ml_h),
         "ntr_relower_estimate");
    printf("  to bring sodium from %.1f down by %.1f to %.1f mmol/L (%.0f under "
           "the 24 h\n  limit) over %.0f h, with urine expected at %.0f mL/h once "
           "the diuresis is stopped:\n", na_now, lower_by, na_now - lower_by,
           RELOWER_MARGIN_MMOL_L, RELOWER_HOURS, RELOWER_URINE_ML_H);
    printf("  5%% dextrose %.0f mL, that is %.0f mL/h\n", volume_l * 1000.0, rate_ml_h);
    printf("  -> re-lowering is a specialist decision; measure sodium every "
           "1 to 2 hours.\n");
}

static void a_rest_step(struct patient_a *p)
{
    heading("A12. The rest of the course, still watched");
    watch_header(&p->limits.lim);
    watch_rows(&p->series, A_BEFORE_RELOWER, A_MEASURED_COUNT);
    watch_summary(&p->series);
}

static void a_chart_step(struct patient_a *p, const char *path)
{
    static band_points band;
    double m_hours[A_MEASURED_COUNT], m_na[A_MEASURED_COUNT];
    double a_hours[PLAN_POINTS], a_na[PLAN_POINTS], d_hours[PLAN_POINTS], d_na[PLAN_POINTS];
    chart_line lines[3];
    char subtitle[200];
    chart_notes notes;
    chart c;

    heading("A13. Chart");
    split(a_measured, A_MEASURED_COUNT, m_hours, m_na);
    split(p->bolus_only, p->n_bolus_only, a_hours, a_na);
    split(p->with_diuresis, p->n_with_diuresis, d_hours, d_na);
    band_over(a_measured, A_MEASURED_COUNT, &p->limits.lim, 48.0, &band);
    lines[0].label = "Predicted: boluses alone";
    lines[0].colour = "#7a7a7a";
    lines[0].hours = a_hours;
    lines[0].na_mmol_l = a_na;
    lines[0].n = p->n_bolus_only;
    lines[1].label = "Predicted: with diuresis";
    lines[1].colour = "#d4780a";
    lines[1].hours = d_hours;
    lines[1].na_mmol_l = d_na;
    lines[1].n = p->n_with_diuresis;
    lines[2].label = "Re-projected with the fit (A9b)";
    lines[2].colour = "#7b3f9e";
    lines[2].hours = p->refit.hours;
    lines[2].na_mmol_l = p->refit.na_mmol_l;
    lines[2].n = p->refit.n;

    snprintf(subtitle, sizeof subtitle, "Band: from the lowest result of the past "
             "24 h up to %.0f mmol/L above it (%.0f above the lowest of 48 h); %s "
             "limits", p->limits.lim.max_rise_24h, p->limits.lim.max_rise_48h,
             p->limits.name);
    c.title = "Patient A (invented): serum sodium, plan, limits and results";
    c.subtitle = subtitle;
    c.caption = "Invented patient. Estimates for decision support, not orders: "
                "verify with measured values; follow local protocols and licensed "
                "clinical judgement.";
    c.hours_max = 48.0;
    c.na_min = 110.0;
    c.na_max = 140.0;
    c.band.label = "Rise allowed now";
    c.band.hours = band.hours;
    c.band.low_mmol_l = band.low;
    c.band.high_mmol_l = band.high;
    c.band.n = band.n;
    c.lines = lines;
    c.n_lines = 3;
    c.points.label = "Measured, within the limits";
    c.points.flagged_label = "Measured, over a limit";
    c.points.hours = m_hours;
    c.points.na_mmol_l = m_na;
    c.points.flagged = p->series.over_now;
    c.points.n = A_MEASURED_COUNT;
    notes_for(&p->series, &notes);
    c.notes = notes.lines;
    c.n_notes = 5;
    if (chart_save_svg(path, &c) != 0) {
        fprintf(stderr, "natremia-demo: could not write %s\n", path);
        exit(1);
    }
    printf("  measured sodium, the predicted and re-projected courses and the rise the\n"
           "  limits allow at each moment written to ");
    print_full_path(path);
    printf("\n  (open it in any web browser); a diamond marks a result over a "
           "limit when it\n  was taken, as in the \"now\" column.\n");
}

static void patient_a(const char *chart_path)
{
    static const int used[] = {NTR_METHOD_EFFECTIVE_OSM_MEASURED, NTR_METHOD_TBW_WATSON,
                               NTR_METHOD_SIAD_CRITERIA,
                               NTR_METHOD_FURST, NTR_METHOD_RESTRICTION_OUTLOOK,
                               NTR_METHOD_SOLUTE_DOSE, NTR_METHOD_BALANCE_COURSE,
                               NTR_METHOD_EFW_BALANCE, NTR_METHOD_URINE_FEEDBACK,
                               NTR_METHOD_COURSE_FIT, NTR_METHOD_FIT_REPROJECT,
                               NTR_METHOD_PLAN_CHECK, NTR_METHOD_COURSE_WINDOWS,
                               NTR_METHOD_RELOWER};
    static struct patient_a p; /* static: the predicted courses are sizeable */
    a_introduce();
    a_panel_step(&p);
    a_tonicity_step(&p);
    a_severity_step(&p);
    a_body_water_step(&p);
    a_siad_step(&p);
    a_restriction_step(&p);
    a_solute_step(&p);
    a_limits_step(&p);
    a_bolus_step(&p);
    a_plan_step(&p);
    a_feedback_step(&p);
    a_fit_step(&p);
    a_watch_step(&p);
    a_relower_step(&p);
    a_rest_step(&p);
    a_chart_step(&p, chart_path);
    sources_step("A14. Where the main numbers come from", used,
                 sizeof used / sizeof used[0]);
    caution();
}

/* ======================================================================= */
/* Patient B: a high sodium, lowered                                        */
/* ======================================================================= */

#define B_SEX NTR_SEX_MALE
#define B_AGE_YEARS 79.0
#define B_HEIGHT_CM 172.0
#define B_WEIGHT_KG 70.0
#define B_NA_MMOL_L 162.0
#define B_K_MMOL_L 4.1
#define B_GLUCOSE_MMOL_L 7.2
#define B_UREA_MMOL_L 16.0
#define B_CREATININE_UMOL_L 130.0
#define B_MEASURED_OSM_MOSM_KG 350.0

/* Urine expected while the water is given (concentrated, little of it). */
#define B_URINE_ML_H 50.0
#define B_URINE_NA_MMOL_L 40.0
#define B_URINE_K_MMOL_L 30.0
#define B_PLAN_STEP_H 0.5
#define B_PLAN_POINTS 97 /* 48 h / 0.5 h + 1 */
#define B_FAST_HOURS 24.0
#define B_SLOW_HOURS 48.0

/* The invented measured series: the 48 h plan was started; by 16 h the
 * sodium had fallen faster than predicted and the infusion was slowed. */
static const ntr_sample b_measured[] = {
    {0.0, 162.0},  {4.0, 158.5},  {8.0, 155.0},  {12.0, 152.0}, {16.0, 150.5},
    {20.0, 150.5}, {24.0, 150.0}, {30.0, 149.0}, {36.0, 147.5}, {42.0, 146.0},
    {48.0, 144.5}, {60.0, 142.0}, {72.0, 140.0},
};
#define B_MEASURED_COUNT (sizeof b_measured / sizeof b_measured[0])
#define B_BEFORE_SLOWING 5

struct patient_b {
    double effective_osm, tbw_fraction_l, tbw_watson_l, deficit_l;
    named_limits limits;
    ntr_sample fast[B_PLAN_POINTS], slow[B_PLAN_POINTS];
    size_t n_fast, n_slow;
    watched series;
};

static void b_introduce(void)
{
    printf("\n######## Patient B: a high sodium, lowered ########\n\n");
    printf("Patient B (invented): man, %.0f years, %.0f cm, %.0f kg; from a care "
           "home, drowsy,\ndrinking little for a week; how long the sodium has been "
           "high is not known.\n", B_AGE_YEARS, B_HEIGHT_CM, B_WEIGHT_KG);
}

static void b_panel_step(struct patient_b *p)
{
    int tonicity;
    heading("B1. Laboratory panel and tonicity");
    printf("  sodium %.0f mmol/L, potassium %.1f mmol/L, glucose %.1f mmol/L, urea "
           "%.1f mmol/L,\n  creatinine %.0f umol/L; measured osmolality %.0f mOsm/kg\n",
           B_NA_MMOL_L, B_K_MMOL_L, B_GLUCOSE_MMOL_L, B_UREA_MMOL_L, B_CREATININE_UMOL_L,
           B_MEASURED_OSM_MOSM_KG);
    must(ntr_effective_osm_measured(B_NA_MMOL_L, B_GLUCOSE_MMOL_L, B_UREA_MMOL_L, 0.0,
                                    B_MEASURED_OSM_MOSM_KG, &p->effective_osm),
         "ntr_effective_osm_measured");
    must(ntr_tonicity_class(p->effective_osm, &tonicity), "ntr_tonicity_class");
    printf("  effective osmolality   measured - urea          %6.1f mOsm/kg\n",
           p->effective_osm);
    printf("  -> %s: the cells have lost water to the high\n     sodium.\n",
           tonicity == NTR_TONICITY_HYPERTONIC ? "hypertonic (above 295 mOsm/kg)"
                                               : "not hypertonic: recheck the panel");
}

static void b_water_step(struct patient_b *p)
{
    heading("B2. Body water and the water deficit");
    must(ntr_tbw_fraction(B_SEX, B_AGE_YEARS, B_WEIGHT_KG, &p->tbw_fraction_l),
         "ntr_tbw_fraction");
    must(ntr_tbw_watson(B_SEX, B_AGE_YEARS, B_HEIGHT_CM, B_WEIGHT_KG, &p->tbw_watson_l),
         "ntr_tbw_watson");
    must(ntr_free_water_deficit(p->tbw_fraction_l, B_NA_MMOL_L, &p->deficit_l),
         "ntr_free_water_deficit");
    printf("  fraction of weight (0.5 for a man of 65 or more):   %5.1f L\n",
           p->tbw_fraction_l);
    printf("  Watson anthropometric equation:                     %5.1f L\n",
           p->tbw_watson_l);
    printf("  water deficit  TBW x (Na / 140 - 1) = %.1f x (%.0f / 140 - 1) = %.1f L\n",
           p->tbw_fraction_l, B_NA_MMOL_L, p->deficit_l);
    printf("  -> the smaller body water predicts the larger fall; the deficit "
           "counts no\n     ongoing losses (urine, skin, breath), which come on "
           "top.\n");
}

static void b_limits_step(struct patient_b *p)
{
    heading("B3. Which limits apply?");
    must(ntr_course_limits_preset(NTR_COURSE_HYPER_CHRONIC, &p->limits.lim),
         "ntr_course_limits_preset");
    p->limits.name = "chronic high sodium";
    printf("  duration not known, so treated as chronic: the limits for lowering a "
           "chronic\n  high sodium, a fall of at most %.0f mmol/L in any 24 h",
           p->limits.lim.max_fall_24h);
    if (p->limits.lim.max_fall_48h > 0.0) {
        printf(" and %.0f in any 48 h", p->limits.lim.max_fall_48h);
    }
    printf(".\n  (A sodium known to have risen within hours may be lowered faster; "
           "the library\n  has limits for that case too.)\n");
}

/* Replace the deficit with 5% dextrose over the hours given, while the
 * expected urine runs. */
static size_t b_plan_flows(const struct patient_b *p, double hours, ntr_timed_flow flows[2])
{
    const ntr_timed_flow urine = {0.0, 0.0, -B_URINE_ML_H, B_URINE_NA_MMOL_L,
                                  B_URINE_K_MMOL_L, {0u, 0u}};
    ntr_timed_flow water = {0.0, 0.0, 0.0, 0.0, 0.0, {0u, 0u}};
    must(ntr_fluid_preset(NTR_FLUID_DEXTROSE_5, &water.na_mmol_l, &water.k_mmol_l),
         "ntr_fluid_preset");
    water.end_h = hours;
    water.rate_ml_h = p->deficit_l * 1000.0 / hours;
    flows[0] = water;
    flows[1] = urine;
    flows[1].end_h = hours;
    return 2u;
}

static void b_check_plan(struct patient_b *p, double hours, ntr_sample *course,
                         size_t *n_course)
{
    const ntr_sample now = {0.0, B_NA_MMOL_L};
    ntr_timed_flow flows[2];
    ntr_course_plan_result r;
    char label[200];
    const size_t n = b_plan_flows(p, hours, flows);
    r.struct_size = sizeof r;
    must(ntr_course_plan_check(&now, 1, p->tbw_fraction_l, flows, n, hours, B_PLAN_STEP_H,
                               &p->limits.lim, &r), "ntr_course_plan_check");
    must(ntr_balance_course(now.na_mmol_l, p->tbw_fraction_l, flows, n, hours,
                            B_PLAN_STEP_H, course, B_PLAN_POINTS, n_course),
         "ntr_balance_course");
    snprintf(label, sizeof label, "the deficit over %.0f h: 5%% dextrose %.0f mL/h, "
             "urine %.0f mL/h\n  (Na %.0f, K %.0f mmol/L):", hours, flows[0].rate_ml_h,
             B_URINE_ML_H, B_URINE_NA_MMOL_L, B_URINE_K_MMOL_L);
    report_plan(label, &r, now.na_mmol_l, hours);
}

static void b_plan_step(struct patient_b *p)
{
    heading("B4. Checking two water plans against the fall limit");
    printf("  (the fluid is the clinician's choice; these are two plans a team "
           "might write)\n");
    b_check_plan(p, B_FAST_HOURS, p->fast, &p->n_fast);
    b_check_plan(p, B_SLOW_HOURS, p->slow, &p->n_slow);
    printf("  -> both plans give the deficit but not the urine, so neither ends at "
           "140. The\n     prediction counts only the fluids listed; water by mouth "
           "or less urine than\n     expected makes the fall faster: measure sodium "
           "every few hours.\n");
}

static void b_watch_step(struct patient_b *p)
{
    heading("B5. Watching the measured series (the 48 h plan was started)");
    printf("  \"now\": each result against the %s limit (a fall of %.0f\n"
           "  mmol/L in 24 h), counted from the highest result of the 24 h (48 h) "
           "before it.\n  \"so far\": when the course first went over a limit, "
           "even if it is within now.\n", p->limits.name, p->limits.lim.max_fall_24h);
    watched_init(&p->series, b_measured, B_MEASURED_COUNT, &p->limits);
    watch_header(&p->limits.lim);
    watch_rows(&p->series, 0, B_BEFORE_SLOWING);
    if (p->series.last.flags & NTR_CF_FALL_OVER_24H) {
        printf("  -> too fast a fall: %.1f mmol/L in 24 h, over the limit by %.1f "
               "mmol/L. The\n     measured fall ran ahead of the prediction; the "
               "5%% dextrose is slowed.\n", p->series.last.max_fall_24h,
               p->series.last.excess_mmol_l);
    }
}

static void b_rest_step(struct patient_b *p)
{
    heading("B6. The rest of the course, still watched");
    watch_header(&p->limits.lim);
    watch_rows(&p->series, B_BEFORE_SLOWING, B_MEASURED_COUNT);
    watch_summary(&p->series);
}

static void b_chart_step(struct patient_b *p, const char *path)
{
    static band_points band;
    double m_hours[B_MEASURED_COUNT], m_na[B_MEASURED_COUNT];
    static double f_hours[B_PLAN_POINTS], f_na[B_PLAN_POINTS];
    static double s_hours[B_PLAN_POINTS], s_na[B_PLAN_POINTS];
    chart_line lines[2];
    char subtitle[200];
    chart_notes notes;
    chart c;

    heading("B7. Chart");
    split(b_measured, B_MEASURED_COUNT, m_hours, m_na);
    split(p->fast, p->n_fast, f_hours, f_na);
    split(p->slow, p->n_slow, s_hours, s_na);
    band_over(b_measured, B_MEASURED_COUNT, &p->limits.lim, 72.0, &band);
    lines[0].label = "Predicted: deficit in 24 h";
    lines[0].colour = "#d4780a";
    lines[0].hours = f_hours;
    lines[0].na_mmol_l = f_na;
    lines[0].n = p->n_fast;
    lines[1].label = "Predicted: deficit in 48 h";
    lines[1].colour = "#7a7a7a";
    lines[1].hours = s_hours;
    lines[1].na_mmol_l = s_na;
    lines[1].n = p->n_slow;
    snprintf(subtitle, sizeof subtitle, "Band: from the highest result of the past "
             "24 h down to %.0f mmol/L below it; limits for a chronic high sodium",
             p->limits.lim.max_fall_24h);
    c.title = "Patient B (invented): serum sodium, water plans, fall limit and results";
    c.subtitle = subtitle;
    c.caption = "Invented patient. Estimates for decision support, not orders: "
                "verify with measured values; follow local protocols and licensed "
                "clinical judgement.";
    c.hours_max = 72.0;
    c.na_min = 135.0;
    c.na_max = 165.0;
    c.band.label = "Fall allowed now";
    c.band.hours = band.hours;
    c.band.low_mmol_l = band.low;
    c.band.high_mmol_l = band.high;
    c.band.n = band.n;
    c.lines = lines;
    c.n_lines = 2;
    c.points.label = "Measured, within the limits";
    c.points.flagged_label = "Measured, over a limit";
    c.points.hours = m_hours;
    c.points.na_mmol_l = m_na;
    c.points.flagged = p->series.over_now;
    c.points.n = B_MEASURED_COUNT;
    notes_for(&p->series, &notes);
    c.notes = notes.lines;
    c.n_notes = 5;
    if (chart_save_svg(path, &c) != 0) {
        fprintf(stderr, "natremia-demo: could not write %s\n", path);
        exit(1);
    }
    printf("  measured sodium, both predicted courses and the fall the limit "
           "allows at each\n  moment written to ");
    print_full_path(path);
    printf("\n  (open it in any web browser); a diamond marks a result over the "
           "limit when it\n  was taken, as in the \"now\" column.\n");
}

static void patient_b(const char *chart_path)
{
    static const int used[] = {NTR_METHOD_EFFECTIVE_OSM_MEASURED, NTR_METHOD_TBW_FRACTION,
                               NTR_METHOD_FREE_WATER_DEFICIT,
                               NTR_METHOD_COURSE_HYPER_CHRONIC, NTR_METHOD_PLAN_CHECK,
                               NTR_METHOD_COURSE_WINDOWS};
    static struct patient_b p;
    b_introduce();
    b_panel_step(&p);
    b_water_step(&p);
    b_limits_step(&p);
    b_plan_step(&p);
    b_watch_step(&p);
    b_rest_step(&p);
    b_chart_step(&p, chart_path);
    sources_step("B8. Where the main numbers come from", used, sizeof used / sizeof used[0]);
    caution();
}

/* ======================================================================= */

/* The second chart's default name: the first with "-high-sodium" before
 * its ".svg" (or at its end). */
static void second_chart_name(const char *first, char *out, size_t size)
{
    size_t len = strlen(first);
    if (len >= 4 && strcmp(first + len - 4, ".svg") == 0) {
        snprintf(out, size, "%.*s-high-sodium.svg", (int)(len - 4), first);
    } else {
        snprintf(out, size, "%s-high-sodium.svg", first);
    }
}

int main(int argc, char **argv)
{
    char second[4096];
    const char *chart_a = "natremia-demo.svg";
    int st;
    cli c;

    if ((st = cli_start(&c, "natremia-demo", usage, argc, argv)) >= 0) return st;
    if (c.argc > 2) return cli_usage_error(&c, "expected at most two chart file names");
    if (c.argc >= 1) chart_a = c.argv[0];
    if (c.argc == 2) {
        snprintf(second, sizeof second, "%s", c.argv[1]);
    } else {
        second_chart_name(chart_a, second, sizeof second);
    }
    printf("natremia %s demo: two invented patients, start to finish\n",
           ntr_version_string());
    printf("The patients, every value and the courses below are invented for this "
           "demo.\n");
    caution();
    patient_a(chart_a);
    patient_b(second);
    return 0;
}
