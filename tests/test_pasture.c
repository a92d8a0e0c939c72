/* test_pasture.c - soil water and growth per strip on the invented demo
 * farm: water conservation per strip and per pitch over a year, and the
 * pattern across the row that practitioners describe (common practice, no
 * source) where the model reproduces it.  Where it does not (the
 * morning-lit edge ahead of the afternoon-lit edge in 2023 and 2024, the
 * inter-row about equal to open ground, the whole array within 3-20 % of
 * open ground in 2023, both edges above open ground in 2023), the
 * figures are printed and reported (docs/model.md section 20) rather than
 * asserted.
 * Runs from the repository root (make check does). */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>

#include "pasture.h"
#include "rgtest.h"

typedef struct fixture {
    site s;
    wx_set w;
    mc_config c;
    mc_result m[3];
    ps_result p[3];
    mc_strip_summary rows[3][64];
} fixture;

static int setup(void **state)
{
    fixture *f = calloc(1, sizeof *f);
    rg_err e = {{0}};
    rg_warn_quiet(1);
    ps_config pc;
    if (!f || site_load("examples/demo/site.json", "models", &f->s, &e) < 0 ||
        wx_load(&f->s.weather, &f->w, &e) < 0 || mc_config_from_site(&f->s, &f->c, &e) < 0 ||
        ps_config_make(&f->s, 0, 0, &pc, &e) < 0) {
        print_error("%s\n", e.msg);
        return -1;
    }
    for (int y = 0; y < 3; y++)
        if (mc_run(&f->c, &f->w.s[y], 0, f->w.s[y].n, &f->m[y], &e) < 0 ||
            ps_run(&pc, &f->m[y], &f->w.s[y], &f->p[y], &e) < 0 ||
            mc_summarise(&f->c, &f->m[y], 1, f->rows[y]) < 0) {
            print_error("%s\n", e.msg);
            return -1;
        }
    *state = f;
    return 0;
}

static int teardown(void **state)
{
    fixture *f = *state;
    for (int y = 0; y < 3; y++) {
        ps_free(&f->p[y]);
        mc_free(&f->m[y]);
    }
    mc_config_free(&f->c);
    wx_free(&f->w);
    site_free(&f->s);
    free(f);
    return 0;
}

/* Water mass balance per strip and per pitch over each year: rain in =
 * runoff + evaporation + transpiration + drainage + change in storage, to
 * rounding (physical invariant); and the sideways spread and the panels
 * together conserve the pitch's rain. */
static void test_water_conserved(void **state)
{
    fixture *f = *state;
    for (int y = 0; y < 3; y++) {
        const ps_result *p = &f->p[y];
        int n = p->n_cols - 1;
        double pitch_rain = 0, open_rain = p->water[n].rain;
        for (int i = 0; i <= n; i++) {
            const ps_water *wb = &p->water[i];
            double out = wb->runoff + wb->evaporation + wb->transpiration + wb->drainage +
                         (wb->storage_end - wb->storage_start);
            assert_close(out, wb->rain + wb->lateral_in, 1e-6 * (1 + wb->rain));
            assert_close(wb->lateral_in, 0.0, 0); /* the demo's soils name no texture */
            if (i < n)
                pitch_rain += wb->rain / n;
        }
        assert_close(pitch_rain, open_rain, 1e-9 * (1 + open_rain));
    }
}

typedef struct zones {
    double am_max, pm_max, inter_mean, under_mean, under_max;
} zones;

static zones zone_growth(const fixture *f, int y)
{
    zones z = {0, 0, 0, 0, 0};
    int n_inter = 0, n_under = 0;
    const ps_result *p = &f->p[y];
    for (int i = 0; i < p->n_cols - 1; i++) {
        double g = ps_total_kgdm_ha(p, i, 0, p->n_days);
        switch (f->rows[y][i].side) {
        case MC_AM_EDGE: z.am_max = fmax(z.am_max, g); break;
        case MC_PM_EDGE: z.pm_max = fmax(z.pm_max, g); break;
        case MC_OPEN: z.inter_mean += g; n_inter++; break;
        default: z.under_mean += g; z.under_max = fmax(z.under_max, g); n_under++; break;
        }
    }
    z.inter_mean /= n_inter;
    z.under_mean /= n_under;
    return z;
}

static double array_gap(const fixture *f, int y)
{
    const ps_result *p = &f->p[y];
    int n = p->n_cols - 1;
    double sum = 0;
    for (int i = 0; i < n; i++)
        sum += ps_total_kgdm_ha(p, i, 0, p->n_days);
    return 1.0 - sum / n / ps_total_kgdm_ha(p, n, 0, p->n_days);
}

