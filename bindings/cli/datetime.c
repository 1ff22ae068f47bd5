/* SPDX-License-Identifier: MIT */
/* ISO 8601 date-times with a zone, to seconds since 1970-01-01T00:00Z
 * (course_cli.h). Only the calendar forms a laboratory feed writes. */
#include "course_cli.h"

#include <string.h>

/* Read exactly n digits at *p; -1 if any is not a digit. */
static long digits(const char **p, int n)
{
    long v = 0;
    int i;
    for (i = 0; i < n; ++i) {
        char c = (*p)[i];
        if (c < '0' || c > '9') return -1;
        v = v * 10 + (c - '0');
    }
    *p += n;
    return v;
}

static int leap_year(long y)
{
    return (y % 4 == 0 && y % 100 != 0) || y % 400 == 0;
}

static long days_in_month(long y, long m)
{
    static const long days[12] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
    return m == 2 && leap_year(y) ? 29 : days[m - 1];
}

/* Days from 1970-01-01 to y-m-d in the proleptic Gregorian calendar:
 * whole years counted through 400-year cycles of 146097 days, with the
 * year taken to start in March so that the leap day falls last. */
static long long days_since_epoch(long y, long m, long d)
{
    long long yy = (long long)y - (m <= 2);
    long long era = (yy >= 0 ? yy : yy - 399) / 400;
    long long year_of_era = yy - era * 400;
    long long month_from_march = (m + 9) % 12;
    long long day_of_year = (153 * month_from_march + 2) / 5 + d - 1;
    long long day_of_era = year_of_era * 365 + year_of_era / 4 - year_of_era / 100 + day_of_year;
    return era * 146097 + day_of_era - 719468;
}

int nc_parse_datetime(const char *text, nc_instant *out, const char **why)
{
    const char *p = text;
    long y, mo, d, h, mi, s = 0, oh, om;
    double frac = 0.0, scale = 0.1;
    long long offset_s = 0;
    int sign;

    if ((y = digits(&p, 4)) < 0 || *p++ != '-' || (mo = digits(&p, 2)) < 0 ||
        *p++ != '-' || (d = digits(&p, 2)) < 0) {
        *why = "not a date-time YYYY-MM-DDThh:mm[:ss]+hh:mm";
        return -1;
    }
    if (mo < 1 || mo > 12 || d < 1 || d > days_in_month(y, mo)) {
        *why = "no such calendar date";
        return -1;
    }
    if (*p == '\0') {
        *why = "a date without a time of day is too coarse for a sodium course";
        return -1;
    }
    if ((*p != 'T' && *p != 't' && *p != ' ') || (++p, (h = digits(&p, 2)) < 0) ||
        *p++ != ':' || (mi = digits(&p, 2)) < 0) {
        *why = "not a date-time YYYY-MM-DDThh:mm[:ss]+hh:mm";
        return -1;
    }
    if (*p == ':') {
        ++p;
        if ((s = digits(&p, 2)) < 0) {
            *why = "seconds are not two digits";
            return -1;
        }
        if (*p == '.' || *p == ',') {
            ++p;
            if (*p < '0' || *p > '9') {
                *why = "no digits after the decimal point of the seconds";
                return -1;
            }
            for (; *p >= '0' && *p <= '9'; ++p, scale /= 10.0) frac += (*p - '0') * scale;
        }
    }
    if (h > 23 || mi > 59 || s > 59) {
        *why = "no such time of day (hours 00-23, minutes and seconds 00-59)";
        return -1;
    }
    if (*p == 'Z' || *p == 'z') {
        ++p;
    } else if (*p == '+' || *p == '-') {
        sign = *p++ == '-' ? -1 : 1;
        oh = digits(&p, 2);
        if (*p == ':') ++p;
        om = digits(&p, 2);
        if (oh < 0 || om < 0 || oh > 14 || om > 59) {
            *why = "the zone offset is not +hh:mm or -hh:mm";
            return -1;
        }
        offset_s = sign * (oh * 3600LL + om * 60LL);
    } else if (*p == '\0') {
        *why = "no zone (Z or +hh:mm): a clock change would shift the time";
        return -1;
    }
    if (*p != '\0') {
        *why = "text after the date-time";
        return -1;
    }
    /* frac < 1 by construction (at most 0.999... of the digits read) */
    out->sec = days_since_epoch(y, mo, d) * 86400LL + h * 3600LL + mi * 60LL + s - offset_s;
    out->frac = frac < 1.0 ? frac : 0.0;
    return 0;
}

double nc_hours_between(nc_instant from, nc_instant to)
{
    return ((double)(to.sec - from.sec) + (to.frac - from.frac)) / 3600.0;
}
