/* test_psychro.c - checks psychro.c against FAO-56 (Allen et al. 1998)
 * tables and worked examples, plus its range refusals. GPL-3.0-or-later. */
#include "rgtest.h"

#include "psychro.h"

/* Saturation vapour pressure e0(T) matches FAO-56 Annex 2 Table 2.3, which
 * prints three decimals (tolerance = half the last printed digit). */
static void test_e0_table_2_3(void **state)
{
    (void)state;
    assert_close(psy_e0_kpa(10.0), 1.228, 0.0005); /* FAO-56 A2 Tab. 2.3 */
    assert_close(psy_e0_kpa(20.0), 2.338, 0.0005); /* FAO-56 A2 Tab. 2.3 */
    assert_close(psy_e0_kpa(30.0), 4.243, 0.0005); /* FAO-56 A2 Tab. 2.3 */
    assert_close(psy_e0_kpa(40.0), 7.376, 0.0005); /* FAO-56 A2 Tab. 2.3 */
}

/* Slope Delta matches FAO-56 Annex 2 Table 2.4 (four decimals printed). */
static void test_slope_table_2_4(void **state)
{
    (void)state;
    assert_close(psy_slope_kpa_c(10.0), 0.0823, 0.00005); /* Tab. 2.4 */
    assert_close(psy_slope_kpa_c(20.0), 0.1447, 0.00005); /* Tab. 2.4 */
    assert_close(psy_slope_kpa_c(30.0), 0.2434, 0.00005); /* Tab. 2.4 */
    assert_close(psy_slope_kpa_c(40.0), 0.3931, 0.00005); /* Tab. 2.4 */
}

/* Eq. 13 is the derivative of eq. 11 (FAO-56 ch. 3) with the product
 * 17.27 x 237.3 = 4098.17 printed as 4098, so it must agree with a central
 * difference of psy_e0_kpa to that rounding (relative 5e-5) from -30 to
 * 50 C. */
static void test_slope_is_derivative(void **state)
{
    (void)state;
    for (double t = -30.0; t <= 50.0; t += 5.0) {
        double h = 1e-4;
        double num = (psy_e0_kpa(t + h) - psy_e0_kpa(t - h)) / (2.0 * h);
        assert_close(psy_slope_kpa_c(t), num, 5e-5 * num);
        assert_close(psy_slope_kpa_c(t) * 4098.171 / 4098.0, num, 1e-7 * num);
    }
}

/* Pressure and psychrometric constant at sea level and at 1800 m match
 * FAO-56 Annex 2 Table 2.2 / ch. 3 Example 2 (P = 81.8 kPa and
 * gamma = 0.054 kPa/C at 1800 m), to the printed rounding. At sea level
 * eq. 8 with its full constants gives 0.06734; the brief's 0.0674 is the
 * rounded coefficient 0.665e-3 x 101.3, so only 0.067 (three decimals as
 * printed in Table 2.2) is asserted there. */
static void test_pressure_gamma_table_2_2(void **state)
{
    (void)state;
    assert_close(psy_pressure_kpa(0.0), 101.3, 0.05);     /* Tab. 2.2 */
    assert_close(psy_gamma_kpa_c(101.3), 0.067, 0.0005);  /* Tab. 2.2 */
    double p = psy_pressure_kpa(1800.0);
    assert_close(p, 81.8, 0.05);                 /* FAO-56 ch. 3 Example 2 */
    assert_close(psy_gamma_kpa_c(p), 0.054, 0.0005); /* ch. 3 Example 2 */
}

/* Eq. 8 equals 0.665e-3 P, the rounded coefficient FAO-56 prints beside
 * it (ch. 3 eq. 8), to that rounding. */
static void test_gamma_coefficient(void **state)
{
    (void)state;
    assert_close(psy_gamma_kpa_c(100.0) / 100.0, 0.665e-3, 0.0005e-3);
}

/* Pressure falls with height (physics: the barometric law). */
static void test_pressure_decreases(void **state)
{
    (void)state;
    double prev = psy_pressure_kpa(-500.0);
    for (double z = -400.0; z <= 9000.0; z += 100.0) {
        double p = psy_pressure_kpa(z);
        assert_true(p < prev);
        prev = p;
    }
}

/* Mean es of FAO-56 ch. 3 Example 3 (Tmax 24.5 C, Tmin 15 C): e0(Tmax)
 * 3.075, e0(Tmin) 1.705, es 2.39 kPa (values from memory of Example 3,
 * consistent with Table 2.3). */
static void test_es_mean_example_3(void **state)
{
    (void)state;
    assert_close(psy_e0_kpa(24.5), 3.075, 0.0005);
    assert_close(psy_e0_kpa(15.0), 1.705, 0.0005);
    assert_close(psy_es_mean_kpa(24.5, 15.0), 2.39, 0.005);
}

