/* et.c - reference evapotranspiration ETo by FAO-56 Penman-Monteith.
 *
 * Part of rowgraze. GPL-3.0-or-later.
 *
 * What it is for: the microclimate stage needs the atmosphere's evaporative
 * demand over grass, per day and per hour, to drive the soil water balance
 * of each strip of a tracker row. ETo is that demand.
 *
 * Depends on psychro.c (psychro.h): every air property is taken from
 * there, not recomputed here, so each FAO-56 formula lives in one function.
 *
 * How the pieces fit:
 *   1. air properties, all from psychro.h: pressure (eq. 7,
 *      psy_pressure_kpa), psychrometric constant (eq. 8, psy_gamma_kpa_c),
 *      saturation vapour pressure (eq. 11/12, psy_e0_kpa,
 *      psy_es_mean_kpa), slope delta (eq. 13, psy_slope_kpa_c), actual
 *      vapour pressure (eq. 14, 17, 54: psy_ea_dew_kpa,
 *      psy_ea_rh_minmax_kpa, psy_ea_rh_kpa). Their ranges (elevation
 *      -500..9000 m, temperatures -100..100 C) become this file's: outside
 *      them psychro returns NaN and so does ETo;
 *   2. sun geometry and extraterrestrial radiation: dr (eq. 23),
 *      declination (eq. 24), sunset angle (eq. 25), daily Ra (eq. 21),
 *      hourly Ra (eq. 28-33), daylight hours (eq. 34);
 *   3. radiation balance: Rs from sunshine (eq. 35), Rso (eq. 37),
 *      Rns (eq. 38), Rnl (eq. 39, daily and hourly), Rn (eq. 40);
 *   4. soil heat flux (eq. 42-46) and wind height correction (eq. 47);
 *   5. the combination equation, daily (eq. 6) and hourly (eq. 53), which
 *      share one static function since they differ only in the
 *      aerodynamic coefficient (900 per day, 37 per hour).
 * et_day_mm_d() and et_hour_mm_h() run 1-5 for one step and can hand back
 * every intermediate term so the tests can check them against FAO-56's
 * worked examples.
 *
 * Reference: Allen, R.G., Pereira, L.S., Raes, D. & Smith, M. (1998) Crop
 * evapotranspiration - Guidelines for computing crop water requirements.
 * FAO Irrigation and Drainage Paper 56, Rome. Equation numbers below are
 * that paper's.
 */
#include "et.h"
#include "psychro.h"

#include <math.h>
#include <stddef.h>

#define ET_NAN ((double)NAN)  /* NAN is a float; spare -Wdouble-promotion */
#define ET_PI 3.14159265358979323846
#define ET_GSC 0.0820          /* solar constant, MJ m-2 min-1 (eq. 21) */
#define ET_SIGMA_D 4.903e-9    /* Stefan-Boltzmann, MJ K-4 m-2 d-1 (eq. 39) */
#define ET_ALBEDO 0.23         /* grass reference albedo (eq. 38) */
#define ET_KELVIN 273.16       /* FAO-56 eq. 39: K = C + 273.16 */
#define ET_DARK_DAY_RATIO 0.5  /* Rs/Rso on a polar-night day: midpoint of
                                * FAO-56's 0.4-0.6 humid night range; common
                                * practice, no source */

/* ---- 2. Sun geometry and extraterrestrial radiation ------------------- */

static int doy_ok(int doy)
{
    return doy >= 1 && doy <= 366;
}

static int lat_ok(double lat_deg)
{
    return lat_deg >= -90.0 && lat_deg <= 90.0; /* false for NaN */
}

static double rad(double deg)
{
    return deg * ET_PI / 180.0;
}

double et_inv_rel_dist(int doy)
{
    if (!doy_ok(doy))
        return ET_NAN;
    return 1.0 + 0.033 * cos(2.0 * ET_PI * doy / 365.0); /* eq. 23 */
}

double et_declination_rad(int doy)
{
    if (!doy_ok(doy))
        return ET_NAN;
    return 0.409 * sin(2.0 * ET_PI * doy / 365.0 - 1.39); /* eq. 24 */
}

double et_sunset_angle_rad(double lat_rad, double decl_rad)
{
    double c;

    if (!(fabs(lat_rad) <= ET_PI / 2.0) || isnan(decl_rad))
        return ET_NAN;
    c = -tan(lat_rad) * tan(decl_rad); /* eq. 25 */
    if (c > 1.0)
        c = 1.0;  /* polar night */
    if (c < -1.0)
        c = -1.0; /* polar day */
    return acos(c);
}

