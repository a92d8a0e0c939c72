/* plancg.c - the rotation plan by column generation (see plancg.h and
 * docs/decomposition.md, which this file follows).
 *
 * Layout, top to bottom:
 *   columns: a paddock trajectory checked against every per-paddock row of
 *     docs/planner.md and costed (col_eval), plus the pool that holds them;
 *   (pricing is planprice.c: an exact dynamic program per paddock);
 *   the guard: GLPK errors jump back to guarded() (as in planmilp.c);
 *   the master: the coupling rows (feed, days, kmax, end) and a convexity
 *     row per paddock, supplement and terminal shortfall as free columns;
 *     the Lagrangian bound from its duals and the pricing minima
 *     (cg_iteration);
 *   plans: dives (fix trajectories, re-generate, repeat), neighbourhoods
 *     of the best plan re-planned by a dive and the restricted master MILP,
 *     the master MILP over every column, each plan checked by pv_simulate;
 *     then the window phase of planmilp.c (pm_solve, PM_WINDOWS);
 *   pcg_solve: the seed (baseline or warm plan), the phases, the result.
 * Masses in tonnes, as in planmilp.c.
 */
#include "plancg.h"

#include "planbase.h"
#include "planprice.h"
#include "planverify.h"

#include <glpk.h>
#include <limits.h>
#include <math.h>
#include <setjmp.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#define TOL 1e-6          /* the verifier's tolerance, t DM/ha */
#define RC_ENTER 1e-6     /* a column enters at reduced cost below -RC_ENTER max(1, |z|) */
#define CG_SHARE 0.50     /* share of the time limit for column generation */
#define DIVE_SHARE 0.75   /* ... column generation and the first dive together */
#define LNS_SHARE 0.80    /* ... and the neighbourhood dives (at least) */
#define MIP_SHARE 0.90    /* ... and the master MILP (the window phase: the rest) */
#define LNS_PADDOCKS 6    /* paddocks a neighbourhood frees */
#define LNS_MAX_S 10.0    /* one neighbourhood, at most */

/* ---------------------------------------------------------------- util */

static double now_s(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_MONOTONIC, &ts);
    return (double)ts.tv_sec + (double)ts.tv_nsec * 1e-9;
}

static int dmax_of(const plan_problem *pb)
{
    return pb->max_days_per_visit < 7 ? pb->max_days_per_visit : 7;
}

/* Most days mob m may graze paddock p in week t: min(O_pt, D), 0 when
 * cattle are barred. */
static int day_cap(const plan_problem *pb, int m, int p, int t)
{
    if (pb->mob[m].is_cattle && pb->pd[p].cattle_barred)
        return 0;
    int o = pb->open_days[p * pb->n_weeks + t], D = dmax_of(pb);
    return o < D ? o : D;
}

/* Milliseconds until `end` for GLPK (at least 1), INT_MAX without limit. */
static int ms_until(double end)
{
    if (!(end < HUGE_VAL))
        return INT_MAX;
    double ms = (end - now_s()) * 1000.0;
    return ms < 1.0 ? 1 : ms > 1e9 ? 1000000000 : (int)ms;
}

/* ------------------------------------------------------------- columns */

/* Spell and rest rows of one paddock (docs/planner.md) on g[0..T-1]. */
static int spell_rest_ok(const plan_problem *pb, const unsigned char *g)
{
    int T = pb->n_weeks, S = pb->spell_weeks;
    for (int t = 0; t < T; t++) {
        if (t + S <= T - 1) {
            int n = 0;
            for (int k = 0; k <= S; k++)
                n += g[t + k];
            if (n > S)
                return 0;
        }
        if (t + 1 < T && g[t] && !g[t + 1])
            for (int k = 2; k <= pb->rest_weeks && t + k <= T - 1; k++)
                if (g[t + k])
                    return 0;
    }
    return 1;
}

/* The mob rows of paddock p in week t (use, cattle, one, dens, visit);
 * returns the days eaten there x I_m summed, or -1 when a row breaks. */
static double week_intake(const plan_problem *pb, int p, int t, const int *days, int *grazed)
{
    int T = pb->n_weeks, n_mobs = 0, sum_d = 0;
    double head = 0, eaten = 0;
    for (int m = 0; m < pb->n_mobs; m++) {
        int d = days[m * T + t];
        if (d < 0 || d > day_cap(pb, m, p, t))
            return -1;
        n_mobs += d > 0;
        head += d > 0 ? (double)pb->mob[m].head : 0.0;
        sum_d += d;
        eaten += pb->mob[m].demand_t_d * (double)d;
    }
    if ((!pb->share_paddocks && n_mobs > 1) || sum_d > dmax_of(pb) ||
        (pb->max_head_per_ha > 0 && head > pb->max_head_per_ha * pb->pd[p].area_ha + 1e-9))
        return -1;
    *grazed = n_mobs > 0;
    return eaten;
}

/* Checks trajectory (days [m * T + t], mow [t]) of paddock p against every
 * per-paddock row of docs/planner.md, with the verifier's recursion and
 * tolerance; fills its cost (mowing and moves) and end cover.  Returns 0,
 * or -1 when a row breaks. */
static int col_eval(const plan_problem *pb, int p, const int *days, const unsigned char *mow,
                    double *cost, double *xT)
{
    const plan_paddock *q = &pb->pd[p];
    int T = pb->n_weeks;
    unsigned char g[PLAN_MAX_WEEKS];
    double x = q->cover0_t_ha, c = 0;
    for (int t = 0; t < T; t++) {
        int grazed = 0;
        double eaten = week_intake(pb, p, t, days, &grazed);
        if (eaten < 0)
            return -1;
        g[t] = (unsigned char)grazed;
        double x1 = (1.0 - 7.0 * q->senescence_per_day) * x +
                    7.0 * pb->growth_t_ha_d[p * T + t] - eaten / q->area_ha;
        if (mow[t] && x1 < q->residual_t_ha - TOL)
            return -1; /* mowlo */
        x = mow[t] ? q->residual_t_ha : x1;
        if (x < -TOL || (grazed && x < q->residual_t_ha - TOL) || x > q->ceiling_t_ha + TOL)
            return -1; /* bal (x >= 0), res, ceil */
        c += mow[t] ? pb->cost_mowing_per_ha * q->area_ha : 0.0;
        for (int m = 0; m < pb->n_mobs; m++)
            c += days[m * T + t] > 0 && !(t > 0 && days[m * T + t - 1] > 0) ? pb->cost_per_move : 0.0;
    }
    if (!spell_rest_ok(pb, g))
        return -1;
    *cost = c;
    *xT = x;
    return 0;
}

