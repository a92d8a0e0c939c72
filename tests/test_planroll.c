/* test_planroll.c - the rolling horizon (planroll.c, docs/rolling.md)
 * against the compact model solved exactly, every rolled plan against the
 * independent verifier, and the coarse tail against rolling without one.
 *
 * What is checked and where the expected values come from:
 *   - the bound is the decomposition's Lagrangian bound of the whole
 *     horizon (Lübbecke & Desrosiers 2005, "Selected topics in column
 *     generation", Operations Research 53(6), section 2.1, from memory):
 *     it never exceeds the compact model's optimum, found here by pm_solve
 *     PM_DIRECT without limits (itself tested against brute force in
 *     test_planmilp.c), and neither the rolled plan nor the strategy's
 *     plan costs less than the optimum;
 *   - every rolled plan, on random problems with sharing, cattle, closed
 *     and part weeks, kept weeks, spells of 1-2 weeks and rests of 0-3
 *     weeks, passes pv_simulate (planverify.c) and costs what it says;
 *   - the feed-budget tail against a window with no end rule, on an
 *     invented farm worked by hand below.
 * Instances are random (a fixed generator) or invented; no figure here
 * comes from a publication.
 */
#include <stdlib.h>
#include <string.h>

#include "plan.h"
#include "planbase.h"
#include "planmilp.h"
#include "planroll.h"
#include "planverify.h"
#include "rgtest.h"
#include "plangen.h"



/* Holds the baseline's first n weeks as kept weeks (plan --keep): the
 * baseline keeps every rule, so the kept weeks do too. */
static void keep_baseline_weeks(plan_problem *pb, int n)
{
    plan b;
    assert_int_equal(pb_baseline(pb, &b), 0);
    size_t cells = (size_t)pb->n_mobs * pb->n_paddocks * pb->n_weeks;
    pb->fixed_days = calloc(cells + 1, sizeof *pb->fixed_days);
    assert_non_null(pb->fixed_days);
    memcpy(pb->fixed_days, b.days, cells * sizeof *b.days);
    pb->fixed_weeks = n;
    plan_free(&b);
}

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

/* Small instances that still roll (windows of 4 weeks, 2 kept): paddocks,
 * mobs, weeks. */
static const int shapes[][3] = {{2, 1, 6}, {3, 1, 6}, {2, 2, 6}, {3, 1, 8}, {2, 1, 8}, {3, 2, 5}};

/* Random small instances (seed 4242): bound <= optimum (PM_DIRECT, no
 * limit) <= the rolled plan, and optimum <= the strategy's plan; both plans
 * pass the verifier at the cost reported; the strategy's plan is no
 * costlier than the rolled one nor than the baseline; where its gap closes
 * it costs the optimum. */
