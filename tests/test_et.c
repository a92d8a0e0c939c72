/* test_et.c - checks of src/et.c against FAO-56's worked examples and
 * against physical sense.
 *
 * Part of rowgraze. GPL-3.0-or-later.
 *
 * Source of every published figure: Allen, R.G., Pereira, L.S., Raes, D. &
 * Smith, M. (1998) FAO Irrigation and Drainage Paper 56 ("FAO-56"),
 * chapters 3 and 4, the worked example named beside each check. Each value
 * is checked to the number of decimals the example prints (tolerance half a
 * unit of its last digit, R1..R4 below) unless a comment says otherwise.
 *
 * How the figures were confirmed: the book's text itself was not reachable
 * from this workplace's reference search. Examples 8-11, 13, 14, 17, 18 and
 * 20 figures agree with the values that an independent public test suite
 * (PyETo, Richards, tests/test_fao.py) attributes to the same FAO-56
 * examples; Example 19's figures are FROM MEMORY of the book and were
 * re-derived by hand from eq. 28-33, 39, 45/46, 53 before being written here
 * (the recomputation reproduces every printed digit, e.g. Ra = 3.543), so
 * they keep the rounding tolerance. Each check says which case it is.
 */
#include "rgtest.h"

#include "et.h"

#include <math.h>

/* Half a unit of the last printed decimal (plus float slack). */
#define R1 (0.05 + 1e-9)
#define R2 (0.005 + 1e-9)
#define R3 (0.0005 + 1e-9)
#define R4 (0.00005 + 1e-9)

#define ET_TEST_PI 3.14159265358979323846

static double deg_min(double deg, double min)
{
    return deg + min / 60.0;
}

/* Example 17 inputs: Bangkok, April, monthly mean day. */
static struct et_day ex17_day(void)
{
    struct et_day d = {0};
    d.lat_deg = deg_min(13.0, 44.0);
    d.elev_m = 2.0;
    d.doy = 105; /* mid-April; reproduces the example's Ra = 38.06 */
    d.tmax_c = 34.8;
    d.tmin_c = 25.6;
    d.humid = ET_HUMID_EA;
    d.ea_kpa = 2.85;
    d.sun = ET_SUN_RS;
    d.rs_mj_m2_d = 22.65;
    d.u2_m_s = 2.0;
    d.g_mj_m2_d = et_g_month_prev_mj_m2_d(29.2, 30.2); /* eq. 44 */
    return d;
}

/* Example 18 inputs: Brussels (Uccle), 6 July. */
static struct et_day ex18_day(void)
{
    struct et_day d = {0};
    d.lat_deg = deg_min(50.0, 48.0);
    d.elev_m = 100.0;
    d.doy = 187;
    d.tmax_c = 21.5;
    d.tmin_c = 12.3;
    d.humid = ET_HUMID_RH;
    d.rhmax_pct = 84.0;
    d.rhmin_pct = 63.0;
    d.sun = ET_SUN_HOURS;
    d.sun_h = 9.25;
    d.u2_m_s = et_u2_m_s(2.78, 10.0); /* eq. 47 */
    d.g_mj_m2_d = 0.0;                /* eq. 42, daily step */
    return d;
}

/* Example 19 inputs: N'Diaye (Senegal), 1 October, 16 13' N, 16 15' W,
 * 8 m; the example uses Lz = 15 (degrees west), i.e. a zone meridian at
 * 15 W. This is the 14:00-15:00 hour; night_hour() turns it into 02-03. */
static struct et_hour ex19_day_hour(void)
{
    struct et_hour h = {0};
    h.lat_deg = deg_min(16.0, 13.0);
    h.lon_east_deg = -deg_min(16.0, 15.0);
    h.zone_east_deg = -15.0;
    h.elev_m = 8.0;
    h.doy = 274;
    h.t_mid_h = 14.5;
    h.t_c = 38.0;
    h.rh_pct = 52.0;
    h.u2_m_s = 3.3;
    h.rs_mj_m2_h = 2.450;
    h.rs_rso_dark = 0.8; /* the example's assumed night Rs/Rso (arid) */
    return h;
}

static struct et_hour ex19_night_hour(void)
{
    struct et_hour h = ex19_day_hour();
    h.t_mid_h = 2.5;
    h.t_c = 28.0;
    h.rh_pct = 90.0;
    h.u2_m_s = 1.9;
    h.rs_mj_m2_h = 0.0;
    return h;
}

