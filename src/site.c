/* site.c - reads and validates the JSON site file (input stage).
 *
 * One static reader per section, in file order: location, array, soils,
 * swards, paddocks, mobs, rules, costs, maintenance, weather.  Each reader
 * checks types and ranges through jsonin.c; cross-section checks (ids that
 * must exist, pitch larger than the chord, a ceiling above the residual)
 * run as soon as both sides are known.  The key names are documented in
 * docs/inputs.md; keep the two in step.
 */
#include "site.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "jsonin.h"
#include "texture.h"
#include "tcal.h"
#include "textfile.h"

#define DEG (3.14159265358979323846 / 180.0) /* radians per degree */

/* Per-entry path such as "$.paddocks[3]". */
static void item_path(char *buf, size_t cap, const char *list, int i)
{
    snprintf(buf, cap, "$.%s[%d]", list, i);
}

/* ---- location ---------------------------------------------------------- */

static int read_location(ji_ctx *c, const cJSON *doc, site_location *l)
{
    static const char *const keys[] = {"latitude_deg", "longitude_deg",
                                       "elevation_m", "utc_offset_h", NULL};
    const char *p = "$.location";
    if (ji_require(c, doc, "$", "location") < 0)
        return -1;
    const cJSON *o = ji_get(doc, "location");
    if (ji_keys(c, o, p, keys) < 0 ||
        ji_number(c, o, p, "latitude_deg", 1, JI_RANGE, -90, 90, &l->latitude_deg) < 0 ||
        ji_number(c, o, p, "longitude_deg", 1, JI_RANGE, -180, 180, &l->longitude_deg) < 0 ||
        ji_number(c, o, p, "elevation_m", 1, JI_RANGE, -450, 6000, &l->elevation_m) < 0 ||
        ji_number(c, o, p, "utc_offset_h", 1, JI_RANGE, -12, 14, &l->utc_offset_h) < 0)
        return -1;
    if (fmod(l->utc_offset_h * 4, 1) != 0)
        return rg_fail(c->err, "%s: %s.utc_offset_h: expected whole quarter hours (e.g. -7, 5.5), found %g",
                       c->file, p, l->utc_offset_h);
    return 0;
}

/* ---- array ------------------------------------------------------------- */

static int read_array_numbers(ji_ctx *c, const cJSON *o, site_array *a)
{
    const char *p = "$.array";
    return (ji_number(c, o, p, "axis_azimuth_deg", 1, JI_RANGE, 0, 360, &a->axis_azimuth_deg) < 0 ||
            ji_number(c, o, p, "axis_tilt_deg", 0, JI_RANGE, 0, 45, &a->axis_tilt_deg) < 0 ||
            ji_number(c, o, p, "cross_axis_slope_deg", 0, JI_RANGE, -30, 30, &a->cross_axis_slope_deg) < 0 ||
            ji_number(c, o, p, "pitch_m", 1, JI_RANGE, 0.5, 50, &a->pitch_m) < 0 ||
            ji_number(c, o, p, "chord_m", 1, JI_RANGE, 0.2, 20, &a->chord_m) < 0 ||
            ji_number(c, o, p, "hub_height_m", 1, JI_RANGE, 0.3, 10, &a->hub_height_m) < 0 ||
            ji_number(c, o, p, "max_rotation_deg", 1, JI_RANGE, 5, 90, &a->max_rotation_deg) < 0 ||
            ji_bool(c, o, p, "backtracking", 0, &a->backtracking) < 0 ||
            ji_number(c, o, p, "night_angle_deg", 0, JI_RANGE, -90, 90, &a->night_angle_deg) < 0 ||
            ji_number(c, o, p, "stow_angle_deg", 0, JI_RANGE, -90, 90, &a->stow_angle_deg) < 0 ||
            ji_number(c, o, p, "stow_wind_m_s", 0, JI_RANGE, 0, 80, &a->stow_wind_m_s) < 0 ||
            ji_number(c, o, p, "strip_width_m", 0, JI_RANGE, 0.01, 5, &a->strip_width_m) < 0 ||
            ji_number(c, o, p, "drip_width_m", 0, JI_RANGE, 0.01, 5, &a->drip_width_m) < 0)
               ? -1 : 0;
}

