/* test_strips.c - checks of the ground-strip geometry (src/strips.c): beam
 * shadows, sky view factors, rain, crossed strings and the sky table.
 *
 * Outside references are named beside each check.  The slow references at
 * the top (ray casting for beam and sky) share no code with strips.c: they
 * follow single rays and test them against every nearby panel.
 */
#include "rgtest.h"
#include "strips.h"

#include <stdlib.h>

#define PI 3.14159265358979323846
#define D2R (PI / 180.0)

/* ---- fixed-seed generator (xorshift64, Marsaglia 2003) ----------------- */

static uint64_t rng_state = 88172645463325252ULL;

static double urand(void)
{
    rng_state ^= rng_state << 13;
    rng_state ^= rng_state >> 7;
    rng_state ^= rng_state << 17;
    return (double)(rng_state >> 11) / 9007199254740992.0; /* [0, 1) */
}

static double urange(double lo, double hi)
{
    return lo + (hi - lo) * urand();
}

static strip_geom random_geom(void)
{
    strip_geom g;
    g.chord_m = urange(0.5, 4.5);
    g.pitch_m = g.chord_m * urange(1.1, 4.0);
    g.hub_m = g.chord_m / 2 * urange(1.05, 2.5);
    g.n_strips = 1 + (int)(urand() * 12);
    int pick = (int)(urand() * 4);
    g.n_rows_each_side = pick == 0 ? (int)(urand() * 4) : STRIP_ROWS_ENDLESS;
    g.drip_width_m = urand() < 0.2 ? 0 : urange(0.05, 1.5 * g.pitch_m);
    g.flat_deg = urange(0, 5);
    return g;
}

static strip_geom demo_geom(void)
{
    strip_geom g = {6.0, 2.0, 2.2, 40, STRIP_ROWS_ENDLESS, 0.3, 2.0};
    return g;
}

/* ---- slow ray references ----------------------------------------------- */

/* Does the ray from (px, 0) along (dx, dz), dz > 0, hit any panel of rows
 * -m..m?  Only rows that the ray passes at panel heights are tried. */
static int ray_hits(const strip_geom *g, double rot, double px, double dx,
                    double dz, int m)
{
    double r = rot * D2R, h = g->chord_m / 2;
    double ex = h * cos(r), ez = h * sin(r);
    double zlo = g->hub_m - fabs(ez), zhi = g->hub_m + fabs(ez);
    double xa = px + dx / dz * zlo, xb = px + dx / dz * zhi;
    double xmin = fmin(xa, xb) - h, xmax = fmax(xa, xb) + h;
    double k0 = fmax(floor(xmin / g->pitch_m), -m);
    double k1 = fmin(ceil(xmax / g->pitch_m), m);
    for (double k = k0; k <= k1; k++) {
        double ax = k * g->pitch_m - ex, az = g->hub_m - ez;
        double sx = 2 * ex, sz = 2 * ez; /* segment a -> a + s */
        double den = dx * sz - dz * sx;
        if (den == 0) continue;
        double qx = ax - px, qz = az;
        double t = (qx * sz - qz * sx) / den;
        double s = (qx * dz - qz * dx) / den;
        if (t > 0 && s >= 0 && s <= 1) return 1;
    }
    return 0;
}

static int ref_rows(const strip_geom *g)
{
    return g->n_rows_each_side == STRIP_ROWS_ENDLESS ? 100000
                                                     : g->n_rows_each_side;
}

/* Beam lit share of strip i, by casting a ray to the sun from each of
 * `samples` midpoints. */
static double ref_beam(const strip_geom *g, double rot, double theta, int i,
                       int samples)
{
    double w = g->pitch_m / g->n_strips, lit = 0;
    for (int j = 0; j < samples; j++) {
        double x = -g->pitch_m / 2 + (i + (j + 0.5) / samples) * w;
        lit += !ray_hits(g, rot, x, -sin(theta * D2R), cos(theta * D2R),
                         ref_rows(g));
    }
    return lit / samples;
}