/* FAO-56 Example 8 (Ra for 20 S on 3 September, J = 246): dr = 0.985,
 * delta = 0.120 rad, ws = 1.527 rad, Ra = 32.2 MJ/m2/d. Confirmed against
 * PyETo tests/test_fao.py (Richards), which quotes the same four figures. */
static void test_ex8_extraterrestrial_day(void **state)
{
    double dec;

    (void)state;
    dec = et_declination_rad(246);
    assert_close(et_inv_rel_dist(246), 0.985, R3);
    assert_close(dec, 0.120, R3);
    assert_close(et_sunset_angle_rad(-20.0 * ET_TEST_PI / 180.0, dec), 1.527,
                 R3);
    assert_close(et_ra_day_mj_m2_d(-20.0, 246), 32.2, R1);
}

/* FAO-56 Example 9 (daylight hours, same place and day as Example 8):
 * N = 11.7 h (eq. 34). Confirmed against PyETo tests/test_fao.py. */
static void test_ex9_daylight_hours(void **state)
{
    (void)state;
    assert_close(et_daylight_h(-20.0, 246), 11.7, R1);
}

/* FAO-56 Example 10 (Rio de Janeiro, 22 54' S, May, 220 h of sunshine):
 * n = 7.1 h/d, N = 10.9 h, Ra = 25.1 MJ/m2/d -> Rs = 14.5 MJ/m2/d (eq. 35).
 * Ra and N for J = 135 recomputed here too. Confirmed against PyETo
 * tests/test_fao.py, which quotes 14.45 before rounding; eq. 35 on the
 * rounded inputs gives 14.4498, so the check is 14.45 to R2 (the book's
 * 14.5 is that figure rounded half up). */
static void test_ex10_angstrom(void **state)
{
    double lat = -deg_min(22.0, 54.0);

    (void)state;
    assert_close(et_ra_day_mj_m2_d(lat, 135), 25.1, R1);
    assert_close(et_daylight_h(lat, 135), 10.9, R1);
    assert_close(et_rs_angstrom_mj_m2_d(7.1, 10.9, 25.1), 14.45, R2);
}

/* FAO-56 Example 11 (Rnl, Rio de Janeiro in May): Tmax 25.1, Tmin 19.1 C,
 * ea 2.1 kPa, Rs 14.5, Rso 18.8 MJ/m2/d -> Rnl = 3.5 MJ/m2/d (eq. 39).
 * Confirmed against PyETo tests/test_fao.py. */
static void test_ex11_net_longwave_day(void **state)
{
    double r;

    (void)state;
    r = et_rs_rso(14.5, 18.8, 0.5);
    assert_close(et_rnl_day_mj_m2_d(25.1, 19.1, 2.1, r), 3.5, R1);
}

/* FAO-56 Example 13 (monthly G, April, T March 14.1 C, May 18.8 C):
 * G = 0.33 MJ/m2/d by eq. 43. Confirmed against PyETo tests/test_fao.py.
 * Eq. 44 is checked by Example 17 (G = 0.14) below. */
static void test_ex13_soil_heat_month(void **state)
{
    (void)state;
    assert_close(et_g_month_mj_m2_d(14.1, 18.8), 0.33, R2);
}

/* FAO-56 Example 14: 3.2 m/s measured at 10 m -> u2 = 2.4 m/s (eq. 47).
 * Confirmed against PyETo tests/test_fao.py. */
static void test_ex14_wind_height(void **state)
{
    (void)state;
    assert_close(et_u2_m_s(3.2, 10.0), 2.4, R1);
}

/* FAO-56 Example 17 (monthly, Bangkok, April): the intermediate terms
 * gamma 0.0673, delta 0.246, es 4.42, Ra 38.06, Rso 28.54, Rns 17.44,
 * Rnl 3.11, Rn 14.33, G 0.14 and ETo 5.72 mm/d. Figures as in our notes;
 * delta, Rn, G, es, ea and ETo confirmed against PyETo tests/test_fao.py
 * (which feeds them into eq. 6 and gets 5.72). Gamma: eq. 7-8 give
 * 0.06735 at 2 m with the rounded coefficient 0.665e-3 and 0.06732 with
 * eq. 8's full constants (psychro.c); our notes print 0.0673 and PyETo
 * quotes 0.0674 for this example, so the check allows either rounding
 * (tolerance 1e-4). */
