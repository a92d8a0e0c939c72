/* cmd_compare.c - `rowgraze compare`: several scenarios, each a full
 * optimised plan, side by side (output stage).
 *
 * A scenario is one site file with some settings changed (scenario.h):
 * the --set axes make their cross product, for each site file given.  Each
 * scenario is planned exactly as `rowgraze plan` plans a site (planrun.h:
 * problem, baseline, solver, verifier) with the same time limit and gap.
 * Scenarios run in parallel: one child process (fork) per scenario, at
 * most as many at once as there are online cores (or --jobs), each writing
 * its result as one fixed-size record to its own pipe; the parent reads
 * them in scenario order.  A child shares nothing with the others after
 * the fork, so a scenario's plan is the one it would have alone (the
 * solver's time limit aside: docs/compare.md, "Same input, same output").
 * Output: a table with text bar charts, CSV or JSON (docs/compare.md).
 */
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cli.h"
#include "diag.h"
#include "forkrun.h"
#include "planrun.h"
#include "scenario.h"
#include "site.h"
#include "tcal.h"
#include "units.h"
#include "weather.h"

#define CMP_MAX_AXES 4
#define CMP_MAX_SITES 8
#define CMP_MAX_SCENARIOS 64

typedef struct cmp_opts {
    const char *models, *out_path;
    const char *sites[CMP_MAX_SITES];
    int n_sites;
    scn_axis axes[CMP_MAX_AXES];
    int n_axes;
    int64_t start_day;
    int weeks, percentile, format, units, jobs;
    double time_limit_s, gap;
} cmp_opts;

/* One scenario's result: plain data, written whole to a pipe. */
typedef struct cmp_row {
    int rc;                 /* RG_EXIT_*; msg says why when not OK */
    char msg[768];
    int status, fell_back;  /* pm_result.status */
    double objective, bound, gap;
    int weeks, percentile, head;
    int64_t start_day;
    double supplement_t, mowed_ha, cost, shortfall_t, end_cover_kgdm_ha;
    int moves;
    double base_supplement_t, base_mowed_ha, base_cost;
    int base_moves;
} cmp_row;

/* A scenario: which site, which value of each axis. */
typedef struct cmp_case {
    int site;
    int value[CMP_MAX_AXES];
    char label[512];
} cmp_case;

static void help(void)
{
    puts("usage: rowgraze compare [OPTIONS] SITE.json [SITE2.json ...]\n\n"
         "Plans several scenarios, each a full optimised plan (as `rowgraze plan`), and\n"
         "shows their supplement, mowing, moves, cost and end cover side by side.\n"
         "A scenario is a site file with settings changed by --set; several --set\n"
         "options make every combination (their cross product), for each site file.\n\n"
         "Options:\n"
         "  --set PATH=V1,V2,... a setting and its values, e.g. mobs.ewes.head=300,400,500,\n"
         "                       rules.min_rest_days=28,35, plan.percentile=10,50,\n"
         "                       costs.supplement_per_t_dm=280,350 (see docs/compare.md)\n"
         "  --start DATE         first day of every plan (default: $.plan.start)\n"
         "  --weeks N            weeks to plan, 1-52 (default: $.plan.weeks or 12)\n"
         "  --percentile P       growth forecast: 10, 50 or 90 (default $.plan.percentile)\n"
         "  --time-limit S       seconds for the solver, per scenario (default 10)\n"
         "  --gap G              stop when proven within G percent (default 1)\n"
         "  --jobs N             scenarios at once (default: the online cores)\n"
         "  --format FORMAT      table (default), csv or json\n"
         "  --units U            metric (ha, kg DM) or us (ac, lb DM); default: the site's\n"
         "  --out FILE           write to FILE (atomically) instead of stdout\n"
         "  --models DIR         sward parameter sets\n"
         "  -h, --help           show this help\n\n"
         "Exit status: 0 ok, 1 runtime failure, 2 bad input or usage.");
}

static int opt_set(cmp_opts *o, const char *arg)
{
    if (o->n_axes == CMP_MAX_AXES)
        return cli_usage_error("compare", "compare: --set: expected at most %d settings", CMP_MAX_AXES), -1;
    rg_err err = {{0}};
    if (scn_parse_axis(arg, &o->axes[o->n_axes], &err) < 0)
        return cli_input_error(err.msg), -1;
    for (int a = 0; a < o->n_axes; a++)
        if (strcmp(o->axes[a].path, o->axes[o->n_axes].path) == 0)
            return cli_usage_error("compare", "compare: --set %s: expected each path once, found it twice",
                                   o->axes[a].path), -1;
    o->n_axes++;
    return 0;
}

