/* strips.h - beam light, sky light and rain reaching the ground strips of
 * one tracker row pitch.  See strips.c for the geometry and references.
 *
 * Conventions (the cross-section plane perpendicular to the tracker axis):
 *   x (m) positive towards the side the sun rises on, z (m) up; tracker
 *   axes at x = k * pitch_m, height hub_m; the panel is a segment of width
 *   chord_m centred on its axis.  rot_deg > 0 turns the panel to face -x
 *   (its -x edge is the lower one); 0 is flat.  theta_deg is the sun's
 *   zenith angle projected on the plane, > 0 when the sun is towards -x, so
 *   the direction to the sun is (-sin theta, cos theta).  The pitch from
 *   -pitch_m/2 to +pitch_m/2 is cut into n_strips equal strips, strip 0
 *   being the -x-most; row 0's panel stands over the middle.
 *
 * Every function except strip_geom_check() expects a geometry that
 * strip_geom_check() accepted; it is not checked again.
 */
#ifndef STRIPS_H
#define STRIPS_H

#include <stddef.h>

/* n_rows_each_side value for an endless field of rows. */
#define STRIP_ROWS_ENDLESS (-1)

/* Largest n_strips and finite n_rows_each_side strip_geom_check accepts. */
#define STRIP_MAX_STRIPS 10000
#define STRIP_MAX_ROWS 100000

typedef struct {
    double pitch_m;       /* distance between tracker axes */
    double chord_m;       /* panel width across the axis */
    double hub_m;         /* axis height above the ground */
    int n_strips;         /* ground strips across one pitch */
    int n_rows_each_side; /* STRIP_ROWS_ENDLESS: endless field (exact for
                             beam and rain; sky view to within 2e-6);
                             0: a lone panel; N > 0: N neighbours a side */
    double drip_width_m;  /* width of the band a panel edge drips onto */
    double flat_deg;      /* |rot| below this sheds rain to both edges */
} strip_geom;

/* A point of the cross-section plane. */
typedef struct {
    double x_m, z_m;
} strip_point;

/* Returns 0 if g is usable: all values finite, 0 < chord_m < pitch_m (rows
 * never touch), hub_m > chord_m/2 (a panel never touches the ground at any
 * angle up to 90 deg), 1 <= n_strips <= STRIP_MAX_STRIPS, n_rows_each_side
 * STRIP_ROWS_ENDLESS or 0..STRIP_MAX_ROWS, drip_width_m >= 0 and
 * 0 <= flat_deg <= 90.  Otherwise returns -1 and writes the reason to err
 * (if err is not NULL and errlen > 0). */
int strip_geom_check(const strip_geom *g, char *err, size_t errlen);

/* Width of one strip, pitch_m / n_strips. */
double strip_width_m(const strip_geom *g);

/* Writes to lit_share[0..n_strips-1] the fraction of each strip's width
 * that the sun's beam reaches (shadows of all panels considered, exact
 * interval arithmetic, O(n_strips) time).  theta_deg with |theta| >= 90 or
 * NaN (sun not above the horizon in the plane) gives 0 everywhere.  Angle
 * handling of rot_deg: outside [-90, 90] it is clamped, NaN counts as 0. */
void strip_beam(const strip_geom *g, double rot_deg, double theta_deg,
                double *lit_share);

/* Isotropic-sky view factor (0..1) from a point of the ground at x_m to the
 * sky between the panels: the sky directions left open by the panels,
 * weighted by the 2-D point formula F = (cos p1 - cos p2)/2.  Any x_m may
 * be given (in an endless field it is reduced modulo the pitch).  rot_deg
 * is handled as in strip_beam; a non-finite x_m gives NaN. */
double strip_sky_view_at(const strip_geom *g, double rot_deg, double x_m);

/* Writes to vf[0..n_strips-1] each strip's sky view factor, the mean of
 * strip_sky_view_at() over samples_per_strip evenly spaced points (the
 * midpoints of equal parts of the strip); samples_per_strip < 1 counts
 * as 1.  Cost grows with the rows needing a look: in an endless field up
 * to about 500 * (hub_m + chord_m/2) / pitch_m rows a side for panels
 * near flat, a handful for tilted ones. */
void strip_sky_view(const strip_geom *g, double rot_deg,
                    int samples_per_strip, double *vf);

/* Writes to rain_strip_mm[0..n_strips-1] the rain depth (mm over the
 * strip's area) each strip receives when rain_mm falls vertically.  Rain on
 * the panel's horizontal projection drips off its lower edge, spread evenly
 * over a band drip_width_m wide centred under that edge and wrapped round
 * the pitch (the neighbouring rows drip into this pitch the same way); a
 * panel with |rot| < flat_deg, or exactly flat, sheds half to each edge; a
 * zero drip width drops it all in the strip under the edge.  The total is
 * kept: sum rain_strip_mm * strip width == rain_mm * pitch_m.  rain_mm that
 * is not a finite number > 0 gives 0 everywhere; rot_deg as in strip_beam. */
void strip_rain(const strip_geom *g, double rot_deg, double rain_mm,
                double *rain_strip_mm);

/* View factor from segment A (a0-a1) to segment B (b0-b1) of an infinitely
 * long 2-D geometry by Hottel's crossed strings, valid when nothing blocks
 * the view and neither segment reaches across the other's line.  The
 * endpoint order does not matter.  A of zero length gives 0. */
double strip_crossed_strings(strip_point a0, strip_point a1, strip_point b0,
                             strip_point b1);

/* A table of strip_sky_view() over rot_deg from -90 to 90 in 0.5 deg steps
 * for one geometry.  Opaque; counted references (strip_sky_table_ref),
 * released by strip_sky_table_free(). */
typedef struct strip_sky_table strip_sky_table;

/* Builds the table (361 calls of strip_sky_view).  Returns a table the
 * caller must release with strip_sky_table_free(), or NULL if the geometry
 * fails strip_geom_check() or memory runs out.  The table keeps no pointer
 * to g. */
strip_sky_table *strip_sky_table_build(const strip_geom *g,
                                       int samples_per_strip);

/* Writes to vf[0..n-1] (n = the table's n_strips) the view factors at
 * rot_deg, linearly interpolated between the table's angles; rot_deg is
 * clamped to [-90, 90] and NaN counts as 0. */
void strip_sky_table_lookup(const strip_sky_table *t, double rot_deg,
                            double *vf);

/* Number of strips the table holds values for. */
int strip_sky_table_strips(const strip_sky_table *t);

/* Another reference to t (which is freed when its last reference is
 * released); returns t. */
strip_sky_table *strip_sky_table_ref(strip_sky_table *t);

/* Releases a reference from strip_sky_table_build() or
 * strip_sky_table_ref(), freeing the table with its last one; NULL is
 * ignored. */
void strip_sky_table_free(strip_sky_table *t);

#endif
