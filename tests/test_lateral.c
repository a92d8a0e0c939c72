/* test_lateral.c - sideways soil water flow between strips (lateral.c) and
 * the texture classes it reads (texture.c): Clapp & Hornberger (1978)
 * eq. 1-2 with their Table 2, the diffusion solution of Crank (1975), and
 * the invariants (water conserved, no new extremes, bounds kept). */
#include <stdlib.h>
#include <string.h>

#include "lateral.h"
#include "rgtest.h"

/* Table 2 of Clapp & Hornberger (1978), loam: b 5.39, psi_s 47.8 cm,
 * K_s 6.95e-4 cm/s (0.0417 cm/min), theta_s 0.451.  Field capacity at 330
 * cm by eq. 1: 0.451 (47.8/330)^(1/5.39) = 0.451 x 0.698755 = 0.315139
 * (hand computation: ln(47.8/330) = -1.932067, /5.39 = -0.358454). */
static void test_table_and_retention(void **state)
{
    (void)state;
    const tex_class *t = tex_find("loam");
    assert_non_null(t);
    assert_close(t->b, 5.39, 0);
    assert_close(t->psi_s_cm, 47.8, 0);
    assert_close(t->theta_s, 0.451, 0);
    assert_close(tex_theta_at_suction(t, 330.0), 0.315139, 5e-6);
    assert_close(tex_theta_at_suction(t, 10.0), 0.451, 0); /* wetter than air entry */
    /* sandy loam, Table 2: b 4.90, psi_s 21.8 cm, theta_s 0.435 */
    const tex_class *sl = tex_find("sandy-loam");
    assert_non_null(sl);
    assert_close(sl->b, 4.90, 0);
    assert_null(tex_find("Loam"));
    assert_null(tex_find("loamy"));
    assert_null(tex_find(NULL));
    assert_true(isnan(tex_theta_at_suction(t, 0.0)));
    /* every class: drier at higher suction, field capacity below porosity */
    const char *names[] = {"sand", "loamy-sand", "sandy-loam", "silt-loam", "loam", "sandy-clay-loam",
                           "silty-clay-loam", "clay-loam", "sandy-clay", "silty-clay", "clay"};
    for (size_t i = 0; i < sizeof names / sizeof names[0]; i++) {
        const tex_class *c = tex_find(names[i]);
        assert_non_null(c);
        assert_non_null(strstr(tex_names(), names[i]));
        assert_true(tex_theta_at_suction(c, 15000.0) < tex_theta_at_suction(c, 330.0));
        assert_true(tex_theta_at_suction(c, 330.0) < c->theta_s);
    }
}

/* D(theta) = K dpsi/dtheta (Clapp & Hornberger 1978 eq. 1 and 2): at
 * saturation b K_s psi_s / theta_s = 5.39 x 6.95e-6 m/s x 0.478 m / 0.451 =
 * 3.970315e-5 m2/s for loam (hand computation); and at any theta it equals
 * K(theta) times the numerical derivative of psi(theta), computed here
 * from eq. 1 and 2 independently of the closed form. */
static void test_diffusivity(void **state)
{
    (void)state;
    const tex_class *t = tex_find("loam");
    assert_close(lf_diffusivity_m2_s(t, 0.451), 3.970315e-5, 1e-10);
    double thetas[] = {0.12, 0.2, 0.28, 0.315};
    for (int i = 0; i < 4; i++) {
        double th = thetas[i], h = 1e-6;
        double k_m_s = t->k_s_cm_s / 100.0 * pow(th / t->theta_s, 2 * t->b + 3);
        double psi_a = t->psi_s_cm / 100.0 * pow((th - h) / t->theta_s, -t->b);
        double psi_b = t->psi_s_cm / 100.0 * pow((th + h) / t->theta_s, -t->b);
        double d_num = k_m_s * (psi_a - psi_b) / (2 * h); /* suction falls as theta rises */
        assert_close(lf_diffusivity_m2_s(t, th), d_num, 1e-6 * d_num);
    }
    assert_true(isnan(lf_diffusivity_m2_s(t, 0.5)));
    assert_true(isnan(lf_diffusivity_m2_s(NULL, 0.3)));
}

static int make_loam(lf_soil *ls)
{
    return lf_soil_make(tex_find("loam"), 0.6, 90.0, ls);
}

/* Water is conserved exactly (to rounding) and the flow creates no new
 * extreme: every depletion stays between the old minimum and maximum
 * (physical invariants of diffusion). */
static void test_conserved_and_monotone(void **state)
{
    (void)state;
    lf_soil ls;
    assert_int_equal(make_loam(&ls), 0);
    enum { N = 40 };
    soil_state s[N];
    double moved[N], scratch[2 * N];
    srand(7);
    for (int trial = 0; trial < 50; trial++) {
        double before = 0, lo = 1e9, hi = -1e9;
        for (int i = 0; i < N; i++) {
            s[i].dr_mm = (trial % 2 ? (i > 10 && i < 16 ? 0.0 : 90.0) : 90.0 * rand() / RAND_MAX);
            s[i].de_mm = 3.0;
            before += s[i].dr_mm;
            lo = fmin(lo, s[i].dr_mm);
            hi = fmax(hi, s[i].dr_mm);
        }
        int subs = lf_step(&ls, s, N, 0.15, 3600.0, moved, scratch);
        assert_true(subs >= 1);
        double after = 0, sum_moved = 0;
        for (int i = 0; i < N; i++) {
            after += s[i].dr_mm;
            sum_moved += moved[i];
            assert_true(s[i].dr_mm >= lo - 1e-12 && s[i].dr_mm <= hi + 1e-12);
            assert_close(s[i].de_mm, 3.0, 0); /* the surface layer is not touched */
        }
        assert_close(after, before, 1e-9);
        assert_close(sum_moved, 0.0, 1e-9);
    }
}

