/* test_planverify.c - the plan verifier: covers and costs of hand-made plans
 * worked out by hand in the comments (the recursion of docs/planner.md),
 * and one broken plan per rule, each checked for the row name the page
 * gives the rule.  The small instances are invented for the tests. */
#include <stdlib.h>
#include <string.h>

#include "planverify.h"
#include "rgtest.h"

/* A problem of P paddocks, M mobs and T weeks with plain defaults: 1 ha,
 * cover 2.0, residual 1.0, ceiling 3.0, no growth, no senescence, open all
 * week; mobs of 100 head eating 0.1 t DM/day; D = 7, S = 1, L = 0, K = 1,
 * no sharing, no density limit, no terminal target; c_s 300, c_w 60,
 * c_v 25, c_T 300.  Ids "p0", "p1"... and "m0", "m1"... */
static void mk(plan_problem *pb, int P, int M, int T)
{
    memset(pb, 0, sizeof *pb);
    pb->n_paddocks = P;
    pb->n_mobs = M;
    pb->n_weeks = T;
    pb->pd = calloc((size_t)P, sizeof *pb->pd);
    pb->mob = calloc((size_t)M, sizeof *pb->mob);
    pb->growth_t_ha_d = calloc((size_t)(P * T), sizeof *pb->growth_t_ha_d);
    pb->open_days = calloc((size_t)(P * T), sizeof *pb->open_days);
    assert_non_null(pb->pd);
    assert_non_null(pb->mob);
    assert_non_null(pb->growth_t_ha_d);
    assert_non_null(pb->open_days);
    for (int p = 0; p < P; p++) {
        plan_paddock *q = &pb->pd[p];
        snprintf(q->id, sizeof q->id, "p%d", p);
        q->area_ha = 1.0;
        q->cover0_t_ha = 2.0;
        q->residual_t_ha = 1.0;
        q->ceiling_t_ha = 3.0;
        for (int t = 0; t < T; t++)
            pb->open_days[p * T + t] = 7;
    }
    for (int m = 0; m < M; m++) {
        snprintf(pb->mob[m].id, sizeof pb->mob[m].id, "m%d", m);
        pb->mob[m].head = 100;
        pb->mob[m].demand_t_d = 0.1;
    }
    pb->max_days_per_visit = 7;
    pb->spell_weeks = 1;
    pb->max_paddocks_per_week = 1;
    pb->cost_supplement_per_t = 300;
    pb->cost_mowing_per_ha = 60;
    pb->cost_per_move = 25;
    pb->penalty_terminal_per_t = 300;
}

static int *D(plan *pl, int m, int p, int t)
{
    return &pl->days[(m * pl->n_paddocks + p) * pl->n_weeks + t];
}

/* Sets mob m's supplement in every week to what the feed row asks. */
static void feed_rest(const plan_problem *pb, plan *pl)
{
    for (int m = 0; m < pb->n_mobs; m++)
        for (int t = 0; t < pb->n_weeks; t++) {
            int sum = 0;
            for (int p = 0; p < pb->n_paddocks; p++)
                sum += *D(pl, m, p, t);
            pl->supplement_t[m * pb->n_weeks + t] =
                7.0 * pb->mob[m].demand_t_d - pb->mob[m].demand_t_d * sum;
        }
}

/* Runs the verifier, expects rc, and (when rc == 1) a first violation that
 * starts with `row`; returns the violation count. */
static int expect(const plan_problem *pb, const plan *pl, int rc, const char *row)
{
    pv_result r;
    int got = pv_simulate(pb, pl, &r);
    if (got != rc || (row && strncmp(r.first_violation, row, strlen(row)) != 0))
        print_error("rc %d, first violation \"%s\"\n", got, r.first_violation);
    assert_int_equal(got, rc);
    if (row)
        assert_int_equal(strncmp(r.first_violation, row, strlen(row)), 0);
    int n = r.n_violations;
    pv_free(&r);
    return n;
}

