/* test_planmilp.c - the GLPK model of docs/planner.md against hand-worked
 * optima, against brute force over every plan of tiny instances, against
 * glpsol reading the exported model, and the plans it returns against the
 * page's rules.
 *
 * doc_cost() below is this test's own reading of docs/planner.md (the cover
 * recursion of "The verifier's simulation" and every row of
 * "Constraints"), written from the page and not from planmilp.c; with the
 * one addition planmilp.h states (a mob is in a paddock only on days it
 * grazes it: y = [d > 0], which is how a plan of days is read anyway).
 */
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "plan.h"
#include "planmilp.h"
#include "rgtest.h"
#include "plangen.h"

#define TOL 1e-6 /* the page's tolerance, t DM/ha or t DM */

/* ------------------------------------------------------------ problems */

/* An empty problem of P paddocks, M mobs, T weeks: every week open,
 * no growth, no rules beyond D = 7, S = 1, L = 1, K = 1. */
static void make_problem(plan_problem *pb, int P, int M, int T)
{
    pg_alloc(pb, P, M, T, 0);
    for (int i = 0; i < P * T; i++)
        pb->open_days[i] = 7;
    for (int p = 0; p < P; p++)
        snprintf(pb->pd[p].id, PLAN_ID_LEN, "P%02d", p + 1);
    for (int m = 0; m < M; m++)
        snprintf(pb->mob[m].id, PLAN_ID_LEN, "M%d", m + 1);
    pb->rest_weeks = 1;
    pb->spell_weeks = 1;
    pb->max_days_per_visit = 7;
    pb->max_paddocks_per_week = 1;
}

static int *days_at(const plan *pl, int m, int p, int t)
{
    return &pl->days[(m * pl->n_paddocks + p) * pl->n_weeks + t];
}

/* ----------------------------------------- the page, read independently */

/* Grazing days and their rules (everything but cover): use, cattle
 * clearance, feed, days, one, kmax, dens, visit, spell, rest.  Fills
 * g[p * T + t]; returns 0, or -1 when a rule breaks. */
static int doc_days(const plan_problem *pb, const plan *pl, int *g)
{
    int P = pb->n_paddocks, M = pb->n_mobs, T = pb->n_weeks;
    int D = pb->max_days_per_visit < 7 ? pb->max_days_per_visit : 7;
    memset(g, 0, (size_t)(P * T) * sizeof *g);
    for (int t = 0; t < T; t++) {
        for (int m = 0; m < M; m++) {
            int total = 0, used = 0;
            for (int p = 0; p < P; p++) {
                int d = *days_at(pl, m, p, t), o = pb->open_days[p * T + t];
                if (d < 0 || d > (o < D ? o : D))
                    return -1; /* use[m,p,t] */
                if (d > 0 && pb->mob[m].is_cattle && pb->pd[p].cattle_barred)
                    return -1; /* cattle clearance */
                total += d;
                used += d > 0;
                if (d > 0)
                    g[p * T + t] = 1;
            }
            double sup = pb->mob[m].demand_t_d * (7 - total);
            if (total > 7 || used > pb->max_paddocks_per_week) /* days, kmax */
                return -1;
            if (fabs(pl->supplement_t[m * T + t] - sup) > TOL) /* feed */
                return -1;
        }
        for (int p = 0; p < P; p++) {
            int mobs = 0, head = 0, days = 0;
            for (int m = 0; m < M; m++) {
                int d = *days_at(pl, m, p, t);
                mobs += d > 0;
                head += d > 0 ? pb->mob[m].head : 0;
                days += d;
            }
            if (!pb->share_paddocks && mobs > 1) /* one */
                return -1;
            if (pb->max_head_per_ha > 0 && head > pb->max_head_per_ha * pb->pd[p].area_ha + TOL)
                return -1; /* dens */
            if (days > D) /* visit */
                return -1;
        }
    }
    for (int p = 0; p < P; p++)
        for (int t = 0; t < T; t++) {
            int run = 0;
            for (int j = 0; j <= pb->spell_weeks && t + pb->spell_weeks < T; j++)
                run += g[p * T + t + j];
            if (t + pb->spell_weeks < T && run > pb->spell_weeks) /* spell */
                return -1;
            for (int k = 2; k <= pb->rest_weeks && t + k < T; k++)
                if (g[p * T + t] - g[p * T + t + 1] + g[p * T + t + k] > 1) /* rest */
                    return -1;
        }
    return 0;
}

/* Cover of paddock p week by week (bal, res, ceil, mowing rows, x >= 0);
 * returns the end cover, or -1 when a rule breaks. */
static double doc_cover(const plan_problem *pb, const plan *pl, const int *g, int p)
{
    const plan_paddock *pd = &pb->pd[p];
    int T = pb->n_weeks;
    double x = pd->cover0_t_ha;
    for (int t = 0; t < T; t++) {
        double eaten = 0;
        for (int m = 0; m < pb->n_mobs; m++)
            eaten += pb->mob[m].demand_t_d * *days_at(pl, m, p, t);
        double x1 = (1 - 7 * pd->senescence_per_day) * x + 7 * pb->growth_t_ha_d[p * T + t] -
                    eaten / pd->area_ha;
        if (pl->mow[p * T + t]) {
            if (x1 < pd->residual_t_ha - TOL) /* mowlo: r would be negative */
                return -1;
            x1 = pd->residual_t_ha;
        }
        if (x1 < -TOL || x1 > pd->ceiling_t_ha + TOL ||
            (g[p * T + t] && x1 < pd->residual_t_ha - TOL))
            return -1;
        x = x1;
    }
    return x;
}

