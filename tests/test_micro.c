/* test_micro.c - the strip microclimate engine on the invented demo farm
 * and on constructed cases: conservation, bounds, and the pattern under
 * trackers that practitioners describe (common practice, no source),
 * which must come out of geometry x sun x weather timing, not labels.
 * Runs from the repository root (make check does). */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "micro.h"
#include "rgtest.h"
#include "tcal.h"

#define DEMO "examples/demo/site.json"

typedef struct fixture {
    site s;
    wx_set w;
    mc_config c;
    mc_result r;      /* demo year 2025 */
} fixture;

static int setup(void **state)
{
    fixture *f = calloc(1, sizeof *f);
    rg_err e = {{0}};
    rg_warn_quiet(1);
    if (!f || site_load(DEMO, "models", &f->s, &e) < 0 || wx_load(&f->s.weather, &f->w, &e) < 0 ||
        mc_config_from_site(&f->s, &f->c, &e) < 0 ||
        mc_run(&f->c, &f->w.s[2], 0, f->w.s[2].n, &f->r, &e) < 0) {
        print_error("%s\n", e.msg);
        return -1;
    }
    *state = f;
    return 0;
}

static int teardown(void **state)
{
    fixture *f = *state;
    mc_free(&f->r);
    mc_config_free(&f->c);
    wx_free(&f->w);
    site_free(&f->s);
    free(f);
    return 0;
}

/* Water mass balance per pitch and hour: the rain reaching the strips,
 * times their widths, equals the rain on the pitch, to rounding, for every
 * hour of a year (physical invariant). */
static void test_rain_conserved(void **state)
{
    fixture *f = *state;
    int n = f->r.n_strips;
    double w = f->c.geom.pitch_m / n;
    for (size_t k = 0; k < f->r.n_hours; k++) {
        double got = 0;
        ptrdiff_t wet = mc_rain_at(&f->r, k);
        for (int i = 0; wet >= 0 && i < n; i++)
            got += f->r.rain_strip_mm[wet + i] * w;
        assert_close(got, f->r.rain_mm[k] * f->c.geom.pitch_m, 1e-9 * (1 + f->r.rain_mm[k]));
    }
}

/* Energy bound: light reaching the ground under the array never exceeds
 * the open field's, hour by hour, summed over the pitch (panels only
 * remove light; ground-reflected light is left out). */
static void test_light_bounded(void **state)
{
    fixture *f = *state;
    int n = f->r.n_strips;
    double w = f->c.geom.pitch_m / n;
    for (size_t k = 0; k < f->r.n_hours; k++) {
        double sum = 0;
        ptrdiff_t at = mc_lit_at(&f->r, k);
        if (at < 0) { /* night: nothing stored, and the open field dark too */
            assert_true(f->r.ghi_w_m2[k] == 0);
            continue;
        }
        for (int i = 0; i < n; i++) {
            double sw = f->r.sw_w_m2[at + i];
            assert_true(sw >= 0);
            sum += sw * w;
        }
        assert_true(sum <= f->r.ghi_w_m2[k] * f->c.geom.pitch_m * (1 + 1e-9) + 1e-9);
    }
}

static int wettest(const mc_strip_summary *rows, int n)
{
    int best = 0;
    for (int i = 1; i < n; i++)
        if (rows[i].rain_share > rows[best].rain_share)
            best = i;
    return best;
}

/* The demo's summer rain comes mostly in afternoon storms: the wettest
 * strip is at the afternoon-lit (west, offset < 0) drip edge and gets far
 * more than the open field; the strip under the panel gets much less
 * light and very little rain (common practice, no source). */
static void test_afternoon_storm_pattern(void **state)
{
    fixture *f = *state;
    int n = f->r.n_strips;
    mc_strip_summary rows[128];
    assert_int_equal(mc_summarise(&f->c, &f->r, 1, rows), 0);
    int wet = wettest(rows, n);
    assert_true(rows[wet].offset_m < 0);
    assert_int_equal(rows[wet].side, MC_PM_EDGE);
    assert_true(rows[wet].rain_share > 2.0);
    int mid = n / 2;
    assert_int_equal(rows[mid].side, MC_UNDER);
    assert_true(rows[mid].light_share < 0.5 * rows[0].light_share);
    assert_true(rows[mid].rain_share < 0.1);
    /* the strip east of the panel takes its light in the morning */
    assert_true(rows[n - 1 - 12].light_am_share > 0.6);
}

