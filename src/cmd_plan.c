/* cmd_plan.c - `rowgraze plan`: the rotation calendar (output stage).
 *
 * Builds the planning problem (planbuild.c) for the chosen weeks, makes the
 * rule-of-thumb baseline (planbase.c), solves the MILP from it
 * (planmilp.c), re-checks both plans with the verifier (planverify.c: a
 * plan that breaks a rule is an error, never printed as a plan), and
 * prints the calendar: week by week, each mob's paddocks with day ranges,
 * cover in and out, supplement, mowing; then the paddocks' rest; then the
 * optimised plan and the baseline side by side.
 */
#include <errno.h>
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "cli.h"
#include "diag.h"
#include "plan.h"
#include "omout.h"
#include "plandays.h"
#include "plankeep.h"
#include "planrun.h"
#include "prevplan.h"
#include "records.h"
#include "site.h"
#include "tcal.h"
#include "textfile.h"
#include "units.h"
#include "weather.h"

typedef struct plan_opts {
    const char *models, *out_path, *site_path, *export_path, *keep_path;
    const char *walk_path, *grazed_path, *maint_path, *om_dir;
    int units;                /* -1: the site's */
    int keep_weeks;
    int64_t start_day;
    int weeks, percentile, format, strategy;
    double time_limit_s, gap;
} plan_opts;

static void help(void)
{
    puts("usage: rowgraze plan [OPTIONS] SITE.json\n\n"
         "Plans which paddocks each mob grazes, week by week, so the flock is fed from\n"
         "pasture as far as the rules allow: residual, rest, visit length, vegetation\n"
         "ceiling (mowing where grazing cannot hold it), maintenance windows, cattle\n"
         "clearance.  Solved as a mixed-integer program (GLPK) from a rule-of-thumb\n"
         "baseline; both plans are re-checked rule by rule and shown side by side.\n\n"
         "Options:\n"
         "  --start DATE         first day of the plan (default: $.plan.start)\n"
         "  --weeks N            weeks to plan, 1-52 (default: $.plan.weeks or 12)\n"
         "  --percentile P       growth forecast used: 10, 50 or 90 (default 50)\n"
         "  --time-limit S       seconds for the solver (default 10)\n"
         "  --gap G              stop when proven within G percent (default 1)\n"
         "  --strategy S         auto (default: compact up to 100 paddock-weeks x\n"
         "                       mobs, else decomposition), compact, decomposition\n"
         "                       or rolling (12-week windows rolled 4 weeks at a\n"
         "                       time, then the decomposition for the bound)\n"
         "  --format FORMAT      table (default), csv or json\n"
         "  --units U            the table in metric (ha, kg DM) or us (acres, lb DM);\n"
         "                       CSV and JSON stay metric, their keys name the unit\n"
         "                       (default: $.units)\n"
         "  --export-model FILE  also write the model (FILE.mps or FILE.lp)\n"
         "  --walk FILE.csv      pasture walk records: each paddock's latest measured\n"
         "                       cover sets its start (carried forward to the start)\n"
         "  --grazed FILE.csv    grazing records: where the mobs were before the start,\n"
         "                       so the rest rule holds across it\n"
         "  --maintenance FILE.csv  maintenance windows (and keep-off periods) besides\n"
         "                       the site file's; animals are kept out\n"
         "  --om-dir DIR         also write the O&M files into DIR (made if missing):\n"
         "                       mowing.csv, mowing.ics, presence.csv, presence.ics\n"
         "  --keep PLAN.json     an earlier plan (from --format json) to re-plan from:\n"
         "                       its first weeks are held and the changes explained\n"
         "  --keep-weeks N       weeks of --keep to hold, 0-52 (default 1)\n"
         "  --out FILE           write to FILE (atomically) instead of stdout\n"
         "  --models DIR         sward parameter sets\n"
         "  -h, --help           show this help\n\n"
         "Exit status: 0 ok, 1 runtime failure (including a plan that fails its\n"
         "check), 2 bad input or usage.");
}

