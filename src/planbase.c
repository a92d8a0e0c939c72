/* planbase.c - the rule-of-thumb baseline rotation (plan stage).
 *
 * How it fits: planmilp.c solves the rotation exactly; this file builds
 * the plan a grazier would draw up by hand (common practice, no source),
 * used as the MILP's warm start and as the yardstick in reports.  It
 * follows the cover recursion of docs/planner.md, and pv_simulate()
 * (planverify.c) accepts every plan it returns.
 *
 * The rule, week by week (t = 0, 1, ...) and mob by mob in index order:
 *  1. Stay: a mob that ended last week in paddock q stays there while it
 *     can (no move).
 *  2. Move: then, while the mob has used fewer than K paddocks this week
 *     and has days left, it moves to the rested paddock with the most
 *     cover at the start of the week (x_pt, t DM/ha; ties to the lower
 *     index).
 *  3. In a paddock it stays d days, the largest whole number that keeps
 *     the week's end cover at or above the residual,
 *         d <= (x_pt + 7 G_pt - 7 s_p x_pt - R_p) A_p / I_m,
 *     limited by the open days O_pt, D = min(7, max_days_per_visit) and the
 *     days of the week not yet spent elsewhere.  (The quotient is floored
 *     after multiplying by 1 + 1e-12, so that an exact whole number of days
 *     is not lost to rounding; the end cover then lies below R_p by at most
 *     1e-12 of the available cover, far inside the verifier's 1e-6.)
 *  4. The rest of the week's demand is supplement:
 *         sup_mt = 7 I_m - I_m sum_p d_mpt.
 *  5. After all mobs, a paddock whose week would end above its ceiling
 *     (x' > C_p) is mowed, and its week ends at R_p.
 * Choices where the rule of thumb is silent or the rules force a change:
 *  - "Rested" and "can" mean every rule of docs/planner.md holds: the
 *    paddock is not taken by another mob this week (the baseline never
 *    shares a paddock, even where sharing is allowed), cattle do not enter
 *    barred paddocks, the mob's head fit the density limit, the spell row
 *    ending this week (the S weeks before grazed) and the rest rows whose
 *    spell ended in week t-k (k = 2..L) allow grazing, and d >= 1.  Weeks
 *    after t are still ungrazed when week t is decided, so these are the
 *    only rows week t can break.
 *  - A mob with zero demand stays in the yard (nothing to gain).
 *  - Economics, so that grazing does not cost more than it saves: a tonne
 *    eaten in week t saves c_s of supplement but may lower the end cover by
 *    up to f = (1 - 7 s_p)^(T-1-t) t (what senescence would have left of
 *    it).  At the start of each week the baseline works out the surplus:
 *    the end total sum_p A_p x_pT if nothing more were grazed (mowing by
 *    step 5) less the target X_T sum_p A_p; each grazing decision uses up
 *    f x (t eaten) of it, and the part beyond what is left is charged at
 *    c_T (never when X_T <= 0: there is no shortfall to make).  A mob
 *    stays only when this net saving is >= 0 and enters (a move) only when
 *    it is >= c_v, the move paying for itself.  Days are not reduced to
 *    make a stay or a move pay: it is the step-3 number or nothing.
 *  - A paddock free on part of the week only (maintenance, keep-off,
 *    recorded rest) is the mob's only paddock that week (row part).
 *  - Kept weeks (plan.h fixed_days, `plan --keep`) are copied as they are,
 *    in both plans, before the rule takes over.
 *  - Finally, the rotation is compared (by pv_simulate) with the yard plan
 *    (all supplement, mowing where step 5 says), and the cheaper is
 *    returned (the rotation on a tie).  Mowing interplay (a paddock grazed
 *    lightly misses a mowing the yard plan makes and ends its horizon
 *    higher or lower) means the guards above cannot promise this alone.
 */
#include "planbase.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "planverify.h"

typedef struct base {
    const plan_problem *pb;
    plan *pl;
    double *x;               /* [p * (T + 1) + t], start of week t */
    unsigned char *g;        /* [p * T + t], grazed */
    unsigned char *taken;    /* [p], used by some mob this week */
    int *cur;                /* [m], paddock the mob ended last week in, or -1 */
    int dmax;                /* D */
    double surplus;          /* end total above the target not yet eaten
                                into, t DM (file comment, "Economics") */
} base;

static size_t pt(const plan_problem *pb, int p, int t)
{
    return (size_t)p * (size_t)pb->n_weeks + (size_t)t;
}