static void test_ex17_monthly(void **state)
{
    struct et_day d = ex17_day();
    struct et_terms k;
    double eto;

    (void)state;
    eto = et_day_mm_d(&d, &k);
    assert_close(k.gamma_kpa_c, 0.0673, 1e-4);
    assert_close(k.t_c, 30.2, R1);
    assert_close(k.delta_kpa_c, 0.246, R3);
    assert_close(k.es_kpa, 4.42, R2);
    assert_close(k.ea_kpa, 2.85, R2);
    assert_close(k.ra_mj_m2, 38.06, R2);
    assert_close(k.rso_mj_m2, 28.54, R2);
    assert_close(k.rns_mj_m2, 17.44, R2);
    assert_close(k.rnl_mj_m2, 3.11, R2);
    assert_close(k.rn_mj_m2, 14.33, R2);
    assert_close(k.g_mj_m2, 0.14, R2);
    assert_close(eto, 5.72, R2);
}

/* FAO-56 Example 17: its Rs = 22.65 MJ/m2/d comes from n = 8.5 h/d with
 * N = 12.31 h by eq. 35. n = 8.5 and N = 12.31 are FROM MEMORY; they
 * reproduce the printed Rs to the last digit, so the check keeps the
 * rounding tolerance. */
static void test_ex17_sunshine(void **state)
{
    struct et_day d = ex17_day();
    struct et_terms k;

    (void)state;
    assert_close(et_daylight_h(d.lat_deg, d.doy), 12.31, R2);
    d.sun = ET_SUN_HOURS;
    d.sun_h = 8.5;
    assert_close(et_day_mm_d(&d, &k), 5.72, R2);
    assert_close(k.rs_mj_m2, 22.65, R2);
}

/* FAO-56 Example 18 (daily, Brussels, 6 July): u2 2.078, es 1.997,
 * ea 1.409, delta 0.122, gamma 0.0666, Ra 41.09, Rso 30.90, Rs 22.07,
 * Rnl 3.71, Rn 13.28, ETo 3.9 mm/d. Ra, Rso, u2, es, ea, delta, gamma and
 * Rn confirmed against PyETo tests/test_fao.py. Gamma: the book's 0.0666
 * is 0.665e-3 x P (P = 100.12 kPa, 0.06658); eq. 8 with its full
 * constants (psychro.c) gives 0.066556, which still rounds to the printed
 * figure, so the R4 check stands. u2: eq. 47 gives 2.0793;
 * the book prints 2.078 (rounded conversion factor), so that one check
 * allows 0.0015. es: the book averages rounded e(Tmax) 2.564 and e(Tmin)
 * 1.431 (= 1.9975) and prints 1.997, hence 1e-3. ETo: the book prints 3.9;
 * our notes say 3.88 unrounded, which we reproduce to R2 as well. */
static void test_ex18_daily(void **state)
{
    struct et_day d = ex18_day();
    struct et_terms k;
    double eto;

    (void)state;
    assert_close(d.u2_m_s, 2.078, 0.0015);
    assert_close(et_daylight_h(d.lat_deg, d.doy), 16.1, R1);
    eto = et_day_mm_d(&d, &k);
    assert_close(k.t_c, 16.9, R1);
    assert_close(k.es_kpa, 1.997, 1e-3);
    assert_close(k.ea_kpa, 1.409, R3);
    assert_close(k.delta_kpa_c, 0.122, R3);
    assert_close(k.gamma_kpa_c, 0.0666, R4);
    assert_close(k.ra_mj_m2, 41.09, R2);
    assert_close(k.rso_mj_m2, 30.90, R2);
    assert_close(k.rs_mj_m2, 22.07, R2);
    assert_close(k.rnl_mj_m2, 3.71, R2);
    assert_close(k.rn_mj_m2, 13.28, R2);
    assert_close(k.g_mj_m2, 0.0, 0.0);
    assert_close(eto, 3.9, R1);
    assert_close(eto, 3.88, R2);
}

