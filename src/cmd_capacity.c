/* cmd_capacity.c - `rowgraze capacity`: the largest head count of one mob
 * the site carries over the plan's weeks within limits on supplement and
 * mowing, for each growth percentile, with the plan at that head count
 * (output stage).
 *
 * For each percentile: the problem is built as `rowgraze plan` builds it
 * (planbuild.c), the search of capacity.c decides head counts exactly for
 * the model and brackets the capacity, and the plan at the capacity is
 * optimised within the limits and re-checked by the verifier.  Every head
 * count decided is listed with how it was settled (docs/capacity.md).
 * The percentiles are searched in parallel, one child process (fork) each,
 * at most as many at once as there are online cores; a child renders its
 * section of the output in memory and sends it through a pipe, and the
 * parent prints the sections in order between the head and the foot.
 */
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "capacity.h"
#include "cli.h"
#include "diag.h"
#include "forkrun.h"
#include "planbuild.h"
#include "site.h"
#include "tcal.h"
#include "units.h"
#include "weather.h"

typedef struct capa_opts {
    const char *models, *out_path, *site_path, *mob_id;
    int64_t start_day;
    int weeks, format, units;
    int pct[3], n_pct;
    int limit_supplement, limit_mowing, limit_shortfall;
    double max_supplement_t, max_mowed_ha, max_shortfall_t, time_limit_s, gap;
} capa_opts;

static void help(void)
{
    puts("usage: rowgraze capacity [OPTIONS] SITE.json\n\n"
         "The largest head count of one mob the site carries over the plan's weeks\n"
         "within the limits given, for each growth percentile, with the plan at that\n"
         "head count.  Each head count is decided exactly for the planning model (a\n"
         "verified plan within the limits, or a proof that none exists); the answer\n"
         "H is carried and H + 1 is not, and the output says how each was settled.\n\n"
         "Options:\n"
         "  --max-supplement T   supplement over the whole plan, t DM, at most T\n"
         "  --max-mowing HA      area mowed over the whole plan, ha, at most HA\n"
         "                       (at least one of the two is needed)\n"
         "  --max-shortfall T    end at most T t DM below the end-cover target (default:\n"
         "                       no limit; the shortfall is only a cost, as in plan)\n"
         "  --mob ID             the mob whose head count varies (default: the first)\n"
         "  --percentile P       10, 50, 90 or all (default all)\n"
         "  --start DATE         first day of the plan (default: $.plan.start)\n"
         "  --weeks N            weeks to plan, 1-52 (default: $.plan.weeks or 12)\n"
         "  --time-limit S       seconds per decision, and for the final plan (default 20)\n"
         "  --gap G              final plan: stop when proven within G percent (default 1)\n"
         "  --format FORMAT      table (default), csv or json\n"
         "  --units U            metric (ha, kg DM) or us (ac, lb DM) in the output;\n"
         "                       the limits are always given in t DM and ha\n"
         "  --out FILE           write to FILE (atomically) instead of stdout\n"
         "  --models DIR         sward parameter sets\n"
         "  -h, --help           show this help\n\n"
         "Exit status: 0 ok, 1 runtime failure, 2 bad input or usage.");
}

static int opt_pct(capa_opts *o, const char *arg)
{
    if (strcmp(arg, "all") == 0) {
        o->n_pct = 3;
        o->pct[0] = 10, o->pct[1] = 50, o->pct[2] = 90;
        return 0;
    }
    if (strcmp(arg, "10") && strcmp(arg, "50") && strcmp(arg, "90"))
        return cli_usage_error("capacity", "capacity: --percentile: expected 10, 50, 90 or all, found \"%s\"", arg), -1;
    o->n_pct = 1;
    o->pct[0] = atoi(arg);
    return 0;
}

