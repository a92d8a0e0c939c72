/* planverify.c - the plan verifier (plan stage): re-simulates a plan in
 * plain C and checks every row of the model in docs/planner.md.
 *
 * How it fits: the MILP (planmilp.c) and the baseline (planbase.c) both
 * produce a `plan`; this file replays it with the page's recursion and is
 * the one place that says whether a plan is legal and what it costs, so the
 * three agree by construction or the tests say where they do not.
 *
 * What it derives from the plan (docs/planner.md, "Variables"):
 *   y_mpt = (d_mpt > 0), g_pt = any mob present, e_mpt = y_mpt and not
 *   y_mp,t-1 (y_mp,-1 = 0), r_pt = x' - R_p when mowed, u = the terminal
 *   shortfall max(0, X_T sum A - sum A x_T) (u is minimised in the MILP, so
 *   it is exactly this).
 * Reading choices (where docs/planner.md leaves room):
 *   - D = min(7, max_days_per_visit), as the page's table defines it;
 *   - the `use` row is d_mpt <= min(O_pt, D) for each mob (so a day in a
 *     closed week, O_pt = 0, is reported as `use`), `visit` sums the mobs;
 *   - the domains of the variables are reported by the column's symbol:
 *     `d[m,p,t]` for days outside 0..7, `w[p,t]` for a mow flag other than
 *     0/1 (read as mowed); x >= 0 is reported as `bal[p,t]` (the balance
 *     cannot hold with a non-negative cover);
 *   - `spell[p,t]` and `rest[p,t,k]` exist only where every week they name
 *     lies inside the horizon ("weeks past the horizon are unconstrained");
 *   - density compares head with rho A_p to 1e-9 head; the terminal row is
 *     soft (u absorbs any shortfall) and is never a violation;
 *   - the optional limits lim_sup and lim_end (to PV_TOL_MASS) and lim_mow
 *     (to 1e-9 ha) are checked last, on the horizon's totals.
 * Rows are checked week by week (mob rows, then paddock rows, then the
 * spell and rest rows that start in that week), so the first violation is
 * the earliest in time.
 */
#include "planverify.h"

#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

typedef struct sim {
    const plan_problem *pb;
    const plan *pl;
    pv_result *out;
    unsigned char *y;        /* [(m * P + p) * T + t] */
    unsigned char *g;        /* [p * T + t] */
    int dmax;                /* D = min(7, max_days_per_visit) */
} sim;

#if defined(__GNUC__)
__attribute__((format(printf, 2, 3)))
#endif
static void note(pv_result *r, const char *fmt, ...)
{
    if (r->n_violations++ == 0) {
        va_list ap;
        va_start(ap, fmt);
        vsnprintf(r->first_violation, sizeof r->first_violation, fmt, ap);
        va_end(ap);
    }
}

static int finite_all(const double *v, size_t n)
{
    for (size_t i = 0; i < n; i++)
        if (!isfinite(v[i]))
            return 0;
    return 1;
}

static int paddocks_valid(const plan_problem *pb)
{
    for (int p = 0; p < pb->n_paddocks; p++) {
        const plan_paddock *q = &pb->pd[p];
        double v[5] = {q->area_ha, q->cover0_t_ha, q->residual_t_ha, q->ceiling_t_ha,
                       q->senescence_per_day};
        if (!finite_all(v, 5) || !(q->area_ha > 0))
            return 0;
    }
    return 1;
}

static int mobs_valid(const plan_problem *pb)
{
    for (int m = 0; m < pb->n_mobs; m++)
        if (pb->mob[m].head < 0 || !isfinite(pb->mob[m].demand_t_d))
            return 0;
    return 1;
}

int pv_problem_valid(const plan_problem *pb)
{
    if (!pb || pb->n_paddocks < 1 || pb->n_mobs < 0 || pb->n_weeks < 1 ||
        pb->n_weeks > PLAN_MAX_WEEKS || !pb->pd || (pb->n_mobs > 0 && !pb->mob) ||
        !pb->growth_t_ha_d || !pb->open_days)
        return 0;
    if (pb->rest_weeks < 0 || pb->spell_weeks < 0 || pb->max_days_per_visit < 0 ||
        pb->max_paddocks_per_week < 0 || pb->fixed_weeks < 0 || pb->fixed_weeks > pb->n_weeks ||
        (pb->fixed_weeks > 0 && !pb->fixed_days))
        return 0;
    double v[9] = {pb->max_head_per_ha, pb->terminal_t_ha, pb->cost_supplement_per_t,
                   pb->cost_mowing_per_ha, pb->cost_per_move, pb->penalty_terminal_per_t,
                   pb->max_supplement_t, pb->max_mowed_ha, pb->max_shortfall_t};
    if ((pb->limit_supplement && !(pb->max_supplement_t >= 0)) ||
        (pb->limit_mowing && !(pb->max_mowed_ha >= 0)) ||
        (pb->limit_shortfall && !(pb->max_shortfall_t >= 0)))
        return 0;
    return finite_all(v, 9) && paddocks_valid(pb) && mobs_valid(pb) &&
           finite_all(pb->growth_t_ha_d, (size_t)pb->n_paddocks * (size_t)pb->n_weeks);
}

