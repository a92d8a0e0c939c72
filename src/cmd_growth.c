/* cmd_growth.c - `rowgraze growth`: the paddock growth forecast, by week
 * (output stage for the growth stage).
 *
 * For each weather year: the microclimate once (one array geometry), then
 * soil water and growth once per distinct soil x sward pair (pasture.c),
 * then each paddock's daily growth as the mix of its pair's strips and
 * open ground (forecast.c).  Weeks run from --from (default 1 January)
 * in 7-day steps to --to (default 31 December), on the same month-days in
 * every year used; across years each week gets the 10th, 50th and 90th
 * percentile of its mean daily growth.  Cost grows with the number of
 * years and soil x sward pairs, not with the number of paddocks.
 */
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cli.h"
#include "diag.h"
#include "forecast.h"
#include "micro.h"
#include "pasture.h"
#include "site.h"
#include "tcal.h"
#include "textfile.h"
#include "weather.h"

enum fmt { FMT_TABLE, FMT_CSV, FMT_JSON };

typedef struct growth_opts {
    const char *models, *out_path, *site_path;
    int from_md, to_md;      /* month * 100 + day */
    int year;                /* 0 = all years */
    int format;
} growth_opts;

static void help(void)
{
    puts("usage: rowgraze growth [OPTIONS] SITE.json\n\n"
         "Forecast growth of every paddock by week: the strips across the row and the\n"
         "open ground, hour by hour (light, rain, leaf temperature and VPD, soil water),\n"
         "mixed by each paddock's share under the array.  With several weather years,\n"
         "each week shows the 10th, 50th and 90th percentile across the years.\n\n"
         "Options:\n"
         "  --from DATE        first day of the season (YYYY-MM-DD; its month and day\n"
         "                     are used in every year), default 1 January\n"
         "  --to DATE          last day of the season, default 31 December\n"
         "  --years all|YYYY   every weather year (default) or one\n"
         "  --format FORMAT    table (default), csv or json\n"
         "  --out FILE         write to FILE (atomically) instead of stdout\n"
         "  --models DIR       sward parameter sets\n"
         "  -h, --help         show this help\n\n"
         "Growth is new dry matter (before senescence) in kg DM/ha/day; the table\n"
         "also gives the median as sward height gained, cm per week.\n"
         "Exit status: 0 ok, 1 runtime failure, 2 bad input or usage.");
}

static int month_day(const char *text, const char *opt, int *md)
{
    int64_t day;
    if (tcal_parse_date(text, &day) < 0)
        return cli_usage_error("growth", "growth: %s: expected a date YYYY-MM-DD, found \"%s\"", opt, text), -1;
    int y, m, d;
    tcal_civil(day, &y, &m, &d);
    if (m == 2 && d == 29)
        return cli_usage_error("growth", "growth: %s: expected a day that every year has, found 29 February", opt), -1;
    *md = m * 100 + d;
    return 0;
}

static int parse_opts(int argc, char **argv, growth_opts *o)
{
    static const struct option opts[] = {
        {"from", required_argument, 0, 'f'}, {"to", required_argument, 0, 't'},
        {"years", required_argument, 0, 'y'}, {"format", required_argument, 0, 'F'},
        {"out", required_argument, 0, 'o'}, {"models", required_argument, 0, 'm'},
        {"help", no_argument, 0, 'h'}, {0, 0, 0, 0}};
    *o = (growth_opts){.from_md = 101, .to_md = 1231};
    int ch;
    optind = 1;
    opterr = 0;
    while ((ch = getopt_long(argc, argv, "h", opts, NULL)) != -1) {
        switch (ch) {
        case 'h': help(); return 1;
        case 'f': if (month_day(optarg, "--from", &o->from_md) < 0) return -1; break;
        case 't': if (month_day(optarg, "--to", &o->to_md) < 0) return -1; break;
        case 'o': o->out_path = optarg; break;
        case 'm': o->models = optarg; break;
        case 'y': {
            char *end;
            long y = strtol(optarg, &end, 10);
            if (strcmp(optarg, "all") == 0)
                o->year = 0;
            else if (*end || y < 1900 || y > 2200)
                return cli_usage_error("growth", "growth: --years: expected all or a year YYYY, found \"%s\"", optarg), -1;
            else
                o->year = (int)y;
            break;
        }
        case 'F':
            if (strcmp(optarg, "table") == 0) o->format = FMT_TABLE;
            else if (strcmp(optarg, "csv") == 0) o->format = FMT_CSV;
            else if (strcmp(optarg, "json") == 0) o->format = FMT_JSON;
            else return cli_usage_error("growth", "growth: --format: expected table, csv or json, found \"%s\"", optarg), -1;
            break;
        default:
            return cli_usage_error("growth", "growth: unknown option or missing value: '%s'", argv[optind - 1]), -1;
        }
    }
    if (argc - optind != 1)
        return cli_usage_error("growth", "growth: expected one site file, found %d arguments", argc - optind), -1;
    if (o->to_md < o->from_md)
        return cli_usage_error("growth", "growth: --to: expected a day of the year on or after --from's (seasons do not wrap the new year)"), -1;
    o->site_path = argv[optind];
    return 0;
}

