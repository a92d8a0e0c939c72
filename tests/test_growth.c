/* test_growth.c - checks of src/growth.c: each modifier against its
 * published form, the hourly step against physical sense and mass balance.
 *
 * Part of rowgraze. GPL-3.0-or-later.
 *
 * Runs from the repository root (make check does): the magnitude check
 * reads models/swards/cool-season-grass.json.
 *
 * Where the expected numbers come from:
 *   - the Beta function values (Tmin 0, Topt 20, Tmax 35) were computed by
 *     hand from the Yin et al. (1995) form f = ((T-Tmin)/(Topt-Tmin))^a
 *     ((Tmax-T)/(Tmax-Topt)), a = (Topt-Tmin)/(Tmax-Topt) = 4/3:
 *       f(10) = 0.5^(4/3) x 25/15 = 0.39685 x 1.66667 = 0.66142,
 *       f(30) = 1.5^(4/3) x 5/15  = 1.71707 x 0.33333 = 0.57236,
 *     and written to 4 decimals (tolerance half a unit of the last one);
 *   - 3-PG: f = exp(-0.05 x 10) = exp(-0.5) = 0.60653 (by hand);
 *   - Beer's law: 1 - exp(-0.5 x 2) = 1 - 1/e = 0.63212 (by hand);
 *   - everything else is a property stated beside its test; sequences of
 *     weather in these tests are INVENTED and say so.
 */
#include <math.h>
#include <string.h>

#include "rgtest.h"
#include "growth.h"
#include "irrad.h"
#include "sward.h"

/* Half a unit of the 4th decimal (plus float slack). */
#define R4 (0.00005 + 1e-12)

/* An INVENTED sward for property checks: cardinal temperatures, RUE, k and
 * rates like models/swards/cool-season-grass.json, but a non-zero base
 * cover so the base/green split is exercised. */
static sward_params invented_sward(void)
{
    sward_params s;
    memset(&s, 0, sizeof s);
    strcpy(s.name, "invented");
    s.rue_g_per_mj_par = 1.9;
    s.light_extinction_k = 0.5;
    s.leaf_area_per_cover_m2_per_kgdm_ha = 0.0015;
    s.t_min_c = 0.0;
    s.t_opt_c = 24.0;
    s.t_max_c = 38.0;
    s.vpd_coeff_per_mbar = 0.05;
    s.senescence_per_day = 0.02;
    s.height_mass_kgdm_ha_per_cm = 110.0;
    s.base_cover_kgdm_ha = 300.0;
    return s;
}

/* Fills a strip's running mean with warm hours so dormancy is off. */
static void warm_up(const sward_params *s, gr_state *st)
{
    gr_flux f;
    for (int h = 0; h < GR_T_AIR_HOURS; h++)
        assert_int_equal(gr_hour(s, st, 0.0, (double)NAN, (double)NAN, 1.0, 15.0, &f), 0);
}

/* Gross growth of one lit hour from a fresh strip at cover_kgdm_ha. */
static double one_hour_gross(const sward_params *s, double cover_kgdm_ha,
                             double sw_w_m2, double t_leaf_c, double vpd_kpa,
                             double ks)
{
    gr_state st;
    gr_flux f;
    assert_int_equal(gr_state_init(s, cover_kgdm_ha, &st), 0);
    assert_int_equal(gr_hour(s, &st, sw_w_m2, t_leaf_c, vpd_kpa, ks, 15.0, &f), 0);
    return f.gross_kgdm_ha;
}

/* Beta function at the brief's cardinal temperatures: hand-computed values
 * of the Yin et al. (1995) form (see the top of this file); f(Topt) = 1 by
 * construction (normalised at the optimum). */
