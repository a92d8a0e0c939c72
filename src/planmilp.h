/* planmilp.h - the rotation plan as a mixed-integer program (plan stage).
 *
 * Builds the model of docs/planner.md (every set, variable, row name and
 * the objective, in tonnes), solves it with GLPK's branch and bound and
 * returns the best plan with the proven lower bound; or writes the model
 * out for another solver.  planmilp.c and plancg.c (the decomposition,
 * strategy PM_DECOMP) are the only files that include glpk.h.
 *
 * One addition to the page (reported to the page's owner): the row
 * pres[m,p,t]  y_mpt <= d_mpt  "a mob is in a paddock only on days it
 * grazes it".  A plan (plan.h) holds grazing days, not y, so without the row
 * the solver could keep y = 1 on a 0-day week (bridging a spell past the
 * rest rows, or saving a re-entry move) and return a plan whose cost and
 * rules read differently in the verifier.
 *
 * Solving strategies: pm_solve builds the model once and hands it to one
 * strategy function, chosen by pm_options.strategy (planmilp.c:
 * solve_direct, branch and bound on the whole model, warm-started from
 * opt->warm; solve_improve, fix-and-optimize over windows of weeks from the
 * warm plan, then branch and bound from the improved plan; solve_windows,
 * the window phase alone; docs/planner.md, "Solving"); PM_DECOMP hands
 * the problem to pcg_solve (plancg.h, docs/decomposition.md) and PM_AUTO
 * picks PM_IMPROVE or PM_DECOMP by size; PM_ROLLING hands it to prl_solve
 * (planroll.h, docs/rolling.md).  Every strategy reports the bound
 * of the full model, never of a restricted one.
 *
 * pm_result.warm under PM_IMPROVE and PM_WINDOWS: PM_WARM_USED when the
 * warm plan keeps every row (the window phase starts from it); when it is
 * refused (PM_WARM_REJECTED) or absent, the phase starts from the baseline
 * (planbase.c) instead.
 */
#ifndef PLANMILP_H
#define PLANMILP_H

#include "diag.h"
#include "plan.h"

/* pm_options.strategy */
#define PM_DIRECT 0  /* branch and bound on the whole model (the default) */
#define PM_IMPROVE 1 /* the warm plan (else the baseline), improved by
                        fix-and-optimize over windows of weeks for up to 60 %
                        of the time limit, then branch and bound on the whole
                        model from the improved plan (docs/planner.md,
                        "Solving") */
#define PM_WINDOWS 2 /* the window phase of PM_IMPROVE alone, windows of
                        window_weeks, until a pass improves nothing: no bound
                        unless a window frees everything (tests, comparisons) */
#define PM_DECIDE 3  /* feasibility: is there a plan that keeps every row (the
                        limits of plan.h included)?  The objective becomes the
                        supplement, t DM; stops at the first plan (PM_FEASIBLE,
                        objective = its supplement), or proves there is none
                        (PM_NO_PLAN with infeasible = 1), or runs out of time
                        (PM_NO_PLAN, infeasible = 0, bound = the least
                        supplement any plan could have, when known) */
#define PM_DECOMP 4  /* column generation over paddock trajectories
                        (plancg.c, docs/decomposition.md): Lagrangian bound;
                        plans from dives, neighbourhoods and the restricted
                        master MILP, then the window phase; bound and gap as
                        the other strategies */
#define PM_AUTO 5    /* PM_IMPROVE when paddocks x weeks x mobs <=
                        PM_AUTO_COMPACT_CELLS, else PM_DECOMP */
#define PM_ROLLING 6 /* a rolling horizon (planroll.c, docs/rolling.md): windows
                        of weeks planned in detail with a coarse feed budget
                        of the weeks after them, then the decomposition on
                        the whole horizon from the rolled plan for the bound */
#define PM_AUTO_COMPACT_CELLS 100 /* docs/decomposition.md: the compact model
                                      proves tiny farms fastest; above, the
                                      decomposition bounds and plans better */

/* pm_result.status */
#define PM_OPTIMAL 0  /* proven optimal (to GLPK's tolerances) */
#define PM_FEASIBLE 1 /* a plan, stopped by the time or gap limit */
#define PM_NO_PLAN 2  /* the model is infeasible, or no plan in the time */
#define PM_ERROR 3    /* bad problem, out of memory, or a GLPK failure */

/* pm_result.warm */
#define PM_WARM_NONE 0     /* no warm plan given */
#define PM_WARM_USED 1     /* the warm plan was handed to GLPK as a plan */
#define PM_WARM_UNUSED 2   /* feasible, but GLPK did not need it (root LP was
                              integral) or had a better plan already */
#define PM_WARM_REJECTED 3 /* the warm plan breaks a row of the model */

typedef struct pm_options {
    double time_limit_s; /* total, build included; <= 0: no limit */
    double gap;          /* relative gap at which to stop, e.g. 0.01; <= 0: prove optimality */
    const plan *warm;    /* optional start plan (the baseline), may be NULL */
    int progress;        /* 1: one-line progress on stderr (the caller decides:
                            only when stderr is a terminal) */
    int strategy;        /* PM_DIRECT, PM_IMPROVE, PM_WINDOWS, PM_DECOMP, PM_AUTO,
                            PM_ROLLING */
    int window_weeks;    /* PM_IMPROVE, PM_WINDOWS: weeks a window frees (the
                            first pass for PM_IMPROVE); <= 0: 2..4, from the size */
} pm_options;

typedef struct pm_result {
    int status;          /* PM_OPTIMAL, PM_FEASIBLE, PM_NO_PLAN, PM_ERROR */
    double objective;    /* cost of the plan returned (NAN without a plan) */
    double bound;        /* proven lower bound on the optimum of the full model
                            (-HUGE_VAL when not even the LP relaxation was solved) */
    double gap;          /* (objective - bound) / max(1e-9, |objective|) */
    int rows, cols;      /* size of the model built */
    int binaries, integers; /* y, g, w; d (as declared, fixed ones included) */
    int warm;            /* PM_WARM_* */
    int infeasible;      /* 1: proven that no plan keeps every row (only possible
                            with the limits of plan.h; to GLPK's tolerances) */
    double seconds;      /* wall time of the call (for reports, never for tests) */
    int strategy;        /* the strategy that ran (PM_AUTO resolved) */
    int nodes;           /* PM_DECOMP: branch-and-price nodes solved (0 otherwise) */
    char msg[256];       /* why, when status is PM_ERROR or PM_NO_PLAN; else a note
                            (the warm plan refused and the row it breaks) or "" */
} pm_result;

/* Solves pb.  opt may be NULL (no limits, no warm start).  out must have been
 * allocated by plan_alloc(pb, out); it receives the best plan when the status
 * is PM_OPTIMAL or PM_FEASIBLE and is left untouched otherwise.  Returns 0
 * (whatever the status, PM_NO_PLAN included), or -1 with status PM_ERROR and
 * a message in res->msg.  GLPK errors never abort the process. */
int pm_solve(const plan_problem *pb, const pm_options *opt, plan *out, pm_result *res);

/* Writes the model pm_solve builds to path (atomically: path.tmp-PID, then
 * renamed): mps = 1 free MPS (glpsol --freemps), mps = 0 CPLEX LP
 * (glpsol --lp; GLPK writes bal[P01,3] there as bal(P01,3)).  Returns 0, or
 * -1 with a message in err (may be NULL). */
int pm_export(const plan_problem *pb, const char *path, int mps, rg_err *err);

#endif