/* ---- the forecast table ------------------------------------------------- */

typedef struct forecast {
    int n_paddocks, n_weeks, n_years;
    int *years;              /* [year] calendar year of each run */
    int64_t *week_start;     /* [week] day number in the first year used */
    int *week_days;          /* [week] days in the week */
    double *rate;            /* [(paddock * n_weeks + week) * n_years + year] kg DM/ha/day */
    double *season;          /* [paddock * n_years + year] kg DM/ha over the season */
} forecast;

static void forecast_free(forecast *f)
{
    free(f->years);
    free(f->week_start);
    free(f->week_days);
    free(f->rate);
    free(f->season);
    memset(f, 0, sizeof *f);
}

/* Days [*d0, *d1) of series w inside the season of calendar year y. */
static int season_days(const wx_series *w, int y, const growth_opts *o, int64_t *d0, int64_t *d1)
{
    int64_t first = tcal_days(y, o->from_md / 100, o->from_md % 100);
    int64_t last = tcal_days(y, o->to_md / 100, o->to_md % 100);
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
 * 1 January of the season's year (or the series' first whole day, if
 * later), with the soil at field capacity and the sward at its residual,
 * so the season opens with the soil water and cover that the year so far
 * has left. */
static int run_year(const site *s, const mc_config *mc, const wx_series *w, int64_t d0, int64_t d1,
                    const pair *pairs, int n_pairs, const int *pair_of, forecast *f, int year,
                    rg_err *err)
{
    mc_result m;
    int y, mo, dd;
    tcal_civil(d0, &y, &mo, &dd);
    int64_t start = tcal_days(y, 1, 1), first_whole = (w->t0_h + 23) / 24;
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

static int build(const site *s, const wx_set *wx, const growth_opts *o, forecast *f, rg_err *err)
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
        return rg_fail(err, "%s: no weather year covers the whole season %02d-%02d to %02d-%02d%s",
                       s->path, o->from_md / 100, o->from_md % 100, o->to_md / 100, o->to_md % 100,
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

/* ---- output ------------------------------------------------------------- */

/* The p-th percentile across years of paddock i, week wk (or the season
 * total when wk < 0). */
static double pct(const forecast *f, int i, int wk, double p)
{
    double v[SITE_MAX_FILES * 2];
    for (int y = 0; y < f->n_years; y++)
        v[y] = wk < 0 ? f->season[(size_t)i * f->n_years + y]
                      : f->rate[((size_t)i * f->n_weeks + wk) * f->n_years + y];
    return fc_percentile(v, f->n_years, p);
}

static const sward_params *sward_of(const site *s, int i)
{
    return &s->swards[s->paddocks[i].sward].p;
}

static void years_text(const forecast *f, char *buf, size_t cap)
{
    if (f->n_years == 1)
        snprintf(buf, cap, "weather year %d", f->years[0]);
    else
        snprintf(buf, cap, "%d weather years, %d to %d", f->n_years, f->years[0],
                 f->years[f->n_years - 1]);
}

#define BLOCK 15 /* paddock columns per block of the weekly table */

static void table(FILE *fp, const site *s, const forecast *f)
{
    char yt[64], a[11];
    years_text(f, yt, sizeof yt);
    fprintf(fp, "Growth forecast, kg DM/ha/day (median over %s)\n", yt);
    for (int b = 0; b < f->n_paddocks; b += BLOCK) {
        int e = b + BLOCK < f->n_paddocks ? b + BLOCK : f->n_paddocks;
        fprintf(fp, "\n%-6s", "week");
        for (int i = b; i < e; i++)
            fprintf(fp, " %5.5s", s->paddocks[i].id);
        fputc('\n', fp);
        for (int wk = 0; wk < f->n_weeks; wk++) {
            tcal_format_date(f->week_start[wk], a);
            fprintf(fp, "%-6s", a + 5);
            for (int i = b; i < e; i++)
                fprintf(fp, " %5.1f", pct(f, i, wk, 50));
            fputc('\n', fp);
        }
    }
    fprintf(fp, "\nSeason totals (kg DM/ha; p10 / p50 / p90 across years) and the median as\n"
                "sward height grown (cm, by each sward's height-mass relation):\n");
    fprintf(fp, "%-10s %8s %8s %8s %8s\n", "paddock", "p10", "p50", "p90", "cm");
    for (int i = 0; i < f->n_paddocks; i++)
        fprintf(fp, "%-10s %8.0f %8.0f %8.0f %8.1f\n", s->paddocks[i].id, pct(f, i, -1, 10),
                pct(f, i, -1, 50), pct(f, i, -1, 90),
                pct(f, i, -1, 50) / sward_of(s, i)->height_mass_kgdm_ha_per_cm);
}

static void csv(FILE *fp, const site *s, const forecast *f)
{
    fputs("paddock,week_start,days,growth_p10_kgdm_ha_d,growth_p50_kgdm_ha_d,growth_p90_kgdm_ha_d,"
          "height_p50_cm_wk\n", fp);
    char a[11];
    for (int i = 0; i < f->n_paddocks; i++)
        for (int wk = 0; wk < f->n_weeks; wk++) {
            tcal_format_date(f->week_start[wk], a);
            double p50 = pct(f, i, wk, 50);
            fprintf(fp, "%s,%s,%d,%.2f,%.2f,%.2f,%.2f\n", s->paddocks[i].id, a + 5, f->week_days[wk],
                    pct(f, i, wk, 10), p50, pct(f, i, wk, 90),
                    p50 * 7 / sward_of(s, i)->height_mass_kgdm_ha_per_cm);
        }
}

static void json(FILE *fp, const site *s, const forecast *f)
{
    char a[11];
    fprintf(fp, "{\n  \"years\": [");
    for (int y = 0; y < f->n_years; y++)
        fprintf(fp, "%s%d", y ? ", " : "", f->years[y]);
    fprintf(fp, "],\n  \"weeks\": [");
    for (int wk = 0; wk < f->n_weeks; wk++) {
        tcal_format_date(f->week_start[wk], a);
        fprintf(fp, "%s{\"start\": \"%s\", \"days\": %d}", wk ? ", " : "", a + 5, f->week_days[wk]);
    }
    fprintf(fp, "],\n  \"paddocks\": [\n");
    for (int i = 0; i < f->n_paddocks; i++) {
        fprintf(fp, "    {\"id\": \"%s\", \"season_kgdm_ha\": {\"p10\": %.1f, \"p50\": %.1f, \"p90\": %.1f},\n"
                    "     \"growth_kgdm_ha_d\": [", s->paddocks[i].id, pct(f, i, -1, 10),
                pct(f, i, -1, 50), pct(f, i, -1, 90));
        for (int wk = 0; wk < f->n_weeks; wk++)
            fprintf(fp, "%s{\"p10\": %.2f, \"p50\": %.2f, \"p90\": %.2f}", wk ? ", " : "",
                    pct(f, i, wk, 10), pct(f, i, wk, 50), pct(f, i, wk, 90));
        fprintf(fp, "]}%s\n", i + 1 < f->n_paddocks ? "," : "");
    }
    fputs("  ]\n}\n", fp);
}

static int emit(const growth_opts *o, const site *s, const forecast *f, rg_err *err)
{
    textfile_out out;
    FILE *fp = stdout;
    if (o->out_path) {
        if (textfile_begin(&out, o->out_path, err) < 0)
            return RG_EXIT_RUNTIME;
        fp = out.fp;
    }
    if (o->format == FMT_CSV)
        csv(fp, s, f);
    else if (o->format == FMT_JSON)
        json(fp, s, f);
    else
        table(fp, s, f);
    if (o->out_path && textfile_commit(&out, err) < 0)
        return RG_EXIT_RUNTIME;
    return RG_EXIT_OK;
}

int cmd_growth(int argc, char **argv)
{
    growth_opts o;
    int p = parse_opts(argc, argv, &o);
    if (p != 0)
        return p > 0 ? RG_EXIT_OK : RG_EXIT_INPUT;
    site s;
    rg_err err = {{0}};
    if (site_load(o.site_path, cli_models_dir(o.models), &s, &err) < 0)
        return cli_input_error(err.msg);
    wx_set wx;
    if (wx_load(&s.weather, &wx, &err) < 0) {
        site_free(&s);
        return cli_input_error(err.msg);
    }
    forecast f;
    int rc = build(&s, &wx, &o, &f, &err);
    if (rc == RG_EXIT_OK)
        rc = emit(&o, &s, &f, &err);
    if (rc != RG_EXIT_OK)
        fprintf(stderr, "rowgraze: error: %s\n", err.msg);
    forecast_free(&f);
    wx_free(&wx);
    site_free(&s);
    return rc;
}