double et_ra_day_mj_m2_d(double lat_deg, int doy)
{
    double phi, dr, dec, ws;

    if (!lat_ok(lat_deg) || !doy_ok(doy))
        return ET_NAN;
    phi = rad(lat_deg);
    dr = et_inv_rel_dist(doy);
    dec = et_declination_rad(doy);
    ws = et_sunset_angle_rad(phi, dec);
    return 24.0 * 60.0 / ET_PI * ET_GSC * dr * /* eq. 21 */
           (ws * sin(phi) * sin(dec) + cos(phi) * cos(dec) * sin(ws));
}

double et_daylight_h(double lat_deg, int doy)
{
    if (!lat_ok(lat_deg) || !doy_ok(doy))
        return ET_NAN;
    return 24.0 / ET_PI * /* eq. 34 */
           et_sunset_angle_rad(rad(lat_deg), et_declination_rad(doy));
}

double et_deg_west(double lon_east_deg)
{
    double w;

    if (!isfinite(lon_east_deg))
        return ET_NAN;
    w = fmod(-lon_east_deg, 360.0);
    if (w < 0.0)
        w += 360.0;
    return w >= 360.0 ? 0.0 : w;
}

/* Wraps an angle in degrees into [-180, 180). */
static double wrap180(double deg)
{
    double w = fmod(deg + 180.0, 360.0);
    if (w < 0.0)
        w += 360.0;
    return w - 180.0;
}

/* Wraps an angle in radians into [-pi, pi). */
static double wrap_pi(double a)
{
    double w = fmod(a + ET_PI, 2.0 * ET_PI);
    if (w < 0.0)
        w += 2.0 * ET_PI;
    return w - ET_PI;
}

/* Seasonal correction for solar time Sc, hours, FAO-56 eq. 32-33. */
static double season_corr_h(int doy)
{
    double b = 2.0 * ET_PI * (doy - 81) / 364.0; /* eq. 33 */
    return 0.1645 * sin(2.0 * b) - 0.1255 * cos(b) - 0.025 * sin(b);
}

double et_ra_hour_mj_m2(double lat_deg, int doy, double lz_west_deg,
                        double lm_west_deg, double t_mid_h, double t_len_h)
{
    double phi, dr, dec, ws, w, w1, w2, ra;

    if (!lat_ok(lat_deg) || !doy_ok(doy) || !isfinite(lz_west_deg) ||
        !isfinite(lm_west_deg) || !isfinite(t_mid_h) ||
        !(t_len_h > 0.0 && t_len_h <= 24.0))
        return ET_NAN;
    phi = rad(lat_deg);
    dr = et_inv_rel_dist(doy);
    dec = et_declination_rad(doy);
    ws = et_sunset_angle_rad(phi, dec);
    w = ET_PI / 12.0 * ((t_mid_h + 0.06667 * wrap180(lz_west_deg -
                         lm_west_deg) + season_corr_h(doy)) - 12.0); /* 31 */
    w = wrap_pi(w);
    if (w < -ws || w > ws)
        return 0.0; /* sun below the horizon at mid-period (FAO-56) */
    w1 = fmax(w - ET_PI * t_len_h / 24.0, -ws); /* eq. 29, daylit part */
    w2 = fmin(w + ET_PI * t_len_h / 24.0, ws);  /* eq. 30, daylit part */
    ra = 12.0 * 60.0 / ET_PI * ET_GSC * dr * /* eq. 28 */
         ((w2 - w1) * sin(phi) * sin(dec) +
          cos(phi) * cos(dec) * (sin(w2) - sin(w1)));
    return fmax(ra, 0.0);
}

double et_ra_hour_east_mj_m2(double lat_deg, int doy, double zone_east_deg,
                             double lon_east_deg, double t_mid_h,
                             double t_len_h)
{
    return et_ra_hour_mj_m2(lat_deg, doy, et_deg_west(zone_east_deg),
                            et_deg_west(lon_east_deg), t_mid_h, t_len_h);
}

/* ---- 3. Radiation balance --------------------------------------------- */

double et_rs_angstrom_mj_m2_d(double sun_h, double daylight_h,
                              double ra_mj_m2_d)
{
    double f;

    if (!(sun_h >= 0.0) || !(daylight_h > 0.0) || !(ra_mj_m2_d >= 0.0))
        return ET_NAN;
    f = fmin(sun_h / daylight_h, 1.0);
    return (0.25 + 0.50 * f) * ra_mj_m2_d; /* eq. 35, as/bs defaults */
}

