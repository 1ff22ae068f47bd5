/* SPDX-License-Identifier: MIT */
/* Hand-written SVG for the demo's sodium chart (see svg_chart.h). */
#include "svg_chart.h"

#include <math.h>

/* Plot area inside the drawing, in pixels; the legend sits to the right. */
#define PLOT_LEFT 86.0
#define PLOT_RIGHT 660.0
#define PLOT_TOP 72.0
#define PLOT_BOTTOM 452.0
#define LEGEND_LEFT 684.0

#define COLOUR_AXIS "#333333"
#define COLOUR_GRID "#dddddd"
#define COLOUR_BAND "#7fbf8f"
#define COLOUR_POINT "#1f4e9c"
#define COLOUR_FLAG "#c0392b"

static double x_px(const chart *c, double hours)
{
    return PLOT_LEFT + (PLOT_RIGHT - PLOT_LEFT) * hours / c->hours_max;
}

static double y_px(const chart *c, double na)
{
    return PLOT_BOTTOM -
           (PLOT_BOTTOM - PLOT_TOP) * (na - c->na_min) / (c->na_max - c->na_min);
}

/* Labels come from the caller: escape the characters XML reserves. */
static void put_text(FILE *out, const char *s)
{
    for (; s != NULL && *s != '\0'; ++s) {
        switch (*s) {
        case '&': fputs("&amp;", out); break;
        case '<': fputs("&lt;", out); break;
        case '>': fputs("&gt;", out); break;
        default: fputc(*s, out); break;
        }
    }
}

static void text_at(FILE *out, double x, double y, const char *anchor,
                    const char *extra, const char *s)
{
    fprintf(out, "<text x=\"%.1f\" y=\"%.1f\" text-anchor=\"%s\"%s>", x, y,
            anchor, extra);
    put_text(out, s);
    fputs("</text>\n", out);
}

/* A tick step that gives five to twelve ticks over the range. */
static double tick_step(double span, const double *steps, size_t n)
{
    size_t i;
    for (i = 0; i < n; ++i) {
        if (span / steps[i] <= 12.0) {
            return steps[i];
        }
    }
    return steps[n - 1];
}

static void draw_axes(FILE *out, const chart *c)
{
    static const double hour_steps[] = {1, 2, 3, 6, 12, 24, 48};
    static const double na_steps[] = {1, 2, 5, 10, 20};
    double step, v;
    char label[32];

    step = tick_step(c->hours_max, hour_steps, 7);
    for (v = 0.0; v <= c->hours_max + 1e-9; v += step) {
        fprintf(out, "<line x1=\"%.1f\" y1=\"%.1f\" x2=\"%.1f\" y2=\"%.1f\" "
                "stroke=\"" COLOUR_GRID "\"/>\n",
                x_px(c, v), PLOT_TOP, x_px(c, v), PLOT_BOTTOM);
        snprintf(label, sizeof label, "%g", v);
        text_at(out, x_px(c, v), PLOT_BOTTOM + 20.0, "middle", "", label);
    }
    step = tick_step(c->na_max - c->na_min, na_steps, 5);
    for (v = ceil(c->na_min / step) * step; v <= c->na_max + 1e-9; v += step) {
        fprintf(out, "<line x1=\"%.1f\" y1=\"%.1f\" x2=\"%.1f\" y2=\"%.1f\" "
                "stroke=\"" COLOUR_GRID "\"/>\n",
                PLOT_LEFT, y_px(c, v), PLOT_RIGHT, y_px(c, v));
        snprintf(label, sizeof label, "%g", v);
        text_at(out, PLOT_LEFT - 8.0, y_px(c, v) + 5.0, "end", "", label);
    }
    fprintf(out, "<rect x=\"%.1f\" y=\"%.1f\" width=\"%.1f\" height=\"%.1f\" "
            "fill=\"none\" stroke=\"" COLOUR_AXIS "\"/>\n",
            PLOT_LEFT, PLOT_TOP, PLOT_RIGHT - PLOT_LEFT, PLOT_BOTTOM - PLOT_TOP);
    text_at(out, (PLOT_LEFT + PLOT_RIGHT) / 2.0, PLOT_BOTTOM + 46.0, "middle",
            "", "Time since the first sample (hours)");
    fprintf(out, "<text x=\"0\" y=\"0\" text-anchor=\"middle\" "
            "transform=\"translate(28 %.1f) rotate(-90)\">"
            "Serum sodium (mmol/L)</text>\n", (PLOT_TOP + PLOT_BOTTOM) / 2.0);
}

static void draw_band(FILE *out, const chart *c)
{
    const chart_band *b = &c->band;
    size_t i;
    if (b->n < 2) {
        return;
    }
    fputs("<polygon fill=\"" COLOUR_BAND "\" fill-opacity=\"0.35\" "
          "stroke=\"" COLOUR_BAND "\" points=\"", out);
    for (i = 0; i < b->n; ++i) {
        fprintf(out, "%.1f,%.1f ", x_px(c, b->hours[i]), y_px(c, b->high_mmol_l[i]));
    }
    for (i = b->n; i-- > 0;) {
        fprintf(out, "%.1f,%.1f ", x_px(c, b->hours[i]), y_px(c, b->low_mmol_l[i]));
    }
    fputs("\"/>\n", out);
}