static int parse_opts(int argc, char **argv, capa_opts *o)
{
    static const struct option opts[] = {
        {"max-supplement", required_argument, 0, 'S'}, {"max-mowing", required_argument, 0, 'M'},
        {"mob", required_argument, 0, 'b'}, {"percentile", required_argument, 0, 'p'},
        {"start", required_argument, 0, 's'}, {"weeks", required_argument, 0, 'w'},
        {"time-limit", required_argument, 0, 'T'}, {"gap", required_argument, 0, 'g'},
        {"format", required_argument, 0, 'F'}, {"units", required_argument, 0, 'u'},
        {"out", required_argument, 0, 'o'}, {"models", required_argument, 0, 'm'},
        {"max-shortfall", required_argument, 0, 'E'},
        {"help", no_argument, 0, 'h'}, {0, 0, 0, 0}};
    memset(o, 0, sizeof *o);
    o->start_day = INT64_MIN;
    o->time_limit_s = 20;
    o->gap = 1;
    o->units = -1;
    opt_pct(o, "all");
    double v;
    int ch;
    optind = 1;
    opterr = 0;
    while ((ch = getopt_long(argc, argv, "h", opts, NULL)) != -1) {
        switch (ch) {
        case 'h': help(); return 1;
        case 'S':
            if (cli_number("capacity", "--max-supplement", optarg, 0, 1e9, 0, &o->max_supplement_t) < 0) return -1;
            o->limit_supplement = 1;
            break;
        case 'M':
            if (cli_number("capacity", "--max-mowing", optarg, 0, 1e9, 0, &o->max_mowed_ha) < 0) return -1;
            o->limit_mowing = 1;
            break;
        case 'E':
            if (cli_number("capacity", "--max-shortfall", optarg, 0, 1e9, 0, &o->max_shortfall_t) < 0) return -1;
            o->limit_shortfall = 1;
            break;
        case 'b': o->mob_id = optarg; break;
        case 'p': if (opt_pct(o, optarg) < 0) return -1; break;
        case 's': if (cli_date("capacity", "--start", optarg, &o->start_day) < 0) return -1; break;
        case 'w': if (cli_number("capacity", "--weeks", optarg, 1, PLAN_MAX_WEEKS, 1, &v) < 0) return -1; o->weeks = (int)v; break;
        case 'T': if (cli_number("capacity", "--time-limit", optarg, 0.1, 86400, 0, &o->time_limit_s) < 0) return -1; break;
        case 'g': if (cli_number("capacity", "--gap", optarg, 0, 100, 0, &o->gap) < 0) return -1; break;
        case 'F': if (cli_format("capacity", optarg, &o->format) < 0) return -1; break;
        case 'u':
            if (un_parse(optarg, &o->units) < 0)
                return cli_usage_error("capacity", "capacity: --units: expected metric or us, found \"%s\"", optarg), -1;
            break;
        case 'o': o->out_path = optarg; break;
        case 'm': o->models = optarg; break;
        default:
            return cli_usage_error("capacity", "capacity: unknown option or missing value: '%s'", argv[optind - 1]), -1;
        }
    }
    if (argc - optind != 1)
        return cli_usage_error("capacity", "capacity: expected one site file, found %d arguments", argc - optind), -1;
    if (!o->limit_supplement && !o->limit_mowing)
        return cli_usage_error("capacity", "capacity: expected --max-supplement T or --max-mowing HA (without a limit any flock can be fed from supplement)"), -1;
    o->site_path = argv[optind];
    return 0;
}

/* ---- output ------------------------------------------------------------- */

typedef struct capa_out {
    const capa_opts *o;
    const site *s;
    int mob, units;
    cap_result res[3];
} capa_out;

static const char *verdict_key(int v)
{
    switch (v) {
    case CAP_CARRIED: return "carried";
    case CAP_NO_PLAN_LP: return "not_carried_lp";
    case CAP_NO_PLAN_TREE: return "not_carried_tree";
    default: return "not_proven";
    }
}

/* The probe at head h, or NULL. */
static const cap_probe *probe_at(const cap_result *r, int h)
{
    for (int k = 0; k < r->n_probes; k++)
        if (r->probe[k].head == h)
            return &r->probe[k];
    return NULL;
}

static double end_cover_kg(const cap_result *r)
{
    const plan_problem *pb = &r->pb;
    double area = 0, sum = 0;
    for (int p = 0; p < pb->n_paddocks; p++) {
        area += pb->pd[p].area_ha;
        sum += pb->pd[p].area_ha * r->vopt.cover_t_ha[(size_t)p * (pb->n_weeks + 1) + pb->n_weeks];
    }
    return 1000.0 * sum / area;
}