/* ea of FAO-56 ch. 3 Example 5 (Tmin 18, Tmax 25 C, RHmax 82 %, RHmin
 * 54 %, RHmean 68 %): eq. 17 gives 1.70 and eq. 19 gives 1.78 kPa (from
 * memory of Example 5; two decimals printed). */
static void test_ea_example_5(void **state)
{
    (void)state;
    assert_close(psy_ea_rh_minmax_kpa(18.0, 25.0, 54.0, 82.0), 1.70, 0.005);
    assert_close(psy_ea_rh_mean_kpa(18.0, 25.0, 68.0), 1.78, 0.005);
}

/* ea from RH at one temperature is RH/100 of Table 2.3's e0: 50 % at 20 C
 * is half of 2.338 kPa (FAO-56 eq. 10 and A2 Table 2.3), and 100 % RH
 * gives zero deficit. */
static void test_ea_rh_single(void **state)
{
    (void)state;
    assert_close(psy_ea_rh_kpa(20.0, 50.0), 1.169, 0.00025);
    double es = psy_e0_kpa(25.0);
    assert_close(psy_vpd_kpa(es, psy_ea_rh_kpa(25.0, 100.0)), 0.0, 1e-15);
    assert_close(psy_vpd_kpa(es, psy_ea_rh_kpa(25.0, 40.0)), 0.6 * es,
                 1e-12);
}

/* The dew point is the algebraic inverse of eq. 14: round trip to 1e-9 C
 * from -40 to 50 C; and reading Table 2.3 backwards, ea = 2.338 kPa has a
 * dew point of 20 C within the table's rounding (0.0005 / 0.1447 C). */
static void test_dew_point_inverse(void **state)
{
    (void)state;
    for (double t = -40.0; t <= 50.0; t += 2.5)
        assert_close(psy_dew_point_c(psy_ea_dew_kpa(t)), t, 1e-9);
    assert_close(psy_dew_point_c(2.338), 20.0, 0.0035); /* A2 Tab. 2.3 */
}

/* Out-of-range inputs give NaN, as documented in psychro.h. */
static void test_refusals(void **state)
{
    (void)state;
    assert_true(isnan(psy_pressure_kpa(-600.0)));
    assert_true(isnan(psy_pressure_kpa(9500.0)));
    assert_true(isnan(psy_pressure_kpa((double)NAN)));
    assert_true(isnan(psy_gamma_kpa_c(0.0)));
    assert_true(isnan(psy_gamma_kpa_c(-1.0)));
    assert_true(isnan(psy_e0_kpa(-237.3)));
    assert_true(isnan(psy_e0_kpa((double)INFINITY)));
    assert_true(isnan(psy_slope_kpa_c(150.0)));
    assert_true(isnan(psy_es_mean_kpa(10.0, 20.0))); /* tmin > tmax */
    assert_true(isnan(psy_ea_rh_kpa(20.0, -0.1)));
    assert_true(isnan(psy_ea_rh_kpa(20.0, 100.1)));
    assert_true(isnan(psy_ea_rh_kpa(20.0, (double)NAN)));
    assert_true(isnan(psy_ea_rh_minmax_kpa(18.0, 25.0, 90.0, 80.0)));
    assert_true(isnan(psy_ea_rh_minmax_kpa(25.0, 18.0, 50.0, 80.0)));
    assert_true(isnan(psy_ea_rh_mean_kpa(18.0, 25.0, 101.0)));
    assert_true(isnan(psy_dew_point_c(0.0)));
    assert_true(isnan(psy_dew_point_c(-1.0)));
    assert_true(isnan(psy_dew_point_c(1e6)));
    assert_true(isnan(psy_vpd_kpa(-1.0, 1.0)));
    assert_true(isnan(psy_vpd_kpa(2.0, (double)NAN)));
    /* Boundaries themselves are accepted. */
    assert_false(isnan(psy_ea_rh_kpa(20.0, 0.0)));
    assert_false(isnan(psy_ea_rh_kpa(20.0, 100.0)));
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_e0_table_2_3),
        cmocka_unit_test(test_slope_table_2_4),
        cmocka_unit_test(test_slope_is_derivative),
        cmocka_unit_test(test_pressure_gamma_table_2_2),
        cmocka_unit_test(test_gamma_coefficient),
        cmocka_unit_test(test_pressure_decreases),
        cmocka_unit_test(test_es_mean_example_3),
        cmocka_unit_test(test_ea_example_5),
        cmocka_unit_test(test_ea_rh_single),
        cmocka_unit_test(test_dew_point_inverse),
        cmocka_unit_test(test_refusals),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
