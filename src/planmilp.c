/* planmilp.c - docs/planner.md as a GLPK mixed-integer program (see
 * planmilp.h).  With plancg.c (the decomposition) the only files in
 * rowgraze that include glpk.h; pm_solve hands PM_DECOMP to pcg_solve
 * and PM_ROLLING to prl_solve (planroll.c).
 *
 * Layout, top to bottom:
 *   the model: columns, then the rows family by family in the page's order,
 *     one static function per family, named after its rows;
 *   the warm start: the verifier's recursion (docs/planner.md, "The
 *     verifier's simulation") turning a plan into a value for every column,
 *     and a check of those values against every column bound and row (GLPK's
 *     glp_ios_heur_sol does not check feasibility, so we do);
 *   the strategy: solve_direct (LP relaxation by glp_simplex for the optimal
 *     basis and the root bound, then glp_intopt with presolve off, the warm
 *     plan handed over at the first GLP_IHEUR call, the best bound of the
 *     tree read in the same callback);
 *   the improvement phase: solve_improve and solve_windows, fix-and-optimize
 *     over windows of weeks (docs/planner.md, "Solving"), each window a
 *     restricted model in the same glp_prob (columns outside it fixed at the
 *     incumbent, bounds restored afterwards), each answer verified;
 *   the guard: glp_error_hook jumps back to guarded(), which frees GLPK's
 *     environment (glp_free_env: every GLPK object of this thread) and
 *     reports PM_ERROR, so misuse never aborts the process.
 * Masses in tonnes: the matrix coefficients then span about 1e2.
 */
#include "planmilp.h"

#include "planbase.h"
#include "plancg.h"
#include "planroll.h"

#include <glpk.h>
#include <limits.h>
#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include <unistd.h>

#define NAME_LEN 256      /* GLPK names are at most 255 characters */
#define FEAS_TOL 1e-6     /* the verifier's tolerance, t DM/ha or t DM */
#define MAX_CELLS 2000000 /* mobs x paddocks x weeks, at most */

/* First column (1-based) of each variable family; n columns in all. */
typedef struct pm_cols {
    int d, y, e, g, w, r, x, sup, u, n;
} pm_cols;

/* The model being built or solved. */
typedef struct pm_model {
    const plan_problem *pb;
    glp_prob *lp;
    pm_cols c;
    int D;                    /* min(7, max_days_per_visit) */
    double *U;                /* [p] upper bound on any cover, t DM/ha */
    double *F;                /* [p * (n_weeks + 1) + t] cover floor, t DM/ha
                                 (docs/planner.md, "Valid strengthening") */
    char (*pid)[PLAN_ID_LEN]; /* paddock ids as written in names */
    char (*mid)[PLAN_ID_LEN]; /* mob ids as written in names */
    int *ind;                 /* one row's entries, 1-based */
    double *val;
    int n_ent, cap;
    int lim_sup_row;          /* row number of lim_sup, 0 when none */
    char name[NAME_LEN];
} pm_model;

/* One call of pm_solve or pm_export: lives in the caller's frame, so what
 * changes after setjmp survives the jump back. */
typedef struct pm_run {
    jmp_buf jb;
    pm_model mm;
    const pm_options *opt;
    plan *out;
    pm_result *res;
    double t0;
    double *warm_x;    /* [1 + n]: the warm plan's columns, or NULL */
    const char *stage; /* what GLPK was doing, for the error message */
    char glpk_text[160]; /* GLPK's own error line, kept off the terminal */
    const char *path;  /* pm_export */
    int mps;
} pm_run;

typedef int (*pm_strategy)(pm_run *run);

/* ---------------------------------------------------------------- util */

static double now_s(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_MONOTONIC, &ts);
    return (double)ts.tv_sec + (double)ts.tv_nsec * 1e-9;
}

static int fail(char *msg, size_t cap, const char *fmt, ...) __attribute__((format(printf, 3, 4)));

static int fail(char *msg, size_t cap, const char *fmt, ...)
{
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(msg, cap, fmt, ap);
    va_end(ap);
    return -1;
}

static int fin(double v)
{
    return isfinite(v);
}

/* ------------------------------------------------------------ checking */

static int check_paddock(const plan_paddock *pd, int p, char *msg, size_t cap)
{
    if (!(fin(pd->area_ha) && pd->area_ha > 0))
        return fail(msg, cap, "paddock %d: area must be positive", p);
    if (!(fin(pd->cover0_t_ha) && fin(pd->residual_t_ha) && fin(pd->ceiling_t_ha) &&
          fin(pd->senescence_per_day)))
        return fail(msg, cap, "paddock %s: cover or senescence not a number", pd->id);
    return 0;
}

static int check_ids(const plan_problem *pb, char *msg, size_t cap)
{
    for (int i = 0; i < pb->n_paddocks; i++)
        for (int j = 0; j < i; j++)
            if (strcmp(pb->pd[i].id, pb->pd[j].id) == 0)
                return fail(msg, cap, "paddock id %s appears twice", pb->pd[i].id);
    for (int i = 0; i < pb->n_mobs; i++)
        for (int j = 0; j < i; j++)
            if (strcmp(pb->mob[i].id, pb->mob[j].id) == 0)
                return fail(msg, cap, "mob id %s appears twice", pb->mob[i].id);
    return 0;
}

static int check_weeks(const plan_problem *pb, char *msg, size_t cap)
{
    for (int i = 0; i < pb->n_paddocks * pb->n_weeks; i++) {
        if (!fin(pb->growth_t_ha_d[i]))
            return fail(msg, cap, "growth not a number (paddock %d, week %d)",
                        i / pb->n_weeks, i % pb->n_weeks);
        if (pb->open_days[i] < 0 || pb->open_days[i] > 7)
            return fail(msg, cap, "open days %d outside 0..7", pb->open_days[i]);
    }
    return 0;
}

static int check_rules(const plan_problem *pb, char *msg, size_t cap)
{
    if (pb->rest_weeks < 0 || pb->spell_weeks < 0 || pb->max_days_per_visit < 0 ||
        pb->max_paddocks_per_week < 0)
        return fail(msg, cap, "rest, spell, visit days and paddocks per week must be >= 0");
    if (!(fin(pb->max_head_per_ha) && fin(pb->terminal_t_ha) && fin(pb->cost_supplement_per_t) &&
          fin(pb->cost_mowing_per_ha) && fin(pb->cost_per_move) && fin(pb->penalty_terminal_per_t)))
        return fail(msg, cap, "a rule or cost is not a number");
    if ((pb->limit_supplement && !(fin(pb->max_supplement_t) && pb->max_supplement_t >= 0)) ||
        (pb->limit_mowing && !(fin(pb->max_mowed_ha) && pb->max_mowed_ha >= 0)) ||
        (pb->limit_shortfall && !(fin(pb->max_shortfall_t) && pb->max_shortfall_t >= 0)))
        return fail(msg, cap, "a limit must be a number >= 0");
    return 0;
}

/* 0 when pb can be built; else -1 and why. */
static int check_problem(const plan_problem *pb, char *msg, size_t cap)
{
    if (pb->n_paddocks < 1 || pb->n_mobs < 0 || pb->n_weeks < 1 || pb->n_weeks > PLAN_MAX_WEEKS)
        return fail(msg, cap, "plan needs 1+ paddocks and 1..%d weeks", PLAN_MAX_WEEKS);
    if ((double)pb->n_paddocks * (pb->n_mobs + 1) * pb->n_weeks > MAX_CELLS)
        return fail(msg, cap, "plan too large: %d paddocks x %d mobs x %d weeks", pb->n_paddocks,
                    pb->n_mobs, pb->n_weeks);
    if (!pb->pd || !pb->growth_t_ha_d || !pb->open_days || (pb->n_mobs > 0 && !pb->mob))
        return fail(msg, cap, "plan problem not filled in");
    for (int p = 0; p < pb->n_paddocks; p++)
        if (check_paddock(&pb->pd[p], p, msg, cap))
            return -1;
    for (int m = 0; m < pb->n_mobs; m++)
        if (!(fin(pb->mob[m].demand_t_d) && pb->mob[m].demand_t_d >= 0 && pb->mob[m].head >= 0))
            return fail(msg, cap, "mob %s: demand and head must be >= 0", pb->mob[m].id);
    if (check_ids(pb, msg, cap) || check_weeks(pb, msg, cap))
        return -1;
    return check_rules(pb, msg, cap);
}

/* 0 when pl is shaped for pb (and, with days_too, its days are 0..7). */
static int check_plan(const plan_problem *pb, const plan *pl, int days_too, const char *what,
                      char *msg, size_t cap)
{
    if (pl->n_paddocks != pb->n_paddocks || pl->n_mobs != pb->n_mobs ||
        pl->n_weeks != pb->n_weeks || !pl->days || !pl->mow || !pl->supplement_t)
        return fail(msg, cap, "%s plan not allocated for this problem", what);
    int n = pb->n_mobs * pb->n_paddocks * pb->n_weeks;
    for (int i = 0; days_too && i < n; i++)
        if (pl->days[i] < 0 || pl->days[i] > 7)
            return fail(msg, cap, "%s plan: %d grazing days in a week", what, pl->days[i]);
    return 0;
}

