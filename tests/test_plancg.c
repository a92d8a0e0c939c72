/* test_plancg.c - the decomposition (plancg.c, docs/decomposition.md)
 * against the compact model solved exactly, against brute force over every
 * single-paddock trajectory, and every plan it returns against the
 * independent verifier.
 *
 * What is checked and where the expected values come from:
 *   - Lagrangian bound (Lübbecke & Desrosiers 2005, "Selected topics in
 *     column generation", Operations Research 53(6), section 2.1, from
 *     memory): the bound never exceeds the compact model's optimum, found
 *     here by pm_solve PM_DIRECT without limits (itself tested against
 *     brute force in test_planmilp.c), and the plan never costs less;
 *   - pricing: the minimum priced cost over every trajectory of one paddock,
 *     enumerated and judged by pv_simulate (planverify.c), equals
 *     prc_price's value, and its bound is not above it;
 *   - the bound is at least the compact model's LP relaxation (read from
 *     the exported model by GLPK's simplex), on an instance where that
 *     relaxation is weak.
 * Instances are random (a fixed generator) or invented; no figure here
 * comes from a publication.
 */
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include <glpk.h>

#include "plan.h"
#include "plancg.h"
#include "planprice.h"
#include "planmilp.h"
#include "planverify.h"
#include "rgtest.h"
#include "plangen.h"



/* pv_simulate passes pl, and its cost is z. */
static void assert_verified(const plan_problem *pb, const plan *pl, double z)
{
    pv_result v;
    int rc = pv_simulate(pb, pl, &v);
    if (rc != 0)
        print_error("verifier: %s\n", v.first_violation);
    assert_int_equal(rc, 0);
    assert_close(v.cost_total, z, 1e-6 * fmax(1.0, fabs(z)));
    pv_free(&v);
}

/* Small instances: paddocks, mobs, weeks, days per visit. */
static const int shapes[][4] = {{2, 1, 3, 2}, {3, 1, 4, 3}, {2, 2, 3, 2}, {3, 1, 5, 7},
                                {4, 1, 4, 3}, {2, 2, 4, 3}, {3, 2, 3, 2}, {4, 1, 6, 5}};

/* Random small instances (seed 808): bound <= optimum (PM_DIRECT, no
 * limit) <= the decomposition's plan; the plan passes the verifier and
 * costs what the solver says.  Without a time limit branch and price
 * explores its tree to the end, so the gap closes on every instance and
 * the plan's cost is the optimum; some instances need branching (more
 * than the root node: the root master LP left a gap there).  Also through
 * pm_solve with PM_DECOMP. */
static void test_bound_optimum_plan(void **state)
{
    (void)state;
    uint64_t seed = 808;
    int branched = 0, n = (int)(sizeof shapes / sizeof shapes[0]);
    for (int k = 0; k < n; k++) {
        plan_problem pb;
        pg_random(&seed, &pb, shapes[k][0], shapes[k][1], shapes[k][2], PG_PLAIN, shapes[k][3]);
        plan exact, cg;
        assert_int_equal(plan_alloc(&pb, &exact), 0);
        assert_int_equal(plan_alloc(&pb, &cg), 0);
        pm_result re, rc;
        assert_int_equal(pm_solve(&pb, NULL, &exact, &re), 0);
        assert_int_equal(re.status, PM_OPTIMAL);
        pm_options o = {0, 0, NULL, 0, PM_DECOMP, 0};
        assert_int_equal(pm_solve(&pb, &o, &cg, &rc), 0);
        assert_true(rc.status == PM_OPTIMAL || rc.status == PM_FEASIBLE);
        double opt = re.objective, tol = 1e-6 * fmax(1.0, fabs(opt));
        print_message("instance %d: %dP %dM %dW D%d  bound %.4f  optimum %.4f  plan %.4f  %s, %d nodes\n", k,
                      shapes[k][0], shapes[k][1], shapes[k][2], shapes[k][3], rc.bound, opt,
                      rc.objective, rc.status == PM_OPTIMAL ? "closed" : "open", rc.nodes);
        assert_true(rc.bound <= opt + tol);
        assert_true(rc.objective >= opt - tol);
        assert_verified(&pb, &cg, rc.objective);
        assert_close(rc.gap, (rc.objective - rc.bound) / fmax(1e-9, fabs(rc.objective)), 1e-12);
        assert_int_equal(rc.status, PM_OPTIMAL);
        assert_close(rc.objective, opt, tol);
        assert_close(rc.bound, opt, tol);
        branched += rc.nodes > 1;
        plan_free(&exact);
        plan_free(&cg);
        plan_problem_free(&pb);
    }
    assert_true(branched > 0); /* the tree did the closing somewhere */
}