/* The same array with each day's rain moved to the mirror hour about
 * solar noon (afternoon storms become morning showers): the wettest strip
 * moves to the east (offset > 0) edge.  Geometry and timing decide it. */
static void test_morning_rain_moves_east(void **state)
{
    fixture *f = *state;
    wx_series m = f->w.s[2];
    double *rain = calloc(m.n, sizeof *rain);
    assert_non_null(rain);
    for (size_t h = 0; h < m.n; h++) {
        size_t day0 = h - h % 24, hour = h % 24;
        /* mirror about 12:00: the demo's solar noon is within minutes of it
         * (longitude 104.6 W on the UTC-7 meridian of 105 W) */
        size_t mirror = (23 + 24 - hour) % 24;
        rain[day0 + mirror] += f->w.s[2].v[WX_RAIN][h];
    }
    m.v[WX_RAIN] = rain;
    mc_result r;
    rg_err e = {{0}};
    assert_int_equal(mc_run(&f->c, &m, 0, m.n, &r, &e), 0);
    mc_strip_summary rows[128];
    assert_int_equal(mc_summarise(&f->c, &r, 1, rows), 0);
    int wet = wettest(rows, r.n_strips);
    assert_true(rows[wet].offset_m > 0);
    assert_int_equal(rows[wet].side, MC_AM_EDGE);
    mc_free(&r);
    free(rain);
}

/* Largest rain share on each drip edge. */
static void edge_rain(const mc_strip_summary *rows, int n, double *am, double *pm)
{
    *am = *pm = 0;
    for (int i = 0; i < n; i++) {
        if (rows[i].side == MC_AM_EDGE && rows[i].rain_share > *am)
            *am = rows[i].rain_share;
        if (rows[i].side == MC_PM_EDGE && rows[i].rain_share > *pm)
            *pm = rows[i].rain_share;
    }
}

/* The same physics under a climate without afternoon storms must not force
 * the pattern: with each day's rain spread evenly over its 24 hours, the
 * gap between the two edges' water is smaller than with the demo's
 * afternoon storms (common practice, no source). */
static void test_even_rain_smaller_gap(void **state)
{
    fixture *f = *state;
    mc_strip_summary rows[128];
    double am, pm;
    assert_int_equal(mc_summarise(&f->c, &f->r, 1, rows), 0);
    edge_rain(rows, f->r.n_strips, &am, &pm);
    double storm_gap = fabs(pm - am);
    wx_series m = f->w.s[2];
    double *rain = calloc(m.n, sizeof *rain);
    assert_non_null(rain);
    for (size_t d = 0; d + 24 <= m.n; d += 24) {
        double day = 0;
        for (size_t h = 0; h < 24; h++)
            day += f->w.s[2].v[WX_RAIN][d + h];
        for (size_t h = 0; h < 24; h++)
            rain[d + h] = day / 24;
    }
    m.v[WX_RAIN] = rain;
    mc_result r;
    rg_err e = {{0}};
    assert_int_equal(mc_run(&f->c, &m, 0, m.n, &r, &e), 0);
    assert_int_equal(mc_summarise(&f->c, &r, 1, rows), 0);
    edge_rain(rows, r.n_strips, &am, &pm);
    print_message("      edge rain gap: afternoon storms %.2f, even rain %.2f (shares of open rain)\n",
                  storm_gap, fabs(pm - am));
    assert_true(fabs(pm - am) < storm_gap);
    mc_free(&r);
    free(rain);
}

/* While lit, the afternoon-lit edge sees warmer leaves and a higher VPD
 * than the morning-lit edge (common practice, no source). */
static void test_pm_edge_warmer(void **state)
{
    fixture *f = *state;
    mc_strip_summary rows[128];
    assert_int_equal(mc_summarise(&f->c, &f->r, 1, rows), 0);
    double t_am = 0, t_pm = 0, v_am = 0, v_pm = 0;
    int n_am = 0, n_pm = 0;
    for (int i = 0; i < f->r.n_strips; i++) {
        if (rows[i].side == MC_AM_EDGE)
            t_am += rows[i].leaf_temp_c, v_am += rows[i].leaf_vpd_kpa, n_am++;
        if (rows[i].side == MC_PM_EDGE)
            t_pm += rows[i].leaf_temp_c, v_pm += rows[i].leaf_vpd_kpa, n_pm++;
    }
    assert_true(n_am > 0 && n_pm > 0);
    assert_true(t_pm / n_pm > t_am / n_am);
    assert_true(v_pm / n_pm > v_am / n_am);
}