static int parse_opts(int argc, char **argv, plan_opts *o)
{
    static const struct option opts[] = {
        {"start", required_argument, 0, 's'}, {"weeks", required_argument, 0, 'w'},
        {"percentile", required_argument, 0, 'p'}, {"time-limit", required_argument, 0, 'T'},
        {"gap", required_argument, 0, 'g'}, {"format", required_argument, 0, 'F'},
        {"export-model", required_argument, 0, 'x'}, {"out", required_argument, 0, 'o'},
        {"models", required_argument, 0, 'm'}, {"keep", required_argument, 0, 'k'},
        {"keep-weeks", required_argument, 0, 'K'}, {"walk", required_argument, 0, 'W'},
        {"grazed", required_argument, 0, 'G'}, {"maintenance", required_argument, 0, 'M'},
        {"om-dir", required_argument, 0, 'O'}, {"units", required_argument, 0, 'u'},
        {"strategy", required_argument, 0, 'S'}, {"help", no_argument, 0, 'h'}, {0, 0, 0, 0}};
    *o = (plan_opts){.start_day = INT64_MIN, .time_limit_s = 10, .gap = 1, .keep_weeks = 1, .units = -1,
                    .strategy = PM_AUTO};
    double v;
    int ch;
    optind = 1;
    opterr = 0;
    while ((ch = getopt_long(argc, argv, "h", opts, NULL)) != -1) {
        switch (ch) {
        case 'h': help(); return 1;
        case 's':
            if (cli_date("plan", "--start", optarg, &o->start_day) < 0)
                return -1;
            break;
        case 'w': if (cli_number("plan", "--weeks", optarg, 1, PLAN_MAX_WEEKS, 0, &v) < 0) return -1; o->weeks = (int)v;
            if (v != o->weeks) return cli_usage_error("plan", "plan: --weeks: expected a whole number, found \"%s\"", optarg), -1;
            break;
        case 'p':
            if (strcmp(optarg, "10") && strcmp(optarg, "50") && strcmp(optarg, "90"))
                return cli_usage_error("plan", "plan: --percentile: expected 10, 50 or 90, found \"%s\"", optarg), -1;
            o->percentile = atoi(optarg);
            break;
        case 'T': if (cli_number("plan", "--time-limit", optarg, 0.1, 86400, 0, &o->time_limit_s) < 0) return -1; break;
        case 'g': if (cli_number("plan", "--gap", optarg, 0, 100, 0, &o->gap) < 0) return -1; break;
        case 'S':
            if (strcmp(optarg, "auto") && strcmp(optarg, "compact") && strcmp(optarg, "decomposition") &&
                strcmp(optarg, "rolling"))
                return cli_usage_error("plan", "plan: --strategy: expected auto, compact, decomposition or rolling, found \"%s\"", optarg), -1;
            o->strategy = !strcmp(optarg, "auto") ? PM_AUTO : !strcmp(optarg, "compact") ? PM_IMPROVE
                        : !strcmp(optarg, "rolling") ? PM_ROLLING : PM_DECOMP;
            break;
        case 'x': o->export_path = optarg; break;
        case 'k': o->keep_path = optarg; break;
        case 'W': o->walk_path = optarg; break;
        case 'G': o->grazed_path = optarg; break;
        case 'M': o->maint_path = optarg; break;
        case 'O': o->om_dir = optarg; break;
        case 'u':
            if (un_parse(optarg, &o->units) < 0)
                return cli_usage_error("plan", "plan: --units: expected metric or us, found \"%s\"", optarg), -1;
            break;
        case 'K': if (cli_number("plan", "--keep-weeks", optarg, 0, PLAN_MAX_WEEKS, 0, &v) < 0) return -1; o->keep_weeks = (int)v;
            if (v != o->keep_weeks) return cli_usage_error("plan", "plan: --keep-weeks: expected a whole number, found \"%s\"", optarg), -1;
            break;
        case 'o': o->out_path = optarg; break;
        case 'm': o->models = optarg; break;
        case 'F': if (cli_format("plan", optarg, &o->format) < 0) return -1; break;
        default:
            return cli_usage_error("plan", "plan: unknown option or missing value: '%s'", argv[optind - 1]), -1;
        }
    }
    if (argc - optind != 1)
        return cli_usage_error("plan", "plan: expected one site file, found %d arguments", argc - optind), -1;
    o->site_path = argv[optind];
    return 0;
}

/* ---- the calendar ------------------------------------------------------- */

typedef struct solved {
    const site *s;
    const plan_problem *pb;
    const pr_run *r;
    const pp_plan *prev;     /* the earlier plan (--keep), or NULL */
    int units;               /* enum site_units of the table (CSV and JSON stay metric) */
} solved;

static const char *const day_name[7] = {"Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"};

/* Weekday (0 = Monday) of a day number: 1970-01-01 was a Thursday. */
static int weekday(int64_t day)
{
    return (int)(((day % 7) + 7 + 3) % 7);
}

static const char *status_name(int st)
{
    switch (st) {
    case PM_OPTIMAL: return "optimal";
    case PM_FEASIBLE: return "feasible (stopped by the time or gap limit)";
    case PM_NO_PLAN: return "no plan from the solver";
    default: return "solver error";
    }
}

/* The strategy that ran, as the table (long) or JSON (short) names it. */
static const char *strategy_name(int st, int long_name)
{
    if (st == PM_DECOMP)
        return "decomposition";
    if (st == PM_ROLLING)
        return long_name ? "rolling horizon" : "rolling";
    return long_name ? "compact model" : "compact";
}

static double cover_kg(const solved *z, int p, int t)
{
    return 1000.0 * z->r->vopt.cover_t_ha[(size_t)p * (z->pb->n_weeks + 1) + t];
}

/* Sward height of paddock p at cover kg (kg DM/ha), in the table's unit. */
static double height_cm(const solved *z, int p, double kg)
{
    return un_height(z->units, sward_height_cm(&z->s->swards[z->s->paddocks[p].sward].p, kg));
}

/* A cover (kg DM/ha) in the table's unit. */
static double cov(const solved *z, double kg)
{
    return un_cover(z->units, kg);
}

/* Last week before t in which paddock p is grazed by any mob, or -1. */
static int grazed_before(const solved *z, int p, int t)
{
    const plan_problem *pb = z->pb;
    for (int u = t - 1; u >= 0; u--)
        for (int m = 0; m < pb->n_mobs; m++)
            if (z->r->opt.days[((size_t)m * pb->n_paddocks + p) * pb->n_weeks + u] > 0)
                return u;
    return -1;
}

