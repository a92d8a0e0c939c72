/* strips.c - beam light, sky light and rain reaching the ground strips of
 * one tracker row pitch, in the 2-D cross-section of long parallel rows.
 *
 * How the pieces fit.  Everything starts from the two edges of row 0's
 * panel (panel_edges); every other row is the same panel moved by k pitches.
 *
 *   Beam.  A panel edge at (x, z) casts its shadow along the sun ray onto
 *   the ground at x + z tan(theta), so one panel shades an interval of
 *   width  chord |cos R cos theta + sin R sin theta| / cos theta
 *        = chord |cos(R - theta)| / cos theta,
 *   and row k shades the same interval moved by k pitches.  In an endless
 *   field the union of all shadows met by one pitch is row 0's shadow taken
 *   modulo the pitch (at most two pieces, or the whole pitch once the
 *   shadow is at least a pitch wide); with N rows a side only the few rows
 *   whose shadow meets the pitch are added.  Each piece is added to the
 *   strips it covers (add_cover), so a call costs O(n_strips).
 *
 *   Sky.  Seen from a ground point x0 an edge at (x, z) lies in the
 *   direction whose angle p from the +x ground has cos p = u = dx / |(dx, z)|
 *   with dx = x - x0.  In u the isotropic-sky weight is uniform: the 2-D
 *   point formula F = (cos p1 - cos p2)/2 makes the view factor of a set of
 *   directions half its length in u, and the whole sky u in [-1, 1] has
 *   view factor 1.  A panel hides the u interval between its edges' u.
 *   Moving a panel by +pitch raises both edges' u, so the intervals of rows
 *   ..., -1, 0, 1, ... are already in order and one merge pass gives their
 *   union.  The rows k >= 0 and the rows k <= 0 are merged separately,
 *   walking outwards (side_blocked; the -x side by mirroring x): the two
 *   unions meet exactly in row 0's interval, so
 *     hidden = |union k>=0| + |union k<=0| - |row 0|,  vf = 1 - hidden/2.
 *   In an endless field a side stops either when (a) the high edge of row
 *   k+1 is seen below the low edge of row k: the condition
 *   zh dxl >= zl (dxh + pitch) only gets easier further out when zh > zl,
 *   so every later row overlaps the one before and their union runs
 *   unbroken to the horizon (u = 1), which is then exact; or (b) all the
 *   rows left lie within SKY_TAIL_TOL of the horizon in view factor.
 *   Flat panels (zh == zl) only ever stop by (b).
 *
 *   Rain.  Vertical rain on the panel's horizontal projection (width
 *   chord cos R) drips off the lower edge into a band spread evenly and
 *   wrapped round the pitch (add_periodic); the rest of the pitch gets the
 *   rain directly.
 *
 * References.
 *   Hottel, H.C. (1954) Radiant-heat transmission. Ch. 4 in McAdams, W.H.,
 *     Heat Transmission, 3rd ed., McGraw-Hill: the crossed-strings method.
 *   Modest, M.F. (2013) Radiative Heat Transfer, 3rd ed., Academic Press,
 *     ch. 4 (view factors; crossed strings; the view factor from an
 *     infinitesimal strip to an infinitely long surface, (sin a2 - sin a1)/2
 *     with angles from the normal, i.e. (cos p1 - cos p2)/2 with angles from
 *     the ground plane).  Section numbers not given: from memory.
 */
#include "strips.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>

#define DEG_TO_RAD (3.14159265358979323846 / 180.0)

/* Sky view factor a side of an endless field may leave unaccounted. */
#define SKY_TAIL_TOL 1e-6

/* Table of strip_sky_view over rotation. */
#define TABLE_STEP_DEG 0.5
#define TABLE_ANGLES 361 /* -90 .. 90 */

struct strip_sky_table {
    int refs;   /* references held (strip_sky_table_ref) */
    int n_strips;
    double *vf; /* TABLE_ANGLES rows of n_strips values */
};

/* ---- geometry check ---------------------------------------------------- */

static int fail(char *err, size_t errlen, const char *msg)
{
    if (err && errlen > 0) snprintf(err, errlen, "%s", msg);
    return -1;
}

