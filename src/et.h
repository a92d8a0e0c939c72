/* et.h - reference evapotranspiration (FAO-56 Penman-Monteith): interface.
 *
 * Part of rowgraze. GPL-3.0-or-later.
 *
 * Every formula comes from Allen, R.G., Pereira, L.S., Raes, D. & Smith, M.
 * (1998) Crop evapotranspiration. FAO Irrigation and Drainage Paper 56
 * ("FAO-56"); each function names its equation numbers.
 *
 * Conventions used throughout:
 *   - latitudes in degrees, north positive, south negative;
 *   - doy is the day of the year, 1 (1 January) .. 366 (31 December in a
 *     leap year);
 *   - radiation in MJ m-2 per day (_mj_m2_d) or per hour (_mj_m2_h); a few
 *     functions work for either and say so (their result has the same period
 *     as their radiation argument);
 *   - on bad input (out of range, NaN, unknown enum) every function returns
 *     NAN instead of a number; nothing here aborts or prints.
 *
 * Longitude conventions (hourly extraterrestrial radiation only):
 *   FAO-56 eq. 31 writes longitudes as degrees WEST of Greenwich, 0..360:
 *   Lz = 0 for Greenwich, 75/90/105/120 for the US Eastern/Central/Mountain/
 *   Pacific zones, 330 for Cairo, 255 for Bangkok. et_ra_hour_mj_m2() takes
 *   that convention. The rest of rowgraze uses ordinary east-positive
 *   longitudes (-180..180, west negative): et_ra_hour_east_mj_m2() and
 *   struct et_hour take those and convert with et_deg_west().
 */
#ifndef ET_H
#define ET_H

/* ---- Radiation and its helpers (FAO-56 chapter 3) ---------------------- */

/* Inverse relative distance Earth-Sun dr (dimensionless), FAO-56 eq. 23.
 * NAN if doy is outside 1..366. */
double et_inv_rel_dist(int doy);

/* Solar declination in radians, FAO-56 eq. 24. NAN if doy is outside
 * 1..366. */
double et_declination_rad(int doy);

/* Sunset hour angle ws in radians, FAO-56 eq. 25. Where the sun never sets
 * (polar day) the result is pi, where it never rises (polar night) 0: the
 * cosine argument is clamped to [-1, 1] first. NAN if lat_rad is outside
 * [-pi/2, pi/2] or either argument is NaN. */
double et_sunset_angle_rad(double lat_rad, double decl_rad);

/* Daily extraterrestrial radiation Ra, FAO-56 eq. 21 (with eq. 23-25).
 * NAN if lat_deg is outside [-90, 90] or doy outside 1..366. */
double et_ra_day_mj_m2_d(double lat_deg, int doy);

/* Daylight hours N, FAO-56 eq. 34. Same bad-input rule as
 * et_ra_day_mj_m2_d(). */
double et_daylight_h(double lat_deg, int doy);

/* Converts an east-positive longitude (degrees, any real) to FAO-56's
 * "degrees west of Greenwich" in [0, 360). NAN if lon_east_deg is not
 * finite. */
double et_deg_west(double lon_east_deg);

/* Extraterrestrial radiation for a period shorter than a day, FAO-56 eq. 28
 * with eq. 29-33 (solar time angles, seasonal correction Sc).
 *   lz_west_deg  longitude of the centre of the local time zone, degrees WEST
 *                of Greenwich (FAO-56 convention, see the top of this file);
 *   lm_west_deg  longitude of the site, degrees WEST of Greenwich;
 *   t_mid_h      standard clock time at the midpoint of the period, hours
 *                (14.5 for 14:00-15:00);
 *   t_len_h      length of the period, hours (1 for hourly).
 * Lz - Lm is wrapped into [-180, 180) so 0 and 360 mean the same meridian.
 * As FAO-56 says, Ra is 0 when the midpoint hour angle is outside
 * [-ws, ws] (sun below the horizon); otherwise the period's end angles are
 * clipped to [-ws, ws], which is eq. 28 integrated over the daylit part of
 * the period only. NAN if lat_deg is outside [-90, 90], doy outside 1..366,
 * t_len_h outside (0, 24], or any argument is not finite. */
double et_ra_hour_mj_m2(double lat_deg, int doy, double lz_west_deg,
                        double lm_west_deg, double t_mid_h, double t_len_h);

/* et_ra_hour_mj_m2() with ordinary east-positive longitudes: zone_east_deg
 * is the time zone's central meridian (15 x the UTC offset in hours, e.g.
 * +15 for UTC+1, -75 for UTC-5), lon_east_deg the site. Same bad-input
 * rule. */
double et_ra_hour_east_mj_m2(double lat_deg, int doy, double zone_east_deg,
                             double lon_east_deg, double t_mid_h,
                             double t_len_h);

/* Solar radiation from sunshine hours, Angstrom formula, FAO-56 eq. 35 with
 * the default as = 0.25, bs = 0.50. n/N is capped at 1. NAN if sun_h < 0,
 * daylight_h <= 0 or ra_mj_m2_d < 0. */
double et_rs_angstrom_mj_m2_d(double sun_h, double daylight_h,
                              double ra_mj_m2_d);

