/* tracker.c - rotation angle of a single-axis tracker row.
 *
 * How the pieces fit: trk_sun_frame turns the sun's zenith and azimuth into
 * the tracker's own frame; trk_ideal_deg is the true-tracking angle, the
 * angle that faces the sun as seen in the cross-section (Marion & Dobos
 * 2013; Anderson & Mikofski 2020 show that their true-tracking angle is the
 * same quantity, so one function serves both).  trk_backtrack_deg turns it
 * away from the sun just enough that rows stop shading each other, on ground
 * that may slope across the axis; trk_axis_tilt_on_slope_deg and
 * trk_cross_axis_slope_deg derive that slope geometry from the terrain.
 * trk_angle_deg applies a row's settings: stow -> night -> track/backtrack
 * -> clip.
 *
 * References:
 *   Marion, W.F. & Dobos, A.P. (2013) Rotation Angle for the Optimum Tracking
 *     of One-Axis Trackers. NREL/TP-6A20-58891.
 *   Anderson, K. & Mikofski, M. (2020) Slope-Aware Backtracking for
 *     Single-Axis Trackers. NREL/TP-5K00-76626.
 *   Lorenzo, E., Narvarte, L. & Munoz, J. (2011) Tracking and back-tracking.
 *     Prog. Photovolt. Res. Appl. 19:747-753 (the flat-ground case).
 */
#include "tracker.h"

#include <math.h>
#include <stddef.h>

#define TRK_PI 3.14159265358979323846
/* NAN is a float; the cast keeps -Wdouble-promotion quiet. */
#define TRK_NAN ((double)NAN)

static double rad(double deg) { return deg * (TRK_PI / 180.0); }
static double deg(double r) { return r * (180.0 / TRK_PI); }

static int finite3(double a, double b, double c)
{
    return isfinite(a) && isfinite(b) && isfinite(c);
}

/* The three unit vectors of the tracker frame are, in (east, north, up):
 *   x = (-cos Aa, sin Aa, 0)                       across, towards Aa - 90
 *   y = (cos Ba sin Aa, cos Ba cos Aa, -sin Ba)    along the axis, downhill
 *   z = (sin Ba sin Aa, sin Ba cos Aa, cos Ba)     normal to the level panel
 * and the sun is s = (sin Z sin As, sin Z cos As, cos Z).  The dot products
 * reduce to functions of As - Aa only. */
void trk_sun_frame(double zenith_deg, double azimuth_deg,
                   double axis_azimuth_deg, double axis_tilt_deg,
                   double *x, double *y, double *z)
{
    double zen = rad(zenith_deg), rel = rad(azimuth_deg - axis_azimuth_deg);
    double ba = rad(axis_tilt_deg);

    *x = -sin(zen) * sin(rel);
    *y = sin(zen) * cos(rel) * cos(ba) - cos(zen) * sin(ba);
    *z = sin(zen) * cos(rel) * sin(ba) + cos(zen) * cos(ba);
}

/* Marion & Dobos (2013) eq. 7 with the quadrant rules that follow it
 * (equation number from memory; not re-read against the report):
 *   R = atan[ sin Z sin(As - Aa) /
 *             (sin Z cos(As - Aa) sin Ba + cos Z cos Ba) ],
 * placed in the right quadrant, which two-argument atan2 does directly.
 * Numerator and denominator are -x and z of trk_sun_frame. */
double trk_ideal_deg(double zenith_deg, double azimuth_deg,
                     double axis_azimuth_deg, double axis_tilt_deg)
{
    double zen = rad(zenith_deg), rel = rad(azimuth_deg - axis_azimuth_deg);
    double ba = rad(axis_tilt_deg);
    double num, den;

    if (!finite3(zenith_deg, azimuth_deg, axis_azimuth_deg) ||
        !isfinite(axis_tilt_deg))
        return TRK_NAN;
    num = sin(zen) * sin(rel);
    den = sin(zen) * cos(rel) * sin(ba) + cos(zen) * cos(ba);
    return deg(atan2(num, den));
}

/* Anderson & Mikofski (2020) eq. 14:
 *   theta_c = -sign(theta_T) acos( |cos(theta_T - beta_c)| /
 *                                  (gcr cos beta_c) ),
 *   theta_B = theta_T + theta_c,
 * applied only while the argument of acos is below 1; at 1 or above no row
 * shades its neighbour and the row tracks (their eqs. 15-16).  gcr is chord
 * over the horizontal pitch. */