static int check_array(ji_ctx *c, const site_array *a)
{
    const char *p = "$.array";
    if (a->pitch_m <= a->chord_m)
        return rg_fail(c->err, "%s: %s.pitch_m: expected a row pitch larger than chord_m (%g m), found %g m",
                       c->file, p, a->chord_m, a->pitch_m);
    /* the strip geometry turns panels up to 90 deg (e.g. in its sky view
     * table), so the edge must clear the ground even then */
    if (a->hub_height_m - a->chord_m / 2 <= 0.05)
        return rg_fail(c->err, "%s: %s.hub_height_m: expected a hub more than half the chord (%g m) above the ground, so that a panel edge clears it at any angle, found %g m",
                       c->file, p, a->chord_m / 2, a->hub_height_m);
    if (fabs(a->night_angle_deg) > a->max_rotation_deg)
        return rg_fail(c->err, "%s: %s.night_angle_deg: expected an angle within the rotation limit (+/-%g), found %g",
                       c->file, p, a->max_rotation_deg, a->night_angle_deg);
    if (fabs(a->stow_angle_deg) > a->max_rotation_deg)
        return rg_fail(c->err, "%s: %s.stow_angle_deg: expected an angle within the rotation limit (+/-%g), found %g",
                       c->file, p, a->max_rotation_deg, a->stow_angle_deg);
    if (a->strip_width_m > a->pitch_m / 4)
        return rg_fail(c->err, "%s: %s.strip_width_m: expected at most a quarter of the pitch (%g m), found %g m",
                       c->file, p, a->pitch_m / 4, a->strip_width_m);
    if (a->drip_width_m > a->pitch_m / 2)
        return rg_fail(c->err, "%s: %s.drip_width_m: expected at most half the pitch (%g m), found %g m",
                       c->file, p, a->pitch_m / 2, a->drip_width_m);
    return 0;
}

static int read_array(ji_ctx *c, const cJSON *doc, site_array *a)
{
    static const char *const keys[] = {
        "axis_azimuth_deg", "axis_tilt_deg", "cross_axis_slope_deg", "pitch_m",
        "chord_m", "hub_height_m", "max_rotation_deg", "backtracking",
        "night_angle_deg", "stow_angle_deg", "stow_wind_m_s", "strip_width_m",
        "drip_width_m", NULL};
    /* defaults: flat ground, backtracking on, flat at night, no wind stow;
     * 0.1 m strips and a 0.3 m drip band (common practice, no source) */
    *a = (site_array){.backtracking = 1, .strip_width_m = 0.1, .drip_width_m = 0.3};
    if (ji_require(c, doc, "$", "array") < 0)
        return -1;
    const cJSON *o = ji_get(doc, "array");
    if (ji_keys(c, o, "$.array", keys) < 0 || read_array_numbers(c, o, a) < 0)
        return -1;
    return check_array(c, a);
}

/* ---- soils and swards -------------------------------------------------- */

/* Reads an "id" and fails when an earlier entry already used it. */
static int read_id(ji_ctx *c, const cJSON *o, const char *path, char *id,
                   const char *ids, size_t stride, int n_before)
{
    if (ji_string(c, o, path, "id", 1, id, SITE_ID_LEN) < 0)
        return -1;
    for (const char *q = id; *q; q++)
        if (*q == '"' || *q == '\\' || *q == ',' || (unsigned char)*q < 32)
            return rg_fail(c->err, "%s: %s.id: expected an id without quotes, backslashes, commas or control characters, found \"%s\"",
                           c->file, path, id);
    for (int j = 0; j < n_before; j++)
        if (strcmp(ids + (size_t)j * stride, id) == 0)
            return rg_fail(c->err, "%s: %s.id: expected a unique id, found \"%s\" again",
                           c->file, path, id);
    return 0;
}

static int read_soils(ji_ctx *c, const cJSON *doc, site *s)
{
    static const char *const keys[] = {"id", "water_held_mm_per_m", "rooting_depth_m",
                                       "infiltration_mm_h", "texture", NULL};
    const cJSON *arr;
    if (ji_array(c, doc, "$", "soils", 1, &arr, &s->n_soils) < 0)
        return -1;
    if (s->n_soils == 0)
        return rg_fail(c->err, "%s: $.soils: expected at least one soil, found an empty list", c->file);
    s->soils = calloc((size_t)s->n_soils, sizeof *s->soils);
    if (!s->soils)
        return rg_fail(c->err, "out of memory");
    for (int i = 0; i < s->n_soils; i++) {
        char p[64];
        site_soil *so = &s->soils[i];
        const cJSON *o = cJSON_GetArrayItem(arr, i);
        item_path(p, sizeof p, "soils", i);
        if (ji_keys(c, o, p, keys) < 0 ||
            read_id(c, o, p, so->id, (const char *)s->soils, sizeof *so, i) < 0 ||
            ji_number(c, o, p, "water_held_mm_per_m", 1, JI_RANGE, 10, 400, &so->water_held_mm_per_m) < 0 ||
            ji_number(c, o, p, "rooting_depth_m", 1, JI_RANGE, 0.05, 5, &so->rooting_depth_m) < 0 ||
            ji_number(c, o, p, "infiltration_mm_h", 1, JI_RANGE, 0.1, 1000, &so->infiltration_mm_h) < 0 ||
            ji_string(c, o, p, "texture", 0, so->texture, sizeof so->texture) < 0)
            return -1;
        if (so->texture[0] && !tex_find(so->texture))
            return rg_fail(c->err, "%s: %s.texture: expected one of %s, found \"%s\"",
                           c->file, p, tex_names(), so->texture);
        double fc_mm_per_m = so->texture[0] ? 1000.0 * tex_theta_at_suction(tex_find(so->texture), TEX_FC_SUCTION_CM) : 1000.0;
        if (!(so->water_held_mm_per_m < fc_mm_per_m))
            return rg_fail(c->err, "%s: %s.water_held_mm_per_m: expected less than the %.0f mm/m a %s holds at field capacity, found %g",
                           c->file, p, fc_mm_per_m, so->texture, so->water_held_mm_per_m);
    }
    return 0;
}