/* Clear-sky solar radiation Rso, FAO-56 eq. 37 (station elevation z in m).
 * Period of the result = period of ra. NAN if ra < 0 or elev_m is not
 * finite. */
double et_rso_mj_m2(double ra_mj_m2, double elev_m);

/* Net shortwave radiation Rns = (1 - 0.23) Rs, FAO-56 eq. 38 with the grass
 * reference albedo. Period of the result = period of rs. NAN if rs < 0. */
double et_rns_mj_m2(double rs_mj_m2);

/* Relative shortwave radiation Rs/Rso limited to <= 1.0, as eq. 39 needs.
 * When rso <= 0 (sun down) the ratio is undefined and dark_ratio is
 * returned instead: FAO-56 (text under eq. 39 and for hourly steps) says to
 * use the ratio from 2-3 hours before sunset, or about 0.4-0.6 in humid and
 * 0.7-0.8 in arid climates. NAN if rs < 0 or the ratio used is outside
 * [0, 1]. */
double et_rs_rso(double rs_mj_m2, double rso_mj_m2, double dark_ratio);

/* Net longwave radiation for a day, FAO-56 eq. 39: mean of sigma*Tmax^4 and
 * sigma*Tmin^4, sigma = 4.903e-9 MJ K-4 m-2 d-1. rs_rso is Rs/Rso (see
 * et_rs_rso()). NAN if tmax_c < tmin_c, ea_kpa < 0 or rs_rso is outside
 * [0, 1]. */
double et_rnl_day_mj_m2_d(double tmax_c, double tmin_c, double ea_kpa,
                          double rs_rso);

/* Net longwave radiation for one hour, FAO-56 eq. 39 as the hourly steps
 * use it: sigma/24 = 2.043e-10 MJ K-4 m-2 h-1 and the hour's mean
 * temperature. NAN if ea_kpa < 0 or rs_rso is outside [0, 1]. */
double et_rnl_hour_mj_m2_h(double t_c, double ea_kpa, double rs_rso);

/* Monthly soil heat flux from the previous and next months' mean air
 * temperatures, FAO-56 eq. 43: G = 0.07 (T[i+1] - T[i-1]). NAN if either
 * is not finite. */
double et_g_month_mj_m2_d(double t_prev_month_c, double t_next_month_c);

/* Monthly soil heat flux when the next month is unknown, FAO-56 eq. 44:
 * G = 0.14 (T[i] - T[i-1]). NAN if either is not finite. (For daily steps
 * FAO-56 eq. 42 gives G ~ 0: pass 0.) */
double et_g_month_prev_mj_m2_d(double t_prev_month_c, double t_month_c);

/* Hourly soil heat flux under grass, FAO-56 eq. 45 (daylight: 0.1 Rn) and
 * eq. 46 (night: 0.5 Rn). NAN if rn is not finite. */
double et_g_hour_mj_m2_h(double rn_mj_m2_h, int daylight);

/* Wind speed at 2 m from speed uz measured at z_m above ground, FAO-56
 * eq. 47. NAN if uz < 0 or z_m <= 0.08 (where the log profile ends). */
double et_u2_m_s(double uz_m_s, double z_m);

/* ---- Reference evapotranspiration ------------------------------------- */

/* How a daily step gives its humidity. */
enum et_humid {
    ET_HUMID_EA,   /* ea_kpa is the day's actual vapour pressure */
    ET_HUMID_TDEW, /* ea from dewpoint tdew_c, FAO-56 eq. 14 */
    ET_HUMID_RH    /* ea from rhmax_pct/rhmin_pct, FAO-56 eq. 17 */
};

/* How a daily step gives its solar radiation. */
enum et_sun {
    ET_SUN_RS,    /* rs_mj_m2_d is measured solar radiation */
    ET_SUN_HOURS  /* Rs from sun_h by Angstrom, FAO-56 eq. 35 */
};

/* Inputs of one daily (or 10-day, monthly mean-day) step. */
struct et_day {
    double lat_deg;       /* site latitude, north positive */
    double elev_m;        /* site elevation above sea level */
    int doy;              /* day of year, 1..366 (mid-period for months) */
    double tmax_c;        /* maximum air temperature at 2 m */
    double tmin_c;        /* minimum air temperature at 2 m */
    enum et_humid humid;  /* which of the next three fields is used */
    double ea_kpa;        /* actual vapour pressure        (ET_HUMID_EA) */
    double tdew_c;        /* dewpoint temperature          (ET_HUMID_TDEW) */
    double rhmax_pct;     /* maximum relative humidity     (ET_HUMID_RH) */
    double rhmin_pct;     /* minimum relative humidity     (ET_HUMID_RH) */
    enum et_sun sun;      /* which of the next two fields is used */
    double rs_mj_m2_d;    /* solar radiation               (ET_SUN_RS) */
    double sun_h;         /* actual sunshine hours n       (ET_SUN_HOURS) */
    double u2_m_s;        /* wind speed at 2 m (see et_u2_m_s()) */
    double g_mj_m2_d;     /* soil heat flux: 0 for days, eq. 43/44 months */
};