static void limits_line(FILE *fp, const capa_out *z)
{
    fputs("Limits over the whole plan:", fp);
    if (z->o->limit_supplement)
        fprintf(fp, " supplement at most %.2f %s", un_mass(z->units, z->o->max_supplement_t), un_mass_name(z->units));
    if (z->o->limit_mowing)
        fprintf(fp, "%s mowing at most %.1f %s", z->o->limit_supplement ? ";" : "",
                un_area(z->units, z->o->max_mowed_ha), un_area_name(z->units));
    if (!z->o->limit_shortfall)
        fputs("; the end cover may fall below its target (at a cost)\n", fp);
    else
        fprintf(fp, ";\n  the plan ends at most %.2f %s below its end-cover target\n",
                un_mass(z->units, z->o->max_shortfall_t), un_mass_name(z->units));
}

/* One week of the plan at the capacity, on one line. */
static void week_line(FILE *fp, const capa_out *z, const cap_result *r, int t)
{
    const plan_problem *pb = &r->pb;
    char a[11];
    tcal_format_date(pb->start_day + 7 * (int64_t)t, a);
    fprintf(fp, "    %2d %s ", t + 1, a + 5);
    int any = 0;
    for (int p = 0; p < pb->n_paddocks; p++) {
        int d = r->opt.days[((size_t)z->mob * pb->n_paddocks + p) * pb->n_weeks + t];
        if (d > 0)
            fprintf(fp, " %s %dd", pb->pd[p].id, d), any = 1;
    }
    if (!any)
        fputs(" off pasture", fp);
    double sup = r->opt.supplement_t[(size_t)z->mob * pb->n_weeks + t];
    if (sup > 1e-9)
        fprintf(fp, "; supplement %.2f %s", un_mass(z->units, sup), un_mass_name(z->units));
    for (int p = 0; p < pb->n_paddocks; p++)
        if (r->opt.mow[(size_t)p * pb->n_weeks + t])
            fprintf(fp, "; mow %s", pb->pd[p].id);
    fputc('\n', fp);
}

static void table_pct(FILE *fp, const capa_out *z, int i)
{
    const cap_result *r = &z->res[i];
    const char *mob = z->s->mobs[z->mob].id;
    fprintf(fp, "\nGrowth p%d: ", z->o->pct[i]);
    if (r->head >= CAP_MAX_HEAD)
        fprintf(fp, "at least %d head of %s (the most a site file allows)\n", r->head, mob);
    else if (r->head == 0)
        fprintf(fp, "not even 1 head of %s within the limits (%s)\n", mob,
                r->settled ? "proven" : "not proven");
    else
        fprintf(fp, "%d head of %s; %d head %s\n", r->head, mob, r->head + 1,
                r->settled ? "proven not carried" : "NOT PROVEN either way (time limit)");
    if (z->o->limit_shortfall)
        fprintf(fp, "  (end-cover target: mean %.0f %s)\n", un_cover(z->units, 1000.0 * r->pb.terminal_t_ha),
                un_cover_name(z->units));
    fputs("  head count decided, in order:\n", fp);
    for (int k = 0; k < r->n_probes; k++) {
        const cap_probe *pr = &r->probe[k];
        fprintf(fp, "    %7d  %-42s", pr->head, cap_verdict_text(pr->verdict));
        if (pr->verdict == CAP_CARRIED) {
            fprintf(fp, " a plan with %.2f %s supplement", un_mass(z->units, pr->supplement_t), un_mass_name(z->units));
            if (z->o->limit_mowing)
                fprintf(fp, ", %.1f %s mowed", un_area(z->units, pr->mowed_ha), un_area_name(z->units));
        }
        else if (pr->verdict == CAP_NOT_PROVEN && isfinite(pr->bound_supplement_t) && pr->bound_supplement_t > 5e-3)
            fprintf(fp, " any plan needs at least %.2f %s supplement", un_mass(z->units, pr->bound_supplement_t),
                    un_mass_name(z->units));
        fputc('\n', fp);
    }
    if (r->head == 0)
        return;
    fprintf(fp, "  the plan at %d head (verified, limits kept): supplement %.2f %s, mowed %.1f %s, %d moves,\n"
                "  cost %.0f%s%s, mean end cover %.0f %s; solver %s\n",
            r->head, un_mass(z->units, r->vopt.supplement_t), un_mass_name(z->units),
            un_area(z->units, r->vopt.mowed_ha), un_area_name(z->units), r->vopt.moves, r->vopt.cost_total,
            z->s->costs.currency[0] ? " " : "", z->s->costs.currency, un_cover(z->units, end_cover_kg(r)), un_cover_name(z->units),
            r->milp.status == PM_OPTIMAL ? "optimal" : "feasible (time or gap limit)");
    fprintf(fp, "  the rule-of-thumb baseline at %d head would need %.2f %s supplement, %.1f %s mowed\n", r->head,
            un_mass(z->units, r->vbase.supplement_t), un_mass_name(z->units), un_area(z->units, r->vbase.mowed_ha),
            un_area_name(z->units));
    fputs("  week by week (paddock and days; supplement; mowing):\n", fp);
    for (int t = 0; t < r->pb.n_weeks; t++)
        week_line(fp, z, r, t);
}