/* Sky view factor at (x, 0) by integrating over n_dir directions phi from
 * the zenith, weight dF = cos(phi)/2 dphi (2-D, Modest 2013 ch. 4), each
 * direction tested by a ray. */
static double ref_sky_point(const strip_geom *g, double rot, double x,
                            int n_dir)
{
    double dphi = PI / n_dir, vf = 0;
    for (int j = 0; j < n_dir; j++) {
        double phi = -PI / 2 + (j + 0.5) * dphi;
        if (!ray_hits(g, rot, x, sin(phi), cos(phi), ref_rows(g)))
            vf += cos(phi) / 2 * dphi;
    }
    return vf;
}

/* ---- geometry check ---------------------------------------------------- */

/* strip_geom_check accepts a sound geometry and rejects each kind of bad
 * one with a message (the rules of strips.h). */
static void test_geom_check(void **state)
{
    (void)state;
    char err[128];
    strip_geom g = demo_geom();
    assert_int_equal(strip_geom_check(&g, err, sizeof err), 0);
    strip_geom bad[9];
    for (int i = 0; i < 9; i++) bad[i] = g;
    bad[0].pitch_m = 2.0;          /* pitch == chord: rows touch */
    bad[1].hub_m = 1.0;            /* hub == chord/2: edge hits ground */
    bad[2].n_strips = 0;
    bad[3].chord_m = (double)NAN;
    bad[4].drip_width_m = -0.1;
    bad[5].n_rows_each_side = -2;
    bad[6].flat_deg = 91;
    bad[7].n_strips = STRIP_MAX_STRIPS + 1;
    bad[8].chord_m = 0;
    for (int i = 0; i < 9; i++) {
        err[0] = '\0';
        assert_int_equal(strip_geom_check(&bad[i], err, sizeof err), -1);
        assert_true(err[0] != '\0');
    }
    assert_int_equal(strip_geom_check(NULL, NULL, 0), -1);
}

/* ---- crossed strings --------------------------------------------------- */

/* Two directly opposed parallel strips of width w at gap h:
 * F = sqrt(1 + (h/w)^2) - h/w (Incropera, DeWitt et al., Fundamentals of
 * Heat and Mass Transfer, 6th ed. 2007, Table 13.1 "parallel plates with
 * midlines connected by perpendicular" - table number from memory; the
 * crossed-strings method, Hottel 1954 / Modest 2013 ch. 4): 0.41421 for
 * h = w, sqrt(5) - 2 = 0.23607 for h = 2w.  Also two strips at right
 * angles sharing an edge, widths 1 and 1: F = (1 + 1 - sqrt 2)/2 = 0.29289
 * (same table, "perpendicular plates with a common edge"). */
static void test_crossed_strings_known(void **state)
{
    (void)state;
    strip_point a0 = {0, 0}, a1 = {1, 0};
    strip_point b0 = {0, 1}, b1 = {1, 1};
    assert_close(strip_crossed_strings(a0, a1, b0, b1), 0.41421356, 1e-8);
    assert_close(strip_crossed_strings(a0, a1, b1, b0), 0.41421356, 1e-8);
    strip_point c0 = {0, 2}, c1 = {1, 2};
    assert_close(strip_crossed_strings(a0, a1, c0, c1), sqrt(5) - 2, 1e-12);
    strip_point d0 = {0, 0}, d1 = {0, 1};
    assert_close(strip_crossed_strings(a0, a1, d0, d1), 0.29289322, 1e-8);
    assert_close(strip_crossed_strings(a0, a0, b0, b1), 0, 0);
}

/* Crossed strings is the integral of the point formula over the emitting
 * strip (Hottel 1954; Modest 2013 ch. 4), so the ground strip under a lone
 * flat panel sees the panel with F = 1 - (strip's mean sky view factor).
 * Pitch 3, chord 1, hub 0.8, one strip spanning the pitch, 4000 samples
 * (midpoint rule, error well below 1e-6 for this smooth integrand). */