/* ------------------------------------------------------------- columns */

static int col_mpt(const pm_model *mm, int base, int m, int p, int t)
{
    return base + (m * mm->pb->n_paddocks + p) * mm->pb->n_weeks + t;
}

static int col_pt(const pm_model *mm, int base, int p, int t)
{
    return base + p * mm->pb->n_weeks + t;
}

static int col_x(const pm_model *mm, int p, int t)
{
    return mm->c.x + p * (mm->pb->n_weeks + 1) + t;
}

static int col_mt(const pm_model *mm, int base, int m, int t)
{
    return base + m * mm->pb->n_weeks + t;
}

static void layout(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    int mpt = pb->n_mobs * pb->n_paddocks * pb->n_weeks, pt = pb->n_paddocks * pb->n_weeks;
    mm->c.d = 1;
    mm->c.y = mm->c.d + mpt;
    mm->c.e = mm->c.y + mpt;
    mm->c.g = mm->c.e + mpt;
    mm->c.w = mm->c.g + pt;
    mm->c.r = mm->c.w + pt;
    mm->c.x = mm->c.r + pt;
    mm->c.sup = mm->c.x + pb->n_paddocks * (pb->n_weeks + 1);
    mm->c.u = mm->c.sup + pb->n_mobs * pb->n_weeks;
    mm->c.n = mm->c.u;
}

/* An id as it may stand in a name: printable, no blank, no [ ] , */
static void clean_id(const char *id, char prefix, int i, char *out)
{
    size_t n = 0;
    for (; id[n] && n + 1 < PLAN_ID_LEN; n++) {
        unsigned char ch = (unsigned char)id[n];
        out[n] = ch > 32 && ch < 127 && !strchr("[],", ch) ? (char)ch : '_';
    }
    out[n] = 0;
    if (n == 0)
        snprintf(out, PLAN_ID_LEN, "%c%d", prefix, i);
}

/* "fam[m,p,t,k]" with the indices that are >= 0 (mob and paddock by id). */
static const char *nm(pm_model *mm, const char *fam, int m, int p, int t, int k)
{
    char *s = mm->name;
    size_t cap = sizeof mm->name, n = (size_t)snprintf(s, cap, "%s[", fam);
    if (m >= 0)
        n += (size_t)snprintf(s + n, cap - n, "%s,", mm->mid[m]);
    if (p >= 0)
        n += (size_t)snprintf(s + n, cap - n, "%s,", mm->pid[p]);
    if (t >= 0)
        n += (size_t)snprintf(s + n, cap - n, "%d,", t);
    if (k >= 0)
        n += (size_t)snprintf(s + n, cap - n, "%d,", k);
    s[n - 1] = ']';
    return s;
}

static void set_col(pm_model *mm, int j, const char *name, int kind, int type, double lb,
                    double ub, double cost)
{
    glp_set_col_name(mm->lp, j, name);
    glp_set_col_kind(mm->lp, j, kind);
    glp_set_col_bnds(mm->lp, j, type, lb, ub);
    glp_set_obj_coef(mm->lp, j, cost);
}

/* 1 when mob m may never be in paddock p in week t (cattle clearance,
 * closed week): y is fixed at 0. */
static int barred(const pm_model *mm, int m, int p, int t)
{
    const plan_problem *pb = mm->pb;
    return (pb->mob[m].is_cattle && pb->pd[p].cattle_barred) ||
           pb->open_days[p * pb->n_weeks + t] == 0;
}

/* Most days mob m may graze paddock p in week t: min(7, O_pt, D). */
static int day_cap(const pm_model *mm, int m, int p, int t)
{
    int o = mm->pb->open_days[p * mm->pb->n_weeks + t];
    return barred(mm, m, p, t) ? 0 : (o < mm->D ? o : mm->D);
}

/* d, y, e: integer days, binary use, moves. */
static void cols_mob_paddock(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    for (int m = 0; m < pb->n_mobs; m++)
        for (int p = 0; p < pb->n_paddocks; p++)
            for (int t = 0; t < pb->n_weeks; t++) {
                int cap = day_cap(mm, m, p, t);
                int jd = col_mpt(mm, mm->c.d, m, p, t);
                set_col(mm, jd, nm(mm, "d", m, p, t, -1), GLP_IV,
                        cap > 0 ? GLP_DB : GLP_FX, 0.0, (double)cap, 0.0);
                int j = col_mpt(mm, mm->c.y, m, p, t);
                set_col(mm, j, nm(mm, "y", m, p, t, -1), GLP_BV, GLP_DB, 0.0, 1.0, 0.0);
                if (barred(mm, m, p, t))
                    glp_set_col_bnds(mm->lp, j, GLP_FX, 0.0, 0.0);
                if (t < pb->fixed_weeks) {
                    /* a kept week (plan.h fixed_days): days and use fixed */
                    int k = pb->fixed_days[((size_t)m * pb->n_paddocks + p) * pb->n_weeks + t];
                    glp_set_col_bnds(mm->lp, jd, GLP_FX, (double)k, (double)k);
                    glp_set_col_bnds(mm->lp, j, GLP_FX, k > 0, k > 0);
                }
                set_col(mm, col_mpt(mm, mm->c.e, m, p, t), nm(mm, "e", m, p, t, -1), GLP_CV,
                        GLP_LO, 0.0, 0.0, pb->cost_per_move);
            }
}

/* g, w, r, x (x[p,0] fixed at the start cover), sup, u. */
static void cols_rest(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    for (int p = 0; p < pb->n_paddocks; p++) {
        for (int t = 0; t < pb->n_weeks; t++) {
            set_col(mm, col_pt(mm, mm->c.g, p, t), nm(mm, "g", -1, p, t, -1), GLP_BV, GLP_DB, 0, 1, 0);
            set_col(mm, col_pt(mm, mm->c.w, p, t), nm(mm, "w", -1, p, t, -1), GLP_BV, GLP_DB, 0, 1,
                    pb->cost_mowing_per_ha * pb->pd[p].area_ha);
            set_col(mm, col_pt(mm, mm->c.r, p, t), nm(mm, "r", -1, p, t, -1), GLP_CV, GLP_LO, 0, 0, 0);
        }
        for (int t = 0; t <= pb->n_weeks; t++) { /* x >= F: the floor, x[p,0] = X0 */
            double f = mm->F[p * (pb->n_weeks + 1) + t];
            set_col(mm, col_x(mm, p, t), nm(mm, "x", -1, p, t, -1), GLP_CV, t ? GLP_LO : GLP_FX,
                    t ? f : pb->pd[p].cover0_t_ha, t ? 0.0 : pb->pd[p].cover0_t_ha, 0.0);
        }
    }
    for (int m = 0; m < pb->n_mobs; m++)
        for (int t = 0; t < pb->n_weeks; t++)
            set_col(mm, col_mt(mm, mm->c.sup, m, t), nm(mm, "sup", m, -1, t, -1), GLP_CV, GLP_LO,
                    0, 0, pb->cost_supplement_per_t);
    set_col(mm, mm->c.u, "u", GLP_CV, GLP_LO, 0.0, 0.0, pb->penalty_terminal_per_t);
}

/* ---------------------------------------------------------------- rows */

static void row_begin(pm_model *mm)
{
    mm->n_ent = 0;
}

static void row_add(pm_model *mm, int col, double v)
{
    if (v == 0.0 || mm->n_ent >= mm->cap)
        return;
    mm->n_ent++;
    mm->ind[mm->n_ent] = col;
    mm->val[mm->n_ent] = v;
}

/* Adds the row begun with row_begin: type GLP_UP (<= ub), GLP_LO (>= lb)
 * or GLP_FX (= lb); the name is mm->name as nm() left it. */
static void row_end(pm_model *mm, int type, double lb, double ub)
{
    int i = glp_add_rows(mm->lp, 1);
    glp_set_row_name(mm->lp, i, mm->name);
    glp_set_row_bnds(mm->lp, i, type, lb, ub);
    glp_set_mat_row(mm->lp, i, mm->n_ent, mm->ind, mm->val);
}

/* bal[p,t]: x_p,t+1 - (1 - 7 s_p) x_pt + sum_m (I_m / A_p) d_mpt + r_pt = 7 G_pt */
static void rows_balance(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    for (int p = 0; p < pb->n_paddocks; p++)
        for (int t = 0; t < pb->n_weeks; t++) {
            const plan_paddock *pd = &pb->pd[p];
            row_begin(mm);
            row_add(mm, col_x(mm, p, t + 1), 1.0);
            row_add(mm, col_x(mm, p, t), -(1.0 - 7.0 * pd->senescence_per_day));
            for (int m = 0; m < pb->n_mobs; m++)
                row_add(mm, col_mpt(mm, mm->c.d, m, p, t), pb->mob[m].demand_t_d / pd->area_ha);
            row_add(mm, col_pt(mm, mm->c.r, p, t), 1.0);
            double rhs = 7.0 * pb->growth_t_ha_d[p * pb->n_weeks + t];
            nm(mm, "bal", -1, p, t, -1);
            row_end(mm, GLP_FX, rhs, rhs);
        }
}