/* In the demo's typical year (the median of its three rain totals, 2024):
 * both drip edges above open ground and above the open inter-row ground,
 * the ground under the panels the least productive, the whole array
 * 3-20 % below open ground (common practice, no source).  The morning-lit
 * edge is NOT ahead of the afternoon-lit edge in 2024 (printed, not
 * asserted; docs/model.md section 20). */
static void test_pattern_typical_year(void **state)
{
    fixture *f = *state;
    zones z = zone_growth(f, 1);
    double open = ps_total_kgdm_ha(&f->p[1], f->p[1].n_cols - 1, 0, f->p[1].n_days);
    print_message("      2024: am-edge %.0f, pm-edge %.0f, inter-row %.0f, under %.0f, open ground %.0f kg DM/ha, array gap %.1f %%\n",
                  z.am_max, z.pm_max, z.inter_mean, z.under_mean, open, 100.0 * array_gap(f, 1));
    assert_true(z.am_max > open && z.pm_max > open);
    assert_true(z.am_max > z.inter_mean && z.pm_max > z.inter_mean);
    assert_true(z.under_max < z.inter_mean);
    double gap = array_gap(f, 1);
    assert_true(gap >= 0.03 && gap <= 0.20);
}

/* In every demo year: both drip edges grow more than the open inter-row
 * ground, the ground under the panels grows least, and the whole array
 * grows less than open ground (common practice, no source).  Printed for
 * the report: which edge wins, and the whole-array gap (the issue asks
 * 3-20 %; the model gives it in 2024 and 2025, not in 2023). */
static void test_edges_above_inter_row(void **state)
{
    fixture *f = *state;
    for (int y = 0; y < 3; y++) {
        zones z = zone_growth(f, y);
        double gap = array_gap(f, y);
        print_message("      %d: am-edge %.0f, pm-edge %.0f, inter-row %.0f, under %.0f; %s edge first; array gap %.1f %%\n",
                      2023 + y, z.am_max, z.pm_max, z.inter_mean, z.under_mean,
                      z.am_max > z.pm_max ? "morning" : "afternoon", 100.0 * gap);
        assert_true(z.am_max > z.inter_mean && z.pm_max > z.inter_mean);
        assert_true(z.under_max < z.inter_mean);
        assert_true(z.under_mean < z.am_max && z.under_mean < z.pm_max);
        assert_true(gap > 0.0);
    }
}

/* With sideways soil water flow (the demo's loam given its texture class,
 * lateral.h): per strip, rain + water in sideways = runoff + evaporation +
 * transpiration + drainage + change in storage; over the pitch the
 * sideways flows add up to zero (water moves, none is made or lost:
 * physical invariants); and the flow evens out the water the strips get:
 * the spread between the wettest and the driest strip's water (rain +
 * sideways) is smaller than the spread of their rain alone, the drip
 * strips give water and the dry strips under the panel receive it. */
static void test_lateral_flow(void **state)
{
    fixture *f = *state;
    rg_err e = {{0}};
    site_soil keep = f->s.soils[0];
    snprintf(f->s.soils[0].texture, sizeof f->s.soils[0].texture, "loam");
    ps_config pc;
    ps_result p;
    int rc = ps_config_make(&f->s, 0, 0, &pc, &e);
    f->s.soils[0] = keep;
    assert_int_equal(rc, 0);
    assert_true(pc.lateral);
    assert_int_equal(ps_run(&pc, &f->m[1], &f->w.s[1], &p, &e), 0);
    int n = p.n_cols - 1;
    double sum_lateral = 0, rain_lo = 1e9, rain_hi = -1e9, got_lo = 1e9, got_hi = -1e9;
    int wettest = 0, driest = 0;
    for (int i = 0; i <= n; i++) {
        const ps_water *wb = &p.water[i];
        double out = wb->runoff + wb->evaporation + wb->transpiration + wb->drainage +
                     (wb->storage_end - wb->storage_start);
        assert_close(out, wb->rain + wb->lateral_in, 1e-6 * (1 + wb->rain));
        if (i == n) {
            assert_close(wb->lateral_in, 0.0, 0); /* open ground has no neighbours */
            break;
        }
        sum_lateral += wb->lateral_in;
        double got = wb->rain + wb->lateral_in;
        if (wb->rain > rain_hi) {
            rain_hi = wb->rain;
            wettest = i;
        }
        if (wb->rain < rain_lo) {
            rain_lo = wb->rain;
            driest = i;
        }
        got_lo = fmin(got_lo, got);
        got_hi = fmax(got_hi, got);
    }
    print_message("      2024 with sideways flow: rain %.0f-%.0f mm across the pitch, rain + sideways %.0f-%.0f mm\n",
                  rain_lo, rain_hi, got_lo, got_hi);
    assert_close(sum_lateral, 0.0, 1e-6 * n);
    assert_true(got_hi - got_lo < rain_hi - rain_lo);
    assert_true(p.water[wettest].lateral_in < 0 && p.water[driest].lateral_in > 0);
    ps_free(&p);
}

