/* report.c - the grazing-plan report as one self-contained HTML file
 * (output stage; see report.h and docs/report.md).
 *
 * The page is written top to bottom: the job, the site, the row
 * cross-section, the growth forecast, cover over time, the rotation
 * calendar (chart and table), the feed budget, mowing, plan versus
 * baseline, assumptions, cautions.  Figures are inline SVG drawn here from
 * the computed numbers; every coordinate and number is printed with a
 * fixed format, so the same input gives the same bytes.
 */
#include "report.h"

#include <math.h>
#include <stdint.h>
#include <string.h>

#include "tcal.h"
#include "units.h"

#define RPT_PI 3.14159265358979323846

#ifndef RG_VERSION
#define RG_VERSION "0.0.0"
#endif

/* What every section reads. */
typedef struct ctx {
    FILE *fp;
    const rpt_input *in;
    const site *s;
    const plan_problem *pb;
    const pr_run *r;
    int u;                   /* enum site_units */
} ctx;

/* Our palette: mob colours, in mob order (cycled). */
static const char *const mob_colour[] = {"#2f6f73", "#c0763a", "#6c5a9c", "#3f8f5b", "#9c4f6e", "#4a78a8"};
#define N_MOB_COLOURS (sizeof mob_colour / sizeof mob_colour[0])

static const char *const day_name[7] = {"Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"};

/* ---- text and numbers ----------------------------------------------------- */

void rpt_escape(FILE *fp, const char *text)
{
    for (const unsigned char *p = (const unsigned char *)text; *p; p++) {
        switch (*p) {
        case '&': fputs("&amp;", fp); break;
        case '<': fputs("&lt;", fp); break;
        case '>': fputs("&gt;", fp); break;
        case '"': fputs("&quot;", fp); break;
        case '\'': fputs("&#39;", fp); break;
        default:
            if ((*p < 0x20 && *p != '\t' && *p != '\n') || *p == 0x7f)
                fputs("\xef\xbf\xbd", fp);
            else
                fputc(*p, fp);
        }
    }
}

char *rpt_num(char *buf, size_t cap, double x, int decimals, int group)
{
    if (!isfinite(x)) {
        snprintf(buf, cap, "n/a");
        return buf;
    }
    char raw[64];
    snprintf(raw, sizeof raw, "%.*f", decimals, x);
    /* "-0", "-0.0" ... become unsigned */
    if (raw[0] == '-' && strspn(raw + 1, "0.") == strlen(raw + 1))
        memmove(raw, raw + 1, strlen(raw));
    const char *digits = raw[0] == '-' ? raw + 1 : raw;
    size_t whole = strcspn(digits, ".");
    size_t k = 0;
    if (raw[0] == '-' && k + 1 < cap)
        buf[k++] = '-';
    for (size_t i = 0; digits[i] && k + 4 < cap; i++) {
        if (group && i > 0 && i < whole && (whole - i) % 3 == 0) {
            memcpy(buf + k, "\xe2\x80\xaf", 3); /* U+202F narrow no-break space */
            k += 3;
        }
        buf[k++] = digits[i];
    }
    buf[k] = '\0';
    return buf;
}

/* Prints a number: d decimals, grouped. */
static void num(const ctx *c, double x, int d)
{
    char b[80];
    fputs(rpt_num(b, sizeof b, x, d, 1), c->fp);
}

/* Prints a number followed by a no-break space and its unit (none before
 * a degree sign). */
static void numu(const ctx *c, double x, int d, const char *unit)
{
    num(c, x, d);
    if (strcmp(unit, "\xc2\xb0") != 0)
        fputs("\xc2\xa0", c->fp);
    rpt_escape(c->fp, unit);
}

/* A JSON string for the data block: RFC 8259 section 7 escapes, and <, >
 * and & as \u escapes so the text cannot close the <script> element. */
static void json_str(FILE *fp, const char *s)
{
    fputc('"', fp);
    for (const unsigned char *p = (const unsigned char *)s; *p; p++) {
        if (*p == '"' || *p == '\\')
            fprintf(fp, "\\%c", *p);
        else if (*p < 0x20 || *p == '<' || *p == '>' || *p == '&')
            fprintf(fp, "\\u%04x", *p);
        else
            fputc(*p, fp);
    }
    fputc('"', fp);
}

/* An SVG coordinate or length: one decimal, never "-0.0". */
static void co(FILE *fp, double x)
{
    char b[80];
    fputs(rpt_num(b, sizeof b, x, 1, 0), fp);
}

/* Prints fmt with each "@" replaced by the next coordinate (one decimal). */
static void svgf(FILE *fp, const char *fmt, int n, const double *v)
{
    int k = 0;
    for (const char *p = fmt; *p; p++) {
        if (*p == '@' && k < n)
            co(fp, v[k++]);
        else
            fputc(*p, fp);
    }
}

static void date_text(int64_t day, char out[16])
{
    char a[11];
    tcal_format_date(day, a);
    snprintf(out, 16, "%s", a);
}

/* Weekday (0 = Monday) of a day number: 1970-01-01 was a Thursday. */
static int weekday(int64_t day)
{
    return (int)(((day % 7) + 7 + 3) % 7);
}

/* ---- plan accessors ----------------------------------------------------- */

static int days_of(const ctx *c, const plan *pl, int m, int p, int t)
{
    return pl->days[((size_t)m * c->pb->n_paddocks + p) * c->pb->n_weeks + t];
}

static double cover_kg(const ctx *c, int p, int t)
{
    return 1000.0 * c->r->vopt.cover_t_ha[(size_t)p * (c->pb->n_weeks + 1) + t];
}

/* Pasture eaten by mob m in week t, t DM: demand on the days it grazes. */
static double pasture_t(const ctx *c, int m, int t)
{
    int d = 0;
    for (int p = 0; p < c->pb->n_paddocks; p++)
        d += days_of(c, &c->r->opt, m, p, t);
    return c->pb->mob[m].demand_t_d * d;
}

static double supplement_t(const ctx *c, int m, int t)
{
    return c->r->opt.supplement_t[(size_t)m * c->pb->n_weeks + t];
}

static const char *species_name(int sp)
{
    return sp == SPECIES_CATTLE ? "cattle" : sp == SPECIES_GOATS ? "goats" : "sheep";
}

/* A round step for an axis from 0 to max with about n ticks. */
static double nice_step(double max, int n)
{
    if (!(max > 0))
        return 1;
    double raw = max / n, p = pow(10, floor(log10(raw))), f = raw / p;
    return (f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10) * p;
}

/* ---- page frame ----------------------------------------------------------- */

static const char css[] =
    ":root{--ink:#22303a;--paper:#fbfaf6;--line:#d9d4c7;--teal:#2f6f73;--sun:#e0a526;"
    "--rain:#3d7ab8;--grass:#6a994e;--band:#cfe3c1;--rust:#b5543a;--mow:#7b5ea7;--muted:#6f7a80}\n"
    "*{box-sizing:border-box}\n"
    "html{background:var(--paper);color:var(--ink)}\n"
    "body{font:11pt/1.45 \"DejaVu Sans\",\"Liberation Sans\",Arial,sans-serif;max-width:190mm;"
    "margin:0 auto;padding:8mm 6mm 14mm}\n"
    "header{border-left:3mm solid var(--teal);padding:2mm 0 2mm 4mm;margin-bottom:6mm}\n"
    "header h1{font-size:20pt;margin:0 0 1mm;font-weight:700;letter-spacing:.01em}\n"
    "header p{margin:0;color:var(--muted)}\n"
    "h2{font-size:13.5pt;margin:9mm 0 2mm;padding-bottom:1mm;border-bottom:.4mm solid var(--line);"
    "break-after:avoid;page-break-after:avoid}\n"
    "h2 .no{display:inline-block;min-width:7mm;margin-right:2mm;color:var(--teal)}\n"
    "h3{font-size:11pt;margin:4mm 0 1mm;break-after:avoid;page-break-after:avoid}\n"
    "p{margin:1.5mm 0}\n"
    "figure{margin:3mm 0;break-inside:avoid;page-break-inside:avoid}\n"
    "figure svg{display:block;width:100%;height:auto;max-height:215mm}\n"
    "figcaption{font-size:9pt;color:var(--muted);margin-top:1mm}\n"
    "table{border-collapse:collapse;width:100%;font-size:9.5pt;margin:2mm 0}\n"
    "th,td{padding:.8mm 1.6mm;text-align:left;vertical-align:top;border-bottom:.2mm solid var(--line)}\n"
    "th{font-weight:600;background:#efece3}\n"
    "td.n,th.n{text-align:right;font-variant-numeric:tabular-nums}\n"
    "td.n,td.d{white-space:nowrap}\n"
    "th .u{display:block;font-weight:400;color:var(--muted);font-size:8.5pt}\n"
    "table.wide{font-size:8.5pt}\n"
    "tr{break-inside:avoid;page-break-inside:avoid}\n"
    "thead{display:table-header-group}\n"
    ".cols{display:grid;grid-template-columns:repeat(auto-fit,minmax(55mm,1fr));gap:4mm}\n"
    ".visit{white-space:nowrap}\n"
    ".key{display:inline-block;width:3.2mm;height:3.2mm;vertical-align:-.4mm;margin-right:1mm;"
    "border:.2mm solid var(--ink)}\n"
    ".caution{border:.5mm solid var(--rust);border-radius:1.5mm;padding:2mm 4mm;background:#fff6f0;"
    "break-inside:avoid;page-break-inside:avoid}\n"
    ".caution li{margin:1mm 0}\n"
    ".note{color:var(--muted);font-size:9pt}\n"
    "footer{margin-top:8mm;font-size:8.5pt;color:var(--muted);border-top:.2mm solid var(--line);padding-top:2mm}\n"
    "svg text{font-family:\"DejaVu Sans\",\"Liberation Sans\",Arial,sans-serif}\n"
    "@page{margin:14mm 12mm 16mm}\n"
    "@media print{html{background:#fff}body{max-width:none;padding:0;font-size:10pt}"
    "section{break-before:auto}h2{margin-top:6mm}"
    "#cautions{break-before:page;page-break-before:always}"
    "figure svg{max-height:225mm}a{color:inherit;text-decoration:none}}\n";

