/* test_plankeep.c - re-planning with the first weeks of an earlier plan
 * held (plankeep.c), and reading that earlier plan back (prevplan.c).
 *
 * The instances are small enough that each expected result is worked out by
 * hand in the test's comment (covers in t DM/ha, no growth, no senescence
 * unless said).
 */
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "plan.h"
#include "plankeep.h"
#include "planmilp.h"
#include "planverify.h"
#include "prevplan.h"
#include "rgtest.h"
#include "tcal.h"

/* 2 paddocks of 1 ha (cover 2.0, residual 1.0, ceiling 5.0), one mob eating
 * 0.1 t DM/day, 3 weeks from 2025-04-07, rest 1 week, every day open. */
static void make_problem(plan_problem *pb)
{
    int P = 2, M = 1, T = 3;
    memset(pb, 0, sizeof *pb);
    pb->n_paddocks = P;
    pb->n_mobs = M;
    pb->n_weeks = T;
    pb->pd = calloc((size_t)P, sizeof *pb->pd);
    pb->mob = calloc((size_t)M, sizeof *pb->mob);
    pb->growth_t_ha_d = calloc((size_t)(P * T), sizeof *pb->growth_t_ha_d);
    pb->open_days = calloc((size_t)(P * T), sizeof *pb->open_days);
    assert_non_null(pb->open_days);
    assert_int_equal(tcal_parse_date("2025-04-07", &pb->start_day), 0);
    for (int i = 0; i < P * T; i++)
        pb->open_days[i] = 7;
    for (int p = 0; p < P; p++) {
        snprintf(pb->pd[p].id, PLAN_ID_LEN, "P%02d", p + 1);
        pb->pd[p].area_ha = 1.0;
        pb->pd[p].cover0_t_ha = 2.0;
        pb->pd[p].residual_t_ha = 1.0;
        pb->pd[p].ceiling_t_ha = 5.0;
    }
    snprintf(pb->mob[0].id, PLAN_ID_LEN, "ewes");
    pb->mob[0].head = 50;
    pb->mob[0].demand_t_d = 0.1;
    pb->rest_weeks = 1;
    pb->spell_weeks = 1;
    pb->max_days_per_visit = 7;
    pb->max_paddocks_per_week = 1;
    pb->cost_supplement_per_t = 300;
    pb->cost_per_move = 10;
}

/* The earlier plan: P01 7 days in its week 0, P02 7 days in week 1. */
static void make_prev(pp_plan *pv, const char *start)
{
    memset(pv, 0, sizeof *pv);
    snprintf(pv->path, sizeof pv->path, "earlier.json");
    assert_int_equal(tcal_parse_date(start, &pv->start_day), 0);
    pv->weeks = 3;
    pv->n_grazes = 2;
    pv->grazes = calloc(2, sizeof *pv->grazes);
    assert_non_null(pv->grazes);
    pv->grazes[0] = (pp_graze){0, "ewes", "P01", 7};
    pv->grazes[1] = (pp_graze){1, "ewes", "P02", 7};
}

static int days(const plan_problem *pb, const plan *pl, int p, int t)
{
    return pl->days[(size_t)p * pb->n_weeks + (size_t)t];
}

/* Both weeks hold (each takes 0.7 t from 2.0: 1.3 >= 1.0), so the solver
 * must return them as they were, and the verifier must agree. */
static void test_keep_holds(void **state)
{
    (void)state;
    plan_problem pb;
    pp_plan pv;
    make_problem(&pb);
    make_prev(&pv, "2025-04-07");
    char why[256];
    rg_err err = {{0}};
    assert_int_equal(pk_apply(&pb, &pv, 2, why, sizeof why, &err), 2);
    assert_string_equal(why, "");
    plan pl;
    pm_result res;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    pm_options o = {.strategy = PM_DIRECT};
    assert_int_equal(pm_solve(&pb, &o, &pl, &res), 0);
    assert_int_equal(res.status, PM_OPTIMAL);
    assert_int_equal(days(&pb, &pl, 0, 0), 7);
    assert_int_equal(days(&pb, &pl, 1, 0), 0);
    assert_int_equal(days(&pb, &pl, 1, 1), 7);
    assert_int_equal(days(&pb, &pl, 0, 1), 0);
    pv_result v;
    assert_int_equal(pv_simulate(&pb, &pl, &v), 0);
    pv_free(&v);
    /* a plan that moves the kept week breaks the keep row */
    pl.days[0] = 6;
    assert_int_equal(pv_simulate(&pb, &pl, &v), 1);
    assert_non_null(strstr(v.first_violation, "keep[ewes,P01,0]"));
    pv_free(&v);
    plan_free(&pl);
    pp_free(&pv);
    plan_problem_free(&pb);
}

/* The walk found P02 at 1.5, not 2.0: seven days would leave 0.8, below the
 * 1.0 residual, so only the first week is kept, and the reason names the
 * residual row of P02 in week 1. */