static void test_crossed_strings_vs_point_formula(void **state)
{
    (void)state;
    strip_geom g = {3.0, 1.0, 0.8, 1, 0, 0.0, 1.0};
    double vf;
    strip_sky_view(&g, 0, 4000, &vf);
    strip_point a0 = {-1.5, 0}, a1 = {1.5, 0};
    strip_point b0 = {-0.5, 0.8}, b1 = {0.5, 0.8};
    assert_close(1 - vf, strip_crossed_strings(a0, a1, b0, b1), 1e-6);
}

/* ---- sky view ---------------------------------------------------------- */

/* Hand check from the point formula F = (cos p1 - cos p2)/2 (Modest 2013
 * ch. 4), recomputed by hand for this file: pitch 2, chord 1, hub 1,
 * rotation 30, rows -1, 0, 1, ground point under the centre.  Our rotation
 * puts row 0's edges at (-0.4330, 0.75) and (0.4330, 1.25): from the
 * point they lie 30.0 deg to -x and 19.1 deg to +x of the zenith, so the
 * hand check's angles (positive towards +x) are already in our convention.
 * Hidden view factors, (sin b - sin a)/2 with angles from the zenith
 * (sin of an edge's angle = dx / sqrt(dx^2 + z^2)), recomputed for this
 * file and checked in python:
 *   row 0:  (0.5 + 0.327327)/2         = 0.413663  (-30.0..19.1 deg)
 *   row 1:  (0.902006 - 0.889476)/2    = 0.006265  (62.8..64.4 deg; the
 *           brief's 0.0060 is a rounding slip: sin 64.4 - sin 62.8 = 0.0124)
 *   row -1: (0.955626 - 0.781742)/2    = 0.086942  (-72.9..-51.4 deg)
 * vf = 1 - 0.506871 = 0.493129 (brief: 0.493).  A lone panel leaves
 * 1 - 0.413663 = 0.586337. */
static void test_sky_hand_check(void **state)
{
    (void)state;
    strip_geom g = {2.0, 1.0, 1.0, 1, 1, 0.0, 1.0};
    assert_close(strip_sky_view_at(&g, 30, 0), 0.493129, 2e-6);
    double vf;
    strip_sky_view(&g, 30, 1, &vf); /* one strip, its midpoint is x = 0 */
    assert_close(vf, 0.493129, 2e-6);
    g.n_rows_each_side = 0;
    assert_close(strip_sky_view_at(&g, 30, 0), 0.586337, 2e-6);
    /* Mirror symmetry: turning the other way and looking from -x is the
     * same picture. */
    g.n_rows_each_side = 1;
    assert_close(strip_sky_view_at(&g, -30, 0), 0.493129, 2e-6);
}

/* Mirror symmetry x -> -x, R -> -R (geometry): strip i at R sees what
 * strip n-1-i sees at -R. */
static void test_sky_mirror(void **state)
{
    (void)state;
    strip_geom g = demo_geom();
    g.n_strips = 9;
    double a[9], b[9];
    for (double r = -80; r <= 80; r += 20) {
        strip_sky_view(&g, r, 3, a);
        strip_sky_view(&g, -r, 3, b);
        for (int i = 0; i < 9; i++) assert_close(a[i], b[8 - i], 1e-9);
    }
}

/* Reciprocity and summation (Modest 2013 ch. 4): with flat panels no two
 * panels overlap as seen from the ground, so in an endless field the
 * hidden sky summed over one pitch equals the hidden sky of one panel over
 * the whole ground line, = chord * F(panel underside -> ground) = chord
 * (the underside of a flat panel sees only ground).  So the integral of
 * (1 - vf) over one pitch equals the chord; midpoint rule with 40 x 20
 * points, truncation at most 2e-6 (strips.h). */
static void test_sky_reciprocity_flat(void **state)
{
    (void)state;
    strip_geom g = demo_geom();
    double vf[40];
    strip_sky_view(&g, 0, 20, vf);
    double hidden = 0, w = strip_width_m(&g);
    for (int i = 0; i < 40; i++) hidden += (1 - vf[i]) * w;
    assert_close(hidden, g.chord_m, 1e-4);
}

