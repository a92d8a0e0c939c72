/* tcal.h - calendar arithmetic on civil dates and hours (no time zones).
 *
 * rowgraze keeps every timestamp in the weather file's own time base (a fixed
 * offset from UTC given in the site file, no daylight saving), counted as
 * whole hours or days since 1970-01-01 00:00 of that base.  Day numbers use
 * the proleptic Gregorian calendar.
 */
#ifndef TCAL_H
#define TCAL_H

#include <stdint.h>

/* Days since 1970-01-01 for a civil date (any month/day, no checking). */
int64_t tcal_days(int year, int month, int day);

/* The civil date of a day number. */
void tcal_civil(int64_t days, int *year, int *month, int *day);

/* 1 when y/m/d is a real date between years 1900 and 2200, else 0. */
int tcal_valid_date(int year, int month, int day);

/* Parses "YYYY-MM-DD" (whole string).  Returns 0 and the day number, or -1. */
int tcal_parse_date(const char *s, int64_t *days);

/* Parses "YYYY-MM-DDTHH:MM[:SS]" or with a space for 'T' (whole string, no
 * zone suffix; seconds must be 00).  Returns 0 and the hour number, or -1. */
int tcal_parse_hour(const char *s, int64_t *hours);

/* Writes "YYYY-MM-DD" (buf >= 11 bytes). */
void tcal_format_date(int64_t days, char *buf);

/* Writes "YYYY-MM-DDTHH:00" (buf >= 17 bytes). */
void tcal_format_hour(int64_t hours, char *buf);

/* Day of the year, 1..366, of a day number. */
int tcal_day_of_year(int64_t days);

/* Floor division of hours into days (works for negative hours too). */
int64_t tcal_hour_day(int64_t hours);

#endif