/* res[p,t]: x_p,t+1 - R_p g_pt >= 0 */
static void rows_residual(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    for (int p = 0; p < pb->n_paddocks; p++)
        for (int t = 0; t < pb->n_weeks; t++) {
            row_begin(mm);
            row_add(mm, col_x(mm, p, t + 1), 1.0);
            row_add(mm, col_pt(mm, mm->c.g, p, t), -pb->pd[p].residual_t_ha);
            nm(mm, "res", -1, p, t, -1);
            row_end(mm, GLP_LO, 0.0, 0.0);
        }
}

/* ceil[p,t], mowcap[p,t], mowlo[p,t], mowhi[p,t] */
static void rows_ceiling(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    for (int p = 0; p < pb->n_paddocks; p++)
        for (int t = 0; t < pb->n_weeks; t++) {
            double R = pb->pd[p].residual_t_ha, U = mm->U[p];
            int x1 = col_x(mm, p, t + 1), w = col_pt(mm, mm->c.w, p, t);
            row_begin(mm);
            row_add(mm, x1, 1.0);
            nm(mm, "ceil", -1, p, t, -1);
            row_end(mm, GLP_UP, 0.0, pb->pd[p].ceiling_t_ha);
            row_begin(mm); /* r_pt - U_p w_pt <= 0 */
            row_add(mm, col_pt(mm, mm->c.r, p, t), 1.0);
            row_add(mm, w, -U);
            nm(mm, "mowcap", -1, p, t, -1);
            row_end(mm, GLP_UP, 0.0, 0.0);
            row_begin(mm); /* x_p,t+1 - R_p w_pt >= 0 */
            row_add(mm, x1, 1.0);
            row_add(mm, w, -R);
            nm(mm, "mowlo", -1, p, t, -1);
            row_end(mm, GLP_LO, 0.0, 0.0);
            row_begin(mm); /* x_p,t+1 + U_p w_pt <= R_p + U_p */
            row_add(mm, x1, 1.0);
            row_add(mm, w, U);
            nm(mm, "mowhi", -1, p, t, -1);
            row_end(mm, GLP_UP, 0.0, R + U);
        }
}

/* feed[m,t]: sum_p I_m d_mpt + sup_mt = 7 I_m;  days[m,t]: sum_p d_mpt <= 7 */
static void rows_demand(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    for (int m = 0; m < pb->n_mobs; m++)
        for (int t = 0; t < pb->n_weeks; t++) {
            double I = pb->mob[m].demand_t_d;
            row_begin(mm);
            for (int p = 0; p < pb->n_paddocks; p++)
                row_add(mm, col_mpt(mm, mm->c.d, m, p, t), I);
            row_add(mm, col_mt(mm, mm->c.sup, m, t), 1.0);
            nm(mm, "feed", m, -1, t, -1);
            row_end(mm, GLP_FX, 7.0 * I, 7.0 * I);
            row_begin(mm);
            for (int p = 0; p < pb->n_paddocks; p++)
                row_add(mm, col_mpt(mm, mm->c.d, m, p, t), 1.0);
            nm(mm, "days", m, -1, t, -1);
            row_end(mm, GLP_UP, 0.0, 7.0);
        }
}

/* use[m,p,t]: d - min(O_pt, D) y <= 0;  grz[m,p,t]: y - g <= 0 (the page's
 * y_mpt <= g_pt);  pres[m,p,t]: y - d <= 0 (our addition, planmilp.h). */
static void rows_link_mob(pm_model *mm, int m, int p, int t)
{
    const plan_problem *pb = mm->pb;
    int d = col_mpt(mm, mm->c.d, m, p, t), y = col_mpt(mm, mm->c.y, m, p, t);
    int o = pb->open_days[p * pb->n_weeks + t];
    row_begin(mm);
    row_add(mm, d, 1.0);
    row_add(mm, y, -(double)(o < mm->D ? o : mm->D));
    nm(mm, "use", m, p, t, -1);
    row_end(mm, GLP_UP, 0.0, 0.0);
    row_begin(mm);
    row_add(mm, y, 1.0);
    row_add(mm, col_pt(mm, mm->c.g, p, t), -1.0);
    nm(mm, "grz", m, p, t, -1);
    row_end(mm, GLP_UP, 0.0, 0.0);
    row_begin(mm);
    row_add(mm, y, 1.0);
    row_add(mm, d, -1.0);
    nm(mm, "pres", m, p, t, -1);
    row_end(mm, GLP_UP, 0.0, 0.0);
}

/* The linking rows: per mob (above), then grz[p,t]: g - sum_m y <= 0. */
static void rows_linking(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    for (int p = 0; p < pb->n_paddocks; p++)
        for (int t = 0; t < pb->n_weeks; t++) {
            for (int m = 0; m < pb->n_mobs; m++)
                rows_link_mob(mm, m, p, t);
            row_begin(mm);
            row_add(mm, col_pt(mm, mm->c.g, p, t), 1.0);
            for (int m = 0; m < pb->n_mobs; m++)
                row_add(mm, col_mpt(mm, mm->c.y, m, p, t), -1.0);
            nm(mm, "grz", -1, p, t, -1);
            row_end(mm, GLP_UP, 0.0, 0.0);
        }
}

/* one[p,t] (unless sharing): sum_m y <= 1;  dens[p,t] (rho > 0):
 * sum_m H_m y <= rho A_p */
static void rows_paddock_mobs(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    for (int p = 0; p < pb->n_paddocks; p++)
        for (int t = 0; t < pb->n_weeks; t++) {
            if (!pb->share_paddocks) {
                row_begin(mm);
                for (int m = 0; m < pb->n_mobs; m++)
                    row_add(mm, col_mpt(mm, mm->c.y, m, p, t), 1.0);
                nm(mm, "one", -1, p, t, -1);
                row_end(mm, GLP_UP, 0.0, 1.0);
            }
            if (pb->max_head_per_ha > 0) {
                row_begin(mm);
                for (int m = 0; m < pb->n_mobs; m++)
                    row_add(mm, col_mpt(mm, mm->c.y, m, p, t), (double)pb->mob[m].head);
                nm(mm, "dens", -1, p, t, -1);
                row_end(mm, GLP_UP, 0.0, pb->max_head_per_ha * pb->pd[p].area_ha);
            }
        }
}

/* kmax[m,t]: sum_p y <= K */
static void rows_kmax(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    for (int m = 0; m < pb->n_mobs; m++)
        for (int t = 0; t < pb->n_weeks; t++) {
            row_begin(mm);
            for (int p = 0; p < pb->n_paddocks; p++)
                row_add(mm, col_mpt(mm, mm->c.y, m, p, t), 1.0);
            nm(mm, "kmax", m, -1, t, -1);
            row_end(mm, GLP_UP, 0.0, (double)pb->max_paddocks_per_week);
        }
}

/* spell[p,t]: g_pt + ... + g_p,t+S <= S (windows inside the horizon);
 * visit[p,t]: sum_m d <= D */
static void rows_spell(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    int S = pb->spell_weeks;
    for (int p = 0; p < pb->n_paddocks; p++)
        for (int t = 0; t < pb->n_weeks; t++) {
            if (t + S <= pb->n_weeks - 1) {
                row_begin(mm);
                for (int j = 0; j <= S; j++)
                    row_add(mm, col_pt(mm, mm->c.g, p, t + j), 1.0);
                nm(mm, "spell", -1, p, t, -1);
                row_end(mm, GLP_UP, 0.0, (double)S);
            }
            row_begin(mm);
            for (int m = 0; m < pb->n_mobs; m++)
                row_add(mm, col_mpt(mm, mm->c.d, m, p, t), 1.0);
            nm(mm, "visit", -1, p, t, -1);
            row_end(mm, GLP_UP, 0.0, (double)mm->D);
        }
}

/* rest[p,t,k]: g_pt - g_p,t+1 + g_p,t+k <= 1, k = 2..L, t + k inside */
static void rows_rest(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    for (int p = 0; p < pb->n_paddocks; p++)
        for (int t = 0; t < pb->n_weeks; t++)
            for (int k = 2; k <= pb->rest_weeks && t + k <= pb->n_weeks - 1; k++) {
                row_begin(mm);
                row_add(mm, col_pt(mm, mm->c.g, p, t), 1.0);
                row_add(mm, col_pt(mm, mm->c.g, p, t + 1), -1.0);
                row_add(mm, col_pt(mm, mm->c.g, p, t + k), 1.0);
                nm(mm, "rest", -1, p, t, k);
                row_end(mm, GLP_UP, 0.0, 1.0);
            }
}

/* move[m,p,t]: e_mpt - y_mpt + y_mp,t-1 >= 0 (y_mp,-1 = 0) */
static void rows_moves(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    for (int m = 0; m < pb->n_mobs; m++)
        for (int p = 0; p < pb->n_paddocks; p++)
            for (int t = 0; t < pb->n_weeks; t++) {
                row_begin(mm);
                row_add(mm, col_mpt(mm, mm->c.e, m, p, t), 1.0);
                row_add(mm, col_mpt(mm, mm->c.y, m, p, t), -1.0);
                /* with spells of one week (S = 1) a paddock grazed in week t
                 * was not grazed in t - 1 (row spell), so every use is an
                 * entry: e >= y, tighter for the LP relaxation
                 * (docs/planner.md, "Valid strengthening") */
                if (t > 0 && pb->spell_weeks > 1)
                    row_add(mm, col_mpt(mm, mm->c.y, m, p, t - 1), 1.0);
                nm(mm, "move", m, p, t, -1);
                row_end(mm, GLP_LO, 0.0, 0.0);
            }
}

