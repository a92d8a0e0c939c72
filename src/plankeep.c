/* plankeep.c - holding the first weeks of an earlier plan (see plankeep.h).
 *
 * How: the earlier plan's grazing days for the weeks that overlap the new
 * plan go into pb->fixed_days; then, from the longest run down, the kept
 * weeks are tried on a copy of the problem cut to those weeks: the baseline
 * (planbase.c) copies kept weeks as they are and mows above the ceiling,
 * and the verifier (planverify.c) checks every rule.  The first run that
 * passes is kept.  The cut copy has no later weeks, so a rule that reaches
 * past the kept weeks (rest, spell) is checked again on the whole plan by
 * the solver's model and the verifier.
 */
#include "plankeep.h"

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "planbase.h"
#include "planverify.h"

int pk_prev_week(const plan_problem *pb, const pp_plan *prev, int t)
{
    int64_t off = pb->start_day + 7 * (int64_t)t - prev->start_day;
    if (off < 0 || off % 7 != 0 || off / 7 >= prev->weeks)
        return -1;
    return (int)(off / 7);
}

static int find_mob(const plan_problem *pb, const char *id)
{
    for (int m = 0; m < pb->n_mobs; m++)
        if (strcmp(pb->mob[m].id, id) == 0)
            return m;
    return -1;
}

static int find_paddock(const plan_problem *pb, const char *id)
{
    for (int p = 0; p < pb->n_paddocks; p++)
        if (strcmp(pb->pd[p].id, id) == 0)
            return p;
    return -1;
}

/* The earlier plan's days in pb's layout for weeks 0..n-1. */
static int fill_fixed(plan_problem *pb, const pp_plan *prev, int n, rg_err *err)
{
    size_t cells = (size_t)pb->n_mobs * (size_t)pb->n_paddocks * (size_t)pb->n_weeks;
    pb->fixed_days = calloc(cells + 1, sizeof *pb->fixed_days);
    if (!pb->fixed_days)
        return rg_fail(err, "out of memory");
    for (int i = 0; i < prev->n_grazes; i++) {
        const pp_graze *g = &prev->grazes[i];
        int m = find_mob(pb, g->mob), p = find_paddock(pb, g->paddock);
        if (m < 0)
            return rg_fail(err, "%s: calendar week %d: mob \"%s\" is not in the site file", prev->path,
                           g->week + 1, g->mob);
        if (p < 0)
            return rg_fail(err, "%s: calendar week %d: paddock \"%s\" is not in the site file",
                           prev->path, g->week + 1, g->paddock);
        for (int t = 0; t < n; t++)
            if (pk_prev_week(pb, prev, t) == g->week)
                pb->fixed_days[((size_t)m * pb->n_paddocks + p) * pb->n_weeks + t] = g->days;
    }
    return 0;
}

/* A copy of pb cut to its first k weeks (fixed_weeks = k). */
static int cut(const plan_problem *pb, int k, plan_problem *c)
{
    *c = *pb;
    c->n_weeks = k;
    c->fixed_weeks = k;
    size_t P = (size_t)pb->n_paddocks, M = (size_t)pb->n_mobs;
    c->pd = NULL; /* shared, never freed through c */
    c->open_mask = NULL; /* only the calendar reads it */
    c->limit_supplement = c->limit_mowing = c->limit_shortfall = 0; /* totals of the whole plan */
    c->growth_t_ha_d = malloc(P * (size_t)k * sizeof *c->growth_t_ha_d);
    c->open_days = malloc(P * (size_t)k * sizeof *c->open_days);
    c->fixed_days = malloc(M * P * (size_t)k * sizeof *c->fixed_days + 1);
    if (!c->growth_t_ha_d || !c->open_days || !c->fixed_days)
        return -1;
    c->pd = pb->pd;
    for (size_t p = 0; p < P; p++)
        for (int t = 0; t < k; t++) {
            c->growth_t_ha_d[p * (size_t)k + (size_t)t] = pb->growth_t_ha_d[p * (size_t)pb->n_weeks + (size_t)t];
            c->open_days[p * (size_t)k + (size_t)t] = pb->open_days[p * (size_t)pb->n_weeks + (size_t)t];
            for (size_t m = 0; m < M; m++)
                c->fixed_days[(m * P + p) * (size_t)k + (size_t)t] =
                    pb->fixed_days[(m * P + p) * (size_t)pb->n_weeks + (size_t)t];
        }
    return 0;
}

static void cut_free(plan_problem *c)
{
    free(c->growth_t_ha_d);
    free(c->open_days);
    free(c->fixed_days);
}

/* 1 when the first k weeks, kept, break no rule; else 0 with why.  -1: out
 * of memory. */
static int weeks_hold(const plan_problem *pb, int k, char *why, size_t cap)
{
    plan_problem c;
    plan pl;
    pv_result r;
    int ok = -1;
    if (cut(pb, k, &c) == 0 && pb_baseline(&c, &pl) == 0) {
        if (pv_simulate(&c, &pl, &r) >= 0) {
            ok = r.n_violations == 0;
            if (!ok)
                snprintf(why, cap, "%s", r.first_violation);
            pv_free(&r);
        }
        plan_free(&pl);
    }
    cut_free(&c);
    return ok;
}

int pk_apply(plan_problem *pb, const pp_plan *prev, int keep_weeks, char *why, size_t cap,
             rg_err *err)
{
    why[0] = '\0';
    if ((pb->start_day - prev->start_day) % 7 != 0)
        return rg_fail(err, "%s: the earlier plan starts on another weekday; --keep needs plans whose weeks line up",
                       prev->path);
    if (pk_prev_week(pb, prev, 0) < 0)
        return rg_fail(err, "%s: the earlier plan %s this plan's start: nothing to keep", prev->path,
                       prev->start_day > pb->start_day ? "starts after" : "has ended by");
    int n = keep_weeks < pb->n_weeks ? keep_weeks : pb->n_weeks;
    while (n > 0 && pk_prev_week(pb, prev, n - 1) < 0)
        n--;
    if (n < keep_weeks)
        snprintf(why, cap, "the earlier plan covers only %d of the weeks asked", n);
    if (fill_fixed(pb, prev, n, err) < 0)
        return -1;
    for (; n > 0; n--) {
        char w[256] = "";
        int ok = weeks_hold(pb, n, w, sizeof w);
        if (ok < 0)
            return rg_fail(err, "out of memory");
        if (ok)
            break;
        snprintf(why, cap, "week %d of the kept plan no longer keeps the rules: %s", n, w);
    }
    pb->fixed_weeks = n;
    return n;
}
