/* test_leaf.c - checks leaf.c: the energy balance of Campbell & Norman
 * (1998) ch. 14 closes, eq. 14.6 is close to it, the conductances follow
 * ch. 7 and 12, and the solution behaves physically. GPL-3.0-or-later.
 *
 * Not checked, for want of a source: a worked example of C&N ch. 14 (the
 * book's example numbers could not be found in the searchable material,
 * and are not invented here), and the non-water-stressed baseline of
 * Jackson et al. (1981) Water Resour. Res. 17:1133-1138 (no numeric
 * baseline value could be sourced).
 */
#include <string.h>

#include "rgtest.h"

#include "leaf.h"
#include "psychro.h"

/* Constants restated here so the closure check does not lean on leaf.c:
 * Stefan-Boltzmann (CODATA 2018), cp of air (C&N 1998, from memory),
 * latent heat 2.45 MJ/kg (FAO-56) x 0.018015 kg/mol. */
#define SIGMA 5.670374419e-8
#define CP 29.3
#define LAMBDA (2.45e6 * 0.018015)
#define K0 273.15

/* A mid-morning sunlit pasture leaf (invented, plausible values). */
static leaf_in base(void)
{
    leaf_in in = {0};
    in.t_air_c = 25.0;
    in.ea_kpa = 1.5;
    in.pressure_kpa = 100.0;
    in.wind_m_s = 1.0;
    in.rabs_w_m2 = 600.0;
    in.g_s_mol_m2_s = 0.2;
    in.leaf_width_m = 0.05;
    in.emissivity = LEAF_EMISSIVITY;
    return in;
}

static double solve_t(const leaf_in *in)
{
    leaf_out o;
    assert_int_equal(leaf_solve(in, &o), LEAF_OK);
    return o.t_leaf_c;
}

/* C&N eq. 14.1 evaluated independently of leaf.c. Note it uses g_Ha for
 * sensible heat: the radiative exchange is already in eps sigma T^4, so
 * g_Hr here would count it twice. */
static double closure(const leaf_in *in, const leaf_out *o)
{
    double tl = o->t_leaf_c;
    double tk = tl + K0;
    return in->rabs_w_m2 - in->emissivity * SIGMA * tk * tk * tk * tk -
           CP * o->g_ha_mol_m2_s * (tl - in->t_air_c) -
           LAMBDA * o->g_v_mol_m2_s * (psy_e0_kpa(tl) - in->ea_kpa) /
               in->pressure_kpa;
}

/* Boundary-layer conductances match C&N 1998 ch. 7 worked by hand for a
 * 5 cm leaf at 1 m/s (d = 0.036 m, sqrt(u/d) = 5.27046):
 * g_Ha = 1.4 x 0.135 x 5.27046 = 0.99612, g_va = 1.4 x 0.147 x 5.27046 =
 * 1.08466 mol/m2/s; they scale as sqrt(u), and wind below the floor acts
 * as the floor. */
static void test_boundary_conductances(void **state)
{
    (void)state;
    assert_close(leaf_g_ha_mol_m2_s(1.0, 0.05), 0.99612, 1e-4);
    assert_close(leaf_g_va_mol_m2_s(1.0, 0.05), 1.08466, 1e-4);
    assert_close(leaf_g_ha_mol_m2_s(4.0, 0.05),
                 2.0 * leaf_g_ha_mol_m2_s(1.0, 0.05), 1e-12);
    assert_close(leaf_g_ha_mol_m2_s(0.0, 0.05),
                 leaf_g_ha_mol_m2_s(LEAF_WIND_MIN_M_S, 0.05), 0.0);
    assert_true(isnan(leaf_g_ha_mol_m2_s(-1.0, 0.05)));
    assert_true(isnan(leaf_g_va_mol_m2_s(1.0, 0.0)));
}

/* Radiative conductance 4 eps sigma T^3 / cp (C&N 1998 ch. 12) worked by
 * hand at 20 C, eps = 1: 4 x 5.670374e-8 x 293.15^3 / 29.3 = 0.195018
 * mol/m2/s; it is proportional to emissivity. */
