/* test_forecast.c - paddock mixing, percentiles, and seasons over the new
 * year on the invented demo farm (run from the repository root). */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "forecast.h"
#include "rgtest.h"
#include "site.h"
#include "tcal.h"
#include "weather.h"

/* The invented demo farm and its synthetic weather, for the season tests
 * (run from the repository root). */
typedef struct demo {
    site s;
    wx_set wx;
} demo;

static int demo_load(void **state)
{
    demo *d = calloc(1, sizeof *d);
    rg_err e = {{0}};
    if (!d || site_load("examples/demo/site.json", "models", &d->s, &e) < 0 ||
        wx_load(&d->s.weather, &d->wx, &e) < 0) {
        print_error("%s\n", e.msg);
        free(d);
        return -1;
    }
    *state = d;
    return 0;
}

static int demo_free(void **state)
{
    demo *d = *state;
    wx_free(&d->wx);
    site_free(&d->s);
    free(d);
    return 0;
}

/* Percentiles by Hyndman & Fan (1996) definition 7, the default of R's
 * quantile() (type = 7): for x = 1..10 (any order), p10 = 1.9, p50 = 5.5,
 * p90 = 9.1; for three values 10, 30, 20: p10 = 12, p50 = 20, p90 = 28
 * (worked by hand from the definition: h = (n - 1) p + 1). */
static void test_percentile(void **state)
{
    (void)state;
    double a[10] = {7, 3, 10, 1, 5, 9, 2, 8, 4, 6};
    assert_close(fc_percentile(a, 10, 10), 1.9, 1e-12);
    assert_close(fc_percentile(a, 10, 50), 5.5, 1e-12);
    assert_close(fc_percentile(a, 10, 90), 9.1, 1e-12);
    double b[3] = {10, 30, 20};
    assert_close(fc_percentile(b, 3, 10), 12, 1e-12);
    assert_close(fc_percentile(b, 3, 50), 20, 1e-12);
    assert_close(fc_percentile(b, 3, 90), 28, 1e-12);
    double c[1] = {4};
    assert_close(fc_percentile(c, 1, 90), 4, 0);
    assert_true(isnan(fc_percentile(c, 0, 50)));
}

/* A paddock's growth is the area-weighted mix of the pitch (equal strips)
 * and open ground (definition). */
static void test_paddock_mix(void **state)
{
    (void)state;
    double strips[4] = {10, 20, 30, 40};
    assert_close(fc_paddock_day(strips, 4, 50, 1.0), 25, 1e-12);
    assert_close(fc_paddock_day(strips, 4, 50, 0.0), 50, 1e-12);
    assert_close(fc_paddock_day(strips, 4, 50, 0.6), 0.6 * 25 + 0.4 * 50, 1e-12);
}

/* A season over the new year (fc_season with to_md before from_md) runs
 * each weather year on into the next one's file: on the demo's three
 * years (2023-2025) there are two such seasons, starting 2023 and 2024.
 * The run is causal, so its November-December weeks are the very numbers
 * of a season that ends on 31 December (same runs from 1 January, same
 * hours); and without a next year in the weather there is no season. */