static int *days_cell(base *b, int m, int p, int t)
{
    const plan_problem *pb = b->pb;
    return &b->pl->days[((size_t)m * (size_t)pb->n_paddocks + (size_t)p) *
                        (size_t)pb->n_weeks + (size_t)t];
}

static int paddock_data_legal(const plan_problem *pb, int p)
{
    const plan_paddock *q = &pb->pd[p];
    if (q->senescence_per_day < 0 || 7.0 * q->senescence_per_day > 1.0 ||
        q->cover0_t_ha < 0 || q->residual_t_ha < 0 || q->residual_t_ha > q->ceiling_t_ha)
        return 0;
    for (int t = 0; t < pb->n_weeks; t++)
        if (pb->growth_t_ha_d[pt(pb, p, t)] < 0 || pb->open_days[pt(pb, p, t)] < 0 ||
            pb->open_days[pt(pb, p, t)] > 7)
            return 0;
    return 1;
}

/* Data for which the yard plan is legal (see planbase.h). */
static int problem_legal(const plan_problem *pb)
{
    if (!pv_problem_valid(pb))
        return 0;
    for (int p = 0; p < pb->n_paddocks; p++)
        if (!paddock_data_legal(pb, p))
            return 0;
    for (int m = 0; m < pb->n_mobs; m++)
        if (pb->mob[m].demand_t_d < 0)
            return 0;
    return 1;
}

/* The week's cover before grazing and mowing, t DM/ha. */
static double cover_ungrazed(const base *b, int p, int t)
{
    const plan_paddock *q = &b->pb->pd[p];
    double x = b->x[(size_t)p * (size_t)(b->pb->n_weeks + 1) + (size_t)t];
    return (1.0 - 7.0 * q->senescence_per_day) * x + 7.0 * b->pb->growth_t_ha_d[pt(b->pb, p, t)];
}

/* Spell row ending in week t and rest rows reaching week t allow grazing. */
static int rested(const base *b, int p, int t)
{
    const plan_problem *pb = b->pb;
    int S = pb->spell_weeks;
    if (t - S >= 0) {
        int n = 0;
        for (int k = 1; k <= S; k++)
            n += b->g[pt(pb, p, t - k)];
        if (n + 1 > S)
            return 0;
    }
    for (int k = 2; k <= pb->rest_weeks && t - k >= 0; k++)
        if (b->g[pt(pb, p, t - k)] && !b->g[pt(pb, p, t - k + 1)])
            return 0;
    return 1;
}

/* Paddocks mob m already uses in week t; *part = 1 when one of them is
 * free on part of the week only (plan.h plan_part_week). */
static int used_this_week(const base *b, int m, int t, int *part)
{
    const plan_problem *pb = b->pb;
    int n = 0;
    *part = 0;
    for (int q = 0; q < pb->n_paddocks; q++)
        if (b->pl->days[((size_t)m * (size_t)pb->n_paddocks + (size_t)q) * (size_t)pb->n_weeks +
                        (size_t)t] > 0) {
            n++;
            *part |= plan_part_week(pb, q, t);
        }
    return n;
}

static int may_enter(const base *b, int m, int p, int t)
{
    const plan_problem *pb = b->pb;
    const plan_mob *mb = &pb->mob[m];
    if (b->taken[p] || (mb->is_cattle && pb->pd[p].cattle_barred))
        return 0;
    int part, n = used_this_week(b, m, t, &part);
    if (part || (n > 0 && plan_part_week(pb, p, t)))
        return 0; /* part[m,p,t] */
    if (pb->max_head_per_ha > 0 &&
        (double)mb->head > pb->max_head_per_ha * pb->pd[p].area_ha + 1e-9)
        return 0;
    return rested(b, p, t);
}

/* Step 3: whole days mob m can spend in p in week t, with `left` days of
 * the week still free. */
static int days_can(const base *b, int m, int p, int t, int left)
{
    const plan_problem *pb = b->pb;
    int open = pb->open_days[pt(pb, p, t)];
    int lim = open < b->dmax ? open : b->dmax;
    lim = lim < left ? lim : left;
    double avail = (cover_ungrazed(b, p, t) - pb->pd[p].residual_t_ha) * pb->pd[p].area_ha;
    if (lim <= 0 || !(avail > 0))
        return 0;
    double q = floor(avail / pb->mob[m].demand_t_d * (1.0 + 1e-12));
    return q >= (double)lim ? lim : (int)q;
}