/* The hull row, hand-worked (docs/decomposition.md, "Master"): one week
 * that counts (weeks 1-4 are closed, so the window phase, 4-week windows,
 * never frees the whole horizon and cannot prove the plan itself), one mob
 * eating I = 0.2 t DM/day, three 1-ha paddocks at 2.0 t DM/ha with
 * residual 0.5, no growth, no senescence; D = 5 days a visit, K = 2
 * paddocks; supplement 100 per t (a grazing day saves 20), a move 10.
 * Integer optimum of week 0: 7 days from two paddocks (5 + 2, each ends
 * >= 1.0), two moves: 20 (one paddock, 5 days: 2 days of supplement, 40,
 * plus 10); weeks 1-4 are all supplement, 4 x 7 x 0.2 x 100 = 560.
 * Without the hull row the master LP takes 7 days from 1.4 paddocks
 * (5 days at lambda 1 and 5 days at lambda 0.4): 14.  The hull row
 * days - 2 Y <= 3 forbids that: the bound is 20 and the gap closes. */
static void test_hull_row(void **state)
{
    (void)state;
    plan_problem pb;
    uint64_t seed = 1;
    pg_random(&seed, &pb, 3, 1, 5, PG_PLAIN, 5);
    for (int p = 0; p < 3; p++) {
        pb.pd[p] = (plan_paddock){"", 1.0, 2.0, 0.5, 5.0, 0.0, 0};
        snprintf(pb.pd[p].id, PLAN_ID_LEN, "P%d", p + 1);
        for (int t = 0; t < 5; t++) {
            pb.growth_t_ha_d[p * 5 + t] = 0;
            pb.open_days[p * 5 + t] = t == 0 ? 7 : 0;
        }
    }
    pb.mob[0] = (plan_mob){"M1", 100, 0, 0.2};
    pb.rest_weeks = 1;
    pb.spell_weeks = 1;
    pb.max_paddocks_per_week = 2;
    pb.share_paddocks = 0;
    pb.max_head_per_ha = 0;
    pb.terminal_t_ha = 0;
    pb.cost_supplement_per_t = 100;
    pb.cost_mowing_per_ha = 50;
    pb.cost_per_move = 10;
    plan cg;
    assert_int_equal(plan_alloc(&pb, &cg), 0);
    pm_options o = {0, 0, NULL, 0, PM_DECOMP, 0};
    pm_result rc;
    assert_int_equal(pcg_solve(&pb, &o, &cg, &rc), 0);
    assert_close(rc.objective, 20.0 + 4 * 7 * 0.2 * 100, 1e-6); /* weeks 1-4: supplement */
    assert_close(rc.bound, rc.objective, 1e-6);
    assert_int_equal(rc.status, PM_OPTIMAL);
    assert_verified(&pb, &cg, rc.objective);
    plan_free(&cg);
    plan_problem_free(&pb);
}

