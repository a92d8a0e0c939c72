/* scenario.c - one setting of a site changed (see scenario.h).
 *
 * A table lists every path a setting may name: its section, key, kind of
 * value and range (the ranges of site.c, so a scenario can hold only what
 * a site file could).  A path resolves to one field of the site; the value
 * is parsed and range-checked before anything is written.
 */
#include "scenario.h"

#include <math.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "plan.h"
#include "tcal.h"

enum scn_kind { K_INT, K_NUM, K_BOOL, K_DATE, K_PCT };
enum scn_sect { S_MOB, S_PADDOCK, S_RULES, S_COSTS, S_PLAN };

typedef struct scn_key {
    int sect;
    const char *key;
    int kind;
    double lo, hi;     /* inclusive range (K_INT, K_NUM); lo_open: lo excluded */
    int lo_open;
    size_t off;        /* offset of the field in its struct */
} scn_key;

#define BIG 1e300
static const scn_key keys[] = {
    {S_MOB, "head", K_INT, 1, 1000000, 0, offsetof(site_mob, head)},
    {S_MOB, "liveweight_kg", K_NUM, 5, 1500, 0, offsetof(site_mob, liveweight_kg)},
    {S_MOB, "intake_pct_lw", K_NUM, 0.5, 6, 0, offsetof(site_mob, intake_pct_lw)},
    {S_MOB, "intake_kgdm_d", K_NUM, 0.1, 40, 0, offsetof(site_mob, intake_kgdm_d)},
    {S_PADDOCK, "area_ha", K_NUM, 0, 10000, 1, offsetof(site_paddock, area_ha)},
    {S_PADDOCK, "start_cover_kgdm_ha", K_NUM, 0, 20000, 0, offsetof(site_paddock, start_cover_kgdm_ha)},
    {S_RULES, "residual_height_cm", K_NUM, 1, 50, 0, offsetof(site_rules, residual_height_cm)},
    {S_RULES, "min_rest_days", K_INT, 0, 365, 0, offsetof(site_rules, min_rest_days)},
    {S_RULES, "max_days_per_visit", K_INT, 1, 90, 0, offsetof(site_rules, max_days_per_visit)},
    {S_RULES, "ceiling_height_cm", K_NUM, 1, 500, 0, offsetof(site_rules, ceiling_height_cm)},
    {S_RULES, "max_paddocks_per_week", K_INT, 1, 7, 0, offsetof(site_rules, max_paddocks_per_week)},
    {S_RULES, "max_head_per_ha", K_NUM, 0, BIG, 0, offsetof(site_rules, max_head_per_ha)},
    {S_RULES, "share_paddocks", K_BOOL, 0, 1, 0, offsetof(site_rules, share_paddocks)},
    {S_COSTS, "supplement_per_t_dm", K_NUM, 0, BIG, 0, offsetof(site_costs, supplement_per_t_dm)},
    {S_COSTS, "mowing_per_ha", K_NUM, 0, BIG, 0, offsetof(site_costs, mowing_per_ha)},
    {S_COSTS, "per_move", K_NUM, 0, BIG, 0, offsetof(site_costs, per_move)},
    {S_PLAN, "start", K_DATE, 0, 0, 0, offsetof(site_plan, start_day)},
    {S_PLAN, "weeks", K_INT, 1, PLAN_MAX_WEEKS, 0, offsetof(site_plan, weeks)},
    {S_PLAN, "percentile", K_PCT, 0, 0, 0, offsetof(site_plan, percentile)},
};
#define N_KEYS (sizeof keys / sizeof keys[0])

static const char *const sect_name[] = {"mobs", "paddocks", "rules", "costs", "plan"};

int scn_parse_axis(const char *arg, scn_axis *ax, rg_err *err)
{
    memset(ax, 0, sizeof *ax);
    const char *eq = strchr(arg, '=');
    if (!eq || eq == arg)
        return rg_fail(err, "--set: expected PATH=V1,V2,... (e.g. mobs.ewes.head=300,400), found \"%s\"", arg);
    size_t n = (size_t)(eq - arg);
    if (n >= sizeof ax->path)
        return rg_fail(err, "--set: expected a path of at most %d characters, found %zu", SCN_PATH_LEN - 1, n);
    memcpy(ax->path, arg, n);
    const char *v = eq + 1;
    for (;;) {
        size_t len = strcspn(v, ",");
        if (len == 0)
            return rg_fail(err, "--set %s: expected a value between the commas, found an empty one", ax->path);
        if (len >= SCN_VALUE_LEN)
            return rg_fail(err, "--set %s: expected values of at most %d characters", ax->path, SCN_VALUE_LEN - 1);
        if (ax->n_values == SCN_MAX_VALUES)
            return rg_fail(err, "--set %s: expected at most %d values", ax->path, SCN_MAX_VALUES);
        memcpy(ax->values[ax->n_values], v, len);
        ax->values[ax->n_values++][len] = 0;
        if (v[len] == 0)
            break;
        v += len + 1;
    }
    return 0;
}