static int parse_opts(int argc, char **argv, cmp_opts *o)
{
    static const struct option opts[] = {
        {"set", required_argument, 0, 'S'}, {"start", required_argument, 0, 's'},
        {"weeks", required_argument, 0, 'w'}, {"percentile", required_argument, 0, 'p'},
        {"time-limit", required_argument, 0, 'T'}, {"gap", required_argument, 0, 'g'},
        {"jobs", required_argument, 0, 'j'}, {"format", required_argument, 0, 'F'},
        {"units", required_argument, 0, 'u'}, {"out", required_argument, 0, 'o'},
        {"models", required_argument, 0, 'm'}, {"help", no_argument, 0, 'h'}, {0, 0, 0, 0}};
    memset(o, 0, sizeof *o);
    o->start_day = INT64_MIN;
    o->time_limit_s = 10;
    o->gap = 1;
    o->units = -1;
    double v;
    int ch;
    optind = 1;
    opterr = 0;
    while ((ch = getopt_long(argc, argv, "h", opts, NULL)) != -1) {
        switch (ch) {
        case 'h': help(); return 1;
        case 'S': if (opt_set(o, optarg) < 0) return -1; break;
        case 's': if (cli_date("compare", "--start", optarg, &o->start_day) < 0) return -1; break;
        case 'w': if (cli_number("compare", "--weeks", optarg, 1, PLAN_MAX_WEEKS, 1, &v) < 0) return -1; o->weeks = (int)v; break;
        case 'p':
            if (strcmp(optarg, "10") && strcmp(optarg, "50") && strcmp(optarg, "90"))
                return cli_usage_error("compare", "compare: --percentile: expected 10, 50 or 90, found \"%s\"", optarg), -1;
            o->percentile = atoi(optarg);
            break;
        case 'T': if (cli_number("compare", "--time-limit", optarg, 0.1, 86400, 0, &o->time_limit_s) < 0) return -1; break;
        case 'g': if (cli_number("compare", "--gap", optarg, 0, 100, 0, &o->gap) < 0) return -1; break;
        case 'j': if (cli_number("compare", "--jobs", optarg, 1, 256, 1, &v) < 0) return -1; o->jobs = (int)v; break;
        case 'F': if (cli_format("compare", optarg, &o->format) < 0) return -1; break;
        case 'u':
            if (un_parse(optarg, &o->units) < 0)
                return cli_usage_error("compare", "compare: --units: expected metric or us, found \"%s\"", optarg), -1;
            break;
        case 'o': o->out_path = optarg; break;
        case 'm': o->models = optarg; break;
        default:
            return cli_usage_error("compare", "compare: unknown option or missing value: '%s'", argv[optind - 1]), -1;
        }
    }
    o->n_sites = argc - optind;
    if (o->n_sites < 1 || o->n_sites > CMP_MAX_SITES)
        return cli_usage_error("compare", "compare: expected 1 to %d site files, found %d", CMP_MAX_SITES,
                               o->n_sites), -1;
    for (int i = 0; i < o->n_sites; i++)
        o->sites[i] = argv[optind + i];
    return 0;
}

/* ---- the scenarios ------------------------------------------------------ */

typedef struct cmp_ctx {
    const cmp_opts *o;      /* owned: released by ctx_destroy */
    site s[CMP_MAX_SITES];
    wx_set wx[CMP_MAX_SITES];
    int loaded;
    cmp_case *cases;
    int n_cases;
    cmp_row *rows;
} cmp_ctx;

/* The site file's name without its directory. */
static const char *base_name(const char *path)
{
    const char *b = strrchr(path, '/');
    return b ? b + 1 : path;
}

static void make_label(const cmp_ctx *c, cmp_case *k)
{
    size_t n = 0;
    k->label[0] = 0;
    if (c->o->n_sites > 1)
        n += (size_t)snprintf(k->label, sizeof k->label, "%s", base_name(c->o->sites[k->site]));
    for (int a = 0; a < c->o->n_axes && n < sizeof k->label; a++)
        n += (size_t)snprintf(k->label + n, sizeof k->label - n, "%s%s=%s", n ? " " : "", c->o->axes[a].path,
                              c->o->axes[a].values[k->value[a]]);
    if (!k->label[0])
        snprintf(k->label, sizeof k->label, "as given");
}