static void test_bound_optimum_plan(void **state)
{
    (void)state;
    uint64_t seed = 4242;
    prl_options ro = {4, 2, PRL_TAIL_BUDGET};
    int n = (int)(sizeof shapes / sizeof shapes[0]);
    for (int k = 0; k < n; k++) {
        plan_problem pb;
        pg_random(&seed, &pb, shapes[k][0], shapes[k][1], shapes[k][2], PG_ROLL, 0);
        plan exact, rolled, best, base;
        assert_int_equal(plan_alloc(&pb, &exact), 0);
        assert_int_equal(plan_alloc(&pb, &rolled), 0);
        assert_int_equal(plan_alloc(&pb, &best), 0);
        assert_int_equal(pb_baseline(&pb, &base), 0);
        pv_result vb;
        assert_int_equal(pv_simulate(&pb, &base, &vb), 0);
        pm_result re, rr, rs;
        assert_int_equal(pm_solve(&pb, NULL, &exact, &re), 0);
        assert_int_equal(re.status, PM_OPTIMAL);
        pm_options o = {0, 0, NULL, 0, PM_ROLLING, 0};
        assert_int_equal(prl_roll(&pb, &o, &ro, &rolled, &rr), 0);
        assert_int_equal(rr.status, PM_FEASIBLE);
        assert_true(rr.bound == -HUGE_VAL); /* a window gives no bound of the whole */
        assert_int_equal(prl_solve(&pb, &o, &ro, &best, &rs), 0);
        assert_true(rs.status == PM_OPTIMAL || rs.status == PM_FEASIBLE);
        assert_int_equal(rs.strategy, PM_ROLLING);
        double opt = re.objective, tol = 1e-6 * fmax(1.0, fabs(opt));
        print_message("instance %d: %dP %dM %dW  bound %.4f  optimum %.4f  rolled %.4f  plan %.4f  baseline %.4f\n",
                      k, shapes[k][0], shapes[k][1], shapes[k][2], rs.bound, opt, rr.objective, rs.objective,
                      vb.cost_total);
        assert_true(rs.bound <= opt + tol);
        assert_true(rr.objective >= opt - tol);
        assert_true(rs.objective >= opt - tol);
        assert_true(rs.objective <= rr.objective + tol);
        assert_true(rs.objective <= vb.cost_total + tol);
        assert_verified(&pb, &rolled, rr.objective);
        assert_verified(&pb, &best, rs.objective);
        assert_close(rs.gap, (rs.objective - rs.bound) / fmax(1e-9, fabs(rs.objective)), 1e-12);
        if (rs.status == PM_OPTIMAL)
            assert_close(rs.objective, opt, tol);
        pv_free(&vb);
        plan_free(&base);
        plan_free(&exact);
        plan_free(&rolled);
        plan_free(&best);
        plan_problem_free(&pb);
    }
}

/* Through pm_solve (PM_ROLLING, the default windows of 12 weeks rolled 4
 * at a time) on a 16-week problem, stopping within 1 %: the same result as
 * prl_solve with no options, reported as the rolling strategy. */
static void test_through_pm_solve(void **state)
{
    (void)state;
    uint64_t seed = 77;
    plan_problem pb;
    pg_random(&seed, &pb, 2, 1, 16, PG_ROLL, 0);
    plan a, b;
    assert_int_equal(plan_alloc(&pb, &a), 0);
    assert_int_equal(plan_alloc(&pb, &b), 0);
    pm_options o = {0, 0.01, NULL, 0, PM_ROLLING, 0};
    pm_result ra, rb;
    assert_int_equal(pm_solve(&pb, &o, &a, &ra), 0);
    assert_int_equal(prl_solve(&pb, &o, NULL, &b, &rb), 0);
    assert_int_equal(ra.strategy, PM_ROLLING);
    assert_true(ra.status == PM_OPTIMAL || ra.status == PM_FEASIBLE);
    assert_true(ra.bound > -HUGE_VAL && ra.bound <= ra.objective);
    assert_close(ra.objective, rb.objective, 0.0); /* no time limit: deterministic */
    assert_close(ra.bound, rb.bound, 0.0);
    assert_memory_equal(a.days, b.days, sizeof *a.days * (size_t)pb.n_paddocks * pb.n_weeks);
    assert_non_null(strstr(ra.msg, "rolled plan"));
    assert_verified(&pb, &a, ra.objective);
    plan_free(&a);
    plan_free(&b);
    plan_problem_free(&pb);
}

/* Random problems with everything a window must carry across its seam
 * (seed 9090; 30 problems, 2-4 paddocks, 1-3 mobs, 6-14 weeks, windows of
 * 2-5 weeks keeping 1-3, a third with kept weeks): every rolled plan, with
 * each of the three tails, passes the verifier at the cost reported and
 * keeps the kept weeks. */