/* Splits a path into section, id (mobs and paddocks only: everything
 * between the first and the last dot, so an id may hold dots) and key.
 * Returns the number of parts found (2 or 3), or -1 when a part is empty
 * or too long. */
static int split(const char *path, char parts[3][SCN_PATH_LEN])
{
    const char *a = strchr(path, '.'), *b = strrchr(path, '.');
    if (!a || a == path || strlen(path) >= SCN_PATH_LEN)
        return -1;
    memcpy(parts[0], path, (size_t)(a - path));
    parts[0][a - path] = 0;
    if (a == b) {
        snprintf(parts[1], SCN_PATH_LEN, "%s", a + 1);
        return parts[1][0] ? 2 : -1;
    }
    memcpy(parts[1], a + 1, (size_t)(b - a - 1));
    parts[1][b - a - 1] = 0;
    snprintf(parts[2], SCN_PATH_LEN, "%s", b + 1);
    return parts[1][0] && parts[2][0] ? 3 : -1;
}

static int find_sect(const char *name)
{
    for (int k = 0; k < 5; k++)
        if (strcmp(name, sect_name[k]) == 0)
            return k;
    return -1;
}

static const scn_key *find_key(int sect, const char *key)
{
    for (size_t k = 0; k < N_KEYS; k++)
        if (keys[k].sect == sect && strcmp(keys[k].key, key) == 0)
            return &keys[k];
    return NULL;
}

/* "head, liveweight_kg, ..." for a section, into buf. */
static void key_list(int sect, char *buf, size_t cap)
{
    buf[0] = 0;
    for (size_t k = 0; k < N_KEYS; k++)
        if (keys[k].sect == sect) {
            size_t n = strlen(buf);
            snprintf(buf + n, cap - n, "%s%s", n ? ", " : "", keys[k].key);
        }
}

/* Index of the mob or paddock with this id, or -1 (with the message). */
static int find_item(const site *s, int sect, const char *id, const char *path, rg_err *err)
{
    int n = sect == S_MOB ? s->n_mobs : s->n_paddocks;
    const char *cands[256];
    size_t nc = 0;
    for (int i = 0; i < n; i++) {
        const char *iid = sect == S_MOB ? s->mobs[i].id : s->paddocks[i].id;
        if (strcmp(iid, id) == 0)
            return i;
        if (nc < 256)
            cands[nc++] = iid;
    }
    const char *near = rg_suggest(id, cands, nc);
    rg_fail(err, "--set %s: %s has no %s \"%s\"%s%s%s", path, s->path, sect == S_MOB ? "mob" : "paddock", id,
            near ? " (did you mean \"" : "", near ? near : "", near ? "\"?)" : "");
    return -1;
}

/* The struct the path's section points into, or NULL (message in err). */
static char *resolve(site *s, const char *path, const scn_key **kp, rg_err *err)
{
    char parts[3][SCN_PATH_LEN], list[512];
    int n = split(path, parts);
    int sect = n >= 2 ? find_sect(parts[0]) : -1;
    if (sect < 0)
        return rg_fail(err, "--set %s: unknown setting; expected mobs.ID.KEY, paddocks.ID.KEY, rules.KEY, costs.KEY or plan.KEY",
                       path), NULL;
    int item = sect == S_MOB || sect == S_PADDOCK;
    if (n != (item ? 3 : 2))
        return rg_fail(err, "--set %s: expected %s.%sKEY, found %d parts", path, sect_name[sect],
                       item ? "ID." : "", n), NULL;
    const char *key = parts[item ? 2 : 1];
    *kp = find_key(sect, key);
    if (!*kp) {
        key_list(sect, list, sizeof list);
        return rg_fail(err, "--set %s: unknown setting \"%s\" in %s; expected one of %s", path, key,
                       sect_name[sect], list), NULL;
    }
    int i = item ? find_item(s, sect, parts[1], path, err) : 0;
    if (i < 0)
        return NULL;
    switch (sect) {
    case S_MOB: return (char *)&s->mobs[i];
    case S_PADDOCK: return (char *)&s->paddocks[i];
    case S_RULES: return (char *)&s->rules;
    case S_COSTS: return (char *)&s->costs;
    default: return (char *)&s->plan;
    }
}

/* Parses value for key k into *num (K_INT, K_NUM, K_BOOL, K_PCT) or *day
 * (K_DATE).  Returns 0, or -1 with the message. */