/* End total sum_p A_p x_pT, t DM, if nothing more is grazed from week t
 * on (mowing by step 5), less the target X_T sum_p A_p. */
static double end_surplus(const base *b, int t)
{
    const plan_problem *pb = b->pb;
    double end = 0, area = 0;
    for (int p = 0; p < pb->n_paddocks; p++) {
        const plan_paddock *q = &pb->pd[p];
        double x = b->x[(size_t)p * (size_t)(pb->n_weeks + 1) + (size_t)t];
        for (int k = t; k < pb->n_weeks; k++) {
            x = (1.0 - 7.0 * q->senescence_per_day) * x + 7.0 * pb->growth_t_ha_d[pt(pb, p, k)];
            x = x > q->ceiling_t_ha ? q->residual_t_ha : x;
        }
        end += q->area_ha * x;
        area += q->area_ha;
    }
    return end - pb->terminal_t_ha * area;
}

/* Share of a tonne eaten in paddock p in week t still there at the end had
 * it not been eaten: f = (1 - 7 s_p)^(T-1-t). */
static double end_share(const base *b, int p, int t)
{
    const plan_problem *pb = b->pb;
    return pow(1.0 - 7.0 * pb->pd[p].senescence_per_day, (double)(pb->n_weeks - 1 - t));
}

/* Net saving of mob m eating d days in paddock p in week t: supplement
 * saved less the terminal penalty its end-cover loss may cause beyond the
 * surplus left (file comment, "Economics"). */
static double net_saving(const base *b, int m, int p, int t, int d)
{
    const plan_problem *pb = b->pb;
    double q = pb->mob[m].demand_t_d * (double)d;
    double saved = pb->cost_supplement_per_t * q;
    if (!(pb->terminal_t_ha > 0))
        return saved;
    double room = b->surplus > 0 ? b->surplus : 0.0;
    double over = end_share(b, p, t) * q - room;
    return saved - pb->penalty_terminal_per_t * (over > 0 ? over : 0.0);
}

/* Step 2: the rested paddock with the most cover where the move pays;
 * -1 if none.  *d gets its days. */
static int best_move(const base *b, int m, int t, int left, int *d)
{
    const plan_problem *pb = b->pb;
    int best = -1;
    double best_x = 0;
    for (int p = 0; p < pb->n_paddocks; p++) {
        if (!may_enter(b, m, p, t))
            continue;
        int n = days_can(b, m, p, t, left);
        if (n < 1 || !(net_saving(b, m, p, t, n) >= pb->cost_per_move))
            continue;
        double x = b->x[(size_t)p * (size_t)(pb->n_weeks + 1) + (size_t)t];
        if (best < 0 || x > best_x) {
            best = p;
            best_x = x;
            *d = n;
        }
    }
    return best;
}

static void graze(base *b, int m, int p, int t, int d)
{
    *days_cell(b, m, p, t) = d;
    b->surplus -= end_share(b, p, t) * b->pb->mob[m].demand_t_d * (double)d;
    b->taken[p] = 1;
    b->g[pt(b->pb, p, t)] = 1;
}

/* Steps 1, 2 and 4 for one mob-week. */
static void place_mob(base *b, int m, int t)
{
    const plan_problem *pb = b->pb;
    double I = pb->mob[m].demand_t_d;
    int left = 7, k = 0, last = -1, q = b->cur[m];
    if (I > 0 && q >= 0 && k < pb->max_paddocks_per_week && may_enter(b, m, q, t)) {
        int d = days_can(b, m, q, t, left);
        if (d > 0 && net_saving(b, m, q, t, d) >= 0) {
            graze(b, m, q, t, d);
            left -= d;
            k++;
            last = q;
        }
    }
    while (I > 0 && k < pb->max_paddocks_per_week && left > 0) {
        int d = 0, p = best_move(b, m, t, left, &d);
        if (p < 0)
            break;
        graze(b, m, p, t, d);
        left -= d;
        k++;
        last = p;
    }
    b->cur[m] = last;
    b->pl->supplement_t[(size_t)m * (size_t)pb->n_weeks + (size_t)t] =
        7.0 * I - I * (double)(7 - left);
}

/* A kept week (plan.h fixed_days): the mob grazes what the kept plan says,
 * whatever the rule of thumb would do. */
