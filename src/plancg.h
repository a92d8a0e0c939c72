/* plancg.h - the rotation plan by column generation (Dantzig-Wolfe
 * decomposition per paddock; plan stage).
 *
 * A column is one paddock's whole trajectory over the horizon (grazing
 * days of each mob each week, mowing weeks, hence cover week by week) that
 * keeps on its own every per-paddock row of docs/planner.md.  The master
 * couples the paddocks only through the mob-week rows (feed, days, kmax)
 * and the terminal cover row, with one convexity row per paddock.  Pricing
 * solves each paddock's subproblem exactly (planprice.h), so the
 * Lagrangian bound is valid at every iteration.  Branch and price
 * (branching on a mob's days in a paddock-week, or its mowing, enforced in
 * pricing and in each node's master) raises the bound past the master LP;
 * its bound is the least over the open nodes.  Plans come from dives, the
 * tree's whole node solutions, neighbourhoods of the best plan and the
 * restricted master as a MILP (GLPK), then the window phase of planmilp.c.  The mathematics and the
 * proof that the bound is valid for the compact model are in
 * docs/decomposition.md.
 */
#ifndef PLANCG_H
#define PLANCG_H

#include "plan.h"
#include "planmilp.h"

/* Solves pb by column generation and branch and price (the strategy
 * PM_DECOMP of pm_solve).  Arguments and results as pm_solve (planmilp.h):
 * out allocated by plan_alloc, res->bound the best bound of the compact
 * model (a Lagrangian bound, or the tree's least bound over its open
 * nodes), res->objective the cost of the best plan found (every plan
 * passes pv_simulate; never costlier than the baseline), res->rows and
 * res->cols the final restricted master's size, res->binaries its
 * trajectory columns, res->nodes the tree's nodes solved.  Without a time
 * limit the tree is explored to the end (the plan is then proven
 * optimal).
 * opt->warm, when it keeps every rule, seeds the master as the baseline
 * does.  Returns 0, or -1 with status PM_ERROR and a message. */
int pcg_solve(const plan_problem *pb, const pm_options *opt, plan *out, pm_result *res);

#endif
