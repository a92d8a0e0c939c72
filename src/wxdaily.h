/* wxdaily.h - daily weather made hourly, so that a site whose weather file
 * is daily can still run the hourly microclimate engine (input stage).
 *
 * The whole interface of wxdaily.c.  wxd_to_hourly() turns n days of daily
 * values into one hourly wx_series (weather.h) in the site's own time base:
 *   air temperature  Parton & Logan (1981): a sine from the morning minimum
 *                    to a maximum lagged after solar noon, then an
 *                    exponential decay through the night to the next
 *                    morning's minimum (wxd_pl_temp_c);
 *   humidity         dew point held constant through the day, RH of each
 *                    hour = 100 ea / es(T_hour), capped at 100;
 *   radiation        the day's total (or Hargreaves' estimate, FAO-56
 *                    eq. 50, when it is missing) shared over the hours by
 *                    the Collares-Pereira & Rabl (1979) ratio, renormalised
 *                    so that the hours add up to the day exactly;
 *   rain             the day's total shared over the hours by a rule
 *                    (enum wxd_rain_rule), conserved exactly;
 *   wind             the day's mean held for every hour.
 * The sun's path (solar noon, sunrise, sunset, hour angles) comes from the
 * FAO-56 formulas (eq. 24, 25, 31-34), not from sun.h: sun_series() costs
 * about 0.5 us an hour (sun.c), eight times the budget of this stage.
 * Everything is deterministic: the same input gives the same bits.
 *
 * GPL-3.0-or-later.
 */
#ifndef WXDAILY_H
#define WXDAILY_H

#include <stddef.h>
#include <stdint.h>

#include "diag.h"
#include "site.h"
#include "weather.h"

/* Parton & Logan (1981) Table 1 coefficients for air temperature at
 * 150 cm (screen height), as a secondary source (the TrenchR package's
 * documentation of diurnal_temp_variation_sineexp) quotes them; the paper's
 * own table was not reachable.  a: lag of the maximum (h), b: night decay
 * coefficient, c: lag of the minimum after sunrise (h, negative: before). */
#define WXD_PL_A_H 1.86
#define WXD_PL_B 2.20
#define WXD_PL_C_H (-0.17)

/* Hargreaves adjustment coefficient kRs, degC^-0.5: FAO-56 eq. 50 gives
 * 0.16 for interior and 0.19 for coastal locations; rowgraze uses the
 * interior value for every site (a choice; a site switch could pass 0.19). */
#define WXD_KRS_INTERIOR 0.16

/* One day of the daily file.  Units in the names; NaN marks a value the
 * file does not give. */
typedef struct wxd_day {
    double tmin_c, tmax_c;   /* air temperature at screen height */
    double rain_mm;          /* day's total */
    double wind_m_s;         /* day's mean */
    double rs_mj_m2_d;       /* global horizontal radiation, or NaN */
    double rh_mean_pct;      /* mean relative humidity, or NaN */
    double tdew_c;           /* dew point, or NaN; wins over rh_mean_pct */
} wxd_day;

/* How a day's rain is spread over its hours. */
enum wxd_rain_rule {
    WXD_RAIN_SPREAD,     /* evenly over the 24 clock hours */
    WXD_RAIN_AFTERNOON,  /* evenly over 15:00-18:00 solar time */
    WXD_RAIN_MORNING     /* evenly over 06:00-09:00 solar time */
};

/* The sun on one day at a site, by FAO-56 (hours are local standard clock
 * time after that day's 00:00; they may fall outside 0..24). */
typedef struct wxd_sun {
    int doy;                 /* day of the year, 1..366 */
    double decl_rad;         /* declination, eq. 24 */
    double sunset_angle_rad; /* ws, eq. 25 */
    double daylength_h;      /* N, eq. 34 */
    double noon_h;           /* solar noon: omega = 0 in eq. 31 */
    double sunrise_h, sunset_h; /* noon -/+ N/2 */
} wxd_sun;

/* One Parton & Logan day: from this morning's minimum to the next. */
typedef struct wxd_tcurve {
    double tmin_c, tmax_c;   /* this day */
    double tmin_next_c;      /* the next morning's minimum */
    double sunrise_h, sunset_h; /* this day, hours after its 00:00 */
    double sunrise_next_h;   /* the next day's sunrise, same clock (~24+) */
} wxd_tcurve;

/* The sun on day number day (tcal.h) at loc.  Returns 0, or -1 when the
 * latitude or longitude is out of range or not finite. */
int wxd_sun_at(const site_location *loc, int64_t day, wxd_sun *out);

/* Hargreaves' radiation formula, FAO-56 eq. 50: kRs sqrt(Tmax - Tmin) Ra,
 * MJ m-2 d-1.  NaN unless tmax_c >= tmin_c, ra >= 0 and krs > 0. */
double wxd_hargreaves_rs_mj_m2_d(double tmax_c, double tmin_c,
                                 double ra_mj_m2_d, double krs);

/* Collares-Pereira & Rabl (1979) ratio rt of hourly to daily global
 * radiation for each clock hour k of a day with sunset hour angle ws_rad
 * and solar noon at clock time noon_h, taken at the hour's middle (hour
 * angle pi/12 (k + 0.5 - noon_h)); 0 where the sun is down there.  The 24
 * values add up to about 1, not exactly.  Returns 0, or -1 (rt untouched)
 * unless 0 < ws_rad <= pi and noon_h is finite. */
int wxd_cpr_hours(double ws_rad, double noon_h, double rt[24]);

/* Air temperature (C) at clock time t_h (hours after the curve day's
 * 00:00) for tmin_time_h(c) <= t_h <= the next minimum; NaN outside. */
double wxd_pl_temp_c(const wxd_tcurve *c, double t_h);

/* Time of the day's minimum (sunrise + c) and maximum (minimum +
 * (day length + 2a) / 2), hours after the curve day's 00:00. */
double wxd_pl_tmin_time_h(const wxd_tcurve *c);
double wxd_pl_tmax_time_h(const wxd_tcurve *c);

/* Turns days[0..n_days) (days[0] is day number first_day) into an hourly
 * series: out->t0_h = first_day * 24, out->n = 24 n_days, v[WX_GHI],
 * v[WX_TEMP], v[WX_RH], v[WX_RAIN], v[WX_WIND] allocated with malloc
 * (wx_series_free frees them), the optional columns NULL, path "" (the
 * caller names it).  Each row holds the value at mid-hour (temperature,
 * RH) or the hour's share (GHI, rain) as weather.h defines them.  Before
 * the first morning the night is that of a day like the first; after the
 * last evening the night decays to the last day's minimum.  Returns 0, or
 * -1 with a message naming the day (out is then left empty): a value out
 * of range, Tmin > Tmax, radiation above the day's extraterrestrial total
 * (eq. 21), a day or night shorter than 1 h (polar latitudes), radiation
 * on a day when the sun is up at no hour's middle, an unknown rain rule,
 * or no memory. */
int wxd_to_hourly(const site_location *loc, int64_t first_day,
                  const wxd_day *days, size_t n_days, int rain_rule,
                  wx_series *out, rg_err *err);

#endif