static int read_swards(ji_ctx *c, const cJSON *doc, const char *models_dir, site *s)
{
    static const char *const keys[] = {"id", "params", NULL};
    const cJSON *arr;
    if (ji_array(c, doc, "$", "swards", 1, &arr, &s->n_swards) < 0)
        return -1;
    if (s->n_swards == 0)
        return rg_fail(c->err, "%s: $.swards: expected at least one sward, found an empty list", c->file);
    s->swards = calloc((size_t)s->n_swards, sizeof *s->swards);
    if (!s->swards)
        return rg_fail(c->err, "out of memory");
    for (int i = 0; i < s->n_swards; i++) {
        char p[64], params[64];
        site_sward *sw = &s->swards[i];
        const cJSON *o = cJSON_GetArrayItem(arr, i);
        item_path(p, sizeof p, "swards", i);
        if (ji_keys(c, o, p, keys) < 0 ||
            read_id(c, o, p, sw->id, (const char *)s->swards, sizeof *sw, i) < 0 ||
            ji_string(c, o, p, "params", 1, params, sizeof params) < 0)
            return -1;
        rg_err inner;
        if (sward_load(models_dir, params, &sw->p, &inner) < 0)
            return rg_fail(c->err, "%s: %s.params: %s", c->file, p, inner.msg);
    }
    return 0;
}

/* ---- paddocks ---------------------------------------------------------- */

/* Index of the entry whose id matches, or -1 with an error (and a hint). */
static int lookup(ji_ctx *c, const char *path, const char *key, const char *what,
                  const char *want, const char *ids, size_t stride, int n)
{
    const char *cands[256];
    int nc = 0;
    for (int j = 0; j < n; j++) {
        const char *id = ids + (size_t)j * stride;
        if (strcmp(id, want) == 0)
            return j;
        if (nc < 256)
            cands[nc++] = id;
    }
    const char *near = rg_suggest(want, cands, (size_t)nc);
    if (near)
        return rg_fail(c->err, "%s: %s.%s: expected the id of a %s, found \"%s\" (did you mean \"%s\"?)",
                       c->file, path, key, what, want, near);
    return rg_fail(c->err, "%s: %s.%s: expected the id of a %s, found \"%s\", which is not defined",
                   c->file, path, key, what, want);
}

static int read_paddock(ji_ctx *c, const cJSON *o, const char *p, site *s, int i)
{
    static const char *const keys[] = {"id", "block", "area_ha", "array_share",
                                       "soil", "sward", "start_cover_kgdm_ha", NULL};
    site_paddock *pd = &s->paddocks[i];
    char soil[SITE_ID_LEN], sward[SITE_ID_LEN];
    if (ji_keys(c, o, p, keys) < 0 ||
        read_id(c, o, p, pd->id, (const char *)s->paddocks, sizeof *pd, i) < 0 ||
        ji_string(c, o, p, "block", 0, pd->block, sizeof pd->block) < 0 ||
        ji_number(c, o, p, "area_ha", 1, JI_POS, 0, 0, &pd->area_ha) < 0 ||
        ji_number(c, o, p, "array_share", 1, JI_RANGE, 0, 1, &pd->array_share) < 0 ||
        ji_string(c, o, p, "soil", 1, soil, sizeof soil) < 0 ||
        ji_string(c, o, p, "sward", 1, sward, sizeof sward) < 0)
        return -1;
    pd->start_cover_kgdm_ha = -1;
    if (ji_number(c, o, p, "start_cover_kgdm_ha", 0, JI_RANGE, 0, 20000, &pd->start_cover_kgdm_ha) < 0)
        return -1;
    if (pd->area_ha > 10000)
        return rg_fail(c->err, "%s: %s.area_ha: expected at most 10000 ha, found %g", c->file, p, pd->area_ha);
    pd->soil = lookup(c, p, "soil", "soil in $.soils", soil, (const char *)s->soils,
                      sizeof *s->soils, s->n_soils);
    if (pd->soil < 0)
        return -1;
    pd->sward = lookup(c, p, "sward", "sward in $.swards", sward, (const char *)s->swards,
                       sizeof *s->swards, s->n_swards);
    return pd->sward < 0 ? -1 : 0;
}