/* Stomata close in shade (pasture.c transpiration_eto, Noilhan & Planton
 * 1989).  Against the same 2024 run with stomata held open at any light
 * (R_GL made tiny, so F1 = 1 wherever light falls): the open ground is
 * untouched to the bit; across the pitch the sward is short of water on
 * fewer days and grows more, the water it no longer loses from shaded
 * leaves; and the morning-lit edge, shaded in the hot dry afternoon,
 * gains more than the afternoon-lit edge, shaded in the cool morning.
 * (Yearly transpiration itself need not fall: water saved in shade is
 * there to use on a later dry day.) */
static void test_stomata_close_in_shade(void **state)
{
    fixture *f = *state;
    rg_err e = {{0}};
    ps_config pc;
    ps_result p;
    assert_int_equal(ps_config_make(&f->s, 0, 0, &pc, &e), 0);
    pc.sward.stomata_light_w_m2 = 1e-9;
    assert_int_equal(ps_run(&pc, &f->m[1], &f->w.s[1], &p, &e), 0);
    const ps_result *q = &f->p[1];
    int n = q->n_cols - 1;
    assert_true(q->water[n].transpiration == p.water[n].transpiration);
    assert_true(q->water[n].evaporation == p.water[n].evaporation);
    assert_true(ps_total_kgdm_ha(q, n, 0, q->n_days) == ps_total_kgdm_ha(&p, n, 0, p.n_days));
    long stress_shut = 0, stress_open = 0;
    double grow_shut = 0, grow_open = 0, am_shut = 0, am_open = 0, pm_shut = 0, pm_open = 0;
    for (int i = 0; i < n; i++) {
        double gs = ps_total_kgdm_ha(q, i, 0, q->n_days), go = ps_total_kgdm_ha(&p, i, 0, p.n_days);
        stress_shut += q->stress_days[i];
        stress_open += p.stress_days[i];
        grow_shut += gs / n;
        grow_open += go / n;
        if (f->rows[1][i].side == MC_AM_EDGE && gs > am_shut) {
            am_shut = gs;
            am_open = go;
        }
        if (f->rows[1][i].side == MC_PM_EDGE && gs > pm_shut) {
            pm_shut = gs;
            pm_open = go;
        }
    }
    print_message("      2024, stomata closing in shade / held open: pitch mean growth %.0f / %.0f kg DM/ha, "
                  "stress strip-days %ld / %ld, am-edge %.0f / %.0f, pm-edge %.0f / %.0f\n",
                  grow_shut, grow_open, stress_shut, stress_open, am_shut, am_open, pm_shut, pm_open);
    assert_true(stress_shut < stress_open);
    assert_true(grow_shut > grow_open);
    assert_true(am_shut / am_open > pm_shut / pm_open);
    ps_free(&p);
}

/* Growth is never negative and water stress days never exceed the days
 * run (bounds). */
static void test_bounds(void **state)
{
    fixture *f = *state;
    for (int y = 0; y < 3; y++) {
        const ps_result *p = &f->p[y];
        for (size_t k = 0; k < p->n_days * (size_t)p->n_cols; k++)
            assert_true(p->growth[k] >= 0 && p->senescence[k] >= 0);
        for (int i = 0; i < p->n_cols; i++)
            assert_true(p->stress_days[i] >= 0 && (size_t)p->stress_days[i] <= p->n_days);
    }
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_water_conserved),
        cmocka_unit_test(test_pattern_typical_year),
        cmocka_unit_test(test_lateral_flow),
        cmocka_unit_test(test_edges_above_inter_row),
        cmocka_unit_test(test_stomata_close_in_shade),
        cmocka_unit_test(test_bounds),
    };
    return cmocka_run_group_tests(tests, setup, teardown);
}
