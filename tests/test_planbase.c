/* test_planbase.c - the rule-of-thumb baseline: hand-made cases worked out
 * in the comments, the grazing-days formula of the University of Maine
 * Cooperative Extension pasture course, and generated instances (a
 * fixed-seed generator invented here) on which the verifier must accept
 * the baseline and the baseline must cost no more than the yard plan. */
#include <stdlib.h>
#include <string.h>

#include "planbase.h"
#include "planverify.h"
#include "rgtest.h"

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
    assert_true(pb->pd && pb->mob && pb->growth_t_ha_d && pb->open_days);
    for (int p = 0; p < P; p++) {
        snprintf(pb->pd[p].id, sizeof pb->pd[p].id, "p%d", p);
        pb->pd[p].area_ha = 1.0;
        pb->pd[p].cover0_t_ha = 2.0;
        pb->pd[p].residual_t_ha = 1.0;
        pb->pd[p].ceiling_t_ha = 3.0;
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

static int days_at(const plan *pl, int m, int p, int t)
{
    return pl->days[(m * pl->n_paddocks + p) * pl->n_weeks + t];
}

/* The verifier's verdict on a plan; prints the first violation. */
static int verdict(const plan_problem *pb, const plan *pl, double *cost)
{
    pv_result r;
    int rc = pv_simulate(pb, pl, &r);
    if (rc != 0)
        print_error("verifier rc %d: %s\n", rc, r.first_violation);
    *cost = r.cost_total;
    pv_free(&r);
    return rc;
}

/* Grazing days from the University of Maine Cooperative Extension pasture
 * course, Lesson 1 (Planning a Grazing System), Appendix D:
 *   days = forage available x area x grazing efficiency /
 *          (average liveweight x intake as a share of liveweight x head).
 * The baseline removes exactly the cover above the residual, so "forage
 * available" is X0 - R and the efficiency is 1 (growth and senescence 0).
 * 100 ewes of 60 kg eating 2.5 % of liveweight: 0.15 t DM/day.
 *  - 1.2 t/ha above the residual on 2 ha: 2.4 / 0.15 = 16 days exactly;
 *  - the page's own example, 4 usable inches at 300 lb/acre-inch = 1,200
 *    lb/acre = 1.34502 t/ha (1 lb/acre = 1.1208511 kg/ha, from the
 *    definitions of the pound and the acre): 2.69004 / 0.15 = 17.93 ->
 *    17 whole days.
 * A visit may last 21 days (S = 3 weeks, D = 7): the mob stays 7, 7 and
 * the rest, and eats nothing more in week 3. */
static void check_handbook(double avail_t_ha, int days_total, int week2)
{
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 4);
    pb.pd[0].area_ha = 2.0;
    pb.pd[0].cover0_t_ha = 1.0 + avail_t_ha;
    pb.pd[0].ceiling_t_ha = 5.0;
    pb.mob[0].head = 100;
    pb.mob[0].demand_t_d = 100 * 60.0 * 0.025 / 1000.0;
    pb.max_days_per_visit = 21;
    pb.spell_weeks = 3;
    pb.penalty_terminal_per_t = 0;
    assert_int_equal(pb_baseline(&pb, &pl), 0);
    int expect_days = (int)floor(avail_t_ha * 2.0 * 1.0 / (60.0 * 0.025 * 100 / 1000.0) + 1e-9);
    assert_int_equal(expect_days, days_total);
    assert_int_equal(days_at(&pl, 0, 0, 0), 7);
    assert_int_equal(days_at(&pl, 0, 0, 1), 7);
    assert_int_equal(days_at(&pl, 0, 0, 2), week2);
    assert_int_equal(days_at(&pl, 0, 0, 3), 0);
    assert_int_equal(7 + 7 + week2, days_total);
    double cost;
    assert_int_equal(verdict(&pb, &pl, &cost), 0);
    plan_free(&pl);
    plan_problem_free(&pb);
}

static void test_handbook_grazing_days(void **state)
{
    (void)state;
    check_handbook(1.2, 16, 2);
    check_handbook(1.34502, 17, 3);
}

/* The mob goes to the paddock with the most cover (ties to the lower
 * index): covers 2.0, 2.5, 2.5 -> paddock 1; there it stays 7 days
 * (7 x 0.1 t leaves 1.8 t/ha, above R = 1.0). Next week paddock 1 may not
 * be grazed again (S = 1), so it moves to paddock 2 (2.5 > 2.0); the third
 * week paddock 1 (L = 0, cover 1.8) is behind paddock 0 (2.0). */
