/* cmd_growth.c - `rowgraze growth`: the paddock growth forecast, by week
 * (output stage for the growth stage).
 *
 * Parses the options into a season (--from and --to month-days, default
 * the whole year; --years), has forecast.c build the weekly table across
 * weather years, and prints it: a weekly median matrix and season totals
 * for people, or every percentile as CSV or JSON.
 */
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cli.h"
#include "diag.h"
#include "forecast.h"
#include "site.h"
#include "tcal.h"
#include "units.h"
#include "textfile.h"
#include "weather.h"

typedef struct growth_opts {
    const char *models, *out_path, *site_path;
    int from_md, to_md;      /* month * 100 + day */
    int year;                /* 0 = all years */
    int format;
    int units;               /* the table's: enum site_units, -1 = the site's */
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
         "  --to DATE          last day of the season, default 31 December; a month and\n"
         "                     day before --from's runs the season over the new year\n"
         "                     (e.g. --from 2024-11-01 --to 2025-02-28)\n"
         "  --years all|YYYY   every weather year (default) or one (the year the\n"
         "                     season starts in)\n"
         "  --format FORMAT    table (default), csv or json\n"
         "  --units U          the table in metric (kg DM/ha, cm) or us (lb DM/ac, in);\n"
         "                     CSV and JSON stay metric (default: $.units)\n"
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
    if (cli_date("growth", opt, text, &day) < 0)
        return -1;
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
        {"units", required_argument, 0, 'u'}, {"help", no_argument, 0, 'h'}, {0, 0, 0, 0}};
    *o = (growth_opts){.from_md = 101, .to_md = 1231, .units = -1};
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
        case 'F': if (cli_format("growth", optarg, &o->format) < 0) return -1; break;
        case 'u':
            if (un_parse(optarg, &o->units) < 0)
                return cli_usage_error("growth", "growth: --units: expected metric or us, found \"%s\"", optarg), -1;
            break;
        default:
            return cli_usage_error("growth", "growth: unknown option or missing value: '%s'", argv[optind - 1]), -1;
        }
    }
    if (argc - optind != 1)
        return cli_usage_error("growth", "growth: expected one site file, found %d arguments", argc - optind), -1;
    o->site_path = argv[optind];
    return 0;
}

/* ---- output ------------------------------------------------------------- */

static const sward_params *sward_of(const site *s, int i)
{
    return &s->swards[s->paddocks[i].sward].p;
}

/* "weather year 2024", "3 weather years, 2023 to 2025"; a season over the
 * new year names both years: "2 weather years, 2023-24 to 2024-25". */
static void years_text(const fc_table *f, int over_new_year, char *buf, size_t cap)
{
    char a[16], b[16];
    int last = f->years[f->n_years - 1];
    if (over_new_year) {
        snprintf(a, sizeof a, "%d-%02d", f->years[0], (f->years[0] + 1) % 100);
        snprintf(b, sizeof b, "%d-%02d", last, (last + 1) % 100);
    } else {
        snprintf(a, sizeof a, "%d", f->years[0]);
        snprintf(b, sizeof b, "%d", last);
    }
    if (f->n_years == 1)
        snprintf(buf, cap, "weather year %s", a);
    else
        snprintf(buf, cap, "%d weather years, %s to %s", f->n_years, a, b);
}

#define BLOCK 15 /* paddock columns per block of the weekly table */

