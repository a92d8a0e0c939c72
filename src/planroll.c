/* planroll.c - the rotation plan by a rolling horizon (see planroll.h and
 * docs/rolling.md, which this file follows).
 *
 * Layout, top to bottom:
 *   the state carried from window to window: the weeks kept so far (a plan
 *     of the whole horizon, later weeks empty), each paddock's cover at the
 *     window's first week (pv_simulate's recursion) and the weeks the rest
 *     rule still closes it (seam_close);
 *   the coarse tail: the feed budget of the whole farm over the weeks after
 *     the window, read as an end-cover target and its price (tail_budget);
 *   a window: its plan_problem (window_problem), a warm plan from the last
 *     window's (window_warm), pm_solve on it, its first weeks kept;
 *   prl_roll: the windows in turn; prl_solve: the rolled plan, then the
 *     decomposition (pcg_solve) on the whole horizon for the bound.
 * No GLPK here: windows go through pm_solve, the bound through pcg_solve.
 */
#include "planroll.h"

#include "planbase.h"
#include "plancg.h"
#include "planverify.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#define MIN_SLICE_S 0.05 /* a window's or the bound phase's time limit, at least */

static double now_s(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_MONOTONIC, &ts);
    return (double)ts.tv_sec + (double)ts.tv_nsec * 1e-9;
}

/* What the windows share. */
typedef struct prl_run {
    const plan_problem *pb;
    const pm_options *opt;
    int W, R, tail;
    int P, M, T;
    plan kept;        /* weeks kept so far (the rest all zero) */
    plan last;        /* the last window's plan, for the next window's warm plan */
    int last_t0;      /* its first week; -1: none */
    double *cover;    /* [P] cover at the window's first week */
    int *closed_to;   /* [P] the window closes the paddock before this week */
    int windows, rows, cols, binaries;
    char note[160];
} prl_run;

/* Supplement of every mob and week of pl from its days: feed[m,t] exactly. */
static void fill_supplement(const plan_problem *pb, plan *pl)
{
    int P = pb->n_paddocks, T = pb->n_weeks;
    for (int m = 0; m < pb->n_mobs; m++)
        for (int t = 0; t < T; t++) {
            int total = 0;
            for (int p = 0; p < P; p++)
                total += pl->days[((size_t)m * P + p) * T + t];
            pl->supplement_t[m * T + t] = pb->mob[m].demand_t_d * (7 - total);
        }
}

static void plan_copy(const plan_problem *pb, const plan *a, plan *b)
{
    size_t pt = (size_t)pb->n_paddocks * pb->n_weeks;
    memcpy(b->days, a->days, pt * pb->n_mobs * sizeof *b->days);
    memcpy(b->mow, a->mow, pt);
    memcpy(b->supplement_t, a->supplement_t, (size_t)pb->n_mobs * pb->n_weeks * sizeof *b->supplement_t);
}

/* pv_simulate's verdict on pl: its cost when it keeps every rule, else
 * HUGE_VAL (why in why, when given). */
static double verified_cost(const plan_problem *pb, const plan *pl, char *why, size_t cap)
{
    pv_result v;
    int rc = pv_simulate(pb, pl, &v);
    double z = rc == 0 ? v.cost_total : HUGE_VAL;
    if (why && rc != 0)
        snprintf(why, cap, "%s", rc < 0 ? "the verifier cannot read it" : v.first_violation);
    if (rc >= 0)
        pv_free(&v);
    return z;
}

/* ------------------------------------------------ carried from the past */

/* Every paddock's cover at the start of week t0 under the weeks kept so
 * far (the verifier's recursion; later weeks do not enter it).  Returns 0,
 * or -1 when the verifier cannot read the problem or is out of memory. */
static int seam_cover(prl_run *run, int t0)
{
    pv_result v;
    if (pv_simulate(run->pb, &run->kept, &v) < 0)
        return -1;
    for (int p = 0; p < run->P; p++)
        run->cover[p] = v.cover_t_ha[(size_t)p * (run->T + 1) + t0];
    pv_free(&v);
    return 0;
}