/* Over the daylight hours of the warmest months (June-August), leaves
 * inside the array average about 4 deg C cooler than in open pasture;
 * accepted 2-6 deg C (common practice, no source). */
static void test_array_leaves_cooler(void **state)
{
    fixture *f = *state;
    int n = f->r.n_strips;
    double diff = 0;
    long hours = 0;
    for (size_t k = 0; k < f->r.n_hours; k++) {
        int y, m, d;
        tcal_civil(tcal_hour_day(f->r.t0_h + (int64_t)k), &y, &m, &d);
        if (m < 6 || m > 8 || !isfinite(f->r.open_leaf_c[k]))
            continue;
        double mean = 0;
        ptrdiff_t at = mc_lit_at(&f->r, k);
        assert_true(at >= 0); /* the open leaf has a temperature: daylight */
        for (int i = 0; i < n; i++)
            mean += f->r.leaf_c[at + i] / n;
        diff += f->r.open_leaf_c[k] - mean;
        hours++;
    }
    assert_true(hours > 1000);
    diff /= (double)hours;
    print_message("      summer daylight: array leaves %.2f C cooler than open pasture\n", diff);
    assert_true(diff >= 2.0 && diff <= 6.0);
}

/* As the pitch grows without bound every strip tends to open-field light
 * (a month of the demo weather, pitch 600 m). */
static void test_wide_pitch_tends_to_open(void **state)
{
    fixture *f = *state;
    mc_config c = f->c;
    c.geom.pitch_m = 600.0;
    c.geom.n_strips = 40;
    c.sky = strip_sky_table_build(&c.geom, 4);
    assert_non_null(c.sky);
    mc_result r;
    rg_err e = {{0}};
    assert_int_equal(mc_run(&c, &f->w.s[2], 4000, 24 * 30, &r, &e), 0);
    mc_strip_summary rows[64];
    assert_int_equal(mc_summarise(&c, &r, 1, rows), 0);
    assert_close(rows[0].light_share, 1.0, 0.01);
    assert_close(rows[39].light_share, 1.0, 0.01);
    mc_free(&r);
    mc_config_free(&c);
}

/* Same input, same output, bit for bit. */
static void test_repeatable(void **state)
{
    fixture *f = *state;
    mc_result r;
    rg_err e = {{0}};
    assert_int_equal(mc_run(&f->c, &f->w.s[2], 0, f->w.s[2].n, &r, &e), 0);
    size_t cells = r.n_rain * (size_t)r.n_strips, lit = r.n_lit * (size_t)r.n_strips;
    assert_int_equal(r.n_lit, f->r.n_lit);
    assert_int_equal(r.n_rain, f->r.n_rain);
    assert_memory_equal(r.lit_row, f->r.lit_row, r.n_hours * sizeof r.lit_row[0]);
    assert_memory_equal(r.rain_row, f->r.rain_row, r.n_hours * sizeof r.rain_row[0]);
    assert_memory_equal(r.sw_w_m2, f->r.sw_w_m2, lit * sizeof(double));
    assert_memory_equal(r.rain_strip_mm, f->r.rain_strip_mm, cells * sizeof(double));
    for (size_t i = 0; i < lit; i++) {
        assert_true((isnan(r.leaf_c[i]) && isnan(f->r.leaf_c[i])) || r.leaf_c[i] == f->r.leaf_c[i]);
        assert_true((isnan(r.vpd_kpa[i]) && isnan(f->r.vpd_kpa[i])) || r.vpd_kpa[i] == f->r.vpd_kpa[i]);
    }
    mc_free(&r);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_rain_conserved),
        cmocka_unit_test(test_light_bounded),
        cmocka_unit_test(test_afternoon_storm_pattern),
        cmocka_unit_test(test_morning_rain_moves_east),
        cmocka_unit_test(test_pm_edge_warmer),
        cmocka_unit_test(test_even_rain_smaller_gap),
        cmocka_unit_test(test_array_leaves_cooler),
        cmocka_unit_test(test_wide_pitch_tends_to_open),
        cmocka_unit_test(test_repeatable),
    };
    return cmocka_run_group_tests(tests, setup, teardown);
}