static void table_head(FILE *fp, const capa_out *z)
{
    char a[11];
    tcal_format_date(z->s->plan.start_day, a);
    fprintf(fp, "Carrying capacity: %s\nmob %s, %d week%s from %s\n", z->s->name, z->s->mobs[z->mob].id,
            z->s->plan.weeks, z->s->plan.weeks == 1 ? "" : "s", a);
    limits_line(fp, z);
}

static void table_foot(FILE *fp)
{
    fputs("\nEach head count is decided for the planning model (docs/planner.md): carried means a\n"
          "plan keeps every rule and the limits, re-checked by the verifier; not carried means\n"
          "the solver proved no plan can.  A capacity is a forecast: walk the paddocks, watch\n"
          "the animals' condition, water and shade, and keep a reserve of feed.\n", fp);
}

static void csv_head(FILE *fp, const capa_out *z)
{
    fprintf(fp, "percentile,head,verdict,supplement_%s,mowed_%s,bound_supplement_%s,capacity\n",
            un_mass_key(z->units), un_area_key(z->units), un_mass_key(z->units));
}

static void csv_pct(FILE *fp, const capa_out *z, int i)
{
    {
        const cap_result *r = &z->res[i];
        for (int k = 0; k < r->n_probes; k++) {
            const cap_probe *pr = &r->probe[k];
            fprintf(fp, "%d,%d,%s,", z->o->pct[i], pr->head, verdict_key(pr->verdict));
            if (pr->verdict == CAP_CARRIED)
                fprintf(fp, "%.3f,%.2f,", un_mass(z->units, pr->supplement_t), un_area(z->units, pr->mowed_ha));
            else
                fputs(",,", fp);
            if (pr->verdict == CAP_NOT_PROVEN && isfinite(pr->bound_supplement_t))
                fprintf(fp, "%.3f", un_mass(z->units, pr->bound_supplement_t));
            fprintf(fp, ",%d\n", pr->head == r->head);
        }
    }
}