/* Why a mob spends days off pasture in week t: how many paddocks are
 * resting, below the residual, closed for maintenance or barred to it. */
static void off_pasture_reasons(FILE *fp, const solved *z, int t, int m, int used)
{
    const plan_problem *pb = z->pb;
    int resting = 0, low = 0, closed = 0, barred = 0;
    for (int p = 0; p < pb->n_paddocks; p++) {
        int last = grazed_before(z, p, t);
        if (pb->mob[m].is_cattle && pb->pd[p].cattle_barred)
            barred++;
        else if (last >= 0 && t - last <= pb->rest_weeks)
            resting++;
        else if (pb->open_days[(size_t)p * pb->n_weeks + t] == 0 && z->r->start.pd &&
                 z->r->start.pd[p].may_graze_day > pb->start_day + 7 * (int64_t)t + 6)
            resting++; /* resting after grazing recorded before the plan */
        else if (pb->open_days[(size_t)p * pb->n_weeks + t] == 0)
            closed++;
        else if (cover_kg(z, p, t) < 1000.0 * pb->pd[p].residual_t_ha + 50)
            low++;
    }
    fprintf(fp, "  %-10s why: of %d paddocks %d resting, %d at the residual, %d closed", "",
            pb->n_paddocks, resting, low, closed);
    if (barred)
        fprintf(fp, ", %d too low for cattle", barred);
    if (used >= pb->max_paddocks_per_week)
        fprintf(fp, "; %d paddocks a week at most", pb->max_paddocks_per_week);
    int held = pb->n_paddocks - resting - low - closed - barred - used;
    if (held > 0 && used < pb->max_paddocks_per_week)
        fprintf(fp, ";\n  %-10s %d kept back (for the end-cover target, or dearer to graze than to feed)",
                "", held);
    fputc('\n', fp);
}

/* One mob's week: its visits in the order of their days (plandays.h). */
static void week_mob(FILE *fp, const solved *z, int t, int m, int *prev, int *first)
{
    const plan_problem *pb = z->pb;
    int used = 0, total = 0;
    int64_t d0 = pb->start_day + 7 * (int64_t)t;
    int clash = pday_place(pb, &z->r->opt, m, t, *prev, first);
    if (clash > 0)
        rg_warn("week %d, %s: %d grazing day%s could not be kept off closed days", t + 1,
                pb->mob[m].id, clash, clash == 1 ? "" : "s");
    *prev = pday_last_of(pb, &z->r->opt, m, t, first);
    for (int day = 0; day < 7; day++)
        for (int p = 0; p < pb->n_paddocks; p++) {
            if (first[p] != day)
                continue;
            int d = z->r->opt.days[((size_t)m * pb->n_paddocks + p) * pb->n_weeks + t];
            int a = weekday(d0 + day), b = weekday(d0 + day + d - 1);
            double in = cover_kg(z, p, t), out = cover_kg(z, p, t + 1);
            int last = grazed_before(z, p, t);
            int64_t rec = z->r->start.pd ? z->r->start.pd[p].last_grazed_day : INT64_MIN;
            char rested[24];
            if (last >= 0)
                snprintf(rested, sizeof rested, "rested %d d", 7 * (t - last - 1) + day);
            else if (rec != INT64_MIN)
                snprintf(rested, sizeof rested, "rested %d d", (int)(d0 + day - rec - 1));
            else
                snprintf(rested, sizeof rested, "first in plan");
            char days[8];
            snprintf(days, sizeof days, "%s%s%s", day_name[a], d > 1 ? "-" : "", d > 1 ? day_name[b] : "");
            fprintf(fp, "  %-10s %-7s %-7s %5.0f -> %5.0f %s (%4.1f -> %4.1f %s) %s\n",
                    used ? "" : pb->mob[m].id, days, pb->pd[p].id, cov(z, in), cov(z, out),
                    un_cover_name(z->units), height_cm(z, p, in), height_cm(z, p, out),
                    un_height_name(z->units), rested);
            total += d;
            used++;
        }
    double sup = z->r->opt.supplement_t[(size_t)m * pb->n_weeks + t];
    if (total < 7) {
        fprintf(fp, "  %-10s %d day%s off pasture (yard or other ground)\n", used ? "" : pb->mob[m].id,
                7 - total, 7 - total == 1 ? "" : "s");
        off_pasture_reasons(fp, z, t, m, used);
    }
    if (sup > 1e-9)
        fprintf(fp, "  %-10s supplement %.2f %s this week\n", "", un_mass(z->units, sup),
                un_mass_name(z->units));
}

/* Returns 0, or -1 when out of memory. */
static int calendar(FILE *fp, const solved *z)
{
    const plan_problem *pb = z->pb;
    char a[11], b[11];
    int *prev = malloc(sizeof *prev * ((size_t)pb->n_mobs + 1));
    int *first = malloc(sizeof *first * (size_t)pb->n_paddocks);
    if (!prev || !first) {
        free(prev);
        free(first);
        return -1;
    }
    for (int m = 0; m < pb->n_mobs; m++)
        prev[m] = -1;
    for (int t = 0; t < pb->n_weeks; t++) {
        int64_t d0 = pb->start_day + 7 * (int64_t)t;
        tcal_format_date(d0, a);
        tcal_format_date(d0 + 6, b);
        fprintf(fp, "\nWeek %d  %s %s to %s %s\n", t + 1, day_name[weekday(d0)], a,
                day_name[weekday(d0 + 6)], b);
        for (int m = 0; m < pb->n_mobs; m++)
            week_mob(fp, z, t, m, &prev[m], first);
        for (int p = 0; p < pb->n_paddocks; p++)
            if (z->r->opt.mow[(size_t)p * pb->n_weeks + t])
                fprintf(fp, "  mow        %-8s %.1f %s down to the residual at the end of the week\n",
                        pb->pd[p].id, un_area(z->units, pb->pd[p].area_ha), un_area_name(z->units));
    }
    free(prev);
    free(first);
    return 0;
}