/* Branching raises the bound above the root master LP, hand-worked
 * (docs/decomposition.md, "Branch and price").  One 1-ha paddock at
 * 2.0 t DM/ha, residual 0.5, ceiling 5, no growth, no senescence; one
 * mob eating I = 0.1 t DM/day; K = 1 paddock a week, D = 7 days; only
 * week 0 of 5 is open (so the window phase, 4-week windows, never frees
 * the whole horizon and cannot prove a plan itself); supplement 100 per
 * t (a grazing day saves 10), a move 10, end target 1.65 t DM/ha with
 * shortfall at 150 per t.  Weeks 1-4 are all supplement: 4 x 7 x 0.1 x
 * 100 = 280.  Grazing d days in week 0 costs
 *   10 + 10 (7 - d) + 150 max(0, 0.1 d - 0.35)
 * d = 3: 50; d = 4: 47.5 (the optimum); d = 5: 52.5; no grazing: 70.
 * The root master LP mixes the idle trajectory and the 7-day one half and
 * half: 3.5 days on average, half a move (5), supplement 35, end cover
 * 1.65 exactly: 40.  No row of the master removes that (D = 7 and K = 1:
 * no hull or size row), so the column generation bound is 280 + 40;
 * branching on the use (idle, 70, or grazed: its LP mixes 3 and 4 days,
 * 45) and then on the days (d <= 3: 50; d >= 4: 47.5) proves 280 + 47.5. */
static void test_branching_raises_bound(void **state)
{
    (void)state;
    plan_problem pb;
    uint64_t seed = 1;
    pg_random(&seed, &pb, 1, 1, 5, PG_PLAIN, 7);
    pb.pd[0] = (plan_paddock){"P1", 1.0, 2.0, 0.5, 5.0, 0.0, 0};
    for (int t = 0; t < 5; t++) {
        pb.growth_t_ha_d[t] = 0;
        pb.open_days[t] = t == 0 ? 7 : 0;
    }
    pb.mob[0] = (plan_mob){"M1", 100, 0, 0.1};
    pb.rest_weeks = 1;
    pb.spell_weeks = 1;
    pb.max_paddocks_per_week = 1;
    pb.share_paddocks = 0;
    pb.max_head_per_ha = 0;
    pb.terminal_t_ha = 1.65;
    pb.penalty_terminal_per_t = 150;
    pb.cost_supplement_per_t = 100;
    pb.cost_mowing_per_ha = 50;
    pb.cost_per_move = 10;
    plan cg, exact;
    assert_int_equal(plan_alloc(&pb, &cg), 0);
    assert_int_equal(plan_alloc(&pb, &exact), 0);
    pm_options o = {0, 0, NULL, 0, PM_DECOMP, 0};
    pm_result rc, re;
    assert_int_equal(pcg_solve(&pb, &o, &cg, &rc), 0);
    assert_int_equal(pm_solve(&pb, NULL, &exact, &re), 0);
    print_message("bound %.4f  plan %.4f  optimum %.4f  nodes %d\n", rc.bound, rc.objective, re.objective,
                  rc.nodes);
    assert_close(re.objective, 280 + 47.5, 1e-6); /* the compact model agrees with the hand sum */
    assert_close(rc.objective, 280 + 47.5, 1e-6);
    assert_close(rc.bound, 280 + 47.5, 1e-6);   /* above the root LP, 280 + 40 */
    assert_int_equal(rc.status, PM_OPTIMAL);
    assert_true(rc.nodes >= 3);                 /* the root and at least two children */
    assert_int_equal(cg.days[0], 4);
    assert_verified(&pb, &cg, rc.objective);
    plan_free(&cg);
    plan_free(&exact);
    plan_problem_free(&pb);
}

/* Part weeks (docs/planner.md, part[m,p,t]; outside pricing,
 * docs/decomposition.md "Rows the pricing does not carry"), random
 * instances (seed 77) with paddock-weeks free on their first 3 days only
 * and K = 2: the compact model (PM_DIRECT, no limit) carries the rows;
 * the decomposition's bound stays at or below its optimum, its plan
 * passes the verifier (which checks the rows), and without a time limit
 * the tree, which branches on a whole solution that breaks a part-week
 * row, closes at that optimum. */