static void json_plan(FILE *fp, const capa_out *z, const cap_result *r)
{
    const plan_problem *pb = &r->pb;
    int u = z->units;
    fprintf(fp, ",\n     \"plan\": {\"status\": \"%s\", \"supplement_%s\": %.3f, \"mowed_%s\": %.2f, \"moves\": %d, "
                "\"terminal_shortfall_%s\": %.3f, \"cost\": %.2f, \"end_cover_%s\": %.0f,\n      \"weeks\": [",
            r->milp.status == PM_OPTIMAL ? "optimal" : "feasible", un_mass_key(u), un_mass(u, r->vopt.supplement_t),
            un_area_key(u), un_area(u, r->vopt.mowed_ha), r->vopt.moves, un_mass_key(u),
            un_mass(u, r->vopt.terminal_shortfall_t), r->vopt.cost_total, un_cover_key(u),
            un_cover(u, end_cover_kg(r)));
    for (int t = 0; t < pb->n_weeks; t++) {
        fprintf(fp, "%s{\"week\": %d, \"grazing\": {", t ? ", " : "", t + 1);
        int first = 1;
        for (int p = 0; p < pb->n_paddocks; p++) {
            int d = r->opt.days[((size_t)z->mob * pb->n_paddocks + p) * pb->n_weeks + t];
            if (d > 0)
                fprintf(fp, "%s\"%s\": %d", first ? "" : ", ", pb->pd[p].id, d), first = 0;
        }
        fprintf(fp, "}, \"supplement_%s\": %.3f, \"mow\": [", un_mass_key(u),
                un_mass(u, r->opt.supplement_t[(size_t)z->mob * pb->n_weeks + t]));
        first = 1;
        for (int p = 0; p < pb->n_paddocks; p++)
            if (r->opt.mow[(size_t)p * pb->n_weeks + t])
                fprintf(fp, "%s\"%s\"", first ? "" : ", ", pb->pd[p].id), first = 0;
        fputs("]}", fp);
    }
    fprintf(fp, "]},\n     \"baseline\": {\"supplement_%s\": %.3f, \"mowed_%s\": %.2f, \"moves\": %d, \"cost\": %.2f}",
            un_mass_key(u), un_mass(u, r->vbase.supplement_t), un_area_key(u), un_area(u, r->vbase.mowed_ha),
            r->vbase.moves, r->vbase.cost_total);
}

static void json_head(FILE *fp, const capa_out *z)
{
    char a[11];
    int u = z->units;
    tcal_format_date(z->s->plan.start_day, a);
    fprintf(fp, "{\n  \"mob\": \"%s\",\n  \"start\": \"%s\",\n  \"weeks\": %d,\n  \"units\": \"%s\",\n  \"limits\": {",
            z->s->mobs[z->mob].id, a, z->s->plan.weeks, u == SITE_UNITS_US ? "us" : "metric");
    if (z->o->limit_supplement)
        fprintf(fp, "\"supplement_%s\": %.3f", un_mass_key(u), un_mass(u, z->o->max_supplement_t));
    if (z->o->limit_mowing)
        fprintf(fp, "%s\"mowed_%s\": %.2f", z->o->limit_supplement ? ", " : "", un_area_key(u),
                un_area(u, z->o->max_mowed_ha));
    if (z->o->limit_shortfall)
        fprintf(fp, ", \"terminal_shortfall_%s\": %.3f", un_mass_key(u), un_mass(u, z->o->max_shortfall_t));
    fputs("},\n  \"percentiles\": [\n", fp);
}

static void json_pct(FILE *fp, const capa_out *z, int i)
{
    int u = z->units;
    {
        const cap_result *r = &z->res[i];
        const cap_probe *next = probe_at(r, r->head + 1);
        fprintf(fp, "    {\"percentile\": %d, \"capacity_head\": %d, \"settled\": %s, \"next_head\": %d, "
                    "\"next_verdict\": \"%s\",\n     \"decisions\": [",
                z->o->pct[i], r->head, r->settled ? "true" : "false", r->head + 1,
                next ? verdict_key(next->verdict) : "not_tried");
        for (int k = 0; k < r->n_probes; k++) {
            const cap_probe *pr = &r->probe[k];
            fprintf(fp, "%s{\"head\": %d, \"verdict\": \"%s\"", k ? ", " : "", pr->head, verdict_key(pr->verdict));
            if (pr->verdict == CAP_CARRIED)
                fprintf(fp, ", \"supplement_%s\": %.3f, \"mowed_%s\": %.2f", un_mass_key(u),
                        un_mass(u, pr->supplement_t), un_area_key(u), un_area(u, pr->mowed_ha));
            if (pr->verdict == CAP_NOT_PROVEN && isfinite(pr->bound_supplement_t))
                fprintf(fp, ", \"bound_supplement_%s\": %.3f", un_mass_key(u), un_mass(u, pr->bound_supplement_t));
            fputc('}', fp);
        }
        fputc(']', fp);
        if (r->head > 0)
            json_plan(fp, z, r);
        fputc('}', fp);
    }
}