/* Each paddock on the first day: cover, how it was found, rest. */
static void start_state(FILE *fp, const solved *z)
{
    const plan_problem *pb = z->pb;
    const ph_state *h = &z->r->start;
    char how[96], a[11];
    fprintf(fp, "\nPaddocks at the start\n");
    char head[32];
    snprintf(head, sizeof head, "cover %s", un_cover_name(z->units));
    fprintf(fp, "  %-8s %14s %7s  %-38s %s\n", "paddock", head, un_height_name(z->units), "how found",
            "may graze from");
    for (int p = 0; p < pb->n_paddocks; p++) {
        double kg = cover_kg(z, p, 0);
        ph_describe(h, p, how, sizeof how);
        if (h->pd[p].source == PH_DEFAULT && z->s->paddocks[p].start_cover_kgdm_ha >= 0)
            snprintf(how, sizeof how, "site file's start cover");
        else if (h->pd[p].source == PH_DEFAULT)
            snprintf(how, sizeof how, "no record: a default (estimated)");
        fprintf(fp, "  %-8s %14.0f %7.1f  %-38s ", pb->pd[p].id, cov(z, kg), height_cm(z, p, kg), how);
        if (h->pd[p].may_graze_day != INT64_MIN && h->pd[p].may_graze_day > pb->start_day) {
            tcal_format_date(h->pd[p].may_graze_day, a);
            fprintf(fp, "%s\n", a);
        } else {
            fprintf(fp, "-\n");
        }
    }
}

/* Last week paddock p is grazed, or -1. */
static int last_grazed(const solved *z, int p)
{
    const plan_problem *pb = z->pb;
    for (int t = pb->n_weeks - 1; t >= 0; t--)
        for (int m = 0; m < pb->n_mobs; m++)
            if (z->r->opt.days[((size_t)m * pb->n_paddocks + p) * pb->n_weeks + t] > 0)
                return t;
    return -1;
}

static void paddocks(FILE *fp, const solved *z)
{
    const plan_problem *pb = z->pb;
    char a[11], b[11];
    fprintf(fp, "\nPaddocks at the end of the plan\n");
    char head[32];
    snprintf(head, sizeof head, "cover %s", un_cover_name(z->units));
    fprintf(fp, "  %-8s %14s %17s %14s\n", "paddock", head, "last grazed week", "may graze from");
    for (int p = 0; p < pb->n_paddocks; p++) {
        int t = last_grazed(z, p);
        fprintf(fp, "  %-8s %14.0f ", pb->pd[p].id, cov(z, cover_kg(z, p, pb->n_weeks)));
        if (t < 0) {
            fprintf(fp, "%17s %14s\n", "not grazed", "any time");
            continue;
        }
        /* the rest runs from the end of the week it was last grazed */
        int64_t end = pb->start_day + 7 * (int64_t)t + 6;
        tcal_format_date(end - 6, a);
        tcal_format_date(end + 1 + z->s->rules.min_rest_days, b);
        fprintf(fp, "%7d (%s) %14s\n", t + 1, a + 5, b);
    }
}

static void totals_row(FILE *fp, const solved *z, const char *name, const pv_result *v, const char *cur)
{
    fprintf(fp, "  %-12s %10.2f %9.1f %6d %10.0f %s\n", name, un_mass(z->units, v->supplement_t),
            un_area(z->units, v->mowed_ha), v->moves, v->cost_total, cur);
}

static void summary(FILE *fp, const solved *z)
{
    const pm_result *r = &z->r->milp;
    const char *cur = z->s->costs.currency;
    fprintf(fp, "\nPlan and baseline (the rule of thumb: most cover first, leave at the residual)\n");
    char sup[24], mow[24];
    snprintf(sup, sizeof sup, "suppl. %s", un_mass_key(z->units));
    snprintf(mow, sizeof mow, "mowed %s", un_area_name(z->units));
    fprintf(fp, "  %-12s %10s %9s %6s %10s\n", "", sup, mow, "moves", "cost");
    totals_row(fp, z, "this plan", &z->r->vopt, cur);
    totals_row(fp, z, "baseline", &z->r->vbase, cur);
    if (z->r->vopt.terminal_shortfall_t > 1e-6 || z->r->vbase.terminal_shortfall_t > 1e-6)
        fprintf(fp, "  cost includes the penalty for ending below the end-cover target:\n"
                    "  %.2f %s short (plan), %.2f (baseline)\n",
                un_mass(z->units, z->r->vopt.terminal_shortfall_t), un_mass_name(z->units),
                un_mass(z->units, z->r->vbase.terminal_shortfall_t));
    if (isfinite(r->bound))
        fprintf(fp, "Solver (%s): %s;\n  cost %.0f, lower bound %.0f, gap %.2f %%; %d rows, %d columns, %d binaries\n",
                strategy_name(r->strategy, 1), status_name(r->status),
                r->objective, r->bound, 100 * r->gap, r->rows, r->cols, r->binaries);
    else
        fprintf(fp, "Solver (%s): %s;\n  cost %.0f, no lower bound yet (the full relaxation did not finish in time);\n"
                    "  %d rows, %d columns, %d binaries\n",
                strategy_name(r->strategy, 1), status_name(r->status),
                r->objective, r->rows, r->cols, r->binaries);
    fprintf(fp, "Both plans were re-checked rule by rule (docs/planner.md): no rule is broken.\n");
    if (z->r->vopt.supplement_t > 1e-6)
        fprintf(fp, "To feed more from pasture: fewer head, a shorter rest (now %d days), a lower\n"
                    "residual (now %.1f %s), more ground, or paddocks that start with more cover.\n",
                z->s->rules.min_rest_days, un_height(z->units, z->s->rules.residual_height_cm),
                un_height_name(z->units));
}