static void test_most_cover_first(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 3, 1, 3);
    pb.pd[1].cover0_t_ha = pb.pd[2].cover0_t_ha = 2.5;
    pb.cost_per_move = 0;
    assert_int_equal(pb_baseline(&pb, &pl), 0);
    assert_int_equal(days_at(&pl, 0, 1, 0), 7);
    assert_int_equal(days_at(&pl, 0, 2, 1), 7);
    assert_int_equal(days_at(&pl, 0, 0, 2), 7);
    assert_close(pl.supplement_t[0] + pl.supplement_t[1] + pl.supplement_t[2], 0.0, 1e-12);
    double cost;
    assert_int_equal(verdict(&pb, &pl, &cost), 0);
    assert_close(cost, 0.0, 1e-9);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Stay, then move (K = 2, S = 2, growth 0.3 t/ha a week, no moving cost).
 * Week 0: p0 has the most cover (1.6 > 1.5); 1.6 + 0.3 - 1.0 = 0.9 t/ha
 * above the residual is 9 days of 0.1 t, so 7 -> 1.9 - 0.7 = 1.2.
 * Week 1: the mob stays in p0: 1.2 + 0.3 - 1.0 = 0.5 t/ha, 5 days; then
 * moves to p1 for the 2 days left of the week. */
static void test_stay_then_move(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 2, 1, 2);
    pb.pd[0].cover0_t_ha = 1.6;
    pb.pd[1].cover0_t_ha = 1.5;
    for (int i = 0; i < 4; i++)
        pb.growth_t_ha_d[i] = 0.3 / 7.0;
    pb.spell_weeks = 2;
    pb.max_paddocks_per_week = 2;
    pb.cost_per_move = 0;
    assert_int_equal(pb_baseline(&pb, &pl), 0);
    assert_int_equal(days_at(&pl, 0, 0, 0), 7);
    assert_int_equal(days_at(&pl, 0, 1, 0), 0);
    assert_int_equal(days_at(&pl, 0, 0, 1), 5);
    assert_int_equal(days_at(&pl, 0, 1, 1), 2);
    double cost;
    assert_int_equal(verdict(&pb, &pl, &cost), 0);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Rest: one paddock, S = 1, L = 2.  Grazed in week 0, it rests weeks 1
 * and 2 (rest rows k = 2; k = 1 by the spell), and is grazed again in week
 * 3; weeks 1 and 2 are all supplement (7 x 0.1 = 0.7 t each). */
static void test_rest_respected(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 4);
    pb.pd[0].cover0_t_ha = 2.7;
    pb.pd[0].ceiling_t_ha = 5.0;
    for (int t = 0; t < 4; t++)
        pb.growth_t_ha_d[t] = 0.1;
    pb.rest_weeks = 2;
    assert_int_equal(pb_baseline(&pb, &pl), 0);
    const int want[4] = {7, 0, 0, 7};
    for (int t = 0; t < 4; t++)
        assert_int_equal(days_at(&pl, 0, 0, t), want[t]);
    assert_close(pl.supplement_t[1], 0.7, 1e-12);
    assert_close(pl.supplement_t[2], 0.7, 1e-12);
    double cost;
    assert_int_equal(verdict(&pb, &pl, &cost), 0);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Cattle and mowing: a cattle mob cannot enter the only (barred) paddock,
 * which grows 0.1 t/ha/day from 2.8: 3.5 > 3.0 is mowed in week 0 (to
 * 1.0), then 1.7, 2.4, 3.1 > 3.0 mowed in week 3.  Cost: 28 x 0.1 t of
 * supplement x 300 = 840, plus 2 mowings of 1 ha x 60 = 120. */
static void test_cattle_barred_and_mowing(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 4);
    pb.pd[0].cover0_t_ha = 2.8;
    pb.pd[0].cattle_barred = 1;
    pb.mob[0].is_cattle = 1;
    for (int t = 0; t < 4; t++)
        pb.growth_t_ha_d[t] = 0.1;
    assert_int_equal(pb_baseline(&pb, &pl), 0);
    const unsigned char mow[4] = {1, 0, 0, 1};
    for (int t = 0; t < 4; t++) {
        assert_int_equal(days_at(&pl, 0, 0, t), 0);
        assert_int_equal(pl.mow[t], mow[t]);
    }
    double cost;
    assert_int_equal(verdict(&pb, &pl, &cost), 0);
    assert_close(cost, 960.0, 1e-9);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* A move that does not pay for itself is not made: 1 day of 0.1 t saves
 * 30 at 300/t, the move costs 40 (file comment of planbase.c); at 29 it
 * is made (30 exactly is a tie lost to rounding either way, so not used). */