/* 1 when some mob grazes paddock p in week t of the kept weeks. */
static int kept_grazed(const prl_run *run, int p, int t)
{
    for (int m = 0; m < run->M; m++)
        if (run->kept.days[((size_t)m * run->P + p) * run->T + t] > 0)
            return 1;
    return 0;
}

/* The rest rule across the window's first week (docs/rolling.md, "The
 * seam"): a paddock last grazed in week l < t0 stays closed through week
 * l + L (the rest after its spell), and at least in week t0 when l = t0 - 1
 * (no spell runs on across the seam).  closed_to[p] is the first week it
 * may be grazed again (t0 when nothing closes it). */
static void seam_close(prl_run *run, int t0)
{
    int L = run->pb->rest_weeks;
    for (int p = 0; p < run->P; p++) {
        run->closed_to[p] = t0;
        for (int l = t0 - 1; l >= 0 && l >= t0 - 1 - L; l--)
            if (kept_grazed(run, p, l)) {
                int to = l + L + 1;
                run->closed_to[p] = l == t0 - 1 && to < t0 + 1 ? t0 + 1 : to;
                break;
            }
    }
}

/* ------------------------------------------------------- the coarse tail */

/* The feed budget of weeks t1..T-1 (docs/rolling.md, "The coarse tail"):
 * the whole farm as one stock of cover S (t DM), S' = a S + G - D each
 * week (a the area-weighted 1 - 7 s_p, G the week's growth, D what the
 * mobs can eat from pasture: their whole demand times the share of the
 * farm's area open that week), the horizon's end target X_T A at the end.
 * Backwards, the stock week t needs to feed the mobs that way and still
 * meet the target is need_t = (need_t+1 - G_t + D_t) / a_t, at least the
 * residual stock sum_p A_p R_p (grazing stops there) and at most the
 * ceiling stock sum_p A_p C_p (the farm holds no more).  The price of a
 * tonne short of it is what makes it up: the end penalty c_T carried back
 * a week at a time (a tonne at t is a_t tonnes at t + 1), never more than
 * the supplement price c_s in a week the mobs can graze (supplement fed
 * instead of grazing keeps the tonne), and c_s where the budget is short
 * on its own (need at the residual stock).  The window [t0, t1) ends with
 * target need_t1 / A at that price. */
static void tail_budget(const plan_problem *pb, int t1, double *target_t_ha, double *price_per_t)
{
    int P = pb->n_paddocks, T = pb->n_weeks;
    double A = 0, Rs = 0, Cs = 0, I = 0;
    for (int p = 0; p < P; p++) {
        A += pb->pd[p].area_ha;
        Rs += pb->pd[p].area_ha * pb->pd[p].residual_t_ha;
        Cs += pb->pd[p].area_ha * fmax(pb->pd[p].ceiling_t_ha, pb->pd[p].residual_t_ha);
    }
    for (int m = 0; m < pb->n_mobs; m++)
        I += pb->mob[m].demand_t_d;
    double cs = pb->cost_supplement_per_t;
    double need = pb->terminal_t_ha * A, price = pb->penalty_terminal_per_t;
    for (int t = T - 1; t >= t1; t--) {
        double a = 0, G = 0, open = 0;
        for (int p = 0; p < P; p++) {
            const plan_paddock *q = &pb->pd[p];
            a += q->area_ha * (1.0 - 7.0 * q->senescence_per_day);
            G += 7.0 * q->area_ha * pb->growth_t_ha_d[(size_t)p * T + t];
            open += pb->open_days[(size_t)p * T + t] > 0 ? q->area_ha : 0.0;
        }
        a /= A;
        double D = 7.0 * I * open / A;
        double n = a > 1e-9 ? (need - G + D) / a : -HUGE_VAL;
        if (n <= Rs) {
            need = Rs;
            price = cs;
        } else {
            need = fmin(n, Cs);
            price = D > 0 ? fmin(cs, price * a) : price * a;
        }
    }
    *target_t_ha = need / A;
    *price_per_t = price;
}

/* ------------------------------------------------------------ a window */

/* The window's problem: weeks t0..t1-1 of pb, covers at t0 as kept so far,
 * the paddocks the rest rule closes given no open days, kept weeks of pb
 * (plan --keep) carried, no limit rows; its end rule the tail's (or, for
 * the last window, pb's own).  Returns 0, or -1 when out of memory. */
