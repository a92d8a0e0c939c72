/* test_planhist.c - each paddock's state at the plan start from records
 * (planhist.c), on the invented demo farm and its synthetic weather.
 *
 * The carry-forward is the daily balance x' = (1 - s) x + G - E/A
 * (docs/planner.md, "From the site to the model").  The checks are its
 * invariants, worked out from that equation alone:
 *  - a record on the start day is the start cover, unchanged;
 *  - grazing enters linearly: E kg DM eaten on day d lowers the start
 *    cover by (E/A)(1 - s)^(start - 1 - d) (while the cover stays above
 *    zero), so the difference between the carry with and without the
 *    grazing records is exactly the sum of those terms;
 *  - the rest after the last recorded grazing day ends min_rest_days later;
 *  - all of this holds over the new year when the weather runs on.
 */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "planhist.h"
#include "records.h"
#include "rgtest.h"
#include "site.h"
#include "tcal.h"
#include "weather.h"

#define DEMO "examples/demo/"

static site s;
static wx_set wx;

static int setup(void **state)
{
    (void)state;
    rg_err e = {{0}};
    if (site_load(DEMO "site.json", "models", &s, &e) < 0 || wx_load(&s.weather, &wx, &e) < 0) {
        print_error("%s\n", e.msg);
        return -1;
    }
    return 0;
}

static int teardown(void **state)
{
    (void)state;
    wx_free(&wx);
    site_free(&s);
    return 0;
}

static int64_t day(int y, int m, int d)
{
    char t[16];
    int64_t v;
    snprintf(t, sizeof t, "%04d-%02d-%02d", y, m, d);
    assert_int_equal(tcal_parse_date(t, &v), 0);
    return v;
}

static void walks_of(const char *text, int64_t start, rec_walks *w)
{
    rg_err e = {{0}};
    if (rec_walk_parse(&s, NULL, start, "walk", text, strlen(text), w, &e) < 0)
        print_error("%s\n", e.msg);
    assert_int_equal(e.msg[0], 0);
}

static void grazes_of(const char *text, int64_t start, rec_grazes *g)
{
    rg_err e = {{0}};
    if (rec_graze_parse(&s, start, "grazed", text, strlen(text), g, &e) < 0)
        print_error("%s\n", e.msg);
    assert_int_equal(e.msg[0], 0);
}

/* A reading on the start day is the start cover; one 7 days earlier is
 * carried (PH_CARRIED), a paddock without one stays PH_DEFAULT. */
static void test_sources(void **state)
{
    (void)state;
    int64_t start = day(2024, 6, 3);
    rec_walks w;
    walks_of("paddock,date,height_cm,cover_kgdm_ha,method\n"
             "P01,2024-06-03,,1800,plate\nP02,2024-05-27,,1800,visual\n", start, &w);
    ph_state h;
    rg_err e = {{0}};
    assert_int_equal(ph_build(&s, &wx, &w, NULL, start, 50, &h, &e), RG_EXIT_OK);
    int p1 = site_find_paddock(&s, "P01"), p2 = site_find_paddock(&s, "P02"), p3 = site_find_paddock(&s, "P03");
    assert_int_equal(h.pd[p1].source, PH_MEASURED);
    assert_close(h.pd[p1].cover_kgdm_ha, 1800, 0);
    assert_int_equal(h.pd[p2].source, PH_CARRIED);
    assert_true(h.pd[p2].cover_kgdm_ha >= 0 && h.pd[p2].cover_kgdm_ha != 1800);
    assert_int_equal(h.pd[p3].source, PH_DEFAULT);
    char buf[96];
    ph_describe(&h, p2, buf, sizeof buf);
    assert_string_equal(buf, "walk 2024-05-27 visual, +7 d (estimated)");
    ph_free(&h);
    rec_walk_free(&w);
}

/* The ewes (demo: 380 head x 1.496 kg DM/day = 568.48 kg/day) graze P02
 * (area A) on 2024-05-29 and 05-30; the walk was 05-27, the start 06-03.
 * Day 05-29 is 4 days before the last carried day 06-02 and 05-30 is 3,
 * so the start cover drops by (568.48 / A) ((1 - s)^4 + (1 - s)^3). */