/* The idle trajectory: no grazing, mowed in a week that would end above
 * the ceiling (then it ends at the residual).  Feasible whenever the
 * baseline exists (growth >= 0, 0 <= 1 - 7 s_p, R_p <= C_p). */
static void col_idle(const plan_problem *pb, int p, int *days, unsigned char *mow)
{
    const plan_paddock *q = &pb->pd[p];
    int T = pb->n_weeks;
    double x = q->cover0_t_ha;
    memset(days, 0, (size_t)pb->n_mobs * (size_t)T * sizeof *days);
    for (int t = 0; t < T; t++) {
        double x1 = (1.0 - 7.0 * q->senescence_per_day) * x + 7.0 * pb->growth_t_ha_d[p * T + t];
        mow[t] = x1 > q->ceiling_t_ha;
        x = mow[t] ? q->residual_t_ha : x1;
    }
}

/* Paddock p's trajectory in plan pl. */
static void col_of_plan(const plan_problem *pb, const plan *pl, int p, int *days,
                        unsigned char *mow)
{
    int T = pb->n_weeks, P = pb->n_paddocks;
    for (int m = 0; m < pb->n_mobs; m++)
        memcpy(days + m * T, pl->days + ((size_t)m * P + p) * T, (size_t)T * sizeof *days);
    memcpy(mow, pl->mow + (size_t)p * T, (size_t)T);
}

/* ---------------------------------------------------------------- pool */

typedef struct pcg_pool {
    int n, cap, MT, T;
    int *pad;            /* [k] paddock of column k */
    double *cost, *xT;   /* [k] mowing + moves; end cover t DM/ha */
    signed char *days;   /* [k * MT + m * T + t] */
    unsigned char *mow;  /* [k * T + t] */
} pcg_pool;

static void pool_free(pcg_pool *pl)
{
    free(pl->pad);
    free(pl->cost);
    free(pl->xT);
    free(pl->days);
    free(pl->mow);
    memset(pl, 0, sizeof *pl);
}

static int pool_grow(pcg_pool *pl)
{
    int cap = pl->cap ? 2 * pl->cap : 256;
    int *pad = realloc(pl->pad, (size_t)cap * sizeof *pad);
    if (pad)
        pl->pad = pad;
    double *c = realloc(pl->cost, (size_t)cap * sizeof *c);
    if (c)
        pl->cost = c;
    double *x = realloc(pl->xT, (size_t)cap * sizeof *x);
    if (x)
        pl->xT = x;
    signed char *d = realloc(pl->days, (size_t)cap * (size_t)(pl->MT ? pl->MT : 1));
    if (d)
        pl->days = d;
    unsigned char *w = realloc(pl->mow, (size_t)cap * (size_t)pl->T);
    if (w)
        pl->mow = w;
    if (!pad || !c || !x || !d || !w)
        return -1;
    pl->cap = cap;
    return 0;
}

/* Index of paddock p's column equal to (days, mow), or -1. */
static int pool_find(const pcg_pool *pl, int p, const int *days, const unsigned char *mow)
{
    for (int k = 0; k < pl->n; k++) {
        if (pl->pad[k] != p || memcmp(pl->mow + (size_t)k * pl->T, mow, (size_t)pl->T) != 0)
            continue;
        const signed char *d = pl->days + (size_t)k * pl->MT;
        int same = 1;
        for (int i = 0; i < pl->MT && same; i++)
            same = d[i] == days[i];
        if (same)
            return k;
    }
    return -1;
}

/* --------------------------------------------------------------- guard */

typedef struct pcg_guard {
    jmp_buf jb;
    char text[160];
} pcg_guard;

static int on_glpk_text(void *info, const char *s)
{
    pcg_guard *g = info;
    size_t n = strlen(g->text);
    if (!strchr(g->text, '\n'))
        snprintf(g->text + n, sizeof g->text - n, "%s", s);
    return 1;
}

static void on_glpk_error(void *info)
{
    pcg_guard *g = info;
    longjmp(g->jb, 1);
}

/* Runs body(arg) with GLPK silenced and its errors caught.  Returns
 * body's result, or -1 (GLPK's environment freed, every GLPK object of
 * this thread gone) with the message in msg. */
static int guarded(int (*body)(void *), void *arg, char *msg, size_t cap)
{
    pcg_guard g;
    memset(&g, 0, sizeof g);
    int was = glp_term_out(GLP_OFF);
    glp_term_hook(on_glpk_text, &g);
    glp_error_hook(on_glpk_error, &g);
    int rc;
    if (setjmp(g.jb) != 0) {
        glp_free_env();
        g.text[strcspn(g.text, "\n")] = 0;
        snprintf(msg, cap, "GLPK stopped on an internal error: %.150s", g.text);
        return -1;
    }
    rc = body(arg);
    glp_error_hook(NULL, NULL);
    glp_term_hook(NULL, NULL);
    glp_term_out(was);
    return rc;
}

/* ------------------------------------------------------------- master */