static int window_problem(const prl_run *run, int t0, int t1, plan_problem *w)
{
    const plan_problem *pb = run->pb;
    int P = run->P, M = run->M, T = run->T, Tw = t1 - t0;
    *w = *pb;
    w->n_weeks = Tw;
    w->start_day = pb->start_day + 7 * (int64_t)t0;
    w->limit_supplement = w->limit_mowing = w->limit_shortfall = 0;
    w->pd = malloc((size_t)P * sizeof *w->pd);
    w->mob = malloc(((size_t)M + 1) * sizeof *w->mob);
    w->growth_t_ha_d = malloc((size_t)P * Tw * sizeof *w->growth_t_ha_d);
    w->open_days = malloc((size_t)P * Tw * sizeof *w->open_days);
    w->open_mask = pb->open_mask ? malloc((size_t)P * Tw) : NULL;
    w->fixed_weeks = pb->fixed_weeks > t0 ? (pb->fixed_weeks - t0 < Tw ? pb->fixed_weeks - t0 : Tw) : 0;
    w->fixed_days = w->fixed_weeks > 0 ? malloc((size_t)M * P * Tw * sizeof *w->fixed_days + 1) : NULL;
    if (!w->pd || !w->mob || !w->growth_t_ha_d || !w->open_days || (pb->open_mask && !w->open_mask) ||
        (w->fixed_weeks > 0 && !w->fixed_days)) {
        plan_problem_free(w);
        return -1;
    }
    memcpy(w->pd, pb->pd, (size_t)P * sizeof *w->pd);
    if (M > 0)
        memcpy(w->mob, pb->mob, (size_t)M * sizeof *w->mob);
    for (int p = 0; p < P; p++) {
        w->pd[p].cover0_t_ha = run->cover[p];
        for (int k = 0; k < Tw; k++) {
            size_t i = (size_t)p * Tw + k, j = (size_t)p * T + t0 + k;
            int closed = t0 + k < run->closed_to[p] && t0 + k >= pb->fixed_weeks;
            w->growth_t_ha_d[i] = pb->growth_t_ha_d[j];
            w->open_days[i] = closed ? 0 : pb->open_days[j];
            if (w->open_mask)
                w->open_mask[i] = closed ? 0 : pb->open_mask[j];
        }
    }
    for (int m = 0; m < M && w->fixed_days; m++)
        for (int p = 0; p < P; p++)
            for (int k = 0; k < Tw; k++)
                w->fixed_days[((size_t)m * P + p) * Tw + k] =
                    k < w->fixed_weeks ? pb->fixed_days[((size_t)m * P + p) * T + t0 + k] : 0;
    if (t1 < T) {
        if (run->tail == PRL_TAIL_BUDGET)
            tail_budget(pb, t1, &w->terminal_t_ha, &w->penalty_terminal_per_t);
        else if (run->tail == PRL_TAIL_NONE)
            w->terminal_t_ha = w->penalty_terminal_per_t = 0;
    }
    return 0;
}

/* The last window's plan moved to weeks t0..: its days and mowing where the
 * two windows overlap, no grazing after (mowed in a week that would end
 * above the ceiling), supplement for the rest.  0 when it keeps every rule
 * of w (then a warm plan for pm_solve), -1 otherwise. */
