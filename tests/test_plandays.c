/* test_plandays.c - laying a mob's weekly visits on days (plandays.c).
 *
 * Every expected placement is worked out by hand in the comment above the
 * check: days are numbered 0 (the week's first day) to 6; a paddock's
 * open_mask has bit i set when day i is free.
 */
#include <stdlib.h>
#include <string.h>

#include "plan.h"
#include "plandays.h"
#include "planmilp.h"
#include "planverify.h"
#include "rgtest.h"

static void mk(plan_problem *pb, plan *pl, int P, int T)
{
    memset(pb, 0, sizeof *pb);
    pb->n_paddocks = P;
    pb->n_mobs = 1;
    pb->n_weeks = T;
    pb->pd = calloc((size_t)P, sizeof *pb->pd);
    pb->mob = calloc(1, sizeof *pb->mob);
    pb->growth_t_ha_d = calloc((size_t)(P * T), sizeof *pb->growth_t_ha_d);
    pb->open_days = calloc((size_t)(P * T), sizeof *pb->open_days);
    pb->open_mask = calloc((size_t)(P * T), 1);
    assert_non_null(pb->open_mask);
    for (int i = 0; i < P * T; i++) {
        pb->open_days[i] = 7;
        pb->open_mask[i] = 0x7f;
    }
    assert_int_equal(plan_alloc(pb, pl), 0);
}

static int *D(const plan_problem *pb, plan *pl, int p, int t)
{
    return &pl->days[(size_t)p * pb->n_weeks + (size_t)t];
}

/* p0 3 days, p1 4 days, every day free: in paddock order, p0 on days 0-2
 * and p1 on 3-6.  With p1 the paddock of the week before, p1 first: 0-3,
 * then p0 4-6. */
static void test_order(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    int first[2];
    mk(&pb, &pl, 2, 1);
    *D(&pb, &pl, 0, 0) = 3;
    *D(&pb, &pl, 1, 0) = 4;
    assert_int_equal(pday_place(&pb, &pl, 0, 0, -1, first), 0);
    assert_int_equal(first[0], 0);
    assert_int_equal(first[1], 3);
    assert_int_equal(pday_place(&pb, &pl, 0, 0, 1, first), 0);
    assert_int_equal(first[1], 0);
    assert_int_equal(first[0], 4);
    assert_int_equal(pday_last_of(&pb, &pl, 0, 0, first), 0);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* p0 closed on days 0-2 (a window, or rest that ends on day 3): p0's 3 days
 * cannot start the week, so p1 takes 0-3 and p0 4-6.  A single visit of 3
 * days to a paddock free only on days 4-6 starts on day 4, leaving days
 * 0-3 off pasture. */
static void test_closed_days(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    int first[2];
    mk(&pb, &pl, 2, 1);
    pb.open_mask[0] = 0x78; /* days 3..6 free */
    *D(&pb, &pl, 0, 0) = 3;
    *D(&pb, &pl, 1, 0) = 4;
    assert_int_equal(pday_place(&pb, &pl, 0, 0, -1, first), 0);
    assert_int_equal(first[1], 0);
    assert_int_equal(first[0], 4);
    *D(&pb, &pl, 1, 0) = 0;
    pb.open_mask[0] = 0x70; /* days 4..6 free */
    assert_int_equal(pday_place(&pb, &pl, 0, 0, -1, first), 0);
    assert_int_equal(first[0], 4);
    assert_int_equal(first[1], -1);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* p0 free only on day 6, 3 days asked, with p1 4 days: no order keeps p0
 * off closed days.  End to end, p1 then p0 puts p0 on days 4-6: 2 closed
 * days (4, 5); p0 then p1 puts p0 on 0-2: 3 closed.  The fewest: 2.  Eight
 * days in a week are refused. */
static void test_unavoidable(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    int first[2];
    mk(&pb, &pl, 2, 1);
    pb.open_mask[0] = 0x40;
    *D(&pb, &pl, 0, 0) = 3;
    *D(&pb, &pl, 1, 0) = 4;
    assert_int_equal(pday_place(&pb, &pl, 0, 0, -1, first), 2);
    assert_int_equal(first[1], 0);
    assert_int_equal(first[0], 4);
    *D(&pb, &pl, 1, 0) = 5;
    assert_int_equal(pday_place(&pb, &pl, 0, 0, -1, first), -1);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Row part[m,p,t] (docs/planner.md): p0 is free on days 3-6 only (4 days)
 * at cover 2.0, p1 every day at cover 1.3; both 1 ha, residual 1.0, no
 * growth; the mob eats 0.1 t/day, supplement costs 100 per t, a move 1.
 * Without the row the cheapest week is p1 3 days (all it holds above the
 * residual) + p0 4 days: no supplement, 2 moves, cost 2.  With it the mob
 * uses one paddock: p0 alone (4 days, 0.3 t supplement: cost 31) or p1
 * alone (3 days, 0.4 t: cost 41); the optimum is p0 4 days, cost 31.  The
 * verifier refuses the plan that uses both. */
static void test_part_row(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, &pl, 2, 1);
    pb.open_mask[0] = 0x78;
    pb.open_days[0] = 4;
    for (int p = 0; p < 2; p++) {
        snprintf(pb.pd[p].id, PLAN_ID_LEN, "p%d", p);
        pb.pd[p].area_ha = 1;
        pb.pd[p].cover0_t_ha = p == 0 ? 2.0 : 1.3;
        pb.pd[p].residual_t_ha = 1.0;
        pb.pd[p].ceiling_t_ha = 5.0;
    }
    snprintf(pb.mob[0].id, PLAN_ID_LEN, "m");
    pb.mob[0].head = 10;
    pb.mob[0].demand_t_d = 0.1;
    pb.rest_weeks = 1;
    pb.spell_weeks = 1;
    pb.max_days_per_visit = 7;
    pb.max_paddocks_per_week = 2;
    pb.cost_supplement_per_t = 100;
    pb.cost_per_move = 1;
    pm_result res;
    pm_options o = {.strategy = PM_DIRECT};
    assert_int_equal(pm_solve(&pb, &o, &pl, &res), 0);
    assert_int_equal(res.status, PM_OPTIMAL);
    assert_close(res.objective, 31.0, 1e-6);
    assert_int_equal(*D(&pb, &pl, 0, 0), 4);
    assert_int_equal(*D(&pb, &pl, 1, 0), 0);
    /* both paddocks in the week: the verifier names the row */
    *D(&pb, &pl, 0, 0) = 4;
    *D(&pb, &pl, 1, 0) = 3;
    pl.supplement_t[0] = 0;
    pv_result v;
    assert_int_equal(pv_simulate(&pb, &pl, &v), 1);
    assert_non_null(strstr(v.first_violation, "part[m,p0,0]"));
    pv_free(&v);
    plan_free(&pl);
    plan_problem_free(&pb);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_order),
        cmocka_unit_test(test_closed_days),
        cmocka_unit_test(test_unavoidable),
        cmocka_unit_test(test_part_row),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