static void test_move_must_pay(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 1);
    pb.pd[0].cover0_t_ha = 1.15; /* one day above the residual */
    pb.cost_per_move = 40;
    pb.penalty_terminal_per_t = 0;
    assert_int_equal(pb_baseline(&pb, &pl), 0);
    assert_int_equal(days_at(&pl, 0, 0, 0), 0);
    plan_free(&pl);
    pb.cost_per_move = 29;
    assert_int_equal(pb_baseline(&pb, &pl), 0);
    assert_int_equal(days_at(&pl, 0, 0, 0), 1);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Whole days are not lost to rounding: 1.7 - 1.0 = 0.7 t/ha above the
 * residual on 1 ha is 7 days of 0.1 t (in binary floating point 0.7 / 0.1
 * is 6.999...; planbase.c floors after a 1 + 1e-12 factor), and the week
 * ends at the residual within the verifier's 1e-6 t DM/ha. */
static void test_whole_days_kept(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 1);
    pb.pd[0].cover0_t_ha = 1.7;
    assert_true(floor((1.7 - 1.0) / 0.1) < 7.0); /* the trap is real */
    assert_int_equal(pb_baseline(&pb, &pl), 0);
    assert_int_equal(days_at(&pl, 0, 0, 0), 7);
    pv_result r;
    assert_int_equal(pv_simulate(&pb, &pl, &r), 0);
    assert_close(r.cover_t_ha[1], 1.0, 1e-12);
    pv_free(&r);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* xorshift64 (Marsaglia 2003, "Xorshift RNGs", J. Stat. Softw. 8(14),
 * the 13/7/17 triple): a fixed-seed source for the generated instances. */
static uint64_t rng_next(uint64_t *s)
{
    *s ^= *s << 13;
    *s ^= *s >> 7;
    *s ^= *s << 17;
    return *s;
}

static double urand(uint64_t *s, double lo, double hi)
{
    return lo + (hi - lo) * (double)(rng_next(s) >> 11) / 9007199254740992.0;
}

static int irand(uint64_t *s, int lo, int hi)
{
    return lo + (int)(rng_next(s) % (uint64_t)(hi - lo + 1));
}

static void gen_paddocks(plan_problem *pb, uint64_t *s)
{
    int T = pb->n_weeks;
    for (int p = 0; p < pb->n_paddocks; p++) {
        plan_paddock *q = &pb->pd[p];
        q->area_ha = urand(s, 0.3, 8.0);
        q->residual_t_ha = urand(s, 0.4, 1.5);
        q->ceiling_t_ha = q->residual_t_ha + urand(s, 0.3, 3.0);
        q->cover0_t_ha = urand(s, 0.0, q->ceiling_t_ha + 1.0);
        q->senescence_per_day = irand(s, 0, 3) == 0 ? 0.0 : urand(s, 0.0, 0.03);
        q->cattle_barred = irand(s, 0, 2) == 0;
        for (int t = 0; t < T; t++) {
            pb->growth_t_ha_d[p * T + t] = urand(s, 0.0, 0.12);
            pb->open_days[p * T + t] = irand(s, 0, 5) == 0 ? irand(s, 0, 7) : 7;
        }
    }
}

static void gen_rules_costs(plan_problem *pb, uint64_t *s)
{
    pb->max_days_per_visit = irand(s, 1, 21);
    pb->spell_weeks = (pb->max_days_per_visit + 6) / 7;
    pb->rest_weeks = irand(s, 0, 6);
    pb->max_paddocks_per_week = irand(s, 1, 3);
    pb->share_paddocks = irand(s, 0, 1);
    pb->max_head_per_ha = irand(s, 0, 1) ? 0.0 : urand(s, 5, 120);
    pb->terminal_t_ha = urand(s, 0.0, 3.0);
    pb->cost_supplement_per_t = urand(s, 100, 500);
    pb->cost_mowing_per_ha = urand(s, 0, 150);
    pb->cost_per_move = irand(s, 0, 3) == 0 ? 0.0 : urand(s, 5, 150);
    pb->penalty_terminal_per_t = urand(s, 0, 2.0) * pb->cost_supplement_per_t;
}

/* A random instance: 1-3 mobs (sheep at 1.5 kg DM/head/day or cattle at
 * 12, from memory), 2-12 paddocks, 2-20 weeks, random rules and costs. */
static void gen(plan_problem *pb, uint64_t *s)
{
    int M = irand(s, 1, 3), P = irand(s, 2, 12), T = irand(s, 2, 20);
    mk(pb, P, M, T);
    gen_paddocks(pb, s);
    for (int m = 0; m < M; m++) {
        pb->mob[m].is_cattle = irand(s, 0, 3) == 0;
        pb->mob[m].head = pb->mob[m].is_cattle ? irand(s, 5, 60) : irand(s, 20, 500);
        pb->mob[m].demand_t_d = pb->mob[m].head * (pb->mob[m].is_cattle ? 0.012 : 0.0015);
    }
    gen_rules_costs(pb, s);
}

/* The yard plan, built here independently of planbase.c: all supplement,
 * mowing in a week that would end above the ceiling (docs/planner.md,
 * "Always feasible"). */