/* end: sum_p A_p x_pT + u >= X_T sum_p A_p */
static void row_terminal(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    double area = 0;
    row_begin(mm);
    for (int p = 0; p < pb->n_paddocks; p++) {
        row_add(mm, col_x(mm, p, pb->n_weeks), pb->pd[p].area_ha);
        area += pb->pd[p].area_ha;
    }
    row_add(mm, mm->c.u, 1.0);
    snprintf(mm->name, sizeof mm->name, "end");
    row_end(mm, GLP_LO, pb->terminal_t_ha * area, 0.0);
}

/* The optional limits (docs/planner.md, "Limits"):
 * lim_sup: sum_mt sup_mt <= S_max;  lim_mow: sum_pt A_p w_pt <= M_max;
 * lim_end: u <= U_max.
 * Added after every other row, so the rows before keep their numbers. */
static void rows_limits(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    int W = pb->spell_weeks + pb->rest_weeks;
    /* restwin[p,t]: g_pt + ... + g_p,t+W-1 <= S, W = S + L, the window inside
     * the horizon (valid for every plan; docs/planner.md, "Limits") */
    if ((pb->limit_supplement || pb->limit_mowing || pb->limit_shortfall) && pb->rest_weeks > 0 && pb->spell_weeks > 0)
        for (int p = 0; p < pb->n_paddocks; p++)
            for (int t = 0; t + W <= pb->n_weeks; t++) {
                row_begin(mm);
                for (int k = 0; k < W; k++)
                    row_add(mm, col_pt(mm, mm->c.g, p, t + k), 1.0);
                nm(mm, "restwin", -1, p, t, -1);
                row_end(mm, GLP_UP, 0.0, pb->spell_weeks);
            }
    if (pb->limit_supplement) {
        row_begin(mm);
        for (int m = 0; m < pb->n_mobs; m++)
            for (int t = 0; t < pb->n_weeks; t++)
                row_add(mm, col_mt(mm, mm->c.sup, m, t), 1.0);
        snprintf(mm->name, sizeof mm->name, "lim_sup");
        row_end(mm, GLP_UP, 0.0, pb->max_supplement_t);
        mm->lim_sup_row = glp_get_num_rows(mm->lp);
    }
    if (pb->limit_mowing) {
        row_begin(mm);
        for (int p = 0; p < pb->n_paddocks; p++)
            for (int t = 0; t < pb->n_weeks; t++)
                row_add(mm, col_pt(mm, mm->c.w, p, t), pb->pd[p].area_ha);
        snprintf(mm->name, sizeof mm->name, "lim_mow");
        row_end(mm, GLP_UP, 0.0, pb->max_mowed_ha);
    }
    if (pb->limit_shortfall) {
        row_begin(mm);
        row_add(mm, mm->c.u, 1.0);
        snprintf(mm->name, sizeof mm->name, "lim_end");
        row_end(mm, GLP_UP, 0.0, pb->max_shortfall_t);
    }
}

/* U_p = max(X0_p, C_p) + 7 max_t G_pt (docs/planner.md, Ceiling). */
static void cover_bounds(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    for (int p = 0; p < pb->n_paddocks; p++) {
        double g = 0;
        for (int t = 0; t < pb->n_weeks; t++)
            g = fmax(g, pb->growth_t_ha_d[p * pb->n_weeks + t]);
        mm->U[p] = fmax(pb->pd[p].cover0_t_ha, pb->pd[p].ceiling_t_ha) + 7.0 * g;
    }
}

/* The cover floor F_pt (docs/planner.md, "Valid strengthening"):
 * F_p0 = X0_p, F_p,t+1 = max(0, min(R_p, (1 - 7 s_p) F_pt + 7 G_pt)), and
 * F_p,t+1 = 0 when 1 - 7 s_p < 0.  Every plan keeps x_pt >= F_pt: a week
 * that is grazed ends at or above R_p (res), a mowed one at R_p (mowlo,
 * mowhi), and one that is neither has no days (use, grz) and no cut
 * (mowcap), so it ends at (1 - 7 s_p) x_pt + 7 G_pt, at least
 * (1 - 7 s_p) F_pt + 7 G_pt when 1 - 7 s_p >= 0.  The LP relaxation can
 * no longer graze a paddock to R_p g_pt with g_pt fractional. */
static void cover_floor(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    int T = pb->n_weeks;
    for (int p = 0; p < pb->n_paddocks; p++) {
        const plan_paddock *pd = &pb->pd[p];
        double a = 1.0 - 7.0 * pd->senescence_per_day, f = pd->cover0_t_ha;
        mm->F[p * (T + 1)] = f;
        for (int t = 0; t < T; t++) {
            double next = a >= 0 ? a * f + 7.0 * pb->growth_t_ha_d[p * T + t] : 0.0;
            f = fmax(0.0, fmin(pd->residual_t_ha, next));
            mm->F[p * (T + 1) + t + 1] = f;
        }
    }
}

static void model_free(pm_model *mm)
{
    free(mm->F);
    free(mm->U);
    free(mm->pid);
    free(mm->mid);
    free(mm->ind);
    free(mm->val);
}

/* The plain-C part of the model (no GLPK call): layout, names, scratch. */
static int model_init(pm_model *mm, const plan_problem *pb)
{
    memset(mm, 0, sizeof *mm);
    mm->pb = pb;
    mm->D = plan_days_max(pb);
    mm->cap = pb->n_paddocks + pb->n_mobs + pb->n_weeks + 8;
    if (pb->limit_supplement || pb->limit_mowing) /* lim_sup, lim_mow span the horizon */
        mm->cap += (pb->n_paddocks + pb->n_mobs) * pb->n_weeks;
    mm->U = malloc((size_t)pb->n_paddocks * sizeof *mm->U);
    mm->F = malloc((size_t)pb->n_paddocks * ((size_t)pb->n_weeks + 1) * sizeof *mm->F);
    mm->pid = malloc((size_t)pb->n_paddocks * sizeof *mm->pid);
    mm->mid = malloc(((size_t)pb->n_mobs + 1) * sizeof *mm->mid);
    mm->ind = malloc(((size_t)mm->cap + 1) * sizeof *mm->ind);
    mm->val = malloc(((size_t)mm->cap + 1) * sizeof *mm->val);
    if (!mm->U || !mm->F || !mm->pid || !mm->mid || !mm->ind || !mm->val) {
        model_free(mm);
        return -1;
    }
    layout(mm);
    cover_bounds(mm);
    cover_floor(mm);
    for (int p = 0; p < pb->n_paddocks; p++)
        clean_id(pb->pd[p].id, 'p', p, mm->pid[p]);
    for (int m = 0; m < pb->n_mobs; m++)
        clean_id(pb->mob[m].id, 'm', m, mm->mid[m]);
    return 0;
}

/* Builds the whole model into mm->lp (GLPK errors jump to the guard). */
/* part[m,p,t]: a paddock free on part of the week only is the mob's one
 * paddock that week: sum_q y_mqt + (K - 1) y_mpt <= K. */
static void rows_part(pm_model *mm)
{
    const plan_problem *pb = mm->pb;
    int K = pb->max_paddocks_per_week;
    if (K <= 1)
        return;
    for (int m = 0; m < pb->n_mobs; m++)
        for (int t = 0; t < pb->n_weeks; t++)
            for (int p = 0; p < pb->n_paddocks; p++) {
                if (!plan_part_week(pb, p, t))
                    continue;
                row_begin(mm);
                for (int q = 0; q < pb->n_paddocks; q++)
                    row_add(mm, col_mpt(mm, mm->c.y, m, q, t), q == p ? (double)K : 1.0);
                nm(mm, "part", m, p, t, -1);
                row_end(mm, GLP_UP, 0.0, (double)K);
            }
}

static void model_build(pm_model *mm)
{
    mm->lp = glp_create_prob();
    glp_set_prob_name(mm->lp, "rowgraze_plan");
    glp_set_obj_name(mm->lp, "cost");
    glp_set_obj_dir(mm->lp, GLP_MIN);
    glp_add_cols(mm->lp, mm->c.n);
    cols_mob_paddock(mm);
    cols_rest(mm);
    rows_balance(mm);
    rows_residual(mm);
    rows_ceiling(mm);
    rows_demand(mm);
    rows_linking(mm);
    rows_paddock_mobs(mm);
    rows_kmax(mm);
    rows_part(mm);
    rows_spell(mm);
    rows_rest(mm);
    rows_moves(mm);
    row_terminal(mm);
    rows_limits(mm);
}

/* ---------------------------------------------------------- warm start */

/* Cover of paddock p over week t from x (docs/planner.md, the verifier's
 * simulation): writes x_p,t+1 and r_pt into v. */