/* Open-field limit: as the pitch grows, a strip far from the panel sees
 * the whole sky and the pitch-mean sky view tends to 1 - chord/pitch (for a
 * lone panel over an endless ground the hidden sky integrates to chord *
 * (F_top->ground + F_bottom->ground) = chord * ((1 - cos R)/2 +
 * (1 + cos R)/2) = chord, reciprocity, Modest 2013 ch. 4; panels overlap
 * only near the horizon).  The strip under the panel keeps the lone-panel
 * value.  Checked for growing pitch: the far strip's deficit shrinks. */
static void test_sky_large_pitch(void **state)
{
    (void)state;
    double prev_far = 1;
    double pitches[3] = {10, 100, 1000};
    for (int pi = 0; pi < 3; pi++) {
        strip_geom g = {pitches[pi], 2.0, 2.0, 101, STRIP_ROWS_ENDLESS, 0.3,
                        1.0};
        double vf[101], mean = 0;
        strip_sky_view(&g, 30, 200, vf);
        for (int i = 0; i < 101; i++) mean += vf[i] / 101;
        double far_def = 1 - vf[0];
        assert_true(far_def < prev_far);
        prev_far = far_def;
        if (pi == 2) {
            assert_true(far_def < 1e-4);
            assert_close(1 - mean, 2.0 / 1000, 0.01 * 2.0 / 1000);
            strip_geom lone = g;
            double lone_vf[101];
            lone.n_rows_each_side = 0;
            strip_sky_view(&lone, 30, 200, lone_vf);
            assert_close(vf[50], lone_vf[50], 1e-4);
            assert_true(vf[50] < 0.9);
        }
    }
}

/* The fast sky view agrees with the slow ray reference (20,000 directions
 * weighted by cos(phi)/2, every panel in range tested) at the same sample
 * points, within 0.002 (the brief's tolerance), on 200 fixed-seed random
 * geometries and rotations.  (That vf stays within [0, 1], so the sky
 * summed over a pitch stays under the open field's, holds by construction:
 * strip_sky_view_at clamps; no test of it could fail.) */
static void test_sky_vs_rays(void **state)
{
    (void)state;
    double worst = 0;
    for (int c = 0; c < 200; c++) {
        strip_geom g = random_geom();
        double rot = urange(-89, 89), vf[12];
        int s = 1 + (int)(urand() * 2);
        assert_int_equal(strip_geom_check(&g, NULL, 0), 0);
        strip_sky_view(&g, rot, s, vf);
        double w = strip_width_m(&g);
        for (int i = 0; i < g.n_strips; i++) {
            double ref = 0;
            for (int j = 0; j < s; j++) {
                double x = -g.pitch_m / 2 + (i + (j + 0.5) / s) * w;
                ref += ref_sky_point(&g, rot, x, 20000) / s;
            }
            assert_close(vf[i], ref, 0.002);
            worst = fmax(worst, fabs(vf[i] - ref));
        }
    }
    print_message("sky vs rays: worst difference %.2e\n", worst);
}

/* ---- sky table --------------------------------------------------------- */

/* Table lookup against the direct call within 0.002 (the brief's
 * tolerance) at 200 fixed-seed rotations, exact at the table's own angles,
 * and clamped beyond +-90. */
static void test_sky_table(void **state)
{
    (void)state;
    strip_geom g = demo_geom();
    g.n_strips = 20;
    strip_sky_table *t = strip_sky_table_build(&g, 4);
    assert_non_null(t);
    assert_int_equal(strip_sky_table_strips(t), 20);
    double a[20], b[20], worst = 0;
    for (int c = 0; c < 200; c++) {
        double rot = urange(-90, 90);
        strip_sky_table_lookup(t, rot, a);
        strip_sky_view(&g, rot, 4, b);
        for (int i = 0; i < 20; i++) {
            assert_close(a[i], b[i], 0.002);
            worst = fmax(worst, fabs(a[i] - b[i]));
        }
    }
    strip_sky_table_lookup(t, 37.5, a);
    strip_sky_view(&g, 37.5, 4, b);
    for (int i = 0; i < 20; i++) assert_close(a[i], b[i], 1e-15);
    strip_sky_table_lookup(t, 135, a);
    strip_sky_view(&g, 90, 4, b);
    for (int i = 0; i < 20; i++) assert_close(a[i], b[i], 1e-15);
    strip_sky_table_free(t);
    g.pitch_m = 1; /* fails the check: no table */
    assert_null(strip_sky_table_build(&g, 4));
    strip_sky_table_free(NULL);
    print_message("sky table vs direct: worst difference %.2e\n", worst);
}

