/* cmd_strips.c - `rowgraze strips`: what the pasture experiences across
 * one tracker row (output stage for the microclimate engine).
 *
 * Loads the site and weather, runs micro.c over the chosen dates for each
 * weather series, and prints either the per-strip summary (one row per
 * strip plus an open-field reference row) or, with --hourly, one line per
 * hour and strip.  Formats: an aligned table for people (fits 100
 * columns), CSV, JSON.  --out writes atomically to a file instead of
 * stdout.
 */
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cli.h"
#include "diag.h"
#include "micro.h"
#include "pasture.h"
#include "site.h"
#include "tcal.h"
#include "textfile.h"
#include "weather.h"

typedef struct strips_opts {
    const char *models, *out_path, *site_path;
    int64_t from_day, to_day;   /* inclusive; INT64_MIN/MAX when open */
    int format, hourly;
} strips_opts;

static void help(void)
{
    puts("usage: rowgraze strips [OPTIONS] SITE.json\n\n"
         "Light, rain, leaf temperature and leaf VPD across one row pitch, strip by\n"
         "strip, computed hour by hour from the array geometry and the weather.\n\n"
         "Options:\n"
         "  --from DATE        first day (YYYY-MM-DD), default: start of the weather\n"
         "  --to DATE          last day (YYYY-MM-DD), default: end of the weather\n"
         "  --format FORMAT    table (default), csv or json\n"
         "  --hourly           one line per hour and strip instead of the summary\n"
         "  --out FILE         write to FILE (atomically) instead of stdout\n"
         "  --models DIR       sward parameter sets (default: $ROWGRAZE_MODELS or the\n"
         "                     models/ directory rowgraze was built with)\n"
         "  -h, --help         show this help\n\n"
         "Summary columns: strip, offset_m (+ towards the sunrise side), side (under,\n"
         "am-edge, pm-edge, open), light_share, light_am_share, rain_share,\n"
         "leaf_temp_c, leaf_vpd_kpa (light-weighted daytime means); the last row\n"
         "(strip 'ref') is open ground outside the array; growth_kgdm_ha and\n"
         "water_stress_days come from the soil water and growth of the soil and sward\n"
         "of the paddock with most ground under the array, started at field capacity\n"
         "on --from and averaged over the years run.\n"
         "Exit status: 0 ok, 1 runtime failure, 2 bad input or usage.");
}

static int parse_opts(int argc, char **argv, strips_opts *o)
{
    static const struct option opts[] = {
        {"from", required_argument, 0, 'f'}, {"to", required_argument, 0, 't'},
        {"format", required_argument, 0, 'F'}, {"hourly", no_argument, 0, 'H'},
        {"out", required_argument, 0, 'o'}, {"models", required_argument, 0, 'm'},
        {"help", no_argument, 0, 'h'}, {0, 0, 0, 0}};
    *o = (strips_opts){.from_day = INT64_MIN, .to_day = INT64_MAX};
    int ch;
    optind = 1;
    opterr = 0; /* our own one-line message instead of getopt's */
    while ((ch = getopt_long(argc, argv, "h", opts, NULL)) != -1) {
        switch (ch) {
        case 'h': help(); return 1;
        case 'f': if (cli_date("strips", "--from", optarg, &o->from_day) < 0) return -1; break;
        case 't': if (cli_date("strips", "--to", optarg, &o->to_day) < 0) return -1; break;
        case 'H': o->hourly = 1; break;
        case 'o': o->out_path = optarg; break;
        case 'm': o->models = optarg; break;
        case 'F': if (cli_format("strips", optarg, &o->format) < 0) return -1; break;
        default: return cli_usage_error("strips", "strips: unknown option or missing value: '%s'", argv[optind - 1]), -1;
        }
    }
    if (argc - optind != 1)
        return cli_usage_error("strips", "strips: expected one site file, found %d arguments", argc - optind), -1;
    if (o->from_day != INT64_MIN && o->to_day != INT64_MAX && o->to_day < o->from_day)
        return cli_usage_error("strips", "strips: --to: expected a date on or after --from"), -1;
    o->site_path = argv[optind];
    return 0;
}

