/* tracker.h - rotation angle of a single-axis tracker row, hour by hour.
 *
 * The whole interface of tracker.c: the ideal ("true-tracking") angle, the
 * slope-aware backtracking correction, the slope geometry that feeds it, the
 * sun seen in the tracker's own frame, and one call that applies a row's
 * settings (wind stow, night, backtracking, rotation limit) in that order.
 *
 * Conventions shared with the rest of rowgraze:
 *   zenith_deg   sun zenith from vertical;
 *   azimuth_deg  clockwise from north (90 = east);
 *   axis_azimuth_deg (Aa) the direction the axis points, downhill along its
 *                length; a north-south horizontal axis uses Aa = 180;
 *   axis_tilt_deg (Ba) tilt of the axis from horizontal, >= 0;
 *   rotation angle R, degrees, 0 = panel level across the axis, positive
 *                when the panel faces the side Aa + 90 (west for Aa = 180).
 *   cross-section: the plane normal to the axis; x points to the side
 *                Aa - 90 (east for Aa = 180), z up.  With R > 0 the panel's
 *                -x edge is the lower one.
 *   gcr          collector chord / row pitch, the pitch measured
 *                horizontally across the axes (Anderson & Mikofski 2020).
 */
#ifndef RG_TRACKER_H
#define RG_TRACKER_H

/* One tracker row's settings (see trk_config_check for the valid ranges). */
typedef struct trk_config {
    double axis_azimuth_deg;     /* Aa, direction the axis points downhill */
    double axis_tilt_deg;        /* Ba, 0 <= Ba < 90 */
    double gcr;                  /* chord / horizontal pitch, 0 < gcr <= 1 */
    double cross_axis_slope_deg; /* ground slope across the axis, > 0 when
                                    the ground falls towards Aa + 90 */
    double max_angle_deg;        /* rotation limit, clipped symmetrically */
    int backtrack;               /* nonzero: avoid row-to-row shade */
    double night_angle_deg;      /* held while zenith_deg >= 90 */
    double stow_angle_deg;       /* held while wind exceeds stow_wind_m_s */
    double stow_wind_m_s;        /* <= 0 disables stow */
} trk_config;

/* Ideal rotation angle in degrees that puts the sun in the plane holding the
 * panel normal and the axis (Marion & Dobos 2013), in (-180, 180].  No limit
 * is applied: with a tilted axis the result can pass +-90 when the sun is
 * behind the plane of the level panel.  Any non-finite input gives NaN. */
double trk_ideal_deg(double zenith_deg, double azimuth_deg,
                     double axis_azimuth_deg, double axis_tilt_deg);

/* Sun unit vector in the tracker frame: x across the axis towards Aa - 90,
 * y along the axis towards Aa, z normal to the axis and the level panel.
 * The cross-section sees the sun along (x, z); trk_ideal_deg equals
 * atan2(-x, z).  Non-finite input gives NaN components; x, y and z must
 * point to storage. */
void trk_sun_frame(double zenith_deg, double azimuth_deg,
                   double axis_azimuth_deg, double axis_tilt_deg,
                   double *x, double *y, double *z);

/* Backtracked rotation angle (Anderson & Mikofski 2020 eq. 14) for the
 * true-tracking angle ideal_deg: the angle closest to ideal_deg at which one
 * row's shadow just reaches the next; ideal_deg itself when no row shades
 * its neighbour.  NaN when gcr is outside (0, 1], |cross_axis_slope_deg| is
 * not below 90, or an input is not finite. */
double trk_backtrack_deg(double ideal_deg, double gcr,
                         double cross_axis_slope_deg);

/* Tilt of an axis laid on a plane slope of slope_tilt_deg whose downhill
 * direction is slope_azimuth_deg, when the axis points along
 * axis_azimuth_deg (Anderson & Mikofski 2020).  Negative when the axis
 * points uphill; turn Aa by 180 before using it in a trk_config.  NaN
 * unless 0 <= slope_tilt_deg < 90 and inputs finite. */
double trk_axis_tilt_on_slope_deg(double slope_tilt_deg,
                                  double slope_azimuth_deg,
                                  double axis_azimuth_deg);

/* Cross-axis slope for backtracking: the rotation angle at which the panel
 * lies parallel to the slope (slope_tilt_deg, downhill slope_azimuth_deg)
 * that holds an axis (axis_azimuth_deg, axis_tilt_deg) (Anderson & Mikofski
 * 2020).  Same sign convention as the rotation angle.  NaN unless
 * 0 <= slope_tilt_deg < 90 and inputs finite. */
double trk_cross_axis_slope_deg(double slope_tilt_deg,
                                double slope_azimuth_deg,
                                double axis_azimuth_deg,
                                double axis_tilt_deg);

/* NULL when cfg is usable, else a static message naming the first bad field.
 * Valid: finite values; 0 <= axis_tilt_deg < 90; 0 < gcr <= 1;
 * |cross_axis_slope_deg| < 90; 0 < max_angle_deg <= 90; night and stow
 * angles within +-max_angle_deg; stow_wind_m_s finite (<= 0 disables). */
const char *trk_config_check(const trk_config *cfg);

/* Rotation angle in degrees for one hour, applying in this order:
 *   1. stow:  stow_wind_m_s > 0 and wind_m_s > stow_wind_m_s ->
 *             cfg->stow_angle_deg (a NaN wind never stows);
 *   2. night: zenith_deg >= 90 -> cfg->night_angle_deg;
 *   3. track: trk_ideal_deg, then trk_backtrack_deg if cfg->backtrack;
 *   4. clip:  to [-max_angle_deg, max_angle_deg].
 * Stow wins over night.  trk_config_check keeps the night and stow angles
 * within the limit, so step 4 only ever changes a tracking angle.  NaN when
 * cfg fails trk_config_check or the sun position is not finite. */
double trk_angle_deg(const trk_config *cfg, double zenith_deg,
                     double azimuth_deg, double wind_m_s);

#endif