/* A uniform pitch stays as it is; a wet strip loses water to dry
 * neighbours and they gain it (direction of flow). */
static void test_direction(void **state)
{
    (void)state;
    lf_soil ls;
    assert_int_equal(make_loam(&ls), 0);
    enum { N = 10 };
    soil_state s[N];
    double moved[N], scratch[2 * N];
    for (int i = 0; i < N; i++)
        s[i] = (soil_state){.dr_mm = 45.0, .de_mm = 0};
    lf_step(&ls, s, N, 0.15, 3600.0, moved, scratch);
    for (int i = 0; i < N; i++)
        assert_close(moved[i], 0.0, 0);
    s[4].dr_mm = 0.0; /* a drip strip at field capacity */
    lf_step(&ls, s, N, 0.15, 3600.0, moved, scratch);
    assert_true(moved[4] < 0 && moved[3] > 0 && moved[5] > 0);
    assert_close(moved[3], moved[5], 1e-12); /* symmetric */
    assert_close(moved[0], 0.0, 1e-6);       /* far away: almost nothing yet */
}

/* With a constant diffusivity D the scheme solves the diffusion equation:
 * on a periodic pitch of length L a sine profile of wavenumber 2 pi / L
 * decays as exp(-D (2 pi / L)^2 t) (Crank, J. 1975, The Mathematics of
 * Diffusion, 2nd ed., ch. 4, separation of variables).  0.1 m strips,
 * D = 1e-6 m2/s over one day: the profile keeps exp(-0.0948) of its
 * amplitude; the scheme agrees within 0.2 %. */
static void test_diffusion_solution(void **state)
{
    (void)state;
    lf_soil ls;
    memset(&ls, 0, sizeof ls);
    ls.taw_mm = 100.0;
    for (int j = 0; j <= LF_TABLE_N; j++)
        ls.d_m2_s[j] = 1e-6;
    ls.d_max_m2_s = 1e-6;
    enum { N = 60 };
    const double w = 0.1, len = N * w, pi = acos(-1.0);
    soil_state s[N];
    double scratch[2 * N];
    for (int i = 0; i < N; i++)
        s[i] = (soil_state){.dr_mm = 50.0 + 10.0 * sin(2 * pi * (i + 0.5) / N), .de_mm = 0};
    for (int h = 0; h < 24; h++)
        assert_true(lf_step(&ls, s, N, w, 3600.0, NULL, scratch) >= 1);
    double kx = 2 * pi / len, expect = 10.0 * exp(-1e-6 * kx * kx * 86400.0);
    double amp = 0;
    for (int i = 0; i < N; i++)
        amp += (s[i].dr_mm - 50.0) * sin(2 * pi * (i + 0.5) / N);
    amp *= 2.0 / N;
    assert_close(amp, expect, 0.002 * expect);
}

/* A diffusivity too large for one explicit step is split into sub-steps
 * and stays monotone: r = D dt / w^2 = 1e-5 x 3600 / 0.01 = 3.6 needs
 * ceil(3.6 / 0.45) = 8. */
static void test_substeps(void **state)
{
    (void)state;
    lf_soil ls;
    memset(&ls, 0, sizeof ls);
    ls.taw_mm = 100.0;
    for (int j = 0; j <= LF_TABLE_N; j++)
        ls.d_m2_s[j] = 1e-5;
    ls.d_max_m2_s = 1e-5;
    soil_state s[8];
    double scratch[16];
    for (int i = 0; i < 8; i++)
        s[i] = (soil_state){.dr_mm = i == 0 ? 0.0 : 100.0, .de_mm = 0};
    assert_int_equal(lf_step(&ls, s, 8, 0.1, 3600.0, NULL, scratch), 8);
    for (int i = 0; i < 8; i++)
        assert_true(s[i].dr_mm >= 0.0 && s[i].dr_mm <= 100.0);
}

/* lf_soil_make refuses a root zone holding more water than the texture
 * holds at field capacity, and bad arguments. */
static void test_make_refuses(void **state)
{
    (void)state;
    lf_soil ls;
    const tex_class *t = tex_find("loam");
    assert_int_equal(lf_soil_make(t, 0.6, 90.0, &ls), 0);
    assert_true(ls.d_m2_s[0] > ls.d_m2_s[LF_TABLE_N]); /* wetter conducts more */
    assert_int_equal(lf_soil_make(t, 0.6, 0.6 * 320.0, &ls), -1); /* 320 mm/m > 315 */
    assert_int_equal(lf_soil_make(NULL, 0.6, 90.0, &ls), -1);
    assert_int_equal(lf_soil_make(t, 0.0, 90.0, &ls), -1);
    assert_int_equal(lf_soil_make(t, 0.6, NAN, &ls), -1);
    soil_state s[2] = {{0, 0}, {0, 0}};
    assert_int_equal(lf_step(&ls, s, 1, 0.1, 3600.0, NULL, (double[4]){0}), -1);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_table_and_retention),
        cmocka_unit_test(test_diffusivity),
        cmocka_unit_test(test_conserved_and_monotone),
        cmocka_unit_test(test_direction),
        cmocka_unit_test(test_diffusion_solution),
        cmocka_unit_test(test_substeps),
        cmocka_unit_test(test_make_refuses),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