static void section(const ctx *c, const char *id, int no, const char *title)
{
    fprintf(c->fp, "<section id=\"%s\">\n<h2><span class=\"no\">%d</span>%s</h2>\n", id, no, title);
}

static void head(const ctx *c)
{
    FILE *fp = c->fp;
    fputs("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n"
          "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n"
          "<meta name=\"generator\" content=\"rowgraze " RG_VERSION "\">\n<title>Grazing plan: ", fp);
    rpt_escape(fp, c->s->name);
    fprintf(fp, "</title>\n<style>\n%s</style>\n</head>\n<body>\n", css);
}

/* ---- 1: the job ----------------------------------------------------------- */

static double total_area_ha(const site *s, int under_only)
{
    double a = 0;
    for (int i = 0; i < s->n_paddocks; i++)
        a += s->paddocks[i].area_ha * (under_only ? s->paddocks[i].array_share : 1.0);
    return a;
}

static void mob_list(const ctx *c)
{
    for (int m = 0; m < c->s->n_mobs; m++) {
        const site_mob *mb = &c->s->mobs[m];
        fputs(m == 0 ? "" : m + 1 == c->s->n_mobs ? " and " : ", ", c->fp);
        fputs("<b>", c->fp);
        rpt_escape(c->fp, mb->id);
        fprintf(c->fp, "</b> (%d %s)", mb->head, species_name(mb->species));
    }
}

static void header(const ctx *c)
{
    FILE *fp = c->fp;
    char a[16], b[16];
    date_text(c->pb->start_day, a);
    date_text(c->pb->start_day + 7 * (int64_t)c->pb->n_weeks - 1, b);
    fputs("<header>\n<h1>Grazing plan: ", fp);
    rpt_escape(fp, c->s->name);
    fprintf(fp, "</h1>\n<p>%d weeks, %s %s to %s %s &middot; growth forecast p%d &middot; %s units</p>\n"
                "</header>\n",
            c->pb->n_weeks, day_name[weekday(c->pb->start_day)], a,
            day_name[weekday(c->pb->start_day + 7 * (int64_t)c->pb->n_weeks - 1)], b,
            c->s->plan.percentile, c->u == SITE_UNITS_US ? "US" : "metric");
}

static void job(const ctx *c)
{
    FILE *fp = c->fp;
    const site *s = c->s;
    const pv_result *v = &c->r->vopt, *bl = &c->r->vbase;
    double pasture = 0, sup = 0;
    int under = 0;
    for (int t = 0; t < c->pb->n_weeks; t++)
        for (int m = 0; m < c->pb->n_mobs; m++)
            pasture += pasture_t(c, m, t), sup += supplement_t(c, m, t);
    for (int i = 0; i < s->n_paddocks; i++)
        under += s->paddocks[i].array_share > 0;
    char a[16];
    date_text(c->pb->start_day, a);
    section(c, "job", 1, "The job");
    fputs("<p>This plan says which paddocks ", fp);
    mob_list(c);
    fprintf(fp, " graze%s, week by week and day by day, for %d weeks from %s %s. The ground is %d "
                "paddocks (", s->n_mobs == 1 ? "s" : "", c->pb->n_weeks,
            day_name[weekday(c->pb->start_day)], a, s->n_paddocks);
    numu(c, un_area(c->u, total_area_ha(s, 0)), 1, un_area_name(c->u));
    fprintf(fp, "), %d of them partly or wholly under rows of single-axis solar trackers. "
                "The plan keeps every paddock at or above its residual (", under);
    numu(c, un_height(c->u, s->rules.residual_height_cm), 1, un_height_name(c->u));
    fprintf(fp, "), rests each at least %d days between visits, keeps visits to %d days or fewer, "
                "and holds the sward under the panels&#39; vegetation ceiling (",
            s->rules.min_rest_days, s->rules.max_days_per_visit);
    numu(c, un_height(c->u, s->rules.ceiling_height_cm), 1, un_height_name(c->u));
    fputs("), mowing where grazing cannot. Over the plan the animals eat ", fp);
    numu(c, un_mass(c->u, pasture + sup), 1, un_mass_name(c->u));
    fputs(": ", fp);
    numu(c, un_mass(c->u, pasture), 1, un_mass_name(c->u));
    fputs(" from pasture and ", fp);
    numu(c, un_mass(c->u, sup), 1, un_mass_name(c->u));
    fprintf(fp, " as supplement, with %d moves and ", v->moves);
    numu(c, un_area(c->u, v->mowed_ha), 1, un_area_name(c->u));
    fputs(" mowed, at a cost of ", fp);
    numu(c, v->cost_total, 0, s->costs.currency);
    if (v->penalty_terminal > 0.5) {
        fputs(" (", fp);
        numu(c, v->penalty_terminal, 0, s->costs.currency);
        fputs(" of it the charge for ending ", fp);
        numu(c, un_mass(c->u, v->terminal_shortfall_t), 1, un_mass_name(c->u));
        fputs(" below the end-cover target)", fp);
    }
    fputs(" against ", fp);
    numu(c, bl->cost_total, 0, s->costs.currency);
    fprintf(fp, " for the rule-of-thumb baseline. Growth is forecast from %d weather year%s; "
                "the plan uses the p%d forecast.</p>\n",
            c->in->fc->n_years, c->in->fc->n_years == 1 ? "" : "s", s->plan.percentile);
    fputs("<p class=\"note\">A plan is a forecast: walk the paddocks before each move, and read "
          "section 11 (cautions) before anyone works with animals near the array.</p>\n</section>\n", fp);
}

/* ---- 2: site, array and flock ------------------------------------------- */

static void row_kv(const ctx *c, const char *k, double x, int d, const char *unit)
{
    fprintf(c->fp, "<tr><th>%s</th><td class=\"n\">", k);
    numu(c, x, d, unit);
    fputs("</td></tr>\n", c->fp);
}

static void site_tables(const ctx *c)
{
    const site *s = c->s;
    const site_array *ar = &s->array;
    FILE *fp = c->fp;
    int u = c->u;
    fputs("<div class=\"cols\">\n<table><caption class=\"note\">Site</caption>\n", fp);
    row_kv(c, "Latitude", s->loc.latitude_deg, 3, "\xc2\xb0");
    row_kv(c, "Longitude", s->loc.longitude_deg, 3, "\xc2\xb0");
    row_kv(c, "Elevation", un_length(u, s->loc.elevation_m), 0, un_length_name(u));
    row_kv(c, "Paddocks", s->n_paddocks, 0, "");
    row_kv(c, "Area", un_area(u, total_area_ha(s, 0)), 1, un_area_name(u));
    row_kv(c, "Under the array", un_area(u, total_area_ha(s, 1)), 1, un_area_name(u));
    fputs("</table>\n<table><caption class=\"note\">Array</caption>\n", fp);
    row_kv(c, "Axis azimuth", ar->axis_azimuth_deg, 0, "\xc2\xb0");
    row_kv(c, "Row pitch", un_length(u, ar->pitch_m), 2, un_length_name(u));
    row_kv(c, "Module width", un_length(u, ar->chord_m), 2, un_length_name(u));
    row_kv(c, "Axis height", un_length(u, ar->hub_height_m), 2, un_length_name(u));
    row_kv(c, "Rotation limit", ar->max_rotation_deg, 0, "\xc2\xb0");
    row_kv(c, "Lowest edge, full tilt", un_length(u, site_lowest_edge_m(ar)), 2, un_length_name(u));
    fprintf(fp, "<tr><th>Backtracking</th><td class=\"n\">%s</td></tr>\n", ar->backtracking ? "yes" : "no");
    fputs("</table>\n<table><caption class=\"note\">Rules</caption>\n", fp);
    row_kv(c, "Residual", un_height(u, s->rules.residual_height_cm), 1, un_height_name(u));
    row_kv(c, "Ceiling", un_height(u, s->rules.ceiling_height_cm), 1, un_height_name(u));
    row_kv(c, "Rest, at least", s->rules.min_rest_days, 0, "d");
    row_kv(c, "Visit, at most", s->rules.max_days_per_visit, 0, "d");
    row_kv(c, "Paddocks per mob-week", s->rules.max_paddocks_per_week, 0, "");
    fputs("</table>\n</div>\n", fp);
}

static void flock_table(const ctx *c)
{
    FILE *fp = c->fp;
    int u = c->u;
    fprintf(fp, "<h3>Flock</h3>\n<table><thead><tr><th>Mob</th><th>Species</th><th class=\"n\">Head</th>"
                "<th class=\"n\">Liveweight<span class=\"u\">%s</span></th>"
                "<th class=\"n\">Intake<span class=\"u\">%s DM/head/day</span></th>"
                "<th class=\"n\">Mob demand<span class=\"u\">%s/day</span></th></tr></thead><tbody>\n",
            un_weight_name(u), un_weight_name(u), un_mass_name(u));
    for (int m = 0; m < c->s->n_mobs; m++) {
        const site_mob *mb = &c->s->mobs[m];
        fprintf(fp, "<tr><td><span class=\"key\" style=\"background:%s\"></span>",
                mob_colour[(size_t)m % N_MOB_COLOURS]);
        rpt_escape(fp, mb->id);
        fprintf(fp, "</td><td>%s</td><td class=\"n\">%d</td><td class=\"n\">", species_name(mb->species), mb->head);
        num(c, un_weight(u, mb->liveweight_kg), 0);
        fputs("</td><td class=\"n\">", fp);
        num(c, un_weight(u, mb->intake_kgdm_d), 2);
        fputs("</td><td class=\"n\">", fp);
        num(c, un_mass(u, mb->head * mb->intake_kgdm_d / 1000.0), 2);
        fputs("</td></tr>\n", fp);
    }
    fputs("</tbody></table>\n", fp);
}

