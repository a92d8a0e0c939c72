/* forecast.h - paddock growth forecast (growth stage, last step).
 *
 * Turns per-strip daily growth (pasture.c) into what the planner needs:
 * each paddock's growth rate by day and by week, as the area-weighted mix
 * of the array's strips (its share under the array) and open ground (the
 * rest), and, where several weather years exist, the 10th, 50th and 90th
 * percentile of each week's rate across the years.  fc_build runs the
 * microclimate (micro.c) and growth (pasture.c) stages to get there.
 */
#ifndef FORECAST_H
#define FORECAST_H

#include <stddef.h>
#include <stdint.h>

#include "diag.h"
#include "site.h"
#include "weather.h"

/* Growth of a paddock on one day, kg DM/ha/day: array_share times the mean
 * of the n strips' growth (strips are equal widths, so the mean is the
 * area-weighted mean over the pitch) plus (1 - array_share) times the open
 * ground's growth. */
double fc_paddock_day(const double *strip_growth, int n, double open_growth,
                      double array_share);

/* The p-th percentile (0 <= p <= 100) of x[0..n-1], by linear interpolation
 * between order statistics (Hyndman & Fan 1996, Am. Stat. 50:361-365,
 * definition 7).  Sorts x in place.  NaN when n < 1. */
double fc_percentile(double *x, int n, double p);


/* The first day of a growth run for a season that starts on day d0; the
 * run starts with the soil at field capacity and the sward at its
 * residual, so it starts in the midwinter before d0, when the soil is
 * usually wet and the sward grows least, so that a wrong guess costs
 * least growth (common practice, no source): 1 January of d0's year at a
 * latitude >= 0, the latest 1 July on or before d0 south of the equator.
 * Where the weather does not reach back that far, runs start on the
 * weather's first whole day instead. */
int64_t fc_run_start_day(double lat_deg, int64_t d0);

/* A season: month-days in every year used (month * 100 + day), or one
 * year only.  to_md before from_md means the season runs over the new
 * year, from from_md of each year to to_md of the next. */
typedef struct fc_season {
    int from_md, to_md;
    int year;                /* 0: every weather year that covers the season;
                                else the year the season starts in */
} fc_season;

/* Weekly growth of every paddock across weather years. */
typedef struct fc_table {
    int n_paddocks, n_weeks, n_years;
    int *years;              /* [year] calendar year of each run */
    int64_t *week_start;     /* [week] day number in the first year used */
    int *week_days;          /* [week] days in the week */
    double *rate;            /* [(paddock * n_weeks + week) * n_years + year] kg DM/ha/day */
    double *season;          /* [paddock * n_years + year] kg DM/ha over the season */
} fc_table;

/* Runs the microclimate and growth stages for every weather year that
 * covers the season (each year from 1 January, so the season opens with
 * the soil water and cover the year so far has left) and fills f.  A
 * season over the new year runs on into the next year's weather, across
 * files that follow one another hour for hour (wx_join), so only years
 * with a next year in the weather count; f->years holds the years the
 * seasons start in.  Cost grows with years x soil-sward pairs, not with
 * paddocks.  Returns
 * RG_EXIT_OK, RG_EXIT_INPUT (no year covers the season) or RG_EXIT_RUNTIME
 * with a message. */
int fc_build(const site *s, const wx_set *wx, const fc_season *season, fc_table *f,
             rg_err *err);

/* The p-th percentile across years of paddock i's mean daily growth in
 * week wk, or of its season total when wk < 0. */
double fc_rate_pct(const fc_table *f, int i, int wk, double p);

void fc_table_free(fc_table *f);

#endif
