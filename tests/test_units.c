/* test_units.c - output unit conversions against their definitions.
 *
 * Reference: NIST Special Publication 811 (Thompson & Taylor, 2008),
 * Appendix B.8 and B.9: 1 acre = 4046.873 m2 (B.8 lists the survey acre;
 * the international acre is 4046.8564224 m2), 1 lb (avoirdupois) =
 * 0.45359237 kg exactly, 1 in = 2.54 cm exactly, 1 ton (short, 2000 lb) =
 * 907.18474 kg; B.9 lists 1 lb/acre = 0.1120851 g/m2 (= 1.120851 kg/ha).
 */
#include "rgtest.h"

#include "units.h"

/* 1 ha = 2.471054 acres (NIST SP 811, 2008, B.8: 1 acre = 4.046873 E+03 m2). */
static void test_area(void **state)
{
    (void)state;
    assert_close(un_area(SITE_UNITS_US, 1.0), 2.471054, 2e-6);
    assert_close(un_area(SITE_UNITS_METRIC, 3.5), 3.5, 0);
}

/* 1 lb/acre = 1.120851 kg/ha (NIST SP 811, 2008, B.9 "pound per acre"). */
static void test_cover(void **state)
{
    (void)state;
    assert_close(un_cover(SITE_UNITS_US, 1.120851), 1.0, 1e-6);
    assert_close(un_cover(SITE_UNITS_US, 2000.0), 2000.0 / 1.120851, 1e-3);
}

/* 1 short ton = 907.18474 kg (NIST SP 811, 2008, B.8 "ton, short"). */
static void test_mass(void **state)
{
    (void)state;
    assert_close(un_mass(SITE_UNITS_US, 0.90718474), 1.0, 1e-12);
    assert_close(un_height(SITE_UNITS_US, 2.54), 1.0, 1e-12);
    /* a cost per ha becomes a smaller cost per acre: 100 per ha = 40.47 per ac */
    assert_close(un_per_area_cost(SITE_UNITS_US, 100.0), 40.468564224, 1e-9);
}

/* 1 ft = 0.3048 m, 1 in = 25.4 mm, 1 lb = 0.45359237 kg, all exact; a
 * Fahrenheit temperature is 1.8 times the Celsius one plus 32 (NIST SP 811,
 * 2008, B.8 and 4.2.1.1): 100 degC = 212 degF, -40 degC = -40 degF. */
static void test_length_weight_temp(void **state)
{
    (void)state;
    assert_close(un_length(SITE_UNITS_US, 0.3048), 1.0, 1e-12);
    assert_close(un_length(SITE_UNITS_METRIC, 6.0), 6.0, 0);
    assert_close(un_weight(SITE_UNITS_US, 0.45359237), 1.0, 1e-12);
    assert_close(un_depth(SITE_UNITS_US, 25.4), 1.0, 1e-12);
    assert_close(un_temp(SITE_UNITS_US, 100.0), 212.0, 1e-12);
    assert_close(un_temp(SITE_UNITS_US, -40.0), -40.0, 1e-12);
    assert_close(un_temp(SITE_UNITS_METRIC, 21.5), 21.5, 0);
    assert_string_equal(un_length_name(SITE_UNITS_US), "ft");
    assert_string_equal(un_depth_name(SITE_UNITS_METRIC), "mm");
}

static void test_names(void **state)
{
    (void)state;
    int u = -1;
    assert_int_equal(un_parse("us", &u), 0);
    assert_int_equal(u, SITE_UNITS_US);
    assert_int_equal(un_parse("metric", &u), 0);
    assert_int_equal(u, SITE_UNITS_METRIC);
    assert_int_equal(un_parse("imperial", &u), -1);
    assert_string_equal(un_cover_name(SITE_UNITS_US), "lb DM/ac");
    assert_string_equal(un_cover_key(SITE_UNITS_METRIC), "kgdm_ha");
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_area), cmocka_unit_test(test_cover),
        cmocka_unit_test(test_mass), cmocka_unit_test(test_names),
        cmocka_unit_test(test_length_weight_temp),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