static void place_fixed(base *b, int m, int t)
{
    const plan_problem *pb = b->pb;
    int used = 0, last = -1;
    for (int p = 0; p < pb->n_paddocks; p++) {
        int d = pb->fixed_days[((size_t)m * (size_t)pb->n_paddocks + (size_t)p) *
                               (size_t)pb->n_weeks + (size_t)t];
        if (d <= 0)
            continue;
        graze(b, m, p, t, d);
        used += d;
        last = p;
    }
    b->cur[m] = last;
    double I = pb->mob[m].demand_t_d;
    b->pl->supplement_t[(size_t)m * (size_t)pb->n_weeks + (size_t)t] = 7.0 * I - I * (double)used;
}

/* Step 5 for one paddock-week: the end cover, mowing above the ceiling. */
static void end_week(base *b, int p, int t)
{
    const plan_problem *pb = b->pb;
    const plan_paddock *q = &pb->pd[p];
    double eaten = 0;
    for (int m = 0; m < pb->n_mobs; m++)
        eaten += pb->mob[m].demand_t_d * (double)*days_cell(b, m, p, t);
    double xp = cover_ungrazed(b, p, t) - eaten / q->area_ha;
    int mow = xp > q->ceiling_t_ha;
    b->pl->mow[pt(pb, p, t)] = (unsigned char)mow;
    b->x[(size_t)p * (size_t)(pb->n_weeks + 1) + (size_t)t + 1] = mow ? q->residual_t_ha : xp;
}

/* Builds the rotation (grazing on) or the yard plan (grazing off) into
 * b->pl, already allocated and zeroed. */
static void build(base *b, int grazing)
{
    const plan_problem *pb = b->pb;
    for (int p = 0; p < pb->n_paddocks; p++)
        b->x[(size_t)p * (size_t)(pb->n_weeks + 1)] = pb->pd[p].cover0_t_ha;
    for (int m = 0; m < pb->n_mobs; m++)
        b->cur[m] = -1;
    for (int t = 0; t < pb->n_weeks; t++) {
        memset(b->taken, 0, (size_t)pb->n_paddocks);
        b->surplus = end_surplus(b, t);
        for (int m = 0; m < pb->n_mobs; m++) {
            if (t < pb->fixed_weeks)
                place_fixed(b, m, t);
            else if (grazing)
                place_mob(b, m, t);
            else
                b->pl->supplement_t[(size_t)m * (size_t)pb->n_weeks + (size_t)t] =
                    7.0 * pb->mob[m].demand_t_d;
        }
        for (int p = 0; p < pb->n_paddocks; p++)
            end_week(b, p, t);
    }
}

/* Total cost of a plan by the verifier; *ok = 0 when it cannot read it. */
static double plan_cost(const plan_problem *pb, const plan *pl, int *ok)
{
    pv_result r;
    int rc = pv_simulate(pb, pl, &r);
    double c = r.cost_total;
    pv_free(&r);
    *ok = rc >= 0;
    return c;
}

/* Builds both plans and keeps the cheaper in *out. */
static int build_and_choose(base *b, plan *out)
{
    const plan_problem *pb = b->pb;
    plan yard;
    if (plan_alloc(pb, &yard) < 0)
        return -1;
    b->pl = &yard;
    build(b, 0);
    memset(b->g, 0, (size_t)pb->n_paddocks * (size_t)pb->n_weeks);
    b->pl = out;
    build(b, 1);
    int ok_r = 0, ok_y = 0;
    double c_rot = plan_cost(pb, out, &ok_r), c_yard = plan_cost(pb, &yard, &ok_y);
    if (!ok_r || !ok_y) {
        plan_free(&yard);
        return -1;
    }
    if (c_yard < c_rot) {
        plan_free(out);
        *out = yard;
    } else {
        plan_free(&yard);
    }
    return 0;
}

int pb_baseline(const plan_problem *pb, plan *out)
{
    if (!out)
        return -1;
    memset(out, 0, sizeof *out);
    if (!problem_legal(pb) || plan_alloc(pb, out) < 0)
        return -1;
    size_t P = (size_t)pb->n_paddocks, T = (size_t)pb->n_weeks;
    base b = {pb, out, calloc(P * (T + 1), sizeof(double)), calloc(P * T, 1), calloc(P, 1),
              calloc((size_t)pb->n_mobs + 1, sizeof(int)),
              plan_days_max(pb), 0.0};
    int rc = -1;
    if (b.x && b.g && b.taken && b.cur)
        rc = build_and_choose(&b, out);
    free(b.x);
    free(b.g);
    free(b.taken);
    free(b.cur);
    if (rc < 0)
        plan_free(out);
    return rc;
}