int strip_geom_check(const strip_geom *g, char *err, size_t errlen)
{
    if (!g) return fail(err, errlen, "no geometry");
    if (!isfinite(g->pitch_m) || !isfinite(g->chord_m) ||
        !isfinite(g->hub_m) || !isfinite(g->drip_width_m) ||
        !isfinite(g->flat_deg))
        return fail(err, errlen, "geometry values must be finite numbers");
    if (!(g->chord_m > 0)) return fail(err, errlen, "chord_m must be > 0");
    if (!(g->pitch_m > g->chord_m))
        return fail(err, errlen, "pitch_m must exceed chord_m");
    if (!(g->hub_m > g->chord_m / 2))
        return fail(err, errlen, "hub_m must exceed chord_m / 2");
    if (g->n_strips < 1 || g->n_strips > STRIP_MAX_STRIPS)
        return fail(err, errlen, "n_strips out of range");
    if (g->n_rows_each_side < STRIP_ROWS_ENDLESS ||
        g->n_rows_each_side > STRIP_MAX_ROWS)
        return fail(err, errlen, "n_rows_each_side out of range");
    if (!(g->drip_width_m >= 0))
        return fail(err, errlen, "drip_width_m must be >= 0");
    if (!(g->flat_deg >= 0 && g->flat_deg <= 90))
        return fail(err, errlen, "flat_deg must be within 0..90");
    return 0;
}

double strip_width_m(const strip_geom *g)
{
    return g->pitch_m / g->n_strips;
}

/* ---- shared helpers ---------------------------------------------------- */

static double clamp_rot(double rot_deg)
{
    if (isnan(rot_deg)) return 0;
    if (rot_deg > 90) return 90;
    if (rot_deg < -90) return -90;
    return rot_deg;
}

/* Row 0's panel edges at rotation rot_deg (already clamped): lo is the
 * lower edge, hi the higher (for a flat panel lo is the -x edge). */
static void panel_edges(const strip_geom *g, double rot_deg, strip_point *lo,
                        strip_point *hi)
{
    double r = rot_deg * DEG_TO_RAD, h = g->chord_m / 2;
    strip_point west = {-h * cos(r), g->hub_m - h * sin(r)};
    strip_point east = {h * cos(r), g->hub_m + h * sin(r)};
    if (rot_deg >= 0) {
        *lo = west;
        *hi = east;
    } else {
        *lo = east;
        *hi = west;
    }
}

static void zero(double *v, int n)
{
    for (int i = 0; i < n; i++) v[i] = 0;
}

/* Adds weight times the length of [lo, hi] within each strip to acc[i];
 * the interval is first cut to the pitch. */
static void add_cover(const strip_geom *g, double lo, double hi,
                      double weight, double *acc)
{
    int n = g->n_strips;
    double half = g->pitch_m / 2, w = strip_width_m(g);
    if (lo < -half) lo = -half;
    if (hi > half) hi = half;
    if (!(hi > lo)) return;
    /* One strip of slack each way against rounding in floor(). */
    int i0 = (int)floor((lo + half) / w) - 1;
    int i1 = (int)floor((hi + half) / w) + 1;
    if (i0 < 0) i0 = 0;
    if (i1 > n - 1) i1 = n - 1;
    for (int i = i0; i <= i1; i++) {
        double a = -half + i * w;
        double b = (i == n - 1) ? half : -half + (i + 1) * w;
        double len = fmin(hi, b) - fmax(lo, a);
        if (len > 0) acc[i] += weight * len;
    }
}

/* Adds density (per metre) over [lo, hi] of the periodic ground, i.e. with
 * every part outside the pitch moved back into it by whole pitches. */
static void add_periodic(const strip_geom *g, double lo, double hi,
                         double density, double *acc)
{
    double p = g->pitch_m, half = p / 2;
    double len = hi - lo, full = floor(len / p), rem = len - full * p;
    if (full > 0) add_cover(g, -half, half, density * full, acc);
    double s = lo - p * floor((lo + half) / p), e = s + rem;
    if (e <= half) {
        add_cover(g, s, e, density, acc);
    } else {
        add_cover(g, s, half, density, acc);
        add_cover(g, -half, e - p, density, acc);
    }
}

/* ---- beam -------------------------------------------------------------- */

/* Shadow of row 0's panel on the ground, [*s0, *s1]; see the file top. */
static void shadow(const strip_geom *g, double rot_deg, double theta_deg,
                   double *s0, double *s1)
{
    strip_point lo, hi;
    panel_edges(g, rot_deg, &lo, &hi);
    double t = tan(theta_deg * DEG_TO_RAD);
    double a = lo.x_m + lo.z_m * t, b = hi.x_m + hi.z_m * t;
    *s0 = fmin(a, b);
    *s1 = fmax(a, b);
}

/* Shadows of an endless field: row 0's shadow modulo the pitch. */
static void shade_endless(const strip_geom *g, double s0, double s1,
                          double *shade)
{
    double p = g->pitch_m, half = p / 2;
    if (s1 - s0 >= p) {
        add_cover(g, -half, half, 1, shade);
        return;
    }
    double m = floor((s0 + half) / p);
    s0 -= m * p;
    s1 -= m * p;
    add_cover(g, s0, fmin(s1, half), 1, shade);
    if (s1 > half) add_cover(g, -half, s1 - p, 1, shade);
}

