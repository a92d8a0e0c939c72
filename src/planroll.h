/* planroll.h - the rotation plan by a rolling horizon (plan stage).
 *
 * The strategy PM_ROLLING of pm_solve (docs/rolling.md): a window of W
 * weeks is planned in detail (a plan_problem of its own, solved by
 * pm_solve with PM_AUTO), the weeks after it only coarsely, as a feed
 * budget of the whole farm that sets the window's end-cover target and its
 * price; the first R weeks of the window are kept, the paddocks' covers and
 * rest carried forward, and the window rolls on until the horizon is
 * covered.  The plan so rolled seeds the decomposition (plancg.h) on the
 * whole horizon, which gives the lower bound: a bound of the whole
 * problem, never of a window.  Every plan is re-checked by pv_simulate and
 * the result is never costlier than the baseline (planbase.h).
 */
#ifndef PLANROLL_H
#define PLANROLL_H

#include "plan.h"
#include "planmilp.h"

/* prl_options.tail: how a window values the weeks after it */
#define PRL_TAIL_BUDGET 0 /* the feed budget of the later weeks (docs/rolling.md) */
#define PRL_TAIL_NONE 1   /* nothing: a window ends with no end-cover rule (myopic) */
#define PRL_TAIL_TARGET 2 /* the horizon's own end-cover rule at every window's end */

#define PRL_WINDOW_WEEKS 12 /* W, weeks a window plans in detail */
#define PRL_ROLL_WEEKS 4    /* R, weeks a window keeps before it rolls */
#define PRL_ROLL_SHARE 0.5  /* share of the time limit for the windows; the
                               decomposition's bound phase has the rest */

typedef struct prl_options {
    int window_weeks; /* W; <= 0: PRL_WINDOW_WEEKS */
    int roll_weeks;   /* R, 1..W; <= 0: PRL_ROLL_WEEKS */
    int tail;         /* PRL_TAIL_* */
} prl_options;

/* The rolled plan alone: windows as above, each solved by pm_solve
 * (PM_AUTO, opt->gap, an equal share of opt->time_limit_s, none when the
 * limit is <= 0).  opt and ro may be NULL (no limit; the defaults above).
 * out, allocated by plan_alloc(pb, out), receives the plan when it passes
 * pv_simulate on pb (res->status PM_FEASIBLE, objective its verified cost);
 * when it does not (only with limit rows, which windows do not carry),
 * status is PM_NO_PLAN, res->msg names the row and out is untouched.
 * res->bound is -HUGE_VAL (a window gives no bound of the whole); rows,
 * cols and binaries are the largest window's.  Returns 0, or -1 with
 * status PM_ERROR and a message. */
int prl_roll(const plan_problem *pb, const pm_options *opt, const prl_options *ro, plan *out,
             pm_result *res);

/* PM_ROLLING (pm_solve passes ro = NULL): prl_roll with ro for up to
 * PRL_ROLL_SHARE of the time limit, then the decomposition (pcg_solve) on
 * the whole horizon, seeded with the cheapest of the rolled plan,
 * opt->warm and the baseline, for the time left.  res as pm_solve:
 * objective the cheapest plan that passes pv_simulate among the baseline,
 * opt->warm, the rolled plan and the decomposition's; bound the
 * decomposition's Lagrangian bound of the whole horizon (-HUGE_VAL when it
 * failed); gap; status; rows, cols, binaries the decomposition's master;
 * res->msg notes what the rolled plan cost and how long it took.  Returns
 * 0, or -1 with status PM_ERROR and a message. */
int prl_solve(const plan_problem *pb, const pm_options *opt, const prl_options *ro, plan *out,
              pm_result *res);

#endif
