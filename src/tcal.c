/* tcal.c - civil-date arithmetic (proleptic Gregorian, no time zones).
 *
 * Day numbers follow the well-known "days from civil" construction: shift
 * the year to start in March so the leap day falls last, then count 400-year
 * eras of 146097 days.  Every conversion is exact integer arithmetic.
 */
#include "tcal.h"

#include <stdio.h>
#include <string.h>

int64_t tcal_days(int year, int month, int day)
{
    int64_t y = (int64_t)year - (month <= 2);
    int64_t era = (y >= 0 ? y : y - 399) / 400;
    int64_t yoe = y - era * 400;
    int64_t mp = (month + 9) % 12;
    int64_t doy = (153 * mp + 2) / 5 + day - 1;
    int64_t doe = yoe * 365 + yoe / 4 - yoe / 100 + doy;
    return era * 146097 + doe - 719468;
}

void tcal_civil(int64_t days, int *year, int *month, int *day)
{
    int64_t z = days + 719468;
    int64_t era = (z >= 0 ? z : z - 146096) / 146097;
    int64_t doe = z - era * 146097;
    int64_t yoe = (doe - doe / 1460 + doe / 36524 - doe / 146096) / 365;
    int64_t doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
    int64_t mp = (5 * doy + 2) / 153;
    int64_t d = doy - (153 * mp + 2) / 5 + 1;
    int64_t m = mp < 10 ? mp + 3 : mp - 9;
    *year = (int)(yoe + era * 400 + (m <= 2));
    *month = (int)m;
    *day = (int)d;
}

static int days_in_month(int year, int month)
{
    static const int n[12] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
    int leap = (year % 4 == 0 && year % 100 != 0) || year % 400 == 0;
    return month == 2 ? 28 + leap : n[month - 1];
}

int tcal_valid_date(int year, int month, int day)
{
    if (year < 1900 || year > 2200 || month < 1 || month > 12 || day < 1)
        return 0;
    return day <= days_in_month(year, month);
}

/* Reads exactly n decimal digits from s; -1 when any is not a digit. */
static int digits(const char *s, int n)
{
    int v = 0;
    for (int i = 0; i < n; i++) {
        if (s[i] < '0' || s[i] > '9')
            return -1;
        v = v * 10 + (s[i] - '0');
    }
    return v;
}

static int parse_ymd(const char *s, int *y, int *m, int *d)
{
    if (s[4] != '-' || s[7] != '-')
        return -1;
    *y = digits(s, 4);
    *m = digits(s + 5, 2);
    *d = digits(s + 8, 2);
    if (*y < 0 || *m < 0 || *d < 0 || !tcal_valid_date(*y, *m, *d))
        return -1;
    return 0;
}

int tcal_parse_date(const char *s, int64_t *days)
{
    int y, m, d;
    if (strlen(s) != 10 || parse_ymd(s, &y, &m, &d) < 0)
        return -1;
    *days = tcal_days(y, m, d);
    return 0;
}

int tcal_parse_hour(const char *s, int64_t *hours)
{
    size_t len = strlen(s);
    int y, m, d;
    if ((len != 16 && len != 19) || parse_ymd(s, &y, &m, &d) < 0)
        return -1;
    if ((s[10] != 'T' && s[10] != ' ') || s[13] != ':')
        return -1;
    int hh = digits(s + 11, 2), mm = digits(s + 14, 2);
    if (hh < 0 || hh > 23 || mm != 0)
        return -1;
    if (len == 19 && (s[16] != ':' || digits(s + 17, 2) != 0))
        return -1;
    *hours = tcal_days(y, m, d) * 24 + hh;
    return 0;
}

void tcal_format_date(int64_t days, char *buf)
{
    int y, m, d;
    tcal_civil(days, &y, &m, &d);
    /* written digit by digit: the formats' widths are exact here, and the
     * compiler cannot prove that snprintf would not truncate */
    unsigned v[3] = {(unsigned)(y % 10000 + 10000) % 10000, (unsigned)m, (unsigned)d};
    buf[0] = (char)('0' + v[0] / 1000);
    buf[1] = (char)('0' + v[0] / 100 % 10);
    buf[2] = (char)('0' + v[0] / 10 % 10);
    buf[3] = (char)('0' + v[0] % 10);
    buf[4] = buf[7] = '-';
    buf[5] = (char)('0' + v[1] / 10);
    buf[6] = (char)('0' + v[1] % 10);
    buf[8] = (char)('0' + v[2] / 10);
    buf[9] = (char)('0' + v[2] % 10);
    buf[10] = '\0';
}

int64_t tcal_hour_day(int64_t hours)
{
    return hours >= 0 ? hours / 24 : -((-hours + 23) / 24);
}

void tcal_format_hour(int64_t hours, char *buf)
{
    int64_t day = tcal_hour_day(hours);
    char date[11];
    tcal_format_date(day, date);
    int hh = (int)(hours - day * 24);
    memcpy(buf, date, 10);
    buf[10] = 'T';
    buf[11] = (char)('0' + hh / 10);
    buf[12] = (char)('0' + hh % 10);
    memcpy(buf + 13, ":00", 4);
}

int tcal_day_of_year(int64_t days)
{
    int y, m, d;
    tcal_civil(days, &y, &m, &d);
    return (int)(days - tcal_days(y, 1, 1)) + 1;
}
