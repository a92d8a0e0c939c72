/* cmd_walksheet.c - `rowgraze walk-sheet`: the sheet to take on a pasture
 * walk (output stage).
 *
 * Lists the paddocks in walking order (the site file's order, which the
 * farm sets to match its route) with what is known of each on the walk
 * date: the last walk record, the cover predicted for the day (the record
 * carried forward by growth and recorded grazing, planhist.h), when its
 * rest ends, and blank columns for the new reading.  --format csv writes
 * the same rows as a walk-records file (docs/records.md) with the paddock
 * and date filled in, so the filled sheet is the next --walk file.
 */
#include <getopt.h>
#include <stdint.h>
#include <stdio.h>
#include <string.h>

#include "cli.h"
#include "diag.h"
#include "planhist.h"
#include "records.h"
#include "site.h"
#include "tcal.h"
#include "units.h"

typedef struct sheet_opts {
    const char *models, *out_path, *site_path, *walk_path, *grazed_path;
    int64_t day;
    int format, units, percentile;
} sheet_opts;

static void help(void)
{
    puts("usage: rowgraze walk-sheet [OPTIONS] SITE.json\n\n"
         "Prints the sheet for a pasture walk: every paddock in walking order (the site\n"
         "file's order) with its last measurement, the cover and height predicted for\n"
         "the walk date from that record, growth and recorded grazing, the day its rest\n"
         "ends, and blank columns to write the new reading in.  With --format csv the\n"
         "sheet is a walk-records file to fill in and give back to `plan --walk`.\n\n"
         "Options:\n"
         "  --date DATE          the walk date (default: $.plan.start)\n"
         "  --walk FILE.csv      earlier walk records\n"
         "  --grazed FILE.csv    grazing records since them\n"
         "  --percentile P       growth forecast for days the weather files lack:\n"
         "                       10, 50 (default) or 90\n"
         "  --format FORMAT      table (default) or csv\n"
         "  --units U            metric or us (default: $.units)\n"
         "  --out FILE           write to FILE (atomically) instead of stdout\n"
         "  --models DIR         sward parameter sets\n"
         "  -h, --help           show this help\n\n"
         "Exit status: 0 ok, 1 runtime failure, 2 bad input or usage.");
}

static int parse_opts(int argc, char **argv, sheet_opts *o)
{
    static const struct option opts[] = {
        {"date", required_argument, 0, 'd'}, {"walk", required_argument, 0, 'W'},
        {"grazed", required_argument, 0, 'G'}, {"percentile", required_argument, 0, 'p'},
        {"format", required_argument, 0, 'F'}, {"units", required_argument, 0, 'u'},
        {"out", required_argument, 0, 'o'}, {"models", required_argument, 0, 'm'},
        {"help", no_argument, 0, 'h'}, {0, 0, 0, 0}};
    *o = (sheet_opts){.day = INT64_MIN, .units = -1, .percentile = 50};
    int ch;
    optind = 1;
    opterr = 0;
    while ((ch = getopt_long(argc, argv, "h", opts, NULL)) != -1) {
        switch (ch) {
        case 'h': help(); return 1;
        case 'd':
            if (cli_date("walk-sheet", "--date", optarg, &o->day) < 0)
                return -1;
            break;
        case 'W': o->walk_path = optarg; break;
        case 'G': o->grazed_path = optarg; break;
        case 'p':
            if (strcmp(optarg, "10") && strcmp(optarg, "50") && strcmp(optarg, "90"))
                return cli_usage_error("walk-sheet", "walk-sheet: --percentile: expected 10, 50 or 90, found \"%s\"", optarg), -1;
            o->percentile = optarg[0] == '1' ? 10 : optarg[0] == '5' ? 50 : 90;
            break;
        case 'F':
            if (cli_format("walk-sheet", optarg, &o->format) < 0)
                return -1;
            if (o->format == CLI_JSON)
                return cli_usage_error("walk-sheet", "walk-sheet: --format: expected table or csv, found \"json\""), -1;
            break;
        case 'u':
            if (un_parse(optarg, &o->units) < 0)
                return cli_usage_error("walk-sheet", "walk-sheet: --units: expected metric or us, found \"%s\"", optarg), -1;
            break;
        case 'o': o->out_path = optarg; break;
        case 'm': o->models = optarg; break;
        default:
            return cli_usage_error("walk-sheet", "walk-sheet: unknown option or missing value: '%s'", argv[optind - 1]), -1;
        }
    }
    if (argc - optind != 1)
        return cli_usage_error("walk-sheet", "walk-sheet: expected one site file, found %d arguments", argc - optind), -1;
    o->site_path = argv[optind];
    return 0;
}

/* Predicted cover of paddock i on the walk day, kg DM/ha: the carried
 * record, else the site's start cover, else residual + 1/3 to the ceiling
 * (planbuild.c's default). */
static double predicted(const site *s, const ph_state *h, int i)
{
    if (h->pd[i].source != PH_DEFAULT)
        return h->pd[i].cover_kgdm_ha;
    if (s->paddocks[i].start_cover_kgdm_ha >= 0)
        return s->paddocks[i].start_cover_kgdm_ha;
    const sward_params *sw = &s->swards[s->paddocks[i].sward].p;
    double r = sward_cover_kgdm_ha(sw, s->rules.residual_height_cm);
    double c = sward_cover_kgdm_ha(sw, s->rules.ceiling_height_cm);
    return r + (c - r) / 3.0;
}