static int window_warm(const prl_run *run, const plan_problem *w, int t0, plan *warm)
{
    int P = run->P, Tw = w->n_weeks, Tl = run->last.n_weeks, shift = t0 - run->last_t0;
    if (run->last_t0 < 0 || shift <= 0 || shift >= Tl)
        return -1;
    int over = Tl - shift < Tw ? Tl - shift : Tw;
    for (int m = 0; m < run->M; m++)
        for (int p = 0; p < P; p++)
            for (int k = 0; k < Tw; k++)
                warm->days[((size_t)m * P + p) * Tw + k] =
                    k < over ? run->last.days[((size_t)m * P + p) * Tl + shift + k] : 0;
    for (int p = 0; p < P; p++)
        for (int k = 0; k < over; k++)
            warm->mow[(size_t)p * Tw + k] = run->last.mow[(size_t)p * Tl + shift + k];
    fill_supplement(w, warm);
    pv_result v;
    if (pv_simulate(w, warm, &v) < 0)
        return -1;
    for (int p = 0; p < P; p++) { /* idle weeks after the overlap */
        const plan_paddock *q = &w->pd[p];
        double x = v.cover_t_ha[(size_t)p * (Tw + 1) + over];
        for (int k = over; k < Tw; k++) {
            double x1 = (1.0 - 7.0 * q->senescence_per_day) * x + 7.0 * w->growth_t_ha_d[(size_t)p * Tw + k];
            warm->mow[(size_t)p * Tw + k] = x1 > q->ceiling_t_ha;
            x = x1 > q->ceiling_t_ha ? q->residual_t_ha : x1;
        }
    }
    pv_free(&v);
    return verified_cost(w, warm, NULL, 0) < HUGE_VAL ? 0 : -1;
}

/* Keeps weeks t0..t0+n-1 of the window's plan wp (of problem w). */
static void window_keep(prl_run *run, const plan_problem *w, const plan *wp, int t0, int n)
{
    int P = run->P, T = run->T, Tw = w->n_weeks;
    for (int p = 0; p < P; p++) {
        for (int m = 0; m < run->M; m++)
            for (int k = 0; k < n; k++)
                run->kept.days[((size_t)m * P + p) * T + t0 + k] = wp->days[((size_t)m * P + p) * Tw + k];
        for (int k = 0; k < n; k++)
            run->kept.mow[(size_t)p * T + t0 + k] = wp->mow[(size_t)p * Tw + k];
    }
}

/* Plans window [t0, t1) in `seconds` (<= 0: no limit) and keeps its first
 * `keep` weeks.  Returns 0, or -1 (message in msg). */
static int window_solve(prl_run *run, int t0, int t1, int keep, double seconds, char *msg, size_t cap)
{
    plan_problem w;
    plan wp, warm;
    memset(&wp, 0, sizeof wp);
    memset(&warm, 0, sizeof warm);
    if (seam_cover(run, t0) != 0 || (seam_close(run, t0), window_problem(run, t0, t1, &w) != 0))
        return snprintf(msg, cap, "rolling horizon: out of memory"), -1;
    int rc = -1;
    if (plan_alloc(&w, &wp) == 0 && plan_alloc(&w, &warm) == 0) {
        int have_warm = window_warm(run, &w, t0, &warm) == 0;
        pm_options o = {seconds > 0 ? seconds : 0, run->opt->gap, have_warm ? &warm : NULL, 0, PM_AUTO,
                        run->opt->window_weeks};
        pm_result r;
        int ok = pm_solve(&w, &o, &wp, &r) == 0 && (r.status == PM_OPTIMAL || r.status == PM_FEASIBLE);
        if (!ok) { /* no plan from the solver: the window's own baseline */
            plan b;
            ok = pb_baseline(&w, &b) == 0;
            if (ok) {
                plan_copy(&w, &b, &wp);
                plan_free(&b);
            }
        } else {
            run->rows = r.rows > run->rows ? r.rows : run->rows;
            run->cols = r.cols > run->cols ? r.cols : run->cols;
            run->binaries = r.binaries > run->binaries ? r.binaries : run->binaries;
        }
        if (ok) {
            window_keep(run, &w, &wp, t0, keep);
            plan_free(&run->last);
            run->last = wp;
            run->last_t0 = t0;
            memset(&wp, 0, sizeof wp);
            run->windows++;
            rc = 0;
        } else
            snprintf(msg, cap, "rolling horizon: no plan for weeks %d-%d (%.180s)", t0 + 1, t1, r.msg);
    } else
        snprintf(msg, cap, "rolling horizon: out of memory");
    plan_free(&wp);
    plan_free(&warm);
    plan_problem_free(&w);
    return rc;
}

/* ------------------------------------------------------------ interface */

static void run_free(prl_run *run)
{
    plan_free(&run->kept);
    plan_free(&run->last);
    free(run->cover);
    free(run->closed_to);
}