/* The page's objective for plan pl; returns 0, or -1 when a rule breaks. */
static int doc_cost(const plan_problem *pb, const plan *pl, double *cost)
{
    int P = pb->n_paddocks, M = pb->n_mobs, T = pb->n_weeks;
    int g[PLAN_MAX_WEEKS * 8];
    assert_true(P * T <= (int)(sizeof g / sizeof g[0]));
    if (doc_days(pb, pl, g) != 0)
        return -1;
    double area = 0, end = 0, z = 0;
    for (int p = 0; p < P; p++) {
        double x = doc_cover(pb, pl, g, p);
        if (x < 0)
            return -1;
        area += pb->pd[p].area_ha;
        end += pb->pd[p].area_ha * x;
        for (int t = 0; t < T; t++)
            z += pb->cost_mowing_per_ha * pb->pd[p].area_ha * pl->mow[p * T + t];
    }
    for (int m = 0; m < M; m++)
        for (int t = 0; t < T; t++) {
            z += pb->cost_supplement_per_t * pl->supplement_t[m * T + t];
            for (int p = 0; p < P; p++) /* move: enters p in week t */
                z += pb->cost_per_move * (*days_at(pl, m, p, t) > 0 &&
                                          (t == 0 || *days_at(pl, m, p, t - 1) == 0));
        }
    double u = pb->terminal_t_ha * area - end;
    *cost = z + pb->penalty_terminal_per_t * (u > 0 ? u : 0);
    return 0;
}

/* Supplement that meets feed[m,t] for the plan's days. */
static void fill_supplement(const plan_problem *pb, plan *pl)
{
    for (int m = 0; m < pb->n_mobs; m++)
        for (int t = 0; t < pb->n_weeks; t++) {
            int total = 0;
            for (int p = 0; p < pb->n_paddocks; p++)
                total += *days_at(pl, m, p, t);
            pl->supplement_t[m * pb->n_weeks + t] = pb->mob[m].demand_t_d * (7 - total);
        }
}

/* ---------------------------------------------------------- brute force */

/* Most days of cell i = (m * P + p) * T + t, by use[m,p,t] and cattle
 * clearance (docs/planner.md). */
static int cell_cap(const plan_problem *pb, int i)
{
    int T = pb->n_weeks, P = pb->n_paddocks;
    int t = i % T, p = (i / T) % P, m = i / (T * P);
    int D = pb->max_days_per_visit < 7 ? pb->max_days_per_visit : 7, o = pb->open_days[p * T + t];
    if (pb->mob[m].is_cattle && pb->pd[p].cattle_barred)
        return 0;
    return o < D ? o : D;
}

/* Every plan: days of every cell in 0..cap, every mowing pattern; the
 * cheapest that keeps every rule, into best.  Returns its cost. */
static double brute_force(const plan_problem *pb, plan *best)
{
    int cells = pb->n_mobs * pb->n_paddocks * pb->n_weeks, pt = pb->n_paddocks * pb->n_weeks;
    plan cur;
    assert_int_equal(plan_alloc(pb, &cur), 0);
    double z_best = HUGE_VAL;
    int g[PLAN_MAX_WEEKS * 8];
    for (;;) {
        fill_supplement(pb, &cur);
        if (doc_days(pb, &cur, g) == 0)
            for (long mask = 0; mask < (1L << pt); mask++) {
                for (int i = 0; i < pt; i++)
                    cur.mow[i] = (unsigned char)((mask >> i) & 1);
                double z;
                if (doc_cost(pb, &cur, &z) == 0 && z < z_best - 1e-12) {
                    z_best = z;
                    memcpy(best->days, cur.days, (size_t)cells * sizeof *cur.days);
                    memcpy(best->mow, cur.mow, (size_t)pt);
                    memcpy(best->supplement_t, cur.supplement_t,
                           (size_t)(pb->n_mobs * pb->n_weeks) * sizeof *cur.supplement_t);
                }
            }
        int i = 0; /* next days assignment (odometer) */
        while (i < cells && cur.days[i] == cell_cap(pb, i))
            cur.days[i++] = 0;
        if (i == cells)
            break;
        cur.days[i]++;
    }
    plan_free(&cur);
    return z_best;
}

/* Number of plans brute_force tries. */
static double plans_to_try(const plan_problem *pb)
{
    double n = pow(2.0, pb->n_paddocks * pb->n_weeks);
    for (int i = 0; i < pb->n_mobs * pb->n_paddocks * pb->n_weeks; i++)
        n *= cell_cap(pb, i) + 1;
    return n;
}

/* ------------------------------------------------------------- helpers */

/* Solves pb with opt and checks what every solve must give: status
 * optimal, the plan keeps every rule (doc_cost) and costs what the solver
 * says, and the bound equals the objective. */
