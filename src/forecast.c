/* forecast.c - paddock growth by day and week, percentiles across years.
 *
 * For each weather year: the microclimate once (one array geometry), then
 * soil water and growth once per distinct soil x sward pair (pasture.c),
 * then each paddock's daily growth as the mix of its pair's strips and
 * open ground (fc_paddock_day).  Weeks run from the season's first day in
 * 7-day steps; across years each week gets percentiles of its mean daily
 * growth (fc_percentile).  A season over the new year runs each year on
 * into the next one's weather (fc_build joins the files first). */
#include "forecast.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "micro.h"
#include "pasture.h"
#include "tcal.h"

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

int64_t fc_run_start_day(double lat_deg, int64_t d0)
{
    int y, m, d;
    tcal_civil(d0, &y, &m, &d);
    if (!(lat_deg < 0.0))
        return tcal_days(y, 1, 1);
    return m >= 7 ? tcal_days(y, 7, 1) : tcal_days(y - 1, 7, 1);
}

/* ---- the weekly table ---------------------------------------------------- */

void fc_table_free(fc_table *f)
{
    free(f->years);
    free(f->week_start);
    free(f->week_days);
    free(f->rate);
    free(f->season);
    memset(f, 0, sizeof *f);
}

/* Whether the season runs over the new year (its last month-day comes
 * before its first). */
static int wraps(const fc_season *o)
{
    return o->to_md < o->from_md;
}

/* Days [*d0, *d1) of series w inside the season that starts in calendar
 * year y (and ends in y + 1 when it wraps). */
static int season_days(const wx_series *w, int y, const fc_season *o, int64_t *d0, int64_t *d1)
{
    int64_t first = tcal_days(y, o->from_md / 100, o->from_md % 100);
    int64_t last = tcal_days(y + wraps(o), o->to_md / 100, o->to_md % 100);
    int64_t s0 = (w->t0_h + 23) / 24, s1 = (w->t0_h + (int64_t)w->n) / 24;
    if (first < s0 || last + 1 > s1)
        return 0; /* the season is not wholly inside this series */
    *d0 = first;
    *d1 = last + 1;
    return 1;
}

/* ---- running the stages ------------------------------------------------- */

typedef struct pair {
    int soil, sward;
} pair;

static int find_pairs(const site *s, pair *pairs, int *pair_of)
{
    int n = 0;
    for (int i = 0; i < s->n_paddocks; i++) {
        int k = 0;
        while (k < n && !(pairs[k].soil == s->paddocks[i].soil && pairs[k].sward == s->paddocks[i].sward))
            k++;
        if (k == n)
            pairs[n++] = (pair){s->paddocks[i].soil, s->paddocks[i].sward};
        pair_of[i] = k;
    }
    return n;
}

/* One season of one series: fills column year of f.  The run starts on
 * the midwinter day before the season (fc_run_start_day; or the series'
 * first whole day, if later), with the soil at field capacity and the
 * sward at its residual, so the season opens with the soil water and
 * cover that the months before it have left. */
static int run_year(const site *s, const mc_config *mc, const wx_series *w, int64_t d0, int64_t d1,
                    const pair *pairs, int n_pairs, const int *pair_of, fc_table *f, int year,
                    rg_err *err)
{
    mc_result m;
    int64_t start = fc_run_start_day(s->loc.latitude_deg, d0), first_whole = (w->t0_h + 23) / 24;
    if (start < first_whole)
        start = first_whole;
    size_t skip = (size_t)(d0 - start);
    size_t from = (size_t)(start * 24 - w->t0_h), n = (size_t)((d1 - start) * 24);
    if (mc_run(mc, w, from, n, &m, err) < 0)
        return -1;
    ps_result *ps = calloc((size_t)n_pairs, sizeof *ps);
    int rc = ps ? 0 : rg_fail(err, "out of memory");
    int done = 0;
    for (int k = 0; rc == 0 && k < n_pairs; k++, done++) {
        ps_config pc;
        rc = ps_config_make(s, pairs[k].soil, pairs[k].sward, &pc, err);
        if (rc == 0)
            rc = ps_run(&pc, &m, w, &ps[k], err);
    }
    for (int i = 0; rc == 0 && i < s->n_paddocks; i++) {
        const ps_result *p = &ps[pair_of[i]];
        double share = s->paddocks[i].array_share, total = 0;
        for (int wk = 0; wk < f->n_weeks; wk++) {
            double sum = 0;
            for (int d = 0; d < f->week_days[wk]; d++) {
                size_t day = skip + (size_t)(wk * 7 + d);
                const double *row = p->growth + day * (size_t)p->n_cols;
                sum += fc_paddock_day(row, p->n_cols - 1, row[p->n_cols - 1], share);
            }
            f->rate[((size_t)i * f->n_weeks + wk) * f->n_years + year] = sum / f->week_days[wk];
            total += sum;
        }
        f->season[(size_t)i * f->n_years + year] = total;
    }
    for (int k = 0; k < done && ps; k++)
        ps_free(&ps[k]);
    free(ps);
    mc_free(&m);
    return rc;
}

