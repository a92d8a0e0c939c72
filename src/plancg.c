/* plancg.c - the rotation plan by column generation (see plancg.h and
 * docs/decomposition.md, which this file follows).
 *
 * Layout, top to bottom:
 *   columns: a paddock trajectory checked against every per-paddock row of
 *     docs/planner.md and costed (col_eval), plus the pool that holds them;
 *   (pricing is planprice.c: an exact dynamic program per paddock);
 *   the guard: GLPK errors jump back to guarded() (as in planmilp.c);
 *   the master: the coupling rows (feed, days, kmax, end) and a convexity
 *     row per paddock, supplement and terminal shortfall as free columns,
 *     a moves row per mob (free until the tree bounds it);
 *     the Lagrangian bound from its duals and the pricing minima
 *     (cg_iteration);
 *   branch and price: nodes of rules on a mob's total moves (first, when
 *     fractional: bnp_moves) or on a paddock's days or mowing in a
 *     week, each solved by column generation inside its rules (pricing
 *     with prc_solve_box, the master's other columns fixed at 0), strong
 *     branching on the most fractional uses, best bound first, the bound
 *     the least over the open nodes (bnp_*);
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
#define DIVE_SHARE 0.60   /* ... column generation and the first dive together */
#define TREE_SHARE 0.80   /* ... and branch and price */
#define LNS_SHARE 0.85    /* ... and the neighbourhood dives (at least 5 %) */
#define MIP_SHARE 0.92    /* ... and the master MILP (the window phase: the rest) */
#define LNS_PADDOCKS 6    /* paddocks a neighbourhood frees */
#define LNS_MAX_S 10.0    /* one neighbourhood, at most */
#define SB_CANDIDATES 8   /* uses probed by strong branching at a node, at most */
#define MASTER_LP_S 30.0  /* one master LP's first try, at most (then the other simplex) */

/* ---------------------------------------------------------------- util */

static double now_s(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_MONOTONIC, &ts);
    return (double)ts.tv_sec + (double)ts.tv_nsec * 1e-9;
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
        if (d < 0 || d > plan_day_cap(pb, m, p, t))
            return -1;
        n_mobs += d > 0;
        head += d > 0 ? (double)pb->mob[m].head : 0.0;
        sum_d += d;
        eaten += pb->mob[m].demand_t_d * (double)d;
    }
    if ((!pb->share_paddocks && n_mobs > 1) || sum_d > plan_days_max(pb) ||
        (pb->max_head_per_ha > 0 && head > pb->max_head_per_ha * pb->pd[p].area_ha + 1e-9))
        return -1;
    *grazed = n_mobs > 0;
    return eaten;
}

/* 1 when mob m enters the paddock in week t of days [m * T + t]: it grazes
 * there that week and did not the week before (the first week counts as
 * an entry).  Each entry is a move, charged cost_per_move. */
static int entered(int T, const int *days, int m, int t)
{
    return days[m * T + t] > 0 && !(t > 0 && days[m * T + t - 1] > 0);
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
            c += entered(T, days, m, t) ? pb->cost_per_move : 0.0;
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
    int c_art, n_art;       /* artificial columns of the <= rows (branch and price) */
    int r_feed, r_days, r_kmax, r_end, r_conv;
    int r_hull;             /* first hull row (docs/decomposition.md), 0: none */
    double hull_s, hull_rhs; /* sum_p d - hull_s sum_p y [- Z] <= hull_rhs */
    int hull_z;             /* -1, or the visit-size row s whose count Z the hull row subtracts */
    int n_step, r_step;     /* visit-size rows: row r_step + s * MT + i counts mob-week i's */
    int step_min[8], step_rhs[8]; /* visits of >= step_min[s] days, at most step_rhs[s] */
    double *step;           /* [s * MT + i] their duals as pricing sees them */
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
    /* branch and price (docs/decomposition.md, "Branch and price") */
    int in_tree;            /* 1: pricing keeps the node's box, bounds go to node_lb */
    signed char *box_lo, *box_hi, *box_mow; /* [p * MT + i], [p * MT + i], [p * T + t] */
    unsigned char *boxed;   /* [P] 1: the node restricts paddock p */
    double node_lb;         /* best Lagrangian bound of the node being solved */
    struct bnp_node *nodes;
    int n_nodes, cap_nodes, nodes_done;
    double tree_floor;      /* least bound of the nodes closed without a plan */
    int r_ent;              /* first of M rows counting each mob's moves (entries), free
                               outside the tree; a node may bound them (branching on moves) */
    int c_ent_art;          /* first of 2 M artificial columns of those rows */
    int *ent_lo, *ent_hi;   /* [M] the node's bounds on each mob's moves */
    double *ent_dual;       /* [M] their duals as pricing sees them */
} pcg_run;