static void test_temp_beta_values(void **state)
{
    (void)state;
    assert_close(gr_temp_beta(10.0, 0.0, 20.0, 35.0), 0.6614, R4); /* by hand */
    assert_close(gr_temp_beta(30.0, 0.0, 20.0, 35.0), 0.5724, R4); /* by hand */
    assert_close(gr_temp_beta(20.0, 0.0, 20.0, 35.0), 1.0, 1e-15);  /* f(Topt)=1 */
}

/* The peak lies at Topt (Yin et al. 1995: the Beta function's maximum is at
 * To = (alpha Tc + beta Tb)/(alpha + beta), which the choice of a makes
 * Topt): values just either side are below 1. */
static void test_temp_beta_peak(void **state)
{
    (void)state;
    assert_true(gr_temp_beta(19.9, 0.0, 20.0, 35.0) < 1.0);
    assert_true(gr_temp_beta(20.1, 0.0, 20.0, 35.0) < 1.0);
    assert_true(gr_temp_beta(19.9, 0.0, 20.0, 35.0) > 0.999);
    assert_true(gr_temp_beta(20.1, 0.0, 20.0, 35.0) > 0.999);
}

/* 0 at and outside the cardinal limits (Yin et al. 1995: no development at
 * or beyond Tb and Tc); NaN for bad arguments (growth.h contract). */
static void test_temp_beta_limits_and_bad(void **state)
{
    (void)state;
    assert_close(gr_temp_beta(0.0, 0.0, 20.0, 35.0), 0.0, 0.0);
    assert_close(gr_temp_beta(-5.0, 0.0, 20.0, 35.0), 0.0, 0.0);
    assert_close(gr_temp_beta(35.0, 0.0, 20.0, 35.0), 0.0, 0.0);
    assert_close(gr_temp_beta(40.0, 0.0, 20.0, 35.0), 0.0, 0.0);
    assert_true(gr_temp_beta(0.01, 0.0, 20.0, 35.0) > 0.0);
    assert_true(gr_temp_beta(34.99, 0.0, 20.0, 35.0) > 0.0);
    assert_true(isnan(gr_temp_beta((double)NAN, 0.0, 20.0, 35.0)));
    assert_true(isnan(gr_temp_beta(10.0, 20.0, 20.0, 35.0)));
    assert_true(isnan(gr_temp_beta(10.0, 0.0, 35.0, 20.0)));
    assert_true(isnan(gr_temp_beta(10.0, (double)NAN, 20.0, 35.0)));
}

/* 3-PG VPD modifier (Landsberg & Waring 1997, f = exp(-k D), D in mbar):
 * 1 kPa = 10 mbar at k = 0.05 gives exp(-0.5) = 0.6065 (by hand); no
 * deficit gives 1; a negative deficit is taken as 0 (growth.h). */
static void test_vpd_mod(void **state)
{
    (void)state;
    assert_close(gr_vpd_mod(1.0, 0.05), 0.6065, R4);   /* by hand */
    assert_close(gr_vpd_mod(0.0, 0.05), 1.0, 0.0);     /* exp(0) */
    assert_close(gr_vpd_mod(-0.3, 0.05), 1.0, 0.0);    /* growth.h */
    assert_true(gr_vpd_mod(2.0, 0.05) < gr_vpd_mod(1.0, 0.05));
    assert_true(isnan(gr_vpd_mod((double)NAN, 0.05)));
    assert_true(isnan(gr_vpd_mod(1.0, -0.01)));
}

/* Beer's law (Monsi & Saeki 1953): nothing intercepted without leaves,
 * almost everything under a dense canopy, 1 - 1/e at k LAI = 1 (by hand). */
static void test_intercepted(void **state)
{
    (void)state;
    assert_close(gr_intercepted(0.0, 0.5), 0.0, 0.0);
    assert_close(gr_intercepted(100.0, 0.5), 1.0, 1e-15);
    assert_close(gr_intercepted(2.0, 0.5), 0.6321, R4);          /* by hand */
    assert_close(gr_intercepted(2.0, 0.5), 1.0 - exp(-1.0), 1e-15); /* the formula */
    assert_true(isnan(gr_intercepted(-1.0, 0.5)));
    assert_true(isnan(gr_intercepted(2.0, 0.0)));
    assert_true(isnan(gr_intercepted((double)NAN, 0.5)));
}

