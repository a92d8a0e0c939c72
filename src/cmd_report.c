/* cmd_report.c - `rowgraze report`: the grazing plan as one self-contained
 * HTML file for a client (output stage).
 *
 * Plans the site as `rowgraze plan` does (planrun.c: problem, baseline,
 * solver, verifier), builds the growth forecast over the plan's weeks
 * (forecast.c), summarises the strips across one row over the same weeks
 * of every weather year (micro.c, pasture.c), and hands all of it to the
 * HTML writer (report.c), which writes atomically to --out.
 */
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "cli.h"
#include "diag.h"
#include "forecast.h"
#include "micro.h"
#include "pasture.h"
#include "planrun.h"
#include "report.h"
#include "site.h"
#include "tcal.h"
#include "textfile.h"
#include "units.h"
#include "weather.h"

typedef struct report_opts {
    const char *models, *out_path, *site_path;
    int64_t start_day;
    int weeks, percentile, units; /* units: -1 = the site's */
    double time_limit_s, gap;
} report_opts;

static void help(void)
{
    puts("usage: rowgraze report [OPTIONS] SITE.json --out PLAN.html\n\n"
         "Writes the grazing plan as one self-contained HTML file a client can read,\n"
         "print (A4 or Letter) and keep: the job, the site and flock, a cross-section of\n"
         "one tracker row with light, rain and growth per strip, the growth forecast,\n"
         "cover over time, the rotation calendar (chart and table), the feed budget,\n"
         "mowing, the plan against the rule-of-thumb baseline, assumptions and their\n"
         "sources, and cautions.  Nothing in it is fetched from anywhere.\n\n"
         "Options:\n"
         "  --out FILE           the HTML file to write (atomically); required\n"
         "  --start DATE         first day of the plan (default: $.plan.start)\n"
         "  --weeks N            weeks to plan, 1-52 (default: $.plan.weeks or 12)\n"
         "  --percentile P       growth forecast used: 10, 50 or 90 (default 50)\n"
         "  --time-limit S       seconds for the solver (default 10)\n"
         "  --gap G              stop when proven within G percent (default 1)\n"
         "  --units metric|us    hectares and kg DM, or acres and lb DM (default: $.units)\n"
         "  --models DIR         sward parameter sets\n"
         "  -h, --help           show this help\n\n"
         "Exit status: 0 ok, 1 runtime failure, 2 bad input or usage.");
}

static int parse_one(int ch, const char *arg, report_opts *o)
{
    double v;
    switch (ch) {
    case 's': return cli_date("report", "--start", arg, &o->start_day);
    case 'w':
        if (cli_number("report", "--weeks", arg, 1, PLAN_MAX_WEEKS, 0, &v) < 0)
            return -1;
        if (v != floor(v))
            return cli_usage_error("report", "report: --weeks: expected a whole number, found \"%s\"", arg), -1;
        o->weeks = (int)v;
        return 0;
    case 'p':
        if (strcmp(arg, "10") && strcmp(arg, "50") && strcmp(arg, "90"))
            return cli_usage_error("report", "report: --percentile: expected 10, 50 or 90, found \"%s\"", arg), -1;
        o->percentile = atoi(arg);
        return 0;
    case 'T': return cli_number("report", "--time-limit", arg, 0.1, 86400, 0, &o->time_limit_s);
    case 'g': return cli_number("report", "--gap", arg, 0, 100, 0, &o->gap);
    case 'u':
        if (un_parse(arg, &o->units) < 0)
            return cli_usage_error("report", "report: --units: expected metric or us, found \"%s\"", arg), -1;
        return 0;
    case 'o': o->out_path = arg; return 0;
    case 'm': o->models = arg; return 0;
    default: return -1;
    }
}

static int parse_opts(int argc, char **argv, report_opts *o)
{
    static const struct option opts[] = {
        {"start", required_argument, 0, 's'}, {"weeks", required_argument, 0, 'w'},
        {"percentile", required_argument, 0, 'p'}, {"time-limit", required_argument, 0, 'T'},
        {"gap", required_argument, 0, 'g'}, {"units", required_argument, 0, 'u'},
        {"out", required_argument, 0, 'o'}, {"models", required_argument, 0, 'm'},
        {"help", no_argument, 0, 'h'}, {0, 0, 0, 0}};
    *o = (report_opts){.start_day = INT64_MIN, .time_limit_s = 10, .gap = 1, .units = -1};
    int ch;
    optind = 1;
    opterr = 0;
    while ((ch = getopt_long(argc, argv, "h", opts, NULL)) != -1) {
        if (ch == 'h')
            return help(), 1;
        if (ch == '?' || ch == ':')
            return cli_usage_error("report", "report: unknown option or missing value: '%s'", argv[optind - 1]), -1;
        if (parse_one(ch, optarg, o) < 0)
            return -1;
    }
    if (argc - optind != 1)
        return cli_usage_error("report", "report: expected one site file, found %d arguments", argc - optind), -1;
    if (!o->out_path)
        return cli_usage_error("report", "report: --out: expected the HTML file to write, found none"), -1;
    o->site_path = argv[optind];
    return 0;
}

