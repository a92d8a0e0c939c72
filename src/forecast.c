/* forecast.c - paddock growth by day and week, percentiles across years.
 * See forecast.h; the weekly tables themselves are built by cmd_growth.c. */
#include "forecast.h"

#include <math.h>
#include <stdlib.h>

double fc_paddock_day(const double *strip_growth, int n, double open_growth,
                      double array_share)
{
    double sum = 0;
    for (int i = 0; i < n; i++)
        sum += strip_growth[i];
    double array = n > 0 ? sum / n : 0;
    return array_share * array + (1.0 - array_share) * open_growth;
}

static int by_value(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return (x > y) - (x < y);
}

double fc_percentile(double *x, int n, double p)
{
    if (n < 1)
        return (double)NAN;
    qsort(x, (size_t)n, sizeof *x, by_value);
    /* Hyndman & Fan (1996) definition 7: h = (n - 1) p + 1 (1-based),
     * Q = x[floor h] + (h - floor h)(x[floor h + 1] - x[floor h]) */
    double h = (n - 1) * p / 100.0;
    int lo = (int)floor(h);
    if (lo >= n - 1)
        return x[n - 1];
    return x[lo] + (h - lo) * (x[lo + 1] - x[lo]);
}