static int read_paddocks(ji_ctx *c, const cJSON *doc, site *s)
{
    const cJSON *arr;
    if (ji_array(c, doc, "$", "paddocks", 1, &arr, &s->n_paddocks) < 0)
        return -1;
    if (s->n_paddocks == 0)
        return rg_fail(c->err, "%s: $.paddocks: expected at least one paddock, found an empty list", c->file);
    s->paddocks = calloc((size_t)s->n_paddocks, sizeof *s->paddocks);
    if (!s->paddocks)
        return rg_fail(c->err, "out of memory");
    for (int i = 0; i < s->n_paddocks; i++) {
        char p[64];
        item_path(p, sizeof p, "paddocks", i);
        if (read_paddock(c, cJSON_GetArrayItem(arr, i), p, s, i) < 0)
            return -1;
    }
    return 0;
}

/* ---- mobs -------------------------------------------------------------- */

static int read_species(ji_ctx *c, const cJSON *o, const char *p, int *species)
{
    static const char *const names[] = {"sheep", "cattle", "goats"};
    char sp[32];
    if (ji_string(c, o, p, "species", 1, sp, sizeof sp) < 0)
        return -1;
    for (int k = 0; k < 3; k++)
        if (strcmp(sp, names[k]) == 0) {
            *species = k;
            return 0;
        }
    return rg_fail(c->err, "%s: %s.species: expected \"sheep\", \"cattle\" or \"goats\", found \"%s\"",
                   c->file, p, sp);
}

static int read_mob(ji_ctx *c, const cJSON *o, const char *p, site *s, int i)
{
    static const char *const keys[] = {"id", "species", "head", "liveweight_kg",
                                       "intake_pct_lw", "intake_kgdm_d", NULL};
    site_mob *m = &s->mobs[i];
    if (ji_keys(c, o, p, keys) < 0 ||
        read_id(c, o, p, m->id, (const char *)s->mobs, sizeof *m, i) < 0 ||
        read_species(c, o, p, &m->species) < 0 ||
        ji_int(c, o, p, "head", 1, 1, 1000000, &m->head) < 0 ||
        ji_number(c, o, p, "liveweight_kg", 1, JI_RANGE, 5, 1500, &m->liveweight_kg) < 0)
        return -1;
    int has_pct = ji_get(o, "intake_pct_lw") != NULL;
    int has_kg = ji_get(o, "intake_kgdm_d") != NULL;
    if (has_pct == has_kg)
        return rg_fail(c->err, "%s: %s: expected exactly one of \"intake_pct_lw\" and \"intake_kgdm_d\", found %s",
                       c->file, p, has_pct ? "both" : "neither");
    if (has_pct) {
        if (ji_number(c, o, p, "intake_pct_lw", 1, JI_RANGE, 0.5, 6, &m->intake_pct_lw) < 0)
            return -1;
        m->intake_kgdm_d = m->liveweight_kg * m->intake_pct_lw / 100.0;
        return 0;
    }
    return ji_number(c, o, p, "intake_kgdm_d", 1, JI_RANGE, 0.1, 40, &m->intake_kgdm_d);
}

static int read_mobs(ji_ctx *c, const cJSON *doc, site *s)
{
    const cJSON *arr;
    if (ji_array(c, doc, "$", "mobs", 1, &arr, &s->n_mobs) < 0)
        return -1;
    if (s->n_mobs == 0)
        return rg_fail(c->err, "%s: $.mobs: expected at least one mob, found an empty list", c->file);
    s->mobs = calloc((size_t)s->n_mobs, sizeof *s->mobs);
    if (!s->mobs)
        return rg_fail(c->err, "out of memory");
    for (int i = 0; i < s->n_mobs; i++) {
        char p[64];
        item_path(p, sizeof p, "mobs", i);
        if (read_mob(c, cJSON_GetArrayItem(arr, i), p, s, i) < 0)
            return -1;
    }
    return 0;
}

/* ---- rules ------------------------------------------------------------- */

static int read_ceiling(ji_ctx *c, const cJSON *o, site *s)
{
    site_rules *r = &s->rules;
    const char *p = "$.rules";
    const cJSON *v = ji_get(o, "ceiling_height_cm");
    r->ceiling_derived = 1;
    if (v && !(cJSON_IsString(v) && strcmp(v->valuestring, "derive") == 0)) {
        if (!cJSON_IsNumber(v)) {
            char found[96];
            ji_describe(v, found, sizeof found);
            return rg_fail(c->err, "%s: %s.ceiling_height_cm: expected a height in cm or \"derive\", found %s",
                           c->file, p, found);
        }
        if (ji_number(c, o, p, "ceiling_height_cm", 1, JI_RANGE, 1, 500, &r->ceiling_height_cm) < 0)
            return -1;
        r->ceiling_derived = 0;
    }
    if (r->ceiling_derived)
        r->ceiling_height_cm = site_lowest_edge_m(&s->array) * 100.0 - r->ceiling_margin_cm;
    if (r->ceiling_height_cm <= r->residual_height_cm)
        return rg_fail(c->err, "%s: %s.%s: expected a vegetation ceiling above the residual height (%g cm), found %.1f cm%s",
                       c->file, p, r->ceiling_derived ? "ceiling_margin_cm" : "ceiling_height_cm",
                       r->residual_height_cm, r->ceiling_height_cm,
                       r->ceiling_derived ? " (the lowest panel edge less this margin)" : "");
    if (!r->ceiling_derived && r->ceiling_height_cm > site_lowest_edge_m(&s->array) * 100)
        rg_warn("%s: %s.ceiling_height_cm: %.0f cm is above the lowest panel edge (%.0f cm at full rotation); vegetation may touch the panels",
                c->file, p, r->ceiling_height_cm, site_lowest_edge_m(&s->array) * 100);
    return 0;
}