/* FAO-56 Example 19, 14:00-15:00 (FROM MEMORY, re-derived by hand, see the
 * top of the file): e(T) 6.63 (printed; it is FAO-56 Annex 2 Table 2.3's
 * 6.625 at 38 C, from memory, rounded half up, so the check is 6.625 to
 * R3; eq. 11 gives 6.6248), ea 3.45 (printed; 0.52 x 6.625 = 3.445
 * rounded half up, so the check is 3.445 to R3), delta 0.358, gamma 0.0673,
 * Ra 3.543, Rso 2.658, Rs/Rso 0.92, Rns 1.887, Rnl 0.137, Rn 1.749,
 * G 0.175 (eq. 45), ETo 0.63 mm/h. */
static void test_ex19_hourly_day(void **state)
{
    struct et_hour h = ex19_day_hour();
    struct et_terms k;
    double eto;

    (void)state;
    eto = et_hour_mm_h(&h, &k);
    assert_close(k.es_kpa, 6.625, R3);
    assert_close(k.ea_kpa, 3.445, R3);
    assert_close(k.delta_kpa_c, 0.358, R3);
    assert_close(k.gamma_kpa_c, 0.0673, R4);
    assert_close(k.ra_mj_m2, 3.543, R3);
    assert_close(k.rso_mj_m2, 2.658, R3);
    assert_close(k.rs_rso, 0.92, R2);
    assert_close(k.rns_mj_m2, 1.887, R3);
    assert_close(k.rnl_mj_m2, 0.137, R3);
    assert_close(k.rn_mj_m2, 1.749, R3);
    assert_close(k.g_mj_m2, 0.175, R3);
    assert_close(eto, 0.63, R2);
}

/* FAO-56 Example 19, 02:00-03:00 (FROM MEMORY, re-derived by hand): sun
 * down so Ra = Rso = 0, Rs/Rso taken as 0.8, e(T) 3.78, ea 3.40,
 * delta 0.220, Rnl 0.100, Rn -0.100, G -0.050 (eq. 46), ETo 0.00 mm/h;
 * rounded as the book prints it, ETo is not negative. */
static void test_ex19_hourly_night(void **state)
{
    struct et_hour h = ex19_night_hour();
    struct et_terms k;
    double eto;

    (void)state;
    eto = et_hour_mm_h(&h, &k);
    assert_close(k.es_kpa, 3.78, R2);
    assert_close(k.ea_kpa, 3.40, R2);
    assert_close(k.delta_kpa_c, 0.220, R3);
    assert_close(k.ra_mj_m2, 0.0, 0.0);
    assert_close(k.rso_mj_m2, 0.0, 0.0);
    assert_close(k.rs_rso, 0.8, 0.0);
    assert_close(k.rnl_mj_m2, 0.100, R3);
    assert_close(k.rn_mj_m2, -0.100, R3);
    assert_close(k.g_mj_m2, -0.050, R3);
    assert_close(eto, 0.00, R2);
    assert_true(round(eto * 100.0) / 100.0 >= 0.0);
}

/* FAO-56 Example 19 hour angles (FROM MEMORY, re-derived by hand): with
 * Lz = 15 and Lm = 16.25 degrees west (eq. 31's convention), J = 274 and
 * t = 14.5 h, Ra = 3.543 MJ/m2/h; the east-positive wrapper with -15 and
 * -16.25 must give the same, and so must Lz written as 375 (= 15) since
 * Lz - Lm is taken modulo 360. */
static void test_ex19_longitude_conventions(void **state)
{
    double lat = deg_min(16.0, 13.0);
    double ra;

    (void)state;
    ra = et_ra_hour_mj_m2(lat, 274, 15.0, 16.25, 14.5, 1.0);
    assert_close(ra, 3.543, R3);
    assert_close(et_ra_hour_east_mj_m2(lat, 274, -15.0, -16.25, 14.5, 1.0),
                 ra, 1e-12);
    assert_close(et_ra_hour_mj_m2(lat, 274, 375.0, 16.25, 14.5, 1.0), ra,
                 1e-12);
    assert_close(et_deg_west(-16.25), 16.25, 1e-12);
    assert_close(et_deg_west(15.0), 345.0, 1e-12);
    assert_close(et_deg_west(0.0), 0.0, 0.0);
}

/* Sign of eq. 31 (derived from FAO-56 eq. 31-33, no published figure): the
 * clock time of solar noon is t0 = 12 - 0.06667 (Lz - Lm) - Sc, so Ra is
 * symmetric about t0. A site 15 degrees EAST of its zone meridian sees
 * solar noon one hour EARLIER than a site on the meridian. */