/* ---- the strips over the plan's season ------------------------------------ */

typedef struct strip_acc {
    mc_config mc;
    ps_config pc;
    mc_result *win;          /* [n_win] the season's hours of each year */
    int n_win, n_strips;
    double *growth;          /* [n_strips + 1] summed over years */
    double rain_mm, tilt_sum, tilt_w;
    wx_set joined;           /* the weather files joined, for runs that cross files */
    double lat_deg;          /* the site's latitude: where runs start (fc_run_start_day) */
} strip_acc;

/* The paddock with the most ground under the array decides the soil and
 * sward of the growth bars (as `rowgraze strips` does). */
static int main_paddock(const site *s)
{
    int best = 0;
    for (int i = 1; i < s->n_paddocks; i++)
        if (s->paddocks[i].area_ha * s->paddocks[i].array_share >
            s->paddocks[best].area_ha * s->paddocks[best].array_share)
            best = i;
    return best;
}

/* Light, rain and tracker angle of one season's hours. */
static void add_window(strip_acc *a, const mc_result *m)
{
    for (size_t h = 0; h < m->n_hours; h++) {
        a->rain_mm += m->rain_mm[h];
        if (m->ghi_w_m2[h] > 0) {
            a->tilt_sum += m->ghi_w_m2[h] * fabs(m->tracker_deg[h]);
            a->tilt_w += m->ghi_w_m2[h];
        }
    }
}

/* Growth per strip over days [d0, d1) of series w: the run starts where
 * the forecast's does (fc_run_start_day, or the series' first whole day). */
static int add_growth(strip_acc *a, const wx_series *w, int64_t d0, int64_t d1, rg_err *err)
{
    int64_t start = fc_run_start_day(a->lat_deg, d0), first_whole = (w->t0_h + 23) / 24;
    if (start < first_whole)
        start = first_whole;
    mc_result m;
    if (mc_run(&a->mc, w, (size_t)(start * 24 - w->t0_h), (size_t)((d1 - start) * 24), &m, err) < 0)
        return -1;
    ps_result p;
    int rc = ps_run(&a->pc, &m, w, &p, err);
    if (rc == 0) {
        for (int i = 0; i < p.n_cols; i++)
            a->growth[i] += ps_total_kgdm_ha(&p, i, (size_t)(d0 - start), (size_t)(d1 - start));
        ps_free(&p);
    }
    mc_free(&m);
    return rc;
}

/* One season [d0, d1) of series w, when the series covers it whole. */
static int add_year(strip_acc *a, const wx_series *w, int64_t d0, int64_t d1, rg_err *err)
{
    int64_t s0 = (w->t0_h + 23) / 24, s1 = (w->t0_h + (int64_t)w->n) / 24;
    if (d0 < s0 || d1 > s1)
        return 0;
    mc_result *m = &a->win[a->n_win];
    if (mc_run(&a->mc, w, (size_t)(d0 * 24 - w->t0_h), (size_t)((d1 - d0) * 24), m, err) < 0)
        return -1;
    a->n_win++;
    add_window(a, m);
    return add_growth(a, w, d0, d1, err);
}

static int strips_run(const site *s, const wx_set *wx, strip_acc *a, rg_err *err)
{
    int y0, m0, dd0, y1, m1, dd1;
    int64_t start = s->plan.start_day, end = start + 7 * (int64_t)s->plan.weeks - 1;
    tcal_civil(start, &y0, &m0, &dd0);
    tcal_civil(end, &y1, &m1, &dd1);
    const site_paddock *pd = &s->paddocks[main_paddock(s)];
    if (mc_config_from_site(s, &a->mc, err) < 0 || ps_config_make(s, pd->soil, pd->sward, &a->pc, err) < 0)
        return -1;
    a->n_strips = a->mc.geom.n_strips;
    int wrap = y1 > y0; /* weeks over the new year: run on into the next file */
    a->lat_deg = s->loc.latitude_deg;
    if (wrap || a->lat_deg < 0.0) { /* or a run from the July before (fc_run_start_day) */
        if (wx_join(wx, &a->joined, err) < 0)
            return -1;
        wx = &a->joined;
    }
    int cap = 0; /* calendar years the series touch: at most one season each */
    for (int j = 0; j < wx->n; j++) {
        int ya, yb, m, d;
        tcal_civil(tcal_hour_day(wx->s[j].t0_h), &ya, &m, &d);
        tcal_civil(tcal_hour_day(wx->s[j].t0_h + (int64_t)wx->s[j].n - 1), &yb, &m, &d);
        cap += yb - ya + 1;
    }
    a->win = calloc((size_t)cap + 1, sizeof *a->win);
    a->growth = calloc((size_t)a->n_strips + 1, sizeof *a->growth);
    if (!a->win || !a->growth)
        return rg_fail(err, "out of memory");
    for (int j = 0; j < wx->n; j++) {
        int ya, yb, m, d;
        tcal_civil(tcal_hour_day(wx->s[j].t0_h), &ya, &m, &d);
        tcal_civil(tcal_hour_day(wx->s[j].t0_h + (int64_t)wx->s[j].n - 1), &yb, &m, &d);
        for (int y = ya; y <= yb && a->n_win < cap; y++)
            if (add_year(a, &wx->s[j], tcal_days(y, m0, dd0), tcal_days(y + wrap, m1, dd1) + 1, err) < 0)
                return -1;
    }
    if (a->n_win == 0)
        return rg_fail(err, "%s: no weather year covers the plan's weeks %02d-%02d to %02d-%02d", s->path, m0,
                       dd0, m1, dd1);
    return 0;
}

