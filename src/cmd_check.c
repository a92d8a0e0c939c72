/* cmd_check.c - `rowgraze check SITE.json`: validate and summarise inputs.
 *
 * Reads the site file, the sward sets it names and every weather file, and
 * prints what a grazier would want to confirm before planning: where the
 * site is, how the array is built, the paddocks, what the flock eats per
 * day, the rules, the maintenance windows and how complete the weather is.
 */
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "cli.h"
#include "diag.h"
#include "site.h"
#include "tcal.h"
#include "weather.h"

static const char *const species_name[] = {"sheep", "cattle", "goats"};

static void help(void)
{
    puts("usage: rowgraze check [--models DIR] SITE.json\n\n"
         "Validates SITE.json, the sward parameter sets it names and every weather\n"
         "file, then prints a summary: site, array, paddocks, flock demand per day,\n"
         "grazing rules, maintenance windows, weather span and completeness.\n\n"
         "Options:\n"
         "  --models DIR   sward parameter sets (default: $ROWGRAZE_MODELS or the\n"
         "                 models/ directory rowgraze was built with)\n"
         "  -h, --help     show this help\n\n"
         "Exit status: 0 valid, 2 invalid input (one error line on stderr).");
}

static void print_site(const site *s)
{
    const site_location *l = &s->loc;
    printf("Site         %s\n", s->name[0] ? s->name : "(unnamed)");
    printf("Location     %.4f %s, %.4f %s, %.0f m above sea level\n",
           fabs(l->latitude_deg), l->latitude_deg >= 0 ? "N" : "S",
           fabs(l->longitude_deg), l->longitude_deg >= 0 ? "E" : "W", l->elevation_m);
    int mins = (int)lround(fabs(l->utc_offset_h) * 60);
    printf("Time base    weather timestamps in UTC%c%02d:%02d, no daylight saving\n",
           l->utc_offset_h < 0 ? '-' : '+', mins / 60, mins % 60);
}

static void print_array(const site *s)
{
    const site_array *a = &s->array;
    printf("Array        single-axis trackers, axis to %.0f deg (tilt %.1f deg), rows %.2f m apart\n",
           a->axis_azimuth_deg, a->axis_tilt_deg, a->pitch_m);
    printf("             panels %.2f m wide on a %.2f m hub (%.0f %% ground cover)\n",
           a->chord_m, a->hub_height_m, 100 * a->chord_m / a->pitch_m);
    printf("             turns +/-%.0f deg, backtracking %s; night %.0f deg; ",
           a->max_rotation_deg, a->backtracking ? "on" : "off", a->night_angle_deg);
    if (a->stow_wind_m_s > 0)
        printf("stow %.0f deg above %.1f m/s wind\n", a->stow_angle_deg, a->stow_wind_m_s);
    else
        printf("no wind stow\n");
    printf("             lowest panel edge %.2f m above ground at full tilt\n",
           site_lowest_edge_m(a));
    printf("             ground cut into %d strips of %.2f m; drip band %.2f m\n",
           (int)lround(a->pitch_m / a->strip_width_m), a->strip_width_m, a->drip_width_m);
}

static void print_soils_swards(const site *s)
{
    for (int i = 0; i < s->n_soils; i++) {
        const site_soil *so = &s->soils[i];
        printf("%-12s %s: %.0f mm plant-available water (%.0f mm/m over %.2f m roots), takes in %.0f mm/h\n",
               i ? "" : "Soils", so->id, so->water_held_mm_per_m * so->rooting_depth_m,
               so->water_held_mm_per_m, so->rooting_depth_m, so->infiltration_mm_h);
        if (so->texture[0])
            printf("%-12s %*s  texture %s: soil water flows sideways between strips\n", "",
                   (int)strlen(so->id), "", so->texture);
    }
    for (int i = 0; i < s->n_swards; i++) {
        const sward_params *p = &s->swards[i].p;
        printf("%-12s %s: parameter set %s, %.0f kg DM/ha per cm of height\n", i ? "" : "Swards",
               s->swards[i].id, p->name, p->height_mass_kgdm_ha_per_cm);
        printf("             (%s)\n", p->title);
    }
}

static void print_paddocks(const site *s)
{
    double total = 0, under = 0;
    for (int i = 0; i < s->n_paddocks; i++) {
        total += s->paddocks[i].area_ha;
        under += s->paddocks[i].area_ha * s->paddocks[i].array_share;
    }
    printf("Paddocks     %d paddocks, %.1f ha: %.1f ha under the array, %.1f ha open ground\n",
           s->n_paddocks, total, under, total - under);
    printf("             %-10s %-8s %8s %12s  %-12s %s\n", "paddock", "block", "area ha",
           "under array", "soil", "sward");
    for (int i = 0; i < s->n_paddocks; i++) {
        const site_paddock *p = &s->paddocks[i];
        printf("             %-10s %-8s %8.2f %11.0f%%  %-12s %s\n", p->id,
               p->block[0] ? p->block : "-", p->area_ha, 100 * p->array_share,
               s->soils[p->soil].id, s->swards[p->sward].id);
    }
}