/* ---- beam -------------------------------------------------------------- */

/* Hand-worked: pitch 2, chord 1, hub 1, 4 strips of 0.5.  Flat panel, sun
 * overhead: shadow [-0.5, 0.5] -> lit 1, 0, 0, 1.  Flat panel, theta = 30
 * (sun to -x): shadow moves +x by hub tan 30 = 0.57735 to
 * [0.07735, 1.07735]; the part past +1 lands (from row -1) on [-1,
 * -0.92265]: lit 1 - 0.07735/0.5 = 0.84530, 1, 1 - 0.42265/0.5 = 0.15470,
 * 0.  For a lone panel the wrapped part is missing: strip 0 fully lit. */
static void test_beam_hand(void **state)
{
    (void)state;
    strip_geom g = {2.0, 1.0, 1.0, 4, STRIP_ROWS_ENDLESS, 0.2, 1.0};
    double lit[4];
    strip_beam(&g, 0, 0, lit);
    assert_close(lit[0], 1, 1e-12);
    assert_close(lit[1], 0, 1e-12);
    assert_close(lit[2], 0, 1e-12);
    assert_close(lit[3], 1, 1e-12);
    strip_beam(&g, 0, 30, lit);
    assert_close(lit[0], 0.84530, 1e-5);
    assert_close(lit[1], 1, 1e-12);
    assert_close(lit[2], 0.15470, 1e-5);
    assert_close(lit[3], 0, 1e-12);
    g.n_rows_each_side = 0;
    strip_beam(&g, 0, 30, lit);
    assert_close(lit[0], 1, 1e-12);
    assert_close(lit[2], 0.15470, 1e-5);
    /* Sun at or below the horizon in the plane, or NaN: no beam. */
    g.n_rows_each_side = STRIP_ROWS_ENDLESS;
    strip_beam(&g, 0, 90, lit);
    assert_close(lit[0], 0, 0);
    strip_beam(&g, 0, (double)NAN, lit);
    assert_close(lit[0], 0, 0);
}

/* Energy: the ground shaded in one pitch equals one panel's shadow width,
 * chord |cos(R - theta)| / cos(theta) (derived in strips.c's top comment
 * by projecting the edges along the ray), while that is under a pitch, and
 * the whole pitch beyond; so the lit width never exceeds the pitch.  A panel
 * edge-on to the sun (R = theta - 90) casts no shadow; a panel facing the
 * sun (R = theta) casts its widest, chord / cos(theta). */
static void test_beam_shadow_width(void **state)
{
    (void)state;
    for (int c = 0; c < 500; c++) {
        strip_geom g = random_geom();
        g.n_rows_each_side = STRIP_ROWS_ENDLESS;
        double rot = urange(-90, 90), th = urange(-85, 85), lit[12];
        strip_beam(&g, rot, th, lit);
        double w = strip_width_m(&g), shaded = 0;
        for (int i = 0; i < g.n_strips; i++) shaded += (1 - lit[i]) * w;
        double width = g.chord_m * fabs(cos((rot - th) * D2R)) /
                       cos(th * D2R);
        assert_close(shaded, fmin(width, g.pitch_m), 1e-9 * g.pitch_m);
    }
    strip_geom g = demo_geom();
    double lit[40], w = strip_width_m(&g), lit_w = 0;
    strip_beam(&g, 40 - 90, 40, lit);
    for (int i = 0; i < 40; i++) lit_w += lit[i] * w;
    assert_close(lit_w, g.pitch_m, 1e-9);
    strip_beam(&g, 40, 40, lit);
    lit_w = 0;
    for (int i = 0; i < 40; i++) lit_w += lit[i] * w;
    assert_close(g.pitch_m - lit_w, g.chord_m / cos(40 * D2R), 1e-9);
}