/* ---- formatting --------------------------------------------------------- */

/* A number, or "na" (JSON: null) when not finite.  f is one printf
 * conversion with optional literal text around it; in a table, "na" is
 * right-aligned to the conversion's width and keeps the text. */
static void num(FILE *fp, int format, const char *f, double x)
{
    if (isfinite(x)) {
        fprintf(fp, f, x);
        return;
    }
    const char *pct = strchr(f, '%');
    const char *conv = pct ? strpbrk(pct, "fgeE") : NULL;
    if (!pct || !conv) {
        fputs(format == CLI_JSON ? "null" : "na", fp);
        return;
    }
    fprintf(fp, "%.*s", (int)(pct - f), f);
    if (format == CLI_TABLE)
        fprintf(fp, "%*s", atoi(pct + 1), "na");
    else
        fputs(format == CLI_JSON ? "null" : "na", fp);
    fputs(conv + 1, fp);
}

/* A JSON string literal (RFC 8259 section 7 escapes). */
static void json_str(FILE *fp, const char *s)
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

/* Per column (strips, then open ground): mean yearly growth and water
 * stress days from the growth stage, NaN when not computed. */
typedef struct strip_growth {
    double *kg, *stress;
} strip_growth;

static void summary_table(FILE *fp, const mc_strip_summary *rows, int n, const strip_growth *g)
{
    /* each column's name is its two header lines joined by '_' */
    fprintf(fp, "%5s %6s %-7s %5s %8s %5s %6s %7s %7s %11s\n", "", "offset", "", "light",
            "light_am", "rain", "leaf", "leaf", "growth", "water");
    fprintf(fp, "%5s %6s %-7s %5s %8s %5s %6s %7s %7s %11s\n", "strip", "m", "side", "share",
            "share", "share", "temp_c", "vpd_kpa", "kgdm_ha", "stress_days");
    for (int i = 0; i <= n; i++) {
        const mc_strip_summary *r = &rows[i];
        if (i < n)
            fprintf(fp, "%5d %6.2f %-7s", r->strip, r->offset_m, mc_side_name(r->side));
        else
            fprintf(fp, "%5s %6s %-7s", "ref", "na", "field");
        num(fp, CLI_TABLE, " %5.2f", r->light_share);
        num(fp, CLI_TABLE, " %8.2f", r->light_am_share);
        num(fp, CLI_TABLE, " %5.2f", r->rain_share);
        num(fp, CLI_TABLE, " %6.1f", r->leaf_temp_c);
        num(fp, CLI_TABLE, " %7.2f", r->leaf_vpd_kpa);
        num(fp, CLI_TABLE, " %7.0f", g->kg[i]);
        num(fp, CLI_TABLE, " %11.0f", g->stress[i]);
        fputc('\n', fp);
    }
}

static void summary_csv(FILE *fp, const mc_strip_summary *rows, int n, const strip_growth *g)
{
    fputs("strip,offset_m,side,light_share,light_am_share,rain_share,leaf_temp_c,leaf_vpd_kpa,"
          "growth_kgdm_ha,water_stress_days\n", fp);
    for (int i = 0; i <= n; i++) {
        const mc_strip_summary *r = &rows[i];
        if (i < n)
            fprintf(fp, "%d,%.3f,%s,", r->strip, r->offset_m, mc_side_name(r->side));
        else
            fputs("ref,na,field,", fp);
        num(fp, CLI_CSV, "%.4f,", r->light_share);
        num(fp, CLI_CSV, "%.4f,", r->light_am_share);
        num(fp, CLI_CSV, "%.4f,", r->rain_share);
        num(fp, CLI_CSV, "%.2f,", r->leaf_temp_c);
        num(fp, CLI_CSV, "%.3f,", r->leaf_vpd_kpa);
        num(fp, CLI_CSV, "%.1f,", g->kg[i]);
        num(fp, CLI_CSV, "%.1f", g->stress[i]);
        fputc('\n', fp);
    }
}