/* No light, no growth (Monteith 1977: growth is RUE x intercepted
 * radiation); micro.c's NaN leaf values at night are accepted, and
 * senescence still runs (senescence_per_day / 24 of green, growth.h). */
static void test_dark(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    gr_state st;
    gr_flux f;
    assert_int_equal(gr_state_init(&s, 2300.0, &st), 0);
    warm_up(&s, &st);
    double green0 = st.green_kgdm_ha;
    assert_int_equal(gr_hour(&s, &st, 0.0, (double)NAN, (double)NAN, 1.0, 15.0, &f), 0);
    assert_close(f.gross_kgdm_ha, 0.0, 0.0);
    assert_close(f.par_mj_m2, 0.0, 0.0);
    assert_close(f.senescence_kgdm_ha, 0.02 / 24.0 * green0, 1e-12);
    assert_int_equal(gr_hour(&s, &st, -3.0, 20.0, 1.0, 1.0, 15.0, &f), 0);
    assert_close(f.gross_kgdm_ha, 0.0, 0.0); /* negative sw is dark, growth.h */
}

/* No growth at or beyond the cardinal temperatures of the leaf (Yin et al.
 * 1995 Beta function is 0 there), in full light. */
static void test_growth_zero_at_cardinals(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    double t_c[] = {-5.0, 0.0, 38.0, 45.0};
    for (size_t i = 0; i < sizeof t_c / sizeof t_c[0]; i++)
        assert_close(one_hour_gross(&s, 2300.0, 600.0, t_c[i], 1.0, 1.0), 0.0, 0.0);
    assert_true(one_hour_gross(&s, 2300.0, 600.0, 0.5, 1.0, 1.0) > 0.0);
    assert_true(one_hour_gross(&s, 2300.0, 600.0, 37.5, 1.0, 1.0) > 0.0);
}

/* Growth rises with light (the RUE model has no saturation: Monteith 1977,
 * growth proportional to intercepted light). */
static void test_monotone_in_light(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    double prev = one_hour_gross(&s, 2300.0, 0.0, 20.0, 1.0, 1.0);
    for (double sw = 25.0; sw <= 1200.0; sw += 25.0) {
        double g = one_hour_gross(&s, 2300.0, sw, 20.0, 1.0, 1.0);
        assert_true(g > prev);
        prev = g;
    }
}

/* Growth is exactly proportional to Ks (FAO-56 eq. 84's Ks multiplies
 * growth; growth.h), including 0. */
static void test_proportional_to_ks(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    double full = one_hour_gross(&s, 2300.0, 500.0, 18.0, 1.2, 1.0);
    assert_true(full > 0.0);
    double ks[] = {0.0, 0.1, 0.25, 0.5, 0.9};
    for (size_t i = 0; i < sizeof ks / sizeof ks[0]; i++)
        assert_close(one_hour_gross(&s, 2300.0, 500.0, 18.0, 1.2, ks[i]),
                     ks[i] * full, 1e-12 * full);
}

/* One lit hour equals the formulas of growth.h written out here: gross =
 * RUE x PAR (0.5 x sw x 3600 / 1e6) x (1 - exp(-k LAI)) x f(T) x f(D) x Ks
 * x 10, senescence = senescence_per_day / 24 x green at the start of the
 * hour, and green changes by their difference. */
