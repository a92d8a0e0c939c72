/* prevplan.c - an earlier plan read back from its JSON (see prevplan.h).
 *
 * The file is what cmd_plan.c writes with --format json: "start",
 * "weeks", "calendar" (per week: "grazing" [{mob, paddock, days}], "mow"
 * [paddock ids]) and "paddocks" [{paddock, cover_kgdm_ha: [weeks + 1]}].
 * Other members are ignored; missing or mistyped ones are errors that name
 * their JSON path.
 */
#include "prevplan.h"

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "jsonin.h"
#include "tcal.h"
#include "textfile.h"

/* The plan file has more members than these readers use, so objects are
 * checked for their type only (ji_keys would warn about every other key). */
static int object(ji_ctx *c, const cJSON *o, const char *path)
{
    if (cJSON_IsObject(o))
        return 0;
    char got[64];
    ji_describe(o, got, sizeof got);
    return rg_fail(c->err, "%s: %s: expected an object, found %s", c->file, path, got);
}

static int read_graze(ji_ctx *c, const cJSON *o, const char *path, int week, pp_graze *g)
{
    g->week = week;
    if (object(c, o, path) < 0)
        return -1;
    return (ji_string(c, o, path, "mob", 1, g->mob, sizeof g->mob) < 0 ||
            ji_string(c, o, path, "paddock", 1, g->paddock, sizeof g->paddock) < 0 ||
            ji_int(c, o, path, "days", 1, 1, 7, &g->days) < 0) ? -1 : 0;
}

/* Counts the grazing and mowing entries so one allocation holds each. */
static int count_entries(ji_ctx *c, const cJSON *cal, int n, int *ng, int *nm)
{
    char path[64];
    *ng = *nm = 0;
    for (int w = 0; w < n; w++) {
        const cJSON *wk = cJSON_GetArrayItem(cal, w), *a;
        int k;
        snprintf(path, sizeof path, "$.calendar[%d]", w);
        if (object(c, wk, path) < 0 || ji_array(c, wk, path, "grazing", 1, &a, &k) < 0)
            return -1;
        *ng += k;
        if (ji_array(c, wk, path, "mow", 0, &a, &k) < 0)
            return -1;
        *nm += k;
    }
    return 0;
}

static int read_mows(ji_ctx *c, const cJSON *wk, const char *path, int w, pp_plan *pl)
{
    const cJSON *a;
    int k;
    if (ji_array(c, wk, path, "mow", 0, &a, &k) < 0)
        return -1;
    for (int i = 0; i < k; i++) {
        const cJSON *v = cJSON_GetArrayItem(a, i);
        if (!cJSON_IsString(v) || !v->valuestring[0] || strlen(v->valuestring) >= PLAN_ID_LEN) {
            char got[64];
            ji_describe(v, got, sizeof got);
            return rg_fail(c->err, "%s: %s.mow[%d]: expected a paddock id, found %s", c->file, path, i, got);
        }
        pp_graze *g = &pl->mows[pl->n_mows++];
        g->week = w;
        snprintf(g->paddock, sizeof g->paddock, "%s", v->valuestring);
    }
    return 0;
}

static int read_calendar(ji_ctx *c, const cJSON *doc, pp_plan *pl)
{
    const cJSON *cal;
    int n, ng, nm;
    if (ji_array(c, doc, "$", "calendar", 1, &cal, &n) < 0)
        return -1;
    if (n != pl->weeks)
        return rg_fail(c->err, "%s: $.calendar: expected %d weeks (as $.weeks says), found %d", c->file, pl->weeks, n);
    if (count_entries(c, cal, n, &ng, &nm) < 0)
        return -1;
    pl->grazes = calloc((size_t)ng + 1, sizeof *pl->grazes);
    pl->mows = calloc((size_t)nm + 1, sizeof *pl->mows);
    if (!pl->grazes || !pl->mows)
        return rg_fail(c->err, "out of memory");
    for (int w = 0; w < n; w++) {
        const cJSON *wk = cJSON_GetArrayItem(cal, w), *a;
        int k;
        char path[64], gpath[96];
        snprintf(path, sizeof path, "$.calendar[%d]", w);
        if (ji_array(c, wk, path, "grazing", 1, &a, &k) < 0)
            return -1;
        for (int i = 0; i < k; i++) {
            snprintf(gpath, sizeof gpath, "%s.grazing[%d]", path, i);
            if (read_graze(c, cJSON_GetArrayItem(a, i), gpath, w, &pl->grazes[pl->n_grazes]) < 0)
                return -1;
            pl->n_grazes++;
        }
        if (read_mows(c, wk, path, w, pl) < 0)
            return -1;
    }
    return 0;
}