typedef struct pcg_run {
    const plan_problem *pb;
    const pm_options *opt;
    pm_result *res;
    plan *out;
    double t0, lim;
    int M, T, P, MT;
    glp_prob *lp;           /* the restricted master */
    int c_lam;              /* first trajectory column; sup: 1..MT, u: MT + 1 */
    int r_feed, r_days, r_kmax, r_end, r_conv;
    int r_hull;             /* first hull row (docs/decomposition.md), 0: none */
    double hull_s, hull_rhs; /* sum_p d - hull_s sum_p y <= hull_rhs */
    pcg_pool pool;
    prc_pricer **pricer;    /* [P] */
    int *seed;              /* [P] the seed plan's column of each paddock */
    plan seed_plan;         /* the baseline, or the warm plan when cheaper */
    double seed_cost;
    double *day, *use;      /* [MT] duals as pricing sees them */
    int *tdays;             /* [MT] scratch trajectory */
    unsigned char *tmow;    /* [T] */
    double best_lb, z_lp;
    int iters, heur_done, diving;
    int *fixed;             /* [P] diving: the paddock's chosen column, or -1 */
    int *choice;            /* [P] columns of the best plan from the pool */
    int *idle;              /* [P] each paddock's idle column */
    plan best;              /* best verified plan */
    double best_cost;
    double last_out;
    int printed;
    double total_area;
} pcg_run;

/* Adds the trajectory (checked by col_eval) of paddock p to the pool and
 * the master; returns its index, the old one when present, -1 when it
 * breaks a row, -2 when out of memory. */
static int master_add(pcg_run *run, int p, const int *days, const unsigned char *mow)
{
    pcg_pool *pl = &run->pool;
    int k = pool_find(pl, p, days, mow);
    if (k >= 0)
        return k;
    double cost, xT;
    if (col_eval(run->pb, p, days, mow, &cost, &xT) != 0)
        return -1;
    if (pl->n == pl->cap && pool_grow(pl) != 0)
        return -2;
    k = pl->n++;
    pl->pad[k] = p;
    pl->cost[k] = cost;
    pl->xT[k] = xT;
    for (int i = 0; i < run->MT; i++)
        pl->days[(size_t)k * run->MT + i] = (signed char)days[i];
    memcpy(pl->mow + (size_t)k * run->T, mow, (size_t)run->T);
    int *ind = malloc((size_t)(4 * run->MT + 3) * sizeof *ind), n = 0;
    double *val = malloc((size_t)(4 * run->MT + 3) * sizeof *val);
    if (!ind || !val) {
        free(ind), free(val);
        pl->n--;
        return -2;
    }
    for (int i = 0; i < run->MT; i++) {
        if (days[i] == 0)
            continue;
        int m = i / run->T;
        if (run->pb->mob[m].demand_t_d != 0)
            ++n, ind[n] = run->r_feed + i, val[n] = run->pb->mob[m].demand_t_d * days[i];
        ++n, ind[n] = run->r_days + i, val[n] = days[i];
        ++n, ind[n] = run->r_kmax + i, val[n] = 1.0;
        if (run->r_hull && days[i] != run->hull_s)
            ++n, ind[n] = run->r_hull + i, val[n] = days[i] - run->hull_s;
    }
    if (xT != 0)
        ++n, ind[n] = run->r_end, val[n] = run->pb->pd[p].area_ha * xT;
    ++n, ind[n] = run->r_conv + p, val[n] = 1.0;
    int j = glp_add_cols(run->lp, 1);
    glp_set_col_bnds(run->lp, j, GLP_LO, 0, 0);
    glp_set_obj_coef(run->lp, j, cost);
    glp_set_mat_col(run->lp, j, n, ind, val);
    free(ind), free(val);
    return k;
}

/* The hull rows (docs/decomposition.md, "Master"): a mob uses Y paddocks
 * in a week (Y whole, at most K), each at most D days, 7 days in all, so
 * its days are at most f(Y) = min(7, D Y); f is concave, so the line
 * through (j, f(j)) and (j + 1, f(j + 1)) bounds the days at every whole
 * Y.  The only line not already implied (days <= D Y, days <= 7) is the
 * one at the kink j = floor(7 / D) when D j < 7 and j < K:
 *   sum_p d_mpt - (7 - D j) sum_p y_mpt <= D j - (7 - D j) j. */
static void master_hull(pcg_run *run)
{
    const plan_problem *pb = run->pb;
    int D = pb->max_days_per_visit < 7 ? pb->max_days_per_visit : 7;
    int j = D > 0 ? 7 / D : 0;
    if (run->MT == 0 || D <= 0 || D * j >= 7 || j >= pb->max_paddocks_per_week)
        return;
    run->hull_s = 7 - D * j;
    run->hull_rhs = D * j - run->hull_s * j;
    run->r_hull = glp_add_rows(run->lp, run->MT);
    for (int i = 0; i < run->MT; i++)
        glp_set_row_bnds(run->lp, run->r_hull + i, GLP_UP, 0, run->hull_rhs);
}

/* The master's rows and free columns (docs/decomposition.md, "Master"). */
static void master_build(pcg_run *run)
{
    const plan_problem *pb = run->pb;
    int MT = run->MT;
    run->lp = glp_create_prob();
    glp_set_obj_dir(run->lp, GLP_MIN);
    run->r_feed = 1;
    run->r_days = 1 + MT;
    run->r_kmax = 1 + 2 * MT;
    run->r_end = 1 + 3 * MT;
    run->r_conv = 2 + 3 * MT;
    glp_add_rows(run->lp, 3 * MT + 1 + run->P);
    glp_add_cols(run->lp, MT + 1);
    for (int i = 0; i < MT; i++) {
        double I = pb->mob[i / run->T].demand_t_d;
        glp_set_row_bnds(run->lp, run->r_feed + i, GLP_FX, 7 * I, 7 * I);
        glp_set_row_bnds(run->lp, run->r_days + i, GLP_UP, 0, 7);
        glp_set_row_bnds(run->lp, run->r_kmax + i, GLP_UP, 0, pb->max_paddocks_per_week);
        int row[2] = {0, run->r_feed + i};
        double a[2] = {0, 1.0};
        glp_set_col_bnds(run->lp, 1 + i, GLP_LO, 0, 0);
        glp_set_obj_coef(run->lp, 1 + i, pb->cost_supplement_per_t);
        glp_set_mat_col(run->lp, 1 + i, 1, row, a);
    }
    glp_set_row_bnds(run->lp, run->r_end, GLP_LO, pb->terminal_t_ha * run->total_area, 0);
    int row[2] = {0, run->r_end};
    double a[2] = {0, 1.0};
    glp_set_col_bnds(run->lp, MT + 1, GLP_LO, 0, 0);
    glp_set_obj_coef(run->lp, MT + 1, pb->penalty_terminal_per_t);
    glp_set_mat_col(run->lp, MT + 1, 1, row, a);
    for (int p = 0; p < run->P; p++)
        glp_set_row_bnds(run->lp, run->r_conv + p, GLP_FX, 1, 1);
    master_hull(run);
    run->c_lam = MT + 2;
}