/* Shadows of rows -N..N (N = n_rows_each_side >= 0). */
static void shade_rows(const strip_geom *g, double s0, double s1,
                       double *shade)
{
    double p = g->pitch_m, half = p / 2, n = g->n_rows_each_side;
    if (s1 - s0 >= p) { /* neighbouring shadows join into one */
        add_cover(g, s0 - n * p, s1 + n * p, 1, shade);
        return;
    }
    double k0 = fmax(ceil((-half - s1) / p), -n);
    double k1 = fmin(floor((half - s0) / p), n);
    for (double k = k0; k <= k1; k++)
        add_cover(g, s0 + k * p, s1 + k * p, 1, shade);
}

void strip_beam(const strip_geom *g, double rot_deg, double theta_deg,
                double *lit_share)
{
    int n = g->n_strips;
    double w = strip_width_m(g), s0, s1;
    zero(lit_share, n); /* first holds the shaded metres of each strip */
    if (!(fabs(theta_deg) < 90)) return;
    shadow(g, clamp_rot(rot_deg), theta_deg, &s0, &s1);
    if (g->n_rows_each_side == STRIP_ROWS_ENDLESS)
        shade_endless(g, s0, s1, lit_share);
    else
        shade_rows(g, s0, s1, lit_share);
    for (int i = 0; i < n; i++)
        lit_share[i] = fmin(1, fmax(0, 1 - lit_share[i] / w));
}

/* ---- sky --------------------------------------------------------------- */

/* cos of the angle from the +x ground to the point (dx, z), z > 0. */
static double ucos(double dx, double z)
{
    return dx / sqrt(dx * dx + z * z);
}

/* Length in u of the union of the intervals hidden by rows k = 0, 1, 2, ...
 * seen from (x0, 0): rows up to n_rows, or in an endless field (n_rows < 0)
 * until one of the stopping rules of the file top holds.  lo, hi are row
 * 0's lower and higher edges; x0 lies within the pitch when endless. */
static double side_blocked(strip_point lo, strip_point hi, double x0,
                           double p, int n_rows)
{
    double run_s = fmin(ucos(lo.x_m - x0, lo.z_m), ucos(hi.x_m - x0, hi.z_m));
    double run_e = fmax(ucos(lo.x_m - x0, lo.z_m), ucos(hi.x_m - x0, hi.z_m));
    double total = 0;
    for (int k = 1; n_rows < 0 || k <= n_rows; k++) {
        double dxl = lo.x_m + k * p - x0, dxh = hi.x_m + k * p - x0;
        double ul = ucos(dxl, lo.z_m), uh = ucos(dxh, hi.z_m);
        double a = fmin(ul, uh), b = fmax(ul, uh);
        int last = 0;
        if (n_rows < 0) {
            if (1 - a <= 2 * SKY_TAIL_TOL) break; /* rule (b) */
            if (hi.z_m > lo.z_m && hi.z_m * dxl >= lo.z_m * (dxh + p)) {
                b = 1; /* rule (a): unbroken to the horizon */
                last = 1;
            }
        }
        if (a <= run_e) {
            run_e = fmax(run_e, b);
        } else {
            total += run_e - run_s;
            run_s = a;
            run_e = b;
        }
        if (last) break;
    }
    return total + (run_e - run_s);
}

/* The 2-D point formula F = (cos p1 - cos p2)/2 per open sky gap (Modest
 * 2013 ch. 4), summed as 1 - (hidden length in u)/2; see the file top. */
double strip_sky_view_at(const strip_geom *g, double rot_deg, double x_m)
{
    double p = g->pitch_m;
    strip_point lo, hi;
    if (!isfinite(x_m)) return (double)NAN;
    if (g->n_rows_each_side == STRIP_ROWS_ENDLESS)
        x_m -= p * floor((x_m + p / 2) / p);
    panel_edges(g, clamp_rot(rot_deg), &lo, &hi);
    double own = fabs(ucos(lo.x_m - x_m, lo.z_m) - ucos(hi.x_m - x_m, hi.z_m));
    double east = side_blocked(lo, hi, x_m, p, g->n_rows_each_side);
    strip_point mlo = {-lo.x_m, lo.z_m}, mhi = {-hi.x_m, hi.z_m};
    double west = side_blocked(mlo, mhi, -x_m, p, g->n_rows_each_side);
    double vf = 1 - (east + west - own) / 2;
    return fmin(1, fmax(0, vf));
}