double et_rso_mj_m2(double ra_mj_m2, double elev_m)
{
    if (!(ra_mj_m2 >= 0.0) || !isfinite(elev_m))
        return ET_NAN;
    return (0.75 + 2e-5 * elev_m) * ra_mj_m2; /* eq. 37 */
}

double et_rns_mj_m2(double rs_mj_m2)
{
    if (!(rs_mj_m2 >= 0.0))
        return ET_NAN;
    return (1.0 - ET_ALBEDO) * rs_mj_m2; /* eq. 38 */
}

double et_rs_rso(double rs_mj_m2, double rso_mj_m2, double dark_ratio)
{
    double r;

    if (!(rs_mj_m2 >= 0.0) || isnan(rso_mj_m2))
        return ET_NAN;
    r = rso_mj_m2 > 0.0 ? fmin(rs_mj_m2 / rso_mj_m2, 1.0) : dark_ratio;
    return (r >= 0.0 && r <= 1.0) ? r : ET_NAN;
}

/* The humidity and cloudiness factors of FAO-56 eq. 39. */
static double rnl_factors(double ea_kpa, double rs_rso)
{
    return (0.34 - 0.14 * sqrt(ea_kpa)) * (1.35 * rs_rso - 0.35);
}

static double pow4(double x)
{
    return (x * x) * (x * x);
}

double et_rnl_day_mj_m2_d(double tmax_c, double tmin_c, double ea_kpa,
                          double rs_rso)
{
    double tk4;

    if (!(tmax_c >= tmin_c) || !isfinite(tmax_c) || !isfinite(tmin_c) ||
        !(ea_kpa >= 0.0) || !(rs_rso >= 0.0 && rs_rso <= 1.0))
        return ET_NAN;
    tk4 = (pow4(tmax_c + ET_KELVIN) + pow4(tmin_c + ET_KELVIN)) / 2.0;
    return ET_SIGMA_D * tk4 * rnl_factors(ea_kpa, rs_rso); /* eq. 39 */
}

double et_rnl_hour_mj_m2_h(double t_c, double ea_kpa, double rs_rso)
{
    if (!isfinite(t_c) || !(ea_kpa >= 0.0) ||
        !(rs_rso >= 0.0 && rs_rso <= 1.0))
        return ET_NAN;
    return ET_SIGMA_D / 24.0 * pow4(t_c + ET_KELVIN) * /* eq. 39, hourly */
           rnl_factors(ea_kpa, rs_rso);
}

/* ---- 4. Soil heat flux, wind ------------------------------------------ */

double et_g_month_mj_m2_d(double t_prev_month_c, double t_next_month_c)
{
    if (!isfinite(t_prev_month_c) || !isfinite(t_next_month_c))
        return ET_NAN;
    return 0.07 * (t_next_month_c - t_prev_month_c); /* eq. 43 */
}

double et_g_month_prev_mj_m2_d(double t_prev_month_c, double t_month_c)
{
    if (!isfinite(t_prev_month_c) || !isfinite(t_month_c))
        return ET_NAN;
    return 0.14 * (t_month_c - t_prev_month_c); /* eq. 44 */
}

double et_g_hour_mj_m2_h(double rn_mj_m2_h, int daylight)
{
    if (!isfinite(rn_mj_m2_h))
        return ET_NAN;
    return (daylight ? 0.1 : 0.5) * rn_mj_m2_h; /* eq. 45 / eq. 46 */
}

double et_u2_m_s(double uz_m_s, double z_m)
{
    double l;

    if (!(uz_m_s >= 0.0) || !(z_m > 0.08) || !isfinite(uz_m_s) ||
        !isfinite(z_m))
        return ET_NAN;
    l = log(67.8 * z_m - 5.42);
    if (!(l > 0.0))
        return ET_NAN;
    return uz_m_s * 4.87 / l; /* eq. 47 */
}

/* ---- 5. The combination equation -------------------------------------- */

/* FAO-56 Penman-Monteith: eq. 6 with cn = 900 (per day) and eq. 53 with
 * cn = 37 (per hour); Cd = 0.34 in both, grass reference.  The 0.34 is
 * r_s / r_a of the reference, 70 s/m over 208 / u2 (eq. 4 and the box
 * after eq. 5, which give eq. 6 from eq. 3); rs_factor multiplies r_s,
 * so 1 is the reference itself. */