static void paddock_table(const ctx *c)
{
    FILE *fp = c->fp;
    int u = c->u;
    const char *cv = un_cover_name(u);
    fprintf(fp, "<h3>Paddocks</h3>\n<table class=\"wide\"><thead><tr><th>Paddock</th><th>Block</th>"
                "<th class=\"n\">Area<span class=\"u\">%s</span></th><th class=\"n\">Under array</th><th>Soil</th>"
                "<th>Sward</th><th class=\"n\">Start cover<span class=\"u\">%s</span></th>"
                "<th class=\"n\">Residual<span class=\"u\">%s</span></th>"
                "<th class=\"n\">Ceiling<span class=\"u\">%s</span></th></tr></thead><tbody>\n",
            un_area_name(u), cv, cv, cv);
    for (int i = 0; i < c->s->n_paddocks; i++) {
        const site_paddock *pd = &c->s->paddocks[i];
        const plan_paddock *pp = &c->pb->pd[i];
        fputs("<tr><td>", fp);
        rpt_escape(fp, pd->id);
        fputs("</td><td>", fp);
        rpt_escape(fp, pd->block);
        fputs("</td><td class=\"n\">", fp);
        num(c, un_area(u, pd->area_ha), 2);
        fputs("</td><td class=\"n\">", fp);
        numu(c, 100 * pd->array_share, 0, "%");
        fputs("</td><td>", fp);
        rpt_escape(fp, c->s->soils[pd->soil].id);
        fputs("</td><td>", fp);
        rpt_escape(fp, c->s->swards[pd->sward].id);
        double v[3] = {pp->cover0_t_ha, pp->residual_t_ha, pp->ceiling_t_ha};
        for (int k = 0; k < 3; k++) {
            fputs("</td><td class=\"n\">", fp);
            num(c, un_cover(u, 1000 * v[k]), 0);
        }
        fputs("</td></tr>\n", fp);
    }
    fputs("</tbody></table>\n", fp);
}

static void site_section(const ctx *c)
{
    section(c, "site", 2, "Site, array and flock");
    site_tables(c);
    flock_table(c);
    paddock_table(c);
    fputs("</section>\n", c->fp);
}

/* ---- 3: the row cross-section ------------------------------------------- */

#define ROW_W 720.0
#define ROW_X0 70.0
#define ROW_X1 690.0

typedef struct band {
    const char *title, *unit, *colour;
    double scale_max;        /* value at the band's full height */
    int decimals;
} band;

/* Value of strip i (i == n: open ground) in band k, in output units. */
static double band_value(const ctx *c, int k, int i)
{
    const rpt_strips *st = c->in->strips;
    const mc_strip_summary *r = &st->rows[i];
    if (k == 0)
        return 100.0 * r->light_share;
    if (k == 1)
        return un_depth(c->u, r->rain_share * st->open_rain_mm);
    return un_cover(c->u, st->growth_kgdm_ha[i]);
}

static double row_x(const ctx *c, double offset_m)
{
    double pitch = c->s->array.pitch_m;
    return ROW_X0 + (offset_m + pitch / 2) / pitch * (ROW_X1 - ROW_X0);
}

/* The panel, its post and the ground; returns the ground line's y. */
static double row_drawing(const ctx *c, double top)
{
    FILE *fp = c->fp;
    const site_array *ar = &c->s->array;
    double sx = (ROW_X1 - ROW_X0) / ar->pitch_m;
    double zmax = ar->hub_height_m + ar->chord_m / 2;
    double sz = sx < 200.0 / zmax ? sx : 200.0 / zmax;
    double ground = top + 30 + sz * zmax;
    double R = c->in->strips->tilt_deg * RPT_PI / 180.0, hx = ar->chord_m / 2 * cos(R) * sx,
           hz = ar->chord_m / 2 * sin(R) * sz, ax = row_x(c, 0), az = ground - ar->hub_height_m * sz;
    double v[12] = {ROW_X0 - 20, ground, ROW_X1 + 20, ground};
    svgf(fp, "<rect x=\"@\" y=\"@\" width=\"@\" height=\"8\" fill=\"#a88f6a\"/>\n", 3,
         (double[]){ROW_X0 - 20, ground, ROW_X1 - ROW_X0 + 40});
    svgf(fp, "<line x1=\"@\" y1=\"@\" x2=\"@\" y2=\"@\" stroke=\"#6a994e\" stroke-width=\"3\"/>\n", 4, v);
    /* post, the afternoon pose (ghost), the morning pose (drawn), axis */
    svgf(fp, "<line x1=\"@\" y1=\"@\" x2=\"@\" y2=\"@\" stroke=\"#55606a\" stroke-width=\"5\"/>\n", 4,
         (double[]){ax, ground, ax, az});
    svgf(fp, "<line x1=\"@\" y1=\"@\" x2=\"@\" y2=\"@\" stroke=\"#8fa7b8\" stroke-width=\"5\" "
             "stroke-dasharray=\"6 4\" opacity=\"0.7\"/>\n", 4,
         (double[]){ax - hx, az + hz, ax + hx, az - hz});
    svgf(fp, "<line x1=\"@\" y1=\"@\" x2=\"@\" y2=\"@\" stroke=\"#1d3557\" stroke-width=\"7\" "
             "stroke-linecap=\"square\"/>\n", 4, (double[]){ax - hx, az - hz, ax + hx, az + hz});
    svgf(fp, "<circle cx=\"@\" cy=\"@\" r=\"5\" fill=\"#e0a526\" stroke=\"#22303a\"/>\n", 2, (double[]){ax, az});
    /* a sun symbol on the morning side, with rays */
    double sxp = ROW_X1 - 40, syp = top + 24;
    svgf(fp, "<g stroke=\"#e0a526\" stroke-width=\"2\"><circle cx=\"@\" cy=\"@\" r=\"9\" fill=\"#f4d27a\"/>", 2,
         (double[]){sxp, syp});
    for (int k = 0; k < 8; k++) {
        double a = k * RPT_PI / 4;
        svgf(fp, "<line x1=\"@\" y1=\"@\" x2=\"@\" y2=\"@\"/>", 4,
             (double[]){sxp + 12 * cos(a), syp + 12 * sin(a), sxp + 17 * cos(a), syp + 17 * sin(a)});
    }
    fputs("</g>\n", fp);
    svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"12\" text-anchor=\"end\" fill=\"#22303a\">sunrise side &#8594;</text>\n",
         2, (double[]){ROW_X1 - 62, top + 28});
    svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"12\" fill=\"#22303a\">&#8592; sunset side</text>\n", 2,
         (double[]){ROW_X0, top + 28});
    char t[80];
    fprintf(fp, "<text x=\"%d\" y=\"%d\" font-size=\"11\" text-anchor=\"middle\" fill=\"#6f7a80\">"
                "panel drawn at %s&#176; facing the morning sun (dashed: the afternoon)</text>\n",
            (int)ax, (int)(top + 10), rpt_num(t, sizeof t, c->in->strips->tilt_deg, 0, 0));
    /* the pitch's width */
    svgf(fp, "<g stroke=\"#6f7a80\"><line x1=\"@\" y1=\"@\" x2=\"@\" y2=\"@\"/>", 4,
         (double[]){ROW_X0, ground + 16, ROW_X1, ground + 16});
    svgf(fp, "<line x1=\"@\" y1=\"@\" x2=\"@\" y2=\"@\"/>", 4, (double[]){ROW_X0, ground + 11, ROW_X0, ground + 21});
    svgf(fp, "<line x1=\"@\" y1=\"@\" x2=\"@\" y2=\"@\"/></g>\n", 4, (double[]){ROW_X1, ground + 11, ROW_X1, ground + 21});
    fprintf(fp, "<text x=\"%d\" y=\"%d\" font-size=\"11\" text-anchor=\"middle\" fill=\"#22303a\">one pitch, ",
            (int)ax, (int)(ground + 31));
    numu(c, un_length(c->u, ar->pitch_m), 1, un_length_name(c->u));
    fprintf(fp, ", halfway to the next row on each side, in %d strips</text>\n", c->in->strips->n);
    return ground + 40;
}

/* Names the strip that explains the band: the wettest (a drip edge) in the
 * rain band, the darkest (the panel's shade) in the light band. */
static void band_note(const ctx *c, int k, const band *b, double top, double h)
{
    const rpt_strips *st = c->in->strips;
    if (k == 2 || st->n < 3)
        return;
    int best = 0;
    for (int i = 1; i < st->n; i++) {
        double v = band_value(c, k, i), w = band_value(c, k, best);
        if (k == 1 ? v > w : v < w)
            best = i;
    }
    double w = (ROW_X1 - ROW_X0) / st->n, x = ROW_X0 + (best + 0.5) * w;
    double y = top + h - h * band_value(c, k, best) / b->scale_max - 4;
    if (y < top + 8)
        y = top + 8;
    svgf(c->fp, "<text x=\"@\" y=\"@\" font-size=\"10\" font-style=\"italic\" text-anchor=\"middle\" "
                "fill=\"#22303a\" stroke=\"#fbfaf6\" stroke-width=\"3\" paint-order=\"stroke\">", 2, (double[]){x, y});
    fputs(k == 1 ? "drip edge" : "panel shade", c->fp);
    fputs("</text>\n", c->fp);
}

static void row_band(const ctx *c, int k, const band *b, double top, double h)
{
    FILE *fp = c->fp;
    const rpt_strips *st = c->in->strips;
    double w = (ROW_X1 - ROW_X0) / st->n, ref = band_value(c, k, st->n);
    char t[80];
    fprintf(fp, "<g class=\"band\" data-band=\"%d\">\n", k);
    svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"12\" font-weight=\"bold\" fill=\"#22303a\">", 2,
         (double[]){ROW_X0, top - 4});
    fprintf(fp, "%s, %s</text>\n", b->title, b->unit);
    svgf(fp, "<line x1=\"@\" y1=\"@\" x2=\"@\" y2=\"@\" stroke=\"#d9d4c7\"/>\n", 4,
         (double[]){ROW_X0, top + h, ROW_X1, top + h});
    for (int i = 0; i < st->n; i++) {
        double val = band_value(c, k, i), bh = isfinite(val) ? h * val / b->scale_max : 0;
        if (bh > h) bh = h;
        if (bh < 0) bh = 0;
        svgf(fp, "<rect x=\"@\" y=\"@\" width=\"@\" height=\"@\" fill=\"", 4,
             (double[]){ROW_X0 + i * w + 0.5, top + h - bh, w - 1 > 0.5 ? w - 1 : 0.5, bh});
        fprintf(fp, "%s\"><title>strip %d, ", b->colour, i);
        numu(c, un_length(c->u, st->rows[i].offset_m), 2, un_length_name(c->u));
        fprintf(fp, ": %s %s</title></rect>\n", rpt_num(t, sizeof t, val, b->decimals, 1), b->unit);
    }
    band_note(c, k, b, top, h);
    double ry = top + h - h * ref / b->scale_max;
    svgf(fp, "<line x1=\"@\" y1=\"@\" x2=\"@\" y2=\"@\" stroke=\"#22303a\" stroke-width=\"1.5\" "
             "stroke-dasharray=\"5 3\"/>\n", 4, (double[]){ROW_X0, ry, ROW_X1, ry});
    svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"10\" text-anchor=\"end\" fill=\"#22303a\">open<tspan x=\"@\" dy=\"11\">", 3,
         (double[]){ROW_X0 - 6, ry - 2, ROW_X0 - 6});
    fprintf(fp, "%s</tspan></text>\n", rpt_num(t, sizeof t, ref, b->decimals, 1));
    fputs("</g>\n", fp);
}