static int plan_fits(const plan_problem *pb, const plan *pl)
{
    return pl && pl->n_paddocks == pb->n_paddocks && pl->n_mobs == pb->n_mobs &&
           pl->n_weeks == pb->n_weeks && pl->days && pl->mow && pl->supplement_t;
}

static int days_of(const sim *s, int m, int p, int t)
{
    return s->pl->days[((size_t)m * (size_t)s->pb->n_paddocks + (size_t)p) *
                       (size_t)s->pb->n_weeks + (size_t)t];
}

static int grazed(const sim *s, int p, int t)
{
    return s->g[(size_t)p * (size_t)s->pb->n_weeks + (size_t)t];
}

static int used(const sim *s, int m, int p, int t)
{
    return s->y[((size_t)m * (size_t)s->pb->n_paddocks + (size_t)p) *
                (size_t)s->pb->n_weeks + (size_t)t];
}

/* y_mpt = (d_mpt > 0); g_pt = any mob present. */
static void derive_presence(sim *s)
{
    const plan_problem *pb = s->pb;
    for (int m = 0; m < pb->n_mobs; m++)
        for (int p = 0; p < pb->n_paddocks; p++)
            for (int t = 0; t < pb->n_weeks; t++) {
                size_t ip = (size_t)p * (size_t)pb->n_weeks + (size_t)t;
                size_t im = ((size_t)m * (size_t)pb->n_paddocks + (size_t)p) *
                                (size_t)pb->n_weeks + (size_t)t;
                s->y[im] = days_of(s, m, p, t) > 0;
                if (s->y[im])
                    s->g[ip] = 1;
            }
}

/* d domain, cattle and use rows of one mob in one paddock and week. */
static void check_mob_paddock(sim *s, int m, int p, int t)
{
    const plan_problem *pb = s->pb;
    const char *mid = pb->mob[m].id, *pid = pb->pd[p].id;
    int d = days_of(s, m, p, t);
    int open = pb->open_days[(size_t)p * (size_t)pb->n_weeks + (size_t)t];
    int lim = open < s->dmax ? open : s->dmax;
    if (d < 0 || d > 7)
        note(s->out, "d[%s,%s,%d]: %d days, outside 0..7", mid, pid, t, d);
    if (d > 0 && pb->mob[m].is_cattle && pb->pd[p].cattle_barred)
        note(s->out, "cattle[%s,%s,%d]: cattle mob in a paddock barred to cattle (%d days)",
             mid, pid, t, d);
    if (d > 0 && d > lim)
        note(s->out, "use[%s,%s,%d]: %d days, at most %d (open %d, visit %d)", mid, pid, t, d,
             lim, open, s->dmax);
    if (t < pb->fixed_weeks) {
        int want = pb->fixed_days[((size_t)m * (size_t)pb->n_paddocks + (size_t)p) *
                                  (size_t)pb->n_weeks + (size_t)t];
        if (d != want)
            note(s->out, "keep[%s,%s,%d]: %d days, the kept plan has %d", mid, pid, t, d, want);
    }
}

/* days, feed and kmax rows of one mob-week. */
static void check_mob_week(sim *s, int m, int t)
{
    const plan_problem *pb = s->pb;
    const plan_mob *mb = &pb->mob[m];
    int sum_d = 0, n_used = 0;
    for (int p = 0; p < pb->n_paddocks; p++) {
        check_mob_paddock(s, m, p, t);
        sum_d += days_of(s, m, p, t);
        n_used += used(s, m, p, t);
    }
    if (sum_d > 7)
        note(s->out, "days[%s,%d]: %d grazing days in a 7-day week", mb->id, t, sum_d);
    for (int p = 0; p < pb->n_paddocks && n_used > 1; p++)
        if (used(s, m, p, t) && plan_part_week(pb, p, t))
            note(s->out, "part[%s,%s,%d]: paddock free on part of the week only, with %d other paddocks",
                 mb->id, pb->pd[p].id, t, n_used - 1);
    double sup = s->pl->supplement_t[(size_t)m * (size_t)pb->n_weeks + (size_t)t];
    double need = 7.0 * mb->demand_t_d - mb->demand_t_d * (double)sum_d;
    if (!(fabs(sup - need) <= PV_TOL_MASS))
        note(s->out, "feed[%s,%d]: supplement %.6g t DM, demand less pasture is %.6g t DM",
             mb->id, t, sup, need);
    if (n_used > pb->max_paddocks_per_week)
        note(s->out, "kmax[%s,%d]: %d paddocks, at most %d", mb->id, t, n_used,
             pb->max_paddocks_per_week);
}