/* Applies the command-line options, then the scenario's settings, to its
 * site (the caller saves and restores it). */
static int apply_case(const cmp_ctx *c, site *s, const cmp_case *k, rg_err *err)
{
    const cmp_opts *o = c->o;
    if (o->start_day != INT64_MIN)
        s->plan.start_day = o->start_day;
    if (o->weeks)
        s->plan.weeks = o->weeks;
    if (o->percentile)
        s->plan.percentile = o->percentile;
    for (int a = 0; a < o->n_axes; a++)
        if (scn_apply(s, o->axes[a].path, o->axes[a].values[k->value[a]], err) < 0)
            return -1;
    return scn_check(s, k->label, err);
}

/* Every scenario, site by site, the first axis varying slowest. */
static int make_cases(cmp_ctx *c)
{
    int per_site = 1;
    for (int a = 0; a < c->o->n_axes; a++)
        per_site *= c->o->axes[a].n_values;
    long total = (long)per_site * c->o->n_sites;
    if (total > CMP_MAX_SCENARIOS)
        return cli_usage_error("compare", "compare: expected at most %d scenarios, found %ld (the settings' values multiply)",
                               CMP_MAX_SCENARIOS, total), -1;
    c->n_cases = (int)total;
    c->cases = calloc((size_t)total, sizeof *c->cases);
    c->rows = calloc((size_t)total, sizeof *c->rows);
    if (!c->cases || !c->rows)
        return cli_input_error("out of memory"), -1;
    for (int i = 0; i < c->n_cases; i++) {
        cmp_case *k = &c->cases[i];
        k->site = i / per_site;
        int r = i % per_site;
        for (int a = c->o->n_axes - 1; a >= 0; a--) {
            k->value[a] = r % c->o->axes[a].n_values;
            r /= c->o->axes[a].n_values;
        }
        make_label(c, k);
    }
    return 0;
}

/* Checks every scenario's settings before any is planned. */
static int check_cases(cmp_ctx *c)
{
    for (int i = 0; i < c->n_cases; i++) {
        site *s = &c->s[c->cases[i].site];
        scn_saved sv;
        if (scn_save(s, &sv) < 0)
            return cli_input_error("out of memory"), -1;
        rg_err err = {{0}};
        int rc = apply_case(c, s, &c->cases[i], &err);
        scn_restore(s, &sv);
        scn_saved_free(&sv);
        if (rc < 0)
            return cli_input_error(err.msg), -1;
    }
    return 0;
}

static double end_cover_kg(const pr_run *r)
{
    const plan_problem *pb = &r->pb;
    double area = 0, sum = 0;
    for (int p = 0; p < pb->n_paddocks; p++) {
        area += pb->pd[p].area_ha;
        sum += pb->pd[p].area_ha * r->vopt.cover_t_ha[(size_t)p * (pb->n_weeks + 1) + pb->n_weeks];
    }
    return 1000.0 * sum / area;
}

static void fill_row(const pr_run *r, cmp_row *w)
{
    w->status = r->milp.status;
    w->fell_back = r->fell_back;
    w->objective = r->milp.objective;
    w->bound = r->milp.bound;
    w->gap = r->milp.gap;
    w->weeks = r->pb.n_weeks;
    w->start_day = r->pb.start_day;
    w->head = r->pb.n_mobs > 0 ? r->pb.mob[0].head : 0;
    w->supplement_t = r->vopt.supplement_t;
    w->mowed_ha = r->vopt.mowed_ha;
    w->moves = r->vopt.moves;
    w->cost = r->vopt.cost_total;
    w->shortfall_t = r->vopt.terminal_shortfall_t;
    w->end_cover_kgdm_ha = end_cover_kg(r);
    w->base_supplement_t = r->vbase.supplement_t;
    w->base_mowed_ha = r->vbase.mowed_ha;
    w->base_moves = r->vbase.moves;
    w->base_cost = r->vbase.cost_total;
}