static int bad_call(const plan_problem *pb, const plan *out, pm_result *res, const char *who)
{
    if (pv_problem_valid(pb) && out && out->n_paddocks == pb->n_paddocks && out->n_mobs == pb->n_mobs &&
        out->n_weeks == pb->n_weeks && out->days && out->mow && out->supplement_t)
        return 0;
    snprintf(res->msg, sizeof res->msg, "%s: bad problem or output plan", who);
    return 1;
}

static void result_init(pm_result *res)
{
    memset(res, 0, sizeof *res);
    res->objective = (double)NAN;
    res->bound = -HUGE_VAL;
    res->gap = HUGE_VAL;
    res->status = PM_ERROR;
    res->strategy = PM_ROLLING;
}

/* The windows in turn: [0, W), [R, R + W), ... until one reaches the end,
 * whose plan is kept whole.  Returns 0, or -1 (message set). */
static int roll(prl_run *run, double t_start, double lim, pm_result *res)
{
    int T = run->T, W = run->W, R = run->R;
    int n = T <= W ? 1 : 1 + (T - W + R - 1) / R;
    for (int t0 = 0, i = 0;; t0 += R, i++) {
        int t1 = t0 + W < T ? t0 + W : T;
        double left = lim > 0 ? lim - (now_s() - t_start) : 0;
        double s = lim > 0 ? fmax(MIN_SLICE_S, left / (n - i)) : 0;
        if (run->opt->progress)
            fprintf(stderr, "\rplan: rolling, weeks %d-%d (window %d of %d)   ", t0 + 1, t1, i + 1, n);
        if (window_solve(run, t0, t1, t1 == T ? t1 - t0 : R, s, res->msg, sizeof res->msg) != 0)
            return -1;
        if (t1 == T)
            break;
    }
    if (run->opt->progress)
        fputc('\n', stderr);
    fill_supplement(run->pb, &run->kept);
    return 0;
}

/* The common start of prl_roll and prl_solve: res initialised, the
 * arguments checked (NULL when they are bad: res says why), the options
 * or defaults returned, the clock read into *t_start. */
static const pm_options *enter(const plan_problem *pb, const pm_options *opt, plan *out,
                               pm_result *res, double *t_start)
{
    static const pm_options none = {0, 0, NULL, 0, PM_ROLLING, 0};
    result_init(res);
    *t_start = now_s();
    if (bad_call(pb, out, res, "rolling horizon"))
        return NULL;
    return opt ? opt : &none;
}

int prl_roll(const plan_problem *pb, const pm_options *opt, const prl_options *ro, plan *out,
             pm_result *res)
{
    if (!res)
        return -1;
    double t_start;
    if (!(opt = enter(pb, opt, out, res, &t_start)))
        return -1;
    prl_run run;
    memset(&run, 0, sizeof run);
    run.pb = pb;
    run.opt = opt;
    run.P = pb->n_paddocks;
    run.M = pb->n_mobs;
    run.T = pb->n_weeks;
    run.W = ro && ro->window_weeks > 0 ? ro->window_weeks : PRL_WINDOW_WEEKS;
    run.R = ro && ro->roll_weeks > 0 ? ro->roll_weeks : PRL_ROLL_WEEKS;
    run.R = run.R < run.W ? run.R : run.W;
    run.tail = ro ? ro->tail : PRL_TAIL_BUDGET;
    run.last_t0 = -1;
    run.cover = malloc((size_t)run.P * sizeof *run.cover);
    run.closed_to = malloc((size_t)run.P * sizeof *run.closed_to);
    int rc = -1;
    if (!run.cover || !run.closed_to || plan_alloc(pb, &run.kept) != 0)
        snprintf(res->msg, sizeof res->msg, "rolling horizon: out of memory");
    else if (roll(&run, t_start, opt->time_limit_s, res) == 0) {
        char why[256];
        double z = verified_cost(pb, &run.kept, why, sizeof why);
        res->rows = run.rows;
        res->cols = run.cols;
        res->binaries = run.binaries;
        if (z < HUGE_VAL) {
            plan_copy(pb, &run.kept, out);
            res->status = PM_FEASIBLE;
            res->objective = z;
            snprintf(res->msg, sizeof res->msg, "rolled over %d windows of %d weeks, %d kept each", run.windows,
                     run.W, run.R);
        } else {
            res->status = PM_NO_PLAN;
            snprintf(res->msg, sizeof res->msg, "the rolled plan breaks %.200s", why);
        }
        rc = 0;
    }
    run_free(&run);
    res->seconds = now_s() - t_start;
    return rc;
}