static void test_solar_noon_sign(void **state)
{
    int doy = 172;
    double b = 2.0 * ET_TEST_PI * (doy - 81) / 364.0;
    double sc = 0.1645 * sin(2.0 * b) - 0.1255 * cos(b) - 0.025 * sin(b);
    double t0 = 12.0 - sc; /* site on the zone meridian */
    double t_east = t0 - 15.0 * 0.06667;

    (void)state;
    assert_close(et_ra_hour_east_mj_m2(45.0, doy, 15.0, 15.0, t0 - 2.5, 1.0),
                 et_ra_hour_east_mj_m2(45.0, doy, 15.0, 15.0, t0 + 2.5, 1.0),
                 1e-9);
    assert_close(et_ra_hour_east_mj_m2(45.0, doy, 15.0, 30.0, t_east - 3.0,
                                       1.0),
                 et_ra_hour_east_mj_m2(45.0, doy, 15.0, 30.0, t_east + 3.0,
                                       1.0),
                 1e-9);
    assert_true(et_ra_hour_east_mj_m2(45.0, doy, 15.0, 30.0, 9.0, 1.0) >
                et_ra_hour_east_mj_m2(45.0, doy, 15.0, 15.0, 9.0, 1.0));
}

/* Eq. 28 and eq. 21 integrate the same extraterrestrial irradiance, so
 * short periods summed over 24 h must give the daily Ra (derived from
 * FAO-56 eq. 21 and 28; no published figure). 6-minute periods: the only
 * loss is FAO-56's zero for a period whose midpoint is past sunset. */
static void test_hourly_sums_to_daily(void **state)
{
    static const double lats[] = {-35.0, 0.0, 16.2, 50.8};
    static const int doys[] = {15, 105, 187, 274};
    size_t i, j;
    int s;

    (void)state;
    for (i = 0; i < sizeof lats / sizeof lats[0]; i++)
        for (j = 0; j < sizeof doys / sizeof doys[0]; j++) {
            double sum = 0.0, day = et_ra_day_mj_m2_d(lats[i], doys[j]);
            for (s = 0; s < 240; s++)
                sum += et_ra_hour_east_mj_m2(lats[i], doys[j], 0.0, 0.0,
                                             0.05 + 0.1 * s, 0.1);
            assert_close(sum, day, 0.001 * day);
        }
}

/* Polar day and night (eq. 25 with its argument clamped; no published
 * figure): at 80 N in late June the sun never sets (ws = pi, N = 24 h), so
 * every hour gets some Ra, even for a site 44 degrees west of its zone
 * meridian whose solar time runs 2.9 h behind the clock (the hour angle
 * must be taken modulo 2 pi); in late December it never rises (ws = 0,
 * Ra = 0, every hour dark). */
static void test_polar(void **state)
{
    double lat = 80.0 * ET_TEST_PI / 180.0;
    int hr;

    (void)state;
    for (hr = 0; hr < 24; hr++)
        assert_true(et_ra_hour_east_mj_m2(80.0, 172, 120.0, 76.0, hr + 0.5,
                                          1.0) > 0.0);
    assert_close(et_sunset_angle_rad(lat, et_declination_rad(172)),
                 ET_TEST_PI, 1e-12);
    assert_close(et_daylight_h(80.0, 172), 24.0, 1e-9);
    assert_close(et_sunset_angle_rad(lat, et_declination_rad(355)), 0.0,
                 1e-12);
    assert_close(et_ra_day_mj_m2_d(80.0, 355), 0.0, 1e-9);
    assert_close(et_ra_hour_east_mj_m2(80.0, 355, 0.0, 0.0, 12.0, 1.0), 0.0,
                 0.0);
}

/* Hourly Ra is zero when the mid-hour sun is below the horizon and never
 * negative at sunrise (FAO-56 text under eq. 28-31; clipping to +-ws is
 * eq. 28 integrated over the daylit part only). */
static void test_hourly_ra_night_and_twilight(void **state)
{
    double t;

    (void)state;
    assert_close(et_ra_hour_mj_m2(50.8, 187, 0.0, 0.0, 0.5, 1.0), 0.0, 0.0);
    for (t = 0.25; t < 24.0; t += 0.5)
        assert_true(et_ra_hour_mj_m2(50.8, 187, 0.0, 0.0, t, 1.0) >= 0.0);
}