static void test_rolled_plans_verified(void **state)
{
    (void)state;
    uint64_t seed = 9090;
    for (int k = 0; k < 30; k++) {
        int P = 2 + (int)(3 * rnd(&seed)), M = 1 + (int)(3 * rnd(&seed)), T = 6 + (int)(9 * rnd(&seed));
        int W = 2 + (int)(4 * rnd(&seed)), R = 1 + (int)(3 * rnd(&seed));
        int keep = rnd(&seed) < 0.33 ? 1 + (int)(4 * rnd(&seed)) : 0;
        plan_problem pb;
        pg_random(&seed, &pb, P, M, T, PG_RICH, 0);
        if (keep)
            keep_baseline_weeks(&pb, keep);
        for (int tail = PRL_TAIL_BUDGET; tail <= PRL_TAIL_TARGET; tail++) {
            prl_options ro = {W, R, tail};
            plan pl;
            assert_int_equal(plan_alloc(&pb, &pl), 0);
            pm_options o = {0, 0.01, NULL, 0, PM_ROLLING, 0};
            pm_result r;
            assert_int_equal(prl_roll(&pb, &o, &ro, &pl, &r), 0);
            if (r.status != PM_FEASIBLE)
                print_error("problem %d (%dP %dM %dW, W %d R %d, tail %d): %s\n", k, P, M, T, W, R, tail, r.msg);
            assert_int_equal(r.status, PM_FEASIBLE);
            assert_verified(&pb, &pl, r.objective);
            for (int m = 0; m < M; m++)
                for (int p = 0; p < P; p++)
                    for (int t = 0; t < keep && t < T; t++) {
                        size_t i = ((size_t)m * P + p) * T + t;
                        assert_int_equal(pl.days[i], pb.fixed_days[i]);
                    }
            plan_free(&pl);
        }
        plan_problem_free(&pb);
    }
}

/* An invented farm worked by hand (docs/rolling.md, "The coarse tail"):
 * 4 paddocks of 1 ha, residual 1.0, ceiling 4.0, start cover 2.0 t DM/ha,
 * no senescence; growth 50 kg DM/ha/day in weeks 0-7, none after; every
 * paddock closed in weeks 8-11 (a maintenance shutdown); one mob eating
 * 0.15 t DM/day (1.05 t a week); rest 2 weeks, spells of 1 week, 7 days a
 * visit, 2 paddocks a week; supplement 300 per t, end shortfall 600 per t
 * below a mean end cover of 3.0 t DM/ha (12 t), mowing 60 per ha, a move
 * 10.  The farm grows 1.4 t a week in weeks 0-7 and the mob eats at most
 * 1.05 t, so it ends with 8 + 8 x 1.4 - E = 19.2 - E t where E is what it
 * grazes: every tonne grazed beyond 7.2 t in weeks 0-7 costs 600 at the
 * end and saves only 300 of supplement.  Windows of 4 weeks keeping 2:
 * with no end rule, the windows [0,4), [2,6), [4,8) see nothing of the
 * shutdown and graze as much as they can (about 8 t); the budget tail
 * gives the window ending at week 8 the target 12 t at 600 per t (nothing
 * grows or is grazed in weeks 8-11, so need_8 = 12 t and the price is
 * carried back undiscounted through the closed weeks), and the plan grazes
 * only what the end cover can spare.  Expected (hand estimate): the no-tail
 * plan ends about 1.2 t short (720) where the tail's feeds 1.2 t more
 * supplement (360), so the tail's plan is cheaper by about 360, less
 * differences in moves and mowing; checked: cheaper by at least 200, and
 * never below the compact model's optimum.  (Measured: 1,690 with the tail,
 * 2,060 without, 1,690 with the horizon's end rule at every window, and
 * the optimum 1,690.) */
