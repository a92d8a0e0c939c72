/* forecast.h - paddock growth forecast (growth stage, last step).
 *
 * Turns per-strip daily growth (pasture.c) into what the planner needs:
 * each paddock's growth rate by day and by week, as the area-weighted mix
 * of the array's strips (its share under the array) and open ground (the
 * rest), and, where several weather years exist, the 10th, 50th and 90th
 * percentile of each week's rate across the years.
 */
#ifndef FORECAST_H
#define FORECAST_H

#include <stddef.h>

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

#endif