static void warm_cover(const pm_model *mm, const plan *pl, int p, int t, double *v)
{
    const plan_problem *pb = mm->pb;
    const plan_paddock *pd = &pb->pd[p];
    double eaten = 0;
    for (int m = 0; m < pb->n_mobs; m++)
        eaten += pb->mob[m].demand_t_d * pl->days[(m * pb->n_paddocks + p) * pb->n_weeks + t];
    double x1 = (1.0 - 7.0 * pd->senescence_per_day) * v[col_x(mm, p, t)] +
                7.0 * pb->growth_t_ha_d[p * pb->n_weeks + t] - eaten / pd->area_ha;
    int mowed = pl->mow[p * pb->n_weeks + t] != 0;
    v[col_pt(mm, mm->c.w, p, t)] = mowed;
    v[col_pt(mm, mm->c.r, p, t)] = mowed ? x1 - pd->residual_t_ha : 0.0;
    v[col_x(mm, p, t + 1)] = mowed ? pd->residual_t_ha : x1;
}

/* d, y, e of mob m in paddock p, and g, over every week. */
static void warm_presence(const pm_model *mm, const plan *pl, int m, int p, double *v)
{
    const plan_problem *pb = mm->pb;
    for (int t = 0; t < pb->n_weeks; t++) {
        int days = pl->days[(m * pb->n_paddocks + p) * pb->n_weeks + t];
        int y = days > 0, before = t > 0 && v[col_mpt(mm, mm->c.y, m, p, t - 1)] > 0.5;
        v[col_mpt(mm, mm->c.d, m, p, t)] = days;
        v[col_mpt(mm, mm->c.y, m, p, t)] = y;
        v[col_mpt(mm, mm->c.e, m, p, t)] = y && !before;
        if (y)
            v[col_pt(mm, mm->c.g, p, t)] = 1.0;
    }
}

/* Every column's value for plan pl, v[1..n] (v[0] unused). */
static void warm_point(const pm_model *mm, const plan *pl, double *v)
{
    const plan_problem *pb = mm->pb;
    memset(v, 0, ((size_t)mm->c.n + 1) * sizeof *v);
    for (int m = 0; m < pb->n_mobs; m++)
        for (int p = 0; p < pb->n_paddocks; p++)
            warm_presence(mm, pl, m, p, v);
    double area = 0, end = 0;
    for (int p = 0; p < pb->n_paddocks; p++) {
        v[col_x(mm, p, 0)] = pb->pd[p].cover0_t_ha;
        for (int t = 0; t < pb->n_weeks; t++)
            warm_cover(mm, pl, p, t, v);
        area += pb->pd[p].area_ha;
        end += pb->pd[p].area_ha * v[col_x(mm, p, pb->n_weeks)];
    }
    for (int m = 0; m < pb->n_mobs; m++)
        for (int t = 0; t < pb->n_weeks; t++)
            v[col_mt(mm, mm->c.sup, m, t)] = pl->supplement_t[m * pb->n_weeks + t];
    v[mm->c.u] = fmax(0.0, pb->terminal_t_ha * area - end);
}

/* 1 when value a breaks bounds of type type [lb, ub] by more than tol. */
static int out_of_bounds(double a, int type, double lb, double ub, double tol)
{
    int lo = type == GLP_LO || type == GLP_DB || type == GLP_FX;
    int up = type == GLP_UP || type == GLP_DB || type == GLP_FX;
    return (lo && a < lb - tol) || (up && a > ub + tol);
}

/* 0 when v satisfies every row, column bound and integrality of mm->lp;
 * else 1 and the first broken name in why.  Rows come first: a plan that
 * goes under the cover floor (a column bound) breaks a row too, and the
 * row names the rule. */
static int point_breaks(pm_model *mm, const double *v, char *why, size_t cap)
{
    glp_prob *lp = mm->lp;
    for (int i = 1; i <= glp_get_num_rows(lp); i++) {
        int n = glp_get_mat_row(lp, i, mm->ind, mm->val);
        double a = 0;
        for (int k = 1; k <= n; k++)
            a += mm->val[k] * v[mm->ind[k]];
        if (out_of_bounds(a, glp_get_row_type(lp, i), glp_get_row_lb(lp, i), glp_get_row_ub(lp, i),
                          FEAS_TOL))
        {
            snprintf(why, cap, "row %s", glp_get_row_name(lp, i));
            return 1;
        }
    }
    for (int j = 1; j <= mm->c.n; j++) {
        int integer = glp_get_col_kind(lp, j) != GLP_CV;
        if ((integer && v[j] != floor(v[j])) ||
            out_of_bounds(v[j], glp_get_col_type(lp, j), glp_get_col_lb(lp, j),
                          glp_get_col_ub(lp, j), FEAS_TOL))
        {
            snprintf(why, cap, "column %s", glp_get_col_name(lp, j));
            return 1;
        }
    }
    return 0;
}

static double point_cost(glp_prob *lp, const double *v, int n)
{
    double z = glp_get_obj_coef(lp, 0);
    for (int j = 1; j <= n; j++)
        z += glp_get_obj_coef(lp, j) * v[j];
    return z;
}

/* Reads the warm plan into run->warm_x, or leaves it NULL (and says why in
 * res->msg) when the plan breaks a row. */
static void warm_prepare(pm_run *run)
{
    pm_model *mm = &run->mm;
    if (!run->opt->warm)
        return;
    run->warm_x = malloc(((size_t)mm->c.n + 1) * sizeof *run->warm_x);
    if (!run->warm_x) {
        run->res->warm = PM_WARM_REJECTED;
        snprintf(run->res->msg, sizeof run->res->msg, "warm plan not used: out of memory");
        return;
    }
    warm_point(mm, run->opt->warm, run->warm_x);
    char why[NAME_LEN + 16];
    if (point_breaks(mm, run->warm_x, why, sizeof why)) {
        run->res->warm = PM_WARM_REJECTED;
        snprintf(run->res->msg, sizeof run->res->msg, "warm plan not used: it breaks %.200s", why);
        free(run->warm_x);
        run->warm_x = NULL;
        return;
    }
    run->res->warm = PM_WARM_UNUSED;
}

/* ------------------------------------------------------------ solution */

/* The plan behind column values v (rounded days and mowing; supplement from
 * feed[m,t], so the plan meets it exactly). */
static void plan_from_point(const pm_model *mm, const double *v, plan *out)
{
    const plan_problem *pb = mm->pb;
    for (int m = 0; m < pb->n_mobs; m++)
        for (int t = 0; t < pb->n_weeks; t++) {
            int total = 0;
            for (int p = 0; p < pb->n_paddocks; p++) {
                int i = (m * pb->n_paddocks + p) * pb->n_weeks + t;
                out->days[i] = (int)lround(v[col_mpt(mm, mm->c.d, m, p, t)]);
                total += out->days[i];
            }
            out->supplement_t[m * pb->n_weeks + t] = pb->mob[m].demand_t_d * (7 - total);
        }
    for (int p = 0; p < pb->n_paddocks; p++)
        for (int t = 0; t < pb->n_weeks; t++)
            out->mow[p * pb->n_weeks + t] = v[col_pt(mm, mm->c.w, p, t)] > 0.5;
}

static void set_result(pm_result *res, int status, double obj, double bound)
{
    res->status = status;
    res->objective = obj;
    res->bound = bound < obj ? bound : obj;
    res->gap = (obj - res->bound) / fmax(1e-9, fabs(obj));
}

/* No plan from GLPK: the warm plan, when it was feasible, is the answer. */
static int fall_back(pm_run *run, double bound, const char *why)
{
    if (!run->warm_x) {
        run->res->status = PM_NO_PLAN;
        run->res->bound = bound;
        snprintf(run->res->msg, sizeof run->res->msg, "%s", why);
        return 0;
    }
    plan_from_point(&run->mm, run->warm_x, run->out);
    set_result(run->res, PM_FEASIBLE, point_cost(run->mm.lp, run->warm_x, run->mm.c.n), bound);
    return 0;
}

/* ------------------------------------------------------------ strategy */

/* What the branch-and-bound callback keeps. */
typedef struct pm_tree_info {
    pm_run *run;
    double bound;    /* best proven bound seen so far */
    double last_out; /* time of the last progress line */
    int printed;
    int warm_tried;  /* the warm plan was offered (once only) */
} pm_tree_info;

static int ms_left(const pm_run *run)
{
    double lim = run->opt->time_limit_s;
    if (!(lim > 0))
        return INT_MAX;
    double ms = (lim - (now_s() - run->t0)) * 1000.0;
    return ms < 1.0 ? 1 : ms > (double)INT_MAX ? INT_MAX : (int)ms;
}

static void show_progress(pm_tree_info *ti, glp_tree *T)
{
    double now = now_s();
    if (now - ti->last_out < 1.0)
        return;
    glp_prob *P = glp_ios_get_prob(T);
    int a, n, total;
    glp_ios_tree_size(T, &a, &n, &total);
    if (glp_mip_status(P) == GLP_FEAS)
        fprintf(stderr, "\rplan: %d nodes, best %.2f, bound %.2f, gap %.1f%%   ", total,
                glp_mip_obj_val(P), ti->bound, 100.0 * glp_ios_mip_gap(T));
    else
        fprintf(stderr, "\rplan: %d nodes, no plan yet, bound %.2f   ", total, ti->bound);
    ti->last_out = now;
    ti->printed = 1;
}