/* 1 paddock of 2 ha, 1 mob of 0.15 t DM/day, 2 weeks; growth 0.05
 * t/ha/day, senescence 0.01/day; grazed 5 days in week 0.  By hand
 * (docs/planner.md, bal):
 *   x1 = (1 - 0.07) 2.0 + 0.35 - 0.15 x 5 / 2 = 1.86 + 0.35 - 0.375 = 1.835
 *   x2 = 0.93 x 1.835 + 0.35 = 2.05655
 * supplement 0.15 x 2 + 0.15 x 7 = 1.35 t -> 405; 1 move -> 25;
 * terminal 2.5 t/ha target: u = 2.5 x 2 - 2 x 2.05655 = 0.8869 t -> 266.07;
 * total 696.07. */
static void test_hand_cover_and_cost(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 2);
    pb.pd[0].area_ha = 2.0;
    pb.pd[0].senescence_per_day = 0.01;
    pb.growth_t_ha_d[0] = pb.growth_t_ha_d[1] = 0.05;
    pb.mob[0].demand_t_d = 0.15;
    pb.terminal_t_ha = 2.5;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 5;
    pl.supplement_t[0] = 0.3;
    pl.supplement_t[1] = 1.05;
    pv_result r;
    assert_int_equal(pv_simulate(&pb, &pl, &r), 0);
    assert_string_equal(r.first_violation, "");
    assert_close(r.cover_t_ha[0], 2.0, 1e-12);
    assert_close(r.cover_t_ha[1], 1.835, 1e-12);
    assert_close(r.cover_t_ha[2], 2.05655, 1e-12);
    assert_close(r.supplement_t, 1.35, 1e-12);
    assert_int_equal(r.moves, 1);
    assert_close(r.terminal_shortfall_t, 0.8869, 1e-12);
    assert_close(r.cost_supplement, 405.0, 1e-9);
    assert_close(r.cost_moves, 25.0, 1e-9);
    assert_close(r.cost_mowing, 0.0, 1e-12);
    assert_close(r.penalty_terminal, 266.07, 1e-9);
    assert_close(r.cost_total, 696.07, 1e-9);
    pv_free(&r);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Two paddocks a, b of 1 ha, growth 0.1 t/ha/day, a mob of 0.1 t/day, 3
 * weeks: a in week 0, b in week 1, a in week 2 (7 days each). By hand:
 *   a: 2.8 -> 2.8 + 0.7 - 0.7 = 2.8 -> 3.5 above the 3.0 ceiling, mowed to
 *      1.0 -> 1.0 + 0.7 - 0.7 = 1.0 (at the residual: res holds);
 *   b: 1.5 -> 2.2 -> 2.2 -> 2.9.
 * 3 moves (75), 1 ha mowed (60), no supplement: total 135. */
static void build_abab(plan_problem *pb, plan *pl)
{
    mk(pb, 2, 1, 3);
    pb->pd[0].cover0_t_ha = 2.8;
    pb->pd[1].cover0_t_ha = 1.5;
    for (int i = 0; i < 6; i++)
        pb->growth_t_ha_d[i] = 0.1;
    assert_int_equal(plan_alloc(pb, pl), 0);
    *D(pl, 0, 0, 0) = 7;
    *D(pl, 0, 1, 1) = 7;
    *D(pl, 0, 0, 2) = 7;
    pl->mow[0 * 3 + 1] = 1;
    feed_rest(pb, pl);
}