static void test_hour_formula(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    double sw = 450.0, t = 18.0, d = 1.2, ks = 0.8, cover = 2300.0;
    double lai = 0.0015 * (cover - 300.0);
    double par = IRR_PAR_FRACTION * sw * 3600.0 / 1e6;
    double a = 24.0 / 14.0;
    double ft = pow(t / 24.0, a) * (38.0 - t) / 14.0;
    double want = 1.9 * par * (1.0 - exp(-0.5 * lai)) * ft * exp(-0.05 * 10.0 * d) * ks * 10.0;
    assert_close(one_hour_gross(&s, cover, sw, t, d, ks), want, 1e-12 * want);
    gr_state st;
    gr_flux f;
    assert_int_equal(gr_state_init(&s, cover, &st), 0);
    assert_int_equal(gr_hour(&s, &st, sw, t, d, ks, 15.0, &f), 0);
    assert_close(f.senescence_kgdm_ha, 0.02 / 24.0 * (cover - 300.0), 1e-12);
    assert_close(st.green_kgdm_ha, cover - 300.0 + want - f.senescence_kgdm_ha, 1e-9);
}

/* Magnitude (common practice, no source): a cool-season sward intercepting
 * all the light at its optimum temperature, no water or VPD limit, with
 * PAR 10 MJ m-2 d-1 and RUE 1.9 g/MJ grows RUE x PAR x 10 = 190 kg DM/ha
 * gross in a day.  The set's t_opt_c is 24 C; the check is run at 20 C
 * with t_opt_c set to 20 (inside the set's own range 18-30), and at 20 C
 * with the set as it is, where f(20) = (20/24)^(24/14) x 18/14 = 0.9406
 * (by hand) scales the day to 178.7. */
static void test_magnitude(void **state)
{
    (void)state;
    sward_params s;
    rg_err e = {{0}};
    assert_int_equal(sward_load("models", "cool-season-grass", &s, &e), 0);
    double par_day_mj_m2 = 10.0;
    double want = s.rue_g_per_mj_par * par_day_mj_m2 * 10.0; /* g m-2 -> kg ha-1 */
    assert_close(want, 190.0, 1e-9);
    /* 12 lit hours of constant shortwave carrying 10 MJ m-2 of PAR */
    double sw = par_day_mj_m2 * 1e6 / (IRR_PAR_FRACTION * 12.0 * 3600.0);
    for (int run = 0; run < 2; run++) {
        sward_params r = s;
        if (run == 0)
            r.t_opt_c = 20.0;
        gr_state st;
        gr_flux f;
        assert_int_equal(gr_state_init(&r, 40000.0, &st), 0); /* LAI 60: all light */
        double gross = 0.0, fint = 0.0;
        for (int h = 0; h < 24; h++) {
            int lit = h >= 6 && h < 18;
            assert_int_equal(gr_hour(&r, &st, lit ? sw : 0.0, 20.0, 0.0, 1.0, 20.0, &f), 0);
            gross += f.gross_kgdm_ha;
            fint = f.intercepted_frac;
        }
        assert_true(fint > 1.0 - 1e-9);
        double ft = gr_temp_beta(20.0, r.t_min_c, r.t_opt_c, r.t_max_c);
        assert_close(gross, want * ft, 1e-6);
        assert_close(gross, run == 0 ? 190.0 : 178.7, run == 0 ? 1e-6 : 0.05);
    }
}

/* INVENTED weather for one strip, hour h of a year: a seasonal and daily
 * cycle with a pseudo-random cloudiness (fixed LCG), cold enough in winter
 * to trigger dormancy; leaf values NaN at night like micro.c. */
typedef struct {
    double sw_w_m2, t_leaf_c, vpd_kpa, ks, t_air_c;
} inv_hour;

static unsigned lcg_next(unsigned *x)
{
    *x = *x * 1664525u + 1013904223u; /* Numerical Recipes LCG constants, from memory */
    return *x >> 8;
}