static void test_radiative_conductance(void **state)
{
    (void)state;
    assert_close(leaf_g_r_mol_m2_s(20.0, 1.0), 0.195018, 1e-6);
    assert_close(leaf_g_r_mol_m2_s(20.0, 0.97),
                 0.97 * leaf_g_r_mol_m2_s(20.0, 1.0), 1e-15);
    assert_true(isnan(leaf_g_r_mol_m2_s(20.0, 1.5)));
}

/* Energy balance closure (C&N eq. 14.1): at the returned temperature,
 * absorbed minus emitted, sensible and latent is below 0.01 W/m2, for
 * dry/transpiring leaves, sun and night, cold and hot air, low and high
 * wind; the reported terms add up the same way. */
static void test_closure(void **state)
{
    (void)state;
    const double rabs[] = {250.0, 450.0, 700.0, 1000.0};
    const double gs[] = {0.0, 0.005, 0.2, 1.0};
    const double ta[] = {-10.0, 5.0, 25.0, 42.0};
    const double wind[] = {0.0, 0.5, 3.0};
    for (size_t i = 0; i < 4; i++)
        for (size_t j = 0; j < 4; j++)
            for (size_t k = 0; k < 4; k++)
                for (size_t m = 0; m < 3; m++) {
                    leaf_in in = base();
                    in.rabs_w_m2 = rabs[i];
                    in.g_s_mol_m2_s = gs[j];
                    in.t_air_c = ta[k];
                    in.ea_kpa = 0.5 * psy_e0_kpa(ta[k]);
                    in.wind_m_s = wind[m];
                    leaf_out o;
                    assert_int_equal(leaf_solve(&in, &o), LEAF_OK);
                    assert_close(closure(&in, &o), 0.0, 0.01);
                    assert_close(in.rabs_w_m2 - o.emitted_w_m2 -
                                     o.sensible_w_m2 - o.latent_w_m2,
                                 0.0, 0.01);
                    assert_close(leaf_residual_w_m2(&in, o.t_leaf_c), 0.0,
                                 0.01);
                    assert_close(o.vpd_leaf_kpa,
                                 psy_e0_kpa(o.t_leaf_c) - in.ea_kpa, 1e-12);
                    assert_true(o.iterations >= 1 && o.iterations <= 10);
                }
}

/* Eq. 14.6 is a linearisation of 14.1 about T_a (C&N 1998 ch. 14): close
 * to the full solution when the leaf is near air temperature (within 0.1 C
 * for this sunlit transpiring leaf 2 C above air), and - because the
 * tangents of the convex T^4 and es(T) lie below them - never below it. */
static void test_linear_estimate(void **state)
{
    (void)state;
    leaf_in in = base();
    leaf_out o;
    assert_int_equal(leaf_solve(&in, &o), LEAF_OK);
    assert_true(fabs(o.t_leaf_c - in.t_air_c) < 3.0);
    assert_close(o.t_leaf_linear_c, o.t_leaf_c, 0.1);
    for (double r = 200.0; r <= 1000.0; r += 100.0)
        for (double g = 0.0; g <= 0.4; g += 0.1) {
            in.rabs_w_m2 = r;
            in.g_s_mol_m2_s = g;
            assert_int_equal(leaf_solve(&in, &o), LEAF_OK);
            assert_true(o.t_leaf_linear_c >= o.t_leaf_c - 1e-9);
        }
}

/* Isothermal limit (C&N 1998 ch. 14): a dry leaf absorbing exactly the
 * longwave it would emit at air temperature sits at air temperature, with
 * no sensible or latent exchange. */
static void test_isothermal_dry_leaf(void **state)
{
    (void)state;
    leaf_in in = base();
    double tk = in.t_air_c + K0;
    in.g_s_mol_m2_s = 0.0;
    in.rabs_w_m2 = in.emissivity * SIGMA * tk * tk * tk * tk;
    leaf_out o;
    assert_int_equal(leaf_solve(&in, &o), LEAF_OK);
    assert_close(o.t_leaf_c, in.t_air_c, 1e-6);
    assert_close(o.t_leaf_linear_c, in.t_air_c, 1e-6);
    assert_close(o.sensible_w_m2, 0.0, 1e-4);
    assert_close(o.latent_w_m2, 0.0, 0.0);
}

/* Physics: more absorbed radiation makes a warmer leaf (dry and
 * transpiring). */