static void yard_plan(const plan_problem *pb, plan *pl)
{
    assert_int_equal(plan_alloc(pb, pl), 0);
    int T = pb->n_weeks;
    for (int m = 0; m < pb->n_mobs; m++)
        for (int t = 0; t < T; t++)
            pl->supplement_t[m * T + t] = 7.0 * pb->mob[m].demand_t_d;
    for (int p = 0; p < pb->n_paddocks; p++) {
        const plan_paddock *q = &pb->pd[p];
        double x = q->cover0_t_ha;
        for (int t = 0; t < T; t++) {
            x = (1.0 - 7.0 * q->senescence_per_day) * x + 7.0 * pb->growth_t_ha_d[p * T + t];
            pl->mow[p * T + t] = x > q->ceiling_t_ha;
            if (x > q->ceiling_t_ha)
                x = q->residual_t_ha;
        }
    }
}

static int grazes(const plan *pl)
{
    size_t n = (size_t)pl->n_mobs * (size_t)pl->n_paddocks * (size_t)pl->n_weeks;
    for (size_t i = 0; i < n; i++)
        if (pl->days[i] > 0)
            return 1;
    return 0;
}

/* On 300 generated instances the verifier accepts the baseline (every rule
 * of docs/planner.md) and the yard plan, the baseline costs no more than
 * the yard plan, and (so that the cost check is not met by always falling
 * back to the yard) the baseline grazes in at least 75 % of them (measured:
 * 247 of these 300; 84 % of 20,000 from the same generator, where the yard
 * fallback of planbase.c was taken in 1 %).  A second run of the baseline
 * gives the same plan, byte for byte. */
static void test_generated_instances(void **state)
{
    (void)state;
    uint64_t seed = 0x9E3779B97F4A7C15u;
    int n = 300, n_grazed = 0;
    for (int i = 0; i < n; i++) {
        plan_problem pb;
        plan base, again, yard;
        gen(&pb, &seed);
        assert_int_equal(pb_baseline(&pb, &base), 0);
        yard_plan(&pb, &yard);
        double c_base, c_yard;
        if (verdict(&pb, &base, &c_base) != 0 || verdict(&pb, &yard, &c_yard) != 0)
            print_error("instance %d\n", i);
        assert_int_equal(verdict(&pb, &base, &c_base), 0);
        assert_int_equal(verdict(&pb, &yard, &c_yard), 0);
        assert_true(c_base <= c_yard + 1e-9 * (1.0 + c_yard));
        n_grazed += grazes(&base);
        assert_int_equal(pb_baseline(&pb, &again), 0);
        size_t cells = (size_t)pb.n_mobs * (size_t)pb.n_paddocks * (size_t)pb.n_weeks;
        assert_memory_equal(base.days, again.days, cells * sizeof *base.days);
        assert_memory_equal(base.mow, again.mow, (size_t)pb.n_paddocks * (size_t)pb.n_weeks);
        plan_free(&base);
        plan_free(&again);
        plan_free(&yard);
        plan_problem_free(&pb);
    }
    if (n_grazed < n * 3 / 4)
        print_error("baseline grazed in %d of %d instances\n", n_grazed, n);
    assert_true(n_grazed >= n * 3 / 4);
}

/* Bad arguments and data no plan can obey -> -1, plan zeroed. */
static void test_bad_arguments(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    mk(&pb, 1, 1, 2);
    assert_int_equal(pb_baseline(NULL, &pl), -1);
    assert_null(pl.days);
    assert_int_equal(pb_baseline(&pb, NULL), -1);
    pb.pd[0].residual_t_ha = 3.5; /* above the ceiling */
    assert_int_equal(pb_baseline(&pb, &pl), -1);
    pb.pd[0].residual_t_ha = 1.0;
    pb.growth_t_ha_d[1] = -0.01;
    assert_int_equal(pb_baseline(&pb, &pl), -1);
    pb.growth_t_ha_d[1] = 0.0;
    pb.open_days[0] = 8;
    assert_int_equal(pb_baseline(&pb, &pl), -1);
    pb.open_days[0] = 7;
    pb.pd[0].senescence_per_day = 0.2;
    assert_int_equal(pb_baseline(&pb, &pl), -1);
    pb.pd[0].senescence_per_day = 0.0;
    assert_int_equal(pb_baseline(&pb, &pl), 0);
    plan_free(&pl);
    plan_problem_free(&pb);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_handbook_grazing_days),
        cmocka_unit_test(test_most_cover_first),
        cmocka_unit_test(test_stay_then_move),
        cmocka_unit_test(test_rest_respected),
        cmocka_unit_test(test_cattle_barred_and_mowing),
        cmocka_unit_test(test_move_must_pay),
        cmocka_unit_test(test_whole_days_kept),
        cmocka_unit_test(test_generated_instances),
        cmocka_unit_test(test_bad_arguments),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