static void test_part_weeks(void **state)
{
    (void)state;
    static const int cases[][4] = {{3, 1, 4, 3}, {4, 1, 4, 5}, {3, 2, 3, 3}};
    uint64_t seed = 77;
    for (int k = 0; k < 3; k++) {
        plan_problem pb;
        pg_random(&seed, &pb, cases[k][0], cases[k][1], cases[k][2], PG_PLAIN, cases[k][3]);
        int P = pb.n_paddocks, T = pb.n_weeks;
        pb.max_paddocks_per_week = 2;
        pb.open_mask = calloc((size_t)(P * T), 1);
        assert_non_null(pb.open_mask);
        for (int i = 0; i < P * T; i++)
            pb.open_mask[i] = pb.open_days[i] == 7 ? 0x7f : pb.open_days[i] == 3 ? 0x07 : 0;
        plan exact, cg;
        assert_int_equal(plan_alloc(&pb, &exact), 0);
        assert_int_equal(plan_alloc(&pb, &cg), 0);
        pm_result re, rc;
        assert_int_equal(pm_solve(&pb, NULL, &exact, &re), 0);
        assert_int_equal(re.status, PM_OPTIMAL);
        pm_options o = {0, 0, NULL, 0, PM_DECOMP, 0};
        assert_int_equal(pcg_solve(&pb, &o, &cg, &rc), 0);
        double opt = re.objective, tol = 1e-6 * fmax(1.0, fabs(opt));
        print_message("part weeks %d: bound %.4f  optimum %.4f  plan %.4f  nodes %d\n", k, rc.bound, opt,
                      rc.objective, rc.nodes);
        assert_true(rc.bound <= opt + tol);
        assert_verified(&pb, &cg, rc.objective);
        assert_int_equal(rc.status, PM_OPTIMAL);
        assert_close(rc.objective, opt, tol);
        plan_free(&exact);
        plan_free(&cg);
        plan_problem_free(&pb);
    }
}

/* A part week decided by branching, hand-worked: paddock A is free on
 * days 0-2 of week 0 only (a part week), B all week 0; weeks 1-4 are
 * closed (all supplement, 4 x 7 x 0.2 x 100 = 560, and no window of the
 * window phase frees the whole horizon).  Both 1 ha at 2.0 t DM/ha,
 * residual 0.5, no growth; one mob eating 0.2 t DM/day, D = 5, K = 2,
 * supplement 100 per t (20 a day), a move 10, no end target.  Pricing
 * does not carry the part-week row, so the root master's solution is
 * whole: B 5 days and A 2 days, 20, which breaks part[m,A,0] (the
 * verifier refuses it).  The tree branches: A not used (B alone, 5 days
 * and 2 of supplement: 50) or A used alone (3 days and 4 of supplement:
 * 90); the optimum is 560 + 50, and the bound reaches it. */