static void test_more_radiation_warmer(void **state)
{
    (void)state;
    for (double g = 0.0; g <= 0.4; g += 0.2) {
        leaf_in in = base();
        in.g_s_mol_m2_s = g;
        double prev = -1e9;
        for (double r = 100.0; r <= 1400.0; r += 100.0) {
            in.rabs_w_m2 = r;
            double t = solve_t(&in);
            assert_true(t > prev);
            prev = t;
        }
    }
}

/* Physics: more wind couples the leaf more tightly to the air, for a
 * leaf warmer than air (strong sun, dry) and one cooler (weak sun). */
static void test_more_wind_closer_to_air(void **state)
{
    (void)state;
    const double rabs[] = {900.0, 300.0};
    for (size_t i = 0; i < 2; i++) {
        leaf_in in = base();
        in.g_s_mol_m2_s = 0.0;
        in.rabs_w_m2 = rabs[i];
        double prev = 1e9;
        for (double u = 0.1; u <= 8.0; u *= 2.0) {
            in.wind_m_s = u;
            double d = fabs(solve_t(&in) - in.t_air_c);
            assert_true(d < prev);
            prev = d;
        }
    }
}

/* Physics: under the same radiation a transpiring leaf is cooler than a
 * dry one, and cooler the more open its stomata (latent heat loss). */
static void test_transpiration_cools(void **state)
{
    (void)state;
    leaf_in in = base();
    double prev = 1e9;
    for (double g = 0.0; g <= 1.0; g += 0.1) {
        in.g_s_mol_m2_s = g;
        double t = solve_t(&in);
        assert_true(t < prev);
        prev = t;
    }
}

/* Physics (C&N 1998 ch. 14 discuss sunlit non-transpiring leaves running
 * far above air; the 8 C threshold is from memory): a dry leaf in strong
 * sun (700 W/m2 absorbed) and light wind (0.2 m/s) runs well above air. */
static void test_dry_leaf_in_sun_is_hot(void **state)
{
    (void)state;
    leaf_in in = base();
    in.t_air_c = 30.0;
    in.ea_kpa = 1.5;
    in.rabs_w_m2 = 700.0;
    in.wind_m_s = 0.2;
    in.g_s_mol_m2_s = 0.0;
    assert_true(solve_t(&in) > in.t_air_c + 8.0);
}

/* At night the Jarvis conductance falls to g_min, so the leaf comes close
 * to the dry leaf's radiative balance: within 0.25 C of it, below air
 * temperature under a clear sky (80 W/m2 radiative deficit), with latent
 * heat loss under 5 % of that deficit. (Physics; thresholds common
 * practice, no source.) */
static void test_night_leaf_near_radiative_balance(void **state)
{
    (void)state;
    leaf_jarvis p = leaf_jarvis_grass();
    leaf_in in = base();
    double tk = in.t_air_c + K0;
    in.rabs_w_m2 = in.emissivity * SIGMA * tk * tk * tk * tk - 80.0;
    in.wind_m_s = 0.5;
    in.g_s_mol_m2_s =
        leaf_gs_jarvis(0.0, psy_e0_kpa(in.t_air_c) - in.ea_kpa, &p);
    leaf_out wet, dry;
    assert_int_equal(leaf_solve(&in, &wet), LEAF_OK);
    in.g_s_mol_m2_s = 0.0;
    assert_int_equal(leaf_solve(&in, &dry), LEAF_OK);
    assert_true(wet.t_leaf_c < in.t_air_c);
    assert_close(wet.t_leaf_c, dry.t_leaf_c, 0.25);
    assert_true(wet.latent_w_m2 < 0.05 * 80.0);
}

/* Jarvis (1976) form: dark gives g_min; half-saturating light at zero VPD
 * gives the midpoint of g_min and g_max; full light at zero VPD approaches
 * g_max; VPD at or past vpd_close shuts to g_min; conductance falls with
 * VPD and rises with light. */