static void print_flock(const site *s)
{
    double area = 0;
    int head = 0;
    for (int i = 0; i < s->n_paddocks; i++)
        area += s->paddocks[i].area_ha;
    for (int i = 0; i < s->n_mobs; i++) {
        const site_mob *m = &s->mobs[i];
        head += m->head;
        printf("%-12s %s: %d %s of %.0f kg, %.2f kg DM/head/day", i ? "" : "Flock",
               m->id, m->head, species_name[m->species], m->liveweight_kg, m->intake_kgdm_d);
        if (m->intake_pct_lw > 0)
            printf(" (%.1f %% of LW)", m->intake_pct_lw);
        printf(" = %.0f kg DM/d\n", m->head * m->intake_kgdm_d);
        if (m->species == SPECIES_CATTLE && site_lowest_edge_m(&s->array) < s->rules.cattle_min_clearance_m)
            printf("             note: the lowest panel edge (%.2f m) is below the cattle clearance (%.2f m); cattle will be kept out of array paddocks\n",
                   site_lowest_edge_m(&s->array), s->rules.cattle_min_clearance_m);
    }
    double d = site_demand_kgdm_d(s);
    printf("Demand       %.0f kg DM/day, %.2f t DM/week; %.1f head/ha over %.1f ha\n", d,
           d * 7 / 1000, head / area, area);
}

static void print_rules(const site *s)
{
    const site_rules *r = &s->rules;
    const sward_params *p = &s->swards[0].p;
    printf("Rules        leave %.0f cm (%.0f kg DM/ha on %s)\n", r->residual_height_cm,
           sward_cover_kgdm_ha(p, r->residual_height_cm), s->swards[0].id);
    printf("             rest at least %d days; at most %d days per visit\n", r->min_rest_days,
           r->max_days_per_visit);
    if (r->ceiling_derived)
        printf("             vegetation ceiling %.0f cm (lowest panel edge %.0f cm less %.0f cm margin)\n",
               r->ceiling_height_cm, site_lowest_edge_m(&s->array) * 100, r->ceiling_margin_cm);
    else
        printf("             vegetation ceiling %.0f cm (set in the site file)\n", r->ceiling_height_cm);
    printf("             paddocks %s between mobs\n", r->share_paddocks ? "may be shared" : "are not shared");
    const site_costs *k = &s->costs;
    printf("Costs        supplement %.2f %s/t DM, mowing %.2f %s/ha, moving a mob %.2f %s\n",
           k->supplement_per_t_dm, k->currency, k->mowing_per_ha, k->currency, k->per_move, k->currency);
}

static void print_windows(const site *s)
{
    if (s->n_windows == 0) {
        printf("Maintenance  none planned\n");
        return;
    }
    for (int i = 0; i < s->n_windows; i++) {
        const site_window *w = &s->windows[i];
        char a[11], b[11];
        tcal_format_date(w->from_day, a);
        tcal_format_date(w->to_day, b);
        printf("%-12s %s to %s, no animals in", i ? "" : "Maintenance", a, b);
        for (int j = 0; j < w->n_paddocks; j++)
            printf("%s%s", j ? "," : " ", s->paddocks[w->paddocks[j]].id);
        printf("%s%s\n", w->reason[0] ? ": " : "", w->reason);
    }
}

static void print_series(const wx_series *w)
{
    char a[17], b[17];
    tcal_format_hour(w->t0_h, a);
    tcal_format_hour(w->t0_h + (int64_t)w->n - 1, b);
    a[10] = b[10] = ' ';
    double rain = 0, temp = 0;
    for (size_t h = 0; h < w->n; h++) {
        rain += w->v[WX_RAIN][h];
        temp += w->v[WX_TEMP][h];
    }
    const char *slash = strrchr(w->path, '/');
    printf("             %s: %s to %s, %zu h\n", slash ? slash + 1 : w->path, a, b, w->n);
    printf("               %.1f %% measured (%zu h filled), rain %.0f mm, mean %.1f C\n",
           100.0 * (double)(w->n - w->n_filled) / (double)w->n, w->n_filled, rain,
           temp / (double)w->n);
}

static void print_weather(const wx_set *wx)
{
    size_t hours = 0;
    for (int i = 0; i < wx->n; i++)
        hours += wx->s[i].n;
    printf("Weather      %d file%s, %zu hours (%.1f years)\n", wx->n, wx->n == 1 ? "" : "s",
           hours, (double)hours / 8766.0);
    for (int i = 0; i < wx->n; i++)
        print_series(&wx->s[i]);
}

int cmd_check(int argc, char **argv)
{
    static const struct option opts[] = {
        {"models", required_argument, 0, 'm'}, {"help", no_argument, 0, 'h'}, {0, 0, 0, 0}};
    const char *models = NULL;
    int ch;
    optind = 1;
    opterr = 0; /* our own one-line message instead of getopt's */
    while ((ch = getopt_long(argc, argv, "h", opts, NULL)) != -1) {
        if (ch == 'h') {
            help();
            return RG_EXIT_OK;
        }
        if (ch == 'm')
            models = optarg;
        else
            return cli_usage_error("check", "check: unknown option or missing value: '%s'", argv[optind - 1]);
    }
    if (argc - optind != 1)
        return cli_usage_error("check", "check: expected one site file, found %d arguments", argc - optind);
    site s;
    wx_set wx;
    if (cli_load(argv[optind], models, &s, &wx) != RG_EXIT_OK)
        return RG_EXIT_INPUT;
    print_site(&s);
    print_array(&s);
    print_soils_swards(&s);
    print_paddocks(&s);
    print_flock(&s);
    print_rules(&s);
    print_windows(&s);
    print_weather(&wx);
    printf("OK           %s and everything it names are valid.\n", s.path);
    cli_unload(&s, &wx);
    return RG_EXIT_OK;
}