/* Moves of mob m in a trajectory's days, as col_eval charges them. */
static int moves_of(int T, const int *days, int m)
{
    int n = 0;
    for (int t = 0; t < T; t++)
        n += entered(T, days, m, t);
    return n;
}

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
    size_t nz = (size_t)(4 + run->n_step) * (size_t)run->MT + (size_t)run->M + 3;
    int *ind = malloc(nz * sizeof *ind), n = 0;
    double *val = malloc(nz * sizeof *val);
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
        double hv = days[i] - run->hull_s -
                    (run->hull_z >= 0 && days[i] >= run->step_min[run->hull_z] ? 1.0 : 0.0);
        if (run->r_hull && hv != 0)
            ++n, ind[n] = run->r_hull + i, val[n] = hv;
        for (int r = 0; r < run->n_step; r++)
            if (days[i] >= run->step_min[r])
                ++n, ind[n] = run->r_step + r * run->MT + i, val[n] = 1.0;
    }
    if (xT != 0)
        ++n, ind[n] = run->r_end, val[n] = run->pb->pd[p].area_ha * xT;
    for (int m = 0; m < run->M; m++) {
        int e = moves_of(run->T, days, m);
        if (e > 0)
            ++n, ind[n] = run->r_ent + m, val[n] = e;
    }
    ++n, ind[n] = run->r_conv + p, val[n] = 1.0;
    int j = glp_add_cols(run->lp, 1);
    glp_set_col_bnds(run->lp, j, GLP_LO, 0, 0);
    glp_set_obj_coef(run->lp, j, cost);
    glp_set_mat_col(run->lp, j, n, ind, val);
    free(ind), free(val);
    return k;
}

/* The largest days - h Y - Z over every week's whole visits of one mob:
 * at most k more visits, each of at most `top` days (visits in falling
 * order), `left` days of the week still free; Z counts visits of at least
 * v days. */
static int hull_lift_max(int D, int k, int left, int top, int h, int v)
{
    int best = 0;
    for (int d = 1; k > 0 && d <= top && d <= left && d <= D; d++) {
        int c = d - h - (d >= v) + hull_lift_max(D, k - 1, left - d, d, h, v);
        best = c > best ? c : best;
    }
    return best;
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
    int D = plan_days_max(pb);
    int j = D > 0 ? 7 / D : 0;
    run->hull_z = -1;
    if (run->MT == 0 || D <= 0 || D * j >= 7 || j >= pb->max_paddocks_per_week)
        return;
    run->hull_s = 7 - D * j;
    run->hull_rhs = D * j - run->hull_s * j;
    /* lifted by a visit-size count Z (docs/decomposition.md): the least
     * right-hand side over every whole week's visits, where it is lower */
    for (int r = 0; r < run->n_step; r++) {
        int c = hull_lift_max(D, pb->max_paddocks_per_week, 7, D, run->hull_s, run->step_min[r]);
        if (c < run->hull_rhs)
            run->hull_rhs = c, run->hull_z = r;
    }
    run->r_hull = glp_add_rows(run->lp, run->MT);
    for (int i = 0; i < run->MT; i++)
        glp_set_row_bnds(run->lp, run->r_hull + i, GLP_UP, 0, run->hull_rhs);
}

/* The visit-size rows (docs/decomposition.md, "Master"): whole visits of
 * at least v days to one mob in one week number at most floor(7 / v) (the
 * mob has 7 days).  A row for v is kept when that count is below K and
 * below the count for v - 1 (else a row already there implies it), and
 * v <= D (else no visit reaches v):
 *   sum_p [d_mpt >= v] <= floor(7 / v). */
static void master_steps(pcg_run *run)
{
    const plan_problem *pb = run->pb;
    int D = plan_days_max(pb), K = pb->max_paddocks_per_week;
    run->n_step = 0;
    for (int v = 2, prev = 7; v <= D && run->MT > 0 && run->n_step < 8; v++) {
        int c = 7 / v;
        if (c < K && c < prev) {
            run->step_min[run->n_step] = v;
            run->step_rhs[run->n_step++] = c;
        }
        prev = c < prev ? c : prev;
    }
    if (run->n_step == 0)
        return;
    run->r_step = glp_add_rows(run->lp, run->n_step * run->MT);
    for (int r = 0; r < run->n_step; r++)
        for (int i = 0; i < run->MT; i++)
            glp_set_row_bnds(run->lp, run->r_step + r * run->MT + i, GLP_UP, 0, run->step_rhs[r]);
}

/* Artificial columns, one per feed row and per <= row (days, kmax, hull,
 * visit size),
 * each relaxing its row by one unit (a day, a paddock), fixed at 0 except
 * in the branch-and-price tree, where forced grazing can make a node's
 * master infeasible: there each may relax its row at a cost (bnp_tree) so
 * high that no integral solution uses it.  The trajectory columns follow. */