/* ---- running ------------------------------------------------------------ */

static int find_mob(const site *s, const char *id, rg_err *err)
{
    if (!id)
        return 0;
    const char *cands[256];
    size_t n = 0;
    for (int m = 0; m < s->n_mobs; m++) {
        if (strcmp(s->mobs[m].id, id) == 0)
            return m;
        if (n < 256)
            cands[n++] = s->mobs[m].id;
    }
    const char *near = rg_suggest(id, cands, n);
    rg_fail(err, "capacity: --mob: %s has no mob \"%s\"%s%s%s", s->path, id, near ? " (did you mean \"" : "",
            near ? near : "", near ? "\"?)" : "");
    return -1;
}

/* What one percentile leaves: its exit code and message, and its section
 * of the output as text. */
typedef struct capa_sec {
    int rc;
    char msg[768];
    char *text;
    size_t len;
} capa_sec;

/* Searches percentile i and renders its section into sec (in memory). */
static void solve_pct(capa_out *z, const site *s, const wx_set *wx, const cap_options *co, int i, capa_sec *sec)
{
    rg_err err = {{0}};
    plan_problem pb;
    sec->rc = plan_build(s, wx, s->plan.start_day, s->plan.weeks, z->o->pct[i], &pb, &err);
    if (sec->rc == RG_EXIT_OK) {
        sec->rc = cap_search(&pb, co, &z->res[i], &err);
        plan_problem_free(&pb);
    }
    if (sec->rc == RG_EXIT_OK) {
        FILE *fp = open_memstream(&sec->text, &sec->len);
        if (!fp) {
            sec->rc = RG_EXIT_RUNTIME;
            rg_fail(&err, "out of memory");
        } else {
            if (z->o->format == CLI_CSV)
                csv_pct(fp, z, i);
            else if (z->o->format == CLI_JSON)
                json_pct(fp, z, i);
            else
                table_pct(fp, z, i);
            if (fclose(fp) != 0) {
                sec->rc = RG_EXIT_RUNTIME;
                rg_fail(&err, "out of memory");
            }
        }
    }
    snprintf(sec->msg, sizeof sec->msg, "%s", err.msg);
    cap_free(&z->res[i]);
}

/* The forkrun context: what every percentile's search reads. */
typedef struct capa_run {
    capa_out *z;
    site *s;
    wx_set *wx;
    const cap_options *co;
} capa_run;

/* forkrun task: searches percentile i and writes its exit code and
 * message, then its section's text. */
static void task_pct(void *ctx, int i, FILE *out)
{
    capa_run *r = ctx;
    capa_sec sec = {0};
    solve_pct(r->z, r->s, r->wx, r->co, i, &sec);
    fwrite(&sec.rc, sizeof sec.rc, 1, out);
    fwrite(sec.msg, sizeof sec.msg, 1, out);
    if (sec.len)
        fwrite(sec.text, 1, sec.len, out);
    free(sec.text);
}

static void task_release(void *ctx)
{
    capa_run *r = ctx;
    free(r->z);
    cli_unload(r->s, r->wx);
}

/* Reads a task's bytes back into sec (or says it ended without them). */
static void take_pct(const fr_result *res, capa_sec *sec)
{
    size_t head = sizeof sec->rc + sizeof sec->msg;
    memset(sec, 0, sizeof *sec);
    if (res->ok && res->len >= head) {
        memcpy(&sec->rc, res->data, sizeof sec->rc);
        memcpy(sec->msg, res->data + sizeof sec->rc, sizeof sec->msg);
        sec->msg[sizeof sec->msg - 1] = '\0';
        sec->len = res->len - head;
        sec->text = sec->len ? malloc(sec->len) : NULL;
        if (!sec->len || sec->text) {
            if (sec->len)
                memcpy(sec->text, res->data + head, sec->len);
            return;
        }
        memset(sec, 0, sizeof *sec);
    }
    sec->rc = RG_EXIT_RUNTIME;
    snprintf(sec->msg, sizeof sec->msg, "the process searching one percentile ended without a result");
}