/* Plans scenario i into c->rows[i] (in this process). */
static void run_case(cmp_ctx *c, int i)
{
    cmp_row *w = &c->rows[i];
    memset(w, 0, sizeof *w);
    site *s = &c->s[c->cases[i].site];
    scn_saved sv;
    if (scn_save(s, &sv) < 0) {
        w->rc = RG_EXIT_RUNTIME;
        snprintf(w->msg, sizeof w->msg, "out of memory");
        return;
    }
    rg_err err = {{0}};
    pr_options po = {.time_limit_s = c->o->time_limit_s, .gap = c->o->gap / 100.0, .quiet = 0};
    pr_run r;
    memset(&r, 0, sizeof r);
    if (apply_case(c, s, &c->cases[i], &err) < 0)
        w->rc = RG_EXIT_INPUT;
    else
        w->rc = pr_plan(s, &c->wx[c->cases[i].site], &po, &r, &err);
    if (w->rc == RG_EXIT_OK) {
        fill_row(&r, w);
        w->percentile = s->plan.percentile;
    } else
        snprintf(w->msg, sizeof w->msg, "%s", err.msg);
    pr_free(&r);
    scn_restore(s, &sv);
    scn_saved_free(&sv);
}

static void ctx_destroy(cmp_ctx *c);

/* ---- in parallel -------------------------------------------------------- */

/* forkrun task: plans scenario i and writes its row. */
static void task_case(void *ctx, int i, FILE *out)
{
    cmp_ctx *c = ctx;
    run_case(c, i);
    fwrite(&c->rows[i], sizeof c->rows[i], 1, out);
}

static void task_release(void *ctx)
{
    ctx_destroy(ctx); /* nothing left behind for a leak checker */
}

/* Every scenario: in children, at most --jobs (else the online cores) at
 * once, collected in order (forkrun.h). */
static void run_all(cmp_ctx *c)
{
    int n = c->n_cases;
    fr_result *res = n > 0 ? calloc((size_t)n, sizeof *res) : NULL;
    if (!res) {
        for (int i = 0; i < n; i++)
            run_case(c, i);
        return;
    }
    fr_run(n, fr_jobs(c->o->jobs), task_case, task_release, c, res);
    for (int i = 0; i < n; i++) {
        cmp_row *w = &c->rows[i];
        if (res[i].ok && res[i].len == sizeof *w) {
            memcpy(w, res[i].data, sizeof *w);
        } else {
            memset(w, 0, sizeof *w);
            w->rc = RG_EXIT_RUNTIME;
            snprintf(w->msg, sizeof w->msg, "the process planning this scenario ended without a result");
        }
        free(res[i].data);
    }
    free(res);
}

/* ---- output ------------------------------------------------------------- */

static const char *status_word(const cmp_row *w)
{
    if (w->fell_back)
        return "baseline";
    return w->status == PM_OPTIMAL ? "optimal" : "feasible";
}

/* A bar of width cells for v of vmax: '=' per full cell, ':' for a half. */
static void bar(FILE *fp, double v, double vmax, int width)
{
    double cells = vmax > 0 ? v / vmax * width : 0;
    int full = (int)floor(cells), half = cells - full >= 0.5;
    fputc('|', fp);
    for (int k = 0; k < width; k++)
        fputc(k < full ? '=' : (k == full && half) ? ':' : ' ', fp);
    fputc('|', fp);
}

typedef double (*cmp_measure)(const cmp_row *w, int units);

static double m_sup(const cmp_row *w, int units) { return un_mass(units, w->supplement_t); }
static double m_mow(const cmp_row *w, int units) { return un_area(units, w->mowed_ha); }
static double m_moves(const cmp_row *w, int units) { (void)units; return w->moves; }
static double m_cost(const cmp_row *w, int units) { (void)units; return w->cost; }
static double m_cover(const cmp_row *w, int units) { return un_cover(units, w->end_cover_kgdm_ha); }

static void chart(FILE *fp, const cmp_ctx *c, const char *title, const char *unit, cmp_measure f, int units,
                  const char *fmt)
{
    double vmax = 0;
    for (int i = 0; i < c->n_cases; i++)
        vmax = fmax(vmax, f(&c->rows[i], units));
    fprintf(fp, "\n%s, %s\n", title, unit);
    for (int i = 0; i < c->n_cases; i++) {
        fprintf(fp, "  %2d ", i + 1);
        bar(fp, f(&c->rows[i], units), vmax, 40);
        fputc(' ', fp);
        fprintf(fp, fmt, f(&c->rows[i], units));
        fputc('\n', fp);
    }
}