static void json_row(FILE *fp, const mc_strip_summary *r, int is_ref, double kg, double stress)
{
    if (is_ref)
        fputs("{\"strip\": \"ref\", \"offset_m\": null, \"side\": \"field\"", fp);
    else
        fprintf(fp, "{\"strip\": %d, \"offset_m\": %.3f, \"side\": \"%s\"", r->strip, r->offset_m,
                mc_side_name(r->side));
    fputs(", \"light_share\": ", fp);
    num(fp, CLI_JSON, "%.4f", r->light_share);
    fputs(", \"light_am_share\": ", fp);
    num(fp, CLI_JSON, "%.4f", r->light_am_share);
    fputs(", \"rain_share\": ", fp);
    num(fp, CLI_JSON, "%.4f", r->rain_share);
    fputs(", \"leaf_temp_c\": ", fp);
    num(fp, CLI_JSON, "%.2f", r->leaf_temp_c);
    fputs(", \"leaf_vpd_kpa\": ", fp);
    num(fp, CLI_JSON, "%.3f", r->leaf_vpd_kpa);
    fputs(", \"growth_kgdm_ha\": ", fp);
    num(fp, CLI_JSON, "%.1f", kg);
    fputs(", \"water_stress_days\": ", fp);
    num(fp, CLI_JSON, "%.1f", stress);
    fputc('}', fp);
}

static void summary_json(FILE *fp, const site *s, const mc_result *res, int nres,
                         const mc_strip_summary *rows, int n, const strip_growth *g)
{
    size_t hours = 0;
    for (int j = 0; j < nres; j++)
        hours += res[j].n_hours;
    char a[17], b[17];
    tcal_format_hour(res[0].t0_h, a);
    tcal_format_hour(res[nres - 1].t0_h + (int64_t)res[nres - 1].n_hours - 1, b);
    fputs("{\n  \"site\": ", fp);
    json_str(fp, s->name);
    fprintf(fp, ",\n  \"first_hour\": \"%s\",\n  \"last_hour\": \"%s\",\n"
                "  \"hours\": %zu,\n  \"pitch_m\": %.3f,\n  \"strips\": [\n",
            a, b, hours, s->array.pitch_m);
    for (int i = 0; i < n; i++) {
        fputs("    ", fp);
        json_row(fp, &rows[i], 0, g->kg[i], g->stress[i]);
        fputs(i + 1 < n ? ",\n" : "\n", fp);
    }
    fputs("  ],\n  \"open_field\": ", fp);
    json_row(fp, &rows[n], 1, g->kg[n], g->stress[n]);
    fputs("\n}\n", fp);
}