static double solve_checked(const plan_problem *pb, const pm_options *opt, plan *out,
                            pm_result *res)
{
    assert_int_equal(plan_alloc(pb, out), 0);
    assert_int_equal(pm_solve(pb, opt, out, res), 0);
    if (res->status != PM_OPTIMAL)
        print_error("status %d: %s\n", res->status, res->msg);
    assert_int_equal(res->status, PM_OPTIMAL);
    if (res->warm != PM_WARM_REJECTED)
        assert_string_equal(res->msg, "");
    double z;
    assert_int_equal(doc_cost(pb, out, &z), 0);
    assert_close(z, res->objective, TOL * fmax(1.0, fabs(z)));
    assert_close(res->bound, res->objective, TOL * fmax(1.0, fabs(z)));
    assert_close(res->gap, 0.0, 1e-9);
    return res->objective;
}

/* --------------------------------------------------------- hand-worked */

/* One paddock, one sheep mob, one week (hand-worked):
 * A = 1 ha, X0 = 2.0, R = 1.5, s = 0.01/d, G = 0.02 t/ha/d, I = 0.1 t/d.
 * Cover after d days: 0.93 * 2.0 + 0.14 - 0.1 d = 2.0 - 0.1 d >= 1.5, so
 * d <= 5.  A grazing day saves 0.1 t of supplement (10 at 100 per t); the
 * move costs 10: d = 5, supplement 0.7 - 0.5 = 0.2 t, cost 20 + 10 = 30
 * (no grazing: 70).  Model size from docs/planner.md with pres[m,p,t]:
 * 10 columns (d y e g w r x0 x1 sup u), 17 rows (bal res ceil mowcap mowlo
 * mowhi feed days use grz[m,p,t] pres grz[p,t] one kmax visit move end). */
static void test_hand_one_week(void **state)
{
    (void)state;
    plan_problem pb;
    make_problem(&pb, 1, 1, 1);
    pb.pd[0] = (plan_paddock){"P01", 1.0, 2.0, 1.5, 5.0, 0.01, 0};
    pb.mob[0] = (plan_mob){"M1", 50, 0, 0.1};
    pb.growth_t_ha_d[0] = 0.02;
    pb.cost_supplement_per_t = 100;
    pb.cost_per_move = 10;
    plan out;
    pm_result res;
    assert_close(solve_checked(&pb, NULL, &out, &res), 30.0, 1e-6);
    assert_int_equal(out.days[0], 5);
    assert_int_equal(out.mow[0], 0);
    assert_close(out.supplement_t[0], 0.2, 1e-9);
    assert_int_equal(res.cols, 10);
    assert_int_equal(res.rows, 17);
    assert_int_equal(res.binaries, 3);
    assert_int_equal(res.integers, 1);
    plan_free(&out);
    plan_problem_free(&pb);
}

/* Two weeks (hand-worked): A = 2 ha, X0 = 2.0, R = 1.0, C = 2.2, s = 0,
 * G = 0.1 t/ha/d (0.7 a week), I = 0.6 t/d (0.3 t/ha a grazing day);
 * supplement 50 per t, move 5, mowing 40 per ha, terminal 1.5 t/ha at 100
 * per t short.  With N days in all the end cover is 3.4 - 0.3 N; a day
 * saves 30 of supplement but below 1.5 t/ha costs 60 of shortfall, so
 * N = 6 (end 1.6): supplement 0.6 (14 - 6) = 4.8 t, cost 240 + 5 = 245
 * (N = 7: 210 + 40 + 5 = 255).  Week 0 needs 2..5 days (ceiling 2.2,
 * residual 1.0), so both weeks are grazed, one spell, one move. */
static void hand_two_weeks(plan_problem *pb, int spell_weeks)
{
    make_problem(pb, 1, 1, 2);
    pb->pd[0] = (plan_paddock){"P01", 2.0, 2.0, 1.0, 2.2, 0.0, 0};
    pb->mob[0] = (plan_mob){"M1", 80, 0, 0.6};
    pb->growth_t_ha_d[0] = pb->growth_t_ha_d[1] = 0.1;
    pb->spell_weeks = spell_weeks;
    pb->cost_supplement_per_t = 50;
    pb->cost_per_move = 5;
    pb->cost_mowing_per_ha = 40;
    pb->terminal_t_ha = 1.5;
    pb->penalty_terminal_per_t = 100;
}

static void test_hand_two_weeks(void **state)
{
    (void)state;
    plan_problem pb;
    hand_two_weeks(&pb, 2);
    plan out;
    pm_result res;
    assert_close(solve_checked(&pb, NULL, &out, &res), 245.0, 1e-6);
    assert_int_equal(out.days[0] + out.days[1], 6);
    assert_true(out.days[0] >= 2 && out.days[0] <= 5);
    plan_free(&out);
    plan_problem_free(&pb);
}

/* The same with spell[p,t] binding (S = 1: g0 + g1 <= 1), hand-worked:
 * grazing week 0 only needs end-of-week-1 cover x1 + 0.7 <= 2.2, so
 * d0 >= 4, and d0 <= 5 (residual): d0 = 5, supplement 0.6 x 9 = 5.4 t,
 * 270 + 5 = 275, end 1.9 (no shortfall).  Week 1 only needs a mowing in
 * week 0 (80) and then d1 <= 2: 360 + 80 + 5 + 80 shortfall; no grazing:
 * 420 + 80.  Optimum 275. */
