/* planprice.h - exact pricing of one paddock's trajectories (plan stage).
 *
 * The pricing problem of the decomposition (plancg.c,
 * docs/decomposition.md "Pricing"): over every trajectory of one paddock
 * that keeps, on its own, every per-paddock row of docs/planner.md
 * (cover balance, residual, ceiling, mowing rows, use, cattle clearance,
 * one mob, density, visit days, spell, rest, moves), minimise
 *   cost - sum_mt day[mt] d_mt - sum_mt use[mt] y_mt - end A_p x_pT
 * (cost = the paddock's mowing and moves; d days, y = [d > 0], x_pT the
 * cover at the end).  Solved exactly by a dynamic program over weeks and
 * rule states whose value functions are piecewise linear in the cover (no
 * discretisation).  Plain C, no GLPK.
 */
#ifndef PLANPRICE_H
#define PLANPRICE_H

#include "plan.h"

/* Prices of the coupling rows as a paddock's subproblem sees them. */
typedef struct prc_duals {
    const double *day; /* [m * n_weeks + t]: value of a grazing day (feed dual x I_m + days dual) */
    const double *use; /* [m * n_weeks + t]: value of the mob being there (kmax dual, <= 0) */
    double end;        /* value of a t DM/ha of end cover, per ha (terminal row dual, >= 0) */
    int n_step;        /* visit-size rows (docs/decomposition.md, "Master"); 0: none */
    const int *step_min;  /* [s]: row s counts a mob's visits of at least step_min[s] days */
    const double *step;   /* [s * n_mobs * n_weeks + m * n_weeks + t]: value of such a visit (<= 0) */
    const double *move;   /* [m]: value of one more entry of mob m into a paddock (the dual of a
                             branching row on the mob's moves); NULL: none */
} prc_duals;

/* Branching rules on one paddock (plancg.c's branch and price): mob m
 * grazes lo[i] .. hi[i] days in week t (i = m * n_weeks + t; hi 0 bars
 * the mob, lo >= 1 forces it there), and mow[t] is -1 (free), 0 (never
 * mowed) or 1 (mowed) at the end of week t. */
typedef struct prc_box {
    const signed char *lo, *hi; /* [m * n_weeks + t] */
    const signed char *mow;     /* [t] */
} prc_box;

/* One paddock's decisions and value functions, built once, priced many times. */
typedef struct prc_pricer prc_pricer;

/* The pricer of paddock p of pb; NULL on a problem the verifier cannot read
 * (pv_problem_valid), p out of range, no memory, or more than 10 mobs
 * where paddocks may be shared (the rule states grow as 2^mobs). */
prc_pricer *prc_new(const plan_problem *pb, int p);
void prc_free(prc_pricer *pr);

/* The least priced cost over every trajectory, and one that attains it:
 * *bound = the minimum less a rounding allowance (1e-9 relative; each cover
 * row gets 1e-9 t DM/ha of slack, which can only lower the minimum);
 * *value = the priced cost of the trajectory returned in days
 * [m * n_weeks + t] and mow [t] (either may be NULL).  With caps (cap_d and
 * cap_y both given, [m * n_weeks + t]) only trajectories giving mob m at
 * most cap_d days in week t, and none where cap_y is 0, count (a plan's
 * days and paddock slots still free; the minimum is then over that subset,
 * not a bound of the whole).  Returns 0, or -1 on bad arguments or no
 * memory. */
int prc_solve(prc_pricer *pr, const prc_duals *du, const int *cap_d, const unsigned char *cap_y,
             double *value, double *bound, int *days, unsigned char *mow);

/* prc_solve without caps, over the trajectories inside box only: the
 * minimum (and *bound) is then over that subset.  Returns 0, 1 when no
 * trajectory keeps every per-paddock row inside the box (then nothing is
 * written), or -1 on bad arguments or no memory. */
int prc_solve_box(prc_pricer *pr, const prc_duals *du, const prc_box *box, double *value,
                  double *bound, int *days, unsigned char *mow);

/* prc_new, prc_solve without caps, prc_free, in one call. */
int prc_price(const plan_problem *pb, int p, const prc_duals *du, double *value, double *bound,
             int *days, unsigned char *mow);

#endif