void strip_sky_view(const strip_geom *g, double rot_deg,
                    int samples_per_strip, double *vf)
{
    int n = g->n_strips, s = samples_per_strip < 1 ? 1 : samples_per_strip;
    double w = strip_width_m(g), half = g->pitch_m / 2;
    for (int i = 0; i < n; i++) {
        double sum = 0;
        for (int j = 0; j < s; j++) {
            double x = -half + (i + (j + 0.5) / s) * w;
            sum += strip_sky_view_at(g, rot_deg, x);
        }
        vf[i] = sum / s;
    }
}

/* ---- rain -------------------------------------------------------------- */

/* Drops amount (mm m) round the edge at x_m: over the drip band, or into
 * the strip under the edge when the band has no width. */
static void drip(const strip_geom *g, double x_m, double amount,
                 double *acc)
{
    double dw = g->drip_width_m;
    if (dw > 0) {
        add_periodic(g, x_m - dw / 2, x_m + dw / 2, amount / dw, acc);
        return;
    }
    double p = g->pitch_m, half = p / 2;
    double x = x_m - p * floor((x_m + half) / p);
    int i = (int)floor((x + half) / strip_width_m(g));
    if (i < 0) i = 0;
    if (i > g->n_strips - 1) i = g->n_strips - 1;
    acc[i] += amount;
}

void strip_rain(const strip_geom *g, double rot_deg, double rain_mm,
                double *rain_strip_mm)
{
    int n = g->n_strips;
    double half = g->pitch_m / 2, w = strip_width_m(g);
    zero(rain_strip_mm, n);
    if (!(rain_mm > 0) || !isfinite(rain_mm)) return;
    double r = clamp_rot(rot_deg);
    double hw = g->chord_m / 2 * cos(r * DEG_TO_RAD); /* projection half */
    add_cover(g, -half, -hw, rain_mm, rain_strip_mm);
    add_cover(g, hw, half, rain_mm, rain_strip_mm);
    double caught = rain_mm * 2 * hw;
    if (fabs(r) < g->flat_deg || r == 0) {
        drip(g, -hw, caught / 2, rain_strip_mm);
        drip(g, hw, caught / 2, rain_strip_mm);
    } else {
        drip(g, r > 0 ? -hw : hw, caught, rain_strip_mm);
    }
    for (int i = 0; i < n; i++) rain_strip_mm[i] /= w;
}

/* ---- crossed strings --------------------------------------------------- */

static double dist(strip_point a, strip_point b)
{
    return hypot(a.x_m - b.x_m, a.z_m - b.z_m);
}

/* Hottel (1954); Modest (2013) ch. 4: F_AB = (sum of crossed strings - sum
 * of uncrossed strings) / (2 |A|).  Which pair is crossed depends on the
 * order the endpoints were given in, hence the absolute value. */
double strip_crossed_strings(strip_point a0, strip_point a1, strip_point b0,
                             strip_point b1)
{
    double len = dist(a0, a1);
    if (!(len > 0)) return 0;
    double crossed = dist(a0, b1) + dist(a1, b0);
    double uncrossed = dist(a0, b0) + dist(a1, b1);
    return fabs(crossed - uncrossed) / (2 * len);
}

/* ---- sky table --------------------------------------------------------- */

strip_sky_table *strip_sky_table_build(const strip_geom *g,
                                       int samples_per_strip)
{
    if (strip_geom_check(g, NULL, 0) != 0) return NULL;
    strip_sky_table *t = malloc(sizeof *t);
    if (!t) return NULL;
    t->refs = 1;
    t->n_strips = g->n_strips;
    t->vf = malloc(sizeof(double) * (size_t)TABLE_ANGLES * (size_t)g->n_strips);
    if (!t->vf) {
        free(t);
        return NULL;
    }
    for (int a = 0; a < TABLE_ANGLES; a++)
        strip_sky_view(g, -90 + a * TABLE_STEP_DEG, samples_per_strip,
                       t->vf + (size_t)a * (size_t)g->n_strips);
    return t;
}

void strip_sky_table_lookup(const strip_sky_table *t, double rot_deg,
                            double *vf)
{
    int n = t->n_strips;
    double pos = (clamp_rot(rot_deg) + 90) / TABLE_STEP_DEG;
    int a = (int)floor(pos);
    if (a > TABLE_ANGLES - 2) a = TABLE_ANGLES - 2;
    double f = pos - a;
    const double *r0 = t->vf + (size_t)a * (size_t)n, *r1 = r0 + n;
    for (int i = 0; i < n; i++) vf[i] = r0[i] + f * (r1[i] - r0[i]);
}

int strip_sky_table_strips(const strip_sky_table *t)
{
    return t->n_strips;
}

strip_sky_table *strip_sky_table_ref(strip_sky_table *t)
{
    t->refs++;
    return t;
}

void strip_sky_table_free(strip_sky_table *t)
{
    if (!t || --t->refs > 0) return;
    free(t->vf);
    free(t);
}