static double band_max(const ctx *c, int k)
{
    double mx = 0;
    for (int i = 0; i <= c->in->strips->n; i++) {
        double v = band_value(c, k, i);
        if (isfinite(v) && v > mx)
            mx = v;
    }
    return mx > 0 ? mx * 1.22 : 1; /* headroom for the note over the tallest bar */
}

/* The range of daytime leaf temperature and leaf VPD across the strips,
 * beside the open ground's. */
static void leaf_note(const ctx *c)
{
    const rpt_strips *st = c->in->strips;
    double t0 = HUGE_VAL, t1 = -HUGE_VAL, v0 = HUGE_VAL, v1 = -HUGE_VAL;
    for (int i = 0; i < st->n; i++) {
        const mc_strip_summary *r = &st->rows[i];
        if (isfinite(r->leaf_temp_c))
            t0 = fmin(t0, r->leaf_temp_c), t1 = fmax(t1, r->leaf_temp_c);
        if (isfinite(r->leaf_vpd_kpa))
            v0 = fmin(v0, r->leaf_vpd_kpa), v1 = fmax(v1, r->leaf_vpd_kpa);
    }
    if (!isfinite(t0) || !isfinite(v0))
        return;
    const mc_strip_summary *o = &st->rows[st->n];
    const char *tn = un_temp_name(c->u);
    fputs("<p>Daytime leaves (light-weighted means) run from ", c->fp);
    numu(c, un_temp(c->u, t0), 1, tn);
    fputs(" to ", c->fp);
    numu(c, un_temp(c->u, t1), 1, tn);
    fputs(" across the strips (open ground ", c->fp);
    numu(c, un_temp(c->u, o->leaf_temp_c), 1, tn);
    fputs("), with a leaf-to-air vapour pressure deficit of ", c->fp);
    num(c, v0, 2);
    fputs(" to ", c->fp);
    numu(c, v1, 2, "kPa");
    fputs(" (open ground ", c->fp);
    numu(c, o->leaf_vpd_kpa, 2, "kPa");
    fputs(").</p>\n", c->fp);
}

static void row_figure(const ctx *c)
{
    FILE *fp = c->fp;
    const rpt_strips *st = c->in->strips;
    band b[3] = {{"Light reaching the ground", "% of open ground", "#e0a526", 0, 0},
                 {"Rain reaching the ground", un_depth_name(c->u), "#3d7ab8", 0, 1},
                 {"Growth over the plan's season", un_cover_name(c->u), "#6a994e", 0, 0}};
    if (c->u == SITE_UNITS_US)
        b[1].decimals = 2;
    for (int k = 0; k < 3; k++)
        b[k].scale_max = band_max(c, k);
    section(c, "row", 3, "Why pasture differs across a row");
    fputs("<p>One row of trackers seen end on, and the ground strips beneath it from halfway to the "
          "next row on one side to halfway on the other. The panel shades the strips under it and "
          "beside it as it follows the sun, and sheds rain off its lower edge: the bars show what each "
          "strip receives over the plan's weeks and what it grows, against open ground (dashed line).</p>\n", fp);
    leaf_note(c);
    double band_h = 70, gap = 32, top = 0;
    fputs("<figure id=\"fig-row\">\n<svg xmlns=\"http://www.w3.org/2000/svg\" role=\"img\" "
          "aria-labelledby=\"fig-row-t\" viewBox=\"0 0 720 ", fp);
    /* height: drawing, then three bands */
    const site_array *ar = &c->s->array;
    double sx = (ROW_X1 - ROW_X0) / ar->pitch_m, zmax = ar->hub_height_m + ar->chord_m / 2;
    double sz = sx < 200.0 / zmax ? sx : 200.0 / zmax;
    double total = 30 + sz * zmax + 40 + 3 * (band_h + gap) + 10;
    co(fp, total);
    fputs("\">\n<title id=\"fig-row-t\">Cross-section of one tracker row with light, rain and growth per strip</title>\n", fp);
    top = row_drawing(c, 0) + gap - 8;
    for (int k = 0; k < 3; k++, top += band_h + gap)
        row_band(c, k, &b[k], top, band_h);
    fputs("</svg>\n<figcaption>Figure 1. ", fp);
    fprintf(fp, "Per strip, mean over %d weather year%s: light as a share of open ground, rain in %s, "
                "and growth in %s of the ",
            st->n_years, st->n_years == 1 ? "" : "s", un_depth_name(c->u), un_cover_name(c->u));
    rpt_escape(fp, st->soil_id);
    fputs(" soil and ", fp);
    rpt_escape(fp, st->sward_id);
    fputs(" sward (the paddocks with most ground under the array), grazed back to the residual every rest "
          "period. Dashed line: open ground outside the array.</figcaption>\n</figure>\n</section>\n", fp);
}

/* ---- 4 and 5: small multiples -------------------------------------------- */

#define SM_COLS 6
#define SM_W 112.0
#define SM_H 78.0
#define SM_PAD 8.0

static double sm_x(int n_pts, int k, double x0)
{
    return x0 + 4 + (n_pts > 1 ? (SM_W - 8) * k / (n_pts - 1) : (SM_W - 8) / 2);
}

/* Opens a small-multiples figure; its first line gives the shared scale. */
static void sm_open(const ctx *c, const char *id, const char *title, double vmax, const char *unit,
                    double *cell_h)
{
    int rows = (c->pb->n_paddocks + SM_COLS - 1) / SM_COLS;
    *cell_h = SM_H + 22;
    fprintf(c->fp, "<figure id=\"%s\">\n<svg xmlns=\"http://www.w3.org/2000/svg\" role=\"img\" "
                   "aria-labelledby=\"%s-t\" viewBox=\"0 0 720 ", id, id);
    co(c->fp, rows * (*cell_h + SM_PAD) + 32);
    fprintf(c->fp, "\">\n<title id=\"%s-t\">%s</title>\n", id, title);
    char t[80];
    fprintf(c->fp, "<text x=\"6\" y=\"12\" font-size=\"10\" fill=\"#6f7a80\">every panel: 0 (bottom) to %s ",
            rpt_num(t, sizeof t, vmax, 0, 1));
    rpt_escape(c->fp, unit);
    fputs(" (top)</text>\n", c->fp);
}

/* The frame and label of paddock i's cell; returns its plot origin. */
static void sm_cell(const ctx *c, int i, double cell_h, double *x0, double *y0)
{
    FILE *fp = c->fp;
    int col = i % SM_COLS, row = i / SM_COLS;
    *x0 = 6 + col * (SM_W + 6);
    *y0 = row * (cell_h + SM_PAD) + 36;
    fprintf(fp, "<g class=\"cell\" data-paddock=\"");
    rpt_escape(fp, c->s->paddocks[i].id);
    fputs("\">\n", fp);
    svgf(fp, "<rect x=\"@\" y=\"@\" width=\"@\" height=\"@\" fill=\"#ffffff\" stroke=\"#d9d4c7\"/>\n", 4,
         (double[]){*x0, *y0, SM_W, SM_H});
    svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"11\" font-weight=\"bold\" fill=\"#22303a\">", 2,
         (double[]){*x0 + 2, *y0 - 4});
    rpt_escape(fp, c->s->paddocks[i].id);
    fputs("</text>\n", fp);
}

static double sm_y(double y0, double v, double vmax)
{
    double f = vmax > 0 ? v / vmax : 0;
    if (f > 1) f = 1;
    if (f < 0) f = 0;
    return y0 + SM_H - 4 - (SM_H - 8) * f;
}

static void forecast_cell(const ctx *c, int i, double cell_h, double vmax)
{
    FILE *fp = c->fp;
    const fc_table *f = c->in->fc;
    double x0, y0;
    sm_cell(c, i, cell_h, &x0, &y0);
    int n = f->n_weeks;
    if (f->n_years > 1) {
        fputs("<polygon fill=\"#cfe3c1\" stroke=\"none\" points=\"", fp);
        for (int k = 0; k < n; k++)
            svgf(fp, "@,@ ", 2, (double[]){sm_x(n, k, x0), sm_y(y0, un_cover(c->u, fc_rate_pct(f, i, k, 90)), vmax)});
        for (int k = n - 1; k >= 0; k--)
            svgf(fp, "@,@ ", 2, (double[]){sm_x(n, k, x0), sm_y(y0, un_cover(c->u, fc_rate_pct(f, i, k, 10)), vmax)});
        fputs("\"/>\n", fp);
    }
    fputs("<polyline fill=\"none\" stroke=\"#2f6f73\" stroke-width=\"2\" points=\"", fp);
    for (int k = 0; k < n; k++)
        svgf(fp, "@,@ ", 2, (double[]){sm_x(n, k, x0), sm_y(y0, un_cover(c->u, fc_rate_pct(f, i, k, 50)), vmax)});
    fputs("\"/>\n", fp);
    char t[80];
    svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"9\" fill=\"#22303a\">season p50 ", 2,
         (double[]){x0 + 2, y0 + SM_H + 11});
    fprintf(fp, "%s</text>\n</g>\n", rpt_num(t, sizeof t, un_cover(c->u, fc_rate_pct(f, i, -1, 50)), 0, 1));
}