static void table(FILE *fp, const cmp_ctx *c, int units)
{
    const cmp_row *w0 = &c->rows[0];
    char a[11];
    tcal_format_date(w0->start_day, a);
    fprintf(fp, "Scenarios: %s\n%d scenario%s, each a full optimised plan (as rowgraze plan); first: %d week%s from %s, growth p%d\n\n",
            c->s[0].name, c->n_cases, c->n_cases == 1 ? "" : "s", w0->weeks, w0->weeks == 1 ? "" : "s", a,
            w0->percentile);
    fprintf(fp, "  %2s  %-40s\n", "#", "scenario");
    for (int i = 0; i < c->n_cases; i++)
        fprintf(fp, "  %2d  %s\n", i + 1, c->cases[i].label);
    char h1[32], h2[32], h3[32];
    snprintf(h1, sizeof h1, "suppl. %s", un_mass_name(units));
    snprintf(h2, sizeof h2, "mowed %s", un_area_name(units));
    snprintf(h3, sizeof h3, "end cover %s", un_cover_name(units));
    char h4[32];
    snprintf(h4, sizeof h4, "short %s", un_mass_name(units));
    fprintf(fp, "\n  %2s %13s %9s %6s %11s %19s %13s  %s\n", "#", h1, h2, "moves", "cost", h3, h4, "solver");
    for (int i = 0; i < c->n_cases; i++) {
        const cmp_row *w = &c->rows[i];
        fprintf(fp, "  %2d %13.2f %9.1f %6d %11.0f %19.0f %13.2f  %s\n", i + 1, m_sup(w, units), m_mow(w, units),
                w->moves, w->cost, m_cover(w, units), un_mass(units, w->shortfall_t), status_word(w));
    }
    fprintf(fp, "  cost%s%s includes the penalty for ending below the end-cover target\n"
                "  (short: the shortfall); every plan was re-checked rule by rule.\n",
            c->s[0].costs.currency[0] ? " in " : "", c->s[0].costs.currency);
    chart(fp, c, "Supplement", un_mass_name(units), m_sup, units, "%.2f");
    chart(fp, c, "Mowing", un_area_name(units), m_mow, units, "%.1f");
    chart(fp, c, "Moves", "paddock entries", m_moves, units, "%.0f");
    chart(fp, c, "Cost", c->s[0].costs.currency[0] ? c->s[0].costs.currency : "money", m_cost, units, "%.0f");
    chart(fp, c, "Mean cover at the end", un_cover_name(units), m_cover, units, "%.0f");
}

static void csv_text(FILE *fp, const char *s)
{
    fputc('"', fp);
    for (; *s; s++) {
        if (*s == '"')
            fputc('"', fp);
        fputc(*s, fp);
    }
    fputc('"', fp);
}

static void csv(FILE *fp, const cmp_ctx *c, int units)
{
    fprintf(fp, "scenario,site,settings,weeks,percentile,status,supplement_%s,mowed_%s,moves,cost,"
                "end_cover_%s,terminal_shortfall_%s,baseline_supplement_%s,baseline_cost,bound,gap\n",
            un_mass_key(units), un_area_key(units), un_cover_key(units), un_mass_key(units), un_mass_key(units));
    for (int i = 0; i < c->n_cases; i++) {
        const cmp_row *w = &c->rows[i];
        fprintf(fp, "%d,", i + 1);
        csv_text(fp, c->o->sites[c->cases[i].site]);
        fputc(',', fp);
        csv_text(fp, c->cases[i].label);
        fprintf(fp, ",%d,%d,%s,%.3f,%.2f,%d,%.2f,%.0f,%.3f,%.3f,%.2f,", w->weeks, w->percentile, status_word(w),
                m_sup(w, units), m_mow(w, units), w->moves, w->cost, m_cover(w, units),
                un_mass(units, w->shortfall_t), un_mass(units, w->base_supplement_t), w->base_cost);
        if (isfinite(w->bound))
            fprintf(fp, "%.2f,%.5f\n", w->bound, w->gap);
        else
            fputs(",\n", fp);
    }
}

/* s as a JSON string (quotes, backslashes and control characters escaped). */
static void json_text(FILE *fp, const char *s)
{
    fputc('"', fp);
    for (; *s; s++) {
        unsigned char ch = (unsigned char)*s;
        if (ch == '"' || ch == '\\')
            fprintf(fp, "\\%c", ch);
        else if (ch < 0x20)
            fprintf(fp, "\\u%04x", ch);
        else
            fputc(ch, fp);
    }
    fputc('"', fp);
}