static void test_tail_beats_myopic(void **state)
{
    (void)state;
    plan_problem pb;
    memset(&pb, 0, sizeof pb);
    int P = 4, T = 12;
    pb.n_paddocks = P;
    pb.n_mobs = 1;
    pb.n_weeks = T;
    pb.pd = calloc((size_t)P, sizeof *pb.pd);
    pb.mob = calloc(1, sizeof *pb.mob);
    pb.growth_t_ha_d = calloc((size_t)P * T, sizeof(double));
    pb.open_days = calloc((size_t)P * T, sizeof(int));
    assert_true(pb.pd && pb.mob && pb.growth_t_ha_d && pb.open_days);
    for (int p = 0; p < P; p++) {
        snprintf(pb.pd[p].id, PLAN_ID_LEN, "P%d", p + 1);
        pb.pd[p].area_ha = 1.0;
        pb.pd[p].residual_t_ha = 1.0;
        pb.pd[p].ceiling_t_ha = 4.0;
        pb.pd[p].cover0_t_ha = 2.0;
        for (int t = 0; t < T; t++) {
            pb.growth_t_ha_d[p * T + t] = t < 8 ? 0.05 : 0.0;
            pb.open_days[p * T + t] = t < 8 ? 7 : 0;
        }
    }
    snprintf(pb.mob[0].id, PLAN_ID_LEN, "flock");
    pb.mob[0].head = 100;
    pb.mob[0].demand_t_d = 0.15;
    pb.rest_weeks = 2;
    pb.spell_weeks = 1;
    pb.max_days_per_visit = 7;
    pb.max_paddocks_per_week = 2;
    pb.terminal_t_ha = 3.0;
    pb.cost_supplement_per_t = 300;
    pb.penalty_terminal_per_t = 600;
    pb.cost_mowing_per_ha = 60;
    pb.cost_per_move = 10;
    double z[3];
    for (int tail = PRL_TAIL_BUDGET; tail <= PRL_TAIL_TARGET; tail++) {
        prl_options ro = {4, 2, tail};
        plan pl;
        assert_int_equal(plan_alloc(&pb, &pl), 0);
        pm_result r;
        assert_int_equal(prl_roll(&pb, NULL, &ro, &pl, &r), 0);
        assert_int_equal(r.status, PM_FEASIBLE);
        assert_verified(&pb, &pl, r.objective);
        z[tail] = r.objective;
        plan_free(&pl);
    }
    plan exact;
    assert_int_equal(plan_alloc(&pb, &exact), 0);
    pm_result re;
    assert_int_equal(pm_solve(&pb, NULL, &exact, &re), 0);
    print_message("budget tail %.2f, no tail %.2f, end rule at every window %.2f, optimum %.2f\n",
                  z[PRL_TAIL_BUDGET], z[PRL_TAIL_NONE], z[PRL_TAIL_TARGET], re.objective);
    assert_true(z[PRL_TAIL_BUDGET] <= z[PRL_TAIL_NONE] - 200);
    assert_true(z[PRL_TAIL_BUDGET] >= re.objective - 1e-6 * re.objective);
    plan_free(&exact);
    plan_problem_free(&pb);
}

/* Bad calls: no result, a plan of the wrong size. */
static void test_errors(void **state)
{
    (void)state;
    uint64_t seed = 5;
    plan_problem pb, other;
    pg_random(&seed, &pb, 2, 1, 6, PG_ROLL, 0);
    pg_random(&seed, &other, 3, 1, 6, PG_ROLL, 0);
    plan wrong;
    assert_int_equal(plan_alloc(&other, &wrong), 0);
    pm_result r;
    assert_int_equal(prl_roll(&pb, NULL, NULL, &wrong, &r), -1);
    assert_int_equal(r.status, PM_ERROR);
    assert_int_equal(prl_solve(&pb, NULL, NULL, &wrong, &r), -1);
    assert_int_equal(r.status, PM_ERROR);
    assert_int_equal(prl_roll(&pb, NULL, NULL, &wrong, NULL), -1);
    plan_free(&wrong);
    plan_problem_free(&pb);
    plan_problem_free(&other);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_bound_optimum_plan),
        cmocka_unit_test(test_through_pm_solve),
        cmocka_unit_test(test_rolled_plans_verified),
        cmocka_unit_test(test_tail_beats_myopic),
        cmocka_unit_test(test_errors),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
