/* plan.h - the rotation planning problem and its plan (plan stage).
 *
 * This header is the contract between the pieces of the plan stage; the
 * formulation it encodes is written out as mathematics in docs/planner.md
 * (the single source of truth for the rules):
 *   plan_problem  what a plan must respect: paddocks with their starting
 *                 cover, weekly growth, residual and ceiling; mobs with
 *                 their demand; weeks; rules; costs (built from a site and
 *                 a growth forecast by planprob.c);
 *   plan          one week-by-week decision: grazing days per mob,
 *                 paddock and week, mowing per paddock and week,
 *                 supplement per mob and week;
 *   pv_simulate   the plain-C re-simulation of a plan (planverify.c): cover
 *                 week by week, every rule checked, costs added up.  The
 *                 MILP (planmilp.c, GLPK), the rule-of-thumb baseline
 *                 (planbase.c) and the verifier all follow the same
 *                 recursion, so a plan's cost is the same whichever reads it.
 * Masses are in tonnes of dry matter (t DM) and t DM/ha, days in days.
 */
#ifndef PLAN_H
#define PLAN_H

#include <stddef.h>
#include <stdint.h>

#define PLAN_ID_LEN 48
#define PLAN_MAX_WEEKS 52

typedef struct plan_paddock {
    char id[PLAN_ID_LEN];
    double area_ha;
    double cover0_t_ha;      /* cover at the start of week 0 */
    double residual_t_ha;    /* grazing never takes cover below this */
    double ceiling_t_ha;     /* cover at the end of every week stays at or below */
    double senescence_per_day; /* fraction of cover lost a day */
    int cattle_barred;       /* 1: panel clearance below the site's cattle limit */
} plan_paddock;

typedef struct plan_mob {
    char id[PLAN_ID_LEN];
    int head;
    int is_cattle;
    double demand_t_d;       /* head x intake, t DM/day */
} plan_mob;

typedef struct plan_problem {
    int n_paddocks, n_mobs, n_weeks;
    int64_t start_day;       /* day number (tcal.h) of week 0's first day */
    plan_paddock *pd;        /* [n_paddocks] */
    plan_mob *mob;           /* [n_mobs] */
    double *growth_t_ha_d;   /* [p * n_weeks + t] forecast growth, t DM/ha/day */
    int *open_days;          /* [p * n_weeks + t] days of week t one visit may last: the
                                longest run of consecutive days free of maintenance
                                windows, keep-off periods and recorded rest (7 when
                                the week is free; a visit is one run of days) */
    unsigned char *open_mask; /* [p * n_weeks + t] bit i set: day i (0 = the week's
                                first day) is free; NULL: every day free.  Only the
                                calendar reads it, to place a visit's days. */
    int rest_weeks;          /* weeks a paddock rests after a grazing spell:
                                ceil(min_rest_days / 7) */
    int spell_weeks;         /* weeks a grazing spell may last: ceil(max_days_per_visit / 7) */
    int max_days_per_visit;  /* grazing days in one spell, at most */
    int max_paddocks_per_week; /* paddocks one mob may use in a week (K) */
    int share_paddocks;      /* 1: several mobs may be in one paddock in a week */
    double max_head_per_ha;  /* stocking density limit while present */
    double terminal_t_ha;    /* area-weighted mean cover at the end, at least */
    double cost_supplement_per_t, cost_mowing_per_ha, cost_per_move;
    double penalty_terminal_per_t; /* per t DM of terminal shortfall */
    int fixed_weeks;         /* weeks 0..fixed_weeks-1 keep the grazing days of
                                fixed_days (an earlier plan held by --keep); 0: none */
    int *fixed_days;         /* [(m * n_paddocks + p) * n_weeks + t], read for
                                t < fixed_weeks only (plan.days' layout); NULL when
                                fixed_weeks is 0.  Owned by the problem. */
    /* Optional limits (docs/planner.md, "Limits"; `rowgraze capacity`):
     * a flag of 0 (as in a zeroed problem) means no limit, so problems
     * built before the limits existed are unchanged. */
    int limit_supplement;    /* 1: lim_sup: sum of sup_mt <= max_supplement_t */
    int limit_mowing;        /* 1: lim_mow: sum of A_p w_pt <= max_mowed_ha */
    int limit_shortfall;     /* 1: lim_end: u <= max_shortfall_t (0: the end target is hard) */
    double max_supplement_t; /* t DM over the horizon, >= 0 */
    double max_mowed_ha;     /* ha mowed over the horizon (a paddock mowed twice counts twice), >= 0 */
    double max_shortfall_t;  /* terminal shortfall u, t DM, >= 0 */
} plan_problem;

typedef struct plan {
    int n_paddocks, n_mobs, n_weeks;
    int *days;               /* [(m * n_paddocks + p) * n_weeks + t] grazing days 0..7 */
    unsigned char *mow;      /* [p * n_weeks + t] 1: mowed at the end of week t */
    double *supplement_t;    /* [m * n_weeks + t] t DM fed beyond pasture */
} plan;

/* 1 when paddock p is free on only part of week t (open_mask, and some day
 * free): a mob that uses it that week uses no other paddock that week, so
 * its visit can always be laid on the free days (row part[m,p,t] of
 * docs/planner.md). */
static inline int plan_part_week(const plan_problem *pb, int p, int t)
{
    size_t i = (size_t)p * (size_t)pb->n_weeks + (size_t)t;
    return pb->open_mask && pb->open_mask[i] != 0x7f && pb->open_days[i] > 0;
}

/* Most days a mob may graze one paddock in a week: D, at most 7. */
static inline int plan_days_max(const plan_problem *pb)
{
    return pb->max_days_per_visit < 7 ? pb->max_days_per_visit : 7;
}

/* Most days mob m may graze paddock p in week t: min(O_pt, D), 0 when
 * cattle are barred from p. */
static inline int plan_day_cap(const plan_problem *pb, int m, int p, int t)
{
    if (pb->mob[m].is_cattle && pb->pd[p].cattle_barred)
        return 0;
    int o = pb->open_days[p * pb->n_weeks + t], D = plan_days_max(pb);
    return o < D ? o : D;
}

/* Allocates an all-zero plan for pb (no grazing, no mowing, no supplement).
 * Returns 0, or -1 when out of memory. */
int plan_alloc(const plan_problem *pb, plan *pl);
void plan_free(plan *pl);
void plan_problem_free(plan_problem *pb);

/* A deep copy of a into *b (every array its own).  Returns 0, or -1 when
 * out of memory (*b is then empty). */
int plan_problem_copy(const plan_problem *a, plan_problem *b);

#endif