/* Seeds the master: each paddock's trajectory in the seed plan and its
 * idle trajectory.  Returns 0, or -1 (message set). */
static int master_seed(pcg_run *run)
{
    for (int p = 0; p < run->P; p++) {
        run->fixed[p] = -1;
        col_of_plan(run->pb, &run->seed_plan, p, run->tdays, run->tmow);
        int k = master_add(run, p, run->tdays, run->tmow);
        col_idle(run->pb, p, run->tdays, run->tmow);
        int k2 = master_add(run, p, run->tdays, run->tmow);
        if (k < 0 || k2 < 0) {
            snprintf(run->res->msg, sizeof run->res->msg,
                     k == -2 || k2 == -2 ? "out of memory" : "seed trajectory of paddock %s breaks a row",
                     run->pb->pd[p].id);
            return -1;
        }
        run->seed[p] = run->choice[p] = k;
        run->idle[p] = k2;
    }
    return 0;
}

/* Solves the master LP; returns 0, or -1 on failure. */
static int master_lp(pcg_run *run, double end)
{
    glp_smcp sp;
    glp_init_smcp(&sp);
    sp.msg_lev = GLP_MSG_OFF;
    sp.tm_lim = ms_until(end + 60.0); /* the master LP is small: let it finish */
    int rc = glp_simplex(run->lp, &sp);
    if (rc != 0 || glp_get_status(run->lp) != GLP_OPT) {
        glp_adv_basis(run->lp, 0);
        rc = glp_simplex(run->lp, &sp);
    }
    if (rc != 0 || glp_get_status(run->lp) != GLP_OPT)
        return -1;
    run->z_lp = glp_get_obj_val(run->lp);
    return 0;
}

/* Duals with the signs the Lagrangian needs (docs/decomposition.md): days,
 * kmax and hull <= 0, end in [0, c_T], feed <= c_s (so supplement and shortfall
 * keep non-negative reduced costs); pricing's day and use prices. */
static double master_duals(pcg_run *run)
{
    const plan_problem *pb = run->pb;
    double rhs = 0;
    for (int i = 0; i < run->MT; i++) {
        double I = pb->mob[i / run->T].demand_t_d;
        double f = fmin(glp_get_row_dual(run->lp, run->r_feed + i), pb->cost_supplement_per_t);
        double d = fmin(0.0, glp_get_row_dual(run->lp, run->r_days + i));
        double k = fmin(0.0, glp_get_row_dual(run->lp, run->r_kmax + i));
        double h = run->r_hull ? fmin(0.0, glp_get_row_dual(run->lp, run->r_hull + i)) : 0.0;
        run->day[i] = f * I + d + h;
        run->use[i] = k - run->hull_s * h;
        rhs += 7 * I * f + 7 * d + pb->max_paddocks_per_week * k + run->hull_rhs * h;
    }
    return rhs;
}

/* The end row's dual, clipped to [0, c_T]. */
static double master_end_dual(const pcg_run *run)
{
    double e = glp_get_row_dual(run->lp, run->r_end);
    return fmax(0.0, fmin(e, run->pb->penalty_terminal_per_t));
}

/* 1 when the best plan is proven optimal, or (with loose) within
 * opt->gap of the bound. */
static int gap_within(const pcg_run *run, int loose)
{
    double z = run->best_cost, g = loose && run->opt->gap > 0 ? run->opt->gap : 0.0;
    return z - run->best_lb <= fmax(1e-7 * fmax(1.0, fabs(z)), g * fabs(z));
}

static int gap_closed(const pcg_run *run)
{
    return gap_within(run, 1);
}

static int fail_msg(pcg_run *run, const char *why)
{
    snprintf(run->res->msg, sizeof run->res->msg, "column generation stopped early: %s", why);
    return -1;
}

static void progress(pcg_run *run, const char *what)
{
    double now = now_s();
    if (!run->opt->progress || now - run->last_out < 1.0)
        return;
    fprintf(stderr, "\rplan: %s (iteration %d), %d columns, best %.2f, bound %.2f   ", what,
            run->iters + 1, run->pool.n, run->best_cost, run->best_lb);
    run->last_out = now;
    run->printed = 1;
}

/* One iteration: master LP, duals, every paddock priced, new columns in,
 * the Lagrangian bound.  Returns the number of columns added, or -1. */