/* An hour that straddles sunset gets eq. 28 integrated over its daylit part
 * only (derived from eq. 28-31; no published figure): the hour whose
 * midpoint is 15 min before sunset must receive exactly what the 45-min
 * period ending at sunset receives: its last 15 min add nothing, neither
 * positive nor negative. Site on the zone meridian, so sunset clock time
 * is 12 + 12 ws / pi - Sc (eq. 31-33). And as FAO-56 says under eq. 31,
 * an hour whose midpoint angle is past ws gets Ra = 0 even though it
 * starts in daylight. */
static void test_hourly_ra_sunset_clip(void **state)
{
    int doy = 187;
    double lat = 50.8;
    double b = 2.0 * ET_TEST_PI * (doy - 81) / 364.0;
    double sc = 0.1645 * sin(2.0 * b) - 0.1255 * cos(b) - 0.025 * sin(b);
    double ws = et_sunset_angle_rad(lat * ET_TEST_PI / 180.0,
                                    et_declination_rad(doy));
    double t_set = 12.0 + 12.0 * ws / ET_TEST_PI - sc;
    double hour, part;

    (void)state;
    hour = et_ra_hour_east_mj_m2(lat, doy, 0.0, 0.0, t_set - 0.25, 1.0);
    part = et_ra_hour_east_mj_m2(lat, doy, 0.0, 0.0, t_set - 0.375, 0.75);
    assert_true(part > 0.0);
    assert_close(hour, part, 1e-6 * part);
    assert_close(et_ra_hour_east_mj_m2(lat, doy, 0.0, 0.0, t_set + 0.25, 1.0),
                 0.0, 0.0);
}

/* Rs/Rso (FAO-56 text under eq. 39): limited to <= 1; with the sun down
 * the caller's ratio is used (0.4-0.6 humid, 0.7-0.8 arid). */
static void test_rs_rso_rule(void **state)
{
    (void)state;
    assert_close(et_rs_rso(30.0, 25.0, 0.5), 1.0, 0.0);
    assert_close(et_rs_rso(10.0, 20.0, 0.5), 0.5, 1e-12);
    assert_close(et_rs_rso(0.0, 0.0, 0.7), 0.7, 0.0);
    assert_true(isnan(et_rs_rso(0.0, 0.0, 1.5)));
    assert_true(isnan(et_rs_rso(-1.0, 10.0, 0.5)));
}

/* Hourly G: eq. 45 in daylight (0.1 Rn), eq. 46 at night (0.5 Rn). */
static void test_hourly_soil_heat(void **state)
{
    (void)state;
    assert_close(et_g_hour_mj_m2_h(2.0, 1), 0.2, 1e-12);
    assert_close(et_g_hour_mj_m2_h(-0.2, 0), -0.1, 1e-12);
}

/* FAO-56 Example 20 (ea from Tdew = 14.8 C, eq. 14): ea = 1.68 kPa.
 * Confirmed against PyETo tests/test_fao.py. Checked through the daily
 * humidity switch. */
static void test_ex20_dewpoint(void **state)
{
    struct et_day d = ex18_day();
    struct et_terms k;

    (void)state;
    d.humid = ET_HUMID_TDEW;
    d.tdew_c = 14.8;
    assert_false(isnan(et_day_mm_d(&d, &k)));
    assert_close(k.ea_kpa, 1.68, R2);
}

/* Physical sense (eq. 6 and 53; common practice, no source): more solar
 * radiation or a larger vapour pressure deficit (lower RH, drier air)
 * gives more ETo, daily and hourly. */
static void test_monotone(void **state)
{
    struct et_day d = ex18_day();
    struct et_hour h = ex19_day_hour();
    double prev;
    int i;

    (void)state;
    d.sun = ET_SUN_RS;
    prev = -1.0;
    for (i = 0; i <= 30; i += 3) {
        double e;
        d.rs_mj_m2_d = i;
        e = et_day_mm_d(&d, NULL);
        assert_true(e > prev);
        prev = e;
    }
    prev = -1.0;
    for (i = 95; i >= 5; i -= 10) {
        double e;
        d.rhmax_pct = i;
        d.rhmin_pct = i;
        d.humid = ET_HUMID_RH;
        e = et_day_mm_d(&d, NULL);
        assert_true(e > prev);
        prev = e;
    }
    prev = -1.0;
    for (i = 0; i <= 12; i++) {
        double e;
        h.rs_mj_m2_h = 0.25 * i;
        e = et_hour_mm_h(&h, NULL);
        assert_true(e > prev);
        prev = e;
    }
    prev = -1.0;
    for (i = 95; i >= 5; i -= 10) {
        double e;
        h.rh_pct = i;
        e = et_hour_mm_h(&h, NULL);
        assert_true(e > prev);
        prev = e;
    }
}