static void test_grazing_linear(void **state)
{
    (void)state;
    int64_t start = day(2024, 6, 3);
    rec_walks w;
    rec_grazes g;
    walks_of("paddock,date,height_cm,cover_kgdm_ha,method\nP02,2024-05-27,,2400,plate\n", start, &w);
    grazes_of("mob,paddock,from,to\newes,P02,2024-05-29,2024-05-30\n", start, &g);
    ph_state a, b;
    rg_err e = {{0}};
    assert_int_equal(ph_build(&s, &wx, &w, NULL, start, 50, &a, &e), RG_EXIT_OK);
    assert_int_equal(ph_build(&s, &wx, &w, &g, start, 50, &b, &e), RG_EXIT_OK);
    int p = site_find_paddock(&s, "P02");
    const site_paddock *sp = &s.paddocks[p];
    double sen = s.swards[sp->sward].p.senescence_per_day;
    double per_day = s.mobs[0].head * s.mobs[0].intake_kgdm_d;
    assert_close(per_day, 380 * 1.496, 1e-9);
    double drop = per_day / sp->area_ha * (pow(1 - sen, 4) + pow(1 - sen, 3));
    assert_true(b.pd[p].cover_kgdm_ha > 0);
    assert_close(a.pd[p].cover_kgdm_ha - b.pd[p].cover_kgdm_ha, drop, 1e-6);
    assert_close(b.pd[p].grazed_kgdm, 2 * per_day, 1e-9);
    /* rest: last grazed 05-30, rest 35 days: may graze from 07-05 */
    assert_int_equal(b.pd[p].last_grazed_day, day(2024, 5, 30));
    assert_int_equal(b.pd[p].may_graze_day, day(2024, 5, 30) + 1 + s.rules.min_rest_days);
    ph_free(&a);
    ph_free(&b);
    rec_walk_free(&w);
    rec_graze_free(&g);
}

/* Over the new year (the demo's weather files follow one another): a walk
 * of 2024-12-16 is carried to a start of 2025-01-06, and grazing recorded
 * either side of 1 January still enters linearly, E/A (1 - s)^k for the
 * k days left to carry; a record more than a year old is not carried. */
static void test_over_new_year(void **state)
{
    (void)state;
    int64_t start = day(2025, 1, 6);
    rec_walks w;
    rec_grazes g;
    walks_of("paddock,date,height_cm,cover_kgdm_ha,method\n"
             "P02,2024-12-16,,2400,plate\nP03,2023-12-20,,2400,plate\n", start, &w);
    grazes_of("mob,paddock,from,to\newes,P02,2024-12-31,2025-01-01\n", start, &g);
    ph_state a, b;
    rg_err e = {{0}};
    rg_warn_quiet(1);
    assert_int_equal(ph_build(&s, &wx, &w, NULL, start, 50, &a, &e), RG_EXIT_OK);
    assert_int_equal(ph_build(&s, &wx, &w, &g, start, 50, &b, &e), RG_EXIT_OK);
    rg_warn_quiet(0);
    int p2 = site_find_paddock(&s, "P02"), p3 = site_find_paddock(&s, "P03");
    assert_int_equal(a.pd[p2].source, PH_CARRIED);
    assert_int_equal(a.pd[p3].source, PH_DEFAULT); /* 383 days old */
    const site_paddock *sp = &s.paddocks[p2];
    double sen = s.swards[sp->sward].p.senescence_per_day;
    double per_day = s.mobs[0].head * s.mobs[0].intake_kgdm_d;
    /* the last carried day is 01-05: 12-31 is 5 days before it, 01-01 is 4 */
    double drop = per_day / sp->area_ha * (pow(1 - sen, 5) + pow(1 - sen, 4));
    assert_true(b.pd[p2].cover_kgdm_ha > 0);
    assert_close(a.pd[p2].cover_kgdm_ha - b.pd[p2].cover_kgdm_ha, drop, 1e-6);
    char buf[96];
    ph_describe(&a, p2, buf, sizeof buf);
    assert_string_equal(buf, "walk 2024-12-16 plate, +21 d (estimated)");
    ph_free(&a);
    ph_free(&b);

    /* with the 2025 file alone nothing runs over the new year: the walk of
     * December is set aside and P02 starts from the default */
    wx_set one = {1, &wx.s[2]};
    rg_warn_quiet(1);
    assert_int_equal(ph_build(&s, &one, &w, NULL, start, 50, &a, &e), RG_EXIT_OK);
    rg_warn_quiet(0);
    assert_int_equal(a.pd[p2].source, PH_DEFAULT);
    ph_free(&a);
    rec_walk_free(&w);
    rec_graze_free(&g);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_sources),
        cmocka_unit_test(test_grazing_linear),
        cmocka_unit_test(test_over_new_year),
    };
    return cmocka_run_group_tests(tests, setup, teardown);
}