static inv_hour invented_hour(int h, unsigned *seed)
{
    const double pi = 3.14159265358979323846;
    inv_hour w;
    int day = h / 24, hod = h % 24;
    double season = -cos(2.0 * pi * (day + 10) / 365.0); /* -1 winter, +1 summer */
    double cloud = (double)(lcg_next(seed) % 1000u) / 1000.0;
    double sun = sin(pi * (hod - 6) / 12.0);
    w.t_air_c = 9.0 + 11.0 * season + 4.0 * sin(pi * (hod - 9) / 12.0);
    w.ks = 0.3 + 0.7 * (double)(lcg_next(seed) % 1000u) / 999.0;
    if (hod >= 6 && hod < 18 && sun > 0.0) {
        w.sw_w_m2 = (650.0 + 250.0 * season) * sun * (1.0 - 0.7 * cloud);
        w.t_leaf_c = w.t_air_c + 2.0 * sun;
        w.vpd_kpa = 0.4 + 1.6 * sun * (1.0 - cloud);
    } else {
        w.sw_w_m2 = 0.0;
        w.t_leaf_c = w.vpd_kpa = (double)NAN;
    }
    return w;
}

typedef struct {
    gr_state st;
    double gross, sen, cut;
    int dormant_hours, floor_ok;
} run_out;

/* A year on the invented weather, grazed to 1,500 kg DM/ha every 21 days. */
static run_out run_year(const sward_params *s)
{
    run_out r;
    memset(&r, 0, sizeof r);
    r.floor_ok = 1;
    unsigned seed = 12345u;
    assert_int_equal(gr_state_init(s, 2000.0, &r.st), 0);
    for (int h = 0; h < 365 * 24; h++) {
        inv_hour w = invented_hour(h, &seed);
        gr_flux f;
        assert_int_equal(gr_hour(s, &r.st, w.sw_w_m2, w.t_leaf_c, w.vpd_kpa, w.ks,
                                 w.t_air_c, &f), 0);
        r.gross += f.gross_kgdm_ha;
        r.sen += f.senescence_kgdm_ha;
        r.dormant_hours += f.dormant;
        if (h % (21 * 24) == 21 * 24 - 1)
            r.cut += gr_cut(&r.st, 1500.0);
        if (r.st.green_kgdm_ha < GR_GREEN_FLOOR_KGDM_HA)
            r.floor_ok = 0;
    }
    return r;
}

/* Mass balance of the state (conservation; growth.h): over an INVENTED year
 * cover_end - cover_start = sum growth - sum senescence - sum cut, to 1e-9,
 * the senesced counter equals the summed senescence, and green never falls
 * below the floor.  The invented year is checked to include both dormant
 * and growing hours, so every branch is in the balance. */
static void test_mass_balance(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    run_out r = run_year(&s);
    double start = 2000.0;
    assert_close(gr_cover_kgdm_ha(&r.st) - start, r.gross - r.sen - r.cut, 1e-9);
    assert_close(r.st.senesced_kgdm_ha, r.sen, 1e-9);
    assert_true(r.floor_ok);
    assert_true(r.dormant_hours > 0 && r.dormant_hours < 365 * 24);
    assert_true(r.gross > 0.0 && r.cut > 0.0);
}

/* Determinism (DEVELOPERS.md: same input, same output, byte for byte): the
 * invented year twice gives bit-identical state and sums. */
static void test_determinism(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    run_out a = run_year(&s), b = run_year(&s);
    assert_memory_equal(&a.st, &b.st, sizeof a.st);
    assert_memory_equal(&a.gross, &b.gross, sizeof a.gross);
    assert_memory_equal(&a.sen, &b.sen, sizeof a.sen);
    assert_memory_equal(&a.cut, &b.cut, sizeof a.cut);
}

/* The running mean is the plain mean of the last 168 hourly air
 * temperatures (the rule's definition, growth.h), fewer at the start. */