/* ---- what changed from the earlier plan (--keep) ------------------------ */

/* "P4 4 d, P5 3 d" or "off pasture": the earlier plan's week w for mob id. */
static void prev_visits(const pp_plan *pv, int w, const char *mob, char *out, size_t cap)
{
    size_t n = 0;
    out[0] = '\0';
    for (int i = 0; i < pv->n_grazes && n < cap; i++) {
        const pp_graze *g = &pv->grazes[i];
        if (g->week == w && strcmp(g->mob, mob) == 0)
            n += (size_t)snprintf(out + n, cap - n, "%s%s %d d", n ? ", " : "", g->paddock, g->days);
    }
    if (!out[0])
        snprintf(out, cap, "off pasture");
}

static void new_visits(const solved *z, int t, int m, char *out, size_t cap)
{
    const plan_problem *pb = z->pb;
    size_t n = 0;
    out[0] = '\0';
    for (int p = 0; p < pb->n_paddocks && n < cap; p++) {
        int d = z->r->opt.days[((size_t)m * pb->n_paddocks + p) * pb->n_weeks + t];
        if (d > 0)
            n += (size_t)snprintf(out + n, cap - n, "%s%s %d d", n ? ", " : "", pb->pd[p].id, d);
    }
    if (!out[0])
        snprintf(out, cap, "off pasture");
}

/* Why paddock p may be used differently in week t: its cover now against
 * the earlier plan's forecast (a difference of 100 kg DM/ha or more), or
 * maintenance.  Appends to out; returns how many reasons it added. */
static int paddock_reasons(const solved *z, int p, int t, int w, char *out, size_t cap)
{
    const plan_problem *pb = z->pb;
    size_t n = strlen(out);
    int k = 0;
    double was = pp_cover(z->prev, pb->pd[p].id, w), now = cover_kg(z, p, t);
    if (was >= 0 && fabs(now - was) >= 100 && n < cap) {
        n += (size_t)snprintf(out + n, cap - n, "%s%s cover %.0f %s, the earlier plan expected %.0f (%+.0f)",
                              n ? "; " : "", pb->pd[p].id, cov(z, now), un_cover_name(z->units), cov(z, was),
                              cov(z, now) - cov(z, was));
        k++;
    }
    /* closed days of the week: resting after recorded grazing, or a window */
    int64_t d0 = pb->start_day + 7 * (int64_t)t, rest_end = z->r->start.pd[p].may_graze_day;
    unsigned mask = pb->open_mask ? pb->open_mask[(size_t)p * pb->n_weeks + t] : 0x7fu;
    int resting = 0, shut = 0;
    for (int i = 0; i < 7; i++)
        if (!((mask >> i) & 1u)) {
            if (rest_end != INT64_MIN && d0 + i < rest_end)
                resting++;
            else
                shut++;
        }
    if (resting && n < cap) {
        char a[11];
        tcal_format_date(rest_end, a);
        n += (size_t)snprintf(out + n, cap - n, "%s%s rests until %s after recorded grazing", n ? "; " : "",
                              pb->pd[p].id, a);
        k++;
    }
    if (shut && n < cap) {
        snprintf(out + n, cap - n, "%s%s closed %d day%s (maintenance or its keep-off)", n ? "; " : "",
                 pb->pd[p].id, shut,
                 shut == 1 ? "" : "s");
        k++;
    }
    return k;
}

/* The reasons for a changed mob-week: every paddock in either version. */
static void change_why(const solved *z, int t, int m, int w, char *out, size_t cap)
{
    const plan_problem *pb = z->pb;
    int k = 0;
    out[0] = '\0';
    for (int p = 0; p < pb->n_paddocks; p++) {
        int now = z->r->opt.days[((size_t)m * pb->n_paddocks + p) * pb->n_weeks + t] > 0, was = 0;
        for (int i = 0; i < z->prev->n_grazes; i++) {
            const pp_graze *g = &z->prev->grazes[i];
            was |= g->week == w && strcmp(g->mob, pb->mob[m].id) == 0 && strcmp(g->paddock, pb->pd[p].id) == 0;
        }
        if (now || was)
            k += paddock_reasons(z, p, t, w, out, cap);
    }
    if (!k)
        snprintf(out, cap, "covers as forecast; the new weeks make another rotation cheaper");
}