static void forecast_section(const ctx *c)
{
    FILE *fp = c->fp;
    const fc_table *f = c->in->fc;
    double vmax = 0, cell_h;
    for (int i = 0; i < f->n_paddocks; i++)
        for (int k = 0; k < f->n_weeks; k++) {
            double v = un_cover(c->u, fc_rate_pct(f, i, k, f->n_years > 1 ? 90 : 50));
            if (v > vmax)
                vmax = v;
        }
    vmax = vmax > 0 ? ceil(vmax * 1.1) : 1;
    section(c, "forecast", 4, "Growth forecast by paddock");
    fprintf(fp, "<p>Daily growth, %s/day, week by week over the plan&#39;s %d weeks, for each paddock: "
                "its strips under the array mixed with its open ground by the share under the array. ",
            un_cover_name(c->u), f->n_weeks);
    if (f->n_years > 1)
        fprintf(fp, "The band runs from the 10th to the 90th percentile across %d weather years (%d to %d); "
                    "the line is the median.</p>\n", f->n_years, f->years[0], f->years[f->n_years - 1]);
    else
        fprintf(fp, "One weather year (%d), so no band: the line is that year.</p>\n", f->years[0]);
    char title[160];
    snprintf(title, sizeof title, "Weekly growth forecast per paddock, %s per day", un_cover_name(c->u));
    char unit[48];
    snprintf(unit, sizeof unit, "%s/day", un_cover_name(c->u));
    sm_open(c, "fig-forecast", title, vmax, unit, &cell_h);
    for (int i = 0; i < f->n_paddocks; i++)
        forecast_cell(c, i, cell_h, vmax);
    fprintf(fp, "</svg>\n<figcaption>Figure 2. Growth, %s/day; every panel has the same scale; "
                "the season&#39;s total growth (median) below each panel, %s.</figcaption>\n"
                "</figure>\n</section>\n", un_cover_name(c->u), un_cover_name(c->u));
}

static int grazed_in(const ctx *c, int p, int t)
{
    for (int m = 0; m < c->pb->n_mobs; m++)
        if (days_of(c, &c->r->opt, m, p, t) > 0)
            return m + 1;
    return 0;
}

static void hline(const ctx *c, double x0, double y, const char *colour, const char *dash)
{
    svgf(c->fp, "<line x1=\"@\" y1=\"@\" x2=\"@\" y2=\"@\" stroke-width=\"1.2\" ", 4,
         (double[]){x0 + 2, y, x0 + SM_W - 2, y});
    fprintf(c->fp, "stroke=\"%s\" stroke-dasharray=\"%s\"/>\n", colour, dash);
}

static void cover_cell(const ctx *c, int p, double cell_h, double vmax)
{
    FILE *fp = c->fp;
    int n = c->pb->n_weeks;
    double x0, y0, step = (SM_W - 8) / n;
    sm_cell(c, p, cell_h, &x0, &y0);
    for (int t = 0; t < n; t++) {
        int m = grazed_in(c, p, t);
        if (m)
            svgf(fp, "<rect x=\"@\" y=\"@\" width=\"@\" height=\"@\" opacity=\"0.22\" ", 4,
                 (double[]){sm_x(n + 1, t, x0), y0 + 1, step, SM_H - 2}),
                fprintf(fp, "fill=\"%s\"/>\n", mob_colour[(size_t)(m - 1) % N_MOB_COLOURS]);
        if (c->r->opt.mow[(size_t)p * n + t])
            svgf(fp, "<path d=\"M@ @l4 4l-4 4l-4-4z\" fill=\"#7b5ea7\"/>\n", 2,
                 (double[]){sm_x(n + 1, t + 1, x0), y0 + 2});
    }
    hline(c, x0, sm_y(y0, un_cover(c->u, 1000 * c->pb->pd[p].residual_t_ha), vmax), "#b5543a", "4 2");
    double ceil_v = un_cover(c->u, 1000 * c->pb->pd[p].ceiling_t_ha);
    if (ceil_v <= vmax)
        hline(c, x0, sm_y(y0, ceil_v, vmax), "#7b5ea7", "1 2");
    fputs("<polyline fill=\"none\" stroke=\"#22303a\" stroke-width=\"1.8\" points=\"", fp);
    for (int t = 0; t <= n; t++)
        svgf(fp, "@,@ ", 2, (double[]){sm_x(n + 1, t, x0), sm_y(y0, un_cover(c->u, cover_kg(c, p, t)), vmax)});
    fputs("\"/>\n</g>\n", fp);
}

static void cover_section(const ctx *c)
{
    FILE *fp = c->fp;
    const plan_problem *pb = c->pb;
    double vmax = 0, cell_h, ceil_min = HUGE_VAL;
    for (int p = 0; p < pb->n_paddocks; p++) {
        for (int t = 0; t <= pb->n_weeks; t++)
            if (cover_kg(c, p, t) > vmax)
                vmax = cover_kg(c, p, t);
        if (pb->pd[p].ceiling_t_ha * 1000 < ceil_min)
            ceil_min = pb->pd[p].ceiling_t_ha * 1000;
    }
    /* show the ceiling when it is not far above the covers */
    if (ceil_min < 1.6 * vmax && ceil_min > vmax)
        vmax = ceil_min;
    vmax = un_cover(c->u, vmax) * 1.08;
    vmax = nice_step(vmax, 4) * ceil(vmax / nice_step(vmax, 4));
    section(c, "cover", 5, "Cover over the plan");
    fprintf(fp, "<p>Each paddock&#39;s cover (%s) at the start of every week and at the end of the plan, "
                "as the plan&#39;s grazing, growth and mowing leave it. Shaded weeks are grazed; the dashed "
                "red line is the residual, the dotted violet line the vegetation ceiling",
            un_cover_name(c->u));
    char t[80];
    if (un_cover(c->u, ceil_min) > vmax)
        fprintf(fp, " (at %s %s or more, above these panels&#39; scale: no paddock comes near it)",
                rpt_num(t, sizeof t, un_cover(c->u, ceil_min), 0, 1), un_cover_name(c->u));
    fputs("; a violet diamond marks a mowing at the end of the week.</p>\n", fp);
    sm_open(c, "fig-cover", "Cover over time per paddock, with residual and ceiling", vmax, un_cover_name(c->u),
            &cell_h);
    for (int p = 0; p < pb->n_paddocks; p++)
        cover_cell(c, p, cell_h, vmax);
    fprintf(fp, "</svg>\n<figcaption>Figure 3. Cover, %s, from the plan&#39;s first day (left) to its last "
                "(right), re-simulated by the plan checker; same scale in every panel.</figcaption>\n"
                "</figure>\n</section>\n", un_cover_name(c->u));
}

/* ---- 6: the rotation calendar ------------------------------------------- */

#define CAL_X0 56.0
#define CAL_Y0 40.0
#define CAL_ROW 21.0

static void cal_defs(FILE *fp)
{
    fputs("<defs><pattern id=\"hatch\" width=\"6\" height=\"6\" patternUnits=\"userSpaceOnUse\" "
          "patternTransform=\"rotate(45)\"><line x1=\"0\" y1=\"0\" x2=\"0\" y2=\"6\" stroke=\"#8c969c\" "
          "stroke-width=\"2\"/></pattern></defs>\n", fp);
}

/* Week labels across the top; with narrow columns only every step-th. */
static void cal_header(const ctx *c, double cw)
{
    FILE *fp = c->fp;
    int step = cw >= 44 ? 1 : (int)ceil(44 / cw);
    for (int t = 0; t < c->pb->n_weeks; t += step) {
        char d[16];
        date_text(c->pb->start_day + 7 * (int64_t)t, d);
        double x = CAL_X0 + (t + 0.5) * cw;
        svgf(fp, "<text x=\"@\" y=\"16\" font-size=\"11\" font-weight=\"bold\" text-anchor=\"middle\" fill=\"#22303a\">", 1, &x);
        fprintf(fp, "W%d</text>\n", t + 1);
        svgf(fp, "<text x=\"@\" y=\"30\" font-size=\"9\" text-anchor=\"middle\" fill=\"#6f7a80\">", 1, &x);
        fprintf(fp, "%s</text>\n", d + 5);
    }
}

static void cal_cell(const ctx *c, int p, int t, double cw)
{
    FILE *fp = c->fp;
    const plan_problem *pb = c->pb;
    double x = CAL_X0 + t * cw, y = CAL_Y0 + p * CAL_ROW;
    svgf(fp, "<rect x=\"@\" y=\"@\" width=\"@\" height=\"@\" fill=\"#ffffff\" stroke=\"#e4dfd3\"/>\n", 4,
         (double[]){x, y, cw, CAL_ROW});
    if (pb->open_days[(size_t)p * pb->n_weeks + t] < 7)
        svgf(fp, "<rect x=\"@\" y=\"@\" width=\"@\" height=\"@\" fill=\"url(#hatch)\"/>\n", 4,
             (double[]){x, y, cw, CAL_ROW});
    int n_in = 0;
    for (int m = 0; m < pb->n_mobs; m++)
        n_in += days_of(c, &c->r->opt, m, p, t) > 0;
    int k = 0;
    for (int m = 0; m < pb->n_mobs; m++) {
        int d = days_of(c, &c->r->opt, m, p, t);
        if (d <= 0)
            continue;
        double h = (CAL_ROW - 2) / n_in, yy = y + 1 + k * h;
        fputs("<g class=\"cal-cell\" data-week=\"", fp);
        fprintf(fp, "%d\" data-mob=\"", t + 1);
        rpt_escape(fp, pb->mob[m].id);
        fputs("\" data-paddock=\"", fp);
        rpt_escape(fp, pb->pd[p].id);
        fprintf(fp, "\" data-days=\"%d\">", d);
        svgf(fp, "<rect x=\"@\" y=\"@\" width=\"@\" height=\"@\" rx=\"3\" ", 4, (double[]){x + 2, yy, cw - 4, h});
        fprintf(fp, "fill=\"%s\"/>", mob_colour[(size_t)m % N_MOB_COLOURS]);
        svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"10\" text-anchor=\"middle\" fill=\"#ffffff\">", 2,
             (double[]){x + cw / 2, yy + h / 2 + 3.5});
        fprintf(fp, cw >= 30 ? "%d d</text><title>" : "%d</text><title>", d);
        rpt_escape(fp, pb->mob[m].id);
        fputs(" in ", fp);
        rpt_escape(fp, pb->pd[p].id);
        fprintf(fp, ", week %d: %d day%s</title></g>\n", t + 1, d, d == 1 ? "" : "s");
        k++;
    }
    if (c->r->opt.mow[(size_t)p * pb->n_weeks + t])
        svgf(fp, "<path d=\"M@ @l5 5l-5 5l-5-5z\" fill=\"#7b5ea7\" stroke=\"#ffffff\"/>\n", 2,
             (double[]){x + cw - 7, y + 1});
}