static void test_part_week_branch(void **state)
{
    (void)state;
    plan_problem pb;
    uint64_t seed = 3;
    pg_random(&seed, &pb, 2, 1, 5, PG_PLAIN, 5);
    pb.open_mask = calloc(10, 1);
    assert_non_null(pb.open_mask);
    for (int p = 0; p < 2; p++) {
        pb.pd[p] = (plan_paddock){"", 1.0, 2.0, 0.5, 5.0, 0.0, 0};
        snprintf(pb.pd[p].id, PLAN_ID_LEN, "%c", 'A' + p);
        for (int t = 0; t < 5; t++) {
            pb.growth_t_ha_d[p * 5 + t] = 0;
            pb.open_days[p * 5 + t] = t > 0 ? 0 : p == 0 ? 3 : 7;
            pb.open_mask[p * 5 + t] = t > 0 ? 0 : p == 0 ? 0x07 : 0x7f;
        }
    }
    pb.mob[0] = (plan_mob){"M1", 100, 0, 0.2};
    pb.rest_weeks = 1;
    pb.spell_weeks = 1;
    pb.max_paddocks_per_week = 2;
    pb.share_paddocks = 0;
    pb.max_head_per_ha = 0;
    pb.terminal_t_ha = 0;
    pb.cost_supplement_per_t = 100;
    pb.cost_mowing_per_ha = 50;
    pb.cost_per_move = 10;
    plan cg, exact;
    assert_int_equal(plan_alloc(&pb, &cg), 0);
    assert_int_equal(plan_alloc(&pb, &exact), 0);
    pm_options o = {0, 0, NULL, 0, PM_DECOMP, 0};
    pm_result rc, re;
    assert_int_equal(pcg_solve(&pb, &o, &cg, &rc), 0);
    assert_int_equal(pm_solve(&pb, NULL, &exact, &re), 0);
    print_message("part week: bound %.4f  plan %.4f  optimum %.4f  nodes %d\n", rc.bound, rc.objective,
                  re.objective, rc.nodes);
    assert_close(re.objective, 560 + 50, 1e-6);
    assert_close(rc.objective, 560 + 50, 1e-6);
    assert_close(rc.bound, 560 + 50, 1e-6);
    assert_int_equal(rc.status, PM_OPTIMAL);
    assert_int_equal(cg.days[0 * 5 + 0], 0); /* A unused */
    assert_int_equal(cg.days[1 * 5 + 0], 5);
    assert_verified(&pb, &cg, rc.objective);
    plan_free(&cg);
    plan_free(&exact);
    plan_problem_free(&pb);
}

/* ------------------------------------------------------------- pricing */

/* The priced cost of the one-paddock plan pl (days of mob m in week t at
 * pl->days[m * T + t]) by the verifier, or +inf when a rule breaks. */
static double priced(const plan_problem *pb, plan *pl, const prc_duals *du)
{
    int T = pb->n_weeks, M = pb->n_mobs;
    for (int m = 0; m < M; m++)
        for (int t = 0; t < T; t++) {
            int total = pl->days[m * T + t];
            pl->supplement_t[m * T + t] = pb->mob[m].demand_t_d * (7 - total);
        }
    pv_result v;
    int rc = pv_simulate(pb, pl, &v);
    assert_true(rc >= 0);
    double z = HUGE_VAL;
    if (rc == 0) {
        z = v.cost_mowing + v.cost_moves - du->end * pb->pd[0].area_ha * v.cover_t_ha[T];
        for (int i = 0; i < M * T; i++)
            z -= du->day[i] * pl->days[i] + du->use[i] * (pl->days[i] > 0);
        for (int r = 0; r < du->n_step; r++)
            for (int i = 0; i < M * T; i++)
                z -= pl->days[i] >= du->step_min[r] ? du->step[r * M * T + i] : 0.0;
        /* a price on each move (entry) of mob m: the moves branching row */
        for (int m = 0; du->move && m < M; m++)
            for (int t = 0; t < T; t++)
                if (pl->days[m * T + t] > 0 && (t == 0 || pl->days[m * T + t - 1] == 0))
                    z -= du->move[m];
    }
    pv_free(&v);
    return z;
}

/* Most days of mob m in week t (use row and cattle clearance). */
static int cap_of(const plan_problem *pb, int m, int t)
{
    int D = pb->max_days_per_visit < 7 ? pb->max_days_per_visit : 7, o = pb->open_days[t];
    if (pb->mob[m].is_cattle && pb->pd[0].cattle_barred)
        return 0;
    return o < D ? o : D;
}