/* Bad input gives NAN and leaves the terms untouched (et.h contract). */
static void test_bad_input(void **state)
{
    struct et_day d = ex18_day();
    struct et_hour h = ex19_day_hour();
    struct et_terms k = {0};

    (void)state;
    assert_true(isnan(et_inv_rel_dist(0)));
    assert_true(isnan(et_declination_rad(367)));
    assert_true(isnan(et_ra_day_mj_m2_d(91.0, 100)));
    assert_true(isnan(et_ra_hour_mj_m2(10.0, 100, 0.0, 0.0, 12.0, 0.0)));
    assert_true(isnan(et_ra_hour_mj_m2(10.0, 100, (double)NAN, 0.0, 12.0,
                                       1.0)));
    assert_true(isnan(et_u2_m_s(2.0, 0.05)));
    assert_true(isnan(et_u2_m_s(-1.0, 10.0)));
    assert_true(isnan(et_rnl_day_mj_m2_d(10.0, 20.0, 1.0, 0.5)));
    assert_true(isnan(et_rs_angstrom_mj_m2_d(-1.0, 12.0, 30.0)));
    assert_true(isnan(et_day_mm_d(NULL, &k)));
    d.rhmin_pct = 90.0; /* above rhmax */
    assert_true(isnan(et_day_mm_d(&d, &k)));
    d = ex18_day();
    d.humid = (enum et_humid)42;
    assert_true(isnan(et_day_mm_d(&d, &k)));
    d = ex18_day();
    d.tmax_c = 5.0; /* below tmin */
    assert_true(isnan(et_day_mm_d(&d, &k)));
    /* Outside the ranges of psychro.h, which et.c takes its eq. 7-17
     * from (et.h contract): elevation above 9000 m, tmax above 100 C, dew
     * point above 100 C, hourly t_c above 100 C. */
    d = ex18_day();
    d.elev_m = 9500.0;
    assert_true(isnan(et_day_mm_d(&d, &k)));
    d = ex18_day();
    d.tmax_c = 101.0;
    assert_true(isnan(et_day_mm_d(&d, &k)));
    d = ex18_day();
    d.humid = ET_HUMID_TDEW;
    d.tdew_c = 120.0;
    assert_true(isnan(et_day_mm_d(&d, &k)));
    h.t_c = 101.0;
    assert_true(isnan(et_hour_mm_h(&h, &k)));
    h = ex19_day_hour();
    h.rh_pct = 101.0;
    assert_true(isnan(et_hour_mm_h(&h, &k)));
    h = ex19_day_hour();
    h.t_mid_h = 25.0;
    assert_true(isnan(et_hour_mm_h(&h, &k)));
    assert_close(k.rn_mj_m2, 0.0, 0.0);
}

/* The shaded form equals the full hourly equation when the strip gets the
 * open field's sun (same eq. 53), falls with less sun, and at no sun
 * equals the aerodynamic term alone less the longwave loss (FAO-56 eq. 53
 * with Rs = 0, Rnl held): checked on Example 19's afternoon hour. */
static void test_shaded(void **state)
{
    (void)state;
    struct et_hour h = ex19_day_hour();
    struct et_terms k;
    double open = et_hour_mm_h(&h, &k);
    assert_close(et_hour_shaded_mm_h(&k, h.u2_m_s, h.rs_mj_m2_h), open, 1e-12);
    double half = et_hour_shaded_mm_h(&k, h.u2_m_s, 0.5 * h.rs_mj_m2_h);
    double none = et_hour_shaded_mm_h(&k, h.u2_m_s, 0.0);
    assert_true(none < half && half < open);
    /* by hand from eq. 53: Rn = -Rnl, G = 0.1 Rn (daylight, eq. 45) */
    double rn = -k.rnl_mj_m2, g = 0.1 * rn;
    double expect = (0.408 * k.delta_kpa_c * (rn - g) +
                     k.gamma_kpa_c * 37.0 / (k.t_c + 273.0) * h.u2_m_s * (k.es_kpa - k.ea_kpa)) /
                    (k.delta_kpa_c + k.gamma_kpa_c * (1.0 + 0.34 * h.u2_m_s));
    assert_close(none, expect, 1e-12);
    assert_true(isnan(et_hour_shaded_mm_h(&k, h.u2_m_s, -1.0)));
}