static int cg_iteration(pcg_run *run, double end)
{
    if (master_lp(run, end) != 0)
        return fail_msg(run, "the master LP failed");
    double lb = master_duals(run);
    double e = master_end_dual(run);
    prc_duals du = {run->day, run->use, e};
    lb += e * run->pb->terminal_t_ha * run->total_area;
    int added = 0, valid = 1;
    for (int p = 0; p < run->P; p++) {
        double value, bound;
        if (run->fixed[p] >= 0)
            continue; /* diving: the paddock's trajectory is chosen */
        if (prc_solve(run->pricer[p], &du, NULL, NULL, &value, &bound, run->tdays, run->tmow) != 0)
            return fail_msg(run, "out of memory in pricing");
        valid = valid && bound > -HUGE_VAL;
        lb += bound;
        double conv = glp_get_row_dual(run->lp, run->r_conv + p);
        if (value < HUGE_VAL && value - conv < -RC_ENTER * fmax(1.0, fabs(run->z_lp))) {
            int before = run->pool.n, k = master_add(run, p, run->tdays, run->tmow);
            if (k == -2)
                return fail_msg(run, "out of memory");
            added += run->pool.n > before;
        }
        progress(run, "column generation");
    }
    if (valid && !run->diving && lb > run->best_lb)
        run->best_lb = lb; /* a dive's master is restricted: no bound from it */
    run->iters++;
    return added;
}

/* Column generation until convergence, `end`, or the gap closes.  The
 * master LP optimum at convergence is the Lagrangian bound itself. */
static void cg_phase(pcg_run *run, double end)
{
    while (now_s() < end) {
        int added = cg_iteration(run, end);
        if (added < 0)
            return;
        if (added == 0)
            return; /* converged: the master LP optimum is the bound */
        if (run->z_lp - run->best_lb <= 1e-9 * fmax(1.0, fabs(run->z_lp)))
            return;
    }
}

/* The master MILP's callback: the best plan of pooled columns (run->choice)
 * as its first plan. */
static void on_master_tree(glp_tree *tree, void *info)
{
    pcg_run *run = info;
    if (glp_ios_reason(tree) != GLP_IHEUR || run->heur_done)
        return;
    int n = glp_get_num_cols(run->lp);
    double *x = calloc((size_t)n + 1, sizeof *x);
    if (!x)
        return;
    double end = 0;
    for (int i = 0; i < run->MT; i++)
        x[1 + i] = run->pb->mob[i / run->T].demand_t_d * 7;
    for (int p = 0; p < run->P; p++) {
        int k = run->choice[p];
        x[run->c_lam + k] = 1.0;
        end += run->pb->pd[p].area_ha * run->pool.xT[k];
        for (int i = 0; i < run->MT; i++)
            x[1 + i] -= run->pb->mob[i / run->T].demand_t_d * run->pool.days[(size_t)k * run->MT + i];
    }
    x[run->MT + 1] = fmax(0.0, run->pb->terminal_t_ha * run->total_area - end);
    glp_ios_heur_sol(tree, x);
    free(x);
    run->heur_done = 1; /* offered once */
}

/* The plan of pooled columns choice[p], supplement by feed[m,t]. */
static void plan_of_choice(const pcg_run *run, const int *choice, plan *pl)
{
    const plan_problem *pb = run->pb;
    int T = run->T, P = run->P;
    for (int p = 0; p < P; p++) {
        int k = choice[p];
        for (int m = 0; m < run->M; m++)
            for (int t = 0; t < T; t++)
                pl->days[((size_t)m * P + p) * T + t] = run->pool.days[(size_t)k * run->MT + m * T + t];
        memcpy(pl->mow + (size_t)p * T, run->pool.mow + (size_t)k * T, (size_t)T);
    }
    for (int m = 0; m < run->M; m++)
        for (int t = 0; t < T; t++) {
            int total = 0;
            for (int p = 0; p < P; p++)
                total += pl->days[((size_t)m * P + p) * T + t];
            pl->supplement_t[m * T + t] = pb->mob[m].demand_t_d * (7 - total);
        }
}

/* Keeps pl as the best plan when the verifier passes it and it is
 * cheaper; returns 1 then, else 0. */
static int offer_plan(pcg_run *run, const plan *pl)
{
    pv_result v;
    int rc = pv_simulate(run->pb, pl, &v), better = 0;
    if (rc == 0 && v.cost_total < run->best_cost - 1e-9 * fmax(1.0, fabs(run->best_cost))) {
        better = 1;
        size_t n = (size_t)run->M * run->P * run->T;
        memcpy(run->best.days, pl->days, n * sizeof *pl->days);
        memcpy(run->best.mow, pl->mow, (size_t)run->P * run->T);
        memcpy(run->best.supplement_t, pl->supplement_t, (size_t)run->MT * sizeof *pl->supplement_t);
        run->best_cost = v.cost_total;
    }
    if (rc >= 0)
        pv_free(&v);
    return better;
}

/* Offers the plan of columns choice[p]; when it is the new best, it
 * becomes run->choice (the master MILP's first plan). */
static void offer_choice(pcg_run *run, const int *choice)
{
    plan pl;
    if (plan_alloc(run->pb, &pl) != 0)
        return;
    plan_of_choice(run, choice, &pl);
    if (offer_plan(run, &pl))
        memcpy(run->choice, choice, (size_t)run->P * sizeof *choice);
    plan_free(&pl);
}

/* The restricted master as a MILP (binary trajectory choice) until `end`. */
static void master_mip(pcg_run *run, double end)
{
    int n = glp_get_num_cols(run->lp);
    for (int j = run->c_lam; j <= n; j++) /* integer, 0..1 by convexity; bounds kept */
        glp_set_col_kind(run->lp, j, GLP_IV);
    run->heur_done = 0;
    for (int p = 0; p < run->P; p++) /* the first plan must keep the dive's fixings */
        run->heur_done |= run->fixed[p] >= 0 && run->fixed[p] != run->choice[p];
    if (master_lp(run, end) != 0)
        return;
    glp_iocp ip;
    glp_init_iocp(&ip);
    ip.msg_lev = GLP_MSG_OFF;
    ip.presolve = GLP_OFF; /* glp_ios_heur_sol needs the original columns */
    ip.tm_lim = ms_until(end);
    ip.mip_gap = run->opt->gap > 0 ? run->opt->gap / 4 : 0.0;
    ip.fp_heur = GLP_ON;
    ip.cb_func = on_master_tree;
    ip.cb_info = run;
    int rc = glp_intopt(run->lp, &ip), st = glp_mip_status(run->lp);
    for (int j = run->c_lam; j <= n; j++)
        glp_set_col_kind(run->lp, j, GLP_CV);
    if ((rc != 0 && rc != GLP_ETMLIM && rc != GLP_EMIPGAP) || (st != GLP_OPT && st != GLP_FEAS))
        return;
    int *choice = malloc((size_t)run->P * sizeof *choice);
    if (!choice)
        return;
    for (int k = 0; k < run->pool.n; k++)
        if (glp_mip_col_val(run->lp, run->c_lam + k) > 0.5)
            choice[run->pool.pad[k]] = k;
    offer_choice(run, choice);
    free(choice);
}