/* Calls each(z, t, m, w, was, now, why) for every mob-week that differs. */
typedef void (*change_fn)(FILE *fp, const solved *z, int t, int m, const char *was, const char *now,
                          const char *why, int first);

static int each_change(FILE *fp, const solved *z, change_fn fn)
{
    const plan_problem *pb = z->pb;
    int n = 0;
    for (int t = 0; t < pb->n_weeks; t++) {
        int w = pk_prev_week(pb, z->prev, t);
        if (w < 0)
            continue;
        for (int m = 0; m < pb->n_mobs; m++) {
            char was[256], now[256], why[512];
            prev_visits(z->prev, w, pb->mob[m].id, was, sizeof was);
            new_visits(z, t, m, now, sizeof now);
            if (strcmp(was, now) == 0)
                continue;
            change_why(z, t, m, w, why, sizeof why);
            fn(fp, z, t, m, was, now, why, n == 0);
            n++;
        }
    }
    return n;
}

/* Prints text after a label, wrapped at spaces to lines of at most 99
 * columns, continuation lines indented by indent columns. */
static void wrapped(FILE *fp, const char *label, int indent, const char *text)
{
    int col = fprintf(fp, "%s", label);
    while (*text) {
        size_t n = strcspn(text, " ");
        if (col > indent && col + 1 + (int)n > 99) {
            fprintf(fp, "\n%*s", indent, "");
            col = indent;
        } else if (col > indent) {
            fputc(' ', fp);
            col++;
        }
        fwrite(text, 1, n, fp);
        col += (int)n;
        text += n;
        while (*text == ' ')
            text++;
    }
    fputc('\n', fp);
}

static void change_text(FILE *fp, const solved *z, int t, int m, const char *was, const char *now,
                        const char *why, int first)
{
    (void)first;
    char label[96];
    snprintf(label, sizeof label, "  week %-2d %-10s was: ", t + 1, z->pb->mob[m].id);
    wrapped(fp, label, 26, was);
    wrapped(fp, "                     now: ", 26, now);
    wrapped(fp, "                     why: ", 26, why);
}

static void json_str(FILE *fp, const char *v)
{
    fputc('"', fp);
    for (const unsigned char *c = (const unsigned char *)v; *c; c++) {
        if (*c == '"' || *c == '\\')
            fprintf(fp, "\\%c", *c);
        else if (*c < 0x20)
            fprintf(fp, "\\u%04x", *c);
        else
            fputc(*c, fp);
    }
    fputc('"', fp);
}

static void change_json(FILE *fp, const solved *z, int t, int m, const char *was, const char *now,
                        const char *why, int first)
{
    fprintf(fp, "%s\n    {\"week\": %d, \"mob\": \"%s\", \"was\": ", first ? "" : ",", t + 1, z->pb->mob[m].id);
    json_str(fp, was);
    fputs(", \"now\": ", fp);
    json_str(fp, now);
    fputs(", \"why\": ", fp);
    json_str(fp, why);
    fputc('}', fp);
}

static void changes_json(FILE *fp, const solved *z)
{
    if (!z->prev)
        return;
    fputs("  \"kept_from\": ", fp);
    json_str(fp, z->prev->path);
    fprintf(fp, ",\n  \"kept_weeks\": %d,\n  \"keep_note\": ", z->r->kept_weeks);
    json_str(fp, z->r->keep_why);
    fputs(",\n  \"changes\": [", fp);
    int n = each_change(fp, z, change_json);
    fputs(n ? "\n  ],\n" : "],\n", fp);
}

static void changes(FILE *fp, const solved *z)
{
    if (!z->prev)
        return;
    char a[11];
    tcal_format_date(z->prev->start_day, a);
    fprintf(fp, "\nChanges from the earlier plan (%s, from %s)\n", z->prev->path, a);
    fprintf(fp, "  weeks held as they were: %d", z->r->kept_weeks);
    if (z->r->keep_why[0])
        fprintf(fp, " (fewer than asked: %s)", z->r->keep_why);
    fputc('\n', fp);
    if (each_change(fp, z, change_text) == 0)
        fprintf(fp, "  no mob-week differs from the earlier plan\n");
}

static int table(FILE *fp, const solved *z)
{
    const plan_problem *pb = z->pb;
    char a[11];
    tcal_format_date(pb->start_day, a);
    fprintf(fp, "Rotation plan: %s\n%d weeks from %s %s, growth forecast p%d\n", z->s->name,
            pb->n_weeks, day_name[weekday(pb->start_day)], a, z->s->plan.percentile);
    start_state(fp, z);
    if (calendar(fp, z) < 0)
        return -1;
    paddocks(fp, z);
    changes(fp, z);
    summary(fp, z);
    return 0;
}