static void test_running_mean(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    gr_state st;
    gr_flux f;
    double t[500];
    assert_int_equal(gr_state_init(&s, 2000.0, &st), 0);
    assert_true(isnan(gr_t_air_7d_c(&st)));
    for (int h = 0; h < 500; h++) {
        t[h] = 5.0 + 7.0 * sin(0.37 * h) + 0.01 * h;
        assert_int_equal(gr_hour(&s, &st, 0.0, (double)NAN, (double)NAN, 1.0, t[h], &f), 0);
        int n = h + 1 < GR_T_AIR_HOURS ? h + 1 : GR_T_AIR_HOURS;
        double sum = 0.0;
        for (int i = h + 1 - n; i <= h; i++)
            sum += t[i];
        assert_close(f.t_air_7d_c, sum / n, 1e-9);
    }
}

/* Dormancy rule (common practice, no source; growth.h): with the 7-day
 * mean air temperature below t_min + 2 C no growth even in warm sunlit
 * leaves, and senescence at half rate; at exactly t_min + 2 C growth. */
static void test_dormancy(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    gr_state st;
    gr_flux f;
    assert_int_equal(gr_state_init(&s, 2300.0, &st), 0);
    for (int h = 0; h < GR_T_AIR_HOURS; h++)
        assert_int_equal(gr_hour(&s, &st, 0.0, (double)NAN, (double)NAN, 1.0, 1.5, &f), 0);
    assert_int_equal(gr_dormant(&s, &st), 1);
    double green0 = st.green_kgdm_ha;
    assert_int_equal(gr_hour(&s, &st, 600.0, 20.0, 1.0, 1.0, 1.5, &f), 0);
    assert_int_equal(f.dormant, 1);
    assert_close(f.gross_kgdm_ha, 0.0, 0.0);
    assert_close(f.senescence_kgdm_ha, 0.5 * 0.02 / 24.0 * green0, 1e-12);
    for (int h = 0; h < GR_T_AIR_HOURS; h++)
        assert_int_equal(gr_hour(&s, &st, 0.0, (double)NAN, (double)NAN, 1.0, 2.0, &f), 0);
    assert_close(gr_t_air_7d_c(&st), 2.0, 1e-12);
    assert_int_equal(gr_dormant(&s, &st), 0);
    assert_int_equal(gr_hour(&s, &st, 600.0, 20.0, 1.0, 1.0, 2.0, &f), 0);
    assert_int_equal(f.dormant, 0);
    assert_true(f.gross_kgdm_ha > 0.0);
}

/* Floor (growth.h, from memory: regrowth from tillers): a long dark spell
 * senesces green down to GR_GREEN_FLOOR_KGDM_HA exactly, no lower, and the
 * sward regrows from there in light. */
static void test_floor_and_regrowth(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    gr_state st;
    gr_flux f;
    assert_int_equal(gr_state_init(&s, 2300.0, &st), 0);
    for (int h = 0; h < 24 * 400; h++)
        assert_int_equal(gr_hour(&s, &st, 0.0, (double)NAN, (double)NAN, 1.0, 15.0, &f), 0);
    assert_close(st.green_kgdm_ha, GR_GREEN_FLOOR_KGDM_HA, 0.0);
    assert_close(f.senescence_kgdm_ha, 0.0, 0.0);
    assert_int_equal(gr_hour(&s, &st, 600.0, 20.0, 1.0, 1.0, 15.0, &f), 0);
    assert_true(f.gross_kgdm_ha > 0.0);
    assert_true(st.green_kgdm_ha > GR_GREEN_FLOOR_KGDM_HA);
}

/* Initial state and cutting (growth.h contract): cover = base + green;
 * cut returns what it removes, stops at base + floor, removes nothing from
 * a sward already at or below the residual, and refuses NaN. */