/* Where the next legend item of width w goes: on this line, or the next. */
static void legend_at(double w, double *x, double *y)
{
    if (*x > CAL_X0 && *x + w > 715) {
        *x = CAL_X0;
        *y += 18;
    }
}

/* The calendar's legend from line y; fp NULL only measures.  Returns the
 * y of its last line. */
static double cal_legend(const ctx *c, FILE *fp, double y)
{
    double x = CAL_X0;
    for (int m = 0; m < c->pb->n_mobs; m++) {
        legend_at(130, &x, &y);
        if (fp) {
            svgf(fp, "<rect x=\"@\" y=\"@\" width=\"14\" height=\"12\" rx=\"3\" ", 2, (double[]){x, y});
            fprintf(fp, "fill=\"%s\"/>", mob_colour[(size_t)m % N_MOB_COLOURS]);
            svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"10\" fill=\"#22303a\">", 2, (double[]){x + 18, y + 10});
            rpt_escape(fp, c->pb->mob[m].id);
            fputs(" (days grazed)</text>\n", fp);
        }
        x += 130;
    }
    legend_at(235, &x, &y);
    if (!fp) {
        x += 235;
        legend_at(200, &x, &y);
        return y;
    }
    svgf(fp, "<rect x=\"@\" y=\"@\" width=\"14\" height=\"12\" fill=\"url(#hatch)\" stroke=\"#8c969c\"/>", 2,
         (double[]){x, y});
    svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"10\" fill=\"#22303a\">closed for maintenance part of the week</text>\n",
         2, (double[]){x + 18, y + 10});
    x += 235;
    legend_at(200, &x, &y);
    svgf(fp, "<path d=\"M@ @l6 6l-6 6l-6-6z\" fill=\"#7b5ea7\"/>", 2, (double[]){x + 6, y});
    svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"10\" fill=\"#22303a\">mowed at the end of the week</text>\n", 2,
         (double[]){x + 16, y + 10});
    return y;
}

static void calendar_chart(const ctx *c)
{
    FILE *fp = c->fp;
    const plan_problem *pb = c->pb;
    double cw = (710 - CAL_X0) / pb->n_weeks, ly = CAL_Y0 + pb->n_paddocks * CAL_ROW + 12;
    double h = cal_legend(c, NULL, ly) + 22;
    fputs("<figure id=\"fig-calendar\">\n<svg xmlns=\"http://www.w3.org/2000/svg\" role=\"img\" "
          "aria-labelledby=\"fig-calendar-t\" viewBox=\"0 0 720 ", fp);
    co(fp, h);
    fputs("\">\n<title id=\"fig-calendar-t\">Rotation calendar: paddock by week, days grazed by each mob</title>\n", fp);
    cal_defs(fp);
    cal_header(c, cw);
    for (int p = 0; p < pb->n_paddocks; p++) {
        svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"11\" text-anchor=\"end\" fill=\"#22303a\">", 2,
             (double[]){CAL_X0 - 6, CAL_Y0 + p * CAL_ROW + 14.5});
        rpt_escape(fp, pb->pd[p].id);
        fputs("</text>\n", fp);
        for (int t = 0; t < pb->n_weeks; t++)
            cal_cell(c, p, t, cw);
    }
    cal_legend(c, fp, ly);
    fputs("</svg>\n<figcaption>Figure 4. Paddocks down, weeks across; each coloured cell is a mob&#39;s stay "
          "that week, with its days.</figcaption>\n</figure>\n", fp);
}

static void visits(const ctx *c, int m, int t, int *grazed)
{
    FILE *fp = c->fp;
    int first = 1;
    *grazed = 0;
    for (int p = 0; p < c->pb->n_paddocks; p++) {
        int d = days_of(c, &c->r->opt, m, p, t);
        if (d <= 0)
            continue;
        *grazed += d;
        fprintf(fp, "%s<span class=\"visit\" data-week=\"%d\" data-mob=\"", first ? "" : ", ", t + 1);
        rpt_escape(fp, c->pb->mob[m].id);
        fputs("\" data-paddock=\"", fp);
        rpt_escape(fp, c->pb->pd[p].id);
        fprintf(fp, "\" data-days=\"%d\">", d);
        rpt_escape(fp, c->pb->pd[p].id);
        fprintf(fp, " &middot; %d&nbsp;d (", d);
        num(c, un_cover(c->u, cover_kg(c, p, t)), 0);
        fputs("&#8594;", fp);
        num(c, un_cover(c->u, cover_kg(c, p, t + 1)), 0);
        fputs(")</span>", fp);
        first = 0;
    }
    if (first)
        fputs("&mdash;", fp);
}

static void mow_list(const ctx *c, int t)
{
    int first = 1;
    for (int p = 0; p < c->pb->n_paddocks; p++)
        if (c->r->opt.mow[(size_t)p * c->pb->n_weeks + t]) {
            fputs(first ? "" : ", ", c->fp);
            rpt_escape(c->fp, c->pb->pd[p].id);
            first = 0;
        }
    if (first)
        fputs("&mdash;", c->fp);
}

static void calendar_table(const ctx *c)
{
    FILE *fp = c->fp;
    const plan_problem *pb = c->pb;
    fprintf(fp, "<h3>The calendar as a table</h3>\n<table id=\"calendar-table\"><thead><tr><th>Week</th><th>Dates</th>"
                "<th>Mob</th><th>Paddock &middot; days (cover in&#8594;out, %s)</th><th class=\"n\">Off pasture</th>"
                "<th class=\"n\">Supplement, %s</th><th>Mowed</th></tr></thead><tbody>\n",
            un_cover_name(c->u), un_mass_name(c->u));
    for (int t = 0; t < pb->n_weeks; t++)
        for (int m = 0; m < pb->n_mobs; m++) {
            char a[16], b[16];
            date_text(pb->start_day + 7 * (int64_t)t, a);
            date_text(pb->start_day + 7 * (int64_t)t + 6, b);
            fprintf(fp, "<tr data-week=\"%d\"><td>%d</td><td class=\"d\">%s&ndash;%s</td><td>", t + 1, t + 1, a + 5, b + 5);
            rpt_escape(fp, pb->mob[m].id);
            fputs("</td><td>", fp);
            int grazed;
            visits(c, m, t, &grazed);
            fprintf(fp, "</td><td class=\"n\">%d&nbsp;d</td><td class=\"n\" data-supplement-t=\"", 7 - grazed);
            fprintf(fp, "%.3f\">", supplement_t(c, m, t));
            num(c, un_mass(c->u, supplement_t(c, m, t)), 2);
            fputs("</td><td>", fp);
            if (m == 0)
                mow_list(c, t);
            fputs("</td></tr>\n", fp);
        }
    fputs("</tbody></table>\n", fp);
}

static void calendar_section(const ctx *c)
{
    section(c, "calendar", 6, "Rotation calendar");
    fputs("<p>Where each mob is, week by week. Within a week the days may be taken in the order shown; "
          "days off pasture are spent in a yard or on ground outside the plan, fed supplement.</p>\n", c->fp);
    calendar_chart(c);
    calendar_table(c);
    fputs("</section>\n", c->fp);
}

/* ---- 7: feed budget ------------------------------------------------------- */

static void feed_bars(const ctx *c, double vmax, double x0, double w, double y0, double h)
{
    FILE *fp = c->fp;
    const plan_problem *pb = c->pb;
    double bw = w / pb->n_weeks;
    for (int t = 0; t < pb->n_weeks; t++) {
        double pas = 0, sup = 0;
        for (int m = 0; m < pb->n_mobs; m++)
            pas += pasture_t(c, m, t), sup += supplement_t(c, m, t);
        double hp = h * un_mass(c->u, pas) / vmax, hs = h * un_mass(c->u, sup) / vmax, x = x0 + t * bw + bw * 0.15;
        fprintf(fp, "<g class=\"feed-week\" data-week=\"%d\">", t + 1);
        svgf(fp, "<rect x=\"@\" y=\"@\" width=\"@\" height=\"@\" fill=\"#6a994e\"/>", 4,
             (double[]){x, y0 + h - hp, bw * 0.7, hp});
        svgf(fp, "<rect x=\"@\" y=\"@\" width=\"@\" height=\"@\" fill=\"#b5543a\"/>", 4,
             (double[]){x, y0 + h - hp - hs, bw * 0.7, hs});
        svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"10\" text-anchor=\"middle\" fill=\"#22303a\">", 2,
             (double[]){x + bw * 0.35, y0 + h + 13});
        fprintf(fp, "W%d</text></g>\n", t + 1);
    }
}

static void axis_y(const ctx *c, double vmax, double x0, double x1, double y0, double h, const char *unit)
{
    FILE *fp = c->fp;
    double step = nice_step(vmax, 4);
    char t[80];
    for (double v = 0; v <= vmax + 1e-9; v += step) {
        double y = y0 + h - h * v / vmax;
        svgf(fp, "<line x1=\"@\" y1=\"@\" x2=\"@\" y2=\"@\" stroke=\"#e4dfd3\"/>", 4, (double[]){x0, y, x1, y});
        svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"10\" text-anchor=\"end\" fill=\"#6f7a80\">", 2,
             (double[]){x0 - 4, y + 3.5});
        fprintf(fp, "%s</text>\n", rpt_num(t, sizeof t, v, step < 1 ? 1 : 0, 1));
    }
    svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"10\" fill=\"#6f7a80\">", 2, (double[]){x0 - 40, y0 - 10});
    rpt_escape(fp, unit);
    fputs(" per week</text>\n", fp);
}