static void table(FILE *fp, const site *s, const fc_table *f, int over_new_year, int u)
{
    char yt[80], a[11];
    years_text(f, over_new_year, yt, sizeof yt);
    fprintf(fp, "Growth forecast, %s/day (median over %s)\n", un_cover_name(u), yt);
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
                fprintf(fp, " %5.1f", un_cover(u, fc_rate_pct(f, i, wk, 50)));
            fputc('\n', fp);
        }
    }
    fprintf(fp, "\nSeason totals (%s; p10 / p50 / p90 across years) and the median as\n"
                "sward height grown (%s, by each sward's height-mass relation):\n",
            un_cover_name(u), un_height_name(u));
    fprintf(fp, "%-10s %8s %8s %8s %8s\n", "paddock", "p10", "p50", "p90", un_height_name(u));
    for (int i = 0; i < f->n_paddocks; i++)
        fprintf(fp, "%-10s %8.0f %8.0f %8.0f %8.1f\n", s->paddocks[i].id,
                un_cover(u, fc_rate_pct(f, i, -1, 10)), un_cover(u, fc_rate_pct(f, i, -1, 50)),
                un_cover(u, fc_rate_pct(f, i, -1, 90)),
                un_height(u, fc_rate_pct(f, i, -1, 50) / sward_of(s, i)->height_mass_kgdm_ha_per_cm));
}

static void csv(FILE *fp, const site *s, const fc_table *f)
{
    fputs("paddock,week_start,days,growth_p10_kgdm_ha_d,growth_p50_kgdm_ha_d,growth_p90_kgdm_ha_d,"
          "height_p50_cm_wk\n", fp);
    char a[11];
    for (int i = 0; i < f->n_paddocks; i++)
        for (int wk = 0; wk < f->n_weeks; wk++) {
            tcal_format_date(f->week_start[wk], a);
            double p50 = fc_rate_pct(f, i, wk, 50);
            fprintf(fp, "%s,%s,%d,%.2f,%.2f,%.2f,%.2f\n", s->paddocks[i].id, a + 5, f->week_days[wk],
                    fc_rate_pct(f, i, wk, 10), p50, fc_rate_pct(f, i, wk, 90),
                    p50 * 7 / sward_of(s, i)->height_mass_kgdm_ha_per_cm);
        }
}

static void json(FILE *fp, const site *s, const fc_table *f)
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
                    "     \"growth_kgdm_ha_d\": [", s->paddocks[i].id, fc_rate_pct(f, i, -1, 10),
                fc_rate_pct(f, i, -1, 50), fc_rate_pct(f, i, -1, 90));
        for (int wk = 0; wk < f->n_weeks; wk++)
            fprintf(fp, "%s{\"p10\": %.2f, \"p50\": %.2f, \"p90\": %.2f}", wk ? ", " : "",
                    fc_rate_pct(f, i, wk, 10), fc_rate_pct(f, i, wk, 50), fc_rate_pct(f, i, wk, 90));
        fprintf(fp, "]}%s\n", i + 1 < f->n_paddocks ? "," : "");
    }
    fputs("  ]\n}\n", fp);
}

static int emit(const growth_opts *o, const site *s, const fc_table *f, rg_err *err)
{
    textfile_out out;
    FILE *fp = cli_out_begin(o->out_path, &out, err);
    if (!fp)
        return RG_EXIT_RUNTIME;
    if (o->format == CLI_CSV)
        csv(fp, s, f);
    else if (o->format == CLI_JSON)
        json(fp, s, f);
    else
        table(fp, s, f, o->to_md < o->from_md, o->units >= 0 ? o->units : s->units);
    return cli_out_end(o->out_path, &out, err);
}

int cmd_growth(int argc, char **argv)
{
    growth_opts o;
    int p = parse_opts(argc, argv, &o);
    if (p != 0)
        return p > 0 ? RG_EXIT_OK : RG_EXIT_INPUT;
    site s;
    wx_set wx;
    if (cli_load(o.site_path, o.models, &s, &wx) != RG_EXIT_OK)
        return RG_EXIT_INPUT;
    rg_err err = {{0}};
    fc_table f;
    fc_season season = {o.from_md, o.to_md, o.year};
    int rc = fc_build(&s, &wx, &season, &f, &err);
    if (rc == RG_EXIT_OK)
        rc = emit(&o, &s, &f, &err);
    cli_finish(rc, &err);
    fc_table_free(&f);
    cli_unload(&s, &wx);
    return rc;
}