/* Paddock p keeps only pooled column k (k < 0: every column again). */
static void fix_paddock(pcg_run *run, int p, int k)
{
    for (int j = 0; j < run->pool.n; j++)
        if (run->pool.pad[j] == p)
            glp_set_col_bnds(run->lp, run->c_lam + j, k < 0 || j == k ? GLP_LO : GLP_FX, 0, 0);
    run->fixed[p] = k;
}

/* 1 when column k fits beside the fixed columns (days[m,t] <= 7 and
 * kmax[m,t] <= K for the columns fixed so far, counted in used_d, used_k). */
static int dive_fits(const pcg_run *run, int k, const int *used_d, const int *used_k)
{
    for (int i = 0; i < run->MT; i++) {
        int d = run->pool.days[(size_t)k * run->MT + i];
        if (d > 0 && (used_d[i] + d > 7 || used_k[i] + 1 > run->pb->max_paddocks_per_week))
            return 0;
    }
    return 1;
}

static void dive_take(pcg_run *run, int k, int *used_d, int *used_k)
{
    for (int i = 0; i < run->MT; i++) {
        int d = run->pool.days[(size_t)k * run->MT + i];
        used_d[i] += d;
        used_k[i] += d > 0;
    }
    fix_paddock(run, run->pool.pad[k], k);
}

/* Paddock p's best trajectory under the master's duals that fits beside
 * the fixed columns (days <= 7 - used, no mob-week at K paddocks): a
 * column index (added to the pool), or its idle column. */
static int dive_price(pcg_run *run, int p, const int *used_d, const int *used_k)
{
    int *cap_d = malloc((size_t)run->MT * sizeof *cap_d);
    unsigned char *cap_y = malloc((size_t)run->MT);
    int k = run->idle[p];
    if (!cap_d || !cap_y) {
        free(cap_d), free(cap_y);
        return k;
    }
    for (int i = 0; i < run->MT; i++) {
        cap_d[i] = 7 - used_d[i];
        cap_y[i] = used_k[i] < run->pb->max_paddocks_per_week;
    }
    master_duals(run);
    prc_duals du = {run->day, run->use, master_end_dual(run)};
    double value, bound;
    if (prc_solve(run->pricer[p], &du, cap_d, cap_y, &value, &bound, run->tdays, run->tmow) == 0) {
        int j = master_add(run, p, run->tdays, run->tmow);
        k = j >= 0 ? j : k;
    }
    free(cap_d), free(cap_y);
    return k;
}

/* Fixes the paddocks whose master LP trajectory is whole, and at least one
 * more: the column of largest weight if it fits beside those fixed, else
 * that paddock's best trajectory that fits (dive_price); the master stays
 * feasible.  Returns how many paddocks were fixed. */
static int dive_fix(pcg_run *run, int *used_d, int *used_k)
{
    int n = 0, best_k = -1;
    double best = 0;
    for (int k = 0; k < run->pool.n; k++) {
        int p = run->pool.pad[k];
        if (run->fixed[p] >= 0)
            continue;
        double v = glp_get_col_prim(run->lp, run->c_lam + k);
        if (v >= 1 - 1e-6 && dive_fits(run, k, used_d, used_k))
            dive_take(run, k, used_d, used_k), n++;
    }
    for (int k = 0; n == 0 && k < run->pool.n; k++) {
        double v = glp_get_col_prim(run->lp, run->c_lam + k);
        if (run->fixed[run->pool.pad[k]] < 0 && v > best)
            best = v, best_k = k;
    }
    if (n > 0 || best_k < 0)
        return n;
    if (!dive_fits(run, best_k, used_d, used_k))
        best_k = dive_price(run, run->pool.pad[best_k], used_d, used_k);
    dive_take(run, best_k, used_d, used_k);
    return 1;
}

/* Out of time in a dive: every paddock left takes, in index order, its
 * column of largest weight in the current master LP when it fits beside
 * those fixed, else its best trajectory that fits (dive_price); no more
 * column generation.  Returns the paddocks left (0). */
static int dive_finish(pcg_run *run, int *used_d, int *used_k)
{
    int *arg = malloc((size_t)run->P * sizeof *arg);
    double *top = calloc((size_t)run->P, sizeof *top);
    if (!arg || !top) {
        free(arg), free(top);
        return 1;
    }
    for (int p = 0; p < run->P; p++)
        arg[p] = -1;
    for (int k = 0; k < run->pool.n; k++) {
        int p = run->pool.pad[k];
        double v = glp_get_col_prim(run->lp, run->c_lam + k);
        if (run->fixed[p] < 0 && (arg[p] < 0 || v > top[p]))
            top[p] = v, arg[p] = k;
    }
    for (int p = 0; p < run->P; p++) {
        if (run->fixed[p] >= 0)
            continue;
        int k = arg[p] >= 0 && dive_fits(run, arg[p], used_d, used_k) ? arg[p]
                                                                        : dive_price(run, p, used_d, used_k);
        dive_take(run, k, used_d, used_k);
    }
    free(arg), free(top);
    return 0;
}