static void csv(FILE *fp, const solved *z)
{
    const plan_problem *pb = z->pb;
    char a[11];
    fputs("week,week_start,kind,mob,paddock,days,cover_in_kgdm_ha,cover_out_kgdm_ha,supplement_t\n", fp);
    for (int t = 0; t < pb->n_weeks; t++) {
        tcal_format_date(pb->start_day + 7 * (int64_t)t, a);
        for (int m = 0; m < pb->n_mobs; m++) {
            for (int p = 0; p < pb->n_paddocks; p++) {
                int d = z->r->opt.days[((size_t)m * pb->n_paddocks + p) * pb->n_weeks + t];
                if (d > 0)
                    fprintf(fp, "%d,%s,graze,%s,%s,%d,%.0f,%.0f,\n", t + 1, a, pb->mob[m].id,
                            pb->pd[p].id, d, cover_kg(z, p, t), cover_kg(z, p, t + 1));
            }
            double sup = z->r->opt.supplement_t[(size_t)m * pb->n_weeks + t];
            if (sup > 1e-9)
                fprintf(fp, "%d,%s,supplement,%s,,,,,%.3f\n", t + 1, a, pb->mob[m].id, sup);
        }
        for (int p = 0; p < pb->n_paddocks; p++)
            if (z->r->opt.mow[(size_t)p * pb->n_weeks + t])
                fprintf(fp, "%d,%s,mow,,%s,,%.0f,%.0f,\n", t + 1, a, pb->pd[p].id, cover_kg(z, p, t),
                        cover_kg(z, p, t + 1));
    }
}

static void json_totals(FILE *fp, const char *name, const pv_result *v)
{
    fprintf(fp, "  \"%s\": {\"supplement_t\": %.3f, \"mowed_ha\": %.2f, \"moves\": %d, "
                "\"terminal_shortfall_t\": %.3f, \"cost\": %.2f}",
            name, v->supplement_t, v->mowed_ha, v->moves, v->terminal_shortfall_t, v->cost_total);
}

static void json(FILE *fp, const solved *z)
{
    const plan_problem *pb = z->pb;
    char a[11];
    tcal_format_date(pb->start_day, a);
    fprintf(fp, "{\n  \"start\": \"%s\",\n  \"weeks\": %d,\n  \"status\": \"%s\",\n  \"strategy\": \"%s\",\n"
                "  \"objective\": %.2f,\n",
            a, pb->n_weeks, z->r->milp.status == PM_OPTIMAL ? "optimal" : "feasible",
            strategy_name(z->r->milp.strategy, 0), z->r->milp.objective);
    if (isfinite(z->r->milp.bound))
        fprintf(fp, "  \"bound\": %.2f,\n  \"gap\": %.5f,\n", z->r->milp.bound, z->r->milp.gap);
    else
        fputs("  \"bound\": null,\n  \"gap\": null,\n", fp);
    changes_json(fp, z);
    json_totals(fp, "plan", &z->r->vopt);
    fputs(",\n", fp);
    json_totals(fp, "baseline", &z->r->vbase);
    fputs(",\n  \"calendar\": [\n", fp);
    for (int t = 0; t < pb->n_weeks; t++) {
        tcal_format_date(pb->start_day + 7 * (int64_t)t, a);
        fprintf(fp, "    {\"week\": %d, \"start\": \"%s\", \"grazing\": [", t + 1, a);
        int first = 1;
        for (int m = 0; m < pb->n_mobs; m++)
            for (int p = 0; p < pb->n_paddocks; p++) {
                int d = z->r->opt.days[((size_t)m * pb->n_paddocks + p) * pb->n_weeks + t];
                if (d <= 0)
                    continue;
                fprintf(fp, "%s{\"mob\": \"%s\", \"paddock\": \"%s\", \"days\": %d, \"cover_in_kgdm_ha\": %.0f, "
                            "\"cover_out_kgdm_ha\": %.0f}",
                        first ? "" : ", ", pb->mob[m].id, pb->pd[p].id, d, cover_kg(z, p, t), cover_kg(z, p, t + 1));
                first = 0;
            }
        fputs("], \"supplement_t\": [", fp);
        for (int m = 0; m < pb->n_mobs; m++)
            fprintf(fp, "%s%.3f", m ? ", " : "", z->r->opt.supplement_t[(size_t)m * pb->n_weeks + t]);
        fputs("], \"mow\": [", fp);
        first = 1;
        for (int p = 0; p < pb->n_paddocks; p++)
            if (z->r->opt.mow[(size_t)p * pb->n_weeks + t]) {
                fprintf(fp, "%s\"%s\"", first ? "" : ", ", pb->pd[p].id);
                first = 0;
            }
        fprintf(fp, "]}%s\n", t + 1 < pb->n_weeks ? "," : "");
    }
    fputs("  ],\n  \"paddocks\": [\n", fp);
    for (int p = 0; p < pb->n_paddocks; p++) {
        static const char *const src[] = {"estimated", "measured", "carried forward"};
        fprintf(fp, "    {\"paddock\": \"%s\", \"area_ha\": %.2f, \"start_cover\": \"%s\", \"cover_kgdm_ha\": [",
                pb->pd[p].id, pb->pd[p].area_ha, src[z->r->start.pd[p].source]);
        for (int t = 0; t <= pb->n_weeks; t++)
            fprintf(fp, "%s%.0f", t ? ", " : "", cover_kg(z, p, t));
        fprintf(fp, "]}%s\n", p + 1 < pb->n_paddocks ? "," : "");
    }
    fputs("  ]\n}\n", fp);
}

/* ---- running ------------------------------------------------------------ */

/* The O&M files (omout.h) into dir: mowing jobs and animal presence, each
 * as CSV and iCalendar.  Each file is written atomically. */