static void table(FILE *fp, const site *s, const ph_state *h, const sheet_opts *o)
{
    char day[11], a[11];
    int u = o->units;
    tcal_format_date(o->day, day);
    fprintf(fp, "Pasture walk sheet: %s, %s\n", s->name, day);
    fprintf(fp, "Predicted = last reading carried forward by growth and recorded grazing\n"
                "(est. = no reading: a default).  Covers in %s, heights in %s.\n\n",
            un_cover_name(u), un_height_name(u));
    fprintf(fp, "%-8s %-5s %-10s %7s %6s  %7s %6s  %-10s | %-8s %-7s %s\n", "paddock", "block",
            "last walk", "cover", "height", "predict", "height", "rest ends", "height", "method", "notes");
    for (int i = 0; i < s->n_paddocks; i++) {
        const site_paddock *sp = &s->paddocks[i];
        const sward_params *sw = &s->swards[sp->sward].p;
        const ph_paddock *q = &h->pd[i];
        double kg = predicted(s, h, i);
        fprintf(fp, "%-8s %-5s ", sp->id, sp->block[0] ? sp->block : "-");
        if (q->walk_day != INT64_MIN) {
            tcal_format_date(q->walk_day, a);
            fprintf(fp, "%-10s %7.0f %6.1f  ", a, un_cover(u, q->walk_kgdm_ha),
                    un_height(u, sward_height_cm(sw, q->walk_kgdm_ha)));
        } else {
            fprintf(fp, "%-10s %7s %6s  ", "none", "-", "-");
        }
        fprintf(fp, "%7.0f %6.1f%s ", un_cover(u, kg), un_height(u, sward_height_cm(sw, kg)),
                q->source == PH_DEFAULT ? "*" : " ");
        if (q->may_graze_day != INT64_MIN && q->may_graze_day > o->day) {
            tcal_format_date(q->may_graze_day, a);
            fprintf(fp, "%-10s", a);
        } else {
            fprintf(fp, "%-10s", "-");
        }
        fprintf(fp, " | ________ _______ __________\n");
    }
    fprintf(fp, "\n* est.: no walk record; measure it.  Method: stick, plate or visual.\n"
                "Cautions: keep clear of inverters, combiner boxes and cables; do not touch\n"
                "damaged modules or cables (PV arrays are live whenever light falls on them);\n"
                "follow the site's safety rules and sign-in procedure.\n");
}

/* A walk-records file (docs/records.md) to fill in: paddock and date given. */
static void csv(FILE *fp, const site *s, const ph_state *h, const sheet_opts *o)
{
    char day[11];
    tcal_format_date(o->day, day);
    fprintf(fp, "# Pasture walk %s, %s: fill height_cm (or cover_kgdm_ha) and method for each\n"
                "# paddock walked; delete rows not walked.  Give the file back with plan --walk.\n",
            day, s->name);
    fputs("paddock,date,height_cm,cover_kgdm_ha,method,note\n", fp);
    for (int i = 0; i < s->n_paddocks; i++) {
        const sward_params *sw = &s->swards[s->paddocks[i].sward].p;
        double kg = predicted(s, h, i);
        fprintf(fp, "%s,%s,,,,predicted %.0f kg DM/ha (%.1f cm)%s\n", s->paddocks[i].id, day, kg,
                sward_height_cm(sw, kg), h->pd[i].source == PH_DEFAULT ? " estimated" : "");
    }
}

static int run(const sheet_opts *o, site *s, const wx_set *wx, rg_err *err)
{
    rec_walks walks = {0};
    rec_grazes grazes = {0};
    /* records may fall on the walk day itself: they must not be after it */
    int rc = RG_EXIT_OK;
    rec_plate plate = rec_plate_of(s);
    if ((o->walk_path && rec_walk_load(s, &plate, o->day + 1, o->walk_path, &walks, err) < 0) ||
        (o->grazed_path && rec_graze_load(s, o->day, o->grazed_path, &grazes, err) < 0))
        rc = RG_EXIT_INPUT;
    ph_state h = {0};
    if (rc == RG_EXIT_OK)
        rc = ph_build(s, wx, o->walk_path ? &walks : NULL, o->grazed_path ? &grazes : NULL, o->day,
                      o->percentile, &h, err);
    if (rc == RG_EXIT_OK) {
        textfile_out out;
        FILE *fp = cli_out_begin(o->out_path, &out, err);
        if (!fp) {
            rc = RG_EXIT_RUNTIME;
        } else {
            if (o->format == CLI_CSV)
                csv(fp, s, &h, o);
            else
                table(fp, s, &h, o);
            rc = cli_out_end(o->out_path, &out, err);
        }
    }
    ph_free(&h);
    rec_walk_free(&walks);
    rec_graze_free(&grazes);
    return rc;
}

int cmd_walksheet(int argc, char **argv)
{
    sheet_opts o;
    int p = parse_opts(argc, argv, &o);
    if (p != 0)
        return p > 0 ? RG_EXIT_OK : RG_EXIT_INPUT;
    site s;
    wx_set wx;
    if (cli_load(o.site_path, o.models, &s, &wx) != RG_EXIT_OK)
        return RG_EXIT_INPUT;
    rg_err err = {{0}};
    if (o.units < 0)
        o.units = s.units;
    if (o.day == INT64_MIN)
        o.day = s.plan.start_day;
    int rc = o.day == INT64_MIN
                 ? (rg_fail(&err, "%s: no walk date: give --date DATE or $.plan.start", s.path), RG_EXIT_INPUT)
                 : run(&o, &s, &wx, &err);
    rc = cli_finish(rc, &err);
    cli_unload(&s, &wx);
    return rc;
}