/* glp_intopt's callback: the tree's best bound at every call; the warm
 * plan at the first GLP_IHEUR (root LP solved, solution not integral). */
static void on_tree(glp_tree *T, void *info)
{
    pm_tree_info *ti = info;
    int p = glp_ios_best_node(T);
    if (p != 0) {
        double b = glp_ios_node_bound(T, p);
        if (b > -1e300 && b > ti->bound)
            ti->bound = b;
    }
    if (glp_ios_reason(T) == GLP_IHEUR && ti->run->warm_x && !ti->warm_tried) {
        ti->warm_tried = 1; /* accepted, or GLPK already holds a better plan */
        if (glp_ios_heur_sol(T, ti->run->warm_x) == 0)
            ti->run->res->warm = PM_WARM_USED;
    }
    if (ti->run->opt->progress)
        show_progress(ti, T);
    /* PM_DECIDE: the first plan that keeps every row settles the question */
    if (ti->run->opt->strategy == PM_DECIDE && glp_mip_status(glp_ios_get_prob(T)) == GLP_FEAS)
        glp_ios_terminate(T);
}

/* The LP relaxation (optimal basis for glp_intopt, root bound).  Returns 1
 * when it is optimal, 0 when the run ended here (result set), -1 error. */
static int solve_relaxation(pm_run *run, double *bound)
{
    glp_smcp sp;
    glp_init_smcp(&sp);
    sp.msg_lev = GLP_MSG_OFF;
    sp.presolve = GLP_OFF;
    sp.tm_lim = ms_left(run);
    run->stage = "LP relaxation";
    glp_scale_prob(run->mm.lp, GLP_SF_AUTO);
    glp_adv_basis(run->mm.lp, 0);
    int rc = glp_simplex(run->mm.lp, &sp), st = glp_get_status(run->mm.lp);
    if (rc == 0 && st == GLP_OPT) {
        *bound = glp_get_obj_val(run->mm.lp);
        return 1;
    }
    if (rc == 0 && (st == GLP_NOFEAS || st == GLP_INFEAS)) {
        run->res->status = PM_NO_PLAN;
        run->res->infeasible = st == GLP_NOFEAS;
        snprintf(run->res->msg, sizeof run->res->msg, "no plan meets the rules (LP relaxation infeasible)");
        return 0;
    }
    if (rc == GLP_ETMLIM || rc == GLP_EITLIM)
        return fall_back(run, -HUGE_VAL, "time limit before the LP relaxation was solved");
    return fail(run->res->msg, sizeof run->res->msg, "GLPK simplex failed (code %d, status %d)",
                rc, st);
}

static void iocp_setup(pm_run *run, glp_iocp *ip, pm_tree_info *ti)
{
    glp_init_iocp(ip);
    ip->msg_lev = GLP_MSG_OFF;
    ip->presolve = GLP_OFF; /* glp_ios_heur_sol needs the original columns */
    ip->tm_lim = ms_left(run);
    ip->mip_gap = run->opt->gap > 0 ? run->opt->gap : 0.0;
    ip->tol_int = 1e-7; /* days are rounded into the plan: keep them near integers */
    ip->fp_heur = GLP_ON;
    ip->mir_cuts = GLP_ON;
    ip->cb_func = on_tree;
    ip->cb_info = ti;
}

/* The plan GLPK holds (or the warm plan, should GLPK have stopped on a
 * costlier one before it was offered), its cost and bound. */
static int take_plan(pm_run *run, int optimal, double bound)
{
    pm_model *mm = &run->mm;
    double obj = glp_mip_obj_val(mm->lp);
    if (!optimal && run->warm_x && point_cost(mm->lp, run->warm_x, mm->c.n) < obj)
        return fall_back(run, bound, "");
    double *v = malloc(((size_t)mm->c.n + 1) * sizeof *v);
    if (!v)
        return fail(run->res->msg, sizeof run->res->msg, "out of memory");
    for (int j = 1; j <= mm->c.n; j++)
        v[j] = glp_mip_col_val(mm->lp, j);
    plan_from_point(mm, v, run->out);
    warm_point(mm, run->out, v); /* the plan as the verifier reads it */
    char why[NAME_LEN + 16];
    if (point_breaks(mm, v, why, sizeof why))
        snprintf(run->res->msg, sizeof run->res->msg,
                 "the plan rounded from GLPK's solution breaks %.200s", why);
    free(v);
    set_result(run->res, optimal ? PM_OPTIMAL : PM_FEASIBLE, obj, optimal ? obj : bound);
    return 0;
}

/* Branch and bound on the whole model from run->warm_x (when set): the
 * LP relaxation first (its bound is the full model's), then glp_intopt. */
static int direct_from(pm_run *run)
{
    pm_tree_info ti = {run, -HUGE_VAL, now_s(), 0, 0};
    int ok = solve_relaxation(run, &ti.bound);
    if (ok <= 0)
        return ok;
    glp_iocp ip;
    iocp_setup(run, &ip, &ti);
    run->stage = "branch and bound";
    int rc = glp_intopt(run->mm.lp, &ip), ms = glp_mip_status(run->mm.lp);
    if (ti.printed)
        fputc('\n', stderr);
    if (rc != 0 && rc != GLP_ETMLIM && rc != GLP_EMIPGAP && rc != GLP_ESTOP)
        return fail(run->res->msg, sizeof run->res->msg, "GLPK branch and bound failed (code %d)", rc);
    if (ms == GLP_NOFEAS) {
        run->res->status = PM_NO_PLAN;
        run->res->infeasible = rc == 0;
        run->res->bound = HUGE_VAL;
        snprintf(run->res->msg, sizeof run->res->msg, "no plan meets the rules");
        return 0;
    }
    if (ms != GLP_OPT && ms != GLP_FEAS)
        return fall_back(run, ti.bound, "no plan found within the time limit");
    return take_plan(run, ms == GLP_OPT, ti.bound);
}

/* PM_DIRECT: branch and bound on the whole model, from the warm plan when
 * given. */
static int solve_direct(pm_run *run)
{
    warm_prepare(run);
    return direct_from(run);
}

/* ---------------------------------------------------- improvement phase */

/* Fix-and-optimize over windows of weeks (docs/planner.md, "Solving"):
 * the incumbent (run->warm_x, a verified point) stays; a window frees the
 * integer columns d, y, g, w of weeks t0..t1-1 (of one mob's d and y only,
 * or of every mob), every other integer column is fixed at the incumbent's
 * value, and GLPK solves that restricted model (MIP presolve on: the fixed
 * columns go, what is left is small).  Its plan, re-read through the
 * verifier's recursion (warm_point) and checked against every row
 * (point_breaks), replaces the incumbent when it is cheaper.  The
 * restricted models' optima are upper bounds only: no bound of the full
 * model comes from here, except when a window frees everything (then the
 * restricted model is the full model). */

#define WIN_FREE_TARGET 240   /* integer columns a window aims to free */
#define WIN_SHARE 0.6         /* PM_IMPROVE: share of the time limit for windows */
#define WIN_MIN_S 0.2         /* per-window time limit: 10 % of the limit, within */
#define WIN_MAX_S 10.0        /* [WIN_MIN_S, WIN_MAX_S] seconds */
#define WIN_GAIN 1e-7         /* relative: a candidate must be this much cheaper */

typedef struct pm_win {
    pm_run *run;
    int *type;          /* [1 + n]: the full model's column bounds */
    double *lb, *ub;
    double *cand;       /* [1 + n]: a candidate point */
    plan pl;            /* the candidate's plan */
    double inc_cost;    /* cost of run->warm_x */
    double end;         /* the phase stops at this time (HUGE_VAL: no limit) */
    int proven;         /* 1: a window freeing everything was solved to optimality */
    double proven_obj;
    double last_out;
    int printed;
} pm_win;

static int int_col(const pm_model *mm, int j)
{
    return (j >= mm->c.d && j < mm->c.e) || (j >= mm->c.g && j < mm->c.r);
}

/* Week of integer column j, and its mob (-1 for g and w). */
static void int_col_where(const pm_model *mm, int j, int *t, int *m)
{
    int T = mm->pb->n_weeks, P = mm->pb->n_paddocks;
    int k = j < mm->c.y ? j - mm->c.d : j < mm->c.e ? j - mm->c.y : j < mm->c.w ? j - mm->c.g : j - mm->c.w;
    *t = k % T;
    *m = j < mm->c.e ? k / (P * T) : -1;
}

/* Frees the integer columns of weeks t0..t1-1 (mob's d and y only, with g
 * and w, when mob >= 0) at their full-model bounds; fixes the rest at the
 * incumbent.  t0 = 0, t1 = T, mob = -1 restores the full model. */
static void win_restrict(pm_win *wn, int t0, int t1, int mob)
{
    pm_model *mm = &wn->run->mm;
    const double *inc = wn->run->warm_x;
    for (int j = 1; j <= mm->c.n; j++) {
        if (!int_col(mm, j))
            continue;
        int t, m;
        int_col_where(mm, j, &t, &m);
        if (t >= t0 && t < t1 && (mob < 0 || m < 0 || m == mob))
            glp_set_col_bnds(mm->lp, j, wn->type[j], wn->lb[j], wn->ub[j]);
        else
            glp_set_col_bnds(mm->lp, j, GLP_FX, inc[j], inc[j]);
    }
}