static void test_keep_stops(void **state)
{
    (void)state;
    plan_problem pb;
    pp_plan pv;
    make_problem(&pb);
    pb.pd[1].cover0_t_ha = 1.5;
    make_prev(&pv, "2025-04-07");
    char why[256];
    rg_err err = {{0}};
    assert_int_equal(pk_apply(&pb, &pv, 2, why, sizeof why, &err), 1);
    assert_non_null(strstr(why, "week 2"));
    assert_non_null(strstr(why, "P02"));
    assert_int_equal(pb.fixed_weeks, 1);
    pp_free(&pv);
    plan_problem_free(&pb);
}

/* An earlier plan that started a week before: its week 1 (P02) is this
 * plan's week 0. */
static void test_keep_offset(void **state)
{
    (void)state;
    plan_problem pb;
    pp_plan pv;
    make_problem(&pb);
    make_prev(&pv, "2025-03-31");
    char why[256];
    rg_err err = {{0}};
    assert_int_equal(pk_prev_week(&pb, &pv, 0), 1);
    assert_int_equal(pk_apply(&pb, &pv, 1, why, sizeof why, &err), 1);
    assert_int_equal(pb.fixed_days[1 * pb.n_weeks + 0], 7);
    assert_int_equal(pb.fixed_days[0 * pb.n_weeks + 0], 0);
    pp_free(&pv);
    plan_problem_free(&pb);
}

/* Plans that cannot be held: another weekday; a paddock the site lacks. */
static void test_keep_refused(void **state)
{
    (void)state;
    plan_problem pb;
    pp_plan pv;
    char why[256];
    rg_err err = {{0}};
    make_problem(&pb);
    make_prev(&pv, "2025-04-08");
    assert_int_equal(pk_apply(&pb, &pv, 1, why, sizeof why, &err), -1);
    assert_non_null(strstr(err.msg, "another weekday"));
    pp_free(&pv);
    make_prev(&pv, "2025-04-07");
    snprintf(pv.grazes[1].paddock, PLAN_ID_LEN, "P09");
    assert_int_equal(pk_apply(&pb, &pv, 1, why, sizeof why, &err), -1);
    assert_non_null(strstr(err.msg, "paddock \"P09\" is not in the site file"));
    pp_free(&pv);
    plan_problem_free(&pb);
}

static char *write_tmp(const char *text)
{
    static char path[64];
    snprintf(path, sizeof path, "/tmp/rg_prevplan_%d.json", (int)getpid());
    FILE *fp = fopen(path, "w");
    assert_non_null(fp);
    fputs(text, fp);
    fclose(fp);
    return path;
}

/* The JSON `plan --format json` writes, read back; and a bad value named by
 * its JSON path. */
static void test_prevplan_read(void **state)
{
    (void)state;
    const char *good =
        "{\"start\": \"2025-04-07\", \"weeks\": 2, \"status\": \"optimal\",\n"
        " \"calendar\": [\n"
        "  {\"week\": 1, \"start\": \"2025-04-07\", \"grazing\": [{\"mob\": \"ewes\", \"paddock\": \"P01\", \"days\": 4},"
        " {\"mob\": \"ewes\", \"paddock\": \"P02\", \"days\": 3}], \"supplement_t\": [0], \"mow\": []},\n"
        "  {\"week\": 2, \"start\": \"2025-04-14\", \"grazing\": [], \"supplement_t\": [0.7], \"mow\": [\"P03\"]}],\n"
        " \"paddocks\": [{\"paddock\": \"P01\", \"area_ha\": 1, \"cover_kgdm_ha\": [2000, 1600, 1500]}]}\n";
    pp_plan pl;
    rg_err err = {{0}};
    char *path = write_tmp(good);
    assert_int_equal(pp_load(path, &pl, &err), 0);
    assert_int_equal(pl.weeks, 2);
    assert_int_equal(pl.n_grazes, 2);
    assert_string_equal(pl.grazes[1].paddock, "P02");
    assert_int_equal(pl.grazes[1].days, 3);
    assert_int_equal(pl.n_mows, 1);
    assert_int_equal(pl.mows[0].week, 1);
    assert_close(pp_cover(&pl, "P01", 2), 1500, 0);
    assert_close(pp_cover(&pl, "P02", 0), -1, 0);
    pp_free(&pl);
    const char *bad =
        "{\"start\": \"2025-04-07\", \"weeks\": 1, \"calendar\": [{\"grazing\": "
        "[{\"mob\": \"ewes\", \"paddock\": \"P01\", \"days\": 9}]}], \"paddocks\": []}\n";
    path = write_tmp(bad);
    assert_int_equal(pp_load(path, &pl, &err), -1);
    assert_non_null(strstr(err.msg, "$.calendar[0].grazing[0].days"));
    assert_null(strchr(err.msg, '\n'));
    remove(path);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_keep_holds), cmocka_unit_test(test_keep_stops),
        cmocka_unit_test(test_keep_offset), cmocka_unit_test(test_keep_refused),
        cmocka_unit_test(test_prevplan_read),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