/* One hour, one strip (or the reference when strip < 0). */
static void hourly_line(FILE *fp, int format, const mc_result *r, size_t k, int strip, int first)
{
    char t[17];
    tcal_format_hour(r->t0_h + (int64_t)k, t);
    ptrdiff_t lit = mc_lit_at(r, k); /* -1 at night: no light, no leaf T or VPD */
    ptrdiff_t wet = mc_rain_at(r, k); /* -1: a dry hour */
    double light = strip < 0 ? r->ghi_w_m2[k] : lit < 0 ? 0.0 : r->sw_w_m2[lit + strip];
    double rain = strip < 0 ? r->rain_mm[k] : wet < 0 ? 0.0 : r->rain_strip_mm[wet + strip];
    double leaf = strip < 0 ? r->open_leaf_c[k] : lit < 0 ? (double)NAN : r->leaf_c[lit + strip];
    double vpd = strip < 0 ? r->open_vpd_kpa[k] : lit < 0 ? (double)NAN : r->vpd_kpa[lit + strip];
    if (format == CLI_JSON) {
        fprintf(fp, "%s\n  {\"timestamp\": \"%s\", \"sun_zenith_deg\": %.3f, \"sun_azimuth_deg\": %.3f, "
                    "\"tracker_deg\": %.2f, \"strip\": ",
                first ? "" : ",", t, r->zenith_deg[k], r->azimuth_deg[k], r->tracker_deg[k]);
        if (strip < 0)
            fputs("\"ref\", \"offset_m\": null", fp);
        else
            fprintf(fp, "%d, \"offset_m\": %.3f", strip, r->offset_m[strip]);
        fprintf(fp, ", \"light_w_m2\": %.1f, \"rain_mm\": %.3f, \"leaf_temp_c\": ", light, rain);
        num(fp, CLI_JSON, "%.2f", leaf);
        fputs(", \"leaf_vpd_kpa\": ", fp);
        num(fp, CLI_JSON, "%.3f", vpd);
        fputc('}', fp);
        return;
    }
    const char *f = format == CLI_CSV ? "%s,%.3f,%.3f,%.2f," : "%-16s %7.2f %7.2f %7.1f ";
    fprintf(fp, f, t, r->zenith_deg[k], r->azimuth_deg[k], r->tracker_deg[k]);
    if (strip < 0)
        fputs(format == CLI_CSV ? "ref,na," : "  ref       na ", fp);
    else
        fprintf(fp, format == CLI_CSV ? "%d,%.3f," : "%5d %8.2f ", strip, r->offset_m[strip]);
    fprintf(fp, format == CLI_CSV ? "%.1f,%.3f," : "%10.1f %7.2f ", light, rain);
    num(fp, format, format == CLI_CSV ? "%.2f," : "%11.1f ", leaf);
    num(fp, format, format == CLI_CSV ? "%.3f" : "%12.2f", vpd);
    fputc('\n', fp);
}

static void hourly(FILE *fp, int format, const mc_result *res, int nres)
{
    if (format == CLI_JSON)
        fputs("[", fp);
    else if (format == CLI_CSV)
        fputs("timestamp,sun_zenith_deg,sun_azimuth_deg,tracker_deg,strip,offset_m,light_w_m2,rain_mm,leaf_temp_c,leaf_vpd_kpa\n", fp);
    else
        fprintf(fp, "%-16s %7s %7s %7s %5s %8s %10s %7s %11s %12s\n", "timestamp", "zenith", "azimuth",
                "tracker", "strip", "offset_m", "light_w_m2", "rain_mm", "leaf_temp_c", "leaf_vpd_kpa");
    int first = 1;
    for (int j = 0; j < nres; j++)
        for (size_t k = 0; k < res[j].n_hours; k++) {
            for (int i = 0; i < res[j].n_strips; i++, first = 0)
                hourly_line(fp, format, &res[j], k, i, first);
            hourly_line(fp, format, &res[j], k, -1, 0);
        }
    if (format == CLI_JSON)
        fputs("\n]\n", fp);
}

/* ---- running ------------------------------------------------------------ */

/* Hours of series w inside the options' dates: [*from, *from + *n). */
static void window(const wx_series *w, const strips_opts *o, size_t *from, size_t *n)
{
    int64_t lo = o->from_day == INT64_MIN ? w->t0_h : o->from_day * 24;
    int64_t hi = o->to_day == INT64_MAX ? w->t0_h + (int64_t)w->n : (o->to_day + 1) * 24;
    if (lo < w->t0_h) lo = w->t0_h;
    if (hi > w->t0_h + (int64_t)w->n) hi = w->t0_h + (int64_t)w->n;
    *from = hi > lo ? (size_t)(lo - w->t0_h) : 0;
    *n = hi > lo ? (size_t)(hi - lo) : 0;
}

static int emit(const strips_opts *o, const site *s, const mc_config *c, const mc_result *res,
                int nres, const strip_growth *g, rg_err *err)
{
    int n = c->geom.n_strips;
    mc_strip_summary *rows = NULL;
    if (!o->hourly && (!(rows = calloc((size_t)n + 1, sizeof *rows)) || mc_summarise(c, res, nres, rows) < 0)) {
        free(rows);
        return rg_fail(err, "out of memory"), RG_EXIT_RUNTIME;
    }
    textfile_out out;
    FILE *fp = cli_out_begin(o->out_path, &out, err);
    if (!fp) {
        free(rows);
        return RG_EXIT_RUNTIME;
    }
    if (o->hourly)
        hourly(fp, o->format, res, nres);
    else if (o->format == CLI_JSON)
        summary_json(fp, s, res, nres, rows, n, g);
    else if (o->format == CLI_CSV)
        summary_csv(fp, rows, n, g);
    else
        summary_table(fp, rows, n, g);
    free(rows);
    return cli_out_end(o->out_path, &out, err);
}

