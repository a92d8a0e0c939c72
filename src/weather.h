/* weather.h - hourly weather series read from CSV files (input stage).
 *
 * Each file named in the site file becomes one contiguous hourly series in
 * the weather file's own time base (site_location.utc_offset_h).  A row's
 * timestamp marks the start of its hour; irradiance, temperature, humidity
 * and wind are means over the hour, rain is the total.  Values are converted
 * to the units in the names (W/m2, deg C, %, mm, m/s, hPa) on reading.
 * Short gaps (up to site_weather.max_fill_h hours) are filled by linear
 * interpolation with no rain, and counted; anything else unexpected is an
 * error naming the file, line and column.
 */
#ifndef WEATHER_H
#define WEATHER_H

#include <stddef.h>
#include <stdint.h>

#include "diag.h"
#include "site.h"

typedef struct wx_series {
    char path[SITE_PATH_LEN];
    int64_t t0_h;          /* hour number (tcal.h) of the first row */
    size_t n;              /* hours */
    double *v[WX_NCOLS];   /* v[col][hour]; v[WX_TIME] is unused (NULL);
                              optional columns absent from the file are NULL */
    size_t n_filled;       /* hours made up by gap filling */
} wx_series;

typedef struct wx_set {
    int n;
    wx_series *s;          /* sorted by start, never overlapping */
} wx_set;

/* Reads one CSV text (already in memory; name is used in messages). */
int wx_parse(const site_weather *cfg, const char *name, const char *text,
             size_t len, wx_series *out, rg_err *err);

/* Reads one daily CSV text (docs/inputs.md: date, tmin_c, tmax_c, rain_mm,
 * wind_m_s, optional rs_mj_m2_d, rh_mean_pct, tdew_c; every day, in
 * order) and makes it hourly with wxdaily.c at cfg->loc, spreading rain by
 * cfg->rain_rule. */
int wx_parse_daily(const site_weather *cfg, const char *name, const char *text,
                   size_t len, wx_series *out, rg_err *err);

/* Reads every file of cfg (daily or hourly as cfg->daily says).  Returns 0, or -1 with one message line. */
int wx_load(const site_weather *cfg, wx_set *out, rg_err *err);

/* Copies in into out, joining each run of series that follow one another
 * hour for hour (the next starts at the hour after the last one ends) and
 * carry the same columns into one series, so a run can cross from one
 * weather file into the next (e.g. a season over the new year).  A joined
 * series takes the first file's path.  Returns 0, or -1 with a message
 * (out of memory; then out is empty). */
int wx_join(const wx_set *in, wx_set *out, rg_err *err);

void wx_series_free(wx_series *s);
void wx_free(wx_set *w);

#endif
