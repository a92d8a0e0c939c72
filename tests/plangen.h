/* plangen.h - random planning problems for the planner tests.
 *
 * Header only, static functions: each test program that includes it gets
 * its own copy.  A fixed linear congruential generator (Knuth's MMIX
 * constants) draws a small problem: covers 1-3 t DM/ha, growth up to 80
 * kg/ha/day (common practice, no source), every rule able to bind.  The
 * kinds draw in one fixed order, the order the planner tests' seeds and
 * hand-worked cases were chosen with, so a seed gives the same problem in
 * every test program:
 *   PG_PLAIN  weeks closed 15 %, 3 days open 15 %, else all open; rests of
 *             1-3 weeks, spells of 1-2 weeks, days per visit as asked;
 *   PG_ROLL   weeks closed 10 %, else all open; rests of 1-3 weeks, spells
 *             of 1 week, 2-7 days per visit;
 *   PG_RICH   as PG_ROLL with part weeks (days 0-3 free: open mask 0x0f)
 *             15 %, rests of 0-3 weeks and spells of 1-2 weeks.
 * Free the problem with plan_problem_free().
 */
#ifndef PLANGEN_H
#define PLANGEN_H

#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "plan.h"

enum pg_kind { PG_PLAIN, PG_ROLL, PG_RICH };

/* Uniform on [0, 1) from the top 53 bits of the next state. */
static double rnd(uint64_t *s)
{
    *s = *s * 6364136223846793005ULL + 1442695040888963407ULL;
    return (double)(*s >> 11) / 9007199254740992.0;
}

static void pg_paddocks(uint64_t *s, plan_problem *pb, enum pg_kind kind)
{
    int T = pb->n_weeks;
    for (int p = 0; p < pb->n_paddocks; p++) {
        plan_paddock *pd = &pb->pd[p];
        snprintf(pd->id, PLAN_ID_LEN, "P%02d", p + 1);
        pd->area_ha = 0.5 + 1.5 * rnd(s);
        pd->residual_t_ha = 1.0 + 0.4 * rnd(s);
        pd->ceiling_t_ha = 2.3 + 0.8 * rnd(s);
        pd->cover0_t_ha = 1.2 + 1.6 * rnd(s);
        pd->senescence_per_day = 0.02 * rnd(s);
        pd->cattle_barred = rnd(s) < 0.3;
        for (int t = 0; t < T; t++) {
            double u = rnd(s);
            pb->growth_t_ha_d[p * T + t] = 0.08 * rnd(s);
            if (kind == PG_PLAIN) {
                pb->open_days[p * T + t] = u < 0.15 ? 0 : u < 0.3 ? 3 : 7;
                continue;
            }
            pb->open_days[p * T + t] = u < 0.1 ? 0 : kind == PG_RICH && u < 0.25 ? 4 : 7;
            if (kind == PG_RICH)
                pb->open_mask[p * T + t] = u < 0.1 ? 0 : u < 0.25 ? 0x0f : 0x7f;
        }
    }
}

/* An empty problem of P paddocks, M mobs and T weeks (zeros; an open-day
 * mask when asked). */
static void pg_alloc(plan_problem *pb, int P, int M, int T, int with_mask)
{
    memset(pb, 0, sizeof *pb);
    pb->n_paddocks = P;
    pb->n_mobs = M;
    pb->n_weeks = T;
    pb->pd = calloc((size_t)P, sizeof *pb->pd);
    pb->mob = calloc((size_t)M + 1, sizeof *pb->mob);
    pb->growth_t_ha_d = calloc((size_t)(P * T), sizeof *pb->growth_t_ha_d);
    pb->open_days = calloc((size_t)(P * T), sizeof *pb->open_days);
    pb->open_mask = with_mask ? calloc((size_t)(P * T), 1) : NULL;
    assert_true(pb->pd && pb->mob && pb->growth_t_ha_d && pb->open_days &&
                (!with_mask || pb->open_mask));
}

/* A random problem of P paddocks, M mobs and T weeks; days_per_visit is
 * used by PG_PLAIN only (the other kinds draw it). */
static void pg_random(uint64_t *s, plan_problem *pb, int P, int M, int T, enum pg_kind kind,
                      int days_per_visit)
{
    pg_alloc(pb, P, M, T, kind == PG_RICH);
    pg_paddocks(s, pb, kind);
    for (int m = 0; m < M; m++) {
        snprintf(pb->mob[m].id, PLAN_ID_LEN, "M%d", m + 1);
        pb->mob[m].head = 20 + (int)(80 * rnd(s));
        pb->mob[m].is_cattle = rnd(s) < 0.4;
        pb->mob[m].demand_t_d = 0.15 + 0.45 * rnd(s);
    }
    if (kind == PG_PLAIN) {
        pb->rest_weeks = 1 + (int)(3 * rnd(s));
        pb->spell_weeks = 1 + (int)(2 * rnd(s));
        pb->max_days_per_visit = days_per_visit;
    } else {
        pb->rest_weeks = kind == PG_RICH ? (int)(4 * rnd(s)) : 1 + (int)(3 * rnd(s));
        pb->spell_weeks = kind == PG_RICH ? 1 + (int)(2 * rnd(s)) : 1;
        pb->max_days_per_visit = 2 + (int)(6 * rnd(s));
    }
    pb->max_paddocks_per_week = 1 + (int)(2 * rnd(s));
    pb->share_paddocks = rnd(s) < 0.3;
    pb->max_head_per_ha = rnd(s) < 0.3 ? 40 + 40 * rnd(s) : 0;
    pb->terminal_t_ha = 1.4 + 0.8 * rnd(s);
    pb->cost_supplement_per_t = 200 + 200 * rnd(s);
    pb->cost_mowing_per_ha = 30 + 50 * rnd(s);
    pb->cost_per_move = 5 + 20 * rnd(s);
    pb->penalty_terminal_per_t = 2 * pb->cost_supplement_per_t;
}

#endif