static void json(FILE *fp, const cmp_ctx *c, int units)
{
    fprintf(fp, "{\n  \"units\": \"%s\",\n  \"scenarios\": [\n", units == SITE_UNITS_US ? "us" : "metric");
    for (int i = 0; i < c->n_cases; i++) {
        const cmp_row *w = &c->rows[i];
        char a[11];
        tcal_format_date(w->start_day, a);
        fprintf(fp, "    {\"scenario\": %d, \"site\": ", i + 1);
        json_text(fp, c->o->sites[c->cases[i].site]);
        fputs(", \"settings\": {", fp);
        for (int k = 0; k < c->o->n_axes; k++)
            fprintf(fp, "%s\"%s\": \"%s\"", k ? ", " : "", c->o->axes[k].path,
                    c->o->axes[k].values[c->cases[i].value[k]]);
        fprintf(fp, "}, \"start\": \"%s\", \"weeks\": %d, \"percentile\": %d, \"status\": \"%s\", \"objective\": %.2f, ",
                a, w->weeks, w->percentile, status_word(w), w->objective);
        if (isfinite(w->bound))
            fprintf(fp, "\"bound\": %.2f, \"gap\": %.5f,\n", w->bound, w->gap);
        else
            fputs("\"bound\": null, \"gap\": null,\n", fp);
        fprintf(fp, "     \"plan\": {\"supplement_%s\": %.3f, \"mowed_%s\": %.2f, \"moves\": %d, "
                    "\"terminal_shortfall_%s\": %.3f, \"cost\": %.2f, \"end_cover_%s\": %.0f},\n",
                un_mass_key(units), m_sup(w, units), un_area_key(units), m_mow(w, units), w->moves,
                un_mass_key(units), un_mass(units, w->shortfall_t), w->cost, un_cover_key(units), m_cover(w, units));
        fprintf(fp, "     \"baseline\": {\"supplement_%s\": %.3f, \"mowed_%s\": %.2f, \"moves\": %d, \"cost\": %.2f}}%s\n",
                un_mass_key(units), un_mass(units, w->base_supplement_t), un_area_key(units),
                un_area(units, w->base_mowed_ha), w->base_moves, w->base_cost, i + 1 < c->n_cases ? "," : "");
    }
    fputs("  ]\n}\n", fp);
}

static int emit(const cmp_ctx *c, rg_err *err)
{
    int units = c->o->units >= 0 ? c->o->units : c->s[0].units;
    textfile_out out;
    FILE *fp = cli_out_begin(c->o->out_path, &out, err);
    if (!fp)
        return RG_EXIT_RUNTIME;
    if (c->o->format == CLI_CSV)
        csv(fp, c, units);
    else if (c->o->format == CLI_JSON)
        json(fp, c, units);
    else
        table(fp, c, units);
    return cli_out_end(c->o->out_path, &out, err);
}

/* The first scenario that failed decides the exit. */
static int first_failure(const cmp_ctx *c, rg_err *err)
{
    for (int i = 0; i < c->n_cases; i++)
        if (c->rows[i].rc != RG_EXIT_OK) {
            rg_fail(err, "scenario %d (%s): %s", i + 1, c->cases[i].label, c->rows[i].msg);
            return c->rows[i].rc;
        }
    return RG_EXIT_OK;
}

/* Releases everything c holds, its options and c itself. */
static void ctx_destroy(cmp_ctx *c)
{
    for (int i = 0; i < c->loaded; i++)
        cli_unload(&c->s[i], &c->wx[i]);
    free(c->cases);
    free(c->rows);
    free((void *)c->o);
    free(c);
}

int cmd_compare(int argc, char **argv)
{
    cmp_ctx *c = calloc(1, sizeof *c);
    cmp_opts *o = calloc(1, sizeof *o);
    if (!c || !o) {
        free(c);
        free(o);
        return cli_input_error("out of memory");
    }
    int p = parse_opts(argc, argv, o), rc = RG_EXIT_INPUT;
    c->o = o;
    if (p > 0)
        rc = RG_EXIT_OK;
    if (p != 0)
        goto done;
    for (; c->loaded < o->n_sites; c->loaded++)
        if (cli_load(o->sites[c->loaded], o->models, &c->s[c->loaded], &c->wx[c->loaded]) != RG_EXIT_OK)
            goto done;
    if (make_cases(c) < 0 || check_cases(c) < 0)
        goto done;
    run_all(c);
    rg_err err = {{0}};
    rc = first_failure(c, &err);
    if (rc == RG_EXIT_OK)
        rc = emit(c, &err);
    rc = cli_finish(rc, &err);
done:
    ctx_destroy(c);
    return rc;
}