/* Keeps plan pl (of cost z) as the best when cheaper. */
static void take_if_cheaper(const plan_problem *pb, const plan *pl, double z, plan *best, double *best_z)
{
    if (z < *best_z - 1e-9 * fmax(1.0, fabs(*best_z))) {
        plan_copy(pb, pl, best);
        *best_z = z;
    }
}

int prl_solve(const plan_problem *pb, const pm_options *opt, const prl_options *ro, plan *out,
              pm_result *res)
{
    if (!res)
        return -1;
    double t_start;
    if (!(opt = enter(pb, opt, out, res, &t_start)))
        return -1;
    double lim = opt->time_limit_s;
    plan best, rp, cp;
    memset(&rp, 0, sizeof rp);
    memset(&cp, 0, sizeof cp);
    if (pb_baseline(pb, &best) != 0) {
        snprintf(res->msg, sizeof res->msg, "rolling horizon: no baseline plan for this problem");
        return -1;
    }
    double best_z = verified_cost(pb, &best, NULL, 0);
    if (opt->warm) {
        double zw = opt->warm->n_paddocks == pb->n_paddocks && opt->warm->n_mobs == pb->n_mobs &&
                            opt->warm->n_weeks == pb->n_weeks
                        ? verified_cost(pb, opt->warm, NULL, 0)
                        : HUGE_VAL;
        res->warm = zw < HUGE_VAL ? PM_WARM_UNUSED : PM_WARM_REJECTED;
        if (zw < best_z)
            res->warm = PM_WARM_USED;
        take_if_cheaper(pb, opt->warm, zw, &best, &best_z);
    }
    int rc = -1;
    pm_result rr, cr;
    if (plan_alloc(pb, &rp) != 0 || plan_alloc(pb, &cp) != 0)
        snprintf(res->msg, sizeof res->msg, "rolling horizon: out of memory");
    else {
        pm_options o = *opt;
        o.time_limit_s = lim > 0 ? PRL_ROLL_SHARE * lim : 0;
        o.warm = NULL;
        if (prl_roll(pb, &o, ro, &rp, &rr) == 0 && rr.status == PM_FEASIBLE)
            take_if_cheaper(pb, &rp, rr.objective, &best, &best_z);
        o = *opt; /* the bound: the decomposition of the whole horizon, from the best plan */
        o.time_limit_s = lim > 0 ? fmax(MIN_SLICE_S, lim - (now_s() - t_start)) : 0;
        o.warm = &best;
        o.strategy = PM_DECOMP;
        if (pcg_solve(pb, &o, &cp, &cr) == 0) {
            res->bound = cr.bound;
            res->rows = cr.rows;
            res->cols = cr.cols;
            res->binaries = cr.binaries;
            if (cr.status == PM_OPTIMAL || cr.status == PM_FEASIBLE)
                take_if_cheaper(pb, &cp, verified_cost(pb, &cp, NULL, 0), &best, &best_z);
        }
        plan_copy(pb, &best, out);
        res->objective = best_z;
        res->bound = fmin(res->bound, best_z);
        res->gap = res->bound > -HUGE_VAL ? (best_z - res->bound) / fmax(1e-9, fabs(best_z)) : HUGE_VAL;
        res->status = best_z - res->bound <= 1e-6 * fmax(1.0, fabs(best_z)) ? PM_OPTIMAL : PM_FEASIBLE;
        if (rr.status == PM_FEASIBLE)
            snprintf(res->msg, sizeof res->msg, "rolled plan %.2f in %.1f s (%.120s); bound from the decomposition%s",
                     rr.objective, rr.seconds, rr.msg, cr.status == PM_ERROR ? " failed" : "");
        else
            snprintf(res->msg, sizeof res->msg, "no rolled plan (%.120s)", rr.msg);
        rc = 0;
    }
    plan_free(&best);
    plan_free(&rp);
    plan_free(&cp);
    res->seconds = now_s() - t_start;
    return rc;
}