/* The paddock with the most ground under the array decides the soil and
 * sward of the growth columns. */
static int main_paddock(const site *s)
{
    int best = 0;
    for (int i = 1; i < s->n_paddocks; i++)
        if (s->paddocks[i].area_ha * s->paddocks[i].array_share >
            s->paddocks[best].area_ha * s->paddocks[best].array_share)
            best = i;
    return best;
}

/* Growth per strip, averaged over the runs (years); NaN where a run does
 * not cover whole days (growth is computed day by day). */
static int strip_growth_run(const site *s, const mc_result *res, int nres, const wx_set *wx,
                            const int *series, strip_growth *g, rg_err *err)
{
    int n = res[0].n_strips + 1;
    g->kg = calloc((size_t)n, sizeof *g->kg);
    g->stress = calloc((size_t)n, sizeof *g->stress);
    if (!g->kg || !g->stress)
        return rg_fail(err, "out of memory");
    const site_paddock *pd = &s->paddocks[main_paddock(s)];
    ps_config pc;
    if (ps_config_make(s, pd->soil, pd->sward, &pc, err) < 0)
        return -1;
    int used = 0;
    for (int j = 0; j < nres; j++) {
        ps_result p;
        if (res[j].t0_h % 24 != 0 || res[j].n_hours % 24 != 0)
            continue; /* growth runs day by day: a run with part days has none */
        if (ps_run(&pc, &res[j], &wx->s[series[j]], &p, err) < 0)
            return -1;
        for (int i = 0; i < n; i++) {
            g->kg[i] += ps_total_kgdm_ha(&p, i, 0, p.n_days);
            g->stress[i] += p.stress_days[i];
        }
        used++;
        ps_free(&p);
    }
    for (int i = 0; i < n; i++) {
        g->kg[i] = used ? g->kg[i] / used : (double)NAN;
        g->stress[i] = used ? g->stress[i] / used : (double)NAN;
    }
    return 0;
}

static int run(const strips_opts *o, const site *s, const wx_set *wx, rg_err *err)
{
    int series[SITE_MAX_FILES];
    strip_growth g = {0};
    mc_config c;
    if (mc_config_from_site(s, &c, err) < 0)
        return RG_EXIT_RUNTIME;
    mc_result *res = calloc((size_t)wx->n, sizeof *res);
    int nres = 0, rc = res ? RG_EXIT_OK : RG_EXIT_RUNTIME;
    for (int j = 0; rc == RG_EXIT_OK && j < wx->n; j++) {
        size_t from, n;
        window(&wx->s[j], o, &from, &n);
        if (n == 0)
            continue;
        if (mc_run(&c, &wx->s[j], from, n, &res[nres], err) < 0)
            rc = RG_EXIT_RUNTIME;
        else
            series[nres++] = j;
    }
    if (rc == RG_EXIT_OK && nres == 0)
        rc = RG_EXIT_INPUT, rg_fail(err, "%s: no weather hours fall between --from and --to", s->path);
    if (rc == RG_EXIT_OK && !o->hourly && strip_growth_run(s, res, nres, wx, series, &g, err) < 0)
        rc = RG_EXIT_RUNTIME;
    if (rc == RG_EXIT_OK)
        rc = emit(o, s, &c, res, nres, &g, err);
    free(g.kg);
    free(g.stress);
    for (int j = 0; j < nres; j++)
        mc_free(&res[j]);
    free(res);
    mc_config_free(&c);
    return rc;
}

int cmd_strips(int argc, char **argv)
{
    strips_opts o;
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