static void test_init_and_cut(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    gr_state st;
    assert_int_equal(gr_state_init(&s, 2300.0, &st), 0);
    assert_close(st.green_kgdm_ha, 2000.0, 0.0);
    assert_close(gr_cover_kgdm_ha(&st), 2300.0, 0.0);
    assert_close(gr_cut(&st, 1500.0), 800.0, 1e-12);
    assert_close(gr_cover_kgdm_ha(&st), 1500.0, 1e-12);
    assert_close(gr_cut(&st, 1800.0), 0.0, 0.0);
    assert_close(gr_cut(&st, 350.0), 1100.0, 1e-12); /* to base 300 + floor 100 */
    assert_close(gr_cover_kgdm_ha(&st), 400.0, 1e-12);
    assert_close(gr_cut(&st, 0.0), 0.0, 0.0);         /* already at base + floor */
    assert_true(isnan(gr_cut(&st, (double)NAN)));
    assert_true(isnan(gr_cut(NULL, 100.0)));
    assert_close(gr_cover_kgdm_ha(&st), 400.0, 0.0);
    /* below base + floor: raised to it */
    assert_int_equal(gr_state_init(&s, 50.0, &st), 0);
    assert_close(gr_cover_kgdm_ha(&st), 400.0, 0.0);
    assert_int_equal(gr_state_init(&s, -1.0, &st), -1);
    assert_int_equal(gr_state_init(&s, (double)NAN, &st), -1);
    assert_int_equal(gr_state_init(NULL, 100.0, &st), -1);
}

/* Bad input to gr_hour (growth.h contract): -1, state untouched, NaN out. */
static void test_hour_bad_input(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    gr_state st, copy;
    gr_flux f;
    assert_int_equal(gr_state_init(&s, 2300.0, &st), 0);
    warm_up(&s, &st);
    copy = st;
    assert_int_equal(gr_hour(&s, &st, (double)NAN, 20.0, 1.0, 1.0, 15.0, &f), -1);
    assert_true(isnan(f.gross_kgdm_ha));
    assert_int_equal(gr_hour(&s, &st, 500.0, (double)NAN, 1.0, 1.0, 15.0, &f), -1);
    assert_int_equal(gr_hour(&s, &st, 500.0, 20.0, (double)NAN, 1.0, 15.0, &f), -1);
    assert_int_equal(gr_hour(&s, &st, 500.0, 20.0, 1.0, 1.5, 15.0, &f), -1);
    assert_int_equal(gr_hour(&s, &st, 500.0, 20.0, 1.0, -0.1, 15.0, &f), -1);
    assert_int_equal(gr_hour(&s, &st, 500.0, 20.0, 1.0, 1.0, (double)NAN, &f), -1);
    assert_int_equal(gr_hour(NULL, &st, 500.0, 20.0, 1.0, 1.0, 15.0, &f), -1);
    assert_int_equal(gr_hour(&s, &st, 500.0, 20.0, 1.0, 1.0, 15.0, NULL), -1);
    sward_params bad = s;
    bad.t_opt_c = bad.t_max_c;
    assert_int_equal(gr_hour(&bad, &st, 500.0, 20.0, 1.0, 1.0, 15.0, &f), -1);
    assert_memory_equal(&st, &copy, sizeof st);
    assert_int_equal(gr_hour(NULL, NULL, 0.0, 0.0, 0.0, 0.0, 0.0, &f), -1);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_temp_beta_values),
        cmocka_unit_test(test_temp_beta_peak),
        cmocka_unit_test(test_temp_beta_limits_and_bad),
        cmocka_unit_test(test_vpd_mod),
        cmocka_unit_test(test_intercepted),
        cmocka_unit_test(test_dark),
        cmocka_unit_test(test_growth_zero_at_cardinals),
        cmocka_unit_test(test_monotone_in_light),
        cmocka_unit_test(test_proportional_to_ks),
        cmocka_unit_test(test_hour_formula),
        cmocka_unit_test(test_magnitude),
        cmocka_unit_test(test_mass_balance),
        cmocka_unit_test(test_determinism),
        cmocka_unit_test(test_running_mean),
        cmocka_unit_test(test_dormancy),
        cmocka_unit_test(test_floor_and_regrowth),
        cmocka_unit_test(test_init_and_cut),
        cmocka_unit_test(test_hour_bad_input),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