static void test_hand_mowing_and_moves(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    build_abab(&pb, &pl);
    pv_result r;
    assert_int_equal(pv_simulate(&pb, &pl, &r), 0);
    const double a[4] = {2.8, 2.8, 1.0, 1.0}, b[4] = {1.5, 2.2, 2.2, 2.9};
    for (int t = 0; t < 4; t++) {
        assert_close(r.cover_t_ha[t], a[t], 1e-12);
        assert_close(r.cover_t_ha[4 + t], b[t], 1e-12);
    }
    assert_int_equal(r.moves, 3);
    assert_close(r.mowed_ha, 1.0, 0);
    assert_close(r.supplement_t, 0.0, 1e-12);
    assert_close(r.cost_total, 135.0, 1e-9);
    pv_free(&r);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* A stay over consecutive weeks is one move; leaving and coming back is
 * two (move row, y_mp,-1 = 0; docs/planner.md). Spell of 3 weeks allowed,
 * 2 days a week on the default paddock (cover 2.0 -> 1.8 -> 1.6). */
static void test_moves_counted(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 3);
    pb.spell_weeks = 3;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 2;
    *D(&pl, 0, 0, 1) = 2;
    feed_rest(&pb, &pl);
    pv_result r;
    assert_int_equal(pv_simulate(&pb, &pl, &r), 0);
    assert_int_equal(r.moves, 1);
    pv_free(&r);
    *D(&pl, 0, 0, 1) = 0;
    *D(&pl, 0, 0, 2) = 2;
    feed_rest(&pb, &pl);
    assert_int_equal(pv_simulate(&pb, &pl, &r), 0);
    assert_int_equal(r.moves, 2);
    assert_close(r.cover_t_ha[3], 1.6, 1e-12);
    pv_free(&r);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Residual: 6 days of 0.1 t on 1 ha from 1.5 ends at 0.9 < 1.0 (res). */
static void test_breaks_residual(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 1);
    pb.pd[0].cover0_t_ha = 1.5;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 5;
    feed_rest(&pb, &pl);
    expect(&pb, &pl, 0, NULL); /* 5 days end exactly at 1.0 */
    *D(&pl, 0, 0, 0) = 6;
    feed_rest(&pb, &pl);
    assert_int_equal(expect(&pb, &pl, 1, "res[p0,0]"), 1);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Ceiling: ungrazed from 2.8 with 0.1 t/ha/day ends at 3.5 > 3.0 (ceil);
 * mowed, it ends at the residual and is legal. */
static void test_breaks_ceiling(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 1);
    pb.pd[0].cover0_t_ha = 2.8;
    pb.growth_t_ha_d[0] = 0.1;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    feed_rest(&pb, &pl);
    assert_int_equal(expect(&pb, &pl, 1, "ceil[p0,0]"), 1);
    pl.mow[0] = 1;
    expect(&pb, &pl, 0, NULL);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Rest: the a-b-a plan above with 2 weeks' rest: a's spell ends in week 0
 * and it is grazed again in week 2 (rest[a,0,2]); with 1 week it is legal. */
static void test_breaks_rest(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    build_abab(&pb, &pl);
    pb.rest_weeks = 1;
    expect(&pb, &pl, 0, NULL);
    pb.rest_weeks = 2;
    assert_int_equal(expect(&pb, &pl, 1, "rest[p0,0,2]"), 1);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* One mob per paddock: two mobs one day each in p0 (one), legal when
 * sharing is allowed. */
static void test_breaks_one_mob(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 2, 1);
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 1;
    *D(&pl, 1, 0, 0) = 1;
    feed_rest(&pb, &pl);
    assert_int_equal(expect(&pb, &pl, 1, "one[p0,0]"), 1);
    pb.share_paddocks = 1;
    expect(&pb, &pl, 0, NULL);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Paddocks per week: one mob in two paddocks with K = 1 (kmax). */
static void test_breaks_kmax(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 2, 1, 1);
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 3;
    *D(&pl, 0, 1, 0) = 3;
    feed_rest(&pb, &pl);
    assert_int_equal(expect(&pb, &pl, 1, "kmax[m0,0]"), 1);
    pb.max_paddocks_per_week = 2;
    expect(&pb, &pl, 0, NULL);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Visit: with max_days_per_visit 3 (D = 3), two sharing mobs of 2 days
 * each give 4 days in the paddock (visit only); one mob of 5 days breaks
 * its own use row first, then visit (2 rows). */
static void test_breaks_visit(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 2, 1);
    pb.max_days_per_visit = 3;
    pb.share_paddocks = 1;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 2;
    *D(&pl, 1, 0, 0) = 2;
    feed_rest(&pb, &pl);
    assert_int_equal(expect(&pb, &pl, 1, "visit[p0,0]"), 1);
    *D(&pl, 1, 0, 0) = 0;
    *D(&pl, 0, 0, 0) = 5;
    feed_rest(&pb, &pl);
    assert_int_equal(expect(&pb, &pl, 1, "use[m0,p0,0]"), 2);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Spell: S = 1, grazed in weeks 0 and 1 (spell[p0,0]). */
static void test_breaks_spell(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 2);
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 2;
    *D(&pl, 0, 0, 1) = 2;
    feed_rest(&pb, &pl);
    assert_int_equal(expect(&pb, &pl, 1, "spell[p0,0]"), 1);
    pb.spell_weeks = 2;
    expect(&pb, &pl, 0, NULL);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Cattle: a cattle mob in a paddock barred to cattle (cattle row). */
static void test_breaks_cattle(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 1);
    pb.mob[0].is_cattle = 1;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 2;
    feed_rest(&pb, &pl);
    expect(&pb, &pl, 0, NULL);
    pb.pd[0].cattle_barred = 1;
    assert_int_equal(expect(&pb, &pl, 1, "cattle[m0,p0,0]"), 1);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Density: 100 head on 1 ha with at most 50 head/ha (dens); 100 head/ha
 * is legal. */
static void test_breaks_density(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 1);
    pb.max_head_per_ha = 50;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 2;
    feed_rest(&pb, &pl);
    assert_int_equal(expect(&pb, &pl, 1, "dens[p0,0]"), 1);
    pb.max_head_per_ha = 100;
    expect(&pb, &pl, 0, NULL);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Closed days: the paddock is open 3 days of the week (maintenance), the
 * mob grazes 5 (use: d <= min(O, D)); also a closed week (O = 0). */
static void test_breaks_closed_day(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 1);
    pb.open_days[0] = 3;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 3;
    feed_rest(&pb, &pl);
    expect(&pb, &pl, 0, NULL);
    *D(&pl, 0, 0, 0) = 5;
    feed_rest(&pb, &pl);
    assert_int_equal(expect(&pb, &pl, 1, "use[m0,p0,0]: 5 days, at most 3 (open 3"), 1);
    pb.open_days[0] = 0;
    *D(&pl, 0, 0, 0) = 1;
    feed_rest(&pb, &pl);
    assert_int_equal(expect(&pb, &pl, 1, "use[m0,p0,0]"), 1);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Feed: the mob grazes 2 days of 0.1 t, so supplement must be 0.5 t;
 * 0.5 + 2e-6 is outside the 1e-6 t tolerance, 0.5 + 5e-7 inside. */
static void test_breaks_feed(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 1);
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 2;
    pl.supplement_t[0] = 0.5 + 5e-7;
    expect(&pb, &pl, 0, NULL);
    pl.supplement_t[0] = 0.5 + 2e-6;
    assert_int_equal(expect(&pb, &pl, 1, "feed[m0,0]"), 1);
    pl.supplement_t[0] = 0.0;
    assert_int_equal(expect(&pb, &pl, 1, "feed[m0,0]"), 1);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Days: 4 + 4 days in two paddocks is 8 days in a week (days row; the
 * feed row then asks for negative supplement and breaks as well). */
static void test_breaks_days(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 2, 1, 1);
    pb.max_paddocks_per_week = 2;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 4;
    *D(&pl, 0, 1, 0) = 4;
    assert_int_equal(expect(&pb, &pl, 1, "days[m0,0]"), 2);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Mowing below the residual: ungrazed, 1.6 -> 1.6 (1 - 7 s) = 0.8 with
 * s = 0.5/7 a day (no growth), below R = 1.0, so mowing it breaks mowlo; the same week
 * unmowed is legal (the paddock is not grazed). */
static void test_breaks_mowlo(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 1);
    pb.pd[0].cover0_t_ha = 1.6;
    pb.pd[0].senescence_per_day = 0.5 / 7.0;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    feed_rest(&pb, &pl);
    pv_result r;
    assert_int_equal(pv_simulate(&pb, &pl, &r), 0);
    assert_close(r.cover_t_ha[1], 0.8, 1e-12);
    pv_free(&r);
    pl.mow[0] = 1;
    assert_int_equal(expect(&pb, &pl, 1, "mowlo[p0,0]"), 1);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Negative cover: senescence of 0.2/day takes 2.0 to 2.0 x (1 - 1.4) =
 * -0.8 (bal: the balance cannot hold with x >= 0). */
static void test_breaks_balance(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 1);
    pb.pd[0].senescence_per_day = 0.2;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    feed_rest(&pb, &pl);
    assert_int_equal(expect(&pb, &pl, 1, "bal[p0,0]"), 1);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Several broken rows are all counted; the first named is the earliest
 * week's (residual in week 0 before kmax in week 1). */
static void test_counts_all(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 2, 1, 2);
    pb.pd[0].cover0_t_ha = 1.5;
    pb.spell_weeks = 2;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 6;                 /* res[p0,0] */
    *D(&pl, 0, 0, 1) = 1;                 /* res[p0,1] (0.9 -> 0.8) */
    *D(&pl, 0, 1, 1) = 1;                 /* kmax[m0,1] */
    feed_rest(&pb, &pl);
    pl.supplement_t[1] = 0;               /* feed[m0,1] */
    assert_int_equal(expect(&pb, &pl, 1, "res[p0,0]"), 4);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Bad arguments: NULLs, a plan of another size, a zero area -> -1 with the
 * result zeroed. */
static void test_bad_arguments(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    pv_result r;
    mk(&pb, 1, 1, 2);
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    feed_rest(&pb, &pl);
    assert_int_equal(pv_simulate(NULL, &pl, &r), -1);
    assert_null(r.cover_t_ha);
    assert_int_equal(pv_simulate(&pb, NULL, &r), -1);
    assert_int_equal(pv_simulate(&pb, &pl, NULL), -1);
    pl.n_weeks = 1;
    assert_int_equal(pv_simulate(&pb, &pl, &r), -1);
    pl.n_weeks = 2;
    pb.pd[0].area_ha = 0;
    assert_int_equal(pv_simulate(&pb, &pl, &r), -1);
    pb.pd[0].area_ha = 1;
    pb.growth_t_ha_d[1] = (double)NAN;
    assert_int_equal(pv_simulate(&pb, &pl, &r), -1);
    assert_int_equal(pv_problem_valid(&pb), 0);
    pb.growth_t_ha_d[1] = 0;
    assert_int_equal(pv_problem_valid(&pb), 1);
    assert_int_equal(pv_simulate(&pb, &pl, &r), 0);
    pv_free(&r);
    pv_free(NULL);
    plan_free(&pl);
    plan_problem_free(&pb);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_hand_cover_and_cost),
        cmocka_unit_test(test_hand_mowing_and_moves),
        cmocka_unit_test(test_moves_counted),
        cmocka_unit_test(test_breaks_residual),
        cmocka_unit_test(test_breaks_ceiling),
        cmocka_unit_test(test_breaks_rest),
        cmocka_unit_test(test_breaks_one_mob),
        cmocka_unit_test(test_breaks_kmax),
        cmocka_unit_test(test_breaks_visit),
        cmocka_unit_test(test_breaks_spell),
        cmocka_unit_test(test_breaks_cattle),
        cmocka_unit_test(test_breaks_density),
        cmocka_unit_test(test_breaks_closed_day),
        cmocka_unit_test(test_breaks_feed),
        cmocka_unit_test(test_breaks_days),
        cmocka_unit_test(test_breaks_mowlo),
        cmocka_unit_test(test_breaks_balance),
        cmocka_unit_test(test_counts_all),
        cmocka_unit_test(test_bad_arguments),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