/* Every trajectory of the one paddock (days odometer x mowing mask). */
static double brute_min(const plan_problem *pb, const prc_duals *du)
{
    int T = pb->n_weeks, n = pb->n_mobs * T;
    plan pl;
    assert_int_equal(plan_alloc(pb, &pl), 0);
    double best = HUGE_VAL;
    for (;;) {
        for (int mask = 0; mask < (1 << T); mask++) {
            for (int t = 0; t < T; t++)
                pl.mow[t] = (unsigned char)((mask >> t) & 1);
            best = fmin(best, priced(pb, &pl, du));
        }
        int i = 0;
        while (i < n && pl.days[i] == cap_of(pb, i / T, i % T))
            pl.days[i++] = 0;
        if (i == n)
            break;
        pl.days[i]++;
    }
    plan_free(&pl);
    return best;
}

/* One paddock, 1-2 mobs, 3-4 weeks, random problems and random prices
 * with the Lagrangian signs (seed 4242; moves priced with either sign, as
 * a moves branching row's dual may be): prc_price's value is the minimum
 * over every trajectory the verifier accepts, its bound is not above it,
 * and its trajectory, re-priced by the verifier, has that value. */
static void test_pricing_brute_force(void **state)
{
    (void)state;
    static const int cases[][3] = {{1, 3, 3}, {1, 4, 2}, {2, 3, 2}, {1, 3, 7}, {2, 3, 1}, {1, 4, 3}};
    uint64_t seed = 4242;
    int grazing = 0;
    for (int k = 0; k < 6; k++) {
        plan_problem pb;
        pg_random(&seed, &pb, 1, cases[k][0], cases[k][1], PG_PLAIN, cases[k][2]);
        for (int r = 0; r < 4; r++) {
            int n = pb.n_mobs * pb.n_weeks;
            double day[8], use[8], step[8], move[2] = {30 * (rnd(&seed) - 0.5), 30 * (rnd(&seed) - 0.5)};
            int step_min[1] = {1 + k % 3};
            for (int i = 0; i < n; i++) {
                day[i] = 0.5 * pb.cost_supplement_per_t * pb.mob[i / pb.n_weeks].demand_t_d *
                         (rnd(&seed) - 0.2);
                use[i] = -10 * rnd(&seed);
                step[i] = -15 * rnd(&seed);
            }
            /* half the rounds price visits of at least step_min days too, and
             * rounds 2 and 3 each mob's moves (either sign) */
            prc_duals du = {day, use, pb.penalty_terminal_per_t * rnd(&seed), r % 2, step_min, step,
                            r >= 2 ? move : NULL};
            double z_bf = brute_min(&pb, &du), value, bound;
            int days[8];
            unsigned char mow[4];
            assert_int_equal(prc_price(&pb, 0, &du, &value, &bound, days, mow), 0);
            assert_close(value, z_bf, 1e-6 * fmax(1.0, fabs(z_bf)));
            assert_true(bound <= z_bf + 1e-9);
            assert_true(bound >= z_bf - 1e-5 * fmax(1.0, fabs(z_bf)));
            plan pl;
            assert_int_equal(plan_alloc(&pb, &pl), 0);
            memcpy(pl.days, days, (size_t)n * sizeof *days);
            memcpy(pl.mow, mow, (size_t)pb.n_weeks);
            assert_close(priced(&pb, &pl, &du), z_bf, 1e-6 * fmax(1.0, fabs(z_bf)));
            for (int i = 0; i < n; i++)
                grazing += days[i] > 0;
            plan_free(&pl);
        }
        plan_problem_free(&pb);
    }
    assert_true(grazing > 0); /* the prices make some trajectories graze */
}

/* ---------------------------------------------- against the LP relaxation */

/* The compact model's LP relaxation optimum, from the exported model. */
static double compact_lp(const plan_problem *pb)
{
    char path[] = "/tmp/rowgraze-cg-XXXXXX";
    int fd = mkstemp(path);
    assert_true(fd >= 0);
    close(fd);
    rg_err e;
    assert_int_equal(pm_export(pb, path, 1, &e), 0);
    glp_term_out(GLP_OFF);
    glp_prob *lp = glp_create_prob();
    assert_int_equal(glp_read_mps(lp, GLP_MPS_FILE, NULL, path), 0);
    remove(path);
    glp_smcp sp;
    glp_init_smcp(&sp);
    sp.msg_lev = GLP_MSG_OFF;
    assert_int_equal(glp_simplex(lp, &sp), 0);
    assert_int_equal(glp_get_status(lp), GLP_OPT);
    double z = glp_get_obj_val(lp);
    glp_delete_prob(lp);
    glp_term_out(GLP_ON);
    return z;
}