/* Diving (docs/decomposition.md, "Plans") over the paddocks with
 * free_p[p] (the others keep the best plan's trajectories, run->choice):
 * fix trajectories the master LP chooses, generate columns for the rest,
 * repeat until every paddock is fixed (or `end`); the plan is offered.
 * With mip, the restricted master MILP then chooses the free paddocks'
 * trajectories among every pooled column (until `end`).  The master is
 * restored. */
static void dive(pcg_run *run, const unsigned char *free_p, int mip, double end)
{
    int *used_d = calloc((size_t)run->MT + 1, sizeof *used_d);
    int *used_k = calloc((size_t)run->MT + 1, sizeof *used_k);
    if (!used_d || !used_k) {
        free(used_d), free(used_k);
        return;
    }
    run->diving = 1;
    int left = 0;
    for (int p = 0; p < run->P; p++)
        if (free_p[p])
            left++;
        else
            dive_take(run, run->choice[p], used_d, used_k);
    while (left > 0 && now_s() < end) {
        cg_phase(run, end);
        int n = master_lp(run, end) == 0 ? dive_fix(run, used_d, used_k) : 0;
        if (n == 0)
            break;
        left -= n;
    }
    if (left > 0 && master_lp(run, end) == 0)
        left = dive_finish(run, used_d, used_k);
    if (left == 0)
        offer_choice(run, run->fixed);
    for (int p = 0; mip && p < run->P; p++)
        if (free_p[p])
            fix_paddock(run, p, -1);
    if (mip && now_s() < end)
        master_mip(run, end);
    for (int p = 0; p < run->P; p++)
        fix_paddock(run, p, -1);
    run->diving = 0;
    free(used_d), free(used_k);
}

/* Large neighbourhoods of the best plan until `end`: a few paddocks drawn
 * at random (a fixed generator) are freed, the rest keep their
 * trajectories, and a dive with the restricted master MILP re-plans them. */
static void neighbourhoods(pcg_run *run, double end)
{
    unsigned char *free_p = calloc((size_t)run->P, 1);
    if (!free_p)
        return;
    uint64_t seed = 20261202;
    int f = run->P < LNS_PADDOCKS ? run->P : LNS_PADDOCKS;
    while (now_s() < end && !gap_closed(run)) {
        memset(free_p, 0, (size_t)run->P);
        for (int n = 0; n < f;) {
            seed = seed * 6364136223846793005ULL + 1442695040888963407ULL;
            int p = (int)((seed >> 33) % (uint64_t)run->P);
            if (!free_p[p])
                free_p[p] = 1, n++;
        }
        dive(run, free_p, 1, fmin(end, now_s() + LNS_MAX_S));
        if (f == run->P)
            break; /* the whole farm: once is enough */
    }
    free(free_p);
}

/* Column generation and the master MILP, inside the guard; every GLPK
 * object is deleted before it returns. */
static int cg_body(void *arg)
{
    pcg_run *run = arg;
    double lim = run->lim;
    master_build(run);
    if (master_seed(run) != 0) {
        glp_delete_prob(run->lp);
        return -1;
    }
    for (int p = 0; p < run->P; p++)
        if (!(run->pricer[p] = prc_new(run->pb, p))) {
            snprintf(run->res->msg, sizeof run->res->msg, "pricing: out of memory or too many mobs");
            glp_delete_prob(run->lp);
            return -1;
        }
    cg_phase(run, lim > 0 ? run->t0 + CG_SHARE * lim : HUGE_VAL);
    if (run->printed)
        fputc('\n', stderr), run->printed = 0;
    unsigned char *all = malloc((size_t)run->P);
    if (all && !gap_within(run, 0)) { /* the first dive runs whatever opt->gap says */
        memset(all, 1, (size_t)run->P);
        dive(run, all, 0, lim > 0 ? run->t0 + DIVE_SHARE * lim : HUGE_VAL);
    }
    free(all);
    if (lim > 0) /* at least LNS_SHARE - DIVE_SHARE of the limit */
        neighbourhoods(run, fmax(run->t0 + LNS_SHARE * lim, now_s() + (LNS_SHARE - DIVE_SHARE) * lim));
    if (!gap_closed(run))
        master_mip(run, lim > 0 ? run->t0 + MIP_SHARE * lim : HUGE_VAL);
    run->res->rows = glp_get_num_rows(run->lp);
    run->res->cols = glp_get_num_cols(run->lp);
    run->res->binaries = run->pool.n;
    glp_delete_prob(run->lp);
    run->lp = NULL;
    return 0;
}

/* The window phase of planmilp.c from the best plan, for the time left. */
static void improve(pcg_run *run)
{
    double left = run->lim > 0 ? run->lim - (now_s() - run->t0) : 0;
    if ((run->lim > 0 && left < 0.5) ||
        gap_closed(run))
        return;
    plan pl;
    if (plan_alloc(run->pb, &pl) != 0)
        return;
    pm_options o = {left, run->opt->gap, &run->best, run->opt->progress, PM_WINDOWS,
                    run->opt->window_weeks};
    pm_result r;
    if (pm_solve(run->pb, &o, &pl, &r) == 0 && (r.status == PM_OPTIMAL || r.status == PM_FEASIBLE)) {
        offer_plan(run, &pl);
        if (r.status == PM_OPTIMAL && r.bound > run->best_lb)
            run->best_lb = r.bound; /* a window that freed everything: the full model */
    }
    plan_free(&pl);
}

static void run_free(pcg_run *run)
{
    pool_free(&run->pool);
    for (int p = 0; run->pricer && p < run->P; p++)
        prc_free(run->pricer[p]);
    free(run->pricer);
    free(run->seed);
    free(run->fixed);
    free(run->choice);
    free(run->idle);
    free(run->day);
    free(run->use);
    free(run->tdays);
    free(run->tmow);
    plan_free(&run->seed_plan);
    plan_free(&run->best);
}

/* The seed: the baseline, or the warm plan when it keeps every rule and
 * is cheaper.  Returns 0, or -1 (message set). */
