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
 *   - the non-rectangular hyperbola and the sunlit/shaded split: values by
 *     hand and the published constants named beside each check;
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

/* INVENTED light for the property checks: a fifth of the shortwave is sky
 * light, the sun at 50 degrees. */
#define SKY_SHARE 0.2
#define SUN_ELEV_DEG 50.0
#define LT(sw) (&(gr_light){(sw), SKY_SHARE * (sw), SUN_ELEV_DEG, NULL, 0.0})

/* An INVENTED sward for property checks: cardinal temperatures, leaf
 * photosynthesis, k and
 * rates like models/swards/cool-season-grass.json, but a non-zero base
 * cover so the base/green split is exercised. */
static sward_params invented_sward(void)
{
    sward_params s;
    memset(&s, 0, sizeof s);
    strcpy(s.name, "invented");
    s.leaf_quantum_yield_mol_per_mol = 0.05;
    s.leaf_pmax_umol_m2_s = 25.0;
    s.leaf_curvature = 0.7;
    s.dm_per_co2_g_per_mol = 13.0;
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
        assert_int_equal(gr_hour(s, st, LT(0.0), (double)NAN, (double)NAN, 1.0, 15.0, &f), 0);
}

/* Gross growth of one lit hour from a fresh strip at cover_kgdm_ha. */
static double one_hour_gross(const sward_params *s, double cover_kgdm_ha,
                             double sw_w_m2, double t_leaf_c, double vpd_kpa,
                             double ks)
{
    gr_state st;
    gr_flux f;
    assert_int_equal(gr_state_init(s, cover_kgdm_ha, &st), 0);
    assert_int_equal(gr_hour(s, &st, LT(sw_w_m2), t_leaf_c, vpd_kpa, ks, 15.0, &f), 0);
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

/* Radiation factor of stomatal conductance, Noilhan & Planton (1989),
 * f = 0.55 (Rg/R_GL)(2/LAI), F1 = (f + rs_min/rs_max)/(1 + f), with the
 * Noah table's grassland values R_GL 100 W/m2, rs_min 40 s/m, rs_max
 * 5000 s/m (WRF run/VEGPARM.TBL).  By hand: Rg 100, LAI 2: f = 0.55,
 * F1 = 0.558 / 1.55 = 0.36; Rg 1000: f = 5.5, F1 = 5.508 / 6.5 =
 * 0.847385; dark: 40/5000 = 0.008.  More light opens, more leaves share
 * it (each gets less), no leaves give 1; bad input refused. */
static void test_stomata_light_f1(void **state)
{
    (void)state;
    assert_close(gr_stomata_light_f1(100.0, 2.0, 100.0, 40.0), 0.36, 1e-12);
    assert_close(gr_stomata_light_f1(1000.0, 2.0, 100.0, 40.0), 5.508 / 6.5, 1e-12);
    assert_close(gr_stomata_light_f1(0.0, 2.0, 100.0, 40.0), 0.008, 1e-15);
    assert_close(gr_stomata_light_f1(300.0, 0.0, 100.0, 40.0), 1.0, 0.0);
    double prev = 0.0;
    for (double rg = 0.0; rg <= 1200.0; rg += 50.0) {
        double f1 = gr_stomata_light_f1(rg, 2.0, 100.0, 40.0);
        assert_true(f1 > prev && f1 < 1.0);
        prev = f1;
    }
    assert_true(gr_stomata_light_f1(200.0, 4.0, 100.0, 40.0) <
                gr_stomata_light_f1(200.0, 1.0, 100.0, 40.0));
    assert_true(isnan(gr_stomata_light_f1(-1.0, 2.0, 100.0, 40.0)));
    assert_true(isnan(gr_stomata_light_f1((double)NAN, 2.0, 100.0, 40.0)));
    assert_true(isnan(gr_stomata_light_f1(100.0, -0.1, 100.0, 40.0)));
    assert_true(isnan(gr_stomata_light_f1(100.0, 2.0, 0.0, 40.0)));
    assert_true(isnan(gr_stomata_light_f1(100.0, 2.0, 100.0, 0.0)));
    assert_true(isnan(gr_stomata_light_f1(100.0, 2.0, 100.0, GR_RS_MAX_S_M)));
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

/* Non-rectangular hyperbola (Thornley & Johnson 1990): values by hand at
 * alpha 0.05, Pmax 25 umol m-2 s-1, I 1000 umol m-2 s-1:
 *   theta 0.7: b = 75, c = 1250, P = (75 - sqrt(5625 - 3500)) / 1.4
 *              = (75 - 46.0977) / 1.4 = 20.6445;
 *   theta 0:   the rectangular hyperbola alpha I Pmax / (alpha I + Pmax)
 *              = 1250 / 75 = 16.6667;
 *   theta 1:   Blackman's min(alpha I, Pmax) = 25, and 10 at I = 200.
 * It never exceeds Pmax or alpha I, and its initial slope is alpha. */
static void test_leaf_nrh(void **state)
{
    (void)state;
    assert_close(gr_leaf_nrh(1000.0, 0.05, 25.0, 0.7), 20.6445, R4); /* by hand */
    assert_close(gr_leaf_nrh(1000.0, 0.05, 25.0, 0.0), 16.6667, R4); /* by hand */
    assert_close(gr_leaf_nrh(1000.0, 0.05, 25.0, 1.0), 25.0, 1e-9);   /* min(50, 25) */
    assert_close(gr_leaf_nrh(200.0, 0.05, 25.0, 1.0), 10.0, 1e-9);    /* min(10, 25) */
    assert_close(gr_leaf_nrh(0.0, 0.05, 25.0, 0.7), 0.0, 0.0);
    assert_close(gr_leaf_nrh(500.0, 0.05, 0.0, 0.7), 0.0, 0.0);
    assert_close(gr_leaf_nrh(1e-3, 0.05, 25.0, 0.7) / 1e-3, 0.05, 1e-6); /* slope alpha */
    for (double i = 0.0; i <= 3000.0; i += 50.0) {
        double p = gr_leaf_nrh(i, 0.05, 25.0, 0.7);
        assert_true(p <= 25.0 && p <= 0.05 * i + 1e-12);
    }
    assert_true(isnan(gr_leaf_nrh(-1.0, 0.05, 25.0, 0.7)));
    assert_true(isnan(gr_leaf_nrh(100.0, 0.05, 25.0, 1.2)));
    assert_true(isnan(gr_leaf_nrh(100.0, (double)NAN, 25.0, 0.7)));
}

/* Light absorbed by sunlit and shaded leaves layer by layer (de Pury &
 * Farquhar 1997, the per-leaf-area forms that the paper integrates):
 *   shaded leaf at depth l: (1 - rho_cd) Id kd' e^(-kd' l)
 *                           + Ib [(1 - rho_cb) kb' e^(-kb' l) - (1 - sigma) kb e^(-kb l)]
 *   sunlit leaf: the same + (1 - sigma) kb Ib, sunlit share e^(-kb l);
 * summed over 20,000 layers, for comparison with the closed forms. */
static void layered(double ib, double id, double lai, double elev_deg, double *sun,
                    double *total)
{
    const double pi = 3.14159265358979323846;
    double kb = 0.5 / sin(elev_deg * pi / 180.0), kbs = kb * sqrt(0.85), kds = 0.78;
    double sq = sqrt(0.85), rho_h = (1.0 - sq) / (1.0 + sq);
    double rho_cb = 1.0 - exp(-2.0 * rho_h * kb / (1.0 + kb));
    int n = 20000;
    double dl = lai / n;
    *sun = *total = 0.0;
    for (int k = 0; k < n; k++) {
        double l = (k + 0.5) * dl;
        double shade = (1.0 - 0.036) * id * kds * exp(-kds * l) +
                       ib * ((1.0 - rho_cb) * kbs * exp(-kbs * l) - 0.85 * kb * exp(-kb * l));
        double lit = shade + 0.85 * kb * ib, fsun = exp(-kb * l);
        *sun += lit * fsun * dl;
        *total += (lit * fsun + shade * (1.0 - fsun)) * dl;
    }
}

/* de Pury & Farquhar (1997) sunlit/shaded split:
 *   - kb' = kb sqrt(1 - sigma) is the paper's 0.46 / sin(beta) (Table 2,
 *     from memory; to its 2 decimals) at 30 degrees: 0.92;
 *   - rho_cb at the zenith by hand: rho_h = (1 - sqrt 0.85)/(1 + sqrt 0.85)
 *     = 0.040607, rho_cb = 1 - exp(-2 x 0.040607 x 0.5 / 1.5) = 0.026708;
 *   - a dense canopy absorbs (1 - rho_cb) Ib + (1 - rho_cd) Id and has
 *     1 / kb of sunlit leaf area (the closed forms' limits);
 *   - the closed forms equal the layer-by-layer sums above (to 1e-6);
 *   - nothing is absorbed without leaves; below 3 degrees beam counts as
 *     sky light (growth.h). */
static void test_sunlit_shaded(void **state)
{
    (void)state;
    gr_sunshade ss;
    assert_int_equal(gr_sunlit_shaded(1000.0, 200.0, 3.0, 30.0, 0.5, &ss), 0);
    assert_close(ss.kb, 1.0, 1e-12);
    assert_close(ss.kb_scat, 0.46 / 0.5, 0.005); /* 0.46 / sin(beta), Table 2 */
    assert_int_equal(gr_sunlit_shaded(1000.0, 0.0, 3.0, 90.0, 0.5, &ss), 0);
    assert_close(ss.rho_cb, 0.026708, 5e-7); /* by hand */
    assert_int_equal(gr_sunlit_shaded(1000.0, 300.0, 40.0, 90.0, 0.5, &ss), 0);
    assert_close(ss.abs_total, (1.0 - 0.026708) * 1000.0 + (1.0 - 0.036) * 300.0, 0.001);
    assert_close(ss.lai_sun, 2.0, 1e-8); /* (1 - e^-20) / 0.5 */
    double elev[] = {15.0, 40.0, 75.0}, lai[] = {0.3, 1.5, 4.0};
    for (int i = 0; i < 3; i++)
        for (int j = 0; j < 3; j++) {
            double sun, total;
            layered(800.0, 150.0, lai[j], elev[i], &sun, &total);
            assert_int_equal(gr_sunlit_shaded(800.0, 150.0, lai[j], elev[i], 0.5, &ss), 0);
            assert_close(ss.abs_sun, sun, 1e-6 * total);
            assert_close(ss.abs_total, total, 1e-6 * total);
            assert_close(ss.abs_sun + ss.abs_shade, ss.abs_total, 1e-12 * total);
            assert_true(ss.abs_shade >= 0.0 && ss.lai_shade >= 0.0);
        }
    assert_int_equal(gr_sunlit_shaded(800.0, 150.0, 0.0, 40.0, 0.5, &ss), 0);
    assert_close(ss.abs_total, 0.0, 0.0);
    gr_sunshade low;
    assert_int_equal(gr_sunlit_shaded(100.0, 50.0, 2.0, 1.0, 0.5, &ss), 0);
    assert_int_equal(gr_sunlit_shaded(0.0, 150.0, 2.0, 1.0, 0.5, &low), 0);
    assert_close(ss.abs_sun, low.abs_sun, 1e-12);
    assert_close(ss.abs_total, low.abs_total, 1e-12);
    gr_optics o;
    gr_sunshade via;
    assert_int_equal(gr_dpf_optics(40.0, 0.5, &o), 0); /* the shortcut: same numbers */
    assert_int_equal(gr_sunlit_shaded_optics(800.0, 150.0, 2.0, &o, &via), 0);
    assert_int_equal(gr_sunlit_shaded(800.0, 150.0, 2.0, 40.0, 0.5, &ss), 0);
    assert_memory_equal(&via, &ss, sizeof ss);
    assert_int_equal(gr_sunlit_shaded_optics(800.0, 150.0, 2.0, NULL, &via), -1);
    assert_int_equal(gr_sunlit_shaded(-1.0, 150.0, 2.0, 40.0, 0.5, &ss), -1);
    assert_true(isnan(ss.abs_total));
    assert_int_equal(gr_sunlit_shaded(100.0, 150.0, 2.0, (double)NAN, 0.5, &ss), -1);
    assert_int_equal(gr_sunlit_shaded(100.0, 150.0, 2.0, 40.0, 0.0, &ss), -1);
}

/* The same light gives more growth as sky light than as beam light at
 * equal total (the shaded leaves work in their efficient, unsaturated
 * range; de Pury & Farquhar 1997), with INVENTED light of 600 W m-2. */
static void test_diffuse_more_efficient(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    double g[2];
    for (int k = 0; k < 2; k++) {
        gr_state st;
        gr_flux f;
        gr_light l = {600.0, k ? 600.0 : 60.0, 50.0, NULL, 0.0};
        assert_int_equal(gr_state_init(&s, 2300.0, &st), 0);
        assert_int_equal(gr_hour(&s, &st, &l, 20.0, 0.5, 1.0, 15.0, &f), 0);
        g[k] = f.gross_kgdm_ha;
    }
    assert_true(g[1] > 1.1 * g[0]);
}

/* The caller's interception (gr_light.intercepted_frac, what pasture.c
 * makes first for the soil) is a shortcut only: the same hour, state and
 * flux to the bit as gr_hour making it itself (growth.h contract). */
static void test_intercepted_shortcut(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    gr_state a, b;
    gr_flux fa, fb;
    assert_int_equal(gr_state_init(&s, 2300.0, &a), 0);
    warm_up(&s, &a);
    b = a;
    gr_light la = {600.0, 150.0, 50.0, NULL, 0.0}, lb = la;
    lb.intercepted_frac = gr_intercepted(s.leaf_area_per_cover_m2_per_kgdm_ha * b.green_kgdm_ha,
                                         s.light_extinction_k);
    assert_int_equal(gr_hour(&s, &a, &la, 20.0, 0.5, 1.0, 15.0, &fa), 0);
    assert_int_equal(gr_hour(&s, &b, &lb, 20.0, 0.5, 1.0, 15.0, &fb), 0);
    /* field by field (the struct has padding) */
    double va[] = {fa.par_mj_m2, fa.par_sky_mj_m2, fa.canopy_umol_m2_s, fa.lai, fa.intercepted_frac,
                   fa.f_temp, fa.f_vpd, fa.ks, fa.t_air_7d_c, fa.gross_kgdm_ha,
                   fa.senescence_kgdm_ha};
    double vb[] = {fb.par_mj_m2, fb.par_sky_mj_m2, fb.canopy_umol_m2_s, fb.lai, fb.intercepted_frac,
                   fb.f_temp, fb.f_vpd, fb.ks, fb.t_air_7d_c, fb.gross_kgdm_ha,
                   fb.senescence_kgdm_ha};
    assert_memory_equal(va, vb, sizeof va);
    assert_int_equal(fa.dormant, fb.dormant);
    assert_memory_equal(&a, &b, sizeof a);
    assert_true(fa.intercepted_frac > 0.0 && fa.gross_kgdm_ha > 0.0);
}

/* No light, no growth (photosynthesis needs absorbed light, Thornley &
 * Johnson 1990); micro.c's NaN leaf values at night are accepted, and
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
    assert_int_equal(gr_hour(&s, &st, LT(0.0), (double)NAN, (double)NAN, 1.0, 15.0, &f), 0);
    assert_close(f.gross_kgdm_ha, 0.0, 0.0);
    assert_close(f.par_mj_m2, 0.0, 0.0);
    assert_close(f.senescence_kgdm_ha, 0.02 / 24.0 * green0, 1e-12);
    assert_int_equal(gr_hour(&s, &st, LT(-3.0), 20.0, 1.0, 1.0, 15.0, &f), 0);
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

/* Growth rises with light (the non-rectangular hyperbola of Thornley &
 * Johnson 1990 rises monotonically towards its plateau). */
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

/* One lit hour equals the chain of growth.h written out here: PAR photon
 * flux 0.5 x sw x 4.57 split into beam and sky, absorbed by sunlit and
 * shaded leaves (gr_sunlit_shaded), their photosynthesis
 * (gr_canopy_gross_umol) x 3600 s x 1e-6 mol/umol x Y x f(T) x f(D) x Ks
 * x 10; senescence = senescence_per_day / 24 x green at the start of the
 * hour, and green changes by their difference. */
static void test_hour_formula(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    double sw = 450.0, t = 18.0, d = 1.2, ks = 0.8, cover = 2300.0;
    double lai = 0.0015 * (cover - 300.0);
    double par = IRR_PAR_FRACTION * sw * IRR_PAR_UMOL_PER_J;
    gr_sunshade ss;
    assert_int_equal(gr_sunlit_shaded((1.0 - SKY_SHARE) * par, SKY_SHARE * par, lai,
                                      SUN_ELEV_DEG, 0.5, &ss), 0);
    double p_umol = gr_canopy_gross_umol(&ss, 0.05, 25.0, 0.7);
    double a = 24.0 / 14.0;
    double ft = pow(t / 24.0, a) * (38.0 - t) / 14.0;
    double want = 13.0 * p_umol * 3600.0 * 1e-6 * ft * exp(-0.05 * 10.0 * d) * ks * 10.0;
    assert_close(one_hour_gross(&s, cover, sw, t, d, ks), want, 1e-12 * want);
    gr_state st;
    gr_flux f;
    assert_int_equal(gr_state_init(&s, cover, &st), 0);
    assert_int_equal(gr_hour(&s, &st, LT(sw), t, d, ks, 15.0, &f), 0);
    assert_close(f.canopy_umol_m2_s, p_umol, 1e-12 * p_umol);
    assert_close(f.senescence_kgdm_ha, 0.02 / 24.0 * (cover - 300.0), 1e-12);
    assert_close(st.green_kgdm_ha, cover - 300.0 + want - f.senescence_kgdm_ha, 1e-9);
}

/* Radiation use efficiency that the canopy model implies, against the
 * published field range: Druille, Oyarzabal & Oesterheld (2019, Agron. J.
 * 111:1770-1778) give 1.93 +/- 1.2 g DM per MJ intercepted PAR for
 * grasslands (496 values).  An INVENTED clear day (sun up 12 h, peak
 * elevation 70 degrees, 1000 sin(elevation) W m-2, 15 % sky light) on the
 * cool-season set at its optimum leaf temperature, no VPD or water limit,
 * at green covers of 1,000-3,000 kg DM/ha: growth / intercepted PAR must
 * lie within the published mean +/- 1 SD (0.73-3.13).  The same day under
 * an overcast sky (350 sin(elevation) W m-2, all sky light) must give a
 * higher RUE: RUE rises with the diffuse share (Sinclair, Shiraiwa &
 * Hammer 1992, Crop Sci. 32:1281-1284, from memory), which the
 * sunlit/shaded split produces. */
static void test_rue_in_published_range(void **state)
{
    (void)state;
    const double pi = 3.14159265358979323846;
    sward_params s;
    rg_err e = {{0}};
    assert_int_equal(sward_load("models", "cool-season-grass", &s, &e), 0);
    double covers[] = {1000.0, 2000.0, 3000.0};
    for (size_t c = 0; c < sizeof covers / sizeof covers[0]; c++) {
        double rue[2];
        for (int clear = 0; clear < 2; clear++) {
            gr_state st;
            gr_flux f;
            assert_int_equal(gr_state_init(&s, covers[c], &st), 0);
            warm_up(&s, &st);
            double gross = 0.0, ipar_mj = 0.0;
            for (int h = 6; h < 18; h++) {
                double elev = 70.0 * sin(pi * (h + 0.5 - 6.0) / 12.0);
                double sw = (clear ? 1000.0 : 350.0) * sin(elev * pi / 180.0);
                gr_light l = {sw, clear ? 0.15 * sw : sw, elev, NULL, 0.0};
                st.green_kgdm_ha = covers[c]; /* the same canopy all day */
                assert_int_equal(gr_hour(&s, &st, &l, s.t_opt_c, 0.0, 1.0, 20.0, &f), 0);
                gross += f.gross_kgdm_ha;
                ipar_mj += f.par_mj_m2 * f.intercepted_frac;
            }
            rue[clear] = gross / 10.0 / ipar_mj; /* kg/ha -> g/m2 */
        }
        print_message("      cover %.0f: RUE clear %.2f, overcast %.2f g DM/MJ\n", covers[c],
                      rue[1], rue[0]);
        assert_true(rue[1] >= 0.73 && rue[1] <= 3.13);
        assert_true(rue[0] > rue[1]);
    }
}

/* Light saturation: an hour at half the light loses much less than half
 * its growth in strong light (the point of the non-rectangular hyperbola),
 * and in weak light growth is nearly proportional to light (initial slope
 * alpha).  INVENTED light; the property is Thornley & Johnson's (1990). */
static void test_saturation(void **state)
{
    (void)state;
    sward_params s = invented_sward();
    double full = one_hour_gross(&s, 2300.0, 900.0, 20.0, 0.5, 1.0);
    double half = one_hour_gross(&s, 2300.0, 450.0, 20.0, 0.5, 1.0);
    assert_true(half > 0.6 * full && half < full);
    double dim = one_hour_gross(&s, 2300.0, 20.0, 20.0, 0.5, 1.0);
    double dim2 = one_hour_gross(&s, 2300.0, 10.0, 20.0, 0.5, 1.0);
    assert_true(dim2 >= 0.5 * dim && dim2 < 0.51 * dim); /* concave, nearly linear */
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
        assert_int_equal(gr_hour(s, &r.st, LT(w.sw_w_m2), w.t_leaf_c, w.vpd_kpa, w.ks,
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
        assert_int_equal(gr_hour(&s, &st, LT(0.0), (double)NAN, (double)NAN, 1.0, t[h], &f), 0);
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
        assert_int_equal(gr_hour(&s, &st, LT(0.0), (double)NAN, (double)NAN, 1.0, 1.5, &f), 0);
    assert_int_equal(gr_dormant(&s, &st), 1);
    double green0 = st.green_kgdm_ha;
    assert_int_equal(gr_hour(&s, &st, LT(600.0), 20.0, 1.0, 1.0, 1.5, &f), 0);
    assert_int_equal(f.dormant, 1);
    assert_close(f.gross_kgdm_ha, 0.0, 0.0);
    assert_close(f.senescence_kgdm_ha, 0.5 * 0.02 / 24.0 * green0, 1e-12);
    for (int h = 0; h < GR_T_AIR_HOURS; h++)
        assert_int_equal(gr_hour(&s, &st, LT(0.0), (double)NAN, (double)NAN, 1.0, 2.0, &f), 0);
    assert_close(gr_t_air_7d_c(&st), 2.0, 1e-12);
    assert_int_equal(gr_dormant(&s, &st), 0);
    assert_int_equal(gr_hour(&s, &st, LT(600.0), 20.0, 1.0, 1.0, 2.0, &f), 0);
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
        assert_int_equal(gr_hour(&s, &st, LT(0.0), (double)NAN, (double)NAN, 1.0, 15.0, &f), 0);
    assert_close(st.green_kgdm_ha, GR_GREEN_FLOOR_KGDM_HA, 0.0);
    assert_close(f.senescence_kgdm_ha, 0.0, 0.0);
    assert_int_equal(gr_hour(&s, &st, LT(600.0), 20.0, 1.0, 1.0, 15.0, &f), 0);
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
    assert_int_equal(gr_hour(&s, &st, LT((double)NAN), 20.0, 1.0, 1.0, 15.0, &f), -1);
    assert_true(isnan(f.gross_kgdm_ha));
    assert_int_equal(gr_hour(&s, &st, LT(500.0), (double)NAN, 1.0, 1.0, 15.0, &f), -1);
    assert_int_equal(gr_hour(&s, &st, LT(500.0), 20.0, (double)NAN, 1.0, 15.0, &f), -1);
    assert_int_equal(gr_hour(&s, &st, LT(500.0), 20.0, 1.0, 1.5, 15.0, &f), -1);
    assert_int_equal(gr_hour(&s, &st, LT(500.0), 20.0, 1.0, -0.1, 15.0, &f), -1);
    assert_int_equal(gr_hour(&s, &st, LT(500.0), 20.0, 1.0, 1.0, (double)NAN, &f), -1);
    assert_int_equal(gr_hour(NULL, &st, LT(500.0), 20.0, 1.0, 1.0, 15.0, &f), -1);
    assert_int_equal(gr_hour(&s, &st, LT(500.0), 20.0, 1.0, 1.0, 15.0, NULL), -1);
    sward_params bad = s;
    bad.t_opt_c = bad.t_max_c;
    assert_int_equal(gr_hour(&bad, &st, LT(500.0), 20.0, 1.0, 1.0, 15.0, &f), -1);
    assert_memory_equal(&st, &copy, sizeof st);
    assert_int_equal(gr_hour(NULL, NULL, LT(0.0), 0.0, 0.0, 0.0, 0.0, &f), -1);
    assert_int_equal(gr_hour(&s, &st, NULL, 20.0, 1.0, 1.0, 15.0, &f), -1);
    gr_light no_sun = {500.0, 100.0, (double)NAN, NULL, 0.0};
    assert_int_equal(gr_hour(&s, &st, &no_sun, 20.0, 1.0, 1.0, 15.0, &f), -1);
    gr_optics other; /* optics made for another G than the sward's k */
    assert_int_equal(gr_dpf_optics(40.0, 0.7, &other), 0);
    gr_light wrong = {500.0, 100.0, 40.0, &other, 0.0};
    assert_int_equal(gr_hour(&s, &st, &wrong, 20.0, 1.0, 1.0, 15.0, &f), -1);
    assert_memory_equal(&st, &copy, sizeof st);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_temp_beta_values),
        cmocka_unit_test(test_temp_beta_peak),
        cmocka_unit_test(test_temp_beta_limits_and_bad),
        cmocka_unit_test(test_vpd_mod),
        cmocka_unit_test(test_stomata_light_f1),
        cmocka_unit_test(test_intercepted),
        cmocka_unit_test(test_leaf_nrh),
        cmocka_unit_test(test_sunlit_shaded),
        cmocka_unit_test(test_diffuse_more_efficient),
        cmocka_unit_test(test_intercepted_shortcut),
        cmocka_unit_test(test_dark),
        cmocka_unit_test(test_growth_zero_at_cardinals),
        cmocka_unit_test(test_monotone_in_light),
        cmocka_unit_test(test_proportional_to_ks),
        cmocka_unit_test(test_hour_formula),
        cmocka_unit_test(test_rue_in_published_range),
        cmocka_unit_test(test_saturation),
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