/* An invented farm where the LP relaxation is weak: 5 paddocks, 1 mob,
 * 8 weeks, a 3-week rest and a costly move, demand about the farm's
 * growth.  The relaxation grazes every paddock a little every week; the
 * decomposition's columns cannot.  Checked: LP <= decomposition bound <=
 * optimum (PM_DIRECT) <= plan; the figures are printed. */
static void test_stronger_than_lp(void **state)
{
    (void)state;
    plan_problem pb;
    uint64_t seed = 99;
    pg_random(&seed, &pb, 5, 1, 8, PG_PLAIN, 5);
    pb.share_paddocks = 0;
    pb.rest_weeks = 3;
    pb.spell_weeks = 1;
    pb.max_paddocks_per_week = 2;
    pb.max_head_per_ha = 0;
    pb.cost_per_move = 40;
    pb.mob[0].is_cattle = 0;
    pb.mob[0].demand_t_d = 0.35;
    for (int i = 0; i < 5 * 8; i++)
        pb.open_days[i] = 7;
    double lp = compact_lp(&pb);
    plan cg, exact;
    assert_int_equal(plan_alloc(&pb, &cg), 0);
    assert_int_equal(plan_alloc(&pb, &exact), 0);
    pm_options o = {0, 0, NULL, 0, PM_DECOMP, 0};
    pm_result rc, re;
    assert_int_equal(pcg_solve(&pb, &o, &cg, &rc), 0);
    pm_options od = {60, 0, NULL, 0, PM_DIRECT, 0};
    assert_int_equal(pm_solve(&pb, &od, &exact, &re), 0);
    print_message("LP relaxation %.2f  decomposition bound %.2f  optimum %.2f (%s)  plan %.2f\n", lp,
                  rc.bound, re.objective, re.status == PM_OPTIMAL ? "proven" : "not proven",
                  rc.objective);
    assert_true(rc.bound >= lp - 1e-6 * fmax(1.0, fabs(lp)));
    assert_true(rc.bound > lp + 0.05 * fabs(re.objective)); /* strictly stronger here */
    assert_true(rc.bound <= re.bound + 1e-6 * fmax(1.0, fabs(re.bound)) || re.status != PM_OPTIMAL);
    assert_true(rc.bound <= re.objective + 1e-6 * fmax(1.0, fabs(re.objective)));
    assert_verified(&pb, &cg, rc.objective);
    plan_free(&cg);
    plan_free(&exact);
    plan_problem_free(&pb);
}

/* ------------------------------------------------------ strategy and errors */

/* PM_AUTO picks the compact strategy on a tiny farm (P T M <= 100) and
 * the decomposition on a larger one; both report as pm_solve does.  The
 * decomposition rejects a plan not shaped for the problem. */