static int read_rules(ji_ctx *c, const cJSON *doc, site *s)
{
    static const char *const keys[] = {"residual_height_cm", "min_rest_days",
        "max_days_per_visit", "ceiling_height_cm", "ceiling_margin_cm",
        "share_paddocks", "cattle_min_clearance_m", "max_paddocks_per_week",
        "max_head_per_ha", NULL};
    site_rules *r = &s->rules;
    const char *p = "$.rules";
    /* defaults: 10 cm margin below the lowest edge and cattle kept out where
     * the lowest edge is under 1.2 m (common practice, no source) */
    *r = (site_rules){.ceiling_margin_cm = 10, .cattle_min_clearance_m = 1.2,
                      .max_paddocks_per_week = 2}; /* 2 paddocks a week: common practice, no source */
    if (ji_require(c, doc, "$", "rules") < 0)
        return -1;
    const cJSON *o = ji_get(doc, "rules");
    if (ji_keys(c, o, p, keys) < 0 ||
        ji_number(c, o, p, "residual_height_cm", 1, JI_RANGE, 1, 50, &r->residual_height_cm) < 0 ||
        ji_int(c, o, p, "min_rest_days", 1, 0, 365, &r->min_rest_days) < 0 ||
        ji_int(c, o, p, "max_days_per_visit", 1, 1, 90, &r->max_days_per_visit) < 0 ||
        ji_number(c, o, p, "ceiling_margin_cm", 0, JI_RANGE, 0, 200, &r->ceiling_margin_cm) < 0 ||
        ji_bool(c, o, p, "share_paddocks", 0, &r->share_paddocks) < 0 ||
        ji_number(c, o, p, "cattle_min_clearance_m", 0, JI_RANGE, 0, 10, &r->cattle_min_clearance_m) < 0 ||
        ji_int(c, o, p, "max_paddocks_per_week", 0, 1, 7, &r->max_paddocks_per_week) < 0 ||
        ji_number(c, o, p, "max_head_per_ha", 0, JI_NONNEG, 0, 0, &r->max_head_per_ha) < 0)
        return -1;
    return read_ceiling(c, o, s);
}

/* ---- costs ------------------------------------------------------------- */

static int read_costs(ji_ctx *c, const cJSON *doc, site_costs *k)
{
    static const char *const keys[] = {"currency", "supplement_per_t_dm",
                                       "mowing_per_ha", "per_move", NULL};
    const char *p = "$.costs";
    *k = (site_costs){{0}, 0, 0, 0};
    if (ji_require(c, doc, "$", "costs") < 0)
        return -1;
    const cJSON *o = ji_get(doc, "costs");
    return (ji_keys(c, o, p, keys) < 0 ||
            ji_string(c, o, p, "currency", 0, k->currency, sizeof k->currency) < 0 ||
            ji_number(c, o, p, "supplement_per_t_dm", 1, JI_NONNEG, 0, 0, &k->supplement_per_t_dm) < 0 ||
            ji_number(c, o, p, "mowing_per_ha", 1, JI_NONNEG, 0, 0, &k->mowing_per_ha) < 0 ||
            ji_number(c, o, p, "per_move", 1, JI_NONNEG, 0, 0, &k->per_move) < 0)
               ? -1 : 0;
}

/* ---- maintenance windows ----------------------------------------------- */

static int read_date(ji_ctx *c, const cJSON *o, const char *p, const char *key, int64_t *day)
{
    char text[32];
    if (ji_string(c, o, p, key, 1, text, sizeof text) < 0)
        return -1;
    if (tcal_parse_date(text, day) < 0)
        return rg_fail(c->err, "%s: %s.%s: expected a date YYYY-MM-DD, found \"%s\"",
                       c->file, p, key, text);
    return 0;
}

/* Adds paddock k to w unless already there. */
static void window_add(site_window *w, int k)
{
    for (int j = 0; j < w->n_paddocks; j++)
        if (w->paddocks[j] == k)
            return;
    w->paddocks[w->n_paddocks++] = k;
}

/* A name in a window's list is a paddock id or a block name (all paddocks
 * of that block). */