static void test_hand_spell(void **state)
{
    (void)state;
    plan_problem pb;
    hand_two_weeks(&pb, 1);
    plan out;
    pm_result res;
    assert_close(solve_checked(&pb, NULL, &out, &res), 275.0, 1e-6);
    assert_int_equal(out.days[0], 5);
    assert_int_equal(out.days[1], 0);
    plan_free(&out);
    plan_problem_free(&pb);
}

/* Cattle clearance and maintenance, one week, hand-worked: A = 2 ha,
 * X0 = 2.0, G = 0.1, C = 2.2, R = 1.0, cattle eating 0.6 t/d, terminal
 * 1.5 t/ha at 100 per t.  Free to graze: d = 4 leaves 1.5 t/ha, supplement
 * 1.8 t (90) + move 5 = 95 (d = 3: 125, d = 5: 60 + 5 + 60 = 125).  Barred
 * (or the week closed): 2.7 > 2.2 must be mowed to 1.0 (80), 4.2 t of
 * supplement (210), shortfall 1.0 t (100): 390. */
static void test_hand_barred(void **state)
{
    (void)state;
    plan_problem pb;
    make_problem(&pb, 1, 1, 1);
    pb.pd[0] = (plan_paddock){"P01", 2.0, 2.0, 1.0, 2.2, 0.0, 0};
    pb.mob[0] = (plan_mob){"C1", 10, 1, 0.6};
    pb.growth_t_ha_d[0] = 0.1;
    pb.cost_supplement_per_t = 50;
    pb.cost_per_move = 5;
    pb.cost_mowing_per_ha = 40;
    pb.terminal_t_ha = 1.5;
    pb.penalty_terminal_per_t = 100;
    plan out;
    pm_result res;
    assert_close(solve_checked(&pb, NULL, &out, &res), 95.0, 1e-6);
    assert_int_equal(out.days[0], 4);
    plan_free(&out);
    pb.pd[0].cattle_barred = 1;
    assert_close(solve_checked(&pb, NULL, &out, &res), 390.0, 1e-6);
    assert_int_equal(out.days[0], 0);
    assert_int_equal(out.mow[0], 1);
    plan_free(&out);
    pb.pd[0].cattle_barred = 0;
    pb.open_days[0] = 0;
    assert_close(solve_checked(&pb, NULL, &out, &res), 390.0, 1e-6);
    plan_free(&out);
    plan_problem_free(&pb);
}

/* Two mobs, one paddock, one week, hand-worked: A = 10 ha, X0 = 3.0,
 * R = 1.0, no growth (20 t above the residual, more than both eat);
 * M1 eats 0.5 t/d (100 head), M2 0.3 t/d (60 head); supplement 100 per t
 * (a grazing day saves 50 for M1, 30 for M2), move 10.
 * Open 7 days: one mob per paddock (one[p,t]): M1 grazes 7 days, M2 is fed
 * 2.1 t: 210 + 10 = 220.  Sharing allowed, the page's visit[p,t] still
 * caps the paddock's days at D = 7 summed over the mobs: 220 again.
 * Open 4 days (maintenance): one mob: M1 4 days, supplement 1.5 + 2.1 t,
 * 360 + 10 = 370; sharing: M1 4 + M2 3 days (7 in all), 1.5 + 1.2 t,
 * 270 + 20 = 290; sharing under 15 head/ha (dens[p,t]: 160 head > 150):
 * 370. */
static void test_hand_one_and_density(void **state)
{
    (void)state;
    static const struct {
        int open, share;
        double head_per_ha, cost;
    } cases[] = {{7, 0, 0, 220}, {7, 1, 0, 220}, {4, 0, 0, 370}, {4, 1, 0, 290}, {4, 1, 15, 370}};
    plan_problem pb;
    make_problem(&pb, 1, 2, 1);
    pb.pd[0] = (plan_paddock){"P01", 10.0, 3.0, 1.0, 5.0, 0.0, 0};
    pb.mob[0] = (plan_mob){"M1", 100, 0, 0.5};
    pb.mob[1] = (plan_mob){"M2", 60, 0, 0.3};
    pb.cost_supplement_per_t = 100;
    pb.cost_per_move = 10;
    for (size_t i = 0; i < sizeof cases / sizeof cases[0]; i++) {
        pb.open_days[0] = cases[i].open;
        pb.share_paddocks = cases[i].share;
        pb.max_head_per_ha = cases[i].head_per_ha;
        plan out;
        pm_result res;
        assert_close(solve_checked(&pb, NULL, &out, &res), cases[i].cost, 1e-6);
        assert_int_equal(out.days[0], cases[i].open); /* M1 first: its days save more */
        plan_free(&out);
    }
    plan_problem_free(&pb);
}

/* The row pres[m,p,t] (y <= d, planmilp.h), hand-worked.  One mob eating
 * 0.1 t/d, K = 2, S = 3, supplement 100 per t (a day of it: 10), move 30.
 * P1 (1 ha, 1.7 t/ha, R = 1.0) grows only in week 2 (0.1 t/ha/d); P2
 * (1 ha, 1.7 t/ha) is open only in week 1.  Plans of days: P1 6, 1, 7 days
 * and P2 6 days in week 1: one day of supplement (10) and two moves (60) =
 * 70; P1 7, 0, 7 and P2 7 costs three moves = 90.  Without pres the model
 * could keep y = 1 in P1 on week 1's 0 days and claim 60, a cost no plan
 * of days has. */