static void test_season_over_new_year(void **state)
{
    demo *d = *state;
    site s = d->s; /* a shallow copy: fields set here stay in this test */
    const wx_set wx = d->wx;
    rg_err e = {{0}};
    fc_table over, dec;
    fc_season a = {1101, 228, 0}, b = {1101, 1231, 0};
    assert_int_equal(fc_build(&s, &wx, &a, &over, &e), RG_EXIT_OK);
    assert_int_equal(fc_build(&s, &wx, &b, &dec, &e), RG_EXIT_OK);
    assert_int_equal(over.n_years, 2);
    assert_int_equal(over.years[0], 2023);
    assert_int_equal(over.years[1], 2024);
    assert_int_equal(over.n_weeks, 18); /* 1 Nov - 28 Feb: 120 days, 17 weeks and 1 day */
    assert_int_equal(dec.n_years, 3);
    int weeks = 8;                      /* 1 Nov - 26 Dec, whole weeks in both */
    double winter = 0;
    for (int i = 0; i < s.n_paddocks; i++)
        for (int wk = 0; wk < weeks; wk++)
            for (int y = 0; y < 2; y++) {
                double x = over.rate[((size_t)i * over.n_weeks + wk) * 2 + (size_t)y];
                double z = dec.rate[((size_t)i * dec.n_weeks + wk) * 3 + (size_t)y];
                assert_true(x == z);
            }
    for (int wk = 9; wk < over.n_weeks; wk++) /* January on: numbers, not NaN */
        for (int y = 0; y < 2; y++) {
            double x = over.rate[(size_t)wk * 2 + (size_t)y];
            assert_true(x >= 0 && isfinite(x));
            winter += x;
        }
    print_message("      P01, January-February of 2023-24 and 2024-25: %.2f kg DM/ha/day summed over weeks\n",
                  winter);
    fc_table_free(&over);
    fc_table_free(&dec);

    wx_set one = {1, &wx.s[2]}; /* 2025 alone: nothing runs over its new year */
    fc_table none;
    assert_int_equal(fc_build(&s, &one, &a, &none, &e), RG_EXIT_INPUT);
    assert_non_null(strstr(e.msg, "no weather file, or files that follow one another"));
}

/* Runs start in the midwinter before the season (fc_run_start_day):
 * 1 January in the north; in the south the latest 1 July on or before
 * the season's first day (common practice, no source). */
static void test_run_start_day(void **state)
{
    (void)state;
    assert_int_equal(fc_run_start_day(44.9, tcal_days(2024, 5, 10)), tcal_days(2024, 1, 1));
    assert_int_equal(fc_run_start_day(0.0, tcal_days(2024, 12, 31)), tcal_days(2024, 1, 1));
    assert_int_equal(fc_run_start_day(-33.9, tcal_days(2024, 5, 10)), tcal_days(2023, 7, 1));
    assert_int_equal(fc_run_start_day(-33.9, tcal_days(2024, 1, 1)), tcal_days(2023, 7, 1));
    assert_int_equal(fc_run_start_day(-33.9, tcal_days(2024, 7, 1)), tcal_days(2024, 7, 1));
    assert_int_equal(fc_run_start_day(-33.9, tcal_days(2024, 12, 31)), tcal_days(2024, 7, 1));
}

/* South of the equator (the demo farm moved to 44.9 S; its synthetic
 * weather kept) a January-March season of 2024 runs from 1 July 2023,
 * across the weather files: its weeks are, to the bit, the January-March
 * weeks of a season from 2 October 2023 (whose run also starts on 1 July
 * 2023; 2 October is 13 weeks before 1 January, so the weeks line up).
 * 2023's season has no July before it in the weather and starts on the
 * weather's first day, so three years still count. */
static void test_southern_start(void **state)
{
    demo *d = *state;
    site s = d->s; /* a shallow copy: fields set here stay in this test */
    const wx_set wx = d->wx;
    rg_err e = {{0}};
    s.loc.latitude_deg = -s.loc.latitude_deg;
    fc_table jm, from_oct;
    fc_season a = {101, 331, 0}, b = {1002, 331, 2023};
    assert_int_equal(fc_build(&s, &wx, &a, &jm, &e), RG_EXIT_OK);
    assert_int_equal(fc_build(&s, &wx, &b, &from_oct, &e), RG_EXIT_OK);
    assert_int_equal(jm.n_years, 3);
    assert_int_equal(jm.years[1], 2024);
    assert_int_equal(from_oct.n_years, 1);
    int same = 0;
    for (int i = 0; i < s.n_paddocks; i++)
        for (int wk = 0; wk < 12; wk++) {
            double x = jm.rate[((size_t)i * jm.n_weeks + wk) * 3 + 1];
            double z = from_oct.rate[(size_t)i * from_oct.n_weeks + 13 + wk];
            assert_true(x == z);
            same += x > 0;
        }
    assert_true(same > 0); /* the weeks compared grow */
    fc_table_free(&jm);
    fc_table_free(&from_oct);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_percentile),
        cmocka_unit_test(test_paddock_mix),
        cmocka_unit_test_setup_teardown(test_season_over_new_year, demo_load, demo_free),
        cmocka_unit_test(test_run_start_day),
        cmocka_unit_test_setup_teardown(test_southern_start, demo_load, demo_free),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