static void test_jarvis_shape(void **state)
{
    (void)state;
    leaf_jarvis p = leaf_jarvis_grass();
    double mid = 0.5 * (p.g_min_mol_m2_s + p.g_max_mol_m2_s);
    assert_close(leaf_gs_jarvis(0.0, 1.0, &p), p.g_min_mol_m2_s, 1e-15);
    assert_close(leaf_gs_jarvis(p.par_half_umol, 0.0, &p), mid, 1e-15);
    assert_close(leaf_gs_jarvis(1e9, 0.0, &p), p.g_max_mol_m2_s, 1e-6);
    assert_close(leaf_gs_jarvis(2000.0, p.vpd_close_kpa, &p),
                 p.g_min_mol_m2_s, 1e-15);
    assert_close(leaf_gs_jarvis(2000.0, 2.0 * p.vpd_close_kpa, &p),
                 p.g_min_mol_m2_s, 1e-15);
    assert_close(leaf_gs_jarvis(500.0, -0.3, &p),
                 leaf_gs_jarvis(500.0, 0.0, &p), 0.0);
    double prev = 1e9;
    for (double d = 0.0; d < p.vpd_close_kpa; d += 0.5) {
        double g = leaf_gs_jarvis(1000.0, d, &p);
        assert_true(g < prev);
        prev = g;
    }
    prev = -1.0;
    for (double q = 0.0; q <= 2000.0; q += 250.0) {
        double g = leaf_gs_jarvis(q, 1.0, &p);
        assert_true(g > prev);
        prev = g;
    }
}

/* A shaded/dark strip transpires little: with Jarvis conductances, a leaf
 * in the dark transpires under a tenth of the same leaf in full light
 * (physics; threshold common practice, no source). */
static void test_dark_strip_low_transpiration(void **state)
{
    (void)state;
    leaf_jarvis p = leaf_jarvis_grass();
    leaf_in in = base();
    double vpd = psy_e0_kpa(in.t_air_c) - in.ea_kpa;
    leaf_out sun, dark;
    in.g_s_mol_m2_s = leaf_gs_jarvis(1800.0, vpd, &p);
    assert_int_equal(leaf_solve(&in, &sun), LEAF_OK);
    in.g_s_mol_m2_s = leaf_gs_jarvis(0.0, vpd, &p);
    in.rabs_w_m2 = 380.0;
    assert_int_equal(leaf_solve(&in, &dark), LEAF_OK);
    assert_true(dark.transp_mol_m2_s < 0.1 * sun.transp_mol_m2_s);
}

/* Same input, same output, bit for bit. */
static void test_deterministic(void **state)
{
    (void)state;
    leaf_in in = base();
    leaf_out a, b;
    memset(&a, 0, sizeof a);
    memset(&b, 0xff, sizeof b);
    assert_int_equal(leaf_solve(&in, &a), LEAF_OK);
    assert_int_equal(leaf_solve(&in, &b), LEAF_OK);
    assert_memory_equal(&a.t_leaf_c, &b.t_leaf_c, sizeof a.t_leaf_c);
    assert_memory_equal(&a.latent_w_m2, &b.latent_w_m2,
                        sizeof a.latent_w_m2);
    assert_int_equal(a.iterations, b.iterations);
}

/* Refusals: each out-of-range input gives LEAF_EINPUT with NaN outputs; a
 * leaf that would pass 100 C gives LEAF_ERANGE; bad Jarvis input is NaN. */
static void test_refusals(void **state)
{
    (void)state;
    leaf_out o;
    leaf_in in;
    for (int field = 0; field < 9; field++) {
        in = base();
        switch (field) {
        case 0: in.t_air_c = 70.0; break;
        case 1: in.ea_kpa = -0.1; break;
        case 2: in.ea_kpa = 2.0 * psy_e0_kpa(in.t_air_c); break;
        case 3: in.pressure_kpa = 20.0; break;
        case 4: in.wind_m_s = -1.0; break;
        case 5: in.rabs_w_m2 = (double)NAN; break;
        case 6: in.g_s_mol_m2_s = -0.1; break;
        case 7: in.leaf_width_m = 0.0; break;
        default: in.emissivity = 1.2; break;
        }
        assert_int_equal(leaf_solve(&in, &o), LEAF_EINPUT);
        assert_true(isnan(o.t_leaf_c) && isnan(o.latent_w_m2));
        assert_true(isnan(leaf_residual_w_m2(&in, 20.0)));
    }
    in = base();
    in.t_air_c = 60.0;
    in.ea_kpa = 0.5;
    in.rabs_w_m2 = 1500.0;
    in.wind_m_s = 0.0;
    in.g_s_mol_m2_s = 0.0;
    in.leaf_width_m = 1.0;
    assert_int_equal(leaf_solve(&in, &o), LEAF_ERANGE);
    assert_true(isnan(o.t_leaf_c));
    leaf_jarvis p = leaf_jarvis_grass();
    assert_true(isnan(leaf_gs_jarvis(-1.0, 1.0, &p)));
    assert_true(isnan(leaf_gs_jarvis(100.0, (double)NAN, &p)));
    p.g_min_mol_m2_s = 1.0;
    assert_true(isnan(leaf_gs_jarvis(100.0, 1.0, &p)));
}