static void test_hand_presence(void **state)
{
    (void)state;
    plan_problem pb;
    make_problem(&pb, 2, 1, 3);
    pb.pd[0] = (plan_paddock){"P01", 1.0, 1.7, 1.0, 5.0, 0.0, 0};
    pb.pd[1] = (plan_paddock){"P02", 1.0, 1.7, 1.0, 5.0, 0.0, 0};
    pb.mob[0] = (plan_mob){"M1", 50, 0, 0.1};
    pb.growth_t_ha_d[2] = 0.1;
    pb.open_days[3] = pb.open_days[5] = 0;
    pb.spell_weeks = 3;
    pb.max_paddocks_per_week = 2;
    pb.cost_supplement_per_t = 100;
    pb.cost_per_move = 30;
    plan out;
    pm_result res;
    assert_close(solve_checked(&pb, NULL, &out, &res), 70.0, 1e-6);
    assert_int_equal(*days_at(&out, 0, 0, 1), 1);
    assert_int_equal(*days_at(&out, 0, 0, 2), 7);
    assert_int_equal(*days_at(&out, 0, 1, 1), 6);
    plan_free(&out);
    plan_problem_free(&pb);
}

/* ---------------------------------------------------------- warm start */

/* A warm plan that keeps the rules is taken (hand_two_weeks: d0 = 5,
 * d1 = 0 costs 275, feasible with S = 2) and the optimum is still 245; one
 * that breaks res[P01,0] (d0 = 7 leaves 0.6 < 1.0 t/ha) is refused by name
 * and the optimum is still 245 (docs/planner.md; GLPK's glp_ios_heur_sol
 * does not check feasibility itself, GLPK reference manual). */
static void test_warm_start(void **state)
{
    (void)state;
    plan_problem pb;
    hand_two_weeks(&pb, 2);
    plan warm, out;
    pm_result res;
    assert_int_equal(plan_alloc(&pb, &warm), 0);
    warm.days[0] = 5;
    fill_supplement(&pb, &warm);
    double zw;
    assert_int_equal(doc_cost(&pb, &warm, &zw), 0);
    assert_close(zw, 275.0, 1e-9);
    pm_options opt = {0, 0, &warm, 0, PM_DIRECT, 0};
    assert_close(solve_checked(&pb, &opt, &out, &res), 245.0, 1e-6);
    assert_true(res.warm == PM_WARM_USED || res.warm == PM_WARM_UNUSED);
    plan_free(&out);
    warm.days[0] = 7;
    fill_supplement(&pb, &warm);
    assert_int_equal(doc_cost(&pb, &warm, &zw), -1);
    assert_close(solve_checked(&pb, &opt, &out, &res), 245.0, 1e-6);
    assert_int_equal(res.warm, PM_WARM_REJECTED);
    assert_non_null(strstr(res.msg, "res[P01,0]"));
    plan_free(&out);
    plan_free(&warm);
    plan_problem_free(&pb);
}

/* ---------------------------------------------------------- random tiny */



/* The plan of "Always feasible" (docs/planner.md): no grazing, supplement
 * for everything, mowing whenever the cover would pass the ceiling. */
static void yard_plan(const plan_problem *pb, plan *pl)
{
    for (int p = 0; p < pb->n_paddocks; p++) {
        double x = pb->pd[p].cover0_t_ha;
        for (int t = 0; t < pb->n_weeks; t++) {
            x = (1 - 7 * pb->pd[p].senescence_per_day) * x + 7 * pb->growth_t_ha_d[p * pb->n_weeks + t];
            pl->mow[p * pb->n_weeks + t] = x > pb->pd[p].ceiling_t_ha;
            if (x > pb->pd[p].ceiling_t_ha)
                x = pb->pd[p].residual_t_ha;
        }
    }
    fill_supplement(pb, pl);
}

/* Tiny instances: paddocks, mobs, weeks, days per visit. */
static const int shapes[][4] = {
    {2, 1, 3, 2}, {3, 1, 2, 3}, {2, 1, 4, 2}, {2, 2, 2, 2}, {1, 2, 3, 2}, {3, 1, 3, 1},
    {2, 2, 3, 1}, {2, 1, 3, 3}, {1, 1, 4, 7}, {3, 2, 2, 1}, {2, 1, 4, 1}, {1, 2, 4, 1},
    {2, 1, 5, 1}, {1, 1, 5, 4}, {2, 2, 2, 3}, {3, 1, 2, 2}, {1, 2, 5, 1}, {2, 1, 3, 4},
    {1, 3, 3, 1}, {2, 1, 4, 3}, {3, 1, 3, 2}, {1, 1, 6, 2}, {2, 2, 3, 2}, {4, 1, 2, 1}};

/* Random tiny instances (seed 20261203): the MILP optimum equals the
 * cheapest plan found by trying every plan (brute force from
 * docs/planner.md), to 1e-6; the returned plan keeps every rule; warm
 * started from the "Always feasible" plan, the optimum is the same and the
 * warm plan is never refused. */