static void draw_line(FILE *out, const chart *c, const chart_line *l)
{
    size_t i;
    fprintf(out, "<polyline fill=\"none\" stroke=\"%s\" stroke-width=\"2.5\" "
            "stroke-dasharray=\"8 5\" points=\"", l->colour);
    for (i = 0; i < l->n; ++i) {
        fprintf(out, "%.1f,%.1f ", x_px(c, l->hours[i]), y_px(c, l->na_mmol_l[i]));
    }
    fputs("\"/>\n", out);
}

static void dot(FILE *out, double x, double y)
{
    fprintf(out, "<circle cx=\"%.1f\" cy=\"%.1f\" r=\"5\" fill=\"" COLOUR_POINT
            "\"/>\n", x, y);
}

static void diamond(FILE *out, double x, double y)
{
    fprintf(out, "<polygon fill=\"" COLOUR_FLAG "\" points=\"%.1f,%.1f %.1f,%.1f "
            "%.1f,%.1f %.1f,%.1f\"/>\n",
            x, y - 8.0, x + 8.0, y, x, y + 8.0, x - 8.0, y);
}

static void draw_points(FILE *out, const chart *c)
{
    const chart_points *p = &c->points;
    size_t i;
    for (i = 0; i < p->n; ++i) {
        double x = x_px(c, p->hours[i]), y = y_px(c, p->na_mmol_l[i]);
        if (p->flagged != NULL && p->flagged[i]) {
            diamond(out, x, y);
        } else {
            dot(out, x, y);
        }
    }
}

static void draw_legend(FILE *out, const chart *c)
{
    double y = PLOT_TOP + 12.0;
    size_t i;
    fprintf(out, "<rect x=\"%.1f\" y=\"%.1f\" width=\"22\" height=\"14\" "
            "fill=\"" COLOUR_BAND "\" fill-opacity=\"0.35\" stroke=\"" COLOUR_BAND
            "\"/>\n", LEGEND_LEFT, y - 11.0);
    text_at(out, LEGEND_LEFT + 30.0, y + 1.0, "start", "", c->band.label);
    for (i = 0; i < c->n_lines; ++i) {
        y += 26.0;
        fprintf(out, "<line x1=\"%.1f\" y1=\"%.1f\" x2=\"%.1f\" y2=\"%.1f\" "
                "stroke=\"%s\" stroke-width=\"2.5\" stroke-dasharray=\"8 5\"/>\n",
                LEGEND_LEFT, y - 4.0, LEGEND_LEFT + 22.0, y - 4.0, c->lines[i].colour);
        text_at(out, LEGEND_LEFT + 30.0, y + 1.0, "start", "", c->lines[i].label);
    }
    y += 26.0;
    dot(out, LEGEND_LEFT + 11.0, y - 4.0);
    text_at(out, LEGEND_LEFT + 30.0, y + 1.0, "start", "", c->points.label);
    y += 26.0;
    diamond(out, LEGEND_LEFT + 11.0, y - 4.0);
    text_at(out, LEGEND_LEFT + 30.0, y + 1.0, "start", "", c->points.flagged_label);
    y += 18.0;
    for (i = 0; c->notes != NULL && i < c->n_notes; ++i) {
        y += 18.0;
        text_at(out, LEGEND_LEFT, y, "start", " font-size=\"13\"", c->notes[i]);
    }
}

int chart_write_svg(FILE *out, const chart *c)
{
    size_t i;
    if (!(c->hours_max > 0.0) || !(c->na_max > c->na_min)) {
        return -1;
    }
    fprintf(out, "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"
            "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"%d\" height=\"%d\" "
            "viewBox=\"0 0 %d %d\" font-family=\"sans-serif\" font-size=\"14\">\n",
            CHART_WIDTH_PX, CHART_HEIGHT_PX, CHART_WIDTH_PX, CHART_HEIGHT_PX);
    fputs("<rect width=\"100%\" height=\"100%\" fill=\"white\"/>\n", out);
    text_at(out, PLOT_LEFT, 32.0, "start", " font-size=\"18\" font-weight=\"bold\"",
            c->title);
    if (c->subtitle != NULL) {
        text_at(out, PLOT_LEFT, 54.0, "start", " font-size=\"13\" fill=\"#444444\"",
                c->subtitle);
    }
    draw_axes(out, c);
    /* Data outside the axis ranges is cut at the plot's edge (a little
     * margin keeps markers on the edge whole) instead of spilling over the
     * labels. */
    fprintf(out, "<clipPath id=\"plot-area\"><rect x=\"%.1f\" y=\"%.1f\" "
            "width=\"%.1f\" height=\"%.1f\"/></clipPath>\n"
            "<g clip-path=\"url(#plot-area)\">\n",
            PLOT_LEFT - 10.0, PLOT_TOP - 10.0, PLOT_RIGHT - PLOT_LEFT + 20.0,
            PLOT_BOTTOM - PLOT_TOP + 20.0);
    draw_band(out, c);
    for (i = 0; i < c->n_lines; ++i) {
        draw_line(out, c, &c->lines[i]);
    }
    draw_points(out, c);
    fputs("</g>\n", out);
    draw_legend(out, c);
    if (c->caption != NULL) {
        text_at(out, 16.0, CHART_HEIGHT_PX - 18.0, "start",
                " font-size=\"12\" fill=\"#555555\"", c->caption);
    }
    fputs("</svg>\n", out);
    return ferror(out) ? -1 : 0;
}

int chart_save_svg(const char *path, const chart *c)
{
    FILE *out = fopen(path, "w");
    int status;
    if (out == NULL) {
        return -1;
    }
    status = chart_write_svg(out, c);
    if (fclose(out) != 0) {
        status = -1;
    }
    return status;
}