static int window_names(ji_ctx *c, const cJSON *arr, const char *p, site *s, site_window *w)
{
    w->paddocks = calloc((size_t)s->n_paddocks, sizeof *w->paddocks);
    if (!w->paddocks)
        return rg_fail(c->err, "out of memory");
    int n = cJSON_GetArraySize(arr);
    if (n == 0)
        return rg_fail(c->err, "%s: %s.paddocks: expected at least one paddock or block, found an empty list", c->file, p);
    for (int j = 0; j < n; j++) {
        const cJSON *v = cJSON_GetArrayItem(arr, j);
        char ip[96];
        snprintf(ip, sizeof ip, "%s.paddocks[%d]", p, j);
        if (!cJSON_IsString(v)) {
            char found[96];
            ji_describe(v, found, sizeof found);
            return rg_fail(c->err, "%s: %s: expected a paddock id or block name, found %s", c->file, ip, found);
        }
        int hit = 0;
        for (int k = 0; k < s->n_paddocks; k++)
            if (strcmp(s->paddocks[k].id, v->valuestring) == 0 ||
                strcmp(s->paddocks[k].block, v->valuestring) == 0) {
                window_add(w, k);
                hit = 1;
            }
        if (!hit)
            return rg_fail(c->err, "%s: %s: expected a paddock id or block name, found \"%s\", which is neither",
                           c->file, ip, v->valuestring);
    }
    return 0;
}

static int read_window(ji_ctx *c, const cJSON *o, const char *p, site *s, site_window *w)
{
    static const char *const keys[] = {"paddocks", "from", "to", "reason", "keep_off_days", NULL};
    const cJSON *arr;
    int n;
    if (ji_keys(c, o, p, keys) < 0 || ji_array(c, o, p, "paddocks", 1, &arr, &n) < 0 ||
        window_names(c, arr, p, s, w) < 0 || read_date(c, o, p, "from", &w->from_day) < 0 ||
        read_date(c, o, p, "to", &w->to_day) < 0 ||
        ji_string(c, o, p, "reason", 0, w->reason, sizeof w->reason) < 0 ||
        ji_int(c, o, p, "keep_off_days", 0, 0, 365, &w->keep_off_days) < 0)
        return -1;
    if (w->to_day < w->from_day) {
        char a[11], b[11];
        tcal_format_date(w->from_day, a);
        tcal_format_date(w->to_day, b);
        return rg_fail(c->err, "%s: %s.to: expected a date on or after \"from\" (%s), found %s",
                       c->file, p, a, b);
    }
    return 0;
}

static int read_windows(ji_ctx *c, const cJSON *doc, site *s)
{
    const cJSON *arr;
    if (ji_array(c, doc, "$", "maintenance", 0, &arr, &s->n_windows) < 0)
        return -1;
    if (s->n_windows == 0)
        return 0;
    s->windows = calloc((size_t)s->n_windows, sizeof *s->windows);
    if (!s->windows)
        return rg_fail(c->err, "out of memory");
    for (int i = 0; i < s->n_windows; i++) {
        char p[64];
        item_path(p, sizeof p, "maintenance", i);
        if (read_window(c, cJSON_GetArrayItem(arr, i), p, s, &s->windows[i]) < 0)
            return -1;
    }
    return 0;
}

/* ---- weather ----------------------------------------------------------- */

static const char *const col_keys[WX_NCOLS + 1] = {
    "time", "ghi", "temp", "rh", "rain", "wind", "dni", "dhi", "pressure", NULL};
static const char *const col_default[WX_NCOLS] = {
    "time", "ghi_w_m2", "temp_c", "rh_pct", "rain_mm", "wind_m_s",
    "dni_w_m2", "dhi_w_m2", "pressure_hpa"};

static int read_choice(ji_ctx *c, const cJSON *o, const char *p, const char *key,
                       const char *const *names, int n, int *out)
{
    char v[16];
    v[0] = '\0';
    if (ji_string(c, o, p, key, 0, v, sizeof v) < 0)
        return -1;
    if (!v[0])
        return 0;
    for (int k = 0; k < n; k++)
        if (strcmp(v, names[k]) == 0) {
            *out = k;
            return 0;
        }
    char list[128] = "";
    for (int k = 0; k < n; k++) {
        strcat(list, k ? (k == n - 1 ? " or \"" : ", \"") : "\"");
        strcat(list, names[k]);
        strcat(list, "\"");
    }
    return rg_fail(c->err, "%s: %s.%s: expected %s, found \"%s\"", c->file, p, key, list, v);
}

static int read_units(ji_ctx *c, const cJSON *w, site_weather *sw)
{
    static const char *const keys[] = {"temp", "rain", "wind", "pressure", NULL};
    static const char *const temp[] = {"C", "F"}, *const rain[] = {"mm", "in"},
        *const wind[] = {"m/s", "km/h", "mph"}, *const pres[] = {"hPa", "kPa"};
    const char *p = "$.weather.units";
    const cJSON *u = ji_get(w, "units");
    if (!u)
        return 0;
    return (ji_keys(c, u, p, keys) < 0 || read_choice(c, u, p, "temp", temp, 2, &sw->temp_f) < 0 ||
            read_choice(c, u, p, "rain", rain, 2, &sw->rain_in) < 0 ||
            read_choice(c, u, p, "wind", wind, 3, &sw->wind_unit) < 0 ||
            read_choice(c, u, p, "pressure", pres, 2, &sw->pressure_kpa) < 0) ? -1 : 0;
}