static void test_brute_force(void **state)
{
    (void)state;
    uint64_t seed = 20261203;
    int n = (int)(sizeof shapes / sizeof shapes[0]), grazed = 0;
    for (int k = 0; k < n; k++) {
        plan_problem pb;
        pg_random(&seed, &pb, shapes[k][0], shapes[k][1], shapes[k][2], PG_PLAIN, shapes[k][3]);
        if (plans_to_try(&pb) > 4e6) { /* keep the test fast: a smaller day range */
            plan_problem_free(&pb);
            pg_random(&seed, &pb, shapes[k][0], shapes[k][1], shapes[k][2], PG_PLAIN, 1);
        }
        assert_true(plans_to_try(&pb) <= 4e6);
        plan best, out, yard;
        assert_int_equal(plan_alloc(&pb, &best), 0);
        double z_bf = brute_force(&pb, &best);
        assert_true(z_bf < HUGE_VAL);
        pm_result res;
        double z = solve_checked(&pb, NULL, &out, &res);
        print_message("instance %2d: %dP %dM %dW D%d  %8.0f plans  brute %.6f  milp %.6f  "
                      "%d rows %d cols  %.3f s\n",
                      k, shapes[k][0], shapes[k][1], shapes[k][2], shapes[k][3], plans_to_try(&pb),
                      z_bf, z, res.rows, res.cols, res.seconds);
        assert_close(z, z_bf, 1e-6);
        for (int i = 0; i < pb.n_mobs * pb.n_paddocks * pb.n_weeks; i++)
            grazed += best.days[i] > 0;
        plan_free(&out);
        assert_int_equal(plan_alloc(&pb, &yard), 0);
        yard_plan(&pb, &yard);
        pm_options opt = {0, 0, &yard, 0, PM_DIRECT, 0};
        assert_close(solve_checked(&pb, &opt, &out, &res), z_bf, 1e-6);
        assert_int_not_equal(res.warm, PM_WARM_REJECTED);
        plan_free(&out);
        plan_free(&yard);
        plan_free(&best);
        plan_problem_free(&pb);
    }
    assert_true(grazed > 0); /* the instances are not all "keep them in the yard" */
}

/* With a loose gap and a warm start, the solver may stop early, but what
 * it returns stays honest: objective >= the true optimum (brute force),
 * bound <= the true optimum, gap = (objective - bound) / |objective|
 * (planmilp.h).  Same instances, seed 77. */
static void test_bound_is_true(void **state)
{
    (void)state;
    uint64_t seed = 77;
    for (int k = 0; k < 6; k++) {
        plan_problem pb;
        pg_random(&seed, &pb, shapes[k][0], shapes[k][1], shapes[k][2], PG_PLAIN, shapes[k][3]);
        plan best, out, yard;
        assert_int_equal(plan_alloc(&pb, &best), 0);
        assert_int_equal(plan_alloc(&pb, &yard), 0);
        assert_int_equal(plan_alloc(&pb, &out), 0);
        double z_bf = brute_force(&pb, &best), z_yard;
        yard_plan(&pb, &yard);
        assert_int_equal(doc_cost(&pb, &yard, &z_yard), 0);
        pm_options opt = {0, 0.5, &yard, 0, PM_DIRECT, 0};
        pm_result res;
        assert_int_equal(pm_solve(&pb, &opt, &out, &res), 0);
        assert_true(res.status == PM_OPTIMAL || res.status == PM_FEASIBLE);
        double z;
        assert_int_equal(doc_cost(&pb, &out, &z), 0);
        assert_close(z, res.objective, 1e-6 * fmax(1, z));
        assert_true(res.objective >= z_bf - 1e-6);
        assert_true(res.objective <= z_yard + 1e-6);
        assert_true(res.bound <= z_bf + 1e-6);
        assert_close(res.gap, (res.objective - res.bound) / fmax(1e-9, fabs(res.objective)), 1e-12);
        if (res.status == PM_FEASIBLE)
            assert_true(res.gap <= 0.5 + 1e-9);
        plan_free(&out);
        plan_free(&yard);
        plan_free(&best);
        plan_problem_free(&pb);
    }
}

/* ---------------------------------------------------- improvement phase */

/* The window phase (PM_WINDOWS, docs/planner.md "Solving"), no time limit,
 * from the "Always feasible" plan, on random tiny instances (seed 3141):
 * with windows shorter than the horizon (1 and 2 weeks) it never returns a
 * plan costlier than its start (a candidate replaces the incumbent only
 * when cheaper), the plan keeps every rule (doc_cost) and costs what the
 * solver says, it is no cheaper than the optimum (brute force), and it
 * claims no bound unless proven optimal (planmilp.h: the restricted
 * models' optima are not bounds of the full model).  Over the instances it
 * improves at least once (else the phase would do nothing). */