static void master_artificial(pcg_run *run)
{
    int MT = run->MT, rows[12] = {run->r_feed, run->r_days, run->r_kmax}, nf = 3;
    if (run->r_hull)
        rows[nf++] = run->r_hull;
    for (int r = 0; r < run->n_step; r++)
        rows[nf++] = run->r_step + r * MT;
    run->c_art = MT + 2;
    run->n_art = nf * MT;
    if (run->n_art > 0)
        glp_add_cols(run->lp, run->n_art);
    for (int j = 0; j < run->n_art; j++) {
        int row[2] = {0, rows[j / MT] + j % MT};
        /* feed: one day's demand eaten beyond it (supplement cannot go below 0) */
        double a[2] = {0, j < MT ? -run->pb->mob[j / run->T].demand_t_d : -1.0};
        glp_set_col_bnds(run->lp, run->c_art + j, GLP_FX, 0, 0);
        glp_set_mat_col(run->lp, run->c_art + j, 1, row, a);
    }
    /* the moves rows: one column counting a move up, one down, per mob */
    run->c_ent_art = run->c_art + run->n_art;
    if (run->M > 0)
        glp_add_cols(run->lp, 2 * run->M);
    for (int j = 0; j < 2 * run->M; j++) {
        int row[2] = {0, run->r_ent + j / 2};
        double a[2] = {0, j % 2 ? -1.0 : 1.0};
        glp_set_col_bnds(run->lp, run->c_ent_art + j, GLP_FX, 0, 0);
        glp_set_mat_col(run->lp, run->c_ent_art + j, 1, row, a);
    }
    run->n_art += 2 * run->M;
    run->c_lam = run->c_art + run->n_art;
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
    run->r_ent = run->M > 0 ? glp_add_rows(run->lp, run->M) : 0;
    for (int m = 0; m < run->M; m++)
        glp_set_row_bnds(run->lp, run->r_ent + m, GLP_FR, 0, 0);
    master_steps(run);
    master_hull(run);
    master_artificial(run);
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
    sp.meth = run->in_tree || run->diving ? GLP_DUALP : GLP_PRIMAL; /* bounds changed */
    /* the master LP is small: let it finish, but a stalled simplex gets
     * MASTER_LP_S before the other method starts again from a fresh basis */
    sp.tm_lim = ms_until(fmin(end + 60.0, now_s() + MASTER_LP_S));
    int rc = glp_simplex(run->lp, &sp);
    if (rc != 0 || glp_get_status(run->lp) != GLP_OPT) {
        glp_adv_basis(run->lp, 0);
        sp.meth = sp.meth == GLP_PRIMAL ? GLP_DUALP : GLP_PRIMAL;
        sp.tm_lim = ms_until(end + 60.0);
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
        for (int r = 0; r < run->n_step; r++) {
            double v = fmin(0.0, glp_get_row_dual(run->lp, run->r_step + r * run->MT + i));
            run->step[r * run->MT + i] = v;
            rhs += run->step_rhs[r] * v;
        }
        if (run->hull_z >= 0) /* the hull row's - Z term */
            run->step[run->hull_z * run->MT + i] -= h;
    }
    /* the moves rows: >= ent_lo (dual >= 0), <= ent_hi (dual <= 0), else free */
    for (int m = 0; m < run->M; m++) {
        double e = 0.0;
        if (run->in_tree) {
            e = glp_get_row_dual(run->lp, run->r_ent + m);
            e = run->ent_lo[m] > 0 ? e : fmin(0.0, e);
            e = run->ent_hi[m] < INT_MAX ? e : fmax(0.0, e);
        }
        run->ent_dual[m] = e;
        rhs += e > 0 ? e * run->ent_lo[m] : e < 0 ? e * run->ent_hi[m] : 0.0;
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
    if (run->in_tree)
        fprintf(stderr, "\rplan: branch and price (node %d), %d columns, best %.2f, bound %.2f   ",
                run->nodes_done + 1, run->pool.n, run->best_cost, run->best_lb);
    else
        fprintf(stderr, "\rplan: %s (iteration %d), %d columns, best %.2f, bound %.2f   ", what,
                run->iters + 1, run->pool.n, run->best_cost, run->best_lb);
    run->last_out = now;
    run->printed = 1;
}

/* Paddock p's branching rules at the node being solved. */
static prc_box box_of(const pcg_run *run, int p)
{
    prc_box b = {run->box_lo + (size_t)p * run->MT, run->box_hi + (size_t)p * run->MT,
                 run->box_mow + (size_t)p * run->T};
    return b;
}

/* One iteration: master LP, duals, every paddock priced, new columns in,
 * the Lagrangian bound.  Returns the number of columns added, or -1. */
static int cg_iteration(pcg_run *run, double end)
{
    if (master_lp(run, end) != 0)
        return fail_msg(run, "the master LP failed");
    double lb = master_duals(run);
    double e = master_end_dual(run);
    prc_duals du = {run->day, run->use, e, run->n_step, run->step_min, run->step, run->ent_dual};
    lb += e * run->pb->terminal_t_ha * run->total_area;
    int added = 0, valid = 1;
    for (int p = 0; p < run->P; p++) {
        double value, bound;
        if (run->fixed[p] >= 0)
            continue; /* diving: the paddock's trajectory is chosen */
        prc_box bx = box_of(run, p);
        int rc = prc_solve_box(run->pricer[p], &du, run->in_tree && run->boxed[p] ? &bx : NULL, &value,
                               &bound, run->tdays, run->tmow);
        if (rc == 1)
            return -3; /* no trajectory in the node's box: bnp_node_solve prevents it */
        if (rc != 0)
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
    if (valid && run->in_tree)
        run->node_lb = fmax(run->node_lb, lb); /* valid for the node's plans */
    else if (valid && !run->diving && lb > run->best_lb)
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
    prc_duals du = {run->day, run->use, master_end_dual(run), run->n_step, run->step_min, run->step,
                    run->ent_dual};
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


/* ---------------------------------------------------- branch and price */

/* A node of the tree (docs/decomposition.md, "Branch and price"): the
 * rule that its parent's branching added; the node's plans keep every
 * rule on its path from the root. */
#define BNP_MOVES (-2) /* a node's rule on a mob's moves, not on a paddock */

typedef struct bnp_node {
    int parent;             /* -1: the root (no rule) */
    int p, i;               /* paddock p; i >= 0: mob i / T grazes lo..hi days in
                               week i % T; i < 0: mowed (lo = 1) or not (lo = 0)
                               at the end of week -1 - i; p = BNP_MOVES: mob i
                               moves lo..hi times over the horizon */
    int lo, hi;
    signed char alone;      /* 1: and mob i / T uses no other paddock in week i % T
                               (a part week, row part[m,p,t] of docs/planner.md) */
    int depth, open;
    double bound;           /* no plan inside the node costs less */
} bnp_node;

/* A new open node; returns its index, or -1 when out of memory. */
static int bnp_add(pcg_run *run, int parent, int p, int i, int lo, int hi, double bound)
{
    if (run->n_nodes == run->cap_nodes) {
        int cap = run->cap_nodes ? 2 * run->cap_nodes : 64;
        bnp_node *v = realloc(run->nodes, (size_t)cap * sizeof *v);
        if (!v)
            return -1;
        run->nodes = v;
        run->cap_nodes = cap;
    }
    int depth = parent >= 0 ? run->nodes[parent].depth + 1 : 0;
    run->nodes[run->n_nodes] = (bnp_node){parent, p, i, lo, hi, 0, depth, 1, bound};
    return run->n_nodes++;
}

/* The box of node v (run->box_*): every rule on its path, intersected. */
static void bnp_box(pcg_run *run, int v)
{
    size_t P = (size_t)run->P, MT = (size_t)run->MT, T = (size_t)run->T;
    memset(run->box_lo, 0, P * MT + 1);
    memset(run->box_hi, 7, P * MT + 1);
    memset(run->box_mow, -1, P * T + 1);
    memset(run->boxed, 0, P);
    for (int m = 0; m < run->M; m++)
        run->ent_lo[m] = 0, run->ent_hi[m] = INT_MAX;
    for (; v >= 0 && run->nodes[v].parent >= 0; v = run->nodes[v].parent) {
        const bnp_node *n = &run->nodes[v];
        if (n->p == BNP_MOVES) {
            run->ent_lo[n->i] = n->lo > run->ent_lo[n->i] ? n->lo : run->ent_lo[n->i];
            run->ent_hi[n->i] = n->hi < run->ent_hi[n->i] ? n->hi : run->ent_hi[n->i];
            continue;
        }
        run->boxed[n->p] = 1;
        if (n->i >= 0) {
            size_t j = (size_t)n->p * MT + (size_t)n->i;
            run->box_lo[j] = n->lo > run->box_lo[j] ? (signed char)n->lo : run->box_lo[j];
            run->box_hi[j] = n->hi < run->box_hi[j] ? (signed char)n->hi : run->box_hi[j];
            for (int q = 0; n->alone && q < run->P; q++)
                if (q != n->p)
                    run->box_hi[(size_t)q * MT + (size_t)n->i] = 0, run->boxed[q] = 1;
        } else
            run->box_mow[(size_t)n->p * T + (size_t)(-1 - n->i)] = (signed char)n->lo;
    }
}

/* 1 when pooled column k keeps the box of its paddock. */
static int bnp_fits(const pcg_run *run, int k)
{
    int p = run->pool.pad[k];
    if (!run->boxed[p])
        return 1;
    prc_box b = box_of(run, p);
    const signed char *d = run->pool.days + (size_t)k * run->MT;
    const unsigned char *w = run->pool.mow + (size_t)k * run->T;
    for (int i = 0; i < run->MT; i++)
        if (d[i] < b.lo[i] || d[i] > b.hi[i])
            return 0;
    for (int t = 0; t < run->T; t++)
        if (b.mow[t] >= 0 && w[t] != b.mow[t])
            return 0;
    return 1;
}

/* The node's master: every pooled column outside the box fixed at 0; a
 * paddock left without a column gets its cheapest trajectory inside the
 * box (priced at zero duals).  Returns 0; 1 when a paddock's box holds no
 * trajectory (the node has no plan); 2 when such a trajectory breaks a
 * row in col_eval (cannot happen: the node is then kept as unresolved);
 * -1 when out of memory. */
static int bnp_master(pcg_run *run)
{
    for (int m = 0; m < run->M; m++) {
        int lo = run->ent_lo[m], hi = run->ent_hi[m];
        glp_set_row_bnds(run->lp, run->r_ent + m,
                         lo > 0 && hi < INT_MAX ? (lo == hi ? GLP_FX : GLP_DB)
                                                : lo > 0 ? GLP_LO : hi < INT_MAX ? GLP_UP : GLP_FR,
                         lo, hi < INT_MAX ? hi : 0);
    }
    unsigned char *has = calloc((size_t)run->P + 1, 1);
    double *zero = calloc((size_t)run->MT + 1, sizeof *zero);
    int rc = has && zero ? 0 : -1;
    for (int k = 0; rc == 0 && k < run->pool.n; k++) {
        int ok = bnp_fits(run, k);
        glp_set_col_bnds(run->lp, run->c_lam + k, ok ? GLP_LO : GLP_FX, 0, 0);
        has[run->pool.pad[k]] |= (unsigned char)ok;
    }
    prc_duals du = {zero, zero, 0.0, 0, NULL, NULL, NULL};
    for (int p = 0; rc == 0 && p < run->P; p++) {
        if (has[p])
            continue;
        prc_box b = box_of(run, p);
        double value, bound;
        rc = prc_solve_box(run->pricer[p], &du, &b, &value, &bound, run->tdays, run->tmow);
        if (rc == 0) {
            int k = master_add(run, p, run->tdays, run->tmow);
            rc = k >= 0 ? 0 : k == -1 ? 2 : -1;
        }
    }
    free(has), free(zero);
    return rc;
}

/* The best plan's cost less the tolerance: a node whose bound reaches it
 * holds no cheaper plan. */
static double bnp_cutoff(const pcg_run *run)
{
    return run->best_cost - 1e-7 * fmax(1.0, fabs(run->best_cost));
}

/* The branching rule for the master LP solution of the node (after
 * convergence): among the paddocks whose weight is spread over several
 * columns, the mob-week whose use is most fractional; else the days of a
 * mob-week on which those columns differ; else a mowing week.  Fills
 * (*p, *i, *v): children days <= v and >= v + 1 (i >= 0), or not mowed and
 * mowed (i < 0).  Returns 0, or 1 when every paddock has one column. */
static int bnp_branch(const pcg_run *run, const double *lam, int *bp, int *bi, int *bv)
{
    int MT = run->MT, T = run->T, found = 0;
    double best = 0;
    double *wsum = calloc((size_t)T + 1, sizeof *wsum);
    int *nsup = calloc((size_t)run->P + 1, sizeof *nsup);
    if (!wsum || !nsup) {
        free(wsum), free(nsup);
        return 1;
    }
    for (int k = 0; k < run->pool.n; k++)
        nsup[run->pool.pad[k]] += lam[k] > 1e-9;
    for (int pass = 0; pass < 3 && !found; pass++)
        for (int p = 0; p < run->P; p++) {
            if (nsup[p] < 2)
                continue;
            /* pass 0: use; pass 1: days (a threshold v between the columns'
             * least and largest); pass 2: mowing */
            for (int i = 0; i < MT; i++) {
                int lo = 127, hi = -1;
                double y = 0;
                for (int k = 0; k < run->pool.n; k++) {
                    if (run->pool.pad[k] != p || lam[k] <= 1e-9)
                        continue;
                    int d = run->pool.days[(size_t)k * MT + i];
                    y += d > 0 ? lam[k] : 0.0;
                    lo = d < lo ? d : lo;
                    hi = d > hi ? d : hi;
                }
                double sc = 0;
                int v = 0;
                if (pass == 0)
                    sc = fmin(y, 1 - y);
                else if (pass == 1 && lo < hi) {
                    double below = 0;
                    for (int k = 0; k < run->pool.n; k++)
                        if (run->pool.pad[k] == p && lam[k] > 1e-9 && run->pool.days[(size_t)k * MT + i] <= lo)
                            below += lam[k];
                    sc = fmin(below, 1 - below) + 1e-6, v = lo;
                }
                if (sc > best + 1e-9) {
                    best = sc, *bp = p, *bi = i, *bv = v, found = 1;
                }
            }
            if (pass == 2) {
                memset(wsum, 0, (size_t)T * sizeof *wsum);
                for (int k = 0; k < run->pool.n; k++)
                    if (run->pool.pad[k] == p && lam[k] > 1e-9)
                        for (int t = 0; t < T; t++)
                            wsum[t] += run->pool.mow[(size_t)k * T + t] ? lam[k] : 0.0;
                for (int t = 0; t < T; t++) {
                    double sc = fmin(wsum[t], 1 - wsum[t]);
                    if (sc > best + 1e-9)
                        best = sc, *bp = p, *bi = -1 - t, *bv = 0, found = 1;
                }
            }
        }
    free(wsum), free(nsup);
    return !found;
}


/* The restricted master's LP optimum with paddock p's columns outside
 * days[i] in [lo, hi] fixed at 0 (a score for branching, never a bound:
 * no pricing), from the parent's basis; bounds and basis restored. */
static double bnp_probe(pcg_run *run, int p, int i, int lo, int hi, const int *rstat, const int *cstat)
{
    int n = 0, nc = glp_get_num_cols(run->lp), nr = glp_get_num_rows(run->lp);
    int *fx = malloc(((size_t)run->pool.n + 1) * sizeof *fx);
    if (!fx)
        return (double)NAN;
    for (int k = 0; k < run->pool.n; k++) {
        int d = run->pool.days[(size_t)k * run->MT + i];
        if (run->pool.pad[k] == p && (d < lo || d > hi) && glp_get_col_type(run->lp, run->c_lam + k) == GLP_LO) {
            glp_set_col_bnds(run->lp, run->c_lam + k, GLP_FX, 0, 0);
            fx[n++] = k;
        }
    }
    glp_smcp sp;
    glp_init_smcp(&sp);
    sp.msg_lev = GLP_MSG_OFF;
    sp.meth = GLP_DUALP;
    sp.it_lim = 500;
    double z = (double)NAN;
    if (glp_simplex(run->lp, &sp) == 0 && glp_get_status(run->lp) == GLP_OPT)
        z = glp_get_obj_val(run->lp);
    for (int j = 0; j < n; j++)
        glp_set_col_bnds(run->lp, run->c_lam + fx[j], GLP_LO, 0, 0);
    for (int r = 1; r <= nr; r++)
        glp_set_row_stat(run->lp, r, rstat[r]);
    for (int j = 1; j <= nc; j++)
        glp_set_col_stat(run->lp, j, cstat[j]);
    free(fx);
    return z;
}

/* Strong branching on use (docs/decomposition.md, "Branch and price"):
 * the SB_CANDIDATES most fractional mob-week uses y of paddocks whose
 * weight is spread are each probed on both sides (bnp_probe); the one
 * whose rises multiply to most is chosen (the product rule).  Returns 1
 * with (*bp, *bi) set, or 0 when no use is fractional. */
static int bnp_strong(pcg_run *run, const double *lam, int *bp, int *bi)
{
    int MT = run->MT, nc = glp_get_num_cols(run->lp), nr = glp_get_num_rows(run->lp), nk = 0;
    size_t n = (size_t)run->P * (size_t)MT;
    double *y = calloc(n + 1, sizeof *y);
    int *cand = malloc((n + 1) * sizeof *cand);
    int *rstat = malloc(((size_t)nr + 1) * sizeof *rstat), *cstat = malloc(((size_t)nc + 1) * sizeof *cstat);
    if (!y || !cand || !rstat || !cstat) {
        free(y), free(cand), free(rstat), free(cstat);
        return 0;
    }
    for (int k = 0; k < run->pool.n; k++)
        if (lam[k] > 1e-9)
            for (int i = 0; i < MT; i++)
                if (run->pool.days[(size_t)k * MT + i] > 0)
                    y[(size_t)run->pool.pad[k] * MT + i] += lam[k];
    for (size_t j = 0; j < n; j++)
        if (fmin(y[j], 1 - y[j]) > 1e-6)
            cand[nk++] = (int)j;
    /* the most fractional first (a stable insertion sort: deterministic) */
    for (int a = 1; a < nk; a++) {
        int c = cand[a], b = a;
        double fc = fmin(y[c], 1 - y[c]);
        while (b > 0 && fmin(y[cand[b - 1]], 1 - y[cand[b - 1]]) < fc)
            cand[b] = cand[b - 1], b--;
        cand[b] = c;
    }
    if (nk > 0)
        *bp = cand[0] / MT, *bi = cand[0] % MT;
    for (int r = 1; r <= nr && nk > 1; r++)
        rstat[r] = glp_get_row_stat(run->lp, r);
    for (int j = 1; j <= nc && nk > 1; j++)
        cstat[j] = glp_get_col_stat(run->lp, j);
    double z0 = glp_get_obj_val(run->lp), best = -1, eps = 1e-6 * fmax(1.0, fabs(z0));
    for (int c = 0; c < nk && c < SB_CANDIDATES && nk > 1; c++) {
        int p = cand[c] / MT, i = cand[c] % MT;
        double lo = bnp_probe(run, p, i, 0, 0, rstat, cstat);
        double hi = bnp_probe(run, p, i, 1, 7, rstat, cstat);
        double sc = fmax(isnan(lo) ? eps : lo - z0, eps) * fmax(isnan(hi) ? eps : hi - z0, eps);
        if (sc > best)
            best = sc, *bp = p, *bi = i;
    }
    free(y), free(cand), free(rstat), free(cstat);
    return nk > 0;
}

/* A mob-week of the plan of columns choice[] that breaks a part-week row
 * (docs/planner.md, part[m,p,t]): mob i / T uses the part-week paddock p
 * and another paddock in week i % T.  Returns 1 with (*bp, *bi), else 0. */
static int bnp_part_week(const pcg_run *run, const int *choice, int *bp, int *bi)
{
    for (int i = 0; i < run->MT; i++) {
        int used = 0, part = -1, t = i % run->T;
        for (int p = 0; p < run->P; p++)
            if (run->pool.days[(size_t)choice[p] * run->MT + i] > 0) {
                used++;
                if (part < 0 && plan_part_week(run->pb, p, t))
                    part = p;
            }
        if (used > 1 && part >= 0) {
            *bp = part, *bi = i;
            return 1;
        }
    }
    return 0;
}

/* The mob whose moves in the node's master LP solution lam are the most
 * fractional (at least 0.05 from a whole number), with *floor_out their
 * whole part; -1 when every mob's moves are whole (or out of memory: the
 * paddock rules then decide). */
static int bnp_moves(const pcg_run *run, const double *lam, int *floor_out)
{
    int best = -1;
    double score = 0.05;
    double *e = calloc((size_t)run->M + 1, sizeof *e);
    if (!e)
        return -1;
    for (int k = 0; k < run->pool.n; k++) {
        if (lam[k] <= 1e-9)
            continue;
        for (int i = 0; i < run->MT; i++)
            run->tdays[i] = run->pool.days[(size_t)k * run->MT + i];
        for (int m = 0; m < run->M; m++)
            e[m] += lam[k] * moves_of(run->T, run->tdays, m);
    }
    for (int m = 0; m < run->M; m++) {
        double f = e[m] - floor(e[m]), sc = fmin(f, 1.0 - f);
        if (sc > score)
            score = sc, best = m, *floor_out = (int)floor(e[m]);
    }
    free(e);
    return best;
}

/* After convergence at node v: a plan when every paddock has one column
 * (and no artificial column is used), else two children.  Returns 0, or
 * -1 when out of memory. */
static int bnp_settle(pcg_run *run, int v)
{
    double *lam = malloc(((size_t)run->pool.n + 1) * sizeof *lam);
    int *choice = malloc(((size_t)run->P + 1) * sizeof *choice);
    if (!lam || !choice) {
        free(lam), free(choice);
        return -1;
    }
    double art = 0;
    for (int j = 0; j < run->n_art; j++)
        art += glp_get_col_prim(run->lp, run->c_art + j);
    for (int k = 0; k < run->pool.n; k++) {
        lam[k] = glp_get_col_prim(run->lp, run->c_lam + k);
        if (lam[k] > 0.5)
            choice[run->pool.pad[k]] = k;
    }
    int p = 0, i = 0, d = 0, rc = 0;
    double bound = run->nodes[v].bound;
    run->nodes[v].open = 0;
    /* first a mob whose moves are fractional: every plan moves a whole
     * number of times, and no paddock's twin can take the fraction */
    int mb = bnp_moves(run, lam, &d);
    if (mb >= 0) {
        int a = bnp_add(run, v, BNP_MOVES, mb, 0, d, bound), b = bnp_add(run, v, BNP_MOVES, mb, d + 1, INT_MAX, bound);
        if (a < 0 || b < 0)
            rc = -1, run->nodes[v].open = 1;
    } else if (!bnp_strong(run, lam, &p, &i) && bnp_branch(run, lam, &p, &i, &d) != 0) {
        /* integral: the plan of its columns (its cost is the LP's); a plan
         * the verifier refuses (part-week or limit rows, outside pricing)
         * leaves the node unresolved, its bound kept in the floor */
        if (art <= 1e-6)
            offer_choice(run, choice);
        if (art > 1e-6 || run->best_cost > bound + 1e-6 * fmax(1.0, fabs(bound))) {
            if (art <= 1e-6 && bnp_part_week(run, choice, &p, &i)) {
                /* a part-week paddock beside another one: either the mob
                 * does not use it, or uses it alone that week */
                int a = bnp_add(run, v, p, i, 0, 0, bound), b = bnp_add(run, v, p, i, 1, 7, bound);
                if (a < 0 || b < 0)
                    rc = -1, run->nodes[v].open = 1;
                else
                    run->nodes[b].alone = 1;
            } else
                run->tree_floor = fmin(run->tree_floor, bound);
        }
    } else {
        double y = 0;
        for (int k = 0; k < run->pool.n; k++)
            if (run->pool.pad[k] == p && lam[k] > 1e-9)
                y += i >= 0 ? (run->pool.days[(size_t)k * run->MT + i] > d ? lam[k] : 0.0)
                            : (run->pool.mow[(size_t)k * run->T - 1 - i] ? lam[k] : 0.0);
        /* the child on the side with more weight is made last: it is
         * solved first among equal bounds (a dive) */
        int up_last = y >= 0.5, a, b;
        if (i >= 0) {
            a = bnp_add(run, v, p, i, up_last ? 0 : d + 1, up_last ? d : 7, bound);
            b = bnp_add(run, v, p, i, up_last ? d + 1 : 0, up_last ? 7 : d, bound);
        } else {
            a = bnp_add(run, v, p, i, !up_last, 0, bound);
            b = bnp_add(run, v, p, i, up_last, 0, bound);
        }
        rc = a < 0 || b < 0 ? -1 : 0;
        if (rc < 0)
            run->nodes[v].open = 1; /* stays in the bound */
    }
    free(lam), free(choice);
    return rc;
}

/* Solves node v: its master, column generation inside its box until
 * convergence or `end`, then bnp_settle.  Returns 0 (the node is closed:
 * pruned, a plan, or branched), 1 when the time ran out (it stays open
 * with the bound reached), -1 on failure (it stays open). */
static int bnp_solve(pcg_run *run, int v, double end)
{
    bnp_box(run, v);
    int rc = bnp_master(run);
    if (rc == 1) { /* a box with no trajectory: no plan in the node */
        run->nodes[v].open = 0;
        return 0;
    }
    if (rc != 0)
        return -1;
    run->node_lb = -HUGE_VAL;
    for (;;) {
        if (now_s() >= end)
            return 1;
        int added = cg_iteration(run, end);
        if (added < 0)
            return -1;
        run->nodes[v].bound = fmax(run->nodes[v].bound, run->node_lb);
        if (run->nodes[v].bound >= bnp_cutoff(run)) {
            run->nodes[v].open = 0; /* no cheaper plan inside */
            return 0;
        }
        if (added == 0)
            break;
        progress(run, "branch and price");
    }
    return bnp_settle(run, v);
}

/* The tree's bound: the least over its open nodes, the nodes left
 * unresolved and the best plan; run->best_lb is raised to it. */
static void bnp_bound(pcg_run *run)
{
    double lb = fmin(run->tree_floor, run->best_cost);
    for (int v = 0; v < run->n_nodes; v++)
        if (run->nodes[v].open)
            lb = fmin(lb, run->nodes[v].bound);
    if (lb > run->best_lb)
        run->best_lb = lb;
}

/* The open node to solve next: least bound, then deepest, then newest. */
static int bnp_pick(const pcg_run *run)
{
    int best = -1;
    for (int v = 0; v < run->n_nodes; v++) {
        const bnp_node *n = &run->nodes[v];
        if (!n->open)
            continue;
        if (best < 0 || n->bound < run->nodes[best].bound - 1e-9 * fmax(1.0, fabs(n->bound)))
            best = v;
        else if (n->bound <= run->nodes[best].bound + 1e-9 * fmax(1.0, fabs(n->bound)) &&
                 n->depth >= run->nodes[best].depth)
            best = v;
    }
    return best;
}

/* Branch and price (docs/decomposition.md) until `end` or the gap closes.
 * The master is restored for the phases that follow. */
static void bnp_tree(pcg_run *run, double end)
{
    size_t P = (size_t)run->P;
    run->box_lo = malloc(P * (size_t)run->MT + 1);
    run->box_hi = malloc(P * (size_t)run->MT + 1);
    run->box_mow = malloc(P * (size_t)run->T + 1);
    run->boxed = malloc(P + 1);
    if (!run->box_lo || !run->box_hi || !run->box_mow || !run->boxed)
        return;
    double big = 10.0 * fabs(run->seed_cost) + 1000.0; /* an integral master that uses one
                                                             costs more than the seed plan */
    for (int j = 0; j < run->n_art; j++) {
        glp_set_col_bnds(run->lp, run->c_art + j, GLP_LO, 0, 0);
        glp_set_obj_coef(run->lp, run->c_art + j, big);
    }
    run->in_tree = 1;
    run->tree_floor = HUGE_VAL;
    bnp_add(run, -1, -1, 0, 0, 0, run->best_lb);
    while (now_s() < end && !gap_closed(run)) {
        int v = bnp_pick(run);
        if (v < 0)
            break;
        if (run->nodes[v].bound >= bnp_cutoff(run)) {
            run->nodes[v].open = 0;
            continue;
        }
        int rc = bnp_solve(run, v, end);
        if (rc != 0)
            break;
        run->nodes_done++;
        bnp_bound(run);
        progress(run, "branch and price");
    }
    bnp_bound(run);
    run->in_tree = 0;
    for (int m = 0; m < run->M; m++)
        glp_set_row_bnds(run->lp, run->r_ent + m, GLP_FR, 0, 0);
    for (int j = 0; j < run->n_art; j++)
        glp_set_col_bnds(run->lp, run->c_art + j, GLP_FX, 0, 0);
    for (int k = 0; k < run->pool.n; k++)
        glp_set_col_bnds(run->lp, run->c_lam + k, GLP_LO, 0, 0);
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
    if (!gap_closed(run))
        bnp_tree(run, lim > 0 ? run->t0 + TREE_SHARE * lim : HUGE_VAL);
    if (lim > 0) /* at least LNS_SHARE - TREE_SHARE of the limit */
        neighbourhoods(run, fmax(run->t0 + LNS_SHARE * lim, now_s() + (LNS_SHARE - TREE_SHARE) * lim));
    if (!gap_closed(run))
        master_mip(run, lim > 0 ? run->t0 + MIP_SHARE * lim : HUGE_VAL);
    if (run->printed)
        fputc('\n', stderr), run->printed = 0;
    run->res->rows = glp_get_num_rows(run->lp);
    run->res->cols = glp_get_num_cols(run->lp);
    run->res->binaries = run->pool.n;
    run->res->nodes = run->nodes_done;
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
    free(run->step);
    free(run->tdays);
    free(run->tmow);
    free(run->box_lo);
    free(run->box_hi);
    free(run->box_mow);
    free(run->boxed);
    free(run->nodes);
    free(run->ent_lo);
    free(run->ent_hi);
    free(run->ent_dual);
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
    run->step = calloc(8 * mt, sizeof *run->step);
    run->tdays = calloc(mt, sizeof *run->tdays);
    run->tmow = calloc((size_t)run->T, 1);
    run->ent_lo = calloc((size_t)run->M + 1, sizeof *run->ent_lo);
    run->ent_hi = calloc((size_t)run->M + 1, sizeof *run->ent_hi);
    run->ent_dual = calloc((size_t)run->M + 1, sizeof *run->ent_dual);
    if (!run->pricer || !run->seed || !run->fixed || !run->choice || !run->idle || !run->day || !run->use || !run->step ||
        !run->tdays || !run->tmow || !run->ent_lo || !run->ent_hi || !run->ent_dual ||
        plan_alloc(pb, &run->best) != 0) {
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