static int build(const site *s, const wx_set *wx, const fc_season *o, fc_table *f, rg_err *err);

/* A season over the new year needs each year's run to go on into the next
 * year's weather file, and a run south of the equator starts in the July
 * before (fc_run_start_day), often in the previous file: join the files
 * that follow one another first. */
int fc_build(const site *s, const wx_set *wx, const fc_season *o, fc_table *f, rg_err *err)
{
    if (!wraps(o) && !(s->loc.latitude_deg < 0.0))
        return build(s, wx, o, f, err);
    memset(f, 0, sizeof *f);
    wx_set joined;
    if (wx_join(wx, &joined, err) < 0)
        return RG_EXIT_RUNTIME;
    int rc = build(s, &joined, o, f, err);
    wx_free(&joined);
    return rc;
}

static int build(const site *s, const wx_set *wx, const fc_season *o, fc_table *f, rg_err *err)
{
    memset(f, 0, sizeof *f);
    int64_t d0[SITE_MAX_FILES * 2], d1[SITE_MAX_FILES * 2];
    int idx[SITE_MAX_FILES * 2], n = 0;
    for (int j = 0; j < wx->n; j++) {
        int y0, y1, m, d;
        tcal_civil(tcal_hour_day(wx->s[j].t0_h), &y0, &m, &d);
        tcal_civil(tcal_hour_day(wx->s[j].t0_h + (int64_t)wx->s[j].n - 1), &y1, &m, &d);
        for (int y = y0; y <= y1 && n < SITE_MAX_FILES * 2; y++) {
            if (o->year && y != o->year)
                continue;
            if (season_days(&wx->s[j], y, o, &d0[n], &d1[n]))
                idx[n++] = j;
        }
    }
    if (n == 0)
        return rg_fail(err, "%s: no weather %s covers the whole season %02d-%02d to %02d-%02d%s",
                       s->path, wraps(o) ? "file, or files that follow one another," : "year",
                       o->from_md / 100, o->from_md % 100, o->to_md / 100, o->to_md % 100,
                       o->year ? " in the year asked for" : ""), RG_EXIT_INPUT;
    int days = (int)(d1[0] - d0[0]);
    for (int k = 1; k < n; k++) /* leap years: every year uses the shortest length */
        if ((int)(d1[k] - d0[k]) < days)
            days = (int)(d1[k] - d0[k]);
    f->n_paddocks = s->n_paddocks;
    f->n_years = n;
    f->n_weeks = (days + 6) / 7;
    f->years = calloc((size_t)n, sizeof *f->years);
    f->week_start = calloc((size_t)f->n_weeks, sizeof *f->week_start);
    f->week_days = calloc((size_t)f->n_weeks, sizeof *f->week_days);
    f->rate = calloc((size_t)f->n_paddocks * f->n_weeks * n, sizeof *f->rate);
    f->season = calloc((size_t)f->n_paddocks * n, sizeof *f->season);
    pair *pairs = calloc((size_t)s->n_paddocks, sizeof *pairs);
    int *pair_of = calloc((size_t)s->n_paddocks, sizeof *pair_of);
    if (!f->years || !f->week_start || !f->week_days || !f->rate || !f->season || !pairs || !pair_of) {
        free(pairs);
        free(pair_of);
        return rg_fail(err, "out of memory"), RG_EXIT_RUNTIME;
    }
    for (int wk = 0; wk < f->n_weeks; wk++) {
        f->week_start[wk] = d0[0] + 7 * wk;
        f->week_days[wk] = wk * 7 + 7 <= days ? 7 : days - wk * 7;
    }
    int n_pairs = find_pairs(s, pairs, pair_of);
    mc_config mc;
    int rc = mc_config_from_site(s, &mc, err) < 0 ? RG_EXIT_RUNTIME : RG_EXIT_OK;
    for (int k = 0; rc == RG_EXIT_OK && k < n; k++) {
        int y, m, d;
        tcal_civil(d0[k], &y, &m, &d);
        f->years[k] = y;
        if (run_year(s, &mc, &wx->s[idx[k]], d0[k], d0[k] + days, pairs, n_pairs, pair_of, f, k,
                     err) < 0)
            rc = RG_EXIT_RUNTIME;
    }
    mc_config_free(&mc);
    free(pairs);
    free(pair_of);
    return rc;
}


/* The p-th percentile across years of paddock i, week wk (or the season
 * total when wk < 0). */
double fc_rate_pct(const fc_table *f, int i, int wk, double p)
{
    double v[SITE_MAX_FILES * 2];
    for (int y = 0; y < f->n_years; y++)
        v[y] = wk < 0 ? f->season[(size_t)i * f->n_years + y]
                      : f->rate[((size_t)i * f->n_weeks + wk) * f->n_years + y];
    return fc_percentile(v, f->n_years, p);
}