/* The exact shadow intervals agree with a slow ray-by-ray reference (400
 * midpoints a strip, a ray to the sun from each, tested against every
 * panel it passes) on 300 fixed-seed random geometries and angles.  Each
 * shadow edge inside a strip can put the midpoint count off by half a
 * sample, and a strip can hold up to four edges: tolerance 2/400. */
static void test_beam_vs_rays(void **state)
{
    (void)state;
    double worst = 0;
    for (int c = 0; c < 300; c++) {
        strip_geom g = random_geom();
        double rot = urange(-90, 90), th = urange(-85, 85), lit[12];
        strip_beam(&g, rot, th, lit);
        for (int i = 0; i < g.n_strips; i++) {
            double ref = ref_beam(&g, rot, th, i, 400);
            assert_close(lit[i], ref, 2.0 / 400);
            worst = fmax(worst, fabs(lit[i] - ref));
        }
    }
    print_message("beam vs rays: worst difference %.2e\n", worst);
}

/* ---- rain -------------------------------------------------------------- */

/* Conservation, exact to rounding: sum rain_strip * w == rain * pitch for
 * any geometry and angle (the brief's invariant), incl. drip bands wider
 * than the pitch, zero drip width and out-of-range angles. */
static void test_rain_conservation(void **state)
{
    (void)state;
    for (int c = 0; c < 1000; c++) {
        strip_geom g = random_geom();
        double rot = urange(-120, 120), rain = urange(0.1, 80), out[12];
        strip_rain(&g, rot, rain, out);
        double w = strip_width_m(&g), sum = 0;
        for (int i = 0; i < g.n_strips; i++) {
            assert_true(out[i] >= 0);
            sum += out[i] * w;
        }
        assert_close(sum, rain * g.pitch_m, 1e-12 * rain * g.pitch_m);
    }
    strip_geom g = demo_geom();
    double out[40];
    strip_rain(&g, 10, -3, out);
    assert_close(out[0], 0, 0);
    strip_rain(&g, 10, (double)NAN, out);
    assert_close(out[20], 0, 0);
}

/* Hand-worked (by hand for this file): pitch 6, chord 2, drip 0.2, 6
 * strips of 1 m.  R = 30: projection half-width cos 30 = 0.86603, the
 * lower edge is at -0.86603 (afternoon, facing -x), its band
 * [-0.96603, -0.76603] lies in strip 2 = [-1, 0].  Strip 2 gets rain on
 * [-1, -0.86603] plus all 1.73205 m of caught rain: 1.86603 rain; strip 3
 * gets [0.86603, 1]: 0.13397 rain; the rest 1.  R = -30 (morning) is the
 * mirror image: the drip lands at the +x (east) edge. */
static void test_rain_hand(void **state)
{
    (void)state;
    strip_geom g = {6.0, 2.0, 2.0, 6, STRIP_ROWS_ENDLESS, 0.2, 1.0};
    double out[6];
    double want[6] = {1, 1, 1.86603, 0.13397, 1, 1};
    strip_rain(&g, 30, 1, out);
    for (int i = 0; i < 6; i++) assert_close(out[i], want[i], 1e-5);
    strip_rain(&g, -30, 1, out);
    for (int i = 0; i < 6; i++) assert_close(out[i], want[5 - i], 1e-5);
    /* Flat (|R| < flat_deg): each edge sheds half, 1 m mm over a 0.2 m
     * band centred on +-1, half of each band in the strip beyond the edge:
     * strip 1 = 1 + 0.5, strip 2 = 0.5 (by hand). */
    double flat[6] = {1, 1.5, 0.5, 0.5, 1.5, 1};
    strip_rain(&g, 0, 1, out);
    for (int i = 0; i < 6; i++) assert_close(out[i], flat[i], 1e-12);
    /* Nearly flat, R = 0.5 < flat_deg: the edges move in by 1 - cos 0.5
     * deg = 3.8e-5 m, shifting 3.8e-5 m of each 5 mm/m band: within 1e-3. */
    strip_rain(&g, 0.5, 1, out);
    for (int i = 0; i < 6; i++) assert_close(out[i], flat[i], 1e-3);
}