static int write_om(const char *dir, const solved *z, rg_err *err)
{
    if (mkdir(dir, 0777) != 0 && errno != EEXIST)
        return rg_fail(err, "%s: cannot make the directory: %s", dir, strerror(errno)), RG_EXIT_RUNTIME;
    om_schedule o;
    if (om_build(z->pb, &z->r->opt, &z->r->vopt, z->s, &o) < 0)
        return rg_fail(err, "out of memory"), RG_EXIT_RUNTIME;
    if (o.n_clash_days > 0)
        rg_warn("%s: %d grazing day%s in the presence files fall on closed days (see the calendar)", dir,
                o.n_clash_days, o.n_clash_days == 1 ? "" : "s");
    static const char *const names[4] = {"mowing.csv", "mowing.ics", "presence.csv", "presence.ics"};
    int rc = RG_EXIT_OK;
    for (int i = 0; i < 4 && rc == RG_EXIT_OK; i++) {
        char path[4096];
        snprintf(path, sizeof path, "%s/%s", dir, names[i]);
        int bad = i == 0 ? om_write_mowing_csv(&o, path, err) : i == 1 ? om_write_mowing_ics(&o, path, err)
                  : i == 2 ? om_write_presence_csv(&o, path, err) : om_write_presence_ics(&o, path, err);
        rc = bad < 0 ? RG_EXIT_RUNTIME : RG_EXIT_OK;
    }
    om_free(&o);
    return rc;
}

static int emit(const plan_opts *o, const solved *z, rg_err *err)
{
    textfile_out out;
    FILE *fp = cli_out_begin(o->out_path, &out, err);
    if (!fp)
        return RG_EXIT_RUNTIME;
    if (o->format == CLI_CSV)
        csv(fp, z);
    else if (o->format == CLI_JSON)
        json(fp, z);
    else if (table(fp, z) < 0) {
        cli_out_abort(o->out_path, &out);
        return rg_fail(err, "out of memory"), RG_EXIT_RUNTIME;
    }
    return cli_out_end(o->out_path, &out, err);
}

typedef struct records {
    rec_walks walks;
    rec_grazes grazes;
    rec_maints maints;
} records;

/* The record files given (after the start is known: records must not be
 * dated after it) and the earlier plan; maintenance windows join the site's. */
static int load_records(const plan_opts *o, site *s, records *rec, rg_err *err)
{
    int64_t start = s->plan.start_day;
    rec_plate plate = rec_plate_of(s);
    if ((o->walk_path && rec_walk_load(s, &plate, start, o->walk_path, &rec->walks, err) < 0) ||
        (o->grazed_path && rec_graze_load(s, start, o->grazed_path, &rec->grazes, err) < 0) ||
        (o->maint_path && rec_maint_load(s, o->maint_path, &rec->maints, err) < 0))
        return RG_EXIT_INPUT;
    if (o->maint_path && rec_maint_merge(&rec->maints, s, err) < 0)
        return RG_EXIT_RUNTIME;
    return RG_EXIT_OK;
}

static void free_records(records *rec)
{
    rec_walk_free(&rec->walks);
    rec_graze_free(&rec->grazes);
    rec_maint_free(&rec->maints);
}

static int run(const plan_opts *o, site *s, const wx_set *wx, rg_err *err)
{
    if (o->start_day != INT64_MIN)
        s->plan.start_day = o->start_day;
    if (o->weeks)
        s->plan.weeks = o->weeks;
    if (o->percentile)
        s->plan.percentile = o->percentile;
    if (s->plan.start_day == INT64_MIN)
        return rg_fail(err, "%s: no plan start: give --start DATE or $.plan.start", s->path), RG_EXIT_INPUT;
    records rec = {0};
    int rc = load_records(o, s, &rec, err);
    if (rc != RG_EXIT_OK) {
        free_records(&rec);
        return rc;
    }
    pp_plan prev = {0};
    if (o->keep_path && pp_load(o->keep_path, &prev, err) < 0) {
        free_records(&rec);
        return RG_EXIT_INPUT;
    }
    pr_options po = {.time_limit_s = o->time_limit_s, .gap = o->gap / 100.0,
                     .progress = isatty(STDERR_FILENO), .export_path = o->export_path,
                     .keep = o->keep_path ? &prev : NULL, .keep_weeks = o->keep_weeks,
                     .strategy = o->strategy,
                     .walks = o->walk_path ? &rec.walks : NULL,
                     .grazes = o->grazed_path ? &rec.grazes : NULL};
    pr_run r;
    rc = pr_plan(s, wx, &po, &r, err);
    if (rc == RG_EXIT_OK) {
        /* the solve time is a diagnostic, not a result: stdout stays the
         * same for the same input */
        if (isatty(STDERR_FILENO))
            fprintf(stderr, "rowgraze: plan solved in %.1f s\n", r.milp.seconds);
        solved z = {.s = s, .pb = &r.pb, .r = &r, .prev = o->keep_path ? &prev : NULL,
                    .units = o->units >= 0 ? o->units : s->units};
        rc = emit(o, &z, err);
        if (rc == RG_EXIT_OK && o->om_dir)
            rc = write_om(o->om_dir, &z, err);
    }
    pr_free(&r);
    pp_free(&prev);
    free_records(&rec);
    return rc;
}

int cmd_plan(int argc, char **argv)
{
    plan_opts o;
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