/* The shaded form with a scaled surface resistance (et.h): factor 1 is
 * et_hour_shaded_mm_h() exactly; factor 2 is eq. 53 with 0.68 in place of
 * 0.34 (by hand, the same terms); more resistance, less ET on Example 19's
 * afternoon hour at any sun; bad factors refused. */
static void test_shaded_rs(void **state)
{
    (void)state;
    struct et_hour h = ex19_day_hour();
    struct et_terms k;
    (void)et_hour_mm_h(&h, &k);
    for (double sun = 0.0; sun <= 1.0; sun += 0.25) {
        double rs = sun * h.rs_mj_m2_h;
        assert_true(et_hour_shaded_rs_mm_h(&k, h.u2_m_s, rs, 1.0) ==
                    et_hour_shaded_mm_h(&k, h.u2_m_s, rs));
        assert_true(et_hour_shaded_rs_mm_h(&k, h.u2_m_s, rs, 3.0) <
                    et_hour_shaded_rs_mm_h(&k, h.u2_m_s, rs, 1.5));
        assert_true(et_hour_shaded_rs_mm_h(&k, h.u2_m_s, rs, 1.5) <
                    et_hour_shaded_mm_h(&k, h.u2_m_s, rs));
    }
    double rn = et_rns_mj_m2(0.3 * h.rs_mj_m2_h) - k.rnl_mj_m2, g = 0.1 * rn; /* eq. 38, 40, 45 */
    double expect = (0.408 * k.delta_kpa_c * (rn - g) +
                     k.gamma_kpa_c * 37.0 / (k.t_c + 273.0) * h.u2_m_s * (k.es_kpa - k.ea_kpa)) /
                    (k.delta_kpa_c + k.gamma_kpa_c * (1.0 + 0.68 * h.u2_m_s));
    assert_close(et_hour_shaded_rs_mm_h(&k, h.u2_m_s, 0.3 * h.rs_mj_m2_h, 2.0), expect, 1e-12);
    assert_true(isnan(et_hour_shaded_rs_mm_h(&k, h.u2_m_s, 0.1, 0.0)));
    assert_true(isnan(et_hour_shaded_rs_mm_h(&k, h.u2_m_s, 0.1, -1.0)));
    assert_true(isnan(et_hour_shaded_rs_mm_h(&k, h.u2_m_s, 0.1, (double)INFINITY)));
    assert_true(isnan(et_hour_shaded_rs_mm_h(&k, h.u2_m_s, 0.1, (double)NAN)));
    assert_true(isnan(et_hour_shaded_rs_mm_h(NULL, h.u2_m_s, 0.1, 1.0)));
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_ex8_extraterrestrial_day),
        cmocka_unit_test(test_ex9_daylight_hours),
        cmocka_unit_test(test_ex10_angstrom),
        cmocka_unit_test(test_ex11_net_longwave_day),
        cmocka_unit_test(test_ex13_soil_heat_month),
        cmocka_unit_test(test_ex14_wind_height),
        cmocka_unit_test(test_ex17_monthly),
        cmocka_unit_test(test_ex17_sunshine),
        cmocka_unit_test(test_ex18_daily),
        cmocka_unit_test(test_ex19_hourly_day),
        cmocka_unit_test(test_ex19_hourly_night),
        cmocka_unit_test(test_ex19_longitude_conventions),
        cmocka_unit_test(test_solar_noon_sign),
        cmocka_unit_test(test_hourly_sums_to_daily),
        cmocka_unit_test(test_polar),
        cmocka_unit_test(test_hourly_ra_night_and_twilight),
        cmocka_unit_test(test_hourly_ra_sunset_clip),
        cmocka_unit_test(test_rs_rso_rule),
        cmocka_unit_test(test_hourly_soil_heat),
        cmocka_unit_test(test_ex20_dewpoint),
        cmocka_unit_test(test_monotone),
        cmocka_unit_test(test_bad_input),
        cmocka_unit_test(test_shaded),
        cmocka_unit_test(test_shaded_rs),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