static void test_auto_and_errors(void **state)
{
    (void)state;
    uint64_t seed = 5;
    plan_problem pb;
    pg_random(&seed, &pb, 3, 1, 4, PG_PLAIN, 3);
    plan out;
    assert_int_equal(plan_alloc(&pb, &out), 0);
    pm_options o = {0, 0, NULL, 0, PM_AUTO, 0};
    pm_result r;
    assert_int_equal(pm_solve(&pb, &o, &out, &r), 0);
    assert_int_equal(r.status, PM_OPTIMAL);
    assert_true(r.integers > 0); /* the compact model's d columns: PM_IMPROVE ran */
    assert_verified(&pb, &out, r.objective);
    plan bad = out;
    bad.n_weeks = 3;
    o.strategy = PM_DECOMP;
    assert_int_equal(pm_solve(&pb, &o, &bad, &r), -1);
    assert_int_equal(r.status, PM_ERROR);
    plan_free(&out);
    plan_problem_free(&pb);
    pg_random(&seed, &pb, 6, 2, 9, PG_PLAIN, 3); /* 108 cells: the decomposition */
    assert_int_equal(plan_alloc(&pb, &out), 0);
    o.strategy = PM_AUTO;
    o.time_limit_s = 3;
    assert_int_equal(pm_solve(&pb, &o, &out, &r), 0);
    assert_true(r.status == PM_OPTIMAL || r.status == PM_FEASIBLE);
    assert_int_equal(r.integers, 0); /* the master has no integer d columns */
    assert_true(r.binaries > 0);
    assert_verified(&pb, &out, r.objective);
    plan_free(&out);
    plan_problem_free(&pb);
}

/* Edge cases (seed 11): a farm with no mobs (the idle trajectories are the
 * only ones; the plan is the yard plan and the gap closes), a warm plan
 * that breaks a rule (refused, said so, the plan still verified) and one
 * that keeps them (used as the seed), shared paddocks with two mobs. */
static void test_edges(void **state)
{
    (void)state;
    uint64_t seed = 11;
    plan_problem pb;
    pg_random(&seed, &pb, 3, 0, 5, PG_PLAIN, 3);
    plan out;
    assert_int_equal(plan_alloc(&pb, &out), 0);
    pm_options o = {0, 0, NULL, 0, PM_DECOMP, 0};
    pm_result r;
    assert_int_equal(pcg_solve(&pb, &o, &out, &r), 0);
    assert_int_equal(r.status, PM_OPTIMAL);
    assert_verified(&pb, &out, r.objective);
    plan_free(&out);
    plan_problem_free(&pb);

    pg_random(&seed, &pb, 3, 2, 4, PG_PLAIN, 3);
    pb.share_paddocks = 1;
    plan warm;
    assert_int_equal(plan_alloc(&pb, &out), 0);
    assert_int_equal(plan_alloc(&pb, &warm), 0);
    warm.days[0] = 7; /* more than D = 3 days: breaks use[m,p,t] */
    o.warm = &warm;
    assert_int_equal(pcg_solve(&pb, &o, &out, &r), 0);
    assert_int_equal(r.warm, PM_WARM_REJECTED);
    assert_verified(&pb, &out, r.objective);
    memcpy(warm.days, out.days, sizeof *out.days * (size_t)(2 * 3 * 4));
    memcpy(warm.mow, out.mow, (size_t)(3 * 4));
    memcpy(warm.supplement_t, out.supplement_t, sizeof *out.supplement_t * (size_t)(2 * 4));
    double z = r.objective;
    assert_int_equal(pcg_solve(&pb, &o, &out, &r), 0);
    assert_true(r.warm == PM_WARM_USED || r.warm == PM_WARM_UNUSED);
    assert_true(r.objective <= z + 1e-6 * fmax(1.0, fabs(z)));
    assert_verified(&pb, &out, r.objective);
    plan exact;
    pm_result re;
    assert_int_equal(plan_alloc(&pb, &exact), 0);
    assert_int_equal(pm_solve(&pb, NULL, &exact, &re), 0);
    assert_true(r.bound <= re.objective + 1e-6 * fmax(1.0, fabs(re.objective)));
    plan_free(&exact);
    plan_free(&warm);
    plan_free(&out);
    plan_problem_free(&pb);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_pricing_brute_force),
        cmocka_unit_test(test_bound_optimum_plan),
        cmocka_unit_test(test_hull_row),
        cmocka_unit_test(test_branching_raises_bound),
        cmocka_unit_test(test_part_weeks),
        cmocka_unit_test(test_part_week_branch),
        cmocka_unit_test(test_stronger_than_lp),
        cmocka_unit_test(test_auto_and_errors),
        cmocka_unit_test(test_edges),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