static int read_columns(ji_ctx *c, const cJSON *w, site_weather *sw)
{
    const char *p = "$.weather.columns";
    for (int k = 0; k < WX_NCOLS; k++)
        snprintf(sw->header[k], sizeof sw->header[k], "%s", col_default[k]);
    const cJSON *m = ji_get(w, "columns");
    if (!m)
        return 0;
    if (ji_keys(c, m, p, col_keys) < 0)
        return -1;
    for (int k = 0; k < WX_NCOLS; k++) {
        if (ji_string(c, m, p, col_keys[k], 0, sw->header[k], sizeof sw->header[k]) < 0)
            return -1;
        for (int j = 0; j < k; j++)
            if (strcmp(sw->header[j], sw->header[k]) == 0)
                return rg_fail(c->err, "%s: %s.%s: expected a header no other column uses, found \"%s\", also used for %s",
                               c->file, p, col_keys[k], sw->header[k], col_keys[j]);
    }
    return 0;
}

static int read_files(ji_ctx *c, const cJSON *w, const char *base, site_weather *sw)
{
    const cJSON *arr;
    if (ji_array(c, w, "$.weather", "files", 1, &arr, &sw->n_files) < 0)
        return -1;
    if (sw->n_files == 0 || sw->n_files > SITE_MAX_FILES)
        return rg_fail(c->err, "%s: $.weather.files: expected 1 to %d file names, found %d",
                       c->file, SITE_MAX_FILES, sw->n_files);
    for (int i = 0; i < sw->n_files; i++) {
        const cJSON *v = cJSON_GetArrayItem(arr, i);
        if (!cJSON_IsString(v) || !v->valuestring[0] || strlen(v->valuestring) > 900) {
            char found[96];
            ji_describe(v, found, sizeof found);
            return rg_fail(c->err, "%s: $.weather.files[%d]: expected a file name, found %s",
                           c->file, i, found);
        }
        textfile_join(base, v->valuestring, sw->files[i], sizeof sw->files[i]);
    }
    return 0;
}

static int read_step(ji_ctx *c, const cJSON *w, site_weather *sw)
{
    static const char *const steps[] = {"hourly", "daily"};
    static const char *const rules[] = {"spread", "afternoon", "morning"}; /* enum wxd_rain_rule order */
    if (read_choice(c, w, "$.weather", "step", steps, 2, &sw->daily) < 0 ||
        read_choice(c, w, "$.weather", "rain_timing", rules, 3, &sw->rain_rule) < 0)
        return -1;
    if (!sw->daily && ji_get(w, "rain_timing"))
        rg_warn("%s: $.weather.rain_timing: used only with \"step\": \"daily\"; ignored", c->file);
    if (sw->daily && ji_get(w, "columns"))
        return rg_fail(c->err, "%s: $.weather.columns: expected no column map with daily files (they use the headers in docs/inputs.md), found one",
                       c->file);
    return 0;
}

static int read_weather(ji_ctx *c, const cJSON *doc, const char *base, site_weather *sw)
{
    static const char *const keys[] = {"files", "step", "rain_timing", "columns", "units",
                                       "fill_gaps_up_to_h", NULL};
    memset(sw, 0, sizeof *sw);
    sw->max_fill_h = 3; /* short logger outages are common; 3 h (common practice, no source) */
    if (ji_require(c, doc, "$", "weather") < 0)
        return -1;
    const cJSON *w = ji_get(doc, "weather");
    return (ji_keys(c, w, "$.weather", keys) < 0 || read_files(c, w, base, sw) < 0 ||
            read_step(c, w, sw) < 0 || read_columns(c, w, sw) < 0 || read_units(c, w, sw) < 0 ||
            ji_int(c, w, "$.weather", "fill_gaps_up_to_h", 0, 0, 24, &sw->max_fill_h) < 0) ? -1 : 0;
}

/* ---- plan defaults ----------------------------------------------------- */

static int read_plan(ji_ctx *c, const cJSON *doc, site_plan *pl)
{
    static const char *const keys[] = {"start", "weeks", "percentile", NULL};
    *pl = (site_plan){.start_day = INT64_MIN, .weeks = 12, .percentile = 50};
    const cJSON *o = ji_get(doc, "plan");
    if (!o)
        return 0;
    if (ji_keys(c, o, "$.plan", keys) < 0 || ji_int(c, o, "$.plan", "weeks", 0, 1, 52, &pl->weeks) < 0 ||
        ji_int(c, o, "$.plan", "percentile", 0, 10, 90, &pl->percentile) < 0)
        return -1;
    if (pl->percentile != 10 && pl->percentile != 50 && pl->percentile != 90)
        return rg_fail(c->err, "%s: $.plan.percentile: expected 10, 50 or 90, found %d", c->file, pl->percentile);
    if (ji_get(o, "start"))
        return read_date(c, o, "$.plan", "start", &pl->start_day);
    return 0;
}

