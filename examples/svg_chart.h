/* SPDX-License-Identifier: MIT */
/* A small, dependency-free SVG line chart for sodium over time.
 *
 * Example code, not part of the library: it uses stdio. It draws, on
 * hours (x) against serum sodium in mmol/L (y):
 *   - a shaded band (the sodium values the correction limits allow),
 *   - any number of predicted courses as dashed lines,
 *   - measured samples as dots, the flagged ones drawn as diamonds,
 * with labelled axes, a legend, short notes under the legend and a
 * caption line. */
#ifndef NTR_EXAMPLE_SVG_CHART_H
#define NTR_EXAMPLE_SVG_CHART_H

#include <stddef.h>
#include <stdio.h>

/* Chart size in CSS pixels; rsvg-convert renders it to this many pixels. */
#define CHART_WIDTH_PX 960
#define CHART_HEIGHT_PX 560

typedef struct chart_line {
    const char *label;   /* legend text */
    const char *colour;  /* any SVG colour, e.g. "#1f5f8b" */
    const double *hours;
    const double *na_mmol_l;
    size_t n;
} chart_line;

typedef struct chart_band {
    const char *label;
    const double *hours;        /* n points along the time axis */
    const double *low_mmol_l;   /* lower edge at each point */
    const double *high_mmol_l;  /* upper edge at each point */
    size_t n;
} chart_band;

typedef struct chart_points {
    const char *label;
    const char *flagged_label;   /* legend text for flagged samples */
    const double *hours;
    const double *na_mmol_l;
    const int *flagged;          /* may be NULL: nothing flagged */
    size_t n;
} chart_points;

typedef struct chart {
    const char *title;
    const char *subtitle;         /* one smaller line under the title; may be NULL */
    const char *caption;          /* one line under the plot; may be NULL */
    double hours_max;             /* x axis runs from 0 to this */
    double na_min, na_max;        /* y axis range, mmol/L */
    chart_band band;
    const chart_line *lines;
    size_t n_lines;
    chart_points points;
    const char *const *notes;     /* lines of text under the legend; may be NULL */
    size_t n_notes;
} chart;

/* Write the chart as a complete SVG document. Returns 0 on success, -1 if
 * the chart is malformed (empty axis range) or writing failed. */
int chart_write_svg(FILE *out, const chart *c);

/* Convenience: write to a file path. Returns 0 on success, -1 otherwise. */
int chart_save_svg(const char *path, const chart *c);

#endif