/* Wrap-around (by hand): pitch 2.2, chord 2, R = 20, drip 0.6, 2 strips of
 * 1.1.  Lower edge at -cos 20 = -0.93969, band [-1.23969, -0.63969]; its
 * 0.13969 m past -1.1 wraps to [0.96031, 1.1] in strip 1.  Caught
 * 1.879385 mm m at 3.132309 mm per m of band (values checked in python).
 * Strip 0: direct 0.160307 + 0.460307 * 3.132309 = 1.602132 -> 1.456484
 * mm; strip 1: direct 0.160307 + 0.139693 * 3.132309 = 0.597868 ->
 * 0.543516 mm (per mm of rain). */
static void test_rain_wrap(void **state)
{
    (void)state;
    strip_geom g = {2.2, 2.0, 1.5, 2, STRIP_ROWS_ENDLESS, 0.6, 1.0};
    double out[2];
    strip_rain(&g, 20, 1, out);
    assert_close(out[0], 1.456484, 2e-6);
    assert_close(out[1], 0.543516, 2e-6);
}

/* Morning rain ends at the east (+x) edge, afternoon at the west (the
 * brief's rule).  With a drip band narrower than a tenth of the chord and
 * |R| <= 60 the whole band lies in the lower edge's half of the pitch
 * (edge at |x| >= chord/4, band within 0.05 chord of it, pitch > 1.1
 * chord), so that half gets rain (pitch/2 + hw) and the other rain (pitch/2
 * - hw), hw = chord cos R / 2 (by hand from the rain rule).  Even strip
 * counts, so the halves are whole strips. */
static void test_rain_side(void **state)
{
    (void)state;
    for (int c = 0; c < 200; c++) {
        strip_geom g = random_geom();
        g.n_strips = 2 * (1 + (int)(urand() * 6)); /* even, 2..12 */
        g.drip_width_m = urange(0, 0.1) * g.chord_m;
        double rot = urange(g.flat_deg + 0.01, 60), out[12], rain = 5;
        double hw = g.chord_m * cos(rot * D2R) / 2, w = strip_width_m(&g);
        int h = g.n_strips / 2;
        for (int sign = 1; sign >= -1; sign -= 2) {
            strip_rain(&g, sign * rot, rain, out);
            double west = 0, east = 0;
            for (int i = 0; i < h; i++) west += out[i] * w;
            for (int i = h; i < g.n_strips; i++) east += out[i] * w;
            double low = rain * (g.pitch_m / 2 + hw);  /* lower edge's half */
            double high = rain * (g.pitch_m / 2 - hw);
            double tol = 1e-9 * rain * g.pitch_m;
            assert_close(sign > 0 ? west : east, low, tol);
            assert_close(sign > 0 ? east : west, high, tol);
        }
    }
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_geom_check),
        cmocka_unit_test(test_crossed_strings_known),
        cmocka_unit_test(test_crossed_strings_vs_point_formula),
        cmocka_unit_test(test_sky_hand_check),
        cmocka_unit_test(test_sky_mirror),
        cmocka_unit_test(test_sky_reciprocity_flat),
        cmocka_unit_test(test_sky_large_pitch),
        cmocka_unit_test(test_sky_vs_rays),
        cmocka_unit_test(test_sky_table),
        cmocka_unit_test(test_beam_hand),
        cmocka_unit_test(test_beam_shadow_width),
        cmocka_unit_test(test_beam_vs_rays),
        cmocka_unit_test(test_rain_conservation),
        cmocka_unit_test(test_rain_hand),
        cmocka_unit_test(test_rain_wrap),
        cmocka_unit_test(test_rain_side),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
