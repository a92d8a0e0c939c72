/* test_site.c - the site file reader and the sward sets it loads.
 * Runs from the repository root (make check does), reading
 * tests/cli/data/base.json and models/. */
#include <math.h>
#include <string.h>

#include "rgtest.h"
#include "site.h"
#include "sward.h"
#include "weather.h"

#define BASE "tests/cli/data/base.json"

static int setup(void **state)
{
    static site s;
    rg_err e = {{0}};
    if (site_load(BASE, "models", &s, &e) < 0) {
        print_error("%s\n", e.msg);
        return -1;
    }
    *state = &s;
    return 0;
}

static int teardown(void **state)
{
    site_free(*state);
    return 0;
}

/* Values arrive as written, defaults fill the rest (docs/inputs.md). */
static void test_values(void **state)
{
    const site *s = *state;
    assert_close(s->loc.latitude_deg, 40.0, 0);
    assert_close(s->array.pitch_m, 6.0, 0);
    assert_int_equal(s->array.backtracking, 1);
    assert_close(s->array.strip_width_m, 0.1, 0);
    assert_int_equal(s->n_paddocks, 2);
    assert_string_equal(s->paddocks[1].block, "north");
    assert_int_equal(s->n_windows, 1);
    assert_int_equal(s->windows[0].n_paddocks, 1);
    assert_string_equal(s->weather.files[0], "tests/cli/data/ok.csv");
    assert_string_equal(s->weather.header[WX_RAIN], "rain_mm");
}

/* Lowest edge = hub - chord/2 sin(limit) (geometry): 1.5 - 1.0 sin 55 deg;
 * the derived ceiling is that height less the 10 cm default margin. */
static void test_ceiling_derived(void **state)
{
    const site *s = *state;
    double edge = 1.5 - 1.0 * sin(55.0 * acos(-1.0) / 180.0);
    assert_close(site_lowest_edge_m(&s->array), edge, 1e-12);
    assert_int_equal(s->rules.ceiling_derived, 1);
    assert_close(s->rules.ceiling_height_cm, edge * 100 - 10, 1e-9);
}

/* Demand = head x liveweight x intake %: 100 x 65 kg x 2.5 % = 162.5 kg DM/d.
 * And NRC (1985) Nutrient Requirements of Sheep, 6th ed., Table 1: a 70 kg
 * ewe at maintenance eats 1.2 kg DM/d, 1.7 % of liveweight; our conversion
 * gives 1.19, equal to the table's rounding. */
static void test_demand(void **state)
{
    site *s = *state;
    assert_close(site_demand_kgdm_d(s), 162.5, 1e-9);
    site_mob m = s->mobs[0];
    s->mobs[0].liveweight_kg = 70;
    s->mobs[0].intake_kgdm_d = 70 * 1.7 / 100;
    assert_close(s->mobs[0].intake_kgdm_d, 1.2, 0.05);
    s->mobs[0] = m;
}

/* Height-mass: 1 lb/acre/inch = 0.45359237 kg / 0.40468564224 ha / 2.54 cm
 * = 0.4413 kg/ha/cm (exact unit definitions).  University of Maine
 * Cooperative Extension pasture course, Lesson 1 Appendix D worked example:
 * a 7 in sward grazed to 3 in at 300 lb/acre/inch leaves 1,200 lb/acre
 * available. */
static void test_height_mass(void **state)
{
    (void)state;
    double k = 0.45359237 / 0.40468564224 / 2.54;
    assert_close(k, 0.4413, 5e-5);
    sward_params p;
    rg_err e = {{0}};
    assert_int_equal(sward_load("models", "cool-season-grass", &p, &e), 0);
    p.height_mass_kgdm_ha_per_cm = 300 * k;
    double avail = sward_cover_kgdm_ha(&p, 7 * 2.54) - sward_cover_kgdm_ha(&p, 3 * 2.54);
    double lb_acre = avail / (0.45359237 / 0.40468564224);
    assert_close(lb_acre, 1200, 0.5);
    assert_close(sward_height_cm(&p, sward_cover_kgdm_ha(&p, 12.5)), 12.5, 1e-9);
}

/* Every shipped sward set loads: each value inside its own range, with a
 * source (sward_load refuses anything else). */
static void test_all_swards_load(void **state)
{
    (void)state;
    static const char *const names[] = {"cool-season-grass", "warm-season-grass", "grass-legume-mix"};
    for (int i = 0; i < 3; i++) {
        sward_params p;
        rg_err e = {{0}};
        int rc = sward_load("models", names[i], &p, &e);
        if (rc)
            print_error("%s\n", e.msg);
        assert_int_equal(rc, 0);
        assert_true(p.t_min_c < p.t_opt_c && p.t_opt_c < p.t_max_c);
    }
    sward_params p;
    rg_err e = {{0}};
    assert_int_equal(sward_load("models", "../etc/passwd", &p, &e), -1);
    assert_non_null(strstr(e.msg, "expected a name of lower-case letters"));
}

/* The reader is repeatable and frees everything (run under ASan). */
static void test_reload(void **state)
{
    (void)state;
    for (int i = 0; i < 3; i++) {
        site s;
        rg_err e = {{0}};
        assert_int_equal(site_load(BASE, "models", &s, &e), 0);
        wx_set w;
        assert_int_equal(wx_load(&s.weather, &w, &e), 0);
        assert_int_equal(w.n, 1);
        assert_int_equal(w.s[0].n, 48);
        wx_free(&w);
        site_free(&s);
    }
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_values),
        cmocka_unit_test(test_ceiling_derived),
        cmocka_unit_test(test_demand),
        cmocka_unit_test(test_height_mass),
        cmocka_unit_test(test_all_swards_load),
        cmocka_unit_test(test_reload),
    };
    return cmocka_run_group_tests(tests, setup, teardown);
}
