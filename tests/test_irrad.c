/* test_irrad.c - checks for irrad.c: the extraterrestrial series, the Erbs
 * diffuse fraction at hand-evaluated points, the beam/diffuse split's
 * energy balance over a sweep, and the PAR conversions.
 */
#include "rgtest.h"
#include "irrad.h"

#define PI 3.14159265358979323846
#define DNAN ((double)NAN) /* NAN is a float */

/* Day 1 (B = 0): Duffie & Beckman (2013) eq. 1.4.1b reduces to
 * 1.000110 + 0.034221 + 0.000719 = 1.035050, times 1361 = 1408.70305 W m-2
 * (evaluated by hand).  Day 183 (B = 2 pi 182/365): factor 0.9666189,
 * 1315.5683 W m-2 (same equation, evaluated independently with a
 * calculator). */
static void test_extra_normal_values(void **state)
{
    (void)state;
    assert_close(irr_extra_normal_w_m2(1), 1408.70305, 1e-6);
    assert_close(irr_extra_normal_w_m2(183), 1315.5683, 1e-3);
}

/* The Earth is nearest the sun about 3 January and farthest about
 * 4 July (perihelion/aphelion dates, from memory): the series peaks in
 * days 1-6 and bottoms in days 182-188, within a few per cent of 1361. */
static void test_extra_normal_extremes(void **state)
{
    (void)state;
    int dmax = 1, dmin = 1;
    for (int d = 1; d <= 366; d++) {
        if (irr_extra_normal_w_m2(d) > irr_extra_normal_w_m2(dmax))
            dmax = d;
        if (irr_extra_normal_w_m2(d) < irr_extra_normal_w_m2(dmin))
            dmin = d;
    }
    assert_in_range(dmax, 1, 6);
    assert_in_range(dmin, 182, 188);
    assert_close(irr_extra_normal_w_m2(dmax) / IRR_SOLAR_CONSTANT_W_M2, 1.035,
                 1e-3);
    assert_close(irr_extra_normal_w_m2(dmin) / IRR_SOLAR_CONSTANT_W_M2,
                 0.9666, 1e-3);
}

/* The simpler published form, Duffie & Beckman (2013) eq. 1.4.1a,
 * 1 + 0.033 cos(360 n / 365), agrees with eq. 1.4.1b to within 0.0026 on
 * every day (difference computed here); 0.003 allowed. */
static void test_extra_normal_simple_form(void **state)
{
    (void)state;
    for (int d = 1; d <= 366; d++) {
        double simple = 1.0 + 0.033 * cos(2.0 * PI * d / 365.0);
        assert_close(irr_extra_normal_w_m2(d) / IRR_SOLAR_CONSTANT_W_M2,
                     simple, 0.003);
    }
}

/* Days outside 1..366 give NaN (irrad.h). */
static void test_extra_normal_bad_day(void **state)
{
    (void)state;
    assert_true(isnan(irr_extra_normal_w_m2(0)));
    assert_true(isnan(irr_extra_normal_w_m2(367)));
    assert_true(isnan(irr_extra_normal_w_m2(-5)));
}

/* Erbs et al. (1982) hourly correlation at kt 0.3, 0.5, 0.7: 0.9486,
 * 0.6591, 0.2440 (evaluated by hand from the polynomial: 0.948596,
 * 0.659150, 0.243980). */
static void test_erbs_values(void **state)
{
    (void)state;
    assert_close(irr_erbs_kd(0.3), 0.9486, 1e-4);
    assert_close(irr_erbs_kd(0.5), 0.6591, 1e-4);
    assert_close(irr_erbs_kd(0.7), 0.2440, 1e-4);
}

/* The linear and constant pieces of Erbs et al. (1982): 1 - 0.09 kt gives
 * 1.0 at 0 and 0.991 at 0.1; 0.165 above 0.8.  Out-of-range kt is clamped
 * and NaN stays NaN (irrad.h). */
static void test_erbs_pieces(void **state)
{
    (void)state;
    assert_close(irr_erbs_kd(0.0), 1.0, 1e-12);
    assert_close(irr_erbs_kd(0.1), 0.991, 1e-12);
    assert_close(irr_erbs_kd(0.22), 0.9802, 1e-12);
    assert_close(irr_erbs_kd(0.9), 0.165, 1e-12);
    assert_close(irr_erbs_kd(-0.2), 1.0, 1e-12);
    assert_close(irr_erbs_kd(1.7), 0.165, 1e-12);
    assert_true(isnan(irr_erbs_kd(DNAN)));
}

/* The pieces of Erbs et al. (1982) nearly meet: the polynomial gives
 * 0.97993 at kt 0.22 (line: 0.9802) and 0.16527 at 0.80 (constant: 0.165),
 * values evaluated by hand; and Kd stays within [0.16, 1] on [0, 1]. */
static void test_erbs_continuity_and_range(void **state)
{
    (void)state;
    assert_close(irr_erbs_kd(0.22 + 1e-12), 0.9802, 5e-4);
    assert_close(irr_erbs_kd(0.80), 0.16527, 1e-5);
    assert_close(irr_erbs_kd(0.80 + 1e-12), 0.165, 0.0);
    for (int i = 0; i <= 1000; i++) {
        double kd = irr_erbs_kd(i / 1000.0);
        assert_true(kd >= 0.16 && kd <= 1.0);
    }
}

/* A split with kt exactly 0.5 (GHI = 0.5 I0 cos z): DHI = 0.65915 GHI and
 * DNI = (1 - 0.65915) 0.5 I0 (Erbs et al. 1982 value evaluated by hand;
 * DNI from the definition of beam on a horizontal plane). */