/* $.units: "metric" (hectares, kg DM) or "us" (acres, lb DM) for outputs. */
static int read_units_choice(ji_ctx *c, const cJSON *doc, int *units)
{
    char u[16] = "metric";
    if (ji_string(c, doc, "$", "units", 0, u, sizeof u) < 0)
        return -1;
    if (strcmp(u, "metric") == 0)
        *units = SITE_UNITS_METRIC;
    else if (strcmp(u, "us") == 0)
        *units = SITE_UNITS_US;
    else
        return rg_fail(c->err, "%s: $.units: expected \"metric\" or \"us\", found \"%s\"", c->file, u);
    return 0;
}

/* $.plate_meter: the farm's own rising-plate equation, fitted to its cuts
 * (records.c has the default and its source). */
static int read_plate(ji_ctx *c, const cJSON *doc, site *s)
{
    static const char *const keys[] = {"kgdm_ha_per_cm", "base_kgdm_ha", "source", NULL};
    const cJSON *o = ji_get(doc, "plate_meter");
    char src[256];
    if (!o)
        return 0;
    s->has_plate = 1;
    return (ji_keys(c, o, "$.plate_meter", keys) < 0 ||
            ji_number(c, o, "$.plate_meter", "kgdm_ha_per_cm", 1, JI_POS | JI_RANGE, 0, 1000,
                      &s->plate_kgdm_ha_per_cm) < 0 ||
            ji_number(c, o, "$.plate_meter", "base_kgdm_ha", 1, JI_NONNEG | JI_RANGE, 0, 5000,
                      &s->plate_base_kgdm_ha) < 0 ||
            ji_string(c, o, "$.plate_meter", "source", 1, src, sizeof src) < 0) ? -1 : 0;
}

/* ---- whole file -------------------------------------------------------- */

static int read_doc(ji_ctx *c, const cJSON *doc, const char *models_dir, site *s)
{
    static const char *const keys[] = {"name", "note", "location", "array", "soils",
        "swards", "paddocks", "mobs", "rules", "costs", "maintenance", "weather", "plan", "units", "plate_meter", NULL};
    char base[SITE_PATH_LEN];
    textfile_dirname(s->path, base, sizeof base);
    return (ji_keys(c, doc, "$", keys) < 0 ||
            ji_string(c, doc, "$", "name", 0, s->name, sizeof s->name) < 0 ||
            read_units_choice(c, doc, &s->units) < 0 || read_plate(c, doc, s) < 0 ||
            read_location(c, doc, &s->loc) < 0 || read_array(c, doc, &s->array) < 0 ||
            read_soils(c, doc, s) < 0 || read_swards(c, doc, models_dir, s) < 0 ||
            read_paddocks(c, doc, s) < 0 || read_mobs(c, doc, s) < 0 ||
            read_rules(c, doc, s) < 0 || read_costs(c, doc, &s->costs) < 0 ||
            read_windows(c, doc, s) < 0 || read_weather(c, doc, base, &s->weather) < 0 ||
            read_plan(c, doc, &s->plan) < 0) ? -1
               : (s->weather.loc = s->loc, 0);
}

int site_parse(const char *path, const char *text, size_t len,
               const char *models_dir, site *s, rg_err *err)
{
    memset(s, 0, sizeof *s);
    if (strlen(path) >= sizeof s->path)
        return rg_fail(err, "%.200s...: path too long", path);
    snprintf(s->path, sizeof s->path, "%s", path);
    ji_ctx c = {path, err};
    cJSON *doc = ji_parse(&c, text, len);
    int rc = doc ? read_doc(&c, doc, models_dir, s) : -1;
    cJSON_Delete(doc);
    if (rc < 0)
        site_free(s);
    return rc;
}

int site_load(const char *path, const char *models_dir, site *s, rg_err *err)
{
    size_t len = 0;
    memset(s, 0, sizeof *s);
    char *text = textfile_read(path, &len, err);
    if (!text)
        return -1;
    int rc = site_parse(path, text, len, models_dir, s, err);
    free(text);
    return rc;
}

void site_free(site *s)
{
    for (int i = 0; s->windows && i < s->n_windows; i++)
        free(s->windows[i].paddocks);
    free(s->windows);
    free(s->soils);
    free(s->swards);
    free(s->paddocks);
    free(s->mobs);
    memset(s, 0, sizeof *s);
}

double site_lowest_edge_m(const site_array *a)
{
    return a->hub_height_m - 0.5 * a->chord_m * sin(a->max_rotation_deg * DEG);
}

double site_demand_kgdm_d(const site *s)
{
    double d = 0;
    for (int i = 0; i < s->n_mobs; i++)
        d += s->mobs[i].head * s->mobs[i].intake_kgdm_d;
    return d;
}

int site_find_paddock(const site *s, const char *id)
{
    for (int i = 0; i < s->n_paddocks; i++)
        if (strcmp(s->paddocks[i].id, id) == 0)
            return i;
    return -1;
}