/* one, dens and visit rows of one paddock-week. */
static void check_sharing(sim *s, int p, int t)
{
    const plan_problem *pb = s->pb;
    const plan_paddock *q = &pb->pd[p];
    int n_mobs = 0, sum_d = 0;
    double head = 0;
    for (int m = 0; m < pb->n_mobs; m++) {
        n_mobs += used(s, m, p, t);
        head += used(s, m, p, t) ? (double)pb->mob[m].head : 0.0;
        sum_d += days_of(s, m, p, t);
    }
    if (!pb->share_paddocks && n_mobs > 1)
        note(s->out, "one[%s,%d]: %d mobs, sharing not allowed", q->id, t, n_mobs);
    if (pb->max_head_per_ha > 0 && head > pb->max_head_per_ha * q->area_ha + 1e-9)
        note(s->out, "dens[%s,%d]: %.0f head on %.6g ha, at most %.6g head/ha", q->id, t, head,
             q->area_ha, pb->max_head_per_ha);
    if (sum_d > s->dmax)
        note(s->out, "visit[%s,%d]: %d grazing days, at most %d", q->id, t, sum_d, s->dmax);
}

/* The week's cover step (bal, mowlo) and the end-of-week rows (res, ceil);
 * writes x_p,t+1 and returns 1 when the paddock was mowed. */
static int step_cover(sim *s, int p, int t)
{
    const plan_problem *pb = s->pb;
    const plan_paddock *q = &pb->pd[p];
    size_t ip = (size_t)p * (size_t)pb->n_weeks + (size_t)t;
    double *x = &s->out->cover_t_ha[(size_t)p * (size_t)(pb->n_weeks + 1)];
    double eaten = 0;
    for (int m = 0; m < pb->n_mobs; m++)
        eaten += pb->mob[m].demand_t_d * (double)days_of(s, m, p, t);
    double xp = (1.0 - 7.0 * q->senescence_per_day) * x[t] + 7.0 * pb->growth_t_ha_d[ip] -
                eaten / q->area_ha;
    int mow = s->pl->mow[ip];
    if (mow > 1)
        note(s->out, "w[%s,%d]: mow flag %d, not 0 or 1", q->id, t, mow);
    if (mow && xp < q->residual_t_ha - PV_TOL_COVER)
        note(s->out, "mowlo[%s,%d]: cover before mowing %.6g t DM/ha, below residual %.6g",
             q->id, t, xp, q->residual_t_ha);
    x[t + 1] = mow ? q->residual_t_ha : xp;
    if (x[t + 1] < -PV_TOL_COVER)
        note(s->out, "bal[%s,%d]: end cover %.6g t DM/ha, below 0", q->id, t, x[t + 1]);
    if (grazed(s, p, t) && x[t + 1] < q->residual_t_ha - PV_TOL_COVER)
        note(s->out, "res[%s,%d]: grazed, end cover %.6g t DM/ha below residual %.6g", q->id, t,
             x[t + 1], q->residual_t_ha);
    if (x[t + 1] > q->ceiling_t_ha + PV_TOL_COVER)
        note(s->out, "ceil[%s,%d]: end cover %.6g t DM/ha above ceiling %.6g", q->id, t,
             x[t + 1], q->ceiling_t_ha);
    return mow != 0;
}

/* spell[p,t] and rest[p,t,k] rows starting in week t (inside the horizon). */
static void check_spell_rest(sim *s, int p, int t)
{
    const plan_problem *pb = s->pb;
    int S = pb->spell_weeks, T = pb->n_weeks;
    if (t + S <= T - 1) {
        int n = 0;
        for (int k = 0; k <= S; k++)
            n += grazed(s, p, t + k);
        if (n > S)
            note(s->out, "spell[%s,%d]: grazed %d weeks running from week %d, at most %d",
                 pb->pd[p].id, t, n, t, S);
    }
    if (t + 1 >= T || !grazed(s, p, t) || grazed(s, p, t + 1))
        return;
    for (int k = 2; k <= pb->rest_weeks && t + k <= T - 1; k++)
        if (grazed(s, p, t + k))
            note(s->out, "rest[%s,%d,%d]: spell ended in week %d, grazed again in week %d, "
                         "rest %d weeks", pb->pd[p].id, t, k, t, t + k, pb->rest_weeks);
}