static double pm_combine_rs(double cn, const struct et_terms *k, double u2_m_s,
                            double rs_factor)
{
    double num = 0.408 * k->delta_kpa_c * (k->rn_mj_m2 - k->g_mj_m2) +
                 k->gamma_kpa_c * cn / (k->t_c + 273.0) * u2_m_s *
                 (k->es_kpa - k->ea_kpa);
    double den = k->delta_kpa_c + k->gamma_kpa_c * (1.0 + 0.34 * rs_factor * u2_m_s);
    return num / den;
}

static double pm_combine(double cn, const struct et_terms *k, double u2_m_s)
{
    return pm_combine_rs(cn, k, u2_m_s, 1.0);
}

/* The open field's terms with the strip's own sun: eq. 38, 40, 45/46. */
static struct et_terms shaded_terms(const struct et_terms *open, double rs_mj_m2_h)
{
    struct et_terms k = *open;
    k.rs_mj_m2 = rs_mj_m2_h;
    k.rns_mj_m2 = et_rns_mj_m2(rs_mj_m2_h);              /* eq. 38 */
    k.rn_mj_m2 = k.rns_mj_m2 - k.rnl_mj_m2;              /* eq. 40 */
    k.g_mj_m2 = et_g_hour_mj_m2_h(k.rn_mj_m2, k.ra_mj_m2 > 0.0); /* eq. 45/46 */
    return k;
}

double et_hour_shaded_mm_h(const struct et_terms *open, double u2_m_s,
                           double rs_mj_m2_h)
{
    if (open == NULL || !(rs_mj_m2_h >= 0.0) || !(u2_m_s >= 0.0))
        return ET_NAN;
    struct et_terms k = shaded_terms(open, rs_mj_m2_h);
    return pm_combine(37.0, &k, u2_m_s);                 /* eq. 53 */
}

double et_hour_shaded_rs_mm_h(const struct et_terms *open, double u2_m_s,
                              double rs_mj_m2_h, double rs_factor)
{
    if (open == NULL || !(rs_mj_m2_h >= 0.0) || !(u2_m_s >= 0.0) ||
        !(rs_factor > 0.0) || !isfinite(rs_factor))
        return ET_NAN;
    struct et_terms k = shaded_terms(open, rs_mj_m2_h);
    return pm_combine_rs(37.0, &k, u2_m_s, rs_factor);  /* eq. 53, r_s scaled */
}

static int pct_ok(double x)
{
    return x >= 0.0 && x <= 100.0; /* false for NaN */
}

/* The day's ea from whichever humidity field in->humid names. */
static double day_ea_kpa(const struct et_day *in)
{
    switch (in->humid) {
    case ET_HUMID_EA:
        if (!(in->ea_kpa >= 0.0) || !isfinite(in->ea_kpa))
            return ET_NAN;
        return in->ea_kpa;
    case ET_HUMID_TDEW:
        /* refuse -100 C itself, like tmin_c in day_in_ok() */
        if (!(in->tdew_c > -100.0))
            return ET_NAN;
        return psy_ea_dew_kpa(in->tdew_c); /* eq. 14; NaN if > 100 C */
    case ET_HUMID_RH: /* eq. 17; NaN for RH outside 0..100, rhmin > rhmax */
        return psy_ea_rh_minmax_kpa(in->tmin_c, in->tmax_c, in->rhmin_pct,
                                    in->rhmax_pct);
    }
    return ET_NAN;
}

/* The day's Rs from whichever radiation field in->sun names. */
static double day_rs_mj_m2_d(const struct et_day *in, double ra)
{
    switch (in->sun) {
    case ET_SUN_RS:
        if (!(in->rs_mj_m2_d >= 0.0) || !isfinite(in->rs_mj_m2_d))
            return ET_NAN;
        return in->rs_mj_m2_d;
    case ET_SUN_HOURS:
        if (!(in->sun_h <= 24.0))
            return ET_NAN;
        return et_rs_angstrom_mj_m2_d(in->sun_h,
                                      et_daylight_h(in->lat_deg, in->doy), ra);
    }
    return ET_NAN;
}

static int day_in_ok(const struct et_day *in)
{
    return lat_ok(in->lat_deg) && doy_ok(in->doy) && isfinite(in->elev_m) &&
           isfinite(in->tmax_c) && isfinite(in->tmin_c) &&
           in->tmax_c >= in->tmin_c && in->tmin_c > -100.0 &&
           in->u2_m_s >= 0.0 && isfinite(in->u2_m_s) &&
           isfinite(in->g_mj_m2_d);
}