static void test_windows_never_costlier(void **state)
{
    (void)state;
    uint64_t seed = 3141;
    int improved = 0;
    for (int k = 0; k < 12; k++) {
        plan_problem pb;
        pg_random(&seed, &pb, shapes[k][0], shapes[k][1], shapes[k][2], PG_PLAIN, shapes[k][3]);
        if (plans_to_try(&pb) > 4e6) {
            plan_problem_free(&pb);
            pg_random(&seed, &pb, shapes[k][0], shapes[k][1], shapes[k][2], PG_PLAIN, 1);
        }
        plan best, yard;
        assert_int_equal(plan_alloc(&pb, &best), 0);
        assert_int_equal(plan_alloc(&pb, &yard), 0);
        double z_bf = brute_force(&pb, &best), z_yard;
        yard_plan(&pb, &yard);
        assert_int_equal(doc_cost(&pb, &yard, &z_yard), 0);
        for (int W = 1; W <= 2 && W < pb.n_weeks; W++) {
            plan out;
            pm_result res;
            pm_options opt = {0, 0, &yard, 0, PM_WINDOWS, W};
            assert_int_equal(plan_alloc(&pb, &out), 0);
            assert_int_equal(pm_solve(&pb, &opt, &out, &res), 0);
            assert_int_equal(res.status, PM_FEASIBLE);
            assert_int_equal(res.warm, PM_WARM_USED);
            double z;
            assert_int_equal(doc_cost(&pb, &out, &z), 0);
            assert_close(z, res.objective, 1e-6 * fmax(1, fabs(z)));
            assert_true(res.objective <= z_yard + 1e-6 * fmax(1, fabs(z_yard)));
            assert_true(res.objective >= z_bf - 1e-6 * fmax(1, fabs(z_bf)));
            assert_true(res.bound == -HUGE_VAL);
            improved += res.objective < z_yard - 1e-6;
            plan_free(&out);
        }
        plan_free(&yard);
        plan_free(&best);
        plan_problem_free(&pb);
    }
    assert_true(improved > 0);
}

/* A window as long as the horizon frees every integer column, so the
 * restricted model is the full model: PM_WINDOWS then returns the exact
 * optimum (brute force, seed 20261203 as test_brute_force), proven, with
 * the bound equal to it.  PM_IMPROVE without a time limit ends with branch
 * and bound on the full model, so it too returns the optimum, whatever
 * the window (auto here).  Both plans keep every rule (solve_checked). */
static void test_windows_whole_horizon(void **state)
{
    (void)state;
    uint64_t seed = 20261203;
    int n = (int)(sizeof shapes / sizeof shapes[0]);
    for (int k = 0; k < n; k++) {
        plan_problem pb;
        pg_random(&seed, &pb, shapes[k][0], shapes[k][1], shapes[k][2], PG_PLAIN, shapes[k][3]);
        if (plans_to_try(&pb) > 4e6) {
            plan_problem_free(&pb);
            pg_random(&seed, &pb, shapes[k][0], shapes[k][1], shapes[k][2], PG_PLAIN, 1);
        }
        plan best, yard, out;
        assert_int_equal(plan_alloc(&pb, &best), 0);
        assert_int_equal(plan_alloc(&pb, &yard), 0);
        double z_bf = brute_force(&pb, &best);
        yard_plan(&pb, &yard);
        pm_result res;
        pm_options opt = {0, 0, &yard, 0, PM_WINDOWS, pb.n_weeks};
        assert_close(solve_checked(&pb, &opt, &out, &res), z_bf, 1e-6);
        plan_free(&out);
        pm_options imp = {0, 0, &yard, 0, PM_IMPROVE, 0};
        assert_close(solve_checked(&pb, &imp, &out, &res), z_bf, 1e-6);
        plan_free(&out);
        pm_options nowarm = {0, 0, NULL, 0, PM_IMPROVE, 1}; /* starts from the baseline */
        assert_close(solve_checked(&pb, &nowarm, &out, &res), z_bf, 1e-6);
        plan_free(&out);
        plan_free(&yard);
        plan_free(&best);
        plan_problem_free(&pb);
    }
}

/* A strategy number pm_solve does not know is refused with a message
 * (planmilp.h). */
static void test_unknown_strategy(void **state)
{
    (void)state;
    plan_problem pb;
    hand_two_weeks(&pb, 2);
    plan out;
    pm_result res;
    assert_int_equal(plan_alloc(&pb, &out), 0);
    pm_options opt = {0, 0, NULL, 0, 99, 0};
    assert_int_equal(pm_solve(&pb, &opt, &out, &res), -1);
    assert_int_equal(res.status, PM_ERROR);
    assert_non_null(strstr(res.msg, "strategy"));
    plan_free(&out);
    plan_problem_free(&pb);
}

/* -------------------------------------------------------------- export */

static int have_glpsol(void)
{
    return system("command -v glpsol >/dev/null 2>&1") == 0;
}

/* Runs glpsol on a model file and reads "Objective:  NAME = Z (MINimum)"
 * from its solution report (GLPK reference manual, glpsol). */
static double glpsol_objective(const char *flag, const char *model, const char *report)
{
    char cmd[1024];
    snprintf(cmd, sizeof cmd, "glpsol %s '%s' -o '%s' >/dev/null 2>&1", flag, model, report);
    assert_int_equal(system(cmd), 0);
    FILE *fp = fopen(report, "r");
    assert_non_null(fp);
    char line[512];
    double z = (double)NAN;
    while (fgets(line, sizeof line, fp))
        if (strncmp(line, "Objective:", 10) == 0)
            assert_int_equal(sscanf(line, "Objective: %*s = %lf", &z), 1);
        else if (strncmp(line, "Status:", 7) == 0)
            assert_non_null(strstr(line, "INTEGER OPTIMAL"));
    fclose(fp);
    return z;
}

static char *read_all(const char *path)
{
    FILE *fp = fopen(path, "r");
    assert_non_null(fp);
    static char buf[1 << 20];
    size_t n = fread(buf, 1, sizeof buf - 1, fp);
    buf[n] = 0;
    fclose(fp);
    return buf;
}