/* Moves, supplement and the objective's terms (x_T already simulated). */
static void add_costs(sim *s, double mowed_ha)
{
    const plan_problem *pb = s->pb;
    pv_result *r = s->out;
    int T = pb->n_weeks;
    for (int m = 0; m < pb->n_mobs; m++)
        for (int t = 0; t < T; t++) {
            r->supplement_t += s->pl->supplement_t[(size_t)m * (size_t)T + (size_t)t];
            for (int p = 0; p < pb->n_paddocks; p++)
                r->moves += used(s, m, p, t) && !(t > 0 && used(s, m, p, t - 1));
        }
    double area = 0, end = 0;
    for (int p = 0; p < pb->n_paddocks; p++) {
        area += pb->pd[p].area_ha;
        end += pb->pd[p].area_ha * r->cover_t_ha[(size_t)p * (size_t)(T + 1) + (size_t)T];
    }
    double u = pb->terminal_t_ha * area - end;
    r->terminal_shortfall_t = u > 0 ? u : 0;
    r->mowed_ha = mowed_ha;
    r->cost_supplement = pb->cost_supplement_per_t * r->supplement_t;
    r->cost_mowing = pb->cost_mowing_per_ha * mowed_ha;
    r->cost_moves = pb->cost_per_move * (double)r->moves;
    r->penalty_terminal = pb->penalty_terminal_per_t * r->terminal_shortfall_t;
    r->cost_total = r->cost_supplement + r->cost_mowing + r->cost_moves + r->penalty_terminal;
}

/* The optional limits (docs/planner.md, "Limits"), after the totals. */
static void check_limits(sim *s)
{
    const plan_problem *pb = s->pb;
    pv_result *r = s->out;
    if (pb->limit_supplement && r->supplement_t > pb->max_supplement_t + PV_TOL_MASS)
        note(r, "lim_sup: %.6f t DM of supplement over the horizon, limit %.6f", r->supplement_t,
             pb->max_supplement_t);
    if (pb->limit_mowing && r->mowed_ha > pb->max_mowed_ha + 1e-9)
        note(r, "lim_mow: %.6f ha mowed over the horizon, limit %.6f", r->mowed_ha, pb->max_mowed_ha);
    if (pb->limit_shortfall && r->terminal_shortfall_t > pb->max_shortfall_t + PV_TOL_MASS)
        note(r, "lim_end: %.6f t DM short of the end-cover target, limit %.6f", r->terminal_shortfall_t,
             pb->max_shortfall_t);
}

static void run_weeks(sim *s)
{
    const plan_problem *pb = s->pb;
    double mowed_ha = 0;
    for (int p = 0; p < pb->n_paddocks; p++)
        s->out->cover_t_ha[(size_t)p * (size_t)(pb->n_weeks + 1)] = pb->pd[p].cover0_t_ha;
    for (int t = 0; t < pb->n_weeks; t++) {
        for (int m = 0; m < pb->n_mobs; m++)
            check_mob_week(s, m, t);
        for (int p = 0; p < pb->n_paddocks; p++) {
            check_sharing(s, p, t);
            if (step_cover(s, p, t))
                mowed_ha += pb->pd[p].area_ha;
            check_spell_rest(s, p, t);
        }
    }
    add_costs(s, mowed_ha);
    check_limits(s);
}

int pv_simulate(const plan_problem *pb, const plan *pl, pv_result *out)
{
    if (!out)
        return -1;
    memset(out, 0, sizeof *out);
    if (!pv_problem_valid(pb) || !plan_fits(pb, pl))
        return -1;
    size_t P = (size_t)pb->n_paddocks, T = (size_t)pb->n_weeks, M = (size_t)pb->n_mobs;
    sim s = {pb, pl, out, calloc(M * P * T + 1, 1), calloc(P * T, 1),
             plan_days_max(pb)};
    out->cover_t_ha = calloc(P * (T + 1), sizeof *out->cover_t_ha);
    if (!s.y || !s.g || !out->cover_t_ha) {
        free(s.y);
        free(s.g);
        pv_free(out);
        return -1;
    }
    derive_presence(&s);
    run_weeks(&s);
    free(s.y);
    free(s.g);
    return out->n_violations > 0;
}

void pv_free(pv_result *r)
{
    if (!r)
        return;
    free(r->cover_t_ha);
    memset(r, 0, sizeof *r);
}
