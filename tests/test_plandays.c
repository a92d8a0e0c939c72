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

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_order),
        cmocka_unit_test(test_closed_days),
        cmocka_unit_test(test_unavoidable),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
