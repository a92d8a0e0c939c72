/* planverify.h - the plan verifier: a plain-C re-simulation of a plan
 * (plan stage).
 *
 * Whatever produced a plan (the GLPK model in planmilp.c, the rule-of-thumb
 * baseline in planbase.c, a hand-edited plan), pv_simulate() replays it week
 * by week with the cover recursion of docs/planner.md, checks every row of
 * the model by the name the page gives it, and adds up the objective.  It
 * never calls GLPK, so it is the independent judge of the other two.
 */
#ifndef PLANVERIFY_H
#define PLANVERIFY_H

#include "plan.h"

/* Tolerances of the checks: cover rows in t DM/ha, mass rows in t DM
 * (docs/planner.md, "The verifier's simulation"). */
#define PV_TOL_COVER 1e-6
#define PV_TOL_MASS 1e-6

typedef struct pv_result {
    double cost_total, cost_supplement, cost_mowing, cost_moves, penalty_terminal;
    double supplement_t;     /* sum of sup_mt, t DM */
    double mowed_ha;         /* sum of A_p w_pt, ha */
    int moves;               /* sum of e_mpt */
    double terminal_shortfall_t; /* u, t DM */
    double *cover_t_ha;      /* [p * (n_weeks + 1) + t]: start of week t;
                                t = n_weeks is the end of the horizon */
    int n_violations;        /* rows broken (each row instance counts once) */
    char first_violation[256]; /* "row[ids]: what, with the numbers"; "" if none */
} pv_result;

/* 1 when the verifier can read pb: counts within range (1..PLAN_MAX_WEEKS
 * weeks, at least one paddock, no negative mob count), arrays present,
 * areas positive and finite, growth, covers, senescence, residual,
 * ceiling, demand and costs finite, rule counts not negative.  0 otherwise
 * (also for NULL).  It does not ask for a feasible problem. */
int pv_problem_valid(const plan_problem *pb);

/* Replays pl on pb and fills *out (out->cover_t_ha is allocated: release
 * with pv_free).  Returns 0 when the plan obeys every rule of
 * docs/planner.md, 1 when it breaks any (out->n_violations counts the
 * broken rows, out->first_violation names the first in week order as
 * "row[paddock or mob ids, week]: ..." with the numbers), -1 on bad
 * arguments (NULL, pv_problem_valid(pb) == 0, pl's sizes not pb's) or no
 * memory, leaving *out zeroed.  Costs and cover are filled in whether or
 * not rules are broken (a mowed week always ends at the residual). */
int pv_simulate(const plan_problem *pb, const plan *pl, pv_result *out);

/* Releases what pv_simulate allocated and zeroes *r (NULL is allowed). */
void pv_free(pv_result *r);

#endif