double et_day_mm_d(const struct et_day *in, struct et_terms *out)
{
    struct et_terms k;
    double eto;

    if (in == NULL || !day_in_ok(in))
        return ET_NAN;
    k.ea_kpa = day_ea_kpa(in);
    k.ra_mj_m2 = et_ra_day_mj_m2_d(in->lat_deg, in->doy);
    k.rs_mj_m2 = day_rs_mj_m2_d(in, k.ra_mj_m2);
    if (isnan(k.ea_kpa) || isnan(k.rs_mj_m2))
        return ET_NAN;
    k.p_kpa = psy_pressure_kpa(in->elev_m);           /* eq. 7 */
    k.gamma_kpa_c = psy_gamma_kpa_c(k.p_kpa);         /* eq. 8 */
    k.t_c = (in->tmax_c + in->tmin_c) / 2.0;
    k.delta_kpa_c = psy_slope_kpa_c(k.t_c);           /* eq. 13 */
    k.es_kpa = psy_es_mean_kpa(in->tmax_c, in->tmin_c); /* eq. 12 */
    k.rso_mj_m2 = et_rso_mj_m2(k.ra_mj_m2, in->elev_m);
    k.rs_rso = et_rs_rso(k.rs_mj_m2, k.rso_mj_m2, ET_DARK_DAY_RATIO);
    k.rns_mj_m2 = et_rns_mj_m2(k.rs_mj_m2);
    k.rnl_mj_m2 = et_rnl_day_mj_m2_d(in->tmax_c, in->tmin_c, k.ea_kpa,
                                     k.rs_rso);
    k.rn_mj_m2 = k.rns_mj_m2 - k.rnl_mj_m2; /* eq. 40 */
    k.g_mj_m2 = in->g_mj_m2_d;
    eto = pm_combine(900.0, &k, in->u2_m_s); /* eq. 6 */
    if (isnan(eto))
        return ET_NAN;
    if (out != NULL)
        *out = k;
    return eto;
}

static int hour_in_ok(const struct et_hour *in)
{
    return lat_ok(in->lat_deg) && doy_ok(in->doy) && isfinite(in->elev_m) &&
           isfinite(in->lon_east_deg) && isfinite(in->zone_east_deg) &&
           in->t_mid_h >= 0.0 && in->t_mid_h <= 24.0 &&
           isfinite(in->t_c) && in->t_c > -100.0 && pct_ok(in->rh_pct) &&
           in->u2_m_s >= 0.0 && isfinite(in->u2_m_s) &&
           in->rs_mj_m2_h >= 0.0 && isfinite(in->rs_mj_m2_h) &&
           in->rs_rso_dark >= 0.0 && in->rs_rso_dark <= 1.0;
}

double et_hour_mm_h(const struct et_hour *in, struct et_terms *out)
{
    struct et_terms k;
    double eto;

    if (in == NULL || !hour_in_ok(in))
        return ET_NAN;
    k.p_kpa = psy_pressure_kpa(in->elev_m);           /* eq. 7 */
    k.gamma_kpa_c = psy_gamma_kpa_c(k.p_kpa);         /* eq. 8 */
    k.t_c = in->t_c;
    k.delta_kpa_c = psy_slope_kpa_c(in->t_c);         /* eq. 13 */
    k.es_kpa = psy_e0_kpa(in->t_c);                   /* eq. 11 */
    k.ea_kpa = psy_ea_rh_kpa(in->t_c, in->rh_pct);    /* eq. 54 */
    k.ra_mj_m2 = et_ra_hour_east_mj_m2(in->lat_deg, in->doy,
                                       in->zone_east_deg, in->lon_east_deg,
                                       in->t_mid_h, 1.0);
    k.rso_mj_m2 = et_rso_mj_m2(k.ra_mj_m2, in->elev_m);
    k.rs_mj_m2 = in->rs_mj_m2_h;
    k.rs_rso = et_rs_rso(k.rs_mj_m2, k.rso_mj_m2, in->rs_rso_dark);
    k.rns_mj_m2 = et_rns_mj_m2(k.rs_mj_m2);
    k.rnl_mj_m2 = et_rnl_hour_mj_m2_h(in->t_c, k.ea_kpa, k.rs_rso);
    k.rn_mj_m2 = k.rns_mj_m2 - k.rnl_mj_m2; /* eq. 40 */
    k.g_mj_m2 = et_g_hour_mj_m2_h(k.rn_mj_m2, k.ra_mj_m2 > 0.0);
    eto = pm_combine(37.0, &k, in->u2_m_s); /* eq. 53 */
    if (isnan(eto))
        return ET_NAN;
    if (out != NULL)
        *out = k;
    return eto;
}
