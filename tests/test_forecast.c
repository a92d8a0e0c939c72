/* test_forecast.c - paddock mixing and percentiles. */
#include "forecast.h"
#include "rgtest.h"

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

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_percentile),
        cmocka_unit_test(test_paddock_mix),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