/* leaf_solve_row gives each leaf the answer leaf_solve gives it (same
 * equations, to 1e-8 C; shared terms computed once), including a refused
 * leaf in the middle of the row. */
static void test_row_matches_single(void **state)
{
    (void)state;
    double rabs[6] = {300, 450, 600, 750, 2000, 900};
    double gs[6] = {0.0, 0.05, 0.2, 0.4, 0.2, 0.1};
    double t[6], v[6];
    for (int canopy = 0; canopy < 2; canopy++) {
        leaf_in in = base();
        in.g_b_mol_m2_s = canopy ? 0.6 : 0.0; /* big-leaf canopy mode too */
        assert_int_equal(leaf_solve_row(&in, 6, rabs, gs, t, v), 1);
        for (int i = 0; i < 6; i++) {
            in.rabs_w_m2 = rabs[i];
            in.g_s_mol_m2_s = gs[i];
            leaf_out o;
            int rc = leaf_solve(&in, &o);
            if (rc != LEAF_OK) {
                assert_true(isnan(t[i]) && isnan(v[i]));
                continue;
            }
            assert_close(t[i], o.t_leaf_c, 1e-8);
            assert_close(v[i], o.vpd_leaf_kpa, 1e-8);
            assert_close(leaf_residual_w_m2(&in, t[i]), 0.0, 0.01);
        }
    }
}

/* A given boundary-layer conductance replaces the flat-plate one for heat
 * and vapour; a lower one (a whole sward's aerodynamic conductance) lets a
 * sunlit, closed leaf run warmer (C&N 1998 eq. 14.6: the leaf-air
 * difference scales with 1/(g_Ha + g_r)). */
static void test_given_conductance(void **state)
{
    (void)state;
    leaf_in in = base();
    in.g_s_mol_m2_s = 0.0;
    in.rabs_w_m2 = 800;
    leaf_out free_leaf, canopy;
    assert_int_equal(leaf_solve(&in, &free_leaf), LEAF_OK);
    in.g_b_mol_m2_s = 0.4;
    assert_int_equal(leaf_solve(&in, &canopy), LEAF_OK);
    assert_close(canopy.g_ha_mol_m2_s, 0.4, 0);
    assert_close(canopy.g_va_mol_m2_s, 0.4, 0);
    assert_true(canopy.t_leaf_c > free_leaf.t_leaf_c + 2.0);
    in.g_b_mol_m2_s = 25.0;
    assert_int_equal(leaf_solve(&in, &canopy), LEAF_EINPUT);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_boundary_conductances),
        cmocka_unit_test(test_radiative_conductance),
        cmocka_unit_test(test_closure),
        cmocka_unit_test(test_linear_estimate),
        cmocka_unit_test(test_isothermal_dry_leaf),
        cmocka_unit_test(test_more_radiation_warmer),
        cmocka_unit_test(test_more_wind_closer_to_air),
        cmocka_unit_test(test_transpiration_cools),
        cmocka_unit_test(test_dry_leaf_in_sun_is_hot),
        cmocka_unit_test(test_night_leaf_near_radiative_balance),
        cmocka_unit_test(test_jarvis_shape),
        cmocka_unit_test(test_dark_strip_low_transpiration),
        cmocka_unit_test(test_deterministic),
        cmocka_unit_test(test_refusals),
        cmocka_unit_test(test_row_matches_single),
        cmocka_unit_test(test_given_conductance),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