/* The exported model, read by glpsol (free MPS and CPLEX LP), has the
 * optimum pm_solve finds: hand_two_weeks (245) and a random instance
 * with rest rows; the MPS file carries the page's row names. */
static void test_export_glpsol(void **state)
{
    (void)state;
    if (!have_glpsol()) {
        print_message("glpsol not found (Debian package glpk-utils): export check skipped\n");
        skip();
    }
    char dir[] = "/tmp/test_planmilp.XXXXXX", mps[128], lp[128], out[128];
    assert_non_null(mkdtemp(dir));
    snprintf(mps, sizeof mps, "%s/m.mps", dir);
    snprintf(lp, sizeof lp, "%s/m.lp", dir);
    snprintf(out, sizeof out, "%s/out.txt", dir);
    plan_problem pb;
    hand_two_weeks(&pb, 2);
    assert_int_equal(pm_export(&pb, mps, 1, NULL), 0);
    assert_close(glpsol_objective("--freemps", mps, out), 245.0, 1e-6);
    assert_int_equal(pm_export(&pb, lp, 0, NULL), 0);
    assert_close(glpsol_objective("--lp", lp, out), 245.0, 1e-6);
    plan_problem_free(&pb);
    uint64_t seed = 5;
    pg_random(&seed, &pb, 3, 2, 4, PG_PLAIN, 7);
    pb.rest_weeks = 3;
    pb.max_head_per_ha = 60;
    plan sol;
    pm_result res;
    double z = solve_checked(&pb, NULL, &sol, &res);
    assert_int_equal(pm_export(&pb, mps, 1, NULL), 0);
    assert_close(glpsol_objective("--freemps", mps, out), z, 1e-6 * fmax(1, fabs(z)));
    assert_int_equal(pm_export(&pb, lp, 0, NULL), 0);
    assert_close(glpsol_objective("--lp", lp, out), z, 1e-6 * fmax(1, fabs(z)));
    const char *text = read_all(mps);
    static const char *const names[] = {
        "bal[P01,0]", "res[P02,1]", "ceil[P03,3]", "mowcap[P01,2]", "mowlo[P01,2]",
        "mowhi[P01,2]", "feed[M1,0]", "days[M2,3]", "use[M1,P02,1]", "grz[M2,P01,0]",
        "grz[P01,0]", "pres[M1,P01,0]", "one[P02,2]", "kmax[M2,1]", "dens[P03,0]",
        "visit[P01,3]", "rest[P01,0,2]", "rest[P02,0,3]", "rest[P02,1,2]", "move[M1,P03,3]", " end ",
        "d[M1,P01,0]", "sup[M2,3]", "x[P03,4]"};
    for (size_t i = 0; i < sizeof names / sizeof names[0]; i++)
        if (!strstr(text, names[i]))
            fail_msg("%s not in the exported model", names[i]);
    plan_free(&sol);
    plan_problem_free(&pb);
    remove(mps);
    remove(lp);
    remove(out);
    rmdir(dir);
}

/* ---------------------------------------------------------------- errors */

/* Bad input is refused with a message (never a GLPK abort): a paddock of
 * no area, a plan for another problem, an export to a missing directory. */
static void test_errors(void **state)
{
    (void)state;
    plan_problem pb;
    hand_two_weeks(&pb, 2);
    plan out, other;
    pm_result res;
    assert_int_equal(plan_alloc(&pb, &out), 0);
    pb.pd[0].area_ha = 0;
    assert_int_equal(pm_solve(&pb, NULL, &out, &res), -1);
    assert_int_equal(res.status, PM_ERROR);
    assert_non_null(strstr(res.msg, "area"));
    pb.pd[0].area_ha = 2;
    pb.n_weeks = 1;
    assert_int_equal(plan_alloc(&pb, &other), 0);
    pb.n_weeks = 2;
    assert_int_equal(pm_solve(&pb, NULL, &other, &res), -1);
    assert_int_equal(res.status, PM_ERROR);
    pm_options opt = {0, 0, &other, 0, PM_DIRECT, 0};
    assert_int_equal(pm_solve(&pb, &opt, &out, &res), -1);
    assert_non_null(strstr(res.msg, "warm"));
    rg_err err;
    assert_int_equal(pm_export(&pb, "/nonexistent-dir/m.mps", 1, &err), -1);
    assert_non_null(strstr(err.msg, "/nonexistent-dir/m.mps"));
    assert_int_equal(access("/nonexistent-dir/m.mps", F_OK), -1);
    assert_int_equal(pm_solve(&pb, NULL, &out, &res), 0); /* GLPK still usable */
    assert_close(res.objective, 245.0, 1e-6);
    plan_free(&other);
    plan_free(&out);
    plan_problem_free(&pb);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_hand_one_week), cmocka_unit_test(test_hand_two_weeks),
        cmocka_unit_test(test_hand_spell),    cmocka_unit_test(test_hand_barred),
        cmocka_unit_test(test_hand_one_and_density), cmocka_unit_test(test_hand_presence),
        cmocka_unit_test(test_warm_start),    cmocka_unit_test(test_brute_force),
        cmocka_unit_test(test_bound_is_true), cmocka_unit_test(test_windows_never_costlier),
        cmocka_unit_test(test_windows_whole_horizon), cmocka_unit_test(test_unknown_strategy),
        cmocka_unit_test(test_export_glpsol),
        cmocka_unit_test(test_errors),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
