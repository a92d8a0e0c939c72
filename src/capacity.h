/* capacity.h - carrying capacity: the largest head count of one mob that a
 * planning problem carries within limits on supplement and mowing (plan
 * stage, for `rowgraze capacity`).
 *
 * The method (docs/capacity.md): a head count H is decided exactly for the
 * model by the MILP with the limit rows lim_sup and lim_mow (plan.h,
 * docs/planner.md "Limits"; planmilp.h PM_DECIDE): either a plan keeping
 * every row, re-checked by the verifier, limits included (H is carried), or
 * a proof that there is none (the LP relaxation is infeasible, or branch
 * and bound explored the whole tree), or, when the time per decision runs
 * out first, neither (not proven; the least supplement any plan could have
 * is kept when known).  A search from the site's head count (doubling up
 * or halving down to a bracket, then bisection) finds H carried with H + 1
 * not carried; the answer is settled when H + 1 was proven not carried.
 * The plan at H is then optimised for cost within the limits (PM_IMPROVE,
 * warm-started from the deciding plan) and verified again.
 */
#ifndef CAPACITY_H
#define CAPACITY_H

#include "diag.h"
#include "plan.h"
#include "planmilp.h"
#include "planverify.h"

#define CAP_MAX_PROBES 96
#define CAP_MAX_HEAD 1000000 /* the site file's limit on a mob's head */

/* cap_probe.verdict: how one head count was settled */
enum cap_verdict {
    CAP_CARRIED,       /* a plan within the limits, verified */
    CAP_NO_PLAN_LP,    /* proven: the LP relaxation has no solution */
    CAP_NO_PLAN_TREE,  /* proven: branch and bound found no plan in the whole tree */
    CAP_NOT_PROVEN     /* the time per decision ran out first */
};

typedef struct cap_probe {
    int head;
    int verdict;             /* enum cap_verdict */
    double supplement_t;     /* CAP_CARRIED: the deciding plan's totals */
    double mowed_ha;
    double bound_supplement_t; /* CAP_NOT_PROVEN: least supplement any plan could
                                  have (t DM), or -HUGE_VAL when unknown */
    double seconds;          /* for reports, never for tests */
} cap_probe;

typedef struct cap_options {
    int mob;                 /* index of the mob whose head varies */
    double intake_kgdm_d;    /* that mob's intake per head, kg DM/day */
    int head0;               /* where the search starts (the site's head count) */
    int limit_supplement, limit_mowing, limit_shortfall; /* as plan.h */
    double max_supplement_t, max_mowed_ha, max_shortfall_t;
    double time_limit_s;     /* per decision, and for the final optimisation */
    double gap;              /* final optimisation: relative gap */
    int progress;            /* 1: one line per decision on stderr */
} cap_options;

typedef struct cap_result {
    int head;                /* the capacity: carried, head + 1 not carried (0: not even 1 head) */
    int settled;             /* 1: head + 1 proven not carried */
    int n_probes;
    cap_probe probe[CAP_MAX_PROBES]; /* in the order they were decided */
    plan_problem pb;         /* the problem at the capacity, limits on (n_paddocks 0 when head is 0) */
    plan opt, base;          /* the optimised plan within the limits; the baseline (limits off) */
    pv_result vopt, vbase;   /* their verified totals (vbase without the limits) */
    pm_result milp;          /* the final optimisation's status, bound, gap */
} cap_result;

/* Sets mob m of pb to head head (demand = head x intake_kgdm_d / 1000, as
 * planbuild.c computes it). */
void cap_set_head(plan_problem *pb, int m, int head, double intake_kgdm_d);

/* Searches pb (not changed) as described above.  Needs at least one limit.
 * Returns RG_EXIT_OK, RG_EXIT_INPUT (no limit, bad mob) or RG_EXIT_RUNTIME
 * (solver error, a plan the verifier refuses), with a message; *r is
 * always safe to pass to cap_free afterwards. */
int cap_search(const plan_problem *pb, const cap_options *o, cap_result *r, rg_err *err);

/* Decides one head count (used by cap_search): fills *pr, and, when
 * carried and plan_out is not NULL, the verified plan (allocated here:
 * plan_free).  near, when not NULL, is a plan carried at another head
 * count: repaired for this one (fewer days where the residual would break,
 * mowing where the ceiling would), it is the solver's first start; the
 * baseline stands in when it breaks a row.  pb gets the head count and the
 * limits of o.  Returns 0, or -1 with a message. */
int cap_decide(plan_problem *pb, const cap_options *o, int head, const plan *near, cap_probe *pr, plan *plan_out,
               rg_err *err);

/* "carried", "not carried (LP relaxation infeasible)", ... */
const char *cap_verdict_text(int verdict);

void cap_free(cap_result *r);

#endif