/* Every percentile: one child each, at most as many at once as there are
 * online cores, collected in order; with one core, here in turn
 * (forkrun.h). */
static void solve_all(capa_out *z, site *s, wx_set *wx, const cap_options *co, capa_sec *sec)
{
    capa_run run = {z, s, wx, co};
    fr_result res[3];
    int n = z->o->n_pct;
    fr_run(n, fr_jobs(0), task_pct, task_release, &run, res);
    for (int i = 0; i < n; i++) {
        take_pct(&res[i], &sec[i]);
        free(res[i].data);
    }
}

static int emit(const capa_out *z, const capa_sec *sec, rg_err *err)
{
    const capa_opts *o = z->o;
    textfile_out out;
    FILE *fp = cli_out_begin(o->out_path, &out, err);
    if (!fp)
        return RG_EXIT_RUNTIME;
    if (o->format == CLI_CSV)
        csv_head(fp, z);
    else if (o->format == CLI_JSON)
        json_head(fp, z);
    else
        table_head(fp, z);
    for (int i = 0; i < o->n_pct; i++) {
        fwrite(sec[i].text, 1, sec[i].len, fp);
        if (o->format == CLI_JSON)
            fputs(i + 1 < o->n_pct ? ",\n" : "\n", fp);
    }
    if (o->format == CLI_JSON)
        fputs("  ]\n}\n", fp);
    else if (o->format == CLI_TABLE)
        table_foot(fp);
    return cli_out_end(o->out_path, &out, err);
}

static int run(capa_out *z, site *s, wx_set *wx, rg_err *err)
{
    const capa_opts *o = z->o;
    if (o->start_day != INT64_MIN)
        s->plan.start_day = o->start_day;
    if (o->weeks)
        s->plan.weeks = o->weeks;
    if (s->plan.start_day == INT64_MIN)
        return rg_fail(err, "%s: no plan start: give --start DATE or $.plan.start", s->path), RG_EXIT_INPUT;
    z->mob = find_mob(s, o->mob_id, err);
    if (z->mob < 0)
        return RG_EXIT_INPUT;
    cap_options co = {.mob = z->mob, .intake_kgdm_d = s->mobs[z->mob].intake_kgdm_d,
                      .head0 = s->mobs[z->mob].head, .limit_supplement = o->limit_supplement,
                      .limit_mowing = o->limit_mowing, .max_supplement_t = o->max_supplement_t,
                      .max_mowed_ha = o->max_mowed_ha, .limit_shortfall = o->limit_shortfall,
                      .max_shortfall_t = o->max_shortfall_t, .time_limit_s = o->time_limit_s, .gap = o->gap / 100.0,
                      .progress = isatty(STDERR_FILENO)};
    capa_sec sec[3];
    memset(sec, 0, sizeof sec);
    solve_all(z, s, wx, &co, sec);
    int rc = RG_EXIT_OK;
    for (int i = 0; i < o->n_pct && rc == RG_EXIT_OK; i++)
        if (sec[i].rc != RG_EXIT_OK) {
            rc = sec[i].rc;
            rg_fail(err, "%s", sec[i].msg);
        }
    if (rc == RG_EXIT_OK)
        rc = emit(z, sec, err);
    for (int i = 0; i < 3; i++)
        free(sec[i].text);
    return rc;
}

int cmd_capacity(int argc, char **argv)
{
    capa_opts o;
    int p = parse_opts(argc, argv, &o);
    if (p != 0)
        return p > 0 ? RG_EXIT_OK : RG_EXIT_INPUT;
    site s;
    wx_set wx;
    if (cli_load(o.site_path, o.models, &s, &wx) != RG_EXIT_OK)
        return RG_EXIT_INPUT;
    capa_out *z = calloc(1, sizeof *z);
    rg_err err = {{0}};
    int rc;
    if (!z)
        rc = cli_finish((rg_fail(&err, "out of memory"), RG_EXIT_RUNTIME), &err);
    else {
        z->o = &o;
        z->s = &s;
        z->units = o.units >= 0 ? o.units : s.units;
        rc = cli_finish(run(z, &s, &wx, &err), &err);
    }
    free(z);
    cli_unload(&s, &wx);
    return rc;
}