static void test_split_known(void **state)
{
    (void)state;
    double i0 = irr_extra_normal_w_m2(172), cosz = cos(35.0 * PI / 180.0);
    double ghi = 0.5 * i0 * cosz, dni, dhi, kt;
    assert_int_equal(irr_split(ghi, 35.0, 172, &dni, &dhi, &kt), 0);
    assert_close(kt, 0.5, 1e-12);
    assert_close(dhi, 0.65915 * ghi, 1e-9);
    assert_close(dni, (1.0 - 0.65915) * 0.5 * i0, 1e-9);
}

/* Energy balance over a sweep of GHI 0-1600 W m-2 (past the top of the
 * atmosphere, to exercise the DNI cap), zenith 0-86.5, every 15th day:
 * DHI + DNI cos z = GHI, 0 <= DHI <= GHI, 0 <= DNI <= I0, 0 <= kt <= 1
 * (closure of the beam/diffuse decomposition; no outside source). */
static void test_split_energy_sweep(void **state)
{
    (void)state;
    int capped = 0;
    for (int day = 1; day <= 366; day += 15)
        for (double zen = 0.0; zen < IRR_ALL_DIFFUSE_ZENITH_DEG; zen += 0.5)
            for (double ghi = 0.0; ghi <= 1600.0; ghi += 10.0) {
                double dni, dhi, kt, i0 = irr_extra_normal_w_m2(day);
                double cosz = cos(zen * PI / 180.0);
                assert_int_equal(irr_split(ghi, zen, day, &dni, &dhi, &kt),
                                 0);
                assert_close(dhi + dni * cosz, ghi, 1e-9 * (1.0 + ghi));
                assert_true(dhi >= 0.0 && dhi <= ghi);
                assert_true(dni >= 0.0 && dni <= i0);
                assert_true(kt >= 0.0 && kt <= 1.0);
                if (dni == i0)
                    capped++;
            }
    assert_true(capped > 0);
}

/* Low sun, night and bad input, as irrad.h documents: at zenith >= 87 all
 * light is diffuse (also in twilight past 90); GHI <= 0 gives zeros; bad
 * values give -1 and NaN outputs. */
static void test_split_edges(void **state)
{
    (void)state;
    double dni, dhi, kt;
    assert_int_equal(irr_split(40.0, 88.0, 100, &dni, &dhi, &kt), 0);
    assert_close(dni, 0.0, 0.0);
    assert_close(dhi, 40.0, 0.0);
    assert_true(kt > 0.0 && kt <= 1.0);
    assert_int_equal(irr_split(3.0, 95.0, 100, &dni, &dhi, &kt), 0);
    assert_close(dhi, 3.0, 0.0);
    assert_close(dni, 0.0, 0.0);
    assert_int_equal(irr_split(0.0, 30.0, 100, &dni, &dhi, &kt), 0);
    assert_close(dni + dhi + kt, 0.0, 0.0);
    assert_int_equal(irr_split(-2.0, 120.0, 100, &dni, &dhi, &kt), 0);
    assert_close(dni + dhi + kt, 0.0, 0.0);
    assert_int_equal(irr_split(DNAN, 30.0, 100, &dni, &dhi, &kt), -1);
    assert_true(isnan(dni) && isnan(dhi) && isnan(kt));
    assert_int_equal(irr_split(500.0, 30.0, 0, &dni, &dhi, &kt), -1);
    assert_int_equal(irr_split(500.0, -1.0, 100, &dni, &dhi, &kt), -1);
    assert_int_equal(irr_split(500.0, 30.0, 100, NULL, &dhi, &kt), -1);
    assert_true(isnan(dhi) && isnan(kt));
}

/* PAR is IRR_PAR_FRACTION (0.50, Szeicz 1974, from memory) of shortwave;
 * negative input is night-time sensor offset and gives 0; NaN stays NaN. */
static void test_par_w(void **state)
{
    (void)state;
    assert_close(irr_par_w_m2(1000.0), 500.0, 1e-9);
    assert_close(irr_par_w_m2(-3.0), 0.0, 0.0);
    assert_true(isnan(irr_par_w_m2(DNAN)));
}

/* 4.57 umol J-1 (McCree 1972, from memory): 100 W m-2 of PAR is
 * 457 umol m-2 s-1.  Full summer sun, about 1000 W m-2 global, is about
 * 2000-2300 umol m-2 s-1 of PAR (rule of thumb, common practice, no
 * source). */
static void test_par_umol(void **state)
{
    (void)state;
    assert_close(irr_par_umol(100.0), 457.0, 1e-9);
    assert_close(irr_par_umol(irr_par_w_m2(1000.0)), 2150.0, 150.0);
    assert_close(irr_par_umol(-1.0), 0.0, 0.0);
    assert_true(isnan(irr_par_umol(DNAN)));
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_extra_normal_values),
        cmocka_unit_test(test_extra_normal_extremes),
        cmocka_unit_test(test_extra_normal_simple_form),
        cmocka_unit_test(test_extra_normal_bad_day),
        cmocka_unit_test(test_erbs_values),
        cmocka_unit_test(test_erbs_pieces),
        cmocka_unit_test(test_erbs_continuity_and_range),
        cmocka_unit_test(test_split_known),
        cmocka_unit_test(test_split_energy_sweep),
        cmocka_unit_test(test_split_edges),
        cmocka_unit_test(test_par_w),
        cmocka_unit_test(test_par_umol),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