static int read_covers(ji_ctx *c, const cJSON *o, const char *path, int weeks, pp_paddock *q)
{
    const cJSON *a;
    int k;
    if (object(c, o, path) < 0 || ji_string(c, o, path, "paddock", 1, q->id, sizeof q->id) < 0 ||
        ji_array(c, o, path, "cover_kgdm_ha", 1, &a, &k) < 0)
        return -1;
    if (k != weeks + 1)
        return rg_fail(c->err, "%s: %s.cover_kgdm_ha: expected %d values (one per week and the end), found %d",
                       c->file, path, weeks + 1, k);
    q->cover_kgdm_ha = calloc((size_t)k, sizeof *q->cover_kgdm_ha);
    if (!q->cover_kgdm_ha)
        return rg_fail(c->err, "out of memory");
    for (int i = 0; i < k; i++) {
        const cJSON *v = cJSON_GetArrayItem(a, i);
        if (!cJSON_IsNumber(v) || !(v->valuedouble >= 0)) {
            char got[64];
            ji_describe(v, got, sizeof got);
            return rg_fail(c->err, "%s: %s.cover_kgdm_ha[%d]: expected a cover >= 0 kg DM/ha, found %s",
                           c->file, path, i, got);
        }
        q->cover_kgdm_ha[i] = v->valuedouble;
    }
    return 0;
}

static int read_paddocks(ji_ctx *c, const cJSON *doc, pp_plan *pl)
{
    const cJSON *arr;
    int n;
    if (ji_array(c, doc, "$", "paddocks", 1, &arr, &n) < 0)
        return -1;
    pl->paddocks = calloc((size_t)n + 1, sizeof *pl->paddocks);
    if (!pl->paddocks)
        return rg_fail(c->err, "out of memory");
    for (int i = 0; i < n; i++) {
        char path[48];
        snprintf(path, sizeof path, "$.paddocks[%d]", i);
        pl->n_paddocks++;
        if (read_covers(c, cJSON_GetArrayItem(arr, i), path, pl->weeks, &pl->paddocks[i]) < 0)
            return -1;
    }
    return 0;
}

static int read_doc(ji_ctx *c, const cJSON *doc, pp_plan *pl)
{
    char start[32];
    if (object(c, doc, "$") < 0 || ji_string(c, doc, "$", "start", 1, start, sizeof start) < 0)
        return -1;
    if (tcal_parse_date(start, &pl->start_day) < 0)
        return rg_fail(c->err, "%s: $.start: expected a date YYYY-MM-DD, found \"%s\"", c->file, start);
    if (ji_int(c, doc, "$", "weeks", 1, 1, PLAN_MAX_WEEKS, &pl->weeks) < 0)
        return -1;
    return (read_calendar(c, doc, pl) < 0 || read_paddocks(c, doc, pl) < 0) ? -1 : 0;
}

int pp_load(const char *path, pp_plan *pl, rg_err *err)
{
    memset(pl, 0, sizeof *pl);
    snprintf(pl->path, sizeof pl->path, "%s", path);
    size_t len = 0;
    char *text = textfile_read(path, &len, err);
    if (!text)
        return -1;
    ji_ctx c = {path, err};
    cJSON *doc = ji_parse(&c, text, len);
    int rc = doc ? read_doc(&c, doc, pl) : -1;
    cJSON_Delete(doc);
    free(text);
    if (rc < 0)
        pp_free(pl);
    return rc;
}

double pp_cover(const pp_plan *pl, const char *id, int w)
{
    if (w < 0 || w > pl->weeks)
        return -1;
    for (int i = 0; i < pl->n_paddocks; i++)
        if (strcmp(pl->paddocks[i].id, id) == 0)
            return pl->paddocks[i].cover_kgdm_ha[w];
    return -1;
}

void pp_free(pp_plan *pl)
{
    if (!pl)
        return;
    for (int i = 0; i < pl->n_paddocks; i++)
        free(pl->paddocks[i].cover_kgdm_ha);
    free(pl->paddocks);
    free(pl->grazes);
    free(pl->mows);
    memset(pl, 0, sizeof *pl);
}