static void win_progress(pm_win *wn, int t0, int t1, int mob)
{
    double now = now_s();
    if (!wn->run->opt->progress || now - wn->last_out < 1.0)
        return;
    fprintf(stderr, "\rplan: improving weeks %d-%d%s%s, best %.2f   ", t0 + 1, t1,
            mob >= 0 ? " of mob " : "", mob >= 0 ? wn->run->mm.mid[mob] : "", wn->inc_cost);
    wn->last_out = now;
    wn->printed = 1;
}

/* Milliseconds one window may take: 10 % of the time limit within
 * [WIN_MIN_S, WIN_MAX_S], never past the phase's end; 0: no time left. */
static int win_ms(const pm_win *wn)
{
    double lim = wn->run->opt->time_limit_s;
    if (!(lim > 0))
        return INT_MAX;
    double left = wn->end - now_s(), each = fmin(WIN_MAX_S, fmax(WIN_MIN_S, 0.1 * lim));
    double s = fmin(each, left);
    return s < 0.02 ? 0 : (int)(s * 1000.0);
}

/* One window: the restricted model solved, its plan verified, kept when
 * cheaper.  Returns 1 improved, 0 not. */
static int win_solve(pm_win *wn, int t0, int t1, int mob)
{
    pm_run *run = wn->run;
    pm_model *mm = &run->mm;
    int ms_lim = win_ms(wn);
    if (ms_lim == 0)
        return 0;
    win_progress(wn, t0, t1, mob);
    win_restrict(wn, t0, t1, mob);
    glp_iocp ip;
    glp_init_iocp(&ip);
    ip.msg_lev = GLP_MSG_OFF;
    ip.presolve = GLP_ON; /* drops the fixed columns; no warm plan is offered here */
    ip.tm_lim = ms_lim;
    ip.mip_gap = 0.0;
    ip.tol_int = 1e-7;
    ip.fp_heur = GLP_ON;
    run->stage = "window";
    int rc = glp_intopt(mm->lp, &ip), st = glp_mip_status(mm->lp);
    if (st != GLP_OPT && st != GLP_FEAS)
        return 0;
    int whole = t0 == 0 && t1 >= mm->pb->n_weeks && (mob < 0 || mm->pb->n_mobs <= 1);
    if (whole && rc == 0 && st == GLP_OPT) {
        wn->proven = 1; /* the restricted model is the full model */
        wn->proven_obj = glp_mip_obj_val(mm->lp);
    }
    for (int j = 1; j <= mm->c.n; j++)
        wn->cand[j] = glp_mip_col_val(mm->lp, j);
    plan_from_point(mm, wn->cand, &wn->pl);
    warm_point(mm, &wn->pl, wn->cand); /* the plan as the verifier reads it */
    char why[NAME_LEN + 16];
    if (point_breaks(mm, wn->cand, why, sizeof why))
        return 0;
    double z = point_cost(mm->lp, wn->cand, mm->c.n);
    if (!(z < wn->inc_cost - WIN_GAIN * fmax(1.0, fabs(wn->inc_cost))))
        return 0;
    double *old = run->warm_x;
    run->warm_x = wn->cand;
    wn->cand = old;
    wn->inc_cost = z;
    return 1;
}

/* Columns one window of W weeks frees, per mob freed at once. */
static int win_size(const plan_problem *pb, int W, int mobs)
{
    return W * pb->n_paddocks * (2 * mobs + 2);
}

/* One pass of windows of W weeks, sliding by half a window.  Mobs are freed
 * together when that window stays small, else one at a time.  Returns the
 * number of improvements. */
static int win_pass(pm_win *wn, int W)
{
    const plan_problem *pb = wn->run->mm.pb;
    int T = pb->n_weeks, step = W > 1 ? W / 2 : 1, n = 0;
    int joint = pb->n_mobs <= 1 || win_size(pb, W, pb->n_mobs) <= WIN_FREE_TARGET || W >= T;
    for (int t0 = 0;; t0 += step) {
        int a = t0 + W > T ? T - W : t0;
        if (joint)
            n += win_solve(wn, a, a + W, -1);
        else
            for (int m = 0; m < pb->n_mobs; m++)
                n += win_solve(wn, a, a + W, m);
        if (a + W >= T || win_ms(wn) == 0 || wn->proven)
            break;
    }
    return n;
}

/* The window phase from run->warm_x until a pass improves nothing (then,
 * with grow, once more with a window a week longer, up to the horizon) or
 * the phase's time is up.  Leaves the full model's bounds restored. */
static int win_phase(pm_win *wn, int grow)
{
    const plan_problem *pb = wn->run->mm.pb;
    int T = pb->n_weeks, W = wn->run->opt->window_weeks;
    if (W <= 0) {
        W = WIN_FREE_TARGET / win_size(pb, 1, 1);
        W = W < 2 ? 2 : W > 4 ? 4 : W;
    }
    W = W > T ? T : W;
    while (!wn->proven && win_ms(wn) > 0) {
        int n = win_pass(wn, W);
        if (n > 0)
            continue;
        if (!grow || W >= T)
            break;
        W++;
    }
    if (wn->printed)
        fputc('\n', stderr);
    win_restrict(wn, 0, T, -1);
    return 0;
}

static void win_free(pm_win *wn)
{
    free(wn->type);
    free(wn->lb);
    free(wn->ub);
    free(wn->cand);
    plan_free(&wn->pl);
}

static int win_init(pm_win *wn, pm_run *run, double end)
{
    pm_model *mm = &run->mm;
    size_t n = (size_t)mm->c.n + 1;
    memset(wn, 0, sizeof *wn);
    wn->run = run;
    wn->end = end;
    wn->type = malloc(n * sizeof *wn->type);
    wn->lb = malloc(n * sizeof *wn->lb);
    wn->ub = malloc(n * sizeof *wn->ub);
    wn->cand = malloc(n * sizeof *wn->cand);
    if (!wn->type || !wn->lb || !wn->ub || !wn->cand || plan_alloc(mm->pb, &wn->pl) != 0) {
        win_free(wn);
        return -1;
    }
    for (int j = 1; j <= mm->c.n; j++) {
        wn->type[j] = glp_get_col_type(mm->lp, j);
        wn->lb[j] = glp_get_col_lb(mm->lp, j);
        wn->ub[j] = glp_get_col_ub(mm->lp, j);
    }
    wn->inc_cost = point_cost(mm->lp, run->warm_x, mm->c.n);
    return 0;
}

/* The starting point: the warm plan when it keeps every row, else the
 * baseline (planbase.c), else none (run->warm_x stays NULL). */
static void start_point(pm_run *run)
{
    warm_prepare(run);
    if (run->warm_x)
        return;
    plan base;
    if (pb_baseline(run->mm.pb, &base) != 0)
        return;
    double *v = malloc(((size_t)run->mm.c.n + 1) * sizeof *v);
    char why[NAME_LEN + 16];
    if (v) {
        warm_point(&run->mm, &base, v);
        if (point_breaks(&run->mm, v, why, sizeof why) == 0) {
            run->warm_x = v;
            v = NULL;
        }
    }
    free(v);
    plan_free(&base);
}

/* The window phase (until `end`), its plan in run->warm_x.  Returns 1 when
 * a window freeing everything proved it optimal (result set), 0 when the
 * caller goes on from run->warm_x, -1 on error. */
static int improve(pm_run *run, double end, int grow)
{
    pm_win wn;
    if (win_init(&wn, run, end) != 0)
        return fail(run->res->msg, sizeof run->res->msg, "out of memory");
    if (run->res->warm == PM_WARM_UNUSED)
        run->res->warm = PM_WARM_USED; /* the phase starts from it */
    win_phase(&wn, grow);
    int proven = wn.proven;
    if (proven) {
        plan_from_point(&run->mm, run->warm_x, run->out);
        set_result(run->res, PM_OPTIMAL, wn.inc_cost, fmin(wn.inc_cost, wn.proven_obj));
    }
    win_free(&wn);
    return proven;
}

/* PM_IMPROVE: the warm plan (or the baseline), the window phase for up to
 * WIN_SHARE of the time limit (windows a week longer after every pass
 * that improves nothing), then branch and bound on the full model from the
 * improved plan for the rest of the time: its LP relaxation gives the
 * bound, or no bound when there is no time for it. */
static int solve_improve(pm_run *run)
{
    start_point(run);
    if (!run->warm_x)
        return direct_from(run);
    double lim = run->opt->time_limit_s;
    int rc = improve(run, lim > 0 ? run->t0 + WIN_SHARE * lim : HUGE_VAL, lim > 0);
    if (rc != 0)
        return rc < 0 ? -1 : 0;
    if (lim > 0 && ms_left(run) <= 1)
        return fall_back(run, -HUGE_VAL, "");
    return direct_from(run);
}

/* PM_WINDOWS: the window phase alone with windows of opt->window_weeks,
 * until a pass improves nothing or the time is up; no bound (unless a
 * window freeing everything proved the plan optimal). */