static int parse_value(const scn_key *k, const char *path, const char *value, double *num, int64_t *day,
                       rg_err *err)
{
    char *end;
    switch (k->kind) {
    case K_DATE:
        if (tcal_parse_date(value, day) == 0)
            return 0;
        return rg_fail(err, "--set %s=%s: expected a date YYYY-MM-DD, found \"%s\"", path, value, value);
    case K_BOOL:
        if (strcmp(value, "true") == 0 || strcmp(value, "false") == 0) {
            *num = value[0] == 't';
            return 0;
        }
        return rg_fail(err, "--set %s=%s: expected true or false, found \"%s\"", path, value, value);
    case K_PCT:
        if (strcmp(value, "10") == 0 || strcmp(value, "50") == 0 || strcmp(value, "90") == 0) {
            *num = atoi(value);
            return 0;
        }
        return rg_fail(err, "--set %s=%s: expected 10, 50 or 90, found \"%s\"", path, value, value);
    default:
        break;
    }
    double x = strtod(value, &end);
    int in = *end == 0 && isfinite(x) && (k->lo_open ? x > k->lo : x >= k->lo) && x <= k->hi;
    if (in && (k->kind != K_INT || x == floor(x))) {
        *num = x;
        return 0;
    }
    const char *what = k->kind == K_INT ? "a whole number" : "a number";
    if (k->hi >= BIG)
        return rg_fail(err, "--set %s=%s: expected %s of at least %.15g, found \"%s\"", path, value, what, k->lo, value);
    return rg_fail(err, "--set %s=%s: expected %s from %.15g%s to %.15g, found \"%s\"", path, value, what, k->lo,
                   k->lo_open ? " (excluded)" : "", k->hi, value);
}

/* What follows from a mob's or the rules' new value. */
static void follow_up(const scn_key *k, char *base)
{
    if (k->sect == S_MOB) {
        site_mob *m = (site_mob *)(void *)base;
        if (strcmp(k->key, "intake_kgdm_d") == 0)
            m->intake_pct_lw = 0;
        else if (m->intake_pct_lw > 0)
            m->intake_kgdm_d = m->liveweight_kg * m->intake_pct_lw / 100.0;
    } else if (k->sect == S_RULES && strcmp(k->key, "ceiling_height_cm") == 0) {
        ((site_rules *)(void *)base)->ceiling_derived = 0;
    }
}

int scn_apply(site *s, const char *path, const char *value, rg_err *err)
{
    const scn_key *k = NULL;
    char *base = resolve(s, path, &k, err);
    if (!base)
        return -1;
    double num = 0;
    int64_t day = 0;
    if (parse_value(k, path, value, &num, &day, err) < 0)
        return -1;
    void *field = base + k->off;
    if (k->kind == K_DATE)
        memcpy(field, &day, sizeof day);
    else if (k->kind == K_NUM) {
        memcpy(field, &num, sizeof num);
    } else {
        int v = (int)num;
        memcpy(field, &v, sizeof v);
    }
    follow_up(k, base);
    return 0;
}

int scn_check(const site *s, const char *label, rg_err *err)
{
    if (s->rules.ceiling_height_cm <= s->rules.residual_height_cm)
        return rg_fail(err, "scenario %s: expected a vegetation ceiling (%.1f cm) above the residual height (%.1f cm)",
                       label, s->rules.ceiling_height_cm, s->rules.residual_height_cm);
    return 0;
}

int scn_save(const site *s, scn_saved *sv)
{
    memset(sv, 0, sizeof *sv);
    sv->rules = s->rules;
    sv->costs = s->costs;
    sv->plan = s->plan;
    sv->mobs = malloc(((size_t)s->n_mobs + 1) * sizeof *sv->mobs);
    sv->paddocks = malloc(((size_t)s->n_paddocks + 1) * sizeof *sv->paddocks);
    if (!sv->mobs || !sv->paddocks) {
        scn_saved_free(sv);
        return -1;
    }
    memcpy(sv->mobs, s->mobs, (size_t)s->n_mobs * sizeof *sv->mobs);
    memcpy(sv->paddocks, s->paddocks, (size_t)s->n_paddocks * sizeof *sv->paddocks);
    return 0;
}

void scn_restore(site *s, const scn_saved *sv)
{
    s->rules = sv->rules;
    s->costs = sv->costs;
    s->plan = sv->plan;
    memcpy(s->mobs, sv->mobs, (size_t)s->n_mobs * sizeof *s->mobs);
    memcpy(s->paddocks, sv->paddocks, (size_t)s->n_paddocks * sizeof *s->paddocks);
}

void scn_saved_free(scn_saved *sv)
{
    free(sv->mobs);
    free(sv->paddocks);
    memset(sv, 0, sizeof *sv);
}