static int run_seed(pcg_run *run)
{
    pv_result v;
    if (pb_baseline(run->pb, &run->seed_plan) != 0 || pv_simulate(run->pb, &run->seed_plan, &v) != 0) {
        snprintf(run->res->msg, sizeof run->res->msg, "no baseline plan for this problem");
        return -1;
    }
    run->seed_cost = v.cost_total;
    pv_free(&v);
    const plan *w = run->opt->warm;
    if (w) {
        int rc = pv_simulate(run->pb, w, &v);
        run->res->warm = rc == 0 ? PM_WARM_UNUSED : PM_WARM_REJECTED;
        if (rc == 0 && v.cost_total < run->seed_cost) {
            size_t n = (size_t)run->M * run->P * run->T;
            memcpy(run->seed_plan.days, w->days, n * sizeof *w->days);
            memcpy(run->seed_plan.mow, w->mow, (size_t)run->P * run->T);
            memcpy(run->seed_plan.supplement_t, w->supplement_t, (size_t)run->MT * sizeof *w->supplement_t);
            run->seed_cost = v.cost_total;
            run->res->warm = PM_WARM_USED;
        }
        if (rc >= 0)
            pv_free(&v);
    }
    return 0;
}

static int run_init(pcg_run *run, const plan_problem *pb, const pm_options *opt, plan *out,
                    pm_result *res)
{
    memset(run, 0, sizeof *run);
    run->pb = pb;
    run->opt = opt;
    run->res = res;
    run->out = out;
    run->t0 = now_s();
    run->lim = opt->time_limit_s;
    run->M = pb->n_mobs;
    run->T = pb->n_weeks;
    run->P = pb->n_paddocks;
    run->MT = run->M * run->T;
    run->pool.MT = run->MT;
    run->pool.T = run->T;
    run->best_lb = -HUGE_VAL;
    run->last_out = run->t0;
    for (int p = 0; p < run->P; p++)
        run->total_area += pb->pd[p].area_ha;
    size_t mt = (size_t)run->MT + 1;
    run->pricer = calloc((size_t)run->P, sizeof *run->pricer);
    run->seed = calloc((size_t)run->P, sizeof *run->seed);
    run->fixed = malloc((size_t)run->P * sizeof *run->fixed);
    run->choice = calloc((size_t)run->P, sizeof *run->choice);
    run->idle = calloc((size_t)run->P, sizeof *run->idle);
    run->day = calloc(mt, sizeof *run->day);
    run->use = calloc(mt, sizeof *run->use);
    run->tdays = calloc(mt, sizeof *run->tdays);
    run->tmow = calloc((size_t)run->T, 1);
    if (!run->pricer || !run->seed || !run->fixed || !run->choice || !run->idle || !run->day || !run->use ||
        !run->tdays || !run->tmow || plan_alloc(pb, &run->best) != 0) {
        snprintf(res->msg, sizeof res->msg, "out of memory");
        return -1;
    }
    if (run_seed(run) != 0)
        return -1;
    size_t n = (size_t)run->M * run->P * run->T;
    memcpy(run->best.days, run->seed_plan.days, n * sizeof *run->best.days);
    memcpy(run->best.mow, run->seed_plan.mow, (size_t)run->P * run->T);
    memcpy(run->best.supplement_t, run->seed_plan.supplement_t, (size_t)run->MT * sizeof(double));
    run->best_cost = run->seed_cost;
    return 0;
}

/* The result as pm_solve reports it, the best plan into out. */
static void run_result(pcg_run *run)
{
    pm_result *res = run->res;
    plan *out = run->out;
    size_t n = (size_t)run->M * run->P * run->T;
    memcpy(out->days, run->best.days, n * sizeof *out->days);
    memcpy(out->mow, run->best.mow, (size_t)run->P * run->T);
    memcpy(out->supplement_t, run->best.supplement_t, (size_t)run->MT * sizeof(double));
    double obj = run->best_cost;
    res->objective = obj;
    res->bound = run->best_lb < obj ? run->best_lb : obj;
    res->gap = res->bound > -HUGE_VAL ? (obj - res->bound) / fmax(1e-9, fabs(obj)) : HUGE_VAL;
    res->status = obj - res->bound <= 1e-6 * fmax(1.0, fabs(obj)) ? PM_OPTIMAL : PM_FEASIBLE;
}

int pcg_solve(const plan_problem *pb, const pm_options *opt, plan *out, pm_result *res)
{
    static const pm_options none = {0, 0, NULL, 0, PM_DECOMP, 0};
    if (!res)
        return -1;
    memset(res, 0, sizeof *res);
    res->objective = (double)NAN;
    res->bound = -HUGE_VAL;
    res->gap = HUGE_VAL;
    res->status = PM_ERROR;
    double t0 = now_s();
    if (!pv_problem_valid(pb) || !out || out->n_paddocks != pb->n_paddocks ||
        out->n_mobs != pb->n_mobs || out->n_weeks != pb->n_weeks || !out->days) {
        snprintf(res->msg, sizeof res->msg, "decomposition: bad problem or output plan");
        return -1;
    }
    if (opt && opt->warm && (opt->warm->n_paddocks != pb->n_paddocks ||
                             opt->warm->n_mobs != pb->n_mobs || opt->warm->n_weeks != pb->n_weeks)) {
        snprintf(res->msg, sizeof res->msg, "decomposition: warm plan not allocated for this problem");
        return -1;
    }
    pcg_run run;
    int rc = run_init(&run, pb, opt ? opt : &none, out, res);
    if (rc == 0) {
        rc = guarded(cg_body, &run, res->msg, sizeof res->msg);
        if (rc == 0)
            improve(&run);
    }
    if (rc == 0)
        run_result(&run);
    else
        res->status = PM_ERROR;
    run_free(&run);
    res->seconds = now_s() - t0;
    return rc == 0 ? 0 : -1;
}