static int solve_windows(pm_run *run)
{
    start_point(run);
    if (!run->warm_x) {
        run->res->status = PM_NO_PLAN;
        snprintf(run->res->msg, sizeof run->res->msg, "no starting plan for the window phase");
        return 0;
    }
    double lim = run->opt->time_limit_s;
    int rc = improve(run, lim > 0 ? run->t0 + lim : HUGE_VAL, 0);
    if (rc != 0)
        return rc < 0 ? -1 : 0;
    return fall_back(run, -HUGE_VAL, "");
}

/* PM_DECIDE: is there a plan that keeps every row, the limits included?
 * The objective becomes the supplement, t DM.  First, with lim_sup lifted,
 * the window phase lowers the supplement of the warm plan (else the
 * baseline) for up to half the time: a plan at or under the limit settles
 * it (and a window freeing everything that proves the least supplement
 * above the limit settles it the other way).  Else, lim_sup back in place,
 * the LP relaxation (infeasible: proven, no plan) and branch and bound,
 * stopped by on_tree at the first plan; the tree's bound is then the least
 * supplement any plan could have. */
static int solve_decide(pm_run *run)
{
    pm_model *mm = &run->mm;
    const plan_problem *pb = mm->pb;
    double S = pb->limit_supplement ? pb->max_supplement_t : HUGE_VAL;
    for (int j = 1; j <= mm->c.n; j++)
        glp_set_obj_coef(mm->lp, j, j >= mm->c.sup && j < mm->c.u ? 1.0 : 0.0);
    if (mm->lim_sup_row)
        glp_set_row_bnds(mm->lp, mm->lim_sup_row, GLP_FR, 0.0, 0.0);
    start_point(run);
    if (run->warm_x && point_cost(mm->lp, run->warm_x, mm->c.n) > S + FEAS_TOL) {
        double lim = run->opt->time_limit_s;
        int rc = improve(run, lim > 0 ? run->t0 + 0.5 * lim : HUGE_VAL, 0);
        if (rc < 0)
            return -1;
        if (rc == 1 && run->res->objective > S + FEAS_TOL) { /* the least supplement, proven */
            run->res->status = PM_NO_PLAN;
            run->res->infeasible = 1;
            run->res->bound = HUGE_VAL;
            snprintf(run->res->msg, sizeof run->res->msg, "no plan within the limits (least supplement proven)");
            return 0;
        }
    }
    if (run->warm_x && point_cost(mm->lp, run->warm_x, mm->c.n) <= S + FEAS_TOL)
        return fall_back(run, -HUGE_VAL, "");
    free(run->warm_x); /* it breaks lim_sup: never offer it to GLPK */
    run->warm_x = NULL;
    run->res->status = 0;
    if (mm->lim_sup_row)
        glp_set_row_bnds(mm->lp, mm->lim_sup_row, GLP_UP, 0.0, S);
    return direct_from(run);
}

/* --------------------------------------------------------------- guard */

/* GLPK prints its error messages even with terminal output off; keep the
 * first line for our message instead. */
static int on_glpk_text(void *info, const char *s)
{
    pm_run *run = info;
    size_t n = strlen(run->glpk_text);
    if (!strchr(run->glpk_text, '\n'))
        snprintf(run->glpk_text + n, sizeof run->glpk_text - n, "%s", s);
    return 1; /* never printed */
}

static void on_glpk_error(void *info)
{
    pm_run *run = info;
    longjmp(run->jb, 1);
}

/* Builds the model and runs body on it with GLPK silenced and its errors
 * caught.  Returns body's result, or -1 (message in msg) on a GLPK error. */
static int guarded(pm_run *run, int (*body)(pm_run *), char *msg, size_t cap)
{
    int was = glp_term_out(GLP_OFF);
    glp_term_hook(on_glpk_text, run);
    glp_error_hook(on_glpk_error, run);
    if (setjmp(run->jb) != 0) {
        glp_free_env(); /* the environment is unusable after an error */
        run->mm.lp = NULL;
        run->glpk_text[strcspn(run->glpk_text, "\n")] = 0;
        return fail(msg, cap, "GLPK stopped on an internal error (%s): %.150s", run->stage,
                    run->glpk_text);
    }
    run->stage = "building the model";
    model_build(&run->mm);
    run->res->rows = glp_get_num_rows(run->mm.lp);
    run->res->cols = glp_get_num_cols(run->mm.lp);
    run->res->binaries = (run->mm.c.e - run->mm.c.y) + 2 * (run->mm.c.w - run->mm.c.g); /* y, g, w */
    run->res->integers = run->mm.c.y - run->mm.c.d;                                    /* d */
    int rc = body(run);
    glp_delete_prob(run->mm.lp);
    run->mm.lp = NULL;
    glp_error_hook(NULL, NULL);
    glp_term_hook(NULL, NULL);
    glp_term_out(was);
    return rc;
}

/* ----------------------------------------------------------- interface */

/* PM_AUTO's choice (docs/decomposition.md): the compact model with its
 * improvement phase on tiny farms, the decomposition above. */
/* Rows the decomposition's pricing does not carry (docs/decomposition.md):
 * the limit rows of `capacity` bind the whole plan, and a plan from the
 * decomposition would too often break them.  (Part-week rows are not
 * priced either, but the bound stays valid without them and the plans are
 * checked against them: on the demo farm the decomposition still wins.) */
static int has_unpriced_rows(const plan_problem *pb)
{
    return pb->limit_supplement || pb->limit_mowing || pb->limit_shortfall;
}

static int auto_strategy(const plan_problem *pb)
{
    double cells = (double)pb->n_paddocks * pb->n_weeks * (pb->n_mobs > 0 ? pb->n_mobs : 1);
    return cells <= PM_AUTO_COMPACT_CELLS || has_unpriced_rows(pb) ? PM_IMPROVE : PM_DECOMP;
}

int pm_solve(const plan_problem *pb, const pm_options *opt, plan *out, pm_result *res)
{
    static const pm_options none = {0, 0, NULL, 0, PM_DIRECT, 0};
    static const pm_strategy strategies[] = {solve_direct, solve_improve, solve_windows, solve_decide};
    if (opt && pb && opt->strategy == PM_ROLLING)
        return prl_solve(pb, opt, NULL, out, res);
    if (opt && pb && (opt->strategy == PM_AUTO || opt->strategy == PM_DECOMP)) {
        pm_options o = *opt;
        o.strategy = opt->strategy == PM_DECOMP ? PM_DECOMP : auto_strategy(pb);
        int rc = o.strategy == PM_DECOMP ? pcg_solve(pb, &o, out, res) : pm_solve(pb, &o, out, res);
        res->strategy = o.strategy;
        return rc;
    }
    pm_run run;
    memset(&run, 0, sizeof run);
    memset(res, 0, sizeof *res);
    res->objective = (double)NAN;
    res->bound = -HUGE_VAL;
    res->gap = HUGE_VAL;
    run.opt = opt ? opt : &none;
    run.out = out;
    run.res = res;
    run.t0 = now_s();
    int rc = -1;
    char *msg = res->msg;
    size_t cap = sizeof res->msg;
    if (check_problem(pb, msg, cap) == 0 && check_plan(pb, out, 0, "output", msg, cap) == 0 &&
        (!run.opt->warm || check_plan(pb, run.opt->warm, 1, "warm", msg, cap) == 0)) {
        if (run.opt->strategy < 0 ||
            run.opt->strategy >= (int)(sizeof strategies / sizeof strategies[0]))
            fail(msg, cap, "unknown solving strategy %d", run.opt->strategy);
        else if (model_init(&run.mm, pb) != 0)
            fail(msg, cap, "out of memory");
        else {
            rc = guarded(&run, strategies[run.opt->strategy], msg, cap);
            model_free(&run.mm);
        }
    }
    free(run.warm_x);
    if (rc != 0)
        res->status = PM_ERROR;
    res->seconds = now_s() - run.t0;
    res->strategy = opt ? opt->strategy : PM_DIRECT;
    return rc == 0 ? 0 : -1;
}

/* pm_export's body: writes run->path's temporary sibling, then renames. */
static int write_model(pm_run *run)
{
    char tmp[4200];
    snprintf(tmp, sizeof tmp, "%s.tmp-%ld", run->path, (long)getpid());
    run->stage = "writing the model";
    int rc = run->mps ? glp_write_mps(run->mm.lp, GLP_MPS_FILE, NULL, tmp)
                      : glp_write_lp(run->mm.lp, NULL, tmp);
    if (rc == 0 && rename(tmp, run->path) == 0)
        return 0;
    remove(tmp);
    return fail(run->res->msg, sizeof run->res->msg, "%s: cannot write the model", run->path);
}

int pm_export(const plan_problem *pb, const char *path, int mps, rg_err *err)
{
    pm_run run;
    pm_result res;
    memset(&run, 0, sizeof run);
    memset(&res, 0, sizeof res);
    run.res = &res;
    run.path = path;
    run.mps = mps;
    int rc = -1;
    if (check_problem(pb, res.msg, sizeof res.msg) != 0)
        ;
    else if (model_init(&run.mm, pb) != 0)
        fail(res.msg, sizeof res.msg, "out of memory");
    else {
        rc = guarded(&run, write_model, res.msg, sizeof res.msg);
        model_free(&run.mm);
    }
    if (rc != 0)
        return rg_fail(err, "model export: %s", res.msg);
    return 0;
}