static void feed_section(const ctx *c)
{
    FILE *fp = c->fp;
    const plan_problem *pb = c->pb;
    double vmax = 0;
    for (int t = 0; t < pb->n_weeks; t++) {
        double s = 0;
        for (int m = 0; m < pb->n_mobs; m++)
            s += pb->mob[m].demand_t_d * 7;
        if (un_mass(c->u, s) > vmax)
            vmax = un_mass(c->u, s);
    }
    double step = nice_step(vmax, 4);
    vmax = step * ceil(vmax * 1.02 / step);
    section(c, "feed", 7, "Feed budget");
    fprintf(fp, "<p>What the animals eat each week, %s: from pasture on the days they graze, and as "
                "supplement on the days pasture cannot carry them.</p>\n", un_mass_name(c->u));
    fputs("<figure id=\"fig-feed\">\n<svg xmlns=\"http://www.w3.org/2000/svg\" role=\"img\" "
          "aria-labelledby=\"fig-feed-t\" viewBox=\"0 0 720 250\">\n<title id=\"fig-feed-t\">Feed budget by week: "
          "pasture and supplement</title>\n", fp);
    axis_y(c, vmax, 60, 700, 30, 180, un_mass_name(c->u));
    feed_bars(c, vmax, 60, 640, 30, 180);
    fputs("<rect x=\"60\" y=\"232\" width=\"12\" height=\"12\" fill=\"#6a994e\"/><text x=\"76\" y=\"242\" "
          "font-size=\"10\" fill=\"#22303a\">pasture</text><rect x=\"150\" y=\"232\" width=\"12\" height=\"12\" "
          "fill=\"#b5543a\"/><text x=\"166\" y=\"242\" font-size=\"10\" fill=\"#22303a\">supplement</text>\n", fp);
    fprintf(fp, "</svg>\n<figcaption>Figure 5. Pasture (green) and supplement (rust) by week, %s.</figcaption>\n"
                "</figure>\n", un_mass_name(c->u));
    fprintf(fp, "<table id=\"feed-table\"><thead><tr><th>Week</th><th class=\"n\">Pasture, %s</th>"
                "<th class=\"n\">Supplement, %s</th><th class=\"n\">Share from pasture</th></tr></thead><tbody>\n",
            un_mass_name(c->u), un_mass_name(c->u));
    for (int t = 0; t < pb->n_weeks; t++) {
        double pas = 0, sup = 0;
        for (int m = 0; m < pb->n_mobs; m++)
            pas += pasture_t(c, m, t), sup += supplement_t(c, m, t);
        fprintf(fp, "<tr><td>%d</td><td class=\"n\">", t + 1);
        num(c, un_mass(c->u, pas), 2);
        fputs("</td><td class=\"n\">", fp);
        num(c, un_mass(c->u, sup), 2);
        fputs("</td><td class=\"n\">", fp);
        numu(c, pas + sup > 0 ? 100 * pas / (pas + sup) : 0, 0, "%");
        fputs("</td></tr>\n", fp);
    }
    fputs("</tbody></table>\n</section>\n", fp);
}

/* ---- 8: mowing ------------------------------------------------------------ */

static void mowing_section(const ctx *c)
{
    FILE *fp = c->fp;
    const plan_problem *pb = c->pb;
    int jobs = 0;
    section(c, "mowing", 8, "Mowing jobs");
    for (int t = 0; t < pb->n_weeks; t++)
        for (int p = 0; p < pb->n_paddocks; p++) {
            if (!c->r->opt.mow[(size_t)p * pb->n_weeks + t])
                continue;
            if (jobs++ == 0)
                fprintf(fp, "<table id=\"mowing-table\"><thead><tr><th>Week</th><th>By</th><th>Paddock</th>"
                            "<th class=\"n\">Area, %s</th><th class=\"n\">Down to, %s</th><th class=\"n\">Cost, ",
                        un_area_name(c->u), un_cover_name(c->u));
            if (jobs == 1) {
                rpt_escape(fp, c->s->costs.currency);
                fputs("</th></tr></thead><tbody>\n", fp);
            }
            char d[16];
            date_text(pb->start_day + 7 * (int64_t)t + 6, d);
            fprintf(fp, "<tr data-week=\"%d\"><td>%d</td><td>%s %s</td><td>", t + 1, t + 1,
                    day_name[weekday(pb->start_day + 7 * (int64_t)t + 6)], d);
            rpt_escape(fp, pb->pd[p].id);
            fputs("</td><td class=\"n\">", fp);
            num(c, un_area(c->u, pb->pd[p].area_ha), 2);
            fputs("</td><td class=\"n\">", fp);
            num(c, un_cover(c->u, 1000 * pb->pd[p].residual_t_ha), 0);
            fputs("</td><td class=\"n\">", fp);
            num(c, pb->pd[p].area_ha * pb->cost_mowing_per_ha, 0);
            fputs("</td></tr>\n", fp);
        }
    if (jobs)
        fputs("</tbody></table>\n<p class=\"note\">Mow only with the array&#39;s owner&#39;s agreement, "
              "clear of cables, posts and modules; see section 11.</p>\n", fp);
    else
        fputs("<p id=\"mowing-none\">No mowing in this plan: grazing holds every paddock under its "
              "vegetation ceiling.</p>\n", fp);
    fputs("</section>\n", fp);
}

/* ---- 9: plan versus baseline --------------------------------------------- */

static void cmp_row(const ctx *c, const char *key, const char *label, double a, double b, int d, const char *unit)
{
    FILE *fp = c->fp;
    fprintf(fp, "<tr data-key=\"%s\"><th>%s, ", key, label);
    rpt_escape(fp, unit);
    fputs("</th><td class=\"n\">", fp);
    num(c, a, d);
    fputs("</td><td class=\"n\">", fp);
    num(c, b, d);
    fputs("</td><td class=\"n\">", fp);
    num(c, a - b, d);
    fputs("</td></tr>\n", fp);
}

static void cost_bar(const ctx *c, const pv_result *v, const char *name, double y, double vmax)
{
    FILE *fp = c->fp;
    double part[4] = {v->cost_supplement, v->cost_mowing, v->cost_moves, v->penalty_terminal};
    static const char *const colour[4] = {"#b5543a", "#7b5ea7", "#2f6f73", "#c9b458"};
    double x = 130, w = 560;
    fprintf(fp, "<text x=\"122\" y=\"");
    co(fp, y + 15);
    fprintf(fp, "\" font-size=\"11\" text-anchor=\"end\" fill=\"#22303a\">%s</text>\n", name);
    for (int k = 0; k < 4; k++) {
        double bw = vmax > 0 ? w * part[k] / vmax : 0;
        svgf(fp, "<rect x=\"@\" y=\"@\" width=\"@\" height=\"22\" ", 3, (double[]){x, y, bw});
        fprintf(fp, "fill=\"%s\"/>\n", colour[k]);
        x += bw;
    }
    svgf(fp, "<text x=\"@\" y=\"@\" font-size=\"10\" fill=\"#22303a\">", 2, (double[]){x + 4 < 640 ? x + 4 : 640, y + 15});
    numu(c, v->cost_total, 0, c->s->costs.currency);
    fputs("</text>\n", fp);
}

static void compare_figure(const ctx *c)
{
    FILE *fp = c->fp;
    const pv_result *a = &c->r->vopt, *b = &c->r->vbase;
    double vmax = (a->cost_total > b->cost_total ? a->cost_total : b->cost_total) * 1.12;
    fputs("<figure id=\"fig-compare\">\n<svg xmlns=\"http://www.w3.org/2000/svg\" role=\"img\" "
          "aria-labelledby=\"fig-compare-t\" viewBox=\"0 0 720 110\">\n<title id=\"fig-compare-t\">Cost of the plan "
          "and of the baseline, by part</title>\n", fp);
    cost_bar(c, a, "this plan", 8, vmax);
    cost_bar(c, b, "baseline", 40, vmax);
    static const char *const names[4] = {"supplement", "mowing", "moves", "end-cover shortfall"};
    static const char *const colour[4] = {"#b5543a", "#7b5ea7", "#2f6f73", "#c9b458"};
    for (int k = 0; k < 4; k++) {
        fprintf(fp, "<rect x=\"%d\" y=\"84\" width=\"12\" height=\"12\" fill=\"%s\"/><text x=\"%d\" y=\"94\" "
                    "font-size=\"10\" fill=\"#22303a\">%s</text>\n", 130 + 130 * k, colour[k], 146 + 130 * k, names[k]);
    }
    fputs("</svg>\n<figcaption>Figure 6. The cost of each plan split into its parts.</figcaption>\n</figure>\n", fp);
}

static void solver_note(const ctx *c)
{
    FILE *fp = c->fp;
    const pm_result *m = &c->r->milp;
    fputs("<p class=\"note\" id=\"solver\">", fp);
    if (c->r->fell_back)
        fputs("The solver gave no plan in the time allowed, so the baseline stands as the plan. ", fp);
    else if (m->status == PM_OPTIMAL)
        fputs("The solver proved this plan optimal for the model. ", fp);
    else
        fputs("The solver stopped at its time or gap limit with this plan. ", fp);
    if (!c->r->fell_back && isfinite(m->bound)) {
        fputs("No plan can cost less than ", fp);
        numu(c, m->bound, 0, c->s->costs.currency);
        fputs(" (gap ", fp);
        num(c, 100 * m->gap, 2);
        fputs("&nbsp;%). ", fp);
    }
    char tl[40], gp[40];
    fprintf(fp, "Limits asked: %s&nbsp;s, gap %s&nbsp;%%. Both plans were re-checked rule by rule by a "
                "plain simulation that does not use the solver: no rule is broken.</p>\n",
            rpt_num(tl, sizeof tl, c->in->time_limit_s, 1, 0), rpt_num(gp, sizeof gp, c->in->gap_pct, 1, 0));
}

static void compare_section(const ctx *c)
{
    FILE *fp = c->fp;
    const pv_result *a = &c->r->vopt, *b = &c->r->vbase;
    int u = c->u;
    const char *cur = c->s->costs.currency;
    section(c, "compare", 9, "This plan against the baseline");
    fputs("<p>The baseline is the rule of thumb: each week the mob goes to the rested paddock with the most "
          "cover and grazes it to the residual, fed supplement when pasture runs short, and a paddock that "
          "would pass its ceiling is mowed.</p>\n", fp);
    fputs("<table id=\"compare-table\"><thead><tr><th></th><th class=\"n\">This plan</th><th class=\"n\">Baseline</th>"
          "<th class=\"n\">Difference</th></tr></thead><tbody>\n", fp);
    cmp_row(c, "supplement", "Supplement", un_mass(u, a->supplement_t), un_mass(u, b->supplement_t), 2, un_mass_name(u));
    cmp_row(c, "mowed", "Mowed", un_area(u, a->mowed_ha), un_area(u, b->mowed_ha), 2, un_area_name(u));
    cmp_row(c, "moves", "Moves", a->moves, b->moves, 0, "count");
    cmp_row(c, "shortfall", "End-cover shortfall", un_mass(u, a->terminal_shortfall_t),
            un_mass(u, b->terminal_shortfall_t), 2, un_mass_name(u));
    cmp_row(c, "cost", "Cost", a->cost_total, b->cost_total, 2, cur);
    fputs("</tbody></table>\n", fp);
    compare_figure(c);
    solver_note(c);
    fputs("</section>\n", fp);
}