double trk_backtrack_deg(double ideal_deg, double gcr,
                         double cross_axis_slope_deg)
{
    double bc = rad(cross_axis_slope_deg), ratio;

    if (!finite3(ideal_deg, gcr, cross_axis_slope_deg) || !(gcr > 0.0) ||
        gcr > 1.0 || !(fabs(cross_axis_slope_deg) < 90.0))
        return TRK_NAN;
    ratio = fabs(cos(rad(ideal_deg) - bc)) / (gcr * cos(bc));
    if (ratio >= 1.0)
        return ideal_deg;
    return ideal_deg - copysign(deg(acos(ratio)), ideal_deg);
}

/* Anderson & Mikofski (2020): an axis laid in the slope plane, pointing
 * horizontally along Aa, descends tan(beta_g) cos(Aa - gamma_g) per unit of
 * horizontal run, so beta_a = atan(tan beta_g cos(Aa - gamma_g)). */
double trk_axis_tilt_on_slope_deg(double slope_tilt_deg,
                                  double slope_azimuth_deg,
                                  double axis_azimuth_deg)
{
    if (!finite3(slope_tilt_deg, slope_azimuth_deg, axis_azimuth_deg) ||
        slope_tilt_deg < 0.0 || slope_tilt_deg >= 90.0)
        return TRK_NAN;
    return deg(atan(tan(rad(slope_tilt_deg)) *
                    cos(rad(axis_azimuth_deg - slope_azimuth_deg))));
}

/* The report defines the cross-axis slope beta_c as the angle, within the
 * plane normal to the axis, between the horizontal and the line where that
 * plane meets the slope.  Derived here (not the report's own closed form):
 * the panel lies in the slope exactly when its normal is the slope's normal,
 * and the rotation that points the panel normal at a given direction is the
 * true-tracking angle of that direction.  So beta_c is trk_ideal_deg with
 * the slope normal (zenith = slope tilt, azimuth = downhill direction) in
 * place of the sun.  The test checks it against the report's worked
 * example. */
double trk_cross_axis_slope_deg(double slope_tilt_deg,
                                double slope_azimuth_deg,
                                double axis_azimuth_deg,
                                double axis_tilt_deg)
{
    if (!(slope_tilt_deg >= 0.0 && slope_tilt_deg < 90.0))
        return TRK_NAN;
    return trk_ideal_deg(slope_tilt_deg, slope_azimuth_deg, axis_azimuth_deg,
                         axis_tilt_deg);
}

static int within(double v, double limit)
{
    return isfinite(v) && fabs(v) <= limit;
}

const char *trk_config_check(const trk_config *cfg)
{
    if (cfg == NULL)
        return "tracker: no configuration";
    if (!isfinite(cfg->axis_azimuth_deg))
        return "tracker: axis azimuth must be finite";
    if (!(cfg->axis_tilt_deg >= 0.0 && cfg->axis_tilt_deg < 90.0))
        return "tracker: axis tilt must be in [0, 90) degrees";
    if (!(cfg->gcr > 0.0 && cfg->gcr <= 1.0))
        return "tracker: gcr must be in (0, 1]";
    if (!(fabs(cfg->cross_axis_slope_deg) < 90.0))
        return "tracker: cross-axis slope must be within (-90, 90) degrees";
    if (!(cfg->max_angle_deg > 0.0 && cfg->max_angle_deg <= 90.0))
        return "tracker: rotation limit must be in (0, 90] degrees";
    if (!within(cfg->night_angle_deg, cfg->max_angle_deg))
        return "tracker: night angle must lie within the rotation limit";
    if (!within(cfg->stow_angle_deg, cfg->max_angle_deg))
        return "tracker: stow angle must lie within the rotation limit";
    if (!isfinite(cfg->stow_wind_m_s))
        return "tracker: stow wind threshold must be finite";
    return NULL;
}

static double clip(double angle_deg, double limit_deg)
{
    if (angle_deg > limit_deg)
        return limit_deg;
    if (angle_deg < -limit_deg)
        return -limit_deg;
    return angle_deg;
}

double trk_angle_deg(const trk_config *cfg, double zenith_deg,
                     double azimuth_deg, double wind_m_s)
{
    double angle;

    if (trk_config_check(cfg) != NULL || !isfinite(zenith_deg) ||
        !isfinite(azimuth_deg))
        return TRK_NAN;
    /* wind protection runs day and night, so stow comes first: a night
     * storm finds the panels at the stow angle, which decides where its
     * rain lands (common practice, no source) */
    if (cfg->stow_wind_m_s > 0.0 && wind_m_s > cfg->stow_wind_m_s)
        return cfg->stow_angle_deg;
    if (zenith_deg >= 90.0)
        return cfg->night_angle_deg;
    angle = trk_ideal_deg(zenith_deg, azimuth_deg, cfg->axis_azimuth_deg,
                          cfg->axis_tilt_deg);
    if (cfg->backtrack)
        angle = trk_backtrack_deg(angle, cfg->gcr, cfg->cross_axis_slope_deg);
    return clip(angle, cfg->max_angle_deg);
}