static void strips_free(strip_acc *a)
{
    for (int k = 0; k < a->n_win; k++)
        mc_free(&a->win[k]);
    free(a->win);
    free(a->growth);
    mc_config_free(&a->mc);
    wx_free(&a->joined);
}

/* ---- running ------------------------------------------------------------ */

static int emit(const report_opts *o, const rpt_input *in, rg_err *err)
{
    textfile_out out;
    FILE *fp = cli_out_begin(o->out_path, &out, err);
    if (!fp)
        return RG_EXIT_RUNTIME;
    rpt_write(fp, in);
    return cli_out_end(o->out_path, &out, err);
}

static int report(const report_opts *o, const site *s, const wx_set *wx, const pr_run *r, rg_err *err)
{
    int y, m0, d0, m1, d1;
    tcal_civil(s->plan.start_day, &y, &m0, &d0);
    tcal_civil(s->plan.start_day + 7 * (int64_t)s->plan.weeks - 1, &y, &m1, &d1);
    fc_season season = {m0 * 100 + d0, m1 * 100 + d1, 0};
    fc_table f;
    strip_acc a;
    memset(&a, 0, sizeof a);
    int rc = fc_build(s, wx, &season, &f, err);
    if (rc == RG_EXIT_OK && strips_run(s, wx, &a, err) < 0)
        rc = RG_EXIT_RUNTIME;
    mc_strip_summary *rows = rc == RG_EXIT_OK ? calloc((size_t)a.n_strips + 1, sizeof *rows) : NULL;
    if (rc == RG_EXIT_OK && (!rows || mc_summarise(&a.mc, a.win, a.n_win, rows) < 0))
        rc = RG_EXIT_RUNTIME, rg_fail(err, "out of memory");
    if (rc == RG_EXIT_OK) {
        for (int i = 0; i <= a.n_strips; i++)
            a.growth[i] /= a.n_win;
        const site_paddock *pd = &s->paddocks[main_paddock(s)];
        rpt_strips st = {.n = a.n_strips, .rows = rows, .growth_kgdm_ha = a.growth,
                         .open_rain_mm = a.rain_mm / a.n_win,
                         .tilt_deg = a.tilt_w > 0 ? a.tilt_sum / a.tilt_w : 0, .n_years = a.n_win,
                         .soil_id = s->soils[pd->soil].id, .sward_id = s->swards[pd->sward].id};
        rpt_input in = {.s = s, .units = o->units >= 0 ? o->units : s->units, .strips = &st, .fc = &f,
                        .run = r, .time_limit_s = o->time_limit_s, .gap_pct = o->gap};
        rc = emit(o, &in, err);
    }
    free(rows);
    strips_free(&a);
    fc_table_free(&f);
    return rc;
}

static int run(const report_opts *o, site *s, const wx_set *wx, rg_err *err)
{
    if (o->start_day != INT64_MIN)
        s->plan.start_day = o->start_day;
    if (o->weeks)
        s->plan.weeks = o->weeks;
    if (o->percentile)
        s->plan.percentile = o->percentile;
    pr_options po = {.time_limit_s = o->time_limit_s, .gap = o->gap / 100.0,
                     .progress = isatty(STDERR_FILENO)};
    pr_run r;
    int rc = pr_plan(s, wx, &po, &r, err);
    if (rc == RG_EXIT_OK)
        rc = report(o, s, wx, &r, err);
    pr_free(&r);
    return rc;
}

int cmd_report(int argc, char **argv)
{
    report_opts o;
    int p = parse_opts(argc, argv, &o);
    if (p != 0)
        return p > 0 ? RG_EXIT_OK : RG_EXIT_INPUT;
    site s;
    wx_set wx;
    if (cli_load(o.site_path, o.models, &s, &wx) != RG_EXIT_OK)
        return RG_EXIT_INPUT;
    rg_err err = {{0}};
    int rc = cli_finish(run(&o, &s, &wx, &err), &err);
    cli_unload(&s, &wx);
    return rc;
}