/* Inputs of one hourly step (the hour ending at t_mid_h + 0.5). */
struct et_hour {
    double lat_deg;       /* site latitude, north positive */
    double lon_east_deg;  /* site longitude, east positive */
    double zone_east_deg; /* central meridian of the time zone, east pos. */
    double elev_m;        /* site elevation above sea level */
    int doy;              /* day of year, 1..366 */
    double t_mid_h;       /* standard clock time at mid-hour, 0..24 */
    double t_c;           /* mean air temperature of the hour at 2 m */
    double rh_pct;        /* mean relative humidity of the hour */
    double u2_m_s;        /* mean wind speed of the hour at 2 m */
    double rs_mj_m2_h;    /* solar radiation received in the hour */
    double rs_rso_dark;   /* Rs/Rso to use when the sun is down (see
                           * et_rs_rso()), e.g. the value 2-3 h before
                           * sunset */
};

/* Intermediate terms of one step, filled by et_day_mm_d()/et_hour_mm_h().
 * Radiation terms and g are per day or per hour, like the step. */
struct et_terms {
    double p_kpa;         /* atmospheric pressure, eq. 7 */
    double gamma_kpa_c;   /* psychrometric constant, eq. 8 */
    double t_c;           /* temperature used for delta and eq. 6/53 */
    double delta_kpa_c;   /* slope of the vapour pressure curve, eq. 13 */
    double es_kpa;        /* saturation vapour pressure, eq. 11/12 */
    double ea_kpa;        /* actual vapour pressure */
    double ra_mj_m2;      /* extraterrestrial radiation */
    double rso_mj_m2;     /* clear-sky radiation */
    double rs_mj_m2;      /* solar radiation */
    double rs_rso;        /* relative shortwave radiation used in eq. 39 */
    double rns_mj_m2;     /* net shortwave, eq. 38 */
    double rnl_mj_m2;     /* net longwave, eq. 39 */
    double rn_mj_m2;      /* net radiation Rns - Rnl, eq. 40 */
    double g_mj_m2;       /* soil heat flux */
};

/* Daily reference evapotranspiration ETo in mm/day, FAO-56 eq. 6, with
 * es from eq. 12, delta at (Tmax + Tmin)/2 from eq. 13, Ra eq. 21, Rso
 * eq. 37, Rnl eq. 39. If out is not NULL it receives the intermediate
 * terms (left untouched on bad input). NAN on bad input: in NULL, latitude
 * or doy out of range, tmax_c < tmin_c, negative wind, radiation, ea or
 * sunshine, humidity outside 0..100 % or rhmin > rhmax, unknown enum, any
 * used field not finite, ET_SUN_HOURS on a polar-night day (N = 0), or
 * outside the ranges of psychro.h, which supplies eq. 7-17: elev_m outside
 * -500..9000, a temperature (tmax, tmin, tdew) above 100 C, or tmin_c /
 * tdew_c at or below -100 C. On
 * a polar-night day with ET_SUN_RS, eq. 39 uses Rs/Rso = 0.5 (midpoint of
 * FAO-56's humid night range; common practice, no source). The result is
 * not clamped at 0. */
double et_day_mm_d(const struct et_day *in, struct et_terms *out);

/* Hourly reference evapotranspiration ETo in mm/hour, FAO-56 eq. 53, with
 * ea from eq. 54, Ra eq. 28-33, Rnl from eq. 39 with sigma/24, G eq. 45/46
 * (daylight = Ra > 0). If out is not NULL it receives the intermediate
 * terms. NAN on bad input (as et_day_mm_d(), t_c outside (-100, 100] C
 * instead of the daily temperatures, plus t_mid_h outside [0, 24],
 * longitudes not finite, rs_rso_dark outside [0, 1]). The result is not
 * clamped: at night it can be slightly negative (dew). */
double et_hour_mm_h(const struct et_hour *in, struct et_terms *out);

/* Hourly ETo (FAO-56 eq. 53) for ground that sees the same air as the
 * open field whose terms are in *open (from et_hour_mm_h) but receives
 * rs_mj_m2_h of sun, e.g. a strip under solar panels: net shortwave
 * (eq. 38), net radiation (eq. 40) and soil heat flux (eq. 45/46) follow
 * the strip's sun; the net longwave is held at the open field's value (an
 * assumption: the panels' own longwave is left out).  NAN on bad input. */
double et_hour_shaded_mm_h(const struct et_terms *open, double u2_m_s,
                           double rs_mj_m2_h);

/* As et_hour_shaded_mm_h(), for a canopy whose surface resistance is
 * rs_factor times the reference's (70 s/m, FAO-56 eq. 5 and the box after
 * it): eq. 53 with 0.34 rs_factor in place of 0.34.  rs_factor 1 gives
 * et_hour_shaded_mm_h() exactly; a larger factor (stomata partly shut,
 * e.g. leaves in shade) gives less when ETo is positive (0 in the limit).
 * NAN on bad input, or when rs_factor is not positive and finite. */
double et_hour_shaded_rs_mm_h(const struct et_terms *open, double u2_m_s,
                              double rs_mj_m2_h, double rs_factor);

#endif