/* ---- 10: assumptions and sources ------------------------------------------ */

static void weather_list(const ctx *c)
{
    FILE *fp = c->fp;
    const site_weather *w = &c->s->weather;
    for (int k = 0; k < w->n_files; k++) {
        const char *slash = strrchr(w->files[k], '/');
        fputs(k ? ", " : "", fp);
        fputs("<code>", fp);
        rpt_escape(fp, slash ? slash + 1 : w->files[k]);
        fputs("</code>", fp);
    }
}

static void sward_list(const ctx *c)
{
    FILE *fp = c->fp;
    for (int k = 0; k < c->s->n_swards; k++) {
        const sward_params *sp = &c->s->swards[k].p;
        fputs(k ? "; " : "", fp);
        rpt_escape(fp, c->s->swards[k].id);
        fputs(": parameter set <code>", fp);
        rpt_escape(fp, sp->name);
        fputs("</code> (", fp);
        rpt_escape(fp, sp->title);
        fputs(")", fp);
    }
}

static void assumptions_section(const ctx *c)
{
    FILE *fp = c->fp;
    const site *s = c->s;
    section(c, "assumptions", 10, "Assumptions and their sources");
    fputs("<ul>\n<li>Weather: ", fp);
    weather_list(c);
    fprintf(fp, ", hourly; the forecast uses every year that covers the plan&#39;s weeks (%d). "
                "Percentiles across years: Hyndman &amp; Fan (1996), definition 7.</li>\n", c->in->fc->n_years);
    fputs("<li>Sun position: NREL Solar Position Algorithm, Reda &amp; Andreas (2004). Beam and diffuse "
          "light: Erbs, Klein &amp; Duffie (1982). Tracker rotation: Marion &amp; Dobos (2013)", fp);
    fputs(s->array.backtracking ? "; backtracking: Anderson &amp; Mikofski (2020).</li>\n" : ".</li>\n", fp);
    fputs("<li>Light, sky light and rain on each ground strip from the row&#39;s two-dimensional geometry; "
          "leaf temperature and vapour pressure deficit from the leaf energy balance (Campbell &amp; Norman "
          "1998). See docs/model.md and docs/strips.md.</li>\n", fp);
    fputs("<li>Soil water: FAO-56 dual crop coefficient water balance, Allen, Pereira, Raes &amp; Smith "
          "(1998). Growth: canopy photosynthesis of sunlit and shaded leaves (de Pury &amp; Farquhar 1997) "
          "with a non-rectangular leaf light response (Thornley &amp; Johnson 1990), times temperature, "
          "vapour pressure deficit (3-PG modifier, Landsberg &amp; Waring 1997) and water stress factors; "
          "the sward in shade transpires with its stomata partly shut (Noilhan &amp; Planton 1989); "
          "each year starts at field capacity in the midwinter before the season (1 January north of the "
          "equator, 1 July south of it; docs/model.md).</li>\n<li>Swards: ", fp);
    sward_list(c);
    fputs("; every parameter&#39;s source is in its file under models/swards/ (&lsquo;from memory&rsquo; "
          "marks values not yet checked against a publication).</li>\n", fp);
    fputs("<li>Plan: the mixed-integer program of docs/planner.md, solved with GLPK. Start cover, where "
          "not measured, is the residual plus a third of the way to the ceiling; senescence acts on the "
          "cover above the residual; the end-cover target is the mean residual plus half the way to the "
          "lower of the mean start cover and the cover the farm would keep ungrazed, its shortfall "
          "charged at 1.5 times the supplement price (common practice, no source).</li>\n<li>Costs from "
          "the site file: supplement ", fp);
    numu(c, s->costs.supplement_per_t_dm, 0, s->costs.currency);
    fputs(" per t DM, mowing ", fp);
    numu(c, un_per_area_cost(c->u, s->costs.mowing_per_ha), 2, s->costs.currency);
    fprintf(fp, " per %s, ", un_area_name(c->u));
    numu(c, s->costs.per_move, 0, s->costs.currency);
    fputs(" per move.</li>\n<li>Units: ", fp);
    if (c->u == SITE_UNITS_US)
        fputs("acres, pounds and short tons of dry matter, inches, feet, &#176;F; conversions exact by "
              "definition, NIST Special Publication 811 (2008), appendix B.8.</li>\n", fp);
    else
        fputs("SI: hectares, kilograms and tonnes of dry matter, centimetres, metres, &#176;C.</li>\n", fp);
    fputs("</ul>\n</section>\n", fp);
}

/* ---- 11: cautions --------------------------------------------------------- */

static void cautions_section(const ctx *c)
{
    section(c, "cautions", 11, "Cautions");
    fputs("<div class=\"caution\">\n<ul>\n"
          "<li><b>PV arrays are live whenever light falls on them.</b> Modules, cables and connectors carry "
          "dangerous voltage in daylight even when the plant is switched off.</li>\n"
          "<li><b>Animals chew cables.</b> Keep cables protected and out of reach, keep animals from "
          "contact with equipment (posts, trackers, inverters, combiner boxes), and let only qualified "
          "people open enclosures.</li>\n"
          "<li><b>Heat stress, water and shade.</b> Water needs rise sharply in heat: give clean water in "
          "every paddock, check it daily, and make sure the animals have shade and are watched on hot "
          "days.</li>\n"
          "<li><b>Fire risk from dry vegetation.</b> Dry, tall grass under and around the array can carry "
          "fire; keep it down, and keep fire breaks and access ways clear.</li>\n"
          "<li><b>Toxic plants and herbicide keep-off periods.</b> Check paddocks for plants poisonous to "
          "the stock, and keep animals off treated ground for the whole keep-off period on the product "
          "label.</li>\n"
          "<li><b>Defer to local codes, the site&#39;s safety rules and licensed professionals</b> "
          "(electricians, veterinarians, agronomists). This plan is a forecast from a model; it does not "
          "replace their judgement or your own eyes on the ground.</li>\n"
          "</ul>\n</div>\n</section>\n", c->fp);
}

/* ---- the data block ----------------------------------------------------- */

static void data_totals(FILE *fp, const char *name, const pv_result *v)
{
    fprintf(fp, "  \"%s\": {\"supplement_t\": %.3f, \"mowed_ha\": %.2f, \"moves\": %d, "
                "\"terminal_shortfall_t\": %.3f, \"cost\": %.2f}",
            name, v->supplement_t, v->mowed_ha, v->moves, v->terminal_shortfall_t, v->cost_total);
}

static void data_week(const ctx *c, int t)
{
    FILE *fp = c->fp;
    const plan_problem *pb = c->pb;
    char a[16];
    date_text(pb->start_day + 7 * (int64_t)t, a);
    fprintf(fp, "    {\"week\": %d, \"start\": \"%s\", \"grazing\": [", t + 1, a);
    int first = 1;
    for (int m = 0; m < pb->n_mobs; m++)
        for (int p = 0; p < pb->n_paddocks; p++) {
            int d = days_of(c, &c->r->opt, m, p, t);
            if (d <= 0)
                continue;
            fputs(first ? "{\"mob\": " : ", {\"mob\": ", fp);
            json_str(fp, pb->mob[m].id);
            fputs(", \"paddock\": ", fp);
            json_str(fp, pb->pd[p].id);
            fprintf(fp, ", \"days\": %d}", d);
            first = 0;
        }
    fputs("], \"supplement_t\": [", fp);
    for (int m = 0; m < pb->n_mobs; m++)
        fprintf(fp, "%s%.3f", m ? ", " : "", supplement_t(c, m, t));
    fputs("], \"mow\": [", fp);
    first = 1;
    for (int p = 0; p < pb->n_paddocks; p++)
        if (c->r->opt.mow[(size_t)p * pb->n_weeks + t]) {
            fputs(first ? "" : ", ", fp);
            json_str(fp, pb->pd[p].id);
            first = 0;
        }
    fprintf(fp, "]}%s\n", t + 1 < pb->n_weeks ? "," : "");
}

static void data_block(const ctx *c)
{
    FILE *fp = c->fp;
    char a[16];
    date_text(c->pb->start_day, a);
    fprintf(fp, "<script type=\"application/json\" id=\"rowgraze-plan\">\n{\n  \"start\": \"%s\",\n"
                "  \"weeks\": %d,\n  \"units_shown\": \"%s\",\n  \"status\": \"%s\",\n",
            a, c->pb->n_weeks, c->u == SITE_UNITS_US ? "us" : "metric",
            c->r->milp.status == PM_OPTIMAL ? "optimal" : "feasible");
    data_totals(fp, "plan", &c->r->vopt);
    fputs(",\n", fp);
    data_totals(fp, "baseline", &c->r->vbase);
    fputs(",\n  \"calendar\": [\n", fp);
    for (int t = 0; t < c->pb->n_weeks; t++)
        data_week(c, t);
    fputs("  ]\n}\n</script>\n", fp);
}

static void footer(const ctx *c)
{
    const char *slash = strrchr(c->s->path, '/');
    fputs("<footer>Made by rowgraze " RG_VERSION " (GPL-3.0-or-later) from <code>", c->fp);
    rpt_escape(c->fp, slash ? slash + 1 : c->s->path);
    fputs("</code>. The same site file and options give the same report.</footer>\n", c->fp);
}

int rpt_write(FILE *fp, const rpt_input *in)
{
    ctx c = {.fp = fp, .in = in, .s = in->s, .pb = &in->run->pb, .r = in->run, .u = in->units};
    head(&c);
    header(&c);
    job(&c);
    site_section(&c);
    row_figure(&c);
    forecast_section(&c);
    cover_section(&c);
    calendar_section(&c);
    feed_section(&c);
    mowing_section(&c);
    compare_section(&c);
    assumptions_section(&c);
    cautions_section(&c);
    data_block(&c);
    footer(&c);
    fputs("</body>\n</html>\n", fp);
    return ferror(fp) ? -1 : 0;
}
